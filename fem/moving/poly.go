package moving

import "math"

// poly is a polynomial of degree 4 at most, constant term first.
type poly [5]float64

// at evaluates p at u (Horner).
func (p *poly) at(u float64) float64 {
	return (((p[4]*u+p[3])*u+p[2])*u+p[1])*u + p[0]
}

// shift returns q(u) = p(u + t) (repeated synthetic division, Knuth,
// TAOCP vol. 2, 4.6.4, from memory).
func (p poly) shift(t float64) poly {
	switch {
	case t == 0:
	case p[4] == 0: // a cubic, as every influence line is
		p[2] += t * p[3]
		p[1] += t * p[2]
		p[0] += t * p[1]
		p[2] += t * p[3]
		p[1] += t * p[2]
		p[2] += t * p[3]
	default:
		for i := range 4 {
			for k := 3; k >= i; k-- {
				p[k] += t * p[k+1]
			}
		}
	}
	return p
}

// addShifted sets p to p + c·q(u + t), as add(c, q.shift(t)) does, but
// for a cubic q (every influence line) in one pass: the shifted cubic's
// coefficients are q(t), q′(t), q″(t)/2 and q₃ (Taylor).
func (p *poly) addShifted(c float64, q *poly, t float64) {
	if q[4] != 0 {
		s := q.shift(t)
		p.add(c, &s)
		return
	}
	q3, q2, q1 := c*q[3], c*q[2], c*q[1]
	p[0] += ((q3*t+q2)*t+q1)*t + c*q[0]
	p[1] += (3*q3*t+2*q2)*t + q1
	p[2] += 3*q3*t + q2
	p[3] += q3
}

// derivative is p′.
func (p *poly) derivative() poly {
	return poly{p[1], 2 * p[2], 3 * p[3], 4 * p[4]}
}

// antiderivative is the integral of the cubic p from 0, a quartic.
func (p *poly) antiderivative() poly {
	return poly{0, p[0], p[1] / 2, p[2] / 3, p[3] / 4}
}

// add sets p to p + c·q.
func (p *poly) add(c float64, q *poly) {
	for k := range p {
		p[k] += c * q[k]
	}
}

// rootsIn writes to out the roots of p, of degree 3 at most, strictly
// inside (lo, hi) and returns how many there are.
func rootsIn(p poly, lo, hi float64, out *[3]float64) int {
	deg := 3
	for deg > 0 && p[deg] == 0 {
		deg--
	}
	n := 0
	keep := func(u float64) {
		if u > lo && u < hi {
			out[n] = u
			n++
		}
	}
	switch deg {
	case 1:
		keep(-p[0] / p[1])
	case 2:
		for _, u := range quadraticRoots(p[2], p[1], p[0]) {
			if !math.IsNaN(u) {
				keep(u)
			}
		}
		if n == 2 && out[0] > out[1] {
			out[0], out[1] = out[1], out[0]
		}
	case 3:
		// Between the roots of p′ (and the ends) p is monotone: one root
		// at most in each piece, found by bisection.
		edges := [4]float64{lo}
		m := 1
		for _, u := range quadraticRoots(3*p[3], 2*p[2], p[1]) {
			if u > lo && u < hi {
				edges[m] = u
				m++
			}
		}
		if m == 3 && edges[1] > edges[2] {
			edges[1], edges[2] = edges[2], edges[1]
		}
		edges[m] = hi
		for i := range m {
			if u, ok := bisect(&p, edges[i], edges[i+1]); ok {
				keep(u)
			}
		}
	}
	return n
}

// quadraticRoots are the real roots of a·u² + b·u + c, NaN where there are
// none, computed without cancellation.
func quadraticRoots(a, b, c float64) [2]float64 {
	nan := math.NaN()
	if a == 0 {
		if b == 0 {
			return [2]float64{nan, nan}
		}
		return [2]float64{-c / b, nan}
	}
	disc := b*b - 4*a*c
	if disc < 0 {
		return [2]float64{nan, nan}
	}
	q := -0.5 * (b + math.Copysign(math.Sqrt(disc), b))
	if q == 0 {
		return [2]float64{0, nan}
	}
	return [2]float64{q / a, c / q}
}

// bisect finds the root of p in [a, b] when p changes sign there.
func bisect(p *poly, a, b float64) (float64, bool) {
	fa, fb := p.at(a), p.at(b)
	if fa == 0 {
		return a, true
	}
	if (fa < 0) == (fb < 0) {
		return 0, false
	}
	for range 80 {
		m := 0.5 * (a + b)
		if m <= a || m >= b {
			break
		}
		fm := p.at(m)
		if (fm < 0) == (fa < 0) {
			a, fa = m, fm
		} else {
			b = m
		}
	}
	return 0.5 * (a + b), true
}
