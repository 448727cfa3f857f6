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
func Equilibrate(a *General, passes int) (rowScale, colScale []float64) {
	n := a.N
	rowScale, colScale = make([]float64, n), make([]float64, n)
	colMax, colFactor := make([]float64, n), make([]float64, n)
	for i := range n {
		rowScale[i], colScale[i] = 1, 1
	}
	for range passes {
		settled := true
		clear(colMax)
		for i := range n {
			row := a.row(i)
			big := 0.0
			for _, v := range row {
				big = larger(big, v)
			}
			if big > 0 {
				f := inverseRoot(big)
				settled = settled && f == 1
				rowScale[i] *= f
				for c := range row {
					row[c] *= f
				}
			}
			// The columns' maxima, gathered row by row: memory is read in
			// order, not down the columns' stride.
			cols := colMax[max(0, i-a.KL):]
			for c, v := range row {
				cols[c] = larger(cols[c], v)
			}
		}
		for j, big := range colMax {
			colFactor[j] = 1
			if big > 0 {
				colFactor[j] = inverseRoot(big)
				settled = settled && colFactor[j] == 1
				colScale[j] *= colFactor[j]
			}
		}
		for i := range n {
			row, cols := a.row(i), colFactor[max(0, i-a.KL):]
			for c := range row {
				row[c] *= cols[c]
			}
		}
		if settled {
			break
		}
	}
	return rowScale, colScale
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

// larger is the larger of big and |v|, or NaN when v is NaN: a plain
// comparison, cheaper than the built-in max's care for signed zeros.
func larger(big, v float64) float64 {
	if a := math.Abs(v); a > big {
		return a
	} else if a != a {
		return a
	}
	return big
}
