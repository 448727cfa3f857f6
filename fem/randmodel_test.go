package fem_test

// A seeded generator of random valid, stable models of realistic size, shared
// by the property tests and the fuzz targets, and the independent statement of
// which rigid-body motion a set of supports leaves free.

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"stave/fem"
)

// loadKinds selects the kinds of action a random model may carry besides
// point and distributed loads.
type loadKinds struct {
	settlement  bool // prescribed support motions
	temperature bool // a uniform temperature change
	springs     bool // spring supports
	selfWeight  bool // gravity on the member's mass
}

var everyLoadKind = loadKinds{settlement: true, temperature: true, springs: true, selfWeight: true}

// gridIntervals divides the member for random positions: every position is
// j·L/gridIntervals with L a multiple of 1/8 m, so positions, L − x and the
// spans between them are exact binary fractions and a mirrored model meshes
// exactly like the original.
const gridIntervals = 64

// newRand returns the generator of one test; the seed is logged so a failure
// can be replayed.
func newRand(t testing.TB, seed uint64) *rand.Rand {
	t.Logf("random models from seed %d", seed)
	return rand.New(rand.NewPCG(seed, seed^0x5eed))
}

// logUniform draws from [lo, hi] with a uniform exponent, as physical
// magnitudes spread over decades.
func logUniform(rnd *rand.Rand, lo, hi float64) float64 {
	return lo * math.Pow(hi/lo, rnd.Float64())
}

// signed draws a magnitude from [lo, hi] (log-uniform) with a random sign.
func signed(rnd *rand.Rand, lo, hi float64) float64 {
	v := logUniform(rnd, lo, hi)
	if rnd.IntN(2) == 0 {
		return -v
	}
	return v
}

// gridPositions draws n distinct grid indices from [lo, hi], sorted.
func gridPositions(rnd *rand.Rand, n, lo, hi int) []int {
	idx := rnd.Perm(hi - lo + 1)[:n]
	for i := range idx {
		idx[i] += lo
	}
	slices.Sort(idx)
	return idx
}

// randomModel draws a valid model that the supports hold still. Magnitudes:
// E 1e9–2e11 Pa, A 1e-4–1e-1 m², I 1e-8–1e-3 m⁴ (timber to steel, small
// rods to large girders), L 1–20 m, loads 1e2–1e5 N, N/m and N·m.
func randomModel(rnd *rand.Rand, kinds loadKinds) *fem.Model {
	L := float64(8+rnd.IntN(153)) / 8
	at := func(j int) float64 { return L * float64(j) / gridIntervals }
	m := &fem.Model{}

	breaks := append([]int{0}, gridPositions(rnd, rnd.IntN(4), 1, gridIntervals-1)...)
	breaks = append(breaks, gridIntervals)
	for i := 1; i < len(breaks); i++ {
		m.Segments = append(m.Segments, fem.Segment{
			Start: at(breaks[i-1]), End: at(breaks[i]),
			Section: fem.Section{
				Area:          logUniform(rnd, 1e-4, 1e-1),
				SecondMoment:  logUniform(rnd, 1e-8, 1e-3),
				FibreDistance: logUniform(rnd, 0.01, 0.5),
			},
			Material: fem.Material{
				Elastic:          logUniform(rnd, 1e9, 2e11),
				Density:          logUniform(rnd, 400, 8000),
				ThermalExpansion: logUniform(rnd, 5e-6, 2.4e-5),
			},
		})
	}

	for {
		m.Supports = randomSupports(rnd, at, kinds)
		if freeMotion(m.Supports) == "" {
			break
		}
	}

	for _, j := range gridPositions(rnd, rnd.IntN(5), 0, gridIntervals) {
		p := fem.PointLoad{X: at(j)}
		switch rnd.IntN(4) {
		case 0:
			p.Axial = signed(rnd, 1e2, 1e5)
		case 1:
			p.Moment = signed(rnd, 1e2, 1e5)
		case 2:
			p.Axial, p.Transverse, p.Moment = signed(rnd, 1e2, 1e5), signed(rnd, 1e2, 1e5), signed(rnd, 1e2, 1e5)
		default:
			p.Transverse = signed(rnd, 1e2, 1e5)
		}
		m.PointLoads = append(m.PointLoads, p)
	}
	for range rnd.IntN(4) {
		d := fem.DistributedLoad{Direction: fem.Transverse}
		if rnd.IntN(3) == 0 {
			d.Direction = fem.Axial
		}
		for _, j := range gridPositions(rnd, 2+rnd.IntN(4), 0, gridIntervals) {
			q := 0.0
			if rnd.IntN(5) > 0 {
				q = signed(rnd, 1e2, 1e5)
			}
			d.Points = append(d.Points, fem.LoadPoint{X: at(j), Intensity: q})
		}
		m.DistributedLoad = append(m.DistributedLoad, d)
	}
	if len(m.PointLoads) == 0 && len(m.DistributedLoad) == 0 {
		m.PointLoads = []fem.PointLoad{{X: at(rnd.IntN(gridIntervals + 1)), Axial: signed(rnd, 1e2, 1e5), Transverse: signed(rnd, 1e2, 1e5)}}
	}
	if kinds.selfWeight && rnd.IntN(3) == 0 {
		// A member inclined at up to 60° from the horizontal.
		slope := rnd.Float64() * math.Pi / 3
		m.Gravity = [2]float64{-fem.StandardGravity * math.Sin(slope), -fem.StandardGravity * math.Cos(slope)}
	}
	if kinds.temperature && rnd.IntN(3) == 0 {
		m.TemperatureChange = 100 * (rnd.Float64() - 0.5)
	}
	m.Mesh = fem.MeshSettings{Elements: 1 + rnd.IntN(50), BarOrder: fem.ElementOrder(1 + rnd.IntN(2))}
	return m
}

