package units

import (
	"math"

	"similis.dev/similis/quantity"
)

// The seven defining constants of the SI, exact since 20 May 2019 (SI
// Brochure, 9th ed. (2019), Table 1).
var (
	// HyperfineCs is the caesium-133 hyperfine transition frequency
	// Δν_Cs = 9 192 631 770 Hz.
	HyperfineCs = quantity.New(9192631770, quantity.Frequency)
	// SpeedOfLight is c = 299 792 458 m/s.
	SpeedOfLight = quantity.New(299792458, quantity.Velocity)
	// Planck is h = 6.626 070 15 × 10⁻³⁴ J·s.
	Planck = quantity.New(6.62607015e-34, quantity.MustDim(2, 1, -1, 0, 0, 0, 0))
	// ElementaryCharge is e = 1.602 176 634 × 10⁻¹⁹ C.
	ElementaryCharge = quantity.New(eCharge, quantity.Charge)
	// Boltzmann is k = 1.380 649 × 10⁻²³ J/K.
	Boltzmann = quantity.New(1.380649e-23, quantity.HeatCapacity)
	// Avogadro is N_A = 6.022 140 76 × 10²³ mol⁻¹.
	Avogadro = quantity.New(6.02214076e23, quantity.MustDim(0, 0, 0, 0, 0, -1, 0))
	// LuminousEfficacy is K_cd = 683 lm/W, for 540 THz radiation; in base
	// units cd·sr·kg⁻¹·m⁻²·s³, with the steradian dimensionless.
	LuminousEfficacy = quantity.New(683, quantity.MustDim(-2, -1, 3, 0, 0, 0, 1))
)

// Other constants.
var (
	// StandardGravity is g_n = 9.806 65 m/s², exact (3rd CGPM, 1901).
	StandardGravity = quantity.New(gn, quantity.Acceleration)
	// StandardAtmosphere is 101 325 Pa, exact (10th CGPM, 1954).
	StandardAtmosphere = quantity.New(atmPa, quantity.Pressure)
	// MolarGas is R = N_A·k, exact from the defining constants:
	// 8.314 462 618… J/(mol·K).
	MolarGas = Avogadro.Mul(Boltzmann)
	// StefanBoltzmann is σ = 2π⁵k⁴/(15h³c²), exact from the defining
	// constants: 5.670 374 419… × 10⁻⁸ W/(m²·K⁴).
	StefanBoltzmann = Boltzmann.Pow(4, 1).Div(Planck.Pow(3, 1).Mul(SpeedOfLight.Pow(2, 1))).Scale(2 * math.Pow(math.Pi, 5) / 15)
	// Gravitation is G = 6.674 30(15) × 10⁻¹¹ m³/(kg·s²) (CODATA 2018).
	Gravitation = quantity.New(6.67430e-11, quantity.MustDim(3, -1, -2, 0, 0, 0, 0))
)
