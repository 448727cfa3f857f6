package fem

import "math"

// The beam: 2-node Hermite cubic elements for (EI w″)″ = q, with w the
// deflection and θ = w′ the rotation.

// hermiteBeam is the Euler–Bernoulli beam element with cubic Hermite shape
// functions and, in a segment that deforms in shear, the interdependent
// interpolation element of a Timoshenko beam, which stands in for it;
// shear says in how many of the model's segments.
type hermiteBeam struct{ shear shearExtent }

// shearExtent is how many of a model's segments deform in shear.
type shearExtent uint8

const (
	noShear shearExtent = iota
	someShear
	allShear
)

// Name is the element in the trade's words, after the theory of the
// segments it is in: "Hermite beam", "Timoshenko beam", or both.
func (b hermiteBeam) Name() string {
	return [...]string{"Hermite beam", "Hermite and Timoshenko beam", "Timoshenko beam"}[b.shear]
}

func (hermiteBeam) Problem() string    { return "beam" }
func (hermiteBeam) Motions() []Dof     { return []Dof{Transverse, Rotation} }
func (hermiteBeam) Hierarchical() bool { return true }

// Varies: w is cubic, θ quadratic, M = EI·w″ linear and V = EI·w‴ constant
// in a Hermite element (Hughes, The Finite Element Method, ch. 1, from memory).
func (hermiteBeam) Varies(q Quantity) Variation {
	switch q {
	case QDeflection:
		return Variation{Degree: 3, Nodal: true}
	case QRotation:
		return Variation{Degree: 2, Nodal: true}
	case QBendingMoment, QBendingStress:
		return Variation{Degree: 1}
	case QShearForce:
		return Variation{Degree: 0}
	}
	return Variation{Degree: -1}
}

func (hermiteBeam) size(ne int) (int, int)       { return 2*ne + 2, 3 }
func (hermiteBeam) nodeDof(node, motion int) int { return 2*node + motion }
func (hermiteBeam) element(e int) (int, int)     { return 2 * e, 4 }

// stiffness is the element's, with its own start rotation condensed out
// when it starts at a hinge (releaseCondensation).
func (hermiteBeam) stiffness(d *elementData) localMatrix {
	k := d.beamStiffness()
	if d.released {
		k, _ = releaseCondensation(k, localVector{}, d.release)
	}
	return k
}

func (hermiteBeam) loads(d *elementData) localVector {
	f := d.beamLoads()
	if d.released {
		_, f = releaseCondensation(d.beamStiffness(), f, d.release)
	}
	return f
}

// releaseCondensation condenses the start rotation θᵣ of an element that
// starts at a hinge out of its stiffness k and loads f, over (w₁, θ₁, w₂,
// θ₂): the element turns by θᵣ at its start, tied to the node's rotation θ₁
// by a spring kᵣ (0 for a pure hinge). With a = k₁₁, the element's own
// stiffness against θᵣ, ρ = kᵣ/(a + kᵣ) and σ = 1/(a + kᵣ), eliminating θᵣ
// gives k'ᵢⱼ = kᵢⱼ − kᵢ₁kⱼ₁σ and f'ᵢ = fᵢ − kᵢ₁f₁σ for the other unknowns,
// and ρ·k₁ⱼ, ρ·a and ρ·f₁ for θ₁: written so, a very stiff joint tends to
// the plain element (ρ → 1, σ → 0) without subtracting huge numbers, and a
// pure hinge gives the element pinned at its start (ρ = 0).
func releaseCondensation(k localMatrix, f localVector, kr float64) (localMatrix, localVector) {
	a := k[1][1]
	rho, sigma := kr/(a+kr), 1/(a+kr)
	var kc localMatrix
	var fc localVector
	for i := range 4 {
		for j := range 4 {
			switch {
			case i == 1 && j == 1:
				kc[i][j] = rho * a
			case i == 1:
				kc[i][j] = rho * k[1][j]
			case j == 1:
				kc[i][j] = rho * k[i][1]
			default:
				kc[i][j] = k[i][j] - k[i][1]*k[j][1]*sigma
			}
		}
		if i == 1 {
			fc[i] = rho * f[1]
		} else {
			fc[i] = f[i] - k[i][1]*f[1]*sigma
		}
	}
	return kc, fc
}

