package material

import (
	"math"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
)

// Exact conversion factors of NIST SP 811 (2008), Appendix B: the tests
// work out each value in US units from these, not from package units.
const (
	lbf  = 4.4482216152605 // N
	inch = 0.0254          // m
	foot = 0.3048          // m
	lb   = 0.45359237      // kg
	gn   = 9.80665         // m/s², standard acceleration of gravity (exact by definition)
	psi  = lbf / (inch * inch)
	ksi  = 1000 * psi // 1 kip = 1000 lbf
	pcf  = lb / (foot * foot * foot)
)

// systems are the units cautions may quote values in: the two display
// systems, the SI base units of a file, and the zero System, which reads as
// the base units.
var systems = []units.System{units.SI, units.USCustomary, units.Base, {}}

func TestTypicalEntriesAreSane(t *testing.T) {
	for _, e := range Typical() {
		m := e.Material
		if !strings.Contains(m.Name, "typical") {
			t.Errorf("%s: name must say the values are typical", m.Name)
		}
		if !strings.Contains(e.Source, "from memory") || e.Strength == "" || e.Kind == "" {
			t.Errorf("%s: source %q, strength %q, kind %q: each must be given, the source marked 'from memory'", m.Name, e.Source, e.Strength, e.Kind)
		}
		if !(m.Elastic > 0 && m.Density > 0 && m.ThermalExpansion > 0 && m.Allowable > 0) {
			t.Errorf("%s: every property must be positive: %+v", m.Name, m)
		}
		// Strengths of structural materials are well under 1 % of E (yield strain
		// of steel ≈ 355/210000 = 0.17 %); a larger ratio means a unit slip here.
		if m.Allowable > m.Elastic/100 {
			t.Errorf("%s: strength %g Pa is more than E/100 = %g Pa", m.Name, m.Allowable, m.Elastic/100)
		}
		for _, u := range systems {
			if w := FarFromTypicalIn(m, u); len(w) != 0 {
				t.Errorf("%s in %s: a typical material is flagged: %v", m.Name, u.Name, w)
			}
		}
	}
}

// The two steel entries come from different codes in different units; once
// converted they must agree, which checks the conversions and the numbers.
func TestSteelEntriesAgreeAcrossCodes(t *testing.T) {
	byName := map[string]fem.Material{}
	for _, e := range Typical() {
		byName[e.Material.Name] = e.Material
	}
	eu, us := byName["Structural steel S355 (typical)"], byName["Structural steel ASTM A992 (typical)"]
	cases := []struct {
		what      string
		got, want float64
		relative  float64
	}{
		// AISC Specification prints E = 29,000 ksi (200 000 MPa), from memory.
		{"E of A992 in SI", us.Elastic, 200e9, 0.001},
		// 490 lb/ft³ against EN 1993-1-1's 7850 kg/m³.
		{"density", us.Density, eu.Density, 0.001},
		// 6.5e-6 per °F = 11.7e-6 per K, against EN 1993-1-1's 12e-6 per K.
		{"thermal expansion", us.ThermalExpansion, 11.7e-6, 1e-12},
		// 50 ksi = 344.7 MPa (NIST SP 811 psi factor), close to S355's 355 MPa.
		{"yield", us.Allowable, 344.7379e6, 1e-6},
	}
	for _, c := range cases {
		if math.Abs(c.got-c.want) > c.relative*c.want {
			t.Errorf("%s: %.6g, want %.6g (±%g relative)", c.what, c.got, c.want, c.relative)
		}
	}
}

