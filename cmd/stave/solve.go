package main

import (
	"context"
	"flag"
	"fmt"
	"io"

	"stave/canvas/report"
	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// solveCommand prints the summary of one model: reactions, extremes,
// equilibrium, error against the exact solution and mesh. The model is
// analysed as the window and the exports analyse it (package fem/analysis).
func solveCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("solve")
	asJSON := fs.Bool("json", false, "print the summary as JSON (SI units)")
	system := fs.String("units", "", "unit system for the printed text: SI or US (default: the file's display units)")
	show := fs.String("show", "", "a model with load cases: print one case or combination by NAME, or the envelope")
	path, err := parseOneFile(fs, args)
	if err != nil {
		return err
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	r := report.Request(p, nil)
	if r.Show, err = showFlag(&p.Model, *show); err != nil {
		return err
	}
	a, err := analysis.Run(context.Background(), r)
	if err != nil {
		return err
	}
	if a.Err != nil {
		return modelError{fmt.Errorf("%s: %w", path, a.Err)}
	}
	sum := a.Summary()
	cases, err := report.CasesResults(&a)
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	if *asJSON {
		return report.WriteSummaryJSON(stdout, path, sum, cases)
	}
	name := *system
	if name == "" {
		name = string(p.View.Units)
	}
	sys, ok := units.ByName(name)
	if !ok {
		return usageError{fmt.Sprintf("unknown unit system %q: use SI or US", name)}
	}
	if cases != nil && r.Show.Kind == analysis.ShowEnvelope {
		report.WriteCasesText(stdout, path, cases, sys)
		return nil
	}
	if cases != nil {
		fmt.Fprintf(stdout, "Showing %s\n", cases.Shown)
	}
	report.WriteSummaryText(stdout, path, sum, sys)
	return nil
}

// newFlagSet makes a flag set that reports misuse as an error, not an exit.
func newFlagSet(name string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	return fs
}

// parseOneFile parses flags that may come before or after a single file name.
func parseOneFile(fs *flag.FlagSet, args []string) (string, error) {
	var files []string
	for {
		if err := fs.Parse(args); err != nil {
			return "", usageError{fmt.Sprintf("%s: %v", fs.Name(), err)}
		}
		if fs.NArg() == 0 {
			break
		}
		files = append(files, fs.Arg(0))
		args = fs.Args()[1:]
	}
	if len(files) != 1 {
		return "", usageError{fmt.Sprintf("%s needs exactly one model file, got %d", fs.Name(), len(files))}
	}
	return files[0], nil
}
