package turbo

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Diameters are a model's and a prototype's impeller or runner diameters
// (at the same reference point of the two machines), named so that one
// cannot be given for the other.
type Diameters struct {
	Model, Prototype quantity.Quantity // D_m, D_p
}

// MoodyStepUpOptions holds the choices of Moody's step-up formula. It is a struct, not
// a bare number, so that the exponent cannot be passed where the
// efficiency belongs (both lie in 0 … 1).
type MoodyStepUpOptions struct {
	// Exponent is n in (D_m/D_p)^n, within 0 … 1; 1/5 if zero.
	Exponent float64
}

// MoodyStepUp carries a model pump or turbine efficiency to the
// prototype by Moody's formula, η_p = 1 − (1 − η_m)·(D_m/D_p)^n, with
// n = opt.Exponent, 1/5 if zero (L. F. Moody, 1925). It is an estimate;
// acceptance tests follow the applicable standard (IEC 60193 for
// hydraulic machines).
func MoodyStepUp(etaModel float64, d Diameters, opt MoodyStepUpOptions) (float64, error) {
	exponent := opt.Exponent
	dModel, dProto := d.Model, d.Prototype
	m := func(r string) error {
		return &Error{Op: "Moody step-up", Fault: similarity.Invalid("", r)}
	}
	if !(etaModel > 0 && etaModel < 1) {
		return 0, m(fmt.Sprintf("model efficiency %.4g is not between 0 and 1", etaModel))
	}
	if err := fail("Moody step-up", similarity.CheckInputs(true,
		similarity.Input{Name: "model diameter", Value: dModel, Dim: quantity.Length},
		similarity.Input{Name: "prototype diameter", Value: dProto, Dim: quantity.Length})); err != nil {
		return 0, err
	}
	if exponent == 0 {
		exponent = 0.2
	}
	if !(exponent >= 0 && exponent <= 1) {
		return 0, m(fmt.Sprintf("exponent %.4g is outside 0 … 1", exponent))
	}
	eta := 1 - (1-etaModel)*math.Pow(dModel.Value()/dProto.Value(), exponent)
	if !(eta > 0 && eta < 1) {
		return 0, m(fmt.Sprintf("the stepped efficiency %.4g is outside 0 … 1 (a prototype %.4g times smaller than the model)", eta, dModel.Value()/dProto.Value()))
	}
	return eta, nil
}

// StepUpMethod says how an efficiency step-up is applied along a
// machine's curve.
type StepUpMethod uint8

// Step-up methods.
const (
	// StepUpAtBEP computes the step-up at the model's best-efficiency
	// point and adds that gain to every point of the curve: the common
	// practice, and the approach of IEC 60193 for hydraulic machines.
	StepUpAtBEP StepUpMethod = iota
	// StepUpEachPoint applies the formula to each point's own efficiency,
	// which overstates the gain at part load (where losses are mostly
	// not the scalable friction losses the formula assumes).
	StepUpEachPoint
)

// String names the method.
func (m StepUpMethod) String() string {
	if m == StepUpAtBEP || m == StepUpEachPoint {
		return [...]string{"the best-efficiency-point gain added at every point (common practice; IEC 60193's approach)", "the formula applied at each point"}[m]
	}
	return fmt.Sprintf("StepUpMethod(%d)", uint8(m))
}

// StepUp is a model efficiency curve carried to the prototype.
type StepUp struct {
	Method StepUpMethod
	// Efficiency holds the prototype efficiency of each point.
	Efficiency []float64
	// BEP is the index of the model's best-efficiency point, and Gain
	// the step-up there, η_p − η_m.
	BEP  int
	Gain float64
}

// MoodyCurve steps up a model efficiency curve by Moody's formula (see
// MoodyStepUp) with the chosen method; the result says which. The
// efficiencies must lie strictly between 0 and 1.
func MoodyCurve(etaModel []float64, d Diameters, opt MoodyStepUpOptions, method StepUpMethod) (StepUp, error) {
	out, err := newStepUp("Moody step-up", etaModel, method)
	if err != nil {
		return StepUp{}, err
	}
	bep, err := MoodyStepUp(etaModel[out.BEP], d, opt)
	if err != nil {
		return StepUp{}, err
	}
	out.Gain = bep - etaModel[out.BEP]
	for i, e := range etaModel {
		switch method {
		case StepUpAtBEP:
			out.Efficiency[i] = e + out.Gain
		case StepUpEachPoint:
			if out.Efficiency[i], err = MoodyStepUp(e, d, opt); err != nil {
				return StepUp{}, err
			}
		default:
			return StepUp{}, &Error{Op: "Moody step-up", Fault: similarity.Invalid("", "unknown "+method.String())}
		}
	}
	return out, nil
}

// newStepUp checks a model efficiency curve (points strictly between 0
// and 1) and returns its StepUp with the best-efficiency point found.
func newStepUp(method string, etaModel []float64, m StepUpMethod) (StepUp, error) {
	if len(etaModel) == 0 {
		return StepUp{}, &Error{Op: method, Fault: similarity.Invalid("", "no efficiency points")}
	}
	out := StepUp{Method: m, Efficiency: make([]float64, len(etaModel))}
	for i, e := range etaModel {
		if !(e > 0 && e < 1) {
			return StepUp{}, &Error{Op: method, Fault: similarity.Invalid("", fmt.Sprintf("point %d: model efficiency %.4g is not between 0 and 1", i, e))}
		}
		if e > etaModel[out.BEP] {
			out.BEP = i
		}
	}
	return out, nil
}
