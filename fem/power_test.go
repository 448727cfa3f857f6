package fem

import (
	"math"
	"math/rand/v2"
	"testing"
)

// integerPower agrees with math.Pow to the bit for the orders the exact
// equations use, on lengths from 1e-9 to 1e9 m and the edges of float64.
func TestIntegerPower(t *testing.T) {
	rnd := rand.New(rand.NewPCG(4, 2))
	xs := []float64{0, 1, 0.1, 3, math.SmallestNonzeroFloat64, math.MaxFloat64, 1e-100, 1e100}
	for range 100_000 {
		xs = append(xs, math.Pow(10, 18*rnd.Float64()-9))
	}
	for _, x := range xs {
		for d := 0; d <= 4; d++ {
			if got, want := integerPower(x, d), math.Pow(x, float64(d)); got != want && !(math.IsNaN(got) && math.IsNaN(want)) {
				t.Fatalf("integerPower(%g, %d) = %.17g, math.Pow gives %.17g", x, d, got, want)
			}
		}
	}
}

// monomial reads the ends of a stretch from a table: it must give
// monomialDerivative's values to the bit there, and elsewhere, and for
// terms and derivatives the table does not hold.
func TestMonomial(t *testing.T) {
	for _, x := range []float64{0, 1, 0.5, 0.3, -1, 2} {
		for k := range 8 {
			for d := range 6 {
				if got, want := monomial(k, d, x), monomialDerivative(k, d, x); math.Float64bits(got) != math.Float64bits(want) {
					t.Errorf("monomial(%d, %d, %g) = %.17g, monomialDerivative gives %.17g", k, d, x, got, want)
				}
			}
		}
	}
}

// bases fills a row of basis values times unit^k, from the table at a
// polynomial stretch's ends: the same values to the bit as basis one by
// one scaled by the power of two, on and off a foundation, at the ends and
// inside.
func TestBases(t *testing.T) {
	solutions := map[string]stretchSolution{
		"beam":               newStretchSolution(4, 2e7, 1.5, -1e3, 2e3),
		"bar":                newStretchSolution(2, 4e8, 0.7, 10, -5),
		"beam on foundation": newGroundSolution(4, 2e7, 1.5, 3e7, -1e3, 2e3),
		"bar on foundation":  newGroundSolution(2, 4e8, 0.7, 2e8, 10, -5),
	}
	for name, s := range solutions {
		for _, x := range []float64{0, 1, 0.25} {
			for d := range 4 {
				v := make([]float64, s.order)
				s.bases(d, x, v)
				for k, got := range v {
					if want := s.basis(k, d, x) * math.Pow(s.unit, float64(k)); math.Float64bits(got) != math.Float64bits(want) {
						t.Errorf("%s: bases(%d, %g)[%d] = %.17g, basis %.17g", name, d, x, k, got, want)
					}
				}
			}
		}
	}
}
