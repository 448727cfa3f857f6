package report

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/check"
	"stave/fem/units"
)

// WriteJSON writes v as indented JSON, as every command's --json does,
// with a zero of either sign written 0 (PlainZeros).
func WriteJSON(w io.Writer, v any) error {
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetIndent("", "  ")
	if err := enc.Encode(v); err != nil {
		return err
	}
	_, err := w.Write(PlainZeros(b.Bytes()))
	return err
}

// PlainZeros writes every number of the JSON document doc that
// encoding/json wrote "-0" (a zero with its sign bit set, as a negated
// zero carries) as "0", in place, and returns the shortened document: the
// text reports write such a zero 0 (units.FormatNumber), and a document
// that says -0 where the text says 0 reads as a different value. Texts
// inside strings are left as they are.
func PlainZeros(doc []byte) []byte {
	out := doc[:0]
	inString := false
	for i := 0; i < len(doc); i++ {
		c := doc[i]
		switch {
		case inString && c == '\\' && i+1 < len(doc):
			out = append(out, c)
			i++
			c = doc[i] // the escaped character, kept as it is
		case c == '"':
			inString = !inString
		case !inString && c == '-' && i+1 < len(doc) && doc[i+1] == '0' && (i+2 == len(doc) || !strings.ContainsRune("0123456789.eE", rune(doc[i+2]))):
			continue
		}
		out = append(out, c)
	}
	return out
}

// The results document of `stave solve --json` (docs/json.md): its format
// name and version. The version changes when a key changes meaning or goes
// away; new keys may appear within a version.
const (
	ResultsFormat  = "stave-results"
	ResultsVersion = 1
)

// resultsDocument is what `stave solve --json` writes: the results of the
// model under Results and, for a model with load cases, its cases,
// combinations and their envelope beside them.
type resultsDocument struct {
	Format  string `json:"format"`
	Version int    `json:"version"`
	File    string `json:"file"`
	Caution string `json:"caution"`
	// Solved says there are results; false when the model was refused
	// (the warnings say why).
	Solved bool `json:"solved"`
	// CheckFailed says a check failed or the results are unreliable: the
	// command exits with status 3.
	CheckFailed bool `json:"check_failed"`
	// Headline names the solution the values lead with: "exact" or
	// "finite_element".
	Headline string    `json:"headline,omitempty"`
	Mesh     *meshJSON `json:"mesh,omitempty"`
	*Results
	// NodalLoads are the consistent nodal loads of the line loads and the
	// self-weight on the mesh solved, as the window's strip shows them;
	// nil for a model with load cases.
	NodalLoads *nodalLoadsJSON `json:"nodal_loads,omitempty"`
	Checks     []checkJSON     `json:"checks"`
	Warnings   []warningJSON   `json:"warnings"`
	// The cases, combinations and envelope of a model with load cases
	// (cases.go); Results are then of the case or combination shown.
	*CasesJSON
	// Trains are the file's moving load trains, each alone on the member:
	// worst positions and envelope (trains.go).
	Trains []TrainJSON `json:"trains,omitempty"`
}

// Results are one set of results: reactions, extremes, the actions at the
// supports inside the member, equilibrium and the error of the finite
// element answer, each headline value beside its finite element one.
type Results struct {
	Reactions      []reactionJSON   `json:"reactions"`
	Foundations    []foundationJSON `json:"foundations"`
	Extremes       []extremeJSON    `json:"extremes"`
	SupportActions []supportJSON    `json:"support_actions"`
	Equilibrium    equilibriumJSON  `json:"equilibrium"`
	ExactError     *exactErrorJSON  `json:"exact_error"`
}

type meshJSON struct {
	Elements int `json:"elements"`
	Nodes    int `json:"nodes"`
	BarOrder int `json:"bar_order"`
	// ChosenBy is "stave" (the default mesh rule) or "model" (set in the file).
	ChosenBy string `json:"chosen_by"`
	Note     string `json:"note"`
	// AccuracyTarget is the default mesh's accuracy, a fraction of each
	// field's largest magnitude; AccuracyReached the largest of the fields'
	// accuracies (null without an exact solution).
	AccuracyTarget  float64  `json:"accuracy_target"`
	AccuracyReached *float64 `json:"accuracy_reached"`
	Condition       float64  `json:"condition_estimate"`
}

// comparedJSON is one value: the headline value, the exact and the finite
// element ones and their difference, with their unit.
type comparedJSON struct {
	Value      float64  `json:"value"`
	Exact      *float64 `json:"exact"`
	FE         float64  `json:"fe"`
	Difference *float64 `json:"difference"`
	Unit       string   `json:"unit"`
}

