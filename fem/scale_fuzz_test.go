package fem_test

// A fuzz target for models of the sizes users reach by script: thousands of
// segments, supports, point loads and load vertices, points down to 1e-9 m
// apart and magnitudes over many decades. A few fuzzed bytes describe
// families of items (kind, count, spacing, magnitude), so short inputs make
// large models.
//
//	go test -run '^$' -fuzz '^FuzzScale$' -fuzztime 60s ./fem

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"stave/fem"
)

// scaleKeyPoints bounds the key points a fuzzed family set may add.
const scaleKeyPoints = 8192

// Family kinds of scaleModel.
const (
	segmentBreaks = iota
	mixedSupports
	pointLoads
	lineVertices
	springSupports
	settledSupports
	shortLines
	familyKinds
)

// decade is 10^(e) for a fuzzed e in [lo, hi], times a fuzzed mantissa in [1, 2).
func (b *fuzzBytes) decade(lo, hi int) float64 {
	e := lo + b.intn(hi-lo+1)
	return (1 + float64(b.next())/256) * math.Pow(10, float64(e))
}

// signedDecade is decade with a fuzzed sign.
func (b *fuzzBytes) signedDecade(lo, hi int) float64 {
	if b.next()&1 == 1 {
		return -b.decade(lo, hi)
	}
	return b.decade(lo, hi)
}

// count is a number of items in [1, scaleKeyPoints] from two bytes.
func (b *fuzzBytes) count() int {
	return 1 + (int(b.next())<<8|int(b.next()))%scaleKeyPoints
}

// positions are n increasing positions in [lo, hi] by one of four spacings:
// uniform, a run of points gap apart (down to 1e-9 m), random, or geometric
// towards lo. Repeats are possible: they are for Validate to refuse.
func (b *fuzzBytes) positions(n int, lo, hi float64) []float64 {
	out := make([]float64, n)
	switch mode := b.intn(4); mode {
	case 0:
		for i := range out {
			out[i] = lo + (hi-lo)*(float64(i)+0.5)/float64(n)
		}
	case 1:
		gap := math.Pow(10, -float64(3+b.intn(7))) // 1e-3 to 1e-9 m
		for i := range out {
			out[i] = min(hi, lo+float64(i)*gap)
		}
	case 2:
		rnd := rand.New(rand.NewPCG(uint64(b.next()), uint64(b.next())))
		for i := range out {
			out[i] = lo + (hi-lo)*rnd.Float64()
		}
		slices.Sort(out)
	default:
		ratio := 0.5 + 0.49*float64(b.next())/255
		step := hi - lo
		for i := range out {
			step *= ratio
			out[i] = lo + step
		}
		slices.Reverse(out)
	}
	return out
}

// scaleModel builds a model from fuzz bytes: a member whose length and
// section span many decades, held at its ends or not, and up to six
// families of items, each of up to scaleKeyPoints items of one kind laid
// out by one spacing over part of the member. Numbers are finite and
// mostly valid; positions may coincide, for Validate to refuse.
func scaleModel(b *fuzzBytes) *fem.Model {
	flags := b.next()
	L := b.decade(-3, 3)
	section := fem.Section{Area: b.decade(-6, 0), SecondMoment: b.decade(-12, -2), FibreDistance: b.decade(-3, 0)}
	material := fem.Material{Name: "fuzzed", Elastic: b.decade(5, 12), Density: 7850, ThermalExpansion: 1.2e-5}
	m := &fem.Model{Segments: []fem.Segment{{Start: 0, End: L, Section: section, Material: material}}}
	if flags&1 == 1 {
		m.Supports = []fem.Support{{X: 0, Kind: fem.Pinned}, {X: L, Kind: fem.Roller}}
	}
	if flags&2 != 0 {
		m.Gravity = [2]float64{b.signedDecade(-2, 2), b.signedDecade(-2, 2)}
	}
	if flags&4 != 0 {
		m.TemperatureChange = b.signedDecade(-2, 3)
	}
	m.Mesh.BarOrder = fem.LinearBar
	if flags&8 != 0 {
		m.Mesh.BarOrder = fem.QuadraticBar
	}
	switch (flags >> 4) & 3 {
	case 1:
		m.Mesh.Elements = 1 // one element per stretch
	case 2:
		m.Mesh.Elements = 1 + (int(b.next())<<9 | int(b.next())<<1) // up to 130,559
	case 3:
		m.Mesh.MaxElementLength = L / float64(1+int(b.next())<<4)
	}
	added := 0
	for range 6 {
		if len(b.data) == 0 || added >= scaleKeyPoints {
			break
		}
		kind := b.intn(familyKinds)
		n := min(b.count(), scaleKeyPoints-added)
		added += n
		lo := L * float64(b.next()) / 255
		hi := lo + (L-lo)*float64(b.next())/255
		xs := b.positions(n, lo, hi)
		addFamily(b, m, kind, xs)
	}
	return m
}

