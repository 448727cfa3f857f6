// Package study measures how the finite element answer approaches the exact
// one as the mesh is refined, and refines the mesh adaptively where a
// recovery-based estimate of the error is largest.
//
// Convergence solves a model on meshes with 1, 2, 4, ... elements in every
// stretch between key points and tabulates the error against the exact
// solution (fem.SolveExact, fem.Compare) with the observed rates; a model
// with load cases is measured case by case, each error the largest over
// its cases. For a smooth exact solution, theory predicts an energy-norm error O(h^(p+1−m))
// and a displacement L2 error O(h^(p+1)), where p is the polynomial degree
// of the element and m the order of the derivative in the strain energy (1
// for bars, 2 for beams) (Strang & Fix, An Analysis of the Finite Element
// Method, ch. 1 and 3; Hughes, The Finite Element Method, ch. 1; from
// memory): linear bars 1 and 2, quadratic bars 2 and 3, Hermite cubic beams
// 2 and 4; beams with shear deformation under line loads, once the shear
// part leads, 1 and 2 (the element's shear force is constant, its
// deflection misses the shear part of a clamped element's). The stress
// error follows the energy rate, but for shear deformation: the stresses
// come from N and M alone, and keep the rate 2. Each measure's rate is
// fitted over the asymptotic rows (Rate): on a member with both axial force
// and bending the beam's error dominates coarse meshes and the bar's fine
// ones, and a fit over every row would report a rate no step shows. A model
// the elements reproduce exactly (point loads only) has round-off errors on
// every mesh: the table says so (Table.Exact) and measures no rate.
//
// Adapt estimates the error of each element in the manner of Zienkiewicz &
// Zhu (1987, 1992): a smoothed bending moment and axial force are recovered
// from the superconvergent points of the elements of a patch, and the energy
// of the difference between recovered and finite element actions measures
// the error. Elements with the largest estimates are halved until the
// estimate and the true error both meet a target.
package study

import (
	"context"
	"fmt"
	"math"

	"stave/fem"
	"stave/fem/units"
)

// Row is one mesh of a convergence table.
type Row struct {
	PerStretch int // elements in every stretch between key points
	Elements   int
	// Errors against the exact solution, relative (see fem.ErrorNorms):
	// of a model with load cases, the largest over its cases.
	MaxStress, L2, Energy float64
	// RoundOff is the relative error at or below which this mesh's errors
	// are round-off: the larger of the study's RoundOff and the solution's
	// condition estimate times ε, the relative error elimination may leave
	// (fem.Solution.Condition). A beam that only a foundation holds across
	// has a condition growing as h⁻⁴, and its round-off outgrows the
	// discretisation error on fine meshes.
	RoundOff float64
	// Observed rates against the previous row, log(e₀/e₁)/log(n₁/n₀);
	// NaN in the first row or where an error is at round-off.
	StressRate, L2Rate, EnergyRate float64
}

// Table is a convergence study.
type Table struct {
	Rows []Row
	// Exact says every error of every row is at round-off: the finite
	// element answer is exact for this model (point loads only, say, which
	// Hermite beams and linear bars reproduce), and there is no rate to
	// measure.
	Exact bool
	// The rates of each measure: fitted over the asymptotic rows and that
	// of the last step (Rate).
	Stress, L2, Energy Rate
	// LoadSets is how many load sets were measured: the model's load
	// cases, or 1 for its own loads.
	LoadSets int
}

// Rate is the observed rate of one error measure.
type Rate struct {
	// Fitted is the least-squares slope of −log(error) against
	// log(elements) over the asymptotic rows, from row From on: the last
	// rows above round-off whose step rates all lie within rateAgreement of
	// the last step's. Early coarse meshes, where another part of the
	// error still dominates (the bending of a member that also carries
	// axial force, say), are left out. NaN with fewer than two rows above
	// round-off.
	Fitted float64
	From   int
	// Last is the rate of the last step with both errors above round-off;
	// NaN when there is none.
	Last float64
}

// RoundOff is the relative error below which a value is taken as exact:
// rates computed from such values measure noise. A mesh whose stiffness
// matrix is ill-conditioned has a higher floor (Row.RoundOff).
const RoundOff = 1e-10

