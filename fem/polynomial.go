package fem

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// Polynomial is Σ P[k]·ξ^k in a local coordinate ξ ∈ [0, 1]: every field of
// an element, and of a stretch of the exact solution, is one (a quintic at
// most: the exact deflection under a linearly varying load).
type Polynomial [polynomialTerms]float64

// polynomialTerms is the number of coefficients of a Polynomial.
const polynomialTerms = 6

// At is the value at ξ, by Horner's rule.
func (p *Polynomial) At(xi float64) float64 {
	return p[0] + xi*(p[1]+xi*(p[2]+xi*(p[3]+xi*(p[4]+xi*p[5]))))
}

// Derivative is dP/dξ.
func (p *Polynomial) Derivative() Polynomial {
	return Polynomial{p[1], 2 * p[2], 3 * p[3], 4 * p[4], 5 * p[5]}
}

// Degree is the index of the last coefficient that is not zero; 0 for a
// constant, zero included.
func (p *Polynomial) Degree() int {
	for d := polynomialTerms - 1; d > 0; d-- {
		if p[d] != 0 {
			return d
		}
	}
	return 0
}

// at is At for a polynomial of degree at most d.
func (p *Polynomial) at(d int, xi float64) float64 {
	if d == 3 {
		return p.at3(xi)
	}
	v := p[d]
	for k := d - 1; k >= 0; k-- {
		v = v*xi + p[k]
	}
	return v
}

// at2 and at3 are At for polynomials of degree 2 and 3 at most, written
// out for the hot loops.
func (p *Polynomial) at2(xi float64) float64 { return p[0] + xi*(p[1]+xi*p[2]) }
func (p *Polynomial) at3(xi float64) float64 { return p[0] + xi*(p[1]+xi*(p[2]+xi*p[3])) }

// roots writes the real roots of p inside the open interval (0, 1) to r, in
// increasing order, and returns how many there are. A polynomial that is
// zero everywhere has none. Degree 1 and 2 are solved in closed form;
// higher degrees are split at the roots of the derivative (found the same
// way) into intervals where p is monotone, each of which holds one root at
// most, found by Newton's method kept inside its bracket. Nothing is
// allocated.
func (p *Polynomial) roots(r *[polynomialTerms - 1]float64) int {
	switch d := p.Degree(); d {
	case 0:
		return 0
	case 1:
		return keepInside(r, []float64{-p[0] / p[1]})
	case 2:
		var q [2]float64
		return keepInside(r, quadraticRoots(p[2], p[1], p[0], q[:0]))
	default:
		dp := p.Derivative()
		var turns [polynomialTerms - 1]float64
		nt := dp.roots(&turns)
		n := 0
		lo, vlo := 0.0, p.at(d, 0)
		for i := 0; i <= nt; i++ {
			hi := 1.0
			if i < nt {
				hi = turns[i]
			}
			vhi := p.at(d, hi)
			switch {
			case vhi == 0 && hi < 1:
				r[n], n = hi, n+1 // touches or crosses zero at a turning point
			case vlo < 0 && vhi > 0 || vlo > 0 && vhi < 0:
				r[n], n = bracketedRoot(p, &dp, d, lo, hi, vlo, vhi), n+1
			}
			lo, vlo = hi, vhi
		}
		return n
	}
}

// keepInside copies the roots in (0, 1) to r, sorted, and returns how many.
func keepInside(r *[polynomialTerms - 1]float64, roots []float64) int {
	n := 0
	for _, x := range roots {
		if x > 0 && x < 1 {
			r[n], n = x, n+1
		}
	}
	if n == 2 && r[1] < r[0] {
		r[0], r[1] = r[1], r[0]
	}
	return n
}

