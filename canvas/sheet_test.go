package canvas

import (
	"bytes"
	"cmp"
	"fmt"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
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
		"thermal expansion 1.200e-05 1/K; bottom fibre warmer than the top by 20.00 K; shear deformation (Timoshenko beam), κ 0.4000, ν 0.3000",
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

// The model table gives the values the loads and the checks use: the
// density under self-weight, the thermal expansion under a change of
// temperature, the allowable stress, the supports' settlements, in the
// sheet's units. A rod under
// its own weight gave g but not ρ, so the sheet did not say what weight
// was carried. US values from NIST SP 811, Appendix B: 1 lb/ft³ =
// 16.01846 kg/m³, 1 ksi = 6.894757 MPa, 1/°F = (5/9)/K.
func TestSheetGivesTheMaterialValuesTheLoadsUse(t *testing.T) {
	steel := fem.Material{Name: "steel", Elastic: 200e9, Density: 7850, ThermalExpansion: 12e-6, Allowable: 250e6}
	sec := fem.Section{Area: 1e-3, SecondMoment: 8e-6, FibreDistance: 0.1}
	rod := fem.Model{Segments: []fem.Segment{{Start: 0, End: 4, Section: sec, Material: steel}},
		Supports: []fem.Support{{X: 0, Kind: fem.Fixed}}, Gravity: [2]float64{fem.StandardGravity, 0}}
	heated := fem.Model{Segments: rod.Segments, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 4, Kind: fem.Pinned}}, TemperatureChange: 30}
	settled := fem.Model{Segments: rod.Segments, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 4, Kind: fem.Roller, Settlement: [3]float64{0, -0.0254, 0}}}}
	for _, c := range []struct {
		name   string
		model  fem.Model
		system units.System
		want   []string
		absent []string
	}{
		{"rod under its own weight, SI", rod, units.SI, []string{"density 7850 kg/m³; allowable stress 250.0 MPa"}, []string{"thermal expansion"}},
		// 7850 / 16.01846 = 490.06 lb/ft³; 250 / 6.894757 = 36.26 ksi.
		{"rod under its own weight, US", rod, units.USCustomary, []string{"density 490.1 lb/ft³; allowable stress 36.26 ksi"}, []string{"thermal expansion"}},
		// 12e-6 /K × 5/9 = 6.667e-6 /°F. The warming of 30 K is a change
		// of temperature, 54 °F (a change of 1 °F is 5/9 K, no offset: NIST
		// SP 811, Appendix B), and the row says so: "temperature -20 °F"
		// reads as a temperature.
		{"heated bar, US", heated, units.USCustomary, []string{"thermal expansion 6.667e-06 1/°F; allowable stress 36.26 ksi", "\ntemperature change\n54.00 °F\n"}, []string{"density"}},
		// A settlement is a load too: 25.4 mm is 1 in exactly.
		{"settled support, US", settled, units.USCustomary, []string{"roller at 13.12 ft; settles 0 in, -1.000 in, 0 rad"}, []string{"density", "thermal expansion"}},
	} {
		t.Run(c.name, func(t *testing.T) {
			in := solved(t, &c.model)
			in.Units = c.system
			page := buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}})
			var text strings.Builder
			for _, it := range page.Items {
				if it.Kind == Text {
					text.WriteString(it.Text + "\n")
				}
			}
			for _, w := range c.want {
				if !strings.Contains(text.String(), w) {
					t.Errorf("the sheet does not say %q:\n%s", w, text.String())
				}
			}
			for _, a := range c.absent {
				if strings.Contains(text.String(), a) {
					t.Errorf("the sheet gives the %s, which no load uses", a)
				}
			}
		})
	}
}

// The model table gives the depth a temperature difference acts over when
// the file gives one (not twice the fibre distance), and the shear
// properties as the file gives them: the shear area and modulus, or κ and
// ν (TestSheetShowsGroundAndHinges); a checker reproduces a thermal or a
// shear result from them.
func TestSheetShowsDepthAndShearInputs(t *testing.T) {
	steel := fem.Material{Elastic: 200e9, ThermalExpansion: 12e-6, ShearModulus: 80e9}
	sec := fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15, Depth: 0.4, ShearArea: 2e-3}
	m := &fem.Model{Segments: []fem.Segment{{Start: 0, End: 6, Section: sec, Material: steel, TemperatureDifference: 10, ShearDeformation: true}},
		Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6, Kind: fem.Fixed}}}
	page := buildSheet(SheetInput{Input: solved(t, m), Notes: SheetNotes{Version: "test"}})
	var lines []string
	for _, it := range page.Items {
		if it.Kind == Text {
			lines = append(lines, it.Text)
		}
	}
	const want = "bottom fibre warmer than the top by 10.00 K over a depth of 400.0 mm; shear deformation (Timoshenko beam), As 2000 mm², G 80.00 GPa"
	if all := strings.Join(lines, "\n"); !strings.Contains(all, want) {
		t.Errorf("the sheet should say %q:\n%s", want, all)
	}
}

