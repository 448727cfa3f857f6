package fem

import "math"

// Extreme is the largest and smallest value of one result quantity along the
// member and where each occurs.
type Extreme struct {
	Quantity Quantity `json:"quantity"` // written as its Fields name, e.g. "BendingMoment"
	Unit     string   `json:"unit"`     // SI unit of Max and Min
	Max      float64  `json:"max"`
	XMax     float64  `json:"x_max"` // m
	Min      float64  `json:"min"`
	XMin     float64  `json:"x_min"` // m
}

// MeshSummary describes the discretisation a solution was computed on.
type MeshSummary struct {
	Elements  int     `json:"elements"`
	Nodes     int     `json:"nodes"`
	BarOrder  int     `json:"bar_order"`
	Condition float64 `json:"condition_estimate"`
}

// EquilibriumSummary is Equilibrium with named components for reports.
type EquilibriumSummary struct {
	Applied   Components `json:"applied"`
	Reactions Components `json:"reactions"`
	Residual  Components `json:"residual"`
	// Relative is the largest residual component divided by the largest applied
	// or reaction component of the same kind; it should be near round-off.
	Relative float64 `json:"relative"`
}

// Components are the three resultants of a force system: forces in N and the
// moment about x = 0 in N·m.
type Components struct {
	Axial      float64 `json:"axial"`
	Transverse float64 `json:"transverse"`
	Moment     float64 `json:"moment"`
}

// ReactionSummary is one support's reaction for reports.
type ReactionSummary struct {
	Support int     `json:"support"` // 1-based, as users count
	Kind    string  `json:"kind"`
	X       float64 `json:"x"`
	Components
}

// Summary gathers what an engineer reads first from a solution.
type Summary struct {
	Reactions   []ReactionSummary  `json:"reactions"`
	Extremes    []Extreme          `json:"extremes"`
	Equilibrium EquilibriumSummary `json:"equilibrium"`
	ExactError  *ErrorNorms        `json:"exact_error"` // nil when the exact solution is not available
	Mesh        MeshSummary        `json:"mesh"`
	Warnings    []string           `json:"warnings"`
}

// summarySamples bounds the work of finding extremes on very fine meshes:
// about this many points in all, and never fewer than the element ends.
const summarySamples = 20000

// extremes walks the elements once, a few points each (only the ends on fine
// meshes), and keeps the running largest and smallest value of every
// reported quantity, so its memory does not grow with the mesh.
func extremes(s *Solution) []Extreme {
	qs := Quantities()
	out := make([]Extreme, len(qs))
	for i, q := range qs {
		out[i] = Extreme{Quantity: q, Unit: q.Info().SI, Max: math.Inf(-1), Min: math.Inf(1)}
	}
	n := len(s.Mesh.Elements)
	if n == 0 || len(s.fields) == 0 {
		for i := range out {
			out[i].Max, out[i].Min = 0, 0
		}
		return out
	}
	perElement := 1
	if summarySamples/n > 1 {
		perElement = min(summarySamples/n, 8)
	}
	for e, el := range s.Mesh.Elements {
		for j := 0; j <= perElement; j++ {
			x := el.Start + (el.End-el.Start)*float64(j)/float64(perElement)
			if j == perElement {
				x = s.Mesh.X[e+1]
			}
			f := s.InElement(e, x)
			for i, q := range qs {
				v := q.Of(&f)
				if v > out[i].Max {
					out[i].Max, out[i].XMax = v, f.X
				}
				if v < out[i].Min {
					out[i].Min, out[i].XMin = v, f.X
				}
			}
		}
	}
	// The deflection peaks inside elements, where their cubic has zero slope.
	for i, q := range qs {
		if q == QDeflection {
			out[i].XMax, out[i].Max = s.DeflectionExtremum(out[i].XMax, true)
			out[i].XMin, out[i].Min = s.DeflectionExtremum(out[i].XMin, false)
		}
	}
	return out
}

// Summarize collects reactions, extremes with positions, equilibrium, mesh
// size and, when e is not nil, the error against the exact solution.
func Summarize(s *Solution, e *Exact) Summary {
	var sum Summary
	for _, r := range s.Reactions {
		kind := ""
		if r.Support >= 0 && r.Support < len(s.Model.Supports) {
			kind = s.Model.Supports[r.Support].Kind.String()
		}
		sum.Reactions = append(sum.Reactions, ReactionSummary{
			Support: r.Support + 1, Kind: kind, X: r.X, Components: components(r.Force),
		})
	}
	sum.Extremes = extremes(s)
	eq := s.Equilibrium
	sum.Equilibrium = EquilibriumSummary{
		Applied:   components(eq.Applied),
		Reactions: components(eq.Reactions),
		Residual:  components(eq.Residual),
		Relative:  relativeResidual(eq),
	}
	if e != nil {
		norms := Compare(s, e)
		sum.ExactError = &norms
	}
	order := int(s.Model.Mesh.BarOrder)
	if order == 0 {
		order = int(LinearBar)
	}
	sum.Mesh = MeshSummary{
		Elements:  len(s.Mesh.Elements),
		Nodes:     len(s.Mesh.X),
		BarOrder:  order,
		Condition: s.Condition,
	}
	sum.Warnings = append(sum.Warnings, s.Warnings...)
	return sum
}

func components(v [3]float64) Components {
	return Components{Axial: v[0], Transverse: v[1], Moment: v[2]}
}

// relativeResidual scales each residual component by the size of the forces
// of its kind, so a residual of 1e-9 N under kilonewton loads reads as round-off.
func relativeResidual(eq Equilibrium) float64 {
	worst := 0.0
	for i := range eq.Residual {
		scale := math.Max(math.Abs(eq.Applied[i]), math.Abs(eq.Reactions[i]))
		if scale == 0 {
			continue
		}
		worst = math.Max(worst, math.Abs(eq.Residual[i])/scale)
	}
	return worst
}
