package ship

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity"
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
	// Line is the friction line for C_F of model and ship; the zero
	// value is the ITTC-1957 line, as for HullTest.
	Line FrictionLine
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

// lineCF is the friction line's C_F at a Measured Reynolds number: the
// value exactly as FrictionLine.CF gives it, with its derivative.
func lineCF(l FrictionLine, re uncertain.Measured) (uncertain.Measured, error) {
	cf, err := l.CF(re.Value())
	if err != nil {
		return uncertain.Measured{}, err
	}
	return uncertain.Apply(re, quantity.Scalar(cf), quantity.Scalar(l.slope(re.Value(), cf))), nil
}

// hullCase is one run of the hull method with every input Measured:
// exact values for ExtrapolateHull, measured ones for ExtrapolateHullRun.
type hullCase struct {
	scale                 float64
	vm, rm, lm, sm        uncertain.Measured
	rhoM, nuM, rhoS, nuS  uncertain.Measured
	formFactor, allowance uncertain.Measured
	g                     quantity.Quantity
	line                  FrictionLine
}

// hullValues are one run's results.
type hullValues struct {
	froude, reM, ctM, cfM, residual uncertain.Measured
	vs, reS, cfS, ctS, rs, pe       uncertain.Measured
}

// hullSide says which friction coefficient failed.
type hullSide struct {
	ship bool
	err  error
}

func (e *hullSide) Error() string { return e.err.Error() }
func (e *hullSide) Unwrap() error { return e.err }

// hullMethod is the ITTC-1957 hull method (Froude's hypothesis with a
// form factor and an allowance), written once for both extrapolations:
//
//	Fn = V_m/√(g·L_m), Re_m = V_m·L_m/ν_m, C_Tm = R_m/(½ρ_m·V_m²·S_m)
//	C_R = C_Tm − (1 + k)·C_F(Re_m)
//	V_s = V_m/√λ, L_s = L_m/λ, S_s = S_m/λ², Re_s = V_s·L_s/ν_s
//	C_Ts = (1 + k)·C_F(Re_s) + C_R + C_A, R_s = C_Ts·½ρ_s·V_s²·S_s, P_E = R_s·V_s
//
// The operations are ordered as plain float arithmetic would order
// them, so exact inputs give the plain method's numbers. An error from a
// friction line is a *hullSide saying model or ship.
func hullMethod(c hullCase) (v hullValues, err error) {
	var cfErr error
	_, err = uncertain.Eval(func() uncertain.Measured {
		half := 0.5
		v.froude = c.vm.Div(c.lm.MulQ(c.g).Sqrt())
		v.reM = c.vm.Mul(c.lm).Div(c.nuM)
		v.ctM = c.rm.Div(c.rhoM.Scale(half).Mul(c.vm).Mul(c.vm).Mul(c.sm))
		if v.cfM, cfErr = lineCF(c.line, v.reM); cfErr != nil {
			cfErr = &hullSide{false, cfErr}
			return uncertain.Measured{}
		}
		v.residual = v.ctM.Sub(c.formFactor.Mul(v.cfM))
		v.vs = c.vm.DivQ(quantity.Scalar(math.Sqrt(c.scale)))
		ls, ss := c.lm.DivQ(quantity.Scalar(c.scale)), c.sm.DivQ(quantity.Scalar(c.scale*c.scale))
		v.reS = v.vs.Mul(ls).Div(c.nuS)
		if v.cfS, cfErr = lineCF(c.line, v.reS); cfErr != nil {
			cfErr = &hullSide{true, cfErr}
			return uncertain.Measured{}
		}
		v.ctS = c.formFactor.Mul(v.cfS).Add(v.residual).Add(c.allowance)
		v.rs = v.ctS.Scale(half).Mul(c.rhoS).Mul(v.vs).Mul(v.vs).Mul(ss)
		v.pe = v.rs.Mul(v.vs)
		return v.pe
	})
	if err == nil {
		err = cfErr
	}
	return v, err
}