// quadraticRoots appends the real roots of a·x² + b·x + c (a ≠ 0) to dst:
// the root free of cancellation, then the other from the product of the
// roots (Numerical Recipes, ch. 5.6, from memory).
func quadraticRoots(a, b, c float64, dst []float64) []float64 {
	a, b, c = scaledToOne(a, b, c)
	disc := b*b - 4*a*c
	if disc < 0 {
		return dst
	}
	q := -0.5 * (b + math.Copysign(math.Sqrt(disc), b))
	if q == 0 { // b = 0 and c = 0: a double root at 0
		return append(dst, 0)
	}
	return append(dst, q/a, c/q)
}

// scaledToOne is a, b, c divided by the power of two that brings the
// largest of them into [0.5, 1): the coefficients of a quadratic whose
// discriminant b² − 4ac would underflow to zero (a field near 1e-200 in SI
// units, say) or overflow, with the same roots, bit for bit where it would
// not.
func scaledToOne(a, b, c float64) (float64, float64, float64) {
	largest := max(math.Abs(a), math.Abs(b), math.Abs(c))
	if largest == 0 || math.IsInf(largest, 0) || math.IsNaN(largest) {
		return a, b, c
	}
	_, e := math.Frexp(largest)
	if e < -1021 || e > 1021 {
		return math.Ldexp(a, -e), math.Ldexp(b, -e), math.Ldexp(c, -e)
	}
	// 2^−e is a normal number: multiplying by it rounds as Ldexp does (both
	// give the exact product correctly rounded), at a fraction of the cost.
	f := math.Float64frombits(uint64(1023-e) << 52)
	return a * f, b * f, c * f
}

// bracketedRoot finds the one root of p (of degree d, derivative dp) in
// [lo, hi], where p is monotone and changes sign: Newton steps from the
// secant point, replaced by bisection whenever one would leave the bracket.
func bracketedRoot(p, dp *Polynomial, d int, lo, hi, vlo, vhi float64) float64 {
	x := lo + (hi-lo)*vlo/(vlo-vhi)
	if !(x > lo && x < hi) {
		x = lo + (hi-lo)/2
	}
	for range 100 {
		v := p.at(d, x)
		if v == 0 {
			return x
		}
		if (v < 0) == (vlo < 0) {
			lo = x
		} else {
			hi = x
		}
		next := x - v/dp.at(d-1, x)
		if !(next > lo && next < hi) {
			next = lo + (hi-lo)/2
		}
		if math.Abs(next-x) <= 0x1p-52 || hi-lo <= 0x1p-52 {
			return next
		}
		x = next
	}
	return x
}

// Point is a value of a field and where it is taken.
type Point struct {
	X     float64 // m
	Value float64
}

// endSlack is how near an end of an interval (in ξ) a root of a
// derivative may lie and still be taken as that end. Round-off in the
// coefficients moves a stationary point at an end (the rotation at a pinned
// end, where M = 0) an ulp or a few inside, where the value differs from
// the end's by the square of that distance, far below round-off, yet may
// win a tie with it: the extreme is then named an ulp short of the node or
// key point it is at (7.999999999999999 m for 8 m).
const endSlack = 64 * 0x1p-52

// within reports whether a root ξ of a derivative lies inside (a, b) by
// more than endSlack: a stationary point to take beside the ends.
func within(xi, a, b float64) bool { return xi > a+endSlack && xi < b-endSlack }

// rangeOn returns the smallest and largest value of p, of degree at most d,
// on [0, 1] in ξ: candidates are the ends, valued v0 and v1 (the element's
// own values there, see Interval), and the roots of the derivative inside
// (within), in closed form up to degree 3; the start wins a tie with the
// end, and a root inside must go beyond both ends by more than a tie (turn).
func rangeOn(p *Polynomial, d int, v0, v1 float64) (lo, hi extremum) {
	lo, hi = endsRange(v0, v1)
	switch {
	case d == 2:
		if xi := -p[1] / (2 * p[2]); within(xi, 0, 1) {
			turn(&lo, &hi, xi, p.at(2, xi))
		}
	case d == 3:
		// p' = 3·p3·ξ² + 2·p2·ξ + p1, its roots as quadraticRoots finds them.
		a, b, c := scaledToOne(3*p[3], 2*p[2], p[1])
		if disc := b*b - 4*a*c; disc >= 0 {
			q := -0.5 * (b + math.Copysign(math.Sqrt(disc), b))
			r0, r1 := q/a, c/q
			if r1 < r0 {
				r0, r1 = r1, r0
			}
			for _, xi := range [2]float64{r0, r1} {
				if within(xi, 0, 1) {
					turn(&lo, &hi, xi, p.at(3, xi))
				}
			}
		}
	case d > 3:
		dp := p.Derivative()
		var r [polynomialTerms - 1]float64
		for _, xi := range r[:dp.roots(&r)] {
			if within(xi, 0, 1) {
				turn(&lo, &hi, xi, p.at(d, xi))
			}
		}
	}
	return lo, hi
}

