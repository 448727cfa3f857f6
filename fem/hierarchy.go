package fem

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"sort"
)

// Fine meshes are solved in a hierarchical basis instead of by assembling
// and eliminating the fine stiffness matrix, whose condition number grows
// like n² for bars and n⁴ for beams: with 10,000 Hermite elements the
// eliminated answer had lost every digit.
//
// Between two neighbouring key points (a stretch) the section is constant,
// distributed loads are linear and nothing restrains the interior nodes.
// Split the node range [lo, hi] of a stretch at a middle node m and take as
// the functions of m the shape functions of the two elements [x_lo, x_m] and
// [x_m, x_hi]: the hat for the bar, the two Hermite cubics for the beam.
// Every function of a coarser level (the key-point mesh included) is linear
// (bar) or cubic (beam) on [x_lo, x_hi], and integrating ∫EA·φ'·ψ' or
// ∫EI·φ''·ψ'' by parts leaves only end terms where φ and φ' vanish: the
// functions of m are energy-orthogonal to all coarser ones, and those of one
// level have disjoint supports. Recursing on [lo, m] and [m, hi] gives a
// basis of the fine space in which the stiffness matrix is block diagonal:
// the key-point system, then a 1×1 (bar) and a 2×2 (beam) system per
// interior node. Each is well conditioned; the key-point system is solved by
// band.LDL. Quadratic bars add one bubble per element, orthogonal to every
// piecewise linear function (its derivative integrates to zero on the
// element).
//
// The coarser solution on [x_lo, x_hi] is carried down as Taylor data at
// x_lo (bar slope u'; beam w'' and w'''), updated by each level's
// coefficients, so slopes, moments and shear forces never come from
// differences of nearly equal nodal values.
//
// Supports, springs, segment breaks and distributed-load break points are
// the key points; all hierarchical functions vanish there, so the reactions
// of the key-point system are those of the fine mesh. Point loads are nodes
// of the fine mesh but stay out of the key-point system, where a load close
// to a support would make a short, stiff stretch: they load it through the
// consistent forces N·P + N'·C of the stretch they lie in, and the
// hierarchical functions whose support covers them the same way. Loads do
// not enter the orthogonality, which is a property of the stiffness alone.

// elementField is what the fields of one element need beyond its end
// displacements: the derivatives the hierarchy carried down to it.
type elementField struct {
	slope     float64 // u' of the linear part of the bar, constant on the element
	bubble    float64 // quadratic bars: u at the middle less the mean of the ends, m
	curvature float64 // w'' at the element's start, 1/m
	third     float64 // w''', constant on the element, 1/m²
}

// taylor is the coarser solution on an interval, seen from its start.
type taylor struct {
	slope, curvature, third float64 // u', w'', w'''
}

// stretchRefiner fills the interior nodes and elements of one stretch.
type stretchRefiner struct {
	x           []float64
	disp        [][3]float64
	fields      []elementField
	sectionData // of the stretch
	order       ElementOrder
	// stretch is the stretch being refined. Its loads are linear on the
	// interval being refined when linear is true (always when it has no
	// breaks): intensity at start plus slope·(x − start).
	stretch                     *elementData
	linear                      bool
	start                       float64
	axial, axialSlope           float64 // N/m, N/m²
	transverse, transverseSlope float64 // N/m, N/m²
	// Point loads inside the stretch, in order, and the node each sits on.
	points     []PointLoad
	pointNodes []int
	// nodesOf are pointNodes for every stretch, found once (refineAll) and
	// shared, read only, by every copy of the refiner: a stretch is set up
	// again for each run of jobs on it, and looking its thousand loads' nodes
	// up each time was a fifth of the refinement.
	nodesOf [][]int
	// releasedNode is the stretch's first node when it starts at a hinge
	// (its own start rotation differs from the node's), else −1.
	releasedNode int
	energy       float64 // twice the strain energy, J
	// poison stays 0 while every result read off the elements
	// (displacements, actions, stresses) is finite and turns NaN at the
	// first that is not: it sums v·0, which is NaN for an infinite or NaN v.
	poison float64
}

