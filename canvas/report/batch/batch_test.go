package batch

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"sync/atomic"
	"testing"

	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/storage"
)

// models are the reference models every command is tested on.
func models(t *testing.T) []string {
	t.Helper()
	paths, err := Paths([]string{"../../../testdata"})
	if err != nil {
		t.Fatal(err)
	}
	if len(paths) < 8 {
		t.Fatalf("testdata holds %d models, want at least 8", len(paths))
	}
	return paths
}

// badFiles writes files that cannot be checked into a new folder and
// returns their paths: text that is not JSON, an empty file, a member that
// can slide along its axis, and a file that does not exist.
func badFiles(t *testing.T) []string {
	t.Helper()
	dir := t.TempDir()
	p, err := storage.Load("../../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Roller}, {X: 4, Kind: fem.Roller}}
	p.Notes.Member = "L-7"
	mechanism, err := storage.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	files := map[string][]byte{"not_json.json": []byte("this is not JSON\n"), "empty.json": nil, "mechanism.json": mechanism}
	var out []string
	for _, name := range []string{"not_json.json", "empty.json", "mechanism.json"} {
		path := filepath.Join(dir, name)
		if err := os.WriteFile(path, files[name], 0o644); err != nil {
			t.Fatal(err)
		}
		out = append(out, path)
	}
	return append(out, filepath.Join(dir, "missing.json"))
}

// runAll runs the batch and returns its lines and summary.
func runAll(t *testing.T, names []string, opts Options) ([]Member, Summary) {
	t.Helper()
	var lines []Member
	sum, err := Run(context.Background(), names, opts, func(m Member) error {
		lines = append(lines, m)
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	return lines, sum
}

// Deflections of two handbook cases, as span/n.
func TestLineMatchesHandbookDeflections(t *testing.T) {
	// Simply supported, uniform load q over L: largest deflection
	// 5qL⁴/(384EI); cantilever with a tip force P: P·L³/(3EI). Source: beam
	// deflection tables, Mechanics of Materials (Gere & Goodno), appendix
	// D, from memory. Both files: L = 4 m, E = 200 GPa, I = 8e-6 m⁴,
	// q = 10 kN/m, P = 10 kN; limits span/360 and length/180 (common practice).
	const L, E, I, q, P = 4.0, 200e9, 8e-6, 10e3, 10e3
	for _, c := range []struct {
		file      string
		w, limitN float64
	}{
		{"simply_supported_uniform.json", 5 * q * L * L * L * L / (384 * E * I), 360},
		{"cantilever_tip_load.json", P * L * L * L / (3 * E * I), 180},
	} {
		t.Run(c.file, func(t *testing.T) {
			lines, _ := runAll(t, []string{"../../../testdata/" + c.file}, Options{})
			m := lines[0]
			d := m.Deflection
			if d == nil {
				t.Fatalf("no deflection in the line: %+v", m)
			}
			near(t, "deflection", d.Deflection, c.w, 1e-9)
			near(t, "span", d.Span, L, 1e-12)
			near(t, "span ratio n", float64(d.Ratio), L/c.w, 1e-9)
			near(t, "limit ratio", d.LimitRatio, c.limitN, 1e-12)
			near(t, "utilisation", float64(d.Utilisation), c.w/(L/c.limitN), 1e-9)
			// No allowable stress is given, so the deflection governs, and fails.
			if m.Governing == nil || *m.Governing != d.Check || m.Status != Failed {
				t.Errorf("governing %+v, status %v: want the deflection check, failed", m.Governing, m.Status)
			}
		})
	}
}

func near(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Abs(want) {
		t.Errorf("%s = %.12g, want %.12g", what, got, want)
	}
}

// Every line says what the single-file analysis of its member says: the
// design check of largest value over limit governs, the deflection check of
// largest value over limit is reported, any failed check fails the member.
func TestLinesAgreeWithSingleFileAnalysis(t *testing.T) {
	names := models(t)
	dir := t.TempDir()
	names = append(names, writeSchedule(t, dir, 12)...)
	lines, _ := runAll(t, names, Options{})
	for i, name := range names {
		src := analysed(t, name)
		var governing, deflection *Check
		failed := false
		for _, r := range src.Analysis.Checks {
			failed = failed || r.Status == check.Fail
			if r.Kind != check.Design || r.Status == check.Info {
				continue
			}
			c := &Check{Name: r.Name, Utilisation: Number(r.Value / r.Limit)}
			if governing == nil || c.Utilisation > governing.Utilisation {
				governing = c
			}
			if strings.HasPrefix(r.Name, "Deflection,") && (deflection == nil || c.Utilisation > deflection.Utilisation) {
				deflection = c
			}
		}
		m := lines[i]
		if m.File != name || m.Mark != src.Project.Notes.Member {
			t.Errorf("line %d is %s (%s), want %s (%s)", i, m.File, m.Mark, name, src.Project.Notes.Member)
		}
		if !sameCheck(m.Governing, governing) {
			t.Errorf("%s: governing %+v, the analysis gives %+v", name, m.Governing, governing)
		}
		var got *Check
		if m.Deflection != nil {
			got = &m.Deflection.Check
		}
		if !sameCheck(got, deflection) {
			t.Errorf("%s: deflection %+v, the analysis gives %+v", name, got, deflection)
		}
		if (m.Status == Failed) != failed {
			t.Errorf("%s: status %v, but a check failed: %v", name, m.Status, failed)
		}
	}
}

func sameCheck(a, b *Check) bool { return (a == nil) == (b == nil) && (a == nil || *a == *b) }

// A file that cannot be loaded or solved is refused in its line, and the
// members after it are checked as usual.
func TestRunGoesPastBadFiles(t *testing.T) {
	good := models(t)
	bad := badFiles(t)
	var names []string
	for i := range max(len(good), len(bad)) {
		if i < len(bad) {
			names = append(names, bad[i])
		}
		if i < len(good) {
			names = append(names, good[i])
		}
	}
	lines, sum := runAll(t, names, Options{Workers: 2})
	if len(lines) != len(names) {
		t.Fatalf("%d lines for %d files", len(lines), len(names))
	}
	wantProblem := map[string]string{
		"not_json.json":  "not valid JSON",
		"empty.json":     "empty",
		"mechanism.json": "free motion",
		"missing.json":   "no such file",
	}
	for i, m := range lines {
		want, isBad := wantProblem[filepath.Base(names[i])]
		switch {
		case isBad && (m.Status != Refused || !strings.Contains(m.Problem, want)):
			t.Errorf("%s: status %v, problem %q: want refused, saying %q", names[i], m.Status, m.Problem, want)
		case isBad && strings.Contains(m.Problem, "\n"):
			t.Errorf("%s: the problem spans lines: %q", names[i], m.Problem)
		case !isBad && (m.Status == Refused || m.Governing == nil):
			t.Errorf("%s: status %v, governing %+v: want it checked", names[i], m.Status, m.Governing)
		}
	}
	if lines[2].Mark != "" || lines[4].Mark != "L-7" {
		t.Errorf("marks of the refused lines: %q, %q; want none for an empty file and L-7 for the mechanism", lines[2].Mark, lines[4].Mark)
	}
	if sum.Refused != len(bad) || sum.Members != len(names) || sum.Worst != Refused {
		t.Errorf("summary %+v: want %d refused of %d, worst refused", sum, len(bad), len(names))
	}
}

// The output is the same byte for byte at any number of workers, in the
// order of the files.
func TestOutputIsTheSameAtAnyWorkerCount(t *testing.T) {
	var names []string
	for range 3 {
		names = append(names, models(t)...)
		names = append(names, badFiles(t)...)
	}
	names = append(names, writeSchedule(t, t.TempDir(), 30)...)
	first := map[string][]byte{}
	for _, workers := range []int{1, 2, 4, 7} {
		for _, format := range []string{"json", "csv", "text"} {
			var out bytes.Buffer
			w, err := NewWriter(format, &out)
			if err != nil {
				t.Fatal(err)
			}
			sum, err := Run(context.Background(), names, Options{Workers: workers}, w.Member)
			if err != nil {
				t.Fatal(err)
			}
			if err := w.Close(sum); err != nil {
				t.Fatal(err)
			}
			if first[format] == nil {
				first[format] = out.Bytes()
			} else if !bytes.Equal(out.Bytes(), first[format]) {
				t.Errorf("%d workers write other %s than 1 worker", workers, format)
			}
		}
	}
}

// At most a window of lines exists at once: member i is loaded only once
// all but the window before it have been handed over, however slow the
// first member is.
func TestRunWaitsInABoundedWindow(t *testing.T) {
	const workers, n = 2, 200
	window := workers * linesPerWorker
	names := make([]string, n)
	for i := range names {
		names[i] = fmt.Sprint(i)
	}
	var started, emitted atomic.Int64
	full := make(chan struct{}) // closed when the window is full
	demo, err := storage.Demo()
	if err != nil {
		t.Fatal(err)
	}
	data, err := storage.Marshal(demo)
	if err != nil {
		t.Fatal(err)
	}
	var early atomic.Int64 // loads started before their window opened
	load := func(name string) (*storage.Project, error) {
		var i int64
		fmt.Sscan(name, &i)
		if started.Add(1) == int64(window) {
			close(full)
		}
		if i == 0 {
			<-full // the first member is slow: the others fill the window
		}
		if emitted.Load() < i+1-int64(window) {
			early.Add(1)
		}
		return storage.Unmarshal(data)
	}
	_, err = Run(context.Background(), names, Options{Workers: workers, Load: load}, func(Member) error {
		emitted.Add(1)
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if early.Load() != 0 || emitted.Load() != n {
		t.Errorf("%d of %d members started before the line %d before them was handed over (%d handed over)", early.Load(), n, window, emitted.Load())
	}
}

// A model that makes Stave fail is refused in its line; the batch goes on.
func TestRunReportsAnInternalFailureInItsLine(t *testing.T) {
	load := func(name string) (*storage.Project, error) {
		if name == "bad" {
			panic("index out of range")
		}
		return storage.Demo()
	}
	lines, sum := runAll(t, []string{"a", "bad", "c"}, Options{Load: load})
	if lines[1].Status != Refused || !strings.Contains(lines[1].Problem, "internal error") || sum.OK != 2 {
		t.Errorf("lines %+v, summary %+v: want the middle one refused as an internal error, the others ok", lines, sum)
	}
}

// A writer's error stops the batch and is returned; so is a cancellation.
func TestRunStops(t *testing.T) {
	names := make([]string, 100)
	for i := range names {
		names[i] = "../../../testdata/demo.json"
	}
	full := errors.New("disk full")
	emitted := 0
	_, err := Run(context.Background(), names, Options{}, func(Member) error {
		if emitted++; emitted == 3 {
			return full
		}
		return nil
	})
	if !errors.Is(err, full) || emitted != 3 {
		t.Errorf("error %v after %d lines: want the writer's error after 3", err, emitted)
	}
	ctx, cancel := context.WithCancel(context.Background())
	emitted = 0
	_, err = Run(ctx, names, Options{}, func(Member) error {
		if emitted++; emitted == 3 {
			cancel()
		}
		return nil
	})
	if !errors.Is(err, context.Canceled) || emitted != 3 {
		t.Errorf("error %v after %d lines: want the cancellation after 3", err, emitted)
	}
}

func TestStatusOfFindings(t *testing.T) {
	lines, _ := runAll(t, models(t), Options{})
	want := map[string]Status{
		"demo.json":                     OK,
		"hanging_rod_self_weight.json":  Caution, // the finite element error is above 1 %
		"simply_supported_uniform.json": Failed,
	}
	for _, m := range lines {
		if s, ok := want[filepath.Base(m.File)]; ok && m.Status != s {
			t.Errorf("%s: status %v, want %v", m.File, m.Status, s)
		}
	}
}

// A finding that marks the results unreliable fails the member, as it
// makes solve exit 3, whatever its severity.
func TestStatusOfUnreliableResults(t *testing.T) {
	for _, c := range []struct {
		name string
		fs   []analysis.Finding
		want Status
	}{
		{"nothing", nil, OK},
		{"a note", []analysis.Finding{{Severity: analysis.Note}}, OK},
		{"a caution", []analysis.Finding{{Severity: analysis.Caution}}, Caution},
		{"an ill-conditioned solver", []analysis.Finding{{Severity: analysis.Caution}, analysis.CodeCondition.Finding("solver", "ill-conditioned")}, Failed},
		{"a failed check", []analysis.Finding{{Severity: analysis.Fail}}, Failed},
	} {
		if got := StatusOf(c.fs); got != c.want {
			t.Errorf("%s: %v, want %v", c.name, got, c.want)
		}
	}
}

func TestPaths(t *testing.T) {
	dir := t.TempDir()
	for _, name := range []string{"b.json", "a.json", "C.JSON", ".hidden.json", "notes.txt", "sub/d.json"} {
		path := filepath.Join(dir, name)
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, nil, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	empty := t.TempDir()
	for _, c := range []struct {
		name string
		args []string
		want []string
		err  string
	}{
		{"a folder: its .json files by name, no hidden ones, no subfolders", []string{dir},
			[]string{"C.JSON", "a.json", "b.json"}, ""},
		{"files as given, missing ones too", []string{"x/missing.json", filepath.Join(dir, "notes.txt")},
			[]string{"x/missing.json", filepath.Join(dir, "notes.txt")}, ""},
		{"a folder with no model", []string{dir, empty}, nil, "holds no .json model file"},
	} {
		t.Run(c.name, func(t *testing.T) {
			got, err := Paths(c.args)
			if c.err != "" {
				if err == nil || !strings.Contains(err.Error(), c.err) {
					t.Errorf("error %v, want one saying %q", err, c.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			for i := range got {
				if len(c.args) == 1 {
					got[i] = filepath.Base(got[i])
				}
			}
			if fmt.Sprint(got) != fmt.Sprint(c.want) {
				t.Errorf("got %q, want %q", got, c.want)
			}
		})
	}
}

// Every line says how far to trust its member's finite element answer: the
// accuracy its mesh reaches (the worst field's |FE − exact| of the extremes
// over the field's largest magnitude), as `stave solve` states it, in the
// text, CSV and JSON. The simply supported beam under a uniform load q on
// its 8 elements has the FE shear force constant in each element, the exact
// shear at the element's middle (its nodal moments are exact, the Hermite
// element reproducing them under consistent loads, and M is linear between
// them; Strang & Fix, ch. 1, from memory): q·h/2 = qL/16 short of qL/2 at
// the support, 1/8 of the largest shear.
func TestLinesSayTheirAccuracy(t *testing.T) {
	const file = "../../../testdata/simply_supported_uniform.json"
	names := models(t)
	lines, _ := runAll(t, names, Options{})
	for i, name := range names {
		src := analysed(t, name)
		sum := src.Analysis.Summary()
		worst, ok := sum.Worst()
		m := lines[i]
		if !ok {
			if m.Accuracy != nil {
				t.Errorf("%s: accuracy %+v without an exact solution", name, *m.Accuracy)
			}
			continue
		}
		if m.Accuracy == nil || m.Accuracy.Ratio != worst.Accuracy || m.Accuracy.Quantity != worst.Quantity {
			t.Errorf("%s: accuracy %+v, `stave solve` states %g (%s)", name, m.Accuracy, worst.Accuracy, worst.Quantity)
		}
	}
	for _, format := range []string{"text", "csv", "json"} {
		got, lines, _ := write(t, format, []string{file})
		a := lines[0].Accuracy
		if a == nil || math.Abs(a.Ratio-0.125) > 1e-12 || a.Quantity != fem.QShearForce {
			t.Fatalf("%s: accuracy %+v, want 0.125 (shear force)", file, a)
		}
		want := map[string]string{"text": "12.5 % (shear force)", "csv": "0.125", "json": `"fe_accuracy": {`}[format]
		if !strings.Contains(got, want) {
			t.Errorf("the %s output does not say %q:\n%s", format, want, got)
		}
	}
}

// analysed is the file name loaded and analysed as stave solve has it.
func analysed(t *testing.T, name string) report.Source {
	t.Helper()
	p, err := storage.Load(name)
	if err != nil {
		t.Fatal(err)
	}
	src, err := report.Analyse(context.Background(), p)
	if err != nil {
		t.Fatal(err)
	}
	return src
}

// The limit ratio is the n the deflection check uses, not the span over
// the limit span/n worked back: on a span of 20 ft (6.096 m, 1 ft =
// 0.3048 m, NIST SP 811, Appendix B) 6.096/(6.096/360) is
// 359.99999999999994 in floating point, which the CSV and JSON printed
// for the file's deflection_limit 360.
func TestLimitRatioIsTheFilesN(t *testing.T) {
	text, err := os.ReadFile("../../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	span := strings.NewReplacer(`"end": 4,`, `"end": 6.096,`, `"x": 4,`, `"x": 6.096,`).Replace(string(text))
	if span == string(text) {
		t.Fatal("the test file no longer has its span at 4 m")
	}
	for _, n := range []float64{360, 180} {
		file := filepath.Join(t.TempDir(), "twenty_feet.json")
		model := strings.Replace(span, `"deflection_limit": 360`, fmt.Sprintf(`"deflection_limit": %g`, n), 1)
		if err := os.WriteFile(file, []byte(model), 0o644); err != nil {
			t.Fatal(err)
		}
		lines, _ := runAll(t, []string{file}, Options{})
		if d := lines[0].Deflection; d == nil || d.LimitRatio != n {
			t.Errorf("deflection_limit %g on a 6.096 m span: line %+v, want limit ratio %g exactly", n, d, n)
		}
	}
}

// strained writes simply_supported_uniform.json, changed by edit, to name
// in dir and returns its path. The file: L = 4 m, q = 10 kN/m,
// I = 8e-6 m⁴, fibre distance c = 0.1 m, so its largest stress is
// qL²/8·c/I = 250 MPa (Gere & Goodno, Mechanics of Materials, appendix D,
// from memory) and its deflection 5qL⁴/(384EI) = 20.83 mm against span/360
// = 11.11 mm, a utilisation of 1.875 (same source).
func strained(t *testing.T, dir, name string, edit func(p *storage.Project)) string {
	t.Helper()
	p, err := storage.Load("../../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Notes.Member = name
	edit(p)
	text, err := storage.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, name+".json")
	if err := os.WriteFile(path, text, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// nonFinite are members whose stress check has a utilisation that is not
// a finite number, with the check that must govern: IEEE 754 arithmetic
// (from memory) overflows 250 MPa over 1e-305 Pa (past 1.8e308) to +Inf,
// rounds 1e-30 Pa over 1e300 (below 4.9e-324) to 0, so that 250 MPa over
// it is +Inf and the 0 MPa of an unloaded overhang over it (no load beyond
// the support, no moment there: statics, from memory) 0/0, NaN.
func nonFinite(t *testing.T, dir string) []struct {
	file, check string
	want        float64
} {
	t.Helper()
	allowable := func(stress, factor float64) func(p *storage.Project) {
		return func(p *storage.Project) {
			p.Model.Segments[0].Material.Allowable, p.View.SafetyFactor = stress, factor
		}
	}
	return []struct {
		file, check string
		want        float64
	}{
		{strained(t, dir, "overflow", allowable(1e-5, 1e300)), "Stress, segment 1", math.Inf(1)},
		{strained(t, dir, "zero_limit", allowable(1e-30, 1e300)), "Stress, segment 1", math.Inf(1)},
		{strained(t, dir, "undefined", func(p *storage.Project) {
			// No allowable stress for the span (no stress check), and a
			// section four times as stiff, whose span (0.47 of span/360)
			// and overhang (0.75 of length/180: the end rotation qL³/24EI
			// over the overhang, beam diagrams, from memory) meet their
			// deflection limits, so that the undefined check is the worst.
			allowable(0, 1e300)(p)
			p.Model.Segments[0].Section.SecondMoment *= 4
			overhang := p.Model.Segments[0]
			overhang.Start, overhang.End, overhang.Material.Allowable = 4, 5, 1e-30
			p.Model.Segments = append(p.Model.Segments, overhang)
		}), "Stress, segment 2", math.NaN()},
	}
}

// sameUtilisation reports whether u is want, NaN for NaN.
func sameUtilisation(u Number, want float64) bool {
	return float64(u) == want || math.IsNaN(float64(u)) && math.IsNaN(want)
}

// A stress check whose utilisation is infinite, or undefined, governs its
// member and the batch: it was left out, and the headline named a
// deflection of 1.87 in another member.
func TestNonFiniteUtilisationGoverns(t *testing.T) {
	dir := t.TempDir()
	for _, c := range nonFinite(t, dir) {
		ok := companion(t, dir, c.want)
		t.Run(filepath.Base(c.file), func(t *testing.T) {
			for _, names := range [][]string{{c.file, ok}, {ok, c.file}} {
				lines, sum := runAll(t, names, Options{})
				m := lines[slices.Index(names, c.file)]
				if g := m.Governing; g == nil || g.Name != c.check || !sameUtilisation(g.Utilisation, c.want) {
					t.Errorf("%v: governing %+v, want %s of utilisation %g", names, g, c.check, c.want)
				}
				if h := sum.Highest; h == nil || h.File != c.file || h.Name != c.check || !sameUtilisation(h.Utilisation, c.want) {
					t.Errorf("%v: highest utilisation %+v, want %s of %s, %g", names, h, c.check, c.file, c.want)
				}
			}
		})
	}
}

// A member whose one doubt is an undefined utilisation (0 over a limit of
// 0, nonFinite's unloaded overhang) is a caution whose warnings name the
// check, as its text, JSON and sheet say it: it was "ok" with no warning
// beside "could not be worked out". On the default mesh no other finding
// asks for a look (the default mesh keeps the FE extremes within 0.5 %).
func TestUndefinedUtilisationIsACaution(t *testing.T) {
	dir := t.TempDir()
	for _, c := range nonFinite(t, dir) {
		if !math.IsNaN(c.want) {
			continue
		}
		p, err := storage.Load(c.file)
		if err != nil {
			t.Fatal(err)
		}
		p.Model.Mesh.Elements = 0
		file := strained(t, dir, "undefined_default_mesh", func(q *storage.Project) { *q = *p })
		lines, _ := runAll(t, []string{file}, Options{})
		m := lines[0]
		if m.Status != Caution || len(m.Warnings) != 1 || m.Warnings[0].Check != c.check || m.Warnings[0].Severity != "caution" {
			t.Errorf("%s: status %v, warnings %+v; want a caution naming %s alone", file, m.Status, m.Warnings, c.check)
		}
	}
}

// companion is a member that stands beside one whose utilisation is want
// and that want governs: one whose deflection fails (1.87) beside an
// infinite utilisation, one within every limit (0.833, 250 of 300 MPa,
// its deflection within span/100) beside an undefined one, which governs
// no failure.
func companion(t *testing.T, dir string, want float64) string {
	t.Helper()
	if !math.IsNaN(want) {
		return strained(t, dir, "deflects", allowable300)
	}
	return strained(t, dir, "passes", func(p *storage.Project) {
		allowable300(p)
		p.View.DeflectionLimit = 100
	})
}

// allowable300 gives the member an allowable stress of 300 MPa, above its
// 250 MPa, so that its deflection governs.
func allowable300(p *storage.Project) { p.Model.Segments[0].Material.Allowable = 300e6 }

// The check that governs: the largest utilisation, an infinite one above
// every other, an undefined one (NaN) above every one within its limit
// but below one beyond it; of equal ones the first. Stave's own order: the worst a check can be.
func TestSummaryGovernsInOrder(t *testing.T) {
	inf, nan := math.Inf(1), math.NaN()
	for _, c := range []struct {
		utilisations []float64
		want         int // the member that governs
	}{
		{[]float64{2, 3}, 1},
		{[]float64{3, 2}, 0},
		{[]float64{3, 3}, 0},
		{[]float64{1.87, inf}, 1},
		{[]float64{inf, 1e308}, 0},
		{[]float64{inf, inf}, 0},
		{[]float64{nan, 5}, 1},
		{[]float64{5, nan}, 0},
		{[]float64{nan, 0.5}, 0},
		{[]float64{0.5, nan}, 1},
		{[]float64{nan, 1}, 0},
		{[]float64{nan, inf}, 1},
		{[]float64{inf, nan}, 0},
		{[]float64{nan, nan}, 0},
	} {
		var s Summary
		for i, u := range c.utilisations {
			mark := fmt.Sprint(i)
			g := checkOf("Stress, segment 1", u)
			s.add(&Member{File: mark + ".json", Mark: mark, Status: Failed, Governing: &g,
				Deflection: &Deflection{Check: g}})
		}
		want := fmt.Sprint(c.want)
		if s.Highest == nil || s.Highest.Mark != want || s.Deflection == nil || s.Deflection.Mark != want {
			t.Errorf("%v: highest %+v, deflection %+v, want member %s", c.utilisations, s.Highest, s.Deflection, want)
		}
	}
}
