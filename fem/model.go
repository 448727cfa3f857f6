package fem

import (
	"slices"
	"sort"
)

// Dof names one of the three motions of a point of the member.
type Dof int

// The three degrees of freedom of a node. Axial is the bar problem; Transverse
// and Rotation make up the beam problem.
const (
	Axial      Dof = iota // u, along x, m
	Transverse            // w, along y (up), m
	Rotation              // θ = dw/dx, counter-clockwise, rad
)

// String gives the trade's word for the motion.
func (d Dof) String() string {
	switch d {
	case Axial:
		return "axial"
	case Transverse:
		return "transverse"
	case Rotation:
		return "rotation"
	}
	return "unknown"
}

// Section holds the cross-section properties of a segment.
type Section struct {
	Area          float64 // A, m²
	SecondMoment  float64 // I about the bending axis, m⁴
	FibreDistance float64 // c, distance from the neutral axis to the extreme fibre, m
	// Depth is the distance between the bottom and top fibres, m, over
	// which a temperature difference bends the member; 0 means twice the
	// fibre distance (a section symmetric about its neutral axis).
	Depth float64
	// ShearArea is the area that carries the shear force in shear
	// deformation, As, m²; 0 means ShearCoefficient·A.
	ShearArea float64
	// ShearCoefficient is κ with As = κ·A (5/6 for a solid rectangle,
	// about the web's share of A for an I-section), when ShearArea is 0.
	ShearCoefficient float64
}

// shearArea is As, given or from κ·A.
func (s Section) shearArea() float64 {
	if s.ShearArea > 0 {
		return s.ShearArea
	}
	return s.ShearCoefficient * s.Area
}

// depth is the section's depth for thermal bending, m (see Depth).
func (s Section) depth() float64 {
	if s.Depth > 0 {
		return s.Depth
	}
	return 2 * s.FibreDistance
}

// Material holds the material properties of a segment.
type Material struct {
	Name             string
	Elastic          float64 // Young's modulus E, Pa
	Density          float64 // ρ, kg/m³ (used for self-weight)
	ThermalExpansion float64 // α, 1/K
	Allowable        float64 // allowable (or yield) stress, Pa; 0 means not given
	// ShearModulus is G, Pa, for shear deformation; 0 means E/(2(1+ν)).
	ShearModulus float64
	// Poisson is Poisson's ratio ν, which gives G when ShearModulus is 0.
	Poisson float64
}

// shearModulus is G, given or from E and ν.
func (m Material) shearModulus() float64 {
	if m.ShearModulus > 0 {
		return m.ShearModulus
	}
	return m.Elastic / (2 * (1 + m.Poisson))
}

// Segment is a stretch of the member with one section and one material.
// Segments are listed in order and must tile [0, L] without gaps or overlaps.
type Segment struct {
	Start, End float64 // m
	Section    Section
	Material   Material
	// TemperatureDifference is how much warmer the bottom fibre is than the
	// top one, K (a roof beam in sun has it negative): it curves the
	// segment by α·ΔT/depth, which restrained members resist with moments.
	// In a model with load cases it acts in the cases marked ThermalGradient.
	TemperatureDifference float64
	// ShearDeformation makes the segment a Timoshenko beam: its shear
	// stiffness G·As adds shear deflection to bending (Section.ShearArea or
	// ShearCoefficient, Material.ShearModulus or Poisson).
	ShearDeformation bool
}

// ShearFlexibility is EI/(G·As) of a segment with shear deformation, m²;
// 0 without (Euler–Bernoulli).
func (s Segment) ShearFlexibility() float64 {
	if !s.ShearDeformation {
		return 0
	}
	return s.Material.Elastic * s.Section.SecondMoment / (s.Material.shearModulus() * s.Section.shearArea())
}

// SupportKind says which motions a support restrains.
type SupportKind int

// Support kinds. A kind holds some motions rigidly; any motion it leaves
// free is held elastically when Support.Stiffness gives it a stiffness, so
// one support can mix the two (a roller with a rotational spring, a pinned
// end on an axial spring). Spring holds nothing rigidly: every motion is
// elastic or free.
const (
	Fixed     SupportKind = iota // axial, transverse and rotation restrained
	Pinned                       // axial and transverse restrained
	Roller                       // transverse restrained
	AxialOnly                    // axial restrained
	Guided                       // axial and rotation restrained, free to deflect
	Spring                       // elastic in each motion
)

