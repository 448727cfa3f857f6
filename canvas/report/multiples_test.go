package report

import (
	"bytes"
	"context"
	"encoding/xml"
	"io"
	"strings"
	"testing"

	"stave/fem/analysis"
	"stave/fem/units"
	"stave/storage"
)

// The small multiples draw the member on 1, 2, 4 and 8 elements per
// stretch, each headed by its largest gap. Under a uniform load q a
// Hermite element's bending moment is off by the fixed-end moment qh²/12
// at its ends (beam fixed-end moment tables, from memory), so the heading
// of a simply supported span of length L on n elements says qL²/(12n²).
func TestMultiplesHeadTheirGaps(t *testing.T) {
	p, err := storage.Load("../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	const q, l = 10e3, 4.0 // N/m and m, as the file says
	var svg bytes.Buffer
	src := Source{Project: p, Units: units.SI, Dimensions: true}
	if err := writeMultiples(context.Background(), &svg, src, "svg", Options{Width: 1200, Height: 800, DPI: 96}); err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, svg.Bytes())
	all := strings.Join(texts, "\n")
	for _, n := range multiplesPerStretch {
		h := l / float64(n)
		want := units.SI.Format(units.Moment, q*h*h/12)
		heading := ""
		for _, s := range texts {
			if strings.HasPrefix(s, perStretchWords(n)) {
				heading = s
			}
		}
		if !strings.Contains(heading, "bending moment M "+want+" at ") {
			t.Errorf("%d per stretch: heading %q, want the largest gap qh²/12 = %s", n, heading, want)
		}
	}
	if !strings.Contains(all, "Results are an aid for checking only") {
		t.Error("the small multiples carry no caution")
	}
}

// svgTexts are the texts of an SVG file, in the order written.
func svgTexts(t *testing.T, svg []byte) []string {
	t.Helper()
	var texts []string
	dec := xml.NewDecoder(bytes.NewReader(svg))
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			return texts
		}
		if err != nil {
			t.Fatalf("the SVG is not XML: %v", err)
		}
		if cd, ok := tok.(xml.CharData); ok {
			texts = append(texts, string(cd))
		}
	}
}

// The small multiples of a model with load cases show what the export
// shows (--show): a case's are drawn as the case, not as the envelope of
// the combinations that every other mesh of them drew.
func TestMultiplesShowWhatIsShown(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		show     analysis.Show
		envelope bool
	}{{analysis.Show{Kind: analysis.ShowCase, Index: 1}, false}, {analysis.Show{Kind: analysis.ShowEnvelope}, true}} {
		var svg bytes.Buffer
		src, err := Export(context.Background(), io.Discard, p, "svg", Options{Show: c.show})
		if err != nil {
			t.Fatal(err)
		}
		if err := writeMultiples(context.Background(), &svg, src, "svg", Options{Width: 1200, Height: 800, DPI: 96}); err != nil {
			t.Fatal(err)
		}
		all := strings.Join(svgTexts(t, svg.Bytes()), "\n")
		if got := strings.Count(all, "envelope of the combinations"); (got > 0) != c.envelope {
			t.Errorf("%s: the multiples say %d times that they draw the envelope", c.show.Title(&p.Model), got)
		}
	}
}
