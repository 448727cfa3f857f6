package main

import (
	"io"
	"os"

	"stave/fem/bench"
)

// benchCommand measures the solver at 1e3 to 1e6 elements beside gonum's
// banded and dense solvers, and what `stave solve` waits for stage by stage,
// and prints the tables (or JSON).
func benchCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("bench")
	asJSON := fs.Bool("json", false, "print the measurements as JSON")
	quick := fs.Bool("quick", false, "small sizes only: checks the harness in a second, numbers mean little")
	pipeline := fs.Bool("pipeline", false, "only the pipeline stage by stage and the point-load table")
	if err := parseFlags(fs, args, stdout, ""); err != nil {
		return err
	}
	if fs.NArg() > 0 {
		return usageError{"bench takes no file"}
	}
	cfg := bench.DefaultConfig()
	if *quick {
		cfg = bench.QuickConfig()
	}
	if *pipeline {
		cfg.Parts = bench.Pipeline | bench.KeyPoints
	}
	cfg.Progress = os.Stderr
	report, err := bench.Run(cfg)
	if err != nil {
		return err
	}
	if *asJSON {
		return report.WriteJSON(stdout)
	}
	return report.WriteText(stdout)
}
