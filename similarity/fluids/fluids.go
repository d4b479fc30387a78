package fluids

import (
	"fmt"
	"math"

	"similis.dev/similis/internal/dual"
	"similis.dev/similis/quantity"
)

// State is the state of a fluid: temperature, pressure and the properties
// similarity plans use. Properties a fluid does not define are zero.
type State struct {
	Temperature        quantity.Quantity // K
	Pressure           quantity.Quantity // Pa
	Density            quantity.Quantity // kg/m³
	DynamicViscosity   quantity.Quantity // Pa·s
	KinematicViscosity quantity.Quantity // m²/s
	SpeedOfSound       quantity.Quantity // m/s (zero if not modelled)
}

// Fluid gives the state of a fluid at a temperature and pressure.
type Fluid interface {
	// Name says what the fluid is ("fresh water", "air").
	Name() string
	// At returns the state at temperature T (K) and pressure p (Pa).
	At(T, p quantity.Quantity) (State, error)
}

// ErrRange is quantity.ErrRange, the module's class for numbers out of
// range; every *RangeError matches it.
var ErrRange = quantity.ErrRange

// RangeError reports a temperature, pressure or altitude out of range,
// or a constant of a gas that gives no physical gas. A constant of the
// wrong dimension is not a RangeError but an ErrDimension.
type RangeError struct {
	Fluid, What string
	// Value is the refused value and Lo … Hi the range it must lie in,
	// all three in Unit.
	Value  float64
	Lo, Hi float64
	// Unit is the unit of Value, Lo and Hi ("K", "°C", "Pa", "kg/kg"),
	// printed after each; empty for a dimensionless value (a Mach
	// number, a ratio, a mole fraction).
	Unit string
}

// Error implements the error interface: "fluids: fresh water:
// temperature 45 °C outside 0 … 40 °C".
func (e *RangeError) Error() string {
	if e.Unit == "" {
		return fmt.Sprintf("fluids: %s: %s %g outside %g … %g", e.Fluid, e.What, e.Value, e.Lo, e.Hi)
	}
	return fmt.Sprintf("fluids: %s: %s %g %s outside %g … %g %s", e.Fluid, e.What, e.Value, e.Unit, e.Lo, e.Hi, e.Unit)
}

// unitOne is the Unit of a *RangeError for a dimensionless value (a
// Mach number, a ratio, a fraction, a choice among constants): no unit
// is printed. Every RangeError the package builds sets Unit, to a unit
// or to unitOne, so that none leaves it out by mistake.
const unitOne = ""

// Is reports whether target is quantity.ErrRange, the class of a
// *RangeError.
func (e *RangeError) Is(target error) bool { return target == quantity.ErrRange }

func check(T, p quantity.Quantity) error {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return err
	}
	if err := p.CheckNamed("pressure", quantity.Pressure); err != nil {
		return err
	}
	if t := T.Value(); !(t > 0) || math.IsInf(t, 0) {
		return &RangeError{Fluid: "state", What: "thermodynamic temperature", Value: t, Lo: 0, Hi: math.Inf(1), Unit: "K"}
	}
	if pr := p.Value(); !(pr > 0) || math.IsInf(pr, 0) {
		return &RangeError{Fluid: "state", What: "absolute pressure", Value: pr, Lo: 0, Hi: math.Inf(1), Unit: "Pa"}
	}
	return nil
}

// finiteState refuses a state whose properties overflowed or underflowed
// (an ideal gas at 1e-300 K).
func finiteState(fluid string, s State) (State, error) {
	for _, x := range []quantity.Quantity{s.Density, s.DynamicViscosity, s.KinematicViscosity} {
		if v := x.Value(); !(v > 0) || math.IsInf(v, 0) {
			return State{}, &RangeError{Fluid: fluid, What: "state (temperature, pressure) giving " + quantity.Describe(x.Dim()), Value: v, Lo: 0, Hi: math.Inf(1), Unit: x.Dim().SIUnit()}
		}
	}
	if v := s.SpeedOfSound.Value(); !(v >= 0) || math.IsInf(v, 0) {
		return State{}, &RangeError{Fluid: fluid, What: "state giving a speed of sound", Value: v, Lo: 0, Hi: math.Inf(1), Unit: "m/s"}
	}
	return s, nil
}

