package fluids

import (
	"math"

	"similis.dev/similis/quantity"
)

// The thermal properties a heat-transfer test scales with: thermal
// conductivity k, isobaric specific heat c_p and the Prandtl number
// Pr = μ·c_p/k.

// SpecificHeat returns the isobaric specific heat of the ideal gas,
// c_p = γR/(γ − 1), constant with temperature in this model (within
// 0.5 % of the reference equation of state for air between 250 and
// 350 K at one atmosphere; it rises above that).
func (g IdealGas) SpecificHeat() (quantity.Quantity, error) {
	c, err := g.constants()
	if err != nil {
		return quantity.Quantity{}, err
	}
	cp := c.gamma * c.r / (c.gamma - 1)
	if math.IsInf(cp, 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.GasName, What: "constants (R, γ) giving a finite specific heat γR/(γ − 1)", Value: cp, Lo: 0, Hi: math.MaxFloat64, Unit: "J/(kg·K)"}
	}
	return quantity.New(cp, quantity.SpecificHeatCapacity), nil
}

// ThermalConductivity returns the gas's thermal conductivity at T by
// Sutherland's law with the constants of F. M. White, Viscous Fluid Flow
// (Table 1-3; air k₀ = 0.0241 W/(m·K), S = 194 K; nitrogen 0.0242,
// 150 K; quoted from memory), stated there to within a few per cent from
// 160 to 2000 K; outside that range, or for a gas without the constants
// (KRef, KTemp, KS), a *RangeError. A constant of the wrong dimension is
// an ErrDimension naming its field.
func (g IdealGas) ThermalConductivity(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	c, err := g.constants()
	if err != nil {
		return quantity.Quantity{}, err
	}
	if !(c.kRef > 0 && c.kTemp > 0 && c.kS > 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.GasName, What: "thermal conductivity constants (none given)", Value: c.kRef, Lo: 0, Hi: math.Inf(1), Unit: "W/(m·K)"}
	}
	t := T.Value()
	if !(t >= 160 && t <= 2000) {
		return quantity.Quantity{}, &RangeError{Fluid: g.GasName, What: "temperature for the conductivity law", Value: t, Lo: 160, Hi: 2000, Unit: "K"}
	}
	k := c.kRef * math.Pow(t/c.kTemp, 1.5) * (c.kTemp + c.kS) / (t + c.kS)
	if !(k > 0) || math.IsInf(k, 0) {
		return quantity.Quantity{}, &RangeError{Fluid: g.GasName, What: "conductivity constants giving a finite conductivity at this temperature", Value: t, Lo: 160, Hi: 2000, Unit: "K"}
	}
	return quantity.New(k, quantity.ThermalConductivity), nil
}

// Prandtl returns Pr = μ·c_p/k of the gas at T.
func (g IdealGas) Prandtl(T quantity.Quantity) (float64, error) {
	k, err := g.ThermalConductivity(T)
	if err != nil {
		return 0, err
	}
	cp, err := g.SpecificHeat()
	if err != nil {
		return 0, err
	}
	mu, err := g.viscosity(T.Value())
	if err != nil {
		return 0, err
	}
	pr := mu * cp.Value() / k.Value()
	if !(pr > 0) || math.IsInf(pr, 0) {
		return 0, &RangeError{Fluid: g.GasName, What: "constants giving a finite Prandtl number at this temperature", Value: T.Value(), Lo: 0, Hi: math.Inf(1), Unit: "K"}
	}
	return pr, nil
}

