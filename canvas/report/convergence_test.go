package report

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/study"
	"stave/fem/units"
)

// The theory line of the convergence text must cover what a model with
// shear deformation shows: the interdependent interpolation element is
// exact at the nodes, but inside an element of length h under a line load
// q it misses the shear part of the deflection of a beam clamped at both
// ends, q·h²/(8·κGA) at its middle (Timoshenko & Gere, fixed-ended beam
// with shear deformation: w = qL⁴/(384EI) + qL²/(8κGA)), so its
// displacement error falls as h², not h⁴. Its shear force is constant in
// an element, off by up to q·h/2 from the exact one (slope q), so the shear
// strain energy of the difference, ∫(V_h − V)²/(κGA) = q²h²L/(12κGA) over
// the member, makes the energy error fall as h, not h² (derived from the
// element's constant shear; Timoshenko & Gere for the strain energy
// ∫V²/(κGA), from memory). A simply supported shear-flexible beam under a
// uniform load measures the rates the text gives.
func TestConvergenceTheoryOfShearDeformation(t *testing.T) {
	m := fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 3, ShearDeformation: true,
			Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.15, ShearArea: 0.006},
			Material: fem.Material{Elastic: 2e11, ShearModulus: 8e10}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 3, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -40e3}, {X: 3, Intensity: -40e3}}}},
	}
	table, err := study.Convergence(context.Background(), &m, 64, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(table.L2.Last-2) > 0.1 {
		t.Errorf("displacement rate of the last step %.3f, want 2 (the shear part of the deflection)", table.L2.Last)
	}
	if math.Abs(table.Energy.Last-1) > 0.1 {
		t.Errorf("energy rate of the last step %.3f, want 1 (the shear strain energy)", table.Energy.Last)
	}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "shear-flexible beam", table, nil, nil, nil)
	if !strings.Contains(buf.String(), "beams with shear deformation 2 and 1") {
		t.Errorf("the theory line gives no rate for beams with shear deformation:\n%s", buf.String())
	}
	// The fit starts from the one-element mesh: it said "1 elements".
	if !strings.Contains(buf.String(), "fitted from 1 element on") {
		t.Errorf("the rates do not say the fit starts from 1 element:\n%s", buf.String())
	}
}

// The energy error is the square root of the strain energy of the
// difference over the square root of the strain energy (fem.ErrorNorms,
// docs/json.md): the ratio of the energy norms (the energy norm is the
// square root of twice the strain energy; Strang & Fix, ch. 1, from
// memory), and the solve text must say so: it named the strain
// energies themselves. One Hermite element on a simply supported beam under
// a uniform load q: the nodal rotations are exact, so the element's moment
// is the constant qL²/12 against the exact qx(L − x)/2 (Gere & Goodno,
// simple beam, uniform load), whose strain energy ∫M²/(2EI) is q²L⁵/(240EI)
// while the difference's is q²L⁵/(1440EI): a ratio of 1/6 (integrated by
// hand), printed as its square root, 40.8 %, not as 16.7 %.
func TestEnergyErrorIsNamedAsTheSquareRoot(t *testing.T) {
	m := simpleSpanUniform()
	m.Mesh = fem.MeshSettings{Elements: 1}
	s, err := fem.Solve(&m)
	if err != nil {
		t.Fatal(err)
	}
	e, err := fem.SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	WriteErrorText(&buf, fem.Compare(s, e), units.SI)
	var line string
	for _, l := range strings.Split(buf.String(), "\n") {
		if strings.Contains(l, fem.EnergyErrorName) {
			line = l
		}
	}
	want := fmt.Sprintf("%.3g %%", 100*math.Sqrt(1.0/6))
	if !strings.HasSuffix(line, want) || !strings.Contains(line, "(energy norm of the difference), as a share of the energy norm") {
		t.Errorf("the energy error line %q: want %s named as the energy norm of the difference over the energy norm (the square roots of the strain energies)", line, want)
	}
}

// A quadratic bar under a uniform axial load q has the exact displacement
// u = q(Lx − x²/2)/EA (Gere & Goodno, bar under a uniform axial load), a
// quadratic the element holds, so the finite element answer is the exact
// one on every mesh (the Galerkin answer is the best in the energy norm,
// Strang & Fix, ch. 1, from memory). The text said "as with point loads
// only", which this model has none of: it must name the case it is.
func TestConvergenceExactSaysWhichLoadsTheElementsReproduce(t *testing.T) {
	m := barUnderUniformAxialLoad()
	m.Mesh = fem.MeshSettings{BarOrder: fem.QuadraticBar}
	table, err := study.Convergence(context.Background(), &m, 8, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if !table.Exact {
		t.Fatalf("a quadratic bar under a uniform axial load is not reported exact: %+v", table.Rows)
	}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "quadratic bar", table, nil, nil, nil)
	text := buf.String()
	if strings.Contains(text, "point loads only") || !strings.Contains(text, "a uniform axial load on quadratic bars") {
		t.Errorf("the text does not say which loads the elements reproduce:\n%s", text)
	}
}

