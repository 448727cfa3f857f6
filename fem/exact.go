package fem

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"sort"
	"sync"

	"stave/fem/band"
)

// Exact is the closed-form solution of a model. Between key points (the ends,
// segment breaks, supports, point loads and distributed-load break points) the
// section is constant and every load is linear in x, so EA·u″ = −p makes the
// axial displacement a cubic and EI·w⁗ = q makes the deflection a quintic.
// SolveExact finds the integration constants and the support reactions from
// one banded system per problem (bar, beam) whose size grows with the
// number of stretches and supports, not with any mesh.
type Exact struct {
	// Condition bounds the round-off in the integration constants and the
	// reactions as Solution.Condition does for the finite element answer:
	// relative errors up to about Condition·ε are possible. It is the
	// larger 1-norm condition estimate of the bar's and the beam's
	// equations after equilibration. Warning says when it matters.
	Condition float64
	model     *Model    // the model solved (shared with its ExactStructure)
	keys      []float64 // key points in increasing order: keys[0] = 0, last = L
	stretches []exactStretch
	reactions []Reaction
	// ranges are the stretches' ranges of every quantity (Interval.Range),
	// worked out once, when EachInterval is first asked (rangesOnce): the
	// summary, the comparison, the checks and the drawing all read them.
	rangesOnce sync.Once
	ranges     [][quantityCount][2]extremum
	// extremes are the exact solution's own extremes (ownExtremes),
	// worked out once (extremesOnce).
	extremesOnce sync.Once
	extremes     *extremes
}

// exactStretch is the part of the member between two neighbouring key points.
type exactStretch struct {
	start, length float64 // m
	end           float64 // the key point it ends at, m (start + length may miss it)
	area, fibre   float64 // A (m²) and c (m) of its segment
	secondMoment  float64 // I, m⁴
	thermalStrain float64 // α·ΔT
	bar, beam     stretchSolution
	// shear is EI/(G·As) of a Timoshenko stretch, m², 0 for Euler–
	// Bernoulli; load is its transverse line load at both ends, N/m, which
	// the shear deformation adds to θ, M and V (shearTerms), and axialLoad
	// its axial one.
	shear           float64
	load, axialLoad [2]float64
}

// shearTerms are what shear deformation adds, at t, to the rotation and
// the bending moment and shear force read off the deflection w of a
// Timoshenko stretch: with θ = w′ + g·θ″, M = EI·θ′ and V = EI·θ″ = M′ under
// a linear load q (θ‴ = q/EI), θ = w′ + g·w‴ + g²·q′/EI, M = EI·w″ + g·q
// and V = EI·w‴ + g·q′ (g = EI/(G·As)). The w‴ part of θ is the caller's.
func (s *exactStretch) shearTerms(t float64) (rotation, moment, shear float64) {
	if s.shear == 0 {
		return 0, 0, 0
	}
	slope := (s.load[1] - s.load[0]) / s.length // q′, N/m²
	q := s.load[0] + (s.load[1]-s.load[0])*t
	return s.shear * s.shear * slope / s.beam.stiffness, s.shear * q, s.shear * slope
}

// stretchSolution is the closed form of one problem (the bar's u or the
// beam's w, m) on one stretch, in the local coordinate t = (x − start)/length
// in [0, 1]: y(t) = Σ c_k·φ_k(t) + y_p(t), with order homogeneous solutions
// φ_k whose constants c_k SolveExact finds and a particular solution y_p of
// the stretch's loads. Working in t keeps all unknowns in metres whatever the
// stretch length. The equations are written through bases, particular and
// setConstants only, so a stretch of another kind brings its own
// functions. Off a foundation a stretch is polynomial: φ_k = t^k and y_p a
// polynomial, kept as one list of coefficients. On one, φ_k are the
// foundation's (groundBasis) and y_p is linear, its coefficients of 1 and
// t following the constants.
//
// A very short stretch that no supports bracket (taylorUnknowns) takes as
// the unknowns of the equations c_k/unit^k instead, unit a power of two
// near its length: its Taylor coefficients y^(k)(start)/k! in x but for
// a factor (length/unit)^k between 2^(−k/2) and 2^(k/2) (on a foundation
// those of the power series, which go as t^k/k! near t = 0).
// Such a stretch passes its section actions on between its neighbours,
// and in t its constants would carry h^k beside theirs: where an action's
// balance row holds y^(d)/h^d of a stretch a ten-billionth of its
// neighbour's length, equilibration, which scales a whole column at once,
// cannot bring both to one size (a point load 1e-10 m from a support made
// equations of condition 7e14, which were refused).
type stretchSolution struct {
	stiffness float64 // EA (N) for the bar, EI (N·m²) for the beam
	// offset is added to the section action odeProblem.offsetAction names:
	// −EA·α·ΔT turns EA·u' into N, −EI·κ (κ the free thermal curvature)
	// turns EI·w'' into M.
	offset float64
	// order is the number of homogeneous solutions (2 for the bar, 4 for the beam).
	order int
	// coeff holds the constants of the homogeneous part (order terms)
	// followed by the particular part of a linear load (two terms, known).
	coeff []float64
	// ground is the basis on a foundation; its order is 0 off one.
	ground groundBasis
	// unit scales the unknowns of the equations, c_k/unit^k: 1, or for a
	// stretch with Taylor unknowns a power of two near its length.
	unit float64
}

