package app

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"fyne.io/fyne/v2/widget"

	"stave/canvas"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/material"
	"stave/fem/units"
)

// checkRow is one line of the checks list.
type checkRow struct {
	status     string // short word in front: "FAIL", "caution", "ok", "within limit", "note"
	name       string // what was checked, one line
	message    string // the full explanation
	importance widget.Importance
	span       [2]float64 // place on the member to highlight, m; {0, 0} for none
	at         float64    // the point the check names, m, when marked
	marked     bool       // draw a marker at at
	failing    bool       // makes the drawing mark results as unreliable
}

// checkRows lists what the user should look at for analysis a: why it
// failed, solver warnings, materials far from typical values, then the
// results of package check, the worst first.
func checkRows(a *analysis) []checkRow {
	var rows []checkRow
	if a.err != nil {
		var mech *fem.MechanismError
		if errors.As(a.err, &mech) {
			rows = append(rows, checkRow{status: "FAIL", name: "free motion (" + mech.Motion + ")", message: mech.Message, importance: widget.DangerImportance, failing: true})
		} else {
			rows = append(rows, checkRow{status: "FAIL", name: "no results", message: a.err.Error(), importance: widget.DangerImportance, failing: true})
		}
	}
	seen := map[string]bool{}
	for i, s := range a.model.Segments {
		for _, msg := range material.FarFromTypical(s.Material) {
			if !seen[msg] {
				seen[msg] = true
				rows = append(rows, checkRow{status: "caution", name: fmt.Sprintf("material of segment %d", i+1), message: msg,
					importance: widget.WarningImportance, span: [2]float64{s.Start, s.End}})
			}
		}
	}
	if a.solution == nil {
		return rows
	}
	if !a.complete {
		rows = append(rows, checkRow{status: "…", name: "exact solution and checks follow when the drawing rests",
			message:    "The finite element result is shown at once; the exact solution and the checks are worked out after it, once edits pause.",
			importance: widget.LowImportance})
	}
	for _, msg := range a.solution.Warnings {
		rows = append(rows, checkRow{status: "caution", name: "solver", message: msg, importance: widget.WarningImportance, failing: true})
	}
	if a.exact == nil && a.exactErr != nil {
		rows = append(rows, checkRow{status: "note", name: "no exact solution", message: a.exactErr.Error(), importance: widget.MediumImportance})
	}
	return append(rows, designRows(a)...)
}

// statusRows says how each check status is shown.
var statusRows = map[check.Status]checkRow{
	check.Fail: {status: "FAIL", importance: widget.DangerImportance},
	check.Warn: {status: "caution", importance: widget.WarningImportance},
	check.Info: {status: "note", importance: widget.MediumImportance},
	check.Pass: {status: "ok", importance: widget.SuccessImportance},
}

// designRows turns the results of package check into rows, the worst first.
func designRows(a *analysis) []checkRow {
	results := append([]check.Result(nil), a.checks...)
	sort.SliceStable(results, func(i, j int) bool { return results[i].Status > results[j].Status })
	rows := make([]checkRow, len(results))
	for i, r := range results {
		row := statusRows[r.Status]
		row.name, row.message = r.Name, r.Message
		// A member too weak for its limits is a finding; an answer that fails
		// its own verification is not to be trusted.
		row.failing = r.Status == check.Fail && r.Kind == check.Verification
		if r.Status == check.Pass && r.Kind == check.Design {
			row.status = "within limit" // a finding about the member, never an approval
		}
		// Design checks always name their worst place (x = 0 at a fixed end included).
		row.at, row.marked = r.X, r.Kind == check.Design && r.Status >= check.Warn
		row.span = r.Span
		if row.span == [2]float64{} && r.X != 0 {
			// A point: mark a short stretch around it so it shows.
			half := 0.01 * a.model.Length()
			row.span = [2]float64{math.Max(0, r.X-half), math.Min(a.model.Length(), r.X+half)}
		}
		rows[i] = row
	}
	return rows
}

// marks are the drawing's markers for the rows that name a point and need a look.
func marks(rows []checkRow) []canvas.Mark {
	var out []canvas.Mark
	for i, r := range rows {
		if r.marked {
			out = append(out, canvas.Mark{X: r.at, Index: i, Severe: r.importance == widget.DangerImportance})
		}
	}
	return out
}

// unreliable reports whether any row should mark the results as doubtful.
func unreliable(rows []checkRow) bool {
	for _, r := range rows {
		if r.failing {
			return true
		}
	}
	return false
}

// resultSummary is the one-paragraph state of the newest analysis.
func resultSummary(a *analysis, u units.System) string {
	switch {
	case a == nil:
		return "solving…"
	case a.solution == nil:
		return "no results: " + a.problem()
	}
	s := a.solution
	e := s.Equilibrium
	res := math.Max(math.Abs(e.Residual[0]), math.Abs(e.Residual[1]))
	return fmt.Sprintf("%d elements, %d nodes · out of balance %s, %s · condition ≈ %.2g",
		len(s.Mesh.Elements), len(s.Mesh.X), u.Format(units.Force, res), u.Format(units.Moment, math.Abs(e.Residual[2])), s.Condition)
}

// handbookText shows the handbook case the model matches, with each
// handbook value beside Stave's finite element and exact values; "" when
// the model is no handbook case. The pass/caution verdicts are in the
// "Handbook:" rows of the checks list.
func handbookText(a *analysis, u units.System) string {
	if a == nil || a.handbook == nil || a.solution == nil {
		return ""
	}
	c := a.handbook
	var b strings.Builder
	fmt.Fprintf(&b, "Handbook cross-check: %s\n%s  (%s)", c.Name, c.Formula, c.Source)
	for _, q := range c.Quantities {
		fe, ok := q.Read(a.solution, a.solution.Reactions)
		if !ok {
			continue
		}
		fmt.Fprintf(&b, "\n• %s: handbook %s · Stave FE %s", q.Name, u.Format(q.Kind, q.Value), u.Format(q.Kind, fe))
		if a.exact != nil {
			if ex, ok := q.Read(a.exact, a.exact.Reactions()); ok {
				fmt.Fprintf(&b, " · exact %s", u.Format(q.Kind, ex))
			}
		}
	}
	return b.String()
}
