package fluids

import (
	"math"

	"similis.dev/similis/quantity"
)

// HumidAir is moist air of a tunnel or a laboratory, with the density of
// the CIPM-2007 formula for the density of moist air (Picard, Davis,
// Gläser and Fujii, Metrologia 45 (2008) 149), constants quoted from
// memory. The formula is stated for 600 hPa ≤ p ≤ 1100 hPa and
// 15 °C ≤ t ≤ 27 °C; outside, a *RangeError.
type HumidAir struct {
	// CO2 is the mole fraction of carbon dioxide; 0.0004 if zero.
	CO2 float64
}

// CIPM-2007 constants.
const (
	cipmR  = 8.314472    // J/(mol·K)
	cipmMv = 18.01528e-3 // kg/mol, water
)

// saturationDavis is the saturation vapour pressure of the CIPM formula,
// p_sv = exp(A·T² + B·T + C + D/T) (Davis, 1992), Pa.
func saturationDavis(T float64) float64 {
	const a, b, c, d = 1.2378847e-5, -1.9121316e-2, 33.93711047, -6.3431645e3
	return math.Exp(a*T*T + b*T + c + d/T)
}

// MoleFraction returns the mole fraction of water vapour x_v = h·f·p_sv/p
// at pressure p, temperature T and relative humidity rh (0 … 1), with
// the enhancement factor f = 1.00062 + 3.14×10⁻⁸ Pa⁻¹·p + 5.6×10⁻⁷ K⁻²·t².
func (a HumidAir) MoleFraction(p, T quantity.Quantity, rh float64) (float64, error) {
	if err := a.check(p, T); err != nil {
		return 0, err
	}
	if !(rh >= 0 && rh <= 1) {
		return 0, &RangeError{Fluid: "humid air (CIPM-2007)", What: "relative humidity", Value: rh, Lo: 0, Hi: 1, Unit: unitOne}
	}
	t := T.Value() - 273.15
	f := 1.00062 + 3.14e-8*p.Value() + 5.6e-7*t*t
	return rh * f * saturationDavis(T.Value()) / p.Value(), nil
}

func (a HumidAir) check(p, T quantity.Quantity) error {
	if err := check(T, p); err != nil {
		return err
	}
	if t := T.Value() - 273.15; !(t >= 15 && t <= 27) {
		return &RangeError{Fluid: "humid air (CIPM-2007)", What: "temperature", Value: t, Lo: 15, Hi: 27, Unit: "°C"}
	}
	if pr := p.Value(); !(pr >= 60e3 && pr <= 110e3) {
		return &RangeError{Fluid: "humid air (CIPM-2007)", What: "pressure", Value: pr, Lo: 60e3, Hi: 110e3, Unit: "Pa"}
	}
	if !(a.CO2 >= 0 && a.CO2 < 0.01) {
		return &RangeError{Fluid: "humid air (CIPM-2007)", What: "CO₂ mole fraction", Value: a.CO2, Lo: 0, Hi: 0.01, Unit: unitOne}
	}
	return nil
}

// DensityMole returns the density of moist air with water-vapour mole
// fraction xv: ρ = p·M_a/(Z·R·T)·(1 − x_v·(1 − M_v/M_a)), with the
// compressibility factor Z of the formula.
func (a HumidAir) DensityMole(p, T quantity.Quantity, xv float64) (quantity.Quantity, error) {
	if err := a.check(p, T); err != nil {
		return quantity.Quantity{}, err
	}
	if !(xv >= 0 && xv < 0.05) {
		return quantity.Quantity{}, &RangeError{Fluid: "humid air (CIPM-2007)", What: "water-vapour mole fraction", Value: xv, Lo: 0, Hi: 0.05, Unit: unitOne}
	}
	co2 := a.CO2
	if co2 == 0 {
		co2 = 0.0004
	}
	ma := (28.96546 + 12.011*(co2-0.0004)) * 1e-3
	pr, tk := p.Value(), T.Value()
	t := tk - 273.15
	const (
		a0, a1, a2 = 1.58123e-6, -2.9331e-8, 1.1043e-10
		b0, b1     = 5.707e-6, -2.051e-8
		c0, c1     = 1.9898e-4, -2.376e-6
		d, e       = 1.83e-11, -0.765e-8
	)
	z := 1 - pr/tk*(a0+a1*t+a2*t*t+(b0+b1*t)*xv+(c0+c1*t)*xv*xv) + pr*pr/(tk*tk)*(d+e*xv*xv)
	rho := pr * ma / (z * cipmR * tk) * (1 - xv*(1-cipmMv/ma))
	return quantity.New(rho, quantity.Density), nil
}

// Density returns the density of moist air at pressure p, temperature T
// and relative humidity rh (0 … 1).
func (a HumidAir) Density(p, T quantity.Quantity, rh float64) (quantity.Quantity, error) {
	xv, err := a.MoleFraction(p, T, rh)
	if err != nil {
		return quantity.Quantity{}, err
	}
	return a.DensityMole(p, T, xv)
}
