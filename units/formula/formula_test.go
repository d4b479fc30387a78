package formula_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

func in(name string, d quantity.Dim) formula.Input { return formula.Input{Name: name, Dim: d} }

// trade formulas written as text, checked against the same formula written
// in Go over random data, to 1e-12 relative.
func TestTradeFormulas(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	u := func(lo, hi float64) float64 { return lo + (hi-lo)*r.Float64() }
	cases := []struct {
		name   string
		src    string
		inputs []formula.Input
		draw   func() []float64
		want   func(x []float64) float64
		dim    quantity.Dim
	}{
		{
			// Swamee and Jain (1976), explicit Darcy friction factor, and
			// Darcy–Weisbach.
			"Swamee–Jain and Darcy–Weisbach",
			"Re = rho*V*D/mu\nf = 0.25 / log10(eps/(3.7*D) + 5.74/Re^0.9)^2\ndp = f * L/D * rho*V^2/2",
			[]formula.Input{in("rho", quantity.Density), in("V", quantity.Velocity), in("D", quantity.Length),
				in("mu", quantity.DynamicViscosity), in("eps", quantity.Length), in("L", quantity.Length)},
			func() []float64 {
				return []float64{u(990, 1000), u(0.5, 5), u(0.02, 0.5), u(8e-4, 1.2e-3), u(1e-6, 1e-4), u(1, 100)}
			},
			func(x []float64) float64 {
				re := x[0] * x[1] * x[2] / x[3]
				lg := math.Log10(x[4]/(3.7*x[2]) + 5.74/math.Pow(re, 0.9))
				f := 0.25 / (lg * lg)
				return f * x[5] / x[2] * x[0] * x[1] * x[1] / 2
			},
			quantity.Pressure,
		},
		{
			// Dittus–Boelter, heating: Nu = 0.023 Re^0.8 Pr^0.4.
			"Dittus–Boelter", "Nu = 0.023 * Re^0.8 * Pr^0.4",
			[]formula.Input{in("Re", quantity.Dimensionless), in("Pr", quantity.Dimensionless)},
			func() []float64 { return []float64{u(1e4, 1e6), u(0.7, 100)} },
			func(x []float64) float64 { return 0.023 * math.Pow(x[0], 0.8) * math.Pow(x[1], 0.4) },
			quantity.Dimensionless,
		},
		{
			// Churchill and Bernstein (1977), cross-flow over a cylinder.
			"Churchill–Bernstein",
			"Nu = 0.3 + 0.62*Re^(1/2)*Pr^(1/3) / (1 + (0.4/Pr)^(2/3))^(1/4) * (1 + (Re/282000)^(5/8))^(4/5)",
			[]formula.Input{in("Re", quantity.Dimensionless), in("Pr", quantity.Dimensionless)},
			func() []float64 { return []float64{u(100, 1e7), u(0.7, 10)} },
			func(x []float64) float64 {
				re, pr := x[0], x[1]
				return 0.3 + 0.62*math.Sqrt(re)*math.Cbrt(pr)/math.Pow(1+math.Pow(0.4/pr, 2.0/3), 0.25)*math.Pow(1+math.Pow(re/282000, 5.0/8), 0.8)
			},
			quantity.Dimensionless,
		},
		{
			// The ITTC-1957 model–ship correlation line.
			"ITTC-1957", "C_F = 0.075 / (log10(V*L/nu) - 2)^2",
			[]formula.Input{in("V", quantity.Velocity), in("L", quantity.Length), in("nu", quantity.KinematicViscosity)},
			func() []float64 { return []float64{u(0.5, 10), u(2, 300), u(0.9e-6, 1.5e-6)} },
			func(x []float64) float64 { d := math.Log10(x[0]*x[1]/x[2]) - 2; return 0.075 / (d * d) },
			quantity.Dimensionless,
		},
		{
			// ISO 2533 troposphere: T = T₀ − 0.0065 K/m·H, p = p₀(T/T₀)^(g₀/(βR)).
			"ISO 2533 troposphere",
			"T = 288.15 {K} - 0.0065 {K/m} * H\np = 101325 {Pa} * (T/(288.15 {K}))^(9.80665/(0.0065*287.05287))",
			[]formula.Input{in("H", quantity.Length)},
			func() []float64 { return []float64{u(0, 11000)} },
			func(x []float64) float64 {
				T := 288.15 - 0.0065*x[0]
				return 101325 * math.Pow(T/288.15, 9.80665/(0.0065*287.05287))
			},
			quantity.Pressure,
		},
		{
			// Laminar or turbulent: 64/Re below 2000, Blasius above.
			"laminar and turbulent", "f = if(Re < 2000, 64/Re, 0.316/Re^0.25)",
			[]formula.Input{in("Re", quantity.Dimensionless)},
			func() []float64 { return []float64{u(100, 1e5)} },
			func(x []float64) float64 {
				if x[0] < 2000 {
					return 64 / x[0]
				}
				return 0.316 / math.Pow(x[0], 0.25)
			},
			quantity.Dimensionless,
		},
	}
	for _, c := range cases {
		p, err := formula.Compile(c.src, c.inputs...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		last := len(p.Outputs()) - 1
		if p.Dim(last) != c.dim {
			t.Errorf("%s: result dimension %v, want %v", c.name, p.Dim(last), c.dim)
		}
		ev := p.Evaluator()
		const rows = 700
		cols := make([][]float64, len(c.inputs))
		for i := range cols {
			cols[i] = make([]float64, rows)
		}
		want := make([]float64, rows)
		for k := range rows {
			x := c.draw()
			for i := range x {
				cols[i][k] = x[i]
			}
			want[k] = c.want(x)
			got, err := ev.Row(x, make([]float64, len(p.Outputs())))
			if err != nil || math.Abs(got[last]-want[k]) > 1e-12*math.Abs(want[k]) {
				t.Fatalf("%s: row %v: %v, want %v (%v)", c.name, x, got, want[k], err)
			}
		}
		series := make([]quantity.Series, len(c.inputs))
		for i := range series {
			series[i] = quantity.NewSeries(cols[i], c.inputs[i].Dim)
		}
		dst := make([][]float64, len(p.Outputs()))
		for i := range dst {
			dst[i] = make([]float64, rows)
		}
		if err := ev.Series(series, dst); err != nil {
			t.Fatal(err)
		}
		for k := range rows {
			if math.Abs(dst[last][k]-want[k]) > 1e-12*math.Abs(want[k]) {
				t.Fatalf("%s: series row %d: %v, want %v", c.name, k, dst[last][k], want[k])
			}
		}
	}
}

// TestMalformed: formulas that are malformed or dimensionally wrong are
// refused with the offset of the mistake and their class.
func TestMalformed(t *testing.T) {
	ins := []formula.Input{in("p", quantity.Pressure), in("V", quantity.Velocity), in("rho", quantity.Density),
		in("D", quantity.Length), in("Re", quantity.Dimensionless), in("T", quantity.Temperature)}
	P, D, U, R, I := quantity.ErrParse, quantity.ErrDimension, quantity.ErrUnknown, quantity.ErrRange, quantity.ErrInvalid
	cases := []struct {
		src    string
		offset int
		class  error
		want   string
	}{
		{"p + V", 2, D, "cannot add pressure, stress [Pa] and velocity [m/s]"},
		{"x = p - rho", 6, D, "cannot subtract"},
		{"log10(p)", 6, D, "argument must be dimensionless"},
		{"exp(V)", 4, D, "dimensionless"},
		{"sin(D)", 4, D, "dimensionless"},
		{"D^(1/4)", 1, D, "cannot raise"},
		{"sqrt(sqrt(D))", 0, D, "cannot take the sqrt"},
		{"D^Re", 1, D, "dimensionless base"},
		{"Re^D", 2, D, "dimensionless base"},
		{"if(p < V, 1, 2)", 5, D, "cannot compare"},
		{"if(Re < 2000, p, V)", 0, D, "branches of if differ"},
		{"if(Re, 1, 2)", 3, D, "must be a comparison"},
		{"Re < 2", 3, D, "not a quantity"},
		{"min(p, V)", 0, D, "one dimension"},
		{"p + 1", 2, D, "cannot add"},
		{"T + 20 {degC}", 2, P, ""}, // a temperature level in K plus a level: same dimension, allowed
		{"p + 3 {m/s}", 2, D, "cannot add"},
		{"", 0, P, "no statement"},
		{"p +", 3, P, "operand is missing"},
		{"(p", 0, P, "never closed"},
		{"p)", 1, P, "unexpected"},
		{"q", 0, U, "unknown name"},
		{"foo(p)", 0, U, "unknown function"},
		{"sqrt(p, V)", 0, P, "takes 1 arguments"},
		{"min(p)", 0, P, "takes 2 arguments"},
		{"p = V", 0, I, "already defined"},
		{"x = p\nx = V", 6, I, "already defined"},
		{"2 {furlong}", 3, U, "unknown unit"},
		{"2 {m", 2, P, "never closed"},
		{"p $ V", 2, P, "unexpected"},
		{"1e999", 0, R, "beyond the range"},
		{"\xff", 0, P, "UTF-8"},
		{"x = ", 4, P, "operand is missing"},
		{"p ^", 3, P, "operand is missing"},
		{"max(p,", 6, P, "operand is missing"},
		{"a and", 5, P, "operand is missing"},
		{"Re < 2 and V", 7, D, "join comparisons"},
		{"-", 1, P, "operand is missing"},
		{"* p", 0, P, "unexpected"},
		{"p p", 2, P, "statement ends"},
		{"p\n+", 3, P, "operand is missing"},
		{strings.Repeat("(", 100) + "1" + strings.Repeat(")", 100), 64, R, "nested more than"},
		{strings.Repeat("1+", 5000) + "1", 4095, R, "more than 4096 operations"},
		{"D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D*D", 41, D, "overflows"},
		{"atan2(p, V)", 0, D, "one dimension"},
		{"hypot(D, V)", 0, D, "one dimension"},
		{"abs(p) + V", 7, D, "cannot add"},
		{"y = p/V; y + D", 11, D, "cannot add"},
		{"if(Re < 1 or p, 1, 2)", 10, D, "join comparisons"},
		{"V^2 + p", 4, D, "cannot add"},
		{"rho*V^2 + V", 8, D, "cannot add"},
		{"ln(Re) + ln(D)", 12, D, "dimensionless"},
		{"-p + V", 3, D, "cannot add"},
		{"Re ** D", 3, D, "dimensionless base"},
		{"2 {°C} * 2", 0, P, ""}, // a scale read as a level, then doubled: allowed, in K
		{"101 325 {Pa}", 4, P, "statement ends"},
		{"sqrt(cbrt(sqrt(D)))", 0, D, "cannot take the sqrt"},
		{"max(p, p) + D", 10, D, "cannot add"},
		{"1/0 + p", 4, D, "cannot add"},
		{"tan(p)", 4, D, "dimensionless"},
		{"asin(V)", 5, D, "dimensionless"},
		{"acos(D) * 2", 5, D, "dimensionless"},
		{"atan(rho)", 5, D, "dimensionless"},
		{"log(p/rho)", 5, D, "dimensionless"},
		{"sqrt()", 0, P, "takes 1 arguments"},
		{"if(Re < 1, 2)", 0, P, "takes 3 arguments"},
		{"x = 2 {m} ; x + V", 14, D, "cannot add"},
		{"p == V", 2, D, "cannot compare"},
		{"2 {°C} + 3 {m}", 8, D, "cannot add"},
		{"Re^(1/2) + D", 9, D, "cannot add"},
		{"1 +* 2", 3, P, "unexpected"},
		{"x == 1", 0, U, "unknown name"},
		{"[m]", 0, P, "written in braces: 9.80665 {m/s^2}"},
		{"9.80665 [m/s^2]", 8, P, "written in braces: 9.80665 {m/s^2}"},
		{"x = 2[m]; x", 5, P, "written in braces"},
		{"2 {m; 3", 2, P, "never closed"},
		{"2 {m\n}", 2, P, "never closed"},
		{"2 {}", 2, P, "empty braces"},
		{"2 { }", 2, P, "empty braces"},
		{"V {m/s}", 2, P, "follows a number, not a name"},
		{"{m}", 0, P, "follows a number"},
		{"2 {m/}", 3, P, "the unit {m/}"},
		{"2 {kPa(g)}", 3, P, "gauge"},
		{"2 {1000}", 3, P, "a number, not a unit"},
		{"2 {1/s} * D", 0, P, ""},
		{"1e-400", 0, R, "beyond the range"},
		{"1e300 {km} * D", 0, P, ""},
		{"2 {m} / 0", 0, P, ""},
		{"p + 20{°C}", 2, D, "cannot add"},
		{"Re^2 {m}", 2, D, "dimensionless base"},
	}
	for _, c := range cases {
		_, err := formula.Compile(c.src, ins...)
		if c.want == "" {
			if err != nil {
				t.Errorf("%q: %v", c.src, err)
			}
			continue
		}
		var fe *formula.Error
		if !errors.As(err, &fe) {
			t.Errorf("%q: %v, want a *formula.Error", c.src, err)
			continue
		}
		if !strings.Contains(fe.Error(), c.want) || fe.Offset != c.offset {
			t.Errorf("%q: offset %d, %q; want offset %d and %q", c.src, fe.Offset, fe.Error(), c.offset, c.want)
		}
		if !errors.Is(err, c.class) {
			t.Errorf("%q: %v is not of class %v", c.src, err, c.class)
		}
	}
}

// genExpr draws a random formula over the inputs x (dimensionless), y
// (length) and the functions, written with redundant or missing
// parentheses and spacing.
func genExpr(t *rapid.T, depth int) string {
	if depth > 3 || rapid.IntRange(0, 3).Draw(t, "leaf") == 0 {
		switch rapid.IntRange(0, 3).Draw(t, "kind") {
		case 0:
			return "x"
		case 1:
			return "(y/(2 {m}))"
		case 2:
			return strconv.FormatFloat(rapid.Float64Range(0.1, 10).Draw(t, "c"), 'g', -1, 64)
		}
		return "1.5e-1"
	}
	a, b := genExpr(t, depth+1), genExpr(t, depth+1)
	switch rapid.IntRange(0, 8).Draw(t, "op") {
	case 0:
		return a + " + " + b
	case 1:
		return a + "-" + b
	case 2:
		return a + "*" + b
	case 3:
		return "(" + a + ")/(" + b + ")"
	case 4:
		return "(" + a + ")^" + []string{"2", "-1", "(1/3)", "0.5"}[rapid.IntRange(0, 3).Draw(t, "e")]
	case 5:
		return "-" + a
	case 6:
		return "exp(-abs(" + a + "))"
	case 7:
		return "max(" + a + ", " + b + ")"
	}
	return "if(" + a + " < " + b + ", " + a + ", " + b + ")"
}

// TestTextRoundTrip: printing a program and compiling the text again
// gives a program that computes the same bits.
func TestTextRoundTrip(t *testing.T) {
	ins := []formula.Input{in("x", quantity.Dimensionless), in("y", quantity.Length)}
	rapid.Check(t, func(t *rapid.T) {
		src := "z = " + genExpr(t, 0) + "\n" + genExpr(t, 0) + " + z"
		p, err := formula.Compile(src, ins...)
		if err != nil {
			t.Fatalf("%q: %v", src, err)
		}
		text := p.Text()
		q, err := formula.Compile(text, ins...)
		if err != nil {
			t.Fatalf("%q printed as %q: %v", src, text, err)
		}
		if q.Text() != text {
			t.Fatalf("printing is not stable: %q then %q", text, q.Text())
		}
		x := []float64{rapid.Float64Range(0.1, 5).Draw(t, "x"), rapid.Float64Range(0.1, 5).Draw(t, "y")}
		pe, qe := p.Evaluator(), q.Evaluator()
		pe.SetCheck(formula.Unchecked) // the same bits, ±Inf and NaN included
		qe.SetCheck(formula.Unchecked)
		a, _ := pe.Row(x, make([]float64, 2))
		b, _ := qe.Row(x, make([]float64, 2))
		for i := range a {
			if math.Float64bits(a[i]) != math.Float64bits(b[i]) && !(math.IsNaN(a[i]) && math.IsNaN(b[i])) {
				t.Fatalf("%q and %q differ: %v, %v", src, text, a, b)
			}
		}
	})
}
