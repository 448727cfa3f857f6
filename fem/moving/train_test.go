package moving

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
)

// Two equal loads P a distance d apart crossing a simple beam of span L:
// the absolute largest moment stands under one load when midspan lies
// halfway between that load and the resultant, and is P·(2L − d)²/(8L)
// (as long as d < (2 − √2)·L, else one load alone at midspan gives more).
// Source: absolute maximum moment under moving concentrated loads,
// Hibbeler, Structural Analysis, ch. 6, from memory; the value follows by
// statics.
func TestTwoEqualLoadsAbsoluteMaximumMoment(t *testing.T) {
	const L, P, d = 10.0, 10e3, 2.0
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	in := influence(t, m)
	tr := &Train{Name: "two equal loads", Axles: []Axle{{Load: P}, {Load: P, Spacing: d}}, Direction: Forward, Step: 0.1}
	p, _ := fem.Prepare(m)
	var stations []float64
	for x := 0.0; x <= L+1e-9; x += 0.05 {
		stations = append(stations, math.Round(x*100)/100)
	}
	e, err := in.Envelope(tr, p.Mesh(), stations)
	if err != nil {
		t.Fatal(err)
	}
	hi, _ := e.Worst(fem.QBendingMoment)
	want := P * (2*L - d) * (2*L - d) / (8 * L)
	if !near(hi.Value, want, 1e-12) {
		t.Errorf("largest moment: got %.12g N·m, want P·(2L − d)²/(8L) = %.12g", hi.Value, want)
	}
	// Under the trailing load at L/2 − d/4 (front at L/2 + 3d/4), or by
	// symmetry under the front load at L/2 + d/4.
	under := [][2]float64{{L/2 - d/4, L/2 + 3*d/4}, {L/2 + d/4, L/2 + d/4}}
	ok := false
	for _, u := range under {
		ok = ok || (near(hi.X, u[0], 1e-9) && near(hi.Placement.Front, u[1], 1e-9))
	}
	if !ok {
		t.Errorf("largest moment at x = %g with the front at %g; want x = %g with the front at %g, or x = %g with the front at %g",
			hi.X, hi.Placement.Front, under[0][0], under[0][1], under[1][0], under[1][1])
	}
	// The moment at midspan is less: a load at midspan, the other 2 m off,
	// gives P·L/4 + P·(L/2 − d)/2 (the triangle of TestSimpleBeamInfluenceLines).
	mid := slices.Index(stations, L/2)
	if got, want := e.Max[3][mid], P*L/4+P*(L/2-d)/2; !near(got, want, 1e-12) {
		t.Errorf("largest moment at midspan: got %.12g, want %.12g", got, want)
	}
}

// The envelope's largest and smallest values at each station are those of
// the train at every position one by one, summed from the influence lines
// (with an axle exactly on the station taken on both sides of it): three
// axles and a uniform load moving both ways over part of the knotty
// member, at stations on key points, on positions the axles reach and
// between. The long train (more axles than shortTrain, so the scan keeps
// a running sum over the stretches of positions, summed afresh every
// resumEvery) is held to the same sums.
func TestEnvelopeAgainstEveryPosition(t *testing.T) {
	long := &Train{Axles: []Axle{{Load: 30e3}}, From: 0.5, To: 9.5, Step: 0.05}
	for k := 1; k < 24; k++ {
		long.Axles = append(long.Axles, Axle{Load: 10e3 + 3e3*float64(k%5), Spacing: 0.15 + 0.05*float64(k%3)})
	}
	three := Train{
		Axles:   []Axle{{Load: 40e3}, {Load: 60e3, Spacing: 1.3}, {Load: 25e3, Spacing: 0.7}},
		Uniform: UniformLoad{Load: 5e3, Start: 0.4, Length: 2.5},
		From:    0.5, To: 9.5, Step: 0.05,
	}
	// Driving on and off the whole member (10 m): the front runs from 0 to
	// 10 m past the train's length, the loads off the member carrying
	// nothing; and the long train likewise, longer than any span.
	off := three
	off.From, off.To, off.OffEnds = 0, 0, true
	longOff := *long
	longOff.From, longOff.To, longOff.OffEnds = 0, 0, true
	for _, tr := range []*Train{&three, long, &off, &longOff} {
		everyPosition(t, tr)
	}
}

