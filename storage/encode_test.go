package storage

import (
	"bytes"
	"errors"
	"flag"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"stave/fem"
)

var update = flag.Bool("update", false, "rewrite the golden files from the current encoder")

// goldenProject uses every part of the format: interleaved loads, a spring,
// a settlement, self-weight, temperature, notes that need escaping.
func goldenProject() *Project {
	steel := fem.Material{Name: "steel", Elastic: 2e11, Density: 7850, ThermalExpansion: 1.2e-5, Allowable: 2.5e8}
	return &Project{
		Notes: Notes{
			Project:  "Golden file",
			Member:   "G-1",
			Engineer: "A. Tester",
			Date:     "2025-06-01",
			Text:     "Covers every key.\nQuotes \" and <angle> & ampersand stay readable.",
		},
		Model: fem.Model{
			Segments: []fem.Segment{
				{Start: 0, End: 1.5, Section: fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1}, Material: steel},
				{Start: 1.5, End: 4, Section: fem.Section{Area: 0.003, SecondMoment: 5e-6, FibreDistance: 0.09}, Material: steel},
			},
			Supports: []fem.Support{
				{X: 0, Kind: fem.Fixed, Settlement: [3]float64{0, -0.002, 0.001}},
				{X: 2.5, Kind: fem.Roller},
				{X: 4, Kind: fem.Spring, Stiffness: [3]float64{0, 75000, 1e6}},
			},
			PointLoads: []fem.PointLoad{{X: 1, Axial: 500, Transverse: -2000, Moment: 300}},
			DistributedLoad: []fem.DistributedLoad{
				{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1000}, {X: 2, Intensity: -3000}, {X: 4, Intensity: -1000}}},
				{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 200}, {X: 4, Intensity: 200}}},
			},
			Gravity:           [2]float64{0, -fem.StandardGravity},
			TemperatureChange: -15,
			Mesh:              fem.MeshSettings{Elements: 12, MaxElementLength: 0.5, BarOrder: fem.QuadraticBar},
		},
		LoadOrder: []LoadKind{DistributedLoad, PointLoad, DistributedLoad},
		View: View{
			Units:           US,
			Overlays:        Overlays{DeformedShape: true, AxialForce: true, Stress: true, Nodes: true},
			Magnification:   50,
			GridStep:        0.25,
			DeflectionLimit: 240,
			SafetyFactor:    1.5,
		},
	}
}

func TestEncodeGolden(t *testing.T) {
	golden := filepath.Join("testdata", "golden", "project.json")
	p := goldenProject()
	got, err := Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	if *update {
		if err := os.WriteFile(golden, got, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatalf("%v (run go test ./storage -run Golden -update to write it)", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("encoding differs from %s:\n%s", golden, lineDiff(want, got))
	}
	back, err := Unmarshal(got)
	if err != nil {
		t.Fatalf("the golden project does not load: %v", err)
	}
	if !reflect.DeepEqual(back, p) {
		t.Errorf("the golden project loads back as\n%+v\nwant\n%+v", back, p)
	}
}

// A load order that no longer matches the loads (the application deleted
// one) still writes every load once: the order first, the rest after.
func TestStaleLoadOrderKeepsEveryLoad(t *testing.T) {
	p := goldenProject()
	p.LoadOrder = []LoadKind{PointLoad, PointLoad, PointLoad}
	data, err := Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	back, err := Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	want := []LoadKind{PointLoad, DistributedLoad, DistributedLoad}
	if !reflect.DeepEqual(back.LoadOrder, want) {
		t.Errorf("load order %v, want %v", back.LoadOrder, want)
	}
	if !reflect.DeepEqual(back.Model, p.Model) {
		t.Errorf("loads changed through a stale order")
	}
}

// A stiffness on a motion a support holds rigidly and a settlement of a
// free motion have no effect; files leave them out rather than store them.
// The springs of the motions a kind leaves free are kept.
func TestEncodeLeavesOutIgnoredSupportValues(t *testing.T) {
	p := goldenProject()
	p.Model.Supports[1].Stiffness = [3]float64{1, 2, 3}
	p.Model.Supports[1].Settlement = [3]float64{0.1, -0.003, 0.2} // a roller holds only the transverse motion
	back, err := Unmarshal(mustMarshal(t, p))
	if err != nil {
		t.Fatal(err)
	}
	got := back.Model.Supports[1]
	if got.Stiffness != [3]float64{1, 0, 3} || got.Settlement != [3]float64{0, -0.003, 0} {
		t.Errorf("roller read back as %+v, want axial and rotational springs and only the transverse settlement", got)
	}
}

func mustMarshal(t *testing.T, p *Project) []byte {
	t.Helper()
	data, err := Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

func TestEncodeRefusesNonFiniteValuesNamingThePlace(t *testing.T) {
	p := goldenProject()
	p.Model.Segments[1].Section.Area = math.NaN()
	p.Model.DistributedLoad[1].Points[1].Intensity = math.Inf(-1)
	_, err := Marshal(p)
	var se *SaveError
	if !errors.As(err, &se) || len(se.Problems) != 2 {
		t.Fatalf("got %v, want a *SaveError with two problems", err)
	}
	// The axial load is the third in the file (see goldenProject's LoadOrder).
	for _, path := range []string{"member.segments[1].section.area", "loads[2].points[1][1]"} {
		if !strings.Contains(err.Error(), path+": ") {
			t.Errorf("the error does not name %s:\n%v", path, err)
		}
	}
}

// Files leave optional settings out; reading fills in the defaults.
func TestDecodeFillsViewDefaults(t *testing.T) {
	demo := readDemo(t)
	start := strings.Index(demo, `,
  "view": {`)
	p, err := Unmarshal([]byte(demo[:start] + "\n}\n"))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(p.View, DefaultView()) {
		t.Errorf("view %+v, want the default %+v", p.View, DefaultView())
	}
}
