package storage

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
	"unicode/utf16"
)

// nested is depth lists or objects around a number.
func nested(depth int, objects bool) []byte {
	open, close := "[", "]"
	if objects {
		open, close = `{"a":`, "}"
	}
	return []byte(strings.Repeat(open, depth) + "1" + strings.Repeat(close, depth))
}

// utf16Text encodes s as UTF-16, little-endian or big-endian, with or without
// a byte-order mark.
func utf16Text(s string, bigEndian, mark bool) []byte {
	units := utf16.Encode([]rune(s))
	if mark {
		units = append([]uint16{0xfeff}, units...)
	}
	var out []byte
	for _, u := range units {
		if bigEndian {
			out = append(out, byte(u>>8), byte(u))
		} else {
			out = append(out, byte(u), byte(u>>8))
		}
	}
	return out
}

// refusal unmarshals data, which must be refused, and returns the problems.
func refusal(t *testing.T, data []byte) []Problem {
	t.Helper()
	p, err := Unmarshal(data)
	var le *LoadError
	if p != nil || !errors.As(err, &le) {
		t.Fatalf("got project %v and error %v, want a *LoadError", p != nil, err)
	}
	return le.Problems
}

// Whole files the loader must refuse, each with the place (line and column)
// and what to do.
func TestDecodeRefusesHostileFiles(t *testing.T) {
	demo := readDemo(t)
	tests := []struct {
		name    string
		data    []byte
		phrases []string
	}{
		{"lists nested 100,000 deep", nested(100_000, false), []string{"line 1, column 65:", "nested more than 64 deep", "open a file saved by Stave"}},
		{"objects nested 100,000 deep", nested(100_000, true), []string{"line 1, column 321:", "nested more than 64 deep"}},
		{"one level too deep", nested(maxDepth+1, false), []string{"nested more than 64 deep"}},
		{"larger than the limit", append([]byte(demo), bytes.Repeat([]byte(" "), MaxFileSize)...), []string{"more than the 8.0 MiB (8388608 bytes) a Stave project file may be", "open the file Stave saved, or its .bak backup"}},
		{"UTF-16, little-endian, with a mark", utf16Text(demo, false, true), []string{"line 1, column 1: this file is UTF-16 text; save it as UTF-8"}},
		{"UTF-16, big-endian, with a mark", utf16Text(demo, true, true), []string{"this file is UTF-16 text; save it as UTF-8"}},
		{"UTF-16 without a mark", utf16Text(demo, false, false), []string{"this file is UTF-16 text; save it as UTF-8"}},
		{"UTF-32, little-endian, with a mark", append([]byte{0xff, 0xfe, 0, 0}, "{\x00\x00\x00"...), []string{"this file is UTF-32 text; save it as UTF-8"}},
		{"UTF-32 without a mark", []byte("\x00\x00\x00{\x00\x00\x00}"), []string{"this file is UTF-32 text; save it as UTF-8"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			problems := refusal(t, tt.data)
			if len(problems) != 1 {
				t.Fatalf("want one problem, got %v", problems)
			}
			for _, phrase := range tt.phrases {
				if !strings.Contains(problems[0].Message, phrase) {
					t.Errorf("the refusal does not say %q:\n%s", phrase, problems[0].Message)
				}
			}
		})
	}
}

// Nesting up to the limit is read (and then refused as not a project).
func TestDecodeReadsNestingUpToTheLimit(t *testing.T) {
	problems := refusal(t, nested(maxDepth, false))
	if len(problems) != 1 || !strings.Contains(problems[0].Message, "the file holds a list [...], not a Stave project") {
		t.Errorf("a list nested %d deep gave %v", maxDepth, problems)
	}
}

// A UTF-8 byte-order mark is skipped: the file reads as without it.
func TestDecodeSkipsAUTF8ByteOrderMark(t *testing.T) {
	demo := []byte(readDemo(t))
	want, err := Unmarshal(demo)
	if err != nil {
		t.Fatal(err)
	}
	got, err := Unmarshal(append([]byte("\xef\xbb\xbf"), demo...))
	if err != nil {
		t.Fatalf("the demo file with a byte-order mark: %v", err)
	}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("the byte-order mark changed the project")
	}
	problems := refusal(t, []byte("\xef\xbb\xbf{\n  \"format\": 1,,\n}"))
	if !strings.Contains(problems[0].Message, "line 2, column 15") {
		t.Errorf("positions after a byte-order mark are off: %v", problems)
	}
}

