package fem

import (
	"math"
	"testing"
)

// Simply supported beam under a uniform downward load: the summary must find
// the midspan extremes at midspan and report the reactions by support.
// Source: Gere & Goodno, Mechanics of Materials, Appendix D (simple beams),
// from memory: R = qL/2, Mmax = qL²/8 at L/2, wmax = 5qL⁴/(384EI) at L/2.
func TestSummarizeSimplySupportedUniform(t *testing.T) {
	const L, E, I, q = 4.0, 200e9, 8e-6, -5e3
	m := &Model{
		Segments: []Segment{{Start: 0, End: L,
			Section:  Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1},
			Material: Material{Elastic: E}}},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {L, q}}}},
		Mesh:            MeshSettings{Elements: 16},
	}
	s, err := Solve(m)
	if err != nil {
		t.Fatal(err)
	}
	sum := Summarize(s, nil)
	if len(sum.Reactions) != 2 || sum.Reactions[0].Support != 1 || sum.Reactions[1].Kind != "roller" {
		t.Fatalf("reactions %+v", sum.Reactions)
	}
	for _, r := range sum.Reactions {
		if math.Abs(r.Transverse+q*L/2) > 1e-9*math.Abs(q*L) {
			t.Errorf("support %d reaction %g, want %g", r.Support, r.Transverse, -q*L/2)
		}
	}
	byQuantity := map[Quantity]Extreme{}
	for _, e := range sum.Extremes {
		byQuantity[e.Quantity] = e
	}
	moment := byQuantity[QBendingMoment]
	// Nodal values are exact and midspan is a node (16 elements), so the
	// moment from w'' at a node differs from qL²/8 by at most the element's
	// fixed-end moment qh²/12 (Hermite moment error, see fem/refcase_test.go).
	h := L / 16
	if want := -q * L * L / 8; math.Abs(moment.Max-want) > math.Abs(q)*h*h/12*(1+1e-9) || math.Abs(moment.XMax-L/2) > h/2 {
		t.Errorf("largest moment %g at %g, want %g at %g", moment.Max, moment.XMax, want, L/2)
	}
	defl := byQuantity[QDeflection]
	if want := 5 * q * L * L * L * L / (384 * E * I); math.Abs(defl.Min-want) > 1e-9*math.Abs(want) || defl.XMin != L/2 {
		t.Errorf("deflection %g at %g, want %g at %g", defl.Min, defl.XMin, want, L/2)
	}
	if sum.Equilibrium.Relative > 1e-12 {
		t.Errorf("equilibrium residual %g", sum.Equilibrium.Relative)
	}
	if sum.ExactError != nil {
		t.Error("exact error reported without an exact solution")
	}
	if sum.Mesh.Elements != 16 || sum.Mesh.Nodes != 17 || sum.Mesh.BarOrder != 1 {
		t.Errorf("mesh %+v", sum.Mesh)
	}
}

// The deflection's extreme is reported where the finite element curve has
// zero slope, not at the nearest sample. A simply supported beam with one
// point load P at a from the left (b = L − a < a) deflects most at
// x = √((L² − b²)/3), by P·b·(L² − b²)^(3/2)/(9√3·L·EI) (Gere & Goodno,
// Mechanics of Materials, table of beam deflections, from memory). Between
// supports and load the exact curve is cubic, so Hermite elements hold it
// exactly, inside the elements too.
func TestDeflectionExtremeAtZeroSlope(t *testing.T) {
	const a = 4.0
	b := testL - a
	m := testModel(Support{X: 0, Kind: Pinned}, Support{X: testL, Kind: Roller})
	m.PointLoads = []PointLoad{{X: a, Transverse: testP}}
	m.Mesh.Elements = 7
	s := mustSolve(t, m)
	wantX := math.Sqrt((testL*testL - b*b) / 3)
	wantW := testP * b * math.Pow(testL*testL-b*b, 1.5) / (9 * math.Sqrt(3) * testL * testE * testI)
	for _, e := range Summarize(s, nil).Extremes {
		if e.Quantity != QDeflection {
			continue
		}
		if math.Abs(e.XMin-wantX) > 1e-9 || relErr(e.Min, wantW) > 1e-9 {
			t.Errorf("largest deflection %.12g m at x = %.12g m, want %.12g m at %.12g m", e.Min, e.XMin, wantW, wantX)
		}
	}
}

// byQuantity indexes the extremes of a summary.
func byQuantity(sum Summary) map[Quantity]Extreme {
	out := map[Quantity]Extreme{}
	for _, e := range sum.Extremes {
		out[e.Quantity] = e
	}
	return out
}

