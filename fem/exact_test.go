package fem

import (
	"math"
	"strings"
	"testing"
)

// Member properties shared by the handbook cases (a steel-like member; the
// formulas hold for any values).
const (
	tE = 200e9  // Pa
	tA = 4e-3   // m²
	tI = 5e-5   // m⁴
	tC = 0.1    // m
	tL = 4.0    // m
	tP = 10e3   // N
	tQ = 5e3    // N/m
	tK = 2.5e6  // N/m
	tD = 0.01   // m, settlement
	tX = 1.2e-5 // 1/K, thermal expansion
	tT = 40.0   // K, temperature change
)

const tEA, tEI = tE * tA, tE * tI

// member returns segments of equal section tiling [0, L] at the given breaks.
func member(L float64, breaks ...float64) []Segment {
	xs := append(append([]float64{0}, breaks...), L)
	segs := make([]Segment, len(xs)-1)
	for i := range segs {
		segs[i] = Segment{Start: xs[i], End: xs[i+1],
			Section:  Section{Area: tA, SecondMoment: tI, FibreDistance: tC},
			Material: Material{Elastic: tE, Density: 7850, ThermalExpansion: tX}}
	}
	return segs
}

func uniformLoad(d Dof, x0, x1, q0, q1 float64) DistributedLoad {
	return DistributedLoad{Direction: d, Points: []LoadPoint{{x0, q0}, {x1, q1}}}
}

// check is one computed quantity and its expected value. A quantity expected
// to vanish is divided by a magnitude it has elsewhere, so that its error is
// relative too.
type check struct {
	what      string
	got, want float64
}

// exactCase is one handbook model with the quantities it is checked on.
type exactCase struct {
	name   string
	model  Model
	checks func(e *Exact) []check
}

func at(e *Exact, x float64) Fields { return e.At(x, Right) }

func reaction(e *Exact, i int, d Dof) float64 { return e.Reactions()[i].Force[d] }

