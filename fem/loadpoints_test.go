package fem_test

import (
	"strings"
	"testing"

	"stave/fem"
)

// Two points of a distributed load closer than the merge tolerance (1e-12
// of the member's length, fem's rule for one point) are refused; when the
// second lies beyond the first, though by less than that, the message says
// they count as one point: it said the point "does not lie beyond" one
// that printed smaller (x = 2.000000000000001 m after x = 2.0 m). Points
// out of order or at one place keep the old sentence.
func TestLoadPointsCloserThanTheTolerance(t *testing.T) {
	for _, c := range []struct {
		second float64
		says   string
	}{
		{2 + 1e-15, "point 3 (x = 2.000000000000001 m) lies beyond point 2 (x = 2.0 m) by less than 1e-12 of the member's length, so they count as one point"},
		{2, "point 3 (x = 2.0 m) does not lie beyond point 2 (x = 2.0 m)"},
		{1, "point 3 (x = 1.0 m) does not lie beyond point 2 (x = 2.0 m)"},
	} {
		m := tiled(1, 4)
		m.DistributedLoad[0].Points = []fem.LoadPoint{{X: 0, Intensity: -1}, {X: 2, Intensity: -2}, {X: c.second, Intensity: -3}, {X: 4, Intensity: -1}}
		err := m.Validate()
		if err == nil || !strings.Contains(err.Error(), c.says) {
			t.Errorf("second point at %v: %v, want %q", c.second, err, c.says)
		}
	}
}
