package fem

// Reactions from K·u − f at a support lose digits when a short stretch joins
// it (a distributed load ending a few millimetres from a support, a support
// next to a change of section): the stretch's end forces are
// differences of terms EI/h³ times nodal values that the solve can only
// round. In exact arithmetic every element's end forces balance its own
// loads, and every node that no rigid restraint holds balances its point
// loads and spring forces, so the section actions follow by statics from one
// stretch between two restraints. Taking that stretch to be the most
// flexible one there (largest h³/EI, h/EA for the bar) and carrying its end
// actions across the others gives the same reactions as K·u − f, free of
// the short stretches' round-off. The forces then balance by construction;
// the moments as closely as that stretch's end actions are known.

// stretchActions are the section actions just inside both ends of a stretch.
type stretchActions struct {
	axial         [2]float64 // N at start and end, N
	shear, moment [2]float64 // V (N) and M (N·m) at start and end
}

// keyLoads are what acts at one key point apart from rigid reactions: point
// loads and spring forces, by Dof.
type keyLoads [3]float64

// startAction is the action of motion d (N, V or M) just inside the start
// of stretch j, read off a solution: where the statics of the reactions
// start from.
type startAction func(j int, d Dof) float64

// staticReactions fills the reactions of every rigid restraint on the
// key-point mesh with key nodes x, stretches els (with the point loads
// inside them and, on a foundation, its forces on them) and point loads at
// the key points, taking the section actions where statics starts from
// start. The springs' reactions must be in reactions already.
func staticReactions(m *Model, x []float64, els []elementData, pointLoads [][3]float64, reactions []Reaction, start startAction) {
	nk := len(x)
	held := make([][3]bool, nk)
	loads := make([]keyLoads, nk)
	for k, p := range pointLoads {
		loads[k] = p
	}
	for r, sup := range m.Supports {
		k := nearest(x, sup.X)
		for d := Axial; d <= Rotation; d++ {
			switch {
			case sup.Elastic(d):
				loads[k][d] += reactions[r].Force[d]
			case sup.Kind.Restrains(d):
				held[k][d] = true
			}
		}
	}
	acts := make([]stretchActions, len(els))
	// Spans between restraints of one motion share their section action.
	for d := Axial; d <= Rotation; d++ {
		for lo := 0; lo < len(els); {
			hi := lo + 1 // the span is stretches lo..hi−1
			for hi < len(els) && !held[hi][d] {
				hi++
			}
			spanActions(d, els, loads, acts, lo, hi, start)
			lo = hi
		}
	}
	// A restraint takes the jump of its action less the point load there:
	// N⁺ − N⁻ = −P − R, V⁺ − V⁻ = P + R, M⁺ − M⁻ = −C − R.
	sign := [3]float64{-1, 1, -1}
	for r, sup := range m.Supports {
		k := nearest(x, sup.X)
		for d := Axial; d <= Rotation; d++ {
			if !held[k][d] {
				continue
			}
			var left, right float64
			if k > 0 {
				left = acts[k-1].of(d)[1]
			}
			if k < len(els) {
				right = acts[k].of(d)[0]
			}
			reactions[r].Force[d] = sign[d]*(right-left) - loads[k][d]
		}
	}
}

// of returns the action that goes with motion d.
func (a *stretchActions) of(d Dof) *[2]float64 {
	switch d {
	case Axial:
		return &a.axial
	case Transverse:
		return &a.shear
	}
	return &a.moment
}

// spanActions sets the action of motion d on stretches lo..hi−1, which no
// restraint of d separates: read off the solution on the most flexible one
// (start), then by statics outwards. Moments need the shears, so d =
// Rotation comes last.
func spanActions(d Dof, els []elementData, loads []keyLoads, acts []stretchActions, lo, hi int, start startAction) {
	best, flex := lo, -1.0
	for j := lo; j < hi; j++ {
		e := &els[j]
		f := e.length / e.axialRigidity
		if d != Axial {
			f = e.length * e.length * e.length / e.flexuralRigidity
		}
		if f > flex {
			best, flex = j, f
		}
	}
	acts[best].of(d)[0] = start(best, d)
	carry(d, &els[best], &acts[best])
	for j := best + 1; j < hi; j++ {
		acts[j].of(d)[0] = acts[j-1].of(d)[1] + across(d, loads[j])
		carry(d, &els[j], &acts[j])
	}
	for j := best - 1; j >= lo; j-- {
		acts[j].of(d)[1] = acts[j+1].of(d)[0] - across(d, loads[j+1])
		uncarry(d, &els[j], &acts[j])
	}
}

