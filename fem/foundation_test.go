package fem

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"sync"
	"testing"
)

// groundModel is the test steel member of length L on a foundation of
// modulus k across it along its whole length, held along its axis at the
// middle (the foundation holds it across).
func groundModel(L, k float64) *Model {
	return &Model{
		Segments:    []Segment{testSegment(0, L)},
		Supports:    []Support{{X: L / 2, Kind: AxialOnly}},
		Foundations: []Foundation{{Start: 0, End: L, Modulus: k}},
	}
}

// A point load P on a long beam on an elastic foundation: far from the
// ends, w = −P·β/(2k)·e^(−βξ)·(cos βξ + sin βξ), M = P/(4β)·e^(−βξ)·(cos βξ
// − sin βξ) and |V| = P/2·e^(−βξ)·cos βξ at ξ = |x − a| from the load,
// β = (k/4EI)^¼ (Hetényi, Beams on Elastic Foundation, 1946, the infinite
// beam; also Roark's Formulas for Stress and Strain, beams on elastic
// foundations; from memory). With β·L/2 = 21 the ends change these by
// about e^(−21) ≈ 8e-10 of their size. The exact solution must give them to
// round-off whatever basis its stretches take (the stretches either side
// of the load are long: decaying exponentials; the FE mesh's own points do
// not matter to it); the default mesh within its stated accuracy.
func TestLongBeamOnFoundationPointLoad(t *testing.T) {
	ei := testE * testI
	const k = 6.4e6 // N/m²: β = (6.4e6/(4·1.6e7))^¼ = 0.5623 /m
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	L := 42 / beta
	const P = 80e3 // N, down
	m := groundModel(L, k)
	m.PointLoads = []PointLoad{{X: L / 2, Transverse: -P}}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	s := mustSolve(t, m)
	wScale, mScale, vScale := P*beta/(2*k), P/(4*beta), P/2
	for _, xi := range []float64{0, 0.3, 1, 2.5, 4, 7} {
		decay := math.Exp(-beta * xi)
		c, sn := math.Cos(beta*xi), math.Sin(beta*xi)
		w := -wScale * decay * (c + sn)
		mo := mScale * decay * (c - sn)
		v := vScale * decay * c
		for _, x := range []float64{L/2 - xi, L/2 + xi} {
			side, sign := Left, 1.0 // V = +P/2 just left of a downward load, −P/2 right of it
			if x > L/2 || xi == 0 && x == L/2 {
				side, sign = Right, -1
			}
			if xi == 0 && x < L/2 {
				continue
			}
			f := e.At(x, side)
			if math.Abs(f.Deflection-w) > 1e-9*wScale || math.Abs(f.BendingMoment-mo) > 1e-9*mScale || math.Abs(f.ShearForce-sign*v) > 1e-9*vScale {
				t.Errorf("exact at x = %.4g: w %.12g M %.12g V %.12g, want %.12g %.12g %.12g", x, f.Deflection, f.BendingMoment, f.ShearForce, w, mo, sign*v)
			}
			g := s.At(x, side)
			if math.Abs(g.Deflection-w) > MeshAccuracy*wScale || math.Abs(g.BendingMoment-mo) > MeshAccuracy*mScale {
				t.Errorf("FE (default mesh) at x = %.4g: w %.6g M %.6g, want %.6g %.6g within %.1f %% of the extremes", x, g.Deflection, g.BendingMoment, w, mo, 100*MeshAccuracy)
			}
		}
	}
	// The foundation carries the whole load: its resultant is P up, acting
	// under the load. The FE one is as good as its solve: within the
	// round-off its condition number allows (Solution.Condition).
	roundOff := max(1e-9, 4*s.Condition*0x1p-52)
	for name, rs := range map[string][]FoundationReaction{"FE": s.Foundations, "exact": e.Foundations()} {
		if len(rs) != 1 || relErr(rs[0].Force[1], P) > roundOff || relErr(rs[0].Centre(), L/2) > roundOff {
			t.Errorf("%s foundation reaction %+v, want %.6g N at x = %.6g m", name, rs, P, L/2)
		}
	}
	if r := s.Equilibrium.Residual; math.Abs(r[1]) > roundOff*P || math.Abs(r[2]) > roundOff*P*L {
		t.Errorf("FE equilibrium residual %v beyond %.2g relative", r, roundOff)
	}
}

