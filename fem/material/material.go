// Package material lists typical properties of common structural materials
// and flags material input that is far from all of them, which most often
// means a value was typed in the wrong unit.
//
// The values are typical, not certified: each Entry names where it comes
// from, and a user must replace it with the certified values of the material
// actually used. All values are SI (Pa, kg/m³, 1/K), as in package fem;
// the warnings quote them in the display units they are given (package
// units) and name the unit slips of the fields typed in those units.
package material

import (
	"fmt"
	"math"
	"slices"
	"strconv"

	"stave/fem"
	"stave/fem/units"
)

// Caution goes beside any list of these materials.
const Caution = "Typical values only: use your material's certified values."

// Entry is one typical material.
type Entry struct {
	Material fem.Material // Allowable holds the strength named in Strength
	Kind     string       // steel, aluminium, timber, concrete
	Strength string       // what the strength value is, in plain words
	Source   string       // where the values come from
	// Units is the display units (units.System.Name, "SI" or "US") whose
	// cautions quote this entry where its kind has one for each, as steel
	// has; "" where it is its kind's only entry (TypicalIn).
	Units string
}

// Typical returns the list of typical materials, a fresh copy each call.
func Typical() []Entry {
	us := units.USCustomary // exact factors, NIST SP 811 (2008) Appendix B
	ksi, lbft3, perF := us.Unit(units.Modulus).ToSI, us.Unit(units.Density).ToSI, us.Unit(units.ThermalExpansion).ToSI
	return []Entry{
		{
			Material: fem.Material{Name: "Structural steel S355 (typical)", Elastic: 210e9, Density: 7850, ThermalExpansion: 12e-6, Allowable: 355e6},
			Kind:     "steel",
			Strength: "yield strength fy for thickness up to 40 mm; not an allowable stress",
			Source:   "EN 1993-1-1 §3.2.6 (E, α, ρ = 7850 kg/m³) and Table 3.1 (fy); from memory",
			Units:    units.SI.Name,
		},
		{
			Material: fem.Material{Name: "Structural steel ASTM A992 (typical)", Elastic: 29000 * ksi, Density: 490 * lbft3, ThermalExpansion: 6.5e-6 * perF, Allowable: 50 * ksi},
			Kind:     "steel",
			Strength: "minimum yield stress Fy = 50 ksi; not an allowable stress",
			Source:   "AISC Specification (E = 29,000 ksi), AISC Manual (490 lb/ft³, 6.5e-6 per °F), ASTM A992 (Fy); from memory",
			Units:    units.USCustomary.Name,
		},
		{
			Material: fem.Material{Name: "Aluminium alloy 6061-T6 (typical)", Elastic: 68.9e9, Density: 2700, ThermalExpansion: 23.6e-6, Allowable: 276e6},
			Kind:     "aluminium",
			Strength: "typical tensile yield strength; design minimums are lower (about 240 MPa for extrusions) and welding weakens it",
			Source:   "ASM Handbook Vol. 2, properties of wrought aluminium alloys; Aluminum Design Manual for minimums; from memory",
		},
		{
			Material: fem.Material{Name: "Softwood timber C24 (typical)", Elastic: 11e9, Density: 420, ThermalExpansion: 4e-6, Allowable: 24e6},
			Kind:     "timber",
			Strength: "characteristic bending strength fm,k, before the modification and material factors a timber code applies",
			Source:   "EN 338 Table 1, strength class C24 (E0,mean, ρmean, fm,k); Wood Handbook (USDA FPL) ch. 4 for α along the grain; from memory",
		},
		{
			Material: fem.Material{Name: "Normal-weight concrete C30/37 (typical)", Elastic: 33e9, Density: 2400, ThermalExpansion: 10e-6, Allowable: 30e6},
			Kind:     "concrete",
			Strength: "characteristic cylinder compressive strength fck; concrete cracks in tension at about a tenth of this",
			Source:   "EN 1992-1-1 Table 3.1 (Ecm, fck) and §3.1.3 (α); density common practice for plain concrete (EN 1991-1-1 Table A.1 gives a unit weight of 24 kN/m³, about 2450 kg/m³); from memory",
		},
	}
}

