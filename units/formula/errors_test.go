package formula_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/formula"
)

// TestErrorsOneClass: every error of the package — compiling, evaluating,
// checked evaluation — matches exactly one class of the module under
// errors.Is, also when wrapped again by a caller, and keeps its cause for
// errors.As.
func TestErrorsOneClass(t *testing.T) {
	ins := []formula.Input{in("p", quantity.Pressure), in("V", quantity.Velocity), in("D", quantity.Length)}
	compile := func(src string) error { _, err := formula.Compile(src, ins...); return err }
	prog, err := formula.Compile("r = D/V", ins...)
	if err != nil {
		t.Fatal(err)
	}
	row := []float64{1e5, 0, 2}
	asForm := func(err error) bool { var e *formula.Error; return errors.As(err, &e) }
	asUnit := func(err error) bool { var e *units.Error; return errors.As(err, &e) }
	asDim := func(err error) bool {
		var e *quantity.Error
		return errors.As(err, &e) && e.Class == quantity.ErrDimension
	}
	asEval := func(err error) bool {
		var e *formula.Error
		return errors.As(err, &e) && e.Op == formula.OpEvaluate && e.Row == -1
	}
	asRange := func(err error) bool { var e *formula.Error; return errors.As(err, &e) && e.Op == formula.OpCheck }
	cases := []struct {
		name  string
		err   error
		class error
		as    []func(error) bool
	}{
		{"syntax", compile("p +"), quantity.ErrParse, nil},
		{"bracket", compile("2 [m]"), quantity.ErrParse, nil},
		{"dimension", compile("p + V"), quantity.ErrDimension, nil},
		{"unknown name", compile("q * 2"), quantity.ErrUnknown, nil},
		{"unknown function", compile("foo(p)"), quantity.ErrUnknown, nil},
		{"unknown unit", compile("2 {furlong} + D"), quantity.ErrUnknown, []func(error) bool{asUnit}},
		{"bad unit", compile("2 {m/} + D"), quantity.ErrParse, []func(error) bool{asUnit}},
		{"gauge unit", compile("2 {kPa(g)} + p"), quantity.ErrParse, []func(error) bool{asUnit}},
		{"exponent overflow", compile(strings.Repeat("D*", 21) + "D"), quantity.ErrDimension, []func(error) bool{asDim}},
		{"number out of range", compile("1e999"), quantity.ErrRange, nil},
		{"too deep", compile(strings.Repeat("(", 80) + "1" + strings.Repeat(")", 80)), quantity.ErrRange, nil},
		{"defined twice", compile("p = 2 {Pa}"), quantity.ErrInvalid, nil},
		{"input twice", func() error { _, err := formula.Compile("p", in("p", 0), in("p", 0)); return err }(), quantity.ErrInvalid, nil},
	}
	for i := range cases[:13] {
		cases[i].as = append(cases[i].as, func(err error) bool {
			var e *formula.Error
			return errors.As(err, &e) && e.Op == formula.OpCompile && e.Row == -1
		})
	}
	ev := prog.Evaluator()
	_, errCount := ev.Row(row[:2], make([]float64, 1))
	_, errRowQ := ev.RowQ([]quantity.Quantity{quantity.New(1, quantity.Pressure), quantity.New(1, quantity.Length), quantity.New(1, quantity.Length)}, make([]quantity.Quantity, 1))
	col := func(x float64, d quantity.Dim) quantity.Series { return quantity.NewSeries([]float64{x, x}, d) }
	errSeriesDim := ev.Series([]quantity.Series{col(1, quantity.Pressure), col(1, quantity.Pressure), col(1, quantity.Length)}, [][]float64{make([]float64, 2)})
	errSeriesLen := ev.Series([]quantity.Series{col(1, quantity.Pressure), col(1, quantity.Velocity), quantity.NewSeries([]float64{1}, quantity.Length)}, [][]float64{make([]float64, 2)})
	_, errRange := ev.Row(row, make([]float64, 1))
	errSeriesRange := ev.Series([]quantity.Series{col(1, quantity.Pressure), col(0, quantity.Velocity), col(1, quantity.Length)}, [][]float64{make([]float64, 2)})
	errGrad := ev.Gradient(row, make([]float64, 1), [][]float64{make([]float64, 3)})
	cases = append(cases, []struct {
		name  string
		err   error
		class error
		as    []func(error) bool
	}{
		{"row count", errCount, quantity.ErrInvalid, []func(error) bool{asEval}},
		{"RowQ dimension", errRowQ, quantity.ErrDimension, []func(error) bool{asEval, asDim}},
		{"Series dimension", errSeriesDim, quantity.ErrDimension, []func(error) bool{asEval, asDim}},
		{"Series length", errSeriesLen, quantity.ErrInvalid, []func(error) bool{asEval}},
		{"Row not finite", errRange, quantity.ErrRange, []func(error) bool{asRange}},
		{"Series not finite", errSeriesRange, quantity.ErrRange, []func(error) bool{asRange}},
		{"Gradient not finite", errGrad, quantity.ErrRange, []func(error) bool{asRange}},
	}...)
	for _, c := range cases {
		c.as = append(c.as, asForm) // the package's one error type
		var fe *formula.Error
		if errors.As(c.err, &fe) && fe.Err != nil && strings.Contains(fe.Reason, fe.Err.Error()) {
			t.Errorf("%s: the reason %q repeats the cause as text", c.name, fe.Reason)
		}
		for _, err := range []error{c.err, fmt.Errorf("reading run 7: %w", c.err)} {
			if cl := classesOf(err); len(cl) != 1 || cl[0] != c.class {
				t.Errorf("%s: %v matches %v, want %v alone", c.name, err, cl, c.class)
			}
			for k, as := range c.as {
				if !as(err) {
					t.Errorf("%s: %v: errors.As %d finds no cause", c.name, err, k)
				}
			}
		}
	}
}
