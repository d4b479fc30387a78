package steady_test

import (
	"errors"
	"io"
	"math"
	"os"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

func mVV(v float64) quantity.Quantity { return quantity.New(v*1e-3, quantity.Dimensionless) }

func TestPolynomial(t *testing.T) {
	c := readCal(t, "drag.cal")
	if c.Name != "drag" || c.Lo != -0.5 || c.Hi != 2 || c.U != 0.15 || c.IsTable() {
		t.Errorf("%+v", c)
	}
	// c1 was written 0.2 kN/(mV/V): 200 N/(mV/V).
	if d := cmp.Diff([]float64{0, 200, 5}, c.Coefficients(), cmp.Comparer(func(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(b) })); d != "" {
		t.Errorf("coefficients (-want +got)\n%s", d)
	}
	// At 1 mV/V: F = 200·1 + 5·1² = 205 N; dF/dx = 200 + 2·5·1 = 210
	// N/(mV/V) = 210 000 N per unit of the dimensionless ratio.
	f, s, err := c.Eval(mVV(1))
	if err != nil {
		t.Fatal(err)
	}
	if !f.ApproxEqual(quantity.New(205, quantity.Force), 1e-12) || !s.ApproxEqual(quantity.New(210000, quantity.Force), 1e-12) {
		t.Errorf("F = %v, slope %v; want 205 N, 210000 N", f, s)
	}
	_, _, err = c.Eval(mVV(2.5))
	oneClass(t, err, quantity.ErrRange)
	_, _, err = c.Eval(quantity.New(1, quantity.Voltage))
	oneClass(t, err, quantity.ErrDimension)
}

func TestTable(t *testing.T) {
	c := readCal(t, "speed.cal")
	if !c.IsTable() || c.Lo != -0.5 || c.Hi != 5 {
		t.Errorf("%+v", c)
	}
	for _, tc := range []struct{ v, speed, slope float64 }{
		{2.5, 1.26, 0.52},  // 1.0 + 0.5·(1.52 − 1.0)
		{4.2, 2.16, 0.55},  // 2.05 + 0.2·(2.6 − 2.05)
		{-0.5, -0.25, 0.5}, // the first row
		{5, 2.6, 0.55},     // the last row
		{0.25, 0.125, 0.5}, // 0 + 0.25·0.5
		{3, 1.52, 0.53},    // a row: the segment above it
	} {
		f, s, err := c.Eval(quantity.New(tc.v, quantity.Voltage))
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(f.Value()-tc.speed) > 1e-12 || math.Abs(s.Value()-tc.slope) > 1e-12 || f.Dim() != quantity.Velocity {
			t.Errorf("%v V: %v, slope %v; want %v m/s, %v", tc.v, f, s, tc.speed, tc.slope)
		}
	}
}

// TestMeasured: a mean carried through the polynomial gets the slope
// times its own uncertainty and the calibration's systematic source.
func TestMeasured(t *testing.T) {
	c := readCal(t, "drag.cal")
	set := uncertain.NewSet()
	rep := set.MustAdd(uncertain.Source{Name: "rep", U: mVV(0.001), Type: uncertain.TypeA, DoF: 50})
	x := set.MustMeasure(mVV(0.5), rep)
	f, err := c.Measured(set, "drag", x)
	if err != nil {
		t.Fatal(err)
	}
	// F = 200·0.5 + 5·0.25 = 101.25 N; dF/dx = 205 N/(mV/V), so the
	// repeatability gives 205·0.001 = 0.205 N and the calibration 0.15 N:
	// u = √(0.205² + 0.15²) = 0.254018 N.
	if math.Abs(f.Value()-101.25) > 1e-9 || math.Abs(f.U().Value()-0.254018) > 1e-6 {
		t.Errorf("F = %v, want 101.25 N ± 0.254018 N", f)
	}
	b, err := f.Budget("F", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	if got := b.Systematic.Value(); math.Abs(got-0.15) > 1e-12 {
		t.Errorf("systematic part %v, want 0.15 N", got)
	}
	// Out of range: the mean named, the channel too.
	_, err = c.Measured(set, "Fx", set.MustMeasure(mVV(-0.6), rep))
	var re *steady.RangeError
	if !errors.As(err, &re) || re.Channel != "Fx" || re.Row != -1 {
		t.Errorf("%v: want a *RangeError on channel Fx for a mean", err)
	}
	oneClass(t, err, quantity.ErrRange)
}

func TestParseCalibrationErrors(t *testing.T) {
	const head = "name d\nraw mV/V\nengineering N\nuncertainty 0.1\n"
	for _, tc := range []struct {
		name, text string
		line       int
		class      error
	}{
		{"unknown keyword", head + "range 0 1\nc1 2\ngain 3\n", 7, quantity.ErrParse},
		{"given twice", head + "raw V\n", 5, quantity.ErrParse},
		{"no raw", "name d\nengineering N\nuncertainty 0.1\nrange 0 1\nc1 2\n", 0, quantity.ErrParse},
		{"unknown unit", "name d\nraw mV/V\nengineering Nwt\n", 3, quantity.ErrUnknown},
		{"coefficient unit of another kind", head + "range 0 1\nc1 2 m/(mV/V)\n", 6, quantity.ErrDimension},
		{"coefficient before units", "name d\nc1 2 N\n", 2, quantity.ErrParse},
		{"not a number", head + "range 0 x\n", 5, quantity.ErrParse},
		{"NaN", head + "range 0 1\nc1 NaN\n", 6, quantity.ErrParse},
		{"infinite", head + "range 0 1\nc1 1e999\n", 6, quantity.ErrParse},
		{"reversed range", head + "range 1 0\n", 5, quantity.ErrParse},
		{"negative uncertainty", "uncertainty -1\n", 1, quantity.ErrParse},
		{"c10", head + "range 0 1\nc10 1\n", 6, quantity.ErrParse},
		{"c01", head + "range 0 1\nc01 1\n", 6, quantity.ErrParse},
		{"no range", head + "c1 2\n", 0, quantity.ErrParse},
		{"not monotone", head + "range -1 1\nc2 1\nc1 0.5\n", 7, quantity.ErrParse},
		{"table overflows", head + "point 0 1e308\npoint 1 -1e308\n", 0, quantity.ErrRange},
		{"constant", head + "range -1 1\nc0 1\n", 0, quantity.ErrParse},
		{"both kinds", head + "range 0 1\nc1 2\npoint 0 0\npoint 1 1\n", 7, quantity.ErrParse},
		{"table with range", head + "range 0 1\npoint 0 0\npoint 1 1\n", 5, quantity.ErrParse},
		{"one row", head + "point 0 0\n", 5, quantity.ErrParse},
		{"raw not increasing", head + "point 0 0\npoint 1 1\npoint 1 2\n", 0, quantity.ErrParse},
		{"engineering not monotone", head + "point 0 0\npoint 1 1\npoint 2 0.5\n", 0, quantity.ErrParse},
		{"engineering flat", head + "point 0 0\npoint 1 1\npoint 2 1\n", 0, quantity.ErrParse},
		{"long line", head + "# " + strings.Repeat("x", steady.MaxCalLine) + "\n", 5, quantity.ErrParse},
		{"not UTF-8", head + "name \xff\n", 5, quantity.ErrParse},
		{"empty name", "name   # none\nraw V\nengineering N\nuncertainty 0\npoint 0 0\npoint 1 1\n", 1, quantity.ErrParse},
		{"too long", strings.Repeat("# comment\n", steady.MaxCalBytes/10+1), 0, quantity.ErrRange},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := steady.ParseCalibration(strings.NewReader(tc.text), "x.cal")
			oneClass(t, err, tc.class)
			var pe *steady.ParseError
			if !errors.As(err, &pe) || pe.Line != tc.line || pe.File != "x.cal" {
				t.Errorf("%v: want a *ParseError at line %d", err, tc.line)
			}
		})
	}
}