// TypicalIn is the list of typical materials the cautions of a user of u
// compare with: of a kind with an entry for each display units, the one
// of u, so that every caution quotes one steel — the AISC Specification's
// E = 29,000 ksi in US units, EN 1993-1-1's 210 GPa otherwise (a file's
// SI base units too).
func TypicalIn(u units.System) []Entry {
	own := units.SI.Name
	if u.Name == units.USCustomary.Name {
		own = u.Name
	}
	return slices.DeleteFunc(Typical(), func(e Entry) bool { return e.Units != "" && e.Units != own })
}

// farFactor is how far (as a ratio either way) a value may be from a
// typical material before it is flagged. The list spans E from 11 to
// 210 GPa; a factor of 3 leaves room for other grades and alloys while
// catching unit slips, which are factors of 7 (ksi and MPa) or more.
const farFactor = 3.0

// slip is a value typed in one unit into a field that expects another: the
// field stores it ratio times the value meant.
type slip struct {
	typed, expected string  // unit symbols
	ratio           float64 // SI value stored / SI value meant
	hint            string
}

// mistyped is the slip of what ("a value", "the density") typed in unit
// typed into a field of unit expected. Its hint asks about it and says how
// many of the smaller unit make one of the larger.
func mistyped(what string, typed, expected units.Unit) slip {
	ratio := expected.ToSI / typed.ToSI
	larger, smaller, n := expected, typed, ratio
	if ratio < 1 {
		larger, smaller, n = typed, expected, 1/ratio
	}
	return slip{typed: typed.Symbol, expected: expected.Symbol, ratio: ratio,
		hint: fmt.Sprintf("Did you type %s in %s where %s is expected? 1 %s is %s %s.",
			what, typed.Symbol, expected.Symbol, larger.Symbol, units.FormatNumber(n), smaller.Symbol)}
}

// saying is s with another hint.
func (s slip) saying(hint string) slip {
	s.hint = hint
	return s
}

// fields are the units of the fields a value of kind q is typed in, as
// seen by someone using u: u's own, then a file's SI base unit, which
// every model is saved in and may be written by hand in; each once.
func fields(u units.System, q units.Kind) []units.Unit {
	own, file := u.Unit(q), units.Base.Unit(q)
	if own == file {
		return []units.Unit{own}
	}
	return []units.Unit{own, file}
}

// modulusSlips are the slips of E typed in MPa (EN 1993-1-1 quotes E =
// 210 000 N/mm², from memory), GPa, Pa, ksi, psi or kPa (a set of units
// of kN and m writes E in kN/m², 2e8 for steel; common practice) into the
// E field of u (GPa or ksi) or of a file (Pa). No E field takes MPa, the
// unit of u's other stresses. Two slips of one ratio are named once, by
// the first.
func modulusSlips(u units.System) []slip {
	typed := []units.Unit{units.SI.Unit(units.Stress), units.SI.Unit(units.Modulus), units.Base.Unit(units.Modulus), units.USCustomary.Unit(units.Modulus)}
	for _, symbol := range []string{"psi", "kPa"} {
		if t, ok := units.Lookup(units.Stress, symbol); ok {
			typed = append(typed, t)
		}
	}
	var out []slip
	for _, expected := range fields(u, units.Modulus) {
		for _, t := range typed {
			if t == expected || slices.ContainsFunc(out, func(s slip) bool { return sameRatio(s.ratio, expected.ToSI/t.ToSI) }) {
				continue
			}
			out = append(out, mistyped("a value", t, expected))
		}
	}
	return out
}

