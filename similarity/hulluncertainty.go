package similarity

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
)

// HullRun is one towed run with the uncertainty of every input, for
// carrying the run to full scale with its uncertainty budget. The tank
// and sea water properties follow from the measured temperatures through
// the water correlations of package fluids, so a thermometer's
// uncertainty reaches the result through density and viscosity, with the
// correlations' exact temperature slopes (fluids.Water.Slopes).
type HullRun struct {
	// Scale is λ = L_model/L_ship, exact.
	Scale float64
	// ModelLength and ModelWettedArea are the model's waterline length
	// and wetted surface.
	ModelLength, ModelWettedArea uncertain.Measured
	// ModelSpeed and ModelResistance are the run's measured speed and
	// total resistance.
	ModelSpeed, ModelResistance uncertain.Measured
	// TankTemperature and SeaTemperature are thermodynamic temperatures
	// (kelvin) of the tank water and the sea.
	TankTemperature, SeaTemperature uncertain.Measured
	// Tank and Sea are the waters (fluids.FreshWater(), fluids.SeaWater()).
	Tank, Sea fluids.Water
	// FormFactor is 1 + k (dimensionless); zero (the zero Measured, or an
	// exact zero) means no form factor, 1 + k = 1, exactly as HullTest
	// treats it. Allowance is C_A (zero: none).
	FormFactor, Allowance uncertain.Measured
	// Gravity is g; g_n if zero.
	Gravity quantity.Quantity
}

// HullRunResult is a run carried to full scale, each value with the
// derivatives with respect to every source of the run, so that
// ShipResistance.Budget and EffectivePower.Budget say which measurement
// dominates.
type HullRunResult struct {
	Froude                      uncertain.Measured
	ModelCT, ModelCF            uncertain.Measured
	Residual                    uncertain.Measured // C_R = C_Tm − (1 + k)·C_Fm
	ShipSpeed                   uncertain.Measured
	ShipCF, ShipCT              uncertain.Measured
	ShipResistance              uncertain.Measured
	EffectivePower              uncertain.Measured
	TankDensity, SeaDensity     uncertain.Measured
	TankViscosity, SeaViscosity uncertain.Measured // kinematic viscosities
	// FormFactor is the 1 + k used (1 when the run gave zero).
	FormFactor uncertain.Measured
	// Warning, when not empty, says why the run is doubtful (a model
	// Reynolds number below LaminarReynolds, a negative C_R, a C_TM above
	// MaxPlausibleCT), as HullPoint.Warning does.
	Warning string
	Caution string
}

// ittc1957 is the ITTC-1957 line on a Measured Reynolds number.
func ittc1957(re uncertain.Measured) uncertain.Measured {
	d := uncertain.Log10(re).Sub(uncertain.Exact(quantity.Scalar(2)))
	return d.Mul(d).Inv().Scale(0.075)
}

// water returns ρ and ν of w at the measured temperature T.
func water(w fluids.Water, T uncertain.Measured) (rho, nu uncertain.Measured, err error) {
	s, err := w.At(T.Quantity(), quantity.New(101325, quantity.Pressure))
	if err != nil {
		return rho, nu, err
	}
	dRho, dNu, err := w.Slopes(T.Quantity())
	if err != nil {
		return rho, nu, err
	}
	return uncertain.Apply(T, s.Density, dRho), uncertain.Apply(T, s.KinematicViscosity, dNu), nil
}

