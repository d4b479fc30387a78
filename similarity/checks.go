package similarity

import (
	"math"

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