// refineJob is an interval of stretch j, between fine nodes lo and hi, still
// to refine, with the coarser solution's Taylor data at lo.
type refineJob struct {
	stretch, lo, hi int
	c               taylor
}

// parallelRefine is the number of elements from which refineAll works on two
// goroutines: below it a goroutine costs more than the half it saves (about
// 50 ns per element).
const parallelRefine = 4096

// refineAll solves the hierarchical levels of every stretch; keys are the
// fine nodes of the key points and proto holds the shared slices. It returns
// twice the strain energy and the sum of the refiners' poison fields.
// A large mesh is cut into jobs holding at most an eighth of the elements
// each, and two runs of jobs of about half the elements each go to two
// goroutines. The cut depends on the mesh only and the two sums are added in
// one order, so the answer is the same to the bit on any number of cores.
func refineAll(proto stretchRefiner, stretches []elementData, keys []int) (energy, poison float64) {
	jobs := make([]refineJob, len(stretches))
	proto.findNodes(stretches)
	r := proto
	for j := range stretches {
		d := &stretches[j]
		r.setup(stretches, j)
		jobs[j] = refineJob{stretch: j, lo: keys[j], hi: keys[j+1], c: r.startTaylor(d, keys[j], keys[j+1])}
	}
	total := keys[len(keys)-1] - keys[0]
	if total < parallelRefine {
		r.run(jobs, stretches)
		return r.energy, r.poison
	}
	jobs = r.cut(jobs, stretches, total/8)
	k, half := 0, 0
	for ; k < len(jobs) && 2*half < total; k++ {
		half += jobs[k].hi - jobs[k].lo
	}
	first, second := proto, proto
	done := make(chan struct{})
	go func() {
		second.run(jobs[k:], stretches)
		close(done)
	}()
	first.run(jobs[:k], stretches)
	<-done
	return first.energy + second.energy, first.poison + second.poison
}

// findNodes sorts each stretch's point loads by position and finds the
// node each sits on (nodesOf).
func (r *stretchRefiner) findNodes(stretches []elementData) {
	r.nodesOf = make([][]int, len(stretches))
	for j := range stretches {
		d := &stretches[j]
		slices.SortFunc(d.points, func(p, q PointLoad) int { return cmp.Compare(p.X, q.X) })
		nodes := make([]int, len(d.points))
		for i, p := range d.points {
			nodes[i] = nearest(r.x, p.X)
		}
		r.nodesOf[j] = nodes
	}
}

// cut splits the jobs holding more than most elements at their middle node
// until none does, and returns them in the order of the nodes.
func (r *stretchRefiner) cut(jobs []refineJob, stretches []elementData, most int) []refineJob {
	out := make([]refineJob, 0, 2*len(jobs)+16)
	var cutJob func(j refineJob)
	cutJob = func(j refineJob) {
		if j.hi-j.lo <= max(most, 1) {
			out = append(out, j)
			return
		}
		entered := !r.linear && r.enter(j.lo, j.hi) // as split does
		m, left, right := r.middle(j.lo, j.hi, j.c)
		if entered {
			r.linear = false
		}
		cutJob(refineJob{stretch: j.stretch, lo: j.lo, hi: m, c: left})
		cutJob(refineJob{stretch: j.stretch, lo: m, hi: j.hi, c: right})
	}
	r.each(jobs, stretches, cutJob)
	return out
}

// run refines the jobs in order.
func (r *stretchRefiner) run(jobs []refineJob, stretches []elementData) {
	r.each(jobs, stretches, func(j refineJob) { r.split(j.lo, j.hi, j.c) })
}

// each calls do for the jobs in order, with r set up for each job's stretch.
func (r *stretchRefiner) each(jobs []refineJob, stretches []elementData, do func(refineJob)) {
	current := -1
	for _, j := range jobs {
		if j.stretch != current {
			r.setup(stretches, j.stretch)
			current = j.stretch
		}
		do(j)
	}
}

