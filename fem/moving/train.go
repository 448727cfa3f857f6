package moving

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"stave/fem"
	"stave/fem/units"
)

// Direction says which way a train moves.
type Direction int

// Directions. A train that moves both ways is placed facing either way:
// the effects of an unsymmetric train differ.
const (
	BothWays Direction = iota
	Forward            // towards +x: the first axle leads, the rest follow at smaller x
	Backward           // towards −x: the first axle leads, the rest follow at larger x
)

var directionNames = [...]string{"both", "forward", "backward"}

// String names the direction as files and messages do.
func (d Direction) String() string {
	if d < 0 || int(d) >= len(directionNames) {
		return "unknown"
	}
	return directionNames[d]
}

// ParseDirection is the inverse of Direction.String.
func ParseDirection(s string) (Direction, bool) {
	i := slices.Index(directionNames[:], s)
	return Direction(max(i, 0)), i >= 0
}

// Axle is one axle or wheel load of a train.
type Axle struct {
	Load float64 // N, acting down (a weight): above zero
	// Spacing is the distance from the axle before, m, above zero; the
	// first axle has none.
	Spacing float64
}

// UniformLoad is a train's uniform load, moving with it.
type UniformLoad struct {
	Load   float64 // N/m, acting down; zero for none
	Start  float64 // m behind the train's front (its first axle)
	Length float64 // m
}

// Train is a set of loads moving together along a stretch of the member.
type Train struct {
	Name    string
	Axles   []Axle
	Uniform UniformLoad
	// From and To bound the stretch the train runs along, m; To = 0 means
	// the member's end. Every position keeps the whole train on it, unless
	// OffEnds.
	From, To float64
	// OffEnds lets the train drive on and off the member where its
	// stretch reaches an end of the member: positions with only part of it
	// on the member count too, its loads beyond the end carrying nothing
	// (a vehicle crossing a span, not a trolley between end stops). A
	// train longer than its stretch is then accepted.
	OffEnds   bool
	Direction Direction
	// Step is the distance between positions, m; 0 derives it from the
	// mesh (DerivedStep). It is shortened to divide the run evenly.
	Step float64
}

// Limits of a train's positions.
const (
	// MaxPositions is the most positions a train may be shown at in one
	// direction: a step finer than that gains nothing a user could see.
	MaxPositions = 100000
	// derivedPositions caps the positions of a step derived from the mesh.
	derivedPositions = 20000
	// MaxAxles is the most axles a train may have: the envelope's search
	// for the worst place (axlePeaks) works under every axle on every
	// stretch of positions between those where a load passes a key point,
	// work growing with the square of the axles (on the two spans of 6 m
	// of testdata/moving/runway.json, 100 axles driving on and off took
	// 2.3 s for `stave solve`, 30 axles 0.2 s).
	MaxAxles = 100
	// MaxLoad is the largest axle load (N) and uniform load (N/m) a train
	// may have, in SI, as fem.MaxFactor is the largest factor of a
	// combination, and for the same reason: results grow with the load
	// and their squares would overflow floating point (an axle of 1e300 N
	// was taken and only left out with a caution, where the load of a case
	// so large is refused).
	MaxLoad = 1e150
)

// CloneTrains copies ts deeply: no slice is shared with ts; nil stays nil.
func CloneTrains(ts []Train) []Train {
	if ts == nil {
		return nil
	}
	out := slices.Clone(ts)
	for i := range out {
		out[i].Axles = slices.Clone(ts[i].Axles)
	}
	return out
}

// Label names the train in messages: its name, or its number (from 1) in a
// list when it has none.
func (t *Train) Label(i int) string {
	if t.Name != "" {
		return fmt.Sprintf("train %q", t.Name)
	}
	return fmt.Sprintf("train %d", i+1)
}

// Length is the train's extent behind its front, m: its last axle or the
// end of its uniform load, whichever is further.
func (t *Train) Length() float64 {
	l := 0.0
	for _, a := range t.Axles[min(1, len(t.Axles)):] {
		l += a.Spacing
	}
	if t.Uniform.Load != 0 {
		l = max(l, t.Uniform.Start+t.Uniform.Length)
	}
	return l
}

// Run is the stretch the train runs along on a member of length L, m.
func (t *Train) Run(L float64) (from, to float64) {
	to = t.To
	if to == 0 {
		to = L
	}
	return t.From, to
}

// Problem is one thing wrong with a train: Key is where, as the file's key
// below the train ("axles[2].spacing"), and Message says what to do.
type Problem struct {
	Key, Message string
}

