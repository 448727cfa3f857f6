package fem

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// denseEquations is the exact solution's system in a dense gonum matrix,
// solved the way Stave did before the banded solver: Ruiz equilibration and
// gonum's dense LU with partial pivoting. It is the reference the banded
// path is checked against.
type denseEquations struct {
	a *mat.Dense
	b []float64
}

func (s *denseEquations) add(row, col int, v []float64) {
	for k, x := range v {
		s.a.Set(row, col+k, s.a.At(row, col+k)+x)
	}
}

func (s *denseEquations) rhs(row int, v float64)    { s.b[row] += v }
func (s *denseEquations) parts() (matrix, rhs bool) { return true, true }

func (s *denseEquations) solve() ([]float64, error) {
	n := len(s.b)
	rowScale, colScale := make([]float64, n), make([]float64, n)
	for i := range rowScale {
		rowScale[i], colScale[i] = 1, 1
	}
	for range equilibrationPasses {
		for i := 0; i < n; i++ {
			big := 0.0
			for j := 0; j < n; j++ {
				big = math.Max(big, math.Abs(s.a.At(i, j)))
			}
			if big > 0 {
				f := 1 / math.Sqrt(big)
				rowScale[i] *= f
				for j := 0; j < n; j++ {
					s.a.Set(i, j, s.a.At(i, j)*f)
				}
			}
		}
		for j := 0; j < n; j++ {
			big := 0.0
			for i := 0; i < n; i++ {
				big = math.Max(big, math.Abs(s.a.At(i, j)))
			}
			if big > 0 {
				f := 1 / math.Sqrt(big)
				colScale[j] *= f
				for i := 0; i < n; i++ {
					s.a.Set(i, j, s.a.At(i, j)*f)
				}
			}
		}
	}
	rhs := mat.NewVecDense(n, nil)
	for i := range s.b {
		rhs.SetVec(i, s.b[i]*rowScale[i])
	}
	var lu mat.LU
	lu.Factorize(s.a)
	if c := lu.Cond(); !(c < maxCondition) {
		return nil, fmt.Errorf("dense: condition %.3g", c)
	}
	var y mat.VecDense
	if err := lu.SolveVecTo(&y, false, rhs); err != nil {
		return nil, err
	}
	x := make([]float64, n)
	for j := range x {
		x[j] = y.AtVec(j) * colScale[j]
	}
	return x, nil
}

// denseExact solves m's exact solution with the dense reference in place of
// the banded system.
func denseExact(t *testing.T, m *Model) *Exact {
	t.Helper()
	e, err := SolveExact(m) // sets up the stretches and key points
	if err != nil {
		t.Fatal(err)
	}
	points := exactKeyPoints(e, m)
	for _, p := range []odeProblem{exactBar, exactBeam} {
		l := e.layout(p, points)
		sys := &denseEquations{a: mat.NewDense(l.unknowns, l.unknowns, nil), b: make([]float64, l.unknowns)}
		e.equations(p, points, l, sys)
		x, err := sys.solve()
		if err != nil {
			t.Fatal(err)
		}
		e.store(p, l, x)
	}
	return e
}

// exactKeyPoints gathers the loads and restraints at e's key points again.
func exactKeyPoints(e *Exact, m *Model) []keyPoint {
	p, err := Prepare(m)
	if err != nil {
		panic(err)
	}
	return e.keyPoints(&p.model, &p.loads)
}

// randomKeyPointModel is a continuous beam of a few spans on pinned and
// roller supports, some springs, with many point loads and load vertices:
// many stretches, so the band matters.
func randomKeyPointModel(rnd *rand.Rand) *Model {
	L := 5 + 20*rnd.Float64()
	m := &Model{Mesh: MeshSettings{Elements: 10}}
	segs := 1 + rnd.IntN(4)
	for i := range segs {
		m.Segments = append(m.Segments, Segment{
			Start: L * float64(i) / float64(segs), End: L * float64(i+1) / float64(segs),
			Section:  Section{Area: 1e-3 * (1 + rnd.Float64()), SecondMoment: 1e-5 * math.Pow(10, 2*rnd.Float64()), FibreDistance: 0.1},
			Material: Material{Elastic: 2e11 * (0.2 + rnd.Float64()), Density: 7850},
		})
	}
	m.Segments[segs-1].End = L
	spans := 1 + rnd.IntN(5)
	for i := 0; i <= spans; i++ {
		s := Support{X: L * float64(i) / float64(spans), Kind: Roller}
		switch {
		case i == 0:
			s.Kind = Pinned
		case rnd.IntN(4) == 0:
			s.Kind, s.Stiffness = Spring, [3]float64{0, 1e6 * (1 + rnd.Float64()), 0}
		case rnd.IntN(4) == 0:
			s.Settlement[Transverse] = -0.005 * rnd.Float64()
		}
		m.Supports = append(m.Supports, s)
	}
	for range 5 + rnd.IntN(60) {
		m.PointLoads = append(m.PointLoads, PointLoad{X: L * rnd.Float64(), Axial: 1e3 * rnd.NormFloat64(), Transverse: -1e4 * rnd.Float64(), Moment: 1e3 * rnd.NormFloat64()})
	}
	d := DistributedLoad{Direction: Transverse}
	x := 0.0
	for x < L {
		d.Points = append(d.Points, LoadPoint{X: x, Intensity: -1e4 * rnd.Float64()})
		x += L * (0.01 + 0.1*rnd.Float64())
	}
	d.Points = append(d.Points, LoadPoint{X: L, Intensity: -1e4 * rnd.Float64()})
	m.DistributedLoad = []DistributedLoad{d}
	m.Gravity = [2]float64{0, -StandardGravity}
	m.TemperatureChange = 20 * rnd.NormFloat64()
	return m
}

