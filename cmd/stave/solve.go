package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"strings"

	"stave/canvas/report"
	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// solveCommand prints the results of one model: mesh and accuracy,
// reactions, extremes, the actions at the supports inside the member,
// equilibrium, the error of the finite element answer, every check and
// every warning. The model is analysed as the window and the exports
// analyse it (package fem/analysis). With --json a refused model still
// gives a document, whose warnings say why.
func solveCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("solve")
	asJSON := fs.Bool("json", false, "print the results as JSON (SI units; docs/json.md)")
	system := fs.String("units", "", "unit system for the printed text: SI or US (default: the file's display units)")
	show := fs.String("show", "", "a model with load cases: print one case or combination by NAME, or the envelope")
	path, err := parseOneFile(fs, args, stdout)
	if err != nil {
		return err
	}
	sys, err := unitsFlag(*system)
	if err != nil {
		return err
	}
	p, err := storage.Load(path)
	if err != nil {
		if *asJSON {
			refused := analysis.Analysis{Err: err}
			if werr := report.WriteSolveJSON(stdout, path, report.Source{Analysis: &refused, Findings: refused.Findings()}); werr != nil {
				return werr
			}
		}
		return modelError{err}
	}
	if sys.Name == "" {
		sys = report.UnitSystem(p.View.Units)
	}
	r := report.Request(p, nil)
	r.Checks.Units = sys
	if r.Show, err = showFlag(&p.Model, *show); err != nil {
		return err
	}
	a, err := analysis.Run(context.Background(), r)
	if err != nil {
		return err
	}
	src := report.NewSource(p, &a)
	src.Units = sys
	if a.Err == nil {
		src = src.WithTrains() // worked out once for every output below, with a warning for a train left out
	}
	switch {
	case *asJSON:
		if err := report.WriteSolveJSON(stdout, path, src); err != nil {
			return modelError{fmt.Errorf("%s: %w", path, err)}
		}
	case a.Err == nil:
		cases, err := report.CasesResults(&a)
		if err != nil {
			return modelError{fmt.Errorf("%s: %w", path, err)}
		}
		src.Trains = cases.WithTrains(src) // worked out once for every text below
		if cases != nil && r.Show.Kind == analysis.ShowEnvelope {
			report.WriteCasesText(stdout, path, cases, sys)
			report.WriteTrainsText(stdout, src)
			report.WriteChecksText(stdout, src) // the envelope's checks, then the warnings
			report.WriteCasesCaution(stdout)
			break
		}
		if cases != nil {
			fmt.Fprintf(stdout, "Showing %s\n", cases.Shown)
		}
		report.WriteSolveText(stdout, path, src)
	}
	if a.Err != nil {
		return modelError{fmt.Errorf("%s: %w", path, a.Err)}
	}
	return inDocument(failures(path, src.Findings), *asJSON)
}

// unitsFlag is the unit system a --units flag names, the zero value when
// the flag is not given (each command then takes the file's display units).
func unitsFlag(name string) (units.System, error) {
	if name == "" {
		return units.System{}, nil
	}
	sys, ok := units.ByName(name)
	if !ok {
		return units.System{}, usageError{fmt.Sprintf("unknown unit system %q: use SI or US", name)}
	}
	return sys, nil
}

// newFlagSet makes a flag set that reports misuse as an error, not an exit.
func newFlagSet(name string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	return fs
}

// parseFlags parses args with fs. With --help it prints the command's
// usage, its operands after the flags, and its flags to stdout and returns
// helpShown; misuse is a usageError.
func parseFlags(fs *flag.FlagSet, args []string, stdout io.Writer, operands string) error {
	err := fs.Parse(args)
	switch {
	case errors.Is(err, flag.ErrHelp):
		fmt.Fprintf(stdout, "usage: %s\n\nflags:\n", strings.TrimSpace("stave "+fs.Name()+" [flags] "+operands))
		fs.SetOutput(stdout)
		fs.PrintDefaults()
		return helpShown
	case err != nil:
		return usageError{fmt.Sprintf("%s: %v", fs.Name(), err)}
	}
	return nil
}

// parseOneFile parses flags that may come before or after a single file
// name. With --help it prints the command's flags to stdout and returns
// helpShown.
func parseOneFile(fs *flag.FlagSet, args []string, stdout io.Writer) (string, error) {
	files, err := parseOperands(fs, args, stdout, "FILE")
	if err != nil {
		return "", err
	}
	if len(files) != 1 {
		return "", usageError{fmt.Sprintf("%s needs exactly one model file, got %d", fs.Name(), len(files))}
	}
	return files[0], nil
}

// parseOperands parses flags that may come before, between or after the
// operands (file names) and returns the operands in order. "--" ends the
// flags: every argument after it is an operand, one beginning with "-"
// too. With --help it prints the command's usage, operands as its
// operands, and returns helpShown.
func parseOperands(fs *flag.FlagSet, args []string, stdout io.Writer, operands string) ([]string, error) {
	var files []string
	for {
		if err := parseFlags(fs, args, stdout, operands); err != nil {
			return nil, err
		}
		rest := fs.Args()
		if endedByDoubleDash(fs, args, len(args)-len(rest)) {
			return append(files, rest...), nil
		}
		if len(rest) == 0 {
			return files, nil
		}
		files = append(files, rest[0])
		args = rest[1:]
	}
}

// endedByDoubleDash reports whether fs, parsing args, stopped at a "--"
// that ends the flags, the last of the parsed arguments: the flags before
// it parse on their own, so it is no flag's value ("--units --").
func endedByDoubleDash(fs *flag.FlagSet, args []string, parsed int) bool {
	if parsed == 0 || args[parsed-1] != "--" {
		return false
	}
	// Parsing the same flags again sets the same values.
	return fs.Parse(args[:parsed-1]) == nil && fs.NArg() == 0
}
