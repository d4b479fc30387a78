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
	Speed              float64 // λ_N, a rotational speed
	Diameter           float64 // λ_D, an impeller or rotor diameter
	Horizontal         float64 // λ_x of a distorted model
	Vertical           float64 // λ_z of a distorted model
}

// need checks that s gives exactly the named ratios, each positive and
// finite, for the rule named.
func (s Scales) need(rule string, names ...string) error {
	all := []struct {
		name string
		v    float64
	}{{"Length", s.Length}, {"Density", s.Density}, {"KinematicViscosity", s.KinematicViscosity}, {"SpeedOfSound", s.SpeedOfSound},
		{"SurfaceTension", s.SurfaceTension}, {"Velocity", s.Velocity}, {"Speed", s.Speed}, {"Diameter", s.Diameter},
		{"Horizontal", s.Horizontal}, {"Vertical", s.Vertical}}
	for _, f := range all {
		needed := slices.Contains(names, f.name)
		switch {
		case needed && (!(f.v > 0) || math.IsInf(f.v, 0)):
			hint := ""
			if f.name == "Density" {
				hint = " (1 for the same fluid)"
			}
			return &PlanError{Err: ErrBadRatio, Symbol: f.name, Reason: fmt.Sprintf("%s needs Scales.%s%s, a positive and finite model/prototype ratio; got %v", rule, f.name, hint, f.v)}
		case !needed && f.v != 0:
			return &PlanError{Err: ErrBadRatio, Symbol: f.name, Reason: fmt.Sprintf("%s does not use Scales.%s (it takes %s)", rule, f.name, strings.Join(names, ", "))}
		}
	}
	return nil
}

func checkRatio(name string, r float64) error {
	if !(r > 0) || math.IsInf(r, 0) {
		return &PlanError{Err: ErrBadRatio, Symbol: name, Reason: fmt.Sprintf("%s ratio %v is not positive and finite", name, r)}
	}
	return nil
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
	if err := s.need("Reynolds", "Length", "Density", "KinematicViscosity"); err != nil {
		return nil, err
	}
	lengthRatio, nuRatio, densityRatio := s.Length, s.KinematicViscosity, s.Density
	p := pigroups.MustProblem(
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("L", quantity.Length, "length"),
		pigroups.VarKind("rho", quantity.Density, "density"), pigroups.VarKind("nu", quantity.KinematicViscosity, "kinematic viscosity"))
	return NewPlan(p).HoldExps("the Reynolds number", map[string]int{"V": 1, "L": 1, "nu": -1}).
		Fix("L", lengthRatio).Fix("nu", nuRatio).Fix("rho", densityRatio).Basis("V", "L", "rho").Solve()
}

