package storage

import "stave/fem"

// Project is everything a project file holds.
type Project struct {
	Notes Notes
	Model fem.Model
	// LoadOrder is the order in which the loads appear in the file, point and
	// distributed loads interleaved: the i-th entry says which kind the i-th
	// load is, and each entry takes the next unused load of its kind from
	// Model.PointLoads or Model.DistributedLoad. Nil keeps all point loads
	// first. Entries beyond the loads of a kind are skipped and loads beyond
	// the entries are written last, so a stale order never loses a load.
	LoadOrder []LoadKind
	// CaseLoadOrder is LoadOrder for the loads of each load case, in the
	// order of Model.Cases; nil, or short, keeps point loads first.
	CaseLoadOrder [][]LoadKind
	View          View
}

// LoadKind tells point loads from distributed loads in Project.LoadOrder.
type LoadKind int

// Load kinds, named in files as "point" and "distributed".
const (
	PointLoad LoadKind = iota
	DistributedLoad
)

// Notes identify the work. All fields are free text.
type Notes struct {
	Project  string // project name or number
	Member   string // member mark, e.g. "J-3"
	Engineer string
	Date     string // the date the engineer gives, written as they like (YYYY-MM-DD suggested)
	Text     string // anything else: assumptions, sources of values, remarks
}

// UnitSystem is the unit system results are displayed in. Files always store SI.
type UnitSystem string

// Display unit systems.
const (
	SI UnitSystem = "SI" // N, m, Pa
	US UnitSystem = "US" // lbf, ft and in, psi
)

// Overlays switch the drawings over the member on and off.
type Overlays struct {
	DeformedShape bool
	AxialForce    bool
	ShearForce    bool
	BendingMoment bool
	Stress        bool
	Nodes         bool
	ExactBand     bool // the band between the finite element and the exact solution
}

// View holds the display settings saved with a project.
type View struct {
	Units    UnitSystem
	Overlays Overlays
	// Magnification scales displacements in the deformed shape; 0 chooses it automatically.
	Magnification float64
	// GridStep is the spacing of the snapping grid along the member, m; 0 means no grid.
	GridStep float64
	// DeflectionLimit is n in the deflection limit span/n.
	DeflectionLimit float64
	// SafetyFactor divides the allowable stress in stress checks.
	SafetyFactor float64
}

// DefaultDeflectionLimit is n in span/360, a limit common for floors
// (common practice; local codes govern).
const DefaultDeflectionLimit = 360

// DefaultView is the view of a new project and the value of every view
// setting a file leaves out.
func DefaultView() View {
	return View{
		Units:           SI,
		Overlays:        Overlays{DeformedShape: true, BendingMoment: true},
		GridStep:        0.1,
		DeflectionLimit: DefaultDeflectionLimit,
		SafetyFactor:    1,
	}
}
