package bench

import (
	"encoding/json"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
)

// WriteJSON writes the report as indented JSON: times in seconds, memory in
// bytes, every comparison under a key that ends in "ratio".
func (r *Report) WriteJSON(w io.Writer) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(r)
}

// WriteText writes the report as plain-text tables, one row per model and
// size, with PASS or FAIL beside each target.
func (r *Report) WriteText(w io.Writer) error {
	var b strings.Builder
	fmt.Fprintf(&b, "Stave solver benchmark: %s %s, %d cores (GOMAXPROCS %d), median of %d repetitions\n",
		r.GoVersion, r.Platform, r.CPUs, r.GOMAXPROCS, r.Repetitions)
	if len(r.Rows) > 0 {
		r.endToEndTable(&b)
		r.kernelTable(&b)
	}
	if len(r.Scaling) > 0 {
		b.WriteString("\nScaling of the end-to-end time (least-squares slope of log time against log elements)\n")
		for _, s := range r.Scaling {
			fmt.Fprintf(&b, "  %s model, %d to %d elements: exponent %.2f (target ≤ %.1f) %s\n",
				s.Model, s.FromElements, s.ToElements, s.ScalingExponent, targetExponent, passFail(s.Pass))
		}
	}
	if len(r.Dense) > 0 {
		b.WriteString("\nDense solver on the identical system (gonum mat.Cholesky factor + solve)\n")
		table(&b, []string{"model", "elements", "unknowns", "ours f+s", "dense", "ours/dense ratio", "difference"}, func(add func(...string)) {
			for _, d := range r.Dense {
				add(d.Model, fmt.Sprint(d.Elements), fmt.Sprint(d.Unknowns), seconds(d.OursSeconds), seconds(d.DenseSeconds),
					fmt.Sprintf("%.2g", d.OursToDenseRatio), fmt.Sprintf("%.1e", d.Difference))
			}
		})
	}
	if len(r.Pitfall) > 0 {
		b.WriteString("\nPitfall: mat.BandCholesky.Factorize (with its condition estimate) against Pbtrf, beam systems\n")
		table(&b, []string{"unknowns", "BandCholesky", "Pbtrf", "BandCholesky/Pbtrf ratio"}, func(add func(...string)) {
			for _, p := range r.Pitfall {
				add(fmt.Sprint(p.Unknowns), seconds(p.BandCholeskySeconds), seconds(p.PbtrfSeconds), fmt.Sprintf("%.0f", p.BandCholeskyToPbtrfRatio))
			}
		})
		fmt.Fprintf(&b, "  BandCholesky time grows as unknowns^%.2f\n", r.PitfallExponent)
	}
	if len(r.Pipeline) > 0 {
		r.pipelineTable(&b)
	}
	if len(r.KeyPoints) > 0 {
		r.keyPointTable(&b)
	}
	if o := r.Oversize; o != nil {
		fmt.Fprintf(&b, "\nRequest beyond memory: fem.Solve on the beam model with %d elements ", o.Elements)
		if o.Refused {
			fmt.Fprintf(&b, "is refused in %s, allocating %d bytes:\n  %q\n", seconds(o.Seconds), o.AllocatedBytes, o.Message)
		} else {
			fmt.Fprintf(&b, "was NOT refused: %s\n", o.Message)
		}
	}
	if len(r.Targets) > 0 {
		b.WriteString("\nTargets (worst value over the rows each covers)\n")
		table(&b, []string{"target", "limit", "measured", "result"}, func(add func(...string)) {
			for _, t := range r.Targets {
				add(t.Name, limitText(t), measuredText(t), passFail(t.Pass))
			}
		})
	}
	_, err := io.WriteString(w, b.String())
	return err
}

func (r *Report) endToEndTable(b *strings.Builder) {
	b.WriteString("\nEnd to end through fem's API: BuildMesh, SolveOnMesh (both problems), Summarize; memory per element\n")
	var warned []string
	table(b, []string{"model", "elements", "mesh", "solve", "fields", "total", "alloc B/el", "peak B/el", fmt.Sprintf("≤ %d", targetPeakBytes)}, func(add func(...string)) {
		for _, row := range r.Rows {
			add(row.Model, fmt.Sprint(row.Elements), seconds(row.MeshSeconds), seconds(row.SolveSeconds), seconds(row.FieldsSeconds),
				seconds(row.TotalSeconds), fmt.Sprintf("%.0f", row.AllocatedBytesPerElement), fmt.Sprintf("%.0f", row.PeakBytesPerElement),
				passFail(row.PeakPass))
			for _, w := range row.FemWarnings {
				warned = append(warned, fmt.Sprintf("  %s model, %d elements (fem condition estimate %.2g): %s", row.Model, row.Elements, row.FemCondition, w))
			}
		}
	})
	if len(warned) > 0 {
		b.WriteString("fem's warnings on these solutions:\n" + strings.Join(warned, "\n") + "\n")
	}
}