var supportKindNames = [...]string{"fixed", "pinned", "roller", "axial", "guided", "spring"}

// String gives the kind's name as used in files and messages.
func (k SupportKind) String() string {
	if k < 0 || int(k) >= len(supportKindNames) {
		return "unknown"
	}
	return supportKindNames[k]
}

// ParseSupportKind is the inverse of SupportKind.String.
func ParseSupportKind(s string) (SupportKind, bool) {
	for i, n := range supportKindNames {
		if n == s {
			return SupportKind(i), true
		}
	}
	return 0, false
}

// Restrains reports whether the kind holds motion d rigidly.
func (k SupportKind) Restrains(d Dof) bool {
	switch k {
	case Fixed:
		return true
	case Pinned:
		return d == Axial || d == Transverse
	case Roller:
		return d == Transverse
	case AxialOnly:
		return d == Axial
	case Guided:
		return d == Axial || d == Rotation
	}
	return false
}

// Elastic reports whether s holds motion d by a spring: its kind leaves d
// free and a stiffness is given for it.
func (s Support) Elastic(d Dof) bool { return !s.Kind.Restrains(d) && s.Stiffness[d] > 0 }

// Holds reports whether s holds motion d at all, rigidly or elastically.
func (s Support) Holds(d Dof) bool { return s.Kind.Restrains(d) || s.Elastic(d) }

// Support is a restraint at one point of the member.
type Support struct {
	X    float64 // position along the member, m
	Kind SupportKind
	// Stiffness per Dof of the motions the kind leaves free: N/m, N/m,
	// N·m/rad; 0 leaves the motion free. A motion the kind holds rigidly
	// takes none (Validate refuses one).
	Stiffness [3]float64
	// Settlement is the prescribed displacement of each rigidly restrained Dof: m, m, rad.
	// Entries for motions the kind leaves free are ignored.
	Settlement [3]float64
}

// Hinge is an internal moment release at x: the member turns freely there,
// or held by a rotational spring across the joint (a semi-rigid joint). The
// deflection stays continuous; the bending moment at the hinge is
// Stiffness times the jump in rotation, zero for a pure hinge.
type Hinge struct {
	X         float64 // m, strictly inside the member
	Stiffness float64 // N·m/rad across the joint; 0 for a pure hinge
}

// Foundation is an elastic (Winkler) foundation under the stretch from
// Start to End: a bed of independent springs that pushes back on the member
// in proportion to its motion there, −Modulus·w across and −AxialModulus·u
// along (a ground beam on soil, a rail on its bed, a pile in the ground).
// A modulus per unit area of ground, such as a subgrade modulus in N/m³,
// times the width of the member's contact gives the modulus here.
// Foundations that overlap add up.
type Foundation struct {
	Start, End float64 // m
	// Modulus is the transverse stiffness per unit length, N/m per m of
	// deflection: N/m².
	Modulus float64
	// AxialModulus is the stiffness along the member per unit length, N/m
	// per m of axial displacement (skin friction of a pile taken as
	// elastic): N/m²; 0 leaves the axial motion free.
	AxialModulus float64
}

// foundationAt is the total transverse and axial modulus of the
// foundations under x, N/m², reading a foundation's end as outside it.
func (m *Model) foundationAt(x float64) (modulus, axial float64) {
	for _, f := range m.Foundations {
		if x > f.Start && x < f.End {
			modulus += f.Modulus
			axial += f.AxialModulus
		}
	}
	return modulus, axial
}

// PointLoad is a concentrated force and/or moment at one point.
type PointLoad struct {
	X          float64 // m
	Axial      float64 // force along +x, N
	Transverse float64 // force along +y (up), N
	Moment     float64 // counter-clockwise moment, N·m
}

// LoadPoint is one vertex of a piecewise-linear distributed load.
type LoadPoint struct {
	X         float64 // m
	Intensity float64 // N/m, along +x for axial loads, along +y (up) for transverse loads
}

// DistributedLoad is a piecewise-linear line load over [Points[0].X, Points[last].X].
// Two points make a uniform, triangular or trapezoidal load; more make a polyline.
type DistributedLoad struct {
	Direction Dof // Axial or Transverse
	Points    []LoadPoint
}

// ElementOrder chooses the bar element; beams are always 2-node Hermite cubics.
type ElementOrder int

