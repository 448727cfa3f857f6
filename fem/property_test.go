package fem_test

// Properties every solution must have, checked on seeded random models:
// equilibrium, superposition, mirror symmetry, scaling with the modulus,
// nodal exactness under refinement and agreement with the exact solution,
// and detection of free rigid-body motions.

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"stave/fem"
)

// propertyModels is the number of random models each property is checked on.
const propertyModels = 200

// unitRoundOff is ε of float64.
const unitRoundOff = 0x1p-52

// solveTolerance is the relative agreement to expect of values computed from
// solves with condition number cond: roundOff, or cond·ε when larger, the
// forward error bound of a backward-stable LDLᵀ factorization (Higham,
// Accuracy and Stability of Numerical Algorithms, ch. 7 and 10, from memory);
// fem reports the condition number after scaling to a unit diagonal, the one
// that bounds the error of such a factorization (van der Sluis 1969, from memory).
func solveTolerance(cond float64) float64 { return math.Max(roundOff, cond*unitRoundOff) }

// nodeQuantities are the fields compared node by node.
var nodeQuantities = []quantity{axialDisplacement, deflection, rotation, axialForce, shearForce, bendingMoment}

// nodeValues reads q at every node of s, from the left and from the right:
// entries 2i and 2i+1 belong to node i.
func nodeValues(s *fem.Solution, q quantity) []float64 {
	v := make([]float64, 0, 2*len(s.Mesh.X))
	for _, x := range s.Mesh.X {
		v = append(v, q.of(s.At(x, fem.Left)), q.of(s.At(x, fem.Right)))
	}
	return v
}

// discrepancy is max|got − want| over the entries, relative to the largest
// magnitude in either or to floor, whichever is largest; floor keeps a field
// that vanishes (and so holds only round-off) from being judged against noise.
func discrepancy(got, want []float64, floor float64) float64 {
	var diff, size float64
	for i := range got {
		diff = math.Max(diff, math.Abs(got[i]-want[i]))
		size = math.Max(size, math.Max(math.Abs(got[i]), math.Abs(want[i])))
	}
	size = math.Max(size, floor)
	if diff == 0 {
		return 0
	}
	return diff / size
}

// headroom tracks, per property, the largest discrepancy seen as a fraction
// of its tolerance, logged so a reader sees how close the checks come.
type headroom struct{ worst float64 }

func (h *headroom) check(t *testing.T, what string, got, want []float64, floor, tol float64) {
	t.Helper()
	if len(got) != len(want) {
		t.Errorf("%s: %d values against %d", what, len(got), len(want))
		return
	}
	d := discrepancy(got, want, floor)
	h.worst = math.Max(h.worst, d/tol)
	if !(d <= tol) {
		t.Errorf("%s: relative discrepancy %.3g, allowed %.3g", what, d, tol)
	}
}

// reactionComponents lists component d of every reaction.
func reactionComponents(rs []fem.Reaction, d fem.Dof) []float64 {
	v := make([]float64, len(rs))
	for i, r := range rs {
		v[i] = r.Force[d]
	}
	return v
}

// reactionFloor is the size below which a reaction component of s is
// round-off: the total load (times L for moments), or the end-action terms
// of an element, which a reaction sums, when larger (see nodeFloor).
func reactionFloor(s *fem.Solution, d fem.Dof) float64 {
	return nodeFloor(s, [...]quantity{axialForce, shearForce, bendingMoment}[d])
}

// forRandomModels runs check on propertyModels random models, each in a
// subtest that prints the model when it fails.
func forRandomModels(t *testing.T, seed uint64, kinds loadKinds, check func(t *testing.T, rnd *rand.Rand, m *fem.Model)) {
	rnd := newRand(t, seed)
	for i := range propertyModels {
		m := randomModel(rnd, kinds)
		t.Run(fmt.Sprintf("model %d", i), func(t *testing.T) {
			t.Cleanup(func() {
				if t.Failed() {
					t.Logf("model (seed %d, number %d): %s", seed, i, describe(m))
				}
			})
			check(t, rnd, m)
		})
	}
}

// mustSolveModel solves m or stops the subtest.
func mustSolveModel(t *testing.T, m *fem.Model) *fem.Solution {
	t.Helper()
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	return s
}

// intervalTerms bounds the magnitudes of the terms K·u that the end actions
// of the interval [a, b] sum (an element of a mesh, or a stretch of the exact
// solution), with the motions read from field: the stiffness row sums
// (linear bar 2EA/h, quadratic bar 16EA/3h, Hermite beam 24EI/h³ and 12EI/h²
// for forces, 12EI/h² and 6EI/h for moments) times the largest motion at the
// interval's ends and middle, plus the thermal end forces. Sums of terms this
// large carry round-off of ε times their size, whatever they sum to.
func intervalTerms(m *fem.Model, a, b float64, field fem.Field) (axial, force, moment float64) {
	h := b - a
	seg := m.Segments[m.SegmentAt(0.5*(a+b))]
	ea, ei := seg.Material.Elastic*seg.Section.Area, seg.Material.Elastic*seg.Section.SecondMoment
	var u, w, theta float64
	for _, f := range []fem.Fields{field.At(a, fem.Right), field.At(0.5*(a+b), fem.Right), field.At(b, fem.Left)} {
		u = math.Max(u, math.Abs(f.AxialDisplacement))
		w = math.Max(w, math.Abs(f.Deflection))
		theta = math.Max(theta, math.Abs(f.Rotation))
	}
	axial = 16*ea/(3*h)*u + 2*ea*math.Abs(seg.Material.ThermalExpansion*m.TemperatureChange)
	force = 24*ei/(h*h*h)*w + 12*ei/(h*h)*theta
	moment = 12*ei/(h*h)*w + 6*ei/h*theta
	return axial, force, moment
}

