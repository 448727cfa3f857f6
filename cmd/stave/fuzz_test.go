package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"stave/storage"
)

// fuzzElements bounds the mesh of a fuzzed file that is solved: a file may
// ask for up to about 10⁷ elements, which solve in tens of seconds (see
// "Hostile sizes" in docs/performance.md), too slow for fuzzing.
const fuzzElements = 200_000

// FuzzSolveJSON feeds fuzzed model files to `stave solve --json FILE`, as a
// script would. Whatever the file, nothing panics and the exit status is
// 0 (solved), 1 (the model or file is wrong, said on stderr) or 3 (solved,
// but a check failed, which the document says). When solved, stdout is one
// results document whose "warnings" is a list, and stderr is empty; when
// not, stderr says what is wrong, never that the results could not be
// written, and stdout is empty or a document with "solved": false.
//
//	go test -run '^$' -fuzz '^FuzzSolveJSON$' -fuzztime 60s ./cmd/stave
func FuzzSolveJSON(f *testing.F) {
	files, err := filepath.Glob(filepath.Join("..", "..", "testdata", "*.json"))
	if err != nil || len(files) == 0 {
		f.Fatalf("no model files in testdata (err %v)", err)
	}
	for _, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		if p, err := storage.Unmarshal(data); err == nil && tooFineToFuzz(p) {
			t.Skip("the mesh is too fine to solve while fuzzing")
		}
		path := filepath.Join(t.TempDir(), "model.json")
		if err := os.WriteFile(path, data, 0o644); err != nil {
			t.Fatal(err)
		}
		var stdout, stderr bytes.Buffer
		code := run([]string{"solve", "--json", path}, &stdout, &stderr)
		switch code {
		case 0, 3:
			checkSolveJSON(t, stdout.Bytes())
			if stderr.Len() > 0 {
				t.Errorf("exit %d with a message on stderr: %s", code, stderr.String())
			}
		case 1:
			msg := stderr.String()
			if stdout.Len() > 0 {
				var doc struct{ Solved *bool }
				if err := json.Unmarshal(stdout.Bytes(), &doc); err != nil || doc.Solved == nil || *doc.Solved {
					t.Errorf("exit 1 with output on stdout that is no refusal document (%d bytes): %.200s", stdout.Len(), stdout.String())
				}
			}
			if !strings.HasPrefix(msg, "stave: ") || len(strings.TrimSpace(msg)) <= len("stave:") {
				t.Errorf("exit 1 without a message: %q", msg)
			}
			if strings.Contains(msg, "json: ") {
				t.Errorf("the results could not be written as JSON: %s", msg)
			}
		default:
			t.Fatalf("exit %d, want 0, 1 or 3; stderr: %s", code, stderr.String())
		}
	})
}

// tooFineToFuzz reports whether p asks for more than fuzzElements elements.
func tooFineToFuzz(p *storage.Project) bool {
	mesh := p.Model.Mesh
	if mesh.Elements > fuzzElements {
		return true
	}
	return mesh.MaxElementLength > 0 && !(p.Model.Length()/mesh.MaxElementLength <= fuzzElements)
}

// checkSolveJSON asserts that out is one JSON object with the parts every
// summary has, and that its warnings are a list of texts.
func checkSolveJSON(t *testing.T, out []byte) {
	t.Helper()
	var top map[string]json.RawMessage
	dec := json.NewDecoder(bytes.NewReader(out))
	if err := dec.Decode(&top); err != nil {
		t.Fatalf("stdout is not a JSON object: %v\n%.300s", err, out)
	}
	if dec.More() {
		t.Fatalf("stdout holds more than one JSON value:\n%.300s", out)
	}
	for _, key := range []string{"format", "file", "caution", "solved", "reactions", "extremes", "equilibrium", "mesh", "checks", "warnings"} {
		if _, ok := top[key]; !ok {
			t.Errorf("no %q in the output", key)
		}
	}
	var warnings []struct{ Code, Message string }
	if raw := bytes.TrimSpace(top["warnings"]); !bytes.HasPrefix(raw, []byte("[")) || json.Unmarshal(raw, &warnings) != nil {
		t.Errorf(`"warnings" is %s, want a list`, raw)
	}
	for _, w := range warnings {
		if w.Code == "" || w.Message == "" {
			t.Errorf("a warning without its code or message: %+v", w)
		}
	}
	var eq struct{ FE struct{ Relative float64 } }
	if err := json.Unmarshal(top["equilibrium"], &eq); err != nil || math.IsNaN(eq.FE.Relative) {
		t.Errorf("equilibrium %s: %v", top["equilibrium"], err)
	}
}
