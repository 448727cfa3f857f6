package main

import (
	"bytes"
	"context"
	"errors"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"stave/canvas/report"
	"stave/storage"
)

// The table `stave export` streams to its file holds the very bytes the
// report writes in one piece into memory.
func TestExportCSVStreamsTheSameBytes(t *testing.T) {
	for _, model := range []string{"three_span_pattern.json", "stepped_bar.json", "two_span_cases.json"} {
		t.Run(model, func(t *testing.T) {
			path := filepath.Join("../../testdata", model)
			out := filepath.Join(t.TempDir(), "table.csv")
			if code, _, stderr := runStave(t, "export", path, "--out", out); code != 0 && code != 3 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			got, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			p, err := storage.Load(path)
			if err != nil {
				t.Fatal(err)
			}
			show, err := showFlag(&p.Model, "")
			if err != nil {
				t.Fatal(err)
			}
			var want bytes.Buffer
			if _, err := report.Export(context.Background(), &want, p, "csv", report.Options{Show: show}); err != nil {
				t.Fatal(err)
			}
			if want.Len() == 0 || !bytes.Equal(got, want.Bytes()) {
				t.Errorf("the file holds %d bytes, the report in memory %d; they differ from byte %d", len(got), want.Len(), firstDifferentByte(got, want.Bytes()))
			}
		})
	}
}

func firstDifferentByte(a, b []byte) int {
	for i := range min(len(a), len(b)) {
		if a[i] != b[i] {
			return i
		}
	}
	return min(len(a), len(b))
}

// An export that fails half way leaves no file, and an older file of the
// same name as it was; one that succeeds counts what it wrote.
func TestExportFailingHalfWayLeavesNoFile(t *testing.T) {
	diskFull := errors.New("no space left on device")
	halfThenFail := func(w io.Writer) error {
		if _, err := io.WriteString(w, strings.Repeat("x [m],V [kN]\n", 200_000)); err != nil {
			return err
		}
		return diskFull
	}
	complete := func(w io.Writer) error { _, err := io.WriteString(w, "x [m]\n0\n"); return err }
	tests := []struct {
		name  string
		old   []byte // nil: no file before
		write func(io.Writer) error
		fails bool
		want  []byte // nil: no file after
	}{
		{"new file", nil, halfThenFail, true, nil},
		{"over an older table", []byte("the older table\n"), halfThenFail, true, []byte("the older table\n")},
		{"complete", []byte("the older table\n"), complete, false, []byte("x [m]\n0\n")},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			path := filepath.Join(dir, "table.csv")
			if tc.old != nil {
				if err := os.WriteFile(path, tc.old, 0o644); err != nil {
					t.Fatal(err)
				}
			}
			n, err := writeExport(path, tc.write)
			switch {
			case tc.fails && !errors.Is(err, diskFull):
				t.Errorf("got %v, want the writing error", err)
			case !tc.fails && (err != nil || n != int64(len(tc.want))):
				t.Errorf("got %d bytes, %v; want %d bytes", n, err, len(tc.want))
			}
			got, readErr := os.ReadFile(path)
			var left []string
			if tc.want == nil {
				if !errors.Is(readErr, os.ErrNotExist) {
					t.Errorf("a file of %d bytes is left (%v)", len(got), readErr)
				}
			} else {
				left = []string{"table.csv"}
				if !bytes.Equal(got, tc.want) {
					t.Errorf("the file holds %q, want %q", got, tc.want)
				}
			}
			entries, _ := os.ReadDir(dir)
			var names []string
			for _, e := range entries {
				names = append(names, e.Name())
			}
			if !slices.Equal(names, left) {
				t.Errorf("the folder holds %v, want %v", names, left)
			}
		})
	}
}
