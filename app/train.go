package app

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// The moving-loads window: a train defined in a small table, drawn on the
// member and dragged along it while the chosen field follows; the envelope
// of that field over all the train's positions; and the influence line of
// the field at the point under the mouse (or pinned by a click, or a
// support's reaction chosen from a list) with the train's worst positions
// for it. Trains are the project's (storage.Project.Trains): editing one
// here changes the project, which then has unsaved changes. The envelope is
// worked out in the background, latest request wins; the rest is quick
// enough to follow the mouse.
type movingWindow struct {
	w   *Window
	win fyne.Window

	index int // the train shown, in w.project.Trains; −1 for none

	// The form.
	trainSelect *escSelect
	name        *escEntry
	direction   *escSelect
	offEnds     *escCheck
	from, to    *escEntry
	step        *escEntry
	axles       *fyne.Container
	axleRows    []axleRow
	formScroll  *container.Scroll // holds the form: laid out again when rows change
	uniform     [3]*escEntry      // load, start, length
	// The labels that name units: the axle table's heading and each
	// number's (showUnits).
	axlesHeading *widget.Label
	unitLabels   []unitLabel
	// shown holds the numbers the form wrote, so a field left as it was
	// reads back the train's own value, not its four figures.
	shown map[*escEntry]shownNumber

	quantity     *escSelect
	targetSelect *escSelect
	// withSelect offers the train alone or a combination that takes it;
	// withNames are the combinations it offers after the train alone.
	withSelect *escSelect
	withNames  []string
	point      *escEntry // where the line of a field is, typed (pinAt)
	pic        *movingPicture
	readout    *widget.Label
	status     *widget.Label

	// What is shown.
	quantityIndex int    // into moving.EnvelopeQuantities
	with          string // the combination shown with the train; "" for the train alone
	reaction      int    // the support whose reaction's line is shown, or −1
	pinned        bool
	pointX        float64 // where the line reads the quantity, m
	hoverX        float64
	hovering      bool

	// Results, for the model and train they were found for.
	member *fem.Member
	infl   *moving.Influence
	mesh   fem.Mesh
	env    *moving.Envelope
	// combined is the combination with, whose envelope env is, once found;
	// nil for the train alone.
	combined *report.TrainCombination
	line     *moving.Line
	worst    []moving.Extreme
	at       moving.Placement
	current  []float64
	seq      uint64 // of the newest change followed: an envelope asked for before it is stale
}

// shownNumber is a number the form wrote: its text, and the value (SI)
// it stands for.
type shownNumber struct {
	text  string
	value float64
}

// axleRow is one row of the axle table.
type axleRow struct {
	number        *widget.Label
	load, spacing *escEntry
	row           *fyne.Container
}

// showMovingLoads opens the moving-loads window, or brings it to the front.
func (w *Window) showMovingLoads() {
	if len(w.project.Model.Segments) == 0 {
		w.setStatus("moving loads need a member: draw one first")
		return
	}
	if w.moving != nil {
		w.moving.win.RequestFocus()
		return
	}
	mw := &movingWindow{w: w, index: -1, reaction: -1, quantityIndex: slices.Index(moving.EnvelopeQuantities, fem.QBendingMoment),
		shown: map[*escEntry]shownNumber{}}
	mw.win = w.app.NewWindow("Stave — moving loads")
	mw.build()
	mw.win.SetOnClosed(func() { w.moving = nil })
	mw.win.Canvas().SetOnTypedKey(func(k *fyne.KeyEvent) {
		if k.Name == fyne.KeyEscape {
			mw.win.Close()
		}
	})
	w.moving = mw
	if len(w.project.Trains) > 0 {
		mw.choose(0)
	} else {
		mw.modelChanged()
	}
	mw.win.Resize(fyne.NewSize(startWidth, startHeight))
	mw.win.Show()
}

// newEntry is an empty single-line entry of the window. Escape closes
// the window wherever the focus is in it, as it closes a dialog of the
// main window, where before it did nothing: its entries, selects, check
// box, buttons and picture hand it on, and with the focus nowhere the
// window's canvas takes it (showMovingLoads). What was typed and not
// applied goes unused, as with a dialog's Cancel; the open list of a
// select takes the first Escape itself and closes alone.
func (mw *movingWindow) newEntry() *escEntry {
	e := newEscEntry()
	e.OnEscape = mw.win.Close
	return e
}

// newSelect is a select of the window of options calling changed on a change.
func (mw *movingWindow) newSelect(options []string, changed func(string)) *escSelect {
	s := newEscSelect(options, changed)
	s.OnEscape = mw.win.Close
	return s
}

// newButton is a button of the window reading label that runs tapped;
// Enter presses it, as Space does (dialogButton).
func (mw *movingWindow) newButton(label string, tapped func()) *dialogButton {
	b := mw.w.newDialogButton(label, tapped)
	b.onEscape = mw.win.Close
	return b
}

