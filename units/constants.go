package units

import (
	"math"

	"similis.dev/similis/quantity"
)

// Physical constants are functions, so that no caller can change one for
// another. The seven defining constants of the SI are exact since 20 May
// 2019 (SI Brochure, 9th ed. (2019), Table 1).

// HyperfineCs is the caesium-133 hyperfine transition frequency
// Δν_Cs = 9 192 631 770 Hz.
func HyperfineCs() quantity.Quantity { return quantity.New(9192631770, quantity.Frequency) }

// SpeedOfLight is c = 299 792 458 m/s.
func SpeedOfLight() quantity.Quantity { return quantity.New(299792458, quantity.Velocity) }

// Planck is h = 6.626 070 15 × 10⁻³⁴ J·s.
func Planck() quantity.Quantity {
	return quantity.New(6.62607015e-34, quantity.MustDim(2, 1, -1, 0, 0, 0, 0))
}

// ElementaryCharge is e = 1.602 176 634 × 10⁻¹⁹ C.
func ElementaryCharge() quantity.Quantity { return quantity.New(eCharge, quantity.Charge) }

// Boltzmann is k = 1.380 649 × 10⁻²³ J/K.
func Boltzmann() quantity.Quantity { return quantity.New(1.380649e-23, quantity.HeatCapacity) }

// Avogadro is N_A = 6.022 140 76 × 10²³ mol⁻¹.
func Avogadro() quantity.Quantity {
	return quantity.New(6.02214076e23, quantity.MustDim(0, 0, 0, 0, 0, -1, 0))
}

// LuminousEfficacy is K_cd = 683 lm/W, for 540 THz radiation; in base
// units cd·sr·kg⁻¹·m⁻²·s³, with the steradian dimensionless.
func LuminousEfficacy() quantity.Quantity {
	return quantity.New(683, quantity.MustDim(-2, -1, 3, 0, 0, 0, 1))
}

// StandardGravity is g_n = 9.806 65 m/s², exact (3rd CGPM, 1901).
func StandardGravity() quantity.Quantity { return quantity.New(gn, quantity.Acceleration) }

// StandardAtmosphere is 101 325 Pa, exact (10th CGPM, 1954).
func StandardAtmosphere() quantity.Quantity { return quantity.New(atmPa, quantity.Pressure) }

// MolarGas is R = N_A·k, exact from the defining constants:
// 8.314 462 618… J/(mol·K).
func MolarGas() quantity.Quantity { return Avogadro().Mul(Boltzmann()) }

// StefanBoltzmann is σ = 2π⁵k⁴/(15h³c²), exact from the defining
// constants: 5.670 374 419… × 10⁻⁸ W/(m²·K⁴).
func StefanBoltzmann() quantity.Quantity {
	return Boltzmann().Pow(4, 1).Div(Planck().Pow(3, 1).Mul(SpeedOfLight().Pow(2, 1))).Scale(2 * math.Pow(math.Pi, 5) / 15)
}

// Gravitation is G = 6.674 30(15) × 10⁻¹¹ m³/(kg·s²) (CODATA 2018).
func Gravitation() quantity.Quantity {
	return quantity.New(6.67430e-11, quantity.MustDim(3, -1, -2, 0, 0, 0, 0))
}
