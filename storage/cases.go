package storage

import (
	"fmt"
	"strconv"
	"strings"

	"stave/fem"
)

// Load cases and combinations in the file (version 2). A file without
// "cases" holds the loads of a model without cases at the top level (one
// load set, which Stave shows as one case named "loads"), as version 1
// does; a file with cases holds every load in them. Combinations name
// their cases by name. Within a case, loads keep their order
// (Project.CaseLoadOrder).

type (
	fileCase struct {
		Name              string `json:"name"`
		Loads             []any  `json:"loads,omitempty"`
		SelfWeight        bool   `json:"self_weight,omitempty"`
		TemperatureChange number `json:"temperature_change,omitempty"`
		Settlements       bool   `json:"settlements,omitempty"`
		Gradient          bool   `json:"temperature_differences,omitempty"`
		BySpan            bool   `json:"by_span,omitempty"`
	}
	fileCombination struct {
		Name    string       `json:"name"`
		Kind    string       `json:"kind"`
		Label   string       `json:"label,omitempty"`
		Factors []fileFactor `json:"factors"`
	}
	// fileFactor names a load case, or a moving load train, and its factor.
	fileFactor struct {
		Case   string `json:"case,omitempty"`
		Train  string `json:"train,omitempty"`
		Factor number `json:"factor"`
	}
)

var combinationKindList = `"strength", "serviceability" or "other"`

// cases writes the load cases and combinations of p.
func (c *converter) cases(p *Project) ([]fileCase, []fileCombination) {
	m := &p.Model
	var cases []fileCase
	for k, lc := range m.Cases {
		path := fmt.Sprintf("cases[%d]", k)
		fc := fileCase{Name: lc.Name, SelfWeight: lc.SelfWeight, Settlements: lc.Settlements, Gradient: lc.ThermalGradient, BySpan: lc.BySpan,
			TemperatureChange: c.num(path+".temperature_change", lc.TemperatureChange)}
		for i, ref := range orderedLoads(caseOrder(p, k), len(lc.PointLoads), len(lc.DistributedLoad)) {
			lp := fmt.Sprintf("%s.loads[%d]", path, i)
			if ref.kind == PointLoad {
				fc.Loads = append(fc.Loads, c.pointLoad(lp, lc.PointLoads[ref.index]))
			} else {
				fc.Loads = append(fc.Loads, c.distributedLoad(lp, lc.DistributedLoad[ref.index]))
			}
		}
		cases = append(cases, fc)
	}
	var combos []fileCombination
	for k, cb := range m.Combinations {
		path := fmt.Sprintf("combinations[%d]", k)
		fc := fileCombination{Name: cb.Name, Kind: cb.Kind.String(), Label: cb.Label, Factors: []fileFactor{}}
		if fc.Kind == "unknown" {
			c.problems = append(c.problems, Problem{Path: path + ".kind",
				Message: fmt.Sprintf("combination kind %d is unknown; choose one of %s", int(cb.Kind), combinationKindList)})
		}
		for i, cf := range cb.Factors {
			fp := fmt.Sprintf("%s.factors[%d]", path, i)
			name := ""
			if cf.Case >= 0 && cf.Case < len(m.Cases) {
				name = m.Cases[cf.Case].Name
			} else {
				c.problems = append(c.problems, Problem{Path: fp + ".case",
					Message: fmt.Sprintf("names load case %d, but there are %d; choose one of the cases", cf.Case+1, len(m.Cases))})
			}
			fc.Factors = append(fc.Factors, fileFactor{Case: name, Factor: c.num(fp+".factor", cf.Factor)})
		}
		for i, tf := range cb.Trains {
			fp := fmt.Sprintf("%s.factors[%d]", path, len(cb.Factors)+i)
			if tf.Train < 0 || tf.Train >= len(p.Trains) || p.Trains[tf.Train].Name == "" {
				c.problems = append(c.problems, Problem{Path: fp + ".train",
					Message: fmt.Sprintf("names train %d, but there is no train of that number with a name; name the train, or remove it from the combination", tf.Train+1)})
				continue
			}
			fc.Factors = append(fc.Factors, fileFactor{Train: p.Trains[tf.Train].Name, Factor: c.num(fp+".factor", tf.Factor)})
		}
		combos = append(combos, fc)
	}
	return cases, combos
}