// everyPosition checks tr's envelope on the knotty member against every
// position one by one.
func everyPosition(t *testing.T, tr *Train) {
	m := knotty()
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	stations := []float64{0, 0.35, 1.7, 2.95, 3, 3.3, 4, 5, 5.55, 6, 7.2, 8, 8.65, 9.5, 10}
	e, err := in.Envelope(tr, p.Mesh(), stations)
	if err != nil {
		t.Fatal(err)
	}
	// The train is its length long (3 axles: 2.9 m, its uniform load ends
	// 0.4 + 2.5 m behind the front), so its front moves over 9 m less
	// that, a position every 0.05 m (3 axles: 6.1 m, 122 steps); driving
	// off the ends of the 10 m member, over 10 m and that.
	free := 9 - tr.Length()
	if tr.OffEnds {
		free = 10 + tr.Length()
	}
	if want := int(math.Round(free/0.05)) + 1; e.Positions != want || len(e.runs) != 2 {
		t.Fatalf("got %d positions in %d directions, want %d in 2", e.Positions, len(e.runs), want)
	}
	// A load off the member carries nothing (one on an end to round-off of
	// the fronts' sums stands on it); a uniform load counts on the member.
	on := func(x float64) bool { return x >= -1e-9 && x <= 10+1e-9 }
	clip := func(x float64) float64 { return min(max(x, 0), 10) }
	// sum is the effect at x (read on side) of the train at p, an axle on
	// x taken on axleSide of it, summed from the influence lines.
	sum := func(l *Line, p Placement, axleSide fem.Side) float64 {
		r := e.runs[0]
		if p.Direction != r.direction {
			r = e.runs[1]
		}
		v := r.q * l.Integral(clip(p.Front+r.u0), clip(p.Front+r.u1))
		for _, a := range r.axles {
			if on(p.Front + a.offset) {
				v += a.load * l.At(p.Front+a.offset, axleSide)
			}
		}
		return v
	}
	for q, qty := range EnvelopeQuantities {
		var want [][2]extreme
		// named[s] holds the effect at station s of the positions the
		// envelope names, its largest and smallest over the sides.
		var named [][2]extreme
		scale := 0.0
		for s, x := range stations {
			sides := []fem.Side{fem.Left, fem.Right}
			var hi, lo, nhi, nlo extreme
			for _, side := range sides {
				l := line(t, in, Target{Quantity: qty, X: x, Side: side})
				for _, axleSide := range sides {
					for _, r := range e.runs {
						for k := range r.n {
							p := Placement{r.direction, r.front(k)}
							v := sum(l, p, axleSide)
							hi.most(v, p)
							lo.least(v, p)
						}
					}
					nhi.most(sum(l, e.MaxAt[q][s], axleSide), e.MaxAt[q][s])
					nlo.least(sum(l, e.MinAt[q][s], axleSide), e.MinAt[q][s])
				}
			}
			want = append(want, [2]extreme{hi, lo})
			named = append(named, [2]extreme{nhi, nlo})
			scale = max(scale, math.Abs(hi.value), math.Abs(lo.value))
		}
		for s, x := range stations {
			// No position of the step gives more than the envelope, and
			// the position it names gives what it holds.
			if d := e.Max[q][s] - want[s][0].value; d < -1e-9*scale {
				t.Errorf("%s at %g: envelope's largest %.12g, below position %+v's %.12g", qty, x, e.Max[q][s], want[s][0].at, want[s][0].value)
			}
			if d := e.Max[q][s] - named[s][0].value; math.Abs(d) > 1e-9*scale {
				t.Errorf("%s at %g: envelope's largest %.12g, its position %+v gives %.12g", qty, x, e.Max[q][s], e.MaxAt[q][s], named[s][0].value)
			}
			if d := e.Min[q][s] - want[s][1].value; d > 1e-9*scale {
				t.Errorf("%s at %g: envelope's smallest %.12g, above position %+v's %.12g", qty, x, e.Min[q][s], want[s][1].at, want[s][1].value)
			}
			if d := e.Min[q][s] - named[s][1].value; math.Abs(d) > 1e-9*scale {
				t.Errorf("%s at %g: envelope's smallest %.12g, its position %+v gives %.12g", qty, x, e.Min[q][s], e.MinAt[q][s], named[s][1].value)
			}
		}
	}
}