// ThermalConductivity returns the thermal conductivity of fresh water at
// one atmosphere by the correlation of Ramires, Nieto de Castro, Nagasaka,
// Nagashima, Assael and Wakeham (J. Phys. Chem. Ref. Data 24 (1995) 1377),
// k = 0.6065·(−1.48445 + 4.12292·T* − 1.63866·T*²) W/(m·K),
// T* = T/298.15 K, for 274 … 370 K (coefficients quoted from memory).
// Sea water is not modelled.
func (w Water) ThermalConductivity(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	if s, err := w.salinity(); err != nil || s != 0 {
		if err != nil {
			return quantity.Quantity{}, err
		}
		return quantity.Quantity{}, &RangeError{Fluid: w.Name(), What: "absolute salinity (mass fraction) for the conductivity correlation (fresh water only)", Value: s, Lo: 0, Hi: 0, Unit: "kg/kg"}
	}
	t := T.Value()
	if !(t >= 274 && t <= 370) {
		return quantity.Quantity{}, &RangeError{Fluid: w.Name(), What: "temperature for the conductivity correlation", Value: t, Lo: 274, Hi: 370, Unit: "K"}
	}
	ts := t / 298.15
	return quantity.New(0.6065*(-1.48445+4.12292*ts-1.63866*ts*ts), quantity.ThermalConductivity), nil
}

// waterCp is the isobaric specific heat of fresh water at 101.325 kPa
// from the IAPWS-95 formulation (evaluated with python3-iapws 1.5.2),
// J/(kg·K), at 5 K steps from the triple point.
var waterCp = [...][2]float64{
	{273.16, 4219.410230}, {278.15, 4205.037692}, {283.15, 4195.158886}, {288.15, 4188.460623},
	{293.15, 4184.050925}, {298.15, 4181.314991}, {303.15, 4179.819672}, {308.15, 4179.258102},
	{313.15, 4179.414798}, {318.15, 4180.141940}, {323.15, 4181.342303}, {328.15, 4182.956504},
	{333.15, 4184.953280}, {338.15, 4187.322032}, {343.15, 4190.067099}, {348.15, 4193.203419},
	{353.15, 4196.753264}, {358.15, 4200.743848}, {363.15, 4205.205606}, {368.15, 4210.171015},
}

// SpecificHeat returns the isobaric specific heat of fresh water at one
// atmosphere: the IAPWS-95 formulation tabulated at 5 K steps from
// 273.16 to 368.15 K and interpolated by cubic Hermite segments (within
// 0.01 % of the formulation between the steps). Sea water is not modelled.
func (w Water) SpecificHeat(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	if s, err := w.salinity(); err != nil || s != 0 {
		if err != nil {
			return quantity.Quantity{}, err
		}
		return quantity.Quantity{}, &RangeError{Fluid: w.Name(), What: "absolute salinity (mass fraction) for the specific heat (fresh water only)", Value: s, Lo: 0, Hi: 0, Unit: "kg/kg"}
	}
	t := T.Value()
	n := len(waterCp)
	if !(t >= waterCp[0][0] && t <= waterCp[n-1][0]) {
		return quantity.Quantity{}, &RangeError{Fluid: w.Name(), What: "temperature for the specific heat", Value: t, Lo: waterCp[0][0], Hi: waterCp[n-1][0], Unit: "K"}
	}
	i := 1
	for i < n-1 && waterCp[i][0] < t {
		i++
	}
	// Hermite interpolation with centred-difference slopes.
	slope := func(j int) float64 {
		a, b := max(j-1, 0), min(j+1, n-1)
		return (waterCp[b][1] - waterCp[a][1]) / (waterCp[b][0] - waterCp[a][0])
	}
	x0, x1 := waterCp[i-1][0], waterCp[i][0]
	hx := x1 - x0
	s := (t - x0) / hx
	h00, h10 := 2*s*s*s-3*s*s+1, s*s*s-2*s*s+s
	h01, h11 := -2*s*s*s+3*s*s, s*s*s-s*s
	cp := h00*waterCp[i-1][1] + h10*hx*slope(i-1) + h01*waterCp[i][1] + h11*hx*slope(i)
	return quantity.New(cp, quantity.SpecificHeatCapacity), nil
}

// Prandtl returns Pr = μ·c_p/k of fresh water at T, with μ from At.
func (w Water) Prandtl(T quantity.Quantity) (float64, error) {
	s, err := w.At(T, quantity.New(101325, quantity.Pressure))
	if err != nil {
		return 0, err
	}
	k, err := w.ThermalConductivity(T)
	if err != nil {
		return 0, err
	}
	cp, err := w.SpecificHeat(T)
	if err != nil {
		return 0, err
	}
	return s.DynamicViscosity.Value() * cp.Value() / k.Value(), nil
}
