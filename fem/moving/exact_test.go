package moving

import (
	"math"
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

// The worst values over the member and over every position, on the
// default stations, with steps that hold no governing position.
func TestWorstOverTheMemberIsExact(t *testing.T) {
	const L, P = 10.0, 20e3
	simple := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	cantilever := beam(4, fem.Support{X: 0, Kind: fem.Fixed})
	pair := func(s float64) []Axle { return []Axle{{Load: P}, {Load: P, Spacing: s}} }
	const s, a, q = 3.0, 3.0, 8e3
	for _, c := range []struct {
		name   string
		m      *fem.Model
		train  Train
		qty    fem.Quantity
		upper  bool
		want   float64
		at     []float64 // where (either, for mirror images); nil: anywhere
		source string
	}{
		// Two equal loads P at s < 0.586·L: P/(2L)·(L − s/2)² under either
		// load, with midspan halfway between it and the resultant (s/4
		// off midspan).
		{"two equal axles, coarse step", simple, Train{Axles: pair(s), From: 0.37, Step: 1}, fem.QBendingMoment, true,
			P / (2 * L) * (L - s/2) * (L - s/2), []float64{L/2 - s/4, L/2 + s/4},
			"AISC beam diagrams, two equal concentrated moving loads, from memory"},
		{"two equal axles, step from the mesh", simple, Train{Axles: pair(s)}, fem.QBendingMoment, true,
			P / (2 * L) * (L - s/2) * (L - s/2), []float64{L/2 - s/4, L/2 + s/4},
			"AISC beam diagrams, two equal concentrated moving loads, from memory"},
		// Further apart than 0.586·L and driving on and off: one alone at
		// midspan, P·L/4.
		{"two axles 7 m apart, off the ends, coarse step", simple, Train{Axles: pair(7), OffEnds: true, Step: 0.7}, fem.QBendingMoment, true,
			P * L / 4, []float64{L / 2}, "AISC beam diagrams, two equal concentrated moving loads, from memory"},
		// Longer than the span: one axle on it at a time.
		{"two axles 12 m apart, off the ends", simple, Train{Axles: pair(12), OffEnds: true, Step: 0.7}, fem.QBendingMoment, true,
			P * L / 4, []float64{L / 2}, "statics: one load at midspan"},
		// The largest shear force is the left reaction with the pair as
		// close to it as its run lets it stand, loads at 0.37 m and 3.37
		// m: P·(L − 0.37)/L + P·(L − 3.37)/L (statics).
		{"two equal axles, shear", simple, Train{Axles: pair(s), From: 0.37, To: 9.71, Step: 1}, fem.QShearForce, true,
			P*(L-0.37)/L + P*(L-3.37)/L, nil, "statics"},
		// A uniform load a long, shorter than the span: the largest moment
		// is at midspan with the load centred on it, q·a·(2L − a)/8.
		{"uniform load shorter than the span", simple, Train{Uniform: UniformLoad{Load: q, Length: a}, From: 0.37, Step: 1}, fem.QBendingMoment, true,
			q * a * (2*L - a) / 8, []float64{L / 2}, "statics, simple beam under a partial uniform load"},
		// Cantilever of 4 m fixed at x = 0, 10 and 20 kN 1.5 m apart:
		// facing forward the 20 kN axle trails at 2.5 m with the 10 kN on
		// the tip, M = −(10·4 + 20·2.5) kN·m; facing backward the 20 kN
		// axle leads to the tip, −(20·4 + 10·2.5) kN·m (statics).
		{"cantilever, forward", cantilever, Train{Axles: []Axle{{Load: 10e3}, {Load: 20e3, Spacing: 1.5}}, Direction: Forward, Step: 0.7}, fem.QBendingMoment, false,
			-(10e3*4 + 20e3*2.5), []float64{0}, "statics"},
		{"cantilever, both ways", cantilever, Train{Axles: []Axle{{Load: 10e3}, {Load: 20e3, Spacing: 1.5}}, Step: 0.7}, fem.QBendingMoment, false,
			-(20e3*4 + 10e3*2.5), []float64{0}, "statics"},
	} {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			e, err := in.Envelope(&c.train, p.Mesh(), nil)
			if err != nil {
				t.Fatal(err)
			}
			hi, lo := e.Worst(c.qty)
			got := lo
			if c.upper {
				got = hi
			}
			if !near(got.Value, c.want, 1e-11) {
				t.Errorf("got %.12g at x = %.9g (front at %.9g %s), want %.12g (%s)", got.Value, got.X, got.Placement.Front, got.Placement.Direction, c.want, c.source)
			}
			ok := c.at == nil
			for _, x := range c.at {
				ok = ok || near(got.X, x, 1e-6)
			}
			if !ok {
				t.Errorf("at x = %.9g, want one of %v", got.X, c.at)
			}
		})
	}
}