// polynomial reports whether the solution is a polynomial in t.
func (s *stretchSolution) polynomial() bool { return s.ground.order == 0 }

// monomialEnds[e][d][k] is the d-th derivative of t^k at the end t = e of
// a stretch, for the terms (up to t⁵) and derivatives (up to the third) the
// equations take there, several times for every key point.
var monomialEnds = func() (v [2][4][6]float64) {
	for e := range v {
		for d := range v[e] {
			for k := range v[e][d] {
				v[e][d][k] = monomialDerivative(k, d, float64(e))
			}
		}
	}
	return v
}()

// monomial is monomialDerivative(k, d, t), from monomialEnds at the ends.
func monomial(k, d int, t float64) float64 {
	if (t == 0 || t == 1) && d < 4 && k < 6 {
		return monomialEnds[int(t)][d][k]
	}
	return monomialDerivative(k, d, t)
}

// basis is the d-th derivative in t of the k-th homogeneous solution at t.
func (s *stretchSolution) basis(k, d int, t float64) float64 {
	if s.polynomial() {
		return monomial(k, d, t)
	}
	return s.ground.derivative(k, d, t)
}

// bases sets v[k] to basis(k, d, t)·unit^k for every k < len(v), the
// coefficient of the k-th unknown of the equations (c_k/unit^k), at a
// polynomial stretch's ends from monomialEnds.
func (s *stretchSolution) bases(d int, t float64, v []float64) {
	if s.polynomial() && (t == 0 || t == 1) && d < 4 && len(v) <= 6 {
		copy(v, monomialEnds[int(t)][d][:])
	} else {
		for k := range v {
			v[k] = s.basis(k, d, t)
		}
	}
	s.scaleUnknowns(v)
}

// scaleUnknowns multiplies v[k] by unit^k, exactly (unit is a power of
// two).
func (s *stretchSolution) scaleUnknowns(v []float64) {
	f := 1.0
	for k := range v {
		v[k] *= f
		f *= s.unit
	}
}

// particular is the d-th derivative in t of the particular solution at t.
func (s *stretchSolution) particular(d int, t float64) float64 {
	if !s.polynomial() {
		switch d {
		case 0:
			return s.coeff[s.order] + s.coeff[s.order+1]*t
		case 1:
			return s.coeff[s.order+1]
		}
		return 0
	}
	v := 0.0
	for k := s.order; k < len(s.coeff); k++ {
		v += s.coeff[k] * monomial(k, d, t)
	}
	return v
}

// derivative is the d-th derivative in t of the solution at t.
func (s *stretchSolution) derivative(d int, t float64) float64 {
	if s.polynomial() {
		return derivativeAt(s.coeff, d, t)
	}
	v := s.particular(d, t)
	for k := range s.order {
		v += s.coeff[k] * s.ground.derivative(k, d, t)
	}
	return v
}

// setConstants stores the homogeneous constants c_k from the unknowns x
// of the equations (c_k/unit^k), which it uses up.
func (s *stretchSolution) setConstants(x []float64) {
	s.scaleUnknowns(x)
	copy(s.coeff[:s.order], x)
}

// useTaylorUnknowns makes the unknowns of the equations the Taylor
// coefficients of a stretch of length h, where its basis functions go as
// t^k near t = 0 (off a foundation, and on one in the power series): unit
// is then the power of two nearest h, so the scaling is exact.
func (s *stretchSolution) useTaylorUnknowns(h float64) {
	if s.polynomial() || s.ground.scale <= groundSeriesLimit {
		_, e := math.Frexp(h / math.Sqrt2)
		s.unit = math.Ldexp(1, e)
	}
}

