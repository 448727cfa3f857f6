package report

import (
	"encoding/json"
	"fmt"
	"io"
	"text/tabwriter"

	"stave/fem"
	"stave/fem/units"
)

// WriteJSON writes v as indented JSON, as every command's --json does.
func WriteJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// WriteSummaryJSON writes the summary of the model in file path as JSON, in
// SI base units, with the caution, and the cases, combinations and
// envelope of a model with load cases when cases is not nil (cases.go).
func WriteSummaryJSON(w io.Writer, path string, s fem.Summary, cases *CasesJSON) error {
	return WriteJSON(w, struct {
		File    string `json:"file"`
		Units   string `json:"units"`
		Caution string `json:"caution"`
		fem.Summary
		*CasesJSON
	}{path, "SI base units: m, N, N·m, Pa, rad", fem.Caution, s, cases})
}

// WriteSummaryText writes the summary of the model in file path as text
// tables in units u: mesh, reactions, extremes, equilibrium, the error
// against the exact solution, warnings and the caution.
func WriteSummaryText(w io.Writer, path string, s fem.Summary, u units.System) {
	pos := func(x float64) string { return u.Format(units.Position, x) }
	force := func(v float64) string { return u.Format(units.Force, v) }
	moment := func(v float64) string { return u.Format(units.Moment, v) }
	fmt.Fprintf(w, "Stave %s: %s\n", Version, path)
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
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
}
