package fem_test

// Beams under transverse loads that the basic handbook cases of
// reference_test.go leave out: loads over part of a span, moments at a
// support or inside a fixed span, unequal continuous spans, settlements and
// a stepped member whose sections differ in depth. Each is checked like the
// reference cases (reactions, values at points, extremes, equilibrium, for
// the finite element and the exact solution), and its extremes as
// fem.Summarize reports them, positions included.

import (
	"fmt"
	"math"
	"testing"

	"stave/fem"
)

// reportedExtreme is a largest (or smallest) value of a quantity that the
// summary must report, and where.
type reportedExtreme struct {
	q       fem.Quantity
	largest bool
	want, x float64
}

// beamCase is a handbook case with the extremes its summary must report.
type beamCase struct {
	refCase
	reported []reportedExtreme
}

func beamHandbookCases() []beamCase {
	const (
		EI = refEI
		cI = refC / refI // c/I of the reference section, 1/m³
	)
	transverse := func(x1, q1, x2, q2 float64) fem.DistributedLoad {
		return fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: x1, Intensity: q1}, {X: x2, Intensity: q2}}}
	}
	simple := func(L float64) []fem.Support {
		return []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}
	}
	var cases []beamCase

	{
		// Simple beam, uniform load w over a ≤ x ≤ b: by statics R1 = W(L − x̄)/L,
		// R2 = W·x̄/L with W = w(b − a) and x̄ = (a + b)/2; the largest moment
		// R1(a + R1/(2w)) at x = a + R1/w, where the shear vanishes. AISC Manual,
		// Beam Diagrams and Formulas, simple beam, uniform load partially
		// distributed (from memory).
		const L, a, b, q = 6.0, 1.0, 4.0, -4e3
		w := -q
		r2 := w * (b - a) * (a + b) / 2 / L
		r1 := w*(b-a) - r2
		x0 := a + r1/w
		mMax := r1 * (a + r1/(2*w))
		cases = append(cases, beamCase{
			refCase: refCase{
				name:      "simply supported, uniform load over part of the span",
				model:     fem.Model{Segments: refMember(L), Supports: simple(L), DistributedLoad: []fem.DistributedLoad{transverse(a, q, b, q)}},
				reactions: [][3]float64{{0, r1, 0}, {0, r2, 0}},
				points: []pointCheck{
					{x: a / 2, q: shearForce, want: r1},
					{x: a, q: bendingMoment, want: r1 * a},
					{x: 5, q: shearForce, want: -r2},
					{x: 5, q: bendingMoment, want: r2 * (L - 5)},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mMax, x: x0, stationary: true},
					{q: bendingStress, want: mMax * cI, x: x0},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, mMax, x0},
				{fem.QShearForce, true, r1, 0},
				{fem.QShearForce, false, -r2, b},
			},
		})
	}
	{
		// Simple beam, load rising linearly from q1 at a to q2 at b: W and its
		// centroid x̄ = a + (b − a)(q1 + 2q2)/(3(q1 + q2)) give the reactions by
		// statics; with s = x − a and k = (q2 − q1)/(b − a) the shear
		// R1 + q1·s + k·s²/2 vanishes at the root s0 = (−q1 − √(q1² − 2k·R1))/k
		// of that quadratic, and M = R1(a + s0) + q1·s0²/2 + k·s0³/6 there
		// (statics of the part left of the section; Roark's Formulas for Stress
		// and Strain, Table 8.1, case 2e, from memory).
		const L, a, b, q1, q2 = 6.0, 1.5, 4.5, -2e3, -8e3
		W := -(q1 + q2) / 2 * (b - a)
		xBar := a + (b-a)*(q1+2*q2)/(3*(q1+q2))
		r2 := W * xBar / L
		r1 := W - r2
		k := (q2 - q1) / (b - a)
		s0 := (-q1 - math.Sqrt(q1*q1-2*k*r1)) / k
		mMax := r1*(a+s0) + q1*s0*s0/2 + k*s0*s0*s0/6
		cases = append(cases, beamCase{
			refCase: refCase{
				name:      "simply supported, trapezoidal load over part of the span",
				model:     fem.Model{Segments: refMember(L), Supports: simple(L), DistributedLoad: []fem.DistributedLoad{transverse(a, q1, b, q2)}},
				reactions: [][3]float64{{0, r1, 0}, {0, r2, 0}},
				points: []pointCheck{
					{x: a, q: bendingMoment, want: r1 * a},
					{x: a + s0, q: shearForce, want: 0},
					{x: 5, q: shearForce, want: -r2},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mMax, x: a + s0, stationary: true},
					{q: bendingStress, want: mMax * cI, x: a + s0},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, mMax, a + s0},
				{fem.QBendingStress, true, mMax * cI, a + s0},
				{fem.QShearForce, false, -r2, b},
			},
		})
	}
	{
		// Simple beam, counter-clockwise moment M0 at the left support:
		// M = −M0(1 − x/L), end slopes M0·L/(3EI) and −M0·L/(6EI), the largest
		// deflection M0·L²/(9√3·EI) at L(1 − 1/√3) from the loaded end. AISC
		// Manual, Beam Diagrams and Formulas, simple beam, moment at one end
		// (from memory).
		const L, M0 = 6.0, 15e3
		xw := L * (1 - 1/math.Sqrt(3))
		wMax := M0 * L * L / (9 * math.Sqrt(3) * EI)
		cases = append(cases, beamCase{
			refCase: refCase{
				name:      "simply supported, moment at a support",
				model:     fem.Model{Segments: refMember(L), Supports: simple(L), PointLoads: []fem.PointLoad{{X: 0, Moment: M0}}},
				reactions: [][3]float64{{0, M0 / L, 0}, {0, -M0 / L, 0}},
				// U = ½·M0·θ(0) (Clapeyron's theorem, from memory).
				energy: M0 * M0 * L / (6 * EI),
				points: []pointCheck{
					{x: 0, q: rotation, want: M0 * L / (3 * EI)},
					{x: L, q: rotation, want: -M0 * L / (6 * EI)},
					{x: L / 2, q: bendingMoment, want: -M0 / 2},
					{x: L / 2, q: shearForce, want: M0 / L},
				},
				extremes: []extremeCheck{
					{q: deflection, want: wMax, x: xw, stationary: true},
					{q: bendingMoment, want: -M0, x: 0, side: fem.Right},
				},
			},
			reported: []reportedExtreme{
				{fem.QDeflection, true, wMax, xw},
				{fem.QBendingMoment, false, -M0, 0},
				{fem.QRotation, true, M0 * L / (3 * EI), 0},
			},
		})
	}
	{
		// Fixed at one end, simply supported at the other, load P at a from the
		// simple support (b = L − a): R1 = P·b²(a + 2L)/(2L³) at the simple
		// support, M = P·a·b(a + L)/(2L²) at the fixed end, deflection under
		// the load P·a²·b³(3L + a)/(12EI·L³). AISC Manual, Beam Diagrams and
		// Formulas, beam fixed at one end, supported at the other, concentrated
		// load at any point (from memory).
		const L, a, b, P = 6.0, 2.0, 4.0, -12e3
		r1 := -P * b * b * (a + 2*L) / (2 * L * L * L)
		mFixed := P * a * b * (a + L) / (2 * L * L)
		wLoad := P * a * a * b * b * b * (3*L + a) / (12 * EI * L * L * L)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "propped cantilever, point load off centre",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Roller}, {X: L, Kind: fem.Fixed}},
					PointLoads: []fem.PointLoad{{X: a, Transverse: P}}},
				reactions: [][3]float64{{0, r1, 0}, {0, -P - r1, mFixed}},
				// U = ½·P·w(a) (Clapeyron's theorem, from memory).
				energy: P * wLoad / 2,
				points: []pointCheck{
					{x: a, q: deflection, want: wLoad},
					{x: a, q: bendingMoment, want: r1 * a},
					{x: 1, q: shearForce, want: r1},
					{x: 5, q: shearForce, want: r1 + P},
					{x: L, q: bendingMoment, want: mFixed},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: r1 * a, x: a},
					{q: bendingStress, want: r1 * a * cI, x: a},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, r1 * a, a},
				{fem.QBendingMoment, false, mFixed, L},
				{fem.QShearForce, false, r1 + P, a},
			},
		})
	}
	{
		// Fixed at both ends, counter-clockwise moment M0 at a (b = L − a):
		// R = 6M0·a·b/L³ up at the left end, sagging moments −M0·b(2a − b)/L²
		// at the left end and M0·a(2b − a)/L² at the right end, the moment
		// jumping by −M0 at the load, deflection there M0·a²·b²(b − a)/(2EI·L³).
		// Roark's Formulas for Stress and Strain, Table 8.1, case 3d (from memory).
		const L, a, b, M0 = 6.0, 1.5, 4.5, 10e3
		r := 6 * M0 * a * b / (L * L * L)
		mLeft := -M0 * b * (2*a - b) / (L * L)
		mRight := M0 * a * (2*b - a) / (L * L)
		wLoad := M0 * a * a * b * b * (b - a) / (2 * EI * L * L * L)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "fixed at both ends, moment inside the span",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
					PointLoads: []fem.PointLoad{{X: a, Moment: M0}}},
				reactions: [][3]float64{{0, r, -mLeft}, {0, -r, mRight}},
				points: []pointCheck{
					{x: a, q: deflection, want: wLoad},
					{x: a, side: fem.Left, q: bendingMoment, want: mLeft + r*a},
					{x: a, side: fem.Right, q: bendingMoment, want: mLeft + r*a - M0},
					{x: L / 2, q: shearForce, want: r},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mLeft + r*a - M0, x: a, side: fem.Right},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, mLeft + r*a, a},
				{fem.QBendingMoment, false, mLeft + r*a - M0, a},
			},
		})
	}
	{
		// Two unequal spans l1, l2 under one uniform load q: the three-moment
		// equation (Clapeyron) with zero end moments gives the moment over
		// the middle support q(l1³ + l2³)/(8(l1 + l2)) (hogging for q down);
		// the reactions follow by statics of each span, and each span's
		// largest sagging moment R²/(2|q|) lies R/|q| from its end support.
		// Three-moment equation, from memory.
		const l1, l2, q = 4.0, 6.0, -5e3
		mB := q * (l1*l1*l1 + l2*l2*l2) / (8 * (l1 + l2))
		rA := -q*l1/2 + mB/l1
		rC := -q*l2/2 + mB/l2
		rB := -q*(l1+l2) - rA - rC
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "two unequal spans, uniform load",
				model: fem.Model{Segments: refMember(l1 + l2),
					Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: l1, Kind: fem.Roller}, {X: l1 + l2, Kind: fem.Roller}},
					DistributedLoad: []fem.DistributedLoad{transverse(0, q, l1+l2, q)}},
				reactions: [][3]float64{{0, rA, 0}, {0, rB, 0}, {0, rC, 0}},
				points: []pointCheck{
					{x: l1, q: bendingMoment, want: mB},
					{x: l1, side: fem.Left, q: shearForce, want: rA + q*l1},
					{x: l1, side: fem.Right, q: shearForce, want: rA + q*l1 + rB},
					{x: rA / -q, q: bendingMoment, want: rA * rA / (-2 * q)},
					{x: l1 + l2 - rC/-q, q: shearForce, want: 0},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mB, x: l1},
					{q: shearForce, want: rA + q*l1 + rB, x: l1, side: fem.Right},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, false, mB, l1},
				{fem.QBendingMoment, true, rC * rC / (-2 * q), l1 + l2 - rC/-q},
				{fem.QShearForce, true, rA + q*l1 + rB, l1},
			},
		})
	}
	{
		// Three unequal spans, load P in the middle one at aB from support B
		// (bC = l2 − aB from C): the three-moment equation (Clapeyron) at B and
		// at C, with the right-hand sides P·x(l2² − x²)/l2 of a point load (x
		// measured from the far support of the span), gives
		//   2(l1 + l2)·MB + l2·MC = −|P|·bC(l2² − bC²)/l2
		//   l2·MB + 2(l2 + l3)·MC = −|P|·aB(l2² − aB²)/l2,
		// solved here by Cramer's rule; the reactions follow from the shear on
		// each side of each support. Three-moment equation, from memory.
		const l1, l2, l3, aB, P = 4.0, 6.0, 5.0, 2.5, -20e3
		bC := l2 - aB
		rhsB := P * bC * (l2*l2 - bC*bC) / l2
		rhsC := P * aB * (l2*l2 - aB*aB) / l2
		a11, a12, a22 := 2*(l1+l2), l2, 2*(l2+l3)
		det := a11*a22 - a12*a12
		mB := (rhsB*a22 - a12*rhsC) / det
		mC := (a11*rhsC - a12*rhsB) / det
		vB := (mC-mB)/l2 - P*bC/l2 // shear just right of B
		vC := vB + P               // shear just left of C
		rA, rD := mB/l1, mC/l3
		rB := vB - rA
		rC := -mC/l3 - vC
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "three unequal spans, point load in the middle span",
				model: fem.Model{Segments: refMember(l1 + l2 + l3),
					Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: l1, Kind: fem.Roller},
						{X: l1 + l2, Kind: fem.Roller}, {X: l1 + l2 + l3, Kind: fem.Roller}},
					PointLoads: []fem.PointLoad{{X: l1 + aB, Transverse: P}}},
				reactions: [][3]float64{{0, rA, 0}, {0, rB, 0}, {0, rC, 0}, {0, rD, 0}},
				points: []pointCheck{
					{x: l1, q: bendingMoment, want: mB},
					{x: l1 + l2, q: bendingMoment, want: mC},
					{x: l1 + aB, q: bendingMoment, want: mB + vB*aB},
					{x: l1 / 2, q: shearForce, want: rA},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mB + vB*aB, x: l1 + aB},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, mB + vB*aB, l1 + aB},
				{fem.QBendingMoment, false, mB, l1},
			},
		})
	}
	{
		// Beam overhanging one support, load P at the end of the overhang a
		// beyond a span L: R1 = P·a/L at the far support, R2 = −P(L + a)/L,
		// M = P·a over the support, tip deflection P·a²(L + a)/(3EI), and the
		// span bows up by −P·a·L²/(9√3·EI) at L/√3. AISC Manual, Beam Diagrams
		// and Formulas, beam overhanging one support, concentrated load at end
		// of overhang (from memory).
		const L, a, P = 5.0, 1.5, -3e3
		tip := P * a * a * (L + a) / (3 * EI)
		up := -P * a * L * L / (9 * math.Sqrt(3) * EI)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "overhang, load at its end",
				model: fem.Model{Segments: refMember(L + a), Supports: simple(L),
					PointLoads: []fem.PointLoad{{X: L + a, Transverse: P}}},
				reactions: [][3]float64{{0, P * a / L, 0}, {0, -P * (L + a) / L, 0}},
				// U = ½·P·w(L + a) (Clapeyron's theorem, from memory).
				energy: P * tip / 2,
				points: []pointCheck{
					{x: L + a, q: deflection, want: tip},
					{x: L / math.Sqrt(3), q: deflection, want: up},
					{x: L, q: bendingMoment, want: P * a},
				},
				extremes: []extremeCheck{
					{q: deflection, want: tip, x: L + a},
					{q: bendingMoment, want: P * a, x: L},
				},
			},
			reported: []reportedExtreme{
				{fem.QDeflection, false, tip, L + a},
				{fem.QDeflection, true, up, L / math.Sqrt(3)},
				{fem.QBendingMoment, false, P * a, L},
			},
		})
	}
	{
		// Fixed at both ends, the right end settles by Δ: w = Δ(3ξ² − 2ξ³),
		// end moments ∓6EI·Δ/L², shear −12EI·Δ/L³; and the left end turned by
		// θ: w = θ·L·ξ(1 − ξ)², moments −4EI·θ/L and 2EI·θ/L, shear 6EI·θ/L².
		// Slope-deflection equations (from memory).
		const L, delta, theta = 6.0, -0.01, 0.002
		m6, v12 := 6*EI*delta/(L*L), 12*EI*delta/(L*L*L)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "fixed at both ends, one end settles",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed},
					{X: L, Kind: fem.Fixed, Settlement: [3]float64{0, delta, 0}}}},
				reactions: [][3]float64{{0, -v12, -m6}, {0, v12, -m6}},
				// U = ½·R·Δ of the settling support (Clapeyron's theorem, from memory).
				energy: v12 * delta / 2,
				points: []pointCheck{
					{x: L / 2, q: deflection, want: delta / 2},
					{x: L / 2, q: rotation, want: 1.5 * delta / L},
					{x: 0, q: bendingMoment, want: m6},
					{x: L, q: bendingMoment, want: -m6},
					{x: L / 3, q: shearForce, want: -v12},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: m6, x: 0},
					{q: rotation, want: 1.5 * delta / L, x: L / 2},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, false, m6, 0},
				{fem.QBendingMoment, true, -m6, L},
				{fem.QRotation, false, 1.5 * delta / L, L / 2},
			},
		}, beamCase{
			refCase: refCase{
				name: "fixed at both ends, one end turned",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{
					{X: 0, Kind: fem.Fixed, Settlement: [3]float64{0, 0, theta}}, {X: L, Kind: fem.Fixed}}},
				reactions: [][3]float64{{0, 6 * EI * theta / (L * L), 4 * EI * theta / L}, {0, -6 * EI * theta / (L * L), 2 * EI * theta / L}},
				// U = ½·Mθ at the turned end (Clapeyron's theorem, from memory).
				energy: 2 * EI * theta * theta / L,
				points: []pointCheck{
					{x: L / 2, q: deflection, want: theta * L / 8},
					{x: 0, q: bendingMoment, want: -4 * EI * theta / L},
					{x: L, q: bendingMoment, want: 2 * EI * theta / L},
					{x: L / 2, q: shearForce, want: 6 * EI * theta / (L * L)},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: -4 * EI * theta / L, x: 0},
					{q: deflection, want: theta * 4 * L / 27, x: L / 3, stationary: true},
				},
			},
			reported: []reportedExtreme{
				{fem.QDeflection, true, theta * 4 * L / 27, L / 3},
				{fem.QBendingMoment, false, -4 * EI * theta / L, 0},
			},
		})
	}
	for _, reach := range []float64{6, 3} {
		// Cantilever of length L, load rising uniformly from nothing at
		// x = reach to w at the fixed end: W = w·reach/2, M(0) = −W·reach/3,
		// deflection W·reach³/(15EI) and rotation W·reach²/(12EI) at x = reach
		// (AISC Manual, Beam Diagrams and Formulas, cantilever beam, load
		// increasing uniformly to fixed end; rotation by integrating M/EI, Gere
		// & Goodno, Mechanics of Materials, ch. 9; from memory), the member
		// straight beyond. M, V and q vanish together at x = reach, so the
		// rotation is flat there to the fourth order: its extreme is named at
		// x = reach (the first place it is reached), not a hair inside where a
		// root of M found to round-off ties with it.
		const L, q = 6.0, -7e3
		W := q * reach / 2
		theta := W * reach * reach / (12 * EI)
		tip := W*reach*reach*reach/(15*EI) + theta*(L-reach)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: fmt.Sprintf("cantilever, load rising to the fixed end from x = %g m", reach),
				model: fem.Model{Segments: refMember(L),
					Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}},
					DistributedLoad: []fem.DistributedLoad{transverse(0, q, reach, 0)}},
				reactions: [][3]float64{{0, -W, -W * reach / 3}},
				points: []pointCheck{
					{x: L, q: deflection, want: tip},
					{x: L, q: rotation, want: theta},
					{x: 0, q: bendingMoment, want: W * reach / 3},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: W * reach / 3, x: 0},
				},
			},
			reported: []reportedExtreme{
				{fem.QRotation, false, theta, reach},
				{fem.QDeflection, false, tip, L},
			},
		})
	}
	{
		// Cantilever of two parts of different depth (I1, c1 from the support to
		// a, I2, c2 beyond), load P at the end: M = P(L − x), tip deflection
		// (P/3E)[(L³ − b³)/I1 + b³/I2] with b = L − a (unit-load method, Gere &
		// Goodno, Mechanics of Materials, ch. 9, from memory); bending stress
		// M·c/I with each part's own section, so the largest is just past the
		// step, P·b·c2/I2, not at the support, P·L·c1/I1.
		const L, a, P = 5.0, 2.0, -4e3
		const I1, c1, I2, c2 = 2e-5, 0.15, 5e-6, 0.08
		b := L - a
		tip := P / (3 * refE) * ((L*L*L-b*b*b)/I1 + b*b*b/I2)
		deep := fem.Section{Area: 6e-3, SecondMoment: I1, FibreDistance: c1}
		shallow := fem.Section{Area: 3e-3, SecondMoment: I2, FibreDistance: c2}
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "stepped cantilever of two depths, end load",
				model: fem.Model{Segments: []fem.Segment{
					{Start: 0, End: a, Section: deep, Material: refSteel},
					{Start: a, End: L, Section: shallow, Material: refSteel}},
					Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}},
					PointLoads: []fem.PointLoad{{X: L, Transverse: P}}},
				reactions: [][3]float64{{0, -P, -P * L}},
				// U = ½·P·w(L) (Clapeyron's theorem, from memory).
				energy: P * tip / 2,
				points: []pointCheck{
					{x: L, q: deflection, want: tip},
					{x: 0, q: bendingStress, want: P * L * c1 / I1},
					{x: a, side: fem.Left, q: bendingStress, want: P * b * c1 / I1},
					{x: a, side: fem.Right, q: bendingStress, want: P * b * c2 / I2},
				},
				extremes: []extremeCheck{
					{q: bendingStress, want: P * b * c2 / I2, x: a, side: fem.Right},
					{q: bendingMoment, want: P * L, x: 0},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingStress, false, P * b * c2 / I2, a},
				{fem.QBendingMoment, false, P * L, 0},
				{fem.QDeflection, false, tip, L},
			},
		})
	}
	return cases
}

