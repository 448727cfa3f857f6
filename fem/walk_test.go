package fem_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"stave/fem"
)

// recorder notes the elements a walk shows it, forks included.
type recorder struct{ seen []int }

func (r *recorder) Visit(v *fem.ElementView) { r.seen = append(r.seen, v.Index) }
func (r *recorder) Fork() fem.Visitor        { return &recorder{} }
func (r *recorder) Join(later fem.Visitor)   { r.seen = append(r.seen, later.(*recorder).seen...) }

// Walk shows every element once, in order along the member, on meshes small
// enough for one pass and large enough for two halves at once; Elements
// gives any run of them.
func TestWalkVisitsEachElementOnceInOrder(t *testing.T) {
	for _, n := range []int{1, 7, 4095, 4096, 10001} {
		m := testModelWithElements(n)
		s, e := solveBothModels(t, m)
		var r recorder
		fem.Walk(s, e, &r)
		if len(r.seen) != len(s.Mesh.Elements) {
			t.Fatalf("%d elements: %d visits", len(s.Mesh.Elements), len(r.seen))
		}
		for i, k := range r.seen {
			if k != i {
				t.Fatalf("%d elements: visit %d is element %d", len(s.Mesh.Elements), i, k)
			}
		}
		from, to := len(s.Mesh.Elements)/3, 2*len(s.Mesh.Elements)/3+1
		next := from
		for v := range s.Elements(e, from, to) {
			if v.Index != next || v.Element != s.Mesh.Elements[next] || v.FE.Start != v.Start || !v.HasExact {
				t.Fatalf("%d elements, run %d to %d: view of element %d is %+v", len(s.Mesh.Elements), from, to, next, v.Element)
			}
			next++
		}
		if next != to {
			t.Errorf("%d elements, run %d to %d ended at %d", len(s.Mesh.Elements), from, to, next)
		}
	}
}

// testModelWithElements is a beam with every kind of load on n elements.
func testModelWithElements(n int) *fem.Model {
	rnd := rand.New(rand.NewPCG(3, 5))
	m := randomModel(rnd, everyLoadKind)
	m.Mesh = fem.MeshSettings{Elements: n}
	return m
}

func solveBothModels(t *testing.T, m *fem.Model) (*fem.Solution, *fem.Exact) {
	t.Helper()
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	e, err := fem.SolveExact(m)
	if err != nil {
		t.Fatalf("SolveExact: %v", err)
	}
	return s, e
}

// polynomialQuantities are the quantities an Interval holds as polynomials.
var polynomialQuantities = fem.Quantities()[:fem.QCombinedStress]

// An element's polynomials are its interpolation (InElement) and its exact
// polynomials are the exact solution (Exact.At), to round-off of the
// quantity's size, at random points; the stretches of EachInterval too.
func TestIntervalsAreTheFields(t *testing.T) {
	forRandomModels(t, 41, everyLoadKind, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		s, e := solveBothModels(t, m)
		scale := fieldScales(s, e)
		for v := range s.Elements(e, 0, len(s.Mesh.Elements)) {
			for range 3 {
				xi := rnd.Float64()
				x := v.FE.X(xi)
				fe, ex := s.InElement(v.Index, x), e.At(x, fem.Right)
				for _, q := range polynomialQuantities {
					p, _ := v.FE.Polynomial(q)
					if got, want := p.At(xi), q.Of(&fe); math.Abs(got-want) > 1e-9*scale[q] {
						t.Errorf("element %d, ξ = %g: finite element %s %g, InElement %g", v.Index, xi, q, got, want)
					}
					p, _ = v.Exact.Polynomial(q)
					if got, want := p.At(xi), q.Of(&ex); math.Abs(got-want) > 1e-9*scale[q] {
						t.Errorf("element %d, ξ = %g: exact %s %g, Exact.At %g", v.Index, xi, q, got, want)
					}
				}
			}
		}
		for j, iv := range e.EachInterval() {
			xi := rnd.Float64()
			ex := e.At(iv.X(xi), fem.Right)
			for _, q := range polynomialQuantities {
				if p, _ := iv.Polynomial(q); math.Abs(p.At(xi)-q.Of(&ex)) > 1e-9*scale[q] {
					t.Errorf("stretch %d, ξ = %g: %s %g, Exact.At %g", j, xi, q, p.At(xi), q.Of(&ex))
				}
			}
		}
	})
}

// densePoints is the number of intervals each element is sampled in to
// judge the closed forms: far more than any output ever sampled.
const densePoints = 200