// The sheet lists the moving load trains its results leave out, under a
// heading that says so.
func TestSheetListsTheTrainsLeftOut(t *testing.T) {
	in := SheetInput{Input: solved(t, modelledModel()), Notes: SheetNotes{Version: "test"}, Trains: []string{`train "cart": 10.00 kN`}}
	var lines []string
	for _, it := range buildSheet(in).Items {
		if it.Kind == Text {
			lines = append(lines, it.Text)
		}
	}
	all := strings.Join(lines, "\n")
	for _, want := range []string{"Moving load trains, left out of these results and checks", `• train "cart": 10.00 kN`} {
		if !strings.Contains(all, want) {
			t.Errorf("the sheet lacks %q:\n%s", want, all)
		}
	}
}

// The sheet gives the error measures with the three significant figures
// of the solve text and of its own results table: it printed "largest
// stress error 1 %" under a table whose bending stress reads 1.04 %. Eight
// Hermite elements on a simply supported beam under a uniform load q have
// exact nodal displacements, so each element's moment is off by its
// fixed-end moment q·h²/12 at its ends (AISC, Beam Diagrams and Formulas,
// beam fixed at both ends, uniformly distributed load): against the
// largest moment q·L²/8 that is 2/(3·8²) = 1.04 %.
func TestSheetErrorMeasuresToThreeFigures(t *testing.T) {
	m := &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 4,
			Section:  fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: fem.Material{Elastic: 2e11}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 4, Intensity: -10e3}}}},
		Mesh:            fem.MeshSettings{Elements: 8},
	}
	var lines []string
	for _, it := range buildSheet(SheetInput{Input: solved(t, m), Notes: SheetNotes{Version: "test"}}).Items {
		if it.Kind == Text {
			lines = append(lines, it.Text)
		}
	}
	want := fmt.Sprintf("FE against exact: %s %.3g %% of the largest stress", fem.StressErrorName, 100*2/(3*8.0*8))
	if all := strings.Join(lines, "\n"); !strings.Contains(all, want) {
		t.Errorf("the sheet should say %q:\n%s", want, all)
	}
}

// The sheet's extremes say the side of a jump as the text output does
// ("just left of 4.000 m", fem.Side.Place), and its columns do not run
// into each other with the longer places, in SI or US units. Two equal
// spans L = 4 m under w = 10 kN/m: the shear force is 5wL/8 = 25 kN just
// right of the middle support and −25 kN just left of it, the moment there
// −wL²/8, continuous (AISC Manual, Beam Diagrams and Formulas, continuous
// beam, two equal spans, uniform load, from memory). Without the exact
// solution the finite element extremes say their own sides: on 16
// elements the finite element shear force is constant in each element,
// largest just right of the support, smallest first reached at 3.5 m, a
// node where it does not jump (fem's TestSummarySaysTheSideOfAJump).
func TestSheetSaysTheSideOfAJump(t *testing.T) {
	m := twoSpans()
	for _, exact := range []bool{true, false} {
		for _, u := range []units.System{units.SI, units.USCustomary} {
			in := solved(t, m)
			in.Units = u
			if !exact {
				in.Exact = nil
			}
			page := buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}})
			rows := map[float32][]Item{} // the text of each line, by its height on the page
			for _, it := range page.Items {
				if it.Kind == Text && it.Text != "" {
					rows[it.At.Y] = append(rows[it.At.Y], it)
				}
			}
			at := u.Format(units.Position, 4)
			want := []string{"just right of " + at, "just left of " + at}
			if !exact {
				want = want[:1]
			}
			for _, row := range rows {
				slices.SortFunc(row, func(a, b Item) int { return cmp.Compare(a.At.X, b.At.X) })
				var sides []string
				for i, it := range row {
					if i > 0 && row[i-1].At.X+row[i-1].Width > it.At.X {
						t.Errorf("exact %v, %s: %q runs into %q", exact, u.Name, row[i-1].Text, it.Text)
					}
					if strings.HasPrefix(it.Text, "just ") {
						sides = append(sides, it.Text)
					}
				}
				switch {
				case strings.HasPrefix(row[0].Text, "shear force") && !slices.Equal(sides, want):
					t.Errorf("exact %v, %s: the shear force's row gives the sides %q, want %q", exact, u.Name, sides, want)
				case strings.HasPrefix(row[0].Text, "bending moment") && len(sides) > 0:
					t.Errorf("exact %v, %s: the moment, which does not jump, has a side: %q", exact, u.Name, sides)
				}
			}
		}
	}
}

