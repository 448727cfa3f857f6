package canvas

import (
	"fmt"
	"strings"
	"testing"
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
			top, bottom := tx.At.Y, tx.At.Y+textHeight(tx.Size)
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

// The deflected shape passes through the segment names under the member; a
// background box over the curve, under the name, keeps the glyphs clear.
func TestSegmentNamesMaskTheDeflectedShape(t *testing.T) {
	m := demoModel(40)
	in := solved(t, m)
	in.Layers.Deformed = true
	v := NewView(1200, 900)
	v.Fit(m)
	s := Build(in, v)
	lastCurve := -1
	for i, it := range s.Items {
		if it.Kind == Polyline && it.Stroke == deformedColour {
			lastCurve = i
		}
	}
	if lastCurve < 0 {
		t.Fatal("no deflected shape drawn")
	}
	names := 0
	for i, it := range s.Items {
		if it.Kind != Text || !strings.HasPrefix(it.Text, "S") || !strings.HasSuffix(it.Text, " steel") {
			continue
		}
		names++
		masked := false
		for j := lastCurve + 1; j < i; j++ {
			p := s.Items[j]
			if p.Kind != Polygon || p.Fill != white || len(p.Points) != 4 {
				continue
			}
			x0, y0, x1, y1 := p.Points[0].X, p.Points[0].Y, p.Points[2].X, p.Points[2].Y
			if x0 <= it.At.X && x1 >= it.At.X+it.Width && y0 <= it.At.Y && y1 >= it.At.Y+textHeight(it.Size) {
				masked = true
			}
		}
		if !masked {
			t.Errorf("the segment name %q has no background box between the deflected shape and itself", it.Text)
		}
	}
	if names != 2 {
		t.Fatalf("%d segment names found, want the demo's two", names)
	}
}
