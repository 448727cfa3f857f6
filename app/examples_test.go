package app

import (
	"path/filepath"
	"testing"

	"stave/canvas"
)

// Every example opens on a diagram that shows something: the bars under
// axial load (a stepped bar, a hanging rod, a restrained bar heated)
// opened on the bending moment alone, "zero along the whole member", with
// the axial force they are about switched off.
func TestExamplesOpenOnADiagramThatShowsSomething(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "testdata", "*.json"))
	if err != nil {
		t.Fatal(err)
	}
	moving, _ := filepath.Glob(filepath.Join("..", "testdata", "moving", "*.json"))
	files = append(files, moving...)
	if len(files) < 10 {
		t.Fatalf("found %d examples in testdata, want the dozen it holds", len(files))
	}
	for _, f := range files {
		name, _ := filepath.Rel(filepath.Join("..", "testdata"), f)
		w, q := openTestdata(t, name, laptop)
		finished(t, w, q)
		w.draw.Refresh()
		s := w.draw.scene
		zero := 0
		for _, it := range s.Items {
			if it.Kind == canvas.Text && it.Text == "zero along the whole member" {
				zero++
			}
		}
		if len(s.Strips) > 0 && zero == len(s.Strips) {
			t.Errorf("%s opens on %d diagram(s), each zero along the whole member", name, zero)
		}
	}
}