var exactCases = []exactCase{
	{
		name: "bar fixed at one end, axial end load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			PointLoads: []PointLoad{{X: tL, Axial: tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = PL/EA. Source: Gere & Goodno, Mechanics of Materials, ch. 2, from memory.
				{"u(L)", at(e, tL).AxialDisplacement, tP * tL / tEA},
				{"N", at(e, tL/3).AxialForce, tP},
				{"σ = N/A", at(e, tL/3).AxialStress, tP / tA},
				{"R", reaction(e, 0, Axial), -tP},
			}
		},
	},
	{
		name: "bar fixed at one end, uniform axial load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Axial, 0, tL, tQ, tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = pL²/2EA, N(0) = pL. Source: Gere & Goodno, Mechanics of Materials, ch. 2, from memory.
				{"u(L)", at(e, tL).AxialDisplacement, tQ * tL * tL / (2 * tEA)},
				{"N(0)", at(e, 0).AxialForce, tQ * tL},
				{"R", reaction(e, 0, Axial), -tQ * tL},
			}
		},
	},
	{
		name: "bar fixed at one end, axial load increasing linearly to p0 at the free end",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Axial, 0, tL, 0, tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// N(x) = p0(L² − x²)/2L, δ = p0L²/3EA. Source: textbook closed form of EA·u'' = −p
				// (Gere & Goodno, Mechanics of Materials, ch. 2, bar with varying load), from memory.
				{"u(L)", at(e, tL).AxialDisplacement, tQ * tL * tL / (3 * tEA)},
				{"N(L/2)", at(e, tL/2).AxialForce, tQ * (tL*tL - tL*tL/4) / (2 * tL)},
			}
		},
	},
	{
		name: "stepped bar, end load",
		model: func() Model {
			m := Model{Segments: member(tL, 1.5), Supports: []Support{{X: 0, Kind: Fixed}},
				PointLoads: []PointLoad{{X: tL, Axial: tP}}}
			m.Segments[1].Section.Area = tA / 2
			return m
		}(),
		checks: func(e *Exact) []check {
			return []check{
				// δ = Σ P·Lᵢ/(E·Aᵢ). Source: Gere & Goodno, Mechanics of Materials, ch. 2, from memory.
				{"u(L)", at(e, tL).AxialDisplacement, tP*1.5/tEA + tP*(tL-1.5)/(tE*tA/2)},
				{"σ in the thin part", at(e, 3).AxialStress, tP / (tA / 2)},
			}
		},
	},
	{
		name: "bar fixed at both ends, interior axial load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Fixed}},
			PointLoads: []PointLoad{{X: 1, Axial: tP}}},
		checks: func(e *Exact) []check {
			a, b := 1.0, tL-1
			return []check{
				// R1 = P·b/L, R2 = P·a/L, both opposing P; u(a) = P·a·b/(L·EA).
				// Source: Gere & Goodno, Mechanics of Materials, ch. 2 (statically indeterminate bar), from memory.
				{"R1", reaction(e, 0, Axial), -tP * b / tL},
				{"R2", reaction(e, 1, Axial), -tP * a / tL},
				{"u(a)", at(e, a).AxialDisplacement, tP * a * b / (tL * tEA)},
			}
		},
	},
	{
		name: "bar restrained at both ends, temperature rise",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Fixed}},
			TemperatureChange: tT},
		checks: func(e *Exact) []check {
			return []check{
				// N = −EA·α·ΔT (compression). Source: Gere & Goodno, Mechanics of Materials, ch. 2
				// (thermal stress in a restrained bar), from memory.
				{"N", at(e, 1).AxialForce, -tEA * tX * tT},
				{"σ", at(e, 3).AxialStress, -tE * tX * tT},
				{"R1 pushes in +x", reaction(e, 0, Axial), tEA * tX * tT},
			}
		},
	},
	{
		name:  "bar fixed at one end, free temperature rise",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}}, TemperatureChange: tT},
		checks: func(e *Exact) []check {
			return []check{
				// δ = α·ΔT·L with no force. Source: Gere & Goodno, Mechanics of Materials, ch. 2, from memory.
				{"u(L)", at(e, tL).AxialDisplacement, tX * tT * tL},
				{"N/(EA·α·ΔT)", at(e, 2).AxialForce / (tEA * tX * tT), 0},
			}
		},
	},
	{
		name: "rod hanging from x = 0 under its own weight",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			Gravity: [2]float64{StandardGravity, 0}},
		checks: func(e *Exact) []check {
			rho := 7850.0
			return []check{
				// δ = ρ·g·L²/2E, N(0) = ρ·g·A·L. Source: Gere & Goodno, Mechanics of Materials,
				// ch. 2 (bar hanging under its own weight), from memory.
				{"u(L)", at(e, tL).AxialDisplacement, rho * StandardGravity * tL * tL / (2 * tE)},
				{"N(0)", at(e, 0).AxialForce, rho * StandardGravity * tA * tL},
			}
		},
	},
	{
		name: "cantilever, downward end load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			PointLoads: []PointLoad{{X: tL, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = PL³/3EI, θ = PL²/2EI, M(0) = −PL (hogging). Source: Roark's Formulas for Stress
				// and Strain, Table 8.1, cantilever with end load, from memory.
				{"w(L)", at(e, tL).Deflection, -tP * tL * tL * tL / (3 * tEI)},
				{"θ(L)", at(e, tL).Rotation, -tP * tL * tL / (2 * tEI)},
				{"M(0)", at(e, 0).BendingMoment, -tP * tL},
				{"V = dM/dx", at(e, 1).ShearForce, tP},
				{"bending stress M·c/I at the root", at(e, 0).BendingStress, -tP * tL * tC / tI},
				// With no axial force both fibres carry the same magnitude; the tie goes to the
				// bottom fibre, so the combined stress equals the bending stress.
				{"combined stress at the root", at(e, 0).CombinedStress, -tP * tL * tC / tI},
				{"reaction force", reaction(e, 0, Transverse), tP},
				{"reaction moment", reaction(e, 0, Rotation), tP * tL},
			}
		},
	},
	{
		name: "cantilever, downward end load and axial tension",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			PointLoads: []PointLoad{{X: tL, Axial: 3 * tP, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// σ = N/A − M·c/I in the top fibre, which is in tension under hogging.
				// Source: Gere & Goodno, Mechanics of Materials, ch. 11 (combined axial and bending
				// stress), from memory.
				{"combined stress at the root", at(e, 0).CombinedStress, 3*tP/tA + tP*tL*tC/tI},
			}
		},
	},
	{
		name: "cantilever, uniform downward load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = qL⁴/8EI, M(0) = −qL²/2. Source: Roark's Formulas for Stress and Strain,
				// Table 8.1, cantilever with uniform load, from memory.
				{"w(L)", at(e, tL).Deflection, -tQ * math.Pow(tL, 4) / (8 * tEI)},
				{"M(0)", at(e, 0).BendingMoment, -tQ * tL * tL / 2},
				{"reaction force", reaction(e, 0, Transverse), tQ * tL},
				{"reaction moment", reaction(e, 0, Rotation), tQ * tL * tL / 2},
			}
		},
	},
	{
		name: "cantilever, load decreasing linearly from q0 at the root to zero at the tip",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, 0)}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = q0L⁴/30EI, M(0) = −q0L²/6. Source: Gere & Goodno, Mechanics of Materials,
				// Appendix deflection tables, cantilever with triangular load, from memory.
				{"w(L)", at(e, tL).Deflection, -tQ * math.Pow(tL, 4) / (30 * tEI)},
				{"M(0)", at(e, 0).BendingMoment, -tQ * tL * tL / 6},
			}
		},
	},
	{
		name: "cantilever, counter-clockwise end moment",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			PointLoads: []PointLoad{{X: tL, Moment: tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = M0·L²/2EI, uniform sagging moment M0. Source: Roark's Formulas for Stress and
				// Strain, Table 8.1, cantilever with end couple, from memory.
				{"w(L)", at(e, tL).Deflection, tP * tL * tL / (2 * tEI)},
				{"M", at(e, 1).BendingMoment, tP},
				{"reaction moment", reaction(e, 0, Rotation), -tP},
			}
		},
	},
	{
		name: "stepped cantilever, end load",
		model: func() Model {
			m := Model{Segments: member(tL, 1), Supports: []Support{{X: 0, Kind: Fixed}},
				PointLoads: []PointLoad{{X: tL, Transverse: -tP}}}
			m.Segments[1].Section.SecondMoment = tI / 4
			return m
		}(),
		checks: func(e *Exact) []check {
			b := tL - 1
			return []check{
				// δ = (P/3E)·[(L³ − b³)/I1 + b³/I2] with b the length of the second part.
				// Source: moment-area theorem (Gere & Goodno, Mechanics of Materials, ch. 9), from memory.
				{"w(L)", at(e, tL).Deflection, -tP / (3 * tE) * ((tL*tL*tL-b*b*b)/tI + b*b*b/(tI/4))},
			}
		},
	},
	{
		name: "simply supported, central load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
			PointLoads: []PointLoad{{X: tL / 2, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = PL³/48EI, M = PL/4, R = P/2. Source: AISC Steel Construction Manual,
				// beam diagrams and formulas (simple beam, concentrated load at centre), from memory.
				{"w(L/2)", at(e, tL/2).Deflection, -tP * tL * tL * tL / (48 * tEI)},
				{"M(L/2)", at(e, tL/2).BendingMoment, tP * tL / 4},
				{"V left of the load", e.At(tL/2, Left).ShearForce, tP / 2},
				{"V right of the load", e.At(tL/2, Right).ShearForce, -tP / 2},
				{"R1", reaction(e, 0, Transverse), tP / 2},
				{"R2", reaction(e, 1, Transverse), tP / 2},
			}
		},
	},
	{
		name: "simply supported, off-centre load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
			PointLoads: []PointLoad{{X: 2.5, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			a, b := 2.5, tL-2.5
			x1 := math.Sqrt((tL*tL - b*b) / 3)
			return []check{
				// M = Pab/L under the load; R1 = Pb/L; δmax = Pb(L² − b²)^{3/2}/(9√3·L·EI) at
				// x = √((L² − b²)/3) for a > b. Source: AISC Steel Construction Manual, beam
				// diagrams and formulas (simple beam, concentrated load at any point), from memory.
				{"M(a)", at(e, a).BendingMoment, tP * a * b / tL},
				{"R1", reaction(e, 0, Transverse), tP * b / tL},
				{"w at the maximum", at(e, x1).Deflection, -tP * b * math.Pow(tL*tL-b*b, 1.5) / (9 * math.Sqrt(3) * tL * tEI)},
				{"θ/(PL²/EI) = 0 at the maximum", at(e, x1).Rotation / (tP * tL * tL / tEI), 0},
			}
		},
	},
	{
		name: "simply supported, uniform load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = 5qL⁴/384EI, M = qL²/8, V(0) = qL/2. Source: AISC Steel Construction Manual,
				// beam diagrams and formulas (simple beam, uniformly distributed load), from memory.
				{"w(L/2)", at(e, tL/2).Deflection, -5 * tQ * math.Pow(tL, 4) / (384 * tEI)},
				{"M(L/2)", at(e, tL/2).BendingMoment, tQ * tL * tL / 8},
				{"V(0) > 0 by the sign convention", at(e, 0).ShearForce, tQ * tL / 2},
				{"θ(0)", at(e, 0).Rotation, -tQ * tL * tL * tL / (24 * tEI)},
			}
		},
	},
	{
		name: "fixed at both ends, uniform load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Fixed}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// M ends = −qL²/12, centre qL²/24, δ = qL⁴/384EI. Source: AISC Steel Construction
				// Manual, beam diagrams and formulas (beam fixed at both ends, uniform load), from memory.
				{"M(0)", at(e, 0).BendingMoment, -tQ * tL * tL / 12},
				{"M(L)", at(e, tL).BendingMoment, -tQ * tL * tL / 12},
				{"M(L/2)", at(e, tL/2).BendingMoment, tQ * tL * tL / 24},
				{"w(L/2)", at(e, tL/2).Deflection, -tQ * math.Pow(tL, 4) / (384 * tEI)},
				{"reaction moment at 0", reaction(e, 0, Rotation), tQ * tL * tL / 12},
			}
		},
	},
	{
		name: "fixed at both ends, off-centre load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Fixed}},
			PointLoads: []PointLoad{{X: 1, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			a, b := 1.0, tL-1
			return []check{
				// M1 = −Pab²/L², M2 = −Pa²b/L², R1 = Pb²(3a + b)/L³. Source: AISC Steel Construction
				// Manual, beam diagrams and formulas (fixed ends, concentrated load at any point), from memory.
				{"M(0)", at(e, 0).BendingMoment, -tP * a * b * b / (tL * tL)},
				{"M(L)", at(e, tL).BendingMoment, -tP * a * a * b / (tL * tL)},
				{"R1", reaction(e, 0, Transverse), tP * b * b * (3*a + b) / (tL * tL * tL)},
				{"M under the load", at(e, a).BendingMoment, 2 * tP * a * a * b * b / (tL * tL * tL)},
			}
		},
	},
	{
		name: "propped cantilever, uniform load",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Roller}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// R = 5qL/8 (fixed), 3qL/8 (prop), M(0) = −qL²/8, max sagging 9qL²/128 at 5L/8 from
				// the fixed end. Source: AISC Steel Construction Manual, beam diagrams and formulas
				// (beam fixed at one end, supported at other, uniform load), from memory.
				{"R fixed", reaction(e, 0, Transverse), 5 * tQ * tL / 8},
				{"R prop", reaction(e, 1, Transverse), 3 * tQ * tL / 8},
				{"M(0)", at(e, 0).BendingMoment, -tQ * tL * tL / 8},
				{"M(5L/8)", at(e, 5*tL/8).BendingMoment, 9 * tQ * tL * tL / 128},
				{"V(5L/8)/qL = 0", at(e, 5*tL/8).ShearForce / (tQ * tL), 0},
			}
		},
	},
	{
		name: "two equal continuous spans, uniform load",
		model: Model{Segments: member(2 * tL),
			Supports:        []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}, {X: 2 * tL, Kind: Roller}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, 2*tL, -tQ, -tQ)}},
		checks: func(e *Exact) []check {
			return []check{
				// R = 3qL/8, 10qL/8, 3qL/8, M over the middle support −qL²/8. Source: AISC Steel
				// Construction Manual, beam diagrams and formulas (continuous beam, two equal spans,
				// uniform load), from memory.
				{"R1", reaction(e, 0, Transverse), 3 * tQ * tL / 8},
				{"R2", reaction(e, 1, Transverse), 10 * tQ * tL / 8},
				{"R3", reaction(e, 2, Transverse), 3 * tQ * tL / 8},
				{"M(L)", at(e, tL).BendingMoment, -tQ * tL * tL / 8},
			}
		},
	},
	{
		name: "cantilever on a tip spring, end load",
		model: Model{Segments: member(tL),
			Supports:   []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Spring, Stiffness: [3]float64{0, tK, 0}}},
			PointLoads: []PointLoad{{X: tL, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			w := -tP / (tK + 3*tEI/(tL*tL*tL))
			return []check{
				// w = P/(k + 3EI/L³): the tip stiffness of the cantilever (Roark's Formulas for
				// Stress and Strain, Table 8.1, from memory) in parallel with the spring.
				{"w(L)", at(e, tL).Deflection, w},
				{"spring force", reaction(e, 1, Transverse), -tK * w},
			}
		},
	},
	{
		name: "bar fixed at one end, axial spring at the other, end load",
		model: Model{Segments: member(tL),
			Supports:   []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Spring, Stiffness: [3]float64{tK * 100, 0, 0}}},
			PointLoads: []PointLoad{{X: tL, Axial: tP}}},
		checks: func(e *Exact) []check {
			u := tP / (tK*100 + tEA/tL)
			return []check{
				// u = P/(k + EA/L): bar and spring in parallel. Source: textbook closed form
				// (Gere & Goodno, Mechanics of Materials, ch. 2), from memory.
				{"u(L)", at(e, tL).AxialDisplacement, u},
				{"spring force", reaction(e, 1, Axial), -tK * 100 * u},
			}
		},
	},
	{
		name: "cantilever on a spring support at the root, end load",
		model: Model{Segments: member(tL),
			Supports:   []Support{{X: 0, Kind: Spring, Stiffness: [3]float64{tK, tK, tK * 10}}},
			PointLoads: []PointLoad{{X: tL, Transverse: -tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// δ = P/k_w + PL²/k_θ + PL³/3EI: the translation and rotation of the root springs
				// in series with bending. Source: Roark's Formulas for Stress and Strain,
				// Table 8.1 (cantilever end load), from memory, plus statics.
				{"w(L)", at(e, tL).Deflection, -tP/tK - tP*tL*tL/(tK*10) - tP*tL*tL*tL/(3*tEI)},
				{"spring force", reaction(e, 0, Transverse), tP},
				{"spring moment", reaction(e, 0, Rotation), tP * tL},
			}
		},
	},
	{
		name: "simply supported, counter-clockwise moment at midspan",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Pinned}, {X: tL, Kind: Roller}},
			PointLoads: []PointLoad{{X: tL / 2, Moment: tP}}},
		checks: func(e *Exact) []check {
			return []check{
				// R1 = −R2 = C/L; M jumps from C/2 to −C/2 at the couple and w(L/2) = 0.
				// Source: Roark's Formulas for Stress and Strain, Table 8.1 (simple beam,
				// intermediate couple), from memory.
				{"R1", reaction(e, 0, Transverse), tP / tL},
				{"R2", reaction(e, 1, Transverse), -tP / tL},
				{"M left of the couple", e.At(tL/2, Left).BendingMoment, tP / 2},
				{"M right of the couple", e.At(tL/2, Right).BendingMoment, -tP / 2},
				{"w(L/2)/(CL²/EI)", at(e, tL/2).Deflection / (tP * tL * tL / tEI), 0},
			}
		},
	},
	{
		name: "propped cantilever, prop settles",
		model: Model{Segments: member(tL),
			Supports: []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Roller, Settlement: [3]float64{0, -tD, 0}}}},
		checks: func(e *Exact) []check {
			return []check{
				// The prop pulls the tip down by δ: R = 3EIδ/L³ downward, M(0) = −3EIδ/L² (hogging).
				// Source: Roark's Formulas for Stress and Strain, Table 8.1 (cantilever end load), from memory.
				{"w(L)", at(e, tL).Deflection, -tD},
				{"R prop", reaction(e, 1, Transverse), -3 * tEI * tD / (tL * tL * tL)},
				{"M(0)", at(e, 0).BendingMoment, -3 * tEI * tD / (tL * tL)},
			}
		},
	},
	{
		name: "cantilever under its own weight",
		model: Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
			Gravity: [2]float64{0, -StandardGravity}},
		checks: func(e *Exact) []check {
			q := 7850 * tA * StandardGravity
			return []check{
				// δ = qL⁴/8EI with q = ρ·A·g. Source: Roark's Formulas for Stress and Strain,
				// Table 8.1, cantilever with uniform load, from memory.
				{"w(L)", at(e, tL).Deflection, -q * math.Pow(tL, 4) / (8 * tEI)},
			}
		},
	},
}

