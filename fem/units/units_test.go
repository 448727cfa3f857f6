package units

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"
)

// The factors below are read against NIST Special Publication 811 (2008),
// Appendix B.8 "Factors for units listed alphabetically" and B.9 "Factors
// for units listed by kind of quantity", from memory. B.8 prints most
// factors rounded to 7 significant figures; those marked exact there (ft,
// in, lb, gₙ) are checked to round-off.
func TestFactorsAgainstNIST811(t *testing.T) {
	us := USCustomary
	cases := []struct {
		name     string
		got      float64
		want     float64
		relative float64
	}{
		// B.8: foot (ft) to metre = 3.048 E-01, exact.
		{"foot", us.Unit(Position).ToSI, 0.3048, 1e-15},
		// B.8: inch (in) to metre = 2.54 E-02, exact.
		{"inch", us.Unit(Dimension).ToSI, 0.0254, 1e-15},
		// B.8: kip (1 kip = 1000 lbf) to newton = 4.448 222 E+03.
		{"kip", us.Unit(Force).ToSI, 4.448222e3, 5e-7},
		// Exact: 1000 × 0.45359237 kg × 9.80665 m/s² (B.8 footnotes on lbf).
		{"kip exact", us.Unit(Force).ToSI, 4448.2216152605, 1e-14},
		// B.8: kip per square inch (ksi) to pascal = 6.894 757 E+06.
		{"ksi stress", us.Unit(Stress).ToSI, 6.894757e6, 5e-7},
		{"ksi modulus", us.Unit(Modulus).ToSI, 6.894757e6, 5e-7},
		// psi derived as lbf/in² with the exact lbf: 6894.757293168361 Pa.
		{"ksi exact", us.Unit(Stress).ToSI, 6894.757293168361e3, 1e-14},
		// B.8: pound-force foot (lbf·ft) to newton metre = 1.355 818 E+00, so kip·ft ×1000.
		{"kip·ft", us.Unit(Moment).ToSI, 1.355818e3, 5e-7},
		// B.8: pound-force per foot (lbf/ft) to newton per metre = 1.459 390 E+01.
		{"kip/ft", us.Unit(LineLoad).ToSI, 1.459390e4, 5e-7},
		// B.8: pound-force per inch (lbf/in) to newton per metre = 1.751 268 E+02.
		{"kip/in", us.Unit(TranslationalStiffness).ToSI, 1.751268e5, 5e-7},
		// B.8: pound-force foot (lbf·ft) to newton metre = 1.355 818 E+00.
		{"kip·ft/rad", us.Unit(RotationalStiffness).ToSI, 1.355818e3, 5e-7},
		// B.8: pound-force inch (lbf·in) to newton metre = 1.129 848 E-01.
		{"kip·in energy", us.Unit(Energy).ToSI, 1.129848e2, 5e-7},
		{"kip·in/rad typed", extra(t, RotationalStiffness, "kip·in/rad").ToSI, 1.129848e2, 5e-7},
		// B.8: square inch (in²) to square metre = 6.4516 E-04, exact.
		{"in²", us.Unit(Area).ToSI, 6.4516e-4, 1e-15},
		// B.8: inch to the fourth power (in⁴) to metre to the fourth power = 4.162 314 E-07.
		{"in⁴", us.Unit(SecondMoment).ToSI, 4.162314e-7, 5e-7},
		// B.8: cubic inch (in³) to cubic metre = 1.638 706 E-05.
		{"in³", us.Unit(SectionModulus).ToSI, 1.638706e-5, 5e-7},
		// B.8: pound per cubic foot (lb/ft³) to kilogram per cubic metre = 1.601 846 E+01.
		{"lb/ft³", us.Unit(Density).ToSI, 1.601846e1, 5e-7},
		// B.8: foot per second squared (ft/s²) to metre per second squared = 3.048 E-01, exact.
		{"ft/s²", us.Unit(Acceleration).ToSI, 0.3048, 1e-15},
		// B.9 (temperature interval): 1 °F = 5/9 K; so 1/°F = 1.8/K.
		{"°F difference", us.Unit(TemperatureChange).ToSI, 5.0 / 9.0, 1e-15},
		{"1/°F", us.Unit(ThermalExpansion).ToSI, 1.8, 1e-15},
		// B.8: standard acceleration of gravity (gₙ) = 9.806 65 E+00 m/s², exact.
		{"g", extra(t, Acceleration, "g").ToSI, 9.80665, 1e-15},
		// B.8: foot pound-force (ft·lbf) to joule = 1.355 818 E+00.
		{"ft·lbf", extra(t, Energy, "ft·lbf").ToSI, 1.355818, 5e-7},
		// B.8: pound-force per square inch (psi) to pascal = 6.894 757 E+03.
		{"psi", extra(t, Stress, "psi").ToSI, 6.894757e3, 5e-7},
		// B.8: pound-force per square foot to pascal = 4.788 026 E+01, so a
		// kip per foot of member per foot of deflection is 4.788 026 E+04 N/m².
		{"kip/ft²", USCustomary.Unit(FoundationModulus).ToSI, 4.788026e4, 5e-7},
	}
	for _, c := range cases {
		if rel := math.Abs(c.got-c.want) / c.want; rel > c.relative {
			t.Errorf("%s: factor %.16g, NIST SP 811 gives %.16g (relative difference %.2g > %.1g)",
				c.name, c.got, c.want, rel, c.relative)
		}
	}
}

