package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"testing"

	"stave/fem"
)

// runStave runs one command line and returns exit status, stdout and stderr.
func runStave(t *testing.T, args ...string) (int, string, string) {
	t.Helper()
	var out, errOut bytes.Buffer
	code := run(args, &out, &errOut)
	return code, out.String(), errOut.String()
}

func TestSolveJSONCantilever(t *testing.T) {
	code, out, stderr := runStave(t, "solve", "--json", "../../testdata/cantilever_tip_load.json")
	// Its 133 mm tip deflection is beyond length/180 = 22.2 mm (common
	// practice for cantilevers): solved and written, a check failed. The
	// document says so; stderr stays empty for the script reading it.
	if code != 3 || stderr != "" || !strings.Contains(out, `"code": "design_fail"`) || !strings.Contains(out, "Deflection, cantilever") {
		t.Fatalf("exit %d, want 3 for the failed deflection check, with it in the document and nothing on stderr; stderr %s", code, stderr)
	}
	var got struct {
		Format    string `json:"format"`
		Version   int    `json:"version"`
		Solved    bool   `json:"solved"`
		Failed    bool   `json:"check_failed"`
		Headline  string `json:"headline"`
		Reactions []struct {
			Axial, Transverse, Moment *struct {
				Value, FE float64
				Exact     *float64
			}
		} `json:"reactions"`
		Extremes []struct {
			Quantity string
			Min      struct {
				Value, X, FE float64
				Exact        *float64
				XFE          float64 `json:"x_fe"`
			}
		} `json:"extremes"`
		Equilibrium struct {
			Exact struct{ Relative float64 }
			FE    struct{ Relative float64 }
		} `json:"equilibrium"`
		ExactError *struct {
			Displacement float64 `json:"displacement_error"`
		} `json:"exact_error"`
		Mesh struct {
			Elements int
			ChosenBy string `json:"chosen_by"`
		} `json:"mesh"`
		Warnings []struct{ Code string } `json:"warnings"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatalf("output is not JSON: %v\n%s", err, out)
	}
	if got.Format != "stave-results" || got.Version != 1 || !got.Solved || !got.Failed || got.Headline != "exact" {
		t.Errorf("header: format %q version %d solved %v check_failed %v headline %q", got.Format, got.Version, got.Solved, got.Failed, got.Headline)
	}
	// Cantilever, L = 4 m, tip force P = 10 kN down, E = 200 GPa, I = 8e-6 m⁴:
	// root reaction P up and moment P·L, tip deflection P·L³/(3·E·I) = 0.1333 m down.
	// Source: Gere & Goodno, Mechanics of Materials, Appendix D (cantilever beams), from memory.
	const P, L, E, I = 10e3, 4.0, 200e9, 8e-6
	if len(got.Reactions) != 1 {
		t.Fatalf("want 1 reaction, got %d", len(got.Reactions))
	}
	r := got.Reactions[0]
	if r.Transverse == nil || r.Moment == nil || r.Axial == nil || r.Transverse.Exact == nil {
		t.Fatalf("a fixed end holds all three components, each with its exact value: %+v", r)
	}
	near(t, "root reaction", r.Transverse.Value, P, 1e-9)
	near(t, "root reaction, FE", r.Transverse.FE, P, 1e-9)
	near(t, "root moment", r.Moment.Value, P*L, 1e-9)
	found := false
	for _, e := range got.Extremes {
		if e.Quantity == "deflection" {
			found = true
			near(t, "tip deflection", e.Min.Value, -P*L*L*L/(3*E*I), 1e-9)
			near(t, "tip deflection, FE", e.Min.FE, -P*L*L*L/(3*E*I), 1e-9)
			near(t, "position of tip deflection", e.Min.X, L, 1e-12)
		}
	}
	if !found {
		t.Error("no deflection extreme in the output")
	}
	if got.Equilibrium.Exact.Relative > 1e-12 || got.Equilibrium.FE.Relative > 1e-12 {
		t.Errorf("equilibrium residuals %+v are not round-off", got.Equilibrium)
	}
	if got.ExactError == nil || got.ExactError.Displacement > 1e-12 {
		t.Errorf("exact_error %+v: point loads only, the elements are exact", got.ExactError)
	}
	if got.Mesh.Elements != 4 || got.Mesh.ChosenBy != "model" {
		t.Errorf("mesh %+v, the file asks for 4 elements", got.Mesh)
	}
	if len(got.Warnings) == 0 || got.Warnings[0].Code != "design_fail" {
		t.Errorf("warnings %+v, want the design failure first", got.Warnings)
	}
}

func near(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Max(math.Abs(want), 1e-300) {
		t.Errorf("%s = %.12g, want %.12g", what, got, want)
	}
}

func TestSolveTextNamesEverySection(t *testing.T) {
	code, out, stderr := runStave(t, "solve", "../../testdata/demo.json")
	if code != 0 {
		t.Fatalf("exit %d, stderr %s", code, stderr)
	}
	for _, want := range []string{"Mesh", "Reactions", "Extremes", "supports inside the member", "Equilibrium", "exact solution",
		fem.StressErrorName, fem.DisplacementErrorName, fem.EnergyErrorName, "Checks", "Warnings: none", "Caution", "kN·m"} {
		if !strings.Contains(out, want) {
			t.Errorf("text summary lacks %q", want)
		}
	}
	_, us, _ := runStave(t, "solve", "--units", "US", "../../testdata/demo.json")
	if !strings.Contains(us, "kip") {
		t.Error("--units US does not print kips")
	}
}

func TestExitStatus(t *testing.T) {
	dir := t.TempDir()
	demo, err := os.ReadFile("../../testdata/cantilever_tip_load.json")
	if err != nil {
		t.Fatal(err)
	}
	outside := filepath.Join(dir, "outside.json")
	os.WriteFile(outside, bytes.Replace(demo, []byte(`"x": 0,`), []byte(`"x": 7,`), 1), 0o644)
	unsupported := filepath.Join(dir, "free.json")
	os.WriteFile(unsupported, bytes.Replace(demo, []byte(`"kind": "fixed"`), []byte(`"kind": "roller"`), 1), 0o644)

	cases := []struct {
		name   string
		args   []string
		code   int
		stderr string // a phrase the message must contain
	}{
		{"no file", []string{"solve"}, 2, "exactly one model file"},
		{"unknown command", []string{"--bogus"}, 2, "unknown command"},
		{"unknown flag", []string{"solve", "--fast", "x.json"}, 2, "flag provided but not defined"},
		{"unknown units", []string{"solve", "--units", "imperial", "../../testdata/demo.json"}, 2, "unknown unit system"},
		{"missing file", []string{"solve", filepath.Join(dir, "none.json")}, 1, "none.json"},
		{"support outside", []string{"solve", outside}, 1, "supports[0]"},
		{"mechanism", []string{"solve", unsupported}, 1, "slide along its axis"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			code, _, stderr := runStave(t, c.args...)
			if code != c.code {
				t.Errorf("exit %d, want %d (stderr %s)", code, c.code, stderr)
			}
			if !strings.Contains(stderr, c.stderr) {
				t.Errorf("stderr %q lacks %q", stderr, c.stderr)
			}
		})
	}
}

// TestReadmeExampleSolves keeps the README's model example true.
func TestReadmeExampleSolves(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile("(?s)```json\n(.*?)```").FindSubmatch(readme)
	if m == nil {
		t.Fatal("README has no json example")
	}
	path := filepath.Join(t.TempDir(), "readme.json")
	if err := os.WriteFile(path, m[1], 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, stderr := runStave(t, "solve", path)
	if code != 0 {
		t.Fatalf("README example does not solve: exit %d\n%s", code, stderr)
	}
	// Same cantilever as above: root moment P·L = 40 kN·m (Gere & Goodno, from memory).
	if !strings.Contains(out, "40.00 kN·m") {
		t.Errorf("README example: root moment 40.00 kN·m not in output\n%s", out)
	}
}

func TestExportWritesEachFormat(t *testing.T) {
	dir := t.TempDir()
	cases := []struct {
		out    string
		extra  []string
		header string
	}{
		{"beam.png", []string{"--dpi", "144", "--width", "600", "--height", "400"}, "\x89PNG"},
		{"beam.svg", nil, "<?xml"},
		{"beam.pdf", nil, "%PDF"},
		{"sheet.pdf", []string{"--sheet"}, "%PDF"},
		{"sheet.png", []string{"--sheet"}, "\x89PNG"},
		{"fields.csv", nil, "# Stave results."},
	}
	for _, c := range cases {
		t.Run(c.out, func(t *testing.T) {
			out := filepath.Join(dir, c.out)
			args := append([]string{"export", "../../testdata/demo.json", "--out", out}, c.extra...)
			if code, _, stderr := runStave(t, args...); code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			data, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			if !bytes.HasPrefix(data, []byte(c.header)) {
				t.Errorf("%s starts with %q, want %q", c.out, data[:min(len(data), 8)], c.header)
			}
		})
	}
	// 600 × 400 points at 144 dpi is 1200 × 800 pixels.
	f, err := os.Open(filepath.Join(dir, "beam.png"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	cfg, err := png.DecodeConfig(f)
	if err != nil {
		t.Fatal(err)
	}
	if cfg.Width != 1200 || cfg.Height != 800 {
		t.Errorf("PNG is %d × %d, want 1200 × 800", cfg.Width, cfg.Height)
	}
}

func TestExportMisuse(t *testing.T) {
	for _, args := range [][]string{
		{"export", "../../testdata/demo.json"},
		{"export", "../../testdata/demo.json", "--out", "x.txt"},
		{"export", "../../testdata/demo.json", "--out", "x.svg", "--sheet"},
		{"export", "../../testdata/demo.json", "--out", "x.png", "--dpi", "-3"},
		{"export", "../../testdata/demo.json", "--out", "x.csv", "--points", "0"},
		{"export", "../../testdata/demo.json", "--out", "x.csv", "--points", "1001"},
		{"export", "../../testdata/demo.json", "--out", "x.png", "--points", "3"},
		{"export", "../../testdata/demo.json", "--out", "x.csv", "--units", "imperial"},
	} {
		if code, _, _ := runStave(t, args...); code != 2 {
			t.Errorf("%v: exit %d, want 2", args, code)
		}
	}
}

// Drawing sizes and densities no drawing can have are misuse, refused at
// once with the range (a width of 10⁹ points ran the vector drawings out of
// memory, a fatal error; an infinite one panicked; a NaN density reached the
// drawing and a tiny one the PNG encoder), and no file is written.
func TestExportRefusesImpossibleSizes(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		out, flag, value, phrase string
	}{
		{"x.svg", "--width", "1e9", "a drawing width of 1e+09 points: give 1 to 20000 points"},
		{"x.pdf", "--height", "1e300", "a drawing height of 1e+300 points"},
		{"x.png", "--width", "Inf", "a drawing width of +Inf points"},
		{"x.svg", "--width", "NaN", "a drawing width of NaN points"},
		{"x.svg", "--width", "1e-300", "a drawing width of 1e-300 points"},
		{"x.png", "--height", "-1", "a drawing height of -1 points"},
		{"x.png", "--dpi", "NaN", "a density of NaN dpi: give 1 to 20000 dpi"},
		{"x.png", "--dpi", "1e-300", "a density of 1e-300 dpi"},
	} {
		out := filepath.Join(dir, c.out)
		code, _, stderr := runStave(t, "export", "../../testdata/demo.json", "--out", out, c.flag, c.value)
		if code != 2 || !strings.Contains(stderr, c.phrase) {
			t.Errorf("%s %s: exit %d, want 2 with %q; stderr %s", c.flag, c.value, code, c.phrase, stderr)
		}
		if _, err := os.Stat(out); err == nil {
			t.Errorf("%s %s: %s was written", c.flag, c.value, c.out)
		}
	}
}

// A density each flag allows alone can still make a PNG larger than
// 20,000 pixels a side, or smaller than one, with the drawing's size: that
// is misuse too, refused with the pixels it would make and the densities
// that fit (a pixel is 1/72 of a point times the density: 1200 points at
// 20,000 dpi is 333,333 pixels); so is a height the footer leaves no room
// in. They were refused as a model (exit 1) after solving, the first
// naming the 1200 × 800 points pixels.
func TestExportRefusesDensitiesTooLargeForTheDrawing(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		args    []string
		phrases []string
	}{
		{[]string{"--out", "x.png", "--dpi", "20000"},
			[]string{"1200 × 800 points at 20000 dpi come to 333333 × 222222 pixels", "give 0.09 to 1200 dpi"}},
		{[]string{"--out", "x.png", "--dpi", "1", "--width", "30", "--height", "40"},
			[]string{"30 × 40 points at 1 dpi come to 0.42 × 0.56 pixels", "give 2.4 to 36000 dpi"}},
		{[]string{"--out", "x.svg", "--height", "10"}, []string{"a drawing 10 points high leaves no room above its 36-point footer (the mesh's accuracy and the caution)"}},
		{[]string{"--out", "x.png", "--multiples", "--dpi", "5000"}, []string{"at 5000 dpi come to", "pixels"}},
	} {
		out := filepath.Join(dir, c.args[1])
		code, _, stderr := runStave(t, append([]string{"export", "../../testdata/demo.json"}, c.args...)...)
		if code != 2 {
			t.Errorf("%v: exit %d, want 2; stderr %s", c.args, code, stderr)
		}
		for _, phrase := range c.phrases {
			if !strings.Contains(stderr, phrase) {
				t.Errorf("%v: stderr lacks %q: %s", c.args, phrase, stderr)
			}
		}
		if _, err := os.Stat(out); err == nil {
			t.Errorf("%v: %s was written", c.args, out)
		}
	}
}

// A --points the mesh cannot be tabulated at, past canvas.CSVMaxRows rows
// (3000 elements at 1001 points each is 3,003,000 rows; at most
// 2,000,000/3000 − 1 = 665 intervals fit), is misuse of the flag, as a
// density too large for the drawing is: exit 2, naming the flag and the
// most that fits, and no file. It was refused as a model (exit 1).
func TestExportRefusesPointsTooManyForTheMesh(t *testing.T) {
	out := filepath.Join(t.TempDir(), "x.csv")
	code, _, stderr := runStave(t, "export", "../../testdata/simply_supported_uniform.json", "--out", out, "--elements", "3000", "--points", "1000")
	if code != 2 {
		t.Errorf("exit %d, want 2; stderr %s", code, stderr)
	}
	for _, phrase := range []string{"--points 1000", "3003000 rows", "at most 665 intervals per element"} {
		if !strings.Contains(stderr, phrase) {
			t.Errorf("stderr lacks %q: %s", phrase, stderr)
		}
	}
	if _, err := os.Stat(out); err == nil {
		t.Errorf("%s was written", out)
	}
}

// --points sets the rows per element of the table and --units its unit
// system, which the preamble states; the file is written whole or not at
// all.
func TestExportCSVPointsAndUnits(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "fields.csv")
	elements := 0
	for _, c := range []struct {
		args    []string
		units   string
		rows    int    // per element
		preface string // what the table says of them
	}{
		{nil, "SI", 5, "# Each element at 5 evenly spaced points (4 intervals), both ends included."},
		{[]string{"--points", "1", "--units", "US"}, "US", 2, "# Each element at its 2 ends (1 interval)."},
		{[]string{"--points", "7", "--units", "SI"}, "SI", 8, "# Each element at 8 evenly spaced points (7 intervals), both ends included."},
	} {
		args := append([]string{"export", "../../testdata/cantilever_tip_load.json", "--out", out}, c.args...)
		// The cantilever fails its deflection check: written, exit 3.
		if code, _, stderr := runStave(t, args...); code != 3 {
			t.Fatalf("%v: exit %d: %s", c.args, code, stderr)
		}
		data, err := os.ReadFile(out)
		if err != nil {
			t.Fatal(err)
		}
		text := string(data)
		if !strings.Contains(text, "\n# Units: "+c.units+".") {
			t.Errorf("%v: no units line for %s", c.args, c.units)
		}
		if !strings.Contains(text, "\n"+c.preface+"\n") {
			t.Errorf("%v: the table does not say %q", c.args, c.preface)
		}
		for _, want := range []string{"\n# Reactions", "\n# Checks", "\n#   - [design_fail] FAIL — Deflection, cantilever"} {
			if !strings.Contains(text, want) {
				t.Errorf("%v: the table's comment rows lack %q", c.args, want)
			}
		}
		var rows int
		for _, line := range strings.Split(strings.TrimSpace(text), "\n") {
			if !strings.HasPrefix(line, "#") && !strings.HasPrefix(line, "x [") {
				rows++
			}
		}
		// The same mesh each time: the first table tells its size.
		if elements == 0 {
			elements = rows / c.rows
		}
		if rows != elements*c.rows || elements == 0 {
			t.Errorf("%v: %d rows, not %d for each of %d elements", c.args, rows, c.rows, elements)
		}
	}
	entries, err := os.ReadDir(dir)
	if err != nil || len(entries) != 1 {
		t.Errorf("the export left %d files behind (%v), want only the table", len(entries), err)
	}
}

// A --target that is not a relative error to reach is misuse: NaN, a
// negative or an infinite one left the adaptive study out without a word.
func TestConvergeTargetMisuse(t *testing.T) {
	for _, target := range []string{"NaN", "-1", "+Inf", "0", "1"} {
		code, out, stderr := runStave(t, "converge", "--target", target, "../../testdata/demo.json")
		if code != 2 || out != "" || !strings.Contains(stderr, "--target "+target+": give the relative energy error to reach") {
			t.Errorf("--target %s: exit %d, stdout %d bytes, stderr %q", target, code, len(out), stderr)
		}
	}
}

// A target the ground beam cannot reach before round-off (its condition
// grows as h⁻⁴; relative errors of condition·ε are possible: Golub & Van
// Loan, the sensitivity of a linear system, from memory) ran the adaptive
// refinement on to a singular matrix, and converge printed nothing of its
// study, only that error, with exit 1. The study is printed with the
// refinement stopped at round-off, in the text and in the JSON.
func TestConvergeTargetBelowRoundOff(t *testing.T) {
	const file = "../../testdata/ground_beam_foundation.json"
	code, out, stderr := runStave(t, "converge", "--max", "4", "--target", "1e-7", file)
	if code != 0 || !strings.Contains(out, "Adaptive refinement") || !strings.Contains(out, "the true error met the round-off of the last mesh") {
		t.Errorf("text: exit %d, stderr %q\n%s", code, stderr, out)
	}
	code, out, stderr = runStave(t, "converge", "--json", "--max", "4", "--target", "1e-7", file)
	var got struct {
		Adaptive struct {
			Reached    bool    `json:"reached"`
			AtRoundOff bool    `json:"at_round_off"`
			True       float64 `json:"true_error"`
		} `json:"adaptive"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil || code != 0 {
		t.Fatalf("JSON: exit %d, %v, stderr %q", code, err, stderr)
	}
	if got.Adaptive.Reached || !got.Adaptive.AtRoundOff || !(got.Adaptive.True > 1e-7) {
		t.Errorf("JSON: %+v, want not reached, at round-off, above the target", got.Adaptive)
	}
}

func TestConvergeJSON(t *testing.T) {
	code, out, stderr := runStave(t, "converge", "--json", "--max", "8", "../../testdata/simply_supported_uniform.json")
	// The model's 20.8 mm deflection is beyond span/360 = 11.1 mm (common
	// practice); the document says so, as solve's does, and stderr stays empty.
	if code != 3 || stderr != "" || !strings.Contains(out, `"check_failed": true`) || !strings.Contains(out, `"code": "design_fail"`) {
		t.Fatalf("exit %d, want 3 for the failed deflection check, said in the document alone; stderr %s", code, stderr)
	}
	var got struct {
		Rows []struct {
			Elements int     `json:"elements"`
			L2       float64 `json:"displacement_error"`
		} `json:"rows"`
		Rates struct {
			Displacement, Energy struct {
				Fitted   *float64 `json:"fitted"`
				LastStep *float64 `json:"last_step"`
			}
		} `json:"rates"`
		Exact    bool                    `json:"exact_for_model"`
		Failed   bool                    `json:"check_failed"`
		Warnings []struct{ Code string } `json:"warnings"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	if len(got.Rows) != 4 {
		t.Fatalf("want rows for 1, 2, 4, 8 elements per stretch, got %d", len(got.Rows))
	}
	// Hermite beams: displacement L2 error O(h⁴), energy O(h²)
	// (Strang & Fix, An Analysis of the Finite Element Method, ch. 1; from memory).
	if r := got.Rates.Displacement.Fitted; r == nil || math.Abs(*r-4) > 0.2 {
		t.Errorf("fitted displacement rate %v, want about 4", r)
	}
	if r := got.Rates.Energy.Fitted; r == nil || math.Abs(*r-2) > 0.2 {
		t.Errorf("fitted energy rate %v, want about 2", r)
	}
	if got.Exact || !got.Failed || len(got.Warnings) == 0 || got.Warnings[0].Code != "design_fail" {
		t.Errorf("exact %v, check_failed %v, warnings %+v", got.Exact, got.Failed, got.Warnings)
	}
	// Point loads only: exact for the model, no rates of round-off.
	code, text, _ := runStave(t, "converge", "../../testdata/cantilever_tip_load.json")
	if code != 3 || !strings.Contains(text, "exact for this model") || strings.Contains(text, "Rates:") {
		t.Errorf("cantilever with a point load: exit %d\n%s", code, text)
	}
}

// converge --units US names the warnings' places and values in US units,
// as solve --units US does: 4 m is 13.12 ft (1 ft = 0.3048 m exactly, NIST
// SP 811 Appendix B).
func TestConvergeUnits(t *testing.T) {
	for _, c := range []struct{ units, want, not string }{
		{"US", "x = 13.12 ft", " m:"},
		{"SI", "x = 4.000 m", " ft"},
	} {
		code, out, stderr := runStave(t, "converge", "--max", "2", "--units", c.units, "../../testdata/two_span_uniform.json")
		if code == 1 || code == 2 {
			t.Fatalf("--units %s: exit %d, stderr %s", c.units, code, stderr)
		}
		if !strings.Contains(out, c.want) || strings.Contains(out, c.not) {
			t.Errorf("--units %s: the warnings do not say %q, or say %q:\n%s", c.units, c.want, c.not, out)
		}
	}
	if code, _, stderr := runStave(t, "converge", "--units", "metric", "../../testdata/two_span_uniform.json"); code != 2 || !strings.Contains(stderr, "use SI or US") {
		t.Errorf("--units metric: exit %d, stderr %q", code, stderr)
	}
}

// A --max whose finest mesh would not fit in memory is misuse (exit 2, README
// "Exit status"): the model is sound and a smaller --max studies it. It
// exited 1, as a refused model; a missing file stays exit 1.
func TestConvergeMisuse(t *testing.T) {
	// The refusal of --max says how far --max may go, not the loader's
	// advice for a model's own mesh ("ask for fewer elements or a longer
	// maximum element length"), which a study does not read.
	for _, c := range []struct {
		args []string
		code int
		says string
		not  string
	}{
		{[]string{"--max", "100000000", "../../testdata/demo.json"}, 2, "--max 100000000: ../../testdata/demo.json: the study's finest mesh, 67108864 elements per stretch, would not fit in memory: give --max ", "maximum element length"},
		{[]string{"--max", "0", "../../testdata/demo.json"}, 2, "--max must be at least 1", ""},
		{[]string{"--target", "1.5", "../../testdata/demo.json"}, 2, "above 0 and below 1", ""},
		{[]string{"--max", "4", "../../testdata/no such file.json"}, 1, "no such file.json", ""},
	} {
		code, _, stderr := runStave(t, append([]string{"converge"}, c.args...)...)
		if code != c.code || !strings.Contains(stderr, c.says) || c.not != "" && strings.Contains(stderr, c.not) {
			t.Errorf("converge %v: exit %d, stderr %q; want exit %d saying %q, not %q", c.args, code, stderr, c.code, c.says, c.not)
		}
	}
}

func TestBenchQuickJSONKeys(t *testing.T) {
	code, out, stderr := runStave(t, "bench", "--quick", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	for _, key := range []string{"ratio", "exponent", `"post_over_solve"`, `"keypoint_exponent"`} {
		if !strings.Contains(out, key) {
			t.Errorf("bench JSON has no key containing %q", key)
		}
	}
}

// --pipeline runs the pipeline and point-load tables alone.
func TestBenchQuickPipelineOnly(t *testing.T) {
	code, out, stderr := runStave(t, "bench", "--quick", "--pipeline")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if !strings.Contains(out, "stage by stage") || !strings.Contains(out, "Point loads on the beam model") || strings.Contains(out, "Pbtrf") {
		t.Errorf("bench --pipeline printed\n%s", out)
	}
}

// variant writes testdata/simply_supported_uniform.json (L = 4 m, pinned and
// roller, w = 10 kN/m down, E = 200 GPa) changed by edit to a file in dir.
func variant(t *testing.T, dir, name string, edit func(m map[string]any)) string {
	t.Helper()
	return variantOf(t, "../../testdata/simply_supported_uniform.json", dir, name, edit)
}

// variantOf is variant of the model in file.
func variantOf(t *testing.T, file, dir, name string, edit func(m map[string]any)) string {
	t.Helper()
	data, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(data, &m); err != nil {
		t.Fatal(err)
	}
	edit(m)
	out, err := json.Marshal(m)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, name+".json")
	if err := os.WriteFile(path, out, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// stiff gives the beam I = 8e-5 m⁴, so its deflection 5wL⁴/(384EI) =
// 2.1 mm passes span/360 = 11.1 mm, and an allowable stress of 250 MPa
// against its wL²/8·c/I = 25 MPa.
func stiff(m map[string]any) {
	seg := m["member"].(map[string]any)["segments"].([]any)[0].(map[string]any)
	seg["section"].(map[string]any)["second_moment"] = 8e-5
	seg["material"].(map[string]any)["allowable_stress"] = 250e6
}

// solveJSON is the results document of one model.
type solveJSON struct {
	Solved    bool `json:"solved"`
	Failed    bool `json:"check_failed"`
	Reactions []struct {
		Transverse *struct{ Value, FE float64 }
	} `json:"reactions"`
	Extremes []struct {
		Quantity string
		Max      struct{ Value, X, FE float64 }
		Accuracy *float64
	} `json:"extremes"`
	ExactError *struct {
		Stress       float64 `json:"stress_error"`
		Displacement float64 `json:"displacement_error"`
		Energy       float64 `json:"energy_error"`
	} `json:"exact_error"`
	Warnings []struct {
		Code, Severity, Message string
		X                       *float64
	} `json:"warnings"`
}

func (d solveJSON) codes() []string {
	var out []string
	for _, w := range d.Warnings {
		out = append(out, w.Code)
	}
	return out
}

// Each kind of outcome through run(), with the warnings the JSON names
// and the exit status: 0 solved and no check failed, 3 solved but a check
// failed, 1 refused.
func TestExitStatusAndWarnings(t *testing.T) {
	dir := t.TempDir()
	const w, L = 10e3, 4.0
	// A roller that settles by an absurd amount on a determinate beam moves
	// it as a rigid body: the reactions stay those of statics, wL/2 each
	// (Gere & Goodno, Mechanics of Materials, Appendix D, from memory), and
	// nothing fails. They read 0 and 40 kN before the exact key-point solver.
	settled := variant(t, dir, "settled", func(m map[string]any) {
		stiff(m)
		m["supports"].([]any)[1].(map[string]any)["settlement"] = map[string]any{"transverse": -1e6}
		m["mesh"] = map[string]any{"elements": 0}
	})
	// One element, set coarse on purpose: M = wL²/8 = 20 kN·m at midspan is
	// the headline value, the element's wL²/12 = 13.33 kN·m beside it.
	coarse := variant(t, dir, "coarse", func(m map[string]any) {
		stiff(m)
		m["mesh"] = map[string]any{"elements": 1}
	})
	// Half the member with I = 8e-20 m⁴: equations ill-conditioned beyond
	// use, no exact solution, and finite element reactions that do not balance.
	contrast := variant(t, dir, "contrast", func(m map[string]any) {
		segs := m["member"].(map[string]any)["segments"].([]any)
		first := segs[0].(map[string]any)
		second := map[string]any{}
		for k, v := range first {
			second[k] = v
		}
		first["end"], second["start"] = 2.0, 2.0
		second["section"] = map[string]any{"area": 0.004, "second_moment": 8e-20, "fibre_distance": 0.1}
		m["member"].(map[string]any)["segments"] = append(segs, second)
		m["mesh"] = map[string]any{"elements": 0}
	})
	overstressed := variant(t, dir, "overstressed", func(m map[string]any) {
		stiff(m)
		seg := m["member"].(map[string]any)["segments"].([]any)[0].(map[string]any)
		seg["material"].(map[string]any)["allowable_stress"] = 20e6
		m["mesh"] = map[string]any{"elements": 0}
	})
	free := variant(t, dir, "free", func(m map[string]any) {
		m["supports"].([]any)[0].(map[string]any)["kind"] = "roller"
	})

	cases := []struct {
		name  string
		file  string
		code  int
		has   []string // warning codes the JSON must list
		hasnt []string
	}{
		{"absurd settlement", settled, 0, nil, []string{"equilibrium", "condition"}},
		{"coarse mesh on purpose", coarse, 0, []string{"coarse_mesh", "fe_error"}, []string{"design_fail"}},
		{"ill-conditioned", contrast, 3, []string{"equilibrium", "condition", "no_exact"}, nil},
		{"overstressed", overstressed, 3, []string{"design_fail"}, []string{"coarse_mesh"}},
		{"free motion", free, 1, []string{"mechanism"}, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			code, out, stderr := runStave(t, "solve", "--json", c.file)
			if code != c.code {
				t.Errorf("exit %d, want %d (stderr %s)", code, c.code, stderr)
			}
			var d solveJSON
			if err := json.Unmarshal([]byte(out), &d); err != nil {
				t.Fatalf("not JSON: %v\n%s", err, out)
			}
			got := strings.Join(d.codes(), " ")
			for _, want := range c.has {
				if !slices.Contains(d.codes(), want) {
					t.Errorf("warnings %q lack %q", got, want)
				}
			}
			for _, not := range c.hasnt {
				if slices.Contains(d.codes(), not) {
					t.Errorf("warnings %q name %q", got, not)
				}
			}
			if d.Solved != (c.code != 1) || d.Failed != (c.code == 3) {
				t.Errorf("solved %v, check_failed %v for exit %d", d.Solved, d.Failed, c.code)
			}
			if textCode, _, _ := runStave(t, "solve", c.file); textCode != c.code {
				t.Errorf("the text output exits %d, the JSON %d", textCode, c.code)
			}
		})
	}

	_, out, _ := runStave(t, "solve", "--json", settled)
	var d solveJSON
	if err := json.Unmarshal([]byte(out), &d); err != nil {
		t.Fatal(err)
	}
	for i, r := range d.Reactions {
		if r.Transverse == nil || math.Abs(r.Transverse.Value-w*L/2) > 1e-6*w*L || math.Abs(r.Transverse.FE-w*L/2) > 1e-6*w*L {
			t.Errorf("settled beam, support %d: reaction %+v, want wL/2 = %g N", i+1, r.Transverse, w*L/2)
		}
	}

	_, out, _ = runStave(t, "solve", "--json", coarse)
	if err := json.Unmarshal([]byte(out), &d); err != nil {
		t.Fatal(err)
	}
	for _, e := range d.Extremes {
		if e.Quantity == "bending_moment" {
			near(t, "coarse mesh: exact largest moment", e.Max.Value, w*L*L/8, 1e-12)
			near(t, "coarse mesh: its place", e.Max.X, L/2, 1e-12)
			near(t, "coarse mesh: FE largest moment beside it", e.Max.FE, w*L*L/12, 1e-12)
		}
	}
	_, text, _ := runStave(t, "solve", coarse)
	for _, want := range []string{"FE and exact differ by 100 % (shear force)", "20.00 kN·m", "13.33 kN·m", "The headline values", "set in the model"} {
		if !strings.Contains(text, want) {
			t.Errorf("coarse mesh: the text lacks %q", want)
		}
	}
}

// A bar held at both ends and heated does not move: its displacement
// error is round-off and reads 0, not 100 % (it read 128 % when divided by
// the exact displacement alone). The two segments carry the same thermal
// force E·A·α·ΔT, with A and α in inverse proportion.
func TestSolveRestrainedHeatedBar(t *testing.T) {
	path := variant(t, t.TempDir(), "heated", func(m map[string]any) {
		segs := m["member"].(map[string]any)["segments"].([]any)
		first := segs[0].(map[string]any)
		first["material"].(map[string]any)["thermal_expansion"] = 1.2e-5
		second := map[string]any{"start": 1.7, "end": 4.0,
			"section":  map[string]any{"area": 0.0033, "second_moment": 8e-6, "fibre_distance": 0.1},
			"material": map[string]any{"name": "steel", "elastic_modulus": 2e11, "thermal_expansion": 1.2e-5 * 0.004 / 0.0033}}
		first["end"] = 1.7
		m["member"].(map[string]any)["segments"] = append(segs, second)
		m["supports"] = []any{map[string]any{"x": 0, "kind": "fixed"}, map[string]any{"x": 4, "kind": "fixed"}}
		m["loads"] = []any{}
		m["temperature_change"] = 30
		m["mesh"] = map[string]any{"elements": 10}
	})
	code, out, stderr := runStave(t, "solve", "--json", path)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var d solveJSON
	if err := json.Unmarshal([]byte(out), &d); err != nil {
		t.Fatal(err)
	}
	if d.ExactError == nil || d.ExactError.Displacement > 1e-12 || d.ExactError.Energy > 1e-12 || d.ExactError.Stress > 1e-12 {
		t.Errorf("exact_error %+v, want round-off", d.ExactError)
	}
}

// Every key of the results document is snake_case, warnings and checks are
// lists even when empty, and every object that holds a dimensioned number
// states its unit beside it.
func TestSolveJSONKeys(t *testing.T) {
	for _, file := range []string{"demo.json", "cantilever_tip_load.json", "fixed_fixed_thermal.json", "two_span_uniform.json",
		"ground_beam_foundation.json", "spliced_beam_hinge.json"} {
		_, out, _ := runStave(t, "solve", "--json", "../../testdata/"+file)
		var doc map[string]any
		if err := json.Unmarshal([]byte(out), &doc); err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		for _, key := range []string{"warnings", "checks", "reactions", "foundations", "extremes", "support_actions"} {
			if _, ok := doc[key].([]any); !ok {
				t.Errorf("%s: %q is %T, not a list", file, key, doc[key])
			}
		}
		walkJSON(t, file, "", doc)
	}
}

// dimensionless are the keys whose numbers have no unit: counts, indices,
// ratios and fractions (docs/json.md).
var dimensionless = map[string]bool{
	"version": true, "support": true, "foundation": true, "elements": true, "nodes": true, "bar_order": true,
	"condition_estimate": true, "accuracy": true, "accuracy_target": true, "accuracy_reached": true,
	"relative": true, "stress_error": true, "displacement_error": true, "energy_error": true,
	"loaded_nodes": true,
}

func walkJSON(t *testing.T, file, path string, v any) {
	t.Helper()
	switch v := v.(type) {
	case map[string]any:
		hasUnit := false
		for k := range v {
			hasUnit = hasUnit || strings.HasSuffix(k, "unit")
		}
		for k, child := range v {
			if k != strings.ToLower(k) || strings.ContainsAny(k, " -") {
				t.Errorf("%s: key %q at %s is not snake_case", file, k, path)
			}
			if _, number := child.(float64); number && !dimensionless[k] && !hasUnit {
				t.Errorf("%s: %s.%s is a number with no unit beside it", file, path, k)
			}
			walkJSON(t, file, path+"."+k, child)
		}
	case []any:
		for i, child := range v {
			walkJSON(t, file, fmt.Sprintf("%s[%d]", path, i), child)
		}
	}
}

// export of a model that cannot be solved writes the drawing of the
// problem and exits 1; a table cannot be written at all; a model whose
// check fails is written and exits 3.
func TestExportExitStatus(t *testing.T) {
	dir := t.TempDir()
	free := variant(t, dir, "free", func(m map[string]any) {
		m["supports"].([]any)[0].(map[string]any)["kind"] = "roller"
	})
	png := filepath.Join(dir, "free.png")
	if code, _, stderr := runStave(t, "export", free, "--out", png); code != 1 || !strings.Contains(stderr, "shows the problem") {
		t.Errorf("unsolvable drawing: exit %d, stderr %s", code, stderr)
	}
	if st, err := os.Stat(png); err != nil || st.Size() == 0 {
		t.Errorf("the drawing of an unsolvable model was not written: %v", err)
	}
	csv := filepath.Join(dir, "free.csv")
	if code, _, _ := runStave(t, "export", free, "--out", csv); code != 1 {
		t.Errorf("unsolvable table: exit %d, want 1", code)
	}
	if _, err := os.Stat(csv); err == nil {
		t.Error("a table was written for a model with no results")
	}
	sheet := filepath.Join(dir, "cantilever.png")
	if code, _, _ := runStave(t, "export", "../../testdata/cantilever_tip_load.json", "--sheet", "--out", sheet); code != 3 {
		t.Errorf("sheet of a model failing its deflection check: exit %d, want 3", code)
	}
	if _, err := os.Stat(sheet); err != nil {
		t.Errorf("the sheet was not written: %v", err)
	}
	if code, _, _ := runStave(t, "export", "../../testdata/demo.json", "--out", filepath.Join(dir, "demo.svg")); code != 0 {
		t.Errorf("demo drawing: exit %d, want 0", code)
	}
}

// Each command's --help lists its flags on standard output and exits 0
// (check and bench said "flag: help requested" with the general usage and
// exit 2).
func TestCommandHelp(t *testing.T) {
	for _, c := range []struct {
		command string
		flags   []string
	}{
		{"solve", []string{"-json", "-units"}},
		{"export", []string{"-out", "-sheet", "-points", "-units"}},
		{"converge", []string{"-json", "-max", "-target", "-units"}},
		{"influence", []string{"-quantity", "-at", "-envelope", "-units"}},
		{"check", []string{"usage: stave check [flags] FILE... | DIR", "-json", "-csv", "-workers", "-units"}},
		{"bench", []string{"usage: stave bench [flags]\n", "-json", "-quick"}},
	} {
		code, out, stderr := runStave(t, c.command, "--help")
		if code != 0 || stderr != "" {
			t.Errorf("%s --help: exit %d, stderr %q", c.command, code, stderr)
		}
		for _, f := range c.flags {
			if !strings.Contains(out, f) {
				t.Errorf("%s --help does not list %s:\n%s", c.command, f, out)
			}
		}
	}
	_, out, _ := runStave(t, "help")
	if !strings.Contains(out, "--target") || !strings.Contains(out, "exit status") {
		t.Errorf("the usage text lacks --target or the exit status:\n%s", out)
	}
}

// The usage `stave --help` prints names every flag of every command, as
// `stave COMMAND --help` lists them, so that the summary and the README,
// which shows the same flags, agree with the commands.
func TestUsageNamesEveryFlag(t *testing.T) {
	flagLine := regexp.MustCompile(`^  -([a-z]+)`)
	for _, cmd := range []string{"solve", "export", "converge", "influence", "check", "bench"} {
		status, help, _ := runStave(t, cmd, "--help")
		if status != 0 {
			t.Fatalf("%s --help exits %d", cmd, status)
		}
		var summary strings.Builder // the usage's lines of cmd, with their continuations
		in := false
		for _, line := range strings.Split(usage, "\n") {
			switch {
			case strings.HasPrefix(line, "  stave "+cmd+" "):
				in = true
			case !strings.HasPrefix(line, "               "):
				in = false
			}
			if in {
				summary.WriteString(line + "\n")
			}
		}
		if summary.Len() == 0 {
			t.Errorf("the usage has no line for %s", cmd)
			continue
		}
		for _, line := range strings.Split(help, "\n") {
			if m := flagLine.FindStringSubmatch(line); m != nil && !strings.Contains(summary.String(), "--"+m[1]) {
				t.Errorf("the usage of %s does not name --%s:\n%s", cmd, m[1], summary.String())
			}
		}
	}
}

// The study doubles the mesh from 1 element per stretch, so --max 100 ends
// at 64 (the largest power of two not above it): the help said only
// "finest mesh", and a study asked for 100 ended at 64 unexplained.
func TestConvergeMaxIsRoundedDownToAPowerOfTwo(t *testing.T) {
	code, out, stderr := runStave(t, "converge", "--json", "--max", "100", "../../testdata/two_span_uniform.json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var got struct {
		Rows []struct {
			PerStretch int `json:"elements_per_stretch"`
		} `json:"rows"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	if n := len(got.Rows); n != 7 || got.Rows[n-1].PerStretch != 64 {
		t.Fatalf("rows %+v, want 1, 2, ..., 64 per stretch", got.Rows)
	}
	_, help, _ := runStave(t, "converge", "--help")
	if !strings.Contains(help, "1, 2, 4, ... elements in every stretch between key points, up to the largest power of two not above this") {
		t.Errorf("converge --help does not say how the finest mesh follows from --max:\n%s", help)
	}
}

// A safety factor or a deflection limit n so small that the limit it gives
// (the allowable stress over the factor, the span over n) is beyond
// floating point still gives a results document: the limit is null, as
// for a check of no limit. The stiff beam's stress, 25 MPa, and
// deflection, 2.1 mm (stiff), lie within any finite limit: the deflection
// passes, the stress warns, as under any safety factor below 1.
func TestSolveJSONLimitsBeyondFloatingPoint(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct{ key, check, status string }{{"safety_factor", "Stress", "warn"}, {"deflection_limit", "Deflection", "pass"}} {
		path := variant(t, dir, c.key, func(m map[string]any) {
			stiff(m)
			m["view"].(map[string]any)[c.key] = 5e-324
		})
		code, stdout, stderr := runStave(t, "solve", "--json", path)
		if code != 0 || stderr != "" {
			t.Errorf("%s 5e-324: exit %d, stderr %q; want 0 and nothing", c.key, code, stderr)
			continue
		}
		checkSolveJSON(t, []byte(stdout))
		var doc struct {
			Checks []struct {
				Name, Status string
				Limit        *float64
			}
		}
		if err := json.Unmarshal([]byte(stdout), &doc); err != nil {
			t.Fatal(err)
		}
		found := false
		for _, r := range doc.Checks {
			if strings.HasPrefix(r.Name, c.check) {
				found = true
				if r.Limit != nil || r.Status != c.status {
					limit, _ := json.Marshal(r.Limit)
					t.Errorf("%s 5e-324: %s %s against %s, want %s against null", c.key, r.Name, r.Status, limit, c.status)
				}
			}
		}
		if !found {
			t.Errorf("%s 5e-324: no %s check in %v", c.key, c.check, doc.Checks)
		}
	}
}

// A combination that takes a train with a factor beyond sense (1e308
// times the end carriage's 42 kN axles) is refused as a case's factor so
// large is: it was taken, its envelope overflowing, with a
// train_not_placed warning and exit 0 (and a factor of 1e300 printed
// deflections of 1e300 mm); the refusal names the combination, the train
// and the limit.
func TestSolveTrainFactorBeyondFloatingPoint(t *testing.T) {
	path := variantOf(t, "../../testdata/moving/runway.json", t.TempDir(), "huge", func(m map[string]any) {
		m["cases"] = []any{map[string]any{"name": "dead", "loads": []any{map[string]any{
			"kind": "distributed", "direction": "transverse", "points": []any{[]any{0, -1000}, []any{12, -1000}}}}}}
		m["combinations"] = []any{map[string]any{"name": "crane", "kind": "strength", "factors": []any{
			map[string]any{"case": "dead", "factor": 1}, map[string]any{"train": "end carriage", "factor": 1e308}}}}
	})
	const says = `combination "crane", the factor on moving load train 1 is 1e+308, larger in size than the 1e+150 Stave takes`
	for _, args := range [][]string{{"solve", "--json", path}, {"solve", path}} {
		code, stdout, stderr := runStave(t, args...)
		if code != 1 || !strings.Contains(stderr, says) || strings.Contains(stdout, "infinite") {
			t.Errorf("%v: exit %d, stdout %q, stderr %q; want 1 and %q", args, code, stdout, stderr, says)
		}
	}
}
