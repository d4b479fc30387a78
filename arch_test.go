package similis_test

import (
	"fmt"
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
// internal/ packages import none of the module. Within similarity, the
// fluids package lies below the similitude core, and the trade packages
// (trades) above it, side by side: a trade imports the core and fluids,
// never another trade, and the core imports no trade.
func layer(dir string) int {
	switch {
	case dir == "internal" || strings.HasPrefix(dir, "internal/"):
		return 0
	case dir == "quantity" || strings.HasPrefix(dir, "quantity/"):
		return 10
	case dir == "units" || strings.HasPrefix(dir, "units/"):
		return 20
	case dir == "pigroups" || strings.HasPrefix(dir, "pigroups/"):
		return 30
	case dir == "similarity/fluids" || strings.HasPrefix(dir, "similarity/fluids/"):
		return 40
	case dir == "similarity":
		return 41
	case tradeOf(dir) != "":
		return 42
	case dir == "similarity/reduction" || strings.HasPrefix(dir, "similarity/reduction/"):
		return 43 // the data-reduction pipeline: may call the core, fluids and the trades
	}
	return 50 // examples and the root package
}

// trades are the trade packages over the similitude core.
var trades = []string{"similarity/ship", "similarity/tunnel", "similarity/turbo", "similarity/hydraulic"}

// tradeOf returns the trade package dir lies in, or "".
func tradeOf(dir string) string {
	for _, t := range trades {
		if dir == t || strings.HasPrefix(dir, t+"/") {
			return t
		}
	}
	return ""
}

// examplesShared reports whether dir is an example command importing the
// examples' own shared package (examples/internal/...), which holds what
// every command does with its flags.
func examplesShared(dir, target string) bool {
	return strings.HasPrefix(dir, "examples/") && strings.HasPrefix(target, "examples/internal/")
}

// ownInternal reports whether target is an internal package of a parent
// of dir (units/chanfile/internal/filebase for units/chanfile/parquetfile):
// Go lets only that subtree import it, so it is a part of the parent,
// which dir may import.
func ownInternal(dir, target string) bool {
	parent, _, ok := strings.Cut(target, "/internal/")
	return ok && strings.HasPrefix(dir, parent+"/")
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
				if layer(dir) == 0 || layer(target) > layer(dir) || layer(target) == layer(dir) && !strings.HasPrefix(target, dir) && !strings.HasPrefix(dir, target) && !examplesShared(dir, target) && !ownInternal(dir, target) && !sameLayer[[2]string{dir, target}] {
					t.Errorf("%s imports %s: an upward or sideways import", path, ip)
				}
			}
		}
	}
}

