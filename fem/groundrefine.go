package fem

import "math"

// Iterative refinement over a foundation. On a foundation every node of
// the mesh enters the factorized equations (keyNodes), and the bed's
// stiffness k·h of an element is a part in about 4/(β·h)⁴ of its bending
// stiffness 12·EI/h³: eliminating the equations rounds away the bed's
// share of every entry, and the deflection, the rotation and what the
// bed carries come out wrong by up to that many ε (measured: 3e-4 of the
// deflection at β·h = 0.001 on 800 elements), long before the mesh is fine
// enough for the shear force on a soft bed. The cure is Wilkinson's
// iterative refinement with an accurate residual (Higham, Accuracy and
// Stability of Numerical Algorithms, 2nd ed., ch. 12, from memory): solve,
// work out r = f − K·u so that it is right to ε of the forces the elements
// actually carry, solve K·δ = r with the same factorization, and add δ;
// each step shrinks the error by the factorization's own relative error,
// so a few steps bring it to round-off. The residual is accurate because
// each element's forces are formed from its deformation, (w₁ − w₂) and
// h·(θ₁ + θ₂) taken in double-length arithmetic (Dekker's exact sum and
// product), never as differences of the huge terms 12·EI/h³·w of a member
// that rides the bed almost rigidly.

// refinementSteps bounds the steps of refinement; each shrinks the error
// by the factorization's relative error, below 1e-2 wherever the automatic
// mesh goes (foundationBetaStep), so a handful reach round-off.
const refinementSteps = 8

// refinableError is the factorization's relative error, condition·ε, up
// to which refinement converges: each step shrinks the error by about that
// much (measured: the error at a condition of 4e15, ε·condition = 0.9, was
// still brought down to 1e-14 of the deflection).
const refinableError = 0.5

// refinedCondition is what a refined system's condition cond comes to for
// round-off: the unknowns are then right to their last digits, and what is
// left is the rounding of those digits in the element forces formed from
// them, 12·EI/h³·ε·|w|. Against the shear force of a stiff bed, about
// k·|w|/β, that is 3ε/(β·h)³ = 3ε·(cond/4)^¾ (cond ≈ 4/(β·h)⁴, automesh.go);
// a soft bed's condition runs higher for the same β·h, which covers its
// shear force being smaller against k·|w| (measured: 2.5e-6 of the load in
// the equilibrium of a member of β·L = 0.3 on a support, within
// refinedCondition·ε = 3e-5).
func refinedCondition(cond float64) float64 { return 4 * math.Pow(cond/4, 0.75) }

// double is an unevaluated sum hi + lo of two float64, |lo| ≤ ulp(hi)/2
// (Dekker's double-length numbers).
type double struct{ hi, lo float64 }

// twoSum is a + b exactly, as hi + lo (Knuth's TwoSum).
func twoSum(a, b float64) double {
	s := a + b
	bb := s - a
	return double{s, (a - (s - bb)) + (b - bb)}
}

// twoProduct is a·b exactly, as hi + lo (by the fused multiply–add).
func twoProduct(a, b float64) double {
	p := a * b
	return double{p, math.FMA(a, b, -p)}
}

// plus is x + y, to about ε² of the larger.
func (x double) plus(y double) double {
	s := twoSum(x.hi, y.hi)
	s.lo += x.lo + y.lo
	return twoSum(s.hi, s.lo)
}

// times is x·c, to about ε² of it.
func (x double) times(c float64) double {
	p := twoProduct(x.hi, c)
	p.lo += x.lo * c
	return twoSum(p.hi, p.lo)
}

// value is x rounded to float64.
func (x double) value() float64 { return x.hi + x.lo }

