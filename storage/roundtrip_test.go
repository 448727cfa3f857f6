package storage

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"testing"
)

// testdataFiles lists the shared model files every package's tests use.
func testdataFiles(t testing.TB) []string {
	t.Helper()
	files, err := filepath.Glob(filepath.Join("..", "testdata", "*.json"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no model files in ../testdata (err %v)", err)
	}
	return files
}

// Every shared model file loads, is canonical (saving gives the same bytes)
// and loads again to an equal project.
func TestRoundTripTestdata(t *testing.T) {
	for _, path := range testdataFiles(t) {
		t.Run(filepath.Base(path), func(t *testing.T) {
			input, err := os.ReadFile(path)
			if err != nil {
				t.Fatal(err)
			}
			p, err := Unmarshal(input)
			if err != nil {
				t.Fatalf("load: %v", err)
			}
			output, err := Marshal(p)
			if err != nil {
				t.Fatalf("save: %v", err)
			}
			if !bytes.Equal(output, input) {
				t.Errorf("saving does not give the file back byte for byte:\n%s", lineDiff(input, output))
			}
			again, err := Unmarshal(output)
			if err != nil {
				t.Fatalf("load after save: %v", err)
			}
			if !reflect.DeepEqual(p, again) {
				t.Errorf("load → save → load changed the project:\nfirst  %+v\nsecond %+v", p, again)
			}
		})
	}
}

// lineDiff shows the first line where two texts differ.
func lineDiff(want, got []byte) string {
	w, g := bytes.Split(want, []byte("\n")), bytes.Split(got, []byte("\n"))
	for i := 0; i < len(w) || i < len(g); i++ {
		var a, b []byte
		if i < len(w) {
			a = w[i]
		}
		if i < len(g) {
			b = g[i]
		}
		if !bytes.Equal(a, b) {
			return fmt.Sprintf("line %d:\n  file:  %s\n  saved: %s", i+1, a, b)
		}
	}
	return "(same lines)"
}

// docs/format.md shows the demo file as its complete example; keep them the same.
func TestFormatDocShowsTheDemoFile(t *testing.T) {
	doc, err := os.ReadFile(filepath.Join("..", "docs", "format.md"))
	if err != nil {
		t.Fatal(err)
	}
	demo := []byte(readDemo(t))
	if !bytes.Contains(doc, append([]byte("```json\n"), demo...)) {
		t.Errorf("docs/format.md does not hold testdata/demo.json as its example; paste the file in again")
	}
}
