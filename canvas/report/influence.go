package report

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strings"
	"text/tabwriter"

	"stave/canvas"
	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// InfluenceRequest is what the influence command asks of a project.
type InfluenceRequest struct {
	// Target is the quantity whose influence line is drawn up.
	Target moving.Target
	// Points is the number of intervals the line is sampled in (0 for 20).
	Points int
	// FiniteElements asks for the finite element line at the samples too.
	FiniteElements bool
	// Envelope asks for every train's envelope at every station.
	Envelope bool
	// Units are the units the messages quote values in; the zero System
	// for SI base units, as a file holds them.
	Units units.System
}

// MovingLoads is the influence line of one target of a project, and what
// each of the project's trains does to it.
type MovingLoads struct {
	Member  *fem.Member
	Mesh    fem.Mesh
	Line    *moving.Line
	Samples []InfluenceSample
	// Largest and Smallest are the line's extremes: where one load does most.
	Largest, Smallest moving.Point
	Trains            []TrainResult
}

// InfluenceSample is the line at one load position: the closed form, and
// the finite element line with the load on the nearest node when asked for.
type InfluenceSample struct {
	S     float64  `json:"s"`
	Exact float64  `json:"exact"`
	FE    *float64 `json:"finite_elements,omitempty"`
	FEAt  *float64 `json:"finite_elements_load_at,omitempty"`
}

// Influence works out the influence line of r.Target on the member of p,
// sampled, with the finite element line beside it when asked, and the
// worst positions of each of p's trains for it (and their envelopes when
// asked).
func Influence(p *storage.Project, r InfluenceRequest) (*MovingLoads, error) {
	member, in, err := InfluenceOf(p, r.Units)
	if err != nil {
		return nil, err
	}
	line, err := in.Line(r.Target)
	if err != nil {
		return nil, err
	}
	r.Target = line.Target // read on the member at its ends
	out := &MovingLoads{Member: member, Mesh: member.Mesh(), Line: line}
	out.Smallest, out.Largest = line.Extremes()
	n := r.Points
	if n <= 0 {
		n = 20
	}
	L := p.Model.Length()
	positions := make([]float64, n+1)
	for i := range positions {
		positions[i] = L * float64(i) / float64(n)
	}
	var fe, at []float64
	if r.FiniteElements {
		if fe, at, err = moving.FELine(member, out.Mesh, r.Target, positions); err != nil {
			return nil, err
		}
	}
	// Round-off where the line vanishes (at a rigid support) reads as zero.
	scale := max(math.Abs(out.Largest.Value), math.Abs(out.Smallest.Value))
	clean := func(v float64) float64 {
		if math.Abs(v) <= 1e-12*scale {
			return 0
		}
		return v
	}
	out.Largest.Value, out.Smallest.Value = clean(out.Largest.Value), clean(out.Smallest.Value)
	for i, s := range positions {
		sample := InfluenceSample{S: s, Exact: clean(sampleAt(line, r.Target, s, L))}
		if fe != nil {
			fe[i] = clean(fe[i])
			sample.FE, sample.FEAt = &fe[i], &at[i]
		}
		out.Samples = append(out.Samples, sample)
	}
	target := &r.Target
	if !target.Bending() {
		target = nil // a train loads across: nothing to say of an axial target
	}
	out.Trains = trainResults(p, in, out.Mesh, target, r.Envelope, r.Units)
	return out, nil
}

// sampleAt is line l of target t at load position s on a member of length
// L. A load on t's own point stands on the far side of the cut from the
// side t is read on (the shear force just right of x has a load at x on
// its left), as the finite element load on the node there does. A line
// that jumps there (the shear force's, the axial force's and stress's) is
// then the limit on the side read less the jump (Line.Jump), which holds at
// an end of the member too, where the line has no piece beyond.
func sampleAt(l *moving.Line, t moving.Target, s, L float64) float64 {
	if l.Jump() == 0 || math.Abs(s-t.X) > 1e-12*L {
		return l.At(s, fem.Right)
	}
	if t.Side == fem.Left {
		return l.At(s, fem.Left) + l.Jump()
	}
	return l.At(s, fem.Right) - l.Jump()
}

// influenceUnit is the unit of the line's ordinates in u: the target's
// display unit per display unit of force, and the factor from SI per
// newton to it.
func influenceUnit(t moving.Target, u units.System) (string, float64) {
	kind := targetKind(t)
	force := u.Unit(units.Force)
	return u.Unit(kind).Symbol + " per " + force.Symbol, force.ToSI / u.Unit(kind).ToSI
}

