package turbo

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// PumpCaution accompanies every pump or turbine result carried from a
// model to a prototype (step-ups, NPSH and Thoma number, specific speed)
// and every acceptance verdict. PrototypePoint and Verdict carry it in
// their Caution field; with the bare values the other functions return,
// print it yourself.
const PumpCaution = "Pump and turbine performance scaled from a model test is an estimate subject to scale effects; " +
	"guaranteed performance comes from the acceptance test to the applicable standard (ISO 9906, IEC 60193), and the " +
	"installation, its suction conditions and its pressure parts are designed to the applicable local codes and checked by licensed engineers."

// IEC 60193 reference values for the scalable-loss step-up of reaction
// machines (Francis and pump-turbines, pumps): the reference Reynolds
// number and the scalable part of the losses at it.
const (
	IECReferenceReynolds = 7e6
	IECScalableLoss      = 0.7
)

// IECMinReynolds is the least model Reynolds number IECStepUp accepts
// (10⁵, this package's bound: the formula is for model tests at
// Reynolds numbers well above it).
const IECMinReynolds = 1e5

// ReynoldsNumbers are a model's and a prototype's Reynolds numbers on one
// definition, named so that one cannot be given for the other.
type ReynoldsNumbers struct {
	Model, Prototype float64 // Re_M, Re_P
}

// IECStepUp steps up a hydraulic efficiency from model to prototype by
// the scalable-loss formula of IEC 60193 (hydraulic turbines, storage
// pumps and pump-turbines, model acceptance tests), quoted from memory:
//
//	δ_ref = (1 − η_M,opt)/((Re_ref/Re_M,opt)^0.16 + (1 − V_ref)/V_ref)
//	Δη = δ_ref·((Re_ref/Re_M)^0.16 − (Re_ref/Re_P)^0.16)
//
// with Re_ref = 7×10⁶ and V_ref = 0.7 (IECReferenceReynolds,
// IECScalableLoss). The formula steps up a hydraulic efficiency; given an
// overall efficiency (a pump's η = ρgQH/P), it takes the hydraulic
// efficiency equal to it, and outside the standard's scope (another kind
// of pump) its result is an indication only. The Reynolds numbers are the
// machines' own as the standard defines them (Re = D·u/ν with u the
// peripheral speed at the reference diameter D); re.Model is the model's
// at its test point, re.Prototype the prototype's. It returns the prototype
// efficiency η_M + Δη, and Δη.
func IECStepUp(etaModel float64, re ReynoldsNumbers) (etaProto, gain float64, err error) {
	reM, reP := re.Model, re.Prototype
	m := func(r string) error {
		return &Error{Op: "IEC 60193 step-up", Fault: similarity.Invalid("", r)}
	}
	if !(etaModel > 0 && etaModel < 1) {
		return 0, 0, m(fmt.Sprintf("model efficiency %.4g is not between 0 and 1", etaModel))
	}
	switch {
	case math.IsNaN(reM) || math.IsNaN(reP) || math.IsInf(reM, 0) || math.IsInf(reP, 0):
		return 0, 0, m(fmt.Sprintf("Reynolds numbers %.3g (model) and %.3g (prototype): want finite", reM, reP))
	case reM < IECMinReynolds:
		return 0, 0, m(fmt.Sprintf("model Reynolds number Re_M = %.3g is below 10⁵ (want 10⁵ ≤ Re_M ≤ Re_P)", reM))
	case reP < reM:
		return 0, 0, m(fmt.Sprintf("prototype Reynolds number Re_P = %.3g is below the model's Re_M = %.3g (want 10⁵ ≤ Re_M ≤ Re_P)", reP, reM))
	}
	const v = IECScalableLoss
	r := func(re float64) float64 { return math.Pow(IECReferenceReynolds/re, 0.16) }
	dref := (1 - etaModel) / (r(reM) + (1-v)/v)
	gain = dref * (r(reM) - r(reP))
	return etaModel + gain, gain, nil
}