// More of Hetényi's closed forms (Beams on Elastic Foundation, 1946; also
// Roark's Formulas for Stress and Strain, beams on elastic foundations;
// from memory), β = (k/4EI)^¼:
//   - a free beam of length L with a central load P: under it
//     w = −Pβ/(2k)·(cosh βL + cos βL + 2)/(sinh βL + sin βL) and
//     M = P/(4β)·(cosh βL − cos βL)/(sinh βL + sin βL), from nearly rigid
//     (βL = 0.3, w → −P/(kL), M → PL/8) to long (βL = 6), across both bases
//     of the exact solution (series up to λ = 2 per stretch, decaying beyond);
//   - a semi-infinite beam (βL = 34) under a load P at its free end:
//     w(0) = −2Pβ/k, θ(0) = 2Pβ²/k; under a counter-clockwise moment C
//     there: w(0) = −2Cβ²/k, θ(0) = 4Cβ³/k;
//   - a foundation under part of the member: the same beam with an
//     overhang c off the foundation, loaded at its tip: the overhang hands
//     the beam P and P·c, and the tip sinks by w(c) − θ(c)·c − Pc³/(3EI);
//   - foundations with supports: a long beam held across at its middle
//     and loaded at a from there takes R = −P·e^(−βa)·(cos βa + sin βa) at
//     the support (the load's deflection there cancelled by R's); the same
//     support settling by Δ with no load takes R = 2kΔ/β, and the moment
//     over it is −R/(4β);
//   - a hinge under a load on a long beam: each side is a semi-infinite
//     beam loaded at its end by P/2, so w = 2(P/2)β/k = Pβ/k, twice the
//     continuous beam's;
//   - a spring kₛ across the loaded end of a semi-infinite beam: the end
//     takes P on the spring and the beam, whose end stiffness is k/(2β)
//     (the first item), so w(0) = P/(kₛ + k/(2β));
//   - a free beam of length L with a load P at one end (hetenyiFreeEnd),
//     from nearly rigid (w(0) → 4P/(kL)) to long (w(0) → 2Pβ/k), on
//     either side of the switch between the bases (βL = 3.9 and 4.1: λ
//     of each half about groundSeriesLimit);
//   - a simply supported beam (pinned and roller at its ends) on the
//     foundation under a uniform load q: at midspan
//     w = q/k·(1 − 2·cosh(λ/2)·cos(λ/2)/(cosh λ + cos λ)) and
//     M = −q/β²·sinh(λ/2)·sin(λ/2)/(cosh λ + cos λ), which tend to
//     5qL⁴/(384EI) and −qL²/8 as λ → 0;
//   - a long beam under a counter-clockwise couple C at its middle: there
//     θ = Cβ³/k and M = ±C/2 just left and right (M jumps by −C), and at
//     ξ beyond it w = Cβ²/k·e^(−βξ)·sin βξ.
func TestHetenyiClosedForms(t *testing.T) {
	const k, P, C, c, a, settle, spring = 6.4e6, -8e4, 3e4, 2.0, 2.0, -5e-3, 4e6
	ei := testE * testI
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	type want struct {
		what      string
		got, want float64
	}
	type row struct {
		name  string
		model func() *Model
		check func(e *Exact) []want
	}
	var rows []row
	for _, bl := range []float64{0.3, 1.5, 3, 6} {
		L := bl / beta
		rows = append(rows, row{fmt.Sprintf("free beam, βL = %g, central load", bl), func() *Model {
			m := groundModel(L, k)
			m.PointLoads = []PointLoad{{X: L / 2, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			f := e.At(L/2, Right)
			d := math.Sinh(bl) + math.Sin(bl)
			return []want{{"w under the load", f.Deflection, P * beta / (2 * k) * (math.Cosh(bl) + math.Cos(bl) + 2) / d},
				{"M under the load", f.BendingMoment, -P / (4 * beta) * (math.Cosh(bl) - math.Cos(bl)) / d}}
		}})
	}
	for _, bl := range []float64{0.05, 0.5, 3.9, 4.1, 9} { // two stretches of βL/2 (the axial support at L/2)
		L := bl / beta
		rows = append(rows, row{fmt.Sprintf("free beam, βL = %g, load at its end", bl), func() *Model {
			m := groundModel(L, k)
			m.PointLoads = []PointLoad{{X: 0, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			return []want{{"w(0)", e.At(0, Right).Deflection, hetenyiFreeEnd(P, k, beta, L)}}
		}})
	}
	for _, bl := range []float64{0.5, 2, 5, 12} {
		L := bl / beta
		rows = append(rows, row{fmt.Sprintf("simply supported, βL = %g, uniform load", bl), func() *Model {
			m := groundModel(L, k)
			m.Supports = []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}}
			m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, P}, {L, P}}}}
			return m
		}, func(e *Exact) []want {
			f := e.At(L/2, Right)
			d := math.Cosh(bl) + math.Cos(bl)
			return []want{{"w at midspan", f.Deflection, P / k * (1 - 2*math.Cosh(bl/2)*math.Cos(bl/2)/d)},
				{"M at midspan", f.BendingMoment, -P / (beta * beta) * math.Sinh(bl/2) * math.Sin(bl/2) / d}}
		}})
	}
	long := 34 / beta
	rows = append(rows, row{"long beam, couple at its middle", func() *Model {
		m := groundModel(2*long, k)
		m.PointLoads = []PointLoad{{X: long, Moment: C}}
		return m
	}, func(e *Exact) []want {
		const xi = 1.3
		return []want{{"θ under the couple", e.At(long, Right).Rotation, C * beta * beta * beta / k},
			{"M just left", e.At(long, Left).BendingMoment, C / 2}, {"M just right", e.At(long, Right).BendingMoment, -C / 2},
			{"w beyond it", e.At(long+xi, Right).Deflection, C * beta * beta / k * math.Exp(-beta*xi) * math.Sin(beta*xi)}}
	}})
	rows = append(rows, []row{
		{"semi-infinite beam, load at its end", func() *Model {
			m := groundModel(long, k)
			m.PointLoads = []PointLoad{{X: 0, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			f := e.At(0, Right)
			return []want{{"w(0)", f.Deflection, 2 * P * beta / k}, {"θ(0)", f.Rotation, -2 * P * beta * beta / k}}
		}},
		{"semi-infinite beam, moment at its end", func() *Model {
			m := groundModel(long, k)
			m.PointLoads = []PointLoad{{X: 0, Moment: C}}
			return m
		}, func(e *Exact) []want {
			f := e.At(0, Right)
			return []want{{"w(0)", f.Deflection, -2 * C * beta * beta / k}, {"θ(0)", f.Rotation, 4 * C * beta * beta * beta / k}}
		}},
		{"overhang off the foundation, load at its tip", func() *Model {
			m := groundModel(c+long, k)
			m.Foundations[0].Start = c
			m.PointLoads = []PointLoad{{X: 0, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			// At the foundation's start the overhang hands the beam P down
			// and the moment −P·c counter-clockwise (P < 0 is down).
			wc := 2*P*beta/k + 2*P*c*beta*beta/k
			tc := -2*P*beta*beta/k - 4*P*c*beta*beta*beta/k
			return []want{{"w at the foundation's start", e.At(c, Right).Deflection, wc},
				{"w at the tip", e.At(0, Right).Deflection, wc - tc*c + P*c*c*c/(3*ei)}}
		}},
		{"support at the middle, load beside it", func() *Model {
			m := groundModel(long, k)
			m.Supports[0].Kind = Pinned
			m.PointLoads = []PointLoad{{X: long/2 + a, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			return []want{{"support's reaction", e.Reactions()[0].Force[Transverse], -P * math.Exp(-beta*a) * (math.Cos(beta*a) + math.Sin(beta*a))},
				{"ground's resultant", e.Foundations()[0].Force[Transverse], -P * (1 - math.Exp(-beta*a)*(math.Cos(beta*a)+math.Sin(beta*a)))}}
		}},
		{"support at the middle settling", func() *Model {
			m := groundModel(long, k)
			m.Supports[0].Kind = Pinned
			m.Supports[0].Settlement[Transverse] = settle
			return m
		}, func(e *Exact) []want {
			r := 2 * k * settle / beta // down, pulling the beam with it
			return []want{{"support's reaction", e.Reactions()[0].Force[Transverse], r}, {"M over it", e.At(long/2, Right).BendingMoment, -r / (4 * beta)}}
		}},
		{"hinge under a load", func() *Model {
			m := groundModel(long, k)
			m.Hinges = []Hinge{{X: long / 2}}
			m.PointLoads = []PointLoad{{X: long / 2, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			return []want{{"w under the load", e.At(long/2, Right).Deflection, P * beta / k}}
		}},
		{"spring at the loaded end", func() *Model {
			m := groundModel(long, k)
			m.Supports = append(m.Supports, Support{X: 0, Kind: Spring, Stiffness: [3]float64{Transverse: spring}})
			m.PointLoads = []PointLoad{{X: 0, Transverse: P}}
			return m
		}, func(e *Exact) []want {
			w := P / (spring + k/(2*beta))
			return []want{{"w(0)", e.At(0, Right).Deflection, w}, {"spring's reaction", e.Reactions()[1].Force[Transverse], -spring * w}}
		}},
	}...)
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			e, err := SolveExact(r.model())
			if err != nil {
				t.Fatal(err)
			}
			for _, w := range r.check(e) {
				if relErr(w.got, w.want) > 1e-9 {
					t.Errorf("%s %.12g, want %.12g", w.what, w.got, w.want)
				}
			}
		})
	}
}

// A free beam of any length on an elastic foundation under a uniform load q
// settles uniformly by q/k and does not bend (Hetényi, 1946, from memory:
// the foundation's pressure matches the load point by point). The
// Hermite element with the consistent foundation stiffness holds a uniform
// deflection exactly, so FE and exact agree with it to round-off, and the
// foundation carries q·L.
func TestFreeBeamOnFoundationUniformLoad(t *testing.T) {
	const L, q = 9.0, -25e3
	for _, k := range []float64{1e3, 2e6, 5e8} { // λ = β·L from 0.4 to 28: both bases
		t.Run(fmt.Sprintf("k = %.0e", k), func(t *testing.T) {
			m := groundModel(L, k)
			m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, q}, {L, q}}}}
			m.Mesh = MeshSettings{Elements: 12}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			s := mustSolve(t, m)
			for name, f := range map[string]Field{"FE": s, "exact": e} {
				for _, x := range []float64{0, 1.7, L / 2, 8.2, L} {
					got := f.At(x, Right)
					if relErr(got.Deflection, q/k) > 1e-9 || math.Abs(got.BendingMoment) > 1e-9*math.Abs(q)*L*L || math.Abs(got.ShearForce) > 1e-9*math.Abs(q)*L {
						t.Errorf("%s at x = %g: w %.10g (want %.10g), M %.3g, V %.3g (want 0)", name, x, got.Deflection, q/k, got.BendingMoment, got.ShearForce)
					}
				}
			}
			for name, rs := range map[string][]FoundationReaction{"FE": s.Foundations, "exact": e.Foundations()} {
				if relErr(rs[0].Force[1], -q*L) > 1e-9 || relErr(rs[0].Centre(), L/2) > 1e-9 {
					t.Errorf("%s foundation reaction %+v, want %.6g N at x = %g m", name, rs[0], -q*L, L/2)
				}
			}
		})
	}
}

// A pile held along its shaft by elastic skin friction kₐ and pushed at its
// head by P, its tip free: u = P·cosh(α(L − x))/(EA·α·sinh αL) and N =
// −P·sinh(α(L − x))/sinh αL, α = (kₐ/EA)^½, so the head settles by
// P/(EA·α·tanh αL) (the bar on an elastic axial foundation, the
// load-transfer solution for a floating pile; e.g. Fleming et al., Piling
// Engineering, from memory). αL runs from 0.1 (series) to 30 (decaying
// exponentials).
func TestPileWithSkinFriction(t *testing.T) {
	const L, P = 15.0, 400e3
	ea := testE * testA
	for _, aL := range []float64{0.1, 1.9, 2.1, 8, 30} {
		t.Run(fmt.Sprintf("αL = %g", aL), func(t *testing.T) {
			alpha := aL / L
			ka := alpha * alpha * ea
			m := &Model{
				Segments:    []Segment{testSegment(0, L)},
				Foundations: []Foundation{{Start: 0, End: L, AxialModulus: ka}},
				PointLoads:  []PointLoad{{X: 0, Axial: P}},
				Mesh:        MeshSettings{Elements: 400},
			}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			s := mustSolve(t, m)
			if !s.AxialOnly {
				t.Errorf("a pile under an axial load alone was solved with bending")
			}
			head := P / (ea * alpha * math.Tanh(aL))
			for _, x := range []float64{0, 0.2 * L, 0.5 * L, 0.9 * L, L} {
				u := P * math.Cosh(alpha*(L-x)) / (ea * alpha * math.Sinh(aL))
				n := -P * math.Sinh(alpha*(L-x)) / math.Sinh(aL)
				f := e.At(x, Right)
				if math.Abs(f.AxialDisplacement-u) > 1e-9*head || math.Abs(f.AxialForce-n) > 1e-9*P {
					t.Errorf("exact at x = %g: u %.12g N %.12g, want %.12g %.12g", x, f.AxialDisplacement, f.AxialForce, u, n)
				}
				// Linear bars on a foundation: nodal u within O(h²) of the truth.
				if g := s.At(x, Right); math.Abs(g.AxialDisplacement-u) > 1e-3*head {
					t.Errorf("FE at x = %g: u %.8g, want %.8g", x, g.AxialDisplacement, u)
				}
			}
			roundOff := max(1e-9, 4*s.Condition*0x1p-52)
			for name, rs := range map[string][]FoundationReaction{"FE": s.Foundations, "exact": e.Foundations()} {
				if relErr(rs[0].Force[0], -P) > roundOff {
					t.Errorf("%s skin friction %.10g N, want %.10g", name, rs[0].Force[0], -P)
				}
			}
		})
	}
}

