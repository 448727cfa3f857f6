package fem

import (
	"math"
	"testing"
)

// A single case's extreme where the field jumps (the shear force at an
// inner support, the moment under a couple) says on which side of the
// point it is read, for the exact and the finite element value alike; one
// where the field is continuous, or at an end of the member (where only
// one side is inside it), says none.
//
// Two equal spans L under a uniform load w (w < 0 downward): the shear
// force is 5wL/8 just left of the middle support and −5wL/8 just right of
// it, the moment there −wL²/8, continuous (AISC Manual, Beam Diagrams and
// Formulas, continuous beam, two equal spans, uniform load on both spans,
// from memory). On 16 elements the finite element shear force is constant
// in each element, the mean of the exact one (Hermite cubics): ∓9wL/16 on
// the elements either side of the support, the largest just right of it
// and the smallest first reached at L − L/8, a node where it does not
// jump, so on no side. A cantilever of length L fixed at 0 with a tip load P:
// the shear force is −P all along and the moment −P·L at the fixed end,
// P·(L − x) (AISC Manual, Beam Diagrams and Formulas, cantilever beam,
// concentrated load at free end, from memory): both are extreme at the
// ends, where no side is given. A simple beam of span L with a couple M0
// at midspan: the moment jumps there from M0/2 just left to −M0/2 just
// right (AISC Manual, Beam Diagrams and Formulas, simple beam, moment
// applied at any point, with a = L/2, from memory: magnitude M0·x/L left
// of it and M0·(L − x)/L right of it; in Stave's signs, sagging positive
// and M0 counter-clockwise, the left reaction is M0/L up by moments about
// the right support, so M = M0·x/L left and M0·x/L − M0 right), and the bending stress M·c/I with it;
// the combined stress, the greatest tension or compression in either
// fibre, is M0·c/(2I) on both sides and does not jump.
func TestSummarySaysTheSideOfAJump(t *testing.T) {
	const L, w, P, M0 = 4.0, -10e3, -8e3, 12e3
	type side struct {
		q        Quantity
		max      bool
		v, x     float64
		side, fe Side
	}
	cases := []struct {
		name  string
		model *Model
		want  []side // quantities not listed have no side
	}{
		{"two spans, uniform load",
			&Model{Segments: []Segment{testSegment(0, 2*L)},
				Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}},
				DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, w}, {2 * L, w}}}},
				Mesh:            MeshSettings{Elements: 16}},
			[]side{{QShearForce, true, -5 * w * L / 8, L, Right, Right}, {QShearForce, false, 5 * w * L / 8, L, Left, 0}}},
		{"cantilever, tip load",
			&Model{Segments: []Segment{testSegment(0, L)}, Supports: []Support{{X: 0, Kind: Fixed}},
				PointLoads: []PointLoad{{X: L, Transverse: P}}, Mesh: MeshSettings{Elements: 4}},
			nil},
		{"simple beam, couple at midspan",
			&Model{Segments: []Segment{testSegment(0, L)}, Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
				PointLoads: []PointLoad{{X: L / 2, Moment: M0}}, Mesh: MeshSettings{Elements: 4}},
			[]side{{QBendingMoment, true, M0 / 2, L / 2, Left, Left}, {QBendingMoment, false, -M0 / 2, L / 2, Right, Right},
				{QBendingStress, true, M0 / 2 * testC / testI, L / 2, Left, Left}, {QBendingStress, false, -M0 / 2 * testC / testI, L / 2, Right, Right}}},
	}
	for _, c := range cases {
		s, e := solveBoth(t, c.model)
		sum := Summarize(s, e)
		for _, x := range sum.Extremes {
			for _, max := range []bool{true, false} {
				v, at, got, fe := x.Min, x.XMin, x.SideMin, x.FESideMin
				if max {
					v, at, got, fe = x.Max, x.XMax, x.SideMax, x.FESideMax
				}
				want := side{q: x.Quantity, max: max}
				found := false
				for _, w := range c.want {
					if w.q == x.Quantity && w.max == max {
						want, found = w, true
					}
				}
				if found && (math.Abs(v-want.v) > 1e-9*math.Abs(want.v) || math.Abs(at-want.x) > 1e-12) {
					t.Errorf("%s: %s (largest %t) %.10g at %g m; want %.10g at %g m", c.name, x.Quantity, max, v, at, want.v, want.x)
				}
				if got != want.side || fe != want.fe {
					t.Errorf("%s: %s (largest %t) %g at %g m read on side %d, FE on side %d; want %d and %d",
						c.name, x.Quantity, max, v, at, got, fe, want.side, want.fe)
				}
			}
		}
	}
}

// Each side is written the way every output writes it, and its name reads
// back to it: the words are the house style of the text output (common
// practice for a value at a jump: "just left of" the point).
func TestSideWords(t *testing.T) {
	cases := []struct {
		side            Side
		name, place, at string
	}{
		{Left, "left", "just left of 4.000 m", "just left of 4.000 m"},
		{Right, "right", "just right of 4.000 m", "just right of 4.000 m"},
		{0, "", "4.000 m", "at 4.000 m"},
	}
	for _, c := range cases {
		if got := c.side.Name(); got != c.name {
			t.Errorf("side %d: name %q, want %q", c.side, got, c.name)
		}
		if got := SideNamed(c.name); got != c.side {
			t.Errorf("SideNamed(%q) = %d, want %d", c.name, got, c.side)
		}
		if got := c.side.Place("4.000 m"); got != c.place {
			t.Errorf("side %d: place %q, want %q", c.side, got, c.place)
		}
		if got := c.side.At("4.000 m"); got != c.at {
			t.Errorf("side %d: at %q, want %q", c.side, got, c.at)
		}
	}
}
