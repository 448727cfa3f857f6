package fem

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"gonum.org/v1/gonum/mat"

	"stave/fem/units"
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
// cannot both stop. Pure hinges cut the beam into parts, each with its own
// rigid motion, joined by the deflection at each hinge: hingeMechanism. A
// hinge with a spring across it ties the rotations too, so the parts it
// joins move as one: it cuts nothing, and a member with no pure hinge is
// judged as one without hinges. Without bending (an axial-only member)
// only the bar's counts. The messages quote places in the units of u.
func checkMechanism(m *Model, bending bool, u units.System) error {
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
	case len(deflection) == 0 && !ground:
		// Whatever its hinges: their parts' many motions name no place.
		return &MechanismError{Motion: "transverse", Message: "the member can move sideways: add a support that restrains deflection",
			Parts: []MechanismPart{{Start: 0, End: m.Length(), Offset: 1}}}
	case slices.ContainsFunc(m.Hinges, func(h Hinge) bool { return h.Stiffness == 0 }):
		return hingeMechanism(m, u)
	case ground:
		return nil
	case len(deflection) == 1 && !rotation:
		L := m.Length()
		return &MechanismError{Motion: "rotation", Message: fmt.Sprintf("the member can rotate about the support at x = %s: add a second support or fix one end", quote(u, units.Position, deflection[0])),
			Parts: []MechanismPart{{Start: 0, End: L, Offset: -deflection[0] / max(deflection[0], L-deflection[0]), Slope: 1 / max(deflection[0], L-deflection[0])}}}
	}
	return nil
}

// hingeMechanism finds a rigid-body motion of the chain of parts between
// pure hinges that every support and joint allows. Each part p moves by
// w(x) = a_p + b_p·(x − cut_p)/L (x scaled by the length, so a and b are
// alike), and every constraint ties one part or two neighbours: a
// deflection or rotation restraint, ground under the part, the deflection
// shared at a hinge. A hinge with a spring across it shares the rotation
// too, which makes the parts it joins one: it is no cut. The null space of
// those constraints is found in one sweep along the chain (chainSweep),
// in time linear in the hinges, supports and foundations. The message
// quotes places in the units of u.
func hingeMechanism(m *Model, u units.System) error {
	L := m.Length()
	cuts := make([]float64, 0, len(m.Hinges)+2)
	cuts = append(cuts, 0)
	for _, h := range m.Hinges {
		if h.Stiffness == 0 {
			cuts = append(cuts, h.X)
		}
	}
	slices.Sort(cuts)
	cuts = append(cuts, L)
	parts := len(cuts) - 1
	// The constraints on each part alone, rows on (a_p, b_p).
	own := make([][][2]float64, parts)
	for _, s := range m.Supports {
		// The part holding x, the right one at a hinge.
		p := min(max(sort.SearchFloat64s(cuts, math.Nextafter(s.X, math.Inf(1)))-1, 0), parts-1)
		if s.Holds(Transverse) {
			own[p] = append(own[p], [2]float64{1, (s.X - cuts[p]) / L})
		}
		if s.Holds(Rotation) {
			own[p] = append(own[p], [2]float64{0, 1})
		}
	}
	// A part with ground under it cannot move: mark the parts each
	// foundation overlaps, as a count that rises at its first and falls
	// after its last.
	grounded := make([]int, parts+1)
	for _, f := range m.Foundations {
		if f.Modulus == 0 || !(f.Start < f.End) {
			continue
		}
		first := max(sort.SearchFloat64s(cuts[1:], math.Nextafter(f.Start, math.Inf(1))), 0) // first part ending after Start
		last := min(sort.SearchFloat64s(cuts, f.End)-1, parts-1)                             // last part starting before End
		if first <= last {
			grounded[first]++
			grounded[last+1]--
		}
	}
	var sweep chainSweep
	under := 0
	for p := range parts {
		rows := own[p]
		if under += grounded[p]; under > 0 {
			rows = append(rows, [2]float64{1, 0}, [2]float64{0, 1})
		}
		if p == 0 {
			sweep.first(rows)
			continue
		}
		// The deflection at the hinge, the end of part p−1, is the start of p's.
		sweep.next([][2]float64{{1, (cuts[p] - cuts[p-1]) / L}}, rows)
	}
	shape := sweep.motion()
	if shape == nil {
		return nil
	}
	return mechanismError(m, cuts, shape, u)
}

