//go:build unix

package storage

import (
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// Load refuses what is not a file before opening it: opening a named pipe
// that nothing writes to would wait for ever.
func TestLoadRefusesWhatIsNotAFile(t *testing.T) {
	dir := t.TempDir()
	pipe := filepath.Join(dir, "pipe.json")
	if err := syscall.Mkfifo(pipe, 0o600); err != nil {
		t.Fatal(err)
	}
	tests := []struct{ path, phrase string }{
		{pipe, "it is a named pipe, not a file; choose a project file"},
		{dir, "it is a folder, not a file"},
		{"/dev/null", "it is a device, not a file"},
	}
	for _, tt := range tests {
		p, err := Load(tt.path)
		if p != nil || err == nil || !strings.Contains(err.Error(), "cannot open "+tt.path+": "+tt.phrase) {
			t.Errorf("Load(%s) gave %v, want %q", tt.path, err, tt.phrase)
		}
	}
}

// Saving refuses to put a file in the place of what is not one, named
// directly or through a link: a named pipe stays a pipe and a folder a
// folder. Before, the pipe was replaced by a regular file (and, run by
// root, an export to a link to /dev/full replaced the device), and the
// folder gave "rename ...: file exists".
func TestSaveRefusesWhatIsNotAFile(t *testing.T) {
	dir := t.TempDir()
	pipe := filepath.Join(dir, "out.csv")
	if err := syscall.Mkfifo(pipe, 0o600); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink(pipe, link); err != nil {
		t.Fatal(err)
	}
	folder := filepath.Join(dir, "folder.csv")
	if err := os.Mkdir(folder, 0o700); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		path, kept, phrase string
		mode               fs.FileMode
	}{
		{pipe, pipe, "it is a named pipe, not a file", fs.ModeNamedPipe},
		{link, pipe, "(the file the link " + link + " points to): it is a named pipe, not a file", fs.ModeNamedPipe},
		{folder, folder, "it is a folder, not a file", fs.ModeDir},
	} {
		err := WriteFile(c.path, func(w io.Writer) error {
			_, err := io.WriteString(w, "a,b\n")
			return err
		})
		if err == nil || !strings.Contains(err.Error(), c.phrase) {
			t.Errorf("WriteFile(%s): %v, want %q", c.path, err, c.phrase)
		}
		if info, err := os.Lstat(c.kept); err != nil || info.Mode().Type() != c.mode {
			t.Errorf("after WriteFile(%s), %s is %v (%v), want it kept as %v", c.path, c.kept, info.Mode().Type(), err, c.mode)
		}
	}
}
