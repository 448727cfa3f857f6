package moving

import (
	"testing"

	"stave/fem"
)

// twoSpanMoment is the bending moment at x of two equal continuous spans
// L (supports at 0, L, 2L, EI constant) under a unit load at s: the simple
// span's moment plus the support moment M_B carried linearly to zero at
// the outer supports, with M_B = −a·b·(L + a)/(4L²) for the load a from
// the left end of its span and b from its right end in the first span,
// −a·b·(L + b)/(4L²) in the second. Source: three-moment equation
// (Clapeyron) for two equal spans, from memory.
func twoSpanMoment(L, x, s float64) float64 {
	var mb float64
	switch {
	case s <= L:
		a, b := s, L-s
		mb = -a * b * (L + a) / (4 * L * L)
	default:
		a, b := s-L, 2*L-s
		mb = -a * b * (L + b) / (4 * L * L)
	}
	simple := func(x, s float64) float64 { // simple span 0..L
		if s < 0 || s > L {
			return 0
		}
		if s <= x {
			return s * (L - x) / L
		}
		return x * (L - s) / L
	}
	if x <= L {
		return simple(x, s) + mb*x/L
	}
	return simple(x-L, s-L) + mb*(2*L-x)/L
}

// The largest effect of a train at a point is exact whatever the step: it
// is reached where an axle stands on a kink or jump of the influence line
// (the point itself, a support), at an end of the run, or at a turn of the
// sum of the axles' ordinates, none of which a grid of positions need hold.
func TestWorstAtAPointIsExactOffTheStep(t *testing.T) {
	const L, P = 6.0, 42e3
	two := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller})
	simple := beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 10, Kind: fem.Roller})
	carriage := Train{Axles: []Axle{{Load: P}, {Load: P, Spacing: 3.2}}}
	// A 1 m step that starts 0.37 m in: no position of the front lies on
	// the supports, on x = 2.1 m or x = 3.337 m.
	coarse := func(t Train) Train { t.From, t.Step = 0.37, 1; return t }
	one := Train{Axles: []Axle{{Load: P}}}
	for _, c := range []struct {
		name   string
		m      *fem.Model
		train  Train
		target Target
		upper  bool
		want   float64
		source string
	}{
		// Axles at 2.1 and 5.3 m (the first on the point): the moments of
		// the three-moment equation summed (twoSpanMoment).
		{"two spans, moment at 2.1 m, step from the mesh", two, carriage, Target{Quantity: fem.QBendingMoment, X: 2.1}, true,
			P * (twoSpanMoment(L, 2.1, 2.1) + twoSpanMoment(L, 2.1, 5.3)), "three-moment equation"},
		{"two spans, moment at 2.1 m, coarse step", two, coarse(carriage), Target{Quantity: fem.QBendingMoment, X: 2.1}, true,
			P * (twoSpanMoment(L, 2.1, 2.1) + twoSpanMoment(L, 2.1, 5.3)), "three-moment equation"},
		// One load on the middle support takes it all (statics).
		{"two spans, middle reaction, coarse step", two, coarse(one), Target{Reaction: true, Support: 1, Motion: fem.Transverse}, true,
			P, "statics: the load on the support"},
		// Simple span: M(x) = P·x·(L − x)/L with the load on x; the shear
		// just right of x is P·(L − x)/L with the load just beyond x, and
		// −P·x/L with it just before (statics, influence lines of a simple
		// beam).
		{"simple span, moment at 3.337 m", simple, coarse(one), Target{Quantity: fem.QBendingMoment, X: 3.337}, true,
			P * 3.337 * (10 - 3.337) / 10, "statics"},
		{"simple span, largest shear at 3.337 m", simple, coarse(one), Target{Quantity: fem.QShearForce, X: 3.337}, true,
			P * (10 - 3.337) / 10, "statics"},
		{"simple span, smallest shear at 3.337 m", simple, coarse(one), Target{Quantity: fem.QShearForce, X: 3.337}, false,
			-P * 3.337 / 10, "statics"},
	} {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			hi, lo, err := in.Worst(&c.train, p.Mesh(), c.target)
			if err != nil {
				t.Fatal(err)
			}
			got := lo
			if c.upper {
				got = hi
			}
			if !near(got.Value, c.want, 1e-11) {
				t.Errorf("got %.12g, want %.12g (%s); the train facing %s, front at %.9g", got.Value, c.want, c.source, got.Placement.Direction, got.Placement.Front)
			}
			// Solved as ordinary loads where it stands, the train gives
			// what was reported (the shear's supremum beside the load
			// aside: the load stands on the point there).
			if c.target.Quantity == fem.QShearForce {
				return
			}
			tm := c.train.Model(c.m, got.Placement)
			ex, err := fem.SolveExact(&tm)
			if err != nil {
				t.Fatal(err)
			}
			var v float64
			if c.target.Reaction {
				sol, err := fem.Solve(&tm)
				if err != nil {
					t.Fatal(err)
				}
				v = read(sol, c.target)
			} else {
				f := ex.At(c.target.X, fem.Right)
				v = c.target.Quantity.Of(&f)
			}
			if !near(v, got.Value, 1e-9) {
				t.Errorf("solved at the reported position: %.12g, reported %.12g", v, got.Value)
			}
		})
	}
}
