package main

import (
	"flag"
	"fmt"
	"io"
	"path/filepath"
	"strconv"
	"strings"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/moving"
	"stave/fem/units"
	"stave/storage"
)

// influenceCommand prints the influence line of one quantity of a model,
// from the exact solution and by finite elements, and what each of the
// file's trains does to it: its worst positions and, with --envelope, the
// envelope of every field over all its positions.
func influenceCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("influence")
	quantity := fs.String("quantity", "", "the quantity: w, theta, V, M, sigma_bending, u, N, sigma_axial (or its name), or reaction")
	at := fs.String("at", "", "where the quantity is read, along the member (display units, or with a unit: 2.5 m)")
	side := fs.String("side", "right", "at a point where the quantity jumps, the side it is read on: left or right")
	support := fs.Int("support", 0, "for a reaction: the support, counted from 1 along the file")
	motion := fs.String("motion", "transverse", "for a reaction: transverse, rotation or axial")
	points := fs.Int("points", 20, "the number of intervals the line is printed in")
	envelope := fs.Bool("envelope", false, "also each train's envelope of every field over all its positions")
	out := fs.String("out", "", "also draw the line, a train at its worst position and its envelope to NAME.png, NAME.svg or NAME.pdf")
	sheet := fs.String("sheet", "", "also write a one-page calculation sheet of the train to NAME.pdf or NAME.png")
	train := fs.Int("train", 1, "the train --out and --sheet show, counted from 1 along the file")
	asJSON := fs.Bool("json", false, "print the result as JSON (SI units)")
	system := fs.String("units", "", "unit system for the printed text: SI or US (default: the file's display units)")
	path, err := parseOneFile(fs, args, stdout)
	if err != nil {
		return err
	}
	if *train < 1 {
		return usageError{fmt.Sprintf("--train %d: count the trains from 1 along the file", *train)}
	}
	if set(fs, "train") && *out == "" && *sheet == "" { // as strayFlags: a flag that does nothing is refused
		return usageError{"--train is for --out and --sheet, which show one train (the text and JSON give every train): leave it out, or add one of them"}
	}
	if *points < 1 || *points > 100000 {
		return usageError{fmt.Sprintf("--points must be between 1 and 100000, got %d", *points)}
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	sys, err := unitsFlag(*system)
	if err != nil {
		return err
	}
	if sys.Name == "" {
		sys = report.UnitSystem(p.View.Units)
	}
	target, err := parseTarget(*quantity, *at, *side, *support, *motion, sys)
	if err != nil {
		return err
	}
	if err := strayFlags(fs, target); err != nil {
		return err
	}
	if err := onMember(target, *at, &p.Model, sys); err != nil {
		return usageError{fmt.Sprintf("%s: %v", path, err)}
	}
	switch n := len(p.Trains); {
	case *sheet != "" && n == 0:
		return usageError{fmt.Sprintf("--sheet: %s has no train to put on a sheet: add one under \"trains\" (docs/format.md)", path)}
	case set(fs, "train") && *train > n:
		return usageError{fmt.Sprintf("--train %d: %s has %s; count them from 1 along the file", *train, path, units.Count(n, "train"))}
	}
	r, err := report.Influence(p, report.InfluenceRequest{Target: target, Points: *points, FiniteElements: true, Envelope: *envelope || *out != "" || *sheet != "", Units: sys})
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	if *out != "" {
		if err := writePicture(r, *out, *train-1, sys); err != nil {
			return err
		}
	}
	if *sheet != "" {
		if err := writeMovingSheet(p, r, *sheet, *train-1, sys); err != nil {
			return err
		}
	}
	if *asJSON {
		return report.WriteInfluenceJSON(stdout, path, r)
	}
	report.WriteInfluenceText(stdout, path, r, sys)
	return nil
}

