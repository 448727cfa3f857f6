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
// along it, α = (kₐ/EA)^½. Iterative refinement (groundrefine.go) brings
// the solution back to round-off while the factorization's relative error,
// condition·ε, stays well below 1: the automatic mesh keeps β·h and α·h at
// least these, a condition of about 5e14 for either problem (the two share
// the mesh, so the longer of the two floors holds). That leaves room for
// the shear force on a soft or short bed, constant in each element while
// the bed's k·w changes it: a member riding the bed almost rigidly feels
// k·w ≈ 4P/L under a load P at a free end, and needs some 800 elements
// whatever β is, which the floor allows down to β·L = 0.4. On a softer bed
// the shear force may miss by about 0.1 %/(β·L), and the mesh's note says
// so.
const (
	foundationBetaStep  = 5e-4
	foundationAlphaStep = 1e-7
)

// groundRates are β = (k/4EI)^¼ and α = (kₐ/EA)^½ of d's stretch of
// foundation, 1/m: how fast its fields wave and decay (0 off a foundation).
func (d *elementData) groundRates() (beta, alpha float64) {
	if d.modulus > 0 && d.flexuralRigidity > 0 {
		beta = math.Sqrt(math.Sqrt(d.modulus / (4 * d.flexuralRigidity)))
	}
	if d.axialModulus > 0 && d.axialRigidity > 0 {
		alpha = math.Sqrt(d.axialModulus / d.axialRigidity)
	}
	return beta, alpha
}

// shortestOnFoundation is the shortest element the automatic mesh puts on
// d's stretch of foundation (0 off a foundation).
func (d *elementData) shortestOnFoundation() float64 {
	beta, alpha := d.groundRates()
	h := 0.0
	if beta > 0 {
		h = foundationBetaStep / beta
	}
	if alpha > 0 {
		h = max(h, foundationAlphaStep/alpha)
	}
	return h
}

// groundPieces is how many equal pieces the automatic mesh sizes d's
// stretch in: one off a foundation, one per 1/β (or 1/α) on it, where the
// fields and the load the bed leaves decay by e^(−1) (Hetényi, Beams on
// Elastic Foundation, 1946: the decay of the infinite beam's solution,
// from memory). Each piece gets the elements its own net load asks for,
// so a long stretch is fine only where the bed takes up a load, not all
// along.
func (d *elementData) groundPieces() int {
	beta, alpha := d.groundRates()
	return max(1, int(math.Ceil(min(d.length*max(beta, alpha), maxGroundPieces))))
}

// maxGroundPieces bounds groundPieces for a stretch of extreme β·L, whose
// fields decay to nothing within a sliver of it anyway.
const maxGroundPieces = 4096

// netLoaded is stretch d on a foundation seen as a stretch off it under
// the load the foundation leaves, q − k·w across and p − kₐ·u along (the
// beam's EI·w⁗ = q − k·w, the bar's −EA·u″ = p − kₐ·u): the
// interpolation bounds of elementLength then hold as they stand, with the
// largest net load found by sampling the exact solution e at sixteen
// points per unit of the stretch's λ, and at eight at least. It is sharper
// than |q| + k·|w|max, as the two largest terms seldom meet at one place
// and cancel where the bed takes a load up. Off a foundation d is returned
// as it is.
func netLoaded(d elementData, e *Exact) elementData {
	if d.modulus == 0 && d.axialModulus == 0 {
		return d
	}
	k, ka := d.modulus, d.axialModulus
	n := netLoadSamples(&d)
	q, p := 0.0, 0.0
	for i := 0; i <= n; i++ {
		t := float64(i) / float64(n)
		side := Right
		if i == n {
			side = Left
		}
		f := e.At(d.start+t*d.length, side)
		q = max(q, math.Abs(d.transverseLoad[0]+t*(d.transverseLoad[1]-d.transverseLoad[0])-k*f.Deflection))
		p = max(p, math.Abs(d.axialLoad[0]+t*(d.axialLoad[1]-d.axialLoad[0])-ka*f.AxialDisplacement))
	}
	d.modulus, d.transverseLoad = 0, [2]float64{q, q}
	if ka > 0 { // a linear bar (Validate): its bound reads only the largest load
		d.axialModulus, d.axialLoad = 0, [2]float64{p, p}
	}
	return d
}

// netLoadSamples is how many intervals netLoaded samples stretch d in:
// sixteen per unit of β·ℓ (or α·ℓ), eight at least, and at most sixteen
// per maxSampledUnits. Only a piece of a stretch whose β·L runs past
// maxGroundPieces is longer than one unit, and there the fields decay
// within a sliver of it.
func netLoadSamples(d *elementData) int {
	beta, alpha := d.groundRates()
	return 8 + int(math.Ceil(16*min(d.length*max(beta, alpha), maxSampledUnits)))
}

// maxSampledUnits bounds the units of β·ℓ netLoadSamples samples, so that
// the maxGroundPieces pieces of a stretch together read the exact solution
// about a million times at most: 10⁴ units per piece read it 655 million
// times on a bed of 1e60 N/m² under a 10 m beam, minutes of solving.
const maxSampledUnits = 16

