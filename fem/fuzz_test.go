package fem_test

// Fuzz targets for bad input and numerical faults: nothing panics, every
// rejection explains itself, and every accepted model gives results that
// balance or carry a warning.
//
//	go test -run '^$' -fuzz '^FuzzValidate$' -fuzztime 30s ./fem

import (
	"encoding/binary"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"regexp"
	"slices"
	"strings"
	"testing"

	"stave/fem"
)

// fuzzBytes turns fuzz input into model data; once the bytes run out every
// read gives zero, so short inputs make small models.
type fuzzBytes struct{ data []byte }

func (b *fuzzBytes) next() byte {
	if len(b.data) == 0 {
		return 0
	}
	c := b.data[0]
	b.data = b.data[1:]
	return c
}

// intn gives a number in [0, n).
func (b *fuzzBytes) intn(n int) int { return int(b.next()) % n }

// bits gives a float64 from eight raw bytes: any value at all, NaN, ±Inf,
// subnormals and ±0 included.
func (b *fuzzBytes) bits() float64 {
	var raw [8]byte
	for i := range raw {
		raw[i] = b.next()
	}
	return math.Float64frombits(binary.LittleEndian.Uint64(raw[:]))
}

// awkward are values that break careless arithmetic.
var awkward = []float64{0, math.Copysign(0, -1), math.NaN(), math.Inf(1), math.Inf(-1),
	math.MaxFloat64, -math.MaxFloat64, math.SmallestNonzeroFloat64, 1e-300, 1e300, -1}

// anyValue gives, by the first byte, an awkward value, raw bits, or a value
// near typical (a sensible magnitude for the field) so that valid models also
// come up often.
func (b *fuzzBytes) anyValue(typical float64) float64 {
	switch c := b.next(); {
	case c < 32:
		return awkward[int(c)%len(awkward)]
	case c < 64:
		return b.bits()
	default:
		return typical * b.moderate()
	}
}

// moderate gives a factor in ±[1e-3, 1e3] or zero: the fuzzer chooses the
// mantissa and the decade, the range keeps magnitudes physical.
func (b *fuzzBytes) moderate() float64 {
	c := b.next()
	if c == 0 {
		return 0
	}
	v := (1 + float64(b.next())/256) * math.Pow(10, float64(int(c%7)-3))
	if c&0x80 != 0 {
		v = -v
	}
	return v
}

// positive is moderate without sign or zero.
func (b *fuzzBytes) positive(typical float64) float64 {
	return typical * (1 + float64(b.next())/64) * math.Pow(10, float64(b.intn(5)-2))
}

// fuzzLimits bound the size of a fuzzed model so each run stays fast.
type fuzzLimits struct {
	items    int // largest count of segments, supports, point and distributed loads
	elements int // largest requested element count
}

