package storage

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
)

// FuzzDecode feeds arbitrary bytes to the loader. It must never panic; every
// rejection must say what is wrong; every accepted project must save and load
// back to the same project, and saving it again must give the same bytes.
// The seeds in testdata/fuzz/FuzzDecode are the shared model files, a few
// damaged ones and a few hostile ones (encodings, nesting, texts, counts).
func FuzzDecode(f *testing.F) {
	f.Fuzz(func(t *testing.T, data []byte) {
		checkDecode(t, data)
	})
}

// checkDecode is FuzzDecode's check of one input; it returns the refusal's
// problems, or nil for an accepted file.
func checkDecode(t *testing.T, data []byte) []Problem {
	p, err := Unmarshal(data)
	if err != nil {
		var le *LoadError
		if p != nil || !errors.As(err, &le) || len(le.Problems) == 0 {
			t.Fatalf("rejection %v (project %v) is not a *LoadError with problems", err, p)
		}
		for _, q := range le.Problems {
			if q.Message == "" {
				t.Fatalf("a problem at %q has no message", q.Path)
			}
		}
		return le.Problems
	}
	saved, err := Marshal(p)
	if err != nil {
		t.Fatalf("an accepted project cannot be saved: %v", err)
	}
	back, err := Unmarshal(saved)
	if err != nil {
		t.Fatalf("a saved project does not load: %v\n%s", err, saved)
	}
	if !reflect.DeepEqual(back, p) {
		t.Fatalf("save and load changed the project:\nbefore %+v\nafter  %+v", p, back)
	}
	if again := mustMarshal(t, back); !bytes.Equal(again, saved) {
		t.Fatalf("saving twice gives different bytes:\n%s", lineDiff(saved, again))
	}
	return nil
}

// FuzzHostileShapes builds files of shapes that hand-picked bytes rarely
// reach: the demo file with view.magnification nested inside depth lists or
// objects (up to 100,000) and notes whose text repeats piece, as written in
// the file, up to about 3 MiB. Besides FuzzDecode's checks, a file too deep
// or too large must be refused for that reason.
func FuzzHostileShapes(f *testing.F) {
	demo, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		f.Fatal(err)
	}
	f.Add(uint32(0), false, []byte("x"), uint32(1))
	f.Add(uint32(maxDepth), true, []byte("é"), uint32(MaxNotesLength+1))
	f.Add(uint32(100_000), false, []byte("\xff"), uint32(3))
	f.Add(uint32(2), true, []byte("\u202e"), uint32(3<<20))
	f.Fuzz(func(t *testing.T, depth uint32, objects bool, piece []byte, repeat uint32) {
		depth %= 100_001
		repeat %= 3<<20/uint32(max(len(piece), 1)) + 1
		magnification := nested(int(depth), objects)
		notes := strings.Repeat(quotable(piece), int(repeat))
		data := bytes.Replace(demo, []byte(`"magnification": 0`), fmt.Appendf(nil, `"magnification": %s`, magnification), 1)
		data = bytes.Replace(data, []byte(`"text": "`), fmt.Appendf(nil, `"text": "%s`, notes), 1)

		problems := checkDecode(t, data)
		var want string
		switch {
		case len(data) > MaxFileSize:
			want = "more than the 8.0 MiB"
		case depth+2 > maxDepth: // the top object and "view" hold magnification
			want = fmt.Sprintf("nested more than %d deep", maxDepth)
		case depth > 0:
			want = "view.magnification: expected a number"
		default:
			return
		}
		for _, q := range problems {
			if strings.Contains(q.String(), want) {
				return
			}
		}
		t.Fatalf("a file of %d bytes, magnification nested %d deep, was not refused with %q: %v", len(data), depth, want, problems)
	})
}

// quotable makes piece fit between the quotes of a JSON string, leaving
// everything but quotes, backslashes and control bytes as it is (bytes that
// are not UTF-8 included).
func quotable(piece []byte) string {
	var b strings.Builder
	for _, c := range piece {
		switch {
		case c == '"' || c == '\\':
			b.WriteByte('\\')
			b.WriteByte(c)
		case c < 0x20:
			fmt.Fprintf(&b, `\u%04x`, c)
		default:
			b.WriteByte(c)
		}
	}
	return b.String()
}
