package batch

import (
	"fmt"
	"os"
	"path/filepath"
	"testing"

	"stave/fem"
	"stave/storage"
)

// scheduleMember is member i of an invented schedule of joists and lintels
// (demo data, no real building): a timber or steel member of 2.4 to 6 m,
// simply supported, propped, fixed at both ends or over two spans, under a
// uniform load and for every other member a point load, with an allowable
// stress so every design check has a limit. The spans and loads vary with
// i so that some members pass and some fail.
func scheduleMember(i int) *storage.Project {
	L := 2.4 + 0.1*float64(i%37)
	steel := i%3 == 0
	seg := fem.Segment{Start: 0, End: L,
		Section:  fem.Section{Area: 0.018, SecondMoment: 8.64e-5, FibreDistance: 0.12}, // 75 × 240 mm
		Material: fem.Material{Name: "timber", Elastic: 11e9, Density: 500, Allowable: 10e6}}
	if steel {
		seg.Section = fem.Section{Area: 2.85e-3, SecondMoment: 1.94e-5, FibreDistance: 0.1} // a 200 mm I-section
		seg.Material = fem.Material{Name: "steel", Elastic: 210e9, Density: 7850, Allowable: 165e6}
	}
	m := fem.Model{Segments: []fem.Segment{seg}, Gravity: [2]float64{0, -fem.StandardGravity}}
	switch i % 4 {
	case 0:
		m.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}
	case 1:
		m.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}}
	case 2:
		m.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}}
	case 3:
		m.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L / 2, Kind: fem.Roller}, {X: L, Kind: fem.Roller}}
	}
	q := -(1e3 + 60*float64(i%23))
	if steel {
		q *= 4
	}
	m.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: L, Intensity: q}}}}
	if i%2 == 1 {
		m.PointLoads = []fem.PointLoad{{X: L * float64(1+i%5) / 6, Transverse: 2 * q}}
	}
	return &storage.Project{
		Notes: storage.Notes{Project: "Invented schedule (demo data)", Member: fmt.Sprintf("J-%d", i+1)},
		Model: m, View: storage.DefaultView(),
	}
}

// writeSchedule writes members 0 to n-1 of the invented schedule into dir
// and returns their paths in order.
func writeSchedule(tb testing.TB, dir string, n int) []string {
	tb.Helper()
	paths := make([]string, n)
	for i := range paths {
		data, err := storage.Marshal(scheduleMember(i))
		if err != nil {
			tb.Fatal(err)
		}
		paths[i] = filepath.Join(dir, fmt.Sprintf("J-%05d.json", i+1))
		if err := os.WriteFile(paths[i], data, 0o644); err != nil {
			tb.Fatal(err)
		}
	}
	return paths
}