// positive checks that a fluid's parameter is positive and finite.
func positive(fluid, what, unit string, x float64) error {
	if !(x > 0) || math.IsInf(x, 0) {
		return &RangeError{Fluid: fluid, What: what, Value: x, Lo: 0, Hi: math.Inf(1), Unit: unit}
	}
	return nil
}

func state(T, p, rho, mu, a float64) State {
	return State{
		Temperature:        quantity.New(T, quantity.Temperature),
		Pressure:           quantity.New(p, quantity.Pressure),
		Density:            quantity.New(rho, quantity.Density),
		DynamicViscosity:   quantity.New(mu, quantity.DynamicViscosity),
		KinematicViscosity: quantity.New(mu/rho, quantity.KinematicViscosity),
		SpeedOfSound:       quantity.New(a, quantity.Velocity),
	}
}

// Water is liquid water, fresh (Salinity zero) or sea water, between 0
// and 40 °C at pressures near atmospheric.
type Water struct {
	// Salinity is the absolute salinity S_A as a mass fraction (kg/kg),
	// a dimensionless Quantity: 35.16504 g/kg is
	// quantity.New(0.03516504, quantity.Dimensionless), or
	// units.MustParse("g/kg").Of(35.16504). The zero Quantity is fresh
	// water. It is
	// the convention of the S argument of FormulaFuncs' sea-water
	// functions too; a salinity of another dimension is an
	// ErrDimension, one outside 0 … 0.045 (45 g/kg) a *RangeError in
	// kg/kg.
	Salinity quantity.Quantity
}

// FreshWater returns the fresh water of a towing tank (salinity 0).
func FreshWater() Water { return Water{} }

// SeaWater returns sea water at the reference salinity 35.16504 g/kg
// (TEOS-10), a mass fraction of 0.03516504.
func SeaWater() Water { return Water{Salinity: quantity.New(seaRefFraction, quantity.Dimensionless)} }

// seaRefFraction is TEOS-10's reference salinity, 35.16504 g/kg, as a
// mass fraction (kg/kg).
const seaRefFraction = 0.03516504

// Name implements Fluid.
func (w Water) Name() string {
	if w.Salinity == (quantity.Quantity{}) {
		return "fresh water"
	}
	return fmt.Sprintf("sea water (S = %g g/kg)", w.Salinity.Value()*1000)
}

// maxSalinity is the largest absolute salinity the sea-water
// correlations are used for, as a mass fraction (45 g/kg).
const maxSalinity = 0.045

// salinity returns the water's absolute salinity as a mass fraction
// (kg/kg), checked: a dimensionless Quantity in 0 … maxSalinity.
func (w Water) salinity() (float64, error) {
	if err := w.Salinity.CheckNamed("fluids: water: Water.Salinity (absolute salinity, a mass fraction in kg/kg)", quantity.Dimensionless); err != nil {
		return 0, err
	}
	s := w.Salinity.Value()
	if !(s >= 0 && s <= maxSalinity) {
		return 0, &RangeError{Fluid: w.Name(), What: "absolute salinity S_A as a mass fraction (35.16504 g/kg is 0.03516504 kg/kg)", Value: s, Lo: 0, Hi: maxSalinity, Unit: "kg/kg"}
	}
	return s, nil
}

// The water correlations are written once over dual numbers, so that
// Slopes has their exact temperature derivatives.

// freshDensity is the CIPM formula (Tanaka et al., 2001), kg/m³, t in °C.
func freshDensity(t dual.Num) dual.Num {
	const a1, a2, a3, a4, a5 = -3.983035, 301.797, 522528.9, 69.34881, 999.974950
	u := t.AddC(a1)
	return dual.Const(1).Sub(u.Mul(u).Mul(t.AddC(a2)).Div(t.AddC(a4).Scale(a3))).Scale(a5)
}

// freshViscosity is the CRC Handbook correlation, Pa·s, t in °C.
func freshViscosity(t dual.Num) dual.Num {
	d := t.AddC(-20)
	if t.V <= 20 {
		lg := dual.Const(1301).Div(d.Poly(998.333, 8.1855, 0.00585)).AddC(-3.30233) // log₁₀ of μ in poise
		return lg.Exp10().Scale(0.1)
	}
	const mu20 = 1.0016e-3
	return d.Poly(0, -1.3272, -0.001053).Div(t.AddC(105)).Exp10().Scale(mu20)
}

