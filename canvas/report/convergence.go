package report

import (
	"fmt"
	"io"
	"math"
	"text/tabwriter"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/study"
	"stave/fem/units"
)

// RateText writes an observed rate (or an effectivity) with two decimals, a
// dash where there is none, and one that rounds to zero as 0.00, not -0.00.
func RateText(r float64) string {
	if math.IsNaN(r) || math.IsInf(r, 0) {
		return "-"
	}
	if math.Abs(r) < 0.005 {
		r = 0
	}
	return fmt.Sprintf("%.2f", r)
}

// errorText writes a relative error with four figures, "round-off" for
// one the comparison reads as zero (fem.ErrorNorms reads a difference
// negligible against its scale as 0: it is not known to be exactly zero,
// only to be lost in round-off), and in words one that is not finite.
func errorText(e float64) string {
	if e == 0 {
		return "round-off"
	}
	return units.FormatG("%.3e", e)
}

// jsonNumber turns NaN (no rate measurable) into null.
func jsonNumber(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return &v
}

type convergenceRowJSON struct {
	PerStretch int      `json:"elements_per_stretch"`
	Elements   int      `json:"elements"`
	MaxStress  float64  `json:"stress_error"`
	L2         float64  `json:"displacement_error"`
	Energy     float64  `json:"energy_error"`
	StressRate *float64 `json:"stress_rate"`
	L2Rate     *float64 `json:"displacement_rate"`
	EnergyRate *float64 `json:"energy_rate"`
}

type rateJSON struct {
	Fitted   *float64 `json:"fitted"`
	FromRow  *int     `json:"fitted_from_row"` // null with Fitted: there is no row a missing fit starts from
	LastStep *float64 `json:"last_step"`
}

// rateOf is r as JSON: the first row fitted is null, as the fitted rate
// is, when there is no fit.
func rateOf(r study.Rate) rateJSON {
	out := rateJSON{Fitted: jsonNumber(r.Fitted), LastStep: jsonNumber(r.Last)}
	if out.Fitted != nil {
		out.FromRow = &r.From
	}
	return out
}

// WriteConvergenceJSON writes the convergence study t of the model in file
// path and, when v is not nil, the adaptive refinement beside uniform
// refinement (or why that comparison failed, uniformErr), as JSON with the
// findings of the analysis of the model on its own mesh (its warnings) and
// the caution.
func WriteConvergenceJSON(w io.Writer, path string, t study.Table, v *study.Versus, uniformErr error, findings []analysis.Finding) error {
	rows := make([]convergenceRowJSON, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = convergenceRowJSON{r.PerStretch, r.Elements, r.MaxStress, r.L2, r.Energy,
			jsonNumber(r.StressRate), jsonNumber(r.L2Rate), jsonNumber(r.EnergyRate)}
	}
	out := map[string]any{
		"format":          "stave-convergence",
		"version":         1,
		"file":            path,
		"rows":            rows,
		"exact_for_model": t.Exact,
		"rates": map[string]rateJSON{
			"stress": rateOf(t.Stress), "displacement": rateOf(t.L2), "energy": rateOf(t.Energy),
		},
		"check_failed": analysis.Failed(findings),
		"warnings":     warningsOf(findings),
		"caution":      fem.Caution,
	}
	if v != nil {
		its := make([]map[string]any, len(v.Adaptive.Iterations))
		for i, it := range v.Adaptive.Iterations {
			its[i] = map[string]any{"elements": it.Elements, "estimated": it.Estimated, "true": it.True, "effectivity": jsonNumber(it.Effectivity)}
		}
		adaptive := map[string]any{
			"iterations": its, "reached": v.Adaptive.Reached, "at_round_off": v.Adaptive.AtRoundOff,
			"true_error": v.AdaptiveTrue, "exact_for_model": v.Exact,
			"uniform_elements_for_same_error": nil, "uniform_true_error": nil,
		}
		if uniformErr != nil {
			adaptive["uniform_not_compared"] = uniformErr.Error()
		} else if !v.Exact {
			adaptive["uniform_elements_for_same_error"], adaptive["uniform_true_error"] = v.UniformElements, v.UniformTrue
		}
		out["adaptive"] = adaptive
	}
	return WriteJSON(w, out)
}

