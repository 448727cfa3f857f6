package canvas

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// Caution is printed on every calculation sheet and exported drawing.
const Caution = fem.Caution

// CombinedStressNote says under a table of extremes what the combined
// stress's are (fem.Extreme): those of both fibres, where the stress
// diagram of one solution draws the larger fibre (fibreWords).
const CombinedStressNote = "Combined stress N/A ± M·c/I: largest, the greatest tension, and smallest, the greatest compression, in either extreme fibre."

// SheetNotes fill the title block of a calculation sheet.
type SheetNotes struct {
	Project, Mark, Engineer, Date, Version string
}

// SheetInput is what a calculation sheet shows. Input carries the model,
// results, unit system and the overlays that pick the diagrams.
type SheetInput struct {
	Input Input
	Notes SheetNotes
	// Mesh says who chose the mesh and the accuracy it reaches, one sentence.
	Mesh string
	// Checks are the warnings (failed, cautioned and noted findings), one
	// sentence each.
	Checks []string
	// Cases are the load cases, combinations with their factors and the
	// envelope's governing values of a model with cases, one line each.
	Cases []string
	// Trains are the moving load trains the sheet's results leave out, one
	// line each.
	Trains []string
}

// A4 portrait in points; the sheet is laid out as a scene of this size.
const (
	a4Width    = 595.28
	a4Height   = 841.89
	sheetEdge  = 28
	sheetDPI   = 150 // PNG sheets
	sheetSmall = 7.5
	sheetText  = 8.5
)

// WriteSheet writes a one-page A4 calculation sheet as "pdf" or "png".
func WriteSheet(w io.Writer, format string, in SheetInput) error {
	if in.Input.Model == nil {
		return fmt.Errorf("canvas: the calculation sheet needs a model")
	}
	if format != "pdf" && format != "png" {
		return fmt.Errorf("canvas: cannot write a calculation sheet as %q: use \"pdf\" or \"png\"", format)
	}
	return writeScene(w, buildSheet(in), format, float64(sheetDPI)/72)
}

// sheet lays out text rows on the page scene.
type sheet struct {
	b *builder
	y float32
}

func (sh *sheet) row(cols []string, xs []float32, size float32, c color.NRGBA, bold bool) {
	for i, s := range cols {
		sh.b.text(s, xs[i], sh.y, size, 0, 0, c, bold)
	}
	sh.y += TextHeight(size) + 1
}

// para writes text wrapped to the page width in small type.
func (sh *sheet) para(text string, c color.NRGBA) {
	for _, ln := range wrap(text, sheetSmall, false, a4Width-2*sheetEdge, textWidth) {
		sh.row([]string{ln}, []float32{sheetEdge}, sheetSmall, c, false)
	}
}

func (sh *sheet) heading(s string) {
	sh.y += 5
	sh.b.text(s, sheetEdge, sh.y, 10, 0, 0, inkColour, true)
	sh.y += TextHeight(10) + 1
	sh.b.line(faintColour, 0.5, Point{sheetEdge, sh.y}, Point{a4Width - sheetEdge, sh.y})
	sh.y += 2
}