// AckeretStepUp steps up an efficiency by Ackeret's formula (1930),
// 1 − η_P = (1 − η_M)·(0.5 + 0.5·(Re_M/Re_P)^0.2): half the losses taken
// as scaling with the Reynolds number to the power −0.2.
func AckeretStepUp(etaModel float64, re ReynoldsNumbers) (float64, error) {
	reM, reP := re.Model, re.Prototype
	if !(etaModel > 0 && etaModel < 1) {
		return 0, &Error{Op: "Ackeret step-up", Fault: similarity.Invalid("", fmt.Sprintf("model efficiency %.4g is not between 0 and 1", etaModel))}
	}
	if !(reM > 0 && reP >= reM) || math.IsInf(reP, 0) {
		return 0, &Error{Op: "Ackeret step-up", Fault: similarity.Invalid("", fmt.Sprintf("Reynolds numbers %.3g (model) and %.3g (prototype): want 0 < Re_M ≤ Re_P, finite", reM, reP))}
	}
	return 1 - (1-etaModel)*(0.5+0.5*math.Pow(reM/reP, 0.2)), nil
}

// FanStepUp converts a fan's efficiency near its best-efficiency point
// from the tested size or speed (Reynolds number re.Model) to another
// (re.Prototype) of
// the same geometrically similar range, by Ackeret's formula applied as
// fan test standards advise: because larger fans of a range perform
// better but the formula's gain is uncertain, only half the predicted
// increase is taken for a larger Reynolds number, and the full predicted
// decrease for a smaller one. (The rule is the fan standards' clause on
// the efficiency of other sizes, which admits it by agreement between
// purchaser and manufacturer and only near the best efficiency; the
// standards prefer testing enough sizes of the series that no fan's
// performance is derived from a larger one.) The Reynolds
// numbers must be on one definition, for example the impeller's tip
// speed times its diameter over ν. It returns the converted efficiency
// and the change applied.
func FanStepUp(etaModel float64, re ReynoldsNumbers) (eta, change float64, err error) {
	reM, reP := re.Model, re.Prototype
	m := func(r string) error {
		return &Error{Op: "fan efficiency conversion", Fault: similarity.Invalid("", r)}
	}
	if !(etaModel > 0 && etaModel < 1) {
		return 0, 0, m(fmt.Sprintf("model efficiency %.4g is not between 0 and 1", etaModel))
	}
	if !(reM > 0 && reP > 0) || math.IsInf(reM, 0) || math.IsInf(reP, 0) {
		return 0, 0, m(fmt.Sprintf("Reynolds numbers %.3g and %.3g: want positive and finite", reM, reP))
	}
	full := (1 - etaModel) * (0.5 - 0.5*math.Pow(reM/reP, 0.2)) // Ackeret's change, η_P − η_M
	change = full
	if full > 0 {
		change = full / 2
	}
	if eta = etaModel + change; !(eta > 0) {
		return 0, 0, m(fmt.Sprintf("converted efficiency %.4g from η = %.4g at Re %.3g → %.3g: the Reynolds numbers are too far apart for the formula", eta, etaModel, reM, reP))
	}
	return eta, change, nil
}

// FanCurve converts a fan's efficiency curve by FanStepUp with the change
// found at the best-efficiency point added at every point (common
// practice; the formula holds only near that point).
func FanCurve(etaModel []float64, re ReynoldsNumbers) (StepUp, error) {
	out, err := newStepUp("fan efficiency conversion", etaModel, StepUpAtBEP)
	if err != nil {
		return StepUp{}, err
	}
	if _, out.Gain, err = FanStepUp(etaModel[out.BEP], re); err != nil {
		return StepUp{}, err
	}
	for i, e := range etaModel {
		out.Efficiency[i] = e + out.Gain
		if !(out.Efficiency[i] > 0 && out.Efficiency[i] < 1) {
			return StepUp{}, &Error{Op: "fan efficiency conversion", Fault: similarity.Invalid("", fmt.Sprintf("point %d: converted efficiency %.4g is not between 0 and 1", i, out.Efficiency[i]))}
		}
	}
	return out, nil
}

