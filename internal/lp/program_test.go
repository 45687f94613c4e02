package lp

import (
	"bufio"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// program is a linear program in the form of Solve, read from testdata.
type program struct {
	name    string
	m, n    int
	c, a, b []float64
}

// readPrograms reads every testdata/programs/*.txt: comment lines starting
// with '#', then "m", "n", "c", "b" and "a" (column-major) lines of
// numbers, each written exactly (shortest round-trip decimal). The files
// are written by kinematic's TestWriteLPClosurePrograms and
// TestWriteLPSizingPrograms from the fuzz corpora there; their comments
// name the source.
func readPrograms(t testing.TB) []program {
	t.Helper()
	paths, err := filepath.Glob("testdata/programs/*.txt")
	if err != nil || len(paths) == 0 {
		t.Fatalf("no programs in testdata/programs: %v", err)
	}
	var ps []program
	for _, path := range paths {
		f, err := os.Open(path)
		if err != nil {
			t.Fatal(err)
		}
		p := program{name: strings.TrimSuffix(filepath.Base(path), ".txt")}
		sc := bufio.NewScanner(f)
		sc.Buffer(nil, 1<<22)
		for sc.Scan() {
			fields := strings.Fields(sc.Text())
			if len(fields) == 0 || strings.HasPrefix(fields[0], "#") {
				continue
			}
			var vs []float64
			for _, s := range fields[1:] {
				v, err := strconv.ParseFloat(s, 64)
				if err != nil {
					t.Fatalf("%s: %v", path, err)
				}
				vs = append(vs, v)
			}
			switch fields[0] {
			case "m":
				p.m = int(vs[0])
			case "n":
				p.n = int(vs[0])
			case "c":
				p.c = vs
			case "b":
				p.b = vs
			case "a":
				p.a = vs
			}
		}
		f.Close()
		if err := sc.Err(); err != nil {
			t.Fatal(err)
		}
		if len(p.c) != p.n || len(p.b) != p.m || len(p.a) != p.m*p.n {
			t.Fatalf("%s: shapes m %d n %d, len c %d b %d a %d", path, p.m, p.n, len(p.c), len(p.b), len(p.a))
		}
		ps = append(ps, p)
	}
	return ps
}
