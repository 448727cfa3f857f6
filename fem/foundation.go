package fem

import (
	"math"
	"math/cmplx"
)

// Elastic (Winkler) foundations. Under a foundation of modulus k the member
// is pushed back by −k·w per unit length, and along it by −kₐ·u, so the
// beam equation becomes EI·w⁗ + k·w = q and the bar's EA·u″ − kₐ·u = −p.
// The finite element side adds the foundation's consistent stiffness,
// ∫k·NᵢNⱼ dx over the element's own shape functions; its nodal values are
// no longer exact, and the foundation couples the hierarchical functions,
// so every node on a foundation is a node of the factorized system
// (keyNodes). The exact side solves the equations in closed form with
// exponential–trigonometric functions (groundBasis).

// FoundationReaction is what one foundation carries: the resultant of the
// forces it exerts on the member.
type FoundationReaction struct {
	Foundation int     // index into Model.Foundations
	Start, End float64 // m
	// Force is the resultant along and across the member, N (positive along
	// +x and up).
	Force [2]float64
	// Moment is the moment of Force[1] about x = 0, N·m counter-clockwise:
	// its line of action is at x = Moment/Force[1].
	Moment float64
}

// Centre is where the resultant across the member acts, m, or the middle
// of the foundation when it carries nothing across.
func (r FoundationReaction) Centre() float64 {
	if r.Force[1] == 0 {
		return 0.5 * (r.Start + r.End)
	}
	return r.Moment / r.Force[1]
}

// groundUnder sets the foundation moduli under each of the elements els.
// Foundation ends are key points, so an element lies wholly on a
// foundation or off it.
func groundUnder(m *Model, els []elementData) {
	if len(m.Foundations) == 0 {
		return
	}
	for i := range els {
		d := &els[i]
		d.modulus, d.axialModulus = m.foundationAt(d.start + 0.5*d.length)
	}
}

// addBeamGround adds the consistent foundation stiffness of the Hermite
// element, k·h/420·[156, 22h, 54, −13h; 22h, 4h², 13h, −3h²; 54, 13h, 156,
// −22h; −13h, −3h², −22h, 4h²] (Przemieniecki, Theory of Matrix Structural
// Analysis, the consistent mass matrix with ρA replaced by k; from memory).
func (d *elementData) addBeamGround(k *localMatrix) {
	if d.modulus == 0 {
		return
	}
	h := d.length
	c := d.modulus * h / 420
	g := localMatrix{
		{156, 22 * h, 54, -13 * h},
		{22 * h, 4 * h * h, 13 * h, -3 * h * h},
		{54, 13 * h, 156, -22 * h},
		{-13 * h, -3 * h * h, -22 * h, 4 * h * h},
	}
	for i := range 4 {
		for j := range 4 {
			k[i][j] += c * g[i][j]
		}
	}
}

// addBarGround adds the linear bar's consistent foundation stiffness
// kₐ·h/6·[2, 1; 1, 2] (as above, from memory). Validate keeps axial
// foundations off quadratic bars.
func (d *elementData) addBarGround(k *localMatrix) {
	if d.axialModulus == 0 {
		return
	}
	c := d.axialModulus * d.length / 6
	k[0][0] += 2 * c
	k[0][1] += c
	k[1][0] += c
	k[1][1] += 2 * c
}

// setGround works out the resultant of the foundation's forces on element
// d from its end displacements a and b (with its own start rotation when it
// starts at a hinge), for the statics of the reactions (change): along the
// member −kₐ·∫u dx, across it −k·∫w dx and that force's moment about the
// element's end, −k·∫(end − x)·w dx, with u linear and w the Hermite
// cubic: ∫Nᵢ dx = (h/2, h²/12, h/2, −h²/12) and ∫(h − x)·Nᵢ dx = (7h²/20,
// h³/20, 3h²/20, −h³/30).
func (d *elementData) setGround(a, b [3]float64) {
	if d.modulus == 0 && d.axialModulus == 0 {
		return
	}
	h := d.length
	start := a[Rotation]
	if d.released {
		start = d.startRotation
	}
	w := [4]float64{a[Transverse], start, b[Transverse], b[Rotation]}
	d.ground[Axial] = -d.axialModulus * h * (a[Axial] + b[Axial]) / 2
	d.ground[Transverse] = -d.modulus * h * ((w[0]+w[2])/2 + h*(w[1]-w[3])/12)
	d.ground[Rotation] = -d.modulus * h * h * (7*w[0]/20 + h*w[1]/20 + 3*w[2]/20 - h*w[3]/30)
}

