package fem

import "math"

// The default mesh. When a model leaves the mesh to Stave (Mesh.Automatic),
// Stave sizes the elements of every stretch from the exact solution of the
// same model and the interpolation error of each element kind, so that for
// every field it reports (u, w, θ, N, V, M and each stress) the finite
// element value stays within MeshAccuracy of that field's largest magnitude
// everywhere: the FE extreme is then within MeshAccuracy of the exact one,
// and lies where the field comes within that margin of its extreme, next
// to the exact place. The element kinds' error bounds are their own
// (Formulation.elementLength); each bound is used with a safety factor of
// two, and TestDefaultMeshRule checks the rule on random models by sampling.

// MeshAccuracy is the accuracy the default mesh is chosen for, relative to
// each field's largest magnitude.
const MeshAccuracy = 0.005

// maxAutomaticElements bounds the default mesh; a model whose rule asks for
// more gets this many, shared out in proportion, and the mesh says so.
const maxAutomaticElements = 200_000

// fallbackElements is the default mesh's size when there is no exact
// solution to size it from (the model cannot be solved in closed form).
const fallbackElements = 100

// Automatic reports whether the settings leave the mesh to Stave: no element
// count and no element length asked for.
func (s MeshSettings) Automatic() bool { return s.Elements <= 0 && s.MaxElementLength <= 0 }

// fieldScales are the largest magnitudes of the exact fields over the member.
type fieldScales [quantityCount]float64

// exactScales samples e at both ends and seven inner points of every
// stretch: its fields are polynomials of degree five at most there, so the
// largest magnitude found is within a few per cent of the true one, which
// is all a scale for the mesh rule needs. On a foundation the fields wave
// and decay over 2π/β; the samples are eight times denser per unit of λ.
func exactScales(e *Exact) fieldScales {
	var s fieldScales
	for j := range e.stretches {
		st := &e.stretches[j]
		n := 8 * (1 + int(math.Ceil(min(max(st.bar.ground.scale, st.beam.ground.scale), 1e4))))
		for k := 0; k <= n; k++ {
			side := Right
			if k == n {
				side = Left
			}
			f := e.At(st.start+st.length*float64(k)/float64(n), side)
			for q := range s {
				s[q] = math.Max(s[q], math.Abs(Quantity(q).Of(&f)))
			}
		}
	}
	return s
}

// sizeLimit is the largest h with coefficient·h^power ≤ allowed: an element
// length that keeps an interpolation error of that form within allowed.
// When nothing is allowed (the field is zero everywhere) or nothing is
// wrong (a zero coefficient), any length will do.
func sizeLimit(coefficient float64, power float64, allowed float64) float64 {
	if coefficient == 0 || allowed == 0 {
		return math.Inf(1)
	}
	return math.Pow(allowed/math.Abs(coefficient), 1/power)
}

// Over a foundation every node of the mesh enters the factorized
// equations, whose condition grows as the fourth power of the elements
// there: about 4/(β·h)⁴ across the member, β = (k/4EI)^¼, and 4/(α·h)²
// along it, α = (kₐ/EA)^½. The automatic mesh keeps β·h and α·h at least
// these, so that round-off (condition·ε) stays near 1e-5 at worst; the
// finite element shear force, constant in each element while the bed's
// k·w changes it, is then within about β·h = 0.4 % of its peak.
const (
	foundationBetaStep  = 0.004
	foundationAlphaStep = 1e-5
)

// beamStepOffBed is the shortest element, as a share of the member's
// length, that the automatic mesh puts where every node enters the beam's
// factorized equations but no bed across the member steadies them: a
// stretch on a foundation along the member alone (keyNodes takes every
// node of a stretch on either kind of foundation, for the bar and the beam
// alike). There the beam's condition grows as the fourth power of the
// number of elements over the member: a thousand keep round-off near
// 1e-5, as foundationBetaStep does on a bed, where the bar's rule for its
// axial force alone would ask for tens of thousands and leave the bending
// to round-off, or refuse it as singular.
const beamStepOffBed = 1e-3

// shortestOnFoundation is the shortest element the automatic mesh puts on
// d's stretch of foundation (0 off a foundation), on a member of the given
// length whose bending is solved or not.
func (d *elementData) shortestOnFoundation(length float64, bending bool) float64 {
	h := 0.0
	switch {
	case d.modulus > 0 && d.flexuralRigidity > 0:
		h = foundationBetaStep / math.Sqrt(math.Sqrt(d.modulus/(4*d.flexuralRigidity)))
	case d.axialModulus > 0 && bending:
		h = beamStepOffBed * length
	}
	if d.axialModulus > 0 && d.axialRigidity > 0 {
		h = max(h, foundationAlphaStep/math.Sqrt(d.axialModulus/d.axialRigidity))
	}
	return h
}

// automaticCounts are the default mesh's element counts per stretch of
// p.keys, and a note on how they were found. With load cases, every case
// must meet the rule on the mesh.
func (p *Member) automaticCounts() ([]int, string) {
	n := make([]int, len(p.keys)-1)
	exacts, err := p.ExactLoadSets()
	if err != nil {
		L := p.model.Length()
		for j := range n {
			n[j] = max(1, int(math.Round(fallbackElements*(p.keys[j+1]-p.keys[j])/L)))
		}
		return n, "automatic: no exact solution to size it from, so about 100 elements spread by length"
	}
	bar, beam := p.model.Formulations()
	for k, e := range exacts {
		scale := exactScales(e)
		l := &p.loadSets[k]
		sections := sectionTable(&p.model, l)
		for j := range n {
			a, b := p.keys[j], p.keys[j+1]
			d := elementData{start: a, length: b - a, sectionData: sections[p.model.SegmentAt(0.5*(a+b))],
				axialLoad: l.Axial[j], transverseLoad: l.Transverse[j]}
			d.modulus, d.axialModulus = p.model.foundationAt(0.5 * (a + b))
			// Half the accuracy: the bounds are estimates.
			tol := MeshAccuracy / 2
			h := min(bar.elementLength(&d, &scale, tol), beam.elementLength(&d, &scale, tol))
			h = max(h, d.shortestOnFoundation(p.model.Length(), p.bending))
			n[j] = max(n[j], 1)
			if h < d.length {
				n[j] = max(n[j], int(min(math.Ceil(d.length/h), maxAutomaticElements)))
			}
		}
	}
	total := 0
	for _, c := range n {
		total += c
	}
	if total <= maxAutomaticElements {
		return n, "automatic, for fields within 0.5 % of the exact extremes"
	}
	for j := range n {
		n[j] = max(1, n[j]*maxAutomaticElements/total)
	}
	return n, "automatic, limited to 200,000 elements: the 0.5 % rule would need more"
}
