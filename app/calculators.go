package app

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/check"
	"stave/fem/material"
	"stave/fem/section"
	"stave/fem/units"
	"stave/storage"
)

// sectionShape is one shape of the section calculator.
type sectionShape struct {
	name  string
	dims  []string
	start []float64 // invented starting dimensions, m, to show the fields' use
	props func(d []float64) (section.Properties, error)
}

var sectionShapes = []sectionShape{
	{"Rectangle", []string{"Width b", "Depth h"}, []float64{0.1, 0.3},
		func(d []float64) (section.Properties, error) { return section.Rectangle(d[0], d[1]) }},
	{"Solid round", []string{"Diameter d"}, []float64{0.05},
		func(d []float64) (section.Properties, error) { return section.SolidRound(d[0]) }},
	{"Round tube", []string{"Outside diameter D", "Wall thickness t"}, []float64{0.1143, 0.006},
		func(d []float64) (section.Properties, error) { return section.RoundTube(d[0], d[1]) }},
	{"Rectangular hollow", []string{"Outside width B", "Outside depth H", "Wall thickness t"}, []float64{0.1, 0.2, 0.008},
		func(d []float64) (section.Properties, error) { return section.RectangularHollow(d[0], d[1], d[2]) }},
	{"I shape", []string{"Flange width b", "Depth h", "Flange thickness tf", "Web thickness tw"}, []float64{0.15, 0.3, 0.0107, 0.0071},
		func(d []float64) (section.Properties, error) { return section.IShape(d[0], d[1], d[2], d[3]) }},
}

// segmentPicker chooses the segment a calculator fills: the selected one,
// else the first.
func (w *Window) segmentPicker() (*escSelect, func() int) {
	n := len(w.project.Model.Segments)
	names := make([]string, n)
	for i, s := range w.project.Model.Segments {
		names[i] = fmt.Sprintf("segment %d (x = %s to %s)", i+1, w.units.Format(units.Position, s.Start), w.units.Format(units.Position, s.End))
	}
	pick := newEscSelect(names, nil)
	pick.OnEscape = w.escape
	start := 0
	if w.selected.Kind == canvas.Segment && w.selected.Index < n {
		start = w.selected.Index
	}
	if n > 0 {
		pick.SetSelectedIndex(start)
	}
	return pick, func() int { return pick.SelectedIndex() }
}

// showSectionCalculator computes A, I and c from a shape's dimensions and
// fills them into a segment.
func (w *Window) showSectionCalculator() {
	if len(w.project.Model.Segments) == 0 {
		w.setStatus("the section calculator fills a segment: draw a member first")
		return
	}
	segment, which := w.segmentPicker()
	now := widget.NewLabel("")
	showNow := func() {
		if i := which(); i >= 0 && i < len(w.project.Model.Segments) {
			sec, u := w.project.Model.Segments[i].Section, w.units
			now.SetText(fmt.Sprintf("Segment now: A = %s    I = %s    c = %s", u.Show(units.Area, sec.Area),
				u.Show(units.SecondMoment, sec.SecondMoment), u.Show(units.Dimension, sec.FibreDistance)))
		}
	}
	showNow()
	segment.OnChanged = func(string) { showNow() }
	result := widget.NewLabel("")
	result.Wrapping = fyne.TextWrapWord
	form := container.New(layout.NewFormLayout())
	var entries []*escEntry
	var shape sectionShape
	var props section.Properties
	var propsErr error
	compute := func() {
		d := make([]float64, len(entries))
		for i, e := range entries {
			v, err := w.units.Parse(units.Dimension, e.Text)
			if err != nil {
				props, propsErr = section.Properties{}, fmt.Errorf("%s: %v", shape.dims[i], err)
				result.SetText(propsErr.Error())
				return
			}
			d[i] = v
		}
		props, propsErr = shape.props(d)
		if propsErr != nil {
			result.SetText(propsErr.Error())
			return
		}
		u := w.units
		result.SetText(fmt.Sprintf("A = %s    I = %s    c = %s\nS = I/c = %s",
			u.Show(units.Area, props.Area), u.Show(units.SecondMoment, props.SecondMoment),
			u.Show(units.Dimension, props.FibreDistance), u.Show(units.SectionModulus, props.SectionModulus)))
	}
	shapes := make([]string, len(sectionShapes))
	for i, s := range sectionShapes {
		shapes[i] = s.name
	}
	choose := newEscSelect(shapes, func(name string) {
		for _, s := range sectionShapes {
			if s.name == name {
				shape = s
			}
		}
		form.Objects, entries = nil, nil
		for i, label := range shape.dims {
			e := newEscEntry()
			e.OnEscape = w.escape
			e.SetText(w.units.Format(units.Dimension, shape.start[i]))
			e.OnChanged = func(string) { compute() }
			entries = append(entries, e)
			form.Add(widget.NewLabel(label))
			form.Add(e)
		}
		form.Refresh()
		compute()
	})
	choose.OnEscape = w.escape
	choose.SetSelectedIndex(0)
	fill := w.newDialogButton("Fill A, I and c of the segment", func() {
		if propsErr != nil {
			w.setStatus("section not filled: %v", propsErr)
			return
		}
		i := which()
		if w.apply(fmt.Sprintf("set segment %d to a %s section", i+1, strings.ToLower(shape.name)), func(m *fem.Model) error {
			m.Segments[i].Section = props.Section()
			return nil
		}) == nil {
			w.selectItem(canvas.Ref{Kind: canvas.Segment, Index: i})
			showNow()
		}
	})
	fill.Importance = widget.HighImportance
	note := widget.NewLabel("Idealised shapes: sharp corners, no root fillets or welds. Tabulated values of rolled sections differ by a few per cent: use them where you have them. Bending is about the axis across the depth.")
	note.Wrapping = fyne.TextWrapWord
	content := container.NewVBox(
		container.NewBorder(nil, nil, widget.NewLabel("Segment"), nil, segment),
		container.NewBorder(nil, nil, widget.NewLabel("Shape"), nil, choose),
		form, widget.NewSeparator(), result, now, fill, note)
	d, _ := w.newDialog("Section calculator", content, choice{label: "Close"})
	d.Resize(fyne.NewSize(560, 480))
	w.showDialog(d)
}