// odeProblem is one of the two decoupled problems, written so that bar and
// beam share the assembly. Its section actions are
// T_i = sign_i·stiffness·y^(order−1−i) (+ offset for i = 0), each paired with
// the motion y^(i) = dofs[i], and at every point T_i(right) − T_i(left) equals
// minus the external action there (point load, support reaction).
type odeProblem struct {
	order int
	dofs  []Dof
	signs []float64
	// offsetAction is the action the solution's offset adds to.
	offsetAction int
}

var (
	// Bar: T_0 = N = EA·(u' − αΔT), and N jumps by −P under an axial force P.
	exactBar = odeProblem{order: 2, dofs: []Dof{Axial}, signs: []float64{1}}
	// Beam: T_0 = −V = −EI·w''' (V jumps by +P under an upward force P) and
	// T_1 = M = EI·w'' (M jumps by −C under a counter-clockwise moment C).
	// M = EI·(w'' − κ) under a free thermal curvature κ.
	exactBeam = odeProblem{order: 4, dofs: []Dof{Transverse, Rotation}, signs: []float64{-1, 1}, offsetAction: 1}
)

// keyPoint gathers what acts at one key point.
type keyPoint struct {
	load       [3]float64 // point loads by Dof: N, N, N·m
	restraints []restraint
	// hinge says the moment is released here; a spring across it has
	// compliance release (rad/(N·m)), 0 meaning none (a pure hinge).
	hinge   bool
	release float64
}

// restraint is one motion y a support holds, rigidly or by a spring. Its
// reaction R is an unknown with the condition y + compliance·R = settlement:
// a spring (R = −k·y) has compliance 1/k and no settlement, a rigid
// restraint compliance 0. Written this way a very stiff spring tends to the
// rigid condition instead of multiplying a tiny y by a huge k.
type restraint struct {
	support    int // index into Model.Supports
	dof        Dof
	settlement float64 // m or rad
	compliance float64 // m/N or rad/(N·m)
}

// SolveExact integrates the governing equations of m in closed form.
func SolveExact(m *Model) (*Exact, error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, err
	}
	return p.Exact()
}

// ExactStructure is the exact solution's equations for a member with the
// matrices of the bar and of the beam equilibrated and factorized once:
// Solve answers any load set gathered on the member's key points (load
// cases, unit loads) with one substitution per problem, and solutions of
// one structure combine linearly (CombineExact).
type ExactStructure struct {
	model    *Model
	keys     []float64
	problems []exactProblem
	// condition is the larger condition estimate of the problems'
	// equilibrated systems (Exact.Condition).
	condition float64
	// taylor says, per stretch and problem (bar, beam), that the
	// unknowns of its equations are its Taylor coefficients
	// (taylorUnknowns).
	taylor [][2]bool
}

// exactProblem is one problem's layout and factorized matrix.
type exactProblem struct {
	ode    odeProblem
	layout exactLayout
	factor exactFactor
}

// newExactStructure sets up and factorizes the member's equations, and
// solves them under the member's own loads, whose stretches and key points
// the assembly needed anyway. Only a factorization that fails, or that the
// condition estimate refuses, returns no structure.
func newExactStructure(p *Member) (*ExactStructure, *Exact, error) {
	es := &ExactStructure{model: &p.model, keys: p.keys, taylor: taylorUnknowns(&p.model, p.keys)}
	own := es.blank(&p.loads)
	points := own.keyPoints(&p.model, &p.loads)
	odes := []odeProblem{exactBar, exactBeam}
	if !p.bending {
		odes = odes[:1] // a bar alone: w stays zero
	}
	// The problems share nothing but what they read: the bar's system is
	// set up, factorized and solved beside the beam's, each on its own
	// goroutine, each storing its own constants and reactions; each
	// condition estimate runs beside its problem's solve and the checks of
	// the solution, and is waited for before either is trusted.
	es.problems = make([]exactProblem, len(odes))
	errs, condErrs := make([]error, len(odes)), make([]error, len(odes))
	var solved, estimated sync.WaitGroup
	for i, ode := range odes {
		solved.Add(1)
		go func() {
			defer solved.Done()
			pr := &es.problems[i]
			var a *band.General
			var b []float64
			if a, b, errs[i] = own.factorizeProblem(pr, ode, points); errs[i] != nil {
				return
			}
			estimated.Add(1)
			go func() {
				defer estimated.Done()
				condErrs[i] = pr.factor.estimate(a)
			}()
			errs[i] = pr.solveInto(own, b)
		}()
	}
	solved.Wait()
	var e *Exact
	var err error
	if errors.Join(errs...) == nil {
		e, err = own.finish(points)
		if err == nil {
			// The stretches' ranges and the extremes, which every summary
			// asks for, worked out while the condition estimates finish on
			// their own goroutines.
			e.ownExtremes()
		}
	}
	estimated.Wait()
	// The problems' errors in order, as if one after the other.
	for i := range odes {
		if failed := cmp.Or(errs[i], condErrs[i]); failed != nil {
			return nil, nil, failed
		}
		es.condition = max(es.condition, es.problems[i].factor.cond)
	}
	own.Condition = es.condition
	// A structure whose own loads overflow still serves other load sets.
	return es, e, err
}

