package canvas

import (
	"fmt"
	"image/color"
	"reflect"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/bench"
	"stave/fem/units"
	"stave/storage"
)

// scenePoints counts the coordinates a renderer must handle.
func scenePoints(s *Scene) int {
	n := 0
	for _, it := range s.Items {
		n += len(it.Points) + 1
	}
	return n
}

func TestSceneSizeIsBoundedByWidth(t *testing.T) {
	const w, h = 800, 900
	var counts []int
	for _, elements := range []int{1000, 100000} {
		m := demoModel(elements)
		in := solved(t, m)
		v := NewView(w, h)
		v.Fit(m)
		s := Build(in, v)
		counts = append(counts, scenePoints(s))
		// Per strip: FE area, FE line, exact line and the gap band, each at
		// most four points per pixel column; the sketch adds a fixed amount.
		bound := 4*(w+2)*6*(len(s.Strips)+1) + 3000
		if c := scenePoints(s); c > bound {
			t.Errorf("%d elements: scene has %d points, more than the %d a %d px wide view allows", elements, c, bound, w)
		}
	}
	if counts[1] > 3*counts[0] {
		t.Errorf("100× more elements gave %d points instead of %d: the scene grows with the mesh, not the width", counts[1], counts[0])
	}
}

// Labels are drawn on top of everything else, and the hover line stops at
// every label it would cross: through the gaps of the glyphs its dashes
// made "2.500 m" read "2.900 m".
func TestHoverLineSparesLabels(t *testing.T) {
	m := demoModel(40)
	in := solved(t, m)
	v := NewView(1200, 900)
	v.Fit(m)
	for _, hx := range []float64{0.1, 1.5, 3, 4.2, 5.2} {
		in.Hovering, in.HoverX = true, hx
		s := Build(in, v)
		x := v.ToScreenX(hx)
		var hover [][2]float32
		var crossed []Item
		firstText := -1
		for i, it := range s.Items {
			switch {
			case it.Kind == Text && firstText < 0:
				firstText = i
			case it.Kind != Text && firstText >= 0:
				t.Fatalf("x = %g m: item %d (kind %d) is drawn after the text at %d", hx, i, it.Kind, firstText)
			}
			if it.Kind == Polyline && it.Dash && it.Stroke == hoverColour {
				hover = append(hover, [2]float32{it.Points[0].Y, it.Points[1].Y})
			}
			if it.Kind == Text && x >= it.At.X && x <= it.At.X+it.Width {
				crossed = append(crossed, it)
			}
		}
		if len(hover) == 0 {
			t.Fatalf("x = %g m: no hover line", hx)
		}
		for _, tx := range crossed {
			top, bottom := tx.At.Y, tx.At.Y+TextHeight(tx.Size)
			for _, h := range hover {
				if h[0] < bottom && h[1] > top {
					t.Errorf("x = %g m: the hover line from y = %g to %g crosses the label %q (y %g to %g)", hx, h[0], h[1], tx.Text, top, bottom)
				}
			}
		}
		if hx == 4.2 && len(crossed) == 0 {
			t.Errorf("x = %g m: the hover line crosses no label; the test needs one", hx)
		}
	}
}

func TestHitTest(t *testing.T) {
	m := demoModel(20)
	in := solved(t, m)
	in.Selected = Ref{Kind: DistributedLoad, Index: 0}
	v := NewView(1000, 800)
	v.Fit(m)
	s := Build(in, v)
	y := s.MemberY
	load := m.DistributedLoad[0].Points[1]
	vertexY := s.LoadBaseY + float32(load.Intensity/s.LoadScale)
	tests := []struct {
		name   string
		px, py float32
		want   Ref
	}{
		{"member between supports and loads", v.ToScreenX(5.2), y, Ref{Kind: Member}},
		{"right end of the member, below the load there", v.ToScreenX(6), y + 7, Ref{Kind: MemberEnd}},
		{"roller support symbol", v.ToScreenX(4.5), y + 18, Ref{Kind: Support, Index: 1}},
		{"point load arrow shaft", v.ToScreenX(2), y - 25, Ref{Kind: PointLoad, Index: 0}},
		{"second load vertex", v.ToScreenX(load.X), vertexY, Ref{Kind: LoadVertex, Index: 0, Vertex: 1}},
		{"load outline top edge", v.ToScreenX(1), s.LoadBaseY + float32(intensityAt(m.DistributedLoad[0].Points, 1)/s.LoadScale), Ref{Kind: DistributedLoad, Index: 0}},
		{"empty corner", 5, s.SketchBottom - 5, Ref{}},
	}
	for _, tc := range tests {
		if got := s.HitTest(tc.px, tc.py, 3); got != tc.want {
			t.Errorf("%s at (%.0f, %.0f): hit %v %d/%d, want %v %d/%d", tc.name, tc.px, tc.py,
				got.Kind, got.Index, got.Vertex, tc.want.Kind, tc.want.Index, tc.want.Vertex)
		}
	}
	if pp := s.IntensityPerPixel(Ref{Kind: LoadVertex, Index: 0, Vertex: 1}); pp != s.LoadScale {
		t.Errorf("a downward drag of a transverse load vertex changes it by %g N/m per pixel, want LoadScale %g", pp, s.LoadScale)
	}
}

