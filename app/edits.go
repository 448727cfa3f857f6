package app

import (
	"fmt"
	"math"
	"sort"

	"stave/canvas"
	"stave/fem"
)

// The section and material a new sketch starts with. Invented values of the
// order of a mid-size rolled steel beam, for sketching only: the user is
// expected to type the real ones in the properties panel.
var (
	sketchSection  = fem.Section{Area: 5.0e-3, SecondMoment: 8.0e-5, FibreDistance: 0.15}
	sketchMaterial = fem.Material{Name: "steel (edit me)", Elastic: 200e9, Density: 7850, ThermalExpansion: 12e-6}
)

// sketchElements is the element count a new member starts with.
const sketchElements = 40

// sameX is the distance below which two positions count as one, m. Members
// are metres long; a micrometre is far below anything a user places.
const sameX = 1e-6

// newMember returns a model holding one bare member of length L.
func newMember(length float64) fem.Model {
	return fem.Model{
		Segments: []fem.Segment{{Start: 0, End: length, Section: sketchSection, Material: sketchMaterial}},
		Mesh:     fem.MeshSettings{Elements: sketchElements, BarOrder: fem.LinearBar},
	}
}

// setLength moves the right end of the member to L. Segment breaks, supports,
// hinges and loads beyond the new end (a hinge at it too) are removed, and
// distributed loads and foundations are cut at it, so shortening then
// lengthening again is not an identity: undo is.
func setLength(m *fem.Model, length float64) error {
	if !(length > 0) || math.IsInf(length, 0) {
		return fmt.Errorf("the member needs a positive length: its end must lie to the right of its start")
	}
	if len(m.Segments) == 0 {
		*m = newMember(length)
		return nil
	}
	segs := m.Segments[:0]
	for _, s := range m.Segments {
		if s.Start < length-sameX {
			segs = append(segs, s)
		}
	}
	segs[len(segs)-1].End = length
	m.Segments = segs
	sup := m.Supports[:0]
	for _, s := range m.Supports {
		if s.X <= length+sameX {
			sup = append(sup, s)
		}
	}
	m.Supports = sup
	hinges := m.Hinges[:0]
	for _, h := range m.Hinges {
		if h.X < length-sameX {
			hinges = append(hinges, h)
		}
	}
	m.Hinges = hinges
	beds := m.Foundations[:0]
	for _, f := range m.Foundations {
		if f.Start < length-sameX {
			f.End = min(f.End, length)
			beds = append(beds, f)
		}
	}
	m.Foundations = beds
	pl := m.PointLoads[:0]
	for _, p := range m.PointLoads {
		if p.X <= length+sameX {
			pl = append(pl, p)
		}
	}
	m.PointLoads = pl
	dl := m.DistributedLoad[:0]
	for _, d := range m.DistributedLoad {
		if d.Points[0].X < length-sameX {
			d.Points = cutLoad(d.Points, length)
			dl = append(dl, d)
		}
	}
	m.DistributedLoad = dl
	return nil
}

// cutLoad ends a load polyline at x, interpolating the intensity there.
func cutLoad(pts []fem.LoadPoint, x float64) []fem.LoadPoint {
	if pts[len(pts)-1].X <= x {
		return pts
	}
	out := make([]fem.LoadPoint, 0, len(pts))
	for _, p := range pts {
		if p.X < x {
			out = append(out, p)
		}
	}
	return append(out, fem.LoadPoint{X: x, Intensity: intensityAt(pts, x)})
}

// intensityAt interpolates a load polyline at x.
func intensityAt(pts []fem.LoadPoint, x float64) float64 {
	for i := 1; i < len(pts); i++ {
		a, b := pts[i-1], pts[i]
		if x <= b.X {
			if b.X-a.X < sameX {
				return b.Intensity
			}
			return a.Intensity + (b.Intensity-a.Intensity)*(x-a.X)/(b.X-a.X)
		}
	}
	return pts[len(pts)-1].Intensity
}

// splitSegment puts a segment break at x; both halves keep the section and
// material of the segment that held x.
func splitSegment(m *fem.Model, x float64) error {
	if len(m.Segments) == 0 {
		return fmt.Errorf("there is no member to split: draw one first")
	}
	i := m.SegmentAt(x)
	s := m.Segments[i]
	if x-s.Start < sameX || s.End-x < sameX {
		return fmt.Errorf("that point is already a segment end: pick a point inside a segment")
	}
	right := s
	right.Start = x
	m.Segments[i].End = x
	m.Segments = append(m.Segments[:i+1], append([]fem.Segment{right}, m.Segments[i+1:]...)...)
	return nil
}

// addSupport places a support of the given kind at x.
func addSupport(m *fem.Model, kind fem.SupportKind, x float64) {
	s := fem.Support{X: x, Kind: kind}
	if kind == fem.Spring {
		// Invented starting stiffnesses so the spring does something visible;
		// the user types the real ones.
		s.Stiffness = [3]float64{1e7, 1e6, 0}
	}
	m.Supports = append(m.Supports, s)
}

// Invented starting values of new loads, downward like gravity loads, for sketching.
const (
	sketchForce     = -10e3 // N
	sketchMoment    = 10e3  // N·m
	sketchLineLoad  = -5e3  // N/m
	minimumLoadSpan = 1e-3  // m; a shorter drag places no distributed load
)