// beamForces is K·u of the plain element d (its start rotation not
// condensed), u = (w₁, θ₁, w₂, θ₂): EI/h³·[12, 6h, −12, 6h; …]·u formed as
// 12·(w₁ − w₂) + 6h·(θ₁ + θ₂), 6·(w₁ − w₂) + h·(4θ₁ + 2θ₂) and 6·(w₁ − w₂)
// + h·(2θ₁ + 4θ₂) in double length, and the foundation's part, so that it
// is right to ε of the forces themselves however far the element has
// moved. An element that deforms in shear (never on a foundation) takes
// its matrix as it is.
func (d *elementData) beamForces(u [4]float64) localVector {
	if d.shear != 0 {
		k := d.beamStiffness()
		var out localVector
		for i := range 4 {
			for j := range 4 {
				out[i] += k[i][j] * u[j]
			}
		}
		return out
	}
	h := d.length
	dw := twoSum(u[0], -u[2])
	shear := dw.times(12).plus(twoSum(u[1], u[3]).times(6 * h))
	m1 := dw.times(6).plus(twoSum(4*u[1], 2*u[3]).times(h))
	m2 := dw.times(6).plus(twoSum(2*u[1], 4*u[3]).times(h))
	c := d.flexuralRigidity / (h * h * h)
	v := c * shear.value()
	out := localVector{v, c * h * m1.value(), -v, c * h * m2.value()}
	if d.modulus != 0 {
		g := d.modulus * h / 420
		w1, t1, w2, t2 := u[0], h*u[1], u[2], h*u[3]
		out[0] += g * (156*w1 + 22*t1 + 54*w2 - 13*t2)
		out[1] += g * h * (22*w1 + 4*t1 + 13*w2 - 3*t2)
		out[2] += g * (54*w1 + 13*t1 + 156*w2 - 22*t2)
		out[3] += g * h * (-13*w1 - 3*t1 - 22*w2 + 4*t2)
	}
	return out
}

// barForces is K·u of the linear bar element d, u = (u₁, u₂), with
// u₁ − u₂ taken in double length (as beamForces).
func (d *elementData) barForces(u [2]float64) [2]float64 {
	f := twoSum(u[0], -u[1]).value() * d.axialRigidity / d.length
	g := d.axialModulus * d.length / 6
	return [2]float64{f + g*(2*u[0]+u[1]), -f + g*(u[0]+2*u[1])}
}

// elementForces writes K·u of element d of form to out, u its end
// unknowns, as accurately as beamForces and barForces: an element that
// starts at a hinge turns there by its own rotation (releasedRotation),
// and K·u of its condensed stiffness is the plain element's forces at that
// rotation less its loads, plus its condensed loads, with the spring's
// moment kᵣ·(θ₁ − θᵣ) on the node's rotation (releaseCondensation).
func elementForces(form Formulation, d *elementData, u []float64, out []float64) {
	if bar, ok := form.(barFormulation); ok {
		if bar.order != LinearBar {
			k := form.stiffness(d)
			for i := range u {
				out[i] = 0
				for j := range u {
					out[i] += k[i][j] * u[j]
				}
			}
			return
		}
		f := d.barForces([2]float64{u[0], u[1]})
		copy(out, f[:])
		return
	}
	w := [4]float64{u[0], u[1], u[2], u[3]}
	if !d.released {
		f := d.beamForces(w)
		copy(out, f[:])
		return
	}
	own := d.releasedRotation(w)
	f := d.beamForces([4]float64{w[0], own, w[2], w[3]})
	plain, condensed := d.beamLoads(), form.loads(d)
	for i := range 4 {
		out[i] = f[i] - plain[i] + condensed[i]
	}
	out[1] = d.release*(w[1]-own) + condensed[1]
}

// refine improves u, the solution of the assembly's equations under the
// loads f (the right-hand side without prescribed motions, which u holds
// at the restrained unknowns), by iterative refinement; it stops when a
// step no longer shrinks the correction.
func (as *assembly) refine(els []elementData, f []float64, u []float64) error {
	r := make([]float64, as.n)
	delta := make([]float64, as.n)
	sum := make([]double, as.n)
	var out [4]float64
	last := math.Inf(1)
	for range refinementSteps {
		// r = f − K·u, summed node by node in double length.
		for i := range sum {
			sum[i] = double{hi: f[i]}
		}
		for e := range els {
			first, count := as.form.element(e)
			elementForces(as.form, &els[e], u[first:first+count], out[:count])
			for i := range count {
				sum[first+i] = sum[first+i].plus(double{hi: -out[i]})
			}
		}
		for _, s := range as.springs {
			sum[s.dof] = sum[s.dof].plus(twoProduct(-s.stiffness, u[s.dof]))
		}
		for i := range r {
			r[i] = sum[i].value()
		}
		for _, c := range as.fixed {
			r[c.dof] = 0
		}
		if err := as.ldl.SolveTo(delta, r); err != nil {
			return err
		}
		size, norm := 0.0, 0.0
		for i := range u {
			size = max(size, math.Abs(delta[i]))
			norm = max(norm, math.Abs(u[i]))
		}
		if !(size < last) {
			return nil // no longer converging: round-off reached
		}
		for i := range u {
			u[i] += delta[i]
		}
		if size <= 0x1p-52*norm {
			return nil
		}
		last = size
	}
	return nil
}
