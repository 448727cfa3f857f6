package fem

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"
)

// A beam fixed at x = 0, with a hinge at x = a and a roller at x = L, under
// a uniform load q (w < 0 down), is statically determinate (a cantilever
// carrying a suspended span): the span from the hinge to the roller is
// simply supported, so the roller and the hinge each take q(L−a)/2; the
// cantilever carries q·a and the hinge's force, so the fixed end takes
// q·a + q(L−a)/2 and the moment q·a²/2 + q(L−a)·a/2 (statics). FE and exact
// must both give them, and no bending moment at the hinge.
func TestHingeSuspendedSpan(t *testing.T) {
	const L, a, q = 8.0, 2.5, -6e3
	m := &Model{
		Segments:        []Segment{testSegment(0, L)},
		Supports:        []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Roller}},
		Hinges:          []Hinge{{X: a}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {L, q}}}},
		Mesh:            MeshSettings{Elements: 32},
	}
	W := -q
	wantFixed, wantMoment, wantRoller := W*a+W*(L-a)/2, W*a*a/2+W*(L-a)*a/2, W*(L-a)/2
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
		if got := r[0].Force[Transverse]; relErr(got, wantFixed) > 1e-9 {
			t.Errorf("%s fixed-end force %.9g, want %.9g", name, got, wantFixed)
		}
		if got := r[0].Force[Rotation]; relErr(got, wantMoment) > 1e-9 {
			t.Errorf("%s fixed-end moment %.9g, want %.9g", name, got, wantMoment)
		}
		if got := r[1].Force[Transverse]; relErr(got, wantRoller) > 1e-9 {
			t.Errorf("%s roller force %.9g, want %.9g", name, got, wantRoller)
		}
	}
	// The finite element moment is linear in an element: off by at most
	// q·h²/8 from the exact one (interpolation error, Strang & Fix, from memory).
	h := L / 32
	for name, f := range map[string]Field{"FE": s, "exact": e} {
		tol := 1e-9 * W * L * L
		if name == "FE" {
			tol = W * h * h / 8
		}
		for _, side := range []Side{Left, Right} {
			if got := f.At(a, side).BendingMoment; math.Abs(got) > tol {
				t.Errorf("%s moment at the hinge (side %d): %.3g, want 0 within %.3g", name, side, got, tol)
			}
		}
	}
	// The deflection is continuous at the hinge, the rotation jumps.
	if l, r := e.At(a, Left), e.At(a, Right); math.Abs(l.Deflection-r.Deflection) > 1e-12 || math.Abs(l.Rotation-r.Rotation) < 1e-6 {
		t.Errorf("exact at the hinge: w %.6g|%.6g, θ %.6g|%.6g; want w continuous and θ jumping", l.Deflection, r.Deflection, l.Rotation, r.Rotation)
	}
	if l, r := s.At(a, Left), s.At(a, Right); math.Abs(l.Rotation-e.At(a, Left).Rotation) > 1e-9 || math.Abs(r.Rotation-e.At(a, Right).Rotation) > 1e-9 {
		t.Errorf("FE rotations at the hinge %.9g|%.9g, exact %.9g|%.9g", l.Rotation, r.Rotation, e.At(a, Left).Rotation, e.At(a, Right).Rotation)
	}
}