// hullWarning says why a run is physically doubtful, or returns "": a
// ship resistance at or below zero, a negative C_R, a model Reynolds
// number below LaminarReynolds, a C_TM above MaxPlausibleCT. Both hull
// extrapolations use it.
func hullWarning(prefix string, reM, ctM, residual, rs float64) string {
	var warn []string
	switch {
	case rs <= 0:
		warn = append(warn, fmt.Sprintf("the ship resistance comes out %s: the model's C_T is below (1 + k)·C_F, so the measurement, the form factor or the friction line is in doubt; do not use this point", fmtCoef(rs, "N")))
	case residual < 0:
		warn = append(warn, fmt.Sprintf("the residual coefficient C_R = %.4g is negative (the model's C_T is below (1 + k)·C_F): check the run and the form factor", residual))
	}
	if reM < LaminarReynolds {
		warn = append(warn, laminarWarning(reM))
	}
	if ctM > MaxPlausibleCT {
		warn = append(warn, implausibleCT(ctM))
	}
	for i := range warn {
		warn[i] = prefix + warn[i]
	}
	return strings.Join(warn, "; ")
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
		return &Error{Op: "hull extrapolation with uncertainty", Fault: similarity.Invalid("", s)}
	}
	if !(r.Scale > 0 && r.Scale < 1) {
		return HullRunResult{}, m(fmt.Sprintf("scale %v: want model/ship between 0 and 1", r.Scale))
	}
	const method = "hull extrapolation with uncertainty"
	if err := fail(method, similarity.CheckInputs(true,
		similarity.Input{Name: "model length", Value: r.ModelLength.Quantity(), Dim: quantity.Length},
		similarity.Input{Name: "model wetted area", Value: r.ModelWettedArea.Quantity(), Dim: quantity.Area},
		similarity.Input{Name: "model speed", Value: r.ModelSpeed.Quantity(), Dim: quantity.Velocity},
		similarity.Input{Name: "model resistance", Value: r.ModelResistance.Quantity(), Dim: quantity.Force},
		similarity.Input{Name: "tank temperature", Value: r.TankTemperature.Quantity(), Dim: quantity.Temperature},
		similarity.Input{Name: "sea temperature", Value: r.SeaTemperature.Quantity(), Dim: quantity.Temperature})); err != nil {
		return HullRunResult{}, err
	}
	if err := fail(method, similarity.CheckInputs(false,
		similarity.Input{Name: "form factor", Value: r.FormFactor.Quantity(), Dim: quantity.Dimensionless},
		similarity.Input{Name: "allowance", Value: r.Allowance.Quantity(), Dim: quantity.Dimensionless})); err != nil {
		return HullRunResult{}, err
	}
	if r.FormFactor.Value() == 0 && r.FormFactor.Set() == nil {
		r.FormFactor = uncertain.Exact(quantity.Scalar(1))
	}
	if k := r.FormFactor.Value(); !(k >= 1 && k <= 2) {
		return HullRunResult{}, m(fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", k))
	}
	g, bad := similarity.GravityOr(r.Gravity)
	if bad != nil {
		return HullRunResult{}, fail("hull run", bad)
	}
	var res HullRunResult
	var err error
	if res.TankDensity, res.TankViscosity, err = water(r.Tank, r.TankTemperature); err != nil {
		return HullRunResult{}, &Error{Op: method, Fault: similarity.Caused("tank temperature", "tank water", err)}
	}
	if res.SeaDensity, res.SeaViscosity, err = water(r.Sea, r.SeaTemperature); err != nil {
		return HullRunResult{}, &Error{Op: method, Fault: similarity.Caused("sea temperature", "sea water", err)}
	}
	res, err = hullRun(r, g, res)
	if err != nil {
		return HullRunResult{}, err
	}
	res.FormFactor = r.FormFactor
	res.Caution = HullCaution
	return res, nil
}

func hullRun(r HullRun, g quantity.Quantity, res HullRunResult) (HullRunResult, error) {
	v, err := hullMethod(hullCase{
		scale: r.Scale, vm: r.ModelSpeed, rm: r.ModelResistance, lm: r.ModelLength, sm: r.ModelWettedArea,
		rhoM: res.TankDensity, nuM: res.TankViscosity, rhoS: res.SeaDensity, nuS: res.SeaViscosity,
		formFactor: r.FormFactor, allowance: r.Allowance, g: g, line: r.Line,
	})
	if err != nil {
		var te *uncertain.Error
		if errors.As(err, &te) && te.Terms > 0 {
			return HullRunResult{}, &Error{Op: "hull extrapolation with uncertainty", Fault: similarity.Invalid("", fmt.Sprintf("more than %d sources for one run: combine some before the extrapolation", uncertain.MaxTerms))}
		}
		var side *hullSide
		if errors.As(err, &side) {
			return HullRunResult{}, side.err
		}
		return HullRunResult{}, err
	}
	res.Froude, res.ModelCT, res.ModelCF, res.Residual = v.froude, v.ctM, v.cfM, v.residual
	res.ShipSpeed, res.ShipCF, res.ShipCT, res.ShipResistance, res.EffectivePower = v.vs, v.cfS, v.ctS, v.rs, v.pe
	if !allFinite(res.ShipResistance.Value(), res.EffectivePower.Value(), res.ShipResistance.U().Value(), res.EffectivePower.U().Value()) {
		return HullRunResult{}, &Error{Op: "hull extrapolation with uncertainty", Fault: similarity.Invalid("", "the ship resistance or its uncertainty is not finite")}
	}
	res.Warning = hullWarning("", v.reM.Value(), v.ctM.Value(), v.residual.Value(), v.rs.Value())
	return res, nil
}