// buildModel makes a model from fuzz bytes. With wild set, every number may
// be anything (awkward, raw bits, typical) and kinds, counts and orders may be
// out of range; otherwise numbers are moderate, positions lie on the member,
// kinds are valid and only the structure (counts, places, kinds, signs and
// magnitudes within physical ranges) is fuzzed.
func buildModel(b *fuzzBytes, wild bool, lim fuzzLimits) *fem.Model {
	value := func(typical float64) float64 {
		if wild {
			return b.anyValue(typical)
		}
		return typical * b.moderate()
	}
	property := func(typical float64) float64 {
		if wild {
			return b.anyValue(typical)
		}
		return b.positive(typical)
	}
	m := &fem.Model{}
	L := 0.0
	for range b.intn(lim.items + 1) {
		start, length := L, b.positive(1)
		if wild {
			start, length = b.anyValue(L+0.001), b.anyValue(1)
		}
		m.Segments = append(m.Segments, fem.Segment{
			Start: start, End: start + length,
			Section: fem.Section{Area: property(1e-2), SecondMoment: property(1e-5), FibreDistance: property(0.1)},
			Material: fem.Material{Elastic: property(1e11), Density: math.Abs(value(1e3)),
				ThermalExpansion: value(1e-5), Allowable: math.Abs(value(1e8))},
		})
		L = start + length
	}
	// Positions: on the member for the tame models, anything for the wild ones.
	position := func() float64 {
		if wild && b.next() < 64 {
			return b.anyValue(L)
		}
		return L * float64(b.next()) / 255
	}
	kinds := int(fem.Spring) + 1
	for range b.intn(lim.items + 1) {
		s := fem.Support{X: position(), Kind: fem.SupportKind(b.intn(kinds))}
		if wild {
			s.Kind = fem.SupportKind(b.intn(kinds+3) - 1)
		}
		for d := range s.Stiffness {
			if b.next()&1 == 1 {
				s.Stiffness[d] = math.Abs(value(1e6))
				if wild {
					s.Stiffness[d] = value(1e6)
				}
			}
			if b.next()&1 == 1 {
				s.Settlement[d] = value(1e-3)
			}
		}
		m.Supports = append(m.Supports, s)
	}
	for range b.intn(lim.items + 1) {
		m.PointLoads = append(m.PointLoads, fem.PointLoad{X: position(), Axial: value(1e4), Transverse: value(1e4), Moment: value(1e4)})
	}
	for range b.intn(lim.items + 1) {
		d := fem.DistributedLoad{Direction: fem.Dof(b.intn(2))}
		if wild {
			d.Direction = fem.Dof(b.intn(5) - 1)
		}
		n := 2 + b.intn(4)
		if wild {
			n = b.intn(6)
		}
		x := 0.0
		for range n {
			if wild {
				x = position()
			} else {
				x += (L - x) * float64(1+b.next()) / 256
			}
			d.Points = append(d.Points, fem.LoadPoint{X: x, Intensity: value(1e4)})
		}
		m.DistributedLoad = append(m.DistributedLoad, d)
	}
	if b.next()&1 == 1 {
		m.Gravity = [2]float64{value(1), value(10)}
	}
	if b.next()&1 == 1 {
		m.TemperatureChange = value(10)
	}
	m.Mesh = fem.MeshSettings{Elements: b.intn(lim.elements + 1), BarOrder: fem.ElementOrder(1 + b.intn(2))}
	if wild {
		m.Mesh.Elements = int(int32(binary.LittleEndian.Uint32([]byte{b.next(), b.next(), b.next(), b.next()})))
		m.Mesh.MaxElementLength = b.anyValue(0.1)
		m.Mesh.BarOrder = fem.ElementOrder(b.intn(5) - 1)
	}
	return m
}

// problemItems gives the length of the list each item indexes, -1 for the
// model-wide items.
func problemItems(m *fem.Model) map[fem.ItemKind]int {
	return map[fem.ItemKind]int{fem.SegmentItem: len(m.Segments), fem.SupportItem: len(m.Supports),
		fem.PointLoadItem: len(m.PointLoads), fem.DistributedLoadItem: len(m.DistributedLoad), fem.MeshItem: -1, fem.ModelItem: -1}
}

// modelWideWords are the words a message about the model or the mesh as a
// whole must use to say what it is about.
var modelWideWords = regexp.MustCompile(`\b(model|member|segments|gravity|temperature|mesh|element|elements)\b`)

// checkProblems asserts that a validation error explains itself: each
// problem names a known item, indexes it within its list, and says which one
// in its message (items are numbered from 1 for the user).
func checkProblems(t *testing.T, m *fem.Model, err error) {
	t.Helper()
	var ve *fem.ValidationError
	if !errors.As(err, &ve) {
		t.Fatalf("Validate returned %T (%v), want a *fem.ValidationError", err, err)
	}
	if len(ve.Problems) == 0 || err.Error() == "" {
		t.Fatalf("a validation error with %d problems and text %q", len(ve.Problems), err.Error())
	}
	lists := problemItems(m)
	for _, p := range ve.Problems {
		it := p.Item
		n, known := lists[it.Kind]
		switch {
		case !known:
			t.Errorf("problem about unknown item %v: %q", it.Kind, p.Message)
		case strings.TrimSpace(p.Message) == "":
			t.Errorf("%s %d (%+v): empty message", it.Kind, it.Index, p.Place)
		case n < 0 && (it.Index != -1 || !modelWideWords.MatchString(p.Message)):
			t.Errorf("%s problem (index %d) does not say what it is about: %q", it.Kind, it.Index, p.Message)
		case n >= 0 && (it.Index < 0 || it.Index >= n):
			t.Errorf("%s index %d outside the %d listed: %q", it.Kind, it.Index, n, p.Message)
		case n >= 0 && !namesItem(p):
			t.Errorf("message does not name %s %d: %q", it.Kind, it.Index+1, p.Message)
		}
		if !strings.Contains(err.Error(), p.Message) {
			t.Errorf("the error text leaves out %q", p.Message)
		}
	}
}