// The headline values of a summary are the exact solution's, and on the
// default mesh every finite element extreme is within MeshAccuracy of them.
// Each row is a handbook beam; w is the magnitude of the downward uniform
// load, l a span. Sources (from memory): Gere & Goodno, Mechanics of
// Materials, Appendix D, and the AISC Steel Construction Manual, beam
// diagrams and formulas (simple beam, cantilever, propped cantilever and
// continuous beam of two equal spans under a uniform load).
func TestSummaryHeadlineOnTheDefaultMesh(t *testing.T) {
	const w, l, E, I = 10e3, 4.0, 200e9, 8e-6
	beam := func(L float64, supports ...Support) *Model {
		return &Model{
			Segments: []Segment{{Start: 0, End: L, Section: Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1},
				Material: Material{Elastic: E}}},
			Supports:        supports,
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, L, -w, -w)},
		}
	}
	type value struct {
		q         Quantity
		max       bool // the largest value, else the smallest
		want, x   float64
		checkTheX bool
	}
	cases := []struct {
		name      string
		model     *Model
		reactions []float64 // transverse, by support
		moments   []float64 // reaction moments, by support
		extremes  []value
		inside    [][2]float64 // V just left and right of each support inside
		insideM   []float64    // M there
	}{
		{"simple beam", beam(l, Support{X: 0, Kind: Pinned}, Support{X: l, Kind: Roller}),
			[]float64{w * l / 2, w * l / 2}, []float64{0, 0},
			[]value{{QBendingMoment, true, w * l * l / 8, l / 2, true}, {QDeflection, false, -5 * w * l * l * l * l / (384 * E * I), l / 2, true},
				{QShearForce, true, w * l / 2, 0, true}, {QShearForce, false, -w * l / 2, l, true}},
			nil, nil},
		{"cantilever", beam(l, Support{X: 0, Kind: Fixed}),
			[]float64{w * l}, []float64{w * l * l / 2},
			[]value{{QBendingMoment, false, -w * l * l / 2, 0, true}, {QDeflection, false, -w * l * l * l * l / (8 * E * I), l, true}},
			nil, nil},
		{"propped cantilever", beam(l, Support{X: 0, Kind: Fixed}, Support{X: l, Kind: Roller}),
			[]float64{5 * w * l / 8, 3 * w * l / 8}, []float64{w * l * l / 8, 0},
			[]value{{QBendingMoment, false, -w * l * l / 8, 0, true}, {QBendingMoment, true, 9 * w * l * l / 128, 5 * l / 8, true}},
			nil, nil},
		{"two equal spans", beam(2*l, Support{X: 0, Kind: Pinned}, Support{X: l, Kind: Roller}, Support{X: 2 * l, Kind: Roller}),
			[]float64{3 * w * l / 8, 10 * w * l / 8, 3 * w * l / 8}, []float64{0, 0, 0},
			[]value{{QBendingMoment, false, -w * l * l / 8, l, true}, {QBendingMoment, true, 9 * w * l * l / 128, 3 * l / 8, false}},
			[][2]float64{{-5 * w * l / 8, 5 * w * l / 8}}, []float64{-w * l * l / 8}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			s, e := solveBoth(t, c.model)
			if !s.Mesh.Automatic || s.Mesh.Note == "" {
				t.Fatalf("the model leaves the mesh to Stave, but the mesh says automatic %v, note %q", s.Mesh.Automatic, s.Mesh.Note)
			}
			sum := Summarize(s, e)
			if !sum.Exact || !sum.Mesh.Automatic || sum.Mesh.Note != s.Mesh.Note {
				t.Errorf("summary: exact %v, mesh %+v", sum.Exact, sum.Mesh)
			}
			scale := w * c.model.Length()
			for i, r := range sum.Reactions {
				if math.Abs(r.Transverse-c.reactions[i]) > 1e-9*scale || math.Abs(r.Moment-c.moments[i]) > 1e-9*scale*l {
					t.Errorf("support %d: exact reaction %g N, %g N·m; want %g, %g", r.Support, r.Transverse, r.Moment, c.reactions[i], c.moments[i])
				}
				if math.Abs(r.FE.Transverse-c.reactions[i]) > 1e-9*scale {
					t.Errorf("support %d: finite element reaction %g N, want %g", r.Support, r.FE.Transverse, c.reactions[i])
				}
				if r.Holds[Axial] != (r.Kind == "pinned" || r.Kind == "fixed") || !r.Holds[Transverse] || r.Holds[Rotation] != (r.Kind == "fixed") {
					t.Errorf("support %d (%s) holds %v", r.Support, r.Kind, r.Holds)
				}
			}
			ex := byQuantity(sum)
			for _, v := range c.extremes {
				x := ex[v.q]
				got, at, fe := x.Min, x.XMin, x.FEMin
				if v.max {
					got, at, fe = x.Max, x.XMax, x.FEMax
				}
				if relErr(got, v.want) > 1e-9 || v.checkTheX && math.Abs(at-v.x) > 1e-9*l {
					t.Errorf("%v: exact %g at %g, want %g at %g", v.q, got, at, v.want, v.x)
				}
				if relErr(fe, v.want) > MeshAccuracy {
					t.Errorf("%v: finite element %g, more than %g from %g", v.q, fe, MeshAccuracy, v.want)
				}
			}
			for _, x := range sum.Extremes {
				if x.Accuracy > MeshAccuracy {
					t.Errorf("%v: the default mesh's extremes are off by %.3g, above %g", x.Quantity, x.Accuracy, MeshAccuracy)
				}
			}
			if len(sum.Supports) != len(c.inside) {
				t.Fatalf("%d supports inside the member, want %d", len(sum.Supports), len(c.inside))
			}
			for i, a := range sum.Supports {
				for k := range 2 {
					if math.Abs(a.Shear[k]-c.inside[i][k]) > 1e-9*scale || math.Abs(a.FEShear[k]-c.inside[i][k]) > MeshAccuracy*scale {
						t.Errorf("support %d, side %d: V exact %g, FE %g; want %g", a.Support, k, a.Shear[k], a.FEShear[k], c.inside[i][k])
					}
					if math.Abs(a.Moment[k]-c.insideM[i]) > 1e-9*scale*l || math.Abs(a.FEMoment[k]-c.insideM[i]) > MeshAccuracy*math.Abs(c.insideM[i]) {
						t.Errorf("support %d, side %d: M exact %g, FE %g; want %g", a.Support, k, a.Moment[k], a.FEMoment[k], c.insideM[i])
					}
				}
			}
			if sum.Equilibrium.Relative > 1e-12 || sum.FEEquilibrium.Relative > 1e-12 {
				t.Errorf("equilibrium: exact %g, FE %g", sum.Equilibrium.Relative, sum.FEEquilibrium.Relative)
			}
		})
	}
}