// cases reads the load cases and combinations.
func (r *reader) cases(p *Project, top *fields) {
	items, paths := top.list("cases", false, "")
	for i, item := range items {
		f := r.object(paths[i], item)
		lc := fem.LoadCase{Name: f.text("name", true, `"name" with the case's name, such as "permanent"`)}
		loads, loadPaths := f.list("loads", false, "")
		var order []LoadKind
		for j, l := range loads {
			r.load(&lc.PointLoads, &lc.DistributedLoad, &order, r.object(loadPaths[j], l))
		}
		lc.SelfWeight = f.flag("self_weight", false)
		lc.TemperatureChange = f.number("temperature_change", "K", false)
		lc.Settlements = f.flag("settlements", false)
		lc.ThermalGradient = f.flag("temperature_differences", false)
		lc.BySpan = f.flag("by_span", false)
		f.finish()
		p.Model.Cases = append(p.Model.Cases, lc)
		p.CaseLoadOrder = append(p.CaseLoadOrder, order)
	}
	names := make([]string, len(p.Model.Cases))
	for k, lc := range p.Model.Cases {
		names[k] = strconv.Quote(cut(lc.Name))
	}
	items, paths = top.list("combinations", false, "")
	for i, item := range items {
		f := r.object(paths[i], item)
		cb := fem.Combination{Name: f.text("name", true, `"name" with the combination's name`)}
		kind := f.text("kind", true, `"kind": one of `+combinationKindList)
		k, known := fem.ParseCombinationKind(kind)
		if !known && f.holds("kind", stringNode) {
			r.add(join(f.path, "kind"), "%q is not a kind of combination; use %s", cut(kind), combinationKindList)
		}
		cb.Kind = k
		cb.Label = f.text("label", false, "")
		factors, factorPaths := f.list("factors", true, `"factors": [{"case": "permanent", "factor": 1.35}, ...]`)
		for j, item := range factors {
			ff := r.object(factorPaths[j], item)
			if item.kind == objectNode && item.fields["train"] != nil {
				if item.fields["case"] != nil { // one entry, one of the two: which would the factor take?
					r.add(join(ff.path, "case"), `factor %d of combination %d names both a load case and a moving load train: give each its own entry, {"case": NAME, "factor": F} or {"train": NAME, "factor": F}`, j+1, i+1)
					ff.known = append(ff.known, "case")
				}
				if tf, ok := r.trainFactor(p, ff); ok {
					cb.Trains = append(cb.Trains, tf)
				}
				continue
			}
			name := ff.text("case", true, `"case" with the name of a load case, or "train" with the name of a moving load train`)
			cf := fem.CaseFactor{Case: caseNamed(p.Model.Cases, name), Factor: ff.number("factor", "(no unit)", true)}
			if cf.Case < 0 && ff.holds("case", stringNode) {
				r.add(join(ff.path, "case"), "%q is not a load case of this file; use %s", cut(name), oneOf(names, `none: add the case under "cases"`))
			}
			ff.finish()
			cb.Factors = append(cb.Factors, cf)
		}
		f.finish()
		p.Model.Combinations = append(p.Model.Combinations, cb)
	}
}