// seaDensity is the one-atmosphere international equation of state of
// sea water, EOS-80 (Millero and Poisson, 1981; UNESCO Technical Papers
// in Marine Science 36 and 44), used as published: its own pure-water
// (SMOW) term, t on the IPTS-68 scale (t₆₈ = 1.00024·t₉₀) and practical
// salinity S_P. The Salinity of a Water, an absolute salinity (here sa
// in g/kg, the Salinity's mass fraction times 1000), is read as practical salinity by the reference-composition ratio of
// TEOS-10, S_P = S_A·35/35.16504. Checked against IAPWS-08 (TEOS-10) to
// 0.002 % between 0 and 40 °C and 5 to 40 g/kg (see the tests).
func seaDensity(t90 dual.Num, sa float64) dual.Num {
	rw, a, b := seaDensityTerms(t90)
	s := sa * spPerSA
	return rw.Add(a.Scale(s)).Add(b.Scale(s * math.Sqrt(s))).AddC(seaC * s * s)
}

// spPerSA reads an absolute salinity as practical salinity (TEOS-10
// reference composition), and seaC is EOS-80's coefficient of S_P².
const (
	spPerSA = 35 / 35.16504
	seaC    = 4.8314e-4
)

// seaDensityTerms are EOS-80's pure-water term and the coefficients of
// S_P and S_P^(3/2) at t₉₀ °C.
func seaDensityTerms(t90 dual.Num) (rw, a, b dual.Num) {
	t := t90.Scale(1.00024)
	rw = t.Poly(999.842594, 6.793952e-2, -9.095290e-3, 1.001685e-4, -1.120083e-6, 6.536332e-9)
	a = t.Poly(8.24493e-1, -4.0899e-3, 7.6438e-5, -8.2467e-7, 5.3875e-9)
	b = t.Poly(-5.72466e-3, 1.0227e-4, -1.6546e-6)
	return rw, a, b
}

// seaDensitySlope is ∂ρ/∂S_A of seaDensity at t₉₀ °C, in kg/m³ per g/kg.
func seaDensitySlope(t90, sa float64) float64 {
	_, a, b := seaDensityTerms(dual.Const(t90))
	s := sa * spPerSA
	return (a.V + 1.5*b.V*math.Sqrt(s) + 2*seaC*s) * spPerSA
}

// seaViscosity follows Sharqawy et al. (2010), eq. 22, with S in kg/kg,
// applied to the fresh-water viscosity above.
func seaViscosity(t dual.Num, s float64) dual.Num {
	A, B := seaViscosityTerms(t)
	return freshViscosity(t).Mul(A.Scale(s).Add(B.Scale(s * s)).AddC(1))
}

// seaViscosityTerms are the coefficients of S and S² of Sharqawy et al.
func seaViscosityTerms(t dual.Num) (A, B dual.Num) {
	return t.Poly(1.541, 1.998e-2, -9.52e-5), t.Poly(7.974, -7.561e-2, 4.724e-4)
}

// seaViscositySlope is ∂μ/∂S of seaViscosity at t °C, S in kg/kg, in Pa·s
// per kg/kg.
func seaViscositySlope(t, s float64) float64 {
	A, B := seaViscosityTerms(dual.Const(t))
	return freshViscosity(dual.Const(t)).V * (A.V + 2*B.V*s)
}

// properties returns ρ and μ of the water at t °C with their derivatives
// with respect to t.
func (w Water) properties(t float64) (rho, mu dual.Num) {
	x := dual.Var(t)
	if s := w.Salinity.Value(); s > 0 {
		return seaDensity(x, s*1000), seaViscosity(x, s)
	}
	return freshDensity(x), freshViscosity(x)
}

// Slopes returns the derivatives with respect to temperature of the
// water's density and kinematic viscosity at T, exact derivatives of the
// correlations At uses: the sensitivity coefficients that carry a
// temperature's uncertainty into ρ and ν (package quantity/uncertain).
// T must be in At's range.
func (w Water) Slopes(T quantity.Quantity) (dRho, dNu quantity.Quantity, err error) {
	if _, err := w.At(T, quantity.New(101325, quantity.Pressure)); err != nil {
		return quantity.Quantity{}, quantity.Quantity{}, err
	}
	rho, mu := w.properties(T.Value() - 273.15)
	nu := mu.Div(rho)
	perK := quantity.New(1, quantity.Temperature)
	return quantity.New(rho.D, quantity.Density).Div(perK), quantity.New(nu.D, quantity.KinematicViscosity).Div(perK), nil
}

