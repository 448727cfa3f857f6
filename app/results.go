package app

import (
	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/fem"
	"stave/fem/units"
)

// readout shows every quantity at the mouse x in a table: the quantity,
// its exact value (the headline) and the finite element value beside it in
// aligned columns, and the unit. Without an exact solution the exact
// column reads "—" and the line above says the values are FE. An
// envelope takes two rows a quantity, its smallest and its largest value,
// each with the combination that gives it in a last column: the ranges
// with the names in one row ran past a laptop screen's readout.
type readout struct {
	at    *widget.Label
	table *escTable
	rows  [][readoutColumns]string
	// columns is the number shown: the governing column is an envelope's.
	columns int
	// least are the columns' widths for every quantity's name, plain
	// numbers and units; widths those set now, wider where a row's text
	// needs it (a combination's name).
	least, widths [readoutColumns]float32
}

// Columns of the readout table.
const (
	columnQuantity = iota
	columnExact
	columnFE
	columnUnit
	columnGoverning // an envelope's: the combination that gives the value
	readoutColumns
)

// The envelope's rows name their quantity with these after it.
const (
	envelopeMin = " min"
	envelopeMax = " max"
)

var readoutHeadings = [readoutColumns]string{"", "exact", "FE", "unit", "governing"}

func newReadout() *readout {
	r := &readout{at: widget.NewLabel(""), columns: columnGoverning}
	r.at.Wrapping = fyne.TextWrapWord
	size := readoutTextSize()
	cell := func() fyne.CanvasObject {
		t := fynecanvas.NewText("", theme.Color(theme.ColorNameForeground))
		t.TextSize = size
		return container.New(layout.NewCustomPaddedLayout(0, 0, 4, 4), t)
	}
	r.table = newEscTable(
		func() (int, int) { return len(r.rows), r.columns },
		cell,
		func(id widget.TableCellID, o fyne.CanvasObject) {
			setCell(o, r.rows[id.Row][id.Col], id.Col == columnFE || id.Col == columnExact, false)
		})
	r.table.ShowHeaderRow = true
	r.table.CreateHeader = cell
	r.table.UpdateHeader = func(id widget.TableCellID, o fyne.CanvasObject) {
		if id.Col >= 0 {
			setCell(o, readoutHeadings[id.Col], id.Col == columnFE || id.Col == columnExact, true)
		}
	}
	widths := [readoutColumns]float32{columnGoverning: fyne.MeasureText(readoutHeadings[columnGoverning], size, fyne.TextStyle{Bold: true}).Width}
	for _, q := range fem.Quantities() {
		for _, suffix := range []string{envelopeMin, envelopeMax} {
			widths[columnQuantity] = max(widths[columnQuantity], fyne.MeasureText(q.Info().Label+suffix, size, fyne.TextStyle{}).Width)
		}
		for _, s := range units.Systems() {
			widths[columnUnit] = max(widths[columnUnit], fyne.MeasureText(s.Unit(q.Info().Unit).Symbol, size, fyne.TextStyle{}).Width)
		}
	}
	number := fyne.MeasureText("-8.888e-88", size, fyne.TextStyle{}).Width
	widths[columnFE], widths[columnExact] = number, number
	for i, w := range widths {
		r.least[i] = w + 12
		r.widths[i] = r.least[i]
		r.table.SetColumnWidth(i, r.widths[i])
	}
	return r
}

// readoutTextSize is a little smaller than labels, so the table shows
// every quantity in a small window.
func readoutTextSize() float32 { return theme.TextSize() - 1 }

// setCell shows text in a table cell, numbers aligned on the right.
func setCell(o fyne.CanvasObject, text string, number, bold bool) {
	t := o.(*fyne.Container).Objects[0].(*fynecanvas.Text)
	t.Text = text
	t.TextStyle.Bold = bold
	t.Alignment = fyne.TextAlignLeading
	if number {
		t.Alignment = fyne.TextAlignTrailing
	}
	t.Refresh()
}

