package moving

import (
	"fmt"
	"math"
	"slices"

	"stave/fem"
)

// The Green's function of the member, built by two transfer sweeps (see the
// package comment). Everything here works in scaled variables so that the
// small systems mix no units: with ℓ the member length and EI₀ (EA₀) the
// largest flexural (axial) rigidity of its segments,
//
//	beam: ŵ = w/ℓ, θ, M̂ = M·ℓ/EI₀, V̂ = V·ℓ²/EI₀, τ = x/ℓ
//	bar:  û = u/ℓ, N̂ = N/EA₀
//
// and, with f = EI₀/EI (g = EA₀/EA) on a stretch, an unloaded stretch carries
// its state over τ by
//
//	ŵ(τ) = ŵ + θ·τ + f·(M̂·τ²/2 + V̂·τ³/6)    û(τ) = û + g·N̂·τ
//	θ(τ) = θ + f·(M̂·τ + V̂·τ²/2)              N̂(τ) = N̂
//	M̂(τ) = M̂ + V̂·τ
//	V̂(τ) = V̂
//
// (V = dM/dx, θ = dw/dx, M = EI·w″: fem's conventions).

// Components of the state.
const (
	compW, compTheta, compM, compV = 0, 1, 2, 3 // beam
	compU, compN                   = 0, 1       // bar
)

// state is one state vector: 4 components for the beam, 2 for the bar.
type state [4]float64

// basis is r ≤ 2 states spanning the states that satisfy every condition
// met by a sweep so far.
type basis [2]state

// mat2 maps the coefficients of one basis onto another's.
type mat2 [2][2]float64

// problem says which of fem's two problems a sweep solves.
type problem int

const (
	bendingProblem problem = iota
	axialProblem
)

// action is what a key point does to the state as a sweep crosses it: a
// rigid restraint (the component row must vanish and the reaction adds the
// direction into), or a spring (into gains c·row from left to right).
type action struct {
	constrain bool
	row, into int
	c         float64
}

// sweeps holds the two sweeps of one problem and the stretch polynomials
// of the unit load's jump.
type sweeps struct {
	problem   problem
	d, r      int       // state size and basis size
	keys      []float64 // key points, m: 0, ..., L
	flex      []float64 // per stretch, EI₀/EI or EA₀/EA
	length    float64   // ℓ = L, m
	rigidity  float64   // EI₀ (N·m²) or EA₀ (N)
	actions   [][]action
	supportAt []int // per key point, the support there, or −1

	// The left sweep: the bases just left and right of each key point
	// (zlMinus[k] in stretch k−1's coefficients, zlPlus[k] in stretch k's)
	// and ml[k], which maps stretch k's coefficients to stretch k−1's. The
	// right sweep likewise, mr[k] mapping stretch k−1's to stretch k's.
	zlMinus, zlPlus, zrMinus, zrPlus []basis
	ml, mr                           []mat2
	// jump[j][p] are the coefficients of τᵖ of (a; b) on stretch j: the
	// left and right states joined by a unit load at τ from the stretch's
	// start are zlPlus[j]·a(τ) and zrPlus[j]·b(τ).
	jump [][4]state
	// The bounds of the lines' pieces (setBounds) and the longest
	// stretch, m: what a window needs.
	pieceAfter, pieceBefore, afterBound, beforeBound []sym2
	longest                                          float64
}

