package fem

import "math"

// Loads is what a model applies to its member, gathered once onto the
// stretches between key points, where every distributed load and the
// self-weight is linear. The finite element solve, the exact solution,
// equilibrium, the handbook recognition and the benchmarks all read loads
// from here; none gathers them from the model itself.
type Loads struct {
	// Keys are the points the loads were gathered on, in increasing order,
	// from 0 to L; stretch j runs from Keys[j] to Keys[j+1]. Every break
	// point of a distributed load and every segment break is among them.
	Keys []float64 // m
	// Axial and Transverse hold, per stretch, the line load at its start and
	// its end: the distributed loads plus the self-weight, N/m.
	Axial, Transverse [][2]float64
	// Points are the concentrated forces and moments, at their own x.
	Points []PointLoad
	// TemperatureChange is the uniform change of temperature, K.
	TemperatureChange float64
	// TemperatureDifference is each segment's temperature difference
	// through the depth (Segment.TemperatureDifference), K; nil when none.
	TemperatureDifference []float64
	// Settlement is each support's prescribed displacement, in the order of
	// Model.Supports: m, m, rad (see Support.Settlement).
	Settlement [][3]float64
}

// GatherLoads gathers the loads of m onto the stretches between keys, which
// must be increasing, run from 0 to L and hold every segment break and
// every break point of the distributed loads (KeyPoints does). It takes time
// linear in the number of stretches and load vertices.
func GatherLoads(m *Model, keys []float64) Loads {
	n := len(keys) - 1
	l := Loads{
		Keys:              keys,
		Axial:             make([][2]float64, n),
		Transverse:        make([][2]float64, n),
		Points:            m.PointLoads,
		TemperatureChange: m.TemperatureChange,
		Settlement:        make([][3]float64, len(m.Supports)),
	}
	for i, s := range m.Supports {
		l.Settlement[i] = s.Settlement
	}
	for i, s := range m.Segments {
		if s.TemperatureDifference != 0 {
			if l.TemperatureDifference == nil {
				l.TemperatureDifference = make([]float64, len(m.Segments))
			}
			l.TemperatureDifference[i] = s.TemperatureDifference
		}
	}
	seg := 0
	for j := range n {
		mid := 0.5 * (keys[j] + keys[j+1])
		for seg < len(m.Segments)-1 && mid >= m.Segments[seg].End {
			seg++
		}
		s := m.Segments[seg]
		weight := s.Material.Density * s.Section.Area // kg/m
		l.Axial[j] = [2]float64{weight * m.Gravity[0], weight * m.Gravity[0]}
		l.Transverse[j] = [2]float64{weight * m.Gravity[1], weight * m.Gravity[1]}
	}
	for _, d := range m.DistributedLoad {
		target := l.Transverse
		if d.Direction == Axial {
			target = l.Axial
		}
		for k := 1; k < len(d.Points); k++ {
			a, b := d.Points[k-1], d.Points[k]
			if !(b.X > a.X) {
				continue // a step: no length, no load
			}
			slope := (b.Intensity - a.Intensity) / (b.X - a.X)
			for j := nearest(keys, a.X); j < nearest(keys, b.X); j++ {
				target[j][0] += a.Intensity + slope*(keys[j]-a.X)
				target[j][1] += a.Intensity + slope*(keys[j+1]-a.X)
			}
		}
	}
	return l
}

// bendsMember reports whether anything in l loads the beam problem: a
// transverse force, a moment, a transverse line load (self-weight across
// the member included) or a settlement across the member or in rotation.
func (l *Loads) bendsMember() bool {
	for _, p := range l.Points {
		if p.Transverse != 0 || p.Moment != 0 {
			return true
		}
	}
	for _, q := range l.Transverse {
		if q[0] != 0 || q[1] != 0 {
			return true
		}
	}
	for _, s := range l.Settlement {
		if s[Transverse] != 0 || s[Rotation] != 0 {
			return true
		}
	}
	return l.TemperatureDifference != nil
}

// Resultant sums the loads exactly: the force along x, the force along y
// and the moment about x = 0 (counter-clockwise), N, N, N·m.
func (l *Loads) Resultant() [3]float64 {
	var r [3]float64
	for _, p := range l.Points {
		r[0] += p.Axial
		r[1] += p.Transverse
		r[2] += p.Moment + p.X*p.Transverse
	}
	for j := range l.Axial {
		a, b := l.Keys[j], l.Keys[j+1]
		h := b - a
		p, q := l.Axial[j], l.Transverse[j]
		r[0] += 0.5 * h * (p[0] + p[1])
		r[1] += 0.5 * h * (q[0] + q[1])
		// ∫x·q dx for q linear on [a, b].
		r[2] += h / 6 * (q[0]*(2*a+b) + q[1]*(a+2*b))
	}
	return r
}

// Sizes are the sizes of the terms Resultant sums, each taken without its
// sign and added up: N, N and N·m. Loads that balance among themselves
// (opposite couples, a force pair with its couple) have a resultant of
// nothing but sizes that are not, against which the round-off of their
// balance with the reactions is measured.
func (l *Loads) Sizes() [3]float64 {
	var r [3]float64
	for _, p := range l.Points {
		r[0] += math.Abs(p.Axial)
		r[1] += math.Abs(p.Transverse)
		r[2] += math.Abs(p.Moment) + math.Abs(p.X*p.Transverse)
	}
	for j := range l.Axial {
		a, b := l.Keys[j], l.Keys[j+1]
		h := b - a
		p, q := l.Axial[j], l.Transverse[j]
		r[0] += 0.5 * h * (math.Abs(p[0]) + math.Abs(p[1]))
		across := 0.5 * h * (math.Abs(q[0]) + math.Abs(q[1]))
		r[1] += across
		r[2] += max(math.Abs(a), math.Abs(b)) * across
	}
	return r
}

// TransverseAt is the transverse line load at x from the loads of stretch j
// (which must hold x), N/m; AxialAt the axial one.
func (l *Loads) TransverseAt(j int, x float64) float64 {
	return linearAt(l.Keys, l.Transverse[j], j, x)
}

// AxialAt is the axial line load at x on stretch j, N/m (see TransverseAt).
func (l *Loads) AxialAt(j int, x float64) float64 { return linearAt(l.Keys, l.Axial[j], j, x) }

// linearAt interpolates the values v at the ends of stretch j at x; at
// either end it gives that end's value exactly.
func linearAt(keys []float64, v [2]float64, j int, x float64) float64 {
	switch x {
	case keys[j]:
		return v[0]
	case keys[j+1]:
		return v[1]
	}
	t := (x - keys[j]) / (keys[j+1] - keys[j])
	return v[0] + (v[1]-v[0])*t
}
