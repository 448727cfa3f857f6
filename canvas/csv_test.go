package canvas

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"runtime"
	"slices"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/units"
)

// The preamble states the unit system and the unit of every column, as the
// header row does; the exact columns are read through the walk and agree
// with Exact.At on the same side.
func TestWriteCSVStatesUnits(t *testing.T) {
	in := solved(t, demoModel(6))
	for _, u := range []units.System{units.SI, units.USCustomary} {
		var buf bytes.Buffer
		if err := WriteCSV(&buf, in.Solution, in.Exact, u, 2, nil); err != nil {
			t.Fatal(err)
		}
		var unitsLine string
		sc := bufio.NewScanner(&buf)
		for sc.Scan() {
			if strings.HasPrefix(sc.Text(), "# Units: ") {
				unitsLine = sc.Text()
			}
		}
		if !strings.HasPrefix(unitsLine, "# Units: "+u.Name+".") {
			t.Fatalf("%s: units line %q", u.Name, unitsLine)
		}
		for _, q := range fem.Quantities() {
			c := q.Info()
			if want := fmt.Sprintf("%s in %s", c.Column, u.Unit(c.Unit).Symbol); !strings.Contains(unitsLine, want) {
				t.Errorf("%s: units line %q lacks %q", u.Name, unitsLine, want)
			}
		}
	}
}

// Points outside 1 to CSVMaxPoints are refused with the range to use.
func TestWriteCSVRefusesPoints(t *testing.T) {
	in := solved(t, demoModel(3))
	for _, n := range []int{0, -1, CSVMaxPoints + 1} {
		err := WriteCSV(io.Discard, in.Solution, in.Exact, units.SI, n, nil)
		if err == nil || !strings.Contains(err.Error(), fmt.Sprint(CSVMaxPoints)) {
			t.Errorf("%d points: error %v, want one naming the range 1 to %d", n, err, CSVMaxPoints)
		}
	}
}

// Four intervals per element on ordinary meshes; fewer, down to one, so
// that large tables keep to about 100,000 rows where they can.
func TestDefaultCSVPoints(t *testing.T) {
	for _, c := range []struct{ elements, want int }{
		{0, 4}, {1, 4}, {20_000, 4}, {20_001, 3}, {25_000, 3}, {30_000, 2}, {50_000, 1}, {1_000_000, 1},
	} {
		if got := DefaultCSVPoints(c.elements); got != c.want {
			t.Errorf("%d elements: %d points, want %d", c.elements, got, c.want)
		}
	}
}

// The table streams: it holds a fixed amount of memory (its buffers and the
// walk's views), so writing ten times the elements allocates hardly more.
// Bytes allocated are counted, not time.
func TestWriteCSVBoundedMemory(t *testing.T) {
	allocated := func(elements int) uint64 {
		in := solved(t, demoModel(elements))
		var before, after runtime.MemStats
		runtime.GC()
		runtime.ReadMemStats(&before)
		if err := WriteCSV(io.Discard, in.Solution, in.Exact, units.SI, 4, nil); err != nil {
			t.Fatal(err)
		}
		runtime.ReadMemStats(&after)
		return after.TotalAlloc - before.TotalAlloc
	}
	small, large := allocated(10_000), allocated(100_000)
	if perElement := (float64(large) - float64(small)) / 90_000; perElement > 4 {
		t.Errorf("writing 10,000 elements allocated %d bytes, 100,000 elements %d: %.1f bytes per further element, the table is not streamed", small, large, perElement)
	}
	t.Logf("10,000 elements: %d bytes allocated; 100,000: %d", small, large)
}

