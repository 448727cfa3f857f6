package main

import (
	"bytes"
	"errors"
	"strings"
	"testing"
)

// fullDisk is standard output on a full disk: every write fails.
type fullDisk struct{}

func (fullDisk) Write([]byte) (int, error) { return 0, errors.New("no space left on device") }

// A command whose output cannot be written says so and exits 1, whatever
// it writes. Before, the text of solve, influence and converge (and
// version) went nowhere with exit status 0, so a script saw a success and
// an empty file.
func TestOutputThatCannotBeWrittenFails(t *testing.T) {
	const file = "../../testdata/two_span_cases.json"
	for _, args := range [][]string{
		{"solve", file},
		{"solve", "--json", file},
		{"influence", file, "--quantity", "M", "--at", "2"},
		{"converge", "--max", "4", file},
		{"check", file},
		{"version"},
	} {
		var stderr bytes.Buffer
		code := run(args, fullDisk{}, &stderr)
		if code != 1 || !strings.Contains(stderr.String(), "no space left on device") {
			t.Errorf("%v: exit %d, stderr %q; want 1 and the write error", args, code, stderr.String())
		}
	}
}
