package analysis

import (
	"context"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/units"
)

// The cautions on a segment's section and temperature load quote its
// values in the analysis' display units, as the checks do. Factors exact,
// NIST SP 811 (2008), Appendix B: 1 in = 0.0254 m, so 1 in² = 6.4516e-4
// m², and a difference of 1 °F is 5/9 K.
func TestSectionFindingsInDisplayUnits(t *testing.T) {
	const in = 0.0254
	seg := fem.Segment{Start: 0, End: 3, TemperatureDifference: 10, // no α: the caution
		Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 6 * in, Depth: 16 * in, ShearArea: 10 * in * in},
		Material: fem.Material{Elastic: 210e9}}
	m := fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}}
	for _, c := range []struct {
		u    units.System
		want []string
	}{
		{units.USCustomary, []string{
			"its temperature difference of 18.00 °F through the depth",
			"Segment 1 gives a shear area 10.00 in² but does not deform in shear",
			"Segment 1's depth h = 16.00 in is more than twice its extreme fibre distance c = 6.000 in, so its other face lies 10.00 in from the neutral axis",
		}},
		{units.SI, []string{
			"its temperature difference of 10.00 K through the depth",
			"Segment 1 gives a shear area 6452 mm² but does not deform in shear",
			"Segment 1's depth h = 406.4 mm is more than twice its extreme fibre distance c = 152.4 mm, so its other face lies 254.0 mm from the neutral axis",
		}},
	} {
		all := messagesOf(materialFindingsIn(t, m, c.u), "")
		for _, w := range c.want {
			if !strings.Contains(all, w) {
				t.Errorf("in %s the cautions lack %q:\n%s", c.u.Name, w, all)
			}
		}
	}
}

// The caution on a material far from typical quotes E in the analysis'
// display units and names the slip of the field typed into: steel's
// 29,000 ksi (AISC, from memory) typed in psi. Factors exact, NIST SP 811
// (2008), Appendix B: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m.
func TestMaterialFindingInDisplayUnits(t *testing.T) {
	const ksi = 1000 * 4.4482216152605 / (0.0254 * 0.0254)
	seg := fem.Segment{Start: 0, End: 3,
		Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.1},
		Material: fem.Material{Name: "steel", Elastic: 29e6 * ksi}}
	m := fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}}
	for _, c := range []struct {
		u    units.System
		want string
	}{
		{units.USCustomary, "steel: E = 2.900e+07 ksi is 1000 times that of typical steel (29000 ksi), the nearest typical material. Did you type a value in psi where ksi is expected?"},
		// Compared in SI with EN 1993-1-1's 210 GPa, as every SI caution is.
		{units.SI, "steel: E = 199900 GPa is 952 times that of typical steel (210.0 GPa), the nearest typical material. Did you type a value in MPa where GPa is expected?"},
	} {
		if all := messagesOf(materialFindingsIn(t, m, c.u), "material of segment 1"); !strings.Contains(all, c.want) {
			t.Errorf("in %s the material caution is not %q:\n%s", c.u.Name, c.want, all)
		}
	}
}

// The caution on a temperature load without α quotes typical values in
// the analysis' display units, each the one the material cautions compare
// with (material.TypicalIn): steel's 6.5e-6 per °F of the AISC Manual in
// US units, 12e-6 /K of EN 1993-1-1 §3.2.6 in SI, concrete's 10e-6 /K of
// EN 1992-1-1 §3.1.3 (5.556e-6 per °F: a kelvin is 9/5 °F, NIST SP 811
// (2008), Appendix B), all from memory. It read "steel 12e-6 /K" in US
// units too.
func TestThermalFindingQuotesTypicalValuesInDisplayUnits(t *testing.T) {
	seg := fem.Segment{Start: 0, End: 3, Section: fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.1},
		Material: fem.Material{Elastic: 210e9}} // no α: the caution
	m := fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}, TemperatureChange: 20}
	for _, c := range []struct {
		u         units.System
		want, not []string
	}{
		{units.USCustomary, []string{"steel 6.500e-06 1/°F", "concrete 5.556e-06 1/°F"}, []string{"/K"}},
		{units.SI, []string{"steel 1.200e-05 1/K", "concrete 1.000e-05 1/K"}, []string{"°F"}},
	} {
		opts := check.DefaultOptions()
		opts.Units = c.u
		a, err := Run(context.Background(), Request{Model: m, Checks: opts})
		if err != nil {
			t.Fatal(err)
		}
		all := messagesOf(a.Findings(), "thermal expansion of segment 1")
		for _, w := range c.want {
			if !strings.Contains(all, w) {
				t.Errorf("in %s the caution lacks %q:\n%s", c.u.Name, w, all)
			}
		}
		for _, w := range c.not {
			if strings.Contains(all, w) {
				t.Errorf("in %s the caution says %q:\n%s", c.u.Name, w, all)
			}
		}
	}
}

// A model its validation refuses is refused alike by both stages, in the
// display units: the exact solution's error is the finite element one's,
// not the same fault quoted again in SI base units.
func TestRefusedModelExactErrorInDisplayUnits(t *testing.T) {
	seg := fem.Segment{Start: 0, End: 3,
		Section:  fem.Section{Area: 0.01, SecondMoment: 1e-4, FibreDistance: 0.1},
		Material: fem.Material{Elastic: 210e9}}
	m := fem.Model{Segments: []fem.Segment{seg}, Supports: []fem.Support{{X: 0, Kind: fem.Fixed}, {X: 6.096, Kind: fem.Roller}},
		PointLoads: []fem.PointLoad{{X: 3, Transverse: -1e4}}}
	opts := check.DefaultOptions()
	opts.Units = units.USCustomary
	a, err := Run(context.Background(), Request{Model: m, Checks: opts})
	if err != nil {
		t.Fatal(err)
	}
	if a.Err == nil || a.ExactErr == nil {
		t.Fatalf("a support beyond the member's end was not refused: %v, %v", a.Err, a.ExactErr)
	}
	// 6.096 m = 20 ft exactly (NIST SP 811 (2008), Appendix B: 1 ft = 0.3048 m).
	if !strings.Contains(a.Err.Error(), "x = 20.0 ft") {
		t.Errorf("the refusal %q does not quote the support's place in feet", a.Err)
	}
	if a.ExactErr.Error() != a.Err.Error() {
		t.Errorf("the exact solution's refusal\n%q\ndiffers from the finite element one's\n%q", a.ExactErr, a.Err)
	}
}

// messagesOf are the messages of fs, those named name only unless it is "",
// one to a line.
func messagesOf(fs []Finding, name string) string {
	var said []string
	for _, f := range fs {
		if name == "" || f.Name == name {
			said = append(said, f.Message)
		}
	}
	return strings.Join(said, "\n")
}
