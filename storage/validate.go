package storage

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

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
		paths := loadPaths(p)
		for _, q := range invalid.Problems {
			problems = append(problems, Problem{Path: modelPath(q, paths), Message: q.Message})
		}
	} else if err != nil {
		add("", "%v", err)
	}
	v := p.View
	if v.Units != SI && v.Units != US {
		add("view.units", "%q is not a display unit system; use %q or %q", string(v.Units), SI, US)
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

// femFields maps the field names of fem.Problem to the file's keys, per item.
var femFields = map[string]map[string]string{
	"segment": {
		"area": "section.area", "second moment": "section.second_moment", "fibre distance": "section.fibre_distance",
		"elastic": "material.elastic_modulus", "density": "material.density",
		"allowable": "material.allowable_stress", "thermal expansion": "material.thermal_expansion",
	},
	"mesh":  {"max element length": "max_element_length", "bar order": "bar_order"},
	"model": {"segments": "member.segments", "gravity[0]": "self_weight.gravity_x", "gravity[1]": "self_weight.gravity_y", "temperature change": "temperature_change"},
}

// modelPath turns the place of a fem.Problem into a path in the file.
func modelPath(q fem.Problem, loads [2][]string) string {
	field := q.Field
	if f, ok := femFields[q.Item][field]; ok {
		field = f
	}
	// "stiffness[1]" → "stiffness.transverse"; "points[2].x" → "points[2][0]".
	if strings.HasPrefix(field, "stiffness[") || strings.HasPrefix(field, "settlement[") {
		for d, name := range motionNames {
			field = strings.Replace(field, "["+strconv.Itoa(d)+"]", "."+name, 1)
		}
	}
	field = strings.NewReplacer(".x", "[0]", ".intensity", "[1]").Replace(field)

	var item string
	switch q.Item {
	case "segment":
		item = fmt.Sprintf("member.segments[%d]", q.Index)
	case "support":
		item = fmt.Sprintf("supports[%d]", q.Index)
	case "point load":
		item = indexed(loads[PointLoad], q.Index)
	case "distributed load":
		item = indexed(loads[DistributedLoad], q.Index)
	case "mesh":
		item = "mesh"
	}
	return join(item, field)
}

func indexed(paths []string, i int) string {
	if i < 0 || i >= len(paths) {
		return "loads"
	}
	return paths[i]
}
