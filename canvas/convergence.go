package canvas

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"strconv"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"stave/fem"
)

// ConvergenceRow is the error of one solution of a mesh refinement study.
type ConvergenceRow struct {
	Elements int
	Errors   fem.ErrorNorms
}

// ConvergenceRates are the rates a convergence study measured for each
// error measure (NaN for none), for the chart's legend, and the relative
// error below which an error is round-off and is not plotted.
type ConvergenceRates struct {
	Displacement, Energy, Stress float64
	Floor                        float64
}

// convergenceSeries are the error measures a chart plots.
var convergenceSeries = []struct {
	name   string
	colour color.NRGBA
	get    func(fem.ErrorNorms) float64
	rate   func(ConvergenceRates) float64
}{
	{fem.DisplacementErrorName, rgb(0x15, 0x65, 0xc0), func(e fem.ErrorNorms) float64 { return e.RelativeL2 },
		func(r ConvergenceRates) float64 { return r.Displacement }},
	{fem.EnergyErrorName, rgb(0x7b, 0x1f, 0xa2), func(e fem.ErrorNorms) float64 { return e.RelativeEnergy },
		func(r ConvergenceRates) float64 { return r.Energy }},
	{fem.StressErrorName + " / largest stress", rgb(0xa8, 0x4a, 0x00), func(e fem.ErrorNorms) float64 { return e.MaxStressRelative },
		func(r ConvergenceRates) float64 { return r.Stress }},
}

// WriteConvergenceChart plots the errors against the number of elements on
// log-log axes, leaving out errors at round-off (rates.Floor), with the
// rate the study measured for each measure in the legend, as "png", "svg"
// or "pdf" (16 × 11 cm).
func WriteConvergenceChart(w io.Writer, format string, rows []ConvergenceRow, rates ConvergenceRates) error {
	if len(rows) < 2 {
		return fmt.Errorf("canvas: a convergence chart needs at least two meshes, got %d: refine the mesh and solve again", len(rows))
	}
	p := plot.New()
	p.Title.Text = "Error against the exact solution"
	p.X.Label.Text = "number of elements"
	p.Y.Label.Text = "relative error"
	p.X.Scale, p.Y.Scale = plot.LogScale{}, plot.LogScale{}
	p.X.Tick.Marker, p.Y.Tick.Marker = powerTicks{}, powerTicks{}
	p.Legend.Left = true // the errors fall to the right, leaving the lower left empty
	p.Legend.TextStyle.Font.Size = 9
	p.Add(plotter.NewGrid())
	plotted := 0
	for _, series := range convergenceSeries {
		var pts plotter.XYs
		for _, r := range rows {
			if e := series.get(r.Errors); e > rates.Floor && r.Elements > 0 {
				pts = append(pts, plotter.XY{X: float64(r.Elements), Y: e})
			}
		}
		if len(pts) == 0 {
			continue
		}
		line, points, err := plotter.NewLinePoints(pts)
		if err != nil {
			return fmt.Errorf("canvas: convergence chart: %v", err)
		}
		line.Color, points.Color = series.colour, series.colour
		points.Shape = draw.CircleGlyph{}
		p.Add(line, points)
		label := series.name
		if r := series.rate(rates); !math.IsNaN(r) {
			label += fmt.Sprintf(": rate %.2f", r)
		}
		p.Legend.Add(label, line, points)
		plotted++
	}
	if plotted == 0 {
		return fmt.Errorf("canvas: every error in the convergence study is round-off or not a number: there is nothing to plot on log axes")
	}
	wt, err := p.WriterTo(16*vg.Centimeter, 11*vg.Centimeter, format)
	if err != nil {
		return fmt.Errorf("canvas: cannot write a convergence chart as %q: %v", format, err)
	}
	_, err = wt.WriteTo(w)
	return err
}

// powerTicks marks the powers of ten, and 2 and 5 times them when a range
// spans fewer than two powers, with short labels ("1e-05" rather than a
// rounding of 0.00001).
type powerTicks struct{}

// Ticks implements plot.Ticker.
func (powerTicks) Ticks(lo, hi float64) []plot.Tick {
	if lo <= 0 || hi <= lo {
		return nil
	}
	first, last := int(math.Floor(math.Log10(lo))), int(math.Ceil(math.Log10(hi)))
	few := last-first <= 2
	var ticks []plot.Tick
	for e := first; e <= last; e++ {
		for _, m := range []float64{1, 2, 3, 4, 5, 6, 7, 8, 9} {
			v := m * math.Pow(10, float64(e))
			if v < lo*(1-1e-9) || v > hi*(1+1e-9) {
				continue
			}
			t := plot.Tick{Value: v}
			if m == 1 || (few && (m == 2 || m == 5)) {
				t.Label = tickLabel(v)
			}
			ticks = append(ticks, t)
		}
	}
	return ticks
}

func tickLabel(v float64) string {
	if v >= 1e-3 && v < 1e5 {
		return strconv.FormatFloat(v, 'f', -1, 64)
	}
	return fmt.Sprintf("%.0e", v)
}
