package bench

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"slices"
	"time"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack/lapack64"
	"gonum.org/v1/gonum/mat"

	"stave/fem"
	"stave/fem/band"
)

// Report is the outcome of Run. Times are in seconds, memory in bytes.
type Report struct {
	GoVersion   string `json:"go_version"`
	Platform    string `json:"platform"`
	CPUs        int    `json:"cpus"`
	GOMAXPROCS  int    `json:"gomaxprocs"`
	Repetitions int    `json:"repetitions"`
	// CoreCacheBytes is the cache private to one core (Config.CoreCacheBytes)
	// and CoreCacheSource where that number came from.
	CoreCacheBytes  int64  `json:"core_cache_bytes"`
	CoreCacheSource string `json:"core_cache_source"`

	Rows    []Row        `json:"rows"`
	Scaling []Scaling    `json:"scaling"`
	Dense   []DenseRow   `json:"dense"`
	Pitfall []PitfallRow `json:"pitfall"`
	// PitfallExponent is the fitted growth of mat.BandCholesky.Factorize with
	// the number of unknowns (about 2 where its condition estimate dominates).
	PitfallExponent float64          `json:"pitfall_band_cholesky_exponent"`
	Oversize        *OversizeRequest `json:"oversize,omitempty"`
	// Pipeline is what `stave solve --json` waits for, stage by stage;
	// its post-processing is judged from PipelineFrom elements.
	Pipeline     []PipelineRow `json:"pipeline,omitempty"`
	PipelineFrom int           `json:"pipeline_target_from_elements,omitempty"`
	// KeyPoints times the analysis of a beam of KeyPointElements elements
	// with more and more point loads; KeyPointExponent is the fitted
	// growth of its time with their number.
	KeyPoints        []KeyPointRow `json:"keypoints,omitempty"`
	KeyPointElements int           `json:"keypoint_elements,omitempty"`
	KeyPointExponent float64       `json:"keypoint_exponent,omitempty"`
	Targets          []Target      `json:"targets"`
}

// Row is one model at one mesh size.
type Row struct {
	Model    string `json:"model"`
	Elements int    `json:"elements"` // as built by fem.BuildMesh
	// Unknowns and HalfBandwidth describe the model's own problem (the bar
	// system of the bar model, the beam system of the beam model), the one
	// whose kernel is timed.
	Unknowns      int `json:"unknowns"`
	HalfBandwidth int `json:"half_bandwidth"`

	MeshSeconds   float64 `json:"mesh_seconds"`   // fem.BuildMesh
	SolveSeconds  float64 `json:"solve_seconds"`  // fem.SolveOnMesh, both problems
	FieldsSeconds float64 `json:"fields_seconds"` // fem.Summarize
	TotalSeconds  float64 `json:"total_seconds"`  // median of the sums

	AllocatedBytesPerElement float64 `json:"allocated_bytes_per_element"`
	PeakBytesPerElement      float64 `json:"peak_heap_bytes_per_element"`
	PeakPass                 bool    `json:"peak_bytes_pass"`

	FemCondition float64  `json:"fem_condition_estimate"`
	FemWarnings  []string `json:"fem_warnings,omitempty"`

	// The kernel on the identical assembled system.
	OursSeconds      float64 `json:"ours_factor_solve_seconds"` // band.LDL.FactorizeSolve
	ConditionSeconds float64 `json:"ours_condition_estimate_seconds"`
	GonumBandSeconds float64 `json:"pbtrf_pbtrs_seconds"` // copy of A and b, Pbtrf + Pbtrs
	OursToGonumRatio float64 `json:"ours_to_pbtrf_pbtrs_ratio"`
	OursToGonumPass  bool    `json:"ours_to_pbtrf_pbtrs_pass"`
	// FemSolveToGonumRatio is SolveSeconds, fem's whole solve of both
	// problems, over Pbtrf+Pbtrs of this one system: what the hierarchical
	// path costs against a direct banded solve of the same answer.
	FemSolveToGonumRatio float64 `json:"fem_solve_to_pbtrf_pbtrs_ratio"`
	BandCopySeconds      float64 `json:"band_copy_seconds"` // copy(dst, A.Data)
	BandBytes            int64   `json:"band_bytes"`        // len(A.Data) · 8
	// BandInCoreCache says the band fits in a core's private cache: its copy
	// is read at cache speed, no memory floor, and the row is left out of
	// the target on the multiple of a copy.
	BandInCoreCache     bool    `json:"band_in_core_cache"`
	OursToBandCopyRatio float64 `json:"ours_to_band_copy_ratio"`
	// OursToBandCopyPass is the ratio against the limit, also for a row
	// whose band is in the core's cache and so no part of the target.
	OursToBandCopyPass bool `json:"ours_to_band_copy_pass"`
	// KernelFailures lists factorizations that refused the model's system.
	KernelFailures []string `json:"kernel_failures,omitempty"`
	// KernelSystem says what the kernels were timed on: "model", the
	// model's own system, or "stand-in", that system with its diagonal
	// doubled (same size and band, well conditioned), used when the model's
	// system is singular to working precision and a factorization refused it.
	KernelSystem string `json:"kernel_system,omitempty"`

	Agreement Agreement `json:"agreement"`
}

