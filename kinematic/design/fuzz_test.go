package design

import (
	"bytes"
	"path/filepath"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// FuzzRead reads arbitrary bytes as a design file. Invariants: no panic;
// an input that reads is valid, writes, and its canonical form reads back
// as an equal Design that writes the same bytes. The seed corpus is the
// test designs and malformed variants of them (more in
// testdata/fuzz/FuzzRead).
func FuzzRead(f *testing.F) {
	files, _ := filepath.Glob("testdata/*.json")
	for _, name := range files {
		f.Add(readFile(f, name))
	}
	f.Add([]byte(baseJSON))
	for _, s := range []string{
		``,
		`{}`,
		`{"format": "sixfold.design/1"}`,
		`{"format": "sixfold.design/2", "balls": []}`,
		`{"format": "sixfold.design/1", "balls": [{"centre": [0, 0, 0], "radius": "1e400 mm", "material": "sapphire"}]}`,
		`{"format": "sixfold.design/1", "description": [[[[[[[[[[[[[[[[[[[[]]]]]]]]]]]]]]]]]]]]}`,
		`[1, 2, 3]`,
		// Bare numbers: refused in version 2, SI with the declaration or
		// in version 1.
		`{"format": "sixfold.design/2", "balls": [{"centre": [0, 0, 0], "radius": 6.35, "material": "sapphire"}]}`,
		`{"format": "sixfold.design/2", "units": "si", "balls": [{"centre": [0, 0, 0], "radius": 6.35, "material": "sapphire"}]}`,
		`{"format": "sixfold.design/2", "units": "mm"}`,
		`{"format": "sixfold.design/2", "axis": [0, 0, 0]}`,
		// Bytes that are not UTF-8, in a value and in a member name.
		"{\"format\": \"sixfold.design/2\", \"description\": \"ab\xffc\"}",
		"{\"format\": \"sixfold.design/2\", \"na\xe2\x82me\": 1}",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		d, err := Parse(b)
		if err != nil {
			if _, ok := err.(*Error); !ok {
				t.Fatalf("error %v is a %T, not a *design.Error", err, err)
			}
			return
		}
		if err := d.Validate(); err != nil {
			t.Fatalf("a design that read does not validate: %v", err)
		}
		var w1 bytes.Buffer
		if err := d.Write(&w1); err != nil {
			t.Fatalf("a design that read does not write: %v", err)
		}
		d2, err := Parse(w1.Bytes())
		if err != nil {
			t.Fatalf("the canonical form does not read: %v\n%s", err, w1.Bytes())
		}
		if diff := cmp.Diff(d, d2); diff != "" {
			t.Fatalf("Read(Write(d)) differs (-want +got):\n%s", diff)
		}
		var w2 bytes.Buffer
		if err := d2.Write(&w2); err != nil || !bytes.Equal(w1.Bytes(), w2.Bytes()) {
			t.Fatalf("the canonical form is not stable (%v)", err)
		}
	})
}
