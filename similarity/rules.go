package similarity

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// Rules of similitude, ready for other programs: each solves a standard
// plan exactly and returns the Solution, whose Ratio, DerivedRatio and
// transfer methods give every scale. Ratios are model/prototype.

// free-surface and fluid-flow variables used by the rules.
func stdVars() []pigroups.Variable {
	return []pigroups.Variable{
		pigroups.VarKind("V", quantity.Velocity, "velocity"),
		pigroups.VarKind("L", quantity.Length, "length"),
		pigroups.VarKind("g", quantity.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", quantity.Density, "density"),
		pigroups.VarKind("mu", quantity.DynamicViscosity, "dynamic viscosity"),
	}
}

// Scales are model/prototype ratios given by name, so that a rule cannot
// take one for another: Froude(Scales{Length: 1.0 / 25, Density: 1}).
// Each rule says which it needs; a needed ratio that is zero, negative or
// not finite is an error naming it, and so is a ratio the rule does not
// use (it would otherwise be silently ignored).
type Scales struct {
	Length             float64 // λ_L
	Density            float64 // λ_ρ: 1 for the same fluid
	KinematicViscosity float64 // λ_ν
	SpeedOfSound       float64 // λ_a
	SurfaceTension     float64 // λ_σ
	Velocity           float64 // λ_V
}

// need checks that s gives exactly the named ratios, each positive and
// finite, for the rule named.
func (s Scales) need(rule string, names ...string) error {
	all := []struct {
		name string
		v    float64
	}{{"Length", s.Length}, {"Density", s.Density}, {"KinematicViscosity", s.KinematicViscosity}, {"SpeedOfSound", s.SpeedOfSound},
		{"SurfaceTension", s.SurfaceTension}, {"Velocity", s.Velocity}}
	for _, f := range all {
		needed := slices.Contains(names, f.name)
		switch {
		case needed && (!(f.v > 0) || math.IsInf(f.v, 0)):
			hint := ""
			if f.name == "Density" {
				hint = " (1 for the same fluid)"
			}
			return planError(rule, f.name, ErrBadRatio, fmt.Sprintf("%s needs Scales.%s%s, a positive and finite model/prototype ratio; got %v", rule, f.name, hint, f.v))
		case !needed && f.v != 0:
			return planError(rule, f.name, ErrBadRatio, fmt.Sprintf("%s does not use Scales.%s (it takes %s)", rule, f.name, strings.Join(names, ", ")))
		}
	}
	return nil
}

// fixed is one ratio a rule fixes: the variable's symbol and its value.
type fixed struct {
	sym   string
	ratio float64
}

// solve checks that s gives exactly the ratios the rule needs, then
// solves the plan over vars that holds the one group (its exponents by
// symbol) with the fixed ratios, on the given basis.
func (s Scales) solve(rule string, need []string, vars []pigroups.Variable, group string, exps map[string]int, fix []fixed, basis ...string) (*Solution, error) {
	if err := s.need(rule, need...); err != nil {
		return nil, err
	}
	pl := NewPlan(pigroups.MustProblem(vars...)).HoldExps(group, exps)
	for _, f := range fix {
		pl.Fix(f.sym, f.ratio)
	}
	return pl.Basis(basis...).Solve()
}

// Froude scaling: the Froude number V/√(gL) held, the same gravity, and a
// density ratio (1 for the same fluid). λ_V = λ_L^(1/2), λ_t = λ_L^(1/2),
// λ_F = λ_ρ·λ_L³, λ_P = λ_ρ·λ_L^(7/2), λ_Q = λ_L^(5/2). The Reynolds
// number floats: with the same fluid its ratio is λ_L^(3/2).
//
// It takes Scales.Length and Scales.Density. The Solution's variables,
// the symbols its Ratio takes, are V (velocity), L (length), g
// (gravitational acceleration), rho (density) and mu (dynamic viscosity);
// the basis of DerivedRatio is V, L, rho.
func Froude(s Scales) (*Solution, error) {
	if err := s.need("Froude", "Length", "Density"); err != nil {
		return nil, err
	}
	lengthRatio, densityRatio := s.Length, s.Density
	p := pigroups.MustProblem(stdVars()...)
	pl := NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		SameGravity("g").Fix("L", lengthRatio).Basis("V", "L", "rho")
	if densityRatio == 1 {
		pl.SameFluid("rho", "mu")
	} else {
		pl.Fix("rho", densityRatio)
	}
	return pl.Solve()
}

// Reynolds scaling: the Reynolds number VL/ν held for given length and
// kinematic-viscosity ratios: λ_V = λ_ν/λ_L, λ_t = λ_L²/λ_ν.
// It takes Scales.Length, Scales.KinematicViscosity and Scales.Density.
// The Solution's variables, the symbols its Ratio takes, are V
// (velocity), L (length), rho (density) and nu (kinematic viscosity); the
// basis of DerivedRatio is V, L, rho.
func Reynolds(s Scales) (*Solution, error) {
	return s.solve("Reynolds", []string{"Length", "Density", "KinematicViscosity"},
		[]pigroups.Variable{pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("L", quantity.Length, "length"),
			pigroups.VarKind("rho", quantity.Density, "density"), pigroups.VarKind("nu", quantity.KinematicViscosity, "kinematic viscosity")},
		"the Reynolds number", map[string]int{"V": 1, "L": 1, "nu": -1},
		[]fixed{{"L", s.Length}, {"nu", s.KinematicViscosity}, {"rho", s.Density}}, "V", "L", "rho")
}

// Mach scaling: the Mach number V/a held: λ_V = λ_a, for given length,
// speed-of-sound and density ratios.
// It takes Scales.Length, Scales.SpeedOfSound and Scales.Density. The
// Solution's variables, the symbols its Ratio takes, are V (velocity), a
// (speed of sound), L (length) and rho (density); the basis of
// DerivedRatio is V, L, rho.
func Mach(s Scales) (*Solution, error) {
	return s.solve("Mach", []string{"Length", "Density", "SpeedOfSound"},
		[]pigroups.Variable{pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("a", quantity.Velocity, "speed of sound"),
			pigroups.VarKind("L", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density")},
		"the Mach number", map[string]int{"V": 1, "a": -1},
		[]fixed{{"L", s.Length}, {"a", s.SpeedOfSound}, {"rho", s.Density}}, "V", "L", "rho")
}

// Weber scaling: ρV²L/σ held: λ_V = (λ_σ/(λ_ρ·λ_L))^(1/2).
// It takes Scales.Length, Scales.Density and Scales.SurfaceTension. The
// Solution's variables, the symbols its Ratio takes, are V (velocity), L
// (length), rho (density) and sigma (surface tension); the basis of
// DerivedRatio is V, L, rho.
func Weber(s Scales) (*Solution, error) {
	return s.solve("Weber", []string{"Length", "Density", "SurfaceTension"},
		[]pigroups.Variable{pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("L", quantity.Length, "length"),
			pigroups.VarKind("rho", quantity.Density, "density"), pigroups.VarKind("sigma", quantity.SurfaceTension, "surface tension")},
		"the Weber number", map[string]int{"rho": 1, "V": 2, "L": 1, "sigma": -1},
		[]fixed{{"L", s.Length}, {"rho", s.Density}, {"sigma", s.SurfaceTension}}, "V", "L", "rho")
}

// Euler scaling: Δp/(ρV²) held (also the cavitation number
// (p − p_v)/(½ρV²) when p is the pressure above vapour pressure):
// λ_p = λ_ρ·λ_V².
// It takes Scales.Length, Scales.Density and Scales.Velocity. The
// Solution's variables, the symbols its Ratio takes, are p (the pressure
// difference), V (velocity), L (length) and rho (density); the basis of
// DerivedRatio is V, L, rho.
func Euler(s Scales) (*Solution, error) {
	return s.solve("Euler", []string{"Length", "Density", "Velocity"},
		[]pigroups.Variable{pigroups.VarKind("p", quantity.Pressure, "pressure difference"), pigroups.VarKind("V", quantity.Velocity, "velocity"),
			pigroups.VarKind("L", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density")},
		"the Euler number", map[string]int{"p": 1, "rho": -1, "V": -2},
		[]fixed{{"L", s.Length}, {"rho", s.Density}, {"V", s.Velocity}}, "V", "L", "rho")
}

// Strouhal scaling: fL/V held: λ_f = λ_V/λ_L, for frequencies of vortex
// shedding and other unsteady flow.
// It takes Scales.Length and Scales.Velocity. The Solution's variables,
// the symbols its Ratio takes, are f (frequency), V (velocity) and L
// (length); the basis of DerivedRatio is V, L.
func Strouhal(s Scales) (*Solution, error) {
	return s.solve("Strouhal", []string{"Length", "Velocity"},
		[]pigroups.Variable{pigroups.VarKind("f", quantity.Frequency, "frequency"), pigroups.VarKind("V", quantity.Velocity, "velocity"),
			pigroups.VarKind("L", quantity.Length, "length")},
		"the Strouhal number", map[string]int{"f": 1, "L": 1, "V": -1},
		[]fixed{{"L", s.Length}, {"V", s.Velocity}}, "V", "L")
}