func TestFarFromTypicalIn(t *testing.T) {
	steel := Typical()[0].Material
	with := func(elastic, density float64) fem.Material {
		m := steel
		m.Name = "input"
		m.Elastic, m.Density = elastic, density
		return m
	}
	us, si, base := units.USCustomary, units.SI, units.Base
	cases := []struct {
		name     string
		units    units.System
		material fem.Material
		want     []string // each must appear in some warning; nil means no warning
		not      []string // none may appear in any warning
	}{
		// AISC gives E = 29,000 ksi and 490 lb/ft³ for steel (from memory);
		// typed in psi, E is 29,000,000 in the ksi field.
		{"US: psi typed in the ksi field", us, with(29e6*ksi, 490*pcf),
			[]string{"E = 2.900e+07 ksi is 1000 times that of typical steel (29000 ksi)", "psi where ksi", "1 ksi is 1000 psi"}, []string{"Pa", "kg/m³", "GPa"}},
		{"US: MPa typed in the ksi field", us, with(200000*ksi, 490*pcf), []string{"E = 200000 ksi", "MPa where ksi", "1 ksi is 6.895 MPa"}, nil},
		{"US: GPa typed in the ksi field", us, with(200*ksi, 490*pcf), []string{"E = 200.0 ksi", "GPa where ksi", "1 GPa is 145.0 ksi"}, nil},
		// A unit weight of 0.490 kip/ft³ (kcf) typed in the lb/ft³ field.
		{"US: kip/ft³ typed in the lb/ft³ field", us, with(29000*ksi, 0.49*pcf),
			[]string{"density = 0.4900 lb/ft³ is 1/1000 of that of typical steel (490.0 lb/ft³)", "kip/ft³ where lb/ft³"}, []string{"kg/m³", "t/m³"}},
		// 0.284 lb/in³, steel as US metal data sheets give it (from memory).
		{"US: lb/in³ typed in the lb/ft³ field", us, with(29000*ksi, 0.284*pcf), []string{"lb/in³ where lb/ft³", "1 lb/in³ is 1728 lb/ft³"}, nil},
		{"US: kg/m³ typed in the lb/ft³ field", us, with(29000*ksi, 7850*pcf), []string{"kg/m³ where lb/ft³"}, nil},
		// A file holds kg/m³: a unit weight of 78.5 kN/m³ typed there, seen in a US window.
		{"US: unit weight typed in a file", us, with(29000*ksi, 78.5), []string{"density = 4.901 lb/ft³", "unit weight in kN/m³ where kg/m³ is expected"}, nil},
		{"US: negative density", us, with(29000*ksi, -1*pcf), []string{"density = -1.000 lb/ft³ must be a finite number"}, nil},
		// Every caution quotes the steel of the AISC Specification, E = 29,000
		// ksi (ASTM A992; from memory): it read "about 30000 ksi", EN 1993-1-1's
		// 210 GPa in ksi, beside "typical steel (29000 ksi)".
		{"US: zero modulus", us, with(0, 490*pcf), []string{"E = 0 ksi", "must be a positive number", "about 29000 ksi"}, []string{"Pa", "30000"}},
		// 105,000 ksi is nearer EN's 210 GPa (30,458 ksi) than A992's E; it read
		// "3.28 times that of typical steel (30460 ksi)".
		{"US: far above steel", us, with(105000*ksi, 490*pcf), []string{"3.62 times that of typical steel (29000 ksi)"}, []string{"30460"}},

		{"SI: MPa typed in the GPa field", si, with(210000e9, 7850),
			[]string{"E = 210000 GPa is 1000 times that of typical steel (210.0 GPa)", "MPa where GPa"}, []string{"ksi", "e+14"}},
		// 29,000 ksi typed in the GPa field: undone it is A992 steel.
		{"SI: ksi typed in the GPa field", si, with(29000e9, 7850), []string{"ksi where GPa"}, nil},
		// 78.5 kN/m³, steel's unit weight (EN 1991-1-1 Table A.4, from memory), typed as a density.
		// The hint's example divides by standard gravity, 9.80665 m/s² exactly
		// (3rd CGPM 1901, NIST SP 330, from memory): 78.5e3/9.80665 = 8004.77
		// kg/m³ (computed); it said "÷ 9.81 m/s² is 8000 kg/m³", which is 8002.
		{"SI: unit weight in kN/m³ typed as density", si, with(210e9, 78.5),
			[]string{"density = 78.50 kg/m³ is 1/100 of that of typical steel (7850 kg/m³)", "unit weight in kN/m³", "78.5 kN/m³ ÷ 9.80665 m/s² (standard gravity) is 8005 kg/m³"}, []string{"lb/ft³", "9.81 m/s²"}},
		{"SI: unit weight in N/m³ typed as density", si, with(210e9, 78500), []string{"unit weight in N/m³"}, nil},
		{"SI: t/m³ typed as kg/m³", si, with(33e9, 2.4), []string{"t/m³"}, nil},
		{"SI: lb/ft³ typed as kg/m³", si, with(210e9, 490), []string{"lb/ft³ where kg/m³", "1 lb/ft³ is 16.02 kg/m³"}, nil},
		// 29000 ksi typed as MPa gives a plausible concrete E; only the density
		// of steel beside it gives the mistake away.
		{"SI: ksi typed in an MPa field", si, with(29000e6, 7850), []string{"3.27 times that of typical concrete", "same material"}, nil},
		{"SI: a plastic, soft, no slip to name", si, with(3e9, 1200), []string{"E = 3.000 GPa is 1/3.67 of that of typical timber (11.00 GPa)", "If your material really is"}, []string{"Did you"}},
		// EN 1993-1-1 §3.2.6 gives E = 210 000 N/mm² (from memory).
		{"SI: zero modulus", si, with(0, 7850), []string{"E = 0 GPa", "must be a positive number", "about 210 GPa"}, nil},
		// 200,000 (MPa) typed in the GPa field: compared with EN's steel, as
		// every SI caution is, not A992's 199.9 GPa.
		{"SI: MPa typed in the GPa field, 200 GPa meant", si, with(200000e9, 7850),
			[]string{"E = 200000 GPa is 952 times that of typical steel (210.0 GPa)", "MPa where GPa"}, []string{"199.9"}},
		// No E field takes MPa: the window's takes GPa, a file's Pa. E = 0.2
		// GPa is what 200 GPa written in kPa (2e8 kN/m², as a kN–m set of
		// units writes it; common practice) gives in a file; it read "Did you
		// type a value in GPa where MPa is expected?".
		{"SI: kPa written in a file", si, with(2e8, 7850), []string{"E = 0.2000 GPa", "kPa where Pa is expected", "1 kPa is 1000 Pa"}, []string{"where MPa"}},
		// 2e8 (kPa) typed in the GPa field; it read "Pa where MPa is expected".
		{"SI: kPa typed in the GPa field", si, with(2e17, 7850), []string{"kPa where GPa is expected"}, []string{"where MPa"}},
		{"SI: negative density", si, with(210e9, -1), []string{"density = -1.000 kg/m³ must be a finite number, not negative"}, nil},

		// A ratio of 10⁹ in e-notation, as times() says and as the values
		// beside it are written (its comment promised no exponent below 10²¹).
		{"file: GPa typed in a Pa field", base, with(210, 7850), []string{"E = 210.0 Pa is 1/1e+09 of that of typical steel (2.100e+11 Pa)", "GPa where Pa"}, nil},
		{"file: MPa typed in a Pa field", base, with(210000, 7850), []string{"MPa where Pa"}, nil},
		// The smallest positive float64 (IEEE 754 binary64, 2⁻¹⁰⁷⁴ ≈ 4.94e-324)
		// as a density: 7850/4.94e-324 = 1.59e+327 (computed) is beyond float64,
		// and the ratio read "1/+Inf of".
		{"file: density at the bottom of the number range", base, with(210e9, 5e-324), []string{"is 1/1.59e+327 of that of typical steel"}, []string{"Inf"}},
		{"file: psi typed in a Pa field", base, with(29e6, 7850), []string{"psi where Pa"}, nil},
		{"no system: the file's units", units.System{}, with(210, 7850), []string{"E = 210.0 Pa", "GPa where Pa"}, nil},
	}
	// Materials that are fine give nothing, in any units.
	for _, u := range systems {
		for _, m := range []struct {
			name     string
			material fem.Material
		}{
			{"steel as typed correctly", with(200e9, 7850)},
			{"aluminium", with(70e9, 2710)},
			{"aluminium with steel's density is within the factor of 3", with(70e9, 7850)},
			{"timber", with(12e9, 500)},
			{"density 0 leaves out self-weight", with(210e9, 0)},
		} {
			cases = append(cases, struct {
				name     string
				units    units.System
				material fem.Material
				want     []string
				not      []string
			}{m.name, u, m.material, nil, nil})
		}
	}
	for _, c := range cases {
		got := FarFromTypicalIn(c.material, c.units)
		t.Logf("%s (%s): %q", c.name, c.units.Name, got)
		if c.want == nil {
			if len(got) != 0 {
				t.Errorf("%s (%s): unexpected warnings %q", c.name, c.units.Name, got)
			}
			continue
		}
		all := strings.Join(got, "\n")
		for _, w := range c.want {
			if !strings.Contains(all, w) {
				t.Errorf("%s: warnings %q do not contain %q", c.name, got, w)
			}
		}
		for _, w := range c.not {
			if strings.Contains(all, w) {
				t.Errorf("%s: warnings %q contain %q", c.name, got, w)
			}
		}
	}
}

