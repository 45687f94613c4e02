package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"regexp"
	"strings"

	"github.com/sixfold-dev/sixfold/kinematic/design"
)

// apiHint is the Go API's pointer, in an unknown dimension's error, to
// the method that lists a pair's dimensions.
var apiHint = regexp.MustCompile(`\(the dimensions of pair (\S+) are listed by Assembly\.Dimensions\)`)

// listDimensions (as in examples/study: each example stands alone) rewrites an unknown tolerance dimension's error for a
// design file's reader, who has no Assembly to call: the pointer to
// Assembly.Dimensions becomes the list of the pair's dimensions, read
// from the same file built without its tolerances. Any other error, or
// one whose file cannot be built even so, is returned as it is.
func listDimensions(err error, src []byte) error {
	if err == nil {
		return nil
	}
	msg := err.Error()
	m := apiHint.FindStringSubmatchIndex(msg)
	if m == nil {
		return err
	}
	pair := msg[m[2]:m[3]]
	var raw map[string]json.RawMessage
	if json.Unmarshal(src, &raw) != nil {
		return err
	}
	// What refers to the tolerances goes with them.
	for _, k := range []string{"tolerances", "monte_carlo", "requirements", "optimize", "packaging"} {
		delete(raw, k)
	}
	bare, jerr := json.Marshal(raw)
	if jerr != nil {
		return err
	}
	d, perr := design.Parse(bare)
	if perr != nil {
		return err
	}
	b, berr := d.Build()
	if berr != nil {
		return err
	}
	var names []string
	for _, n := range b.Assembly().Dimensions() {
		if strings.HasPrefix(n, pair+".") {
			names = append(names, n)
		}
	}
	if len(names) == 0 {
		return err
	}
	return errors.New(msg[:m[0]] + fmt.Sprintf("(the dimensions of pair %s: %s)", pair, strings.Join(names, ", ")) + msg[m[1]:])
}
