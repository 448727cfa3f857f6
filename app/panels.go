package app

import (
	"fmt"
	"image/color"
	"math"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	fynecanvas "fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// toolInfo describes one button of the tool strip.
type toolInfo struct {
	tool  tool
	label string
	key   rune // the letter that picks the tool
	hint  string
}

var tools = []toolInfo{
	{toolPick, "Pick", 'q', "click to select, drag an item to move it, double-click a line load to add a vertex"},
	{toolPan, "Pan", 'h', "drag to move the view (the middle mouse button pans with any tool)"},
	{toolMember, "Member", 'm', "drag along the drawing to set the member's length"},
	{toolSplit, "Split", 'b', "click on the member to break a segment in two"},
	{toolSupport, "Support", 'r', "click on the member to place a support of the kind chosen below"},
	{toolForce, "Force", 'p', "click on the member to place a point force"},
	{toolMoment, "Moment", 't', "click on the member to place a point moment"},
	{toolLineLoad, "Line load", 'l', "drag along the member to place a distributed load; drag its end handles to shape it"},
	{toolVertex, "Vertex", 'k', "click on a distributed load to add a vertex, then drag it"},
}

var supportKinds = []fem.SupportKind{fem.Fixed, fem.Pinned, fem.Roller, fem.AxialOnly, fem.Guided, fem.Spring}

// controls are the widgets around the drawing.
type controls struct {
	w            *Window
	toolButtons  map[tool]*widget.Button
	kindSelect   *widget.Select
	properties   *fyne.Container
	panel        propertiesPanel
	readout      *readout
	checkList    *widget.List
	checkDetail  *widget.Label
	elements     *widget.Entry
	elementsUsed *widget.Label // the element count actually solved
	layerChecks  map[*bool]*widget.Check
	order        *widget.Select
	unitSelect   *widget.Select
	grid         *widget.Entry
	magnify      *widget.Slider
	magnifyText  *widget.Label
}

// build lays out the window's content.
func (w *Window) build() {
	c := &controls{w: w, toolButtons: map[tool]*widget.Button{}, layerChecks: map[*bool]*widget.Check{}}
	w.ui = c
	w.status = widget.NewLabel("")
	w.status.Truncation = fyne.TextTruncateEllipsis

	strip := container.NewVBox(widget.NewLabelWithStyle("Tools", fyne.TextAlignLeading, fyne.TextStyle{Bold: true}))
	for _, t := range tools {
		b := widget.NewButton(fmt.Sprintf("%s  (%c)", t.label, t.key-'a'+'A'), func() { w.setTool(t.tool) })
		b.Alignment = widget.ButtonAlignLeading
		c.toolButtons[t.tool] = b
		strip.Add(b)
	}
	names := make([]string, len(supportKinds))
	for i, k := range supportKinds {
		names[i] = k.String()
	}
	c.kindSelect = widget.NewSelect(names, nil)
	c.kindSelect.SetSelected(w.kind.String())
	c.kindSelect.OnChanged = func(s string) {
		if k, ok := fem.ParseSupportKind(s); ok {
			w.kind = k
			w.setTool(toolSupport)
		}
	}
	strip.Add(widget.NewLabel("Support kind"))
	strip.Add(c.kindSelect)
	strip.Add(widget.NewSeparator())
	strip.Add(widget.NewButton("Undo", w.undo))
	strip.Add(widget.NewButton("Redo", w.redo))
	strip.Add(widget.NewButton("Delete", w.deleteSelected))
	strip.Add(widget.NewButton("Fit view (F)", w.draw.fit))

	c.properties = container.NewVBox()
	c.readout = newReadout()
	// Rows are plain coloured text, half the height of labels, so the list
	// shows several checks at once.
	c.checkList = widget.NewList(
		func() int { return len(w.checks) },
		func() fyne.CanvasObject {
			return container.New(layout.NewCustomPaddedLayout(3, 3, 6, 0), fynecanvas.NewText("", theme.Color(theme.ColorNameForeground)))
		},
		func(i widget.ListItemID, o fyne.CanvasObject) {
			r := w.checks[i]
			t := o.(*fyne.Container).Objects[0].(*fynecanvas.Text)
			t.Text = r.Status + "  " + r.Name
			t.Color = importanceColour(importance(r.Severity))
			t.Refresh()
		})
	c.checkDetail = widget.NewLabel("")
	c.checkDetail.Wrapping = fyne.TextWrapWord
	c.checkList.OnSelected = func(i widget.ListItemID) {
		if i < len(w.checks) {
			w.selectCheck(w.checks[i])
		}
	}
	c.checkList.OnUnselected = func(widget.ListItemID) { w.selectCheck(analysis.Finding{}) }

	readoutAndChecks := container.NewVSplit(
		container.NewScroll(c.readout.grid), // its first line says what it shows: no heading, to save height
		container.NewBorder(heading("Checks"), minHeight(90, container.NewVScroll(c.checkDetail)), nil, nil, c.checkList))
	readoutAndChecks.SetOffset(0.4)
	side := container.NewVSplit(
		container.NewVScroll(c.properties),
		readoutAndChecks)
	side.SetOffset(0.3)

	center := container.NewBorder(c.settingsBar(), c.layerBar(), nil, nil, w.draw)
	warning := widget.NewLabelWithStyle(caution, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	warning.Importance = widget.WarningImportance
	warning.Wrapping = fyne.TextWrapWord
	bottom := container.NewVBox(widget.NewSeparator(), w.status, warning)

	split := container.NewHSplit(center, side)
	split.SetOffset(0.68)
	w.win.SetContent(container.NewBorder(nil, bottom, container.NewVScroll(strip), nil, split))
	w.win.SetMainMenu(w.mainMenu())
	w.addShortcuts()
	w.setTool(toolPick)
}

// importanceColour is the theme colour of text of importance i.
func importanceColour(i widget.Importance) color.Color {
	name := theme.ColorNameForeground
	switch i {
	case widget.DangerImportance:
		name = theme.ColorNameError
	case widget.WarningImportance:
		name = theme.ColorNameWarning
	case widget.SuccessImportance:
		name = theme.ColorNameSuccess
	case widget.LowImportance:
		name = theme.ColorNameDisabled
	}
	return theme.Color(name)
}

// minHeight gives o at least h pixels of height.
func minHeight(h float32, o fyne.CanvasObject) fyne.CanvasObject {
	r := fynecanvas.NewRectangle(color.Transparent)
	r.SetMinSize(fyne.NewSize(0, h))
	return container.NewStack(r, o)
}

func heading(s string) *widget.Label {
	return widget.NewLabelWithStyle(s, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
}

// settingsBar holds the mesh and grid settings above the drawing (and makes the unit switch the layer bar shows).
func (c *controls) settingsBar() fyne.CanvasObject {
	w := c.w
	c.elements = widget.NewEntry()
	c.elements.OnSubmitted = func(s string) { w.setElements(s) }
	finer := widget.NewButton("×2", func() { w.scaleElements(2) })
	coarser := widget.NewButton("÷2", func() { w.scaleElements(0.5) })
	c.order = widget.NewSelect([]string{"linear bar", "quadratic bar"}, func(s string) {
		order := fem.LinearBar
		if s == "quadratic bar" {
			order = fem.QuadraticBar
		}
		if w.project.Model.Mesh.BarOrder != order && !(order == fem.LinearBar && w.project.Model.Mesh.BarOrder == 0) {
			w.apply("use "+s+" elements", func(m *fem.Model) error { m.Mesh.BarOrder = order; return nil })
		}
	})
	c.unitSelect = widget.NewSelect([]string{units.SI.Name + " units", units.USCustomary.Name + " units"}, func(s string) {
		if sys, ok := units.ByName(strings.TrimSuffix(s, " units")); ok && sys.Name != w.units.Name {
			w.setUnits(sys)
		}
	})
	c.unitSelect.SetSelected(w.units.Name + " units")
	c.grid = widget.NewEntry()
	c.grid.OnSubmitted = func(s string) { w.setGrid(s) }
	c.showGrid()
	c.elementsUsed = widget.NewLabel("")
	return container.NewHBox(
		widget.NewLabel("Elements requested"), container.NewGridWrap(fyne.NewSize(70, c.elements.MinSize().Height), c.elements), c.elementsUsed, finer, coarser,
		c.order,
		widget.NewLabel("Snap"), container.NewGridWrap(fyne.NewSize(100, c.grid.MinSize().Height), c.grid))
}

// layerBar holds the overlay switches, the magnification and the units below the drawing.
func (c *controls) layerBar() fyne.CanvasObject {
	w := c.w
	toggle := func(label string, on *bool) fyne.CanvasObject {
		ch := widget.NewCheck(label, func(v bool) {
			*on = v
			w.draw.Refresh()
			w.updateTitle()
		})
		ch.SetChecked(*on)
		c.layerChecks[on] = ch
		return ch
	}
	o := &w.project.View.Overlays
	c.magnify = widget.NewSlider(0, 4) // log10 of the magnification
	c.magnify.Step = 0.05
	c.magnify.OnChanged = func(v float64) {
		w.project.View.Magnification = math.Round(math.Pow(10, v))
		c.showMagnification()
		w.draw.Refresh()
	}
	auto := widget.NewButton("auto", func() {
		w.project.View.Magnification = 0
		c.showMagnification()
		w.draw.Refresh()
	})
	c.magnifyText = widget.NewLabel("")
	c.showMagnification()
	return container.NewVBox(
		container.NewGridWithColumns(4,
			toggle("Deflected shape", &o.DeformedShape), toggle("Axial force N", &o.AxialForce),
			toggle("Shear force V", &o.ShearForce), toggle("Bending moment M", &o.BendingMoment),
			toggle("Stress σ", &o.Stress), toggle("Nodes", &o.Nodes),
			toggle("Exact vs FE gap", &o.ExactBand), toggle("Dimensions", &w.dimensions)),
		container.NewBorder(nil, nil, widget.NewLabel("Deflection scale"), container.NewHBox(c.magnifyText, auto, c.unitSelect), c.magnify))
}

func (c *controls) showMagnification() {
	m := c.w.project.View.Magnification
	if m > 0 {
		c.magnifyText.SetText(fmt.Sprintf("×%s", units.FormatNumber(m)))
		c.magnify.Value = math.Log10(m)
		c.magnify.Refresh()
		return
	}
	text := "×auto"
	if s := c.w.draw.scene; s != nil && s.Magnification > 0 {
		text = fmt.Sprintf("×%s (auto)", units.FormatNumber(s.Magnification))
	}
	c.magnifyText.SetText(text)
}

func (c *controls) showGrid() {
	g := c.w.project.View.GridStep
	if g > 0 {
		c.grid.SetText(c.w.units.Format(units.Position, g))
	} else {
		c.grid.SetText("auto")
	}
}

// showLayers brings the overlay switches in line with the project's overlays.
func (c *controls) showLayers() {
	for on, ch := range c.layerChecks {
		ch.SetChecked(*on)
	}
}

// showMesh shows the mesh settings of the current model and the number of
// elements solved: more than requested where key points (supports, loads,
// segment ends) fall between the requested nodes, or the adaptive mesh.
func (c *controls) showMesh() {
	w := c.w
	ms := w.project.Model.Mesh
	c.elements.SetText(strconv.Itoa(ms.Elements))
	if ms.BarOrder == fem.QuadraticBar {
		c.order.SetSelected("quadratic bar")
	} else {
		c.order.SetSelected("linear bar")
	}
	c.showElementsUsed()
}

// showElementsUsed shows how many elements the shown result has.
func (c *controls) showElementsUsed() {
	w := c.w
	used := ""
	if a := w.result; a != nil && a.seq == w.pending && a.Solution != nil {
		used = fmt.Sprintf("→ %d used", len(a.Solution.Mesh.Elements))
	}
	if w.adaptNodes != nil {
		used = fmt.Sprintf("→ adaptive mesh, %d used", len(w.adaptNodes)-1)
	}
	c.elementsUsed.SetText(used)
}

func (w *Window) setTool(t tool) {
	w.tool = t
	for k, b := range w.ui.toolButtons {
		if k == t {
			b.Importance = widget.HighImportance
		} else {
			b.Importance = widget.MediumImportance
		}
		b.Refresh()
	}
	for _, info := range tools {
		if info.tool == t {
			hint := info.hint
			if t == toolSupport {
				hint = strings.Replace(hint, "the kind chosen below", "kind "+w.kind.String(), 1)
			}
			w.setStatus("%s: %s", info.label, hint)
		}
	}
}

// maxElements bounds what a typo in the element count can ask of the solver.
const maxElements = 200000

func (w *Window) setElements(text string) {
	n, err := strconv.Atoi(strings.TrimSpace(text))
	if err != nil || n < 1 || n > maxElements {
		w.setStatus("element count: type a whole number from 1 to %d; got %q", maxElements, text)
		w.ui.showMesh()
		return
	}
	w.apply(fmt.Sprintf("use %d elements", n), func(m *fem.Model) error { m.Mesh.Elements = n; return nil })
}

func (w *Window) scaleElements(f float64) {
	n := max(1, min(maxElements, int(math.Round(float64(max(w.project.Model.Mesh.Elements, 1))*f))))
	w.setElements(strconv.Itoa(n))
}

func (w *Window) setGrid(text string) {
	t := strings.TrimSpace(text)
	if t == "" || t == "auto" || t == "0" {
		w.project.View.GridStep = 0
	} else {
		g, err := w.units.Parse(units.Position, t)
		if err != nil || g <= 0 {
			w.setStatus("snap step: %v (type a length such as 0.25 m, or auto)", errOr(err, "must be positive"))
			w.ui.showGrid()
			return
		}
		w.project.View.GridStep = g
	}
	w.ui.showGrid()
	w.updateTitle()
}

func errOr(err error, text string) string {
	if err != nil {
		return err.Error()
	}
	return text
}

func (w *Window) setUnits(s units.System) {
	w.units = s
	w.project.View.Units = storageUnits(s)
	// A snap step of 0.1 m reads 0.3281 ft: move it to a round step of the new units.
	if g := w.project.View.GridStep; g > 0 {
		w.project.View.GridStep = s.FromDisplay(units.Position, roundStep(s.ToDisplay(units.Position, g)))
		w.note = " — snap step now " + s.Format(units.Position, w.project.View.GridStep)
	}
	w.setStatus("showing %s units", s.Name)
	w.ui.showGrid()
	w.ui.showProperties()
	// Check messages are written in the display units: solve again.
	w.resubmit()
	w.hoverChanged()
	w.draw.Refresh()
	w.updateTitle()
}

// roundStep is the step of the form 1, 2, 2.5 or 5 × 10ⁿ nearest to v > 0
// on a log scale.
func roundStep(v float64) float64 {
	decade := math.Pow(10, math.Floor(math.Log10(v)))
	best := decade
	for _, m := range []float64{1, 2, 2.5, 5, 10} {
		if math.Abs(math.Log(m*decade/v)) < math.Abs(math.Log(best/v)) {
			best = m * decade
		}
	}
	return best
}

// hoverChanged updates the readout for the mouse position.
func (w *Window) hoverChanged() {
	w.ui.readout.show(w)
}

// selectCheck shows the full message of r and marks its place on the drawing.
func (w *Window) selectCheck(f analysis.Finding) {
	w.highlight = f.Span
	if f.Name == "" {
		text, handbook := "solving…", ""
		if a := w.result; a != nil {
			text, handbook = a.MeshText(w.units), a.HandbookText(w.units)
		}
		text += "\nClick a check to read it and see its place on the drawing."
		if handbook != "" {
			text += "\n\n" + handbook
		}
		w.ui.checkDetail.SetText(text)
	} else {
		w.ui.checkDetail.SetText(f.Sentence())
	}
	w.draw.Refresh()
}

// showResults refreshes everything that shows the newest analysis.
func (c *controls) showResults() {
	w := c.w
	c.checkList.UnselectAll()
	w.selectCheck(analysis.Finding{})
	c.checkList.Refresh()
	c.showMagnification()
	c.showElementsUsed()
	w.hoverChanged()
}

// readout shows every quantity at the mouse x, finite element beside exact,
// in a text grid: compact rows and aligned columns.
type readout struct {
	grid *widget.TextGrid
}

func newReadout() *readout {
	return &readout{grid: widget.NewTextGrid()}
}

// readoutLine lays out one line of the readout in fixed columns narrow
// enough for the side panel: the unit is written once, after both values.
func readoutLine(name, fe, exact, unit string) string {
	return fmt.Sprintf("%-14s %9s %9s %s", name, fe, exact, unit)
}

// shortNumber is units.FormatNumber with the exponent's zeros dropped
// ("-3.208e-4"), so every value fits nine characters.
func shortNumber(v float64) string {
	s := units.FormatNumber(v)
	return strings.NewReplacer("e-0", "e-", "e+0", "e", "e+", "e").Replace(s)
}

func (r *readout) show(w *Window) {
	d := w.draw
	a := w.result
	m := &w.project.Model
	if !d.hovering || a == nil || a.Solution == nil || d.hoverX < 0 || d.hoverX > m.Length() {
		r.grid.SetText("At the mouse\n\nMove the mouse over the member to read\nevery result at that point, finite\nelement (FE) beside exact.")
		return
	}
	x := d.hoverX
	fe := a.Solution.At(x, fem.Right)
	lines := []string{readoutLine("at "+w.units.Format(units.Position, x), "FE", "exact", "")}
	var ex fem.Fields
	if a.Exact != nil {
		ex = a.Exact.At(x, fem.Right)
	}
	for _, q := range fem.Quantities() {
		info := q.Info()
		exact := "—"
		if a.Exact != nil {
			exact = shortNumber(w.units.ToDisplay(info.Unit, q.Of(&ex)))
		}
		lines = append(lines, readoutLine(info.Label, shortNumber(w.units.ToDisplay(info.Unit, q.Of(&fe))), exact, w.units.Unit(info.Unit).Symbol))
	}
	r.grid.SetText(strings.Join(lines, "\n"))
}

// storageUnits names s the way project files do.
func storageUnits(s units.System) storage.UnitSystem {
	if s.Name == units.USCustomary.Name {
		return storage.US
	}
	return storage.SI
}

// describeRef is describe with a capital letter, for panel titles.
func describeRef(r canvas.Ref) string {
	s := describe(r)
	return strings.ToUpper(s[:1]) + s[1:]
}