// Two equal spans under a uniform load q with a semi-rigid joint of
// stiffness k over the middle support: each span is simply supported with
// an end moment M at the joint, turning by qL³/(24EI) − M·L/(3EI) there, and
// the joint's spring gives M = k·Δθ with Δθ twice that, so
// M = (k·qL³/(12EI)) / (1 + 2kL/(3EI)) (slope-deflection, Gere & Goodno,
// from memory): near 0 for a soft joint and qL²/8 for a rigid joint (the
// continuous beam, AISC beam diagrams case 29, from memory). A pure hinge
// over the support is refused (TestHingeAtSupportRefused).
func TestSemiRigidJoint(t *testing.T) {
	const L, q = 5.0, -10e3
	ei := testE * testI
	W := -q
	for _, k := range []float64{1e-3 * ei / L, ei / L, 1e3 * ei / L} {
		t.Run(fmt.Sprintf("k = %.3g", k), func(t *testing.T) {
			m := &Model{
				Segments:        []Segment{testSegment(0, 2*L)},
				Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}},
				Hinges:          []Hinge{{X: L, Stiffness: k}},
				DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {2 * L, q}}}},
				Mesh:            MeshSettings{Elements: 40},
			}
			want := -(k * W * L * L * L / (12 * ei)) / (1 + 2*k*L/(3*ei)) // hogging
			s := mustSolve(t, m)
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			h := 2 * L / 40
			for name, f := range map[string]Field{"FE": s, "exact": e} {
				tol := 1e-9 * W * L * L
				if name == "FE" {
					tol = W * h * h / 8 // the FE moment's interpolation error
				}
				if got := f.At(L, Left).BendingMoment; math.Abs(got-want) > tol {
					t.Errorf("%s moment at the joint %.9g, want %.9g within %.3g", name, got, want, tol)
				}
			}
			if want != 0 && (math.Abs(want) > W*L*L/8 || math.Abs(want) < 0) {
				t.Errorf("moment %.6g outside the pinned and fixed limits", want)
			}
		})
	}
}

// A hinge in a simply supported span makes it a mechanism: refused, naming
// the part that can move, with the free motion's shape.
func TestHingeMechanism(t *testing.T) {
	m := &Model{
		Segments:   []Segment{testSegment(0, 6)},
		Supports:   []Support{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}},
		Hinges:     []Hinge{{X: 2}},
		PointLoads: []PointLoad{{X: 3, Transverse: -1e3}},
		Mesh:       MeshSettings{Elements: 6},
	}
	var mech *MechanismError
	_, err := Solve(m)
	if !errors.As(err, &mech) || !strings.Contains(mech.Message, "the part from x = 0.0 m to 2.0 m can turn about x = 0.0 m") || len(mech.Parts) != 2 {
		t.Fatalf("got %v, want a mechanism of two parts naming the part turning about x = 0", err)
	}
	if _, err := SolveExact(m); !errors.As(err, &mech) {
		t.Errorf("exact: %v, want the mechanism too", err)
	}
	// A rotational spring across the hinge makes it sound again.
	m.Hinges[0].Stiffness = 1e6
	mustSolve(t, m)
}

// A pure hinge at a support that lets the member turn adds nothing the
// support does not already free, and one at a support that holds the
// rotation could not say which side it holds: both are refused at the
// hinge's position.
func TestHingeAtSupportRefused(t *testing.T) {
	for _, tc := range []struct {
		kind SupportKind
		want string
	}{
		{Roller, "a roller support that already lets the member turn"},
		{Pinned, "a pinned support that already lets the member turn"},
		{Fixed, "which holds the rotation"},
	} {
		m := &Model{
			Segments:   []Segment{testSegment(0, 8)},
			Supports:   []Support{{X: 0, Kind: Pinned}, {X: 4, Kind: tc.kind}, {X: 8, Kind: Roller}},
			Hinges:     []Hinge{{X: 4}},
			PointLoads: []PointLoad{{X: 2, Transverse: -1e3}},
		}
		var ve *ValidationError
		err := m.Validate()
		if !errors.As(err, &ve) || !strings.Contains(err.Error(), "hinge 1 is at support 2 (x = 4.0 m), "+tc.want) {
			t.Errorf("%s: got %v, want a refusal naming hinge 1 at support 2", tc.kind, err)
			continue
		}
		if p := ve.Problems[0].Place; p.Item != (Item{Kind: HingeItem, Index: 0}) || p.Property != PositionProperty {
			t.Errorf("%s: the refusal is placed at %+v, want hinge 1's position", tc.kind, p)
		}
	}
}