// addFamily adds items of one kind at xs to m.
func addFamily(b *fuzzBytes, m *fem.Model, kind int, xs []float64) {
	force := b.decade(-6, 12) // N
	vary := b.next()
	sign := func(i int) float64 { return float64(1 - 2*((i*int(vary|1))>>3&1)) }
	switch kind {
	case segmentBreaks:
		contrast := math.Pow(10, float64(vary%16)/2) // up to about 3e7 between neighbours
		last := m.Segments[len(m.Segments)-1]
		m.Segments = m.Segments[:len(m.Segments)-1]
		start := last.Start
		for i, x := range xs {
			if x <= start || x >= last.End {
				continue
			}
			s := last
			s.Start, s.End = start, x
			if i%2 == 1 {
				s.Section.SecondMoment *= contrast
				s.Material.Elastic /= math.Sqrt(contrast)
			}
			m.Segments = append(m.Segments, s)
			start = x
		}
		last.Start = start
		m.Segments = append(m.Segments, last)
	case mixedSupports, springSupports, settledSupports:
		for i, x := range xs {
			s := fem.Support{X: x, Kind: fem.SupportKind((i*int(vary) + int(vary>>4)) % (int(fem.Spring) + 1))}
			if kind == springSupports {
				s.Kind = fem.Spring
			}
			for d := fem.Axial; d <= fem.Rotation; d++ {
				switch {
				case !s.Kind.Restrains(d) && (kind == springSupports || (i+int(d))%3 == 0):
					s.Stiffness[d] = force * math.Pow(10, float64(int(vary%13)-6)) / m.Length()
				case s.Kind.Restrains(d) && kind == settledSupports:
					s.Settlement[d] = sign(i+int(d)) * m.Length() * 1e-3 * float64(1+i%7)
				}
			}
			if s.Kind == fem.Spring && s.Stiffness == [3]float64{} {
				s.Stiffness[fem.Transverse] = force
			}
			m.Supports = append(m.Supports, s)
		}
	case pointLoads:
		for i, x := range xs {
			p := fem.PointLoad{X: x, Transverse: sign(i) * force}
			if vary&1 == 1 {
				p.Axial = sign(i+1) * force * 1e-3
			}
			if vary&2 == 2 {
				p.Moment = sign(i+2) * force * m.Length()
			}
			m.PointLoads = append(m.PointLoads, p)
		}
	case lineVertices:
		d := fem.DistributedLoad{Direction: fem.Dof(vary & 1)}
		for i, x := range xs {
			d.Points = append(d.Points, fem.LoadPoint{X: x, Intensity: force / m.Length() * (1 + 0.5*sign(i)*float64(vary>>4)/15)})
		}
		m.DistributedLoad = append(m.DistributedLoad, d)
	case shortLines:
		for i := 0; i+1 < len(xs); i += 2 {
			m.DistributedLoad = append(m.DistributedLoad, fem.DistributedLoad{Direction: fem.Dof(i / 2 % 2),
				Points: []fem.LoadPoint{{X: xs[i], Intensity: sign(i) * force}, {X: xs[i+1], Intensity: sign(i+1) * force}}})
		}
	}
}

