package ship_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"path/filepath"
	"strings"
	"testing"
)

// fieldDocs returns the doc text (the comment above and the one beside)
// of every field of the package's exported structs, by "Type.Field".
func fieldDocs(t *testing.T) map[string]string {
	t.Helper()
	fs := token.NewFileSet()
	names, err := filepath.Glob("*.go")
	if err != nil {
		t.Fatal(err)
	}
	docs := map[string]string{}
	for _, name := range names {
		if strings.HasSuffix(name, "_test.go") {
			continue
		}
		f, err := parser.ParseFile(fs, name, nil, parser.ParseComments)
		if err != nil {
			t.Fatal(err)
		}
		ast.Inspect(f, func(n ast.Node) bool {
			ts, ok := n.(*ast.TypeSpec)
			if !ok {
				return true
			}
			st, ok := ts.Type.(*ast.StructType)
			if !ok {
				return false
			}
			for _, fl := range st.Fields.List {
				for _, nm := range fl.Names {
					docs[ts.Name.Name+"."+nm.Name] = fl.Doc.Text() + " " + fl.Comment.Text()
				}
			}
			return false
		})
	}
	return docs
}

// TestFieldUnitsStated: each dimensional float field states its unit as
// "(unit)" on its own doc, so that no number in a result is read in the
// wrong unit.
func TestFieldUnitsStated(t *testing.T) {
	docs := fieldDocs(t)
	for field, unit := range map[string]string{
		"ResistanceFit.Density":             "(kg/m³)",
		"ResistanceFit.WettedArea":          "(m²)",
		"SelfPropulsionPoint.ModelSpeed":    "(m/s)",
		"SelfPropulsionPoint.RevsPerSecond": "(rev/s)",
		"SelfPropulsionPoint.Resistance":    "(N)",
		"SelfPropulsionPoint.TowingForce":   "(N)",
		"OpenWaterFit.Chord":                "(m)",
		"OpenWaterFit.Viscosity":            "(m²/s)",
		"SpeedPowerPoint.PowerU":            "(W)",
		"SpeedPowerPoint.RevsU":             "(rev/s)",
		"SpeedPowerPoint.Power":             "(W)",
		"SpeedPowerPoint.Revs":              "(rev/s)",
		"PoweringResult.RevsPerSecond":      "(rev/s)",
		"PoweringResult.RPM":                "(rev/min)",
	} {
		doc, ok := docs[field]
		if !ok {
			t.Errorf("%s: no such field", field)
			continue
		}
		if !strings.Contains(doc, unit) {
			t.Errorf("%s: doc %q does not state %s", field, strings.TrimSpace(doc), unit)
		}
	}
}
