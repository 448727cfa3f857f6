package main

import (
	"bytes"
	"encoding/json"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
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
	if code != 0 {
		t.Fatalf("exit %d, stderr %s", code, stderr)
	}
	var got struct {
		Reactions []struct {
			Transverse, Moment float64
		} `json:"reactions"`
		Extremes []struct {
			Quantity string
			Min      float64
			XMin     float64 `json:"x_min"`
		} `json:"extremes"`
		Equilibrium struct{ Relative float64 }    `json:"equilibrium"`
		ExactError  *struct{ RelativeL2 float64 } `json:"exact_error"`
		Mesh        struct{ Elements int }        `json:"mesh"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatalf("output is not JSON: %v\n%s", err, out)
	}
	// Cantilever, L = 4 m, tip force P = 10 kN down, E = 200 GPa, I = 8e-6 m⁴:
	// root reaction P up and moment P·L, tip deflection P·L³/(3·E·I) = 0.1333 m down.
	// Source: Gere & Goodno, Mechanics of Materials, Appendix D (cantilever beams), from memory.
	const P, L, E, I = 10e3, 4.0, 200e9, 8e-6
	if len(got.Reactions) != 1 {
		t.Fatalf("want 1 reaction, got %d", len(got.Reactions))
	}
	near(t, "root reaction", got.Reactions[0].Transverse, P, 1e-9)
	near(t, "root moment", got.Reactions[0].Moment, P*L, 1e-9)
	found := false
	for _, e := range got.Extremes {
		if e.Quantity == "Deflection" {
			found = true
			near(t, "tip deflection", e.Min, -P*L*L*L/(3*E*I), 1e-9)
			near(t, "position of tip deflection", e.XMin, L, 1e-12)
		}
	}
	if !found {
		t.Error("no deflection extreme in the output")
	}
	if got.Equilibrium.Relative > 1e-12 {
		t.Errorf("equilibrium residual %g is not round-off", got.Equilibrium.Relative)
	}
	if got.ExactError == nil {
		t.Error("exact_error missing")
	}
	if got.Mesh.Elements != 4 {
		t.Errorf("mesh elements = %d, the file asks for 4", got.Mesh.Elements)
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
	for _, want := range []string{"Reactions", "Extremes", "Equilibrium", "exact solution", "Caution", "kN·m"} {
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

// --points sets the rows per element of the table and --units its unit
// system, which the preamble states; the file is written whole or not at
// all.
func TestExportCSVPointsAndUnits(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "fields.csv")
	elements := 0
	for _, c := range []struct {
		args  []string
		units string
		rows  int // per element
	}{
		{nil, "SI", 5},
		{[]string{"--points", "1", "--units", "US"}, "US", 2},
		{[]string{"--points", "7", "--units", "SI"}, "SI", 8},
	} {
		args := append([]string{"export", "../../testdata/cantilever_tip_load.json", "--out", out}, c.args...)
		if code, _, stderr := runStave(t, args...); code != 0 {
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

func TestConvergeJSON(t *testing.T) {
	code, out, stderr := runStave(t, "converge", "--json", "--max", "8", "../../testdata/simply_supported_uniform.json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var got struct {
		Rows []struct {
			Elements int     `json:"elements"`
			L2       float64 `json:"l2_error_relative"`
		} `json:"rows"`
		Rates struct{ L2, Energy *float64 } `json:"fitted_rates"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	if len(got.Rows) != 4 {
		t.Fatalf("want rows for 1, 2, 4, 8 elements per stretch, got %d", len(got.Rows))
	}
	// Hermite beams: displacement L2 error O(h⁴), energy O(h²)
	// (Strang & Fix, An Analysis of the Finite Element Method, ch. 1; from memory).
	if got.Rates.L2 == nil || math.Abs(*got.Rates.L2-4) > 0.2 {
		t.Errorf("fitted L2 rate %v, want about 4", got.Rates.L2)
	}
	if got.Rates.Energy == nil || math.Abs(*got.Rates.Energy-2) > 0.2 {
		t.Errorf("fitted energy rate %v, want about 2", got.Rates.Energy)
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
