package report

import (
	"context"
	"fmt"
	"io"

	"stave/canvas"
	"stave/fem"
	"stave/fem/analysis"
	"stave/fem/study"
)

// multiplesPerStretch are the meshes of the small multiples: so many
// elements on each stretch between key points.
var multiplesPerStretch = []int{1, 2, 4, 8}

// writeMultiples writes the small multiples of src's project as format:
// its member analysed on 1, 2, 4 and 8 elements per stretch between key
// points, drawn one under the other with each one's largest gaps, each
// showing what src's analysis shows of a model with cases. Each drawing is
// opts.Width × opts.Height/2 points.
func writeMultiples(ctx context.Context, w io.Writer, src Source, format string, opts Options) error {
	p := src.Project
	keys := fem.KeyPoints(&p.Model)
	var ms []canvas.Multiple
	for _, n := range multiplesPerStretch {
		r := Request(p, study.Subdivide(keys, n))
		r.Checks.Units = src.Units
		if a := src.Analysis; a != nil && a.Cases != nil {
			r.Show = a.Cases.Show
		}
		a, err := analysis.Run(ctx, r)
		if err != nil {
			return err
		}
		s := NewSource(p, &a)
		s.Units, s.Dimensions = src.Units, src.Dimensions
		words := perStretchWords(n)
		if a.Solution != nil {
			words += fmt.Sprintf(" (%d in all)", len(a.Solution.Mesh.Elements))
		}
		ms = append(ms, canvas.Multiple{Input: drawing(s), Mesh: words})
	}
	return canvas.WriteMultiples(w, format, ms, opts.Width, opts.Height/2, opts.DPI/72)
}

// perStretchWords names a mesh of n elements per stretch.
func perStretchWords(n int) string {
	if n == 1 {
		return "1 element per stretch"
	}
	return fmt.Sprintf("%d elements per stretch", n)
}
