package fem

import (
	"math"
	"testing"
)

// TestClosedSamplesOfAStretchAreBounded: the comparison with the exact
// solution samples each element on a foundation sixteen times (and
// integrates it in two Gauss panels) per unit of λ over it. Capped at 10⁵
// units an element, a fine mesh under a stretch of extreme λ (a 10 m beam
// on a bed of 1e60 N/m², λ about 2e14, cut into the automatic mesh's
// 200,000 elements) sampled 3e11 times and `stave solve` ran for minutes.
// The elements of a stretch now share at most 10⁵ units beyond sixteen
// each, while an element of moderate λ is sampled as before.
func TestClosedSamplesOfAStretchAreBounded(t *testing.T) {
	for _, tc := range []struct {
		name      string
		waves     float64 // λ of the stretch
		intervals int
	}{
		{"one element, moderate lambda", 19, 1},
		{"a few elements, moderate lambda", 400, 10},
		{"fine mesh, extreme lambda", 2e14, 1000},
		{"one element, extreme lambda", 2e14, 1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s := &exactStretch{length: 10}
			s.beam.ground.scale = tc.waves
			pieces, panels := 0, 0
			var v Interval
			for i := range tc.intervals {
				span := 1 / float64(tc.intervals)
				v.setClosed(s, float64(i)*span, span, 10*float64(i)*span, 10*float64(i+1)*span)
				pieces += v.closedPieces()
				panels += v.closedPanels()
			}
			units := tc.waves
			if units/float64(tc.intervals) <= 16 { // sampled as before
				want := tc.intervals * (8 + int(math.Ceil(16*units/float64(tc.intervals))))
				if pieces != want {
					t.Errorf("%d pieces, want %d", pieces, want)
				}
			}
			// At most 10⁵ units a stretch beyond 16 an interval (and
			// round-up).
			if bound := tc.intervals*(8+16*17) + 16*100_000; pieces > bound {
				t.Errorf("%d pieces in all, more than %d", pieces, bound)
			}
			if bound := tc.intervals*(1+2*17) + 2*100_000; panels > bound {
				t.Errorf("%d panels in all, more than %d", panels, bound)
			}
		})
	}
}

// TestStretchRangesReadAlone: the stretches' ranges are worked out on
// intervals that keep their closed-form readings (closedRead), in two
// halves at once from parallelStretches stretches on. Each range must be
// the one a fresh interval that keeps nothing finds for its stretch alone,
// to the bit: a reading kept from another stretch, or another quantity's
// search steered by one, would move it.
func TestStretchRangesReadAlone(t *testing.T) {
	const L, n = 12.0, parallelStretches + 88
	m := groundModel(L, 2.4e7)
	m.Gravity = [2]float64{0, -9.80665}
	for i := range n {
		// Uneven places and sizes, so that no two stretches are alike.
		x := L * (float64(i) + 0.5 + 0.3*math.Sin(float64(i))) / n
		m.PointLoads = append(m.PointLoads, PointLoad{X: x, Axial: 10 * float64(i%7), Transverse: -1e3 * (1 + float64(i%5))})
	}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	if len(e.stretches) < parallelStretches {
		t.Fatalf("%d stretches: the test needs %d or more", len(e.stretches), parallelStretches)
	}
	ranges := e.stretchRanges()
	closed := 0
	for j := range e.stretches {
		s := &e.stretches[j]
		var v Interval
		s.interval(0, 1, s.start, s.end, &v)
		if v.closed.stretch != nil {
			closed++
		}
		for q := range Quantity(quantityCount) {
			var want [2]extremum
			v.rangeOf(q, &want)
			if got := ranges[j][q]; got != want {
				t.Fatalf("stretch %d, %v: range %v, alone %v", j, q, got, want)
			}
		}
		kept := memoInterval()
		e.stretchInterval(j, ranges, kept)
		for _, sign := range []float64{1, -1} {
			wl, wh := v.fibreRange(sign)
			gl, gh := kept.fibreRange(sign)
			if gl != wl || gh != wh {
				t.Fatalf("stretch %d, fibre %v: range %v %v, alone %v %v", j, sign, gl, gh, wl, wh)
			}
		}
	}
	if closed < parallelStretches {
		t.Fatalf("%d stretches in closed form: the test needs %d or more", closed, parallelStretches)
	}
}
