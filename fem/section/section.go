// Package section computes the properties of common cross-sections from
// their dimensions, for bending in the member's plane (about the strong axis
// where there is one).
//
// Each shape function takes dimensions in m and returns Properties in SI:
// area A (m²), second moment of area I (m⁴), the distance c from the
// neutral axis to the extreme fibre (m) and the elastic section modulus
// S = I/c (m³). Properties.Section gives the fem.Section a segment needs.
//
// Shapes are idealised: corners are sharp and rolled fillets and weld
// material are left out, so a rolled or cold-formed section's tabulated
// values differ by a few per cent. Use the tabulated values where you have
// them.
package section

import (
	"fmt"
	"math"

	"stave/fem"
	"stave/fem/units"
)

// Properties are the elastic properties of a cross-section for bending in
// the member's plane.
type Properties struct {
	Area           float64 // A, m²
	SecondMoment   float64 // I about the bending axis, m⁴
	FibreDistance  float64 // c, neutral axis to extreme fibre, m
	SectionModulus float64 // S = I/c, m³
}

// Section is the part of the properties the fem solver uses.
func (p Properties) Section() fem.Section {
	return fem.Section{Area: p.Area, SecondMoment: p.SecondMoment, FibreDistance: p.FibreDistance}
}

// symmetric builds Properties for a shape symmetric about its bending axis,
// so the extreme fibre is at half the depth.
func symmetric(area, secondMoment, depth float64) Properties {
	c := depth / 2
	return Properties{Area: area, SecondMoment: secondMoment, FibreDistance: c, SectionModulus: secondMoment / c}
}

// Rectangle is a solid rectangle of width b and depth h (h in the plane of
// bending): I = b·h³/12.
func Rectangle(b, h float64) (Properties, error) {
	if err := positive("rectangle", dim{"width b", b}, dim{"depth h", h}); err != nil {
		return Properties{}, err
	}
	return symmetric(b*h, b*h*h*h/12, h), nil
}

// SolidRound is a solid circle of diameter d: I = π·d⁴/64.
func SolidRound(d float64) (Properties, error) {
	if err := positive("solid round", dim{"diameter d", d}); err != nil {
		return Properties{}, err
	}
	return symmetric(math.Pi*d*d/4, math.Pi*math.Pow(d, 4)/64, d), nil
}

// RoundTube is a circular hollow section of outside diameter D and wall
// thickness t: I = π·(D⁴ − d⁴)/64 with d = D − 2t.
func RoundTube(outside, wall float64) (Properties, error) {
	if err := positive("round tube", dim{"outside diameter D", outside}, dim{"wall thickness t", wall}); err != nil {
		return Properties{}, err
	}
	if 2*wall >= outside {
		return Properties{}, fmt.Errorf("round tube: wall thickness t = %s is at least half the outside diameter D = %s, so there is no hole; use a solid round, or a wall thinner than %s",
			show(wall), show(outside), show(outside/2))
	}
	inside := outside - 2*wall
	area := math.Pi * (outside*outside - inside*inside) / 4
	return symmetric(area, math.Pi*(math.Pow(outside, 4)-math.Pow(inside, 4))/64, outside), nil
}

// RectangularHollow is a box of outside width B, outside depth H (in the
// plane of bending) and wall thickness t, with sharp corners:
// I = B·H³/12 − b·h³/12 with b = B − 2t, h = H − 2t.
func RectangularHollow(width, depth, wall float64) (Properties, error) {
	if err := positive("rectangular hollow section", dim{"width B", width}, dim{"depth H", depth}, dim{"wall thickness t", wall}); err != nil {
		return Properties{}, err
	}
	if smaller := math.Min(width, depth); 2*wall >= smaller {
		return Properties{}, fmt.Errorf("rectangular hollow section: wall thickness t = %s is at least half the smaller outside dimension %s, so there is no hole; use a rectangle, or a wall thinner than %s",
			show(wall), show(smaller), show(smaller/2))
	}
	b, h := width-2*wall, depth-2*wall
	return symmetric(width*depth-b*h, (width*depth*depth*depth-b*h*h*h)/12, depth), nil
}

// IShape is a doubly symmetric I (or H) shape of flange width b, overall
// depth h, flange thickness tf and web thickness tw, bent about its strong
// axis: I = b·h³/12 − (b − tw)·(h − 2tf)³/12. Root fillets are left out.
func IShape(flangeWidth, depth, flangeThickness, webThickness float64) (Properties, error) {
	if err := positive("I shape", dim{"flange width b", flangeWidth}, dim{"depth h", depth},
		dim{"flange thickness tf", flangeThickness}, dim{"web thickness tw", webThickness}); err != nil {
		return Properties{}, err
	}
	if 2*flangeThickness >= depth {
		return Properties{}, fmt.Errorf("I shape: the two flanges (2 × tf = %s) fill the whole depth h = %s, leaving no web; make tf less than %s or use a rectangle",
			show(2*flangeThickness), show(depth), show(depth/2))
	}
	if webThickness > flangeWidth {
		return Properties{}, fmt.Errorf("I shape: web thickness tw = %s is wider than the flanges (b = %s); check that b and tw are not swapped",
			show(webThickness), show(flangeWidth))
	}
	web := depth - 2*flangeThickness
	area := 2*flangeWidth*flangeThickness + web*webThickness
	second := (flangeWidth*depth*depth*depth - (flangeWidth-webThickness)*web*web*web) / 12
	return symmetric(area, second, depth), nil
}

type dim struct {
	name  string
	value float64
}

func positive(shape string, dims ...dim) error {
	for _, d := range dims {
		if !(d.value > 0) || math.IsInf(d.value, 0) {
			return fmt.Errorf("%s: %s = %s must be a positive, finite length", shape, d.name, show(d.value))
		}
	}
	return nil
}

func show(v float64) string { return units.SI.Format(units.Dimension, v) }
