package storage

import (
	"bytes"
	"errors"
	"reflect"
	"testing"
)

// FuzzDecode feeds arbitrary bytes to the loader. It must never panic; every
// rejection must say what is wrong; every accepted project must save and load
// back to the same project, and saving it again must give the same bytes.
// The seeds in testdata/fuzz/FuzzDecode are the shared model files and a few
// damaged ones.
func FuzzDecode(f *testing.F) {
	f.Fuzz(func(t *testing.T, data []byte) {
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
			return
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
	})
}