// twoSpans is a member over two equal spans of 4 m under 10 kN/m, on 16
// elements (the shipped two_span_uniform).
func twoSpans() *fem.Model {
	return &fem.Model{
		Segments: []fem.Segment{{Start: 0, End: 8,
			Section:  fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1},
			Material: fem.Material{Elastic: 2e11}}},
		Supports:        []fem.Support{{X: 0, Kind: fem.Pinned}, {X: 4, Kind: fem.Roller}, {X: 8, Kind: fem.Roller}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: -10e3}, {X: 8, Intensity: -10e3}}}},
		Mesh:            fem.MeshSettings{Elements: 16},
	}
}

// The diagrams' labels of the extremes say the side of a jump as the
// results table and the text output do: the shear force of two spans
// (TestSheetSaysTheSideOfAJump's values) is 25 kN just right of the middle
// support and −25 kN just left of it, 22.5 kN just right of it and
// −22.5 kN at 3.5 m on the mesh; without the exact solution the finite
// element labels say their own sides. The moment, continuous, has none.
func TestDiagramLabelsSayTheSideOfAJump(t *testing.T) {
	for _, exact := range []bool{true, false} {
		for _, u := range units.Systems() {
			in := solved(t, twoSpans())
			in.Units = u
			in.Overlays = storage.Overlays{ShearForce: true, BendingMoment: true}
			f, at := u.Format, func(x float64) string { return u.Format(units.Position, x) }
			want := []string{"FE " + f(units.Force, 22.5e3) + " just right of " + at(4), "FE " + f(units.Force, -22.5e3) + " at " + at(3.5),
				"exact " + f(units.Force, 25e3) + " just right of " + at(4) + ", FE off by " + f(units.Force, -2.5e3),
				"exact " + f(units.Force, -25e3) + " just left of " + at(4) + ", FE off by +" + f(units.Force, 2.5e3)}
			if !exact {
				in.Exact = nil
				want = want[:2]
			}
			v := NewView(1000, 700)
			v.Fit(in.Model)
			var texts []string
			for _, it := range Build(in, v).Items {
				if it.Kind == Text {
					texts = append(texts, it.Text)
				}
			}
			for _, w := range want {
				if !slices.Contains(texts, w) {
					t.Errorf("exact %v, %s: no label %q among %q", exact, u.Name, w, texts)
				}
			}
			for _, s := range texts {
				if strings.Contains(s, "kN·m") && strings.Contains(s, "just ") || strings.Contains(s, "kip·ft") && strings.Contains(s, "just ") {
					t.Errorf("exact %v, %s: the moment, which does not jump, has a side: %q", exact, u.Name, s)
				}
			}
		}
	}
}

// The sheet's line on the mesh gives its condition estimate as the text
// output does, to two figures ("condition estimate 18"): it wrote
// "1.78e+01" beside the text's "18" for the same mesh.
func TestSheetMeshLineAsTheText(t *testing.T) {
	in := solved(t, twoSpans())
	sum := fem.Summarize(in.Solution, in.Exact)
	want := fmt.Sprintf("Mesh: 16 elements, 17 nodes, %s, condition estimate %s.", sum.Mesh.Kinds, units.FormatG("%.2g", sum.Mesh.Condition))
	var all []string
	for _, it := range buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}}).Items {
		if it.Kind == Text {
			all = append(all, it.Text)
		}
	}
	if text := strings.Join(all, " "); !strings.Contains(text, want) {
		t.Errorf("the sheet does not say %q:\n%s", want, text)
	}
}

// pageRows are the texts of page's lines in small type, each line's from
// left to right, by their height on the page.
func pageRows(page *Scene) map[float32][]Item {
	rows := map[float32][]Item{}
	for _, it := range page.Items {
		if it.Kind == Text && it.Text != "" {
			rows[it.At.Y] = append(rows[it.At.Y], it)
		}
	}
	for _, row := range rows {
		slices.SortFunc(row, func(a, b Item) int { return cmp.Compare(a.At.X, b.At.X) })
	}
	return rows
}

// rowsOf are the texts of the first n cells of each row of rows (pageRows)
// whose first cell reads first.
func rowsOf(rows map[float32][]Item, first string, n int) [][]string {
	var out [][]string
	for _, row := range rows {
		if row[0].Text != first {
			continue
		}
		var texts []string
		for _, it := range row[:min(len(row), n)] {
			texts = append(texts, it.Text)
		}
		out = append(out, texts)
	}
	return out
}