// ExtrapolateHullRun carries one run to full scale by the same method as
// ExtrapolateHull (ITTC-1957 line, form factor, allowance; Froude
// similarity), propagating the inputs' uncertainties to first order. The
// form factor's own uncertainty, if it comes from a Prohaska fit of the
// same runs, shares their sources only approximately: give it as a
// separate source (ProhaskaResult.FormFactorStdErr is its Type A part).
func ExtrapolateHullRun(r HullRun) (HullRunResult, error) {
	m := func(s string) error {
		return &ExtrapolationError{Method: "hull extrapolation with uncertainty", Reason: s}
	}
	if !(r.Scale > 0 && r.Scale < 1) {
		return HullRunResult{}, m(fmt.Sprintf("scale %v: want model/ship between 0 and 1", r.Scale))
	}
	const method = "hull extrapolation with uncertainty"
	if err := checkInputs(method, true,
		input{"model length", r.ModelLength.Quantity(), quantity.Length}, input{"model wetted area", r.ModelWettedArea.Quantity(), quantity.Area},
		input{"model speed", r.ModelSpeed.Quantity(), quantity.Velocity}, input{"model resistance", r.ModelResistance.Quantity(), quantity.Force},
		input{"tank temperature", r.TankTemperature.Quantity(), quantity.Temperature}, input{"sea temperature", r.SeaTemperature.Quantity(), quantity.Temperature},
	); err != nil {
		return HullRunResult{}, err
	}
	if err := checkInputs(method, false,
		input{"form factor", r.FormFactor.Quantity(), quantity.Dimensionless}, input{"allowance", r.Allowance.Quantity(), quantity.Dimensionless},
	); err != nil {
		return HullRunResult{}, err
	}
	if r.FormFactor.Value() == 0 && r.FormFactor.Set() == nil {
		r.FormFactor = uncertain.Exact(quantity.Scalar(1))
	}
	if k := r.FormFactor.Value(); !(k >= 1 && k <= 2) {
		return HullRunResult{}, m(fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", k))
	}
	g, err := gravityOr("hull run", r.Gravity)
	if err != nil {
		return HullRunResult{}, err
	}
	var res HullRunResult
	if res.TankDensity, res.TankViscosity, err = water(r.Tank, r.TankTemperature); err != nil {
		return HullRunResult{}, m("tank water: " + err.Error())
	}
	if res.SeaDensity, res.SeaViscosity, err = water(r.Sea, r.SeaTemperature); err != nil {
		return HullRunResult{}, m("sea water: " + err.Error())
	}
	res, err = hullRun(r, g, res)
	if err != nil {
		return HullRunResult{}, err
	}
	res.FormFactor = r.FormFactor
	res.Caution = HullCaution
	var warn []string
	if re := r.ModelSpeed.Value() * r.ModelLength.Value() / res.TankViscosity.Value(); re < LaminarReynolds {
		warn = append(warn, laminarWarning(re))
	}
	if res.Residual.Value() < 0 {
		warn = append(warn, fmt.Sprintf("the residual coefficient C_R = %.4g is negative (the model's C_T is below (1 + k)·C_F): check the run and the form factor", res.Residual.Value()))
	}
	if res.ModelCT.Value() > MaxPlausibleCT {
		warn = append(warn, implausibleCT(res.ModelCT.Value()))
	}
	res.Warning = strings.Join(warn, "; ")
	return res, nil
}

func hullRun(r HullRun, g quantity.Quantity, res HullRunResult) (HullRunResult, error) {
	var reM, reS float64
	_, err := uncertain.Eval(func() uncertain.Measured {
		vm, lm, sm := r.ModelSpeed, r.ModelLength, r.ModelWettedArea
		half := uncertain.Exact(quantity.Scalar(0.5))
		res.Froude = vm.Div(lm.MulQ(g).Sqrt())
		re := vm.Mul(lm).Div(res.TankViscosity)
		reM = re.Value()
		res.ModelCF = ittc1957(re)
		res.ModelCT = r.ModelResistance.Div(half.Mul(res.TankDensity).Mul(vm).Mul(vm).Mul(sm))
		res.Residual = res.ModelCT.Sub(r.FormFactor.Mul(res.ModelCF))
		inv := 1 / r.Scale
		res.ShipSpeed = vm.Scale(1 / math.Sqrt(r.Scale))
		ls, ss := lm.Scale(inv), sm.Scale(inv*inv)
		reShip := res.ShipSpeed.Mul(ls).Div(res.SeaViscosity)
		reS = reShip.Value()
		res.ShipCF = ittc1957(reShip)
		res.ShipCT = r.FormFactor.Mul(res.ShipCF).Add(res.Residual).Add(r.Allowance)
		res.ShipResistance = res.ShipCT.Mul(half.Mul(res.SeaDensity).Mul(res.ShipSpeed).Mul(res.ShipSpeed).Mul(ss))
		res.EffectivePower = res.ShipResistance.Mul(res.ShipSpeed)
		return res.EffectivePower
	})
	if err != nil {
		var te *uncertain.TermsError
		if errors.As(err, &te) {
			return HullRunResult{}, &ExtrapolationError{Method: "hull extrapolation with uncertainty", Reason: fmt.Sprintf("more than %d sources for one run: combine some before the extrapolation", uncertain.MaxTerms)}
		}
		return HullRunResult{}, err
	}
	for _, re := range []float64{reM, reS} {
		if !(re >= minLineRe && re <= maxLineRe) {
			return HullRunResult{}, &ExtrapolationError{Method: "ITTC-1957 line", Reason: fmt.Sprintf("Reynolds number %g is outside 10⁵ … 10¹⁰ or not finite", re)}
		}
	}
	return res, nil
}

// MeasuredRatio returns the ratio (model/prototype) of the dimension d
// as a measured value: its law evaluated at the free ratios, each given
// either in free as a measured value (a scale known to its uncertainty,
// say a model length measured against a drawing's) or fixed in the
// solution (exact). The exponents are exact.
func (s *Solution) MeasuredRatio(d quantity.Dim, free map[string]uncertain.Measured) (uncertain.Measured, error) {
	r, err := s.DerivedRatio(d)
	if err != nil {
		return uncertain.Measured{}, err
	}
	for sym := range free {
		if !slices.Contains(s.Params(), sym) {
			return uncertain.Measured{}, &PlanError{Err: ErrBadRatio, Reason: fmt.Sprintf("λ_%s is not a parameter of this plan (%s)", sym, strings.Join(s.Params(), ", "))}
		}
	}
	out := uncertain.Exact(quantity.Scalar(1))
	for _, t := range r.Law.Terms {
		x, ok := free[t.Symbol]
		if !ok {
			fixed, ferr := s.Ratio(t.Symbol)
			if ferr != nil || math.IsNaN(fixed.Value) {
				return uncertain.Measured{}, &PlanError{Err: ErrUnknownRatio, Reason: fmt.Sprintf("%s: the free ratio λ_%s has no value; give it in free", quantity.Describe(d), t.Symbol)}
			}
			x = uncertain.Exact(quantity.Scalar(fixed.Value))
		}
		if !x.Quantity().IsDimensionless() || !(x.Value() > 0) || math.IsInf(x.Value(), 0) {
			return uncertain.Measured{}, &PlanError{Err: ErrBadRatio, Reason: fmt.Sprintf("free ratio λ_%s = %v: want a positive number", t.Symbol, x.Quantity())}
		}
		if out, err = uncertain.Eval(func() uncertain.Measured {
			return out.Mul(x.Pow(int(t.Exp.Num()), int(t.Exp.Den())))
		}); err != nil {
			return uncertain.Measured{}, err
		}
	}
	return out, nil
}

// MeasuredToPrototype carries a measured model value to full scale,
// q_p = q_m/λ, with λ from MeasuredRatio: the uncertainty of the model
// value and of any measured free ratio both reach the result.
func (s *Solution) MeasuredToPrototype(m uncertain.Measured, free map[string]uncertain.Measured) (uncertain.Measured, error) {
	r, err := s.MeasuredRatio(m.Dim(), free)
	if err != nil {
		return uncertain.Measured{}, err
	}
	return uncertain.Eval(func() uncertain.Measured { return m.Div(r) })
}