// allBeamCases are the cases of this file and those of varied_loads_test.go.
func allBeamCases() []beamCase { return append(beamHandbookCases(), variedLoadCases()...) }

func TestBeamHandbookFiniteElement(t *testing.T) {
	for _, c := range allBeamCases() {
		t.Run(c.name, func(t *testing.T) { checkFiniteElementCase(t, c.refCase, fem.LinearBar) })
	}
}

func TestBeamHandbookExact(t *testing.T) {
	for _, c := range allBeamCases() {
		t.Run(c.name, func(t *testing.T) { checkExactCase(t, c.refCase) })
	}
}

// TestBeamHandbookSummary checks the extremes fem.Summarize reports: the
// headline (exact) value and its position to round-off on any mesh, and on
// the default mesh the finite element value within the accuracy it promises.
func TestBeamHandbookSummary(t *testing.T) {
	for _, c := range allBeamCases() {
		for _, elements := range []int{0, 3} {
			m := c.model
			m.Mesh = fem.MeshSettings{Elements: elements}
			sol, err := fem.Solve(&m)
			if err != nil {
				t.Fatalf("%s: Solve: %v", c.name, err)
			}
			ex, err := fem.SolveExact(&m)
			if err != nil {
				t.Fatalf("%s: SolveExact: %v", c.name, err)
			}
			sum := fem.Summarize(sol, ex)
			L := m.Length()
			for _, r := range c.reported {
				e, ok := extremeOf(sum, r.q)
				if !ok {
					t.Errorf("%s: no extreme of %v", c.name, r.q)
					continue
				}
				value, x, fe := e.Min, e.XMin, e.FEMin
				if r.largest {
					value, x, fe = e.Max, e.XMax, e.FEMax
				}
				scale := math.Max(math.Abs(e.Max), math.Abs(e.Min))
				if !(math.Abs(value-r.want) <= roundOff*scale) || !(math.Abs(x-r.x) <= roundOff*L) {
					t.Errorf("%s, %d elements: %v (largest %v) reported %.10g at x = %.10g m, book %.10g at %.10g m",
						c.name, elements, r.q, r.largest, value, x, r.want, r.x)
				}
				if elements == 0 && !(math.Abs(fe-value) <= fem.MeshAccuracy*scale) {
					t.Errorf("%s, default mesh: %v finite element %.10g, exact %.10g: beyond the default mesh's accuracy %g",
						c.name, r.q, fe, value, fem.MeshAccuracy)
				}
			}
		}
	}
}