// turn takes the value v of a stationary point inside an interval, at ξ,
// into lo and hi, which hold the ends' values and any turns before it,
// where it goes beyond them by more than a tie (Beyond). A turn that only
// ties with an end is the end's value reached a little inside, where the
// field is flat: a root of the derivative that is a multiple root at the
// end, found to round-off. The rotation of a cantilever whose load falls
// to nothing at its free end turns there with M, V and q all zero, and the
// triple root of M was found 5e-5 m inside a 6 m member, whose value beat
// the end's by round-off and named 5.99995 m for the free end's rotation.
func turn(lo, hi *extremum, xi, v float64) {
	if Beyond(lo.value, v) {
		*lo = extremum{xi, v}
	}
	if Beyond(v, hi.value) {
		*hi = extremum{xi, v}
	}
}

// turnsInside reports whether p, of degree at most d, may turn inside
// (0, 1), where its derivative could vanish; false means it is monotone
// there and its extremes are at the ends. Cheap for degree 3 and less,
// true for more.
func turnsInside(p *Polynomial, d int) bool {
	switch {
	case d <= 1:
		return false
	case d == 2:
		return (p[1] < 0) != (p[1]+2*p[2] < 0)
	case d == 3:
		// p' = p1 + 2·p2·ξ + 3·p3·ξ², its values at the ends and at its vertex.
		d0, d1 := p[1], p[1]+2*p[2]+3*p[3]
		if (d0 < 0) != (d1 < 0) {
			return true
		}
		vertex := -p[2] / (3 * p[3])
		return vertex > 0 && vertex < 1 && (p[1]+vertex*(2*p[2]+3*p[3]*vertex) < 0) != (d0 < 0)
	}
	return true
}

// maxAbs is the largest |p| on [0, 1] for p of degree at most d, and where.
func maxAbs(p *Polynomial, d int) extremum {
	lo, hi := rangeOn(p, d, p[0], p.at(d, 1))
	if -lo.value > hi.value {
		return extremum{lo.xi, -lo.value}
	}
	return hi
}

// extremum is a value at a local coordinate ξ.
type extremum struct{ xi, value float64 }

// least takes (xi, v) when v is below e.
func (e *extremum) least(xi, v float64) {
	if v < e.value {
		e.xi, e.value = xi, v
	}
}

// most takes (xi, v) when v is above e.
func (e *extremum) most(xi, v float64) {
	if v > e.value {
		e.xi, e.value = xi, v
	}
}

// MaxAbsBound bounds |p| on [0, 1] from above, cheaply: by the largest
// magnitude of its coefficients in the Bernstein basis of degree 5 (of
// degree 3 for a cubic, a tighter bound), whose
// convex hull holds p (Farin, Curves and Surfaces for CAGD, ch. 5, from
// memory). The bound is reached at the ends and is within a small factor of
// the maximum inside, so a search for a largest value can skip the
// intervals whose bound does not beat the largest so far.
func (p *Polynomial) MaxAbsBound() float64 {
	if p[4] == 0 && p[5] == 0 {
		return cubicBound(p) // tighter, and cheaper: a walk asks for it per element
	}
	// b_i = Σ_{k ≤ i} C(i, k)/C(5, k)·p_k.
	c1, c2, c3, c4 := p[1]/5, p[2]/10, p[3]/10, p[4]/5
	b0, b1, b2 := p[0], p[0]+c1, p[0]+2*c1+c2
	b3, b4 := p[0]+3*c1+3*c2+c3, p[0]+4*c1+6*c2+4*c3+c4
	b5 := p[0] + p[1] + p[2] + p[3] + p[4] + p[5]
	lo, hi := min(b0, b1, b2), max(b0, b1, b2)
	lo, hi = min(lo, b3, b4, b5), max(hi, b3, b4, b5)
	return max(hi, -lo)
}

