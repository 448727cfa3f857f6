package app

import (
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/fem"
	"stave/fem/units"
)

// Exact conversion factors, NIST SP 811 (2008), Appendix B.8.
const (
	footInMetres = 0.3048
	kipInNewtons = 4448.2216152605 // 1000 lbf, 1 lbf = 4.4482216152605 N
)

// fill types values into the form's fields by key.
func fill(t *testing.T, f *addForm, values map[string]string) {
	t.Helper()
	for key, v := range values {
		e, ok := f.entries[key]
		if !ok {
			t.Fatalf("the %s form has no field %q (has %v)", f.current.name, key, f.fields)
		}
		e.SetText(v)
	}
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-9*math.Max(1, math.Abs(b)) }

// Every kind the Add form offers lands in the model where typed, in the
// units typed, as one undoable edit, and is selected.
func TestAddFormPlacesEachKind(t *testing.T) {
	for _, c := range []struct {
		name, kind, choice string
		us                 bool // the window shows US units
		values             map[string]string
		check              func(before, after fem.Model) string
	}{
		{"pinned support with a settlement", "Support", "pinned", false,
			map[string]string{"x": "250 cm", "stransverse": "-5 mm"},
			func(b, a fem.Model) string {
				s := a.Supports[len(a.Supports)-1]
				if len(a.Supports) != len(b.Supports)+1 || s.Kind != fem.Pinned || !near(s.X, 2.5) || !near(s.Settlement[1], -0.005) {
					return fmt.Sprintf("support %+v", s)
				}
				return ""
			}},
		{"spring support in US units", "Support", "spring", true,
			map[string]string{"x": "3", "kaxial": "0", "ktransverse": "100", "krotation": "0"},
			func(b, a fem.Model) string {
				s := a.Supports[len(a.Supports)-1]
				// 100 kip/in = 100 × 4448.2216152605 N / 0.0254 m.
				if s.Kind != fem.Spring || !near(s.X, 3*footInMetres) || !near(s.Stiffness[1], 100*kipInNewtons/0.0254) {
					return fmt.Sprintf("support %+v", s)
				}
				return ""
			}},
		{"point load", "Point load", "", false,
			map[string]string{"x": "1.2", "axial": "3 kN", "transverse": "-12", "moment": "0"},
			func(b, a fem.Model) string {
				p := a.PointLoads[len(a.PointLoads)-1]
				if len(a.PointLoads) != len(b.PointLoads)+1 || p != (fem.PointLoad{X: 1.2, Axial: 3000, Transverse: -12000}) {
					return fmt.Sprintf("point load %+v", p)
				}
				return ""
			}},
		{"point load in US units", "Point load", "", true,
			map[string]string{"x": "10 ft", "transverse": "-2", "axial": "0", "moment": "0"},
			func(b, a fem.Model) string {
				p := a.PointLoads[len(a.PointLoads)-1]
				if !near(p.X, 10*footInMetres) || !near(p.Transverse, -2*kipInNewtons) {
					return fmt.Sprintf("point load %+v", p)
				}
				return ""
			}},
		{"moment", "Moment", "", false,
			map[string]string{"x": "4 m", "moment": "7.5 kN·m"},
			func(b, a fem.Model) string {
				p := a.PointLoads[len(a.PointLoads)-1]
				if p != (fem.PointLoad{X: 4, Moment: 7500}) {
					return fmt.Sprintf("moment %+v", p)
				}
				return ""
			}},
		{"axial line load", "Line load", axialText, false,
			map[string]string{"start": "1", "end": "4.5", "qstart": "2", "qend": "500 N/m"},
			func(b, a fem.Model) string {
				d := a.DistributedLoad[len(a.DistributedLoad)-1]
				want := fem.DistributedLoad{Direction: fem.Axial, Points: []fem.LoadPoint{{X: 1, Intensity: 2000}, {X: 4.5, Intensity: 500}}}
				if len(a.DistributedLoad) != len(b.DistributedLoad)+1 || !reflect.DeepEqual(d, want) {
					return fmt.Sprintf("line load %+v", d)
				}
				return ""
			}},
		{"segment break", "Segment break", "", false,
			map[string]string{"x": "1500 mm"},
			func(b, a fem.Model) string {
				if len(a.Segments) != len(b.Segments)+1 || a.Segments[0].End != 1.5 || a.Segments[1].Start != 1.5 {
					return fmt.Sprintf("segments %+v", a.Segments)
				}
				return ""
			}},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		if c.us {
			w.setUnits(units.USCustomary)
		}
		before := w.Model()
		undo := len(w.hist.done)
		f := newAddForm(w)
		f.kind.SetSelected(c.kind)
		if c.choice != "" {
			f.choice.SetSelected(c.choice)
		}
		fill(t, f, c.values)
		if !f.submit() {
			t.Errorf("%s: not added: %s", c.name, f.message.Text)
			continue
		}
		after := w.Model()
		if problem := c.check(before, after); problem != "" {
			t.Errorf("%s: the model has %s", c.name, problem)
		}
		if got := len(w.hist.done); got != undo+1 {
			t.Errorf("%s: adding made %d undo steps, want 1", c.name, got-undo)
		}
		if w.selected.Kind == canvas.None {
			t.Errorf("%s: nothing is selected after adding", c.name)
		}
		w.undo()
		if !reflect.DeepEqual(w.Model(), before) {
			t.Errorf("%s: one undo did not remove what was added", c.name)
		}
	}
}

