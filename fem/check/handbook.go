package check

import (
	"cmp"
	"math"
	"slices"

	"stave/fem"
	"stave/fem/units"
)

// Case is a standard handbook case the model matches.
type Case struct {
	Name       string
	Formula    string // plain text, e.g. "δmax = 5qL⁴/(384EI)"
	Source     string
	Quantities []Quantity
}

// Reading says which result a handbook Quantity is compared with.
type Reading int

// Readings.
const (
	DeflectionAt         Reading = iota // w at X
	AxialDisplacementAt                 // u at X
	BendingMomentAt                     // M at X
	AxialForceAt                        // N at X
	TransverseReactionAt                // transverse reaction of the supports at X
	AxialReactionAt                     // axial reaction of the supports at X
)

// Quantity is one handbook value, with the sign conventions of package fem
// (up and counter-clockwise positive, sagging moments positive).
type Quantity struct {
	Name  string
	Value float64 // SI
	Kind  units.Kind
	X     float64 // where it applies, m
	Reads Reading
}

// Read takes the matching value from a solution (finite element or exact)
// and its reactions; false when there is no support at X for a reaction.
func (q Quantity) Read(f fem.Field, reactions []fem.Reaction) (float64, bool) {
	switch q.Reads {
	case TransverseReactionAt, AxialReactionAt:
		d := fem.Transverse
		if q.Reads == AxialReactionAt {
			d = fem.Axial
		}
		sum, found := 0.0, false
		for _, r := range reactions {
			if math.Abs(r.X-q.X) <= samePlace*math.Max(1, math.Abs(q.X)) {
				sum, found = sum+r.Force[d], true
			}
		}
		return sum, found
	}
	// Read from inside the member at the ends; the fields the cases compare
	// are continuous elsewhere, so the side does not matter there.
	side := fem.Right
	if q.X > 0 {
		side = fem.Left
	}
	at := f.At(q.X, side)
	switch q.Reads {
	case DeflectionAt:
		return at.Deflection, true
	case AxialDisplacementAt:
		return at.AxialDisplacement, true
	case BendingMomentAt:
		return at.BendingMoment, true
	case AxialForceAt:
		return at.AxialForce, true
	}
	return 0, false
}

// samePlace is the relative distance under which two positions are one.
const samePlace = 1e-9

// Sources of the cases. Roark's Table 8.1 numbers a case by load (1 a point
// load, 2 a distributed load) and a letter for the end conditions (a
// free–fixed, c simply supported–fixed, d fixed–fixed, e simply supported
// at both ends).
const (
	roark      = "Roark's Formulas for Stress and Strain, Table 8.1, case "
	fromMemory = " (from memory)"
)

// propped is where the largest deflection of a propped cantilever under a
// uniform load lies, as a fraction of the span from the simple support: the
// root of 8t³ − 9t² + 1 = 0 in (0, 1), t = (1 + √33)/16 = 0.4215.
var propped = (1 + math.Sqrt(33)) / 16

// proppedDeflection is δmax·EI/(qL⁴) there, t(1 − 3t² + 2t³)/48 = 0.005416
// (Roark and the AISC Manual print qL⁴/(185EI)).
var proppedDeflection = propped * (1 - 3*propped*propped + 2*propped*propped*propped) / 48

// memberFacts is what recognition needs to know about a one-segment model.
type memberFacts struct {
	length, elastic, area, second float64
	beamSupports                  []placed // supports that act on the beam problem
	barSupports                   []placed // supports that restrain axial motion
	points                        []fem.PointLoad
	uniform                       float64 // uniform transverse load over the whole member incl. self-weight, N/m
	axialWeight                   float64 // uniform axial load over the whole member incl. self-weight, N/m
	other                         bool    // something no case covers
}

type placed struct {
	x    float64
	kind EndCondition
}

