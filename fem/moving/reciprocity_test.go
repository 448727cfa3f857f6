package moving

import (
	"fmt"
	"math"
	"testing"

	"stave/fem"
)

// knotty is an invented member with every feature the influence lines must
// follow: a change of section at x = 4 m, a fixed end, a transverse spring
// support at 6 m, a roller with a rotational spring at the far end, a
// semi-rigid joint at 3 m and a pure hinge at 8 m.
func knotty() *fem.Model {
	seg := func(a, b, i float64) fem.Segment {
		return fem.Segment{Start: a, End: b,
			Section:  fem.Section{Area: 6e-3, SecondMoment: i, FibreDistance: 0.2},
			Material: fem.Material{Elastic: 210e9}}
	}
	return &fem.Model{
		Segments: []fem.Segment{seg(0, 4, 9e-5), seg(4, 10, 4e-5)},
		Supports: []fem.Support{
			{X: 0, Kind: fem.Fixed},
			{X: 6, Kind: fem.Spring, Stiffness: [3]float64{0, 3e6, 0}},
			{X: 10, Kind: fem.Roller, Stiffness: [3]float64{0, 0, 2e6}},
		},
		Hinges: []fem.Hinge{{X: 3, Stiffness: 8e6}, {X: 8}},
		Mesh:   fem.MeshSettings{Elements: 100},
	}
}

// exactUnder solves m's member in closed form with fem's exact solver under
// a unit load at s alone.
func exactUnder(t *testing.T, m *fem.Model, s float64, bending bool) *fem.Exact {
	t.Helper()
	u := Unloaded(m)
	load := fem.PointLoad{X: s, Transverse: -1}
	if !bending {
		load = fem.PointLoad{X: s, Axial: 1}
	}
	u.PointLoads = []fem.PointLoad{load}
	e, err := fem.SolveExact(&u)
	if err != nil {
		t.Fatal(err)
	}
	return e
}

// The influence line is, by definition, the target's value with the load at
// s: compared with fem's own exact solver, an independent construction (one
// banded system per load set), for every kind of target on the knotty
// member and loads on both sides of the target and on key points.
func TestLinesAgainstExactSolves(t *testing.T) {
	m := knotty()
	in := influence(t, m)
	var targets []Target
	for _, x := range []float64{1.7, 3, 4, 5, 6, 8, 9.2} {
		for _, q := range []fem.Quantity{fem.QDeflection, fem.QRotation, fem.QShearForce, fem.QBendingMoment, fem.QBendingStress, fem.QAxialForce, fem.QAxialDisplacement} {
			for _, side := range []fem.Side{fem.Left, fem.Right} {
				targets = append(targets, Target{Quantity: q, X: x, Side: side})
			}
		}
	}
	for i, sup := range m.Supports {
		for d := fem.Axial; d <= fem.Rotation; d++ {
			if sup.Holds(d) {
				targets = append(targets, Target{Reaction: true, Support: i, Motion: d})
			}
		}
	}
	positions := []float64{0.4, 2.2, 3, 3.5, 4, 5.5, 6, 7.1, 8, 9.9}
	for _, bending := range []bool{true, false} {
		for _, s := range positions {
			e := exactUnder(t, m, s, bending)
			for _, tg := range targets {
				if tg.Bending() != bending {
					continue
				}
				l := line(t, in, tg)
				var want float64
				if tg.Reaction {
					want = e.Reactions()[tg.Support].Force[tg.Motion]
				} else {
					if tg.X == s {
						continue // the line's own jump: TestShearJumpUnderTheLoad
					}
					f := e.At(tg.X, tg.Side)
					want = tg.Quantity.Of(&f)
				}
				got := l.At(s, fem.Right)
				if tol := 1e-9 * max(scaleOf(t, l), natural(m, tg)); math.Abs(got-want) > tol {
					t.Errorf("%s, load at %g: line gives %.12g, the exact solve %.12g", tg, s, got, want)
				}
			}
		}
	}
}

// natural is the size of a unit load's effect on tg in a member like m,
// for tolerances where the line itself vanishes (the moment at a hinge):
// L for moments, 1 for forces, L³/EI and L²/EI for the deflection and the
// rotation, L/EA for the axial displacement, stresses per its section.
func natural(m *fem.Model, tg Target) float64 {
	L := m.Length()
	seg := m.Segments[0]
	ei := seg.Material.Elastic * seg.Section.SecondMoment
	switch {
	case tg.Reaction && tg.Motion == fem.Rotation, tg.Quantity == fem.QBendingMoment:
		return L
	case tg.Reaction, tg.Quantity == fem.QShearForce, tg.Quantity == fem.QAxialForce:
		return 1
	case tg.Quantity == fem.QBendingStress:
		return L * seg.Section.FibreDistance / seg.Section.SecondMoment
	case tg.Quantity == fem.QAxialStress:
		return 1 / seg.Section.Area
	case tg.Quantity == fem.QDeflection:
		return L * L * L / ei
	case tg.Quantity == fem.QRotation:
		return L * L / ei
	}
	return L / (seg.Material.Elastic * seg.Section.Area)
}