// TestTradesIndependent fails if a trade package (its code or its tests)
// imports another trade, or the similitude core (code or tests) imports a
// trade: each trade stands on the core and fluids alone.
func TestTradesIndependent(t *testing.T) {
	fset := token.NewFileSet()
	err := filepath.WalkDir("similarity", func(path string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() || !strings.HasSuffix(path, ".go") {
			return err
		}
		dir := filepath.ToSlash(filepath.Dir(path))
		f, err := parser.ParseFile(fset, path, nil, parser.ImportsOnly)
		if err != nil {
			return err
		}
		for _, imp := range f.Imports {
			ip, _ := strconv.Unquote(imp.Path.Value)
			target := tradeOf(strings.TrimPrefix(ip, module+"/"))
			if !strings.HasPrefix(ip, module+"/") || target == "" {
				continue
			}
			if own := tradeOf(dir); own == "" && !strings.HasPrefix(dir, "similarity/fluids") || own != "" && own != target {
				t.Errorf("%s imports %s: a trade package is imported only from outside the similarity tree", path, ip)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
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
			for _, e := range internalExposed(fset, f) {
				t.Error(e)
			}
		}
	}
}

// TestInternalExposedCatches checks the checker itself on declarations
// that expose an internal type: a function result, a struct field (also
// of a nested struct), a typed and an untyped exported variable, and an
// exported constant; and that unexported ones pass.
func TestInternalExposedCatches(t *testing.T) {
	const src = `package p
import "similis.dev/similis/internal/dual"
func F() dual.Number { return dual.Number{} }
type T struct{ A dual.Number; B struct{ C dual.Number } }
var V dual.Number
var W = dual.Number{}
var X, Y = 1, dual.Number{}
const K = dual.Max
type u struct{ A dual.Number }
var w = dual.Number{}
func g() dual.Number { return dual.Number{} }
`
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "p.go", src, 0)
	if err != nil {
		t.Fatal(err)
	}
	got := internalExposed(fset, f)
	var names []string
	for _, e := range got {
		names = append(names, strings.Fields(e)[1])
	}
	want := []string{"F", "T.A", "T.B", "V", "W", "Y", "K"}
	if !slices.Equal(names, want) {
		t.Errorf("caught %q, want %q:\n%s", names, want, strings.Join(got, "\n"))
	}
}

// internalExposed returns, for each exported declaration of f that uses a
// type or value of an internal package, a line naming it: exported
// functions and methods of exported types (parameters and results),
// exported types and their exported fields, and exported variables and
// constants, by their type or, when it is not written, their value.
func internalExposed(fset *token.FileSet, f *ast.File) []string {
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
		return nil
	}
	var out []string
	check := func(what string, n ast.Node) {
		if n == nil {
			return
		}
		found := ""
		ast.Inspect(n, func(x ast.Node) bool {
			if sel, ok := x.(*ast.SelectorExpr); ok && found == "" {
				if id, ok := sel.X.(*ast.Ident); ok && slices.Contains(internal, id.Name) {
					found = fmt.Sprintf("%s: %s uses the internal %s.%s", fset.Position(sel.Pos()), what, id.Name, sel.Sel.Name)
				}
			}
			return found == ""
		})
		if found != "" {
			out = append(out, found)
		}
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
								check(s.Name.Name+"(embedded)", fld.Type)
							}
						}
						continue
					}
					check(s.Name.Name, s.Type)
				case *ast.ValueSpec:
					for i, n := range s.Names {
						if !n.IsExported() {
							continue
						}
						if s.Type != nil {
							check(n.Name, s.Type)
						} else if i < len(s.Values) {
							check(n.Name, s.Values[i])
						}
					}
				}
			}
		}
	}
	return out
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

// TestSentinelsUnique fails if two packages declare an exported sentinel
// error of the same name with different values (each its own
// errors.New): errors.Is against one would miss the other. A package that
// shares another's sentinel assigns that value instead.
func TestSentinelsUnique(t *testing.T) {
	fset := token.NewFileSet()
	seen := map[string]string{} // name → directory that made it with errors.New
	for dir, files := range goFiles(t) {
		for _, path := range files {
			f, err := parser.ParseFile(fset, path, nil, 0)
			if err != nil {
				t.Fatal(err)
			}
			for _, decl := range f.Decls {
				g, ok := decl.(*ast.GenDecl)
				if !ok || g.Tok != token.VAR {
					continue
				}
				for _, spec := range g.Specs {
					vs := spec.(*ast.ValueSpec)
					for i, n := range vs.Names {
						if !n.IsExported() || !strings.HasPrefix(n.Name, "Err") || i >= len(vs.Values) {
							continue
						}
						call, ok := vs.Values[i].(*ast.CallExpr)
						if !ok {
							continue
						}
						if sel, ok := call.Fun.(*ast.SelectorExpr); !ok || sel.Sel.Name != "New" {
							continue
						}
						if other, ok := seen[n.Name]; ok && other != dir {
							t.Errorf("%s and %s both make a sentinel %s of their own", other, dir, n.Name)
						}
						seen[n.Name] = dir
					}
				}
			}
		}
	}
}