// Handbook recognises a standard handbook case: a prismatic one-segment
// member with supports and loads of one of these kinds: cantilever with a
// tip load or a uniform load; simply supported with a central load or a
// uniform load; fixed at both ends, uniform load; propped cantilever,
// uniform load; two equal spans, uniform load; a bar fixed at one end with
// an end load; a rod hanging under its own weight. Mirror images count.
func Handbook(m *fem.Model) (Case, bool) {
	f, ok := facts(m)
	if !ok || f.other {
		return Case{}, false
	}
	L := f.length
	ei, ea := f.elastic*f.second, f.elastic*f.area
	beamLoaded := f.uniform != 0 || (len(f.points) > 0 && f.points[0].Transverse != 0)
	if f.axialWeight == 0 && beamLoaded {
		return beamCase(f, L, ei)
	}
	if !beamLoaded {
		return barCase(f, L, ea)
	}
	return Case{}, false
}

func facts(m *fem.Model) (memberFacts, bool) {
	var f memberFacts
	if len(m.Segments) != 1 || m.TemperatureChange != 0 || len(m.Hinges) > 0 || len(m.Foundations) > 0 || len(m.Cases) > 0 {
		return f, false
	}
	seg := m.Segments[0]
	if seg.TemperatureDifference != 0 || seg.ShearDeformation {
		return f, false // the tables are for Euler–Bernoulli beams without thermal bending
	}
	f.length, f.elastic, f.area, f.second = m.Length(), seg.Material.Elastic, seg.Section.Area, seg.Section.SecondMoment
	conditions := endConditions(m)
	for i, s := range m.Supports {
		if s.Stiffness != [3]float64{} || s.Settlement != [3]float64{} {
			return f, false
		}
		if c := conditions[i]; c != Free {
			f.beamSupports = append(f.beamSupports, placed{s.X, c})
		}
		if s.Kind.Restrains(fem.Axial) {
			f.barSupports = append(f.barSupports, placed{x: s.X})
		}
	}
	f.beamSupports = uniquePlaces(f.beamSupports, f.length)
	for _, p := range m.PointLoads {
		if p != (fem.PointLoad{X: p.X}) {
			f.points = append(f.points, p)
		}
	}
	for _, p := range f.points {
		// A case has either a transverse or an axial point load, never a moment or both.
		f.other = f.other || p.Moment != 0 || (p.Axial != 0 && p.Transverse != 0)
	}
	loads := fem.GatherLoads(m, fem.KeyPoints(m))
	var uniformAlong, uniformAcross bool
	f.axialWeight, uniformAlong = uniformOver(loads.Axial)
	f.uniform, uniformAcross = uniformOver(loads.Transverse)
	f.other = f.other || !uniformAlong || !uniformAcross
	f.other = f.other || len(f.points) > 1 || (len(f.points) == 1 && (f.uniform != 0 || f.axialWeight != 0))
	return f, true
}

// uniformOver reports whether the line load, given per stretch at both
// ends (fem.Loads), has one intensity over the whole member, and which.
func uniformOver(stretches [][2]float64) (float64, bool) {
	q := stretches[0][0]
	for _, s := range stretches {
		if s[0] != q || s[1] != q {
			return 0, false
		}
	}
	return q, true
}

// uniquePlaces sorts ps by position and keeps one entry per position
// (endConditionAt already combined the supports there).
func uniquePlaces(ps []placed, length float64) []placed {
	slices.SortFunc(ps, func(a, b placed) int { return cmp.Compare(a.x, b.x) })
	var out []placed
	for _, p := range ps {
		if len(out) == 0 || p.x-out[len(out)-1].x > samePlace*length {
			out = append(out, p)
		}
	}
	return out
}