// Agreement compares our solution of the identical system with Pbtrs's.
type Agreement struct {
	// Condition is the estimated 1-norm condition number of D·A·D with
	// D = diag(A)^(-1/2), the scaling in which Cholesky's error is bounded.
	Condition float64 `json:"scaled_condition_estimate"`
	// Difference is max|D⁻¹(x − y)| / max|D⁻¹y|, x ours and y Pbtrs's.
	Difference float64 `json:"relative_difference"`
	// FemDifference is the same with x the displacements fem.SolveOnMesh
	// returned for the model, found without factorizing this system; not
	// compared (FemCompared false) on a stand-in system.
	FemDifference float64 `json:"fem_relative_difference"`
	FemCompared   bool    `json:"fem_compared"`
	// Tolerance is 8(K+1)·cond·ε: the forward error bound of each banded
	// Cholesky-type solve is about cond·ε times a small multiple of the
	// bandwidth (Higham, Accuracy and Stability of Numerical Algorithms,
	// ch. 10, from memory), doubled for two solvers.
	Tolerance float64 `json:"tolerance"`
	// Meaningful is false when Tolerance ≥ 1: the system is singular to
	// working precision and no agreement can be expected of any solver.
	Meaningful bool `json:"meaningful"`
	Agree      bool `json:"agree"`
}

// Scaling is the fitted growth of the end-to-end time with the mesh size.
type Scaling struct {
	Model           string  `json:"model"`
	FromElements    int     `json:"from_elements"`
	ToElements      int     `json:"to_elements"`
	ScalingExponent float64 `json:"scaling_exponent"`
	Pass            bool    `json:"pass"`
}

// DenseRow compares ours with gonum's dense Cholesky on one small system.
type DenseRow struct {
	Model            string  `json:"model"`
	Elements         int     `json:"elements"`
	Unknowns         int     `json:"unknowns"`
	OursSeconds      float64 `json:"ours_factor_solve_seconds"`
	DenseSeconds     float64 `json:"dense_cholesky_seconds"`
	OursToDenseRatio float64 `json:"ours_to_dense_ratio"`
	Difference       float64 `json:"relative_difference"`
}

// PitfallRow times mat.BandCholesky.Factorize against Pbtrf on a beam system.
type PitfallRow struct {
	Unknowns                 int     `json:"unknowns"`
	BandCholeskySeconds      float64 `json:"band_cholesky_factorize_seconds"`
	PbtrfSeconds             float64 `json:"pbtrf_seconds"`
	BandCholeskyToPbtrfRatio float64 `json:"band_cholesky_to_pbtrf_ratio"`
}

// OversizeRequest is what fem.Solve said to a request beyond the machine's memory.
type OversizeRequest struct {
	Elements       int     `json:"elements"`
	Refused        bool    `json:"refused"`
	Message        string  `json:"message"`
	Seconds        float64 `json:"seconds"`
	AllocatedBytes uint64  `json:"allocated_bytes"`
}

// Target is one speed or memory goal and whether the run met it.
type Target struct {
	Name     string  `json:"name"`
	Limit    float64 `json:"limit"`
	Measured float64 `json:"measured"` // the worst value over the rows it covers
	Unit     string  `json:"unit"`
	Pass     bool    `json:"pass"`
}

