package report

import (
	"bytes"
	"context"
	"math"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// A train in a combination, factor 1.5 on top of the combination's case at
// 1.35: every extreme of the combination equals the member solved in closed
// form with the case's loads times 1.35 and the train's axles times 1.5 at
// the governing position (superposition: the fields are linear in the
// loads), and the file keeps the train's factor through saving.
func TestTrainInACombination(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Trains = []moving.Train{{Name: "trolley", Axles: []moving.Axle{{Load: 12e3}, {Load: 12e3, Spacing: 1.2}}, Step: 0.05}}
	p.Model.Combinations = append(p.Model.Combinations, fem.Combination{Name: "with trolley", Kind: fem.Strength,
		Factors: []fem.CaseFactor{{Case: 0, Factor: 1.35}}, Trains: []fem.TrainFactor{{Train: 0, Factor: 1.5}}})

	data, err := storage.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	back, err := storage.Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	if cb := back.Model.Combinations[len(back.Model.Combinations)-1]; len(cb.Trains) != 1 || cb.Trains[0] != (fem.TrainFactor{Train: 0, Factor: 1.5}) {
		t.Fatalf("saved and loaded, the combination takes trains %+v, want the trolley at 1.5", cb.Trains)
	}

	rs, err := TrainEnvelopes(p, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 1 || len(rs[0].Combinations) != 1 {
		t.Fatalf("got %d trains, want 1 with 1 combination", len(rs))
	}
	c := rs[0].Combinations[0]
	if c.Combination != "with trolley" || c.Factor != 1.5 || len(c.Worst) != len(moving.EnvelopeQuantities) {
		t.Fatalf("combination %q factor %g with %d extremes", c.Combination, c.Factor, len(c.Worst))
	}
	own := p.Model.LoadSet(0)
	// The shear force's extreme at a support is its limit with an axle
	// just beside it (on the support the load goes into the reaction): the
	// train is also solved moved 1e-8 of the length either way.
	L := p.Model.Length()
	for _, w := range c.Worst {
		for _, ex := range []TrainExtreme{w.Largest, w.Smallest} {
			var want, tols []float64
			for _, shift := range []float64{0, -1e-8 * L, 1e-8 * L} {
				m := own.Clone()
				for i := range m.DistributedLoad {
					for k := range m.DistributedLoad[i].Points {
						m.DistributedLoad[i].Points[k].Intensity *= 1.35
					}
				}
				d, _ := moving.ParseDirection(ex.Direction)
				axles, _ := p.Trains[0].Loads(moving.Placement{Direction: d, Front: ex.Front + shift})
				for _, a := range axles {
					a.Transverse *= 1.5
					m.PointLoads = append(m.PointLoads, a)
				}
				e, err := fem.SolveExact(&m)
				if err != nil {
					t.Fatal(err)
				}
				l, r := e.At(ex.X, fem.Left), e.At(ex.X, fem.Right)
				// Moved, the axles' shear force changes by about the
				// shift over the span (1e-8 of the value).
				tol := 1e-9
				if shift != 0 {
					tol = 1e-7
				}
				want, tols = append(want, w.Quantity.Of(&l), w.Quantity.Of(&r)), append(tols, tol, tol)
			}
			scale := math.Max(math.Abs(w.Largest.Value), math.Abs(w.Smallest.Value))
			ok := false
			for k, v := range want {
				ok = ok || math.Abs(ex.Value-v) <= tols[k]*scale
			}
			if !ok {
				t.Errorf("%s: %.10g at x = %g with the front at %g %s; solved there and moved either way: %.10g", w.Quantity, ex.Value, ex.X, ex.Front, ex.Direction, want)
			}
		}
	}
	// The load-case envelope takes the combination with its train where it
	// goes beyond the cases' envelope, naming the train's position, and the
	// findings say the checks leave the train out.
	src, cases := analysedCases(t, p)
	cases.WithTrains(src)
	for _, q := range cases.Envelope.Quantities {
		if q.Quantity != fem.QBendingMoment {
			continue
		}
		for _, w := range c.Worst {
			if w.Quantity == fem.QBendingMoment && (q.Min.Value != w.Smallest.Value || q.Min.Train == nil || q.Min.Combination != "with trolley" || q.Min.Train.Front != w.Smallest.Front) {
				t.Errorf("envelope's smallest moment %+v, want the combination with its train, %g at front %g", q.Min, w.Smallest.Value, w.Smallest.Front)
			}
		}
	}
	flagged := false
	for _, f := range src.Findings {
		flagged = flagged || f.Code == analysis.CodeTrainNotChecked
	}
	if !flagged {
		t.Error("no finding says the checks leave the train out")
	}
	// The trolley alone: the combination's moment over the middle support
	// is worse than 1.35 times the case's own −wL²/8 = −20 kN·m (two equal
	// spans under a uniform load, beam tables, from memory).
	for _, w := range c.Worst {
		if w.Quantity == fem.QBendingMoment && !(w.Smallest.Value < -1.35*20e3) {
			t.Errorf("smallest moment %g N·m, want below 1.35 × −20 kN·m", w.Smallest.Value)
		}
	}
}

// The worst values of a train alone and of a combination that takes it lie
// between the default stations, under an axle; they are found there. Simple
// span L = 10 m; three axles 40, 120 and 90 kN, 2.0 m and 3.5 m apart,
// moving both ways on positions 0.01 m apart; case "G" a uniform 5 kN/m.
// With the middle axle at x and the others at x − 2 m and x + 3.5 m, the
// left reaction of the axles is (250 kN·(L − x) − 235 kN·m)/L and the moment
// under the middle axle M_T(x) = x·(250(L − x) − 235)/L − 80 kN·m; the
// case's is q·x·(L − x)/2. Alone, M_T is largest at x = 4.53 m (midspan
// halfway between the axle and the resultant: 433.0225 kN·m); with the
// factors 1.35 on the case and 1.5 on the train, 1.35·q·x(L − x)/2 +
// 1.5·M_T(x) = 373,500·x − 40,875·x² − 120,000 N·m is largest at x =
// 373,500/81,750 = 4.5688 m, where no position of the 0.01 m step puts the
// middle axle: 733.2247706 kN·m, every position counting. Source: statics
// of a simple beam (textbook closed form, derived here; the rule of the
// resultant from memory).
func TestTrainPeaksBetweenStations(t *testing.T) {
	p, err := storage.Unmarshal([]byte(threeAxleModel))
	if err != nil {
		t.Fatal(err)
	}
	rs, err := TrainEnvelopes(p, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 1 || len(rs[0].Combinations) != 1 {
		t.Fatalf("got %d trains, want 1 with 1 combination", len(rs))
	}
	moment := func(ws []QuantityWorst) TrainExtreme {
		for _, w := range ws {
			if w.Quantity == fem.QBendingMoment {
				return w.Largest
			}
		}
		t.Fatal("no bending moment among the extremes")
		return TrainExtreme{}
	}
	for _, c := range []struct {
		name  string
		got   TrainExtreme
		value float64
		at    []float64 // the place, or its mirror image
	}{
		{"train alone", moment(rs[0].Worst), 433022.5, []float64{4.53, 5.47}},
		{"combination U", moment(rs[0].Combinations[0].Worst), 373500*373500/(4*40875.0) - 120e3, []float64{373500 / 81750.0, 10 - 373500/81750.0}},
	} {
		if math.Abs(c.got.Value-c.value) > 1e-9*c.value {
			t.Errorf("%s: largest moment %.10g N·m, want %.10g", c.name, c.got.Value, c.value)
		}
		if math.Abs(c.got.X-c.at[0]) > 1e-9 && math.Abs(c.got.X-c.at[1]) > 1e-9 {
			t.Errorf("%s: largest moment at x = %.10g m, want %g m or %g m", c.name, c.got.X, c.at[0], c.at[1])
		}
	}
}

// fileHead opens a project file of the tests: its format and units.
const fileHead = `{"format": "stave-member", "version": 2,
	"units": {"length": "m", "area": "m²", "second_moment": "m⁴", "force": "N", "moment": "N·m", "line_load": "N/m",
		"stress": "Pa", "density": "kg/m³", "acceleration": "m/s²", "thermal_expansion": "1/K", "temperature_change": "K",
		"rotation": "rad", "spring": "N/m", "rotational_spring": "N·m/rad"},`

// threeAxleModel is the simple span of TestTrainPeaksBetweenStations.
const threeAxleModel = fileHead + `
	"member": {"segments": [{"start": 0, "end": 10, "section": {"area": 0.004, "second_moment": 1.6e-5, "fibre_distance": 0.1},
		"material": {"elastic_modulus": 2e11}}]},
	"supports": [{"x": 0, "kind": "pinned"}, {"x": 10, "kind": "roller"}],
	"cases": [{"name": "G", "loads": [{"kind": "distributed", "direction": "transverse", "points": [[0, -5000], [10, -5000]]}]}],
	"combinations": [{"name": "U", "kind": "strength", "factors": [{"case": "G", "factor": 1.35}, {"train": "three", "factor": 1.5}]}],
	"trains": [{"name": "three", "axles": [{"load": 40000}, {"load": 120000, "spacing": 2}, {"load": 90000, "spacing": 3.5}], "step": 0.01}],
	"mesh": {"elements": 40}}`

// The sheet's governing positions note the finite element check only where
// it differs beyond round-off: the moment at the pinned end is 0 exactly
// and about 1e-11 N·m in the finite element solve, which must read "0 kN·m",
// not "0 kN·m (FE -5.551e-15 kN·m)" running into the next column.
func TestMovingSheetLeavesRoundOffOut(t *testing.T) {
	p, r := movingMoment(t, threeAxleModel, 4.5)
	sheet, err := MovingSheet(p, r, 0, units.SI)
	if err != nil {
		t.Fatal(err)
	}
	for _, row := range sheet.Rows {
		if row[0] != fem.QBendingMoment.String() {
			continue
		}
		if row[4] != "0 kN·m" {
			t.Errorf("smallest bending moment reads %q, want \"0 kN·m\"", row[4])
		}
		return
	}
	t.Error("no bending moment row on the sheet")
}

// A train that does not fit on the member is left out of the trains'
// results with a warning among the findings, not in its own results
// alone; trains that fit give none.
func TestTrainLeftOutIsWarned(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	fits := moving.Train{Name: "trolley", Axles: []moving.Axle{{Load: 12e3}, {Load: 12e3, Spacing: 1.2}}, Step: 0.05}
	long := moving.Train{Name: "long", Axles: []moving.Axle{{Load: 12e3}, {Load: 12e3, Spacing: 50}}, Step: 0.05}
	// Its finite element check at the governing position overflows: it
	// alone is left out (every train of the file was).
	huge := moving.Train{Name: "huge", Axles: []moving.Axle{{Load: 1e300}}, Step: 0.05}
	for _, tc := range []struct {
		trains []moving.Train
		warned int
	}{{[]moving.Train{fits}, 0}, {[]moving.Train{fits, long}, 1}, {[]moving.Train{huge, fits}, 1}} {
		p.Trains = tc.trains
		src, err := Analyse(context.Background(), p)
		if err != nil {
			t.Fatal(err)
		}
		src = src.WithTrains()
		warned := 0
		for _, f := range src.Findings {
			if f.Code == analysis.CodeTrainNotPlaced {
				warned++
				if f.Severity != analysis.Caution {
					t.Errorf("%s: severity %v, want a caution", f.Name, f.Severity)
				}
			}
		}
		if warned != tc.warned || len(src.Trains) != len(tc.trains) {
			t.Errorf("%d trains: %d warnings of a train left out, %d results; want %d and %d", len(tc.trains), warned, len(src.Trains), tc.warned, len(tc.trains))
		}
		for i, r := range src.Trains {
			if r.Train.Name == "trolley" && r.Err != nil {
				t.Errorf("train %d, the trolley that fits, left out: %v", i+1, r.Err)
			}
		}
	}
}

// An influence line of an axial quantity says of each train that it moves
// none of it (its loads act across the member), instead of a train's
// heading with nothing under it; a bending quantity gets the train's
// extremes.
func TestTrainOnAxialTargetSaysNone(t *testing.T) {
	p, err := storage.Load("../../testdata/moving/runway.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		q    fem.Quantity
		none bool
	}{{fem.QAxialForce, true}, {fem.QBendingMoment, false}} {
		r, err := Influence(p, InfluenceRequest{Target: moving.Target{Quantity: tc.q, X: 3}})
		if err != nil {
			t.Fatal(err)
		}
		var b strings.Builder
		WriteInfluenceText(&b, "runway.json", r, units.SI)
		if got := strings.Count(b.String(), "move no axial force"); (got == len(p.Trains)) != tc.none || (got == 0) == tc.none {
			t.Errorf("%s: %d trains said to move none, of %d:\n%s", tc.q, got, len(p.Trains), b.String())
		}
	}
}

// A train is described in one line: its axles, its uniform load and its
// run, each part once, whatever parts it has; a run of equal axles at
// equal spacing is named once, with its count, and a long train's axles
// and length follow (their sum, Train.Length). The loads and spacings are
// invented demo data.
func TestDescribeTrain(t *testing.T) {
	long := moving.Train{Axles: []moving.Axle{{Load: 20e3}}}
	for range 40 {
		long.Axles = append(long.Axles, moving.Axle{Load: 5e3, Spacing: 0.25})
	}
	long.Axles = append(long.Axles, moving.Axle{Load: 20e3, Spacing: 1})
	for _, c := range []struct {
		name  string
		train moving.Train
		want  string
	}{
		{"axles", moving.Train{Axles: []moving.Axle{{Load: 10e3}, {Load: 20e3, Spacing: 1.5}}},
			`t: 10.00 kN –1.500 m– 20.00 kN; runs both ways between x = 0 m and 8.000 m, wholly on that stretch at every position`},
		{"a uniform load alone", moving.Train{Uniform: moving.UniformLoad{Load: 5e3, Length: 2}, Direction: moving.Forward},
			`t: 5.000 kN/m over 2.000 m from 0 m behind the front; runs forward (towards +x) between x = 0 m and 8.000 m, wholly on that stretch at every position`},
		{"both", moving.Train{Axles: []moving.Axle{{Load: 10e3}}, Uniform: moving.UniformLoad{Load: 5e3, Start: 1, Length: 2}, From: 1, To: 7},
			`t: 10.00 kN; 5.000 kN/m over 2.000 m from 1.000 m behind the front; runs both ways between x = 1.000 m and 7.000 m, wholly on that stretch at every position`},
		{"two equal after the first", moving.Train{Axles: []moving.Axle{{Load: 6e3}, {Load: 9e3, Spacing: 1.1}, {Load: 9e3, Spacing: 1.1}}},
			`t: 6.000 kN –1.100 m– 9.000 kN –1.100 m– 9.000 kN; runs both ways between x = 0 m and 8.000 m, wholly on that stretch at every position`},
		{"a run of forty", long,
			`t: 20.00 kN then 40 times –0.2500 m– 5.000 kN –1.000 m– 20.00 kN; 42 axles over 11.00 m; runs both ways between x = 0 m and 8.000 m, wholly on that stretch at every position`},
	} {
		if got := describeTrain(&c.train, "t", 8, units.SI); got != c.want {
			t.Errorf("%s: %q, want %q", c.name, got, c.want)
		}
	}
}

// A cantilever (fixed at 0, 4 m) under two axles acting down: its moment is
// nowhere above zero (statics), so the train's largest moment, and the
// finite element reading beside it, read 0, not the round-off of the
// closed form ("9.095e-15 kN·m"); the smallest is −(10 kN·2.5 m + 20 kN·4
// m) = −105 kN·m with the heavier axle at the tip.
func TestTrainTextLeavesRoundOffOut(t *testing.T) {
	const model = fileHead + `
	"member": {"segments": [{"start": 0, "end": 4, "section": {"area": 0.004, "second_moment": 1.6e-5, "fibre_distance": 0.1},
		"material": {"elastic_modulus": 2e11}}]},
	"supports": [{"x": 0, "kind": "fixed"}],
	"trains": [{"name": "t", "axles": [{"load": 10000}, {"load": 20000, "spacing": 1.5}], "step": 0.01}]}`
	_, r := movingMoment(t, model, 1)
	var b strings.Builder
	WriteInfluenceText(&b, "cantilever", r, units.SI)
	out := b.String()
	if strings.Contains(out, "e-1") {
		t.Errorf("round-off printed:\n%s", out)
	}
	i := strings.Index(out, "    bending moment ")
	if i < 0 {
		t.Fatalf("no bending moment row:\n%s", out)
	}
	rows := strings.SplitN(out[i:], "\n", 3)
	if !strings.Contains(rows[0], "largest   0 kN·m at") || !strings.Contains(rows[0], "(finite elements 0 kN·m)") || !strings.Contains(rows[1], "smallest  -105.0 kN·m at x = 0 m") {
		t.Errorf("bending moment rows:\n%s\n%s", rows[0], rows[1])
	}
}

// movingMoment is the project of the file text model and the influence
// line of its bending moment at x, with its trains' envelopes.
func movingMoment(t *testing.T, model string, x float64) (*storage.Project, *MovingLoads) {
	t.Helper()
	p, err := storage.Unmarshal([]byte(model))
	if err != nil {
		t.Fatal(err)
	}
	r, err := Influence(p, InfluenceRequest{Target: moving.Target{Quantity: fem.QBendingMoment, X: x}, Envelope: true})
	if err != nil {
		t.Fatal(err)
	}
	return p, r
}

// The results table and the calculation sheet hold the member's own loads
// alone, so they name the moving load trains they leave out: the runway's
// two trains, with their axles (42 kN, 3.2 m apart, as the file gives).
func TestTableAndSheetNameTheTrainsLeftOut(t *testing.T) {
	p, err := storage.Load("../../testdata/moving/runway.json")
	if err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	src, err := Export(context.Background(), &out, p, "csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	lines := trainLines(src)
	if len(lines) != 2 || !strings.HasPrefix(lines[0], `train "end carriage": 42.00 kN –3.200 m– 42.00 kN`) || !strings.Contains(lines[1], `"maintenance cart"`) {
		t.Errorf("train lines %q: want the two trains of the file", lines)
	}
	table := out.String()
	wants := []string{"\n# " + TrainsLeftOut + "\n"}
	for _, l := range lines {
		wants = append(wants, "\n#   "+l+"\n")
	}
	for _, want := range wants {
		if !strings.Contains(table, want) {
			t.Errorf("the table lacks %q", want)
		}
	}
	demo, err := storage.Demo()
	if err != nil {
		t.Fatal(err)
	}
	if src, err := Analyse(context.Background(), demo); err != nil || trainLines(src) != nil {
		t.Errorf("the demo, without trains: lines %q, error %v", trainLines(src), err)
	}
}

// A train that no combination takes is in no design check: the runway's
// checks take its self-weight alone (about 1 % of the allowable stress),
// so each of its two trains gets a caution that says so, and a train a
// combination takes gets none of its own (the combination's finding says
// what the checks leave out).
func TestTrainsInNoCombinationAreFlagged(t *testing.T) {
	p, err := storage.Load("../../testdata/moving/runway.json")
	if err != nil {
		t.Fatal(err)
	}
	count := func(p *storage.Project) (n int, names []string) {
		src, err := Analyse(context.Background(), p)
		if err != nil {
			t.Fatal(err)
		}
		for _, f := range src.WithTrains().Findings {
			if f.Code == analysis.CodeTrainNotChecked && strings.Contains(f.Name, "not in the checks") {
				n++
				names = append(names, f.Name)
				if f.Severity != analysis.Caution {
					t.Errorf("%s: severity %v, want a caution", f.Name, f.Severity)
				}
			}
		}
		return n, names
	}
	if n, names := count(p); n != len(p.Trains) || len(p.Trains) != 2 {
		t.Errorf("runway with %d trains in no combination: %d cautions %q, want one each", len(p.Trains), n, names)
	}
	p.Model.Cases = []fem.LoadCase{{Name: "own", PointLoads: []fem.PointLoad{{X: 1, Transverse: -1e3}}}}
	p.Model.Combinations = []fem.Combination{{Name: "with the first", Factors: []fem.CaseFactor{{Case: 0, Factor: 1}},
		Trains: []fem.TrainFactor{{Train: 0, Factor: 1.5}}}}
	if n, names := count(p); n != 1 || !strings.Contains(names[0], p.Trains[1].Name) {
		t.Errorf("first train in a combination: cautions %q, want one, for the second train %q", names, p.Trains[1].Name)
	}
}

// A combination that takes a train adds it to the worst arrangement of its
// cases placed by span at each point, chosen apart from the train's
// position. Two equal spans L = 6 m under q = 10 kN/m placed by span and one
// 50 kN axle: the largest sagging moment loads the first span alone, with
// the axle on it at a from the end support. For the two-span beam the
// moment over the middle support is −qL²/16 from the span's load and
// −P·a·(L² − a²)/(4L²) from the axle (continuous beam of two equal spans,
// AISC Manual, beam diagrams and formulas, from memory), so under the axle
// M(a) = R·a − q·a²/2 with R = qL/2 + P(L − a)/L + M_B/L (statics);
// maximised over a here by scanning. Every span loaded gives less (M_B
// −qL²/8): the combination fell 11 % short with it.
func TestTrainCombinationTakesTheWorstArrangement(t *testing.T) {
	const L, q, P = 6.0, 10e3, 50e3
	p, err := storage.Load("../../testdata/two_span_cases.json") // spans of 4 m: resized below
	if err != nil {
		t.Fatal(err)
	}
	m := &p.Model
	m.Segments[0].End = 2 * L
	m.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}, {X: 2 * L, Kind: fem.Roller}}
	m.Cases = []fem.LoadCase{{Name: "imp", BySpan: true,
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -q}, {X: 2 * L, Intensity: -q}}}}}}
	m.Combinations = []fem.Combination{{Name: "with axle", Kind: fem.Strength,
		Factors: []fem.CaseFactor{{Case: 0, Factor: 1}}, Trains: []fem.TrainFactor{{Train: 0, Factor: 1}}}}
	p.Trains = []moving.Train{{Name: "axle", Axles: []moving.Axle{{Load: P}}, Step: 0.01}}

	want, wantAt := 0.0, 0.0
	for a := 0.0; a <= L; a += 1e-4 {
		mb := -q*L*L/16 - P*a*(L*L-a*a)/(4*L*L)
		r := q*L/2 + P*(L-a)/L + mb/L
		if v := r*a - q*a*a/2; v > want {
			want, wantAt = v, a
		}
	}
	rs, err := TrainEnvelopes(p, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	var got QuantityWorst
	for _, w := range rs[0].Combinations[0].Worst {
		if w.Quantity == fem.QBendingMoment {
			got = w
		}
	}
	// The train's positions are 0.01 m apart: the moment under the axle
	// misses the peak by at most its slope change times the half step.
	if math.Abs(got.Largest.Value-want) > 1e-4*want || math.Abs(got.Largest.X-wantAt) > 0.01 {
		t.Errorf("largest moment %.6g N·m at %g m, want %.6g at %.4g m", got.Largest.Value, got.Largest.X, want, wantAt)
	}
	src, err := Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	src = src.WithTrains()
	cases, err := CasesResults(src.Analysis)
	if err != nil {
		t.Fatal(err)
	}
	cases.WithTrains(src)
	for _, qe := range cases.Envelope.Quantities {
		if qe.Quantity != fem.QBendingMoment {
			continue
		}
		g := qe.Max
		if g.Train == nil || len(g.LoadedSpans) != 1 || !slices.Equal(g.LoadedSpans[0].Spans, []int{1}) {
			t.Errorf("envelope's largest moment %+v: want the train's, with imp on span 1 alone", g)
		}
	}
}