// fieldScales are, per quantity, the largest magnitude of either solution
// at the nodes (both sides) plus the terms that cancel in it: the thermal
// term of N and the stresses, and for θ, M and V the nodal motions over the
// element length (as the Hermite shape functions' derivatives take them).
// Round-off of a quantity is relative to this.
func fieldScales(s *fem.Solution, e *fem.Exact) [fem.QCombinedStress + 1]float64 {
	var scale [fem.QCombinedStress + 1]float64
	for i, el := range s.Mesh.Elements {
		for _, x := range []float64{el.Start, el.End} {
			fe, ex := s.InElement(i, x), e.At(x, fem.Right)
			for _, q := range fem.Quantities() {
				scale[q] = math.Max(scale[q], math.Max(math.Abs(q.Of(&fe)), math.Abs(q.Of(&ex))))
			}
		}
	}
	h := math.Inf(1)
	for _, el := range s.Mesh.Elements {
		h = math.Min(h, el.End-el.Start)
	}
	w, theta := scale[fem.QDeflection]/h, scale[fem.QRotation]
	thermal, bending, moment := 0.0, 0.0, 0.0
	for _, seg := range s.Model.Segments {
		mat, sec := seg.Material, seg.Section
		thermal = math.Max(thermal, mat.Elastic*mat.ThermalExpansion*math.Abs(s.Model.TemperatureChange))
		ei := mat.Elastic * sec.SecondMoment
		moment = math.Max(moment, ei*(w+theta)/h)
		bending = math.Max(bending, mat.Elastic*sec.FibreDistance*(w+theta)/h)
	}
	scale[fem.QRotation] += w
	scale[fem.QBendingMoment] += moment
	scale[fem.QShearForce] += moment / h
	scale[fem.QBendingStress] += bending
	scale[fem.QAxialForce] += thermal * 0.1 // the largest area drawn is 0.1 m²
	scale[fem.QAxialStress] += thermal
	scale[fem.QCombinedStress] += thermal + bending
	for q := range scale {
		scale[q] = math.Max(scale[q], math.SmallestNonzeroFloat64)
	}
	return scale
}

// Summarize's extremes, in closed form, agree with a dense sampling of every
// element (both ends seen from inside) and are never smaller in magnitude:
// a sampling can only miss a peak between its points (the extreme value
// theorem and Fermat's theorem on stationary points). Each is reached where
// it is reported. The combined stress's are those of both extreme fibres,
// σa + |σb| and σa − |σb|.
func TestPropertyExtremesClosedForm(t *testing.T) {
	forRandomModels(t, 43, everyLoadKind, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		s, e := solveBothModels(t, m)
		scale := fieldScales(s, e)
		var lo, hi [fem.QCombinedStress + 1]float64
		for q := range lo {
			lo[q], hi[q] = math.Inf(1), math.Inf(-1)
		}
		for i, el := range s.Mesh.Elements {
			for j := 0; j <= densePoints; j++ {
				f := s.InElement(i, el.Start+(el.End-el.Start)*float64(j)/densePoints)
				for _, q := range fem.Quantities() {
					l, h := q.Of(&f), q.Of(&f)
					if q == fem.QCombinedStress {
						l, h = fibres(&f)
					}
					lo[q], hi[q] = math.Min(lo[q], l), math.Max(hi[q], h)
				}
			}
		}
		h := 0.0
		for _, el := range s.Mesh.Elements {
			h = math.Max(h, el.End-el.Start)
		}
		for _, x := range fem.Summarize(s, nil).Extremes {
			q := x.Quantity
			floor := 1e-9 * scale[q]
			// Between samples h/densePoints apart a polynomial of degree 3
			// departs from its extreme by a little of its own size; a jump
			// of the combined stress is approached to one sample.
			gap := 1e-4*scale[q] + floor
			if x.Max < hi[q]-floor || x.Min > lo[q]+floor || x.Max > hi[q]+gap || x.Min < lo[q]-gap {
				t.Errorf("%s: closed form %g to %g, dense sampling %g to %g", q, x.Min, x.Max, lo[q], hi[q])
			}
			for k, p := range [][2]float64{{x.XMax, x.Max}, {x.XMin, x.Min}} {
				left, right := s.At(p[0], fem.Left), s.At(p[0], fem.Right)
				l, r := q.Of(&left), q.Of(&right)
				if q == fem.QCombinedStress { // the fibre of the extreme
					lc, lt := fibres(&left)
					rc, rt := fibres(&right)
					l, r = [2]float64{lt, lc}[k], [2]float64{rt, rc}[k]
				}
				if d := math.Min(math.Abs(l-p[1]), math.Abs(r-p[1])); d > 1e-9*scale[q] {
					t.Errorf("%s: %g reported at x = %g, where it is %g | %g", q, p[1], p[0], l, r)
				}
			}
		}
	})
}

