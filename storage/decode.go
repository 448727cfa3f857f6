package storage

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
	"strings"

	"stave/fem"
)

// Problem is one thing wrong with a file.
type Problem struct {
	// Path is the place in the file, e.g. "loads[3].points[1]"; empty for the
	// file as a whole.
	Path string
	// Message says what is wrong and what to do.
	Message string
}

func (p Problem) String() string {
	if p.Path == "" {
		return p.Message
	}
	return p.Path + ": " + p.Message
}

// LoadError lists everything wrong with a file that could not be loaded.
type LoadError struct {
	File     string // the file's path, when it was read from one
	Problems []Problem
}

func (e *LoadError) Error() string {
	what := "the file"
	if e.File != "" {
		what = e.File
	}
	if len(e.Problems) == 1 {
		return what + " cannot be opened: " + e.Problems[0].String()
	}
	return fmt.Sprintf("%s cannot be opened (%d problems):\n", what, len(e.Problems)) + listProblems(e.Problems)
}

// MaxListedProblems is how many problems a message lists, one a line; it
// counts the rest. A generated file can hold a problem in each of 100,000
// items, and a message of 100,000 lines (12 MB) floods a terminal and
// freezes a dialog while saying no more than its first lines do.
const MaxListedProblems = 100

func listProblems(problems []Problem) string {
	n := min(len(problems), MaxListedProblems)
	lines := make([]string, n, n+1)
	for i, p := range problems[:n] {
		lines[i] = "  - " + p.String()
	}
	if rest := len(problems) - n; rest > 0 {
		noun := "problems"
		if rest == 1 {
			noun = "problem"
		}
		lines = append(lines, fmt.Sprintf("  - and %d more %s (the first %d are listed)", rest, noun, n))
	}
	return strings.Join(lines, "\n")
}

// Unmarshal reads a project file's bytes. On any problem it returns nil and
// a *LoadError listing all problems found, so an open project is never
// replaced by a half-read one.
func Unmarshal(data []byte) (*Project, error) {
	refuse := func(problem Problem) error {
		return &LoadError{Problems: []Problem{problem}}
	}
	if len(data) > MaxFileSize {
		return nil, refuse(sizeError{int64(len(data))}.problem())
	}
	if encoding := textEncoding(data); encoding != "" {
		return nil, refuse(Problem{Message: fmt.Sprintf("line 1, column 1: this file is %s text; save it as UTF-8 (in most editors: Save As, encoding UTF-8) and open it again", encoding)})
	}
	top, err := parseTree(bytes.TrimPrefix(data, utf8BOM))
	if err != nil {
		return nil, refuse(Problem{Message: err.Error()})
	}
	if problem, ok := checkVersion(top); !ok {
		return nil, refuse(problem)
	}
	var r reader
	p := r.project(r.object("", top))
	problems := r.problems
	found := newProblemPlaces(r.problems)
	for _, q := range append(check(p), checkTexts(p)...) {
		if !found.overlaps(q.Path) {
			problems = append(problems, q)
		}
	}
	if len(problems) > 0 {
		inFileOrder(problems)
		return nil, &LoadError{Problems: problems}
	}
	return p, nil
}

// Validate checks a project as Unmarshal would after reading it, so the
// application can warn before saving a file that would not open again.
// It returns nil or a *LoadError.
func Validate(p *Project) error {
	problems := append(check(p), checkTexts(p)...)
	if data, err := Marshal(p); err == nil && len(data) > MaxFileSize {
		problems = append(problems, oversize(len(data)))
	}
	if len(problems) > 0 {
		inFileOrder(problems)
		return &LoadError{Problems: problems}
	}
	return nil
}

// problemPlaces are the paths of the problems found as a file was read,
// and every path around them, so that a problem found later can be looked
// up at once (overlaps) rather than against every problem in turn, which
// took minutes on a file of 50,000 loads each with a problem twice over.
type problemPlaces struct {
	at     map[string]bool // the problems' own paths
	around map[string]bool // theirs and every path that holds one of them
}

