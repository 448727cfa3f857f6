package analysis

import (
	"context"
	"runtime"
	"strconv"
	"testing"

	"stave/fem"
	"stave/fem/check"
)

// TestMemoryPerLoadSet measures what Run allocates per element, as the
// growth of runtime.MemStats.TotalAlloc from 50,000 to 100,000 elements,
// for models with load cases, and holds it to what fem's memory estimate
// takes (fem.Model.AllocationPerElement). The estimate once counted only
// the cases: one case in four combinations allocated 263 B per element
// where it counted 100.
func TestMemoryPerLoadSet(t *testing.T) {
	if testing.Short() {
		t.Skip("allocates large meshes")
	}
	for _, c := range []struct {
		spans, cases, combos int
		bySpan               bool
	}{
		{2, 1, 1, false},
		{2, 1, 4, false},
		{2, 4, 1, false},
		{2, 2, 3, true},
		{8, 2, 3, true},
		{5, 1, 0, true}, // no combinations: the case alone is the envelope's
	} {
		name := strconv.Itoa(c.spans) + " spans, " + strconv.Itoa(c.cases) + " cases, " + strconv.Itoa(c.combos) + " combinations"
		if c.bySpan {
			name += ", the last case placed by span"
		}
		lo, hi := runAllocated(t, memoryModel(50_000, c.spans, c.cases, c.combos, c.bySpan)), runAllocated(t, memoryModel(100_000, c.spans, c.cases, c.combos, c.bySpan))
		m := memoryModel(100_000, c.spans, c.cases, c.combos, c.bySpan)
		perElement, budget := (hi-lo)/50_000, m.AllocationPerElement()
		t.Logf("%s: Run allocates %.0f B per element, the estimate takes %.0f", name, perElement, budget)
		if perElement > budget {
			t.Errorf("%s: Run allocates %.0f B per element, more than the %.0f the memory estimate takes", name, perElement, budget)
		}
	}
}

// memoryModel is a beam 8 m long over equal spans with n elements, cases
// of uniform loads (the last placed by span when bySpan) and combos
// combinations of them all.
func memoryModel(n, spans, cases, combos int, bySpan bool) fem.Model {
	m := fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 8, Section: fem.Section{Area: 0.004, SecondMoment: 1.6e-5, FibreDistance: 0.1}, Material: fem.Material{Elastic: 2e11}}},
		Supports: []fem.Support{{X: 0, Kind: fem.Pinned}},
		Mesh:     fem.MeshSettings{Elements: n},
	}
	for s := 1; s <= spans; s++ {
		m.Supports = append(m.Supports, fem.Support{X: 8 * float64(s) / float64(spans), Kind: fem.Roller})
	}
	for k := range cases {
		m.Cases = append(m.Cases, fem.LoadCase{Name: "case " + strconv.Itoa(k+1), BySpan: bySpan && k == cases-1,
			DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -1e4 - float64(k)}, {X: 8, Intensity: -1e4}}}}})
	}
	for j := range combos {
		cb := fem.Combination{Name: "combination " + strconv.Itoa(j+1)}
		for k := range cases {
			cb.Factors = append(cb.Factors, fem.CaseFactor{Case: k, Factor: 1 + 0.1*float64(j)})
		}
		m.Combinations = append(m.Combinations, cb)
	}
	return m
}

// runAllocated is the bytes Run allocates on m, the least of two runs
// (another test's goroutine may add bytes to a run, never take any).
func runAllocated(t *testing.T, m fem.Model) float64 {
	t.Helper()
	least := 0.0
	for i := range 2 {
		var before, after runtime.MemStats
		runtime.GC()
		runtime.ReadMemStats(&before)
		a, err := Run(context.Background(), Request{Model: m.Clone(), Checks: check.DefaultOptions()})
		if err != nil || a.Err != nil {
			t.Fatalf("%v %v", err, a.Err)
		}
		runtime.ReadMemStats(&after)
		if b := float64(after.TotalAlloc - before.TotalAlloc); i == 0 || b < least {
			least = b
		}
	}
	return least
}