func TestViewRoundTripAndZoom(t *testing.T) {
	m := demoModel(4)
	v := NewView(1000, 600)
	v.Fit(m)
	if a, b := v.ToScreenX(0), v.ToScreenX(m.Length()); a != fitMarginLeft || b != 1000-fitMarginRight {
		t.Errorf("fitted member spans %.1f..%.1f px, want %d..%d", a, b, fitMarginLeft, 1000-fitMarginRight)
	}
	before := v.ToModelX(300)
	v.Zoom(2.5, 300)
	if after := v.ToModelX(300); after-before > 1e-12 || before-after > 1e-12 {
		t.Errorf("zoom moved the point under the mouse from x = %g to %g", before, after)
	}
	v.Pan(40, 0)
	if x := v.ToModelX(340); x-before > 1e-12 || before-x > 1e-12 {
		t.Errorf("after panning 40 px the point is at x = %g, want %g", x, before)
	}
}

func BenchmarkBuild(b *testing.B) {
	for _, elements := range []int{10000, 1000000} {
		b.Run(fmt.Sprintf("elements=%d", elements), func(b *testing.B) {
			m := demoModel(elements)
			in := solved(b, m)
			v := NewView(1200, 900)
			v.Fit(m)
			var s *Scene
			for b.Loop() {
				s = Build(in, v)
			}
			b.ReportMetric(float64(len(s.Items)), "items")
			b.ReportMetric(float64(scenePoints(s)), "points")
		})
	}
	// A hover redraw with a cache reuses the sampled curves.
	b.Run("elements=1000000/hover", func(b *testing.B) {
		m := demoModel(1000000)
		in := solved(b, m)
		in.Cache = &Cache{}
		v := NewView(1200, 900)
		v.Fit(m)
		Build(in, v)
		in.Hovering = true
		for b.Loop() {
			in.HoverX += 1e-4
			Build(in, v)
		}
	})
}

// The deflected shape passes through the segment names under the member: it
// breaks around them, in pieces that cover nothing.
func TestDeflectedShapeBreaksAroundSegmentNames(t *testing.T) {
	m := demoModel(40)
	in := solved(t, m)
	in.Overlays.DeformedShape = true
	v := NewView(1200, 900)
	v.Fit(m)
	// Magnified so that the curve meets the middle of the name S1.
	s := Build(in, v)
	for _, it := range s.Items {
		if it.Kind == Text && it.Text == "S1 steel" {
			x, y := it.At.X+it.Width/2, it.At.Y+TextHeight(it.Size)/2
			w := curveAt(t, s, x) - s.MemberY
			in.Magnification = s.Magnification * float64((y-s.MemberY)/w)
		}
	}
	s = Build(in, v)
	var names []Item
	var pieces [][]Point
	for _, it := range s.Items {
		if it.Kind == Text && strings.HasPrefix(it.Text, "S") && strings.HasSuffix(it.Text, " steel") {
			names = append(names, it)
		}
		if it.Kind == Polyline && it.Stroke == deformedColour {
			pieces = append(pieces, it.Points)
		}
	}
	if len(names) != 2 {
		t.Fatalf("%d segment names found, want the fixture's two", len(names))
	}
	crossed := 0
	for _, n := range names {
		box := []rect{{n.At.X, n.At.Y, n.At.X + n.Width, n.At.Y + TextHeight(n.Size)}}
		for _, pc := range pieces {
			for i := 0; i+1 < len(pc); i++ {
				if len(insideSpans(pc[i], pc[i+1], box, 0)) > 0 {
					t.Errorf("the deflected shape from %v to %v runs through %q", pc[i], pc[i+1], n.Text)
				}
			}
		}
		// Joined up again, the pieces cross the name: the test needs a
		// name that the curve would run through.
		for i := 0; i+1 < len(pieces); i++ {
			a, b := pieces[i][len(pieces[i])-1], pieces[i+1][0]
			if len(insideSpans(a, b, box, 0)) > 0 {
				crossed++
			}
		}
	}
	if crossed == 0 {
		t.Error("the deflected shape crosses no segment name; the test needs one")
	}
}

