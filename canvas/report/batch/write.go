package batch

import (
	"bufio"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
	"unicode"
	"unicode/utf8"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/fem/check"
)

// Writer writes a batch's lines as Run hands them over, then its summary.
type Writer interface {
	Member(m Member) error
	Close(s Summary) error
}

// NewWriter is the writer of format "text", "json" or "csv" to w.
func NewWriter(format string, w io.Writer) (Writer, error) {
	switch format {
	case "text":
		return &textWriter{w: w}, nil
	case "json":
		return &jsonWriter{w: bufio.NewWriter(w)}, nil
	case "csv":
		return &csvWriter{out: w}, nil
	}
	return nil, fmt.Errorf("no batch output %q: choose text, json or csv", format)
}

// ratioText is n of span/n, to three figures below 100.
func ratioText(n float64) string {
	if n >= 100 {
		return strconv.FormatFloat(n, 'f', 0, 64)
	}
	return strconv.FormatFloat(n, 'g', 3, 64)
}

// deflectionText is a deflection check as "L/250 (limit L/360)". A
// deflection past its limit (a ratio below the limit's) that rounds to the
// limit gets as many decimals as show it below, as check.UtilisationText
// keeps a failed utilisation above 1.00: "L/359.6 (limit L/360)", never
// "L/360 (limit L/360)" beside fail.
func deflectionText(d *Deflection) string {
	if math.IsInf(float64(d.Ratio), 0) {
		return fmt.Sprintf("none (limit L/%s)", ratioText(d.LimitRatio))
	}
	ratio, limit := float64(d.Ratio), ratioText(d.LimitRatio)
	text := ratioText(ratio)
	for decimals := 1; ratio < d.LimitRatio && decimals <= 17; decimals++ {
		if shown, _ := strconv.ParseFloat(text, 64); shown < d.LimitRatio {
			break
		}
		text = strconv.FormatFloat(ratio, 'f', decimals, 64)
	}
	return fmt.Sprintf("L/%s (limit L/%s)", text, limit)
}

// warningText is the warnings in one cell: why a refused member has no
// results, or each warning's severity and check.
func warningText(m Member) string {
	if m.Status == Refused {
		return m.Problem
	}
	if len(m.Warnings) == 0 {
		return ""
	}
	parts := make([]string, len(m.Warnings))
	for i, w := range m.Warnings {
		parts[i] = w.Severity + " " + w.Check
	}
	return strings.Join(parts, "; ")
}

// textWriter aligns its columns, so it keeps the rows (a short line of
// text per member) until Close.
type textWriter struct {
	w    io.Writer
	rows []string
}

func (t *textWriter) Member(m Member) error {
	mark, governing, utilisation, deflection, accuracy := dash(m.Mark), "-", "-", "-", "-"
	if g := m.Governing; g != nil {
		governing, utilisation = g.Name, check.UtilisationText(float64(g.Utilisation))
	}
	if d := m.Deflection; d != nil {
		deflection = deflectionText(d)
	}
	if m.Accuracy != nil {
		accuracy = m.Accuracy.text()
	}
	cells := []string{m.File, mark, m.Status.String(), governing, utilisation, deflection, accuracy, dash(warningText(m))}
	for i, c := range cells {
		cells[i] = printable(c)
	}
	t.rows = append(t.rows, strings.Join(cells, "\t"))
	return nil
}

// printable is s as the text table writes it: as it is, or, where it holds
// a control character (a line feed, a tab) or bytes that are not UTF-8, as
// Go quotes it without the quotes ("a\nb\xff.json"), so that a file name
// from a folder's listing keeps to its row and cell.
func printable(s string) string {
	if utf8.ValidString(s) && !strings.ContainsFunc(s, unicode.IsControl) {
		return s
	}
	q := strconv.Quote(s)
	return q[1 : len(q)-1]
}

// dash stands for an empty cell.
func dash(s string) string {
	if s == "" {
		return "-"
	}
	return s
}

// highestText is the summary's highest utilisation u: as the table writes
// it, and, where it is undefined, that it could not be worked out.
func highestText(u Number) string {
	if math.IsNaN(float64(u)) {
		return "could not be worked out (undefined, as 0 over a limit of 0 is)"
	}
	return check.UtilisationText(float64(u))
}

// members counts n members in words: "1 member", "12 members".
func members(n int) string {
	if n == 1 {
		return "1 member"
	}
	return fmt.Sprintf("%d members", n)
}

