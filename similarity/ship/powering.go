package ship

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/internal/roots"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

// OpenWaterPoint is one point of a propeller's open-water curve: the
// advance ratio J = V_A/(nD), the thrust coefficient K_T = T/(ρn²D⁴) and
// the torque coefficient K_Q = Q/(ρn²D⁵), with n in revolutions per
// second (ITTC 7.5-02-03-02.1). K_Q is the coefficient itself, not 10K_Q.
type OpenWaterPoint struct{ J, KT, KQ float64 }

// PropellerGeometry is what the ITTC-1978 scale correction of the
// propeller characteristics needs, at 0.75 of the radius.
type PropellerGeometry struct {
	Diameter       quantity.Quantity // the ship propeller's D
	Blades         int               // Z
	PitchRatio     float64           // P/D at 0.75R
	Chord          quantity.Quantity // c at 0.75R, ship scale
	ThicknessRatio float64           // t/c at 0.75R
	// Roughness is the ship propeller's blade roughness k_P; 30 µm if
	// zero (the procedure's standard value).
	Roughness quantity.Quantity
	// ModelReynolds is the model propeller's Reynolds number at 0.75R in
	// the open-water test, Re_co = c·√(V_A² + (0.75πnD)²)/ν (model scale).
	ModelReynolds float64
}

// PoweringInput is one speed of a ship's resistance, self-propulsion and
// open-water tests, for the ITTC-1978 performance prediction.
type PoweringInput struct {
	// Scale is λ = L_model/L_ship.
	Scale float64
	// ModelLength (waterline), ModelWettedArea, ModelSpeed and
	// ModelResistance are the resistance test's at this speed.
	ModelLength, ModelWettedArea, ModelSpeed, ModelResistance quantity.Quantity
	// Tank and Sea are the waters' states (density, kinematic viscosity),
	// both required: a zero State is refused, the field named.
	Tank, Sea fluids.State
	// FormFactor is 1 + k, required (1 … 2; 1 for none). Zero is refused:
	// the prediction has no default form factor.
	FormFactor float64
	// HullRoughness is k_S; 150 µm if zero (the procedure's standard).
	HullRoughness quantity.Quantity
	// CorrelationAllowance is C_A, the basin's own. Zero means the basin
	// gives none: the procedure's own formula
	// C_A = (5.68 − 0.6·log₁₀Re_S)·10⁻³ is used and the result says so
	// (CorrelationFromFormula). A basin whose correlation allowance is
	// exactly zero sets ZeroCorrelationAllowance instead.
	CorrelationAllowance float64
	// ZeroCorrelationAllowance applies no correlation allowance at all
	// (C_A = 0), rather than the procedure's formula; CorrelationAllowance
	// must then be zero.
	ZeroCorrelationAllowance bool
	// TransverseArea is the ship's projected area above water, A_VS,
	// for the air resistance (zero: no air resistance); AirDensity is
	// ρ_A (1.225 kg/m³ if zero) and AirDrag C_DA (0.8 if zero).
	TransverseArea, AirDensity quantity.Quantity
	AirDrag                    float64
	// ModelWake (Taylor wake fraction w_TM from thrust identity),
	// ThrustDeduction t and RelativeRotative η_R are the self-propulsion
	// test's.
	ModelWake, ThrustDeduction, RelativeRotative float64
	// Propeller and OpenWater (the model's curve, at least three points
	// in increasing J) describe the propeller.
	//
	// OpenWater is a table of the curve, interpolated linearly between
	// its points: pass measured points only when they are dense, or a
	// faired table (OpenWaterFit.Table). Faired, when set, is the curve
	// faired by ReduceOpenWater and is used instead (its polynomials,
	// within its measured J range); OpenWater must then be empty.
	Propeller PropellerGeometry
	OpenWater []OpenWaterPoint
	Faired    *OpenWaterFit
	// Propellers is the number of propellers: 1 (single screw) or 2.
	// With two, each carries half the thrust, and the wake is not scaled
	// (w_TS = w_TM, the procedure's treatment of twin screws with open
	// shafts); DeliveredPower is then the sum over both shafts.
	Propellers int
	// CP and CN are the correlation factors on delivered power and
	// revolutions; 1 if zero, otherwise finite and within 0.5 … 1.5.
	CP, CN float64
	// Gravity is g for the Froude number; g_n if zero.
	Gravity quantity.Quantity
}

