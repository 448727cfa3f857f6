package storage

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"math/rand/v2"
	"os"
	"os/exec"
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

// saveAs loads the demo, names its engineer and saves it at path.
func saveAs(t *testing.T, path, engineer string) *Project {
	t.Helper()
	p := loadDemo(t)
	p.Notes.Engineer = engineer
	if err := Save(path, p); err != nil {
		t.Fatal(err)
	}
	return p
}

// engineerIn loads path and returns its engineer.
func engineerIn(t *testing.T, path string) string {
	t.Helper()
	p, err := Load(path)
	if err != nil {
		t.Fatal(err)
	}
	return p.Notes.Engineer
}

// Saving through a symbolic link replaces the file it points to, keeps the
// link, and keeps the backup beside the file.
func TestSaveThroughASymbolicLink(t *testing.T) {
	tests := []struct {
		name string
		// link is where the link goes, to what it points, and target the
		// file that must be saved, all relative to a fresh folder.
		link, to, target string
		exists           bool // whether the target holds a file before
	}{
		{"relative, into another folder", "links/joist.json", "../real/joist.json", "real/joist.json", true},
		{"absolute", "links/joist.json", "/real/joist.json", "real/joist.json", true},
		{"to a link", "links/joist.json", "other.json", "real/joist.json", true}, // links/other.json -> ../real/joist.json
		{"to a file not yet made", "links/joist.json", "../real/new.json", "real/new.json", false},
		{"relative, from inside a linked folder", "alias/joist.json", "../joist.json", "real/joist.json", true}, // alias -> real/sub
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			root := t.TempDir()
			at := func(rel string) string { return filepath.Join(root, rel) }
			for _, d := range []string{"links", "real/sub"} {
				if err := os.MkdirAll(at(d), 0o755); err != nil {
					t.Fatal(err)
				}
			}
			if err := os.Symlink("real/sub", at("alias")); err != nil {
				t.Skip("no symbolic links here:", err)
			}
			mustLink := func(to, link string) {
				if err := os.Symlink(to, link); err != nil {
					t.Fatal(err)
				}
			}
			mustLink("../real/joist.json", at("links/other.json"))
			if tt.exists {
				saveAs(t, at(tt.target), "before")
			}
			to := tt.to
			if filepath.IsAbs(to) {
				to = filepath.Join(root, to)
			}
			mustLink(to, at(tt.link))

			saveAs(t, at(tt.link), "after")

			info, err := os.Lstat(at(tt.link))
			if err != nil || info.Mode()&os.ModeSymlink == 0 {
				t.Fatalf("the link is gone or no longer a link (%v, %v)", info, err)
			}
			if got, _ := os.Readlink(at(tt.link)); got != to {
				t.Errorf("the link points to %s, want %s", got, to)
			}
			if got := engineerIn(t, at(tt.target)); got != "after" {
				t.Errorf("the target holds the version %q, want the new one", got)
			}
			if _, err := os.Lstat(BackupPath(at(tt.link))); err == nil {
				t.Errorf("a backup was made beside the link")
			}
			if tt.exists {
				if got := engineerIn(t, BackupPath(at(tt.target))); got != "before" {
					t.Errorf("the target's backup holds %q, want the previous version", got)
				}
			}
		})
	}
}

func TestSaveThroughALinkLoopSaysWhy(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	if err := os.Symlink("joist.json", path); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	err := Save(path, loadDemo(t))
	if err == nil || !strings.Contains(err.Error(), "more than 40 symbolic links") {
		t.Errorf("saving through a link to itself gave %v", err)
	}
}

// endedProcess returns the id of a process that has run and ended.
func endedProcess(t *testing.T) int {
	t.Helper()
	cmd := exec.Command(os.Args[0], "-test.run=^$")
	if err := cmd.Run(); err != nil {
		t.Fatal(err)
	}
	return cmd.Process.Pid
}

