// Command stave checks one straight structural member by finite elements.
//
// With no arguments it opens the window on the built-in demo model; with a
// file it opens that file. The subcommands work without a display:
//
//	stave solve [--json] [--units SI|US] FILE
//	stave export FILE --out NAME.png|NAME.svg|NAME.pdf|NAME.csv [--sheet] [--dpi N] [--points N] [--units SI|US]
//	stave converge [--json] [--max N] FILE
//	stave influence FILE --quantity Q [--at X] [--support N] [--envelope] [--json]
//	stave check [--json | --csv] [--workers N] FILE... | DIR
//	stave bench [--json]
//	stave version
//
// Exit status: 0 on success, 1 when the model is wrong (the message names the
// offending item), 2 on misuse of the command line. check exits with its
// worst member's: 1 when any was refused, else 3 when any failed a check.
package main

import (
	"errors"
	"fmt"
	"io"
	"os"

	"stave/canvas/report"
	_ "stave/cmd/stave/internal/plainlocale" // before the GUI toolkit reads the locale
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

const usage = `usage:
  stave [FILE]                         open the window (on the demo model without FILE)
  stave solve [--json] [--units SI|US] FILE
  stave export FILE --out NAME.png|NAME.svg|NAME.pdf|NAME.csv [--sheet] [--dpi N]
               [--points N] [--units SI|US]
  stave converge [--json] [--max N] FILE
  stave influence FILE --quantity Q [--at X] [--side left|right] [--support N]
               [--motion M] [--points N] [--envelope] [--json] [--units SI|US]
  stave check [--json | --csv] [--workers N] FILE... | DIR
  stave bench [--json]
  stave version
`

// The calculation sheets and the solve text name the version, from the
// window or the command line.
func init() { report.Version = version }

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run dispatches one command line and returns the exit status.
func run(args []string, stdout, stderr io.Writer) int {
	err := dispatch(args, stdout)
	if err == nil {
		return 0
	}
	fmt.Fprintln(stderr, "stave:", err)
	var ue usageError
	if errors.As(err, &ue) {
		fmt.Fprint(stderr, usage)
		return 2
	}
	var se statusError
	if errors.As(err, &se) {
		return se.status
	}
	return 1
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
		fmt.Fprintln(stdout, "stave", version)
		return nil
	case "help", "-h", "--help":
		fmt.Fprint(stdout, usage)
		return nil
	}
	if len(args) == 1 && args[0] != "" && args[0][0] != '-' {
		return openWindow(args[0])
	}
	return usageError{fmt.Sprintf("unknown command %q", args[0])}
}