// PoweringResult is the full-scale prediction at one speed, with every
// intermediate coefficient of the method.
type PoweringResult struct {
	Froude                      float64
	ModelReynolds, ShipReynolds float64
	ModelCT, ModelCF, Residual  float64 // C_TM, C_FM, C_R = C_TM − (1 + k)C_FM
	ShipCF                      float64 // C_FS
	RoughnessAllowance          float64 // ΔC_F (may be negative: see Warning)
	// CorrelationAllowance is the C_A applied: the basin's, or the
	// procedure's formula when CorrelationFromFormula is set.
	CorrelationAllowance   float64
	CorrelationFromFormula bool
	AirResistance          float64 // C_AAS
	// ShipCT is C_TS = (1 + k)C_FS + ΔC_F + C_A + C_R + C_AAS: it
	// includes the roughness, correlation and air allowances.
	ShipCT                    float64
	ShipSpeed, ShipResistance quantity.Quantity
	EffectivePower            quantity.Quantity // P_E = R_TS·V_S
	ShipWake                  float64           // w_TS
	// ModelWake and ThrustDeduction are the w_TM and t the prediction
	// used.
	ModelWake, ThrustDeduction float64
	// ModelBladeDrag and ShipBladeDrag are C_DM and C_DS, the blade
	// section drag coefficients of model and ship propeller at 0.75R;
	// DeltaCD = C_DM − C_DS.
	ModelBladeDrag, ShipBladeDrag float64
	DeltaCD, DeltaKT, DeltaKQ     float64 // propeller scale correction
	Load                          float64 // K_T/J² of the ship's propeller
	J, KT, KQ                     float64 // full-scale operating point (KQ without η_R)
	Eta0, EtaH, EtaR, EtaD        float64 // open-water, hull, relative rotative, propulsive
	// RevsPerSecond and RPM are the propeller's rate of revolution after
	// C_N; PropellerSpeed is the same as an angular velocity (2πn).
	RevsPerSecond  float64 // n (rev/s)
	RPM            float64 // n (rev/min)
	PropellerSpeed quantity.Quantity
	Thrust, Torque quantity.Quantity // per propeller
	// DeliveredPower is P_D of all propellers (all shafts) after C_P.
	DeliveredPower quantity.Quantity
	// CP and CN are the correlation factors applied to P_D and n (1
	// when the input gave none).
	CP, CN float64
	// Warning, when not empty, says why the prediction is doubtful: a
	// negative roughness allowance ΔC_F, residuary coefficient C_R or
	// correlation allowance C_A from the procedure's formula, a
	// model Reynolds number where laminar flow is likely, a model
	// propeller Reynolds number below the open-water test's usual
	// minimum. Every report that prints the result prints it.
	Warning string
	Caution string
}

// MinBladeReynolds is the model propeller's Reynolds number Re_co at and
// below which the procedure's blade drag formula
// C_DM = 2(1 + 2t/c)[0.044/Re_co^(1/6) − 5/Re_co^(2/3)] is zero or
// negative: Re_co = (5/0.044)² ≈ 12 913. ITTC1978 refuses such a Re_co.
const MinBladeReynolds = (5 / 0.044) * (5 / 0.044)

// UsualBladeReynolds is the model propeller Reynolds number below which
// open-water data are flagged: ITTC's open-water procedure asks for Re_co
// of at least about 2×10⁵ so that the blade flow is turbulent (ITTC
// 7.5-02-03-02.1; from memory).
const UsualBladeReynolds = 2e5

// CorrelationAllowanceITTC returns the correlation allowance of the
// revised ITTC-1978 procedure, C_A = (5.68 − 0.6·log₁₀Re_S)·10⁻³, at the
// ship's Reynolds number (ITTC 7.5-02-03-01.4, 2017 revision; from
// memory). It is negative above Re_S = 10^(5.68/0.6) ≈ 2.9×10⁹, beyond
// the formula's range; ITTC1978 warns when it applies it there.
func CorrelationAllowanceITTC(shipReynolds float64) float64 {
	return (5.68 - 0.6*math.Log10(shipReynolds)) * 1e-3
}

