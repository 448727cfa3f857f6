package fem

import (
	"math"
	"sort"
)

// Line loads inside a stretch. The factorized key-point system holds only
// the points where the member itself changes: its ends, the supports and the
// breaks between segments of different stiffness (systemKeyPoints). A break
// point of a distributed load, like a point load, stays out of it: a ramp a
// micrometre long next to a support would otherwise make a stretch so short
// and stiff that the system is singular to working precision, though the
// model is sound. Such a stretch's line load is then piecewise linear; it is
// still a node of the fine mesh, so every element's load stays linear.

// loadBreak is a point inside a stretch where its line loads change slope or
// jump (a step).
type loadBreak struct {
	x           float64    // m
	left, right [2]float64 // axial and transverse intensity just left and right of x, N/m
}

// loadPiece is a part of a stretch with linear line loads: axial from p0 to
// p1 and transverse from q0 to q1, N/m.
type loadPiece struct {
	start, length  float64 // m
	p0, p1, q0, q1 float64
}

// pieces calls do for every piece of the line loads of d between x0 and x1
// (within d), in order.
func (d *elementData) pieces(x0, x1 float64, do func(loadPiece)) {
	from := sort.Search(len(d.breaks), func(i int) bool { return d.breaks[i].x > x0 })
	a := x0
	pa, qa := d.axialAt(x0, Right), d.transverseAt(x0, Right)
	for _, b := range d.breaks[from:] {
		if b.x >= x1 {
			break
		}
		do(loadPiece{start: a, length: b.x - a, p0: pa, p1: b.left[0], q0: qa, q1: b.left[1]})
		a, pa, qa = b.x, b.right[0], b.right[1]
	}
	do(loadPiece{start: a, length: x1 - a, p0: pa, p1: d.axialAt(x1, Left), q0: qa, q1: d.transverseAt(x1, Left)})
}

// linearPiece is the part of a stretch between neighbouring breaks (or its
// ends), where both line loads are linear: axial and transverse intensity
// va just right of a and vb just left of b, N/m.
type linearPiece struct {
	a, b   float64 // m
	va, vb [2]float64
}

// at is line load k (0 axial, 1 transverse) of the piece at x, as loadAt
// gives it there: each end's own value exactly at that end.
func (p *linearPiece) at(x float64, k int) float64 {
	return linearBetween(p.a, p.b, p.va[k], p.vb[k], x)
}

// pieceOver returns the piece of d's line loads holding [x0, x1], and false
// when a break lies strictly inside (the loads are not linear there). The
// refinement asks for the loads of two elements at every fine node: one
// search for the piece, instead of one per end and per load.
func (d *elementData) pieceOver(x0, x1 float64) (linearPiece, bool) {
	j := sort.Search(len(d.breaks), func(i int) bool { return d.breaks[i].x > x0 })
	if j < len(d.breaks) && d.breaks[j].x < x1 {
		return linearPiece{}, false
	}
	p := linearPiece{a: d.start, b: d.start + d.length,
		va: [2]float64{d.axialLoad[0], d.transverseLoad[0]}, vb: [2]float64{d.axialLoad[1], d.transverseLoad[1]}}
	if j > 0 {
		p.a, p.va = d.breaks[j-1].x, d.breaks[j-1].right
	}
	if j < len(d.breaks) {
		p.b, p.vb = d.breaks[j].x, d.breaks[j].left
	}
	return p, true
}

// axialAt and transverseAt are the line loads of d at x, seen from side
// where a break makes them jump, N/m.
func (d *elementData) axialAt(x float64, side Side) float64 { return d.loadAt(x, side, 0) }

func (d *elementData) transverseAt(x float64, side Side) float64 { return d.loadAt(x, side, 1) }

