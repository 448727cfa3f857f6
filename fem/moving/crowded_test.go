package moving

import (
	"math"
	"testing"

	"stave/fem"
)

// proppedReaction is the reaction at the simply supported end of a beam of
// span l fixed at the other end, per unit load down at a from the simply
// supported end: R₁ = b²(a + 2l)/(2l³), b = l − a (AISC Manual, Beam
// Diagrams and Formulas, "Beam fixed at one end, supported at other —
// concentrated load at any point").
func proppedReaction(l, a float64) float64 {
	b := l - a
	return b * b * (a + 2*l) / (2 * l * l * l)
}

// Supports 0.1 mm apart hold the member as one support that also holds its
// rotation; the influence lines refused such members as mechanisms ("the
// member cannot carry a load across the member near x = 0 m: ... add a
// support") where stave solve solves them: a roller 0.1 mm from a fixed
// end (the stretch between them was judged singular against the member's
// scale, its pivot about (0.1 mm / 10 m)³), and three rollers 0.1 mm apart
// (the sweep's basis grew degenerate). Each line is checked against the
// handbook's propped cantilever, which the crowded supports make of each
// span to within about (0.1 mm)/span. Closer still, 0.01 mm to 0.1 µm
// apart (10⁻⁶ to 10⁻⁸ of the member), where stave solve still solves the
// member, the lines were refused as mechanisms again: after two
// constraints a stretch τ of the member long leaves the next one a
// deflection of the order of τ², under the fixed threshold of a
// degenerate basis from τ ≈ 1.4e-6.
func TestCrowdedSupportsInfluenceLines(t *testing.T) {
	for _, eps := range []float64{1e-4, 1e-5, 1e-6, 1e-7} { // m
		crowdedSupportsLines(t, eps)
	}
}

// crowdedSupportsLines checks the lines of TestCrowdedSupportsInfluenceLines
// with the crowded supports eps apart.
func crowdedSupportsLines(t *testing.T, eps float64) {
	t.Helper()
	for _, c := range []struct {
		name   string
		m      *fem.Model
		target Target
		want   func(s float64) float64
	}{
		{
			// Fixed at x = 0 (a roller 0.1 mm beside it), supported at 10 m:
			// the prop's reaction, a = 10 − s from it.
			"roller beside a fixed end",
			beam(10, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: eps, Kind: fem.Roller}, fem.Support{X: 10, Kind: fem.Roller}),
			Target{Reaction: true, Support: 2, Motion: fem.Transverse},
			func(s float64) float64 { return proppedReaction(10, 10-s) },
		},
		{
			// The same, the moment at 7.5 m: R·2.5 less the load's lever
			// when it stands between 7.5 m and the prop.
			"roller beside a fixed end, moment",
			beam(10, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: eps, Kind: fem.Roller}, fem.Support{X: 10, Kind: fem.Roller}),
			Target{Quantity: fem.QBendingMoment, X: 7.5},
			func(s float64) float64 { return proppedReaction(10, 10-s)*2.5 - max(0, s-7.5) },
		},
		{
			// Pinned at 0 and 10 m, three rollers 0.1 mm apart at midspan:
			// two propped cantilevers of 5 m, fixed at the middle; a load on
			// the right one gives the left end no reaction.
			"three rollers side by side",
			beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 5, Kind: fem.Roller}, fem.Support{X: 5 + eps, Kind: fem.Roller},
				fem.Support{X: 5 + 2*eps, Kind: fem.Roller}, fem.Support{X: 10, Kind: fem.Roller}),
			Target{Reaction: true, Support: 0, Motion: fem.Transverse},
			leftProppedHalf,
		},
		{
			// Two fixed supports 1 µm apart at midspan (1e-7 of the member):
			// the same two propped cantilevers. The sweep judged the second
			// support to restrain nothing, the deflection it meets growing
			// as the cube of the stretch from the first (1e-21 of the basis
			// against a tolerance of 1e-12), and refused the member.
			"two fixed supports 1 µm apart",
			beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 5, Kind: fem.Fixed}, fem.Support{X: 5 + 1e-6, Kind: fem.Fixed},
				fem.Support{X: 10, Kind: fem.Roller}),
			Target{Reaction: true, Support: 0, Motion: fem.Transverse},
			leftProppedHalf,
		},
		{
			// Three rollers 1 µm apart: as three 0.1 mm apart.
			"three rollers 1 µm apart",
			beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 5, Kind: fem.Roller}, fem.Support{X: 5 + 1e-6, Kind: fem.Roller},
				fem.Support{X: 5 + 2e-6, Kind: fem.Roller}, fem.Support{X: 10, Kind: fem.Roller}),
			Target{Reaction: true, Support: 0, Motion: fem.Transverse},
			leftProppedHalf,
		},
	} {
		l, err := influence(t, c.m).Line(c.target)
		if err != nil {
			t.Errorf("%s, %g m apart: %v", c.name, eps, err)
			continue
		}
		for _, s := range []float64{0.5, 1, 2.5, 4, 4.9, 5.5, 6, 7.5, 8, 9.5} {
			if got, want := l.At(s, fem.Right), c.want(s); math.Abs(got-want) > 1e-4 {
				t.Errorf("%s, %g m apart: %s for a unit load at s = %g: %.8g, want %.8g", c.name, eps, c.target, s, got, want)
			}
		}
	}
}

// A hinge crowded with a roller by a fixed end, 0.1 mm to 0.1 µm apart
// (10⁻⁵ to 10⁻⁸ of the member): the influence line of the moment at 7 m
// is, load position by load position, the exact solution of the member
// under a unit load there (fem.SolveExact; Müller-Breslau's principle, the
// line being the member's response to a moving unit load by definition).
// The lines were refused as mechanisms from 0.01 mm.
func TestCrowdedHingeLineIsTheExactSolution(t *testing.T) {
	for _, eps := range []float64{1e-4, 1e-5, 1e-6, 1e-7} { // m
		model := func() *fem.Model {
			m := beam(10, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: eps, Kind: fem.Roller}, fem.Support{X: 10, Kind: fem.Roller})
			m.Hinges = []fem.Hinge{{X: 2 * eps}}
			return m
		}
		l, err := influence(t, model()).Line(Target{Quantity: fem.QBendingMoment, X: 7})
		if err != nil {
			t.Errorf("%g m apart: %v", eps, err)
			continue
		}
		for _, s := range []float64{1, 2.5, 4, 6, 7, 8.5, 9.5} {
			m := model()
			m.PointLoads = []fem.PointLoad{{X: s, Transverse: -1}}
			e, err := fem.SolveExact(m)
			if err != nil {
				t.Fatalf("%g m apart, unit load at %g m: %v", eps, s, err)
			}
			f := e.At(7, fem.Right)
			if got, want := l.At(s, fem.Right), f.BendingMoment; math.Abs(got-want) > 1e-9 {
				t.Errorf("%g m apart: the line at %g m reads %.12g m, the exact solution %.12g m", eps, s, got, want)
			}
		}
	}
}

// leftProppedHalf is the left end's reaction per unit load at s of a
// 10 m member pinned at 0 and held rigidly at midspan by crowded supports:
// a propped cantilever of 5 m fixed at the middle, which a load on the
// right half does not reach.
func leftProppedHalf(s float64) float64 {
	if s >= 5 {
		return 0
	}
	return proppedReaction(5, s)
}