// setup points r at stretch j: its section, loads and point loads (sorted by
// position, with their nodes).
func (r *stretchRefiner) setup(stretches []elementData, j int) {
	d := &stretches[j]
	r.sectionData = d.sectionData
	r.stretch = d
	r.start = d.start
	r.linear = len(d.breaks) == 0
	r.axial, r.axialSlope = d.axialLoad[0], (d.axialLoad[1]-d.axialLoad[0])/d.length
	r.transverse, r.transverseSlope = d.transverseLoad[0], (d.transverseLoad[1]-d.transverseLoad[0])/d.length
	r.points, r.pointNodes = d.points, r.nodesOf[j]
	r.releasedNode = -1
	if d.released {
		r.releasedNode = nearest(r.x, d.start)
	}
}

// displacement is node i's displacement as the stretch being refined sees
// it: at the start of a stretch that starts at a hinge, with the stretch's
// own start rotation.
func (r *stretchRefiner) displacement(i int) [3]float64 {
	d := r.disp[i]
	if i == r.releasedNode {
		d[Rotation] = r.stretch.startRotation
	}
	return d
}

// startTaylor is the key-point solution's Taylor data at the start of
// stretch d, between fine nodes lo and hi.
func (r *stretchRefiner) startTaylor(d *elementData, lo, hi int) taylor {
	a, b := r.displacement(lo), r.disp[hi]
	d2, d3 := rotationSlopes(d.length, d.phi(d.length))
	beam := [4]float64{a[Transverse], a[Rotation], b[Transverse], b[Rotation]}
	var c taylor
	c.slope = (b[Axial] - a[Axial]) / d.length
	for i, v := range beam {
		c.curvature += d2[i] * v
		c.third += d3[i] * v
	}
	return c
}

// split solves the levels of [lo, hi] down to its elements.
func (r *stretchRefiner) split(lo, hi int, c taylor) {
	if hi-lo == 1 {
		r.finish(lo, c)
		return
	}
	if !r.linear && r.enter(lo, hi) {
		r.split(lo, hi, c)
		r.linear = false
		return
	}
	m, left, right := r.middle(lo, hi, c)
	r.split(lo, m, left)
	r.split(m, hi, right)
}

