package storage

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strings"
)

// node is one parsed JSON value. The loader walks nodes instead of decoding
// straight into structs so that it can report every problem at once, each
// with its path, rather than stopping at the first.
type node struct {
	kind  nodeKind
	text  string // a string's value or a number's literal text
	truth bool
	// damaged marks a string whose literal held bytes that are not UTF-8 or
	// half of a surrogate pair; the decoder replaced them by U+FFFD.
	damaged bool
	items   []*node          // array elements
	keys    []string         // object keys in file order
	fields  map[string]*node // object members
}

type nodeKind int

const (
	nullNode nodeKind = iota
	boolNode
	numberNode
	stringNode
	arrayNode
	objectNode
)

func (n *node) describe() string {
	switch n.kind {
	case boolNode:
		return "true/false"
	case numberNode:
		return "a number"
	case stringNode:
		return "text"
	case arrayNode:
		return "a list [...]"
	case objectNode:
		return "an object {...}"
	}
	return "null"
}

// maxDepth is how deeply a file may nest lists and objects. A project nests
// them projectDepth deep; the bound keeps the recursion below far from the
// end of the stack, whose overflow is fatal, not a panic.
const maxDepth = 64

// projectDepth is the deepest a project nests lists and objects: the file's
// object, then cases[i].loads[j].points[k] (a point is a list).
const projectDepth = 7

// parseTree reads one JSON value and nothing after it. Its errors name the
// line and column.
func parseTree(data []byte) (*node, error) {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	p := treeParser{dec: dec, data: data}
	top, err := p.value(0)
	if err != nil {
		return nil, err
	}
	if _, err := dec.Token(); err != io.EOF {
		return nil, fmt.Errorf("%s: more text follows the end of the project; remove it", p.position(dec.InputOffset()))
	}
	return top, nil
}

type treeParser struct {
	dec  *json.Decoder
	data []byte
}

func (p *treeParser) position(offset int64) string {
	offset = min(max(offset, 0), int64(len(p.data)))
	line := 1 + bytes.Count(p.data[:offset], []byte("\n"))
	column := offset - int64(bytes.LastIndexByte(p.data[:offset], '\n'))
	return fmt.Sprintf("line %d, column %d", line, column)
}

func (p *treeParser) fail(err error) error {
	var syntax *json.SyntaxError
	switch {
	case errors.As(err, &syntax):
		// syntax.Offset is not the place in the file for a value the
		// decoder reads whole (it counts the bytes of the values read so
		// far): a NaN on line 53 was placed on line 31. The decoder stands
		// at the offending character, or before the value it holds, with
		// spaces between.
		at := p.dec.InputOffset()
		for at < int64(len(p.data)) && strings.IndexByte(" \t\r\n", p.data[at]) >= 0 {
			at++
		}
		return fmt.Errorf("%s: %v; the file is not valid JSON, fix the text there", p.position(at), syntax)
	case err == io.EOF || errors.Is(err, io.ErrUnexpectedEOF):
		return fmt.Errorf("%s: the file ends too early; it may have been cut off", p.position(int64(len(p.data))))
	}
	return fmt.Errorf("%s: %v", p.position(p.dec.InputOffset()), err)
}

// token reads the next token. For a string it also reports whether its
// literal in the file was damaged (see node.damaged).
func (p *treeParser) token() (tok json.Token, damaged bool, err error) {
	start := p.dec.InputOffset()
	tok, err = p.dec.Token()
	if _, ok := tok.(string); ok && err == nil {
		// The bytes read hold separators and spaces, then the quoted literal.
		read := p.data[start:p.dec.InputOffset()]
		literal := read[bytes.IndexByte(read, '"')+1 : len(read)-1]
		damaged = !literalIntact(literal)
	}
	return tok, damaged, err
}

// value reads one value that lies inside depth lists and objects.
func (p *treeParser) value(depth int) (*node, error) {
	tok, damaged, err := p.token()
	if err != nil {
		return nil, p.fail(err)
	}
	switch t := tok.(type) {
	case nil:
		return &node{kind: nullNode}, nil
	case bool:
		return &node{kind: boolNode, truth: t}, nil
	case json.Number:
		return &node{kind: numberNode, text: string(t)}, nil
	case string:
		return &node{kind: stringNode, text: t, damaged: damaged}, nil
	case json.Delim:
		if depth == maxDepth {
			return nil, fmt.Errorf("%s: lists and objects are nested more than %d deep here (a Stave project nests them %d deep at most), so this is not a Stave project file or it is damaged; open a file saved by Stave", p.position(p.dec.InputOffset()-1), maxDepth, projectDepth)
		}
		if t == '[' {
			return p.array(depth + 1)
		}
		return p.object(depth + 1)
	}
	return nil, p.fail(fmt.Errorf("unexpected %v", tok))
}

func (p *treeParser) array(depth int) (*node, error) {
	n := &node{kind: arrayNode}
	for p.dec.More() {
		item, err := p.value(depth)
		if err != nil {
			return nil, err
		}
		n.items = append(n.items, item)
	}
	if _, err := p.dec.Token(); err != nil { // the closing ']'
		return nil, p.fail(err)
	}
	return n, nil
}

func (p *treeParser) object(depth int) (*node, error) {
	n := &node{kind: objectNode, fields: map[string]*node{}}
	for p.dec.More() {
		tok, err := p.dec.Token()
		if err != nil {
			return nil, p.fail(err)
		}
		key := tok.(string) // the decoder only yields string keys inside an object
		if _, dup := n.fields[key]; dup {
			return nil, fmt.Errorf("%s: the key %q appears twice in one object; keep one", p.position(p.dec.InputOffset()), cut(key))
		}
		value, err := p.value(depth)
		if err != nil {
			return nil, err
		}
		n.keys = append(n.keys, key)
		n.fields[key] = value
	}
	if _, err := p.dec.Token(); err != nil { // the closing '}'
		return nil, p.fail(err)
	}
	return n, nil
}
