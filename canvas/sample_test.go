package canvas

import (
	"fmt"
	"math"
	"slices"
	"testing"

	"stave/fem"
)

// sampledByAt is how the curves were read before the sampler took a narrow
// element's end from its start: every sample through Solution.At, one after
// the other, each element's end included but where the sampler leaves it
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

// The curves the sampler draws must be those of reading every element end
// through At: the same samples in every pixel column, first and last at the
// same places, and values equal to round-off (a narrow element's end moment is
// its start moment plus V·h, its end stress is recomputed from N and M).
// Covers wide and narrow elements, both bar orders, a zoomed view and enough
// elements for the two-goroutine read (fem.WalkElements: from 4,096 on).
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
		{8192, fem.LinearBar, 1, drawn},
		{8192, fem.QuadraticBar, 1, drawn},
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
			got, _ := (&Cache{}).read(s, v, qs, nil, nil)
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

// One walk that reads the curves and the largest gaps together (the whole
// member in view, both read anew) must give what the two walks give apart,
// to the bit: the same samples in every column, the same closed-form peaks
// and the same gaps at the same places. Zoomed in, the curves take their own
// walk over the visible elements, and the result is the same again. Covers
// a mesh walked in one piece and one walked in two halves.
func TestOneWalkReadsCurvesAndGapsAsTwo(t *testing.T) {
	qs := []fem.Quantity{fem.QDeflection, fem.QShearForce, fem.QBendingMoment, fem.QCombinedStress}
	for _, c := range []struct {
		elements int
		zoom     float32
	}{{300, 1}, {8192, 1}, {8192, 40}} {
		t.Run(fmt.Sprintf("%d elements, zoom %g", c.elements, c.zoom), func(t *testing.T) {
			in := solved(t, demoModel(c.elements))
			v := NewView(1100, 800)
			v.Fit(in.Model)
			v.Zoom(c.zoom, 500)
			// Apart: the curves without the exact solution, then the gaps
			// alone.
			apart := &Cache{}
			wantCurves, _ := apart.read(in.Solution, v, qs, nil, nil)
			finder := newGapFinder(qs[1:])
			fem.Walk(in.Solution, in.Exact, finder)
			finder.values(in.Solution, in.Exact)
			gotCurves, gotGaps := (&Cache{}).read(in.Solution, v, qs, in.Exact, qs[1:])
			for i, q := range qs {
				g, w := gotCurves[i], wantCurves[i]
				if g.n != w.n || g.lo != w.lo || g.hi != w.hi || g.peakLo != w.peakLo || g.peakHi != w.peakHi ||
					!slices.Equal(g.cols, w.cols) {
					t.Errorf("%s: read with the gaps, %d samples from %+v to %+v, peaks %+v and %+v; read alone, %d from %+v to %+v, peaks %+v and %+v",
						q, g.n, g.lo, g.hi, g.peakLo, g.peakHi, w.n, w.lo, w.hi, w.peakLo, w.peakHi)
				}
			}
			if !slices.Equal(gotGaps, finder.gaps) {
				t.Errorf("gaps read with the curves %+v, walked alone %+v", gotGaps, finder.gaps)
			}
			if slices.ContainsFunc(gotGaps, func(g gap) bool { return g.at.value == 0 }) {
				t.Errorf("gaps %+v: zero gaps would agree whatever the walk, and every diagram of this model has one", gotGaps)
			}
		})
	}
}
