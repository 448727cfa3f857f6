package report

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"stave/fem"
)

// The report writes a value that is not finite in words, where fmt's %g
// writes "+Inf" or "NaN" (Go's fmt documentation, from memory): a
// singular system's condition estimate, an error that could not be
// measured.
func TestReportSaysNotFiniteInWords(t *testing.T) {
	var b bytes.Buffer
	WriteMeshText(&b, fem.Summary{Mesh: fem.MeshSummary{Elements: 4, Nodes: 5, Condition: math.Inf(1)}})
	for _, c := range []struct{ got, want string }{
		{b.String(), "condition estimate infinite"},
		{percent(math.NaN()), "undefined"},
		{percent(0.0125), "1.25 %"},
	} {
		if strings.Contains(c.got, "Inf") || strings.Contains(c.got, "NaN") || !strings.Contains(c.got, c.want) {
			t.Errorf("%q, want %q in words", c.got, c.want)
		}
	}
}