// stiffnessTerms sums intervalTerms over the intervals between the points x
// per equilibrium component (moments about x = 0).
func stiffnessTerms(m *fem.Model, x []float64, field fem.Field) [3]float64 {
	var t [3]float64
	for i := 1; i < len(x); i++ {
		axial, force, moment := intervalTerms(m, x[i-1], x[i], field)
		t[0] += axial
		t[1] += force
		t[2] += moment + x[i]*force
	}
	return t
}

// nodeFloor is the size below which a nodal value of q is round-off: for
// displacements the size the loads give them (scalesOf); for forces, which
// sum the end-action terms of an element, also the largest such terms.
func nodeFloor(s *fem.Solution, q quantity) float64 {
	floor := scalesOf(&s.Model).of(q)
	if q.nodallyExact() {
		return floor
	}
	for _, e := range s.Mesh.Elements {
		axial, force, moment := intervalTerms(&s.Model, e.Start, e.End, s)
		floor = math.Max(floor, [...]float64{axialForce: axial, shearForce: force, bendingMoment: moment}[q])
	}
	return floor
}

// balanceScale is the size of the terms whose sum is each equilibrium
// component: the loads (scalesOf), the reactions and the stiffness terms.
func balanceScale(m *fem.Model, reactions []fem.Reaction, terms [3]float64) [3]float64 {
	load := scalesOf(m).force
	scale := [3]float64{load + terms[0], load + terms[1], load*m.Length() + terms[2]}
	for _, r := range reactions {
		scale[0] += math.Abs(r.Force[0])
		scale[1] += math.Abs(r.Force[1])
		scale[2] += math.Abs(r.Force[2]) + math.Abs(r.X*r.Force[1])
	}
	return scale
}

