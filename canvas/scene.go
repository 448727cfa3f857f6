// Package canvas turns a member model and its results into a scene, a
// display list of polylines, polygons, circles and text in pixels, and draws
// that one scene to PNG, SVG and PDF (WritePNG, WriteSVG, WritePDF) and, for
// the screen, to a raster of its shapes (Rasterize) under text that the
// window sets itself (package app), so a report shows exactly what the
// screen showed. It imports no GUI toolkit.
//
// The path is Input + View -> Build -> Scene -> renderer. Build lays out a
// sketch band (member, supports, loads, deformed shape, dimension line, scale
// bar) and one strip per switched-on diagram, all sharing the view's x
// transform. Result curves are reduced per pixel column (first, min, max, last)
// so the size of a scene is bounded by the view width, not by the number of
// elements. Handles in the scene let the GUI hit-test what is under the mouse.
//
// The package also writes the report products: a one-page calculation sheet
// (WriteSheet), a convergence chart (WriteConvergenceChart) and a table of
// results (WriteCSV); package canvas/report makes them from an analysis.
package canvas

import (
	"image/color"
	"math"
)

// RefKind says what kind of model part a Ref points at.
type RefKind int

// Kinds of things the user can point at. Index in Ref points into the model
// slice named by the kind.
const (
	None            RefKind = iota
	Member                  // the member line
	MemberEnd               // the right end: drag to change the length
	Segment                 // Model.Segments[Index]
	Support                 // Model.Supports[Index]
	PointLoad               // Model.PointLoads[Index]
	DistributedLoad         // Model.DistributedLoad[Index] as a whole: drag sideways to move
	LoadVertex              // Model.DistributedLoad[Index].Points[Vertex]: drag up/down for intensity
	CheckMark               // a marked check (Index is the caller's check index)
	Element                 // Solution.Mesh.Elements[Index], in the nodal loads' strip
	Hinge                   // Model.Hinges[Index]
	Foundation              // Model.Foundations[Index]: drag sideways to move
)

var refKindNames = [...]string{"none", "member", "member end", "segment", "support",
	"point load", "distributed load", "load vertex", "check mark", "element", "hinge", "foundation"}

// String names the kind in plain words.
func (k RefKind) String() string {
	if k < 0 || int(k) >= len(refKindNames) {
		return "unknown"
	}
	return refKindNames[k]
}

// Ref points at one part of the model.
type Ref struct {
	Kind   RefKind
	Index  int
	Vertex int
}

// Point is a position in scene pixels, origin top-left, y down.
type Point struct{ X, Y float32 }

// ItemKind says how an Item is drawn.
type ItemKind int

// Kinds of scene items.
const (
	Polyline ItemKind = iota // Points joined, stroked
	Polygon                  // Points closed, filled with Fill (and stroked if StrokeWidth > 0)
	Circle                   // Center and Radius, filled and/or stroked
	Text                     // Text with its box's top-left corner at At
)

// Item is one entry of the display list. Colours with zero alpha are not drawn.
type Item struct {
	Kind        ItemKind
	Points      []Point
	Center      Point
	Radius      float32
	Stroke      color.NRGBA
	StrokeWidth float32
	Dash        bool // short dashes instead of a solid stroke
	Fill        color.NRGBA

	Text string
	At   Point   // top-left corner of the text box
	Size float32 // text height in pixels
	Bold bool
	// Width is the measured width of the text box, used for layout and alignment.
	Width float32
}

// Handle is a hit area for a model part: a polyline (one point for a point
// handle) widened by Radius.
type Handle struct {
	Ref    Ref
	Points []Point
	Radius float32
	// PerPixel is the change of load intensity, N/m, for a drag of one pixel
	// down the screen (LoadVertex handles only; zero otherwise).
	PerPixel float64
}

// Strip is one diagram strip's place in the scene, so the GUI can label or
// hit-test it.
type Strip struct {
	Name          string
	Top, Bottom   float32
	BaselineY     float32
	UnitsPerPixel float64 // SI value per pixel, positive upward on screen
}

// Scene is the display list for one drawing, in pixels with the origin at the
// top-left corner.
type Scene struct {
	Width, Height float32
	Items         []Item
	Handles       []Handle
	// LoadScale is the distributed load intensity, N/m, that one pixel of
	// height stands for in the sketch band.
	LoadScale float64
	// MemberY is the screen y of the member axis; LoadBaseY the y from which
	// distributed load ordinates are measured.
	MemberY, LoadBaseY float32
	// SketchBottom is the bottom of the sketch band; Strips follow below it.
	SketchBottom float32
	Strips       []Strip
	// Magnification is the deflection scale factor used for the deformed shape.
	Magnification float64
}

// HitTest returns the topmost handle within tolerance pixels of (px, py);
// handles added later lie on top. It returns Ref{} (Kind None) when nothing is hit.
func (s *Scene) HitTest(px, py, tolerance float32) Ref {
	p := Point{px, py}
	for i := len(s.Handles) - 1; i >= 0; i-- {
		h := s.Handles[i]
		if distanceToPolyline(p, h.Points) <= h.Radius+tolerance {
			return h.Ref
		}
	}
	return Ref{}
}

// IntensityPerPixel is the change of load intensity, N/m, for dragging the
// vertex ref one pixel down; zero when ref is not a load vertex in the scene.
func (s *Scene) IntensityPerPixel(ref Ref) float64 {
	for _, h := range s.Handles {
		if h.Ref == ref {
			return h.PerPixel
		}
	}
	return 0
}

func distanceToPolyline(p Point, pts []Point) float32 {
	if len(pts) == 0 {
		return float32(math.Inf(1))
	}
	best := distance(p, pts[0])
	for i := 1; i < len(pts); i++ {
		best = min(best, distanceToSegment(p, pts[i-1], pts[i]))
	}
	return best
}

func distance(a, b Point) float32 {
	return float32(math.Hypot(float64(a.X-b.X), float64(a.Y-b.Y)))
}

func distanceToSegment(p, a, b Point) float32 {
	dx, dy := b.X-a.X, b.Y-a.Y
	l2 := dx*dx + dy*dy
	if l2 == 0 {
		return distance(p, a)
	}
	t := ((p.X-a.X)*dx + (p.Y-a.Y)*dy) / l2
	t = max(0, min(1, t))
	return distance(p, Point{a.X + t*dx, a.Y + t*dy})
}
