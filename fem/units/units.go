// Package units converts Stave's SI values to and from the units an engineer
// reads and types, in two systems of display units: SI (m, mm, kN, MPa, ...)
// and US customary (ft, in, kip, ksi, ...).
//
// The fem package works in base SI units only (m, N, Pa, kg, K, s, J). This
// package sits at the edges: input fields call Parse, panels and reports call
// Format. Each value a user sees is of one Kind (a force, a moment, a
// stress...); a System maps every Kind to one Unit.
//
// A Unit is a symbol and one factor, ToSI: SI value = display value × ToSI.
// Every factor is exact, derived from the defining values of NIST Special
// Publication 811 (2008), Appendix B: 1 ft = 0.3048 m, 1 in = 0.0254 m,
// 1 lb = 0.45359237 kg, gₙ = 9.80665 m/s², hence 1 lbf = 4.4482216152605 N.
// Temperatures are only ever differences here (a change of temperature, and
// expansion per degree), so there is no offset: 1 °F difference = 5/9 K.
package units

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Kind names the kind of a value (a position, a force, a stress...), which
// picks its display unit.
type Kind int

// Kinds of value Stave displays.
const (
	Position               Kind = iota // x along the member (m / ft)
	Dimension                          // section dimensions (mm / in)
	Deflection                         // displacements (mm / in)
	Rotation                           // rad in both systems
	Force                              // kN / kip
	Moment                             // kN·m / kip·ft
	LineLoad                           // kN/m / kip/ft
	Stress                             // MPa / ksi
	Modulus                            // GPa / ksi
	Area                               // mm² / in²
	SecondMoment                       // 10⁶ mm⁴ / in⁴
	SectionModulus                     // 10³ mm³ / in³
	Density                            // kg/m³ / lb/ft³
	ThermalExpansion                   // 1/K / 1/°F
	TemperatureChange                  // K / °F (differences)
	TranslationalStiffness             // kN/m / kip/in
	RotationalStiffness                // kN·m/rad / kip·ft/rad, as the moments
	Acceleration                       // m/s² / ft/s²
	Energy                             // J / kip·in
	FoundationModulus                  // kN/m² / kip/ft²: force per length of member per deflection
	kindCount
)

var kindNames = [kindCount]string{
	"position", "section dimension", "deflection", "rotation", "force", "moment",
	"line load", "stress", "modulus", "area", "second moment of area",
	"section modulus", "density", "thermal expansion coefficient",
	"temperature change", "translational stiffness", "rotational stiffness",
	"acceleration", "energy", "foundation modulus",
}

// String names the quantity in plain words, for messages.
func (q Kind) String() string {
	if q < 0 || q >= kindCount {
		return "unknown quantity"
	}
	return kindNames[q]
}

// Kinds lists every Kind in declaration order.
func Kinds() []Kind {
	qs := make([]Kind, kindCount)
	for i := range qs {
		qs[i] = Kind(i)
	}
	return qs
}

// Unit is a display unit: SI value = display value × ToSI.
type Unit struct {
	Symbol string
	ToSI   float64
}

// Defining values, NIST SP 811 (2008), Appendix B.8 (exact by definition).
const (
	foot            = 0.3048     // m
	inch            = 0.0254     // m
	pound           = 0.45359237 // kg (avoirdupois pound, mass)
	standardGravity = 9.80665    // m/s²
	poundForce      = pound * standardGravity
	kip             = 1000 * poundForce
	fahrenheitStep  = 5.0 / 9.0 // K per °F of difference
)

// System is a consistent set of display units, one per Kind.
type System struct {
	Name  string
	Units [kindCount]Unit
}