// summarize describes a large model in a line: its counts and scales, not
// its items.
func summarize(m *fem.Model) string {
	vertices := 0
	for _, d := range m.DistributedLoad {
		vertices += len(d.Points)
	}
	return fmt.Sprintf("L = %g m, %d segments, %d supports, %d point loads, %d distributed loads (%d vertices), gravity %v, ΔT %g K, mesh %+v",
		m.Length(), len(m.Segments), len(m.Supports), len(m.PointLoads), len(m.DistributedLoad), vertices, m.Gravity, m.TemperatureChange, m.Mesh)
}

// scaleSeeds are inputs for members the size of the issue's; each starts
// with its flags and the member's shape: 10 m, A = 0.1 m², I = 1e-3 m⁴,
// c = 0.1 m, E = 1e11 Pa.
var scaleSeeds = [][]byte{
	// 3,000 segments of alternating stiffness under a uniform load, one
	// element per stretch.
	{0x11, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0,
		segmentBreaks, 0x0b, 0xb7, 0, 255, 0, 8, 0, 5,
		lineVertices, 0, 1, 0, 255, 0, 8, 0, 1},
	// 3,000 point loads at random places, with moments, on 50,001 elements.
	{0x21, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0, 0x61, 0xa8,
		pointLoads, 0x0b, 0xb7, 0, 255, 2, 7, 9, 10, 0, 3},
	// A line load of 8,192 vertices at random places, automatic mesh.
	{0x01, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0,
		lineVertices, 0x1f, 0xff, 0, 255, 2, 7, 9, 12, 0, 0xf1},
	// 3,000 supports of every kind, some on springs, and a temperature rise.
	{0x15, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0, 0, 3, 0,
		mixedSupports, 0x0b, 0xb7, 10, 200, 0, 12, 0, 0x35},
	// 3,000 spring supports under self-weight.
	{0x13, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0, 1, 2, 0, 0, 3, 0,
		springSupports, 0x0b, 0xb7, 0, 255, 0, 9, 0, 0x27},
	// 65 settled supports 1e-9 m apart, and 33 point loads among them.
	{0x11, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0,
		settledSupports, 0x00, 0x40, 100, 255, 1, 6, 8, 0, 0x21,
		pointLoads, 0x00, 0x20, 100, 10, 1, 6, 8, 0, 3},
	// 500 short line loads, elements no longer than L/161.
	{0x31, 4, 0, 5, 0, 9, 0, 2, 0, 6, 0, 10,
		shortLines, 0x03, 0xe7, 0, 255, 0, 8, 0, 0x5a},
}

// FuzzScale: Validate never panics and lists problems that name their
// items; on a valid model, fem.Solve and fem.SolveExact each refuse it with
// a message or return finite results whose loads and reactions balance
// (for the finite element answer to within its Condition); and when both
// succeed, their reactions agree to within Condition·ε: a finite element
// solution with consistent loads is exact at the nodes.
func FuzzScale(f *testing.F) {
	for _, s := range scaleSeeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		m := scaleModel(&fuzzBytes{data})
		if err := m.Validate(); err != nil {
			checkSomeProblems(t, m, err)
			return
		}
		s, err := fem.Solve(m)
		if err != nil {
			checkRefusal(t, m, "Solve", err)
		} else {
			checkScaledSolution(t, m, s)
		}
		e, exactErr := fem.SolveExact(m)
		if exactErr != nil {
			checkRefusal(t, m, "SolveExact", exactErr)
			return
		}
		reactions := e.Reactions()
		checkScaledBalance(t, m, "the exact solution", reactions, 0)
		for _, x := range []float64{0, m.Length() / 3, m.Length()} {
			if f := e.At(x, fem.Right); nonFiniteVector([]float64{f.AxialDisplacement, f.Deflection, f.Rotation, f.AxialForce, f.ShearForce, f.BendingMoment}) {
				t.Fatalf("exact fields at x = %g: %+v: %s", x, f, summarize(m))
			}
		}
		if err != nil {
			return
		}
		tol := agreement(s.Condition)
		scale := balanceScale(m, reactions, [3]float64{})
		for i, r := range s.Reactions {
			for d := range r.Force {
				if diff := math.Abs(r.Force[d] - reactions[i].Force[d]); !(diff <= tol*scale[d]) {
					t.Fatalf("support %d, %v: finite element reaction %g, exact %g: they differ by %.3g of the loads, beyond %.3g for condition %.3g: %s",
						i+1, fem.Dof(d), r.Force[d], reactions[i].Force[d], diff/scale[d], tol, s.Condition, summarize(m))
				}
			}
		}
	})
}

