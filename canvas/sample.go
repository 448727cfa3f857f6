package canvas

import (
	"math"
	"sort"

	"stave/fem"
	"stave/fem/units"
)

// quantity is one result read from fem.Fields.
type quantity struct {
	name   string
	symbol string
	unit   units.Quantity
	get    func(fem.Fields) float64
}

var deflectionQuantity = quantity{"deflection", "w", units.Deflection, func(f fem.Fields) float64 { return f.Deflection }}

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
}

func newCurve(v View) *curve {
	// One spare column each side keeps the line continuous off the edges.
	return &curve{v: v, cols: make([]column, int(math.Ceil(float64(v.Width)))+2),
		lo: extreme{value: math.Inf(1)}, hi: extreme{value: math.Inf(-1)}}
}

func (c *curve) add(x, value float64) {
	if math.IsNaN(value) {
		return
	}
	k := int(math.Floor(float64(c.v.ToScreenX(x)))) + 1
	k = max(0, min(len(c.cols)-1, k))
	col := &c.cols[k]
	e := extreme{x, value}
	if col.n == 0 {
		*col = column{first: e, lo: e, hi: e}
	}
	if value < col.lo.value {
		col.lo, col.loAt = e, col.n
	}
	if value > col.hi.value {
		col.hi, col.hiAt = e, col.n
	}
	col.last = e
	col.n++
	c.n++
	if value < c.lo.value {
		c.lo = e
	}
	if value > c.hi.value {
		c.hi = e
	}
}

// peakAbs is the sample of largest magnitude.
func (c *curve) peakAbs() extreme {
	if c.n == 0 {
		return extreme{}
	}
	if math.Abs(c.lo.value) > math.Abs(c.hi.value) {
		return c.lo
	}
	return c.hi
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

// sampleCurves reads the finite element solution for each quantity over the
// visible part of the member. Elements wider than a few pixels are sampled
// inside; narrower ones give only their end values, so the work is about two
// evaluations per visible element and the result is bounded by the width.
func sampleCurves(s *fem.Solution, v View, qs []quantity) []*curve {
	cs := make([]*curve, len(qs))
	for i := range cs {
		cs[i] = newCurve(v)
	}
	add := func(x float64, side fem.Side) {
		f := s.At(x, side)
		for i, q := range qs {
			cs[i].add(x, q.get(f))
		}
	}
	lo, hi := v.ToModelX(-1), v.ToModelX(v.Width+1)
	els := s.Mesh.Elements
	i := sort.Search(len(els), func(k int) bool { return els[k].End >= lo })
	for ; i < len(els) && els[i].Start <= hi; i++ {
		e := els[i]
		inner := int(min(maxSamplesPerElement, (e.End-e.Start)*v.Scale/3))
		add(e.Start, fem.Right)
		for j := 1; j <= inner; j++ {
			add(e.Start+(e.End-e.Start)*float64(j)/float64(inner+1), fem.Right)
		}
		add(e.End, fem.Left)
	}
	return cs
}

// exactCurves reads the exact solution once per pixel column and on both
// sides of every key point, and measures the gap to the finite element
// solution (when s is not nil) at the same places.
func exactCurves(e *fem.Exact, s *fem.Solution, m *fem.Model, v View, qs []quantity) (cs []*curve, gaps []extreme) {
	cs = make([]*curve, len(qs))
	for i := range cs {
		cs[i] = newCurve(v)
	}
	gaps = make([]extreme, len(qs))
	l := m.Length()
	add := func(x float64, side fem.Side) {
		// Beyond the ends there is no other side to read.
		if x <= 0 {
			side = fem.Right
		} else if x >= l {
			side = fem.Left
		}
		f := e.At(x, side)
		var g fem.Fields
		if s != nil {
			g = s.At(x, side)
		}
		for i, q := range qs {
			ev := q.get(f)
			cs[i].add(x, ev)
			if s != nil {
				if d := q.get(g) - ev; math.Abs(d) > math.Abs(gaps[i].value) {
					gaps[i] = extreme{x, d}
				}
			}
		}
	}
	x0, x1 := max(0, v.ToModelX(0)), min(l, v.ToModelX(v.Width))
	keys := keyPoints(m)
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
	return cs, gaps
}

// Cache keeps the sampled finite element curves between builds of the same
// solution in the same view, so a hover or a selection change redraws without
// reading a large solution again. The zero value is ready to use; give each
// drawing area its own Cache and do not share one between goroutines.
type Cache struct {
	solution  *fem.Solution
	x0, scale float64
	width     float32
	names     string
	sampled   []*curve
}

// curves returns the sampled curves of qs, reading the solution only when the
// solution, the view's x transform or the quantities changed.
func (c *Cache) curves(s *fem.Solution, v View, qs []quantity) []*curve {
	names := ""
	for _, q := range qs {
		names += q.name + ";"
	}
	if c != nil && c.solution == s && c.x0 == v.X0 && c.scale == v.Scale && c.width == v.Width && c.names == names {
		return c.sampled
	}
	cs := sampleCurves(s, v, qs)
	if c != nil {
		*c = Cache{solution: s, x0: v.X0, scale: v.Scale, width: v.Width, names: names, sampled: cs}
	}
	return cs
}
