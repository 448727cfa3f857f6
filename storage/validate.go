package storage

import (
	"fmt"

	"stave/fem"
)

// checker collects the problems of a decoded project; its paths are the file's.
type checker struct {
	problems []Problem
	length   float64 // member length, m
}

func (c *checker) add(path, format string, args ...any) {
	c.problems = append(c.problems, Problem{Path: path, Message: fmt.Sprintf(format, args...)})
}

// check finds everything about p that a file must not hold: values out of
// range, positions off the member, segments that do not tile it.
func check(p *Project) []Problem {
	m := &p.Model
	c := checker{length: m.Length()}
	c.segments(m.Segments)
	for i, s := range m.Supports {
		c.support(fmt.Sprintf("supports[%d]", i), s)
	}
	for i, ref := range fileLoads(p) {
		path := fmt.Sprintf("loads[%d]", i)
		if ref.kind == PointLoad {
			c.onMember(path+".x", m.PointLoads[ref.index].X)
		} else {
			c.distributed(path, m.DistributedLoad[ref.index])
		}
	}
	if m.Mesh.Elements < 1 {
		c.add("mesh.elements", "%d elements cannot make a mesh; ask for 1 or more", m.Mesh.Elements)
	}
	c.atLeastZero("mesh.max_element_length", m.Mesh.MaxElementLength, "m", "the element length cap (0 means no cap)")
	if o := m.Mesh.BarOrder; o != 0 && o != fem.LinearBar && o != fem.QuadraticBar {
		c.add("mesh.bar_order", "%d is not a bar element order; use 1 (linear) or 2 (quadratic)", int(o))
	}
	c.view(p.View)
	return c.problems
}

func (c *checker) segments(segments []fem.Segment) {
	if len(segments) == 0 {
		c.add("member.segments", "the member has no segments; add at least one")
	}
	for i, s := range segments {
		path := fmt.Sprintf("member.segments[%d]", i)
		switch {
		case i == 0 && s.Start != 0:
			c.add(path+".start", "the member starts at x = 0, but the first segment starts at %g m; set it to 0", s.Start)
		case i > 0 && s.Start != segments[i-1].End:
			c.add(path+".start", "%g m does not meet the end of the segment before (%g m); segments must follow one another without gaps or overlaps", s.Start, segments[i-1].End)
		}
		if !(s.End > s.Start) {
			c.add(path+".end", "%g m is not past the segment's start (%g m); a segment must have a length", s.End, s.Start)
		}
		c.positive(path+".section.area", s.Section.Area, "m²", "area")
		c.positive(path+".section.second_moment", s.Section.SecondMoment, "m⁴", "second moment of area")
		c.atLeastZero(path+".section.fibre_distance", s.Section.FibreDistance, "m", "fibre distance (0 means not given)")
		c.positive(path+".material.elastic_modulus", s.Material.Elastic, "Pa", "elastic modulus")
		c.atLeastZero(path+".material.density", s.Material.Density, "kg/m³", "density")
		c.atLeastZero(path+".material.allowable_stress", s.Material.Allowable, "Pa", "allowable stress (0 means not given)")
	}
}

var motionNames = [3]string{"axial", "transverse", "rotation"}

func (c *checker) support(path string, s fem.Support) {
	c.onMember(path+".x", s.X)
	if s.Kind.String() == "unknown" {
		c.add(path+".kind", "support kind %d is unknown; use %s", int(s.Kind), supportKindList)
		return
	}
	if s.Kind == fem.Spring {
		units := [3]string{"N/m", "N/m", "N·m/rad"}
		for d, k := range s.Stiffness {
			c.atLeastZero(path+".stiffness."+motionNames[d], k, units[d], "spring stiffness")
		}
		if s.Stiffness == [3]float64{} {
			c.add(path+".stiffness", "a spring support with no stiffness holds nothing; give at least one stiffness above zero")
		}
	}
	for d, v := range s.Settlement {
		if v != 0 && !s.Kind.Restrains(fem.Dof(d)) {
			c.add(path+".settlement."+motionNames[d], "a %s support leaves the %s motion free, so it cannot prescribe a settlement there; remove it", s.Kind, motionNames[d])
		}
	}
}

func (c *checker) distributed(path string, l fem.DistributedLoad) {
	if l.Direction != fem.Axial && l.Direction != fem.Transverse {
		c.add(path+".direction", "direction %s is not one a distributed load can have; use axial or transverse", l.Direction)
	}
	if len(l.Points) < 2 {
		c.add(path+".points", "a distributed load needs at least two points [x, intensity] (start and end); it has %d", len(l.Points))
	}
	for j, pt := range l.Points {
		pointPath := fmt.Sprintf("%s.points[%d]", path, j)
		c.onMember(pointPath+"[0]", pt.X)
		if j > 0 && !(pt.X > l.Points[j-1].X) {
			c.add(pointPath+"[0]", "%g m does not come after the previous point (%g m); list the points from left to right", pt.X, l.Points[j-1].X)
		}
	}
}

func (c *checker) view(v View) {
	if v.Units != SI && v.Units != US {
		c.add("view.units", "%q is not a display unit system; use %q or %q", string(v.Units), SI, US)
	}
	c.atLeastZero("view.magnification", v.Magnification, "", "magnification (0 chooses it automatically)")
	c.atLeastZero("view.grid_step", v.GridStep, "m", "grid step (0 means no grid)")
	c.positive("view.deflection_limit", v.DeflectionLimit, "", "deflection limit n in span/n")
	c.positive("view.safety_factor", v.SafetyFactor, "", "safety factor")
}

// onMember checks that x lies on the member.
func (c *checker) onMember(path string, x float64) {
	switch {
	case x < 0:
		c.add(path, "%g m is before the member start (0 m); move it onto the member", x)
	case x > c.length:
		c.add(path, "%g m is past the member end (%g m); move it onto the member", x, c.length)
	}
}

func (c *checker) positive(path string, v float64, unit, what string) {
	if !(v > 0) {
		c.add(path, "%s is not a valid %s; enter a value above zero", withUnit(v, unit), what)
	}
}

func (c *checker) atLeastZero(path string, v float64, unit, what string) {
	if v < 0 {
		c.add(path, "%s is not a valid %s; enter zero or more", withUnit(v, unit), what)
	}
}

func withUnit(v float64, unit string) string {
	if unit == "" {
		return fmt.Sprintf("%g", v)
	}
	return fmt.Sprintf("%g %s", v, unit)
}
