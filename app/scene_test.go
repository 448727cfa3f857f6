package app

import (
	"testing"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
)

// drawScene makes a background, one raster of every shape and one text per
// label, each label no wider on screen than the scene laid it out: a long
// bold warning once ran 37 px past its box.
func TestDrawScene(t *testing.T) {
	test.NewTempApp(t)
	p := demoProject(t)
	in := canvas.Input{Model: &p.Model, Overlays: p.View.Overlays, Dimensions: true,
		Problem: "free motion: the member can rotate about the support at x = 0.0 m: add a second support or fix one"}
	v := canvas.NewView(900, 800)
	v.Fit(&p.Model)
	s := canvas.Build(in, v)
	objs := drawScene(s)
	texts := 0
	for _, it := range s.Items {
		if it.Kind == canvas.Text {
			texts++
		}
	}
	if len(objs) != texts+2 {
		t.Errorf("drawScene made %d objects for %d labels, want a background, a raster and one per label", len(objs), texts)
	}
	r, ok := objs[1].(*fynecanvas.Raster)
	if !ok {
		t.Fatalf("second object is %T, want the raster of shapes", objs[1])
	}
	if r.Size() != fyne.NewSize(s.Width, s.Height) {
		t.Errorf("raster is %v, want the scene size", r.Size())
	}
	long := false
	for i, o := range objs[2:] {
		txt := o.(*fynecanvas.Text)
		var it canvas.Item
		for _, item := range s.Items {
			if item.Kind == canvas.Text && item.Text == txt.Text {
				it = item
				break
			}
		}
		long = long || it.Text == in.Problem
		if got := fyne.MeasureText(txt.Text, txt.TextSize, txt.TextStyle).Width; got > it.Width+0.5 {
			t.Errorf("label %d %q is %.1f px wide on screen, laid out for %.1f", i, it.Text, got, it.Width)
		}
	}
	if !long {
		t.Error("the problem line is not among the labels")
	}
}
