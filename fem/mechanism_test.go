package fem

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"

	"stave/fem/units"
)

// hingeChain is a member 0 to L with hinges at hs (pure where the
// stiffness is 0) and supports ss, as hingeMechanism reads it.
func hingeChain(L float64, hs []Hinge, ss []Support, fs ...Foundation) *Model {
	return &Model{Segments: []Segment{testSegment(0, L)}, Hinges: hs, Supports: ss, Foundations: fs}
}

// Chains of parts between hinges, each a rigid body in the plane that a
// deflection restraint pins at a point and a rotation restraint keeps
// level; two restraints of deflection at different points, or one with a
// rotation restraint, hold a part, and a hinge passes the deflection (a
// spring across it the rotation too) to the next part: the kinematics of
// rigid bodies, from memory (any statics text, e.g. Hibbeler, Structural
// Analysis, on the stability of compound beams).
func TestHingeMechanismCases(t *testing.T) {
	pure := func(x ...float64) []Hinge {
		var out []Hinge
		for _, v := range x {
			out = append(out, Hinge{X: v})
		}
		return out
	}
	cases := []struct {
		name string
		m    *Model
		want string // a part of the message; "" for no mechanism
	}{
		{"hinge in a simple span", hingeChain(6, pure(2), []Support{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}}),
			"the part from x = 0.0 m to 2.0 m can turn about x = 0.0 m, the part from x = 2.0 m to 6.0 m can turn about x = 6.0 m"},
		{"semi-rigid hinge in a simple span", hingeChain(6, []Hinge{{X: 2, Stiffness: 1e6}}, []Support{{X: 0, Kind: Pinned}, {X: 6, Kind: Roller}}), ""},
		{"propped cantilever with a hinge", hingeChain(6, pure(2), []Support{{X: 0, Kind: Fixed}, {X: 6, Kind: Roller}}), ""},
		{"cantilever with a hinge", hingeChain(6, pure(2), []Support{{X: 0, Kind: Fixed}}),
			"the part from x = 2.0 m to 6.0 m can turn about x = 2.0 m"},
		{"cantilever with a spring across the hinge", hingeChain(6, []Hinge{{X: 2, Stiffness: 5e4}}, []Support{{X: 0, Kind: Fixed}}), ""},
		{"support at a semi-rigid hinge", hingeChain(6, []Hinge{{X: 3, Stiffness: 1e5}}, []Support{{X: 0, Kind: Pinned}, {X: 3, Kind: Roller}, {X: 6, Kind: Roller}}), ""},
		{"pure hinge at the only inner support", hingeChain(6, pure(3), []Support{{X: 0, Kind: Roller}, {X: 3, Kind: Pinned}}),
			"the part from x = 3.0 m to 6.0 m can turn about x = 3.0 m"},
		{"gerber beam", hingeChain(12, pure(4, 8), []Support{{X: 0, Kind: Pinned}, {X: 3, Kind: Roller}, {X: 9, Kind: Roller}, {X: 12, Kind: Roller}}), ""},
		{"middle part with no restraint of its own", hingeChain(12, pure(4, 8), []Support{{X: 0, Kind: Fixed}, {X: 12, Kind: Fixed}}), ""},
		{"two free parts between fixed ends", hingeChain(12, pure(3, 6, 9), []Support{{X: 0, Kind: Fixed}, {X: 12, Kind: Fixed}}),
			"the part from x = 3.0 m to 6.0 m can turn about x = 3.0 m, the part from x = 6.0 m to 9.0 m can turn about x = 9.0 m"},
		{"guided part", hingeChain(6, pure(3), []Support{{X: 0, Kind: Fixed}, {X: 5, Kind: Guided}}), ""},
		{"guided part hinged to a held one", hingeChain(6, pure(3), []Support{{X: 0, Kind: Roller}, {X: 1, Kind: Roller}, {X: 5, Kind: Guided}}), ""},
		{"spring support holding deflection", hingeChain(6, pure(3), []Support{{X: 0, Kind: Fixed}, {X: 5, Kind: Spring, Stiffness: [3]float64{0, 1e6, 0}}}), ""},
		{"spring support holding rotation alone", hingeChain(6, pure(3), []Support{{X: 0, Kind: Pinned}, {X: 5, Kind: Spring, Stiffness: [3]float64{0, 0, 1e6}}}),
			"the part from x = 0.0 m to 3.0 m can turn about x = 0.0 m, the part from x = 3.0 m to 6.0 m can move sideways"},
		{"foundation under the free part", hingeChain(6, pure(2), []Support{{X: 0, Kind: Fixed}}, Foundation{Start: 4, End: 6, Modulus: 1e6}), ""},
		{"foundation ending at the hinge", hingeChain(6, pure(2), []Support{{X: 0, Kind: Pinned}}, Foundation{Start: 0, End: 2, Modulus: 1e6}),
			"the part from x = 2.0 m to 6.0 m can turn about x = 2.0 m"},
		{"foundation starting at the hinge", hingeChain(6, pure(2), []Support{{X: 0, Kind: AxialOnly}}, Foundation{Start: 2, End: 3, Modulus: 1e6}),
			"the part from x = 0.0 m to 2.0 m can turn about x = 2.0 m"},
		{"axial foundation only", hingeChain(6, pure(2), []Support{{X: 0, Kind: Fixed}}, Foundation{Start: 0, End: 6, AxialModulus: 1e6}),
			"the part from x = 2.0 m to 6.0 m can turn about x = 2.0 m"},
		{"foundation over every part", hingeChain(6, pure(2, 4), nil, Foundation{Start: 1, End: 5, Modulus: 1e6}), ""},
		{"no restraint across at all", hingeChain(6, pure(3), []Support{{X: 0, Kind: AxialOnly}}), "the part from x = 0.0 m to 3.0 m"},
		// A part 1 µm long reads with the digits that tell its ends apart
		// (it read "from x = 4.0 m to 4.0 m").
		{"two hinges 1 µm apart in a cantilever", hingeChain(6, pure(4, 4.000001), []Support{{X: 0, Kind: Fixed}}),
			"the part from x = 4.0 m to 4.000001 m"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			err := hingeMechanism(c.m, units.Base)
			var mech *MechanismError
			switch {
			case c.want == "" && err != nil:
				t.Errorf("got %v, want no mechanism", err)
			case c.want != "" && (!errors.As(err, &mech) || !strings.Contains(mech.Message, c.want)):
				t.Errorf("got %v, want a mechanism naming %q", err, c.want)
			case mech != nil:
				if r := motionResidual(c.m, mech.Parts); r > 1e-9 {
					t.Errorf("the motion breaks a constraint by %.3g", r)
				}
			}
		})
	}
}

