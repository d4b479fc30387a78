package similarity

import (
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// input is one quantity a method takes: its name for messages and the
// dimension it must have.
type input struct {
	name string
	q    quantity.Quantity
	d    quantity.Dim
}

// checkInputs checks each input's dimension (a *quantity.DimensionError
// naming it) and, when positive is set, that its value is positive and
// finite (an *ExtrapolationError naming it and the method).
func checkInputs(method string, positive bool, in ...input) error {
	for _, c := range in {
		if err := c.q.CheckNamed(c.name, c.d); err != nil {
			return err
		}
		if positive && (!(c.q.Value() > 0) || math.IsInf(c.q.Value(), 0)) {
			return &ExtrapolationError{Method: method, Reason: c.name + " must be positive and finite"}
		}
	}
	return nil
}

// orDefault returns q, or def when q is the zero Quantity (the field left
// unset); a given q must have def's dimension and be positive and finite,
// or an error names it and the method.
func orDefault(method, name string, q, def quantity.Quantity) (quantity.Quantity, error) {
	if q == (quantity.Quantity{}) {
		return def, nil
	}
	if err := checkInputs(method, true, input{name, q, def.Dim()}); err != nil {
		return quantity.Quantity{}, err
	}
	return q, nil
}

// gravityOr returns g, or the standard acceleration of gravity g_n when g
// is unset, checked as orDefault does.
func gravityOr(method string, g quantity.Quantity) (quantity.Quantity, error) {
	return orDefault(method, "gravity", g, units.StandardGravity())
}

// ResultRangeError reports a result that falls out of the range of a
// float64 — an overflow to ±Inf, a NaN, or an underflow to zero where the
// inputs make the result positive — although each input was accepted.
// It matches quantity.ErrRange.
type ResultRangeError struct {
	Method string // the computation, "NPSH"
	Result string // the result that overflowed, "specific speed n_q"
	Value  float64
}

// Error implements the error interface.
func (e *ResultRangeError) Error() string {
	return "similarity: " + e.Method + ": the " + e.Result + " (" + strconv.FormatFloat(e.Value, 'g', 4, 64) +
		") is out of the range of a float64 for these inputs"
}

// Is reports whether target is quantity.ErrRange, the class of a
// *ResultRangeError.
func (e *ResultRangeError) Is(target error) bool { return target == quantity.ErrRange }

// result is one computed value a method returns, with its name.
type result struct {
	name string
	v    float64
}

// checkResults returns a *ResultRangeError for the first result that is
// not finite or, when positive is set, not above zero.
func checkResults(method string, positive bool, rs ...result) error {
	for _, r := range rs {
		if math.IsNaN(r.v) || math.IsInf(r.v, 0) || (positive && !(r.v > 0)) {
			return &ResultRangeError{Method: method, Result: r.name, Value: r.v}
		}
	}
	return nil
}
