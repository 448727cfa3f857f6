package report

import (
	"bytes"
	"context"
	"html"
	"image/png"
	"io"
	"strings"
	"testing"

	"stave/fem"
	"stave/fem/analysis"
	"stave/storage"
)

func demo(t *testing.T) *storage.Project {
	t.Helper()
	p, err := storage.Demo()
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// Every product starts the way its format requires; an unknown one is
// refused with the list of products.
func TestExportEveryProduct(t *testing.T) {
	starts := map[string]string{"png": "\x89PNG", "svg": "<?xml", "pdf": "%PDF", "sheet-pdf": "%PDF", "sheet-png": "\x89PNG", "csv": "# Stave results.",
		"multiples-png": "\x89PNG", "multiples-pdf": "%PDF"}
	for _, p := range Products {
		var buf bytes.Buffer
		if _, err := Export(context.Background(), &buf, demo(t), p.Name, Options{}); err != nil {
			t.Errorf("Export %s: %v", p.Name, err)
		} else if !bytes.HasPrefix(buf.Bytes(), []byte(starts[p.Name])) {
			t.Errorf("Export %s starts with %q, want %q", p.Name, buf.Bytes()[:min(buf.Len(), 8)], starts[p.Name])
		}
	}
	if _, err := Export(context.Background(), io.Discard, demo(t), "jpeg", Options{}); err == nil || !strings.Contains(err.Error(), "sheet-png") {
		t.Errorf("an unknown product gave %v, want an error listing the products", err)
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := Export(ctx, io.Discard, demo(t), "png", Options{}); err != context.Canceled {
		t.Errorf("a cancelled export gave %v, want %v", err, context.Canceled)
	}
}

// A PNG drawing has Width·DPI/72 × Height·DPI/72 pixels.
func TestExportPNGSize(t *testing.T) {
	for _, c := range []struct {
		opts          Options
		width, height int
	}{
		{Options{}, 1600, 1067}, // defaults: 1200 × 800 points at 96 dpi
		{Options{Width: 600, Height: 300, DPI: 72}, 600, 300},
		{Options{Width: 600, Height: 300, DPI: 144}, 1200, 600},
		{Options{Width: 400, Height: 500, DPI: 300}, 1667, 2083},
	} {
		var buf bytes.Buffer
		if _, err := Export(context.Background(), &buf, demo(t), "png", c.opts); err != nil {
			t.Fatalf("%+v: %v", c.opts, err)
		}
		cfg, err := png.DecodeConfig(&buf)
		if err != nil {
			t.Fatalf("%+v: %v", c.opts, err)
		}
		if cfg.Width != c.width || cfg.Height != c.height {
			t.Errorf("%+v: PNG is %d × %d pixels, want %d × %d", c.opts, cfg.Width, cfg.Height, c.width, c.height)
		}
	}
	if _, err := Export(context.Background(), io.Discard, demo(t), "png", Options{DPI: -1}); err == nil {
		t.Error("a negative density was accepted")
	}
}

// A member that can move still gives a drawing with the problem on it, but
// no results table.
func TestExportUnsolvable(t *testing.T) {
	p, err := storage.Load("../../testdata/cantilever_tip_load.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Model.Supports[0].Kind = fem.Roller
	var svg bytes.Buffer
	if _, err := Export(context.Background(), &svg, p, "svg", Options{}); err != nil {
		t.Fatalf("drawing of a mechanism: %v", err)
	}
	if !strings.Contains(svg.String(), "free motion") {
		t.Error("the drawing of a mechanism does not say \"free motion\"")
	}
	_, err = Export(context.Background(), io.Discard, p, "csv", Options{})
	if err == nil || !strings.Contains(err.Error(), "free motion") {
		t.Errorf("results table of a mechanism gave %v, want an error naming the free motion", err)
	}
}

// An envelope whose combinations overflow still gives a drawing and a
// sheet, with the problem written on them, not a crash.
func TestExportEnvelopeOverflow(t *testing.T) {
	p, err := storage.Load("../../testdata/two_span_cases.json")
	if err != nil {
		t.Fatal(err)
	}
	// The largest factor Stave takes (fem.MaxFactor) on loads 1e150 times the file's:
	// the results, beyond 1e300, and their squares overflow.
	for i := range p.Model.Combinations {
		for j := range p.Model.Combinations[i].Factors {
			p.Model.Combinations[i].Factors[j].Factor = fem.MaxFactor
		}
	}
	for _, c := range p.Model.Cases {
		for _, d := range c.DistributedLoad {
			for j := range d.Points {
				d.Points[j].Intensity *= 1e150
			}
		}
		for j := range c.PointLoads {
			c.PointLoads[j].Transverse *= 1e150
		}
	}
	for _, product := range []string{"svg", "sheet-pdf"} {
		var buf bytes.Buffer
		src, err := Export(context.Background(), &buf, p, product, Options{})
		if err != nil {
			t.Fatalf("%s of an overflowing envelope: %v", product, err)
		}
		if src.Analysis.Err == nil || !strings.Contains(src.Analysis.Err.Error(), "too large") {
			t.Errorf("%s: the analysis gave %v, want the overflow", product, src.Analysis.Err)
		}
	}
	var svg bytes.Buffer
	if _, err := Export(context.Background(), &svg, p, "svg", Options{}); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(svg.String(), "too large") {
		t.Error("the drawing of an overflowing envelope does not say the results are too large")
	}
}

// An exported drawing says, above the caution, how far to trust its finite
// element answer, as the sheet and stave solve do: a coarse mesh set in
// the model (the simply supported beam on 2 elements, whose shear force is
// off by a quarter of qL/2: the FE shear is the exact one at each
// element's middle, Strang & Fix, from memory) showed its diagrams with no
// word of it.
func TestExportedDrawingSaysHowFarToTrustIt(t *testing.T) {
	p, err := storage.Load("../../testdata/simply_supported_uniform.json")
	if err != nil {
		t.Fatal(err)
	}
	p.Model.Mesh = fem.MeshSettings{Elements: 2}
	var svg bytes.Buffer
	src, err := Export(context.Background(), &svg, p, "svg", Options{})
	if err != nil {
		t.Fatal(err)
	}
	want := strings.Fields(analysis.MeshChoice(src.Analysis.Summary()))
	text := strings.Join(strings.Fields(svgText(svg.String())), " ")
	if !strings.Contains(text, strings.Join(want, " ")) || !strings.Contains(text, "beyond the default mesh") {
		t.Errorf("the drawing's texts %q lack the mesh's accuracy %q", text, strings.Join(want, " "))
	}
}

// svgText is the text of an SVG's text elements, in order, space apart.
func svgText(svg string) string {
	var out []string
	for _, part := range strings.Split(svg, "<text")[1:] {
		if i, j := strings.Index(part, ">"), strings.Index(part, "</text>"); i >= 0 && j > i {
			out = append(out, html.UnescapeString(part[i+1:j]))
		}
	}
	return strings.Join(out, " ")
}