type reactionJSON struct {
	Support    int           `json:"support"`
	Kind       string        `json:"kind"`
	X          float64       `json:"x"`
	XUnit      string        `json:"x_unit"`
	Axial      *comparedJSON `json:"axial"`
	Transverse *comparedJSON `json:"transverse"`
	Moment     *comparedJSON `json:"moment"`
}

// foundationJSON is what one foundation carries: the resultant of the
// ground's forces on the member along it, across it, its moment about
// x = 0 and where it acts.
type foundationJSON struct {
	Foundation int           `json:"foundation"`
	Start      float64       `json:"start"`
	End        float64       `json:"end"`
	XUnit      string        `json:"x_unit"`
	Axial      *comparedJSON `json:"axial"`
	Transverse *comparedJSON `json:"transverse"`
	Moment     *comparedJSON `json:"moment"`
	Centre     *comparedJSON `json:"centre"`
}

type extremeJSON struct {
	Quantity string    `json:"quantity"`
	Name     string    `json:"name"`
	Max      placeJSON `json:"max"`
	Min      placeJSON `json:"min"`
	// Accuracy is how far the finite element extremes are from the exact
	// ones, a fraction of the field's largest magnitude; null without an
	// exact solution.
	Accuracy *float64 `json:"accuracy"`
}

// placeJSON is an extreme: headline value and place, the exact value, the
// finite element value and place, and the difference of the values.
type placeJSON struct {
	Value float64 `json:"value"`
	X     float64 `json:"x"`
	// Side and SideFE are "left" or "right" where the field jumps at X and
	// XFE (the shear force at an inner support): the value is its limit
	// just left or just right of the point, as support_actions give both.
	// Left out where the field does not jump.
	Side       string   `json:"side,omitempty"`
	Exact      *float64 `json:"exact"`
	FE         float64  `json:"fe"`
	XFE        float64  `json:"x_fe"`
	SideFE     string   `json:"side_fe,omitempty"`
	Difference *float64 `json:"difference"`
	Unit       string   `json:"unit"`
	XUnit      string   `json:"x_unit"`
}

type supportJSON struct {
	Support     int          `json:"support"`
	Kind        string       `json:"kind"`
	X           float64      `json:"x"`
	XUnit       string       `json:"x_unit"`
	ShearLeft   comparedJSON `json:"shear_left"`
	ShearRight  comparedJSON `json:"shear_right"`
	MomentLeft  comparedJSON `json:"moment_left"`
	MomentRight comparedJSON `json:"moment_right"`
}

type componentsJSON struct {
	Axial      float64 `json:"axial"`
	Transverse float64 `json:"transverse"`
	Moment     float64 `json:"moment"`
	ForceUnit  string  `json:"force_unit"`
	MomentUnit string  `json:"moment_unit"`
}

type balanceJSON struct {
	Reactions componentsJSON `json:"reactions"`
	// Ground is the part of Reactions the foundations carry; nil without
	// foundations.
	Ground   *componentsJSON `json:"ground"`
	Residual componentsJSON  `json:"residual"`
	Relative float64         `json:"relative"`
}

type equilibriumJSON struct {
	Applied componentsJSON `json:"applied"`
	Exact   *balanceJSON   `json:"exact"`
	FE      balanceJSON    `json:"fe"`
}

type exactErrorJSON struct {
	StressError       float64 `json:"stress_error"`
	DisplacementError float64 `json:"displacement_error"`
	EnergyError       float64 `json:"energy_error"`
	MaxStressError    float64 `json:"max_stress_error"`
	StressUnit        string  `json:"stress_unit"`
	MaxStressErrorX   float64 `json:"max_stress_error_x"`
	XUnit             string  `json:"x_unit"`
	MaxDeflection     float64 `json:"max_deflection_error"`
	MaxAxial          float64 `json:"max_axial_displacement_error"`
	DisplacementUnit  string  `json:"displacement_unit"`
}

type checkJSON struct {
	Check   string   `json:"check"`
	Name    string   `json:"name"`
	Kind    string   `json:"kind"`
	Status  string   `json:"status"`
	Source  string   `json:"source"`
	Value   float64  `json:"value"`
	Limit   *float64 `json:"limit"`
	FE      *float64 `json:"fe"`
	Unit    string   `json:"unit"`
	X       float64  `json:"x"`
	XFE     *float64 `json:"x_fe"`
	XUnit   string   `json:"x_unit"`
	Message string   `json:"message"`
}

