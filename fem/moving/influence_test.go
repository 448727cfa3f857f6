package moving

import (
	"math"
	"testing"

	"stave/fem"
)

// beam is a prismatic member of length L with the given supports: steel
// (E = 200 GPa), A = 5e-3 m², I = 8e-5 m⁴, c = 0.15 m (invented values
// of a plain section; the closed forms below do not depend on them except
// through EI).
func beam(L float64, sups ...fem.Support) *fem.Model {
	return &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: L,
			Section:  fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15},
			Material: fem.Material{Elastic: 200e9}}},
		Supports: sups,
		Mesh:     fem.MeshSettings{Elements: 40},
	}
}

func influence(t *testing.T, m *fem.Model) *Influence {
	t.Helper()
	_, in := prepared(t, m)
	return in
}

// prepared is m's member and its influence lines.
func prepared(t *testing.T, m *fem.Model) (*fem.Member, *Influence) {
	t.Helper()
	p, err := fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	in, err := New(p)
	if err != nil {
		t.Fatal(err)
	}
	return p, in
}

func line(t *testing.T, in *Influence, tg Target) *Line {
	t.Helper()
	l, err := in.Line(tg)
	if err != nil {
		t.Fatal(err)
	}
	return l
}

func near(got, want, tol float64) bool {
	return math.Abs(got-want) <= tol*max(1, math.Abs(want))
}

// Simply supported beam, span L, unit load down at s. Source: influence
// lines of a simple beam (statics; e.g. Hibbeler, Structural Analysis,
// ch. 6), from memory:
//
//	R_A(s) = 1 − s/L
//	M(x = L/2; s) = s/2 for s ≤ L/2, (L − s)/2 beyond: a triangle, peak L/4
//	V(x; s) = −s/L for s < x, 1 − s/L for s > x
func TestSimpleBeamInfluenceLines(t *testing.T) {
	const L = 8.0
	in := influence(t, beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}))
	mid := line(t, in, Target{Quantity: fem.QBendingMoment, X: L / 2})
	ra := line(t, in, Target{Reaction: true, Support: 0, Motion: fem.Transverse})
	v3 := line(t, in, Target{Quantity: fem.QShearForce, X: 3})
	for _, s := range []float64{0, 0.5, 2, 3.999, 4, 4.5, 7, 8} {
		wantM := s / 2
		if s > L/2 {
			wantM = (L - s) / 2
		}
		if got := mid.At(s, fem.Right); !near(got, wantM, 1e-12) {
			t.Errorf("M(L/2) for a load at s = %g: got %.15g, want %g", s, got, wantM)
		}
		if got, want := ra.At(s, fem.Right), 1-s/L; !near(got, want, 1e-12) {
			t.Errorf("R_A for a load at s = %g: got %.15g, want %g", s, got, want)
		}
		wantV := 1 - s/L
		if s < 3 {
			wantV = -s / L
		}
		if got := v3.At(s, fem.Right); !near(got, wantV, 1e-12) {
			t.Errorf("V(3) for a load at s = %g: got %.15g, want %g", s, got, wantV)
		}
	}
	lo, hi := mid.Extremes()
	if !near(hi.Value, L/4, 1e-12) || !near(hi.S, L/2, 1e-9) || !near(lo.Value, 0, 1e-12) {
		t.Errorf("extremes of M(L/2): got %+v and %+v, want the peak L/4 = %g at s = %g and 0", lo, hi, L/4, L/2)
	}
}

// Two equal continuous spans L (supports at 0, L, 2L), unit load down at a.
// By Müller-Breslau the middle reaction's line is the deflected shape of the
// simple beam of span 2L under a load at its middle, scaled to 1 there. With
// the deflection of a simple beam of span ℓ under a load at a ≤ ℓ/2, read at
// its middle, P·a·(3ℓ² − 4a²)/(48·EI) (beam deflection tables, Roark's
// Formulas / AISC beam diagrams, from memory), that gives for a ≤ L
//
//	R_B(a) = a·(3L² − a²)/(2L³), symmetric about B,
//
// and statics (moments about C) R_A = (2L − a − R_B·L)/(2L).
func TestTwoSpanReactionInfluenceLines(t *testing.T) {
	const L = 5.0
	in := influence(t, beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller}))
	rb := line(t, in, Target{Reaction: true, Support: 1, Motion: fem.Transverse})
	ra := line(t, in, Target{Reaction: true, Support: 0, Motion: fem.Transverse})
	for _, a := range []float64{0, 1, 2.5, 4, 5, 6, 8.5, 10} {
		u := min(a, 2*L-a)
		wantB := u * (3*L*L - u*u) / (2 * L * L * L)
		wantA := (2*L - a - wantB*L) / (2 * L)
		if got := rb.At(a, fem.Right); !near(got, wantB, 1e-12) {
			t.Errorf("R_B for a load at %g: got %.15g, want %.15g", a, got, wantB)
		}
		if got := ra.At(a, fem.Right); !near(got, wantA, 1e-12) {
			t.Errorf("R_A for a load at %g: got %.15g, want %.15g", a, got, wantA)
		}
	}
}