// A simple beam on one element, set coarse on purpose: the headline values
// stay exact (M = wL²/8 = 20 kN·m at midspan, V = wL/2 = 20 kN at the ends;
// Gere & Goodno, Mechanics of Materials, Appendix D, from memory), the
// finite element ones beside them are the element's (its moment is the end
// moment wL²/12 = 13.33 kN·m of the consistent load, constant, so its shear
// is zero), and the accuracy says how far apart: for the moment 2/3, its
// smallest value (exact 0 at the supports, FE wL²/12) being further off
// than its largest (1/3), and all of it for the shear. The axial force is zero in both and reads 0, not a
// ratio of round-off.
func TestSummaryCoarseMesh(t *testing.T) {
	const w, L = 10e3, 4.0
	m := &Model{
		Segments: []Segment{{Start: 0, End: L, Section: Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: Material{Elastic: 200e9}}},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, L, -w, -w)},
		Mesh:            MeshSettings{Elements: 1},
	}
	s, e := solveBoth(t, m)
	sum := Summarize(s, e)
	if sum.Mesh.Automatic {
		t.Error("a mesh set in the model is reported as Stave's choice")
	}
	x := byQuantity(sum)
	moment, shear := x[QBendingMoment], x[QShearForce]
	if relErr(moment.Max, w*L*L/8) > 1e-12 || math.Abs(moment.XMax-L/2) > 1e-12 || relErr(moment.FEMax, w*L*L/12) > 1e-12 {
		t.Errorf("moment: exact %g at %g, FE %g; want %g at %g and %g", moment.Max, moment.XMax, moment.FEMax, w*L*L/8, L/2, w*L*L/12)
	}
	if math.Abs(moment.Min) > 1e-12*w*L*L || relErr(moment.FEMin, w*L*L/12) > 1e-12 || math.Abs(moment.Accuracy-2.0/3) > 1e-12 {
		t.Errorf("moment: smallest exact %g, FE %g, accuracy %g; want 0, %g and 2/3", moment.Min, moment.FEMin, moment.Accuracy, w*L*L/12)
	}
	if relErr(shear.Max, w*L/2) > 1e-12 || math.Abs(shear.Accuracy-1) > 1e-12 {
		t.Errorf("shear: exact %g, accuracy %g; want %g and 1", shear.Max, shear.Accuracy, w*L/2)
	}
	if a := x[QAxialForce].Accuracy; a != 0 {
		t.Errorf("axial force, zero in both solutions: accuracy %g, want 0", a)
	}
	if worst, ok := sum.Worst(); !ok || worst.Quantity != QShearForce {
		t.Errorf("worst extreme %v (%v), want the shear force", worst.Quantity, ok)
	}
}

// Values that are zero in closed form read zero, not their round-off: a
// cantilever fixed at x = 0 under a tip load P has M(x) = −P·(L − x), zero
// at the free end, and θ = −P·x·(2L − x)/(2EI), zero at the fixed end (Gere
// & Goodno, Mechanics of Materials, table of cantilever beams, from
// memory), so the largest moment and the largest rotation are 0 exactly,
// in the exact and the finite element columns alike; and two equal
// extremes (the shear is −P everywhere) are named at the first place.
func TestSummaryZeroesRoundOff(t *testing.T) {
	const L, P = 4.0, 10e3
	m := &Model{
		Segments: []Segment{{Start: 0, End: L,
			Section:  Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: Material{Elastic: 200e9}}},
		Supports:   []Support{{X: 0, Kind: Fixed}},
		PointLoads: []PointLoad{{X: L, Transverse: -P}},
		Mesh:       MeshSettings{Elements: 7},
	}
	sum := Summarize(solveBoth(t, m))
	for _, q := range []Quantity{QBendingMoment, QBendingStress, QRotation} {
		x := sum.Extremes[q]
		if x.Max != 0 || x.FEMax != 0 {
			t.Errorf("%s: largest %g (exact) and %g (FE), want 0 and 0", q, x.Max, x.FEMax)
		}
	}
	if v := sum.Extremes[QShearForce]; v.XMax != 0 || v.FEXMax != 0 || v.XMin != 0 || v.FEXMin != 0 {
		t.Errorf("constant shear: extremes at %g, %g (exact) and %g, %g (FE), want all at 0", v.XMin, v.XMax, v.FEXMin, v.FEXMax)
	}
}

// The shear force and moment at a support inside the member read zero
// where they are zero in closed form, as the extremes do, not their
// round-off: a beam on a uniform foundation, held along its axis at
// mid-length only, under two equal loads placed symmetrically, deflects
// symmetrically, so its shear force, antisymmetric, is zero at mid-length
// (symmetry of a symmetric structure under a symmetric load, from memory).
// The shipped ground beam gave 8.772e-14 kN and -4.390e-14 kN there, its
// exact values' round-off; the finite element shear beside, an element's
// constant, is a real error and stays.
func TestSupportActionsZeroRoundOff(t *testing.T) {
	for _, elements := range []int{600, 60} {
		m := &Model{
			Segments: []Segment{{Start: 0, End: 12,
				Section:  Section{Area: 0.48, SecondMoment: 0.0256, FibreDistance: 0.4},
				Material: Material{Elastic: 3e10}}},
			Supports:    []Support{{X: 6, Kind: AxialOnly}},
			Foundations: []Foundation{{Start: 0, End: 12, Modulus: 2.4e7}},
			PointLoads:  []PointLoad{{X: 1.5, Transverse: -600e3}, {X: 10.5, Transverse: -600e3}},
			Mesh:        MeshSettings{Elements: elements},
		}
		sum := Summarize(solveBoth(t, m))
		if len(sum.Supports) != 1 {
			t.Fatalf("%d elements: %d supports inside the member, want 1", elements, len(sum.Supports))
		}
		a := sum.Supports[0]
		if a.Shear != [2]float64{} {
			t.Errorf("%d elements: shear force %g N left and %g N right of mid-length, want 0 and 0", elements, a.Shear[0], a.Shear[1])
		}
		if a.FEShear[0] == 0 || a.FEShear[1] == 0 {
			t.Errorf("%d elements: finite element shear force %g N left and %g N right of mid-length, want the element's error", elements, a.FEShear[0], a.FEShear[1])
		}
	}
}

