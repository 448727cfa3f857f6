package storage

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"strconv"
	"strings"

	"stave/fem"
)

// FormatName is the value of the "format" key of every Stave project file.
const FormatName = "stave-member"

// Version is the format version this Stave writes and the newest it reads.
const Version = 2

// The file layout. Struct fields, not maps, so that keys come out in a fixed
// order and files diff well. Optional values are left out when zero.
type (
	fileProject struct {
		Format            string            `json:"format"`
		Version           int               `json:"version"`
		Units             unitDeclaration   `json:"units"`
		Notes             fileNotes         `json:"notes,omitzero"`
		Member            fileMember        `json:"member"`
		Supports          []fileSupport     `json:"supports"`
		Hinges            []fileHinge       `json:"hinges,omitempty"`
		Foundations       []fileGround      `json:"foundations,omitempty"`
		Loads             []any             `json:"loads,omitempty"`
		SelfWeight        *fileGravity      `json:"self_weight,omitempty"`
		TemperatureChange number            `json:"temperature_change,omitempty"`
		Cases             []fileCase        `json:"cases,omitempty"`
		Combinations      []fileCombination `json:"combinations,omitempty"`
		Mesh              fileMesh          `json:"mesh"`
		View              fileView          `json:"view"`
	}
	fileNotes struct {
		Project  string `json:"project,omitempty"`
		Member   string `json:"member,omitempty"`
		Engineer string `json:"engineer,omitempty"`
		Date     string `json:"date,omitempty"`
		Text     string `json:"text,omitempty"`
	}
	fileMember struct {
		AxialOnly bool          `json:"axial_only,omitempty"`
		Segments  []fileSegment `json:"segments"`
	}
	fileSegment struct {
		Start                 number       `json:"start"`
		End                   number       `json:"end"`
		Section               fileSection  `json:"section"`
		Material              fileMaterial `json:"material"`
		TemperatureDifference number       `json:"temperature_difference,omitempty"`
		ShearDeformation      bool         `json:"shear_deformation,omitempty"`
	}
	fileSection struct {
		Area             number `json:"area"`
		SecondMoment     number `json:"second_moment"`
		FibreDistance    number `json:"fibre_distance"`
		Depth            number `json:"depth,omitempty"`
		ShearArea        number `json:"shear_area,omitempty"`
		ShearCoefficient number `json:"shear_coefficient,omitempty"`
	}
	fileMaterial struct {
		Name             string `json:"name,omitempty"`
		Elastic          number `json:"elastic_modulus"`
		Density          number `json:"density,omitempty"`
		ThermalExpansion number `json:"thermal_expansion,omitempty"`
		Allowable        number `json:"allowable_stress,omitempty"`
		ShearModulus     number `json:"shear_modulus,omitempty"`
		Poisson          number `json:"poisson,omitempty"`
	}
	fileSupport struct {
		X          number      `json:"x"`
		Kind       string      `json:"kind"`
		Stiffness  *fileMotion `json:"stiffness,omitempty"`
		Settlement *fileMotion `json:"settlement,omitempty"`
	}
	fileHinge struct {
		X         number `json:"x"`
		Stiffness number `json:"stiffness,omitempty"`
	}
	fileGround struct {
		Start        number `json:"start"`
		End          number `json:"end"`
		Modulus      number `json:"modulus,omitempty"`
		AxialModulus number `json:"axial_modulus,omitempty"`
	}
	// fileMotion holds one value per degree of freedom.
	fileMotion struct {
		Axial      number `json:"axial,omitempty"`
		Transverse number `json:"transverse,omitempty"`
		Rotation   number `json:"rotation,omitempty"`
	}
	filePointLoad struct {
		Kind       string `json:"kind"`
		X          number `json:"x"`
		Axial      number `json:"axial,omitempty"`
		Transverse number `json:"transverse,omitempty"`
		Moment     number `json:"moment,omitempty"`
	}
	fileDistributedLoad struct {
		Kind      string      `json:"kind"`
		Direction string      `json:"direction"`
		Points    [][2]number `json:"points"`
	}
	fileGravity struct {
		X number `json:"gravity_x"`
		Y number `json:"gravity_y"`
	}
	fileMesh struct {
		Elements         int    `json:"elements"`
		MaxElementLength number `json:"max_element_length,omitempty"`
		BarOrder         int    `json:"bar_order,omitempty"`
	}
	fileView struct {
		Units           string       `json:"units"`
		Overlays        fileOverlays `json:"overlays"`
		Magnification   number       `json:"magnification"`
		GridStep        number       `json:"grid_step"`
		DeflectionLimit number       `json:"deflection_limit"`
		SafetyFactor    number       `json:"safety_factor"`
	}
	fileOverlays struct {
		DeformedShape bool `json:"deformed_shape"`
		AxialForce    bool `json:"axial_force"`
		ShearForce    bool `json:"shear_force"`
		BendingMoment bool `json:"bending_moment"`
		Stress        bool `json:"stress"`
		Nodes         bool `json:"nodes"`
		ExactBand     bool `json:"exact_band"`
	}
)

