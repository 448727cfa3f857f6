package fem

import (
	"testing"

	"stave/fem/band"
	"stave/fem/units"
)

// The solver's messages quote places in the units PrepareIn is given, as
// ValidateIn's do, and Prepare's in SI base units. Factors exact, NIST SP
// 811 (2008), Appendix B: 1 ft = 0.3048 m.
func TestSolverMessagesInDisplayUnits(t *testing.T) {
	const ft = 0.3048
	load := []PointLoad{{X: 1 * ft, Transverse: -1000}}
	onePin := &Model{Segments: []Segment{testSegment(0, 20*ft)}, Supports: []Support{{X: 10 * ft, Kind: Pinned}}, PointLoads: load}
	hinged := &Model{Segments: []Segment{testSegment(0, 20*ft)}, Supports: []Support{{X: 0, Kind: Fixed}}, Hinges: []Hinge{{X: 8 * ft}}, PointLoads: load}
	for _, c := range []struct {
		name string
		m    *Model
		u    units.System
		want string
	}{
		{"one pin", onePin, units.USCustomary,
			"the member can rotate about the support at x = 10.0 ft: add a second support or fix one end"},
		{"one pin", onePin, units.SI,
			"the member can rotate about the support at x = 3.048 m: add a second support or fix one end"},
		{"one pin", onePin, units.Base,
			"the member can rotate about the support at x = 3.048 m: add a second support or fix one end"},
		{"one pin", onePin, units.System{},
			"the member can rotate about the support at x = 3.048 m: add a second support or fix one end"},
		{"hinged cantilever", hinged, units.USCustomary,
			"with its hinges the member is a mechanism: the part from x = 8.0 ft to 20.0 ft can turn about x = 8.0 ft; add a support under the free part, fix an end, or remove a hinge"},
		{"hinged cantilever", hinged, units.SI,
			"with its hinges the member is a mechanism: the part from x = 2.4384 m to 6.096 m can turn about x = 2.4384 m; add a support under the free part, fix an end, or remove a hinge"},
	} {
		p, err := PrepareIn(c.m, c.u)
		if err != nil {
			t.Fatalf("%s in %s: %v", c.name, c.u.Name, err)
		}
		if _, err := p.Solve(p.Mesh()); err == nil || err.Error() != c.want {
			t.Errorf("%s in %s: got %v, want %q", c.name, c.u.Name, err, c.want)
		}
	}
	p, err := Prepare(onePin)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := p.Solve(p.Mesh()); err == nil || err.Error() != "the member can rotate about the support at x = 3.048 m: add a second support or fix one end" {
		t.Errorf("Prepare: got %v, want the place in m", err)
	}
}

// A pivot that fails names its place in the units given (a failed pivot is
// built by hand: no small model is known to give one).
func TestPivotMessageInDisplayUnits(t *testing.T) {
	const ft = 0.3048
	nodes := []float64{0, 5 * ft, 10 * ft, 20 * ft}
	m := &Model{Segments: []Segment{testSegment(0, 20*ft)}}
	pe := &band.PivotError{Row: 2 * 2, Pivot: 1e-20, Diagonal: 1e10} // the beam's node 3 (x = 10 ft), 2 unknowns a node
	stretch := []float64{0, 10 * ft, 10*ft + 1e-4*ft, 20 * ft}
	ground := &Model{Segments: []Segment{testSegment(0, 20*ft)}, Foundations: []Foundation{{Start: 0, End: 20 * ft, Modulus: 1e6}}}
	beam := hermiteBeam{}
	for _, c := range []struct {
		name  string
		m     *Model
		nodes []float64
		u     units.System
		want  string
	}{
		{"soft spring", m, nodes, units.USCustomary,
			"the beam stiffness matrix is singular to working precision near x = 10.0 ft (pivot 1e-20 of diagonal 1e+10): check for very soft springs next to stiff parts, or stiffnesses many orders of magnitude apart"},
		{"soft spring", m, nodes, units.SI,
			"the beam stiffness matrix is singular to working precision near x = 3.048 m (pivot 1e-20 of diagonal 1e+10): check for very soft springs next to stiff parts, or stiffnesses many orders of magnitude apart"},
		{"short stretch", m, stretch, units.USCustomary,
			"the beam stiffness matrix is singular to working precision at the stretch from x = 10.0 ft to 10.0001 ft, only 0.0001 ft long on a member of 20.0 ft: supports or changes of section that close together make a piece too stiff to solve; move them apart or, if they are one, make them one point"},
		{"foundation", ground, nodes, units.USCustomary,
			"the beam equations over the elastic foundation near x = 10.0 ft are singular to working precision: on a foundation every node of the mesh enters them (4 nodes here), and they grow ill-conditioned as the fourth power of the number of elements; use fewer elements over the foundation, or leave the mesh to Stave"},
	} {
		if got := pivotMessage(c.m, c.nodes, beam, pe, c.u).Error(); got != c.want {
			t.Errorf("%s in %s:\n got %s\nwant %s", c.name, c.u.Name, got, c.want)
		}
	}
}