type warningJSON struct {
	Code       string      `json:"code"`
	Severity   string      `json:"severity"`
	Unreliable bool        `json:"unreliable"`
	Check      *string     `json:"check"`
	Name       string      `json:"name"`
	Message    string      `json:"message"`
	X          *float64    `json:"x"`
	Span       *[2]float64 `json:"span"`
	XUnit      string      `json:"x_unit"`
}

// headlineName names the solution the headline values are from.
func headlineName(exact bool) string {
	if exact {
		return "exact"
	}
	return "finite_element"
}

// compared is a headline value v beside the finite element value fe.
func compared(exact bool, v, fe float64, unit string) comparedJSON {
	c := comparedJSON{Value: v, FE: fe, Unit: unit}
	if exact {
		d := fe - v
		c.Exact, c.Difference = &v, &d
	}
	return c
}

func componentsOf(c fem.Components) componentsJSON {
	return componentsJSON{c.Axial, c.Transverse, c.Moment, "N", "N·m"}
}

// balanceOf is e as JSON, with the ground's part when there is ground.
func balanceOf(e fem.EquilibriumSummary, ground bool) balanceJSON {
	b := balanceJSON{Reactions: componentsOf(e.Reactions), Residual: componentsOf(e.Residual), Relative: e.Relative}
	if ground {
		g := componentsOf(e.Ground)
		b.Ground = &g
	}
	return b
}

// foundationsOf is what each foundation of s carries: the components it
// can carry, the moment about x = 0 and the line of action of the
// resultant across the member.
func foundationsOf(s fem.Summary) []foundationJSON {
	out := []foundationJSON{}
	for _, f := range s.Foundations {
		j := foundationJSON{Foundation: f.Foundation, Start: f.Start, End: f.End, XUnit: "m"}
		c := func(v, fe float64, unit string) *comparedJSON {
			c := compared(s.Exact, v, fe, unit)
			return &c
		}
		if f.Holds[fem.Axial] {
			j.Axial = c(f.Reaction.Force[0], f.FE.Force[0], "N")
		}
		if f.Holds[fem.Transverse] {
			j.Transverse = c(f.Reaction.Force[1], f.FE.Force[1], "N")
			j.Moment = c(f.Reaction.Moment, f.FE.Moment, "N·m")
			if centre, fe, ok := f.Centre(); ok {
				j.Centre = c(centre, fe, "m")
			}
		}
		out = append(out, j)
	}
	return out
}

// resultsOf is the summary s as one set of results.
func resultsOf(s fem.Summary) *Results {
	r := &Results{Reactions: []reactionJSON{}, Foundations: foundationsOf(s), Extremes: []extremeJSON{}, SupportActions: []supportJSON{}}
	for _, x := range s.Reactions {
		j := reactionJSON{Support: x.Support, Kind: x.Kind, X: x.X, XUnit: "m"}
		held := func(d fem.Dof, v, fe float64, unit string) *comparedJSON {
			if !x.Holds[d] {
				return nil
			}
			c := compared(s.Exact, v, fe, unit)
			return &c
		}
		j.Axial = held(fem.Axial, x.Axial, x.FE.Axial, "N")
		j.Transverse = held(fem.Transverse, x.Transverse, x.FE.Transverse, "N")
		j.Moment = held(fem.Rotation, x.Moment, x.FE.Moment, "N·m")
		r.Reactions = append(r.Reactions, j)
	}
	for _, e := range s.Extremes {
		place := func(v, x, fe, xfe float64, side, feSide fem.Side) placeJSON {
			c := compared(s.Exact, v, fe, e.Unit)
			return placeJSON{Value: v, X: x, Side: side.Name(), Exact: c.Exact, FE: fe, XFE: xfe, SideFE: feSide.Name(),
				Difference: c.Difference, Unit: e.Unit, XUnit: "m"}
		}
		j := extremeJSON{Quantity: e.Quantity.Key(), Name: e.Quantity.Info().Name,
			Max: place(e.Max, e.XMax, e.FEMax, e.FEXMax, e.SideMax, e.FESideMax),
			Min: place(e.Min, e.XMin, e.FEMin, e.FEXMin, e.SideMin, e.FESideMin)}
		if s.Exact {
			a := e.Accuracy
			j.Accuracy = &a
		}
		r.Extremes = append(r.Extremes, j)
	}
	for _, a := range s.Supports {
		r.SupportActions = append(r.SupportActions, supportJSON{Support: a.Support, Kind: a.Kind, X: a.X, XUnit: "m",
			ShearLeft:   compared(s.Exact, a.Shear[0], a.FEShear[0], "N"),
			ShearRight:  compared(s.Exact, a.Shear[1], a.FEShear[1], "N"),
			MomentLeft:  compared(s.Exact, a.Moment[0], a.FEMoment[0], "N·m"),
			MomentRight: compared(s.Exact, a.Moment[1], a.FEMoment[1], "N·m")})
	}
	ground := len(s.Foundations) > 0
	r.Equilibrium = equilibriumJSON{Applied: componentsOf(s.FEEquilibrium.Applied), FE: balanceOf(s.FEEquilibrium, ground)}
	if s.Exact {
		b := balanceOf(s.Equilibrium, ground)
		r.Equilibrium.Exact = &b
	}
	if e := s.ExactError; e != nil {
		r.ExactError = &exactErrorJSON{StressError: e.MaxStressRelative, DisplacementError: e.RelativeL2, EnergyError: e.RelativeEnergy,
			MaxStressError: e.MaxStress, StressUnit: "Pa", MaxStressErrorX: e.MaxStressAt, XUnit: "m",
			MaxDeflection: e.MaxDeflection, MaxAxial: e.MaxAxial, DisplacementUnit: "m"}
	}
	return r
}

