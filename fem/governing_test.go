package fem

import (
	"math"
	"testing"
)

// mirroredLoads is a beam continuous over two equal spans L = 4 m with
// one combination per case, each a point force P = 10 kN down at one of
// xs: two loads at mirror places (2.9 m and 5.1 m) give the same extremes
// at mirror places and the same middle reaction, each to round-off of its
// own.
func mirroredLoads(xs ...float64) *Model {
	m := twoEqualSpans(4, 200e9, 1.6e-5)
	for k, x := range xs {
		m.Cases = append(m.Cases, LoadCase{Name: string(rune('a' + k)), PointLoads: []PointLoad{{X: x, Transverse: -10e3}}})
		m.Combinations = append(m.Combinations, Combination{Name: string(rune('a' + k)), Kind: Strength, Factors: []CaseFactor{{Case: k, Factor: 1}}})
	}
	m.Mesh.Elements = 64
	return m
}

// Where combinations tie (to round-off) for an extreme, the first in the
// file's order is named, wherever along the member its own extreme lies;
// it was the one that came first along the member for the quantities,
// and the one whose round-off was larger for the reactions.
//
// Two equal spans L with P at a from the end of a span: by the
// three-moment equation M over the middle support is
// −P·a·(L² − a²)/(4L²) (Timoshenko & Gere, continuous beams, from
// memory), so with a = 2.9 m the middle reaction is P·a/L + 2|M|/L =
// 8969.609375 N and the moment under the load R·a = 5481.56640625 N·m
// with the end reaction R = P·(L − a)/L − |M|/L = 1890.1953125 N; the same
// from either span by symmetry.
func TestTiesGoToTheFirstCombination(t *testing.T) {
	const moment, middle = 5481.56640625, 8969.609375
	for _, c := range []struct {
		name  string
		xs    []float64
		first float64 // where the first combination's largest moment is, m
	}{
		{"right span first", []float64{5.1, 2.9}, 5.1},
		{"left span first", []float64{2.9, 5.1}, 2.9},
	} {
		_, cs := solveCombinations(t, mirroredLoads(c.xs...))
		env := cs.Envelope()
		m := env.Quantities[QBendingMoment].Max
		if math.Abs(m.Value-moment) > 1e-9*moment || m.Combination != 0 || math.Abs(m.X-c.first) > 1e-12 {
			t.Errorf("%s: largest moment %.12g N·m at x = %g m by combination %d; want %.12g at %g m by the first, 0",
				c.name, m.Value, m.X, m.Combination, moment, c.first)
		}
		r := env.Reactions[1].Max[Transverse]
		if math.Abs(r.Value-middle) > 1e-9*middle || r.Combination != 0 {
			t.Errorf("%s: largest middle reaction %.17g N by combination %d; want %.12g by the first, 0", c.name, r.Value, r.Combination, middle)
		}
	}
}

// An extreme where the field of its combination jumps (the shear force
// at a support) says on which side of the point it is read; one where the
// field is continuous (the moment there, a span's deflection) says none.
// Three equal spans L under a permanent load g on all and an imposed load
// q placed by span, combined 1.35g + 1.5q: the shear force is most
// negative just left of the first inner support with spans 1 and 2
// loaded, −(1.35·0.6·|g| + 1.5·(37/60)·|q|)·L, and just right of it it is
// 1.35·0.5·|g|·L + 1.5·(35/60)·|q|·L only; the most positive is its mirror
// just right of the second (three-moment equation: all spans loaded,
// M_B = −wL²/10; spans 1 and 2, M_B = −7wL²/60 and M_C = −wL²/30;
// continuous-beam coefficients 0.600, 0.617 and 0.583 in the AISC Manual's
// Beam Diagrams and Formulas, three equal spans, from memory).
func TestEnvelopeSaysTheSideOfAJump(t *testing.T) {
	const L, g, q = 4.0, -6e3, -10e3
	m := threeSpans(L, g, q)
	m.Combinations = []Combination{{Name: "strength", Kind: Strength, Factors: []CaseFactor{{0, 1.35}, {1, 1.5}}}}
	_, cs := solveCombinations(t, m)
	env := cs.Envelope()
	shear := env.Quantities[QShearForce]
	want := (1.35*0.6*g + 1.5*37.0/60*q) * L
	for _, c := range []struct {
		name string
		got  Governing
		x, v float64
		side Side
	}{
		{"smallest shear force", shear.Min, L, want, Left},
		{"largest shear force", shear.Max, 2 * L, -want, Right},
	} {
		if math.Abs(c.got.Value-c.v) > 1e-9*math.Abs(c.v) || math.Abs(c.got.X-c.x) > 1e-12 || c.got.Side != c.side {
			t.Errorf("%s: %.10g N at x = %g m on side %d; want %.10g at %g m on side %d", c.name, c.got.Value, c.got.X, c.got.Side, c.v, c.x, c.side)
		}
	}
	for _, qe := range env.Quantities {
		if qe.Quantity == QShearForce {
			continue
		}
		for _, g := range []Governing{qe.Max, qe.Min} {
			if g.Side != 0 {
				t.Errorf("%s: %g at x = %g m read on side %d, where the field does not jump", qe.Quantity, g.Value, g.X, g.Side)
			}
		}
	}
}
