package app

import (
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/storage"
)

// twoSpans is a sketch beam of two 4 m spans on a pinned and two roller
// supports under 10 kN/m downward along all of it.
func twoSpans() *storage.Project {
	p := &storage.Project{View: storage.DefaultView(), Model: newMember(8)}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}, {X: 8, Kind: fem.Roller}}
	p.Model.DistributedLoad = []fem.DistributedLoad{{Direction: fem.Transverse,
		Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 8, Intensity: -10e3}}}}
	return p
}

// add fills the Add form for kind with values and submits it.
func add(t *testing.T, w *Window, kind string, values map[string]string) {
	t.Helper()
	f := newAddForm(w)
	f.kind.SetSelected(kind)
	fill(t, f, values)
	if !f.submit() {
		t.Fatalf("adding a %s was refused: %s", kind, f.message.Text)
	}
}

// reactionsOf are the transverse support reactions of s, N.
func reactionsOf(s *fem.Solution) []float64 {
	out := make([]float64, len(s.Reactions))
	for i, r := range s.Reactions {
		out[i] = r.Force[fem.Transverse]
	}
	return out
}

// A pure hinge added through the Add form makes the continuous two-span
// beam a determinate one: the bending moment at the hinge vanishes and
// the reactions follow from statics alone.
func TestAddHingeReleasesTheMoment(t *testing.T) {
	w, q := newTestWindow(t, twoSpans())
	before := solved(t, w, q)
	// Continuous beam of two equal spans L = 4 m under q = 10 kN/m:
	// reactions 3qL/8, 10qL/8, 3qL/8 = 15, 50, 15 kN, and at 2 m from the
	// right end M = 15·2 − 10·2²/2 = +10 kN·m. Source: two-span continuous
	// beam table, AISC Manual beam diagrams, from memory; then statics.
	// Between nodes a Hermite element's moment under a uniform load is off
	// by up to q·h²/12 (FE theory for cubic beam elements, from memory).
	tol := 10e3 * math.Pow(longestElement(before), 2) / 12
	if m := before.At(6, fem.Left).BendingMoment; math.Abs(m-10e3) > tol {
		t.Fatalf("control: the continuous beam has M(6 m) = %g N·m, want 10 kN·m", m)
	}
	add(t, w, "Hinge", map[string]string{"x": "6 m", "khinge": "0"})
	if got := w.Model().Hinges; len(got) != 1 || got[0] != (fem.Hinge{X: 6}) {
		t.Fatalf("the model has hinges %+v, want one pure hinge at 6 m", got)
	}
	if w.selected != (canvas.Ref{Kind: canvas.Hinge}) {
		t.Errorf("after adding, %v %d is selected, want the hinge", w.selected.Kind, w.selected.Index)
	}
	after := solved(t, w, q)
	// Statics: the part right of the hinge (2 m) hangs on the hinge and the
	// right roller, 10 kN each; the left part is then a beam on 0 and 4 m
	// with a 2 m overhang loaded by 10 kN at its tip: R(4) = (10·6·3 +
	// 10·6)/4 = 60 kN, R(0) = 10·6 + 10 − 60 = 10 kN. M at a pure hinge is 0.
	exact := w.result.Exact
	if exact == nil {
		t.Fatalf("no exact solution: %v", w.result.ExactErr)
	}
	for _, side := range []fem.Side{fem.Left, fem.Right} {
		if m := after.At(6, side).BendingMoment; math.Abs(m) > tol*(1+1e-9) {
			t.Errorf("the finite element moment at the hinge is %g N·m, want 0 within q·h²/12 = %g", m, tol)
		}
		if m := exact.At(6, side).BendingMoment; math.Abs(m) > 1e-9*80e3*8 {
			t.Errorf("the exact moment at the hinge is %g N·m, want 0", m)
		}
	}
	want := []float64{10e3, 60e3, 10e3}
	for i, r := range reactionsOf(after) {
		if math.Abs(r-want[i]) > 1e-6*80e3 {
			t.Errorf("reaction %d is %g N, want %g N (statics)", i+1, r, want[i])
		}
	}
}

