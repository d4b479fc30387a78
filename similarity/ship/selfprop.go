package ship

import (
	"fmt"
	"math"
	"slices"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

// ResistanceFit is a resistance test faired: the model's total
// resistance coefficient C_TM = R_TM/(½ρV²S) as a polynomial in the
// model speed V_M (m/s), fitted by least squares with the fit's
// intervals. The coefficient is faired rather than the resistance
// because it varies slowly with speed, so a low order follows it; the
// resistance is C_TM·½ρV²S at the test's water and wetted surface.
type ResistanceFit struct {
	CT *fit.Poly // C_TM against V_M in m/s
	// Density is the test's water density ρ (kg/m³).
	Density float64
	// WettedArea is the model's wetted surface S_M (m²).
	WettedArea float64
	// Warning names the runs the fit flags as outliers (not dropped).
	Warning string
}

// FairResistance fairs a resistance test's runs (HullTest.Speeds and
// Resistances, at least five, in the tank's water) by a polynomial of
// C_TM in V_M of the given order (1 … 6), or of the order chosen among
// 1 … 5 by the corrected Akaike criterion (fit.AICc) when order is zero;
// the choice is stated in CT.Notes.
func FairResistance(test HullTest, order int) (*ResistanceFit, error) {
	const op = "resistance fairing"
	if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: "model wetted area", Value: test.ModelWettedArea, Dim: quantity.Area},
		similarity.Input{Name: "tank density", Value: test.Tank.Density, Dim: quantity.Density})); err != nil {
		return nil, err
	}
	n := len(test.Speeds)
	if n != len(test.Resistances) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("%d speeds and %d resistances", n, len(test.Resistances)))}
	}
	if n < 5 || n > fit.MaxRows {
		return nil, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("%d runs: want 5 … %d to fair a resistance curve", n, fit.MaxRows))}
	}
	if order < 0 || order > 6 {
		return nil, &Error{Op: op, Fault: similarity.Invalid("order", fmt.Sprintf("polynomial order %d: want 1 … 6, or 0 to choose it", order))}
	}
	r := &ResistanceFit{Density: test.Tank.Density.Value(), WettedArea: test.ModelWettedArea.Value()}
	v, ct := make([]float64, n), make([]float64, n)
	for i := range n {
		name := fmt.Sprintf("run %d", i+1)
		if err := fail(op, similarity.CheckInputs(true,
			similarity.Input{Name: name + ": speed", Value: test.Speeds[i], Dim: quantity.Velocity},
			similarity.Input{Name: name + ": resistance", Value: test.Resistances[i], Dim: quantity.Force})); err != nil {
			return nil, err
		}
		v[i] = test.Speeds[i].Value()
		ct[i] = test.Resistances[i].Value() / (0.5 * r.Density * v[i] * v[i] * r.WettedArea)
		if err := fail(op, similarity.CheckResults(true, similarity.Result{Name: name + ": C_TM", Value: ct[i]})); err != nil {
			return nil, err
		}
	}
	var err error
	if order > 0 {
		r.CT, err = fit.FitPoly(v, ct, order, nil)
	} else {
		r.CT, err = fit.SelectPoly(v, ct, 5, fit.AICc, nil)
	}
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("C_TM", "fairing C_TM against the model speed", err)}
	}
	r.Warning = joinWarnings(outlierNotes(r.CT, "V_M", " m/s", "C_TM"))
	return r, nil
}

// At returns the faired resistance R_TM at the model speed v, within the
// test's speed range (an *Error of class quantity.ErrRange outside it),
// with the prediction of C_TM and its intervals.
func (r *ResistanceFit) At(v quantity.Quantity) (quantity.Quantity, fit.Prediction, error) {
	const op = "resistance fairing"
	if err := v.CheckNamed("model speed", quantity.Velocity); err != nil {
		return quantity.Quantity{}, fit.Prediction{}, err
	}
	p, err := r.CT.Predict(v.Value())
	if err != nil {
		return quantity.Quantity{}, fit.Prediction{}, &Error{Op: op, Fault: similarity.Caused("model speed", fmt.Sprintf("model speed %.4g m/s", v.Value()), err)}
	}
	x := v.Value()
	return quantity.New(p.Y*0.5*r.Density*x*x*r.WettedArea, quantity.Force), p, nil
}