// releasedRotation recovers the start rotation θᵣ of an element that
// starts at a hinge from its end displacements u = (w₁, θ₁, w₂, θ₂), θ₁
// being the node's rotation: the element's row for θᵣ in equilibrium.
func (d *elementData) releasedRotation(u [4]float64) float64 {
	a, kr := d.beamStiffness()[1][1], d.release
	// k₁₀·w₁ + k₁₂·w₂ + k₁₃·θ₂ without loss (beamForces).
	r := d.beamLoads()[1] - d.beamForces([4]float64{u[0], 0, u[2], u[3]})[1]
	return r/(a+kr) + kr/(a+kr)*u[1]
}

// hermite returns the cubic Hermite shape functions for (w1, θ1, w2, θ2) at
// ξ ∈ [0, 1] for an element of length h, with their first, second and third
// x-derivatives.
func hermite(xi, h float64) (n, d1, d2, d3 [4]float64) {
	x2 := xi * xi
	n = hermiteValues(xi, h)
	d1 = [4]float64{(6*x2 - 6*xi) / h, 1 - 4*xi + 3*x2, (6*xi - 6*x2) / h, 3*x2 - 2*xi}
	d2 = [4]float64{(12*xi - 6) / (h * h), (6*xi - 4) / h, (6 - 12*xi) / (h * h), (6*xi - 2) / h}
	d3 = [4]float64{12 / (h * h * h), 6 / (h * h), -12 / (h * h * h), 6 / (h * h)}
	return n, d1, d2, d3
}

// hermiteValues is n of hermite alone, free of its divisions: the fields of
// an element need only the values.
func hermiteValues(xi, h float64) [4]float64 {
	x2, x3 := xi*xi, xi*xi*xi
	return [4]float64{1 - 3*x2 + 2*x3, h * (xi - 2*x2 + x3), 3*x2 - 2*x3, h * (x3 - x2)}
}

// beamStiffness is the closed-form beam stiffness for (w1, θ1, w2, θ2), with
// the foundation's under the element (addBeamGround): the
// Hermite element (Hughes, The Finite Element Method; Strang & Fix, ch. 1;
// from memory), or with shear deformation the interdependent
// interpolation element, EI/((1+φ)h³)·[12, 6h, −12, 6h; 6h, (4+φ)h², −6h,
// (2−φ)h²; …] with φ = 12EI/(G·As·h²) (Przemieniecki, Theory of Matrix
// Structural Analysis, from memory), which is exact for the Timoshenko beam
// and does not lock however short the element.
func (d *elementData) beamStiffness() localMatrix {
	h := d.length
	phi := d.phi(h)
	c := d.flexuralRigidity / ((1 + phi) * h * h * h)
	k := localMatrix{
		{12 * c, 6 * h * c, -12 * c, 6 * h * c},
		{6 * h * c, (4 + phi) * h * h * c, -6 * h * c, (2 - phi) * h * h * c},
		{-12 * c, -6 * h * c, 12 * c, -6 * h * c},
		{6 * h * c, (2 - phi) * h * h * c, -6 * h * c, (4 + phi) * h * h * c},
	}
	d.addBeamGround(&k)
	return k
}

// phi is the shear parameter φ = 12·EI/(G·As·h²) of an element of length h
// of this stretch: 0 for an Euler–Bernoulli beam.
func (d *elementData) phi(h float64) float64 { return 12 * d.shear / (h * h) }

// beamShape returns the shape functions of the deflection and of the
// rotation for (w1, θ1, w2, θ2) at ξ ∈ [0, 1] for an element of length h
// with shear parameter φ: the interdependent interpolation element's
// cubic w and quadratic θ, whose difference w′ − θ is the constant shear
// strain (Reddy, An Introduction to the Finite Element Method, from
// memory). With φ = 0 they are the Hermite cubics and their derivatives.
func beamShape(xi, h, phi float64) (w, theta [4]float64) {
	if phi == 0 {
		n, d1, _, _ := hermite(xi, h)
		return n, d1
	}
	mu := 1 / (1 + phi)
	x2, x3 := xi*xi, xi*xi*xi
	w = [4]float64{
		mu * (1 + phi - phi*xi - 3*x2 + 2*x3),
		mu * h * (xi*(1+phi/2) - x2*(2+phi/2) + x3),
		mu * (phi*xi + 3*x2 - 2*x3),
		mu * h * (-xi*phi/2 - x2*(1-phi/2) + x3),
	}
	theta = [4]float64{
		mu * 6 / h * (x2 - xi),
		mu * (1 + phi - (4+phi)*xi + 3*x2),
		-mu * 6 / h * (x2 - xi),
		mu * (3*x2 - (2-phi)*xi),
	}
	return w, theta
}

