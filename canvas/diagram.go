package canvas

import (
	"fmt"
	"image/color"
	"math"
	"unicode"
	"unicode/utf8"

	"golang.org/x/text/encoding/charmap"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// diagram is one result strip under the sketch.
type diagram struct {
	quantity fem.Quantity
	colour   color.NRGBA
	// downPositive draws positive values below the axis (the bending moment
	// on the tension side under sagging).
	downPositive bool
	legend       string
	enabled      func(storage.Overlays) bool
}

var diagramsList = []diagram{
	{fem.QAxialForce, rgb(0x2e, 0x7d, 0x32), false, "tension + drawn above", func(o storage.Overlays) bool { return o.AxialForce }},
	{fem.QShearForce, rgb(0x15, 0x65, 0xc0), false, "V = dM/dx, + drawn above", func(o storage.Overlays) bool { return o.ShearForce }},
	{fem.QBendingMoment, rgb(0x7b, 0x1f, 0xa2), true, "sagging + drawn below (tension side)", func(o storage.Overlays) bool { return o.BendingMoment }},
	{fem.QCombinedStress, rgb(0xa8, 0x4a, 0x00), false, "tension + drawn above", func(o storage.Overlays) bool { return o.Stress }},
}

// stripCount is the number of diagram strips o switches on.
func stripCount(o storage.Overlays) int {
	n := 0
	for _, d := range diagramsList {
		if d.enabled(o) {
			n++
		}
	}
	return n
}

// quantityWords names q in the trade's words with its symbol, where the
// symbol can be written in every export: PDF text knows only code page 1252
// (see codePage1252), which has no Greek letters.
func quantityWords(q fem.Quantity) string {
	info := q.Info()
	if _, err := charmap.Windows1252.NewEncoder().String(info.Symbol); info.Symbol == "" || err != nil {
		return info.Name
	}
	return info.Name + " " + info.Symbol
}

// capitalized is s with its first letter in upper case.
func capitalized(s string) string {
	r, n := utf8.DecodeRuneInString(s)
	return string(unicode.ToUpper(r)) + s[n:]
}

// diagrams draws every switched-on strip. All strips are sampled in one walk
// over the elements.
func (b *builder) diagrams(lay layoutBands) {
	if len(lay.strips) == 0 {
		return
	}
	qs := make([]quantity, len(lay.strips))
	for i, st := range lay.strips {
		qs[i] = sampled(st.diagram.quantity)
	}
	fe := b.feCurves
	var ex []*curve
	var gaps []extreme
	var envs []envelopeStrip
	switch {
	case b.in.Envelope != nil:
		// The upper curves take the place of the solution's (envelope.go).
		envs = b.envelopeCurves(qs)
		fe, ex = make([]*curve, len(envs)), make([]*curve, len(envs))
		for i := range envs {
			fe[i], ex[i] = envs[i].hi, envs[i].exactHi
		}
		gaps = make([]extreme, len(envs))
	case b.in.Exact != nil && b.in.Overlays.ExactBand:
		ex, gaps = exactCurves(b.in.Exact, b.in.Solution, b.in.Model, b.v, qs, b.in.Cache)
	}
	for i, st := range lay.strips {
		var f, e *curve
		var gap extreme
		var env *envelopeStrip
		if fe != nil {
			f = fe[i]
		}
		if ex != nil {
			e, gap = ex[i], gaps[i]
		}
		if envs != nil {
			env = &envs[i]
		}
		b.strip(st, f, e, gap, env)
	}
}

// strip draws one diagram: axis, FE area and curve, exact curve and the gap
// between them, extremes and the largest gap labelled.
// With an envelope, fe and ex are its upper curves and env has the rest.
func (b *builder) strip(st stripPlace, fe, ex *curve, gap extreme, env *envelopeStrip) {
	d := st.diagram
	unit := d.quantity.Info().Unit
	title := capitalized(quantityWords(d.quantity)) + " [" + b.u.Unit(unit).Symbol + "]"
	b.text(title, 8, st.top+5, titleSize, 0, 0, d.colour, true)
	tr := rect{0, st.top, 16 + textWidth(title, titleSize, true), st.top + 22}
	b.occupy(tr)
	legend := d.legend
	if env != nil {
		legend = "envelope of the combinations, upper and lower curve; " + legend
	}
	if ex != nil {
		legend += "; thin black: exact, shaded: gap to FE"
	}
	b.occupy(b.text(legend, tr.x1+8, st.top+7, smallSize, 0, 0, faintColour, false))
	if b.in.Unreliable {
		b.occupy(b.text("UNRELIABLE", b.v.Width-8, st.top+5, labelSize, 1, 0, problemColour, true))
	}
	defer b.line(faintColour, 0.75, Point{0, st.bottom}, Point{b.v.Width, st.bottom})

	lo, hi := 0.0, 0.0
	for _, c := range []*curve{fe, ex} {
		if c != nil && c.n > 0 {
			lo, hi = min(lo, c.lo.value), max(hi, c.hi.value)
		}
	}
	if env != nil {
		lo, hi = env.envelopeRange(lo, hi)
	}
	// Room above and below the curve for the labels of its extremes.
	innerTop, innerBottom := st.top+40, st.bottom-20
	if unit == units.Stress {
		innerBottom -= 12 // room for the colour band
	}
	span := hi - lo
	if span == 0 || fe == nil && ex == nil {
		span = 1
	}
	upp := span / float64(innerBottom-innerTop) // SI per pixel
	toY := func(v float64) float32 {
		if d.downPositive {
			return innerTop + float32((v-lo)/upp)
		}
		return innerTop + float32((hi-v)/upp)
	}
	baseY := toY(0)
	sign := 1.0
	if d.downPositive {
		sign = -1
	}
	b.s.Strips = append(b.s.Strips, Strip{Name: capitalized(d.quantity.Info().Name), Top: st.top, Bottom: st.bottom, BaselineY: baseY, UnitsPerPixel: sign * upp})
	l := b.in.Model.Length()
	b.line(faintColour, 1, Point{b.clampX(b.sx(0)), baseY}, Point{b.clampX(b.sx(l)), baseY})
	if fe == nil && ex == nil {
		b.text("no results", b.v.Width/2, (st.top+st.bottom)/2, labelSize, 0.5, 0.5, faintColour, false)
		return
	}
	var fePts, exPts []Point
	if fe != nil && fe.n > 0 {
		fePts = fe.points(toY)
		area := append(append([]Point{}, fePts...), Point{fePts[len(fePts)-1].X, baseY}, Point{fePts[0].X, baseY})
		b.polygon(withAlpha(d.colour, 0x38), color.NRGBA{}, 0, area...)
	}
	if ex != nil && ex.n > 0 {
		exPts = ex.points(toY)
	}
	if len(fePts) > 0 && len(exPts) > 0 {
		band := append([]Point{}, fePts...)
		for k := len(exPts) - 1; k >= 0; k-- {
			band = append(band, exPts[k])
		}
		b.polygon(gapColour, color.NRGBA{}, 0, band...)
	}
	if env != nil {
		b.envelopeLower(env, d.colour, toY)
	}
	if len(fePts) > 0 {
		b.line(d.colour, 1.8, fePts...)
	}
	if len(exPts) > 0 {
		b.line(exactColour, 0.9, exPts...)
	}
	if unit == units.Stress {
		b.stressBand(fe, ex, innerBottom+6, st.top+8)
	}
	main := fe
	if main == nil || main.n == 0 {
		main = ex
	}
	if env != nil {
		b.envelopeExtremes(d.quantity, d, env, toY)
	} else {
		b.extremes(main, d, toY)
	}
	if ex != nil && fe != nil && gap.value != 0 && math.Abs(gap.value) > 1e-9*max(math.Abs(lo), math.Abs(hi)) {
		gx := b.sx(gap.x)
		b.circle(Point{gx, toY(ex.valueNear(gap.x))}, 3, color.NRGBA{}, gapColour, 1.5)
		s := fmt.Sprintf("largest gap %s at %s", b.format(unit, math.Abs(gap.value)), b.format(units.Position, gap.x))
		b.label(s, smallSize, rgb(0xa0, 0x10, 0x50), false, true,
			labelSpot{gx, st.bottom - 3, 0.5, 1}, labelSpot{b.v.Width - 8, st.bottom - 3, 1, 1})
	}
}

// valueNear is the curve value in the column holding x (its last sample).
func (c *curve) valueNear(x float64) float64 {
	k := int(math.Floor(float64(c.v.ToScreenX(x)))) + 1
	k = max(0, min(len(c.cols)-1, k))
	return c.cols[k].last.value
}

// extremes labels the highest and lowest values with their positions.
func (b *builder) extremes(c *curve, d diagram, toY func(float64) float32) {
	if c == nil || c.n == 0 {
		return
	}
	for _, e := range []extreme{c.hi, c.lo} {
		// A value at round-off of the diagram's size is a zero and gets no
		// label; a constant diagram gets one.
		size := max(math.Abs(c.hi.value), math.Abs(c.lo.value))
		if math.Abs(e.value) <= 1e-9*size || (e == c.lo && math.Abs(c.hi.value-c.lo.value) <= 1e-9*math.Abs(c.hi.value)) {
			continue
		}
		b.peakLabel(e.x, e.value, fmt.Sprintf("%s at %s", b.format(d.quantity.Info().Unit, e.value), b.format(units.Position, e.x)), d, toY)
	}
}

// peakLabel marks the value v at x and labels it s, outside the curve:
// above a peak drawn upward, below one drawn downward.
func (b *builder) peakLabel(x, v float64, s string, d diagram, toY func(float64) float32) {
	px, py := b.sx(x), toY(v)
	b.circle(Point{px, py}, 2.5, d.colour, color.NRGBA{}, 0)
	up := (v > 0) != d.downPositive
	ay, dy := float32(1), float32(-4)
	if !up {
		ay, dy = 0, 4
	}
	b.label(s, smallSize, inkColour, false, true,
		labelSpot{px, py + dy, 0.5, ay}, labelSpot{px + 6, py + dy, 0, ay}, labelSpot{px - 6, py + dy, 1, ay},
		labelSpot{px + 6, py, 0, 0.5})
}

// stressColour maps a stress to a diverging colour: compression violet,
// tension orange, zero white; t is stress over the largest magnitude.
func stressColour(t float64) color.NRGBA {
	t = max(-1, min(1, t))
	tension := [3]float64{0xd9, 0x5f, 0x0e}
	compression := [3]float64{0x4b, 0x3b, 0x9a}
	end := tension
	if t < 0 {
		end, t = compression, -t
	}
	mix := func(k int) uint8 { return uint8(math.Round(255 + (end[k]-255)*t)) }
	return color.NRGBA{mix(0), mix(1), mix(2), 0xff}
}

// stressBand draws a colour strip along the member, one run per colour step,
// and its legend.
func (b *builder) stressBand(fe, ex *curve, y, legendY float32) {
	c := fe
	if c == nil || c.n == 0 {
		c = ex
	}
	peak := math.Abs(c.peakAbs().value)
	if peak == 0 {
		return
	}
	const steps = 16
	step := func(col column) int {
		v := col.hi.value
		if -col.lo.value > v {
			v = col.lo.value
		}
		return int(math.Round(v / peak * steps))
	}
	runStart, runStep := -1, 0
	flush := func(end int) {
		if runStart >= 0 {
			x0, x1 := float32(runStart-1), float32(end-1)
			b.rectangle(x0, y, x1, y+8, stressColour(float64(runStep)/steps))
		}
	}
	last := 0
	for k, col := range c.cols {
		if col.n == 0 {
			continue // a column between samples continues the run
		}
		if s := step(col); runStart < 0 || s != runStep {
			flush(k)
			runStart, runStep = k, s
		}
		last = k
	}
	flush(last + 1)
	// Legend: compression on the left, tension on the right.
	lx := b.v.Width - 190
	ly := legendY
	for k := -steps; k < steps; k++ {
		x := lx + float32(k+steps)*4
		b.rectangle(x, ly, x+4, ly+8, stressColour((float64(k)+0.5)/steps))
	}
	b.text(b.format(units.Stress, -peak), lx-3, ly+4, smallSize-1, 1, 0.5, faintColour, false)
	b.text(b.format(units.Stress, peak), lx+4*2*steps+3, ly+4, smallSize-1, 0, 0.5, faintColour, false)
	b.occupy(rect{lx - 60, ly - 2, b.v.Width, ly + 10})
}
