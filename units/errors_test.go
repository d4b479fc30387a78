package units_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// classesOf returns the module's error classes err matches.
func classesOf(err error) []error {
	var cl []error
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			cl = append(cl, c)
		}
	}
	return cl
}

// TestErrorsOneType: every error the package returns — reading a unit or
// a value, converting, a number out of range, a gauge pressure, a
// definition — is a *units.Error matching its Kind and exactly one class
// of the module, also when wrapped again; a cause is kept for errors.Is
// and errors.As, not copied into the reason; the fields a caller reads
// (Op, Offset, Symbol, Suggest, From and To) are on the outer error.
func TestErrorsOneType(t *testing.T) {
	one := func(_ any, err error) error { return err }
	two := func(_, _ any, err error) error { return err }
	m, s := units.MustParse("m"), units.MustParse("s")
	tab := units.NewTable()
	isDim := func(e *units.Error) bool {
		var d *quantity.Error
		return errors.As(e, &d) && d.Class == quantity.ErrDimension
	}
	for _, c := range []struct {
		name  string
		err   error
		op    string
		kind  error
		class error
		check func(e *units.Error) bool // the fields a caller reads, if any
	}{
		{"Parse syntax", one(units.Parse("m^")), units.OpParse, units.ErrDangling, quantity.ErrParse, nil},
		{"Parse unknown", one(units.Parse("kgg")), units.OpParse, units.ErrUnknownSymbol, quantity.ErrUnknown,
			func(e *units.Error) bool { return e.Symbol == "kgg" && len(e.Suggest) > 0 }},
		{"Parse too long", one(units.Parse(strings.Repeat("m*", units.MaxExprLen))), units.OpParse, units.ErrTooLong, quantity.ErrParse, nil},
		{"Parse exponent out of range", one(units.Parse("%^20*%^20")), units.OpParse, units.ErrExponent, quantity.ErrParse, nil},
		{"ParseDialect unknown", two(units.ParseDialect("furlongs/hr")), units.OpParse, units.ErrUnknownSymbol, quantity.ErrUnknown,
			func(e *units.Error) bool {
				var in *units.Error
				return errors.As(e.Err, &in) && in.Symbol == "furlongs"
			}},
		{"ParseDialect gauge", two(units.ParseDialect("kPa(g)")), units.OpParse, units.ErrGauge, quantity.ErrParse, nil},
		{"ParseValue number", one(units.ParseValue("3..2 m")), units.OpParseValue, nil, quantity.ErrParse, nil},
		{"ParseValue unknown unit", one(units.ParseValue("12 knots")), units.OpParseValue, units.ErrUnknownSymbol, quantity.ErrUnknown,
			func(e *units.Error) bool { return e.Symbol == "knots" && e.Offset == 3 }},
		{"ParseValue gauge", one(units.ParseValue("40 kPa(g)")), units.OpParseValue, units.ErrGauge, quantity.ErrParse, nil},
		{"Convert dimensions", one(units.ConvertUnits(1, m, s)), units.OpConvert, units.ErrIncompatible, quantity.ErrDimension,
			func(e *units.Error) bool { return e.From.Equal(m) && e.To.Equal(s) }},
		{"Convert temperature", one(units.Convert(1, "degC", "degF_diff")), units.OpConvert, units.ErrTemperature, quantity.ErrInvalid, nil},
		{"Convert angle", one(units.Convert(1, "rad/s", "Hz")), units.OpConvert, units.ErrAngle, quantity.ErrInvalid, nil},
		{"Convert not finite", one(units.ConvertUnits(math.Inf(1), m, m)), units.OpConvert, nil, quantity.ErrRange, nil},
		{"Mul exponent", one(units.MustParse("%^20").Mul(units.MustParse("%^20"))), "multiply units", nil, quantity.ErrRange, nil},
		{"Pow exponent", one(units.MustParse("%").Pow(62, 1)), "raise a unit to a power", nil, quantity.ErrRange, nil},
		{"Pow dimension", one(m.Pow(62, 1)), "raise a unit to a power", nil, quantity.ErrDimension,
			isDim},
		{"Mul dimension", one(units.MustParse("m^20").Mul(units.MustParse("m^20"))), "multiply units", nil, quantity.ErrDimension, nil},
		{"Flag dimension", units.NewFlag(quantity.VolumeFlowRate, units.MustParseValue("1 L/s")).Set("1.2 m/s"), units.OpSetFlag, nil, quantity.ErrDimension,
			isDim},
		{"ValueOf dimension", one(s.ValueOf(quantity.New(1, quantity.Length))), units.OpConvert, units.ErrIncompatible, quantity.ErrDimension, nil},
		{"Gauge reference", one(units.MustParseGauge("40 kPa(g)").Absolute(quantity.New(1, quantity.Length))), units.OpGauge, units.ErrGauge, quantity.ErrInvalid, nil},
		{"GaugeOf below vacuum", one(units.GaugeOf(quantity.New(-1, quantity.Pressure), units.StandardReference(), units.MustParse("kPa"))), units.OpGauge, units.ErrGauge, quantity.ErrInvalid, nil},
		{"Gauge value text", one(units.ParseGauge("4..0 kPa(g)")), units.OpParseValue, nil, quantity.ErrParse, nil},
		{"Value text not finite", one(units.Value{Number: math.NaN(), Unit: m}.MarshalText()), units.OpFormat, nil, quantity.ErrInvalid, nil},
		{"Define taken", tab.Define("m", "s"), units.OpDefine, units.ErrDefine, quantity.ErrInvalid, nil},
		{"Define unparsable", tab.Define("div", "0.25 inH2O^"), units.OpDefine, units.ErrDefine, quantity.ErrParse, nil},
		{"Define unknown", tab.Define("div", "0.25 furlongs"), units.OpDefine, units.ErrDefine, quantity.ErrUnknown, nil},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		for _, err := range []error{c.err, fmt.Errorf("run 7: %w", c.err)} {
			var e *units.Error
			if !errors.As(err, &e) {
				t.Errorf("%s: %T is not a *units.Error", c.name, err)
				continue
			}
			if e.Op != c.op {
				t.Errorf("%s: Op %q, want %q", c.name, e.Op, c.op)
			}
			if cl := classesOf(err); len(cl) != 1 || cl[0] != c.class {
				t.Errorf("%s: %v matches %v, want %v alone", c.name, err, cl, c.class)
			}
			if c.kind != nil && !errors.Is(err, c.kind) {
				t.Errorf("%s: %v is not %v", c.name, err, c.kind)
			}
			if c.check != nil && !c.check(e) {
				t.Errorf("%s: fields of %#v", c.name, e)
			}
			if e.Err != nil && strings.Contains(e.Reason, e.Err.Error()) {
				t.Errorf("%s: the reason %q repeats the cause as text", c.name, e.Reason)
			}
		}
	}
}