// pane is the readout with its line on where it reads, at least as wide
// as the quantity, exact, FE and unit columns: the window's panes leave it
// room for them, where it scrolled the units out of sight in a window
// 1024 px wide.
func (r *readout) pane() fyne.CanvasObject {
	return container.New(readoutLayout{r}, container.NewBorder(r.at, nil, nil, nil, r.table))
}

// readoutLayout lays the readout out at least as wide as its least
// columns up to the unit, which hold every quantity's name, also an
// envelope's, every number and every unit.
type readoutLayout struct{ r *readout }

func (l readoutLayout) MinSize(objects []fyne.CanvasObject) fyne.Size {
	size := objects[0].MinSize()
	var columns float32
	for c := columnQuantity; c <= columnUnit; c++ {
		columns += l.r.least[c]
	}
	return fyne.NewSize(max(size.Width, columns), size.Height)
}

func (l readoutLayout) Layout(objects []fyne.CanvasObject, size fyne.Size) {
	objects[0].Resize(size)
}

// clear shows the quantities with no values and says how to get them.
func (r *readout) clear(u units.System) {
	r.at.SetText("Move the mouse over the member to read every result there: exact, with the finite element (FE) value beside it.")
	r.fill(u, func(fem.Quantity) (string, string) { return "", "" })
}

// fill sets one row per quantity with values from value, in units u.
func (r *readout) fill(u units.System, value func(fem.Quantity) (exact, fe string)) {
	r.rows = r.rows[:0]
	for _, q := range fem.Quantities() {
		row := quantityRow(u, q, "")
		row[columnExact], row[columnFE] = value(q)
		r.rows = append(r.rows, row)
	}
	r.showRows(columnGoverning)
}

// quantityRow is a row of q, its label followed by suffix, with its unit in u.
func quantityRow(u units.System, q fem.Quantity, suffix string) [readoutColumns]string {
	var row [readoutColumns]string
	row[columnQuantity], row[columnUnit] = q.Info().Label+suffix, u.Unit(q.Info().Unit).Symbol
	return row
}

// showRows draws the rows in the first columns, fitted to their text.
func (r *readout) showRows(columns int) {
	r.columns = columns
	r.fitColumns()
	r.table.Refresh()
}

// fitColumns widens each column to its longest text, so no cell runs into
// the next; the table scrolls sideways when they pass the panel.
func (r *readout) fitColumns() {
	size := readoutTextSize()
	for c := range readoutColumns {
		w := r.least[c]
		for _, row := range r.rows {
			w = max(w, fyne.MeasureText(row[c], size, fyne.TextStyle{}).Width+12)
		}
		if w != r.widths[c] {
			r.widths[c] = w
			r.table.SetColumnWidth(c, w)
		}
	}
}

func (r *readout) show(w *Window) {
	d := w.draw
	a := w.result
	m := &w.project.Model
	if !d.hovering || a == nil || a.Solution == nil || d.hoverX < 0 || d.hoverX > m.Length() {
		r.clear(w.units)
		return
	}
	x := d.hoverX
	at := "At x = " + w.position(x) + " (under the mouse)"
	if a.Exact == nil {
		at += ": no exact solution, so only the finite element (FE) values"
	}
	r.at.SetText(at)
	if r.showEnvelope(w, x) {
		return
	}
	fe := a.Solution.At(x, fem.Right)
	var ex fem.Fields
	if a.Exact != nil {
		ex = a.Exact.At(x, fem.Right)
	}
	r.fill(w.units, func(q fem.Quantity) (string, string) {
		unit := q.Info().Unit
		exact := "—"
		if a.Exact != nil {
			exact = units.FormatNumber(w.units.ToDisplay(unit, q.Of(&ex)))
		}
		return exact, units.FormatNumber(w.units.ToDisplay(unit, q.Of(&fe)))
	})
}

// hoverChanged updates the readout for the mouse position.
func (w *Window) hoverChanged() {
	w.ui.readout.show(w)
}