// Bad input adds nothing and says what is wrong, under the field's name.
func TestAddFormRefusesBadInput(t *testing.T) {
	for _, c := range []struct {
		name, kind string
		values     map[string]string
		want       []string // in the message
	}{
		{"a word for a position", "Support", map[string]string{"x": "twelve"}, []string{"Position x:", "twelve"}},
		{"no position", "Point load", map[string]string{"x": "", "transverse": "-1"}, []string{"Position x: type a value"}},
		{"a force for a position", "Point load", map[string]string{"x": "3 kN", "transverse": "-1"}, []string{"Position x:", "force"}},
		{"beyond the member", "Support", map[string]string{"x": "9 m"}, []string{"Position x:"}},
		{"two supports at one point", "Support", map[string]string{"x": "0"}, []string{"Position x:", "both at x = 0"}},
		{"no load at all", "Point load", map[string]string{"x": "1"}, []string{"Transverse force (+ up):", "all zero"}},
		{"a line load ending before it starts", "Line load", map[string]string{"start": "4", "end": "2", "qstart": "-1", "qend": "-1"}, []string{"End x:"}},
		{"a break at the member end", "Segment break", map[string]string{"x": "5.5"}, []string{"Position x:"}},
		{"a hinge at the member end", "Hinge", map[string]string{"x": "5.5"}, []string{"Position x:", "end of the member"}},
		{"a negative hinge stiffness", "Hinge", map[string]string{"x": "2", "khinge": "-3"}, []string{"Stiffness across it, 0 = pure hinge:", "negative"}},
		{"a foundation ending before it starts", "Foundation", map[string]string{"start": "4", "end": "2", "modulus": "1000"}, []string{"End x:"}},
		{"a foundation with no stiffness", "Foundation", map[string]string{"start": "1", "end": "2", "modulus": "0", "axialmodulus": "0"}, []string{"Modulus across the member:", "no stiffness"}},
		{"control: a good support", "Support", map[string]string{"x": "2"}, nil},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		before, undo := w.Model(), len(w.hist.done)
		f := newAddForm(w)
		f.kind.SetSelected(c.kind)
		fill(t, f, c.values)
		added := f.submit()
		if c.want == nil {
			// The control row: the same form with good values adds.
			if !added {
				t.Errorf("%s: a good support was refused: %s", c.name, f.message.Text)
			}
			continue
		}
		if added || !reflect.DeepEqual(w.Model(), before) || len(w.hist.done) != undo {
			t.Errorf("%s: bad input changed the model", c.name)
		}
		for _, want := range c.want {
			if !strings.Contains(f.message.Text, want) {
				t.Errorf("%s: message %q does not say %q", c.name, f.message.Text, want)
			}
		}
	}
}

// The form in its dialog: the Add button adds and closes it; Cancel closes
// it and adds nothing.
func TestAddDialog(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	n := len(w.Model().Supports)
	w.showAddForm()
	selects, entries, buttons, _ := dialogWidgets(t, w)
	if len(selects) < 2 || len(entries) < 1 {
		t.Fatalf("the Add dialog shows %d choices and %d entries", len(selects), len(entries))
	}
	entries[0].SetText("2 m") // the support's position comes first
	test.Tap(buttonNamed(t, buttons, "Add"))
	if got := len(w.Model().Supports); got != n+1 || w.Model().Supports[n].X != 2 {
		t.Fatalf("Add placed %d supports (want %d), the new one at %v", got, n+1, w.Model().Supports)
	}
	if w.win.Canvas().Overlays().Top() != nil {
		t.Error("the Add dialog stayed open after adding")
	}
	w.showAddForm()
	_, _, buttons, _ = dialogWidgets(t, w)
	test.Tap(buttonNamed(t, buttons, "Cancel"))
	if w.win.Canvas().Overlays().Top() != nil || len(w.Model().Supports) != n+1 {
		t.Error("Cancel left the dialog open or changed the supports")
	}
}

