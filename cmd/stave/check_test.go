package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"stave/fem"
	"stave/storage"
)

// checkLine is what the tests read of a line of check --json.
type checkLine struct {
	File     string `json:"file"`
	Member   string `json:"member"`
	Status   string `json:"status"`
	Problem  string `json:"problem"`
	Warnings []struct {
		Severity string `json:"severity"`
		Check    string `json:"check"`
	} `json:"warnings"`
	Deflection *struct {
		Deflection float64 `json:"deflection_m"`
		Span       float64 `json:"span_m"`
	} `json:"deflection"`
}

// checkJSON runs check --json with args and returns the exit status and lines.
func checkJSON(t *testing.T, args ...string) (int, []checkLine) {
	t.Helper()
	code, out, stderr := runStave(t, append([]string{"check", "--json"}, args...)...)
	var doc struct {
		Members []checkLine `json:"members"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("check --json %v: not JSON (%v), stderr %s:\n%s", args, err, stderr, out)
	}
	return code, doc.Members
}

// mechanism writes a model that can slide along its axis and returns its path.
func mechanism(t *testing.T) string {
	t.Helper()
	p, err := storage.Load("../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Model.Supports = []fem.Support{{X: 0, Kind: fem.Roller}, {X: 4, Kind: fem.Roller}}
	data, err := storage.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "mechanism.json")
	if err := os.WriteFile(path, data, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// edited writes the model of file changed by edit, as JSON, and returns its path.
func edited(t *testing.T, file, name string, edit func(doc map[string]any)) string {
	t.Helper()
	data, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	var doc map[string]any
	if err := json.Unmarshal(data, &doc); err != nil {
		t.Fatal(err)
	}
	edit(doc)
	if data, err = json.Marshal(doc); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(path, data, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// illConditioned is a simply supported beam whose right half is 10¹² times
// stiffer than its left: the solver's equations are ill-conditioned, so
// solve marks the results unreliable, though no check fails (the
// deflection limit is span/100).
func illConditioned(t *testing.T) string {
	return edited(t, "../../testdata/simply_supported_uniform.json", "ill_conditioned.json", func(doc map[string]any) {
		seg := func(start, end, e float64) map[string]any {
			return map[string]any{"start": start, "end": end,
				"section":  map[string]any{"area": 0.004, "second_moment": 8e-6, "fibre_distance": 0.1},
				"material": map[string]any{"elastic_modulus": e}}
		}
		doc["member"] = map[string]any{"segments": []any{seg(0, 2, 2e11), seg(2, 4, 2e23)}}
		delete(doc, "mesh")
		doc["view"].(map[string]any)["deflection_limit"] = 100
	})
}

// longTrain is the demo model with a train of two axles 8 m apart, which
// does not fit on its 5.5 m: solve leaves the train out with a caution.
func longTrain(t *testing.T) string {
	return edited(t, "../../testdata/demo.json", "long_train.json", func(doc map[string]any) {
		doc["trains"] = []any{map[string]any{"name": "long cart",
			"axles": []any{map[string]any{"load": 1000}, map[string]any{"load": 1000, "spacing": 8}}}}
	})
}

// Member by member, check says what solve says of the same file: refused
// exactly when solve refuses it, with solve's reason; failed exactly when
// solve exits 3 (a failed check, or results marked unreliable), with the
// same failed and cautioned warnings; otherwise the largest deflection of
// a member spanning end to end is solve's largest deflection.
func TestCheckAgreesWithSolve(t *testing.T) {
	notJSON := filepath.Join(t.TempDir(), "not_json.json")
	if err := os.WriteFile(notJSON, []byte("{"), 0o644); err != nil {
		t.Fatal(err)
	}
	files, err := filepath.Glob("../../testdata/*.json")
	if err != nil || len(files) < 8 {
		t.Fatalf("testdata: %d files, %v", len(files), err)
	}
	files = append(files, notJSON, mechanism(t), "missing.json", illConditioned(t), longTrain(t))
	_, lines := checkJSON(t, files...)
	if len(lines) != len(files) {
		t.Fatalf("%d lines for %d files", len(lines), len(files))
	}
	// Models whose largest deflection from the line through the supports is
	// the largest deflection itself: supports that do not settle, at the
	// ends of the span or at the root of a cantilever.
	deflects := map[string]bool{"cantilever_tip_load.json": true, "simply_supported_uniform.json": true, "two_span_uniform.json": true}
	for i, file := range files {
		code, out, stderr := runStave(t, "solve", "--json", file)
		m := lines[i]
		if m.File != file {
			t.Fatalf("line %d is %s, want %s", i, m.File, file)
		}
		if refused := m.Status == "refused"; refused != (code == 1) {
			t.Errorf("%s: check says %s, solve exits %d", file, m.Status, code)
			continue
		}
		if code == 1 {
			// solve's message is "stave: " and the reason, perhaps behind the file's name.
			if !strings.Contains(stderr, m.Problem[strings.LastIndex(m.Problem, ": ")+2:]) {
				t.Errorf("%s: check says %q, solve says %q", file, m.Problem, stderr)
			}
			continue
		}
		if failed := m.Status == "fail"; failed != (code == 3) {
			t.Errorf("%s: check says %s, solve exits %d", file, m.Status, code)
		}
		var solved struct {
			Warnings []struct{ Severity, Name string }
		}
		if err := json.Unmarshal([]byte(out), &solved); err != nil {
			t.Fatal(err)
		}
		var want, got []string
		for _, w := range solved.Warnings {
			if w.Severity == "fail" || w.Severity == "caution" {
				want = append(want, w.Name)
			}
		}
		for _, w := range m.Warnings {
			got = append(got, w.Check)
		}
		slices.Sort(want)
		slices.Sort(got)
		if !slices.Equal(got, want) {
			t.Errorf("%s: check warns of %q, solve of %q", file, got, want)
		}
		if !deflects[filepath.Base(file)] {
			continue
		}
		var sum struct {
			Extremes []struct {
				Quantity string
				Max, Min struct{ Value float64 }
			}
		}
		if err := json.Unmarshal([]byte(out), &sum); err != nil {
			t.Fatal(err)
		}
		for _, e := range sum.Extremes {
			if e.Quantity != "deflection" {
				continue
			}
			// solve's headline deflection is the exact one; the check takes
			// the larger of the finite element and exact ones, which agree
			// to the mesh's accuracy (0.5 % and better on these meshes).
			want := math.Max(math.Abs(e.Min.Value), math.Abs(e.Max.Value))
			if m.Deflection == nil || math.Abs(m.Deflection.Deflection-want) > 5e-3*want {
				t.Errorf("%s: check's deflection %+v, solve's largest %g", file, m.Deflection, want)
			}
		}
	}
}

func TestCheckExitStatus(t *testing.T) {
	empty := t.TempDir()
	demo := "../../testdata/demo.json"
	for _, c := range []struct {
		name string
		args []string
		code int
	}{
		{"every member solved, none failed", []string{demo, "../../testdata/stepped_bar.json"}, 0},
		{"a member failed a check", []string{demo, "../../testdata/simply_supported_uniform.json"}, 3},
		{"a member refused is worse than a failed check", []string{"../../testdata/simply_supported_uniform.json", mechanism(t), demo}, 1},
		{"a folder", []string{"../../testdata"}, 3},
		{"flags after the files", []string{demo, "--csv"}, 0},
		{"no file", nil, 2},
		{"a folder holding no model", []string{empty}, 2},
		{"JSON and CSV at once", []string{"--json", "--csv", demo}, 2},
		{"a negative number of workers", []string{"--workers", "-1", demo}, 2},
		// Each worker holds a whole analysis: 10,000 workers on 30 large
		// members held 2.5 GB where one per core held 0.5 GB.
		{"more workers than maxWorkersPerCore a core", []string{"--workers", strconv.Itoa(maxWorkersPerCore*runtime.GOMAXPROCS(0) + 1), demo}, 2},
		{"maxWorkersPerCore workers a core", []string{"--workers", strconv.Itoa(maxWorkersPerCore * runtime.GOMAXPROCS(0)), demo}, 0},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, out, stderr := runStave(t, append([]string{"check"}, c.args...)...)
			if code != c.code {
				t.Fatalf("exit %d, want %d; stderr %s", code, c.code, stderr)
			}
			switch {
			case code == 0 && stderr != "":
				t.Errorf("a batch that passed printed on standard error: %s", stderr)
			case code == 1 || code == 3:
				if !strings.Contains(stderr, "their lines say") || !strings.Contains(out, "Caution:") {
					t.Errorf("stderr %q, output:\n%s", stderr, out)
				}
			case code == 2 && !strings.Contains(stderr, "usage:"):
				t.Errorf("misuse without the usage: %s", stderr)
			}
		})
	}
}

// The whole output is the same at 1 and at 4 workers.
func TestCheckSameAtAnyWorkerCount(t *testing.T) {
	args := []string{"../../testdata", mechanism(t), "missing.json", "../../testdata/demo.json"}
	for _, format := range []string{"--json", "--csv", "--text"} {
		var outs []string
		for _, workers := range []string{"1", "4"} {
			a := append([]string{"check", "--workers", workers}, args...)
			if format != "--text" {
				a = append(a, format)
			}
			code, out, stderr := runStave(t, a...)
			if code != 1 {
				t.Fatalf("check %v: exit %d, want 1 (a refused member); stderr %s", a, code, stderr)
			}
			outs = append(outs, out)
		}
		if outs[0] != outs[1] {
			t.Errorf("%s: 1 and 4 workers write different outputs:\n%s\n---\n%s", format, outs[0], outs[1])
		}
	}
}

// A whole process that checks a batch which passes prints nothing on
// standard error, a pipe here: no bar.
func TestCheckProcessKeepsStandardErrorEmpty(t *testing.T) {
	cmd := exec.Command(os.Args[0], "check", "../../testdata/demo.json", "../../testdata/stepped_bar.json")
	cmd.Env = append(os.Environ(), runAsBinary+"=1")
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	if err := cmd.Run(); err != nil || stderr.Len() != 0 || !strings.Contains(stdout.String(), "2 members: 2 ok") {
		t.Errorf("error %v, stderr %q, stdout:\n%s", err, stderr.String(), stdout.String())
	}
}

// The bar shows only once the batch has run a second, at most ten times a
// second, and is erased at the end.
func TestProgressBar(t *testing.T) {
	var out bytes.Buffer
	clock := time.Unix(0, 0)
	p := newProgress(&out, 200, func() time.Time { return clock })
	for done := 1; done <= 200; done++ {
		clock = clock.Add(10 * time.Millisecond)
		p.show(done)
	}
	p.clear()
	// From 1 s to 2 s: one drawing when the second is reached, then every 100 ms.
	draws := strings.Count(out.String(), "\r[")
	if draws != 11 || !strings.HasPrefix(out.String(), "\r[###############...............] 100/200 members, 1 s") {
		t.Errorf("%d drawings, starting %q", draws, out.String()[:min(60, out.Len())])
	}
	if !strings.HasSuffix(out.String(), "200/200 members, 2 s\r\033[K") {
		t.Errorf("the bar does not end full and erased: %q", out.String()[max(0, out.Len()-60):])
	}
	out.Reset()
	quick := newProgress(&out, 10, func() time.Time { return clock })
	quick.show(10)
	quick.clear()
	if out.Len() != 0 {
		t.Errorf("a batch shorter than a second drew %q", out.String())
	}
}

// --units names the places of the checks in the text as solve --units
// does; the JSON's lengths stay in metres. 4 m is 13.12 ft (1 ft = 0.3048 m
// exactly, NIST SP 811, appendix B); the deflection 5qL⁴/(384EI) =
// 20.83 mm of the simply supported beam (Gere & Goodno, beam deflection
// tables, from memory) does not depend on the units shown.
func TestCheckUnits(t *testing.T) {
	ss := "../../testdata/simply_supported_uniform.json"
	us := edited(t, ss, "shown_in_us.json", func(doc map[string]any) { doc["view"].(map[string]any)["units"] = "US" })
	for _, c := range []struct {
		name  string
		args  []string
		place string
	}{
		{"the file's units by default", []string{ss}, "Deflection, span 0 m to 4.000 m"},
		{"the file's US units by default", []string{us}, "Deflection, span 0 ft to 13.12 ft"},
		{"US asked for", []string{"--units", "US", ss}, "Deflection, span 0 ft to 13.12 ft"},
		{"SI asked for a file shown in US", []string{us, "--units", "SI"}, "Deflection, span 0 m to 4.000 m"},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, out, stderr := runStave(t, append([]string{"check"}, c.args...)...)
			if code != 3 || !strings.Contains(out, c.place) {
				t.Errorf("exit %d (want 3, the deflection fails), no %q in:\n%s%s", code, c.place, out, stderr)
			}
			_, lines := checkJSON(t, c.args...)
			const q, L, E, I = 10e3, 4.0, 200e9, 8e-6
			want := 5 * q * L * L * L * L / (384 * E * I)
			if d := lines[0].Deflection; d == nil || math.Abs(d.Deflection-want) > 1e-9*want || d.Span != L {
				t.Errorf("JSON deflection %+v, want %g m over %g m", d, want, L)
			}
		})
	}
	if code, _, stderr := runStave(t, "check", "--units", "imperial", ss); code != 2 || !strings.Contains(stderr, "unknown unit system") {
		t.Errorf("--units imperial: exit %d, stderr %q; want 2, naming the unknown system", code, stderr)
	}
}

// After "--" every argument is a file, also one that begins with "-" and
// comes after another file (the flag package's convention: "--" ends the
// flags); before it, flags may still follow the files.
func TestFilesAfterDoubleDash(t *testing.T) {
	dir := t.TempDir()
	demo, err := os.ReadFile("../../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range []string{"-a.json", "-b.json"} {
		if err := os.WriteFile(filepath.Join(dir, name), demo, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	t.Chdir(dir)
	for _, c := range []struct {
		name    string
		args    []string
		code    int
		members int // rows of the batch's CSV; 0 for solve
	}{
		{"check: two files after --", []string{"check", "--csv", "--", "-a.json", "-b.json"}, 0, 2},
		// After -- even --json names a file, which does not exist: refused.
		{"check: after --, --json is a file", []string{"check", "--csv", "--", "-a.json", "--json"}, 1, 2},
		{"solve: one file after --", []string{"solve", "--", "-a.json"}, 0, 0},
		{"solve: two files after -- are one too many", []string{"solve", "--", "-a.json", "-b.json"}, 2, 0},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, out, stderr := runStave(t, c.args...)
			if code != c.code {
				t.Fatalf("exit %d, want %d; stderr %s", code, c.code, stderr)
			}
			if c.members > 0 {
				// The caution's comment line and the header come first.
				if got := strings.Count(out, "\n") - 2; got != c.members {
					t.Errorf("%d members, want %d:\n%s", got, c.members, out)
				}
			}
			if c.code == 2 && strings.Contains(stderr, "flag provided but not defined") {
				t.Errorf("a file after -- read as a flag: %s", stderr)
			}
		})
	}
}
