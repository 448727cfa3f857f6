package canvas

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"

	"stave/fem"
	"stave/fem/units"
)

// csvPreamble opens every results table: comment lines (read with
// csv.Reader.Comment = '#') with the caution and the sign conventions, since
// a table travels without the window around it.
var csvPreamble = []string{
	"# Stave results. " + Caution,
	"# Signs: x along the member; u along +x; w up; theta and moments counter-clockwise;",
	"# N tension positive; M sagging positive (M = EI w''); V = dM/dx; stresses tension positive, bending in the bottom fibre.",
}

// WriteCSV writes x and every result quantity, finite element and (when e is
// not nil) exact, at perElement+1 points in each element, both ends included,
// in the display units of u named in the header, after a preamble of comment
// lines. An element's start is read from the right and its end from the left,
// so jumps show as two rows at one x.
func WriteCSV(w io.Writer, s *fem.Solution, e *fem.Exact, u units.System, perElement int) error {
	if s == nil {
		return fmt.Errorf("canvas: there are no results to write: solve the model first")
	}
	if perElement < 1 {
		return fmt.Errorf("canvas: %d points per element is too few: use at least 1", perElement)
	}
	if u.Name == "" {
		u = units.SI
	}
	for _, line := range csvPreamble {
		if _, err := fmt.Fprintln(w, line); err != nil {
			return err
		}
	}
	cw := csv.NewWriter(w)
	header := []string{fmt.Sprintf("x [%s]", u.Unit(units.Position).Symbol)}
	qs := fem.Quantities()
	for _, q := range qs {
		c := q.Info()
		sym := u.Unit(c.Unit).Symbol
		header = append(header, fmt.Sprintf("%s FE [%s]", c.Column, sym))
		if e != nil {
			header = append(header, fmt.Sprintf("%s exact [%s]", c.Column, sym))
		}
	}
	if err := cw.Write(header); err != nil {
		return err
	}
	num := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	row := make([]string, 0, len(header))
	for _, el := range s.Mesh.Elements {
		for j := 0; j <= perElement; j++ {
			x := el.Start + (el.End-el.Start)*float64(j)/float64(perElement)
			side := fem.Right
			if j == perElement {
				side = fem.Left
			}
			fe := s.At(x, side)
			var ex fem.Fields
			if e != nil {
				ex = e.At(x, side)
			}
			row = append(row[:0], num(u.ToDisplay(units.Position, x)))
			for _, q := range qs {
				kind := q.Info().Unit
				row = append(row, num(u.ToDisplay(kind, q.Of(&fe))))
				if e != nil {
					row = append(row, num(u.ToDisplay(kind, q.Of(&ex))))
				}
			}
			if err := cw.Write(row); err != nil {
				return err
			}
		}
	}
	cw.Flush()
	return cw.Error()
}