// At implements Fluid. Pressure is checked for its dimension but its
// small effect on a liquid is neglected.
func (w Water) At(T, p quantity.Quantity) (State, error) {
	if err := check(T, p); err != nil {
		return State{}, err
	}
	t := T.Value() - 273.15
	if !(t >= 0 && t <= 40) {
		return State{}, &RangeError{Fluid: w.Name(), What: "temperature", Value: t, Lo: 0, Hi: 40, Unit: "°C"}
	}
	if _, err := w.salinity(); err != nil {
		return State{}, err
	}
	rho, mu := w.properties(t)
	return state(T.Value(), p.Value(), rho.V, mu.V, 0), nil
}

// AtCelsius is At for a temperature in °C at standard atmospheric
// pressure.
func (w Water) AtCelsius(t float64) (State, error) {
	return w.At(quantity.New(t+273.15, quantity.Temperature), quantity.New(101325, quantity.Pressure))
}

// IdealGas is a gas with ρ = p/(R·T), Sutherland's viscosity law
// μ = β·T^(3/2)/(T + S) and speed of sound a = √(γ·R·T).
//
// Every dimensional constant is a quantity.Quantity, checked where the
// gas is used: a constant of the wrong dimension (a dimensionless 287
// for R, a β given as a viscosity) is refused with an ErrDimension
// naming the field and both dimensions, never read as a number in an
// assumed unit. Build them with quantity.New, or parse them with package
// units: quantity.New(287.05287, quantity.SpecificHeatCapacity),
// quantity.New(1.458e-6, SutherlandConstantDim),
// quantity.New(110.4, quantity.Temperature).
//
// The model holds only for a gas: At and Viscosity refuse, with a
// *RangeError, a temperature below MinTemperature or above
// MaxTemperature, and At refuses a state at or below the condensation
// temperature the gas's saturation curve gives at its pressure (see
// LowestTemperature). A bound left zero (the zero Quantity, or 0 K), or
// NoSaturation, is not checked: a caller's own gas states its own range.
type IdealGas struct {
	// GasName names the gas in messages.
	GasName string
	// R is the specific gas constant, of the dimension of a specific
	// heat capacity, J/(kg·K).
	R quantity.Quantity
	// Gamma is the ratio of specific heats c_p/c_v, dimensionless.
	Gamma float64
	// Beta is Sutherland's constant β, of dimension
	// SutherlandConstantDim, kg/(m·s·K^(1/2)).
	Beta quantity.Quantity
	// S is Sutherland's temperature, a thermodynamic temperature (K);
	// required, 0 K included (write quantity.New(0,
	// quantity.Temperature)).
	S quantity.Quantity
	// KRef, KTemp and KS are Sutherland's law for the thermal
	// conductivity, k = KRef·(T/KTemp)^(3/2)·(KTemp + KS)/(T + KS);
	// the zero Quantity when not modelled.
	//
	// KRef is the conductivity at KTemp, a thermal conductivity
	// (W/(m·K)).
	KRef quantity.Quantity
	// KTemp is the reference temperature of KRef, a thermodynamic
	// temperature (K).
	KTemp quantity.Quantity
	// KS is Sutherland's temperature for the conductivity, a
	// thermodynamic temperature (K).
	KS quantity.Quantity
	// MinTemperature is the lowest thermodynamic temperature at which
	// the constants are stated (K); zero leaves it unchecked.
	MinTemperature quantity.Quantity
	// MaxTemperature is the highest thermodynamic temperature at which
	// the constants are stated (K); zero leaves it unchecked.
	MaxTemperature quantity.Quantity
	// Saturation is the gas's vapour-pressure curve, checked by At.
	Saturation SaturationCurve
}

// SutherlandConstantDim is the dimension of Sutherland's constant β,
// kg/(m·s·K^(1/2)): a dynamic viscosity per square root of a
// thermodynamic temperature, M L⁻¹ T⁻¹ Θ^(−1/2).
const SutherlandConstantDim quantity.Dim = quantity.DynamicViscosity - quantity.Temperature/2

// SaturationCurve names the vapour-pressure curve of a gas that can
// condense at the temperatures of a test.
type SaturationCurve uint8

// Saturation curves.
const (
	// NoSaturation: no curve is modelled; MinTemperature alone bounds
	// the gas from below.
	NoSaturation SaturationCurve = iota
	// NitrogenSaturation is nitrogen's curve (NitrogenSaturationPressure)
	// from the triple point to the critical point.
	NitrogenSaturation
)