func beamCase(f memberFacts, L, ei float64) (Case, bool) {
	at := func(x float64) bool { return math.Abs(x) <= samePlace*L }
	s := f.beamSupports
	q := f.uniform
	pointAt := func(x float64) (float64, bool) {
		if len(f.points) != 1 || !at(f.points[0].X-x) {
			return 0, false
		}
		return f.points[0].Transverse, true
	}
	simple := func(p placed) bool { return p.kind == Pinned }
	switch {
	case len(s) == 1 && s[0].kind == Fixed && (at(s[0].x) || at(s[0].x-L)):
		fixed, free := s[0].x, L-s[0].x
		if P, ok := pointAt(free); ok {
			return Case{Name: "Cantilever, point load at the free end", Formula: "δ = PL³/(3EI), M = PL at the support, R = P",
				Source: roark + "1a with a = 0" + fromMemory, Quantities: []Quantity{
					{"deflection at the free end", P * L * L * L / (3 * ei), units.Deflection, free, DeflectionAt},
					{"bending moment at the support", P * L, units.Moment, fixed, BendingMomentAt},
					{"support reaction", -P, units.Force, fixed, TransverseReactionAt},
				}}, true
		}
		if len(f.points) == 0 {
			return Case{Name: "Cantilever, uniform load", Formula: "δ = qL⁴/(8EI), M = qL²/2 at the support, R = qL",
				Source: roark + "2a with a uniform load over the whole span" + fromMemory, Quantities: []Quantity{
					{"deflection at the free end", q * L * L * L * L / (8 * ei), units.Deflection, free, DeflectionAt},
					{"bending moment at the support", q * L * L / 2, units.Moment, fixed, BendingMomentAt},
					{"support reaction", -q * L, units.Force, fixed, TransverseReactionAt},
				}}, true
		}
	case len(s) == 2 && at(s[0].x) && at(s[1].x-L) && simple(s[0]) && simple(s[1]):
		if P, ok := pointAt(L / 2); ok {
			return Case{Name: "Simply supported, point load at midspan", Formula: "δ = PL³/(48EI), M = PL/4, R = P/2",
				Source: roark + "1e with a = L/2" + fromMemory, Quantities: []Quantity{
					{"deflection at midspan", P * L * L * L / (48 * ei), units.Deflection, L / 2, DeflectionAt},
					{"bending moment at midspan", -P * L / 4, units.Moment, L / 2, BendingMomentAt},
					{"left reaction", -P / 2, units.Force, 0, TransverseReactionAt},
					{"right reaction", -P / 2, units.Force, L, TransverseReactionAt},
				}}, true
		}
		if len(f.points) == 0 {
			return Case{Name: "Simply supported, uniform load", Formula: "δmax = 5qL⁴/(384EI), Mmax = qL²/8, R = qL/2",
				Source: roark + "2e with a uniform load over the whole span" + fromMemory, Quantities: []Quantity{
					{"deflection at midspan", 5 * q * L * L * L * L / (384 * ei), units.Deflection, L / 2, DeflectionAt},
					{"bending moment at midspan", -q * L * L / 8, units.Moment, L / 2, BendingMomentAt},
					{"left reaction", -q * L / 2, units.Force, 0, TransverseReactionAt},
					{"right reaction", -q * L / 2, units.Force, L, TransverseReactionAt},
				}}, true
		}
	case len(f.points) > 0:
	case len(s) == 2 && at(s[0].x) && at(s[1].x-L) && s[0].kind == Fixed && s[1].kind == Fixed:
		return Case{Name: "Fixed at both ends, uniform load", Formula: "δmax = qL⁴/(384EI), M = qL²/12 at the ends and qL²/24 at midspan, R = qL/2",
			Source: roark + "2d with a uniform load over the whole span" + fromMemory, Quantities: []Quantity{
				{"deflection at midspan", q * L * L * L * L / (384 * ei), units.Deflection, L / 2, DeflectionAt},
				{"bending moment at the left end", q * L * L / 12, units.Moment, 0, BendingMomentAt},
				{"bending moment at midspan", -q * L * L / 24, units.Moment, L / 2, BendingMomentAt},
				{"left reaction", -q * L / 2, units.Force, 0, TransverseReactionAt},
			}}, true
	case len(s) == 2 && at(s[0].x) && at(s[1].x-L) && (s[0].kind == Fixed && simple(s[1]) || simple(s[0]) && s[1].kind == Fixed):
		fixed, prop := s[0].x, s[1].x
		if s[1].kind == Fixed {
			fixed, prop = prop, fixed
		}
		toward := func(t float64) float64 { return prop + (fixed-prop)*t }
		return Case{Name: "Propped cantilever, uniform load", Formula: "δmax = qL⁴/(185EI) at 0.4215L from the simple support, M = qL²/8 at the fixed end, R = 5qL/8 and 3qL/8",
			Source: roark + "2c with a uniform load over the whole span" + fromMemory, Quantities: []Quantity{
				{"largest deflection", proppedDeflection * q * L * L * L * L / ei, units.Deflection, toward(propped), DeflectionAt},
				{"bending moment at the fixed end", q * L * L / 8, units.Moment, fixed, BendingMomentAt},
				{"largest sagging moment", -9 * q * L * L / 128, units.Moment, toward(3.0 / 8), BendingMomentAt},
				{"reaction at the fixed end", -5 * q * L / 8, units.Force, fixed, TransverseReactionAt},
				{"reaction at the simple support", -3 * q * L / 8, units.Force, prop, TransverseReactionAt},
			}}, true
	case len(s) == 3 && at(s[0].x) && at(s[1].x-L/2) && at(s[2].x-L) && simple(s[0]) && simple(s[1]) && simple(s[2]):
		l := L / 2
		return Case{Name: "Two equal spans, uniform load", Formula: "R = 3ql/8, 10ql/8, 3ql/8; M = ql²/8 over the middle support; δmax = ql⁴/(185EI) at 0.4215l from an end",
			Source: "AISC Steel Construction Manual, Table 3-23, continuous beam, two equal spans, uniform load on both spans (from memory); each span acts as a propped cantilever, " + roark + "2c" + fromMemory,
			Quantities: []Quantity{
				{"largest deflection", proppedDeflection * q * l * l * l * l / ei, units.Deflection, propped * l, DeflectionAt},
				{"bending moment over the middle support", q * l * l / 8, units.Moment, l, BendingMomentAt},
				{"largest sagging moment", -9 * q * l * l / 128, units.Moment, 3 * l / 8, BendingMomentAt},
				{"end reaction", -3 * q * l / 8, units.Force, 0, TransverseReactionAt},
				{"middle reaction", -10 * q * l / 8, units.Force, l, TransverseReactionAt},
			}}, true
	}
	return Case{}, false
}