// Of equal peaks the first along the member is named, in both columns: a
// beam continuous over two equal spans L under a uniform load w sags most,
// M = 9wL²/128 at 3L/8 from an end support, in each span alike (AISC
// Manual, beam diagrams and formulas, continuous beam of two equal spans,
// from memory), and its deflection is zero at all three supports.
func TestSummaryNamesTheFirstOfEqualPeaks(t *testing.T) {
	const L, w = 4.0, 10e3
	m := &Model{
		Segments: []Segment{{Start: 0, End: 2 * L,
			Section:  Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: Material{Elastic: 200e9}}},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -w}, {2 * L, -w}}}},
		Mesh:            MeshSettings{Elements: 32},
	}
	sum := Summarize(solveBoth(t, m))
	mo := sum.Extremes[QBendingMoment]
	if want := 9 * w * L * L / 128; math.Abs(mo.Max-want) > 1e-9*want || math.Abs(mo.XMax-3*L/8) > 1e-9*L {
		t.Errorf("exact largest moment %g at %g m, want %g at %g m", mo.Max, mo.XMax, want, 3*L/8)
	}
	if mo.FEXMax > L {
		t.Errorf("finite element largest moment named at %g m, in the second span; the first span's peak is equal", mo.FEXMax)
	}
	if d := sum.Extremes[QDeflection]; d.Max != 0 || d.XMax != 0 || d.FEMax != 0 || d.FEXMax != 0 {
		t.Errorf("largest deflection %g at %g m (exact), %g at %g m (FE), want 0 at the first support", d.Max, d.XMax, d.FEMax, d.FEXMax)
	}
}

// Within one stretch of the exact solution the first place wins a tie too:
// a beam fixed at both ends under a uniform load w has M = −wL²/12 at both
// ends and zero deflection there (AISC Manual, beam diagrams and formulas,
// beam fixed at both ends, from memory); the exact solution is one stretch,
// whose two ends differ by round-off, and its extremes are named at x = 0,
// as the finite element ones are.
func TestSummaryNamesTheFirstEndOfOneStretch(t *testing.T) {
	const L, w = 6.0, 10e3
	m := &Model{
		Segments: []Segment{{Start: 0, End: L,
			Section:  Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.2},
			Material: Material{Elastic: 200e9}}},
		Supports:        []Support{{X: 0, Kind: Fixed}, {X: L, Kind: Fixed}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -w}, {L, -w}}}},
	}
	sum := Summarize(solveBoth(t, m))
	mo := sum.Extremes[QBendingMoment]
	if want := -w * L * L / 12; math.Abs(mo.Min-want) > 1e-9*w*L*L || mo.XMin != 0 || mo.FEXMin != 0 {
		t.Errorf("smallest moment %g at %g m (exact), FE at %g m; want %g at 0 in both", mo.Min, mo.XMin, mo.FEXMin, want)
	}
	if d := sum.Extremes[QDeflection]; d.Max != 0 || d.XMax != 0 || d.FEXMax != 0 {
		t.Errorf("largest deflection %g at %g m (exact), FE at %g m; want 0 at x = 0 in both", d.Max, d.XMax, d.FEXMax)
	}
	if c := sum.Extremes[QCombinedStress]; c.XMax != 0 || c.XMin != 0 {
		t.Errorf("combined stress extremes at %g and %g m (exact); want both at x = 0, where the end moment puts ±wL²c/(12I)", c.XMin, c.XMax)
	}
}

// The combined stress's extremes are over both extreme fibres, σa + |σb|
// and σa − |σb|: the largest tension and the largest compression anywhere
// in the member, whichever fibre is the larger in magnitude. A cantilever
// fixed at x = 0 with a point load at its tip, axial Pa and transverse Pt
// down, carries N = Pa and M(0) = Pt·L at its root (statics); its fibres
// there are N/A ± |M|·c/I (combined axial and bending stress, Gere &
// Goodno, Mechanics of Materials, from memory). Under compression the
// root's tension fibre (+475 MPa) is the smaller in magnitude, and under
// tension its compression fibre: the extremes must show it all the same,
// from the finite element and from the exact solution.
func TestCombinedStressExtremesTakeBothFibres(t *testing.T) {
	const L, A, I, c, E, Pt = 4.0, 0.004, 8e-6, 0.1, 2e11, -10e3
	for _, Pa := range []float64{-100e3, 100e3} {
		m := &Model{
			Segments: []Segment{{Start: 0, End: L,
				Section: Section{Area: A, SecondMoment: I, FibreDistance: c}, Material: Material{Elastic: E}}},
			Supports:   []Support{{X: 0, Kind: Fixed}},
			PointLoads: []PointLoad{{X: L, Axial: Pa, Transverse: Pt}},
			Mesh:       MeshSettings{Elements: 4},
		}
		s, e := solveBoth(t, m)
		axial, bending := Pa/A, math.Abs(Pt*L)*c/I
		wantMax, wantMin := axial+bending, axial-bending
		got := byQuantity(Summarize(s, e))[QCombinedStress]
		for _, v := range []struct {
			what      string
			value, at float64
			want      float64
		}{
			{"largest", got.Max, got.XMax, wantMax}, {"smallest", got.Min, got.XMin, wantMin},
			{"FE largest", got.FEMax, got.FEXMax, wantMax}, {"FE smallest", got.FEMin, got.FEXMin, wantMin},
		} {
			if relErr(v.value, v.want) > 1e-9 || v.at != 0 {
				t.Errorf("axial %g N: %s combined stress %.6g Pa at x = %g m, want %.6g Pa at the root",
					Pa, v.what, v.value, v.at, v.want)
			}
		}
	}
}

