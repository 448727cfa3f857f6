package fem_test

// Members under loads that vary along them and under couples, beside the
// cases of beam_handbook_test.go and checked as those are (reactions, values
// at points, extremes, and the extremes fem.Summarize reports with their
// places, on the default mesh within the accuracy it promises): a
// fixed-ended beam under a triangular load and under a uniform load over
// part of the span, a propped cantilever turned at its simple support, a bar
// held at both ends under an axial load rising along it, a column under its
// own weight and a load at its top, and a pile carried by skin friction
// rising with depth and a spring under its base.

import (
	"math"

	"stave/fem"
)

func variedLoadCases() []beamCase {
	const EI, EA = refEI, refEA
	var cases []beamCase
	{
		// Fixed at both ends, load rising linearly from 0 at x = 0 to q0 at
		// x = L: R1 = −3q0·L/20, R2 = −7q0·L/20, end moments q0·L²/30 and
		// q0·L²/20 (hogging for q0 down), w = q0·x²(L − x)²(2L + x)/(120EI·L),
		// q0·L⁴/(768EI) at midspan and largest at x = L(√105 − 5)/10 ≈ 0.525L,
		// where d/dx of x²(L − x)²(2L + x) vanishes; the shear vanishes at
		// x = L√(3/10), where the sagging moment is largest. Roark's Formulas
		// for Stress and Strain, Table 8.1, case 2e with the load over the
		// whole span (from memory); the deflection by integrating EI·w'''' = q
		// with w = w' = 0 at both ends.
		const L, q0 = 6.0, -6e3
		r1, r2 := -3*q0*L/20, -7*q0*L/20
		mA, mB := q0*L*L/30, q0*L*L/20
		w := func(x float64) float64 { return q0 * x * x * (L - x) * (L - x) * (2*L + x) / (120 * EI * L) }
		xw := L * (math.Sqrt(105) - 5) / 10
		x0 := L * math.Sqrt(0.3)
		mMax := mA + r1*x0 + q0*x0*x0*x0/(6*L)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "fixed at both ends, load rising along the span",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
					DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0}, {X: L, Intensity: q0}}}}},
				reactions: [][3]float64{{0, r1, -mA}, {0, r2, mB}},
				// U = ½∫q·w dx = q0²·L⁵/(5600EI) (Clapeyron's theorem, the
				// integral of the deflection above).
				energy: q0 * q0 * L * L * L * L * L / (5600 * EI),
				points: []pointCheck{
					{x: L / 2, q: deflection, want: q0 * L * L * L * L / (768 * EI)},
					{x: xw, q: deflection, want: w(xw)},
					{x: x0, q: shearForce, want: 0},
					{x: L, q: bendingMoment, want: mB},
				},
				extremes: []extremeCheck{
					{q: deflection, want: w(xw), x: xw, stationary: true},
					{q: bendingMoment, want: mB, x: L},
				},
			},
			reported: []reportedExtreme{
				{fem.QDeflection, false, w(xw), xw},
				{fem.QBendingMoment, true, mMax, x0},
				{fem.QBendingMoment, false, mB, L},
				{fem.QShearForce, true, r1, 0},
				{fem.QShearForce, false, -r2, L},
			},
		})
	}
	{
		// Fixed at both ends, uniform load q from a to b: the fixed-end
		// moments of a load P at s, P·s·(L − s)²/L² and P·s²·(L − s)/L²
		// (Roark's Formulas for Stress and Strain, Table 8.1, case 1d, from
		// memory), integrated over the loaded length; the reactions by
		// statics, the largest sagging moment where the shear vanishes.
		const L, a, b, q = 6.0, 1.0, 3.5, -8e3
		over := func(f func(s float64) float64) float64 { return f(b) - f(a) }
		mA := q / (L * L) * over(func(s float64) float64 { return L*L*s*s/2 - 2*L*s*s*s/3 + s*s*s*s/4 })
		mB := q / (L * L) * over(func(s float64) float64 { return L*s*s*s/3 - s*s*s*s/4 })
		r1 := (mB - mA - q*over(func(s float64) float64 { return L*s - s*s/2 })) / L
		r2 := -q*(b-a) - r1
		x0 := a - r1/q
		mMax := mA + r1*x0 + q*(x0-a)*(x0-a)/2
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "fixed at both ends, uniform load over part of the span",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
					DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, a, b, q)}},
				reactions: [][3]float64{{0, r1, -mA}, {0, r2, mB}},
				points: []pointCheck{
					{x: a, q: bendingMoment, want: mA + r1*a},
					{x: x0, q: shearForce, want: 0},
					{x: 5, q: shearForce, want: -r2},
					{x: L, q: bendingMoment, want: mB},
				},
				extremes: []extremeCheck{
					{q: bendingMoment, want: mA, x: 0},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, mMax, x0},
				{fem.QBendingMoment, false, mA, 0},
				{fem.QShearForce, true, r1, 0},
			},
		})
	}
	{
		// Fixed at x = 0, simply supported at L, counter-clockwise couple M0
		// at the simple support: R = 3M0/(2L) up at the fixed end, M0/2
		// carried over to it (M = −M0/2 + 3M0·x/(2L)), w = M0·x²(x − L)/(4EI·L),
		// largest M0·L²/(27EI) at x = 2L/3, slope M0·L/(4EI) under the couple.
		// Roark's Formulas for Stress and Strain, Table 8.1, case 3c with the
		// couple at the supported end (from memory).
		const L, M0 = 6.0, 12e3
		wMin := -M0 * L * L / (27 * EI)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "propped cantilever, moment at the simple support",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}},
					PointLoads: []fem.PointLoad{{X: L, Moment: M0}}},
				reactions: [][3]float64{{0, 3 * M0 / (2 * L), M0 / 2}, {0, -3 * M0 / (2 * L), 0}},
				// U = ½·M0·θ(L) (Clapeyron's theorem, from memory).
				energy: M0 * M0 * L / (8 * EI),
				points: []pointCheck{
					{x: L, q: rotation, want: M0 * L / (4 * EI)},
					{x: 2 * L / 3, q: deflection, want: wMin},
					{x: L / 3, q: bendingMoment, want: 0},
				},
				extremes: []extremeCheck{
					{q: deflection, want: wMin, x: 2 * L / 3, stationary: true},
					{q: bendingMoment, want: M0, x: L},
				},
			},
			reported: []reportedExtreme{
				{fem.QBendingMoment, true, M0, L},
				{fem.QBendingMoment, false, -M0 / 2, 0},
				{fem.QDeflection, false, wMin, 2 * L / 3},
				{fem.QRotation, true, M0 * L / (4 * EI), L},
				{fem.QShearForce, true, 3 * M0 / (2 * L), 0},
			},
		})
	}
	{
		// Bar held at both ends under an axial load rising from 0 to p0 along
		// it, p = p0·x/L: integrating N' = −p with u(0) = u(L) = 0 gives
		// u = p0(L²x − x³)/(6L·EA), N = p0·L/6 − p0·x²/(2L), the largest
		// displacement p0·L²/(9√3·EA) at x = L/√3 and the ends' reactions
		// −p0·L/6 and −p0·L/3 (Gere & Goodno, Mechanics of Materials, ch. 2,
		// statically indeterminate bars, the method from memory).
		const L, p0 = 5.0, 8e3
		xu := L / math.Sqrt(3)
		uMax := p0 * L * L / (9 * math.Sqrt(3) * EA)
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "bar fixed at both ends, axial load rising along it",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
					DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0}, {X: L, Intensity: p0}}}}},
				reactions: [][3]float64{{-p0 * L / 6, 0, 0}, {-p0 * L / 3, 0, 0}},
				// U = ∫N²/(2EA) dx = p0²·L³/(90EA) of the fields above.
				energy: p0 * p0 * L * L * L / (90 * EA),
				points: []pointCheck{
					{x: L / 2, q: axialDisplacement, want: p0 * L * L / (16 * EA)},
					{x: L / 2, q: axialForce, want: p0 * L / 24},
					{x: xu, q: axialForce, want: 0},
				},
				extremes: []extremeCheck{
					{q: axialDisplacement, want: uMax, x: xu},
					{q: axialForce, want: -p0 * L / 3, x: L},
				},
			},
			reported: []reportedExtreme{
				{fem.QAxialDisplacement, true, uMax, xu},
				{fem.QAxialForce, true, p0 * L / 6, 0},
				{fem.QAxialForce, false, -p0 * L / 3, L},
			},
		})
	}
	{
		// Column fixed at its base x = 0, x up, under its own weight and a
		// load P on its top: N = −P − γA(L − x), top displacement
		// −(P·L + γA·L²/2)/EA (Gere & Goodno, Mechanics of Materials, ch. 2,
		// bar under its own weight, from memory, with the end load added).
		const L, P = 5.0, 50e3
		gammaA := refDensity * fem.StandardGravity * refA // N/m
		top := -(P*L + gammaA*L*L/2) / EA
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "column under its own weight and a load on its top",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
					PointLoads: []fem.PointLoad{{X: L, Axial: -P}}, Gravity: [2]float64{-fem.StandardGravity, 0}},
				reactions: [][3]float64{{P + gammaA*L, 0, 0}},
				// U = ∫N²/(2EA) dx of the field above.
				energy: (P*P*L + P*gammaA*L*L + gammaA*gammaA*L*L*L/3) / (2 * EA),
				points: []pointCheck{
					{x: L / 2, q: axialForce, want: -P - gammaA*L/2},
					{x: L, q: axialDisplacement, want: top},
				},
				extremes: []extremeCheck{
					{q: axialForce, want: -P - gammaA*L, x: 0},
					{q: axialDisplacement, want: top, x: L},
				},
			},
			reported: []reportedExtreme{
				{fem.QAxialForce, false, -P - gammaA*L, 0},
				{fem.QAxialForce, true, -P, L},
				{fem.QAxialDisplacement, false, top, L},
			},
		})
	}
	{
		// Pile, x down from its head, pushed in by F at the head, held by skin
		// friction rising from f0 at the head to f1 at the toe (acting up,
		// along −x) and by a spring k under its base: by statics the base
		// takes F − (f0 + f1)·L/2 and N = −F + f0·x + (f1 − f0)·x²/(2L)
		// (N' = −p); the toe settles by its force over k and the head by that
		// plus ∫−N/EA over the pile (Gere & Goodno, Mechanics of Materials,
		// ch. 2, bars under distributed axial loads, the method from memory).
		const L, F, f0, f1, k = 12.0, 300e3, 10e3, 30e3, 5e8
		base := F - (f0+f1)*L/2
		toe := base / k
		head := toe + (F*L-f0*L*L/2-(f1-f0)*L*L/6)/EA
		cases = append(cases, beamCase{
			refCase: refCase{
				name: "pile on skin friction rising with depth and a spring under its base",
				model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: L, Kind: fem.Spring, Stiffness: [3]float64{k, 0, 0}}},
					PointLoads:      []fem.PointLoad{{X: 0, Axial: F}},
					DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: -f0}, {X: L, Intensity: -f1}}}}},
				reactions: [][3]float64{{-base, 0, 0}},
				points: []pointCheck{
					{x: L / 2, q: axialForce, want: -F + f0*L/2 + (f1-f0)*L/8},
					{x: L, q: axialDisplacement, want: toe},
					{x: 0, q: axialDisplacement, want: head},
				},
				extremes: []extremeCheck{
					{q: axialForce, want: -F, x: 0},
					{q: axialDisplacement, want: head, x: 0},
				},
			},
			reported: []reportedExtreme{
				{fem.QAxialForce, false, -F, 0},
				{fem.QAxialForce, true, -base, L},
				{fem.QAxialDisplacement, true, head, 0},
				{fem.QAxialDisplacement, false, toe, L},
			},
		})
	}
	return cases
}
