package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// --elements solves on that many elements instead of the file's mesh:
// the results table has a row group per element; --multiples writes the
// small multiples as PNG or PDF and nothing else.
func TestExportElementsAndMultiples(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "fields.csv")
	// The cantilever fails its deflection check: exit 3, the table written.
	if code, _, stderr := runStave(t, "export", "../../testdata/cantilever_tip_load.json", "--out", out, "--elements", "3", "--points", "1"); code != 3 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	data, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	rows := 0
	for _, line := range strings.Split(strings.TrimSpace(string(data)), "\n") {
		if !strings.HasPrefix(line, "#") && !strings.HasPrefix(line, "x [") {
			rows++
		}
	}
	// One stretch from the wall to the tip load, 3 elements, 2 rows each.
	if rows != 3*2 {
		t.Errorf("--elements 3 gave %d rows, want 6 (3 elements, both ends of each)", rows)
	}
	png := filepath.Join(dir, "multiples.png")
	if code, _, stderr := runStave(t, "export", "../../testdata/cantilever_tip_load.json", "--out", png, "--multiples"); code != 3 {
		t.Fatalf("--multiples: exit %d: %s", code, stderr)
	}
	if data, err := os.ReadFile(png); err != nil || !bytes.HasPrefix(data, []byte("\x89PNG")) {
		t.Errorf("--multiples wrote no PNG (%v)", err)
	}
	for _, args := range [][]string{
		{"--out", "x.png", "--elements", "0"},
		{"--out", "x.svg", "--multiples"},
		{"--out", "x.pdf", "--multiples", "--sheet"},
	} {
		if code, _, _ := runStave(t, append([]string{"export", "../../testdata/demo.json"}, args...)...); code != 2 {
			t.Errorf("%v: exit %d, want 2", args, code)
		}
	}
}

// --elements asking for more elements than fit in memory is misuse of the
// flag (exit 2, as converge --max and export --points too large are,
// README "Exit status"), told before anything is written: the file's own
// model is fine. It was exit 1, a model refused, with a PNG of "the
// problem" written and a CSV's message "cannot save ...: writing failed".
func TestExportElementsTooManyIsMisuse(t *testing.T) {
	dir := t.TempDir()
	for _, out := range []string{"fields.csv", "beam.png"} {
		path := filepath.Join(dir, out)
		code, _, stderr := runStave(t, "export", "../../testdata/demo.json", "--out", path, "--elements", "100000000")
		if code != 2 {
			t.Errorf("%s: exit %d, want 2: %s", out, code, stderr)
		}
		if !strings.Contains(stderr, "--elements 100000000") || !strings.Contains(stderr, "memory") || strings.Contains(stderr, "writing failed") {
			t.Errorf("%s: the message does not name the flag and why: %s", out, stderr)
		}
		if _, err := os.Stat(path); err == nil {
			t.Errorf("%s written for a mesh that cannot be solved", out)
		}
	}
}