// The same where the exact solution is read in closed form (a member on an
// elastic foundation) and the stresses vary along the member: the
// extremes of both fibres are those of σa ± σb sampled densely, and no
// sample lies beyond them (the definition of the extremes).
func TestCombinedStressExtremesOnAFoundationTakeBothFibres(t *testing.T) {
	const L = 8.0
	m := testModel(Support{X: 0, Kind: Pinned})
	m.Segments = []Segment{testSegment(0, L)}
	m.Foundations = []Foundation{{Start: 0, End: L, Modulus: 5e6, AxialModulus: 2e6}}
	// Axial compression large enough that the tension fibre is never the
	// larger in magnitude, and a transverse load to bend the member both ways.
	m.PointLoads = []PointLoad{{X: L, Axial: -200e3}, {X: 3, Transverse: -200e3}}
	m.Mesh.Elements = 32
	s, e := solveBoth(t, m)
	got := byQuantity(Summarize(s, e))[QCombinedStress]
	hi, lo := math.Inf(-1), math.Inf(1)
	const n = 4000
	for i := 0; i <= n; i++ {
		for _, side := range []Side{Left, Right} {
			f := e.At(L*float64(i)/n, side)
			hi = max(hi, f.AxialStress+math.Abs(f.BendingStress))
			lo = min(lo, f.AxialStress-math.Abs(f.BendingStress))
		}
	}
	if hi <= 0 {
		t.Fatalf("the model has no tension fibre (largest %g Pa): it tests nothing", hi)
	}
	scale := max(math.Abs(hi), math.Abs(lo))
	if math.Abs(got.Max-hi) > 1e-6*scale || math.Abs(got.Min-lo) > 1e-6*scale {
		t.Errorf("combined stress extremes %.6g and %.6g Pa, want those of both fibres sampled, %.6g and %.6g Pa",
			got.Max, got.Min, hi, lo)
	}
}

// A field that is stationary at an end of a stretch has its extreme there,
// named at the end exactly: the root of its derivative lies there too, and
// round-off may put it an ulp inside with a value an ulp beyond the end's.
// A beam continuous over two spans L with only the second loaded by w has
// M = −wL²/16 over the middle support (three-moment equation) and turns most
// at its far end, by wL³/24EI − (wL²/16)·L/6EI = wL³/(32EI) (beam tables,
// from memory), where M = 0; the exact extreme was named at
// x = 7.999999999999999 m for L = 4 m, the finite element one at 8 m.
func TestSummaryNamesAStationaryEndAtTheEnd(t *testing.T) {
	const L, w, E, I = 4.0, 10e3, 200e9, 1.6e-5
	m := twoEqualSpans(L, E, I)
	m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{L, -w}, {2 * L, -w}}}}
	for _, n := range []int{0, 7, 64} {
		m.Mesh.Elements = n
		r := Summarize(solveBoth(t, m)).Extremes[QRotation]
		if want := w * L * L * L / (32 * E * I); math.Abs(r.Max-want) > 1e-9*want || r.XMax != 2*L || r.FEXMax != 2*L {
			t.Errorf("%d elements: largest rotation %.12g at x = %.17g m (exact), FE at %.17g m; want %.12g at %g m in both", n, r.Max, r.XMax, r.FEXMax, want, 2*L)
		}
	}
}

// A small deflection beside a large axial force is a result, not round-off:
// a simply supported strut (pinned at 0, roller at L) under an axial
// compression P at its roller end and a small load Q across it at midspan
// deflects, in linear theory, by Q·L³/(48·EI) at midspan and turns by
// Q·L²/(16·EI) at its ends (Gere & Goodno, Mechanics of Materials, simple
// beam with a central point load; the axial force does not bend a straight
// member in linear theory). The axial force stretches the member by P·L/EA;
// it bends it by nothing, so it must not set the size a deflection is
// zeroed against (P·L³/EI, 40 m here, zeroed every deflection below 40 nm).
func TestSummaryKeepsASmallDeflectionBesideALargeAxialForce(t *testing.T) {
	const L, E, I, P, Q = 4.0, 200e9, 8e-6, 1e6, 0.01
	m := &Model{
		Segments: []Segment{{Start: 0, End: L,
			Section:  Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1},
			Material: Material{Elastic: E}}},
		Supports:   []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		PointLoads: []PointLoad{{X: L, Axial: -P}, {X: L / 2, Transverse: -Q}},
		Mesh:       MeshSettings{Elements: 8},
	}
	sum := Summarize(solveBoth(t, m))
	for _, c := range []struct {
		q    Quantity
		want float64 // the extreme of larger magnitude
	}{
		{QDeflection, -Q * L * L * L / (48 * E * I)},
		{QRotation, Q * L * L / (16 * E * I)},
	} {
		x := sum.Extremes[c.q]
		got := x.Min
		if c.want > 0 {
			got = x.Max
		}
		if math.Abs(got-c.want) > 1e-9*math.Abs(c.want) {
			t.Errorf("%s: extreme %g, want %g", c.q, got, c.want)
		}
	}
}

// twoEqualSpans is a beam of modulus E and second moment I continuous
// over two spans L (pinned at 0, rollers at L and 2L), unloaded.
func twoEqualSpans(L, E, I float64) *Model {
	return &Model{
		Segments: []Segment{{Start: 0, End: 2 * L,
			Section:  Section{Area: 0.004, SecondMoment: I, FibreDistance: 0.1},
			Material: Material{Elastic: E}}},
		Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}, {X: 2 * L, Kind: Roller}},
	}
}

// A member's stretch is its own problem (linear theory): a simply
// supported beam of 4 m under 10 kN/m, pulled by P at its roller,
// stretches by δ = P·L/(E·A) (Gere & Goodno, Mechanics of Materials,
// ch. 2, from memory) however small P is beside the bending. A pull of
// 1 mN gives 4e-12 m beside a deflection of about 5 mm; the summary read
// it as round-off of the displacements and showed 0. With no force along
// the member the stretch is nothing and stays 0.
func TestSmallStretchBesideBending(t *testing.T) {
	const L = 4.0
	for _, c := range []struct {
		pull float64 // N
		want float64 // m
	}{
		{1e3, 1e3 * L / (testE * testA)},
		{1e-3, 1e-3 * L / (testE * testA)},
		{0, 0},
	} {
		m := withUniform(&Model{
			Segments: []Segment{testSegment(0, L)},
			Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
		}, -10e3)
		if c.pull != 0 {
			m.PointLoads = []PointLoad{{X: L, Axial: c.pull}}
		}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		for _, x := range Summarize(s, e).Extremes {
			if x.Quantity != QAxialDisplacement {
				continue
			}
			if math.Abs(x.Max-c.want) > 1e-9*c.want || math.Abs(x.FEMax-c.want) > 1e-9*c.want || x.Min != 0 {
				t.Errorf("pull %g N: stretch %g m (FE %g), least %g; want %g m and 0", c.pull, x.Max, x.FEMax, x.Min, c.want)
			}
		}
	}
}