// foundationReactions shares the foundations' forces on the elements els
// out among the foundations of m, in proportion to their moduli where
// they overlap.
func foundationReactions(m *Model, els []elementData) []FoundationReaction {
	if len(m.Foundations) == 0 {
		return nil
	}
	out := make([]FoundationReaction, len(m.Foundations))
	for i, f := range m.Foundations {
		out[i] = FoundationReaction{Foundation: i, Start: f.Start, End: f.End}
	}
	for j := range els {
		d := &els[j]
		if d.modulus == 0 && d.axialModulus == 0 {
			continue
		}
		end := d.start + d.length
		for i, f := range m.Foundations {
			mid := d.start + 0.5*d.length
			if mid <= f.Start || mid >= f.End {
				continue
			}
			r := &out[i]
			if d.axialModulus > 0 {
				r.Force[0] += d.ground[Axial] * f.AxialModulus / d.axialModulus
			}
			if d.modulus > 0 {
				share := f.Modulus / d.modulus
				r.Force[1] += d.ground[Transverse] * share
				// ∫x·q dx = end·∫q dx − ∫(end − x)·q dx.
				r.Moment += (end*d.ground[Transverse] - d.ground[Rotation]) * share
			}
		}
	}
	return out
}

// groundResultant is the resultant of the foundations' forces in the terms
// of Equilibrium: along x, along y and the moment about x = 0.
func groundResultant(rs []FoundationReaction) [3]float64 {
	var g [3]float64
	for _, r := range rs {
		g[0] += r.Force[0]
		g[1] += r.Force[1]
		g[2] += r.Moment
	}
	return g
}

// groundBasis is the homogeneous part of the closed form on a stretch on a
// foundation, in the stretch's coordinate t ∈ [0, 1] (stretchSolution). In
// t the beam's EI·w⁗ + k·w = q reads w⁗ = c·(w − q/k) with c = −k·h⁴/EI =
// −4λ⁴ (λ = β·h, β = (k/4EI)^¼), and the bar's EA·u″ − kₐ·u = −p reads
// u″ = c·(u − p/kₐ) with c = kₐ·h²/EA = μ² (μ = α·h, α = (kₐ/EA)^½); the
// particular solutions q/k and p/kₐ are linear like the loads.
//
// Two bases span the homogeneous solutions. For a short stretch or a soft
// foundation (scale ≤ groundSeriesLimit) the functions gₖ with gₖ′ = gₖ₋₁
// and g₀′ = c·gₙ₋₁, gₖ(0) = 0 but gₖ⁽ᵏ⁾(0) = 1, summed as their power
// series gₖ(t) = Σᵢ cⁱ·t^(n·i+k)/(n·i+k)!: for the beam the functions of
// Krylov (cosh·cos, …), for the bar cosh μt and sinh μt/μ, which tend to
// 1, t, t²/2, t³/6 as the foundation softens, so a soft foundation loses
// nothing against a polynomial stretch. For a long stretch on a stiff one
// the functions that decay from either end, e^(−λt)·(cos λt, sin λt) and
// e^(λ(t−1))·(cos λ(t−1), sin λ(t−1)) for the beam, e^(−μt) and
// e^(μ(t−1)) for the bar (Hetényi, Beams on Elastic Foundation, 1946, from
// memory): each is at most 1 on the stretch however long it is, where the
// growing exponentials would overflow and swamp the decaying ones.
type groundBasis struct {
	order int     // n: 2 for the bar, 4 for the beam; 0 for a stretch off any foundation
	cycle float64 // c
	scale float64 // μ or λ: how fast the decaying functions decay over the stretch
}

