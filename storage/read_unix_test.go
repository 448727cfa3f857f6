//go:build unix

package storage

import (
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
