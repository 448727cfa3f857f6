package moving

import (
	"math"
	"slices"
	"testing"

	"stave/fem"
)

// bruteCases are members over 30 spans (invented), enough for windows
// (fewStretches), where a station's lines die away slowly or not at all:
// soft and nearly floating springs, hinges, short spans beside long ones,
// stiff spans beside weak ones, fixed ends; under two axles, twelve, and
// an axle with a uniform load driving off the ends.
func bruteCases() []struct {
	name  string
	m     *fem.Model
	train Train
} {
	two := Train{Axles: []Axle{{Load: 42e3}, {Load: 42e3, Spacing: 3.2}}, Step: 0.05, Direction: BothWays}
	equal := manySpans(30, 1)
	soft := manySpans(30, 1)
	for i := 1; i < 30; i++ {
		soft.Supports[i] = fem.Support{X: float64(i), Kind: fem.Spring, Stiffness: [3]float64{fem.Transverse: 2e5}}
	}
	hinged := manySpans(30, 1)
	hinged.Hinges = []fem.Hinge{{X: 3.5}, {X: 10.5}, {X: 17.5}, {X: 24.5}}
	uneven := beam(0)
	x := 0.0
	for i := range 30 {
		uneven.Supports = append(uneven.Supports, fem.Support{X: x, Kind: fem.Roller})
		if i%2 == 0 {
			x += 0.5
		} else {
			x += 4
		}
	}
	uneven.Supports[0].Kind = fem.Pinned
	uneven.Segments[0].End = uneven.Supports[29].X
	uniform := Train{Axles: []Axle{{Load: 30e3}}, Uniform: UniformLoad{Load: 3e3, Start: 0, Length: 5}, Step: 0.05, OffEnds: true}
	contrast := manySpans(30, 1)
	contrast.Segments = nil
	for i := range 30 {
		sg := fem.Segment{Start: float64(i), End: float64(i + 1), Section: fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15}, Material: fem.Material{Elastic: 200e9}}
		if i%3 == 1 {
			sg.Section.SecondMoment *= 1e4
		}
		contrast.Segments = append(contrast.Segments, sg)
	}
	long := Train{Axles: []Axle{{Load: 20e3}}, Step: 0.05, Direction: BothWays}
	for k := 1; k < 12; k++ {
		long.Axles = append(long.Axles, Axle{Load: 20e3 + 1e3*float64(k), Spacing: 0.7 + 0.1*float64(k%3)})
	}
	floating := manySpans(30, 1)
	for i := 1; i < 30; i++ {
		floating.Supports[i] = fem.Support{X: float64(i), Kind: fem.Spring, Stiffness: [3]float64{fem.Transverse: 2e3}}
	}
	fixed := manySpans(30, 1)
	fixed.Supports[0].Kind, fixed.Supports[30].Kind = fem.Fixed, fem.Fixed
	gerber := manySpans(30, 1)
	for i := range 15 {
		gerber.Hinges = append(gerber.Hinges, fem.Hinge{X: 2*float64(i) + 0.75})
	}
	gerber.Supports[0].Kind = fem.Fixed
	segmented := manySpans(2, 15)
	segmented.Segments = nil
	for i := range 40 {
		sg := fem.Segment{Start: 0.75 * float64(i), End: 0.75 * float64(i+1), Section: fem.Section{Area: 5e-3, SecondMoment: 8e-5 * (1 + 0.5*math.Sin(float64(i))), FibreDistance: 0.15}, Material: fem.Material{Elastic: 200e9}}
		segmented.Segments = append(segmented.Segments, sg)
	}
	springy := manySpans(30, 1)
	for i := 0; i <= 30; i += 3 {
		springy.Supports[i] = fem.Support{X: float64(i), Kind: fem.Spring, Stiffness: [3]float64{fem.Transverse: 1e9, fem.Rotation: 1e5}}
	}
	springy.Supports[0] = fem.Support{X: 0, Kind: fem.Pinned}
	return []struct {
		name  string
		m     *fem.Model
		train Train
	}{
		{"two spans of 40 segments", segmented, two},
		{"rotational springs", springy, long},
		{"stiff and weak spans", contrast, two},
		{"12 axles", equal, long},
		{"floating springs", floating, two},
		{"fixed ends, 12 axles", fixed, long},
		{"gerber", gerber, two},
		{"30 equal spans", equal, two},
		{"30 soft springs", soft, two},
		{"30 spans with hinges", hinged, two},
		{"30 uneven spans", uneven, two},
		{"30 equal spans, uniform load", equal, uniform},
	}
}

