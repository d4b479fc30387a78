package ship

import (
	"errors"
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

// ITTC1957 returns the ITTC-1957 model–ship correlation line,
// C_F = 0.075/(log₁₀Re − 2)², for a Reynolds number above 10⁵ (the line
// is not meant for laminar or transitional flow).
func ITTC1957(re float64) (float64, error) { return LineITTC1957.CF(re) }

// HullTest is a towing-tank resistance test to extrapolate to full scale
// by Froude's hypothesis: the total resistance coefficient is a
// frictional part, from the ITTC-1957 line times a form factor (1 + k),
// plus a residual part that depends on the Froude number alone and so
// is the same for model and ship at equal Froude numbers.
type HullTest struct {
	// Scale is λ = L_model/L_ship (1/16 for a 1:16 model).
	Scale float64
	// ModelLength is the model's length for the Reynolds and Froude
	// numbers (waterline length, common practice).
	ModelLength quantity.Quantity
	// ModelWettedArea is the model's wetted surface S_m.
	ModelWettedArea quantity.Quantity
	// Speeds and Resistances are the measured model speeds and total
	// resistances, one per towed run.
	Speeds, Resistances []quantity.Quantity
	// Tank and Sea are the states of the waters of model and ship (from
	// package fluids, or a fluids.State of the caller's own); their
	// density and kinematic viscosity are used. Both are required: a
	// zero State is refused, the field named
	// (fluids.FreshWater().AtCelsius(15) gives a tank's water at 15 °C).
	Tank, Sea fluids.State
	// FormFactor is 1 + k. Zero means no form factor, 1 + k = 1 (the
	// original ITTC-1957 method), exactly as HullRun treats it. See
	// Prohaska.
	FormFactor float64
	// Allowance is the roughness and correlation allowance C_A added to
	// the ship's total resistance coefficient (for example 0.0004; the
	// value is the yard's or basin's own).
	Allowance float64
	// Gravity is g for the Froude number; g_n if zero.
	Gravity quantity.Quantity
	// Line is the friction line for C_F of model and ship; the zero
	// value is the ITTC-1957 line, which the method is defined with.
	Line FrictionLine
}

// HullPoint is one run carried to full scale.
type HullPoint struct {
	ModelSpeed, ModelResistance quantity.Quantity
	Froude                      float64 // Fn = V/√(gL), equal for model and ship
	ModelReynolds               float64
	ModelCT, ModelCF            float64 // total and frictional (ITTC-1957) coefficients
	Residual                    float64 // C_R = C_Tm − (1 + k)·C_Fm
	ShipSpeed                   quantity.Quantity
	ShipReynolds                float64
	ShipCF, ShipCT              float64 // C_Ts = (1 + k)·C_Fs + C_R + C_A
	ShipResistance              quantity.Quantity
	EffectivePower              quantity.Quantity // P_E = R_Ts·V_s
	// Warning, when not empty, says why the point is physically
	// doubtful (a model resistance below the friction line gives a
	// negative residual and can give a negative ship resistance; a model
	// Reynolds number below LaminarReynolds; a C_TM above
	// MaxPlausibleCT); every report that prints the point prints it.
	Warning string
}

// MaxPlausibleCT is the highest model total resistance coefficient C_TM
// taken as plausible for a towed hull; a larger one is flagged, since it
// usually means a wrong wetted surface, speed or force unit, or a reading
// that belongs to another model (common practice; the figure is a rough
// bound, from memory, above what displacement and planing hull models
// show at their resistance hump).
const MaxPlausibleCT = 0.02

func laminarWarning(re float64) string {
	return fmt.Sprintf("the model Reynolds number %.3g is below %.0g: the flow over the model may be partly laminar even with turbulence stimulation (common practice, after the ITTC recommendations), which lowers C_TM and makes the friction-line extrapolation doubtful", re, LaminarReynolds)
}

func implausibleCT(ct float64) string {
	return fmt.Sprintf("the model's C_TM = %.3g×10⁻³ is above %.0f×10⁻³, beyond any towed hull's (common practice): check the wetted surface, the speed and the force unit", ct*1e3, MaxPlausibleCT*1e3)
}

// HullResult is the extrapolation: its inputs, the ship's size, and every
// run with its intermediate coefficients.
type HullResult struct {
	Test                       HullTest
	FormFactor                 float64
	ShipLength, ShipWettedArea quantity.Quantity
	Points                     []HullPoint
	Caution                    string
}

// HullCaution is printed with every hull extrapolation.
const HullCaution = "Full-scale resistance and power from a model test are estimates subject to scale effects; " +
	"hull powering and propulsion are to be confirmed by the basin's own correlation and by the responsible naval architect."

// ExtrapolateHull carries towed-model resistance to the ship by the
// ITTC-1957 method (with a form factor if one is given).
func ExtrapolateHull(t HullTest) (*HullResult, error) {
	m := func(r string) error {
		return &Error{Op: "hull extrapolation", Fault: similarity.Invalid("", r)}
	}
	if !(t.Scale > 0 && t.Scale < 1) {
		return nil, m(fmt.Sprintf("scale %v: want model/ship between 0 and 1", t.Scale))
	}
	if len(t.Speeds) == 0 || len(t.Speeds) != len(t.Resistances) {
		return nil, m(fmt.Sprintf("%d speeds and %d resistances", len(t.Speeds), len(t.Resistances)))
	}
	if err := watersSet("hull extrapolation", "HullTest", t.Tank, t.Sea); err != nil {
		return nil, err
	}
	if err := failNamed("hull extrapolation", similarity.CheckInputs(true,
		similarity.Input{Name: "model length", Value: t.ModelLength, Dim: quantity.Length},
		similarity.Input{Name: "model wetted area", Value: t.ModelWettedArea, Dim: quantity.Area},
		similarity.Input{Name: "tank density", Value: t.Tank.Density, Dim: quantity.Density},
		similarity.Input{Name: "tank viscosity", Value: t.Tank.KinematicViscosity, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "sea density", Value: t.Sea.Density, Dim: quantity.Density},
		similarity.Input{Name: "sea viscosity", Value: t.Sea.KinematicViscosity, Dim: quantity.KinematicViscosity})); err != nil {
		return nil, err
	}
	g, bad := similarity.GravityOr(t.Gravity)
	if bad != nil {
		return nil, fail("hull extrapolation", bad)
	}
	k1 := t.FormFactor
	if k1 == 0 {
		k1 = 1
	}
	if !(k1 >= 1 && k1 <= 2) {
		return nil, m(fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", k1))
	}
	if !(math.Abs(t.Allowance) <= 0.005) {
		return nil, m(fmt.Sprintf("allowance C_A = %v is not finite or outside ±0.005", t.Allowance))
	}
	res := &HullResult{Test: t, FormFactor: k1, Caution: HullCaution}
	Lm, Sm := t.ModelLength.Value(), t.ModelWettedArea.Value()
	Ls, Ss := Lm/t.Scale, Sm/(t.Scale*t.Scale)
	res.ShipLength, res.ShipWettedArea = quantity.New(Ls, quantity.Length), quantity.New(Ss, quantity.Area)
	for i, v := range t.Speeds {
		r := t.Resistances[i]
		if err := failNamed("hull extrapolation", similarity.CheckInputs(false,
			similarity.Input{Name: fmt.Sprintf("speed %d", i+1), Value: v, Dim: quantity.Velocity},
			similarity.Input{Name: fmt.Sprintf("resistance %d", i+1), Value: r, Dim: quantity.Force})); err != nil {
			return nil, err
		}
		if !(v.Value() > 0) || !(r.Value() > 0) || math.IsInf(v.Value(), 0) || math.IsInf(r.Value(), 0) {
			return nil, m(fmt.Sprintf("run %d: speed and resistance must be positive and finite", i+1))
		}
		x := uncertain.Exact
		hv, err := hullMethod(hullCase{
			scale: t.Scale, vm: x(v), rm: x(r), lm: x(t.ModelLength), sm: x(t.ModelWettedArea),
			rhoM: x(t.Tank.Density), nuM: x(t.Tank.KinematicViscosity), rhoS: x(t.Sea.Density), nuS: x(t.Sea.KinematicViscosity),
			formFactor: x(quantity.Scalar(k1)), allowance: x(quantity.Scalar(t.Allowance)), g: g, line: t.Line,
		})
		if err != nil {
			var side *hullSide
			if errors.As(err, &side) {
				where := "model"
				if side.ship {
					where = "ship"
				}
				return nil, &Error{Op: "hull extrapolation", Fault: similarity.Caused(fmt.Sprintf("run %d, %s", i+1, where), fmt.Sprintf("run %d, %s", i+1, where), side.err)}
			}
			return nil, err
		}
		p := HullPoint{ModelSpeed: v, ModelResistance: r,
			Froude: hv.froude.Value(), ModelReynolds: hv.reM.Value(), ModelCT: hv.ctM.Value(), ModelCF: hv.cfM.Value(),
			Residual: hv.residual.Value(), ShipSpeed: hv.vs.Quantity(), ShipReynolds: hv.reS.Value(),
			ShipCF: hv.cfS.Value(), ShipCT: hv.ctS.Value(), ShipResistance: hv.rs.Quantity(), EffectivePower: hv.pe.Quantity()}
		Rs := p.ShipResistance.Value()
		if !allFinite(Rs, p.EffectivePower.Value(), p.Froude, p.ModelCT) {
			return nil, m(fmt.Sprintf("run %d: the ship resistance is not finite", i+1))
		}
		p.Warning = hullWarning(fmt.Sprintf("run %d (V_m = %.4g m/s): ", i+1, v.Value()), p.ModelReynolds, p.ModelCT, p.Residual, Rs)
		res.Points = append(res.Points, p)
	}
	return res, nil
}

// watersSet refuses a tank or sea water state left unset (the zero
// fluids.State) in the input struct typ of procedure op, naming the field
// and the fix.
func watersSet(op, typ string, tank, sea fluids.State) error {
	for _, w := range [...]struct {
		field, fix string
		st         fluids.State
	}{
		{"Tank", "tank water's state, e.g. fluids.FreshWater().AtCelsius(15)", tank},
		{"Sea", "sea water's state, e.g. fluids.SeaWater().AtCelsius(15)", sea},
	} {
		if w.st == (fluids.State{}) {
			f := typ + "." + w.field
			return &Error{Op: op, Fault: similarity.Invalid(f, f+" is not set: give the "+w.fix)}
		}
	}
	return nil
}