// The caution on a combination that takes a moving load train names the
// train as every other message does (moving.Train.Label, docs/format.md
// trains: the name is optional): by its name when it has one, by its number
// otherwise; the second train of the project here, so a number is 2.
func TestTrainInACombinationIsNamed(t *testing.T) {
	for _, c := range []struct{ name, want, not string }{
		{"pair", `moving load train "pair"`, "train 2"},
		{"", "moving load train 2", `train ""`},
	} {
		p, err := storage.Load("../../testdata/two_span_cases.json")
		if err != nil {
			t.Fatal(err)
		}
		p.Trains = []moving.Train{{Name: "other", Axles: []moving.Axle{{Load: 1e3}}},
			{Name: c.name, Axles: []moving.Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}}
		p.Model.Combinations[0].Trains = []fem.TrainFactor{{Train: 1, Factor: 1.5}}
		src, err := Analyse(context.Background(), p)
		if err != nil {
			t.Fatal(err)
		}
		found := false
		for _, f := range src.Findings {
			if f.Code != analysis.CodeTrainNotChecked || !strings.Contains(f.Name, "combination") {
				continue
			}
			found = true
			if !strings.Contains(f.Name, c.want) || !strings.Contains(f.Message, c.want) || strings.Contains(f.Name+f.Message, c.not) {
				t.Errorf("train named %q: caution %q: %q, want it named %q", c.name, f.Name, f.Message, c.want)
			}
		}
		if !found {
			t.Errorf("train named %q: no caution says the combination's checks leave it out", c.name)
		}
	}
}