// A stiffness reads in the units of what it relates: a translational
// spring in force per deflection unit, a rotational one in moment per
// radian, so a spring's force k·w and moment k·θ come out in the units the
// reactions are printed in (dimensional consistency, common practice).
func TestStiffnessUnitsFollowForceMomentAndDeflection(t *testing.T) {
	for _, s := range Systems() {
		if got, want := s.Unit(RotationalStiffness).Symbol, s.Unit(Moment).Symbol+"/rad"; got != want {
			t.Errorf("%s: rotational stiffness in %s, want %s", s.Name, got, want)
		}
		if got, want := s.Unit(RotationalStiffness).ToSI, s.Unit(Moment).ToSI; math.Abs(got-want) > 1e-15*want {
			t.Errorf("%s: rotational stiffness factor %g, want the moment's %g", s.Name, got, want)
		}
	}
}

func extra(t *testing.T, q Kind, symbol string) Unit {
	t.Helper()
	u, ok := lookUp(q, symbol)
	if !ok {
		t.Fatalf("no unit %q for %s", symbol, q)
	}
	return u
}

// SI display units are decimal multiples of the base units: the SI Brochure
// prefixes (NIST SP 811, Sec. 4.3 table 5, from memory).
func TestSIDisplayFactors(t *testing.T) {
	want := map[Kind]float64{
		Position: 1, Dimension: 1e-3, Deflection: 1e-3, Force: 1e3, Moment: 1e3,
		LineLoad: 1e3, Stress: 1e6, Modulus: 1e9, Area: 1e-6, SecondMoment: 1e-6,
		SectionModulus: 1e-6, TranslationalStiffness: 1e3, RotationalStiffness: 1e3,
		FoundationModulus: 1e3,
	}
	for q, f := range want {
		if got := SI.Unit(q).ToSI; got != f {
			t.Errorf("SI %s: factor %g, want %g", q, got, f)
		}
	}
}

func TestEveryKindHasUnits(t *testing.T) {
	for _, s := range Systems() {
		for _, q := range Kinds() {
			u := s.Unit(q)
			if u.Symbol == "" || !(u.ToSI > 0) {
				t.Errorf("%s: %s has no unit (%+v)", s.Name, q, u)
			}
			if strings.HasPrefix(q.String(), "unknown") {
				t.Errorf("quantity %d has no name", int(q))
			}
		}
	}
}

