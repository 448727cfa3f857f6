package bench

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"strings"
	"time"

	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/storage"
)

// PipelineRow is what a user waits for on one model of one size, stage by
// stage, as `stave solve --json` goes: the model read from its file, the
// mesh, the finite element solve, the exact solution, the one walk over the
// elements that feeds the extremes, the comparison with the exact solution
// and the checks' probes, then the checks, and the summary written as JSON.
// Times are the medians of the repetitions, in seconds (Total the median of
// the repetitions' sums); Shares are each stage's part of the sum of the
// stages' medians, by the stages' names. The walk's three parts are also
// timed each in a walk of its own (Extremes, Comparison, Checks), to show
// where its time goes; they count in no total.
type PipelineRow struct {
	Model             string             `json:"model"`
	Elements          int                `json:"elements"`
	LoadSeconds       float64            `json:"load_seconds"`   // storage.Unmarshal of the model file's bytes
	MeshSeconds       float64            `json:"mesh_seconds"`   // fem.BuildMesh
	SolveSeconds      float64            `json:"solve_seconds"`  // fem.SolveOnMesh, both problems
	ExactSeconds      float64            `json:"exact_seconds"`  // fem.SolveExact
	WalkSeconds       float64            `json:"walk_seconds"`   // as analysis.Finish: one fem.Walk for the summary and the checks' probes, then the checks
	OutputSeconds     float64            `json:"output_seconds"` // the summary as JSON
	TotalSeconds      float64            `json:"total_seconds"`  // median of the sums
	Shares            map[string]float64 `json:"shares"`
	ExtremesSeconds   float64            `json:"extremes_seconds"`   // part: fem.Summarize without the exact solution, a walk of its own
	ComparisonSeconds float64            `json:"comparison_seconds"` // part: fem.Compare, a walk of its own with the exact solution
	ChecksSeconds     float64            `json:"checks_seconds"`     // part: the checks' probes in a walk of their own, and the checks
	// PostOverSolve is everything after the solve (exact solution, the
	// walk with the checks, output) over the solve.
	PostOverSolve float64 `json:"post_over_solve"`
}

// KeyPointRow is the analysis of the key-point model (KeyPointModel) with
// one number of point loads: analysis.Solve and analysis.Finish, the whole
// of `stave solve` after reading the file, in seconds.
type KeyPointRow struct {
	PointLoads    int     `json:"point_loads"`
	Elements      int     `json:"elements"`
	SolveSeconds  float64 `json:"solve_seconds"`  // analysis.Solve: mesh and finite element solve, the exact solution started beside it
	FinishSeconds float64 `json:"finish_seconds"` // analysis.Finish: the exact solution waited for, one walk, checks
	TotalSeconds  float64 `json:"total_seconds"`
}

// pipelineStages names the stages of a PipelineRow, in order, and
// walkParts the parts of its walk, each timed in a walk of its own.
var (
	pipelineStages = []string{"load", "mesh", "solve", "exact", "walk", "output"}
	walkParts      = []string{"extremes", "comparison", "checks"}
)

// measurePipeline times the stages of one model of one size.
func measurePipeline(cfg Config, bm benchModel, size int) (PipelineRow, error) {
	m := bm.build(size)
	data, err := storage.Marshal(&storage.Project{Model: *m, View: storage.DefaultView()})
	if err != nil {
		return PipelineRow{}, fmt.Errorf("bench: %s model with %d elements: %w", bm.name, size, err)
	}
	progress(cfg, "%s model, %d elements: the pipeline stage by stage", bm.name, size)
	opts := check.DefaultOptions()
	var failed error
	var elements int
	stages, total := timeStages(max(cfg.Repetitions, 1), len(pipelineStages), cfg.MinBatch, func() []time.Duration {
		t := make([]time.Time, 0, len(pipelineStages)+len(walkParts)+1)
		t = append(t, time.Now())
		p, err := storage.Unmarshal(data)
		if err != nil {
			failed = err
			return make([]time.Duration, len(pipelineStages)+len(walkParts))
		}
		t = append(t, time.Now())
		mesh, err := fem.BuildMesh(&p.Model)
		t = append(t, time.Now())
		var s *fem.Solution
		if err == nil {
			s, err = fem.SolveOnMesh(&p.Model, mesh)
		}
		t = append(t, time.Now())
		var e *fem.Exact
		if err == nil {
			e, err = fem.SolveExact(&p.Model)
		}
		t = append(t, time.Now())
		if err != nil {
			failed = err
			return make([]time.Duration, len(pipelineStages)+len(walkParts))
		}
		elements = len(mesh.Elements)
		z := fem.NewSummarizer(s, e)
		probe := check.NewProbe(&p.Model, s, e)
		fem.Walk(s, e, z, probe)
		probe.Results(z.Comparison(), opts)
		sum := z.Summary()
		t = append(t, time.Now())
		err = json.NewEncoder(io.Discard).Encode(sum)
		t = append(t, time.Now())
		if err != nil {
			failed = err
		}
		// The walk's parts, each in a walk of its own.
		fem.Summarize(s, nil)
		t = append(t, time.Now())
		fem.Compare(s, e)
		t = append(t, time.Now())
		probe = check.NewProbe(&p.Model, s, e)
		fem.Walk(s, e, probe)
		probe.Results(nil, opts)
		t = append(t, time.Now())
		out := make([]time.Duration, len(t)-1)
		for i := range out {
			out[i] = t[i+1].Sub(t[i])
		}
		return out
	})
	if failed != nil {
		return PipelineRow{}, fmt.Errorf("bench: %s model with %d elements: %w", bm.name, size, failed)
	}
	row := PipelineRow{Model: bm.name, Elements: elements, Shares: map[string]float64{}}
	fields := []*float64{&row.LoadSeconds, &row.MeshSeconds, &row.SolveSeconds, &row.ExactSeconds, &row.WalkSeconds, &row.OutputSeconds,
		&row.ExtremesSeconds, &row.ComparisonSeconds, &row.ChecksSeconds}
	sum := 0.0
	for i, field := range fields {
		*field = stages[i]
		if i < len(pipelineStages) {
			sum += stages[i]
		}
	}
	for i, name := range pipelineStages {
		if sum > 0 {
			row.Shares[name] = stages[i] / sum
		}
	}
	row.TotalSeconds = total
	post := row.ExactSeconds + row.WalkSeconds + row.OutputSeconds
	row.PostOverSolve = ratio(post, row.SolveSeconds)
	return row, nil
}