// A study of one mesh fits no rate (docs/json.md: `fitted` and
// `fitted_from_row` are null where there is none), nor does one whose
// errors are all round-off: the document said the fit started from row 0.
func TestConvergenceJSONFitsNoRowWithoutAFit(t *testing.T) {
	uniform, point := simpleSpanUniform(), simpleSpanUniform()
	point.DistributedLoad = nil
	point.PointLoads = []fem.PointLoad{{X: 1.3, Transverse: -10e3}}
	for _, c := range []struct {
		name string
		m    fem.Model
		max  int
		fit  bool
	}{{"one mesh", uniform, 1, false}, {"point load, exact", point, 4, false}, {"uniform load", uniform, 4, true}} {
		table, err := study.Convergence(context.Background(), &c.m, c.max, units.Base)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		var buf bytes.Buffer
		if err := WriteConvergenceJSON(&buf, "member.json", table, nil, nil, nil); err != nil {
			t.Fatal(err)
		}
		var got struct {
			Rates map[string]struct {
				Fitted  *float64 `json:"fitted"`
				FromRow *int     `json:"fitted_from_row"`
			} `json:"rates"`
		}
		if err := json.Unmarshal(buf.Bytes(), &got); err != nil {
			t.Fatal(err)
		}
		for name, r := range got.Rates {
			if (r.Fitted != nil) != c.fit || (r.FromRow != nil) != c.fit {
				t.Errorf("%s, %s: fitted %v from row %v; want both given: %v", c.name, name, r.Fitted, r.FromRow, c.fit)
			}
		}
	}
}

// The table's first measure is the largest stress error, and the theory
// lines must give its rate beside the others: the stress comes from N and
// M, whose errors fall as the energy error does, h^p for elements of
// degree p in the strain (Strang & Fix, ch. 1 and 3, from memory): 1 for
// linear bars (a constant N against a linear one, off by up to q·h/2), 2
// for Hermite beams (a linear M against a quadratic one, off by q·h²/12 at
// the nodes under a uniform load q, by hand from the nodally exact
// rotations). A study of one mesh has no rate, and says why.
func TestConvergenceTextGivesTheStressRate(t *testing.T) {
	base := fem.Model{Segments: fourMetreMember()}
	bar, beam := base, base
	bar.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}}
	bar.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 10e3}, {X: 4, Intensity: 10e3}}}}
	beam.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}
	beam.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 4, Intensity: -10e3}}}}
	for _, c := range []struct {
		name   string
		m      fem.Model
		theory float64
	}{{"linear bar", bar, 1}, {"Hermite beam", beam, 2}} {
		table, err := study.Convergence(context.Background(), &c.m, 16, units.Base)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if math.Abs(table.Stress.Fitted-c.theory) > 0.05 {
			t.Errorf("%s: stress rate %.3f, theory %g", c.name, table.Stress.Fitted, c.theory)
		}
		var buf bytes.Buffer
		WriteConvergenceText(&buf, c.name, table, nil, nil, nil)
		if !strings.Contains(buf.String(), "Stress error (from N and M alone): 1 for linear bars, 2 for quadratic bars and Hermite beams") {
			t.Errorf("%s: the theory lines give no rate for the stress:\n%s", c.name, buf.String())
		}
	}
	one, err := study.Convergence(context.Background(), &beam, 1, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "one mesh", one, nil, nil, nil)
	if !strings.Contains(buf.String(), "a rate needs two meshes") {
		t.Errorf("a study of one mesh does not say why it has no rate:\n%s", buf.String())
	}
}