// chainSweep finds the null space of constraints on a chain of unknowns
// (a_p, b_p), p = 0, 1, …, each constraint on one link or on two
// neighbours, in one pass. After link p it holds an orthonormal basis of
// the motions of links 0…p that every constraint among them allows, by
// their coefficients e: link p moves by y·e, and the coefficients of the
// basis after link p−1 are c·e. A motion that leaves link p still (y·e = 0)
// allows every later link to stay still too: it is a free motion of the
// whole chain, kept (as its coefficients after p−1, found) and taken out of
// the basis, which stays orthonormal as a basis of whole-chain motions, so
// the motions kept and the basis left at the end are together an
// orthonormal basis of the null space.
type chainSweep struct {
	steps []chainStep
}

// chainStep is one link of a chainSweep: per basis motion after it, the
// link's own (a, b) (y) and the coefficients after the link before (c);
// found is the sum of the free motions that stop at this link, as
// coefficients after the link before.
type chainStep struct {
	y     [][2]float64
	c     [][]float64
	found []float64
}

// nullTolerance is the size, relative to the largest, below which a
// singular value of a step's constraints counts as zero.
const nullTolerance = 1e-10

// first starts the sweep with the first link's own constraints.
func (s *chainSweep) first(rows [][2]float64) {
	s.steps = append(s.steps[:0], s.step(nil, nil, rows))
}

// next adds a link: link rows tie the previous link's (a, b), as link·(a,
// b) = the new link's (a, b) component by component (its offset for the
// first row, its slope for the second); rows are the new link's own
// constraints.
func (s *chainSweep) next(link, rows [][2]float64) {
	s.steps = append(s.steps, s.step(s.steps[len(s.steps)-1].y, link, rows))
}

// step solves one link's constraints on the previous basis coefficients
// and the link's own (a, b), prev being the previous link's y.
func (s *chainSweep) step(prev [][2]float64, link, rows [][2]float64) chainStep {
	k := len(prev)
	n := k + 2
	var data []float64
	for i, l := range link {
		r := make([]float64, n)
		for j, v := range prev {
			r[j] = l[0]*v[0] + l[1]*v[1]
		}
		r[k+i] = -1
		data = append(data, r...)
	}
	for _, o := range rows {
		r := make([]float64, n)
		r[k], r[k+1] = o[0], o[1]
		data = append(data, r...)
	}
	z := nullSpace(len(data)/n, n, data) // columns (c; y) of the allowed motions
	// Motions that leave this link still: free motions of the chain.
	zy := make([]float64, 2*len(z))
	for j, col := range z {
		zy[j], zy[len(z)+j] = col[k], col[k+1]
	}
	var st chainStep
	if len(z) == 0 {
		return st
	}
	still := nullSpace(2, len(z), zy)
	moving := complement(len(z), still)
	for _, e := range still {
		if st.found == nil {
			st.found = make([]float64, k)
		}
		for j, col := range z {
			for i := range k {
				st.found[i] += col[i] * e[j]
			}
		}
	}
	for _, e := range moving {
		col := make([]float64, n)
		for j, zc := range z {
			for i := range n {
				col[i] += zc[i] * e[j]
			}
		}
		st.c = append(st.c, col[:k])
		st.y = append(st.y, [2]float64{col[k], col[k+1]})
	}
	return st
}

// motion is a free motion of the whole chain, (a, b) per link: the sum of
// the orthonormal basis of the null space the sweep found, so that a link
// any free motion moves moves in it (but for a sum that cancels); nil
// when the chain cannot move.
func (s *chainSweep) motion() [][2]float64 {
	last := len(s.steps) - 1
	e := make([]float64, len(s.steps[last].y))
	for i := range e {
		e[i] = 1
	}
	free := len(e) > 0
	for _, st := range s.steps {
		free = free || st.found != nil
	}
	if !free {
		return nil
	}
	out := make([][2]float64, len(s.steps))
	for p := last; p >= 0; p-- {
		st := s.steps[p]
		for j, y := range st.y {
			out[p][0] += y[0] * e[j]
			out[p][1] += y[1] * e[j]
		}
		if p == 0 {
			break
		}
		prev := make([]float64, len(s.steps[p-1].y))
		copy(prev, st.found)
		for j, c := range st.c {
			for i, v := range c {
				prev[i] += v * e[j]
			}
		}
		e = prev
	}
	return out
}