// String names the curve.
func (c SaturationCurve) String() string {
	switch c {
	case NoSaturation:
		return "none"
	case NitrogenSaturation:
		return "nitrogen (Span et al., 2000)"
	}
	return fmt.Sprintf("SaturationCurve(%d)", uint8(c))
}

// Air returns dry air with the constants of ISO 2533:1975: R = 287.052 87
// J/(kg·K), γ = 1.4, β = 1.458 × 10⁻⁶ kg/(m·s·K^(1/2)), S = 110.4 K; and
// Sutherland's law for its conductivity (see ThermalConductivity). It
// is a function, so no caller can change the air (or the standard
// atmosphere) for another.
//
// Its range is 132.6 … 600 K. Air is a mixture with no single saturation
// curve; 132.6 K is its maxcondentherm, the highest temperature at which
// it can condense at any pressure (Lemmon, Jacobsen, Penoncello and
// Friend, J. Phys. Chem. Ref. Data 29 (2000) 331, quoted from memory), so
// above it no state is liquid, and below it the dew point, which depends
// on the pressure, is not modelled. Above 600 K the constant γ = 1.4 no
// longer holds: c_p of air rises from 1.007 kJ/(kg·K) at 300 K to
// 1.051 at 600 K (Incropera and DeWitt, Table A.4, from memory), γ
// falls to about 1.376, and the speed of sound is about 1 % high.
func Air() IdealGas { return isoAir }

var isoAir = IdealGas{GasName: "air", R: quantity.New(287.05287, quantity.SpecificHeatCapacity), Gamma: 1.4,
	Beta: quantity.New(1.458e-6, SutherlandConstantDim), S: kelvin(110.4),
	KRef: quantity.New(0.0241, quantity.ThermalConductivity), KTemp: kelvin(273), KS: kelvin(194),
	MinTemperature: kelvin(132.6), MaxTemperature: kelvin(600)}

// kelvin is the thermodynamic temperature t K.
func kelvin(t float64) quantity.Quantity { return quantity.New(t, quantity.Temperature) }

// Name implements Fluid.
func (g IdealGas) Name() string { return g.GasName }

// gasConstants are the constants of an IdealGas, checked, as numbers in
// the coherent SI units: r J/(kg·K), beta kg/(m·s·K^(1/2)), s, kTemp,
// kS, tMin and tMax K, kRef W/(m·K).
type gasConstants struct {
	r, gamma, beta, s float64
	// kRef, kTemp and kS are zero when the conductivity is not modelled.
	kRef, kTemp, kS float64
	// tMin is 0 and tMax +Inf where the gas states no bound.
	tMin, tMax float64
	saturation SaturationCurve
}

// constant returns the value, in the coherent SI unit, of the gas's
// constant x held in field, which must have dimension want; an optional
// constant may be the zero Quantity (not given, read as 0). A wrong
// dimension is an ErrDimension naming the gas, the field and both
// dimensions.
func (g IdealGas) constant(field, what string, x quantity.Quantity, want quantity.Dim, optional bool) (float64, error) {
	if x.Dim() == want || optional && x == (quantity.Quantity{}) {
		return x.Value(), nil
	}
	return 0, x.CheckNamed(fmt.Sprintf("fluids: %s: IdealGas.%s (%s)", g.GasName, field, what), want)
}

