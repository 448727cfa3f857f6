package storage

import (
	"bytes"
	"errors"
	"io"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
	"time"
)

func loadDemo(t *testing.T) *Project {
	t.Helper()
	p, err := Load(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// listDir names the entries of dir, sorted.
func listDir(t *testing.T, dir string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, e := range entries {
		names = append(names, e.Name())
	}
	return names
}

func TestSaveKeepsThePreviousFileAsBackup(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	p := loadDemo(t)
	if err := Save(path, p); err != nil {
		t.Fatal(err)
	}
	first, _ := os.ReadFile(path)
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{"joist.json"}) {
		t.Errorf("after the first save the folder holds %v, want only the file", got)
	}

	p.Notes.Engineer = "second version"
	if err := Save(path, p); err != nil {
		t.Fatal(err)
	}
	backup, _ := os.ReadFile(BackupPath(path))
	if !bytes.Equal(backup, first) {
		t.Errorf("the backup is not the previous file")
	}
	again, err := Load(path)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(again, p) {
		t.Errorf("the saved file loads to a different project")
	}
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{"joist.json", "joist.json.bak"}) {
		t.Errorf("after the second save the folder holds %v, want the file and its backup", got)
	}
}

// A write that fails half way leaves the old file byte for byte and no
// temporary file behind.
func TestSaveFailingHalfWayLeavesTheOldFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	old := []byte("the previous content\n")
	if err := os.WriteFile(path, old, 0o600); err != nil {
		t.Fatal(err)
	}
	diskFull := errors.New("no space left on device")
	defer func(saved func(io.Writer, []byte) error) { writeData = saved }(writeData)
	writeData = func(w io.Writer, data []byte) error {
		if _, err := w.Write(data[:len(data)/2]); err != nil {
			return err
		}
		return diskFull
	}

	err := Save(path, loadDemo(t))
	if !errors.Is(err, diskFull) || !strings.Contains(err.Error(), "writing failed") || !strings.Contains(err.Error(), path) {
		t.Errorf("error %q does not say that writing %s failed", err, path)
	}
	if got, _ := os.ReadFile(path); !bytes.Equal(got, old) {
		t.Errorf("the old file changed to %q", got)
	}
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{"joist.json"}) {
		t.Errorf("the folder holds %v after the failed save, want only the old file", got)
	}
}

func TestSaveKeepsPermissions(t *testing.T) {
	path := filepath.Join(t.TempDir(), "joist.json")
	if err := os.WriteFile(path, []byte("{}"), 0o640); err != nil {
		t.Fatal(err)
	}
	if err := Save(path, loadDemo(t)); err != nil {
		t.Fatal(err)
	}
	if info, _ := os.Stat(path); info.Mode().Perm() != 0o640 {
		t.Errorf("permissions %v after saving, want -rw-r-----", info.Mode().Perm())
	}
}

func TestSaveIntoMissingFolderSaysWhy(t *testing.T) {
	path := filepath.Join(t.TempDir(), "no such folder", "joist.json")
	err := Save(path, loadDemo(t))
	if err == nil || !strings.Contains(err.Error(), "cannot create a temporary file") {
		t.Errorf("error %v does not say the temporary file could not be made", err)
	}
}

func TestLoadNamesTheFile(t *testing.T) {
	path := filepath.Join(t.TempDir(), "broken.json")
	if err := os.WriteFile(path, []byte(`{"format": "stave-member", "version": 1}`), 0o600); err != nil {
		t.Fatal(err)
	}
	p, err := Load(path)
	var le *LoadError
	if p != nil || !errors.As(err, &le) || le.File != path || !strings.HasPrefix(err.Error(), path+" cannot be opened") {
		t.Errorf("Load of a bad file gave %v, %v", p, err)
	}
}

func TestRecovery(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "state") // WriteRecovery makes the folder
	if r, err := FindRecovery(dir); r != nil || err != nil {
		t.Fatalf("an empty folder gave a recovery %v, %v", r, err)
	}
	p := loadDemo(t)
	before := time.Now()
	if err := WriteRecovery(dir, p, "/home/someone/joist.json"); err != nil {
		t.Fatal(err)
	}
	after := time.Now()
	r, err := FindRecovery(dir)
	if err != nil {
		t.Fatal(err)
	}
	if r == nil || !reflect.DeepEqual(r.Project, p) || r.Source != "/home/someone/joist.json" {
		t.Fatalf("recovered %+v, want the project and its source", r)
	}
	if r.Written.Before(before) || r.Written.After(after) {
		t.Errorf("written at %v, not between %v and %v", r.Written, before, after)
	}
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{filepath.Base(RecoveryPath(dir))}) {
		t.Errorf("the folder holds %v, want only the autosave", got)
	}

	if err := ClearRecovery(dir); err != nil {
		t.Fatal(err)
	}
	if r, err := FindRecovery(dir); r != nil || err != nil {
		t.Errorf("after clearing, found %v, %v", r, err)
	}
	if err := ClearRecovery(dir); err != nil {
		t.Errorf("clearing twice: %v", err)
	}
}

func TestDamagedRecoveryIsReported(t *testing.T) {
	dir := t.TempDir()
	if err := os.WriteFile(RecoveryPath(dir), []byte(`{"format": "stave-recovery", "project": `), 0o600); err != nil {
		t.Fatal(err)
	}
	r, err := FindRecovery(dir)
	if r != nil || err == nil || !strings.Contains(err.Error(), "damaged") {
		t.Errorf("a cut-off autosave gave %v, %v", r, err)
	}
}
