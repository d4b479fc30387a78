package similis_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"io/fs"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
)

const module = "similis.dev/similis"

// layer gives each package directory its place: a package may import
// only packages of a lower layer (or its own subpackages' layer), and
// internal/ packages import none of the module.
func layer(dir string) int {
	switch {
	case dir == "internal" || strings.HasPrefix(dir, "internal/"):
		return 0
	case dir == "quantity" || strings.HasPrefix(dir, "quantity/"):
		return 1
	case dir == "units" || strings.HasPrefix(dir, "units/"):
		return 2
	case dir == "pigroups" || strings.HasPrefix(dir, "pigroups/"):
		return 3
	case dir == "similarity" || strings.HasPrefix(dir, "similarity/"):
		return 4
	}
	return 5 // examples and the root package
}

// examplesShared reports whether dir is an example command importing the
// examples' own shared package (examples/internal/...), which holds what
// every command does with its flags.
func examplesShared(dir, target string) bool {
	return strings.HasPrefix(dir, "examples/") && strings.HasPrefix(target, "examples/internal/")
}

// sameLayer lists the imports allowed between sibling packages of one
// layer, each in one direction only: the fits build on the uncertainty
// propagation (a prediction carries the fit's coefficients as sources).
var sameLayer = map[[2]string]bool{{"quantity/fit", "quantity/uncertain"}: true}

// goFiles returns the module's non-test Go files by directory.
func goFiles(t *testing.T) map[string][]string {
	t.Helper()
	out := map[string][]string{}
	err := filepath.WalkDir(".", func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (strings.HasPrefix(d.Name(), ".") && path != "." || d.Name() == "testdata") {
			return filepath.SkipDir
		}
		if !d.IsDir() && strings.HasSuffix(path, ".go") && !strings.HasSuffix(path, "_test.go") {
			dir := filepath.ToSlash(filepath.Dir(path))
			out[dir] = append(out[dir], path)
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	return out
}

// TestLayering fails if a package imports upward: quantity ← units ←
// pigroups ← similarity ← examples, internal/ below them all and
// importing none of the module.
func TestLayering(t *testing.T) {
	fset := token.NewFileSet()
	for dir, files := range goFiles(t) {
		for _, path := range files {
			f, err := parser.ParseFile(fset, path, nil, parser.ImportsOnly)
			if err != nil {
				t.Fatal(err)
			}
			for _, imp := range f.Imports {
				ip, _ := strconv.Unquote(imp.Path.Value)
				if !strings.HasPrefix(ip, module+"/") {
					continue
				}
				target := strings.TrimPrefix(ip, module+"/")
				if layer(dir) == 0 || layer(target) > layer(dir) || layer(target) == layer(dir) && !strings.HasPrefix(target, dir) && !strings.HasPrefix(dir, target) && !examplesShared(dir, target) && !sameLayer[[2]string{dir, target}] {
					t.Errorf("%s imports %s: an upward or sideways import", path, ip)
				}
			}
		}
	}
}

// TestNoInternalTypesExported fails if a type of an internal package
// appears in an exported declaration outside internal/: an importer could
// not name it.
func TestNoInternalTypesExported(t *testing.T) {
	fset := token.NewFileSet()
	for dir, files := range goFiles(t) {
		if layer(dir) == 0 || strings.HasPrefix(dir, "examples") {
			continue
		}
		for _, path := range files {
			f, err := parser.ParseFile(fset, path, nil, 0)
			if err != nil {
				t.Fatal(err)
			}
			var internal []string // local names of internal imports
			for _, imp := range f.Imports {
				ip, _ := strconv.Unquote(imp.Path.Value)
				if strings.Contains(ip, "/internal/") {
					name := ip[strings.LastIndex(ip, "/")+1:]
					if imp.Name != nil {
						name = imp.Name.Name
					}
					internal = append(internal, name)
				}
			}
			if len(internal) == 0 {
				continue
			}
			check := func(what string, n ast.Node) {
				if n == nil {
					return
				}
				ast.Inspect(n, func(x ast.Node) bool {
					if sel, ok := x.(*ast.SelectorExpr); ok {
						if id, ok := sel.X.(*ast.Ident); ok && slices.Contains(internal, id.Name) {
							t.Errorf("%s: %s uses the internal type %s.%s", fset.Position(sel.Pos()), what, id.Name, sel.Sel.Name)
						}
					}
					return true
				})
			}
			for _, decl := range f.Decls {
				switch d := decl.(type) {
				case *ast.FuncDecl:
					if !d.Name.IsExported() || d.Recv != nil && !exportedRecv(d.Recv) {
						continue
					}
					check(d.Name.Name, d.Type)
				case *ast.GenDecl:
					for _, spec := range d.Specs {
						switch s := spec.(type) {
						case *ast.TypeSpec:
							if !s.Name.IsExported() {
								continue
							}
							if st, ok := s.Type.(*ast.StructType); ok {
								for _, fld := range st.Fields.List {
									for _, n := range fld.Names {
										if n.IsExported() {
											check(s.Name.Name+"."+n.Name, fld.Type)
										}
									}
									if len(fld.Names) == 0 {
										check(s.Name.Name+" (embedded)", fld.Type)
									}
								}
								continue
							}
							check(s.Name.Name, s.Type)
						case *ast.ValueSpec:
							for _, n := range s.Names {
								if n.IsExported() {
									check(n.Name, s.Type)
								}
							}
						}
					}
				}
			}
		}
	}
}

func exportedRecv(fl *ast.FieldList) bool {
	if fl == nil || len(fl.List) == 0 {
		return false
	}
	typ := fl.List[0].Type
	if s, ok := typ.(*ast.StarExpr); ok {
		typ = s.X
	}
	if ix, ok := typ.(*ast.IndexExpr); ok {
		typ = ix.X
	}
	id, ok := typ.(*ast.Ident)
	return ok && id.IsExported()
}