// gaussPoint is one point of a Gauss–Legendre rule on [0, 1].
type gaussPoint struct{ xi, w float64 }

// The Gauss–Legendre rules the error integrals use: n points integrate
// polynomials of degree 2n − 1 exactly on [0, 1] (gonum's quad.Legendre).
// Arrays, not slices: the hot loops over them carry no bounds checks.
var (
	gauss4 = [4]gaussPoint(legendre(4)) // degree 7: the square of a cubic
	gauss6 = [6]gaussPoint(legendre(6)) // degree 11: the square of a quintic
)

func legendre(n int) []gaussPoint {
	xs, ws := make([]float64, n), make([]float64, n)
	quad.Legendre{}.FixedLocations(xs, ws, 0, 1)
	out := make([]gaussPoint, n)
	for i := range out {
		out[i] = gaussPoint{xs[i], ws[i]}
	}
	return out
}

// cubicBound bounds |p| on [0, 1] from above for p of degree 3 at most, by
// its Bernstein coefficients of degree 3 (see MaxAbsBound).
func cubicBound(p *Polynomial) float64 {
	b1 := p[0] + p[1]*(1.0/3)
	b2 := b1 + (p[1]+p[2])*(1.0/3)
	b3 := p[0] + p[1] + p[2] + p[3]
	return larger(larger(math.Abs(p[0]), math.Abs(b1)), larger(math.Abs(b2), math.Abs(b3)))
}

// larger is the larger of a and b, for bounds in hot loops: cheaper than
// max, which also orders zeros by sign and passes NaN on.
func larger(a, b float64) float64 {
	if a > b {
		return a
	}
	return b
}

// quinticShare is the largest size of the smaller part of a quintic (see
// maxAbsBeyond), relative to the larger, at which its extremes are taken
// from the larger part's, polished by Newton's method.
const quinticShare = 1e-2