// allowedDeps is DEVELOPERS.md's list of third-party modules with where
// each may be imported: by package directory (a prefix ending in "/"
// covers the subtree) and whether only test files may import it. An
// import of a module not listed, or from a directory not listed, fails
// TestDependenciesWhereListed, so the guide's list cannot drift from the
// code.
var allowedDeps = []struct {
	module   string
	dirs     []string
	testOnly bool
}{
	{"gonum.org/v1/gonum", []string{"quantity/fit", "quantity/uncertain", "pigroups", "similarity/ship", "similarity/tunnel", "similarity/hydraulic"}, false},
	{"github.com/parquet-go/parquet-go", []string{"units/chanfile/parquetfile"}, false},
	{"github.com/parquet-go/parquet-go", []string{"similarity/reduction", "examples/pisets"}, true},
	{"github.com/klauspost/compress", []string{"units/chanfile/parquetfile"}, false},
	{"gonum.org/v1/plot", []string{"examples/"}, false},
	{"github.com/schollz/progressbar/v3", []string{"examples/pisets"}, false},
	{"golang.org/x/term", []string{"examples/pisets"}, false},
	{"github.com/google/go-cmp", []string{"", "examples/", "internal/", "quantity/", "units/", "pigroups/", "similarity/", "quantity", "units", "pigroups", "similarity"}, true},
	{"pgregory.net/rapid", []string{"", "examples/", "internal/", "quantity/", "units/", "pigroups/", "similarity/", "quantity", "units", "pigroups", "similarity"}, true},
}

// depAllowed reports whether a file in dir (a test file or not) may
// import the third-party package ip.
func depAllowed(dir, ip string, test bool) bool {
	for _, a := range allowedDeps {
		if ip != a.module && !strings.HasPrefix(ip, a.module+"/") {
			continue
		}
		if a.testOnly && !test {
			continue
		}
		for _, d := range a.dirs {
			if dir == d || strings.HasSuffix(d, "/") && strings.HasPrefix(dir, d) || dir == "." && d == "" {
				return true
			}
		}
	}
	return false
}

// TestDependenciesWhereListed fails on a third-party import that
// DEVELOPERS.md's dependency list (allowedDeps) does not allow where it
// stands: a new module, a module used in a new package, or a test-only
// module imported by library code.
func TestDependenciesWhereListed(t *testing.T) {
	fset := token.NewFileSet()
	err := filepath.WalkDir(".", func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (strings.HasPrefix(d.Name(), ".") && path != "." || d.Name() == "testdata") {
			return filepath.SkipDir
		}
		if d.IsDir() || !strings.HasSuffix(path, ".go") {
			return nil
		}
		f, err := parser.ParseFile(fset, path, nil, parser.ImportsOnly)
		if err != nil {
			return err
		}
		dir := filepath.ToSlash(filepath.Dir(path))
		for _, imp := range f.Imports {
			ip, _ := strconv.Unquote(imp.Path.Value)
			first, _, _ := strings.Cut(ip, "/")
			if !strings.Contains(first, ".") || strings.HasPrefix(ip, module+"/") || ip == module {
				continue // the standard library, or the module itself
			}
			if !depAllowed(dir, ip, strings.HasSuffix(path, "_test.go")) {
				t.Errorf("%s imports %s, which DEVELOPERS.md's dependency list does not allow there", path, ip)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}

// TestDependencyRuleCatches shows the rule can fail: a library file may
// not import a test-only module, and plot is for the examples alone.
func TestDependencyRuleCatches(t *testing.T) {
	for _, c := range []struct {
		dir, ip string
		test    bool
		want    bool
	}{
		{"quantity", "pgregory.net/rapid", false, false},
		{"quantity", "pgregory.net/rapid", true, true},
		{"similarity/ship", "gonum.org/v1/plot/plotter", false, false},
		{"examples/towingtank", "gonum.org/v1/plot/plotter", false, true},
		{"units", "github.com/parquet-go/parquet-go", false, false},
		{"similarity/reduction", "github.com/parquet-go/parquet-go", false, false},
		{"similarity/reduction", "github.com/parquet-go/parquet-go", true, true},
		{".", "github.com/google/go-cmp/cmp", true, true},
		{"units", "example.com/new/module", false, false},
	} {
		if got := depAllowed(c.dir, c.ip, c.test); got != c.want {
			t.Errorf("depAllowed(%q, %q, test=%v) = %v, want %v", c.dir, c.ip, c.test, got, c.want)
		}
	}
}