// buildSheet lays out the whole page as one scene, so the PDF and PNG
// sheets are drawn by the same code as every other output.
func buildSheet(in SheetInput) *Scene {
	u := in.Input.Units
	if u.Name == "" {
		u = units.SI
	}
	pageView := View{Width: a4Width, Height: a4Height, Scale: 1}
	b := &builder{in: Input{Model: in.Input.Model}, v: pageView, u: u, s: &Scene{Width: a4Width, Height: a4Height}}
	sh := &sheet{b: b, y: sheetEdge}
	right := float32(a4Width - sheetEdge)

	// Title block.
	b.polygon(color.NRGBA{}, inkColour, 1, Point{sheetEdge, sh.y}, Point{right, sh.y}, Point{right, sh.y + 58}, Point{sheetEdge, sh.y + 58})
	b.text("Member check: calculation sheet", sheetEdge+8, sh.y+7, 13, 0, 0, inkColour, true)
	n := in.Notes
	left := []string{"Project: " + n.Project, "Member: " + n.Mark, "Engineer: " + n.Engineer}
	rightCol := []string{"Date: " + n.Date, "Stave " + n.Version, "Units: " + u.Name}
	for i := range left {
		b.text(left[i], sheetEdge+8, sh.y+26+float32(i)*10, sheetSmall+0.5, 0, 0, inkColour, false)
		b.text(rightCol[i], 380, sh.y+26+float32(i)*10, sheetSmall+0.5, 0, 0, inkColour, false)
	}
	sh.y += 62

	sh.modelTable(in.Input.Model)

	// Diagrams: the same Build as the screen, at a fixed size, drawn at
	// diagramScale so its labels sit close to the size of the table text.
	sh.heading("Diagrams")
	di := in.Input
	di.Selected, di.Hovering, di.Highlight, di.Cache = Ref{}, false, [2]float64{}, nil
	room := float32(a4Height-sheetEdge-3*TextHeight(sheetText)) - sh.y - sh.reserve(in)
	dh := min(float32(300+120*stripCount(in.Input.Overlays))*diagramScale, room)
	dw := float32(right - sheetEdge)
	v := NewView(dw/diagramScale, dh/diagramScale)
	v.Fit(in.Input.Model)
	diagrams := Build(di, v)
	// Strips that do not fit the height run on below it: shrink them into the box.
	k := float32(diagramScale)
	for _, st := range diagrams.Strips {
		if st.Bottom*diagramScale > dh+1 { // a point's slack: strips end at the box to round-off
			k = min(k, dh/st.Bottom)
		}
	}
	appendScene(b.s, diagrams, sheetEdge, sh.y, k)
	b.polygon(color.NRGBA{}, faintColour, 0.5, Point{sheetEdge, sh.y}, Point{right, sh.y}, Point{right, sh.y + dh}, Point{sheetEdge, sh.y + dh})
	sh.y += dh + 4

	if in.Input.Solution != nil {
		sh.resultsTable(fem.Summarize(in.Input.Solution, in.Input.Exact), in.Mesh, u)
	} else if in.Input.Problem != "" {
		sh.heading("Results")
		for _, ln := range wrap(in.Input.Problem, sheetText, true, right-sheetEdge, textWidth) {
			sh.row([]string{ln}, []float32{sheetEdge}, sheetText, problemColour, true)
		}
	}
	sh.list("Load cases, combinations and envelope", in.Cases, inkColour)
	sh.list("Warnings", in.Checks, problemColour)
	sh.list("Moving load trains, left out of these results and checks (stave solve and stave influence give them)", in.Trains, inkColour)
	// The caution sits at the foot of the page whatever the content above.
	foot := float32(a4Height - sheetEdge - 2*TextHeight(sheetText))
	b.line(inkColour, 0.75, Point{sheetEdge, foot - 4}, Point{right, foot - 4})
	for i, ln := range wrap(Caution, sheetText, true, right-sheetEdge, textWidth) {
		b.text(ln, sheetEdge, foot+float32(i)*TextHeight(sheetText), sheetText, 0, 0, inkColour, true)
	}
	return b.scene()
}

// diagramScale shrinks the diagrams onto the sheet.
const diagramScale = 0.62

// appendScene copies the items of src into dst scaled by k and shifted by (dx, dy).
func appendScene(dst, src *Scene, dx, dy, k float32) {
	move := func(p Point) Point { return Point{p.X*k + dx, p.Y*k + dy} }
	for _, it := range src.Items {
		pts := make([]Point, len(it.Points))
		for i, p := range it.Points {
			pts[i] = move(p)
		}
		it.Points = pts
		it.Center, it.At = move(it.Center), move(it.At)
		it.Radius, it.StrokeWidth, it.Size, it.Width = it.Radius*k, it.StrokeWidth*k, it.Size*k, it.Width*k
		dst.Items = append(dst.Items, it)
	}
}