// IECCurve steps up a model efficiency curve by IECStepUp with the gain
// at the best-efficiency point added at every point, as the standard does;
// re holds the model's and prototype's Reynolds numbers.
func IECCurve(etaModel []float64, re ReynoldsNumbers) (StepUp, error) {
	out, err := newStepUp("IEC 60193 step-up", etaModel, StepUpAtBEP)
	if err != nil {
		return StepUp{}, err
	}
	_, gain, err := IECStepUp(etaModel[out.BEP], re)
	if err != nil {
		return StepUp{}, err
	}
	out.Gain = gain
	for i, e := range etaModel {
		out.Efficiency[i] = e + gain
	}
	return out, nil
}

// NPSHInput is the state at a pump's (or turbine's) low-pressure
// reference section.
type NPSHInput struct {
	// Pressure is the absolute static pressure at the section (a gauge
	// reading must first be made absolute with the day's barometer).
	Pressure quantity.Quantity
	// VapourPressure is the liquid's at its temperature
	// (fluids.VapourPressure for water).
	VapourPressure quantity.Quantity
	Density        quantity.Quantity
	// Velocity is the mean velocity at the section, for its velocity head.
	Velocity quantity.Quantity
	// Gravity is g; g_n if zero.
	Gravity quantity.Quantity
}

// NPSH returns the net positive suction head (energy) at the section,
// NPSH = (p − p_v)/(ρg) + V²/(2g), as a length: the head above vapour
// pressure (ISO 9906, IEC 60193). A result out of the range of a float64
// is a *Error of class quantity.ErrRange. See PumpCaution.
func NPSH(in NPSHInput) (quantity.Quantity, error) {
	if err := fail("NPSH", similarity.CheckInputs(true,
		similarity.Input{Name: "pressure", Value: in.Pressure, Dim: quantity.Pressure},
		similarity.Input{Name: "vapour pressure", Value: in.VapourPressure, Dim: quantity.Pressure},
		similarity.Input{Name: "density", Value: in.Density, Dim: quantity.Density})); err != nil {
		return quantity.Quantity{}, err
	}
	if err := fail("NPSH", similarity.CheckInputs(false,
		similarity.Input{Name: "velocity", Value: in.Velocity, Dim: quantity.Velocity})); err != nil {
		return quantity.Quantity{}, err
	}
	gq, bad := similarity.GravityOr(in.Gravity)
	if bad != nil {
		return quantity.Quantity{}, fail("NPSH", bad)
	}
	g := gq.Value()
	p, pv, rho, v := in.Pressure.Value(), in.VapourPressure.Value(), in.Density.Value(), in.Velocity.Value()
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return quantity.Quantity{}, &Error{Op: "NPSH", Fault: similarity.Invalid("velocity", "velocity must be finite")}
	}
	n := (p-pv)/(rho*g) + v*v/(2*g)
	if err := fail("NPSH", similarity.CheckResults(false, similarity.Result{Name: "NPSH", Value: n})); err != nil {
		return quantity.Quantity{}, err
	}
	return quantity.New(n, quantity.Length), nil
}

// Heads are a machine's NPSH and its head at one operating point, both
// lengths, named so that one cannot be given for the other.
type Heads struct {
	NPSH quantity.Quantity // the net positive suction head (NPSH3 at the cavitation limit)
	Head quantity.Quantity // the machine's head H at the same point
}

// Thoma returns the Thoma cavitation number σ = NPSH/H of h: equal for
// model and prototype at similar operating points (IEC 60193), so the
// prototype's NPSH is σ·H_P.
func Thoma(h Heads) (float64, error) {
	npsh, head := h.NPSH, h.Head
	if err := npsh.CheckNamed("NPSH", quantity.Length); err != nil {
		return 0, err
	}
	if err := head.CheckNamed("head", quantity.Length); err != nil {
		return 0, err
	}
	if !(head.Value() > 0) || math.IsInf(head.Value(), 0) || math.IsNaN(npsh.Value()) || math.IsInf(npsh.Value(), 0) {
		return 0, &Error{Op: "Thoma number", Fault: similarity.Invalid("", fmt.Sprintf("NPSH %.4g m and head %.4g m: want a finite NPSH and a positive, finite head", npsh.Value(), head.Value()))}
	}
	sigma := npsh.Value() / head.Value()
	return sigma, fail("Thoma number", similarity.CheckResults(false, similarity.Result{Name: "Thoma number σ", Value: sigma}))
}