// The targets, as limits on the measured values.
const (
	targetGonumRatio    = 0.5 // ours / (Pbtrf + Pbtrs)
	targetBandCopyRatio = 5   // ours / one copy of the band
	targetBeamSeconds   = 0.5 // 1e6-element beam end to end
	targetBeamElements  = 1_000_000
	targetExponent      = 1.1 // scaling of the end-to-end time
	targetPeakBytes     = 400 // peak heap growth per element
	// Everything after the solve (exact solution, extremes, comparison,
	// checks, output) over the solve, from Config.ExponentFrom elements.
	targetPostOverSolve    = 1.0
	targetKeyPointExponent = 1.1 // growth of the analysis time with the point loads
)

// benchModel is one of the two models the main table measures.
type benchModel struct {
	name    string
	problem Problem
	build   func(elements int) *fem.Model
}

var benchModels = []benchModel{{"bar", Bar, BarModel}, {"beam", Beam, BeamModel}}

// Run measures what cfg selects and returns the report. It fails only when a
// benchmark model cannot be solved, which would be a bug in fem or here.
func Run(cfg Config) (*Report, error) {
	r := &Report{
		GoVersion:   runtime.Version(),
		Platform:    runtime.GOOS + "/" + runtime.GOARCH,
		CPUs:        runtime.NumCPU(),
		GOMAXPROCS:  runtime.GOMAXPROCS(0),
		Repetitions: max(cfg.Repetitions, 1),
	}
	r.CoreCacheBytes, r.CoreCacheSource = cfg.CoreCacheBytes, "Config.CoreCacheBytes"
	if r.CoreCacheBytes <= 0 {
		r.CoreCacheBytes, r.CoreCacheSource = coreCache()
	}
	if cfg.Parts&(EndToEnd|Memory|Kernels) != 0 {
		for _, bm := range benchModels {
			for _, size := range cfg.Elements {
				row, err := measureRow(cfg, bm, size)
				if err != nil {
					return nil, err
				}
				row.BandInCoreCache = row.BandBytes > 0 && row.BandBytes <= r.CoreCacheBytes
				r.Rows = append(r.Rows, row)
			}
			if cfg.Parts&EndToEnd != 0 {
				r.Scaling = appendScaling(r.Scaling, bm.name, r.Rows, cfg.ExponentFrom)
			}
		}
	}
	if cfg.Parts&Dense != 0 {
		for _, bm := range benchModels {
			for _, n := range cfg.DenseUnknowns {
				row, err := measureDense(cfg, bm, n)
				if err != nil {
					return nil, err
				}
				r.Dense = append(r.Dense, row)
			}
		}
	}
	if cfg.Parts&Pitfall != 0 {
		var n, t []float64
		for _, size := range cfg.PitfallUnknowns {
			row, err := measurePitfall(cfg, size)
			if err != nil {
				return nil, err
			}
			r.Pitfall = append(r.Pitfall, row)
			n = append(n, float64(row.Unknowns))
			t = append(t, row.BandCholeskySeconds)
		}
		r.PitfallExponent, _ = slope(n, t)
	}
	if cfg.Parts&Oversize != 0 {
		r.Oversize = measureOversize(cfg)
	}
	if cfg.Parts&Pipeline != 0 {
		r.PipelineFrom = cfg.ExponentFrom
		for _, bm := range benchModels {
			for _, size := range cfg.Elements {
				row, err := measurePipeline(cfg, bm, size)
				if err != nil {
					return nil, err
				}
				r.Pipeline = append(r.Pipeline, row)
			}
		}
	}
	if cfg.Parts&KeyPoints != 0 {
		r.KeyPointElements = cfg.KeyPointElements
		for _, loads := range cfg.KeyPointLoads {
			row, err := measureKeyPoints(cfg, loads)
			if err != nil {
				return nil, err
			}
			r.KeyPoints = append(r.KeyPoints, row)
		}
		r.KeyPointExponent, _ = keyPointExponent(r.KeyPoints)
	}
	r.Targets = targets(r, cfg.ExponentFrom)
	return r, nil
}

func progress(cfg Config, format string, args ...any) {
	if cfg.Progress != nil {
		fmt.Fprintf(cfg.Progress, format+"\n", args...)
	}
}