// springReactions sets the reaction of every spring of m, −k·y, from the
// displacements disp at the key points x.
func springReactions(m *Model, x []float64, disp [][3]float64, reactions []Reaction) {
	for r, sup := range m.Supports {
		k := nearest(x, sup.X)
		for d := Axial; d <= Rotation; d++ {
			if sup.Elastic(d) {
				reactions[r].Force[d] = -sup.Stiffness[d] * disp[k][d]
			}
		}
	}
}

// elementActions is startAction for the finite element solution: the end
// forces K·u − f of stretch j of els with key-point displacements disp (its
// own start rotation where it starts at a hinge).
func elementActions(els []elementData, disp [][3]float64) startAction {
	return func(j int, d Dof) float64 {
		e := &els[j]
		if d == Axial {
			f := e.barLoads(LinearBar)
			return -(e.barForces([2]float64{disp[j][Axial], disp[j+1][Axial]})[0] - f[0])
		}
		start := disp[j][Rotation]
		if e.released {
			start = e.startRotation
		}
		// The forces from the deformation, not from differences of large
		// terms (beamForces): a member on a soft bed moves far more than it
		// bends.
		k := e.beamForces([4]float64{disp[j][Transverse], start, disp[j+1][Transverse], disp[j+1][Rotation]})
		f := e.beamLoads()
		if d == Rotation {
			return -(k[1] - f[1]) // M(start) = −F_θ(start)
		}
		return k[0] - f[0] // V(start) = F_w(start)
	}
}

// across is the jump of the action of d at a key point no restraint of d
// holds: N⁺ − N⁻ = −P, V⁺ − V⁻ = P, M⁺ − M⁻ = −C (springs included in loads).
func across(d Dof, l keyLoads) float64 {
	if d == Transverse {
		return l[d]
	}
	return -l[d]
}

// carry sets the action at the end of a stretch from the one at its start:
// N' = −p, V' = q, M' = V, with the jumps of the point loads inside; the
// loads are linear, so the integrals are exact.
func carry(d Dof, e *elementData, a *stretchActions) {
	a.of(d)[1] = a.of(d)[0] + change(d, e, a.shear[0])
}

// uncarry is carry backwards: the start from the end. Moments need the
// shear at the start, which the shear pass has set.
func uncarry(d Dof, e *elementData, a *stretchActions) {
	a.of(d)[0] = a.of(d)[1] - change(d, e, a.shear[0])
}

// change is the action of d at the end of stretch e less the one at its
// start; shear is V at the start (used for moments only).
func change(d Dof, e *elementData, shear float64) float64 {
	h := e.length
	var c float64
	switch {
	case len(e.breaks) > 0:
		if d == Rotation {
			c = h * shear
		}
		end := e.start + h
		e.pieces(e.start, end, func(pc loadPiece) {
			switch d {
			case Axial:
				c -= pc.length * (pc.p0 + pc.p1) / 2
			case Transverse:
				c += pc.length * (pc.q0 + pc.q1) / 2
			case Rotation:
				// ∫(end − x)·q dx over the piece.
				c += (end-pc.start-pc.length)*pc.length*(pc.q0+pc.q1)/2 + pc.length*pc.length*(2*pc.q0+pc.q1)/6
			}
		})
	case d == Axial:
		c = -h * (e.axialLoad[0] + e.axialLoad[1]) / 2
	case d == Transverse:
		c = h * (e.transverseLoad[0] + e.transverseLoad[1]) / 2
	default:
		c = h*shear + h*h*(2*e.transverseLoad[0]+e.transverseLoad[1])/6
	}
	for _, p := range e.points {
		switch d {
		case Axial:
			c -= p.Axial
		case Transverse:
			c += p.Transverse
		case Rotation:
			c += p.Transverse*(e.start+h-p.X) - p.Moment
		}
	}
	// The foundation's forces act like line loads (setGround).
	switch d {
	case Axial:
		c -= e.ground[Axial]
	default:
		c += e.ground[d]
	}
	return c
}
