package fem

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/gonum/mat"
)

// MechanismError says the supports leave a rigid-body motion free.
type MechanismError struct {
	Motion  string // "axial", "transverse", "rotation", or "hinge" for a chain of parts between hinges
	Message string
	// Parts is the free motion across the member, one part between hinges
	// each, for a drawing to show; empty for the bar's sliding.
	Parts []MechanismPart
}

func (e *MechanismError) Error() string { return e.Message }

// MechanismPart is the free motion of one part of the member between
// hinges: it moves by w(x) = Offset + Slope·(x − Start), in units of an
// arbitrary size (only the shape means anything).
type MechanismPart struct {
	Start, End    float64 // m
	Offset, Slope float64 // m, rad, of a motion scaled to unit largest deflection
}

// checkMechanism looks for rigid-body motions the supports leave free. The
// bar's rigid motion is u = a; without hinges the beam's are w = a + b·x,
// which one point of deflection restraint, or one rotation restraint,
// cannot both stop. Hinges cut the beam into parts, each with its own
// rigid motion, joined by the deflection (and, through a spring, the
// rotation) at each hinge: hingeMechanism. Without bending (an axial-only
// member) only the bar's counts.
func checkMechanism(m *Model, bending bool) error {
	var axial, rotation, ground bool
	var deflection []float64
	for _, s := range m.Supports {
		axial = axial || s.Holds(Axial)
		rotation = rotation || s.Holds(Rotation)
		if s.Holds(Transverse) {
			deflection = append(deflection, s.X)
		}
	}
	// A foundation holds every rigid motion of the stretch it lies under.
	for _, f := range m.Foundations {
		axial = axial || f.AxialModulus > 0
		ground = ground || f.Modulus > 0
	}
	switch {
	case !axial && !m.slidesFree():
		return &MechanismError{Motion: "axial", Message: "the member can slide along its axis: add an axial restraint (pinned, fixed, axial or spring support)"}
	case !bending:
		return nil
	case len(m.Hinges) > 0:
		return hingeMechanism(m)
	case ground:
		return nil
	case len(deflection) == 0:
		return &MechanismError{Motion: "transverse", Message: "the member can move sideways: add a support that restrains deflection",
			Parts: []MechanismPart{{Start: 0, End: m.Length(), Offset: 1}}}
	case len(deflection) == 1 && !rotation:
		L := m.Length()
		return &MechanismError{Motion: "rotation", Message: fmt.Sprintf("the member can rotate about the support at x = %s: add a second support or fix one end", fmtMetres(deflection[0])),
			Parts: []MechanismPart{{Start: 0, End: L, Offset: -deflection[0] / max(deflection[0], L-deflection[0]), Slope: 1 / max(deflection[0], L-deflection[0])}}}
	}
	return nil
}

// hingeMechanism finds a rigid-body motion of the chain of parts between
// hinges that every support and joint allows: the null space of the
// constraints on each part's offset a and slope b (x scaled by the length,
// so the columns are alike), from gonum's singular value decomposition.
func hingeMechanism(m *Model) error {
	L := m.Length()
	cuts := []float64{0}
	for _, h := range m.Hinges {
		cuts = append(cuts, h.X)
	}
	slices.Sort(cuts)
	cuts = append(cuts, L)
	parts := len(cuts) - 1
	part := func(x float64) int { // the part holding x, the right one at a hinge
		for p := parts - 1; p > 0; p-- {
			if x >= cuts[p] {
				return p
			}
		}
		return 0
	}
	var rows [][]float64
	row := func() []float64 { r := make([]float64, 2*parts); rows = append(rows, r); return r }
	// Offset and slope of part p: w(x) = a_p + b_p·(x − cut_p)/L.
	for p := 0; p+1 < parts; p++ {
		r := row() // the deflection is continuous at the hinge
		r[2*p], r[2*p+1], r[2*(p+1)] = 1, (cuts[p+1]-cuts[p])/L, -1
		if k := hingeAt(m, cuts[p+1]).Stiffness; k > 0 {
			r := row() // a spring across it ties the rotations
			r[2*p+1], r[2*(p+1)+1] = 1, -1
		}
	}
	for _, s := range m.Supports {
		p := part(s.X)
		if s.Holds(Transverse) {
			r := row()
			r[2*p], r[2*p+1] = 1, (s.X-cuts[p])/L
		}
		if s.Holds(Rotation) {
			r := row()
			r[2*p+1] = 1
		}
	}
	for _, f := range m.Foundations {
		if f.Modulus == 0 {
			continue
		}
		for p := range parts { // a part with ground under it cannot move
			if min(f.End, cuts[p+1]) > max(f.Start, cuts[p]) {
				r := row()
				r[2*p] = 1
				r = row()
				r[2*p+1] = 1
			}
		}
	}
	a := mat.NewDense(max(len(rows), 1), 2*parts, nil)
	for i, r := range rows {
		a.SetRow(i, r)
	}
	// The singular values alone first: most chains are no mechanism, and
	// the singular vectors cost the most (U, which nothing reads, most of
	// all: 400 hinges took 4 s with it).
	var svd mat.SVD
	if !svd.Factorize(a, mat.SVDNone) {
		return nil
	}
	values := svd.Values(nil)
	rank := 0
	for _, v := range values {
		if v > 1e-10*values[0] {
			rank++
		}
	}
	if len(rows) > 0 && rank == 2*parts {
		return nil
	}
	if !svd.Factorize(a, mat.SVDFullV) {
		return nil
	}
	var v mat.Dense
	svd.VTo(&v)
	shape := make([]MechanismPart, parts)
	big := 0.0
	for p := range shape {
		off, slope := v.At(2*p, 2*parts-1), v.At(2*p+1, 2*parts-1)/L
		shape[p] = MechanismPart{Start: cuts[p], End: cuts[p+1], Offset: off, Slope: slope}
		big = max(big, math.Abs(off), math.Abs(off+slope*(cuts[p+1]-cuts[p])))
	}
	var moving []string
	for p := range shape {
		s := &shape[p]
		s.Offset, s.Slope = s.Offset/big, s.Slope/big
		if math.Abs(s.Offset) < 1e-9 && math.Abs(s.Slope)*(s.End-s.Start) < 1e-9 {
			continue
		}
		where := fmt.Sprintf("the part from x = %s to %s", fmtMetres(s.Start), fmtMetres(s.End))
		if parts == 1 {
			where = "the member"
		}
		if math.Abs(s.Slope)*(s.End-s.Start) < 1e-9 {
			moving = append(moving, where+" can move sideways")
			continue
		}
		pivot := s.Start - s.Offset/s.Slope
		for _, f := range Features(m) { // a support or hinge there, not its round-off
			if math.Abs(f.X-pivot) <= 1e-9*L {
				pivot = f.X
			}
		}
		moving = append(moving, fmt.Sprintf("%s can turn about x = %s", where, fmtMetres(pivot)))
	}
	return &MechanismError{Motion: "hinge", Parts: shape,
		Message: fmt.Sprintf("with its hinges the member is a mechanism: %s; add a support under the free part, fix an end, or remove a hinge", strings.Join(moving, ", "))}
}

// hingeAt is m's hinge at x (the zero Hinge when there is none).
func hingeAt(m *Model, x float64) Hinge {
	for _, h := range m.Hinges {
		if h.X == x {
			return h
		}
	}
	return Hinge{}
}
