package fem_test

// Accuracy of fine meshes: nodal values, moments and shear forces of beams
// with up to 10⁶ Hermite elements against the exact solution of the same
// model. In exact arithmetic the nodal values are exact (Tong 1969; Strang &
// Fix ch. 1, from memory), so what is measured here is round-off.

import (
	"math"
	"testing"

	"stave/fem"
)

// accuracyModels are the testdata members (cantilever_tip_load,
// simply_supported_uniform, two_span_uniform, demo), written out in Go.
func accuracyModels() []struct {
	name  string
	model fem.Model
} {
	steel := fem.Segment{Start: 0, End: 4, Section: refSection, Material: fem.Material{Name: "steel", Elastic: refE}}
	span := func(l float64) []fem.Segment { s := steel; s.End = l; return []fem.Segment{s} }
	uniform := func(l, q float64) []fem.DistributedLoad {
		return []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: l, Intensity: q}}}}
	}
	// demo.json: invented demo scenario (glued-laminated joist over two spans).
	glulam := fem.Material{Elastic: 1.15e10, Density: 420, ThermalExpansion: 5e-6, Allowable: 1.2e7}
	demo := fem.Model{
		Segments: []fem.Segment{
			{Start: 0, End: 3, Section: fem.Section{Area: 0.0243, SecondMoment: 0.0001476225, FibreDistance: 0.135}, Material: glulam},
			{Start: 3, End: 5.5, Section: fem.Section{Area: 0.02025, SecondMoment: 8.54296875e-5, FibreDistance: 0.1125}, Material: glulam},
		},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 3, Kind: fem.Roller}, {X: 5.5, Kind: fem.Roller}},
		PointLoads:      []fem.PointLoad{{X: 4.2, Transverse: -2500}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0.5, Intensity: -1500}, {X: 2.8, Intensity: -3000}}}},
		Gravity:         [2]float64{0, -fem.StandardGravity},
	}
	return []struct {
		name  string
		model fem.Model
	}{
		{"cantilever tip load", fem.Model{Segments: span(4), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}}, PointLoads: []fem.PointLoad{{X: 4, Transverse: -10e3}}}},
		{"simply supported uniform", fem.Model{Segments: span(4), Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}}, DistributedLoad: uniform(4, -10e3)}},
		{"two span uniform", fem.Model{Segments: span(8), Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}, {X: 8, Kind: fem.Roller}}, DistributedLoad: uniform(8, -10e3)}},
		{"demo", demo},
	}
}

// nodalErrors returns the largest nodal errors of w and θ, each relative
// to the largest exact |w| or |θ| at the nodes.
func nodalErrors(s *fem.Solution, ex *fem.Exact) (w, theta float64) {
	var dw, dt, sw, st float64
	for i, x := range s.Mesh.X {
		e := ex.At(x, fem.Right)
		d := s.Displacement[i]
		dw = math.Max(dw, math.Abs(d[fem.Transverse]-e.Deflection))
		dt = math.Max(dt, math.Abs(d[fem.Rotation]-e.Rotation))
		sw = math.Max(sw, math.Abs(e.Deflection))
		st = math.Max(st, math.Abs(e.Rotation))
	}
	return dw / sw, dt / st
}

// forceErrors returns the largest excess of the moment and shear errors over
// their discretisation bounds, relative to the largest exact |M| and |V|, at
// both ends and the middle of about 20,000 elements spread over the member.
// With exact nodal values the element's moment error is the fixed-end moment
// diagram of its own load, at most q·h²/12, and its constant shear equals
// the exact shear somewhere in it, so it is off by at most q·h (beam
// fixed-end moment tables, from memory; statics).
func forceErrors(s *fem.Solution, ex *fem.Exact, q float64) (moment, shear float64) {
	var dm, dv, sm, sv float64
	stride := max(1, len(s.Mesh.Elements)/20_000)
	for e := 0; e < len(s.Mesh.Elements); e += stride {
		el := s.Mesh.Elements[e]
		h := el.End - el.Start
		for _, p := range []struct {
			x    float64
			side fem.Side
		}{{el.Start, fem.Right}, {0.5 * (el.Start + el.End), fem.Right}, {el.End, fem.Left}} {
			got, want := s.At(p.x, p.side), ex.At(p.x, p.side)
			dm = math.Max(dm, math.Abs(got.BendingMoment-want.BendingMoment)-q*h*h/12)
			dv = math.Max(dv, math.Abs(got.ShearForce-want.ShearForce)-q*h)
			sm = math.Max(sm, math.Abs(want.BendingMoment))
			sv = math.Max(sv, math.Abs(want.ShearForce))
		}
	}
	return math.Max(dm, 0) / sm, math.Max(dv, 0) / sv
}

// largestLoad is the largest |q| of the transverse loads and self-weight, N/m.
func largestLoad(m *fem.Model) float64 {
	q := 0.0
	for _, d := range m.DistributedLoad {
		for _, p := range d.Points {
			q += math.Abs(p.Intensity)
		}
	}
	for _, s := range m.Segments {
		q += s.Material.Density * s.Section.Area * math.Abs(m.Gravity[1])
	}
	return q
}