// The refusal of a hinge at a support that holds the rotation must give
// advice that leads to a model the loader takes: a pure hinge over a pinned
// or roller support is refused in its turn (TestHingeAtSupportRefused), so
// only a semi-rigid joint may be told to choose one of those kinds.
func TestHingeAtSupportHoldingRotationAdvice(t *testing.T) {
	for _, tc := range []struct {
		name      string
		stiffness float64
		want, not string
	}{
		{"pure hinge", 0, "move the hinge a little off the support", "(pinned, roller)"},
		{"semi-rigid joint", 1e6, "(pinned, roller)", "move the hinge a little off the support"},
	} {
		m := &Model{
			Segments:   []Segment{testSegment(0, 8)},
			Supports:   []Support{{X: 0, Kind: Pinned}, {X: 4, Kind: Fixed}, {X: 8, Kind: Roller}},
			Hinges:     []Hinge{{X: 4, Stiffness: tc.stiffness}},
			PointLoads: []PointLoad{{X: 2, Transverse: -1e3}},
		}
		err := m.Validate()
		if err == nil || !strings.Contains(err.Error(), tc.want) || strings.Contains(err.Error(), tc.not) {
			t.Errorf("%s: got %v, want advice with %q and without %q", tc.name, err, tc.want, tc.not)
		}
		// Following the advice to a pinned support must be taken for the semi-rigid joint.
		if tc.stiffness > 0 {
			m.Supports[1].Kind = Pinned
			if err := m.Validate(); err != nil {
				t.Errorf("%s over a pinned support: %v", tc.name, err)
			}
		}
	}
}

// A point moment C on a hinge turns only one of the two parts it joins, and
// the model cannot say which: the finite element solution put it on the
// left part and the exact one on the right, so the two disagreed by the
// whole answer and the headline picked a side without a word. It is
// refused at the load's position, in a load case as well. A little to one
// side it is solved: with a beam fixed at x = 0, a hinge at x = a and a pin
// at x = L, C on the cantilever (left) is taken by the fixed end alone (a
// reaction moment −C), and C on the suspended part (right) is balanced by a
// couple of C/(L−a) between the hinge and the pin, which the cantilever
// carries to the fixed end as a force C/(L−a) and a moment C·a/(L−a)
// (statics).
func TestPointMomentAtHinge(t *testing.T) {
	const L, a, C = 8.0, 3.0, 5e3
	model := func(x, k float64) *Model {
		return &Model{
			Segments:   []Segment{testSegment(0, L)},
			Supports:   []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Pinned}},
			Hinges:     []Hinge{{X: a, Stiffness: k}},
			PointLoads: []PointLoad{{X: 1, Transverse: -1e3}, {X: x, Moment: C}},
			Mesh:       MeshSettings{Elements: 16},
		}
	}
	inCase := func(m *Model) *Model {
		m.Cases = []LoadCase{{Name: "imposed", PointLoads: m.PointLoads}}
		m.PointLoads = nil
		return m
	}
	for _, tc := range []struct {
		name string
		m    *Model
		want Place
	}{
		{"pure hinge", model(a, 0), Place{Item: Item{Kind: PointLoadItem, Index: 1}, Property: PositionProperty}},
		{"semi-rigid joint", model(a, 2e6), Place{Item: Item{Kind: PointLoadItem, Index: 1}, Property: PositionProperty}},
		{"in a load case", inCase(model(a, 0)), Place{Item: Item{Kind: PointLoadItem, Index: 1, Case: 1}, Property: PositionProperty}},
	} {
		var ve *ValidationError
		if err := tc.m.Validate(); !errors.As(err, &ve) || len(ve.Problems) != 1 || ve.Problems[0].Place != tc.want ||
			!strings.Contains(err.Error(), "point load 2 puts a moment on hinge 1 (x = 3.0 m)") {
			t.Errorf("%s: got %v, want one refusal at %+v naming point load 2 and hinge 1", tc.name, err, tc.want)
		}
	}
	// A transverse force on the hinge is no ambiguity: both parts share its deflection.
	m := model(5, 0)
	m.PointLoads[0].X = a
	if err := m.Validate(); err != nil {
		t.Errorf("a transverse force on the hinge: %v, want it accepted", err)
	}
	for _, tc := range []struct {
		name                  string
		x                     float64
		fixed, moment, pinned float64 // reactions to C alone, N and N·m (statics)
	}{
		{"just left of the hinge", a - 0.1, 0, -C, 0},
		{"just right of the hinge", a + 0.1, C / (L - a), C * a / (L - a), -C / (L - a)},
	} {
		m := model(tc.x, 0)
		m.PointLoads = m.PointLoads[1:]
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
			for _, c := range []struct {
				what      string
				got, want float64
			}{
				{"fixed-end force", r[0].Force[Transverse], tc.fixed},
				{"fixed-end moment", r[0].Force[Rotation], tc.moment},
				{"pin force", r[1].Force[Transverse], tc.pinned},
			} {
				if math.Abs(c.got-c.want) > 1e-9*C {
					t.Errorf("%s, %s: %s %.9g, want %.9g", tc.name, name, c.what, c.got, c.want)
				}
			}
		}
	}
}