// BenchmarkWriteCSV measures the table's throughput (MB/s) on a fine mesh,
// finite element and exact columns, four intervals per element.
func BenchmarkWriteCSV(b *testing.B) {
	in := solved(b, demoModel(100_000))
	var n countingDiscard
	if err := WriteCSV(&n, in.Solution, in.Exact, units.SI, 4, nil); err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(n))
	b.ReportAllocs()
	for b.Loop() {
		if err := WriteCSV(io.Discard, in.Solution, in.Exact, units.SI, 4, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// countingDiscard counts the bytes written to it.
type countingDiscard int

func (c *countingDiscard) Write(p []byte) (int, error) {
	*c += countingDiscard(len(p))
	return len(p), nil
}

// With a foundation the table adds the ground's force per unit length,
// finite element and exact. A free beam on a foundation along its whole
// length under a uniform load q sinks evenly, w = q/k, so the ground
// pushes back with −k·w = −q everywhere (statics); the cubic elements
// hold a constant exactly. A model without foundations has no such column.
func TestWriteCSVGround(t *testing.T) {
	const q, k, L = -20e3, 2e7, 8.0 // N/m, N/m², m
	m := &fem.Model{
		Segments:        []fem.Segment{{Start: 0, End: L, Section: fem.Section{Area: 0.3, SecondMoment: 6e-3, FibreDistance: 0.25}, Material: fem.Material{Elastic: 30e9}}},
		Supports:        []fem.Support{{X: L / 2, Kind: fem.AxialOnly}},
		Foundations:     []fem.Foundation{{Start: 0, End: L, Modulus: k}},
		DistributedLoad: []fem.DistributedLoad{{Direction: fem.Transverse, Points: []fem.LoadPoint{{X: 0, Intensity: q}, {X: L, Intensity: q}}}},
		Mesh:            fem.MeshSettings{Elements: 8},
	}
	in := solved(t, m)
	var buf bytes.Buffer
	if err := WriteCSV(&buf, in.Solution, in.Exact, units.SI, 2, nil); err != nil {
		t.Fatal(err)
	}
	r := csv.NewReader(&buf)
	r.Comment = '#'
	rows, err := r.ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	fe, ex := slices.Index(rows[0], "ground across FE [kN/m]"), slices.Index(rows[0], "ground across exact [kN/m]")
	if fe < 0 || ex < 0 || slices.ContainsFunc(rows[0], func(s string) bool { return strings.HasPrefix(s, "ground along") }) {
		t.Fatalf("header %q: want the ground across, FE and exact, and nothing along", rows[0])
	}
	if len(rows) != 1+8*3 {
		t.Fatalf("%d rows, want a header and 3 points in each of 8 elements", len(rows))
	}
	for _, row := range rows[1:] {
		for _, c := range []int{fe, ex} {
			if v := parse(t, row[c]); math.Abs(v+q/1e3) > 1e-9*math.Abs(q/1e3) {
				t.Errorf("x = %s: %s is %g kN/m, want %g", row[0], rows[0][c], v, -q/1e3)
			}
		}
	}
	plain := solved(t, demoModel(4))
	buf.Reset()
	if err := WriteCSV(&buf, plain.Solution, plain.Exact, units.SI, 1, nil); err != nil {
		t.Fatal(err)
	}
	if strings.Contains(buf.String(), "ground") {
		t.Error("a model without foundations has a ground column")
	}
}

// A place typed in feet reads back in feet: a member of 14 ft (4.2672 m,
// 1 ft = 0.3048 m exactly, NIST SP 811 Appendix B) on 4 elements has its
// nodes at 0, 3.5, 7, 10.5 and 14 ft, which 4.2672 / 0.3048 in floating
// point writes 13.999999999999998. The table writes 15 significant figures,
// more than the conversion is good to.
func TestWriteCSVRoundTripsFeet(t *testing.T) {
	ft, _ := units.USCustomary.Parse(units.Position, "14 ft")
	steel := fem.Material{Name: "steel", Elastic: 200e9}
	m := &fem.Model{
		Segments:   []fem.Segment{{Start: 0, End: ft, Section: fem.Section{Area: 5e-3, SecondMoment: 8e-5, FibreDistance: 0.15}, Material: steel}},
		Supports:   []fem.Support{{X: 0, Kind: fem.Fixed}},
		PointLoads: []fem.PointLoad{{X: ft, Transverse: -10e3}},
		Mesh:       fem.MeshSettings{Elements: 4},
	}
	in := solved(t, m)
	var buf bytes.Buffer
	if err := WriteCSV(&buf, in.Solution, in.Exact, units.USCustomary, 1, nil); err != nil {
		t.Fatal(err)
	}
	var xs []string
	for _, line := range strings.Split(buf.String(), "\n") {
		if line == "" || strings.HasPrefix(line, "#") || strings.HasPrefix(line, "x ") {
			continue
		}
		xs = append(xs, strings.Split(line, ",")[0])
	}
	want := []string{"0", "3.5", "3.5", "7", "7", "10.5", "10.5", "14"}
	if !slices.Equal(xs, want) {
		t.Errorf("x column %q, want %q", xs, want)
	}
}

// A table past CSVMaxRows rows is refused before a byte is written, saying
// how many rows it would have and the most points per element that fit:
// 1,000 intervals in each of 100,000 elements once streamed gigabytes to
// disk (3.4 GB in 25 s, of some 30 GB).
func TestWriteCSVRefusesHugeTables(t *testing.T) {
	in := solved(t, demoModel(3_000))
	var n countingDiscard
	err := WriteCSV(&n, in.Solution, in.Exact, units.SI, CSVMaxPoints, nil)
	rows := len(in.Solution.Mesh.Elements) * (CSVMaxPoints + 1)
	fit := CSVMaxRows/len(in.Solution.Mesh.Elements) - 1
	if err == nil || !strings.Contains(err.Error(), fmt.Sprint(rows)) || !strings.Contains(err.Error(), fmt.Sprintf("at most %d", fit)) {
		t.Errorf("%d rows: error %v, want one naming the %d rows and at most %d points per element", rows, err, rows, fit)
	}
	if n != 0 {
		t.Errorf("a refused table wrote %d bytes", n)
	}
	// The mesh's own table, the ends of each element, is written on any
	// mesh (it streams): one of more than CSVMaxRows/2 elements was
	// refused, which left a mesh of a million elements without a table.
	big := solved(t, demoModel(CSVMaxRows/2+10))
	n = 0
	if err := WriteCSV(&n, big.Solution, nil, units.SI, 1, nil); err != nil || n == 0 {
		t.Errorf("the table of %d elements' ends: %v, %d bytes", len(big.Solution.Mesh.Elements), err, n)
	}
}

// CSVText puts a single quote before a text that a spreadsheet would read
// as a formula: one that begins with =, +, -, @, a tab or a carriage return
// (the triggers and the remedy of OWASP's "CSV Injection" page).
func TestCSVText(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"=1+1", "'=1+1"},
		{"+1", "'+1"},
		{"-1", "'-1"},
		{"@SUM(A1)", "'@SUM(A1)"},
		{"\t=1", "'\t=1"},
		{"\r=1", "'\r=1"},
		{"", ""},
		{"beam 1", "beam 1"},
		{"B-1 = 3", "B-1 = 3"},
		{" =1", " =1"},
		{"'=1", "'=1"},
	} {
		if got := CSVText(c.in); got != c.want {
			t.Errorf("CSVText(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

// The notes are comment lines, which a spreadsheet reads as a row of cells
// split at the commas: a name in them such as a combination named
// `a,=1+1` began a cell with a formula (or with a quote, `b,"=1"`, which
// the spreadsheet takes off). Such a cell gets the single quote of CSVText;
// a line with no such cell is written as it is.
func TestWriteCSVNotesAreNotFormulas(t *testing.T) {
	in := solved(t, demoModel(2))
	notes := []string{
		`Showing combination "a,=1+1"`,
		`train "b,"=1", front at 2 m`,
		`Reactions, x = 1,-2 kN,+3,@x`,
		`Mesh: 2 elements, 3 nodes`,
	}
	want := []string{
		`# Showing combination "a,'=1+1"`,
		`# train "b,'"=1", front at 2 m`,
		`# Reactions, x = 1,'-2 kN,'+3,'@x`,
		`# Mesh: 2 elements, 3 nodes`,
	}
	var buf bytes.Buffer
	if err := WriteCSV(&buf, in.Solution, in.Exact, units.SI, 1, notes); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(buf.String(), "\n")
	for _, w := range want {
		if !slices.Contains(lines, w) {
			t.Errorf("no line %q in:\n%s", w, strings.Join(lines[:12], "\n"))
		}
	}
}