// newSweeps sets up and runs the sweeps of problem pr for m, a valid model.
func newSweeps(m *fem.Model, pr problem) (*sweeps, error) {
	s := &sweeps{problem: pr, d: 4, r: 2, length: m.Length()}
	if pr == axialProblem {
		s.d, s.r = 2, 1
	}
	s.keys = keyPoints(m, pr)
	K := len(s.keys) - 1
	for _, seg := range m.Segments {
		s.rigidity = max(s.rigidity, rigidity(seg, pr))
	}
	s.flex = make([]float64, K)
	for j := range K {
		seg := m.Segments[m.SegmentAt(0.5*(s.keys[j]+s.keys[j+1]))]
		s.flex[j] = s.rigidity / rigidity(seg, pr)
	}
	s.actions = make([][]action, K+1)
	s.supportAt = make([]int, K+1)
	for k := range s.supportAt {
		s.supportAt[k] = -1
	}
	for i, sup := range m.Supports {
		k := s.keyIndex(sup.X)
		s.supportAt[k] = i
		s.actions[k] = append(s.actions[k], s.supportActions(sup)...)
	}
	if pr == bendingProblem {
		for _, h := range m.Hinges {
			k := s.keyIndex(h.X)
			if h.Stiffness > 0 {
				s.actions[k] = append(s.actions[k], action{row: compM, into: compTheta, c: s.rigidity / (s.length * h.Stiffness)})
			} else {
				s.actions[k] = append(s.actions[k], action{constrain: true, row: compM, into: compTheta})
			}
		}
	}
	if err := s.run(); err != nil {
		return nil, err
	}
	return s, nil
}

// rigidity is a segment's EI (bending) or EA (axial).
func rigidity(seg fem.Segment, pr problem) float64 {
	if pr == axialProblem {
		return seg.Material.Elastic * seg.Section.Area
	}
	return seg.Material.Elastic * seg.Section.SecondMoment
}

// supportActions are what support sup does to the scaled state.
func (s *sweeps) supportActions(sup fem.Support) []action {
	var out []action
	l, e := s.length, s.rigidity
	if s.problem == axialProblem {
		switch {
		case sup.Kind.Restrains(fem.Axial):
			out = append(out, action{constrain: true, row: compU, into: compN})
		case sup.Elastic(fem.Axial):
			// N⁺ = N⁻ + k·u, the spring's reaction being −k·u.
			out = append(out, action{row: compU, into: compN, c: sup.Stiffness[fem.Axial] * l / e})
		}
		return out
	}
	// A restraint of w acts on V, one of θ on M; springs make V⁺ = V⁻ − k·w
	// and M⁺ = M⁻ + k·θ, their reactions being −k·w and −k·θ.
	for _, r := range []struct {
		motion    fem.Dof
		row, into int
		scale     float64
	}{{fem.Transverse, compW, compV, -l * l * l / e}, {fem.Rotation, compTheta, compM, l / e}} {
		switch {
		case sup.Kind.Restrains(r.motion):
			out = append(out, action{constrain: true, row: r.row, into: r.into})
		case sup.Elastic(r.motion):
			out = append(out, action{row: r.row, into: r.into, c: sup.Stiffness[r.motion] * r.scale})
		}
	}
	return out
}

// keyTolerance is the distance, relative to the member, within which two
// key points are one: fem's own merge tolerance.
const keyTolerance = 1e-12

// keyPoints are the points where the unloaded member's state may jump or
// its stiffness change: the ends, the supports, the segment breaks and, for
// bending, the hinges; in order, with points closer than keyTolerance·L one.
func keyPoints(m *fem.Model, pr problem) []float64 {
	L := m.Length()
	pts := []float64{0, L}
	for _, seg := range m.Segments[1:] {
		pts = append(pts, seg.Start)
	}
	for _, sup := range m.Supports {
		pts = append(pts, sup.X)
	}
	if pr == bendingProblem {
		for _, h := range m.Hinges {
			pts = append(pts, h.X)
		}
	}
	for i, x := range pts {
		pts[i] = min(max(x, 0), L)
	}
	slices.Sort(pts)
	out := pts[:1]
	for _, x := range pts[1:] {
		if x-out[len(out)-1] > keyTolerance*L {
			out = append(out, x)
		}
	}
	out[len(out)-1] = L
	return out
}

// keyIndex is the index of the key point nearest to x.
func (s *sweeps) keyIndex(x float64) int {
	i, _ := slices.BinarySearch(s.keys, x)
	if i == len(s.keys) || (i > 0 && x-s.keys[i-1] < s.keys[i]-x) {
		return i - 1
	}
	return i
}