// groundSeriesLimit is the scale up to which the power series serve: their
// terms grow no larger than a few times the sum (at λ = 2 the largest term
// of g₀ is 64/4! against a sum of −1.57), so at most a digit is lost to
// cancellation, and they need a dozen terms at most.
const groundSeriesLimit = 2

// newGroundSolution is the closed form on a stretch of length h on a
// foundation of the given modulus, for the problem of the given order and
// stiffness (EA, EI) under a linear load from l0 to l1 written as
// stiffness·y^(order) ∓ modulus·y = load (−p for the bar, q for the
// beam): its particular solution ∓load/modulus in the coefficients of 1
// and t after the homogeneous ones.
func newGroundSolution(order int, stiffness, h, modulus, l0, l1 float64) stretchSolution {
	sign := 1.0 // the beam: EI·w⁗ + k·w = q
	if order == exactBar.order {
		sign = -1 // the bar: EA·u″ − kₐ·u = −p
	}
	c := make([]float64, order+2)
	c[order], c[order+1] = sign*l0/modulus, sign*(l1-l0)/modulus
	g := groundBasis{order: order, cycle: -sign * math.Pow(h, float64(order)) * modulus / stiffness}
	if order == exactBar.order {
		g.scale = math.Sqrt(g.cycle)
	} else {
		g.scale = math.Sqrt(math.Sqrt(-g.cycle / 4))
	}
	return stretchSolution{stiffness: stiffness, order: order, coeff: c, ground: g, unit: 1}
}

// derivative is the d-th derivative in t of the k-th basis function at t.
func (g *groundBasis) derivative(k, d int, t float64) float64 {
	if g.scale > groundSeriesLimit {
		return g.decaying(k, d, t)[d]
	}
	// gₖ⁽ᵈ⁾ = gₖ₋d, each turn past g₀ bringing a factor c.
	j, f := k-d, 1.0
	for j < 0 {
		j += g.order
		f *= g.cycle
	}
	return f * g.series(j, t)
}

// series sums gⱼ(t) = Σᵢ cⁱ·t^(n·i+j)/(n·i+j)!.
func (g *groundBasis) series(j int, t float64) float64 {
	term := 1.0
	for q := 1; q <= j; q++ {
		term *= t / float64(q)
	}
	sum := term
	for i := 1; i < 40 && term != 0; i++ {
		for q := 1; q <= g.order; q++ {
			term *= t / float64(g.order*(i-1)+j+q)
		}
		term *= g.cycle
		sum += term
		if math.Abs(term) < 1e-18*math.Abs(sum) {
			break
		}
	}
	return sum
}

// decaying is the derivatives of orders 0 to upto (at most 3) of the k-th
// decaying function at t: for the beam Re or Im of z^d·e^(z·s) with z =
// λ(−1 + i), s = t for the first two and z = λ(1 + i), s = t − 1 for the
// last two; for the bar (∓μ)^d·e^(∓μ·s) likewise.
func (g *groundBasis) decaying(k, upto int, t float64) [4]float64 {
	var out [4]float64
	l := g.scale
	if g.order == exactBar.order {
		v, z := math.Exp(l*(t-1)), l
		if k == 0 {
			v, z = math.Exp(-l*t), -l
		}
		for d := 0; d <= upto; d++ {
			out[d] = v
			v *= z
		}
		return out
	}
	z, v := g.wave(k/2, t)
	for d := 0; d <= upto; d++ {
		out[d] = real(v)
		if k%2 == 1 {
			out[d] = imag(v)
		}
		v *= z
	}
	return out
}

// Foundations returns what each foundation carries in the exact solution,
// in the order of Model.Foundations; nil without foundations.
func (e *Exact) Foundations() []FoundationReaction {
	if e == nil || len(e.model.Foundations) == 0 {
		return nil
	}
	m := e.model
	out := make([]FoundationReaction, len(m.Foundations))
	for i, f := range m.Foundations {
		out[i] = FoundationReaction{Foundation: i, Start: f.Start, End: f.End}
	}
	for j := range e.stretches {
		s := &e.stretches[j]
		if s.polynomial() {
			continue
		}
		g, end, mid := s.groundResultant(), s.start+s.length, s.start+0.5*s.length
		k, ka := m.foundationAt(mid)
		for i, f := range m.Foundations {
			if mid <= f.Start || mid >= f.End {
				continue
			}
			r := &out[i]
			if ka > 0 {
				r.Force[0] += g[Axial] * f.AxialModulus / ka
			}
			if k > 0 {
				// ∫x·q dx = end·∫q dx − ∫(end − x)·q dx.
				r.Force[1] += g[Transverse] * f.Modulus / k
				r.Moment += (end*g[Transverse] - g[Rotation]) * f.Modulus / k
			}
		}
	}
	return out
}

