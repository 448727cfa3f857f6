package fem

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"sort"
)

// KeyPoints returns the sorted points that must be nodes, the one rule every
// part of Stave uses: the ends, segment breaks, supports, point loads and
// every break point of the distributed loads (Features), clamped to the
// member, with points closer than mergeTolerance·L taken as one.
func KeyPoints(m *Model) []float64 {
	features := Features(m)
	pts := make([]float64, 0, len(features)+2)
	pts = append(pts, 0, m.Length())
	for _, f := range features {
		pts = append(pts, f.X)
	}
	return mergeSorted(pts, m.Length())
}

// systemKeyPoints are the key points the factorized key-point system holds:
// those where the member itself changes, its ends, the supports, the
// hinges, the ends of foundations and the breaks between segments of
// different stiffness. Loads stay out of it (pieces.go): a load close to a
// support would otherwise make a short, stiff stretch there.
func systemKeyPoints(m *Model) []float64 {
	pts := []float64{0, m.Length()}
	for _, s := range m.Supports {
		pts = append(pts, s.X)
	}
	for _, h := range m.Hinges {
		pts = append(pts, h.X)
	}
	for _, f := range m.Foundations {
		pts = append(pts, f.Start, f.End)
	}
	for i := 1; i < len(m.Segments); i++ {
		if !sameStiffness(m.Segments[i-1], m.Segments[i]) {
			pts = append(pts, m.Segments[i].Start)
		}
	}
	return mergeSorted(pts, m.Length())
}

// sameStiffness reports whether two segments give the solver the same
// stretch: the same E·A, E·I, thermal expansion and free curvature of a
// temperature difference, α·ΔT/depth (a break between them changes only
// what is read off the fields, such as stresses).
func sameStiffness(a, b Segment) bool {
	ea, eb := a.Material, b.Material
	return a.ShearFlexibility() == b.ShearFlexibility() &&
		ea.Elastic*a.Section.Area == eb.Elastic*b.Section.Area &&
		ea.Elastic*a.Section.SecondMoment == eb.Elastic*b.Section.SecondMoment &&
		ea.ThermalExpansion == eb.ThermalExpansion &&
		a.TemperatureDifference/a.Section.depth() == b.TemperatureDifference/b.Section.depth()
}

// mergeSorted sorts pts, clamps them to [0, L] and keeps one point of each
// cluster closer than mergeTolerance·L. pts must hold 0 and L, which are kept exactly.
func mergeSorted(pts []float64, L float64) []float64 {
	tol := mergeTolerance * L
	for i, x := range pts {
		pts[i] = min(max(x, 0), L)
	}
	slices.Sort(pts)
	out := pts[:1]
	for _, x := range pts[1:] {
		last := len(out) - 1
		if x-out[last] > tol {
			out = append(out, x)
		} else if x == L && last > 0 {
			out[last] = L
		}
	}
	return out
}

// BuildMesh divides the member as Model.Mesh asks: nodes at every key point,
// then each stretch between key points is divided uniformly into
// max(1, round(Elements·len/L)) elements, or ceil(len/MaxElementLength) when
// that is finer. With neither setting each stretch is one element.
func BuildMesh(m *Model) (Mesh, error) {
	p, err := Prepare(m)
	if err != nil {
		return Mesh{}, err
	}
	return p.Mesh(), nil
}

// Mesh divides the member as its Model.Mesh asks (see BuildMesh), or, when
// the settings leave it to Stave, as the default mesh rule does
// (automesh.go).
func (p *Member) Mesh() Mesh {
	if p.model.Mesh.Automatic() {
		n, note := p.automaticCounts()
		mesh := p.meshWith(n)
		mesh.Automatic, mesh.Note = true, note
		return mesh
	}
	n := p.requestedCounts()
	pieces := make([][]int, len(n))
	for j, c := range n {
		pieces[j] = []int{c}
	}
	return p.meshWith(pieces)
}

// requestedCounts are the element counts per stretch of p.keys that the
// model's mesh settings ask for: max(1, round(Elements·len/L)), or
// ceil(len/MaxElementLength) when that is finer.
func (p *Member) requestedCounts() []int {
	m, keys := &p.model, p.keys
	L := m.Length()
	n := make([]int, len(keys)-1)
	for j := range n {
		span := keys[j+1] - keys[j]
		n[j] = 1
		if m.Mesh.Elements > 0 {
			n[j] = max(n[j], int(math.Round(float64(m.Mesh.Elements)*span/L)))
		}
		if h := m.Mesh.MaxElementLength; h > 0 {
			// The factor keeps a stretch of exactly k·h from getting k+1 elements by round-off.
			n[j] = max(n[j], int(math.Ceil(span/h*(1-1e-12))))
		}
	}
	return n
}