// factorizeProblem sets pr to problem ode of e's equations, assembled and
// factorized, and returns the matrix it used up (for the condition
// estimate) and the right-hand side of e's loads, assembled in the same
// pass. points are e's key points.
func (e *Exact) factorizeProblem(pr *exactProblem, ode odeProblem, points []keyPoint) (*band.General, []float64, error) {
	*pr = exactProblem{ode: ode, layout: e.layout(ode, points)}
	var shape bandShape
	e.equations(ode, points, pr.layout, &shape)
	sys := systemEquations{band.NewGeneral(pr.layout.unknowns, shape.lower, shape.upper), make([]float64, pr.layout.unknowns)}
	if rows := e.equations(ode, points, pr.layout, &sys); rows != pr.layout.unknowns {
		return nil, nil, fmt.Errorf("fem: exact solution assembled %d equations for %d unknowns", rows, pr.layout.unknowns)
	}
	if err := pr.factor.factorize(sys.a); err != nil {
		return nil, nil, err
	}
	return sys.a, sys.b, nil
}

// solveInto stores in e the problem's constants and reactions for the
// right-hand side b, which it uses up.
func (pr *exactProblem) solveInto(e *Exact, b []float64) error {
	x, err := pr.factor.solve(b)
	if err != nil {
		return err
	}
	e.store(pr.ode, pr.layout, x)
	return nil
}

// KeyPoints are the points loads must be gathered on for Solve. They are
// shared, not copied: do not change them.
func (es *ExactStructure) KeyPoints() []float64 { return es.keys }

// Solve integrates the member's equations in closed form under the loads l,
// gathered (GatherLoads) on the structure's KeyPoints with one settlement
// per support.
func (es *ExactStructure) Solve(l *Loads) (*Exact, error) {
	if len(l.Keys) != len(es.keys) || len(l.Settlement) != len(es.model.Supports) {
		return nil, fmt.Errorf("fem: the loads were gathered for another member or other supports: gather them on ExactStructure.KeyPoints")
	}
	e := es.blank(l)
	points := e.keyPoints(es.model, l)
	for _, pr := range es.problems {
		b := make([]float64, pr.layout.unknowns)
		e.equations(pr.ode, points, pr.layout, &rhsEquations{b})
		if err := pr.solveInto(e, b); err != nil {
			return nil, err
		}
	}
	return e.finish(points)
}

// finish checks that e, with every problem's constants and reactions,
// holds finite numbers, and takes the reactions of the stretches clamped at
// both ends from statics. points are e's key points.
func (e *Exact) finish(points []keyPoint) (*Exact, error) {
	if !e.finite() {
		return nil, errNotFinite
	}
	e.staticReactions(points)
	return e, nil
}

