package app

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"stave/canvas"
	"stave/fem"
	"stave/fem/units"
)

// field is one number of the selected item, shown and typed in display units.
type field struct {
	label string
	q     units.Kind
	get   func(m *fem.Model) float64
	set   func(m *fem.Model, v float64)
}

// fieldsFor lists the editable numbers of the item r.
func fieldsFor(m *fem.Model, r canvas.Ref) []field {
	i := r.Index
	pos := func(label string, p func(m *fem.Model) *float64) field {
		return field{label, units.Position, func(m *fem.Model) float64 { return *p(m) }, func(m *fem.Model, v float64) { *p(m) = v }}
	}
	num := func(label string, q units.Kind, p func(m *fem.Model) *float64) field {
		f := pos(label, p)
		f.q = q
		return f
	}
	switch r.Kind {
	case canvas.None, canvas.Member, canvas.MemberEnd:
		if len(m.Segments) == 0 {
			return []field{{"Length", units.Position, func(*fem.Model) float64 { return 0 },
				func(m *fem.Model, v float64) { _ = setLength(m, v) }}}
		}
		return []field{
			{"Length", units.Position, func(m *fem.Model) float64 { return m.Length() }, func(m *fem.Model, v float64) { _ = setLength(m, v) }},
			num("Temperature change", units.TemperatureChange, func(m *fem.Model) *float64 { return &m.TemperatureChange }),
			num("Gravity along x", units.Acceleration, func(m *fem.Model) *float64 { return &m.Gravity[0] }),
			num("Gravity across (up +)", units.Acceleration, func(m *fem.Model) *float64 { return &m.Gravity[1] }),
		}
	case canvas.Segment:
		s := func(m *fem.Model) *fem.Segment { return &m.Segments[i] }
		return []field{
			pos("End x", func(m *fem.Model) *float64 { return &s(m).End }),
			num("Area A", units.Area, func(m *fem.Model) *float64 { return &s(m).Section.Area }),
			num("Second moment I", units.SecondMoment, func(m *fem.Model) *float64 { return &s(m).Section.SecondMoment }),
			num("Extreme fibre c", units.Dimension, func(m *fem.Model) *float64 { return &s(m).Section.FibreDistance }),
			num("Young's modulus E", units.Modulus, func(m *fem.Model) *float64 { return &s(m).Material.Elastic }),
			num("Density", units.Density, func(m *fem.Model) *float64 { return &s(m).Material.Density }),
			num("Thermal expansion α", units.ThermalExpansion, func(m *fem.Model) *float64 { return &s(m).Material.ThermalExpansion }),
			num("Allowable stress (0 = none)", units.Stress, func(m *fem.Model) *float64 { return &s(m).Material.Allowable }),
			num("Temperature ΔT (bottom − top)", units.TemperatureChange, func(m *fem.Model) *float64 { return &s(m).TemperatureDifference }),
			num("Depth h (0 = 2c)", units.Dimension, func(m *fem.Model) *float64 { return &s(m).Section.Depth }),
			// Shown with shear deformation off too, so they can be typed
			// before it is switched on (it needs them).
			num("Shear area As (0 = κ·A)", units.Area, func(m *fem.Model) *float64 { return &s(m).Section.ShearArea }),
			num("Shear coefficient κ", ratio, func(m *fem.Model) *float64 { return &s(m).Section.ShearCoefficient }),
			num("Shear modulus G (0 = from E, ν)", units.Modulus, func(m *fem.Model) *float64 { return &s(m).Material.ShearModulus }),
			num("Poisson's ratio ν", ratio, func(m *fem.Model) *float64 { return &s(m).Material.Poisson }),
		}
	case canvas.Support:
		s := func(m *fem.Model) *fem.Support { return &m.Supports[i] }
		fs := []field{pos("x", func(m *fem.Model) *float64 { return &s(m).X })}
		k := m.Supports[i].Kind
		// A settlement for each motion the kind holds, a stiffness for each
		// it leaves free (a mixed support: a roller that turns against a spring).
		for d, q := range []units.Kind{units.Deflection, units.Deflection, units.Rotation} {
			dof := fem.Dof(d)
			if k.Restrains(dof) {
				fs = append(fs, num("Settlement "+dof.String(), q, func(m *fem.Model) *float64 { return &s(m).Settlement[d] }))
			} else {
				fs = append(fs, num(stiffnessNames[d]+" (0 = free)", stiffnessKinds[d], func(m *fem.Model) *float64 { return &s(m).Stiffness[d] }))
			}
		}
		return fs
	case canvas.Hinge:
		h := func(m *fem.Model) *fem.Hinge { return &m.Hinges[i] }
		return []field{
			pos("x", func(m *fem.Model) *float64 { return &h(m).X }),
			num("Rotational stiffness (0 = pure hinge)", units.RotationalStiffness, func(m *fem.Model) *float64 { return &h(m).Stiffness }),
		}
	case canvas.Foundation:
		f := func(m *fem.Model) *fem.Foundation { return &m.Foundations[i] }
		return []field{
			pos("Start x", func(m *fem.Model) *float64 { return &f(m).Start }),
			pos("End x", func(m *fem.Model) *float64 { return &f(m).End }),
			num("Modulus across", units.FoundationModulus, func(m *fem.Model) *float64 { return &f(m).Modulus }),
			num("Modulus along (0 = free)", units.FoundationModulus, func(m *fem.Model) *float64 { return &f(m).AxialModulus }),
		}
	case canvas.PointLoad:
		p := func(m *fem.Model) *fem.PointLoad { return &m.PointLoads[i] }
		return []field{
			pos("x", func(m *fem.Model) *float64 { return &p(m).X }),
			num("Axial force (+ along x)", units.Force, func(m *fem.Model) *float64 { return &p(m).Axial }),
			num("Transverse force (+ up)", units.Force, func(m *fem.Model) *float64 { return &p(m).Transverse }),
			num("Moment (+ counter-clockwise)", units.Moment, func(m *fem.Model) *float64 { return &p(m).Moment }),
		}
	case canvas.DistributedLoad, canvas.LoadVertex:
		var fs []field
		for k := range m.DistributedLoad[i].Points {
			pt := func(m *fem.Model) *fem.LoadPoint { return &m.DistributedLoad[i].Points[k] }
			fs = append(fs,
				pos(fmt.Sprintf("Vertex %d x", k+1), func(m *fem.Model) *float64 { return &pt(m).X }),
				num(fmt.Sprintf("Vertex %d intensity", k+1), units.LineLoad, func(m *fem.Model) *float64 { return &pt(m).Intensity }))
		}
		return fs
	}
	return nil
}

