package app

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"

	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// Load cases in the window. The window edits one case at a time: while it
// does, that case's loads and temperature change sit in the model's own
// load fields (the editing form), so every tool, form and drag edits them
// as it edits a model without cases, and the drawing shows them (the
// other cases' loads are hidden). The solver, the file, the history and
// the exports see the model with every load in its case (the canonical
// form): lowerCase and fem.Model.CaseLifted turn one into the other.

// lowerCase is the inverse of fem.Model.CaseLifted: m, in the editing
// form of case k, with its own loads back in case k.
func lowerCase(m fem.Model, k int) fem.Model {
	if len(m.Cases) == 0 {
		return m
	}
	m = m.Clone()
	k = min(max(k, 0), len(m.Cases)-1)
	c := &m.Cases[k]
	c.PointLoads = append(c.PointLoads, m.PointLoads...)
	c.DistributedLoad = append(c.DistributedLoad, m.DistributedLoad...)
	c.TemperatureChange += m.TemperatureChange
	m.PointLoads, m.DistributedLoad, m.TemperatureChange = nil, nil, 0
	return m
}

// canonicalModel is the window's model with every load in its case.
func (w *Window) canonicalModel() fem.Model { return lowerCase(w.project.Model, w.editCase) }

// canonical is the window's project as files and exports hold it.
func (w *Window) canonical() storage.Project {
	p := cloneProject(w.project)
	p.Model = w.canonicalModel()
	return p
}

// validate checks m, in the editing form, as fem checks the canonical
// model, with the problems of the edited case's loads placed on the
// model's own, as the editing form holds them; it lets a case stay empty
// while the user fills it (the solver then says the case is empty, and
// what to do).
func (w *Window) validate(m *fem.Model) error {
	c := lowerCase(*m, w.editCase)
	err := validate(&c, w.units)
	ve, ok := err.(*fem.ValidationError)
	if !ok {
		return err
	}
	var rest []fem.Problem
	for _, p := range ve.Problems {
		if p.Place.Item.Kind == fem.CaseItem && p.Place.Property == fem.NoProperty && strings.Contains(p.Message, "is empty") {
			continue
		}
		if p.Place.Item.Case == w.editCase+1 && len(m.Cases) > 0 {
			p.Place.Item.Case = 0
		}
		rest = append(rest, p)
	}
	if len(rest) == 0 {
		return nil
	}
	return &fem.ValidationError{Problems: rest}
}

// fromHistory is m, a model of the history (every load in its case), in
// the editing form of the case edited, or of the last when it has fewer.
func (w *Window) fromHistory(m fem.Model) fem.Model {
	w.editCase = max(min(w.editCase, len(m.Cases)-1), 0)
	return m.CaseLifted(w.editCase)
}

// showEnvelope fills the readout with the envelope at x when the analysis
// shows one: two rows a quantity, its smallest and its largest value, each
// with the combination that gives it. False when it shows one solution.
func (r *readout) showEnvelope(w *Window, x float64) bool {
	a := w.result
	if a.Cases == nil || a.Cases.Show.Kind != analysis.ShowEnvelope {
		return false
	}
	c := a.Cases
	fe := c.Solutions.At(x, fem.Right, false)
	ex, exact := fe, c.Solutions.FixedExact != nil
	if exact {
		ex = c.Solutions.At(x, fem.Right, true)
	}
	r.at.SetText(fmt.Sprintf("At x = %s (under the mouse): envelope of %d combinations, each quantity's min and max", w.position(x), len(c.Combinations)))
	r.rows = r.rows[:0]
	for _, q := range fem.Quantities() {
		unit := q.Info().Unit
		value := func(f fem.Fields) string { return units.FormatNumber(w.units.ToDisplay(unit, q.Of(&f))) }
		lo, hi := quantityRow(w.units, q, envelopeMin), quantityRow(w.units, q, envelopeMax)
		lo[columnExact], hi[columnExact] = "—", "—"
		if exact {
			lo[columnExact], hi[columnExact] = value(ex.Lo), value(ex.Hi)
		}
		lo[columnFE], hi[columnFE] = value(fe.Lo), value(fe.Hi)
		lo[columnGoverning], hi[columnGoverning] = c.Combinations[ex.LoBy[q]].Name, c.Combinations[ex.HiBy[q]].Name
		r.rows = append(r.rows, lo, hi)
	}
	r.showRows(readoutColumns)
	return true
}

