package formula_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// TestConstantKeepsDimension: a name bound to a number with a unit has
// that unit's dimension in every later statement, so the dimension check
// sees it (Froude number with g = 9.80665 m/s², the standard acceleration
// of gravity of the SI Brochure; Reynolds number with ν of water at 20 °C,
// about 1.0034e-6 m²/s, from memory).
func TestConstantKeepsDimension(t *testing.T) {
	ins := []formula.Input{in("V", quantity.Velocity), in("L", quantity.Length), in("Re", quantity.Dimensionless),
		in("rho", quantity.Density)}
	ok := []struct {
		src string
		dim quantity.Dim
	}{
		{"g = 9.80665 {m/s^2}\nFr = V/sqrt(g*L)", quantity.Dimensionless},
		{"nu = 1.0034e-6 {m^2/s}; V*L/nu + Re", quantity.Dimensionless},
		{"S = 2.1 {m^2}; F = 0.5*rho*V^2*S", quantity.Force},
		{"g = 9.80665{m/s^2}; h = g; t = sqrt(2*L/h)", quantity.Time},
		{"c = pi; c*Re + Re", quantity.Dimensionless},
		{"T0 = 20{°C}; T0 - 1 {K}", quantity.Temperature},
	}
	for _, c := range ok {
		p, err := formula.Compile(c.src, ins...)
		if err != nil {
			t.Errorf("%q: %v", c.src, err)
			continue
		}
		if got := p.Dim(len(p.Outputs()) - 1); got != c.dim {
			t.Errorf("%q: the result is %v, want %v", c.src, got, c.dim)
		}
	}
	bad := []string{
		"a = 4 {m^2}; a + 1",
		"g = 9.80665 {m/s^2}; Re + g",
		"S = 2.1 {m^2}; ln(S)",
		"nu = 1.0034e-6 {m^2/s}; V*L/nu + V",
		"k = 3 {m}; j = k; j + Re",
	}
	for _, src := range bad {
		_, err := formula.Compile(src, ins...)
		if !errors.Is(err, quantity.ErrDimension) {
			t.Errorf("%q: %v, want a dimension error", src, err)
		}
	}
}

// dimTerm is a formula term with the dimension it must have.
type dimTerm struct {
	text string
	dim  quantity.Dim
}

// TestStatementDimensionSeenLater: for random programs of statements
// built from inputs, numbers with units and earlier statements, the
// dimension of every statement is the one worked out by hand, and a later
// statement that names it (alone, in a product, in a sum with itself)
// sees that same dimension.
func TestStatementDimensionSeenLater(t *testing.T) {
	ins := []formula.Input{in("V", quantity.Velocity), in("L", quantity.Length), in("rho", quantity.Density), in("Re", quantity.Dimensionless)}
	consts := []dimTerm{{"9.80665 {m/s^2}", quantity.Acceleration}, {"2.1{m^2}", quantity.Area}, {"1.0034e-6 {m^2/s}", quantity.KinematicViscosity},
		{"101.325 {kPa}", quantity.Pressure}, {"20 {°C}", quantity.Temperature}, {"3", quantity.Dimensionless}, {"0.5 {s}", quantity.Time}}
	rapid.Check(t, func(t *rapid.T) {
		pool := []dimTerm{}
		for _, x := range ins {
			pool = append(pool, dimTerm{x.Name, x.Dim})
		}
		var lines []string
		var want []quantity.Dim
		n := rapid.IntRange(1, 6).Draw(t, "statements")
		for i := range n {
			pick := func(label string) dimTerm {
				if rapid.Bool().Draw(t, label+" is a number") {
					return consts[rapid.IntRange(0, len(consts)-1).Draw(t, label)]
				}
				return pool[rapid.IntRange(0, len(pool)-1).Draw(t, label)]
			}
			a, b := pick("a"), pick("b")
			var e dimTerm
			switch rapid.IntRange(0, 5).Draw(t, "form") {
			case 0:
				e = a
			case 1:
				d, err := a.dim.Mul(b.dim)
				if err != nil {
					t.Skip("exponent overflow")
				}
				e = dimTerm{"(" + a.text + ")*(" + b.text + ")", d}
			case 2:
				d, err := a.dim.Div(b.dim)
				if err != nil {
					t.Skip("exponent overflow")
				}
				e = dimTerm{"(" + a.text + ")/(" + b.text + ")", d}
			case 3:
				d, err := a.dim.Pow(2, 1)
				if err != nil {
					t.Skip("exponent overflow")
				}
				e = dimTerm{"(" + a.text + ")^2", d}
			case 4:
				e = dimTerm{"abs(" + a.text + ") + " + a.text, a.dim}
			default:
				e = dimTerm{"max(" + a.text + ", " + a.text + ")", a.dim}
			}
			name := fmt.Sprintf("s%d", i)
			lines = append(lines, name+" = "+e.text)
			want = append(want, e.dim)
			pool = append(pool, dimTerm{name, e.dim})
		}
		src := strings.Join(lines, "\n")
		p, err := formula.Compile(src, ins...)
		if err != nil {
			t.Fatalf("%q: %v", src, err)
		}
		for i := range n {
			if p.Dim(i) != want[i] {
				t.Fatalf("%q: statement %d is %v, want %v", src, i, p.Dim(i), want[i])
			}
			for _, probe := range []string{"s%d", "s%d * 1", "s%d + s%d", "if(s%d < s%d, s%d, s%d)"} {
				text := src + "\nprobe = " + strings.ReplaceAll(probe, "%d", fmt.Sprint(i))
				q, err := formula.Compile(text, ins...)
				if err != nil {
					t.Fatalf("%q: %v", text, err)
				}
				if got := q.Dim(n); got != want[i] {
					t.Fatalf("%q: a later statement sees s%d as %v, it is %v", text, i, got, want[i])
				}
			}
		}
	})
}
