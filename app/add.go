package app

import (
	"errors"
	"fmt"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/units"
)

// addField is one number of the Add form.
type addField struct {
	key   string // names the field across kinds, so a typed position survives a change of kind
	label string
	q     units.Kind
	place fem.Place // where fem's problems with this value lie (Item is filled in when checking)
	start string    // the text it starts with; "" leaves it empty, to be typed
}

// addKind is one kind of thing the Add form places on the member.
type addKind struct {
	name string
	// fields lists the numbers to type; they may depend on the form's
	// choice (the support kind, the load direction).
	fields func(f *addForm) []addField
	// item is the model item the new thing becomes in m, before it is added.
	item func(m *fem.Model) fem.Item
	// put adds the new thing to m from the values (SI) of the fields.
	put func(f *addForm, m *fem.Model, v map[string]float64) error
	// selects is what to select once added.
	selects canvas.RefKind
}

// Directions of a line load as the form names them.
const (
	upwardText = "transverse (+ up)"
	axialText  = "axial (+ along x)"
)

var positionField = addField{key: "x", label: "Position x", q: units.Position, place: fem.Place{Property: fem.PositionProperty}}

var addKinds = []addKind{
	{
		name: "Support",
		fields: func(f *addForm) []addField {
			fs := []addField{positionField}
			k := f.supportKind()
			// A settlement for each motion the kind holds, a stiffness for
			// each it leaves free: a roller may turn against a spring.
			start := [3]float64{}
			if k == fem.Spring {
				start = [3]float64{1e7, 1e6, 0} // as the support tool places them
			}
			for d, q := range []units.Kind{units.Deflection, units.Deflection, units.Rotation} {
				dof := fem.Dof(d)
				if k.Restrains(dof) {
					fs = append(fs, addField{key: "s" + dof.String(), label: capital(dof.String()) + " settlement", q: q,
						place: fem.Place{Property: fem.SettlementProperty, Dof: dof}, start: "0"})
					continue
				}
				q := stiffnessKinds[d]
				fs = append(fs, addField{key: "k" + dof.String(), label: stiffnessNames[d] + ", 0 = free", q: q,
					place: fem.Place{Property: fem.MotionStiffnessProperty, Dof: dof}, start: f.w.units.Format(q, start[d])})
			}
			return fs
		},
		item: func(m *fem.Model) fem.Item { return fem.Item{Kind: fem.SupportItem, Index: len(m.Supports)} },
		put: func(f *addForm, m *fem.Model, v map[string]float64) error {
			s := fem.Support{X: v["x"], Kind: f.supportKind()}
			for d := range 3 {
				s.Stiffness[d] = v["k"+fem.Dof(d).String()]
				s.Settlement[d] = v["s"+fem.Dof(d).String()]
			}
			m.Supports = append(m.Supports, s)
			return nil
		},
		selects: canvas.Support,
	},
	{
		name: "Point load",
		fields: func(*addForm) []addField {
			return []addField{positionField,
				{key: "axial", label: "Axial force (+ along x)", q: units.Force, place: fem.Place{Property: fem.AxialForceProperty}, start: "0"},
				{key: "transverse", label: "Transverse force (+ up)", q: units.Force, place: fem.Place{Property: fem.TransverseForceProperty}, start: "0"},
				momentField}
		},
		item: func(m *fem.Model) fem.Item { return fem.Item{Kind: fem.PointLoadItem, Index: len(m.PointLoads)} },
		put: func(_ *addForm, m *fem.Model, v map[string]float64) error {
			if v["axial"] == 0 && v["transverse"] == 0 && v["moment"] == 0 {
				return locatedError{"transverse", "the forces and the moment are all zero: type at least one of them"}
			}
			m.PointLoads = append(m.PointLoads, fem.PointLoad{X: v["x"], Axial: v["axial"], Transverse: v["transverse"], Moment: v["moment"]})
			return nil
		},
		selects: canvas.PointLoad,
	},
	{
		name:   "Moment",
		fields: func(*addForm) []addField { return []addField{positionField, momentField} },
		item:   func(m *fem.Model) fem.Item { return fem.Item{Kind: fem.PointLoadItem, Index: len(m.PointLoads)} },
		put: func(_ *addForm, m *fem.Model, v map[string]float64) error {
			if v["moment"] == 0 {
				return locatedError{"moment", "a moment of zero does nothing: type its value"}
			}
			m.PointLoads = append(m.PointLoads, fem.PointLoad{X: v["x"], Moment: v["moment"]})
			return nil
		},
		selects: canvas.PointLoad,
	},
	{
		name: "Line load",
		fields: func(*addForm) []addField {
			point := func(key, label string, q units.Kind, p fem.Property, vertex int) addField {
				return addField{key: key, label: label, q: q, place: fem.Place{Property: p, Vertex: vertex}}
			}
			return []addField{
				point("start", "Start x", units.Position, fem.PointXProperty, 0),
				point("end", "End x", units.Position, fem.PointXProperty, 1),
				point("qstart", "Intensity at the start", units.LineLoad, fem.PointIntensityProperty, 0),
				point("qend", "Intensity at the end", units.LineLoad, fem.PointIntensityProperty, 1),
			}
		},
		item: func(m *fem.Model) fem.Item {
			return fem.Item{Kind: fem.DistributedLoadItem, Index: len(m.DistributedLoad)}
		},
		put: func(f *addForm, m *fem.Model, v map[string]float64) error {
			if v["qstart"] == 0 && v["qend"] == 0 {
				return locatedError{"qstart", "both intensities are zero: type at least one of them"}
			}
			dir := fem.Transverse
			if f.choice.Selected == axialText {
				dir = fem.Axial
			}
			m.DistributedLoad = append(m.DistributedLoad, fem.DistributedLoad{Direction: dir,
				Points: []fem.LoadPoint{{X: v["start"], Intensity: v["qstart"]}, {X: v["end"], Intensity: v["qend"]}}})
			return nil
		},
		selects: canvas.DistributedLoad,
	},
	{
		name: "Hinge",
		fields: func(*addForm) []addField {
			return []addField{positionField,
				{key: "khinge", label: "Stiffness across it, 0 = pure hinge", q: units.RotationalStiffness,
					place: fem.Place{Property: fem.StiffnessProperty}, start: "0"}}
		},
		item: func(m *fem.Model) fem.Item { return fem.Item{Kind: fem.HingeItem, Index: len(m.Hinges)} },
		put: func(_ *addForm, m *fem.Model, v map[string]float64) error {
			m.Hinges = append(m.Hinges, fem.Hinge{X: v["x"], Stiffness: v["khinge"]})
			return nil
		},
		selects: canvas.Hinge,
	},
	{
		name: "Foundation",
		fields: func(*addForm) []addField {
			field := func(key, label string, q units.Kind, p fem.Property, start string) addField {
				return addField{key: key, label: label, q: q, place: fem.Place{Property: p}, start: start}
			}
			return []addField{
				field("start", "Start x", units.Position, fem.StartProperty, ""),
				field("end", "End x", units.Position, fem.EndProperty, ""),
				field("modulus", "Modulus across the member", units.FoundationModulus, fem.ModulusProperty, ""),
				field("axialmodulus", "Modulus along the member, 0 = free", units.FoundationModulus, fem.AxialModulusProperty, "0"),
			}
		},
		item: func(m *fem.Model) fem.Item { return fem.Item{Kind: fem.FoundationItem, Index: len(m.Foundations)} },
		put: func(_ *addForm, m *fem.Model, v map[string]float64) error {
			m.Foundations = append(m.Foundations, fem.Foundation{Start: v["start"], End: v["end"], Modulus: v["modulus"], AxialModulus: v["axialmodulus"]})
			return nil
		},
		selects: canvas.Foundation,
	},
	{
		name:   "Segment break",
		fields: func(*addForm) []addField { return []addField{positionField} },
		// The break makes two segments of one: any problem with segments is the position's.
		item: func(*fem.Model) fem.Item { return fem.Item{Kind: fem.SegmentItem, Index: -1} },
		put: func(_ *addForm, m *fem.Model, v map[string]float64) error {
			if err := splitSegment(m, v["x"]); err != nil {
				return locatedError{"x", err.Error()}
			}
			return nil
		},
		selects: canvas.Segment,
	},
}