// densitySlips are the slips of a density typed into a field of u or of a
// file. A kg/m³ field may get a unit weight (kN/m³ or N/m³), t/m³ or
// g/cm³, or lb/ft³; a lb/ft³ field a unit weight in kip/ft³ (kcf), lb/in³
// as metals' data sheets give it, or kg/m³. A unit weight in lbf/ft³ is
// the density in lb/ft³ (1 lbf is the weight of 1 lb under standard
// gravity), so it is no slip.
func densitySlips(u units.System) []slip {
	kgm3, lbft3 := units.Base.Unit(units.Density), units.USCustomary.Unit(units.Density)
	inchesPerFoot := units.USCustomary.Unit(units.Position).ToSI / units.USCustomary.Unit(units.Dimension).ToSI
	var out []slip
	for _, field := range fields(u, units.Density) {
		switch field {
		case kgm3:
			out = append(out,
				mistyped("the unit weight", units.Unit{Symbol: "kN/m³", ToSI: 1000 / fem.StandardGravity}, kgm3).
					saying("Did you type the unit weight in kN/m³ where kg/m³ is expected? Density is mass per volume: 78.5 kN/m³ ÷ 9.80665 m/s² (standard gravity) is 8005 kg/m³."),
				mistyped("the unit weight", units.Unit{Symbol: "N/m³", ToSI: 1 / fem.StandardGravity}, kgm3).
					saying("Did you type the unit weight in N/m³ where kg/m³ is expected? Density is mass per volume: divide it by 9.80665 m/s² (standard gravity)."),
				mistyped("the density", units.Unit{Symbol: "t/m³", ToSI: 1000}, kgm3).
					saying("Did you type the density in t/m³ or g/cm³ where kg/m³ is expected? Multiply by 1000 to get kg/m³."),
				mistyped("the density", lbft3, kgm3))
		case lbft3:
			out = append(out,
				mistyped("the unit weight", units.Unit{Symbol: "kip/ft³", ToSI: 1000 * lbft3.ToSI}, lbft3),
				mistyped("the density", units.Unit{Symbol: "lb/in³", ToSI: math.Pow(inchesPerFoot, 3) * lbft3.ToSI}, lbft3),
				mistyped("the density", kgm3, lbft3))
		}
	}
	return out
}

// sameRatio tells ratios apart only by round-off.
func sameRatio(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(b) }

// FarFromTypicalIn returns warnings, written for someone new to the trade,
// when the modulus or the density of m is far from every typical material,
// or when the density does not go with the material its modulus resembles.
// The warnings quote values in u, the display units (the zero System reads
// as units.Base, a file's), and name the unit slips of the fields a user of
// u types into. An empty result means nothing looks odd; it is no proof
// the values are right.
func FarFromTypicalIn(m fem.Material, u units.System) []string {
	name := m.Name
	if name == "" {
		name = "this material"
	}
	if u.Name == "" {
		u = units.Base
	}
	typical := TypicalIn(u)
	elastic := property{"E", func(e Entry) float64 { return e.Material.Elastic }, func(v float64) string { return u.Format(units.Modulus, v) }}
	density := property{"density", func(e Entry) float64 { return e.Material.Density }, func(v float64) string { return u.Format(units.Density, v) }}
	if !(m.Elastic > 0) || math.IsInf(m.Elastic, 0) {
		steel := typical[slices.IndexFunc(typical, func(e Entry) bool { return e.Kind == "steel" })]
		return []string{fmt.Sprintf("%s: E = %s; Young's modulus must be a positive number (steel's is about %s).",
			name, elastic.show(m.Elastic), u.FormatFigures(units.Modulus, elastic.of(steel), 2))}
	}
	var warnings []string
	byModulus := nearest(typical, m.Elastic, elastic.of)
	modulusFar := far(m.Elastic, elastic.of(byModulus))
	if modulusFar {
		warnings = append(warnings, elastic.warning(name, m.Elastic, byModulus, nearestTypical, typical, modulusSlips(u), checkUnit))
	}
	switch {
	case m.Density < 0 || math.IsNaN(m.Density) || math.IsInf(m.Density, 0):
		warnings = append(warnings, fmt.Sprintf("%s: density = %s must be a finite number, not negative; use 0 to leave out self-weight.", name, density.show(m.Density)))
	case m.Density == 0:
	case !modulusFar && far(m.Density, density.of(byModulus)):
		// E looks right, so it tells the kind of material the density should match.
		warnings = append(warnings, density.warning(name, m.Density, byModulus, ", whose E is closest to yours", []Entry{byModulus}, densitySlips(u), checkSameKind))
	case modulusFar:
		if byDensity := nearest(typical, m.Density, density.of); far(m.Density, density.of(byDensity)) {
			warnings = append(warnings, density.warning(name, m.Density, byDensity, nearestTypical, typical, densitySlips(u), checkUnit))
		}
	}
	return warnings
}

// property is E or density: its name, its value in an Entry and how a
// value is shown.
type property struct {
	name string
	of   func(Entry) float64
	show func(float64) string
}

