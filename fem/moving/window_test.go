package moving

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"stave/fem"
)

// manySpans is a beam of n equal spans of span metres, pinned at 0 and on
// rollers elsewhere (invented), with the default mesh of beam.
func manySpans(n int, span float64) *fem.Model {
	sups := []fem.Support{{X: 0, Kind: fem.Pinned}}
	for i := 1; i <= n; i++ {
		sups = append(sups, fem.Support{X: span * float64(i), Kind: fem.Roller})
	}
	return beam(span*float64(n), sups...)
}

// windowCases are members over many supports and trains on them
// (invented), for the window tests: equal and uneven spans, fixed ends, an
// overhang, soft springs, hinges, and trains short and long, with a
// uniform load, one way and both, on part of the member, driving off it.
func windowCases() []struct {
	name  string
	m     *fem.Model
	train Train
} {
	two := Train{Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}
	uniform := Train{Axles: []Axle{{Load: 30e3}, {Load: 10e3, Spacing: 2}},
		Uniform: UniformLoad{Load: 3e3, Start: 0.5, Length: 6}, Direction: Backward, OffEnds: true}
	long := Train{Axles: []Axle{{Load: 20e3}}}
	for k := 1; k < 12; k++ {
		long.Axles = append(long.Axles, Axle{Load: 20e3 + 1e3*float64(k), Spacing: 0.7 + 0.1*float64(k%3)})
	}
	fixed := manySpans(40, 1.5)
	fixed.Supports[0].Kind, fixed.Supports[40].Kind = fem.Fixed, fem.Fixed
	overhang := manySpans(30, 2)
	overhang.Segments[0].End = 66
	uneven := beam(0)
	x := 0.0
	for i := range 50 {
		uneven.Supports = append(uneven.Supports, fem.Support{X: x, Kind: fem.Roller})
		x += 0.8 + 3.2*math.Abs(math.Sin(float64(7*i)))
	}
	uneven.Supports[0].Kind = fem.Pinned
	uneven.Segments[0].End = uneven.Supports[49].X
	springs := manySpans(40, 2)
	for i := 1; i < 40; i++ {
		springs.Supports[i] = fem.Support{X: 2 * float64(i), Kind: fem.Spring, Stiffness: [3]float64{fem.Transverse: 5e6}}
	}
	hinges := manySpans(40, 2)
	hinges.Hinges = []fem.Hinge{{X: 5}, {X: 33, Stiffness: 2e6}}
	short := two
	short.From, short.To = 10, 30
	off := two
	off.OffEnds, off.Direction = true, BothWays
	return []struct {
		name  string
		m     *fem.Model
		train Train
	}{
		{"60 equal spans, two axles", manySpans(60, 1), two},
		{"60 equal spans, two axles driving off", manySpans(60, 1), off},
		{"60 equal spans, uniform load", manySpans(60, 1.5), uniform},
		{"60 equal spans, 12 axles", manySpans(60, 2), long},
		{"40 spans fixed at both ends", fixed, two},
		{"overhang", overhang, off},
		{"50 uneven spans", uneven, long},
		{"soft springs", springs, two},
		{"hinges", hinges, uniform},
		{"short run", manySpans(100, 2), short},
	}
}

// wholeMember is what scanRuns finds, over the whole member: the lines
// filled along it and every position of the runs scanned.
func wholeMember(s *sweeps, rs []reader, runs []run, jumps []fem.Side) (hi, lo []extreme) {
	var ls lines
	ls.fill(s, rs)
	hi, lo = make([]extreme, len(rs)), make([]extreme, len(rs))
	for r := range runs {
		runs[r].scan(&ls, hi, lo, jumps, nil)
	}
	return hi, lo
}

