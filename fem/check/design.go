package check

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// stressChecks compares, per segment, the largest combined stress with the
// allowable stress over the safety factor.
func stressChecks(p *Probe, o Options) []Result {
	var out []Result
	h := p.headline()
	amplified := firstOrder(p, h, o)
	for i, seg := range p.model.Segments {
		r := Result{Name: fmt.Sprintf("Stress, segment %d", i+1), Code: CodeStress, Unit: "Pa", Span: [2]float64{seg.Start, seg.End}}
		where := h.stress[i].x
		r.X, r.Value = where, math.Abs(h.stress[i].value)
		fe := peak{math.Abs(p.fe.stress[i].value), p.fe.stress[i].x}
		p.beside(&r, fe)
		stress := o.Units.Format(units.Stress, r.Value)
		at := o.Units.Format(units.Position, where)
		allowable := seg.Material.Allowable
		if !(allowable > 0) {
			r.Status = Info
			r.Message = fmt.Sprintf("The largest combined stress is %s at x = %s, from %s. %sNo allowable stress is given for this segment's material, so it is not checked: enter one to get a utilisation.",
				stress, at, p.fromWhat(), p.feBeside(o, units.Stress, r.Value, fe))
			out = append(out, r)
			continue
		}
		r.Limit = allowable / o.SafetyFactor
		utilisation := r.Value / r.Limit
		r.Status = Pass
		switch {
		case utilisation > 1:
			r.Status = Fail
		case math.IsNaN(utilisation):
			// 0 over a limit of 0: nothing acts where nothing is allowed.
			// The quotient has no value, so the check cannot pass: it asks
			// to be looked at, below a failure (as the batch's governing
			// check ranks it), never "within limit".
			r.Status = Warn
		}
		figures := LimitFigures(o.Units, units.Stress, r.Value, r.Limit)
		f := func(v float64) string { return o.Units.FormatFigures(units.Stress, v, figures) }
		r.Message = fmt.Sprintf("Utilisation %s: the largest combined stress (axial plus bending, worst fibre) is %s at x = %s, from %s; the limit is the allowable %s divided by the safety factor %.3g = %s. %s",
			UtilisationText(utilisation), f(r.Value), at, p.fromWhat(), f(allowable), o.SafetyFactor, f(r.Limit),
			p.feBeside(o, units.Stress, r.Value, fe))
		if r.Limit == 0 {
			r.Message += "The limit is 0: the allowable stress is too small for the safety factor, their quotient rounds to 0; enter the allowable stress and the safety factor meant. "
		}
		if math.IsNaN(utilisation) {
			r.Message += "Nothing acts here and nothing is allowed, so the utilisation, 0 over 0, cannot be worked out: the check can say the stress is neither within its limit nor beyond it. "
		}
		if r.Status == Fail {
			r.Message += "Above 1 the member is overstressed: a larger section, a stronger material, or less load is needed. "
		}
		if o.SafetyFactor < 1 {
			// Most often a resistance factor φ, which multiplies a strength,
			// typed where this check divides.
			if r.Status == Pass {
				r.Status = Warn
			}
			r.Message += fmt.Sprintf("A safety factor below 1 raises the limit above the allowable stress entered, which leaves less than no margin: if %.3g is a resistance factor φ that multiplies the strength, enter 1/φ = %s instead. ",
				o.SafetyFactor, units.FormatG("%.3g", 1/o.SafetyFactor))
		}
		if o.SafetyFactor == 1 {
			r.Message += "With a safety factor of 1 there is no margin in this check: the value entered must already be an allowable (design) stress, not a yield or characteristic strength. "
		}
		r.Message += "The stress is compared by magnitude, tension and compression alike: materials weak in tension, such as concrete, need their own check. "
		r.Message += amplified[i]
		r.Message += "This is elastic stress only: local buckling, lateral-torsional buckling, shear, connections and fatigue are not checked."
		out = append(out, r)
	}
	return out
}