// curveAt is the height of the deflected shape at the screen column x.
func curveAt(t *testing.T, s *Scene, x float32) float32 {
	t.Helper()
	for _, it := range s.Items {
		if it.Kind != Polyline || it.Stroke != deformedColour {
			continue
		}
		for i := 0; i+1 < len(it.Points); i++ {
			p, q := it.Points[i], it.Points[i+1]
			if p.X <= x && x <= q.X && q.X > p.X {
				return p.Y + (x-p.X)/(q.X-p.X)*(q.Y-p.Y)
			}
		}
	}
	t.Fatalf("no deflected shape at x = %g", x)
	return 0
}

// around keeps what lies outside the boxes, as pieces that end on their edges.
func TestAroundBoxes(t *testing.T) {
	box := []rect{{10, -5, 20, 5}}
	for _, c := range []struct {
		name string
		pts  []Point
		want [][]Point
	}{
		{"through", []Point{{0, 0}, {30, 0}}, [][]Point{{{0, 0}, {10, 0}}, {{20, 0}, {30, 0}}}},
		{"through, several points", []Point{{0, 0}, {12, 0}, {18, 0}, {30, 0}}, [][]Point{{{0, 0}, {10, 0}}, {{20, 0}, {30, 0}}}},
		{"past", []Point{{0, 10}, {15, 10}, {30, 10}}, [][]Point{{{0, 10}, {15, 10}, {30, 10}}}},
		{"inside", []Point{{12, 0}, {18, 0}}, nil},
		{"in slanting, out level", []Point{{5, 0}, {15, 4}, {25, 4}}, [][]Point{{{5, 0}, {10, 2}}, {{20, 4}, {25, 4}}}},
		{"touching a corner only", []Point{{5, 0}, {15, 10}}, [][]Point{{{5, 0}, {15, 10}}}},
	} {
		got := around(c.pts, box, 0)
		if !reflect.DeepEqual(got, c.want) {
			t.Errorf("%s: around gives %v, want %v", c.name, got, c.want)
		}
	}
}

// Hinges and foundations are picked like supports: a hinge's ring on the
// member, a foundation's bed under it, and a support standing in the bed
// stays the support's.
func TestHitTestHingeAndFoundation(t *testing.T) {
	m := demoModel(20)
	m.Supports = append(m.Supports, fem.Support{X: 6, Kind: fem.Roller})
	m.Hinges = []fem.Hinge{{X: 5.2}}
	m.Foundations = []fem.Foundation{{Start: 0, End: 3.5, Modulus: 5e6}}
	in := solved(t, m)
	v := NewView(1000, 800)
	v.Fit(m)
	s := Build(in, v)
	y := s.MemberY
	tests := []struct {
		name   string
		px, py float32
		want   Ref
	}{
		{"hinge ring on the member", v.ToScreenX(5.2), y, Ref{Kind: Hinge}},
		{"just beside the hinge", v.ToScreenX(5.2) + 4, y + 3, Ref{Kind: Hinge}},
		{"member away from the hinge", v.ToScreenX(5.6), y, Ref{Kind: Member}},
		{"foundation bed under the member", v.ToScreenX(2.7), y + 9, Ref{Kind: Foundation}},
		{"foundation bed near its end", v.ToScreenX(3.45), y + 12, Ref{Kind: Foundation}},
		{"member over the foundation", v.ToScreenX(2.7), y, Ref{Kind: Member}},
		{"pinned support standing in the bed", v.ToScreenX(0), y + 18, Ref{Kind: Support, Index: 0}},
		{"below the bed, clear of it", v.ToScreenX(2.7), y + 40, Ref{}},
	}
	for _, tc := range tests {
		if got := s.HitTest(tc.px, tc.py, 3); got != tc.want {
			t.Errorf("%s at (%.0f, %.0f): hit %v %d, want %v %d", tc.name, tc.px, tc.py, got.Kind, got.Index, tc.want.Kind, tc.want.Index)
		}
	}
	in.Selected = Ref{Kind: Foundation}
	if !hasColour(Build(in, v), selectedColour, v.ToScreenX(1), v.ToScreenX(3.5)) {
		t.Errorf("a selected foundation is not drawn in the selection colour")
	}
	carried := units.SI.Format(units.Force, in.Solution.Foundations[0].Force[fem.Transverse])
	if !hasText(s, "bed 5000 kN/m², Ry "+carried) { // 5e6 N/m² in kN/m², and the solution's share
		t.Errorf("no modulus label under the foundation among %v", texts(s))
	}
}

// hasColour reports whether some line of s in colour c lies between the
// screen x x0 and x1.
func hasColour(s *Scene, c color.NRGBA, x0, x1 float32) bool {
	for _, it := range s.Items {
		if it.Kind == Polyline && it.Stroke == c && len(it.Points) > 0 && it.Points[0].X >= x0 && it.Points[0].X <= x1 {
			return true
		}
	}
	return false
}