// checksList shows the findings of the newest analysis, one wrapped line
// each in its severity's colour; a click on one shows its whole message
// and marks its place on the drawing.
type checksList struct {
	w        *Window
	summary  *widget.Label // the mesh and balance, the handbook case, or what to do first
	rows     []*checkRow
	box      *fyne.Container
	selected int // index into w.checks; -1 for none
}

func newChecksList(w *Window) *checksList {
	l := &checksList{w: w, summary: widget.NewLabel(""), selected: -1}
	l.summary.Wrapping = fyne.TextWrapWord
	l.box = container.NewVBox(l.summary)
	return l
}

// pane is the list under its heading, scrolling when long.
func (l *checksList) pane() fyne.CanvasObject {
	return container.NewBorder(heading("Checks"), nil, nil, nil, container.NewVScroll(l.box))
}

// checkRow is one finding: a label that can be clicked.
type checkRow struct {
	widget.Label
	onTap func()
}

func newCheckRow(onTap func()) *checkRow {
	r := &checkRow{onTap: onTap}
	r.Wrapping = fyne.TextWrapWord
	r.ExtendBaseWidget(r)
	return r
}

// Tapped is part of fyne.Tappable.
func (r *checkRow) Tapped(*fyne.PointEvent) { r.onTap() }

// show brings the list in line with w.checks and the selection.
func (l *checksList) show() {
	w := l.w
	if len(l.rows) < len(w.checks) {
		// Added all at once: the box lays itself out on every Add, which
		// took 2.9 of the 3.2 s of showing a member's 2,000 checks.
		objects := l.box.Objects
		for len(l.rows) < len(w.checks) {
			i := len(l.rows)
			row := newCheckRow(func() { w.selectCheck(i) })
			l.rows = append(l.rows, row)
			objects = append(objects, row)
		}
		l.box.Objects = objects
		l.box.Refresh()
	}
	for i, row := range l.rows {
		if i >= len(w.checks) {
			row.Hide()
			continue
		}
		f := w.checks[i]
		text := f.Status + "  " + f.Name
		if i == l.selected {
			text = f.Sentence()
		}
		row.Text, row.Importance, row.TextStyle.Bold = text, importance(f.Severity), i == l.selected
		row.Show()
		row.Refresh()
	}
	l.summary.SetText(l.summaryText())
}

// summaryText heads the list: what to do on a blank sketch, otherwise the
// mesh and balance of the result, who chose the mesh and its accuracy, the
// headline values (exact, FE beside) and the handbook case it matches.
func (l *checksList) summaryText() string {
	w := l.w
	if len(w.project.Model.Segments) == 0 {
		return "No member yet, so nothing to check. Choose Member (M) and drag along the drawing, or type a length under Properties."
	}
	a := w.result
	if a == nil {
		return "solving…"
	}
	text := a.MeshText()
	if h := a.HeadlineText(w.units); h != "" {
		text += "\n\n" + h
	}
	if len(w.checks) > 0 {
		text += "\n\nClick a check to read it and see its place on the drawing."
	}
	if h := a.HandbookText(w.units); h != "" {
		text += "\n\n" + h
	}
	return text
}

// selectCheck shows the whole message of check i (none for -1) and marks
// its place on the drawing.
func (w *Window) selectCheck(i int) {
	l := w.ui.checks
	if i < 0 || i >= len(w.checks) || i == l.selected {
		i = -1 // a second click closes it
	}
	l.selected = i
	w.highlight = [2]float64{}
	if i >= 0 {
		w.highlight = w.checks[i].Span
	}
	l.show()
	w.draw.Refresh()
}

// showResults refreshes everything that shows the newest analysis.
func (c *controls) showResults() {
	w := c.w
	c.checks.selected = -1
	w.highlight = [2]float64{}
	c.checks.show()
	w.draw.Refresh()
	c.showMagnification()
	c.showElementsUsed()
	w.hoverChanged()
}
