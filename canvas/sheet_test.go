package canvas

import (
	"bytes"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
)

// modelledModel is a member with everything the model table must show
// beyond segments, supports and loads: a segment heated on its bottom
// with shear deformation, a hinge with a rotational spring and a pure
// one, and a foundation.
func modelledModel() *fem.Model {
	steel := fem.Material{Name: "steel", Elastic: 200e9, ThermalExpansion: 12e-6, Poisson: 0.3}
	sec := fem.Section{Area: 5.38e-3, SecondMoment: 8.36e-5, FibreDistance: 0.15, ShearCoefficient: 0.4}
	return &fem.Model{
		Segments: []fem.Segment{
			{Start: 0, End: 4, Section: sec, Material: steel, TemperatureDifference: 20, ShearDeformation: true},
			{Start: 4, End: 10, Section: sec, Material: steel},
		},
		Supports:    []fem.Support{{X: 0, Kind: fem.Fixed}},
		Hinges:      []fem.Hinge{{X: 3, Stiffness: 5e6}, {X: 5}},
		Foundations: []fem.Foundation{{Start: 4, End: 10, Modulus: 2.4e7}},
		PointLoads:  []fem.PointLoad{{X: 7, Transverse: -100e3}},
		Mesh:        fem.MeshSettings{Elements: 40},
	}
}

// The sheet shows what was modelled (the heated, shear-deforming segment,
// the hinges, the foundation) and what the ground carries beside the
// reactions, and it still fits one page.
func TestSheetShowsGroundAndHinges(t *testing.T) {
	m := modelledModel()
	in := SheetInput{Input: solved(t, m), Notes: SheetNotes{Project: "Invented", Version: "test"}}
	page := buildSheet(in)
	var lines []string
	for _, it := range page.Items {
		if it.Kind == Text {
			lines = append(lines, it.Text)
		}
	}
	sum := fem.Summarize(in.Input.Solution, in.Input.Exact)
	g := sum.Foundations[0]
	f := units.SI.Format
	// Statics of the part from the hinge at 5 m on: the ground carries
	// the load less the shear the hinge passes on, and its resultant acts
	// between the foundation's ends.
	if g.Reaction.Force[1] <= 0 || g.Reaction.Force[1] > 100e3 || g.Reaction.Centre() < 4 || g.Reaction.Centre() > 10 {
		t.Fatalf("the ground carries %g N at %g m: want up to the 100 kN load, on the foundation", g.Reaction.Force[1], g.Reaction.Centre())
	}
	for _, want := range []string{
		"α 1.200e-05 1/K; bottom fibre warmer than the top by 20.00 K; shear deformation (Timoshenko beam), κ 0.4000, ν 0.3000",
		"at 3.000 m: rotational spring 5000 kN·m/rad",
		"at 5.000 m: carries no moment",
		"4.000 m to 10.00 m; modulus 24000 kN/m² across",
		"foundation 1 (ground)",
		f(units.Force, g.Reaction.Force[1]) + " (FE " + f(units.Force, g.FE.Force[1]) + ")",
		"spread over 4.000 m to 10.00 m",
	} {
		if !slices.ContainsFunc(lines, func(s string) bool { return strings.Contains(s, want) }) {
			t.Errorf("the sheet does not say %q", want)
		}
	}
	if !slices.ContainsFunc(lines, func(s string) bool { return strings.Contains(s, "reactions of the supports and the ground") }) {
		t.Error("the sheet's equilibrium does not name the ground")
	}
	// The ground's row names where its resultant acts, as a reaction's
	// row names where the support is.
	centre := slices.Index(lines, f(units.Position, g.Reaction.Centre()))
	if centre < 1 || lines[centre-1] != "foundation 1 (ground)" {
		t.Errorf("the ground's row does not say it acts at %s", f(units.Position, g.Reaction.Centre()))
	}
	// Nothing runs off the page, and the diagrams stay above the results.
	results := slices.IndexFunc(page.Items, func(it Item) bool { return it.Kind == Text && it.Text == "Results" })
	for _, it := range page.Items {
		if it.Kind == Text && (it.At.Y+TextHeight(it.Size) > a4Height-sheetEdge+1 || it.At.X+it.Width > a4Width-sheetEdge+1) {
			t.Errorf("%q runs off the page at (%g, %g)", it.Text, it.At.X, it.At.Y)
		}
	}
	if results < 0 {
		t.Fatal("the sheet has no results")
	}
	for _, it := range page.Items[:results] {
		if it.Kind == Text && it.At.Y+TextHeight(it.Size) > page.Items[results].At.Y {
			t.Errorf("%q at y = %g runs into the results below y = %g", it.Text, it.At.Y, page.Items[results].At.Y)
		}
	}
	var pdf bytes.Buffer
	if err := WriteSheet(&pdf, "pdf", in); err != nil {
		t.Fatal(err)
	}
	if n := countPages(pdf.Bytes()); n != 1 {
		t.Errorf("the sheet has %d pages, want 1", n)
	}
}

// The sheet's model table gives the inputs the temperature and the shear
// deformation act through, as the file gives them: α wherever a
// temperature acts (a uniform change too), the depth a temperature
// difference acts over when it is given, and the shear area and modulus
// when they are given instead of κ and ν; α not where no temperature acts.
func TestSheetShowsThermalAndShearInputs(t *testing.T) {
	steel := fem.Material{Elastic: 200e9, ThermalExpansion: 12e-6, ShearModulus: 80e9}
	sec := fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15, Depth: 0.4, ShearArea: 2e-3}
	held := []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Fixed}}
	for _, c := range []struct {
		name      string
		m         *fem.Model
		want, not string
	}{
		{"warmed", &fem.Model{Segments: []fem.Segment{{Start: 0, End: 6, Section: sec, Material: steel}}, Supports: held, TemperatureChange: 30},
			"α 1.200e-05 1/K", "warmer"},
		{"a difference over a depth given, shear area and modulus given", &fem.Model{Segments: []fem.Segment{{Start: 0, End: 6, Section: sec, Material: steel,
			TemperatureDifference: 10, ShearDeformation: true}}, Supports: held},
			"α 1.200e-05 1/K; bottom fibre warmer than the top by 10.00 K over a depth of 400.0 mm; shear deformation (Timoshenko beam), As 2000 mm², G 80.00 GPa", "κ"},
		{"no temperature", &fem.Model{Segments: []fem.Segment{{Start: 0, End: 6, Section: sec, Material: steel}}, Supports: held,
			PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}}, "E 200.0 GPa", "α"},
	} {
		page := buildSheet(SheetInput{Input: solved(t, c.m), Notes: SheetNotes{Version: "test"}})
		var lines []string
		for _, it := range page.Items {
			if it.Kind == Text {
				lines = append(lines, it.Text)
			}
		}
		all := strings.Join(lines, "\n")
		if !strings.Contains(all, c.want) || strings.Contains(all, c.not) {
			t.Errorf("%s: the sheet should say %q and not %q:\n%s", c.name, c.want, c.not, all)
		}
	}
}
