package bench

import (
	"fmt"
	"testing"

	"stave/fem"
	"stave/fem/band"
)

// The Go benchmarks below are the `go test -bench` view of the same
// measurements, with the allocation counts -benchmem adds; Run is the full
// report with the comparisons and targets.

var benchmarkSizes = []int{1_000, 10_000, 100_000}

func BenchmarkSolve(b *testing.B) {
	for _, bm := range benchModels {
		for _, size := range benchmarkSizes {
			m := bm.build(size)
			b.Run(fmt.Sprintf("%s/elements=%d", bm.name, size), func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					s, err := fem.Solve(m)
					if err != nil {
						b.Fatal(err)
					}
					fem.Summarize(s, nil)
				}
			})
		}
	}
}

func BenchmarkKernel(b *testing.B) {
	for _, bm := range benchModels {
		for _, size := range benchmarkSizes {
			m := bm.build(size)
			mesh, err := fem.BuildMesh(m)
			if err != nil {
				b.Fatal(err)
			}
			sys, err := Assemble(m, mesh, bm.problem)
			if err != nil {
				b.Fatal(err)
			}
			// As in Run: a system singular to working precision (the fine
			// beam from 100,000 elements) is timed on its stand-in.
			a, rhs := sys.A, sys.B
			x := make([]float64, a.N)
			system := "model"
			var probe band.LDL
			if probe.FactorizeSolve(a, x, rhs) != nil {
				a, system = standIn(a), "stand-in"
			}
			b.Run(fmt.Sprintf("%s/elements=%d/%s/BandLDL", bm.name, size, system), func(b *testing.B) {
				var f band.LDL
				for b.Loop() {
					if err := f.FactorizeSolve(a, x, rhs); err != nil {
						b.Fatal(err)
					}
				}
			})
			factor := make([]float64, len(a.Data))
			b.Run(fmt.Sprintf("%s/elements=%d/%s/Pbtrf+Pbtrs", bm.name, size, system), func(b *testing.B) {
				for b.Loop() {
					if !gonumBandSolve(a, rhs, factor, x) {
						b.Fatal("Pbtrf refused the system")
					}
				}
			})
		}
	}
}
