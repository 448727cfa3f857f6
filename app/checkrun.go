package app

import "stave/fem/units"

// checkOptions are the limits the design checks use.
type checkOptions struct {
	deflectionLimit float64 // n in span/n
	safetyFactor    float64
}

func (w *Window) checkOptions() checkOptions {
	return checkOptions{deflectionLimit: w.project.View.DeflectionLimit, safetyFactor: w.project.View.SafetyFactor}
}

// designChecks are the checks of package fem/check; that package has not
// landed yet, so there are none.
func designChecks(a *analysis, o checkOptions, u units.System) []checkRow { return nil }
