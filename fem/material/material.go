// Package material lists typical properties of common structural materials
// and flags material input that is far from all of them, which most often
// means a value was typed in the wrong unit.
//
// The values are typical, not certified: each Entry names where it comes
// from, and a user must replace it with the certified values of the material
// actually used. All values are SI (Pa, kg/m³, 1/K), as in package fem.
package material

import (
	"fmt"
	"math"
	"strconv"

	"stave/fem"
)

// Caution goes beside any list of these materials.
const Caution = "Typical values only: use your material's certified values."

// Entry is one typical material.
type Entry struct {
	Material fem.Material // Allowable holds the strength named in Strength
	Kind     string       // steel, aluminium, timber, concrete
	Strength string       // what the strength value is, in plain words
	Source   string       // where the values come from
}

// Typical returns the list of typical materials, a fresh copy each call.
func Typical() []Entry {
	const (
		ksi   = 6894757.293168361 // Pa, NIST SP 811 (2008) B.8
		lbft3 = 16.01846337396014 // kg/m³ per lb/ft³, NIST SP 811 (2008) B.8
		perF  = 1.8               // 1/K per 1/°F
	)
	return []Entry{
		{
			Material: fem.Material{Name: "Structural steel S355 (typical)", Elastic: 210e9, Density: 7850, ThermalExpansion: 12e-6, Allowable: 355e6},
			Kind:     "steel",
			Strength: "yield strength fy for thickness up to 40 mm; not an allowable stress",
			Source:   "EN 1993-1-1 §3.2.6 (E, α, ρ = 7850 kg/m³) and Table 3.1 (fy); from memory",
		},
		{
			Material: fem.Material{Name: "Structural steel ASTM A992 (typical)", Elastic: 29000 * ksi, Density: 490 * lbft3, ThermalExpansion: 6.5e-6 * perF, Allowable: 50 * ksi},
			Kind:     "steel",
			Strength: "minimum yield stress Fy = 50 ksi; not an allowable stress",
			Source:   "AISC Specification (E = 29,000 ksi), AISC Manual (490 lb/ft³, 6.5e-6 per °F), ASTM A992 (Fy); from memory",
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

// farFactor is how far (as a ratio either way) a value may be from a
// typical material before it is flagged. The list spans E from 11 to
// 210 GPa; a factor of 3 leaves room for other grades and alloys while
// catching unit slips, which are factors of 7 (ksi and MPa) or more.
const farFactor = 3.0

// slip is a unit mistake that multiplies a typed value by ratio.
type slip struct {
	ratio float64
	hint  string
}

// Unit slips seen with the modulus: ratio is typed value in Pa / meant value.
var modulusSlips = []slip{
	{1e3, "Did you type a value in MPa where GPa is expected?"},
	{1e6, "Did you type a value in Pa where MPa is expected?"},
	{1e9, "Did you type a value in Pa where GPa is expected?"},
	{1e-3, "Did you type a value in GPa where MPa is expected?"},
	{1e-6, "Did you type a value in MPa where Pa is expected?"},
	{1e-9, "Did you type a value in GPa where Pa is expected?"},
	{1 / 6.894757293168361, "Did you type a value in ksi where MPa is expected? 1 ksi is 6.895 MPa."},
	{6.894757293168361, "Did you type a value in MPa where ksi is expected? 1 ksi is 6.895 MPa."},
}

// Slips seen with density: unit weight typed as density, t/m³ or g/cm³ or
// lb/ft³ typed as kg/m³.
var densitySlips = []slip{
	{fem.StandardGravity / 1000, "Did you type the unit weight in kN/m³? Density is mass per volume: 78.5 kN/m³ ÷ 9.81 m/s² is 8000 kg/m³."},
	{fem.StandardGravity, "Did you type the unit weight in N/m³? Density is mass per volume: divide it by 9.81 m/s²."},
	{1e-3, "Did you type the density in t/m³ or g/cm³? Multiply by 1000 to get kg/m³."},
	{1 / 16.01846337396014, "Did you type the density in lb/ft³? 1 lb/ft³ is 16.02 kg/m³."},
}

// FarFromTypical returns warnings, written for someone new to the trade,
// when the modulus or the density of m is far from every typical material,
// or when the density does not go with the material its modulus resembles.
// An empty result means nothing looks odd; it is no proof the values are right.
func FarFromTypical(m fem.Material) []string {
	name := m.Name
	if name == "" {
		name = "this material"
	}
	if !(m.Elastic > 0) || math.IsInf(m.Elastic, 0) {
		return []string{fmt.Sprintf("%s: E = %g Pa; Young's modulus must be a positive number (steel's is about 210e9 Pa = 210 GPa).", name, m.Elastic)}
	}
	elastic := func(e Entry) float64 { return e.Material.Elastic }
	density := func(e Entry) float64 { return e.Material.Density }
	typical := Typical()
	var warnings []string
	byModulus := nearest(typical, m.Elastic, elastic)
	modulusFar := far(m.Elastic, elastic(byModulus))
	if modulusFar {
		warnings = append(warnings, fmt.Sprintf("%s: E = %.3g Pa is %s that of %s (%.3g Pa), the nearest typical material. %s",
			name, m.Elastic, times(m.Elastic/elastic(byModulus)), kindName(byModulus), elastic(byModulus), hint(m.Elastic, modulusSlips, typical, elastic, checkUnit)))
	}
	switch {
	case m.Density < 0 || math.IsNaN(m.Density) || math.IsInf(m.Density, 0):
		warnings = append(warnings, fmt.Sprintf("%s: density = %g kg/m³ must be a finite number, not negative; use 0 to leave out self-weight.", name, m.Density))
	case m.Density == 0:
	case !modulusFar && far(m.Density, density(byModulus)):
		// E looks right, so it tells the kind of material the density should match.
		warnings = append(warnings, fmt.Sprintf("%s: density = %.4g kg/m³ is %s that of %s (%.4g kg/m³), whose E is closest to yours. %s",
			name, m.Density, times(m.Density/density(byModulus)), kindName(byModulus), density(byModulus), hint(m.Density, densitySlips, []Entry{byModulus}, density, checkSameKind)))
	case modulusFar:
		if byDensity := nearest(typical, m.Density, density); far(m.Density, density(byDensity)) {
			warnings = append(warnings, fmt.Sprintf("%s: density = %.4g kg/m³ is %s that of %s (%.4g kg/m³), the nearest typical material. %s",
				name, m.Density, times(m.Density/density(byDensity)), kindName(byDensity), density(byDensity), hint(m.Density, densitySlips, typical, density, checkUnit)))
		}
	}
	return warnings
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

// hint names the slip that, undone, brings v closest to one of entries, or
// returns otherwise when none brings it within slipMatch.
func hint(v float64, slips []slip, entries []Entry, property func(Entry) float64, otherwise string) string {
	found, bestDistance := otherwise, math.Log(slipMatch)
	for _, s := range slips {
		meant := v / s.ratio
		reference := property(nearest(entries, meant, property))
		if d := math.Abs(math.Log(meant / reference)); d < bestDistance {
			found, bestDistance = s.hint, d
		}
	}
	return found
}

const (
	checkUnit     = "If your material really is like this, carry on; otherwise check the number and its unit."
	checkSameKind = "E and density usually come from the same material: check both against your material's data sheet."
)

func kindName(e Entry) string { return "typical " + e.Kind }

// times writes a ratio in words with three figures and no exponent below
// 10²¹: "1000 times", "1/16 of".
func times(ratio float64) string {
	three := func(v float64) string {
		rounded, _ := strconv.ParseFloat(fmt.Sprintf("%.3g", v), 64)
		return strconv.FormatFloat(rounded, 'g', -1, 64)
	}
	if ratio >= 1 {
		return three(ratio) + " times"
	}
	return "1/" + three(1/ratio) + " of"
}
