package main

import (
	"io"
	"os"

	"stave/fem/bench"
)

// benchCommand measures the solver at 1e3 to 1e6 elements beside gonum's
// banded and dense solvers, and prints the table (or JSON).
func benchCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("bench")
	asJSON := fs.Bool("json", false, "print the measurements as JSON")
	quick := fs.Bool("quick", false, "small sizes only: checks the harness in a second, numbers mean little")
	if err := fs.Parse(args); err != nil {
		return usageError{"bench: " + err.Error()}
	}
	if fs.NArg() > 0 {
		return usageError{"bench takes no file"}
	}
	cfg := bench.DefaultConfig()
	if *quick {
		cfg = bench.QuickConfig()
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