// SI shows positions in m and section dimensions and deflections in mm.
// Second moments and section moduli are in 10⁶ mm⁴ and 10³ mm³, the way
// metric steel section tables print them (CISC Handbook of Steel Construction,
// AISC metric tables; from memory): an IPE 300 reads 83.56 rather than 83560000.
// Treat as read-only.
var SI = System{Name: "SI", Units: [kindCount]Unit{
	Position:               {"m", 1},
	Dimension:              {"mm", 1e-3},
	Deflection:             {"mm", 1e-3},
	Rotation:               {"rad", 1},
	Force:                  {"kN", 1e3},
	Moment:                 {"kN·m", 1e3},
	LineLoad:               {"kN/m", 1e3},
	Stress:                 {"MPa", 1e6},
	Modulus:                {"GPa", 1e9},
	Area:                   {"mm²", 1e-6},
	SecondMoment:           {"10⁶ mm⁴", 1e-6},
	SectionModulus:         {"10³ mm³", 1e-6},
	Density:                {"kg/m³", 1},
	ThermalExpansion:       {"1/K", 1},
	TemperatureChange:      {"K", 1},
	TranslationalStiffness: {"kN/m", 1e3},
	RotationalStiffness:    {"kN·m/rad", 1e3},
	Acceleration:           {"m/s²", 1},
	Energy:                 {"J", 1},
	FoundationModulus:      {"kN/m²", 1e3},
}}

// USCustomary uses ft for positions, in for dimensions and deflections, kips
// and ksi, as US structural practice does. Treat as read-only.
var USCustomary = System{Name: "US", Units: [kindCount]Unit{
	Position:               {"ft", foot},
	Dimension:              {"in", inch},
	Deflection:             {"in", inch},
	Rotation:               {"rad", 1},
	Force:                  {"kip", kip},
	Moment:                 {"kip·ft", kip * foot},
	LineLoad:               {"kip/ft", kip / foot},
	Stress:                 {"ksi", kip / (inch * inch)},
	Modulus:                {"ksi", kip / (inch * inch)},
	Area:                   {"in²", inch * inch},
	SecondMoment:           {"in⁴", inch * inch * inch * inch},
	SectionModulus:         {"in³", inch * inch * inch},
	Density:                {"lb/ft³", pound / (foot * foot * foot)},
	ThermalExpansion:       {"1/°F", 1 / fahrenheitStep},
	TemperatureChange:      {"°F", fahrenheitStep},
	TranslationalStiffness: {"kip/in", kip / inch},
	RotationalStiffness:    {"kip·ft/rad", kip * foot},
	Acceleration:           {"ft/s²", foot},
	Energy:                 {"kip·in", kip * inch},
	FoundationModulus:      {"kip/ft²", kip / (foot * foot)},
}}

// Base shows every value in the SI base units the fem package works in
// (m, N, N·m, Pa, ...), as a file holds them: the units of messages that
// are not shown in a system of display units. It is not a display system
// (Systems does not list it). Treat as read-only.
var Base = System{Name: "SI base", Units: [kindCount]Unit{
	Position:               {"m", 1},
	Dimension:              {"m", 1},
	Deflection:             {"m", 1},
	Rotation:               {"rad", 1},
	Force:                  {"N", 1},
	Moment:                 {"N·m", 1},
	LineLoad:               {"N/m", 1},
	Stress:                 {"Pa", 1},
	Modulus:                {"Pa", 1},
	Area:                   {"m²", 1},
	SecondMoment:           {"m⁴", 1},
	SectionModulus:         {"m³", 1},
	Density:                {"kg/m³", 1},
	ThermalExpansion:       {"1/K", 1},
	TemperatureChange:      {"K", 1},
	TranslationalStiffness: {"N/m", 1},
	RotationalStiffness:    {"N·m/rad", 1},
	Acceleration:           {"m/s²", 1},
	Energy:                 {"J", 1},
	FoundationModulus:      {"N/m²", 1},
}}