func barCase(f memberFacts, L, ea float64) (Case, bool) {
	if len(f.barSupports) != 1 {
		return Case{}, false
	}
	held := f.barSupports[0].x
	atEnd := math.Abs(held) <= samePlace*L || math.Abs(held-L) <= samePlace*L
	if !atEnd {
		return Case{}, false
	}
	free, toward := L-held, 1.0 // toward: +1 when the free end is at x = L
	if held > 0 {
		free, toward = 0, -1
	}
	if len(f.points) == 1 && math.Abs(f.points[0].X-free) <= samePlace*L && f.axialWeight == 0 {
		P := f.points[0].Axial
		return Case{Name: "Bar fixed at one end, axial load at the other", Formula: "δ = PL/(EA), N = P",
			Source: "Mechanics of Materials (Gere & Goodno), axially loaded members, δ = PL/(EA) (from memory)", Quantities: []Quantity{
				{"displacement of the loaded end", P * L / ea, units.Deflection, free, AxialDisplacementAt},
				{"axial force", toward * P, units.Force, L / 2, AxialForceAt},
				{"support reaction", -P, units.Force, held, AxialReactionAt},
			}}, true
	}
	if len(f.points) == 0 && f.axialWeight != 0 {
		p := f.axialWeight
		return Case{Name: "Rod under its own weight, held at one end", Formula: "δ = ρgL²/(2E), N = ρgAL at the support",
			Source: "Mechanics of Materials (Gere & Goodno), bar hanging under its own weight, δ = WL/(2EA) (from memory)", Quantities: []Quantity{
				{"displacement of the free end", p * L * L / (2 * ea), units.Deflection, free, AxialDisplacementAt},
				{"axial force at the support", toward * p * L, units.Force, held, AxialForceAt},
				{"support reaction", -p * L, units.Force, held, AxialReactionAt},
			}}, true
	}
	return Case{}, false
}