// casesPanel is the list of load cases, the case being edited, what the
// drawing shows and the combinations.
type casesPanel struct {
	w                                         *Window
	box                                       *fyne.Container
	caseSelect, showSelect                    *escSelect
	selfWeight, settlements, gradient, bySpan *escCheck
	showing                                   []analysis.Show // the choices of showSelect
	// bar holds the choices above the drawing: laid out again when their
	// options change, as each is as wide as its widest option.
	bar      *fyne.Container
	updating bool // set while the panel sets its own widgets
}

// newCasesPanel builds the panel; refresh fills it.
func newCasesPanel(w *Window) *casesPanel {
	c := &casesPanel{w: w}
	c.caseSelect = w.newSelect(nil, func(s string) {
		if !c.updating {
			w.chooseCase(c.caseSelect.SelectedIndex())
		}
	})
	c.showSelect = w.newSelect(nil, func(string) {
		if i := c.showSelect.SelectedIndex(); !c.updating && i >= 0 && i < len(c.showing) {
			w.setShow(c.showing[i])
		}
	})
	flag := func(label string, set func(lc *fem.LoadCase, on bool)) *escCheck {
		var ch *escCheck
		ch = w.newCheck(label, func(on bool) {
			if !c.updating {
				w.setCaseFlag(label, on, set)
			}
		})
		return ch
	}
	c.selfWeight = flag("self-weight", func(lc *fem.LoadCase, on bool) { lc.SelfWeight = on })
	c.settlements = flag("settlements", func(lc *fem.LoadCase, on bool) { lc.Settlements = on })
	c.gradient = flag("ΔT through depth", func(lc *fem.LoadCase, on bool) { lc.ThermalGradient = on })
	c.bySpan = flag("placed by span", func(lc *fem.LoadCase, on bool) { lc.BySpan = on })
	// The choice of the case edited and the combinations are above the
	// drawing (actionBar), beside what it shows.
	c.box = container.NewVBox(heading("Load cases"),
		container.NewGridWithColumns(2, w.newButton("Add…", nil, w.addCase),
			w.newButton("Rename…", nil, w.renameCase), w.newButton("Delete", nil, w.deleteCase)),
		c.selfWeight, c.settlements, c.gradient, c.bySpan)
	return c
}

// refresh shows the model's cases and what is shown.
func (c *casesPanel) refresh() {
	w := c.w
	m := &w.project.Model
	c.updating = true
	defer func() { c.updating = false }()
	names := make([]string, m.LoadSetCount())
	for k := range names {
		names[k] = m.LoadSetName(k)
	}
	beforeCases, beforeShow := c.caseSelect.Options, c.showSelect.Options
	c.caseSelect.Options = names
	c.caseSelect.SetSelectedIndex(min(w.editCase, len(names)-1))
	hasCases := len(m.Cases) > 0
	for _, ch := range []*escCheck{c.selfWeight, c.settlements, c.gradient, c.bySpan} {
		if hasCases {
			ch.Enable()
		} else {
			ch.Disable()
		}
	}
	if hasCases {
		lc := m.Cases[min(w.editCase, len(m.Cases)-1)]
		c.selfWeight.SetChecked(lc.SelfWeight)
		c.settlements.SetChecked(lc.Settlements)
		c.gradient.SetChecked(lc.ThermalGradient)
		c.bySpan.SetChecked(lc.BySpan)
	}
	c.showing = c.showing[:0]
	var labels []string
	if hasCases {
		c.showing = append(c.showing, analysis.Show{Kind: analysis.ShowEnvelope})
		labels = append(labels, "envelope")
		for i, cb := range m.EnvelopeCombinations() {
			c.showing = append(c.showing, analysis.Show{Kind: analysis.ShowCombination, Index: i})
			labels = append(labels, "combination: "+cb.Name)
		}
		for k := range m.Cases {
			c.showing = append(c.showing, analysis.Show{Kind: analysis.ShowCase, Index: k})
			labels = append(labels, "case: "+m.Cases[k].Name)
		}
	} else {
		c.showing = append(c.showing, analysis.Show{})
		labels = append(labels, "the loads (no cases yet)")
	}
	c.showSelect.Options = labels
	sel := 0
	for i, s := range c.showing {
		if s == w.show {
			sel = i
		}
	}
	c.showSelect.SetSelectedIndex(sel)
	if c.bar != nil && !(slices.Equal(beforeCases, c.caseSelect.Options) && slices.Equal(beforeShow, c.showSelect.Options)) {
		c.bar.Refresh()
	}
}