// Problems lists everything wrong with t on a member of length L: its own
// problems (OwnProblems), then whether its run lies on the member, whether
// it fits on its run and how many positions its step gives. The messages
// quote values in u: the display units of a window, or units.Base.
func (t *Train) Problems(L float64, u units.System) []Problem {
	out := t.OwnProblems(u)
	if len(out) > 0 {
		return out // the rest needs a sound train
	}
	add := func(key, format string, args ...any) {
		out = append(out, Problem{key, fmt.Sprintf(format, args...)})
	}
	x := func(v float64) string { return quote(u, units.Position, v) }
	from, to := t.Run(L)
	switch {
	case !(from >= 0) || !finite(from) || from >= L:
		add("from", "the train's run starts at x = %s, which is not on the member (0 to %s)", x(from), x(L))
	case !(to > from) || !finite(to) || to > L*(1+keyTolerance):
		add("to", "the train's run ends at x = %s: enter a point after its start (%s) and on the member (up to %s), or 0 for the member's end", x(t.To), x(from), x(L))
	}
	if len(out) > 0 {
		return out
	}
	run, length := to-from, t.Length()
	if start, end := t.OffAt(L); length > run*(1+keyTolerance) && !start && !end {
		add("", "the train is %s long and does not fit on the %s it runs along (x = %s to %s): shorten the train or lengthen its run", x(length), x(run), x(from), x(to))
		return out
	}
	lo, hi := t.Fronts(L)
	if n := positions(hi-lo, t.Step); t.Step > 0 && n > MaxPositions {
		count := strconv.Itoa(n)
		if n >= positionsCap {
			count = strconv.FormatFloat((hi-lo)/t.Step+1, 'g', 3, 64) // the cap is not the count
			if math.IsInf((hi-lo)/t.Step, 1) {
				count = "more than 1e+308" // nor is +Inf
			}
		}
		add("step", "a step of %s takes %s positions along the %s the train can move; Stave takes at most %d: enter a step of at least %s", x(t.Step), count, x(hi-lo), MaxPositions, x((hi-lo)/(MaxPositions-1)))
	}
	return out
}

// OffAt reports whether t on a member of length L may drive off it at its
// start and at its end: OffEnds, and its stretch reaches that end of the
// member.
func (t *Train) OffAt(L float64) (start, end bool) {
	from, to := t.Run(L)
	return t.OffEnds && from <= keyTolerance*L, t.OffEnds && to >= L*(1-keyTolerance)
}

