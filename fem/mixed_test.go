package fem

import (
	"fmt"
	"math"
	"testing"
)

// A beam on a roller held against rotation by a spring k at x = 0 and a
// roller at x = L, under a uniform load q: the end moment follows from
// compatibility of rotations (slope-deflection, Gere & Goodno, Mechanics of
// Materials, from memory): the simply supported beam turns by qL³/(24EI),
// an end moment M turns it back by M·L/(3EI) and the spring by M/k, so
// M = (qL³/(24EI)) / (1/k + L/(3EI)), between 0 (k → 0, simply supported)
// and qL²/8 (k → ∞, propped cantilever). The reactions follow by statics:
// R_A = qL/2 + M/L. Finite element and exact solutions must both match.
func TestRollerWithRotationalSpring(t *testing.T) {
	const L, q = 6.0, -8e3 // m, N/m (downwards)
	ei := testE * testI
	for _, k := range []float64{1e3, ei / L, 10 * ei / L, 1e12} {
		t.Run(fmt.Sprintf("k = %.3g", k), func(t *testing.T) {
			m := &Model{
				Segments:        []Segment{testSegment(0, L)},
				Supports:        []Support{{X: 0, Kind: Roller, Stiffness: [3]float64{0, 0, k}}, {X: L, Kind: Pinned}},
				DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {L, q}}}},
				Mesh:            MeshSettings{Elements: 24},
			}
			moment := (-q * L * L * L / (24 * ei)) / (1/k + L/(3*ei)) // hogging, N·m
			wantRA := -q*L/2 + moment/L
			s := mustSolve(t, m)
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
				if got := r[0].Force[Transverse]; relErr(got, wantRA) > 1e-9 {
					t.Errorf("%s reaction at the spring end %.9g, want %.9g", name, got, wantRA)
				}
				// The sagging member turns clockwise at x = 0; the spring turns
				// it back, counter-clockwise (positive).
				if got := r[0].Force[Rotation]; relErr(got, moment) > 1e-9 {
					t.Errorf("%s spring moment %.9g, want %.9g", name, got, moment)
				}
			}
			if got := e.At(0, Right).BendingMoment; relErr(got, -moment) > 1e-9 {
				t.Errorf("exact moment at the spring end %.9g, want %.9g (hogging)", got, -moment)
			}
		})
	}
}

// A bar fixed at x = L and held at x = 0 by a roller on an axial spring k,
// with an axial force P at mid-length: the load splits between the two
// parts as between springs in parallel (the left part is the bar's half
// EA/(L/2) in series with k), so the spring carries
// P·kₗ/(kₗ + 2EA/L) with kₗ = 1/(1/k + L/(2EA)) (bars in series and in
// parallel, Gere & Goodno, from memory).
func TestRollerOnAxialSpring(t *testing.T) {
	const L, P = 4.0, 50e3
	ea := testE * testA
	k := ea / L
	m := &Model{
		Segments:   []Segment{testSegment(0, L)},
		Supports:   []Support{{X: 0, Kind: Roller, Stiffness: [3]float64{k, 0, 0}}, {X: L, Kind: Fixed}},
		PointLoads: []PointLoad{{X: L / 2, Axial: P}},
		Mesh:       MeshSettings{Elements: 8},
	}
	left := 1 / (1/k + L/(2*ea))
	want := -P * left / (left + 2*ea/L) // the spring pulls back
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
		if got := r[0].Force[Axial]; relErr(got, want) > 1e-9 {
			t.Errorf("%s spring reaction %.9g, want %.9g", name, got, want)
		}
		if got := r[1].Force[Axial]; relErr(got, -P-want) > 1e-9 {
			t.Errorf("%s fixed-end reaction %.9g, want %.9g", name, got, -P-want)
		}
	}
	// Held transversely only at the roller and fully at the fixed end, it is no mechanism.
	if math.IsNaN(s.Displacement[0][Axial]) {
		t.Error("no displacement at the spring")
	}
}
