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