// extremeOf is the summary's extreme of quantity q.
func extremeOf(s fem.Summary, q fem.Quantity) (fem.Extreme, bool) {
	for _, e := range s.Extremes {
		if e.Quantity == q {
			return e, true
		}
	}
	return fem.Extreme{}, false
}

// An extreme at a key point (a support, the end of the member) is reported
// at that point to the bit, not at start + length of the interval before it,
// which can miss it by a unit in the last place (0.95 + (3.9 − 0.95) =
// 3.9000000000000004): read there, the field must give the reported value,
// not that of the far side of a jump. The values themselves are statics:
// P·a at the support of a cantilever.
func TestExtremeAtKeyPointNamesIt(t *testing.T) {
	const P = -10e3
	cases := []struct {
		name     string
		model    fem.Model
		q        fem.Quantity // its smallest value is checked
		x, value float64
	}{
		{"cantilever fixed at its right end x = 3.9 m, load at 0.95 m", fem.Model{Segments: refMember(3.9),
			Supports: []fem.Support{{X: 3.9, Kind: fem.Fixed}}, PointLoads: []fem.PointLoad{{X: 0.95, Transverse: P}}},
			fem.QBendingMoment, 3.9, P * (3.9 - 0.95)},
		{"cantilever past a fixed support at x = 3.9 m, load at its end", fem.Model{Segments: refMember(6),
			Supports:   []fem.Support{{X: 0.95, Kind: fem.Pinned}, {X: 3.9, Kind: fem.Fixed}},
			PointLoads: []fem.PointLoad{{X: 6, Transverse: P}}},
			fem.QBendingMoment, 3.9, P * (6 - 3.9)},
	}
	for _, c := range cases {
		for _, elements := range []int{0, 1} {
			m := c.model
			m.Mesh = fem.MeshSettings{Elements: elements}
			sol, err := fem.Solve(&m)
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			ex, err := fem.SolveExact(&m)
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			e, _ := extremeOf(fem.Summarize(sol, ex), c.q)
			for _, r := range []struct {
				solution string
				field    fem.Field
				value, x float64
			}{{"exact", ex, e.Min, e.XMin}, {"finite element", sol, e.FEMin, e.FEXMin}} {
				atLeft, atRight := r.field.At(r.x, fem.Left), r.field.At(r.x, fem.Right)
				left, right := c.q.Of(&atLeft), c.q.Of(&atRight)
				tol := roundOff * math.Abs(c.value)
				if r.x != c.x || !(math.Abs(r.value-c.value) <= tol) || !(math.Abs(left-r.value) <= tol || math.Abs(right-r.value) <= tol) {
					t.Errorf("%s, %d elements, %s: %v %.10g reported at x = %v m (read there: %.10g left, %.10g right); want %.10g at x = %v m",
						c.name, elements, r.solution, c.q, r.value, r.x, left, right, c.value, c.x)
				}
			}
		}
	}
}