// constants checks the gas's constants, their dimensions first and then
// that they give a physical gas, and returns them as numbers in SI
// units.
func (g IdealGas) constants() (gasConstants, error) {
	// The fields in the order of gasConstants; v holds their values
	// (a pointer into c would move c to the heap on every call).
	fields := [...]struct {
		field, what string
		x           quantity.Quantity
		want        quantity.Dim
		optional    bool
	}{
		{"R", "specific gas constant", g.R, quantity.SpecificHeatCapacity, false},
		{"Beta", "Sutherland's constant β", g.Beta, SutherlandConstantDim, false},
		{"S", "Sutherland's temperature", g.S, quantity.Temperature, false},
		{"KRef", "thermal conductivity at KTemp", g.KRef, quantity.ThermalConductivity, true},
		{"KTemp", "reference temperature of the conductivity", g.KTemp, quantity.Temperature, true},
		{"KS", "Sutherland's temperature for the conductivity", g.KS, quantity.Temperature, true},
		{"MinTemperature", "lowest temperature of the constants", g.MinTemperature, quantity.Temperature, true},
		{"MaxTemperature", "highest temperature of the constants", g.MaxTemperature, quantity.Temperature, true},
	}
	var v [len(fields)]float64
	for i, f := range fields {
		x, err := g.constant(f.field, f.what, f.x, f.want, f.optional)
		if err != nil {
			return gasConstants{}, err
		}
		v[i] = x
	}
	c := gasConstants{r: v[0], gamma: g.Gamma, beta: v[1], s: v[2], kRef: v[3], kTemp: v[4], kS: v[5],
		tMin: v[6], tMax: v[7], saturation: g.Saturation}
	if err := positive(g.GasName, "specific gas constant R", "J/(kg·K)", c.r); err != nil {
		return gasConstants{}, err
	}
	if !(c.gamma > 1) || math.IsInf(c.gamma, 0) {
		return gasConstants{}, &RangeError{Fluid: g.GasName, What: "ratio of specific heats γ", Value: c.gamma, Lo: 1, Hi: math.Inf(1), Unit: unitOne}
	}
	if err := positive(g.GasName, "Sutherland's constant β", "kg/(m·s·K^(1/2))", c.beta); err != nil {
		return gasConstants{}, err
	}
	if !(c.s >= 0) || math.IsInf(c.s, 0) {
		return gasConstants{}, &RangeError{Fluid: g.GasName, What: "Sutherland's temperature S", Value: c.s, Lo: 0, Hi: math.Inf(1), Unit: "K"}
	}
	if !(c.tMin >= 0) || math.IsInf(c.tMin, 0) {
		return gasConstants{}, &RangeError{Fluid: g.GasName, What: "lowest temperature of the constants", Value: c.tMin, Lo: 0, Hi: math.Inf(1), Unit: "K"}
	}
	if !(c.tMax >= 0) || math.IsInf(c.tMax, 0) || (c.tMax > 0 && c.tMax <= c.tMin) {
		return gasConstants{}, &RangeError{Fluid: g.GasName, What: "highest temperature of the constants", Value: c.tMax, Lo: c.tMin, Hi: math.Inf(1), Unit: "K"}
	}
	if c.tMax == 0 {
		c.tMax = math.Inf(1)
	}
	if g.Saturation > NitrogenSaturation {
		return gasConstants{}, &RangeError{Fluid: g.GasName, What: "saturation curve", Value: float64(g.Saturation), Lo: 0, Hi: float64(NitrogenSaturation), Unit: unitOne}
	}
	return c, nil
}

// At implements Fluid. A state outside the gas's temperature range, or
// at or below its condensation temperature at p (LowestTemperature), is
// a *RangeError: no density is given for a liquid or a solid. A constant
// of the wrong dimension is an ErrDimension naming its field.
func (g IdealGas) At(T, p quantity.Quantity) (State, error) {
	if err := check(T, p); err != nil {
		return State{}, err
	}
	t, pr := T.Value(), p.Value()
	c, err := g.constants()
	if err != nil {
		return State{}, err
	}
	if err := g.inRange(c, t); err != nil {
		return State{}, err
	}
	if lo := c.condensation(pr); c.saturation != NoSaturation && !(t > lo) {
		return State{}, &RangeError{Fluid: g.GasName, Unit: "K", What: fmt.Sprintf("temperature at %.6g Pa: at or below the condensation temperature (%s) — not a gas", pr, c.saturation),
			Value: t, Lo: lo, Hi: c.tMax}
	}
	mu, err := g.sutherland(c, t)
	if err != nil {
		return State{}, err
	}
	return finiteState(g.GasName, state(t, pr, pr/(c.r*t), mu, math.Sqrt(c.gamma*c.r*t)))
}

// LowestTemperature returns the lowest temperature at which the gas is
// a gas at pressure p in this model, the larger of MinTemperature and
// the condensation temperature at p: for nitrogen the saturation
// temperature between the triple-point and the critical pressures, the
// triple-point temperature below (where the solid forms) and the
// critical temperature above (a dense fluid that an ideal gas does not
// describe). At refuses a temperature at or below it.
func (g IdealGas) LowestTemperature(p quantity.Quantity) (quantity.Quantity, error) {
	if err := p.CheckNamed("pressure", quantity.Pressure); err != nil {
		return quantity.Quantity{}, err
	}
	if pr := p.Value(); !(pr > 0) || math.IsInf(pr, 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.GasName, What: "absolute pressure", Value: pr, Lo: 0, Hi: math.Inf(1), Unit: "Pa"}
	}
	c, err := g.constants()
	if err != nil {
		return quantity.Quantity{}, err
	}
	return kelvin(c.condensation(p.Value())), nil
}