// middle solves the functions of the middle node m of [lo, hi] and returns
// m with the Taylor data at the starts of [lo, m] and [m, hi].
func (r *stretchRefiner) middle(lo, hi int, c taylor) (m int, left, right taylor) {
	m = lo + (hi-lo)/2
	xl, xm, xh := r.x[lo], r.x[m], r.x[hi]
	a, b := xm-xl, xh-xm

	ia, ib := 1/a, 1/b // one division each; the rest multiplies

	// Bar: the hat at m, ∫p·φ from the consistent forces of the two
	// elements (its thermal forces cancel). Beam: the end block of the left
	// element plus the start block of the right one, loaded by their
	// consistent forces at m.
	if r.shear != 0 {
		return r.middleWithShear(lo, m, hi, c)
	}
	var cu, fw, ft float64
	if s := r.stretch; r.linear {
		pl, pm, ph := r.axialAt(xl), r.axialAt(xm), r.axialAt(xh)
		ql, qm, qh := r.transverseAt(xl), r.transverseAt(xm), r.transverseAt(xh)
		cu = (a*(pl+2*pm) + b*(2*pm+ph)) / (6 * r.axialRigidity * (ia + ib))
		// hermiteLoads of the two elements at m, two divisions instead of eight.
		fw = (a*(3*ql+7*qm) + b*(7*qm+3*qh)) / 20
		ft = (b*b*(3*qm+2*qh) - a*a*(2*ql+3*qm)) / 60
	} else {
		cu = (s.linearBarLoadsOn(xl, xm)[1] + s.linearBarLoadsOn(xm, xh)[0]) / (r.axialRigidity * (ia + ib))
		fl, fr := s.hermiteLoadsOn(xl, xm), s.hermiteLoadsOn(xm, xh)
		fw, ft = fl[2]+fr[0], fl[3]+fr[1]
	}
	ei := r.flexuralRigidity
	k11 := 12 * ei * (ia*ia*ia + ib*ib*ib)
	k12 := 6 * ei * (ib*ib - ia*ia)
	k22 := 4 * ei * (ia + ib)
	if len(r.points) > 0 {
		pu, pw, pt := r.pointsOn(lo, m, hi)
		cu += pu / (r.axialRigidity * (ia + ib))
		fw, ft = fw+pw, ft+pt
	}
	// The scaled off-diagonal |k12|/√(k11·k22) is at most √3/2, so the
	// determinant keeps at least a quarter of k11·k22: no cancellation.
	idet := 1 / (k11*k22 - k12*k12)
	cw := (k22*fw - k12*ft) * idet
	ct := (k11*ft - k12*fw) * idet

	p := r.displacement(lo)
	r.disp[m] = [3]float64{
		p[Axial] + c.slope*a + cu,
		p[Transverse] + a*(p[Rotation]+a*(c.curvature/2+a*c.third/6)) + cw,
		p[Rotation] + a*(c.curvature+a*c.third/2) + ct,
	}
	left = taylor{
		slope:     c.slope + cu*ia,
		curvature: c.curvature + (6*cw*ia-2*ct)*ia,
		third:     c.third + (6*ct-12*cw*ia)*ia*ia,
	}
	right = taylor{
		slope:     c.slope - cu*ib,
		curvature: c.curvature + a*c.third - (6*cw*ib+4*ct)*ib,
		third:     c.third + (12*cw*ib+6*ct)*ib*ib,
	}
	return m, left, right
}

// middleWithShear is middle for a Timoshenko stretch (shear flexibility g =
// EI/(G·As) > 0): the functions of m are those of the interdependent
// interpolation elements [lo, m] and [m, hi] (beamShape), still
// energy-orthogonal to every coarser function because they solve the
// homogeneous Timoshenko equations. The Taylor data carry θ′ and θ″ (not
// w″, w‴): w′ = θ − g·θ″ (the shear strain), w″ = θ′ and w‴ = θ″.
func (r *stretchRefiner) middleWithShear(lo, m, hi int, c taylor) (int, taylor, taylor) {
	xl, xm, xh := r.x[lo], r.x[m], r.x[hi]
	a, b := xm-xl, xh-xm
	ia, ib := 1/a, 1/b
	s, g := r.stretch, r.shear
	cu := (s.linearBarLoadsOn(xl, xm)[1] + s.linearBarLoadsOn(xm, xh)[0]) / (r.axialRigidity * (ia + ib))
	fl, fr := s.hermiteLoadsOn(xl, xm), s.hermiteLoadsOn(xm, xh)
	pa, pb := 12*g*ia*ia, 12*g*ib*ib // φ of each element
	ma, mb := 1/(1+pa), 1/(1+pb)
	ei := r.flexuralRigidity
	k11 := 12 * ei * (ma*ia*ia*ia + mb*ib*ib*ib)
	k12 := 6 * ei * (mb*ib*ib - ma*ia*ia)
	k22 := ei * ((4+pa)*ma*ia + (4+pb)*mb*ib)
	fw, ft := fl[2]+fr[0], fl[3]+fr[1]
	if len(r.points) > 0 {
		pu, pw, pt := r.pointsOn(lo, m, hi)
		cu += pu / (r.axialRigidity * (ia + ib))
		fw, ft = fw+pw, ft+pt
	}
	idet := 1 / (k11*k22 - k12*k12)
	cw := (k22*fw - k12*ft) * idet
	ct := (k11*ft - k12*fw) * idet

	p := r.displacement(lo)
	r.disp[m] = [3]float64{
		p[Axial] + c.slope*a + cu,
		p[Transverse] + a*(p[Rotation]-g*c.third+a*(c.curvature/2+a*c.third/6)) + cw,
		p[Rotation] + a*(c.curvature+a*c.third/2) + ct,
	}
	// θ′ and θ″ of the left element's end functions at its start and of
	// the right element's start functions (beamShape's θ, differentiated).
	left := taylor{
		slope:     c.slope + cu*ia,
		curvature: c.curvature + ma*(6*cw*ia-(2-pa)*ct)*ia,
		third:     c.third + ma*(6*ct-12*cw*ia)*ia*ia,
	}
	right := taylor{
		slope:     c.slope - cu*ib,
		curvature: c.curvature + a*c.third - mb*(6*cw*ib+(4+pb)*ct)*ib,
		third:     c.third + mb*(12*cw*ib+6*ct)*ib*ib,
	}
	return m, left, right
}