func (t *textWriter) Close(s Summary) error {
	bw := bufio.NewWriter(t.w)
	fmt.Fprintf(bw, "Stave %s: check of %s\n\n", report.Version, members(s.Members))
	tw := tabwriter.NewWriter(bw, 2, 4, 2, ' ', 0)
	fmt.Fprintln(tw, "file\tmember\tstatus\tgoverning check\tutilisation\tdeflection\tFE accuracy\twarnings")
	for _, r := range t.rows {
		fmt.Fprintln(tw, r)
	}
	tw.Flush()
	fmt.Fprintf(bw, "\n%s: %d ok, %d caution, %d failed a check, %d refused\n", members(s.Members), s.OK, s.Caution, s.Failed, s.Refused)
	if h := s.Highest; h != nil {
		fmt.Fprintf(bw, "Highest utilisation: %s, %s, in %s\n", highestText(h.Utilisation), h.Name, printable(h.Who.String()))
	}
	if d := s.Deflection; d != nil {
		fmt.Fprintf(bw, "Largest deflection for its limit: %s, %s, in %s\n", deflectionText(&d.Deflection), d.Name, printable(d.Who.String()))
	}
	fmt.Fprintln(bw, "Utilisation is the checked value over its limit (1 at the limit); L is the span or overhang checked.")
	fmt.Fprintf(bw, "FE accuracy: how far the finite element extremes are from the exact ones, as a share of the field's largest magnitude, in the field named (the default mesh keeps it within %.3g %%; - where there is no exact solution); the checks judge the exact solution where there is one.\n", 100*fem.MeshAccuracy)
	fmt.Fprintln(bw, "Caution:", fem.Caution)
	return bw.Flush()
}

// jsonWriter streams one object: the members as they come, then the
// summary, as report.WriteJSON would indent the whole.
type jsonWriter struct {
	w *bufio.Writer
	n int
}

// The schedule document of `stave check --json` (docs/json.md): its
// format name and version, which changes as report.ResultsVersion does,
// when a key changes meaning or goes away.
const (
	Format  = "stave-check"
	Version = 1
)

// jsonHead opens the schedule document, up to its members' list.
var jsonHead = fmt.Sprintf("{\n  \"format\": %q,\n  \"version\": %d,\n  \"members\": [", Format, Version)

// jsonUnits says the units of the JSON output.
const jsonUnits = "SI: lengths (deflection_m, span_m) in m; utilisations and span ratios are pure numbers"

func (j *jsonWriter) Member(m Member) error {
	if m.Warnings == nil {
		m.Warnings = []Warning{} // [] rather than null
	}
	b, err := json.MarshalIndent(m, "    ", "  ")
	if err != nil {
		return err
	}
	if j.n == 0 {
		j.w.WriteString(jsonHead + "\n    ")
	} else {
		j.w.WriteString(",\n    ")
	}
	j.n++
	_, err = j.w.Write(report.PlainZeros(b))
	return err
}

func (j *jsonWriter) Close(s Summary) error {
	if j.n == 0 {
		j.w.WriteString(jsonHead)
	} else {
		j.w.WriteString("\n  ")
	}
	tail, err := json.MarshalIndent(struct {
		Summary Summary `json:"summary"`
		Units   string  `json:"units"`
		Caution string  `json:"caution"`
	}{s, jsonUnits, fem.Caution}, "", "  ")
	if err != nil {
		return err
	}
	j.w.WriteString("],\n")
	j.w.Write(report.PlainZeros(tail[2:])) // without its opening "{\n"
	j.w.WriteString("\n")
	return j.w.Flush()
}

// csvWriter streams a header and one row per member, after a comment line
// with the caution (read with csv.Reader.Comment = '#'), as the results
// table does.
type csvWriter struct {
	out io.Writer
	w   *csv.Writer
}

var csvHeader = []string{"file", "member", "status", "governing check", "utilisation",
	"deflection check", "deflection [m]", "span [m]", "span ratio n (span/n)", "limit ratio n", "warnings",
	"FE accuracy (share of the field's largest magnitude)", "FE accuracy field"}

// csvTextColumns are the columns of text, which canvas.CSVText keeps from
// being read as formulas (a file name or member mark beginning with =);
// the others hold numbers.
var csvTextColumns = []int{0, 1, 2, 3, 5, 10, 12}

func (c *csvWriter) start() error {
	if c.w != nil {
		return nil
	}
	if _, err := fmt.Fprintln(c.out, "# Stave batch check. "+fem.Caution); err != nil {
		return err
	}
	c.w = csv.NewWriter(c.out)
	return c.w.Write(csvHeader)
}

func (c *csvWriter) Member(m Member) error {
	if err := c.start(); err != nil {
		return err
	}
	num := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	row := []string{m.File, m.Mark, m.Status.String(), "", "", "", "", "", "", "", warningText(m), "", ""}
	if g := m.Governing; g != nil {
		row[3], row[4] = g.Name, g.NotFinite
		if g.NotFinite == "" {
			row[4] = num(float64(g.Utilisation))
		}
	}
	if d := m.Deflection; d != nil {
		row[5], row[6], row[7], row[9] = d.Name, num(d.Deflection), num(d.Span), num(d.LimitRatio)
		if !math.IsInf(float64(d.Ratio), 0) {
			row[8] = num(float64(d.Ratio))
		}
	}
	if a := m.Accuracy; a != nil {
		row[11], row[12] = num(a.Ratio), a.Quantity.Key()
	}
	for _, i := range csvTextColumns {
		row[i] = canvas.CSVText(row[i])
	}
	return c.w.Write(row)
}

func (c *csvWriter) Close(Summary) error {
	if err := c.start(); err != nil {
		return err
	}
	c.w.Flush()
	return c.w.Error()
}
