package fem

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// fromRoots is the monic polynomial with the given roots, times scale.
func fromRoots(scale float64, roots ...float64) Polynomial {
	p := Polynomial{scale}
	for _, r := range roots {
		var q Polynomial
		for k := len(p) - 1; k >= 0; k-- {
			q[k] = -r * p[k]
			if k > 0 {
				q[k] += p[k-1]
			}
		}
		p = q
	}
	return p
}

// Roots of polynomials built from their roots (the factored form is the
// definition of a root): those inside (0, 1) are found, in order, and no
// others; double roots at least once.
func TestPolynomialRoots(t *testing.T) {
	for _, c := range []struct {
		name  string
		p     Polynomial
		want  []float64
		tight bool // simple roots: to 1e-12; a double root only to about √ε
	}{
		{"constant", Polynomial{3}, nil, true},
		{"zero everywhere", Polynomial{}, nil, true},
		{"linear inside", fromRoots(2, 0.3), []float64{0.3}, true},
		{"linear outside", fromRoots(2, 1.3), nil, true},
		{"quadratic, both inside", fromRoots(-5, 0.7, 0.2), []float64{0.2, 0.7}, true},
		{"quadratic, one inside", fromRoots(1, -0.5, 0.25), []float64{0.25}, true},
		{"quadratic, complex roots", Polynomial{1, 0, 1}, nil, true},
		{"cubic, three inside", fromRoots(1, 0.9, 0.1, 0.5), []float64{0.1, 0.5, 0.9}, true},
		{"cubic, roots at the ends only", fromRoots(1, 0, 1, 2), nil, true},
		{"quartic, four inside", fromRoots(3e-7, 0.15, 0.35, 0.65, 0.85), []float64{0.15, 0.35, 0.65, 0.85}, true},
		{"quintic, five inside", fromRoots(1e6, 0.05, 0.25, 0.5, 0.75, 0.95), []float64{0.05, 0.25, 0.5, 0.75, 0.95}, true},
		{"quintic, close pair", fromRoots(1, 0.4, 0.4001, 2, 3, -1), []float64{0.4, 0.4001}, true},
		{"quartic, double root", fromRoots(1, 0.3, 0.3, 0.8, 1.5), []float64{0.3, 0.8}, false},
		{"quintic, tiny leading term", Polynomial{-0.25, 1, 0, 0, 0, 1e-20}, []float64{0.25}, true},
	} {
		t.Run(c.name, func(t *testing.T) {
			var r [polynomialTerms - 1]float64
			got := r[:c.p.roots(&r)]
			tol := 1e-12
			if !c.tight {
				tol = 1e-6
			}
			if len(got) < len(c.want) || len(got) > len(c.want)+1 || !slices.IsSorted(got) {
				t.Fatalf("roots %v, want %v", got, c.want)
			}
			for _, w := range c.want {
				i := slices.IndexFunc(got, func(g float64) bool { return math.Abs(g-w) <= tol })
				if i < 0 {
					t.Errorf("root %g not found in %v", w, got)
				}
			}
			if c.tight && len(got) != len(c.want) {
				t.Errorf("roots %v, want %v", got, c.want)
			}
		})
	}
}

// randomPolynomial draws a polynomial of degree up to 5 with coefficients of
// mixed sizes and signs.
func randomPolynomial(rnd *rand.Rand) (Polynomial, int) {
	var p Polynomial
	d := rnd.IntN(polynomialTerms)
	for k := 0; k <= d; k++ {
		p[k] = (rnd.Float64() - 0.5) * math.Pow(10, 4*rnd.Float64()-2)
	}
	return p, d
}