// The worst positions the envelope names give its values when the train is
// solved there as ordinary loads, by fem's exact solver and by finite
// elements (which hold the exact moment at the nodes the loads stand on).
func TestEnvelopeAtItsGoverningPositions(t *testing.T) {
	m := knotty()
	m.Mesh = fem.MeshSettings{MaxElementLength: 0.05}
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	tr := &Train{Name: "trolley", Axles: []Axle{{Load: 30e3}, {Load: 30e3, Spacing: 1.5}}, Direction: BothWays, Step: 0.05}
	e, err := in.Envelope(tr, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []fem.Quantity{fem.QBendingMoment, fem.QDeflection} {
		hi, lo := e.Worst(q)
		for _, ex := range []Extreme{hi, lo} {
			tm := tr.Model(m, ex.Placement)
			ee, err := fem.SolveExact(&tm)
			if err != nil {
				t.Fatal(err)
			}
			sol, err := fem.Solve(&tm)
			if err != nil {
				t.Fatal(err)
			}
			matches := func(f fem.Field) bool {
				for _, side := range []fem.Side{fem.Left, fem.Right} {
					v := f.At(ex.X, side)
					if math.Abs(q.Of(&v)-ex.Value) <= 1e-9*math.Abs(ex.Value) {
						return true
					}
				}
				return false
			}
			if !matches(ee) || !matches(sol) {
				fx, sx := ee.At(ex.X, fem.Right), sol.At(ex.X, fem.Right)
				t.Errorf("%s: the envelope gives %.12g at %g for the train facing %s with its front at %g; solved there, exact %.12g, finite elements %.12g",
					q, ex.Value, ex.X, ex.Placement.Direction, ex.Placement.Front, q.Of(&fx), q.Of(&sx))
			}
		}
	}
}

func TestTrainProblems(t *testing.T) {
	ok := Train{Axles: []Axle{{Load: 10e3}, {Load: 10e3, Spacing: 2}}}
	for _, c := range []struct {
		name   string
		change func(*Train)
		key    string
		says   string
	}{
		{"too long", func(t *Train) { t.Axles[1].Spacing = 12 }, "", "does not fit on the 10 m"},
		{"too long for its run", func(t *Train) { t.From, t.To = 3, 4 }, "", "does not fit on the 1 m"},
		{"zero spacing", func(t *Train) { t.Axles[1].Spacing = 0 }, "axles[1].spacing", "must be above zero"},
		{"negative spacing", func(t *Train) { t.Axles[1].Spacing = -1 }, "axles[1].spacing", "must be above zero"},
		{"a spacing before the first axle", func(t *Train) { t.Axles[0].Spacing = 1 }, "axles[0].spacing", "nothing stands before it"},
		{"millions of positions", func(t *Train) { t.Step = 1e-6 }, "step", "takes 8000001 positions"},
		// 8 m / 1e-300 m: the count once said 1000000000000000, the cap
		// positions keeps it under.
		{"more positions than an int holds", func(t *Train) { t.Step = 1e-300 }, "step", "takes 8e+300 positions"},
		// 8 m / 5e-324 m overflows: the count once read "+Inf".
		{"more positions than a float holds", func(t *Train) { t.Step = 5e-324 }, "step", "takes more than 1e+308 positions"},
		{"negative step", func(t *Train) { t.Step = -0.1 }, "step", "enter a step above zero"},
		{"no loads", func(t *Train) { t.Axles = nil }, "", "no loads"},
		{"more axles than the envelope's search takes", func(t *Train) {
			for len(t.Axles) <= MaxAxles {
				t.Axles = append(t.Axles, Axle{Load: 1e3, Spacing: 1e-3})
			}
		}, "axles", fmt.Sprintf("it has %d axles; Stave takes at most %d", MaxAxles+1, MaxAxles)},
		{"an upward load", func(t *Train) { t.Axles[0].Load = -5 }, "axles[0].load", "above zero"},
		{"a run that ends before it starts", func(t *Train) { t.From, t.To = 6, 5 }, "to", "after its start"},
		{"a run off the member", func(t *Train) { t.From = 11 }, "from", "not on the member"},
		{"a uniform load with no length", func(t *Train) { t.Uniform = UniformLoad{Load: 1e3} }, "uniform.length", "above zero"},
		// An axle of 1e300 N was taken, and the train only left out with a
		// caution that its results overflow.
		{"an axle load beyond floating point's squares", func(t *Train) { t.Axles[1].Load = 1e300 }, "axles[1].load", "axle 2 has a load of 1e+300 N, more than the 1e+150 N Stave takes"},
		{"an axle load just over the most", func(t *Train) { t.Axles[0].Load = math.Nextafter(MaxLoad, math.Inf(1)) }, "axles[0].load", "more than the 1e+150 N"},
		{"a uniform load beyond floating point's squares", func(t *Train) { t.Uniform = UniformLoad{Load: 1e300, Length: 2} }, "uniform.load", "the uniform load is 1e+300 N/m, more than the 1e+150 N/m"},
	} {
		t.Run(c.name, func(t *testing.T) {
			tr := ok
			tr.Axles = slices.Clone(ok.Axles)
			c.change(&tr)
			ps := tr.Problems(10, units.Base)
			found := false
			for _, p := range ps {
				found = found || (p.Key == c.key && strings.Contains(p.Message, c.says))
			}
			if !found {
				t.Errorf("problems %+v: want one at %q saying %q", ps, c.key, c.says)
			}
		})
	}
	if ps := ok.Problems(10, units.Base); len(ps) != 0 {
		t.Errorf("a sound train has problems: %+v", ps)
	}
	// Units of no name (the zero System) are SI base units, as Validate
	// and the files' messages quote them, not "+Inf " of no unit.
	long := ok
	long.Axles = slices.Clone(ok.Axles)
	long.Axles[1].Spacing = 12
	if got, want := long.Problems(10, units.System{}), long.Problems(10, units.Base); !slices.Equal(got, want) {
		t.Errorf("problems in units of no name %+v, in SI base units %+v", got, want)
	}
	heaviest := Train{Axles: []Axle{{Load: MaxLoad}}, Uniform: UniformLoad{Load: MaxLoad, Length: 2}}
	if ps := heaviest.Problems(10, units.Base); len(ps) != 0 {
		t.Errorf("a train of loads %g has problems: %+v", MaxLoad, ps)
	}
	most := Train{Axles: []Axle{{Load: 1e3}}}
	for len(most.Axles) < MaxAxles {
		most.Axles = append(most.Axles, Axle{Load: 1e3, Spacing: 1e-3})
	}
	if ps := most.Problems(10, units.Base); len(ps) != 0 {
		t.Errorf("a train of %d axles has problems: %+v", MaxAxles, ps)
	}
}

// A train in a combination on top of fixed loads: at every station the
// combination's extremes are the fixed loads' field plus the factor times
// the train's extreme on the side the factor's sign picks, checked against
// the combination solved at the governing position by fem's exact solver
// (superposition: the fields are linear in the loads).
func TestCombinedEnvelope(t *testing.T) {
	m := knotty()
	m.Gravity = [2]float64{0, -fem.StandardGravity}
	m.Segments[0].Material.Density, m.Segments[1].Material.Density = 7850, 7850
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	tr := &Train{Axles: []Axle{{Load: 20e3}, {Load: 35e3, Spacing: 1.8}}, Step: 0.1}
	stations := []float64{1, 2.5, 5, 7.3, 9}
	e, err := in.Envelope(tr, p.Mesh(), stations)
	if err != nil {
		t.Fatal(err)
	}
	own, err := fem.SolveExact(m) // the self-weight alone
	if err != nil {
		t.Fatal(err)
	}
	base := make([][]float64, len(EnvelopeQuantities))
	for q, qty := range EnvelopeQuantities {
		for _, x := range stations {
			f := own.At(x, fem.Right)
			base[q] = append(base[q], 1.35*qty.Of(&f))
		}
	}
	for _, factor := range []float64{1.5, -0.8} {
		c := e.Combine(factor, Base{Max: base, Min: base})
		for q, qty := range EnvelopeQuantities {
			for s, x := range stations {
				// The largest of base + factor·train over the positions is
				// base + factor times the train's largest for a positive
				// factor, its smallest for a negative one.
				hi, lo := e.Max[q][s], e.Min[q][s]
				if factor < 0 {
					hi, lo = lo, hi
				}
				if c.Max[q][s] != base[q][s]+factor*hi || c.Min[q][s] != base[q][s]+factor*lo || c.Max[q][s] < c.Min[q][s] {
					t.Errorf("factor %g, %s at %g: combined %g to %g, want %g to %g", factor, qty, x, c.Min[q][s], c.Max[q][s], base[q][s]+factor*lo, base[q][s]+factor*hi)
				}
				for _, got := range []struct {
					v  float64
					at Placement
				}{{c.Max[q][s], c.MaxAt[q][s]}, {c.Min[q][s], c.MinAt[q][s]}} {
					loads := *m
					loads.PointLoads, _ = tr.Loads(got.at)
					for i := range loads.PointLoads {
						loads.PointLoads[i].Transverse *= factor
					}
					loads.Gravity = [2]float64{0, -1.35 * fem.StandardGravity}
					ex, err := fem.SolveExact(&loads)
					if err != nil {
						t.Fatal(err)
					}
					// An axle standing on x: the envelope holds the limit on
					// the side that gives more, so either side may match.
					l, r := ex.At(x, fem.Left), ex.At(x, fem.Right)
					wl, wr := qty.Of(&l), qty.Of(&r)
					tol := 1e-9 * max(math.Abs(wl), math.Abs(wr), 1e-12)
					if math.Abs(got.v-wl) > tol && math.Abs(got.v-wr) > tol {
						t.Errorf("factor %g, %s at %g: combined envelope %.12g, solved %.12g or %.12g", factor, qty, x, got.v, wl, wr)
					}
				}
			}
		}
	}
}

// A uniform load train as long as a simple span has one position, the whole
// span loaded: the moment at midspan is q·L²/8, the end reactions q·L/2 and
// the midspan deflection 5·q·L⁴/(384·E·I) down (simple beam, uniform load;
// AISC beam diagrams / Roark's Formulas, from memory).
func TestUniformTrainOverTheWholeSpan(t *testing.T) {
	const L, q = 8.0, 12e3
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	p, in := prepared(t, m)
	tr := &Train{Uniform: UniformLoad{Load: q, Length: L}, Direction: Forward}
	e, err := in.Envelope(tr, p.Mesh(), []float64{0, L / 4, L / 2})
	if err != nil {
		t.Fatal(err)
	}
	if e.Positions != 1 {
		t.Fatalf("%d positions, want the one", e.Positions)
	}
	ei := m.Segments[0].Material.Elastic * m.Segments[0].Section.SecondMoment
	if got, want := e.Max[3][2], q*L*L/8; !near(got, want, 1e-12) {
		t.Errorf("midspan moment %.12g, want qL²/8 = %.12g", got, want)
	}
	if got, want := e.Min[0][2], -5*q*L*L*L*L/(384*ei); !near(got, want, 1e-12) {
		t.Errorf("midspan deflection %.12g, want −5qL⁴/(384EI) = %.12g", got, want)
	}
	for _, r := range e.Reactions {
		if !near(r.Max, q*L/2, 1e-12) || !near(r.Min, q*L/2, 1e-12) {
			t.Errorf("reaction of support %d from %g to %g, want qL/2 = %g", r.Support+1, r.Min, r.Max, q*L/2)
		}
	}
}

// The worst values over the member on the default stations (nil), where
// they lie between stations: under an axle for the moment, at the turn of
// the deflected shape for the deflection. Simple beam of span 10 m, EI =
// 200 GPa × 8e-5 m⁴, positions on a grid that holds the governing one.
func TestWorstBetweenDefaultStations(t *testing.T) {
	const L = 10.0
	const EI = 200e9 * 8e-5
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	// One load P at b = 3 m from the left support: the largest deflection
	// P·b·(L² − b²)^(3/2)/(9√3·L·EI), in the longer part, √((L² − b²)/3)
	// from the right support. Source: simple beam, concentrated load at any
	// point, beam diagrams and formulas (AISC Steel Construction Manual),
	// from memory.
	const P, b = 50e3, 3.0
	wMax := -P * b * math.Pow(L*L-b*b, 1.5) / (9 * math.Sqrt(3) * L * EI)
	xMax := L - math.Sqrt((L*L-b*b)/3)
	// Three axles 40, 120 and 90 kN, 2.0 m and 3.5 m apart (resultant 250
	// kN, 0.94 m from the middle axle): the largest moment stands under the
	// middle axle when midspan lies halfway between it and the resultant,
	// at x = 5 ∓ 0.47 m, and is R_A·x − 40 kN·2 m with R_A = 250 kN·(5 −
	// 0.47 m)/10 m: 433.0225 kN·m. Source: absolute maximum moment under
	// moving concentrated loads, Hibbeler, Structural Analysis, ch. 6, from
	// memory; the value follows by statics.
	three := []Axle{{Load: 40e3}, {Load: 120e3, Spacing: 2}, {Load: 90e3, Spacing: 3.5}}
	for _, c := range []struct {
		name     string
		train    Train
		q        fem.Quantity
		upper    bool
		want, at []float64 // acceptable values and places (mirror images)
	}{
		{"three axles, largest moment under the middle axle", Train{Axles: three, Step: 0.01},
			fem.QBendingMoment, true, []float64{433022.5}, []float64{4.53, 5.47}},
		{"one load stopped at 3 m, largest deflection off the load", Train{Axles: []Axle{{Load: P}}, From: 0, To: 3, Step: 0.05},
			fem.QDeflection, false, []float64{wMax}, []float64{xMax}},
	} {
		e, err := in.Envelope(&c.train, p.Mesh(), nil)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		hi, lo := e.Worst(c.q)
		got := lo
		if c.upper {
			got = hi
		}
		if !near(got.Value, c.want[0], 1e-9) {
			t.Errorf("%s: got %.12g, want %.12g", c.name, got.Value, c.want[0])
		}
		ok := false
		for _, x := range c.at {
			ok = ok || near(got.X, x, 1e-4)
		}
		if !ok {
			t.Errorf("%s: at x = %.9g, want one of %v", c.name, got.X, c.at)
		}
	}
}

// The largest moment of a train over every position when the step is
// coarser than the stations, or holds no position at the classic one: each
// position's moment peaks under one of its axles, and the peaks of
// neighbouring positions lie a step apart, further than the stations next
// to the worst one. Simple beam; the moment under an axle at x with the
// resultant W a distance e beyond it is W·(L − x − e)·x/L less the moment
// of the loads behind it, a parabola in the position whose top (x = L/2 −
// e/2, the classic rule) gives the absolute largest moment, whether a
// position of the step lies there or not. Source: absolute maximum moment
// under moving concentrated loads, Hibbeler, Structural Analysis, ch. 6,
// from memory; values by statics.
func TestWorstMomentOnACoarseStep(t *testing.T) {
	// Three axles 50, 100 and 100 kN, 2 m and 3 m apart on 12 m: the
	// resultant 250 kN stands 2.8 m behind the front, 0.8 m beyond the
	// middle axle, which the rule puts at x = 6.4 m (front at 8.4 m, a
	// position of the 0.1 m step): R_A = 250 kN·(12 − 5.6)/12 and
	// M = R_A·6.4 m − 100 kN·3 m = 553.333 kN·m.
	three := []Axle{{Load: 50e3}, {Load: 100e3, Spacing: 2}, {Load: 100e3, Spacing: 3}}
	// Two axles 80 and 40 kN, 1.3 m apart, backward from x = 1.1 m to 9.3
	// m on 10 m: the resultant 120 kN stands 1.3/3 m behind the 80 kN
	// front, which the rule puts at f = (10 − 1.3/3)/2 = 4.7833 m, where
	// M = 120 kN·(10 − 1.3/3 − f)·f/10; no position of the 0.07 m step
	// (shortened to 6.9/99 m) lies there.
	const f = (10 - 1.3/3) / 2
	two := Train{Axles: []Axle{{Load: 80e3}, {Load: 40e3, Spacing: 1.3}}, From: 1.1, To: 9.3, Step: 0.07, Direction: Backward}
	for _, c := range []struct {
		name   string
		L      float64
		train  Train
		want   float64
		at     []float64 // the places that give it (mirror images)
		fronts []float64
	}{
		{"three axles, classic position on the 0.1 m step", 12, Train{Axles: three, Step: 0.1},
			250e3*(12-5.6)/12*6.4 - 100e3*3, []float64{6.4, 5.6}, []float64{8.4, 3.6}},
		{"two axles backward on part of the member, off the 0.07 m step", 10, two,
			120e3 * (10 - 1.3/3 - f) * f / 10, []float64{f}, []float64{f}},
	} {
		t.Run(c.name, func(t *testing.T) {
			m := beam(c.L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: c.L, Kind: fem.Roller})
			p, in := prepared(t, m)
			e, err := in.Envelope(&c.train, p.Mesh(), nil)
			if err != nil {
				t.Fatal(err)
			}
			hi, _ := e.Worst(fem.QBendingMoment)
			if !near(hi.Value, c.want, 1e-12) {
				t.Errorf("largest moment %.12g N·m, want %.12g", hi.Value, c.want)
			}
			ok := false
			for i := range c.at {
				ok = ok || (near(hi.X, c.at[i], 1e-9) && near(hi.Placement.Front, c.fronts[i], 1e-9))
			}
			if !ok {
				t.Errorf("at x = %.9g with the front at %.9g; want x in %v with the front in %v", hi.X, hi.Placement.Front, c.at, c.fronts)
			}
		})
	}
}

