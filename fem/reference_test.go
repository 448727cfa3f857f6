package fem_test

// Handbook cases of bars and beams, each entered as a user would and checked
// against published closed forms, for the finite element solution and for
// the exact solution alike.

import (
	"math"
	"testing"

	"stave/fem"
)

// uniformLoad is a load of constant intensity from x1 to x2.
func uniformLoad(dir fem.Dof, x1, x2, intensity float64) fem.DistributedLoad {
	return fem.DistributedLoad{Direction: dir, Points: []fem.LoadPoint{{X: x1, Intensity: intensity}, {X: x2, Intensity: intensity}}}
}

func referenceCases() []refCase {
	const (
		L      = refLength
		P      = refP
		q      = refQ
		F      = refF
		p      = refPAxis
		M0     = 10e3 // end moment, N·m, counter-clockwise
		dT     = 50.0 // temperature rise, K
		a, b   = 3.0, 1.0
		span   = refLength // each span of the continuous beam, m
		EI, EA = refEI, refEA
	)
	sqrt33 := math.Sqrt(33)
	// Propped span (simple support at one end, no rotation at the other) under
	// uniform load: deflection at distance s from the simple support,
	// q·s·(L³ − 3L·s² + 2s³)/(48EI), largest at s = L(1 + √33)/16 ≈ 0.4215L.
	// Source: AISC Manual, Beam Diagrams and Formulas, beam fixed at one end and
	// supported at the other, uniform load (from memory).
	propped := func(s, l float64) float64 { return q * s * (l*l*l - 3*l*s*s + 2*s*s*s) / (48 * EI) }
	proppedAt := span * (1 + sqrt33) / 16
	gamma := refDensity * fem.StandardGravity // specific weight ρg, N/m³

	return []refCase{
		{
			// Source: axial deformation δ = PL/EA, Gere & Goodno, Mechanics of Materials, ch. 2 (from memory).
			name: "bar fixed at one end, axial end load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: L, Axial: F}}},
			reactions: [][3]float64{{-F, 0, 0}},
			// Strain energy U = N²L/(2EA) of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: F * F * L / (2 * EA),
			points: []pointCheck{
				{x: L, q: axialDisplacement, want: F * L / EA},
				{x: L / 2, q: axialDisplacement, want: F * L / (2 * EA)},
				{x: L / 2, q: axialForce, want: F},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: F * L / EA, x: L},
				{q: axialForce, want: F, x: 0},
				{q: axialStress, want: F / refA, x: 0},
			},
		},
		{
			// Bar fixed at x = 0 under a uniform axial load p: closed form of EA u'' = −p,
			// u = p(Lx − x²/2)/EA, N = p(L − x); Gere & Goodno ch. 2 (from memory).
			name: "bar fixed at one end, uniform axial load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Axial, 0, L, p)}},
			reactions: [][3]float64{{-p * L, 0, 0}},
			// Strain energy U = ∫N²/(2EA) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: p * p * L * L * L / (6 * EA),
			points: []pointCheck{
				{x: L, q: axialDisplacement, want: p * L * L / (2 * EA)},
				{x: L / 2, q: axialDisplacement, want: 3 * p * L * L / (8 * EA)},
				{x: L / 2, q: axialForce, want: p * L / 2},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: p * L * L / (2 * EA), x: L},
				{q: axialForce, want: p * L, x: 0},
				{q: axialStress, want: p * L / refA, x: 0},
			},
		},
		{
			// Linearly increasing axial load p0·x/L (zero at the support): closed form
			// of EA u'' = −p, u = p0(L²x − x³/3)/(2L·EA), N = p0(L² − x²)/(2L);
			// Gere & Goodno ch. 2 (from memory).
			name: "bar fixed at one end, linearly increasing axial load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial,
					Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: L, Intensity: p}}}}},
			reactions: [][3]float64{{-p * L / 2, 0, 0}},
			// Strain energy U = ∫N²/(2EA) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: p * p * L * L * L / (15 * EA),
			points: []pointCheck{
				{x: L, q: axialDisplacement, want: p * L * L / (3 * EA)},
				{x: L / 2, q: axialDisplacement, want: 11 * p * L * L / (48 * EA)},
				{x: L / 2, q: axialForce, want: 3 * p * L / 8},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: p * L * L / (3 * EA), x: L},
				{q: axialForce, want: p * L / 2, x: 0},
				{q: axialStress, want: p * L / (2 * refA), x: 0},
			},
		},
		{
			// Stepped bar, end load: δ = Σ N·Lᵢ/(E·Aᵢ), σᵢ = N/Aᵢ; Gere & Goodno ch. 2 (from memory).
			name: "stepped bar fixed at one end, axial end load",
			model: fem.Model{
				Segments: []fem.Segment{
					{Start: 0, End: L / 2, Section: refSection, Material: refSteel},
					{Start: L / 2, End: L, Section: fem.Section{Area: refA / 2, SecondMoment: refI / 2, FibreDistance: refC}, Material: refSteel},
				},
				Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: L, Axial: F}}},
			reactions: [][3]float64{{-F, 0, 0}},
			// Strain energy U = Σ N²Lᵢ/(2EAᵢ) of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: 3 * F * F * L / (4 * EA),
			points: []pointCheck{
				{x: L / 2, q: axialDisplacement, want: F * (L / 2) / EA},
				{x: L, q: axialDisplacement, want: F*(L/2)/EA + F*(L/2)/(EA/2)},
				{x: L / 2, side: fem.Left, q: axialStress, want: F / refA},
				{x: L / 2, side: fem.Right, q: axialStress, want: F / (refA / 2)},
				{x: L / 4, q: axialForce, want: F},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: 3 * F * L / (2 * EA), x: L},
				{q: axialForce, want: F, x: L},
				{q: axialStress, want: 2 * F / refA, x: L},
			},
		},
		{
			// Bar fixed at both ends, axial load F at x = a (b = L − a): reactions
			// −F·b/L and −F·a/L, u(a) = F·a·b/(L·EA); Gere & Goodno ch. 2,
			// statically indeterminate axial members (from memory).
			name: "bar fixed at both ends, interior axial load",
			model: fem.Model{Segments: refMember(L),
				Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: a, Axial: F}}},
			reactions: [][3]float64{{-F * b / L, 0, 0}, {-F * a / L, 0, 0}},
			// Strain energy U = F·u(a)/2 of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: F * F * a * b / (2 * L * EA),
			points: []pointCheck{
				{x: a, q: axialDisplacement, want: F * a * b / (L * EA)},
				{x: a / 2, q: axialDisplacement, want: F * b / L * (a / 2) / EA},
				{x: a, side: fem.Left, q: axialForce, want: F * b / L},
				{x: a, side: fem.Right, q: axialForce, want: -F * a / L},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: F * a * b / (L * EA), x: a},
				{q: axialForce, want: -F * a / L, x: L},
				{q: axialStress, want: -F * a / (L * refA), x: L},
			},
		},
		{
			// Bar held between rigid walls, heated by ΔT: N = −EAαΔT, σ = −EαΔT,
			// no displacement; Gere & Goodno ch. 2, thermal effects (from memory).
			name: "bar fixed at both ends, temperature rise",
			model: fem.Model{Segments: refMember(L),
				Supports:          []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
				TemperatureChange: dT},
			reactions: [][3]float64{{EA * refAlpha * dT, 0, 0}, {-EA * refAlpha * dT, 0, 0}},
			// Strain energy U = N²L/(2EA) of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: EA * refAlpha * dT * refAlpha * dT * L / 2,
			points: []pointCheck{
				{x: L / 2, q: axialDisplacement, want: 0},
				{x: L / 3, q: axialForce, want: -EA * refAlpha * dT},
			},
			extremes: []extremeCheck{
				{q: axialForce, want: -EA * refAlpha * dT, x: L / 2},
				{q: axialStress, want: -refE * refAlpha * dT, x: L / 2},
			},
		},
		{
			// Rod hanging from x = 0 under its own weight (gravity along +x):
			// N = ρgA(L − x), δ = ρgL²/(2E); Gere & Goodno ch. 2, bar hanging
			// under its own weight (from memory).
			name: "hanging rod under self-weight",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				Gravity: [2]float64{fem.StandardGravity, 0}},
			reactions: [][3]float64{{-gamma * refA * L, 0, 0}},
			// Strain energy U = ∫N²/(2EA) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: gamma * gamma * refA * L * L * L / (6 * refE),
			points: []pointCheck{
				{x: L, q: axialDisplacement, want: gamma * L * L / (2 * refE)},
				{x: L / 2, q: axialDisplacement, want: 3 * gamma * L * L / (8 * refE)},
				{x: L / 2, q: axialForce, want: gamma * refA * L / 2},
			},
			extremes: []extremeCheck{
				{q: axialDisplacement, want: gamma * L * L / (2 * refE), x: L},
				{q: axialForce, want: gamma * refA * L, x: 0},
				{q: axialStress, want: gamma * L, x: 0},
			},
		},
		{
			// Cantilever, load P at the free end: w = P·x²(3L − x)/(6EI), tip P·L³/(3EI),
			// tip slope P·L²/(2EI), root moment P·L. Roark's Formulas for Stress and
			// Strain, Table 8.1; Gere & Goodno, Appendix, cantilever deflections (from memory).
			name: "cantilever, end load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: L, Transverse: P}}},
			reactions: [][3]float64{{0, -P, -P * L}},
			// Strain energy U = ∫M²/(2EI) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: P * P * L * L * L / (6 * EI),
			points: []pointCheck{
				{x: L, q: deflection, want: P * L * L * L / (3 * EI)},
				{x: L, q: rotation, want: P * L * L / (2 * EI)},
				{x: L / 2, q: deflection, want: 5 * P * L * L * L / (48 * EI)},
				{x: L / 2, q: bendingMoment, want: P * L / 2},
				{x: L / 2, q: shearForce, want: -P},
			},
			extremes: []extremeCheck{
				{q: deflection, want: P * L * L * L / (3 * EI), x: L},
				{q: bendingMoment, want: P * L, x: 0},
				{q: bendingStress, want: P * L * refC / refI, x: 0},
			},
		},
		{
			// Cantilever, uniform load q: w = q·x²(6L² − 4Lx + x²)/(24EI), tip q·L⁴/(8EI),
			// tip slope q·L³/(6EI), root moment q·L²/2. Roark Table 8.1; Gere & Goodno
			// Appendix (from memory).
			name: "cantilever, uniform load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, 0, L, q)}},
			reactions: [][3]float64{{0, -q * L, -q * L * L / 2}},
			// Strain energy U = ∫M²/(2EI) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: q * q * L * L * L * L * L / (40 * EI),
			points: []pointCheck{
				{x: L, q: deflection, want: q * L * L * L * L / (8 * EI)},
				{x: L, q: rotation, want: q * L * L * L / (6 * EI)},
				{x: L / 2, q: deflection, want: 17 * q * L * L * L * L / (384 * EI)},
				{x: L / 2, q: bendingMoment, want: q * L * L / 8},
				{x: 0, q: shearForce, want: -q * L},
			},
			extremes: []extremeCheck{
				{q: deflection, want: q * L * L * L * L / (8 * EI), x: L},
				{q: bendingMoment, want: q * L * L / 2, x: 0},
				{q: bendingStress, want: q * L * L / 2 * refC / refI, x: 0},
			},
		},
		{
			// Cantilever, load falling linearly from q0 at the support to zero at the
			// free end: w = q0·x²(10L³ − 10L²x + 5Lx² − x³)/(120·L·EI), tip q0·L⁴/(30EI),
			// tip slope q0·L³/(24EI), root moment q0·L²/6. Gere & Goodno, Appendix,
			// cantilever with triangular load; Roark Table 8.1 (from memory).
			name: "cantilever, linearly varying load",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse,
					Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: L, Intensity: 0}}}}},
			reactions: [][3]float64{{0, -q * L / 2, -q * L * L / 6}},
			// Strain energy U = ∫M²/(2EI) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: q * q * L * L * L * L * L / (504 * EI),
			points: []pointCheck{
				{x: L, q: deflection, want: q * L * L * L * L / (30 * EI)},
				{x: L, q: rotation, want: q * L * L * L / (24 * EI)},
				{x: L / 2, q: deflection, want: q * (L / 2) * (L / 2) * (10*L*L*L - 5*L*L*L + 5*L*L*L/4 - L*L*L/8) / (120 * L * EI)},
				{x: L / 2, q: bendingMoment, want: q * L * L / 48},
			},
			extremes: []extremeCheck{
				{q: deflection, want: q * L * L * L * L / (30 * EI), x: L},
				{q: bendingMoment, want: q * L * L / 6, x: 0},
				{q: bendingStress, want: q * L * L / 6 * refC / refI, x: 0},
			},
		},
		{
			// Cantilever, counter-clockwise moment M0 at the free end: uniform sagging
			// moment M0, w = M0·x²/(2EI), tip slope M0·L/EI. Roark Table 8.1; Gere &
			// Goodno Appendix (from memory).
			name: "cantilever, end moment",
			model: fem.Model{Segments: refMember(L), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: L, Moment: M0}}},
			reactions: [][3]float64{{0, 0, -M0}},
			// Strain energy U = M0²L/(2EI) of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: M0 * M0 * L / (2 * EI),
			points: []pointCheck{
				{x: L, q: deflection, want: M0 * L * L / (2 * EI)},
				{x: L, q: rotation, want: M0 * L / EI},
				{x: L / 2, q: deflection, want: M0 * L * L / (8 * EI)},
				{x: L / 2, q: shearForce, want: 0},
			},
			extremes: []extremeCheck{
				{q: deflection, want: M0 * L * L / (2 * EI), x: L},
				{q: bendingMoment, want: M0, x: L / 2, stationary: true},
				{q: bendingStress, want: M0 * refC / refI, x: L / 2},
			},
		},
		{
			// Simple beam, load P at midspan: midspan deflection P·L³/(48EI), end slope
			// P·L²/(16EI), moment P·L/4 under the load. AISC Manual, Beam Diagrams and
			// Formulas, simple beam with a concentrated load at the centre (from memory).
			name: "simply supported, central load",
			model: fem.Model{Segments: refMember(L),
				Supports:   []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
				PointLoads: []fem.PointLoad{{X: L / 2, Transverse: P}}},
			reactions: [][3]float64{{0, -P / 2, 0}, {0, -P / 2, 0}},
			// Strain energy U = P·w/2 of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: P * P * L * L * L / (96 * EI),
			points: []pointCheck{
				{x: 0, q: rotation, want: P * L * L / (16 * EI)},
				{x: L, q: rotation, want: -P * L * L / (16 * EI)},
				{x: L / 4, q: bendingMoment, want: -P * L / 8},
				{x: L / 4, q: deflection, want: P * (L / 4) * (3*L*L - 4*L*L/16) / (48 * EI)},
				{x: 0, q: shearForce, want: -P / 2},
			},
			extremes: []extremeCheck{
				{q: deflection, want: P * L * L * L / (48 * EI), x: L / 2, stationary: true},
				{q: bendingMoment, want: -P * L / 4, x: L / 2},
				{q: bendingStress, want: -P * L / 4 * refC / refI, x: L / 2},
			},
		},
		{
			// Simple beam, load P at x = a, b = L − a, a > b: reactions −P·b/L and −P·a/L,
			// moment −P·a·b/L under the load, deflection there P·a²b²/(3EI·L), largest
			// deflection P·b(L² − b²)^(3/2)/(9√3·L·EI) at x = √((L² − b²)/3), end slope
			// P·a·b(L + b)/(6L·EI). AISC Manual, simple beam with a concentrated load at
			// any point; Gere & Goodno Appendix, simple beam deflections (from memory).
			name: "simply supported, off-centre load",
			model: fem.Model{Segments: refMember(L),
				Supports:   []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
				PointLoads: []fem.PointLoad{{X: a, Transverse: P}}},
			reactions: [][3]float64{{0, -P * b / L, 0}, {0, -P * a / L, 0}},
			// Strain energy U = P·w(a)/2 of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: P * P * a * a * b * b / (6 * EI * L),
			points: []pointCheck{
				{x: a, q: deflection, want: P * a * a * b * b / (3 * EI * L)},
				{x: 0, q: rotation, want: P * a * b * (L + b) / (6 * L * EI)},
				{x: L, q: rotation, want: -P * a * b * (L + a) / (6 * L * EI)},
				{x: a, q: bendingMoment, want: -P * a * b / L},
			},
			extremes: []extremeCheck{
				{q: deflection, want: P * b * math.Pow(L*L-b*b, 1.5) / (9 * math.Sqrt(3) * L * EI), x: math.Sqrt((L*L - b*b) / 3), stationary: true},
				{q: bendingMoment, want: -P * a * b / L, x: a},
				{q: bendingStress, want: -P * a * b / L * refC / refI, x: a},
			},
		},
		{
			// Simple beam, uniform load: w = q·x(L³ − 2Lx² + x³)/(24EI), midspan
			// 5q·L⁴/(384EI), end slope q·L³/(24EI), midspan moment −q·L²/8. AISC Manual,
			// simple beam with uniformly distributed load; Roark Table 8.1 (from memory).
			name: "simply supported, uniform load",
			model: fem.Model{Segments: refMember(L),
				Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, 0, L, q)}},
			reactions: [][3]float64{{0, -q * L / 2, 0}, {0, -q * L / 2, 0}},
			// Strain energy U = ∫M²/(2EI) dx of the book's fields (Gere & Goodno, strain energy, from memory).
			energy: q * q * L * L * L * L * L / (240 * EI),
			points: []pointCheck{
				{x: 0, q: rotation, want: q * L * L * L / (24 * EI)},
				{x: L, q: rotation, want: -q * L * L * L / (24 * EI)},
				{x: L / 4, q: deflection, want: q * (L / 4) * (L*L*L - 2*L*L*L/16 + L*L*L/64) / (24 * EI)},
				{x: L / 4, q: bendingMoment, want: -q * (L / 4) * (3 * L / 4) / 2},
				{x: 0, q: shearForce, want: -q * L / 2},
			},
			extremes: []extremeCheck{
				{q: deflection, want: 5 * q * L * L * L * L / (384 * EI), x: L / 2, stationary: true},
				{q: bendingMoment, want: -q * L * L / 8, x: L / 2, stationary: true},
				{q: bendingStress, want: -q * L * L / 8 * refC / refI, x: L / 2},
			},
		},
		{
			// Beam fixed at both ends, uniform load: end moments q·L²/12 (hogging),
			// midspan moment −q·L²/24, w = q·x²(L − x)²/(24EI), midspan q·L⁴/(384EI).
			// AISC Manual, beam fixed at both ends, uniformly distributed load; Roark
			// Table 8.1 (from memory).
			name: "fixed at both ends, uniform load",
			model: fem.Model{Segments: refMember(L),
				Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, 0, L, q)}},
			reactions: [][3]float64{{0, -q * L / 2, -q * L * L / 12}, {0, -q * L / 2, q * L * L / 12}},
			// Strain energy U = ½∫q·w dx of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: q * q * L * L * L * L * L / (1440 * EI),
			points: []pointCheck{
				{x: L / 2, q: bendingMoment, want: -q * L * L / 24},
				{x: L / 4, q: deflection, want: q * (L / 4) * (L / 4) * (3 * L / 4) * (3 * L / 4) / (24 * EI)},
				{x: 0, q: shearForce, want: -q * L / 2},
				{x: L, q: bendingMoment, want: q * L * L / 12},
			},
			extremes: []extremeCheck{
				{q: deflection, want: q * L * L * L * L / (384 * EI), x: L / 2, stationary: true},
				{q: bendingMoment, want: q * L * L / 12, x: 0},
				{q: bendingStress, want: q * L * L / 12 * refC / refI, x: 0},
			},
		},
		{
			// Beam fixed at both ends, load P at x = a, b = L − a, a > b: end moments
			// P·a·b²/L² and P·a²·b/L² (hogging), reactions −P·b²(3a + b)/L³ and
			// −P·a²(a + 3b)/L³, moment −2P·a²b²/L³ under the load, deflection there
			// P·a³b³/(3EI·L³), largest deflection 2P·a³b²/(3EI(3a + b)²) at
			// x = 2aL/(3a + b). AISC Manual, beam fixed at both ends, concentrated load
			// at any point; Roark Table 8.1 (from memory).
			name: "fixed at both ends, off-centre load",
			model: fem.Model{Segments: refMember(L),
				Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Fixed}},
				PointLoads: []fem.PointLoad{{X: a, Transverse: P}}},
			reactions: [][3]float64{
				{0, -P * b * b * (3*a + b) / (L * L * L), -P * a * b * b / (L * L)},
				{0, -P * a * a * (a + 3*b) / (L * L * L), P * a * a * b / (L * L)},
			},
			// Strain energy U = P·w(a)/2 of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: P * P * a * a * a * b * b * b / (6 * EI * L * L * L),
			points: []pointCheck{
				{x: a, q: deflection, want: P * a * a * a * b * b * b / (3 * EI * L * L * L)},
				{x: a, q: bendingMoment, want: -2 * P * a * a * b * b / (L * L * L)},
				{x: 0, q: bendingMoment, want: P * a * b * b / (L * L)},
			},
			extremes: []extremeCheck{
				{q: deflection, want: 2 * P * a * a * a * b * b / (3 * EI * (3*a + b) * (3*a + b)), x: 2 * a * L / (3*a + b), stationary: true},
				{q: bendingMoment, want: P * a * a * b / (L * L), x: L},
				{q: bendingStress, want: P * a * a * b / (L * L) * refC / refI, x: L},
			},
		},
		{
			// Beam fixed at x = 0, simply supported at x = L, uniform load: reactions
			// −5q·L/8 and −3q·L/8, fixed-end moment q·L²/8 (hogging), largest sagging
			// moment −9q·L²/128 at 3L/8 from the simple support, slope there −q·L³/(48EI).
			// AISC Manual, beam fixed at one end and supported at the other, uniform
			// load; Roark Table 8.1 (from memory).
			name: "propped cantilever, uniform load",
			model: fem.Model{Segments: refMember(L),
				Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}, {X: L, Kind: fem.Roller}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, 0, L, q)}},
			reactions: [][3]float64{{0, -5 * q * L / 8, -q * L * L / 8}, {0, -3 * q * L / 8, 0}},
			// Strain energy U = ½∫q·w dx of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: q * q * L * L * L * L * L / (640 * EI),
			points: []pointCheck{
				{x: L / 2, q: deflection, want: propped(L/2, L)},
				{x: L, q: rotation, want: -q * L * L * L / (48 * EI)},
				{x: 5 * L / 8, q: bendingMoment, want: -9 * q * L * L / 128},
				{x: 5 * L / 8, q: shearForce, want: 0},
			},
			extremes: []extremeCheck{
				{q: deflection, want: propped(proppedAt, L), x: L - proppedAt, stationary: true},
				{q: bendingMoment, want: q * L * L / 8, x: 0},
				{q: bendingStress, want: q * L * L / 8 * refC / refI, x: 0},
			},
		},
		{
			// Two equal spans l, uniform load on both: end reactions −3q·l/8, middle
			// −10q·l/8, moment over the middle support q·l²/8 (hogging), largest sagging
			// moment −9q·l²/128 at 3l/8 from each end; each span deflects as a propped
			// span. AISC Manual, continuous beam, two equal spans, uniform load on both
			// spans (from memory).
			name: "two equal spans, uniform load",
			model: fem.Model{Segments: refMember(2 * span),
				Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: span, Kind: fem.Roller},
					{X: 2 * span, Kind: fem.Roller}},
				DistributedLoad: []fem.DistributedLoad{uniformLoad(fem.Transverse, 0, 2*span, q)}},
			reactions: [][3]float64{{0, -3 * q * span / 8, 0}, {0, -10 * q * span / 8, 0}, {0, -3 * q * span / 8, 0}},
			// Strain energy U = ½∫q·w dx of the book's fields (Clapeyron's theorem; Gere & Goodno, strain energy, from memory).
			energy: q * q * span * span * span * span * span / (320 * EI),
			points: []pointCheck{
				{x: span, q: rotation, want: 0},
				{x: 0, q: rotation, want: q * span * span * span / (48 * EI)},
				{x: span / 2, q: deflection, want: propped(span/2, span)},
				{x: 3 * span / 8, q: bendingMoment, want: -9 * q * span * span / 128},
				{x: 13 * span / 8, q: bendingMoment, want: -9 * q * span * span / 128},
				{x: 3 * span / 8, q: shearForce, want: 0},
			},
			extremes: []extremeCheck{
				{q: deflection, want: propped(proppedAt, span), x: proppedAt, stationary: true},
				{q: bendingMoment, want: q * span * span / 8, x: span},
				{q: bendingStress, want: q * span * span / 8 * refC / refI, x: span},
			},
		},
	}
}

