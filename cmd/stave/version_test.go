package main

import (
	"encoding/json"
	"fmt"
	"os"
	"strconv"
	"strings"
	"testing"
)

// FyneApp.toml names the version that `make dist` puts on the packages (the
// Linux bundle's name, the Windows version information); `stave version` and the
// calculation sheets must say the same.
func TestVersionIsFyneAppVersion(t *testing.T) {
	data, err := os.ReadFile("../../FyneApp.toml")
	if err != nil {
		t.Fatal(err)
	}
	want, err := detailsValue(string(data), "Version")
	if err != nil {
		t.Fatal(err)
	}
	code, out, stderr := runStave(t, "version")
	if code != 0 || out != "stave "+want+"\n" {
		t.Errorf("stave version: exit %d, printed %q (stderr %q); FyneApp.toml says %s: change one to match the other",
			code, out, stderr, want)
	}
}

// detailsValue returns the string value of key in the [Details] table of a
// FyneApp.toml.
func detailsValue(toml, key string) (string, error) {
	inDetails := false
	for _, line := range strings.Split(toml, "\n") {
		line = strings.TrimSpace(line)
		if strings.HasPrefix(line, "[") {
			inDetails = line == "[Details]"
			continue
		}
		name, value, ok := strings.Cut(line, "=")
		if inDetails && ok && strings.TrimSpace(name) == key {
			return strconv.Unquote(strings.TrimSpace(value))
		}
	}
	return "", fmt.Errorf("FyneApp.toml has no %s in [Details]", key)
}

// version prints the release alone; a stray argument is misuse (it was
// ignored) and --help shows its usage.
func TestVersionArguments(t *testing.T) {
	for _, c := range []struct {
		args []string
		code int
		out  string
	}{
		{[]string{"version"}, 0, "stave " + version + "\n"},
		{[]string{"--version"}, 0, "stave " + version + "\n"},
		{[]string{"version", "--help"}, 0, "usage: stave version [flags]"},
		{[]string{"version", "x.json"}, 2, ""},
	} {
		code, out, stderr := runStave(t, c.args...)
		if code != c.code || !strings.HasPrefix(out, c.out) || (c.code == 2) != strings.Contains(stderr, "version takes no argument") {
			t.Errorf("stave %v: exit %d, stdout %q, stderr %q; want exit %d, stdout from %q", c.args, code, out, stderr, c.code, c.out)
		}
	}
}

// Every JSON document of the command line names its format and version
// (docs/json.md, "Format and version"), so a program can tell what it reads
// and refuse a version it does not know: the influence line and the check
// schedule had neither.
func TestJSONDocumentsNameTheirFormat(t *testing.T) {
	const model = "../../testdata/simply_supported_uniform.json"
	for _, c := range []struct {
		args   []string
		format string
	}{
		{[]string{"solve", "--json", model}, "stave-results"},
		{[]string{"converge", "--json", "--max", "4", model}, "stave-convergence"},
		{[]string{"influence", "--json", "--quantity", "M", "--at", "2", model}, "stave-influence"},
		{[]string{"check", "--json", model}, "stave-check"},
		{[]string{"check", "--json", "no-such-file.json"}, "stave-check"}, // a refused member still gives the document
	} {
		_, out, stderr := runStave(t, c.args...)
		var doc struct {
			Format  *string `json:"format"`
			Version *int    `json:"version"`
		}
		if err := json.Unmarshal([]byte(out), &doc); err != nil {
			t.Errorf("stave %v: not JSON (%v, stderr %q):\n%s", c.args, err, stderr, out)
			continue
		}
		if doc.Format == nil || *doc.Format != c.format || doc.Version == nil || *doc.Version != 1 {
			t.Errorf("stave %v: format %v, version %v; want %q and 1", c.args, doc.Format, doc.Version, c.format)
		}
	}
}
