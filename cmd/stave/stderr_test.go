package main

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"testing"
)

// runAsBinary makes the test binary run the command line instead of the
// tests when the parent test sets it, so a test can watch a whole process:
// package initialization, standard error and the exit status.
const runAsBinary = "STAVE_TEST_RUN_AS_BINARY"

func TestMain(m *testing.M) {
	if os.Getenv(runAsBinary) == "1" {
		os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
	}
	os.Exit(m.Run())
}

// Every headless command that succeeds prints nothing on standard error,
// also in the plain C locale with a character set that containers and CI
// use, where the GUI toolkit's initialization used to print three lines
// about a locale it could not parse.
func TestHeadlessCommandsKeepStandardErrorEmpty(t *testing.T) {
	dir := t.TempDir()
	demo := "../../testdata/demo.json"
	for _, args := range [][]string{
		{"version"},
		{"solve", demo},
		{"solve", "--json", demo},
		{"converge", "--max", "4", demo},
		{"export", demo, "--out", filepath.Join(dir, "demo.png")},
		{"export", demo, "--sheet", "--out", filepath.Join(dir, "sheet.pdf")},
		{"export", demo, "--out", filepath.Join(dir, "demo.csv")},
	} {
		cmd := exec.Command(os.Args[0], args...)
		cmd.Env = append(withoutLocale(os.Environ()), runAsBinary+"=1", "LANG=C.UTF-8")
		var stderr bytes.Buffer
		cmd.Stdout, cmd.Stderr = nil, &stderr
		if err := cmd.Run(); err != nil {
			t.Errorf("stave %v: %v\n%s", args, err, stderr.String())
			continue
		}
		if stderr.Len() != 0 {
			t.Errorf("stave %v printed on standard error:\n%s", args, stderr.String())
		}
	}
}

// withoutLocale is env without the variables that name the locale.
func withoutLocale(env []string) []string {
	var out []string
	for _, kv := range env {
		name, _, _ := bytes.Cut([]byte(kv), []byte("="))
		switch string(name) {
		case "LANGUAGE", "LC_ALL", "LC_MESSAGES", "LANG":
			continue
		}
		out = append(out, kv)
	}
	return out
}

// A command that writes a JSON document whose check failed exits 3 with
// nothing on standard error: the document says why (check_failed and the
// warnings, or the batch's worst_status), as docs/json.md says of solve.
// converge --json and check --json printed the failures on standard error
// as well. Without --json the message stays.
func TestFailedCheckInADocumentKeepsStandardErrorEmpty(t *testing.T) {
	failing := "../../testdata/cantilever_tip_load.json" // 133 mm tip deflection, beyond length/180
	for _, c := range []struct {
		args  []string
		quiet bool
	}{
		{[]string{"solve", "--json", failing}, true},
		{[]string{"converge", "--json", "--max", "2", failing}, true},
		{[]string{"check", "--json", failing}, true},
		{[]string{"solve", failing}, false},
		{[]string{"converge", "--max", "2", failing}, false},
		{[]string{"check", failing}, false},
		{[]string{"check", "--csv", failing}, false},
	} {
		code, _, stderr := runStave(t, c.args...)
		if code != 3 {
			t.Errorf("stave %v: exit %d, want 3; stderr %s", c.args, code, stderr)
		}
		if quiet := stderr == ""; quiet != c.quiet {
			t.Errorf("stave %v: standard error %q, want it empty: %v", c.args, stderr, c.quiet)
		}
	}
}