// showMaterials fills a segment's material from a list of typical ones.
func (w *Window) showMaterials() {
	if len(w.project.Model.Segments) == 0 {
		w.setStatus("the materials list fills a segment: draw a member first")
		return
	}
	segment, which := w.segmentPicker()
	typical := material.Typical()
	names := make([]string, len(typical))
	for i, e := range typical {
		names[i] = e.Material.Name
	}
	detail := widget.NewLabel("")
	detail.Wrapping = fyne.TextWrapWord
	var chosen material.Entry
	pick := newEscSelect(names, func(name string) {
		for _, e := range typical {
			if e.Material.Name == name {
				chosen = e
			}
		}
		u, m := w.units, chosen.Material
		detail.SetText(fmt.Sprintf("E = %s · density %s · α = %s · strength %s\nThe strength is the %s.\nSource: %s.",
			u.Format(units.Modulus, m.Elastic), u.Format(units.Density, m.Density), u.Format(units.ThermalExpansion, m.ThermalExpansion),
			u.Format(units.Stress, m.Allowable), chosen.Strength, chosen.Source))
	})
	pick.OnEscape = w.escape
	pick.SetSelectedIndex(0)
	caution := widget.NewLabelWithStyle(material.Caution, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	caution.Importance = widget.WarningImportance
	caution.Wrapping = fyne.TextWrapWord
	factor := w.project.View.SafetyFactor
	if !(factor > 0) {
		factor = 1
	}
	strength := widget.NewLabel(fmt.Sprintf("The strength goes into the segment's allowable stress as it is; the stress check divides it by the safety factor, now %s (Study ▸ Check limits).", units.FormatNumber(factor)))
	strength.Wrapping = fyne.TextWrapWord
	fill := w.newDialogButton("Fill E, density, α and strength of the segment", func() {
		i := which()
		if w.apply(fmt.Sprintf("make segment %d %s", i+1, chosen.Material.Name), func(m *fem.Model) error {
			m.Segments[i].Material = chosen.Material
			return nil
		}) == nil {
			w.selectItem(canvas.Ref{Kind: canvas.Segment, Index: i})
		}
	})
	fill.Importance = widget.HighImportance
	content := container.NewVBox(caution,
		container.NewBorder(nil, nil, widget.NewLabel("Segment"), nil, segment),
		container.NewBorder(nil, nil, widget.NewLabel("Material"), nil, pick),
		detail, strength, fill)
	d, _ := w.newDialog("Typical materials", content, choice{label: "Close"})
	d.Resize(fyne.NewSize(620, 420))
	w.showDialog(d)
}

// showCheckLimits edits the project's deflection limit and safety factor.
func (w *Window) showCheckLimits() {
	f := newCheckLimitsForm(w.project.View)
	w.showForm("Check limits", "Apply", f.items, func(ok bool) {
		if !ok {
			return
		}
		n, err1 := strconv.ParseFloat(strings.TrimSpace(f.ratio.Text), 64)
		sf, err2 := strconv.ParseFloat(strings.TrimSpace(f.factor.Text), 64)
		if err1 != nil || err2 != nil || !(n > 0) || !(sf > 0) {
			w.setStatus("check limits not changed: type positive numbers, such as 360 and 1.5")
			return
		}
		w.setCheckLimits(n, sf)
	})
}

// checkLimitsForm is the content of the Check limits dialog: the span/n of
// the deflection check, with typical values to pick from, and the safety
// factor on allowable stress.
type checkLimitsForm struct {
	ratio, factor *escEntry
	typical       *escSelect
	items         []*widget.FormItem
}

func newCheckLimitsForm(v storage.View) *checkLimitsForm {
	f := &checkLimitsForm{ratio: newEscEntry(), factor: newEscEntry()}
	f.ratio.SetText(units.FormatNumber(v.DeflectionLimit))
	f.factor.SetText(units.FormatNumber(v.SafetyFactor))
	limits := check.DeflectionLimits()
	names := make([]string, len(limits))
	for i, l := range limits {
		names[i] = fmt.Sprintf("span/%g: %s", l.Ratio, l.Use)
	}
	f.typical = newEscSelect(names, func(name string) {
		if i := slices.Index(names, name); i >= 0 {
			f.ratio.SetText(units.FormatNumber(limits[i].Ratio))
		}
	})
	f.typical.PlaceHolder = "pick a typical value…"
	typical := widget.NewFormItem("Typical deflection limits", f.typical)
	typical.HintText = "common practice; the governing code and the brief set the real limit"
	f.items = []*widget.FormItem{
		typical,
		widget.NewFormItem("Deflection limit: span /", f.ratio),
		widget.NewFormItem("Safety factor on allowable stress", f.factor),
	}
	return f
}

// setCheckLimits stores the limits and checks again.
func (w *Window) setCheckLimits(spanRatio, safetyFactor float64) {
	w.project.View.DeflectionLimit, w.project.View.SafetyFactor = spanRatio, safetyFactor
	w.resubmit()
	w.updateTitle()
	w.setStatus("checks use span/%s and a safety factor of %s (common practice values vary; local codes govern)",
		units.FormatNumber(spanRatio), units.FormatNumber(safetyFactor))
}