// changeCases applies change to the canonical model as one undoable edit,
// then edits case k of the result.
func (w *Window) changeCases(name string, k int, change func(m *fem.Model) error) error {
	before := w.editCase
	err := w.apply(name, func(m *fem.Model) error {
		c := lowerCase(*m, before)
		if err := change(&c); err != nil {
			return err
		}
		w.editCase = k
		*m = c.CaseLifted(k)
		return nil
	})
	if err != nil {
		w.editCase = before
	}
	w.ui.cases.refresh()
	return err
}

// chooseCase edits case k.
func (w *Window) chooseCase(k int) {
	m := w.canonicalModel()
	if len(m.Cases) == 0 || k < 0 || k >= len(m.Cases) || k == w.editCase {
		return
	}
	w.editCase = k
	w.selected = canvasNone
	w.project.Model = m.CaseLifted(k)
	w.modelChanged()
	w.setStatus("editing load case %s: loads placed now go into it; the other cases' loads are hidden", m.Cases[k].Name)
}

// addCase asks for a name and adds an empty case, which becomes the one
// edited. A model without cases first turns its loads into a case named
// "loads".
func (w *Window) addCase() {
	m := w.canonicalModel()
	entry := newEscEntry()
	entry.SetText(fmt.Sprintf("case %d", m.LoadSetCount()+min(len(m.Cases), 1)))
	w.showForm("Add a load case", "Add", []*widget.FormItem{widget.NewFormItem("Name", entry)}, func(ok bool) {
		if !ok {
			return
		}
		w.addCaseNamed(strings.TrimSpace(entry.Text))
	})
}

// addCaseNamed adds an empty case named name and edits it.
func (w *Window) addCaseNamed(name string) error {
	n := len(w.canonicalModel().Cases)
	k := max(n, 1)
	return w.changeCases("add load case "+name, k, func(m *fem.Model) error {
		if len(m.Cases) == 0 {
			*m = ownLoadsAsCase(*m)
		}
		m.Cases = append(m.Cases, fem.LoadCase{Name: name})
		return nil
	})
}

// ownLoadsAsCase is m, a model without cases, with its loads in one case
// named "loads": its own loads and temperature, its self-weight, its
// supports' settlements and its segments' temperature differences where it
// has them.
func ownLoadsAsCase(m fem.Model) fem.Model {
	lc := fem.LoadCase{Name: m.LoadSetName(0), PointLoads: m.PointLoads, DistributedLoad: m.DistributedLoad,
		TemperatureChange: m.TemperatureChange, SelfWeight: m.Gravity != [2]float64{}}
	for _, s := range m.Supports {
		lc.Settlements = lc.Settlements || s.Settlement != [3]float64{}
	}
	for _, sg := range m.Segments {
		lc.ThermalGradient = lc.ThermalGradient || sg.TemperatureDifference != 0
	}
	m.PointLoads, m.DistributedLoad, m.TemperatureChange = nil, nil, 0
	m.Cases = []fem.LoadCase{lc}
	return m
}

// renameCase asks for a new name of the case edited.
func (w *Window) renameCase() {
	m := w.canonicalModel()
	if len(m.Cases) == 0 {
		w.setStatus("the model has no load cases yet: Add one first")
		return
	}
	k := w.editCase
	entry := newEscEntry()
	entry.SetText(m.Cases[k].Name)
	w.showForm("Rename the load case", "Rename", []*widget.FormItem{widget.NewFormItem("Name", entry)}, func(ok bool) {
		if ok {
			name := strings.TrimSpace(entry.Text)
			w.changeCases("rename load case "+m.Cases[k].Name+" to "+name, k, func(m *fem.Model) error {
				m.Cases[k].Name = name
				return nil
			})
		}
	})
}

