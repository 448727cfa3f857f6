package canvas

import (
	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// Input is everything Build draws. Solution and Exact may be nil (not solved
// yet, or the solver failed: then Problem says why).
type Input struct {
	Model    *fem.Model
	Solution *fem.Solution
	Exact    *fem.Exact
	// Problem is a solver error, shown prominently on the drawing.
	Problem string
	// Unreliable marks every strip with a warning (ill-conditioned or failed checks).
	Unreliable bool
	// Overlays switch the deformed shape, the diagram strips (axial force,
	// shear force, bending moment, combined stress with a colour legend),
	// the node ticks and the exact curve with its gap on and off: the
	// project's own switches, as the window shows and the file saves them.
	Overlays storage.Overlays
	// Dimensions draws the dimension lines and the scale bar.
	Dimensions bool
	// Magnification of deflections in the deformed shape; 0 picks one so the
	// largest deflection is about 15% of the sketch band height.
	Magnification float64
	Units         units.System
	Selected      Ref
	// HoverX is the model x (m) of the mouse when Hovering.
	HoverX   float64
	Hovering bool
	// Highlight is an x range (m) shaded across all strips, e.g. the place of a
	// selected check; {0, 0} means none.
	Highlight [2]float64
	// Marks are places the checks point at, drawn as small markers along
	// the foot of the sketch with CheckMark handles.
	Marks []Mark
	// NodalLoads, when not nil, adds a strip under the sketch with the
	// nodal loads of the solution's mesh, consistent beside lumped, whose
	// elements can be pointed at (Element handles); the selected element's
	// span is shaded.
	NodalLoads *fem.NodalLoads
	// Handles draws the window's editing handles that mean nothing on
	// paper: the open circle at the member's end that drags its length,
	// which on a drawing reads as a pin (on a fixed end, say). Exports
	// leave it off.
	Handles bool
	// Cache, when not nil, keeps sampled results between builds (see Cache).
	Cache *Cache
	// Envelope, when not nil, is drawn in the strips instead of Solution
	// (envelope.go); the sketch still shows Solution's deformed shape and
	// reactions, which must be the first combination's (Names[0]), and
	// says whose they are.
	Envelope *Envelope
	// Showing names whose deflection and reactions the sketch draws
	// ("combination ULS 1"), and LoadsOf whose loads, when the model has
	// cases: the window draws the loads of the case it edits beside the
	// results of what it shows. When the two differ the sketch says whose
	// each is. Under an envelope the results are the first combination's,
	// whatever Showing says.
	Showing, LoadsOf string
}

// Mark is one marked check.
type Mark struct {
	X      float64 // where the check points, m
	Index  int     // the caller's check index, returned as Ref.Index of its handle
	Severe bool    // a failed check (drawn in the problem colour) rather than a warning
	Name   string  // what the mark stands for, written beside it ("caution: Stress, segment 1")
}
