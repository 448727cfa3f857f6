package check

import (
	"fmt"
	"math"

	"stave/fem"
	"stave/fem/units"
)

// equilibriumTolerance is the residual, relative to the loads, that the
// equilibrium check allows: the solver's reactions balance to round-off,
// many orders below this, so a failure means a real defect.
const equilibriumTolerance = 1e-6

// equilibriumChecks compares applied loads with reactions in each direction.
func equilibriumChecks(m *fem.Model, s *fem.Solution, o Options) []Result {
	eq := s.Equilibrium
	forceScale := 0.0
	for i := range 2 {
		forceScale = math.Max(forceScale, math.Max(math.Abs(eq.Applied[i]), math.Abs(eq.Reactions[i])))
	}
	directions := []struct {
		name, what string
		kind       units.Kind
		scale      float64
	}{
		{"axial forces", "forces along the member", units.Force, forceScale},
		{"transverse forces", "forces across the member", units.Force, forceScale},
		{"moments about x = 0", "moments about the left end", units.Moment,
			math.Max(math.Max(math.Abs(eq.Applied[2]), math.Abs(eq.Reactions[2])), forceScale*m.Length())},
	}
	var out []Result
	for i, d := range directions {
		r := Result{Name: "Equilibrium, " + d.name, Kind: Verification, Value: eq.Applied[i], Limit: -eq.Reactions[i], Span: [2]float64{0, m.Length()}}
		residual := eq.Applied[i] + eq.Reactions[i]
		r.Status = Pass
		if math.Abs(residual) > equilibriumTolerance*d.scale {
			r.Status = Fail
		}
		r.Message = fmt.Sprintf("The applied %s add up to %s and the reactions to %s; in equilibrium they cancel (difference %s). ",
			d.what, o.Units.Format(d.kind, eq.Applied[i]), o.Units.Format(d.kind, eq.Reactions[i]), o.Units.Format(d.kind, residual))
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
	r := Result{Name: "Error against the exact solution", Kind: Verification, Limit: o.ErrorLimit, Span: [2]float64{0, p.model.Length()}}
	if p.exact == nil {
		r.Status = Info
		r.Message = "No exact solution is available for this model, so the finite element error is not measured: compare a finer mesh instead."
		return r
	}
	norms := p.norms
	r.Value, r.X = norms.MaxStressRelative, p.stressErrorAt
	r.Status = Pass
	if r.Value > r.Limit {
		r.Status = Warn
	}
	r.Message = fmt.Sprintf("The finite element stresses differ from the exact ones by at most %.3g %% of the largest stress (worst near x = %s); the error in energy is %.3g %%. ",
		100*r.Value, o.Units.Format(units.Position, r.X), 100*norms.RelativeEnergy)
	if r.Status == Warn {
		r.Message += fmt.Sprintf("That is more than %.3g %%: use more elements, especially where the error is largest.", 100*r.Limit)
	} else {
		r.Message += "The mesh is fine enough for these loads."
	}
	return r
}

// handbookCheck compares the finite element solution with a handbook case
// when the model is one.
func handbookCheck(m *fem.Model, s *fem.Solution, o Options) []Result {
	c, ok := Handbook(m)
	if !ok {
		return nil
	}
	var out []Result
	for _, q := range c.Quantities {
		r := Result{Name: "Handbook: " + q.Name, Kind: Verification, X: q.X, Limit: q.Value, Span: [2]float64{0, m.Length()}}
		v, found := q.Read(s, s.Reactions)
		if !found {
			continue
		}
		r.Value = v
		difference := math.Abs(v-q.Value) / math.Abs(q.Value)
		r.Status = Pass
		if difference > o.HandbookTolerance {
			r.Status = Warn
		}
		r.Message = fmt.Sprintf("%s: Stave gives %s, the handbook %s (%s; %s), a difference of %.3g %%.",
			c.Name, o.Units.Format(q.Kind, v), o.Units.Format(q.Kind, q.Value), c.Formula, c.Source, 100*difference)
		if r.Status == Warn {
			r.Message += " Between nodes the finite element values converge as the mesh is refined: add elements and look again."
		}
		out = append(out, r)
	}
	return out
}
