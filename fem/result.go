package fem

// Caution goes with every result Stave shows, prints or writes.
const Caution = "Results are an aid for checking only. A qualified engineer must review them; local codes and licensed practice govern."

// Side picks the limit at a point where a field jumps (under a point load, at
// a support, at a change of section).
type Side int

// Sides of a point.
const (
	Left  Side = -1
	Right Side = 1
)

// Name is the side as results name it: "left", "right", or "" for neither
// (a field read where it does not jump).
func (s Side) Name() string {
	switch s {
	case Left:
		return "left"
	case Right:
		return "right"
	}
	return ""
}

// SideNamed is the side of name, as Name gives it: 0 for any other name.
func SideNamed(name string) Side {
	switch name {
	case "left":
		return Left
	case "right":
		return Right
	}
	return 0
}

// Place is the position p, written with its unit ("4.000 m", or
// "x = 4.000 m"), read on side s of a jump: "just left of 4.000 m"; p
// itself where s is neither side. Every output that says where a value
// is read says it so.
func (s Side) Place(p string) string {
	if n := s.Name(); n != "" {
		return "just " + n + " of " + p
	}
	return p
}

// At is where a value is, as words after it: "at 4.000 m", or on side s of
// a jump "just left of 4.000 m" (Place).
func (s Side) At(p string) string {
	if s.Name() == "" {
		return "at " + p
	}
	return s.Place(p)
}

// Fields are all result quantities at one position x along the member.
type Fields struct {
	X                 float64 // m
	AxialDisplacement float64 // u, m
	Deflection        float64 // w, m, positive up
	Rotation          float64 // θ = dw/dx, rad, counter-clockwise
	AxialForce        float64 // N, N, tension positive
	ShearForce        float64 // V = dM/dx, N
	BendingMoment     float64 // M = EI·w'', N·m, sagging positive
	AxialStress       float64 // N/A, Pa
	BendingStress     float64 // M·c/I, Pa (positive in the bottom fibre under sagging)
	CombinedStress    float64 // N/A ± M·c/I, whichever extreme fibre is larger in magnitude, Pa
}

// Field is anything that can be read at a point: the finite element solution
// and the exact solution both are.
type Field interface {
	At(x float64, side Side) Fields
}

// Element is one finite element of the mesh.
type Element struct {
	Segment    int     // index of the segment it lies in
	Start, End float64 // m
	First      int     // index of its first end node in Mesh.X; the other end node is First+1
}

// Mesh is the subdivision of the member. X holds the end nodes of the elements
// in increasing order; quadratic bars add an internal node at each element's
// middle that is not listed here.
type Mesh struct {
	X        []float64
	Elements []Element
	// Automatic says Stave chose the mesh (the default mesh rule), and Note
	// how, in words for reports.
	Automatic bool
	Note      string
}

// Reaction is the force a support exerts on the member, in member axes.
type Reaction struct {
	Support int        // index into Model.Supports
	X       float64    // m
	Force   [3]float64 // axial N, transverse N, moment N·m (counter-clockwise)
}

// Equilibrium compares applied loads with reactions, those of the supports
// and of the foundations: Fx, Fy and the moment about x = 0. Residual =
// Applied + Reactions, which must vanish. Ground is the part of Reactions
// the foundations carry (zero without foundations). Sizes are those of the
// loads added up without their signs (Loads.Sizes; zero in a balance built
// from Applied alone, Exact.Balance), the scale of the round-off in
// Applied.
type Equilibrium struct {
	Applied, Reactions, Residual [3]float64
	Ground                       [3]float64
	Sizes                        [3]float64
}
