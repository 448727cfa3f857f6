package report

import (
	"bytes"
	"encoding/json"
	"math"
	"testing"
)

// WriteJSON writes a zero with its sign bit set (a negated zero, as a
// reaction no support load reaches carries) as 0, the way the text
// reports do; other numbers and texts stay as encoding/json writes them.
// Before, the document said -0 (stave solve --json on
// testdata/fixed_fixed_thermal.json: "value": -0 for a moment reaction).
func TestWriteJSONWritesZeroWithoutSign(t *testing.T) {
	negZero := math.Copysign(0, -1)
	for _, c := range []struct {
		name string
		v    any
		want string
	}{
		{"negative zero", negZero, "0\n"},
		{"in a list", []float64{negZero, 0, negZero}, "[\n  0,\n  0,\n  0\n]\n"},
		{"in an object", map[string]float64{"x": negZero}, "{\n  \"x\": 0\n}\n"},
		{"small negative numbers keep their sign", []float64{-0.5, -0.05, -1e-7, -10}, "[\n  -0.5,\n  -0.05,\n  -1e-7,\n  -10\n]\n"},
		{"a text -0 stays", "-0", "\"-0\"\n"},
		{"a text with an escaped quote before -0", `a"-0`, "\"a\\\"-0\"\n"},
		{"a text ending in a backslash, then a number", []any{`a\`, negZero}, "[\n  \"a\\\\\",\n  0\n]\n"},
	} {
		var b bytes.Buffer
		if err := WriteJSON(&b, c.v); err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if b.String() != c.want {
			t.Errorf("%s: %q, want %q", c.name, b.String(), c.want)
		}
		if !json.Valid(b.Bytes()) {
			t.Errorf("%s: %q is not JSON", c.name, b.String())
		}
	}
}
