package similarity

import (
	"errors"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Shared checks for trade procedures. The trade packages (ship, tunnel,
// turbo, hydraulic) check their inputs and results the same way; the
// checks below find what is wrong and describe it in a Fault, and each
// trade reports the Fault as its own error type, which embeds it beside
// the name of its procedure.

// Input is one quantity a trade procedure takes: its name for messages,
// its value and the dimension it must have.
type Input struct {
	Name  string
	Value quantity.Quantity
	Dim   quantity.Dim
}

// Result is one computed value a trade procedure returns, with its name
// for messages.
type Result struct {
	Name  string
	Value float64
}

// Fault describes what is wrong with a trade procedure's input or result.
// It is a description, not an error: a trade's error type embeds it beside
// the procedure's name, and so takes its fields and its Is and Unwrap
// methods. When Reason is empty the fault is Err alone, an error complete
// in itself (the *quantity.Error of class quantity.ErrDimension naming an
// input of the wrong dimension), which the trade returns unchanged (see
// Cause).
type Fault struct {
	Input  string // the input or result concerned, if one is
	Reason string // what was wrong, in words
	Class  error  // one of quantity.ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid, or ErrConflict
	Err    error  // the error that caused this one, or nil
}

// Invalid returns a Fault of class quantity.ErrInvalid.
func Invalid(input, reason string) Fault {
	return Fault{Input: input, Reason: reason, Class: quantity.ErrInvalid}
}

// OutOfRange returns a Fault of class quantity.ErrRange.
func OutOfRange(input, reason string) Fault {
	return Fault{Input: input, Reason: reason, Class: quantity.ErrRange}
}

// Caused returns a Fault caused by err, in err's class (ClassOf), so that
// an error embedding it matches exactly one class.
func Caused(input, reason string, err error) Fault {
	return Fault{Input: input, Reason: reason, Class: ClassOf(err), Err: err}
}

// Message returns the reason, followed by the cause's message when there
// is a cause: the text after a trade's prefix and procedure.
func (f Fault) Message() string {
	if f.Err != nil {
		return f.Reason + ": " + f.Err.Error()
	}
	return f.Reason
}

// Is reports whether target is the fault's class.
func (f Fault) Is(target error) bool { return target != nil && target == f.Class }

// Unwrap returns the error that caused the fault, or nil.
func (f Fault) Unwrap() error { return f.Err }

// Cause returns Err, or nil when f is nil.
func (f *Fault) Cause() error {
	if f == nil {
		return nil
	}
	return f.Err
}

// Fail returns a trade's error for f, a fault found by a shared check in
// the trade's procedure op: nil for no fault, Err itself for a fault that
// is Err alone, and otherwise the error newErr makes of op and f (the
// trade's error type embedding the Fault).
func Fail[E error](op string, f *Fault, newErr func(op string, f Fault) E) error {
	if f == nil || f.Reason == "" {
		return f.Cause()
	}
	return newErr(op, *f)
}

// CheckInputs checks each input's dimension (a Fault whose Err is the
// *quantity.Error of class quantity.ErrDimension naming it) and, when
// positive is set, that its value is positive and finite (a Fault of
// class quantity.ErrInvalid naming it). It returns the first fault, or
// nil.
func CheckInputs(positive bool, in ...Input) *Fault {
	for _, c := range in {
		if err := c.Value.CheckNamed(c.Name, c.Dim); err != nil {
			return &Fault{Input: c.Name, Class: quantity.ErrDimension, Err: err}
		}
		if v := c.Value.Value(); positive && (!(v > 0) || math.IsInf(v, 0)) {
			return &Fault{Input: c.Name, Class: quantity.ErrInvalid, Reason: c.Name + " must be positive and finite"}
		}
	}
	return nil
}

// OrDefault returns q, or def when q is the zero Quantity (an option left
// unset). A given q must have def's dimension and be positive and finite,
// or a Fault names it as name.
func OrDefault(name string, q, def quantity.Quantity) (quantity.Quantity, *Fault) {
	if q == (quantity.Quantity{}) {
		return def, nil
	}
	if f := CheckInputs(true, Input{Name: name, Value: q, Dim: def.Dim()}); f != nil {
		return quantity.Quantity{}, f
	}
	return q, nil
}

// GravityOr returns g, or the standard acceleration of gravity g_n when g
// is unset, checked as OrDefault checks an option named "gravity".
func GravityOr(g quantity.Quantity) (quantity.Quantity, *Fault) {
	return OrDefault("gravity", g, units.StandardGravity())
}

// CheckResults returns a Fault of class quantity.ErrRange for the first
// result that is not finite or, when positive is set, not above zero, or
// nil when every result is usable.
func CheckResults(positive bool, rs ...Result) *Fault {
	for _, r := range rs {
		if math.IsNaN(r.Value) || math.IsInf(r.Value, 0) || (positive && !(r.Value > 0)) {
			return &Fault{Input: r.Name, Class: quantity.ErrRange, Reason: "the " + r.Name + " (" +
				strconv.FormatFloat(r.Value, 'g', 4, 64) + ") is out of the range of a float64 for these inputs"}
		}
	}
	return nil
}

// ClassOf returns the first of quantity.ErrDimension, ErrRange, ErrParse,
// ErrUnknown, ErrInvalid and ErrConflict that err matches, or
// quantity.ErrInvalid when it matches none, so that an error wrapping err
// has exactly one class.
func ClassOf(err error) error {
	if errors.Is(err, ErrConflict) {
		return ErrConflict
	}
	if c := quantity.ClassOf(err); c != nil {
		return c
	}
	return quantity.ErrInvalid
}

// CheckRatios returns a Fault of class quantity.ErrRange for the first
// model/prototype ratio that is not positive and finite, named by its
// Result's Name, or nil when every ratio is usable.
func CheckRatios(rs ...Result) *Fault {
	for _, r := range rs {
		if !(r.Value > 0) || math.IsInf(r.Value, 0) {
			return &Fault{Input: r.Name, Class: quantity.ErrRange, Reason: "the " + r.Name + " ratio " +
				strconv.FormatFloat(r.Value, 'g', -1, 64) + " is not positive and finite (a model/prototype ratio)"}
		}
	}
	return nil
}
