package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"stave/canvas"
	"stave/canvas/report"
	"stave/fem"
	"stave/storage"
)

// exportCommand writes the drawing and its results, a calculation sheet or a
// CSV table of the sampled fields, without opening a window. A model that
// cannot be solved still gets its drawing or sheet, which shows the
// problem, and exits 1; results whose checks fail are written and exit 3.
func exportCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("export")
	out := fs.String("out", "", "output file: NAME.png, NAME.svg, NAME.pdf or NAME.csv")
	sheet := fs.Bool("sheet", false, "write the one-page calculation sheet (with --out NAME.pdf or NAME.png)")
	multiples := fs.Bool("multiples", false, "write the member on 1, 2, 4 and 8 elements per stretch, one drawing under the other (with --out NAME.png or NAME.pdf)")
	elements := fs.Int("elements", 0, "solve on N elements instead of the file's mesh (spread over the stretches by length)")
	dpi := fs.Float64("dpi", 0, "pixel density of PNG output, 1 to 20,000, with the drawing at most 20,000 pixels a side (default 96)")
	width := fs.Float64("width", 0, "drawing width in points, 1 to 20,000 (default 1200)")
	height := fs.Float64("height", 0, "drawing height in points, 1 to 20,000 (default 800)")
	points := fs.Int("points", 0, "CSV only: sample each element at N+1 evenly spaced points, both ends included (default 4; fewer above 20,000 elements); a table sampled inside its elements (N above 1) holds at most 2,000,000 rows")
	system := fs.String("units", "", "unit system of the output: SI or US (default: the file's display units)")
	show := fs.String("show", "", "a model with load cases: draw one case or combination by NAME, or the envelope (the default)")
	path, err := parseOneFile(fs, args, stdout)
	if err != nil {
		return err
	}
	if *out == "" {
		return usageError{"export needs --out NAME.png, NAME.svg, NAME.pdf or NAME.csv"}
	}
	if err := report.CheckSize(*width, *height, *dpi); err != nil {
		return usageError{fmt.Sprintf("--width, --height, --dpi: %v", err)}
	}
	kind, err := exportKind(*out, *sheet)
	if err != nil {
		return err
	}
	if *multiples {
		if *sheet || (kind != "png" && kind != "pdf") {
			return usageError{"--multiples writes a drawing: use it with --out NAME.png or NAME.pdf, without --sheet"}
		}
		kind = "multiples-" + kind
	}
	if set(fs, "elements") && *elements < 1 {
		return usageError{fmt.Sprintf("--elements %d: give a positive number of elements", *elements)}
	}
	opts := report.Options{Width: float32(*width), Height: float32(*height), DPI: *dpi}
	if set(fs, "points") {
		if kind != "csv" {
			return usageError{"--points applies to the CSV table only: use it with --out NAME.csv"}
		}
		if *points < 1 || *points > canvas.CSVMaxPoints {
			return usageError{fmt.Sprintf("--points %d: give from 1 to %d intervals per element", *points, canvas.CSVMaxPoints)}
		}
		opts.CSVPoints = *points
	}
	if opts.Units, err = unitsFlag(*system); err != nil {
		return err
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	if opts.Show, err = showFlag(&p.Model, *show); err != nil {
		return err
	}
	if set(fs, "elements") {
		p.Model.Mesh.Elements, p.Model.Mesh.MaxElementLength = *elements, 0
		if err := meshFits(&p.Model); err != nil {
			return usageError{fmt.Sprintf("--elements %d: %s: %v", *elements, path, err)}
		}
	}
	var src report.Source
	n, err := writeExport(*out, func(w io.Writer) error {
		var err error
		src, err = report.Export(context.Background(), w, p, kind, opts)
		return err
	})
	var size *canvas.SizeError
	if errors.As(err, &size) {
		// The size and density each lie in their ranges, but not together.
		return usageError{fmt.Sprintf("--width, --height, --dpi: %s", strings.TrimPrefix(size.Error(), "canvas: "))}
	}
	var rows *canvas.RowsError
	if errors.As(err, &rows) {
		// Only --points asks for more than the default's rows.
		return usageError{fmt.Sprintf("--points %d: %s", *points, strings.TrimPrefix(rows.Error(), "canvas: "))}
	}
	if err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	fmt.Fprintf(stdout, "wrote %s (%d bytes)\n", *out, n)
	if a := src.Analysis; a != nil && a.Err != nil {
		return modelError{fmt.Errorf("%s: the model cannot be solved, so %s shows the problem instead of results: %w", path, *out, a.Err)}
	}
	return failures(path, src.Findings)
}

// meshFits is the problem with m's element count (too many to fit in
// memory), nil when it has none. The model loaded without problems, so only
// a mesh set from the command line can have one.
func meshFits(m *fem.Model) error {
	var ve *fem.ValidationError
	if !errors.As(m.Validate(), &ve) {
		return nil
	}
	for _, p := range ve.Problems {
		if p.Item.Kind == fem.MeshItem && p.Property == fem.ElementsProperty {
			return errors.New(p.Message)
		}
	}
	return nil
}

// set reports whether the flag name was given on the command line.
func set(fs *flag.FlagSet, name string) bool {
	found := false
	fs.Visit(func(f *flag.Flag) { found = found || f.Name == name })
	return found
}

// writeExport streams what write writes to path through storage.WriteFile:
// a temporary file beside path, renamed to path once complete, so a failed
// export leaves no file and an old one in place, and a large results table
// is never held in memory. It returns the number of bytes written.
func writeExport(path string, write func(io.Writer) error) (int64, error) {
	var n int64
	err := storage.WriteFile(path, func(w io.Writer) error {
		counted := &countingWriter{w: w}
		err := write(counted)
		n = counted.n
		return err
	})
	return n, err
}

// countingWriter counts the bytes written through it.
type countingWriter struct {
	w io.Writer
	n int64
}

func (c *countingWriter) Write(p []byte) (int, error) {
	n, err := c.w.Write(p)
	c.n += int64(n)
	return n, err
}

// exportKind picks what to write from the output file's extension.
func exportKind(out string, sheet bool) (string, error) {
	ext := strings.ToLower(strings.TrimPrefix(filepath.Ext(out), "."))
	switch {
	case sheet && (ext == "pdf" || ext == "png"):
		return "sheet-" + ext, nil
	case sheet:
		return "", usageError{fmt.Sprintf("the calculation sheet is written as .pdf or .png, not %q", filepath.Ext(out))}
	case ext == "png", ext == "svg", ext == "pdf", ext == "csv":
		return ext, nil
	}
	return "", usageError{fmt.Sprintf("cannot tell the format of %q: use an output name ending in .png, .svg, .pdf or .csv", out)}
}
