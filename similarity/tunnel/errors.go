package tunnel

import (
	"strconv"

	"similis.dev/similis/similarity"
)

// Error reports a wind-tunnel computation that cannot give a result: an input
// it cannot use, a value outside the range of the procedure, a result
// out of the range of a float64, or a line of a balance-calibration file
// it cannot read. It is the package's one error type. Its Fault gives the
// input concerned, the class (one of quantity.ErrDimension, ErrRange,
// ErrParse, ErrUnknown, ErrInvalid) under errors.Is, the reason and the
// cause under errors.Unwrap.
type Error struct {
	Op string // the procedure, in words: "2-D wall correction"
	// Line is the line of a balance-calibration file the error is on,
	// from 1; 0 when the error is not about a file.
	Line int
	similarity.Fault
}

// Error implements the error interface.
func (e *Error) Error() string {
	s := "tunnel: " + e.Op + ": "
	if e.Line > 0 {
		s += "line " + strconv.Itoa(e.Line) + ": "
	}
	return s + e.Message()
}

// fail reports a fault found by a shared check as an *Error of op.
func fail(op string, f *similarity.Fault) error { return similarity.Fail(op, f, newError) }

// newError returns the *Error of procedure op for fault f.
func newError(op string, f similarity.Fault) *Error { return &Error{Op: op, Fault: f} }
