package canvas

import "stave/fem"

// The largest gap between the finite element and the exact solution of
// each diagram, over the whole member, in closed form (ElementView.Gap), so
// that the screen and every export mark the same gap at the same place
// whatever their width or zoom.

// gap is the largest |FE − exact| of one quantity along the member, and the
// two solutions' values where it is.
type gap struct {
	at        extreme // where it is and how large
	fe, exact float64
	// element and xi are where it is in the mesh: the element and the
	// local coordinate at which gapFinder.values reads fe and exact.
	element int
	xi      float64
}

// tie is the relative margin within which two values count as equal: a
// later element's gap must beat the largest so far by more to take its
// place, so equal gaps to round-off (a uniform load's at every node) go to
// the first along the member.
const tie = 1e-9

// gapFinder takes the largest gap of each of its quantities in a walk over
// the elements with the exact solution (a fem.Visitor), and then, in
// values, the two solutions' values there.
type gapFinder struct {
	qs   []fem.Quantity
	gaps []gap
	f, g fem.Fields
}

func newGapFinder(qs []fem.Quantity) *gapFinder {
	return &gapFinder{qs: qs, gaps: make([]gap, len(qs))}
}

func (w *gapFinder) Visit(v *fem.ElementView) {
	for i, q := range w.qs {
		floor := w.gaps[i].at.value * (1 + tie)
		p, ok := v.Gap(q, floor)
		if !ok || p.Value <= floor {
			continue
		}
		w.gaps[i] = gap{at: extreme{p.X, p.Value}, element: v.Index, xi: (p.X - v.Start) / (v.End - v.Start)}
	}
}

// values reads the values of both solutions at each gap found, s and e
// being those walked: once, after the walk, for the largest gaps alone.
// Read at every larger gap met on the way, as they were before, they cost
// more than the search itself on a beam under a growing load, where a
// third of the elements beat the largest gap so far.
func (w *gapFinder) values(s *fem.Solution, e *fem.Exact) {
	for i := range w.gaps {
		p := &w.gaps[i]
		if !(p.at.value > 0) { // none found: the walk takes only gaps above 0
			continue
		}
		for v := range s.Elements(e, p.element, p.element+1) {
			v.FE.At(p.xi, &w.f)
			v.Exact.At(p.xi, &w.g)
		}
		p.fe, p.exact = w.qs[i].Of(&w.f), w.qs[i].Of(&w.g)
	}
}

func (w *gapFinder) Fork() fem.Visitor { return newGapFinder(w.qs) }

func (w *gapFinder) Join(later fem.Visitor) {
	for i, g := range later.(*gapFinder).gaps {
		if g.at.value > w.gaps[i].at.value*(1+tie) {
			w.gaps[i] = g
		}
	}
}

// gapMemo keeps the largest gaps of one solution against one exact
// solution between builds (Cache.read): they depend on neither the view
// nor the hover.
type gapMemo struct {
	solution *fem.Solution
	exact    *fem.Exact
	qs       []fem.Quantity
	gaps     []gap
}
