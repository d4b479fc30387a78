package similarity_test

import (
	"fmt"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Froude scaling of a 1:25 model in the same water: every ratio as an
// exact law, then its value.
func ExampleFroude() {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		panic(err)
	}
	for _, d := range []quantity.Dim{quantity.Velocity, quantity.Time, quantity.Force, quantity.Power, quantity.VolumeFlowRate} {
		r, _ := s.DerivedRatio(d)
		fmt.Printf("%-16s %s\n", quantity.KindName(d), r)
	}
	// Output:
	// velocity         λ_L^(1/2) = 0.2
	// time             λ_L^(1/2) = 0.2
	// force            λ_L³ = 6.4e-05
	// power            λ_L^(7/2) = 1.28e-05
	// volume flow rate λ_L^(5/2) = 0.00032
}

// The Froude and Reynolds numbers cannot both be held with the same water
// and gravity.
func ExamplePlan_Solve() {
	p := pigroups.MustProblem(
		pigroups.Var("V", quantity.Velocity), pigroups.Var("L", quantity.Length), pigroups.Var("g", quantity.Acceleration),
		pigroups.Var("rho", quantity.Density), pigroups.Var("mu", quantity.DynamicViscosity))
	_, err := similarity.NewPlan(p).
		HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/25).
		Solve()
	ce := similarity.ConflictOf(err)
	fmt.Println(ce.Summary)
	for _, r := range ce.Remedies {
		fmt.Println(r)
	}
	// Output:
	// holding the Froude number and the Reynolds number with the same fluid and the same gravity forces λ_L to 1, against a length scale of 1:25
	// without the Froude number: the Froude number would float, Fr model/prototype = λ_L^(-3/2) = 125 (Fr²: λ_L⁻³ = 15625)
	// without the Reynolds number: the Reynolds number would float, Re model/prototype = λ_L^(3/2) = 0.008
	// without the same fluid: λ_rho = λ_mu·λ_L^(-3/2); λ_mu free; ν_m/ν_p = λ_L^(3/2) = 0.008 — ν_m/ν_p = 0.008: with a prototype in water at 20 °C (1.00e-06 m²/s) the model fluid would need 8.03e-09 m²/s, below every practical test liquid, which reach down to a few ×10⁻⁷ m²/s (common practice)
	// without the same gravity: λ_g = λ_L⁻³ = 15625 — λ_g ≠ 1 cannot be met: no tank, flume or tunnel changes gravity (common practice; only a centrifuge raises it)
	// without a length scale of 1:25: λ_L to 1
}

// Carry a measured model force to full scale.
func ExampleSolution_ToPrototype() {
	s, _ := similarity.Froude(similarity.Scales{Length: 1.0 / 30, Density: 1})
	fm := quantity.New(12.5, quantity.Force) // invented model reading, N
	fp, _ := s.ToPrototype(fm)
	fmt.Printf("%.4g N\n", fp.Value())
	// Output:
	// 3.375e+05 N
}

// After a conflict there is no solution; the report lays out the conflict
// and its remedies, and with the prototype's fluid (invented: sea water
// of about 15 °C) what each remedy would ask of the model fluid.
func ExampleNewReport_conflict() {
	p := pigroups.MustProblem(
		pigroups.Var("V", quantity.Velocity), pigroups.Var("L", quantity.Length), pigroups.Var("g", quantity.Acceleration),
		pigroups.Var("rho", quantity.Density), pigroups.Var("mu", quantity.DynamicViscosity))
	_, err := similarity.NewPlan(p).
		HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/25).
		Solve()
	ce := similarity.ConflictOf(err)
	r, err := similarity.NewReport(nil, similarity.ReportOptions{Title: "Hull 1:25", Conflict: ce,
		Prototype: map[string]quantity.Quantity{"rho": quantity.New(1025, quantity.Density), "mu": quantity.New(1.22e-3, quantity.DynamicViscosity)}})
	if err != nil {
		panic(err)
	}
	fmt.Print(r.Text())
	// Output:
	// Hull 1:25
	// =========
	//
	// note: conflict: holding the Froude number and the Reynolds number with the same fluid and the same gravity forces λ_L to 1, against a length scale of 1:25
	// note:   without the Froude number: the Froude number would float, Fr model/prototype = λ_L^(-3/2) = 125 (Fr²: λ_L⁻³ = 15625)
	// note:   without the Reynolds number: the Reynolds number would float, Re model/prototype = λ_L^(3/2) = 0.008
	// note:   without the same fluid: λ_rho = λ_mu·λ_L^(-3/2); λ_mu free; ν_m/ν_p = λ_L^(3/2) = 0.008
	// note:     the model fluid would need a kinematic viscosity of 9.52e-09 m²/s (ν_m/ν_p = 0.008, prototype 1.19e-06 m²/s; water at 20 °C has 1.00e-06 m²/s, air at 20 °C and 101.325 kPa 1.51e-05 m²/s): below every practical test liquid, which reach down to a few ×10⁻⁷ m²/s (common practice)
	// note:   without the same gravity: λ_g = λ_L⁻³ = 15625 — λ_g ≠ 1 cannot be met: no tank, flume or tunnel changes gravity (common practice; only a centrifuge raises it)
	// note:   without a length scale of 1:25: λ_L to 1
	//
	// CAUTION: Model-test predictions are estimates subject to scale effects. Hydraulic structures, hulls and pressure vessels are designed to the applicable local codes and checked by licensed engineers.
}
