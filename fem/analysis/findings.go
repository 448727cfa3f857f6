package analysis

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"stave/fem"
	"stave/fem/check"
	"stave/fem/material"
	"stave/fem/moving"
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

var severityNames = [...]string{"ok", "pending", "note", "caution", "fail"}

// Name is the severity in lower case, one word, as programs read it.
func (s Severity) Name() string {
	if s < 0 || int(s) >= len(severityNames) {
		return "unknown"
	}
	return severityNames[s]
}

// Flagged reports whether a sheet lists findings of this severity.
func (s Severity) Flagged() bool { return s == Fail || s == Caution }

// Finding is one line of what the user should look at.
type Finding struct {
	Code     Code // what kind of finding, for programs (Codes)
	Severity Severity
	// Status is the word in front: the severity's, or "within limit" for a
	// design check that passes (a finding about the member, never an approval).
	Status  string
	Name    string // what was checked, one line
	Message string // the full explanation
	// Check is the code of the check of package check the finding reports
	// (check.CodeStress...); "" for findings of the analysis itself.
	Check string
	// Span is the place on the member to highlight, m; {0, 0} for none.
	Span [2]float64
	// At is the point the finding names, m, when Located; marked on the
	// drawing when Marked.
	At      float64
	Located bool
	Marked  bool
	// Doubtful makes the drawing mark every result as unreliable.
	Doubtful bool
}

// finding is a finding of code c, with the severity and reliability the
// table of codes gives it.
func finding(c Code, name, message string) Finding {
	i := c.info()
	return Finding{Code: c, Severity: i.Severity, Status: i.Severity.String(), Name: name, Message: message, Doubtful: i.Unreliable}
}

// segmentFinding is a caution of code material about segment s, spanning it.
func segmentFinding(s fem.Segment, name, message string) Finding {
	f := finding(CodeMaterial, name, message)
	f.Span = [2]float64{s.Start, s.End}
	return f
}

// Findings lists what the user should look at: why the analysis failed,
// materials far from typical values, solver warnings, a missing exact
// solution, finite element extremes far from the exact ones, then the
// results of package check, the worst first.
func (a *Analysis) Findings() []Finding {
	var out []Finding
	if a.Err != nil {
		var mech *fem.MechanismError
		f := finding(CodeNoResults, "no results", a.Err.Error())
		if errors.As(a.Err, &mech) {
			f = finding(CodeMechanism, "free motion ("+mech.Motion+")", mech.Message)
		}
		out = append(out, f)
	}
	seen := map[string]bool{}
	for i, s := range a.Model.Segments {
		for _, msg := range material.FarFromTypicalIn(s.Material, a.Units) {
			if !seen[msg] {
				seen[msg] = true
				out = append(out, segmentFinding(s, fmt.Sprintf("material of segment %d", i+1), msg))
			}
		}
	}
	out = append(out, thermalFindings(&a.Model, a.Units)...)
	out = append(out, selfWeightFindings(&a.Model)...)
	out = append(out, shearAreaFindings(&a.Model, a.Units)...)
	out = append(out, depthFindings(&a.Model, a.Units)...)
	out = append(out, foundationFindings(&a.Model, a.Units)...)
	if a.Solution == nil {
		return out
	}
	if !a.Complete {
		out = append(out, finding(CodePending, "exact solution and checks follow when the drawing rests",
			"The finite element result is shown at once; the exact solution and the checks are worked out after it, once edits pause."))
	}
	for _, msg := range a.Solution.Warnings {
		out = append(out, finding(CodeCondition, "solver", msg))
	}
	if a.Cases != nil {
		for k, err := range a.Cases.Unsolved {
			if err != nil {
				name := a.Cases.combinationName(&a.Model, k)
				out = append(out, finding(CodeNoResults, "no results of "+name,
					fmt.Sprintf("The %s could not be solved: %v. It has no results, and the checks of the envelope leave it out.", name, err)))
			}
		}
	}
	for _, cb := range a.Model.Combinations {
		for _, tf := range cb.Trains {
			train := a.trainLabel(tf.Train)
			out = append(out, finding(CodeTrainNotChecked, fmt.Sprintf("combination %q with moving load %s", cb.Name, train),
				fmt.Sprintf("Combination %q takes moving load %s with a factor of %s. The design checks and the drawn envelope take the combination's cases alone; the combination with the train at its worst positions is in the trains' results (stave solve, stave influence --envelope, and Study > Moving loads… in the window, its envelope of the combination). Check those values against your limits.", cb.Name, train, units.FormatNumber(tf.Factor))))
		}
	}
	if msg := a.Exact.Warning(); msg != "" {
		out = append(out, finding(CodeCondition, "exact solution", msg))
	}
	if se := (*fem.SingularError)(nil); a.Exact == nil && errors.As(a.ExactErr, &se) {
		out = append(out, finding(CodeCondition, "exact solution",
			"The exact solution's equations are singular or nearly so: the model has supports, hinges or loads almost at one point, or stiffnesses far apart, and its finite element answer sits on the same near-singular equations. Its values may be meaningless (a shear force in a very short element above all): move the items apart or together, or bring the stiffnesses closer."))
	}
	if a.Exact == nil && a.ExactErr != nil {
		out = append(out, finding(CodeNoExact, "no exact solution: values are the finite element ones",
			fmt.Sprintf("There is no exact solution of this model (%v), so every value reported is the finite element one, labelled FE, and its error is not measured: a peak between nodes may be missed. Refine the mesh and compare to be sure.", a.ExactErr)))
	}
	if f, ok := a.largeDisplacement(); ok {
		out = append(out, f)
	}
	if f, ok := a.coarseMesh(); ok {
		out = append(out, f)
	}
	return append(out, a.checkFindings()...)
}