// loadAt is the line load k (0 axial, 1 transverse) at x.
func (d *elementData) loadAt(x float64, side Side, k int) float64 {
	ends := [2][2]float64{d.axialLoad, d.transverseLoad}[k]
	if len(d.breaks) == 0 {
		return linearBetween(d.start, d.start+d.length, ends[0], ends[1], x)
	}
	i := sort.Search(len(d.breaks), func(i int) bool { return d.breaks[i].x >= x })
	if i < len(d.breaks) && d.breaks[i].x == x {
		if side == Left {
			return d.breaks[i].left[k]
		}
		return d.breaks[i].right[k]
	}
	a, va := d.start, ends[0]
	if i > 0 {
		a, va = d.breaks[i-1].x, d.breaks[i-1].right[k]
	}
	b, vb := d.start+d.length, ends[1]
	if i < len(d.breaks) {
		b, vb = d.breaks[i].x, d.breaks[i].left[k]
	}
	return linearBetween(a, b, va, vb, x)
}

// linearBetween interpolates va at a and vb at b linearly at x, giving each
// end's value exactly there.
func linearBetween(a, b, va, vb, x float64) float64 {
	switch x {
	case a:
		return va
	case b:
		return vb
	}
	return va + (vb-va)*(x-a)/(b-a)
}

// loadsIn gathers the loads of l on [x0, x1]: the intensities just inside
// its ends and the breaks strictly inside, where l's loads change slope or
// jump (the key points of l there).
func (l *Loads) loadsIn(x0, x1 float64) (axial, transverse [2]float64, breaks []loadBreak) {
	j := l.stretchAt(x0, Right)
	k := l.stretchAt(x1, Left)
	axial = [2]float64{l.AxialAt(j, x0), l.AxialAt(k, x1)}
	transverse = [2]float64{l.TransverseAt(j, x0), l.TransverseAt(k, x1)}
	for i := j + 1; i <= k; i++ {
		b := loadBreak{x: l.Keys[i],
			left:  [2]float64{l.Axial[i-1][1], l.Transverse[i-1][1]},
			right: [2]float64{l.Axial[i][0], l.Transverse[i][0]}}
		if b.left != b.right || !sameSlope(l, i) {
			breaks = append(breaks, b)
		}
	}
	return axial, transverse, breaks
}

// stretchAt is the stretch of l holding x, the one to the right of a key
// point at x when side is Right and to its left when Left (the end
// stretches at the member's ends).
func (l *Loads) stretchAt(x float64, side Side) int {
	last := len(l.Axial) - 1
	k := nearest(l.Keys, x)
	tol := mergeTolerance * l.Keys[last+1]
	if math.Abs(l.Keys[k]-x) <= tol {
		if side == Left {
			return max(k-1, 0)
		}
		return min(k, last)
	}
	if x < l.Keys[k] {
		return k - 1
	}
	return min(k, last)
}

// sameSlope reports whether l's loads run on straight through key i, so
// that it is no break of theirs (a key point of a point load, say). The
// intensities at a key point inside a ramp are interpolated from the
// load's own points, each with a rounding, so the slopes on either side
// are compared to within slopeRoundings roundings of the intensities that
// make them: compared exactly, 282 of the 333 point loads on a ramp of the
// drag benchmark's beam (bench.KeyPointModel) were breaks, and the
// refinement read the loads piece by piece at every fine node of the
// stretch. A kink of the load itself changes the slope by far more.
func sameSlope(l *Loads, i int) bool {
	h0, h1 := l.Keys[i]-l.Keys[i-1], l.Keys[i+1]-l.Keys[i]
	for _, v := range [][][2]float64{l.Axial, l.Transverse} {
		a, b := v[i-1], v[i]
		left, right := (a[1]-a[0])*h1, (b[1]-b[0])*h0
		size := (math.Abs(a[0])+math.Abs(a[1]))*h1 + (math.Abs(b[0])+math.Abs(b[1]))*h0
		if !(math.Abs(left-right) <= slopeRoundings*0x1p-52*size) {
			return false
		}
	}
	return true
}

// slopeRoundings is the number of roundings (ε = 2⁻⁵²) of the
// intensities within which sameSlope takes two slopes for one: a few per
// intensity interpolated, and per product.
const slopeRoundings = 16
