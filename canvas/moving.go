package canvas

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
)

// MovingInput is what a moving-loads picture shows: the member with a train
// standing at one position, the envelope of one quantity over all the
// train's positions with that quantity where the train stands, and the
// influence line of one target with the train's worst positions for it.
type MovingInput struct {
	Model *fem.Model
	Units units.System
	Train *moving.Train
	// At is where the train is drawn.
	At moving.Placement
	// Envelope is the train's envelope and Quantity the index, in
	// moving.EnvelopeQuantities, of the quantity drawn; Current holds that
	// quantity at the envelope's stations with the train at At (nil to
	// leave it out).
	Envelope *moving.Envelope
	Quantity int
	Current  []float64
	// Combination names the combination whose envelope Envelope is, the
	// train on top of its cases ("" for the train alone), and Peaks are
	// its largest and smallest value of the quantity drawn over the whole
	// member, between the stations too (nil: the envelope's own).
	Combination string
	Peaks       []moving.Extreme
	// Line is the influence line drawn, with Worst the train's extremes for
	// its target (their positions marked); nil for no line.
	Line  *moving.Line
	Worst []moving.Extreme
	// HoverX is the x under the mouse when Hovering.
	HoverX   float64
	Hovering bool
}

// Colours of the moving-loads picture.
var (
	envelopeFill    = rgba(0x19, 0x5f, 0xc0, 0x2c)
	envelopeColour  = rgb(0x19, 0x5f, 0xc0)
	influenceColour = rgb(0x2d, 0x6a, 0x2f)
	largestColour   = rgb(0xc0, 0x1c, 0x1c)
	smallestColour  = rgb(0x6a, 0x2d, 0x8f)
)

// MovingBands are the places of a moving-loads picture's three bands, for
// the window to read values under the mouse.
type MovingBands struct {
	MemberY                                          float32
	EnvelopeTop, EnvelopeBottom, EnvelopeBaseline    float32
	InfluenceTop, InfluenceBottom, InfluenceBaseline float32
	// EnvelopePerPixel and InfluencePerPixel are the values (SI; per newton
	// for the line) one pixel upwards stands for.
	EnvelopePerPixel, InfluencePerPixel float64
}

// BuildMoving lays out a moving-loads picture of width × height pixels with
// the member fitted across it.
func BuildMoving(in MovingInput, width, height float32) (*Scene, MovingBands) {
	v := NewView(width, height)
	b := &builder{in: Input{Model: in.Model}, v: v, u: in.Units, s: &Scene{Width: width, Height: height}}
	if b.u.Name == "" {
		b.u = units.SI
	}
	var bands MovingBands
	if in.Model == nil || in.Model.Length() <= 0 {
		return b.scene(), bands
	}
	v.Fit(in.Model)
	b.v = v
	// Bands: the sketch (the train's title, an axle's label, its arrow,
	// the member, the supports and the run), the envelope, the influence
	// line.
	top := float32(6)
	bands.MemberY = top + TextHeight(labelSize) + TextHeight(smallSize) + movingArrow + 14
	sketchBottom := bands.MemberY + supportHeight + 22
	rest := height - sketchBottom
	bands.EnvelopeTop, bands.EnvelopeBottom = sketchBottom+4, sketchBottom+rest*0.55
	bands.InfluenceTop, bands.InfluenceBottom = bands.EnvelopeBottom+18, height-6
	b.movingSketch(in, bands.MemberY)
	b.envelopeBand(in, &bands)
	b.influenceBand(in, &bands)
	if in.Hovering {
		b.hoverLine(b.sx(in.HoverX), top, height)
	}
	return b.scene(), bands
}

