package fit

import (
	"fmt"

	"similis.dev/similis/quantity"
)

// Error reports data a fit cannot take, a prediction it refuses, or a
// shape a fairing cannot have. Err is the error's class, quantity.ErrInvalid
// (data or arguments a fit cannot take) or quantity.ErrRange (a number out
// of range: not finite, an x outside the fitted range, a result that
// overflows), or a cause of one of those classes; every Error matches
// exactly one class under errors.Is.
type Error struct {
	Op     string // the function: "FitPoly", "Predict", "Fair", …
	Row    int    // the offending row (0-based), or −1
	Reason string
	Err    error // the class, or a cause of one class
}

// Error returns the message: "fit: FitPoly: row 3: weight −1: want a
// positive finite number".
func (e *Error) Error() string {
	s := "fit: " + e.Op + ": "
	if e.Row >= 0 {
		s += fmt.Sprintf("row %d: ", e.Row)
	}
	s += e.Reason
	if e.Err != quantity.ErrInvalid && e.Err != quantity.ErrRange && e.Err != nil {
		s += ": " + e.Err.Error()
	}
	return s
}

// Unwrap returns the class or the cause.
func (e *Error) Unwrap() error { return e.Err }

func invalid(op string, row int, format string, args ...any) *Error {
	return &Error{Op: op, Row: row, Reason: fmt.Sprintf(format, args...), Err: quantity.ErrInvalid}
}

func outOfRange(op string, row int, format string, args ...any) *Error {
	return &Error{Op: op, Row: row, Reason: fmt.Sprintf(format, args...), Err: quantity.ErrRange}
}

// finite reports whether x is neither NaN nor ±Inf.
func finite(x float64) bool { return x-x == 0 }

// allFinite reports whether every value is finite.
func allFinite(v ...float64) bool {
	for _, x := range v {
		if !finite(x) {
			return false
		}
	}
	return true
}