// propertiesPanel is the state of the panel for the selected item.
type propertiesPanel struct {
	key     string // what the panel was built for; a new key rebuilds it
	fields  []field
	entries []*escEntry
	shown   []string // the text each entry was last given
}

// panelKey says which widgets the panel for r needs: the same key means the
// panel can be kept and only its values updated. Rebuilding on every edit
// would create widgets (and Fyne's cached renderers for them) at the rate
// of mouse events during a drag.
func panelKey(m *fem.Model, r canvas.Ref, fields []field, u units.System) string {
	k := fmt.Sprintf("%v|%s|", r, u.Name)
	for _, f := range fields {
		k += f.label + "|"
	}
	switch r.Kind {
	case canvas.Support:
		k += m.Supports[r.Index].Kind.String()
	case canvas.DistributedLoad, canvas.LoadVertex:
		k += m.DistributedLoad[r.Index].Direction.String()
	case canvas.Segment:
		k += fmt.Sprintf("%s|%v", m.Segments[r.Index].Material.Name, m.Segments[r.Index].ShearDeformation)
	case canvas.None, canvas.Member, canvas.MemberEnd:
		k += fmt.Sprint(m.AxialOnly)
	}
	return k
}

// showProperties shows the selected item in the properties panel.
func (c *controls) showProperties() {
	w := c.w
	m := &w.project.Model
	r := w.selected
	if r.Kind == canvas.Element {
		c.showElementLoads(r.Index)
		return
	}
	title := "Member"
	if r.Kind != canvas.None && r.Kind != canvas.MemberEnd {
		title = describeRef(r)
	}
	fields := fieldsFor(m, r)
	p := &c.panel
	key := panelKey(m, r, fields, w.units)
	if key == p.key {
		for k, f := range fields {
			text := w.formatField(f.q, f.get(m))
			if p.entries[k].Text == p.shown[k] { // leave what the user is typing
				p.entries[k].SetText(text)
			}
			p.shown[k] = text
		}
		return
	}
	p.key = key
	message := widget.NewLabel("")
	message.Wrapping = fyne.TextWrapWord
	message.Importance = widget.DangerImportance
	entries := make([]*escEntry, len(fields))
	shown := make([]string, len(fields))
	p.fields, p.entries, p.shown = fields, entries, shown
	form := container.New(layout.NewFormLayout())
	applyAll := func() {
		if err := w.applyFields(title, r, fields, entries, shown); err != nil {
			message.SetText(err.Error())
			message.Show()
			return
		}
		c.panel.key = "" // show the applied values as the panel formats them
		c.showProperties()
	}
	for k, f := range fields {
		e := newEscEntry()
		e.OnEscape = w.escape
		shown[k] = w.formatField(f.q, f.get(m))
		e.SetText(shown[k])
		e.OnSubmitted = func(string) { applyAll() }
		entries[k] = e
		label := widget.NewLabel(f.label)
		if r.Kind == canvas.LoadVertex && strings.HasPrefix(f.label, fmt.Sprintf("Vertex %d ", r.Vertex+1)) {
			label.TextStyle.Bold = true
		}
		form.Add(label)
		form.Add(e)
	}
	objects := c.choices(r)
	objects = append(objects, form)
	if len(fields) > 0 {
		hint := widget.NewLabel(w.typingHint(fields))
		hint.Wrapping = fyne.TextWrapWord
		hint.Importance = widget.LowImportance
		objects = append(objects, hint)
	}
	if r.Kind == canvas.Segment {
		objects = append(objects, c.materialName(r.Index, message))
	}
	// The buttons stay in view below the fields, which scroll.
	var buttons []fyne.CanvasObject
	if len(fields) > 0 {
		apply := w.newButton("Apply", nil, applyAll)
		apply.Importance = widget.HighImportance
		buttons = append(buttons, apply)
	}
	if r.Kind != canvas.None {
		buttons = append(buttons, w.newButton("Delete "+describe(r), theme.DeleteIcon(), w.deleteSelected))
	}
	message.Hide() // until there is something to say
	foot := container.NewVBox(message, newFlow(buttons...))
	scroll := container.NewVScroll(container.NewVBox(objects...))
	followFocus(scroll)
	c.properties.Objects = []fyne.CanvasObject{container.NewBorder(heading("Properties — "+title), foot, nil, nil, scroll)}
	c.properties.Refresh()
}

