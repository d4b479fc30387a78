package fluids

import (
	"math"

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
	if err := T.CheckNamed("temperature", quantity.Temperature); err != nil {
		return quantity.Quantity{}, err
	}
	t := T.Value()
	if !(t >= 273.15 && t <= waterTc) {
		return quantity.Quantity{}, &RangeError{Fluid: "water (IAPWS-IF97 saturation)", What: "temperature (K)", Value: t, Lo: 273.15, Hi: waterTc}
	}
	const (
		n1, n2, n3, n4, n5  = 0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7
		n6, n7, n8, n9, n10 = 0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3
	)
	th := t + n9/(t-n10)
	a := th*th + n1*th + n2
	b := n3*th*th + n4*th + n5
	c := n6*th*th + n7*th + n8
	x := 2 * c / (-b + math.Sqrt(b*b-4*a*c))
	return quantity.New(x*x*x*x*1e6, quantity.Pressure), nil
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
		return quantity.Quantity{}, &RangeError{Fluid: "water (IAPWS surface tension)", What: "temperature (K)", Value: t, Lo: 273.16, Hi: waterTc}
	}
	tau := 1 - t/waterTc
	return quantity.New(235.8e-3*math.Pow(tau, 1.256)*(1-0.625*tau), quantity.SurfaceTension), nil
}
