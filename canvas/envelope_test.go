package canvas

import (
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// The envelope is drawn in the strips: an upper and a lower curve of the
// diagram's colour, and the largest and smallest values labelled with the
// combination that governs each (two spans: the largest sagging moment
// with the first span alone loaded, the moment over the middle support
// with both).
func TestEnvelopeDrawsBothCurvesAndNamesTheCombination(t *testing.T) {
	m, cs, sol := twoSpanCombinations(t)
	in := Input{Model: m, Solution: sol, Overlays: storage.Overlays{BendingMoment: true, DeformedShape: true},
		Envelope: &Envelope{Solutions: cs, Result: cs.Envelope(), Names: []string{"both", "first"}}}
	v := NewView(1000, 600)
	v.Fit(m)
	s := Build(in, v)
	var labels []string
	curves := 0
	for _, it := range s.Items {
		if it.Text != "" {
			labels = append(labels, it.Text)
		}
		if it.Kind == Polyline && it.StrokeWidth == 1.8 && len(it.Points) > 50 {
			curves++
		}
	}
	all := strings.Join(labels, " | ")
	for _, want := range []string{"at 4.000 m, both", "at 1.750 m, first", "envelope of the combinations"} {
		if !strings.Contains(all, want) {
			t.Errorf("no label with %q among %s", want, all)
		}
	}
	if curves != 2 {
		t.Errorf("%d curves drawn in the strip, want the upper and the lower", curves)
	}
	// The sketch above the strips shows one solution, the first
	// combination's: its reactions are both spans' (end reaction 3qL/8 =
	// 15 kN, middle 10qL/8 = 50 kN; continuous beam tables, AISC Manual
	// "Beam Diagrams and Formulas", from memory), and it says whose.
	for _, want := range []string{"deflection and reactions: combination both", "Ry 15.00 kN", "Ry 50.00 kN"} {
		if !strings.Contains(all, want) {
			t.Errorf("no label with %q among %s", want, all)
		}
	}
}

// Under the envelope the sketch still draws one solution's deflection and
// reactions, the first combination's: it says whose, since the envelope's
// reactions differ (two equal spans, wL = 40 kN each: the end support
// carries 3/8·wL = 15 kN with both spans loaded and 7/16·wL = 17.5 kN with
// the first alone; AISC Manual beam diagrams, continuous beam of two equal
// spans, from memory).
func TestEnvelopeSketchNamesItsCombination(t *testing.T) {
	m, cs, sol := twoSpanCombinations(t)
	for _, deformed := range []bool{true, false} {
		in := Input{Model: m, Solution: sol, Units: units.SI, Overlays: storage.Overlays{DeformedShape: deformed, BendingMoment: true},
			Envelope: &Envelope{Solutions: cs, Result: cs.Envelope(), Names: []string{"both", "first"}}}
		v := NewView(1000, 600)
		v.Fit(m)
		var labels []string
		for _, it := range Build(in, v).Items {
			if it.Text != "" {
				labels = append(labels, it.Text)
			}
		}
		all := strings.Join(labels, " | ")
		for _, want := range []string{"Ry 15.00 kN", "reactions: combination both"} {
			if !strings.Contains(all, want) {
				t.Errorf("deflected shape %v: no label with %q among %s", deformed, want, all)
			}
		}
	}
}

// twoSpanCombinations is a beam continuous over two spans of 4 m under
// 10 kN/m, on both spans ("both") or the first alone ("first"), its two
// combinations solved, and the first's solution.
func twoSpanCombinations(t *testing.T) (*fem.Model, *fem.CombinationSolutions, *fem.Solution) {
	t.Helper()
	w := fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 8, Intensity: -10e3}}}
	first := fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 4, Intensity: -10e3}}}
	m := &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 8, Section: fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: fem.Material{Elastic: 2e11}}},
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}, {X: 8, Kind: fem.Roller}},
		Cases:    []fem.LoadCase{{Name: "both spans", DistributedLoad: []fem.DistributedLoad{w}}, {Name: "first span", DistributedLoad: []fem.DistributedLoad{first}}},
		Combinations: []fem.Combination{
			{Name: "both", Factors: []fem.CaseFactor{{Case: 0, Factor: 1}}},
			{Name: "first", Factors: []fem.CaseFactor{{Case: 1, Factor: 1}}},
		},
		Mesh: fem.MeshSettings{Elements: 32},
	}
	p, err := fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	cs, err := p.SolveCombinations(p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	sol, _ := cs.Solution(0)
	return m, cs, sol
}