// Fronts is the range of x its front takes on a member of length L, m,
// facing forward (a train moving backward takes the mirror range about its
// stretch): the whole train on its stretch, or where OffEnds lets it
// leave the member at an end, from only its front on to only its last
// load on.
func (t *Train) Fronts(L float64) (lo, hi float64) {
	from, to := t.Run(L)
	length := t.Length()
	lo, hi = from+length, to
	start, end := t.OffAt(L)
	if start {
		lo = from
	}
	if end {
		hi = to + length
	}
	return lo, hi
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// OwnProblems lists what is wrong with t whatever member it runs on: its
// loads, spacings, uniform load, direction and step, quoting values in u.
// A file refuses these; the rest (Problems) depends on the member, which
// may change after the train was made, and is reported when the train is
// used.
func (t *Train) OwnProblems(u units.System) []Problem {
	var out []Problem
	add := func(key, format string, args ...any) {
		out = append(out, Problem{key, fmt.Sprintf(format, args...)})
	}
	x := func(v float64) string { return quote(u, units.Position, v) }
	if len(t.Axles) == 0 && t.Uniform.Load == 0 {
		add("", "it has no loads: give it at least one axle or a uniform load")
	}
	if len(t.Axles) > MaxAxles {
		add("axles", "it has %d axles; Stave takes at most %d (the search for the worst place tries the points under every axle at every position): give the axles that fit on the member at once, or join close axles into one", len(t.Axles), MaxAxles)
	}
	for i, a := range t.Axles {
		switch {
		case !(a.Load > 0) || !finite(a.Load):
			add(fmt.Sprintf("axles[%d].load", i), "axle %d has a load of %s: an axle load is a weight acting down, enter it above zero", i+1, quote(u, units.Force, a.Load))
		case a.Load > MaxLoad:
			add(fmt.Sprintf("axles[%d].load", i), "axle %d has a load of %s, more than the %s Stave takes (%s): check the value and its units", i+1, quote(u, units.Force, a.Load), quote(u, units.Force, MaxLoad), tooLarge)
		}
		switch {
		case i == 0 && a.Spacing != 0:
			add("axles[0].spacing", "the first axle has a spacing of %s, but nothing stands before it: leave its spacing out (or 0)", x(a.Spacing))
		case i > 0 && (!(a.Spacing > 0) || !finite(a.Spacing)):
			add(fmt.Sprintf("axles[%d].spacing", i), "axle %d stands %s from axle %d: a spacing must be above zero (two wheels at one place are one axle: add their loads)", i+1, x(a.Spacing), i)
		}
	}
	if ul := t.Uniform; ul.Load != 0 || ul.Length != 0 || ul.Start != 0 {
		switch {
		case !(ul.Load > 0) || !finite(ul.Load):
			add("uniform.load", "the uniform load is %s: enter it above zero (acting down), or leave the uniform load out", quote(u, units.LineLoad, ul.Load))
		case ul.Load > MaxLoad:
			add("uniform.load", "the uniform load is %s, more than the %s Stave takes (%s): check the value and its units", quote(u, units.LineLoad, ul.Load), quote(u, units.LineLoad, MaxLoad), tooLarge)
		}
		if !(ul.Length > 0) || !finite(ul.Length) {
			add("uniform.length", "the uniform load is %s long: enter a length above zero", x(ul.Length))
		}
		if !(ul.Start >= 0) || !finite(ul.Start) {
			add("uniform.start", "the uniform load starts %s behind the front: enter zero or more", x(ul.Start))
		}
	}
	if t.Direction < BothWays || t.Direction > Backward {
		add("direction", "the direction is not one of %s", strings.Join(directionNames[:], ", "))
	}
	if !(t.From >= 0) || !finite(t.From) {
		add("from", "the train's run starts at x = %s: enter zero or more", x(t.From))
	}
	if !(t.To >= 0) || !finite(t.To) {
		add("to", "the train's run ends at x = %s: enter a point on the member, or 0 for the member's end", x(t.To))
	}
	if !(t.Step >= 0) || !finite(t.Step) {
		add("step", "the step is %s: enter a step above zero, or 0 to take it from the mesh", x(t.Step))
	}
	return out
}

// tooLarge says why a load above MaxLoad is refused.
const tooLarge = "results grow with the load, and their squares would overflow floating point"

// quote prints v, an SI value of kind k, in u's unit: "3.2 m", "10.5 ft";
// units of no name (the zero System) are SI base units.
func quote(u units.System, k units.Kind, v float64) string {
	if u.Name == "" {
		u = units.Base
	}
	return trim(u.ToDisplay(k, v)) + " " + u.Unit(k).Symbol
}

// Check returns the problems of t as one error naming the train (its
// number i in a list, when it has no name), or nil; its values are in u.
func (t *Train) Check(L float64, i int, u units.System) error {
	ps := t.Problems(L, u)
	if len(ps) == 0 {
		return nil
	}
	msgs := make([]string, len(ps))
	for k, p := range ps {
		msgs[k] = p.Message
	}
	return errors.New(t.Label(i) + ": " + strings.Join(msgs, "; "))
}

// positionsCap is the most positions counts: far beyond any limit, and
// no overflow of an int.
const positionsCap = 1e15

// positions is the number of positions a step gives over a free run of
// the given length: the run divided evenly into steps no longer than step,
// both ends included (at most positionsCap).
func positions(free, step float64) int {
	if free <= 0 {
		return 1
	}
	n := math.Ceil(free / step * (1 - 1e-12))
	if !(n < positionsCap) {
		return positionsCap // far beyond any limit, and no overflow
	}
	return int(n) + 1
}

// DerivedStep is the step taken from the mesh for a train running from
// from to to, whose front travels free metres: the mean length of the
// elements there, but not so short that the train takes more than
// derivedPositions positions, both ends of its run included.
func DerivedStep(mesh fem.Mesh, from, to, free float64) float64 {
	count := 0
	for _, e := range mesh.Elements {
		if mid := 0.5 * (e.Start + e.End); mid >= from && mid <= to {
			count++
		}
	}
	step := (to - from) / float64(max(count, 1))
	return max(step, free/(derivedPositions-1))
}

// Placement is one position of a train: the way it faces and the x of its
// front (the first axle), m.
type Placement struct {
	Direction Direction
	Front     float64
}

// Loads are the train's loads at p as fem loads: a point load for each axle
// and a distributed load for the uniform load, acting down.
func (t *Train) Loads(p Placement) ([]fem.PointLoad, []fem.DistributedLoad) {
	sign := -1.0 // behind the front is towards −x for a train moving forward
	if p.Direction == Backward {
		sign = 1
	}
	var points []fem.PointLoad
	x := p.Front
	for i, a := range t.Axles {
		if i > 0 {
			x += sign * a.Spacing
		}
		points = append(points, fem.PointLoad{X: x, Transverse: -a.Load})
	}
	var lines []fem.DistributedLoad
	if u := t.Uniform; u.Load > 0 {
		a, b := p.Front+sign*u.Start, p.Front+sign*(u.Start+u.Length)
		a, b = min(a, b), max(a, b)
		lines = append(lines, fem.DistributedLoad{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: a, Intensity: -u.Load}, {X: b, Intensity: -u.Load}}})
	}
	return points, lines
}