// randomSupports draws 1–4 supports at distinct grid points, the ends twice
// as likely as any other point; it does not check stability.
func randomSupports(rnd *rand.Rand, at func(int) float64, kinds loadKinds) []fem.Support {
	count := 1 + rnd.IntN(4)
	var places []int
	for len(places) < count {
		j := rnd.IntN(gridIntervals + 1)
		if rnd.IntN(4) == 0 {
			j = gridIntervals * rnd.IntN(2)
		}
		if !slices.Contains(places, j) {
			places = append(places, j)
		}
	}
	kindCount := int(fem.Spring)
	if kinds.springs {
		kindCount++
	}
	sups := make([]fem.Support, count)
	for i, j := range places {
		s := fem.Support{X: at(j), Kind: fem.SupportKind(rnd.IntN(kindCount))}
		if s.Kind == fem.Spring {
			for s.Stiffness == [3]float64{} {
				for d := range s.Stiffness {
					if rnd.IntN(3) > 0 {
						// N/m for the forces, N·m/rad for the moment.
						s.Stiffness[d] = logUniform(rnd, 1e3, 1e9)
					}
				}
			}
		} else if kinds.settlement && rnd.IntN(3) == 0 {
			s.Settlement = [3]float64{signed(rnd, 1e-4, 1e-2), signed(rnd, 1e-4, 5e-2), signed(rnd, 1e-4, 1e-2)}
		}
		sups[i] = s
	}
	return sups
}

// freeMotion names the rigid-body motion the supports leave free, "" for
// none. It is stated independently of fem: the bar's rigid motion u = a is
// stopped by any axial restraint; the beam's rigid motions w = a + b·x are
// stopped when the restraint rows (1, x) for each deflection restraint and
// (0, 1) for each rotation restraint have rank 2.
func freeMotion(sups []fem.Support) string {
	holds := func(s fem.Support, d fem.Dof) bool {
		if s.Kind == fem.Spring {
			return s.Stiffness[d] > 0
		}
		return s.Kind.Restrains(d)
	}
	var axial bool
	var rows [][2]float64
	for _, s := range sups {
		axial = axial || holds(s, fem.Axial)
		if holds(s, fem.Transverse) {
			rows = append(rows, [2]float64{1, s.X})
		}
		if holds(s, fem.Rotation) {
			rows = append(rows, [2]float64{0, 1})
		}
	}
	if !axial {
		return "axial"
	}
	// The rank is 2 when some pair of rows has a nonzero determinant.
	rank := min(len(rows), 1)
	for i := range rows {
		for j := i + 1; j < len(rows); j++ {
			if rows[i][0]*rows[j][1]-rows[i][1]*rows[j][0] != 0 {
				rank = 2
			}
		}
	}
	switch {
	case rank == 0 || (rank == 1 && !slices.ContainsFunc(rows, func(r [2]float64) bool { return r[0] != 0 })):
		// No deflection restraint at all: the member translates sideways.
		return "transverse"
	case rank == 1:
		return "rotation"
	}
	return ""
}

// describe prints a model compactly for failure messages.
func describe(m *fem.Model) string {
	return fmt.Sprintf("%+v", *m)
}