// staticReactions replaces, where a stretch is clamped at both ends, the
// reactions of the rigid restraints solved for with the integration
// constants by those statics gives from the actions on the most flexible
// stretch between restraints (reactions.go), as the finite element answer
// takes them; the springs keep theirs. A short, stiff stretch clamped at
// both ends (two fixed supports a millimetre apart) has constants that meet
// its end conditions only to the round-off of the whole system, magnified
// by its stiffness in the reactions solved beside it. Its end actions come
// instead from its ends' prescribed motions, as K·u − f of the element of
// the same stretch, which is exact for exact end values (the Hermite and
// the interdependent interpolation elements reproduce the exact end forces
// under linear loads); every other stretch's from its own fields. points
// are the key points' loads and restraints.
func (e *Exact) staticReactions(points []keyPoint) {
	n := len(e.keys)
	disp, loads := make([][3]float64, n), make([][3]float64, n)
	prescribed := make([][3]bool, n)
	for k := range e.keys {
		loads[k] = points[k].load
		for _, r := range points[k].restraints {
			if r.compliance == 0 {
				disp[k][r.dof], prescribed[k][r.dof] = r.settlement, true
			}
		}
	}
	// clamped reports whether the problem of motion d is held rigidly at
	// both ends of stretch j, so its end motions are known exactly.
	clamped := func(j int, d Dof) bool {
		a, b := prescribed[j], prescribed[j+1]
		if d == Axial {
			return a[Axial] && b[Axial]
		}
		return a[Transverse] && a[Rotation] && b[Transverse] && b[Rotation] && !points[j].hinge
	}
	someClamped := false
	for j := range e.stretches {
		someClamped = someClamped || clamped(j, Axial) || clamped(j, Transverse)
	}
	if !someClamped {
		return
	}
	els := make([]elementData, len(e.stretches))
	for j := range e.stretches {
		s := &e.stretches[j]
		els[j] = elementData{start: s.start, length: s.length, axialLoad: s.axialLoad, transverseLoad: s.load,
			sectionData: sectionData{axialRigidity: s.bar.stiffness, flexuralRigidity: s.beam.stiffness, shear: s.shear,
				thermalStrain: s.thermalStrain, thermalCurvature: -s.beam.offset / s.beam.stiffness}}
		if !s.polynomial() {
			els[j].ground = s.groundResultant()
		}
	}
	element := elementActions(els, disp)
	start := func(j int, d Dof) float64 {
		s := &e.stretches[j]
		if s.polynomial() && clamped(j, d) {
			return element(j, d)
		}
		var f Fields
		s.fields(0, &f)
		return [3]float64{f.AxialForce, f.ShearForce, f.BendingMoment}[d]
	}
	staticReactions(e.model, e.keys, els, loads, e.reactions, start)
}

// blank is an Exact with the stretches of the loads l and no constants yet.
func (es *ExactStructure) blank(l *Loads) *Exact {
	e := &Exact{Condition: es.condition, model: es.model, keys: es.keys, stretches: make([]exactStretch, len(es.keys)-1), reactions: make([]Reaction, len(es.model.Supports))}
	for j := range e.stretches {
		s := &e.stretches[j]
		*s = newStretch(es.model, l, j)
		if es.taylor[j][0] {
			s.bar.useTaylorUnknowns(s.length)
		}
		if es.taylor[j][1] {
			s.beam.useTaylorUnknowns(s.length)
		}
	}
	for i, s := range es.model.Supports {
		e.reactions[i] = Reaction{Support: i, X: s.X}
	}
	return e
}

// taylorLength is the length, relative to the member's, below which a
// stretch may take Taylor unknowns (taylorUnknowns): on longer ones the
// constants in t serve as well (a load 1 cm from a support of two spans
// of 4 m gave condition 2e4 in t, 2e3 in Taylor unknowns).
const taylorLength = 1e-3

// taylorUnknowns says, per stretch between the key points keys of m and
// per problem (bar, beam), whether the unknowns of the stretch's equations
// are its Taylor coefficients (stretchSolution): where it is shorter than
// taylorLength of the member and supports do not hold the problem's
// motions (rigidly or by springs) at both its ends. Between two such
// supports its section actions follow from how its ends move against
// each other, not from balance with its neighbours alone, and the
// constants in t, of the size of its end motions, are kept: between two
// fixed supports a millimetre apart, Taylor coefficients of the moment
// and the shear would be fixed by end motions 1e-6 and 1e-9 times their
// size (condition 4e15 against 8e7).
func taylorUnknowns(m *Model, keys []float64) [][2]bool {
	e := Exact{keys: keys}
	held := make([][2]bool, len(keys))
	for _, s := range m.Supports {
		k := e.keyIndex(s.X)
		held[k][0] = held[k][0] || s.Holds(Axial)
		held[k][1] = held[k][1] || s.Holds(Transverse) || s.Holds(Rotation)
	}
	short := taylorLength * keys[len(keys)-1]
	out := make([][2]bool, len(keys)-1)
	for j := range out {
		for p := range out[j] {
			out[j][p] = keys[j+1]-keys[j] < short && !(held[j][p] && held[j+1][p])
		}
	}
	return out
}