// Values of the demo file the loader must refuse, each at its path. A text
// refused is named, quoted with its invisible characters escaped and cut
// short, as the loader quotes other values ("notes.project: is 1001
// characters long" named none).
func TestDecodeRefusesHostileValues(t *testing.T) {
	demo := readDemo(t)
	const name = `"name": "glued-laminated softwood (typical values)"`
	tests := []struct {
		name, old, new string
		path, phrase   string
	}{
		{"element count beyond the limit", `"elements": 22,`, `"elements": 1e12,`, "mesh.elements", "1e12 is too large; a count in a file may be at most 1000000000"},
		{"version far beyond this Stave's", `"version": 2`, `"version": 1e12`, "version", "newer Stave (format version 1e12)"},
		{"version too large for a number", `"version": 2`, `"version": 1e999`, "version", "newer Stave"},
		{"version below one", `"version": 2`, `"version": -4`, "version", "-4 is not a format version"},
		{"bytes not UTF-8 in a name", name, "\"name\": \"glued-laminated \xe9\"", "member.segments[0].material.name", "not UTF-8 text"},
		{"half a surrogate pair", `"engineer": "(demo)"`, `"engineer": "\ud800 (demo)"`, "notes.engineer", "half of a \\u surrogate pair"},
		{"low half of a pair first", `"engineer": "(demo)"`, `"engineer": "\udc00\ud800"`, "notes.engineer", "not UTF-8 text"},
		{"control character in a name", name, `"name": "soft\u0007wood"`, "member.segments[0].material.name", `"soft\awood" holds the control character U+0007 at character 5`},
		{"tab in a label", `"member": "J-1"`, `"member": "J\t1"`, "notes.member", `"J\t1" holds the control character U+0009`},
		{"C1 control character", `"project": "Demo`, `"project": "\u0085Demo`, "notes.project", `"\u0085Demo`},
		{"carriage return in the notes", `"text": "Invented`, `"text": "Invented\r\n`, "notes.text", "may hold tabs and line breaks, no other"},
		{"direction override in a name", name, `"name": "\u202egniwollef"`, "member.segments[0].material.name", `"\u202egniwollef" holds U+202E at character 1, an invisible character that changes the direction`},
		{"direction isolate in the notes", `"date": "2025-06-01"`, `"date": "2025\u2066-06-01"`, "notes.date", `"2025\u2066-06-01" holds U+2066`},
		{"label too long", `"member": "J-1"`, `"member": "` + strings.Repeat("é", MaxLabelLength+1) + `"`, "notes.member", `"` + strings.Repeat("é", 40) + `… (2002 bytes in all)" is 1001 characters long, more than the 1000 allowed here`},
		{"notes too long", `"text": "Invented`, `"text": "` + strings.Repeat("x", MaxNotesLength) + `Invented`, "notes.text", `"` + strings.Repeat("x", 40) + `… (`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			if !strings.Contains(demo, tt.old) {
				t.Fatalf("the demo file has no %q to edit", tt.old)
			}
			problems := refusal(t, []byte(strings.Replace(demo, tt.old, tt.new, 1)))
			for _, q := range problems {
				if q.Path == tt.path && strings.Contains(q.Message, tt.phrase) {
					return
				}
			}
			t.Errorf("no problem at %q saying %q; got %v", tt.path, tt.phrase, problems)
		})
	}
}

// Texts the loader must keep as they are.
func TestDecodeKeepsPlainTexts(t *testing.T) {
	demo := readDemo(t)
	tests := []struct{ name, engineer, want string }{
		{"a surrogate pair", `"\ud83d\udcd0 A. Engineer"`, "📐 A. Engineer"},
		{"the replacement character itself", `"\ufffd and \uFFFD"`, "\ufffd and \ufffd"},
		{"letters of other scripts", `"Ingeniør Ødegård, 工程师"`, "Ingeniør Ødegård, 工程师"},
		{"a label at the limit", `"` + strings.Repeat("é", MaxLabelLength) + `"`, strings.Repeat("é", MaxLabelLength)},
		{"escaped backslash before u", `"C:\\users"`, `C:\users`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			p, err := Unmarshal([]byte(strings.Replace(demo, `"engineer": "(demo)"`, `"engineer": `+tt.engineer, 1)))
			if err != nil {
				t.Fatal(err)
			}
			if p.Notes.Engineer != tt.want {
				t.Errorf("engineer %q, want %q", p.Notes.Engineer, tt.want)
			}
		})
	}
	p, err := Unmarshal([]byte(strings.Replace(demo, `"text": "Invented`, `"text": "Line one\n\tindented\nInvented`, 1)))
	if err != nil {
		t.Fatalf("notes with tabs and line breaks: %v", err)
	}
	if !strings.HasPrefix(p.Notes.Text, "Line one\n\tindented\n") {
		t.Errorf("notes %q lost their tab or line breaks", p.Notes.Text)
	}
}

