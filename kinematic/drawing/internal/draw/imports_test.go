package draw

import (
	"go/parser"
	"go/token"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestImportsPointDown checks that the kit imports no package of the
// module above it (kinematic, screw, hertz): callers translate their
// results into its plain types.
func TestImportsPointDown(t *testing.T) {
	files, err := filepath.Glob("*.go")
	if err != nil {
		t.Fatal(err)
	}
	fset := token.NewFileSet()
	for _, f := range files {
		ast, err := parser.ParseFile(fset, f, nil, parser.ImportsOnly)
		if err != nil {
			t.Fatal(err)
		}
		for _, im := range ast.Imports {
			p, _ := strconv.Unquote(im.Path.Value)
			if strings.HasPrefix(p, "github.com/sixfold-dev/sixfold/") && !strings.HasPrefix(p, "github.com/sixfold-dev/sixfold/internal/") {
				t.Errorf("%s imports %s", f, p)
			}
		}
	}
}
