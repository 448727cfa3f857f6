package app

import (
	"errors"
	"fmt"
	"math"

	"fyne.io/fyne/v2/widget"

	"stave/fem"
	"stave/fem/material"
	"stave/fem/units"
)

// checkRow is one line of the checks list.
type checkRow struct {
	status     string // short word in front: "FAIL", "caution", "ok", "note"
	message    string
	importance widget.Importance
	span       [2]float64 // place on the member to highlight, m; {0, 0} for none
	failing    bool       // makes the drawing mark results as unreliable
}

// checkRows lists what the user should look at for analysis a: why it
// failed, solver warnings, materials far from typical values, and how far
// the finite element results are from the exact ones.
func checkRows(a *analysis, o checkOptions, u units.System) []checkRow {
	var rows []checkRow
	if a.err != nil {
		var mech *fem.MechanismError
		if errors.As(a.err, &mech) {
			rows = append(rows, checkRow{status: "FREE MOTION", message: mech.Message, importance: widget.DangerImportance, failing: true})
		} else {
			rows = append(rows, checkRow{status: "no results", message: a.err.Error(), importance: widget.DangerImportance, failing: true})
		}
	}
	seen := map[string]bool{}
	for i, s := range a.model.Segments {
		for _, msg := range material.FarFromTypical(s.Material) {
			if !seen[msg] {
				seen[msg] = true
				rows = append(rows, checkRow{status: "caution", message: fmt.Sprintf("segment %d: %s", i+1, msg),
					importance: widget.WarningImportance, span: [2]float64{s.Start, s.End}})
			}
		}
	}
	if a.solution == nil {
		return rows
	}
	for _, msg := range a.solution.Warnings {
		rows = append(rows, checkRow{status: "caution", message: msg, importance: widget.WarningImportance, failing: true})
	}
	rows = append(rows, designChecks(a, o, u)...)
	if a.exact != nil {
		n := a.norms
		rows = append(rows, checkRow{status: "note", importance: widget.MediumImportance,
			message: fmt.Sprintf("finite element vs exact: deflection differs by at most %s, combined stress by %s (%.2g%%)",
				u.Format(units.Deflection, n.MaxDeflection), u.Format(units.Stress, n.MaxStress), 100*n.MaxStressRelative)})
	} else if a.exactErr != nil {
		rows = append(rows, checkRow{status: "note", message: "no exact solution to compare with: " + a.exactErr.Error()})
	}
	return rows
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
	return fmt.Sprintf("%d elements, %d nodes; equilibrium residual %s, %s; condition estimate %.2g",
		len(s.Mesh.Elements), len(s.Mesh.X), u.Format(units.Force, res), u.Format(units.Moment, math.Abs(e.Residual[2])), s.Condition)
}