// maxAbsBeyond returns the larger of best and the largest |p| on [0, 1], p
// of degree 5 at most, without a search where it can. Any such p is
// p(0) + V + B: V + p(0) = H, the cubic with p's values and slopes at both
// ends (Hermite interpolation), and B = ξ²(1−ξ)²·(α + βξ), α = p4 + 2·p5,
// β = p5. On the elements of a fine mesh one of V and B varies much more
// than the other: B, the error of a Hermite element, where the mesh is
// coarse enough for it to outweigh round-off at the nodes, V where it is
// not. Each part's extremes are in closed form (the roots of a quadratic),
// and p's lie near the larger part's. With m the largest |p| at the ends
// and at the larger part's extremes, and s a bound of the smaller part,
// max |p| ≤ m + 2s: the element is skipped where m + 2s ≤ best. Where the
// smaller part is within quinticShare of the larger, or where V is no
// larger than noise, the round-off of p's nodal values (p being a
// difference of two fields of size noise/ε on the element), p's extremes
// are taken at both parts' extremes polished by Newton steps on p′: the
// error then falls with the square of the share, or stays within the
// noise (TestMaxAbsBeyond checks it against a search). Otherwise they are
// searched for (maxAbs).
func maxAbsBeyond(p *Polynomial, best, noise float64) float64 {
	if p[4] == 0 && p[5] == 0 {
		if cubicBound(p) <= best {
			return best
		}
		return max(best, maxAbs(p, 3).value)
	}
	if p.MaxAbsBound() <= best {
		return best
	}
	beta := p[5]
	alpha := p[4] + 2*beta
	end := p.At(1)
	endSlope := p[1] + 2*p[2] + 3*p[3] + 4*p[4] + 5*p[5]
	// The Hermite functions on [0, 1]: N3 = 1 − N1 ∈ [0, 1], |N2| and |N4|
	// at most 4/27; and ξ²(1−ξ)² ≤ 1/16.
	vBound := math.Abs(end-p[0]) + 4.0/27*(math.Abs(p[1])+math.Abs(endSlope))
	bBound := max(math.Abs(alpha), math.Abs(alpha+beta)) / 16
	// B' = ξ(1−ξ)·(2α + (3β − 4α)·ξ − 5β·ξ²); H' = p1 + 2·h2·ξ + 3·h3·ξ²
	// with h2, h3 the coefficients of H. Their real roots, brought into
	// [0, 1]: p' may have a root inside near one just outside.
	var rb, rh [2]float64
	nb := realRoots(-5*beta, 3*beta-4*alpha, 2*alpha, &rb)
	nh := realRoots(3*(p[3]-beta+2*alpha), 2*(p[2]-alpha), p[1], &rh)
	found := max(math.Abs(p[0]), math.Abs(end))
	larger, slack, share := rb[:nb], vBound, vBound/bBound
	if vBound > bBound {
		larger, slack, share = rh[:nh], bBound, bBound/vBound
	}
	for _, xi := range larger {
		found = max(found, math.Abs(p.At(xi)))
	}
	switch {
	case found+2*slack <= best:
		return best
	case share > quinticShare && vBound > noise:
		return max(best, maxAbs(p, 5).value)
	}
	dp := p.Derivative()
	ddp := dp.Derivative()
	var starts [4]float64 // both parts' turning points, on the stack
	k := copy(starts[:], rb[:nb])
	k += copy(starts[k:], rh[:nh])
	for _, xi := range starts[:k] {
		found = max(found, math.Abs(p.At(newtonTurn(&dp, &ddp, xi))))
	}
	return max(best, found)
}

// Where a finite element field agrees with the exact one at the nodes (in
// one dimension with consistent loads its nodal values are exact, Strang &
// Fix, An Analysis of the Finite Element Method, ch. 1, from memory), the
// error on an element is a bubble: for the Hermite deflection p =
// ξ²(1−ξ)²·(α + βξ), values and slopes vanishing at both ends; for the
// bar's displacement p = ξ(1−ξ)·(a + bξ), values vanishing. Their largest
// magnitude and the integral of their square are then in closed form.

// hermiteBubble returns α and β of p = ξ²(1−ξ)²·(α + βξ), p of degree 5 at
// most, when p's values and slopes at both ends are within noise of zero;
// false otherwise.
func hermiteBubble(p *Polynomial, noise float64) (alpha, beta float64, ok bool) {
	end := p[0] + p[1] + p[2] + p[3] + p[4] + p[5]
	endSlope := p[1] + 2*p[2] + 3*p[3] + 4*p[4] + 5*p[5]
	if !(math.Abs(p[0]) <= noise && math.Abs(p[1]) <= noise && math.Abs(end) <= noise && math.Abs(endSlope) <= noise) {
		return 0, 0, false
	}
	return p[4] + 2*p[5], p[5], true
}

// hermiteBubbleMax is the largest |ξ²(1−ξ)²·(α + βξ)| on [0, 1]: at a root
// of 2α + (3β − 4α)·ξ − 5β·ξ², where its derivative
// ξ(1−ξ)·(2α + (3β − 4α)·ξ − 5β·ξ²) vanishes inside.
func hermiteBubbleMax(alpha, beta float64) float64 {
	var r [2]float64
	largest := 0.0
	for _, xi := range r[:realRoots(-5*beta, 3*beta-4*alpha, 2*alpha, &r)] {
		s := xi * (1 - xi)
		largest = larger(largest, math.Abs(s*s*(alpha+beta*xi)))
	}
	return largest
}