// longestElement is the length of the longest element of s, m.
func longestElement(s *fem.Solution) float64 {
	h := 0.0
	for i := 1; i < len(s.Mesh.X); i++ {
		h = max(h, s.Mesh.X[i]-s.Mesh.X[i-1])
	}
	return h
}

// A foundation added through the Add form takes part of the load to the
// ground: the supports carry less than the load, and what the ground
// carries is the modulus times the deflection, integrated.
func TestAddFoundationCarriesPartOfTheLoad(t *testing.T) {
	p := twoSpans()
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 8, Kind: fem.Roller}}
	w, q := newTestWindow(t, p)
	add(t, w, "Foundation", map[string]string{"start": "2 m", "end": "6 m", "modulus": "2000", "axialmodulus": "0"})
	if got := w.Model().Foundations; len(got) != 1 || got[0] != (fem.Foundation{Start: 2, End: 6, Modulus: 2e6}) {
		t.Fatalf("the model has foundations %+v, want 2 to 6 m at 2000 kN/m²", got)
	}
	s := solved(t, w, q)
	const load = 80e3 // 10 kN/m over 8 m
	supports := 0.0
	for _, r := range reactionsOf(s) {
		supports += r
	}
	if len(s.Foundations) != 1 {
		t.Fatalf("the solution has %d foundation results", len(s.Foundations))
	}
	ground := s.Foundations[0].Force[fem.Transverse]
	if !(supports < 0.95*load) || !(ground > 0.05*load) {
		t.Errorf("supports carry %g N and the ground %g N of %g N: the foundation takes too little", supports, ground, load)
	}
	// Statics: supports and ground together carry the load.
	if math.Abs(supports+ground-load) > 1e-6*load {
		t.Errorf("supports %g N + ground %g N = %g N, want the load %g N", supports, ground, supports+ground, load)
	}
	// Winkler's bed pushes back −k·w per metre: the ground's share is
	// ∫ −k·w dx over the bed, here by Simpson's rule on 400 intervals of the
	// solved deflection (composite Simpson, any numerical analysis text).
	const k, n = 2e6, 400
	h := 4.0 / n
	sum := 0.0
	for i := 0; i <= n; i++ {
		c := 2.0
		switch {
		case i == 0 || i == n:
			c = 1
		case i%2 == 1:
			c = 4
		}
		sum += c * -k * s.At(2+float64(i)*h, fem.Right).Deflection
	}
	if integral := sum * h / 3; math.Abs(integral-ground) > 1e-3*ground {
		t.Errorf("the ground carries %g N, but ∫ k·w dx = %g N", ground, integral)
	}
}

// fieldEntry is the properties panel's entry for the field whose label
// starts with label.
func fieldEntry(t *testing.T, w *Window, label string) *escEntry {
	t.Helper()
	for k, f := range w.ui.panel.fields {
		if strings.HasPrefix(f.label, label) {
			return w.ui.panel.entries[k]
		}
	}
	var have []string
	for _, f := range w.ui.panel.fields {
		have = append(have, f.label)
	}
	t.Fatalf("the panel of %v has no field %q (has %q)", w.selected.Kind, label, have)
	return nil
}

// checkNamed is the panel's check box whose text starts with prefix.
func checkNamed(t *testing.T, w *Window, prefix string) *widget.Check {
	t.Helper()
	for _, o := range test.LaidOutObjects(w.ui.properties) {
		if c, ok := o.(*escCheck); ok && strings.HasPrefix(c.Text, prefix) {
			return &c.Check
		}
	}
	t.Fatalf("no check box %q in the properties panel", prefix)
	return nil
}