// stiffnessKinds and stiffnessNames are the kinds and names of a support's
// stiffness per motion.
var (
	stiffnessKinds = [3]units.Kind{units.TranslationalStiffness, units.TranslationalStiffness, units.RotationalStiffness}
	stiffnessNames = [3]string{"Axial stiffness", "Transverse stiffness", "Rotational stiffness"}
)

var momentField = addField{key: "moment", label: "Moment (+ counter-clockwise)", q: units.Moment, place: fem.Place{Property: fem.MomentProperty}, start: "0"}

// locatedError is a problem with the value of one field.
type locatedError struct {
	key, message string
}

func (e locatedError) Error() string { return e.message }

func capital(s string) string { return strings.ToUpper(s[:1]) + s[1:] }

// addForm places a support, load, hinge, foundation or segment break typed
// in display units.
type addForm struct {
	w       *Window
	kind    *escSelect // what to add
	choice  *escSelect // the support kind or the load direction; hidden when the kind has none
	form    *fyne.Container
	hint    *widget.Label
	message *widget.Label
	content fyne.CanvasObject

	current addKind
	fields  []addField
	entries map[string]*escEntry // by field key, kept across kinds
	labels  map[string]*widget.Label
	onAdded func()
}

func newAddForm(w *Window) *addForm {
	f := &addForm{w: w, entries: map[string]*escEntry{}, labels: map[string]*widget.Label{},
		form: container.New(layout.NewFormLayout()), message: widget.NewLabel(""), hint: widget.NewLabel("")}
	f.message.Wrapping = fyne.TextWrapWord
	f.message.Importance = widget.DangerImportance
	f.hint.Wrapping = fyne.TextWrapWord
	f.hint.Importance = widget.LowImportance
	names := make([]string, len(addKinds))
	for i, k := range addKinds {
		names[i] = k.name
	}
	f.choice = newEscSelect(nil, func(string) { f.showFields() })
	f.kind = newEscSelect(names, func(name string) { f.choose(name) })
	f.choice.OnEscape, f.kind.OnEscape = w.escape, w.escape
	f.content = container.NewVBox(f.form, f.hint, f.message)
	f.kind.SetSelected(names[0])
	return f
}