// firstOrder writes, per segment, the sentence that says its stresses
// leave out the amplification of its bending by compression, when a
// column it lies in is compressed ("" otherwise): not of a member solved
// for axial force alone, which has no bending to amplify. Segments and
// columns both run along the member, so one pass over each finds them.
func firstOrder(p *Probe, h *peaks, o Options) []string {
	out := make([]string, len(p.model.Segments))
	if len(p.columns) == 0 || p.solution.AxialOnly {
		return out
	}
	roundOff, next := AxialRoundOff(p.model), 0
	for i, seg := range p.model.Segments {
		for next < len(p.columns) && p.columns[next].b <= seg.Start {
			next++
		}
		compression := 0.0
		for k := next; k < len(p.columns) && p.columns[k].a < seg.End; k++ {
			compression = max(compression, h.compression[k].value)
		}
		if compression > roundOff {
			out[i] = fmt.Sprintf("The part of the member this segment lies in carries up to %s of compression, and these stresses are first-order, worked out on the straight member: compression amplifies the bending moments, by about 1/(1 − N/Pcr) with Pcr the critical load of the buckling check (Timoshenko & Gere, Theory of Elastic Stability, ch. 1, beam-columns; from memory), which is not included. ",
				o.Units.Format(units.Force, compression))
		}
	}
	return out
}

// DeflectionLimit is a span/n limit in common use.
type DeflectionLimit struct {
	Use   string
	Ratio float64 // n in span/n
}

// DeflectionLimits lists typical deflection limits. They are common
// practice; similar values appear for example in the International Building
// Code, Table 1604.3 (from memory). The governing code and the client's
// brief set the real limits.
func DeflectionLimits() []DeflectionLimit {
	return []DeflectionLimit{
		{"floor members, live load", 360},
		{"floor members, total load", 240},
		{"roof members supporting a plaster ceiling, live load", 360},
		{"roof members, other ceilings", 240},
		{"roof members, no ceiling", 180},
		{"cantilevers (length, not twice the length)", 180},
	}
}

// stretch is a part of the member between supports (or an overhang).
type stretch struct {
	a, b      float64
	support   [2]bool // whether each end sits on a transverse support
	spring    [2]bool // whether that support holds it across by a spring alone
	overhangs bool    // one end is free
	ground    bool    // a foundation holds some of it across
}

// stretches splits [0, L] at the supports that hold the member across:
// rigidly, and by a spring too when springs is true. Buckling takes the
// rigid ones alone (a spring is no pin for a column); deflection takes
// both, as pattern loading takes its spans (fem.Model.Spans).
func stretches(m *fem.Model, springs bool) []stretch {
	var xs []float64
	elastic := map[float64]bool{}
	for _, s := range m.Supports {
		switch {
		case s.Kind.Restrains(fem.Transverse):
			xs = append(xs, s.X)
		case springs && s.Elastic(fem.Transverse):
			xs = append(xs, s.X)
			elastic[s.X] = true
		}
	}
	slices.Sort(xs)
	xs = slices.Compact(xs)
	L := m.Length()
	if len(xs) == 0 {
		return nil
	}
	var out []stretch
	tol := 1e-9 * L
	add := func(a, b float64, support [2]bool) {
		st := stretch{a: a, b: b, support: support, overhangs: !support[0] || !support[1]}
		st.spring = [2]bool{support[0] && elastic[a], support[1] && elastic[b]}
		st.ground = slices.ContainsFunc(m.Foundations, func(f fem.Foundation) bool {
			return f.Modulus > 0 && f.Start < b-tol && f.End > a+tol
		})
		out = append(out, st)
	}
	if xs[0] > tol {
		add(0, xs[0], [2]bool{false, true})
	}
	for i := 1; i < len(xs); i++ {
		add(xs[i-1], xs[i], [2]bool{true, true})
	}
	if last := xs[len(xs)-1]; last < L-tol {
		add(last, L, [2]bool{true, false})
	}
	return out
}

