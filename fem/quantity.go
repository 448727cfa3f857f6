package fem

import (
	"fmt"
	"strings"

	"stave/fem/units"
)

// Quantity names one result quantity of Fields. Every output (summaries,
// the calculation sheet, CSV tables, the diagrams, the window's readout and
// the command line) lists quantities from this one table, so a quantity is
// named, given its unit and read from the fields in one place.
type Quantity int

// The result quantities, in the order reports list them.
const (
	QAxialDisplacement Quantity = iota // u, m
	QDeflection                        // w, m, positive up
	QRotation                          // θ = dw/dx, rad, counter-clockwise
	QAxialForce                        // N, N, tension positive
	QShearForce                        // V = dM/dx, N
	QBendingMoment                     // M, N·m, sagging positive
	QAxialStress                       // N/A, Pa
	QBendingStress                     // M·c/I, Pa
	QCombinedStress                    // N/A ± M·c/I of larger magnitude, Pa
	quantityCount
)

// QuantityInfo describes a quantity for every output.
type QuantityInfo struct {
	// Field is the name of the quantity's member of Fields, as JSON
	// summaries name it.
	Field string
	// Name is the trade's words for it, lower case: "bending moment".
	Name string
	// Symbol is its usual letter or formula: "M", "N/A".
	Symbol string
	// Label is a short label for narrow readouts, symbol first: "M bending".
	Label string
	// Column is its name in a CSV header: short, ASCII, no spaces.
	Column string
	// Unit is the kind of value, which picks the display unit.
	Unit units.Kind
	// SI is the symbol of its SI base unit, in which fem works.
	SI string
}

var quantityInfo = [quantityCount]QuantityInfo{
	QAxialDisplacement: {"AxialDisplacement", "axial displacement", "u", "u axial", "u", units.Deflection, "m"},
	QDeflection:        {"Deflection", "deflection", "w", "w deflection", "w", units.Deflection, "m"},
	QRotation:          {"Rotation", "rotation", "θ", "θ rotation", "theta", units.Rotation, "rad"},
	QAxialForce:        {"AxialForce", "axial force", "N", "N axial force", "N", units.Force, "N"},
	QShearForce:        {"ShearForce", "shear force", "V", "V shear force", "V", units.Force, "N"},
	QBendingMoment:     {"BendingMoment", "bending moment", "M", "M bending", "M", units.Moment, "N·m"},
	QAxialStress:       {"AxialStress", "axial stress", "N/A", "σ axial N/A", "sigma_axial", units.Stress, "Pa"},
	QBendingStress:     {"BendingStress", "bending stress", "Mc/I", "σ bending Mc/I", "sigma_bending", units.Stress, "Pa"},
	QCombinedStress:    {"CombinedStress", "combined stress", "", "σ combined", "sigma_combined", units.Stress, "Pa"},
}

// Quantities lists every result quantity in report order.
func Quantities() []Quantity {
	qs := make([]Quantity, quantityCount)
	for i := range qs {
		qs[i] = Quantity(i)
	}
	return qs
}

// Info describes q; a value outside the table gives the zero QuantityInfo.
func (q Quantity) Info() QuantityInfo {
	if q < 0 || q >= quantityCount {
		return QuantityInfo{}
	}
	return quantityInfo[q]
}

// String is the quantity's name in the trade's words.
func (q Quantity) String() string {
	if n := q.Info().Name; n != "" {
		return n
	}
	return "unknown quantity"
}

// Key is q's name as JSON documents give it: its Name in snake_case,
// "bending_moment".
func (q Quantity) Key() string { return strings.ReplaceAll(q.Info().Name, " ", "_") }

// MarshalText writes q as its Key.
func (q Quantity) MarshalText() ([]byte, error) {
	if q.Info().Field == "" {
		return nil, fmt.Errorf("fem: quantity %d is not in the table", int(q))
	}
	return []byte(q.Key()), nil
}

// ParseQuantity finds the quantity whose Field, Name, Key or Column is s.
func ParseQuantity(s string) (Quantity, bool) {
	for i, info := range quantityInfo {
		if s == info.Field || s == info.Name || s == Quantity(i).Key() || s == info.Column {
			return Quantity(i), true
		}
	}
	return 0, false
}

// Of reads q from f.
func (q Quantity) Of(f *Fields) float64 {
	switch q {
	case QAxialDisplacement:
		return f.AxialDisplacement
	case QDeflection:
		return f.Deflection
	case QRotation:
		return f.Rotation
	case QAxialForce:
		return f.AxialForce
	case QShearForce:
		return f.ShearForce
	case QBendingMoment:
		return f.BendingMoment
	case QAxialStress:
		return f.AxialStress
	case QBendingStress:
		return f.BendingStress
	case QCombinedStress:
		return f.CombinedStress
	}
	return 0
}