func (mw *movingWindow) build() {
	mw.readout = widget.NewLabel("")
	mw.readout.Wrapping = fyne.TextWrapWord
	mw.status = widget.NewLabel("")
	mw.status.Wrapping = fyne.TextWrapWord
	mw.pic = newMovingPicture(mw)
	mw.trainSelect = mw.newSelect(nil, func(s string) {
		if i := slices.Index(mw.trainSelect.Options, s); i >= 0 && i != mw.index {
			mw.choose(i)
		}
	})
	mw.name = mw.newEntry()
	mw.direction = mw.newSelect([]string{"both", "forward", "backward"}, nil)
	mw.offEnds = newEscCheck("Drives on and off at the ends", nil)
	mw.offEnds.OnEscape = mw.win.Close
	mw.from, mw.to, mw.step = mw.newEntry(), mw.newEntry(), mw.newEntry()
	mw.to.SetPlaceHolder("the member's end")
	mw.step.SetPlaceHolder("from the mesh")
	for i := range mw.uniform {
		mw.uniform[i] = mw.newEntry()
	}
	mw.uniform[0].SetPlaceHolder("none")
	mw.axles = container.NewVBox()
	for _, e := range append([]*escEntry{mw.name, mw.from, mw.to, mw.step}, mw.uniform[:]...) {
		mw.submits(e)
	}
	form := container.New(layout.NewFormLayout(),
		widget.NewLabel("Name"), mw.name,
		widget.NewLabel("Moves"), mw.direction,
		mw.unitLabel("From x", units.Position), mw.from,
		mw.unitLabel("To x", units.Position), mw.to,
		mw.unitLabel("Step", units.Position), mw.step,
	)
	// The heading wraps and the switch has a row of its own, so that
	// neither widens the form beyond its share of a small screen.
	mw.axlesHeading = heading("")
	mw.axlesHeading.Wrapping = fyne.TextWrapWord
	uniform := container.New(layout.NewFormLayout(),
		mw.unitLabel("Load", units.LineLoad), mw.uniform[0],
		mw.unitLabel("Behind the front", units.Position), mw.uniform[1],
		mw.unitLabel("Length", units.Position), mw.uniform[2],
	)
	mw.showUnits()
	left := container.NewVBox(
		heading("Train"),
		container.NewBorder(nil, nil, nil, container.NewHBox(
			mw.newButton("New", mw.newTrain), mw.newButton("Delete", mw.deleteTrain)), mw.trainSelect),
		form,
		mw.offEnds,
		mw.axlesHeading,
		mw.axles,
		mw.newButton("Add an axle", func() { mw.addAxleRow(moving.Axle{}); mw.rowsChanged() }),
		heading("Uniform load moving with it"),
		uniform,
		mw.newButton("Apply", mw.apply),
	)
	names := make([]string, len(moving.EnvelopeQuantities))
	for i, q := range moving.EnvelopeQuantities {
		names[i] = q.String()
	}
	mw.quantity = mw.newSelect(names, nil)
	mw.quantity.SetSelected(names[mw.quantityIndex])
	mw.quantity.OnChanged = func(s string) {
		mw.quantityIndex = slices.Index(names, s)
		mw.showLine()
	}
	mw.withSelect = mw.newSelect(nil, func(s string) {
		name := ""
		if k := slices.Index(mw.withSelect.Options, s); k > 0 {
			name = mw.withNames[k-1]
		}
		if name != mw.with {
			mw.with = name
			mw.modelChanged()
		}
	})
	mw.targetSelect = mw.newSelect(nil, nil)
	mw.targetSelect.OnChanged = func(s string) {
		mw.reaction = slices.Index(mw.targetSelect.Options, s) - 1
		mw.showLine()
	}
	warning := widget.NewLabelWithStyle(caution, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	warning.Importance = widget.WarningImportance
	warning.Wrapping = fyne.TextWrapWord
	wide := func(o fyne.CanvasObject, w float32) fyne.CanvasObject {
		return container.NewGridWrap(fyne.NewSize(w, o.MinSize().Height), o)
	}
	mw.point = mw.newEntry()
	mw.point.SetPlaceHolder("under the mouse")
	mw.point.OnSubmitted = mw.pinAt
	top := newFlow(widget.NewLabel("Field"), wide(mw.quantity, 190), widget.NewLabel("Envelope of"), wide(mw.withSelect, 300),
		widget.NewLabel("Influence line of"), wide(mw.targetSelect, 380),
		container.NewHBox(widget.NewLabel("at x"), wide(mw.point, 150)), mw.newButton("Worst position", mw.toWorst))
	hint := widget.NewLabel("Drag the train, or ← → on the picture (Tab to it); a click pins the influence line, another frees it.")
	hint.Wrapping = fyne.TextWrapWord
	// The controls come last: the canvas lays a container out again for
	// one child whose minimum size changed per pass, the last it meets,
	// and when the window shrinks both the controls (into more rows) and
	// the readout below change; with the controls first the picture kept
	// its place under two rows while they took three, and lay under them.
	below := container.NewVBox(mw.readout, hint)
	center := container.New(layout.NewBorderLayout(top, below, nil, nil), mw.pic, below, top)
	// fyne draws the scroll bar over the content's right edge, where the
	// fields, Delete and the axles' × ran under it and looked cut off.
	mw.formScroll = container.NewVScroll(container.New(layout.NewCustomPaddedLayout(0, 0, 0, theme.ScrollBarSize()), left))
	followFocus(mw.formScroll)
	split := container.NewHSplit(mw.formScroll, center)
	split.SetOffset(0.27)
	mw.win.SetContent(container.NewBorder(nil, container.NewVBox(widget.NewSeparator(), mw.status, warning), nil, nil, split))
}

// unitLabel is the label of a number of kind k in the form, named and
// given its unit by showUnits.
type unitLabel struct {
	label *widget.Label
	name  string
	kind  units.Kind
}

// unitLabel makes the label name of a number of kind k, its unit to be shown.
func (mw *movingWindow) unitLabel(name string, k units.Kind) *widget.Label {
	l := widget.NewLabel(name)
	mw.unitLabels = append(mw.unitLabels, unitLabel{l, name, k})
	return l
}

// showUnits names the window's units in the labels that say them.
func (mw *movingWindow) showUnits() {
	u := mw.w.units
	mw.axlesHeading.SetText(fmt.Sprintf("Axles, front first (load in %s, spacing from the axle before in %s)", u.Unit(units.Force).Symbol, u.Unit(units.Position).Symbol))
	for _, l := range mw.unitLabels {
		l.label.SetText(l.name + " (" + u.Unit(l.kind).Symbol + ")")
	}
}

// unitsChanged shows the train in the window's new units: the numbers of
// the form are written again in them (a number typed and not applied is
// dropped, as the properties of the window drop theirs), and the labels,
// the choices and the readout name them.
func (mw *movingWindow) unitsChanged() {
	mw.showUnits()
	mw.showPoint()
	if mw.index >= 0 {
		mw.choose(mw.index)
		return
	}
	mw.modelChanged()
}

// refreshChoices lists the trains and the reactions a line may be of.
func (mw *movingWindow) refreshChoices() {
	var names []string
	for i := range mw.w.project.Trains {
		names = append(names, mw.w.project.Trains[i].Label(i))
	}
	mw.trainSelect.Options = names
	if mw.index >= 0 && mw.index < len(names) {
		mw.trainSelect.Selected = names[mw.index]
	} else {
		mw.trainSelect.Selected = ""
	}
	mw.trainSelect.Refresh()
	opts := []string{"the field at the point under the mouse"}
	for i, s := range mw.w.project.Model.Supports {
		if s.Holds(fem.Transverse) {
			opts = append(opts, fmt.Sprintf("the reaction of support %d (%s at %s)", i+1, s.Kind, mw.w.units.Format(units.Position, s.X)))
		}
	}
	mw.targetSelect.Options = opts
	if mw.reaction+1 >= len(opts) {
		mw.reaction = -1
	}
	mw.targetSelect.Selected = opts[mw.reaction+1]
	mw.targetSelect.Refresh()
	with := []string{"the train alone"}
	mw.withNames = nil
	for _, cb := range mw.w.project.Model.Combinations {
		for _, tf := range cb.Trains {
			if mw.index >= 0 && tf.Train == mw.index {
				mw.withNames = append(mw.withNames, cb.Name)
				with = append(with, fmt.Sprintf("combination %q, train × %s", cb.Name, units.FormatNumber(tf.Factor)))
			}
		}
	}
	k := slices.Index(mw.withNames, mw.with)
	if k < 0 {
		mw.with = ""
	}
	mw.withSelect.Options = with
	mw.withSelect.Selected = with[k+1]
	mw.withSelect.Refresh()
}

// supportOf is the support index of reaction choice k (−1 for none).
func (mw *movingWindow) supportOf(k int) int {
	n := -1
	for i, s := range mw.w.project.Model.Supports {
		if s.Holds(fem.Transverse) {
			n++
			if n == k {
				return i
			}
		}
	}
	return -1
}

// choose shows train i of the project in the form.
func (mw *movingWindow) choose(i int) {
	mw.index = i
	t := mw.w.project.Trains[i]
	mw.name.SetText(t.Name)
	mw.direction.SetSelected(t.Direction.String())
	mw.setNumber(mw.from, units.Position, t.From, false)
	mw.setNumber(mw.to, units.Position, t.To, true)
	mw.offEnds.SetChecked(t.OffEnds)
	mw.setNumber(mw.step, units.Position, t.Step, true)
	mw.setAxleRows(t.Axles)
	mw.setNumber(mw.uniform[0], units.LineLoad, t.Uniform.Load, true)
	mw.setNumber(mw.uniform[1], units.Position, t.Uniform.Start, t.Uniform.Load == 0)
	mw.setNumber(mw.uniform[2], units.Position, t.Uniform.Length, t.Uniform.Load == 0)
	mw.modelChanged()
}

// setNumber writes v, of kind k, in e in display units without the unit
// symbol, or nothing for a zero that means "not given" (empty), and keeps
// it for number.
func (mw *movingWindow) setNumber(e *escEntry, k units.Kind, v float64, empty bool) {
	text := ""
	if v != 0 || !empty {
		text = units.FormatNumber(mw.w.units.ToDisplay(k, v))
	}
	mw.shown[e] = shownNumber{text, v}
	e.SetText(text)
}

// number reads e as a value of kind k, SI: the value setNumber wrote while
// its text is as written, else what is typed there (0 for nothing, when
// optional).
func (mw *movingWindow) number(e *escEntry, k units.Kind, optional bool) (float64, error) {
	empty := strings.TrimSpace(e.Text) == ""
	if s, ok := mw.shown[e]; ok && e.Text == s.text && !empty {
		return s.value, nil
	}
	if optional && empty {
		return 0, nil
	}
	return mw.w.units.Parse(k, e.Text) // says what an empty field lacks
}

// setAxleRows fills the axle table with a row per axle.
func (mw *movingWindow) setAxleRows(axles []moving.Axle) {
	for _, r := range mw.axleRows {
		delete(mw.shown, r.load)
		delete(mw.shown, r.spacing)
	}
	mw.axles.RemoveAll()
	mw.axleRows = nil
	for _, a := range axles {
		mw.addAxleRow(a)
	}
	mw.rowsChanged()
}

func (mw *movingWindow) addAxleRow(a moving.Axle) {
	r := axleRow{number: widget.NewLabel(strconv.Itoa(len(mw.axleRows) + 1)), load: mw.newEntry(), spacing: mw.newEntry()}
	mw.submits(r.load)
	mw.submits(r.spacing)
	r.load.SetPlaceHolder("load")
	r.spacing.SetPlaceHolder("spacing")
	mw.setNumber(r.load, units.Force, a.Load, true)
	if len(mw.axleRows) == 0 {
		mw.makeFront(r)
	} else {
		mw.setNumber(r.spacing, units.Position, a.Spacing, true)
	}
	remove := mw.newButton("×", nil)
	r.row = container.NewBorder(nil, nil, r.number, remove, container.NewGridWithColumns(2, r.load, r.spacing))
	remove.OnTapped = func() { mw.removeAxleRow(r.row) }
	mw.axleRows = append(mw.axleRows, r)
	mw.axles.Add(r.row)
}

// makeFront makes r the axle table's first row, the front axle's, which
// has no spacing to type.
func (mw *movingWindow) makeFront(r axleRow) {
	delete(mw.shown, r.spacing)
	r.spacing.SetText("")
	r.spacing.SetPlaceHolder("(the front)")
	r.spacing.Disable()
}

// removeAxleRow takes the axle row row out of the table and leaves the
// others as typed, numbered again: the table is not read, so a field that
// cannot be read stays as it is (reading it, and writing the rows again
// from what was read, dropped every row from such a field on). When the
// front row goes, the next becomes the front.
func (mw *movingWindow) removeAxleRow(row *fyne.Container) {
	k := slices.IndexFunc(mw.axleRows, func(o axleRow) bool { return o.row == row })
	if k < 0 {
		return
	}
	r := mw.axleRows[k]
	delete(mw.shown, r.load)
	delete(mw.shown, r.spacing)
	mw.axleRows = slices.Delete(mw.axleRows, k, k+1)
	mw.axles.Remove(row)
	for i, o := range mw.axleRows {
		o.number.SetText(strconv.Itoa(i + 1))
	}
	if k == 0 && len(mw.axleRows) > 0 {
		mw.makeFront(mw.axleRows[0])
	}
	mw.rowsChanged()
}

// rowsChanged lays the form out again for the axle table's new rows,
// which the form's scroll then brings into sight as they gain the focus.
func (mw *movingWindow) rowsChanged() {
	if mw.formScroll == nil {
		return // still being built
	}
	followFocus(mw.formScroll)
	mw.formScroll.Content.Refresh()
	mw.formScroll.Refresh()
}

// submits makes Enter in e apply the form, as Enter does in the
// window's properties: at 1280 × 720 the Apply button is below the fold.
func (mw *movingWindow) submits(e *escEntry) {
	e.OnSubmitted = func(string) { mw.apply() }
}

// readAxles reads the axle table; a row left empty is skipped.
func (mw *movingWindow) readAxles() ([]moving.Axle, error) {
	var out []moving.Axle
	for i, r := range mw.axleRows {
		if strings.TrimSpace(r.load.Text) == "" && strings.TrimSpace(r.spacing.Text) == "" {
			continue
		}
		var a moving.Axle
		var err error
		if a.Load, err = mw.number(r.load, units.Force, false); err != nil {
			return out, fmt.Errorf("axle %d, load: %v", i+1, err)
		}
		if len(out) > 0 {
			if a.Spacing, err = mw.number(r.spacing, units.Position, false); err != nil {
				return out, fmt.Errorf("axle %d, spacing: %v", i+1, err)
			}
		}
		out = append(out, a)
	}
	return out, nil
}

// readTrain reads the form into a train.
func (mw *movingWindow) readTrain() (moving.Train, error) {
	t := moving.Train{Name: strings.TrimSpace(mw.name.Text)}
	d, _ := moving.ParseDirection(mw.direction.Selected)
	t.Direction = d
	t.OffEnds = mw.offEnds.Checked
	read := func(e *escEntry, k units.Kind, what string) (float64, error) {
		v, err := mw.number(e, k, true)
		if err != nil {
			return 0, fmt.Errorf("%s: %v", what, err)
		}
		return v, nil
	}
	var err error
	if t.Axles, err = mw.readAxles(); err != nil {
		return t, err
	}
	fields := []struct {
		e    *escEntry
		k    units.Kind
		what string
		v    *float64
	}{
		{mw.from, units.Position, "from", &t.From}, {mw.to, units.Position, "to", &t.To}, {mw.step, units.Position, "step", &t.Step},
		{mw.uniform[0], units.LineLoad, "uniform load", &t.Uniform.Load}, {mw.uniform[1], units.Position, "uniform load start", &t.Uniform.Start},
		{mw.uniform[2], units.Position, "uniform load length", &t.Uniform.Length},
	}
	for _, f := range fields {
		if *f.v, err = read(f.e, f.k, f.what); err != nil {
			return t, err
		}
	}
	return t, nil
}

// apply puts the form's train into the project when it is sound.
func (mw *movingWindow) apply() {
	if mw.index < 0 {
		mw.newTrain()
		return
	}
	t, err := mw.readTrain()
	if err == nil {
		err = t.Check(mw.w.project.Model.Length(), mw.index, mw.w.units)
	}
	if err != nil {
		mw.status.SetText("not applied: " + err.Error())
		return
	}
	mw.w.project.Trains[mw.index] = t
	mw.w.trainsChanged()
	mw.status.SetText("applied " + t.Label(mw.index))
	mw.modelChanged()
}

// newTrain adds a two-axle train to the project and shows it.
func (mw *movingWindow) newTrain() {
	L := mw.w.project.Model.Length()
	spacing := min(2, L/4)
	t := moving.Train{Name: fmt.Sprintf("train %d", len(mw.w.project.Trains)+1),
		Axles: []moving.Axle{{Load: 10e3}, {Load: 10e3, Spacing: spacing}}}
	mw.w.project.Trains = append(mw.w.project.Trains, t)
	mw.w.trainsChanged()
	mw.choose(len(mw.w.project.Trains) - 1)
}

// deleteTrain removes the train shown from the project.
func (mw *movingWindow) deleteTrain() {
	if mw.index < 0 {
		return
	}
	i := mw.index
	mw.index = -1
	mw.w.deleteTrain(i)
	if len(mw.w.project.Trains) > 0 {
		mw.choose(0)
		return
	}
	mw.env, mw.line, mw.worst, mw.current = nil, nil, nil, nil
	mw.modelChanged()
}

// modelChanged works out the member's influence lines again and, in the
// background, the shown train's envelope.
func (mw *movingWindow) modelChanged() {
	// Whatever changed, an envelope asked for before is stale, also when
	// none is asked for now (no train left, no influence lines, a train
	// that does not fit): it would be taken for the train shown.
	mw.seq++
	mw.refreshChoices()
	mw.member, mw.infl, mw.env, mw.combined = nil, nil, nil, nil
	// The member as files and the command line have it, every load in
	// its case; one the window still lets be refused (a case not yet
	// given loads) has the same lines without its loads.
	p := mw.w.canonical()
	loaded := p // the combinations' cases need their loads
	member, infl, err := report.InfluenceOf(&p, mw.w.units)
	if err != nil {
		p.Model = moving.Unloaded(&p.Model)
		member, infl, err = report.InfluenceOf(&p, mw.w.units)
	}
	if err == nil {
		mw.member, mw.mesh, mw.infl = member, member.Mesh(), infl
	}
	if err != nil {
		mw.status.SetText("no influence lines: " + err.Error())
		mw.pic.Refresh()
		return
	}
	mw.showLine()
	if mw.index < 0 {
		mw.status.SetText("no train yet: press New to add one")
		return
	}
	// The envelope's goroutine reads its own copy: the axles of the
	// project's train may change while it runs.
	t := moving.CloneTrains(mw.w.project.Trains[mw.index : mw.index+1])[0]
	if err := t.Check(p.Model.Length(), mw.index, mw.w.units); err != nil {
		mw.status.SetText(err.Error())
		return
	}
	seq, infl, mesh, index, with := mw.seq, mw.infl, mw.mesh, mw.index, mw.with
	go func() {
		env, err := infl.Envelope(&t, mesh, nil)
		var tc *report.TrainCombination
		if err == nil && with != "" {
			tc, err = combinationOf(&loaded, index, infl, mesh, env, with)
		}
		mw.w.post(func() { mw.envelopeReady(seq, env, tc, err) })
	}()
}

// combinationOf is the combination named name with train i's envelope e
// on top of its cases, as the trains' results give it.
func combinationOf(p *storage.Project, i int, in *moving.Influence, mesh fem.Mesh, e *moving.Envelope, name string) (*report.TrainCombination, error) {
	tcs, err := report.TrainCombinations(p, i, in, mesh, e)
	if err != nil {
		return nil, err
	}
	for k := range tcs {
		if tcs[k].Combination == name {
			return &tcs[k], nil
		}
	}
	return nil, fmt.Errorf("combination %q does not take the train", name)
}

// envelopeReady takes an envelope found in the background, unless the
// model or the train changed since it was asked for.
func (mw *movingWindow) envelopeReady(seq uint64, env *moving.Envelope, tc *report.TrainCombination, err error) {
	if seq != mw.seq {
		return
	}
	if err != nil {
		mw.status.SetText(err.Error())
		return
	}
	mw.env, mw.combined = env, tc
	with := ""
	if tc != nil {
		mw.env, with = tc.Envelope, fmt.Sprintf(", with the cases of combination %q", tc.Combination)
	}
	if !mw.pinned {
		// The line starts where the field is largest.
		hi, _ := mw.peaks()
		mw.pointX = hi.X
	}
	mw.status.SetText(fmt.Sprintf("%s%s: %d positions in each direction it moves, %s apart",
		mw.w.project.Trains[mw.index].Label(mw.index), with, env.Positions, mw.w.units.Format(units.Position, env.Step)))
	mw.showLine()
	mw.toWorst()
}

// pinAt pins the line of the field at the x typed, in display units or
// with a unit, and shows it; nothing typed lets it follow the mouse again.
// A point off the member is refused with the reason.
func (mw *movingWindow) pinAt(text string) {
	if strings.TrimSpace(text) == "" {
		mw.pinned = false
		mw.showLine()
		return
	}
	u := mw.w.units
	x, err := u.Parse(units.Position, text)
	if L := mw.w.project.Model.Length(); err == nil && (x < 0 || x > L) {
		err = fmt.Errorf("x = %s is off the member, which runs from 0 to %s", u.Format(units.Position, x), u.Format(units.Position, L))
	}
	if err != nil {
		mw.status.SetText("influence line at x: " + err.Error())
		return
	}
	if mw.reaction >= 0 {
		mw.targetSelect.SetSelectedIndex(0) // the field's line, not a reaction's
	}
	mw.pinned, mw.pointX = true, x
	mw.showPoint()
	mw.showLine()
}

// showPoint writes the pinned point in its field, or nothing while the
// line follows the mouse.
func (mw *movingWindow) showPoint() {
	text := ""
	if mw.pinned {
		text = units.FormatNumber(mw.w.units.ToDisplay(units.Position, mw.pointX))
	}
	mw.point.SetText(text)
}

// target is the influence line's target now.
func (mw *movingWindow) target() moving.Target {
	if s := mw.supportOf(mw.reaction); s >= 0 {
		return moving.Target{Reaction: true, Support: s, Motion: fem.Transverse}
	}
	x := mw.pointX
	if mw.hovering && !mw.pinned {
		x = mw.hoverX
	}
	return moving.Target{Quantity: moving.EnvelopeQuantities[mw.quantityIndex], X: x, Side: fem.Right}
}

// showLine works out the influence line of the target and the train's
// worst positions for it.
func (mw *movingWindow) showLine() {
	mw.line, mw.worst = nil, nil
	if mw.infl != nil {
		if l, err := mw.infl.Line(mw.target()); err == nil {
			mw.line = l
		}
	}
	if mw.line != nil && mw.env != nil {
		t := mw.w.project.Trains[mw.index]
		if hi, lo, err := mw.infl.Worst(&t, mw.mesh, mw.line.Target); err == nil {
			mw.worst = []moving.Extreme{hi, lo}
		}
	}
	mw.followTrain()
}

// toWorst moves the train to its worst position for the line's target, or
// for the field's largest value when there is no line.
func (mw *movingWindow) toWorst() {
	switch {
	case len(mw.worst) > 0:
		mw.at = mw.worst[0].Placement
	case mw.env != nil:
		hi, _ := mw.peaks()
		mw.at = hi.Placement
	default:
		return
	}
	mw.followTrain()
}

// peaks are the largest and the smallest value of the field shown over
// the member and every position: the combination's, between the stations
// too, when one is shown.
func (mw *movingWindow) peaks() (hi, lo moving.Extreme) {
	q := moving.EnvelopeQuantities[mw.quantityIndex]
	if mw.combined != nil {
		for _, w := range mw.combined.Worst {
			if w.Quantity == q {
				return w.Largest.Extreme(), w.Smallest.Extreme()
			}
		}
	}
	return mw.env.Worst(q)
}

// dragTrain moves the train's front by dx metres from where the drag began,
// to the nearest of its positions.
func (mw *movingWindow) dragTrain(start moving.Placement, dx float64) {
	if mw.env == nil {
		return
	}
	mw.at = mw.env.Nearest(moving.Placement{Direction: start.Direction, Front: start.Front + dx})
	mw.followTrain()
}

// followTrain solves the train where it stands, in closed form, and draws.
func (mw *movingWindow) followTrain() {
	mw.current = nil
	if mw.env != nil && mw.index >= 0 && mw.combined == nil {
		t := mw.w.project.Trains[mw.index]
		tm := t.Model(&mw.w.project.Model, mw.at)
		if e, err := fem.SolveExact(&tm); err == nil {
			q := moving.EnvelopeQuantities[mw.quantityIndex]
			mw.current = make([]float64, len(mw.env.Stations))
			for s, x := range mw.env.Stations {
				f := e.At(x, fem.Right)
				mw.current[s] = q.Of(&f)
			}
		}
	}
	mw.showReadout()
	mw.pic.Refresh()
}

// input is what the picture shows.
func (mw *movingWindow) input() canvas.MovingInput {
	in := canvas.MovingInput{Model: &mw.w.project.Model, Units: mw.w.units, Quantity: mw.quantityIndex,
		Envelope: mw.env, Current: mw.current, Line: mw.line, Worst: mw.worst, At: mw.at,
		HoverX: mw.hoverX, Hovering: mw.hovering}
	if mw.index >= 0 && mw.env != nil {
		in.Train = &mw.w.project.Trains[mw.index]
	}
	if mw.combined != nil && mw.env != nil {
		hi, lo := mw.peaks()
		in.Combination, in.Peaks = mw.combined.Combination, []moving.Extreme{hi, lo}
	}
	return in
}

// showReadout writes the envelope, the train's field and the line at the
// mouse (or the pinned point).
func (mw *movingWindow) showReadout() {
	u := mw.w.units
	x := mw.pointX
	if mw.hovering {
		x = mw.hoverX
	}
	q := moving.EnvelopeQuantities[mw.quantityIndex]
	k := q.Info().Unit
	parts := []string{"x = " + u.Format(units.Position, x)}
	if e := mw.env; e != nil {
		s := nearestStation(e.Stations, x)
		hi, lo := e.MaxAt[mw.quantityIndex][s], e.MinAt[mw.quantityIndex][s]
		what := q.String()
		if mw.combined != nil {
			what = fmt.Sprintf("combination %q with the train, %s", mw.combined.Combination, q)
		}
		// Where the envelope jumps at the station, each extreme says its side.
		station := "the station x = " + u.Format(units.Position, e.Stations[s])
		parts = append(parts, fmt.Sprintf("%s over all positions: largest %s %s (front at %s %s), smallest %s %s (front at %s %s)", what,
			u.Format(k, e.Max[mw.quantityIndex][s]), e.MaxSide[mw.quantityIndex][s].At(station), u.Format(units.Position, hi.Front), hi.Direction,
			u.Format(k, e.Min[mw.quantityIndex][s]), e.MinSide[mw.quantityIndex][s].At(station), u.Format(units.Position, lo.Front), lo.Direction))
		if mw.current != nil {
			parts = append(parts, fmt.Sprintf("with the front at %s: %s", u.Format(units.Position, mw.at.Front), u.Format(k, mw.current[s])))
		}
	}
	if mw.line != nil && len(mw.worst) == 2 {
		what := mw.line.Describe(u.Format(units.Position, mw.line.Target.X))
		own := "the train's"
		if mw.combined != nil {
			own = "the train's own (no cases, no factor)"
		}
		parts = append(parts, fmt.Sprintf("%s extremes of the %s: largest %s, smallest %s", own, what,
			u.Format(targetUnit(mw.line.Target), mw.worst[0].Value), u.Format(targetUnit(mw.line.Target), mw.worst[1].Value)))
	}
	mw.readout.SetText(strings.Join(parts, "; "))
}

// targetUnit is the kind of value a target is.
func targetUnit(t moving.Target) units.Kind {
	switch {
	case t.Reaction && t.Motion == fem.Rotation:
		return units.Moment
	case t.Reaction:
		return units.Force
	}
	return t.Quantity.Info().Unit
}

// movingPicture draws the moving-loads scene and turns the mouse into
// moves of the train and of the line's point.
type movingPicture struct {
	widget.BaseWidget
	mw        *movingWindow
	frame     *fynecanvas.Rectangle // newFocusFrame
	dragStart *moving.Placement
	dragX     float32
}

var (
	_ fyne.Focusable    = (*movingPicture)(nil)
	_ fyne.Draggable    = (*movingPicture)(nil)
	_ fyne.Tappable     = (*movingPicture)(nil)
	_ desktop.Hoverable = (*movingPicture)(nil)
)

func newMovingPicture(mw *movingWindow) *movingPicture {
	p := &movingPicture{mw: mw, frame: newFocusFrame()}
	p.ExtendBaseWidget(p)
	return p
}

func (p *movingPicture) CreateRenderer() fyne.WidgetRenderer { return &movingRenderer{p: p} }

// MinSize leaves room for the readout, the status and the caution under
// the picture on a screen of 1024 × 640.
func (p *movingPicture) MinSize() fyne.Size { return fyne.NewSize(400, 240) }

// modelX is the member x under the screen x px, as the scene places it.
func (p *movingPicture) modelX(px float32) float64 {
	size := p.Size()
	v := canvas.NewView(size.Width, size.Height)
	v.Fit(&p.mw.w.project.Model)
	return min(max(v.ToModelX(px), 0), p.mw.w.project.Model.Length())
}

func (p *movingPicture) Dragged(ev *fyne.DragEvent) {
	if p.dragStart == nil {
		start := p.mw.at
		p.dragStart, p.dragX = &start, ev.Position.X-ev.Dragged.DX
	}
	dx := p.modelX(ev.Position.X) - p.modelX(p.dragX)
	p.mw.dragTrain(*p.dragStart, dx)
}

func (p *movingPicture) DragEnd() { p.dragStart = nil }

// FocusGained is part of fyne.Focusable: the picture takes the focus
// by Tab or a click, and then ← and → move the train; its frame shows it.
func (p *movingPicture) FocusGained() { showFocus(p.frame, true) }

// FocusLost is part of fyne.Focusable.
func (p *movingPicture) FocusLost() { showFocus(p.frame, false) }

// TypedRune is part of fyne.Focusable.
func (p *movingPicture) TypedRune(rune) {}

// TypedKey is part of fyne.Focusable: ← and → move the train one of its
// positions back or on, as a drag does by the mouse; Escape closes the
// window, as it does on the window's widgets.
func (p *movingPicture) TypedKey(ev *fyne.KeyEvent) {
	mw := p.mw
	if ev.Name == fyne.KeyEscape {
		mw.win.Close()
		return
	}
	if mw.env == nil {
		return
	}
	switch ev.Name {
	case fyne.KeyLeft:
		mw.dragTrain(mw.at, -mw.env.Step)
	case fyne.KeyRight:
		mw.dragTrain(mw.at, mw.env.Step)
	}
}

func (p *movingPicture) Tapped(ev *fyne.PointEvent) {
	mw := p.mw
	if c := fyne.CurrentApp().Driver().CanvasForObject(p); c != nil {
		c.Focus(p)
	}
	if mw.pinned {
		mw.pinned = false
	} else {
		mw.pinned, mw.pointX = true, p.modelX(ev.Position.X)
	}
	mw.showPoint()
	mw.showLine()
}

func (p *movingPicture) MouseIn(ev *desktop.MouseEvent) { p.MouseMoved(ev) }

func (p *movingPicture) MouseMoved(ev *desktop.MouseEvent) {
	mw := p.mw
	mw.hovering, mw.hoverX = true, p.modelX(ev.Position.X)
	if mw.pinned || mw.supportOf(mw.reaction) >= 0 {
		mw.showReadout()
		p.Refresh()
		return
	}
	mw.showLine()
}

func (p *movingPicture) MouseOut() {
	p.mw.hovering = false
	p.mw.showReadout()
	p.Refresh()
}

type movingRenderer struct {
	p       *movingPicture
	objects []fyne.CanvasObject
}

func (r *movingRenderer) Layout(size fyne.Size) {
	r.p.frame.Resize(size)
	r.Refresh()
}

func (r *movingRenderer) MinSize() fyne.Size { return r.p.MinSize() }

func (r *movingRenderer) Refresh() {
	size := r.p.Size()
	if size.Width <= 0 || size.Height <= 0 {
		return
	}
	s, _ := canvas.BuildMoving(r.p.mw.input(), size.Width, size.Height)
	r.objects = append(drawScene(s), r.p.frame)
	for _, o := range r.objects {
		o.Refresh()
	}
}

func (r *movingRenderer) Objects() []fyne.CanvasObject { return r.objects }

func (r *movingRenderer) Destroy() {}

// nearestStation is the index of the station nearest to x.
func nearestStation(stations []float64, x float64) int {
	s, _ := slices.BinarySearch(stations, x)
	if s == len(stations) || (s > 0 && x-stations[s-1] < stations[s]-x) {
		s--
	}
	return s
}