// checkSomeProblems is checkProblems on the first and last 32 problems of
// a validation error: a model of thousands of items may have thousands of
// problems, and checkProblems takes time quadratic in their number.
func checkSomeProblems(t *testing.T, m *fem.Model, err error) {
	t.Helper()
	var ve *fem.ValidationError
	if errors.As(err, &ve) && len(ve.Problems) > 64 {
		err = &fem.ValidationError{Problems: append(ve.Problems[:32:32], ve.Problems[len(ve.Problems)-32:]...)}
	}
	checkProblems(t, m, err)
}

// agreement is the relative difference allowed between two answers of a
// problem whose condition number is cond: round-off of the sums (roundOff)
// plus the growth the condition number allows, with a factor of 16 for the
// two solvers and the sums over supports.
func agreement(cond float64) float64 { return roundOff + 16*cond*0x1p-52 }

// checkScaledSolution asserts that a finite element solution is finite
// everywhere it is reported and balances its loads.
func checkScaledSolution(t *testing.T, m *fem.Model, s *fem.Solution) {
	t.Helper()
	for i, d := range s.Displacement {
		if nonFiniteVector(d[:]) {
			t.Fatalf("node %d: displacement %v without an error (warnings %q): %s", i, d, s.Warnings, summarize(m))
		}
	}
	for _, x := range []float64{0, m.Length() / 2, m.Length()} {
		if f := s.At(x, fem.Left); nonFiniteVector([]float64{f.AxialForce, f.ShearForce, f.BendingMoment, f.CombinedStress}) {
			t.Fatalf("fields at x = %g: %+v without an error: %s", x, f, summarize(m))
		}
	}
	checkScaledBalance(t, m, "Solve", s.Reactions, s.Condition)
}

// checkScaledBalance asserts that the loads of m and the reactions balance
// to within agreement(cond) of the loads and reactions summed: a solution's
// reactions carry relative errors up to about cond·ε, and their sum with
// them.
func checkScaledBalance(t *testing.T, m *fem.Model, what string, reactions []fem.Reaction, cond float64) {
	t.Helper()
	applied := appliedLoads(m)
	scale := balanceScale(m, reactions, [3]float64{})
	for _, r := range reactions {
		if nonFiniteVector(r.Force[:]) {
			t.Fatalf("%s: support %d: reaction %v: %s", what, r.Support+1, r.Force, summarize(m))
		}
		applied[0] += r.Force[0]
		applied[1] += r.Force[1]
		applied[2] += r.Force[2] + r.X*r.Force[1]
	}
	tol := agreement(cond)
	for d, res := range applied {
		if !(math.Abs(res) <= tol*scale[d]) {
			t.Fatalf("%s: equilibrium component %d: residual %.3g, %.3g of the loads and reactions, beyond %.3g for condition %.3g: %s",
				what, d, res, math.Abs(res)/scale[d], tol, cond, summarize(m))
		}
	}
}
