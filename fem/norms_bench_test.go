package fem_test

import (
	"fmt"
	"path/filepath"
	"testing"

	"stave/fem"
	"stave/storage"
)

func BenchmarkCompare(b *testing.B) {
	for _, elements := range []int{10000, 100000} {
		b.Run(fmt.Sprintf("elements=%d", elements), func(b *testing.B) {
			p, err := storage.Load(filepath.Join("..", "testdata", "demo.json"))
			if err != nil {
				b.Fatal(err)
			}
			m := &p.Model
			m.Mesh.Elements, m.Mesh.MaxElementLength = elements, 0
			s, err := fem.Solve(m)
			if err != nil {
				b.Fatal(err)
			}
			e, err := fem.SolveExact(m)
			if err != nil {
				b.Fatal(err)
			}
			b.ReportAllocs()
			for b.Loop() {
				fem.Compare(s, e)
			}
		})
	}
}
