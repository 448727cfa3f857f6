package fem

import (
	"errors"
	"math"
	"testing"
)

// A ground beam on its bed with nothing holding it along its axis and
// nothing pushing it along is solved, its axial displacement measured from
// x = 0: the same answer as with an axial support at mid-length that
// carries no force. Under a central point load P on a long beam the ground
// carries all of P (statics) and the deflection under the load is
// P·β/(2k), β = (k/4EI)^¼ (Hetényi, Beams on Elastic Foundation, 1946, the
// infinite beam; from memory). A load along the member, or a beam on
// supports alone, still needs an axial restraint.
func TestFreeGroundBeamSlidesFree(t *testing.T) {
	ei := testE * testI
	const k, P = 6.4e6, 80e3 // N/m², N
	beta := math.Sqrt(math.Sqrt(k / (4 * ei)))
	L := 42 / beta
	held := groundModel(L, k)
	held.PointLoads = []PointLoad{{X: L / 2, Transverse: -P}}
	free := held.Clone()
	free.Supports = nil

	hs, fs := mustSolve(t, held), mustSolve(t, &free)
	he, err := SolveExact(held)
	if err != nil {
		t.Fatal(err)
	}
	fe, err := SolveExact(&free)
	if err != nil {
		t.Fatal(err)
	}
	want := -P * beta / (2 * k)
	for name, f := range map[string]Field{"FE": fs, "exact": fe} {
		if got := f.At(L/2, Left).Deflection; math.Abs(got-want) > 1e-6*math.Abs(want) {
			t.Errorf("%s deflection under the load %.9g m, want %.9g (Hetényi)", name, got, want)
		}
	}
	for _, x := range []float64{0, L / 4, L / 2, 0.9 * L} {
		for name, pair := range map[string][2]Field{"FE": {hs, fs}, "exact": {he, fe}} {
			a, b := pair[0].At(x, Right), pair[1].At(x, Right)
			if math.Abs(a.Deflection-b.Deflection) > 1e-9*math.Abs(want) || math.Abs(a.BendingMoment-b.BendingMoment) > 1e-9*P/beta {
				t.Errorf("%s at x = %.3g: w %.9g|%.9g, M %.9g|%.9g with and without the axial support", name, x, a.Deflection, b.Deflection, a.BendingMoment, b.BendingMoment)
			}
			if b.AxialDisplacement != 0 || b.AxialForce != 0 {
				t.Errorf("%s at x = %.3g: u = %g, N = %g, want 0 with nothing along the member", name, x, b.AxialDisplacement, b.AxialForce)
			}
		}
	}
	if len(fs.Reactions) != 0 {
		t.Errorf("the free beam has %d reactions, want none", len(fs.Reactions))
	}
	ground := 0.0
	for _, g := range fs.Foundations {
		ground += g.Force[Transverse]
	}
	if math.Abs(ground-P) > 1e-6*P {
		t.Errorf("the ground carries %.9g N across, want P = %g (statics)", ground, P)
	}

	var me *MechanismError
	pushed := free.Clone()
	pushed.PointLoads = append(pushed.PointLoads, PointLoad{X: 0, Axial: 1e3})
	if _, err := Solve(&pushed); !errors.As(err, &me) || me.Motion != "axial" {
		t.Errorf("a ground beam pushed along with nothing to hold it: got %v, want the axial mechanism", err)
	}
	onSupports := free.Clone()
	onSupports.Foundations = nil
	onSupports.Supports = []Support{{X: 0, Kind: Roller}, {X: L, Kind: Roller}}
	if _, err := Solve(&onSupports); !errors.As(err, &me) || me.Motion != "axial" {
		t.Errorf("a beam on two rollers: got %v, want the axial mechanism", err)
	}
}
