package analysis

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/material"
	"stave/fem/units"
)

// Severity grades a finding, from nothing to see to a failure.
type Severity int

// Severities, mildest first.
const (
	OK      Severity = iota // a check met its limit or agreed
	Pending                 // not worked out yet: the second stage follows
	Note                    // for information
	Caution                 // look at it
	Fail                    // wrong, or no result at all
)

var severityWords = [...]string{"ok", "…", "note", "caution", "FAIL"}

// String is the word in front of a finding of this severity.
func (s Severity) String() string {
	if s < 0 || int(s) >= len(severityWords) {
		return "unknown"
	}
	return severityWords[s]
}

// Flagged reports whether a sheet lists findings of this severity.
func (s Severity) Flagged() bool { return s == Fail || s == Caution }

// Finding is one line of what the user should look at.
type Finding struct {
	Severity Severity
	// Status is the word in front: the severity's, or "within limit" for a
	// design check that passes (a finding about the member, never an approval).
	Status  string
	Name    string // what was checked, one line
	Message string // the full explanation
	// Span is the place on the member to highlight, m; {0, 0} for none.
	Span [2]float64
	// At is the point the finding names, m, marked on the drawing when Marked.
	At     float64
	Marked bool
	// Doubtful makes the drawing mark every result as unreliable.
	Doubtful bool
}

func finding(s Severity, name, message string) Finding {
	return Finding{Severity: s, Status: s.String(), Name: name, Message: message}
}

// Findings lists what the user should look at: why the analysis failed,
// materials far from typical values, solver warnings, a missing exact
// solution, then the results of package check, the worst first.
func (a *Analysis) Findings() []Finding {
	var out []Finding
	if a.Err != nil {
		var mech *fem.MechanismError
		f := finding(Fail, "no results", a.Err.Error())
		if errors.As(a.Err, &mech) {
			f = finding(Fail, "free motion ("+mech.Motion+")", mech.Message)
		}
		f.Doubtful = true
		out = append(out, f)
	}
	seen := map[string]bool{}
	for i, s := range a.Model.Segments {
		for _, msg := range material.FarFromTypical(s.Material) {
			if !seen[msg] {
				seen[msg] = true
				f := finding(Caution, fmt.Sprintf("material of segment %d", i+1), msg)
				f.Span = [2]float64{s.Start, s.End}
				out = append(out, f)
			}
		}
	}
	if a.Solution == nil {
		return out
	}
	if !a.Complete {
		out = append(out, finding(Pending, "exact solution and checks follow when the drawing rests",
			"The finite element result is shown at once; the exact solution and the checks are worked out after it, once edits pause."))
	}
	for _, msg := range a.Solution.Warnings {
		f := finding(Caution, "solver", msg)
		f.Doubtful = true
		out = append(out, f)
	}
	if a.Exact == nil && a.ExactErr != nil {
		out = append(out, finding(Note, "no exact solution", a.ExactErr.Error()))
	}
	return append(out, a.checkFindings()...)
}

// checkSeverity is the severity of each check status.
var checkSeverity = [...]Severity{check.Pass: OK, check.Info: Note, check.Warn: Caution, check.Fail: Fail}

// checkFindings turns the results of package check into findings, the worst first.
func (a *Analysis) checkFindings() []Finding {
	results := append([]check.Result(nil), a.Checks...)
	sort.SliceStable(results, func(i, j int) bool { return results[i].Status > results[j].Status })
	out := make([]Finding, len(results))
	for i, r := range results {
		f := finding(checkSeverity[r.Status], r.Name, r.Message)
		// A member too weak for its limits is a finding; an answer that fails
		// its own verification is not to be trusted.
		f.Doubtful = r.Status == check.Fail && r.Kind == check.Verification
		if r.Status == check.Pass && r.Kind == check.Design {
			f.Status = "within limit"
		}
		// Design checks always name their worst place (x = 0 at a fixed end included).
		f.At, f.Marked = r.X, r.Kind == check.Design && r.Status >= check.Warn
		f.Span = r.Span
		if f.Span == [2]float64{} && r.X != 0 {
			// A point: mark a short stretch around it so it shows.
			half := 0.01 * a.Model.Length()
			f.Span = [2]float64{math.Max(0, r.X-half), math.Min(a.Model.Length(), r.X+half)}
		}
		out[i] = f
	}
	return out
}

// Unreliable reports whether any finding marks the results as doubtful.
func Unreliable(fs []Finding) bool {
	for _, f := range fs {
		if f.Doubtful {
			return true
		}
	}
	return false
}

// Sentence is the finding in one line: "FAIL — name: message".
func (f Finding) Sentence() string { return f.Status + " — " + f.Name + ": " + f.Message }

// Flagged are the failed and cautioned findings, one sentence each, the
// failures first.
func Flagged(fs []Finding) []string {
	var flagged []Finding
	for _, f := range fs {
		if f.Severity.Flagged() {
			flagged = append(flagged, f)
		}
	}
	sort.SliceStable(flagged, func(i, j int) bool { return flagged[i].Severity == Fail && flagged[j].Severity != Fail })
	out := make([]string, len(flagged))
	for i, f := range flagged {
		out[i] = f.Sentence()
	}
	return out
}

// MeshText is one line on the mesh and the balance of the solution, in
// units u; the problem when there is no solution.
func (a *Analysis) MeshText(u units.System) string {
	if a.Solution == nil {
		return "no results: " + a.Problem()
	}
	s := a.Solution
	e := s.Equilibrium
	res := math.Max(math.Abs(e.Residual[0]), math.Abs(e.Residual[1]))
	return fmt.Sprintf("%d elements, %d nodes · out of balance %s, %s · condition ≈ %.2g",
		len(s.Mesh.Elements), len(s.Mesh.X), u.Format(units.Force, res), u.Format(units.Moment, math.Abs(e.Residual[2])), s.Condition)
}

// HandbookText shows the handbook case the model matches, with each
// handbook value beside the finite element and exact values, in units u;
// "" when the model is no handbook case. The verdicts are among the
// findings ("Handbook:" checks).
func (a *Analysis) HandbookText(u units.System) string {
	if a.Handbook == nil || a.Solution == nil {
		return ""
	}
	c := a.Handbook
	var b strings.Builder
	fmt.Fprintf(&b, "Handbook cross-check: %s\n%s  (%s)", c.Name, c.Formula, c.Source)
	for _, q := range c.Quantities {
		fe, ok := q.Read(a.Solution, a.Solution.Reactions)
		if !ok {
			continue
		}
		fmt.Fprintf(&b, "\n• %s: handbook %s · Stave FE %s", q.Name, u.Format(q.Kind, q.Value), u.Format(q.Kind, fe))
		if a.Exact != nil {
			if ex, ok := q.Read(a.Exact, a.Exact.Reactions()); ok {
				fmt.Fprintf(&b, " · exact %s", u.Format(q.Kind, ex))
			}
		}
	}
	return b.String()
}