// roundOffOf is the round-off floor of a solution with condition estimate
// cond: relative errors up to cond·ε are possible (fem.Solution.Condition).
func roundOffOf(cond float64) float64 {
	return math.Max(RoundOff, cond*0x1p-52)
}

// rateAgreement is how far, in rate, a step may be from the last one and
// still count as asymptotic: well under the gap of one between the rates
// theory gives the elements (common practice for reading such tables).
const rateAgreement = 0.25

// Convergence solves m with 1, 2, 4, ... up to maxPerStretch elements in
// every stretch between key points and compares each with the exact solution.
// It stops with ctx's error when ctx is done before a mesh. fem's messages
// quote values in u (fem.PrepareIn).
func Convergence(ctx context.Context, m *fem.Model, maxPerStretch int, u units.System) (Table, error) {
	if maxPerStretch < 1 {
		return Table{}, fmt.Errorf("convergence study: the finest mesh must have at least 1 element per stretch, got %d", maxPerStretch)
	}
	exacts, keys, err := prepare(m, "convergence study", u)
	if err != nil {
		return Table{}, err
	}
	finest := 1
	for finest <= maxPerStretch/2 {
		finest *= 2
	}
	if err := fits(m, finest, len(keys)-1); err != nil {
		fit := finest / 2
		for fit >= 1 && fits(m, fit, len(keys)-1) != nil {
			fit /= 2
		}
		return Table{}, TooFineError{Finest: finest, Fits: fit, Err: err}
	}
	t := Table{LoadSets: len(exacts)}
	for k := 1; k <= maxPerStretch; k *= 2 {
		if err := ctx.Err(); err != nil {
			return Table{}, err
		}
		sols, err := solveOn(m, Subdivide(keys, k), u)
		if err != nil {
			return Table{}, fmt.Errorf("convergence study, %d elements per stretch: %w", k, err)
		}
		s := sols[0]
		row := Row{PerStretch: k, Elements: len(s.Mesh.Elements), RoundOff: roundOffOf(s.Condition)}
		for i, s := range sols {
			norms := fem.Compare(s, exacts[i])
			row.MaxStress = math.Max(row.MaxStress, norms.MaxStressRelative)
			row.L2 = math.Max(row.L2, norms.RelativeL2)
			row.Energy = math.Max(row.Energy, norms.RelativeEnergy)
		}
		row.StressRate, row.L2Rate, row.EnergyRate = math.NaN(), math.NaN(), math.NaN()
		if n := len(t.Rows); n > 0 {
			prev := t.Rows[n-1]
			step := func(before, after float64) float64 {
				if before <= prev.RoundOff || after <= row.RoundOff {
					return math.NaN()
				}
				return math.Log(before/after) / math.Log(float64(row.Elements)/float64(prev.Elements))
			}
			row.StressRate = step(prev.MaxStress, row.MaxStress)
			row.L2Rate = step(prev.L2, row.L2)
			row.EnergyRate = step(prev.Energy, row.Energy)
		}
		t.Rows = append(t.Rows, row)
	}
	t.Stress = rateOf(t.Rows, func(r Row) (float64, float64) { return r.MaxStress, r.StressRate })
	t.L2 = rateOf(t.Rows, func(r Row) (float64, float64) { return r.L2, r.L2Rate })
	t.Energy = rateOf(t.Rows, func(r Row) (float64, float64) { return r.Energy, r.EnergyRate })
	t.Exact = true
	for _, r := range t.Rows {
		t.Exact = t.Exact && r.MaxStress <= RoundOff && r.L2 <= RoundOff && r.Energy <= RoundOff
	}
	return t, nil
}

// rateOf is the rate of the measure value gives (its error and step rate)
// over rows: the last step's, and the fit over the asymptotic rows.
func rateOf(rows []Row, value func(Row) (float64, float64)) Rate {
	r := Rate{Fitted: math.NaN(), Last: math.NaN()}
	last := len(rows) - 1
	for last >= 0 {
		if e, _ := value(rows[last]); e > rows[last].RoundOff {
			break
		}
		last--
	}
	if last < 1 {
		return r
	}
	_, r.Last = value(rows[last])
	if math.IsNaN(r.Last) {
		return r
	}
	r.From = last - 1
	for r.From > 0 {
		e, step := value(rows[r.From])
		if e <= rows[r.From].RoundOff || math.IsNaN(step) || math.Abs(step-r.Last) > rateAgreement {
			break
		}
		r.From--
	}
	r.Fitted = fittedRate(rows[r.From:last+1], func(row Row) float64 { e, _ := value(row); return e })
	return r
}

