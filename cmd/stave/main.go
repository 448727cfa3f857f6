// Command stave checks one straight structural member by finite elements.
//
// With no arguments it opens the window on the built-in demo model; with a
// file it opens that file. The subcommands work without a display:
//
//	stave solve [--json] [--units SI|US] [--show NAME] FILE
//	stave export FILE --out NAME.png|NAME.svg|NAME.pdf|NAME.csv [--sheet | --multiples] [--elements N] [--dpi N] [--points N] [--units SI|US] [--show NAME]
//	stave converge [--json] [--max N] [--target E] [--units SI|US] FILE
//	stave influence FILE --quantity Q [--at X] [--support N] [--envelope] [--json]
//	stave check [--json | --csv] [--workers N] [--units SI|US] FILE... | DIR
//	stave bench [--json]
//	stave version
//
// Exit status: 0 when the model is solved and no check failed; 3 when it is
// solved and the results are written but a check failed or the results are
// unreliable (the warnings say why); 1 when the model is refused (the
// message names the offending item; export still writes the drawing of the
// problem); 2 on misuse of the command line. check exits with its worst
// member's: 1 when any was refused, else 3 when any failed a check.
// `COMMAND --help` lists a command's flags and exits 0.
package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"

	"stave/canvas/report"
	_ "stave/cmd/stave/internal/plainlocale" // before the GUI toolkit reads the locale
	"stave/fem/analysis"
)

// version is the Stave release; it also appears on calculation sheets.
const version = "0.1.0"

// usageError marks misuse of the command line (exit status 2).
type usageError struct{ msg string }

func (e usageError) Error() string { return e.msg }

// modelError marks a model that cannot be solved as given (exit status 1).
type modelError struct{ err error }

func (e modelError) Error() string { return e.err.Error() }
func (e modelError) Unwrap() error { return e.err }

// checkFailed marks results that were written but did not pass their
// checks (exit status 3): what failed, one finding per line.
type checkFailed struct {
	path     string
	failures []string
}

func (e checkFailed) Error() string {
	return fmt.Sprintf("%s: solved and written, but a check failed or the results are unreliable (the warnings say why):\n  %s",
		e.path, strings.Join(e.failures, "\n  "))
}

// failures is the checkFailed error for findings fs when they fail
// (analysis.Failed), nil otherwise.
func failures(path string, fs []analysis.Finding) error {
	if !analysis.Failed(fs) {
		return nil
	}
	var out []string
	for _, f := range analysis.Warnings(fs) {
		if f.Severity == analysis.Fail || f.Doubtful {
			out = append(out, fmt.Sprintf("[%s] %s — %s", f.Code, f.Status, f.Name))
		}
	}
	return checkFailed{path: path, failures: out}
}

// documented ends a command with status 3 when the JSON document it wrote
// says why (check_failed and the warnings, or the batch's worst_status):
// standard error stays empty.
type documented struct{ err error }

func (e documented) Error() string { return e.err.Error() }
func (e documented) Unwrap() error { return e.err }

// inDocument is err as documented when a JSON document was written and err
// is a failed check (exit status 3), else err.
func inDocument(err error, asJSON bool) error {
	var cf checkFailed
	var se statusError
	if asJSON && (errors.As(err, &cf) || errors.As(err, &se) && se.status == 3) {
		return documented{err}
	}
	return err
}

// helpShown says a command printed its flags because --help asked (exit status 0).
var helpShown = errors.New("help shown")

const usage = `usage:
  stave [FILE]                         open the window (on the demo model without FILE)
  stave solve [--json] [--units SI|US] [--show NAME] FILE
  stave export FILE --out NAME.png|NAME.svg|NAME.pdf|NAME.csv [--sheet | --multiples]
               [--elements N] [--dpi N] [--width W] [--height H] [--points N]
               [--units SI|US] [--show NAME]
  stave converge [--json] [--max N] [--target E] [--units SI|US] FILE
  stave influence FILE --quantity Q [--at X] [--side left|right] [--support N]
               [--motion M] [--points N] [--envelope] [--json] [--units SI|US]
               [--out NAME.png|NAME.svg|NAME.pdf] [--sheet NAME.pdf|NAME.png] [--train N]
  stave check [--json | --csv] [--workers N] [--units SI|US] FILE... | DIR
  stave bench [--json] [--quick] [--pipeline]
  stave version
  stave COMMAND --help                 the flags of a command

exit status: 0 solved, no check failed; 3 solved and written, but a check failed
or the results are unreliable (the warnings say why); 1 model refused; 2 command
line misused; check exits with its worst member's
`

// The calculation sheets and the solve text name the version, from the
// window or the command line.
func init() { report.Version = version }

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run dispatches one command line and returns the exit status: 1 when
// standard output could not take what the command wrote (a full disk, a
// closed pipe), which the text reports, writing with fmt.Fprint, do not
// see themselves.
func run(args []string, stdout, stderr io.Writer) int {
	out := &outputWriter{w: stdout}
	err := dispatch(args, out)
	if out.err != nil && !errors.Is(err, out.err) {
		err = fmt.Errorf("cannot write the output: %w", out.err)
	}
	if err == nil || errors.Is(err, helpShown) {
		return 0
	}
	if _, ok := err.(documented); ok {
		return 3
	}
	fmt.Fprintln(stderr, "stave:", err)
	var ue usageError
	var cf checkFailed
	switch {
	case errors.As(err, &ue):
		fmt.Fprint(stderr, usage)
		return 2
	case errors.As(err, &cf):
		return 3
	}
	var se statusError
	if errors.As(err, &se) {
		return se.status
	}
	return 1
}

// outputWriter passes writes on to w until one fails, and keeps that
// error: later writes return it without trying.
type outputWriter struct {
	w   io.Writer
	err error
}

func (o *outputWriter) Write(p []byte) (int, error) {
	if o.err != nil {
		return 0, o.err
	}
	n, err := o.w.Write(p)
	o.err = err
	return n, err
}

func dispatch(args []string, stdout io.Writer) error {
	if len(args) == 0 {
		return openWindow("")
	}
	switch args[0] {
	case "solve":
		return solveCommand(args[1:], stdout)
	case "export":
		return exportCommand(args[1:], stdout)
	case "converge":
		return convergeCommand(args[1:], stdout)
	case "influence":
		return influenceCommand(args[1:], stdout)
	case "check":
		return checkCommand(args[1:], stdout, os.Stderr)
	case "bench":
		return benchCommand(args[1:], stdout)
	case "version", "--version":
		return versionCommand(args[1:], stdout)
	case "help", "-h", "--help":
		fmt.Fprint(stdout, usage)
		return nil
	}
	if len(args) == 1 && args[0] != "" && args[0][0] != '-' {
		return openWindow(args[0])
	}
	return usageError{fmt.Sprintf("unknown command %q", args[0])}
}

// versionCommand prints the release; it takes no file (a stray argument
// was ignored).
func versionCommand(args []string, stdout io.Writer) error {
	fs := newFlagSet("version")
	if err := parseFlags(fs, args, stdout, ""); err != nil {
		return err
	}
	if fs.NArg() > 0 {
		return usageError{fmt.Sprintf("version takes no argument, got %q", fs.Arg(0))}
	}
	fmt.Fprintln(stdout, "stave", version)
	return nil
}
