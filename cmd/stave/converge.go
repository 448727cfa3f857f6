package main

import (
	"context"
	"fmt"
	"io"

	"stave/canvas/report"
	"stave/fem/study"
	"stave/storage"
)

// convergeCommand prints a convergence study of a model against its exact
// solution and, with --target, an adaptive refinement beside uniform refinement.
func convergeCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("converge")
	asJSON := fs.Bool("json", false, "print the study as JSON")
	maxPer := fs.Int("max", 64, "finest mesh: elements in every stretch between key points")
	target := fs.Float64("target", 0, "also refine adaptively until the estimated relative energy error is below this (e.g. 0.01)")
	path, err := parseOneFile(fs, args)
	if err != nil {
		return err
	}
	if *maxPer < 1 {
		return usageError{fmt.Sprintf("--max must be at least 1, got %d", *maxPer)}
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	ctx := context.Background()
	table, err := study.Convergence(ctx, &p.Model, *maxPer)
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	var versus *study.Versus
	if *target > 0 {
		v, err := study.AgainstUniform(ctx, &p.Model, *target, 100000, 100000)
		if err != nil {
			return modelError{fmt.Errorf("%s: %w", path, err)}
		}
		versus = &v
	}
	if *asJSON {
		return report.WriteConvergenceJSON(stdout, path, table, versus)
	}
	report.WriteConvergenceText(stdout, path, table, versus)
	return nil
}