// A roller's rotation is free, so its panel offers a rotational
// stiffness; typing one makes a mixed support that takes an end moment.
func TestFreeMotionStiffnessMakesAMixedSupport(t *testing.T) {
	p := twoSpans()
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 8, Kind: fem.Roller}}
	w, q := newTestWindow(t, p)
	w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 1})
	seg := p.Model.Segments[0]
	ei, l := seg.Material.Elastic*seg.Section.SecondMoment, 8.0
	k := 3 * ei / l
	e := fieldEntry(t, w, "Rotational stiffness")
	text := strconv.FormatFloat(k/1e3, 'g', -1, 64) + " kN·m/rad"
	e.SetText(text)
	e.OnSubmitted(text)
	sp := w.Model().Supports[1]
	if sp.Kind != fem.Roller || math.Abs(sp.Stiffness[fem.Rotation]-k) > 1e-9*k || !sp.Elastic(fem.Rotation) {
		t.Fatalf("after typing %q the support is %+v, want a roller with a rotational spring of %g N·m/rad", text, sp, k)
	}
	s := solved(t, w, q)
	// A beam pinned at one end and held at the other by a rotational spring
	// k, under q: the end slope of the simple beam, qL³/(24EI), less that
	// of the end moment, M·L/(3EI), equals M/k, so M = (qL²/8)/(1 + 3EI/(kL)),
	// qL²/16 = 40 kN·m for k = 3EI/L. Source: end slopes from the beam
	// deflection tables of Gere & Goodno, from memory; then compatibility.
	if m := math.Abs(s.Reactions[1].Force[fem.Rotation]); math.Abs(m-40e3) > 1e-6*40e3 {
		t.Errorf("the spring holds %g N·m at the roller, want qL²/16 = 40 kN·m", m)
	}
	for _, label := range []string{"Settlement transverse", "Axial stiffness", "Rotational stiffness"} {
		fieldEntry(t, w, label) // a roller holds deflection rigidly, the rest elastically or not
	}
}

// Segment ΔT, depth and the shear settings round-trip through the
// properties pane, and the shear check box switches shear deformation.
func TestSegmentThermalAndShearRoundTrip(t *testing.T) {
	w, q := newTestWindow(t, twoSpans())
	w.selectItem(canvas.Ref{Kind: canvas.Segment})
	typed := map[string]string{"Temperature ΔT": "25", "Depth h": "300", "Shear coefficient": "0.8333", "Poisson's ratio": "0.3"}
	for label, text := range typed {
		fieldEntry(t, w, label).SetText(text)
	}
	fieldEntry(t, w, "Depth h").OnSubmitted("300")
	sg := w.Model().Segments[0]
	if sg.TemperatureDifference != 25 || math.Abs(sg.Section.Depth-0.3) > 1e-15 || sg.Section.ShearCoefficient != 0.8333 || sg.Material.Poisson != 0.3 {
		t.Fatalf("after Apply the segment has ΔT %g K, h %g m, κ %g, ν %g", sg.TemperatureDifference, sg.Section.Depth, sg.Section.ShearCoefficient, sg.Material.Poisson)
	}
	for label, text := range typed {
		if got := fieldEntry(t, w, label).Text; !strings.HasPrefix(got, text) && !strings.HasPrefix(got, strings.TrimSuffix(text, "0")) {
			t.Errorf("%s shows %q after Apply, typed %q", label, got, text)
		}
	}
	stiff := solved(t, w, q).At(2, fem.Right).Deflection
	box := checkNamed(t, w, "Shear deformation")
	test.Tap(box)
	if !w.Model().Segments[0].ShearDeformation {
		t.Fatalf("ticking the box left shear deformation off: %s", w.status.Text)
	}
	if !checkNamed(t, w, "Shear deformation").Checked {
		t.Errorf("the rebuilt panel shows shear deformation off")
	}
	// Shear adds to the deflection of a beam (Timoshenko beam theory,
	// e.g. Roark's, from memory): the beam sags further at 2 m.
	if soft := solved(t, w, q).At(2, fem.Right).Deflection; !(soft < stiff) {
		t.Errorf("with shear deformation the deflection at 2 m is %g m, without %g m: want more sag", soft, stiff)
	}
	w.undo()
	if w.Model().Segments[0].ShearDeformation || checkNamed(t, w, "Shear deformation").Checked {
		t.Errorf("undo left shear deformation on (model) or ticked (panel)")
	}
	// A ratio takes no unit; a word is refused and changes nothing.
	e := fieldEntry(t, w, "Poisson's ratio")
	e.SetText("0.3 MPa")
	e.OnSubmitted("0.3 MPa")
	if got := w.Model().Segments[0].Material.Poisson; got != 0.3 {
		t.Errorf("typing a ratio with a unit set ν to %g", got)
	}
}

