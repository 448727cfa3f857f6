package main

import (
	"context"
	"errors"
	"fmt"
	"io"

	"stave/canvas/report"
	"stave/fem/analysis"
	"stave/fem/study"
	"stave/storage"
)

// convergeCommand prints a convergence study of a model against its exact
// solution and, with --target, an adaptive refinement beside uniform
// refinement, with the warnings of the model analysed on its own mesh (as
// `stave solve` analyses it); exit status 3 when a check of that fails.
func convergeCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("converge")
	asJSON := fs.Bool("json", false, "print the study as JSON")
	maxPer := fs.Int("max", 64, "finest mesh: the study solves 1, 2, 4, ... elements in every stretch between key points, up to the largest power of two not above this")
	target := fs.Float64("target", 0, "also refine adaptively until the estimated and the true relative energy error are both at most this (e.g. 0.01)")
	system := fs.String("units", "", "unit system the warnings are written in: SI or US (default: the file's display units)")
	path, err := parseOneFile(fs, args, stdout)
	if err != nil {
		return err
	}
	sys, err := unitsFlag(*system)
	if err != nil {
		return err
	}
	if *maxPer < 1 {
		return usageError{fmt.Sprintf("--max must be at least 1, got %d", *maxPer)}
	}
	if set(fs, "target") && !(*target > 0 && *target < 1) {
		return usageError{fmt.Sprintf("--target %g: give the relative energy error to reach, above 0 and below 1 (0.01 is 1 %%)", *target)}
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	if sys.Name == "" {
		sys = report.UnitSystem(p.View.Units)
	}
	ctx := context.Background()
	table, err := study.Convergence(ctx, &p.Model, *maxPer, sys)
	if tf := (study.TooFineError{}); errors.As(err, &tf) {
		if tf.Fits < 1 {
			return usageError{fmt.Sprintf("--max %d: %s: %v", *maxPer, path, err)}
		}
		return usageError{fmt.Sprintf("--max %d: %s: the study's finest mesh, %d elements per stretch, would not fit in memory: give --max %d or less", *maxPer, path, tf.Finest, tf.Fits)}
	}
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	var versus *study.Versus
	var uniformErr error
	if *target > 0 {
		v, err := study.AgainstUniform(ctx, &p.Model, *target, 100000, 100000, sys)
		if err != nil && len(v.Adaptive.Iterations) == 0 {
			return modelError{fmt.Errorf("%s: %w", path, err)}
		}
		versus, uniformErr = &v, err
	}
	r := report.Request(p, nil)
	r.Checks.Units = sys
	a, err := analysis.Run(ctx, r)
	if err != nil {
		return err
	}
	findings := a.Findings()
	if *asJSON {
		if err := report.WriteConvergenceJSON(stdout, path, table, versus, uniformErr, findings); err != nil {
			return err
		}
	} else {
		report.WriteConvergenceText(stdout, path, table, versus, uniformErr, findings)
	}
	return inDocument(failures(path, findings), *asJSON)
}