// A bar fixed at both ends, unit load along +x at s: the part before s
// carries N = (L − s)/L in tension, the part after N = −s/L (statics with
// the compatibility of the two parts' elongations, from memory).
func TestFixedBarAxialForceInfluenceLine(t *testing.T) {
	const L = 6.0
	in := influence(t, beam(L, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: L, Kind: fem.Fixed}))
	n := line(t, in, Target{Quantity: fem.QAxialForce, X: 2})
	for _, s := range []float64{0, 1, 2.5, 4, 6} {
		want := -s / L
		if s > 2 {
			want = (L - s) / L
		}
		if got := n.At(s, fem.Right); !near(got, want, 1e-12) {
			t.Errorf("N(2) for a load at %g: got %.15g, want %g", s, got, want)
		}
	}
}

// A line's pieces, each in its own ξ, give the line's values.
func TestPiecesGiveTheLine(t *testing.T) {
	in := influence(t, knotty())
	l := line(t, in, Target{Quantity: fem.QBendingMoment, X: 5.3})
	for _, p := range l.Pieces() {
		for _, xi := range []float64{0.1, 0.5, 0.9} {
			s := p.From + xi*(p.To-p.From)
			c := p.Coefficients
			got := c[0] + xi*(c[1]+xi*(c[2]+xi*c[3]))
			if want := l.At(s, fem.Right); !near(got, want, 1e-12) {
				t.Errorf("piece %g–%g at s = %g: %.15g, the line %.15g", p.From, p.To, s, got, want)
			}
		}
	}
}

