package turbo

import (
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Affinity holds the turbomachine flow, head and power coefficients for
// a change of speed and diameter: Q ∝ N·D³, gH ∝ N²·D², P ∝ ρ·N³·D⁵.
// Every ratio is model/prototype, as everywhere in this package; divide a
// model value by it for the prototype.
type Affinity struct {
	RotationalSpeed, Diameter, Density float64 // λ_N, λ_D, λ_ρ
	Flow, Head, Power                  float64 // λ_Q, λ_H (as gH), λ_P
	Torque                             float64 // λ_T = λ_P/λ_N
	// Pressure is the ratio of a fan's (or pump's) pressure rise,
	// λ_Δp = λ_ρ·λ_H: the fan laws with the density of each side, as
	// the fan pressure coefficient ψ_p = Δp/(ρn²D²) held equal gives.
	Pressure float64
}

// AffinityScales are the model/prototype ratios the affinity laws take,
// by name so that one cannot be given for another. Each must be positive
// and finite, and each is required: a ratio left zero is not taken as 1
// but refused, the error naming the field and the value that means
// "the same" (Density: 1 for the same fluid).
type AffinityScales struct {
	RotationalSpeed float64 // λ_N, the ratio of shaft speeds
	Diameter        float64 // λ_D, the ratio of impeller or rotor diameters
	Density         float64 // λ_ρ
}

// AffinityLaws returns the affinity-law ratios, model/prototype, for the
// rotational speed, diameter and density ratios of sc, from the held coefficients solved exactly (Q/(ND³),
// gH/(N²D²), P/(ρN³D⁵)), over the variables Q (volume flow rate), gH
// (specific energy), P (power), N (rotational speed), D (diameter) and
// rho (density). Efficiency is taken equal, so Power is the power ratio
// at equal efficiency.
//
// A prototype point with an efficiency step-up is found thus (and
// PrototypePointOf does it): the flow and head keep their affinity
// values, Q_P = Q_M/Flow and H_P = H_M/Head; the efficiency is stepped up
// by one of the formulas (MoodyStepUp, IECStepUp, AckeretStepUp,
// FanStepUp) to η_P; and the power input is computed from them,
// P_P = ρ_P·g·Q_P·H_P/η_P, not divided by Power. See PumpCaution.
func AffinityLaws(sc AffinityScales) (Affinity, error) {
	for _, r := range [...]struct {
		field, input, same string
		v                  float64
	}{
		{"RotationalSpeed", "rotational speed", "n_m/n_p: 1 for the same speed", sc.RotationalSpeed},
		{"Diameter", "diameter", "D_m/D_p: 1 for the same size", sc.Diameter},
		{"Density", "density", "ρ_m/ρ_p: 1 for the same fluid", sc.Density},
	} {
		if r.v == 0 {
			return Affinity{}, &Error{Op: "affinity laws", Fault: similarity.Invalid(r.input,
				"AffinityScales."+r.field+" is not set (0): give the model/prototype "+r.input+" ratio "+r.same)}
		}
	}
	if err := fail("affinity laws", similarity.CheckRatios(
		similarity.Result{Name: "rotational speed", Value: sc.RotationalSpeed},
		similarity.Result{Name: "diameter", Value: sc.Diameter},
		similarity.Result{Name: "density", Value: sc.Density})); err != nil {
		return Affinity{}, err
	}
	speedRatio, diameterRatio, densityRatio := sc.RotationalSpeed, sc.Diameter, sc.Density
	p := pigroups.MustProblem(
		pigroups.VarKind("Q", quantity.VolumeFlowRate, "volume flow rate"), pigroups.VarKind("gH", quantity.SpecificEnergy, "specific energy"),
		pigroups.VarKind("P", quantity.Power, "power"), pigroups.VarKind("N", quantity.AngularVelocity, "rotational speed"),
		pigroups.VarKind("D", quantity.Length, "length"), pigroups.VarKind("rho", quantity.Density, "density"))
	s, err := similarity.NewPlan(p).
		HoldExps("the flow coefficient", map[string]int{"Q": 1, "N": -1, "D": -3}).
		HoldExps("the head coefficient", map[string]int{"gH": 1, "N": -2, "D": -2}).
		HoldExps("the power coefficient", map[string]int{"P": 1, "rho": -1, "N": -3, "D": -5}).
		Fix("N", speedRatio).Fix("D", diameterRatio).Fix("rho", densityRatio).Basis("N", "D", "rho").Solve()
	if err != nil {
		return Affinity{}, err
	}
	v, err := s.RatioValues("Q", "gH", "P")
	if err != nil {
		return Affinity{}, err
	}
	a := Affinity{RotationalSpeed: speedRatio, Diameter: diameterRatio, Density: densityRatio, Flow: v[0], Head: v[1], Power: v[2]}
	a.Torque = a.Power / a.RotationalSpeed
	a.Pressure = a.Density * a.Head
	if err := fail("affinity laws", similarity.CheckRatios(
		similarity.Result{Name: "torque", Value: a.Torque},
		similarity.Result{Name: "pressure", Value: a.Pressure})); err != nil {
		return Affinity{}, err
	}
	return a, nil
}
