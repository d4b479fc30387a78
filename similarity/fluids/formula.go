package fluids

import (
	"math"

	"similis.dev/similis/internal/dual"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// FormulaFuncs returns the fluid properties of this package as functions
// for the formula language, to give to formula.Options.Funcs, so that a
// derived channel can read nu = nu_water(T_w). Arguments and results are
// in SI: a temperature in kelvins (a formula's 20{°C} or a channel in °C
// is converted), a pressure in pascals, an absolute salinity S as a
// mass fraction in kg/kg, the convention of Water.Salinity (35.16504
// g/kg is 0.03516504, written 35.16504 {g/kg}; a bare 35 is 35 kg/kg
// and refused), a relative humidity as a fraction, 0 … 1.
//
//	rho_water(T)          density of fresh water, kg/m³ (Water.At), 0 … 40 °C
//	mu_water(T)           its dynamic viscosity, Pa·s
//	nu_water(T)           its kinematic viscosity, m²/s
//	pv_water(T)           vapour pressure of water, Pa (VapourPressure, IAPWS-IF97), 0 … 373.946 °C
//	sigma_water(T)        surface tension of water against air, N/m (SurfaceTension, IAPWS), 0.01 … 373.946 °C
//	rho_sea(T, S)         density of sea water of absolute salinity S (kg/kg), kg/m³, 0 … 40 °C, S 0 … 0.045 kg/kg (45 g/kg)
//	mu_sea(T, S)          its dynamic viscosity, Pa·s
//	nu_sea(T, S)          its kinematic viscosity, m²/s
//	rho_air(T, p)         density of dry air as an ideal gas, kg/m³ (Air().At)
//	mu_air(T)             its dynamic viscosity by Sutherland's law, Pa·s
//	nu_air(T, p)          its kinematic viscosity, m²/s
//	rho_humid_air(T, p, RH) density of moist air (HumidAir{}.Density, CIPM-2007), kg/m³, 15 … 27 °C, 600 … 1100 hPa
//
// A value outside a function's range is the package's *RangeError, which
// a formula Evaluator reports with its row and statement; a salinity's
// states its value and range in kg/kg. Every function
// but rho_humid_air gives its exact partial derivatives (Func.Deriv), so
// formula's Gradient carries the uncertainty of a thermometer into ν; a
// program calling rho_humid_air has no Gradient.
func FormulaFuncs() []formula.Func {
	T, p, one := quantity.Temperature, quantity.Pressure, quantity.Dimensionless
	fresh := func(prop func(rho, mu dual.Num) dual.Num) (func([]float64) (float64, error), func(a, g []float64) error) {
		eval := func(a []float64) (float64, error) {
			x, err := waterProp(Water{}, a[0], prop)
			return x.V, err
		}
		deriv := func(a, g []float64) error {
			x, err := waterProp(Water{}, a[0], prop)
			g[0] = x.D
			return err
		}
		return eval, deriv
	}
	sea := func(prop func(rho, mu dual.Num) dual.Num, slope func(t, s float64) float64) (func([]float64) (float64, error), func(a, g []float64) error) {
		eval := func(a []float64) (float64, error) {
			x, err := waterProp(Water{Salinity: quantity.New(a[1], one)}, a[0], prop)
			return x.V, err
		}
		deriv := func(a, g []float64) error {
			x, err := waterProp(Water{Salinity: quantity.New(a[1], one)}, a[0], prop)
			g[0], g[1] = x.D, slope(a[0]-273.15, a[1])
			return err
		}
		return eval, deriv
	}
	rho := func(rho, _ dual.Num) dual.Num { return rho }
	mu := func(_, mu dual.Num) dual.Num { return mu }
	nu := func(rho, mu dual.Num) dual.Num { return mu.Div(rho) }
	rhoSlope := func(t, s float64) float64 { return seaDensitySlope(t, s*1000) * 1000 }
	muSlope := seaViscositySlope
	nuSlope := func(t, s float64) float64 {
		r, m := (Water{Salinity: quantity.New(s, one)}).properties(t)
		return muSlope(t, s)/r.V - m.V/(r.V*r.V)*rhoSlope(t, s)
	}
	fs := []formula.Func{
		{Name: "rho_water", Args: []quantity.Dim{T}, Result: quantity.Density},
		{Name: "mu_water", Args: []quantity.Dim{T}, Result: quantity.DynamicViscosity},
		{Name: "nu_water", Args: []quantity.Dim{T}, Result: quantity.KinematicViscosity},
		{Name: "rho_sea", Args: []quantity.Dim{T, one}, Result: quantity.Density},
		{Name: "mu_sea", Args: []quantity.Dim{T, one}, Result: quantity.DynamicViscosity},
		{Name: "nu_sea", Args: []quantity.Dim{T, one}, Result: quantity.KinematicViscosity},
	}
	fs[0].Eval, fs[0].Deriv = fresh(rho)
	fs[1].Eval, fs[1].Deriv = fresh(mu)
	fs[2].Eval, fs[2].Deriv = fresh(nu)
	fs[3].Eval, fs[3].Deriv = sea(rho, rhoSlope)
	fs[4].Eval, fs[4].Deriv = sea(mu, muSlope)
	fs[5].Eval, fs[5].Deriv = sea(nu, nuSlope)
	air := Air()
	airS := air.S.Value() // Sutherland's temperature of air, K
	return append(fs,
		formula.Func{Name: "pv_water", Args: []quantity.Dim{T}, Result: p,
			Eval: func(a []float64) (float64, error) {
				x, err := vapourPressure(quantity.New(a[0], T))
				return x.V, err
			},
			Deriv: func(a, g []float64) error {
				x, err := vapourPressure(quantity.New(a[0], T))
				g[0] = x.D
				return err
			}},
		formula.Func{Name: "sigma_water", Args: []quantity.Dim{T}, Result: quantity.SurfaceTension,
			Eval: func(a []float64) (float64, error) {
				s, err := SurfaceTension(quantity.New(a[0], T))
				return s.Value(), err
			},
			Deriv: func(a, g []float64) error {
				if _, err := SurfaceTension(quantity.New(a[0], T)); err != nil {
					return err
				}
				// σ = A·τ^1.256·(1 − 0.625τ), τ = 1 − T/T_c.
				tau := 1 - a[0]/waterTc
				g[0] = -235.8e-3 * (1.256*math.Pow(tau, 0.256)*(1-0.625*tau) - 0.625*math.Pow(tau, 1.256)) / waterTc
				return nil
			}},
		formula.Func{Name: "rho_air", Args: []quantity.Dim{T, p}, Result: quantity.Density,
			Eval: func(a []float64) (float64, error) {
				s, err := air.At(quantity.New(a[0], T), quantity.New(a[1], p))
				return s.Density.Value(), err
			},
			Deriv: func(a, g []float64) error {
				s, err := air.At(quantity.New(a[0], T), quantity.New(a[1], p))
				r := s.Density.Value()
				g[0], g[1] = -r/a[0], r/a[1]
				return err
			}},
		formula.Func{Name: "mu_air", Args: []quantity.Dim{T}, Result: quantity.DynamicViscosity,
			Eval: func(a []float64) (float64, error) { return air.viscosity(a[0]) },
			Deriv: func(a, g []float64) error {
				m, err := air.viscosity(a[0])
				g[0] = m * (1.5/a[0] - 1/(a[0]+airS))
				return err
			}},
		formula.Func{Name: "nu_air", Args: []quantity.Dim{T, p}, Result: quantity.KinematicViscosity,
			Eval: func(a []float64) (float64, error) {
				s, err := air.At(quantity.New(a[0], T), quantity.New(a[1], p))
				return s.KinematicViscosity.Value(), err
			},
			Deriv: func(a, g []float64) error {
				s, err := air.At(quantity.New(a[0], T), quantity.New(a[1], p))
				n := s.KinematicViscosity.Value()
				// ν = μ(T)·R·T/p
				g[0], g[1] = n*(1.5/a[0]-1/(a[0]+airS)+1/a[0]), -n/a[1]
				return err
			}},
		formula.Func{Name: "rho_humid_air", Args: []quantity.Dim{T, p, one}, Result: quantity.Density,
			Eval: func(a []float64) (float64, error) {
				r, err := HumidAir{}.Density(quantity.New(a[1], p), quantity.New(a[0], T), a[2])
				return r.Value(), err
			}},
	)
}

// waterProp is a property of water w at T kelvins, with its derivative
// with respect to T, in At's range.
func waterProp(w Water, T float64, prop func(rho, mu dual.Num) dual.Num) (dual.Num, error) {
	if _, err := w.At(quantity.New(T, quantity.Temperature), quantity.New(101325, quantity.Pressure)); err != nil {
		return dual.Num{}, err
	}
	return prop(w.properties(T - 273.15)), nil
}
