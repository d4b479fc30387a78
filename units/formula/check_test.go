package formula_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// classes are the error classes of the module; an error matches one.
var classes = []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}

func classesOf(err error) []error {
	var out []error
	for _, c := range classes {
		if errors.Is(err, c) {
			out = append(out, c)
		}
	}
	return out
}

// TestNonFiniteRowRefused: by default a result that is not finite is a
// *Error (OpCheck) of class ErrRange naming the statement and the operation
// that gave it, never a number with a nil error.
func TestNonFiniteRowRefused(t *testing.T) {
	ins := []formula.Input{in("x", quantity.Dimensionless), in("D", quantity.Length)}
	cases := []struct {
		src    string
		x, d   float64
		stmt   int
		name   string
		offset int
		reason string
	}{
		{"r = 1/x", 0, 1, 0, "r", 5, "division by zero"},
		{"ln(x)", 0, 1, 0, "", 0, "logarithm of zero"},
		{"a = 1; log10(x - 2)", 1, 1, 1, "", 7, "logarithm of a negative number"},
		{"s = sqrt(x)", -1, 1, 0, "s", 4, "square root of a negative number"},
		{"asin(x)", 2, 1, 0, "", 0, "asin of a number outside [−1, 1]"},
		{"acos(x)", -1.5, 1, 0, "", 0, "acos of a number outside"},
		{"V = D*D*D", 1, 1e200, 0, "V", 5, "an overflow"},
		{"exp(x*1e300)", 1, 1, 0, "", 0, "(exp)"},
		{"a = x + 1; b = 1/(a - 1); c = b*2", 0, 1, 1, "b", 16, "division by zero"},
		{"(x - 1)^(-2)", 1, 1, 0, "", 7, "zero raised to a negative power"},
		{"x^0.5", -4, 1, 0, "", 1, "a fractional power of a negative number"},
		{"y = x*0", math.Inf(1), 1, 0, "y", 5, "input x is +Inf"},
		{"y = x", math.Inf(-1), 1, 0, "y", 0, "input x is -Inf"},
		{"if(x > 0, 1/x, ln(x - 1))", 0, 1, 0, "", 15, "logarithm of a negative number"},
	}
	for _, c := range cases {
		p, err := formula.Compile(c.src, ins...)
		if err != nil {
			t.Fatalf("%q: %v", c.src, err)
		}
		got, err := p.Evaluator().Row([]float64{c.x, c.d}, make([]float64, len(p.Outputs())))
		var re *formula.Error
		if !errors.As(err, &re) {
			t.Errorf("%q at x = %v: %v, %v; want an *Error of OpCheck", c.src, c.x, got, err)
			continue
		}
		if cl := classesOf(err); len(cl) != 1 || cl[0] != quantity.ErrRange {
			t.Errorf("%q: classes %v, want ErrRange alone", c.src, cl)
		}
		if re.Row != -1 || re.Statement != c.stmt || re.Name != c.name || re.Offset != c.offset || !strings.Contains(re.Reason, c.reason) || finiteF(re.Value) {
			t.Errorf("%q at x = %v: %+v; want statement %d %q at %d, %q", c.src, c.x, *re, c.stmt, c.name, c.offset, c.reason)
		}
		// The same through RowQ.
		_, err = p.Evaluator().RowQ([]quantity.Quantity{quantity.New(c.x, quantity.Dimensionless), quantity.New(c.d, quantity.Length)}, make([]quantity.Quantity, len(p.Outputs())))
		if !errors.As(err, &re) {
			t.Errorf("%q: RowQ gives %v, want an *Error of OpCheck", c.src, err)
		}
	}
}

