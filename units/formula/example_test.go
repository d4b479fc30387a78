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
