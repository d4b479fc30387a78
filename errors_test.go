package similis_test

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
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
		{"ExtrapolateHull", one(ship.ExtrapolateHull(ship.HullTest{})), "invalid"},
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

// TestErrorVocabularyWrapped: errors that wrap another (a value whose unit
// does not parse, a definition whose expression does not, a data-sheet
// reading, a flag's check, a plan's report unit) match exactly one class,
// and errors.As reaches the typed error inside.
func TestErrorVocabularyWrapped(t *testing.T) {
	classes := map[string]error{
		"dimension": quantity.ErrDimension, "range": quantity.ErrRange, "parse": quantity.ErrParse,
		"unknown": quantity.ErrUnknown, "invalid": quantity.ErrInvalid, "conflict": similarity.ErrConflict,
	}
	one := func(_ any, err error) error { return err }
	two := func(_, _ any, err error) error { return err }
	flow := units.NewFlag(quantity.VolumeFlowRate, units.MustParseValue("1 L/s"))
	level := units.NewFlag(quantity.Temperature, units.MustParseValue("20 °C"))
	fr, _ := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	var dst quantity.Series
	p := pigroups.MustProblem(pigroups.Dep("R", quantity.Force), pigroups.Var("V", quantity.Velocity),
		pigroups.Var("L", quantity.Length), pigroups.Var("g", quantity.Acceleration), pigroups.Var("rho", quantity.Density))
	sol, err := similarity.NewPlan(p).HoldExps("Fr", map[string]int{"V": 2, "g": -1, "L": -1}).
		SameGravity("g").Fix("L", 0.04).Same("the same fluid", "rho").Basis("V", "L", "rho").Solve()
	if err != nil {
		t.Fatal(err)
	}
	proto := map[string]quantity.Quantity{"V": quantity.New(5, quantity.Velocity)}
	other := pigroups.MustProblem(pigroups.Var("a", quantity.Length), pigroups.Var("b", quantity.Length))
	oset, err := other.PiSet("a")
	if err != nil {
		t.Fatal(err)
	}
	foreign := oset.Groups()
	var (
		parseErr  *units.Error
		dimErr    *quantity.Error
		convErr   *units.Error
		planErr   *similarity.PlanError
		rangeErr  *units.Error
		ratErr    *quantity.Error
		defineErr *units.Error
		valueErr  *units.Error
	)
	cases := []struct {
		name  string
		err   error
		class string
		inner any // a pointer to the typed error errors.As must reach
	}{
		{"ParseValue unknown unit", one(units.ParseValue("3 furlongs")), "unknown", &parseErr},
		{"ParseValue bad unit", one(units.ParseValue("3 m^")), "parse", &parseErr},
		{"ParseValue number", one(units.ParseValue("3..2 m")), "parse", &valueErr},
		{"ParseDialect syntax", two(units.ParseDialect("m^^2")), "parse", &parseErr},
		{"ParseDialect exponent", two(units.ParseDialect("hr^99")), "parse", &parseErr},
		{"ParseDialect unknown", two(units.ParseDialect("furlongs/hr")), "unknown", &parseErr},
		{"Define unparsable", units.NewTable().Define("div", "0.25 inH2O^"), "parse", &parseErr},
		{"Define unknown", units.NewTable().Define("div", "0.25 furlongs"), "unknown", &parseErr},
		{"Define taken", units.NewTable().Define("m", "s"), "invalid", &defineErr},
		{"Flag dimension", flow.Set("1.2 m/s"), "dimension", &dimErr},
		{"Flag text dimension", flow.UnmarshalText([]byte("1.2 m/s")), "dimension", &dimErr},
		{"Flag text unknown", flow.UnmarshalText([]byte("1.2 furlongs")), "unknown", &parseErr},
		{"Flag temperature difference", level.UnmarshalText([]byte("20 Δ°C")), "invalid", &convErr},
		{"Unit.Pow exponent", one(units.MustParse("%").Pow(62, 1)), "range", &rangeErr},
		{"Rat MinInt64", one(quantity.RatInt(-1 << 62).Add(quantity.RatInt(-1 << 62))), "range", &ratErr},
		{"Ratio unknown", one(fr.Ratio("nope")), "unknown", &planErr},
		{"SetPoints unit", one(sol.SetPoints(proto, map[string]string{"V": "furlongs"})), "unknown", &parseErr},
		{"SetPoints dimension", one(sol.SetPoints(map[string]quantity.Quantity{"V": quantity.New(5, quantity.Length)}, nil)), "dimension", &dimErr},
		{"SeriesToPrototype nil", sol.SeriesToPrototype(nil, dst), "invalid", &planErr},
		{"NewReport nothing", one(similarity.NewReport(nil, similarity.ReportOptions{})), "invalid", &planErr},
		{"NewReport unit", one(similarity.NewReport(sol, similarity.ReportOptions{Prototype: proto, Units: map[string]string{"V": "kn^"}})), "parse", &parseErr},
		{"HoldExps MinInt64", one(similarity.NewPlan(p).HoldExps("x", map[string]int{"V": math.MinInt64}).Solve()), "range", &ratErr},
		{"Plan conflict", one(similarity.NewPlan(p).HoldExps("Fr", map[string]int{"V": 2, "g": -1, "L": -1}).
			SameGravity("g").Fix("L", 0.04).Fix("V", 0.5).Solve()), "conflict", &planErr},
		{"Table.Parse unknown", one(units.NewTable().Parse("div/s")), "unknown", &parseErr},
		{"Table.ParseValue unit", one(units.NewTable().ParseValue("3 m^")), "parse", &parseErr},
		{"ParseGauge unknown unit", one(units.ParseGauge("40 furlong(g)")), "unknown", &parseErr},
		{"ParseGauge number", one(units.ParseGauge("4..0 kPa(g)")), "parse", &valueErr},
		{"Printer.FormatIn", one(units.Printer{}.FormatIn(quantity.New(1, quantity.Force), units.MustParse("Pa"))), "dimension", &convErr},
		{"Unit.Mul exponent", one(units.MustParse("%^20").Mul(units.MustParse("%^20"))), "range", &rangeErr},
		{"Unit.Mul dimension", one(units.MustParse("m^20").Mul(units.MustParse("m^20"))), "dimension", &dimErr},
		{"With unknown", one(sol.With(map[string]float64{"nope": 1})), "unknown", &planErr},
		{"With bad ratio", one(fr.With(map[string]float64{"L": -1})), "range", &planErr},
		{"VariableToPrototype dimension", one(sol.VariableToPrototype("V", quantity.New(1, quantity.Force))), "dimension", &dimErr},
		{"DerivedRatio current", one(sol.DerivedRatio(quantity.Current)), "unknown", &planErr},
		{"NewReport foreign group", one(similarity.NewReport(sol, similarity.ReportOptions{Groups: foreign})), "invalid", &planErr},
		{"Compromise foreign group", one(similarity.NewPlan(p).Fix("L", 0.04).Compromise(nil, similarity.Priority{Group: foreign[0]})), "invalid", &planErr},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		var matched []string
		for name, cl := range classes {
			if errors.Is(c.err, cl) {
				matched = append(matched, name)
			}
		}
		if len(matched) != 1 || matched[0] != c.class {
			t.Errorf("%s: %v (%T) matches %v, want only %s", c.name, c.err, c.err, matched, c.class)
		}
		if !errors.As(c.err, c.inner) {
			t.Errorf("%s: errors.As does not reach %T in %v (%T)", c.name, c.inner, c.err, c.err)
		} else if qe, ok := c.inner.(**quantity.Error); ok && c.class == "dimension" && (*qe).Class != quantity.ErrDimension {
			t.Errorf("%s: the *quantity.Error reached is of class %v, want ErrDimension", c.name, (*qe).Class)
		}
	}
}
