package moving

import (
	"fmt"
	"strings"
	"testing"

	"stave/fem"
)

// The finite element line solves the member once per node a load stands
// on, each solve as long as the mesh: a line of 100,000 points on a mesh of
// 100,000 elements ran past 100 s with nothing written. Past
// MaxFELineWork element-solves it is refused, naming the most points that
// fit; points that share a node share its solve, so a fine line on a
// coarse mesh costs no more than the mesh's nodes.
func TestFELineWork(t *testing.T) {
	const L = 10.0
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	m.Mesh = fem.MeshSettings{Elements: 20_000}
	p, err := fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	tg := Target{Quantity: fem.QBendingMoment, X: 2.5}
	spread := func(n int) []float64 {
		out := make([]float64, n+1)
		for i := range out {
			out[i] = L * float64(i) / float64(n)
		}
		return out
	}
	elements := len(p.Mesh().Elements)
	n := MaxFELineWork/elements + 100 // past the limit, each point on a node of its own
	_, _, err = FELine(p, p.Mesh(), tg, spread(n))
	if err == nil || !strings.Contains(err.Error(), fmt.Sprintf("at most %d points", MaxFELineWork/elements-1)) {
		t.Errorf("%d points on %d elements: %v, want them refused naming at most %d points", n, elements, err, MaxFELineWork/elements-1)
	}
	// On 40 elements 100,000 points stand on 41 nodes: 41 solves. Each
	// shares its node's value; the simple span's moment at 2.5 m with the
	// unit load at s on a node is s·(L − 2.5)/L before 2.5 m and
	// 2.5·(L − s)/L after (statics).
	m.Mesh = fem.MeshSettings{Elements: 40}
	p, err = fem.Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	values, at, err := FELine(p, p.Mesh(), tg, spread(100_000))
	if err != nil {
		t.Fatalf("100,000 points on 40 elements: %v", err)
	}
	for i, s := range at {
		want := 2.5 * (L - s) / L
		if s < 2.5 {
			want = s * (L - 2.5) / L
		}
		if !near(values[i], want, 1e-9) {
			t.Fatalf("the load on the node at %g m: %.12g, want %.12g (statics)", s, values[i], want)
		}
	}
}