// addPointForce places a downward force at x.
func addPointForce(m *fem.Model, x float64) {
	m.PointLoads = append(m.PointLoads, fem.PointLoad{X: x, Transverse: sketchForce})
}

// addPointMoment places a counter-clockwise moment at x.
func addPointMoment(m *fem.Model, x float64) {
	m.PointLoads = append(m.PointLoads, fem.PointLoad{X: x, Moment: sketchMoment})
}

// addLineLoad places a uniform downward line load over [a, b] (in any order).
func addLineLoad(m *fem.Model, a, b float64) error {
	if a > b {
		a, b = b, a
	}
	if b-a < minimumLoadSpan {
		return fmt.Errorf("drag along the member to give the line load a span")
	}
	m.DistributedLoad = append(m.DistributedLoad, fem.DistributedLoad{
		Direction: fem.Transverse,
		Points:    []fem.LoadPoint{{X: a, Intensity: sketchLineLoad}, {X: b, Intensity: sketchLineLoad}},
	})
	return nil
}

// addLoadVertex inserts a vertex into distributed load i at x, on the
// current polyline so the load does not change until the vertex is dragged.
// It returns the index of the new vertex.
func addLoadVertex(m *fem.Model, i int, x float64) (int, error) {
	if i < 0 || i >= len(m.DistributedLoad) {
		return 0, fmt.Errorf("distributed load %d does not exist", i+1)
	}
	pts := m.DistributedLoad[i].Points
	if x <= pts[0].X+sameX || x >= pts[len(pts)-1].X-sameX {
		return 0, fmt.Errorf("that point is not inside distributed load %d: add vertices between its ends", i+1)
	}
	k := sort.Search(len(pts), func(j int) bool { return pts[j].X >= x })
	if math.Abs(pts[k].X-x) < sameX {
		return 0, fmt.Errorf("distributed load %d already has a vertex there", i+1)
	}
	p := fem.LoadPoint{X: x, Intensity: intensityAt(pts, x)}
	out := append(append(append(make([]fem.LoadPoint, 0, len(pts)+1), pts[:k]...), p), pts[k:]...)
	m.DistributedLoad[i].Points = out
	return k, nil
}

// remove deletes the item r names. Deleting a vertex of a two-point load
// removes the load; deleting a segment merges it into its right neighbour
// (the last one into its left); deleting the member clears the model.
func remove(m *fem.Model, r canvas.Ref) error {
	switch r.Kind {
	case canvas.Support:
		m.Supports = append(m.Supports[:r.Index], m.Supports[r.Index+1:]...)
	case canvas.PointLoad:
		m.PointLoads = append(m.PointLoads[:r.Index], m.PointLoads[r.Index+1:]...)
	case canvas.Hinge:
		m.Hinges = append(m.Hinges[:r.Index], m.Hinges[r.Index+1:]...)
	case canvas.Foundation:
		m.Foundations = append(m.Foundations[:r.Index], m.Foundations[r.Index+1:]...)
	case canvas.DistributedLoad:
		m.DistributedLoad = append(m.DistributedLoad[:r.Index], m.DistributedLoad[r.Index+1:]...)
	case canvas.LoadVertex:
		d := &m.DistributedLoad[r.Index]
		if len(d.Points) <= 2 {
			return remove(m, canvas.Ref{Kind: canvas.DistributedLoad, Index: r.Index})
		}
		d.Points = append(d.Points[:r.Vertex], d.Points[r.Vertex+1:]...)
	case canvas.Segment:
		if len(m.Segments) < 2 {
			return fmt.Errorf("the member has one segment only; delete the member instead")
		}
		i := r.Index
		if i == len(m.Segments)-1 {
			i--
		}
		m.Segments[i].End = m.Segments[i+1].End
		m.Segments = append(m.Segments[:i+1], m.Segments[i+2:]...)
	case canvas.Member, canvas.MemberEnd:
		mesh := m.Mesh
		*m = fem.Model{Mesh: mesh}
	case canvas.Element:
		return fmt.Errorf("element %d is part of the mesh, not of the model: change the number of elements below the drawing instead", r.Index+1)
	default:
		return fmt.Errorf("nothing selected to delete: click an item first")
	}
	return nil
}

// describe names the item r for messages and the properties panel title.
func describe(r canvas.Ref) string {
	switch r.Kind {
	case canvas.Support:
		return fmt.Sprintf("support %d", r.Index+1)
	case canvas.PointLoad:
		return fmt.Sprintf("point load %d", r.Index+1)
	case canvas.Hinge:
		return fmt.Sprintf("hinge %d", r.Index+1)
	case canvas.Foundation:
		return fmt.Sprintf("foundation %d", r.Index+1)
	case canvas.DistributedLoad:
		return fmt.Sprintf("distributed load %d", r.Index+1)
	case canvas.LoadVertex:
		return fmt.Sprintf("vertex %d of distributed load %d", r.Vertex+1, r.Index+1)
	case canvas.Segment:
		return fmt.Sprintf("segment %d", r.Index+1)
	case canvas.Member, canvas.MemberEnd:
		return "member"
	case canvas.Element:
		return fmt.Sprintf("element %d", r.Index+1)
	}
	return "nothing"
}