// Model is m's member and supports with the train at p as its only loads:
// the model to solve the train at one position by finite elements and in
// closed form. The loads of a train partly off the member (OffEnds) are
// left out beyond its ends, a uniform load cut at them.
func (t *Train) Model(m *fem.Model, p Placement) fem.Model {
	c := Unloaded(m)
	points, lines := t.Loads(p)
	L := m.Length()
	tol := keyTolerance * L
	for _, a := range points {
		if a.X >= -tol && a.X <= L+tol {
			a.X = min(max(a.X, 0), L)
			c.PointLoads = append(c.PointLoads, a)
		}
	}
	for _, d := range lines {
		a, b := max(d.Points[0].X, 0), min(d.Points[1].X, L)
		if b-a > tol {
			d.Points[0].X, d.Points[1].X = a, b
			c.DistributedLoad = append(c.DistributedLoad, d)
		}
	}
	return c
}

// placedAxle is an axle's load (N, down) and offset from the front (m,
// signed: it stands at front + offset).
type placedAxle struct{ offset, load float64 }

// run is one direction of a train's positions: every front from s0 to
// s0 + (n − 1)·step, shown and stepped through at s0 + k·step for k < n.
type run struct {
	direction Direction
	s0, step  float64
	n         int
	axles     []placedAxle
	uniform   bool
	q, u0, u1 float64 // the uniform load, N/m down, from front + u0 to front + u1
	// Scratch of scan, kept between calls; fixed are the fronts at which
	// an axle or an end of the uniform load passes a key point (setKeys).
	breaks, fixed, moving, offsets, keys []float64
	candidates                           []float64
	// sortedOffsets are the axles' offsets in order (setKeys), jumpPoints
	// the points where scanMeetings looks for loads meeting.
	sortedOffsets, jumpPoints []float64
	places                    []int
	axleTerms, uniformTerms   []poly
	short                     []bool
	tolerance                 float64 // round-off within which a front that puts an axle on a point is on the run, m
	// minOff and maxOff are the least and the greatest offset of a load
	// (setKeys); cut is what a windowed scan leaves out (scan).
	minOff, maxOff float64
	cut            cut
}

// runs are t's positions on a member of length L with the given step (0
// takes it from mesh): one run per direction it moves in.
func (t *Train) runs(L float64, mesh fem.Mesh) ([]run, error) {
	if err := t.Check(L, 0, units.Base); err != nil {
		return nil, err
	}
	from, to := t.Run(L)
	lo, hi := t.Fronts(L)
	free := max(hi-lo, 0)
	step := t.Step
	if step == 0 {
		step = DerivedStep(mesh, from, to, free)
	}
	n := positions(free, step)
	if n > 1 {
		step = free / float64(n-1)
	}
	length := t.Length()
	var out []run
	for _, d := range []Direction{Forward, Backward} {
		if t.Direction != BothWays && t.Direction != d {
			continue
		}
		sign := -1.0
		s0 := lo
		if d == Backward {
			// The mirror of the forward fronts about the stretch: the front
			// at x stands where the forward train's last load stood.
			sign, s0 = 1, lo-length
		}
		r := run{direction: d, s0: s0, step: step, n: n}
		r.tolerance = keyTolerance * L
		offset := 0.0
		for i, a := range t.Axles {
			if i > 0 {
				offset += a.Spacing
			}
			r.axles = append(r.axles, placedAxle{sign * offset, a.Load})
		}
		if u := t.Uniform; u.Load > 0 {
			r.uniform, r.q = true, u.Load
			r.u0, r.u1 = sign*u.Start, sign*(u.Start+u.Length)
			r.u0, r.u1 = min(r.u0, r.u1), max(r.u0, r.u1)
		}
		out = append(out, r)
	}
	return out, nil
}

// front is the x of the front at position k.
func (r *run) front(k int) float64 { return r.s0 + float64(k)*r.step }