// nullSpace is an orthonormal basis of the null space of the r×n matrix
// held row by row in data, from gonum's singular value decomposition: n
// vectors when r is 0.
func nullSpace(r, n int, data []float64) [][]float64 {
	if n == 0 {
		return nil
	}
	if r == 0 {
		return complement(n, nil)
	}
	var svd mat.SVD
	if !svd.Factorize(mat.NewDense(r, n, data), mat.SVDFullV) {
		return nil // not seen: taken as no free motion, as before
	}
	values := svd.Values(nil)
	rank := 0
	for _, v := range values {
		if v > nullTolerance*values[0] {
			rank++
		}
	}
	var v mat.Dense
	svd.VTo(&v)
	var out [][]float64
	for j := rank; j < n; j++ {
		out = append(out, mat.Col(nil, j, &v))
	}
	return out
}

// complement is an orthonormal basis of the vectors of length n orthogonal
// to the orthonormal vectors basis.
func complement(n int, basis [][]float64) [][]float64 {
	if len(basis) == 0 {
		out := make([][]float64, n)
		for i := range out {
			out[i] = make([]float64, n)
			out[i][i] = 1
		}
		return out
	}
	data := make([]float64, 0, len(basis)*n)
	for _, b := range basis {
		data = append(data, b...)
	}
	return nullSpace(len(basis), n, data)
}

// mechanismError names the parts that the free motion shape, (offset,
// scaled slope) per part between cuts, moves, at places in the units of u.
func mechanismError(m *Model, cuts []float64, shape [][2]float64, u units.System) error {
	L := m.Length()
	parts := make([]MechanismPart, len(shape))
	big := 0.0
	for p, s := range shape {
		off, slope := s[0], s[1]/L
		parts[p] = MechanismPart{Start: cuts[p], End: cuts[p+1], Offset: off, Slope: slope}
		big = max(big, math.Abs(off), math.Abs(off+slope*(cuts[p+1]-cuts[p])))
	}
	features := Features(m)
	at := make([]float64, len(features))
	for i, f := range features {
		at[i] = f.X
	}
	slices.Sort(at)
	// The places print with the digits that tell the parts' ends apart (a
	// part 1 µm long read "from x = 4.0 m to 4.0 m").
	var ends []float64
	for _, s := range parts {
		ends = append(ends, u.ToDisplay(units.Position, s.Start), u.ToDisplay(units.Position, s.End))
	}
	digits := digitsApart(ends)
	place := func(x float64) string { return quoteDigits(u, units.Position, x, digits) }
	var moving []string
	count := 0
	for p := range parts {
		s := &parts[p]
		s.Offset, s.Slope = s.Offset/big, s.Slope/big
		if math.Abs(s.Offset) < 1e-9 && math.Abs(s.Slope)*(s.End-s.Start) < 1e-9 {
			continue
		}
		if count++; count > maxPartsNamed {
			continue
		}
		where := fmt.Sprintf("the part from x = %s to %s", place(s.Start), place(s.End))
		if len(parts) == 1 {
			where = "the member"
		}
		if math.Abs(s.Slope)*(s.End-s.Start) < 1e-9 {
			moving = append(moving, where+" can move sideways")
			continue
		}
		pivot := s.Start - s.Offset/s.Slope
		// A support or hinge there, not its round-off.
		if i := sort.SearchFloat64s(at, pivot-1e-9*L); i < len(at) && at[i] <= pivot+1e-9*L {
			pivot = at[i]
		}
		moving = append(moving, fmt.Sprintf("%s can turn about x = %s", where, place(pivot)))
	}
	if more := count - maxPartsNamed; more > 0 {
		moving = append(moving, fmt.Sprintf("and %d more parts can move", more))
	}
	return &MechanismError{Motion: "hinge", Parts: parts,
		Message: fmt.Sprintf("with its hinges the member is a mechanism: %s; add a support under the free part, fix an end, or remove a hinge", strings.Join(moving, ", "))}
}

// maxPartsNamed is how many moving parts a mechanism's message names; it
// counts the rest.
const maxPartsNamed = 10