// finite reports whether the reactions and the fields at the ends and middle
// of every stretch are finite numbers: validated but extreme inputs (a
// moment of 1e308 N·m, I of 5e-324 m⁴) can overflow.
func (e *Exact) finite() bool {
	for _, r := range e.reactions {
		for _, f := range r.Force {
			if !isFinite(f) {
				return false
			}
		}
	}
	// Each stretch is read directly, not through At's search for it.
	var f Fields
	for j := range e.stretches {
		for _, t := range [3]float64{0, 0.5, 1} {
			e.stretches[j].fields(t, &f)
			for _, v := range [...]float64{f.AxialDisplacement, f.Deflection, f.Rotation, f.AxialForce,
				f.ShearForce, f.BendingMoment, f.AxialStress, f.BendingStress, f.CombinedStress} {
				if !isFinite(v) {
					return false
				}
			}
		}
	}
	return true
}

// newStretch sets up stretch j of the loads l with its section and the
// particular solution of its (linear) loads.
func newStretch(m *Model, l *Loads, j int) exactStretch {
	a, b := l.Keys[j], l.Keys[j+1]
	seg := m.Segments[m.SegmentAt(0.5*(a+b))]
	sec, mat := seg.Section, seg.Material
	s := exactStretch{
		start: a, length: b - a, end: b,
		area: sec.Area, fibre: sec.FibreDistance, secondMoment: sec.SecondMoment,
		thermalStrain: mat.ThermalExpansion * l.TemperatureChange,
	}
	ea, ei := mat.Elastic*sec.Area, mat.Elastic*sec.SecondMoment
	axial, transverse := l.Axial[j], l.Transverse[j]
	// EA·u″ = −p and EI·w⁗ = q, with −kₐ·u and +k·w on a foundation.
	k, ka := m.foundationAt(0.5 * (a + b))
	if ka > 0 {
		s.bar = newGroundSolution(exactBar.order, ea, s.length, ka, -axial[0], -axial[1])
	} else {
		s.bar = newStretchSolution(exactBar.order, ea, s.length, -axial[0], -axial[1])
	}
	s.bar.offset = -ea * s.thermalStrain
	if k > 0 {
		s.beam = newGroundSolution(exactBeam.order, ei, s.length, k, transverse[0], transverse[1])
	} else {
		s.beam = newStretchSolution(exactBeam.order, ei, s.length, transverse[0], transverse[1])
	}
	s.shear, s.load, s.axialLoad = seg.ShearFlexibility(), transverse, axial
	if l.TemperatureDifference != nil {
		// The curvature α·ΔT/h first: E·I·α may overflow where ΔT is 0.
		s.beam.offset = -ei * (mat.ThermalExpansion * l.TemperatureDifference[m.SegmentAt(0.5*(a+b))] / sec.depth())
	}
	return s
}

// newStretchSolution holds the particular solution of
// stiffness·y^(order) = load, with the load going linearly from l0 to l1
// over a stretch of length h: in t, y^(order) = h^order·load/stiffness.
func newStretchSolution(order int, stiffness, h, l0, l1 float64) stretchSolution {
	c := make([]float64, order+2)
	scale := math.Pow(h, float64(order)) / stiffness
	c[order] = scale * l0 / fallingFactorial(order, order)
	c[order+1] = scale * (l1 - l0) / fallingFactorial(order+1, order+1)
	return stretchSolution{stiffness: stiffness, order: order, coeff: c, unit: 1}
}

// keyPoints gathers what acts at each key point of m under the loads l: the
// point loads and the restraints of the supports, with their settlements.
func (e *Exact) keyPoints(m *Model, loads *Loads) []keyPoint {
	points := make([]keyPoint, len(e.keys))
	for i, s := range m.Supports {
		k := &points[e.keyIndex(s.X)]
		for d := Axial; d <= Rotation; d++ {
			switch {
			case s.Kind.Restrains(d):
				k.restraints = append(k.restraints, restraint{support: i, dof: d, settlement: loads.Settlement[i][d]})
			case s.Elastic(d):
				k.restraints = append(k.restraints, restraint{support: i, dof: d, compliance: 1 / s.Stiffness[d]})
			}
		}
	}
	if m.slidesFree() {
		points[0].restraints = append(points[0].restraints, restraint{support: datum, dof: Axial})
	}
	for _, h := range m.Hinges {
		k := &points[e.keyIndex(h.X)]
		k.hinge = true
		if h.Stiffness > 0 {
			k.release = 1 / h.Stiffness
		}
	}
	for _, p := range loads.Points {
		k := &points[e.keyIndex(p.X)]
		k.load[Axial] += p.Axial
		k.load[Transverse] += p.Transverse
		k.load[Rotation] += p.Moment
	}
	return points
}

// keyIndex returns the index of the key point nearest to x.
func (e *Exact) keyIndex(x float64) int {
	i := sort.SearchFloat64s(e.keys, x)
	if i == len(e.keys) || (i > 0 && x-e.keys[i-1] < e.keys[i]-x) {
		return i - 1
	}
	return i
}