// A spring across a hinge ties the rotations of the parts it joins, so
// for rigid-body motions they are one body (the kinematics of rigid
// bodies, from memory): a member that its supports alone leave free is
// refused for its supports, as without the hinge, not as a mechanism of
// its hinges with "remove a hinge" as a remedy. A member on one pin with a
// semi-rigid joint was refused with "the part from x = 0.0 m to 1.3 m can
// turn about x = 10.1 m, the part from x = 1.3 m to 12.4 m can turn about
// x = 10.1 m; ... or remove a hinge". A member that nothing holds across
// is told so, whatever its hinges. A pure hinge beside a semi-rigid one
// still names the part it frees, whole.
func TestMechanismAcrossSemiRigidHinges(t *testing.T) {
	const L = 12.4
	cases := []struct {
		name     string
		hinges   []Hinge
		supports []Support
		motion   string
		message  string // the whole message, or a part of it for a hinge's mechanism
	}{
		{"one pin and a semi-rigid joint", []Hinge{{X: 1.3, Stiffness: 1e6}}, []Support{{X: 10.1, Kind: Pinned}},
			"rotation", "the member can rotate about the support at x = 10.1 m: add a second support or fix one end"},
		{"nothing across and a semi-rigid joint", []Hinge{{X: 6, Stiffness: 1e6}}, []Support{{X: 0, Kind: AxialOnly}},
			"transverse", "the member can move sideways: add a support that restrains deflection"},
		// Nothing across the member and a pure hinge: the motions are many,
		// and one the chain's sweep picks turned both parts about x = -8.33 m.
		{"nothing across and a pure hinge", []Hinge{{X: 6}}, []Support{{X: 0, Kind: AxialOnly}},
			"transverse", "the member can move sideways: add a support that restrains deflection"},
		{"a pure hinge past a semi-rigid joint in a cantilever", []Hinge{{X: 2, Stiffness: 1e6}, {X: 4}}, []Support{{X: 0, Kind: Fixed}},
			"hinge", "with its hinges the member is a mechanism: the part from x = 4.0 m to 12.4 m can turn about x = 4.0 m;"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := &Model{Segments: []Segment{testSegment(0, L)}, Hinges: c.hinges, Supports: c.supports,
				PointLoads: []PointLoad{{X: 3, Transverse: -1}}}
			_, err := Solve(m)
			var me *MechanismError
			if !errors.As(err, &me) {
				t.Fatalf("got error %v, want a *MechanismError", err)
			}
			if me.Motion != c.motion || !(me.Message == c.message || c.motion == "hinge" && strings.HasPrefix(me.Message, c.message)) {
				t.Errorf("got (%q, %q), want (%q, %q)", me.Motion, me.Message, c.motion, c.message)
			}
			if r := motionResidual(m, me.Parts); r > 1e-9 {
				t.Errorf("the motion breaks a constraint by %.3g", r)
			}
		})
	}
}