// targetKind is the kind of value the target is.
func targetKind(t moving.Target) units.Kind {
	if t.Reaction {
		if t.Motion == fem.Rotation {
			return units.Moment
		}
		return units.Force
	}
	return t.Quantity.Info().Unit
}

// WriteInfluenceText writes the influence line of the model in file path
// and what each train does to its target, in units u, with the caution.
func WriteInfluenceText(w io.Writer, path string, r *MovingLoads, u units.System) {
	t := r.Line.Target
	pos := func(x float64) string { return u.Format(units.Position, x) }
	unit, scale := influenceUnit(t, u)
	value := func(v float64) string { return units.FormatNumber(v*scale) + " " + unit }
	fmt.Fprintf(w, "Stave %s: %s\n", Version, path)
	fmt.Fprintf(w, "Influence line of the %s, for %s\n", describeTarget(r.Line, u), t.UnitLoad(u.Unit(units.Force).Symbol))
	fmt.Fprintln(w, "(exact solution of the member in closed form; finite elements: one solve per load position on one factorization, the load on the nearest node)")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintln(tw, "  load at\texact\tfinite elements")
	for _, s := range r.Samples {
		fe := "–"
		if s.FE != nil {
			fe = value(*s.FE)
			if *s.FEAt != s.S {
				fe += " (load at " + pos(*s.FEAt) + ")"
			}
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", pos(s.S), value(s.Exact), fe)
	}
	tw.Flush()
	fmt.Fprintf(w, "  largest %s with the load at %s; smallest %s with the load at %s\n",
		value(r.Largest.Value), pos(r.Largest.S), value(r.Smallest.Value), pos(r.Smallest.S))
	writeTrainsText(w, r.Trains, r.Member.Model(), r.Line, u)
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
}

// writeTrainsText writes what each train does on model m: how it runs,
// its extremes of target when one is given, and over all its positions
// the extremes of every field and reaction with the positions that govern.
func writeTrainsText(w io.Writer, trains []TrainResult, m *fem.Model, target *moving.Line, u units.System) {
	pos := func(x float64) string { return u.Format(units.Position, x) }
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	for _, tr := range trains {
		fmt.Fprintf(w, "\n%s\n", describeTrain(&tr.Train, tr.Label, m.Length(), u))
		if tr.Err != nil {
			fmt.Fprintf(w, "  not placed: %v\n", tr.Err)
			continue
		}
		if tr.Envelope != nil {
			fmt.Fprintf(w, "  every position of its front along its run counts (the window steps through %d each way it moves, %s apart)\n", tr.Envelope.Positions, pos(tr.Envelope.Step))
		}
		switch {
		case tr.Target && target != nil:
			kind := targetKind(target.Target)
			size := max(math.Abs(tr.Largest.Value), math.Abs(tr.Smallest.Value))
			fmt.Fprintf(w, "  %s: largest %s, smallest %s\n", describeTarget(target, u),
				trainExtremeText(tr.Largest, kind, u, false, size), trainExtremeText(tr.Smallest, kind, u, false, size))
		case target != nil:
			fmt.Fprintf(w, "  %s: 0 wherever the train stands; a train's loads act across the member and move no axial force or axial displacement\n", describeTarget(target, u))
		}
		if tr.Envelope == nil {
			continue
		}
		fmt.Fprintln(w, "  over all positions (front: the x of the first axle; finite elements: the train solved there)")
		writeWorst(tw, tr.Worst, m.Length(), u)
		for _, re := range tr.Envelope.Reactions {
			k := units.Force
			if re.Motion == fem.Rotation {
				k = units.Moment
			}
			hi := TrainExtreme{Value: re.Max, X: m.Supports[re.Support].X, Direction: re.MaxAt.Direction.String(), Front: re.MaxAt.Front}
			lo := TrainExtreme{Value: re.Min, X: hi.X, Direction: re.MinAt.Direction.String(), Front: re.MinAt.Front}
			size := max(math.Abs(re.Max), math.Abs(re.Min))
			fmt.Fprintf(tw, "    %s reaction of support %d\tlargest\t%s\n", re.Motion, re.Support+1, trainExtremeText(hi, k, u, false, size))
			fmt.Fprintf(tw, "    \tsmallest\t%s\n", trainExtremeText(lo, k, u, false, size))
		}
		tw.Flush()
		for _, c := range tr.Combinations {
			fmt.Fprintf(w, "  in combination %q, factor %s on top of its cases (exact solution; those placed by span in the worst arrangement at each point)\n", c.Combination, units.FormatNumber(c.Factor))
			writeWorst(tw, c.Worst, m.Length(), u)
			tw.Flush()
		}
	}
}

// writeWorst writes the rows of the extremes ws on a member of length L,
// m, each measured against the size of its kind over ws (the deflection
// and the rotation times L, the shear force and the moment over L, the
// stress), so that the round-off of a value that vanishes (the largest
// moment of a cantilever under loads acting down) reads as zero.
func writeWorst(tw io.Writer, ws []QuantityWorst, L float64, u units.System) {
	var kinds [3]float64
	kind := func(q fem.Quantity) (int, float64) {
		switch q {
		case fem.QDeflection:
			return 0, 1
		case fem.QRotation:
			return 0, L
		case fem.QShearForce:
			return 1, 1
		case fem.QBendingMoment:
			return 1, 1 / L
		}
		return 2, 1
	}
	for _, q := range ws {
		i, scale := kind(q.Quantity)
		for _, e := range []TrainExtreme{q.Largest, q.Smallest} {
			kinds[i] = max(kinds[i], math.Abs(e.Value)*scale)
		}
	}
	for _, q := range ws {
		k := q.Quantity.Info().Unit
		i, scale := kind(q.Quantity)
		size := kinds[i] / scale
		fmt.Fprintf(tw, "    %s\tlargest\t%s\n", q.Quantity, trainExtremeText(q.Largest, k, u, true, size))
		fmt.Fprintf(tw, "    \tsmallest\t%s\n", trainExtremeText(q.Smallest, k, u, true, size))
	}
}

// trainExtremeText writes an extreme with the train's position, and where
// it is when at says so; values within round-off of size read as zero.
func trainExtremeText(e TrainExtreme, k units.Kind, u units.System, at bool, size float64) string {
	value := func(v float64) string {
		if math.Abs(v) <= 1e-9*size {
			v = 0
		}
		return u.Format(k, v)
	}
	s := value(e.Value)
	if at {
		s += " " + fem.SideNamed(e.Side).At("x = "+u.Format(units.Position, e.X))
	}
	s += fmt.Sprintf(", front at %s %s", u.Format(units.Position, e.Front), e.Direction)
	if e.FE != nil {
		s += " (finite elements " + value(*e.FE) + ")"
	}
	return s
}

// describeTarget names the target of l with its position in display
// units and, where it jumps there, its side (moving.Line.Describe).
func describeTarget(l *moving.Line, u units.System) string {
	return l.Describe(u.Format(units.Position, l.Target.X))
}

// describeTrain says what a train is, in one line.
func describeTrain(t *moving.Train, label string, L float64, u units.System) string {
	var parts []string
	if axles := t.Axles; len(axles) > 0 {
		s := u.Format(units.Force, axles[0].Load)
		axles = axles[1:]
		// A run of equal axles at equal spacing is written once with its
		// count: a long train would otherwise fill a page with one line.
		for len(axles) > 0 {
			a, k := axles[0], 1
			for k < len(axles) && axles[k] == a {
				k++
			}
			if k > 2 {
				s += fmt.Sprintf(" then %d times", k)
			} else {
				k = 1
			}
			s += fmt.Sprintf(" –%s– %s", u.Format(units.Position, a.Spacing), u.Format(units.Force, a.Load))
			axles = axles[k:]
		}
		if n := len(t.Axles); n > 3 {
			s += fmt.Sprintf("; %d axles over %s", n, u.Format(units.Position, t.Length()))
		}
		parts = append(parts, s)
	}
	if ul := t.Uniform; ul.Load > 0 {
		parts = append(parts, fmt.Sprintf("%s over %s from %s behind the front", u.Format(units.LineLoad, ul.Load), u.Format(units.Position, ul.Length), u.Format(units.Position, ul.Start)))
	}
	from, to := t.Run(L)
	// Said every time: a train longer than about 0.6 of a span can give
	// more with some axles off it, which a whole train on its run misses.
	on := "wholly on that stretch at every position"
	switch start, end := t.OffAt(L); {
	case start && end:
		on = "driving on and off the member at both its ends"
	case start:
		on = "driving on and off the member at x = 0"
	case end:
		on = "driving on and off the member at its far end"
	}
	parts = append(parts, fmt.Sprintf("runs %s between x = %s and %s, %s", directionWords(t.Direction), u.Format(units.Position, from), u.Format(units.Position, to), on))
	return label + ": " + strings.Join(parts, "; ")
}

func directionWords(d moving.Direction) string {
	switch d {
	case moving.Forward:
		return "forward (towards +x)"
	case moving.Backward:
		return "backward (towards −x)"
	}
	return "both ways"
}

// The influence line document of `stave influence --json` (docs/json.md):
// its format name and version, which changes as ResultsVersion does, when
// a key changes meaning or goes away.
const (
	InfluenceFormat  = "stave-influence"
	InfluenceVersion = 1
)

// InfluenceJSON is the influence command's JSON, in SI units: the line of
// one target (values per newton of the unit load) and the trains.
type InfluenceJSON struct {
	Format  string `json:"format"`
	Version int    `json:"version"`
	File    string `json:"file"`
	Units   string `json:"units"`
	Caution string `json:"caution"`
	Line    struct {
		Target   string            `json:"target"`
		Quantity *fem.Quantity     `json:"quantity,omitempty"`
		X        *float64          `json:"x,omitempty"`
		Side     string            `json:"side,omitempty"`
		Support  int               `json:"support,omitempty"`
		Motion   string            `json:"motion,omitempty"`
		UnitLoad string            `json:"unit_load"`
		Method   string            `json:"method"`
		Samples  []InfluenceSample `json:"samples"`
		Pieces   []moving.Piece    `json:"pieces"`
		Largest  moving.Point      `json:"largest"`
		Smallest moving.Point      `json:"smallest"`
	} `json:"influence_line"`
	Trains []TrainJSON `json:"trains,omitempty"`
}

// influenceMethod says how the lines were found, for the JSON.
const influenceMethod = "exact: the member's Green's function in closed form (piecewise cubic in the load position); finite elements: one solve per load position on one factorization, the load on the nearest node"

// WriteInfluenceJSON writes r as JSON for the model in file path.
func WriteInfluenceJSON(w io.Writer, path string, r *MovingLoads) error {
	j := InfluenceJSON{Format: InfluenceFormat, Version: InfluenceVersion}
	j.File, j.Units, j.Caution = path, "SI base units: m, N, N·m, Pa, rad; influence ordinates per N of the unit load", fem.Caution
	t := r.Line.Target
	l := &j.Line
	l.Target, l.UnitLoad, l.Method = r.Line.String(), t.UnitLoad("N"), influenceMethod
	if t.Reaction {
		l.Support, l.Motion = t.Support+1, t.Motion.String()
	} else {
		q, x := t.Quantity, t.X
		l.Quantity, l.X, l.Side = &q, &x, r.Line.Side().Name()
	}
	l.Samples, l.Pieces, l.Largest, l.Smallest = r.Samples, r.Line.Pieces(), r.Largest, r.Smallest
	j.Trains = TrainsJSON(r.Member.Model(), r.Trains, true)
	return WriteJSON(w, j)
}

// MovingPicture is the picture of r with train i of its trains (counted
// from 0) standing at its worst position for the target, or, for an axial
// target, for the bending moment's largest value; it needs the train's
// envelope (InfluenceRequest.Envelope).
func MovingPicture(r *MovingLoads, i int, u units.System) (canvas.MovingInput, error) {
	in := canvas.MovingInput{Model: r.Member.Model(), Units: u, Line: r.Line, Quantity: -1}
	if len(r.Trains) == 0 {
		return in, nil
	}
	if i < 0 || i >= len(r.Trains) {
		return in, fmt.Errorf("there is no train %d: the file has %d", i+1, len(r.Trains))
	}
	tr := &r.Trains[i]
	if tr.Err != nil {
		return in, tr.Err
	}
	if tr.Envelope == nil {
		return in, fmt.Errorf("%s: the picture needs the train's envelope", tr.Label)
	}
	in.Train, in.Envelope = &tr.Train, tr.Envelope
	q := r.Line.Target.Quantity
	in.Quantity = slices.Index(moving.EnvelopeQuantities, q)
	if r.Line.Target.Reaction || in.Quantity < 0 {
		in.Quantity = slices.Index(moving.EnvelopeQuantities, fem.QBendingMoment)
	}
	if tr.Target {
		in.Worst = []moving.Extreme{tr.Largest.Extreme(), tr.Smallest.Extreme()}
		in.At = in.Worst[0].Placement
	} else {
		hi, _ := tr.Envelope.Worst(moving.EnvelopeQuantities[in.Quantity])
		in.At = hi.Placement
	}
	tm := tr.Train.Model(in.Model, in.At)
	exact, err := fem.SolveExact(&tm)
	if err != nil {
		return in, err
	}
	q = moving.EnvelopeQuantities[in.Quantity]
	in.Current = make([]float64, len(tr.Envelope.Stations))
	for s, x := range tr.Envelope.Stations {
		f := exact.At(x, fem.Right)
		in.Current[s] = q.Of(&f)
	}
	return in, nil
}

// MovingSheet is the one-page sheet of r with train i (from 0): the
// picture of MovingPicture, what the train and the line are, and the
// train's governing positions with their finite element checks.
func MovingSheet(p *storage.Project, r *MovingLoads, i int, u units.System) (canvas.MovingSheet, error) {
	pic, err := MovingPicture(r, i, u)
	if err != nil {
		return canvas.MovingSheet{}, err
	}
	if pic.Train == nil {
		return canvas.MovingSheet{}, fmt.Errorf("the file has no train to put on a sheet: add one under \"trains\" (docs/format.md)")
	}
	tr := &r.Trains[i]
	n := p.Notes
	s := canvas.MovingSheet{Picture: pic, Notes: canvas.SheetNotes{Project: n.Project, Mark: n.Member, Engineer: n.Engineer, Date: n.Date, Version: Version}}
	L := r.Member.Model().Length()
	unit, scale := influenceUnit(r.Line.Target, u)
	s.About = []string{
		describeTrain(&tr.Train, tr.Label, L, u) + fmt.Sprintf("; %d positions in each direction, %s apart.", tr.Envelope.Positions, u.Format(units.Position, tr.Envelope.Step)),
		fmt.Sprintf("Influence line of the %s for %s: largest %s %s with the load at %s, smallest %s %s at %s; exact solution in closed form, checked by one finite element solve per position.",
			describeTarget(r.Line, u), r.Line.Target.UnitLoad(u.Unit(units.Force).Symbol), units.FormatNumber(r.Largest.Value*scale), unit, u.Format(units.Position, r.Largest.S),
			units.FormatNumber(r.Smallest.Value*scale), unit, u.Format(units.Position, r.Smallest.S)),
		"Envelope: at every station the largest and smallest value over all positions (where an axle stands on the station, on the side that gives more); each extreme below is solved again by finite elements with the train at its governing position.",
	}
	s.Header = []string{"quantity", "largest", "at", "front", "smallest", "at", "front"}
	pos := func(x float64) string { return u.Format(units.Position, x) }
	front := func(e TrainExtreme) string { return pos(e.Front) + " " + e.Direction }
	// The finite element check shows where it differs as printed, round-off
	// of the quantity's size aside (a moment that vanishes at a support).
	withFE := func(k units.Kind, e TrainExtreme, size float64) string {
		v := u.Format(k, e.Value)
		if e.FE == nil || math.Abs(*e.FE-e.Value) <= 1e-12*size {
			return v
		}
		if fe := u.Format(k, *e.FE); fe != v {
			v += " (FE " + fe + ")"
		}
		return v
	}
	for _, w := range tr.Worst {
		k := w.Quantity.Info().Unit
		size := max(math.Abs(w.Largest.Value), math.Abs(w.Smallest.Value))
		place := func(e TrainExtreme) string { return fem.SideNamed(e.Side).Place(pos(e.X)) }
		s.Rows = append(s.Rows, []string{w.Quantity.String(), withFE(k, w.Largest, size), place(w.Largest), front(w.Largest),
			withFE(k, w.Smallest, size), place(w.Smallest), front(w.Smallest)})
	}
	for _, re := range tr.Envelope.Reactions {
		k := units.Force
		if re.Motion == fem.Rotation {
			k = units.Moment
		}
		x := pos(p.Model.Supports[re.Support].X)
		s.Rows = append(s.Rows, []string{fmt.Sprintf("%s reaction %d", re.Motion, re.Support+1), u.Format(k, re.Max), x, pos(re.MaxAt.Front) + " " + re.MaxAt.Direction.String(),
			u.Format(k, re.Min), x, pos(re.MinAt.Front) + " " + re.MinAt.Direction.String()})
	}
	return s, nil
}