// reserve is the height the results and checks below the diagrams take.
func (sh *sheet) reserve(in SheetInput) float32 {
	line := TextHeight(sheetSmall) + 1
	h := float32(0)
	if s := in.Input.Solution; s != nil {
		// The note, two headers, nine extremes and the note on the
		// combined stress, the inside supports' header, equilibrium, two
		// lines on the mesh and one on the error.
		h += line*float32(19+len(s.Reactions)+len(s.Foundations)+len(s.Model.Supports)) + 9 + 30
	} else {
		h += 3*line + 25
	}
	for _, list := range [][]string{in.Checks, in.Cases, in.Trains} {
		if len(list) > 0 {
			h += 25
			for _, c := range list {
				h += line * float32(len(wrap("• "+c, sheetText, false, a4Width-2*sheetEdge, textWidth)))
			}
		}
	}
	return h
}

// list writes a heading and its lines as bullets in colour c; nothing
// without lines.
func (sh *sheet) list(title string, lines []string, c color.NRGBA) {
	if len(lines) == 0 {
		return
	}
	sh.heading(title)
	for _, l := range lines {
		for _, ln := range wrap("• "+l, sheetText, false, a4Width-2*sheetEdge, textWidth) {
			sh.row([]string{ln}, []float32{sheetEdge}, sheetText, c, false)
		}
	}
}

// sheetRows caps each input table so the page holds.
const sheetRows = 6