// A refinement stopped by its element limit says what the limit was: the
// text said "within the element limit", which the command line (100000)
// and the window (20000) set differently. A linear bar's energy error
// falls as h (Strang & Fix, ch. 1, from memory), so a target of 1e-6 on a
// bar under a uniform axial load needs far more than 64 elements.
func TestAdaptiveTextNamesTheElementLimit(t *testing.T) {
	m := barUnderUniformAxialLoad()
	v, err := study.AgainstUniform(context.Background(), &m, 1e-6, 64, 1000, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if v.Adaptive.Reached {
		t.Fatalf("a target of 1e-6 reached within 64 linear bar elements: %+v", v.Adaptive.Iterations)
	}
	var buf bytes.Buffer
	WriteAdaptiveText(&buf, v, nil)
	if !strings.Contains(buf.String(), "The target was not reached within 64 elements, the most this refinement may use.") {
		t.Errorf("the text does not name the element limit:\n%s", buf.String())
	}
}

// A rate is not measured where an error is at round-off (study.Row), and
// the table shows a dash there: the legend must say what the dash means.
// Hermite beams under a uniform load have a displacement error falling as
// h⁴ (Strang & Fix, ch. 1, from memory), 1.8e-1 on one element of a
// simply supported span (integrated by hand from the element's error
// q·s²(h − s)²/(24EI)), so below 1e-10 from about 256 elements on, while
// the stress and energy errors (h²) stay above it.
func TestConvergenceTextSaysWhatADashMeans(t *testing.T) {
	m := simpleSpanUniform()
	table, err := study.Convergence(context.Background(), &m, 512, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if last := table.Rows[len(table.Rows)-1]; !math.IsNaN(last.L2Rate) || math.IsNaN(last.EnergyRate) {
		t.Fatalf("the finest row %+v: want the displacement at round-off and the energy above it", last)
	}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "beam", table, nil, nil, nil)
	if !strings.Contains(buf.String(), "- in the first row and where either error is at round-off") {
		t.Errorf("the legend does not say what a dash in a rate column means:\n%s", buf.String())
	}
}

// fourMetreMember is the member of the studies' tests (demo data): 4 m of
// one section, E = 200 GPa.
func fourMetreMember() []fem.Segment {
	return []fem.Segment{{Start: 0, End: 4,
		Section:  fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1},
		Material: fem.Material{Elastic: 2e11}}}
}

// simpleSpanUniform is that member simply supported under 10 kN/m down.
func simpleSpanUniform() fem.Model {
	return fem.Model{Segments: fourMetreMember(),
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 4, Intensity: -10e3}}}}}
}

// barUnderUniformAxialLoad is that member fixed at x = 0 under 10 kN/m
// along it.
func barUnderUniformAxialLoad() fem.Model {
	return fem.Model{Segments: fourMetreMember(),
		Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 10e3}, {X: 4, Intensity: 10e3}}}}}
}

// An error the comparison reads as zero is round-off (fem.ErrorNorms: a
// difference negligible against its scale reads 0), not an exact zero,
// and the table says so; it printed "0.000e+00". The rows are written as
// given (a table made by hand), and each other cell keeps its figures.
func TestConvergenceTextSaysRoundOffForZero(t *testing.T) {
	nan := math.NaN()
	table := study.Table{Rows: []study.Row{
		{PerStretch: 1, Elements: 4, MaxStress: 0.25, L2: 0, Energy: 0.125, RoundOff: study.RoundOff, StressRate: nan, L2Rate: nan, EnergyRate: nan},
		{PerStretch: 2, Elements: 8, MaxStress: 0.0625, L2: 0, Energy: 0.0625, RoundOff: study.RoundOff, StressRate: 2, L2Rate: nan, EnergyRate: 1},
	}, Stress: study.Rate{Fitted: 2, Last: 2}, L2: study.Rate{Fitted: nan, Last: nan}, Energy: study.Rate{Fitted: 1, Last: 1}, LoadSets: 1}
	var buf bytes.Buffer
	WriteConvergenceText(&buf, "by hand", table, nil, nil, nil)
	text := buf.String()
	if strings.Contains(text, "0.000e+00") || strings.Count(text, "round-off") < 3 || !strings.Contains(text, "6.250e-02") {
		t.Errorf("zero errors should read round-off, the others as numbers:\n%s", text)
	}
}

// A rate that rounds to zero reads 0.00, never -0.00 (stave converge on a
// member on a bed of 1e-30 N/m² wrote -0.00 in its energy rate column).
func TestRateTextWritesNoNegativeZero(t *testing.T) {
	for _, c := range []struct {
		rate float64
		want string
	}{
		{-0.001, "0.00"},
		{math.Copysign(0, -1), "0.00"},
		{0.001, "0.00"},
		{-0.006, "-0.01"},
		{2, "2.00"},
		{-1.5, "-1.50"},
		{math.NaN(), "-"},
	} {
		if got := RateText(c.rate); got != c.want {
			t.Errorf("RateText(%g) = %q, want %q", c.rate, got, c.want)
		}
	}
}