// relTol fits a solution that is exact up to round-off.
const relTol = 1e-9

func TestExactHandbookCases(t *testing.T) {
	worst := 0.0
	for _, c := range exactCases {
		t.Run(c.name, func(t *testing.T) {
			e, err := SolveExact(&c.model)
			if err != nil {
				t.Fatalf("SolveExact: %v", err)
			}
			checks := c.checks(e)
			for _, k := range checks {
				rel := math.Abs(k.got - k.want)
				if k.want != 0 {
					rel /= math.Abs(k.want)
				}
				worst = math.Max(worst, rel)
				if !(rel <= relTol) {
					t.Errorf("%s = %.12g, want %.12g (relative error %.2g)", k.what, k.got, k.want, rel)
				}
			}
		})
	}
	t.Logf("largest relative error over all handbook checks: %.3g", worst)
}

// TestExactEquilibrium checks that the exact reactions balance every load of a
// model that uses all features at once (statics: ΣFx = ΣFy = ΣM = 0).
func TestExactEquilibrium(t *testing.T) {
	m := Model{
		Segments: member(6, 2.5),
		Supports: []Support{
			{X: 0, Kind: Pinned, Settlement: [3]float64{0.001, -0.002, 0}},
			{X: 3, Kind: Spring, Stiffness: [3]float64{1e7, 4e6, 2e6}},
			{X: 6, Kind: Roller, Settlement: [3]float64{0, 0.003, 0}},
		},
		PointLoads: []PointLoad{{X: 1.2, Axial: 7e3, Transverse: -9e3, Moment: 4e3}, {X: 4.4, Transverse: 2e3}},
		DistributedLoad: []DistributedLoad{
			{Direction: Transverse, Points: []LoadPoint{{0.5, -3e3}, {2, -6e3}, {5, -1e3}}},
			uniformLoad(Axial, 1, 6, 1e3, -2e3),
		},
		Gravity:           [2]float64{1.5, -StandardGravity},
		TemperatureChange: -25,
	}
	m.Segments[1].Section.SecondMoment = tI / 3
	m.Segments[1].Section.Area = tA / 2
	e, err := SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	// Applied resultants: point loads, then each linear piece of load by
	// Simpson's rule (exact for the quadratic x·q(x)), then self-weight.
	var applied [3]float64
	for _, p := range m.PointLoads {
		applied[0] += p.Axial
		applied[1] += p.Transverse
		applied[2] += p.Moment + p.X*p.Transverse
	}
	for _, d := range m.DistributedLoad {
		for i := 0; i+1 < len(d.Points); i++ {
			a, b := d.Points[i], d.Points[i+1]
			h, xm, qm := b.X-a.X, (a.X+b.X)/2, (a.Intensity+b.Intensity)/2
			force := h * qm
			moment := h / 6 * (a.X*a.Intensity + 4*xm*qm + b.X*b.Intensity)
			if d.Direction == Axial {
				applied[0] += force
			} else {
				applied[1] += force
				applied[2] += moment
			}
		}
	}
	for _, s := range m.Segments {
		w := s.Material.Density * s.Section.Area * (s.End - s.Start)
		applied[0] += w * m.Gravity[0]
		applied[1] += w * m.Gravity[1]
		applied[2] += w * m.Gravity[1] * (s.Start + s.End) / 2
	}
	residual, scale := applied, [3]float64{}
	for _, r := range e.Reactions() {
		residual[0] += r.Force[0]
		residual[1] += r.Force[1]
		residual[2] += r.Force[2] + r.X*r.Force[1]
		for d := range scale {
			scale[d] = math.Max(scale[d], math.Abs(r.Force[d]))
		}
	}
	for d, name := range []string{"ΣFx", "ΣFy", "ΣM about x = 0"} {
		ref := math.Max(math.Abs(applied[d]), scale[d])
		if math.Abs(residual[d]) > relTol*ref {
			t.Errorf("%s = %.6g with loads and reactions of size %.6g", name, residual[d], ref)
		}
	}
	// The settlements are met exactly.
	for _, c := range []check{
		{"u(0)", e.At(0, Right).AxialDisplacement, 0.001},
		{"w(0)", e.At(0, Right).Deflection, -0.002},
		{"w(6)", e.At(6, Left).Deflection, 0.003},
	} {
		if math.Abs(c.got-c.want) > relTol*math.Abs(c.want) {
			t.Errorf("%s = %.12g, want the settlement %.12g", c.what, c.got, c.want)
		}
	}
}