// ratio is the kind of a field that has no unit (κ, ν): a plain number.
const ratio units.Kind = -1

// formatField shows an SI value of kind q as its entry shows it.
func (w *Window) formatField(q units.Kind, v float64) string {
	if q == ratio {
		return units.FormatNumber(v)
	}
	return w.units.Format(q, v)
}

// parseField reads what was typed for a value of kind q, in SI.
func (w *Window) parseField(q units.Kind, text string) (float64, error) {
	if q != ratio {
		return w.units.Parse(q, text)
	}
	v, err := strconv.ParseFloat(strings.TrimSpace(text), 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("expected a plain number with no unit, such as 0.3; got '%s'", strings.TrimSpace(text))
	}
	return v, nil
}

// typingHint says how typed numbers are read, with an example in the
// display units of the panel's first load, or else of its first field.
func (w *Window) typingHint(fields []field) string {
	q := fields[0].q
	for _, f := range fields {
		if f.q == units.Force || f.q == units.Moment || f.q == units.LineLoad {
			q = f.q
			break
		}
	}
	return fmt.Sprintf("Enter or Apply applies. A number alone is in the unit shown; a number with a unit is converted: e.g. 12 %s.", w.units.Unit(q).Symbol)
}

// materialName is the entry of a segment's material name, which must be
// a label a file can hold (storage's rules).
func (c *controls) materialName(i int, message *widget.Label) fyne.CanvasObject {
	w := c.w
	name := newEscEntry()
	name.OnEscape = w.escape
	name.SetText(w.project.Model.Segments[i].Material.Name)
	name.OnSubmitted = func(s string) {
		p := cloneProject(w.project)
		p.Model.Segments[i].Material.Name = s
		if problems := textProblems(&p, fmt.Sprintf("member.segments[%d].material.name", i)); len(problems) > 0 {
			message.SetText("Material name: " + problems[0].Message)
			message.Show()
			return
		}
		message.Hide()
		w.apply(fmt.Sprintf("rename the material of segment %d", i+1), func(m *fem.Model) error {
			m.Segments[i].Material.Name = s
			return nil
		})
	}
	return container.NewBorder(nil, nil, widget.NewLabel("Material name"), nil, name)
}

