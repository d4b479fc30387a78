package turbo

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// ModelPoint is one operating point of the model: its flow, head and
// efficiency η_M = ρgQH/P.
type ModelPoint struct {
	Flow, Head quantity.Quantity // Q_M, H_M
	Efficiency float64           // η_M, strictly between 0 and 1
}

// StepUpApplied names the efficiency step-up carried to the prototype
// and gives the prototype efficiency it returned, so that the result can
// say which was applied.
type StepUpApplied struct {
	// Method names the formula as a report prints it: "Moody, n = 1/5",
	// "IEC 60193", "none (efficiency taken equal)". Required.
	Method string
	// Efficiency is the prototype efficiency η_P the formula gave
	// (MoodyStepUp's result, IECStepUp's etaProto, …), strictly between
	// 0 and 1; the model's own efficiency for no step-up.
	Efficiency float64
}

// PrototypeInput is what PrototypePointOf carries to the prototype: a
// model point, the affinity ratios between the machines, the step-up
// applied and the prototype's fluid.
type PrototypeInput struct {
	Affinity Affinity   // from AffinityLaws, model/prototype
	Model    ModelPoint // the model point to carry
	StepUp   StepUpApplied
	// Density is the prototype fluid's ρ_P, for its power.
	Density quantity.Quantity
	// Gravity is g, the same for model and prototype; g_n if zero.
	Gravity quantity.Quantity
}

// PrototypePoint is a model point carried to the prototype.
type PrototypePoint struct {
	// Flow and Head are the affinity values, Q_P = Q_M/λ_Q and
	// H_P = H_M/λ_H (the head ratio λ_H is that of gH; with one g it is
	// that of H). The step-up does not change them.
	Flow, Head quantity.Quantity
	// Efficiency is η_P = ModelEfficiency + Gain, from the step-up named
	// in StepUp.
	Efficiency, ModelEfficiency, Gain float64
	StepUp                            string
	// Power is the prototype's power input P_P = ρ_P·g·Q_P·H_P/η_P, with
	// the stepped-up efficiency (not the affinity power P_M/λ_P, which
	// takes the efficiency equal).
	Power quantity.Quantity
	// Caution is PumpCaution.
	Caution string
}

// PrototypePointOf carries a model point to the prototype by the recipe
// of the trade: the flow and head by the affinity laws, Q_P = Q_M/λ_Q and
// H_P = H_M/λ_H, unchanged by the step-up; the efficiency stepped up,
// η_P from the named formula; and the power from them,
// P_P = ρ_P·g·Q_P·H_P/η_P. Inputs of the wrong dimension, not positive or
// not finite, an efficiency outside 0 … 1 or an unnamed step-up are an
// *Error naming the input. See PumpCaution.
func PrototypePointOf(in PrototypeInput) (PrototypePoint, error) {
	const op = "prototype point"
	bad := func(input, r string) error { return &Error{Op: op, Fault: similarity.Invalid(input, r)} }
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "model flow", Value: in.Model.Flow, Dim: quantity.VolumeFlowRate},
		similarity.Input{Name: "model head", Value: in.Model.Head, Dim: quantity.Length},
		similarity.Input{Name: "prototype density", Value: in.Density, Dim: quantity.Density})); err != nil {
		if err, ok := err.(*quantity.Error); ok {
			return PrototypePoint{}, &Error{Op: op, Fault: similarity.Caused(err.Name, "wrong dimension", err)}
		}
		return PrototypePoint{}, err
	}
	g, gf := similarity.GravityOr(in.Gravity)
	if gf != nil {
		return PrototypePoint{}, fail(op, gf)
	}
	a := in.Affinity
	if !(a.Flow > 0 && a.Head > 0) || math.IsInf(a.Flow+a.Head, 0) {
		return PrototypePoint{}, bad("affinity", fmt.Sprintf("flow ratio %.4g and head ratio %.4g: want positive and finite (from AffinityLaws)", a.Flow, a.Head))
	}
	etaM, etaP := in.Model.Efficiency, in.StepUp.Efficiency
	if !(etaM > 0 && etaM < 1) {
		return PrototypePoint{}, bad("model efficiency", fmt.Sprintf("model efficiency %.4g is not between 0 and 1", etaM))
	}
	if in.StepUp.Method == "" {
		return PrototypePoint{}, bad("step-up", "StepUpApplied.Method is not set: name the step-up applied (\"none (efficiency taken equal)\" for none)")
	}
	if !(etaP > 0 && etaP < 1) {
		return PrototypePoint{}, bad("step-up", fmt.Sprintf("prototype efficiency %.4g (%s) is not between 0 and 1", etaP, in.StepUp.Method))
	}
	qp, hp := in.Model.Flow.Value()/a.Flow, in.Model.Head.Value()/a.Head
	pp := in.Density.Value() * g.Value() * qp * hp / etaP
	if err := fail(op, similarity.CheckResults(true,
		similarity.Result{Name: "prototype flow", Value: qp},
		similarity.Result{Name: "prototype head", Value: hp},
		similarity.Result{Name: "prototype power", Value: pp})); err != nil {
		return PrototypePoint{}, err
	}
	return PrototypePoint{
		Flow: quantity.New(qp, quantity.VolumeFlowRate), Head: quantity.New(hp, quantity.Length),
		Efficiency: etaP, ModelEfficiency: etaM, Gain: etaP - etaM, StepUp: in.StepUp.Method,
		Power: quantity.New(pp, quantity.Power), Caution: PumpCaution,
	}, nil
}