// The worst values at the target are measured against each other as the
// envelope's are: the shear force just right of a fixed support 0.1 mm
// from the next is 10 kN with the axle on the support and 0 with it
// anywhere else (the stretch between the two is clamped at both ends, so
// no load outside it reaches it: statics), and the 0 once read
// "-3.638e-15 kN", the round-off of summing the axle's line on the 0.1 mm
// stretch.
func TestTrainTargetLeavesRoundOffOut(t *testing.T) {
	const model = fileHead + `
	"member": {"segments": [{"start": 0, "end": 10, "section": {"area": 0.01, "second_moment": 1e-4, "fibre_distance": 0.1},
		"material": {"elastic_modulus": 2.1e11}}]},
	"supports": [{"x": 0, "kind": "pinned"}, {"x": 5, "kind": "fixed"}, {"x": 5.0001, "kind": "fixed"}, {"x": 10, "kind": "roller"}],
	"trains": [{"name": "one", "axles": [{"load": 10000}], "step": 0.01}]}`
	p, err := storage.Unmarshal([]byte(model))
	if err != nil {
		t.Fatal(err)
	}
	r, err := Influence(p, InfluenceRequest{Target: moving.Target{Quantity: fem.QShearForce, X: 5, Side: fem.Right}})
	if err != nil {
		t.Fatal(err)
	}
	var b strings.Builder
	WriteInfluenceText(&b, "short", r, units.SI)
	out := b.String()
	if !strings.Contains(out, "largest 10.00 kN") || !strings.Contains(out, "smallest 0 kN") || strings.Contains(out, "e-1") {
		t.Errorf("want the largest 10.00 kN and the smallest 0 kN:\n%s", out)
	}
}

