package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"path/filepath"
	"testing"
)

// Every --json document writes zero as 0, never -0, as the text does.
// Before, solve --json wrote "limit": -0 on every model's axial
// equilibrium row, "value": -0 on the moment reactions of
// testdata/fixed_fixed_thermal.json and "fe": -0 on the axial reaction of
// testdata/ground_beam_foundation.json, and influence --json -0 among a
// reaction line's coefficients.
func TestJSONWritesNoNegativeZero(t *testing.T) {
	files, err := filepath.Glob("../../testdata/*.json")
	if err != nil || len(files) == 0 {
		t.Fatalf("no example models: %v", err)
	}
	files = append(files, "../../testdata/moving/runway.json")
	for _, file := range files {
		for _, args := range [][]string{
			{"solve", "--json", file},
			{"influence", file, "--quantity", "reaction", "--support", "1", "--json"},
			{"check", "--json", file},
		} {
			code, out, stderr := runStave(t, args...)
			if code != 0 && code != 3 {
				continue // a refused line has no numbers to judge; other tests cover the refusal
			}
			dec := json.NewDecoder(bytes.NewReader([]byte(out)))
			dec.UseNumber()
			var doc any
			if err := dec.Decode(&doc); err != nil {
				t.Errorf("%v: not JSON: %v (stderr %s)", args, err, stderr)
				continue
			}
			if where := negativeZero(doc, ""); where != "" {
				t.Errorf("%v: %s is -0", args, where)
			}
		}
	}
}

// negativeZero is the path of the first number in v written -0, or "".
func negativeZero(v any, path string) string {
	switch v := v.(type) {
	case json.Number:
		if f, err := v.Float64(); err == nil && f == 0 && len(v) > 0 && v[0] == '-' {
			return path
		}
	case map[string]any:
		for k, child := range v {
			if w := negativeZero(child, path+"."+k); w != "" {
				return w
			}
		}
	case []any:
		for i, child := range v {
			if w := negativeZero(child, fmt.Sprintf("%s[%d]", path, i)); w != "" {
				return w
			}
		}
	}
	return ""
}