// Influence lines of a beam with overhangs, a cantilever and two equal
// continuous spans, per newton of a load acting down at s, against statics
// and the three-moment equation (from memory; e.g. Hibbeler, Structural
// Analysis, ch. 6 and 10):
//
//   - overhangs, supports at 2 and 10 on 12 m: R_A = (10 − s)/8 over the
//     whole member (above 1 on the left overhang, below 0 on the right);
//     M(6) = 4·R_A less (6 − s) for a load left of 6; on the left
//     overhang M(1) = −(1 − s) for s < 1, 0 beyond; V(11) = +1 for a load
//     beyond 11, 0 before it.
//   - cantilever fixed at 0, 4 m: the support's moment reaction s
//     (counter-clockwise), M(1.5) = −(s − 1.5) beyond 1.5, V(1.5) = +1
//     beyond it.
//   - two spans L = 5 m: the three-moment equation with a load at a in the
//     first span, 2·M_B·(2L) = −a·(L − a)·(L + a)/L, gives M_B =
//     −a·(L² − a²)/(4L²), mirrored for the second span; R_A = (L − a)/L +
//     M_B/L in the first span and M_B/L in the second; M(2) = 2·R_A less
//     (2 − a) for a load left of 2; V just right of B = −R_C, plus 1 for a
//     load beyond B, with R_C = M_B/L for a load in the first span and
//     (a − L)/L + M_B/L in the second.
func TestOverhangCantileverAndTwoSpanInfluenceLines(t *testing.T) {
	pinned := func(x float64) fem.Support { return fem.Support{X: x, Kind: fem.Pinned} }
	roller := func(x float64) fem.Support { return fem.Support{X: x, Kind: fem.Roller} }
	overhangs := beam(12, pinned(2), roller(10))
	cantilever := beam(4, fem.Support{X: 0, Kind: fem.Fixed})
	const L = 5.0
	twoSpans := beam(2*L, pinned(0), roller(L), roller(2*L))
	mB := func(a float64) float64 {
		u := min(a, 2*L-a)
		return -u * (L*L - u*u) / (4 * L * L)
	}
	rA := func(a float64) float64 {
		if a <= L {
			return (L-a)/L + mB(a)/L
		}
		return mB(a) / L
	}
	rC := func(a float64) float64 {
		if a >= L {
			return (a-L)/L + mB(a)/L
		}
		return mB(a) / L
	}
	left := func(a, x float64) float64 { // a load at a, left of x, in the moment at x
		if a < x {
			return x - a
		}
		return 0
	}
	for _, c := range []struct {
		name   string
		m      *fem.Model
		target Target
		want   func(s float64) float64
	}{
		{"overhangs, R_A", overhangs, Target{Reaction: true, Support: 0, Motion: fem.Transverse}, func(s float64) float64 { return (10 - s) / 8 }},
		{"overhangs, M(6)", overhangs, Target{Quantity: fem.QBendingMoment, X: 6}, func(s float64) float64 { return 4*(10-s)/8 - left(s, 6) }},
		{"overhangs, M(1)", overhangs, Target{Quantity: fem.QBendingMoment, X: 1}, func(s float64) float64 { return -left(s, 1) }},
		{"overhangs, V(11)", overhangs, Target{Quantity: fem.QShearForce, X: 11}, func(s float64) float64 {
			if s > 11 {
				return 1
			}
			return 0
		}},
		{"cantilever, moment reaction", cantilever, Target{Reaction: true, Support: 0, Motion: fem.Rotation}, func(s float64) float64 { return s }},
		{"cantilever, M(1.5)", cantilever, Target{Quantity: fem.QBendingMoment, X: 1.5}, func(s float64) float64 { return -max(s-1.5, 0) }},
		{"cantilever, V(1.5)", cantilever, Target{Quantity: fem.QShearForce, X: 1.5}, func(s float64) float64 {
			if s > 1.5 {
				return 1
			}
			return 0
		}},
		{"two spans, M_B", twoSpans, Target{Quantity: fem.QBendingMoment, X: L}, mB},
		{"two spans, M(2)", twoSpans, Target{Quantity: fem.QBendingMoment, X: 2}, func(a float64) float64 { return 2*rA(a) - left(a, 2) }},
		{"two spans, V just right of B", twoSpans, Target{Quantity: fem.QShearForce, X: L, Side: fem.Right}, func(a float64) float64 {
			if a > L {
				return 1 - rC(a) // the load beyond the cut
			}
			return -rC(a)
		}},
	} {
		t.Run(c.name, func(t *testing.T) {
			l := line(t, influence(t, c.m), c.target)
			length := c.m.Length()
			for i := 0; i <= 48; i++ {
				s := length * float64(i) / 48
				if !c.target.Reaction && s == c.target.X {
					continue // the line jumps or turns there: its own tests
				}
				if got, want := l.At(s, fem.Right), c.want(s); math.Abs(got-want) > 1e-12*length {
					t.Errorf("load at %g: got %.15g, want %.15g", s, got, want)
				}
			}
		})
	}
}

// The extremes of a line tie to round-off, the first along the member kept,
// as the solver's do (fem.Beyond): a cantilever fixed at 0 with a hinged
// suspended span on a roller at 10 m (hinge at 4 m) has the fixed-end
// moment M_A = −s for a load at s ≤ 4 and −4·(10 − s)/6 beyond (statics of
// a hinged beam, e.g. Hibbeler, Structural Analysis, ch. 6, from memory):
// never positive, zero with the load on either support. Its largest value
// is that zero at s = 0, not round-off at s = 10 m.
func TestLineExtremesTieToRoundOff(t *testing.T) {
	m := beam(10, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: 10, Kind: fem.Roller})
	m.Hinges = []fem.Hinge{{X: 4}}
	l := line(t, influence(t, m), Target{Quantity: fem.QBendingMoment, X: 0})
	lo, hi := l.Extremes()
	if hi.S != 0 || math.Abs(hi.Value) > 1e-12 {
		t.Errorf("largest: %.17g with the load at %g, want 0 at 0", hi.Value, hi.S)
	}
	if !near(lo.Value, -4, 1e-12) || !near(lo.S, 4, 1e-12) {
		t.Errorf("smallest: %.17g with the load at %g, want -4 at 4", lo.Value, lo.S)
	}
}
