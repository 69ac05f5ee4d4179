package physics

import (
	"go/ast"
	"go/parser"
	"go/token"
	"os"
	"strings"
	"testing"
)

// TestDoc_DegreesRule holds the package to the units rule of doc.go: every
// exported name that holds degrees ends in Deg and is one of the reporting
// values doc.go lists by name, and every exported field or constant whose
// comment says "degrees" carries that suffix.
func TestDoc_DegreesRule(t *testing.T) {
	docText, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	fset := token.NewFileSet()
	entries, err := os.ReadDir(".")
	if err != nil {
		t.Fatal(err)
	}
	var files []*ast.File
	for _, e := range entries {
		if n := e.Name(); strings.HasSuffix(n, ".go") && !strings.HasSuffix(n, "_test.go") {
			f, err := parser.ParseFile(fset, n, nil, parser.ParseComments)
			if err != nil {
				t.Fatal(err)
			}
			files = append(files, f)
		}
	}
	check := func(name, comment string, pos token.Pos) {
		if !ast.IsExported(name) {
			return
		}
		if strings.HasSuffix(name, "Deg") {
			if !strings.Contains(string(docText), name) {
				t.Errorf("%s: %s is in degrees but doc.go does not list it among the degree values", fset.Position(pos), name)
			}
			return
		}
		if strings.Contains(comment, "degrees") && !strings.Contains(comment, "radians") {
			t.Errorf("%s: %s is documented in degrees but its name lacks the Deg suffix", fset.Position(pos), name)
		}
	}
	for _, f := range files {
		ast.Inspect(f, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.Field:
				c := n.Doc.Text() + n.Comment.Text()
				for _, id := range n.Names {
					check(id.Name, c, id.Pos())
				}
			case *ast.ValueSpec:
				c := n.Doc.Text() + n.Comment.Text()
				for _, id := range n.Names {
					check(id.Name, c, id.Pos())
				}
			case *ast.FuncDecl:
				check(n.Name.Name, "", n.Name.Pos())
			}
			return true
		})
	}
}