// hermiteBubbleSquare is ∫₀¹ (ξ²(1−ξ)²·(α + βξ))² dξ =
// α²·B(5,5) + 2αβ·B(6,5) + β²·B(7,5), B the beta function.
func hermiteBubbleSquare(alpha, beta float64) float64 {
	return alpha*alpha/630 + alpha*beta/630 + beta*beta/2310
}

// linearBubble returns a and b of p = ξ(1−ξ)·(a + bξ), p of degree 3 at
// most, when p's values at both ends are within noise of zero; false
// otherwise.
func linearBubble(p *Polynomial, noise float64) (a, b float64, ok bool) {
	if !(math.Abs(p[0]) <= noise && math.Abs(p[0]+p[1]+p[2]+p[3]) <= noise) {
		return 0, 0, false
	}
	return -p[2] - p[3], -p[3], true
}

// linearBubbleMax is the largest |ξ(1−ξ)·(a + bξ)| on [0, 1]: at a root of
// its derivative a + 2(b − a)·ξ − 3b·ξ².
func linearBubbleMax(a, b float64) float64 {
	var r [2]float64
	largest := 0.0
	for _, xi := range r[:realRoots(-3*b, 2*(b-a), a, &r)] {
		largest = larger(largest, math.Abs(xi*(1-xi)*(a+b*xi)))
	}
	return largest
}

// linearBubbleSquare is ∫₀¹ (ξ(1−ξ)·(a + bξ))² dξ =
// a²·B(3,3) + 2ab·B(4,3) + b²·B(5,3).
func linearBubbleSquare(a, b float64) float64 {
	return a*a/30 + a*b/30 + b*b/105
}

// realRoots writes the real roots of a·ξ² + b·ξ + c, clamped to [0, 1],
// to r and returns how many there are; a and b may be zero.
func realRoots(a, b, c float64, r *[2]float64) int {
	switch {
	case a != 0:
		a, b, c = scaledToOne(a, b, c)
		disc := b*b - 4*a*c
		if disc < 0 {
			return 0
		}
		q := -0.5 * (b + math.Copysign(math.Sqrt(disc), b))
		if q == 0 {
			r[0] = 0 // a double root at 0
			return 1
		}
		r[0], r[1] = min(max(q/a, 0), 1), min(max(c/q, 0), 1)
		return 2
	case b != 0:
		r[0] = min(max(-c/b, 0), 1)
		return 1
	}
	return 0
}

// newtonTurn is xi moved by up to three Newton steps towards a root of dp
// (the derivative of a quintic; ddp its own), staying inside (0, 1).
func newtonTurn(dp, ddp *Polynomial, xi float64) float64 {
	for range 3 {
		step := dp.at(4, xi) / ddp.at(3, xi)
		next := xi - step
		if !(next > 0 && next < 1) {
			break
		}
		xi = next
		if math.Abs(step) <= 0x1p-40 {
			break
		}
	}
	return xi
}

// extremeTie is the relative difference within which two extremes tie:
// round-off, which would otherwise choose between the equal peaks of a
// symmetric member (the two spans of a symmetric continuous beam).
const extremeTie = 1e-12

// Beyond reports whether a exceeds b by more than a tie (extremeTie of the
// smaller size; an infinite b, the start of a search, is exceeded by every
// number): a search along the member takes a later place for its largest
// value only then, and for its smallest only where Beyond(earlier, later),
// so that of two equal peaks the first along the member is named
// everywhere, in the tables, the envelopes and the drawings.
func Beyond(a, b float64) bool {
	return a > b && !(a-b <= extremeTie*min(math.Abs(a), math.Abs(b)))
}

// BeyondField is Beyond where a and b are values of one field whose
// largest magnitude is scale: a must also exceed b by more than extremeTie
// of scale, so that round-off about zero (a deflection of 1e-18 m beside a
// support's 0) does not name a place of its own.
func BeyondField(a, b, scale float64) bool {
	return Beyond(a, b) && a-b > extremeTie*scale
}
