package similis_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"path/filepath"
	"strings"
	"testing"
)

// fieldUnits lists, by package directory, dimensional float fields whose
// doc must state their unit as "(unit)", so that no number in a result
// is read in the wrong unit.
var fieldUnits = map[string]map[string]string{
	"similarity/fluids": {
		"Water.Salinity": "(kg/kg)", // a dimensionless Quantity, a mass fraction
	},
	"similarity/hydraulic": {
		"RatingPoint.Head":      "(m)",
		"RatingPoint.Discharge": "(m³/s)",
		"RatingPoint.Velocity":  "(m/s)",
		"Rating.C":              "(m^(3−n)/s)",
		"Rating.HeadMin":        "(m)",
		"Rating.HeadMax":        "(m)",
		"Rating.ProtoC":         "(m^(3−n)/s)",
		"Rating.CrestLength":    "(m)",
		"Rating.Gravity":        "(m/s²)",
	},
	"similarity/ship": {
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
	},
	"similarity/tunnel": {
		"AxisLoads.Drag":       "(N)",
		"AxisLoads.Lift":       "(N)",
		"AxisLoads.Side":       "(N)",
		"AxisLoads.Roll":       "(N·m)",
		"AxisLoads.Pitch":      "(N·m)",
		"AxisLoads.Yaw":        "(N·m)",
		"WeightTare.Weight":    "(N)",
		"WeightTare.CG":        "(m)",
		"WeightTare.ForceRMS":  "(N)",
		"WeightTare.MomentRMS": "(N·m)",
		"ComponentRange.Min":   "(N for a force, N·m for a",
		"Attitude.PitchDeg":    "(degrees)",
		"Attitude.RollDeg":     "(degrees)",
	},
	"similarity/turbo": {
		"Verdict.HeadBar":              "(m)",
		"Verdict.FlowBar":              "(m³/s)",
		"Verdict.FlowAtGuaranteeHead":  "(m³/s)",
		"Verdict.HeadCrossing":         "(m³/s)",
		"Verdict.Intersection":         "(m³/s)",
		"Verdict.PowerMax":             "(W)",
		"SpecificSpeeds.Metric":        "(rpm, m³/s, m)",
		"SpecificSpeeds.US":            "(rpm, US gpm, ft)",
		"SpecificSpeeds.Dimensionless": "(dimensionless",
	},
}

// fieldDocs returns the doc text (the comment above and the one beside)
// of every field of the exported structs of the package in dir, by
// "Type.Field".
func fieldDocs(t *testing.T, dir string) map[string]string {
	t.Helper()
	fs := token.NewFileSet()
	names, err := filepath.Glob(filepath.Join(dir, "*.go"))
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

// TestFieldUnitsStated: each listed field exists and its doc states its
// unit.
func TestFieldUnitsStated(t *testing.T) {
	for dir, fields := range fieldUnits {
		docs := fieldDocs(t, dir)
		for field, unit := range fields {
			doc, ok := docs[field]
			if !ok {
				t.Errorf("%s: %s: no such field", dir, field)
				continue
			}
			if !strings.Contains(doc, unit) {
				t.Errorf("%s: %s: doc %q does not state %s", dir, field, strings.TrimSpace(doc), unit)
			}
		}
	}
}