// The worst value over the member found on the default stations is no
// less than that of an envelope taken at 2,001 stations (every 6 mm), for
// every quantity: the peaks between stations are found, not sampled. And
// solved as ordinary loads where the envelope says, the train gives it.
// Two continuous spans of 6 m, a two-axle carriage both ways and a cart
// with a uniform load forward (invented).
func TestWorstNotBelowADenseEnvelope(t *testing.T) {
	m := beam(12, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 6, Kind: fem.Roller}, fem.Support{X: 12, Kind: fem.Roller})
	p, in := prepared(t, m)
	dense := make([]float64, 2001)
	for i := range dense {
		dense[i] = 12 * float64(i) / 2000
	}
	for _, tr := range []Train{
		{Name: "carriage", Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}},
		{Name: "cart", Axles: []Axle{{Load: 6e3}, {Load: 9e3, Spacing: 1.1}, {Load: 9e3, Spacing: 0.9}},
			Uniform: UniformLoad{Load: 1.5e3, Start: 2.5, Length: 2}, From: 0.5, To: 11.5, Direction: Forward},
	} {
		e, err := in.Envelope(&tr, p.Mesh(), nil)
		if err != nil {
			t.Fatal(err)
		}
		d, err := in.Envelope(&tr, p.Mesh(), dense)
		if err != nil {
			t.Fatal(err)
		}
		for q, qty := range EnvelopeQuantities {
			hi, lo := e.Worst(qty)
			dhi, dlo := d.Worst(qty)
			scale := max(math.Abs(hi.Value), math.Abs(lo.Value))
			if hi.Value < dhi.Value-1e-12*scale || lo.Value > dlo.Value+1e-12*scale {
				t.Errorf("%s, %s: from %.12g to %.12g over the member, but %.12g to %.12g on the dense stations", tr.Name, qty, lo.Value, hi.Value, dlo.Value, dhi.Value)
			}
			if q == 4 {
				continue // the stress is the moment's
			}
			// The shear force's extreme may be its limit with an axle just
			// beside the point (on a support it would go straight into
			// the reaction): the train is also solved 0.1 µm either way.
			for _, ex := range []Extreme{hi, lo} {
				ok := false
				var got []float64
				for _, shift := range []float64{0, -1e-7, 1e-7} {
					pl := ex.Placement
					pl.Front += shift
					tm := tr.Model(m, pl)
					sol, err := fem.SolveExact(&tm)
					if err != nil {
						t.Fatal(err)
					}
					for _, side := range []fem.Side{fem.Left, fem.Right} {
						f := sol.At(ex.X, side)
						got = append(got, qty.Of(&f))
						ok = ok || math.Abs(qty.Of(&f)-ex.Value) <= 1e-7*scale
					}
				}
				if !ok {
					t.Errorf("%s, %s: %.12g at %g with the front at %g %s; solved there and 0.1 µm either way %.12g", tr.Name, qty, ex.Value, ex.X, ex.Placement.Front, ex.Placement.Direction, got)
				}
			}
		}
	}
}
