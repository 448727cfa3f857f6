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

// BenchmarkRunManySupports times Run on a beam over thousands of equal
// spans, each a part for the deflection checks and a column for buckling:
// the exact solution's stretches are matched to the parts holding them.
// Before the matching slid along the parts, 40,000 spans took 6 s here
// (`stave solve` of 100,000 spans, 49 s).
func BenchmarkRunManySupports(b *testing.B) {
	for _, spans := range []int{1000, 10000} {
		m := loadModel(b, "simply_supported_uniform.json")
		m.Mesh = fem.MeshSettings{Elements: spans}
		L := m.Length()
		m.Supports = m.Supports[:1]
		for i := 1; i <= spans; i++ {
			m.Supports = append(m.Supports, fem.Support{X: L * float64(i) / float64(spans), Kind: fem.Roller})
		}
		s, e := solveBoth(b, m)
		b.Run(fmt.Sprintf("spans=%d", spans), func(b *testing.B) {
			for b.Loop() {
				Run(m, s, e, Options{})
			}
		})
	}
}
