package fem

import (
	"errors"
	"fmt"
	"math"
	"math/bits"

	"stave/fem/units"
)

// Solution is the finite element answer for one model.
type Solution struct {
	Model        Model // a copy of the solved model
	Mesh         Mesh
	Displacement [][3]float64 // per node of Mesh.X: u (m), w (m), θ (rad)
	Reactions    []Reaction   // one per support, in the order of Model.Supports
	// Foundations are what each foundation carries, in the order of
	// Model.Foundations.
	Foundations  []FoundationReaction
	StrainEnergy float64 // energy stored in the member (springs excluded), J
	Equilibrium  Equilibrium
	// Condition bounds how much round-off can grow in the results: relative
	// errors up to about Condition·ε (ε = 2.2e-16) are possible in
	// displacements, forces and moments. It is the larger estimated 1-norm
	// condition number of the bar and beam key-point systems, the only ones
	// solved by elimination, after symmetric scaling to a unit diagonal,
	// plus a term for the levels of the hierarchical refinement (see
	// hierarchy.go), each of which adds a few rounding errors.
	Condition float64
	Warnings  []string
	// AxialOnly says the member was solved as a bar alone (Member.Bending):
	// its deflection, rotation, shear force and bending moment are zero and
	// outputs leave them out.
	AxialOnly bool

	sections []sectionData // per segment of Model
	barOrder ElementOrder
	// loads are what the solution answers, gathered on the key points: the
	// member's own, a load case's, or a combination's sum.
	loads  Loads
	fields []elementField // per element of Mesh
	// releasedStart holds the own start rotation of each element that
	// starts at a hinge, by element (rad); nil without hinges.
	releasedStart map[int]float64
}

// sectionData is what the fields need from a segment.
type sectionData struct {
	axialRigidity, flexuralRigidity float64 // EA (N), EI (N·m²)
	area, secondMoment, fibre       float64 // A (m²), I (m⁴), c (m)
	thermalStrain                   float64 // α·ΔT
	// thermalCurvature is α·ΔT/depth of a temperature difference through
	// the depth, 1/m: the free curvature, sagging positive (bottom warmer).
	thermalCurvature float64
	// shear is EI/(G·As), m², of a Timoshenko beam; 0 for Euler–Bernoulli.
	shear float64
}

// conditionLimit is the condition number beyond which results are flagged:
// relative errors of up to cond·ε, 2e-4 at the limit, may then show in the
// last digits an engineer reads.
const conditionLimit = 1e12

// levelRoundOff is the growth of relative round-off per level of the
// hierarchical refinement, a bound with margin over the largest measured
// (TestFineBeamAccuracy: below 1 per level on the reference members).
const levelRoundOff = 4

// conditionWarning says how far results of a problem with condition number
// cond can be trusted, or returns "" when they can.
func conditionWarning(problem string, cond float64) string {
	const eps = 0x1p-52
	switch {
	case cond*eps >= 1:
		return fmt.Sprintf("the %s stiffness matrix is singular to working precision (estimated condition number %s, beyond 1/ε of float64): the results are meaningless; check for springs or sections of extreme stiffness, or supports and loads almost at one point", problem, units.FormatG("%.2g", cond))
	case cond > conditionLimit:
		return fmt.Sprintf("the %s stiffness matrix is ill-conditioned (estimated condition number %.2g): results are unreliable, with relative errors possibly up to %.0e; avoid extreme stiffness contrasts and supports or loads very close together", problem, cond, cond*eps)
	}
	return ""
}

// Solve validates, meshes, assembles and solves the model: BuildMesh and
// SolveOnMesh on one prepared member.
func Solve(m *Model) (*Solution, error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, err
	}
	return p.Solve(p.Mesh())
}

// SolveOnMesh solves the model on a given mesh, which must hold a node at
// every key point (BuildMesh and MeshFromNodes make such meshes).
func SolveOnMesh(m *Model, mesh Mesh) (*Solution, error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, err
	}
	return p.Solve(mesh)
}

// Structure is a model's member and supports on one mesh, with the
// key-point stiffness of the bar and of the beam assembled and factorized
// once. Solve answers any number of load sets on it (load cases, unit loads
// for influence lines) at the cost of the substitutions and the
// hierarchical refinement alone: O(n) per load set, and the same answer as
// a fresh solve to the bit.
//
// Only the key points that are not point loads enter the factorized system
// (hierarchy.go): a point load close to a support would otherwise make a
// short, stiff stretch there.
type Structure struct {
	model Model
	mesh  Mesh
	keys  []int     // the fine node of each key point of the system
	keyX  []float64 // their x, m
	// keyPoints are the model's KeyPoints, point loads included.
	keyPoints []float64
	// coarse is the key-point mesh and stretches its elements, with
	// geometry and section but no loads.
	coarse    Mesh
	stretches []elementData
	bar, beam Formulation
	problems  [2]*assembly // bar, beam; no beam without bending
	bending   bool         // see Member.Bending
	// condition and warnings are the key-point systems' (see Solution).
	condition float64
	warnings  []string
}

