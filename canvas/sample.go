package canvas

import (
	"math"
	"slices"
	"sort"

	"stave/fem"
	"stave/fem/units"
)

// extreme is a value and where it occurs.
type extreme struct{ x, value float64 }

// column is what one pixel column shows of a curve: the first and last
// samples falling in it and its lowest and highest, in the order met.
type column struct {
	n                   int
	first, last, lo, hi extreme
	loAt, hiAt          int // sample numbers of lo and hi within the column
}

// curve is a result reduced to pixel columns: at most four points per column,
// whatever the number of samples fed in.
type curve struct {
	v      View
	cols   []column
	lo, hi extreme // over all samples
	n      int
	// peakLo and peakHi are the extremes in closed form over the elements
	// read, so a drawing labels them where the results table reports them,
	// whatever its width.
	peakLo, peakHi extreme
}

// reset empties c for view v, keeping its memory when it is large enough.
func (c *curve) reset(v View) {
	// One spare column each side keeps the line continuous off the edges.
	n := int(math.Ceil(float64(v.Width))) + 2
	if cap(c.cols) < n {
		c.cols = make([]column, n)
	}
	c.cols = c.cols[:n]
	clear(c.cols)
	*c = curve{v: v, cols: c.cols, lo: extreme{value: math.Inf(1)}, hi: extreme{value: math.Inf(-1)},
		peakLo: extreme{value: math.Inf(1)}, peakHi: extreme{value: math.Inf(-1)}}
}

// takePeaks takes the closed-form extremes of one element, which follows
// those taken: of equal peaks the first, as the results table (fem.Beyond).
func (c *curve) takePeaks(lo, hi fem.Point) {
	if fem.Beyond(c.peakLo.value, lo.Value) {
		c.peakLo = extreme{lo.X, lo.Value}
	}
	if fem.Beyond(hi.Value, c.peakHi.value) {
		c.peakHi = extreme{hi.X, hi.Value}
	}
}

// column is the index of the column holding model x.
func (c *curve) column(x float64) int {
	k := int(math.Floor(float64(c.v.ToScreenX(x)))) + 1
	return max(0, min(len(c.cols)-1, k))
}

func (c *curve) add(x, value float64) { c.addTo(c.column(x), x, value) }

// addTo adds a sample to column k, which must be c.column(x). Samples come in
// increasing x; finish sums the columns up once all are in.
func (c *curve) addTo(k int, x, value float64) {
	if math.IsNaN(value) {
		return
	}
	col := &c.cols[k]
	e := extreme{x, value}
	switch {
	case col.n == 0:
		*col = column{first: e, lo: e, hi: e}
	case value < col.lo.value:
		col.lo, col.loAt = e, col.n
	case value > col.hi.value:
		col.hi, col.hiAt = e, col.n
	}
	col.last = e
	col.n++
}

// finish sets the count and the extremes over all samples from the columns:
// the first lowest and the first highest met, as the columns keep them.
func (c *curve) finish() {
	c.n, c.lo, c.hi = 0, extreme{value: math.Inf(1)}, extreme{value: math.Inf(-1)}
	for k := range c.cols {
		col := &c.cols[k]
		if col.n == 0 {
			continue
		}
		c.n += col.n
		if col.lo.value < c.lo.value {
			c.lo = col.lo
		}
		if col.hi.value > c.hi.value {
			c.hi = col.hi
		}
	}
}

// merge appends the samples of o, which all follow those of c, column by column.
func (c *curve) merge(o *curve) {
	c.takePeaks(fem.Point{X: o.peakLo.x, Value: o.peakLo.value}, fem.Point{X: o.peakHi.x, Value: o.peakHi.value})
	for k := range o.cols {
		col, next := &c.cols[k], &o.cols[k]
		switch {
		case next.n == 0:
			continue
		case col.n == 0:
			*col = *next
			continue
		}
		if next.lo.value < col.lo.value {
			col.lo, col.loAt = next.lo, col.n+next.loAt
		}
		if next.hi.value > col.hi.value {
			col.hi, col.hiAt = next.hi, col.n+next.hiAt
		}
		col.last = next.last
		col.n += next.n
	}
}

// peakAbs is the sample of largest magnitude.
func (c *curve) peakAbs() extreme { return largerOf(c.n, c.lo, c.hi) }

// peak is the closed-form extreme of largest magnitude.
func (c *curve) peak() extreme { return largerOf(c.n, c.peakLo, c.peakHi) }

// largerOf is lo or hi, whichever is larger in magnitude; zero without samples.
func largerOf(n int, lo, hi extreme) extreme {
	if n == 0 {
		return extreme{}
	}
	if math.Abs(lo.value) > math.Abs(hi.value) {
		return lo
	}
	return hi
}