// beamLoads is the consistent nodal load vector ∫N·q dx, plus N·P + N'·C
// for the point loads inside (the work of a moment C is C·w') and the
// thermal moments of a temperature difference through the depth.
func (d *elementData) beamLoads() localVector {
	f := d.hermiteLoadsOn(d.start, d.start+d.length)
	// The free thermal curvature κ does the work ∫N''·EI·κ dx =
	// EI·κ·(N'(end) − N'(start)): ∓EI·κ on the rotations, nothing on w.
	thermal := d.flexuralRigidity * d.thermalCurvature
	f[1] -= thermal
	f[3] += thermal
	for _, p := range d.points {
		n, rot := beamShape((p.X-d.start)/d.length, d.length, d.phi(d.length))
		for a := range f {
			f[a] += n[a]*p.Transverse + rot[a]*p.Moment
		}
	}
	return f
}

// hermiteLoadsOn is ∫N·q dx over [x0, x1] within d for the deflection's
// shape functions (beamShape) of an element from x0 to x1 under d's line
// load: hermiteLoads for an Euler–Bernoulli element whose load is linear
// there, else the sum over its pieces by the 3-point rule (exact for a cubic
// times a linear load).
func (d *elementData) hermiteLoadsOn(x0, x1 float64) localVector {
	h := x1 - x0
	if x0 == d.start && x1 == d.start+d.length {
		h = d.length // the element itself: its own length, not a difference
	}
	phi := d.phi(h)
	if phi == 0 {
		if pc, ok := d.pieceOver(x0, x1); ok {
			return hermiteLoads(h, pc.at(x0, 1), pc.at(x1, 1))
		}
	}
	var f localVector
	d.pieces(x0, x1, func(pc loadPiece) {
		for _, g := range gauss3 {
			n, _ := beamShape((pc.start+g.xi*pc.length-x0)/h, h, phi)
			q := pc.q0 + (pc.q1-pc.q0)*g.xi
			for a := range f {
				f[a] += g.w * pc.length * n[a] * q
			}
		}
	})
	return f
}

// hermiteLoads is ∫N·q dx for the Hermite shape functions of an element of
// length h under a load going linearly from q0 to q1: the fixed-end forces of
// a trapezoidal load (h(7q0+3q1)/20, h²(3q0+2q1)/60, h(3q0+7q1)/20,
// −h²(2q0+3q1)/60; beam fixed-end force tables, from memory; checked against
// Gauss–Legendre quadrature in TestHermiteLoadsQuadrature).
func hermiteLoads(h, q0, q1 float64) localVector {
	return localVector{
		h * (7*q0 + 3*q1) / 20,
		h * h * (3*q0 + 2*q1) / 60,
		h * (3*q0 + 7*q1) / 20,
		-h * h * (2*q0 + 3*q1) / 60,
	}
}

// elementLength bounds the interpolation error of the Hermite beam (Strang
// & Fix, An Analysis of the Finite Element Method, ch. 1, from memory): V is
// constant on an element, off by about |q|·h/2 from the exact V (slope q);
// M is linear, off by at most |q|·h²/8; w is the cubic Hermite interpolant,
// off by at most |w⁗|·h⁴/384 = |q|·h⁴/(384·EI), and θ by at most
// |q|·h³/(24·EI). The bending stress follows M·c/I; the combined stress
// takes half the tolerance, the bar's error taking the other half. On a
// foundation the load the beam feels is q − k·w, bounded by |q| + k·|w|max.
func (hermiteBeam) elementLength(d *elementData, s *fieldScales, tol float64) float64 {
	q := max(math.Abs(d.transverseLoad[0]), math.Abs(d.transverseLoad[1])) + d.modulus*s[QDeflection]
	ei, section := d.flexuralRigidity, d.fibre/d.secondMoment
	return min(
		sizeLimit(q/2, 1, tol*s[QShearForce]),
		sizeLimit(q/8, 2, tol*s[QBendingMoment]),
		sizeLimit(q*section/8, 2, tol*s[QBendingStress]),
		sizeLimit(q*section/8, 2, tol/2*s[QCombinedStress]),
		sizeLimit(q/(384*ei), 4, tol*s[QDeflection]),
		sizeLimit(q/(24*ei), 3, tol*s[QRotation]))
}
