package design

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"unicode/utf8"
)

// The reader first turns the file into a tree of nodes, with its own
// bounds, then walks the tree against the format (read.go). Building the
// tree itself, rather than decoding into structs, keeps the JSON path of
// every value for its errors, finds members given twice (which
// encoding/json would merge silently) and bounds what a hostile file can
// make the reader allocate.

// MaxSize is the size in bytes of the largest design file that Read and
// Parse accept: 4 MiB, about a thousand times the demo cassette design.
const MaxSize = 4 << 20

// Bounds of the tree: maxTokens the number of JSON values and keys in it
// (a design with the most tolerances allowed, 10 000 of about 8 tokens
// each, needs 80 000); maxDepth the nesting (the format nests 6 deep:
// cases[i].applied[j].force[k]); maxElements the length of any one array
// (the longest list the format allows is the tolerances').
const (
	maxTokens   = 150_000
	maxDepth    = 16
	maxElements = maxTolerances
)

type nodeKind uint8

const (
	nullNode nodeKind = iota
	boolNode
	numberNode
	stringNode
	objectNode
	arrayNode
)

func (k nodeKind) String() string {
	return [...]string{"null", "a boolean", "a number", "a string", "an object", "an array"}[k]
}

// node is one JSON value.
type node struct {
	kind nodeKind
	text string   // a string's value, a number's literal
	b    bool     // a boolean's value
	keys []string // an object's member names, in file order
	vals []*node  // an object's member values, or an array's elements
}

// get returns the member key of an object node, or nil.
func (n *node) get(key string) *node {
	for i, k := range n.keys {
		if k == key {
			return n.vals[i]
		}
	}
	return nil
}

type treeBuilder struct {
	dec    *json.Decoder
	data   []byte
	tokens int

	// badUTF8 reports whether the file holds bytes that are not UTF-8,
	// which the decoder would silently replace with U+FFFD; the strings
	// are then checked one by one to name the one at fault.
	badUTF8 bool
}

// parseTree returns the tree of the JSON document b.
func parseTree(b []byte) (*node, error) {
	if len(b) > MaxSize {
		return nil, errorf("", ErrTooLarge, "the file has %d bytes; at most %d (%d MiB) are read", len(b), MaxSize, MaxSize>>20)
	}
	dec := json.NewDecoder(bytes.NewReader(b))
	dec.UseNumber()
	t := &treeBuilder{dec: dec, data: b, badUTF8: !utf8.Valid(b)}
	n, err := t.value("", 0)
	if err != nil {
		return nil, err
	}
	if _, err := dec.Token(); err != io.EOF {
		return nil, errorf("", ErrSyntax, "%s: more data after the design's object", t.where(dec.InputOffset()))
	}
	return n, nil
}

// value reads one value at path.
func (t *treeBuilder) value(path string, depth int) (*node, error) {
	if depth > maxDepth {
		return nil, errorf(path, ErrTooLarge, "nested more than %d deep", maxDepth)
	}
	t.tokens++
	if t.tokens > maxTokens {
		return nil, errorf(path, ErrTooLarge, "more than %d JSON values in the file", maxTokens)
	}
	start := t.dec.InputOffset()
	tok, err := t.dec.Token()
	if err != nil {
		return nil, t.syntax(err, path)
	}
	if err := t.checkUTF8(start, path); err != nil {
		return nil, err
	}
	switch v := tok.(type) {
	case nil:
		return &node{kind: nullNode}, nil
	case bool:
		return &node{kind: boolNode, b: v}, nil
	case json.Number:
		return &node{kind: numberNode, text: string(v)}, nil
	case string:
		return &node{kind: stringNode, text: v}, nil
	case json.Delim:
		switch v {
		case '{':
			return t.object(path, depth)
		case '[':
			return t.array(path, depth)
		}
	}
	return nil, errorf(path, ErrSyntax, "%s: unexpected %v", t.where(t.dec.InputOffset()), tok)
}

func (t *treeBuilder) object(path string, depth int) (*node, error) {
	n := &node{kind: objectNode}
	for t.dec.More() {
		t.tokens++
		if t.tokens > maxTokens {
			return nil, errorf(path, ErrTooLarge, "more than %d JSON values in the file", maxTokens)
		}
		start := t.dec.InputOffset()
		tok, err := t.dec.Token()
		if err != nil {
			return nil, t.syntax(err, path)
		}
		if err := t.checkUTF8(start, path); err != nil {
			return nil, err
		}
		key, _ := tok.(string) // the decoder allows only strings here
		for _, k := range n.keys {
			if k == key {
				return nil, errorf(join(path, key), ErrUnknownField, "given twice")
			}
		}
		v, err := t.value(join(path, key), depth+1)
		if err != nil {
			return nil, err
		}
		n.keys = append(n.keys, key)
		n.vals = append(n.vals, v)
	}
	if _, err := t.dec.Token(); err != nil { // '}'
		return nil, t.syntax(err, path)
	}
	return n, nil
}

func (t *treeBuilder) array(path string, depth int) (*node, error) {
	n := &node{kind: arrayNode}
	for t.dec.More() {
		if len(n.vals) == maxElements {
			return nil, errorf(path, ErrTooLarge, "more than %d entries", maxElements)
		}
		v, err := t.value(index(path, len(n.vals)), depth+1)
		if err != nil {
			return nil, err
		}
		n.vals = append(n.vals, v)
	}
	if _, err := t.dec.Token(); err != nil { // ']'
		return nil, t.syntax(err, path)
	}
	return n, nil
}

// checkUTF8 returns an error at path if the token read from the byte
// offset start holds bytes that are not UTF-8. A JSON text exchanged
// between systems is UTF-8 (RFC 8259, §8.1).
func (t *treeBuilder) checkUTF8(start int64, path string) error {
	if !t.badUTF8 {
		return nil
	}
	end := min(t.dec.InputOffset(), int64(len(t.data)))
	tok := t.data[start:end]
	if utf8.Valid(tok) {
		return nil
	}
	off := start
	for len(tok) > 0 {
		r, size := utf8.DecodeRune(tok)
		if r == utf8.RuneError && size <= 1 {
			break
		}
		tok, off = tok[size:], off+int64(size)
	}
	return errorf(path, ErrSyntax, "%s: byte 0x%02x is not UTF-8; a design file is UTF-8 text", t.where(off), t.data[off])
}

// syntax returns the decoder's error err, met while reading the value at
// path, as an *Error with the line and column.
func (t *treeBuilder) syntax(err error, path string) error {
	var se *json.SyntaxError
	switch {
	case errors.As(err, &se):
		return errorf(path, ErrSyntax, "%s: %v", t.where(se.Offset), se)
	case err == io.EOF || errors.Is(err, io.ErrUnexpectedEOF):
		if len(bytes.TrimSpace(t.data)) == 0 {
			return errorf(path, ErrSyntax, "empty input")
		}
		return errorf(path, ErrSyntax, "unexpected end of input")
	}
	return errorf(path, ErrSyntax, "%s: %v", t.where(t.dec.InputOffset()), err)
}

// where returns "line L, column C" of the byte offset off.
func (t *treeBuilder) where(off int64) string {
	if off > int64(len(t.data)) {
		off = int64(len(t.data))
	}
	line, col := 1, 1
	for _, c := range t.data[:off] {
		if c == '\n' {
			line, col = line+1, 1
		} else {
			col++
		}
	}
	return fmt.Sprintf("line %d, column %d", line, col)
}