// points turns the columns into a polyline with toY mapping values to screen y.
func (c *curve) points(toY func(float64) float32) []Point {
	pts := make([]Point, 0, 2*len(c.cols))
	put := func(e extreme) { pts = append(pts, Point{c.v.ToScreenX(e.x), toY(e.value)}) }
	for _, col := range c.cols {
		if col.n == 0 {
			continue
		}
		put(col.first)
		inner := []struct {
			at int
			e  extreme
		}{{col.loAt, col.lo}, {col.hiAt, col.hi}}
		if inner[1].at < inner[0].at {
			inner[0], inner[1] = inner[1], inner[0]
		}
		for _, in := range inner {
			if in.at != 0 && in.at != col.n-1 {
				put(in.e)
			}
		}
		if col.n > 1 {
			put(col.last)
		}
	}
	return pts
}

// maxSamplesPerElement caps the samples inside one wide element; one sample
// every three pixels draws a cubic smoothly.
const maxSamplesPerElement = 48

// sampler reads the finite element solution for each quantity over the
// visible part of the member into its curves, one curve per quantity, in
// a walk over the elements (a fem.Visitor). Elements wider than a few
// pixels are sampled inside; narrower ones give only their end values, so
// the work is about one evaluation per visible element (the end follows
// from the start, see variation) and the result is bounded by the width.
// Many visible elements are read in two halves at once (fem.WalkElements),
// the second into the curves of half (one per quantity).
type sampler struct {
	s  *fem.Solution
	v  View
	qs []fem.Quantity
	cs []*curve
	// from and to are the visible elements, from ≤ i < to.
	from, to int
	// What a narrow element's end adds: nothing for a nodal quantity, which
	// the next element's start repeats, nor below a pixel for a constant one.
	nodal, constant []bool
	half            []*curve
	// f is the fields of the samples, kept in one place: passed by pointer
	// to the quantities' readers they would otherwise move to the heap one
	// by one.
	f fem.Fields
}

// newSampler is an empty sampler of qs of s in view v into cs, with the
// memory half for the second half of a two-goroutine read.
func newSampler(s *fem.Solution, v View, qs []fem.Quantity, cs, half []*curve) *sampler {
	for _, c := range cs {
		c.reset(v)
	}
	lo, hi := v.ToModelX(-1), v.ToModelX(v.Width+1)
	els := s.Mesh.Elements
	first := sort.Search(len(els), func(k int) bool { return els[k].End >= lo })
	end := first + sort.Search(len(els)-first, func(k int) bool { return els[first+k].Start > hi })
	w := &sampler{s: s, v: v, qs: qs, cs: cs, from: first, to: end, half: half,
		nodal: make([]bool, len(qs)), constant: make([]bool, len(qs))}
	for i, q := range qs {
		vary := s.Varies(q)
		w.nodal[i], w.constant[i] = vary.Nodal, vary.Degree == 0
	}
	return w
}

// whole reports whether every element of the solution is visible.
func (w *sampler) whole() bool { return w.from == 0 && w.to == len(w.s.Mesh.Elements) }

// walk reads the visible elements alone.
func (w *sampler) walk() { fem.WalkElements(w.s, nil, w.from, w.to, w) }

// finish sums the curves up once every visible element is read.
func (w *sampler) finish() {
	for _, c := range w.cs {
		c.finish()
	}
}

// add adds the samples at x to the curves.
func (w *sampler) add(x float64, f *fem.Fields) {
	k := w.cs[0].column(x)
	for i, q := range w.qs {
		w.cs[i].addTo(k, x, q.Of(f))
	}
}

// Visit adds the samples of a visible element and its extremes.
func (w *sampler) Visit(el *fem.ElementView) {
	if el.Index < w.from || el.Index >= w.to {
		return
	}
	cs, qs, f := w.cs, w.qs, &w.f
	for i, q := range qs {
		cs[i].takePeaks(el.FE.Range(q))
	}
	h := el.End - el.Start
	inner := int(min(maxSamplesPerElement, h*w.v.Scale/3))
	if inner > 0 {
		for j := 0; j <= inner+1; j++ {
			x := el.Start + h*float64(j)/float64(inner+1)
			if j == inner+1 {
				x = el.End
			}
			// ξ as InElement finds it from x, so that the drawing
			// reads the fields as it always has, to the bit.
			el.FE.At(min(max((x-el.Start)/h, 0), 1), f)
			w.add(x, f)
		}
		return
	}
	w.add(el.Start, el.FE.End(0))
	// The end repeats the next element's start for a nodal quantity and,
	// below a pixel, the start's value for a constant one (a jump at
	// the node then shows within the pixel column, as it would anyway).
	last, subPixel := el.Index == w.to-1, h*w.v.Scale < 1
	kEnd := cs[0].column(el.End)
	for i := range qs {
		if w.nodal[i] && !last || w.constant[i] && subPixel {
			continue
		}
		cs[i].addTo(kEnd, el.End, qs[i].Of(el.FE.End(1)))
	}
}