// TestFineBeamAccuracy: nodal deflections and rotations agree with the
// exact solution to 1e-12·ln(n) relative at every element count, and moments
// and shear forces within their discretisation bounds plus the same
// round-off. One 10⁶-element run shows the limit the benchmarks use.
func TestFineBeamAccuracy(t *testing.T) {
	for i, c := range accuracyModels() {
		ex, err := fem.SolveExact(&c.model)
		if err != nil {
			t.Fatal(err)
		}
		counts := []int{10, 1000, 10_000, 100_000}
		if i == len(accuracyModels())-1 {
			counts = append(counts, 1_000_000)
		}
		for _, n := range counts {
			m := c.model
			m.Mesh = fem.MeshSettings{Elements: n}
			s, err := fem.Solve(&m)
			if err != nil {
				t.Fatalf("%s, %d elements: %v", c.name, n, err)
			}
			allowed := 1e-12 * math.Log(float64(n))
			w, th := nodalErrors(s, ex)
			dm, dv := forceErrors(s, ex, largestLoad(&m))
			t.Logf("%-25s n = %7d: nodal w %.2g, θ %.2g; M %.2g, V %.2g beyond the discretisation bound; Condition %.3g, warnings %d",
				c.name, n, w, th, dm, dv, s.Condition, len(s.Warnings))
			for _, r := range []struct {
				what string
				err  float64
			}{{"nodal deflection", w}, {"nodal rotation", th}, {"bending moment", dm}, {"shear force", dv}} {
				if !(r.err <= allowed) {
					t.Errorf("%s, %d elements: %s error %.3g relative, allowed %.3g", c.name, n, r.what, r.err, allowed)
				}
			}
			if len(s.Warnings) != 0 {
				t.Errorf("%s, %d elements: warnings %v for a well-conditioned model", c.name, n, s.Warnings)
			}
		}
	}
}

// Graded meshes (MeshFromNodes, as adaptive refinement makes them) keep the
// same nodal accuracy: element lengths here range over five decades.
func TestGradedBeamAccuracy(t *testing.T) {
	for _, c := range accuracyModels() {
		ex, err := fem.SolveExact(&c.model)
		if err != nil {
			t.Fatal(err)
		}
		const n = 100_000
		x := make([]float64, n+1)
		for i := range x {
			r := float64(i) / n
			x[i] = c.model.Length() * r * r
		}
		mesh, err := fem.MeshFromNodes(&c.model, x)
		if err != nil {
			t.Fatal(err)
		}
		s, err := fem.SolveOnMesh(&c.model, mesh)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		w, th := nodalErrors(s, ex)
		allowed := 1e-12 * math.Log(n)
		t.Logf("%-25s graded, %d elements: nodal w %.2g, θ %.2g", c.name, len(mesh.Elements), w, th)
		if !(w <= allowed) || !(th <= allowed) || len(s.Warnings) != 0 {
			t.Errorf("%s, graded mesh: nodal deflection error %.3g, rotation %.3g, allowed %.3g; warnings %v", c.name, w, th, allowed, s.Warnings)
		}
	}
}

// TestFineBarAccuracy: a bar under a point load, a rising axial load,
// self-weight along the axis and heating, up to 10⁶ linear or quadratic
// elements (10⁶ for quadratic ones only, to keep the test short). Nodal u is exact in exact arithmetic (Strang & Fix ch. 1, from
// memory); N at an element's middle differs from the exact N by at most the
// axial load over the element, |p|·h (statics), plus round-off.
func TestFineBarAccuracy(t *testing.T) {
	m := fem.Model{Segments: refMember(refLength), Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads:        []fem.PointLoad{{X: 2.5, Axial: refF}},
		DistributedLoad:   []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: refLength, Intensity: refPAxis}}}},
		Gravity:           [2]float64{fem.StandardGravity, 0},
		TemperatureChange: 30}
	ex, err := fem.SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	p := refPAxis + refDensity*refA*fem.StandardGravity // largest |p|, N/m
	for _, order := range []fem.ElementOrder{fem.LinearBar, fem.QuadraticBar} {
		counts := []int{10, 1000, 100_000}
		if order == fem.QuadraticBar {
			counts = append(counts, 1_000_000)
		}
		for _, n := range counts {
			m.Mesh = fem.MeshSettings{Elements: n, BarOrder: order}
			s, err := fem.Solve(&m)
			if err != nil {
				t.Fatal(err)
			}
			var du, su, dn, sn float64
			for i, x := range s.Mesh.X {
				e := ex.At(x, fem.Right)
				du = math.Max(du, math.Abs(s.Displacement[i][fem.Axial]-e.AxialDisplacement))
				su = math.Max(su, math.Abs(e.AxialDisplacement))
			}
			stride := max(1, n/20_000)
			for e := 0; e < len(s.Mesh.Elements); e += stride {
				el := s.Mesh.Elements[e]
				mid := 0.5 * (el.Start + el.End)
				want := ex.At(mid, fem.Right).AxialForce
				dn = math.Max(dn, math.Abs(s.At(mid, fem.Right).AxialForce-want)-p*(el.End-el.Start))
				sn = math.Max(sn, math.Abs(want))
			}
			allowed := 1e-12 * math.Log(float64(n))
			t.Logf("bar order %d, n = %7d: nodal u %.2g, N %.2g beyond the discretisation bound", order, n, du/su, math.Max(dn, 0)/sn)
			if !(du/su <= allowed) || !(dn/sn <= allowed) {
				t.Errorf("bar order %d, %d elements: nodal u error %.3g, axial force error %.3g beyond p·h, relative; allowed %.3g", order, n, du/su, dn/sn, allowed)
			}
		}
	}
}