// measureRow fills one row of the main table.
func measureRow(cfg Config, bm benchModel, size int) (Row, error) {
	m := bm.build(size)
	mesh, err := fem.BuildMesh(m)
	if err != nil {
		return Row{}, fmt.Errorf("bench: %s model with %d elements: %w", bm.name, size, err)
	}
	ne := len(mesh.Elements)
	row := Row{Model: bm.name, Elements: ne}
	sol, err := fem.SolveOnMesh(m, mesh)
	if err != nil {
		return Row{}, fmt.Errorf("bench: %s model with %d elements: %w", bm.name, ne, err)
	}
	row.FemCondition, row.FemWarnings = sol.Condition, sol.Warnings
	femX := displacementVector(sol, bm.problem)
	sol = nil // not kept alive through the memory pass
	reps := max(cfg.Repetitions, 1)

	if cfg.Parts&EndToEnd != 0 {
		progress(cfg, "%s model, %d elements: mesh, solve, fields", bm.name, ne)
		var failed error
		stages, total := timeStages(reps, 3, cfg.MinBatch, func() []time.Duration {
			t0 := time.Now()
			mesh, err := fem.BuildMesh(m)
			t1 := time.Now()
			s, err2 := fem.SolveOnMesh(m, mesh)
			t2 := time.Now()
			if err = errors.Join(err, err2); err != nil {
				failed = err
				return []time.Duration{t1.Sub(t0), t2.Sub(t1), 0}
			}
			fem.Summarize(s, nil)
			return []time.Duration{t1.Sub(t0), t2.Sub(t1), time.Since(t2)}
		})
		if failed != nil {
			return Row{}, fmt.Errorf("bench: %s model with %d elements: %w", bm.name, ne, failed)
		}
		row.MeshSeconds, row.SolveSeconds, row.FieldsSeconds, row.TotalSeconds = stages[0], stages[1], stages[2], total
	}

	if cfg.Parts&Memory != 0 {
		progress(cfg, "%s model, %d elements: memory", bm.name, ne)
		allocated, peak := memoryUse(func() any {
			mesh, _ := fem.BuildMesh(m)
			s, _ := fem.SolveOnMesh(m, mesh)
			return fem.Summarize(s, nil)
		})
		row.AllocatedBytesPerElement = float64(allocated) / float64(ne)
		row.PeakBytesPerElement = float64(peak) / float64(ne)
		row.PeakPass = row.PeakBytesPerElement <= targetPeakBytes
	}

	if cfg.Parts&Kernels != 0 {
		progress(cfg, "%s model, %d elements: kernels on the identical system", bm.name, ne)
		sys, err := Assemble(m, mesh, bm.problem)
		if err != nil {
			return Row{}, err
		}
		measureKernels(cfg, sys, femX, &row)
	} else {
		n, k := len(mesh.X)*len(bm.problem.motions()), 2*len(bm.problem.motions())-1
		row.Unknowns, row.HalfBandwidth = n, k
	}
	return row, nil
}

// measureKernels times ours, Pbtrf+Pbtrs and one copy of the band on sys,
// and compares ours and fem's own answer (femX, in sys's order) with Pbtrs's.
// The fine beam system is singular to working precision from about 1e5
// elements; when a factorization refuses it, the refusal is recorded and the
// kernels are timed on a stand-in of the same size and band instead.
func measureKernels(cfg Config, sys *System, femX []float64, row *Row) {
	row.Unknowns, row.HalfBandwidth = sys.A.N, sys.A.K
	row.KernelSystem = "model"
	failures := kernelsOn(cfg, sys.A, sys.B, femX, row)
	if len(failures) == 0 {
		return
	}
	row.KernelFailures = failures
	row.KernelSystem = "stand-in"
	*row = clearKernels(*row)
	for _, f := range kernelsOn(cfg, standIn(sys.A), sys.B, nil, row) {
		row.KernelFailures = append(row.KernelFailures, "stand-in: "+f)
	}
}

// standIn is a with its diagonal doubled: A + diag(A) is positive definite
// whenever A is, its scaled condition number is small, and the work of a
// factorization is the same for any values that do not fail.
func standIn(a *band.Symmetric) *band.Symmetric {
	out := &band.Symmetric{N: a.N, K: a.K, Data: slices.Clone(a.Data)}
	for i := range a.N {
		out.Data[i*(a.K+1)] *= 2
	}
	return out
}

// clearKernels returns row without the kernel measurements.
func clearKernels(row Row) Row {
	row.OursSeconds, row.ConditionSeconds, row.GonumBandSeconds = 0, 0, 0
	row.OursToGonumRatio, row.OursToGonumPass = 0, false
	row.FemSolveToGonumRatio, row.BandCopySeconds = 0, 0
	row.OursToBandCopyRatio, row.OursToBandCopyPass = 0, false
	row.Agreement = Agreement{}
	return row
}

