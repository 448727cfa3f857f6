package fem

import (
	"math"
	"testing"
)

// Consistent nodal loads of single elements against closed forms.
func TestElementLoadVectors(t *testing.T) {
	const L, p, q = 2.5, 3e3, -7e3
	bar := func(order ElementOrder, p1, p2 float64) localVector {
		d := elementData{length: L, axialLoad: [2]float64{p1, p2}}
		return d.barLoads(order)
	}
	beam := func(q1, q2 float64) localVector {
		d := elementData{length: L, transverseLoad: [2]float64{q1, q2}}
		return d.beamLoads()
	}
	cases := []struct {
		name      string
		got, want localVector
	}{
		// Linear bar, uniform p: p·L/2 at each node (Hughes, The Finite Element Method, ch. 1, from memory).
		{"linear bar, uniform", bar(LinearBar, p, p), localVector{p * L / 2, p * L / 2}},
		// Linear bar, p from p1 to p2: L(2p1+p2)/6 and L(p1+2p2)/6 (Hughes, ch. 1, from memory).
		{"linear bar, linear", bar(LinearBar, p, -2*p), localVector{L * (2*p - 2*p) / 6, L * (p - 4*p) / 6}},
		// Quadratic bar, uniform p: p·L·(1/6, 2/3, 1/6) (Hughes, ch. 3, Simpson weights, from memory).
		{"quadratic bar, uniform", bar(QuadraticBar, p, p), localVector{p * L / 6, 2 * p * L / 3, p * L / 6}},
		// Quadratic bar, triangular 0→p: p·L·(0, 1/3, 1/6) (∫ of the shape functions times ξ, from memory).
		{"quadratic bar, triangular", bar(QuadraticBar, 0, p), localVector{0, p * L / 3, p * L / 6}},
		// Beam, uniform q: [qL/2, qL²/12, qL/2, −qL²/12] (fixed-end force tables,
		// AISC Manual beam diagrams case 15, from memory).
		{"beam, uniform", beam(q, q), localVector{q * L / 2, q * L * L / 12, q * L / 2, -q * L * L / 12}},
		// Beam, triangular 0→q: [3qL/20, qL²/30, 7qL/20, −qL²/20] (fixed-end
		// force tables for a triangular load, from memory).
		{"beam, triangular", beam(0, q), localVector{3 * q * L / 20, q * L * L / 30, 7 * q * L / 20, -q * L * L / 20}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			for i := range c.want {
				if math.Abs(c.got[i]-c.want[i]) > 1e-12*math.Abs(p*L) {
					t.Errorf("entry %d: got %.12g, want %.12g", i, c.got[i], c.want[i])
				}
			}
		})
	}
}

// The thermal nodal forces of a bar are ∓EA·α·ΔT at its ends and nothing at
// a quadratic bar's middle node (virtual work of the free strain, from memory).
func TestThermalLoadVectors(t *testing.T) {
	d := elementData{length: 1.7, sectionData: sectionData{axialRigidity: 3e8, thermalStrain: 4e-4}}
	want := 3e8 * 4e-4
	if f := d.barLoads(LinearBar); f[0] != -want || f[1] != want {
		t.Errorf("linear: %v, want [%g %g]", f[:2], -want, want)
	}
	if f := d.barLoads(QuadraticBar); f[0] != -want || f[1] != 0 || f[2] != want {
		t.Errorf("quadratic: %v, want [%g 0 %g]", f[:3], -want, want)
	}
}

