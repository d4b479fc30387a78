package fluids

import (
	"math"

	"similis.dev/similis/internal/dual"
	"similis.dev/similis/quantity"
)

// Critical point of water (IAPWS).
const (
	waterTc = 647.096 // K
	waterPc = 22.064e6
)

// VapourPressure returns the saturation (vapour) pressure of pure water
// at the thermodynamic temperature T, by the saturation-pressure equation
// of IAPWS-IF97 (region 4, eq. 30), from 273.15 K to the critical point
// 647.096 K; outside, a *RangeError. The vapour pressure of sea water is
// lower (by about 1.8 % at 35 g/kg) and is not modelled here.
func VapourPressure(T quantity.Quantity) (quantity.Quantity, error) {
	p, err := vapourPressure(T)
	if err != nil {
		return quantity.Quantity{}, err
	}
	return quantity.New(p.V, quantity.Pressure), nil
}

// VapourPressureSlope returns the vapour pressure at T and its exact
// derivative dp_v/dT (Pa/K) from the same IAPWS-IF97 equation, for an
// uncertainty budget in which a thermometer reaches p_v.
func VapourPressureSlope(T quantity.Quantity) (pv, slope quantity.Quantity, err error) {
	p, err := vapourPressure(T)
	if err != nil {
		return quantity.Quantity{}, quantity.Quantity{}, err
	}
	return quantity.New(p.V, quantity.Pressure), quantity.New(p.D, quantity.Pressure).Div(quantity.New(1, quantity.Temperature)), nil
}

// vapourPressure is IAPWS-IF97 eq. 30 over dual numbers: p_v and its
// derivative with respect to T.
func vapourPressure(T quantity.Quantity) (dual.Num, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return dual.Num{}, err
	}
	t := T.Value()
	if !(t >= 273.15 && t <= waterTc) {
		return dual.Num{}, &RangeError{Fluid: "water (IAPWS-IF97 saturation)", What: "temperature", Value: t, Lo: 273.15, Hi: waterTc, Unit: "K"}
	}
	const (
		n1, n2, n3, n4, n5  = 0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7
		n6, n7, n8, n9, n10 = 0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3
	)
	tv := dual.Var(t)
	th := tv.Add(dual.Const(n9).Div(tv.AddC(-n10)))
	a := th.Mul(th).Add(th.Scale(n1)).AddC(n2)
	b := th.Mul(th).Scale(n3).Add(th.Scale(n4)).AddC(n5)
	c := th.Mul(th).Scale(n6).Add(th.Scale(n7)).AddC(n8)
	x := c.Scale(2).Div(b.Mul(b).Sub(a.Mul(c).Scale(4)).Sqrt().Sub(b))
	x2 := x.Mul(x)
	return x2.Mul(x2).Scale(1e6), nil
}

// SurfaceTension returns the surface tension of pure water against its
// vapour (in practice, against air) at T, by the IAPWS release on the
// surface tension of ordinary water substance (2014):
// σ = 235.8 mN/m·τ^1.256·(1 − 0.625τ), τ = 1 − T/647.096 K, from the
// triple point 273.16 K to the critical point; outside, a *RangeError.
func SurfaceTension(T quantity.Quantity) (quantity.Quantity, error) {
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	t := T.Value()
	if !(t >= 273.16 && t <= waterTc) {
		return quantity.Quantity{}, &RangeError{Fluid: "water (IAPWS surface tension)", What: "temperature", Value: t, Lo: 273.16, Hi: waterTc, Unit: "K"}
	}
	tau := 1 - t/waterTc
	return quantity.New(235.8e-3*math.Pow(tau, 1.256)*(1-0.625*tau), quantity.SurfaceTension), nil
}
