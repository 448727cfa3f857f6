package band

import "math"

// Equilibrate scales a in place, within its band, towards unit largest
// magnitude in every row and column by Ruiz's square-root scaling (Ruiz,
// "A scaling algorithm to equilibrate both rows and columns norms in
// matrices", 2001, from memory): each pass divides every row by the square
// root of its largest magnitude, then every column by the square root of
// its own. A row or column of zeros (or holding a NaN) is left alone. In
// the ∞-norm the row and column maxima converge to 1 linearly with rate
// 1/2, so a few passes settle a matrix whose rows and columns carry
// different units.
//
// It returns the accumulated scales R = diag(rowScale) and C =
// diag(colScale), so that a now holds R·A·C: solve (R·A·C)·y = R·b and take
// x = C·y. Fewer than one pass leaves a alone and returns unit scales.
func Equilibrate(a *General, passes int) (rowScale, colScale []float64) {
	n := a.N
	rowScale, colScale = make([]float64, n), make([]float64, n)
	for i := range n {
		rowScale[i], colScale[i] = 1, 1
	}
	for range passes {
		for i := range n {
			row := a.row(i)
			big := 0.0
			for _, v := range row {
				big = max(big, math.Abs(v))
			}
			if big > 0 {
				f := 1 / math.Sqrt(big)
				rowScale[i] *= f
				for c := range row {
					row[c] *= f
				}
			}
		}
		for j := range n {
			if big := a.columnMax(j); big > 0 {
				f := 1 / math.Sqrt(big)
				colScale[j] *= f
				p, count, step := a.column(j)
				for ; count > 0; p, count = p+step, count-1 {
					a.Data[p] *= f
				}
			}
		}
	}
	return rowScale, colScale
}