// The closed-form range of a polynomial on [0, 1] contains every value a
// dense sampling finds and is reached: the extremes of a continuous function
// on a closed interval lie at its ends or where its derivative vanishes
// (Fermat's theorem on stationary points). The Bernstein bound is never below
// the largest magnitude.
func TestPolynomialRangeAgainstDenseSampling(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 11))
	const samples = 20000
	for i := range 2000 {
		p, d := randomPolynomial(rnd)
		lo, hi := rangeOn(&p, d, p[0], p.At(1))
		sampledLo, sampledHi, scale := math.Inf(1), math.Inf(-1), 0.0
		for j := 0; j <= samples; j++ {
			v := p.At(float64(j) / samples)
			sampledLo, sampledHi = math.Min(sampledLo, v), math.Max(sampledHi, v)
		}
		for _, c := range p {
			scale += math.Abs(c)
		}
		floor := 1e-14 * scale
		// Between samples 1/samples apart a polynomial departs from its
		// extreme by at most |p''|/2·(1/(2·samples))², |p''| ≤ 20·scale.
		gap := 10 * scale / (4 * samples * samples)
		if lo.value > sampledLo+floor || hi.value < sampledHi-floor ||
			lo.value < sampledLo-gap-floor || hi.value > sampledHi+gap+floor {
			t.Errorf("polynomial %d %v: range [%.17g, %.17g], sampled [%.17g, %.17g]", i, p, lo.value, hi.value, sampledLo, sampledHi)
		}
		if v := p.At(lo.xi); math.Abs(v-lo.value) > floor {
			t.Errorf("polynomial %d %v: lowest %g reported at ξ = %g, where it is %g", i, p, lo.value, lo.xi, v)
		}
		if v := p.At(hi.xi); math.Abs(v-hi.value) > floor {
			t.Errorf("polynomial %d %v: highest %g reported at ξ = %g, where it is %g", i, p, hi.value, hi.xi, v)
		}
		if b := p.MaxAbsBound(); b < math.Max(-lo.value, hi.value)-floor {
			t.Errorf("polynomial %d %v: Bernstein bound %g below the largest magnitude %g", i, p, b, math.Max(-lo.value, hi.value))
		}
		// A polynomial that does not turn inside has its extremes at the ends.
		if !turnsInside(&p, d) {
			ends := [2]float64{p.At(0), p.At(1)}
			if sampledLo < min(ends[0], ends[1])-floor || sampledHi > max(ends[0], ends[1])+floor {
				t.Errorf("polynomial %d %v: said not to turn inside, but sampled from %g to %g between ends %g and %g", i, p, sampledLo, sampledHi, ends[0], ends[1])
			}
		}
	}
}

// The Gauss–Legendre rules integrate x^k exactly to degree 2n − 1:
// ∫₀¹ x^k dx = 1/(k + 1).
func TestGaussRulesExact(t *testing.T) {
	for _, c := range []struct {
		rule   []gaussPoint
		degree int
	}{{gauss4[:], 7}, {gauss6[:], 11}} {
		for k := 0; k <= c.degree; k++ {
			sum := 0.0
			for _, q := range c.rule {
				sum += q.w * math.Pow(q.xi, float64(k))
			}
			if math.Abs(sum-1/float64(k+1)) > 1e-15 {
				t.Errorf("%d points, x^%d: %.17g, want %.17g", len(c.rule), k, sum, 1/float64(k+1))
			}
		}
	}
}

// hermitePlusBubble is H + B with H the cubic of end values and slopes
// (w0, s0) and (w1, s1) in ξ, and B = ξ²(1−ξ)²·(α + βξ).
func hermitePlusBubble(w0, s0, w1, s1, alpha, beta float64) Polynomial {
	// Hermite cubic in the monomial basis.
	h := Polynomial{w0, s0, -3*w0 - 2*s0 + 3*w1 - s1, 2*w0 + s0 - 2*w1 + s1}
	return Polynomial{h[0], h[1], h[2] + alpha, h[3] + beta - 2*alpha, alpha - 2*beta, beta}
}

