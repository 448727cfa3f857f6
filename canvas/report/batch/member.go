package batch

import (
	"encoding/json"
	"fmt"
	"math"
	"sort"
	"strings"

	"stave/canvas/report"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/fem/units"
	"stave/storage"
)

// Member is one member's line: what a checking engineer reads first.
type Member struct {
	File string `json:"file"`
	// Mark is the member mark from the file's notes; "" when it gives none.
	Mark   string `json:"member"`
	Status Status `json:"status"`
	// Problem says why a refused member has no results; "" otherwise.
	Problem string `json:"problem,omitempty"`
	// Governing is the design check (stress, deflection, buckling) of
	// largest utilisation (as governs orders them); nil when no design
	// check was made.
	Governing *Check `json:"governing"`
	// Deflection is the deflection check of largest utilisation; nil when
	// deflection was not checked.
	Deflection *Deflection `json:"deflection"`
	// Accuracy is how far the member's finite element answer is from the
	// exact one, as `stave solve` states it; nil when it was refused or
	// has no exact solution.
	Accuracy *Accuracy `json:"fe_accuracy"`
	// Warnings are the findings that failed or ask for caution, failures first.
	Warnings []Warning `json:"warnings"`
}

// Check is a design check and its utilisation, the checked value over
// its limit: 1 at the limit.
type Check struct {
	Name string `json:"check"`
	// Utilisation is +Inf where the limit is 0 (an allowable stress so small
	// that over the safety factor it is 0) or the quotient overflows (over a
	// safety factor of 1e300), NaN where it cannot be worked out (0 over a
	// limit of 0); JSON writes either as null.
	Utilisation Number `json:"utilisation"`
	// NotFinite says why Utilisation is null in JSON: "infinite" or
	// "undefined" (units.FormatG's words); "" where it is a number.
	NotFinite string `json:"utilisation_not_finite,omitempty"`
}

// checkOf is the check named name of utilisation u.
func checkOf(name string, u float64) Check {
	c := Check{Name: name, Utilisation: Number(u)}
	if math.IsInf(u, 0) || math.IsNaN(u) {
		c.NotFinite = units.FormatG("%g", u)
	}
	return c
}

// governs reports whether utilisation u governs one of v: the larger does;
// an infinite one governs every other. An undefined one (NaN: 0 over a
// limit of 0, nothing acting where nothing is allowed) governs every
// utilisation within its limit, so that it is not left out, but not one
// beyond its limit, whose failure it would hide. Of two that tie, v stays.
func governs(u, v Number) bool {
	a, b := float64(u), float64(v)
	switch {
	case math.IsNaN(a):
		return !math.IsNaN(b) && !(b > 1)
	case math.IsNaN(b):
		return a > 1
	}
	return a > b
}

// Deflection is a deflection check as span/n.
type Deflection struct {
	Check
	// Deflection is the largest |w| from the line through the supports, m.
	Deflection float64 `json:"deflection_m"`
	// Span is the length of the span or overhang checked, m.
	Span float64 `json:"span_m"`
	// Ratio is n in span/n, Span/Deflection.
	Ratio Number `json:"span_ratio"`
	// LimitRatio is n in the limit span/n (the cantilever's for an overhang).
	LimitRatio float64 `json:"limit_ratio"`
}

// Accuracy is the accuracy the member's mesh reaches: the largest
// |FE − exact| of a field's extremes as a share of that field's largest
// magnitude (fem.Extreme.Accuracy), and the field it is worst in.
type Accuracy struct {
	Ratio    float64      `json:"ratio"`
	Quantity fem.Quantity `json:"quantity"` // written as its key: "shear_force"
}

// text is the accuracy in words: "0.25 % (shear force)".
func (a *Accuracy) text() string {
	return fmt.Sprintf("%s (%s)", units.FormatG("%.3g %%", 100*a.Ratio), a.Quantity)
}

// Number is a number that may not be finite, which JSON cannot hold: a
// span ratio n in span/n, +Inf where the span does not deflect, and a
// utilisation (Check.Utilisation).
type Number float64

// MarshalJSON writes a number that is not finite as null.
func (n Number) MarshalJSON() ([]byte, error) {
	if math.IsInf(float64(n), 0) || math.IsNaN(float64(n)) {
		return []byte("null"), nil
	}
	return json.Marshal(float64(n))
}

// Warning is one finding that failed or asks for caution.
type Warning struct {
	Severity string `json:"severity"` // "FAIL" or "caution"
	Check    string `json:"check"`
	Message  string `json:"message"`
}

// deflectionCheck starts the name of every deflection check of package check.
const deflectionCheck = "Deflection, "

// Line is the line of the member in file, of project p analysed as a
// (whose second stage has run). Its findings are those `stave solve`
// reports: the analysis's, and those of the moving load trains that cannot
// be placed on the member.
func Line(file string, p *storage.Project, a *analysis.Analysis) Member {
	m := Member{File: file, Mark: p.Notes.Member}
	if a.Err != nil {
		m.Status, m.Problem = Refused, oneLine(a.Problem())
		return m
	}
	sum := a.Summary()
	if worst, ok := sum.Worst(); ok {
		m.Accuracy = &Accuracy{worst.Accuracy, worst.Quantity}
	}
	fs := report.NewSource(p, a).WithTrains().Findings
	m.Status = StatusOf(fs)
	for _, f := range fs {
		if f.Severity.Flagged() {
			m.Warnings = append(m.Warnings, Warning{f.Severity.String(), f.Name, f.Message})
		}
	}
	sort.SliceStable(m.Warnings, func(i, j int) bool {
		return m.Warnings[i].Severity == analysis.Fail.String() && m.Warnings[j].Severity != analysis.Fail.String()
	})
	for _, r := range a.Checks {
		if r.Kind != check.Design || r.Status == check.Info {
			continue // verifications, and design checks not made (no allowable stress given)
		}
		u := checkOf(r.Name, r.Value/r.Limit)
		if m.Governing == nil || governs(u.Utilisation, m.Governing.Utilisation) {
			m.Governing = &u
		}
		if strings.HasPrefix(r.Name, deflectionCheck) && (m.Deflection == nil || governs(u.Utilisation, m.Deflection.Utilisation)) {
			span := r.Span[1] - r.Span[0]
			m.Deflection = &Deflection{Check: u, Deflection: r.Value, Span: span,
				Ratio: Number(span / r.Value), LimitRatio: r.SpanRatio}
		}
	}
	return m
}
