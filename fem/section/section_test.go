package section

import (
	"math"
	"strings"
	"testing"
)

func near(a, b, relative float64) bool { return math.Abs(a-b) <= relative*math.Abs(b) }

// Closed forms from the properties-of-plane-areas appendix of Gere & Goodno,
// Mechanics of Materials (from memory); the hollow and I shapes are rebuilt
// here from rectangles by the parallel-axis theorem, a different route from
// the subtraction the package uses.
func TestClosedForms(t *testing.T) {
	rectangleAbout := func(b, h, offset float64) float64 { return b*h*h*h/12 + b*h*offset*offset }
	cases := []struct {
		name                string
		build               func() (Properties, error)
		area, second, fibre float64
	}{
		{"rectangle b·h³/12", func() (Properties, error) { return Rectangle(0.1, 0.3) },
			0.1 * 0.3, 0.1 * 0.027 / 12, 0.15},
		{"solid round π·d⁴/64", func() (Properties, error) { return SolidRound(0.05) },
			math.Pi * 0.0025 / 4, math.Pi * 6.25e-6 / 64, 0.025},
		{"round tube π·(D⁴ − d⁴)/64", func() (Properties, error) { return RoundTube(0.2, 0.01) },
			math.Pi * (0.04 - 0.0324) / 4, math.Pi * (0.0016 - 0.00104976) / 64, 0.1},
		{"rectangular hollow by parts", func() (Properties, error) { return RectangularHollow(0.1, 0.2, 0.01) },
			2*0.1*0.01 + 2*0.01*0.18,
			2*rectangleAbout(0.1, 0.01, 0.095) + 2*rectangleAbout(0.01, 0.18, 0), 0.1},
		{"I shape by parallel axes", func() (Properties, error) { return IShape(0.15, 0.3, 0.0107, 0.0071) },
			2*0.15*0.0107 + 0.0071*(0.3-0.0214),
			2*rectangleAbout(0.15, 0.0107, (0.3-0.0107)/2) + rectangleAbout(0.0071, 0.3-0.0214, 0), 0.15},
	}
	for _, c := range cases {
		p, err := c.build()
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if !near(p.Area, c.area, 1e-12) || !near(p.SecondMoment, c.second, 1e-12) || !near(p.FibreDistance, c.fibre, 1e-12) {
			t.Errorf("%s: got A=%g I=%g c=%g, want A=%g I=%g c=%g", c.name,
				p.Area, p.SecondMoment, p.FibreDistance, c.area, c.second, c.fibre)
		}
		if !near(p.SectionModulus, c.second/c.fibre, 1e-12) {
			t.Errorf("%s: S = %g, want I/c = %g", c.name, p.SectionModulus, c.second/c.fibre)
		}
		s := p.Section()
		if s.Area != p.Area || s.SecondMoment != p.SecondMoment || s.FibreDistance != p.FibreDistance {
			t.Errorf("%s: Section() = %+v does not carry %+v", c.name, s, p)
		}
	}
}

// Tabulated properties of rolled and hot-finished sections. The package
// leaves root fillets out, so rolled I shapes come out a few per cent below
// the tables; each row states how far below it may be.
func TestHandbookSections(t *testing.T) {
	const inch = 0.0254
	cases := []struct {
		name                  string
		build                 func() (Properties, error)
		area, second, modulus float64 // tabulated, SI
		below                 float64 // largest shortfall allowed, relative
	}{
		// IPE 300, EN 10365 dimensions (h 300, b 150, tw 7.1, tf 10.7, r 15 mm):
		// A = 53.81 cm², Iy = 8356 cm⁴, Wel,y = 557.1 cm³ (European section tables,
		// from memory). Fillets of r = 15 mm add about 4 % to A and I.
		{"IPE 300", func() (Properties, error) { return IShape(0.150, 0.300, 0.0107, 0.0071) },
			53.81e-4, 8356e-8, 557.1e-6, 0.05},
		// W12x26, AISC Steel Construction Manual Table 1-1 (from memory):
		// d 12.2, bf 6.49, tf 0.380, tw 0.230 in; A = 7.65 in², Ix = 204 in⁴, Sx = 33.4 in³.
		{"W12x26", func() (Properties, error) { return IShape(6.49*inch, 12.2*inch, 0.380*inch, 0.230*inch) },
			7.65 * inch * inch, 204 * math.Pow(inch, 4), 33.4 * math.Pow(inch, 3), 0.03},
		// CHS 168.3 × 6.3, EN 10210-2 tables (from memory): A = 32.1 cm², I = 1053 cm⁴,
		// Wel = 125 cm³. A tube has no fillets: only the table's rounding separates us.
		{"CHS 168.3x6.3", func() (Properties, error) { return RoundTube(0.1683, 0.0063) },
			32.1e-4, 1053e-8, 125e-6, 0.005},
	}
	for _, c := range cases {
		p, err := c.build()
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		for _, q := range []struct {
			what       string
			got, table float64
		}{{"A", p.Area, c.area}, {"I", p.SecondMoment, c.second}, {"S", p.SectionModulus, c.modulus}} {
			shortfall := (q.table - q.got) / q.table
			t.Logf("%s %s: %.5g vs table %.5g (%.2f %% below)", c.name, q.what, q.got, q.table, 100*shortfall)
			if shortfall > c.below || shortfall < -0.005 {
				t.Errorf("%s: %s = %.5g, table %.5g: %.2f %% below, allowed 0 to %.1f %%",
					c.name, q.what, q.got, q.table, 100*shortfall, 100*c.below)
			}
		}
	}
}

func TestInvalidDimensions(t *testing.T) {
	cases := []struct {
		name    string
		build   func() (Properties, error)
		message string
	}{
		{"zero width", func() (Properties, error) { return Rectangle(0, 0.3) }, "rectangle: width b = 0 mm must be a positive"},
		{"negative diameter", func() (Properties, error) { return SolidRound(-0.02) }, "diameter d = -20.00 mm"},
		// A value that is not a number reads in words (units.FormatNumber).
		{"NaN depth", func() (Properties, error) { return Rectangle(0.1, math.NaN()) }, "depth h = undefined mm"},
		{"tube wall too thick", func() (Properties, error) { return RoundTube(0.1, 0.06) },
			"wall thickness t = 60.00 mm is at least half the outside diameter D = 100.0 mm"},
		{"box wall too thick", func() (Properties, error) { return RectangularHollow(0.1, 0.2, 0.05) },
			"wall thickness t = 50.00 mm is at least half the smaller outside dimension 100.0 mm"},
		{"flanges fill depth", func() (Properties, error) { return IShape(0.1, 0.02, 0.01, 0.005) }, "leaving no web"},
		{"web wider than flange", func() (Properties, error) { return IShape(0.01, 0.3, 0.01, 0.1) }, "check that b and tw are not swapped"},
	}
	for _, c := range cases {
		_, err := c.build()
		if err == nil {
			t.Errorf("%s: accepted", c.name)
			continue
		}
		if !strings.Contains(err.Error(), c.message) {
			t.Errorf("%s: error %q, want it to contain %q", c.name, err, c.message)
		}
	}
}