// meshOf is the mesh part of the document.
func meshOf(s fem.Summary) *meshJSON {
	m := &meshJSON{Elements: s.Mesh.Elements, Nodes: s.Mesh.Nodes, BarOrder: s.Mesh.BarOrder, ChosenBy: "model",
		Note: s.Mesh.Note, AccuracyTarget: fem.MeshAccuracy, Condition: s.Mesh.Condition}
	if s.Mesh.Automatic {
		m.ChosenBy = "stave"
	} else if m.Note == "" {
		m.Note = "set in the model"
	}
	if w, ok := s.Worst(); ok {
		m.AccuracyReached = &w.Accuracy
	}
	return m
}

// MaxNodalLoadsListed is the most loaded nodes the results document lists
// one by one (about 100 bytes each): a mesh that loads more gives their
// count and sums alone, as a document for a program to read should not run
// to megabytes for a fine mesh under a load along all of it. A mesh of
// more elements than this gets no nodal loads worked out at all (their
// table costs more than the solve on a mesh of 10⁶ elements): only the
// element formulations, with nodes_listed false.
const MaxNodalLoadsListed = 10_000

// nodalLoadsJSON are the consistent nodal loads of the line loads and the
// self-weight (fem.NodalLoads): every node they load, unless there are more
// than MaxNodalLoadsListed, their sum and the load's own resultant.
type nodalLoadsJSON struct {
	Bar         string          `json:"bar"`
	Beam        *string         `json:"beam"` // null for a member solved as a bar alone
	LoadedNodes *int            `json:"loaded_nodes"`
	Listed      bool            `json:"nodes_listed"`
	Nodes       []nodalLoadJSON `json:"nodes"`
	Sum         *loadSumJSON    `json:"sum"`
	Resultant   *loadSumJSON    `json:"resultant"`
}

// nodalLoadJSON is the consistent load on one node: forces along x and
// across (N), moment (N·m, counter-clockwise). MiddleNode marks the middle
// node of a quadratic bar element, which takes an axial force only.
type nodalLoadJSON struct {
	X          float64 `json:"x"`
	MiddleNode bool    `json:"middle_node"`
	loadSumJSON
	XUnit string `json:"x_unit"`
}

// loadSumJSON is a load: forces along x and across, and a moment (a
// resultant's about x = 0), with their units.
type loadSumJSON struct {
	Axial      float64 `json:"axial"`
	Transverse float64 `json:"transverse"`
	Moment     float64 `json:"moment"`
	ForceUnit  string  `json:"force_unit"`
	MomentUnit string  `json:"moment_unit"`
}

// loadOf is the load r (along, across, moment) in SI units.
func loadOf(r [3]float64) *loadSumJSON {
	return &loadSumJSON{r[fem.Axial], r[fem.Transverse], r[fem.Rotation], "N", "N·m"}
}

// beamName is the beam element's name, nil (null) for none.
func beamName(name string) *string {
	if name == "" {
		return nil
	}
	return &name
}

