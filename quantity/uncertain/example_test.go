package uncertain_test

import (
	"fmt"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// Two pressure transducers across a flow restrictor (an invented rig) were
// calibrated against the same dead-weight standard, whose uncertainty
// (standard, 0.02 % of reading) therefore enters both readings alike. The
// pressure drop is known better than either reading: the standard's part
// nearly cancels, leaving the readings' own repeatability. By hand:
// u(P1) = √((0.0002·612 kPa)² + (15 Pa)²) = 123.3 Pa; u(Δp) =
// √((0.0002·13.5 kPa)² + 2·(15 Pa)²) = 21.4 Pa.
func ExampleSet_Measure() {
	set := uncertain.NewSet()
	std := set.MustAdd(uncertain.Source{Name: "dead-weight standard", U: quantity.Scalar(0.0002), Relative: true, Effect: uncertain.Systematic})
	r1 := set.MustAdd(uncertain.Source{Name: "P1 repeatability", U: quantity.New(15, quantity.Pressure), Type: uncertain.TypeA, DoF: 29})
	r2 := set.MustAdd(uncertain.Source{Name: "P2 repeatability", U: quantity.New(15, quantity.Pressure), Type: uncertain.TypeA, DoF: 29})
	p1 := set.MustMeasure(quantity.New(612.0e3, quantity.Pressure), std, r1)
	p2 := set.MustMeasure(quantity.New(598.5e3, quantity.Pressure), std, r2)
	dp := p1.Sub(p2)
	fmt.Printf("u(P1) = %.0f Pa, u(P2) = %.0f Pa\n", p1.U().Value(), p2.U().Value())
	fmt.Printf("Δp = %.0f Pa, u(Δp) = %.1f Pa (treating P1, P2 as independent: %.0f Pa)\n",
		dp.Value(), dp.U().Value(), quantity.Hypot(p1.U(), p2.U()).Value())
	// Output:
	// u(P1) = 123 Pa, u(P2) = 121 Pa
	// Δp = 13500 Pa, u(Δp) = 21.4 Pa (treating P1, P2 as independent: 173 Pa)
}

// The budget of a model-scale resistance coefficient C_T = R/(½ρV²S) from
// an invented towing-tank run: which measurement dominates, the effective
// degrees of freedom and the expanded uncertainty at 95 %. By hand:
// C_T = 31.2/(½·999·1.8²·4.2) = 0.004590; relative parts 0.08/31.2 =
// 0.256 %, 2·0.1 % (V²), 0.2 % (S), 0.05/31.2 = 0.160 %, 0.1/999 = 0.010 %,
// root-sum-square 0.414 %.
func ExampleMeasured_Budget() {
	set := uncertain.NewSet()
	ur := set.MustAdd(uncertain.Source{Name: "dynamometer calibration", U: quantity.New(0.05, quantity.Force), Effect: uncertain.Systematic})
	rr := set.MustAdd(uncertain.Source{Name: "resistance repeatability", U: quantity.New(0.08, quantity.Force), Type: uncertain.TypeA, DoF: 9})
	uv := set.MustAdd(uncertain.Source{Name: "carriage speed", U: quantity.Scalar(0.001), Relative: true, Dist: uncertain.Rectangular, Effect: uncertain.Systematic})
	us := set.MustAdd(uncertain.Source{Name: "wetted area", U: quantity.Scalar(0.002), Relative: true, Effect: uncertain.Systematic})
	urho := set.MustAdd(uncertain.Source{Name: "density (temperature)", U: quantity.New(0.1, quantity.Density), Effect: uncertain.Systematic})

	r := set.MustMeasure(quantity.New(31.2, quantity.Force), ur, rr)
	v := set.MustMeasure(quantity.New(1.8, quantity.Velocity), uv)
	s := set.MustMeasure(quantity.New(4.2, quantity.Area), us)
	rho := set.MustMeasure(quantity.New(999.0, quantity.Density), urho)
	ct := r.Div(rho.Mul(v).Mul(v).Mul(s).Scale(0.5))
	b, _ := ct.Budget("C_T", 0.95)
	fmt.Print(b)
	// Output:
	// C_T = 0.004590, u_c = 0.000019 (0.41 %), ν_eff = 61, k = 2.00, U(95 %) = 0.000038
	// systematic part 0.000015, random part 0.000012
	// source                    type       distribution  effect            u(source)                 c  contribution  % of u_c²
	// resistance repeatability  A (ν = 9)  t             random              0.080 N      0.000147 1/N      0.000012       38.3
	// carriage speed            B          rectangular   systematic  0.10 % of value          -0.00918     0.0000092       23.3
	// wetted area               B          normal        systematic  0.20 % of value          -0.00459     0.0000092       23.3
	// dynamometer calibration   B          normal        systematic          0.050 N      0.000147 1/N     0.0000074       15.0
	// density (temperature)     B          normal        systematic       0.10 kg/m³  -4.59×10⁻⁶ m³/kg    0.00000046        0.1
}

// A Monte Carlo check of a first-order result (JCGM 101:2008): the
// friction velocity u_τ = √(τ_w/ρ) with an invented wall shear stress.
func ExampleMonteCarlo() {
	set := uncertain.NewSet()
	ut := set.MustAdd(uncertain.Source{Name: "wall shear stress", U: quantity.New(0.04, quantity.Pressure), Dist: uncertain.Rectangular})
	urho := set.MustAdd(uncertain.Source{Name: "density", U: quantity.New(0.005, quantity.Density)})
	in := []uncertain.Measured{
		set.MustMeasure(quantity.New(1.6, quantity.Pressure), ut),
		set.MustMeasure(quantity.New(1.204, quantity.Density), urho),
	}
	model := func(x []uncertain.Measured) uncertain.Measured { return x[0].Div(x[1]).Sqrt() }
	b, _ := model(in).Budget("u_τ", 0.95)
	mc, _ := uncertain.MonteCarlo(in, model, 200_000, 0.95, 1)
	fmt.Printf("first order: %.4f ± %.4f m/s (95 %%)\n", b.Value.Value(), b.Expanded.Value())
	fmt.Printf("Monte Carlo: [%.4f, %.4f] m/s\n", mc.Low.Value(), mc.High.Value())
	fmt.Println("validated:", b.Validate(mc, 1).Validated)
	// Output:
	// first order: 1.1528 ± 0.0286 m/s (95 %)
	// Monte Carlo: [1.1281, 1.1770] m/s
	// validated: true
}

// A measured value prints with its standard uncertainty to two
// significant digits and the estimate to the same decimal place (GUM
// §7.2.6), in the derived unit's name with a prefix where the value is
// large. An invented model resistance of 138 434.1 N with u = 832.6 N:
// u rounds to 0.83 kN, so the value is stated to 0.01 kN.
func ExampleMeasured_String() {
	set := uncertain.NewSet()
	cal := set.MustAdd(uncertain.Source{Name: "dynamometer", U: quantity.New(832.6328569252115, quantity.Force)})
	r := set.MustMeasure(quantity.New(138434.1051208327, quantity.Force), cal)
	fmt.Println(r)
	v := set.MustMeasure(quantity.New(1.23412, quantity.Velocity), set.MustAdd(uncertain.Source{Name: "carriage", U: quantity.New(0.01234, quantity.Velocity)}))
	fmt.Println(v)
	// Output:
	// 138.43 kN ± 0.83 kN
	// 1.234 m/s ± 0.012 m/s
}
