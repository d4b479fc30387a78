package similarity

import (
	"math"

	"similis.dev/similis/quantity"
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