// Fork reads the later elements into the curves of half.
func (w *sampler) Fork() fem.Visitor {
	later := *w
	later.cs = w.half[:len(w.cs)]
	later.half = nil
	for _, c := range later.cs {
		c.reset(w.v)
	}
	return &later
}

// Join appends the samples of the later elements.
func (w *sampler) Join(later fem.Visitor) {
	for i, c := range w.cs {
		c.merge(later.(*sampler).cs[i])
	}
}

// exactCurves reads the exact solution once per pixel column and on both
// sides of every key point.
func exactCurves(e *fem.Exact, m *fem.Model, v View, qs []fem.Quantity, c *Cache) []*curve {
	var memory []*curve
	if c != nil {
		memory = c.exactMem
		defer func() { c.exactMem = memory }()
	}
	cs := grow(&memory, len(qs))
	for _, cv := range cs {
		cv.reset(v)
	}
	l := m.Length()
	f := new(fem.Fields) // see sampler
	add := func(x float64, side fem.Side) {
		// Beyond the ends there is no other side to read.
		if x <= 0 {
			side = fem.Right
		} else if x >= l {
			side = fem.Left
		}
		*f = e.At(x, side)
		for i, q := range qs {
			cs[i].add(x, q.Of(f))
		}
	}
	eachPixel(m, v, add)
	for _, c := range cs {
		c.finish()
	}
	return cs
}

// eachPixel calls add at one x per pixel column of the visible part of m,
// and on both sides of every key point, in order.
func eachPixel(m *fem.Model, v View, add func(x float64, side fem.Side)) {
	l := m.Length()
	x0, x1 := max(0, v.ToModelX(0)), min(l, v.ToModelX(v.Width))
	keys := fem.KeyPoints(m)
	k := lowerBound(keys, x0)
	n := int(math.Ceil(float64(v.ToScreenX(x1) - v.ToScreenX(x0))))
	for j := 0; j <= n; j++ {
		x := x0 + (x1-x0)*float64(j)/float64(max(n, 1))
		for k < len(keys) && keys[k] <= x {
			add(keys[k], fem.Left)
			add(keys[k], fem.Right)
			k++
		}
		add(x, fem.Right)
	}
}

// exactExtremes are the smallest and largest exact values of each of qs in
// closed form, over the stretches between key points that reach into the
// view: a stretch's every field is one polynomial (fem.Exact.EachInterval),
// read once for all of qs. Where the exact solution reaches an extreme also
// at the place of the finite element extreme of the same kind in near, to
// round-off (the two ends of a symmetric span, say), that place is taken, so
// that a label pairs the two where they belong together.
func exactExtremes(e *fem.Exact, v View, qs []fem.Quantity, near []*curve) (lo, hi []extreme) {
	lo, hi = make([]extreme, len(qs)), make([]extreme, len(qs))
	for i := range qs {
		lo[i], hi[i] = extreme{value: math.Inf(1)}, extreme{value: math.Inf(-1)}
	}
	x0, x1 := v.ToModelX(0), v.ToModelX(v.Width)
	for _, iv := range e.EachInterval() {
		if iv.X(1) < x0 || iv.X(0) > x1 {
			continue
		}
		for i, q := range qs {
			l, h := iv.Range(q)
			if fem.Beyond(lo[i].value, l.Value) {
				lo[i] = extreme{l.X, l.Value}
			}
			if fem.Beyond(h.Value, hi[i].value) {
				hi[i] = extreme{h.X, h.Value}
			}
		}
	}
	for i, q := range qs {
		size := max(math.Abs(lo[i].value), math.Abs(hi[i].value))
		for _, p := range [2]struct {
			ex *extreme
			fe extreme
		}{{&lo[i], near[i].peakLo}, {&hi[i], near[i].peakHi}} {
			for _, side := range [2]fem.Side{fem.Left, fem.Right} {
				f := e.At(p.fe.x, side)
				if math.Abs(q.Of(&f)-p.ex.value) <= tie*size {
					p.ex.x = p.fe.x
				}
			}
		}
	}
	return lo, hi
}

// Cache keeps the sampled finite element curves between builds of the same
// solution in the same view, so a hover or a selection change redraws without
// reading a large solution again; after any other change it lends their
// memory to the new curves. It also lends each build the layout's memory of
// the one before and keeps the texts' widths and the values written (see
// scratch). The zero value is ready to use; give each drawing area its own
// Cache and do not share one between goroutines.
type Cache struct {
	solution  *fem.Solution
	x0, scale float64
	width     float32
	drawn     []fem.Quantity
	gapMemo   gapMemo // the largest gaps, read anew for other solutions
	sampled   []*curve
	half      []*curve // memory for the second half of a two-goroutine read
	exactMem  []*curve // memory for the exact curves, read anew each build
	scratch   scratch  // lent to each build (see lend)
}