// The member's axial-only toggle declares it a tie.
func TestAxialOnlyToggle(t *testing.T) {
	p := &storage.Project{View: storage.DefaultView(), Model: newMember(3)}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Fixed}}
	p.Model.PointLoads = []fem.PointLoad{{X: 3, Axial: 5e3}}
	w, _ := newTestWindow(t, p)
	w.selectItem(canvas.Ref{Kind: canvas.Member})
	test.Tap(checkNamed(t, w, "Axial only"))
	if !w.Model().AxialOnly {
		t.Fatalf("ticking Axial only left the member bending: %s", w.status.Text)
	}
	test.Tap(checkNamed(t, w, "Axial only"))
	if w.Model().AxialOnly {
		t.Errorf("unticking Axial only left it declared a tie")
	}
}

// Hinges and foundations are picked, dragged and deleted on the drawing
// like supports; a foundation keeps its length as it moves.
func TestDragAndDeleteHingeAndFoundation(t *testing.T) {
	p := twoSpans()
	p.Model.Hinges = []fem.Hinge{{X: 6}}
	p.Model.Foundations = []fem.Foundation{{Start: 1, End: 3, Modulus: 1e6}}
	w, _ := newTestWindow(t, p)
	d := w.draw
	hinge, bed := canvas.Ref{Kind: canvas.Hinge}, canvas.Ref{Kind: canvas.Foundation}
	from := handle(t, d, hinge)
	drag(d, from, fyne.NewPos(d.view.ToScreenX(7), from.Y), 6)
	if x := w.Model().Hinges[0].X; math.Abs(x-7) > 0.02 {
		t.Errorf("the dragged hinge is at %g m, want about 7 m", x)
	}
	from = handle(t, d, bed)
	from.X = d.view.ToScreenX(2)
	drag(d, from, fyne.NewPos(d.view.ToScreenX(3.5), from.Y), 6)
	f := w.Model().Foundations[0]
	if math.Abs(f.Start-2.5) > 0.02 || math.Abs(f.End-f.Start-2) > 1e-9 {
		t.Errorf("the dragged foundation runs %g to %g m, want about 2.5 to 4.5 m, 2 m long", f.Start, f.End)
	}
	if w.selected != bed {
		t.Errorf("dragging the foundation selected %v", w.selected.Kind)
	}
	w.deleteSelected()
	if len(w.Model().Foundations) != 0 || len(w.Model().Hinges) != 1 {
		t.Errorf("deleting the selected foundation left %d foundations, %d hinges", len(w.Model().Foundations), len(w.Model().Hinges))
	}
	w.selectItem(hinge)
	w.deleteSelected()
	if len(w.Model().Hinges) != 0 {
		t.Errorf("deleting the selected hinge left %d", len(w.Model().Hinges))
	}
	// The member end still drags the length (the load's vertex there,
	// drawn over the end, taken off first).
	w.apply("unload", func(m *fem.Model) error { m.DistributedLoad = nil; return nil })
	end := handle(t, d, canvas.Ref{Kind: canvas.MemberEnd})
	drag(d, end, fyne.NewPos(d.view.ToScreenX(9), end.Y), 6)
	if l := w.project.Model.Length(); math.Abs(l-9) > 0.02 {
		t.Errorf("dragging the member end made it %g m long, want about 9 m (%s; end at %v, view width %g)", l, w.status.Text, end, d.view.Width)
	}
}