// TestExactContinuity checks that u, w and θ do not jump at key points while
// N, V and M jump by the point actions there, on the model above's kind of
// mixture (the jump conditions restate the sign convention of the rules).
func TestExactContinuity(t *testing.T) {
	const C, F, H = 3e3, -8e3, 2e3 // N·m, N, N
	m := Model{Segments: member(5, 2), Supports: []Support{{X: 0, Kind: Fixed}, {X: 5, Kind: Pinned}},
		PointLoads:      []PointLoad{{X: 2, Axial: H, Transverse: F, Moment: C}},
		DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, 5, -1e3, -4e3)}}
	m.Segments[1].Section.SecondMoment = tI * 2
	e, err := SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	l, r := e.At(2, Left), e.At(2, Right)
	for _, c := range []check{
		{"u jump", r.AxialDisplacement - l.AxialDisplacement, 0},
		{"w jump", r.Deflection - l.Deflection, 0},
		{"θ jump", r.Rotation - l.Rotation, 0},
		// Jumps from equilibrium of a short piece around the load, with the
		// conventions of the rules: N⁺ − N⁻ = −H, V⁺ − V⁻ = F, M⁺ − M⁻ = −C.
		{"N jump", r.AxialForce - l.AxialForce, -H},
		{"V jump", r.ShearForce - l.ShearForce, F},
		{"M jump", r.BendingMoment - l.BendingMoment, -C},
	} {
		ref := math.Max(math.Abs(c.want), math.Abs(l.Deflection)+math.Abs(l.Rotation)+math.Abs(l.AxialDisplacement))
		if math.Abs(c.got-c.want) > relTol*ref {
			t.Errorf("%s = %.6g, want %.6g", c.what, c.got, c.want)
		}
	}
}

