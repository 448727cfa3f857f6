package main

import (
	"context"
	"fmt"
	"io"
	"os"
	"runtime"
	"runtime/debug"
	"strings"
	"time"

	"stave/canvas/report/batch"
)

// statusError ends a command whose results are written with a status other
// than 0, and says why on standard error.
type statusError struct {
	status int
	msg    string
}

func (e statusError) Error() string { return e.msg }

// maxWorkersPerCore is the most members `check` analyses at once per core.
const maxWorkersPerCore = 4

// checkCommand checks a schedule of members, one model file each, on every
// core: one line per member in the order given, then a summary (package
// canvas/report/batch). The exit status is the worst member's: 1 when any
// was refused, else 3 when any failed a check, else 0.
func checkCommand(args []string, stdout, stderr io.Writer) error {
	fs := newFlagSet("check")
	asJSON := fs.Bool("json", false, "print the lines and the summary as JSON")
	asCSV := fs.Bool("csv", false, "print the lines as CSV")
	workers := fs.Int("workers", 0, "members analysed at once, at most 4 per core (default: one per core)")
	system := fs.String("units", "", "unit system the text names the checks' places in: SI or US (default: each file's display units; JSON and CSV lengths stay in m)")
	names, err := parseOperands(fs, args, stdout, "FILE... | DIR")
	if err != nil {
		return err
	}
	sys, err := unitsFlag(*system)
	if err != nil {
		return err
	}
	switch {
	case len(names) == 0:
		return usageError{"check needs model files, or a folder of them"}
	case *asJSON && *asCSV:
		return usageError{"check writes --json or --csv, not both"}
	case *workers < 0:
		return usageError{fmt.Sprintf("--workers must be 0 (one per core) or more, got %d", *workers)}
	case *workers > maxWorkersPerCore*runtime.GOMAXPROCS(0):
		return usageError{fmt.Sprintf("--workers %d: give at most %d (%d per core here): each worker holds a whole analysis in memory, and more of them than cores only take more memory", *workers, maxWorkersPerCore*runtime.GOMAXPROCS(0), maxWorkersPerCore)}
	}
	paths, err := batch.Paths(names)
	if err != nil {
		return usageError{err.Error()}
	}
	format := "text"
	if *asJSON {
		format = "json"
	} else if *asCSV {
		format = "csv"
	}
	w, err := batch.NewWriter(format, stdout)
	if err != nil {
		return err
	}
	// The text waits for the last member to align its columns; streamed
	// lines on a terminal show the progress themselves.
	bar := newProgress(nil, len(paths), time.Now)
	if isTerminal(stderr) && (format == "text" || !isTerminal(stdout)) {
		bar.w = stderr
	}
	if os.Getenv("GOGC") == "" {
		// The batch keeps a few MiB alive while it allocates fast, so the
		// default target collects every few members: 400 saved 13 % of the
		// processor time on 10,000 members for 10 to 20 MB more (docs/performance.md).
		debug.SetGCPercent(400)
	}
	done := 0
	sum, err := batch.Run(context.Background(), paths, batch.Options{Workers: *workers, Units: sys}, func(m batch.Member) error {
		done++
		bar.show(done)
		return w.Member(m)
	})
	bar.clear()
	if err != nil {
		return err
	}
	if err := w.Close(sum); err != nil {
		return err
	}
	switch sum.Worst {
	case batch.Refused:
		return statusError{1, fmt.Sprintf("%d of %d members refused (%d failed a check): their lines say why", sum.Refused, sum.Members, sum.Failed)}
	case batch.Failed:
		return inDocument(statusError{3, fmt.Sprintf("%d of %d members failed a check: their lines say which", sum.Failed, sum.Members)}, *asJSON)
	}
	return nil
}

// isTerminal reports whether w is a terminal (a character device).
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	info, err := f.Stat()
	return err == nil && info.Mode()&os.ModeCharDevice != 0
}

// progress draws a bar on one line of a terminal, once the batch has run
// for progressAfter, and at most every progressEvery.
type progress struct {
	w     io.Writer // nil: no bar
	total int
	now   func() time.Time
	start time.Time
	last  time.Time
	drawn bool
}

const (
	progressAfter = time.Second
	progressEvery = 100 * time.Millisecond
	barWidth      = 30
)

func newProgress(w io.Writer, total int, now func() time.Time) *progress {
	return &progress{w: w, total: total, now: now, start: now()}
}

// show draws the bar with done of the members checked, when it is time.
func (p *progress) show(done int) {
	if p.w == nil {
		return
	}
	t := p.now()
	if t.Sub(p.start) < progressAfter || (p.drawn && t.Sub(p.last) < progressEvery) {
		return
	}
	p.last, p.drawn = t, true
	filled := barWidth * done / p.total
	fmt.Fprintf(p.w, "\r[%s%s] %d/%d members, %.0f s", strings.Repeat("#", filled), strings.Repeat(".", barWidth-filled),
		done, p.total, t.Sub(p.start).Seconds())
}

// clear erases the bar, if drawn, so the terminal keeps only the results.
func (p *progress) clear() {
	if p.drawn {
		fmt.Fprint(p.w, "\r\033[K")
	}
}