// motionResidual is how far the free motion parts breaks the constraints
// of m's supports, hinges and foundations: 0 for a motion they allow.
func motionResidual(m *Model, parts []MechanismPart) float64 {
	L := m.Length()
	at := func(x float64, right bool) MechanismPart { // the part holding x
		for i := len(parts) - 1; i >= 0; i-- {
			if x > parts[i].Start || x == parts[i].Start && right || i == 0 {
				return parts[i]
			}
		}
		panic("unreachable")
	}
	w := func(p MechanismPart, x float64) float64 { return p.Offset + p.Slope*(x-p.Start) }
	worst := 0.0
	for _, s := range m.Supports {
		p := at(s.X, true)
		if s.Holds(Transverse) {
			worst = max(worst, math.Abs(w(p, s.X)))
		}
		if s.Holds(Rotation) {
			worst = max(worst, math.Abs(p.Slope)*L)
		}
	}
	for _, h := range m.Hinges {
		l, r := at(h.X, false), at(h.X, true)
		worst = max(worst, math.Abs(w(l, h.X)-w(r, h.X)))
		if h.Stiffness > 0 {
			worst = max(worst, math.Abs(l.Slope-r.Slope)*L)
		}
	}
	for _, f := range m.Foundations {
		for _, p := range parts {
			if f.Modulus > 0 && min(f.End, p.End) > max(f.Start, p.Start) {
				worst = max(worst, math.Abs(p.Offset), math.Abs(p.Slope)*L)
			}
		}
	}
	return worst
}