const nearestTypical = ", the nearest typical material"

// warning says that v, the value of p for the material called name, is
// far from that of ref, which why tells how it was chosen. When a slip,
// undone, brings v near one of entries, the warning compares v with that
// entry and names the slip, so a value typed in psi reads 1000 times that
// of typical steel and not 952 times that of another steel; otherwise it
// ends with otherwise.
func (p property) warning(name string, v float64, ref Entry, why string, entries []Entry, slips []slip, otherwise string) string {
	advice := otherwise
	if s, e, ok := undo(v, slips, entries, p.of); ok {
		advice = s.hint
		if e.Material.Name != ref.Material.Name {
			ref, why = e, ""
		}
	}
	return fmt.Sprintf("%s: %s = %s is %s that of %s (%s)%s. %s",
		name, p.name, p.show(v), times(v, p.of(ref)), kindName(ref), p.show(p.of(ref)), why, advice)
}

// nearest finds the entry whose property is closest to v on a log scale, so
// 3 times more and 3 times less are equally far.
func nearest(entries []Entry, v float64, property func(Entry) float64) Entry {
	best := entries[0]
	for _, e := range entries[1:] {
		if math.Abs(math.Log(v/property(e))) < math.Abs(math.Log(v/property(best))) {
			best = e
		}
	}
	return best
}

func far(v, reference float64) bool {
	ratio := v / reference
	return ratio > farFactor || ratio < 1/farFactor
}

// slipMatch is how close (as a ratio either way) a value must come to a
// typical one once a slip is undone for that slip to be named: tighter than
// farFactor, so a hint is given only when it explains the number well.
const slipMatch = 1.5

// undo finds the slip that, undone, brings v closest to one of entries,
// and that entry; ok is false when none brings it within slipMatch.
func undo(v float64, slips []slip, entries []Entry, property func(Entry) float64) (found slip, near Entry, ok bool) {
	bestDistance := math.Log(slipMatch)
	for _, s := range slips {
		meant := v / s.ratio
		e := nearest(entries, meant, property)
		if d := math.Abs(math.Log(meant / property(e))); d < bestDistance {
			found, near, ok, bestDistance = s, e, true, d
		}
	}
	return found, near, ok
}

const (
	checkUnit     = "If your material really is like this, carry on; otherwise check the number and its unit."
	checkSameKind = "E and density usually come from the same material: check both against your material's data sheet."
)

func kindName(e Entry) string { return "typical " + e.Kind }

// times writes v/reference in words with three figures, in e-notation
// from 10⁶ on as strconv's shortest 'g' writes it (and as the values beside
// it are written): "1000 times", "1/16 of", "1/1e+09 of". A ratio beyond
// the range of float64 is written from its logarithm: a density of 5e-324
// kg/m³ is "1/1.59e+327 of" steel's, where v/reference underflows to 0 and
// read "1/+Inf of".
func times(v, reference float64) string {
	ratio, prefix, suffix := v/reference, "", " times"
	if ratio < 1 {
		ratio, prefix, suffix = reference/v, "1/", " of"
	}
	if math.IsInf(ratio, 0) {
		// Log2, not Log10: math.Log10 of a subnormal number is off by
		// 15 decades (Log10(5e-324) gave -307.95 with Go 1.26 on amd64, for
		// -323.31; Log2 is exact).
		return prefix + powerOfTen(math.Abs(math.Log2(v)-math.Log2(reference))*math.Ln2/math.Ln10) + suffix
	}
	rounded, _ := strconv.ParseFloat(fmt.Sprintf("%.3g", ratio), 64)
	return prefix + strconv.FormatFloat(rounded, 'g', -1, 64) + suffix
}

// powerOfTen writes 10^l, too large for a float64, as strconv's 'g' would
// with three figures: "1.59e+327".
func powerOfTen(l float64) string {
	exponent := math.Floor(l)
	mantissa, _ := strconv.ParseFloat(fmt.Sprintf("%.3g", math.Pow(10, l-exponent)), 64)
	if mantissa >= 10 {
		mantissa, exponent = mantissa/10, exponent+1
	}
	return fmt.Sprintf("%se+%02.0f", strconv.FormatFloat(mantissa, 'g', -1, 64), exponent)
}