// An edit refused for a problem of a hinge or foundation says so in the
// message line, and a click on the line selects the item.
func TestRefusedEditLocatesTheItem(t *testing.T) {
	p := twoSpans()
	p.Model.Hinges = []fem.Hinge{{X: 6}}
	p.Model.Foundations = []fem.Foundation{{Start: 1, End: 3, Modulus: 1e6}}
	w, _ := newTestWindow(t, p)
	for _, c := range []struct {
		name   string
		change func(m *fem.Model)
		want   canvas.Ref
		says   string
	}{
		{"a hinge at the member end", func(m *fem.Model) { m.Hinges[0].X = 8 }, canvas.Ref{Kind: canvas.Hinge}, "hinge 1"},
		{"a foundation ending before it starts", func(m *fem.Model) { m.Foundations[0].End = 0.5 }, canvas.Ref{Kind: canvas.Foundation}, "foundation 1"},
	} {
		w.selectItem(canvas.Ref{})
		if w.apply(c.name, func(m *fem.Model) error { c.change(m); return nil }) == nil {
			t.Fatalf("%s was applied", c.name)
		}
		if got := w.status.Text; !strings.Contains(got, c.says) || !strings.HasPrefix(got, "Click here to select "+c.says) {
			t.Errorf("%s: the message line says %q", c.name, got)
		}
		test.Tap(w.status)
		if w.selected != c.want {
			t.Errorf("%s: a click on the message selected %v %d", c.name, w.selected.Kind, w.selected.Index)
		}
	}
	w.setStatus("something else")
	w.selectItem(canvas.Ref{})
	test.Tap(w.status)
	if w.selected.Kind != canvas.None {
		t.Errorf("a click on a message about nothing selected %v", w.selected.Kind)
	}
}

// Each item a problem can lie on maps to the part of the drawing that
// shows it; items the drawing does not show map to none.
func TestRefOfItems(t *testing.T) {
	for _, c := range []struct {
		name string
		it   fem.Item
		want canvas.Ref
	}{
		{"segment", fem.Item{Kind: fem.SegmentItem, Index: 1}, canvas.Ref{Kind: canvas.Segment, Index: 1}},
		{"support", fem.Item{Kind: fem.SupportItem, Index: 2}, canvas.Ref{Kind: canvas.Support, Index: 2}},
		{"hinge", fem.Item{Kind: fem.HingeItem, Index: 0}, canvas.Ref{Kind: canvas.Hinge}},
		{"foundation", fem.Item{Kind: fem.FoundationItem, Index: 3}, canvas.Ref{Kind: canvas.Foundation, Index: 3}},
		{"own point load", fem.Item{Kind: fem.PointLoadItem, Index: 1}, canvas.Ref{Kind: canvas.PointLoad, Index: 1}},
		{"own distributed load", fem.Item{Kind: fem.DistributedLoadItem}, canvas.Ref{Kind: canvas.DistributedLoad}},
		{"a load of another case", fem.Item{Kind: fem.PointLoadItem, Index: 1, Case: 2}, canvas.Ref{}},
		{"the model", fem.Item{Kind: fem.ModelItem, Index: -1}, canvas.Ref{}},
		{"the mesh", fem.Item{Kind: fem.MeshItem, Index: -1}, canvas.Ref{}},
		{"a combination", fem.Item{Kind: fem.CombinationItem, Index: 0}, canvas.Ref{}},
		{"a segment break being added", fem.Item{Kind: fem.SegmentItem, Index: -1}, canvas.Ref{}},
	} {
		if got := refOf(c.it); got != c.want {
			t.Errorf("%s: refOf gives %v %d, want %v %d", c.name, got.Kind, got.Index, c.want.Kind, c.want.Index)
		}
	}
}