// On a laptop's screen (1280 × 720, where the window's drawing measures
// 731 × 365 px) the sketch and two diagrams, the demo's shear force and
// bending moment, fit in the drawing: nothing of the lower diagram runs
// below its edge. Three or more may run on, to be panned to.
func TestTwoDiagramsFitALaptopDrawing(t *testing.T) {
	v := NewView(731, 365)
	lay := layout(storage.Overlays{ShearForce: true, BendingMoment: true}, v, 1, false)
	if len(lay.strips) != 2 {
		t.Fatalf("%d strips, want 2", len(lay.strips))
	}
	if bottom := lay.strips[1].bottom; bottom > v.Height {
		t.Errorf("the lower diagram ends at %g px, below the drawing's %g px", bottom, v.Height)
	}
	if s := lay.strips[0]; s.top < lay.sketchBottom || s.bottom-s.top < 72 {
		t.Errorf("the upper diagram runs from %g to %g px under a sketch ending at %g px: want at least 72 px below it", s.top, s.bottom, lay.sketchBottom)
	}
}

// A Cache lends each build the memory of the one before (boxes, grid,
// labels, measured widths, written values): a drawing built with a Cache
// that has drawn others (more loads, fewer, a bigger view, other units, the
// same again) is the drawing built without one, item for item. A box or a
// label left over from an earlier build would move or drop a label here, a
// value written in other units would show. (Build's own contract; no check
// value of its own.)
func TestCacheLendsNothingOfEarlierDrawings(t *testing.T) {
	crowded := bench.KeyPointModel(200, 300)
	sparse := bench.KeyPointModel(200, 3)
	plain := demoModel(40)
	us := units.USCustomary
	steps := []struct {
		m    *fem.Model
		w, h float32
		u    units.System
	}{{crowded, 1000, 800, units.SI}, {sparse, 1000, 800, units.SI}, {plain, 1000, 800, units.SI}, {crowded, 1200, 900, units.SI},
		{plain, 1000, 800, us}, {crowded, 1000, 800, us}, {crowded, 1000, 800, units.SI}, {crowded, 1000, 800, units.SI}}
	cache := &Cache{}
	for i, st := range steps {
		v := NewView(st.w, st.h)
		v.Fit(st.m)
		in := solved(t, st.m)
		in.Units = st.u
		in.Cache = nil
		want := Build(in, v)
		in.Cache = cache
		got := Build(in, v)
		if len(got.Items) != len(want.Items) {
			t.Errorf("build %d: %d items with the Cache, %d without", i, len(got.Items), len(want.Items))
			continue
		}
		for k := range got.Items {
			if !reflect.DeepEqual(got.Items[k], want.Items[k]) {
				t.Errorf("build %d, item %d: %+v with the Cache, %+v without", i, k, got.Items[k], want.Items[k])
				break
			}
		}
		if !reflect.DeepEqual(*got, *want) {
			t.Errorf("build %d: the scene differs with the Cache (handles, strips or scales)", i)
		}
	}
}

// A member solved as a bar alone names no beam elements in its strips'
// legends: a hanging rod declared axial-only (demo data) shows its axial
// force "FE, 4 linear bar elements" and its bending moment, zero, as
// "FE, 4 elements", not as Hermite beam elements that were never solved.
func TestAxialOnlyLegendsNameTheBarAlone(t *testing.T) {
	m := &fem.Model{
		AxialOnly: true,
		Segments: []fem.Segment{{Start: 0, End: 4,
			Section:  fem.Section{Area: 1e-3, SecondMoment: 1e-6, FibreDistance: 0.02},
			Material: fem.Material{Elastic: 200e9, Density: 7850}}},
		Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 4, Axial: 10e3}},
		Mesh:       fem.MeshSettings{Elements: 4},
	}
	in := solved(t, m)
	if !in.Solution.AxialOnly {
		t.Fatal("the member was not solved as a bar alone")
	}
	s := Build(in, NewView(1200, 900))
	var legends []string
	for _, it := range s.Items {
		if it.Kind == Text && strings.HasPrefix(it.Text, "FE, ") {
			legends = append(legends, it.Text)
		}
	}
	if !slices.Contains(legends, "FE, 4 linear bar elements") || !slices.Contains(legends, "FE, 4 elements") {
		t.Errorf("legends %q, want the axial force's %q and the bending moment's %q", legends, "FE, 4 linear bar elements", "FE, 4 elements")
	}
	for _, l := range legends {
		if strings.Contains(l, "Hermite") {
			t.Errorf("legend %q names beam elements on a member solved as a bar alone", l)
		}
	}
}