// deleteCase deletes the case edited, with its loads, and its factors
// from every combination.
func (w *Window) deleteCase() {
	m := w.canonicalModel()
	if len(m.Cases) == 0 {
		w.setStatus("the model has no load cases to delete")
		return
	}
	k := w.editCase
	err := w.changeCases("delete load case "+m.Cases[k].Name, max(k-1, 0), func(m *fem.Model) error {
		m.Cases = append(m.Cases[:k], m.Cases[k+1:]...)
		for i := range m.Combinations {
			cb := &m.Combinations[i]
			var kept []fem.CaseFactor
			for _, f := range cb.Factors {
				if f.Case != k {
					f.Case = afterDeletion(f.Case, k)
					kept = append(kept, f)
				}
			}
			cb.Factors = kept
		}
		var combos []fem.Combination
		for _, cb := range m.Combinations {
			if len(cb.Factors) > 0 {
				combos = append(combos, cb)
			}
		}
		m.Combinations = combos
		if len(m.Cases) == 0 {
			m.Combinations = nil
		}
		return nil
	})
	if err == nil {
		w.setShow(shownAfterDeletion(w.show, k, m, w.project.Model))
	}
}

// deleteTrain removes train t from the project and from every combination
// that takes it, in the model and in the undo history alike: trains are not
// undone, so no model there may name one that is gone, or name by its old
// number a train that moved up. The trains after it are numbered one lower.
func (w *Window) deleteTrain(t int) {
	ts := w.project.Trains
	w.project.Trains = append(ts[:t:t], ts[t+1:]...)
	for _, stack := range [][]edit{w.hist.done, w.hist.undone} {
		for i := range stack {
			e := &stack[i]
			e.before.Combinations = withoutTrain(e.before.Combinations, t)
			e.after.Combinations = withoutTrain(e.after.Combinations, t)
		}
	}
	m := w.project.Model.Clone()
	m.Combinations = withoutTrain(m.Combinations, t)
	w.project.Model = m
	w.trainsChanged()
	w.modelChanged()
}

// withoutTrain is combos with train t taken out and the trains after it
// numbered one lower, in new slices: models sharing combos keep theirs.
func withoutTrain(combos []fem.Combination, t int) []fem.Combination {
	if combos == nil {
		return nil
	}
	out := make([]fem.Combination, len(combos))
	for i, cb := range combos {
		cb.Trains = nil
		for _, f := range combos[i].Trains {
			if f.Train != t {
				f.Train = afterDeletion(f.Train, t)
				cb.Trains = append(cb.Trains, f)
			}
		}
		out[i] = cb
	}
	return out
}

// afterDeletion is index i of a list, other than k, once item k is
// deleted from it: one lower past k.
func afterDeletion(i, k int) int {
	if i > k {
		return i - 1
	}
	return i
}

// shownAfterDeletion is what to show of after, the model before with case
// k deleted, in place of s, shown before: the same case or combination
// where it still is, else the envelope.
func shownAfterDeletion(s analysis.Show, k int, before, after fem.Model) analysis.Show {
	envelope := analysis.Show{Kind: analysis.ShowEnvelope}
	switch s.Kind {
	case analysis.ShowCase:
		if s.Index == k || len(after.Cases) == 0 {
			return envelope
		}
		return analysis.Show{Kind: analysis.ShowCase, Index: afterDeletion(s.Index, k)}
	case analysis.ShowCombination:
		was := before.EnvelopeCombinations()
		if s.Index < 0 || s.Index >= len(was) {
			return envelope
		}
		for i, cb := range after.EnvelopeCombinations() {
			if cb.Name == was[s.Index].Name {
				return analysis.Show{Kind: analysis.ShowCombination, Index: i}
			}
		}
	}
	return envelope
}

// setCaseFlag sets one flag of the case edited.
func (w *Window) setCaseFlag(label string, on bool, set func(lc *fem.LoadCase, on bool)) {
	k := w.editCase
	w.changeCases(fmt.Sprintf("%s of load case %s: %v", label, w.project.Model.Cases[k].Name, on), k, func(m *fem.Model) error {
		set(&m.Cases[k], on)
		if label == "self-weight" && on && m.Gravity == [2]float64{} {
			m.Gravity = [2]float64{0, -fem.StandardGravity}
		}
		return nil
	})
}