// rotationSlopes are the first and second derivatives at the start of the
// rotation's shape functions (beamShape's θ) for an element of length h
// with shear parameter φ: θ′ and θ″ of the element from its end values.
func rotationSlopes(h, phi float64) (d1, d2 [4]float64) {
	if phi == 0 {
		_, _, d2, d3 := hermite(0, h)
		return d2, d3
	}
	mu := 1 / (1 + phi)
	d1 = [4]float64{-6 * mu / (h * h), -(4 + phi) * mu / h, 6 * mu / (h * h), -(2 - phi) * mu / h}
	d2 = [4]float64{12 * mu / (h * h * h), 6 * mu / (h * h), -12 * mu / (h * h * h), 6 * mu / (h * h)}
	return d1, d2
}

// finish stores element e's derivatives, solves its bubble and adds its energy.
func (r *stretchRefiner) finish(e int, c taylor) {
	h := r.x[e+1] - r.x[e]
	f := elementField{slope: c.slope, curvature: c.curvature, third: c.third}
	strain := c.slope - r.thermalStrain
	if r.order == QuadraticBar {
		// Break points of the loads are nodes: the load is linear here.
		p := [2]float64{r.axialAt(r.x[e]), r.axialAt(r.x[e+1])}
		if len(r.stretch.breaks) > 0 {
			p = [2]float64{r.stretch.axialAt(r.x[e], Right), r.stretch.axialAt(r.x[e+1], Left)}
		}
		d := elementData{length: h, sectionData: sectionData{axialRigidity: r.axialRigidity}, axialLoad: p}
		k, load := d.barStiffness(QuadraticBar), d.barLoads(QuadraticBar)
		f.bubble = load[1] / k[1][1]
	}
	r.energy += r.sectionData.energy(h, f)
	r.fields[e] = f
	d := r.disp[e]
	// Bounds of the actions and stress in the element: non-negative, so
	// their sum overflows only if one of them is near overflow itself.
	axial := r.axialRigidity * (math.Abs(strain) + 4*math.Abs(f.bubble)/h)
	moment := r.flexuralRigidity * (math.Abs(c.curvature) + h*math.Abs(c.third))
	r.poison += d[Axial]*0 + d[Transverse]*0 + d[Rotation]*0 +
		(axial+moment+r.flexuralRigidity*math.Abs(c.third)+axial/r.area+moment*r.fibre/r.secondMoment)*0
}

// energy is twice the strain energy of an element of length h with fields
// f on this section, J (springs excluded).
func (d *sectionData) energy(h float64, f elementField) float64 {
	strain := f.slope - d.thermalStrain
	// The bubble's strain (4 − 8ξ)·bubble/h is orthogonal to the constant
	// part; the bubble is 0 but for quadratic bars.
	bar := strain*strain + 16.0/3*(f.bubble/h)*(f.bubble/h)
	// ∫(w'' + w'''·s)² ds over [0, h].
	k0 := f.curvature - d.thermalCurvature // the curvature less the free thermal one
	bend := k0*k0 + h*f.third*(k0+h*f.third/3)
	bend += d.shear * f.third * f.third // G·As·γ² = EI·g·θ″² with γ = −g·θ″
	return h * (d.axialRigidity*bar + d.flexuralRigidity*bend)
}