// kernelsOn fills row's kernel measurements on a·x = b and returns the
// refusals, if any; femX, when not nil, is fem's answer to compare.
func kernelsOn(cfg Config, a *band.Symmetric, b, femX []float64, row *Row) []string {
	n, k := a.N, a.K
	reps := max(cfg.Repetitions, 1)
	var failures []string

	dst := make([]float64, len(a.Data))
	bandCopy := func() { copy(dst, a.Data) }
	row.BandBytes = int64(8 * len(a.Data))
	var f band.LDL
	ours := make([]float64, n)
	oursOp := func() { _ = f.FactorizeSolve(a, ours, b) }
	if err := f.FactorizeSolve(a, ours, b); err != nil {
		failures = append(failures, "band.LDL: "+err.Error())
	}
	factor := make([]float64, len(a.Data))
	theirs := make([]float64, n)
	gonumOp := func() { gonumBandSolve(a, b, factor, theirs) }
	if !gonumBandSolve(a, b, factor, theirs) {
		failures = append(failures, "lapack64.Pbtrf: the matrix is not positive definite to working precision")
	}
	if len(failures) > 0 {
		row.BandCopySeconds = timeOp(reps, cfg.MinBatch, bandCopy)
		return failures
	}
	// In turns, so each ratio compares runs made in the same state of the
	// machine, whose speed drifts by up to 2× within a minute; after a
	// collection, so none runs beside them (the kernels allocate nothing).
	runtime.GC()
	t := timeRounds(reps, cfg.MinBatch, oursOp, gonumOp, bandCopy)
	row.OursSeconds, row.GonumBandSeconds, row.BandCopySeconds = median(t[0]), median(t[1]), median(t[2])
	row.OursToGonumRatio = pairedRatio(t[0], t[1])
	row.OursToGonumPass = row.OursToGonumRatio <= targetGonumRatio
	row.OursToBandCopyRatio = pairedRatio(t[0], t[2])
	row.OursToBandCopyPass = row.OursToBandCopyRatio <= targetBandCopyRatio
	row.FemSolveToGonumRatio = ratio(row.SolveSeconds, row.GonumBandSeconds)

	scale := make([]float64, n)
	for i := range scale {
		scale[i] = 1 / math.Sqrt(a.Data[i*(k+1)])
	}
	var cond float64
	row.ConditionSeconds = timeOp(reps, cfg.MinBatch, func() { cond = f.Cond(a, scale) })
	const eps = 0x1p-52
	ag := Agreement{Condition: cond, Tolerance: 8 * float64(k+1) * cond * eps}
	ag.Difference = scaledDifference(ours, theirs, scale)
	ag.Meaningful = ag.Tolerance < 1
	ag.Agree = ag.Meaningful && ag.Difference <= ag.Tolerance
	if femX != nil {
		ag.FemCompared = true
		ag.FemDifference = scaledDifference(femX, theirs, scale)
		ag.Agree = ag.Agree && ag.FemDifference <= ag.Tolerance
	}
	row.Agreement = ag
	return nil
}

// displacementVector lists a solution's displacements in the order of p's unknowns.
func displacementVector(s *fem.Solution, p Problem) []float64 {
	motions := p.motions()
	out := make([]float64, 0, len(motions)*len(s.Displacement))
	for _, u := range s.Displacement {
		for _, d := range motions {
			out = append(out, u[d])
		}
	}
	return out
}

// gonumBandSolve solves a·x = b by Pbtrf and Pbtrs, which work in place, so
// the matrix and right-hand side are copied into factor and x first, as
// band.LDL copies them into its own storage.
func gonumBandSolve(a *band.Symmetric, b, factor, x []float64) bool {
	copy(factor, a.Data)
	copy(x, b)
	t, ok := lapack64.Pbtrf(blas64.SymmetricBand{Uplo: blas.Upper, N: a.N, K: a.K, Data: factor, Stride: a.K + 1})
	if !ok {
		return false
	}
	lapack64.Pbtrs(t, blas64.General{Rows: a.N, Cols: 1, Data: x, Stride: 1})
	return true
}

// scaledDifference is max|(x−y)/s| / max|y/s|.
func scaledDifference(x, y, scale []float64) float64 {
	var diff, size float64
	for i := range x {
		diff = max(diff, math.Abs(x[i]-y[i])/scale[i])
		size = max(size, math.Abs(y[i])/scale[i])
	}
	if size == 0 {
		return diff
	}
	return diff / size
}

