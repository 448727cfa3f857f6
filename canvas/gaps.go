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
}

// tie is the relative margin within which two values count as equal: a
// later element's gap must beat the largest so far by more to take its
// place, so equal gaps to round-off (a uniform load's at every node) go to
// the first along the member.
const tie = 1e-9

// gapFinder takes the largest gap of each of its quantities in a walk over
// the elements with the exact solution (a fem.Visitor).
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
		xi := (p.X - v.Start) / (v.End - v.Start)
		v.FE.At(xi, &w.f)
		v.Exact.At(xi, &w.g)
		w.gaps[i] = gap{extreme{p.X, p.Value}, q.Of(&w.f), q.Of(&w.g)}
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
