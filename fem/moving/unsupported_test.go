package moving

import (
	"strings"
	"testing"

	"stave/fem"
)

// The closed-form influence lines do not take an elastic foundation or
// shear deformation (before, they left them out silently: the midspan
// moment of a simple span on a bed read the bare span's L/4 where the
// member solved with the load there gives about −0.02 m). Such members get
// a message that says so, across or along as it applies; the other
// direction still answers.
func TestInfluenceRefusesWhatItLeavesOut(t *testing.T) {
	bed := knotty()
	bed.Foundations = []fem.Foundation{{Start: 0, End: 10, Modulus: 5e6}}
	shear := knotty()
	shear.Segments[1].ShearDeformation = true
	shear.Segments[1].Section.ShearCoefficient = 5.0 / 6
	shear.Segments[1].Material.Poisson = 0.3
	skin := knotty()
	skin.Foundations = []fem.Foundation{{Start: 2, End: 8, AxialModulus: 1e7}}
	across := Target{Quantity: fem.QBendingMoment, X: 5}
	along := Target{Quantity: fem.QAxialForce, X: 5}
	for _, c := range []struct {
		name            string
		m               *fem.Model
		refused, answer Target
		why             string
	}{
		{"bed", bed, across, along, "an elastic foundation across it"},
		{"shear", shear, across, along, "shear deformation"},
		{"skin friction", skin, along, across, "an elastic foundation along it"},
	} {
		in := influence(t, c.m)
		if _, err := in.Line(c.refused); err == nil || !strings.Contains(err.Error(), c.why) {
			t.Errorf("%s: %v, want a refusal naming %q", c.name, err, c.why)
		}
		if _, err := in.Line(c.answer); err != nil {
			t.Errorf("%s: the other direction: %v", c.name, err)
		}
	}
}
