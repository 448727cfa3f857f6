package fem

import (
	"math"
	"testing"
)

// checkUnderflow takes the largest displacement by magnitude whatever its
// sign, and refuses it only when it is a number below the smallest normal,
// 2^−1022 (IEEE 754 binary64, from memory), but not zero: −0 and +0 are
// zero, and a NaN or an infinity among the displacements is no underflow
// (the checks of finite results refuse those).
func TestCheckUnderflowDisplacements(t *testing.T) {
	tiny := 0x1p-1030 // subnormal
	for _, c := range []struct {
		name string
		disp [][3]float64
		want bool // refused as underflow
	}{
		{"all zero", [][3]float64{{0, 0, 0}, {0, 0, 0}}, false},
		{"negative zero", [][3]float64{{math.Copysign(0, -1), 0, 0}}, false},
		{"one subnormal", [][3]float64{{0, 0, 0}, {0, tiny, 0}}, true},
		{"a negative subnormal", [][3]float64{{0, 0, -tiny}}, true},
		{"a subnormal beside a normal", [][3]float64{{tiny, 0, 0}, {0, -1e-300, 0}}, false},
		{"the smallest normal", [][3]float64{{0, 0x1p-1022, 0}}, false},
		{"a subnormal beside a NaN", [][3]float64{{tiny, math.NaN(), 0}}, false},
		{"a subnormal beside an infinity", [][3]float64{{tiny, 0, math.Inf(-1)}}, false},
	} {
		s := &Solution{Displacement: c.disp}
		if got := checkUnderflow(s) != nil; got != c.want {
			t.Errorf("%s: refused %v, want %v", c.name, got, c.want)
		}
	}
}