// Validate finds the same text problems in a project in memory, so the
// application can warn that a file would not open again.
func TestValidateChecksTexts(t *testing.T) {
	p := loadDemo(t)
	p.Notes.Engineer = "A.\u202e Engineer"
	p.Model.Segments[1].Material.Name = strings.Repeat("x", MaxLabelLength+1)
	err := Validate(p)
	var le *LoadError
	if !errors.As(err, &le) {
		t.Fatalf("Validate gave %v", err)
	}
	var paths []string
	for _, q := range le.Problems {
		paths = append(paths, q.Path)
	}
	if want := []string{"notes.engineer", "member.segments[1].material.name"}; !reflect.DeepEqual(paths, want) {
		t.Errorf("problems at %v, want %v", paths, want)
	}
}

// A project whose file would be larger than a file may be is reported.
func TestValidateChecksTheFileSize(t *testing.T) {
	p := loadDemo(t)
	load := p.Model.PointLoads[0]
	base := len(mustMarshal(t, p))
	p.Model.PointLoads = append(p.Model.PointLoads, load)
	perLoad := len(mustMarshal(t, p)) - base
	for range (MaxFileSize-base)/perLoad + 1 {
		p.Model.PointLoads = append(p.Model.PointLoads, load)
	}
	if size := len(mustMarshal(t, p)); size <= MaxFileSize {
		t.Fatalf("the test project's file is %d bytes, not more than the limit", size)
	}
	err := Validate(p)
	if err == nil || !strings.Contains(err.Error(), "more than the 8.0 MiB (8388608 bytes) a project file may be") {
		t.Errorf("Validate of a project too large to save gave %v", err)
	}
}

// Load refuses a file larger than the limit without reading it, and stops
// reading one that does not tell its size at the limit.
func TestLoadRefusesLargeFiles(t *testing.T) {
	path := filepath.Join(t.TempDir(), "huge.json")
	sparseFile(t, path, 200<<20)
	files := []struct{ path, phrase string }{
		{path, "the file is 200.0 MiB (209715200 bytes), more than the 8.0 MiB"},
		{unsizedLargeFile(t), "the file is 8.0 MiB (8388609 bytes), more than the 8.0 MiB"},
	}
	for _, file := range files {
		if file.path == "" {
			continue
		}
		p, err := Load(file.path)
		var le *LoadError
		if p != nil || !errors.As(err, &le) || le.File != file.path || !strings.Contains(err.Error(), file.phrase) {
			t.Errorf("Load(%s) gave %v, want a refusal saying %q", file.path, err, file.phrase)
		}
	}
}

// unsizedLargeFile returns a file whose size reads as 0 but which holds more
// than MaxFileSize bytes (Linux's list of kernel symbols), or "" if there
// is none.
func unsizedLargeFile(t *testing.T) string {
	const path = "/proc/kallsyms"
	info, err := os.Stat(path)
	if err != nil || info.Size() != 0 {
		t.Logf("%s is not a file that hides its size (%v)", path, err)
		return ""
	}
	if data, err := os.ReadFile(path); err != nil || len(data) <= MaxFileSize {
		t.Logf("%s holds %d bytes (%v), not more than the limit", path, len(data), err)
		return ""
	}
	return path
}

// sparseFile makes a file of size bytes that takes no space on disk.
func sparseFile(t *testing.T, path string, size int64) {
	t.Helper()
	f, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	if err := f.Truncate(size); err != nil {
		t.Fatal(err)
	}
}

// FindRecovery refuses an autosave larger than the limit, whether its size
// shows or not.
func TestFindRecoveryRefusesLargeFiles(t *testing.T) {
	tests := []struct {
		name   string
		make   func(t *testing.T, path string)
		phrase string
	}{
		{"sparse", func(t *testing.T, path string) { sparseFile(t, path, 200<<20) }, "the file is 200.0 MiB"},
		{"of unknown size", func(t *testing.T, path string) {
			large := unsizedLargeFile(t)
			if large == "" {
				t.Skip("no file here that hides its size")
			}
			if err := os.Symlink(large, path); err != nil {
				t.Fatal(err)
			}
		}, "the file is 8.0 MiB (8388609 bytes), more than"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			dir := t.TempDir()
			tt.make(t, RecoveryPath(dir))
			r, err := FindRecovery(dir)
			if r != nil || err == nil || !strings.Contains(err.Error(), "cannot be recovered: "+tt.phrase) {
				t.Errorf("FindRecovery gave %v, %v; want a refusal saying %q", r, err, tt.phrase)
			}
		})
	}
}

