package moving

import (
	"math"
	"testing"

	"stave/fem"
)

// The worst effect of a train is summed from each axle's piece of the
// influence line, a cubic in the front's position. A cubic written about a
// point far from where it is read loses the digits it cancels: a piece
// 0.1 mm long read 5 m from the member's origin, or a train whose axles
// stand kilometres behind its front, read every axle's line to a few per
// cent. These are the cases; the expected values need no scan.
func TestWorstFarFromTheOrigin(t *testing.T) {
	const P = 10e3
	one := Train{Axles: []Axle{{Load: P}}, Step: 0.01}
	// Two fixed supports 0.1 mm apart at x = 5 m of a 10 m beam.
	short := beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 5, Kind: fem.Fixed},
		fem.Support{X: 5.0001, Kind: fem.Fixed}, fem.Support{X: 10, Kind: fem.Roller})
	// 100 axles 1 km apart driving over a 10 m simple span: one at a time
	// on it, kilometres from the front.
	far := Train{Axles: []Axle{{Load: P}}, OffEnds: true}
	for range 99 {
		far.Axles = append(far.Axles, Axle{Load: P, Spacing: 1000})
	}
	simple := beam(10, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: 10, Kind: fem.Roller})
	for _, c := range []struct {
		name   string
		m      *fem.Model
		train  Train
		target Target
	}{
		{"shear just right of a support 0.1 mm from the next", short, one, Target{Quantity: fem.QShearForce, X: 5, Side: fem.Right}},
		{"moment 0.05 mm from both supports", short, one, Target{Quantity: fem.QBendingMoment, X: 5.00005}},
		{"deflection 0.05 mm from both supports", short, one, Target{Quantity: fem.QDeflection, X: 5.00005}},
		{"far axles, deflection at midspan", simple, far, Target{Quantity: fem.QDeflection, X: 5}},
		{"far axles, moment at 3 m", simple, far, Target{Quantity: fem.QBendingMoment, X: 3}},
		{"far axles, shear just left of 3 m", simple, far, Target{Quantity: fem.QShearForce, X: 3, Side: fem.Left}},
	} {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			hi, lo, err := in.Worst(&c.train, p.Mesh(), c.target)
			if err != nil {
				t.Fatal(err)
			}
			// One axle on the member at a time: the worst effects are the
			// load times the influence line's extremes (the definition of
			// an influence line, from memory), zero among them since the
			// member is also unloaded (off the member, or on a support).
			l := line(t, in, c.target)
			lineLo, lineHi := l.Extremes()
			wantHi, wantLo := P*max(lineHi.Value, 0), P*min(lineLo.Value, 0)
			scale := P * max(math.Abs(lineHi.Value), math.Abs(lineLo.Value))
			if math.Abs(hi.Value-wantHi) > 1e-9*scale || math.Abs(lo.Value-wantLo) > 1e-9*scale {
				t.Errorf("worst %.12g and %.12g, want %.12g and %.12g (load times the line's extremes)", hi.Value, lo.Value, wantHi, wantLo)
			}
		})
	}
}

// The envelope of the far axles over the simple span: the deflection is
// never upward under loads acting down, and its smallest is P·L³/(48·EI)
// at midspan (a simple beam under a central point load, AISC Manual, Beam
// Diagrams and Formulas, case 7, from memory).
func TestEnvelopeOfFarAxles(t *testing.T) {
	const P, L = 10e3, 10.0
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	p, in := prepared(t, m)
	far := &Train{Axles: []Axle{{Load: P}}, OffEnds: true}
	for range 99 {
		far.Axles = append(far.Axles, Axle{Load: P, Spacing: 1000})
	}
	e, err := in.Envelope(far, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	EI := m.Segments[0].Material.Elastic * m.Segments[0].Section.SecondMoment
	want := -P * L * L * L / (48 * EI)
	hi, lo := e.Worst(fem.QDeflection)
	if hi.Value > 1e-9*math.Abs(want) {
		t.Errorf("largest deflection %.6g m at x = %g, want none upward", hi.Value, hi.X)
	}
	if !near(lo.Value, want, 1e-9) || math.Abs(lo.X-L/2) > 1e-6 {
		t.Errorf("smallest deflection %.12g m at x = %.9g, want %.12g m at %g (P·L³/48EI)", lo.Value, lo.X, want, L/2)
	}
}
