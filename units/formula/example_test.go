package formula_test

import (
	"fmt"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// A correlation kept as text, compiled against its inputs' dimensions
// and evaluated over a whole column (invented readings).
func Example() {
	p, err := formula.Compile("Nu = 0.023 * Re^0.8 * Pr^0.4", formula.Input{Name: "Re", Dim: quantity.Dimensionless},
		formula.Input{Name: "Pr", Dim: quantity.Dimensionless})
	if err != nil {
		panic(err)
	}
	re := quantity.NewSeries([]float64{1e4, 5e4, 1e5}, quantity.Dimensionless)
	pr := quantity.NewSeries([]float64{7, 7, 7}, quantity.Dimensionless)
	nu := make([]float64, 3)
	if err := p.Evaluator().Series([]quantity.Series{re, pr}, [][]float64{nu}); err != nil {
		panic(err)
	}
	fmt.Printf("%.1f\n", nu)
	// Output:
	// [79.4 287.7 500.9]
}

// A dimension mistake is refused when the text is compiled, with its
// offset and the dimensions involved.
func ExampleCompile() {
	_, err := formula.Compile("dp = P1 - V", formula.Input{Name: "P1", Dim: quantity.Pressure}, formula.Input{Name: "V", Dim: quantity.Velocity})
	fmt.Println(err)
	// Output:
	// formula "dp = P1 - V": at 8: cannot subtract pressure, stress [Pa] and velocity [m/s]
}

// Derived channels in order, and a number with a unit.
func ExampleProgram_Outputs() {
	p, err := formula.Compile("dp = P1 - P2\nh = dp / (rho * 9.80665 {m/s^2})",
		formula.Input{Name: "P1", Dim: quantity.Pressure}, formula.Input{Name: "P2", Dim: quantity.Pressure},
		formula.Input{Name: "rho", Dim: quantity.Density})
	if err != nil {
		panic(err)
	}
	out, _ := p.Evaluator().Row([]float64{152000, 101325, 998.2}, make([]float64, 2))
	fmt.Println(p.Outputs(), quantity.KindName(p.Dim(1)))
	fmt.Printf("dp = %.0f Pa, h = %.3f m\n", out[0], out[1])
	// Output:
	// [dp h] length
	// dp = 50675 Pa, h = 5.177 m
}

// A result that is not finite is refused, with the row and the statement
// it appears in: here a depth of zero in a Froude number (invented
// open-channel readings). By the explicit option MarkMissing the result
// is NaN, the mark of a missing value, and counted instead.
func ExampleEvaluator_SetCheck() {
	p, err := formula.Compile("g = 9.80665 {m/s^2}\nFr = V/sqrt(g*h)",
		formula.Input{Name: "V", Dim: quantity.Velocity}, formula.Input{Name: "h", Dim: quantity.Length})
	if err != nil {
		panic(err)
	}
	cols := []quantity.Series{quantity.NewSeries([]float64{1.2, 1.5, 1.1}, quantity.Velocity),
		quantity.NewSeries([]float64{0.30, 0, 0.25}, quantity.Length)}
	out := [][]float64{make([]float64, 3), make([]float64, 3)}
	ev := p.Evaluator()
	fmt.Println(ev.Series(cols, out))
	ev.SetCheck(formula.MarkMissing)
	if err := ev.Series(cols, out); err != nil {
		panic(err)
	}
	fmt.Printf("Fr = %.3f, %d marked missing\n", out[1], ev.Marked(1))
	// Output:
	// formula "g = 9.80665 {m/s^2}\nFr = V/sqrt(g*h)": row 2, statement 2 (counting from 1): Fr is +Inf, not finite: at 26: division by zero
	// Fr = [0.700 NaN 0.703], 1 marked missing
}

// Example_solve solves the Colebrook–White equation, written as
// published, for the Darcy friction factor of a pipe at Re = 10⁵ and
// ε/D = 10⁻⁴ (scipy's brentq gives 0.0185139 for the same equation).
func Example_solve() {
	p, err := formula.Compile("f = solve(f, 1/sqrt(f) = -2*log10(eps/(3.7*D) + 2.51/(Re*sqrt(f))), 0.005, 0.1)",
		formula.Input{Name: "Re", Dim: quantity.Dimensionless}, formula.Input{Name: "eps", Dim: quantity.Length}, formula.Input{Name: "D", Dim: quantity.Length})
	if err != nil {
		fmt.Println(err)
		return
	}
	out, err := p.Evaluator().Row([]float64{1e5, 10e-6, 0.1}, make([]float64, 1))
	fmt.Printf("f = %.6f %v\n", out[0], err)
	// Output: f = 0.018514 <nil>
}
