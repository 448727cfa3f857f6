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
	{fem.QCombinedStress, rgb(0xa8, 0x4a, 0x00), false, "", func(o storage.Overlays) bool { return o.Stress }}, // fibreWords
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

// fibreWords are the combined stress strip's name and its sign convention:
// of one solution it draws, at each place, N/A ± M·c/I in the extreme
// fibre where it is larger in magnitude (fem.Fields.CombinedStress), the
// bottom one where no axial force acts, while the results' largest and
// smallest combined stress are the greatest tension and compression of
// both fibres, which can lie beyond the curve (the top fibre's tension
// over an inner support); the envelope of combinations draws both fibres'
// (fem.CombinationSolutions.At), as the results give them.
func fibreWords(envelope bool) (name, convention string) {
	if envelope {
		return "combined stress, both fibres", "Tension + drawn above: the upper curve is the greatest tension and the lower the greatest compression of both extreme fibres, N/A ± M·c/I, as in the results."
	}
	return "combined stress, larger fibre", "Tension + drawn above. Drawn is N/A ± M·c/I in the extreme fibre where it is larger in magnitude (the bottom fibre, M·c/I, where no axial force acts); the results' combined stress is of both fibres, so its largest and smallest can lie beyond this curve."
}

// capitalized is s with its first letter in upper case.
func capitalized(s string) string {
	r, n := utf8.DecodeRuneInString(s)
	return string(unicode.ToUpper(r)) + s[n:]
}

// diagrams draws every switched-on strip. All strips are sampled in one walk
// over the elements (Build), which also takes each one's extremes and its
// largest gap to the exact solution in closed form.
func (b *builder) diagrams(lay layoutBands, exact *exactRead) {
	ex := exact.curves() // waited for even when no strip draws them
	if len(lay.strips) == 0 {
		return
	}
	qs := stripQuantities(lay)
	// The exact extremes go beside the finite element ones whenever the
	// exact solution is known; its curve and the gap only when shown.
	var exLo, exHi []extreme
	var envs []envelopeStrip
	switch {
	case b.in.Envelope != nil:
		// The upper curves take the place of the solution's (envelope.go).
		envs = b.envelopeCurves(qs)
	case b.in.Exact != nil && b.feCurves != nil:
		exLo, exHi = exactExtremes(b.in.Exact, b.v, qs, b.feCurves)
	}
	for i, st := range lay.strips {
		sd := stripData{place: st}
		if envs != nil {
			sd.env = &envs[i]
			sd.fe, sd.ex = envs[i].hi, envs[i].exactHi
			b.strip(sd)
			continue
		}
		if b.feCurves != nil {
			sd.fe = b.feCurves[i]
		}
		if ex != nil {
			sd.ex = ex[i]
		}
		if b.gaps != nil {
			sd.gap = &b.gaps[i]
		}
		if exLo != nil {
			sd.exLo, sd.exHi, sd.exact = exLo[i], exHi[i], true
		}
		b.strip(sd)
	}
}

// stripQuantities are the quantities of the strips, in layout order.
func stripQuantities(lay layoutBands) []fem.Quantity {
	qs := make([]fem.Quantity, len(lay.strips))
	for i, st := range lay.strips {
		qs[i] = st.diagram.quantity
	}
	return qs
}

// exactRead is the exact curves of the strips being read on a goroutine of
// their own (startExactCurves).
type exactRead struct {
	done   chan struct{}
	read   []*curve
	failed any // what the reading panicked with, raised again by curves
}

// startExactCurves starts reading the exact curves of the strips when the
// drawing shows them (not under an envelope, whose own curves take their
// place). They need only the exact solution, the model and the view, so
// they are read beside the sketch, which does not touch them; diagrams
// waits for them. It returns nil when there is nothing to read.
func (b *builder) startExactCurves(lay layoutBands) *exactRead {
	e := b.exact()
	if e == nil || b.in.Envelope != nil || len(lay.strips) == 0 {
		return nil
	}
	r := &exactRead{done: make(chan struct{})}
	m, v, qs, c := b.in.Model, b.v, stripQuantities(lay), b.in.Cache
	go func() {
		defer func() {
			r.failed = recover()
			close(r.done)
		}()
		r.read = exactCurves(e, m, v, qs, c)
	}()
	return r
}

// wait waits for the reading to end (nothing to wait for on a nil r): the
// curves' memory in the cache is the reading's until then.
func (r *exactRead) wait() {
	if r != nil {
		<-r.done
	}
}

