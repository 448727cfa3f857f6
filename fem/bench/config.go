package bench

import (
	"io"
	"time"
)

// Part selects a section of the benchmark.
type Part uint

// The sections Run can measure.
const (
	EndToEnd  Part = 1 << iota // mesh, solve and fields through fem's public API
	Memory                     // bytes allocated and peak heap growth per element
	Kernels                    // ours vs Pbtrf+Pbtrs vs one copy of the band, on the identical system
	Dense                      // ours vs gonum's dense Cholesky on small identical systems
	Pitfall                    // mat.BandCholesky.Factorize vs Pbtrf
	Oversize                   // fem.Solve on a request beyond the machine's memory
	Pipeline                   // what `stave solve --json` waits for, stage by stage
	KeyPoints                  // the analysis with more and more point loads

	AllParts = EndToEnd | Memory | Kernels | Dense | Pitfall | Oversize | Pipeline | KeyPoints
)

// Config says what Run measures and how often.
type Config struct {
	// Elements lists the mesh sizes (requested elements) of the main table.
	Elements []int
	// ExponentFrom is the smallest size that enters the scaling exponent and
	// the bytes-per-element target: below it fixed costs hide the growth
	// with n. The table shows every size.
	ExponentFrom int
	// CoreCacheBytes is the cache private to one core (its second-level
	// cache on the development machine). A copy of the band measures memory
	// speed only where the band does not fit there: a band that fits stays
	// in that cache between repetitions and is read at cache speed, several
	// times faster than from memory (Go's copy writes arrays of 1 MiB and
	// more past the caches, so only the read side stays). The target on the
	// multiple of a band copy covers the rows whose band exceeds it; the
	// table shows every row. Zero means: ask the operating system (coreCache).
	CoreCacheBytes int64
	// DenseUnknowns lists the system sizes of the comparison with the dense
	// solver, whose cost grows as n³.
	DenseUnknowns []int
	// PitfallUnknowns lists the beam system sizes at which mat.BandCholesky is
	// timed; keep them at or below about 20,000, where it already takes seconds.
	PitfallUnknowns []int
	// OversizeElements is the mesh request sent to fem.Solve to show the refusal.
	OversizeElements int
	// KeyPointLoads lists the numbers of point loads of the key-point table,
	// on a beam of KeyPointElements elements (KeyPointModel).
	KeyPointLoads    []int
	KeyPointElements int
	// Repetitions of each timing; the median is reported.
	Repetitions int
	// MinBatch is the shortest interval timed at once; quicker operations are
	// repeated until it is reached, so the clock's resolution does not matter.
	MinBatch time.Duration
	// Parts selects the sections to run.
	Parts Part
	// Progress, when not nil, receives one line per step as the run goes.
	Progress io.Writer
}

// DefaultConfig is the full benchmark: 1e3 to 1e6 elements. It takes a
// minute or two on two cores.
func DefaultConfig() Config {
	return Config{
		Elements:         []int{1_000, 10_000, 100_000, 1_000_000},
		ExponentFrom:     10_000,
		DenseUnknowns:    []int{500, 1_000, 2_000},
		PitfallUnknowns:  []int{2_500, 5_000, 10_000, 20_000},
		OversizeElements: 1_000_000_000,
		KeyPointLoads:    []int{10, 100, 1_000, 10_000},
		KeyPointElements: 10_000,
		Repetitions:      5,
		MinBatch:         20 * time.Millisecond,
		Parts:            AllParts,
	}
}

// QuickConfig runs every part at small sizes, in a second or so; it is for
// tests and for checking that the harness works, not for numbers.
func QuickConfig() Config {
	return Config{
		Elements:         []int{200, 400, 800},
		ExponentFrom:     100,
		CoreCacheBytes:   16 << 10, // between the quick sizes' bands (3 to 50 KiB), to exercise both kinds of row
		DenseUnknowns:    []int{100, 200},
		PitfallUnknowns:  []int{500, 1_000},
		OversizeElements: 1_000_000_000,
		KeyPointLoads:    []int{4, 16, 64},
		KeyPointElements: 400,
		Repetitions:      3,
		MinBatch:         time.Millisecond,
		Parts:            AllParts,
	}
}