// siUnits is the only unit declaration a version 1 file may carry, in file order.
var siUnits = unitDeclaration{
	{"length", "m"},
	{"area", "m²"},
	{"second_moment", "m⁴"},
	{"force", "N"},
	{"moment", "N·m"},
	{"line_load", "N/m"},
	{"stress", "Pa"},
	{"density", "kg/m³"},
	{"acceleration", "m/s²"},
	{"thermal_expansion", "1/K"},
	{"temperature_change", "K"},
	{"rotation", "rad"},
	{"spring", "N/m"},
	{"rotational_spring", "N·m/rad"},
}

// unitDeclaration is the "units" object: what each kind of value is measured in.
type unitDeclaration []struct{ Quantity, Unit string }

func (u unitDeclaration) MarshalJSON() ([]byte, error) {
	var b bytes.Buffer
	b.WriteByte('{')
	for i, e := range u {
		if i > 0 {
			b.WriteByte(',')
		}
		fmt.Fprintf(&b, "%q:%q", e.Quantity, e.Unit)
	}
	b.WriteByte('}')
	return b.Bytes(), nil
}

// Names of the load kinds and directions in files.
const (
	pointKindName       = "point"
	distributedKindName = "distributed"
)

var directionNames = map[fem.Dof]string{fem.Axial: "axial", fem.Transverse: "transverse"}

// number is a float64 written in the shortest form that reads back exactly,
// with a plain exponent (2e11, 8e-6) so that files stay readable.
type number float64

func (n number) MarshalJSON() ([]byte, error) {
	f := float64(n)
	if math.IsNaN(f) || math.IsInf(f, 0) {
		// toFile has already refused these with the place named.
		return nil, fmt.Errorf("%v cannot be written to a file", f)
	}
	s := strconv.FormatFloat(f, 'g', -1, 64)
	if i := strings.IndexByte(s, 'e'); i >= 0 {
		mantissa, exponent := s[:i], strings.TrimPrefix(s[i+1:], "+")
		sign := ""
		if strings.HasPrefix(exponent, "-") {
			sign, exponent = "-", exponent[1:]
		}
		s = mantissa + "e" + sign + strings.TrimLeft(exponent, "0")
	}
	return []byte(s), nil
}

// Marshal returns p as a canonical project file. It refuses values a file
// cannot hold (NaN, infinities, unknown kinds) and names their place, and
// leaves out what fem ignores (the stiffness of a rigid support, the
// settlement of a free motion). It does not otherwise check the model, so work
// in progress can always be saved; Validate tells whether it would load.
func Marshal(p *Project) ([]byte, error) {
	var c converter
	f := c.toFile(p)
	if len(c.problems) > 0 {
		return nil, &SaveError{Problems: c.problems}
	}
	var compact bytes.Buffer
	enc := json.NewEncoder(&compact)
	enc.SetEscapeHTML(false) // notes are for people: keep "<" and "&" readable
	if err := enc.Encode(f); err != nil {
		return nil, fmt.Errorf("storage: cannot encode the project: %w", err)
	}
	var out bytes.Buffer
	indentJSON(&out, bytes.TrimSpace(compact.Bytes()))
	out.WriteByte('\n')
	return out.Bytes(), nil
}

// SaveError lists the values of a project that no file can hold.
type SaveError struct {
	Problems []Problem
}

func (e *SaveError) Error() string {
	return "the project cannot be written:\n" + listProblems(e.Problems)
}

// converter turns a Project into the file layout, noting values it cannot write.
type converter struct {
	problems []Problem
}

