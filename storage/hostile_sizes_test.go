package storage

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"stave/fem"
)

// hostileSpan is the length of the large members below, m.
const hostileSpan = 30

// spread is the i-th of n+1 increasing points from 0 to hostileSpan, each
// inner one moved off its grid by up to a tenth of the spacing.
func spread(i, n int) float64 {
	if i == 0 || i == n {
		return hostileSpan * float64(i/n)
	}
	return hostileSpan * (float64(i) + 0.1*math.Sin(float64(i))) / float64(n)
}

// rippledLine is a transverse line load of n vertices over the member.
func rippledLine(n int) fem.DistributedLoad {
	line := fem.DistributedLoad{Direction: fem.Transverse}
	for i := range n {
		line.Points = append(line.Points, fem.LoadPoint{X: spread(i, n-1), Intensity: -1e4 * (1 + 0.3*math.Sin(float64(i)/50))})
	}
	return line
}

// hostileSizes are valid members of the sizes a user can reach by script
// or by patience (invented data): thousands of key points of each kind.
// Positions are what a program computing them writes, full float64 digits,
// not numbers rounded to a grid, so their files are as large as such
// members' files get.
func hostileSizes() []struct {
	name  string
	model fem.Model
} {
	steel := fem.Material{Name: "steel", Elastic: 2e11}
	section := fem.Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1}
	plain := func() fem.Model {
		return fem.Model{
			Segments: []fem.Segment{{Start: 0, End: hostileSpan, Section: section, Material: steel}},
			Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: hostileSpan, Kind: fem.Roller}},
		}
	}
	uniform := fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e4}, {X: hostileSpan, Intensity: -1e4}}}

	segments := plain()
	segments.Segments = nil
	for i := range 3000 {
		s := fem.Segment{Start: spread(i, 3000), End: spread(i+1, 3000), Section: section, Material: steel}
		s.Section.SecondMoment *= 1 + 0.5*float64(i%2)
		segments.Segments = append(segments.Segments, s)
	}
	segments.DistributedLoad = []fem.DistributedLoad{uniform}

	points := plain()
	for i := range 3000 {
		points.PointLoads = append(points.PointLoads, fem.PointLoad{X: spread(2*i+1, 6000), Transverse: -1000 * (1 + math.Cos(float64(i)))})
	}

	vertices := plain()
	vertices.DistributedLoad = []fem.DistributedLoad{rippledLine(20000)}

	supports := plain()
	supports.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}}
	for i := 1; i < 3000; i++ {
		supports.Supports = append(supports.Supports, fem.Support{X: spread(i, 2999), Kind: fem.Roller})
	}
	supports.DistributedLoad = []fem.DistributedLoad{uniform}

	return []struct {
		name  string
		model fem.Model
	}{
		{"segments3000", segments},
		{"points3000", points},
		{"vertices20000", vertices},
		{"supports3000", supports},
	}
}

// A valid member of thousands of key points that Stave saves is one Stave
// loads back: the file size limit must not refuse what Stave wrote.
//
// With STAVE_HOSTILE_DIR set, the files (automatic mesh and 100,000
// elements) are written there for the survey in docs/performance.md.
func TestHostileSizesLoadAsSaved(t *testing.T) {
	dir := os.Getenv("STAVE_HOSTILE_DIR")
	for _, tt := range hostileSizes() {
		t.Run(tt.name, func(t *testing.T) {
			if err := tt.model.Validate(); err != nil {
				t.Fatalf("the member is not valid: %v", err)
			}
			for _, elements := range []int{0, 100_000} {
				p := &Project{Model: tt.model, View: DefaultView()}
				p.Model.Mesh.Elements = elements
				data := mustMarshal(t, p)
				if dir != "" {
					name := filepath.Join(dir, fmt.Sprintf("%s-e%d.json", tt.name, elements))
					if err := os.WriteFile(name, data, 0o644); err != nil {
						t.Fatal(err)
					}
				}
				back, err := Unmarshal(data)
				if err != nil {
					t.Fatalf("a file of %d bytes that Stave saved does not load: %v", len(data), err)
				}
				if !reflect.DeepEqual(back.Model, p.Model) {
					t.Errorf("the member changed through its file")
				}
			}
		})
	}
}

// Save writes any member Validate accepts up to the file size Load reads,
// and refuses a bigger one saying why: Stave never writes a file it cannot
// read back. A line load of 45,000 vertices (about 2.2 MiB as saved) saves
// and loads; 200,000 vertices (about 10 MiB) is refused on saving, naming
// the limit.
func TestSavedValidMemberLoadsBack(t *testing.T) {
	const n = 45_000
	m := hostileSizes()[2].model // vertices20000
	m.DistributedLoad = []fem.DistributedLoad{rippledLine(n)}
	if err := m.Validate(); err != nil {
		t.Fatalf("the member is not valid: %v", err)
	}
	path := filepath.Join(t.TempDir(), "long-line-load.json")
	if err := Save(path, &Project{Model: m, View: DefaultView()}); err != nil {
		t.Fatalf("Save refused a valid member of %d load vertices: %v", n, err)
	}
	if _, err := Load(path); err != nil {
		info, _ := os.Stat(path)
		t.Fatalf("Stave saved a valid member (%d load vertices) to a file of %d bytes that it refuses to load: %v", n, info.Size(), err)
	}
	m.DistributedLoad = []fem.DistributedLoad{rippledLine(200_000)}
	big := filepath.Join(t.TempDir(), "longer-line-load.json")
	err := Save(big, &Project{Model: m, View: DefaultView()})
	if err == nil || !strings.Contains(err.Error(), "more than the 8.0 MiB") {
		t.Errorf("Save of a member whose file passes the limit gave %v", err)
	}
	if _, statErr := os.Stat(big); statErr == nil {
		t.Errorf("Save refused the file but wrote it")
	}
}