// SuctionPressureFor returns the absolute static pressure the prototype
// needs at its low-pressure section to run at the model's Thoma number σ
// with head H: p = p_v + ρg(σH − V²/(2g)), with the vapour pressure at the
// prototype's own water temperature. Head, vapour pressure and density
// must be positive and finite, the velocity finite. See PumpCaution.
func SuctionPressureFor(sigma float64, head quantity.Quantity, vapour, density, velocity, gravity quantity.Quantity) (quantity.Quantity, error) {
	if err := fail("suction pressure", similarity.CheckInputs(true,
		similarity.Input{Name: "head", Value: head, Dim: quantity.Length},
		similarity.Input{Name: "vapour pressure", Value: vapour, Dim: quantity.Pressure},
		similarity.Input{Name: "density", Value: density, Dim: quantity.Density})); err != nil {
		return quantity.Quantity{}, err
	}
	if err := fail("suction pressure", similarity.CheckInputs(false, similarity.Input{Name: "velocity", Value: velocity, Dim: quantity.Velocity})); err != nil {
		return quantity.Quantity{}, err
	}
	if v := velocity.Value(); math.IsNaN(v) || math.IsInf(v, 0) {
		return quantity.Quantity{}, &Error{Op: "suction pressure", Fault: similarity.Invalid("", "velocity must be finite")}
	}
	gq, bad := similarity.GravityOr(gravity)
	if bad != nil {
		return quantity.Quantity{}, fail("suction pressure", bad)
	}
	g := gq.Value()
	if !(sigma >= 0) || math.IsInf(sigma, 0) {
		return quantity.Quantity{}, &Error{Op: "suction pressure", Fault: similarity.Invalid("", fmt.Sprintf("Thoma number %.4g: want a finite number at least 0", sigma))}
	}
	v := velocity.Value()
	p := vapour.Value() + density.Value()*g*(sigma*head.Value()-v*v/(2*g))
	if err := fail("suction pressure", similarity.CheckResults(false, similarity.Result{Name: "required absolute pressure", Value: p})); err != nil {
		return quantity.Quantity{}, err
	}
	if !(p > 0) {
		return quantity.Quantity{}, &Error{Op: "suction pressure", Fault: similarity.Invalid("", fmt.Sprintf("the required absolute pressure %.4g Pa is not positive", p))}
	}
	return quantity.New(p, quantity.Pressure), nil
}

// SpecificSpeeds is a machine's specific speed in the three conventions
// in use, all at the same point (the best-efficiency point, per stage and
// per eye): the dimensionless Ω_s = ω·Q^½/(gH)^¾ with ω in rad/s, the
// metric n_q = n·Q^½/H^¾ with n in rpm, Q in m³/s and H in m, and the US
// N_s = n·Q^½/H^¾ with n in rpm, Q in US gallons per minute and H in feet.
//
// The fields are bare numbers because a specific speed's "unit" is a
// convention, not a unit a value can carry; String prints each with its
// convention.
type SpecificSpeeds struct {
	// Dimensionless is Ω_s = ω·Q^½/(gH)^¾ (dimensionless, ω in rad/s, Q in m³/s, gH in J/kg).
	Dimensionless float64
	// Metric is n_q = n·Q^½/H^¾ (rpm, m³/s, m), with n in rpm, Q in m³/s and H in m.
	Metric float64
	// US is N_s = n·Q^½/H^¾ (rpm, US gpm, ft), with n in rpm, Q in US gallons per minute and H in feet.
	US float64
}

// String prints the three specific speeds to four significant figures,
// each with its convention:
//
//	n_q = 28.83 (n in rpm, Q in m³/s, H in m); N_s = 1489 (n in rpm, Q in US gpm, H in ft); Ω_s = 0.5448 (dimensionless: ω in rad/s, Q in m³/s, gH in J/kg)
func (s SpecificSpeeds) String() string {
	return fmt.Sprintf("n_q = %.4g (n in rpm, Q in m³/s, H in m); N_s = %.4g (n in rpm, Q in US gpm, H in ft); Ω_s = %.4g (dimensionless: ω in rad/s, Q in m³/s, gH in J/kg)",
		s.Metric, s.US, s.Dimensionless)
}