// Two equal loads P a distance d apart driving across a simple span L
// (Train.OffEnds): once d > (2 − √2)·L, one load alone at midspan gives
// the largest moment, P·L/4, more than both on the span can,
// P·(2L − d)²/(8L) where they fit (absolute maximum moment under moving loads, Hibbeler,
// Structural Analysis, ch. 6, from memory; both values by statics). A
// train kept wholly on the span misses it, and one longer than the span
// runs only when it may drive off.
func TestTrainDrivingOnAndOff(t *testing.T) {
	const L, P = 10.0, 10e3
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	for _, c := range []struct {
		d       float64
		offEnds bool
		want    float64
	}{
		{7, true, P * L / 4},
		// Kept on the span, the rule's position (front at L/2 + 3d/4) is
		// off it: the best is the front on the far support, the other load
		// d before it, P·d·(L − d)/L under that one (statics).
		{7, false, P * 7 * (L - 7) / L},
		{12, true, P * L / 4},
		{4, true, P * (2*L - 4) * (2*L - 4) / (8 * L)}, // d < 0.586·L: both on govern
	} {
		tr := &Train{Axles: []Axle{{Load: P}, {Load: P, Spacing: c.d}}, OffEnds: c.offEnds, Step: 0.05}
		e, err := in.Envelope(tr, p.Mesh(), nil)
		if err != nil {
			t.Fatalf("d = %g m, off ends %v: %v", c.d, c.offEnds, err)
		}
		if hi, _ := e.Worst(fem.QBendingMoment); !near(hi.Value, c.want, 1e-9) {
			t.Errorf("d = %g m, off ends %v: largest moment %.9g N·m at x = %g (front at %g), want %.9g", c.d, c.offEnds, hi.Value, hi.X, hi.Placement.Front, c.want)
		}
	}
	long := &Train{Axles: []Axle{{Load: P}, {Load: P, Spacing: 12}}}
	if _, err := in.Envelope(long, p.Mesh(), nil); err == nil || !strings.Contains(err.Error(), "does not fit") {
		t.Errorf("a 12 m train kept on a 10 m span: %v, want it refused as not fitting", err)
	}
}