// nodalLoadsOf is nl as the results document lists it: the nodes with a
// load, in order along the member, the middle nodes of quadratic bars
// between their ends.
func nodalLoadsOf(nl *fem.NodalLoads) *nodalLoadsJSON {
	out := &nodalLoadsJSON{Bar: nl.Bar, Beam: beamName(nl.Beam), Nodes: []nodalLoadJSON{}, Sum: loadOf(nl.Consistent), Resultant: loadOf(nl.Resultant)}
	var loaded []nodalLoadJSON
	for i, n := range nl.Nodes {
		if n.Consistent != [3]float64{} {
			loaded = append(loaded, nodalLoadJSON{X: n.X, loadSumJSON: *loadOf(n.Consistent), XUnit: "m"})
		}
		if i < len(nl.Elements) {
			if e := nl.Elements[i]; e.BarMiddle != 0 {
				loaded = append(loaded, nodalLoadJSON{X: (e.Start + e.End) / 2, MiddleNode: true, loadSumJSON: *loadOf([3]float64{e.BarMiddle, 0, 0}), XUnit: "m"})
			}
		}
	}
	n := len(loaded)
	out.LoadedNodes = &n
	if out.Listed = len(loaded) <= MaxNodalLoadsListed; out.Listed && loaded != nil {
		out.Nodes = loaded
	}
	return out
}

// nodalLoadsOfSolution are s's nodal loads as the results document lists
// them, not worked out on a mesh of more than MaxNodalLoadsListed elements.
func nodalLoadsOfSolution(s *fem.Solution) *nodalLoadsJSON {
	if len(s.Mesh.Elements) > MaxNodalLoadsListed {
		bar, beam := s.ElementNames()
		return &nodalLoadsJSON{Bar: bar, Beam: beamName(beam), Nodes: []nodalLoadJSON{}}
	}
	return nodalLoadsOf(s.NodalLoads())
}

var kindNames = [...]string{check.Design: "design", check.Verification: "verification"}

// checksOf lists the checks of a.
func checksOf(a *analysis.Analysis) []checkJSON {
	out := []checkJSON{}
	for _, r := range a.Checks {
		j := checkJSON{Check: r.Code, Name: r.Name, Kind: kindNames[r.Kind], Status: r.Status.String(),
			Source: headlineName(r.Exact), Value: r.Value, Unit: r.Unit, X: r.X, XUnit: "m", Message: r.Message}
		// A limit beyond floating point (the allowable stress over a
		// safety factor of 5e-324) is no limit: null, as for a check of none.
		if limit := r.Limit; r.Status != check.Info && !math.IsInf(limit, 0) && !math.IsNaN(limit) {
			j.Limit = &limit
		}
		if r.HasFE {
			fe, x := r.FE, r.FEX
			j.FE, j.XFE = &fe, &x
		}
		out = append(out, j)
	}
	return out
}

// warningsOf lists the warnings among findings fs (analysis.Warnings).
func warningsOf(fs []analysis.Finding) []warningJSON {
	out := []warningJSON{}
	for _, f := range analysis.Warnings(fs) {
		j := warningJSON{Code: string(f.Code), Severity: f.Severity.Name(), Unreliable: f.Doubtful, Name: f.Name, Message: f.Message, XUnit: "m"}
		if f.Check != "" {
			c := f.Check
			j.Check = &c
		}
		if f.Located {
			x := f.At
			j.X = &x
		}
		if f.Span != [2]float64{} {
			s := f.Span
			j.Span = &s
		}
		out = append(out, j)
	}
	return out
}

// WriteSolveJSON writes the results of src's analysis of the model in file
// path as the results document (docs/json.md), in SI units, with every
// check and every warning; a model that was refused gives a document with
// no results and the warnings that say why.
func WriteSolveJSON(w io.Writer, path string, src Source) error {
	a := src.Analysis
	doc := resultsDocument{Format: ResultsFormat, Version: ResultsVersion, File: path, Caution: fem.Caution,
		Solved: a.Solution != nil, CheckFailed: a.Solution != nil && analysis.Failed(src.Findings),
		Checks: checksOf(a), Warnings: warningsOf(src.Findings)}
	if a.Solution != nil {
		sum := a.Summary()
		doc.Headline, doc.Mesh, doc.Results = headlineName(sum.Exact), meshOf(sum), resultsOf(sum)
		// A model with cases has one solution per view, not one set of
		// loads: its cases and combinations are listed apart.
		if a.Cases == nil {
			doc.NodalLoads = nodalLoadsOfSolution(a.Solution)
		}
		cases, err := CasesResults(a)
		if err != nil {
			return err
		}
		trains := cases.WithTrains(src)
		doc.CasesJSON = cases
		if trains != nil {
			doc.Trains = TrainsJSON(&src.Project.Model, trains, true)
		}
	}
	return WriteJSON(w, doc)
}

