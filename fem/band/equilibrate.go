package band

import "math"

// Equilibrate scales a in place, within its band, towards unit largest
// magnitude in every row and column by Ruiz's square-root scaling (Ruiz,
// "A scaling algorithm to equilibrate both rows and columns norms in
// matrices", 2001, from memory): each pass divides every row by the square
// root of its largest magnitude, then every column by the square root of
// its own, each root rounded to a power of two (inverseRoot). A row or
// column of zeros (or holding a NaN) is left alone. In the ∞-norm the row
// and column maxima converge to 1 linearly with rate 1/2, so a few passes
// settle a matrix whose rows and columns carry different units; with the
// roots rounded they stop within [1/2, 2].
//
// It returns the accumulated scales R = diag(rowScale) and C =
// diag(colScale), so that a now holds R·A·C: solve (R·A·C)·y = R·b and take
// x = C·y. Fewer than one pass leaves a alone and returns unit scales;
// passes is at most, as a pass that scales nothing ends the work.
//
// A pass reads only the rows and columns that may have changed since their
// maximum was last found to need no scaling: those scaled themselves, and
// those crossing one that was. The others would be scaled by 1, so the
// result is the same to the bit as full passes, and the passes that only
// settle a few stragglers cost little.
func Equilibrate(a *General, passes int) (rowScale, colScale []float64) {
	n := a.N
	rowScale, colScale = make([]float64, n), make([]float64, n)
	rowDirty, colDirty := make([]bool, n), make([]bool, n)
	for i := range n {
		rowScale[i], colScale[i] = 1, 1
		rowDirty[i], colDirty[i] = true, true
	}
	for range passes {
		settled := true
		for i, dirty := range rowDirty {
			if !dirty {
				continue
			}
			row := a.row(i)
			big := largestMagnitude(row)
			f := 1.0
			if big > 0 {
				f = inverseRoot(big)
			}
			rowDirty[i] = f != 1
			if f == 1 {
				continue
			}
			settled = false
			rowScale[i] *= f
			for c := range row {
				row[c] *= f
			}
			first := max(0, i-a.KL)
			markAll(colDirty[first : first+len(row)])
		}
		for j, dirty := range colDirty {
			if !dirty {
				continue
			}
			p, count, step := a.column(j)
			var bits uint64
			for q, c := p, count; c > 0; q, c = q+step, c-1 {
				bits = max(bits, magnitudeBits(a.Data[q]))
			}
			big := math.Float64frombits(bits)
			f := 1.0
			if big > 0 {
				f = inverseRoot(big)
			}
			colDirty[j] = f != 1
			if f == 1 {
				continue
			}
			settled = false
			colScale[j] *= f
			for q, c := p, count; c > 0; q, c = q+step, c-1 {
				a.Data[q] *= f
			}
			first := max(0, j-a.KU)
			markAll(rowDirty[first : first+count])
		}
		if settled {
			break
		}
	}
	return rowScale, colScale
}

// markAll sets every flag of dirty.
func markAll(dirty []bool) {
	for i := range dirty {
		dirty[i] = true
	}
}

// inverseRoot is 1/√big rounded to the nearest power of two: scaling by
// powers of two is exact, so the scaled matrix carries no rounding of its
// own, and a pass that finds every maximum within [1/2, 2) scales nothing
// (factor 1) and ends the passes.
func inverseRoot(big float64) float64 {
	// big = m·2^e with m in [1/2, 1), so log₂ big lies in [e−1, e) and
	// rounding half of it gives ⌊e/2⌋ (an arithmetic shift floors). For a
	// normal big, e is its biased exponent less 1022 and 2^−⌊e/2⌋ is normal
	// too, so both are read and made from the bits.
	bits := math.Float64bits(big)
	if biased := int(bits>>52) & 0x7ff; biased > 0 && biased < 0x7ff {
		return math.Float64frombits(uint64(1023-((biased-1022)>>1)) << 52)
	}
	_, e := math.Frexp(big)
	return math.Ldexp(1, -(e >> 1))
}

// largestMagnitude is the largest |x| in v, NaN when v holds a NaN.
func largestMagnitude(v []float64) float64 {
	var bits uint64
	for _, x := range v {
		bits = max(bits, magnitudeBits(x))
	}
	return math.Float64frombits(bits)
}

// magnitudeBits are the bits of |x|: magnitudes order as these do, and a
// NaN's lie above every number's, so the largest of them is the largest
// magnitude or a NaN, in integer comparisons cheaper than float ones.
func magnitudeBits(x float64) uint64 { return math.Float64bits(x) &^ (1 << 63) }
