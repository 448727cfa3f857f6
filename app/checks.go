package app

import (
	"fyne.io/fyne/v2/widget"

	"stave/fem/analysis"
)

// importance is how the window shows a finding of severity s: the one place
// where severities become widget importances.
func importance(s analysis.Severity) widget.Importance {
	switch s {
	case analysis.Fail:
		return widget.DangerImportance
	case analysis.Caution:
		return widget.WarningImportance
	case analysis.OK:
		return widget.SuccessImportance
	case analysis.Pending:
		return widget.LowImportance
	}
	return widget.MediumImportance
}
