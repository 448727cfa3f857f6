package app

import (
	"math"
	"reflect"
	"slices"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/storage"
)

// Working with load cases in the window: a model without cases gets a
// second case (its loads become the case "loads"), a load placed goes into
// the case edited, the other case's loads leave the drawing, undo returns
// across the change of cases, the combinations table takes factors, and
// the envelope is solved and read at the mouse with its governing
// combinations.
func TestCasesInTheWindow(t *testing.T) {
	w, q := newTestWindow(t, demoProject(t))
	solved(t, w, q)
	own := w.Model()
	if err := w.addCaseNamed("imposed"); err != nil {
		t.Fatal(err)
	}
	m := w.Model()
	if len(m.Cases) != 2 || m.Cases[0].Name != "loads" || !reflect.DeepEqual(m.Cases[0].PointLoads, own.PointLoads) || !m.Cases[0].SelfWeight || len(m.PointLoads) != 0 {
		t.Fatalf("cases after adding one: %+v", m.Cases)
	}
	if w.editCase != 1 || len(w.project.Model.PointLoads) != 0 || len(w.project.Model.DistributedLoad) != 0 {
		t.Fatalf("editing case %d with %d loads shown, want the new, empty case", w.editCase, len(w.project.Model.PointLoads))
	}
	// The new case is empty: the model is kept, and the solver says what to do.
	finished(t, w, q)
	if w.result.Err == nil || !strings.Contains(w.result.Err.Error(), "is empty") {
		t.Errorf("an empty case solved: %v", w.result.Err)
	}
	// A point load placed now belongs to the new case.
	w.setTool(toolForce)
	w.place(2.0)
	m = w.Model()
	if len(m.Cases[1].PointLoads) != 1 || len(m.Cases[0].PointLoads) != len(own.PointLoads) {
		t.Fatalf("the point load went to %+v", m.Cases)
	}
	solved(t, w, q)
	// The drawing shows the edited case's loads only.
	loads := 0
	for _, h := range w.draw.scene.Handles {
		if h.Ref.Kind == canvas.PointLoad {
			loads++
		}
	}
	if loads != 1 {
		t.Errorf("%d point loads drawn, want the edited case's one", loads)
	}
	// Combinations from the table, one cell refused with its place.
	tab := newCombinationTable(w.Model(), nil, nil)
	tab.addTemplates()
	tab.rows[0].factors[1].SetText("1,5")
	if _, err := tab.combinations(); err == nil || !strings.Contains(err.Error(), "row 1, imposed") {
		t.Errorf("a bad factor: %v", err)
	}
	tab.rows[0].factors[1].SetText("1.5")
	combos, err := tab.combinations()
	if err != nil || len(combos) != 2 || combos[0].Factors[0].Factor != 1.35 || !strings.Contains(combos[0].Label, "typical") {
		t.Fatalf("combinations %+v, %v", combos, err)
	}
	if err := w.changeCases("edit the combinations", w.editCase, func(m *fem.Model) error { m.Combinations = combos; return nil }); err != nil {
		t.Fatal(err)
	}
	solved(t, w, q)
	c := w.result.Cases
	if c == nil || c.Show.Kind != analysis.ShowEnvelope || len(c.Combinations) != 2 {
		t.Fatalf("the analysis shows %+v", c)
	}
	// The readout at the mouse names the governing combinations.
	w.draw.hovering, w.draw.hoverX = true, 2.0
	w.hoverChanged()
	if txt := w.ui.readout.at.Text; !strings.Contains(txt, "envelope of 2 combinations") {
		t.Errorf("readout heading %q", txt)
	}
	lo, hi := envelopeRows(t, w.ui.readout, fem.QBendingMoment)
	if lo[columnFE] == "" || lo[columnExact] == "" || !strings.Contains(lo[columnGoverning]+hi[columnGoverning], "strength") {
		t.Errorf("readout of M: %q, %q", lo, hi)
	}
	// The checks name their governing combination.
	named := false
	for _, f := range w.checks {
		named = named || strings.Contains(f.Name, "(governing: ")
	}
	if !named {
		t.Error("no check names its governing combination")
	}
	// Showing one case, then undoing everything back to the model without cases.
	w.setShow(analysis.Show{Kind: analysis.ShowCase, Index: 1})
	sol := solved(t, w, q)
	if got := sol.Equilibrium.Applied[fem.Transverse]; math.Abs(got-w.Model().Cases[1].PointLoads[0].Transverse) > 1e-9 {
		t.Errorf("case imposed shows a transverse load of %g N", got)
	}
	for range 3 {
		w.undo()
	}
	if !reflect.DeepEqual(w.Model(), own) || w.editCase != 0 {
		t.Errorf("undo gave %+v, editing %d", w.Model().Cases, w.editCase)
	}
}

