package canvas

import (
	"fmt"
	"math"
	"testing"

	"stave/fem"
)

// sampledByAt is how the curves were read before sampleCurves took a narrow
// element's end from its start: every sample through Solution.At, one after
// the other, each element's end included but where sampleElements leaves it
// out as a repeat (a nodal quantity's end before the next element, a constant
// quantity's end in an element narrower than a pixel).
func sampledByAt(s *fem.Solution, v View, qs []fem.Quantity) []*curve {
	cs := make([]*curve, len(qs))
	for i := range cs {
		cs[i] = &curve{}
		cs[i].reset(v)
	}
	lo, hi := v.ToModelX(-1), v.ToModelX(v.Width+1)
	var visible []fem.Element
	for _, e := range s.Mesh.Elements {
		if e.End >= lo && e.Start <= hi {
			visible = append(visible, e)
		}
	}
	for n, e := range visible {
		inner := int(min(maxSamplesPerElement, (e.End-e.Start)*v.Scale/3))
		for j := 0; j <= inner+1; j++ {
			x, side := e.Start+(e.End-e.Start)*float64(j)/float64(inner+1), fem.Right
			if j == inner+1 {
				x, side = e.End, fem.Left
			}
			f := s.At(x, side)
			for i, q := range qs {
				vary := s.Varies(q)
				repeat := inner == 0 && j == 1 && (vary.Nodal && n < len(visible)-1 ||
					vary.Degree == 0 && (e.End-e.Start)*v.Scale < 1)
				if !repeat {
					cs[i].add(x, q.Of(&f))
				}
			}
		}
	}
	for _, c := range cs {
		c.finish()
	}
	return cs
}

// The curves sampleCurves draws must be those of reading every element end
// through At: the same samples in every pixel column, first and last at the
// same places, and values equal to round-off (a narrow element's end moment is
// its start moment plus V·h, its end stress is recomputed from N and M).
// Covers wide and narrow elements, both bar orders, a zoomed view and enough
// elements for the two-goroutine read.
func TestSampleCurvesMatchReadingEveryEnd(t *testing.T) {
	var drawn []fem.Quantity
	for _, d := range diagramsList {
		drawn = append(drawn, d.quantity)
	}
	drawn = append(drawn, fem.QDeflection)
	// A quantity that is neither nodal nor constant is read at both ends.
	rotation := fem.QRotation
	for _, c := range []struct {
		elements int
		order    fem.ElementOrder
		zoom     float32
		qs       []fem.Quantity
	}{
		{12, fem.LinearBar, 1, drawn},
		{3000, fem.LinearBar, 1, drawn},
		{3000, fem.QuadraticBar, 1, drawn},
		{3000, fem.LinearBar, 40, drawn},
		{3000, fem.LinearBar, 1, []fem.Quantity{fem.QDeflection}},
		{3000, fem.LinearBar, 1, append([]fem.Quantity{rotation}, drawn...)},
		{2 * parallelElements, fem.LinearBar, 1, drawn},
		{2 * parallelElements, fem.QuadraticBar, 1, drawn},
	} {
		qs := c.qs
		t.Run(fmt.Sprintf("%d elements, bar order %d, zoom %g, %s…", c.elements, c.order, c.zoom, qs[0]), func(t *testing.T) {
			m := demoModel(c.elements)
			m.Mesh.BarOrder = c.order
			m.PointLoads[1].Axial = 60e3 // a varying axial force in the second segment
			m.DistributedLoad = append(m.DistributedLoad, fem.DistributedLoad{Direction: fem.Axial,
				Points: []fem.LoadPoint{{X: 1, Intensity: 5e3}, {X: 5, Intensity: -2e3}}})
			s, err := fem.Solve(m)
			if err != nil {
				t.Fatal(err)
			}
			v := NewView(1100, 800)
			v.Fit(m)
			v.Zoom(c.zoom, 500)
			var got, half []*curve
			sampleCurves(s, v, qs, grow(&got, len(qs)), grow(&half, len(qs)))
			want := sampledByAt(s, v, qs)
			for i, q := range qs {
				g, w := got[i], want[i]
				tol := 1e-9 * max(math.Abs(w.lo.value), math.Abs(w.hi.value))
				near := func(a, b extreme) bool { return math.Abs(a.value-b.value) <= tol }
				if g.n != w.n || !near(g.lo, w.lo) || !near(g.hi, w.hi) {
					t.Errorf("%s: %d samples from %g to %g, want %d from %g to %g", q, g.n, g.lo.value, g.hi.value, w.n, w.lo.value, w.hi.value)
					continue
				}
				bad := 0
				for k := range w.cols {
					a, b := g.cols[k], w.cols[k]
					if a.n != b.n || a.first.x != b.first.x || a.last.x != b.last.x ||
						!near(a.first, b.first) || !near(a.last, b.last) || !near(a.lo, b.lo) || !near(a.hi, b.hi) {
						if bad++; bad <= 3 {
							t.Errorf("%s, column %d: got %+v, want %+v", q, k, a, b)
						}
					}
				}
			}
		})
	}
}