// A support made of a kind that holds a motion rigidly drops its spring on
// that motion, and keeps those on the motions still free.
func TestSupportKindChangeKeepsFreeSprings(t *testing.T) {
	p := twoSpans()
	p.Model.Supports[2] = fem.Support{X: 8, Kind: fem.Spring, Stiffness: [3]float64{0, 1e6, 2e5}}
	w, _ := newTestWindow(t, p)
	w.selectItem(canvas.Ref{Kind: canvas.Support, Index: 2})
	var kind *widget.Select
	for _, o := range test.LaidOutObjects(w.ui.properties) {
		if s := selectIn(o); s != nil {
			kind = s
		}
	}
	if kind == nil {
		t.Fatal("no kind choice in the support's panel")
	}
	kind.SetSelected("roller")
	got := w.Model().Supports[2]
	if want := (fem.Support{X: 8, Kind: fem.Roller, Stiffness: [3]float64{0, 0, 2e5}}); got != want {
		t.Errorf("after choosing roller the support is %+v, want %+v (%s)", got, want, w.status.Text)
	}
}

// Shortening the member takes off the hinges beyond (or at) the new end and
// the foundations that start beyond it, and cuts the others at it.
func TestShorteningCutsHingesAndFoundations(t *testing.T) {
	m := newMember(8)
	m.Hinges = []fem.Hinge{{X: 2}, {X: 5}, {X: 6}}
	m.Foundations = []fem.Foundation{{Start: 1, End: 3, Modulus: 1e6}, {Start: 4, End: 7, Modulus: 2e6}, {Start: 5.5, End: 8, Modulus: 3e6}}
	if err := setLength(&m, 5); err != nil {
		t.Fatal(err)
	}
	if want := []fem.Hinge{{X: 2}}; !slices.Equal(m.Hinges, want) {
		t.Errorf("hinges %+v, want %+v", m.Hinges, want)
	}
	if want := []fem.Foundation{{Start: 1, End: 3, Modulus: 1e6}, {Start: 4, End: 5, Modulus: 2e6}}; !slices.Equal(m.Foundations, want) {
		t.Errorf("foundations %+v, want %+v", m.Foundations, want)
	}
	if err := m.Validate(); err != nil {
		t.Errorf("the shortened member does not validate: %v", err)
	}
}

// Undoing a delete brings the item back selected, as it was when it was
// deleted, so its properties show again; redo deletes it and leaves
// nothing selected.
func TestUndoDeleteSelectsTheItemAgain(t *testing.T) {
	w, _ := newTestWindow(t, demoProject(t))
	for _, r := range []canvas.Ref{{Kind: canvas.PointLoad}, {Kind: canvas.Support, Index: 1}} {
		n := count(&w.project.Model, r.Kind)
		w.selectItem(r)
		w.deleteSelected()
		if count(&w.project.Model, r.Kind) != n-1 || w.selected.Kind != canvas.None {
			t.Fatalf("deleting %s left %d of %d, %v selected", describe(r), count(&w.project.Model, r.Kind), n, w.selected)
		}
		w.undo()
		if count(&w.project.Model, r.Kind) != n || w.selected != r {
			t.Errorf("undoing the delete of %s: %d of %d, %v selected", describe(r), count(&w.project.Model, r.Kind), n, w.selected)
		}
		w.redo()
		if count(&w.project.Model, r.Kind) != n-1 || w.selected.Kind != canvas.None {
			t.Errorf("redoing the delete of %s: %d of %d, %v selected", describe(r), count(&w.project.Model, r.Kind), n, w.selected)
		}
		w.undo()
	}
}
