package storage

import (
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
)

// Trains (version 2) survive saving and loading, and are written in the
// canonical form docs/format.md shows.
func TestTrainsRoundTrip(t *testing.T) {
	p := goldenProject()
	p.Trains = []moving.Train{
		{Name: "hoist trolley", Axles: []moving.Axle{{Load: 18e3}, {Load: 18e3, Spacing: 1.2}}, Direction: moving.Forward, OffEnds: true, Step: 0.05},
		{Axles: []moving.Axle{{Load: 5e3}}, Uniform: moving.UniformLoad{Load: 2e3, Start: 0.5, Length: 1.5}, From: 0.5, To: 3.5},
	}
	data := mustMarshal(t, p)
	want := `  "trains": [
    {
      "name": "hoist trolley",
      "axles": [
        {
          "load": 18000
        },
        {
          "load": 18000,
          "spacing": 1.2
        }
      ],
      "off_ends": true,
      "direction": "forward",
      "step": 0.05
    },
    {
      "axles": [
        {
          "load": 5000
        }
      ],
      "uniform": {
        "load": 2000,
        "start": 0.5,
        "length": 1.5
      },
      "from": 0.5,
      "to": 3.5
    }
  ],
  "mesh": {`
	if !strings.Contains(string(data), want) {
		t.Errorf("the trains are not written as expected; the file:\n%s", data)
	}
	back, err := Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(back.Trains, p.Trains) {
		t.Errorf("read back %+v, want %+v", back.Trains, p.Trains)
	}
}

// A file's trains are checked like the rest of it: each problem at its
// place, in the train's own words.
func TestTrainProblemsInFiles(t *testing.T) {
	for _, c := range []struct {
		name, trains, path, says string
	}{
		{"zero spacing", `[{"axles": [{"load": 1000}, {"load": 1000, "spacing": 0}]}]`, "trains[0].axles[1].spacing", "must be above zero"},
		{"negative step", `[{"axles": [{"load": 1000}], "step": -0.1}]`, "trains[0].step", `train 1: the step is -0.1 m`},
		{"unknown direction", `[{"axles": [{"load": 1000}], "direction": "sideways"}]`, "trains[0].direction", `"sideways" is not a direction`},
		{"unknown key", `[{"axles": [{"load": 1000, "weight": 3}]}]`, "trains[0].axles[0].weight", ""},
		{"missing load", `[{"axles": [{"spacing": 2}]}]`, "trains[0].axles[0].load", ""},
		{"a name with a control character", `[{"name": "a\u0007b", "axles": [{"load": 1000}]}]`, "trains[0].name", "control character"},
	} {
		t.Run(c.name, func(t *testing.T) {
			data := strings.Replace(string(mustMarshal(t, goldenProject())), `  "mesh": {`, `  "trains": `+c.trains+",\n"+`  "mesh": {`, 1)
			_, err := Unmarshal([]byte(data))
			le, ok := err.(*LoadError)
			if !ok {
				t.Fatalf("got %v, want a *LoadError", err)
			}
			for _, p := range le.Problems {
				if p.Path == c.path && strings.Contains(p.Message, c.says) {
					return
				}
			}
			t.Errorf("problems %v: want one at %s saying %q", le.Problems, c.path, c.says)
		})
	}
}

// A train that does not fit on the member, or whose step gives too many
// positions on it, stays in the file: shortening the member in the window
// must not make a file that no longer opens. It is reported when used.
func TestTrainsThatDoNotFitStillOpen(t *testing.T) {
	p := goldenProject() // a member of 4 m
	p.Trains = []moving.Train{
		{Name: "long", Axles: []moving.Axle{{Load: 1000}, {Load: 1000, Spacing: 9}}},
		{Name: "fine", Axles: []moving.Axle{{Load: 1000}}, Step: 1e-6},
	}
	back, err := Unmarshal(mustMarshal(t, p))
	if err != nil {
		t.Fatalf("the file does not open: %v", err)
	}
	for i, says := range []string{"does not fit on the 4 m", "Stave takes at most 100000"} {
		if err := back.Trains[i].Check(back.Model.Length(), i, units.Base); err == nil || !strings.Contains(err.Error(), says) {
			t.Errorf("train %d: %v, want a message saying %q", i+1, err, says)
		}
	}
}

// A combination takes a train by its name: saved and read back it keeps
// it; a name that is no train of the file is refused where it stands.
func TestCombinationTakesATrain(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "testdata", "two_span_cases.json"))
	if err != nil {
		t.Fatal(err)
	}
	withTrain := func(name string) []byte {
		s := strings.Replace(string(data), `"combinations": [`, `"trains": [{"name": "trolley", "axles": [{"load": 12000}, {"load": 12000, "spacing": 1.2}]}],
  "combinations": [{"name": "with trolley", "kind": "strength", "factors": [{"case": "both spans", "factor": 1.35}, {"train": "`+name+`", "factor": 1.5}]},`, 1)
		if s == string(data) {
			t.Fatal("the file has no combinations to add to")
		}
		return []byte(s)
	}
	p, err := Unmarshal(withTrain("trolley"))
	if err != nil {
		t.Fatal(err)
	}
	if cb := p.Model.Combinations[0]; len(cb.Trains) != 1 || cb.Trains[0] != (fem.TrainFactor{Train: 0, Factor: 1.5}) || len(cb.Factors) != 1 {
		t.Fatalf("the combination reads as %+v, want case 1 at 1.35 and the trolley at 1.5", cb)
	}
	saved, err := Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(saved), `"train": "trolley"`) {
		t.Errorf("saved without the train's factor:\n%s", saved)
	}
	_, err = Unmarshal(withTrain("trolly"))
	if err == nil || !strings.Contains(err.Error(), `combinations[0].factors[1].train: "trolly" is not a train of this file; use one of "trolley"`) {
		t.Errorf("an unknown train: %v", err)
	}
}

// The memory estimate counts the envelopes of the file's trains, which
// live outside the model: the runway example with its two trains fits at
// 500,000 elements and is refused at 520,000 (the model's own 400 B per
// element, each train's 4,000 B: about 511,000 fit in 4 GiB), naming the
// mesh and the trains; without its trains, 520,000 elements fit. Each
// train's envelope grew `stave solve`'s resident memory by about 1 KB per
// element (runway example, 100,000 and 400,000 elements, measured 5
// December); the limit is Stave's own (fem.Validate's memory estimate).
func TestTrainsCountInTheMemoryEstimate(t *testing.T) {
	p, err := Load(filepath.Join("..", "testdata", "moving", "runway.json"))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		elements int
		trains   bool
		refused  bool
	}{{500_000, true, false}, {520_000, true, true}, {520_000, false, false}} {
		q := *p
		q.Model.Mesh.Elements = c.elements
		if !c.trains {
			q.Trains = nil
		}
		err := Validate(&q)
		switch {
		case c.refused && (err == nil || !strings.Contains(err.Error(), "mesh.elements") || !strings.Contains(err.Error(), "2 moving load trains")):
			t.Errorf("%d elements with trains %v: %v; want the mesh refused for the 2 moving load trains' envelopes", c.elements, c.trains, err)
		case !c.refused && err != nil:
			t.Errorf("%d elements with trains %v refused: %v", c.elements, c.trains, err)
		}
	}
}