// A bar on an elastic axial foundation, EA·u″ = kₐ·u (the load-transfer
// equation of TestPileWithSkinFriction, α = (kₐ/EA)^½), solved here for two
// more ends: held at x = 0 and pulled by P at L, u = P·sinh αx/(EA·α·cosh αL),
// so the end moves P·tanh αL/(EA·α) and the support takes −P/cosh αL;
// free at both ends and warmed by ΔT (free strain ε = α_T·ΔT), the bed
// holds it back, u = ε·sinh α(x − L/2)/(α·cosh(αL/2)) and
// N = EA·ε·(cosh α(x − L/2)/cosh(αL/2) − 1): no force at the ends,
// −EA·ε·(1 − 1/cosh(αL/2)) at the middle, the full restraint EA·ε on a
// long bar (derived here from the equation, the way a slab on subgrade
// friction is treated; from memory). αL from 0.1 (series) to 40
// (decaying exponentials). The exact solution gives them to round-off,
// the default mesh within its stated accuracy.
func TestBarOnAxialBedClosedForms(t *testing.T) {
	const L, P, dT = 10.0, 1e5, 30.0
	ea := testE * testA
	eps := testα * dT
	for _, aL := range []float64{0.1, 2.5, 40} {
		alpha := aL / L
		bed := []Foundation{{Start: 0, End: L, AxialModulus: alpha * alpha * ea}}
		for _, c := range []struct {
			name  string
			model Model
			u     func(x float64) float64
			n     func(x float64) float64
			react float64 // the axial reaction of the support at x = 0, if any
		}{
			{"held at x = 0, pulled at L", Model{Supports: []Support{{X: 0, Kind: AxialOnly}}, PointLoads: []PointLoad{{X: L, Axial: P}}},
				func(x float64) float64 { return P * math.Sinh(alpha*x) / (ea * alpha * math.Cosh(aL)) },
				func(x float64) float64 { return P * math.Cosh(alpha*x) / math.Cosh(aL) }, -P / math.Cosh(aL)},
			{"free, warmed", Model{TemperatureChange: dT},
				func(x float64) float64 { return eps * math.Sinh(alpha*(x-L/2)) / (alpha * math.Cosh(aL/2)) },
				func(x float64) float64 { return ea * eps * (math.Cosh(alpha*(x-L/2))/math.Cosh(aL/2) - 1) }, 0},
		} {
			t.Run(fmt.Sprintf("%s, αL = %g", c.name, aL), func(t *testing.T) {
				m := c.model
				m.Segments, m.AxialOnly, m.Foundations = []Segment{testSegment(0, L)}, true, bed
				e, err := SolveExact(&m)
				if err != nil {
					t.Fatal(err)
				}
				s := mustSolve(t, &m)
				places := []float64{0, 0.1 * L, L / 4, L / 2, 0.8 * L, L}
				var uScale, nScale float64 // the fields' largest magnitudes: at an end or the middle
				for _, x := range places {
					uScale, nScale = max(uScale, math.Abs(c.u(x))), max(nScale, math.Abs(c.n(x)))
				}
				for _, x := range places {
					for name, f := range map[string]Fields{"exact": e.At(x, Right), "FE": s.At(x, Right)} {
						tol := 1e-9
						if name == "FE" {
							tol = MeshAccuracy
						}
						if math.Abs(f.AxialDisplacement-c.u(x)) > tol*uScale || math.Abs(f.AxialForce-c.n(x)) > tol*nScale {
							t.Errorf("%s at x = %g: u %.10g N %.10g, want %.10g %.10g", name, x, f.AxialDisplacement, f.AxialForce, c.u(x), c.n(x))
						}
					}
				}
				if len(m.Supports) > 0 {
					if r := e.Reactions()[0].Force[Axial]; math.Abs(r-c.react) > 1e-9*P {
						t.Errorf("exact reaction %.10g N, want %.10g", r, c.react)
					}
				}
			})
		}
	}
}

// The exact solution does not care which basis a stretch takes: a modulus
// a hair either side of the one where λ crosses groundSeriesLimit gives the
// same fields to within the change in the modulus.
func TestFoundationBasesAgree(t *testing.T) {
	const L = 4.0
	ei := testE * testI
	// λ = β·L/2 on the two stretches either side of the load.
	kAt := func(lambda float64) float64 { b := lambda / (L / 2); return 4 * ei * b * b * b * b }
	var got [2]Fields
	for i, k := range []float64{kAt(groundSeriesLimit) * (1 - 1e-12), kAt(groundSeriesLimit) * (1 + 1e-12)} {
		m := groundModel(L, k)
		m.Supports = append(m.Supports, Support{X: 0, Kind: Roller})
		m.PointLoads = []PointLoad{{X: L / 2, Transverse: -1e4, Moment: 3e3}}
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		if i == 0 && e.stretches[0].beam.ground.scale > groundSeriesLimit || i == 1 && e.stretches[0].beam.ground.scale <= groundSeriesLimit {
			t.Fatalf("the stretch's scale %.15g is on the wrong side of %g", e.stretches[0].beam.ground.scale, float64(groundSeriesLimit))
		}
		got[i] = e.At(1.3, Right)
	}
	a, b := got[0].values(), got[1].values()
	for q := range a {
		if math.Abs(a[q]-b[q]) > 1e-9*math.Max(math.Abs(a[q]), 1e-12) {
			t.Errorf("%s: %.15g with the series, %.15g with the decaying functions", Quantity(q).Info().Name, a[q], b[q])
		}
	}
}

// A foundation under part of a member with a hinge: the FE answer
// converges to the exact one as the mesh refines, both balance the loads,
// and the foundation takes what the supports do not.
func TestPartialFoundationConverges(t *testing.T) {
	const L = 10.0
	m := &Model{
		Segments:    []Segment{testSegment(0, 4), testSegment(4, L)},
		Supports:    []Support{{X: 0, Kind: Pinned}},
		Hinges:      []Hinge{{X: 2}},
		Foundations: []Foundation{{Start: 3, End: L, Modulus: 4e6}, {Start: 6, End: 8, Modulus: 1e6}},
		PointLoads:  []PointLoad{{X: 1, Transverse: -2e4}, {X: 7, Transverse: -3e4, Moment: 1e4}},
		DistributedLoad: []DistributedLoad{
			{Direction: Transverse, Points: []LoadPoint{{2.5, -4e3}, {9, -1e3}}},
		},
	}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	var last float64
	for i, n := range []int{20, 80, 320} {
		m.Mesh = MeshSettings{Elements: n}
		s := mustSolve(t, m)
		worst := 0.0
		for x := 0.05; x < L; x += 0.1 {
			worst = max(worst, math.Abs(s.At(x, Right).BendingMoment-e.At(x, Right).BendingMoment))
		}
		if i > 0 && worst > last/8 { // M converges as h² (common practice: 16 times less per halving twice)
			t.Errorf("%d elements: moment error %.3g, not below an eighth of %.3g", n, worst, last)
		}
		last = worst
		r, tol := s.Equilibrium.Residual, max(1e-9, 4*s.Condition*0x1p-52)
		if math.Abs(r[1]) > tol*5e4 || math.Abs(r[2]) > tol*5e4*L {
			t.Errorf("%d elements: equilibrium residual %v", n, r)
		}
		ground := 0.0
		for _, f := range s.Foundations {
			ground += f.Force[1]
		}
		want := 2e4 + 3e4 + 6.5*2.5e3 - s.Reactions[0].Force[1]
		if relErr(ground, want) > max(1e-9, 4*s.Condition*0x1p-52) {
			t.Errorf("%d elements: the foundations carry %.10g N, want %.10g", n, ground, want)
		}
	}
	var exactGround [2]float64
	for i, f := range e.Foundations() {
		exactGround[i] = f.Force[1]
	}
	total := exactGround[0] + exactGround[1] + e.Reactions()[0].Force[1]
	if relErr(total, 2e4+3e4+6.5*2.5e3) > 1e-9 {
		t.Errorf("exact: foundations %v and the support %.10g N carry %.10g N, want %.10g", exactGround, e.Reactions()[0].Force[1], total, 2e4+3e4+6.5*2.5e3)
	}
}

// A point load P a millimetre or a centimetre beyond a hinge on a long
// beam on an elastic foundation, on a mesh of 100 elements: every node on a
// foundation enters the factorized equations, and the short element, pinned
// at the hinge, leaves a pivot block of rank one there. The ground must
// still carry P to round-off (statics: nothing else holds the member
// across), wherever the hinge lies along the member; the node-block kernel
// of package band missed it by 0.14 % (the FE equilibrium check failed) when
// the elimination met that block from the far end.
func TestShortStretchBeyondAHingeOnAFoundation(t *testing.T) {
	const L, k, P = 100.0, 6.4e6, -1e5
	for _, c := range []struct{ hinge, beyond float64 }{
		{20, 1e-3}, {50, 1e-3}, {70, 1e-3}, {49.5, 1e-3}, {70, 1e-2},
	} {
		m := groundModel(L, k)
		m.Supports[0].X = c.hinge
		m.Hinges = []Hinge{{X: c.hinge}}
		m.PointLoads = []PointLoad{{X: c.hinge + c.beyond, Transverse: P}}
		m.Mesh = MeshSettings{Elements: 100}
		s := mustSolve(t, m)
		tol := max(1e-9, 4*s.Condition*0x1p-52)
		if r := s.Equilibrium.Residual; math.Abs(r[1]) > tol*math.Abs(P) || math.Abs(r[2]) > tol*math.Abs(P)*L {
			t.Errorf("hinge at x = %g m, load %g m beyond: equilibrium residual %v, beyond %.3g of the load", c.hinge, c.beyond, r, tol)
		}
		if g := s.Foundations[0].Force[1]; relErr(g, -P) > tol {
			t.Errorf("hinge at x = %g m, load %g m beyond: the ground carries %.10g N, want %.10g", c.hinge, c.beyond, g, -P)
		}
	}
}