// setShow picks what the drawing, the readout and the checks show.
func (w *Window) setShow(s analysis.Show) {
	if s == w.show {
		return
	}
	w.show = s
	w.resubmit()
	w.ui.cases.refresh()
	w.setStatus("showing %s", s.Title(&w.project.Model))
}

// showCombinations edits the combinations in a table: a row per
// combination with its name and kind, a column per case and per named
// moving load train holding its factor (empty: it is not taken).
func (w *Window) showCombinations() {
	if len(w.project.Model.Cases) == 0 {
		w.setStatus("the model has no load cases to combine: Add a case first")
		return
	}
	w.showDialog(w.newCombinationsDialog().dialog)
}

// combinationsDialog is the dialog of the combinations' table.
type combinationsDialog struct {
	dialog       dialog.Dialog
	table        *combinationTable
	scroll       *container.Scroll // holds the table
	message      *widget.Label     // why the table was not kept
	addRow, keep *dialogButton
}

// newCombinationsDialog makes the dialog on the model's combinations; a
// table it cannot keep is refused there, with the reason, and the dialog
// stays open.
func (w *Window) newCombinationsDialog() *combinationsDialog {
	cd := &combinationsDialog{table: newCombinationTable(w.canonicalModel(), w.project.Trains, w.escape), message: widget.NewLabel("")}
	t := cd.table
	cd.message.Wrapping = fyne.TextWrapWord
	cd.message.Importance = widget.DangerImportance
	note := widget.NewLabel("Factors are yours: take them from your local code. The template rows are typical values only (" + templateNote + ").")
	note.Wrapping = fyne.TextWrapWord
	// The rows keep their own height; new ones come into sight.
	cd.scroll = container.NewScroll(container.NewVBox(t.grid))
	followFocus(cd.scroll)
	added := func() {
		followFocus(cd.scroll)
		cd.scroll.Refresh()
		cd.scroll.ScrollToBottom()
	}
	cd.keep = w.newDialogButton("Keep these combinations", func() {
		combos, err := t.combinations()
		if err == nil {
			err = w.changeCases("edit the combinations", w.editCase, func(m *fem.Model) error {
				m.Combinations = combos
				return nil
			})
		}
		if err != nil {
			cd.message.SetText(err.Error())
			return
		}
		cd.message.SetText("")
		cd.dialog.Hide()
	})
	cd.addRow = w.newDialogButton("Add a row", func() { t.addRow(fem.Combination{Kind: fem.Strength}); added() })
	body := container.NewBorder(note, container.NewVBox(cd.message, container.NewHBox(
		cd.addRow, w.newDialogButton("Add typical templates", func() { t.addTemplates(); added() }), cd.keep)), nil, nil, cd.scroll)
	cd.dialog, _ = w.newDialog("Combinations", body, choice{label: "Cancel"})
	cd.dialog.Resize(fyne.NewSize(760, 560)) // fits a 1280 × 720 screen
	return cd
}

// templateNote marks every template.
const templateNote = "typical; use the factors your local code gives"

// combinationTable is the grid of the combinations dialog: a column per
// case and per named moving load train (a file names a train in a
// combination by its name).
type combinationTable struct {
	cases  []string
	trains []int // the project's trains that have a name, by index
	// trainHeads are the headings of the trains' columns, which a
	// refused factor is placed by.
	trainHeads []string
	grid       *fyne.Container
	rows       []combinationRow
	escape     func() // what Escape in an entry does
}

type combinationRow struct {
	name    *escEntry
	kind    *escSelect
	label   string
	factors []*escEntry // per case
	trains  []*escEntry // per named train (combinationTable.trains)
}

var kindNames = []string{fem.Strength.String(), fem.Serviceability.String(), fem.OtherCombination.String()}

func newCombinationTable(m fem.Model, trains []moving.Train, escape func()) *combinationTable {
	t := &combinationTable{escape: escape}
	for _, c := range m.Cases {
		t.cases = append(t.cases, c.Name)
	}
	for i, tr := range trains {
		if tr.Name != "" {
			t.trains = append(t.trains, i)
		}
	}
	t.grid = container.NewGridWithColumns(len(t.cases) + len(t.trains) + 2)
	t.grid.Add(heading("combination"))
	t.grid.Add(heading("kind"))
	for _, n := range t.cases {
		t.grid.Add(heading(n))
	}
	for _, i := range t.trains {
		t.trainHeads = append(t.trainHeads, "train "+trains[i].Name)
		t.grid.Add(heading(t.trainHeads[len(t.trainHeads)-1]))
	}
	for _, cb := range m.Combinations {
		t.addRow(cb)
	}
	return t
}

