package fem

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

// problemsWith is the messages of m's validation problems that hold text.
func problemsWith(t *testing.T, m *Model, text string) []string {
	t.Helper()
	var ve *ValidationError
	if err := m.Validate(); !errors.As(err, &ve) {
		t.Fatalf("got %v, want a *ValidationError", err)
	}
	var out []string
	for _, p := range ve.Problems {
		if strings.Contains(p.Message, text) {
			out = append(out, p.Message)
		}
	}
	return out
}

// Hundreds of hinges, supports and moment loads at one point (a script's
// slip) are each refused once, naming the lowest-numbered item they clash
// with, as duplicate supports are: not once per pair, which made 20,000
// hinges at one point 200 million problems (more than 5 GB, not finished
// in 60 s).
func TestValidateCrowdedHingesNameOnePair(t *testing.T) {
	const n = 300
	m := validModel()
	for range n {
		m.Hinges = append(m.Hinges, Hinge{X: 2})
		m.Supports = append(m.Supports, Support{X: 2, Kind: Fixed})
		m.PointLoads = append(m.PointLoads, PointLoad{X: 2, Moment: 1e3})
	}
	for _, c := range []struct {
		text string
		want func(i int) string // the problem of the i-th item (from 0)
		from int                // the first item with a problem
	}{
		{"keep one hinge per point", func(i int) string { return fmt.Sprintf("hinges 1 and %d are both at x = 2.0 m", i+1) }, 1},
		{"which holds the rotation", func(i int) string { return fmt.Sprintf("hinge %d is at support 3 (x = 2.0 m)", i+1) }, 0},
		{"puts a moment on hinge", func(i int) string { return fmt.Sprintf("point load %d puts a moment on hinge 1 (x = 2.0 m)", i+2) }, 0},
	} {
		got := problemsWith(t, m, c.text)
		if len(got) != n-c.from {
			t.Errorf("%q: %d problems, want one for each of %d items", c.text, len(got), n-c.from)
			continue
		}
		for i, msg := range got {
			if want := c.want(i + c.from); !strings.HasPrefix(msg, want) {
				t.Errorf("%q: problem %d is %q, want it to start %q", c.text, i, msg, want)
				break
			}
		}
	}
	// A pure hinge at a crowd of rollers names the first roller there.
	m = validModel()
	for range n {
		m.Hinges = append(m.Hinges, Hinge{X: 2})
		m.Supports = append(m.Supports, Support{X: 2, Kind: Roller})
	}
	if got := problemsWith(t, m, "already lets the member turn there"); len(got) != n || !strings.HasPrefix(got[n-1], fmt.Sprintf("hinge %d is at support 3 (x = 2.0 m), a roller support", n)) {
		t.Errorf("%d problems of hinges at rollers, want %d naming support 3, the last %q", len(got), n, got[len(got)-1:])
	}
}

// lowestWithin gives, for random crowded places and queries, the lowest
// index within the tolerance that a look at every pair finds.
func TestLowestWithinAsEveryPair(t *testing.T) {
	r := rand.New(rand.NewPCG(5, 23))
	const tol = 1e-3
	for round := range 50 {
		xs := make([]float64, r.IntN(60))
		qs := make([]float64, r.IntN(60))
		for _, s := range [][]float64{xs, qs} {
			for i := range s {
				s[i] = float64(r.IntN(8)) + float64(r.IntN(5)-2)*0.6*tol
				if r.IntN(20) == 0 {
					s[i] = []float64{math.NaN(), math.Inf(1), math.Inf(-1)}[r.IntN(3)]
				}
			}
		}
		want := make([]int, len(qs))
		for i, q := range qs {
			want[i] = -1
			for j, x := range xs {
				if math.Abs(x-q) <= tol {
					want[i] = j
					break
				}
			}
		}
		if got := lowestWithin(xs, qs, tol); !slices.Equal(got, want) {
			t.Fatalf("round %d: places %v, queries %v: got %v, want %v", round, xs, qs, got, want)
		}
	}
}

