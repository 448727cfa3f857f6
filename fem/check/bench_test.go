package check

import (
	"fmt"
	"path/filepath"
	"testing"

	"stave/fem"
	"stave/storage"
)

// loadModel reads one of the shared model files in testdata.
func loadModel(t testing.TB, name string) *fem.Model {
	t.Helper()
	p, err := storage.Load(filepath.Join("..", "..", "testdata", name))
	if err != nil {
		t.Fatalf("loading %s: %v", name, err)
	}
	return &p.Model
}

// BenchmarkRun times Run on the demo member, and the whole second stage of
// an edit: the exact solution, then every check.
func BenchmarkRun(b *testing.B) {
	for _, elements := range []int{10000, 100000} {
		m := loadModel(b, "demo.json")
		m.Mesh.Elements, m.Mesh.MaxElementLength = elements, 0
		s, e := solveBoth(b, m)
		b.Run(fmt.Sprintf("elements=%d", elements), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				Run(m, s, e, Options{})
			}
		})
		b.Run(fmt.Sprintf("elements=%d/exact+checks", elements), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				e, err := fem.SolveExact(m)
				if err != nil {
					b.Fatal(err)
				}
				Run(m, s, e, Options{})
			}
		})
	}
}