// curves waits for the exact curves and returns them; nil on a nil r. A
// panic of the reading is raised again here, in the builder's goroutine.
func (r *exactRead) curves() []*curve {
	if r == nil {
		return nil
	}
	r.wait()
	if r.failed != nil {
		panic(r.failed)
	}
	return r.read
}

// stripData is what one strip draws: the finite element curve, the exact
// one when shown and the exact extremes in closed form when known.
type stripData struct {
	place      stripPlace
	fe, ex     *curve
	exLo, exHi extreme
	exact      bool // exLo and exHi are known
	gap        *gap // the largest gap, when the exact curve is shown
	// env is the envelope of the combinations, whose upper curves fe and
	// ex are; nil for one solution.
	env *envelopeStrip
}

// strip draws one diagram: its legend, the element boundaries, the finite
// element area and curve, the exact curve with the gap between them, the
// extremes of both and the largest gap, each labelled.
func (b *builder) strip(sd stripData) {
	st, fe, ex := sd.place, sd.fe, sd.ex
	d := st.diagram
	unit := d.quantity.Info().Unit
	b.band = rect{0, st.top, b.v.Width, st.bottom}
	defer func() {
		b.band = rect{}
		b.line(faintColour, 0.75, Point{0, st.bottom}, Point{b.v.Width, st.bottom})
	}()
	if b.in.Unreliable {
		b.place(text1("UNRELIABLE", labelSize, problemColour, true, labelSpot{b.v.Width - 8, st.top + 5, 1, 0}))
	}
	name, convention := quantityWords(d.quantity), capitalized(d.legend)+"."
	if d.quantity == fem.QCombinedStress {
		name, convention = fibreWords(sd.env != nil)
	}
	title := capitalized(name) + " [" + b.u.Unit(unit).Symbol + "]"
	header := []legendItem{{text: title, size: titleSize, colour: d.colour, bold: true}}
	if sd.env != nil {
		text := "envelope of the combinations, upper and lower curve"
		if b.in.Envelope.TrainsLeftOut {
			text = "envelope of the combinations' cases (trains left out), upper and lower curve"
		}
		header = append(header, legendItem{text: text, size: smallSize, colour: inkColour})
	}
	if fe != nil {
		header = append(header, b.stripLegend(d, ex != nil)...)
	}
	if unit == units.Stress && stressPeak(fe, ex) > 0 {
		header = append(header, b.stressLegend(fe, ex))
	}
	innerTop := b.legendRow(header, 8, st.top+4, b.v.Width-8) + 8
	// The sign convention and how the field behaves inside an element, or
	// the convention alone where the curve would have too little room.
	footer := []string{convention}
	if fe != nil {
		footer = []string{convention + " " + b.insideElement(d.quantity, sd.env != nil), convention}
	}
	innerBottom := b.footer(footer, innerTop, st.bottom)
	if unit == units.Stress {
		innerBottom -= 12 // room for the colour band
	}

	lo, hi := 0.0, 0.0
	for _, c := range []*curve{fe, ex} {
		if c != nil && c.n > 0 {
			lo, hi = min(lo, c.lo.value), max(hi, c.hi.value)
		}
	}
	if sd.env != nil {
		lo, hi = sd.env.envelopeRange(lo, hi)
	}
	zero := hi == lo
	if zero {
		lo, hi = -0.5, 0.5 // zero everywhere: the axis in the middle
	}
	span := hi - lo
	upp := span / float64(max(innerBottom-innerTop, 10)) // SI per pixel
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
	if fe != nil {
		b.boundaries(innerTop-4, innerBottom+4)
	}
	l := b.in.Model.Length()
	b.line(faintColour, 1, Point{b.clampX(b.sx(0)), baseY}, Point{b.clampX(b.sx(l)), baseY})
	if fe == nil && ex == nil {
		return // not solved (the sketch says why)
	}
	if zero {
		b.place(text1("zero along the whole member", smallSize, faintColour, false, labelSpot{(b.sx(0) + b.sx(l)) / 2, baseY - 3, 0.5, 1}))
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
		b.polygon(gapFill, color.NRGBA{}, 0, band...)
	}
	if sd.env != nil {
		b.envelopeLower(sd.env, d.colour, toY)
	}
	if len(fePts) > 0 {
		b.line(d.colour, 1.8, fePts...)
		b.avoid(fePts)
	}
	if len(exPts) > 0 {
		b.line(exactColour, 0.9, exPts...)
		b.avoid(exPts)
	}
	if unit == units.Stress {
		b.stressBand(fe, ex, innerBottom+6)
	}
	// Every mark first, so that no label covers one.
	var labels []label
	if sd.env != nil {
		labels = b.envelopeExtremes(d, sd.env, toY)
	} else {
		labels = b.stripExtremes(sd, toY)
		if gap, ok := b.largestGap(sd, toY); ok {
			labels = append(labels, gap)
		}
	}
	for _, l := range labels {
		b.place(l)
	}
}