// groundResultant is, for the exact solution on a stretch on a foundation,
// what setGround is for an element: the resultant of the foundation's
// forces along and across the stretch and the moment of the latter about
// its end. On a foundation k·w = q − V′ and kₐ·u = p + N′ (V′ = EI·w⁗,
// N′ = EA·u″), so they follow from the loads and the actions at the
// stretch's ends in closed form: −∫kₐ·u dx = −∫p dx − (N(b) − N(a)),
// −∫k·w dx = −∫q dx + V(b) − V(a), and −∫(b − x)·k·w dx = −∫(b − x)·q dx −
// h·V(a) + M(b) − M(a) (by parts, M′ = V).
func (s *exactStretch) groundResultant() [3]float64 {
	var fa, fb Fields
	s.fields(0, &fa)
	s.fields(1, &fb)
	h := s.length
	var g [3]float64
	if !s.bar.polynomial() {
		g[Axial] = -h*(s.axialLoad[0]+s.axialLoad[1])/2 - (fb.AxialForce - fa.AxialForce)
	}
	if !s.beam.polynomial() {
		q0, q1 := s.load[0], s.load[1]
		g[Transverse] = -h*(q0+q1)/2 + fb.ShearForce - fa.ShearForce
		g[Rotation] = -h*h*(2*q0+q1)/6 - h*fa.ShearForce + fb.BendingMoment - fa.BendingMoment
	}
	return g
}

// wave is the beam's pair of decaying functions at t as one complex
// exponential v = e^(z·s), with z = λ(−1 + i) and s = t for the pair
// decaying from the start, z = λ(1 + i) and s = t − 1 for the pair decaying
// from the end: the functions are Re v and Im v, their d-th derivatives
// those of z^d·v.
func (g *groundBasis) wave(pair int, t float64) (z, v complex128) {
	l := g.scale
	z, s := complex(-l, l), t
	if pair == 1 {
		z, s = complex(l, l), t-1
	}
	return z, cmplx.Exp(z * complex(s, 0))
}

// derivatives writes the solution's derivatives in t of orders 0 to upto
// (at most 3) at t to out: what derivative gives, with each basis
// function's exponential or series summed once for all orders.
func (s *stretchSolution) derivatives(t float64, upto int, out *[4]float64) {
	if s.polynomial() {
		for d := 0; d <= upto; d++ {
			out[d] = derivativeAt(s.coeff, d, t)
		}
		return
	}
	for d := 0; d <= upto; d++ {
		out[d] = s.particular(d, t)
	}
	g := &s.ground
	if g.scale > groundSeriesLimit && s.order == exactBeam.order {
		// The beam's functions come in pairs, Re and Im of one exponential.
		for pair := range 2 {
			z, v := g.wave(pair, t)
			cr, ci := s.coeff[2*pair], s.coeff[2*pair+1]
			for d := 0; d <= upto; d++ {
				out[d] += cr*real(v) + ci*imag(v)
				v *= z
			}
		}
		return
	}
	if g.scale > groundSeriesLimit {
		for k := range s.order {
			v := g.decaying(k, upto, t)
			for d := 0; d <= upto; d++ {
				out[d] += s.coeff[k] * v[d]
			}
		}
		return
	}
	var series [4]float64
	for j := range s.order {
		series[j] = g.series(j, t)
	}
	for k := range s.order {
		for d := 0; d <= upto; d++ {
			j, f := k-d, 1.0
			for j < 0 {
				j += s.order
				f *= g.cycle
			}
			out[d] += s.coeff[k] * f * series[j]
		}
	}
}