// Stiffness matrices: closed forms checked against the energy of exactly
// representable motions, which is independent of how the matrix was written:
// ½·uᵀKu must equal ½∫EA·u'² or ½∫EI·w″² for the interpolated field.
func TestElementStiffnessEnergy(t *testing.T) {
	d := elementData{length: 1.3, sectionData: sectionData{axialRigidity: 2e9, flexuralRigidity: 5e6}}
	quadForm := func(k localMatrix, u []float64) float64 {
		s := 0.0
		for i := range u {
			for j := range u {
				s += u[i] * k[i][j] * u[j]
			}
		}
		return 0.5 * s
	}
	bar := [][]float64{{0.3, -0.1}, {1, 1}, {0.2, -0.4, 0.7}, {1, 1, 1}}
	for _, u := range bar {
		order := ElementOrder(len(u) - 1)
		got := quadForm(d.barStiffness(order), u)
		want := d.strainEnergy(order, u, make([]float64, 4))
		if math.Abs(got-want) > 1e-12*max(math.Abs(want), 1) {
			t.Errorf("bar %v: ½uᵀKu = %g, ½∫EA u'² = %g", u, got, want)
		}
	}
	for _, w := range [][]float64{{0.01, 0.02, -0.03, 0.005}, {1, 0, 1, 0}, {0, 1, 1.3, 1}} {
		got := quadForm(d.beamStiffness(), w)
		want := d.strainEnergy(LinearBar, []float64{0, 0}, w)
		if math.Abs(got-want) > 1e-9*max(math.Abs(want), 1e-6) {
			t.Errorf("beam %v: ½wᵀKw = %g, ½∫EI w''² = %g", w, got, want)
		}
	}
	// Rigid-body motions store no energy: u = const, w = a + b·x.
	if e := quadForm(d.beamStiffness(), []float64{0.2, 0.1, 0.2 + 0.1*1.3, 0.1}); math.Abs(e) > 1e-6 {
		t.Errorf("rigid beam motion stores %g J", e)
	}
}

// The 12, 6L, 4L², 2L² entries of the Hermite stiffness (Hughes; from memory).
func TestBeamStiffnessEntries(t *testing.T) {
	L, EI := 2.0, 3.0
	k := (&elementData{length: L, sectionData: sectionData{flexuralRigidity: EI}}).beamStiffness()
	want := [4][4]float64{
		{12, 6 * L, -12, 6 * L},
		{6 * L, 4 * L * L, -6 * L, 2 * L * L},
		{-12, -6 * L, 12, -6 * L},
		{6 * L, 2 * L * L, -6 * L, 4 * L * L},
	}
	for i := range want {
		for j := range want[i] {
			if w := want[i][j] * EI / (L * L * L); math.Abs(k[i][j]-w) > 1e-15*math.Abs(w) {
				t.Errorf("K[%d][%d] = %g, want %g", i, j, k[i][j], w)
			}
		}
	}
}

// strainEnergy is, by quadrature, ½∫EA(u' − αΔT)² dx + ½∫EI·w”² dx over the element, given
// its bar and beam nodal values; both integrands are at most quadratic.
func (d *elementData) strainEnergy(order ElementOrder, bar []float64, beam []float64) float64 {
	h := d.length
	e := 0.0
	for _, g := range gauss3 {
		_, dn := barShape(order, g.xi, h)
		strain := -d.thermalStrain
		for a := range order.nodes() {
			strain += dn[a] * bar[a]
		}
		_, _, d2, _ := hermite(g.xi, h)
		curvature := 0.0
		for a := range d2 {
			curvature += d2[a] * beam[a]
		}
		e += g.w * h * (d.axialRigidity*strain*strain + d.flexuralRigidity*curvature*curvature)
	}
	return 0.5 * e
}

// The beam element is named after the theory of the segments it stands in:
// with shear deformation it is the interdependent interpolation element of
// a Timoshenko beam (its consistent loads carry φ, nodalloads.go), and the
// legends, the mesh panel and the table of nodal loads called it a Hermite
// beam.
func TestBeamElementNamedAfterItsTheory(t *testing.T) {
	steel := Material{Elastic: 200e9, Poisson: 0.3}
	sec := Section{Area: 4e-3, SecondMoment: 8e-6, FibreDistance: 0.1, ShearCoefficient: 5.0 / 6}
	seg := func(start, end float64, shear bool) Segment {
		return Segment{Start: start, End: end, Section: sec, Material: steel, ShearDeformation: shear}
	}
	for _, c := range []struct {
		segments []Segment
		want     string
	}{
		{[]Segment{seg(0, 2, false), seg(2, 4, false)}, "Hermite beam"},
		{[]Segment{seg(0, 2, true), seg(2, 4, false)}, "Hermite and Timoshenko beam"},
		{[]Segment{seg(0, 2, true), seg(2, 4, true)}, "Timoshenko beam"},
	} {
		m := Model{Segments: c.segments}
		if _, beam := m.Formulations(); beam.Name() != c.want {
			t.Errorf("shear deformation %v, %v: the beam element is %q, want %q", c.segments[0].ShearDeformation, c.segments[1].ShearDeformation, beam.Name(), c.want)
		}
	}
}