// TestSummaryNamesTheElements: the mesh line names the elements a member is
// solved with, not the bar's order alone, which read as "bar elements" on a
// beam. The names are the element formulations' own (Formulation.Name).
func TestSummaryNamesTheElements(t *testing.T) {
	const L = 4.0
	member := func(edit func(*Model)) *Model {
		m := &Model{
			Segments: []Segment{{Start: 0, End: L,
				Section:  Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1},
				Material: Material{Elastic: 200e9}}},
			Supports:        []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -5e3}, {L, -5e3}}}},
			Mesh:            MeshSettings{Elements: 4},
		}
		edit(m)
		return m
	}
	for _, tc := range []struct {
		name string
		edit func(*Model)
		want string
	}{
		{"beam", func(*Model) {}, "linear bar and Hermite beam elements"},
		{"quadratic bar, shear deformation", func(m *Model) {
			m.Mesh.BarOrder = QuadraticBar
			m.Segments[0].Section.ShearCoefficient = 5.0 / 6
			m.Segments[0].Material.Poisson = 0.3
			m.Segments[0].ShearDeformation = true
		}, "quadratic bar and Timoshenko beam elements"},
		{"tie", func(m *Model) {
			m.AxialOnly = true
			m.Supports = []Support{{X: 0, Kind: Pinned}}
			m.DistributedLoad = []DistributedLoad{{Direction: Axial, Points: []LoadPoint{{0, -5e3}, {L, -5e3}}}}
		}, "linear bar elements"},
	} {
		s, err := Solve(member(tc.edit))
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if got := Summarize(s, nil).Mesh.Kinds; got != tc.want {
			t.Errorf("%s: the mesh's elements are %q, want %q", tc.name, got, tc.want)
		}
	}
}

// A stress is measured against the section it acts on: an unloaded
// overhang of an absurdly weak section (I = 8e-20 m⁴ beside the span's
// 8e-6 m⁴) set the round-off scale of every stress in the member, and the
// span's 250 MPa read 0 in the extremes and the stress error 0 %. A simply
// supported 4 m span under q = 10 kN/m has M = qL²/8 = 20 kN·m at midspan
// (Gere & Goodno, Mechanics of Materials, Appendix D, from memory), so
// σ = M·c/I = 20e3 · 0.1 / 8e-6 = 250 MPa in tension and compression
// (flexure formula, same book); the overhang carries nothing (statics).
func TestSummaryStressAgainstItsOwnSection(t *testing.T) {
	section := func(I float64) Section { return Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1} }
	steel := Material{Elastic: 200e9}
	m := &Model{
		Segments: []Segment{{Start: 0, End: 4, Section: section(8e-6), Material: steel},
			{Start: 4, End: 5, Section: section(8e-20), Material: steel}},
		Supports:        []Support{{X: 0, Kind: Pinned}, {X: 4, Kind: Roller}},
		DistributedLoad: []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -10e3}, {4, -10e3}}}},
		Mesh:            MeshSettings{Elements: 8},
	}
	sum := Summarize(solveBoth(t, m))
	const sigma = 250e6
	for _, q := range []Quantity{QBendingStress, QCombinedStress} {
		x := sum.Extremes[q]
		if !relNear(x.Max, sigma, 1e-9) || !relNear(x.FEMax, sigma, 0.02) {
			t.Errorf("%s: largest %g (exact) and %g (FE), want %g", q, x.Max, x.FEMax, sigma)
		}
		want := max(math.Abs(x.FEMax-x.Max), math.Abs(x.FEMin-x.Min)) / max(math.Abs(x.Max), math.Abs(x.Min))
		if want == 0 || !relNear(x.Accuracy, want, 1e-9) {
			t.Errorf("%s: accuracy %g, want %g, the larger error of the extremes over the largest stress", q, x.Accuracy, want)
		}
	}
	if x := sum.Extremes[QCombinedStress]; !relNear(x.Min, -sigma, 1e-9) {
		t.Errorf("combined stress: smallest %g (exact), want %g", x.Min, -sigma)
	}
	n := sum.ExactError
	if want := n.MaxStress / sigma; n.MaxStress == 0 || !relNear(n.MaxStressRelative, want, 1e-9) {
		t.Errorf("stress error %g Pa, relative %g, want %g of the largest exact stress", n.MaxStress, n.MaxStressRelative, want)
	}
}

// relNear says whether got is within a share tol of want.
func relNear(got, want, tol float64) bool { return math.Abs(got-want) <= tol*math.Abs(want) }

