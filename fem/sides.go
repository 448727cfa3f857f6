package fem

import (
	"math"
	"slices"
)

// sideOfJump is the side of x that value is read on, where x is one of
// keys (to the merge tolerance of a member of length L) and the field
// judge reads jumps there by more than round-off of size (negligible): the
// side whose limit, as read reads it, is nearer value. It is 0 where the
// field is continuous, away from the key points, and at the member's ends,
// where either side reads the one inside the member. judge reads the field
// that says whether there is a jump (the exact solution where there is
// one: a finite element field also jumps between elements, by the mesh's
// error), read the one value is of. The envelope's extremes (readSides)
// and a summary's (readExtremeSides) are read so.
func sideOfJump(keys []float64, L, x, value, size float64, judge, read func(Side) float64) Side {
	tol := mergeTolerance * L
	k, _ := slices.BinarySearch(keys, x)
	if !(k < len(keys) && keys[k]-x <= tol || k > 0 && x-keys[k-1] <= tol) {
		return 0
	}
	if math.Abs(judge(Left)-judge(Right)) <= negligible*size {
		return 0
	}
	if math.Abs(read(Left)-value) < math.Abs(read(Right)-value) {
		return Left
	}
	return Right
}

// valueOf is quantity q of the envelope values v: of the combined stress
// the larger of the fibres' (upper), the greatest tension, or the smaller.
func valueOf(v *[envelopeValues]float64, q Quantity, upper bool) float64 {
	switch {
	case q != QCombinedStress:
		return v[q]
	case upper:
		return max(v[bottomFibre], v[topFibre])
	}
	return min(v[bottomFibre], v[topFibre])
}

// readExtremeSides sets the sides of the extremes of list, of the
// solution s (SideOf): the headline ones read from e where it is not nil,
// else from s, the finite element ones from s.
func readExtremeSides(list []Extreme, s *Solution, e *Exact) {
	var headline Field = s
	if e != nil {
		headline = e
	}
	for i := range list {
		x := &list[i]
		q := x.Quantity
		size := max(math.Abs(x.Max), math.Abs(x.Min))
		x.SideMax, x.SideMin = s.SideOf(e, headline, q, x.XMax, x.Max, size, true), s.SideOf(e, headline, q, x.XMin, x.Min, size, false)
		x.FESideMax, x.FESideMin = s.SideOf(e, s, q, x.FEXMax, x.FEMax, size, true), s.SideOf(e, s, q, x.FEXMin, x.FEMin, size, false)
	}
}

// SideOf is the side of x that value, an extreme of quantity q of the field
// f (s or e), is read on where the field jumps at x (sideOfJump), 0 where
// it does not: upper says value is a largest one, which of the combined
// stress is the greater fibre's. Whether the field jumps is read from e
// where it is not nil (the finite element field also jumps between
// elements, by the mesh's error), else from s; size is the field's
// largest magnitude. The summary's extremes and the drawing's labels of
// them are read so.
func (s *Solution) SideOf(e *Exact, f Field, q Quantity, x, value, size float64, upper bool) Side {
	var judge Field = s
	if e != nil {
		judge = e
	}
	read := func(f Field) func(Side) float64 {
		return func(side Side) float64 {
			fs := f.At(x, side)
			v := sampleValues(&fs)
			return valueOf(&v, q, upper)
		}
	}
	return sideOfJump(s.loads.Keys, s.Model.Length(), x, value, size, read(judge), read(f))
}