// The extremes table says where each finite element extreme is, beside
// the exact one's place: on 16 elements the finite element shear force of
// two spans (twoSpans) is smallest, −22.5 kN, first at 3.5 m, not just
// left of the middle support where the exact −25 kN = −5wL/8 is (two equal
// spans under a uniform load, beam tables, from memory), and largest,
// 22.5 kN, just right of it as the exact 25 kN is (constant in each
// element: fem's TestSummarySaysTheSideOfAJump). The sheet gave "FE -22.50 kN" with no place of
// its own, read as at the exact one's. Every shipped model's row gives
// each finite element extreme's own place ("same" where it is the exact
// one's), in SI and US units, its texts clear of each other and on the page.
func TestSheetSaysWhereTheFEExtremesAre(t *testing.T) {
	for _, u := range units.Systems() {
		in := solved(t, twoSpans())
		in.Units = u
		f := u.Format
		at := func(x float64) string { return f(units.Position, x) }
		want := []string{"shear force V", f(units.Force, 25e3), "just right of " + at(4), f(units.Force, 22.5e3), "same",
			f(units.Force, -25e3), "just left of " + at(4), f(units.Force, -22.5e3), at(3.5)}
		found := rowsOf(pageRows(buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}})), want[0], len(want))
		for _, got := range found {
			if !slices.Equal(got, want) {
				t.Errorf("%s: the shear force's extremes read %q, want %q", u.Name, got, want)
			}
		}
		if len(found) == 0 {
			t.Errorf("%s: the sheet has no row of the shear force's extremes", u.Name)
		}
	}
	for _, c := range shippedCases(t) {
		if !strings.HasSuffix(c.name, "saved overlays") {
			continue
		}
		for _, u := range units.Systems() {
			in := c.in
			in.Units = u
			f := u.Format
			place := func(x float64, side fem.Side) string { return side.Place(f(units.Position, x)) }
			feAt := func(x float64, side fem.Side, exact string) string {
				if p := place(x, side); p != exact {
					return p
				}
				return "same"
			}
			sum := fem.Summarize(in.Solution, in.Exact)
			rows := pageRows(buildSheet(SheetInput{Input: in, Notes: SheetNotes{Version: "test"}}))
			for _, e := range sum.Extremes {
				q := e.Quantity.Info().Unit
				hi, lo := place(e.XMax, e.SideMax), place(e.XMin, e.SideMin)
				want := []string{quantityWords(e.Quantity), f(q, e.Max), hi, f(q, e.FEMax), feAt(e.FEXMax, e.FESideMax, hi),
					f(q, e.Min), lo, f(q, e.FEMin), feAt(e.FEXMin, e.FESideMin, lo)}
				found := rowsOf(rows, want[0], len(want))
				for _, got := range found {
					if !slices.Equal(got, want) {
						t.Errorf("%s, %s: the extremes read %q, want %q", c.name, u.Name, got, want)
					}
				}
				if len(found) == 0 {
					t.Errorf("%s, %s: no row of the %s", c.name, u.Name, want[0])
				}
			}
			for _, row := range rows {
				for i, it := range row {
					if i > 0 && row[i-1].At.X+row[i-1].Width > it.At.X {
						t.Errorf("%s, %s: %q runs into %q", c.name, u.Name, row[i-1].Text, it.Text)
					}
					if it.At.X+it.Width > a4Width-sheetEdge+1 {
						t.Errorf("%s, %s: %q runs off the page", c.name, u.Name, it.Text)
					}
				}
			}
		}
	}
}

// A table too wide for the page at the sheet's type is set in smaller
// type, with its columns apart and inside the width; one that fits keeps
// the sheet's type and shares the room left over between its columns.
func TestTableColumnsFitTheWidth(t *testing.T) {
	long := "just right of 4.000 m, a place longer than any"
	for _, c := range []struct {
		name  string
		row   []string
		small bool // the table must be set in smaller type
	}{
		{"fits", []string{"shear force V", "25.00 kN", "4.000 m"}, false},
		{"too wide", []string{"shear force V", long, long, long, long, long}, true},
	} {
		head := make([]string, len(c.row))
		xs, size := tableColumns(head, [][]string{c.row}, sheetSmall, a4Width-2*sheetEdge)
		if c.small != (size < sheetSmall) {
			t.Errorf("%s: set in %g pt type, want smaller than %g: %v", c.name, size, float32(sheetSmall), c.small)
		}
		for i, s := range c.row {
			end := xs[i] + textWidth(s, size, false)
			if i+1 < len(xs) && end+tableGap > xs[i+1]+0.01 {
				t.Errorf("%s: column %d ends at %g, within %d pt of the next at %g", c.name, i, end, tableGap, xs[i+1])
			}
			if end > a4Width-sheetEdge+0.01 {
				t.Errorf("%s: column %d ends at %g, off the page at %g", c.name, i, end, a4Width-sheetEdge)
			}
		}
	}
}