func (sh *sheet) modelTable(m *fem.Model) {
	sh.heading("Model")
	xs := []float32{sheetEdge, sheetEdge + 70}
	f := sh.b.format
	var rows [][2]string
	if m.AxialOnly {
		rows = append(rows, [2]string{"member", "tie or strut: axial force only, bending not solved"})
	}
	heated := m.TemperatureChange != 0
	for _, c := range m.Cases {
		heated = heated || c.TemperatureChange != 0
	}
	for i, s := range m.Segments {
		rows = append(rows, [2]string{fmt.Sprintf("segment %d", i+1), fmt.Sprintf("%s to %s; A %s, I %s, c %s; E %s %s",
			f(units.Position, s.Start), f(units.Position, s.End), f(units.Area, s.Section.Area),
			f(units.SecondMoment, s.Section.SecondMoment), f(units.Dimension, s.Section.FibreDistance),
			f(units.Modulus, s.Material.Elastic), s.Material.Name)})
		// What else the segment models, on a line of its own so the row
		// fits: the material values the loads and checks use (the sheet of
		// a rod under its own weight gave g but not ρ).
		var also []string
		if m.Gravity != [2]float64{} && s.Material.Density != 0 {
			also = append(also, "density "+f(units.Density, s.Material.Density))
		}
		if (heated || s.TemperatureDifference != 0) && s.Material.ThermalExpansion != 0 {
			also = append(also, "thermal expansion "+f(units.ThermalExpansion, s.Material.ThermalExpansion))
		}
		if s.Material.Allowable > 0 {
			also = append(also, "allowable stress "+f(units.Stress, s.Material.Allowable))
		}
		if s.TemperatureDifference != 0 {
			d := "bottom fibre warmer than the top by " + f(units.TemperatureChange, s.TemperatureDifference)
			if s.Section.Depth > 0 {
				d += " over a depth of " + f(units.Dimension, s.Section.Depth)
			}
			also = append(also, d)
		}
		if s.ShearDeformation {
			d := "shear deformation (Timoshenko beam), "
			if s.Section.ShearArea > 0 {
				d += "As " + f(units.Area, s.Section.ShearArea)
			} else {
				d += "κ " + units.FormatNumber(s.Section.ShearCoefficient)
			}
			if s.Material.ShearModulus > 0 {
				d += ", G " + f(units.Modulus, s.Material.ShearModulus)
			} else {
				d += ", ν " + units.FormatNumber(s.Material.Poisson)
			}
			also = append(also, d)
		}
		if len(also) > 0 {
			rows = append(rows, [2]string{"", strings.Join(also, "; ")})
		}
	}
	for i, s := range m.Supports {
		d := fmt.Sprintf("%s at %s", s.Kind, f(units.Position, s.X))
		if s.Stiffness != [3]float64{} {
			d += fmt.Sprintf("; k %s, %s, %s", f(units.TranslationalStiffness, s.Stiffness[0]),
				f(units.TranslationalStiffness, s.Stiffness[1]), f(units.RotationalStiffness, s.Stiffness[2]))
		}
		if st := s.Settlement; st != [3]float64{} {
			d += fmt.Sprintf("; settles %s, %s, %s", f(units.Deflection, st[0]), f(units.Deflection, st[1]), f(units.Rotation, st[2]))
		}
		rows = append(rows, [2]string{fmt.Sprintf("support %d", i+1), d})
	}
	for i, h := range m.Hinges {
		d := "at " + f(units.Position, h.X) + ": carries no moment"
		if h.Stiffness > 0 {
			d = "at " + f(units.Position, h.X) + ": rotational spring " + f(units.RotationalStiffness, h.Stiffness)
		}
		rows = append(rows, [2]string{fmt.Sprintf("hinge %d", i+1), d})
	}
	for i, g := range m.Foundations {
		var parts []string
		if g.Modulus > 0 {
			parts = append(parts, "modulus "+f(units.FoundationModulus, g.Modulus)+" across")
		}
		if g.AxialModulus > 0 {
			parts = append(parts, f(units.FoundationModulus, g.AxialModulus)+" along")
		}
		rows = append(rows, [2]string{fmt.Sprintf("foundation %d", i+1), fmt.Sprintf("%s to %s; %s",
			f(units.Position, g.Start), f(units.Position, g.End), strings.Join(parts, ", "))})
	}
	for i, p := range m.PointLoads {
		var parts []string
		if p.Axial != 0 {
			parts = append(parts, "axial "+f(units.Force, p.Axial))
		}
		if p.Transverse != 0 {
			parts = append(parts, "transverse "+f(units.Force, p.Transverse))
		}
		if p.Moment != 0 {
			parts = append(parts, "moment "+f(units.Moment, p.Moment))
		}
		rows = append(rows, [2]string{fmt.Sprintf("point load %d", i+1), "at " + f(units.Position, p.X) + ": " + strings.Join(parts, ", ")})
	}
	for i, d := range m.DistributedLoad {
		var parts []string
		for _, p := range d.Points {
			parts = append(parts, f(units.LineLoad, p.Intensity)+" at "+f(units.Position, p.X))
		}
		rows = append(rows, [2]string{fmt.Sprintf("line load %d", i+1), d.Direction.String() + ": " + strings.Join(parts, "; ")})
	}
	if m.Gravity != [2]float64{} {
		rows = append(rows, [2]string{"self-weight", fmt.Sprintf("g = (%s, %s)", f(units.Acceleration, m.Gravity[0]), f(units.Acceleration, m.Gravity[1]))})
	}
	if m.TemperatureChange != 0 {
		rows = append(rows, [2]string{"temperature change", f(units.TemperatureChange, m.TemperatureChange)})
	}
	limit := 3 * sheetRows
	for i, r := range rows {
		if i == limit {
			sh.row([]string{"", fmt.Sprintf("… and %d more (see the model file)", len(rows)-limit)}, xs, sheetSmall, faintColour, false)
			break
		}
		sh.row(r[:], xs, sheetSmall, inkColour, false)
	}
}

// tableGap is the least room between two columns of a table, points.
const tableGap = 4

