package steady

import (
	"fmt"
	"strings"

	"similis.dev/similis/quantity"
)

// Error reports an argument or a piece of data the reduction cannot take:
// a window outside the record, a missing value inside a window, a channel
// too strongly correlated for its window. Its class under errors.Is is
// that of Err when Err is set (quantity.ErrRange for a number out of
// range, or the class of the cause it wraps) and quantity.ErrInvalid
// otherwise, so that it matches exactly one class.
type Error struct {
	Op      string // what was being done: "summarize", "detect", "tare", …
	Channel string // the channel's name, if any
	Row     int    // the sample (row from 0 of the history), or −1
	Reason  string
	Err     error // the cause, or the class quantity.ErrRange; nil for ErrInvalid
}

// Error returns "steady: summarize: channel "drag": row 412: …".
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("steady: ")
	sb.WriteString(e.Op)
	sb.WriteString(": ")
	if e.Channel != "" {
		fmt.Fprintf(&sb, "channel %q: ", e.Channel)
	}
	if e.Row >= 0 {
		fmt.Fprintf(&sb, "row %d: ", e.Row)
	}
	sb.WriteString(e.Reason)
	if e.Err != nil && e.Err != quantity.ErrRange {
		sb.WriteString(": ")
		sb.WriteString(e.Err.Error())
	}
	return sb.String()
}

// Is reports whether target is quantity.ErrInvalid, the class of an Error
// without a cause.
func (e *Error) Is(target error) bool { return e.Err == nil && target == quantity.ErrInvalid }

// Unwrap returns the cause, or nil.
func (e *Error) Unwrap() error { return e.Err }

func invalid(op, channel string, row int, format string, args ...any) *Error {
	return &Error{Op: op, Channel: channel, Row: row, Reason: fmt.Sprintf(format, args...)}
}

func outOfRange(op, channel string, row int, format string, args ...any) *Error {
	return &Error{Op: op, Channel: channel, Row: row, Reason: fmt.Sprintf(format, args...), Err: quantity.ErrRange}
}

// ParseError reports a calibration file that cannot be read, with the
// line (from 1; 0 when the whole file is concerned). Its class is that
// of Err when Err has one (a unit that is not known is
// quantity.ErrUnknown, a coefficient's unit of the wrong dimension
// quantity.ErrDimension) and quantity.ErrParse otherwise, so that it
// matches exactly one class.
type ParseError struct {
	File   string
	Line   int
	Text   string // the offending text, truncated, if any
	Reason string
	Err    error // an underlying error (a units parse error), or nil
}

// Error returns "steady: drag.cal:7: …".
func (e *ParseError) Error() string {
	var sb strings.Builder
	sb.WriteString("steady: ")
	sb.WriteString(e.File)
	if e.Line > 0 {
		fmt.Fprintf(&sb, ":%d", e.Line)
	}
	sb.WriteString(": ")
	if e.Text != "" {
		fmt.Fprintf(&sb, "%q: ", e.Text)
	}
	sb.WriteString(e.Reason)
	if e.Err != nil {
		sb.WriteString(": ")
		sb.WriteString(e.Err.Error())
	}
	return sb.String()
}

// Is reports whether target is quantity.ErrParse, the class of a
// ParseError without a cause or whose cause has no class of the module
// (a failing reader's I/O error).
func (e *ParseError) Is(target error) bool { return target == quantity.ErrParse && !classed(e.Err) }

// classed reports whether err matches one of the module's classes.
func classed(err error) bool {
	return quantity.ClassOf(err) != nil
}

// Unwrap returns the underlying error, or nil.
func (e *ParseError) Unwrap() error { return e.Err }

// RangeError reports a raw reading outside the range a calibration
// covers: it is refused rather than extrapolated. It matches
// quantity.ErrRange.
type RangeError struct {
	Calibration string // the calibration's name
	Channel     string // the channel it was applied to
	Row         int    // the sample (row from 0 of the series), or −1 for a mean
	Time        quantity.Quantity
	HasTime     bool    // Time is the row's time
	Value       float64 // the reading, in the calibration's raw unit
	Lo, Hi      float64 // the calibrated range, in the raw unit
	Unit        string  // the raw unit's spelling
}

// Error returns "steady: calibration "drag" on channel "Fx": row 812
// (t = 4.06 s): reading 2.31 mV/V outside the calibrated range
// [-2, 2] mV/V"; a mean is named "mean" in place of the row.
func (e *RangeError) Error() string {
	var sb strings.Builder
	fmt.Fprintf(&sb, "steady: calibration %q", e.Calibration)
	if e.Channel != "" {
		fmt.Fprintf(&sb, " on channel %q", e.Channel)
	}
	switch {
	case e.Row >= 0 && e.HasTime:
		fmt.Fprintf(&sb, ": row %d (t = %.6g s)", e.Row, e.Time.Value())
	case e.Row >= 0:
		fmt.Fprintf(&sb, ": row %d", e.Row)
	case e.Channel != "":
		sb.WriteString(": mean")
	}
	sb.WriteString(": ")
	fmt.Fprintf(&sb, "reading %.6g %s outside the calibrated range [%.6g, %.6g] %s", e.Value, e.Unit, e.Lo, e.Hi, e.Unit)
	return sb.String()
}

// Is reports whether target is quantity.ErrRange.
func (e *RangeError) Is(target error) bool { return target == quantity.ErrRange }