// Exact factors between the conventions: 1 US gallon = 3.785411784 L,
// 1 ft = 0.3048 m (NIST SP 811), g_n = 9.80665 m/s².
var (
	usPerMetric            = math.Sqrt(60/3.785411784e-3) * math.Pow(0.3048, 0.75)
	dimensionlessPerMetric = (2 * math.Pi / 60) / math.Pow(9.80665, 0.75)
)

// SpecificSpeedOf returns the specific speeds of a machine turning at
// the angular velocity omega, with flow Q and head H, for standard
// gravity. Give omega through its unit, units.MustParse("rpm").Of(1450):
// a rotational speed and a frequency share a dimension, so a bare
// quantity.New(1450/60, …) in rev/s would be read as rad/s, 2π too small.
func SpecificSpeedOf(omega, flow, head quantity.Quantity) (SpecificSpeeds, error) {
	if err := fail("specific speed", similarity.CheckInputs(true,
		similarity.Input{Name: "rotational speed", Value: omega, Dim: quantity.AngularVelocity},
		similarity.Input{Name: "flow", Value: flow, Dim: quantity.VolumeFlowRate},
		similarity.Input{Name: "head", Value: head, Dim: quantity.Length})); err != nil {
		return SpecificSpeeds{}, err
	}
	w, qv, h := omega.Value(), flow.Value(), head.Value()
	return specificSpeeds(w * 60 / (2 * math.Pi) * math.Sqrt(qv) / math.Pow(h, 0.75))
}

// SpecificSpeedMetric converts n_q (rpm, m³/s, m) to all three forms. A
// specific speed that is not positive and finite is an
// *Error; one whose other forms overflow a float64 is a
// *Error of class quantity.ErrRange.
func SpecificSpeedMetric(nq float64) (SpecificSpeeds, error) {
	if err := specificSpeedIn("n_q", nq); err != nil {
		return SpecificSpeeds{}, err
	}
	return specificSpeeds(nq)
}

// SpecificSpeedUS converts N_s (rpm, US gpm, ft) to all three forms,
// with the errors of SpecificSpeedMetric.
func SpecificSpeedUS(ns float64) (SpecificSpeeds, error) {
	if err := specificSpeedIn("N_s", ns); err != nil {
		return SpecificSpeeds{}, err
	}
	return specificSpeeds(ns / usPerMetric)
}

// SpecificSpeedDimensionless converts Ω_s (rad/s, m³/s, m, g_n) to all
// three forms, with the errors of SpecificSpeedMetric.
func SpecificSpeedDimensionless(omega float64) (SpecificSpeeds, error) {
	if err := specificSpeedIn("Ω_s", omega); err != nil {
		return SpecificSpeeds{}, err
	}
	return specificSpeeds(omega / dimensionlessPerMetric)
}

// specificSpeedIn checks a specific speed given in one form.
func specificSpeedIn(form string, v float64) error {
	if !(v > 0) || math.IsInf(v, 0) {
		return &Error{Op: "specific speed", Fault: similarity.Invalid("", fmt.Sprintf("%s = %.4g: want a positive, finite specific speed", form, v))}
	}
	return nil
}

// specificSpeeds returns the three forms from n_q, each checked.
func specificSpeeds(nq float64) (SpecificSpeeds, error) {
	s := SpecificSpeeds{Dimensionless: nq * dimensionlessPerMetric, Metric: nq, US: nq * usPerMetric}
	if err := fail("specific speed", similarity.CheckResults(true,
		similarity.Result{Name: "specific speed n_q", Value: s.Metric},
		similarity.Result{Name: "specific speed N_s", Value: s.US},
		similarity.Result{Name: "specific speed Ω_s", Value: s.Dimensionless})); err != nil {
		return SpecificSpeeds{}, err
	}
	return s, nil
}
