package fem

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// fieldExtremes samples f at the ends and 16 inner points of every piece
// between the points xs (element or stretch ends, where fields may jump) and
// returns, per quantity, the largest and smallest value with their places;
// for the combined stress, the largest and smallest of the two extreme
// fibres.
func fieldExtremes(f Field, xs []float64) (hi, lo [quantityCount]float64, xHi, xLo [quantityCount]float64) {
	for q := range hi {
		hi[q], lo[q] = math.Inf(-1), math.Inf(1)
	}
	for i := 1; i < len(xs); i++ {
		a, b := xs[i-1], xs[i]
		for k := 0; k <= 16; k++ {
			x, side := a+(b-a)*float64(k)/16, Right
			if k == 16 {
				x, side = b, Left
			}
			v := f.At(x, side)
			for q := range hi {
				top, bottom := Quantity(q).Of(&v), Quantity(q).Of(&v)
				if Quantity(q) == QCombinedStress {
					// The extremes of the combined stress are those of the
					// fibres: the largest tension and the largest compression.
					top, bottom = v.AxialStress-v.BendingStress, v.AxialStress+v.BendingStress
				}
				if y := max(top, bottom); y > hi[q] {
					hi[q], xHi[q] = y, x
				}
				if y := min(top, bottom); y < lo[q] {
					lo[q], xLo[q] = y, x
				}
			}
		}
	}
	return hi, lo, xHi, xLo
}

// The default mesh meets its rule (automesh.go): for every field the finite
// element extreme is within MeshAccuracy of the exact extreme, relative to
// the field's largest magnitude, and lies where the exact field is within
// that margin of its extreme or within one element of the exact place. The
// reference is the exact solution of the same model; both are sampled
// densely.
func TestDefaultMeshRule(t *testing.T) {
	rnd := rand.New(rand.NewPCG(21, 22))
	for trial := range 30 {
		m := randomKeyPointModel(rnd)
		m.Mesh = MeshSettings{}
		if trial%3 == 0 {
			m.DistributedLoad = append(m.DistributedLoad, DistributedLoad{Direction: Axial,
				Points: []LoadPoint{{X: 0, Intensity: 1e4 * rnd.NormFloat64()}, {X: m.Length(), Intensity: 1e4 * rnd.NormFloat64()}}})
		}
		if trial%2 == 0 {
			m.Mesh.BarOrder = QuadraticBar
		}
		if trial%3 == 1 {
			// A foundation under a random stretch, β·L from about 0.3 to 30.
			L := m.Length()
			a, b := L*rnd.Float64()/2, L*(0.5+rnd.Float64()/2)
			seg := m.Segments[0]
			ei := seg.Material.Elastic * seg.Section.SecondMoment
			beta := math.Pow(10, -0.5+2*rnd.Float64()) / L
			f := Foundation{Start: a, End: b, Modulus: 4 * ei * math.Pow(beta, 4)}
			if m.Mesh.BarOrder != QuadraticBar {
				f.AxialModulus = seg.Material.Elastic * seg.Section.Area * beta * beta
			}
			m.Foundations = []Foundation{f}
		}
		t.Run(fmt.Sprintf("trial %d", trial), func(t *testing.T) {
			s, err := Solve(m)
			if err != nil {
				t.Fatal(err)
			}
			if !s.Mesh.Automatic {
				t.Fatal("the mesh of a model that asks for none is not automatic")
			}
			if s.Condition > conditionLimit {
				// A load vertex a hair's breadth from a segment break next to a
				// soft spring: no mesh helps an ill-conditioned key-point system,
				// and the solution says so in its warnings.
				t.Skipf("condition %.2g: the results carry a warning instead", s.Condition)
			}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			feHi, feLo, xFeHi, xFeLo := fieldExtremes(s, s.Mesh.X)
			exHi, exLo, xExHi, xExLo := fieldExtremes(e, s.Mesh.X)
			for q := range Quantity(quantityCount) {
				scale := max(math.Abs(exHi[q]), math.Abs(exLo[q]))
				if scale == 0 {
					continue
				}
				// value is the exact field at x as fieldExtremes reads it.
				value := func(x float64, largest bool) float64 {
					at := e.At(x, Right)
					if q != QCombinedStress {
						return q.Of(&at)
					}
					top, bottom := at.AxialStress-at.BendingStress, at.AxialStress+at.BendingStress
					if largest {
						return max(top, bottom)
					}
					return min(top, bottom)
				}
				check := func(which string, fe, ex, xFe, xEx float64) {
					if d := math.Abs(fe - ex); d > MeshAccuracy*scale {
						t.Errorf("%s %s: FE %.6g, exact %.6g: off by %.2g %% of %.4g", which, q, fe, ex, 100*d/scale, scale)
					}
					h := s.Mesh.Elements[s.elementAt(xEx, Right)].End - s.Mesh.Elements[s.elementAt(xEx, Right)].Start
					if math.Abs(xFe-xEx) > h*(1+1e-9) && math.Abs(value(xFe, which == "largest")-ex) > MeshAccuracy*scale {
						t.Errorf("%s %s at x = %.4g m, exact at %.4g m: more than one element (%.3g m) apart", which, q, xFe, xEx, h)
					}
				}
				check("largest", feHi[q], exHi[q], xFeHi[q], xExHi[q])
				check("smallest", feLo[q], exLo[q], xFeLo[q], xExLo[q])
			}
		})
	}
}

// A simply supported beam, 4 m, under 10 kN/m with the mesh left to Stave:
// the largest moment wL²/8 = 20 kN·m at midspan, the deflection
// 5wL⁴/(384EI) and the end shears ±wL/2 = ±20 kN (simply supported beam,
// uniform load: AISC Manual beam diagrams case 1; Gere & Goodno; from
// memory), each from the finite element solution within MeshAccuracy.
func TestDefaultMeshSimplySupported(t *testing.T) {
	const L, w, E, I = 4.0, -10e3, 2e11, 8e-6
	m := &Model{
		Segments:        []Segment{{Start: 0, End: L, Section: Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1}, Material: Material{Elastic: E}}},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, w}, {L, w}}}},
	}
	s, err := Solve(m)
	if err != nil {
		t.Fatal(err)
	}
	hi, lo, xHi, _ := fieldExtremes(s, s.Mesh.X)
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"largest moment", hi[QBendingMoment], -w * L * L / 8},
		{"its place", xHi[QBendingMoment], L / 2},
		{"deflection", lo[QDeflection], 5 * w * L * L * L * L / (384 * E * I)},
		{"shear at the left end", hi[QShearForce], -w * L / 2},
		{"shear at the right end", lo[QShearForce], w * L / 2},
	} {
		if math.Abs(c.got-c.want) > MeshAccuracy*math.Abs(c.want) {
			t.Errorf("%s: %.6g, want %.6g within %.1f %% (%d elements)", c.what, c.got, c.want, 100*MeshAccuracy, len(s.Mesh.Elements))
		}
	}
}