// scratch is what a build needs only while it lays the drawing out: the
// occupied boxes and their grid, the crowd labels waiting and the cells
// where they found no room, the labels' items before they join the
// scene's, the widths of the texts measured (a text's width follows from
// its characters, size and weight alone, so it holds for every later build)
// and the values written, in the unit system formatsIn. A drag step rebuilds the drawing of 1,000 loads with all of it.
// items is the size of the last scene, which the next starts with room for.
type scratch struct {
	boxes                    []box
	grid                     boxGrid
	crowd                    []label
	full                     map[[2]int32]fullCell
	texts, backings, leaders []Item
	widths                   map[textKey]float32
	formats                  map[formatKey]string
	formatsIn                units.System
	items                    int
}

// maxWidths bounds the texts a Cache remembers the widths of, and the
// values it remembers written: past it they are forgotten and measured or
// written anew.
const maxWidths = 1 << 12

// lend gives b the scratch memory of the last build, emptied; nothing when
// c is nil.
func (c *Cache) lend(b *builder) {
	if c == nil {
		return
	}
	m := c.scratch
	c.scratch = scratch{}
	b.boxes = m.boxes[:0]
	if g := m.grid; g.newest != nil && g.columns == gridCells(b.s.Width) && g.rows == gridCells(b.s.Height) {
		clear(g.newest)
		b.boxGrid = boxGrid{columns: g.columns, rows: g.rows, newest: g.newest, entries: g.entries[:0], large: g.large[:0]}
	}
	b.crowd, b.full = m.crowd[:0], m.full
	clear(b.full)
	b.texts, b.backings, b.leaders = m.texts[:0], m.backings[:0], m.leaders[:0]
	if len(m.widths) <= maxWidths {
		b.widths = m.widths
	}
	if len(m.formats) <= maxWidths && m.formatsIn == b.u {
		b.formats = m.formats
	}
	b.s.Items = make([]Item, 0, m.items)
}

// keep takes back the scratch memory of b, whose scene is made; nothing
// when c is nil.
func (c *Cache) keep(b *builder) {
	if c == nil {
		return
	}
	c.scratch = scratch{boxes: b.boxes, grid: b.boxGrid, crowd: b.crowd, full: b.full,
		texts: b.texts, backings: b.backings, leaders: b.leaders, widths: b.widths,
		formats: b.formats, formatsIn: b.u, items: len(b.s.Items)}
}

// grow returns the first n of *cs, adding empty curves as needed.
func grow(cs *[]*curve, n int) []*curve {
	for len(*cs) < n {
		*cs = append(*cs, &curve{})
	}
	return (*cs)[:n]
}

// read returns the sampled curves of qs, reading the solution only when
// the solution, the view's x transform or the quantities changed, and,
// when e is not nil, the largest gap to e of each of gapped, walking the
// elements only when s, e or gapped changed (both memos are the Cache's;
// c may be nil). When both are read anew and the whole member is in view,
// as it is unless zoomed in, one walk with the exact solution reads both:
// on a drag step of a beam of 10,000 elements it saves a walk.
func (c *Cache) read(s *fem.Solution, v View, qs []fem.Quantity, e *fem.Exact, gapped []fem.Quantity) ([]*curve, []gap) {
	if c == nil {
		c = &Cache{}
	}
	var w *sampler
	if c.solution != s || c.x0 != v.X0 || c.scale != v.Scale || c.width != v.Width || !slices.Equal(c.drawn, qs) {
		w = newSampler(s, v, qs, grow(&c.sampled, len(qs)), grow(&c.half, len(qs)))
		c.solution, c.x0, c.scale, c.width, c.drawn = s, v.X0, v.Scale, v.Width, slices.Clone(qs)
	}
	var g *gapFinder
	if m := &c.gapMemo; e != nil && (m.solution != s || m.exact != e || !slices.Equal(m.qs, gapped)) {
		g = newGapFinder(slices.Clone(gapped))
	}
	if w != nil && g != nil && w.whole() {
		fem.Walk(s, e, w, g)
	} else {
		if w != nil {
			w.walk()
		}
		if g != nil {
			fem.Walk(s, e, g)
		}
	}
	if w != nil {
		w.finish()
	}
	if g != nil {
		g.values(s, e)
		c.gapMemo = gapMemo{s, e, g.qs, g.gaps}
	}
	var gaps []gap
	if e != nil {
		gaps = c.gapMemo.gaps
	}
	return c.sampled[:len(qs)], gaps
}