// transfer carries z over τ along stretch j (τ may be negative).
func (s *sweeps) transfer(z state, j int, tau float64) state {
	f := s.flex[j]
	if s.problem == axialProblem {
		return state{z[compU] + f*z[compN]*tau, z[compN]}
	}
	w, th, m, v := z[compW], z[compTheta], z[compM], z[compV]
	t2 := tau * tau
	return state{
		w + th*tau + f*(m*t2/2+v*t2*tau/6),
		th + f*(m*tau+v*t2/2),
		m + v*tau,
		v,
	}
}

// transferBasis carries every column of z over τ along stretch j.
func (s *sweeps) transferBasis(z basis, j int, tau float64) basis {
	for c := range s.r {
		z[c] = s.transfer(z[c], j, tau)
	}
	return z
}

// initial is the basis of a free end: the beam's deflection and rotation,
// the bar's displacement, with no force.
func (s *sweeps) initial() basis {
	var z basis
	z[0][0] = 1
	if s.r == 2 {
		z[1][1] = 1
	}
	return z
}

// degenerate is the size, relative to the basis, below which a restraint
// finds nothing left to restrain: the member is a mechanism there. Sizes
// are weighed by the stretch the sweep has just crossed (stretchWeights),
// so that a support 1 µm beyond another on 10 m, which meets deflections
// of the order of (1e-7)³ of the forces, is judged by its own stretch.
const degenerate = 1e-12

// stretchWeights are the weights of the state's components over a stretch
// h long (relative to ℓ), as solveJump scales its rows: over it a force V̂
// of order 1 makes M̂ of order h, θ of h² and ŵ of h³ (û of h, N̂ of 1).
// A stretch as long as the member weighs them alike.
func (s *sweeps) stretchWeights(h float64) state {
	h = min(h, 1)
	if s.problem == axialProblem {
		return state{1 / h, 1}
	}
	return state{1 / (h * h * h), 1 / (h * h), 1 / h, 1}
}

// weighed is the norm of z with its components weighed by w.
func weighed(z, w state) float64 {
	var n state
	for i := range z {
		n[i] = z[i] * w[i]
	}
	return norm(n)
}

// cross carries the basis z across key point k, from left to right (dir 1)
// or right to left (dir −1). It returns the new basis and the map of its
// coefficients to those of z.
func (s *sweeps) cross(z basis, k int, dir float64) (basis, mat2, error) {
	var m mat2
	// The stretch just crossed, towards k.
	h := 1.0
	if K := len(s.keys) - 1; dir > 0 && k > 0 {
		h = (s.keys[k] - s.keys[k-1]) / s.length
	} else if dir < 0 && k < K {
		h = (s.keys[k+1] - s.keys[k]) / s.length
	}
	wt := s.stretchWeights(h)
	for c := range s.r {
		n := norm(z[c])
		if n == 0 || math.IsInf(n, 0) || math.IsNaN(n) {
			return z, m, s.mechanism(k)
		}
		for i := range z[c] {
			z[c][i] /= n
		}
		m[c][c] = 1 / n
	}
	for _, a := range s.actions[k] {
		if !a.constrain {
			for c := range s.r {
				z[c][a.into] += dir * a.c * z[c][a.row]
			}
			continue
		}
		var next basis
		var cm mat2
		// Each state's size, weighed: the restraint must find a share of
		// one of them in its row.
		var size [2]float64
		for c := range s.r {
			size[c] = weighed(z[c], wt)
		}
		if s.r == 1 {
			if math.Abs(z[0][a.row])*wt[a.row] < degenerate*size[0] {
				return z, m, s.mechanism(k)
			}
		} else {
			z0, z1 := z[0][a.row], z[1][a.row]
			n := math.Hypot(z0, z1)
			if math.Hypot(z0/size[0], z1/size[1])*wt[a.row] < degenerate {
				return z, m, s.mechanism(k)
			}
			c0, c1 := z1/n, -z0/n
			var v state
			for i := range s.d {
				v[i] = c0*z[0][i] + c1*z[1][i]
			}
			// v's own share of the reaction's direction is dropped: that
			// direction joins the basis below, and a v left nearly along it
			// made the basis degenerate once supports crowd together
			// (three rollers 0.1 mm apart read as a mechanism).
			v[a.row], v[a.into] = 0, 0
			// What is left of the states combined, against the sizes they
			// were combined from.
			nv := norm(v)
			if weighed(v, wt) < degenerate*(math.Abs(c0)*size[0]+math.Abs(c1)*size[1]) {
				return z, m, s.mechanism(k)
			}
			for i := range v {
				v[i] /= nv
			}
			next[0] = v
			cm = mat2{{c0 / nv, 0}, {c1 / nv, 0}}
		}
		next[s.r-1][a.into] = 1
		z = next
		m = m.times(cm)
	}
	return z, m, nil
}