func ratio(ours, theirs float64) float64 {
	if theirs <= 0 {
		return 0
	}
	return ours / theirs
}

// systemNear assembles the model's own problem with as many unknowns as
// possible up to n.
func systemNear(bm benchModel, n int) (*System, int, error) {
	per := len(bm.problem.motions())
	for ne := max(n/per-1, 1); ; ne-- {
		m := bm.build(ne)
		mesh, err := fem.BuildMesh(m)
		if err != nil {
			return nil, 0, err
		}
		if per*len(mesh.X) <= n || ne == 1 {
			sys, err := Assemble(m, mesh, bm.problem)
			return sys, len(mesh.Elements), err
		}
	}
}

// measureDense compares ours with gonum's dense Cholesky on one small system.
func measureDense(cfg Config, bm benchModel, n int) (DenseRow, error) {
	sys, ne, err := systemNear(bm, n)
	if err != nil {
		return DenseRow{}, err
	}
	a, b := sys.A, sys.B
	n = a.N
	progress(cfg, "%s system, %d unknowns: dense Cholesky", bm.name, n)
	reps := max(cfg.Repetitions, 1)
	var f band.LDL
	ours := make([]float64, n)
	var failed error
	oursSeconds := timeOp(reps, cfg.MinBatch, func() { failed = f.FactorizeSolve(a, ours, b) })
	if failed != nil {
		return DenseRow{}, failed
	}
	dense := mat.NewSymDense(n, nil)
	for i := range n {
		for j := i; j <= min(i+a.K, n-1); j++ {
			dense.SetSym(i, j, a.At(i, j))
		}
	}
	var ch mat.Cholesky
	rhs := mat.NewVecDense(n, b)
	theirs := mat.NewVecDense(n, nil)
	denseSeconds := timeOp(reps, cfg.MinBatch, func() {
		if !ch.Factorize(dense) {
			failed = errors.New("gonum's dense Cholesky found the assembled system not positive definite")
			return
		}
		if err := ch.SolveVecTo(theirs, rhs); err != nil {
			var c mat.Condition
			if !errors.As(err, &c) { // a large condition number is reported, not fatal
				failed = err
			}
		}
	})
	if failed != nil {
		return DenseRow{}, failed
	}
	scale := make([]float64, n)
	for i := range scale {
		scale[i] = 1 / math.Sqrt(a.Data[i*(a.K+1)])
	}
	return DenseRow{
		Model: bm.name, Elements: ne, Unknowns: n,
		OursSeconds: oursSeconds, DenseSeconds: denseSeconds,
		OursToDenseRatio: ratio(oursSeconds, denseSeconds),
		Difference:       scaledDifference(ours, theirs.RawVector().Data, scale),
	}, nil
}

// measurePitfall times mat.BandCholesky.Factorize and Pbtrf on a beam system
// of about n unknowns.
func measurePitfall(cfg Config, n int) (PitfallRow, error) {
	sys, _, err := systemNear(benchModels[1], n)
	if err != nil {
		return PitfallRow{}, err
	}
	a := sys.A
	progress(cfg, "beam system, %d unknowns: mat.BandCholesky", a.N)
	reps := max(cfg.Repetitions, 1)
	sb := mat.NewSymBandDense(a.N, a.K, a.Data)
	var ch mat.BandCholesky
	ok := true
	bc := timeOp(reps, cfg.MinBatch, func() { ok = ch.Factorize(sb) && ok })
	factor := make([]float64, len(a.Data))
	pb := timeOp(reps, cfg.MinBatch, func() {
		copy(factor, a.Data)
		_, good := lapack64.Pbtrf(blas64.SymmetricBand{Uplo: blas.Upper, N: a.N, K: a.K, Data: factor, Stride: a.K + 1})
		ok = good && ok
	})
	if !ok {
		return PitfallRow{}, fmt.Errorf("bench: a beam system of %d unknowns is not positive definite for gonum", a.N)
	}
	return PitfallRow{Unknowns: a.N, BandCholeskySeconds: bc, PbtrfSeconds: pb, BandCholeskyToPbtrfRatio: ratio(bc, pb)}, nil
}

