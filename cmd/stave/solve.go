package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"text/tabwriter"

	"stave/fem"
	"stave/fem/units"
	"stave/storage"
)

// solveCommand prints the summary of one model: reactions, extremes,
// equilibrium, error against the exact solution and mesh.
func solveCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("solve")
	asJSON := fs.Bool("json", false, "print the summary as JSON (SI units)")
	system := fs.String("units", "", "unit system for the printed text: SI or US (default: the file's display units)")
	path, err := parseOneFile(fs, args)
	if err != nil {
		return err
	}
	p, sol, exact, err := loadAndSolve(path)
	if err != nil {
		return err
	}
	sum := fem.Summarize(sol, exact)
	if exact == nil {
		sum.Warnings = append(sum.Warnings, "the exact solution is not available for this model, so the error against it is not reported")
	}
	if *asJSON {
		return writeJSON(stdout, struct {
			File    string `json:"file"`
			Units   string `json:"units"`
			Caution string `json:"caution"`
			fem.Summary
		}{path, "SI base units: m, N, N·m, Pa, rad", caution, sum})
	}
	name := *system
	if name == "" {
		name = string(p.View.Units)
	}
	sys, ok := units.ByName(name)
	if !ok {
		return usageError{fmt.Sprintf("unknown unit system %q: use SI or US", name)}
	}
	printSummary(stdout, path, sum, sys)
	return nil
}

// loadAndSolve reads a model file and solves it and its exact counterpart.
// A missing exact solution is not an error: exact comes back nil.
func loadAndSolve(path string) (*storage.Project, *fem.Solution, *fem.Exact, error) {
	p, err := storage.Load(path)
	if err != nil {
		return nil, nil, nil, modelError{err}
	}
	sol, err := fem.Solve(&p.Model)
	if err != nil {
		return nil, nil, nil, modelError{fmt.Errorf("%s: %w", path, err)}
	}
	exact, err := fem.SolveExact(&p.Model)
	if err != nil {
		exact = nil
	}
	return p, sol, exact, nil
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

func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

func printSummary(w io.Writer, path string, s fem.Summary, u units.System) {
	pos := func(x float64) string { return u.Format(units.Position, x) }
	force := func(v float64) string { return u.Format(units.Force, v) }
	moment := func(v float64) string { return u.Format(units.Moment, v) }

	fmt.Fprintf(w, "Stave %s: %s\n", version, path)
	fmt.Fprintf(w, "Mesh: %d elements, %d nodes, bar elements of order %d, condition estimate %.2g\n\n",
		s.Mesh.Elements, s.Mesh.Nodes, s.Mesh.BarOrder, s.Mesh.Condition)

	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintln(tw, "Reactions (forces of the supports on the member; +x along the member, up positive, moments counter-clockwise)")
	fmt.Fprintln(tw, "  support\tkind\tx\taxial\ttransverse\tmoment")
	for _, r := range s.Reactions {
		fmt.Fprintf(tw, "  %d\t%s\t%s\t%s\t%s\t%s\n", r.Support, r.Kind, pos(r.X), force(r.Axial), force(r.Transverse), moment(r.Moment))
	}
	tw.Flush()

	fmt.Fprintln(tw, "\nExtremes along the member")
	fmt.Fprintln(tw, "  quantity\tlargest\tat x\tsmallest\tat x")
	for _, e := range s.Extremes {
		q := e.Quantity.Info()
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\n", q.Name, u.Format(q.Unit, e.Max), pos(e.XMax), u.Format(q.Unit, e.Min), pos(e.XMin))
	}
	tw.Flush()

	eq := s.Equilibrium
	fmt.Fprintln(tw, "\nEquilibrium (applied loads + reactions must be zero)")
	fmt.Fprintln(tw, "  \tapplied\treactions\tresidual")
	fmt.Fprintf(tw, "  axial force\t%s\t%s\t%s\n", force(eq.Applied.Axial), force(eq.Reactions.Axial), force(eq.Residual.Axial))
	fmt.Fprintf(tw, "  transverse force\t%s\t%s\t%s\n", force(eq.Applied.Transverse), force(eq.Reactions.Transverse), force(eq.Residual.Transverse))
	fmt.Fprintf(tw, "  moment about x = 0\t%s\t%s\t%s\n", moment(eq.Applied.Moment), moment(eq.Reactions.Moment), moment(eq.Residual.Moment))
	tw.Flush()
	fmt.Fprintf(w, "  largest residual relative to the loads: %.1e\n", eq.Relative)

	if e := s.ExactError; e != nil {
		fmt.Fprintln(tw, "\nError of the finite element answer against the exact solution of the same model")
		fmt.Fprintf(tw, "  largest deflection error\t%s\n", u.Format(units.Deflection, e.MaxDeflection))
		fmt.Fprintf(tw, "  largest axial displacement error\t%s\n", u.Format(units.Deflection, e.MaxAxial))
		fmt.Fprintf(tw, "  largest stress error\t%s (%.3g %% of the largest stress)\n", u.Format(units.Stress, e.MaxStress), 100*e.MaxStressRelative)
		fmt.Fprintf(tw, "  relative L2 error of displacements\t%.3g\n", e.RelativeL2)
		fmt.Fprintf(tw, "  relative energy-norm error\t%.3g\n", e.RelativeEnergy)
		tw.Flush()
	}
	if len(s.Warnings) > 0 {
		fmt.Fprintln(w, "\nWarnings")
		for _, m := range s.Warnings {
			fmt.Fprintln(w, "  -", m)
		}
	}
	fmt.Fprintln(w, "\nCaution:", caution)
}