// choices are the non-numeric settings of the item r, applied as soon as changed.
func (c *controls) choices(r canvas.Ref) []fyne.CanvasObject {
	w := c.w
	m := &w.project.Model
	switch r.Kind {
	case canvas.Support:
		names := make([]string, len(supportKinds))
		for i, k := range supportKinds {
			names[i] = k.String()
		}
		s := w.newSelect(names, nil)
		s.SetSelected(m.Supports[r.Index].Kind.String())
		s.OnChanged = func(name string) {
			k, _ := fem.ParseSupportKind(name)
			if k != w.project.Model.Supports[r.Index].Kind {
				w.apply(fmt.Sprintf("make %s %s", describe(r), name), func(m *fem.Model) error {
					s := &m.Supports[r.Index]
					s.Kind = k
					for d := range s.Stiffness { // a spring where the kind now holds rigidly goes
						if k.Restrains(fem.Dof(d)) {
							s.Stiffness[d] = 0
						}
					}
					return nil
				})
			}
		}
		return []fyne.CanvasObject{container.NewBorder(nil, nil, widget.NewLabel("Kind"), nil, s)}
	case canvas.DistributedLoad, canvas.LoadVertex:
		s := w.newSelect([]string{"transverse (+ up)", "axial (+ along x)"}, nil)
		dir := m.DistributedLoad[r.Index].Direction
		if dir == fem.Axial {
			s.SetSelected("axial (+ along x)")
		} else {
			s.SetSelected("transverse (+ up)")
		}
		s.OnChanged = func(name string) {
			d := fem.Transverse
			if strings.HasPrefix(name, "axial") {
				d = fem.Axial
			}
			if d != w.project.Model.DistributedLoad[r.Index].Direction {
				w.apply(fmt.Sprintf("make distributed load %d %s", r.Index+1, d), func(m *fem.Model) error {
					m.DistributedLoad[r.Index].Direction = d
					return nil
				})
			}
		}
		return []fyne.CanvasObject{container.NewBorder(nil, nil, widget.NewLabel("Direction"), nil, s)}
	case canvas.Segment:
		return []fyne.CanvasObject{c.toggle("Shear deformation (Timoshenko beam)",
			m.Segments[r.Index].ShearDeformation, fmt.Sprintf("shear deformation of segment %d", r.Index+1),
			func(m *fem.Model) *bool { return &m.Segments[r.Index].ShearDeformation })}
	case canvas.None, canvas.Member, canvas.MemberEnd:
		if len(m.Segments) == 0 {
			return nil
		}
		return []fyne.CanvasObject{c.toggle("Axial only (tie or strut)", m.AxialOnly, "axial only",
			func(m *fem.Model) *bool { return &m.AxialOnly })}
	}
	return nil
}

// toggle is a check box for the setting at, applied as one edit named
// after what when it changes.
func (c *controls) toggle(label string, on bool, what string, at func(m *fem.Model) *bool) fyne.CanvasObject {
	w := c.w
	box := w.newCheck(label, nil)
	box.SetChecked(on)
	box.OnChanged = func(on bool) {
		if on == *at(&w.project.Model) {
			return
		}
		name := "switch off " + what
		if on {
			name = "switch on " + what
		}
		if w.apply(name, func(m *fem.Model) error { *at(m) = on; return nil }) != nil {
			box.SetChecked(!on) // refused: show what the model holds
		}
	}
	return box
}

// applyFields parses the changed entries and applies them together as one
// edit; a value that does not parse, or a model that does not validate,
// changes nothing. Untouched entries are skipped because they show values
// rounded to four figures.
func (w *Window) applyFields(title string, r canvas.Ref, fields []field, entries []*escEntry, shown []string) error {
	values := make([]float64, len(fields))
	changed := make([]bool, len(fields))
	anyChanged := false
	for k, f := range fields {
		if entries[k].Text == shown[k] {
			continue
		}
		changed[k], anyChanged = true, true
		v, err := w.parseField(f.q, entries[k].Text)
		if err != nil {
			return fmt.Errorf("%s: %v", f.label, err)
		}
		values[k] = v
	}
	if !anyChanged {
		return nil
	}
	var names []string
	for k, f := range fields {
		if changed[k] {
			names = append(names, strings.ToLower(f.label[:1])+f.label[1:])
		}
	}
	name := "edit " + strings.ToLower(title[:1]) + title[1:] + ": " + strings.Join(names, ", ")
	return w.apply(name, func(m *fem.Model) error {
		for k, f := range fields {
			if !changed[k] {
				continue
			}
			if r.Kind <= canvas.MemberEnd && k == 0 && !(values[0] > 0) {
				return fmt.Errorf("the member length must be positive; got %s", w.units.Format(units.Position, values[0]))
			}
			f.set(m, values[k])
		}
		return nil
	})
}