// automaticCounts are the default mesh's element counts per stretch of
// p.keys, stretch j divided into len(n[j]) equal pieces (groundPieces) of
// n[j][i] elements each, and a note on how they were found. With load
// cases, every case must meet the rule on the mesh.
func (p *Member) automaticCounts() ([][]int, string) {
	n := make([][]int, len(p.keys)-1)
	exacts, err := p.ExactLoadSets()
	if err != nil {
		L := p.model.Length()
		for j := range n {
			n[j] = []int{max(1, int(math.Round(fallbackElements*(p.keys[j+1]-p.keys[j])/L)))}
		}
		return n, "automatic: no exact solution to size it from, so about 100 elements spread by length"
	}
	bar, beam := p.model.Formulations()
	// The rule asked the beam's or the bar's elements to be shorter than
	// a foundation allows: its shear force, or its axial force, may miss.
	var flooredBeam, flooredBar bool
	unfollowed := false // a foundation too stiff for any mesh to follow (followable)
	for k, e := range exacts {
		scale := exactScales(e)
		l := &p.loadSets[k]
		sections := sectionTable(&p.model, l)
		for j := range n {
			a, b := p.keys[j], p.keys[j+1]
			d := elementData{start: a, length: b - a, sectionData: sections[p.model.SegmentAt(0.5*(a+b))],
				axialLoad: l.Axial[j], transverseLoad: l.Transverse[j]}
			d.modulus, d.axialModulus = p.model.foundationAt(0.5 * (a + b))
			floor := d.shortestOnFoundation()
			if n[j] == nil {
				n[j] = make([]int, d.groundPieces())
			}
			for i := range n[j] {
				piece := d.piece(i, len(n[j]))
				beta, alpha := piece.groundRates()
				piece = netLoaded(piece, e)
				// Half the accuracy: the bounds are estimates.
				tol := MeshAccuracy / 2
				hBar, hBeam := bar.elementLength(&piece, &scale, tol), beam.elementLength(&piece, &scale, tol)
				if !followable(hBar, alpha, piece.length) {
					hBar, unfollowed = piece.length, true
				}
				if !followable(hBeam, beta, piece.length) {
					hBeam, unfollowed = piece.length, true
				}
				h := min(hBar, hBeam)
				if h < floor && floor < piece.length {
					h = floor
					flooredBeam, flooredBar = flooredBeam || hBeam < floor, flooredBar || hBar < floor
				}
				n[j][i] = max(n[j][i], 1)
				if h < piece.length {
					n[j][i] = max(n[j][i], int(min(math.Ceil(piece.length/h), maxAutomaticElements)))
				}
			}
		}
	}
	total := 0
	for _, c := range n {
		for _, ci := range c {
			total += ci
		}
	}
	if total <= maxAutomaticElements && unfollowed {
		return n, "automatic, for fields within 0.5 % of the exact extremes but over a foundation too stiff for any mesh to follow, whose fields change within less than 200,000 elements could resolve: the elements there are few, and their finite element fields may miss the exact ones by as much as their size"
	}
	if total <= maxAutomaticElements && (flooredBeam || flooredBar) {
		missed := "the shear force"
		switch {
		case flooredBeam && flooredBar:
			missed = "the shear and axial forces"
		case flooredBar:
			missed = "the axial force"
		}
		return n, "automatic, for fields within 0.5 % of the exact extremes but over a foundation, whose equations limit how short its elements may be: " + missed + " there may miss by more"
	}
	if total <= maxAutomaticElements {
		return n, "automatic, for fields within 0.5 % of the exact extremes"
	}
	for _, c := range n {
		for i := range c {
			c[i] = max(1, c[i]*maxAutomaticElements/total)
		}
	}
	return n, "automatic, limited to 200,000 elements: the 0.5 % rule would need more"
}

// followable reports whether elements of length h (as the rule asks) on a
// piece of the given length on a foundation whose fields change at rate
// (β across, α along: 1/m) are worth making: they are, unless the rule
// asks for more than maxAutomaticElements on the piece alone while even
// that many would leave every element longer than 1/rate, over which
// the bed's fields decay by e^(−1) (Hetényi, Beams on Elastic Foundation,
// 1946, from memory). Cubic elements then cannot follow the bed's fields
// at all, however many the piece gets, and spending the whole mesh on it
// bought nothing (a 1,000 m member on a bed of 1e149 N/m² got 200,000
// elements whose shear force missed the exact one by 100 %, and `stave
// solve` took 20 s): such a piece gets one element, and the mesh's note
// says why.
func followable(h, rate, length float64) bool {
	return !(length/h > maxAutomaticElements && rate*length/maxAutomaticElements > 1)
}

// piece is the i-th of pieces equal pieces of stretch d, with the linear
// loads along it.
func (d *elementData) piece(i, pieces int) elementData {
	if pieces == 1 {
		return *d
	}
	out := *d
	h := d.length / float64(pieces)
	out.start, out.length = d.start+float64(i)*h, h
	at := func(l [2]float64, t float64) float64 { return l[0] + t*(l[1]-l[0]) }
	t0, t1 := float64(i)/float64(pieces), float64(i+1)/float64(pieces)
	out.axialLoad = [2]float64{at(d.axialLoad, t0), at(d.axialLoad, t1)}
	out.transverseLoad = [2]float64{at(d.transverseLoad, t0), at(d.transverseLoad, t1)}
	return out
}