// scaleOf is the largest magnitude of a line, for tolerances.
func scaleOf(t *testing.T, l *Line) float64 {
	t.Helper()
	lo, hi := l.Extremes()
	return max(math.Abs(lo.Value), math.Abs(hi.Value), 1e-300)
}

// The shear force at x jumps by the unit load as the load passes x: by 1
// for a load acting down, from V(x) with the load just after x to the one
// just before (dV/dx = q; statics, from memory).
func TestShearJumpUnderTheLoad(t *testing.T) {
	in := influence(t, knotty())
	for _, x := range []float64{1.7, 5, 9.2} {
		l := line(t, in, Target{Quantity: fem.QShearForce, X: x})
		if got := l.At(x, fem.Right) - l.At(x, fem.Left); !near(got, 1, 1e-9) {
			t.Errorf("V at %g: the line jumps by %.12g at the point, want 1", x, got)
		}
	}
}

// Maxwell–Betti: the influence line of the deflection at x0 is the
// deflected shape under a unit load at x0 (Maxwell's reciprocal theorem,
// e.g. Timoshenko & Young, Theory of Structures, from memory), here the
// shape fem's exact solver gives for that one load.
func TestDeflectionLineIsTheDeflectedShape(t *testing.T) {
	m := knotty()
	in := influence(t, m)
	for _, x0 := range []float64{1.7, 3, 5, 6, 9.2} {
		l := line(t, in, Target{Quantity: fem.QDeflection, X: x0})
		sameAsDeflection(t, l, exactUnder(t, m, x0, true), fmt.Sprintf("the line of w(%g) and the deflection under a unit load there", x0))
	}
}

// sameAsDeflection compares line l with the deflected shape of e along
// the member.
func sameAsDeflection(t *testing.T, l *Line, e *fem.Exact, what string) {
	t.Helper()
	tol := 1e-9 * scaleOf(t, l)
	for s := 0.0; s <= 10; s += 0.25 {
		f := e.At(s, fem.Right)
		if got := l.At(s, fem.Right); math.Abs(got-f.Deflection) > tol {
			t.Errorf("%s, s = %g: %.12g against %.12g", what, s, got, f.Deflection)
		}
	}
}

// Müller-Breslau: the influence line of a rigid support's reaction is the
// member's shape when that support alone is moved by one unit in the
// direction of the reaction (up for a transverse reaction, counter-clockwise
// for a moment), here found by fem's exact solver with a unit settlement
// (Müller-Breslau principle, e.g. Hibbeler, Structural Analysis, ch. 6,
// from memory).
func TestReactionLineIsTheSettlementShape(t *testing.T) {
	m := knotty()
	in := influence(t, m)
	for _, d := range []fem.Dof{fem.Transverse, fem.Rotation} {
		l := line(t, in, Target{Reaction: true, Support: 0, Motion: d})
		u := Unloaded(m)
		u.Supports[0].Settlement[d] = 1
		e, err := fem.SolveExact(&u)
		if err != nil {
			t.Fatal(err)
		}
		sameAsDeflection(t, l, e, fmt.Sprintf("the line of the %s reaction at the fixed end and the settlement shape", d))
	}
}

// The two constructions of the document agree: the finite element line,
// one solve per load position on one factorization, against the closed
// form. With the load on a node the Hermite elements hold the exact
// solution (the exact deflection is cubic between nodes), so they agree to
// round-off, on the knotty member and on a fine mesh. The member's own loads
// are no part of a line: here a temperature change and a temperature
// difference through the depth of its first segment, which the finite
// element line took in and was off by their moments.
func TestFiniteElementLineAgreesWithClosedForm(t *testing.T) {
	for _, elements := range []int{100, 100000} {
		m := knotty()
		m.Mesh.Elements = elements
		m.TemperatureChange = 20
		m.Segments[0].Material.ThermalExpansion, m.Segments[0].TemperatureDifference = 12e-6, 25
		p, in := prepared(t, m)
		mesh := p.Mesh()
		positions := []float64{0.05, 1.3, 3, 4.42, 6, 7.77, 8, 9.95}
		if elements > 1000 {
			positions = positions[:3]
		}
		for _, tg := range []Target{
			{Quantity: fem.QBendingMoment, X: 5},
			{Quantity: fem.QShearForce, X: 7, Side: fem.Left},
			{Quantity: fem.QDeflection, X: 9.2},
			{Reaction: true, Support: 1, Motion: fem.Transverse},
			{Reaction: true, Support: 0, Motion: fem.Rotation},
			{Quantity: fem.QAxialForce, X: 2},
		} {
			t.Run(fmt.Sprintf("%d elements %s", elements, tg), func(t *testing.T) {
				fe, at, err := FELine(p, mesh, tg, positions)
				if err != nil {
					t.Fatal(err)
				}
				l := line(t, in, tg)
				tol := 1e-8 * scaleOf(t, l)
				for i, s := range at {
					if want := l.At(s, fem.Right); math.Abs(fe[i]-want) > tol {
						t.Errorf("load at %g: finite elements %.12g, closed form %.12g", s, fe[i], want)
					}
				}
			})
		}
	}
}
