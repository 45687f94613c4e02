package kinematic

import (
	"fmt"
	"go/ast"
	"go/parser"
	"go/token"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// fileOrder is the package's files, the floor first: each file may use
// only the files above it (DEVELOPERS.md, "Files of kinematic", gives the
// same list with one line each).
var fileOrder = []string{
	"doc.go",
	"errors.go",
	"finite.go",
	"contact.go",
	"surface.go",
	"seat.go",
	"vee.go",
	"rods.go",
	"flat.go",
	"socket.go",
	"cone.go",
	"layouts.go",
	"keepout.go",
	"analyze.go",
	"stability.go",
	"geometry.go",
	"forcelaw.go",
	"model.go",
	"statics.go",
	"preload.go",
	"equilibrium.go",
	"stiffness.go",
	"vibration.go",
	"spectrum.go",
	"random.go",
	"friction.go",
	"microslip.go",
	"closure.go",
	"assembly.go",
	"pose.go",
	"amplification.go",
	"budget.go",
	"thermal.go",
	"study.go",
	"score.go",
	"optimize.go",
}

// TestFilesDependDownward checks that every non-test file of the package
// is in fileOrder and refers only to package-level names declared in its
// own file or in files above it.
func TestFilesDependDownward(t *testing.T) {
	paths, err := filepath.Glob("*.go")
	if err != nil {
		t.Fatal(err)
	}
	fset := token.NewFileSet()
	files := map[string]*ast.File{}
	for _, p := range paths {
		if strings.HasSuffix(p, "_test.go") {
			continue
		}
		f, err := parser.ParseFile(fset, p, nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		files[p] = f
	}
	for name := range files {
		if !slices.Contains(fileOrder, name) {
			t.Errorf("%s is not in fileOrder (layout_test.go) or DEVELOPERS.md's list: give it its place", name)
		}
	}
	for _, name := range fileOrder {
		if files[name] == nil {
			t.Errorf("fileOrder lists %s, which does not exist", name)
		}
	}
	for _, v := range upwardUses(fset, files, fileOrder) {
		t.Error(v)
	}
}

// TestUpwardUsesFindsOne checks the checker on a package of two files in
// which the upper file calls a function and a method of the lower one,
// and uses a field, a local and a composite-literal key that share names
// with the lower file's declarations (which must not count).
func TestUpwardUsesFindsOne(t *testing.T) {
	src := map[string]string{
		"a.go": `package p
type A struct{ helper int }
func (a A) field() int { helper := 1; return a.helper + helper + A{helper: 2}.helper }
func top() int { return helper() + A{}.method() }
`,
		"b.go": `package p
func helper() int { return 1 }
func (a A) method() int { return 2 }
`,
	}
	fset := token.NewFileSet()
	files := map[string]*ast.File{}
	for name, s := range src {
		f, err := parser.ParseFile(fset, name, s, 0)
		if err != nil {
			t.Fatal(err)
		}
		files[name] = f
	}
	got := upwardUses(fset, files, []string{"a.go", "b.go"})
	if len(got) != 2 || !strings.Contains(got[0], "helper") || !strings.Contains(got[1], "method") {
		t.Errorf("got %q; want the use of helper and of method in a.go", got)
	}
	// The other way round, only b.go's receiver type A is used upward.
	if got := upwardUses(fset, files, []string{"b.go", "a.go"}); len(got) != 1 || !strings.Contains(got[0], "uses A,") {
		t.Errorf("in the order b.go, a.go: got %q; want the use of A in b.go", got)
	}
}

// upwardUses returns, for each use in a file of a package-level name
// declared only in files below it in order, a message naming the file,
// the name, its position and where it is declared.
//
// Functions, types, variables and constants are found by the parser's
// resolution: a name used in a file and declared at package level in
// another file is left unresolved in the file (locals, parameters and
// fields resolve or are selectors, and composite-literal keys are not
// listed). Methods are found by name at call sites x.name(...): the use is
// upward only when every method or interface method of that name is
// declared below the file (methods of different types can share a name).
func upwardUses(fset *token.FileSet, files map[string]*ast.File, order []string) []string {
	rank := map[string]int{}
	for i, name := range order {
		rank[name] = i
	}
	decl := map[string]string{}      // package-level name → its file
	methods := map[string][]string{} // method name → the files that declare one
	for name, f := range files {
		for _, d := range f.Decls {
			switch d := d.(type) {
			case *ast.FuncDecl:
				if d.Recv != nil {
					methods[d.Name.Name] = append(methods[d.Name.Name], name)
				} else {
					decl[d.Name.Name] = name
				}
			case *ast.GenDecl:
				for _, s := range d.Specs {
					switch s := s.(type) {
					case *ast.TypeSpec:
						decl[s.Name.Name] = name
						if it, ok := s.Type.(*ast.InterfaceType); ok {
							for _, m := range it.Methods.List {
								for _, n := range m.Names {
									methods[n.Name] = append(methods[n.Name], name)
								}
							}
						}
					case *ast.ValueSpec:
						for _, n := range s.Names {
							decl[n.Name] = name
						}
					}
				}
			}
		}
	}
	var out []string
	for _, name := range order {
		f := files[name]
		if f == nil {
			continue
		}
		for _, id := range f.Unresolved {
			if at, ok := decl[id.Name]; ok && rank[at] > rank[name] {
				out = append(out, fmt.Sprintf("%s: %s uses %s, declared in %s, below it", fset.Position(id.Pos()), name, id.Name, at))
			}
		}
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok {
				return true
			}
			sel, ok := call.Fun.(*ast.SelectorExpr)
			if !ok {
				return true
			}
			at := methods[sel.Sel.Name]
			if len(at) == 0 {
				return true
			}
			if slices.ContainsFunc(at, func(a string) bool { return rank[a] <= rank[name] }) {
				return true
			}
			slices.Sort(at)
			out = append(out, fmt.Sprintf("%s: %s calls method %s, declared in %s, below it", fset.Position(sel.Sel.Pos()), name, sel.Sel.Name, strings.Join(slices.Compact(at), ", ")))
			return true
		})
	}
	return out
}