// A station's lines filled and its train scanned over a window of the
// member give what the whole member gives: to the bit for a short train of
// axles alone, whose every position is summed afresh either way; to
// round-off for a uniform load (its integrals taken from the window's
// start) and a long train (its running sums begun afresh at the window).
// The tolerance, 1e-11 of the largest extreme of the quantity anywhere on
// the member, is round-off: a long train's sums carry 4e-13 of it either
// way (measured, docs/performance.md). At every station of the default
// mesh and every support's reactions; the test fails, too, if no window
// left anything out (it would test nothing).
func TestWindowedScanMatchesWholeMember(t *testing.T) {
	for _, c := range windowCases() {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			s := in.bending
			all, err := c.train.runs(c.m.Length(), p.Mesh())
			if err != nil {
				t.Fatal(err)
			}
			runs := workRuns(all, s)
			exact := len(c.train.Axles) <= shortTrain && c.train.Uniform.Load == 0
			type pair struct{ got, want [2]extreme }
			var got []pair
			scale := make(map[int]float64) // per line (row), the largest extreme
			cut := 0
			compare := func(rs []reader, jumps []fem.Side, row func(i int) int) {
				var ls lines
				var w window
				hi, lo := make([]extreme, len(rs)), make([]extreme, len(rs))
				scanRuns(s, &ls, &w, rs, runs, hi, lo, jumps)
				if !w.whole {
					cut++
				}
				whi, wlo := wholeMember(s, rs, runs, jumps)
				for i := range rs {
					got = append(got, pair{[2]extreme{hi[i], lo[i]}, [2]extreme{whi[i], wlo[i]}})
					k := row(i)
					scale[k] = max(scale[k], math.Abs(whi[i].value), math.Abs(wlo[i].value))
				}
			}
			var rows []int
			for _, x := range Stations(p.Mesh()) {
				for _, side := range []fem.Side{fem.Left, fem.Right} {
					rs := make([]reader, len(envelopeRows))
					in.stationReaders(s, x, side, rs)
					compare(rs, bothSides, func(i int) int { return i })
					rows = append(rows, 0, 1, 2, 3)
				}
			}
			for k := range c.m.Supports {
				compare([]reader{s.reactionReader(s.keyIndex(c.m.Supports[k].X), fem.Transverse)}, nil, func(int) int { return 4 })
				rows = append(rows, 4)
			}
			if cut == 0 {
				t.Fatal("no window left any position out")
			}
			for n, g := range got {
				for e := range 2 {
					a, b := g.got[e], g.want[e]
					switch {
					case exact && (math.Float64bits(a.value) != math.Float64bits(b.value) || a.at != b.at || a.set != b.set):
						t.Errorf("extreme %d/%d: windowed %v at %+v, whole member %v at %+v", n, e, a.value, a.at, b.value, b.at)
					case !exact && !(math.Abs(a.value-b.value) <= 1e-11*scale[rows[n]]):
						t.Errorf("extreme %d/%d: windowed %.17g at %+v, whole member %.17g at %+v", n, e, a.value, a.at, b.value, b.at)
					}
				}
			}
		})
	}
}

// Every piece of a line off the stretch where its window says it matters
// is below the window's bound: the sum of its terms' sizes over its
// stretch, Σ|cₚ|·hᵖ, against beyond. At every station of members over many
// supports, spring supports and hinges (windowCases).
func TestWindowBoundHoldsTheLines(t *testing.T) {
	for _, c := range windowCases() {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			s := in.bending
			edges := 0
			for _, x := range Stations(p.Mesh()) {
				i, tau := s.locate(x, fem.Right)
				rs := make([]reader, len(envelopeRows))
				for q, row := range envelopeRows {
					_, sc, _ := s.quantityRow(EnvelopeQuantities[q])
					rs[q] = s.stationReader(i, tau, row, sc)
					rs[q].x = x
				}
				var w window
				w.set(s, rs, 0)
				var ls lines
				ls.fill(s, rs)
				for k := range ls.pieces() {
					a, b := ls.bounds[k], ls.bounds[k+1]
					if a >= w.near && b <= w.far {
						continue
					}
					edges++
					h := (b - a) / ls.length
					for l := range rs {
						c := ls.coef[k*ls.n+l]
						size := math.Abs(c[0]) + math.Abs(c[1])*h + math.Abs(c[2])*h*h + math.Abs(c[3])*h*h*h
						if !(size <= w.beyond[l]) {
							t.Fatalf("x = %g, line %d, piece %g to %g: size %g, beyond the window's bound %g", x, l, a, b, size, w.beyond[l])
						}
					}
				}
			}
			if edges == 0 && c.name != "short run" {
				t.Fatal("no window ended inside the member")
			}
		})
	}
}

// The bookkeeping of positions a window leaves out (extreme.skip) gives
// the extreme every position would have given, whenever it ends sure:
// random effects, some left out in blocks standing for positions the
// window bounds (their effects within the block's bound, some exactly at
// it, some ties to round-off, and blocks of exact zeros from the first
// position), each compared with the plain most and least over all of
// them in order. Fails, too, if it is never sure (it would test nothing).
func TestSkipBookkeeping(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	sure := 0
	for trial := range 20000 {
		type event struct {
			v       float64
			at      Placement
			skipped bool
			bound   float64 // of a skipped block, on its first event
			zero    bool
			first   bool
		}
		var events []event
		pos := 0.0
		value := func(scale float64) float64 {
			v := scale * (2*rng.Float64() - 1)
			switch rng.IntN(6) {
			case 0:
				return scale // at the bound
			case 1:
				return -scale
			case 2:
				if len(events) > 0 {
					return events[len(events)-1].v * (1 + 1e-13*(2*rng.Float64()-1)) // a tie
				}
			}
			return v
		}
		for b := range 1 + rng.IntN(6) {
			skipped := rng.IntN(2) == 0
			zero := skipped && b == 0 && rng.IntN(3) == 0
			scale := math.Pow(10, float64(rng.IntN(8)-4))
			bound := scale
			if zero {
				bound = 0
			}
			for k := range 1 + rng.IntN(5) {
				pos++
				v := value(scale)
				switch {
				case zero:
					v = 0
				case skipped:
					v = min(max(v, -bound), bound)
				}
				events = append(events, event{v: v, at: Placement{Forward, pos}, skipped: skipped, bound: bound, zero: zero, first: k == 0})
			}
		}
		var whi, wlo, hi, lo extreme
		for _, e := range events {
			whi.most(e.v, e.at)
			wlo.least(e.v, e.at)
			switch {
			case !e.skipped:
				hi.most(e.v, e.at)
				lo.least(e.v, e.at)
			case e.first:
				hi.skip(e.bound, e.zero, true, e.at, e.zero)
				lo.skip(e.bound, e.zero, false, e.at, e.zero)
			}
		}
		for _, c := range []struct {
			name      string
			got, want extreme
		}{{"largest", hi, whi}, {"smallest", lo, wlo}} {
			if c.got.unsure {
				continue
			}
			sure++
			if c.got.value != c.want.value || c.got.at != c.want.at || c.got.set != c.want.set {
				t.Fatalf("trial %d, %s: bookkeeping %v at %+v, every position %v at %+v (events %+v)", trial, c.name, c.got.value, c.got.at, c.want.value, c.want.at, events)
			}
		}
	}
	if sure < 1000 {
		t.Fatalf("the bookkeeping ended sure %d times in 40000", sure)
	}
}