// mechanism is the error of a member that cannot carry a load near key point k.
func (s *sweeps) mechanism(k int) error {
	what := "across the member"
	if s.problem == axialProblem {
		what = "along the member"
	}
	return fmt.Errorf("the member cannot carry a load %s near x = %.4g m: the supports and hinges leave part of it free to move; add a support that holds it %s", what, s.keys[k], what)
}

func norm(z state) float64 { return math.Sqrt(z[0]*z[0] + z[1]*z[1] + z[2]*z[2] + z[3]*z[3]) }

func (a mat2) times(b mat2) mat2 {
	return mat2{
		{a[0][0]*b[0][0] + a[0][1]*b[1][0], a[0][0]*b[0][1] + a[0][1]*b[1][1]},
		{a[1][0]*b[0][0] + a[1][1]*b[1][0], a[1][0]*b[0][1] + a[1][1]*b[1][1]},
	}
}

// rowTimes is the row vector v times a.
func rowTimes(v [2]float64, a mat2) [2]float64 {
	return [2]float64{v[0]*a[0][0] + v[1]*a[1][0], v[0]*a[0][1] + v[1]*a[1][1]}
}

// run sweeps from both ends and solves the jump of a unit load on every
// stretch.
func (s *sweeps) run() error {
	K := len(s.keys) - 1
	s.zlMinus, s.zlPlus = make([]basis, K+1), make([]basis, K+1)
	s.zrMinus, s.zrPlus = make([]basis, K+1), make([]basis, K+1)
	s.ml, s.mr = make([]mat2, K+1), make([]mat2, K+1)
	var err error
	z := s.initial()
	for k := 0; k <= K; k++ {
		s.zlMinus[k] = z
		if z, s.ml[k], err = s.cross(z, k, 1); err != nil {
			return err
		}
		s.zlPlus[k] = z
		if k < K {
			z = s.transferBasis(z, k, (s.keys[k+1]-s.keys[k])/s.length)
		}
	}
	z = s.initial()
	for k := K; k >= 0; k-- {
		s.zrPlus[k] = z
		if z, s.mr[k], err = s.cross(z, k, -1); err != nil {
			return err
		}
		s.zrMinus[k] = z
		if k > 0 {
			z = s.transferBasis(z, k-1, -(s.keys[k]-s.keys[k-1])/s.length)
		}
	}
	s.jump = make([][4]state, K)
	for j := range K {
		if err := s.solveJump(j); err != nil {
			return err
		}
	}
	s.setBounds()
	return nil
}

