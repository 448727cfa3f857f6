package app

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
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
	toolButtons  map[tool]*ringButton
	strip        *container.Scroll // the tools and the load cases, left of the drawing
	kindSelect   *escSelect
	cases        *casesPanel
	properties   *fyne.Container // the properties pane, rebuilt for each kind of item
	panel        propertiesPanel
	readout      *readout
	checks       *checksList
	elements     *escEntry
	elementsUsed *widget.Label // the element count actually solved
	layerChecks  map[*bool]*escCheck
	order        *escSelect
	orders       []barOrder
	unitSelect   *escSelect
	grid         *escEntry
	magnify      *escSlider
	magnifyText  *widget.Label
}

// build lays out the window's content: the tools on the left; above the
// drawing the commands every item shares, below it the overlays, the mesh
// and the deflection scale, each a bar that wraps when the window is
// narrow; on the right the selected item's properties, the readout at the
// mouse and the checks, each in a pane that scrolls; the status and the
// caution at the foot.
func (w *Window) build() {
	c := &controls{w: w, toolButtons: map[tool]*ringButton{}, layerChecks: map[*bool]*escCheck{}}
	w.ui = c
	w.status = newStatusLine(w)

	strip := container.NewVBox(heading("Tools"))
	for _, t := range tools {
		b := w.newButton(fmt.Sprintf("%s  (%c)", t.label, t.key-'a'+'A'), nil, func() { w.setTool(t.tool) })
		b.Alignment = widget.ButtonAlignLeading
		c.toolButtons[t.tool] = b
		strip.Add(b)
	}
	names := make([]string, len(supportKinds))
	for i, k := range supportKinds {
		names[i] = k.String()
	}
	c.kindSelect = w.newSelect(names, nil)
	c.kindSelect.SetSelected(w.kind.String())
	c.kindSelect.OnChanged = func(s string) {
		if k, ok := fem.ParseSupportKind(s); ok {
			w.kind = k
			w.setTool(toolSupport)
		}
	}
	strip.Add(widget.NewLabel("Support kind"))
	strip.Add(c.kindSelect)
	c.cases = newCasesPanel(w)
	strip.Add(c.cases.box)

	c.properties = container.NewStack()
	c.readout = newReadout()
	c.readout.table.OnEscape = w.escape
	c.checks = newChecksList(w)
	readoutAndChecks := container.NewVSplit(c.readout.pane(), c.checks.pane())
	readoutAndChecks.SetOffset(0.5)
	side := container.NewVSplit(c.properties, readoutAndChecks)
	side.SetOffset(0.38)

	// The bars above and below the drawing have the strip's compact
	// padding: with fyne's, a window 1024 px wide, where they wrap into
	// more rows, needed 659 px of height for 610 on a 1024 × 640 screen,
	// and grew past its foot, the caution line with it.
	below := compact(newFlow(append(c.layerBar(), c.meshBar()...)...))
	bar := compact(c.actionBar())
	// The objects in the order they are on the screen, which is the
	// order Tab takes (a border container puts its middle first).
	center := container.New(layout.NewBorderLayout(bar, below, nil, nil), bar, w.draw, below)
	warning := widget.NewLabelWithStyle(caution, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	warning.Importance = widget.WarningImportance
	warning.Wrapping = fyne.TextWrapWord
	bottom := container.NewVBox(widget.NewSeparator(), w.status, warning)

	split := container.NewHSplit(center, side)
	split.SetOffset(0.66)
	c.strip = container.NewVScroll(compact(strip))
	content := container.New(layout.NewBorderLayout(nil, bottom, c.strip, nil), c.strip, split, bottom)
	w.win.SetContent(content)
	// Lay out at once: wrapped labels measure their height at the width
	// they are given, and a window shown before that would take the
	// height of every word on a line of its own as its minimum.
	content.Resize(w.win.Canvas().Size().Max(fyne.NewSize(startWidth, startHeight)))
	w.setMainMenu()
	w.setTool(toolPick)
}

func heading(s string) *widget.Label {
	return widget.NewLabelWithStyle(s, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
}

// actionBar holds the commands above the drawing, the snapping step and the units.
func (c *controls) actionBar() fyne.CanvasObject {
	w := c.w
	c.grid = newEscEntry()
	c.grid.OnEscape = w.escape
	c.grid.OnSubmitted = func(s string) { w.setGrid(s) }
	c.showGrid()
	c.unitSelect = w.newSelect([]string{units.SI.Name + " units", units.USCustomary.Name + " units"}, func(s string) {
		if sys, ok := units.ByName(strings.TrimSuffix(s, " units")); ok && sys.Name != w.units.Name {
			w.setUnits(sys)
		}
	})
	c.unitSelect.SetSelected(w.units.Name + " units")
	c.cases.bar = newFlow(
		w.newButton("Add…", theme.ContentAddIcon(), w.showAddForm),
		w.newButton("Undo", theme.ContentUndoIcon(), w.undo),
		w.newButton("Redo", theme.ContentRedoIcon(), w.redo),
		w.newButton("Delete", theme.DeleteIcon(), w.deleteSelected),
		w.newButton("Fit view", theme.ZoomFitIcon(), w.draw.fit),
		container.NewBorder(nil, nil, widget.NewLabel("Snap"), nil, fixedWidth(110, c.grid)),
		c.unitSelect,
		// The choices of the load cases: shown, edited, combined.
		container.NewHBox(widget.NewLabel("Show"), fitOptions(c.cases.showSelect, 260)),
		container.NewHBox(widget.NewLabel("Editing"), fitOptions(c.cases.caseSelect, 200)),
		w.newButton("Combinations…", nil, w.showCombinations))
	return c.cases.bar
}

// barOrder is one choice of the bar element, named as fem names its formulation.
type barOrder struct {
	order fem.ElementOrder
	name  string
}

// barOrders lists the bar elements a mesh can use, and the beam element
// every mesh uses, by the names of their formulations.
func barOrders() (orders []barOrder, beam string) {
	for _, o := range []fem.ElementOrder{fem.LinearBar, fem.QuadraticBar} {
		m := fem.Model{Mesh: fem.MeshSettings{BarOrder: o}}
		bar, b := m.Formulations()
		orders, beam = append(orders, barOrder{o, bar.Name()}), b.Name()
	}
	return orders, beam
}

// meshBar makes the mesh settings shown below the drawing.
func (c *controls) meshBar() []fyne.CanvasObject {
	w := c.w
	c.elements = newEscEntry()
	c.elements.OnEscape = w.escape
	c.elements.OnSubmitted = func(s string) { w.setElements(s) }
	finer := w.newButton("Double", nil, func() { w.scaleElements(2) })
	coarser := w.newButton("Halve", nil, func() { w.scaleElements(0.5) })
	orders, beam := barOrders()
	c.orders = orders
	names := make([]string, len(orders))
	for i, o := range orders {
		names[i] = o.name
	}
	c.order = w.newSelect(names, func(s string) {
		for _, o := range c.orders {
			if o.name == s && o.order != orderOf(w.project.Model.Mesh) {
				w.apply("use "+s+" elements for the axial part", func(m *fem.Model) error { m.Mesh.BarOrder = o.order; return nil })
			}
		}
	})
	c.elementsUsed = widget.NewLabel("")
	return []fyne.CanvasObject{
		container.NewHBox(widget.NewLabel("Elements"), fixedWidth(80, c.elements), c.elementsUsed, finer, coarser),
		container.NewHBox(widget.NewLabel(beam+" · axial:"), c.order)}
}

// orderOf is the bar order of mesh settings, LinearBar when unset.
func orderOf(ms fem.MeshSettings) fem.ElementOrder {
	if ms.BarOrder == 0 {
		return fem.LinearBar
	}
	return ms.BarOrder
}

// fixedWidth gives o a width of px and its own height, as the theme it is
// shown in makes it.
func fixedWidth(px float32, o fyne.CanvasObject) fyne.CanvasObject {
	return container.New(widthLayout(px), o)
}

// widthLayout lays its one object out px wide at its own height.
type widthLayout float32

func (l widthLayout) MinSize(objects []fyne.CanvasObject) fyne.Size {
	return fyne.NewSize(float32(l), objects[0].MinSize().Height)
}

func (l widthLayout) Layout(objects []fyne.CanvasObject, size fyne.Size) {
	objects[0].Resize(size)
}

// layerBar makes the overlay switches and the deflection scale shown below the drawing.
func (c *controls) layerBar() []fyne.CanvasObject {
	w := c.w
	toggle := func(label string, on *bool) fyne.CanvasObject {
		ch := w.newCheck(label, func(v bool) {
			*on = v
			w.draw.Refresh()
			w.updateTitle()
		})
		ch.SetChecked(*on)
		c.layerChecks[on] = ch
		return ch
	}
	o := &w.project.View.Overlays
	c.magnify = w.newSlider(0, 4) // log10 of the magnification
	c.magnify.Step = 0.05
	c.magnify.OnChanged = func(v float64) {
		w.project.View.Magnification = math.Round(math.Pow(10, v))
		c.showMagnification()
		w.draw.Refresh()
	}
	auto := w.newButton("auto", nil, func() {
		w.project.View.Magnification = 0
		c.showMagnification()
		w.draw.Refresh()
	})
	c.magnifyText = widget.NewLabel("")
	c.showMagnification()
	return []fyne.CanvasObject{
		toggle("Deflected shape", &o.DeformedShape), toggle("Axial force N", &o.AxialForce),
		toggle("Shear force V", &o.ShearForce), toggle("Bending moment M", &o.BendingMoment),
		toggle("Stress σ", &o.Stress), toggle("Nodes", &o.Nodes),
		toggle("Exact vs FE gap", &o.ExactBand), toggle("Dimensions", &w.dimensions),
		container.NewHBox(widget.NewLabel("Deflection scale"), fixedWidth(150, c.magnify), c.magnifyText, auto)}
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
	for _, o := range c.orders {
		if o.order == orderOf(ms) {
			c.order.SetSelected(o.name)
		}
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
	w.apply("use "+units.Count(n, "element"), func(m *fem.Model) error { m.Mesh.Elements = n; return nil })
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
	if w.moving != nil {
		w.moving.unitsChanged()
	}
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

// storageUnits names s the way project files do.
func storageUnits(s units.System) storage.UnitSystem {
	if s.Name == units.USCustomary.Name {
		return storage.US
	}
	return storage.SI
}

// describeRef is describe with a capital letter, for panel titles.
func describeRef(r canvas.Ref) string { return capitalize(describe(r)) }