func (c *converter) num(path string, v float64) number {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		c.problems = append(c.problems, Problem{Path: path,
			Message: fmt.Sprintf("%v is not a number a file can hold; enter a finite value", v)})
	}
	return number(v)
}

func (c *converter) motion(path string, v [3]float64) *fileMotion {
	if v == [3]float64{} {
		return nil
	}
	return &fileMotion{
		Axial:      c.num(path+".axial", v[fem.Axial]),
		Transverse: c.num(path+".transverse", v[fem.Transverse]),
		Rotation:   c.num(path+".rotation", v[fem.Rotation]),
	}
}

func (c *converter) toFile(p *Project) fileProject {
	m := &p.Model
	f := fileProject{
		Format:            FormatName,
		Version:           Version,
		Units:             siUnits,
		Notes:             fileNotes(p.Notes),
		Member:            fileMember{AxialOnly: m.AxialOnly, Segments: make([]fileSegment, len(m.Segments))},
		Supports:          make([]fileSupport, len(m.Supports)),
		TemperatureChange: c.num("temperature_change", m.TemperatureChange),
		Mesh: fileMesh{
			Elements:         m.Mesh.Elements,
			MaxElementLength: c.num("mesh.max_element_length", m.Mesh.MaxElementLength),
			BarOrder:         int(m.Mesh.BarOrder),
		},
		View: c.view(p.View),
	}
	for i, s := range m.Segments {
		path := fmt.Sprintf("member.segments[%d]", i)
		f.Member.Segments[i] = fileSegment{
			Start: c.num(path+".start", s.Start),
			End:   c.num(path+".end", s.End),
			Section: fileSection{
				Area:             c.num(path+".section.area", s.Section.Area),
				SecondMoment:     c.num(path+".section.second_moment", s.Section.SecondMoment),
				FibreDistance:    c.num(path+".section.fibre_distance", s.Section.FibreDistance),
				Depth:            c.num(path+".section.depth", s.Section.Depth),
				ShearArea:        c.num(path+".section.shear_area", s.Section.ShearArea),
				ShearCoefficient: c.num(path+".section.shear_coefficient", s.Section.ShearCoefficient),
			},
			Material: fileMaterial{
				Name:             s.Material.Name,
				Elastic:          c.num(path+".material.elastic_modulus", s.Material.Elastic),
				Density:          c.num(path+".material.density", s.Material.Density),
				ThermalExpansion: c.num(path+".material.thermal_expansion", s.Material.ThermalExpansion),
				Allowable:        c.num(path+".material.allowable_stress", s.Material.Allowable),
				ShearModulus:     c.num(path+".material.shear_modulus", s.Material.ShearModulus),
				Poisson:          c.num(path+".material.poisson", s.Material.Poisson),
			},
			ShearDeformation:      s.ShearDeformation,
			TemperatureDifference: c.num(path+".temperature_difference", s.TemperatureDifference),
		}
	}
	for i, h := range m.Hinges {
		path := fmt.Sprintf("hinges[%d]", i)
		f.Hinges = append(f.Hinges, fileHinge{X: c.num(path+".x", h.X), Stiffness: c.num(path+".stiffness", h.Stiffness)})
	}
	for i, g := range m.Foundations {
		path := fmt.Sprintf("foundations[%d]", i)
		f.Foundations = append(f.Foundations, fileGround{Start: c.num(path+".start", g.Start), End: c.num(path+".end", g.End),
			Modulus: c.num(path+".modulus", g.Modulus), AxialModulus: c.num(path+".axial_modulus", g.AxialModulus)})
	}
	for i, s := range m.Supports {
		path := fmt.Sprintf("supports[%d]", i)
		fs := fileSupport{X: c.num(path+".x", s.X), Kind: s.Kind.String()}
		if fs.Kind == "unknown" {
			c.problems = append(c.problems, Problem{Path: path + ".kind",
				Message: fmt.Sprintf("support kind %d is unknown; choose one of %s", int(s.Kind), supportKindList)})
		}
		// A spring always writes its stiffness, even all zero, so the key's
		// presence marks the kind; another kind writes the springs it has.
		var stiffness [3]float64
		for d := range stiffness {
			if !s.Kind.Restrains(fem.Dof(d)) {
				stiffness[d] = s.Stiffness[d]
			}
		}
		fs.Stiffness = c.motion(path+".stiffness", stiffness)
		if fs.Stiffness == nil && s.Kind == fem.Spring {
			fs.Stiffness = &fileMotion{}
		}
		// fem ignores the settlement of motions a support leaves free; the file leaves it out.
		var settlement [3]float64
		for d := range settlement {
			if s.Kind.Restrains(fem.Dof(d)) {
				settlement[d] = s.Settlement[d]
			}
		}
		fs.Settlement = c.motion(path+".settlement", settlement)
		f.Supports[i] = fs
	}
	f.Loads = c.loads(p)
	f.Cases, f.Combinations = c.cases(p)
	if m.Gravity != [2]float64{} {
		f.SelfWeight = &fileGravity{X: c.num("self_weight.gravity_x", m.Gravity[0]), Y: c.num("self_weight.gravity_y", m.Gravity[1])}
	}
	return f
}

