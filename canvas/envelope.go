package canvas

import (
	"image/color"
	"math"

	"stave/fem"
	"stave/fem/units"
)

// Envelope is the envelope of a model's combinations, drawn in every strip
// instead of one solution: its upper and lower curve, and the exact
// solutions' envelope with the gap between them when the exact band is on.
type Envelope struct {
	Solutions *fem.CombinationSolutions
	// Result is the envelope in closed form, whose extremes are labelled
	// with their combinations; nil labels the sampled extremes alone.
	Result *fem.Envelope
	Names  []string // the combinations', as Result's Combination indices count them
	// TrainsLeftOut says a combination takes moving load trains, which
	// the envelope leaves out (it is of each combination's cases alone):
	// the strips say so.
	TrainsLeftOut bool
}

// envelopeStrip is the envelope of one strip's quantity as curves.
type envelopeStrip struct {
	quantity       fem.Quantity
	hi, lo         *curve
	exactHi, exact *curve // the exact lower curve is exact; nil without the exact band
}

// envelopeCurves samples the envelope once per pixel column and on both
// sides of every key point, for the strips' quantities.
func (b *builder) envelopeCurves(qs []fem.Quantity) []envelopeStrip {
	env := b.in.Envelope
	exact := b.in.Overlays.ExactBand && env.Solutions.FixedExact != nil
	out := make([]envelopeStrip, len(qs))
	for i, q := range qs {
		out[i] = envelopeStrip{quantity: q, hi: new(curve), lo: new(curve)}
		out[i].hi.reset(b.v)
		out[i].lo.reset(b.v)
		if exact {
			out[i].exactHi, out[i].exact = new(curve), new(curve)
			out[i].exactHi.reset(b.v)
			out[i].exact.reset(b.v)
		}
	}
	l := b.in.Model.Length()
	eachPixel(b.in.Model, b.v, func(x float64, side fem.Side) {
		if x <= 0 {
			side = fem.Right
		} else if x >= l {
			side = fem.Left
		}
		s := env.Solutions.At(x, side, false)
		var e fem.EnvelopeSample
		if exact {
			e = env.Solutions.At(x, side, true)
		}
		for i := range out {
			o := &out[i]
			o.hi.add(x, o.quantity.Of(&s.Hi))
			o.lo.add(x, o.quantity.Of(&s.Lo))
			if exact {
				o.exactHi.add(x, o.quantity.Of(&e.Hi))
				o.exact.add(x, o.quantity.Of(&e.Lo))
			}
		}
	})
	for _, o := range out {
		for _, c := range []*curve{o.hi, o.lo, o.exactHi, o.exact} {
			if c != nil {
				c.finish()
			}
		}
	}
	return out
}

// envelopeRange widens lo and hi to the lower curves of es.
func (es *envelopeStrip) envelopeRange(lo, hi float64) (float64, float64) {
	for _, c := range []*curve{es.lo, es.exact} {
		if c != nil && c.n > 0 {
			lo, hi = min(lo, c.lo.value), max(hi, c.hi.value)
		}
	}
	return lo, hi
}

// envelopeLower draws the lower curves of es below the upper ones already
// drawn: the area between the envelope's curves, the lower curve, the
// exact lower curve with its gap.
func (b *builder) envelopeLower(es *envelopeStrip, colour color.NRGBA, toY func(float64) float32) {
	hi, lo := es.hi.points(toY), es.lo.points(toY)
	if len(hi) > 0 && len(lo) > 0 {
		area := append([]Point{}, hi...)
		for k := len(lo) - 1; k >= 0; k-- {
			area = append(area, lo[k])
		}
		b.polygon(withAlpha(colour, 0x30), color.NRGBA{}, 0, area...)
	}
	if es.exact != nil && es.exact.n > 0 {
		ex := es.exact.points(toY)
		band := append([]Point{}, lo...)
		for k := len(ex) - 1; k >= 0; k-- {
			band = append(band, ex[k])
		}
		b.polygon(gapFill, color.NRGBA{}, 0, band...)
		b.line(exactColour, 0.9, ex...)
	}
	if len(lo) > 0 {
		b.line(colour, 1.8, lo...)
	}
}

// envelopeExtremes marks the envelope's largest and smallest value of the
// strip's quantity and returns their labels, each naming the combination
// that governs it; without the closed form, the largest and smallest
// sample of es. A value near zero against the largest is left unmarked.
func (b *builder) envelopeExtremes(d diagram, es *envelopeStrip, toY func(float64) float32) []label {
	q, env := d.quantity, b.in.Envelope
	type peak struct {
		x, value float64
		by       string
		side     fem.Side // of x, where the field jumps there
	}
	var peaks []peak
	if env.Result == nil {
		if es.hi.n > 0 {
			peaks = []peak{{es.hi.hi.x, es.hi.hi.value, "", 0}, {es.lo.lo.x, es.lo.lo.value, "", 0}}
		}
	} else {
		for _, qe := range env.Result.Quantities {
			if qe.Quantity == q {
				for _, g := range []fem.Governing{qe.Max, qe.Min} {
					peaks = append(peaks, peak{g.X, g.Value, env.Names[g.Combination], g.Side})
				}
			}
		}
	}
	size := 0.0
	for _, p := range peaks {
		size = max(size, math.Abs(p.value))
	}
	var labels []label
	for _, p := range peaks {
		if !labelled(p.value, p.value, size) {
			continue
		}
		at := Point{b.sx(p.x), toY(p.value)}
		b.marker(at, 2.5, d.colour, false)
		s := b.format(q.Info().Unit, p.value) + " " + p.side.At(b.format(units.Position, p.x))
		if p.by != "" {
			s += ", " + p.by
		}
		up := (p.value > 0) != d.downPositive
		labels = append(labels, label{lines: []string{s}, size: smallSize, colour: inkColour, at: at, spots: besideSpots(at, up)})
	}
	return labels
}