// A pure hinge where a support holds the deflection only elastically, or
// holds only the axial motion, leaves the two parts joined, so it is
// solved, not refused as cutting the member into separate spans (as it is
// at a pinned or roller support, TestHingeAtSupportRefused). A beam fixed at
// x = 0 with a hinge at x = a and a roller at x = L under a uniform load q
// (w = −q down): the suspended part hands q(L−a)/2 to the joint (statics).
// On a spring k there, the joint sinks by δ = (q(L−a)/2/kc + q·a⁴/(8EI)) /
// (1 + k/kc), kc = 3EI/a³ the cantilever's tip stiffness, and the spring
// takes k·δ (compatibility; cantilever tip deflections P·a³/(3EI) and
// q·a⁴/(8EI), Gere & Goodno tables, from memory). At an axial support an
// axial force P beyond it goes to that support alone (statics).
func TestPureHingeOnElasticOrAxialSupport(t *testing.T) {
	const L, a, q, P = 8.0, 4.0, 5e3, 3e3
	ei := testE * testI
	kc := 3 * ei / (a * a * a)
	const k = 1e6
	delta := (q*(L-a)/2/kc + q*a*a*a*a/(8*ei)) / (1 + k/kc)
	for _, tc := range []struct {
		name    string
		support Support
		load    []PointLoad
		dof     Dof
		want    float64 // the middle support's reaction, N
	}{
		{"transverse spring", Support{X: a, Kind: Spring, Stiffness: [3]float64{0, k, 0}}, nil, Transverse, k * delta},
		{"axial support", Support{X: a, Kind: AxialOnly}, []PointLoad{{X: 6, Axial: P}}, Axial, -P},
	} {
		m := &Model{
			Segments:        []Segment{testSegment(0, L)},
			Supports:        []Support{{X: 0, Kind: Fixed}, tc.support, {X: L, Kind: Roller}},
			Hinges:          []Hinge{{X: a}},
			PointLoads:      tc.load,
			DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -q}, {L, -q}}}},
			Mesh:            MeshSettings{Elements: 16},
		}
		if err := m.Validate(); err != nil {
			t.Errorf("%s: %v, want it accepted", tc.name, err)
			continue
		}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		for name, r := range map[string][]Reaction{"FE": s.Reactions, "exact": e.Reactions()} {
			if got := r[1].Force[tc.dof]; relErr(got, tc.want) > 1e-9 {
				t.Errorf("%s, %s: middle support's reaction %.9g, want %.9g", tc.name, name, got, tc.want)
			}
			if got, want := r[2].Force[Transverse], q*(L-a)/2; relErr(got, want) > 1e-9 {
				t.Errorf("%s, %s: roller's reaction %.9g, want %.9g", tc.name, name, got, want)
			}
		}
	}
}