// meshWith divides stretch j of p.keys into len(n[j]) equal pieces and
// piece i of it uniformly into n[j][i] elements.
func (p *Member) meshWith(n [][]int) Mesh {
	keys := p.keys
	total := 1
	for _, c := range n {
		for _, ci := range c {
			total += ci
		}
	}
	x := make([]float64, 0, total)
	x = append(x, keys[0])
	for j, c := range n {
		a, b := keys[j], keys[j+1]
		for i, ci := range c {
			// Piece i runs from t0 to t1 of the stretch.
			t0, t1 := float64(i)/float64(len(c)), float64(i+1)/float64(len(c))
			for q := 1; q < ci; q++ {
				x = append(x, a+(b-a)*(t0+(t1-t0)*float64(q)/float64(ci)))
			}
			if i < len(c)-1 {
				x = append(x, a+(b-a)*t1)
			}
		}
		x = append(x, b)
	}
	return meshOn(&p.model, x)
}

// MeshFromNodes builds a mesh on caller-chosen node positions x (increasing,
// within [0, L]); key points missing from x are added, so the result can be
// solved with SolveOnMesh. It is meant for adaptive refinement.
func MeshFromNodes(m *Model, x []float64) (Mesh, error) {
	p, err := Prepare(m)
	if err != nil {
		return Mesh{}, err
	}
	return p.MeshOn(x)
}

// MeshOn builds a mesh on the node positions x (see MeshFromNodes).
func (p *Member) MeshOn(x []float64) (Mesh, error) {
	m := &p.model
	L := m.Length()
	tol := mergeTolerance * L
	for i, xi := range x {
		switch {
		case !isFinite(xi):
			return Mesh{}, fmt.Errorf("fem: node %d has position %v: give finite positions", i+1, xi)
		case xi < -tol || xi > L+tol:
			return Mesh{}, fmt.Errorf("fem: node %d at x = %s lies outside the member (length %s)", i+1, fmtMetres(xi), fmtMetres(L))
		case i > 0 && xi < x[i-1]:
			return Mesh{}, fmt.Errorf("fem: node %d (x = %s) lies before node %d (x = %s): list nodes in increasing x", i+1, fmtMetres(xi), i, fmtMetres(x[i-1]))
		}
	}
	keys := p.keys
	all := make([]float64, 0, len(x)+len(keys))
	all = append(all, keys...)
	// Nodes that nearly coincide with a key point give way to it.
	for _, xi := range x {
		k := nearest(keys, xi)
		if math.Abs(keys[k]-xi) > tol {
			all = append(all, xi)
		}
	}
	return meshOn(m, mergeSorted(all, L)), nil
}

// meshOn makes the elements between consecutive nodes x.
func meshOn(m *Model, x []float64) Mesh {
	els := make([]Element, len(x)-1)
	seg := 0
	for i := range els {
		mid := 0.5 * (x[i] + x[i+1])
		for seg < len(m.Segments)-1 && mid >= m.Segments[seg].End {
			seg++
		}
		els[i] = Element{Segment: seg, Start: x[i], End: x[i+1], First: i}
	}
	return Mesh{X: x, Elements: els}
}

// NodeNearest returns the index in m.X of the node closest to x, m: the node
// a support, point load or load break at x sits on.
func (m Mesh) NodeNearest(x float64) int { return nearest(m.X, x) }

// nearest returns the index of the value of sorted xs closest to x.
func nearest(xs []float64, x float64) int {
	i := sort.SearchFloat64s(xs, x)
	switch {
	case i == len(xs):
		return i - 1
	case i > 0 && x-xs[i-1] < xs[i]-x:
		return i - 1
	}
	return i
}

// checkMesh makes sure a caller-supplied mesh is one meshOn could have made
// for m with key points keys.
func checkMesh(m *Model, keys []float64, mesh Mesh) error {
	n := len(mesh.Elements)
	if n == 0 || len(mesh.X) != n+1 {
		return errors.New("fem: the mesh has no elements or its node list does not match them: build it with BuildMesh or MeshFromNodes")
	}
	L := m.Length()
	tol := mergeTolerance * L
	if math.Abs(mesh.X[0]) > tol || math.Abs(mesh.X[n]-L) > tol {
		return fmt.Errorf("fem: the mesh spans x = %s to %s but the member is %s long: rebuild the mesh", fmtMetres(mesh.X[0]), fmtMetres(mesh.X[n]), fmtMetres(L))
	}
	for i, e := range mesh.Elements {
		if e.First != i || e.Start != mesh.X[i] || e.End != mesh.X[i+1] || !(e.End > e.Start) || e.Segment < 0 || e.Segment >= len(m.Segments) {
			return fmt.Errorf("fem: element %d of the mesh is inconsistent (x = %s to %s): rebuild the mesh", i+1, fmtMetres(e.Start), fmtMetres(e.End))
		}
	}
	for _, k := range keys {
		if math.Abs(mesh.X[nearest(mesh.X, k)]-k) > tol {
			return fmt.Errorf("fem: the mesh has no node at the key point x = %s: build it with BuildMesh or MeshFromNodes", fmtMetres(k))
		}
	}
	return nil
}
