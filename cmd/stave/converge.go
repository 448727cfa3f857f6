package main

import (
	"fmt"
	"io"
	"math"
	"text/tabwriter"

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
	table, err := study.Convergence(&p.Model, *maxPer)
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	var versus *study.Versus
	if *target > 0 {
		v, err := study.AgainstUniform(&p.Model, *target, 100000, 100000)
		if err != nil {
			return modelError{fmt.Errorf("%s: %w", path, err)}
		}
		versus = &v
	}
	if *asJSON {
		return report.WriteJSON(stdout, convergenceJSON(path, table, versus))
	}
	printConvergence(stdout, path, table, versus)
	return nil
}

// jsonNumber turns NaN (no rate measurable) into null.
func jsonNumber(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return &v
}

type rowJSON struct {
	PerStretch int      `json:"elements_per_stretch"`
	Elements   int      `json:"elements"`
	MaxStress  float64  `json:"max_stress_error_relative"`
	L2         float64  `json:"l2_error_relative"`
	Energy     float64  `json:"energy_error_relative"`
	StressRate *float64 `json:"stress_rate"`
	L2Rate     *float64 `json:"l2_rate"`
	EnergyRate *float64 `json:"energy_rate"`
}

func convergenceJSON(path string, t study.Table, v *study.Versus) any {
	rows := make([]rowJSON, len(t.Rows))
	for i, r := range t.Rows {
		rows[i] = rowJSON{r.PerStretch, r.Elements, r.MaxStress, r.L2, r.Energy,
			jsonNumber(r.StressRate), jsonNumber(r.L2Rate), jsonNumber(r.EnergyRate)}
	}
	out := map[string]any{
		"file": path,
		"rows": rows,
		"fitted_rates": map[string]*float64{
			"stress": jsonNumber(t.StressRate), "l2": jsonNumber(t.L2Rate), "energy": jsonNumber(t.EnergyRate),
		},
		"caution": caution,
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
	return out
}

func printConvergence(w io.Writer, path string, t study.Table, v *study.Versus) {
	fmt.Fprintf(w, "Convergence of %s against the exact solution of the same model\n", path)
	fmt.Fprintln(w, "(errors relative; rate = log(error ratio) / log(element ratio))")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "per stretch\telements\tmax stress\trate\tL2 displ.\trate\tenergy\trate\t")
	for _, r := range t.Rows {
		fmt.Fprintf(tw, "%d\t%d\t%.3e\t%s\t%.3e\t%s\t%.3e\t%s\t\n", r.PerStretch, r.Elements,
			r.MaxStress, rateText(r.StressRate), r.L2, rateText(r.L2Rate), r.Energy, rateText(r.EnergyRate))
	}
	tw.Flush()
	fmt.Fprintf(w, "Fitted rates: stress %s, L2 %s, energy %s\n", rateText(t.StressRate), rateText(t.L2Rate), rateText(t.EnergyRate))
	fmt.Fprintln(w, "Theory for smooth solutions (Strang & Fix): linear bars L2 2, energy 1; quadratic bars 3 and 2; Hermite beams 4 and 2.")
	fmt.Fprintln(w, "Point loads, steps and partial loads on key points keep these rates, since the mesh has nodes there.")
	if v != nil {
		fmt.Fprintln(w, "\nAdaptive refinement (recovery-based estimate, Zienkiewicz & Zhu)")
		tw = tabwriter.NewWriter(w, 2, 4, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintln(tw, "elements\testimated\ttrue\teffectivity\t")
		for _, it := range v.Adaptive.Iterations {
			fmt.Fprintf(tw, "%d\t%.3e\t%.3e\t%s\t\n", it.Elements, it.Estimated, it.True, rateText(it.Effectivity))
		}
		tw.Flush()
		if !v.Adaptive.Reached {
			fmt.Fprintln(w, "The target was not reached within the element limit.")
		}
		fmt.Fprintf(w, "Uniform refinement needs %d elements for the same true error (%.3e; adaptive %.3e with %d elements).\n",
			v.UniformElements, v.UniformTrue, v.AdaptiveTrue, len(v.Adaptive.Nodes)-1)
	}
	fmt.Fprintln(w, "\nCaution:", caution)
}

func rateText(r float64) string {
	if math.IsNaN(r) || math.IsInf(r, 0) {
		return "-"
	}
	return fmt.Sprintf("%.2f", r)
}
