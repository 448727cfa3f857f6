package storage

import (
	"fmt"
	"strings"
	"testing"
)

// A message lists at most MaxListedProblems problems and counts the rest.
// Before, a file with a problem in each of its 100,000 loads was refused
// with a message of 100,000 lines (12 MB) on standard error and in the
// window's dialog.
func TestLoadErrorListsAtMostItsLimit(t *testing.T) {
	for _, c := range []struct {
		name     string
		problems int
		lines    int    // lines under the heading
		last     string // the last line
	}{
		{"one", 1, 0, "loads[0]: bad"},
		{"at the limit", MaxListedProblems, MaxListedProblems, fmt.Sprintf("  - loads[%d]: bad", MaxListedProblems-1)},
		{"one over", MaxListedProblems + 1, MaxListedProblems + 1, "  - and 1 more problem (the first 100 are listed)"},
		{"100,000", 100_000, MaxListedProblems + 1, "  - and 99900 more problems (the first 100 are listed)"},
	} {
		e := &LoadError{File: "f.json"}
		for i := range c.problems {
			e.Problems = append(e.Problems, Problem{Path: fmt.Sprintf("loads[%d]", i), Message: "bad"})
		}
		lines := strings.Split(e.Error(), "\n")
		if got := len(lines) - 1; got != c.lines {
			t.Errorf("%s: %d lines under the heading, want %d", c.name, got, c.lines)
		}
		if !strings.HasSuffix(lines[len(lines)-1], c.last) {
			t.Errorf("%s: last line %q, want it to end %q", c.name, lines[len(lines)-1], c.last)
		}
		if c.problems > 1 && !strings.Contains(lines[0], fmt.Sprintf("(%d problems)", c.problems)) {
			t.Errorf("%s: heading %q does not count every problem", c.name, lines[0])
		}
	}
}