// A line exactly zero off the window (the deflection over a rigid
// support, the moment at a pinned end) gives +0 at every position left
// out, so a run's positions from its first are taken as +0 at the first
// (as a scan of the whole member takes them), and the extreme stays sure;
// positions left out later, within a bound of 0, change nothing.
func TestSkipZeroFromTheStart(t *testing.T) {
	first := Placement{Backward, -6.5}
	for _, c := range []struct {
		name  string
		taken []float64 // effects of the positions taken, after the skip
		hi    float64   // the largest, and where: the first position, or the taken one
		hiAt  Placement
	}{
		{"zero everywhere", []float64{0, 0, 0}, 0, first},
		{"round-off above zero", []float64{0, 1e-20, 0}, 1e-20, Placement{Backward, 2}},
		{"negative", []float64{-1e-20, -3}, 0, first},
	} {
		var hi extreme
		hi.skip(0, true, true, first, true)
		for k, v := range c.taken {
			hi.most(v, Placement{Backward, float64(k + 1)})
		}
		hi.skip(0, true, true, first, false) // positions left out after
		if hi.unsure || hi.value != c.hi || hi.at != c.hiAt {
			t.Errorf("%s: largest %v at %+v (unsure %v), want %v at %+v", c.name, hi.value, hi.at, hi.unsure, c.hi, c.hiAt)
		}
	}
}

// On equal spans under a two-axle train every station's window settles
// its extremes (settled): none is scanned again over the member, so the
// envelope's cost grows with the supports, not their square.
func TestWindowSettlesOnEqualSpans(t *testing.T) {
	m := manySpans(100, 1)
	p, in := prepared(t, m)
	s := in.bending
	tr := Train{Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}, Direction: BothWays}
	all, err := tr.runs(m.Length(), p.Mesh())
	if err != nil {
		t.Fatal(err)
	}
	runs := workRuns(all, s)
	for _, x := range Stations(p.Mesh()) {
		for _, side := range []fem.Side{fem.Left, fem.Right} {
			rs := make([]reader, len(envelopeRows))
			in.stationReaders(s, x, side, rs)
			var w window
			var ls lines
			w.set(s, rs, runs[0].maxOff-runs[0].minOff)
			ls.fillWindow(s, rs, w.lo, w.hi)
			hi, lo := make([]extreme, len(rs)), make([]extreme, len(rs))
			for r := range runs {
				runs[r].scan(&ls, hi, lo, bothSides, &w)
			}
			if w.hi-w.lo > 40 || !settled(hi, lo, &runs[0].cut) {
				t.Fatalf("x = %g (%v): window of stretches %d to %d, settled %v", x, side, w.lo, w.hi, settled(hi, lo, &runs[0].cut))
			}
		}
	}
}

// BenchmarkEnvelopeManySupports is a two-axle train (42 kN at 3.2 m, as
// the runway demo's) over a beam of spans of 1 m on n supports, its
// envelope at the default stations, peaks and reactions: the case whose
// cost grew with the square of the supports before windows (see
// window.go). Run it with -benchtime 1x or 3x: one op takes up to seconds.
func BenchmarkEnvelopeManySupports(b *testing.B) {
	for _, n := range []int{100, 300, 1000, 3000} {
		b.Run(fmt.Sprintf("supports=%d", n), func(b *testing.B) {
			m := manySpans(n-1, 1)
			m.Mesh = fem.MeshSettings{Elements: 120}
			in, mesh := influenceOn(b, m)
			tr := &Train{Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}
			b.ResetTimer()
			start := cpuTime(b)
			defer func() { b.ReportMetric(float64(cpuTime(b)-start)/1e6/float64(b.N), "cpu-ms/op") }()
			for range b.N {
				if _, err := in.Envelope(tr, mesh, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