// Where the ground carries its resultant across, read in the summary: under
// a point load on a long beam (statics: the ground returns the load, so its
// resultant acts under it), and nowhere where the ground's forces add up to
// a couple alone: a free beam on a foundation turned by a moment C at its
// end, or pushed down and up by ±P a distance d apart, has the ground
// return −C or P·d as a couple (statics: no force across, moments
// balanced). Its line of action was M/F with F round-off, 1.2e31 m.
func TestWhereTheGroundActs(t *testing.T) {
	const L, k = 40.0, 6.4e6
	for _, c := range []struct {
		name   string
		loads  []PointLoad
		couple float64 // N·m the ground returns as a couple; 0: a force at centre
		centre float64 // m
	}{
		{"point load mid-member", []PointLoad{{X: 17, Transverse: -1e5}}, 0, 17},
		{"moment at the end", []PointLoad{{X: 0, Moment: 3e4}}, -3e4, 0},
		{"equal and opposite loads", []PointLoad{{X: 15, Transverse: -1e5}, {X: 25, Transverse: 1e5}}, -1e6, 0},
	} {
		m := groundModel(L, k)
		m.PointLoads = c.loads
		m.Mesh = MeshSettings{Elements: 160}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		g := Summarize(s, e).Foundations[0]
		centre, fe, ok := g.Centre()
		if c.couple != 0 {
			if ok || relErr(g.Reaction.Moment, c.couple) > 1e-9 {
				t.Errorf("%s: the ground acts at %g m (FE %g m) with %g N·m; want a couple of %g N·m, acting nowhere", c.name, centre, fe, g.Reaction.Moment, c.couple)
			}
			continue
		}
		if !ok || relErr(centre, c.centre) > 1e-9 || relErr(fe, c.centre) > 1e-6 {
			t.Errorf("%s: the ground acts at %g m (FE %g m, found %v); want %g m", c.name, centre, fe, ok, c.centre)
		}
	}
}

// Every foundation input that makes no sense is refused where it lies.
func TestValidateFoundations(t *testing.T) {
	ground := func(f Foundation) func(m *Model) {
		return func(m *Model) { m.Foundations = []Foundation{f} }
	}
	checkValidation(t, []validationCase{
		{"foundation end before start", ground(Foundation{Start: 2, End: 1, Modulus: 1e6}), place(FoundationItem, 0, EndProperty), "foundation 1 runs from x = 2.0 m to x = 1.0 m: its end must lie beyond its start"},
		{"foundation outside", ground(Foundation{Start: 1, End: 3.5, Modulus: 1e6}), place(FoundationItem, 0, EndProperty), "foundation 1 at x = 3.5 m lies outside the member (length 3.0 m)"},
		{"negative modulus", ground(Foundation{Start: 0, End: 3, Modulus: -1e6}), place(FoundationItem, 0, ModulusProperty), "foundation 1: the modulus across the member is -1e+06 N/m²: it must not be negative"},
		{"NaN axial modulus", ground(Foundation{Start: 0, End: 3, AxialModulus: math.NaN()}), place(FoundationItem, 0, AxialModulusProperty), "foundation 1: the axial modulus is NaN"},
		{"no modulus", ground(Foundation{Start: 0, End: 3}), place(FoundationItem, 0, ModulusProperty), "foundation 1 has no stiffness across or along the member"},
		{"modulus out of range", ground(Foundation{Start: 0, End: 3, Modulus: 1e200}), place(FoundationItem, 0, ModulusProperty), "outside the range the solvers work in"},
		{"axial-only member on a foundation", func(m *Model) {
			*m = Model{Segments: m.Segments, Supports: []Support{{X: 0, Kind: AxialOnly}}, AxialOnly: true, Foundations: []Foundation{{Start: 0, End: 3, Modulus: 1e6}}}
		}, place(FoundationItem, 0, ModulusProperty), "foundation 1 holds the member across, but the member is declared to carry axial force only"},
		{"shear deformation on a foundation", func(m *Model) {
			m.Segments[1].ShearDeformation, m.Segments[1].Section.ShearCoefficient, m.Segments[1].Material.Poisson = true, 5.0/6, 0.3
			m.Foundations = []Foundation{{Start: 0.5, End: 2, Modulus: 1e6}}
		}, place(FoundationItem, 0, ModulusProperty), "foundation 1 lies under segment 2 from x = 1.0 m to 2.0 m, which deforms in shear"},
		{"quadratic bars on an axial foundation", func(m *Model) {
			m.Mesh.BarOrder = QuadraticBar
			m.Foundations = []Foundation{{Start: 0, End: 3, AxialModulus: 1e6}}
		}, place(MeshItem, -1, BarOrderProperty), "foundation 1 holds the member along its axis, which the quadratic bar element does not take yet"},
	})
}

// A foundation holds the rigid motions of the stretch it lies under: a
// beam on nothing but a foundation and an axial restraint is no mechanism,
// and of two parts joined by a hinge the one off the foundation is.
func TestFoundationMechanisms(t *testing.T) {
	m := groundModel(6, 1e6)
	m.PointLoads = []PointLoad{{X: 1, Transverse: -1e3}}
	if _, err := Solve(m); err != nil {
		t.Errorf("a beam on a foundation: %v", err)
	}
	m.Foundations[0] = Foundation{Start: 3, End: 6, Modulus: 1e6}
	m.Hinges = []Hinge{{X: 2}}
	_, err := Solve(m)
	var me *MechanismError
	if !errors.As(err, &me) || !strings.Contains(me.Message, "the part from x = 0.0 m to 2.0 m can turn about x = 2.0 m") {
		t.Errorf("a part off the foundation beyond a hinge: got %v", err)
	}
}

// The exact solution on a foundation is read in closed form by the walk:
// its extremes are those of the long beam under a point load (see
// TestLongBeamOnFoundationPointLoad): the largest moment P/(4β) under the
// load, the largest hogging moment P/(4β)·e^(−π/2) a quarter wave π/(2β)
// either side, the largest deflection P·β/(2k) under the load (Hetényi,
// 1946, from memory); and the comparison with the finite element solution
// finds the largest errors a dense sampling of both finds.
func TestFoundationWalk(t *testing.T) {
	ei := testE * testI
	const k, P = 6.4e6, 80e3
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	L := 42 / beta
	m := groundModel(L, k)
	m.PointLoads = []PointLoad{{X: L / 2, Transverse: -P}}
	m.Mesh = MeshSettings{Elements: 300}
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	var mLo, mHi, wLo Point
	mLo.Value, mHi.Value, wLo.Value = math.Inf(1), math.Inf(-1), math.Inf(1)
	for _, v := range e.EachInterval() {
		if _, ok := v.Polynomial(QDeflection); ok {
			t.Fatal("an exact interval on a foundation claims to be a polynomial")
		}
		lo, hi := v.Range(QBendingMoment)
		if lo.Value < mLo.Value {
			mLo = lo
		}
		if hi.Value > mHi.Value {
			mHi = hi
		}
		if lo, _ := v.Range(QDeflection); lo.Value < wLo.Value {
			wLo = lo
		}
	}
	peak, hog, quarter := P/(4*beta), P/(4*beta)*math.Exp(-math.Pi/2), math.Pi/(2*beta)
	if relErr(mHi.Value, peak) > 1e-9 || math.Abs(mHi.X-L/2) > 1e-9*L {
		t.Errorf("largest exact moment %.10g at x = %.8g, want %.10g at %.8g", mHi.Value, mHi.X, peak, L/2)
	}
	if relErr(mLo.Value, -hog) > 1e-9 || math.Abs(math.Abs(mLo.X-L/2)-quarter) > 1e-6*L {
		t.Errorf("largest hogging moment %.10g at x = %.8g, want %.10g at %.8g ± %.8g", mLo.Value, mLo.X, -hog, L/2, quarter)
	}
	if relErr(wLo.Value, -P*beta/(2*k)) > 1e-9 {
		t.Errorf("largest deflection %.10g, want %.10g", wLo.Value, -P*beta/(2*k))
	}
	// Dense sampling of both solutions, 40 points an element.
	var du, dw float64
	for _, el := range s.Mesh.Elements {
		for i := 0; i <= 40; i++ {
			x := el.Start + (el.End-el.Start)*float64(i)/40
			a, b := s.At(x, Right), e.At(x, Right)
			du, dw = max(du, math.Abs(a.AxialDisplacement-b.AxialDisplacement)), max(dw, math.Abs(a.Deflection-b.Deflection))
		}
	}
	norms := Compare(s, e)
	if norms.MaxDeflection < dw*(1-1e-9) || norms.MaxDeflection > dw*1.01 {
		t.Errorf("largest deflection error %.6g, dense sampling finds %.6g", norms.MaxDeflection, dw)
	}
	if !(norms.RelativeEnergy > 0 && norms.RelativeEnergy < 0.2 && norms.RelativeL2 > 0 && norms.RelativeL2 < 0.05) {
		t.Errorf("error norms on 300 elements (β·h = %.2g): %+v", beta*L/300, norms)
	}
	// Finer, the energy error falls as h² (cubic elements: the curvature's
	// error is of order h^(p−1), p = 3; Strang & Fix, ch. 1, from memory).
	m.Mesh.Elements = 1200
	finer := Compare(mustSolve(t, m), e)
	if r := norms.RelativeEnergy / finer.RelativeEnergy; r < 14 || r > 18 {
		t.Errorf("energy error %.3g on 300 elements, %.3g on 1,200: ratio %.3g, want about 16", norms.RelativeEnergy, finer.RelativeEnergy, r)
	}
}