// extraUnits are further units Parse accepts for a quantity, beyond the two
// systems' own, so a user may type "300 mm" for a position or "0.3 m" for a
// depth.
var extraUnits = map[Kind][]Unit{
	Position:               {{"mm", 1e-3}, {"cm", 1e-2}, {"in", inch}},
	Dimension:              {{"m", 1}, {"cm", 1e-2}, {"ft", foot}},
	Deflection:             {{"m", 1}, {"cm", 1e-2}, {"ft", foot}},
	Force:                  {{"N", 1}, {"MN", 1e6}, {"lbf", poundForce}},
	Moment:                 {{"N·m", 1}, {"kN·mm", 1}, {"kip·in", kip * inch}, {"lbf·ft", poundForce * foot}, {"lbf·in", poundForce * inch}},
	LineLoad:               {{"N/m", 1}, {"N/mm", 1e3}, {"kip/in", kip / inch}, {"lbf/ft", poundForce / foot}},
	Stress:                 {{"Pa", 1}, {"kPa", 1e3}, {"N/mm²", 1e6}, {"GPa", 1e9}, {"psi", poundForce / (inch * inch)}},
	Modulus:                {{"Pa", 1}, {"MPa", 1e6}, {"N/mm²", 1e6}, {"psi", poundForce / (inch * inch)}},
	Area:                   {{"m²", 1}, {"cm²", 1e-4}},
	SecondMoment:           {{"mm⁴", 1e-12}, {"cm⁴", 1e-8}, {"m⁴", 1}},
	SectionModulus:         {{"mm³", 1e-9}, {"cm³", 1e-6}, {"m³", 1}},
	ThermalExpansion:       {{"1/°C", 1}},
	TemperatureChange:      {{"°C", 1}},
	TranslationalStiffness: {{"N/m", 1}, {"kN/mm", 1e6}, {"lbf/in", poundForce / inch}},
	RotationalStiffness:    {{"N·m/rad", 1}, {"kip·in/rad", kip * inch}},
	Acceleration:           {{"g", standardGravity}},
	Energy:                 {{"kJ", 1e3}, {"N·m", 1}, {"ft·lbf", foot * poundForce}},
	FoundationModulus:      {{"N/m²", 1}, {"MN/m²", 1e6}, {"kip/in²", kip / (inch * inch)}, {"lbf/in²", poundForce / (inch * inch)}},
}

// aliases are further spellings Parse reads, as US practice writes them
// (common practice): kip-ft for kip·ft, plf and klf for lbf/ft and kip/ft,
// psf, ksf and pcf, lb for the pound-force where a force is meant, F and
// degF for °F, and the foot and inch marks ' and ". They are read, never
// shown, so the messages list the symbols of the tables above. "kips" and
// "lbs" read as kip and lb wherever they stand (see singular); "k" reads as
// a kip only joined to another unit (k-ft, k/ft), where it cannot be a
// thousand. The factors are those of the units they spell, NIST SP 811
// (2008), Appendix B.
var aliases = map[Kind][]Unit{
	Position:               lengthMarks,
	Dimension:              lengthMarks,
	Deflection:             lengthMarks,
	Force:                  {{"lb", poundForce}},
	Moment:                 momentAliases,
	LineLoad:               {{"plf", poundForce / foot}, {"klf", kip / foot}, {"lb/ft", poundForce / foot}, {"k/ft", kip / foot}, {"k/in", kip / inch}},
	Stress:                 forcePerSquareFoot,
	Modulus:                forcePerSquareFoot,
	Density:                {{"pcf", pound / (foot * foot * foot)}},
	ThermalExpansion:       {{"1/F", 1 / fahrenheitStep}, {"1/degF", 1 / fahrenheitStep}, {"1/degC", 1}},
	TemperatureChange:      {{"F", fahrenheitStep}, {"degF", fahrenheitStep}, {"degC", 1}},
	TranslationalStiffness: {{"k/in", kip / inch}, {"lb/in", poundForce / inch}},
	RotationalStiffness:    perRadian(momentAliases),
	Energy:                 momentAliases,
	FoundationModulus:      forcePerSquareFoot,
}

