package report

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// A train's extremes say on which side of a jump they are read, as the
// static extremes do (fem.Side.At, Place; JSON "side"): the runway's end
// carriage, 42 kN –3.2 m– 42 kN over two spans of 6 m, gives the shear
// force ±65.43 kN either side of the middle support, P + P·(1 − R₁(2.8))
// with R₁(a) = (L − a)/L − a(L² − a²)/(4L³) (two equal spans, a load in
// the first: AISC Beam Diagrams and Formulas, continuous beam – two equal
// spans – concentrated load at any point, from memory), the largest just
// right of 6 m and the smallest just left of it; the moment over the
// support, which does not jump, says no side. In the text in SI and US
// units, in the JSON and on the sheet; the influence line's target, the
// shear force at 3 m, which jumps under the unit load there, says the side
// it is read on in the same words.
func TestTrainExtremesSayTheirSide(t *testing.T) {
	p, err := storage.Load("../../testdata/moving/runway.json")
	if err != nil {
		t.Fatal(err)
	}
	r, err := Influence(p, InfluenceRequest{Target: moving.Target{Quantity: fem.QShearForce, X: 3, Side: fem.Right}, Points: 4, Envelope: true})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		u                   units.System
		target, right, left string
	}{
		{units.SI, "shear force just right of x = 3.000 m: largest", "65.43 kN just right of x = 6.000 m", "-65.43 kN just left of x = 6.000 m"},
		{units.USCustomary, "shear force just right of x = 9.843 ft: largest", "14.71 kip just right of x = 19.69 ft", "-14.71 kip just left of x = 19.69 ft"},
	} {
		var b strings.Builder
		WriteInfluenceText(&b, "runway.json", r, c.u)
		text := b.String()
		for _, want := range []string{c.target, c.right, c.left} {
			if !strings.Contains(text, want) {
				t.Errorf("%s: the text lacks %q:\n%s", c.u.Name, want, text)
			}
		}
		for _, line := range strings.Split(text, "\n") {
			if strings.Contains(line, "bending moment") && strings.Contains(line, "just ") {
				t.Errorf("%s: the moment, which does not jump, has a side: %s", c.u.Name, line)
			}
		}
	}

	var doc []struct {
		Train string
		Worst []struct {
			Quantity          string
			Largest, Smallest struct {
				Value, X float64
				Side     string
			}
		}
	}
	data, err := json.Marshal(TrainsJSON(&p.Model, r.Trains, false))
	if err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(data, &doc); err != nil {
		t.Fatal(err)
	}
	for _, w := range doc[0].Worst {
		want := [2]string{}
		if w.Quantity == "shear_force" {
			want = [2]string{"right", "left"}
		}
		if got := [2]string{w.Largest.Side, w.Smallest.Side}; got != want {
			t.Errorf("JSON %s: sides %q, want %q", w.Quantity, got, want)
		}
	}

	sheet, err := MovingSheet(p, r, 0, units.SI)
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, row := range sheet.Rows {
		if row[0] == fem.QShearForce.String() {
			found = true
			if row[2] != "just right of 6.000 m" || row[5] != "just left of 6.000 m" {
				t.Errorf("sheet: shear force at %q and %q, want just right of and just left of 6.000 m", row[2], row[5])
			}
		}
	}
	if !found {
		t.Error("no shear force row on the sheet")
	}
}

// A combination that takes a train says the side of its extremes where
// their sum jumps: two equal spans L = 4 m (two_span_cases.json) under
// 1.35 × q = 10 kN/m over both spans, whose shear force is ±5qL/8 either
// side of the middle support (AISC Beam Diagrams and Formulas, continuous
// beam – two equal spans – uniform load, from memory), and 1.5 × a trolley
// of 12 kN –1.2 m– 12 kN, ±(P + P·(1 − R₁(L − d))) there as above: the
// largest just right of 4 m, the smallest just left of it.
func TestTrainCombinationExtremesSayTheirSide(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	const q, L, P, d = 10e3, 4.0, 12e3, 1.2
	p.Trains = []moving.Train{{Name: "trolley", Axles: []moving.Axle{{Load: P}, {Load: P, Spacing: d}}, Step: 0.05}}
	p.Model.Combinations = append(p.Model.Combinations, fem.Combination{Name: "with trolley", Kind: fem.Strength,
		Factors: []fem.CaseFactor{{Case: 0, Factor: 1.35}}, Trains: []fem.TrainFactor{{Train: 0, Factor: 1.5}}})
	rs, err := TrainEnvelopes(p, units.Base)
	if err != nil {
		t.Fatal(err)
	}
	a := L - d
	r1 := (L-a)/L - a*(L*L-a*a)/(4*L*L*L)
	v := 1.35*5*q*L/8 + 1.5*(P+P*(1-r1))
	for _, w := range rs[0].Combinations[0].Worst {
		want := [2]string{}
		if w.Quantity == fem.QShearForce {
			want = [2]string{"right", "left"}
			if math.Abs(w.Largest.Value-v) > 1e-9*v || math.Abs(w.Smallest.Value+v) > 1e-9*v || w.Largest.X != L || w.Smallest.X != L {
				t.Errorf("shear force %.10g at %g and %.10g at %g, want ±%.10g at %g", w.Largest.Value, w.Largest.X, w.Smallest.Value, w.Smallest.X, v, L)
			}
		}
		if got := [2]string{w.Largest.Side, w.Smallest.Side}; got != want {
			t.Errorf("%s: sides %q, want %q", w.Quantity, got, want)
		}
	}
}

// The influence document gives the side its line is read on where the
// quantity jumps at the point, and only there (docs/json.md,
// influence_line.side), as Line.Describe says it: the shear force just
// left of the runway's middle support, "left"; the moment there, which
// does not jump, none (it read "right"); its target in words likewise
// (it read "bending moment at x = 2.4 m (left side)").
func TestInfluenceJSONSideWhereItJumps(t *testing.T) {
	p, err := storage.Load("../../testdata/moving/runway.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		tg           moving.Target
		want, target string
	}{
		{moving.Target{Quantity: fem.QShearForce, X: 6, Side: fem.Left}, "left", "shear force just left of x = 6 m"},
		{moving.Target{Quantity: fem.QShearForce, X: 6, Side: fem.Right}, "right", "shear force just right of x = 6 m"},
		{moving.Target{Quantity: fem.QBendingMoment, X: 6, Side: fem.Right}, "", "bending moment at x = 6 m"},
		{moving.Target{Quantity: fem.QBendingMoment, X: 2.4, Side: fem.Left}, "", "bending moment at x = 2.4 m"},
	} {
		r, err := Influence(p, InfluenceRequest{Target: c.tg, Points: 2})
		if err != nil {
			t.Fatal(err)
		}
		var b strings.Builder
		if err := WriteInfluenceJSON(&b, "runway.json", r); err != nil {
			t.Fatal(err)
		}
		var doc struct {
			Line struct {
				Side   string `json:"side"`
				Target string `json:"target"`
			} `json:"influence_line"`
		}
		if err := json.Unmarshal([]byte(b.String()), &doc); err != nil {
			t.Fatal(err)
		}
		if doc.Line.Side != c.want || doc.Line.Target != c.target {
			t.Errorf("%v: side %q, target %q; want %q, %q", c.tg, doc.Line.Side, doc.Line.Target, c.want, c.target)
		}
	}
}