// The banded exact solver keeps the dense path's accuracy: on random
// continuous beams with up to a few hundred stretches both give the same
// reactions and fields to a tolerance of the condition's order (gonum's
// dense LU is the reference library).
func TestExactBandedAgainstDense(t *testing.T) {
	rnd := rand.New(rand.NewPCG(11, 12))
	for trial := range 60 {
		m := randomKeyPointModel(rnd)
		t.Run(fmt.Sprintf("trial %d", trial), func(t *testing.T) {
			banded, err := SolveExact(m)
			if err != nil {
				t.Fatal(err)
			}
			dense := denseExact(t, m)
			scale := 0.0
			for _, r := range dense.Reactions() {
				for _, f := range r.Force {
					scale = max(scale, math.Abs(f))
				}
			}
			for i, r := range banded.Reactions() {
				for d, f := range r.Force {
					if want := dense.Reactions()[i].Force[d]; math.Abs(f-want) > 1e-9*scale {
						t.Errorf("reaction %d %s: banded %.12g, dense %.12g", i+1, Dof(d), f, want)
					}
				}
			}
			var fieldScale Fields
			xs := make([]float64, 201)
			for k := range xs {
				xs[k] = m.Length() * float64(k) / 200
				g := dense.At(xs[k], Right)
				for _, q := range Quantities() {
					setMax(&fieldScale, q, math.Abs(q.Of(&g)))
				}
			}
			for _, x := range xs {
				f, g := banded.At(x, Right), dense.At(x, Right)
				for _, q := range Quantities() {
					if d := math.Abs(q.Of(&f) - q.Of(&g)); d > 1e-8*q.Of(&fieldScale) {
						t.Fatalf("%s at x = %.4g m: banded %.12g, dense %.12g", q, x, q.Of(&f), q.Of(&g))
					}
				}
			}
		})
	}
}

// setMax raises quantity q of f to v when v is larger.
func setMax(f *Fields, q Quantity, v float64) {
	ptr := map[Quantity]*float64{
		QAxialDisplacement: &f.AxialDisplacement, QDeflection: &f.Deflection, QRotation: &f.Rotation,
		QAxialForce: &f.AxialForce, QShearForce: &f.ShearForce, QBendingMoment: &f.BendingMoment,
		QAxialStress: &f.AxialStress, QBendingStress: &f.BendingStress, QCombinedStress: &f.CombinedStress,
	}[q]
	*ptr = max(*ptr, v)
}

// BenchmarkExactKeyPoints times SolveExact on a two-span beam carrying n
// point loads: the banded system keeps it linear in the key points (target:
// 10,000 key points in under 50 ms; compare the rows' ns/op in one run).
func BenchmarkExactKeyPoints(b *testing.B) {
	for _, n := range []int{100, 1000, 10000} {
		m := keyPointModel("point loads", n)
		m.Supports = append(m.Supports, Support{X: m.Length() / 2, Kind: Roller})
		b.Run(fmt.Sprintf("keypoints=%d", n), func(b *testing.B) {
			for b.Loop() {
				if _, err := SolveExact(m); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// The exact solution refuses equations whose condition estimate, after
// equilibration, reaches maxCondition, with the message that says so and no
// solution or structure, whichever problem (here the beam's; the bar's is
// well conditioned) and whatever runs beside the estimate. The estimate of
// the two-span beam with a point load a metre grows about as the fourth
// power of the key points (measured: 2.9e11 at 10,000, 4.6e12 at 20,000),
// so 30,000 pass maxCondition.
func TestExactRefusesIllConditioned(t *testing.T) {
	m := keyPointModel("point loads", 30000)
	m.Supports = append(m.Supports, Support{X: m.Length() / 2, Kind: Roller})
	p, err := Prepare(m)
	if err != nil {
		t.Fatal(err)
	}
	e, err := p.Exact()
	if e != nil || err == nil || !strings.Contains(err.Error(), "singular or nearly so") {
		t.Fatalf("SolveExact gave a solution (%v) or another error: %v", e != nil, err)
	}
	if es, serr := p.ExactStructure(); es != nil || serr != err {
		t.Errorf("ExactStructure gave a structure (%v) or another error: %v", es != nil, serr)
	}
}

// A singular system's condition number is infinite, which fmt's %g writes
// "+Inf" (Go's fmt documentation, from memory): the messages say it in
// words.
func TestSingularConditionInWords(t *testing.T) {
	for _, msg := range []string{
		(&SingularError{Condition: math.Inf(1)}).Error(),
		conditionWarning("beam", math.Inf(1)),
		conditionWarning("bar", math.NaN()),
	} {
		if strings.Contains(msg, "Inf") || strings.Contains(msg, "NaN") {
			t.Errorf("%q prints a value that is not finite as fmt writes it", msg)
		}
	}
	if msg := (&SingularError{Condition: math.Inf(1)}).Error(); !strings.Contains(msg, "condition number infinite") {
		t.Errorf("%q does not say the condition number is infinite", msg)
	}
}