func (r *Report) kernelTable(b *strings.Builder) {
	if r.Rows[0].BandCopySeconds == 0 {
		return
	}
	b.WriteString("\nKernel on the identical assembled system: band.LDL vs lapack64.Pbtrf+Pbtrs vs one copy of the band array\n")
	header := []string{"model", "elements", "unknowns", "K", "system", "ours f+s", "cond est", "Pbtrf+Pbtrs", "ratio",
		fmt.Sprintf("≤ %.1f", targetGonumRatio), "solve/Pbtrf", "band copy", "×copy", fmt.Sprintf("≤ %d", targetBandCopyRatio),
		"scaled cond", "ours diff", "fem diff", "tolerance", "agree"}
	var failures []string
	table(b, header, func(add func(...string)) {
		for _, row := range r.Rows {
			ag := row.Agreement
			agree := verdict(ag.Tolerance, ag.Agree)
			if ag.Tolerance >= 1 {
				agree = "n/a"
			}
			cells := []string{row.Model, fmt.Sprint(row.Elements), fmt.Sprint(row.Unknowns), fmt.Sprint(row.HalfBandwidth),
				row.KernelSystem, seconds(row.OursSeconds), seconds(row.ConditionSeconds), seconds(row.GonumBandSeconds),
				number("%.2f", row.OursToGonumRatio), verdict(row.OursToGonumRatio, row.OursToGonumPass),
				number("%.2f", row.FemSolveToGonumRatio),
				seconds(row.BandCopySeconds), number("%.1f", row.OursToBandCopyRatio), copyVerdict(row),
				number("%.1e", ag.Condition), number("%.1e", ag.Difference), number("%.1e", ag.FemDifference), number("%.1e", ag.Tolerance), agree}
			add(cells...)
			for _, f := range row.KernelFailures {
				failures = append(failures, fmt.Sprintf("  %s model, %d elements: %s", row.Model, row.Elements, f))
			}
		}
	})
	fmt.Fprintf(b, "×copy: ours over one copy of the band; \"cache\" where the band fits in a core's %s cache (%s),\n"+
		"  which the copy then reads at cache speed: no memory floor, and no part of the target\n", mebibytes(r.CoreCacheBytes), r.CoreCacheSource)
	b.WriteString("solve/Pbtrf: fem.SolveOnMesh (both problems, hierarchical) over Pbtrf+Pbtrs of this system alone; no target\n")
	b.WriteString("agree: ours and fem's answer each within the tolerance 8(K+1)·cond·ε of Pbtrs's, in the diagonal scaling; n/a when that tolerance is ≥ 1\n")
	b.WriteString("system: model, the model's own assembled system; stand-in, the same with its diagonal doubled (same size and band,\n" +
		"  well conditioned), timed where a factorization refused the model's system; fem's answer is not compared there\n")
	if len(failures) > 0 {
		b.WriteString("factorizations that refused the model's system:\n" + strings.Join(failures, "\n") + "\n")
	}
}

// number formats v, or "-" when it was not measured (zero).
func number(format string, v float64) string {
	if v == 0 {
		return "-"
	}
	return fmt.Sprintf(format, v)
}

// table writes aligned columns under header; fill adds the rows.
func table(b *strings.Builder, header []string, fill func(add func(...string))) {
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
	line := func(cells ...string) { fmt.Fprintln(tw, strings.Join(cells, "\t")+"\t") }
	line(header...)
	fill(line)
	tw.Flush()
}

// seconds prints a time in s, ms or µs with three significant digits.
func seconds(s float64) string {
	switch {
	case s == 0:
		return "-"
	case s >= 1:
		return fmt.Sprintf("%.3g s", s)
	case s >= 1e-3:
		return fmt.Sprintf("%.3g ms", s*1e3)
	}
	return fmt.Sprintf("%.3g µs", s*1e6)
}

// verdict is passFail for a measured value, "-" when it was not measured.
func verdict(measured float64, ok bool) string {
	if measured == 0 {
		return "-"
	}
	return passFail(ok)
}

// copyVerdict is the ×copy target's cell: "cache" where the row is no part
// of it.
func copyVerdict(row Row) string {
	if row.BandInCoreCache && row.OursToBandCopyRatio > 0 {
		return "cache"
	}
	return verdict(row.OursToBandCopyRatio, row.OursToBandCopyPass)
}

func passFail(ok bool) string {
	if ok {
		return "PASS"
	}
	return "FAIL"
}

func limitText(t Target) string {
	if t.Unit == "s" {
		return "< " + seconds(t.Limit)
	}
	return fmt.Sprintf("≤ %g", t.Limit)
}

func measuredText(t Target) string {
	switch t.Unit {
	case "s":
		return seconds(t.Measured)
	case "B":
		return fmt.Sprintf("%.0f B", t.Measured)
	}
	return fmt.Sprintf("%.2f", t.Measured)
}