// WriteConvergenceText writes the convergence study t of the model named
// name as a table of errors and rates, the rates fitted over the
// asymptotic rows and of the last step beside theory's, then (when v is not
// nil) the adaptive refinement with why its comparison with uniform
// refinement failed (uniformErr), the warnings among findings (of the
// analysis of the model on its own mesh; none shown when nil) and the
// caution.
func WriteConvergenceText(w io.Writer, name string, t study.Table, v *study.Versus, uniformErr error, findings []analysis.Finding) {
	fmt.Fprintf(w, "Convergence of %s against the exact solution of the same model\n", name)
	if t.Exact {
		fmt.Fprintf(w, "The finite element answer is exact for this model on every mesh tried (%d to %d elements): its errors are round-off, below %.0e,\n",
			t.Rows[0].Elements, t.Rows[len(t.Rows)-1].Elements, study.RoundOff)
		fmt.Fprintln(w, "as the elements reproduce point loads and moments, settlements and temperature changes between nodes (linear bars and Hermite beams, with shear")
		fmt.Fprintln(w, "deformation too), and a uniform axial load on quadratic bars. There is no rate to measure.")
	} else {
		fmt.Fprintf(w, "(errors relative: %s, %s, %s, round-off where the comparison cannot tell one from zero; rate = log(error ratio) / log(element ratio); - in the first row and where either error is at round-off)\n",
			fem.StressErrorName, fem.DisplacementErrorName, fem.EnergyErrorName)
		if t.LoadSets > 1 {
			fmt.Fprintf(w, "(each error the largest over the model's %d load cases, each case against its own exact solution)\n", t.LoadSets)
		}
		tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintln(tw, "per stretch\telements\tstress\trate\tdisplacement\trate\tenergy\trate\t")
		for _, r := range t.Rows {
			fmt.Fprintf(tw, "%d\t%d\t%s\t%s\t%s\t%s\t%s\t%s\t\n", r.PerStretch, r.Elements,
				errorText(r.MaxStress), RateText(r.StressRate), errorText(r.L2), RateText(r.L2Rate), errorText(r.Energy), RateText(r.EnergyRate))
		}
		tw.Flush()
		rate := func(r study.Rate) string {
			if math.IsNaN(r.Fitted) {
				return "-"
			}
			return fmt.Sprintf("%s (last step %s, fitted from %s on)", RateText(r.Fitted), RateText(r.Last), units.Count(t.Rows[r.From].Elements, "element"))
		}
		if len(t.Rows) < 2 {
			fmt.Fprintln(w, "Rates: none, from one mesh: a rate needs two meshes (a finer study has more).")
		} else {
			fmt.Fprintf(w, "Rates: stress %s; displacement %s; energy %s\n", rate(t.Stress), rate(t.L2), rate(t.Energy))
		}
		fmt.Fprintln(w, "Theory for smooth solutions (Strang & Fix): linear bars displacement 2, energy 1; quadratic bars 3 and 2; Hermite beams 4 and 2;")
		fmt.Fprintln(w, "beams with shear deformation 2 and 1 under line loads, once the shear part leads (each element misses q·h²/(8·κGA) of the deflection, and its constant shear force up to q·h/2).")
		fmt.Fprintln(w, "Stress error (from N and M alone): 1 for linear bars, 2 for quadratic bars and Hermite beams, shear deformation or not.")
		fmt.Fprintln(w, "A member with both shows the beam's rates on coarse meshes and the bar's on fine ones; the fit takes the finest rows that agree.")
		fmt.Fprintln(w, "Point loads, steps and partial loads on key points keep these rates, since the mesh has nodes there.")
	}
	if v != nil {
		fmt.Fprintln(w)
		WriteAdaptiveText(w, *v, uniformErr)
	}
	if findings != nil {
		fmt.Fprintln(w, "\nThe model on its own mesh, checked as `stave solve` checks it:")
		WriteWarningsText(w, findings)
	}
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
}

// WriteAdaptiveText writes the iterations of an adaptive refinement and how
// many elements uniform refinement needs for the same error, or why that
// comparison failed (uniformErr) or was not made.
func WriteAdaptiveText(w io.Writer, v study.Versus, uniformErr error) {
	fmt.Fprintln(w, "Adaptive refinement (recovery-based estimate, Zienkiewicz & Zhu)")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "elements\testimated\ttrue\teffectivity\t")
	for _, it := range v.Adaptive.Iterations {
		fmt.Fprintf(tw, "%d\t%s\t%s\t%s\t\n", it.Elements, errorText(it.Estimated), errorText(it.True), RateText(it.Effectivity))
	}
	tw.Flush()
	switch {
	case v.Adaptive.AtRoundOff:
		fmt.Fprintln(w, "The target was not reached: the true error met the round-off of the last mesh (its condition estimate times ε), which finer meshes only raise.")
	case !v.Adaptive.Reached:
		fmt.Fprintf(w, "The target was not reached within %s, the most this refinement may use.\n", units.Count(v.Adaptive.MaxElements, "element"))
	}
	switch {
	case v.Exact:
		fmt.Fprintln(w, "The finite element answer is exact for this model: its error is round-off, so uniform refinement is not compared.")
	case uniformErr != nil:
		fmt.Fprintf(w, "Uniform refinement was not compared: %v\n", uniformErr)
	default:
		fmt.Fprintf(w, "Uniform refinement needs %d elements for the same true error (%s; adaptive %s with %d elements).\n",
			v.UniformElements, errorText(v.UniformTrue), errorText(v.AdaptiveTrue), len(v.Adaptive.Nodes)-1)
	}
}

// WriteConvergenceChart plots the errors of study t against the number of
// elements (canvas.WriteConvergenceChart) as "png", "svg" or "pdf", with
// the study's fitted rates; a model the finite element answer is exact for
// has no chart.
func WriteConvergenceChart(w io.Writer, format string, t study.Table) error {
	if t.Exact {
		return fmt.Errorf("the finite element answer is exact for this model: its errors are round-off, with no convergence to plot")
	}
	rows := make([]canvas.ConvergenceRow, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = canvas.ConvergenceRow{Elements: r.Elements,
			Errors: fem.ErrorNorms{MaxStressRelative: r.MaxStress, RelativeL2: r.L2, RelativeEnergy: r.Energy}}
	}
	return canvas.WriteConvergenceChart(w, format, rows, canvas.ConvergenceRates{
		Displacement: t.L2.Fitted, Energy: t.Energy.Fitted, Stress: t.Stress.Fitted, Floor: study.RoundOff})
}
