package fem_test

import (
	"math"
	"testing"

	"stave/fem"
)

// A point load a tiny distance a from a support, hinge, spring, segment
// break, distributed load's end or the member's end splits off a stretch
// of length a. Its equations were written in constants that carry a^k
// (t = (x − start)/a), so beside a span of metres they made equations of
// condition 7e14 at a = 1e-10 m: the exact solution refused the model
// between a ≈ 1e-11 and 1e-9 m (from 1e-6 m for a load at a cantilever's
// tip), and the headline fell back to the finite element answer with a
// condition caution and exit status 3. The answers must instead follow
// the closed forms over the whole sweep, from loads merged into the item
// (a below 1e-12 of the length) to a millimetre away, with no warning.
// The model is invented: a steel member of 8 m, I = 8e-6 m⁴.
func TestLoadsNearItems(t *testing.T) {
	const (
		S  = 8.0                   // m, the member
		L  = S / 2                 // m, one of two equal spans
		E  = 2e11                  // Pa
		I  = 8e-6                  // m⁴
		EI = E * I                 // N·m²
		P  = -1e4                  // N, a transverse force (downward)
		C  = 2e4                   // N·m, a counter-clockwise moment
		Px = 1e4                   // N, an axial force
		q  = -1e4                  // N/m
		k  = 48 * EI / (S * S * S) // N/m, the spring: as stiff as the simply supported span at its middle
	)
	segment := func(start, end, i float64) fem.Segment {
		return fem.Segment{Start: start, End: end, Section: fem.Section{Area: 0.004, SecondMoment: i, FibreDistance: 0.1}, Material: fem.Material{Elastic: E}}
	}
	whole := []fem.Segment{segment(0, S, I)}
	twoSpans := []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}, {X: S, Kind: fem.Roller}}
	simple := []fem.Support{{X: 0, Kind: fem.Pinned}, {X: S, Kind: fem.Roller}}
	// simpleFlex is the deflection at d ≤ S/2 from an end of the simply
	// supported member under a unit force at its middle, d·(3S² − 4d²)/(48EI)
	// (AISC Steel Construction Manual, Table 3-23, simple beam, concentrated
	// load at center, from memory); by Maxwell's reciprocal theorem also the
	// deflection at the middle under a unit force at d.
	simpleFlex := func(d float64) float64 { return d * (3*S*S - 4*d*d) / (48 * EI) }
	type reaction = [3]float64 // axial, transverse, moment (counter-clockwise)
	for _, c := range []struct {
		name  string
		at    float64 // m, the item
		sides []float64
		model func(x float64) fem.Model
		want  func(x float64) []reaction
		force float64 // N, the scale of the forces; moments are compared on force·S
		// extra is one more field against its closed form, compared on
		// scale.
		extra   func(e *fem.Exact, x float64) (got, want, scale float64)
		quality string
	}{
		{
			// Two equal spans l, a force P at a from the outer support of
			// its span and b from the middle one: R_outer = P·b·(4l² −
			// a(l + a))/(4l³), R_middle = P·a·(2l² + b(l + a))/(2l³), R_far
			// = −P·a·b·(l + a)/(4l³), and the moment over the middle
			// support −P·a·b·(l + a)/(4l²) (AISC Steel Construction Manual,
			// Table 3-23, continuous beam, two equal spans, concentrated
			// load at any point, from memory; the three-moment equation
			// gives the same).
			name: "force by the middle support of two spans", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: twoSpans, PointLoads: []fem.PointLoad{{X: x, Transverse: P}}}
			},
			want: func(x float64) []reaction {
				b := math.Abs(x - L)
				a := L - b
				down := -P
				outer := down * b * (4*L*L - a*(L+a)) / (4 * L * L * L)
				middle := down * a * (2*L*L + b*(L+a)) / (2 * L * L * L)
				far := -down * a * b * (L + a) / (4 * L * L * L)
				if x > L {
					outer, far = far, outer
				}
				return []reaction{{0, outer, 0}, {0, middle, 0}, {0, far, 0}}
			},
			force: -P,
			extra: func(e *fem.Exact, x float64) (float64, float64, float64) {
				b := math.Abs(x - L)
				a := L - b
				return e.At(L, fem.Left).BendingMoment, P * a * b * (L + a) / (4 * L * L), -P * L
			},
			quality: "bending moment over the middle support",
		},
		{
			// A counter-clockwise moment C at ξ on two equal spans: without
			// the middle support the middle deflects by −C·θ(ξ), θ the
			// slope at ξ under a unit downward force at the middle
			// (Maxwell–Betti), θ = ∓(3S² − 12d²)/(48EI) with d the
			// distance of ξ from the nearer end (the derivative of
			// simpleFlex); the middle support takes R = C·θ(ξ)/f, f =
			// S³/(48EI) (simpleFlex(S/2)), and the ends the rest by statics.
			name: "moment by the middle support of two spans", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: twoSpans, PointLoads: []fem.PointLoad{{X: x, Moment: C}}}
			},
			want: func(x float64) []reaction {
				d := min(x, S-x)
				slope := (3*S*S - 12*d*d) / (48 * EI)
				if x < L {
					slope = -slope
				}
				middle := C * slope / simpleFlex(L)
				far := -(C + L*middle) / S
				return []reaction{{0, -middle - far, 0}, {0, middle, 0}, {0, far, 0}}
			},
			force: C / S,
		},
		{
			// Fixed at 0, a hinge at L, a roller at S: the part beyond the
			// hinge is simply supported on the hinge and the roller, the
			// rest a cantilever (statics).
			name: "force by a hinge", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: S, Kind: fem.Roller}},
					Hinges: []fem.Hinge{{X: L}}, PointLoads: []fem.PointLoad{{X: x, Transverse: P}}}
			},
			want: func(x float64) []reaction {
				roller := 0.0
				if x > L {
					roller = -P * (x - L) / (S - L)
				}
				return []reaction{{0, -P - roller, -x*P - S*roller}, {0, roller, 0}}
			},
			force: -P,
		},
		{
			// A spring support of stiffness k at the middle of a simply
			// supported member: it takes R = −k·w₀/(1 + k·f), w₀ = P·f(d)
			// the middle's deflection without it (simpleFlex and Maxwell's
			// theorem), f = simpleFlex(S/2); the ends the rest by statics.
			name: "force by a spring support", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: []fem.Support{simple[0], {X: L, Kind: fem.Spring, Stiffness: [3]float64{0, k, 0}}, simple[1]},
					PointLoads: []fem.PointLoad{{X: x, Transverse: P}}}
			},
			want: func(x float64) []reaction {
				spring := -k * P * simpleFlex(min(x, S-x)) / (1 + k*simpleFlex(L))
				end := -(x*P + L*spring) / S
				return []reaction{{0, -P - spring - end, 0}, {0, spring, 0}, {0, end, 0}}
			},
			force: -P,
		},
		{
			// Simply supported, its second half twice as stiff: the
			// reactions are statics'.
			name: "force by a segment break", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: []fem.Segment{segment(0, L, I), segment(L, S, 2*I)}, Supports: simple,
					PointLoads: []fem.PointLoad{{X: x, Transverse: P}}}
			},
			want: func(x float64) []reaction {
				return []reaction{{0, -P * (S - x) / S, 0}, {0, -P * x / S, 0}}
			},
			force: -P,
		},
		{
			// Simply supported, q on the first half (statics).
			name: "force by a distributed load's end", at: L, sides: []float64{1, -1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: simple, PointLoads: []fem.PointLoad{{X: x, Transverse: P}},
					DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: L, Intensity: q}}}}}
			},
			want: func(x float64) []reaction {
				end := -(x*P + q*L*L/2) / S
				return []reaction{{0, -P - q*L - end, 0}, {0, end, 0}}
			},
			force: -P,
		},
		{
			// A cantilever fixed at 0, a force at x by its free end: R = −P,
			// M = −x·P (statics), tip deflection P·x²·(3S − x)/(6EI) (AISC
			// Steel Construction Manual, Table 3-23, cantilever beam,
			// concentrated load at any point, from memory).
			name: "force by the free end of a cantilever", at: S, sides: []float64{-1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}}, PointLoads: []fem.PointLoad{{X: x, Transverse: P}}}
			},
			want:  func(x float64) []reaction { return []reaction{{0, -P, -x * P}} },
			force: -P,
			extra: func(e *fem.Exact, x float64) (float64, float64, float64) {
				want := P * x * x * (3*S - x) / (6 * EI)
				return e.At(S, fem.Left).Deflection, want, math.Abs(want)
			},
			quality: "tip deflection",
		},
		{
			// A bar held along its axis at both ends, an axial force at x:
			// the ends take −P·(S − x)/S and −P·x/S (statics and
			// compatibility of a uniform bar, from memory).
			name: "axial force by a support at the member's end", at: 0, sides: []float64{1},
			model: func(x float64) fem.Model {
				return fem.Model{Segments: whole, Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: S, Kind: fem.Pinned}}, PointLoads: []fem.PointLoad{{X: x, Axial: Px}}}
			},
			want: func(x float64) []reaction {
				return []reaction{{-Px * (S - x) / S, 0, 0}, {-Px * x / S, 0, 0}}
			},
			force: Px,
		},
	} {
		for _, side := range c.sides {
			for _, a := range []float64{1e-14, 1e-13, 1e-12, 1e-11, 1e-10, 1e-9, 1e-8, 1e-7, 1e-6, 1e-5, 1e-4, 1e-3} {
				x := c.at + side*a
				m := c.model(x)
				e, err := fem.SolveExact(&m)
				if err != nil {
					t.Errorf("%s, a = %g m on the %+g side: %v", c.name, a, side, err)
					continue
				}
				if w := e.Warning(); w != "" {
					t.Errorf("%s, a = %g m on the %+g side: %s", c.name, a, side, w)
				}
				for i, r := range e.Reactions() {
					want := c.want(x)[i]
					for d := range want {
						scale := c.force
						if d == int(fem.Rotation) {
							scale *= S
						}
						err := math.Abs(r.Force[d]-want[d]) / scale
						if !(err <= 1e-11) {
							t.Errorf("%s, a = %g m on the %+g side: support %d, reaction %d: %.15g, closed form %.15g (off by %.2g of the load)",
								c.name, a, side, i+1, d, r.Force[d], want[d], err)
						}
					}
				}
				if c.extra != nil {
					got, want, scale := c.extra(e, x)
					err := math.Abs(got-want) / scale
					if !(err <= 1e-11) {
						t.Errorf("%s, a = %g m on the %+g side: %s %.15g, closed form %.15g (off by %.2g of its scale)", c.name, a, side, c.quality, got, want, err)
					}
				}
			}
		}
	}
}
