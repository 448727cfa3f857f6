package storage

import (
	"os"
	"path/filepath"
	"reflect"
	"regexp"
	"testing"

	"stave/fem"
)

// A version 1 file keeps opening: it reads as the same project as its
// version 2 counterpart, and saving writes version 2.
func TestVersion1Opens(t *testing.T) {
	old, err := Load(filepath.Join("testdata", "version1", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	now, err := Load(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(old.Model, now.Model) || !reflect.DeepEqual(old.View, now.View) || old.Notes != now.Notes {
		t.Error("the version 1 demo reads differently from the version 2 one")
	}
	saved, err := Marshal(old)
	if err != nil {
		t.Fatal(err)
	}
	want, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	if string(saved) != string(want) {
		t.Error("the version 1 demo saved does not give the version 2 file")
	}
}

// The additions of version 2 survive saving and loading: a roller with a
// rotational spring, an axial-only member, hinges, foundations.
func TestVersion2Additions(t *testing.T) {
	p := goldenProject()
	p.Model.Supports[1].Stiffness = [3]float64{0, 0, 4.5e6} // the roller's rotational spring
	p.Model.AxialOnly = true
	p.Model.PointLoads, p.Model.DistributedLoad, p.LoadOrder = nil, nil, nil
	p.Model.Gravity = [2]float64{}
	p.Model.Supports[0].Settlement = [3]float64{}
	back, err := Unmarshal(mustMarshal(t, p))
	if err != nil {
		t.Fatal(err)
	}
	if !back.Model.AxialOnly || back.Model.Supports[1].Stiffness != [3]float64{0, 0, 4.5e6} {
		t.Errorf("read back axial-only %v, support %+v", back.Model.AxialOnly, back.Model.Supports[1])
	}
	p = goldenProject()
	p.Model.Hinges = []fem.Hinge{{X: 1.2}, {X: 3.1, Stiffness: 2e6}}
	back, err = Unmarshal(mustMarshal(t, p))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(back.Model.Hinges, p.Model.Hinges) {
		t.Errorf("hinges read back as %+v, want %+v", back.Model.Hinges, p.Model.Hinges)
	}
	p = goldenProject()
	p.Model.Foundations = []fem.Foundation{{Start: 0.5, End: 3, Modulus: 2.5e7}, {Start: 1, End: 2, AxialModulus: 4e6}}
	p.Model.Mesh.BarOrder = fem.LinearBar // quadratic bars take no axial foundation
	back, err = Unmarshal(mustMarshal(t, p))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(back.Model.Foundations, p.Model.Foundations) {
		t.Errorf("foundations read back as %+v, want %+v", back.Model.Foundations, p.Model.Foundations)
	}
}

// A file that leaves the mesh out, or its number of elements, lets Stave
// choose the mesh, as "elements": 0 does.
func TestMeshLeftOutIsAutomatic(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "testdata", "simply_supported_uniform.json"))
	if err != nil {
		t.Fatal(err)
	}
	p, err := Unmarshal(data)
	if err != nil {
		t.Fatal(err)
	}
	p.Model.Mesh = fem.MeshSettings{}
	full, err := Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	for name, cut := range map[string]*regexp.Regexp{
		"no mesh":     regexp.MustCompile(`"mesh": \{\s*"elements": 0\s*\},`),
		"no elements": regexp.MustCompile(`"elements": 0`),
	} {
		text := cut.ReplaceAllString(string(full), "")
		if text == string(full) {
			t.Fatalf("%s: the saved file has nothing to leave out:\n%s", name, full)
		}
		q, err := Unmarshal([]byte(text))
		if err != nil {
			t.Errorf("%s: %v\n%s", name, err, text)
			continue
		}
		if q.Model.Mesh != (fem.MeshSettings{}) {
			t.Errorf("%s: mesh %+v, want the automatic one", name, q.Model.Mesh)
		}
	}
}
