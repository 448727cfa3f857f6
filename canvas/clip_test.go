package canvas

import (
	"bytes"
	"image/color"
	"reflect"
	"testing"
)

// Lines and areas that leave the box are cut at its sides; what lies
// inside is kept, and what lies wholly outside is left out.
func TestClipItems(t *testing.T) {
	lo, hi := Point{0, 0}, Point{100, 100}
	tests := []struct {
		name string
		in   Item
		want []Item
	}{
		{"inside, kept", Item{Kind: Polyline, Points: []Point{{10, 10}, {90, 90}}},
			[]Item{{Kind: Polyline, Points: []Point{{10, 10}, {90, 90}}}}},
		{"line leaving through the top", Item{Kind: Polyline, Points: []Point{{50, 50}, {50, -1e9}}},
			[]Item{{Kind: Polyline, Points: []Point{{50, 50}, {50, 0}}}}},
		{"line out and back in, two runs", Item{Kind: Polyline, Points: []Point{{10, 50}, {10, 1e9}, {90, 1e9}, {90, 50}}},
			[]Item{{Kind: Polyline, Points: []Point{{10, 50}, {10, 100}}}, {Kind: Polyline, Points: []Point{{90, 100}, {90, 50}}}}},
		{"line wholly outside", Item{Kind: Polyline, Points: []Point{{-5, -5}, {-5, 200}}}, nil},
		{"triangle across the bottom", Item{Kind: Polygon, Points: []Point{{20, 50}, {80, 50}, {50, 1e9}}},
			[]Item{{Kind: Polygon, Points: []Point{{20, 100}, {20, 50}, {80, 50}, {80, 100}}}}},
		{"circle far outside", Item{Kind: Circle, Center: Point{50, -1e9}, Radius: 3}, nil},
		{"text far outside", Item{Kind: Text, At: Point{-1e9, 50}, Text: "x"}, nil},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got := clipItems([]Item{tc.in}, lo, hi)
			if len(got) != len(tc.want) {
				t.Fatalf("got %d items %v, want %d %v", len(got), got, len(tc.want), tc.want)
			}
			for i := range got {
				for j, p := range got[i].Points {
					w := tc.want[i].Points[j]
					if d := max(abs32(p.X-w.X), abs32(p.Y-w.Y)); d > 1e-3 {
						t.Errorf("item %d point %d is %v, want %v", i, j, p, w)
					}
				}
				got[i].Points, tc.want[i].Points = nil, nil
				if !reflect.DeepEqual(got[i], tc.want[i]) {
					t.Errorf("item %d is %+v, want %+v", i, got[i], tc.want[i])
				}
			}
		})
	}
}

func abs32(v float32) float32 { return max(v, -v) }

// A PNG whose deflection runs 10⁹ points off the picture (a magnification
// of 10¹⁰) is drawn, and looks as if the line stopped at the box; the
// rasterizer never finished on it before.
func TestPNGOfFarLines(t *testing.T) {
	blue := color.NRGBA{0x1f, 0x4e, 0x9a, 0xff}
	scene := func(far float32) *Scene {
		return &Scene{Width: 100, Height: 60, Items: []Item{
			{Kind: Polyline, Points: []Point{{10, 10}, {10, far}}, Stroke: blue, StrokeWidth: 1},
			{Kind: Polygon, Points: []Point{{20, 10}, {80, 10}, {80, far}, {20, far}}, Fill: blue},
		}}
	}
	var got, want bytes.Buffer
	if err := writeScene(&got, scene(-1e9), "png", 1); err != nil {
		t.Fatal(err)
	}
	if err := writeScene(&want, scene(-clipMargin), "png", 1); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got.Bytes(), want.Bytes()) {
		t.Error("the PNG of lines running 1e9 off the picture differs from that of the same lines cut at the box")
	}
}