// movingSketch draws the member, its supports and the train at in.At.
func (b *builder) movingSketch(in MovingInput, y float32) {
	m := in.Model
	x0, x1 := b.sx(0), b.sx(m.Length())
	b.line(inkColour, memberWidth, Point{x0, y}, Point{x1, y})
	for i, sp := range m.Supports {
		b.support(i, sp, y)
	}
	for _, h := range m.Hinges {
		b.circle(Point{b.sx(h.X), y}, 4, white, inkColour, 1.5)
	}
	t := in.Train
	if t == nil {
		return
	}
	points, lines := t.Loads(in.At)
	biggest := 0.0
	for _, p := range points {
		biggest = max(biggest, -p.Transverse)
	}
	arrowTop := y - memberWidth/2 - movingArrow
	for _, d := range lines {
		a, c := b.sx(d.Points[0].X), b.sx(d.Points[1].X)
		band := arrowTop + 18
		b.rectangle(a, band, c, y-memberWidth/2-2, rgba(0xb0, 0x2a, 0x1e, 0x30))
		b.line(loadColour, 1.2, Point{a, band}, Point{c, band})
		b.place(text1(b.format(units.LineLoad, -d.Points[0].Intensity), smallSize, loadColour, false,
			labelSpot{(a + c) / 2, band - 2, 0.5, 1}))
	}
	for i, p := range points {
		x := b.sx(p.X)
		h := float32(movingArrow)
		if biggest > 0 {
			h = movingArrow/2 + movingArrow/2*float32(-p.Transverse/biggest)
		}
		b.arrow(Point{x, y - memberWidth/2 - 2 - h}, Point{x, y - memberWidth/2 - 2}, loadColour, 2, 8)
		if i == 0 {
			b.circle(Point{x, y - memberWidth/2 - 4 - h}, 3, loadColour, loadColour, 1)
		}
		b.place(text1(b.format(units.Force, -p.Transverse), smallSize, loadColour, false,
			labelSpot{x, y - memberWidth/2 - 6 - h, 0.5, 1}, labelSpot{x + 4, y - memberWidth/2 - 6 - h, 0, 1}))
	}
	from, to := t.Run(m.Length())
	runY := y + supportHeight + 14
	b.line(faintColour, 1, Point{b.sx(from), runY}, Point{b.sx(to), runY})
	b.line(faintColour, 1, Point{b.sx(from), runY - 4}, Point{b.sx(from), runY + 4})
	b.line(faintColour, 1, Point{b.sx(to), runY - 4}, Point{b.sx(to), runY + 4})
	facing := map[moving.Direction]string{moving.Forward: "facing +x", moving.Backward: "facing −x"}[in.At.Direction]
	b.text(fmt.Sprintf("%s, front at x = %s %s", trainName(t), b.format(units.Position, in.At.Front), facing), 8, 6, labelSize, 0, 0, loadColour, true)
}

// movingArrow is the length of the arrow of the heaviest axle, pixels.
const movingArrow = 46

// trainName names a train in the picture.
func trainName(t *moving.Train) string {
	if t.Name != "" {
		return "train “" + t.Name + "”"
	}
	return "train"
}

// envelopeBand draws the envelope of the chosen quantity (shaded between
// its largest and smallest values) and the quantity where the train stands.
func (b *builder) envelopeBand(in MovingInput, bands *MovingBands) {
	e := in.Envelope
	if e == nil || in.Quantity < 0 || in.Quantity >= len(moving.EnvelopeQuantities) {
		return
	}
	q := moving.EnvelopeQuantities[in.Quantity]
	info := q.Info()
	hi, lo := e.Max[in.Quantity], e.Min[in.Quantity]
	vmin, vmax := 0.0, 0.0
	for s := range e.Stations {
		vmin, vmax = min(vmin, lo[s]), max(vmax, hi[s])
	}
	mid, per := fitRange(vmin, vmax, bands.EnvelopeTop+TextHeight(labelSize)+14, bands.EnvelopeBottom-4)
	bands.EnvelopeBaseline, bands.EnvelopePerPixel = mid, per
	toY := func(v float64) float32 { return mid - float32(v/per) }
	caption := fmt.Sprintf("%s: envelope over every position (shaded), and where the train stands; positive up", info.Name)
	if in.Combination != "" {
		caption = fmt.Sprintf("%s: envelope of combination %q, its cases and the train at every position (shaded); positive up", info.Name, in.Combination)
	}
	b.text(caption, 8, bands.EnvelopeTop, labelSize, 0, 0, inkColour, true)
	upper, lower := make([]Point, len(e.Stations)), make([]Point, len(e.Stations))
	for s, x := range e.Stations {
		upper[s] = Point{b.sx(x), toY(hi[s])}
		lower[s] = Point{b.sx(x), toY(lo[s])}
	}
	outline := append(append([]Point{}, upper...), reversed(lower)...)
	b.polygon(envelopeFill, color.NRGBA{}, 0, outline...)
	b.line(envelopeColour, 1.2, upper...)
	b.line(envelopeColour, 1.2, lower...)
	b.line(dimensionColour, 1, Point{b.sx(0), mid}, Point{b.sx(in.Model.Length()), mid})
	if in.Current != nil {
		cur := make([]Point, len(e.Stations))
		for s, x := range e.Stations {
			cur[s] = Point{b.sx(x), toY(in.Current[s])}
		}
		b.line(loadColour, 1.8, cur...)
	}
	whi, wlo := e.Worst(q)
	if len(in.Peaks) == 2 {
		whi, wlo = in.Peaks[0], in.Peaks[1]
	}
	size := max(math.Abs(whi.Value), math.Abs(wlo.Value))
	for _, w := range []struct {
		ex moving.Extreme
		c  color.NRGBA
		ay float32
	}{{whi, largestColour, 1}, {wlo, smallestColour, 0}} {
		// ay: the label goes above a largest value, below a smallest. A
		// value that is zero or round-off against the other is no peak.
		if math.Abs(w.ex.Value) <= 1e-9*size {
			continue
		}
		p := Point{b.sx(w.ex.X), toY(w.ex.Value)}
		b.circle(p, 3.5, w.c, w.c, 1)
		b.place(text1(b.format(info.Unit, w.ex.Value)+" "+w.ex.Side.At(b.format(units.Position, w.ex.X)), smallSize, w.c, false,
			labelSpot{p.X + 7, p.Y, 0, 0.5}, labelSpot{p.X - 7, p.Y, 1, 0.5}, labelSpot{p.X, p.Y + 6 - 12*w.ay, 0.5, 1 - w.ay}))
	}
}