// Element counts at which the nodal values must already be exact.
var coarseMeshes = []int{1, 2, 5}

// fineMesh is the element count for the checks between nodes.
const fineMesh = 64

func TestReferenceFiniteElement(t *testing.T) {
	for _, c := range referenceCases() {
		for _, order := range c.barOrders() {
			t.Run(c.name+"/"+orderName(order), func(t *testing.T) { checkFiniteElementCase(t, c, order) })
		}
	}
}

// checkFiniteElementCase checks the finite element solution of c on coarse
// meshes (what theory makes exact there) and on a fine one (everything); a
// case without a book strain energy (0) skips that check.
func checkFiniteElementCase(t *testing.T, c refCase, order fem.ElementOrder) {
	t.Helper()
	for _, n := range coarseMeshes {
		sol := solveWith(t, c.model, n, order)
		checkReactions(t, c, sol.Reactions, scalesOf(&c.model))
		checkEquilibrium(t, &c.model, sol.Reactions, &sol.Equilibrium)
		// Only what theory says is exact at any mesh: nodal displacements, and
		// everything where the load between nodes leaves no error.
		j := feJudge(sol, order)
		j.checkPoints(t, c, j.exactAt)
	}
	sol := solveWith(t, c.model, fineMesh, order)
	checkReactions(t, c, sol.Reactions, scalesOf(&c.model))
	checkEquilibrium(t, &c.model, sol.Reactions, &sol.Equilibrium)
	if c.energy != 0 {
		checkStrainEnergy(t, c, sol, order)
	}
	j := feJudge(sol, order)
	j.checkPoints(t, c, nil)
	j.checkExtremes(t, c)
}

func TestReferenceExact(t *testing.T) {
	for _, c := range referenceCases() {
		t.Run(c.name, func(t *testing.T) { checkExactCase(t, c) })
	}
}

// checkExactCase checks the closed-form solution of c to round-off.
func checkExactCase(t *testing.T, c refCase) {
	t.Helper()
	ex, err := fem.SolveExact(&c.model)
	if err != nil {
		t.Fatalf("SolveExact: %v", err)
	}
	checkReactions(t, c, ex.Reactions(), scalesOf(&c.model))
	checkEquilibrium(t, &c.model, ex.Reactions(), nil)
	j := exactJudge(ex, &c.model)
	j.checkPoints(t, c, nil)
	j.checkExtremes(t, c)
}
