//go:build unix

package storage

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// A new file takes the permissions the umask allows; a replaced file keeps
// its own, whatever the umask.
func TestSaveRespectsTheUmaskAndKeepsModes(t *testing.T) {
	tests := []struct {
		name     string
		umask    int
		existing os.FileMode // 0: no file before
		want     os.FileMode
	}{
		{"new file, umask 077", 0o077, 0, 0o600},
		{"new file, umask 022", 0o022, 0, 0o644},
		{"new file, umask 002", 0o002, 0, 0o664},
		{"existing file, umask 077", 0o077, 0o644, 0o644},
		{"existing file, umask 022", 0o022, 0o640, 0o640},
		{"existing file, umask 002", 0o002, 0o600, 0o600},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			path := filepath.Join(t.TempDir(), "joist.json")
			if tt.existing != 0 {
				saveAs(t, path, "before")
				if err := os.Chmod(path, tt.existing); err != nil {
					t.Fatal(err)
				}
			}
			defer syscall.Umask(syscall.Umask(tt.umask))
			saveAs(t, path, "after")
			if info, err := os.Stat(path); err != nil || info.Mode().Perm() != tt.want {
				t.Errorf("permissions %v (%v), want %v", info.Mode().Perm(), err, tt.want)
			}
		})
	}
	t.Run("autosave, umask 077", func(t *testing.T) {
		dir := t.TempDir()
		defer syscall.Umask(syscall.Umask(0o077))
		if err := WriteRecovery(dir, loadDemo(t), ""); err != nil {
			t.Fatal(err)
		}
		if info, err := os.Stat(RecoveryPath(dir)); err != nil || info.Mode().Perm() != 0o600 {
			t.Errorf("the autosave has permissions %v (%v), want 0600", info.Mode().Perm(), err)
		}
	})
}

// Where the folder cannot be written, saving fails, says so and leaves the
// previous file as it was.
func TestSaveIntoAReadOnlyFolderKeepsTheOldFile(t *testing.T) {
	if os.Geteuid() == 0 {
		t.Skip("the superuser writes into read-only folders")
	}
	dir := t.TempDir()
	path := filepath.Join(dir, "joist.json")
	saveAs(t, path, "before")
	old, _ := os.ReadFile(path)
	if err := os.Chmod(dir, 0o555); err != nil {
		t.Fatal(err)
	}
	defer os.Chmod(dir, 0o755)
	err := Save(path, loadDemo(t))
	if err == nil || !strings.Contains(err.Error(), "cannot create a temporary file") || !strings.Contains(err.Error(), "the previous file is unchanged") {
		t.Errorf("saving into a read-only folder gave %v", err)
	}
	if got, _ := os.ReadFile(path); !bytes.Equal(got, old) {
		t.Errorf("the previous file changed")
	}
	if got := listDir(t, dir); len(got) != 1 {
		t.Errorf("the folder holds %v, want only the previous file", got)
	}
}
