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

// The findings and the window's headline say the side of a jump as the
// text output does ("just left of 4.000 m", fem.Side.Place), in either
// unit system. Two equal spans of 4 m under 10 kN/m (the shipped model,
// 16 elements): the shear force is 25 kN just right of the middle support
// and −25 kN just left of it, 5wL/8 (AISC Manual, Beam Diagrams and
// Formulas, continuous beam, two equal spans, uniform load, from memory);
// the finite element one is constant in each element, ±22.5 kN (9wL/16,
// the mean of the exact one over the element beside the support), largest
// just right of the support and smallest first reached at 3.5 m, a node
// where it does not jump (fem's TestSummarySaysTheSideOfAJump). A member
// fixed at 0 with a hinge at a = 2 m and a roller at 4 m, a force P at the
// hinge: the part left of the hinge is a cantilever under P at its tip,
// turning by P·a²/(2EI) there (AISC Manual, Beam Diagrams and Formulas,
// cantilever beam, concentrated load at free end, from memory), −0.2 rad
// for P = −10 kN and EI = 100 kN·m², its tip P·a³/(3EI) = −0.267 m down, less
// than a tenth of the member's length; the part right of it turns rigidly
// about the roller by 0.267/2 = 0.133 rad: the rotation jumps at the hinge
// and is largest just left of it.
func TestFindingsSayTheSideOfAJump(t *testing.T) {
	for _, u := range units.Systems() {
		opts := check.DefaultOptions()
		opts.Units = u
		pos := func(x float64) string { return u.Format(units.Position, x) }
		force := func(v float64) string { return u.Format(units.Force, v) }
		a, err := Run(context.Background(), Request{Model: load(t, "two_span_uniform.json"), Checks: opts})
		if err != nil || a.Err != nil {
			t.Fatalf("%s: %v, %v", u.Name, err, a.Err)
		}
		coarse, ok := a.coarseMesh()
		if !ok {
			t.Fatalf("%s: no coarse_mesh finding on 16 elements", u.Name)
		}
		for _, want := range []string{
			"of the largest shear force just right of x = " + pos(4) + ":",
			fmt.Sprintf("is %s just right of x = %s exactly, %s just right of x = %s in the finite element", force(25e3), pos(4), force(22.5e3), pos(4)),
		} {
			if !strings.Contains(coarse.Message, want) {
				t.Errorf("%s: the coarse_mesh finding lacks %q: %s", u.Name, want, coarse.Message)
			}
		}
		want := fmt.Sprintf("• shear force from %s just left of %s to %s just right of %s (FE %s at %s, %s just right of %s)",
			force(-25e3), pos(4), force(25e3), pos(4), force(-22.5e3), pos(3.5), force(22.5e3), pos(4))
		if text := a.HeadlineText(u); !strings.Contains(text, want) {
			t.Errorf("%s: the headline lacks %q:\n%s", u.Name, want, text)
		}

		const P, EI = -10e3, 100e3
		sec := fem.Section{Area: 0.004, SecondMoment: 8e-6, FibreDistance: 0.1}
		m := fem.Model{
			Segments:   []fem.Segment{{Start: 0, End: 4, Section: sec, Material: fem.Material{Elastic: EI / sec.SecondMoment}}},
			Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 4, Kind: fem.Roller}},
			Hinges:     []fem.Hinge{{X: 2}},
			PointLoads: []fem.PointLoad{{X: 2, Transverse: P}},
		}
		a, err = Run(context.Background(), Request{Model: m, Checks: opts})
		if err != nil || a.Err != nil {
			t.Fatalf("%s: hinged member: %v, %v", u.Name, err, a.Err)
		}
		large, ok := a.largeDisplacement()
		want = fmt.Sprintf("The largest rotation is %s just left of x = %s, more than", u.Format(units.Rotation, P*2*2/(2*EI)), pos(2))
		if !ok || !strings.HasPrefix(large.Message, want) {
			t.Errorf("%s: the large displacement finding (%v) does not begin %q: %s", u.Name, ok, want, large.Message)
		}
	}
}