// thermalFindings are the cautions that a temperature load acts on a
// segment with no coefficient of thermal expansion, where it does nothing:
// most likely α was left out, since every structural material expands.
// The temperature difference is quoted in u.
func thermalFindings(m *fem.Model, u units.System) []Finding {
	change := m.TemperatureChange != 0
	for _, c := range m.Cases {
		change = change || c.TemperatureChange != 0
	}
	var out []Finding
	for i, s := range m.Segments {
		if s.Material.ThermalExpansion != 0 {
			continue
		}
		var loads []string
		if change {
			loads = append(loads, "the temperature change")
		}
		if s.TemperatureDifference != 0 {
			loads = append(loads, fmt.Sprintf("its temperature difference of %s through the depth", u.Format(units.TemperatureChange, s.TemperatureDifference)))
		}
		if len(loads) == 0 {
			continue
		}
		out = append(out, segmentFinding(s, fmt.Sprintf("thermal expansion of segment %d", i+1),
			fmt.Sprintf("Segment %d has no coefficient of thermal expansion α, so %s does nothing to it: enter α (typical values: %s), or remove the temperature load.", i+1, strings.Join(loads, " and "), typicalExpansion(u))))
	}
	return out
}

// typicalExpansion lists in u the coefficients of thermal expansion of
// typical steel, concrete and aluminium, those the material cautions
// compare with (material.TypicalIn): "steel 1.200e-05 1/K, ...".
func typicalExpansion(u units.System) string {
	var said []string
	for _, kind := range []string{"steel", "concrete", "aluminium"} {
		for _, e := range material.TypicalIn(u) {
			if e.Kind == kind {
				said = append(said, kind+" "+u.Format(units.ThermalExpansion, e.Material.ThermalExpansion))
				break
			}
		}
	}
	return strings.Join(said, ", ")
}

// selfWeightFindings is the caution that m gives gravity for self-weight
// while it has load cases and none of them takes the self-weight: it then
// acts in no case, which leaving the weight out on purpose does not need
// (gravity 0 says that).
func selfWeightFindings(m *fem.Model) []Finding {
	if m.Gravity == [2]float64{} || len(m.Cases) == 0 || slices.ContainsFunc(m.Cases, func(c fem.LoadCase) bool { return c.SelfWeight }) {
		return nil
	}
	return []Finding{finding(CodeSelfWeightUnused, "self-weight in no load case",
		"The model gives gravity for self-weight, but no load case takes it, so the member's own weight acts in none of the cases, combinations or checks. Mark the cases it acts in (self-weight), or set gravity to 0 if the weight is to be left out.")}
}

