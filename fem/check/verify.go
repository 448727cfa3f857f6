package check

import (
	"fmt"
	"math"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// equilibriumTolerance is the residual, relative to the loads, that the
// equilibrium check allows: the solver's reactions balance to round-off,
// many orders below this, so a failure means a real defect.
const equilibriumTolerance = 1e-6

// roundOffAllowance is how many times its round-off bound (Condition·ε) a
// finite element balance may miss by before it fails, up to
// roundOffCeiling of the loads: the ground's reaction under a foundation is
// read from the displacements, which carry that round-off; a balance worse
// than the ceiling fails however ill-conditioned the equations.
const (
	roundOffAllowance = 10
	roundOffCeiling   = 1e-4
)

// epsilon is the spacing of float64 numbers at 1 (IEEE 754 binary64).
const epsilon = 0x1p-52

// equilibriumChecks compares applied loads with reactions in each
// direction, the reactions of the finite element solution s and, when e is
// not nil, those of the exact solution, which the reports lead with.
func equilibriumChecks(m *fem.Model, s *fem.Solution, e *fem.Exact, o Options) []Result {
	balances := []fem.Equilibrium{s.Equilibrium}
	if e != nil {
		balances = append(balances, e.Balance(s.Equilibrium.Applied))
	}
	forceScale, momentScale := s.EquilibriumScales(e)
	directions := []struct {
		name, what string
		kind       units.Kind
		unit       string
	}{
		{"axial forces", "forces along the member", units.Force, "N"},
		{"transverse forces", "forces across the member", units.Force, "N"},
		{"moments about x = 0", "moments about the left end", units.Moment, "N·m"},
	}
	var out []Result
	for i, d := range directions {
		eq := balances[len(balances)-1] // the headline reactions
		// 0 - r rather than -r: no reaction reads +0, not -0.
		r := Result{Name: "Equilibrium, " + d.name, Code: CodeEquilibrium, Kind: Verification, Value: eq.Applied[i], Limit: 0 - eq.Reactions[i],
			Unit: d.unit, Exact: e != nil, Span: [2]float64{0, m.Length()}}
		r.Status = Pass
		var parts []string
		for k, b := range balances {
			scale := forceScale
			if i == 2 {
				scale = momentScale
			}
			residual := b.Applied[i] + b.Reactions[i]
			tolerance := equilibriumTolerance
			if k == 0 {
				tolerance = max(tolerance, min(roundOffAllowance*s.Condition*epsilon, roundOffCeiling))
			}
			if math.Abs(residual) > tolerance*scale {
				r.Status = Fail
			}
			whose := "finite element"
			if k == 1 {
				whose = "exact"
			}
			parts = append(parts, fmt.Sprintf("the %s reactions to %s (difference %s)", whose,
				o.Units.Format(d.kind, b.Reactions[i]), o.Units.Format(d.kind, residual)))
		}
		r.Message = fmt.Sprintf("The applied %s add up to %s and %s; in equilibrium they cancel. ",
			d.what, o.Units.Format(d.kind, eq.Applied[i]), strings.Join(parts, ", "))
		if r.Status == Fail {
			r.Message += "They do not: the results cannot be trusted. Look for warnings about conditioning, and report the model."
		} else {
			r.Message += "They do: the supports carry exactly the loads applied."
		}
		out = append(out, r)
	}
	return out
}

// exactCheck measures the finite element error against the exact solution.
func exactCheck(p *Probe, o Options) Result {
	r := Result{Name: "Error against the exact solution", Code: CodeExactError, Kind: Verification, Limit: o.ErrorLimit, Span: [2]float64{0, p.model.Length()}}
	if p.exact == nil {
		r.Status = Info
		r.Message = "No exact solution is available for this model, so the finite element error is not measured: compare a finer mesh instead."
		return r
	}
	norms := p.norms
	r.Value, r.X = norms.MaxStressRelative, p.stressErrorAt
	if math.IsNaN(r.Value) || math.IsNaN(norms.RelativeEnergy) {
		r.Status = Warn
		r.Message = "The finite element error could not be measured: comparing the two solutions overflowed the range of floating-point numbers, so nothing here says how far the finite element values can be trusted. Look for material or section values, loads or springs of extreme size."
		return r
	}
	r.Status = Pass
	if r.Value > r.Limit {
		r.Status = Warn
	}
	r.Message = fmt.Sprintf("The finite element stresses differ from the exact ones by at most %s of the largest stress (worst near x = %s); the %s is %s. ",
		units.FormatG("%.3g %%", 100*r.Value), o.Units.Format(units.Position, r.X), fem.EnergyErrorName, units.FormatG("%.3g %%", 100*norms.RelativeEnergy))
	if r.Status == Warn {
		r.Message += fmt.Sprintf("That is more than %.3g %%: the headline values are the exact ones, but the finite element diagrams and values are off by that much; use more elements, or leave the mesh to Stave.", 100*r.Limit)
	} else {
		r.Message += "The mesh is fine enough for these loads."
	}
	return r
}

// handbookCheck compares the solution the reports lead with (the exact
// solution e, or s without it) with a handbook case when the model is one,
// the finite element value beside an exact one.
func handbookCheck(m *fem.Model, s *fem.Solution, e *fem.Exact, o Options) []Result {
	c, ok := Handbook(m)
	if !ok {
		return nil
	}
	var out []Result
	for _, q := range c.Quantities {
		r := Result{Name: "Handbook: " + q.Name, Code: CodeHandbook, Kind: Verification, X: q.X, Limit: q.Value,
			Unit: siUnit(q.Kind), Span: [2]float64{0, m.Length()}}
		fe, found := q.Read(s, s.Reactions)
		if !found {
			continue
		}
		r.Value = fe
		who := "Stave's finite element solution"
		if e != nil {
			if v, ok := q.Read(e, e.Reactions()); ok {
				r.Value, r.Exact, r.FE, r.FEX, r.HasFE = v, true, fe, q.X, true
				who = "Stave's exact solution"
			}
		}
		difference := math.Abs(r.Value-q.Value) / math.Abs(q.Value)
		r.Status = Pass
		if difference > o.HandbookTolerance {
			r.Status = Warn
		}
		r.Message = fmt.Sprintf("%s: %s gives %s, the handbook %s (%s; %s), a difference of %s.",
			c.Name, who, o.Units.Format(q.Kind, r.Value), o.Units.Format(q.Kind, q.Value), c.Formula, c.Source, units.FormatG("%.3g %%", 100*difference))
		if r.Exact {
			r.Message += fmt.Sprintf(" The finite element solution on this mesh gives %s.", o.Units.Format(q.Kind, fe))
		}
		switch {
		case r.Status == Warn && r.Exact:
			r.Message += " The exact solution should match the handbook: the model differs from the handbook case, or Stave is wrong here; report the model."
		case r.Status == Warn:
			r.Message += " Between nodes the finite element values converge as the mesh is refined: add elements and look again."
		}
		out = append(out, r)
	}
	return out
}

// siUnit is the SI symbol of values of kind k, as fem keeps them.
func siUnit(k units.Kind) string {
	switch k {
	case units.Position, units.Dimension, units.Deflection:
		return "m"
	case units.Rotation:
		return "rad"
	case units.Force:
		return "N"
	case units.Moment:
		return "N·m"
	case units.Stress, units.Modulus:
		return "Pa"
	}
	return units.SI.Unit(k).Symbol
}
