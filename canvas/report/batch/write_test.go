package batch

import (
	"bytes"
	"context"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"stave/canvas/report"
	"stave/fem"
)

// write runs the batch through the writer of format and returns the output
// with the lines and summary the writer was given.
func write(t *testing.T, format string, names []string) (string, []Member, Summary) {
	t.Helper()
	var out bytes.Buffer
	w, err := NewWriter(format, &out)
	if err != nil {
		t.Fatal(err)
	}
	var lines []Member
	sum, err := Run(context.Background(), names, Options{}, func(m Member) error {
		lines = append(lines, m)
		return w.Member(m)
	})
	if err != nil {
		t.Fatal(err)
	}
	if err := w.Close(sum); err != nil {
		t.Fatal(err)
	}
	return out.String(), lines, sum
}

// The streamed JSON is the document report.WriteJSON writes of the whole.
func TestJSONStreamsOneDocument(t *testing.T) {
	names := append(models(t), badFiles(t)...)
	got, lines, sum := write(t, "json", names)
	for i := range lines {
		if lines[i].Warnings == nil {
			lines[i].Warnings = []Warning{}
		}
	}
	var want bytes.Buffer
	err := report.WriteJSON(&want, struct {
		Format  string   `json:"format"`
		Version int      `json:"version"`
		Members []Member `json:"members"`
		Summary Summary  `json:"summary"`
		Units   string   `json:"units"`
		Caution string   `json:"caution"`
	}{Format, Version, lines, sum, jsonUnits, fem.Caution})
	if err != nil {
		t.Fatal(err)
	}
	if got != want.String() {
		t.Errorf("streamed JSON differs from the whole document:\n%s\nwant:\n%s", got, want.String())
	}
	var doc struct {
		Members []struct {
			Deflection *struct {
				Ratio *float64 `json:"span_ratio"`
			} `json:"deflection"`
		} `json:"members"`
		Summary struct{ Members int } `json:"summary"`
	}
	if err := json.Unmarshal([]byte(got), &doc); err != nil {
		t.Fatal(err)
	}
	// stepped_bar.json is a bar under axial load: nothing deflects.
	for i, m := range doc.Members {
		if strings.HasSuffix(names[i], "stepped_bar.json") && (m.Deflection == nil || m.Deflection.Ratio != nil) {
			t.Errorf("%s: want a deflection check with span_ratio null, got %+v", names[i], m.Deflection)
		}
	}
	if len(doc.Members) != len(names) || doc.Summary.Members != len(names) {
		t.Errorf("%d members, summary of %d, for %d files", len(doc.Members), doc.Summary.Members, len(names))
	}
}

func TestJSONOfNoMember(t *testing.T) {
	var out bytes.Buffer
	w, _ := NewWriter("json", &out)
	if err := w.Close(Summary{}); err != nil {
		t.Fatal(err)
	}
	var doc struct{ Members []Member }
	if err := json.Unmarshal(out.Bytes(), &doc); err != nil || doc.Members == nil {
		t.Errorf("members %v, error %v, in:\n%s", doc.Members, err, out.String())
	}
}

// The CSV is a comment line with the caution, a header and a row per member.
func TestCSVHasARowPerMember(t *testing.T) {
	names := append(models(t), badFiles(t)...)
	got, lines, _ := write(t, "csv", names)
	if !strings.HasPrefix(got, "# ") || !strings.Contains(strings.SplitN(got, "\n", 2)[0], fem.Caution) {
		t.Errorf("the first line is not a comment with the caution: %q", strings.SplitN(got, "\n", 2)[0])
	}
	r := csv.NewReader(strings.NewReader(got))
	r.Comment = '#'
	rows, err := r.ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != len(names)+1 || fmt.Sprint(rows[0]) != fmt.Sprint(csvHeader) {
		t.Fatalf("%d rows for %d members, header %q", len(rows), len(names), rows[0])
	}
	for i, m := range lines {
		row := rows[i+1]
		if row[0] != names[i] || row[2] != m.Status.String() {
			t.Errorf("row %d: %q, want %s with status %v", i+1, row[:3], names[i], m.Status)
		}
		if m.Status == Refused && row[10] != m.Problem {
			t.Errorf("row %d: warnings %q, want the problem %q", i+1, row[10], m.Problem)
		}
		if g := m.Governing; g != nil {
			if u, err := strconv.ParseFloat(row[4], 64); err != nil || u != float64(g.Utilisation) {
				t.Errorf("row %d: utilisation %q, want %v", i+1, row[4], g.Utilisation)
			}
		}
	}
}