// Texts of the file that a message repeats are cut short, so that a message
// stays readable whatever the file holds.
func TestDecodeCutsLongTextsInMessages(t *testing.T) {
	demo := readDemo(t)
	long := strings.Repeat("z", 100_000)
	tests := []struct{ name, old, new, path string }{
		{"format", `"format": "stave-member"`, `"format": "` + long + `"`, "format"},
		{"version", `"version": 2`, `"version": 1` + strings.Repeat("0", 100_000), "version"},
		{"unit", `"length": "m"`, `"length": "` + long + `"`, "units.length"},
		{"support kind", `"kind": "pinned"`, `"kind": "` + long + `"`, "supports[0].kind"},
		{"load kind", `"kind": "point"`, `"kind": "` + long + `"`, "loads[0].kind"},
		{"load direction", `"direction": "transverse"`, `"direction": "` + long + `"`, "loads[1].direction"},
		{"number", `"x": 4.2,`, `"x": 1` + strings.Repeat("0", 100_000) + `e999,`, "loads[0].x"},
		{"count", `"elements": 22,`, `"elements": 0.` + strings.Repeat("5", 100_000) + `,`, "mesh.elements"},
		{"unknown key", `"mesh": {`, `"` + long + `": 1, "mesh": {`, strings.Repeat("z", 40) + "… (100000 bytes in all)"},
		{"duplicate key", `"mesh": {`, `"` + long + `": 1, "` + long + `": 1, "mesh": {`, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			if !strings.Contains(demo, tt.old) {
				t.Fatalf("the demo file has no %q to edit", tt.old)
			}
			problems := refusal(t, []byte(strings.Replace(demo, tt.old, tt.new, 1)))
			found := false
			for _, q := range problems {
				if len(q.String()) > 500 {
					t.Errorf("a message of %d bytes: %.200s…", len(q.String()), q)
				}
				found = found || q.Path == tt.path && strings.Contains(q.String(), "… (1000")
			}
			if !found {
				t.Errorf("no problem at %q shows the text cut short: %v", tt.path, problems)
			}
		})
	}
}

// The refusal of a file nested too deep says how deeply a project nests
// lists and objects: as deep as the shipped files with cases do, no deeper
// than any (it said 5 while files with cases nest 7 deep).
func TestProjectDepthIsTheShippedFilesDeepest(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "testdata", "*.json"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no model files in testdata (err %v)", err)
	}
	deepest := 0
	for _, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		tree, err := parseTree(data)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		deepest = max(deepest, nodeDepth(tree))
	}
	if deepest != projectDepth {
		t.Errorf("the shipped files nest lists and objects %d deep, the refusal says %d", deepest, projectDepth)
	}
}

// nodeDepth is how many lists and objects nest in n, n included.
func nodeDepth(n *node) int {
	inner := 0
	for _, c := range n.items {
		inner = max(inner, nodeDepth(c))
	}
	for _, c := range n.fields {
		inner = max(inner, nodeDepth(c))
	}
	if n.kind == arrayNode || n.kind == objectNode {
		return inner + 1
	}
	return inner
}

// A syntax error deep in a file is placed where it is: past the decoder's
// first read, the JSON decoder's offset counts from its buffer, and a NaN
// on line 53 of a file was reported at "line 31, column 18".
func TestSyntaxErrorPlacedDeepInTheFile(t *testing.T) {
	demo := readDemo(t)
	for _, bad := range []string{"NaN", "Infinity", "+5.5", ".5", "05.5", "5.5.5", "tru"} {
		text := strings.Replace(demo, `"end": 5.5,`, `"end": `+bad+`,`, 1)
		i := strings.Index(text, `"end": `+bad)
		if i < 0 {
			t.Fatal("the demo file has no segment ending at 5.5 m")
		}
		line := 1 + strings.Count(text[:i], "\n")
		want := fmt.Sprintf("line %d, column ", line)
		problems := refusal(t, []byte(text))
		if len(problems) != 1 || !strings.HasPrefix(problems[0].Message, want) {
			t.Errorf("%q at line %d: %v, want it placed on its line", bad, line, problems)
		}
	}
}