// fitRange places values from vmin ≤ 0 to vmax ≥ 0 between the screen
// heights top and bottom: it returns the y of zero and the value per pixel.
func fitRange(vmin, vmax float64, top, bottom float32) (zero float32, per float64) {
	per = (vmax - vmin) / float64(bottom-top)
	if !(per > 0) {
		return (top + bottom) / 2, 1
	}
	return top + float32(vmax/per), per
}

func reversed(pts []Point) []Point {
	out := make([]Point, len(pts))
	for i, p := range pts {
		out[len(pts)-1-i] = p
	}
	return out
}

// influenceBand draws the influence line with its target marked and the
// train's worst positions for it: the axles where they stand, on the line.
func (b *builder) influenceBand(in MovingInput, bands *MovingBands) {
	l := in.Line
	if l == nil {
		return
	}
	lo, hi := l.Extremes()
	top, bottom := bands.InfluenceTop+2*TextHeight(labelSize)+10, bands.InfluenceBottom-4
	mid, per := fitRange(min(lo.Value, 0), max(hi.Value, 0), top, bottom)
	bands.InfluenceBaseline, bands.InfluencePerPixel = mid, per
	toY := func(v float64) float32 { return mid - float32(v/per) }
	what := l.Describe(b.format(units.Position, l.Target.X))
	b.text(fmt.Sprintf("influence line of the %s, for %s; positive up", what, l.Target.UnitLoad(b.u.Unit(units.Force).Symbol)), 8, bands.InfluenceTop, labelSize, 0, 0, inkColour, true)
	b.line(dimensionColour, 1, Point{b.sx(0), mid}, Point{b.sx(in.Model.Length()), mid})
	for _, piece := range l.Polylines(600) {
		pts := make([]Point, len(piece))
		for i, p := range piece {
			pts[i] = Point{b.sx(p.S), toY(p.Value)}
		}
		area := append(append([]Point{{pts[0].X, mid}}, pts...), Point{pts[len(pts)-1].X, mid})
		b.polygon(rgba(0x2d, 0x6a, 0x2f, 0x22), color.NRGBA{}, 0, area...)
		b.line(influenceColour, 1.6, pts...)
	}
	x := l.Target.X
	if l.Target.Reaction {
		x = in.Model.Supports[l.Target.Support].X
	}
	b.s.Items = append(b.s.Items, Item{Kind: Polyline, Points: []Point{{b.sx(x), top}, {b.sx(x), bottom}}, Stroke: influenceColour, StrokeWidth: 1, Dash: true})
	if in.Train == nil {
		return
	}
	for k, w := range in.Worst {
		c := largestColour
		if k > 0 {
			c = smallestColour
		}
		points, _ := in.Train.Loads(w.Placement)
		L := in.Model.Length()
		for _, p := range points {
			if p.X < 0 || p.X > L {
				continue // off the member (a train driving off its ends): it carries nothing
			}
			v := l.At(p.X, fem.Right)
			pt := Point{b.sx(p.X), toY(v)}
			b.line(c, 1, Point{pt.X, mid}, pt)
			b.circle(pt, 3, c, c, 1)
		}
		word := "largest"
		if k > 0 {
			word = "smallest"
		}
		kind := units.Force
		if !l.Target.Reaction {
			kind = l.Target.Quantity.Info().Unit
		} else if l.Target.Motion == fem.Rotation {
			kind = units.Moment
		}
		text := fmt.Sprintf("%s %s with the front at %s", word, b.format(kind, w.Value), b.format(units.Position, w.Placement.Front))
		b.text(text, 8+float32(k)*280, bands.InfluenceTop+TextHeight(labelSize)+4, smallSize, 0, 0, c, false)
	}
}