// Mach scaling: the Mach number V/a held: λ_V = λ_a, for given length,
// speed-of-sound and density ratios.
// It takes Scales.Length, Scales.SpeedOfSound and Scales.Density. The
// Solution's variables, the symbols its Ratio takes, are V (velocity), a
// (speed of sound), L (length) and rho (density); the basis of
// DerivedRatio is V, L, rho.
func Mach(s Scales) (*Solution, error) {
	if err := s.need("Mach", "Length", "Density", "SpeedOfSound"); err != nil {
		return nil, err
	}
	lengthRatio, soundRatio, densityRatio := s.Length, s.SpeedOfSound, s.Density
	p := pigroups.MustProblem(
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("a", quantity.Velocity, "speed of sound"),
		pigroups.VarKind("L", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density"))
	return NewPlan(p).HoldExps("the Mach number", map[string]int{"V": 1, "a": -1}).
		Fix("L", lengthRatio).Fix("a", soundRatio).Fix("rho", densityRatio).Basis("V", "L", "rho").Solve()
}

// Weber scaling: ρV²L/σ held: λ_V = (λ_σ/(λ_ρ·λ_L))^(1/2).
// It takes Scales.Length, Scales.Density and Scales.SurfaceTension. The
// Solution's variables, the symbols its Ratio takes, are V (velocity), L
// (length), rho (density) and sigma (surface tension); the basis of
// DerivedRatio is V, L, rho.
func Weber(s Scales) (*Solution, error) {
	if err := s.need("Weber", "Length", "Density", "SurfaceTension"); err != nil {
		return nil, err
	}
	lengthRatio, densityRatio, tensionRatio := s.Length, s.Density, s.SurfaceTension
	p := pigroups.MustProblem(
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("L", quantity.Length, "length"),
		pigroups.VarKind("rho", quantity.Density, "density"), pigroups.VarKind("sigma", quantity.SurfaceTension, "surface tension"))
	return NewPlan(p).HoldExps("the Weber number", map[string]int{"rho": 1, "V": 2, "L": 1, "sigma": -1}).
		Fix("L", lengthRatio).Fix("rho", densityRatio).Fix("sigma", tensionRatio).Basis("V", "L", "rho").Solve()
}

// Euler scaling: Δp/(ρV²) held (also the cavitation number
// (p − p_v)/(½ρV²) when p is the pressure above vapour pressure):
// λ_p = λ_ρ·λ_V².
// It takes Scales.Length, Scales.Density and Scales.Velocity. The
// Solution's variables, the symbols its Ratio takes, are p (the pressure
// difference), V (velocity), L (length) and rho (density); the basis of
// DerivedRatio is V, L, rho.
func Euler(s Scales) (*Solution, error) {
	if err := s.need("Euler", "Length", "Density", "Velocity"); err != nil {
		return nil, err
	}
	lengthRatio, densityRatio, velocityRatio := s.Length, s.Density, s.Velocity
	p := pigroups.MustProblem(
		pigroups.VarKind("p", quantity.Pressure, "pressure difference"), pigroups.VarKind("V", quantity.Velocity, "velocity"),
		pigroups.VarKind("L", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density"))
	return NewPlan(p).HoldExps("the Euler number", map[string]int{"p": 1, "rho": -1, "V": -2}).
		Fix("L", lengthRatio).Fix("rho", densityRatio).Fix("V", velocityRatio).Basis("V", "L", "rho").Solve()
}

// Cavitation is Euler scaling of the pressure above vapour pressure,
// p − p_v, so that the cavitation number is held. It takes the Scales
// Euler takes, and its Solution has Euler's variables: p (here p − p_v),
// V, L and rho.
func Cavitation(s Scales) (*Solution, error) { return Euler(s) }

// Strouhal scaling: fL/V held: λ_f = λ_V/λ_L, for frequencies of vortex
// shedding and other unsteady flow.
// It takes Scales.Length and Scales.Velocity. The Solution's variables,
// the symbols its Ratio takes, are f (frequency), V (velocity) and L
// (length); the basis of DerivedRatio is V, L.
func Strouhal(s Scales) (*Solution, error) {
	if err := s.need("Strouhal", "Length", "Velocity"); err != nil {
		return nil, err
	}
	lengthRatio, velocityRatio := s.Length, s.Velocity
	p := pigroups.MustProblem(
		pigroups.VarKind("f", quantity.Frequency, "frequency"), pigroups.VarKind("V", quantity.Velocity, "velocity"),
		pigroups.VarKind("L", quantity.Length, "length"))
	return NewPlan(p).HoldExps("the Strouhal number", map[string]int{"f": 1, "L": 1, "V": -1}).
		Fix("L", lengthRatio).Fix("V", velocityRatio).Basis("V", "L").Solve()
}

// Affinity holds the turbomachine flow, head and power coefficients for
// a change of speed and diameter: Q ∝ N·D³, gH ∝ N²·D², P ∝ ρ·N³·D⁵.
// Every ratio is model/prototype, as everywhere in this package; divide a
// model value by it for the prototype.
type Affinity struct {
	Speed, Diameter, Density float64 // λ_N, λ_D, λ_ρ
	Flow, Head, Power        float64 // λ_Q, λ_H (as gH), λ_P
	Torque                   float64 // λ_T = λ_P/λ_N
	// Pressure is the ratio of a fan's (or pump's) pressure rise,
	// λ_Δp = λ_ρ·λ_H: the fan laws with the density of each side, as
	// the fan pressure coefficient ψ_p = Δp/(ρn²D²) held equal gives.
	Pressure float64
}

// AffinityLaws returns the affinity-law ratios, model/prototype, for the
// speed, diameter and density ratios Scales.Speed, Scales.Diameter and
// Scales.Density, from the held coefficients solved exactly (Q/(ND³),
// gH/(N²D²), P/(ρN³D⁵)), over the variables Q (volume flow rate), gH
// (specific energy), P (power), N (rotational speed), D (diameter) and
// rho (density). Efficiency is taken equal; see MoodyStepUp.
func AffinityLaws(sc Scales) (Affinity, error) {
	if err := sc.need("AffinityLaws", "Speed", "Diameter", "Density"); err != nil {
		return Affinity{}, err
	}
	speedRatio, diameterRatio, densityRatio := sc.Speed, sc.Diameter, sc.Density
	p := pigroups.MustProblem(
		pigroups.VarKind("Q", quantity.VolumeFlowRate, "volume flow rate"), pigroups.VarKind("gH", quantity.SpecificEnergy, "specific energy"),
		pigroups.VarKind("P", quantity.Power, "power"), pigroups.VarKind("N", quantity.AngularVelocity, "rotational speed"),
		pigroups.VarKind("D", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density"))
	s, err := NewPlan(p).
		HoldExps("the flow coefficient", map[string]int{"Q": 1, "N": -1, "D": -3}).
		HoldExps("the head coefficient", map[string]int{"gH": 1, "N": -2, "D": -2}).
		HoldExps("the power coefficient", map[string]int{"P": 1, "rho": -1, "N": -3, "D": -5}).
		Fix("N", speedRatio).Fix("D", diameterRatio).Fix("rho", densityRatio).Basis("N", "D", "rho").Solve()
	if err != nil {
		return Affinity{}, err
	}
	v, err := ratioValues(s, "Q", "gH", "P")
	if err != nil {
		return Affinity{}, err
	}
	a := Affinity{Speed: speedRatio, Diameter: diameterRatio, Density: densityRatio, Flow: v[0], Head: v[1], Power: v[2]}
	a.Torque = a.Power / a.Speed
	a.Pressure = a.Density * a.Head
	if err := finiteRatios("torque", a.Torque, "pressure", a.Pressure); err != nil {
		return Affinity{}, err
	}
	return a, nil
}

// Distorted is a distorted Froude model of a river or harbour, with a
// horizontal length ratio and a larger vertical one.
type Distorted struct {
	Horizontal, Vertical float64 // λ_x, λ_z
	Distortion           float64 // λ_z/λ_x, the vertical exaggeration (4 for 1:200 across and 1:50 deep)
	Velocity             float64 // λ_V = λ_z^(1/2)
	Time                 float64 // λ_t = λ_x/λ_z^(1/2), along the flow
	Discharge            float64 // λ_Q = λ_x·λ_z^(3/2)
	Area                 float64 // plan area λ_x²
	Slope                float64 // λ_S = λ_z/λ_x
	Manning              float64 // λ_n = λ_z^(2/3)/λ_x^(1/2)
	solution             *Solution
}

// DistortedFroude returns the ratios of a distorted Froude model: the
// Froude number held on the vertical scale (V²/(g·z)), the same gravity,
// the horizontal scale fixed separately. Manning's n follows from holding
// friction slope equal to bed slope: n ∝ z^(2/3)·S^(1/2)/V.
//
// It takes Scales.Horizontal and Scales.Vertical. The plan behind it
// (Distorted.Solution) has the variables V (velocity), x (horizontal
// length), z (vertical length), g (gravitational acceleration), t (time)
// and Q (volume flow rate); the basis of DerivedRatio is V, x.
func DistortedFroude(sc Scales) (Distorted, error) {
	if err := sc.need("DistortedFroude", "Horizontal", "Vertical"); err != nil {
		return Distorted{}, err
	}
	horizontal, vertical := sc.Horizontal, sc.Vertical
	p := pigroups.MustProblem(
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("x", quantity.Length, "length"),
		pigroups.VarKind("z", quantity.Length, "length"), pigroups.VarKind("g", quantity.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("t", quantity.Time, "time"), pigroups.VarKind("Q", quantity.VolumeFlowRate, "volume flow rate"))
	s, err := NewPlan(p).
		HoldExps("the Froude number on depth", map[string]int{"V": 2, "g": -1, "z": -1}).
		HoldExps("the kinematics along the flow", map[string]int{"V": 1, "t": 1, "x": -1}).
		HoldExps("the discharge through a section", map[string]int{"Q": 1, "V": -1, "x": -1, "z": -1}).
		SameGravity("g").Fix("x", horizontal).Fix("z", vertical).Basis("V", "x").Solve()
	if err != nil {
		return Distorted{}, err
	}
	v, err := ratioValues(s, "V", "t", "Q")
	if err != nil {
		return Distorted{}, err
	}
	d := Distorted{
		Horizontal: horizontal, Vertical: vertical, Distortion: vertical / horizontal,
		Velocity: v[0], Time: v[1], Discharge: v[2], Area: horizontal * horizontal,
		Slope: vertical / horizontal, Manning: math.Pow(vertical, 2.0/3) / math.Sqrt(horizontal),
		solution: s,
	}
	if err := finiteRatios("area", d.Area, "slope", d.Slope, "Manning's n", d.Manning, "distortion", d.Distortion); err != nil {
		return Distorted{}, err
	}
	return d, nil
}

// ratioValues returns the values of the ratios of the given variables.
func ratioValues(s *Solution, syms ...string) ([]float64, error) {
	out := make([]float64, len(syms))
	for i, sym := range syms {
		r, err := s.Ratio(sym)
		if err != nil {
			return nil, err
		}
		out[i] = r.Value
	}
	return out, nil
}

// finiteRatios checks name–value pairs of derived ratios: each must be
// positive and finite.
func finiteRatios(pairs ...any) error {
	for i := 0; i+1 < len(pairs); i += 2 {
		if v := pairs[i+1].(float64); !(v > 0) || math.IsInf(v, 0) {
			return &PlanError{Err: ErrBadRatio, Symbol: pairs[i].(string), Reason: fmt.Sprintf("the %s ratio is out of the range of a float64 for these ratios", pairs[i])}
		}
	}
	return nil
}

// Solution returns the plan behind the distorted model, for its laws.
func (d Distorted) Solution() *Solution { return d.solution }

// ManningRatio is the ratio of Manning's roughness coefficient in an
// undistorted Froude model, λ_n = λ_L^(1/6): from V = R^(2/3)·S^(1/2)/n
// with λ_V = λ_L^(1/2), λ_R = λ_L and λ_S = 1.
func ManningRatio(lengthRatio float64) (float64, error) {
	if err := checkRatio("length", lengthRatio); err != nil {
		return 0, err
	}
	r := math.Pow(lengthRatio, 1.0/6)
	return r, finiteRatios("Manning's n", r)
}
