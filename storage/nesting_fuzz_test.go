package storage

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// leaf is one scalar value of a file (a number, a text that is not a key,
// true, false or null): its bytes and how many lists and objects hold it.
type leaf struct{ start, end, depth int }

// leaves lists the scalar values of the JSON text data, in order, and last
// the whole text as a leaf at depth 0.
func leaves(data []byte) []leaf {
	var out []leaf
	depth := 0
	for i := 0; i < len(data); i++ {
		switch c := data[i]; {
		case c == '[' || c == '{':
			depth++
		case c == ']' || c == '}':
			depth--
		case c == '"':
			end := stringEnd(data, i)
			rest := bytes.TrimLeft(data[end:], " \t\r\n")
			if len(rest) == 0 || rest[0] != ':' {
				out = append(out, leaf{i, end, depth})
			}
			i = end - 1
		case c == '-' || c == 't' || c == 'f' || c == 'n' || (c >= '0' && c <= '9'):
			end := i + bytes.IndexAny(data[i:], ",]}\r\n\t ")
			out = append(out, leaf{i, end, depth})
			i = end - 1
		}
	}
	return append(out, leaf{0, len(data), 0})
}

// wrap puts depth lists or objects around data[l.start:l.end], chosen by
// the bits of pattern in turn (1 an object, 0 a list; an empty pattern
// gives lists), and closes them unless open is set.
func wrap(data []byte, l leaf, depth int, pattern []byte, open bool) []byte {
	var openers, closers bytes.Buffer
	for i := range depth {
		object := len(pattern) > 0 && pattern[i/8%len(pattern)]>>(i%8)&1 == 1
		if object {
			openers.WriteString(`{"a":`)
		} else {
			openers.WriteByte('[')
		}
		if !open {
			closers.WriteByte("]}"[boolIndex(object)])
		}
	}
	out := make([]byte, 0, len(data)+openers.Len()+closers.Len())
	out = append(out, data[:l.start]...)
	out = append(out, openers.Bytes()...)
	out = append(out, data[l.start:l.end]...)
	out = append(out, reverse(closers.Bytes())...)
	return append(out, data[l.end:]...)
}

func boolIndex(b bool) int {
	if b {
		return 1
	}
	return 0
}

func reverse(b []byte) []byte {
	out := make([]byte, len(b))
	for i, c := range b {
		out[len(b)-1-i] = c
	}
	return out
}

// FuzzNestingEverywhere complements FuzzHostileShapes: any value of the
// demo file, or the whole file, is wrapped in up to 200,000 lists and
// objects mixed as the fuzzer likes, closed or left open. Besides
// FuzzDecode's checks (no panic, no stack overflow, every refusal
// explained), nothing wrapped is accepted; a file too large is refused for
// its size, one nested deeper than the limit for its depth, at a line and
// column.
func FuzzNestingEverywhere(f *testing.F) {
	demo, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		f.Fatal(err)
	}
	places := leaves(demo)
	f.Add(uint16(0), []byte{}, uint32(1), false)
	f.Add(uint16(7), []byte{0xaa}, uint32(maxDepth), false)
	f.Add(uint16(40), []byte{0x0f, 0xf0}, uint32(maxDepth-4), true)
	f.Add(uint16(len(places)-1), []byte{0x01}, uint32(100_000), false)
	f.Add(uint16(len(places)-2), []byte{0xff}, uint32(200_000), true)
	f.Fuzz(func(t *testing.T, which uint16, pattern []byte, depth uint32, open bool) {
		l := places[int(which)%len(places)]
		depth %= 200_001
		data := wrap(demo, l, int(depth), pattern, open)
		problems := checkDecode(t, data)
		if depth == 0 {
			return
		}
		if problems == nil {
			t.Fatalf("a file with the value at bytes %d–%d wrapped %d deep (open %v) was accepted", l.start, l.end, depth, open)
		}
		var want string
		switch {
		case len(data) > MaxFileSize:
			want = "more than the 8.0 MiB"
		case l.depth+int(depth) > maxDepth:
			want = fmt.Sprintf("nested more than %d deep", maxDepth)
		default:
			return
		}
		for _, q := range problems {
			if s := q.String(); strings.Contains(s, want) && (!strings.HasPrefix(want, "nested") || strings.Contains(s, "line ")) {
				return
			}
		}
		t.Fatalf("a file of %d bytes with the value at bytes %d–%d (depth %d) wrapped %d deep was not refused with %q: %v", len(data), l.start, l.end, l.depth, depth, want, problems)
	})
}

// The demo file's leaves are its values: as many as its scalar values, with
// the depths the format gives them.
func TestLeavesOfTheDemo(t *testing.T) {
	demo := []byte(readDemo(t))
	ls := leaves(demo)
	whole := ls[len(ls)-1]
	if whole != (leaf{0, len(demo), 0}) {
		t.Errorf("the last leaf is %+v, want the whole file", whole)
	}
	depths := map[string]int{}
	for _, l := range ls[:len(ls)-1] {
		depths[string(demo[l.start:l.end])] = l.depth
	}
	for value, depth := range map[string]int{`"stave-member"`: 1, `"J-1"`: 2, `"glued-laminated softwood (typical values)"`: 5, `1.15e10`: 5, `"pinned"`: 3} {
		if got, ok := depths[value]; !ok || got != depth {
			t.Errorf("value %s: depth %d (found %v), want %d", value, got, ok, depth)
		}
	}
	if _, ok := depths[`"format"`]; ok {
		t.Errorf("a key was taken for a value")
	}
}
