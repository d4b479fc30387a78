package reduction_test

import (
	"fmt"
	"strings"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
)

// A Go harness reduces an INVENTED towing log in a few lines: two runs
// labelled 1 and 2, a zero under label 9, the dynamometer tared, ρ and ν
// of the tank water from its temperature, and the groups with their
// uncertainty.
func Example() {
	log := `# INVENTED: a short towing log, 4 samples a run
run [1],V [m/s],F [N],T_w [°C]
9,0,0.5,18
9,0,0.7,18
9,0,0.5,18
9,0,0.7,18
1,1.9,10.6,18
1,2.1,10.4,18
1,1.9,10.6,18
1,2.1,10.4,18
2,2.95,20.6,18
2,3.05,20.8,18
2,2.95,20.6,18
2,3.05,20.8,18
`
	src, err := chanfile.NewReader(strings.NewReader(log), "towing.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	problem := pigroups.MustProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
	)
	set, _ := problem.PiSet("rho", "V", "L")
	zero := reduction.Run("run", 4, 9)
	spec := &reduction.Spec{
		Derive: "rho = rho_water(T_w); nu = nu_water(T_w); L = 2 {m}",
		Funcs:  fluids.FormulaFuncs(),
		Points: reduction.Runs("run", 4, 9),
		Zero:   &zero,
		Tare:   []string{"F"},
		Set:    set.WithConventional(),
	}
	res, err := spec.Reduce(reduction.Input{Name: "towing.csv", Source: src})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, p := range res.Points {
		v, _ := p.Value("V")
		f, _ := p.Value("F")
		fmt.Printf("%s: V = %v, F = %v, %s = %.4e ± %.1e\n", p.Tag, v.Mean, f.Mean,
			res.Groups[1].Column, p.Groups[1].Value(), p.Groups[1].U().Value())
	}
	// Re = V·L/ν: 2 m/s · 2 m / 1.0547e-6 m²/s (nu_water at 18 °C) = 3.7924e6, with
	// u_rel(Re) = u_rel(V) = 0.058/2.0; F tared: 10.5 − 0.6 = 9.9 N (see TestHandCase).
	// Output:
	// run 1: V = 2.000 m/s ± 0.058 m/s, F = 9.900 N ± 0.082 N, Re = 3.7924e+06 ± 1.1e+05
	// run 2: V = 3.000 m/s ± 0.029 m/s, F = 20.100 N ± 0.082 N, Re = 5.6886e+06 ± 5.5e+04
}