// choose switches the form to the kind called name.
func (f *addForm) choose(name string) {
	for _, k := range addKinds {
		if k.name != name {
			continue
		}
		f.current = k
		switch name {
		case "Support":
			names := make([]string, len(supportKinds))
			for i, s := range supportKinds {
				names[i] = s.String()
			}
			f.choice.Options = names
			f.choice.Selected = f.w.kind.String()
		case "Line load":
			f.choice.Options = []string{upwardText, axialText}
			f.choice.Selected = upwardText
		default:
			f.choice.Options = nil
		}
		f.choice.Refresh()
		f.showFields()
	}
}

// supportKind is the support kind chosen.
func (f *addForm) supportKind() fem.SupportKind {
	k, ok := fem.ParseSupportKind(f.choice.Selected)
	if !ok {
		return f.w.kind
	}
	return k
}

// showFields lays out the fields of the current kind and choice.
func (f *addForm) showFields() {
	u := f.w.units
	f.fields = f.current.fields(f)
	f.form.Objects = []fyne.CanvasObject{widget.NewLabel("Add"), f.kind}
	switch f.current.name {
	case "Support":
		f.form.Add(widget.NewLabel("Kind"))
		f.form.Add(f.choice)
	case "Line load":
		f.form.Add(widget.NewLabel("Direction"))
		f.form.Add(f.choice)
	}
	for _, fd := range f.fields {
		e, ok := f.entries[fd.key]
		if !ok {
			e = newEscEntry()
			e.OnEscape = f.w.escape
			e.SetText(fd.start)
			e.OnSubmitted = func(string) { f.submit() }
			f.entries[fd.key] = e
			f.labels[fd.key] = widget.NewLabel("")
		}
		e.SetPlaceHolder("in " + u.Unit(fd.q).Symbol)
		if fd.q == units.Position {
			e.SetPlaceHolder("in " + u.Unit(fd.q).Symbol + " from the left end")
		}
		l := f.labels[fd.key]
		l.SetText(fd.label + " (" + u.Unit(fd.q).Symbol + ")")
		l.Importance = widget.MediumImportance
		f.form.Add(l)
		f.form.Add(e)
	}
	f.form.Refresh()
	f.hint.SetText(fmt.Sprintf("A number alone is in the unit shown; one with a unit is converted (e.g. 12 %s, or %s for a position). Loads follow the signs in brackets: a downward force is negative. The member is %s long.",
		u.Unit(units.Force).Symbol, "250 "+u.Unit(units.Dimension).Symbol, f.w.position(f.w.project.Model.Length())))
	f.message.SetText("")
}