// exactLayout numbers the unknowns of one problem along the member: at
// each key point the reactions of the restraints there, then the constants
// of the stretch that starts there.
type exactLayout struct {
	held     []restraint // the restraints of the problem, in order along the member
	heldCol  []int       // the column of each one's reaction
	firstCol []int       // per stretch, the column of its first constant
	unknowns int
	// actionUnit is 1, or for stiffnesses beyond 2^±actionUnitBits a power
	// of two near the stretches' stiffness (their geometric mean): the
	// balance equations are divided by it and the reactions solved for in
	// it, so that they meet the continuity and restraint equations, in m
	// and rad, near unit size whatever EI or EA is.
	actionUnit float64
}

// actionUnitBits bounds the stiffnesses (N, N·m²) whose balance equations
// are left as they are: within 2^±64 the row and column equilibration
// balances them alone (two spans of steel with E scaled from 1e-25 to 1e18
// are solved in TestExactSolutionWhateverTheStiffness), and a member of
// ordinary size keeps the round-off it had; beyond, it did not (E scaled
// by 1e30 gave no exact solution, condition number 2.67e+13 after scaling).
const actionUnitBits = 64

func (e *Exact) layout(p odeProblem, points []keyPoint) exactLayout {
	l := exactLayout{firstCol: make([]int, len(e.stretches))}
	col := 0
	for k, kp := range points {
		for _, r := range kp.restraints {
			if p.index(r.dof) >= 0 {
				l.held = append(l.held, r)
				l.heldCol = append(l.heldCol, col)
				col++
			}
		}
		if k < len(e.stretches) {
			l.firstCol[k] = col
			col += p.order
		}
	}
	l.unknowns = col
	exponents := 0
	for j := range e.stretches {
		_, x := math.Frexp(e.solution(p, j).stiffness)
		exponents += x
	}
	l.actionUnit = 1
	if x := exponents / max(1, len(e.stretches)); x > actionUnitBits || x < -actionUnitBits {
		l.actionUnit = math.Ldexp(1, x)
	}
	return l
}

// equations writes the equations of problem p to sys, key point by key
// point, and returns how many rows it wrote. At each key point and for
// each motion: continuity of the motion between the two stretches (inside
// the member), the balance of the section actions with the point loads and
// the reactions there, and for each restraint its condition
// y + compliance·R = settlement.
func (e *Exact) equations(p odeProblem, points []keyPoint, l exactLayout, sys exactEquations) int {
	nStretch := len(e.stretches)
	row := 0
	matrix, rhs := sys.parts()
	// values holds a term's entries, one per constant (the beam has the
	// most, four), cell a restraint's one.
	var values [4]float64
	var cell [1]float64
	// term adds scale·y^(d) of stretch j at t to the row.
	term := func(j, d int, t, scale float64) {
		v := values[:p.order]
		if matrix || rhs {
			s := e.solution(p, j)
			f := scale / integerPower(e.stretches[j].length, d)
			if matrix {
				s.bases(d, t, v)
				for k := range v {
					v[k] *= f
				}
			}
			if rhs {
				sys.rhs(row, -f*s.particular(d, t))
			}
		}
		sys.add(row, l.firstCol[j], v)
	}
	shear := func(j int) float64 {
		if p.order == exactBeam.order {
			return e.stretches[j].shear
		}
		return 0
	}
	// motion adds scale·(the motion of dofs[i]) of stretch j at t to the
	// row: y^(i), and for the rotation of a Timoshenko beam its shear terms.
	motion := func(j, i int, t, scale float64) {
		term(j, i, t, scale)
		if g := shear(j); g != 0 && i == 1 {
			term(j, 3, t, scale*g)
			rot, _, _ := e.stretches[j].shearTerms(t)
			sys.rhs(row, -scale*rot)
		}
	}
	// action adds scale·T_i of stretch j at t, in the action unit, to the
	// row.
	action := func(j, i int, t, scale float64) {
		scale /= l.actionUnit
		s := e.solution(p, j)
		term(j, p.order-1-i, t, scale*p.signs[i]*s.stiffness)
		if i == p.offsetAction {
			sys.rhs(row, -scale*s.offset)
		}
		if shear(j) != 0 {
			_, m, v := e.stretches[j].shearTerms(t)
			sys.rhs(row, -scale*p.signs[i]*[2]float64{v, m}[i])
		}
	}
	next := 0 // index into l.held
	for k, kp := range points {
		// The motion at a key point is read from the stretch on its right,
		// or on its left at x = L.
		side, t := k, 0.0
		if k == nStretch {
			side, t = k-1, 1.0
		}
		for i, d := range p.dofs {
			switch {
			case k > 0 && k < nStretch && kp.hinge && d == Rotation:
				// The rotation jumps at a hinge: the moment there is the
				// spring's, M = kᵣ·(θ⁺ − θ⁻), written c·M − (θ⁺ − θ⁻) = 0
				// with c = 1/kᵣ; a pure hinge gives M = 0.
				if kp.release == 0 {
					action(k-1, i, 1, 1)
				} else {
					action(k-1, i, 1, kp.release*l.actionUnit)
					motion(k, i, 0, -1)
					motion(k-1, i, 1, 1)
				}
				row++
			case k > 0 && k < nStretch:
				motion(k, i, 0, 1)
				motion(k-1, i, 1, -1)
				row++
			}
			if k < nStretch {
				action(k, i, 0, 1)
			}
			if k > 0 {
				action(k-1, i, 1, -1)
			}
			sys.rhs(row, -kp.load[d]/l.actionUnit)
			first := next
			for _, r := range kp.restraints {
				if r.dof == d {
					cell[0] = 1
					sys.add(row, l.heldCol[next], cell[:])
					next++
				}
			}
			row++
			// The settlements are this load set's (kp), not the layout's.
			q := first
			for _, r := range kp.restraints {
				if r.dof != d {
					continue
				}
				motion(side, i, t, 1)
				cell[0] = r.compliance * l.actionUnit
				sys.add(row, l.heldCol[q], cell[:])
				sys.rhs(row, r.settlement)
				row++
				q++
			}
		}
	}
	return row
}

