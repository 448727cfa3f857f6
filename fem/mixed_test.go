package fem

import (
	"errors"
	"fmt"
	"math"
	"slices"
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

// A tie held only axially at both ends carries an axial force P at x = a:
// the ends share it as a bar fixed at both ends does, P·(L−a)/L at x = 0 and
// P·a/L at x = L (statically indeterminate bar, Gere & Goodno, Mechanics of
// Materials, from memory). Nothing loads it across, so it is solved as a bar
// alone, not refused as free to move sideways; declared axial-only, a
// transverse load on it is refused where it stands.
func TestTieOnAxialSupports(t *testing.T) {
	const L, a, P = 5.0, 2.0, 30e3
	m := &Model{
		Segments:   []Segment{testSegment(0, L)},
		Supports:   []Support{{X: 0, Kind: AxialOnly}, {X: L, Kind: AxialOnly}},
		PointLoads: []PointLoad{{X: a, Axial: P}},
		Mesh:       MeshSettings{Elements: 10},
	}
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	if !s.AxialOnly {
		t.Error("a member nothing bends is not reported as solved axially only")
	}
	for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
		if got, want := r[0].Force[Axial], -P*(L-a)/L; relErr(got, want) > 1e-12 {
			t.Errorf("%s reaction at x = 0: %.12g, want %.12g", name, got, want)
		}
		if got, want := r[1].Force[Axial], -P*a/L; relErr(got, want) > 1e-12 {
			t.Errorf("%s reaction at x = L: %.12g, want %.12g", name, got, want)
		}
	}
	if f := s.At(1, Right); f.Deflection != 0 || f.BendingMoment != 0 || f.AxialForce <= 0 {
		t.Errorf("fields at x = 1 m: %+v, want tension and no bending", f)
	}
	// Its summary shows no bending quantities: only the axial extremes (the
	// combined stress is the axial stress), no shear or moment at supports,
	// no reaction across.
	sum := Summarize(s, e)
	var got []Quantity
	for _, x := range sum.Extremes {
		got = append(got, x.Quantity)
	}
	if want := []Quantity{QAxialDisplacement, QAxialForce, QAxialStress, QCombinedStress}; !slices.Equal(got, want) {
		t.Errorf("the summary lists %v, want %v", got, want)
	}
	for _, r := range sum.Reactions {
		if r.Holds[Transverse] || r.Holds[Rotation] || !r.Holds[Axial] {
			t.Errorf("support %d reads as holding %v, want the axial motion alone", r.Support, r.Holds)
		}
	}
	if len(sum.Supports) != 0 {
		t.Errorf("%d supports' shear and moment listed on a bar", len(sum.Supports))
	}
	m.AxialOnly = true
	m.PointLoads = append(m.PointLoads, PointLoad{X: 1, Transverse: -1e3})
	var invalid *ValidationError
	if err := m.Validate(); !errors.As(err, &invalid) || invalid.Problems[0].Place != (Place{Item: Item{Kind: PointLoadItem, Index: 1}, Property: TransverseForceProperty}) {
		t.Errorf("a transverse load on an axial-only member: %v", err)
	}
	// Without the declaration the same load bends it, and two axial supports cannot hold that.
	m.AxialOnly = false
	var mech *MechanismError
	if _, err := Solve(m); !errors.As(err, &mech) {
		t.Errorf("a bent member on axial supports only: %v, want a mechanism", err)
	}
}
