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
	// largest utilisation; nil when no design check has a limit.
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
	Name        string  `json:"check"`
	Utilisation float64 `json:"utilisation"`
}

// Deflection is a deflection check as span/n.
type Deflection struct {
	Check
	// Deflection is the largest |w| from the line through the supports, m.
	Deflection float64 `json:"deflection_m"`
	// Span is the length of the span or overhang checked, m.
	Span float64 `json:"span_m"`
	// Ratio is n in span/n, Span/Deflection.
	Ratio Ratio `json:"span_ratio"`
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

// Ratio is n in span/n: +Inf when the span does not deflect, null in JSON.
type Ratio float64

// MarshalJSON writes an infinite ratio as null.
func (r Ratio) MarshalJSON() ([]byte, error) {
	if math.IsInf(float64(r), 0) {
		return []byte("null"), nil
	}
	return json.Marshal(float64(r))
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
		if r.Kind != check.Design || !(r.Limit > 0) {
			continue // verifications, and design checks without a limit (no allowable stress given)
		}
		u := Check{r.Name, r.Value / r.Limit}
		if math.IsNaN(u.Utilisation) || math.IsInf(u.Utilisation, 0) {
			continue
		}
		if m.Governing == nil || u.Utilisation > m.Governing.Utilisation {
			m.Governing = &u
		}
		if strings.HasPrefix(r.Name, deflectionCheck) && (m.Deflection == nil || u.Utilisation > m.Deflection.Utilisation) {
			span := r.Span[1] - r.Span[0]
			m.Deflection = &Deflection{Check: u, Deflection: r.Value, Span: span,
				Ratio: Ratio(span / r.Value), LimitRatio: r.SpanRatio}
		}
	}
	return m
}
