package fem

import (
	"math"
	"strings"
	"testing"
)

func TestBuildMesh(t *testing.T) {
	base := func() *Model {
		m := testModel(Support{X: 0, Kind: Pinned}, Support{X: 4, Kind: Roller})
		m.PointLoads = []PointLoad{{X: 1.5, Transverse: -1}}
		return m
	}
	cases := []struct {
		name string
		mesh MeshSettings
		want []float64
	}{
		// Key points 0, 1.5, 4, 6: stretches of 1.5, 2.5 and 2 m.
		{"one element per stretch by default", MeshSettings{}, []float64{0, 1.5, 4, 6}},
		{"count shared by length", MeshSettings{Elements: 12}, []float64{0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6}},
		// round(2·1.5/6) = 1 (rounds half away from zero: 0.5 → 1), round(2·2.5/6) = 1, round(2·2/6) = 1.
		{"at least one per stretch", MeshSettings{Elements: 2}, []float64{0, 1.5, 4, 6}},
		{"maximum length", MeshSettings{MaxElementLength: 1}, []float64{0, 0.75, 1.5, 1.5 + 2.5/3, 1.5 + 5.0/3, 4, 5, 6}},
		{"finer rule wins", MeshSettings{Elements: 3, MaxElementLength: 2}, []float64{0, 1.5, 2.75, 4, 6}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := base()
			m.Mesh = c.mesh
			mesh, err := BuildMesh(m)
			if err != nil {
				t.Fatal(err)
			}
			if len(mesh.X) != len(c.want) {
				t.Fatalf("nodes %v, want %v", mesh.X, c.want)
			}
			for i := range c.want {
				if math.Abs(mesh.X[i]-c.want[i]) > 1e-12 {
					t.Fatalf("nodes %v, want %v", mesh.X, c.want)
				}
			}
			if err := checkMesh(m, KeyPoints(m), mesh); err != nil {
				t.Error(err)
			}
		})
	}
}

func TestKeyPointsMergeAndSegments(t *testing.T) {
	m := mixedModel(1)            // one element per stretch
	m.Supports[1].X = 3.2 + 1e-14 // closer than 1e-12·L to the point load below
	m.PointLoads = append(m.PointLoads, PointLoad{X: 3.2, Transverse: -1})
	mesh, err := BuildMesh(m)
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{0, 0.5, 1, 1.3, 2, 2.5, 3.2, 4, 4.5, 5.5, 6, 6.1, 7}
	if len(mesh.X) != len(want) {
		t.Fatalf("nodes %v, want %v", mesh.X, want)
	}
	for i, e := range mesh.Elements {
		mid := 0.5 * (e.Start + e.End)
		if s := m.Segments[e.Segment]; mid < s.Start || mid > s.End {
			t.Errorf("element %d (%g to %g) assigned to segment %d (%g to %g)", i, e.Start, e.End, e.Segment, s.Start, s.End)
		}
	}
}

func TestMeshFromNodes(t *testing.T) {
	m := testModel(Support{X: 0, Kind: Fixed}, Support{X: 2.5, Kind: Roller})
	mesh, err := MeshFromNodes(m, []float64{0, 0.1, 0.2, 2.5 - 1e-13, 5.9})
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{0, 0.1, 0.2, 2.5, 5.9, 6}
	if len(mesh.X) != len(want) {
		t.Fatalf("nodes %v, want %v", mesh.X, want)
	}
	for i := range want {
		if mesh.X[i] != want[i] {
			t.Fatalf("nodes %v, want %v", mesh.X, want)
		}
	}
	for _, bad := range [][]float64{{0, 2, 1}, {0, 7}, {math.NaN()}} {
		if _, err := MeshFromNodes(m, bad); err == nil {
			t.Errorf("nodes %v accepted", bad)
		}
	}
	// A mesh that misses a key point is refused by SolveOnMesh.
	m.PointLoads = []PointLoad{{X: 4, Transverse: -1}}
	if _, err := SolveOnMesh(m, mesh); err == nil || !strings.Contains(err.Error(), "no node at the key point x = 4.0 m") {
		t.Errorf("got %v, want a missing key point error", err)
	}
}