// A case placed by span over more spans than MaxPatternSpans is refused,
// naming the case and the count: each arrangement of loaded spans is
// solved and checked whole, for every span's check, so the work grew with
// the cube of the spans (200 spans: more than 60 s and 1.5 GB); up to the
// limit it is accepted.
func TestValidatePatternSpansLimit(t *testing.T) {
	model := func(spans int) *Model {
		L := float64(spans)
		m := &Model{Segments: []Segment{testSegment(0, L)}, Supports: []Support{{X: 0, Kind: Pinned}}}
		for i := 1; i <= spans; i++ {
			m.Supports = append(m.Supports, Support{X: float64(i), Kind: Roller})
		}
		uniform := []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, -1e3}, {L, -1e3}}}}
		m.Cases = []LoadCase{{Name: "permanent", DistributedLoad: uniform}, {Name: "imposed", DistributedLoad: uniform, BySpan: true}}
		m.Combinations = []Combination{{Name: "all", Factors: []CaseFactor{{Case: 0, Factor: 1}, {Case: 1, Factor: 1}}}}
		return m
	}
	if err := model(MaxPatternSpans).Validate(); err != nil {
		t.Errorf("%d spans placed by span: %v, want it accepted", MaxPatternSpans, err)
	}
	var ve *ValidationError
	err := model(MaxPatternSpans + 1).Validate()
	want := fmt.Sprintf("load case \"imposed\" is placed by span over %d spans, more than the %d", MaxPatternSpans+1, MaxPatternSpans)
	if !errors.As(err, &ve) || len(ve.Problems) != 1 || ve.Problems[0].Place != (Place{Item: Item{Kind: CaseItem, Index: 1}}) || !strings.HasPrefix(ve.Problems[0].Message, want) {
		t.Errorf("%d spans placed by span: %v, want one problem at the case starting %q", MaxPatternSpans+1, err, want)
	}
}

// Combinations that take moving load trains more than MaxTrainEntries
// times in all are refused at the combination where the count passes the
// limit: each train in each combination is an envelope of its own, so 80
// trains in each of 80 combinations of a 10 m span took 11 s and 1.3 GB,
// and the count grows with the product; up to the limit they are accepted.
func TestValidateTrainEntriesLimit(t *testing.T) {
	model := func(entries int) *Model {
		m := &Model{Segments: []Segment{testSegment(0, 10)}, Supports: []Support{{X: 0, Kind: Pinned}, {X: 10, Kind: Roller}}}
		m.Cases = []LoadCase{{Name: "permanent", PointLoads: []PointLoad{{X: 5, Transverse: -1e3}}}}
		for k := 0; entries > 0; k++ {
			cb := Combination{Name: fmt.Sprint("c", k), Factors: []CaseFactor{{Case: 0, Factor: 1}}}
			for i := 0; i < 7 && entries > 0; i++ {
				cb.Trains = append(cb.Trains, TrainFactor{Train: i, Factor: 1.5})
				entries--
			}
			m.Combinations = append(m.Combinations, cb)
		}
		return m
	}
	if err := model(MaxTrainEntries).Validate(); err != nil {
		t.Errorf("%d train entries: %v, want them accepted", MaxTrainEntries, err)
	}
	var ve *ValidationError
	err := model(MaxTrainEntries + 1).Validate()
	at := Place{Item: Item{Kind: CombinationItem, Index: MaxTrainEntries / 7}, Property: FactorsProperty}
	want := fmt.Sprintf("the combinations take moving load trains %d times", MaxTrainEntries+1)
	if !errors.As(err, &ve) || len(ve.Problems) != 1 || ve.Problems[0].Place != at || !strings.Contains(ve.Problems[0].Message, want) {
		t.Errorf("%d train entries: %v, want one problem at %+v saying %q", MaxTrainEntries+1, err, at, want)
	}
}
