package fem

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"stave/fem/units"
)

// duplicateSupports returns the "both at x" sentences Validate gives m, in order.
func duplicateSupports(t *testing.T, m *Model) []string {
	t.Helper()
	var ve *ValidationError
	if err := m.Validate(); err != nil && !errors.As(err, &ve) {
		t.Fatalf("got %v, want a *ValidationError", err)
	}
	var out []string
	if ve != nil {
		for _, p := range ve.Problems {
			if strings.Contains(p.Message, " are both at x = ") || strings.Contains(p.Message, "count as one point") {
				out = append(out, p.Message[:strings.Index(p.Message, ":")])
			}
		}
	}
	return out
}

// Two supports at one point are named by the later one's number and the
// lowest number of an earlier one within the merge tolerance (1e-12·L) of
// it, whatever the order in which the supports are listed.
func TestValidateDuplicateSupportsNameThePair(t *testing.T) {
	tol := mergeTolerance * 3 // the model is 3 m long
	nan := math.NaN()
	tests := []struct {
		name   string
		places []float64
		want   []string
	}{
		{"none", []float64{0, 1, 3}, nil},
		{"two", []float64{0, 3, 0}, []string{"supports 1 and 3 are both at x = 0.0 m"}},
		{"three at one point", []float64{2, 0, 2, 3, 2},
			[]string{"supports 1 and 3 are both at x = 2.0 m", "supports 1 and 5 are both at x = 2.0 m"}},
		{"listed right to left", []float64{3, 2, 1, 0, 1, 2},
			[]string{"supports 3 and 5 are both at x = 1.0 m", "supports 2 and 6 are both at x = 2.0 m"}},
		// Within the tolerance is not transitive: the third is near the
		// second only.
		{"a chain within the tolerance", []float64{1, 1 + 0.6*tol, 1 + 1.2*tol},
			[]string{"supports 1 and 2 are both at x = 1.0 m", "supports 2 and 3 are both at x = 1.0 m"}},
		{"the nearer one listed later", []float64{1 + 1.2*tol, 1, 1 + 0.6*tol},
			[]string{"supports 1 and 3 are both at x = 1.0 m"}},
		// The first lies outside the member and is refused for that; the
		// second, inside, still names it.
		{"past the end, then inside", []float64{0, 3 + 1.5*tol, 3 + 0.7*tol},
			[]string{"supports 2 and 3 are both at x = 3.0 m"}},
		{"a place that is not a number", []float64{0, nan, 3, nan, 0}, []string{"supports 1 and 5 are both at x = 0.0 m"}},
		// Near 0 the places print apart: the sentence names both (it said
		// both were at the second's, 1e-12 m).
		{"within the tolerance of the start", []float64{0, 1e-12, 3},
			[]string{"supports 1 and 2 are at x = 0.0 m and x = 1e-12 m, which count as one point (closer than 1e-12 of the member's length)"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := validModel()
			m.Supports = nil
			for _, x := range tc.places {
				m.Supports = append(m.Supports, Support{X: x, Kind: Roller})
			}
			m.Supports[0].Kind = Pinned
			if got := duplicateSupports(t, m); !slices.Equal(got, tc.want) {
				t.Errorf("got %q, want %q", got, tc.want)
			}
		})
	}
}

// On many supports crowded at a few places, the pairs named are those the
// rule "each support with the lowest-numbered earlier one within the
// tolerance" gives when every pair is compared.
func TestValidateDuplicateSupportsAsEveryPair(t *testing.T) {
	r := rand.New(rand.NewPCG(17, 3))
	const L = 3.0
	tol := mergeTolerance * L
	for round := range 20 {
		m := validModel()
		m.Supports = nil
		for range 200 {
			x := float64(r.IntN(40)) * L / 39
			x = min(L, max(0, x+float64(r.IntN(5)-2)*0.6*tol))
			m.Supports = append(m.Supports, Support{X: x, Kind: Roller})
		}
		var want []string
		for i, s := range m.Supports {
			for j := range i {
				if math.Abs(m.Supports[j].X-s.X) <= tol {
					want = append(want, fmt.Sprintf("supports %d and %d %s", j+1, i+1, (&validator{u: units.Base}).atOnePoint(m.Supports[j].X, s.X)))
					break
				}
			}
		}
		if got := duplicateSupports(t, m); !slices.Equal(got, want) {
			t.Fatalf("round %d: got %d sentences, want %d; first difference at %d", round, len(got), len(want), firstDifference(got, want))
		}
	}
}

func firstDifference(a, b []string) int {
	for i := range min(len(a), len(b)) {
		if a[i] != b[i] {
			return i
		}
	}
	return min(len(a), len(b))
}

// A spring whose stiffnesses are refused one by one (negative, not finite)
// draws only those refusals: it is not also called a spring with no
// stiffness, which would send the user to look for a value they did give.
// A spring with every stiffness 0 still draws that message alone.
func TestValidateRefusedSpringStiffnessIsTheOnlyMessage(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	tests := []struct {
		name      string
		stiffness [3]float64
		want      []Property // the properties of support 2 that draw a problem, in order
	}{
		{"negative", [3]float64{0, -75000, 0}, []Property{MotionStiffnessProperty}},
		{"NaN", [3]float64{0, nan, 0}, []Property{MotionStiffnessProperty}},
		{"infinite", [3]float64{inf, 0, 0}, []Property{MotionStiffnessProperty}},
		{"two negative", [3]float64{-1, -2, 0}, []Property{MotionStiffnessProperty, MotionStiffnessProperty}},
		{"none", [3]float64{}, []Property{StiffnessProperty}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			m := validModel()
			m.Supports[1] = Support{X: 3, Kind: Spring, Stiffness: tt.stiffness}
			var ve *ValidationError
			if err := m.Validate(); !errors.As(err, &ve) {
				t.Fatalf("got %v, want a *ValidationError", err)
			}
			var got []Property
			for _, p := range ve.Problems {
				if p.Place.Item == (Item{Kind: SupportItem, Index: 1}) {
					got = append(got, p.Place.Property)
				}
			}
			if !slices.Equal(got, tt.want) {
				t.Errorf("support 2 draws problems at %v, want %v:\n%v", got, tt.want, ve)
			}
		})
	}
}