// namesItem reports whether the message names its item the way users count,
// "support 3", or in a pair, "supports 1 and 3", "segment 1 ... segment 2".
func namesItem(p fem.Problem) bool {
	number := fmt.Sprint(p.Item.Index + 1)
	single := regexp.MustCompile(`\b` + p.Item.Kind.String() + ` ` + number + `\b`)
	pair := regexp.MustCompile(`\b` + p.Item.Kind.String() + `s \d+ and ` + number + `\b`)
	return single.MatchString(p.Message) || pair.MatchString(p.Message)
}

// brokenSeeds are inputs that make broken models: nothing, awkward values
// everywhere, and raw NaN, +Inf and −MaxFloat64 in the first segment.
var brokenSeeds = [][]byte{
	{},
	{2, 2, 3, 4, 5, 6, 7, 8, 9, 10, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13},
	{1, 40, 0, 0, 0, 0, 0, 0, 0xf8, 0x7f, 40, 0, 0, 0, 0, 0, 0, 0xf0, 0x7f, 40, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xef, 0xff},
}

// solvableSeeds finds, among seeded random inputs, three whose tame models
// Solve accepts: with several segments and supports, point and distributed
// loads; the second with a spring support, the third with self-weight and a
// temperature change.
func solvableSeeds() [][]byte {
	rnd := rand.New(rand.NewPCG(3, 4))
	wants := []func(m *fem.Model) bool{
		func(*fem.Model) bool { return true },
		func(m *fem.Model) bool {
			return slices.ContainsFunc(m.Supports, func(s fem.Support) bool { return s.Kind == fem.Spring })
		},
		func(m *fem.Model) bool { return m.TemperatureChange != 0 && m.Gravity != [2]float64{} },
	}
	var seeds [][]byte
	for len(seeds) < len(wants) {
		b := make([]byte, 120)
		for i := range b {
			b[i] = byte(rnd.IntN(256))
		}
		m := buildModel(&fuzzBytes{b}, false, tameLimits)
		if len(m.Segments) < 2 || len(m.Supports) < 2 || len(m.PointLoads) == 0 || len(m.DistributedLoad) == 0 || !wants[len(seeds)](m) {
			continue
		}
		if _, err := fem.Solve(m); err == nil {
			seeds = append(seeds, b)
		}
	}
	return seeds
}

func addSeeds(f *testing.F) {
	for _, s := range append(brokenSeeds, solvableSeeds()...) {
		f.Add(s)
	}
}

// FuzzValidate: Validate never panics; it accepts a model or lists problems
// that each name their item and place; and what it accepts has no NaN or
// infinity where a number is used.
func FuzzValidate(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		m := buildModel(&fuzzBytes{data}, true, fuzzLimits{items: 5, elements: 1 << 30})
		err := m.Validate()
		if err != nil {
			checkProblems(t, m, err)
			return
		}
		if where := nonFinite(m); where != "" {
			t.Fatalf("Validate accepted a model whose %s is not finite: %s", where, describe(m))
		}
	})
}

// nonFinite names the first number of m that a solver would use and that is
// NaN or infinite, or returns "".
func nonFinite(m *fem.Model) string {
	bad := func(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) }
	for i, s := range m.Segments {
		for _, v := range []float64{s.Start, s.End, s.Section.Area, s.Section.SecondMoment, s.Section.FibreDistance,
			s.Material.Elastic, s.Material.Density, s.Material.ThermalExpansion, s.Material.Allowable} {
			if bad(v) {
				return fmt.Sprintf("segment %d", i+1)
			}
		}
	}
	for i, s := range m.Supports {
		for d := fem.Axial; d <= fem.Rotation; d++ {
			if bad(s.X) || (s.Kind == fem.Spring && bad(s.Stiffness[d])) || (s.Kind.Restrains(d) && bad(s.Settlement[d])) {
				return fmt.Sprintf("support %d", i+1)
			}
		}
	}
	for i, p := range m.PointLoads {
		if bad(p.X) || bad(p.Axial) || bad(p.Transverse) || bad(p.Moment) {
			return fmt.Sprintf("point load %d", i+1)
		}
	}
	for i, d := range m.DistributedLoad {
		for _, p := range d.Points {
			if bad(p.X) || bad(p.Intensity) {
				return fmt.Sprintf("distributed load %d", i+1)
			}
		}
	}
	if bad(m.Gravity[0]) || bad(m.Gravity[1]) || bad(m.TemperatureChange) || bad(m.Mesh.MaxElementLength) {
		return "gravity, temperature or mesh"
	}
	return ""
}