// A mesh far too fine over a foundation makes the equations singular to
// working precision (their condition grows as the fourth power of the
// elements there); the refusal names the foundation and the fix, not close
// supports.
func TestTooFineOverAFoundation(t *testing.T) {
	m := groundModel(12, 1e7)
	m.PointLoads = []PointLoad{{X: 3, Transverse: -1e5}}
	m.Mesh = MeshSettings{Elements: 100000}
	_, err := Solve(m)
	if err == nil || !strings.Contains(err.Error(), "over the elastic foundation") || !strings.Contains(err.Error(), "use fewer elements over the foundation") {
		t.Errorf("got %v, want a refusal naming the foundation's mesh", err)
	}
}

// Two loads 0.01 mm apart on a ground beam (the ground_beam_foundation
// model: EI = 7.68e8 N·m², k = 2.4e7 N/m², β = 0.297 /m) make an element of
// that length between them, and on a foundation every node enters the
// factorized equations: beside the bed's terms its stiffness 12·EI/h³ is
// beyond their rounding, whatever the mesh, the default one included. The
// refusal said "use fewer elements over the foundation, or leave the mesh
// to Stave", which the model had done; it now names the two points and
// what to do, as it does for a load 0.1 µm inside the start of a
// foundation. A millimetre apart they still solve, FE as exact.
func TestCloseItemsOverAFoundation(t *testing.T) {
	ground := func(gap float64, elements int) *Model {
		return &Model{
			Segments:    []Segment{{Start: 0, End: 12, Section: Section{Area: 0.48, SecondMoment: 0.0256, FibreDistance: 0.4}, Material: Material{Elastic: 3e10}}},
			Supports:    []Support{{X: 6, Kind: AxialOnly}},
			Foundations: []Foundation{{Start: 0, End: 12, Modulus: 2.4e7}},
			PointLoads:  []PointLoad{{X: 1.5, Transverse: -600e3}, {X: 1.5 + gap, Transverse: -1e3}, {X: 10.5, Transverse: -600e3}},
			Mesh:        MeshSettings{Elements: elements},
		}
	}
	for _, elements := range []int{0, 100, 2000} {
		m := ground(1e-5, elements)
		// A load 0.1 µm inside the start of a foundation: the pivot that
		// fails may lie off the foundation.
		edge := ground(1e-7, elements)
		edge.Foundations[0].Start, edge.PointLoads = 1.5, edge.PointLoads[1:]
		for name, m := range map[string]*Model{"two loads": m, "a foundation's start and a load": edge} {
			_, err := Solve(m)
			to := m.PointLoads[len(m.PointLoads)-2].X
			if err == nil || !strings.Contains(err.Error(), fmt.Sprintf("from x = 1.5 m to %v m", to)) || strings.Contains(err.Error(), "leave the mesh to Stave") {
				t.Errorf("%s, %d elements: got %v, want a refusal naming the stretch from 1.5 m to %v m", name, elements, err, to)
			}
		}
	}
	m := ground(1e-3, 0)
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := s.At(1.5, Right).Deflection, e.At(1.5, Right).Deflection; relErr(got, want) > 1e-6 {
		t.Errorf("loads 1 mm apart: FE deflection %.9g m under them, exact %.9g", got, want)
	}
}

// The default mesh keeps its elements on a foundation at least
// foundationBetaStep/β long, for the equations' round-off; its note says
// which field may then miss the 0.5 %: the shear force where the beam's
// elements were held back (a member riding a soft bed, β·L = 0.05, under an
// end load), the axial force where the bar's were (an axial line load
// changing sign within 2 cm beside the axial support, on a bed across the
// member that no load bends). The note named the shear force for both: on
// such a model (a polyline axial load beside a guided support) the axial
// force missed by 0.73 % while the note blamed the shear force.
func TestDefaultMeshNoteNamesTheFieldHeldBack(t *testing.T) {
	const L, p = 2.0, 1e4
	soft := groundModel(L, 4*testE*testI*math.Pow(0.05/L, 4))
	soft.PointLoads = []PointLoad{{X: 0, Transverse: -1e4}}
	axial := groundModel(L, 5e7)
	axial.DistributedLoad = []DistributedLoad{{Direction: Axial, Points: []LoadPoint{{L/2 - 0.01, p}, {L / 2, -p}, {L/2 + 0.01, p}}}}
	for _, c := range []struct {
		name  string
		m     *Model
		field string
	}{{"soft bed, end load", soft, "the shear force"}, {"axial load beside the support", axial, "the axial force"}} {
		s := mustSolve(t, c.m)
		if want := c.field + " there may miss by more"; !strings.HasSuffix(s.Mesh.Note, want) {
			t.Errorf("%s: mesh note %q, want it to end %q", c.name, s.Mesh.Note, want)
		}
	}
}

// A simple span with a stiff bed under its first metre: the 0.5 % rule for
// the shear force over the bed (constant in each element while the bed's
// k·w changes it, with w sized by the span's largest deflection) asked for
// 5,818 elements there, and the equations over the bed, whose condition
// grows as 4/(β·h)⁴, were singular to working precision (condition 1.8e16).
// The automatic mesh keeps β·h at least foundationBetaStep on the bed and
// refines the solve there: no warning, the load balanced by the supports
// and the ground (statics), and every field's extreme within the default
// mesh's 0.5 %.
func TestAutomaticMeshOnAStiffBed(t *testing.T) {
	const k, P = 1e8, 10e3 // N/m², N
	m := &Model{
		Segments:    []Segment{testSegment(0, 10)},
		Supports:    []Support{{X: 0, Kind: Pinned}, {X: 10, Kind: Roller}},
		Foundations: []Foundation{{Start: 0, End: 1, Modulus: k}},
		PointLoads:  []PointLoad{{X: 5, Transverse: -P}},
	}
	s := mustSolve(t, m)
	if len(s.Warnings) != 0 || s.Condition > 1e12 {
		t.Errorf("the automatic mesh of %d elements: condition %.2g, warnings %v", len(s.Mesh.Elements), s.Condition, s.Warnings)
	}
	carried := 0.0
	for _, g := range s.Foundations {
		carried += g.Force[Transverse]
	}
	for _, r := range s.Reactions {
		carried += r.Force[Transverse]
	}
	if math.Abs(carried-P) > 1e-6*P {
		t.Errorf("supports and ground carry %.9g N, want the load, %g N (statics)", carried, P)
	}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	withinMeshAccuracy(t, "", s, e)
}

// hetenyiFreeEnd is the deflection under a load P at the end of a free beam
// of length L on a foundation, w(0) = 2Pβ/k·(sinh βL·cosh βL − sin βL·cos
// βL)/(sinh² βL − sin² βL) (Hetényi, Beams on Elastic Foundation, 1946, the
// finite beam with free ends, from memory): 2Pβ/k for a long beam, 4P/(kL)
// for one the bed carries rigidly.
func hetenyiFreeEnd(P, k, beta, L float64) float64 {
	x := beta * L
	sh, s := math.Sinh(x), math.Sin(x)
	return 2 * P * beta / k * (sh*math.Cosh(x) - s*math.Cos(x)) / (sh*sh - s*s)
}

