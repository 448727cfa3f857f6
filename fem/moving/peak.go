package moving

import (
	"math"

	"stave/fem"
)

// peakShear is the index of the shear force in EnvelopeQuantities, the
// moment's the next (axlePeaks).
const peakShear = 2

// fitNodes is the number of samples axlePeaks fits a polynomial through:
// one more than its degree, at most 5 (see axlePeaks).
const fitNodes = 6

// axlePeaks are the points where the bending moment, the bending stress
// and the shear force of train t are largest and smallest over the member
// and over every position, found exactly where they stand under an axle.
// For one position the moment has its corners and the shear force its
// jumps under the axles, so, but for a uniform load's own turn, their
// extremes over the member stand under an axle (or on a key point or an
// end, which are stations). The moment under axle a with the front at s,
// g(s) = Σ P_b·G(s + e_a, s + e_b) (G the moment at its first argument
// under a unit load at its second, e the axles' offsets), is a polynomial
// in s as long as no load passes a key point (the run's fixed breaks): G
// is linear in the point read within a stretch (M = M₀ + V·τ) and cubic in
// the load's place, so g has degree 4, 5 with a uniform load's integral;
// the shear force beside the axle has degree 3 (4). axlePeaks samples g
// between breaks at fitNodes Chebyshev points, fits the polynomial
// through them (which it is, to round-off), and takes its largest and
// smallest value at the ends and at the roots of its derivative. The
// points it returns are stations to add: the envelope there is exact.
// Peaks within peakTie of the largest (smallest) are all returned, so that
// of equal peaks (the two spans of a symmetric member) the envelope, exact
// at each, names the first along the member (Envelope.Worst), not the one
// the fit's round-off puts ahead.
func (in *Influence) axlePeaks(s *sweeps, e *Envelope) []float64 {
	type peak struct {
		kind     int // shear, moment, stress
		value, x float64
	}
	var peaks []peak
	take := func(k int, v, x float64) { peaks = append(peaks, peak{k, v, x}) }
	first, last := e.Stations[0], e.Stations[len(e.Stations)-1]
	tol := keyTolerance * s.length
	var nodes [fitNodes]float64
	for k := range nodes {
		nodes[k] = math.Cos(math.Pi * (float64(k) + 0.5) / fitNodes)
	}
	var ls lines
	var rs [2]reader
	// The samples: the shear force with the axle just before the point
	// and just beyond it, the moment, the stress; kinds says which of
	// found each takes.
	var samples [4][fitNodes]float64
	kinds := [4]int{0, 0, 1, 2}
	m := in.model
	for _, r := range workRuns(e.runs, s) {
		for a, ax := range r.axles {
			for j := 1; j < len(r.fixed); j++ {
				// The fronts that keep axle a on the stations' stretch.
				fa, fb := max(r.fixed[j-1], first-ax.offset), min(r.fixed[j], last-ax.offset)
				if fb-fa <= tol {
					continue
				}
				mid, half := 0.5*(fa+fb), 0.5*(fb-fa)
				var stress float64
				for k, t := range nodes {
					front := mid + half*t
					x := front + ax.offset
					i, tau := s.locate(x, fem.Right)
					for q, row := range [2]int{compV, compM} {
						_, scale, _ := s.quantityRow(EnvelopeQuantities[peakShear+q])
						rs[q] = s.stationReader(i, tau, row, scale)
						rs[q].x = x
					}
					// The lines under the train alone (to the bit as over
					// the whole member, but a uniform load's integrals).
					margin := cutMargin * r.tolerance
					ls.fillWindow(s, rs[:], max(s.stretchAt(front+r.minOff-margin)-1, 0), min(s.stretchAt(front+r.maxOff+margin)+1, len(s.keys)-2))
					var base [2]float64
					for b, other := range r.axles {
						if b != a {
							for q := range base {
								base[q] += other.load * ls.valueOn(q, front+other.offset)
							}
						}
					}
					if r.uniform {
						for q := range base {
							base[q] += r.q * (ls.integralOn(q, front+r.u1) - ls.integralOn(q, front+r.u0))
						}
					}
					if k == 0 {
						sec := m.Segments[m.SegmentAt(x)].Section
						stress = sec.FibreDistance / sec.SecondMoment
					}
					samples[0][k] = base[0] + ax.load*ls.value(0, x, fem.Left)
					samples[1][k] = base[0] + ax.load*ls.value(0, x, fem.Right)
					samples[2][k] = base[1] + ax.load*ls.value(1, x, fem.Right)
					samples[3][k] = samples[2][k] * stress
				}
				for q := range samples {
					c := fit(&nodes, &samples[q])
					ts := append([]float64{-1, 1}, rootsBetween(derivative(c[:]), -1, 1)...)
					for _, t := range ts {
						take(kinds[q], evalPoly(c[:], t), mid+half*t+ax.offset)
					}
				}
			}
		}
	}
	// The largest and smallest of each kind, and their size.
	var hi, lo [3]float64
	for k := range hi {
		hi[k], lo[k] = math.Inf(-1), math.Inf(1)
	}
	for _, p := range peaks {
		hi[p.kind], lo[p.kind] = max(hi[p.kind], p.value), min(lo[p.kind], p.value)
	}
	var out []float64
	for _, p := range peaks {
		tie := peakTie * max(math.Abs(hi[p.kind]), math.Abs(lo[p.kind]))
		if p.value >= hi[p.kind]-tie || p.value <= lo[p.kind]+tie {
			out = append(out, min(max(p.x, first), last))
		}
	}
	return out
}

