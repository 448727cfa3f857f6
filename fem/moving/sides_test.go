package moving

import (
	"testing"

	"stave/fem"
)

// A train's extreme at a point where its envelope jumps says on which side
// of the point it is read (Extreme.Side), as a single case's extreme does
// (fem.Extreme.SideMax), and none where the envelope does not jump.
//
// Two equal spans L (supports at 0, L, 2L), two axles P at spacing d: the
// shear force just right of the middle support is largest with the front
// axle just past it and the rear one on the second span, and by symmetry
// the smallest just left of it. For a load in the first span at a from
// the end support, the reaction there is R₁ = (L − a)/L − a(L² − a²)/(4L³)
// per unit load (two-span continuous beam, the moment over the middle
// support −a(L² − a²)/(4L²): AISC Beam Diagrams and Formulas, continuous
// beam – two equal spans – concentrated load at any point, from memory),
// so V just left of the middle support is R₁ − 1 with the load at a, and
// −1 with the load just left of the support: the smallest, with the
// front axle just left of the support and the rear one at L − d, is
// −P − P·(1 − R₁(L − d)) (65.43 kN for the runway's 42 kN at 3.2 m on
// 6 m). The moment over the support does not jump (no couple acts
// there): no side.
//
// A cantilever of length c fixed at 0 carrying at a hinge (x = c) a
// suspended span to a roller at c + l: two axles P at spacing d, the front
// at c + d and the rear on the hinge, load the hinge with
// V = P + P·(l − d)/l, and the cantilever's tip turns by V·c²/(2EI)
// (cantilever with an end load, Roark's Formulas for Stress and Strain,
// table of beam formulas, from memory): the smallest rotation, just left
// of the hinge, where the rotation jumps.
func TestTrainExtremesSayTheSideOfAJump(t *testing.T) {
	const L, P, d = 6.0, 42e3, 3.2
	spans := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller})
	r1 := func(a float64) float64 { return (L-a)/L - a*(L*L-a*a)/(4*L*L*L) }
	shear := -P - P*(1-r1(L-d))
	const c, l = 4.0, 6.0
	hinged := beam(c+l, fem.Support{X: 0, Kind: fem.Fixed}, fem.Support{X: c + l, Kind: fem.Roller})
	hinged.Hinges = []fem.Hinge{{X: c}}
	ei := hinged.Segments[0].Material.Elastic * hinged.Segments[0].Section.SecondMoment
	turn := -(P + P*(l-d)/l) * c * c / (2 * ei)
	train := func() *Train {
		return &Train{Name: "two axles", Axles: []Axle{{Load: P}, {Load: P, Spacing: d}}, Direction: BothWays, Step: 0.1}
	}
	for _, tc := range []struct {
		name  string
		m     *fem.Model
		q     fem.Quantity
		upper bool
		x     float64
		value float64
		side  fem.Side
	}{
		{"shear force largest, two spans", spans, fem.QShearForce, true, L, -shear, fem.Right},
		{"shear force smallest, two spans", spans, fem.QShearForce, false, L, shear, fem.Left},
		{"moment over the support, two spans", spans, fem.QBendingMoment, false, L, 0, 0},
		{"rotation at the hinge", hinged, fem.QRotation, false, c, turn, fem.Left},
	} {
		t.Run(tc.name, func(t *testing.T) {
			p, in := prepared(t, tc.m)
			e, err := in.Envelope(train(), p.Mesh(), nil)
			if err != nil {
				t.Fatal(err)
			}
			hi, lo := e.Worst(tc.q)
			got := lo
			if tc.upper {
				got = hi
			}
			if !near(got.X, tc.x, 1e-9) || tc.value != 0 && !near(got.Value, tc.value, 1e-9) {
				t.Errorf("%s: %.12g at x = %g, want %.12g at x = %g", tc.q, got.Value, got.X, tc.value, tc.x)
			}
			if got.Side != tc.side {
				t.Errorf("%s %.12g at x = %g: read on side %q, want %q", tc.q, got.Value, got.X, got.Side.Name(), tc.side.Name())
			}
		})
	}
}