// On a soft or short bed (β·L of a few tenths to about 2) the member rides
// the bed almost rigidly, and the bed's k·w works on it like a line load of
// about P/L: the shear force, constant in each element, then needs
// elements of a few thousandths of the member whatever β is. The default
// mesh had kept β·h at least 0.004 for round-off and missed the 0.5 % it
// promises by up to 2.6 % (β·L = 0.3, load at a free end; 1 % at β·L =
// 0.8): every field's FE extreme must be within MeshAccuracy of the exact
// one, on free beams under an end and a central load (whose exact
// deflections must be Hetényi's closed forms, hetenyiFreeEnd and
// TestHetenyiClosedForms), a support standing on the bed and a hinge over
// it; and the FE equilibrium must hold to the round-off the solution
// states.
func TestDefaultMeshOnASoftBed(t *testing.T) {
	const L, P = 10.0, -1e5
	ei := testE * testI
	for _, bl := range []float64{0.3, 0.8, 1.5} {
		beta := bl / L
		k := 4 * ei * math.Pow(beta, 4)
		d := math.Sinh(bl) + math.Sin(bl)
		rows := []struct {
			name   string
			change func(m *Model)
			x      float64 // where the closed form gives w, or −1
			w      float64
		}{
			{"load at a free end", func(m *Model) { m.PointLoads = []PointLoad{{X: 0, Transverse: P}} }, 0, hetenyiFreeEnd(P, k, beta, L)},
			{"central load", func(m *Model) { m.PointLoads = []PointLoad{{X: L / 2, Transverse: P}} },
				L / 2, P * beta / (2 * k) * (math.Cosh(bl) + math.Cos(bl) + 2) / d},
			{"support on the bed", func(m *Model) {
				m.Supports = []Support{{X: 3, Kind: Pinned}}
				m.PointLoads = []PointLoad{{X: 7, Transverse: P}}
			}, -1, 0},
			{"hinge over the bed", func(m *Model) {
				m.Hinges = []Hinge{{X: 4}}
				m.PointLoads = []PointLoad{{X: 6, Transverse: P}}
				m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{0, P / 100}, {L, P / 100}}}}
			}, -1, 0},
		}
		for _, r := range rows {
			t.Run(fmt.Sprintf("βL = %g, %s", bl, r.name), func(t *testing.T) {
				m := groundModel(L, k)
				r.change(m)
				e, err := SolveExact(m)
				if err != nil {
					t.Fatal(err)
				}
				if r.x >= 0 {
					if got := e.At(r.x, Right).Deflection; relErr(got, r.w) > 1e-9 {
						t.Errorf("exact w(%g) = %.12g, want %.12g (Hetényi)", r.x, got, r.w)
					}
				}
				s := mustSolve(t, m)
				withinMeshAccuracy(t, "", s, e)
				// Round-off as the solution states it: the nodal values of a
				// member riding a soft bed are large against its bending.
				roundOff := max(1e-9, 4*s.Condition*0x1p-52)
				if r := s.Equilibrium.Residual; math.Abs(r[1]) > roundOff*math.Abs(P) || math.Abs(r[2]) > roundOff*math.Abs(P)*L {
					t.Errorf("FE equilibrium residual %v beyond %.2g relative", r, roundOff)
				}
			})
		}
	}
}

// Over a foundation every node enters the factorized equations, and with
// β·h = 0.001 (800 elements on a free beam of β·L = 0.8, condition about
// 3e13) eliminating them rounded the bed's share of each entry away: the
// deflection under a load at the free end came out 3e-4 off and the FE
// equilibrium 3e-4 off. The nodal deflection of the Hermite element on a
// foundation is off by O((β·h)⁴) only (from memory), here about 1e-12, so
// with the refined solve it must match Hetényi's closed form
// (hetenyiFreeEnd) to 1e-9, a margin over that, and balance the load to
// round-off; the mesh must carry no warning.
func TestFineMeshOverASoftBed(t *testing.T) {
	const L, P, bl = 10.0, -1e5, 0.8
	ei := testE * testI
	beta := bl / L
	k := 4 * ei * math.Pow(beta, 4)
	m := groundModel(L, k)
	m.PointLoads = []PointLoad{{X: 0, Transverse: P}, {X: 3.3, Transverse: -P / 5}}
	m.Mesh = MeshSettings{Elements: 800}
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	// The second load's share of w(0) comes from the exact solution, the
	// first's from the closed form.
	other := *m
	other.PointLoads = m.PointLoads[1:]
	eo, err := SolveExact(&other)
	if err != nil {
		t.Fatal(err)
	}
	want := hetenyiFreeEnd(P, k, beta, L) + eo.At(0, Right).Deflection
	if got := e.At(0, Right).Deflection; relErr(got, want) > 1e-9 {
		t.Errorf("exact w(0) = %.12g, want %.12g (Hetényi)", got, want)
	}
	if got := s.At(0, Right).Deflection; relErr(got, want) > 1e-9 {
		t.Errorf("FE w(0) on 800 elements = %.12g, want %.12g (Hetényi): off by %.2g", got, want, relErr(got, want))
	}
	if r := s.Equilibrium.Residual; math.Abs(r[1]) > 1e-9*math.Abs(P) || math.Abs(r[2]) > 1e-9*math.Abs(P)*L {
		t.Errorf("FE equilibrium residual %v, want round-off", r)
	}
	if len(s.Warnings) != 0 {
		t.Errorf("warnings %q, want none", s.Warnings)
	}
}

// The invented ground beam of testdata/ground_beam_foundation.json (12 m
// on a bed of k = 24 MN/m², two column loads of 600 kN) on the default
// mesh: meshing from the exact solution, solving with refinement over the
// bed and comparing FE with exact, as `stave solve` does.
func BenchmarkGroundBeamDefaultMesh(b *testing.B) {
	m := benchGroundBeam()
	m.PointLoads = []PointLoad{{X: 1.5, Transverse: -6e5}, {X: 10.5, Transverse: -6e5}}
	benchSummarize(b, m)
}

// benchGroundBeam is the invented ground beam of the benchmarks without its
// column loads: 12 m of concrete on a bed of k = 24 MN/m², held along its
// axis at its middle, under its own weight.
func benchGroundBeam() *Model {
	seg := Segment{Start: 0, End: 12, Section: Section{Area: 0.48, SecondMoment: 0.0256, FibreDistance: 0.4},
		Material: Material{Elastic: 3e10, Density: 2400}}
	return &Model{
		Segments:    []Segment{seg},
		Supports:    []Support{{X: 6, Kind: AxialOnly}},
		Foundations: []Foundation{{Start: 0, End: 12, Modulus: 2.4e7}},
		Gravity:     [2]float64{0, -9.80665},
	}
}

// The ground beam of BenchmarkGroundBeamDefaultMesh under n equal point
// loads spread evenly along it (a hostile input: under 20,000 of them
// `stave solve` took 6 s, nearly all of it in the exact solution's
// extremes, about a thousand closed-form readings per stretch; see
// "Many point loads on a foundation" in docs/performance.md).
func BenchmarkGroundBeamManyLoads(b *testing.B) {
	for _, n := range []int{1000, 4000} {
		b.Run(fmt.Sprintf("loads=%d", n), func(b *testing.B) {
			m := benchGroundBeam()
			m.Mesh = MeshSettings{Elements: 600}
			for i := range n {
				m.PointLoads = append(m.PointLoads, PointLoad{X: 12 * (float64(i) + 0.5) / float64(n), Transverse: -1e3})
			}
			benchSummarize(b, m)
		})
	}
}

// Away from a load the fields of a beam on a foundation decay as
// e^(−β·x) (Hetényi, Beams on Elastic Foundation, 1946, the infinite beam,
// from memory), and so does the load the bed leaves, q − k·w, which sizes
// the default mesh's elements: sized by the stretch's largest net load
// instead, a stretch five wavelengths long got as fine a mesh as the few
// metres beside the load (2,002 elements at β·L = 10, 6,002 at 30 for one
// central load). The mesh sizes each 1/β of a stretch by its own net load:
// doubling a long member adds a few elements, not as many again, and every
// extreme stays within MeshAccuracy of the exact one (w under the load and
// M there the infinite beam's Pβ/(2k) and P/(4β), TestHetenyiClosedForms).
func TestDefaultMeshFollowsTheDecay(t *testing.T) {
	const k, P = 6.4e6, -8e4
	ei := testE * testI
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	var counts []int
	for _, bl := range []float64{30, 60} {
		L := bl / beta
		m := groundModel(L, k)
		m.PointLoads = []PointLoad{{X: L / 2, Transverse: P}}
		s := mustSolve(t, m)
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		withinMeshAccuracy(t, fmt.Sprintf("β·L = %g, ", bl), s, e)
		counts = append(counts, len(s.Mesh.Elements))
	}
	if counts[1] > counts[0]*6/5 {
		t.Errorf("the default mesh has %d elements at β·L = 30 and %d at 60: the length the fields have decayed over is meshed as finely as the load's neighbourhood", counts[0], counts[1])
	}
}

// A long beam on two foundations, k₁ left of x = a and k₂ right of it,
// loaded by P at the step: each side is a semi-infinite beam loaded at its
// end by its share of P and a moment C, whose end deflections and
// rotations are Hetényi's (TestHetenyiClosedForms: w = 2Pβ/k − 2Cβ²/k, θ =
// −2Pβ²/k + 4Cβ³/k), the left one mirrored; w and θ continuous at the step
// give the right share P₂ and C from two equations. With k₁ = k₂ it is the
// infinite beam's w = Pβ/(2k). Exact w at the step and what each
// foundation carries must be these; the default mesh's within MeshAccuracy.
func TestSteppedFoundation(t *testing.T) {
	const P = -8e4
	ei := testE * testI
	for _, ks := range [][2]float64{{6.4e6, 6.4e6}, {6.4e6, 1.6e6}, {1e6, 4e7}} {
		k1, k2 := ks[0], ks[1]
		b1, b2 := math.Sqrt(math.Sqrt(k1/(4*ei))), math.Sqrt(math.Sqrt(k2/(4*ei)))
		// Rows: w right − w left = 0, θ right − θ left = 0, in P₂ and C.
		a11, a12, r1 := 2*b2/k2+2*b1/k1, -2*b2*b2/k2+2*b1*b1/k1, 2*P*b1/k1
		a21, a22, r2 := -2*b2*b2/k2+2*b1*b1/k1, 4*b2*b2*b2/k2+4*b1*b1*b1/k1, 2*P*b1*b1/k1
		det := a11*a22 - a12*a21
		p2, c := (r1*a22-a12*r2)/det, (a11*r2-a21*r1)/det
		w := 2*p2*b2/k2 - 2*c*b2*b2/k2
		t.Run(fmt.Sprintf("k₁ = %g, k₂ = %g", k1, k2), func(t *testing.T) {
			a := 30 / b1
			L := a + 30/b2
			m := groundModel(L, k1)
			m.Foundations = []Foundation{{Start: 0, End: a, Modulus: k1}, {Start: a, End: L, Modulus: k2}}
			m.PointLoads = []PointLoad{{X: a, Transverse: P}}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			if got := e.At(a, Right).Deflection; relErr(got, w) > 1e-9 {
				t.Errorf("exact w at the step %.10g, want %.10g", got, w)
			}
			if g := e.Foundations(); relErr(g[1].Force[Transverse], -p2) > 1e-9 || relErr(g[0].Force[Transverse], -(P-p2)) > 1e-9 {
				t.Errorf("the foundations carry %.10g and %.10g N, want %.10g and %.10g", g[0].Force[Transverse], g[1].Force[Transverse], -(P - p2), -p2)
			}
			s := mustSolve(t, m)
			withinMeshAccuracy(t, "", s, e)
		})
	}
}

