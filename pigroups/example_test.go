package pigroups_test

import (
	"fmt"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// Drag on a sphere: two groups from the repeating set ρ, V, D.
func Example() {
	p, err := pigroups.NewProblem(
		pigroups.Dep("F", quantity.Force).WithKind("force"),
		pigroups.Var("ρ", quantity.Density),
		pigroups.Var("V", quantity.Velocity),
		pigroups.Var("D", quantity.Length),
		pigroups.Var("μ", quantity.DynamicViscosity),
	)
	if err != nil {
		panic(err)
	}
	s, err := p.PiSet("ρ", "V", "D")
	if err != nil {
		panic(err)
	}
	fmt.Print(p.MatrixTable())
	fmt.Print(s)
	// Output:
	//      F   ρ   V  D   μ
	//  L   1  -3   1  1  -1
	//  M   1   1   0  0   1
	//  T  -2   0  -1  0  -1
	// rank 3, 5 variables, 2 groups
	// Π₁ = F/(ρ·V²·D²)   ∝C_D (proportional to the drag coefficient; C_D = F/(½·ρ·V²·A), A the reference area, and D² stands in for the reference area A: C_D = 2·Π₁·D²/A)
	// Π₂ = μ/(ρ·V·D)   1/Re (Reynolds number; conventional form Re)
}

// A repeating set that is not independent is refused with the group its
// members form.
func ExampleProblem_CheckRepeating() {
	p := pigroups.MustProblem(
		pigroups.Dep("T", quantity.Torque),
		pigroups.VarKind("ω", quantity.AngularVelocity, "rotational speed"),
		pigroups.Var("V", quantity.Velocity),
		pigroups.Var("D", quantity.Length),
		pigroups.Var("ρ", quantity.Density),
	)
	fmt.Println(p.CheckRepeating("ω", "V", "D"))
	def, _ := p.DefaultRepeating()
	fmt.Println(def)
	// Output:
	// pigroups: repeating set {ω, V, D}: repeating variables not independent; no repeating variable carries M; they form the dimensionless group ω*D/V among themselves
	// [V D ρ]
}

// Capillary rise: M and T occur only as M T⁻², so the rank is 2.
func ExampleProblem_RankNote() {
	p := pigroups.MustProblem(
		pigroups.Dep("h", quantity.Length),
		pigroups.Var("σ", quantity.SurfaceTension),
		pigroups.Var("ρg", quantity.SpecificWeight),
		pigroups.Var("d", quantity.Length),
	)
	fmt.Println(p.RankNote())
	// Output:
	// the rank is 2, less than the 3 base dimensions that appear (L, M, T): every variable's dimension is a product of powers of L and M T⁻², and only 2 combinations of the base dimensions are independent; so there are 2 groups (4 variables less the rank 2), where counting base dimensions would give 1 group
}

// Fit a power law to invented bench data.
func ExampleFitPowerLaw() {
	re := []float64{2e4, 5e4, 1e5, 2e5, 5e5, 1e6}
	nu := []float64{78.1, 161.6, 270.8, 477.2, 998.6, 1708.3} // invented readings
	f, err := pigroups.FitPowerLaw(nu, [][]float64{re}, nil)
	if err != nil {
		panic(err)
	}
	fmt.Printf("Nu = %.3f·Re^%.3f, exponent 95%% CI [%.3f, %.3f], R² = %.4f\n",
		f.C, f.Exponents[0], f.Intervals[0][0], f.Intervals[0][1], f.R2)
	// Output:
	// Nu = 0.031·Re^0.790, exponent 95% CI [0.778, 0.802], R² = 0.9999
}

// A group is a product of powers of its variables: Product gives it as a
// quantity.Product, which Format writes, and NewGroup reads back.
func ExampleGroup_Product() {
	p := pigroups.MustProblem(
		pigroups.Dep("Δp", quantity.Pressure),
		pigroups.Var("ρ", quantity.Density),
		pigroups.Var("V", quantity.Velocity),
		pigroups.Var("D", quantity.Length),
		pigroups.Var("μ", quantity.DynamicViscosity),
	)
	s, err := p.PiSet("ρ", "V", "D")
	if err != nil {
		panic(err)
	}
	re := s.Groups()[1].Conventional()
	prod := re.Product()
	for _, f := range prod {
		fmt.Printf("%s^%v\n", f.Name, f.Exp)
	}
	fmt.Println(prod.Format(quantity.Unicode, quantity.Fraction, ""), "=", re.Format(quantity.Unicode), "=", re.Label())
	back, err := p.NewGroup("Re", prod)
	if err != nil {
		panic(err)
	}
	fmt.Println(back, back.Label())
	// Output:
	// ρ^1
	// V^1
	// D^1
	// μ^-1
	// ρ·V·D/μ = ρ·V·D/μ = Re
	// ρ*V*D/μ Re
}