// shearAreaFindings are the cautions that a segment deforming in shear has
// a shear area above its cross-section area: As = κ·A with κ below 1 for
// every section (5/6 for a solid rectangle, about the web's share of A for
// an I-section; Timoshenko's shear coefficient, from memory), so a larger
// one is most likely in the wrong units, and it hides the shear deflection;
// and that a segment gives a shear area or κ but does not deform in shear,
// so they are not used. The areas are quoted in u.
func shearAreaFindings(m *fem.Model, u units.System) []Finding {
	var out []Finding
	for i, s := range m.Segments {
		as := s.Section.ShearArea
		what := "shear area " + u.Format(units.Area, as)
		if as == 0 {
			as = s.Section.ShearCoefficient * s.Section.Area
			what = fmt.Sprintf("shear coefficient κ = %s", units.FormatNumber(s.Section.ShearCoefficient))
		}
		var msg string
		switch {
		case !s.ShearDeformation && as > 0:
			msg = fmt.Sprintf("Segment %d gives a %s but does not deform in shear, so it is not used: turn on shear deformation for the segment to add the shear deflection, or leave the shear properties out.", i+1, what)
		case s.ShearDeformation && as > s.Section.Area:
			msg = fmt.Sprintf("Segment %d deforms in shear with a %s, more than its cross-section area of %s: the area carrying the shear is a part of the section (κ = 5/6 for a solid rectangle, about the web's share for an I-section), so check its units; too large a one leaves out shear deflection.", i+1, what, u.Format(units.Area, s.Section.Area))
		default:
			continue
		}
		out = append(out, segmentFinding(s, fmt.Sprintf("shear area of segment %d", i+1), msg))
	}
	return out
}

// depthFindings are the cautions that a segment's depth h, given, does not
// fit its extreme fibre distance c: c runs from the neutral axis to the
// farther face, so c ≤ h ≤ 2c (the extreme fibre of S = I/c; Gere &
// Goodno, Mechanics of Materials, ch. 5, from memory). Below c the extreme
// fibre lies outside the section; beyond 2c the other face is farther
// than c, and M·c/I understates the stress there. Either may be a typing
// error in h or in c, so the model is solved as entered and the caution
// says which to check. The lengths are quoted in u.
func depthFindings(m *fem.Model, u units.System) []Finding {
	dim := func(v float64) string { return u.Format(units.Dimension, v) }
	var out []Finding
	const slack = 1e-9 // for values entered to a few figures
	for i, s := range m.Segments {
		h, c := s.Section.Depth, s.Section.FibreDistance
		var msg string
		switch {
		case !(h > 0 && c > 0):
			continue // no depth given
		case h < c*(1-slack):
			msg = fmt.Sprintf("Segment %d's depth h = %s is less than its extreme fibre distance c = %s, which must lie within the section: check both (c runs from the neutral axis to the farther face).", i+1, dim(h), dim(c))
		case h > 2*c*(1+slack):
			msg = fmt.Sprintf("Segment %d's depth h = %s is more than twice its extreme fibre distance c = %s, so its other face lies %s from the neutral axis, farther than c: the bending stress M·c/I understates the stress there. Enter as c the distance to the farther face, or check h (a temperature difference bends the segment over h).", i+1, dim(h), dim(c), dim(h-c))
		default:
			continue
		}
		out = append(out, segmentFinding(s, fmt.Sprintf("depth of segment %d", i+1), msg))
	}
	return out
}

// stiffBed is how many times the characteristic length 1/β of the member
// on a foundation may go into the depth of its section before the
// foundation is taken as far too stiff (foundationFindings): a margin of
// ten on beam theory's need for lengths long against the depth (common
// practice, not a code's value).
const stiffBed = 10