// submit checks the typed values and, when they make a valid model, adds
// the new thing as one undoable edit and reports true. Otherwise it lists
// each problem under the name of its field, marks those fields, changes
// nothing and reports false.
func (f *addForm) submit() bool {
	w := f.w
	for _, l := range f.labels {
		l.Importance = widget.MediumImportance
		l.Refresh()
	}
	if len(w.project.Model.Segments) == 0 {
		f.message.SetText("There is no member yet: type its length under Properties (or drag with the Member tool), then add to it.")
		return false
	}
	values := map[string]float64{}
	var problems []string
	for _, fd := range f.fields {
		text := strings.TrimSpace(f.entries[fd.key].Text)
		if text == "" {
			problems = append(problems, f.located(fd.key, "type a value, such as "+exampleOf(w.units, fd.q)))
			continue
		}
		v, err := w.units.Parse(fd.q, text)
		if err != nil {
			problems = append(problems, f.located(fd.key, err.Error()))
			continue
		}
		values[fd.key] = v
	}
	if len(problems) == 0 {
		cand := w.project.Model.Clone()
		item := f.current.item(&cand)
		var located locatedError
		err := f.current.put(f, &cand, values)
		if errors.As(err, &located) {
			problems = append(problems, f.located(located.key, located.message))
		} else if err == nil {
			problems = f.modelProblems(&cand, item)
		}
	}
	if len(problems) > 0 {
		f.message.SetText(strings.Join(problems, "\n"))
		return false
	}
	k := f.current
	what := strings.ToLower(k.name)
	if k.name == "Support" {
		what = f.supportKind().String() + " support"
	}
	name := fmt.Sprintf("add a %s at x = %s", what, w.position(values["x"]))
	if k.name == "Line load" || k.name == "Foundation" {
		name = fmt.Sprintf("add a %s from x = %s to %s", what, w.position(values["start"]), w.position(values["end"]))
	}
	var item fem.Item
	if w.apply(name, func(m *fem.Model) error {
		item = k.item(m)
		return k.put(f, m, values)
	}) != nil {
		f.message.SetText(w.status.Text)
		return false
	}
	if k.selects == canvas.Segment {
		item.Index = w.project.Model.SegmentAt(values["x"])
	}
	w.selectItem(canvas.Ref{Kind: k.selects, Index: item.Index})
	if f.onAdded != nil {
		f.onAdded()
	}
	return true
}

// located is message under the label of field key, which it marks.
func (f *addForm) located(key, message string) string {
	label := key
	for _, fd := range f.fields {
		if fd.key == key {
			label = fd.label
		}
	}
	if l, ok := f.labels[key]; ok {
		l.Importance = widget.DangerImportance
		l.Refresh()
	}
	return label + ": " + message
}

// modelProblems validates m with the new item in it; problems of the new
// item are placed under the field that holds the value, others stand alone.
func (f *addForm) modelProblems(m *fem.Model, item fem.Item) []string {
	var invalid *fem.ValidationError
	if err := f.w.validate(m); !errors.As(err, &invalid) {
		if err != nil {
			return []string{err.Error()}
		}
		return nil
	}
	var out []string
	for _, p := range invalid.Problems {
		key := ""
		for _, fd := range f.fields {
			at := fd.place
			at.Item = item
			if p.Place == at || f.current.name == "Segment break" && p.Item.Kind == fem.SegmentItem {
				key = fd.key
			}
		}
		if key == "" {
			out = append(out, p.Message)
			continue
		}
		out = append(out, f.located(key, p.Message))
	}
	return out
}

// exampleOf is a value of kind q as one could type it in system u.
func exampleOf(u units.System, q units.Kind) string {
	return "2.5 " + u.Unit(q).Symbol
}

// showAddForm opens the Add form in a dialog; it closes once something is added.
func (w *Window) showAddForm() {
	f := newAddForm(w)
	d, _ := w.newDialog("Add to the member", f.content, choice{label: "Cancel"},
		choice{label: "Add", importance: widget.HighImportance, run: func() { f.submit() }, stays: true})
	f.onAdded = d.Hide
	d.Resize(fyne.NewSize(600, 470))
	w.showDialog(d)
	if e, ok := f.entries[f.fields[0].key]; ok {
		w.win.Canvas().Focus(e)
	}
}