// deflectionChecks measures, per stretch, the deflection relative to the
// supports (so settlements do not count) against span/n.
func deflectionChecks(p *Probe, o Options) []Result {
	if len(p.parts) == 0 {
		msg := "No support holds the member across, rigidly or by a spring, so there is no span to measure deflection against; deflection is not checked."
		if len(p.model.Foundations) > 0 {
			msg += " A member a foundation alone carries settles with the ground: check its settlement, and the differences of settlement along it, against the limits of the foundation design."
		}
		return []Result{{Name: "Deflection", Code: CodeDeflection, Status: Info, Message: msg}}
	}
	var out []Result
	h := p.headline()
	for k, st := range p.parts {
		r := Result{Code: CodeDeflection, Unit: "m", Span: [2]float64{st.a, st.b}, Value: h.deflection[k].value, X: h.deflection[k].x}
		p.beside(&r, p.fe.deflection[k])
		length := st.b - st.a
		n := o.SpanRatio
		kind := "span"
		if st.overhangs {
			n = o.CantileverRatio
			kind = "cantilever"
		}
		r.Name = fmt.Sprintf("Deflection, %s %s to %s", kind, o.Units.Format(units.Position, st.a), o.Units.Format(units.Position, st.b))
		if st.ground {
			r.Name += ", on a foundation"
		}
		r.Limit, r.SpanRatio = length/n, n
		r.Status = Pass
		if r.Value > r.Limit {
			r.Status = Fail
		}
		choice := "is a user choice"
		if st.overhangs {
			// The file and the window set the span ratio only.
			choice = fmt.Sprintf("applies to every cantilever and overhang, whatever the limit set for spans (span/%g)", o.SpanRatio)
		}
		measured, fixed := deflectionDatum(p.model, st)
		figures := LimitFigures(o.Units, units.Deflection, r.Value, r.Limit)
		r.Message = fmt.Sprintf("The largest deflection in this %s is %s at x = %s, %s, from %s. The limit %s/%g = %s %s (common practice: span/360 for floors under live load, /240 under total load, length/180 for cantilevers). This deflection comes from every load in the model, self-weight included: compare it with a total-load limit, or model the live load alone for a live-load limit.",
			kind, o.Units.FormatFigures(units.Deflection, r.Value, figures), o.Units.Format(units.Position, r.X), measured, p.fromWhat(),
			kind, n, o.Units.FormatFigures(units.Deflection, r.Limit, figures), choice)
		if st.overhangs {
			r.Message += " For a cantilever or an overhang the limit uses its own length (length/180 is the common-practice span/360 with the span taken as twice the length)"
			if fixed {
				r.Message += "."
			} else {
				r.Message += ", and the deflection includes the tilt of the beam over the support."
			}
		} else {
			r.Message += " The span is the distance between its supports, rigid or springs."
		}
		if st.ground {
			r.Message += fmt.Sprintf(" This %s lies on an elastic foundation, which carries it across as well: it is checked as its supports alone make it, and its deflection includes the settlement of the ground under it. Check the settlement, and its differences along the member, against the limits of the foundation design too.", kind)
		}
		if s := p.feBeside(o, units.Deflection, r.Value, p.fe.deflection[k]); s != "" {
			r.Message += " " + strings.TrimSpace(s)
		}
		if r.Status == Fail {
			r.Message += " Too much deflection cracks finishes and makes floors feel bouncy: a deeper section or a shorter span helps most."
		}
		out = append(out, r)
	}
	return out
}

// deflectionDatum says what the deflection of part st is measured from
// (the line newChord draws), and whether st is a cantilever or overhang
// whose support holds rotation rigidly: a span from the line through its
// two supports; such a cantilever from the member's tangent at that
// support, which the loads do not turn; any other overhang from the line
// through its support at the slope settlement alone gives it, so that the
// member's turn over the support counts. Where a spring holds the part
// across, the line is taken where the spring stands unloaded.
func deflectionDatum(m *fem.Model, st stretch) (measured string, fixed bool) {
	spring := ""
	switch {
	case st.overhangs && st.spring != [2]bool{}:
		spring = ", taken where the spring support stands unloaded, so the spring's give counts as deflection"
	case st.spring != [2]bool{}:
		spring = " where each spring support stands unloaded, so a spring's give under the loads counts as deflection"
	}
	if !st.overhangs {
		return "measured from the line through the supports (settlement not counted)" + spring, false
	}
	held := st.a
	if !st.support[0] {
		held = st.b
	}
	if holdsRotation(m, held) {
		if spring != "" { // held rigidly in rotation, elastically across
			return "measured from the member's tangent at its support, which holds it from turning (settlement not counted)" + spring, true
		}
		return "measured from the member's tangent at its fixed support (settlement not counted)", true
	}
	if spring == "" {
		spring = ", so the member's turn over the support counts"
	}
	return "measured from the line through its support at the slope settlement alone gives it (settlement not counted)" + spring, false
}