// WriteSolveText writes the results of src's analysis of the model in file
// path as text tables in src's units: mesh and accuracy, reactions,
// extremes, the actions at the supports inside the member, equilibrium,
// the error of the finite element answer, the checks, the warnings and the
// caution. Every value is the exact solution's, with the finite element
// one beside it, unless there is no exact solution: then the values are
// the finite element ones, labelled FE. src's analysis must have a solution.
func WriteSolveText(w io.Writer, path string, src Source) {
	fmt.Fprintf(w, "Stave %s: %s\n", Version, path)
	WriteResultsText(w, src)
	WriteTrainsText(w, src)
	fmt.Fprintln(w, "\nCaution:", fem.Caution)
}

// WriteTrainsText writes what each of the project's moving load trains
// does on the member, alone and in the combinations that take it; nothing
// for a project without trains.
func WriteTrainsText(w io.Writer, src Source) {
	if trains := src.trains(); trains != nil {
		fmt.Fprintln(w, "\nMoving load trains, each alone on the member (its own loads and cases not added, except in the combinations that take it; stave influence draws them)")
		writeTrainsText(w, trains, &src.Project.Model, nil, src.Units)
	}
}

// noSupports is what the text says in place of the reactions of a member
// that no support holds.
const noSupports = "the member has no supports: the ground carries every load"

