package ship

import "similis.dev/similis/similarity"

// Error reports a ship-model computation that cannot give a result: an input
// it cannot use, a value outside the range of the procedure, or a result
// out of the range of a float64. It is the package's one error type. Its
// Fault gives the input concerned, the class (one of
// quantity.ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid)
// under errors.Is, the reason and the cause under errors.Unwrap.
type Error struct {
	Op string // the procedure, in words: "ITTC-1978 prediction"
	similarity.Fault
}

// Error implements the error interface.
func (e *Error) Error() string {
	if e.Reason == "" && e.Err != nil {
		return "ship: " + e.Op + ": " + e.Err.Error()
	}
	return "ship: " + e.Op + ": " + e.Message()
}

// fail reports a fault found by a shared check as an *Error of op.
func fail(op string, f *similarity.Fault) error { return similarity.Fail(op, f, newError) }

// newError returns the *Error of procedure op for fault f.
func newError(op string, f similarity.Fault) *Error { return &Error{Op: op, Fault: f} }

// failNamed is fail, except that a fault that is a cause alone (a wrong
// dimension, whose cause names the input) is also returned as an *Error
// of op, so that its message says which procedure refused it.
func failNamed(op string, f *similarity.Fault) error {
	if f != nil && f.Reason == "" && f.Err != nil {
		return newError(op, *f)
	}
	return fail(op, f)
}
