package storage

import (
	"fmt"
	"strconv"
	"unicode/utf16"
	"unicode/utf8"
)

// Limits on the texts of a file: labels (the notes' project, member,
// engineer and date, and material names) are one line each; the notes' text
// may run to many lines.
const (
	MaxLabelLength = 1000    // characters
	MaxNotesLength = 100_000 // characters, about forty pages
)

// literalIntact reports whether the body of a JSON string literal, which
// the decoder has accepted, decodes without loss: its bytes are UTF-8 and
// its \u escapes pair surrogates. The decoder replaces anything else by
// U+FFFD without saying so.
func literalIntact(literal []byte) bool {
	for i := 0; i < len(literal); {
		switch {
		case literal[i] == '\\' && literal[i+1] == 'u':
			r := escaped(literal[i:])
			if !utf16.IsSurrogate(r) {
				i += 6
				continue
			}
			if len(literal) < i+12 || literal[i+6] != '\\' || utf16.DecodeRune(r, escaped(literal[i+6:])) == utf8.RuneError {
				return false
			}
			i += 12
		case literal[i] == '\\':
			i += 2
		default:
			r, size := utf8.DecodeRune(literal[i:])
			if r == utf8.RuneError && size == 1 {
				return false
			}
			i += size
		}
	}
	return true
}

// escaped decodes the \uXXXX escape at the start of s; anything else gives -1.
func escaped(s []byte) rune {
	if len(s) < 6 || s[1] != 'u' {
		return -1
	}
	r, err := strconv.ParseUint(string(s[2:6]), 16, 16)
	if err != nil {
		return -1
	}
	return rune(r)
}

// textFault says what is wrong with a label (notes false) or with the notes'
// text (notes true), or returns "". Control characters and the characters
// that override the direction of text would reach drawings and sheets,
// where they hide or reorder what the engineer wrote. The message opens
// with the text, cut short and quoted with such characters escaped.
func textFault(s string, notes bool) string {
	limit := MaxLabelLength
	if notes {
		limit = MaxNotesLength
	}
	quoted := func() string { return strconv.Quote(cut(s)) }
	if n := utf8.RuneCountInString(s); n > limit {
		return fmt.Sprintf("%s is %d characters long, more than the %d allowed here; shorten it", quoted(), n, limit)
	}
	position := 0
	for _, r := range s {
		position++
		switch {
		case notes && (r == '\t' || r == '\n'):
		case r < 0x20 || 0x7f <= r && r <= 0x9f:
			allowed := "a label is one line of plain text"
			if notes {
				allowed = "the notes may hold tabs and line breaks, no other control characters"
			}
			return fmt.Sprintf("%s holds the control character %U at character %d; remove it (%s)", quoted(), r, position, allowed)
		case 0x202a <= r && r <= 0x202e || 0x2066 <= r && r <= 0x2069:
			return fmt.Sprintf("%s holds %U at character %d, an invisible character that changes the direction of the text around it; remove it", quoted(), r, position)
		}
	}
	return ""
}

// cut shortens a text of the file for a message, so that a hostile file
// cannot make a message of megabytes.
func cut(s string) string {
	const most = 40 // characters
	count := 0
	for i := range s {
		if count == most {
			return fmt.Sprintf("%s… (%d bytes in all)", s[:i], len(s))
		}
		count++
	}
	return s
}

// checkTexts finds the texts of p that a file must not hold, with their
// paths in the file.
func checkTexts(p *Project) []Problem {
	var problems []Problem
	check := func(path, s string, notes bool) {
		if fault := textFault(s, notes); fault != "" {
			problems = append(problems, Problem{Path: path, Message: fault})
		}
	}
	check("notes.project", p.Notes.Project, false)
	check("notes.member", p.Notes.Member, false)
	check("notes.engineer", p.Notes.Engineer, false)
	check("notes.date", p.Notes.Date, false)
	check("notes.text", p.Notes.Text, true)
	for i, s := range p.Model.Segments {
		check(fmt.Sprintf("member.segments[%d].material.name", i), s.Material.Name, false)
	}
	caseTexts(p, check)
	return problems
}