// tableColumns places the columns of a table of rows under the bold head
// in type of size across width from the sheet's edge: each column as wide
// as its widest text, the room left over shared out between them. A
// table too wide for width at size, with tableGap between its columns,
// is set in the smaller type that fits, returned as fitted.
func tableColumns(head []string, rows [][]string, size, width float32) (xs []float32, fitted float32) {
	widths := make([]float32, len(head))
	for i, h := range head {
		widths[i] = textWidth(h, size, true)
	}
	for _, r := range rows {
		for i, c := range r {
			widths[i] = max(widths[i], textWidth(c, size, false))
		}
	}
	used := float32(0)
	for _, w := range widths {
		used += w
	}
	gaps := float32(len(widths) - 1)
	fitted = size
	if used > 0 && used+gaps*tableGap > width {
		// Text is as wide as its type is large.
		k := (width - gaps*tableGap) / used
		fitted, used = size*k, used*k
		for i := range widths {
			widths[i] *= k
		}
	}
	gap := float32(0)
	if gaps > 0 {
		gap = (width - used) / gaps
	}
	xs = make([]float32, len(widths))
	x := float32(sheetEdge)
	for i, w := range widths {
		xs[i] = x
		x += w + gap
	}
	return xs, fitted
}

// resultsTable lists the reactions, extremes and actions at the supports
// inside the member: the exact solution's beside the finite element ones
// when there is one, else the finite element ones labelled FE; then
// equilibrium, the mesh (mesh: who chose it and its accuracy) and the
// error against the exact solution.
func (sh *sheet) resultsTable(sum fem.Summary, mesh string, u units.System) {
	f := u.Format
	sh.heading("Results")
	note := "Values are the exact solution of the model; FE is the finite element answer on this mesh, and \"FE at\" where it lies (\"same\": at the exact value's place)."
	if !sum.Exact {
		note = "There is no exact solution of this model: every value is the finite element (FE) one."
	}
	sh.para(note, inkColour)
	head := "exact"
	if !sum.Exact {
		head = "FE"
	}
	// value is the headline value with the finite element one beside it.
	value := func(k units.Kind, v, fe float64) string {
		if !sum.Exact {
			return f(k, fe)
		}
		return f(k, v) + " (FE " + f(k, fe) + ")"
	}
	xs := []float32{sheetEdge, sheetEdge + 95, sheetEdge + 150, sheetEdge + 280, sheetEdge + 410}
	sh.row([]string{"reaction", "at", "axial, " + head, "transverse, " + head, "moment, " + head}, xs, sheetSmall, faintColour, true)
	for _, r := range sum.Reactions {
		cols := []string{fmt.Sprintf("support %d (%s)", r.Support, r.Kind), f(units.Position, r.X)}
		for _, c := range []struct {
			held  bool
			kind  units.Kind
			v, fe float64
		}{
			{r.Holds[fem.Axial], units.Force, r.Axial, r.FE.Axial},
			{r.Holds[fem.Transverse], units.Force, r.Transverse, r.FE.Transverse},
			{r.Holds[fem.Rotation], units.Moment, r.Moment, r.FE.Moment},
		} {
			text := "—"
			if c.held {
				text = value(c.kind, c.v, c.fe)
			}
			cols = append(cols, text)
		}
		sh.row(cols, xs, sheetSmall, inkColour, false)
	}
	// The ground's resultant, at its line of action, and the stretch it
	// is spread over where a support has its moment.
	for _, g := range sum.Foundations {
		at := "a couple"
		if centre, _, ok := g.Centre(); ok {
			at = f(units.Position, centre)
		}
		cols := []string{fmt.Sprintf("foundation %d (ground)", g.Foundation), at, "—", "—",
			"spread over " + f(units.Position, g.Start) + " to " + f(units.Position, g.End)}
		if g.Holds[fem.Axial] {
			cols[2] = value(units.Force, g.Reaction.Force[0], g.FE.Force[0])
		}
		if g.Holds[fem.Transverse] {
			cols[3] = value(units.Force, g.Reaction.Force[1], g.FE.Force[1])
		}
		sh.row(cols, xs, sheetSmall, inkColour, false)
	}
	sh.y += 3
	// Each extreme's place says the side of a jump as the text output
	// does (fem.Side.Place), so the columns are as wide as what they hold.
	// A finite element extreme has its own place, which need not be the
	// exact one's (the shear force of an element is constant, so it peaks
	// at the element's end): "same" where it is, so that a jump's long
	// places fit the page twice over.
	place := func(x float64, side fem.Side) string { return side.Place(f(units.Position, x)) }
	feAt := func(x float64, side fem.Side, exact string) string {
		if p := place(x, side); p != exact {
			return p
		}
		return "same"
	}
	titles := []string{"quantity", "largest FE", "at", "smallest FE", "at"}
	if sum.Exact {
		titles = []string{"quantity", "largest", "at", "FE", "FE at", "smallest", "at", "FE", "FE at", "FE accuracy"}
	}
	var extremes [][]string
	for _, e := range sum.Extremes {
		q := e.Quantity.Info().Unit
		if !sum.Exact {
			extremes = append(extremes, []string{quantityWords(e.Quantity), f(q, e.FEMax), place(e.FEXMax, e.FESideMax), f(q, e.FEMin), place(e.FEXMin, e.FESideMin)})
			continue
		}
		hi, lo := place(e.XMax, e.SideMax), place(e.XMin, e.SideMin)
		extremes = append(extremes, []string{quantityWords(e.Quantity), f(q, e.Max), hi, f(q, e.FEMax), feAt(e.FEXMax, e.FESideMax, hi),
			f(q, e.Min), lo, f(q, e.FEMin), feAt(e.FEXMin, e.FESideMin, lo), units.FormatG("%.3g %%", 100*e.Accuracy)})
	}
	xs, size := tableColumns(titles, extremes, sheetSmall, a4Width-2*sheetEdge)
	sh.row(titles, xs, size, faintColour, true)
	for _, r := range extremes {
		sh.row(r, xs, size, inkColour, false)
	}
	sh.para(CombinedStressNote, inkColour)
	if len(sum.Supports) > 0 {
		sh.y += 3
		xs = []float32{sheetEdge, sheetEdge + 95, sheetEdge + 150, sheetEdge + 280, sheetEdge + 410}
		sh.row([]string{"inside support", "at", "V left, " + head, "V right, " + head, "M, " + head}, xs, sheetSmall, faintColour, true)
		for _, a := range sum.Supports {
			moment := value(units.Moment, a.Moment[0], a.FEMoment[0])
			if math.Abs(a.Moment[1]-a.Moment[0]) > 1e-9*math.Max(math.Abs(a.Moment[0]), math.Abs(a.Moment[1])) {
				moment = f(units.Moment, a.Moment[0]) + " / " + value(units.Moment, a.Moment[1], a.FEMoment[1])
			}
			sh.row([]string{fmt.Sprintf("support %d (%s)", a.Support, a.Kind), f(units.Position, a.X),
				value(units.Force, a.Shear[0], a.FEShear[0]), value(units.Force, a.Shear[1], a.FEShear[1]), moment}, xs, sheetSmall, inkColour, false)
		}
	}
	sh.y += 3
	eq := sum.Equilibrium
	reactions := head + " reactions"
	if len(sum.Foundations) > 0 {
		reactions += " of the supports and the ground"
	}
	sh.para(fmt.Sprintf("Equilibrium residual (%s): %s, %s, %s (relative %s; FE %s)", reactions, f(units.Force, eq.Residual.Axial),
		f(units.Force, eq.Residual.Transverse), f(units.Moment, eq.Residual.Moment), eq.RelativeWords(), sum.FEEquilibrium.RelativeWords()), inkColour)
	sh.para("Mesh: "+sum.Mesh.Words()+". "+mesh, inkColour)
	if e := sum.ExactError; e != nil {
		sh.para(fmt.Sprintf("FE against exact: %s %s of the largest stress, %s %s, %s %s",
			fem.StressErrorName, units.FormatG("%.3g %%", 100*e.MaxStressRelative), fem.DisplacementErrorName, units.FormatG("%.3g %%", 100*e.RelativeL2),
			fem.EnergyErrorName, units.FormatG("%.3g %%", 100*e.RelativeEnergy)), inkColour)
	}
}