// foundationFindings are the cautions that a foundation is so stiff that
// the member on it would bend over lengths far below the depth of its
// section: the characteristic length 1/β, β = (k/4EI)^¼ (Hetényi, Beams on
// Elastic Foundation, 1946, from memory), over which the fields under a
// load wave and decay, is less than a stiffBed-th of the depth. Beam
// theory, and Winkler's bed under it, take a member that bends over
// lengths long against its depth, so the model means nothing there, and
// no mesh can follow it; such a modulus most often comes of wrong units
// (N/m³ of a subgrade entered as N/m² per metre of member, say), so the
// model is solved as entered and the caution says what to check. The
// depth is the section's (twice its fibre distance when no depth is
// given), or that of the rectangle of the same A and I, √(12·I/A), when
// neither is; one caution per foundation, for the segment under it that
// it bends shortest. Lengths and the modulus are quoted in u.
func foundationFindings(m *fem.Model, u units.System) []Finding {
	var out []Finding
	for i, f := range m.Foundations {
		if !(f.Modulus > 0) {
			continue
		}
		worst, seg, beta, depth := 0.0, -1, 0.0, 0.0
		for j, s := range m.Segments {
			ei := s.Material.Elastic * s.Section.SecondMoment
			if s.End <= f.Start || s.Start >= f.End || !(ei > 0) {
				continue
			}
			b := math.Sqrt(math.Sqrt(f.Modulus / (4 * ei)))
			d := s.Section.Depth
			if !(d > 0) {
				d = 2 * s.Section.FibreDistance
			}
			if !(d > 0) {
				d = math.Sqrt(12 * s.Section.SecondMoment / s.Section.Area)
			}
			if r := b * d; r > worst {
				worst, seg, beta, depth = r, j, b, d
			}
		}
		if !(worst > stiffBed) {
			continue
		}
		dim := func(v float64) string { return u.Format(units.Dimension, v) }
		c := finding(CodeMaterial, fmt.Sprintf("modulus of foundation %d", i+1), fmt.Sprintf(
			"Foundation %d's modulus of %s makes segment %d on it bend over a characteristic length 1/β = (4·E·I/k)^¼ of %s, a small part of its depth of %s: "+
				"beam theory, and the elastic foundation under it, take a member that bends over lengths long against its depth, and mean nothing here. "+
				"At this stiffness the bed holds the member as if it were rigid: its deflection, rotation and moment come out next to nothing, and its shear force jumps within 1/β of each load, which no mesh can follow. "+
				"Check the modulus and its units: it is the force per length of member per length of deflection, a modulus of subgrade reaction times the width in contact. A bed that is to hold the member rigidly is better given as supports.",
			i+1, u.Format(units.FoundationModulus, f.Modulus), seg+1, dim(1/beta), dim(depth)))
		c.Span = [2]float64{f.Start, f.End}
		out = append(out, c)
	}
	return out
}

// Small-displacement (linear) theory writes equilibrium on the undeformed
// member and takes sin θ ≈ tan θ ≈ θ and the curvature as w″. Beyond a
// displacement of a tenth of the member's length, or a rotation of 0.1 rad
// (about 6°), that no longer holds: common practice, not a code's value.
// A member that moves so much under working loads is far beyond any
// deflection limit, so such values most often come of wrong units or
// magnitudes in the model.
const (
	largeDisplacementShare = 0.1 // of the member's length
	largeRotation          = 0.1 // rad
)

