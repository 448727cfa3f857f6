package canvas

import (
	"bytes"
	"encoding/csv"
	"image/png"
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

func TestWriteCSVMatchesSolution(t *testing.T) {
	m := demoModel(6)
	in := solved(t, m)
	for _, u := range []units.System{units.SI, units.USCustomary} {
		var buf bytes.Buffer
		if err := WriteCSV(&buf, in.Solution, in.Exact, u, 3, nil); err != nil {
			t.Fatal(err)
		}
		if !strings.HasPrefix(buf.String(), "# Stave results. "+Caution) {
			t.Errorf("%s: the CSV does not open with the caution", u.Name)
		}
		r := csv.NewReader(&buf)
		r.Comment = '#'
		records, err := r.ReadAll()
		if err != nil {
			t.Fatalf("%s: the CSV does not parse: %v", u.Name, err)
		}
		header := records[0]
		if want := "x [" + u.Unit(units.Position).Symbol + "]"; header[0] != want {
			t.Errorf("%s: first column is %q, want %q", u.Name, header[0], want)
		}
		if got, want := len(records)-1, len(in.Solution.Mesh.Elements)*4; got != want {
			t.Errorf("%s: %d rows, want %d (4 per element)", u.Name, got, want)
		}
		// Row 5 is the second element's start, read from the right.
		row := records[5]
		x := u.FromDisplay(units.Position, parse(t, row[0]))
		el := in.Solution.Mesh.Elements[1]
		if math.Abs(x-el.Start) > 1e-12 {
			t.Fatalf("%s: row 5 is at x = %g, want the second element's start %g", u.Name, x, el.Start)
		}
		fe, ex := in.Solution.At(el.Start, fem.Right), in.Exact.At(el.Start, fem.Right)
		for i, q := range fem.Quantities() {
			for k, f := range []fem.Fields{fe, ex} {
				got := u.FromDisplay(q.Info().Unit, parse(t, row[1+2*i+k]))
				want := q.Of(&f)
				if math.Abs(got-want) > 1e-12*math.Max(1, math.Abs(want)) {
					t.Errorf("%s: column %q is %g in SI, the solver's At gives %g", u.Name, header[1+2*i+k], got, want)
				}
			}
		}
	}
}

func parse(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("CSV cell %q is not a number", s)
	}
	return v
}

func TestSheet(t *testing.T) {
	m := demoModel(12)
	in := SheetInput{Input: solved(t, m),
		Notes:  SheetNotes{Project: "Demo hall", Mark: "B1", Engineer: "A. Tester", Date: "2026-01-01", Version: "test"},
		Checks: []string{"bending stress 165 MPa exceeds the allowable 160 MPa at x = 2.0 m"}}
	in.Input.Overlays = storage.Overlays{DeformedShape: true, ShearForce: true, BendingMoment: true, Nodes: true, ExactBand: true}
	var pdf bytes.Buffer
	if err := WriteSheet(&pdf, "pdf", in); err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(pdf.Bytes(), []byte("%PDF")) || countPages(pdf.Bytes()) != 1 {
		t.Errorf("the sheet PDF has %d pages (want 1) or no %%PDF header", countPages(pdf.Bytes()))
	}
	var img bytes.Buffer
	if err := WriteSheet(&img, "png", in); err != nil {
		t.Fatal(err)
	}
	decoded, err := png.Decode(&img)
	if err != nil {
		t.Fatalf("the sheet PNG does not decode: %v", err)
	}
	// A4 at 150 dpi: 210 mm × 297 mm.
	if b := decoded.Bounds(); math.Abs(float64(b.Dx())-1240) > 1 || math.Abs(float64(b.Dy())-1754) > 1 {
		t.Errorf("the sheet PNG is %d × %d pixels, want A4 at 150 dpi, 1240 × 1754", b.Dx(), b.Dy())
	}
	page := buildSheet(in)
	var lines []string
	for _, it := range page.Items {
		lines = append(lines, it.Text)
	}
	for _, want := range []string{Caution, "Project: Demo hall", "• " + in.Checks[0]} {
		if !slices.Contains(lines, want) {
			t.Errorf("the sheet has no line %q", want)
		}
	}
	// 8.36e-5 m⁴ is 83.60 × 10⁶ mm⁴: the power of ten with its ×.
	if want := "I 83.60 × 10⁶ mm⁴"; !slices.ContainsFunc(lines, func(s string) bool { return strings.Contains(s, want) }) {
		t.Errorf("the sheet's model table does not say %q", want)
	}
	if want := extremeLabel(in.Input); !slices.ContainsFunc(lines, func(s string) bool { return strings.HasPrefix(s, "FE ") && strings.Contains(s, want) }) {
		t.Errorf("the sheet's drawing has no label saying the finite element bending moment reaches %q", want)
	}
	if err := WriteSheet(&img, "tiff", in); err == nil {
		t.Error("an unknown sheet format was accepted")
	}
}

func TestConvergenceChart(t *testing.T) {
	m := demoModel(2)
	e, err := fem.SolveExact(m)
	if err != nil {
		t.Fatal(err)
	}
	var rows []ConvergenceRow
	for _, n := range []int{4, 8, 16, 32} {
		m.Mesh.Elements = n
		s, err := fem.Solve(m)
		if err != nil {
			t.Fatal(err)
		}
		rows = append(rows, ConvergenceRow{Elements: len(s.Mesh.Elements), Errors: fem.Compare(s, e)})
	}
	for _, format := range []string{"png", "svg", "pdf"} {
		var buf bytes.Buffer
		if err := WriteConvergenceChart(&buf, format, rows, ConvergenceRates{Displacement: 4, Energy: 2, Stress: 2, Floor: 1e-10}); err != nil {
			t.Fatalf("%s: %v", format, err)
		}
		if buf.Len() < 1000 {
			t.Errorf("%s chart is only %d bytes", format, buf.Len())
		}
	}
	if err := WriteConvergenceChart(&bytes.Buffer{}, "png", rows[:1], ConvergenceRates{}); err == nil {
		t.Error("a chart of one mesh was accepted")
	}
	// Errors at round-off are not plotted: a model the elements solve
	// exactly has nothing to show.
	exact := []ConvergenceRow{{Elements: 2, Errors: fem.ErrorNorms{RelativeL2: 1e-16, RelativeEnergy: 2e-16}}, {Elements: 4, Errors: fem.ErrorNorms{RelativeL2: 3e-16}}}
	if err := WriteConvergenceChart(&bytes.Buffer{}, "png", exact, ConvergenceRates{Floor: 1e-10}); err == nil || !strings.Contains(err.Error(), "round-off") {
		t.Errorf("a chart of round-off: %v", err)
	}
}

func TestWriteImage(t *testing.T) {
	in := solved(t, demoModel(10))
	var buf bytes.Buffer
	in.Overlays = storage.Overlays{BendingMoment: true}
	if err := WriteImage(&buf, "png", in, 640, 480, 1, ""); err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(&buf)
	if err != nil {
		t.Fatal(err)
	}
	if b := img.Bounds(); b.Dx() != 640 || b.Dy() != 480 {
		t.Errorf("image is %d × %d, want 640 × 480", b.Dx(), b.Dy())
	}
	if err := WriteImage(&buf, "bmp", in, 640, 480, 1, ""); err == nil {
		t.Error("an unknown image format was accepted")
	}
	buf.Reset()
	if err := WriteImage(&buf, "svg", in, 640, 480, 1, ""); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "qualified engineer must review") {
		t.Error("the exported drawing carries no caution")
	}
}
