package canvas

import (
	"bufio"
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"strings"

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

// groundColumn is a column of what the foundations carry, per unit length
// of member: the force of the ground on the member, −modulus × displacement.
type groundColumn struct {
	Column       string
	modulus      func(fem.Foundation) float64 // N/m²
	displacement func(*fem.Fields) float64    // m
}

// groundColumns are the results table's ground columns, taken for a model
// whose foundations have any modulus of that kind.
var groundColumns = []groundColumn{
	{"ground across", func(f fem.Foundation) float64 { return f.Modulus }, func(f *fem.Fields) float64 { return f.Deflection }},
	{"ground along", func(f fem.Foundation) float64 { return f.AxialModulus }, func(f *fem.Fields) float64 { return f.AxialDisplacement }},
}

// groundOf are the ground columns of model m.
func groundOf(m *fem.Model) []groundColumn {
	var out []groundColumn
	for _, g := range groundColumns {
		for _, f := range m.Foundations {
			if g.modulus(f) > 0 {
				out = append(out, g)
				break
			}
		}
	}
	return out
}

// Points per element of the results table by default (DefaultCSVPoints):
// four intervals per element up to csvRows rows in all, fewer on larger
// meshes, and never fewer than one (both ends of every element, so every
// jump shows).
const (
	csvDefaultPoints = 4
	csvRows          = 100_000
	// CSVMaxPoints bounds the intervals per element a table may ask for.
	CSVMaxPoints = 1000
	// CSVMaxRows bounds the rows of a table that samples its elements
	// inside, about 300 bytes each: 600 MB at most (1,000 intervals in each
	// of 100,000 elements, 1e8 rows, had streamed 3.4 GB to disk after
	// 25 s, of some 30 GB). The ends of every element alone, the mesh's own
	// table, are written on any mesh: the mesh is the user's, the table
	// streams.
	CSVMaxRows = 2_000_000
)

// DefaultCSVPoints is the number of intervals each of elements elements is
// sampled in by default: 4, fewer above 20,000 elements so that a table
// keeps to about 100,000 rows, and at least 1.
func DefaultCSVPoints(elements int) int {
	return max(1, min(csvDefaultPoints, csvRows/max(elements, 1)-1))
}

// RowsError is the refusal of a table that samples inside its elements
// and would have more than CSVMaxRows rows: PerElement intervals in each of
// Elements elements. The number of intervals is the caller's choice, so a
// command line reports it as misuse of its flag.
type RowsError struct{ Elements, PerElement int }

func (e *RowsError) Error() string {
	return fmt.Sprintf("canvas: the table would have %d rows (%d elements at %d points each), more than the %d a table sampled inside its elements holds: ask for at most %s per element",
		e.Elements*(e.PerElement+1), e.Elements, e.PerElement+1, CSVMaxRows, units.Count(max(1, CSVMaxRows/e.Elements-1), "interval"))
}

// WriteCSV writes x and every result quantity, finite element and (when e is
// not nil) exact, at perElement+1 points in each element, both ends included,
// in the display units of u (SI when u is the zero System), after a preamble
// of comment lines that states the unit system and the units of every
// column, and then the lines of notes as comment lines (the results with
// their checks and warnings, say; a table travels without the window).
// With foundations, columns of the ground's force on the member per unit
// length follow the quantities. An element's start is read from the right and its end from the
// left, so jumps show as two rows at one x. The table is streamed: it is
// formatted in chunks of elements walked in order (fem.Solution.Elements),
// into a few reused buffers, so memory does not grow with the mesh. A
// table of more than CSVMaxRows rows that samples inside its elements is
// refused before anything is written.
func WriteCSV(w io.Writer, s *fem.Solution, e *fem.Exact, u units.System, perElement int, notes []string) error {
	if s == nil {
		return fmt.Errorf("canvas: there are no results to write: solve the model first")
	}
	if perElement < 1 || perElement > CSVMaxPoints {
		return fmt.Errorf("canvas: %d points per element: use from 1 to %d", perElement, CSVMaxPoints)
	}
	if elements := len(s.Mesh.Elements); perElement > 1 && elements*(perElement+1) > CSVMaxRows {
		return &RowsError{Elements: elements, PerElement: perElement}
	}
	if u.Name == "" {
		u = units.SI
	}
	out := bufio.NewWriterSize(w, 64<<10)
	qs := fem.Quantities()
	ground := groundOf(&s.Model)
	for _, line := range csvPreamble {
		out.WriteString(line + "\n")
	}
	if len(ground) > 0 {
		out.WriteString("# Ground: the force per unit length the foundations exert on the member, up and along +x positive.\n")
	}
	out.WriteString(csvUnitsLine(u, qs, ground) + "\n")
	if perElement == 1 {
		out.WriteString("# Each element at its 2 ends (1 interval).\n")
	} else {
		fmt.Fprintf(out, "# Each element at %d evenly spaced points (%d intervals), both ends included.\n", perElement+1, perElement)
	}
	for _, line := range notes {
		out.WriteString(csvComment(strings.TrimRight("# "+line, " ")) + "\n")
	}
	header := []string{fmt.Sprintf("x [%s]", u.Unit(units.Position).Symbol)}
	for _, q := range qs {
		c := q.Info()
		sym := u.Unit(c.Unit).Symbol
		header = append(header, fmt.Sprintf("%s FE [%s]", c.Column, sym))
		if e != nil {
			header = append(header, fmt.Sprintf("%s exact [%s]", c.Column, sym))
		}
	}
	for _, g := range ground {
		sym := u.Unit(units.LineLoad).Symbol
		header = append(header, fmt.Sprintf("%s FE [%s]", g.Column, sym))
		if e != nil {
			header = append(header, fmt.Sprintf("%s exact [%s]", g.Column, sym))
		}
	}
	cw := csv.NewWriter(out)
	if err := cw.Write(header); err != nil {
		return err
	}
	cw.Flush()
	t := csvTable{s: s, e: e, perElement: perElement, position: u.Unit(units.Position).ToSI, qs: qs,
		ground: ground, lineLoad: u.Unit(units.LineLoad).ToSI}
	for _, q := range qs {
		t.divisor = append(t.divisor, u.Unit(q.Info().Unit).ToSI)
	}
	if err := t.stream(out); err != nil {
		return err
	}
	return out.Flush()
}

// csvTable formats the rows of a results table.
type csvTable struct {
	s          *fem.Solution
	e          *fem.Exact
	perElement int
	qs         []fem.Quantity
	// Display value = SI value / ToSI, as units.System.ToDisplay computes it.
	position float64
	divisor  []float64
	ground   []groundColumn
	lineLoad float64 // the ground columns' ToSI
}

// csvFigures is the significant figures of a value in the table: the
// conversion to display units (a division by 0.3048 for feet) is good to
// about 16, and the shortest exact form of its result shows that last
// figure's noise, 13.999999999999998 ft for a node typed at 14 ft.
const csvFigures = 15

// csvChunkRows is about how many rows one chunk of a table holds: four
// chunks' buffers, some megabytes, are what the table holds in memory.
const csvChunkRows = 4096

// stream formats the table in chunks of elements on two goroutines, each
// into its own buffers, and writes the chunks to w in order: formatting
// numbers, not the walk, is most of the work.
func (t *csvTable) stream(w io.Writer) error {
	n := len(t.s.Mesh.Elements)
	perChunk := max(1, csvChunkRows/(t.perElement+1))
	chunks := (n + perChunk - 1) / perChunk
	workers := min(2, chunks)
	ready, free := make([]chan []byte, workers), make([]chan []byte, workers)
	done := make(chan struct{})
	defer close(done)
	for k := range workers {
		ready[k], free[k] = make(chan []byte, 1), make(chan []byte, 2)
		for range 2 {
			// Room for the rows of a chunk at up to 24 bytes a number.
			free[k] <- make([]byte, 0, perChunk*(t.perElement+1)*24*t.columns())
		}
		go func() {
			for c := k; c < chunks; c += workers {
				var buf []byte
				select {
				case buf = <-free[k]:
				case <-done:
					return
				}
				buf = t.rows(buf[:0], c*perChunk, min((c+1)*perChunk, n))
				select {
				case ready[k] <- buf:
				case <-done:
					return
				}
			}
		}()
	}
	for c := range chunks {
		buf := <-ready[c%workers]
		if _, err := w.Write(buf); err != nil {
			return err
		}
		free[c%workers] <- buf
	}
	return nil
}

// columns is the number of columns of the table.
func (t *csvTable) columns() int {
	if t.e != nil {
		return 1 + 2*(len(t.qs)+len(t.ground))
	}
	return 1 + len(t.qs) + len(t.ground)
}

// rows appends the rows of elements from ≤ i < to to buf: at each element's
// perElement+1 points, the start read from the right, the end from the
// left.
func (t *csvTable) rows(buf []byte, from, to int) []byte {
	var fe, ex fem.Fields
	moduli := make([]float64, len(t.ground))
	for el := range t.s.Elements(t.e, from, to) {
		h := el.End - el.Start
		// Foundation ends are nodes: an element lies on a foundation or off it.
		mid := el.Start + 0.5*h
		for i, g := range t.ground {
			moduli[i] = 0
			for _, f := range t.s.Model.Foundations {
				if mid > f.Start && mid < f.End {
					moduli[i] += g.modulus(f)
				}
			}
		}
		for j := 0; j <= t.perElement; j++ {
			x, xi := el.Start+h*float64(j)/float64(t.perElement), 1.0
			if j < t.perElement {
				xi = min(max((x-el.Start)/h, 0), 1) // as Solution.InElement finds it
			}
			el.FE.At(xi, &fe)
			if t.e != nil {
				el.Exact.At(xi, &ex)
			}
			buf = strconv.AppendFloat(buf, x/t.position, 'g', csvFigures, 64)
			for i, q := range t.qs {
				buf = append(buf, ',')
				buf = strconv.AppendFloat(buf, q.Of(&fe)/t.divisor[i], 'g', csvFigures, 64)
				if t.e != nil {
					buf = append(buf, ',')
					buf = strconv.AppendFloat(buf, q.Of(&ex)/t.divisor[i], 'g', csvFigures, 64)
				}
			}
			for i, g := range t.ground {
				buf = append(buf, ',')
				buf = strconv.AppendFloat(buf, -moduli[i]*g.displacement(&fe)/t.lineLoad, 'g', csvFigures, 64)
				if t.e != nil {
					buf = append(buf, ',')
					buf = strconv.AppendFloat(buf, -moduli[i]*g.displacement(&ex)/t.lineLoad, 'g', csvFigures, 64)
				}
			}
			buf = append(buf, '\n')
		}
	}
	return buf
}

// CSVText is a text cell s as a CSV file holds it: as it is, or, when a
// spreadsheet opening the file would read it as a formula (it begins with
// =, +, -, @, a tab or a carriage return), behind a single quote, which the
// spreadsheet shows as text and does not evaluate. Every CSV writer passes
// the text it does not write itself (names, file names, messages) through
// it; numbers are not text cells, and a negative one stays a number.
func CSVText(s string) string {
	if s != "" && strings.IndexByte("=+-@\t\r", s[0]) >= 0 {
		return "'" + s
	}
	return s
}

// csvComment is a comment line as CSVText would write its cells: a
// spreadsheet reads the line as a row of cells split at its commas, so
// each cell after the first (which begins with #) that a spreadsheet would
// read as a formula, or as a quoted field whose text might be one, gets the
// single quote.
func csvComment(line string) string {
	cells := strings.Split(line, ",")
	for i, c := range cells[1:] {
		if strings.HasPrefix(c, `"`) {
			c = "'" + c
		}
		cells[i+1] = CSVText(c)
	}
	return strings.Join(cells, ",")
}

// csvUnitsLine states the unit system and the unit of every column.
func csvUnitsLine(u units.System, qs []fem.Quantity, ground []groundColumn) string {
	var b strings.Builder
	fmt.Fprintf(&b, "# Units: %s. x in %s", u.Name, u.Unit(units.Position).Symbol)
	for _, q := range qs {
		c := q.Info()
		fmt.Fprintf(&b, "; %s in %s", c.Column, u.Unit(c.Unit).Symbol)
	}
	for _, g := range ground {
		fmt.Fprintf(&b, "; %s in %s", g.Column, u.Unit(units.LineLoad).Symbol)
	}
	return b.String() + "."
}