// A train a combination takes at factor 0 adds nothing to it: the
// load-case envelope keeps the combination's cases for every extreme and
// reaction, where the train's envelope ties with them to round-off; it
// named the train's position for the bending stress and two reactions of
// testdata/three_span_pattern.json, whose round-off came out above.
func TestTrainAtFactorZeroGovernsNothing(t *testing.T) {
	p, err := storage.Load("../../testdata/three_span_pattern.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Trains = []moving.Train{{Name: "trolley", Axles: []moving.Axle{{Load: 12e3}}, Step: 0.5}}
	p.Model.Combinations[0].Trains = []fem.TrainFactor{{Train: 0, Factor: 0}}
	r, _ := casesWithTrains(t, p)
	for _, q := range r.Envelope.Quantities {
		for _, g := range []GoverningJSON{q.Max, q.Min} {
			if g.Train != nil {
				t.Errorf("%s: %g by %q with the train at %g m", q.Name, g.Value, g.Combination, g.Train.Front)
			}
		}
	}
	for _, re := range r.Envelope.Reactions {
		for _, m := range []map[string]*GoverningJSON{re.Max, re.Min} {
			for name, g := range m {
				if g != nil && g.Train != nil {
					t.Errorf("support %d, %s: %g by %q with the train at %g m", re.Support, name, g.Value, g.Combination, g.Train.Front)
				}
			}
		}
	}
}

// An extreme of the envelope that a combination with its train gives
// where the cases' field jumps says the side it is read on, as the
// cases' own do (TestEnvelopeSaysTheSideOfAJump): two axles of 30 kN at
// 1 m in the strength combination of testdata/three_span_pattern.json at
// 1.5 add to its shear force beside the inner supports, most just left of
// 4 m and just right of 8 m (the mirror).
func TestTrainExtremeSaysTheSideOfAJump(t *testing.T) {
	p, err := storage.Load("../../testdata/three_span_pattern.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Trains = []moving.Train{{Name: "trolley", Axles: []moving.Axle{{Load: 30e3}, {Load: 30e3, Spacing: 1}}, Step: 0.5}}
	p.Model.Combinations[0].Trains = []fem.TrainFactor{{Train: 0, Factor: 1.5}}
	r, _ := casesWithTrains(t, p)
	for _, q := range r.Envelope.Quantities {
		if q.Quantity != fem.QShearForce {
			continue
		}
		for _, c := range []struct {
			g    GoverningJSON
			x    float64
			side string
		}{{q.Max, 8, "right"}, {q.Min, 4, "left"}} {
			if c.g.Train == nil || c.g.X != c.x || c.g.Side != c.side {
				t.Errorf("shear force %g at x = %g m, side %q, train %v; want the train's at %g m, side %q", c.g.Value, c.g.X, c.g.Side, c.g.Train, c.x, c.side)
			}
		}
	}
}