// loads lists the loads in the project's load order (see Project.LoadOrder).
func (c *converter) loads(p *Project) []any {
	var out []any
	for i, ref := range fileLoads(p) {
		path := fmt.Sprintf("loads[%d]", i)
		if ref.kind == PointLoad {
			out = append(out, c.pointLoad(path, p.Model.PointLoads[ref.index]))
		} else {
			out = append(out, c.distributedLoad(path, p.Model.DistributedLoad[ref.index]))
		}
	}
	return out
}

// pointLoad is l as the file holds it at path.
func (c *converter) pointLoad(path string, l fem.PointLoad) filePointLoad {
	return filePointLoad{
		Kind:       pointKindName,
		X:          c.num(path+".x", l.X),
		Axial:      c.num(path+".axial", l.Axial),
		Transverse: c.num(path+".transverse", l.Transverse),
		Moment:     c.num(path+".moment", l.Moment),
	}
}

// distributedLoad is l as the file holds it at path.
func (c *converter) distributedLoad(path string, l fem.DistributedLoad) fileDistributedLoad {
	fl := fileDistributedLoad{Kind: distributedKindName, Direction: directionNames[l.Direction],
		Points: make([][2]number, len(l.Points))}
	if fl.Direction == "" {
		c.problems = append(c.problems, Problem{Path: path + ".direction",
			Message: fmt.Sprintf("direction %s is not one a distributed load can have; choose axial or transverse", l.Direction)})
	}
	for j, pt := range l.Points {
		pp := fmt.Sprintf("%s.points[%d]", path, j)
		fl.Points[j] = [2]number{c.num(pp+"[0]", pt.X), c.num(pp+"[1]", pt.Intensity)}
	}
	return fl
}

// loadRef names one load of a model.
type loadRef struct {
	kind  LoadKind
	index int // into Model.PointLoads or Model.DistributedLoad
}

// fileLoads gives the loads of p in file order: first as p.LoadOrder says,
// then any loads it does not reach, point loads before distributed ones.
func fileLoads(p *Project) []loadRef {
	return orderedLoads(p.LoadOrder, len(p.Model.PointLoads), len(p.Model.DistributedLoad))
}

// orderedLoads gives points point loads and lines distributed loads in
// file order: as order says, then any it does not reach.
func orderedLoads(order []LoadKind, points, lines int) []loadRef {
	counts := [2]int{points, lines}
	var next [2]int
	refs := make([]loadRef, 0, counts[0]+counts[1])
	for _, k := range order {
		if (k == PointLoad || k == DistributedLoad) && next[k] < counts[k] {
			refs = append(refs, loadRef{k, next[k]})
			next[k]++
		}
	}
	for _, k := range []LoadKind{PointLoad, DistributedLoad} {
		for ; next[k] < counts[k]; next[k]++ {
			refs = append(refs, loadRef{k, next[k]})
		}
	}
	return refs
}

func (c *converter) view(v View) fileView {
	return fileView{
		Units:           string(v.Units),
		Overlays:        fileOverlays(v.Overlays),
		Magnification:   c.num("view.magnification", v.Magnification),
		GridStep:        c.num("view.grid_step", v.GridStep),
		DeflectionLimit: c.num("view.deflection_limit", v.DeflectionLimit),
		SafetyFactor:    c.num("view.safety_factor", v.SafetyFactor),
	}
}
