package fem

// Gap is the largest |FE − exact| of quantity q on the element and where,
// in closed form: the difference of the two polynomials (of the exact
// fields' degree) at its ends and at the roots of its derivative. The
// combined stress compares the exact stress on the fibre the finite element
// one is taken at, as Comparison does. A drawing and the results read the
// same gap at the same place from this, whatever the view's width.
//
// It returns false without the exact solution on the view or for an
// unknown quantity, and, without working the gap out, when a bound of it
// (Polynomial.MaxAbsBound) shows it cannot exceed above: a walk that seeks
// the largest gap passes the largest so far.
func (v *ElementView) Gap(q Quantity, above float64) (Point, bool) {
	if !v.HasExact || q < 0 || q >= quantityCount {
		return Point{}, false
	}
	fe, ex := &v.FE, &v.Exact
	if ex.closed.stretch != nil {
		return v.closedGap(q, above)
	}
	var e extremum
	if q == QCombinedStress {
		// |Δσa ± Δσb| ≤ |Δσa| + |Δσb|.
		var da, db Polynomial
		for k := range da {
			da[k], db[k] = fe.poly[QAxialStress][k]-ex.poly[QAxialStress][k], fe.poly[QBendingStress][k]-ex.poly[QBendingStress][k]
		}
		if da.MaxAbsBound()+db.MaxAbsBound() <= above {
			return Point{}, false
		}
		if e = combinedError(fe, ex, above); e.value < 0 {
			return Point{}, false
		}
	} else {
		var d Polynomial
		for k := range d {
			d[k] = fe.poly[q][k] - ex.poly[q][k]
		}
		if d.MaxAbsBound() <= above {
			return Point{}, false
		}
		e = maxAbs(&d, exactDegrees[q])
	}
	return Point{X: fe.X(e.xi), Value: e.value}, true
}