// NewStructure validates m, checks that mesh fits it and that the supports
// hold it, and assembles and factorizes the key-point systems.
func NewStructure(m *Model, mesh Mesh) (*Structure, error) {
	p, err := Prepare(m)
	if err != nil {
		return nil, err
	}
	return p.Structure(mesh)
}

func newStructure(p *Member, mesh Mesh) (*Structure, error) {
	m := &p.model
	if err := checkMesh(m, p.keys, mesh); err != nil {
		return nil, err
	}
	keys, err := keyNodes(m, mesh.X)
	if err != nil {
		return nil, err
	}
	st := &Structure{model: *m, mesh: mesh, keys: keys, keyX: make([]float64, len(keys)), keyPoints: p.keys}
	for j, i := range keys {
		st.keyX[j] = mesh.X[i]
	}
	st.coarse = meshOn(m, st.keyX)
	st.bar, st.beam = m.Formulations()
	sections := sectionTable(m, nil)
	st.stretches = make([]elementData, len(st.coarse.Elements))
	for j, e := range st.coarse.Elements {
		st.stretches[j] = elementData{start: e.Start, length: e.End - e.Start, sectionData: sections[e.Segment]}
	}
	markReleases(m, st.keyX, st.stretches)
	groundUnder(m, st.stretches)
	// The key-point system of the bar is always linear: a quadratic bar's
	// bubbles are orthogonal to it and solved element by element.
	forms := []Formulation{barFormulation{LinearBar}, st.beam}
	if !p.bending {
		forms = forms[:1] // a bar alone: the beam is neither loaded nor necessarily held
	}
	st.bending = p.bending
	for i, form := range forms {
		as, err := assemble(m, st.keyX, st.stretches, form, p.units)
		if err != nil {
			return nil, err
		}
		st.problems[i] = as
		st.condition = max(st.condition, as.cond)
		if w := conditionWarning(form.Problem(), as.cond); w != "" {
			st.warnings = append(st.warnings, w)
		}
	}
	return st, nil
}

// KeyPoints are the points loads must be gathered on for Solve: the model's
// KeyPoints, m. They are shared, not copied: do not change them.
func (st *Structure) KeyPoints() []float64 { return st.keyPoints }

// Solve finds the displacements, fields and reactions under the loads l,
// which must be gathered (GatherLoads) on the structure's KeyPoints and
// hold one settlement per support.
func (st *Structure) Solve(l *Loads) (*Solution, error) {
	m, mesh, keys := &st.model, st.mesh, st.keys
	if len(l.Settlement) != len(m.Supports) || len(l.Keys) < 2 || math.Abs(l.Keys[len(l.Keys)-1]-m.Length()) > mergeTolerance*m.Length() {
		return nil, fmt.Errorf("fem: the loads were gathered for another member or other supports: gather them on Structure.KeyPoints")
	}
	s := &Solution{Model: st.model, Mesh: mesh, sections: sectionTable(m, l), Condition: st.condition}
	s.Warnings = append(s.Warnings, st.warnings...)
	s.loads = *l
	s.barOrder = m.Mesh.BarOrder
	if s.barOrder == 0 {
		s.barOrder = LinearBar
	}
	stretches, keyPointLoads := elementTable(m, st.coarse, mesh.X, l)
	s.Reactions = make([]Reaction, len(m.Supports))
	for i, sup := range m.Supports {
		s.Reactions[i] = Reaction{Support: i, X: sup.X}
	}
	s.Displacement = make([][3]float64, len(mesh.X))
	s.AxialOnly = !st.bending
	if !st.bending && l.bendsMember() {
		return nil, fmt.Errorf("fem: the loads bend a member solved as a bar alone: gather them for a model that is not axial-only")
	}
	for _, as := range st.problems {
		if as == nil {
			continue
		}
		u := make([]float64, as.n)
		if err := as.solve(stretches, keyPointLoads, l.Settlement, u); err != nil {
			return nil, err
		}
		for j, i := range keys {
			for mi, d := range as.form.Motions() {
				s.Displacement[i][d] = u[as.form.nodeDof(j, mi)]
			}
		}
	}
	keyDisp := make([][3]float64, len(keys))
	for j, i := range keys {
		keyDisp[j] = s.Displacement[i]
	}
	// A stretch that starts at a hinge turns there by its own rotation.
	for j := range stretches {
		if d := &stretches[j]; d.released {
			a, b := keyDisp[j], keyDisp[j+1]
			d.startRotation = d.releasedRotation([4]float64{a[Transverse], a[Rotation], b[Transverse], b[Rotation]})
			if s.releasedStart == nil {
				s.releasedStart = map[int]float64{}
			}
			s.releasedStart[keys[j]] = d.startRotation
		}
	}
	for j := range stretches {
		stretches[j].setGround(keyDisp[j], keyDisp[j+1])
	}
	springReactions(m, st.keyX, keyDisp, s.Reactions)
	staticReactions(m, st.keyX, stretches, keyPointLoads, s.Reactions, elementActions(stretches, keyDisp))
	s.Foundations = foundationReactions(m, stretches)
	s.fields = make([]elementField, len(mesh.Elements))
	energy, poison := refineAll(stretchRefiner{x: mesh.X, disp: s.Displacement, fields: s.fields, order: s.barOrder}, stretches, keys)
	depth := 0
	for j := range stretches {
		depth = max(depth, bits.Len(uint(keys[j+1]-keys[j]-1)))
	}
	s.StrainEnergy = 0.5 * energy
	if err := checkFinite(poison, s); err != nil {
		return nil, err
	}
	s.Condition += levelRoundOff * float64(depth)
	s.Equilibrium = equilibrium(l.Resultant(), s.Reactions, groundResultant(s.Foundations))
	s.Equilibrium.Sizes = l.Sizes()
	if err := checkUnderflow(s); err != nil {
		return nil, err
	}
	return s, nil
}