var (
	// lengthMarks are the foot and inch marks, ASCII and typographic.
	lengthMarks = []Unit{{"'", foot}, {"′", foot}, {"’", foot}, {"\"", inch}, {"″", inch}, {"”", inch}, {"''", inch}}
	// momentAliases are a force times a length, either way round; an
	// energy and, per radian, a rotational stiffness take them all.
	momentAliases = []Unit{
		{"kip·ft", kip * foot}, {"kip·in", kip * inch}, {"lbf·ft", poundForce * foot}, {"lbf·in", poundForce * inch},
		{"ft·kip", kip * foot}, {"k·ft", kip * foot}, {"ft·k", kip * foot},
		{"in·kip", kip * inch}, {"k·in", kip * inch}, {"in·k", kip * inch},
		{"lb·ft", poundForce * foot}, {"ft·lb", poundForce * foot}, {"ft·lbf", poundForce * foot},
		{"lb·in", poundForce * inch}, {"in·lb", poundForce * inch}, {"in·lbf", poundForce * inch},
	}
	forcePerSquareFoot = []Unit{{"psf", poundForce / (foot * foot)}, {"ksf", kip / (foot * foot)}}
)

// perRadian is each of us divided by a radian.
func perRadian(us []Unit) []Unit {
	out := make([]Unit, len(us))
	for i, u := range us {
		out[i] = Unit{u.Symbol + "/rad", u.ToSI}
	}
	return out
}

// Systems lists the display systems, SI first.
func Systems() []System { return []System{SI, USCustomary} }

// ByName finds a system by its Name ("SI" or "US").
func ByName(name string) (System, bool) {
	for _, s := range Systems() {
		if s.Name == name {
			return s, true
		}
	}
	return System{}, false
}

// Unit is the display unit of q in this system.
func (s System) Unit(q Kind) Unit {
	if q < 0 || q >= kindCount {
		return Unit{Symbol: "?", ToSI: 1}
	}
	return s.Units[q]
}

// ToDisplay converts an SI value of q to this system's display unit.
func (s System) ToDisplay(q Kind, vSI float64) float64 { return vSI / s.Unit(q).ToSI }

// FromDisplay converts a value in this system's display unit of q to SI.
func (s System) FromDisplay(q Kind, v float64) float64 { return v * s.Unit(q).ToSI }

// significantFigures is what Format shows: four figures is finer than any
// load or property a member check starts from is known.
const significantFigures = 4

// Format shows an SI value of q in display units with four significant
// figures and the unit symbol, e.g. "-12.50 kN·m".
func (s System) Format(q Kind, vSI float64) string {
	return s.FormatFigures(q, vSI, significantFigures)
}

// FormatFigures is Format with the given number of significant figures
// (at least 1), for a value that four figures would not tell from another.
func (s System) FormatFigures(q Kind, vSI float64, figures int) string {
	return FormatNumberFigures(s.ToDisplay(q, vSI), figures) + " " + s.Unit(q).Symbol
}

// Show is Format for reading, not typing: a unit that starts with a power
// of ten gets its multiplication sign, "80.00 × 10⁶ mm⁴" and not
// "80.00 10⁶ mm⁴", which reads as 80.00106 or a product of two numbers.
// Parse reads Format's spelling, which a field shows.
func (s System) Show(q Kind, vSI float64) string {
	f, sym := s.Format(q, vSI), s.Unit(q).Symbol
	if strings.HasPrefix(sym, "10") && strings.HasSuffix(f, " "+sym) {
		return strings.TrimSuffix(f, sym) + "× " + sym
	}
	return f
}

// Count is n of a noun, its plural with an s: "1 element", "2 elements".
func Count(n int, noun string) string {
	if n == 1 {
		return "1 " + noun
	}
	return fmt.Sprintf("%d %ss", n, noun)
}

// FormatNumber writes v with four significant figures, in fixed notation
// between 0.001 and 10⁶ and in exponent notation outside; a value that is
// not a finite number in words (notFinite).
func FormatNumber(v float64) string { return FormatNumberFigures(v, significantFigures) }

// FormatG writes v as fmt.Sprintf(format, v) does, format holding one verb
// of the %e, %f or %g family with its flags ("%.3g", "%+.3g %%", "%.0e"),
// and a value that is not a finite number in words (notFinite), the whole
// of what it writes: a message reads "condition number infinite", not
// "+Inf".
func FormatG(format string, v float64) string {
	if w, ok := notFinite(v); ok {
		return w
	}
	return fmt.Sprintf(format, v)
}