// largeDisplacement is the caution that the largest displacement or
// rotation is beyond what small-displacement theory covers
// (largeDisplacementShare, largeRotation): of the solution shown and, with
// load cases, of each combination, the displacement (axial or across) and
// the rotation furthest beyond their thresholds, each named where it is
// beyond; false when all are within, or before Finish.
func (a *Analysis) largeDisplacement() (Finding, bool) {
	if a.summary == nil {
		return Finding{}, false
	}
	type solution struct {
		sum   *fem.Summary
		words string // which solution, as solutionWords gives it
	}
	sols := []solution{{a.summary, a.Cases.solutionWords(&a.Model)}}
	if a.Cases != nil {
		for k, sum := range a.Cases.Summaries {
			if sum != nil {
				sols = append(sols, solution{sum, " in " + a.Cases.combinationName(&a.Model, k)})
			}
		}
	}
	type beyond struct {
		q            fem.Quantity
		v, at, ratio float64  // the value, where, and its share of the threshold
		side         fem.Side // of at, where the field jumps there (a rotation at a hinge)
		words        string
	}
	length := a.Model.Length()
	var move, turn beyond // the worst displacement and rotation
	for _, s := range sols {
		for _, e := range s.sum.Extremes {
			worst, limit := &move, largeDisplacementShare*length
			switch e.Quantity {
			case fem.QAxialDisplacement, fem.QDeflection:
			case fem.QRotation:
				worst, limit = &turn, largeRotation
			default:
				continue
			}
			for _, p := range [2]struct {
				v, at float64
				side  fem.Side
			}{{e.Max, e.XMax, e.SideMax}, {e.Min, e.XMin, e.SideMin}} {
				if r := math.Abs(p.v) / limit; r > 1 && r > worst.ratio {
					*worst = beyond{e.Quantity, p.v, p.at, r, p.side, s.words}
				}
			}
		}
	}
	u := a.Units
	var parts []string
	for _, b := range []beyond{move, turn} {
		switch {
		case b.ratio == 0:
		case b.q == fem.QRotation:
			parts = append(parts, fmt.Sprintf("the largest rotation is %s %s%s, more than %g rad (about 6°)",
				u.Format(units.Rotation, b.v), b.side.At("x = "+u.Format(units.Position, b.at)), b.words, largeRotation))
		default:
			parts = append(parts, fmt.Sprintf("the largest %s is %s %s%s, more than a tenth of the member's length (%s)",
				b.q.Info().Name, u.Format(units.Position, b.v), b.side.At("x = "+u.Format(units.Position, b.at)), b.words, u.Format(units.Position, largeDisplacementShare*length)))
		}
	}
	if len(parts) == 0 {
		return Finding{}, false
	}
	at := move.at
	if move.ratio == 0 {
		at = turn.at
	}
	text := strings.Join(parts, "; ")
	msg := strings.ToUpper(text[:1]) + text[1:] + ". The results rest on small-displacement (linear) theory, which holds only while the member moves little beside its length and turns little (equilibrium on the undeformed member, sin θ ≈ θ): it does not hold here, and the values are those of linear theory all the same. Such a movement most often comes of wrong units or magnitudes: check the model's units and its values (E, A, I, loads, spring stiffnesses); a member that really moves this much needs a large-displacement analysis, which Stave does not make."
	f := finding(CodeLargeDisplacement, "displacement beyond small-displacement theory", msg)
	f.At, f.Located = at, true
	return f, true
}