// solveJump finds the polynomials of (a; b) on stretch j from
// [−zlPlus | zrPlus]·(a; b) = −T(−τ)·J, J the unit load's jump: −e_V for a
// unit force down (V̂ jumps by −1), −e_N for a unit force along +x.
func (s *sweeps) solveJump(j int) error {
	var a [4][4]float64
	for c := range s.r {
		for i := range s.d {
			a[i][c] = -s.zlPlus[j][c][i]
			a[i][s.r+c] = s.zrPlus[j][c][i]
		}
	}
	// The rows are scaled to the stretch, so that a stretch far shorter
	// than the member (supports 0.1 mm apart on 10 m) is judged singular
	// by its own sizes, not the member's: over a stretch of length h
	// (relative to ℓ) a unit load makes V̂ of order 1, M̂ of h, θ of h²
	// and ŵ of h³ (û of h, N̂ of 1). The columns are then equilibrated.
	h := (s.keys[j+1] - s.keys[j]) / s.length
	rowScale := [4]float64{1 / (h * h * h), 1 / (h * h), 1 / h, 1}
	if s.problem == axialProblem {
		rowScale = [4]float64{1 / h, 1}
	}
	var colScale [4]float64
	for i := range s.d {
		for c := range s.d {
			a[i][c] *= rowScale[i]
			colScale[c] = max(colScale[c], math.Abs(a[i][c]))
		}
	}
	for c := range s.d {
		if colScale[c] == 0 || math.IsInf(colScale[c], 0) || math.IsNaN(colScale[c]) {
			return s.mechanism(j)
		}
		for i := range s.d {
			a[i][c] /= colScale[c]
		}
	}
	var lu smallLU
	if !lu.factorize(a, s.d) {
		return s.mechanism(j)
	}
	f := s.flex[j]
	var rhs [4]state
	if s.problem == axialProblem {
		rhs[0][compN] = -1
		rhs[1][compU] = f
	} else {
		rhs[0][compV] = -1
		rhs[1][compM] = 1
		rhs[2][compTheta] = -f / 2
		rhs[3][compW] = f / 6
	}
	for p := range rhs {
		for i := range s.d {
			rhs[p][i] *= rowScale[i]
		}
		y := lu.solve(rhs[p])
		for c := range s.d {
			y[c] /= colScale[c]
		}
		s.jump[j][p] = y
	}
	return nil
}

// smallLU is Gaussian elimination with partial pivoting of a d × d matrix,
// d ≤ 4.
type smallLU struct {
	a   [4][4]float64
	piv [4]int
	d   int
}

// singularPivot is the pivot, relative to the largest entry, below which
// the system is taken as singular: the member is a mechanism.
const singularPivot = 1e-13

func (lu *smallLU) factorize(a [4][4]float64, d int) bool {
	lu.a, lu.d = a, d
	big := 0.0
	for i := range d {
		for k := range d {
			big = max(big, math.Abs(a[i][k]))
		}
	}
	for k := range d {
		p := k
		for i := k + 1; i < d; i++ {
			if math.Abs(lu.a[i][k]) > math.Abs(lu.a[p][k]) {
				p = i
			}
		}
		lu.piv[k] = p
		lu.a[k], lu.a[p] = lu.a[p], lu.a[k]
		if !(math.Abs(lu.a[k][k]) > singularPivot*big) {
			return false
		}
		for i := k + 1; i < d; i++ {
			l := lu.a[i][k] / lu.a[k][k]
			lu.a[i][k] = l
			for c := k + 1; c < d; c++ {
				lu.a[i][c] -= l * lu.a[k][c]
			}
		}
	}
	return true
}

func (lu *smallLU) solve(b state) state {
	d := lu.d
	// The rows were swapped whole, multipliers included: swap b first
	// (as LAPACK's getrs does), then substitute.
	for k := range d {
		b[k], b[lu.piv[k]] = b[lu.piv[k]], b[k]
	}
	for k := range d {
		for i := k + 1; i < d; i++ {
			b[i] -= lu.a[i][k] * b[k]
		}
	}
	for k := d - 1; k >= 0; k-- {
		for c := k + 1; c < d; c++ {
			b[k] -= lu.a[k][c] * b[c]
		}
		b[k] /= lu.a[k][k]
	}
	return b
}