// maxAbsBeyond gives the largest |p| on [0, 1], or best if larger, as the
// search of maxAbs finds it: to 1e-9 where either part of p (see
// maxAbsBeyond) outweighs the other, and within the noise it is given
// where the Hermite part is noise. Drawn the way a comparison meets them:
// an element error ξ²(1−ξ)²·(α + βξ) and nodal round-off of every relative
// size, cubics, and random quintics.
func TestMaxAbsBeyond(t *testing.T) {
	rnd := rand.New(rand.NewPCG(3, 5))
	signed := func() float64 { return 2*rnd.Float64() - 1 }
	for i := range 20000 {
		var p Polynomial
		noise := 0.0
		switch i % 4 {
		case 0, 1: // element error plus nodal differences from 1e-16 to 1e2 of it, noise or not
			size := math.Pow(10, -16+18*rnd.Float64())
			p = hermitePlusBubble(size*signed(), size*signed(), size*signed(), size*signed(), signed(), 0.3*signed())
			if i%4 == 0 {
				noise = 16 * size
			}
		case 2: // a cubic
			p = Polynomial{signed(), signed(), signed(), signed()}
		default:
			p, _ = randomPolynomial(rnd)
		}
		best := 0.0
		if i%3 == 0 {
			best = maxAbs(&p, 5).value * (0.5 + rnd.Float64())
		}
		want := max(best, maxAbs(&p, 5).value)
		got := maxAbsBeyond(&p, best, noise)
		if math.Abs(got-want) > 1e-9*want+2*noise {
			t.Errorf("polynomial %d %v, best %g, noise %g: %.17g, want %.17g", i, p, best, noise, got, want)
		}
	}
}

// The bubbles' largest magnitude and the integral of their square in
// closed form agree with the search of maxAbs and with Gauss–Legendre
// quadrature of the same polynomials expanded; a polynomial that does not
// vanish at the ends beyond the noise is refused.
func TestBubbles(t *testing.T) {
	rnd := rand.New(rand.NewPCG(9, 1))
	square := func(p *Polynomial) float64 {
		sum := 0.0
		for _, q := range &gauss6 {
			v := p.At(q.xi)
			sum += q.w * v * v
		}
		return sum
	}
	for i := range 2000 {
		a, b := 2*rnd.Float64()-1, 2*rnd.Float64()-1
		if i%5 == 0 {
			b = 0 // a uniform load
		}
		h := hermitePlusBubble(0, 0, 0, 0, a, b)
		alpha, beta, ok := hermiteBubble(&h, 1e-14)
		if !ok || math.Abs(alpha-a) > 1e-15 || math.Abs(beta-b) > 1e-15 {
			t.Fatalf("hermiteBubble of %v: %g, %g, %v; want %g, %g", h, alpha, beta, ok, a, b)
		}
		if got, want := hermiteBubbleMax(a, b), maxAbs(&h, 5).value; math.Abs(got-want) > 1e-13*want {
			t.Errorf("Hermite bubble %g, %g: largest %.17g, want %.17g", a, b, got, want)
		}
		if got, want := hermiteBubbleSquare(a, b), square(&h); math.Abs(got-want) > 1e-13*want {
			t.Errorf("Hermite bubble %g, %g: square %.17g, want %.17g", a, b, got, want)
		}
		// ξ(1−ξ)(a + bξ) = aξ + (b − a)ξ² − bξ³.
		l := Polynomial{0, a, b - a, -b}
		la, lb, ok := linearBubble(&l, 1e-14)
		if !ok || math.Abs(la-a) > 1e-15 || math.Abs(lb-b) > 1e-15 {
			t.Fatalf("linearBubble of %v: %g, %g, %v; want %g, %g", l, la, lb, ok, a, b)
		}
		if got, want := linearBubbleMax(a, b), maxAbs(&l, 3).value; math.Abs(got-want) > 1e-13*want {
			t.Errorf("linear bubble %g, %g: largest %.17g, want %.17g", a, b, got, want)
		}
		if got, want := linearBubbleSquare(a, b), square(&l); math.Abs(got-want) > 1e-13*want {
			t.Errorf("linear bubble %g, %g: square %.17g, want %.17g", a, b, got, want)
		}
	}
	off := hermitePlusBubble(1e-9, 0, 0, 0, 1, 0)
	if _, _, ok := hermiteBubble(&off, 1e-12); ok {
		t.Error("hermiteBubble took a polynomial whose end value is beyond the noise")
	}
	line := Polynomial{0, 1, -1 + 1e-9}
	if _, _, ok := linearBubble(&line, 1e-12); ok {
		t.Error("linearBubble took a polynomial whose end value is beyond the noise")
	}
}