// correlationFormulaLimit is the ship Reynolds number above which
// CorrelationAllowanceITTC is negative, 10^(5.68/0.6) ≈ 2.9×10⁹: a long,
// fast ship beyond the formula's range. ITTC1978 warns when it applies
// the formula there.
var correlationFormulaLimit = math.Pow(10, 5.68/0.6)

// PoweringCaution is printed with every powering prediction.
const PoweringCaution = "Delivered power and propeller revolutions predicted from model tests by the ITTC-1978 method are estimates; " +
	"the correlation factors are the basin's own, and machinery selection and trials follow the responsible naval architect and the applicable rules."

// ITTC1978 predicts the ship's resistance, delivered power and propeller
// revolutions at one speed by the ITTC-1978 performance prediction method
// (ITTC Recommended Procedure 7.5-02-03-01.4; the formulas below are as
// that procedure gives them, quoted from memory):
//
//	C_TS = (1 + k)C_FS + ΔC_F + C_A + C_R + C_AAS, C_F from the ITTC-1957 line
//	ΔC_F = 0.044[(k_S/L_WL)^(1/3) − 10·Re_S^(−1/3)] + 0.000125
//	C_A  = the basin's, or (5.68 − 0.6·log₁₀Re_S)·10⁻³ when it gives none
//	C_AAS = C_DA·ρ_A·A_VS/(ρ_S·S_S)
//	w_TS = (t + 0.04) + (w_TM − t − 0.04)·((1 + k)C_FS + ΔC_F)/((1 + k)C_FM)
//	ΔC_D = C_DM − C_DS,  C_DM = 2(1 + 2t/c)[0.044/Re_co^(1/6) − 5/Re_co^(2/3)],
//	                      C_DS = 2(1 + 2t/c)(1.89 + 1.62·log₁₀(c/k_P))^(−2.5)
//	ΔK_T = −ΔC_D·0.3·(P/D)·(c·Z/D),  ΔK_Q = ΔC_D·0.25·(c·Z/D)
//	K_T/J² = S·C_TS/(2N·D²(1 − t)(1 − w_TS)²)  → J_TS on the corrected curve
//	n_S = (1 − w_TS)V_S/(J_TS·D),  P_DS = 2πρ_S·n_S³·D⁵·K_QTS/η_R per propeller
//
// The open-water curve is the faired one (PoweringInput.Faired, from
// ReduceOpenWater) or a table interpolated linearly between its points;
// a load outside the curve's J range is an error, not an extrapolation. A point
// that is not finite (a missing value read as NaN), a correlation factor
// that is not finite, or a model propeller Reynolds number at which the
// C_DM formula fails (Re_co ≤ MinBladeReynolds) is refused with a
// *Error naming it (Input). A negative ΔC_F (a short hull or a low
// speed) or C_R is not refused but stated in Warning.
func ITTC1978(in PoweringInput) (PoweringResult, error) {
	m := func(r string) error {
		return &Error{Op: "ITTC-1978 prediction", Fault: similarity.Invalid("", r)}
	}
	if !(in.Scale > 0 && in.Scale < 1) {
		return PoweringResult{}, m(fmt.Sprintf("scale %v: want model/ship between 0 and 1", in.Scale))
	}
	if err := watersSet("ITTC-1978 prediction", "PoweringInput", in.Tank, in.Sea); err != nil {
		return PoweringResult{}, err
	}
	if err := failNamed("ITTC-1978 prediction", similarity.CheckInputs(true,
		similarity.Input{Name: "model length", Value: in.ModelLength, Dim: quantity.Length},
		similarity.Input{Name: "model wetted area", Value: in.ModelWettedArea, Dim: quantity.Area},
		similarity.Input{Name: "model speed", Value: in.ModelSpeed, Dim: quantity.Velocity},
		similarity.Input{Name: "model resistance", Value: in.ModelResistance, Dim: quantity.Force},
		similarity.Input{Name: "tank density", Value: in.Tank.Density, Dim: quantity.Density},
		similarity.Input{Name: "tank viscosity", Value: in.Tank.KinematicViscosity, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "sea density", Value: in.Sea.Density, Dim: quantity.Density},
		similarity.Input{Name: "sea viscosity", Value: in.Sea.KinematicViscosity, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "propeller diameter", Value: in.Propeller.Diameter, Dim: quantity.Length},
		similarity.Input{Name: "propeller chord", Value: in.Propeller.Chord, Dim: quantity.Length},
	)); err != nil {
		return PoweringResult{}, err
	}
	const method = "ITTC-1978 prediction"
	var ks, kp, rhoA, g float64
	for _, d := range []struct {
		dst        *float64
		name       string
		given, def quantity.Quantity
	}{
		{&ks, "hull roughness", in.HullRoughness, quantity.New(150e-6, quantity.Length)},
		{&kp, "propeller roughness", in.Propeller.Roughness, quantity.New(30e-6, quantity.Length)},
		{&rhoA, "air density", in.AirDensity, quantity.New(1.225, quantity.Density)},
		{&g, "gravity", in.Gravity, units.StandardGravity()},
	} {
		v, bad := similarity.OrDefault(d.name, d.given, d.def)
		if bad != nil {
			return PoweringResult{}, fail(method, bad)
		}
		*d.dst = v.Value()
	}
	avs := 0.0
	if in.TransverseArea != (quantity.Quantity{}) {
		if err := in.TransverseArea.CheckNamed("transverse area", quantity.Area); err != nil {
			return PoweringResult{}, err
		}
		avs = in.TransverseArea.Value()
	}
	cda := in.AirDrag
	if cda == 0 {
		cda = 0.8
	}
	pe := func(field string, v float64, reason string) error {
		return &Error{Op: "ITTC-1978 prediction", Fault: similarity.Invalid(field, fmt.Sprintf("%s = %v: %s", field, v, reason))}
	}
	if !(cda > 0 && cda <= 2) {
		return PoweringResult{}, pe("air drag coefficient C_DA", cda, "want a finite value in 0 … 2")
	}
	if !(math.Abs(in.CorrelationAllowance) <= 0.005) {
		return PoweringResult{}, pe("correlation allowance C_A", in.CorrelationAllowance, "want a finite value within ±0.005")
	}
	if in.ZeroCorrelationAllowance && in.CorrelationAllowance != 0 {
		return PoweringResult{}, pe("correlation allowance C_A", in.CorrelationAllowance, "ZeroCorrelationAllowance is set, so C_A must be zero")
	}
	k1 := in.FormFactor
	if !(k1 >= 1 && k1 <= 2) {
		return PoweringResult{}, m(fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", k1))
	}
	np := in.Propellers
	if np == 0 {
		np = 1
	}
	if np != 1 && np != 2 {
		return PoweringResult{}, m(fmt.Sprintf("%d propellers: the method covers single and twin screws", np))
	}
	t, wm, etaR := in.ThrustDeduction, in.ModelWake, in.RelativeRotative
	if !(t >= 0 && t < 1) || !(wm >= 0 && wm < 1) || !(etaR > 0.5 && etaR < 1.5) {
		return PoweringResult{}, m(fmt.Sprintf("t = %v, w_TM = %v, η_R = %v: want 0 ≤ t, w < 1 and η_R near 1", t, wm, etaR))
	}
	pr := in.Propeller
	if pr.Blades < 2 || pr.Blades > 12 || !(pr.PitchRatio > 0 && pr.PitchRatio < 3) || !(pr.ThicknessRatio > 0 && pr.ThicknessRatio < 0.5) {
		return PoweringResult{}, m("propeller geometry: want 2 … 12 blades, 0 < P/D < 3 and 0 < t/c < 0.5")
	}
	if !(pr.ModelReynolds > MinBladeReynolds && pr.ModelReynolds <= 1e8) {
		return PoweringResult{}, pe("model propeller Reynolds number Re_co", pr.ModelReynolds,
			fmt.Sprintf("the blade drag formula C_DM = 2(1 + 2t/c)[0.044/Re_co^(1/6) − 5/Re_co^(2/3)] needs Re_co > (5/0.044)² ≈ %.0f (and at most 10⁸)", MinBladeReynolds))
	}
	owKT, owKQ, lo, hi, err := openWaterCurve(in)
	if err != nil {
		return PoweringResult{}, err
	}
	cp, cn := in.CP, in.CN
	if cp == 0 {
		cp = 1
	}
	if cn == 0 {
		cn = 1
	}
	if !(cp >= 0.5 && cp <= 1.5) {
		return PoweringResult{}, pe("power correlation factor C_P", cp, "want a finite value in 0.5 … 1.5")
	}
	if !(cn >= 0.5 && cn <= 1.5) {
		return PoweringResult{}, pe("revolutions correlation factor C_N", cn, "want a finite value in 0.5 … 1.5")
	}

	var r PoweringResult
	r.CP, r.CN = cp, cn
	lm, sm, vm := in.ModelLength.Value(), in.ModelWettedArea.Value(), in.ModelSpeed.Value()
	ls, ss := lm/in.Scale, sm/(in.Scale*in.Scale)
	vs := vm / math.Sqrt(in.Scale)
	rhoM, rhoS := in.Tank.Density.Value(), in.Sea.Density.Value()
	r.Froude = vm / math.Sqrt(g*lm)
	r.ModelReynolds = vm * lm / in.Tank.KinematicViscosity.Value()
	r.ShipReynolds = vs * ls / in.Sea.KinematicViscosity.Value()
	if r.ModelCF, err = LineITTC1957.CF(r.ModelReynolds); err != nil {
		return PoweringResult{}, err
	}
	if r.ShipCF, err = LineITTC1957.CF(r.ShipReynolds); err != nil {
		return PoweringResult{}, err
	}
	r.ModelCT = in.ModelResistance.Value() / (0.5 * rhoM * vm * vm * sm)
	r.Residual = r.ModelCT - k1*r.ModelCF
	r.RoughnessAllowance = 0.044*(math.Cbrt(ks/ls)-10*math.Pow(r.ShipReynolds, -1.0/3)) + 0.000125
	r.AirResistance = cda * rhoA * avs / (rhoS * ss)
	switch {
	case in.ZeroCorrelationAllowance:
		r.CorrelationAllowance = 0
	case in.CorrelationAllowance == 0:
		r.CorrelationAllowance, r.CorrelationFromFormula = CorrelationAllowanceITTC(r.ShipReynolds), true
	default:
		r.CorrelationAllowance = in.CorrelationAllowance
	}
	r.ShipCT = k1*r.ShipCF + r.RoughnessAllowance + r.CorrelationAllowance + r.Residual + r.AirResistance
	rts := r.ShipCT * 0.5 * rhoS * vs * vs * ss
	r.ShipSpeed = quantity.New(vs, quantity.Velocity)
	r.ShipResistance = quantity.New(rts, quantity.Force)
	r.EffectivePower = quantity.New(rts*vs, quantity.Power)

	if np == 1 {
		r.ShipWake = (t + 0.04) + (wm-t-0.04)*(k1*r.ShipCF+r.RoughnessAllowance)/(k1*r.ModelCF)
	} else {
		r.ShipWake = wm
	}
	if !(r.ShipWake > -0.5 && r.ShipWake < 1) {
		return PoweringResult{}, m(fmt.Sprintf("the full-scale wake w_TS = %.4f is not physical", r.ShipWake))
	}
	d := pr.Diameter.Value()
	c := pr.Chord.Value()
	tc := pr.ThicknessRatio
	if !(c/kp > 10) {
		return PoweringResult{}, pe("propeller chord/roughness c/k_P", c/kp, "the ship blade drag formula needs a chord many times the roughness")
	}
	r.ModelBladeDrag = 2 * (1 + 2*tc) * (0.044/math.Pow(pr.ModelReynolds, 1.0/6) - 5/math.Pow(pr.ModelReynolds, 2.0/3))
	r.ShipBladeDrag = 2 * (1 + 2*tc) * math.Pow(1.89+1.62*math.Log10(c/kp), -2.5)
	r.DeltaCD = r.ModelBladeDrag - r.ShipBladeDrag
	czd := c * float64(pr.Blades) / d
	r.DeltaKT = -r.DeltaCD * 0.3 * pr.PitchRatio * czd
	r.DeltaKQ = r.DeltaCD * 0.25 * czd
	r.Load = ss * r.ShipCT / (2 * float64(np) * d * d * (1 - t) * (1 - r.ShipWake) * (1 - r.ShipWake))

	kt := func(j float64) float64 { return owKT(j) - r.DeltaKT }
	kq := func(j float64) float64 { return owKQ(j) - r.DeltaKQ }
	f := func(j float64) float64 { return kt(j) - r.Load*j*j }
	if f(lo) < 0 || f(hi) > 0 {
		return PoweringResult{}, m(fmt.Sprintf("the load K_T/J² = %.4f meets the open-water curve outside its measured J = %g … %g", r.Load, lo, hi))
	}
	if r.J, err = roots.Bisect(f, lo, hi); err != nil {
		return PoweringResult{}, &Error{Op: "ITTC-1978 prediction", Fault: similarity.Caused("open-water curve", "no operating point on the open-water curve", err)}
	}
	r.KT, r.KQ = kt(r.J), kq(r.J)
	r.Eta0 = r.J * r.KT / (2 * math.Pi * r.KQ)
	r.ModelWake, r.ThrustDeduction = wm, t
	r.EtaH = (1 - t) / (1 - r.ShipWake)
	r.EtaR = etaR
	r.EtaD = r.Eta0 * r.EtaH * r.EtaR
	n := (1 - r.ShipWake) * vs / (r.J * d)
	pd := 2 * math.Pi * rhoS * n * n * n * math.Pow(d, 5) * r.KQ / etaR * float64(np)
	r.Thrust = quantity.New(r.KT*rhoS*n*n*math.Pow(d, 4), quantity.Force)
	r.Torque = quantity.New(r.KQ*rhoS*n*n*math.Pow(d, 5)/etaR, quantity.Torque)
	r.RevsPerSecond = cn * n
	r.RPM = 60 * r.RevsPerSecond
	r.PropellerSpeed = quantity.New(2*math.Pi*r.RevsPerSecond, quantity.AngularVelocity)
	r.DeliveredPower = quantity.New(cp*pd, quantity.Power)
	r.Caution = PoweringCaution
	if !allFinite(r.Froude, r.ModelReynolds, r.ShipReynolds, r.ModelCT, r.ShipCT, r.ShipSpeed.Value(), r.ShipResistance.Value(),
		r.EffectivePower.Value(), r.Load, r.J, r.KT, r.KQ, r.Eta0, r.EtaD, r.RevsPerSecond, r.RPM, r.PropellerSpeed.Value(),
		r.Thrust.Value(), r.Torque.Value(), r.DeliveredPower.Value()) || !(r.Eta0 > 0) || !(r.RevsPerSecond > 0) {
		return PoweringResult{}, m("the prediction is not finite and positive (inputs beyond any ship)")
	}
	var warn []string
	if r.ModelReynolds < LaminarReynolds {
		warn = append(warn, laminarWarning(r.ModelReynolds))
	}
	if r.Residual < 0 {
		warn = append(warn, fmt.Sprintf("the residuary coefficient C_R = %.3f×10⁻³ is negative (the model's C_TM is below (1 + k)·C_FM): check the run and the form factor", r.Residual*1e3))
	}
	if r.RoughnessAllowance < 0 {
		warn = append(warn, fmt.Sprintf("the roughness allowance ΔC_F = %.3f×10⁻³ is negative and lowers C_TS by %.1f %%: its formula is outside its range for a hull this short or this slow (L = %.3g m, Re_S = %.3g); the basin's own allowance should replace it",
			r.RoughnessAllowance*1e3, -100*r.RoughnessAllowance/r.ShipCT, ls, r.ShipReynolds))
	}
	if r.CorrelationFromFormula && r.CorrelationAllowance < 0 {
		warn = append(warn, fmt.Sprintf("the correlation allowance C_A = %.3f×10⁻³ from the procedure's formula (5.68 − 0.6·log₁₀Re_S)·10⁻³ is negative and lowers C_TS by %.1f %%: "+
			"the ship Reynolds number Re_S = %.3g is above %.3g, where the formula changes sign, so it is used beyond its range (L = %.3g m); the basin's own allowance should replace it",
			r.CorrelationAllowance*1e3, -100*r.CorrelationAllowance/r.ShipCT, r.ShipReynolds, correlationFormulaLimit, ls))
	}
	if r.ModelCT > MaxPlausibleCT {
		warn = append(warn, implausibleCT(r.ModelCT))
	}
	if pr.ModelReynolds < UsualBladeReynolds {
		warn = append(warn, fmt.Sprintf("the model propeller's Re_co = %.3g is below %.0g, where the open-water test's blade flow may be partly laminar (ITTC 7.5-02-03-02.1; from memory)", pr.ModelReynolds, UsualBladeReynolds))
	}
	if in.Faired != nil && in.Faired.Warning != "" {
		warn = append(warn, "open-water curve: "+in.Faired.Warning)
	}
	r.Warning = strings.Join(warn, "; ")
	return r, nil
}

// allFinite reports whether every x is finite.
func allFinite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// interp interpolates a coefficient of the open-water curve linearly in
// J, within the measured points.
func interp(ow []OpenWaterPoint, j float64, y func(OpenWaterPoint) float64) float64 {
	i := 1
	for i < len(ow)-1 && ow[i].J < j {
		i++
	}
	a, b := ow[i-1], ow[i]
	s := (j - a.J) / (b.J - a.J)
	return y(a) + s*(y(b)-y(a))
}

// openWaterCurve returns the model's open-water K_T(J) and K_Q(J) and
// their J range: the faired polynomials, or the table checked and
// interpolated linearly.
func openWaterCurve(in PoweringInput) (kt, kq func(float64) float64, lo, hi float64, err error) {
	m := func(r string) error {
		return &Error{Op: "ITTC-1978 prediction", Fault: similarity.Invalid("open-water curve", r)}
	}
	if f := in.Faired; f != nil {
		if len(in.OpenWater) > 0 {
			return nil, nil, 0, 0, m("both a faired open-water curve and a table are given: pass one")
		}
		if f.KT == nil || f.KQ == nil || !(f.JMin < f.JMax) {
			return nil, nil, 0, 0, m("the faired open-water curve is empty: make it with ReduceOpenWater")
		}
		return f.KT.Eval, f.KQ.Eval, f.JMin, f.JMax, nil
	}
	ow := in.OpenWater
	for i, p := range ow {
		for _, c := range []struct {
			name string
			v    float64
		}{{"J", p.J}, {"K_T", p.KT}, {"K_Q", p.KQ}} {
			if math.IsNaN(c.v) || math.IsInf(c.v, 0) {
				return nil, nil, 0, 0, &Error{Op: "ITTC-1978 prediction", Fault: similarity.Invalid(fmt.Sprintf("open-water point %d: %s", i, c.name), fmt.Sprintf("open-water point %d: %s = %v: not a finite number (a missing value?)", i, c.name, c.v))}
			}
		}
		if !(p.J >= 0 && p.J <= 2) || !(p.KQ > 0 && p.KQ < 1) || !(p.KT > -1 && p.KT < 2) {
			return nil, nil, 0, 0, &Error{Op: "ITTC-1978 prediction", Fault: similarity.Invalid(fmt.Sprintf("open-water point %d: J, K_T, K_Q", i), fmt.Sprintf("open-water point %d: J = %v, K_T = %v, K_Q = %v: want 0 ≤ J ≤ 2, −1 < K_T < 2, 0 < K_Q < 1", i, p.J, p.KT, p.KQ))}
		}
	}
	if len(ow) < 3 || !slices.IsSortedFunc(ow, func(a, b OpenWaterPoint) int { return cmp.Compare(a.J, b.J) }) {
		return nil, nil, 0, 0, m("the open-water curve needs at least three points in increasing J")
	}
	for i := 1; i < len(ow); i++ {
		if ow[i].J == ow[i-1].J {
			return nil, nil, 0, 0, m(fmt.Sprintf("two open-water points at J = %v", ow[i].J))
		}
	}
	kt = func(j float64) float64 { return interp(ow, j, func(p OpenWaterPoint) float64 { return p.KT }) }
	kq = func(j float64) float64 { return interp(ow, j, func(p OpenWaterPoint) float64 { return p.KQ }) }
	return kt, kq, ow[0].J, ow[len(ow)-1].J, nil
}
