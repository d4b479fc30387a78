package tunnel

import (
	"errors"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Error reports a wind-tunnel computation that cannot give a result: an input
// it cannot use, a value outside the range of the procedure, or a result
// out of the range of a float64. It is the package's one error type.
type Error struct {
	Op     string // the procedure, in words: "2-D wall correction"
	Input  string // the input or result concerned, if one is
	Class  error  // one of quantity.ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid
	Reason string // what was wrong, in words
	Err    error  // the error that caused this one, or nil
	// Line is the line of a balance-calibration file the error is on,
	// from 1; 0 when the error is not about a file.
	Line int
}

// Error implements the error interface.
func (e *Error) Error() string {
	s := "tunnel: " + e.Op + ": "
	if e.Line > 0 {
		s += "line " + strconv.Itoa(e.Line) + ": "
	}
	s += e.Reason
	if e.Err != nil {
		s += ": " + e.Err.Error()
	}
	return s
}

// Is reports whether target is the error's class.
func (e *Error) Is(target error) bool { return target != nil && target == e.Class }

// Unwrap returns the error that caused this one, or nil.
func (e *Error) Unwrap() error { return e.Err }

// invalid returns an *Error of class quantity.ErrInvalid.
func invalid(op, input, reason string) *Error {
	return &Error{Op: op, Input: input, Class: quantity.ErrInvalid, Reason: reason}
}

// outOfRange returns an *Error of class quantity.ErrRange.
func outOfRange(op, input, reason string) *Error {
	return &Error{Op: op, Input: input, Class: quantity.ErrRange, Reason: reason}
}

// input is one quantity a method takes: its name for messages and the
// dimension it must have.
type input struct {
	name string
	q    quantity.Quantity
	d    quantity.Dim
}

// checkInputs checks each input's dimension (a *quantity.DimensionError
// naming it) and, when positive is set, that its value is positive and
// finite (an *Error of class quantity.ErrInvalid naming it and the method).
func checkInputs(method string, positive bool, in ...input) error {
	for _, c := range in {
		if err := c.q.CheckNamed(c.name, c.d); err != nil {
			return err
		}
		if positive && (!(c.q.Value() > 0) || math.IsInf(c.q.Value(), 0)) {
			return invalid(method, c.name, c.name+" must be positive and finite")
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

// result is one computed value a method returns, with its name.
type result struct {
	name string
	v    float64
}

// checkResults returns an *Error of class quantity.ErrRange for the first
// result that is not finite or, when positive is set, not above zero.
func checkResults(method string, positive bool, rs ...result) error {
	for _, r := range rs {
		if math.IsNaN(r.v) || math.IsInf(r.v, 0) || (positive && !(r.v > 0)) {
			return outOfRange(method, r.name, "the "+r.name+" ("+strconv.FormatFloat(r.v, 'g', 4, 64)+
				") is out of the range of a float64 for these inputs")
		}
	}
	return nil
}

// wrap returns an *Error caused by err, in err's class (quantity.ErrInvalid
// when err has none of quantity's), so that it matches exactly one class.
func wrap(op, input, reason string, err error) *Error {
	class := quantity.ErrInvalid
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			class = c
			break
		}
	}
	return &Error{Op: op, Input: input, Class: class, Reason: reason, Err: err}
}
