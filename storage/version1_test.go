package storage

import (
	"os"
	"path/filepath"
	"reflect"
	"testing"
)

// A version 1 file keeps opening: it reads as the same project as its
// version 2 counterpart, and saving writes version 2.
func TestVersion1Opens(t *testing.T) {
	old, err := Load(filepath.Join("testdata", "version1", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	now, err := Load(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(old.Model, now.Model) || !reflect.DeepEqual(old.View, now.View) || old.Notes != now.Notes {
		t.Error("the version 1 demo reads differently from the version 2 one")
	}
	saved, err := Marshal(old)
	if err != nil {
		t.Fatal(err)
	}
	want, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	if string(saved) != string(want) {
		t.Error("the version 1 demo saved does not give the version 2 file")
	}
}
