package fluids

import (
	"math"

	"similis.dev/similis/quantity"
)

// Nitrogen returns nitrogen as an ideal gas: R = 8.314462618/0.0280134
// J/(kg·K) (CODATA 2018 molar gas constant; molar mass 28.0134 g/mol),
// γ = 1.4, and Sutherland's law with μ₀ = 1.663×10⁻⁵ Pa·s at 273 K and
// S = 107 K (F. M. White, Viscous Fluid Flow, Table 1-2, quoted from
// memory; the law is stated there to about 2 % from 100 to 1500 K).
//
// At refuses a state at or below the saturation temperature at its
// pressure (NitrogenSaturation; below the triple point, and below the
// critical temperature above the critical pressure), and above 600 K,
// where γ = 1.4 no longer holds (c_p of nitrogen rises from 1.041 to
// 1.075 kJ/(kg·K) between 300 and 600 K, Incropera and DeWitt, Table A.4,
// from memory). The ideal-gas state is a fair approximation of a
// cryogenic tunnel's gas only well above saturation — near it the real
// gas's compressibility factor departs from 1 by a few per cent —
// and CondensationMargin says how far above it is.
func Nitrogen() IdealGas { return nitrogenGas }

var nitrogenGas = IdealGas{GasName: "nitrogen", R: quantity.New(8.314462618/0.0280134, quantity.SpecificHeatCapacity), Gamma: 1.4,
	Beta: quantity.New(1.663e-5*(273+107)/math.Pow(273, 1.5), SutherlandConstantDim), S: kelvin(107),
	KRef: quantity.New(0.0242, quantity.ThermalConductivity), KTemp: kelvin(273), KS: kelvin(150),
	MinTemperature: kelvin(n2Tt), MaxTemperature: kelvin(600), Saturation: NitrogenSaturation}

// Nitrogen's critical and triple points (Span et al., 2000).
const (
	n2Tc, n2Pc = 126.192, 3.3958e6
	n2Tt       = 63.151
)

// NitrogenSaturationPressure returns the vapour pressure of nitrogen at
// T by the ancillary equation of Span, Lemmon, Jacobsen, Wagner and
// Yokozeki (J. Phys. Chem. Ref. Data 29 (2000) 1361), coefficients quoted
// from memory: ln(p/p_c) = (T_c/T)(N₁θ + N₂θ^1.5 + N₃θ^2.5 + N₄θ⁵),
// θ = 1 − T/T_c, from the triple point to the critical point.
func NitrogenSaturationPressure(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	t := T.Value()
	if !(t >= n2Tt && t <= n2Tc) {
		return quantity.Quantity{}, &RangeError{Fluid: "nitrogen (saturation)", What: "temperature", Value: t, Lo: n2Tt, Hi: n2Tc, Unit: "K"}
	}
	return quantity.New(n2SatP(t), quantity.Pressure), nil
}

func n2SatP(t float64) float64 {
	const n1, n2, n3, n4 = -6.12445284, 1.26327220, -0.765910082, -1.77570564
	th := 1 - t/n2Tc
	return n2Pc * math.Exp(n2Tc/t*(n1*th+n2*math.Pow(th, 1.5)+n3*math.Pow(th, 2.5)+n4*math.Pow(th, 5)))
}

// NitrogenSaturationTemperature returns the temperature at which
// nitrogen condenses at pressure p, inverting the saturation equation,
// between the triple-point and critical pressures.
func NitrogenSaturationTemperature(p quantity.Quantity) (quantity.Quantity, error) {
	if err := p.CheckNamed("pressure", quantity.Pressure); err != nil {
		return quantity.Quantity{}, err
	}
	pr := p.Value()
	if !(pr >= n2SatP(n2Tt) && pr <= n2SatP(n2Tc)) {
		return quantity.Quantity{}, &RangeError{Fluid: "nitrogen (saturation)", What: "pressure", Value: pr, Lo: n2SatP(n2Tt), Hi: n2SatP(n2Tc), Unit: "Pa"}
	}
	return quantity.New(n2SatT(pr), quantity.Temperature), nil
}

// n2SatT inverts n2SatP by bisection for a pressure between the
// triple-point and critical pressures; 200 halvings at most.
func n2SatT(pr float64) float64 {
	lo, hi := n2Tt, n2Tc
	for range 200 {
		mid := (lo + hi) / 2
		if n2SatP(mid) < pr {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo < 1e-12 {
			break
		}
	}
	return (lo + hi) / 2
}

// CondensationMargin returns how far the static temperature T of
// nitrogen at static pressure p lies above its saturation temperature
// there, in kelvin: the margin a cryogenic tunnel keeps to avoid
// condensation in the test section. A pressure above the critical one
// has no saturation temperature and is an error.
func CondensationMargin(T, p quantity.Quantity) (quantity.Quantity, error) {
	if err := check(T, p); err != nil {
		return quantity.Quantity{}, err
	}
	if p.Value() < n2SatP(n2Tt) {
		// Below the triple-point pressure nitrogen sublimes; the margin to
		// the triple point is then a conservative figure.
		return quantity.New(T.Value()-n2Tt, quantity.Temperature), nil
	}
	ts, err := NitrogenSaturationTemperature(p)
	if err != nil {
		return quantity.Quantity{}, err
	}
	return quantity.New(T.Value()-ts.Value(), quantity.Temperature), nil
}
