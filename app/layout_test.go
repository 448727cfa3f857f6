package app

import (
	"fmt"
	"path/filepath"
	"strconv"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// laptop is the content of a window filling a screen of 1280 × 720 pixels
// under its menu bar (some 30 px in the screenshots of the window).
var laptop = fyne.NewSize(1280, 690)

// openTestdata opens a file of testdata in a window of size.
func openTestdata(t *testing.T, name string, size fyne.Size) (*Window, *uiQueue) {
	t.Helper()
	p, err := storage.Load(filepath.Join("..", "testdata", name))
	if err != nil {
		t.Fatal(err)
	}
	w, q := newTestWindow(t, p)
	w.win.Resize(size)
	return w, q
}

// On a laptop's screen every control of the tool strip is in sight
// without scrolling: the tools, the support kind and the load cases with
// their combinations.
func TestStripFitsALaptopScreen(t *testing.T) {
	for _, size := range []fyne.Size{laptop, fyne.NewSize(1600, 970)} {
		w, _ := openTestdata(t, "two_span_cases.json", size)
		strip := w.ui.strip
		top := fyne.CurrentApp().Driver().AbsolutePositionForObject(strip).Y
		for _, o := range test.LaidOutObjects(strip.Content) {
			if _, ok := o.(fyne.Focusable); !ok || !o.Visible() {
				continue
			}
			if bottom := fyne.CurrentApp().Driver().AbsolutePositionForObject(o).Y + o.Size().Height - top; bottom > strip.Size().Height+0.5 {
				t.Errorf("at %v the strip shows %.0f px, and %s ends at %.0f px, out of sight", size, strip.Size().Height, nameOf(o), bottom)
			}
		}
	}
}

// nameOf is the text of a widget, to name it in a failure.
func nameOf(o fyne.CanvasObject) string {
	if b := buttonIn(o); b != nil {
		return "button " + quoteOr(b.Text, "(icon only)")
	}
	switch v := o.(type) {
	case *widget.Check:
		return "switch " + quoteOr(v.Text, "")
	case *escCheck:
		return "switch " + quoteOr(v.Text, "")
	case *widget.Select:
		return "choice " + quoteOr(v.Selected, "")
	case *escSelect:
		return "choice " + quoteOr(v.Selected, "")
	case *widget.Entry:
		return "field " + quoteOr(v.Text, "")
	case *escEntry:
		return "field " + quoteOr(v.Text, "")
	}
	return "a " + fyneTypeName(o)
}

func quoteOr(s, empty string) string {
	if s == "" {
		return empty
	}
	return "“" + s + "”"
}

func fyneTypeName(o fyne.CanvasObject) string {
	switch o.(type) {
	case *drawing:
		return "drawing"
	case *movingPicture:
		return "picture"
	case *widget.Table, *escTable:
		return "table"
	case *widget.Slider, *escSlider:
		return "slider"
	case *widget.List:
		return "list"
	}
	return "widget"
}

// The choices above the drawing are wide enough to show the longest of
// their options whole: the Show choice of a model without cases read
// "the loads (…".
func TestChoicesShowTheirWholeText(t *testing.T) {
	for _, name := range []string{"demo.json", "two_span_cases.json"} {
		w, _ := openTestdata(t, name, laptop)
		for _, s := range []*escSelect{w.ui.cases.showSelect, w.ui.cases.caseSelect} {
			for _, o := range s.Options {
				// The room for the text: the select's width less its
				// icon, the padding by the icon, and the label's inset
				// each side (fyne's selectRenderer.Layout, v2.7), in
				// the theme the select is shown in.
				size := func(n fyne.ThemeSizeName) float32 { return theme.SizeForWidget(n, s) }
				room := s.Size().Width - size(theme.SizeNameInlineIcon) - size(theme.SizeNameInnerPadding) - 3*size(theme.SizeNamePadding)
				if need := fyne.MeasureText(o, theme.TextSize(), fyne.TextStyle{}).Width; need > room+0.5 {
					t.Errorf("%s: the choice of %q has %.0f px for its text, %q needs %.0f", name, s.Selected, room, o, need)
				}
			}
		}
	}
}

// Every button of the load cases says what it does in words, for the eye
// and for a screen reader.
func TestCaseButtonsHaveWords(t *testing.T) {
	w, _ := openTestdata(t, "two_span_cases.json", laptop)
	n := 0
	for _, o := range test.LaidOutObjects(w.ui.cases.box) {
		if b := buttonIn(o); b != nil {
			n++
			if b.Text == "" {
				t.Errorf("a button of the load cases shows only an icon")
			}
		}
	}
	if n < 3 {
		t.Errorf("the load cases have %d buttons, want add, rename and delete", n)
	}
}

// Tab takes the focus through the window as it reads: the tool strip on
// the left first, then the column of the drawing (the bar above it, the
// drawing, the bars below), then the panes on the right, each column from
// top to bottom.
func TestTabFollowsTheScreen(t *testing.T) {
	w, _ := openTestdata(t, "two_span_cases.json", laptop)
	c := w.win.Canvas()
	drv := fyne.CurrentApp().Driver()
	stripRight := drv.AbsolutePositionForObject(w.ui.strip).X + w.ui.strip.Size().Width
	drawRight := drv.AbsolutePositionForObject(w.draw).X + w.draw.Size().Width
	column := func(p fyne.Position) int {
		switch {
		case p.X < stripRight:
			return 0
		case p.X < drawRight:
			return 1
		}
		return 2
	}
	// A widget scrolled out of its pane counts as at the pane's foot.
	foot := map[fyne.CanvasObject]float32{}
	for _, o := range test.LaidOutObjects(w.win.Content()) {
		if s, ok := o.(*container.Scroll); ok {
			for _, in := range test.LaidOutObjects(s.Content) {
				foot[in] = drv.AbsolutePositionForObject(s).Y + s.Size().Height
			}
		}
	}
	c.Unfocus()
	c.FocusNext()
	first := c.Focused()
	var last fyne.Position
	var lastName string
	for i := 0; i < 200; i++ {
		o := c.Focused().(fyne.CanvasObject)
		p := drv.AbsolutePositionForObject(o)
		if y, ok := foot[o]; ok {
			p.Y = min(p.Y, y)
		}
		if i > 0 {
			if column(p) < column(last) || column(p) == column(last) && p.Y < last.Y-0.5 {
				t.Errorf("Tab went from %s at %v (column %d) back to %s at %v (column %d)", lastName, last, column(last), nameOf(o), p, column(p))
			}
		}
		last, lastName = p, nameOf(o)
		c.FocusNext()
		if c.Focused() == first {
			return
		}
	}
	t.Fatal("Tab never came back to the first widget")
}

// On a laptop's screen, 1280 or 1024 px wide, the readout shows without
// scrolling sideways every quantity's value, exact and FE side by side
// with the unit, and for the envelope its smallest and largest: its FE
// column ran past the pane at 1280 px wide, where the governing
// combinations' names widened the exact column, and at 1024 px the unit
// column was out of sight for any model. The
// values of the two equal spans (4 m, 10 kN/m on each or on one) are the
// beam tables' (AISC Manual, "Beam Diagrams and Formulas", continuous
// beam, two equal spans): over the middle support M = −wL²/8 = −20 kN·m
// with both loaded, −wL²/16 = −10 kN·m with one.
func TestEnvelopeReadoutFitsALaptopScreen(t *testing.T) {
	for _, size := range []fyne.Size{smallLaptop, laptop} {
		for _, name := range []string{"demo.json", "two_span_cases.json"} {
			w, q := openTestdata(t, name, size)
			finished(t, w, q)
			readoutFits(t, w, q, fmt.Sprintf("%s at %.0f px wide", name, size.Width))
		}
	}
	w, q := openTestdata(t, "two_span_cases.json", laptop)
	finished(t, w, q)
	r := w.ui.readout
	// Over the middle support, in SI: the smallest moment is the one of
	// both spans loaded, and the largest no more than one span's.
	w.setUnits(units.SI)
	finished(t, w, q)
	w.draw.hovering, w.draw.hoverX = true, 4
	w.hoverChanged()
	lo, hi := envelopeRows(t, r, fem.QBendingMoment)
	if lo[columnExact] != "-20.00" || lo[columnUnit] != "kN·m" || lo[columnGoverning] == "" || hi[columnGoverning] == "" {
		t.Errorf("envelope of M at x = 4 m: smallest %q, largest %q; want -20.00 kN·m and the combinations named", lo, hi)
	}
	if v, err := strconv.ParseFloat(hi[columnExact], 64); err != nil || v < -10 || v > 0 {
		t.Errorf("envelope of M at x = 4 m: largest %q, want between −wL²/16 = −10 and 0 kN·m", hi[columnExact])
	}
}

// readoutFits checks, in both unit systems and at points along the member,
// that the readout of w shows its quantity, exact, FE and unit columns
// whole and each text in its column.
func readoutFits(t *testing.T, w *Window, q *uiQueue, where string) {
	t.Helper()
	r := w.ui.readout
	for _, sys := range []units.System{units.SI, units.USCustomary} {
		w.setUnits(sys)
		finished(t, w, q)
		for _, x := range []float64{0.3, 1.5, 2.9, 4, 5.71, 7.6} {
			w.draw.hovering, w.draw.hoverX = true, x
			w.hoverChanged()
			var used float32
			for c := columnQuantity; c <= columnUnit; c++ {
				used += r.widths[c]
			}
			if room := r.table.Size().Width; used > room+0.5 {
				t.Errorf("%s, %s, x = %g m: the quantity, exact, FE and unit columns need %.0f px, the readout is %.0f wide", where, sys.Name, x, used, room)
			}
			for _, row := range r.rows {
				for c, text := range row {
					if need := fyne.MeasureText(text, readoutTextSize(), fyne.TextStyle{}).Width; need > r.widths[c] {
						t.Errorf("%s, %s, x = %g m: column %d is %.0f wide for %q, which needs %.0f", where, sys.Name, x, c, r.widths[c], text, need)
					}
				}
			}
		}
	}
}

// envelopeRows are the readout's rows of q's smallest and largest value.
func envelopeRows(t *testing.T, r *readout, q fem.Quantity) (lo, hi [readoutColumns]string) {
	t.Helper()
	if len(r.rows) != 2*len(fem.Quantities()) {
		t.Fatalf("the envelope's readout has %d rows, want two per quantity", len(r.rows))
	}
	return r.rows[2*int(q)], r.rows[2*int(q)+1]
}

// smallLaptop is the content of a window filling a screen of 1024 × 640
// pixels under its menu bar.
var smallLaptop = fyne.NewSize(1024, 610)

// The window fits a screen of 1024 × 640 with the caution line at its foot
// in sight: there the bars above and below the drawing wrap into more
// rows, and with fyne's padding they and the drawing asked for 659 px, so
// the window grew past the screen's foot and the caution with it.
func TestWindowFitsASmallLaptop(t *testing.T) {
	for _, name := range []string{"demo.json", "two_span_cases.json", "moving/runway.json"} {
		w, _ := openTestdata(t, name, smallLaptop)
		if need := w.win.Content().MinSize(); need.Height > smallLaptop.Height || need.Width > smallLaptop.Width {
			t.Errorf("%s: the window needs %.0f × %.0f px, the screen has %.0f × %.0f under the menu bar",
				name, need.Width, need.Height, smallLaptop.Width, smallLaptop.Height)
		}
	}
}

// The moving-loads window gives its picture most of a screen of 1024 ×
// 640: the train form, widened by its axles' heading and its switch, took
// 456 of the 1024 px, so the picture had 552, and the controls above it
// wrapped into four rows. (That the controls stay above the picture as
// the window shrinks is seen on the screen only: the test driver does not
// lay a window out again when a minimum size changes.)
func TestMovingWindowPictureOnASmallScreen(t *testing.T) {
	w, q := openTestdata(t, filepath.Join("moving", "runway.json"), smallLaptop)
	finished(t, w, q)
	w.showMovingLoads()
	mw := w.moving
	small := fyne.NewSize(1024, 640)
	mw.win.Resize(small)
	if got := mw.pic.Size().Width; got < 0.65*small.Width {
		t.Errorf("the picture is %.0f px wide in a window %.0f wide, want at least two thirds (the form needs %.0f)",
			got, small.Width, mw.formScroll.Content.MinSize().Width)
	}
}
