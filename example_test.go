package similis_test

// The README's tour, one Example per package, so that every snippet there
// compiles and its output is checked.

import (
	"fmt"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/formula"
)

func Example_quantity() {
	rho := quantity.New(998.2, quantity.Density)
	v := quantity.New(2.0, quantity.Velocity)
	d := quantity.New(0.05, quantity.Length)
	mu := quantity.New(1.0016e-3, quantity.DynamicViscosity)
	re := rho.Mul(v).Mul(d).Div(mu)
	fmt.Printf("Re = %.4g, dimensionless: %v\n", re.Value(), re.IsDimensionless())

	nu := quantity.New(1.0034e-6, quantity.KinematicViscosity)
	_, err := quantity.Eval(func() quantity.Quantity { return quantity.Log10(rho.Mul(v).Mul(d).Div(nu)) })
	fmt.Println(err)
	// Output:
	// Re = 9.966e+04, dimensionless: true
	// cannot take the logarithm of density [kg·m⁻³]: the argument must be dimensionless
}

func Example_units() {
	kpa, _ := units.Convert(14.7, "psi", "kPa")
	h, _ := units.Convert(1, "BTU/(h*ft^2*degF)", "W/(m²·K)")
	t, _ := units.ParseQuantity("20 °C")
	fmt.Printf("%.4f kPa, %.6f W/(m²·K), %v\n", kpa, h, t)
	_, err := units.Convert(1500, "rpm", "Hz")
	fmt.Println(err != nil)
	// Output:
	// 101.3529 kPa, 5.678263 W/(m²·K), 293.15 K
	// true
}

func Example_pigroups() {
	p := pigroups.MustProblem(
		pigroups.Dep("Δp", quantity.Pressure).WithKind("pressure difference"),
		pigroups.Var("ρ", quantity.Density), pigroups.Var("V", quantity.Velocity),
		pigroups.Var("D", quantity.Length), pigroups.Var("μ", quantity.DynamicViscosity),
		pigroups.Var("ε", quantity.Length))
	s, _ := p.PiSet("ρ", "V", "D")
	fmt.Print(s)
	// Output:
	// Π₁ = Δp/(ρ·V²)   Eu (Euler number)
	// Π₂ = μ/(ρ·V·D)   1/Re (Reynolds number; conventional form Re)
	// Π₃ = ε/D
}

func Example_coefficients() {
	p := pigroups.MustProblem(
		pigroups.Dep("T", quantity.Force).WithKind("force"),
		pigroups.VarKind("n", quantity.AngularVelocity, "rotational speed"),
		pigroups.VarKind("D", quantity.Length, "length"), pigroups.VarKind("ρ", quantity.Density, "density"))
	s, _ := p.PiSet("n", "D", "ρ")
	fmt.Println(s.Groups()[0].Label()) // the Pi group, n held in rad/s
	kt := s.WithCoefficients()         // the trade's K_T, n in rev/s
	n, _ := units.ParseQuantity("600 rpm")
	row := []quantity.Quantity{quantity.New(200, quantity.Force), n, quantity.New(0.25, quantity.Length), quantity.New(1000, quantity.Density)}
	v, _ := kt.Evaluator().Row(row, make([]float64, 1))
	fmt.Printf("%s = %s = %.4g\n", kt.Groups()[0].Label(), kt.Groups()[0].Format(quantity.Unicode), v[0])
	// Output:
	// K_T/(4π²)
	// K_T = 4π²·T/(n²·D⁴·ρ) = 0.512
}

func Example_similarity() {
	s, _ := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1}) // a 1:25 model in the same water
	for _, d := range []quantity.Dim{quantity.Velocity, quantity.Force, quantity.Power} {
		r, _ := s.DerivedRatio(d)
		fmt.Println(quantity.KindName(d), r)
	}
	// Output:
	// velocity λ_L^(1/2) = 0.2
	// force λ_L³ = 6.4e-05
	// power λ_L^(7/2) = 1.28e-05
}

func Example_formula() {
	p, err := formula.Compile(`Re = rho*V*D/mu
f  = if(Re < 2000, 64/Re, 0.25 / log10(eps/(3.7*D) + 5.74/Re^0.9)^2)
dp = f * L/D * rho*V^2/2`,
		formula.Input{Name: "rho", Dim: quantity.Density}, formula.Input{Name: "V", Dim: quantity.Velocity},
		formula.Input{Name: "D", Dim: quantity.Length}, formula.Input{Name: "mu", Dim: quantity.DynamicViscosity},
		formula.Input{Name: "eps", Dim: quantity.Length}, formula.Input{Name: "L", Dim: quantity.Length})
	if err != nil {
		panic(err)
	}
	col := func(d quantity.Dim, v ...float64) quantity.Series { return quantity.NewSeries(v, d) }
	cols := []quantity.Series{col(quantity.Density, 998.2, 998.2), col(quantity.Velocity, 0.01, 2.5), col(quantity.Length, 0.08, 0.08),
		col(quantity.DynamicViscosity, 1.0016e-3, 1.0016e-3), col(quantity.Length, 4.5e-5, 4.5e-5), col(quantity.Length, 40, 40)}
	out := [][]float64{make([]float64, 2), make([]float64, 2), make([]float64, 2)}
	if err := p.Evaluator().Series(cols, out); err != nil {
		panic(err)
	}
	fmt.Printf("Re %.0f, f %.4f, Δp %.1f Pa\n", out[0][0], out[1][0], out[2][0])
	fmt.Printf("Re %.0f, f %.4f, Δp %.0f Pa\n", out[0][1], out[1][1], out[2][1])
	_, err = formula.Compile("dp = p1 - V", formula.Input{Name: "p1", Dim: quantity.Pressure}, formula.Input{Name: "V", Dim: quantity.Velocity})
	fmt.Println(err)
	// Output:
	// Re 797, f 0.0803, Δp 2.0 Pa
	// Re 199321, f 0.0193, Δp 30040 Pa
	// formula "dp = p1 - V": at 8: cannot subtract pressure, stress [Pa] and velocity [m/s]
}
