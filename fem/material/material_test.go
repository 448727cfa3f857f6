package material

import (
	"math"
	"strings"
	"testing"

	"stave/fem"
)

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
		if w := FarFromTypical(m); len(w) != 0 {
			t.Errorf("%s: a typical material is flagged: %v", m.Name, w)
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

func TestFarFromTypical(t *testing.T) {
	steel := Typical()[0].Material
	with := func(elastic, density float64) fem.Material {
		m := steel
		m.Name = "input"
		m.Elastic, m.Density = elastic, density
		return m
	}
	cases := []struct {
		name     string
		material fem.Material
		want     []string // each must appear in some warning; nil means no warning
	}{
		{"steel as typed correctly", with(200e9, 7850), nil},
		{"aluminium", with(70e9, 2710), nil},
		{"aluminium with steel's density is within the factor of 3", with(70e9, 7850), nil},
		{"timber", with(12e9, 500), nil},
		{"density 0 leaves out self-weight", with(210e9, 0), nil},
		{"MPa typed in a GPa field", with(2.1e14, 7850), []string{"1000 times", "MPa where GPa"}},
		{"GPa typed in a Pa field", with(210, 7850), []string{"GPa where Pa"}},
		{"MPa typed in a Pa field", with(210000, 7850), []string{"MPa where Pa"}},
		// 29000 ksi typed as MPa gives a plausible concrete E; only the density
		// of steel beside it gives the mistake away.
		{"ksi typed in an MPa field", with(29000e6, 7850), []string{"3.27 times that of typical concrete", "same material"}},
		{"ksi typed in a GPa field", with(29000e9, 7850), []string{"MPa where GPa"}},
		{"MPa typed in a ksi field", with(200000*6.894757293168361e6, 7850), []string{"MPa where ksi"}},
		{"unit weight typed as density", with(210e9, 78.5), []string{"unit weight in kN/m³"}},
		{"t/m³ typed as kg/m³", with(33e9, 2.4), []string{"t/m³"}},
		{"lb/ft³ typed as kg/m³", with(210e9, 490), []string{"lb/ft³"}},
		{"a plastic: soft, no slip to name", with(3e9, 1200), []string{"1/3.67 of that of typical timber", "If your material really is"}},
		{"zero modulus", with(0, 7850), []string{"must be a positive number"}},
		{"negative density", with(210e9, -1), []string{"must be a finite number, not negative"}},
	}
	for _, c := range cases {
		got := FarFromTypical(c.material)
		t.Logf("%s: %q", c.name, got)
		if c.want == nil {
			if len(got) != 0 {
				t.Errorf("%s: unexpected warnings %q", c.name, got)
			}
			continue
		}
		all := strings.Join(got, "\n")
		for _, w := range c.want {
			if !strings.Contains(all, w) {
				t.Errorf("%s: warnings %q do not contain %q", c.name, got, w)
			}
		}
	}
}