func TestRoundTrip(t *testing.T) {
	values := []float64{0, 1, -12.5, 3.7e-9, 2.1e11, 7850}
	for _, s := range Systems() {
		for _, q := range Kinds() {
			for _, v := range values {
				back := s.FromDisplay(q, s.ToDisplay(q, v))
				if math.Abs(back-v) > 1e-14*math.Abs(v) {
					t.Errorf("%s %s: %g -> %g -> %g", s.Name, q, v, s.ToDisplay(q, v), back)
				}
				parsed, err := s.Parse(q, FormatNumber(s.ToDisplay(q, v))+" "+s.Unit(q).Symbol)
				if err != nil {
					t.Errorf("%s %s: Parse(Format(%g)): %v", s.Name, q, v, err)
					continue
				}
				// Format keeps four significant figures.
				if math.Abs(parsed-v) > 5e-4*math.Abs(v) {
					t.Errorf("%s %s: Parse(Format(%g)) = %g", s.Name, q, v, parsed)
				}
			}
		}
	}
}

func TestByName(t *testing.T) {
	for _, name := range []string{"SI", "US"} {
		s, ok := ByName(name)
		if !ok || s.Name != name {
			t.Errorf("ByName(%q) = %v, %v", name, s.Name, ok)
		}
	}
	if _, ok := ByName("imperial"); ok {
		t.Error("ByName(imperial) found a system")
	}
}

func TestFormat(t *testing.T) {
	cases := []struct {
		s    System
		q    Kind
		vSI  float64
		want string
	}{
		{SI, Moment, -12500, "-12.50 kN·m"},
		{SI, Force, 0, "0 kN"},
		{SI, Stress, 235e6, "235.0 MPa"},
		{SI, Modulus, 210e9, "210.0 GPa"},
		{SI, Deflection, -0.0123456, "-12.35 mm"},
		{SI, Position, 3, "3.000 m"},
		{SI, SecondMoment, 83.56e-6, "83.56 10⁶ mm⁴"},
		{SI, Stress, 1.23456e-3, "1.235e-09 MPa"},
		{SI, Force, 9999.6, "10.00 kN"},
		{SI, Area, 1e3, "1.000e+09 mm²"},
		// 1 kip exactly.
		{USCustomary, Force, 4448.2216152605, "1.000 kip"},
		// 10 ft = 3.048 m exactly.
		{USCustomary, Position, 3.048, "10.00 ft"},
		// 36 ksi, a common yield stress, is 248.2 MPa.
		{USCustomary, Stress, 248.2e6, "36.00 ksi"},
	}
	for _, c := range cases {
		if got := c.s.Format(c.q, c.vSI); got != c.want {
			t.Errorf("%s Format(%s, %g) = %q, want %q", c.s.Name, c.q, c.vSI, got, c.want)
		}
	}
}

func TestParse(t *testing.T) {
	cases := []struct {
		s    System
		q    Kind
		text string
		want float64 // SI
	}{
		{SI, Force, "12", 12e3},
		{SI, Force, "12 kN", 12e3},
		{SI, Force, "12kN", 12e3},
		{SI, Force, "1 kip", 4448.2216152605},
		{SI, Force, "−2.5 kN", -2.5e3},
		{SI, Force, "-2.5e3 N", -2.5e3},
		{SI, Position, "3.5 ft", 3.5 * 0.3048},
		{SI, Position, "1200 mm", 1.2},
		{USCustomary, Position, "10", 3.048},
		{USCustomary, Position, "3 m", 3},
		{SI, Moment, "4 kN*m", 4e3},
		{SI, Moment, "4 kN.m", 4e3},
		{SI, Moment, "4 kN m", 4e3},
		{SI, SecondMoment, "8356 cm^4", 8356e-8},
		{SI, SecondMoment, "83.56", 83.56e-6},
		{SI, SecondMoment, "300 in4", 300 * math.Pow(0.0254, 4)},
		{SI, Modulus, "2.1e5 MPa", 2.1e11},
		{SI, Modulus, "29000 ksi", 29000 * 6894757.293168361},
		{USCustomary, Stress, "50", 50 * 6894757.293168361},
		{SI, TemperatureChange, "18 °F", 10},
		{SI, ThermalExpansion, "6.5e-6 1/°F", 1.17e-5},
		{SI, Acceleration, "1 g", 9.80665},
		{SI, Density, "490 lb/ft³", 490 * 16.018463373960138},
		{SI, LineLoad, "1 kip/ft", 4448.2216152605 / 0.3048},
		{SI, Stress, "355 N/mm²", 355e6},
		{SI, Deflection, "  .5 in ", 0.0127},
	}
	for _, c := range cases {
		got, err := c.s.Parse(c.q, c.text)
		if err != nil {
			t.Errorf("%s Parse(%s, %q): %v", c.s.Name, c.q, c.text, err)
			continue
		}
		if math.Abs(got-c.want) > 1e-12*math.Abs(c.want) {
			t.Errorf("%s Parse(%s, %q) = %.15g, want %.15g", c.s.Name, c.q, c.text, got, c.want)
		}
	}
}

