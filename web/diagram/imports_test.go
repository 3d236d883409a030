package diagram

import (
	"go/parser"
	"go/token"
	"io/fs"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestWebImportsResultTypesOnly keeps the import rule of DEVELOPERS.md: code under web/ takes the
// root optics package's result types and the presentation leaves optics/tables and optics/numfmt,
// and never imports a computing package below it (optics/layout, optics/trace, ...); tests may, to
// build their inputs.
func TestWebImportsResultTypesOnly(t *testing.T) {
	presentation := map[string]bool{"raytable/optics/tables": true, "raytable/optics/numfmt": true}
	checked := 0
	err := filepath.WalkDir("..", func(path string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() || !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return err
		}
		f, err := parser.ParseFile(token.NewFileSet(), path, nil, parser.ImportsOnly)
		if err != nil {
			return err
		}
		checked++
		for _, imp := range f.Imports {
			p, _ := strconv.Unquote(imp.Path.Value)
			if strings.HasPrefix(p, "raytable/optics/") && !presentation[p] {
				t.Errorf("%s imports %s; web takes the report's result types from raytable/optics and its tables and number words only", path, p)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if checked < 10 {
		t.Fatalf("checked %d files under web/, expected the drawing and view sources", checked)
	}
}
