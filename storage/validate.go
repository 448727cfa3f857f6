package storage

import (
	"errors"
	"fmt"

	"stave/fem"
)

// check finds everything about p that a file must not hold. The model's
// rules come from (*fem.Model).Validate, moved to the file's paths; the view
// settings are the file's own.
func check(p *Project) []Problem {
	var problems []Problem
	add := func(path, format string, args ...any) {
		problems = append(problems, Problem{Path: path, Message: fmt.Sprintf(format, args...)})
	}
	var invalid *fem.ValidationError
	if err := p.Model.Validate(); errors.As(err, &invalid) {
		paths := append([][2][]string{loadPaths(p)}, caseLoadPaths(p)...)
		for _, q := range invalid.Problems {
			problems = append(problems, Problem{Path: modelPath(q.Place, paths), Message: q.Message})
		}
	} else if err != nil {
		add("", "%v", err)
	} else if q, ok := p.Model.TrainsMemoryProblem(len(p.Trains)); ok {
		problems = append(problems, Problem{Path: modelPath(q.Place, nil), Message: q.Message})
	}
	problems = append(problems, caseProblems(p)...)
	problems = append(problems, trainProblems(p)...)
	v := p.View
	if v.Units != SI && v.Units != US {
		add("view.units", "%q is not a display unit system; use %q or %q", cut(string(v.Units)), SI, US)
	}
	if !(v.Magnification >= 0) {
		add("view.magnification", "%g is not a magnification; enter zero (automatic) or more", v.Magnification)
	}
	if !(v.GridStep >= 0) {
		add("view.grid_step", "%g m is not a grid step; enter zero (no grid) or more", v.GridStep)
	}
	if !(v.DeflectionLimit > 0) {
		add("view.deflection_limit", "%g is not a deflection limit; enter n above zero for a limit of span/n, such as %d", v.DeflectionLimit, DefaultDeflectionLimit)
	}
	if !(v.SafetyFactor > 0) {
		add("view.safety_factor", "%g is not a safety factor; enter a value above zero, such as 1", v.SafetyFactor)
	}
	return problems
}

var motionNames = [3]string{"axial", "transverse", "rotation"}

// loadPaths gives the file path of every load: [PointLoad][i] and [DistributedLoad][i].
func loadPaths(p *Project) [2][]string {
	paths := [2][]string{make([]string, len(p.Model.PointLoads)), make([]string, len(p.Model.DistributedLoad))}
	for i, ref := range fileLoads(p) {
		paths[ref.kind][ref.index] = fmt.Sprintf("loads[%d]", i)
	}
	return paths
}

// modelPath turns the place of a fem.Problem into a path in the file;
// loads[c] are the paths of the loads of case c (0 the model's own, see
// fem.Item).
func modelPath(at fem.Place, loads [][2][]string) string {
	item := casePath(at.Item)
	if key := caseKey(at); key != "" {
		return join(item, key)
	}
	own := [2][]string{}
	if c := at.Item.Case; c >= 0 && c < len(loads) {
		own = loads[c]
	}
	switch at.Item.Kind {
	case fem.SegmentItem:
		item = fmt.Sprintf("member.segments[%d]", at.Item.Index)
	case fem.SupportItem:
		item = fmt.Sprintf("supports[%d]", at.Item.Index)
	case fem.HingeItem:
		item = fmt.Sprintf("hinges[%d]", at.Item.Index)
	case fem.FoundationItem:
		item = fmt.Sprintf("foundations[%d]", at.Item.Index)
	case fem.PointLoadItem:
		item = indexed(own[PointLoad], at.Item.Index)
	case fem.DistributedLoadItem:
		item = indexed(own[DistributedLoad], at.Item.Index)
	case fem.MeshItem:
		item = "mesh"
	}
	if key := propertyKey(at); key != "" {
		return join(item, key)
	}
	return item
}

// propertyKey gives the key, below its item, that holds a property in the file.
func propertyKey(at fem.Place) string {
	switch at.Property {
	case fem.StartProperty:
		return "start"
	case fem.EndProperty:
		return "end"
	case fem.AreaProperty:
		return "section.area"
	case fem.SecondMomentProperty:
		return "section.second_moment"
	case fem.FibreDistanceProperty:
		return "section.fibre_distance"
	case fem.ElasticProperty:
		return "material.elastic_modulus"
	case fem.DensityProperty:
		return "material.density"
	case fem.ThermalExpansionProperty:
		return "material.thermal_expansion"
	case fem.AllowableProperty:
		return "material.allowable_stress"
	case fem.DepthProperty:
		return "section.depth"
	case fem.TemperatureDifferenceProperty:
		return "temperature_difference"
	case fem.ShearAreaProperty:
		return "section.shear_area"
	case fem.ShearCoefficientProperty:
		return "section.shear_coefficient"
	case fem.ShearModulusProperty:
		return "material.shear_modulus"
	case fem.PoissonProperty:
		return "material.poisson"
	case fem.PositionProperty:
		return "x"
	case fem.KindProperty:
		return "kind"
	case fem.StiffnessProperty:
		return "stiffness"
	case fem.ModulusProperty:
		return "modulus"
	case fem.AxialModulusProperty:
		return "axial_modulus"
	case fem.MotionStiffnessProperty:
		return "stiffness." + motionName(at.Dof)
	case fem.SettlementProperty:
		return "settlement." + motionName(at.Dof)
	case fem.AxialForceProperty:
		return "axial"
	case fem.TransverseForceProperty:
		return "transverse"
	case fem.MomentProperty:
		return "moment"
	case fem.DirectionProperty:
		return "direction"
	case fem.PointsProperty:
		return "points"
	case fem.PointXProperty:
		return fmt.Sprintf("points[%d][0]", at.Vertex)
	case fem.PointIntensityProperty:
		return fmt.Sprintf("points[%d][1]", at.Vertex)
	case fem.ElementsProperty:
		return "elements"
	case fem.MaxElementLengthProperty:
		return "max_element_length"
	case fem.BarOrderProperty:
		return "bar_order"
	case fem.SegmentsProperty:
		return "member.segments"
	case fem.GravityProperty:
		if at.Dof == fem.Axial {
			return "self_weight.gravity_x"
		}
		return "self_weight.gravity_y"
	case fem.TemperatureChangeProperty:
		return "temperature_change"
	}
	return ""
}

// motionName is the file's key for motion d.
func motionName(d fem.Dof) string {
	if d < 0 || int(d) >= len(motionNames) {
		return "unknown"
	}
	return motionNames[d]
}

func indexed(paths []string, i int) string {
	if i < 0 || i >= len(paths) {
		return "loads"
	}
	return paths[i]
}