// trainFactor reads a factor entry that names a moving load train:
// {"train": NAME, "factor": F}. p's trains must be read already.
func (r *reader) trainFactor(p *Project, ff *fields) (fem.TrainFactor, bool) {
	name := ff.text("train", true, `"train" with the name of a moving load train`)
	tf := fem.TrainFactor{Train: -1, Factor: ff.number("factor", "(no unit)", true)}
	for i, t := range p.Trains {
		switch {
		case t.Name != name:
		case tf.Train < 0:
			tf.Train = i
		default:
			r.add(join(ff.path, "train"), "%q names trains %d and %d: give each train its own name", cut(name), tf.Train+1, i+1)
		}
	}
	if tf.Train < 0 && ff.holds("train", stringNode) {
		var names []string
		for _, t := range p.Trains {
			if t.Name != "" {
				names = append(names, strconv.Quote(cut(t.Name)))
			}
		}
		r.add(join(ff.path, "train"), "%q is not a train of this file; use %s", cut(name), oneOf(names, `none: add it under "trains" with a name`))
	}
	ff.finish()
	return tf, tf.Train >= 0
}

// oneOf lists the names a reference may take ("one of "a", "b""), or says
// none when there are none.
func oneOf(names []string, none string) string {
	if len(names) == 0 {
		return none
	}
	return "one of " + strings.Join(names, ", ")
}

// caseNamed is the index of the case named name, or −1.
func caseNamed(cases []fem.LoadCase, name string) int {
	for k, lc := range cases {
		if lc.Name == name {
			return k
		}
	}
	return -1
}

// caseProblems are what a file's cases must not hold beyond fem's rules: a
// case that takes the self-weight of a file that gives no gravity.
func caseProblems(p *Project) []Problem {
	var problems []Problem
	for k, lc := range p.Model.Cases {
		if lc.SelfWeight && p.Model.Gravity == [2]float64{} {
			problems = append(problems, Problem{Path: fmt.Sprintf("cases[%d].self_weight", k),
				Message: fmt.Sprintf("load case %q takes the self-weight, but the file gives no gravity; add \"self_weight\": {\"gravity_x\": 0, \"gravity_y\": -9.80665} at the top level, or set this to false", lc.Name)})
		}
	}
	return problems
}

// caseTexts checks the names and labels of the cases and combinations as
// labels.
func caseTexts(p *Project, check func(path, s string, notes bool)) {
	for k, lc := range p.Model.Cases {
		check(fmt.Sprintf("cases[%d].name", k), lc.Name, false)
	}
	for k, cb := range p.Model.Combinations {
		check(fmt.Sprintf("combinations[%d].name", k), cb.Name, false)
		check(fmt.Sprintf("combinations[%d].label", k), cb.Label, false)
	}
}

// caseOrder is the load order of case k of p.
func caseOrder(p *Project, k int) []LoadKind {
	if k < len(p.CaseLoadOrder) {
		return p.CaseLoadOrder[k]
	}
	return nil
}

// caseLoadPaths gives the file path of every load of every case, as
// loadPaths does for the model's own.
func caseLoadPaths(p *Project) [][2][]string {
	out := make([][2][]string, len(p.Model.Cases))
	for k, lc := range p.Model.Cases {
		out[k] = [2][]string{make([]string, len(lc.PointLoads)), make([]string, len(lc.DistributedLoad))}
		for i, ref := range orderedLoads(caseOrder(p, k), len(lc.PointLoads), len(lc.DistributedLoad)) {
			out[k][ref.kind][ref.index] = fmt.Sprintf("cases[%d].loads[%d]", k, i)
		}
	}
	return out
}

// casePath is the file path of a case or combination item, or "".
func casePath(it fem.Item) string {
	switch it.Kind {
	case fem.CaseItem:
		return fmt.Sprintf("cases[%d]", it.Index)
	case fem.CombinationItem:
		return fmt.Sprintf("combinations[%d]", it.Index)
	}
	return ""
}

// caseKey is the key below a case or combination that holds a property, or "".
func caseKey(at fem.Place) string {
	switch at.Property {
	case fem.NameProperty:
		return "name"
	case fem.FactorsProperty:
		return "factors"
	case fem.FactorCaseProperty:
		return fmt.Sprintf("factors[%d].case", at.Vertex)
	case fem.FactorProperty:
		return fmt.Sprintf("factors[%d].factor", at.Vertex)
	case fem.CombinationKindProperty:
		return "kind"
	}
	return ""
}