// denseNullSpace is the null space of the chain's constraints on each
// part's offset and slope, written out as one dense matrix and found by
// gonum's singular value decomposition: the reference the sweep must
// agree with. Rows of the basis are (offset, slope·L) per part.
func denseNullSpace(m *Model) (cuts []float64, basis *mat.Dense) {
	L := m.Length()
	cuts = []float64{0}
	for _, h := range m.Hinges {
		cuts = append(cuts, h.X)
	}
	slices.Sort(cuts)
	cuts = append(cuts, L)
	n := 2 * (len(cuts) - 1)
	var rows []float64
	add := func(entries ...float64) { // index, value pairs
		r := make([]float64, n)
		for i := 0; i < len(entries); i += 2 {
			r[int(entries[i])] = entries[i+1]
		}
		rows = append(rows, r...)
	}
	for p := 1; p < len(cuts)-1; p++ {
		add(float64(2*p-2), 1, float64(2*p-1), (cuts[p]-cuts[p-1])/L, float64(2*p), -1)
		for _, h := range m.Hinges {
			if h.X == cuts[p] && h.Stiffness > 0 {
				add(float64(2*p-1), 1, float64(2*p+1), -1)
			}
		}
	}
	for _, s := range m.Supports {
		p := 0
		for p+2 < len(cuts) && s.X >= cuts[p+1] {
			p++
		}
		if s.Holds(Transverse) {
			add(float64(2*p), 1, float64(2*p+1), (s.X-cuts[p])/L)
		}
		if s.Holds(Rotation) {
			add(float64(2*p+1), 1)
		}
	}
	for _, f := range m.Foundations {
		for p := 0; p+1 < len(cuts); p++ {
			if f.Modulus > 0 && min(f.End, cuts[p+1]) > max(f.Start, cuts[p]) {
				add(float64(2*p), 1)
				add(float64(2*p+1), 1)
			}
		}
	}
	if len(rows) == 0 {
		add()
	}
	var svd mat.SVD
	if !svd.Factorize(mat.NewDense(len(rows)/n, n, rows), mat.SVDFullV) {
		panic("SVD failed")
	}
	values := svd.Values(nil)
	rank := 0
	for _, v := range values {
		if v > 1e-10*values[0] {
			rank++
		}
	}
	if rank == n {
		return cuts, nil
	}
	var v mat.Dense
	svd.VTo(&v)
	return cuts, mat.DenseCopyOf(v.Slice(0, n, rank, n))
}

// Random chains of up to eight parts, with pure and semi-rigid hinges,
// supports of every kind (some at hinges), elastic supports and
// foundations: the sweep finds a mechanism exactly when the dense null
// space is not empty, its motion is one the constraints allow, and it
// moves the parts that some free motion moves.
func TestHingeMechanismAsDenseNullSpace(t *testing.T) {
	rnd := rand.New(rand.NewPCG(11, 17))
	const L = 10.0
	mechanisms := 0
	for i := range 3000 {
		var hs []Hinge
		xs := map[float64]bool{}
		for range 1 + rnd.IntN(7) {
			x := float64(1 + rnd.IntN(19)) // on a 0.5 m grid, so supports fall on hinges
			if xs[x] {
				continue
			}
			xs[x] = true
			h := Hinge{X: x / 2}
			if rnd.IntN(3) == 0 {
				h.Stiffness = 1e5
			}
			hs = append(hs, h)
		}
		var ss []Support
		for range rnd.IntN(5) {
			s := Support{X: float64(rnd.IntN(21)) / 2, Kind: SupportKind(rnd.IntN(6))}
			if s.Kind == Spring {
				for d := range s.Stiffness {
					s.Stiffness[d] = float64(rnd.IntN(2)) * 1e6
				}
			}
			ss = append(ss, s)
		}
		var fs []Foundation
		if rnd.IntN(4) == 0 {
			a, b := float64(rnd.IntN(21))/2, float64(rnd.IntN(21))/2
			fs = append(fs, Foundation{Start: min(a, b), End: max(a, b), Modulus: float64(rnd.IntN(2)) * 1e6})
		}
		m := hingeChain(L, hs, ss, fs...)
		cuts, basis := denseNullSpace(m)
		err := hingeMechanism(m, units.Base)
		var mech *MechanismError
		if (basis != nil) != errors.As(err, &mech) {
			t.Fatalf("model %d (hinges %v, supports %v, foundations %v): got %v, want a mechanism %v", i, hs, ss, fs, err, basis != nil)
		}
		if mech == nil {
			continue
		}
		mechanisms++
		if r := motionResidual(m, mech.Parts); r > 1e-9 {
			t.Errorf("model %d: the motion breaks a constraint by %.3g", i, r)
		}
		for p := range len(cuts) - 1 {
			moves := false // some free motion moves part p
			for j := range basis.RawMatrix().Cols {
				a, b := basis.At(2*p, j), basis.At(2*p+1, j)
				moves = moves || math.Abs(a) > 1e-9 || math.Abs(a+b*(cuts[p+1]-cuts[p])/L) > 1e-9
			}
			// The reported part that holds this stretch: parts a spring
			// across a hinge joins are reported as one.
			k := 0
			for k+1 < len(mech.Parts) && mech.Parts[k].End <= cuts[p] {
				k++
			}
			got := mech.Parts[k]
			w := func(x float64) float64 { return got.Offset + got.Slope*(x-got.Start) }
			moved := math.Abs(w(cuts[p])) > 1e-9 || math.Abs(w(cuts[p+1])) > 1e-9
			if moves != moved {
				t.Errorf("model %d (hinges %v, supports %v, foundations %v): part %d from %g to %g moves %v, want %v", i, hs, ss, fs, p, cuts[p], cuts[p+1], moved, moves)
			}
		}
	}
	if mechanisms < 300 || mechanisms > 2700 {
		t.Errorf("%d mechanisms of 3000 models: the sample tests too little of one side", mechanisms)
	}
}