// A typed minus zero is zero: it must not come back as "-0.0 m" in what
// the program says about the value.
func TestParseMinusZero(t *testing.T) {
	for _, text := range []string{"-0", "-0 m", "−0.0", "-0e3 mm"} {
		v, err := SI.Parse(Position, text)
		if err != nil || v != 0 || math.Signbit(v) {
			t.Errorf("Parse(position, %q) = %v, %v; want +0", text, v, err)
		}
	}
}

func TestParseErrors(t *testing.T) {
	cases := []struct {
		q       Kind
		text    string
		message string
	}{
		{Force, "abc", "expected a force such as 12 kN; got 'abc'"},
		{Force, "", "expected a force such as 12 kN; got ''"},
		{Force, "12 m", "'12 m' is a position, but force is expected here"},
		{Area, "12 furlongs", "unknown unit 'furlongs' for an area"},
		{Stress, "1e999 MPa", "expected a finite stress"},
		// A decimal comma, or a thousands separator, is not a unit.
		{Position, "1,5", "use a point for decimals, such as 1.5, and no thousands separator; got '1,5'"},
		{Force, "1,000 kN", "use a point for decimals, such as 1.5, and no thousands separator; got '1,000 kN'"},
	}
	for _, c := range cases {
		_, err := SI.Parse(c.q, c.text)
		if err == nil {
			t.Errorf("Parse(%s, %q) accepted it", c.q, c.text)
			continue
		}
		if !strings.Contains(err.Error(), c.message) {
			t.Errorf("Parse(%s, %q) error %q, want it to contain %q", c.q, c.text, err, c.message)
		}
	}
}

// A length typed in feet or inches is stored as the metre value the exact
// definition gives (1 ft = 0.3048 m, 1 in = 0.0254 m, NIST SP 811 Appendix
// B): the nearest double to n × 0.0381 m for n/8 ft, so a file holds
// 3.6576 for 12 ft, not 3.6576000000000004 (12 × 0.3048 in floating point).
// The expected value is the decimal n·381 × 10⁻⁴ written out by integer
// arithmetic and read by strconv.
func TestParseFeetAndInchesExactly(t *testing.T) {
	for n := 1; n <= 4000; n++ {
		feet := strconv.FormatFloat(float64(n)/8, 'f', -1, 64)
		want, _ := strconv.ParseFloat(fmt.Sprintf("%d.%04d", n*381/10000, n*381%10000), 64)
		for _, text := range []string{feet, feet + " ft", strconv.FormatFloat(float64(n)*1.5, 'f', -1, 64) + " in"} {
			got, err := USCustomary.Parse(Position, text)
			if err != nil || got != want {
				t.Fatalf("%q: %.17g (%v), want %.17g", text, got, err, want)
			}
		}
	}
	// Any other factor of a finite decimal: the exact product, rounded once.
	// 5 kip·ft is 5 × 4448.2216152605 × 0.3048 N·m = 6779.089741657002
	// exactly, 3 lbf·in is 3 × 4.4482216152605 × 0.0254 = 0.3389544870828501.
	for _, c := range []struct {
		q    Kind
		text string
		want float64
	}{
		{Moment, "5 kip·ft", 6779.089741657002},
		{Force, "0.1 kip", 444.82216152605},
		{Dimension, "0.3 in", 0.00762},
		{Position, "1e-3 ft", 0.0003048},
		{Moment, "3 lbf·in", 0.3389544870828501},
	} {
		got, err := USCustomary.Parse(c.q, c.text)
		if err != nil || got != c.want {
			t.Errorf("%q: %.17g (%v), want %.17g", c.text, got, err, c.want)
		}
	}
}
