package apicheck

import (
	"bufio"
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"go/ast"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"runtime/debug"
	"slices"
	"strings"
)

// listedPackage is the part of `go list -json` output that listModule reads.
type listedPackage struct {
	ImportPath     string
	Dir            string
	Name           string
	GoFiles        []string
	CgoFiles       []string
	IgnoredGoFiles []string
	Imports        []string
}

// listModule returns the recorded API of every public package of the module
// whose root directory is root: one line per item, sorted, in the format
// described in the package documentation.
func listModule(root string) ([]string, error) {
	pkgs, err := publicPackages(root)
	if err != nil {
		return nil, err
	}
	return list(root, pkgs)
}

// publicPackages returns the import paths and directories of the public packages of
// the module rooted at root, sorted by import path: every package `go list
// ./...` reports that is not a main package and has no path element
// internal or examples below root.
func publicPackages(root string) ([]listedPackage, error) {
	out, err := goCmd(root, "list", "-json=ImportPath,Dir,Name,GoFiles,CgoFiles,IgnoredGoFiles,Imports", "./...")
	if err != nil {
		return nil, err
	}
	var pkgs []listedPackage
	dec := json.NewDecoder(bytes.NewReader(out))
	for {
		var p listedPackage
		if err := dec.Decode(&p); errors.Is(err, io.EOF) {
			break
		} else if err != nil {
			return nil, fmt.Errorf("reading go list output: %w", err)
		}
		rel, err := filepath.Rel(root, p.Dir)
		if err != nil {
			return nil, err
		}
		if p.Name == "main" || !public(rel) {
			continue
		}
		pkgs = append(pkgs, p)
	}
	slices.SortFunc(pkgs, func(a, b listedPackage) int { return strings.Compare(a.ImportPath, b.ImportPath) })
	return pkgs, nil
}

// public reports whether the package in the directory rel (relative to the
// module root, slash or OS separated) is importable by users of the module
// and meant for them: no path element is internal (Go's rule), examples,
// testdata, or hidden (starting with "." or "_", which the go command
// ignores anyway).
func public(rel string) bool {
	for _, e := range strings.Split(filepath.ToSlash(rel), "/") {
		switch {
		case e == "internal", e == "examples", e == "testdata":
			return false
		case strings.HasPrefix(e, "."), strings.HasPrefix(e, "_"):
			if e != "." {
				return false
			}
		}
	}
	return true
}

// list type-checks pkgs from source, with their imports read from export
// data, and returns their recorded lines, sorted.
func list(root string, pkgs []listedPackage) ([]string, error) {
	var imports []string
	for _, p := range pkgs {
		if len(p.CgoFiles) > 0 {
			return nil, fmt.Errorf("%s: cgo files %v: the API check lists pure Go packages only", p.ImportPath, p.CgoFiles)
		}
		for _, f := range p.IgnoredGoFiles {
			if !strings.HasSuffix(f, "_test.go") {
				return nil, fmt.Errorf("%s: %s is excluded by a build constraint on this platform: the API check lists one platform only and would miss what it declares", p.ImportPath, f)
			}
		}
		imports = append(imports, p.Imports...)
	}
	slices.Sort(imports)
	imports = slices.Compact(imports)
	exports, err := exportData(root, imports)
	if err != nil {
		return nil, err
	}

	fset := token.NewFileSet()
	imp := importer.ForCompiler(fset, "gc", func(path string) (io.ReadCloser, error) {
		f, ok := exports[path]
		if !ok {
			return nil, fmt.Errorf("no export data for %q", path)
		}
		return os.Open(f)
	})
	features := make(map[string]bool)
	for _, p := range pkgs {
		files := make([]*ast.File, 0, len(p.GoFiles))
		for _, name := range p.GoFiles {
			f, err := parser.ParseFile(fset, filepath.Join(p.Dir, name), nil, parser.SkipObjectResolution)
			if err != nil {
				return nil, err
			}
			files = append(files, f)
		}
		conf := types.Config{Importer: imp}
		tp, err := conf.Check(p.ImportPath, fset, files, nil)
		if err != nil {
			return nil, fmt.Errorf("type-checking %s: %w", p.ImportPath, err)
		}
		w := walker{pkg: tp, features: features}
		if err := w.walk(); err != nil {
			return nil, err
		}
	}
	lines := make([]string, 0, len(features))
	for f := range features {
		lines = append(lines, f)
	}
	slices.Sort(lines)
	return lines, nil
}

// exportData returns the export data file of every package in paths and of
// their dependencies, by import path.
func exportData(root string, paths []string) (map[string]string, error) {
	m := make(map[string]string)
	if len(paths) == 0 {
		return m, nil
	}
	args := append([]string{"list", "-deps", "-export", "-f", "{{if .Export}}{{.ImportPath}}\t{{.Export}}{{end}}"}, paths...)
	out, err := goCmd(root, args...)
	if err != nil {
		return nil, err
	}
	sc := bufio.NewScanner(bytes.NewReader(out))
	for sc.Scan() {
		path, file, ok := strings.Cut(sc.Text(), "\t")
		if ok {
			m[path] = file
		}
	}
	return m, sc.Err()
}

// goCmd runs the go command in dir with the build flags the running binary
// was built with that change which packages are compiled (-race), so that
// the build cache of the enclosing `go test` is reused, and returns its
// standard output.
func goCmd(dir string, args ...string) ([]byte, error) {
	if bi, ok := debug.ReadBuildInfo(); ok {
		for _, s := range bi.Settings {
			if s.Key == "-race" && s.Value == "true" {
				args = slices.Insert(args, 1, "-race")
			}
		}
	}
	cmd := exec.Command("go", args...)
	cmd.Dir = dir
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	out, err := cmd.Output()
	if err != nil {
		return nil, fmt.Errorf("go %s in %s: %v\n%s", strings.Join(args, " "), dir, err, stderr.Bytes())
	}
	return out, nil
}