// A train that drives off a simple span leaves it unloaded at its last
// positions, where the deflection and the moment are zero everywhere but
// for round-off (2.7e-15 m against 0.104 m). The largest deflection and the
// smallest moment over every position are then 0 (a support's deflection,
// an end's moment: statics), at x = 0 with the first position, not at a
// place and a position that round-off chose.
func TestTrainWorstZeroIsNotRoundOff(t *testing.T) {
	const L, P = 10.0, 100e3
	m := beam(L, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller})
	in := influence(t, m)
	p, _ := fem.Prepare(m)
	tr := &Train{Axles: []Axle{{Load: P}, {Load: P, Spacing: 7}}, OffEnds: true, Step: 0.1}
	e, err := in.Envelope(tr, p.Mesh(), nil)
	if err != nil {
		t.Fatal(err)
	}
	first := Placement{e.runs[0].direction, e.runs[0].s0}
	hi, _ := e.Worst(fem.QDeflection)
	_, lo := e.Worst(fem.QBendingMoment)
	for _, c := range []struct {
		name string
		got  Extreme
	}{{"largest deflection", hi}, {"smallest bending moment", lo}} {
		if math.Abs(c.got.Value) > 1e-12 || c.got.X != 0 || c.got.Placement != first {
			t.Errorf("%s: %g at x = %g with the front at %g %v, want 0 at x = 0 with the first position (front at %g %v)",
				c.name, c.got.Value, c.got.X, c.got.Placement.Front, c.got.Placement.Direction, first.Front, first.Direction)
		}
	}
	// The climb off the stations keeps it there too.
	if ex, moved := e.Peak(slices.Index(EnvelopeQuantities, fem.QBendingMoment), false, func([]float64) *Envelope { return nil }); moved || ex.X != 0 {
		t.Errorf("Peak of the smallest moment: %g at x = %g (moved %v), want 0 at x = 0", ex.Value, ex.X, moved)
	}
}