// coarseMesh is the finding that the finite element extremes are further
// from the exact ones than the default mesh's accuracy, naming the worst
// field and where, and which number is which; false when they are not, or
// before Finish.
func (a *Analysis) coarseMesh() (Finding, bool) {
	if a.summary == nil || !a.summary.Exact {
		return Finding{}, false
	}
	sum, words := a.summary, a.Cases.solutionWords(&a.Model)
	worst, _ := sum.Worst()
	feEnvelope := a.Cases.finiteElementEnvelope()
	if feEnvelope {
		// The envelope's values are every combination's finite element
		// ones: the worst combination's mesh error is the envelope's.
		for k, cs := range a.Cases.Summaries {
			if cs == nil { // not solved: the no_results finding says so
				continue
			}
			if w, ok := cs.Worst(); ok && w.Accuracy > worst.Accuracy {
				sum, worst, words = cs, w, a.Cases.combinationWords(&a.Model, k)
			}
		}
	}
	if worst.Accuracy <= fem.MeshAccuracy {
		return Finding{}, false
	}
	u := a.Units
	q := worst.Quantity.Info()
	exact, at, fe, feAt, side, feSide := worst.Max, worst.XMax, worst.FEMax, worst.FEXMax, worst.SideMax, worst.FESideMax
	which := "largest"
	if math.Abs(worst.FEMin-worst.Min) > math.Abs(worst.FEMax-worst.Max) {
		exact, at, fe, feAt, side, feSide, which = worst.Min, worst.XMin, worst.FEMin, worst.FEXMin, worst.SideMin, worst.FESideMin, "smallest"
	}
	// Where each is read, on its side of a jump (fem.Side.At).
	place, fePlace := side.At("x = "+u.Format(units.Position, at)), feSide.At("x = "+u.Format(units.Position, feAt))
	var others []string
	for _, e := range sum.Extremes {
		if e.Quantity != worst.Quantity && e.Accuracy > fem.MeshAccuracy {
			others = append(others, fmt.Sprintf("%s %s", e.Quantity, units.FormatG("%.3g %%", 100*e.Accuracy)))
		}
	}
	msg := fmt.Sprintf("FE and exact differ by %s of the largest %s %s%s: the %s %s is %s %s exactly, %s %s in the finite element (FE) solution on this mesh. ",
		units.FormatG("%.3g %%", 100*worst.Accuracy), q.Name, place, words, which, q.Name,
		u.Format(q.Unit, exact), place, u.Format(q.Unit, fe), fePlace)
	if len(others) > 0 {
		msg += "Also beyond 0.5 %: " + strings.Join(others, ", ") + ". "
	}
	if feEnvelope {
		msg += "The envelope's values are those of the finite element solutions of the combinations (a member on an elastic foundation, whose exact solution is no polynomial), so they may be off by as much; each combination shown alone has the exact values. "
	} else {
		msg += "The headline values are the exact ones; the FE values beside them and the FE diagrams are this mesh's approximation. "
	}
	if sum.Mesh.Automatic {
		msg += "Stave chose this mesh (" + sum.Mesh.Note + ") and it falls short of its 0.5 %."
	} else {
		msg += "The mesh is set in the model: leave it to Stave (0 elements) for FE extremes within 0.5 % of the exact ones."
	}
	f := finding(CodeCoarseMesh, fmt.Sprintf("FE and exact differ by %s (%s)", units.FormatG("%.3g %%", 100*worst.Accuracy), q.Name), msg)
	f.At, f.Located = at, true
	return f, true
}

// checkCode is the code of each check status, by kind.
var checkCode = map[check.Kind][4]Code{
	check.Design:       {check.Pass: CodeDesignWithinLimit, check.Info: CodeDesignNotChecked, check.Warn: CodeDesignCaution, check.Fail: CodeDesignFail},
	check.Verification: {check.Pass: CodeVerified, check.Info: CodeNotVerified, check.Warn: CodeFEError, check.Fail: CodeEquilibrium},
}

// verificationCodes are the codes of the verification checks that fail
// or warn, by check.
var verificationCodes = map[string]Code{
	check.CodeEquilibrium: CodeEquilibrium,
	check.CodeExactError:  CodeFEError,
	check.CodeHandbook:    CodeHandbook,
}

// codeOf is the code of the finding that reports r.
func codeOf(r check.Result) Code {
	if r.Kind == check.Verification && r.Status >= check.Warn {
		if c, ok := verificationCodes[r.Code]; ok {
			return c
		}
	}
	return checkCode[r.Kind][r.Status]
}

