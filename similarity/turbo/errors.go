package turbo

import (
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// Error reports a turbomachine computation that cannot give a result: an input
// it cannot use, a value outside the range of the procedure, or a result
// out of the range of a float64. It is the package's one error type.
type Error struct {
	Op     string // the procedure, in words: "IEC 60193 step-up"
	Input  string // the input or result concerned, if one is
	Class  error  // one of quantity.ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid
	Reason string // what was wrong, in words
	Err    error  // the error that caused this one, or nil
}

// Error implements the error interface.
func (e *Error) Error() string {
	s := "turbo: " + e.Op + ": " + e.Reason
	if e.Err != nil {
		s += ": " + e.Err.Error()
	}
	return s
}

// Is reports whether target is the error's class.
func (e *Error) Is(target error) bool { return target != nil && target == e.Class }

// Unwrap returns the error that caused this one, or nil.
func (e *Error) Unwrap() error { return e.Err }

// fail returns f, a fault found by one of the shared checks of package
// similarity, as an error of procedure op; nil when f is nil.
func fail(op string, f *similarity.Fault) error {
	if f == nil || f.Reason == "" {
		return f.Cause()
	}
	return &Error{Op: op, Input: f.Input, Class: f.Class, Reason: f.Reason, Err: f.Err}
}

// invalid returns an *Error of class quantity.ErrInvalid.
func invalid(op, input, reason string) *Error {
	return &Error{Op: op, Input: input, Class: quantity.ErrInvalid, Reason: reason}
}

// outOfRange returns an *Error of class quantity.ErrRange.
func outOfRange(op, input, reason string) *Error {
	return &Error{Op: op, Input: input, Class: quantity.ErrRange, Reason: reason}
}

// wrap returns an *Error caused by err, in err's class, so that it
// matches exactly one class.
func wrap(op, input, reason string, err error) *Error {
	return &Error{Op: op, Input: input, Class: similarity.ClassOf(err), Reason: reason, Err: err}
}
