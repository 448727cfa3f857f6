// Package plainlocale names English as the language of messages when the
// locale is the plain C or POSIX one with a character set ("C.UTF-8", as
// containers and CI set it). The GUI toolkit reads the locale while its
// packages initialize, cannot parse "C", and says so on standard error, so
// every headless command would print three lines of noise. Stave's text is
// English, so LANGUAGE=en changes nothing else.
//
// Import it from package main for its side effect. Go initializes the
// packages of a program in the order of their import paths wherever their
// own imports allow (Go 1.21 and later); this package imports only os and
// strings and its path sorts before text/template, which the toolkit's
// language package needs, so it runs first (see GODEBUG=inittrace=1).
package plainlocale

import (
	"os"
	"strings"
)

func init() {
	if os.Getenv("LANGUAGE") == "" && plain(effective(os.Getenv)) {
		os.Setenv("LANGUAGE", "en")
	}
}

// effective is the locale that names the language of messages: the first
// of LC_ALL, LC_MESSAGES and LANG that is set.
func effective(getenv func(string) string) string {
	for _, name := range []string{"LC_ALL", "LC_MESSAGES", "LANG"} {
		if v := getenv(name); v != "" {
			return v
		}
	}
	return ""
}

// plain reports whether locale is C or POSIX with a character set or a
// modifier, which no language tag parses; the bare names are understood.
func plain(locale string) bool {
	name, rest, found := strings.Cut(locale, ".")
	if !found {
		name, rest, found = strings.Cut(locale, "@")
	}
	return found && rest != "" && (name == "C" || name == "POSIX")
}