// A train's envelope over many supports, windowed (window.go), holds what
// every position gives: at stations between and on the supports, each
// extreme and reaction is what the member solved in closed form
// (fem.SolveExact, statics and the elastic line, not the influence lines'
// sweeps) with the train at the envelope's own position gives (a load on
// the station or a support read as the limit of one beside it), and no
// position of the front on a 0.1 m grid, both ways, gives more, on either
// side of a station. Tolerance 1e-7 of the quantity's largest: round-off.
func TestWindowedEnvelopeAgainstEachPositionSolved(t *testing.T) {
	for _, c := range bruteCases() {
		t.Run(c.name, func(t *testing.T) {
			p, in := prepared(t, c.m)
			L := c.m.Length()
			var stations []float64
			for k := 0; 0.1+0.73*float64(k) < L; k++ {
				x := 0.1 + 0.73*float64(k)
				near := false
				for _, sp := range c.m.Supports {
					near = near || math.Abs(sp.X-x) < 1e-6
				}
				if !near {
					stations = append(stations, x)
				}
			}
			for _, sp := range c.m.Supports {
				stations = append(stations, sp.X)
			}
			slices.Sort(stations)
			env, err := in.Envelope(&c.train, p.Mesh(), stations)
			if err != nil {
				t.Fatal(err)
			}
			value := func(pl Placement) *fem.Exact {
				m := c.train.Model(c.m, pl)
				e, err := fem.SolveExact(&m)
				if err != nil {
					t.Fatal(err)
				}
				return e
			}
			nq := len(envelopeRows) // the bending stress is the moment's times c/I
			scale := make([]float64, nq)
			for k := range nq {
				for i := range env.Stations {
					scale[k] = max(scale[k], math.Abs(env.Max[k][i]), math.Abs(env.Min[k][i]))
				}
			}
			// The envelope's value at its own placement.
			for k := range nq {
				q := EnvelopeQuantities[k]
				for i, x := range env.Stations {
					for _, up := range []bool{true, false} {
						v, at := env.Min[k][i], env.MinAt[k][i]
						if up {
							v, at = env.Max[k][i], env.MaxAt[k][i]
						}
						// A load on the station or a support is read as
						// the limit of one beside it: either side of it.
						got, match := 0.0, false
						for _, d := range []float64{0, -1e-9, 1e-9} {
							e := value(Placement{at.Direction, at.Front + d})
							for _, side := range bothSides {
								f := e.At(x, side)
								got = q.Of(&f)
								match = match || math.Abs(got-v) <= 1e-7*scale[k]
							}
						}
						if !match {
							t.Errorf("%v at %g (upper %v): envelope %g at %+v, solved there %g", q, x, up, v, at, got)
						}
					}
				}
			}
			rscale := 0.0
			for _, r := range env.Reactions {
				rscale = max(rscale, math.Abs(r.Max), math.Abs(r.Min))
			}
			for _, r := range env.Reactions {
				for _, up := range []bool{true, false} {
					v, at := r.Min, r.MinAt
					if up {
						v, at = r.Max, r.MaxAt
					}
					got := value(at).Reactions()[r.Support].Force[r.Motion]
					if math.Abs(got-v) > 1e-7*rscale {
						t.Errorf("reaction %d/%v (upper %v): envelope %g at %+v, solved there %g", r.Support, r.Motion, up, v, at, got)
					}
				}
			}
			// Every position of the front on a grid, each way it moves:
			// behind the start to past the end driving off the ends, the
			// whole train on the member otherwise.
			for _, d := range []Direction{Forward, Backward} {
				lo, hi := c.train.Length(), L
				if c.train.OffEnds {
					lo, hi = 0, L+c.train.Length()
				}
				if d == Backward {
					lo, hi = L-hi, L-lo
				}
				for front := lo; front <= hi+1e-9; front += 0.1 {
					e := value(Placement{d, front})
					for _, r := range env.Reactions {
						if v := e.Reactions()[r.Support].Force[r.Motion]; v > r.Max+1e-7*rscale || v < r.Min-1e-7*rscale {
							t.Fatalf("reaction %d/%v: front %g %v gives %g, envelope %g to %g", r.Support, r.Motion, front, d, v, r.Min, r.Max)
						}
					}
					for i, x := range env.Stations {
						for k := range nq {
							for _, side := range bothSides {
								f := e.At(x, side)
								if v := EnvelopeQuantities[k].Of(&f); v > env.Max[k][i]+1e-7*scale[k] || v < env.Min[k][i]-1e-7*scale[k] {
									t.Fatalf("%v at %g: front %g %v gives %g, envelope %g to %g (at %+v, %+v)", EnvelopeQuantities[k], x, front, d, v, env.Min[k][i], env.Max[k][i], env.MinAt[k][i], env.MaxAt[k][i])
								}
							}
						}
					}
				}
			}
		})
	}
}
