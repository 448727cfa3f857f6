package main

import (
	"bytes"
	"context"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"

	"stave/canvas/report"
	"stave/storage"
)

// exportCommand writes the drawing and its results, a calculation sheet or a
// CSV table of the sampled fields, without opening a window.
func exportCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("export")
	out := fs.String("out", "", "output file: NAME.png, NAME.svg, NAME.pdf or NAME.csv")
	sheet := fs.Bool("sheet", false, "write the one-page calculation sheet (with --out NAME.pdf or NAME.png)")
	dpi := fs.Float64("dpi", 0, "pixel density of PNG output (default 96)")
	width := fs.Float64("width", 0, "drawing width in points (default 1200)")
	height := fs.Float64("height", 0, "drawing height in points (default 800)")
	path, err := parseOneFile(fs, args)
	if err != nil {
		return err
	}
	if *out == "" {
		return usageError{"export needs --out NAME.png, NAME.svg, NAME.pdf or NAME.csv"}
	}
	if *dpi < 0 || *width < 0 || *height < 0 {
		return usageError{"--dpi, --width and --height must be positive"}
	}
	kind, err := exportKind(*out, *sheet)
	if err != nil {
		return err
	}
	p, err := storage.Load(path)
	if err != nil {
		return modelError{err}
	}
	var buf bytes.Buffer
	opts := report.Options{Width: float32(*width), Height: float32(*height), DPI: *dpi}
	if err := report.Export(context.Background(), &buf, p, kind, opts); err != nil {
		return modelError{fmt.Errorf("%s: %w", path, err)}
	}
	if err := os.WriteFile(*out, buf.Bytes(), 0o644); err != nil {
		return fmt.Errorf("cannot write %s: %w", *out, err)
	}
	fmt.Fprintf(stdout, "wrote %s (%d bytes)\n", *out, buf.Len())
	return nil
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