// The worst value of a train can lie off the stations, far from the worst
// station: beside a support where the stations tie, or at a turn within a
// station's gap of a support, where the field bends differently on either
// side. Beam diagrams and formulas (AISC Steel Construction Manual, from
// memory), superposed: simple beam, concentrated load at any point, M =
// P·a·b/l; beam overhanging one support, concentrated load at the end of
// the overhang, M = −P·c·x/l between the supports; the rotation by
// integrating M/EI from the left support, whose rotation makes the
// deflection zero at the right one (double integration, Gere & Goodno,
// Mechanics of Materials, ch. 9, from memory).
func TestWorstOffTheWorstStation(t *testing.T) {
	const EI = 200e9 * 8e-5
	// Supports at 7.889 m and 8.989 m on 10.5 m; 48 kN and 18 kN 2.6 m
	// apart moving backward over the whole member. The moment is never
	// sagging over the overhang on the left (its stations tie at zero, the
	// first at x = 0), and sagging only under the 48 kN axle at the last
	// position, 11 mm past the support (the 18 kN axle at the tip), between
	// two stations: M = 48 kN·a·(l − a)/l − 18 kN·c·a/l, l = 1.1 m, c =
	// 1.511 m, a = 0.011 m.
	const a, l, c = 0.011, 1.1, 1.511
	momentTrain := Train{Axles: []Axle{{Load: 48e3}, {Load: 18e3, Spacing: 2.6}}, Direction: Backward, Step: 0.1}
	wantM := 48e3*a*(l-a)/l - 18e3*c*a/l
	// Supports at 0 and 6 m on 8 m, Q = 100 kN at 2 m and P at the tip
	// such that the moment changes sign at x0 = 6·Q/(Q + P) = 5.994 m, 6
	// mm short of the support (stations every 20 mm): the rotation turns
	// there, largest. The train fits its run in one position.
	const Q, L, x0 = 100e3, 6.0, 5.994
	P := Q * (L - x0) / x0
	R0 := Q*(L-2)/L - P*2/L
	theta0 := -(R0*L*L*L/6 - Q*(L-2)*(L-2)*(L-2)/6) / L / EI
	wantTheta := theta0 + (R0*x0*x0/2-Q*(x0-2)*(x0-2)/2)/EI
	rotationTrain := Train{Axles: []Axle{{Load: P}, {Load: Q, Spacing: 6}}, From: 2, To: 8, Direction: Forward}
	for _, cse := range []struct {
		name  string
		m     *fem.Model
		train Train
		q     fem.Quantity
		want  float64
		at    float64
	}{
		{"sagging moment under an axle beside a support", beam(10.5, fem.Support{X: 7.889, Kind: fem.Pinned}, fem.Support{X: 8.989, Kind: fem.Roller}),
			momentTrain, fem.QBendingMoment, wantM, 7.889 + a},
		{"rotation turning 6 mm short of a support", beam(8, fem.Support{X: 0, Kind: fem.Pinned}, fem.Support{X: L, Kind: fem.Roller}),
			rotationTrain, fem.QRotation, wantTheta, x0},
	} {
		t.Run(cse.name, func(t *testing.T) {
			p, in := prepared(t, cse.m)
			e, err := in.Envelope(&cse.train, p.Mesh(), nil)
			if err != nil {
				t.Fatal(err)
			}
			hi, _ := e.Worst(cse.q)
			if !near(hi.Value, cse.want, 1e-9*math.Abs(cse.want)) || math.Abs(hi.X-cse.at) > 1e-4 {
				t.Errorf("largest %v %.12g at x = %.9g, want %.12g at %.9g", cse.q, hi.Value, hi.X, cse.want, cse.at)
			}
		})
	}
}

// A step taken from the mesh is the mean element length along the run,
// but gives at most derivedPositions positions, both ends of the run
// included, as docs/format.md says ("at most 20,000 positions"). The
// counts follow from that definition (the run divided evenly into steps
// no longer than the step, both ends counted); no outside source.
func TestDerivedStepKeepsItsPositions(t *testing.T) {
	const L, free = 12.0, 10.8 // a 1.2 m train on a 12 m run
	for _, c := range []struct {
		elements, want int
	}{
		{24, 23},        // 0.5 m: 10.8/0.5 = 21.6, so 22 steps
		{1000, 901},     // 0.012 m: 900 steps
		{20000, 18001},  // 0.0006 m: 18,000 steps, under the cap
		{200000, 20000}, // 0.00006 m would be 180,000 steps: capped
	} {
		mesh := fem.Mesh{}
		for k := range c.elements {
			mesh.Elements = append(mesh.Elements, fem.Element{Start: L * float64(k) / float64(c.elements), End: L * float64(k+1) / float64(c.elements)})
		}
		step := DerivedStep(mesh, 0, L, free)
		if got := positions(free, step); got != c.want {
			t.Errorf("%d elements: step %g m gives %d positions, want %d", c.elements, step, got, c.want)
		}
	}
}