// measureKeyPoints times the analysis of the key-point model with loads
// point loads.
func measureKeyPoints(cfg Config, loads int) (KeyPointRow, error) {
	m := KeyPointModel(cfg.KeyPointElements, loads)
	progress(cfg, "beam model, %d elements, %d point loads: the analysis", cfg.KeyPointElements, loads)
	r := analysis.Request{Model: *m, Checks: check.DefaultOptions(), ExactAhead: true} // as analysis.Run
	ctx := context.Background()
	var failed error
	var elements int
	stages, total := timeStages(max(cfg.Repetitions, 1), 2, cfg.MinBatch, func() []time.Duration {
		t0 := time.Now()
		a, err := analysis.Solve(ctx, r)
		t1 := time.Now()
		if err == nil && a.Err == nil {
			a, err = analysis.Finish(ctx, r, a)
		}
		t2 := time.Now()
		switch {
		case err != nil:
			failed = err
		case a.Err != nil:
			failed = a.Err
		case a.Exact == nil:
			failed = a.ExactErr
		default:
			elements = len(a.Solution.Mesh.Elements)
		}
		return []time.Duration{t1.Sub(t0), t2.Sub(t1)}
	})
	if failed != nil {
		return KeyPointRow{}, fmt.Errorf("bench: key-point model with %d point loads: %w", loads, failed)
	}
	return KeyPointRow{PointLoads: loads, Elements: elements, SolveSeconds: stages[0], FinishSeconds: stages[1], TotalSeconds: total}, nil
}

// keyPointExponent fits the growth of the analysis time with the number of
// point loads.
func keyPointExponent(rows []KeyPointRow) (float64, bool) {
	var n, t []float64
	for _, r := range rows {
		n = append(n, float64(r.PointLoads))
		t = append(t, r.TotalSeconds)
	}
	return slope(n, t)
}

func (r *Report) pipelineTable(b *strings.Builder) {
	b.WriteString("\nWhat `stave solve --json` waits for, stage by stage (the walk: one walk over the elements for the extremes, the comparison and the checks' probes, and the checks, as analysis.Finish)\n")
	header := []string{"model", "elements"}
	for _, s := range pipelineStages {
		header = append(header, s, "%")
	}
	header = append(header, "total", "post/solve", fmt.Sprintf("≤ %g", targetPostOverSolve))
	header = append(header, walkParts...)
	table(b, header, func(add func(...string)) {
		for _, row := range r.Pipeline {
			cells := []string{row.Model, fmt.Sprint(row.Elements)}
			for i, v := range []float64{row.LoadSeconds, row.MeshSeconds, row.SolveSeconds, row.ExactSeconds, row.WalkSeconds, row.OutputSeconds} {
				cells = append(cells, seconds(v), fmt.Sprintf("%.0f", 100*row.Shares[pipelineStages[i]]))
			}
			verdict := "-"
			if row.Elements >= r.PipelineFrom {
				verdict = passFail(row.PostOverSolve <= targetPostOverSolve)
			}
			cells = append(cells, seconds(row.TotalSeconds), fmt.Sprintf("%.2f", row.PostOverSolve), verdict,
				seconds(row.ExtremesSeconds), seconds(row.ComparisonSeconds), seconds(row.ChecksSeconds))
			add(cells...)
		}
	})
	b.WriteString("post/solve: exact + walk + output over solve; judged from " + fmt.Sprint(r.PipelineFrom) + " elements\n")
	b.WriteString("extremes, comparison, checks: the walk's parts, each timed in a walk of its own (they count in no total); from 4,096 elements a walk runs on two goroutines, the solve on one\n")
}

func (r *Report) keyPointTable(b *strings.Builder) {
	fmt.Fprintf(b, "\nPoint loads on the beam model of %d elements: analysis.Solve (with the exact solution started beside the finite element one) and analysis.Finish (the exact solution waited for, one walk, checks)\n", r.KeyPointElements)
	table(b, []string{"point loads", "elements", "solve", "finish", "total"}, func(add func(...string)) {
		for _, row := range r.KeyPoints {
			add(fmt.Sprint(row.PointLoads), fmt.Sprint(row.Elements), seconds(row.SolveSeconds), seconds(row.FinishSeconds), seconds(row.TotalSeconds))
		}
	})
	if len(r.KeyPoints) > 1 {
		fmt.Fprintf(b, "  total time grows as point loads^%.2f (target ≤ %.1f) %s\n", r.KeyPointExponent, targetKeyPointExponent,
			passFail(r.KeyPointExponent <= targetKeyPointExponent))
	}
}