func TestExactRejectsMechanisms(t *testing.T) {
	for _, c := range []struct {
		name     string
		supports []Support
		words    string
	}{
		{"no axial restraint", []Support{{X: 0, Kind: Roller}, {X: tL, Kind: Roller}}, "slide along its axis"},
		{"no deflection restraint", []Support{{X: 0, Kind: Guided}}, "move sideways"},
		{"one pin only", []Support{{X: 1, Kind: Pinned}}, "rotate about the support at x = 1"},
	} {
		t.Run(c.name, func(t *testing.T) {
			m := Model{Segments: member(tL), Supports: c.supports, PointLoads: []PointLoad{{X: tL / 2, Transverse: -tP}}}
			_, err := SolveExact(&m)
			if err == nil || !strings.Contains(err.Error(), c.words) {
				t.Fatalf("SolveExact error = %v, want one saying %q", err, c.words)
			}
		})
	}
}

// The scaled formulation must stay accurate for stiff springs and long
// members with many stretches.
func TestExactConditioning(t *testing.T) {
	t.Run("very stiff tip spring acts as a prop", func(t *testing.T) {
		const k = 1e18 // N/m, 1e13 times the cantilever's tip stiffness 3EI/L³
		m := Model{Segments: member(tL),
			Supports:        []Support{{X: 0, Kind: Fixed}, {X: tL, Kind: Spring, Stiffness: [3]float64{0, k, 0}}},
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, tL, -tQ, -tQ)}}
		e, err := SolveExact(&m)
		if err != nil {
			t.Fatal(err)
		}
		// Propped cantilever, prop force 3qL/8, softened by the spring's compliance
		// 3EI/(kL³) ≈ 1e-13. Source: AISC Steel Construction Manual, beam diagrams and
		// formulas (beam fixed at one end, supported at other), from memory.
		if got, want := reaction(e, 1, Transverse), 3*tQ*tL/8; math.Abs(got-want) > relTol*want {
			t.Errorf("spring force %.12g, want the prop force %.12g", got, want)
		}
	})
	t.Run("very soft end springs", func(t *testing.T) {
		const k = 1.0 // N/m
		soft := Support{Kind: Spring, Stiffness: [3]float64{k, k, 0}}
		m := Model{Segments: member(tL), Supports: []Support{soft, soft},
			PointLoads: []PointLoad{{X: tL / 2, Transverse: -tP}}}
		m.Supports[1].X = tL
		e, err := SolveExact(&m)
		if err != nil {
			t.Fatal(err)
		}
		// Rigid settlement P/2k of both springs plus the simple-beam deflection PL³/48EI.
		// Source: AISC Steel Construction Manual, beam diagrams and formulas (simple beam,
		// concentrated load at centre), from memory, plus statics.
		if got, want := at(e, tL/2).Deflection, -tP/(2*k)-tP*tL*tL*tL/(48*tEI); math.Abs(got-want) > relTol*math.Abs(want) {
			t.Errorf("w(L/2) %.15g, want %.15g", got, want)
		}
		if got, want := at(e, tL/2).BendingMoment, tP*tL/4; math.Abs(got-want) > relTol*want {
			t.Errorf("M(L/2) %.12g, want %.12g", got, want)
		}
	})
	t.Run("fifty continuous spans of 20 m", func(t *testing.T) {
		const spans, span = 50, 20.0
		sup := []Support{{X: 0, Kind: Pinned}}
		for i := 1; i <= spans; i++ {
			sup = append(sup, Support{X: span * float64(i), Kind: Roller})
		}
		m := Model{Segments: member(spans * span), Supports: sup,
			DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, spans*span, -tQ, -tQ)}}
		e, err := SolveExact(&m)
		if err != nil {
			t.Fatal(err)
		}
		// Far from the ends every span acts as fixed at both ends (the end effect
		// decays like (2 − √3)^k per span): reaction qL and support moment −qL²/12.
		// Source: AISC Steel Construction Manual, beam diagrams and formulas (beam
		// fixed at both ends, uniform load), from memory.
		mid := spans / 2
		if got, want := reaction(e, mid, Transverse), tQ*span; math.Abs(got-want) > relTol*want {
			t.Errorf("middle reaction %.12g, want %.12g", got, want)
		}
		if got, want := at(e, span*float64(mid)).BendingMoment, -tQ*span*span/12; math.Abs(got-want) > relTol*math.Abs(want) {
			t.Errorf("middle support moment %.12g, want %.12g", got, want)
		}
	})
}