// Each slip's ratio is the one the exact conversion factors of NIST SP 811
// (2008), Appendix B give (see the constants above), worked out here
// independently of package units: a value typed in unit T into a field of
// unit X is stored X/T times the value meant.
func TestSlipRatios(t *testing.T) {
	us, si, base := units.USCustomary, units.SI, units.Base
	cases := []struct {
		units           units.System
		typed, expected string
		want            float64
	}{
		{us, "psi", "ksi", ksi / psi},
		{us, "MPa", "ksi", ksi / 1e6},
		{us, "GPa", "ksi", ksi / 1e9},
		{us, "Pa", "ksi", ksi},
		{us, "kip/ft³", "lb/ft³", pcf / (1000 * pcf)},
		{us, "lb/in³", "lb/ft³", pcf / (lb / (inch * inch * inch))},
		{us, "kg/m³", "lb/ft³", pcf},
		{us, "lb/ft³", "kg/m³", 1 / pcf}, // a file, which holds kg/m³
		{us, "psi", "Pa", 1 / psi},
		{si, "MPa", "GPa", 1e3},
		{si, "Pa", "GPa", 1e9},
		{si, "ksi", "GPa", 1e9 / ksi},
		{si, "kPa", "GPa", 1e6},
		{si, "MPa", "Pa", 1e-6},
		{si, "kPa", "Pa", 1e-3},
		{us, "kPa", "ksi", ksi / 1e3},
		{si, "GPa", "Pa", 1e-9},
		// A unit weight in kN/m³ is a density of 1000/gₙ kg/m³ (standard gravity, exact).
		{si, "kN/m³", "kg/m³", gn / 1000},
		{si, "N/m³", "kg/m³", gn},
		{si, "t/m³", "kg/m³", 1e-3},
		{si, "lb/ft³", "kg/m³", 1 / pcf},
		{base, "psi", "Pa", 1 / psi},
		{base, "ksi", "Pa", 1 / ksi},
	}
	for _, c := range cases {
		var found []slip
		for _, s := range append(modulusSlips(c.units), densitySlips(c.units)...) {
			if s.typed == c.typed && s.expected == c.expected {
				found = append(found, s)
			}
		}
		if len(found) != 1 {
			t.Errorf("%s: %d slips of %s typed where %s is expected, want 1", c.units.Name, len(found), c.typed, c.expected)
			continue
		}
		if got := found[0].ratio; math.Abs(got-c.want) > 1e-14*c.want {
			t.Errorf("%s: %s typed where %s is expected: ratio %.17g, want %.17g", c.units.Name, c.typed, c.expected, got, c.want)
		}
	}
	// A ksi field takes no unit weights in SI units, nor an SI window a ksi
	// slip, and no E field takes MPa (the window's takes GPa, a file's Pa).
	for _, c := range []struct {
		units           units.System
		typed, expected string
	}{{us, "kN/m³", "lb/ft³"}, {si, "MPa", "ksi"}, {base, "MPa", "GPa"}, {si, "GPa", "MPa"}, {si, "Pa", "MPa"}, {si, "ksi", "MPa"}} {
		for _, s := range append(modulusSlips(c.units), densitySlips(c.units)...) {
			if s.typed == c.typed && s.expected == c.expected {
				t.Errorf("%s: slip %s typed where %s is expected, which no field of these units expects", c.units.Name, c.typed, c.expected)
			}
		}
	}
}
