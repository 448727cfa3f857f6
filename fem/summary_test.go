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