// condensation is LowestTemperature in K for checked constants and a
// pressure p in Pa.
func (c gasConstants) condensation(p float64) float64 {
	t := c.tMin
	if c.saturation == NitrogenSaturation {
		var ts float64
		switch {
		case p < n2SatP(n2Tt):
			ts = n2Tt
		case p > n2Pc:
			ts = n2Tc
		default:
			ts = n2SatT(p)
		}
		t = max(t, ts)
	}
	return t
}

// inRange refuses a temperature t (K) outside the gas's stated range.
func (g IdealGas) inRange(c gasConstants, t float64) error {
	if !(t > 0) || math.IsInf(t, 0) || t < c.tMin || t > c.tMax {
		return &RangeError{Fluid: g.GasName, What: "temperature for the gas's constants", Value: t, Lo: c.tMin, Hi: c.tMax, Unit: "K"}
	}
	return nil
}

// Viscosity returns Sutherland's dynamic viscosity μ(T) (Pa·s) at the
// thermodynamic temperature T. A T that is not a temperature, or a
// constant of the wrong dimension, is an ErrDimension; a temperature
// outside the gas's range (MinTemperature … MaxTemperature), not
// positive and finite, or constants that give no finite viscosity, is a
// *RangeError. It does not know the pressure, so it cannot check for
// condensation: At does.
func (g IdealGas) Viscosity(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	mu, err := g.viscosity(T.Value())
	if err != nil {
		return quantity.Quantity{}, err
	}
	return quantity.New(mu, quantity.DynamicViscosity), nil
}

// viscosity is Viscosity for T in K, μ in Pa·s.
func (g IdealGas) viscosity(T float64) (float64, error) {
	c, err := g.constants()
	if err != nil {
		return 0, err
	}
	return g.sutherland(c, T)
}

// sutherland is Sutherland's law for checked constants, T in K, μ in
// Pa·s, in the gas's range.
func (g IdealGas) sutherland(c gasConstants, T float64) (float64, error) {
	if err := g.inRange(c, T); err != nil {
		return 0, err
	}
	mu := c.beta * T * math.Sqrt(T) / (T + c.s)
	if !(mu > 0) || math.IsInf(mu, 0) {
		return 0, &RangeError{Fluid: g.GasName, What: "temperature giving a finite, positive Sutherland viscosity", Value: T, Lo: 0, Hi: math.Inf(1), Unit: "K"}
	}
	return mu, nil
}

// Constant is a fluid with fixed properties, for a caller's own liquid or
// a test where properties were measured.
type Constant struct {
	FluidName string
	Density   quantity.Quantity
	Viscosity quantity.Quantity // dynamic
	Sound     quantity.Quantity // zero if not needed
}

// Name implements Fluid.
func (c Constant) Name() string { return c.FluidName }

// At implements Fluid; the properties do not vary.
func (c Constant) At(T, p quantity.Quantity) (State, error) {
	if err := check(T, p); err != nil {
		return State{}, err
	}
	if err := c.Density.CheckNamed(c.FluidName+" density", quantity.Density); err != nil {
		return State{}, err
	}
	if err := c.Viscosity.CheckNamed(c.FluidName+" viscosity", quantity.DynamicViscosity); err != nil {
		return State{}, err
	}
	if err := positive(c.FluidName, "density", "kg/m³", c.Density.Value()); err != nil {
		return State{}, err
	}
	if err := positive(c.FluidName, "dynamic viscosity", "Pa·s", c.Viscosity.Value()); err != nil {
		return State{}, err
	}
	a := 0.0
	if c.Sound != (quantity.Quantity{}) {
		if err := c.Sound.CheckNamed(c.FluidName+" speed of sound", quantity.Velocity); err != nil {
			return State{}, err
		}
		a = c.Sound.Value()
		if err := positive(c.FluidName, "speed of sound", "m/s", a); err != nil {
			return State{}, err
		}
	}
	return finiteState(c.FluidName, state(T.Value(), p.Value(), c.Density.Value(), c.Viscosity.Value(), a))
}