// Saving removes the temporary files earlier saves of the same file left
// when they were stopped, and nothing else.
func TestSaveRemovesStaleTemporaries(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	saveAs(t, path, "before") // so that the second save makes a backup
	ended := endedProcess(t)
	otherHost := "00000000"
	if otherHost == hostTag {
		otherHost = "ffffffff"
	}
	temporary := func(file, host string, pid int) string {
		return fmt.Sprintf(".%s.%s-%d-12345.tmp", file, host, pid)
	}
	fresh, abandoned := time.Now(), time.Now().Add(-time.Hour)
	files := []struct {
		name    string
		written time.Time
		removed bool
	}{
		{temporary("joist.json", hostTag, ended), fresh, true},
		{temporary("joist.json.bak", hostTag, ended), fresh, true},
		{temporary("joist.json", hostTag, os.Getpid()), fresh, false},  // this process, saving
		{temporary("joist.json", hostTag, os.Getppid()), fresh, false}, // another running process, saving
		{temporary("joist.json.bak", hostTag, os.Getppid()), abandoned, true},
		{temporary("joist.json", otherHost, ended), fresh, false}, // whether it runs is not known here
		{temporary("joist.json", otherHost, ended+1), abandoned, true},
		{".joist.json.2718281828.tmp", fresh, false}, // the older naming
		{".joist.json.3141592653.tmp", abandoned, true},
		{temporary("beam.json", hostTag, ended), abandoned, false},
		{".joist.json.notes.tmp", abandoned, false},
		{"joist.json.12345.tmp", abandoned, false},
	}
	for _, f := range files {
		if err := os.WriteFile(filepath.Join(dir, f.name), []byte("partial"), 0o644); err != nil {
			t.Fatal(err)
		}
		if err := os.Chtimes(filepath.Join(dir, f.name), f.written, f.written); err != nil {
			t.Fatal(err)
		}
	}
	folder := temporary("joist.json", hostTag, ended+2)
	if err := os.Mkdir(filepath.Join(dir, folder), 0o755); err != nil {
		t.Fatal(err)
	}

	saveAs(t, path, "after")

	for _, f := range files {
		_, err := os.Stat(filepath.Join(dir, f.name))
		if gone := errors.Is(err, os.ErrNotExist); gone != f.removed {
			t.Errorf("%s (written %s ago): removed %v, want %v", f.name, time.Since(f.written).Round(time.Minute), gone, f.removed)
		}
	}
	if _, err := os.Stat(filepath.Join(dir, folder)); err != nil {
		t.Errorf("a folder named like a temporary file was removed")
	}
}

// saveLoopEnv makes the test binary a helper process that saves, at the
// path the variable holds, in a loop until it is killed.
const saveLoopEnv = "STAVE_TEST_SAVE_LOOP"

// saveInALoop saves the demo at path with a new engineer each time, saying
// "ready" on its output after the first save; it never returns.
func saveInALoop(t *testing.T, path string) {
	p := loadDemo(t)
	for i := 0; ; i++ {
		p.Notes.Engineer = fmt.Sprintf("save %d", i)
		if err := Save(path, p); err != nil {
			fmt.Fprintln(os.Stderr, err)
			os.Exit(1)
		}
		if i == 0 {
			fmt.Println("ready")
		}
	}
}

// A save killed at any moment (kill -9) leaves the file and its backup
// whole, each an earlier version; the next save removes the killed saves'
// temporary files.
func TestKilledSavesLoseNothing(t *testing.T) {
	if path := os.Getenv(saveLoopEnv); path != "" {
		saveInALoop(t, path)
	}
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	saveAs(t, path, "first")
	saveAs(t, path, "second")
	const kills = 40
	leftTemporaries := 0
	for i := range kills {
		helper := exec.Command(os.Args[0], "-test.run=^TestKilledSavesLoseNothing$")
		helper.Env = append(os.Environ(), saveLoopEnv+"="+path)
		helper.Stderr = os.Stderr
		out, err := helper.StdoutPipe()
		if err != nil {
			t.Fatal(err)
		}
		if err := helper.Start(); err != nil {
			t.Fatal(err)
		}
		if line, err := bufio.NewReader(out).ReadString('\n'); line != "ready\n" {
			helper.Process.Kill()
			helper.Wait()
			t.Fatalf("the helper process said %q (%v)", line, err)
		}
		time.Sleep(time.Duration(rand.Int64N(int64(5 * time.Millisecond))))
		if err := helper.Process.Kill(); err != nil {
			t.Fatal(err)
		}
		helper.Wait()

		for _, f := range []string{path, BackupPath(path)} {
			p, err := Load(f)
			if err != nil {
				t.Fatalf("after kill %d: %v", i+1, err)
			}
			if !strings.HasPrefix(p.Notes.Engineer, "save ") && p.Notes.Engineer != "second" {
				t.Fatalf("after kill %d, %s holds the version %q", i+1, filepath.Base(f), p.Notes.Engineer)
			}
		}
		if len(listDir(t, dir)) > 2 {
			leftTemporaries++
		}
	}
	t.Logf("%d of %d kills left temporary files", leftTemporaries, kills)
	saveAs(t, path, "last")
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{"joist.json", "joist.json.bak"}) {
		t.Errorf("after a save by a live process the folder holds %v, want only the file and its backup", got)
	}
}

// When the backup is already the file itself (a save stopped after keeping
// it), the next save leaves no temporary link behind: renaming one hard
// link over another of the same file does nothing.
func TestSaveWhenTheBackupIsTheFileItself(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	saveAs(t, path, "before")
	if err := os.Link(path, BackupPath(path)); err != nil {
		t.Skip("no hard links here:", err)
	}
	saveAs(t, path, "after")
	if got := listDir(t, dir); !reflect.DeepEqual(got, []string{"joist.json", "joist.json.bak"}) {
		t.Errorf("the folder holds %v, want only the file and its backup", got)
	}
	if got := engineerIn(t, BackupPath(path)); got != "before" {
		t.Errorf("the backup holds %q, want the previous version", got)
	}
}