// notFinite is v in words where it is not a finite number, which fmt and
// strconv write "+Inf", "-Inf" and "NaN", a reader may not know: an
// overflow is infinite, and a NaN (0/0, ∞ − ∞) has no value, undefined.
func notFinite(v float64) (string, bool) {
	switch {
	case math.IsInf(v, 1):
		return "infinite", true
	case math.IsInf(v, -1):
		return "minus infinite", true
	case math.IsNaN(v):
		return "undefined", true
	}
	return "", false
}

// FormatNumberFigures is FormatNumber with the given number of significant
// figures (at least 1).
func FormatNumberFigures(v float64, figures int) string {
	figures = max(figures, 1)
	if w, ok := notFinite(v); ok {
		return w
	}
	switch {
	case v == 0:
		return "0"
	}
	// Round first so 9.9996 becomes 10.00, not 9.9996 printed as "10.000".
	rounded := roundFigures(v, figures)
	exponent := int(math.Floor(math.Log10(math.Abs(rounded))))
	if exponent < -3 || exponent >= 6 {
		return strconv.FormatFloat(rounded, 'e', figures-1, 64)
	}
	return strconv.FormatFloat(rounded, 'f', max(figures-1-exponent, 0), 64)
}

// noiseFigures are the significant figures of a computed value beyond
// which its decimals are round-off: two computations of one value (the
// exact and the finite element solution) agree to about 1e-13 of its size.
const noiseFigures = 12

// roundFigures is v, finite and not zero, rounded to the given significant
// figures, a half away from zero. To fewer than noiseFigures it rounds v's
// first noiseFigures decimal figures, so that a value halfway between two
// spellings (16.875 to four figures) rounds the same way whichever side of
// the half round-off left it; to more it rounds v as it is, for a value
// told from another one just beside it (check.LimitFigures).
func roundFigures(v float64, figures int) float64 {
	if figures >= noiseFigures {
		r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'e', figures-1, 64), 64)
		return r
	}
	// |v| to noiseFigures figures, "d.ddddddddddde±XX".
	mantissa, exponent, _ := strings.Cut(strconv.FormatFloat(math.Abs(v), 'e', noiseFigures-1, 64), "e")
	digits, _ := strconv.ParseInt(strings.Replace(mantissa, ".", "", 1), 10, 64)
	e, _ := strconv.Atoi(exponent)
	drop := int64(math.Pow10(noiseFigures - figures))
	kept := digits / drop
	if 2*(digits%drop) >= drop {
		kept++
	}
	r, _ := strconv.ParseFloat(strconv.FormatInt(kept, 10)+"e"+strconv.Itoa(e-figures+1), 64)
	return math.Copysign(r, v)
}

// Parse reads text typed for a value of q and returns it in SI. A plain
// number is taken in this system's display unit; a number followed by a
// unit symbol of q from either system (or a common variant such as N, Pa,
// mm⁴) is converted from that unit: "12 kN", "3.5 ft", "2.1e5 MPa".
// Symbols may be typed in ASCII: "kN*m", "kN.m", "kN-m", "mm^4", "in4".
// US spellings are read too (see aliases): "5 kip-ft", "2 klf", "50 psf",
// and a length in feet and inches, "12' 3"" or "12 ft 3 in".
func (s System) Parse(q Kind, text string) (float64, error) {
	v, err := s.parse(q, text)
	if err == nil && math.IsInf(v, 0) {
		// A finite number can be too large once converted: 1e308 MN.
		return 0, s.notFinite(q, text)
	}
	return v, err
}

func (s System) notFinite(q Kind, text string) error {
	return fmt.Errorf("expected a finite %s such as %s; got '%s'", q, s.example(q), strings.TrimSpace(text))
}