// newEntry is an entry of the table.
func (t *combinationTable) newEntry() *escEntry {
	e := newEscEntry()
	e.OnEscape = t.escape
	return e
}

// addRow adds a row showing cb.
func (t *combinationTable) addRow(cb fem.Combination) {
	r := combinationRow{name: t.newEntry(), kind: newEscSelect(kindNames, nil), label: cb.Label}
	r.kind.OnEscape = t.escape
	r.name.SetText(cb.Name)
	r.kind.SetSelected(cb.Kind.String())
	t.grid.Add(r.name)
	t.grid.Add(r.kind)
	for k := range t.cases {
		e := t.newEntry()
		for _, f := range cb.Factors {
			if f.Case == k {
				e.SetText(factorText(f.Factor))
			}
		}
		r.factors = append(r.factors, e)
		t.grid.Add(e)
	}
	for _, i := range t.trains {
		e := t.newEntry()
		for _, f := range cb.Trains {
			if f.Train == i {
				e.SetText(factorText(f.Factor))
			}
		}
		r.trains = append(r.trains, e)
		t.grid.Add(e)
	}
	t.rows = append(t.rows, r)
}

// factorText is factor f as a cell of the table shows it, a zero of
// either sign as 0 (report.PlainZero).
func factorText(f float64) string {
	return strconv.FormatFloat(report.PlainZero(f), 'g', -1, 64)
}

// addTemplates adds two typical rows over every case: a strength row
// (1.35 on the first case, 1.5 on the others) and a serviceability row
// (1 on each), both marked typical.
func (t *combinationTable) addTemplates() {
	strength := fem.Combination{Name: fmt.Sprintf("strength %d", len(t.rows)+1), Kind: fem.Strength, Label: "strength (" + templateNote + ")"}
	service := fem.Combination{Name: fmt.Sprintf("serviceability %d", len(t.rows)+2), Kind: fem.Serviceability, Label: "serviceability (" + templateNote + ")"}
	for k := range t.cases {
		f := 1.5
		if k == 0 {
			f = 1.35
		}
		strength.Factors = append(strength.Factors, fem.CaseFactor{Case: k, Factor: f})
		service.Factors = append(service.Factors, fem.CaseFactor{Case: k, Factor: 1})
	}
	t.addRow(strength)
	t.addRow(service)
}

// combinations reads the table; rows with no name and no factor (of a
// case or a train) are left out. A factor that is not a number is refused with its place.
func (t *combinationTable) combinations() ([]fem.Combination, error) {
	var out []fem.Combination
	for i, r := range t.rows {
		cb := fem.Combination{Name: strings.TrimSpace(r.name.Text), Label: r.label}
		cb.Kind, _ = fem.ParseCombinationKind(r.kind.Selected)
		// factor reads one cell: ok false for an empty one.
		factor := func(e *escEntry, column string) (f float64, ok bool, err error) {
			s := strings.TrimSpace(e.Text)
			if s == "" {
				return 0, false, nil
			}
			if f, err = strconv.ParseFloat(s, 64); err != nil {
				return 0, false, fmt.Errorf("row %d, %s: %q is not a factor; enter a number such as 1.35, or leave the cell empty", i+1, column, s)
			}
			return report.PlainZero(f), true, nil
		}
		for k, e := range r.factors {
			f, ok, err := factor(e, t.cases[k])
			if err != nil {
				return nil, err
			}
			if ok {
				cb.Factors = append(cb.Factors, fem.CaseFactor{Case: k, Factor: f})
			}
		}
		for j, e := range r.trains {
			f, ok, err := factor(e, t.trainHeads[j])
			if err != nil {
				return nil, err
			}
			if ok {
				cb.Trains = append(cb.Trains, fem.TrainFactor{Train: t.trains[j], Factor: f})
			}
		}
		if cb.Name == "" && len(cb.Factors) == 0 && len(cb.Trains) == 0 {
			continue
		}
		out = append(out, cb)
	}
	return out, nil
}