// (a) Loads and reactions balance: the reported residual is round-off of the
// sums that make it, and the reported totals are the model's loads.
func TestPropertyEquilibrium(t *testing.T) {
	var h headroom
	forRandomModels(t, 1, everyLoadKind, func(t *testing.T, _ *rand.Rand, m *fem.Model) {
		s := mustSolveModel(t, m)
		eq := s.Equilibrium
		applied := appliedLoads(m)
		scale := balanceScale(m, s.Reactions, stiffnessTerms(m, s.Mesh.X, s))
		var reactions [3]float64
		for _, r := range s.Reactions {
			reactions[0] += r.Force[0]
			reactions[1] += r.Force[1]
			reactions[2] += r.Force[2] + r.X*r.Force[1]
		}
		for d, name := range []string{"Fx", "Fy", "moment about x = 0"} {
			h.check(t, "applied "+name, []float64{eq.Applied[d]}, []float64{applied[d]}, scale[d], roundOff)
			h.check(t, "reaction total "+name, []float64{eq.Reactions[d]}, []float64{reactions[d]}, scale[d], roundOff)
			// The residual is a sum of terms of size scale: round-off is ε
			// times that, whatever the conditioning, for a backward-stable
			// solve (Higham, Accuracy and Stability, ch. 10, from memory).
			h.check(t, "residual "+name, []float64{eq.Residual[d]}, []float64{0}, scale[d], roundOff)
		}
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// cloneModel copies m deeply, so edits leave m alone.
func cloneModel(m *fem.Model) *fem.Model {
	c := m.Clone()
	return &c
}

// splitLoads deals every action of m (each point load, distributed load and
// support settlement, the self-weight and the temperature change) to one of
// two models with the same member and supports.
func splitLoads(rnd *rand.Rand, m *fem.Model) (a, b *fem.Model) {
	a, b = cloneModel(m), cloneModel(m)
	a.PointLoads, b.PointLoads = nil, nil
	a.DistributedLoad, b.DistributedLoad = nil, nil
	pick := func() (to, other *fem.Model) {
		if rnd.IntN(2) == 0 {
			return a, b
		}
		return b, a
	}
	for _, p := range m.PointLoads {
		to, _ := pick()
		to.PointLoads = append(to.PointLoads, p)
	}
	for _, d := range m.DistributedLoad {
		to, _ := pick()
		to.DistributedLoad = append(to.DistributedLoad, d)
	}
	for i := range m.Supports {
		_, other := pick()
		other.Supports[i].Settlement = [3]float64{}
	}
	_, other := pick()
	other.Gravity = [2]float64{}
	_, other = pick()
	other.TemperatureChange = 0
	return a, b
}

// (b) The response to two sets of actions together is the sum of the
// responses to each, on the same mesh.
func TestPropertySuperposition(t *testing.T) {
	var h headroom
	forRandomModels(t, 2, everyLoadKind, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		both := mustSolveModel(t, m)
		a, b := splitLoads(rnd, m)
		var parts [2]*fem.Solution
		for i, part := range []*fem.Model{a, b} {
			s, err := fem.SolveOnMesh(part, both.Mesh)
			if err != nil {
				t.Fatalf("SolveOnMesh of load set %d: %v", i+1, err)
			}
			parts[i] = s
		}
		tol := solveTolerance(both.Condition)
		for _, q := range nodeQuantities {
			va, vb := nodeValues(parts[0], q), nodeValues(parts[1], q)
			sum := make([]float64, len(va))
			for i := range sum {
				sum[i] = va[i] + vb[i]
			}
			h.check(t, q.String()+" at the nodes", sum, nodeValues(both, q), nodeFloor(both, q), tol)
		}
		for d := fem.Axial; d <= fem.Rotation; d++ {
			ra, rb := reactionComponents(parts[0].Reactions, d), reactionComponents(parts[1].Reactions, d)
			for i := range ra {
				ra[i] += rb[i]
			}
			h.check(t, d.String()+" reactions", ra, reactionComponents(both.Reactions, d), reactionFloor(both, d), tol)
		}
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// mirrorModel reflects m about x = L/2: x → L − x. Axial forces, moments,
// axial settlements and rotations change sign; transverse ones keep it.
func mirrorModel(m *fem.Model) *fem.Model {
	L := m.Length()
	c := cloneModel(m)
	slices.Reverse(c.Segments)
	for i := range c.Segments {
		s := &c.Segments[i]
		s.Start, s.End = L-s.End, L-s.Start
	}
	for i := range c.Supports {
		s := &c.Supports[i]
		s.X = L - s.X
		s.Settlement[fem.Axial] = -s.Settlement[fem.Axial]
		s.Settlement[fem.Rotation] = -s.Settlement[fem.Rotation]
	}
	for i := range c.PointLoads {
		p := &c.PointLoads[i]
		p.X, p.Axial, p.Moment = L-p.X, -p.Axial, -p.Moment
	}
	for _, d := range c.DistributedLoad {
		slices.Reverse(d.Points)
		for j := range d.Points {
			d.Points[j].X = L - d.Points[j].X
			if d.Direction == fem.Axial {
				d.Points[j].Intensity = -d.Points[j].Intensity
			}
		}
	}
	c.Gravity[0] = -c.Gravity[0]
	return c
}

// mirrorSign is how each quantity transforms under x → L − x: u, θ and V
// (odd in x) change sign, w, N and M keep it.
var mirrorSign = map[quantity]float64{axialDisplacement: -1, deflection: 1, rotation: -1, axialForce: 1, shearForce: -1, bendingMoment: 1}

// (c) A mirrored model gives the mirrored response.
func TestPropertyMirrorSymmetry(t *testing.T) {
	var h headroom
	forRandomModels(t, 3, everyLoadKind, func(t *testing.T, _ *rand.Rand, m *fem.Model) {
		s, r := mustSolveModel(t, m), mustSolveModel(t, mirrorModel(m))
		if len(r.Mesh.X) != len(s.Mesh.X) {
			t.Fatalf("the mirrored model has %d nodes, the original %d", len(r.Mesh.X), len(s.Mesh.X))
		}
		tol := solveTolerance(math.Max(s.Condition, r.Condition))
		for _, q := range nodeQuantities {
			// Node i seen from the left is mirrored node n−i seen from the right.
			want := nodeValues(r, q)
			slices.Reverse(want)
			for i := range want {
				want[i] *= mirrorSign[q]
			}
			h.check(t, q.String()+" at mirrored nodes", nodeValues(s, q), want, nodeFloor(s, q), tol)
		}
		for d, sign := range [3]float64{-1, 1, -1} {
			want := reactionComponents(r.Reactions, fem.Dof(d))
			for i := range want {
				want[i] *= sign
			}
			h.check(t, fem.Dof(d).String()+" reactions", reactionComponents(s.Reactions, fem.Dof(d)), want, reactionFloor(s, fem.Dof(d)), tol)
		}
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// (d) Multiplying every stiffness by k divides the displacements by k and
// leaves the forces alone. Springs are scaled too: the member and the springs
// share the loads in proportion to their stiffness, so scaling only E would
// change that share. Settlements and temperature are left out: they prescribe
// displacements, which do not scale.
func TestPropertyStiffnessScaling(t *testing.T) {
	var h headroom
	kinds := loadKinds{springs: true, selfWeight: true}
	forRandomModels(t, 4, kinds, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		checkStiffnessScaling(t, &h, m, logUniform(rnd, 1e-2, 1e2))
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// The same at factors far outside any material, where a kernel multiplying
// three stiffness entries, or squaring one, leaves float64's range: a review
// found the 2×2 node blocks silently wrong with E of 2e−110 Pa.
func TestPropertyStiffnessScalingExtreme(t *testing.T) {
	var h headroom
	kinds := loadKinds{springs: true, selfWeight: true}
	factors := []float64{1e-110, 1e-60, 1e60, 1e110}
	forRandomModels(t, 14, kinds, func(t *testing.T, rnd *rand.Rand, m *fem.Model) {
		checkStiffnessScaling(t, &h, m, factors[rnd.IntN(len(factors))])
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// checkStiffnessScaling solves m and m with every stiffness times k and
// compares them as TestPropertyStiffnessScaling says.
func checkStiffnessScaling(t *testing.T, h *headroom, m *fem.Model, k float64) {
	stiff := cloneModel(m)
	for i := range stiff.Segments {
		stiff.Segments[i].Material.Elastic *= k
	}
	for i := range stiff.Supports {
		for d := range stiff.Supports[i].Stiffness {
			stiff.Supports[i].Stiffness[d] *= k
		}
	}
	s, r := mustSolveModel(t, m), mustSolveModel(t, stiff)
	tol := solveTolerance(math.Max(s.Condition, r.Condition))
	for _, q := range nodeQuantities {
		got := nodeValues(r, q)
		if q.nodallyExact() { // the displacements
			for i := range got {
				got[i] *= k
			}
		}
		h.check(t, fmt.Sprintf("%s with E×%.4g", q, k), got, nodeValues(s, q), nodeFloor(s, q), tol)
	}
	for d := fem.Axial; d <= fem.Rotation; d++ {
		h.check(t, d.String()+" reactions", reactionComponents(r.Reactions, d), reactionComponents(s.Reactions, d), reactionFloor(s, d), tol)
	}
}

// bisect adds the middle of every interval of the sorted nodes x.
func bisect(x []float64) []float64 {
	out := []float64{x[0]}
	for i := 1; i < len(x); i++ {
		out = append(out, 0.5*(x[i-1]+x[i]), x[i])
	}
	return out
}

// displacementsAt reads the nodal displacements of s at the positions x,
// which must be nodes of its mesh.
func displacementsAt(t *testing.T, s *fem.Solution, x []float64) [3][]float64 {
	t.Helper()
	index := make(map[float64]int, len(s.Mesh.X))
	for i, xi := range s.Mesh.X {
		index[xi] = i
	}
	var out [3][]float64
	for _, xi := range x {
		i, ok := index[xi]
		if !ok {
			t.Fatalf("x = %g m is not a node of the refined mesh", xi)
		}
		for d := range out {
			out[d] = append(out[d], s.Displacement[i][d])
		}
	}
	return out
}

// (e) In one dimension, with loads integrated consistently, the nodal
// displacements of linear and quadratic bars and of Hermite beams are exact
// (Tong 1969; Strang & Fix, An Analysis of the Finite Element Method, ch. 1;
// from memory). So refining a mesh (one element per stretch, then 2 and 4)
// never moves the values at the coarse nodes, and every node agrees with the
// exact solution.
func TestPropertyNodalExactness(t *testing.T) {
	var h headroom
	forRandomModels(t, 5, everyLoadKind, func(t *testing.T, _ *rand.Rand, m *fem.Model) {
		ex, err := fem.SolveExact(m)
		if err != nil {
			t.Fatalf("SolveExact: %v", err)
		}
		scales := scalesOf(m)
		coarseModel := cloneModel(m)
		coarseModel.Mesh.Elements = 0
		coarse := mustSolveModel(t, coarseModel)
		x := coarse.Mesh.X
		want := displacementsAt(t, coarse, coarse.Mesh.X)
		for level := 1; level <= 2; level++ {
			x = bisect(x)
			mesh, err := fem.MeshFromNodes(m, x)
			if err != nil {
				t.Fatalf("MeshFromNodes, %d elements per stretch: %v", 1<<level, err)
			}
			fine, err := fem.SolveOnMesh(m, mesh)
			if err != nil {
				t.Fatalf("SolveOnMesh, %d elements per stretch: %v", 1<<level, err)
			}
			got := displacementsAt(t, fine, coarse.Mesh.X)
			tol := solveTolerance(math.Max(coarse.Condition, fine.Condition))
			for d, q := range nodeQuantities[:3] {
				h.check(t, fmt.Sprintf("%s at the coarse nodes, %d elements per stretch", q, 1<<level), got[d], want[d], scales.of(q), tol)
			}
		}
		s := mustSolveModel(t, m)
		var exact [3][]float64
		for _, xi := range s.Mesh.X {
			f := ex.At(xi, fem.Right)
			for d, v := range []float64{f.AxialDisplacement, f.Deflection, f.Rotation} {
				exact[d] = append(exact[d], v)
			}
		}
		got := displacementsAt(t, s, s.Mesh.X)
		for d, q := range nodeQuantities[:3] {
			h.check(t, q.String()+" against the exact solution", got[d], exact[d], scales.of(q), solveTolerance(s.Condition))
		}
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// (f) With exact nodal displacements the reactions, recovered from the
// element end forces, are exact too, and so equal the closed-form ones.
func TestPropertyReactionsMatchExact(t *testing.T) {
	var h headroom
	forRandomModels(t, 6, everyLoadKind, func(t *testing.T, _ *rand.Rand, m *fem.Model) {
		s := mustSolveModel(t, m)
		ex, err := fem.SolveExact(m)
		if err != nil {
			t.Fatalf("SolveExact: %v", err)
		}
		exact := ex.Reactions()
		if len(exact) != len(s.Reactions) {
			t.Fatalf("%d exact reactions, %d finite element ones", len(exact), len(s.Reactions))
		}
		for d := fem.Axial; d <= fem.Rotation; d++ {
			h.check(t, d.String()+" reactions", reactionComponents(s.Reactions, d), reactionComponents(exact, d), reactionFloor(s, d), solveTolerance(s.Condition))
		}
	})
	t.Logf("largest discrepancy: %.3g of its tolerance", h.worst)
}

// Random supports, stable or not: Solve and SolveExact refuse exactly the
// arrangements that leave a rigid-body motion free, and name that motion.
// SolveExact may refuse a stable model for other reasons (see
// TestExactShortStiffStretch); here only a false mechanism counts.
func TestPropertyMechanismDetection(t *testing.T) {
	rnd := newRand(t, 7)
	free := map[string]int{}
	for i := range propertyModels {
		m := randomModel(rnd, everyLoadKind)
		at := func(j int) float64 { return m.Length() * float64(j) / gridIntervals }
		m.Supports = randomSupports(rnd, at, everyLoadKind)
		if rnd.IntN(8) == 0 {
			m.Supports = nil
		}
		want := freeMotion(m.Supports)
		free[want]++
		_, errFE := fem.Solve(m)
		_, errExact := fem.SolveExact(m)
		for name, err := range map[string]error{"Solve": errFE, "SolveExact": errExact} {
			var me *fem.MechanismError
			switch {
			case want == "" && name == "SolveExact" && errors.As(err, &me):
				t.Errorf("model %d, supports %+v: SolveExact: %v; the supports hold every rigid-body motion", i, m.Supports, err)
			case want == "" && name == "Solve" && err != nil:
				t.Errorf("model %d, supports %+v: %s: %v; the supports hold every rigid-body motion", i, m.Supports, name, err)
			case want != "" && !errors.As(err, &me):
				t.Errorf("model %d, supports %+v: %s gave %v, want a *MechanismError naming the %s motion", i, m.Supports, name, err, want)
			case want != "" && (me.Motion != want || me.Message == ""):
				t.Errorf("model %d, supports %+v: %s names motion %q (%q), want %q", i, m.Supports, name, me.Motion, me.Message, want)
			}
		}
	}
	t.Logf("free motions drawn: %v", free)
}

// judgeAgainstExact asserts that a solution Solve gave without warnings is
// as accurate as its condition number promises: nodal displacements (exact
// in theory, see TestPropertyNodalExactness), reactions and the equilibrium
// balance agree with the exact solution within solveTolerance.
func judgeAgainstExact(t *testing.T, m *fem.Model, s *fem.Solution) {
	t.Helper()
	ex, err := fem.SolveExact(m)
	if err != nil {
		t.Fatalf("no warning, and the exact solution to judge by is refused: %v", err)
	}
	tol := solveTolerance(s.Condition)
	scales := scalesOf(m)
	got := displacementsAt(t, s, s.Mesh.X)
	var exact [3][]float64
	for _, x := range s.Mesh.X {
		f := ex.At(x, fem.Right)
		for d, v := range []float64{f.AxialDisplacement, f.Deflection, f.Rotation} {
			exact[d] = append(exact[d], v)
		}
	}
	var h headroom
	for d, q := range nodeQuantities[:3] {
		h.check(t, q.String()+" at the nodes against the exact solution", got[d], exact[d], scales.of(q), tol)
	}
	for d := fem.Axial; d <= fem.Rotation; d++ {
		h.check(t, d.String()+" reactions against the exact ones", reactionComponents(s.Reactions, d), reactionComponents(ex.Reactions(), d), reactionFloor(s, d), tol)
	}
	if r := fem.Summarize(s, nil).Equilibrium.Relative; !(r <= tol) {
		t.Errorf("loads and reactions leave a relative residual of %.3g (allowed %.3g) with no warning", r, tol)
	}
}

// steelMember is a uniform steel member (A 1e-2 m², I 1e-4 m⁴, c 0.15 m)
// split at the given points. Invented, typical values.
func steelMember(length float64, breaks ...float64) []fem.Segment {
	section := fem.Section{Area: 1e-2, SecondMoment: 1e-4, FibreDistance: 0.15}
	steel := fem.Material{Elastic: 2e11, Density: 7850, ThermalExpansion: 1.2e-5}
	var segs []fem.Segment
	start := 0.0
	for _, end := range append(breaks, length) {
		segs = append(segs, fem.Segment{Start: start, End: end, Section: section, Material: steel})
		start = end
	}
	return segs
}

// withModulusRatio divides E of the segments listed by ratio.
func withModulusRatio(segs []fem.Segment, ratio float64, soft ...int) []fem.Segment {
	for _, i := range soft {
		segs[i].Material.Elastic /= ratio
	}
	return segs
}

// Extreme springs, stiffness contrasts, fine meshes and nearly coincident
// points: Solve refuses with a message, or warns with the condition estimate,
// or gives an answer as accurate as its condition number promises. A wrong
// answer presented as fine is the one outcome not allowed.
func TestIllConditioningNeverSilent(t *testing.T) {
	loads := []fem.PointLoad{{X: 3, Axial: 2e4, Transverse: -1e4, Moment: 5e3}}
	pinnedRoller := []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}}
	cases := []struct {
		name  string
		model fem.Model
	}{
		{name: "propped by a 1e20 N/m spring", model: fem.Model{Segments: steelMember(6),
			Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Spring, Stiffness: [3]float64{1e20, 1e20, 0}}},
			PointLoads: loads}},
		{name: "end held by a 1e20 N·m/rad rotational spring", model: fem.Model{Segments: steelMember(6),
			Supports:   []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Spring, Stiffness: [3]float64{0, 1e20, 1e20}}},
			PointLoads: loads}},
		{name: "E ratio 1e14, stiff half then soft half", model: fem.Model{Segments: withModulusRatio(steelMember(6, 3), 1e14, 1),
			Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Pinned}}, PointLoads: []fem.PointLoad{{X: 4.5, Axial: 2e4, Transverse: -1e4}}}},
		{name: "E ratio 1e14, soft middle third", model: fem.Model{Segments: withModulusRatio(steelMember(6, 2, 4), 1e14, 1),
			Supports: pinnedRoller, PointLoads: loads}},
		{name: "E ratio 1e14, stiff middle third", model: fem.Model{Segments: withModulusRatio(steelMember(6, 2, 4), 1e14, 0, 2),
			Supports: pinnedRoller, PointLoads: loads}},
		{name: "E ratio 1e8, soft middle third", model: fem.Model{Segments: withModulusRatio(steelMember(6, 2, 4), 1e8, 1),
			Supports: pinnedRoller, PointLoads: loads}},
		{name: "3000 elements", model: fem.Model{Segments: steelMember(6), Supports: pinnedRoller, PointLoads: loads,
			Mesh: fem.MeshSettings{Elements: 3000}}},
		{name: "30000 elements", model: fem.Model{Segments: steelMember(6), Supports: pinnedRoller, PointLoads: loads,
			Mesh: fem.MeshSettings{Elements: 30000}}},
	}
	for _, gap := range []float64{6e-7, 6e-8, 6e-9} {
		cases = append(cases, struct {
			name  string
			model fem.Model
		}{name: fmt.Sprintf("load %g m from a support", gap), model: fem.Model{Segments: steelMember(6),
			Supports:   pinnedRoller,
			PointLoads: []fem.PointLoad{{X: gap, Transverse: -1e4}, {X: 3, Transverse: -1e4}}}})
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			s, err := fem.Solve(&c.model)
			switch {
			case err != nil:
				if strings.TrimSpace(err.Error()) == "" {
					t.Fatalf("refused with an empty message")
				}
				t.Logf("refused: %v", err)
			case len(s.Warnings) > 0:
				for _, w := range s.Warnings {
					if !strings.Contains(w, "condition number") {
						t.Errorf("warning without the condition estimate: %q", w)
					}
				}
				t.Logf("warned: %q", s.Warnings)
			default:
				judgeAgainstExact(t, &c.model, s)
				t.Logf("no warning; condition %.3g", s.Condition)
			}
		})
	}
}

// A short stretch between two fixed supports of a deep member: the exact
// solution must solve it like any other well-posed model.
func TestExactShortStiffStretch(t *testing.T) {
	segs := steelMember(1.75)
	segs[0].Section.SecondMoment = 1e-3
	const P = -1e4 // N, at x = 0.5 m
	m := fem.Model{Segments: segs,
		Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 0.1, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 0.5, Transverse: P}}}
	ex, err := fem.SolveExact(&m)
	if err != nil {
		t.Fatalf("SolveExact: %v", err)
	}
	// Statics: the part right of x = 0.1 m is a cantilever from the second
	// support, which takes all of P and the moment −P·0.4 m; the stretch
	// between the two fixed supports carries nothing, so the first support
	// takes nothing.
	want := [][3]float64{{0, 0, 0}, {0, -P, -P * 0.4}}
	for i, r := range ex.Reactions() {
		for d := range 3 {
			if math.Abs(r.Force[d]-want[i][d]) > roundOff*math.Abs(P) {
				t.Errorf("support %d, %s reaction %.10g, want %.10g", i+1, fem.Dof(d), r.Force[d], want[i][d])
			}
		}
	}
}

// Numbers far outside physical ranges: validation refuses those that take a
// stiffness or a section modulus outside the solvers' range (refused),
// naming the item; for the
// others both solvers refuse with a message, or return results that are
// finite.
func TestExtremeValidValuesNeverSilent(t *testing.T) {
	cases := []struct {
		name    string
		edit    func(m *fem.Model)
		refused bool
	}{
		{"settlement 1e300 m", func(m *fem.Model) { m.Supports[1].Settlement[fem.Transverse] = 1e300 }, false},
		{"moment 1.7e308 N·m", func(m *fem.Model) { m.PointLoads[0].Moment = 1.7e308 }, false},
		{"load 1e300 N", func(m *fem.Model) { m.PointLoads[0].Transverse = -1e300 }, false},
		{"E 1e-300 Pa", func(m *fem.Model) { m.Segments[0].Material.Elastic = 1e-300 }, true},
		{"E 1e300 Pa", func(m *fem.Model) { m.Segments[0].Material.Elastic = 1e300 }, true},
		{"I 5e-324 m⁴", func(m *fem.Model) { m.Segments[0].Section.SecondMoment = math.SmallestNonzeroFloat64 }, true},
		{"A 5e-324 m²", func(m *fem.Model) { m.Segments[0].Section.Area = math.SmallestNonzeroFloat64 }, true},
		{"fibre distance 1e306 m", func(m *fem.Model) { m.Segments[0].Section.FibreDistance = 1e306 }, true},
		{"temperature change 1e300 K", func(m *fem.Model) { m.TemperatureChange = 1e300 }, false},
		{"density 1e300 kg/m³", func(m *fem.Model) { m.Segments[0].Material.Density = 1e300 }, false},
		{"spring 5e-324 N/m", func(m *fem.Model) {
			m.Supports[1] = fem.Support{X: 6, Kind: fem.Spring, Stiffness: [3]float64{0, math.SmallestNonzeroFloat64, 0}}
		}, true},
		{"length 1e-200 m", func(m *fem.Model) {
			m.Segments[0].End, m.Supports[1].X, m.PointLoads[0].X = 1e-200, 1e-200, 0.5e-200
		}, true},
		{"length 1e200 m", func(m *fem.Model) {
			m.Segments[0].End, m.Supports[1].X, m.PointLoads[0].X = 1e200, 1e200, 0.5e200
		}, true},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := fem.Model{Segments: steelMember(6), Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}},
				PointLoads: []fem.PointLoad{{X: 3, Axial: 2e4, Transverse: -1e4}}, Gravity: [2]float64{0, -fem.StandardGravity}}
			c.edit(&m)
			err := m.Validate()
			switch {
			case c.refused && err == nil:
				t.Fatalf("validation accepted a stiffness or section modulus outside the solvers' range")
			case c.refused:
				checkProblems(t, &m, err)
				return
			case err != nil:
				t.Fatalf("the case should pass validation: %v", err)
			}
			var fields []fem.Field
			var reactions [][]fem.Reaction
			if s, err := fem.Solve(&m); err == nil {
				fields, reactions = append(fields, s), append(reactions, s.Reactions)
			} else if strings.TrimSpace(err.Error()) == "" {
				t.Errorf("Solve refused with an empty message")
			}
			if e, err := fem.SolveExact(&m); err == nil {
				fields, reactions = append(fields, e), append(reactions, e.Reactions())
			} else if strings.TrimSpace(err.Error()) == "" {
				t.Errorf("SolveExact refused with an empty message")
			}
			for i, rs := range reactions {
				for _, r := range rs {
					if nonFiniteVector(r.Force[:]) {
						t.Errorf("solver %d: support %d reaction %v", i+1, r.Support+1, r.Force)
					}
				}
				for _, x := range []float64{0, m.Length() / 3, m.Length()} {
					f := fields[i].At(x, fem.Right)
					if nonFiniteVector([]float64{f.AxialDisplacement, f.Deflection, f.Rotation, f.AxialForce, f.ShearForce, f.BendingMoment, f.CombinedStress}) {
						t.Errorf("solver %d: fields at x = %g m: %+v", i+1, x, f)
					}
				}
			}
		})
	}
}