// gerberChain is a beam fixed at 0 over n+1 spans of 1 m, with a hinge
// 0.5 m into every span after the first and a roller at the end of each:
// each part is held by its roller and the hinge to the part before it.
func gerberChain(n int) *Model {
	m := hingeChain(float64(n+1), nil, []Support{{X: 0, Kind: Fixed}})
	for i := 1; i <= n; i++ {
		m.Hinges = append(m.Hinges, Hinge{X: float64(i) + 0.5})
		m.Supports = append(m.Supports, Support{X: float64(i), Kind: Roller})
	}
	m.Supports = append(m.Supports, Support{X: float64(n + 1), Kind: Roller})
	return m
}

// Thousands of hinges: the chain is sound, and without one roller the
// part after it turns about the hinge before it and every part beyond
// follows, each about its roller (rigid-body kinematics, from memory);
// the message names the first few and counts the rest.
func TestHingeMechanismThousandsOfHinges(t *testing.T) {
	const n = 4000
	m := gerberChain(n)
	if err := hingeMechanism(m, units.Base); err != nil {
		t.Fatalf("%d hinges, each part held: %v", n, err)
	}
	m.Supports = slices.Delete(m.Supports, 3000, 3001) // the roller at x = 3000 m
	var mech *MechanismError
	if err := hingeMechanism(m, units.Base); !errors.As(err, &mech) {
		t.Fatalf("without the roller at 3000 m: %v, want a mechanism", err)
	}
	want := "the part from x = 2999.5 m to 3000.5 m can turn about x = 2999.5 m, the part from x = 3000.5 m to 3001.5 m can turn about x = 3001.0 m"
	if !strings.Contains(mech.Message, want) || !strings.Contains(mech.Message, fmt.Sprintf("and %d more parts can move", n-2999+1-maxPartsNamed)) {
		t.Errorf("got %q, want it to name %q and count the rest", mech.Message, want)
	}
	if r := motionResidual(m, mech.Parts); r > 1e-9 {
		t.Errorf("the motion breaks a constraint by %.3g", r)
	}
	for p, part := range mech.Parts {
		if moved := part.Offset != 0 || part.Slope != 0; moved != (p >= 2999) {
			t.Fatalf("part %d from %g m moves %v, want %v", p, part.Start, moved, p >= 2999)
		}
	}
}

// BenchmarkHingeMechanism times the mechanism check of a chain of parts,
// which grew with the cube of the hinges with a dense decomposition (400
// hinges about 1 s, 4,000 about 1,000 s) and grows linearly with the
// sweep.
//
//	go test -run '^$' -bench HingeMechanism -benchtime 3x ./fem
func BenchmarkHingeMechanism(b *testing.B) {
	for _, n := range []int{400, 4000, 40000} {
		m := gerberChain(n)
		b.Run(fmt.Sprintf("hinges=%d", n), func(b *testing.B) {
			for b.Loop() {
				if err := hingeMechanism(m, units.Base); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
