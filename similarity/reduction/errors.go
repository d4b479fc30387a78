package reduction

import (
	"fmt"
	"strings"

	"similis.dev/similis/quantity"
)

// Error reports why a file could not be reduced: the file, and where
// there is one the line of a text file (or the data row), the point and
// the channel or group concerned. Its class under errors.Is is that of
// its cause (a *chanfile.Error of the reader, a *steady.Error, a
// *formula.Error, an *uncertain.Error, …) when the cause has one,
// and quantity.ErrInvalid otherwise, so it matches exactly one class.
type Error struct {
	// Op is the step that failed: "plan" when the spec does not fit the
	// file's columns (a variable with no channel, a formula that does not
	// compile, a unit that does not convert) — a mistake of the caller,
	// not of the data — or "read", "derive", "calibrate", "points",
	// "zero", "reduce", "groups", "write".
	Op      string
	File    string
	Line    int    // the line of a text file, from 1; 0 if unknown
	Row     int    // the data row, from 1; 0 if none
	Point   string // the point's tag ("run 2", "zero"), if any
	Channel string // the channel, variable or group concerned, if any
	Reason  string
	Err     error // the cause, or nil

	located bool // the cause's message names the file and line itself
}

// Error returns "reduction: carriage.csv:812: run 2: channel "drag": …".
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("reduction: ")
	if e.located && e.Point == "" && e.Channel == "" && e.Reason == "" {
		sb.WriteString(e.Err.Error())
		return sb.String()
	}
	if e.File != "" {
		sb.WriteString(e.File)
		switch {
		case e.Line > 0:
			fmt.Fprintf(&sb, ":%d", e.Line)
		case e.Row > 0:
			fmt.Fprintf(&sb, ": row %d", e.Row)
		}
		sb.WriteString(": ")
	}
	if e.Point != "" {
		sb.WriteString(e.Point)
		sb.WriteString(": ")
	}
	if e.Channel != "" {
		fmt.Fprintf(&sb, "%q: ", e.Channel)
	}
	sb.WriteString(e.Reason)
	if e.Err != nil {
		if e.Reason != "" {
			sb.WriteString(": ")
		}
		sb.WriteString(e.Err.Error())
	}
	return sb.String()
}

// Unwrap returns the cause.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is quantity.ErrInvalid, the class of an
// Error whose cause has no class of the module.
func (e *Error) Is(target error) bool {
	return target == quantity.ErrInvalid && classless(e.Err)
}

// classless reports whether err has none of the module's classes.
func classless(err error) bool {
	return err == nil || quantity.ClassOf(err) == nil
}