// peakTie is the share of a quantity's size within which axlePeaks takes
// peaks for equal: the round-off of its fits, far above a tie of exact
// values (fem.Beyond), which the envelope then settles at each.
const peakTie = 1e-9

// fit is the polynomial of degree len(nodes) − 1 through the values at
// the nodes, its coefficients constant first: Newton's divided
// differences, then expanded (Horner) into powers.
func fit(nodes, values *[fitNodes]float64) [fitNodes]float64 {
	d := *values
	for k := 1; k < fitNodes; k++ {
		for i := fitNodes - 1; i >= k; i-- {
			d[i] = (d[i] - d[i-1]) / (nodes[i] - nodes[i-k])
		}
	}
	var c [fitNodes]float64
	for i := fitNodes - 1; i >= 0; i-- {
		// c ← c·(t − nodes[i]) + d[i]
		for k := fitNodes - 1; k > 0; k-- {
			c[k] = c[k-1] - nodes[i]*c[k]
		}
		c[0] = -nodes[i]*c[0] + d[i]
	}
	return c
}

// evalPoly is Σ c[k]·tᵏ.
func evalPoly(c []float64, t float64) float64 {
	v := 0.0
	for k := len(c) - 1; k >= 0; k-- {
		v = v*t + c[k]
	}
	return v
}

// derivative is the coefficients of the derivative of Σ c[k]·tᵏ.
func derivative(c []float64) []float64 {
	if len(c) < 2 {
		return nil
	}
	out := make([]float64, len(c)-1)
	for k := range out {
		out[k] = float64(k+1) * c[k+1]
	}
	return out
}

// rootsBetween are the roots of Σ c[k]·tᵏ strictly inside (lo, hi), in
// order: between the roots of its derivative the polynomial is monotone,
// with one root at most, found by bisection.
func rootsBetween(c []float64, lo, hi float64) []float64 {
	if len(c) < 2 {
		return nil
	}
	edges := append([]float64{lo}, rootsBetween(derivative(c), lo, hi)...)
	edges = append(edges, hi)
	var out []float64
	for i := 1; i < len(edges); i++ {
		a, b := edges[i-1], edges[i]
		fa, fb := evalPoly(c, a), evalPoly(c, b)
		if fa == 0 || (fa < 0) == (fb < 0) {
			continue
		}
		for range 100 {
			m := 0.5 * (a + b)
			if m <= a || m >= b {
				break
			}
			if fm := evalPoly(c, m); (fm < 0) == (fa < 0) {
				a, fa = m, fm
			} else {
				b = m
			}
		}
		if u := 0.5 * (a + b); u > lo && u < hi {
			out = append(out, u)
		}
	}
	return out
}
