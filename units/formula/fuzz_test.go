package formula_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// FuzzCompile, with a library of two functions (sq with a range, dbl),
// checks that parsing and compiling never panic and that
// their work is bounded; that a refused text has an error of exactly one
// class; that a compiled program prints as text that compiles again; and
// that checked evaluation — Row, Series and Gradient on finite inputs,
// including zeros, negative and huge values — never gives a result that
// is not finite with a nil error, while MarkMissing gives finite values or
// NaN, never ±Inf and never an error.
func FuzzCompile(f *testing.F) {
	for _, s := range []string{swameeJain, "Nu = 0.023 * Re^0.8 * Pr^0.4", "if(Re < 2000, 64/Re, 0.316/Re^0.25)", "p + V", "(((", "2 {m/s^2} * D",
		"20{°C} - 1 {K}", "9.80665 [m/s^2]", "2 {furlong}", "x = 2 {m}; x + D", "g = 9.80665 {m/s^2}; Fr = V/sqrt(g*D)",
		"1/a", "ln(a - 0.5)", "sqrt(-a)", "asin(2*a)", "D*D*D", "exp(Re*1e300)", "a = 1/(Re - 1e5); b = a + 1",
		"x = 1; y = x^(1/3); y", "# only a comment", "a ** -2", "hypot(D, D) / D", "\xff", "2 {", "{m}", "2 {}",
		"A = sq(D); A/D", "sq(D*Re)", "dbl(a) + sq(2 {m})/D^2", "sq(V)", "sq(D, D)", "sq(20 {m})",
		"f = solve(f, 1/sqrt(f) = -2*log10(1e-4/3.7 + 2.51/(Re*sqrt(f))), 0.005, 0.1)",
		"x = solve(x, x^2 = a, 0, 10)", "solve(x, x = D, 0 {m}, 1)", "solve(x, sq(x) = D*D, 0 {m}, D)", "solve(x, x, a, Re)",
		"solve(x x", "solve(x, x = 1, 0, 1", "solve(x, solve(y, y, 0, 1), 0, 1)", "k = 3*pi; solve(x, x - k, 0, 20)"} {
		f.Add(s)
	}
	ins := []formula.Input{{Name: "Re", Dim: quantity.Dimensionless}, {Name: "Pr", Dim: quantity.Dimensionless},
		{Name: "D", Dim: quantity.Length}, {Name: "p", Dim: quantity.Pressure}, {Name: "V", Dim: quantity.Velocity}, {Name: "a", Dim: quantity.Dimensionless}}
	rows := [][]float64{{1e5, 7, 0.1, 2e5, 3, 0.5}, {0, 0, 0, 0, 0, 0}, {-1, -2, -0.5, -1e5, -3, -1}, {1e200, 1e-200, 1e150, 1e300, 1e-300, 2}}
	opts := formula.Options{Funcs: []formula.Func{testFuncs[0], {Name: "dbl", Args: []quantity.Dim{quantity.Dimensionless}, Result: quantity.Dimensionless,
		Eval: func(a []float64) (float64, error) { return 2 * a[0], nil }, Deriv: func(a, g []float64) error { g[0] = 2; return nil }}}}
	f.Fuzz(func(t *testing.T, src string) {
		p, err := opts.Compile(src, ins...)
		if err != nil {
			if cl := classesOf(err); len(cl) != 1 {
				t.Fatalf("%q: %v matches %d classes", src, err, len(cl))
			}
			return
		}
		if _, err := opts.Compile(p.Text(), ins...); err != nil {
			t.Fatalf("%q prints as %q, which does not compile: %v", src, p.Text(), err)
		}
		n := len(p.Outputs())
		ev := p.Evaluator()
		cols := make([]quantity.Series, len(ins))
		for j := range ins {
			col := make([]float64, len(rows))
			for i := range rows {
				col[i] = rows[i][j]
			}
			cols[j] = quantity.NewSeries(col, ins[j].Dim)
		}
		dst := make([][]float64, n)
		for i := range dst {
			dst[i] = make([]float64, len(rows))
		}
		allFinite := func(what string, x []float64) {
			for _, v := range x {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("%q: %s: %v with a nil error", src, what, x)
				}
			}
		}
		for _, row := range rows {
			out, err := ev.Row(row, make([]float64, n))
			if err == nil {
				allFinite("Row", out)
			} else if !errors.Is(err, quantity.ErrRange) {
				t.Fatalf("%q: Row: %v", src, err)
			}
			grad := make([][]float64, n)
			for i := range grad {
				grad[i] = make([]float64, len(ins))
			}
			gout := make([]float64, n)
			if err := ev.Gradient(row, gout, grad); err == nil {
				allFinite("Gradient", gout)
				for _, g := range grad {
					allFinite("Gradient", g)
				}
			} else if !errors.Is(err, quantity.ErrRange) {
				t.Fatalf("%q: Gradient: %v", src, err)
			}
		}
		if err := ev.Series(cols, dst); err == nil {
			for _, d := range dst {
				allFinite("Series", d)
			}
		} else if !errors.Is(err, quantity.ErrRange) {
			t.Fatalf("%q: Series: %v", src, err)
		}
		ev.SetCheck(formula.MarkMissing)
		if err := ev.Series(cols, dst); err != nil {
			t.Fatalf("%q: MarkMissing: %v", src, err)
		}
		for _, d := range dst {
			for _, v := range d {
				if math.IsInf(v, 0) {
					t.Fatalf("%q: MarkMissing leaves %v", src, d)
				}
			}
		}
	})
}