// The text aligns every cell under its heading and ends with the summary
// and the caution.
func TestTextAlignsItsColumns(t *testing.T) {
	names := append(models(t), badFiles(t)...)
	got, _, sum := write(t, "text", names)
	text := strings.Split(got, "\n")
	header := text[2]
	columns := []string{"member", "status", "governing check", "utilisation", "deflection", "warnings"}
	for i, line := range text[3 : 3+len(names)] {
		if !strings.HasPrefix(line, names[i]+" ") {
			t.Errorf("line %d does not start with its file %s: %q", i, names[i], line)
		}
		if strings.HasSuffix(line, " ") {
			t.Errorf("line %d ends in a space: %q", i, line)
		}
		for _, c := range columns {
			at := utf8.RuneCountInString(header[:strings.Index(header, c)])
			runes := []rune(line)
			if at >= len(runes) || runes[at-1] != ' ' || runes[at] == ' ' {
				t.Errorf("line %d: no cell starts under %q: %q", i, c, line)
			}
		}
	}
	counts := fmt.Sprintf("%d members: %d ok, %d caution, %d failed a check, %d refused", sum.Members, sum.OK, sum.Caution, sum.Failed, sum.Refused)
	if !strings.Contains(got, counts) || !strings.HasSuffix(got, "Caution: "+fem.Caution+"\n") {
		t.Errorf("the text lacks %q or the caution at its end:\n%s", counts, got)
	}
}

func TestDeflectionText(t *testing.T) {
	for _, c := range []struct {
		ratio, limit float64
		want         string
	}{
		{192, 360, "L/192 (limit L/360)"},
		{4015.5, 360, "L/4016 (limit L/360)"},
		{33.333, 180, "L/33.3 (limit L/180)"},
		{math.Inf(1), 180, "none (limit L/180)"},
		// A deflection 0.1 % over span/360 fails (utilisation 1.001):
		// it read "L/360 (limit L/360)" beside fail.
		{360 / 1.001, 360, "L/359.6 (limit L/360)"},
		{360 / 1.0000001, 360, "L/359.99996 (limit L/360)"},
		{360.4, 360, "L/360 (limit L/360)"}, // passes, at the limit
	} {
		d := Deflection{Ratio: Number(c.ratio), LimitRatio: c.limit}
		if got := deflectionText(&d); got != c.want {
			t.Errorf("ratio %g, limit %g: %q, want %q", c.ratio, c.limit, got, c.want)
		}
	}
}

// The text counts members in words: a batch of one said "check of 1 members".
func TestMembersInWords(t *testing.T) {
	for _, c := range []struct {
		n    int
		want string
	}{{0, "0 members"}, {1, "1 member"}, {2, "2 members"}, {1000, "1000 members"}} {
		if got := members(c.n); got != c.want {
			t.Errorf("members(%d) = %q, want %q", c.n, got, c.want)
		}
	}
}

// A file whose name holds a line feed and a byte that is not UTF-8 (a
// folder's listing may hold any name) keeps to its one row of the text
// table, the name and the refusal that quotes it escaped as Go writes them,
// and so does the summary that names it; it once broke the row in two and
// wrote the raw byte.
func TestTextRowOfAHostileName(t *testing.T) {
	dir := t.TempDir()
	name := filepath.Join(dir, "a\nb\xff.json")
	demo, err := os.ReadFile("../../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(name, demo, 0o644); err != nil {
		t.Skipf("this file system takes no such name: %v", err)
	}
	bad := filepath.Join(dir, "c\nd.json")
	if err := os.WriteFile(bad, []byte("not JSON"), 0o644); err != nil {
		t.Fatal(err)
	}
	out, _, _ := write(t, "text", []string{name, bad})
	if !utf8.ValidString(out) {
		t.Errorf("the table holds bytes that are not UTF-8:\n%s", out)
	}
	for _, line := range strings.Split(out, "\n") {
		if strings.HasPrefix(line, "b") || strings.HasPrefix(line, "d.json") {
			t.Errorf("a name broke its row:\n%s", out)
		}
	}
	if !strings.Contains(out, `a\nb\xff.json`) || !strings.Contains(out, `c\nd.json`) {
		t.Errorf("the names are not written escaped:\n%s", out)
	}
}