// fibres are the stresses of the compression and the tension fibre of f,
// σa − |σb| and σa + |σb|.
func fibres(f *fem.Fields) (compression, tension float64) {
	return f.AxialStress - math.Abs(f.BendingStress), f.AxialStress + math.Abs(f.BendingStress)
}

// sampledNorms are the measures of the error against the exact solution as
// Compare took them before the walk, kept here as the reference:
// ComparePoints+1 = 9 points per element for the maxima (both ends, each
// seen from inside its element) and 6 Gauss–Legendre points per element
// for the squared integrals. The stress error compares the finite element
// combined stress with the exact stress on its fibre, as Compare measures
// it now (before the walk each solution's own larger fibre was taken, the
// same but on the slivers where the two solutions' larger fibres differ).
type sampledNorms struct {
	deflection, axial, stress float64
	dispErr, disp             float64
	energyErr, energy         float64
}

func sampledCompare(s *fem.Solution, e *fem.Exact, perElement int) sampledNorms {
	var out sampledNorms
	xs, ws := make([]float64, 6), make([]float64, 6)
	quad.Legendre{}.FixedLocations(xs, ws, 0, 1)
	for i, el := range s.Mesh.Elements {
		for k := 0; k <= perElement; k++ {
			x, side := el.Start+(el.End-el.Start)*float64(k)/float64(perElement), fem.Right
			if k == perElement {
				x, side = el.End, fem.Left
			}
			f, g := s.InElement(i, x), e.At(x, side)
			out.deflection = math.Max(out.deflection, math.Abs(f.Deflection-g.Deflection))
			out.axial = math.Max(out.axial, math.Abs(f.AxialDisplacement-g.AxialDisplacement))
			// The exact stress on the fibre the finite element one is taken at.
			fibre := g.AxialStress + g.BendingStress
			if f.CombinedStress != f.AxialStress+f.BendingStress {
				fibre = g.AxialStress - g.BendingStress
			}
			out.stress = math.Max(out.stress, math.Abs(f.CombinedStress-fibre))
		}
		h := el.End - el.Start
		seg := s.Model.Segments[el.Segment]
		ea, ei := seg.Material.Elastic*seg.Section.Area, seg.Material.Elastic*seg.Section.SecondMoment
		for q := range xs {
			x, w := el.Start+h*xs[q], h*ws[q]
			f, g := s.InElement(i, x), e.At(x, fem.Right)
			du, dw := f.AxialDisplacement-g.AxialDisplacement, f.Deflection-g.Deflection
			dn, dm := f.AxialForce-g.AxialForce, f.BendingMoment-g.BendingMoment
			out.dispErr += w * (du*du + dw*dw)
			out.disp += w * (g.AxialDisplacement*g.AxialDisplacement + g.Deflection*g.Deflection)
			out.energyErr += w * (dn*dn/ea + dm*dm/ei)
			out.energy += w * (g.AxialForce*g.AxialForce/ea + g.BendingMoment*g.BendingMoment/ei)
		}
	}
	return out
}

// Compare in closed form agrees with the sampled and quadrature
// implementation it replaced: its largest errors are never smaller than the
// 9 samples per element found, exceed them by no more than a sampling can
// miss, and agree with a dense sampling; its norms, by quadrature exact for
// the polynomials involved either way, agree to round-off.
func TestPropertyCompareAgainstSampling(t *testing.T) {
	forRandomModels(t, 47, everyLoadKind, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		s, e := solveBothModels(t, m)
		scale := fieldScales(s, e)
		got := fem.Compare(s, e)
		old, dense := sampledCompare(s, e, 8), sampledCompare(s, e, densePoints)
		for _, c := range []struct {
			name                 string
			got, old, dense, tol float64
			scale                float64
		}{
			{"MaxDeflection", got.MaxDeflection, old.deflection, dense.deflection, 1e-4, scale[fem.QDeflection]},
			{"MaxAxial", got.MaxAxial, old.axial, dense.axial, 1e-4, scale[fem.QAxialDisplacement]},
			{"MaxStress", got.MaxStress, old.stress, dense.stress, 2e-2, scale[fem.QCombinedStress]},
		} {
			floor := 1e-9 * c.scale
			if c.got < c.old-floor || c.got < c.dense-floor ||
				c.got > c.old*1.1+floor || c.got > c.dense*(1+c.tol)+floor {
				t.Errorf("%s = %.12g; sampled at 9 points per element %.12g, at %d %.12g", c.name, c.got, c.old, densePoints+1, c.dense)
			}
		}
		// The relative norms, where the exact solution's measure is not at
		// round-off (where it is, Compare judges against a scale of terms).
		for _, c := range []struct {
			name          string
			got, err, ref float64
		}{
			{"RelativeL2", got.RelativeL2, old.dispErr, old.disp},
			{"RelativeEnergy", got.RelativeEnergy, old.energyErr, old.energy},
		} {
			if c.ref <= 1e-6*c.err || c.ref == 0 {
				continue
			}
			want := math.Sqrt(c.err / c.ref)
			if math.Abs(c.got-want) > 1e-7*want+1e-9 {
				t.Errorf("%s = %.12g, by 6-point quadrature through InElement and Exact.At %.12g", c.name, c.got, want)
			}
		}
	})
}