// chordLine is the deflection of the supports of a part in one solution:
// the straight line through both supports of a span (through a spring
// support where it stands unloaded, so its give counts); for an overhang, the
// line through its support at the tilt that settlements alone give it (see
// settlementTilts). A walk reads it twice per element, so it holds what at
// needs and nothing to choose between.
type chordLine struct {
	a, span float64 // the part's start and length, m
	w0, dw  float64 // the deflection at a, and its change over the span, m
}

// newChord is the chord of part st in solution src; tilt is the part's
// settlementTilts, so that settlement counts no more on an overhang than in
// a span.
func newChord(src fem.Field, st stretch, tilt float64) chordLine {
	wa, wb := src.At(st.a, fem.Right).Deflection, src.At(st.b, fem.Left).Deflection
	// A spring's give is the member's response to the loads: the chord
	// passes through the spring where it stands unloaded.
	if st.spring[0] {
		wa = 0
	}
	if st.spring[1] {
		wb = 0
	}
	c := chordLine{a: st.a, span: st.b - st.a, w0: wa, dw: wb - wa}
	switch {
	case !st.support[0]:
		c.w0, c.dw = wb-tilt*c.span, tilt*c.span
	case !st.support[1]:
		c.dw = tilt * c.span
	}
	return c
}

// settlementTilts is, per part, the slope (rad) at which settlements
// alone tilt an overhang as a rigid body, and 0 for a span: on a support
// that holds rotation, the rotation it imposes (a settlement elsewhere
// bends the span beside it but cannot turn the overhang), else the slope
// of the chord of the span beside it. It is read off the finite element
// solution fe, whose held motions are the prescribed values exactly (a
// load case's own settlements among them), so without settlements every
// tilt is exactly 0.
func settlementTilts(fe fem.Field, m *fem.Model, parts []stretch) []float64 {
	tilts := make([]float64, len(parts))
	for k, st := range parts {
		if !st.overhangs {
			continue
		}
		at, side, beside := st.a, fem.Right, k-1 // the support, the overhang's side of it, the part past it
		if !st.support[0] {
			at, side, beside = st.b, fem.Left, k+1
		}
		if holdsRotation(m, at) {
			tilts[k] = fe.At(at, side).Rotation
		} else if beside >= 0 && beside < len(parts) && !parts[beside].overhangs {
			c := newChord(fe, parts[beside], 0)
			tilts[k] = c.dw / c.span
		}
	}
	return tilts
}

// holdsRotation says whether a support at x holds rotation rigidly.
func holdsRotation(m *fem.Model, x float64) bool {
	tol := 1e-9 * m.Length()
	return slices.ContainsFunc(m.Supports, func(s fem.Support) bool {
		return math.Abs(s.X-x) <= tol && s.Kind.Restrains(fem.Rotation)
	})
}

// at is the chord's deflection at x.
func (c *chordLine) at(x float64) float64 {
	return c.w0 + c.dw*(x-c.a)/c.span
}

// DeflectionLine is the line from which the deflection check of the part
// of m from a to b measures the deflection of src: its values at a and b.
// An overhang's tilt is read off the finite element solution fe, as
// NewProbe reads it. False when m has no such part.
func DeflectionLine(m *fem.Model, fe, src fem.Field, a, b float64) ([2]float64, bool) {
	parts := stretches(m, true)
	tilts := settlementTilts(fe, m, parts)
	for k, st := range parts {
		if st.a == a && st.b == b {
			c := newChord(src, st, tilts[k])
			return [2]float64{c.at(a), c.at(b)}, true
		}
	}
	return [2]float64{}, false
}
