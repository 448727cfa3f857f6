package canvas

import (
	"fmt"
	"testing"

	"stave/fem"
	"stave/fem/bench"
	"stave/fem/units"
)

// forceShafts counts the shafts of point force arrows drawn within a pixel
// of x: vertical lines 2 px wide, arrowLength less the head long.
func forceShafts(s *Scene, x float32) int {
	n := 0
	for _, it := range s.Items {
		if it.Kind == Polyline && it.StrokeWidth == 2 && len(it.Points) == 2 &&
			abs(float64(it.Points[0].X-x)) < 1 && it.Points[0].X == it.Points[1].X &&
			abs(float64(it.Points[1].Y-it.Points[0].Y)) == arrowLength-10 {
			n++
		}
	}
	return n
}

// Transverse forces in one pixel column that point the same way share one
// arrow and one label, the count times the force or the count and the sum;
// each keeps its handle. The selected one, or one pointing the other way,
// draws its own. The loads are demo data.
func TestForcesInOnePixelColumnShareAnArrow(t *testing.T) {
	const x = 2.0 // m, between the supports of the demo model
	tests := []struct {
		name     string
		forces   []float64 // N, at x, a tenth of a millimetre apart
		selected int       // index among forces, -1 for none
		arrows   int
		labels   []string
	}{
		{"one force", []float64{-1e3}, -1, 1, []string{"1.000 kN"}},
		{"three alike", []float64{-1e3, -1e3, -1e3}, -1, 1, []string{"3 × 1.000 kN"}},
		{"two unlike", []float64{-1e3, -2e3}, -1, 1, []string{"2 loads, 3.000 kN in all"}},
		{"one of three selected", []float64{-1e3, -1e3, -1e3}, 1, 2, []string{"2 × 1.000 kN", "1.000 kN"}},
		{"down and up", []float64{-1e3, 2e3}, -1, 2, []string{"1.000 kN", "2.000 kN"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := demoModel(20)
			m.PointLoads = nil
			for k, f := range tc.forces {
				m.PointLoads = append(m.PointLoads, fem.PointLoad{X: x + 1e-4*float64(k), Transverse: f})
			}
			in := Input{Model: m, Units: units.SI}
			if tc.selected >= 0 {
				in.Selected = Ref{Kind: PointLoad, Index: tc.selected}
			}
			v := NewView(1000, 800)
			v.Fit(m)
			s := Build(in, v)
			px := v.ToScreenX(x)
			if got := forceShafts(s, px); got != tc.arrows {
				t.Errorf("%d arrows at %g m, want %d", got, x, tc.arrows)
			}
			for _, want := range tc.labels {
				if _, ok := texts(s)[want]; !ok {
					t.Errorf("no label %q; the texts are %v", want, texts(s))
				}
			}
			handles := map[int]bool{}
			for _, h := range s.Handles {
				if h.Ref.Kind == PointLoad {
					handles[h.Ref.Index] = true
				}
			}
			if len(handles) != len(tc.forces) {
				t.Errorf("%d of the %d forces have a handle", len(handles), len(tc.forces))
			}
			if got := s.HitTest(px, s.MemberY-25, 3); got.Kind != PointLoad {
				t.Errorf("the shared arrow's shaft hits %v, not a point load", got.Kind)
			}
		})
	}
}

// A member under many more forces than the view has pixel columns draws at
// most two arrows a column, and no more labels than the sketch band holds
// without overlap; none of them overlaps another. Each force keeps its
// handle. The loads are demo data (bench.KeyPointModel).
func TestDenseForcesAreBoundedByPixels(t *testing.T) {
	const width, height = 600, 700
	for _, loads := range []int{1_000, 20_000} {
		t.Run(fmt.Sprint(loads, " forces"), func(t *testing.T) {
			m := bench.KeyPointModel(100, loads)
			v := NewView(width, height)
			v.Fit(m)
			s := Build(Input{Model: m, Units: units.SI, Dimensions: true}, v)
			bare := *m
			bare.PointLoads = m.PointLoads[:len(m.PointLoads)-loads]
			without := Build(Input{Model: &bare, Units: units.SI, Dimensions: true}, v)

			var labels []Item
			for _, it := range s.Items {
				if it.Kind == Text {
					labels = append(labels, it)
				}
			}
			for i, a := range labels {
				for _, o := range labels[i+1:] {
					if textBox(a).overlaps(textBox(o)) {
						t.Fatalf("%q (%v) overlaps %q (%v)", a.Text, textBox(a), o.Text, textBox(o))
					}
				}
			}
			// An arrow is a shaft and a head, two a column in the view and
			// the 20 px beside it; a label is a text, its backing and its
			// leader, no smaller than a digit and one line, side by side in
			// the sketch band.
			columns := width + 2*20 + 1
			most := int(width * s.SketchBottom / (textWidth("0", smallSize, false) * TextHeight(smallSize)))
			bound := 2*2*columns + 3*most
			if added := len(s.Items) - len(without.Items); added > bound {
				t.Errorf("the forces add %d items to the scene, more than the %d that %d × %.0f px allow", added, bound, width, s.SketchBottom)
			}
			handles := 0
			for _, h := range s.Handles {
				if h.Ref.Kind == PointLoad {
					handles++
				}
			}
			if handles != len(m.PointLoads) {
				t.Errorf("%d handles for %d point loads", handles, len(m.PointLoads))
			}
		})
	}
}

// Where forces stand closer than their labels are wide, their labels wait
// for the reactions' and the marked checks': each of those is placed. The
// loads and the marks are demo data (bench.KeyPointModel).
func TestCrowdedForcesLeaveRoomForResults(t *testing.T) {
	m := bench.KeyPointModel(100, 1_000)
	s, err := fem.Solve(m)
	if err != nil {
		t.Fatal(err)
	}
	marks := []Mark{{X: 7.5, Severe: true, Name: "FAIL: Deflection, span 5.000 m to 10.00 m"},
		{X: 12.5, Name: "caution: Deflection, cantilever 10.00 m to 15.00 m"}}
	in := Input{Model: m, Solution: s, Units: units.SI, Dimensions: true, Marks: marks}
	v := NewView(746, 442) // the window's drawing at 1280 × 720
	v.Fit(m)
	b := build(in, v)
	got := b.scene()
	var want []string
	for _, mk := range marks {
		want = append(want, mk.Name)
	}
	for _, r := range s.Reactions {
		for d, name := range [3]string{"Rx ", "Ry ", "Mr "} {
			q := [3]units.Kind{units.Force, units.Force, units.Moment}[d]
			if r.Force[d] != 0 && b.supportHolds(r.Support, fem.Dof(d)) {
				want = append(want, name+b.format(q, r.Force[d]))
			}
		}
	}
	if len(want) < 5 {
		t.Fatalf("only %d labels to look for: the test needs the reactions", len(want))
	}
	for _, w := range want {
		if _, ok := texts(got)[w]; !ok {
			t.Errorf("no label %q among the forces' labels", w)
		}
	}
}
