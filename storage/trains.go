package storage

import (
	"fmt"

	"stave/fem/moving"
	"stave/fem/units"
)

// Trains are a version 2 addition: moving load trains (package fem/moving),
// each with its axles, an optional uniform load, the stretch it runs along,
// its direction and its step. See docs/format.md.

type (
	fileTrain struct {
		Name      string       `json:"name,omitempty"`
		Axles     []fileAxle   `json:"axles,omitempty"`
		Uniform   *fileUniform `json:"uniform,omitempty"`
		From      number       `json:"from,omitempty"`
		To        number       `json:"to,omitempty"`
		OffEnds   bool         `json:"off_ends,omitempty"`
		Direction string       `json:"direction,omitempty"`
		Step      number       `json:"step,omitempty"`
	}
	fileAxle struct {
		Load    number `json:"load"`
		Spacing number `json:"spacing,omitempty"`
	}
	fileUniform struct {
		Load   number `json:"load"`
		Start  number `json:"start,omitempty"`
		Length number `json:"length"`
	}
)

// trains writes the project's trains; a train that moves both ways leaves
// its direction out.
func (c *converter) trains(ts []moving.Train) []fileTrain {
	var out []fileTrain
	for i, t := range ts {
		path := fmt.Sprintf("trains[%d]", i)
		ft := fileTrain{Name: t.Name, From: c.num(path+".from", t.From), To: c.num(path+".to", t.To), OffEnds: t.OffEnds, Step: c.num(path+".step", t.Step)}
		if t.Direction != moving.BothWays {
			ft.Direction = t.Direction.String()
			if ft.Direction == "unknown" {
				c.problems = append(c.problems, Problem{Path: path + ".direction",
					Message: fmt.Sprintf("direction %d is unknown; choose both, forward or backward", int(t.Direction))})
			}
		}
		for j, a := range t.Axles {
			ap := fmt.Sprintf("%s.axles[%d]", path, j)
			ft.Axles = append(ft.Axles, fileAxle{Load: c.num(ap+".load", a.Load), Spacing: c.num(ap+".spacing", a.Spacing)})
		}
		if u := t.Uniform; u != (moving.UniformLoad{}) {
			ft.Uniform = &fileUniform{Load: c.num(path+".uniform.load", u.Load), Start: c.num(path+".uniform.start", u.Start), Length: c.num(path+".uniform.length", u.Length)}
		}
		out = append(out, ft)
	}
	return out
}

// trains reads the "trains" list.
func (r *reader) trains(top *fields) []moving.Train {
	var out []moving.Train
	items, paths := top.list("trains", false, "")
	for i, item := range items {
		f := r.object(paths[i], item)
		t := moving.Train{Name: f.text("name", false, "")}
		axles, axlePaths := f.list("axles", false, "")
		for j, a := range axles {
			af := r.object(axlePaths[j], a)
			t.Axles = append(t.Axles, moving.Axle{Load: af.number("load", "N", true), Spacing: af.number("spacing", "m", false)})
			af.finish()
		}
		if u := f.object("uniform", false, ""); u.n != nil {
			t.Uniform = moving.UniformLoad{Load: u.number("load", "N/m", true), Start: u.number("start", "m", false), Length: u.number("length", "m", true)}
			u.finish()
		}
		t.From, t.To = f.number("from", "m", false), f.number("to", "m", false)
		t.OffEnds = f.flag("off_ends", false)
		name := f.text("direction", false, "")
		if f.holds("direction", stringNode) {
			d, ok := moving.ParseDirection(name)
			if !ok {
				r.add(join(f.path, "direction"), "%q is not a direction; use \"both\", \"forward\" (towards the member's end) or \"backward\"", cut(name))
			}
			t.Direction = d
		}
		t.Step = f.number("step", "m", false)
		f.finish()
		out = append(out, t)
	}
	return out
}

// trainProblems are the problems of the project's trains themselves, with
// their paths, and of their names as labels. Whether a train fits on its
// member is not a file's problem: the member may be shortened after the
// train was made, and a file must not stop opening for that; it is
// reported when the train is used.
func trainProblems(p *Project) []Problem {
	var out []Problem
	for i, t := range p.Trains {
		path := fmt.Sprintf("trains[%d]", i)
		if fault := textFault(t.Name, false); fault != "" {
			out = append(out, Problem{Path: path + ".name", Message: fault})
		}
		for _, q := range t.OwnProblems(units.Base) {
			where := path
			if q.Key != "" {
				where += "." + q.Key
			}
			out = append(out, Problem{Path: where, Message: t.Label(i) + ": " + q.Message})
		}
	}
	return out
}