// checkFindings turns the results of package check into findings, the
// worst first. The check of the error against the exact solution says
// nothing when there is none: the no_exact finding says why.
func (a *Analysis) checkFindings() []Finding {
	var results []check.Result
	for _, r := range a.Checks {
		if r.Code == check.CodeExactError && r.Status == check.Info {
			continue
		}
		results = append(results, r)
	}
	sort.SliceStable(results, func(i, j int) bool { return results[i].Status > results[j].Status })
	out := make([]Finding, len(results))
	for i, r := range results {
		f := finding(codeOf(r), r.Name, r.Message)
		f.Check = r.Code
		if r.Status == check.Pass && r.Kind == check.Design {
			f.Status = "within limit"
		}
		// Design checks always name their worst place (x = 0 at a fixed end included).
		f.At, f.Located, f.Marked = r.X, r.Kind == check.Design || r.Code == check.CodeExactError || r.Code == check.CodeHandbook,
			r.Kind == check.Design && r.Status >= check.Warn
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

// Failed reports whether a command that wrote its results should say a
// check failed (exit status 3): a finding failed, or marks the results as
// unreliable.
func Failed(fs []Finding) bool {
	for _, f := range fs {
		if f.Severity == Fail || f.Doubtful {
			return true
		}
	}
	return false
}

// Warnings are the findings every output lists: failures, cautions and
// notes, the worst first (a stable order otherwise).
func Warnings(fs []Finding) []Finding {
	var out []Finding
	for _, f := range fs {
		if f.Severity >= Note {
			out = append(out, f)
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].Severity > out[j].Severity })
	return out
}

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

// MeshText is one line on the mesh and the balance of the solution (its
// largest residual relative to the loads, as the text output and the
// sheet give it), then who chose the mesh and the accuracy it reaches;
// the problem when there is no solution.
func (a *Analysis) MeshText() string {
	if a.Solution == nil {
		return "no results: " + a.Problem()
	}
	s := a.Solution
	text := fmt.Sprintf("%s, %s · residual %s of the loads · condition ≈ %s",
		units.Count(len(s.Mesh.Elements), "element"), units.Count(len(s.Mesh.X), "node"), s.FEBalance(a.Exact).RelativeWords(), units.FormatG("%.2g", s.Condition))
	if a.summary != nil {
		text += "\n" + MeshChoice(*a.summary)
	}
	return text
}

// MeshChoice says who chose the mesh and the accuracy its finite element
// extremes reach against the exact ones, in one or two sentences.
func MeshChoice(sum fem.Summary) string {
	who := "set in the model"
	if sum.Mesh.Automatic {
		who = "chosen by Stave (" + sum.Mesh.Note + ")"
	}
	worst, ok := sum.Worst()
	if !ok {
		return fmt.Sprintf("The mesh is %s; with no exact solution its accuracy is not measured.", who)
	}
	if RoundOff(worst.Accuracy) {
		return fmt.Sprintf("The mesh is %s; its finite element extremes equal the exact ones (to round-off).", who)
	}
	verdict := "within"
	if worst.Accuracy > fem.MeshAccuracy {
		verdict = "beyond"
	}
	return fmt.Sprintf("The mesh is %s; its finite element extremes are up to %s of a field's largest magnitude from the exact ones (worst: %s), %s the default mesh's %.3g %%.",
		who, units.FormatG("%.3g %%", 100*worst.Accuracy), worst.Quantity, verdict, 100*fem.MeshAccuracy)
}

// roundOffAccuracy is the share of a field's largest magnitude up to which
// a finite element extreme's distance from the exact one is round-off, the
// size package fem treats as zero against a field.
const roundOffAccuracy = 1e-9

// RoundOff reports whether accuracy (fem.Extreme.Accuracy, a share of a
// field's largest magnitude) is nil or round-off: the finite element
// extremes then equal the exact ones, and no field is the worst.
func RoundOff(accuracy float64) bool { return accuracy <= roundOffAccuracy }

// headlineQuantities are the fields HeadlineText lists.
var headlineQuantities = []fem.Quantity{fem.QDeflection, fem.QAxialForce, fem.QShearForce, fem.QBendingMoment, fem.QCombinedStress}

// HeadlineText lists, in units u, what an engineer reads first: each
// reaction component a support holds, the largest and smallest deflection,
// axial and shear force, bending moment and combined stress with their
// places (fields that are zero left out), and the actions at the supports
// inside the member, each the exact value with the finite element one
// beside; the finite element values alone, labelled FE, without an exact
// solution. "" before Finish.
func (a *Analysis) HeadlineText(u units.System) string {
	if a.summary == nil {
		return ""
	}
	sum := a.summary
	pos := func(x float64) string { return u.Format(units.Position, x) }
	// at is where an extreme is, on its side of a jump (fem.Side.At).
	at := func(x float64, side fem.Side) string { return side.At(pos(x)) }
	value := func(k units.Kind, v, fe float64) string {
		if !sum.Exact {
			return u.Format(k, fe) + " FE"
		}
		return fmt.Sprintf("%s (FE %s)", u.Format(k, v), u.Format(k, fe))
	}
	var b strings.Builder
	if sum.Exact {
		b.WriteString("Exact values, finite element (FE) beside:")
	} else {
		b.WriteString("No exact solution: finite element (FE) values:")
	}
	for _, r := range sum.Reactions[:min(len(sum.Reactions), headlineRows)] {
		var parts []string
		for d, c := range []struct {
			name  string
			kind  units.Kind
			v, fe float64
		}{{"axial", units.Force, r.Axial, r.FE.Axial}, {"transverse", units.Force, r.Transverse, r.FE.Transverse}, {"moment", units.Moment, r.Moment, r.FE.Moment}} {
			if r.Holds[d] {
				parts = append(parts, c.name+" "+value(c.kind, c.v, c.fe))
			}
		}
		fmt.Fprintf(&b, "\n• reaction %d (%s, %s): %s", r.Support, r.Kind, pos(r.X), strings.Join(parts, ", "))
	}
	more(&b, len(sum.Reactions), "reactions")
	for _, e := range sum.Extremes {
		if !slices.Contains(headlineQuantities, e.Quantity) || e.Max == 0 && e.Min == 0 && e.FEMax == 0 && e.FEMin == 0 {
			continue
		}
		k := e.Quantity.Info().Unit
		if !sum.Exact {
			fmt.Fprintf(&b, "\n• %s from %s %s to %s %s, FE", e.Quantity, u.Format(k, e.FEMin), at(e.FEXMin, e.FESideMin), u.Format(k, e.FEMax), at(e.FEXMax, e.FESideMax))
			continue
		}
		fmt.Fprintf(&b, "\n• %s from %s %s to %s %s (FE %s %s, %s %s)", e.Quantity,
			u.Format(k, e.Min), at(e.XMin, e.SideMin), u.Format(k, e.Max), at(e.XMax, e.SideMax),
			u.Format(k, e.FEMin), at(e.FEXMin, e.FESideMin), u.Format(k, e.FEMax), at(e.FEXMax, e.FESideMax))
	}
	for _, s := range sum.Supports[:min(len(sum.Supports), headlineRows)] {
		fmt.Fprintf(&b, "\n• at support %d (%s): V %s left, %s right; M %s", s.Support, pos(s.X),
			value(units.Force, s.Shear[0], s.FEShear[0]), value(units.Force, s.Shear[1], s.FEShear[1]), value(units.Moment, s.Moment[0], s.FEMoment[0]))
		if math.Abs(s.Moment[1]-s.Moment[0]) > 1e-9*math.Max(math.Abs(s.Moment[0]), math.Abs(s.Moment[1])) {
			fmt.Fprintf(&b, " left, %s right", value(units.Moment, s.Moment[1], s.FEMoment[1]))
		}
	}
	more(&b, len(sum.Supports), "supports inside the member")
	return b.String()
}

// headlineRows is the most reactions, and the most supports inside the
// member, HeadlineText lists: a member on 500 supports made 109 kB of text,
// which the window's wrapped label took 2 s to lay out (40,000 supports
// froze it for minutes).
const headlineRows = 10

// more says how many of n items of what HeadlineText left out.
func more(b *strings.Builder, n int, what string) {
	if n > headlineRows {
		fmt.Fprintf(b, "\n• and %d more %s (`stave solve` lists every one)", n-headlineRows, what)
	}
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

// trainLabel names the project's train i as moving.Train.Label does: by
// the request's label, or by its number when the request gave none.
func (a *Analysis) trainLabel(i int) string {
	if i >= 0 && i < len(a.TrainLabels) {
		return a.TrainLabels[i]
	}
	return (&moving.Train{}).Label(i)
}
