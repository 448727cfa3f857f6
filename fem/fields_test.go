package fem

import (
	"math"
	"testing"
)

// Under a point load P the shear force jumps by P (dV/dx = q integrated over
// the point, statics), and At's side picks the two limits.
func TestAtSides(t *testing.T) {
	P := -12e3
	m := withPointLoad(testModel(Support{X: 0, Kind: Pinned}, Support{X: testL, Kind: Roller}), PointLoad{X: 2, Transverse: P, Axial: 5e3})
	s := mustSolve(t, m)
	left, right := s.At(2, Left), s.At(2, Right)
	if relErr(right.ShearForce-left.ShearForce, P) > 1e-9 {
		t.Errorf("shear jump %g, want %g", right.ShearForce-left.ShearForce, P)
	}
	// Simply supported beam, point load P at a: V = −P·b/L left of it, P·a/L right
	// of it in this sign convention (AISC beam diagrams case 7, from memory).
	a, b := 2.0, testL-2
	if relErr(left.ShearForce, -P*b/testL) > 1e-9 || relErr(right.ShearForce, P*a/testL) > 1e-9 {
		t.Errorf("V = %g | %g, want %g | %g", left.ShearForce, right.ShearForce, -P*b/testL, P*a/testL)
	}
	// The axial force jumps by −(axial load): tension 5 kN left of it, none
	// right of it (the pinned support at x = 0 holds the load; statics).
	if relErr(left.AxialForce, 5e3) > 1e-9 || math.Abs(right.AxialForce) > 1e-6 {
		t.Errorf("N = %g | %g, want 5000 | 0", left.AxialForce, right.AxialForce)
	}
	if left.Deflection != right.Deflection {
		t.Errorf("deflection differs across the node: %g vs %g", left.Deflection, right.Deflection)
	}
	// Outside the member, x is clamped.
	if f := s.At(-1, Left); f.X != 0 {
		t.Errorf("At(-1) evaluated at x = %g, want 0", f.X)
	}
	// Stresses follow the stated convention: M·c/I, combined the larger fibre.
	f := s.At(3, Right)
	if relErr(f.BendingStress, f.BendingMoment*testC/testI) > 1e-12 || relErr(f.AxialStress, f.AxialForce/testA) > 1e-12 {
		t.Errorf("stresses %+v", f)
	}
	top, bottom := f.AxialStress-f.BendingStress, f.AxialStress+f.BendingStress
	if f.CombinedStress != top && f.CombinedStress != bottom || math.Abs(f.CombinedStress) != max(math.Abs(top), math.Abs(bottom)) {
		t.Errorf("combined stress %g, want the larger of %g and %g", f.CombinedStress, top, bottom)
	}
}

func TestSample(t *testing.T) {
	m := mixedModel(30)
	m.Mesh.BarOrder = QuadraticBar
	s := mustSolve(t, m)
	const n = 4
	pts := s.Sample(n)
	if len(pts) != len(s.Mesh.Elements)*(n+1) {
		t.Fatalf("%d points, want %d", len(pts), len(s.Mesh.Elements)*(n+1))
	}
	for i := 1; i < len(pts); i++ {
		if pts[i].X < pts[i-1].X {
			t.Fatalf("points out of order at %d: %g after %g", i, pts[i].X, pts[i-1].X)
		}
	}
	for e := range s.Mesh.Elements {
		first, last := pts[e*(n+1)], pts[e*(n+1)+n]
		if first.X != s.Mesh.X[e] || last.X != s.Mesh.X[e+1] {
			t.Errorf("element %d sampled from %g to %g, want %g to %g", e, first.X, last.X, s.Mesh.X[e], s.Mesh.X[e+1])
		}
		// Sampled values agree with At on the same side of the node and with the nodal displacements.
		if at := s.At(first.X, Right); at != first {
			t.Errorf("element %d start: Sample %+v, At %+v", e, first, at)
		}
		d := s.Displacement[e]
		if first.AxialDisplacement != d[Axial] || first.Deflection != d[Transverse] || math.Abs(first.Rotation-d[Rotation]) > 1e-15 {
			t.Errorf("element %d start: fields %+v, nodal displacement %v", e, first, d)
		}
	}
}