// saysAll reports whether message holds every part of want split at "…",
// in order; the parts between are free (numbers the code works out).
func saysAll(message, want string) bool {
	for _, part := range strings.Split(want, "…") {
		i := strings.Index(message, part)
		if i < 0 {
			return false
		}
		message = message[i+len(part):]
	}
	return true
}

// Each kind of bad input gets a message that names the item as users count
// it and the place or value at fault. Cases validate_test.go already covers
// are left out; all problems of each case must explain themselves
// (checkProblems, shared with FuzzValidate).
func TestValidationMessagesNameItemAndPlace(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name  string
		edit  func(m *fem.Model)
		place fem.Place
		says  string
	}{
		{"segment ends before it starts", func(m *fem.Model) { m.Segments[1].End = 1.5 },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 1}, Property: fem.EndProperty}, "segment 2 runs from x = 2.0 m to x = 1.5 m"},
		{"negative area", func(m *fem.Model) { m.Segments[0].Section.Area = -0.01 },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 0}, Property: fem.AreaProperty}, "segment 1: the area A is -0.01 m²: it must be positive"},
		{"negative second moment", func(m *fem.Model) { m.Segments[1].Section.SecondMoment = -1e-4 },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 1}, Property: fem.SecondMomentProperty}, "segment 2: the second moment of area I is -0.0001 m⁴: it must be positive"},
		{"infinite area", func(m *fem.Model) { m.Segments[0].Section.Area = inf },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 0}, Property: fem.AreaProperty}, "segment 1: the area A is +Inf: enter a finite value in m²"},
		{"NaN second moment", func(m *fem.Model) { m.Segments[1].Section.SecondMoment = nan },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 1}, Property: fem.SecondMomentProperty}, "segment 2: the second moment of area I is NaN"},
		{"infinite E", func(m *fem.Model) { m.Segments[0].Material.Elastic = inf },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 0}, Property: fem.ElasticProperty}, "segment 1: Young's modulus E is +Inf"},
		{"zero E", func(m *fem.Model) { m.Segments[1].Material.Elastic = 0 },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 1}, Property: fem.ElasticProperty}, "segment 2: Young's modulus E is 0.0 Pa: it must be positive"},
		{"segments listed out of order", func(m *fem.Model) { m.Segments[0], m.Segments[1] = m.Segments[1], m.Segments[0] },
			fem.Place{Item: fem.Item{Kind: fem.SegmentItem, Index: 0}, Property: fem.StartProperty}, "segment 1 starts at x = 2.0 m: the member must start at x = 0"},
		{"support before the start", func(m *fem.Model) { m.Supports[0].X = -0.5 },
			fem.Place{Item: fem.Item{Kind: fem.SupportItem, Index: 0}, Property: fem.PositionProperty}, "support 1 at x = -0.5 m lies outside the member (length 6.0 m)"},
		{"supports closer than the merge tolerance", func(m *fem.Model) { m.Supports[1].X = 1e-13 },
			fem.Place{Item: fem.Item{Kind: fem.SupportItem, Index: 1}, Property: fem.PositionProperty}, "supports 1 and 2 are at x = 0.0 m and x = 1e-13 m, which count as one point"},
		{"NaN spring stiffness", func(m *fem.Model) {
			m.Supports[1] = fem.Support{X: 6, Kind: fem.Spring, Stiffness: [3]float64{1e6, 1e6, nan}}
		},
			fem.Place{Item: fem.Item{Kind: fem.SupportItem, Index: 1}, Property: fem.MotionStiffnessProperty, Dof: fem.Rotation}, "support 2: the rotation spring stiffness is NaN: enter a finite value in N·m/rad"},
		{"point load at NaN", func(m *fem.Model) { m.PointLoads[0].X = nan },
			fem.Place{Item: fem.Item{Kind: fem.PointLoadItem, Index: 0}, Property: fem.PositionProperty}, "point load 1: its position is NaN"},
		{"point load past the end", func(m *fem.Model) { m.PointLoads[0].X = 6.5 },
			fem.Place{Item: fem.Item{Kind: fem.PointLoadItem, Index: 0}, Property: fem.PositionProperty}, "point load 1 at x = 6.5 m lies outside the member (length 6.0 m)"},
		{"zero-span load inside the member", func(m *fem.Model) {
			m.DistributedLoad[0].Points = []fem.LoadPoint{{X: 2, Intensity: -1e3}, {X: 2, Intensity: -1e3}}
		}, fem.Place{Item: fem.Item{Kind: fem.DistributedLoadItem, Index: 0}, Property: fem.PointsProperty}, "distributed load 1 starts and ends at x = 2.0 m: give it a length"},
		{"load point at NaN", func(m *fem.Model) { m.DistributedLoad[0].Points[1].X = nan },
			fem.Place{Item: fem.Item{Kind: fem.DistributedLoadItem, Index: 0}, Property: fem.PointXProperty, Vertex: 1}, "distributed load 1: point 2 has position NaN"},
		{"load points in decreasing x", func(m *fem.Model) {
			m.DistributedLoad[0].Points = []fem.LoadPoint{{X: 5, Intensity: -1e3}, {X: 1, Intensity: -2e3}}
		}, fem.Place{Item: fem.Item{Kind: fem.DistributedLoadItem, Index: 0}, Property: fem.PointXProperty, Vertex: 1}, "point 2 (x = 1.0 m) does not lie beyond point 1 (x = 5.0 m)"},
		// The estimate itself depends on validate.go's bytes per element.
		{"a billion elements", func(m *fem.Model) { m.Mesh.Elements = 1e9 },
			fem.Place{Item: fem.Item{Kind: fem.MeshItem, Index: -1}, Property: fem.ElementsProperty}, "the mesh would need about … GB of memory (1e+09 elements)"},
		{"NaN element length", func(m *fem.Model) { m.Mesh.MaxElementLength = nan },
			fem.Place{Item: fem.Item{Kind: fem.MeshItem, Index: -1}, Property: fem.MaxElementLengthProperty}, "the maximum element length is NaN m"},
		{"infinite gravity", func(m *fem.Model) { m.Gravity[0] = inf },
			fem.Place{Item: fem.Item{Kind: fem.ModelItem, Index: -1}, Property: fem.GravityProperty, Dof: fem.Axial}, "the gravity component 1 is +Inf"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m := fem.Model{Segments: steelMember(6, 2),
				Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 6, Kind: fem.Roller}},
				PointLoads:      []fem.PointLoad{{X: 3, Transverse: -1e4}},
				DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 1, Intensity: -1e3}, {X: 5, Intensity: -2e3}}}},
				Mesh:            fem.MeshSettings{Elements: 10}}
			if err := m.Validate(); err != nil {
				t.Fatalf("the base model is invalid: %v", err)
			}
			c.edit(&m)
			err := m.Validate()
			checkProblems(t, &m, err)
			var ve *fem.ValidationError
			errors.As(err, &ve)
			if !slices.ContainsFunc(ve.Problems, func(p fem.Problem) bool {
				return p.Place == c.place && saysAll(p.Message, c.says)
			}) {
				t.Errorf("no problem at %+v saying %q in:\n%v", c.place, c.says, err)
			}
		})
	}
}
