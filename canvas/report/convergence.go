package report

import (
	"fmt"
	"io"
	"math"
	"text/tabwriter"

	"stave/canvas"
	"stave/fem"
	"stave/fem/study"
)

// RateText writes an observed rate (or an effectivity) with two decimals, a
// dash where there is none.
func RateText(r float64) string {
	if math.IsNaN(r) || math.IsInf(r, 0) {
		return "-"
	}
	return fmt.Sprintf("%.2f", r)
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
	MaxStress  float64  `json:"max_stress_error_relative"`
	L2         float64  `json:"l2_error_relative"`
	Energy     float64  `json:"energy_error_relative"`
	StressRate *float64 `json:"stress_rate"`
	L2Rate     *float64 `json:"l2_rate"`
	EnergyRate *float64 `json:"energy_rate"`
}

// WriteConvergenceJSON writes the convergence study t of the model in file
// path and, when v is not nil, the adaptive refinement beside uniform
// refinement, as JSON with the caution.
func WriteConvergenceJSON(w io.Writer, path string, t study.Table, v *study.Versus) error {
	rows := make([]convergenceRowJSON, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = convergenceRowJSON{r.PerStretch, r.Elements, r.MaxStress, r.L2, r.Energy,
			jsonNumber(r.StressRate), jsonNumber(r.L2Rate), jsonNumber(r.EnergyRate)}
	}
	out := map[string]any{
		"file": path,
		"rows": rows,
		"fitted_rates": map[string]*float64{
			"stress": jsonNumber(t.StressRate), "l2": jsonNumber(t.L2Rate), "energy": jsonNumber(t.EnergyRate),
		},
		"caution": fem.Caution,
	}
	if v != nil {
		its := make([]map[string]any, len(v.Adaptive.Iterations))
		for i, it := range v.Adaptive.Iterations {
			its[i] = map[string]any{"elements": it.Elements, "estimated": it.Estimated, "true": it.True, "effectivity": jsonNumber(it.Effectivity)}
		}
		out["adaptive"] = map[string]any{
			"iterations": its, "reached": v.Adaptive.Reached, "true_error": v.AdaptiveTrue,
			"uniform_elements_for_same_error": v.UniformElements, "uniform_true_error": v.UniformTrue,
		}
	}
	return WriteJSON(w, out)
}

// WriteConvergenceText writes the convergence study t of the model named
// name as a table of errors and rates, the fitted rates beside theory's,
// then (when v is not nil) the adaptive refinement, and the caution.
func WriteConvergenceText(w io.Writer, name string, t study.Table, v *study.Versus) {
	fmt.Fprintf(w, "Convergence of %s against the exact solution of the same model\n", name)
	fmt.Fprintln(w, "(errors relative; rate = log(error ratio) / log(element ratio))")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "per stretch\telements\tmax stress\trate\tL2 displ.\trate\tenergy\trate\t")
	for _, r := range t.Rows {
		fmt.Fprintf(tw, "%d\t%d\t%.3e\t%s\t%.3e\t%s\t%.3e\t%s\t\n", r.PerStretch, r.Elements,
			r.MaxStress, RateText(r.StressRate), r.L2, RateText(r.L2Rate), r.Energy, RateText(r.EnergyRate))
	}
	tw.Flush()
	fmt.Fprintf(w, "Fitted rates: stress %s, L2 %s, energy %s\n", RateText(t.StressRate), RateText(t.L2Rate), RateText(t.EnergyRate))
	fmt.Fprintln(w, "Theory for smooth solutions (Strang & Fix): linear bars L2 2, energy 1; quadratic bars 3 and 2; Hermite beams 4 and 2.")
	fmt.Fprintln(w, "Point loads, steps and partial loads on key points keep these rates, since the mesh has nodes there.")
	if v != nil {
		fmt.Fprintln(w)
		WriteAdaptiveText(w, *v, nil)
	}
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
}

// WriteAdaptiveText writes the iterations of an adaptive refinement and how
// many elements uniform refinement needs for the same error, or why that
// comparison failed (uniformErr).
func WriteAdaptiveText(w io.Writer, v study.Versus, uniformErr error) {
	fmt.Fprintln(w, "Adaptive refinement (recovery-based estimate, Zienkiewicz & Zhu)")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "elements\testimated\ttrue\teffectivity\t")
	for _, it := range v.Adaptive.Iterations {
		fmt.Fprintf(tw, "%d\t%.3e\t%.3e\t%s\t\n", it.Elements, it.Estimated, it.True, RateText(it.Effectivity))
	}
	tw.Flush()
	if !v.Adaptive.Reached {
		fmt.Fprintln(w, "The target was not reached within the element limit.")
	}
	if uniformErr != nil {
		fmt.Fprintf(w, "Uniform refinement was not compared: %v\n", uniformErr)
		return
	}
	fmt.Fprintf(w, "Uniform refinement needs %d elements for the same true error (%.3e; adaptive %.3e with %d elements).\n",
		v.UniformElements, v.UniformTrue, v.AdaptiveTrue, len(v.Adaptive.Nodes)-1)
}

// WriteConvergenceChart plots the errors of study t against the number of
// elements (canvas.WriteConvergenceChart) as "png", "svg" or "pdf".
func WriteConvergenceChart(w io.Writer, format string, t study.Table) error {
	rows := make([]canvas.ConvergenceRow, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = canvas.ConvergenceRow{Elements: r.Elements,
			Errors: fem.ErrorNorms{MaxStressRelative: r.MaxStress, RelativeL2: r.L2, RelativeEnergy: r.Energy}}
	}
	return canvas.WriteConvergenceChart(w, format, rows)
}