// The cases panel lists the cases and what can be shown, and switching the
// case edited swaps the loads drawn without changing the model.
func TestCasesPanel(t *testing.T) {
	p, err := storage.Load("../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	w, q := newTestWindow(t, p)
	solved(t, w, q)
	c := w.ui.cases
	if got := c.caseSelect.Options; !reflect.DeepEqual(got, []string{"both spans", "first span", "imposed"}) {
		t.Errorf("cases listed %q", got)
	}
	if len(c.showSelect.Options) != 1+3+3 || c.showSelect.Selected != "envelope" {
		t.Errorf("show choices %q, selected %q", c.showSelect.Options, c.showSelect.Selected)
	}
	before := w.Model()
	c.caseSelect.SetSelectedIndex(1)
	if w.editCase != 1 || !reflect.DeepEqual(w.Model(), before) || w.dirty() {
		t.Errorf("editing %d; model kept %v; unsaved %v", w.editCase, reflect.DeepEqual(w.Model(), before), w.dirty())
	}
	if pts := w.project.Model.DistributedLoad; len(pts) != 1 || pts[0].Points[1].X != 4 {
		t.Errorf("loads drawn for the first-span case: %+v", pts)
	}
	test.Tap(c.bySpan)
	if !w.Model().Cases[1].BySpan {
		t.Error("placed by span was not set on the case edited")
	}
	c.showSelect.SetSelected("combination: first")
	if w.show != (analysis.Show{Kind: analysis.ShowCombination, Index: 1}) {
		t.Errorf("show %+v", w.show)
	}
}

// A named moving load train has its column in the combinations table: a
// factor typed there puts the train in the combination, and a combination
// that takes one shows its factor; an unnamed train, which a file cannot
// name, has none.
func TestCombinationTableTrains(t *testing.T) {
	m := fem.Model{Cases: []fem.LoadCase{{Name: "permanent"}, {Name: "imposed"}},
		Combinations: []fem.Combination{{Name: "with hoist", Kind: fem.Strength,
			Factors: []fem.CaseFactor{{Case: 0, Factor: 1.35}}, Trains: []fem.TrainFactor{{Train: 1, Factor: 1.5}}}}}
	trains := []moving.Train{{Axles: []moving.Axle{{Load: 1}}}, {Name: "hoist", Axles: []moving.Axle{{Load: 1}}}}
	tab := newCombinationTable(m, trains, nil)
	if len(tab.trains) != 1 || tab.trains[0] != 1 || len(tab.rows[0].trains) != 1 || tab.rows[0].trains[0].Text != "1.5" {
		t.Fatalf("train columns %v, the row's %v; want the named train's with 1.5", tab.trains, tab.rows[0].trains)
	}
	tab.rows[0].trains[0].SetText("x")
	// The refusal names the column as its heading does, not by the train's number.
	if _, err := tab.combinations(); err == nil || !strings.Contains(err.Error(), "row 1, train hoist:") {
		t.Errorf("a bad train factor: %v", err)
	}
	tab.rows[0].trains[0].SetText("1.2")
	combos, err := tab.combinations()
	if err != nil || len(combos) != 1 || !reflect.DeepEqual(combos[0].Trains, []fem.TrainFactor{{Train: 1, Factor: 1.2}}) {
		t.Errorf("combinations %+v, %v; want the hoist at 1.2", combos, err)
	}
	tab.rows[0].trains[0].SetText("")
	if combos, err = tab.combinations(); err != nil || len(combos[0].Trains) != 0 {
		t.Errorf("an empty cell keeps the train: %+v, %v", combos, err)
	}
	// A row with a train's factor alone is kept, for the model to say
	// what it lacks; it was dropped, the factor typed lost without a word.
	tab.addRow(fem.Combination{Kind: fem.Strength})
	tab.rows[1].trains[0].SetText("1.5")
	if combos, err = tab.combinations(); err != nil || len(combos) != 2 || len(combos[1].Trains) != 1 {
		t.Errorf("a row with a train's factor alone gave %+v, %v", combos, err)
	}
}

// A model without cases that gets one keeps every action in the case its
// own loads become: its segments' temperature differences too, which were
// left in no case (and so acted in none) before.
func TestOwnLoadsAsCaseKeepsEveryAction(t *testing.T) {
	for _, c := range []struct {
		name                    string
		edit                    func(m *fem.Model)
		settlements, difference bool
	}{
		{"loads only", func(m *fem.Model) {}, false, false},
		{"settlement", func(m *fem.Model) { m.Supports[0].Settlement[fem.Transverse] = -0.01 }, true, false},
		{"temperature difference", func(m *fem.Model) { m.Segments[0].TemperatureDifference = 20 }, false, true},
	} {
		m := newMember(4)
		addSupport(&m, fem.Fixed, 0)
		m.PointLoads = []fem.PointLoad{{X: 2, Transverse: -1e3}}
		c.edit(&m)
		lc := ownLoadsAsCase(m).Cases[0]
		if lc.Settlements != c.settlements || lc.ThermalGradient != c.difference || len(lc.PointLoads) != 1 {
			t.Errorf("%s: case %+v, want settlements %v and temperature differences %v", c.name, lc, c.settlements, c.difference)
		}
	}
}

// The sketch draws the loads of the case edited and the deflection and
// reactions of what is shown: when the two differ it says whose each is.
// Showing the first span's case while editing both spans' drew 10 kN/m
// over both spans beside the reactions of the first span alone (7/16,
// 10/16 and −1/16 of wL = 40 kN: 17.5, 25 and −2.5 kN; AISC Manual, "Beam
// Diagrams and Formulas", continuous beam of two equal spans, one span
// loaded), with nothing to tell them apart.
func TestSketchSaysWhoseLoadsAndResults(t *testing.T) {
	w, q := openTestdata(t, "two_span_cases.json", laptop)
	for _, c := range []struct {
		show      string
		edit      int
		want, not string
	}{
		{"case: first span", 0, "loads drawn: load case both spans; deflection and reactions: load case first span", ""},
		{"combination: first", 2, "loads drawn: load case imposed; deflection and reactions: combination first", ""},
		{"case: first span", 1, "", "loads drawn"},
		{"envelope", 1, "loads drawn: load case first span; deflection and reactions: combination both", ""},
	} {
		w.ui.cases.caseSelect.SetSelectedIndex(c.edit)
		w.ui.cases.showSelect.SetSelected(c.show)
		solved(t, w, q)
		w.draw.Refresh()
		var all []string
		for _, it := range w.draw.scene.Items {
			all = append(all, it.Text)
		}
		text := strings.Join(all, " | ")
		if c.want != "" && !strings.Contains(text, c.want) {
			t.Errorf("showing %s, editing case %d: no %q among the sketch's labels %s", c.show, c.edit+1, c.want, text)
		}
		if c.not != "" && strings.Contains(text, c.not) {
			t.Errorf("showing %s, editing the same case: the sketch says %q", c.show, c.not)
		}
		if c.show == "case: first span" {
			for _, r := range []string{"Ry 17.50 kN", "Ry 25.00 kN", "Ry -2.500 kN"} {
				if !strings.Contains(text, r) {
					t.Errorf("showing the first span's case: no reaction %q among %s", r, text)
				}
			}
		}
	}
}

// The combinations dialog says there why a table it cannot keep is
// refused (a row that combines no case), and stays open; a row added
// comes into sight, at 1280 × 720 below the three rows the dialog shows.
// Keeping refused a combination without a factor in the status line
// behind the dialog, which stayed open with no word, and the added row
// was out of sight under the others.
func TestCombinationsDialogSaysWhyAndShowsNewRows(t *testing.T) {
	w, q := openTestdata(t, "two_span_cases.json", laptop)
	solved(t, w, q)
	before := w.Model()
	cd := w.newCombinationsDialog()
	cd.dialog.Show()
	test.Tap(cd.addRow)
	row := cd.table.rows[len(cd.table.rows)-1]
	visible := func(o fyne.CanvasObject) bool {
		y := fyne.CurrentApp().Driver().AbsolutePositionForObject(o).Y - fyne.CurrentApp().Driver().AbsolutePositionForObject(cd.scroll).Y
		return y >= -0.5 && y+o.Size().Height <= cd.scroll.Size().Height+0.5
	}
	if !visible(row.name) {
		t.Errorf("the row added is out of sight: the table scrolls %v in %v", cd.scroll.Offset, cd.scroll.Size())
	}
	test.Type(row.name, "empty")
	test.Tap(cd.keep)
	if !strings.Contains(cd.message.Text, "combines no load cases") {
		t.Errorf("the dialog says %q about a combination without a factor", cd.message.Text)
	}
	if !reflect.DeepEqual(w.Model(), before) {
		t.Error("a refused table changed the model")
	}
	row.factors[0].SetText("1.2")
	test.Tap(cd.keep)
	if cb := w.Model().Combinations; len(cb) != 4 || cb[3].Name != "empty" || cd.message.Text != "" {
		t.Errorf("after a factor: combinations %+v, message %q", cb, cd.message.Text)
	}
}

// Deleting a load case keeps showing what is shown when it is still there
// (a case after it, a combination that keeps a factor), and shows the
// envelope when it went with the case. It showed the envelope after every
// deletion.
func TestDeletingACaseKeepsWhatIsShown(t *testing.T) {
	for _, c := range []struct {
		show   string
		delete int
		want   string
	}{
		{"case: imposed", 0, "case: imposed"},
		{"case: first span", 1, "envelope"},
		{"combination: pattern", 1, "combination: pattern"},
		{"combination: first", 1, "envelope"},
		{"combination: pattern", 2, "envelope"},
	} {
		w, q := openTestdata(t, "two_span_cases.json", laptop)
		w.ui.cases.showSelect.SetSelected(c.show)
		w.ui.cases.caseSelect.SetSelectedIndex(c.delete)
		w.deleteCase()
		finished(t, w, q)
		if got := w.ui.cases.showSelect.Selected; got != c.want {
			t.Errorf("showing %s, deleting case %d: the window shows %q, want %q", c.show, c.delete+1, got, c.want)
		}
		if got, want := w.result.Cases.Show, w.show; got != want && want.Kind != analysis.ShowEnvelope {
			t.Errorf("showing %s, deleting case %d: the analysis shows %+v, the choice %+v", c.show, c.delete+1, got, want)
		}
	}
}

// pairTrain is two axles of 42 kN 3.2 m apart (demo data).
var pairTrain = moving.Train{Name: "pair", Axles: []moving.Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}}