// A displacement is measured against the deformations the member really
// has, not against what its loads would do to its weakest section: an
// unloaded overhang of I = 8e-20 m⁴ beside a span of 8e-6 m⁴ made every
// displacement round-off, and the span's deflection, the overhang's
// rise and every rotation read 0, the displacement error 0 %. A simply
// supported span L = 4 m under q = 10 kN/m (E = 200 GPa, I = 8e-6 m⁴)
// sags 5qL⁴/(384EI) = 20.83 mm at midspan and turns qL³/(24EI) =
// 0.01667 rad at its ends (AISC Manual, Beam Diagrams and Formulas,
// simple beam – uniformly distributed load; Gere & Goodno, Mechanics of
// Materials, Appendix D); the unloaded overhang carries no moment
// (statics) and turns with the span's end, its tip a = 1 m beyond it
// rising by the end slope times a. With a tip load P = 100 N on an
// overhang of I = 8e-10 m⁴ that does bend, the tip drops
// Pa²L/(3EI) + Pa³/(3EI₀) (the span's end turning under the moment Pa,
// and the overhang as a cantilever; AISC, beam overhanging one support –
// concentrated load at end of overhang, with the overhang's own bending
// taken at its own I by superposition, from memory) and the span rises by
// at most PaL²/(9√3·EI) at x = L/√3 (same AISC case). Beside the weak
// unloaded overhang the other causes of displacement read too: the span
// is statically determinate, so a settlement δ of its roller, or a
// turn θ₀ of a fixed end, moves it and the overhang as a rigid body
// (statics), and a spring of stiffness k under the roller gives by its
// reaction qL/2 over k, the span turning by that over L on top of its own
// bending; a temperature difference ΔT through the depth h bends the
// heated span freely into κ = α·ΔT/h (docs/format.md; Timoshenko & Goodier,
// Theory of Elasticity, thermal stress in beams, from memory), w = κ·x·(x −
// L)/2: −κL²/8 at midspan, turning ∓κL/2 at its ends.
func TestSummaryDisplacementsBesideAWeakOverhang(t *testing.T) {
	const (
		E, Is, L, a = 200e9, 8e-6, 4.0, 1.0
		q           = 10e3
		P, Io       = 100.0, 8e-10
		delta, k    = 0.01, 75e3   // settlement (m), spring (N/m)
		theta       = 0.001        // turn of a fixed end, rad
		alpha, dT   = 1.2e-5, 20.0 // 1/K, K
	)
	section := func(I float64) Section { return Section{Area: 4e-3, SecondMoment: I, FibreDistance: 0.1} }
	steel := Material{Elastic: E}
	slope := q * L * L * L / (24 * E * Is)
	uniform := func(m *Model) {
		m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -q}, {L, -q}}}}
	}
	give := q * L / 2 / k
	kappa := alpha * dT / 0.2 // h = 2c
	for _, c := range []struct {
		name     string
		overhang float64 // I of the overhang, m⁴
		model    func(m *Model)
		// want are the exact extremes of deflection (m) and rotation (rad):
		// largest, where, smallest, where.
		deflection, rotation [4]float64
		// cubic says w is cubic between the nodes, which Hermite elements
		// reproduce exactly (from memory): the displacement error is then
		// round-off.
		cubic bool
	}{
		{"uniform load on the span, weak unloaded overhang", 8e-20, uniform,
			[4]float64{slope * a, L + a, -5 * q * L * L * L * L / (384 * E * Is), L / 2},
			[4]float64{slope, L, -slope, 0}, false},
		{"tip load on a weak overhang", Io,
			func(m *Model) { m.PointLoads = []PointLoad{{X: L + a, Transverse: -P}} },
			[4]float64{P * a * L * L / (9 * math.Sqrt(3) * E * Is), L / math.Sqrt(3),
				-(P*a*a*L/(3*E*Is) + P*a*a*a/(3*E*Io)), L + a},
			// The rotation: P·a·L/(6EI) at x = 0 (end moment Pa, beam tables,
			// from memory); at the tip −(P·a·L/(3EI) + P·a²/(2EI₀)).
			[4]float64{P * a * L / (6 * E * Is), 0, -(P*a*L/(3*E*Is) + P*a*a/(2*E*Io)), L + a}, true},
		// A rotation constant along the member is named at its start.
		{"settlement of the roller", 8e-20,
			func(m *Model) { m.Supports[1].Settlement = [3]float64{0, -delta, 0} },
			[4]float64{0, 0, -delta * (L + a) / L, L + a}, [4]float64{-delta / L, 0, -delta / L, 0}, true},
		{"turn of a fixed end", 8e-20,
			func(m *Model) { m.Supports = []Support{{X: 0, Kind: Fixed, Settlement: [3]float64{0, 0, theta}}} },
			[4]float64{theta * (L + a), L + a, 0, 0}, [4]float64{theta, 0, theta, 0}, true},
		{"uniform load on the span over a spring", 8e-20,
			func(m *Model) {
				m.Supports[1] = Support{X: L, Kind: Spring, Stiffness: [3]float64{0, k, 0}}
				uniform(m)
			},
			[4]float64{0, 0, -give*(L+a)/L + slope*a, L + a}, [4]float64{-give/L + slope, L, -give/L - slope, 0}, false},
		{"temperature difference through the span", 8e-20,
			func(m *Model) {
				m.Segments[0].Material.ThermalExpansion, m.Segments[0].TemperatureDifference = alpha, dT
			},
			[4]float64{kappa * L / 2 * a, L + a, -kappa * L * L / 8, L / 2}, [4]float64{kappa * L / 2, L, -kappa * L / 2, 0}, true},
	} {
		m := &Model{
			Segments: []Segment{{Start: 0, End: L, Section: section(Is), Material: steel},
				{Start: L, End: L + a, Section: section(c.overhang), Material: steel}},
			Supports: []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			Mesh:     MeshSettings{Elements: 8},
		}
		c.model(m)
		s, e := solveBoth(t, m)
		sum := Summarize(s, e)
		for k, want := range map[Quantity][4]float64{QDeflection: c.deflection, QRotation: c.rotation} {
			x := sum.Extremes[k]
			got := [4]float64{x.Max, x.XMax, x.Min, x.XMin}
			for i := 0; i < 4; i += 2 {
				if !relNear(got[i], want[i], 1e-6) || math.Abs(got[i+1]-want[i+1]) > 1e-6 {
					t.Errorf("%s: %s extreme %g at x = %g, want %g at x = %g", c.name, k, got[i], got[i+1], want[i], want[i+1])
				}
			}
		}
		// The displacement error: the root mean square of w_h − w over that
		// of w (its definition, ErrorNorms.RelativeL2), integrated here by
		// Simpson's rule on a fine grid.
		var errSq, wSq float64
		const n = 4000
		for i := 0; i <= n; i++ {
			x := (L + a) * float64(i) / n
			wt := 2.0 + 2*float64(i%2)
			if i == 0 || i == n {
				wt = 1
			}
			wh, w := s.At(x, Left).Deflection, e.At(x, Left).Deflection
			errSq += wt * (wh - w) * (wh - w)
			wSq += wt * w * w
		}
		want := math.Sqrt(errSq / wSq)
		if got := sum.ExactError.RelativeL2; c.cubic && got > 1e-12 || !c.cubic && !relNear(got, want, 1e-3) {
			t.Errorf("%s: displacement error %g, want %g (‖w_h − w‖/‖w‖; round-off where w is cubic)", c.name, got, want)
		}
	}
}

