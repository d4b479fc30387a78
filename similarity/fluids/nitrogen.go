package fluids

import (
	"fmt"
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
// gas's compressibility factor departs from 1 by a few per cent, which
// NitrogenCompressibility estimates — and CondensationMargin says how
// far above it is.
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

// Nitrogen's critical density (Span et al., 2000), mol/m³, and its
// acentric factor ω = 0.0372 (the value listed with Span et al.'s
// constants in NIST's fluid data; Pitzer's definition
// ω = −1 − log₁₀(p_sat(0.7·T_c)/p_c) gives 0.0372 from the saturation
// equation above), and the molar gas constant (CODATA 2018), J/(mol·K).
const (
	n2RhoC  = 11183.9
	n2Omega = 0.0372
	rMolar  = 8.314462618
)

// Bounds of the second-virial estimate: the reduced temperature T/T_c
// from which the generalized correlation is used, and the highest
// temperature, that of the Nitrogen gas model.
const (
	virialMinTr = 0.7
	virialMaxT  = 600
	// virialMaxDeparture is the largest 1 − Z the estimate gives: against
	// nitrogen's saturated-vapour densities the two-term form is 0.3 %
	// off at 90 K (Z ≈ 0.90) but 3 % at 100 K (Z ≈ 0.84) and 7 % at
	// 110 K (Z ≈ 0.78).
	virialMaxDeparture = 0.1
)

// Compressibility is an estimate of how far nitrogen at one state departs
// from the ideal gas that Nitrogen models.
type Compressibility struct {
	// Z is the compressibility factor p/(ρ·R·T), dimensionless: the
	// ideal-gas density p/(R·T) is Z times the real one.
	Z float64
	// SoundSpeedRatio is the real gas's speed of sound over the ideal
	// gas's √(γ·R·T) at the same temperature and pressure,
	// dimensionless.
	SoundSpeedRatio float64
	// ReducedTemperature is T/T_c and ReducedPressure p/p_c,
	// dimensionless.
	ReducedTemperature, ReducedPressure float64
}

// NitrogenCompressibility estimates nitrogen's compressibility factor
// at temperature T and absolute pressure p from the truncated virial
// equation Z = 1 + B·p/(R·T), with the second virial coefficient B from
// the generalized (Pitzer-type) correlation of Abbott as given in Smith,
// Van Ness and Abbott, Introduction to Chemical Engineering
// Thermodynamics (coefficients quoted from memory):
//
//	B·p_c/(R·T_c) = B⁰ + ω·B¹, B⁰ = 0.083 − 0.422/T_r^1.6, B¹ = 0.139 − 0.172/T_r^4.2,
//
// with T_c = 126.192 K and p_c = 3.3958 MPa (Span et al., 2000) and
// ω = 0.0372. It also estimates the real gas's speed of sound from the
// acoustic second virial coefficient of the same B(T),
// β_a = 2B + 2(γ⁰−1)·T·dB/dT + ((γ⁰−1)²/γ⁰)·T²·d²B/dT², γ⁰ = 1.4:
// a² = γ⁰·R·T·(1 + β_a·p/(R_m·T)) (a standard result, from memory; the
// tests check it against the thermodynamic identities).
//
// The textbook shows the correlation within 2 % of the Lee–Kesler
// tables down to T_r ≈ 0.7, where the gas's own saturation pressure
// bounds it; below T/T_c = 0.7 (88.33 K) and above 600 K (the
// Nitrogen model's range) the estimate is refused with a *RangeError,
// as is a state at or below the saturation temperature (not a gas), a
// pressure above that of half the critical density (a reduced volume
// below 2, beyond which the two-term virial form is not used — common
// practice, from memory), and a state where the estimate departs from
// the ideal gas by more than 10 % (Z < 0.9): near saturation at higher
// pressures the two-term form falls short of the real departure (3 %
// in density for the saturated vapour at 100 K, Z ≈ 0.84). The tests
// compare Z with the same truncated form on the published data fit of
// B for nitrogen (B = 185.4 − 141.8·exp(88.7 K/T) cm³/mol, 75 … 700 K):
// within 0.1 % at 108 K and 1 bar and 0.5 % at 100 K and 4.5 bar, and
// the density with a table of the saturated vapour: 0.3 % at 90 K.
//
// The estimate is for planning: at 108 K and 1.03 bar, 31 K above
// saturation, Z ≈ 0.984, so an ideal-gas density is 1.6 % low there.
func NitrogenCompressibility(T, p quantity.Quantity) (Compressibility, error) {
	if err := check(T, p); err != nil {
		return Compressibility{}, err
	}
	t, pr := T.Value(), p.Value()
	const fluid = "nitrogen (second-virial estimate)"
	if !(t >= virialMinTr*n2Tc && t <= virialMaxT) {
		return Compressibility{}, &RangeError{Fluid: fluid, What: "temperature (the generalized correlation is used from T/T_c = 0.7)", Value: t, Lo: virialMinTr * n2Tc, Hi: virialMaxT, Unit: "K"}
	}
	if pr >= n2SatP(n2Tt) {
		ts := n2Tc
		if pr <= n2Pc {
			ts = n2SatT(pr)
		}
		if !(t > ts) {
			return Compressibility{}, &RangeError{Fluid: fluid, What: fmt.Sprintf("temperature at %.6g Pa: at or below the condensation temperature — not a gas", pr), Value: t, Lo: ts, Hi: virialMaxT, Unit: "K"}
		}
	}
	tr, prr := t/n2Tc, pr/n2Pc
	b, db, d2b := virialB(tr)
	// Half the critical density: V/V_c = Z·T_r/(Z_c·p_r) ≥ 2, that is
	// p_r ≤ T_r/(2·Z_c − B̂).
	zc := n2Pc / (n2RhoC * rMolar * n2Tc)
	if pmax := n2Pc * tr / (2*zc - b); !(pr <= pmax) {
		return Compressibility{}, &RangeError{Fluid: fluid, What: "pressure (the two-term virial form is used to half the critical density)", Value: pr, Lo: 0, Hi: pmax, Unit: "Pa"}
	}
	// A departure beyond virialMaxDeparture: the two-term form is not
	// used (pmax is where Z = 1 − virialMaxDeparture, for B < 0).
	if z := 1 + b*prr/tr; !(z >= 1-virialMaxDeparture) {
		return Compressibility{}, &RangeError{Fluid: fluid, What: fmt.Sprintf("pressure (the two-term virial form is used while Z ≥ %g; here Z ≈ %.3f)", 1-virialMaxDeparture, z),
			Value: pr, Lo: 0, Hi: n2Pc * virialMaxDeparture * tr / -b, Unit: "Pa"}
	}
	const g0 = 1.4
	beta := 2*b + 2*(g0-1)*tr*db + (g0-1)*(g0-1)/g0*tr*tr*d2b
	return Compressibility{Z: 1 + b*prr/tr, SoundSpeedRatio: math.Sqrt(1 + beta*prr/tr), ReducedTemperature: tr, ReducedPressure: prr}, nil
}

// virialB is the reduced second virial coefficient B̂ = B·p_c/(R·T_c) of
// nitrogen at the reduced temperature tr, and its first and second
// derivatives with respect to tr.
func virialB(tr float64) (b, db, d2b float64) {
	b = 0.083 - 0.422*math.Pow(tr, -1.6) + n2Omega*(0.139-0.172*math.Pow(tr, -4.2))
	db = 0.422*1.6*math.Pow(tr, -2.6) + n2Omega*0.172*4.2*math.Pow(tr, -5.2)
	d2b = -0.422*1.6*2.6*math.Pow(tr, -3.6) - n2Omega*0.172*4.2*5.2*math.Pow(tr, -6.2)
	return b, db, d2b
}