type failing struct{}

func (failing) Read([]byte) (int, error) { return 0, io.ErrUnexpectedEOF }

// TestParseCalibrationReadError: a reader's failure is a parse error with
// its cause kept.
func TestParseCalibrationReadError(t *testing.T) {
	_, err := steady.ParseCalibration(failing{}, "x.cal")
	oneClass(t, err, quantity.ErrParse)
	if !errors.Is(err, io.ErrUnexpectedEOF) {
		t.Errorf("%v: cause lost", err)
	}
}

// FuzzParseCalibration: any text is read without panic and in bounded
// work, to a calibration whose values over its range are finite or to an
// error of exactly one class.
func FuzzParseCalibration(f *testing.F) {
	for _, name := range []string{"drag.cal", "speed.cal"} {
		b, err := os.ReadFile("testdata/" + name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(string(b))
	}
	f.Add("name a\nraw degC\nengineering degF\nuncertainty 0.1\nrange 0 100\nc0 32 degF\nc1 1.8\n")
	f.Add("name a\nraw V\nengineering Pa\nuncertainty 1\npoint 0 1e308\npoint 1 -1e308\n")
	f.Fuzz(func(t *testing.T, text string) {
		c, err := steady.ParseCalibration(strings.NewReader(text), "fuzz.cal")
		if err != nil {
			n := 0
			for _, cl := range classes {
				if errors.Is(err, cl) {
					n++
				}
			}
			if n != 1 {
				t.Fatalf("%v: %d classes", err, n)
			}
			return
		}
		for _, x := range []float64{c.Lo, (c.Lo + c.Hi) / 2, c.Hi} {
			y, s, err := c.Eval(c.Raw.Of(x))
			if err != nil {
				// Only a raw unit whose SI round trip moves the end
				// out of range may refuse it, and then as a range error.
				oneClass(t, err, quantity.ErrRange)
				continue
			}
			if math.IsNaN(y.Value()) || math.IsInf(y.Value(), 0) || math.IsNaN(s.Value()) {
				t.Fatalf("at %v: %v, slope %v", x, y, s)
			}
		}
	})
}