// An influence line's target says its side where its quantity jumps at the
// point, in the words of the static outputs (fem.Side.At): the shear force
// (which jumps under the unit load standing on the point, Line.Jump, and
// by the reaction at a support), the rotation at a hinge (the two parts
// turn apart); not the moment over a support or the deflection, which do
// not jump, nor anything at an end of the member, which has one side.
func TestLineSaysItsSideWhereItJumps(t *testing.T) {
	const L = 6.0
	m := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Fixed})
	m.Hinges = []fem.Hinge{{X: 9}}
	in := influence(t, m)
	for _, c := range []struct {
		tg   Target
		want string
	}{
		{Target{Quantity: fem.QShearForce, X: L, Side: fem.Left}, "shear force just left of x = 6 m"},
		{Target{Quantity: fem.QShearForce, X: L, Side: fem.Right}, "shear force just right of x = 6 m"},
		{Target{Quantity: fem.QShearForce, X: 3, Side: fem.Left}, "shear force just left of x = 3 m"},
		{Target{Quantity: fem.QBendingMoment, X: L, Side: fem.Left}, "bending moment at x = 6 m"},
		{Target{Quantity: fem.QBendingMoment, X: 3, Side: fem.Right}, "bending moment at x = 3 m"},
		{Target{Quantity: fem.QRotation, X: 9, Side: fem.Right}, "rotation just right of x = 9 m"},
		{Target{Quantity: fem.QRotation, X: L, Side: fem.Left}, "rotation at x = 6 m"},
		{Target{Quantity: fem.QDeflection, X: 9, Side: fem.Left}, "deflection at x = 9 m"},
		{Target{Quantity: fem.QShearForce, X: 0, Side: fem.Left}, "shear force at x = 0 m"},
		{Target{Reaction: true, Support: 1, Motion: fem.Transverse}, "transverse reaction of support 2"},
	} {
		x := trim(c.tg.X) + " m"
		if got := line(t, in, c.tg).Describe(x); got != c.want {
			t.Errorf("%v: %q, want %q", c.tg, got, c.want)
		}
	}
}

// An extreme at a support is placed on the support itself, not a hair
// beside it: the runway's 42 kN –3.2 m– 42 kN over two spans of 6 m gives
// its shear force and its hogging moment over the middle support, with
// the rear axle 3.2 m behind a front at 9.2 m (9.2 − 3.2 =
// 5.999999999999999 in floating point), and the envelope's peak under
// that axle, within the key points' tolerance of the support's station,
// named x = 5.999999999999999 in the JSON. The station is the support's.
func TestExtremeAtASupportIsOnIt(t *testing.T) {
	const L, P, d = 6.0, 42e3, 3.2
	m := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller})
	m.Mesh.Elements = 120
	p, in := prepared(t, m)
	e, err := in.Envelope(&Train{Name: "end carriage", Axles: []Axle{{Load: P}, {Load: P, Spacing: d}}, Direction: BothWays, Step: 0.05}, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []fem.Quantity{fem.QShearForce, fem.QBendingMoment} {
		hi, lo := e.Worst(q)
		for _, x := range []Extreme{hi, lo} {
			if q == fem.QBendingMoment && x == hi {
				continue // the sagging moment lies in a span
			}
			if x.X != L {
				t.Errorf("%s %.12g at x = %.17g, want on the support at %g", q, x.Value, x.X, L)
			}
		}
	}
	for i := 1; i < len(e.Stations); i++ {
		if e.Stations[i]-e.Stations[i-1] <= keyTolerance*2*L {
			t.Errorf("stations %.17g and %.17g are one point", e.Stations[i-1], e.Stations[i])
		}
	}
}

// Of equal peaks, the first along the member: one axle P over two equal
// spans L gives the largest moment under itself at a = ξL in either span,
// R₁·a with R₁ = Pb/(4L³)·(4L² − a(L + a)), b = L − a (AISC Beam Diagrams
// and Formulas, continuous beam – two equal spans – concentrated load at
// any point, from memory): M = PL·(ξ − 5ξ²/4 + ξ⁴/4), largest where
// 1 − 5ξ/2 + ξ³ = 0, ξ = 0.43232... The two spans' peaks tie but for
// round-off, and the envelope named the one in the second span,
// x = 15.68 m on spans of 10 m, where the load case envelope names the
// first of equal extremes along the member.
func TestEqualPeaksNameTheFirst(t *testing.T) {
	const L, P = 10.0, 100e3
	m := beam(2*L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}, fem.Support{X: 2 * L, Kind: fem.Roller})
	p, in := prepared(t, m)
	e, err := in.Envelope(&Train{Name: "one", Axles: []Axle{{Load: P}}, Direction: BothWays, Step: 0.2}, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	xi := 0.4
	for range 50 { // Newton on 1 − 5ξ/2 + ξ³
		xi -= (1 - 2.5*xi + xi*xi*xi) / (-2.5 + 3*xi*xi)
	}
	want := P * L * (xi - 1.25*xi*xi + 0.25*xi*xi*xi*xi)
	hi, _ := e.Worst(fem.QBendingMoment)
	if !near(hi.Value, want, 1e-9) || !near(hi.X, xi*L, 1e-6) {
		t.Errorf("largest moment %.12g N·m at x = %.9g m, want %.12g N·m at x = %.9g m (the first span's)", hi.Value, hi.X, want, xi*L)
	}
}
