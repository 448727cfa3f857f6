package app

import (
	"regexp"
	"strings"
	"testing"

	"fyne.io/fyne/v2"

	"stave/fem"
	"stave/fem/units"
)

// A refused edit is explained in the units the window shows: a US window
// quoted "support 2 at x = 6.096 m lies outside the member (length 5.5 m)"
// for a support typed at 20 ft. Factors exact, NIST SP 811 (2008),
// Appendix B: 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N,
// 1 kip = 1000 lbf.
func TestValidationMessagesInWindowUnits(t *testing.T) {
	const (
		ft  = 0.3048
		in  = 0.0254
		kip = 4448.2216152605
	)
	for _, c := range []struct {
		name   string
		system units.System
		change func(m *fem.Model)
		want   string
	}{
		// The demo member is 5.5 m long: 5.5/0.3048 = 18.0446 ft.
		{"support past the end", units.USCustomary, func(m *fem.Model) { m.Supports[1].X = 20 * ft },
			"support 2 at x = 20.0 ft lies outside the member (length 18.0446 ft)"},
		{"support past the end", units.SI, func(m *fem.Model) { m.Supports[1].X = 6 },
			"support 2 at x = 6.0 m lies outside the member (length 5.5 m)"},
		{"negative spring", units.USCustomary, func(m *fem.Model) {
			m.Supports[1].Kind, m.Supports[1].Stiffness[fem.Transverse] = fem.Spring, -5*kip/in
		}, "the transverse spring stiffness is -5.0 kip/in: it must not be negative"},
		{"negative spring", units.SI, func(m *fem.Model) {
			m.Supports[1].Kind, m.Supports[1].Stiffness[fem.Transverse] = fem.Spring, -5e3
		}, "the transverse spring stiffness is -5.0 kN/m: it must not be negative"},
		{"negative modulus", units.USCustomary, func(m *fem.Model) { m.Segments[0].Material.Elastic = -29000 * kip / (in * in) },
			"Young's modulus E is -29000.0 ksi: it must be positive"},
		{"negative hinge stiffness", units.USCustomary, func(m *fem.Model) {
			m.Hinges = []fem.Hinge{{X: 1, Stiffness: -100 * kip * ft}}
		}, "hinge 1: the rotational stiffness is -100.0 kip·ft/rad: it must not be negative"},
		{"distributed load point past the end", units.USCustomary, func(m *fem.Model) {
			m.DistributedLoad[0].Points[1].X = 20 * ft
		}, "point 2 at x = 20.0 ft lies outside the member (length 18.0446 ft)"},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		w.setUnits(c.system)
		err := w.apply("edit", func(m *fem.Model) error { c.change(m); return nil })
		if err == nil {
			t.Errorf("%s in %s: the edit was applied", c.name, c.system.Name)
			continue
		}
		if !strings.Contains(err.Error(), c.want) || !strings.Contains(w.status.Text, c.want) {
			t.Errorf("%s in %s: the window says %q, want it to say %q", c.name, c.system.Name, w.status.Text, c.want)
		}
	}
}

// The moving-loads window explains a train it refuses in the window's
// units too: a US window said "the step is -0.6096 m" for a step typed as
// -2 (ft). 1 ft = 0.3048 m, 1 kip = 4448.2216152605 N (NIST SP 811 (2008),
// Appendix B).
func TestTrainMessagesInWindowUnits(t *testing.T) {
	for _, c := range []struct {
		entry func(mw *movingWindow) *escEntry
		typed string
		want  string
	}{
		{func(mw *movingWindow) *escEntry { return mw.step }, "-2", "the step is -2 ft: enter a step above zero"},
		{func(mw *movingWindow) *escEntry { return mw.from }, "1000", "the train's run starts at x = 1000 ft, which is not on the member (0 to "},
		{func(mw *movingWindow) *escEntry { return mw.axleRows[0].load }, "-3", "axle 1 has a load of -3 kip: an axle load"},
	} {
		w, q, mw := runwayWindow(t)
		w.setUnits(units.USCustomary)
		finished(t, w, q)
		c.entry(mw).SetText(c.typed)
		mw.apply()
		if !strings.Contains(mw.status.Text, c.want) {
			t.Errorf("typed %s: the moving-loads window says %q, want it to say %q", c.typed, mw.status.Text, c.want)
		}
	}
}

// An edit the sketch tools refuse says so without a length in metres when
// the window shows feet: splitting the demo member at its segment break
// read "split the member at x = 9.84 ft: x = 3 m is already a segment end".
func TestRefusedSketchEditsInWindowUnits(t *testing.T) {
	metres := regexp.MustCompile(`[0-9] m\b`)
	for _, c := range []struct {
		name string
		edit func(w *Window)
		want string
	}{
		{"split at the segment break", func(w *Window) {
			w.setTool(toolSplit)
			click(w.draw, fyne.NewPos(w.draw.view.ToScreenX(w.Model().Segments[0].End), w.draw.scene.MemberY))
		}, "already a segment end"},
		{"vertex at the start of a line load", func(w *Window) {
			w.addVertex(0, 0) // the load starts at 0.5 m
		}, "not inside distributed load 1"},
		{"member end dragged past its start", func(w *Window) {
			w.setTool(toolMember)
			y := w.draw.scene.MemberY
			drag(w.draw, fyne.NewPos(w.draw.view.ToScreenX(1), y), fyne.NewPos(w.draw.view.ToScreenX(-1), y), 1)
		}, "positive length"},
	} {
		w, _ := newTestWindow(t, demoProject(t))
		w.setUnits(units.USCustomary)
		before := w.Model()
		c.edit(w)
		got := w.status.Text
		if !strings.Contains(got, c.want) || metres.MatchString(got) {
			t.Errorf("%s in feet: the window says %q, want %q and no length in m", c.name, got, c.want)
		}
		if after := w.Model(); after.Length() != before.Length() || len(after.Segments) != len(before.Segments) {
			t.Errorf("%s: the refused edit changed the member", c.name)
		}
	}
}