// A value typed under Properties moves the item on the drawing; a new
// member length fits the view to the member.
func TestTypedValuesMoveTheDrawing(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	d := w.draw
	ref := canvas.Ref{Kind: canvas.Support, Index: 1}
	w.selectItem(ref)
	was := handle(t, d, ref)
	w.applyFields("Support 2", ref, w.ui.panel.fields, entriesWith(w, 0, "2 m"), w.ui.panel.shown)
	now := handle(t, d, ref)
	if want := d.view.ToScreenX(2); math.Abs(float64(now.X-want)) > 1 || now.X == was.X {
		t.Errorf("the support's handle is at x = %g px (was %g), want %g px for 2 m", now.X, was.X, want)
	}

	w.selectItem(canvas.Ref{})
	oldView := d.view
	w.applyFields("Member", canvas.Ref{}, w.ui.panel.fields, entriesWith(w, 0, "22 m"), w.ui.panel.shown)
	if got := w.project.Model.Length(); got != 22 {
		t.Fatalf("the member is %g m long, want 22 m", got)
	}
	if end := oldView.ToScreenX(22); end <= oldView.Width {
		t.Fatalf("the test needs a length that runs off the old view: 22 m ends at %g of %g px", end, oldView.Width)
	}
	if end := d.view.ToScreenX(22); end > d.view.Width || d.view.Scale >= oldView.Scale || d.view != d.fittedView() {
		t.Errorf("after typing 22 m the member ends at %g px of %g: the view was not fitted", end, d.view.Width)
	}
	w.undo()
	if d.view != d.fittedView() || d.view.Scale != oldView.Scale {
		t.Errorf("undoing the length did not fit the view back to the 5.5 m member")
	}
}

// entriesWith is the properties panel's entries with field k set to text.
func entriesWith(w *Window, k int, text string) []*escEntry {
	es := w.ui.panel.entries
	es[k].SetText(text)
	return es
}

// A number typed into a field reached by Tab replaces what the field
// held: 5 typed into an axial settlement of "0" gave 50 mm, and -12 into
// a transverse force of "0" gave -120 kN.
func TestAddFormByTabTypesOverTheFields(t *testing.T) {
	for _, c := range []struct {
		name, kind string
		typed      []string // into the position and the fields after it, by Tab
		check      func(m fem.Model) string
	}{
		{"support", "Support", []string{"4.5", "5", "7"}, func(m fem.Model) string {
			s := m.Supports[len(m.Supports)-1]
			if want := [3]float64{0.005, 0.007, 0}; !near(s.X, 4.5) || !near(s.Settlement[0], want[0]) || !near(s.Settlement[1], want[1]) || s.Settlement[2] != 0 {
				return fmt.Sprintf("support at %g m with settlements %v m, want 4.5 m and %v m", s.X, s.Settlement, want)
			}
			return ""
		}},
		{"point load", "Point load", []string{"2", "3", "-12", "4"}, func(m fem.Model) string {
			p := m.PointLoads[len(m.PointLoads)-1]
			if !near(p.X, 2) || !near(p.Axial, 3e3) || !near(p.Transverse, -12e3) || !near(p.Moment, 4e3) {
				return fmt.Sprintf("point load %+v, want at 2 m with 3 kN, -12 kN and 4 kN·m", p)
			}
			return ""
		}},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		w.showAddForm()
		cv := w.win.Canvas()
		selects, _, _, _ := dialogWidgets(t, w)
		selects[0].SetSelected(c.kind)
		// Tab on from the choice of kind to the first field, the position.
		for range 5 {
			if _, ok := cv.Focused().(*escEntry); ok {
				break
			}
			cv.FocusNext()
		}
		for i, s := range c.typed {
			if i > 0 {
				cv.FocusNext()
			}
			f, ok := cv.Focused().(*escEntry)
			if !ok {
				t.Fatalf("%s: Tab reached %T, not a field", c.name, cv.Focused())
			}
			test.Type(f, s)
		}
		cv.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
		if problem := c.check(w.Model()); problem != "" {
			t.Errorf("%s typed by Tab: the model has %s", c.name, problem)
		}
	}
}
