package app

import (
	"image/color"
	"math"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"sync/atomic"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas/report"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

func runwayWindow(t *testing.T) (*Window, *uiQueue, *movingWindow) {
	t.Helper()
	p, err := storage.Load(filepath.Join("..", "testdata", "moving", "runway.json"))
	if err != nil {
		t.Fatal(err)
	}
	w, q := newTestWindow(t, p)
	w.showMovingLoads()
	mw := w.moving
	if mw == nil {
		t.Fatal("no moving-loads window")
	}
	q.waitFor(t, "the envelope", func() bool { return mw.env != nil })
	return w, q, mw
}

// The window shows the file's first train at its worst position for the
// largest bending moment, with its envelope, and the train follows a drag.
func TestMovingWindowDragsTheTrain(t *testing.T) {
	_, _, mw := runwayWindow(t)
	hi, _ := mw.env.Worst(moving.EnvelopeQuantities[mw.quantityIndex])
	if mw.current == nil {
		t.Fatal("no field of the train where it stands")
	}
	s, _ := slices.BinarySearch(mw.env.Stations, hi.X)
	if got := mw.current[s]; math.Abs(got-hi.Value) > 1e-9*math.Abs(hi.Value) {
		t.Errorf("where the train stands (front at %g m) the moment at %g m is %g, want the envelope's largest %g", mw.at.Front, hi.X, got, hi.Value)
	}
	mw.win.Resize(fyne.NewSize(1280, 760))
	size := mw.pic.Size()
	before := mw.at
	start := fyne.NewPos(size.Width/2, 60)
	at := fyne.CurrentApp().Driver().AbsolutePositionForObject(mw.pic)
	test.Drag(mw.win.Canvas(), at.Add(start), -200, 0)
	mw.pic.DragEnd()
	if mw.at.Front >= before.Front {
		t.Errorf("dragging 200 pixels left moved the front from %g to %g m", before.Front, mw.at.Front)
	}
	if mw.env.Nearest(mw.at) != mw.at {
		t.Errorf("the front at %g m is not one of the train's positions", mw.at.Front)
	}
}

// Editing the train in the table changes the project (unsaved), and a train
// that does not fit is refused with the reason.
func TestMovingWindowEditsTheProject(t *testing.T) {
	w, q, mw := runwayWindow(t)
	mw.axleRows[1].spacing.SetText("2.5")
	mw.apply()
	if got := w.project.Trains[0].Axles[1].Spacing; got != 2.5 {
		t.Errorf("the project's spacing is %g m after applying 2.5", got)
	}
	if !w.dirty() {
		t.Error("the edited train leaves the project unchanged")
	}
	q.waitFor(t, "the new envelope", func() bool { return mw.env != nil && mw.env.Train.Axles[1].Spacing == 2.5 })
	mw.axleRows[1].spacing.SetText("20")
	mw.apply()
	if w.project.Trains[0].Axles[1].Spacing != 2.5 || mw.status.Text == "" {
		t.Errorf("a train longer than the member was applied; status %q", mw.status.Text)
	}
	// Driving on and off the member's ends, a train longer than it runs.
	mw.offEnds.SetChecked(true)
	mw.apply()
	if tr := w.project.Trains[0]; !tr.OffEnds || tr.Axles[1].Spacing != 20 {
		t.Errorf("checking the box and applying gave the train %+v, want one driving off the ends with a 20 m spacing", tr)
	}
}

// Choosing a train with more axles lays the table out for all its rows:
// none hides under the button below it.
func TestMovingWindowShowsEveryAxle(t *testing.T) {
	_, q, mw := runwayWindow(t)
	mw.choose(1)
	q.waitFor(t, "the cart's envelope", func() bool { return mw.env != nil && mw.env.Train.Name == "maintenance cart" })
	if len(mw.axleRows) != 3 {
		t.Fatalf("%d rows for the cart's 3 axles", len(mw.axleRows))
	}
	if got, need := mw.axles.Size().Height, mw.axles.MinSize().Height; got < need-0.5 {
		t.Errorf("the axle table is %g high, its 3 rows need %g", got, need)
	}
}

// The train's form works from the keyboard: Enter in any of its fields
// applies it, as Enter does in the window's properties, since at 1280 ×
// 720 the Apply button lies below the form's fold; and the picture shows
// a frame while it has the focus (← and → then move the train). Enter
// did nothing, and the picture gave no sign of focus.
func TestMovingWindowByKeyboard(t *testing.T) {
	w, q, mw := runwayWindow(t)
	fields := map[string]*escEntry{"spacing": mw.axleRows[1].spacing, "name": mw.name, "step": mw.step}
	for what, e := range fields {
		want := w.project.Trains[0]
		switch what {
		case "spacing":
			e.SetText("2.8")
			want.Axles = slices.Clone(want.Axles)
			want.Axles[1].Spacing = 2.8
		case "name":
			e.SetText("carriage")
			want.Name = "carriage"
		case "step":
			e.SetText("0.1")
			want.Step = 0.1
		}
		e.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
		if got := w.project.Trains[0]; !reflect.DeepEqual(got, want) {
			t.Errorf("Enter in the %s field: the train is %+v, want %+v", what, got, want)
		}
	}
	q.waitFor(t, "the envelope", func() bool { return mw.env != nil })
	c := mw.win.Canvas()
	c.Focus(mw.pic)
	if mw.pic.frame.StrokeColor != theme.Color(theme.ColorNamePrimary) || !slices.Contains(test.WidgetRenderer(mw.pic).Objects(), fyne.CanvasObject(mw.pic.frame)) {
		t.Errorf("the picture in focus has a frame of %v, drawn %v", mw.pic.frame.StrokeColor, slices.Contains(test.WidgetRenderer(mw.pic).Objects(), fyne.CanvasObject(mw.pic.frame)))
	}
	before := mw.at
	mw.pic.TypedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if mw.at == before {
		t.Error("→ left the train where it was")
	}
	c.Unfocus()
	if mw.pic.frame.StrokeColor != color.Transparent {
		t.Errorf("the picture out of focus has a frame of %v", mw.pic.frame.StrokeColor)
	}
}

// The train's form follows the window's units: switched to US units with
// the moving loads window open, its fields and headings read kip and ft,
// and applying the form leaves the train as it was. The form kept "42.00"
// under a heading of kN, and Apply read it as 42 kip (186.8 kN).
func TestMovingWindowFollowsTheUnits(t *testing.T) {
	w, q, mw := runwayWindow(t)
	// The form writes four figures; applying it untouched keeps the
	// train's own numbers, not those figures.
	w.project.Trains[0].Axles[0].Load = 42345
	w.project.Trains[0].Step = 0.05004
	mw.choose(0)
	want := moving.CloneTrains(w.project.Trains)
	mw.apply()
	if got := w.project.Trains; !reflect.DeepEqual(got, want) {
		t.Errorf("applying the form untouched made the train %+v, want %+v", got[0], want[0])
	}
	w.project.Trains[0].Axles[0].Load, w.project.Trains[0].Step = 42e3, 0.05
	mw.choose(0)
	want = moving.CloneTrains(w.project.Trains)
	w.setUnits(units.USCustomary)
	finished(t, w, q)
	// 42 kN is 42000 / 4448.2216152605 kip = 9.442 kip (NIST SP 811,
	// Appendix B: 1 lbf = 4.4482216152605 N); 3.2 m is 10.50 ft.
	if got := mw.axleRows[0].load.Text; got != "9.442" {
		t.Errorf("the first axle's load reads %q in US units, want 9.442 (kip)", got)
	}
	if got := mw.axleRows[1].spacing.Text; got != "10.50" {
		t.Errorf("the second axle's spacing reads %q in US units, want 10.50 (ft)", got)
	}
	if !strings.Contains(mw.axlesHeading.Text, "kip") || strings.Contains(mw.axlesHeading.Text, "kN") {
		t.Errorf("the axles' heading says %q in US units", mw.axlesHeading.Text)
	}
	mw.apply()
	if got := w.project.Trains; !reflect.DeepEqual(got[0].Axles, want[0].Axles) {
		t.Errorf("applying the form in US units made the axles %+v, want %+v", got[0].Axles, want[0].Axles)
	}
}

// The × of an axle row removes that row, even with a row above it left
// empty: the table was read without the empty row, and the row's place in
// the table then named the axle after it (here none: nothing was removed).
func TestMovingWindowRemovesTheAxleClicked(t *testing.T) {
	_, q, mw := runwayWindow(t)
	mw.choose(1)
	q.waitFor(t, "the cart's envelope", func() bool { return mw.env != nil && mw.env.Train.Name == "maintenance cart" })
	mw.axleRows[0].load.SetText("")
	test.Tap(axleRemover(t, mw.axleRows[2]))
	axles, err := mw.readAxles()
	if err != nil || len(axles) != 1 || axles[0].Load != 9000 {
		t.Errorf("after removing the third of the cart's axles (the first left empty): %+v, %v; want the second alone, 9 kN", axles, err)
	}
}

// axleRemover is the × of axle row r.
func axleRemover(t *testing.T, r axleRow) *widget.Button {
	t.Helper()
	for _, o := range test.LaidOutObjects(r.row) {
		if b := buttonIn(o); b != nil && b.Text == "×" {
			return b
		}
	}
	t.Fatal("no × in the axle row")
	return nil
}

// The × of an axle row removes that row alone and leaves the others as
// typed, a typo too: the table was read to remove a row and written again
// from what it read, which stops at a field it cannot read, so a typo in
// one row and a × in another dropped every row from the typo on without a
// word. The rows are numbered again; when the front goes, the next row is
// the front, which has no spacing.
func TestMovingWindowRemovingAnAxleKeepsTheOthersAsTyped(t *testing.T) {
	_, q, mw := runwayWindow(t)
	mw.choose(1)
	q.waitFor(t, "the cart's envelope", func() bool { return mw.env != nil && mw.env.Train.Name == "maintenance cart" })
	typed := [][2]string{} // the cart's rows as the form writes them
	for _, r := range mw.axleRows {
		typed = append(typed, [2]string{r.load.Text, r.spacing.Text})
	}
	if len(typed) != 3 {
		t.Fatalf("%d rows for the cart's 3 axles", len(typed))
	}
	for _, c := range []struct {
		name         string
		typo, remove int    // rows, from 0
		field        string // "load" or "spacing"
		want         [][2]string
	}{
		{"a typo in the first load, the last row removed", 0, 2, "load", [][2]string{{"6,0", ""}, typed[1]}},
		{"a typo in the second load, the last row removed", 1, 2, "load", [][2]string{typed[0], {"9 kN/m", typed[1][1]}}},
		{"a typo in the last spacing, the second row removed", 2, 1, "spacing", [][2]string{typed[0], {typed[2][0], "0..9"}}},
		{"a typo in the second load, the front removed", 1, 0, "load", [][2]string{{"9 kN/m", ""}, typed[2]}},
	} {
		mw.choose(1)
		r := mw.axleRows[c.typo]
		e := r.load
		if c.field == "spacing" {
			e = r.spacing
		}
		e.SetText(map[string]string{"load": "9 kN/m", "spacing": "0..9"}[c.field])
		if c.typo == 0 {
			e.SetText("6,0")
		}
		test.Tap(axleRemover(t, mw.axleRows[c.remove]))
		var got [][2]string
		for i, r := range mw.axleRows {
			got = append(got, [2]string{r.load.Text, r.spacing.Text})
			if n := r.number.Text; n != strconv.Itoa(i+1) {
				t.Errorf("%s: row %d is numbered %q", c.name, i+1, n)
			}
		}
		if !reflect.DeepEqual(got, c.want) {
			t.Errorf("%s: rows %q, want %q", c.name, got, c.want)
		}
		if len(mw.axleRows) > 0 && !mw.axleRows[0].spacing.Disabled() {
			t.Errorf("%s: the front row's spacing can be typed in", c.name)
		}
	}
}

// The moving loads window works on the member as the command line does:
// on a model with load cases (it prepared the window's model with the
// loads of the case edited lifted out of it, and refused it: 'load case
// "both spans" is empty'), and on a member whose only loads are its trains
// with the mesh left to Stave (it took the automatic mesh of one element a
// span, so the train stood at 3 positions 4.4 m apart, and its largest
// moment at x = 2.1 m read 32.7 kN·m). The train's largest moment at a
// point is the influence line's closed form (Müller-
// Breslau; two equal spans L = 6 m, M_B = −P·ξ(L² − ξ²)/(4L²) from the
// three-moment equation, Timoshenko & Young, from memory): 56.57 kN·m at
// x = 2.1 m, the two 42 kN axles at 2.1 and 5.3 m.
func TestMovingWindowWorksAsTheCommandLine(t *testing.T) {
	cased, err := storage.Load(filepath.Join("..", "testdata", "two_span_cases.json"))
	if err != nil {
		t.Fatal(err)
	}
	cased.Trains = []moving.Train{{Name: "pair", Axles: []moving.Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}}
	bare, err := storage.Load(filepath.Join("..", "testdata", "moving", "runway.json"))
	if err != nil {
		t.Fatal(err)
	}
	bare.Model.Gravity, bare.Model.Mesh.Elements = [2]float64{}, 0
	bare.Trains = bare.Trains[:1]
	bare.Trains[0].Step = 0
	for name, p := range map[string]*storage.Project{"two spans with cases": cased, "runway with no loads": bare} {
		w, q := newTestWindow(t, p)
		w.showMovingLoads()
		mw := w.moving
		q.waitFor(t, "the envelope of "+name, func() bool { return mw.env != nil || mw.infl == nil })
		if mw.infl == nil {
			t.Errorf("%s: no influence lines: %s", name, mw.status.Text)
			continue
		}
		want := canonicalInfluence(t, w)
		if mw.env.Step != want.Step || mw.env.Positions != want.Positions {
			t.Errorf("%s: the train stands at %d positions %g m apart, the command line's at %d, %g m apart", name, mw.env.Positions, mw.env.Step, want.Positions, want.Step)
		}
		if name == "runway with no loads" {
			// With a step that puts the rear axle on x = 2.1 m.
			w.project.Trains[0].Step = 0.1
			mw.modelChanged()
			q.waitFor(t, "the envelope by steps of 0.1 m", func() bool { return mw.env != nil })
			mw.pinned, mw.pointX = true, 2.1
			mw.showLine()
			if hi := mw.worst[0].Value; math.Abs(hi-56.568e3) > 0.01e3 {
				t.Errorf("%s: the train's largest moment at x = 2.1 m is %g N·m, want 56.57 kN·m", name, hi)
			}
		}
	}
}

// canonicalInfluence is the first train's envelope as the command line
// works it out on the window's project.
func canonicalInfluence(t *testing.T, w *Window) *moving.Envelope {
	t.Helper()
	p := w.canonical()
	rs, err := report.TrainEnvelopes(&p, units.Base)
	if err != nil || len(rs) == 0 || rs[0].Err != nil {
		t.Fatalf("the command line's train envelopes: %v %+v", err, rs)
	}
	return rs[0].Envelope
}

// The point the influence line is of can be typed, so the line of a field
// is reached by keyboard too (the mouse alone set it: under it, or pinned
// by a click). At x = 3 m of the runway's two 6 m spans, the end
// carriage's largest moment is 49.19 kN·m, its axles at 3.0 and 6.2 m
// (M = 42·(3·3/6) + M_B·3/6 with M_B = −Σ P·ξ(L² − ξ²)/(4L²) over the two
// spans, three-moment equation, Timoshenko & Young, from memory); a point
// off the member is refused with the reason.
func TestMovingWindowTakesATypedPoint(t *testing.T) {
	_, _, mw := runwayWindow(t)
	mw.point.SetText("3 m")
	mw.point.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if mw.line == nil || mw.line.Target.X != 3 || !mw.pinned {
		t.Fatalf("after typing 3 m the line is of %+v, pinned %v", mw.line, mw.pinned)
	}
	if hi := mw.worst[0].Value; math.Abs(hi-49.19e3) > 0.01e3 {
		t.Errorf("the largest moment at x = 3 m is %g N·m, want 49.19 kN·m", hi)
	}
	mw.point.SetText("13 m")
	mw.point.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if mw.line.Target.X != 3 || !strings.Contains(mw.status.Text, "12") {
		t.Errorf("a point off the member: the line is at %g m, the status says %q", mw.line.Target.X, mw.status.Text)
	}
	// A click lets the point go, and the field empties; another pins it
	// where it is, and the field shows it (the picture's left edge: x = 0).
	mw.win.Resize(fyne.NewSize(1280, 720))
	test.Tap(mw.pic)
	if mw.pinned || mw.point.Text != "" {
		t.Errorf("after a click let the point go: pinned %v, the field reads %q", mw.pinned, mw.point.Text)
	}
	test.Tap(mw.pic)
	if !mw.pinned || mw.point.Text != "0" {
		t.Errorf("after a click pinned the point at the left end: pinned %v, the field reads %q", mw.pinned, mw.point.Text)
	}
}

// The window shows a combination that takes the train, its cases at their
// worst arrangement with the train on top, as the command line's trains'
// results give it (report.TrainEnvelopes), and back the train alone.
func TestMovingWindowShowsACombinationWithItsTrain(t *testing.T) {
	p := twoSpansWithTrains(t, pairTrain)
	results, err := report.TrainEnvelopes(p, units.Base)
	if err != nil || len(results) != 1 || len(results[0].Combinations) != 1 {
		t.Fatalf("the command line's trains' results: %v, %+v", err, results)
	}
	want := results[0].Combinations[0]
	w, q := newTestWindow(t, p)
	w.showMovingLoads()
	mw := w.moving
	q.waitFor(t, "the train's envelope", func() bool { return mw.env != nil })
	alone := mw.env
	if n := len(mw.withSelect.Options); n != 2 {
		t.Fatalf("the envelope choices are %q, want the train alone and the combination", mw.withSelect.Options)
	}
	mw.withSelect.SetSelectedIndex(1)
	q.waitFor(t, "the combination's envelope", func() bool { return mw.combined != nil })
	in := mw.input()
	if in.Combination != want.Combination || in.Current != nil {
		t.Errorf("the picture shows combination %q (the train's own field %v), want %q and no field of the train alone", in.Combination, in.Current != nil, want.Combination)
	}
	k := slices.Index(moving.EnvelopeQuantities, moving.EnvelopeQuantities[mw.quantityIndex])
	for s := range want.Envelope.Stations {
		if in.Envelope.Max[k][s] != want.Envelope.Max[k][s] || in.Envelope.Min[k][s] != want.Envelope.Min[k][s] {
			t.Fatalf("at station %d the window's envelope is %g to %g, the command line's %g to %g", s,
				in.Envelope.Min[k][s], in.Envelope.Max[k][s], want.Envelope.Min[k][s], want.Envelope.Max[k][s])
		}
	}
	for _, qw := range want.Worst {
		if qw.Quantity != moving.EnvelopeQuantities[mw.quantityIndex] {
			continue
		}
		if len(in.Peaks) != 2 || in.Peaks[0].Value != qw.Largest.Value || in.Peaks[1].Value != qw.Smallest.Value {
			t.Errorf("the picture marks %+v, the command line's extremes are %g and %g", in.Peaks, qw.Largest.Value, qw.Smallest.Value)
		}
	}
	if !strings.Contains(mw.readout.Text, `combination "both"`) {
		t.Errorf("the readout does not say it reads the combination: %q", mw.readout.Text)
	}
	mw.withSelect.SetSelectedIndex(0)
	q.waitFor(t, "the train alone", func() bool { return mw.env != nil && mw.combined == nil })
	if mw.current == nil || !reflect.DeepEqual(mw.env.Max, alone.Max) {
		t.Error("back to the train alone, the window does not show its own envelope and field")
	}
}

// Every number of the train's form says its unit, in the window's units:
// From x, To x and Step read as bare numbers ("0", "0.05000") with no unit
// anywhere near them, where the axles' heading and the uniform load named
// theirs.
func TestTrainFormNamesItsUnits(t *testing.T) {
	w, q, mw := runwayWindow(t)
	fields := []struct {
		label string
		kind  units.Kind
	}{
		{"From x", units.Position}, {"To x", units.Position}, {"Step", units.Position},
		{"Load", units.LineLoad}, {"Behind the front", units.Position}, {"Length", units.Position},
	}
	for _, sys := range []units.System{units.SI, units.USCustomary} {
		w.setUnits(sys)
		finished(t, w, q)
		var texts []string
		for _, o := range test.LaidOutObjects(mw.win.Content()) {
			if l, ok := o.(*widget.Label); ok {
				texts = append(texts, l.Text)
			}
		}
		for _, f := range fields {
			want := f.label + " (" + sys.Unit(f.kind).Symbol + ")"
			if !slices.Contains(texts, want) {
				t.Errorf("%s units: no label %q in the train's form", sys.Name, want)
			}
		}
	}
}

// An envelope asked for in the background and not yet back when its train
// is deleted is dropped when it comes: deleting the file's last train
// while the envelope of the train before it was still being found took
// that envelope for the shown train's and indexed the trains at −1 (a
// panic). Every change the window follows makes the envelopes asked for
// before it stale, also when it asks for none (no train left, influence
// lines refused, a train that does not fit).
func TestMovingWindowDropsTheEnvelopeOfADeletedTrain(t *testing.T) {
	w, q, mw := runwayWindow(t)
	if len(w.project.Trains) != 2 {
		t.Fatalf("runway.json has %d trains, want 2", len(w.project.Trains))
	}
	var asked atomic.Int32
	w.post = func(f func()) { asked.Add(1); q.post(f) }
	mw.deleteTrain() // asks for the envelope of the other train
	mw.deleteTrain() // the last: no train to ask for
	q.waitFor(t, "the envelope asked for before the last train went", func() bool { return asked.Load() >= 1 })
	q.drain()
	if mw.env != nil || mw.index != -1 {
		t.Errorf("with no train left the window shows train %d's envelope (%v)", mw.index, mw.env != nil)
	}
	if got := mw.status.Text; !strings.Contains(got, "no train yet") {
		t.Errorf("status %q, want it to say there is no train yet", got)
	}
}

// Every field, label and button of the train form stays clear of the
// form's scroll bar, which fyne draws over the content's right edge: at
// 1280 × 720 the fields, the Delete button and the axles' × ran to the
// edge of the split, under the bar, and looked cut off.
func TestTrainFormClearsItsScrollBar(t *testing.T) {
	_, _, mw := runwayWindow(t)
	d := fyne.CurrentApp().Driver()
	s := mw.formScroll
	edge := d.AbsolutePositionForObject(s).X + s.Size().Width - theme.ScrollBarSize()
	n := 0
	for _, o := range test.LaidOutObjects(s.Content) {
		switch o.(type) {
		case fyne.Focusable, *widget.Label:
		default:
			continue
		}
		n++
		if right := d.AbsolutePositionForObject(o).X + o.Size().Width; right > edge {
			t.Errorf("%s ends at x = %.0f px, under the scroll bar, which starts at %.0f", nameOf(o), right, edge)
		}
	}
	if n == 0 {
		t.Error("the form has no widget")
	}
}