// parseTarget reads the target of an influence line from the flags.
func parseTarget(quantity, at, side string, support int, motion string, sys units.System) (moving.Target, error) {
	var t moving.Target
	switch strings.ToLower(quantity) {
	case "":
		return t, usageError{"influence needs --quantity: one of w, theta, V, M, sigma_bending, u, N, sigma_axial, or reaction with --support"}
	case "reaction", "r":
		if support < 1 {
			return t, usageError{"a reaction needs --support N, the support counted from 1 along the file"}
		}
		d, ok := map[string]fem.Dof{"transverse": fem.Transverse, "rotation": fem.Rotation, "axial": fem.Axial}[motion]
		if !ok {
			return t, usageError{fmt.Sprintf("--motion %q: use transverse, rotation or axial", motion)}
		}
		return moving.Target{Reaction: true, Support: support - 1, Motion: d}, nil
	}
	q, ok := fem.ParseQuantity(quantity)
	if !ok {
		q, ok = fem.ParseQuantity(strings.ReplaceAll(quantity, "-", " "))
	}
	if !ok {
		return t, usageError{fmt.Sprintf("--quantity %q is not a quantity: use w, theta, V, M, sigma_bending, u, N, sigma_axial, or reaction", quantity)}
	}
	if q == fem.QCombinedStress {
		return t, usageError{"--quantity: the combined stress is not linear in the loads (it takes the larger fibre): it has no influence line; ask for sigma_bending or sigma_axial"}
	}
	if at == "" {
		return t, usageError{fmt.Sprintf("the %s needs --at: where along the member to read it", q)}
	}
	x, err := sys.Parse(units.Position, at)
	if err != nil {
		return t, usageError{fmt.Sprintf("--at: %v", err)}
	}
	t = moving.Target{Quantity: q, X: x, Side: fem.Right}
	switch side {
	case "left":
		t.Side = fem.Left
	case "right":
	default:
		return t, usageError{fmt.Sprintf("--side %q: use left or right", side)}
	}
	return t, nil
}

// strayFlags refuses a flag that the target does not read: --at and
// --side belong to a quantity along the member, --support and --motion to
// a reaction (given to the other, they were ignored without a word).
func strayFlags(fs *flag.FlagSet, t moving.Target) error {
	stray, wants := []string{"support", "motion"}, "a reaction"
	if t.Reaction {
		stray, wants = []string{"at", "side"}, "a quantity read along the member"
	}
	for _, name := range stray {
		if set(fs, name) {
			return usageError{fmt.Sprintf("--%s is for %s: leave it out for the %s", name, wants, t)}
		}
	}
	return nil
}

// onMember refuses a target off member m, a support it does not have, or
// a reaction its support does not give, in units sys (fem/moving says the
// same in m). The place is written as typed in at, the member's length to
// ten figures: 4.00001 m typed for a member of 4 m must not read "4.000 m
// is not on 0 to 4.000 m".
func onMember(t moving.Target, at string, m *fem.Model, sys units.System) error {
	if t.Reaction {
		if t.Support < 0 || t.Support >= len(m.Supports) {
			return fmt.Errorf("--support %d: the member has %s; count them from 1 along the file", t.Support+1, units.Count(len(m.Supports), "support"))
		}
		sup := m.Supports[t.Support]
		if !sup.Holds(t.Motion) {
			return fmt.Errorf("support %d (%s at x = %s) does not hold the %s motion: it has no %s reaction", t.Support+1, sup.Kind, sys.Format(units.Position, sup.X), t.Motion, t.Motion)
		}
		return nil
	}
	if L := m.Length(); !(t.X >= 0 && t.X <= L) {
		typed := strings.TrimSpace(at)
		if _, err := strconv.ParseFloat(typed, 64); err == nil { // a plain number, in display units
			typed += " " + sys.Unit(units.Position).Symbol
		}
		length := strconv.FormatFloat(sys.ToDisplay(units.Position, L), 'g', 10, 64)
		return fmt.Errorf("x = %s is not on the member (0 to %s %s): give a point on it", typed, length, sys.Unit(units.Position).Symbol)
	}
	return nil
}

// writePicture draws the moving-loads picture of r with train i to the
// file name, its format from the extension.
func writePicture(r *report.MovingLoads, name string, i int, sys units.System) error {
	format := strings.TrimPrefix(strings.ToLower(filepath.Ext(name)), ".")
	if format != "png" && format != "svg" && format != "pdf" {
		return usageError{fmt.Sprintf("--out %q: name a .png, .svg or .pdf file", name)}
	}
	in, err := report.MovingPicture(r, i, sys)
	if err != nil {
		return modelError{err}
	}
	_, err = writeExport(name, func(w io.Writer) error { return canvas.WriteMoving(w, format, in, 1200, 760, 96.0/72) })
	return err
}

// writeMovingSheet writes the one-page sheet of r with train i to the file
// name, a PDF or PNG by its extension.
func writeMovingSheet(p *storage.Project, r *report.MovingLoads, name string, i int, sys units.System) error {
	format := strings.TrimPrefix(strings.ToLower(filepath.Ext(name)), ".")
	if format != "png" && format != "pdf" {
		return usageError{fmt.Sprintf("--sheet %q: name a .pdf or .png file", name)}
	}
	in, err := report.MovingSheet(p, r, i, sys)
	if err != nil {
		return modelError{err}
	}
	_, err = writeExport(name, func(w io.Writer) error { return canvas.WriteMovingSheet(w, format, in) })
	return err
}