// Displacements that are zero in closed form still read zero beside a weak
// unloaded overhang (I = 8e-20 m⁴), in the exact and the finite element
// columns alike, now that round-off is judged against the deformations the
// member has: the fixed end of a cantilever under q = 10 kN/m neither
// moves nor turns, while its tip (L = 4 m) drops qL⁴/(8EI) and turns
// qL³/(6EI) (Gere & Goodno, Mechanics of Materials, Appendix D,
// cantilever under a uniform load, from memory), the unloaded extension
// a = 1 m beyond it dropping a further qL³/(6EI)·a (statics: it carries
// nothing); a pull P along the member bends nothing (linear theory) and
// stretches it P·(L + a)/(EA) at its free end (Gere & Goodno, axially
// loaded members), as far as a pull P at x = L stretches it, P·L/(EA),
// however thin the unloaded overhang beyond (A = 4e-20 m²); a force on a
// pinned support goes straight into it (statics), and the member does not
// move at all.
func TestSummaryDisplacementRoundOffBesideAWeakOverhang(t *testing.T) {
	const E, I, A, L, a, q, P = 200e9, 8e-6, 4e-3, 4.0, 1.0, 10e3, 50e3
	section := func(I float64) Section { return Section{Area: A, SecondMoment: I, FibreDistance: 0.1} }
	tip := q * L * L * L / (6 * E * I)
	for _, c := range []struct {
		name     string
		area     float64 // the overhang's, m²
		supports []Support
		loads    func(m *Model)
		// want are the exact extremes, largest and smallest, with where
		// they are, of the quantities listed; every other displacement
		// extreme is 0 in both columns.
		want map[Quantity][4]float64
	}{
		{"cantilever under a uniform load", A, []Support{{X: 0, Kind: Fixed}},
			func(m *Model) {
				m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -q}, {L, -q}}}}
			},
			map[Quantity][4]float64{QDeflection: {0, 0, -(q*L*L*L*L/(8*E*I) + tip*a), L + a}, QRotation: {0, 0, -tip, L}}},
		{"pull along the member", A, []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			func(m *Model) { m.PointLoads = []PointLoad{{X: L + a, Axial: P}} },
			map[Quantity][4]float64{QAxialDisplacement: {P * (L + a) / (E * A), L + a, 0, 0}}},
		{"pull beside a thin unloaded overhang", 4e-20, []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			func(m *Model) { m.PointLoads = []PointLoad{{X: L, Axial: P}} },
			map[Quantity][4]float64{QAxialDisplacement: {P * L / (E * A), L, 0, 0}}},
		{"force on a support", A, []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
			func(m *Model) { m.PointLoads = []PointLoad{{X: 0, Transverse: -P}} },
			nil},
	} {
		m := &Model{
			Segments: []Segment{{Start: 0, End: L, Section: section(I), Material: Material{Elastic: E}},
				{Start: L, End: L + a, Section: Section{Area: c.area, SecondMoment: 8e-20, FibreDistance: 0.1}, Material: Material{Elastic: E}}},
			Supports: c.supports,
			Mesh:     MeshSettings{Elements: 8},
		}
		c.loads(m)
		sum := Summarize(solveBoth(t, m))
		for _, k := range []Quantity{QAxialDisplacement, QDeflection, QRotation} {
			x := sum.Extremes[k]
			want, ok := c.want[k]
			switch {
			case !ok && (x.Max != 0 || x.Min != 0 || x.FEMax != 0 || x.FEMin != 0):
				t.Errorf("%s: %s extremes %g, %g (exact) and %g, %g (FE), want all 0", c.name, k, x.Max, x.Min, x.FEMax, x.FEMin)
			case ok:
				got := [4]float64{x.Max, x.XMax, x.Min, x.XMin}
				fe := [2]float64{x.FEMax, x.FEMin}
				for i := 0; i < 4; i += 2 {
					if want[i] == 0 && (got[i] != 0 || fe[i/2] != 0) {
						t.Errorf("%s: %s extreme %g (exact), %g (FE), want 0 and 0", c.name, k, got[i], fe[i/2])
					}
					if !relNear(got[i], want[i], 1e-6) || math.Abs(got[i+1]-want[i+1]) > 1e-6 {
						t.Errorf("%s: %s extreme %g at x = %g, want %g at x = %g", c.name, k, got[i], got[i+1], want[i], want[i+1])
					}
				}
			}
		}
	}
}

// A coefficient of thermal expansion with no temperature load does nothing,
// however large: a finite α of 1e308 where no temperature change or
// difference acts leaves the summary's imposed scales and its error
// measures those of the same member without α, not NaN (E·A·α or E·I·α
// overflowed before they were multiplied by a ΔT of 0), also beside a
// segment warmer on one face.
func TestHugeExpansionWithoutTemperatureDoesNothing(t *testing.T) {
	measure := func(alpha float64, warmFirst bool) (*ErrorNorms, [2]float64) {
		m := validModel()
		for i := range m.Segments {
			m.Segments[i].Material.ThermalExpansion = alpha
		}
		if warmFirst { // the first segment warmer on one face, with a usual α
			m.Segments[0].Material.ThermalExpansion, m.Segments[0].TemperatureDifference = 12e-6, 20
		}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		force, moment := m.ImposedScales()
		return Summarize(s, e).ExactError, [2]float64{force, moment}
	}
	for _, warm := range []bool{false, true} {
		plain, plainScales := measure(0, warm)
		huge, scales := measure(1e308, warm)
		if scales != plainScales {
			t.Errorf("first segment warmed %v: imposed scales %v with α = 1e308 where no temperature acts, want %v", warm, scales, plainScales)
		}
		if plain == nil || huge == nil || *huge != *plain {
			t.Errorf("first segment warmed %v: error measures with α = 1e308 where no temperature acts: %+v; want those without α: %+v", warm, huge, plain)
		}
	}
}