func (s System) parse(q Kind, text string) (float64, error) {
	if q < 0 || q >= kindCount {
		return 0, fmt.Errorf("cannot read %q: unknown quantity %d", text, int(q))
	}
	number, symbol := splitNumber(text)
	v, err := strconv.ParseFloat(number, 64)
	if number == "" || (err != nil && !errors.Is(err, strconv.ErrRange)) {
		return 0, fmt.Errorf("expected %s such as %s; got '%s'", article(q), s.example(q), strings.TrimSpace(text))
	}
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, s.notFinite(q, text)
	}
	if strings.HasPrefix(symbol, ",") {
		return 0, fmt.Errorf("use a point for decimals, such as 1.5, and no thousands separator; got '%s'", strings.TrimSpace(text))
	}
	if v == 0 {
		v = 0 // a typed -0 is zero, not "-0.0 m" in what is said about it
	}
	if symbol == "" {
		return exactSum(term{number, v, s.Unit(q).ToSI}), nil
	}
	if u, ok := lookUp(q, symbol); ok {
		return exactSum(term{number, v, u.ToSI}), nil
	}
	if inches, ok := inchesAfterFeet(symbol); ok {
		return feetAndInches(q, text, number, v, inches)
	}
	if other, ok := kindOf(symbol); ok {
		return 0, wrongKind(q, other, text)
	}
	if isFraction(text) {
		return 0, fmt.Errorf("'%s': fractions are not read; type a decimal, such as 3.5 for 3 1/2", strings.TrimSpace(text))
	}
	if normalize(symbol) == "k" {
		return 0, fmt.Errorf("'%s': k alone could be a kip or a thousand; write the unit in full (for %s: %s)",
			strings.TrimSpace(text), article(q), strings.Join(Accepted(q), ", "))
	}
	return 0, fmt.Errorf("unknown unit '%s' for %s; use one of %s",
		symbol, article(q), strings.Join(Accepted(q), ", "))
}

func wrongKind(q, other Kind, text string) error {
	return fmt.Errorf("'%s' is %s, but %s is expected here; use one of %s",
		strings.TrimSpace(text), article(other), q, strings.Join(Accepted(q), ", "))
}

// isFraction tells whether text holds a digit, '/' and a digit, as in
// 3 1/2" (a unit has a letter or a mark after its '/').
func isFraction(text string) bool {
	digit := func(c byte) bool { return c >= '0' && c <= '9' }
	for i := 1; i+1 < len(text); i++ {
		if text[i] == '/' && digit(text[i-1]) && digit(text[i+1]) {
			return true
		}
	}
	return false
}

// isLength tells the kinds measured in metres, which take feet and inches.
func isLength(q Kind) bool { return q == Position || q == Dimension || q == Deflection }

// inchesAfterFeet reads the rest of a length in feet and inches, such as
// 12' 3", 12'-3" or 12 ft 3 in, after its number of feet: it returns the
// number of inches, unsigned, if symbol is a foot mark or ft, an optional
// hyphen and that number with an inch mark or in.
func inchesAfterFeet(symbol string) (string, bool) {
	for _, mark := range []string{"'", "′", "’", "ft"} {
		rest, ok := strings.CutPrefix(symbol, mark)
		if !ok {
			continue
		}
		rest = strings.TrimSpace(rest)
		if after, ok := strings.CutPrefix(rest, "-"); ok {
			rest = strings.TrimSpace(after)
		}
		if rest == "" || !(rest[0] == '.' || rest[0] >= '0' && rest[0] <= '9') {
			return "", false
		}
		inches, unit := splitNumber(rest)
		if u, ok := lookUp(Dimension, unit); ok && u.ToSI == inch {
			return inches, true
		}
	}
	return "", false
}

// feetAndInches is a length typed in feet and inches: the number of feet
// (v, typed as number) and of inches, the sign of the feet applying to the
// whole as it does to 12 ft 3 in written with a minus.
func feetAndInches(q Kind, text, number string, v float64, inches string) (float64, error) {
	if !isLength(q) {
		return 0, wrongKind(q, Position, text)
	}
	in, err := strconv.ParseFloat(inches, 64)
	if err != nil || in >= 12 {
		return 0, fmt.Errorf("the inches after the feet in '%s' must be a number under 12, such as 12' 3\"", strings.TrimSpace(text))
	}
	if strings.HasPrefix(number, "-") {
		in, inches = -in, "-"+inches
	}
	return exactSum(term{number, v, foot}, term{inches, in, inch}), nil
}