// WriteResultsText writes what WriteSolveText writes between its title and
// the caution: the results, the checks and the warnings. src's analysis
// must have a solution.
func WriteResultsText(w io.Writer, src Source) {
	u := src.Units
	sum := src.Analysis.Summary()
	WriteMeshText(w, sum)
	feBeside := sum.Exact
	if !sum.Exact {
		fmt.Fprintln(w, "There is no exact solution of this model: every value below is the finite element (FE) one.")
	} else {
		fmt.Fprintln(w, "Values are the exact solution of the model; FE is the finite element answer on this mesh beside it, FE − exact their difference.")
	}
	pos := func(x float64) string { return u.Format(units.Position, x) }
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	columns := func(first string) string {
		if feBeside {
			return first + "\texact\tFE\tFE − exact"
		}
		return first + "\tFE"
	}
	values := func(k units.Kind, v, fe float64) string {
		if feBeside {
			return fmt.Sprintf("%s\t%s\t%s", u.Format(k, v), u.Format(k, fe), u.Format(k, fe-v))
		}
		return u.Format(k, fe)
	}

	if len(sum.Reactions) == 0 {
		// Only a foundation holds a member without supports: a model with
		// neither is a mechanism and is not solved.
		fmt.Fprintln(tw, "\nReactions: none, "+noSupports+" (its resultant: Foundations, below)")
	} else {
		fmt.Fprintln(tw, "\nReactions (forces of the supports on the member; +x along the member, up positive, moments counter-clockwise)")
		fmt.Fprintln(tw, columns("  support\tkind\tx\tcomponent"))
	}
	for _, r := range sum.Reactions {
		lead := fmt.Sprintf("  %d\t%s\t%s", r.Support, r.Kind, pos(r.X))
		for _, c := range []struct {
			name    string
			kind    units.Kind
			v, fe   float64
			holding bool
		}{
			{"axial", units.Force, r.Axial, r.FE.Axial, r.Holds[fem.Axial]},
			{"transverse", units.Force, r.Transverse, r.FE.Transverse, r.Holds[fem.Transverse]},
			{"moment", units.Moment, r.Moment, r.FE.Moment, r.Holds[fem.Rotation]},
		} {
			if !c.holding {
				continue
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\n", lead, c.name, values(c.kind, c.v, c.fe))
			lead = "  \t\t" // the support once, on its first component
		}
	}
	tw.Flush()

	if len(sum.Foundations) > 0 {
		fmt.Fprintln(tw, "\nFoundations (resultant of the ground's forces on the member, with its moment about x = 0 and where it acts)")
		fmt.Fprintln(tw, columns("  foundation\tfrom\tto\tcomponent"))
		for _, f := range sum.Foundations {
			lead := fmt.Sprintf("  %d\t%s\t%s", f.Foundation, pos(f.Start), pos(f.End))
			centre, feCentre, acts := f.Centre()
			for _, c := range []struct {
				name    string
				kind    units.Kind
				v, fe   float64
				holding bool
			}{
				{"axial", units.Force, f.Reaction.Force[0], f.FE.Force[0], f.Holds[fem.Axial]},
				{"transverse", units.Force, f.Reaction.Force[1], f.FE.Force[1], f.Holds[fem.Transverse]},
				{"moment about x = 0", units.Moment, f.Reaction.Moment, f.FE.Moment, f.Holds[fem.Transverse]},
				{"acts at x", units.Position, centre, feCentre, f.Holds[fem.Transverse]},
			} {
				if !c.holding {
					continue
				}
				text := values(c.kind, c.v, c.fe)
				if c.kind == units.Position && !acts {
					text = "nowhere: the forces across add up to nothing, a couple"
				}
				fmt.Fprintf(tw, "%s\t%s\t%s\n", lead, c.name, text)
				lead = "  \t\t"
			}
		}
		tw.Flush()
	}

	fmt.Fprintln(tw, "\nExtremes along the member")
	if feBeside {
		fmt.Fprintln(tw, "  quantity\t\texact\tat x\tFE\tat x\tFE − exact\tFE accuracy")
	} else {
		fmt.Fprintln(tw, "  quantity\t\tFE\tat x")
	}
	for _, e := range sum.Extremes {
		q := e.Quantity.Info()
		for i, x := range [2]struct {
			which           string
			v, at, fe, feAt float64
			side, feSide    fem.Side
		}{{"largest", e.Max, e.XMax, e.FEMax, e.FEXMax, e.SideMax, e.FESideMax}, {"smallest", e.Min, e.XMin, e.FEMin, e.FEXMin, e.SideMin, e.FESideMin}} {
			name := q.Name
			if i > 0 {
				name = ""
			}
			at, feAt := x.side.Place(u.Format(units.Position, x.at)), x.feSide.Place(u.Format(units.Position, x.feAt))
			if !feBeside {
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", name, x.which, u.Format(q.Unit, x.fe), feAt)
				continue
			}
			accuracy := ""
			if i == 0 {
				accuracy = percent(e.Accuracy)
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", name, x.which, u.Format(q.Unit, x.v), at,
				u.Format(q.Unit, x.fe), feAt, u.Format(q.Unit, x.fe-x.v), accuracy)
		}
	}
	tw.Flush()
	fmt.Fprintln(w, "  "+canvas.CombinedStressNote)
	if feBeside {
		fmt.Fprintln(w, "  FE accuracy: the larger |FE − exact| of the two extremes, as a share of the field's largest magnitude.")
	}

	if len(sum.Supports) > 0 {
		fmt.Fprintln(tw, "\nShear force and bending moment at the supports inside the member, just left and just right")
		fmt.Fprintln(tw, columns("  support\tkind\tx\tquantity"))
		for _, a := range sum.Supports {
			lead := fmt.Sprintf("  %d\t%s\t%s", a.Support, a.Kind, pos(a.X))
			for k, side := range [2]string{"left", "right"} {
				fmt.Fprintf(tw, "%s\tshear force, %s\t%s\n", lead, side, values(units.Force, a.Shear[k], a.FEShear[k]))
				lead = "  \t\t"
			}
			for k, side := range [2]string{"left", "right"} {
				fmt.Fprintf(tw, "%s\tbending moment, %s\t%s\n", lead, side, values(units.Moment, a.Moment[k], a.FEMoment[k]))
			}
		}
		tw.Flush()
	}

	writeEquilibriumText(w, tw, sum, u)
	if e := sum.ExactError; e != nil {
		WriteErrorText(w, *e, u)
	}
	WriteChecksText(w, src)
}

// percent writes a fraction as a percentage with three figures, in words
// where it is not a finite number (units.FormatG).
func percent(v float64) string { return units.FormatG("%.3g %%", 100*v) }

// WriteMeshText writes the line on the mesh: its size, who chose it and
// how, and the accuracy its extremes reach against the exact ones.
func WriteMeshText(w io.Writer, sum fem.Summary) {
	fmt.Fprintln(w, "Mesh: "+sum.Mesh.Words())
	fmt.Fprintln(w, "  "+analysis.MeshChoice(sum))
}

// writeEquilibriumText writes the balance of loads and reactions, of the
// exact and of the finite element reactions; with foundations, the
// ground's part of the reactions beside them.
func writeEquilibriumText(w io.Writer, tw *tabwriter.Writer, sum fem.Summary, u units.System) {
	ground := len(sum.Foundations) > 0
	balances := []fem.EquilibriumSummary{sum.FEEquilibrium}
	head := "FE reactions"
	if sum.Exact {
		balances = []fem.EquilibriumSummary{sum.Equilibrium, sum.FEEquilibrium}
		head = "exact reactions\t" + head
	}
	title, cols := "applied loads + reactions", "  \tapplied"
	for _, h := range strings.Split(head, "\t") {
		if ground {
			h += "\tof which ground"
		}
		cols += "\t" + h + "\tresidual"
	}
	if ground {
		title += " of the supports and the ground"
	}
	fmt.Fprintf(tw, "\nEquilibrium (%s must be zero)\n", title)
	fmt.Fprintln(tw, cols)
	for _, c := range []struct {
		name string
		kind units.Kind
		get  func(fem.Components) float64
	}{
		{"axial force", units.Force, func(c fem.Components) float64 { return c.Axial }},
		{"transverse force", units.Force, func(c fem.Components) float64 { return c.Transverse }},
		{"moment about x = 0", units.Moment, func(c fem.Components) float64 { return c.Moment }},
	} {
		line := "  " + c.name + "\t" + u.Format(c.kind, c.get(balances[0].Applied))
		for _, b := range balances {
			line += "\t" + u.Format(c.kind, c.get(b.Reactions))
			if ground {
				line += "\t" + u.Format(c.kind, c.get(b.Ground))
			}
			line += "\t" + u.Format(c.kind, c.get(b.Residual))
		}
		fmt.Fprintln(tw, line)
	}
	tw.Flush()
	if sum.Exact {
		fmt.Fprintf(w, "  largest residual relative to the loads: exact %s, FE %s\n", sum.Equilibrium.RelativeWords(), sum.FEEquilibrium.RelativeWords())
		return
	}
	fmt.Fprintf(w, "  largest residual relative to the loads: %s\n", sum.FEEquilibrium.RelativeWords())
}

// WriteErrorText writes the three error measures of the finite element
// answer against the exact solution, in words, and the largest errors.
func WriteErrorText(w io.Writer, e fem.ErrorNorms, u units.System) {
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintln(tw, "\nHow far the finite element answer is from the exact solution of the same model")
	fmt.Fprintf(tw, "  %s, as a share of the largest stress\t%s (near x = %s)\n", fem.StressErrorName, percent(e.MaxStressRelative), u.Format(units.Position, e.MaxStressAt))
	fmt.Fprintf(tw, "  %s, as a share of the displacements\t%s\n", fem.DisplacementErrorName, percent(e.RelativeL2))
	fmt.Fprintf(tw, "  %s (energy norm of the difference), as a share of the energy norm\t%s\n", fem.EnergyErrorName, percent(e.RelativeEnergy))
	fmt.Fprintf(tw, "  largest errors\tstress %s, deflection %s, axial displacement %s\n", u.Format(units.Stress, e.MaxStress),
		u.Format(units.Deflection, e.MaxDeflection), u.Format(units.Deflection, e.MaxAxial))
	tw.Flush()
}

// siKinds are the display kinds of the SI units checks give their values in.
var siKinds = map[string]units.Kind{"Pa": units.Stress, "m": units.Deflection, "N": units.Force, "N·m": units.Moment, "rad": units.Rotation}

// checkValue is the value of check r in units u, with the finite element
// value beside an exact one.
func checkValue(r check.Result, u units.System) string {
	k, ok := siKinds[r.Unit]
	if r.Code == check.CodeEquilibrium && ok {
		return fmt.Sprintf("applied %s, reactions %s", u.Format(k, r.Value), u.Format(k, -r.Limit))
	}
	if !ok {
		switch {
		case r.Code == check.CodeExactError && r.Status == check.Info:
			return "not measured"
		case r.Code == check.CodeExactError:
			return percent(r.Value)
		}
		return ""
	}
	s := u.Format(k, r.Value)
	if r.HasFE {
		s += " exact, FE " + u.Format(k, r.FE)
	} else if !r.Exact && r.Kind == check.Design {
		s += " FE"
	}
	return s
}

// WriteChecksText writes every check of src on one line each, then the
// warnings in full.
func WriteChecksText(w io.Writer, src Source) {
	a, u := src.Analysis, src.Units
	fmt.Fprintln(w, "\nChecks")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	for _, r := range a.Checks {
		status := r.Status.String()
		if r.Kind == check.Design && r.Status == check.Pass {
			status = "within limit"
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", status, r.Name, checkValue(r, u))
	}
	tw.Flush()
	WriteWarningsText(w, src.Findings)
}

// WriteWarningsText writes the warnings among findings fs, each with its
// code, or says there are none.
func WriteWarningsText(w io.Writer, fs []analysis.Finding) {
	ws := analysis.Warnings(fs)
	if len(ws) == 0 {
		fmt.Fprintln(w, "\nWarnings: none")
		return
	}
	fmt.Fprintln(w, "\nWarnings")
	for _, f := range ws {
		fmt.Fprintf(w, "  - [%s] %s\n", f.Code, f.Sentence())
	}
}