// store takes the constants and reactions of problem p from the solution x.
func (e *Exact) store(p odeProblem, l exactLayout, x []float64) {
	for j := range e.stretches {
		e.solution(p, j).setConstants(x[l.firstCol[j] : l.firstCol[j]+p.order])
	}
	for q, r := range l.held {
		if r.support != datum {
			e.reactions[r.support].Force[r.dof] = x[l.heldCol[q]] * l.actionUnit
		}
	}
}

// solution is the closed form of problem p on stretch j.
func (e *Exact) solution(p odeProblem, j int) *stretchSolution {
	if p.order == exactBar.order {
		return &e.stretches[j].bar
	}
	return &e.stretches[j].beam
}

// index returns the position of d among the problem's motions, or −1.
func (p odeProblem) index(d Dof) int {
	for i, pd := range p.dofs {
		if pd == d {
			return i
		}
	}
	return -1
}

// Reactions returns the force each support exerts on the member, in the order
// of Model.Supports, springs included.
func (e *Exact) Reactions() []Reaction {
	if e == nil {
		return nil
	}
	return append([]Reaction(nil), e.reactions...)
}

// At evaluates the exact fields at x. At a point where a field jumps, side
// picks the limit; x is clamped to the member, and at its ends the side
// outside gives the value just inside.
func (e *Exact) At(x float64, side Side) Fields {
	if e == nil || len(e.stretches) == 0 {
		return Fields{X: x}
	}
	j, t := e.locate(x, side)
	var f Fields
	e.stretches[j].fields(t, &f)
	return f
}

// locate finds the stretch and local coordinate t for x seen from side.
func (e *Exact) locate(x float64, side Side) (int, float64) {
	last := len(e.stretches) - 1
	length := e.keys[last+1]
	x = math.Max(0, math.Min(length, x))
	k := e.keyIndex(x)
	if math.Abs(x-e.keys[k]) <= mergeTolerance*length {
		switch {
		case k == 0:
			return 0, 0
		case k == last+1 || side == Left:
			return k - 1, 1
		default:
			return k, 0
		}
	}
	j := min(k, last) // NaN lands past the last key point
	if x < e.keys[k] {
		j = k - 1
	}
	return j, (x - e.stretches[j].start) / e.stretches[j].length
}

// integerPower is x^d for the orders of derivative the equations take
// (0 to 3) by multiplication, the same to the bit as math.Pow there
// (TestIntegerPower) and several times quicker: the exact equations ask
// for it a few times per key point, three times over.
func integerPower(x float64, d int) float64 {
	switch d {
	case 0:
		return 1
	case 1:
		return x
	case 2:
		return x * x
	case 3:
		return x * x * x
	}
	return math.Pow(x, float64(d))
}