// Bar element orders.
const (
	LinearBar    ElementOrder = 1 // 2-node linear bar
	QuadraticBar ElementOrder = 2 // 3-node quadratic bar
)

// MeshSettings controls the subdivision of the member into elements.
// Nodes are always placed at segment breaks, supports, point loads and load
// break points; each stretch between them is then divided uniformly.
type MeshSettings struct {
	// Elements is the requested total number of elements (at least one per stretch).
	Elements int
	// MaxElementLength, when > 0, caps the element length in m; the finer of the two rules wins.
	MaxElementLength float64
	BarOrder         ElementOrder // 0 means LinearBar
}

// StandardGravity is gₙ, exact by definition (CGPM 1901; NIST SP 811, 2008, B.8).
const StandardGravity = 9.80665 // m/s²

// Model is one straight member along x, from 0 to L, in SI units.
type Model struct {
	Segments []Segment
	Supports []Support
	// Hinges release the bending moment at points inside the member.
	Hinges []Hinge
	// Foundations carry the member elastically along stretches of it.
	Foundations     []Foundation
	PointLoads      []PointLoad
	DistributedLoad []DistributedLoad
	// Gravity is the acceleration of self-weight in member axes (x along the
	// member, y up), m/s². Zero means no self-weight. A horizontal beam has
	// {0, -StandardGravity}; a rod hanging from x = 0 has {StandardGravity, 0}.
	Gravity [2]float64
	// TemperatureChange is a uniform change of temperature along the member, K.
	TemperatureChange float64
	// AxialOnly declares the member a tie or strut: it carries axial force
	// only and takes no transverse load, and its bending is not solved.
	// A member that nothing loads transversely is solved the same way
	// without being declared so (Member.Bending).
	AxialOnly bool
	// Cases are named load sets (cases.go). A model with cases holds every
	// load in them and none in PointLoads, DistributedLoad or
	// TemperatureChange; Gravity then gives the direction of the
	// self-weight that the cases marked SelfWeight carry.
	Cases []LoadCase
	// Combinations combine the cases with the engineer's factors.
	Combinations []Combination
	Mesh         MeshSettings
}

// Length is the member length L, m (the end of the last segment).
func (m *Model) Length() float64 {
	if len(m.Segments) == 0 {
		return 0
	}
	return m.Segments[len(m.Segments)-1].End
}

// SegmentAt returns the index of the segment that holds x; at a break it
// returns the segment to the right, at the member end the last one.
// The segments tile the member in order, so it searches them by halves: the
// mesh, the exact solution and the checks ask it for every stretch, and a
// walk over every segment each time took 18 of the 19 s of solving a
// member of 40,000 segments.
func (m *Model) SegmentAt(x float64) int {
	i := sort.Search(len(m.Segments), func(i int) bool { return x < m.Segments[i].End })
	return min(i, len(m.Segments)-1)
}

// Clone returns a deep copy of m: no slice is shared with m, so editing one
// never changes the other. Nil slices stay nil.
func (m *Model) Clone() Model {
	c := *m
	c.Segments = slices.Clone(m.Segments)
	c.Supports = slices.Clone(m.Supports)
	c.Hinges = slices.Clone(m.Hinges)
	c.Foundations = slices.Clone(m.Foundations)
	c.PointLoads, c.DistributedLoad = cloneLoads(m.PointLoads, m.DistributedLoad)
	if m.Cases != nil {
		c.Cases = make([]LoadCase, len(m.Cases))
		for i, lc := range m.Cases {
			lc.PointLoads, lc.DistributedLoad = cloneLoads(lc.PointLoads, lc.DistributedLoad)
			c.Cases[i] = lc
		}
	}
	if m.Combinations != nil {
		c.Combinations = make([]Combination, len(m.Combinations))
		for i, cb := range m.Combinations {
			cb.Factors = slices.Clone(cb.Factors)
			cb.Trains = slices.Clone(cb.Trains)
			c.Combinations[i] = cb
		}
	}
	return c
}

// cloneLoads copies point and distributed loads deeply; nil stays nil.
func cloneLoads(points []PointLoad, lines []DistributedLoad) ([]PointLoad, []DistributedLoad) {
	var out []DistributedLoad
	if lines != nil {
		out = make([]DistributedLoad, len(lines))
		for i, d := range lines {
			d.Points = slices.Clone(d.Points)
			out[i] = d
		}
	}
	return slices.Clone(points), out
}