// At never panics: outside the member it clamps, NaN gives NaN, and the zero
// Exact gives empty fields.
func TestExactAtEdges(t *testing.T) {
	m := Model{Segments: member(tL), Supports: []Support{{X: 0, Kind: Fixed}},
		PointLoads: []PointLoad{{X: tL, Transverse: -tP}}}
	e, err := SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := e.At(tL+1, Right).Deflection, e.At(tL, Left).Deflection; got != want {
		t.Errorf("beyond the end: w = %g, want the end value %g", got, want)
	}
	if got, want := e.At(-1, Left).BendingMoment, e.At(0, Right).BendingMoment; got != want {
		t.Errorf("before the start: M = %g, want the end value %g", got, want)
	}
	if got := e.At(math.NaN(), Right).Deflection; !math.IsNaN(got) {
		t.Errorf("At(NaN) deflection = %g, want NaN", got)
	}
	var zero Exact
	if got := zero.At(1, Right); got != (Fields{X: 1}) {
		t.Errorf("zero Exact: At = %+v, want empty fields", got)
	}
}

// BenchmarkSolveExact times a member with 100 stretches (101 supports).
func BenchmarkSolveExact(b *testing.B) {
	sup := []Support{{X: 0, Kind: Pinned}}
	for i := 1; i <= 100; i++ {
		sup = append(sup, Support{X: float64(i), Kind: Roller})
	}
	m := Model{Segments: member(100), Supports: sup,
		DistributedLoad: []DistributedLoad{uniformLoad(Transverse, 0, 100, -tQ, -2*tQ)}}
	for b.Loop() {
		if _, err := SolveExact(&m); err != nil {
			b.Fatal(err)
		}
	}
}