// A bed that holds the member along its axis too, however weakly, kept
// every element at least 1e-5/α long for the round-off of the bar's
// equations (α = (kₐ/EA)^½), and the beam shares the mesh: with kₐ = 1
// N/m² under a ground beam that is 1.4 m, and on its 32 elements the
// shear force under a column load came out 5.4 % off. Both problems are refined over the bed
// (groundrefine.go), so the bar's floor falls to 1e-7/α, and the default
// mesh must meet MeshAccuracy on every field (exact: the beam on its bed,
// TestHetenyiClosedForms; the bar's u = 0, no axial load).
func TestAxialBedDoesNotCoarsenTheBeam(t *testing.T) {
	m := groundModel(10, 1e5)
	m.Foundations[0].AxialModulus = 1
	m.PointLoads = []PointLoad{{X: 2.5, Transverse: -1e5}}
	s := mustSolve(t, m)
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	withinMeshAccuracy(t, "", s, e)
}

// withinMeshAccuracy reports every extreme whose finite element values miss
// the exact ones by more than MeshAccuracy of the field's size: what the
// default mesh promises (automesh.go). label goes before the quantity.
func withinMeshAccuracy(t *testing.T, label string, s *Solution, e *Exact) {
	t.Helper()
	for _, x := range Summarize(s, e).Extremes {
		scale := math.Max(math.Abs(x.Max), math.Abs(x.Min))
		if diff := math.Max(math.Abs(x.FEMax-x.Max), math.Abs(x.FEMin-x.Min)); diff > MeshAccuracy*scale {
			t.Errorf("%s%s on %d elements: FE extremes %.6g..%.6g, exact %.6g..%.6g: off by %.2g of %.3g, beyond %g",
				label, x.Quantity, len(s.Mesh.Elements), x.FEMin, x.FEMax, x.Min, x.Max, diff/scale, scale, MeshAccuracy)
		}
	}
}

// The exact extremes on a foundation come from sampling each stretch and
// refining the turns between samples; a turn inside the first or last
// piece of a stretch, next to a key point, must not be lost to the end
// value there. On a long beam on an elastic foundation under a point load
// P the rotation is θ = (P·β²/k)·e^(−βξ)·sin βξ at ξ = x − a right of the
// load, largest at βξ = π/4: θmax = (P·β²/k)·e^(−π/4)·sin(π/4) (Hetényi,
// Beams on Elastic Foundation, 1946, the infinite beam, from memory). A
// segment break (the same section on both sides, so nothing changes) a
// little past that place puts the turn inside the last piece of the
// stretch that starts at the load.
func TestFoundationTurnNextToAKeyPoint(t *testing.T) {
	ei := testE * testI
	const k, P = 6.4e6, 80e3
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	L := 42 / beta
	peak := L/2 + math.Pi/(4*beta)
	for _, past := range []float64{0.002, 0.01, 0.03} { // m past the turn
		m := groundModel(L, k)
		m.Segments = []Segment{testSegment(0, peak+past), testSegment(peak+past, L)}
		m.PointLoads = []PointLoad{{X: L / 2, Transverse: -P}}
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		want := P * beta * beta / k * math.Exp(-math.Pi/4) * math.Sin(math.Pi/4)
		best := Point{Value: math.Inf(-1)}
		for _, v := range e.EachInterval() {
			if _, hi := v.Range(QRotation); hi.Value > best.Value {
				best = hi
			}
		}
		if relErr(best.Value, want) > 1e-9 || math.Abs(best.X-peak) > 1e-6*L {
			t.Errorf("break %.3g m past the turn: largest rotation %.10g at x = %.8g, want %.10g at %.8g", past, best.Value, best.X, want, peak)
		}
		sum := Summarize(mustSolve(t, m), e)
		for _, x := range sum.Extremes {
			if x.Quantity == QRotation && relErr(x.Max, want) > 1e-9 {
				t.Errorf("break %.3g m past the turn: summary's largest rotation %.10g, want %.10g", past, x.Max, want)
			}
		}
	}
}

// A foundation along the member alone (skin friction) puts every node of
// its stretch into the factorized equations of the beam as well as of the
// bar (keyNodes), though the beam has no bed there to steady them. The
// default mesh sizes the bar's elements for its axial force, which changes
// fast near a loaded end (thousands of elements for αL of 40), and must not
// let that ruin or refuse the bending. A simply supported beam under a
// uniform load q keeps R = q·L/2 and M = q·L²/8 at midspan (AISC Steel
// Construction Manual, Beam Diagrams and Formulas, case 1), whatever holds
// it along its axis; the bar, pulled by P at its free end, carries N =
// P·cosh(αx)/cosh(αL), α = (kₐ/EA)^½ (the bar on an elastic axial
// foundation, as for the pile above, from memory).
func TestDefaultMeshOnSkinFrictionKeepsTheBeam(t *testing.T) {
	const L, q, P = 10.0, -10e3, 50e3
	ea := testE * testA
	for _, aL := range []float64{40, 200} {
		t.Run(fmt.Sprintf("αL = %g", aL), func(t *testing.T) {
			alpha := aL / L
			m := withUniform(&Model{
				Segments:    []Segment{testSegment(0, L)},
				Supports:    []Support{{X: 0, Kind: Pinned}, {X: L, Kind: Roller}},
				Foundations: []Foundation{{Start: 0, End: L, AxialModulus: alpha * alpha * ea}},
				PointLoads:  []PointLoad{{X: L, Axial: P}},
			}, q)
			s, err := Solve(m)
			if err != nil {
				t.Fatalf("default mesh: %v", err)
			}
			R := -q * L / 2
			for i, r := range s.Reactions {
				if relErr(r.Force[Transverse], R) > 1e-6 {
					t.Errorf("FE reaction %d: %.10g N, want %.10g", i+1, r.Force[Transverse], R)
				}
			}
			if f := s.At(L/2, Right); relErr(f.BendingMoment, -q*L*L/8) > MeshAccuracy {
				t.Errorf("FE midspan moment %.8g N·m, want %.8g within %g", f.BendingMoment, -q*L*L/8, MeshAccuracy)
			}
			// The ground takes the whole pull in the FE solution too, on
			// whatever mesh (equilibrium of the element forces).
			if len(s.Foundations) != 1 || relErr(s.Foundations[0].Force[0], -P) > 1e-9 {
				t.Errorf("FE skin friction %+v, want %.10g N", s.Foundations, -P)
			}
			e, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			for _, x := range []float64{0.9 * L, L} {
				if f := e.At(x, Left); relErr(f.AxialForce, P*math.Cosh(alpha*x)/math.Cosh(aL)) > 1e-9 {
					t.Errorf("exact N at x = %g: %.10g, want %.10g", x, f.AxialForce, P*math.Cosh(alpha*x)/math.Cosh(aL))
				}
			}
		})
	}
}

// EachInterval yields each stretch as a fresh Interval of it would hold it,
// though it reuses one Interval: on a beam founded along its middle third
// only, whose stretches alternate between polynomials (off the bed) and
// closed forms (on it), every stretch gives the same ends and the same range
// of every quantity, to the bit, as an Interval of its own. An Interval that
// kept a range, an end or a closed form's samples from the stretch before
// would show here. (EachInterval's own contract; no check value of its own.)
func TestEachIntervalIsAFreshInterval(t *testing.T) {
	e := foundedMiddleThird(t)
	closed, n := 0, 0
	for j, got := range e.EachInterval() {
		if j != n {
			t.Fatalf("stretch %d yielded as %d", n, j)
		}
		n++
		var w Interval
		st := &e.stretches[j]
		st.interval(0, 1, st.start, st.end, &w)
		if _, ok := w.Polynomial(QDeflection); !ok {
			closed++
		}
		for _, q := range Quantities() {
			glo, ghi := got.Range(q)
			wlo, whi := w.Range(q)
			if glo != wlo || ghi != whi {
				t.Errorf("stretch %d, %s: range %v … %v, a fresh Interval gives %v … %v", j, q, glo, ghi, wlo, whi)
			}
		}
		for i := range 2 {
			if *got.End(i) != *w.End(i) {
				t.Errorf("stretch %d, end %d: %+v, a fresh Interval gives %+v", j, i, *got.End(i), *w.End(i))
			}
		}
	}
	if n != len(e.stretches) {
		t.Errorf("%d stretches yielded of %d", n, len(e.stretches))
	}
	if closed == 0 || closed == n {
		t.Errorf("%d of %d stretches in closed form: the test needs both kinds", closed, n)
	}
}