// TestCompareLinearBarMaxAxial: on a bar with a linear load the error of a
// linear element is a cubic whose largest value lies between the sample
// points; the closed form finds it exactly. Fixed at x = 0, load p(x) = p0·x/L
// rising to p0 at the free end: EA·u = p0·(L²x/2 − x³/6)/L, a cubic
// (the textbook closed form of EA·u″ = −p with u(0) = 0, N(L) = 0, from memory). Linear elements are
// exact at the nodes (Hughes, ch. 1, from memory), so on [0, h] the error is
// the cubic less its chord.
func TestCompareLinearBarMaxAxial(t *testing.T) {
	const L, p0, E, A = 2.0, 3e4, 2e11, 1e-3
	m := &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: L, Section: fem.Section{Area: A, SecondMoment: 1e-6, FibreDistance: 0.05},
			Material: fem.Material{Elastic: E}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Fixed}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 0, Intensity: 0}, {X: L, Intensity: p0}}}},
		Mesh:            fem.MeshSettings{Elements: 1, BarOrder: fem.LinearBar},
	}
	s, e := solveBothModels(t, m)
	// u(x) − chord = p0/(6·EA·L)·x·(L² − x²) on the single element [0, L],
	// largest at x = L/√3: p0·L²/(9√3·EA).
	want := p0 * L * L / (9 * math.Sqrt(3) * E * A)
	if got := fem.Compare(s, e).MaxAxial; math.Abs(got-want) > 1e-12*want {
		t.Errorf("MaxAxial = %.15g m, want %.15g m", got, want)
	}
	if old := sampledCompare(s, e, 8).axial; !(old < want*(1-1e-4)) {
		t.Errorf("9 samples found %.15g m: this case no longer shows a peak between them (want below %.15g m)", old, want)
	}
}

// Where the nodal values of the two solutions disagree (here: the exact
// solution of the same member under loads 1 % larger), the errors are no
// bubbles and Compare measures them as they are, by the search and the
// Gauss points of its other path: its largest errors agree with a dense
// sampling, its relative L2 norm with 6-point quadrature through InElement
// and Exact.At.
func TestPropertyCompareNodesDisagree(t *testing.T) {
	forRandomModels(t, 53, everyLoadKind, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		s, _ := solveBothModels(t, m)
		other := m.Clone()
		for i := range other.PointLoads {
			p := &other.PointLoads[i]
			p.Axial, p.Transverse, p.Moment = 1.01*p.Axial, 1.01*p.Transverse, 1.01*p.Moment
		}
		for i := range other.DistributedLoad {
			for j := range other.DistributedLoad[i].Points {
				other.DistributedLoad[i].Points[j].Intensity *= 1.01
			}
		}
		other.Gravity[0], other.Gravity[1] = 1.01*other.Gravity[0], 1.01*other.Gravity[1]
		e, err := fem.SolveExact(&other)
		if err != nil {
			t.Skipf("no exact solution: %v", err)
		}
		scale := fieldScales(s, e)
		got := fem.Compare(s, e)
		dense := sampledCompare(s, e, densePoints)
		for _, c := range []struct {
			name       string
			got, dense float64
			scale      float64
		}{
			{"MaxDeflection", got.MaxDeflection, dense.deflection, scale[fem.QDeflection]},
			{"MaxAxial", got.MaxAxial, dense.axial, scale[fem.QAxialDisplacement]},
		} {
			floor := 1e-9 * c.scale
			if c.got < c.dense-floor || c.got > c.dense*(1+1e-4)+floor {
				t.Errorf("%s = %.12g; sampled at %d points per element %.12g", c.name, c.got, densePoints+1, c.dense)
			}
		}
		if dense.disp > 0 && dense.dispErr > 1e-20*dense.disp {
			want := math.Sqrt(dense.dispErr / dense.disp)
			if math.Abs(got.RelativeL2-want) > 1e-7*want {
				t.Errorf("RelativeL2 = %.12g, by 6-point quadrature %.12g", got.RelativeL2, want)
			}
		}
	})
}