// fittedRate is the least-squares slope of −log(error) against log(elements).
func fittedRate(rows []Row, value func(Row) float64) float64 {
	var xs, ys []float64
	for _, r := range rows {
		if v := value(r); v > r.RoundOff {
			xs, ys = append(xs, math.Log(float64(r.Elements))), append(ys, -math.Log(v))
		}
	}
	if len(xs) < 2 {
		return math.NaN()
	}
	var mx, my float64
	for i := range xs {
		mx, my = mx+xs[i], my+ys[i]
	}
	mx, my = mx/float64(len(xs)), my/float64(len(xs))
	var sxy, sxx float64
	for i := range xs {
		sxy += (xs[i] - mx) * (ys[i] - my)
		sxx += (xs[i] - mx) * (xs[i] - mx)
	}
	return sxy / sxx
}

// prepare solves every load set of m exactly (its load cases, or its own
// loads; fem.Member.ExactLoadSets) and returns the solutions with the nodes
// every mesh of m must hold (one element per stretch between key points);
// what names the study in errors, whose values fem quotes in u.
func prepare(m *fem.Model, what string, u units.System) ([]*fem.Exact, []float64, error) {
	p, err := fem.PrepareIn(m, u)
	if err != nil {
		return nil, nil, fmt.Errorf("%s needs the exact solution: %w", what, err)
	}
	exacts, err := p.ExactLoadSets()
	if err != nil {
		return nil, nil, fmt.Errorf("%s needs the exact solution: %w", what, err)
	}
	return exacts, fem.KeyPoints(m), nil
}

// Subdivide splits every interval of nodes into k equal parts: the nodes of
// a mesh of k elements on every stretch between key points.
func Subdivide(nodes []float64, k int) []float64 {
	out := make([]float64, 0, (len(nodes)-1)*k+1)
	out = append(out, nodes[0])
	for i := 1; i < len(nodes); i++ {
		a, b := nodes[i-1], nodes[i]
		for j := 1; j < k; j++ {
			out = append(out, a+(b-a)*float64(j)/float64(k))
		}
		out = append(out, b)
	}
	return out
}

// TooFineError is the refusal of a study whose finest mesh, as asked for,
// would not fit in memory: the request is at fault, not the model, which a
// coarser study takes. Its message says how fine a study may go, not what
// the loader's refusal (Err) advises for a model's own mesh (fewer
// elements, a longer maximum element length), which does not bear on it.
type TooFineError struct {
	Finest int   // elements per stretch of the finest mesh asked for
	Fits   int   // the finest that fits, a power of two; 0 for none
	Err    error // the loader's refusal of the finest mesh
}

func (e TooFineError) Error() string {
	fit := "not even 1 element per stretch fits"
	if e.Fits > 0 {
		fit = fmt.Sprintf("a study up to %s per stretch fits", units.Count(e.Fits, "element"))
	}
	return fmt.Sprintf("convergence study, the finest mesh of %d elements per stretch: it would not fit in memory; %s", e.Finest, fit)
}

func (e TooFineError) Unwrap() error { return e.Err }

// fits refuses k elements on each of n stretches when the analysis of
// that mesh would not fit in memory, as the loader refuses a file that
// asks for it: a study up to 10⁹ elements per stretch ran until memory
// ran out.
func fits(m *fem.Model, k, n int) error {
	um := *m
	um.Mesh = fem.MeshSettings{Elements: math.MaxInt, BarOrder: m.Mesh.BarOrder}
	if k <= math.MaxInt/n {
		um.Mesh.Elements = k * n
	}
	return um.Validate()
}

// solveOn solves every load set of m (fem.Member.SolveLoadSets) on a mesh
// of nodes and the key points (fem.Member.MeshOn), fem's messages quoting
// values in u.
func solveOn(m *fem.Model, nodes []float64, u units.System) ([]*fem.Solution, error) {
	p, err := fem.PrepareIn(m, u)
	if err != nil {
		return nil, err
	}
	mesh, err := p.MeshOn(nodes)
	if err != nil {
		return nil, err
	}
	return p.SolveLoadSets(mesh)
}
