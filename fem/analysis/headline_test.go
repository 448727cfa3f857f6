package analysis

import (
	"context"
	"fmt"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/units"
)

// The window's headline lists the reactions and the actions at the
// supports inside the member up to headlineRows of each, and says how many
// more there are: a member on 500 supports made 109 kB of text, which a
// wrapped label took 2 s to lay out (2,000 supports 21 s, 40,000 more than
// five minutes, the window frozen). Each line names its support from 1, so
// the first and the last listed are supports 1 and headlineRows.
func TestHeadlineListsAFewSupports(t *testing.T) {
	for _, supports := range []int{3, headlineRows + 2, 500} {
		m := load(t, "simply_supported_uniform.json")
		L := m.Length()
		m.Supports = m.Supports[:1]
		for i := 1; i < supports; i++ {
			m.Supports = append(m.Supports, fem.Support{X: L * float64(i) / float64(supports-1), Kind: fem.Roller})
		}
		m.Mesh = fem.MeshSettings{Elements: 2 * supports}
		a, err := Run(context.Background(), Request{Model: m, Checks: check.DefaultOptions()})
		if err != nil || a.Err != nil {
			t.Fatalf("%d supports: %v, %v", supports, err, a.Err)
		}
		text := a.HeadlineText(units.SI)
		inner := supports - 2
		for _, c := range []struct {
			line        string
			count, more int
		}{{"\n• reaction ", supports, supports - headlineRows}, {"\n• at support ", inner, inner - headlineRows}} {
			listed := min(c.count, headlineRows)
			if got := strings.Count(text, c.line); got != listed {
				t.Errorf("%d supports: %d lines %q, want %d", supports, got, c.line, listed)
			}
			if more := fmt.Sprintf("\n• and %d more", c.more); c.more > 0 != strings.Contains(text, more) {
				t.Errorf("%d supports: %q said %v, want %v:\n%s", supports, more, !(c.more > 0), c.more > 0, text)
			}
		}
		if len(text) > 10000 {
			t.Errorf("%d supports: the headline is %d bytes", supports, len(text))
		}
	}
}