// boundaries draws the element boundaries from y0 to y1, faint, where
// the visible elements are at least minBoundarySpacing pixels wide on
// average; a finer mesh would only grey the strip.
func (b *builder) boundaries(y0, y1 float32) {
	xs := visibleNodes(b.in.Solution.Mesh.X, b.v)
	if len(xs) < 2 || float32(len(xs)) > b.v.Width/minBoundarySpacing {
		return
	}
	for _, x := range xs {
		px := b.sx(x)
		b.line(boundaryColour, 0.7, Point{px, y0}, Point{px, y1})
	}
}

// minPlot is the least height, px, a strip leaves its curve: the words
// under it give way first.
const minPlot = 36

// footer places at the foot of a strip ending at bottom the first of texts
// whose lines leave the curve minPlot pixels below innerTop, and returns
// the bottom of the curve's room, with space under it for a label beside
// its lowest point.
func (b *builder) footer(texts []string, innerTop, bottom float32) float32 {
	for _, t := range texts {
		lines := wrap(t, smallSize, false, b.v.Width-16, b.textWidth)
		if top := bottom - 3 - TextHeight(smallSize)*float32(len(lines)); top-10-innerTop >= minPlot {
			return b.paragraph(lines, 8, bottom-3, smallSize, faintColour) - 10
		}
	}
	return bottom - 13
}

// minBoundarySpacing is the average width, px, of the visible elements
// below which their boundaries are not drawn.
const minBoundarySpacing = 5

var boundaryColour = rgba(0x8a, 0x90, 0x96, 0x70)

// stripExtremes marks the largest and the smallest value of the finite
// element curve, and of the exact one when shown, and returns their labels,
// each beside the same extreme of the exact solution when known; an extreme
// near zero against the field's largest magnitude is left unmarked.
func (b *builder) stripExtremes(sd stripData, toY func(float64) float32) []label {
	fe, d := sd.fe, sd.place.diagram
	if fe == nil || fe.n == 0 {
		return nil
	}
	exact := sd.exact
	size := max(math.Abs(fe.peakLo.value), math.Abs(fe.peakHi.value))
	if exact {
		size = max(size, math.Abs(sd.exLo.value), math.Abs(sd.exHi.value))
	}
	type pair struct {
		fe, ex extreme
		up     bool // drawn toward the top of the strip
		upper  bool // the largest values, not the smallest
	}
	var pairs []pair
	for _, p := range []pair{{fe.peakHi, sd.exHi, !d.downPositive, true}, {fe.peakLo, sd.exLo, d.downPositive, false}} {
		// A constant field is labelled once, at its largest value: its
		// extremes may be the one point, so they are told apart by role.
		constant := !p.upper && math.Abs(fe.peakHi.value-fe.peakLo.value) <= 1e-9*size
		if !exact {
			p.ex = p.fe
		}
		if labelled(p.fe.value, p.ex.value, size) && !constant {
			pairs = append(pairs, p)
		}
	}
	var labels []label
	for _, p := range pairs {
		b.marker(Point{b.sx(p.fe.x), toY(p.fe.value)}, 2.5, d.colour, false)
		if sd.ex != nil {
			b.marker(Point{b.sx(p.ex.x), toY(p.ex.value)}, 3, exactColour, true)
		}
		// Each on its side of a jump, as the results table (fem.Summary's
		// extremes) says it.
		s, e, q := b.in.Solution, b.in.Exact, d.quantity
		var ex *extreme
		sides := [2]fem.Side{s.SideOf(e, s, q, p.fe.x, p.fe.value, size, p.upper)}
		if exact {
			ex = &p.ex
			sides[1] = s.SideOf(e, e, q, p.ex.x, p.ex.value, size, p.upper)
		}
		at := Point{b.sx(p.fe.x), toY(p.fe.value)}
		labels = append(labels, b.extremeLabel("", q.Info().Unit, p.fe, ex, sides, at, p.up, inkColour))
	}
	return labels
}