// WriteMoving draws the moving-loads picture of width × height points as
// "png" (scale pixels per point), "svg" or "pdf", with the caution in a
// footer.
func WriteMoving(w io.Writer, format string, in MovingInput, width, height float32, scale float64) error {
	if in.Model == nil {
		return fmt.Errorf("canvas: there is no model to draw")
	}
	if height <= footerHeight {
		return footerError(height, footerHeight, "the caution")
	}
	in.Hovering = false
	s, _ := BuildMoving(in, width, height-footerHeight)
	s.Height = height
	s.Items = append(s.Items, Item{Kind: Text, Text: Caution, At: Point{8, height - footerHeight + 4},
		Size: smallSize, Stroke: dimensionColour, Width: textWidth(Caution, smallSize, false)})
	return writeScene(w, s, format, scale)
}

// MovingSheet is a one-page calculation sheet of a train: the title block,
// what the train is, the moving-loads picture and the table of its
// governing positions.
type MovingSheet struct {
	Picture MovingInput
	Notes   SheetNotes
	// About are lines saying what the train and the line are.
	About []string
	// Header and Rows make the table of governing positions.
	Header []string
	Rows   [][]string
}

// WriteMovingSheet writes the sheet as "pdf" or "png" on one A4 page.
func WriteMovingSheet(w io.Writer, format string, in MovingSheet) error {
	if in.Picture.Model == nil {
		return fmt.Errorf("canvas: the moving-loads sheet needs a model")
	}
	if format != "pdf" && format != "png" {
		return fmt.Errorf("canvas: cannot write a sheet as %q: use \"pdf\" or \"png\"", format)
	}
	u := in.Picture.Units
	if u.Name == "" {
		u = units.SI
	}
	b := &builder{in: Input{Model: in.Picture.Model}, v: View{Width: a4Width, Height: a4Height, Scale: 1}, u: u, s: &Scene{Width: a4Width, Height: a4Height}}
	sh := &sheet{b: b, y: sheetEdge}
	right := float32(a4Width - sheetEdge)
	// A title and one line of notes: the work this sheet belongs to.
	b.text("Moving loads: calculation sheet", sheetEdge, sh.y, 13, 0, 0, inkColour, true)
	sh.y += TextHeight(13) + 2
	n := in.Notes
	notes := fmt.Sprintf("Project: %s · Member: %s · Engineer: %s · Date: %s · Stave %s · Units: %s", n.Project, n.Mark, n.Engineer, n.Date, n.Version, u.Name)
	for _, ln := range wrap(notes, sheetSmall+0.5, false, right-sheetEdge, textWidth) {
		sh.row([]string{ln}, []float32{sheetEdge}, sheetSmall+0.5, inkColour, false)
	}
	b.line(inkColour, 1, Point{sheetEdge, sh.y + 1}, Point{right, sh.y + 1})
	sh.y += 4
	sh.heading("Train and influence line")
	for _, line := range in.About {
		for _, ln := range wrap(line, sheetSmall, false, right-sheetEdge, textWidth) {
			sh.row([]string{ln}, []float32{sheetEdge}, sheetSmall, inkColour, false)
		}
	}
	sh.heading("The train at its worst position, its envelope and the influence line")
	dh := float32(400)
	pic := in.Picture
	pic.Hovering = false
	scene, _ := BuildMoving(pic, (right-sheetEdge)/diagramScale, dh/diagramScale)
	appendScene(b.s, scene, sheetEdge, sh.y, diagramScale)
	b.polygon(color.NRGBA{}, faintColour, 0.5, Point{sheetEdge, sh.y}, Point{right, sh.y}, Point{right, sh.y + dh}, Point{sheetEdge, sh.y + dh})
	sh.y += dh + 4
	sh.heading("Governing positions (front: the x of the first axle)")
	xs := make([]float32, len(in.Header))
	for i := range xs {
		xs[i] = sheetEdge + float32(i)*(right-sheetEdge)/float32(len(xs))
	}
	if len(xs) > 0 {
		xs[0], xs[1] = sheetEdge, sheetEdge+95
		for i := 2; i < len(xs); i++ {
			xs[i] = xs[1] + float32(i-1)*(right-xs[1])/float32(len(xs)-1)
		}
	}
	sh.row(in.Header, xs, sheetSmall, faintColour, true)
	foot := float32(a4Height - sheetEdge - 2*TextHeight(sheetText))
	for _, r := range in.Rows {
		if sh.y > foot-2*TextHeight(sheetSmall) {
			sh.row([]string{"… (more rows than the page holds: see stave influence --envelope)"}, []float32{sheetEdge}, sheetSmall, faintColour, false)
			break
		}
		sh.row(r, xs, sheetSmall, inkColour, false)
	}
	b.line(inkColour, 0.75, Point{sheetEdge, foot - 4}, Point{right, foot - 4})
	for i, ln := range wrap(Caution, sheetText, true, right-sheetEdge, textWidth) {
		b.text(ln, sheetEdge, foot+float32(i)*TextHeight(sheetText), sheetText, 0, 0, inkColour, true)
	}
	return writeScene(w, b.scene(), format, float64(sheetDPI)/72)
}