// pointsOn is the work of the point loads inside (x_lo, x_hi) on the
// functions of m: the bar's hat and the beam's two Hermite functions.
func (r *stretchRefiner) pointsOn(lo, m, hi int) (bar, w, theta float64) {
	first := sort.SearchInts(r.pointNodes, lo+1)
	for i := first; i < len(r.points) && r.pointNodes[i] < hi; i++ {
		p, node := r.points[i], r.pointNodes[i]
		switch {
		case node == m:
			bar, w, theta = bar+p.Axial, w+p.Transverse, theta+p.Moment
		case node < m:
			h := r.x[m] - r.x[lo]
			xi := (r.x[node] - r.x[lo]) / h
			n, d1 := beamShape(xi, h, r.stretch.phi(h))
			bar += xi * p.Axial
			w += n[2]*p.Transverse + d1[2]*p.Moment
			theta += n[3]*p.Transverse + d1[3]*p.Moment
		default:
			h := r.x[hi] - r.x[m]
			xi := (r.x[node] - r.x[m]) / h
			n, d1 := beamShape(xi, h, r.stretch.phi(h))
			bar += (1 - xi) * p.Axial
			w += n[0]*p.Transverse + d1[0]*p.Moment
			theta += n[1]*p.Transverse + d1[1]*p.Moment
		}
	}
	return bar, w, theta
}

// enter switches r to linear loads on [lo, hi] when no break of the
// stretch's loads lies inside (below there they are one linear piece), and
// reports whether it did. The loads are the whole piece's, whatever
// interval of it enters, so that the jobs cut for two goroutines refine to
// the same bits as one walk of the stretch.
func (r *stretchRefiner) enter(lo, hi int) bool {
	pc, ok := r.stretch.pieceOver(r.x[lo], r.x[hi])
	if !ok {
		return false
	}
	r.linear, r.start = true, pc.a
	r.axial, r.axialSlope = pc.va[0], (pc.vb[0]-pc.va[0])/(pc.b-pc.a)
	r.transverse, r.transverseSlope = pc.va[1], (pc.vb[1]-pc.va[1])/(pc.b-pc.a)
	return true
}

// axialAt and transverseAt are the line loads at x where they are linear
// (linear is true).
func (r *stretchRefiner) axialAt(x float64) float64 {
	return r.axial + r.axialSlope*(x-r.start)
}

func (r *stretchRefiner) transverseAt(x float64) float64 {
	return r.transverse + r.transverseSlope*(x-r.start)
}

// keyNodes returns the index in x of every key point of m but the point
// loads, in order, and every node on a foundation: the foundation's
// stiffness couples the hierarchical functions, which are orthogonal in
// the member's stiffness alone, so a stretch on a foundation is solved
// element by element in the factorized system.
func keyNodes(m *Model, x []float64) ([]int, error) {
	keys := systemKeyPoints(m)
	idx := make([]int, len(keys))
	for j, k := range keys {
		idx[j] = nearest(x, k)
		if j > 0 && idx[j] <= idx[j-1] {
			return nil, fmt.Errorf("fem: the mesh has no separate nodes for the key points x = %s and %s: rebuild the mesh", fmtMetres(keys[j-1]), fmtMetres(k))
		}
	}
	if idx[len(idx)-1] != len(x)-1 {
		return nil, fmt.Errorf("fem: the mesh does not end at the member end x = %s: rebuild the mesh", fmtMetres(keys[len(keys)-1]))
	}
	if len(m.Foundations) == 0 {
		return idx, nil
	}
	all := make([]int, 0, len(idx))
	for j := range len(idx) - 1 {
		all = append(all, idx[j])
		if k, ka := m.foundationAt(0.5 * (keys[j] + keys[j+1])); k > 0 || ka > 0 {
			for i := idx[j] + 1; i < idx[j+1]; i++ {
				all = append(all, i)
			}
		}
	}
	return append(all, idx[len(idx)-1]), nil
}