// twoSpansWithTrains is testdata/two_span_cases.json with trains, each
// taken by its combination "both" with a factor of 1.5.
func twoSpansWithTrains(t *testing.T, trains ...moving.Train) *storage.Project {
	t.Helper()
	p, err := storage.Load("../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Trains = moving.CloneTrains(trains) // the tests' trains stay as written
	for i := range trains {
		p.Model.Combinations[0].Trains = append(p.Model.Combinations[0].Trains, fem.TrainFactor{Train: i, Factor: 1.5})
	}
	return p
}

// trainCautions are the names of the window's train_not_checked cautions.
func trainCautions(w *Window) []string {
	var names []string
	for _, f := range w.checks {
		if f.Code == analysis.CodeTrainNotChecked {
			names = append(names, f.Name)
		}
	}
	return names
}

// The window's checks name a train that a combination takes as every
// other message does, by its name (docs/format.md, trains): the caution
// said "moving load train 1" of the file's only train, named "pair".
func TestCombinationTrainCautionNamesTheTrain(t *testing.T) {
	p := twoSpansWithTrains(t, pairTrain)
	w, q := newTestWindow(t, p)
	finished(t, w, q)
	names := trainCautions(w)
	if want := `combination "both" with moving load train "pair"`; !slices.Contains(names, want) {
		t.Errorf("the train cautions are %q, want %q", names, want)
	}
}

// Renaming, adding or deleting a train in the moving-loads window brings
// the main window's checks up to date at once: the caution kept naming the
// train by its old name until the next edit of the member.
func TestTrainCautionFollowsTheMovingLoadsWindow(t *testing.T) {
	p := twoSpansWithTrains(t, pairTrain)
	w, q := newTestWindow(t, p)
	finished(t, w, q)
	w.showMovingLoads()
	mw := w.moving
	mw.name.SetText("heavy pair")
	mw.apply()
	finished(t, w, q)
	names := trainCautions(w)
	if want := `combination "both" with moving load train "heavy pair"`; !slices.Contains(names, want) {
		t.Errorf("after renaming the train the cautions are %q, want %q", names, want)
	}
}

// Deleting a train a combination takes drops it from the combination and
// renumbers the others: a combination taking the second of two trains
// took none, or a train that was not there, once the first was deleted.
func TestDeletingATrainKeepsTheCombinationsTrains(t *testing.T) {
	p := twoSpansWithTrains(t, pairTrain, moving.Train{Name: "cart", Axles: []moving.Axle{{Load: 5e3}, {Load: 5e3, Spacing: 1}}})
	p.Model.Combinations[0].Trains[1].Factor = 1.2
	w, q := newTestWindow(t, p)
	finished(t, w, q)
	if err := w.apply("set the mesh", func(m *fem.Model) error { m.Mesh.Elements = 40; return nil }); err != nil {
		t.Fatal(err)
	}
	w.showMovingLoads()
	w.moving.choose(0)
	w.moving.deleteTrain()
	finished(t, w, q)
	want := []fem.TrainFactor{{Train: 0, Factor: 1.2}}
	if got := w.project.Model.Combinations[0].Trains; !reflect.DeepEqual(got, want) {
		t.Errorf("after deleting the first train the combination takes %+v, want %+v (the cart, now the first)", got, want)
	}
	w.undo()
	if got := w.project.Model.Combinations[0].Trains; !reflect.DeepEqual(got, want) {
		t.Errorf("undoing an edit made before the train was deleted gives the combination %+v, want %+v", got, want)
	}
	names := trainCautions(w)
	if want := `combination "both" with moving load train "cart"`; !slices.Contains(names, want) {
		t.Errorf("after deleting the first train the cautions are %q, want %q", names, want)
	}
}

// A factor of 0 typed with a sign ("-0") reads as 0, in a case's cell and
// in a train's, and a zero factor of either sign (a file may hold "-0")
// shows as 0: the table kept −0, which its cells and the reports then
// wrote "-0", as if a load were taken away. IEEE 754 has a zero of either
// sign, equal to each other (from memory).
func TestCombinationFactorZeroHasNoSign(t *testing.T) {
	negZero := math.Copysign(0, -1)
	m := fem.Model{Cases: []fem.LoadCase{{Name: "permanent"}},
		Combinations: []fem.Combination{{Name: "from a file", Kind: fem.Strength,
			Factors: []fem.CaseFactor{{Case: 0, Factor: negZero}}, Trains: []fem.TrainFactor{{Train: 0, Factor: negZero}}}}}
	trains := []moving.Train{{Name: "hoist", Axles: []moving.Axle{{Load: 1}}}}
	tab := newCombinationTable(m, trains, nil)
	if got := []string{tab.rows[0].factors[0].Text, tab.rows[0].trains[0].Text}; !slices.Equal(got, []string{"0", "0"}) {
		t.Errorf("factors of −0 show as %q, want 0 and 0", got)
	}
	for _, typed := range []string{"-0", " -0.0 ", "-0e3", "-0.000"} {
		tab.rows[0].factors[0].SetText(typed)
		tab.rows[0].trains[0].SetText(typed)
		combos, err := tab.combinations()
		if err != nil {
			t.Fatalf("%q typed: %v", typed, err)
		}
		for _, read := range []struct {
			what string
			f    float64
		}{{"case", combos[0].Factors[0].Factor}, {"train", combos[0].Trains[0].Factor}} {
			if read.f != 0 || math.Signbit(read.f) {
				t.Errorf("%q typed as a %s's factor reads as %v, want 0 without a sign", typed, read.what, read.f)
			}
		}
	}
}