func newProblemPlaces(problems []Problem) problemPlaces {
	f := problemPlaces{at: make(map[string]bool, len(problems)), around: make(map[string]bool, 2*len(problems))}
	for _, p := range problems {
		f.at[p.Path] = true
		for _, outer := range outerPaths(p.Path) {
			f.around[outer] = true
		}
	}
	return f
}

// overlaps reports whether a problem was already found at path, inside it
// or around it: a missing or mistyped value need not be reported again as
// out of range.
func (f problemPlaces) overlaps(path string) bool {
	if f.around[path] {
		return true // a problem at path or inside it
	}
	for _, outer := range outerPaths(path) {
		if f.at[outer] {
			return true // a problem around path
		}
	}
	return false
}

// outerPaths are path itself and every path that holds it, out to the
// whole file (""): "loads[2].x" is held by "loads[2]", "loads" and "".
func outerPaths(path string) []string {
	out := []string{path}
	for i := len(path) - 1; i > 0; i-- {
		if path[i] == '.' || path[i] == '[' {
			out = append(out, path[:i])
		}
	}
	if path != "" {
		out = append(out, "")
	}
	return out
}

// migration rewrites the parsed file of one format version into the layout of
// the next.
type migration func(top *node) error

// migrations maps each old version to the step that lifts it by one.
// Version 2 only adds to version 1 (supports that mix rigid and elastic
// motions, and this round's other additions), so a version 1 file is read
// as it stands.
var migrations = map[int]migration{1: func(*node) error { return nil }}

// checkVersion makes sure top is a Stave project this version can read,
// migrating older versions in place.
func checkVersion(top *node) (Problem, bool) {
	if top.kind != objectNode {
		return Problem{Message: fmt.Sprintf("the file holds %s, not a Stave project; open a .json file saved by Stave", top.describe())}, false
	}
	format := top.fields["format"]
	if format == nil {
		return Problem{Path: "format", Message: fmt.Sprintf("missing; a Stave project file starts with \"format\": %q", FormatName)}, false
	}
	if format.kind != stringNode || format.text != FormatName {
		shown := format.describe()
		if format.kind == stringNode {
			shown = strconv.Quote(cut(format.text))
		}
		return Problem{Path: "format", Message: fmt.Sprintf("is %s, so this is not a Stave project file (expected %q); open a file saved by Stave", shown, FormatName)}, false
	}
	version := top.fields["version"]
	if version == nil {
		return Problem{Path: "version", Message: fmt.Sprintf("missing; add \"version\": %d after \"format\"", Version)}, false
	}
	v, err := strconv.ParseFloat(version.text, 64) // too large for a float64 gives ±Inf, still a whole number
	switch {
	case version.kind != numberNode || err != nil && !math.IsInf(v, 0) || v != math.Trunc(v):
		return Problem{Path: "version", Message: fmt.Sprintf("must be a whole number such as %d", Version)}, false
	case v > Version:
		return Problem{Path: "version", Message: fmt.Sprintf("this file was written by a newer Stave (format version %s); this version reads up to %d — update Stave", cut(version.text), Version)}, false
	case v < 0:
		return Problem{Path: "version", Message: fmt.Sprintf("%s is not a format version (they count up from 1); open a file saved by Stave", cut(version.text))}, false
	}
	if err := migrate(top, int(v), Version, migrations); err != nil {
		return Problem{Path: "version", Message: err.Error()}, false
	}
	return Problem{}, true
}

// migrate lifts the parsed file top from format version from to version to,
// one step at a time, and records the new version in the file.
func migrate(top *node, from, to int, table map[int]migration) error {
	if oldest := firstReadable(table, to); from < oldest {
		return fmt.Errorf("format version %d is older than any this Stave can read (it reads versions %d to %d); open the file with the Stave that wrote it and save it again", from, oldest, to)
	}
	for v := from; v < to; v++ {
		if err := table[v](top); err != nil {
			return fmt.Errorf("cannot convert the file from format version %d to %d: %v", v, v+1, err)
		}
	}
	top.fields["version"] = &node{kind: numberNode, text: strconv.Itoa(to)}
	return nil
}

// firstReadable is the oldest version from which table reaches version to.
func firstReadable(table map[int]migration, to int) int {
	v := to
	for table[v-1] != nil {
		v--
	}
	return v
}