// longDecimals are the factors that are finite decimals longer than the
// shortest decimal of their float64: a force in lbf or kip times a length
// in ft or in (1 lbf·ft = 1.3558179483314004 N·m exactly, whose nearest
// float64 prints as 1.3558179483314003). Each is keyed by its float64,
// which is the nearest to the exact product, as the constant expressions
// of the tables give it.
var longDecimals = func() map[float64]*big.Rat {
	out := map[float64]*big.Rat{}
	for _, force := range []string{"4.4482216152605", "4448.2216152605"} { // lbf, kip
		for _, length := range []string{"0.3048", "0.0254"} { // ft, in
			f, _ := new(big.Rat).SetString(force)
			l, _ := new(big.Rat).SetString(length)
			f.Mul(f, l)
			key, _ := f.Float64()
			out[key] = f
		}
	}
	return out
}()

// term is a typed decimal number (its text, and v as read) in a unit of
// factor to SI.
type term struct {
	number    string
	v, factor float64
}

// exactSum is the sum of the terms' numbers times their factors, worked
// out exactly and rounded once: 12 ft is 3.6576 m, where 12 × 0.3048 in
// floating point is 3.6576000000000004, which a saved file would show, and
// 12' 3" is 3.7338 m. A factor is taken as its long decimal, or else as
// the decimal its float64 reads as, which is exact for every other factor
// of a finite decimal (ft, in, kip, in⁴, 1/°F...). Text too long or an
// exponent too large for cheap exact arithmetic go by the floating-point
// sum; zero terms add nothing.
func exactSum(terms ...term) float64 {
	float := 0.0
	for _, t := range terms {
		float += t.v * t.factor
	}
	sum := new(big.Rat)
	for _, t := range terms {
		if t.v == 0 {
			continue
		}
		if len(t.number) > 40 || math.Abs(t.v) > 1e300 || math.Abs(t.v) < 1e-300 {
			return float
		}
		if i := strings.IndexAny(t.number, "eE"); i >= 0 && len(strings.TrimLeft(t.number[i+1:], "+-")) > 3 {
			return float
		}
		n, ok := new(big.Rat).SetString(t.number)
		f, okFactor := longDecimals[t.factor]
		if !okFactor {
			f, okFactor = new(big.Rat).SetString(strconv.FormatFloat(t.factor, 'g', -1, 64))
		}
		if !ok || !okFactor {
			return float
		}
		sum.Add(sum, n.Mul(n, f))
	}
	p, _ := sum.Float64()
	return p
}