// resistance returns the faired R_TM in N at v m/s without checks.
func (r *ResistanceFit) resistance(v float64) float64 {
	return r.CT.Eval(v) * 0.5 * r.Density * v * v * r.WettedArea
}

// perturbed returns a copy of r with coefficient k of C_TM moved by h.
func (r *ResistanceFit) perturbed(k int, h float64) *ResistanceFit {
	g := *r
	p := *r.CT
	p.B = slices.Clone(r.CT.B)
	p.B[k] += h
	g.CT = &p
	return &g
}

// SkinFriction is the skin-friction correction of a self-propulsion
// test at one model speed, with the coefficients it is made of.
type SkinFriction struct {
	// Force is F_D = ½ρ_M·V_M²·S_M·[(1 + k)(C_FM − C_FS) − ΔC_F − C_A],
	// the towing force applied to the model so that its propeller works
	// at the ship's self-propulsion point.
	Force                       quantity.Quantity
	ModelReynolds, ShipReynolds float64
	ModelCF, ShipCF             float64 // ITTC-1957 line
	RoughnessAllowance          float64 // ΔC_F, as ITTC1978 computes it
	CorrelationAllowance        float64 // C_A, as ITTC1978 takes it
	CorrelationFromFormula      bool
}

// SkinFrictionCorrection returns the skin-friction correction force F_D
// for a self-propulsion test at in.ModelSpeed, as the ITTC-1978 method
// defines it (ITTC 7.5-02-03-01.4; quoted from memory):
//
//	F_D = ½ρ_M·V_M²·S_M·[(1 + k)(C_FM − C_FS) − ΔC_F − C_A]
//
// with C_F from the ITTC-1957 line and ΔC_F and C_A exactly as ITTC1978
// takes them from the same input, so that the test and the prediction
// agree. It reads Scale, ModelLength, ModelWettedArea, ModelSpeed, Tank,
// Sea, FormFactor, HullRoughness, CorrelationAllowance and
// ZeroCorrelationAllowance, and ignores the other fields. Some basins
// leave C_A out of F_D (the original 1978 text); set
// ZeroCorrelationAllowance for that, and say so in the report.
func SkinFrictionCorrection(in PoweringInput) (SkinFriction, error) {
	const op = "skin-friction correction"
	if !(in.Scale > 0 && in.Scale < 1) {
		return SkinFriction{}, &Error{Op: op, Fault: similarity.Invalid("scale", fmt.Sprintf("scale %v: want model/ship between 0 and 1", in.Scale))}
	}
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "model length", Value: in.ModelLength, Dim: quantity.Length},
		similarity.Input{Name: "model wetted area", Value: in.ModelWettedArea, Dim: quantity.Area},
		similarity.Input{Name: "model speed", Value: in.ModelSpeed, Dim: quantity.Velocity},
		similarity.Input{Name: "tank density", Value: in.Tank.Density, Dim: quantity.Density},
		similarity.Input{Name: "tank viscosity", Value: in.Tank.KinematicViscosity, Dim: quantity.KinematicViscosity},
		similarity.Input{Name: "sea viscosity", Value: in.Sea.KinematicViscosity, Dim: quantity.KinematicViscosity})); err != nil {
		return SkinFriction{}, err
	}
	k1 := in.FormFactor
	if !(k1 >= 1 && k1 <= 2) {
		return SkinFriction{}, &Error{Op: op, Fault: similarity.Invalid("form factor", fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", k1))}
	}
	if !(math.Abs(in.CorrelationAllowance) <= 0.005) || (in.ZeroCorrelationAllowance && in.CorrelationAllowance != 0) {
		return SkinFriction{}, &Error{Op: op, Fault: similarity.Invalid("correlation allowance C_A", fmt.Sprintf("C_A = %v: want a finite value within ±0.005, and zero with ZeroCorrelationAllowance", in.CorrelationAllowance))}
	}
	ksq, bad := similarity.OrDefault("hull roughness", in.HullRoughness, quantity.New(150e-6, quantity.Length))
	if bad != nil {
		return SkinFriction{}, fail(op, bad)
	}
	lm, sm, vm := in.ModelLength.Value(), in.ModelWettedArea.Value(), in.ModelSpeed.Value()
	ls, vs := lm/in.Scale, vm/math.Sqrt(in.Scale)
	var s SkinFriction
	var err error
	s.ModelReynolds = vm * lm / in.Tank.KinematicViscosity.Value()
	s.ShipReynolds = vs * ls / in.Sea.KinematicViscosity.Value()
	if s.ModelCF, err = LineITTC1957.CF(s.ModelReynolds); err != nil {
		return SkinFriction{}, &Error{Op: op, Fault: similarity.Caused("model Reynolds number", "the model's friction coefficient", err)}
	}
	if s.ShipCF, err = LineITTC1957.CF(s.ShipReynolds); err != nil {
		return SkinFriction{}, &Error{Op: op, Fault: similarity.Caused("ship Reynolds number", "the ship's friction coefficient", err)}
	}
	s.RoughnessAllowance = 0.044*(math.Cbrt(ksq.Value()/ls)-10*math.Pow(s.ShipReynolds, -1.0/3)) + 0.000125
	switch {
	case in.ZeroCorrelationAllowance:
	case in.CorrelationAllowance == 0:
		s.CorrelationAllowance, s.CorrelationFromFormula = CorrelationAllowanceITTC(s.ShipReynolds), true
	default:
		s.CorrelationAllowance = in.CorrelationAllowance
	}
	fd := 0.5 * in.Tank.Density.Value() * vm * vm * sm * (k1*(s.ModelCF-s.ShipCF) - s.RoughnessAllowance - s.CorrelationAllowance)
	if err := fail(op, similarity.CheckResults(false, similarity.Result{Name: "skin-friction correction force", Value: fd})); err != nil {
		return SkinFriction{}, err
	}
	s.Force = quantity.New(fd, quantity.Force)
	return s, nil
}

// SelfPropulsionRun is one steady point of a model self-propulsion test
// at the ship's self-propulsion point: the model towed at ModelSpeed
// with the towing force TowingForce (the skin-friction correction F_D)
// and its propeller(s) turning at RevsPerSecond.
type SelfPropulsionRun struct {
	ModelSpeed quantity.Quantity
	// RevsPerSecond is n in revolutions per second (not rad/s, not rpm).
	RevsPerSecond float64
	// Thrust and Torque are each propeller's (the mean of the shafts
	// with two).
	Thrust, Torque quantity.Quantity
	// TowingForce is the force F_D the carriage applied in the direction
	// of motion (SkinFrictionCorrection gives the one to apply).
	TowingForce quantity.Quantity
	// Resistance is the model's resistance R_TM at this speed; the zero
	// Quantity takes it from SelfPropulsionTest.Resistance.
	Resistance quantity.Quantity
}

// SelfPropulsionTest is a model self-propulsion test with what its
// analysis needs: the model propeller's faired open-water curve and the
// faired resistance curve (both at the temperature of this test's water,
// the caller's responsibility).
type SelfPropulsionTest struct {
	Diameter   quantity.Quantity // model propeller D
	Water      fluids.State      // the tank's water during the test
	OpenWater  *OpenWaterFit
	Resistance *ResistanceFit // may be nil when every run gives its Resistance
	// Propellers is the number of propellers, 1 (the default) or 2; with
	// two, the propellers share the resistance equally.
	Propellers int
	Runs       []SelfPropulsionRun
}

// SelfPropulsionPoint is one run analysed by thrust identity.
type SelfPropulsionPoint struct {
	ModelSpeed    float64 // V_M (m/s)
	RevsPerSecond float64 // n (rev/s)
	Resistance    float64 // R_TM used (N)
	TowingForce   float64 // F_D (N)
	KT, KQ        float64 // K_TM = T/(ρn²D⁴), K_QM = Q/(ρn²D⁵) behind the hull
	J             float64 // J_TM, from the open-water K_T equal to K_TM
	KQ0           float64 // the open-water K_Q at J_TM
	// Wake is the Taylor wake fraction w_TM = 1 − J_TM·nD/V_M,
	// ThrustDeduction t = (N·T + F_D − R_TM)/(N·T), RelativeRotative
	// η_R = K_Q0/K_QM, EtaH = (1 − t)/(1 − w_TM), Eta0 the open-water
	// efficiency at J_TM and EtaD = η_H·η_O·η_R.
	Wake, ThrustDeduction, RelativeRotative float64
	EtaH, Eta0, EtaD                        float64
	// Reynolds is the run's blade Reynolds number
	// Re_0.7 = c_0.7·√(V_A² + (0.7πnD)²)/ν with V_A = J_TM·nD, from the
	// open-water test's chord and the water's viscosity (0 when the
	// open-water curve carries no chord).
	Reynolds float64
	// Warning, when not empty, says why the run is doubtful: a Reynolds
	// number below UsualOpenWaterReynolds, where the model propeller's
	// blade flow may be partly laminar (which flatters K_Q and η_R).
	Warning string
}

// AnalyseSelfPropulsion analyses each run of a self-propulsion test by
// thrust identity (ITTC 7.5-02-03-01.1, propulsion test, with the
// analysis of 7.5-02-03-01.4; quoted from memory):
//
//	K_TM = T/(ρn²D⁴), K_QM = Q/(ρn²D⁵)              (n in rev/s)
//	J_TM: the faired open-water K_T(J_TM) = K_TM
//	w_TM = 1 − J_TM·nD/V_M
//	t    = (N·T + F_D − R_TM)/(N·T)                  (N propellers)
//	η_R  = K_Q0/K_QM, K_Q0 the open-water K_Q at J_TM
//	η_H  = (1 − t)/(1 − w_TM), η_O = η₀(J_TM), η_D = η_H·η_O·η_R
//
// A K_TM outside the open-water curve, a speed outside the faired
// resistance curve, and factors outside 0 ≤ w_TM < 1, −0.5 < t < 1,
// 0.5 < η_R < 1.5 are refused with an *Error naming the run.
func AnalyseSelfPropulsion(t SelfPropulsionTest) ([]SelfPropulsionPoint, error) {
	const op = "self-propulsion analysis"
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "propeller diameter", Value: t.Diameter, Dim: quantity.Length},
		similarity.Input{Name: "water density", Value: t.Water.Density, Dim: quantity.Density})); err != nil {
		return nil, err
	}
	if t.OpenWater == nil || t.OpenWater.KT == nil || t.OpenWater.KQ == nil {
		return nil, &Error{Op: op, Fault: similarity.Invalid("open-water curve", "the analysis needs the faired open-water curve (ReduceOpenWater)")}
	}
	np := t.Propellers
	if np == 0 {
		np = 1
	}
	if np != 1 && np != 2 {
		return nil, &Error{Op: op, Fault: similarity.Invalid("propellers", fmt.Sprintf("%d propellers: want 1 or 2", np))}
	}
	if len(t.Runs) == 0 || len(t.Runs) > fit.MaxRows {
		return nil, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("%d runs: want 1 … %d", len(t.Runs), fit.MaxRows))}
	}
	d, rho := t.Diameter.Value(), t.Water.Density.Value()
	out := make([]SelfPropulsionPoint, 0, len(t.Runs))
	for i, r := range t.Runs {
		name := fmt.Sprintf("run %d", i+1)
		if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: name + ": model speed", Value: r.ModelSpeed, Dim: quantity.Velocity},
			similarity.Input{Name: name + ": thrust", Value: r.Thrust, Dim: quantity.Force},
			similarity.Input{Name: name + ": torque", Value: r.Torque, Dim: quantity.Torque})); err != nil {
			return nil, err
		}
		if err := r.TowingForce.CheckNamed(name+": towing force", quantity.Force); err != nil {
			return nil, err
		}
		if fd := r.TowingForce.Value(); math.IsNaN(fd) || math.IsInf(fd, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name+": towing force", fmt.Sprintf("%s: towing force %v N: not a finite number", name, fd))}
		}
		n := r.RevsPerSecond
		if !(n > 0) || math.IsInf(n, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name+": n", fmt.Sprintf("%s: n = %v rev/s: want a positive finite rate of revolution", name, n))}
		}
		p := SelfPropulsionPoint{ModelSpeed: r.ModelSpeed.Value(), RevsPerSecond: n, TowingForce: r.TowingForce.Value()}
		if r.Resistance != (quantity.Quantity{}) {
			if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: name + ": resistance", Value: r.Resistance, Dim: quantity.Force})); err != nil {
				return nil, err
			}
			p.Resistance = r.Resistance.Value()
		} else {
			if t.Resistance == nil {
				return nil, &Error{Op: op, Fault: similarity.Invalid(name+": resistance", name+": no resistance given and no faired resistance curve")}
			}
			rt, _, err := t.Resistance.At(r.ModelSpeed)
			if err != nil {
				return nil, &Error{Op: op, Fault: similarity.Caused(name+": resistance", name, err)}
			}
			p.Resistance = rt.Value()
		}
		th, q := r.Thrust.Value(), r.Torque.Value()
		p.KT = th / (rho * n * n * d * d * d * d)
		p.KQ = q / (rho * n * n * d * d * d * d * d)
		if err := fail(op, similarity.CheckResults(true,
			similarity.Result{Name: name + ": K_TM", Value: p.KT},
			similarity.Result{Name: name + ": K_QM", Value: p.KQ})); err != nil {
			return nil, err
		}
		j, err := t.OpenWater.JForKT(p.KT)
		if err != nil {
			return nil, &Error{Op: op, Fault: similarity.Caused(name+": K_TM", fmt.Sprintf("%s: thrust identity (K_TM = %.5g)", name, p.KT), err)}
		}
		p.J = j
		p.KQ0 = t.OpenWater.KQ.Eval(j)
		p.Wake = 1 - j*n*d/p.ModelSpeed
		p.ThrustDeduction = (float64(np)*th + p.TowingForce - p.Resistance) / (float64(np) * th)
		p.RelativeRotative = p.KQ0 / p.KQ
		p.EtaH = (1 - p.ThrustDeduction) / (1 - p.Wake)
		p.Eta0 = j * p.KT / (2 * math.Pi * p.KQ0)
		p.EtaD = p.EtaH * p.Eta0 * p.RelativeRotative
		if !allFinite(p.Wake, p.ThrustDeduction, p.RelativeRotative, p.EtaH, p.Eta0, p.EtaD) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(name, name+": the factors are out of the range of a float64")}
		}
		if !(p.Wake >= 0 && p.Wake < 1) || !(p.ThrustDeduction > -0.5 && p.ThrustDeduction < 1) || !(p.RelativeRotative > 0.5 && p.RelativeRotative < 1.5) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name, fmt.Sprintf("%s: w_TM = %.4g, t = %.4g, η_R = %.4g: not the factors of a propelled hull (want 0 ≤ w_TM < 1, −0.5 < t < 1, 0.5 < η_R < 1.5; a unit slip, or the wrong open-water curve?)",
				name, p.Wake, p.ThrustDeduction, p.RelativeRotative))}

		}
		if c, nu := t.OpenWater.Chord, t.OpenWater.Viscosity; c > 0 && nu > 0 {
			p.Reynolds = bladeReynolds(c, j*n*d, n, d, 0.7, nu)
			if p.Reynolds < UsualOpenWaterReynolds {
				p.Warning = fmt.Sprintf("self-propulsion %s (V_M = %.4g m/s): the propeller's Re_0.7 = %.3g is below the usual minimum %.0e (ITTC 7.5-02-03-02.1; from memory): the blade flow may be partly laminar, which flatters K_Q and η_R",
					name, p.ModelSpeed, p.Reynolds, UsualOpenWaterReynolds)
			}
		}
		out = append(out, p)
	}
	return out, nil
}