// A text cell a spreadsheet would read as a formula (one that begins with
// =, +, -, @, a tab or a carriage return: the triggers OWASP's "CSV
// Injection" page lists) is written behind a single quote, the remedy that
// page gives; numbers, negative ones too, stay numbers. The file name, the
// mark and the warnings are the user's text; before, "=HYPERLINK(...)" as a
// member mark reached the cell as it was.
func TestCSVTextCellsAreNotFormulas(t *testing.T) {
	for _, c := range []struct {
		file, mark, problem string
		want                [3]string // file, member, warnings
	}{
		{"=cmd.json", "=HYPERLINK(\"x\")", "+SUM(A1)", [3]string{"'=cmd.json", "'=HYPERLINK(\"x\")", "'+SUM(A1)"}},
		{"-x.json", "@A1", "\tfile", [3]string{"'-x.json", "'@A1", "'\tfile"}},
		{"\rx.json", "B-1", "a = b", [3]string{"'\rx.json", "B-1", "a = b"}},
		{"beam.json", "", "", [3]string{"beam.json", "", ""}},
	} {
		m := Member{File: c.file, Mark: c.mark, Status: Refused, Problem: c.problem}
		if c.problem == "" {
			m.Status = OK
			// Invented values; a negative deflection and utilisation test that numbers keep their sign.
			m.Governing = &Check{Name: "Bending stress", Utilisation: -0.5}
			m.Deflection = &Deflection{Check: Check{Name: "Deflection, span 1", Utilisation: 0.25}, Deflection: -0.004, Span: 4, Ratio: 1000, LimitRatio: 250}
		}
		var out bytes.Buffer
		w, _ := NewWriter("csv", &out)
		if err := w.Member(m); err != nil {
			t.Fatal(err)
		}
		if err := w.Close(Summary{}); err != nil {
			t.Fatal(err)
		}
		r := csv.NewReader(&out)
		r.Comment = '#'
		rows, err := r.ReadAll()
		if err != nil {
			t.Fatal(err)
		}
		row := rows[1]
		if got := [3]string{row[0], row[1], row[10]}; got != c.want {
			t.Errorf("%q, %q, %q: cells %q, want %q", c.file, c.mark, c.problem, got, c.want)
		}
		if m.Governing != nil && (row[4] != "-0.5" || row[6] != "-0.004") {
			t.Errorf("numbers %q and %q, want -0.5 and -0.004 as they are", row[4], row[6])
		}
	}
}

// Each output names a utilisation that is not finite as the highest, in
// words, JSON as null and why: infinite, or undefined, which the text
// says could not be worked out.
func TestOutputsNameANonFiniteUtilisation(t *testing.T) {
	dir := t.TempDir()
	for _, c := range nonFinite(t, dir) {
		t.Run(filepath.Base(c.file), func(t *testing.T) {
			names := []string{companion(t, dir, c.want), c.file}
			words := map[bool]string{true: "infinite", false: "undefined"}[math.IsInf(c.want, 1)]
			text, _, _ := write(t, "text", names)
			headline := map[string]string{
				"infinite":  "Highest utilisation: infinite, " + c.check + ", in " + c.file,
				"undefined": "Highest utilisation: could not be worked out (undefined, as 0 over a limit of 0 is), " + c.check + ", in " + c.file,
			}[words]
			if !strings.Contains(text, headline) {
				t.Errorf("the text does not say %q:\n%s", headline, text)
			}
			got, _, _ := write(t, "csv", names)
			r := csv.NewReader(strings.NewReader(got))
			r.Comment = '#'
			rows, err := r.ReadAll()
			if err != nil {
				t.Fatal(err)
			}
			if row := rows[2]; row[3] != c.check || row[4] != words {
				t.Errorf("CSV governing check %q, utilisation %q, want %q, %q", row[3], row[4], c.check, words)
			}
			got, _, _ = write(t, "json", names)
			type governing struct {
				Check       string          `json:"check"`
				Utilisation json.RawMessage `json:"utilisation"`
				NotFinite   *string         `json:"utilisation_not_finite"`
			}
			var doc struct {
				Members []struct{ Governing governing } `json:"members"`
				Summary struct {
					Highest governing `json:"highest_utilisation"`
				} `json:"summary"`
			}
			if err := json.Unmarshal([]byte(got), &doc); err != nil {
				t.Fatal(err)
			}
			for what, g := range map[string]governing{"member": doc.Members[1].Governing, "summary": doc.Summary.Highest} {
				if g.Check != c.check || string(g.Utilisation) != "null" || g.NotFinite == nil || *g.NotFinite != words {
					t.Errorf("JSON %s: %s, utilisation %s, want %s, utilisation null, utilisation_not_finite %q", what, g.Check, g.Utilisation, c.check, words)
				}
			}
			if g := doc.Members[0].Governing; string(g.Utilisation) == "null" || g.NotFinite != nil {
				t.Errorf("JSON of a finite utilisation: %s, utilisation_not_finite %v, want a number and none", g.Utilisation, g.NotFinite)
			}
		})
	}
}