func finiteF(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// TestNonFiniteSeriesFirstRowAndStatement: over columns the error names
// the first row that has a result that is not finite, and in it the first
// such statement, also past the first block of rows; the rows before it
// are written.
func TestNonFiniteSeriesFirstRowAndStatement(t *testing.T) {
	p, err := formula.Compile("r = 1/x\ns = sqrt(x)\nt = s + r", in("x", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		at   map[int]float64 // rows with another value than 4
		row  int
		stmt int
	}{
		{map[int]float64{3: -1, 5: 0}, 3, 1}, // sqrt(−1) first
		{map[int]float64{3: 0, 5: -1}, 3, 0}, // 1/0 and sqrt(0) = 0
		{map[int]float64{300: 0, 700: -1}, 300, 0},
		{map[int]float64{2: math.NaN(), 600: -9}, 600, 1}, // a missing value is not an error
	}
	for _, c := range cases {
		x := make([]float64, 1000)
		for i := range x {
			x[i] = 4
			if v, ok := c.at[i]; ok {
				x[i] = v
			}
		}
		dst := [][]float64{make([]float64, 1000), make([]float64, 1000), make([]float64, 1000)}
		err := p.Evaluator().Series([]quantity.Series{quantity.NewSeries(x, quantity.Dimensionless)}, dst)
		var re *formula.Error
		if !errors.As(err, &re) || re.Row != c.row || re.Statement != c.stmt || !errors.Is(err, quantity.ErrRange) {
			t.Errorf("%v: %v; want row %d, statement %d", c.at, err, c.row, c.stmt)
			continue
		}
		if dst[2][c.row-1] != 2.25 { // 4: sqrt 2 + 1/4, by hand
			t.Errorf("%v: row %d before the error is %v, want 2.25", c.at, c.row-1, dst[2][c.row-1])
		}
		if !strings.Contains(err.Error(), "statement") || !strings.Contains(err.Error(), "row") {
			t.Errorf("message %q names no row or statement", err)
		}
	}
}

// TestMissingInputAndGuardsAreNotErrors: a NaN input (a missing value)
// makes the results that use it NaN without an error; a branch of if not
// taken does not count; an overflow that later operations bring back into
// range (1/(1/0)) is not a result.
func TestMissingInputAndGuardsAreNotErrors(t *testing.T) {
	p, err := formula.Compile("a = if(x > 0, ln(x), 0)\nb = y*2\nc = 1/(1/x)", in("x", quantity.Dimensionless), in("y", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	x := []float64{0, 1, 0, math.E}
	y := []float64{1, math.NaN(), 3, 4}
	dst := [][]float64{make([]float64, 4), make([]float64, 4), make([]float64, 4)}
	ev := p.Evaluator()
	if err := ev.Series([]quantity.Series{quantity.NewSeries(x, 0), quantity.NewSeries(y, 0)}, dst); err != nil {
		t.Fatal(err)
	}
	want := [][]float64{{0, 0, 0, 1}, {2, math.NaN(), 6, 8}, {0, 1, 0, math.E}}
	if d := cmp.Diff(want, dst, cmpopts.EquateNaNs(), cmpopts.EquateApprox(0, 1e-15)); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
	if ev.Marked(0)+ev.Marked(1)+ev.Marked(2) != 0 {
		t.Errorf("marked %d, %d, %d; want none", ev.Marked(0), ev.Marked(1), ev.Marked(2))
	}
}

// TestMarkMissing: by the explicit option a result that is not finite is
// NaN and counted; a later statement that uses it is missing, not
// counted; a missing input is not counted either.
func TestMarkMissing(t *testing.T) {
	p, err := formula.Compile("r = 1/x\ns = r + 1\nq = sqrt(x)", in("x", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	ev := p.Evaluator()
	ev.SetCheck(formula.MarkMissing)
	x := []float64{1, 0, 4, 0, math.NaN(), -4}
	dst := [][]float64{make([]float64, 6), make([]float64, 6), make([]float64, 6)}
	if err := ev.Series([]quantity.Series{quantity.NewSeries(x, 0)}, dst); err != nil {
		t.Fatal(err)
	}
	nan := math.NaN()
	want := [][]float64{{1, nan, 0.25, nan, nan, -0.25}, {2, nan, 1.25, nan, nan, 0.75}, {1, 0, 2, 0, nan, nan}}
	if d := cmp.Diff(want, dst, cmpopts.EquateNaNs()); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
	if got := []int{ev.Marked(0), ev.Marked(1), ev.Marked(2)}; !cmp.Equal(got, []int{2, 0, 1}) {
		t.Errorf("marked %v, want [2 0 1]", got)
	}
	out, err := ev.Row([]float64{0}, make([]float64, 3))
	if err != nil || !math.IsNaN(out[0]) || !math.IsNaN(out[1]) || ev.Marked(0) != 3 {
		t.Errorf("Row: %v, %v, marked %d", out, err, ev.Marked(0))
	}
	ev.ResetMarked()
	if ev.Marked(0) != 0 {
		t.Errorf("after ResetMarked: %d", ev.Marked(0))
	}
	// Unchecked: the float64 arithmetic as it is.
	ev.SetCheck(formula.Unchecked)
	if out, err := ev.Row([]float64{0}, make([]float64, 3)); err != nil || !math.IsInf(out[0], 1) {
		t.Errorf("Unchecked: %v, %v", out, err)
	}
}

// TestGradientNonFinite: √x at 0 is 0 but its derivative 1/(2√x) is
// not finite: refused with the input named, or marked.
func TestGradientNonFinite(t *testing.T) {
	p, err := formula.Compile("s = sqrt(x)", in("x", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	ev := p.Evaluator()
	out, grad := make([]float64, 1), [][]float64{make([]float64, 1)}
	err = ev.Gradient([]float64{0}, out, grad)
	var re *formula.Error
	if !errors.As(err, &re) || re.Wrt != "x" || re.Name != "s" || !errors.Is(err, quantity.ErrRange) {
		t.Errorf("%v", err)
	}
	ev.SetCheck(formula.MarkMissing)
	if err := ev.Gradient([]float64{0}, out, grad); err != nil || out[0] != 0 || !math.IsNaN(grad[0][0]) || ev.Marked(0) != 1 {
		t.Errorf("marked: %v %v %v %d", err, out, grad, ev.Marked(0))
	}
}