// Accepted lists the unit symbols Parse takes for q: SI's first, then US's,
// then the variants.
func Accepted(q Kind) []string {
	var out []string
	for _, u := range candidates(q) {
		if !contains(out, u.Symbol) {
			out = append(out, u.Symbol)
		}
	}
	return out
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

func candidates(q Kind) []Unit {
	if q < 0 || q >= kindCount {
		return nil
	}
	return append([]Unit{SI.Units[q], USCustomary.Units[q]}, extraUnits[q]...)
}

// Lookup is the unit Parse reads symbol as, for a value of q ("psi" for a
// modulus, "pcf" for a density), for a caller that needs the factor of a
// unit its system does not show; ok is false when Parse takes no such unit.
func Lookup(q Kind, symbol string) (u Unit, ok bool) { return lookUp(q, symbol) }

// lookUp finds the unit of q typed as symbol, among the candidates and
// then the aliases. A leading '/' reads as "1/" (/°F is 1/°F).
func lookUp(q Kind, symbol string) (Unit, bool) {
	key := normalize(singular(symbol))
	if strings.HasPrefix(key, "/") {
		key = "1" + key
	}
	for _, u := range append(candidates(q), aliases[q]...) {
		if normalize(u.Symbol) == key {
			if !strings.ContainsAny(u.Symbol, productMarks) && apart(symbol) {
				return Unit{}, false // "m m" is m·m, not mm
			}
			return u, true
		}
	}
	return Unit{}, false
}

// productMarks are what normalize drops between the units of a product.
const productMarks = "·⋅*. -"

// apart tells whether symbol is units typed apart, "m m" or "m*m": their
// product, which normalize joins into the symbol of another unit (mm). A
// part that is no unit of its own keeps the whole one symbol: "deg F",
// "k N".
func apart(symbol string) bool {
	parts := strings.FieldsFunc(symbol, func(r rune) bool { return strings.ContainsRune(productMarks, r) })
	if len(parts) < 2 {
		return false
	}
	for _, p := range parts {
		if _, ok := kindOf(p); !ok {
			return false
		}
	}
	return true
}

// singular reads the plurals "kips" and "lbs", standing as words, as kip
// and lb: "kips/ft" is kip/ft.
func singular(symbol string) string {
	var b strings.Builder
	word := func(r rune) bool { return unicode.IsLetter(r) || r == '°' }
	for len(symbol) > 0 {
		end := strings.IndexFunc(symbol, func(r rune) bool { return !word(r) })
		if end < 0 {
			end = len(symbol)
		}
		if end == 0 {
			r, size := utf8.DecodeRuneInString(symbol)
			b.WriteRune(r)
			symbol = symbol[size:]
			continue
		}
		switch w := symbol[:end]; w {
		case "kips", "lbs":
			b.WriteString(strings.TrimSuffix(w, "s"))
		default:
			b.WriteString(w)
		}
		symbol = symbol[end:]
	}
	return b.String()
}

func kindOf(symbol string) (Kind, bool) {
	for _, q := range Kinds() {
		if _, ok := lookUp(q, symbol); ok {
			return q, true
		}
	}
	return 0, false
}

func (s System) example(q Kind) string {
	return "12 " + s.Unit(q).Symbol
}

func article(q Kind) string {
	name := q.String()
	if strings.ContainsRune("aeiou", rune(name[0])) {
		return "an " + name
	}
	return "a " + name
}

// splitNumber separates a leading number from the unit that follows it.
func splitNumber(text string) (number, symbol string) {
	t := strings.TrimSpace(strings.ReplaceAll(text, "−", "-"))
	end := 0
	seenDigit, seenExponent := false, false
	for end < len(t) {
		c := t[end]
		switch {
		case c >= '0' && c <= '9':
			seenDigit = true
		case c == '.' || ((c == '+' || c == '-') && (end == 0 || t[end-1] == 'e' || t[end-1] == 'E')):
		case (c == 'e' || c == 'E') && seenDigit && !seenExponent && end+1 < len(t) &&
			(t[end+1] >= '0' && t[end+1] <= '9' || t[end+1] == '-' || t[end+1] == '+'):
			seenExponent = true
		default:
			return t[:end], strings.TrimSpace(t[end:])
		}
		end++
	}
	return t, ""
}

// normalize maps the ways a unit can be typed to one spelling: the
// multiplication dot, '*', '.', spaces and '^' are dropped, and so is a
// hyphen between letters (kip-ft, common practice), and superscript
// digits become plain ones, so "kN·m", "kN*m", "kN-m" and "kN m" all read
// "kNm".
func normalize(symbol string) string {
	var b strings.Builder
	runes := []rune(symbol)
	for i, r := range runes {
		if r == '-' && i > 0 && i+1 < len(runes) && unicode.IsLetter(runes[i-1]) && unicode.IsLetter(runes[i+1]) {
			continue
		}
		switch r {
		case '·', '⋅', '*', '.', ' ', '^':
		case '²':
			b.WriteByte('2')
		case '³':
			b.WriteByte('3')
		case '⁴':
			b.WriteByte('4')
		case '⁶':
			b.WriteByte('6')
		case 'º':
			b.WriteRune('°')
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}