// checkFinite refuses results that overflowed float64, which validated but
// extreme inputs (E of 1e-300 Pa, a moment of 1e308 N·m) can produce; poison
// is the refinement's (stretchRefiner.poison).
func checkFinite(poison float64, s *Solution) error {
	for _, d := range s.Displacement[len(s.Displacement)-1] {
		poison += d * 0
	}
	for _, re := range s.Reactions {
		for _, f := range re.Force {
			poison += f * 0
		}
	}
	if poison != 0 || !isFinite(s.StrainEnergy) {
		return errNotFinite
	}
	return nil
}

// errNotFinite is the refusal of results that overflowed, by either solver.
var errNotFinite = errors.New("the results are too large for floating point (a displacement, force, moment or stress is infinite or undefined): check the units and magnitudes of the section, material, springs and loads")

// smallestNormal is float64's smallest normal number, 2^−1022 ≈ 2.2e-308
// (IEEE 754 binary64): below it numbers lose significant bits.
const smallestNormal = 0x1p-1022

// checkUnderflow refuses results that underflowed float64, which validated
// but extreme inputs (a load of 1e-300 N/m, a combination's factor of
// 1e-320) can produce: displacements, applied forces or reactions that are
// not all zero but whose largest is below smallestNormal, where their
// digits are lost. Equilibrium would fail on them with nothing wrong in the
// solver. (Displacements lost to zero are refused where they are solved
// for, assembly.solve.)
func checkUnderflow(s *Solution) error {
	// The largest magnitude by the bits of |v|, which order as the
	// magnitudes do, a NaN's above all: integer comparisons, where the
	// float max, with its care for NaN and −0, took 0.12 s of the 0.71 s
	// of Structure.Solve in a profile of 400 drag steps (10,000 elements).
	var bits uint64
	for _, d := range s.Displacement {
		for _, v := range d {
			bits = max(bits, math.Float64bits(v)&^(1<<63))
		}
	}
	largest := math.Float64frombits(bits)
	applied, reactions := 0.0, 0.0
	for i := range 3 {
		applied = max(applied, math.Abs(s.Equilibrium.Applied[i]))
		reactions = max(reactions, math.Abs(s.Equilibrium.Reactions[i]))
	}
	for _, v := range []float64{largest, applied, reactions} {
		if v > 0 && v < smallestNormal {
			return errUnderflow
		}
	}
	return nil
}

// errUnderflow is the refusal of results that underflowed.
var errUnderflow = errors.New("the results are too small for floating point (the displacements or forces come to less than 2.2e-308, where numbers lose their digits): check the units and magnitudes of the loads, combination factors, section, material and springs")

// sectionTable gathers the section data of every segment under the thermal
// loads of l: its uniform change of temperature and the segments'
// temperature differences through the depth.
func sectionTable(m *Model, l *Loads) []sectionData {
	out := make([]sectionData, len(m.Segments))
	for i, seg := range m.Segments {
		sec, mat := seg.Section, seg.Material
		out[i] = sectionData{
			axialRigidity:    mat.Elastic * sec.Area,
			flexuralRigidity: mat.Elastic * sec.SecondMoment,
			area:             sec.Area,
			secondMoment:     sec.SecondMoment,
			fibre:            sec.FibreDistance,
			shear:            seg.ShearFlexibility(),
		}
		if l != nil {
			out[i].thermalStrain = mat.ThermalExpansion * l.TemperatureChange
			if l.TemperatureDifference != nil {
				out[i].thermalCurvature = mat.ThermalExpansion * l.TemperatureDifference[i] / sec.depth()
			}
		}
	}
	return out
}

// equilibrium compares the resultant of the applied loads (Loads.Resultant:
// forces along x and y, moment about x = 0) with that of the reactions of
// the supports and of the foundations (ground, in the same terms).
func equilibrium(applied [3]float64, reactions []Reaction, ground [3]float64) Equilibrium {
	q := Equilibrium{Applied: applied, Reactions: ground, Ground: ground}
	for _, r := range reactions {
		q.Reactions[0] += r.Force[0]
		q.Reactions[1] += r.Force[1]
		q.Reactions[2] += r.Force[2] + r.X*r.Force[1]
	}
	for i := range q.Residual {
		q.Residual[i] = q.Applied[i] + q.Reactions[i]
	}
	return q
}
