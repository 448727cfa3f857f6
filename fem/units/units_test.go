package units

import (
	"fmt"
	"math"
	"math/big"
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

// Show writes a power of ten in a unit with its multiplication sign, and
// leaves every other value as Format writes it. 83.56e-6 m⁴ is 83.56 × 10⁶
// mm⁴ and 1.5e-3 m³ is 1500 × 10³ mm³ (powers of ten; from memory).
func TestShow(t *testing.T) {
	cases := []struct {
		s    System
		q    Kind
		vSI  float64
		want string
	}{
		{SI, SecondMoment, 83.56e-6, "83.56 × 10⁶ mm⁴"},
		{SI, SectionModulus, 1.5e-3, "1500 × 10³ mm³"},
		{SI, Moment, -12500, "-12.50 kN·m"},
		// in⁴ has no power of ten: as Format writes it.
		{USCustomary, SecondMoment, 0.0001, USCustomary.Format(SecondMoment, 0.0001)},
	}
	for _, c := range cases {
		if got := c.s.Show(c.q, c.vSI); got != c.want {
			t.Errorf("%s Show(%s, %g) = %q, want %q", c.s.Name, c.q, c.vSI, got, c.want)
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
		// Finite as typed, too large once converted: it read +Inf.
		{Force, "1e308 MN", "expected a finite force such as 12 kN; got '1e308 MN'"},
		{Force, "1.7e308 kips", "expected a finite force"},
		{Stress, "1e303 ksi", "expected a finite stress"},
		{Modulus, "9e299 GPa", "expected a finite modulus"}, // by the exact product
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

// si is the SI value of a typed decimal number times a factor written as
// decimals joined by '*' and '/' ("4448.2216152605/0.3048"), worked out
// exactly and rounded once; finite tells whether the factor is a finite
// decimal, so that Parse's single rounding must give exactly this.
func si(t *testing.T, number, factor string) (want float64, finite bool) {
	t.Helper()
	v, ok := new(big.Rat).SetString(number)
	if !ok {
		t.Fatalf("bad number %q", number)
	}
	finite = true
	for i, part := range strings.FieldsFunc(factor, func(r rune) bool { return r == '*' || r == '/' }) {
		f, ok := new(big.Rat).SetString(part)
		if !ok {
			t.Fatalf("bad factor %q", factor)
		}
		divide := i > 0 && factor[strings.Index(factor, part)-1] == '/'
		if divide {
			v.Quo(v, f)
			finite = false
		} else {
			v.Mul(v, f)
		}
	}
	want, _ = v.Float64()
	return want, finite
}

// US spellings of units, read as the units they spell. The factors are the
// exact definitions of NIST Special Publication 811 (2008), Appendix B.8
// (from memory): 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 lb = 0.45359237 kg,
// 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N, 1 kip = 1000
// lbf; a temperature interval of 1 °F is 5/9 K (B.9, from memory). A factor
// that is a finite decimal (kip·ft, ft, in) gives the typed value times it
// exactly, rounded once; a quotient (kip/ft, psf, °F) gives it within the
// rounding of the factor itself, two units in the last place.
func TestParseUSSpellings(t *testing.T) {
	const (
		lbf    = "4.4482216152605"
		kip    = "4448.2216152605"
		ft     = "0.3048"
		in     = "0.0254"
		lbMass = "0.45359237"
	)
	cases := []struct {
		s      System
		q      Kind
		text   string
		number string
		factor string
	}{
		// Moments: kip·ft, kip·in, lbf·ft, lbf·in, either way round, hyphenated, plural.
		{USCustomary, Moment, "5 kip-ft", "5", kip + "*" + ft},
		{SI, Moment, "5 ft-kip", "5", kip + "*" + ft},
		{SI, Moment, "5 k-ft", "5", kip + "*" + ft},
		{SI, Moment, "5 ft-k", "5", kip + "*" + ft},
		{SI, Moment, "5 kip·ft", "5", kip + "*" + ft},
		{SI, Moment, "5 kips-ft", "5", kip + "*" + ft},
		{SI, Moment, "5 ft-kips", "5", kip + "*" + ft},
		{SI, Moment, "60 kip-in", "60", kip + "*" + in},
		{SI, Moment, "60 in-kips", "60", kip + "*" + in},
		{SI, Moment, "60 k-in", "60", kip + "*" + in},
		// 1200 lbf·ft read 1626.9815379976803 N·m, one unit in the last place
		// off: the factor went by its float64's shortest decimal,
		// 1.3558179483314003, not the exact 1.3558179483314004.
		{SI, Moment, "1200 lbf·ft", "1200", lbf + "*" + ft},
		{SI, Moment, "1200 lb-ft", "1200", lbf + "*" + ft},
		{SI, Moment, "1200 ft-lbs", "1200", lbf + "*" + ft},
		{SI, Moment, "100 in-lb", "100", lbf + "*" + in},
		{SI, RotationalStiffness, "3e4 kip-ft/rad", "3e4", kip + "*" + ft},
		{SI, RotationalStiffness, "3e4 ft-kips/rad", "3e4", kip + "*" + ft},
		{SI, Energy, "5 in-kips", "5", kip + "*" + in},
		{SI, Energy, "5 kip-ft", "5", kip + "*" + ft},
		{SI, RotationalStiffness, "3e4 lbf·in/rad", "3e4", lbf + "*" + in},
		// Forces: kips, and lb or lbs for the pound-force.
		{SI, Force, "3 kips", "3", kip},
		{USCustomary, Force, "3.5 kips", "3.5", kip},
		{SI, Force, "500 lb", "500", lbf},
		{SI, Force, "500 lbs", "500", lbf},
		// Line loads: plf, klf, k/ft, kips/ft, lb/ft.
		{SI, LineLoad, "200 plf", "200", lbf + "/" + ft},
		{SI, LineLoad, "2 klf", "2", kip + "/" + ft},
		{SI, LineLoad, "2 k/ft", "2", kip + "/" + ft},
		{USCustomary, LineLoad, "2 kips/ft", "2", kip + "/" + ft},
		{SI, LineLoad, "200 lbs/ft", "200", lbf + "/" + ft},
		{SI, TranslationalStiffness, "10 k/in", "10", kip + "/" + in},
		// Pressures: psf, ksf, for a stress, a modulus, a foundation modulus.
		{SI, Stress, "50 psf", "50", lbf + "/" + ft + "/" + ft},
		{SI, Stress, "2 ksf", "2", kip + "/" + ft + "/" + ft},
		{SI, Modulus, "500 ksf", "500", kip + "/" + ft + "/" + ft},
		{SI, FoundationModulus, "2 ksf", "2", kip + "/" + ft + "/" + ft},
		// Density: pcf, lb/ft³ with the pound as a mass.
		{SI, Density, "150 pcf", "150", lbMass + "/" + ft + "/" + ft + "/" + ft},
		{SI, Density, "150 lbs/ft^3", "150", lbMass + "/" + ft + "/" + ft + "/" + ft},
		// Temperature changes and expansion: degF, F, /°F, 1/F.
		{SI, TemperatureChange, "18 degF", "18", "5/9"},
		{SI, TemperatureChange, "18 deg F", "18", "5/9"},
		{SI, TemperatureChange, "18 F", "18", "5/9"},
		{USCustomary, TemperatureChange, "18 °F", "18", "5/9"},
		{USCustomary, TemperatureChange, "10 degC", "10", "1"},
		{SI, ThermalExpansion, "6.5e-6 /°F", "6.5e-6", "1.8"},
		{SI, ThermalExpansion, "6.5e-6 1/F", "6.5e-6", "1.8"},
		{SI, ThermalExpansion, "6.5e-6 /F", "6.5e-6", "1.8"},
		{SI, ThermalExpansion, "6.5e-6 1/degF", "6.5e-6", "1.8"},
		{USCustomary, ThermalExpansion, "1.2e-5 /°C", "1.2e-5", "1"},
		// Feet and inches, for lengths.
		{SI, Position, "12'", "12", ft},
		{SI, Position, "12′", "12", ft},
		{SI, Position, `3"`, "3", in},
		{SI, Position, "3''", "3", in},
		{SI, Position, `12' 3"`, "147", in},
		{SI, Position, `12'3"`, "147", in},
		{SI, Position, `12'-3"`, "147", in},
		{SI, Position, "12′ 3″", "147", in},
		{SI, Position, "12 ft 3 in", "147", in},
		{SI, Position, "12 ft - 3 in", "147", in},
		{SI, Position, `-12' 3"`, "-147", in},
		{SI, Position, `-0' 3"`, "-3", in},
		{USCustomary, Position, `0' 7.5"`, "7.5", in},
		{USCustomary, Position, `1e1' 11.25"`, "131.25", in},
		{SI, Dimension, `14"`, "14", in},
		{SI, Deflection, `0.75"`, "0.75", in},
		{USCustomary, Dimension, `1' 2"`, "14", in},
	}
	for _, c := range cases {
		want, finite := si(t, c.number, c.factor)
		got, err := c.s.Parse(c.q, c.text)
		if err != nil {
			t.Errorf("%s Parse(%s, %q): %v", c.s.Name, c.q, c.text, err)
			continue
		}
		tolerance := 0.0
		if !finite {
			tolerance = 2 * (math.Nextafter(math.Abs(want), math.Inf(1)) - math.Abs(want))
		}
		if math.Abs(got-want) > tolerance {
			t.Errorf("%s Parse(%s, %q) = %.17g, want %.17g (%s × %s)", c.s.Name, c.q, c.text, got, want, c.number, c.factor)
		}
	}
}

// What is still refused says why: a unit of another kind names its kind.
func TestParseUSSpellingsRefused(t *testing.T) {
	cases := []struct {
		q       Kind
		text    string
		message string
	}{
		// "12k" is as often twelve thousand as twelve kips.
		{Force, "3 k", "k alone could be a kip or a thousand; write the unit in full (for a force: "},
		{Force, "12k", "'12k': k alone could be a kip or a thousand"},
		{Force, `12' 3"`, `'12' 3"' is a position, but force is expected here`},
		{Force, "12 psf", "'12 psf' is a stress, but force is expected here"},
		{Stress, "150 pcf", "'150 pcf' is a density, but stress is expected here"},
		{Moment, "2 klf", "'2 klf' is a line load, but moment is expected here"},
		{Position, "18 degF", "'18 degF' is a temperature change, but position is expected here"},
		{TemperatureChange, "6.5e-6 /°F", "is a thermal expansion coefficient, but temperature change is expected here"},
		// lb is the pound-force only where a force is meant: a density is a mass per volume.
		{Density, "150 lb", "'150 lb' is a force, but density is expected here"},
		{Position, `12' 13"`, `the inches after the feet in '12' 13"' must be a number under 12`},
		{Position, `12' 3 1/2"`, "fractions are not read; type a decimal, such as 3.5 for 3 1/2"},
		{Dimension, `1/2"`, "fractions are not read"},
		{Position, "12 -ft", "unknown unit '-ft' for a position"},
		// Units typed apart are their product (as in "kN m"), which no unit
		// of one symbol is: "2 m m" read as 2 mm, a thousandth of it.
		{Position, "2 m m", "unknown unit 'm m' for a position"},
		{Position, "2 m*m", "unknown unit 'm*m' for a position"},
		{Dimension, "2 m.m", "unknown unit 'm.m' for a section dimension"},
		{Area, "2 m·m", "unknown unit 'm·m' for an area"},
		{Position, "12 ft 3", "unknown unit 'ft 3' for a position"},
	}
	for _, c := range cases {
		v, err := SI.Parse(c.q, c.text)
		if err == nil {
			t.Errorf("Parse(%s, %q) accepted it as %g", c.q, c.text, v)
			continue
		}
		if !strings.Contains(err.Error(), c.message) {
			t.Errorf("Parse(%s, %q) error %q, want it to contain %q", c.q, c.text, err, c.message)
		}
	}
}

// Parse never panics, and what it accepts is a finite number.
func FuzzParse(f *testing.F) {
	for _, seed := range []string{"12 kN", "5 kip-ft", `12' 3"`, "12 ft 3 in", `-0' 3"`, "6.5e-6 /°F", "3 kips/ft", "12k", `3 1/2"`, "'", `1e999' 1"`, "1' -"} {
		f.Add(int(Position), seed)
	}
	f.Add(int(Force), "1e308 MN")
	f.Add(int(Moment), "2 ft-lbs")
	f.Fuzz(func(t *testing.T, kind int, text string) {
		for _, s := range Systems() {
			v, err := s.Parse(Kind(kind), text)
			if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Errorf("%s Parse(%d, %q) = %g", s.Name, kind, text, v)
			}
		}
	})
}

// Every factor of a force in lbf or kip times a length in ft or in, as the
// tables hold it, is found among the long decimals with its exact value
// (NIST SP 811 (2008), Appendix B.8 definitions, from memory).
func TestLongDecimalsAreTheTablesFactors(t *testing.T) {
	for _, c := range []struct {
		q      Kind
		symbol string
		exact  string
	}{
		{Moment, "kip·ft", "1355.8179483314004"},
		{Moment, "kip·in", "112.9848290276167"},
		{Moment, "lbf·ft", "1.3558179483314004"},
		{Moment, "lbf·in", "0.1129848290276167"},
	} {
		f, ok := longDecimals[extra(t, c.q, c.symbol).ToSI]
		want, _ := new(big.Rat).SetString(c.exact)
		if !ok || f.Cmp(want) != 0 {
			t.Errorf("%s: long decimal %v (found %v), want %s", c.symbol, f, ok, c.exact)
		}
	}
}

// Count names one of a noun in the singular and any other number in the
// plural: "Mesh: 1 element, 2 nodes", not "1 elements".
func TestCount(t *testing.T) {
	for _, c := range []struct {
		n    int
		want string
	}{{0, "0 elements"}, {1, "1 element"}, {2, "2 elements"}, {1000, "1000 elements"}} {
		if got := Count(c.n, "element"); got != c.want {
			t.Errorf("Count(%d) = %q, want %q", c.n, got, c.want)
		}
	}
}

// A value that lies halfway between two spellings of four figures prints
// one way, whatever round-off its computation left in the last bits: the
// exact and the finite element solutions of one propped cantilever give its
// fixed-end stress 3PL/16·c/I = 16.875 MPa (P = 10 kN, L = 6 m, c = 0.15 m,
// I = 1e-4 m⁴; AISC Manual, Beam Diagrams and Formulas, case 13, from
// memory) as 16874999.999999996 and 16875000 Pa, and a three-span beam's
// end rotation wL³/(40EI) = 0.0015625 rad (w = 10 kN/m, L = 5 m, EI = 2e7
// N·m²; slope-deflection with support moments wL²/10, from memory) as
// 0.0015625000000000018 and 0.0015624999999999999 rad. Round-off stays
// below twelve figures; the half is rounded away from zero, as by hand
// (ISO 80000-1:2009 Annex B, rule B, from memory).
func TestFormatHalfwayIsOneSpelling(t *testing.T) {
	cases := []struct {
		s    System
		q    Kind
		near float64
		want string
	}{
		{SI, Stress, 16.875e6, "16.88 MPa"},
		{SI, Stress, -16.875e6, "-16.88 MPa"},
		{SI, Rotation, 0.0015625, "0.001563 rad"},
		{SI, Rotation, -0.0015625, "-0.001563 rad"},
		{SI, Force, 12345, "12.35 kN"},
	}
	for _, c := range cases {
		for _, ulps := range []float64{-4, -1, 0, 1, 4} {
			v := c.near + ulps*(math.Nextafter(c.near, math.Inf(1))-c.near)
			if got := c.s.Format(c.q, v); got != c.want {
				t.Errorf("%s Format(%s, %.17g) = %q, want %q", c.s.Name, c.q, v, got, c.want)
			}
		}
	}
}

// Lookup gives the unit Parse reads a symbol as, for other packages that
// need a unit's factor (the material cautions' unit slips); it knows only
// the units Parse takes for that kind of value.
func TestLookup(t *testing.T) {
	const (
		lbf  = 4.4482216152605 // N, NIST SP 811 (2008) Appendix B, exact from lb and gₙ
		inch = 0.0254          // m, NIST SP 811 (2008) Appendix B, exact
		foot = 0.3048          // m, NIST SP 811 (2008) Appendix B, exact
		lb   = 0.45359237      // kg, NIST SP 811 (2008) Appendix B, exact
	)
	for _, c := range []struct {
		q      Kind
		symbol string
		ok     bool
		want   float64 // ToSI when ok
	}{
		{Modulus, "psi", true, lbf / (inch * inch)},
		{Modulus, "MPa", true, 1e6}, // SI prefix mega, NIST SP 811 Sec. 4.3, from memory
		{Density, "pcf", true, lb / (foot * foot * foot)},
		{Density, "lb/ft^3", true, lb / (foot * foot * foot)},
		{Density, "t/m³", false, 0},
		{Modulus, "kN", false, 0},
		{Kind(-1), "Pa", false, 0},
	} {
		u, ok := Lookup(c.q, c.symbol)
		if ok != c.ok || ok && math.Abs(u.ToSI-c.want) > 1e-15*c.want {
			t.Errorf("Lookup(%s, %q) = %+v, %v; want ToSI %.16g, %v", c.q, c.symbol, u, ok, c.want, c.ok)
		}
	}
}

// FormatG writes a finite value as fmt does and one that is not finite in
// words, where fmt writes "+Inf", "-Inf" or "NaN" (Go's fmt package
// documentation, from memory): a condition number of a singular system
// read "condition number +Inf after scaling".
func TestFormatG(t *testing.T) {
	for _, c := range []struct {
		format string
		v      float64
		want   string
	}{
		{"%.3g", 1.23456e13, "1.23e+13"},
		{"%.2g", 0.5, "0.5"},
		{"%+.3g %%", -2.5, "-2.5 %"},
		{"%.0e", 1e-3, "1e-03"},
		{"%.3g", math.Inf(1), "infinite"},
		{"%.3g %%", math.Inf(-1), "minus infinite"},
		{"%.2g", math.NaN(), "undefined"},
	} {
		if got := FormatG(c.format, c.v); got != c.want {
			t.Errorf("FormatG(%q, %g) = %q, want %q", c.format, c.v, got, c.want)
		}
	}
	// The display units say it alike: a limit that overflowed read "+Inf MPa".
	if got := SI.Format(Stress, math.Inf(1)); got != "infinite MPa" {
		t.Errorf("an infinite stress reads %q, want %q", got, "infinite MPa")
	}
}