// besideSpots are the spots for a label of a curve's point at: outside the
// curve first (above a point drawn toward the top, below one drawn toward
// the bottom), then beside it.
func besideSpots(at Point, up bool) []labelSpot {
	ay, dy := float32(1), float32(-5)
	if !up {
		ay, dy = 0, 5
	}
	return []labelSpot{
		{at.X, at.Y + dy, 0.5, ay}, {at.X + 6, at.Y + dy, 0, ay}, {at.X - 6, at.Y + dy, 1, ay},
		{at.X + 8, at.Y, 0, 0.5}, {at.X - 8, at.Y, 1, 0.5},
	}
}

// gapInk is the colour of the largest gap's mark and label.
var gapInk = rgb(0xa0, 0x10, 0x50)

// largestGap marks where the finite element curve is farthest from the
// exact one, with a bar between the two, and returns its label; false when
// they agree to round-off.
func (b *builder) largestGap(sd stripData, toY func(float64) float32) (label, bool) {
	fe, g := sd.fe, sd.gap
	if fe == nil || g == nil || !sd.exact {
		return label{}, false
	}
	size := max(math.Abs(fe.peakLo.value), math.Abs(fe.peakHi.value), math.Abs(sd.exLo.value), math.Abs(sd.exHi.value))
	if g.at.value <= tie*size {
		return label{}, false
	}
	x := b.sx(g.at.x)
	if x < 0 || x > b.v.Width {
		return label{}, false // the largest gap lies off the view
	}
	y0, y1 := toY(g.fe), toY(g.exact)
	b.line(gapInk, 1.5, Point{x, y0}, Point{x, y1})
	for _, y := range []float32{y0, y1} {
		b.line(gapInk, 1.5, Point{x - 3, y}, Point{x + 3, y})
	}
	b.occupy(rect{x - 3, min(y0, y1) - 1, x + 3, max(y0, y1) + 1}, markerBox)
	unit := sd.place.diagram.quantity.Info().Unit
	s := fmt.Sprintf("largest gap %s at %s", b.format(unit, g.at.value), b.format(units.Position, g.at.x))
	at := Point{x, max(y0, y1)}
	return label{lines: []string{s}, size: smallSize, colour: gapInk, at: at,
		spots: append(besideSpots(at, false), besideSpots(Point{x, min(y0, y1)}, true)...)}, true
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

// stressSteps is the number of colour steps from zero to the largest stress.
const stressSteps = 16

// stressPeak is the largest magnitude of the stress the band colours: the
// finite element curve's, or the exact one's without it.
func stressPeak(fe, ex *curve) float64 {
	c := fe
	if c == nil || c.n == 0 {
		c = ex
	}
	if c == nil {
		return 0
	}
	return math.Abs(c.peakAbs().value)
}

// stressBand draws a colour strip along the member at y, one run per colour step.
func (b *builder) stressBand(fe, ex *curve, y float32) {
	c := fe
	if c == nil || c.n == 0 {
		c = ex
	}
	peak := stressPeak(fe, ex)
	if peak == 0 {
		return
	}
	step := func(col column) int {
		v := col.hi.value
		if -col.lo.value > v {
			v = col.lo.value
		}
		return int(math.Round(v / peak * stressSteps))
	}
	runStart, runStep := -1, 0
	flush := func(end int) {
		if runStart >= 0 {
			x0, x1 := float32(runStart-1), float32(end-1)
			b.rectangle(x0, y, x1, y+8, stressColour(float64(runStep)/stressSteps))
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
}

// stressLegend is the colour band's legend, a legend item: compression on
// the left, tension on the right, each end labelled with its stress.
func (b *builder) stressLegend(fe, ex *curve) legendItem {
	peak := stressPeak(fe, ex)
	words := fmt.Sprintf("colour band: %s to %s", b.format(units.Stress, -peak), b.format(units.Stress, peak))
	const w = 4 * 2 * stressSteps / 2
	return legendItem{width: w, text: words, size: smallSize, colour: faintColour, swatch: func(x, y float32) {
		for k := -stressSteps; k < stressSteps; k++ {
			sx := x + float32(k+stressSteps)*2
			b.rectangle(sx, y-4, sx+2, y+4, stressColour((float64(k)+0.5)/stressSteps))
		}
	}}
}
