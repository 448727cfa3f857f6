package canvas

import (
	"bytes"
	"image/png"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
)

// movingFixture is a two-span member with a three-axle train standing at
// its worst position for the bending moment at 2.5 m (invented values).
func movingFixture(t *testing.T) MovingInput {
	t.Helper()
	seg := fem.Segment{End: 10, Section: fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15}, Material: fem.Material{Elastic: 2e11}}
	m := &fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 5, Kind: fem.Roller}, {X: 10, Kind: fem.Roller}}, Mesh: fem.MeshSettings{Elements: 50}}
	tr := &moving.Train{Name: "cart", Axles: []moving.Axle{{Load: 10e3}, {Load: 20e3, Spacing: 1}, {Load: 20e3, Spacing: 1}}, Step: 0.1}
	return movingAtWorst(t, m, tr, moving.Target{Quantity: fem.QBendingMoment, X: 2.5})
}

// movingAtWorst is the picture's input for train tr on m, its envelope of
// the bending moment and the influence line of target, with the train at
// its worst position for the target's largest value.
func movingAtWorst(t *testing.T, m *fem.Model, tr *moving.Train, target moving.Target) MovingInput {
	t.Helper()
	p, err := fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	in, err := moving.New(p)
	if err != nil {
		t.Fatal(err)
	}
	env, err := in.Envelope(tr, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	line, err := in.Line(target)
	if err != nil {
		t.Fatal(err)
	}
	hi, lo, err := in.Worst(tr, p.Mesh(), target)
	if err != nil {
		t.Fatal(err)
	}
	return MovingInput{Model: m, Units: units.SI, Train: tr, At: hi.Placement, Envelope: env, Quantity: 3, Line: line, Worst: []moving.Extreme{hi, lo}}
}

// The picture names the side a target is read on where it says one, as
// the text output does: the shear force just left of the middle support of
// the fixture differs from the one just right of it by the reaction there.
func TestMovingPictureNamesTheSide(t *testing.T) {
	in := movingFixture(t)
	for _, c := range []struct {
		side fem.Side
		want string
	}{{fem.Left, "influence line of the shear force just left of x = 5.000 m,"}, {fem.Right, "influence line of the shear force just right of x = 5.000 m,"}} {
		tg := moving.Target{Quantity: fem.QShearForce, X: 5, Side: c.side}
		p, err := fem.Prepare(in.Model)
		if err != nil {
			t.Fatal(err)
		}
		inf, err := moving.New(p)
		if err != nil {
			t.Fatal(err)
		}
		if in.Line, err = inf.Line(tg); err != nil {
			t.Fatal(err)
		}
		s, _ := BuildMoving(in, 1200, 700)
		found := false
		for _, it := range s.Items {
			found = found || it.Kind == Text && strings.HasPrefix(it.Text, c.want)
		}
		if !found {
			t.Errorf("side %v: no text starting %q", c.side, c.want)
		}
	}
}

// The picture draws each axle where the train stands, names the envelope's
// quantity and the line's target, and marks the worst positions' values.
func TestMovingPicture(t *testing.T) {
	in := movingFixture(t)
	s, bands := BuildMoving(in, 1200, 700)
	all := strings.Join(stripTexts(s), "\n")
	for _, want := range []string{"bending moment: envelope over", "influence line of the bending moment at x = 2.500 m",
		"largest " + units.SI.Format(units.Moment, in.Worst[0].Value), "train “cart”"} {
		if !strings.Contains(all, want) {
			t.Errorf("no text %q among:\n%s", want, all)
		}
	}
	v := NewView(1200, 700)
	v.Fit(in.Model)
	points, _ := in.Train.Loads(in.At)
	for _, p := range points {
		x := v.ToScreenX(p.X)
		found := false
		for _, it := range s.Items {
			if it.Kind == Polyline && len(it.Points) == 2 && it.Stroke == loadColour && it.Points[0].X == x && it.Points[1].Y > it.Points[0].Y {
				found = true
			}
		}
		if !found {
			t.Errorf("no arrow for the axle at %g m (screen x %g)", p.X, x)
		}
	}
	if !(bands.EnvelopeTop < bands.EnvelopeBaseline && bands.EnvelopeBaseline < bands.EnvelopeBottom && bands.EnvelopeBottom < bands.InfluenceTop) {
		t.Errorf("bands out of order: %+v", bands)
	}
	var buf bytes.Buffer
	if err := WriteMoving(&buf, "png", in, 600, 400, 1); err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(&buf)
	if err != nil {
		t.Fatal(err)
	}
	if b := img.Bounds(); b.Dx() != 600 || b.Dy() != 400 {
		t.Errorf("picture of %v, want 600 × 400", b)
	}
	buf.Reset()
	if err := WriteMovingSheet(&buf, "pdf", MovingSheet{Picture: in, Header: []string{"quantity", "largest"}, Rows: [][]string{{"bending moment", "1 kN·m"}}}); err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(buf.Bytes(), []byte("%PDF")) {
		t.Error("the sheet is not a PDF")
	}
}

// A train driving off the member's ends (two 10 kN axles 7 m apart on a
// 10 m simple span, invented) at its worst position for the midspan moment
// has its rear axle off the member: the influence line marks only the axle
// on it, and the envelope's smallest moment, zero up to round-off on a
// simple span under loads acting down (statics), is not labelled.
func TestMovingPictureOffTheEnds(t *testing.T) {
	seg := fem.Segment{End: 10, Section: fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15}, Material: fem.Material{Elastic: 2e11}}
	m := &fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 10, Kind: fem.Roller}}, Mesh: fem.MeshSettings{Elements: 40}}
	tr := &moving.Train{Axles: []moving.Axle{{Load: 10e3}, {Load: 10e3, Spacing: 7}}, OffEnds: true, Direction: moving.Forward, Step: 0.05}
	in := movingAtWorst(t, m, tr, moving.Target{Quantity: fem.QBendingMoment, X: 5})
	if in.At.Front != 5 {
		t.Fatalf("worst position for the midspan moment: front at %g m, want 5 m (one axle at midspan, the other off)", in.At.Front)
	}
	s, _ := BuildMoving(in, 1200, 700)
	v := NewView(1200, 700)
	v.Fit(m)
	for _, it := range s.Items {
		mark := it.Fill == largestColour || it.Fill == smallestColour
		if it.Kind == Circle && mark && (it.Center.X < v.ToScreenX(0)-1 || it.Center.X > v.ToScreenX(10)+1) {
			t.Errorf("a mark off the member at screen x %g (the member spans %g to %g)", it.Center.X, v.ToScreenX(0), v.ToScreenX(10))
		}
		if it.Kind == Text && strings.Contains(it.Text, "e-1") {
			t.Errorf("round-off labelled: %q", it.Text)
		}
	}
}

// The envelope's extremes are labelled with the side of a jump they are
// read on, as the results table labels a case's (fem.Side.At): the
// fixture's shear force over the middle support, where the reaction makes
// it jump, largest just right of 5.000 m and smallest just left of it
// (the mirror image of the two spans), the moment there with no side.
func TestMovingPictureLabelsTheSideOfAJump(t *testing.T) {
	in := movingFixture(t)
	for _, c := range []struct {
		q     int
		wants []string
	}{
		{2, []string{" just right of 5.000 m", " just left of 5.000 m"}},
		{3, nil},
	} {
		in.Quantity = c.q
		s, _ := BuildMoving(in, 1200, 700)
		all := strings.Join(stripTexts(s), "\n")
		for _, want := range c.wants {
			if !strings.Contains(all, want) {
				t.Errorf("%s: no label %q among:\n%s", moving.EnvelopeQuantities[c.q], want, all)
			}
		}
		if c.wants == nil && strings.Contains(all, "just ") {
			t.Errorf("%s: a side where nothing jumps:\n%s", moving.EnvelopeQuantities[c.q], all)
		}
	}
}
