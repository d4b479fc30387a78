package similis_test

import (
	"errors"
	"reflect"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

// TestErrorVocabulary: every error a sample of entry points returns is a
// typed error of the module (never a bare string error), matches exactly
// one of the module's classes under errors.Is, and says what it is about.
func TestErrorVocabulary(t *testing.T) {
	classes := map[string]error{
		"dimension": quantity.ErrDimension, "range": quantity.ErrRange, "parse": quantity.ErrParse,
		"unknown": quantity.ErrUnknown, "invalid": quantity.ErrInvalid, "conflict": similarity.ErrConflict,
	}
	p := pigroups.MustProblem(pigroups.Dep("F", quantity.Force), pigroups.Var("ρ", quantity.Density),
		pigroups.Var("V", quantity.Velocity), pigroups.Var("D", quantity.Length), pigroups.Var("μ", quantity.DynamicViscosity))
	s, _ := p.PiSet("ρ", "V", "D")
	one := func(_ any, err error) error { return err }
	cases := []struct {
		name  string
		err   error
		class string
	}{
		{"ParseDim", one(quantity.ParseDim("L^x")), "parse"},
		{"ParseRat", one(quantity.ParseRat("1/")), "parse"},
		{"Rat overflow", one(quantity.RatInt(1 << 62).Mul(quantity.RatInt(8))), "range"},
		{"Check", quantity.New(1, quantity.Length).Check(quantity.Time), "dimension"},
		{"Parse syntax", one(units.Parse("m^")), "parse"},
		{"Parse unknown", one(units.Parse("furlongs")), "unknown"},
		{"ParseValue", one(units.ParseValue("101 325 Pa")), "parse"},
		{"Convert dimensions", one(units.Convert(1, "m", "s")), "dimension"},
		{"Convert angle", one(units.Convert(1, "rpm", "Hz")), "invalid"},
		{"Convert overflow", one(units.Convert(1e308, "km", "m")), "range"},
		{"Unit.Pow", one(units.MustParse("m").Pow(1, 4)), "dimension"}, // L^(1/4) cannot be held
		{"Unit.Pow factor", one(units.MustParse("Qm").Pow(11, 1)), "range"},
		{"Define", units.NewTable().Define("m", "s"), "invalid"},
		{"NewProblem", one(pigroups.NewProblem()), "invalid"},
		{"VarUnit", one(pigroups.VarUnit("x", "furlongs")), "unknown"},
		{"Kinds", one(p.Kinds(9)), "unknown"},
		{"PiSet", one(p.PiSet("ρ", "V")), "invalid"},
		{"PiSet unknown", one(p.PiSet("ρ", "V", "Q")), "unknown"},
		{"Coefficient", one(s.Groups()[0].Coefficient()), "invalid"},
		{"Evaluator", one(s.Evaluator().Row(nil, nil)), "invalid"},
		{"FitPowerLaw", one(pigroups.FitPowerLaw([]float64{1}, nil, nil)), "invalid"},
		{"Froude", one(similarity.Froude(similarity.Scales{Length: -1, Density: 1})), "range"},
		{"Plan unknown", one(similarity.NewPlan(p).Fix("L", 0.1).Solve()), "unknown"},
		{"Plan conflict", one(similarity.NewPlan(p).HoldExps("Re", map[string]int{"ρ": 1, "V": 1, "D": 1, "μ": -1}).
			Same("the same fluid", "ρ", "μ").Fix("V", 0.5).Fix("D", 0.5).Solve()), "conflict"},
		{"ExtrapolateHull", one(similarity.ExtrapolateHull(similarity.HullTest{})), "invalid"},
		{"Water", one(fluids.FreshWater().AtCelsius(99)), "range"},
		{"StandardAtmosphere", one(fluids.StandardAtmosphere(quantity.New(1, quantity.Time), fluids.Geometric)), "dimension"},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		tn := reflect.TypeOf(c.err).String()
		if !strings.HasPrefix(tn, "*") || !strings.HasSuffix(tn, "Error") || strings.HasPrefix(tn, "*fmt.") || strings.HasPrefix(tn, "*errors.") {
			t.Errorf("%s: %s is not a typed error of the module: %v", c.name, tn, c.err)
		}
		var matched []string
		for name, cl := range classes {
			if errors.Is(c.err, cl) {
				matched = append(matched, name)
			}
		}
		if len(matched) != 1 || matched[0] != c.class {
			t.Errorf("%s: %v (%s) matches %v, want only %s", c.name, c.err, tn, matched, c.class)
		}
	}
}