// tameLimits keep fuzzed models small enough to solve thousands a second.
var tameLimits = fuzzLimits{items: 4, elements: 200}

// checkRefusal asserts that an error explains itself.
func checkRefusal(t *testing.T, m *fem.Model, what string, err error) {
	t.Helper()
	var ve *fem.ValidationError
	if errors.As(err, &ve) {
		checkProblems(t, m, err)
		return
	}
	if strings.TrimSpace(err.Error()) == "" {
		t.Fatalf("%s refused the model with an empty message: %s", what, describe(m))
	}
}

// FuzzSolve: Solve never panics; it refuses with a message, or returns
// finite results whose loads and reactions balance to round-off of the sums
// that make them, or warns that the results are unreliable.
func FuzzSolve(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		m := buildModel(&fuzzBytes{data}, false, tameLimits)
		s, err := fem.Solve(m)
		if err != nil {
			checkRefusal(t, m, "Solve", err)
			return
		}
		if len(s.Warnings) > 0 {
			for _, w := range s.Warnings {
				if !strings.Contains(w, "condition number") {
					t.Errorf("warning without the condition estimate: %q", w)
				}
			}
			return
		}
		for i, d := range s.Displacement {
			if nonFiniteVector(d[:]) {
				t.Fatalf("node %d: displacement %v with no warning: %s", i, d, describe(m))
			}
		}
		checkBalance(t, m, s.Reactions, stiffnessTerms(m, s.Mesh.X, s))
	})
}

// checkBalance asserts that the loads of m and the reactions balance to
// round-off of the terms summed, with no help from fem's own totals. A
// backward-stable solve leaves residuals of ε times those terms, whatever the
// conditioning (Higham, Accuracy and Stability, ch. 10, from memory).
func checkBalance(t *testing.T, m *fem.Model, reactions []fem.Reaction, terms [3]float64) {
	t.Helper()
	applied := appliedLoads(m)
	scale := balanceScale(m, reactions, terms)
	for _, r := range reactions {
		if nonFiniteVector(r.Force[:]) {
			t.Fatalf("support %d: reaction %v: %s", r.Support+1, r.Force, describe(m))
		}
		applied[0] += r.Force[0]
		applied[1] += r.Force[1]
		applied[2] += r.Force[2] + r.X*r.Force[1]
	}
	for d, res := range applied {
		if !(math.Abs(res) <= roundOff*scale[d]) {
			t.Fatalf("equilibrium component %d: residual %.3g against terms of %.3g: %s", d, res, scale[d], describe(m))
		}
	}
}

// keyPositions are the points where the exact solution changes form (ends,
// segment breaks, supports, point loads, load break points): the nodes of
// fem's mesh with one element per stretch.
func keyPositions(t *testing.T, m *fem.Model) []float64 {
	t.Helper()
	c := *m
	c.Mesh.Elements, c.Mesh.MaxElementLength = 0, 0
	mesh, err := fem.BuildMesh(&c)
	if err != nil {
		t.Fatalf("BuildMesh of a model SolveExact accepted: %v", err)
	}
	return mesh.X
}

func nonFiniteVector(v []float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return true
		}
	}
	return false
}

// FuzzExact: SolveExact never panics; it refuses with a message or returns
// finite reactions that balance the loads and finite fields.
func FuzzExact(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		m := buildModel(&fuzzBytes{data}, false, tameLimits)
		e, err := fem.SolveExact(m)
		if err != nil {
			checkRefusal(t, m, "SolveExact", err)
			return
		}
		checkBalance(t, m, e.Reactions(), stiffnessTerms(m, keyPositions(t, m), e))
		for _, x := range []float64{0, m.Length() / 3, m.Length()} {
			f := e.At(x, fem.Right)
			if nonFiniteVector([]float64{f.AxialDisplacement, f.Deflection, f.Rotation, f.AxialForce, f.ShearForce, f.BendingMoment}) {
				t.Fatalf("fields at x = %g: %+v: %s", x, f, describe(m))
			}
		}
	})
}
