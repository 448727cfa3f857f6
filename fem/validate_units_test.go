package fem

import (
	"strings"
	"testing"

	"stave/fem/units"
)

// ValidateIn quotes the values of its messages in the display units it is
// given, and Validate in SI base units, as a file holds them. Factors
// exact, NIST SP 811 (2008), Appendix B: 1 ft = 0.3048 m, 1 in = 0.0254 m,
// 1 lbf = 4.4482216152605 N, 1 kip = 1000 lbf.
func TestValidateInDisplayUnits(t *testing.T) {
	const (
		ft  = 0.3048
		in  = 0.0254
		kip = 4448.2216152605
	)
	for _, c := range []struct {
		name string
		edit func(m *Model)
		u    units.System
		want string
	}{
		// validModel is 3 m long: 3/0.3048 = 9.84252 ft.
		{"support past the end", func(m *Model) { m.Supports[1].X = 12 * ft }, units.USCustomary,
			"support 2 at x = 12.0 ft lies outside the member (length 9.84252 ft)"},
		{"support past the end", func(m *Model) { m.Supports[1].X = 3.2 }, units.Base,
			"support 2 at x = 3.2 m lies outside the member (length 3.0 m)"},
		{"support past the end", func(m *Model) { m.Supports[1].X = 3.2 }, units.SI,
			"support 2 at x = 3.2 m lies outside the member (length 3.0 m)"},
		// The zero System, units of no name, is SI base units, as Validate
		// quotes them (elsewhere an unnamed system is SI too).
		{"support past the end", func(m *Model) { m.Supports[1].X = 3.2 }, units.System{},
			"support 2 at x = 3.2 m lies outside the member (length 3.0 m)"},
		{"negative area", func(m *Model) { m.Segments[0].Section.Area = -2 * in * in }, units.USCustomary,
			"segment 1: the area A is -2.0 in²: it must be positive"},
		{"negative area", func(m *Model) { m.Segments[0].Section.Area = -2e-6 }, units.SI,
			"segment 1: the area A is -2.0 mm²: it must be positive"},
		{"negative spring", func(m *Model) {
			m.Supports[1].Kind, m.Supports[1].Stiffness[Transverse] = Spring, -5*kip/in
		}, units.USCustomary, "support 2: the transverse spring stiffness is -5.0 kip/in: it must not be negative"},
		{"distributed load backwards", func(m *Model) { m.DistributedLoad[0].Points[1].X = 0 }, units.USCustomary,
			"distributed load 1 starts and ends at x = 0.0 ft: give it a length"},
		{"hinge at the end", func(m *Model) { m.Hinges = []Hinge{{X: 3}} }, units.USCustomary,
			"hinge 1 is at an end of the member (x = 9.84252 ft)"},
		{"shear coefficient", func(m *Model) { m.Segments[0].Section.ShearCoefficient = -1 }, units.USCustomary,
			"segment 1: the shear coefficient is -1.0: it must be zero or positive"},
	} {
		m := validModel()
		c.edit(m)
		err := m.ValidateIn(c.u)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s in %s: got %v, want %q", c.name, c.u.Name, err, c.want)
		}
	}
	m := validModel()
	m.Supports[1].X = 3.2
	if a, b := m.Validate(), m.ValidateIn(units.Base); a == nil || a.Error() != b.Error() {
		t.Errorf("Validate says %v, ValidateIn(units.Base) %v", a, b)
	}
}