// measureOversize sends fem.Solve a mesh request far beyond memory.
func measureOversize(cfg Config) *OversizeRequest {
	progress(cfg, "beam model, %d elements requested: expecting a refusal", cfg.OversizeElements)
	m := BeamModel(cfg.OversizeElements)
	o := &OversizeRequest{Elements: cfg.OversizeElements}
	var err error
	allocated, _ := memoryUse(func() any {
		start := time.Now()
		_, err = fem.Solve(m)
		o.Seconds = time.Since(start).Seconds()
		return nil
	})
	o.AllocatedBytes = allocated
	if err != nil {
		o.Refused, o.Message = true, err.Error()
	} else {
		o.Message = "fem.Solve accepted the request"
	}
	return o
}

// appendScaling fits the exponent of the model's total time over the rows
// with at least from elements.
func appendScaling(out []Scaling, model string, rows []Row, from int) []Scaling {
	var n, t []float64
	s := Scaling{Model: model}
	for _, r := range rows {
		if r.Model != model || r.Elements < from {
			continue
		}
		if len(n) == 0 {
			s.FromElements = r.Elements
		}
		s.ToElements = r.Elements
		n = append(n, float64(r.Elements))
		t = append(t, r.TotalSeconds)
	}
	p, ok := slope(n, t)
	if !ok {
		return out
	}
	s.ScalingExponent, s.Pass = p, p <= targetExponent
	return append(out, s)
}

// targets summarises the goals over the report: each is met when its worst
// measured value is.
func targets(r *Report, from int) []Target {
	var out []Target
	worst := func(name, unit string, limit float64, value func(Row) (float64, bool)) {
		t := Target{Name: name, Limit: limit, Unit: unit, Measured: math.Inf(-1)}
		for _, row := range r.Rows {
			if v, ok := value(row); ok {
				t.Measured = max(t.Measured, v)
			}
		}
		if !math.IsInf(t.Measured, -1) {
			t.Pass = t.Measured <= limit
			out = append(out, t)
		}
	}
	worst("ours / (Pbtrf + Pbtrs)", "ratio", targetGonumRatio, func(row Row) (float64, bool) {
		return row.OursToGonumRatio, row.OursToGonumRatio > 0
	})
	// A band that fits in a core's cache is copied at cache speed: there the
	// copy is no memory floor (Config.CoreCacheBytes).
	worst(fmt.Sprintf("ours / one copy of the band, bands over the %s core cache", mebibytes(r.CoreCacheBytes)), "ratio", targetBandCopyRatio, func(row Row) (float64, bool) {
		return row.OursToBandCopyRatio, !row.BandInCoreCache && row.OursToBandCopyRatio > 0
	})
	worst("beam end to end at 1e6 elements", "s", targetBeamSeconds, func(row Row) (float64, bool) {
		return row.TotalSeconds, row.Model == "beam" && row.Elements >= targetBeamElements && row.TotalSeconds > 0
	})
	// Below from, fixed costs and fem.Summarize's denser sampling of small
	// meshes dominate the bytes per element; the table shows those rows.
	worst(fmt.Sprintf("peak heap growth per element, from %d elements", from), "B", targetPeakBytes, func(row Row) (float64, bool) {
		return row.PeakBytesPerElement, row.Elements >= from && row.PeakBytesPerElement > 0
	})
	if len(r.Pipeline) > 0 {
		t := Target{Name: fmt.Sprintf("post-processing / solve, from %d elements", r.PipelineFrom), Limit: targetPostOverSolve,
			Unit: "ratio", Measured: math.Inf(-1)}
		for _, row := range r.Pipeline {
			if row.Elements >= r.PipelineFrom {
				t.Measured = max(t.Measured, row.PostOverSolve)
			}
		}
		if !math.IsInf(t.Measured, -1) {
			t.Pass = t.Measured <= t.Limit
			out = append(out, t)
		}
	}
	if len(r.KeyPoints) > 1 {
		out = append(out, Target{
			Name:  fmt.Sprintf("key-point exponent, %d to %d point loads", r.KeyPoints[0].PointLoads, r.KeyPoints[len(r.KeyPoints)-1].PointLoads),
			Limit: targetKeyPointExponent, Unit: "exponent", Measured: r.KeyPointExponent, Pass: r.KeyPointExponent <= targetKeyPointExponent,
		})
	}
	for _, s := range r.Scaling {
		out = append(out, Target{
			Name:  fmt.Sprintf("scaling exponent, %s model, %d to %d elements", s.Model, s.FromElements, s.ToElements),
			Limit: targetExponent, Unit: "exponent", Measured: s.ScalingExponent, Pass: s.Pass,
		})
	}
	return out
}