// reader turns parsed nodes into a Project, noting every problem.
type reader struct {
	problems []Problem
}

func (r *reader) add(path, format string, args ...any) {
	r.problems = append(r.problems, Problem{Path: path, Message: fmt.Sprintf(format, args...)})
}

// fields reads one JSON object. Every key it is asked for counts as known;
// finish reports the others. A fields with a nil node (missing or of the
// wrong type, already reported) yields zero values silently.
type fields struct {
	r     *reader
	path  string
	n     *node
	known []string
}

func (r *reader) object(path string, n *node) *fields {
	f := &fields{r: r, path: path}
	if n == nil {
		return f
	}
	if n.kind != objectNode {
		r.add(path, "expected an object {...}, found %s", n.describe())
		return f
	}
	f.n = n
	return f
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

// get returns the value of key, or nil when it is absent (reported when required).
// hint tells what to add.
func (f *fields) get(key string, required bool, hint string) *node {
	if !contains(f.known, key) {
		f.known = append(f.known, key)
	}
	if f.n == nil {
		return nil
	}
	v := f.n.fields[key]
	if v == nil && required {
		f.r.add(join(f.path, key), "missing; add %s", hint)
	}
	return v
}

// finish reports keys that were not asked for.
func (f *fields) finish() {
	if f.n == nil {
		return
	}
	for _, k := range f.n.keys {
		if !contains(f.known, k) {
			f.r.add(join(f.path, cut(k)), "unknown key; remove it or correct its spelling (keys allowed here: %s)", strings.Join(f.known, ", "))
		}
	}
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// number reads a number in unit (for messages); absent optional numbers are 0.
func (f *fields) number(key, unit string, required bool) float64 {
	v := f.get(key, required, fmt.Sprintf("%q with a number %s", key, inUnit(unit)))
	return f.r.number(join(f.path, key), v, unit)
}

func (r *reader) number(path string, v *node, unit string) float64 {
	if v == nil {
		return 0
	}
	if v.kind != numberNode {
		r.add(path, "expected a number %s, found %s", inUnit(unit), v.describe())
		return 0
	}
	x, err := strconv.ParseFloat(v.text, 64)
	if err != nil || math.IsInf(x, 0) {
		r.add(path, "%s is too large for a number; enter a value %s", cut(v.text), inUnit(unit))
		return 0
	}
	if x == 0 && nonzeroMantissa(v.text) {
		r.add(path, "%s is too small for a number and would read as 0; enter 0 if you mean zero, or check the unit (values %s)", cut(v.text), inUnit(unit))
		return 0
	}
	return x
}

// inUnit phrases the unit of a number for a message: "in m²" for a unit,
// and a description such as "(no unit)" or "a count" in parentheses as it is.
func inUnit(unit string) string {
	switch {
	case strings.HasPrefix(unit, "("):
		return unit
	case strings.HasPrefix(unit, "a "):
		return "(" + unit + ")"
	}
	return "in " + unit
}

// nonzeroMantissa reports whether a JSON number has a digit other than 0
// before its exponent: a value that is not zero, however small.
func nonzeroMantissa(text string) bool {
	if i := strings.IndexAny(text, "eE"); i >= 0 {
		text = text[:i]
	}
	return strings.ContainsAny(text, "123456789")
}

// maxCount bounds the whole numbers of a file, so they fit an int anywhere.
const maxCount = 1_000_000_000

// count reads a whole number.
func (f *fields) count(key string, required bool) int {
	path := join(f.path, key)
	v := f.get(key, required, fmt.Sprintf("%q with a whole number", key))
	if v == nil {
		return 0
	}
	x := f.r.number(path, v, "a count")
	switch {
	case math.Abs(x) > maxCount:
		f.r.add(path, "%s is too large; a count in a file may be at most %d, enter a smaller whole number", cut(v.text), maxCount)
		return 0
	case x != math.Trunc(x):
		f.r.add(path, "%s is not a whole number; enter one such as 10", cut(v.text))
		return 0
	}
	return int(x)
}

// text reads a string; absent optional strings are "".
func (f *fields) text(key string, required bool, hint string) string {
	v := f.get(key, required, hint)
	if v == nil {
		return ""
	}
	if v.kind != stringNode {
		f.r.add(join(f.path, key), "expected text in quotes, found %s", v.describe())
		return ""
	}
	if v.damaged {
		f.r.add(join(f.path, key), "holds bytes that are not UTF-8 text (or half of a \\u surrogate pair); retype the text and save the file as UTF-8")
		return ""
	}
	return v.text
}

// flag reads true or false; absent flags keep def.
func (f *fields) flag(key string, def bool) bool {
	v := f.get(key, false, "")
	if v == nil {
		return def
	}
	if v.kind != boolNode {
		f.r.add(join(f.path, key), "expected true or false, found %s", v.describe())
		return def
	}
	return v.truth
}

// object reads a nested object.
func (f *fields) object(key string, required bool, hint string) *fields {
	return f.r.object(join(f.path, key), f.get(key, required, hint))
}

// list reads an array and returns its elements with their paths.
func (f *fields) list(key string, required bool, hint string) ([]*node, []string) {
	path := join(f.path, key)
	v := f.get(key, required, hint)
	if v == nil {
		return nil, nil
	}
	if v.kind != arrayNode {
		f.r.add(path, "expected a list [...], found %s", v.describe())
		return nil, nil
	}
	paths := make([]string, len(v.items))
	for i := range v.items {
		paths[i] = fmt.Sprintf("%s[%d]", path, i)
	}
	return v.items, paths
}

func (r *reader) project(top *fields) *Project {
	p := &Project{}
	top.get("format", true, "")
	top.get("version", true, "")
	r.units(top.object("units", true, "the declaration of SI units (see docs/format.md)"))

	notes := top.object("notes", false, "")
	p.Notes = Notes{
		Project:  notes.text("project", false, ""),
		Member:   notes.text("member", false, ""),
		Engineer: notes.text("engineer", false, ""),
		Date:     notes.text("date", false, ""),
		Text:     notes.text("text", false, ""),
	}
	notes.finish()

	member := top.object("member", true, `"member": {"segments": [...]}`)
	p.Model.AxialOnly = member.flag("axial_only", false)
	items, paths := member.list("segments", true, `"segments": [...] with at least one segment`)
	for i, item := range items {
		p.Model.Segments = append(p.Model.Segments, r.segment(r.object(paths[i], item)))
	}
	member.finish()

	items, paths = top.list("supports", true, `"supports": [...]`)
	for i, item := range items {
		p.Model.Supports = append(p.Model.Supports, r.support(r.object(paths[i], item)))
	}

	items, paths = top.list("hinges", false, "")
	for i, item := range items {
		h := r.object(paths[i], item)
		p.Model.Hinges = append(p.Model.Hinges, fem.Hinge{X: h.number("x", "m", true), Stiffness: h.number("stiffness", "N·m/rad", false)})
		h.finish()
	}

	items, paths = top.list("foundations", false, "")
	for i, item := range items {
		g := r.object(paths[i], item)
		p.Model.Foundations = append(p.Model.Foundations, fem.Foundation{
			Start: g.number("start", "m", true), End: g.number("end", "m", true),
			Modulus: g.number("modulus", "N/m²", false), AxialModulus: g.number("axial_modulus", "N/m²", false)})
		g.finish()
	}

	items, paths = top.list("loads", false, "")
	for i, item := range items {
		r.load(&p.Model.PointLoads, &p.Model.DistributedLoad, &p.LoadOrder, r.object(paths[i], item))
	}

	if weight := top.object("self_weight", false, ""); weight.n != nil {
		p.Model.Gravity = [2]float64{weight.number("gravity_x", "m/s²", true), weight.number("gravity_y", "m/s²", true)}
		weight.finish()
	}
	p.Model.TemperatureChange = top.number("temperature_change", "K", false)
	p.Trains = r.trains(top) // before the combinations, which may name them
	r.cases(p, top)

	// Without a mesh, or without its number of elements, Stave chooses the
	// mesh, as it does for "elements": 0.
	mesh := top.object("mesh", false, "")
	p.Model.Mesh = fem.MeshSettings{
		Elements:         mesh.count("elements", false),
		MaxElementLength: mesh.number("max_element_length", "m", false),
		BarOrder:         fem.ElementOrder(mesh.count("bar_order", false)),
	}
	// fem reads an order of 0 as linear; a file says so by leaving the key out.
	if order := mesh.get("bar_order", false, ""); order != nil && order.kind == numberNode && !nonzeroMantissa(order.text) {
		r.add("mesh.bar_order", "%s is not a bar element order; enter 1 (linear) or 2 (quadratic), or leave bar_order out for linear", cut(order.text))
	}
	mesh.finish()

	p.View = r.view(top.object("view", false, ""))
	top.finish()
	return p
}

func (r *reader) units(f *fields) {
	for _, u := range siUnits {
		v := f.get(u.Quantity, true, fmt.Sprintf("%q: %q", u.Quantity, u.Unit))
		switch {
		case v == nil:
		case v.kind != stringNode:
			r.add(join(f.path, u.Quantity), "expected the unit %q in quotes, found %s", u.Unit, v.describe())
		case v.text != u.Unit:
			r.add(join(f.path, u.Quantity), "declares %q, but Stave files hold SI base units only; convert the values to %s and declare %q", cut(v.text), u.Unit, u.Unit)
		}
	}
	f.finish()
}

func (r *reader) segment(f *fields) fem.Segment {
	s := fem.Segment{Start: f.number("start", "m", true), End: f.number("end", "m", true)}
	section := f.object("section", true, `"section": {"area", "second_moment", "fibre_distance"}`)
	s.Section = fem.Section{
		Area:             section.number("area", "m²", true),
		SecondMoment:     section.number("second_moment", "m⁴", true),
		FibreDistance:    section.number("fibre_distance", "m", true),
		Depth:            section.number("depth", "m", false),
		ShearArea:        section.number("shear_area", "m²", false),
		ShearCoefficient: section.number("shear_coefficient", "a ratio", false),
	}
	section.finish()
	material := f.object("material", true, `"material": {"name", "elastic_modulus", ...}`)
	s.Material = fem.Material{
		Name:             material.text("name", false, ""),
		Elastic:          material.number("elastic_modulus", "Pa", true),
		Density:          material.number("density", "kg/m³", false),
		ThermalExpansion: material.number("thermal_expansion", "1/K", false),
		Allowable:        material.number("allowable_stress", "Pa", false),
		ShearModulus:     material.number("shear_modulus", "Pa", false),
		Poisson:          material.number("poisson", "a ratio", false),
	}
	material.finish()
	s.TemperatureDifference = f.number("temperature_difference", "K", false)
	s.ShearDeformation = f.flag("shear_deformation", false)
	f.finish()
	return s
}

var supportKindList = `"fixed", "pinned", "roller", "axial", "guided" or "spring"`

func (r *reader) support(f *fields) fem.Support {
	s := fem.Support{X: f.number("x", "m", true)}
	kindPath := join(f.path, "kind")
	name := f.text("kind", true, `"kind": one of `+supportKindList)
	kind, known := fem.ParseSupportKind(name)
	if !known && f.holds("kind", stringNode) {
		r.add(kindPath, "%q is not a support kind; use %s", cut(name), supportKindList)
	}
	s.Kind = kind
	// Any kind may hold the motions it leaves free by a spring (fem.Support);
	// a stiffness on a motion the kind holds rigidly is refused by
	// fem.Validate, at its path.
	stiffness := f.object("stiffness", known && kind == fem.Spring, `"stiffness": {"axial", "transverse", "rotation"} in N/m, N/m and N·m/rad`)
	s.Stiffness = [3]float64{
		stiffness.number("axial", "N/m", false),
		stiffness.number("transverse", "N/m", false),
		stiffness.number("rotation", "N·m/rad", false),
	}
	stiffness.finish()
	settlement := f.object("settlement", false, "")
	units := [3]string{"m", "m", "rad"}
	for d, name := range motionNames {
		s.Settlement[d] = settlement.number(name, units[d], false)
		if settlement.holds(name, numberNode) && known && !kind.Restrains(fem.Dof(d)) {
			r.add(join(settlement.path, name), "a %s support leaves the %s motion free, so it cannot have a settlement there; remove it", kind, name)
		}
	}
	settlement.finish()
	f.finish()
	return s
}

// load reads one load into points or lines, noting its kind in order.
func (r *reader) load(points *[]fem.PointLoad, lines *[]fem.DistributedLoad, order *[]LoadKind, f *fields) {
	kind := f.text("kind", true, `"kind": "point" or "distributed"`)
	switch kind {
	case pointKindName:
		*order = append(*order, PointLoad)
		*points = append(*points, fem.PointLoad{
			X:          f.number("x", "m", true),
			Axial:      f.number("axial", "N", false),
			Transverse: f.number("transverse", "N", false),
			Moment:     f.number("moment", "N·m", false),
		})
	case distributedKindName:
		*order = append(*order, DistributedLoad)
		*lines = append(*lines, r.distributed(f))
	default:
		if f.holds("kind", stringNode) {
			r.add(join(f.path, "kind"), "%q is not a load kind; use \"point\" or \"distributed\"", cut(kind))
		}
		return // the other keys depend on the kind
	}
	f.finish()
}

func (r *reader) distributed(f *fields) fem.DistributedLoad {
	var l fem.DistributedLoad
	directionPath := join(f.path, "direction")
	switch d := f.text("direction", true, `"direction": "axial" or "transverse"`); d {
	case "axial":
		l.Direction = fem.Axial
	case "transverse":
		l.Direction = fem.Transverse
	case "":
	default:
		r.add(directionPath, "%q is not a load direction; use \"axial\" or \"transverse\"", cut(d))
	}
	items, paths := f.list("points", true, `"points": [[x, intensity], ...] with x in m and intensity in N/m`)
	for i, item := range items {
		if item.kind != arrayNode || len(item.items) != 2 {
			r.add(paths[i], "expected a pair [x, intensity] (m, N/m), found %s", describeList(item))
			continue
		}
		l.Points = append(l.Points, fem.LoadPoint{
			X:         r.number(paths[i]+"[0]", item.items[0], "m"),
			Intensity: r.number(paths[i]+"[1]", item.items[1], "N/m"),
		})
	}
	return l
}

func describeList(n *node) string {
	if n.kind == arrayNode {
		return fmt.Sprintf("a list of %d values", len(n.items))
	}
	return n.describe()
}

func (r *reader) view(f *fields) View {
	v := DefaultView()
	if units := f.text("units", false, ""); f.holds("units", stringNode) {
		v.Units = UnitSystem(units)
	}
	o := f.object("overlays", false, "")
	v.Overlays = Overlays{
		DeformedShape: o.flag("deformed_shape", v.Overlays.DeformedShape),
		AxialForce:    o.flag("axial_force", v.Overlays.AxialForce),
		ShearForce:    o.flag("shear_force", v.Overlays.ShearForce),
		BendingMoment: o.flag("bending_moment", v.Overlays.BendingMoment),
		Stress:        o.flag("stress", v.Overlays.Stress),
		Nodes:         o.flag("nodes", v.Overlays.Nodes),
		ExactBand:     o.flag("exact_band", v.Overlays.ExactBand),
	}
	o.finish()
	v.Magnification = f.numberOr("magnification", "(no unit)", v.Magnification)
	v.GridStep = f.numberOr("grid_step", "m", v.GridStep)
	v.DeflectionLimit = f.numberOr("deflection_limit", "(n in span/n)", v.DeflectionLimit)
	v.SafetyFactor = f.numberOr("safety_factor", "(no unit)", v.SafetyFactor)
	f.finish()
	return v
}

// numberOr reads an optional number that defaults to def when absent.
func (f *fields) numberOr(key, unit string, def float64) float64 {
	if f.n == nil || f.n.fields[key] == nil {
		f.get(key, false, "")
		return def
	}
	return f.number(key, unit, false)
}

// holds reports whether the object has key with a value of the given kind.
func (f *fields) holds(key string, kind nodeKind) bool {
	return f.n != nil && f.n.fields[key] != nil && f.n.fields[key].kind == kind
}
