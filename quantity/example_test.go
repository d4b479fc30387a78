package quantity_test

import (
	"errors"
	"fmt"

	"similis.dev/similis/quantity"
)

// The error model: a formula bug panics at once with an *Error of class
// ErrDimension; values from input are checked first; user formulas run
// under Eval.
func Example() {
	rho := quantity.New(998.2, quantity.Density) // water at 20 °C
	v := quantity.New(2.0, quantity.Velocity)
	d := quantity.New(0.05, quantity.Length)
	mu := quantity.New(1.0016e-3, quantity.DynamicViscosity)

	re := rho.Mul(v).Mul(d).Div(mu)
	fmt.Printf("Re = %.4g (%s)\n", re.Value(), re.Dim())

	// A viscosity read from a file turns out to be kinematic.
	fromFile := quantity.New(1.0034e-6, quantity.KinematicViscosity)
	if err := fromFile.CheckNamed("μ", quantity.DynamicViscosity); err != nil {
		fmt.Println(err)
	}

	// A user's formula that adds a pressure to a velocity.
	_, err := quantity.Eval(func() quantity.Quantity {
		return quantity.New(101325, quantity.Pressure).Add(v)
	})
	fmt.Println(errors.Is(err, quantity.ErrDimension), err)
	// Output:
	// Re = 9.966e+04 (1)
	// μ: want dynamic viscosity [Pa·s], got kinematic viscosity, thermal diffusivity, diffusion coefficient [m²·s⁻¹]
	// true cannot add pressure, stress [Pa] and velocity [m·s⁻¹]
}

func ExampleDim() {
	k, _ := quantity.ParseDim("kg m^(-1/2) s^-2") // fracture toughness, MPa·√m
	fmt.Println(k, "|", k.SIUnit(), "|", quantity.KindName(k))
	p, _ := quantity.Force.Div(quantity.Area)
	fmt.Println(p == quantity.Pressure, p.SIUnitASCII())
	// Output:
	// L^(-1/2) M T⁻² | kg·m^(-1/2)·s⁻² | stress intensity factor
	// true kg m^-1 s^-2
}

func ExampleSeries() {
	rho := quantity.NewSeries([]float64{998, 997, 996}, quantity.Density)
	v := quantity.NewSeries([]float64{1, 2, 3}, quantity.Velocity)
	var q quantity.Series
	q.SetMul(rho, v) // dynamic pressure ½ρV², no allocation once q has grown
	q.SetMul(q, v)
	q.SetScale(q, 0.5)
	fmt.Printf("%.1f\n", q.Values())
	fmt.Println(q.Dim().SIUnit(), q.Max())
	// Output:
	// [499.0 1994.0 4482.0]
	// kg·m⁻¹·s⁻² 4482 Pa
}

func ExampleQuantity_Format() {
	rho := quantity.New(1.225, quantity.Density)
	fmt.Printf("%v | %.2g | %#v | %12.3e|\n", rho, rho, rho, rho)
	// Output:
	// 1.225 kg·m⁻³ | 1.2 kg·m⁻³ | 1.225 kg m^-3 | 1.225e+00 kg·m⁻³|
}

// A force, a pressure and a power print with the SI special names N, Pa
// and W, a dynamic viscosity and a specific heat capacity with the SI's
// compounds of them, and each reads back to the same bits; energy and
// torque share a dimension and print N·m, right for both. A frequency is
// not guessed to be in Hz. For other units, see the units package's
// Printer.
func ExampleQuantity_String() {
	r := quantity.New(138434.1, quantity.Force)
	fmt.Println(r, quantity.New(101325, quantity.Pressure), quantity.New(2.5e6, quantity.Power), quantity.New(12, quantity.Energy))
	mu := quantity.New(0.0010016, quantity.DynamicViscosity)
	fmt.Println(mu, quantity.New(4186, quantity.SpecificHeatCapacity), quantity.New(50, quantity.Frequency))
	back, err := quantity.ParseQuantitySI(mu.String())
	fmt.Println(back == mu, err)
	// Output:
	// 138434.1 N 101325 Pa 2.5e+06 W 12 N·m
	// 0.0010016 Pa·s 4186 J/(kg·K) 50 s⁻¹
	// true <nil>
}

// The Reynolds number of three pipe-flow readings (invented), as the
// Series documentation writes it.
func ExampleSeries_reynolds() {
	rho := quantity.NewSeries([]float64{998.2, 998.2, 997.0}, quantity.Density)
	v := quantity.NewSeries([]float64{0.5, 1.0, 2.0}, quantity.Velocity)
	d := quantity.NewSeries([]float64{0.05, 0.05, 0.05}, quantity.Length)
	mu := quantity.NewSeries([]float64{1.002e-3, 1.002e-3, 0.890e-3}, quantity.DynamicViscosity)
	var re quantity.Series
	re.SetMul(rho, v)
	re.SetMul(re, d)
	re.SetDiv(re, mu) // ρVD/μ
	fmt.Printf("%.0f %v\n", re.Values(), re.Dim().IsDimensionless())
	// Output:
	// [24905 49810 112022] true
}