// The roots and the range of a polynomial do not depend on its scale: c·p
// has the roots of p, and its extremes are c times those of p at the same
// ξ (a property of polynomials). A field whose coefficients are near 1e-200
// (the deflection of a 1e-200 N load) squared them to zero in b² − 4ac and
// lost its turning points: the largest moment of such a beam was read at
// its end. Scales are powers of two, so c·p is exact and so must be the
// answers.
func TestPolynomialRootsAndRangeAreScaleFree(t *testing.T) {
	for _, c := range []struct {
		name string
		p    Polynomial
	}{
		{"quadratic with a vertex inside", fromRoots(-1, 0.2, 0.9)},
		{"cubic with two turns inside", fromRoots(1, 0.1, 0.5, 0.9)},
		// The moment of a simply supported beam under a triangular load,
		// ξ(1 − ξ²)/6 (Roark's Formulas, Table 8.1, from memory).
		{"cubic of a triangular load's moment", Polynomial{0, 1.0 / 6, 0, -1.0 / 6}},
		{"quartic with three turns inside", fromRoots(1, 0.1, 0.4, 0.6, 0.95)},
		{"quintic with four turns inside", fromRoots(1, 0.05, 0.3, 0.5, 0.7, 0.95)},
	} {
		d := c.p.Degree()
		var want [polynomialTerms - 1]float64
		nWant := c.p.roots(&want)
		lo, hi := rangeOn(&c.p, d, c.p[0], c.p.at(d, 1))
		for _, e := range []int{-900, -700, -520, 520, 900} {
			s := math.Ldexp(1, e)
			t.Run(fmt.Sprintf("%s, times 2^%d", c.name, e), func(t *testing.T) {
				var q Polynomial
				for k := range q {
					q[k] = c.p[k] * s
				}
				var got [polynomialTerms - 1]float64
				if n := q.roots(&got); !slices.Equal(got[:n], want[:nWant]) {
					t.Errorf("roots %v, want %v", got[:n], want[:nWant])
				}
				l, h := rangeOn(&q, d, q[0], q.at(d, 1))
				if l.xi != lo.xi || l.value != lo.value*s || h.xi != hi.xi || h.value != hi.value*s {
					t.Errorf("range [%g at ξ = %g, %g at ξ = %g], want [%g at %g, %g at %g]",
						l.value, l.xi, h.value, h.xi, lo.value*s, lo.xi, hi.value*s, hi.xi)
				}
			})
		}
	}
}

// scaledToOne divides by a power of two; by multiplication where 2^−e is a
// normal number, by math.Ldexp elsewhere. Both give the exact quotient
// correctly rounded (IEEE 754: a product by a power of two is exact unless
// it leaves the normal numbers, then rounded once), so the results must
// equal Ldexp's bit for bit: over coefficients from 1e−320 to 1e308, with
// small ones beside large ones (subnormal results) and signs mixed.
func TestScaledToOneMatchesLdexp(t *testing.T) {
	rnd := rand.New(rand.NewPCG(5, 6))
	value := func() float64 {
		v := math.Ldexp(0.5+0.5*rnd.Float64(), rnd.IntN(2100)-1070)
		if rnd.IntN(2) == 0 {
			v = -v
		}
		if rnd.IntN(10) == 0 {
			v = 0
		}
		return v
	}
	for range 200_000 {
		a, b, c := value(), value(), value()
		largest := max(math.Abs(a), math.Abs(b), math.Abs(c))
		if largest == 0 {
			continue
		}
		_, e := math.Frexp(largest)
		ga, gb, gc := scaledToOne(a, b, c)
		for i, pair := range [][2]float64{{ga, math.Ldexp(a, -e)}, {gb, math.Ldexp(b, -e)}, {gc, math.Ldexp(c, -e)}} {
			if math.Float64bits(pair[0]) != math.Float64bits(pair[1]) {
				t.Fatalf("scaledToOne(%g, %g, %g): coefficient %d is %g, Ldexp gives %g", a, b, c, i, pair[0], pair[1])
			}
		}
	}
}