// foundedMiddleThird is the exact solution of a 12 m beam, simply
// supported, founded along its middle third only and loaded all along:
// its stretches alternate between polynomials (off the bed) and closed
// forms (on it).
func foundedMiddleThird(t *testing.T) *Exact {
	t.Helper()
	const L, k = 12.0, 6.4e6
	m := groundModel(L, k)
	m.Foundations[0].Start, m.Foundations[0].End = L/3, 2*L/3
	m.Supports = append(m.Supports, Support{X: 0, Kind: Pinned}, Support{X: L, Kind: Roller})
	m.PointLoads = []PointLoad{{X: 1, Transverse: -30e3}, {X: 5, Transverse: -80e3, Axial: 10e3}, {X: 6.5, Moment: 12e3}, {X: 10, Transverse: 20e3}}
	m.DistributedLoad = []DistributedLoad{{Direction: Transverse, Points: []LoadPoint{{X: 2, Intensity: -5e3}, {X: 11, Intensity: -9e3}}}}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	if len(e.stretches) < 6 {
		t.Fatalf("%d stretches: the model should give a dozen, polynomials and closed forms", len(e.stretches))
	}
	return e
}

// The stretches' ranges are worked out once and kept with the exact
// solution (Exact.stretchRanges), which the window's drawing, its
// analysis and the halves of a walk read at once: two goroutines that
// first ask EachInterval of one exact solution together must each get
// every range a fresh Interval of the stretch gives, to the bit. Under
// go test -race, a cache filled without synchronisation fails here.
// (EachInterval's own contract; no check value of its own.)
func TestEachIntervalFromTwoGoroutines(t *testing.T) {
	e := foundedMiddleThird(t)
	want := make([][quantityCount][2]Point, len(e.stretches))
	for j := range e.stretches {
		var w Interval
		st := &e.stretches[j]
		st.interval(0, 1, st.start, st.end, &w)
		for q := range Quantity(quantityCount) {
			want[j][q][0], want[j][q][1] = w.Range(q)
		}
	}
	var wg sync.WaitGroup
	wrong := make([]int, 2)
	for g := range wrong {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for j, v := range e.EachInterval() {
				for q := range Quantity(quantityCount) {
					if lo, hi := v.Range(q); lo != want[j][q][0] || hi != want[j][q][1] {
						wrong[g]++
					}
				}
			}
		}()
	}
	wg.Wait()
	for g, n := range wrong {
		if n > 0 {
			t.Errorf("goroutine %d: %d ranges differ from a fresh Interval's", g+1, n)
		}
	}
}

// A bed far stiffer than any ground (1e149 N/m² under a 1,000 m member:
// β = 2e35 /m, so 1/β is 5e-36 m) changes its fields within a sliver no
// mesh can follow: 200,000 elements on it missed the shear force by 100 %
// as one element does, and `stave solve` took 20 s. The default mesh
// gives such a bed's pieces one element each, and says so; the exact
// solution is Hetényi's infinite beam under a central load P to round-off
// (w = −Pβ/(2k), M = P/(4β), V = ±P/2 beside the load; Hetényi, Beams on
// Elastic Foundation, 1946, from memory; the ends change it by e^(−βL/2),
// nothing), and the FE reactions still balance the load.
func TestDefaultMeshOnABedNoMeshFollows(t *testing.T) {
	const L, k, P = 1000.0, 1e149, -1e4
	m := groundModel(L, k)
	m.PointLoads = []PointLoad{{X: L / 2, Transverse: P}}
	s := mustSolve(t, m)
	// Two stretches (either side of the load) of maxGroundPieces pieces.
	if n := len(s.Mesh.Elements); n > 2*maxGroundPieces {
		t.Errorf("%d elements, want one a piece, %d at most", n, 2*maxGroundPieces)
	}
	if !strings.Contains(s.Mesh.Note, "too stiff for any mesh to follow") {
		t.Errorf("mesh note %q does not say why its elements are few", s.Mesh.Note)
	}
	e, err := SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	beta := math.Sqrt(math.Sqrt(k / (4 * testE * testI)))
	left, right := e.At(L/2, Left), e.At(L/2, Right)
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"w under the load", right.Deflection, P * beta / (2 * k)},
		{"M under the load", right.BendingMoment, -P / (4 * beta)},
		{"V left of the load", left.ShearForce, -P / 2},
		{"V right of the load", right.ShearForce, P / 2},
	} {
		if relErr(c.got, c.want) > 1e-9 {
			t.Errorf("exact %s = %.12g, want %.12g (Hetényi)", c.what, c.got, c.want)
		}
	}
	if r := s.Equilibrium.Residual; math.Abs(r[1]) > 1e-9*math.Abs(P) || math.Abs(r[2]) > 1e-9*math.Abs(P)*L {
		t.Errorf("FE equilibrium residual %v, want round-off", r)
	}
}

// followable: elements are worth making on a piece of a bed unless the
// rule asks for more than maxAutomaticElements there and even that many
// would be longer than 1/rate each.
func TestFollowable(t *testing.T) {
	const piece = 1.0 // m; maxAutomaticElements elements 5 µm long
	for _, c := range []struct {
		name    string
		h, rate float64
		want    bool
	}{
		{"a few elements", 0.1, 1e3, true},
		{"many, within the cap", piece / 1e5, 1e6, true},
		{"beyond the cap, the cap follows (β·h = 0.5)", piece / 1e6, 1e5, true},
		{"beyond the cap, the cap follows not (β·h = 2)", piece / 1e6, 4e5, false},
		{"off a bed", piece / 1e6, 0, true},
	} {
		if got := followable(c.h, c.rate, piece); got != c.want {
			t.Errorf("%s: followable %v, want %v", c.name, got, c.want)
		}
	}
}

// On a stretch whose fields decay from its ends within a sliver of it,
// an interval whose every sample and Gauss node lies deadUnits of decay or
// more from those ends reads the particular solution alone: eight samples
// and one panel, where it took sixteen a unit up to the cap (1.6 million
// on a stretch of a bed of 1e149 N/m²); its range is then that of the
// samples at its ends (the load's jump in the shear force, ±P/2, here).
// A stretch of moderate λ keeps sixteen samples a unit.
func TestClosedSamplesOfADeadStretch(t *testing.T) {
	for _, c := range []struct {
		name         string
		k            float64
		dead         bool
		pieces, legs int
	}{
		{"a bed no mesh follows", 1e149, true, 8, 1},
		{"a moderate bed", 6.4e6, false, 0, 0},
	} {
		const L, P = 20.0, -1e4
		m := groundModel(L, c.k)
		m.PointLoads = []PointLoad{{X: L / 2, Transverse: P}}
		m.Mesh = MeshSettings{Elements: 2}
		e, err := SolveExact(m)
		if err != nil {
			t.Fatal(err)
		}
		intervals := 0
		for _, v := range e.EachInterval() {
			if v.closed.stretch == nil {
				continue
			}
			intervals++
			units := v.closed.span * v.closed.stretch.waves()
			if !c.dead {
				if want := 8 + int(math.Ceil(16*units)); v.closedPieces() != want {
					t.Errorf("%s: %d samples, want %d, sixteen a unit of %g", c.name, v.closedPieces(), want, units)
				}
				continue
			}
			if v.closedPieces() != c.pieces || v.closedPanels() != c.legs {
				t.Errorf("%s: %d pieces and %d panels, want %d and %d", c.name, v.closedPieces(), v.closedPanels(), c.pieces, c.legs)
			}
			lo, hi := v.Range(QShearForce)
			if want := math.Abs(P / 2); relErr(max(-lo.Value, hi.Value), want) > 1e-9 {
				t.Errorf("%s: shear force from %g to %g on [%g, %g], want %g beside the load", c.name, lo.Value, hi.Value, v.Start, v.end, want)
			}
		}
		if intervals == 0 {
			t.Fatalf("%s: no interval in closed form", c.name)
		}
	}
}

// The 1,000 m member on a bed of 1e149 N/m² of TestDefaultMeshOnABedNoMeshFollows,
// as `stave solve` takes it: meshing from the exact solution, solving and
// comparing FE with exact (20 s before the mesh gave up following such a
// bed and the comparison its dead samples).
func BenchmarkBedNoMeshFollows(b *testing.B) {
	m := groundModel(1000, 1e149)
	m.PointLoads = []PointLoad{{X: 500, Transverse: -1e4}}
	benchSummarize(b, m)
}

// benchSummarize times m as `stave solve` takes it: the finite element
// and exact solutions and their summary.
func benchSummarize(b *testing.B, m *Model) {
	for b.Loop() {
		s, err := Solve(m)
		if err != nil {
			b.Fatal(err)
		}
		e, err := SolveExact(m)
		if err != nil {
			b.Fatal(err)
		}
		Summarize(s, e)
	}
}
