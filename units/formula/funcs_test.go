package formula_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// errOutOfRange is the error of the test library's correlation.
type errOutOfRange struct{ x float64 }

func (e *errOutOfRange) Error() string        { return fmt.Sprintf("x = %g outside 0 … 10", e.x) }
func (e *errOutOfRange) Is(target error) bool { return target == quantity.ErrRange }

// testFuncs is a small library: sq(L) = L² on 0 … 10 m (an invented
// correlation with a range), and twice(x), with no derivative.
var testFuncs = []formula.Func{
	{Name: "sq", Args: []quantity.Dim{quantity.Length}, Result: quantity.Area,
		Eval: func(a []float64) (float64, error) {
			if !(a[0] >= 0 && a[0] <= 10) {
				return 0, &errOutOfRange{a[0]}
			}
			return a[0] * a[0], nil
		},
		Deriv: func(a, g []float64) error { g[0] = 2 * a[0]; return nil }},
	{Name: "twice", Args: []quantity.Dim{quantity.Dimensionless}, Result: quantity.Dimensionless,
		Eval: func(a []float64) (float64, error) { return 2 * a[0], nil }},
}

var withFuncs = formula.Options{Funcs: testFuncs}

// TestFuncCall: a function of the library is called with its dimensions
// checked; its value per row matches the hand calculation.
func TestFuncCall(t *testing.T) {
	p, err := withFuncs.Compile("A = sq(D); k = twice(Re); A*k", in("D", quantity.Length), in("Re", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	if p.Dim(0) != quantity.Area || p.Dim(2) != quantity.Area {
		t.Fatalf("dimensions %v %v", p.Dim(0), p.Dim(2))
	}
	out, err := p.Evaluator().Row([]float64{3, 0.5}, make([]float64, 3))
	if err != nil {
		t.Fatal(err)
	}
	// 3² = 9, 2·0.5 = 1, 9·1 = 9.
	if diff := cmp.Diff([]float64{9, 1, 9}, out); diff != "" {
		t.Error(diff)
	}
}

// TestFuncCompileErrors: a call of the wrong dimension or arity, an
// unknown function, and a library that is not well formed are refused
// at compile time with one class each.
func TestFuncCompileErrors(t *testing.T) {
	ins := []formula.Input{in("D", quantity.Length), in("V", quantity.Velocity)}
	for _, c := range []struct {
		opts formula.Options
		src  string
		cls  error
		want string
	}{
		{withFuncs, "sq(V)", quantity.ErrDimension, "argument 1 of sq is velocity"},
		{withFuncs, "sq(D) + D", quantity.ErrDimension, "cannot add"},
		{withFuncs, "sq(D, D)", quantity.ErrParse, "takes 1 arguments"},
		{withFuncs, "cube(D)", quantity.ErrUnknown, "unknown function"},
		{formula.Options{}, "sq(D)", quantity.ErrUnknown, "unknown function"},
		{withFuncs, "sq(20 {m})", quantity.ErrRange, "outside 0 … 10"},
		{formula.Options{Funcs: []formula.Func{{Name: "sqrt", Eval: testFuncs[0].Eval}}}, "D", quantity.ErrInvalid, "built-in"},
		{formula.Options{Funcs: []formula.Func{testFuncs[0], testFuncs[0]}}, "D", quantity.ErrInvalid, "twice"},
		{formula.Options{Funcs: []formula.Func{{Name: "f"}}}, "D", quantity.ErrInvalid, "no Eval"},
		{formula.Options{Funcs: []formula.Func{{Name: "2f", Eval: testFuncs[0].Eval}}}, "D", quantity.ErrInvalid, "a name"},
		{formula.Options{Keep: []string{"x"}}, "y = D", quantity.ErrUnknown, "no statement assigns"},
		{formula.Options{Keep: []string{"y", "y"}}, "y = D", quantity.ErrInvalid, "twice"},
	} {
		_, err := c.opts.Compile(c.src, ins...)
		if err == nil {
			t.Errorf("%q compiles", c.src)
			continue
		}
		if cl := classesOf(err); len(cl) != 1 || cl[0] != c.cls || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: %v: classes %v, want %v and %q", c.src, err, cl, c.cls, c.want)
		}
	}
}

// TestFuncOutOfRangeRow: a function's error at a row is an *Error (OpCheck)
// with that row and statement, wrapping the function's error, in Row,
// Series, and MarkMissing marks it.
func TestFuncOutOfRangeRow(t *testing.T) {
	p, err := withFuncs.Compile("k = 2*D\nA = sq(k)", in("D", quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	ev := p.Evaluator()
	col := quantity.NewSeries([]float64{1, 2, 6, 3}, quantity.Length) // 2·6 = 12 m > 10 m at row 2
	dst := [][]float64{make([]float64, 4), make([]float64, 4)}
	err = ev.Series([]quantity.Series{col}, dst)
	var re *formula.Error
	if !errors.As(err, &re) || re.Row != 2 || re.Statement != 1 || re.Name != "A" {
		t.Fatalf("got %v (%#v)", err, re)
	}
	var oe *errOutOfRange
	if !errors.As(err, &oe) || oe.x != 12 || !strings.Contains(err.Error(), "row 3") || !strings.Contains(err.Error(), "sq: x = 12") {
		t.Errorf("the cause is lost: %v", err)
	}
	if cl := classesOf(err); len(cl) != 1 || cl[0] != quantity.ErrRange {
		t.Errorf("classes %v", cl)
	}
	if _, err := ev.Row([]float64{6}, make([]float64, 2)); !errors.As(err, &re) || re.Row != -1 {
		t.Errorf("Row: %v", err)
	}
	// A function's error of another class keeps that one class.
	bad := formula.Options{Funcs: []formula.Func{{Name: "g", Args: []quantity.Dim{quantity.Length}, Result: quantity.Length,
		Eval: func(a []float64) (float64, error) { return 0, fmt.Errorf("g: %w", quantity.ErrInvalid) }}}}
	pg, err := bad.Compile("g(D)", in("D", quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	_, err = pg.Evaluator().Row([]float64{1}, make([]float64, 1))
	if cl := classesOf(err); !errors.As(err, &re) || len(cl) != 1 || cl[0] != quantity.ErrInvalid {
		t.Errorf("g: %v: classes %v", err, cl)
	}
	ev.SetCheck(formula.MarkMissing)
	if err := ev.Series([]quantity.Series{col}, dst); err != nil || !math.IsNaN(dst[1][2]) || dst[1][3] != 36 || ev.Marked(1) != 1 {
		t.Errorf("MarkMissing: %v %v marked %d", err, dst, ev.Marked(1))
	}
}

// TestGradientFunc: Gradient uses a function's derivative, and refuses a
// program calling a function without one.
func TestGradientFunc(t *testing.T) {
	p, err := withFuncs.Compile("A = sq(3*D)", in("D", quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	grad := [][]float64{{0}}
	if err := p.Evaluator().Gradient([]float64{2}, make([]float64, 1), grad); err != nil || grad[0][0] != 36 { // d(9D²)/dD = 18·D
		t.Errorf("grad %v, %v", grad, err)
	}
	p, _ = withFuncs.Compile("twice(Re)", in("Re", quantity.Dimensionless))
	err = p.Evaluator().Gradient([]float64{2}, make([]float64, 1), grad)
	if !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), "twice gives no derivative") {
		t.Errorf("got %v", err)
	}
}

// colebrook is the Colebrook–White equation as published, solved for the
// Darcy friction factor f in a bracket.
const colebrook = `f = solve(f, 1/sqrt(f) = -2*log10(eps/(3.7*D) + 2.51/(Re*sqrt(f))), 0.005, 0.1)`

// TestSolveColebrook checks the root against scipy.optimize.brentq
// (python3-scipy 1.10.1, xtol 1e-15) on the same equation:
// Re = 1e5, ε/D = 1e-4: f = 0.018513866077471648;
// Re = 1e6, ε/D = 1e-3: f = 0.019943465840476862;
// Re = 4e3, smooth:     f = 0.0399070140556349.
func TestSolveColebrook(t *testing.T) {
	ins := []formula.Input{in("Re", quantity.Dimensionless), in("eps", quantity.Length), in("D", quantity.Length)}
	p, err := formula.Compile(colebrook, ins...)
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{0.018513866077471648, 0.019943465840476862, 0.0399070140556349}
	re := quantity.NewSeries([]float64{1e5, 1e6, 4e3}, quantity.Dimensionless)
	eps := quantity.NewSeries([]float64{1e-5, 1e-4, 0}, quantity.Length)
	d := quantity.NewSeries([]float64{0.1, 0.1, 0.1}, quantity.Length)
	dst := [][]float64{make([]float64, 3)}
	if err := p.Evaluator().Series([]quantity.Series{re, eps, d}, dst); err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(want, dst[0], cmpopts.EquateApprox(1e-13, 0)); diff != "" {
		t.Error(diff)
	}
	// The same through Row, and the text prints and compiles again.
	out, err := p.Evaluator().Row([]float64{1e5, 1e-5, 0.1}, make([]float64, 1))
	if err != nil || math.Abs(out[0]-want[0]) > 1e-15 {
		t.Errorf("Row: %v %v", out, err)
	}
	if _, err := formula.Compile(p.Text(), ins...); err != nil {
		t.Errorf("%q: %v", p.Text(), err)
	}
}

// TestSolveRefusals: no root in the bracket is an *Error (OpCheck) naming the
// row; a bracket of two dimensions, sides of two dimensions, an unknown
// that is already a name or absent from the equation are refused at
// compile time.
func TestSolveRefusals(t *testing.T) {
	ins := []formula.Input{in("a", quantity.Dimensionless), in("L", quantity.Length)}
	p, err := formula.Compile("x = solve(x, x^2 = a, 0, 10)", ins...)
	if err != nil {
		t.Fatal(err)
	}
	dst := [][]float64{make([]float64, 3)}
	err = p.Evaluator().Series([]quantity.Series{quantity.NewSeries([]float64{4, 2, -1}, quantity.Dimensionless), quantity.NewSeries([]float64{1, 1, 1}, quantity.Length)}, dst)
	var re *formula.Error
	if !errors.As(err, &re) || re.Row != 2 || !strings.Contains(re.Reason, "no root is bracketed") {
		t.Fatalf("got %v", err)
	}
	if dst[0][0] != 2 || math.Abs(dst[0][1]-math.Sqrt2) > 1e-15 {
		t.Errorf("roots %v", dst[0])
	}
	for _, c := range []struct {
		src string
		cls error
	}{
		{"solve(x, x = L, 0, 1 {m})", quantity.ErrDimension},
		{"solve(x, x = L, 0 {m}, 1 {m}) + a", quantity.ErrDimension},
		{"solve(x, x^2 = L, 0 {m}, 1 {m})", quantity.ErrDimension},
		{"solve(a, a = 1, 0, 1)", quantity.ErrInvalid},
		{"solve(x, a = 1, 0, 1)", quantity.ErrInvalid},
		{"solve(x, solve(y, y = x, 0, 1) = 1, 0, 1)", quantity.ErrInvalid},
		{"solve(x, x == 1, 0, 1)", quantity.ErrDimension},
		{"solve(x x = 1, 0, 1)", quantity.ErrParse},
		{"solve(x, x = 1, 0)", quantity.ErrParse},
	} {
		_, err := formula.Compile(c.src, ins...)
		if cl := classesOf(err); len(cl) != 1 || cl[0] != c.cls {
			t.Errorf("%q: %v: classes %v, want %v", c.src, err, cl, c.cls)
		}
	}
}

// TestSolveGradient: the derivative of a root is exact by the implicit
// function theorem: x = √a has dx/da = 1/(2√a); a root x = L·√a of
// x² = a·L² has ∂x/∂L = √a.
func TestSolveGradient(t *testing.T) {
	p, err := formula.Compile("x = solve(x, x^2 = a*L^2, 0 {m}, 100 {m})", in("a", quantity.Dimensionless), in("L", quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	out := make([]float64, 1)
	grad := [][]float64{make([]float64, 2)}
	if err := p.Evaluator().Gradient([]float64{4, 3}, out, grad); err != nil {
		t.Fatal(err)
	}
	// x = 3·2 = 6; ∂x/∂a = L/(2√a) = 0.75; ∂x/∂L = √a = 2.
	if diff := cmp.Diff([]float64{0.75, 2}, grad[0], cmpopts.EquateApprox(1e-12, 0)); diff != "" || math.Abs(out[0]-6) > 1e-14 {
		t.Errorf("x = %v, %s", out, diff)
	}
}

// TestKeep: Options.Keep chooses the results and their order; the other
// statements are still checked.
func TestKeep(t *testing.T) {
	p, err := formula.Options{Keep: []string{"dp", "Re"}}.Compile(swameeJain, pipeInputs...)
	if err != nil {
		t.Fatal(err)
	}
	all, _ := formula.Compile(swameeJain, pipeInputs...)
	if diff := cmp.Diff([]string{"dp", "Re"}, p.Outputs()); diff != "" || p.Dim(0) != quantity.Pressure {
		t.Fatal(diff)
	}
	row := []float64{1000, 2, 0.1, 1e-3, 1e-5, 10}
	got, err := p.Evaluator().Row(row, make([]float64, 2))
	if err != nil {
		t.Fatal(err)
	}
	want, _ := all.Evaluator().Row(row, make([]float64, 3))
	if got[0] != want[2] || got[1] != want[0] {
		t.Errorf("got %v, all %v", got, want)
	}
	// An intermediate that is not finite is still refused, with its statement.
	p, _ = formula.Options{Keep: []string{"y"}}.Compile("k = 1/x; y = if(x > 0, k, 0)", in("x", quantity.Dimensionless))
	var re *formula.Error
	if _, err := p.Evaluator().Row([]float64{0}, make([]float64, 1)); !errors.As(err, &re) || re.Name != "k" || re.Statement != 0 {
		t.Errorf("got %v", err)
	}
}

// TestConstantBound: a statement that depends on no input is computed
// when the text is compiled (Constant), a constant call included.
func TestConstantBound(t *testing.T) {
	p, err := withFuncs.Compile("g = 9.80665 {m/s^2}; k = 2*pi/3 + sqrt(4); A = sq(2 {m}); y = k*x", in("x", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	pi := math.Pi // in float64 arithmetic, as the formula computes it
	for i, want := range []float64{9.80665, 2*pi/3 + 2, 4} {
		if v, ok := p.Constant(i); !ok || v != want {
			t.Errorf("Constant(%d) = %v, %v; want %v", i, v, ok, want)
		}
	}
	if _, ok := p.Constant(3); ok {
		t.Error("y depends on x")
	}
}

// TestConstantsProperty: a constant folded at compile time equals the
// same expression evaluated row by row with the constant an input.
func TestConstantsProperty(t *testing.T) {
	ops := []string{"%s + %s", "%s * %s", "%s / %s", "%s - %s", "sqrt(abs(%s) + %s*0)", "max(%s, %s)", "if(%s < %s, 1, 2)", "%s^2 + %s", "exp(%s/(1 + abs(%s)))", "atan2(%s, %s)"}
	rapid.Check(t, func(t *rapid.T) {
		var gen func(depth int) (folded, open string)
		gen = func(depth int) (string, string) {
			if depth == 0 || rapid.Bool().Draw(t, "leaf") {
				v := rapid.Float64Range(-100, 100).Draw(t, "v")
				s := fmt.Sprintf("(%v)", math.Abs(v))
				if v < 0 {
					s = fmt.Sprintf("(-%v)", -v)
				}
				if rapid.Bool().Draw(t, "input") {
					return s, "(a*0 + " + s + ")"
				}
				return s, s
			}
			op := rapid.SampledFrom(ops).Draw(t, "op")
			f1, o1 := gen(depth - 1)
			f2, o2 := gen(depth - 1)
			return fmt.Sprintf(op, f1, f2), fmt.Sprintf(op, o1, o2)
		}
		folded, open := gen(3)
		pf, err := formula.Compile("k = "+folded, in("a", quantity.Dimensionless))
		if err != nil {
			t.Fatalf("%q: %v", folded, err)
		}
		po, err := formula.Compile("k = "+open, in("a", quantity.Dimensionless))
		if err != nil {
			t.Fatalf("%q: %v", open, err)
		}
		ro, errO := po.Evaluator().Row([]float64{1}, make([]float64, 1))
		rf, errF := pf.Evaluator().Row([]float64{1}, make([]float64, 1))
		if (errO == nil) != (errF == nil) {
			t.Fatalf("%q: %v, %v", folded, errO, errF)
		}
		if errO != nil {
			return
		}
		// A statement of constants is folded unless an intermediate is not
		// finite (left in place so that it is reported per row, as the
		// package documents: max(1, -1/0) is 1 yet not folded). Whatever
		// is folded equals the per-row evaluation.
		v, ok := pf.Constant(0)
		if ok && v != ro[0] || rf[0] != ro[0] {
			t.Fatalf("%q: folded %v (%v), row %v", folded, v, ok, ro[0])
		}
		if !ok && !strings.ContainsAny(folded, "/^") && !strings.Contains(folded, "exp") && !strings.Contains(folded, "*") {
			t.Fatalf("%q: a statement of constants with no operation that can overflow is not folded", folded)
		}
	})
}

// TestSolveSeriesBlocks: a solve over more rows than one block, with a
// function of the library in its equation, gives each row's root
// (x = √a, from sq(x·1 m) = a·1 m²), a missing row stays missing, and
// nothing is allocated.
func TestSolveSeriesBlocks(t *testing.T) {
	p, err := withFuncs.Compile("x = solve(x, sq(x*1 {m}) = a*1 {m^2}, 0, 10); y = 2*x", in("a", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	const n = 1000
	a := make([]float64, n)
	for i := range a {
		a[i] = float64(i) / 10
	}
	a[700] = math.NaN()
	dst := [][]float64{make([]float64, n), make([]float64, n)}
	ev := p.Evaluator()
	cols := []quantity.Series{quantity.NewSeries(a, quantity.Dimensionless)}
	if err := ev.Series(cols, dst); err != nil {
		t.Fatal(err)
	}
	if allocs := testing.AllocsPerRun(3, func() { _ = ev.Series(cols, dst) }); allocs != 0 {
		t.Errorf("Series with a solve and a call: %v allocations", allocs)
	}
	for i, v := range a {
		want := math.Sqrt(v)
		if i == 700 {
			if !math.IsNaN(dst[0][i]) || !math.IsNaN(dst[1][i]) {
				t.Errorf("row %d: %v %v, want missing", i, dst[0][i], dst[1][i])
			}
			continue
		}
		if math.Abs(dst[0][i]-want) > 4e-16*want || dst[1][i] != 2*dst[0][i] {
			t.Fatalf("row %d: %v %v, want %v", i, dst[0][i], dst[1][i], want)
		}
	}
}
