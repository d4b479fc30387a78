package units

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// Reasons a unit expression is refused; an *Error of OpParse has one as
// its Kind, so errors.Is(err, ErrUnknownSymbol) and the like work.
var (
	ErrEmpty         = errors.New("empty expression")
	ErrSyntax        = errors.New("syntax error")
	ErrUnknownSymbol = errors.New("unknown unit symbol")
	ErrDangling      = errors.New("dangling operator")
	ErrParen         = errors.New("unbalanced parenthesis")
	ErrExponent      = errors.New("bad exponent")
	ErrTooDeep       = errors.New("nesting too deep")
	ErrTooLong       = errors.New("expression too long")
	ErrAmbiguous     = errors.New("ambiguous expression")
	ErrNumber        = errors.New("bad number")
)

// Limits that bound the parser's work for any input.
const (
	MaxExprLen  = 512 // bytes in an expression
	MaxDepth    = 16  // nested parentheses
	MaxExpAbs   = 24  // largest |exponent| numerator
	MaxExpDen   = 12  // largest exponent denominator
	maxNumLen   = 40  // bytes in a numeric factor
	maxCacheLen = 8192
)

// The operations an Error reports.
const (
	OpParse      = "parse"        // reading a unit expression
	OpParseValue = "parse value"  // reading a number and a unit
	OpConvert    = "convert"      // converting between units
	OpGauge      = "gauge"        // making a gauge level absolute, or one from an absolute pressure
	OpDefine     = "define"       // defining a unit in a Table
	OpFormat     = "format value" // writing a value as text
	OpSetFlag    = "set flag"     // setting a Flag
)

// Error is the package's one error type: a unit expression or a value
// that cannot be read, a conversion that cannot be made, a number out of
// range, a gauge pressure used as if it were absolute, or a definition
// that is refused. Op says which.
//
// Kind, one of the package's Err… values, names the problem (ErrSyntax,
// ErrUnknownSymbol, ErrIncompatible, ErrGauge, ErrDefine, …), and Err holds
// the error that caused it, if one did (the unit part of a value, the
// expression of a definition). Under errors.Is an Error matches its Kind
// and exactly one class of the module: the cause's class when the cause
// has one; otherwise quantity.ErrUnknown for an unknown symbol,
// quantity.ErrParse for text that cannot be read, quantity.ErrDimension
// for dimensions that differ, quantity.ErrRange for a number out of
// range, and quantity.ErrInvalid for an angle or a temperature role that
// does not match, a gauge pressure and a definition. Unwrap returns the
// cause.
type Error struct {
	Op     string // OpParse, OpConvert, …, or the unit operation for a number out of range ("multiply units")
	Input  string // the text or value concerned; the name, for OpDefine
	Offset int    // byte offset in Input of the problem, for OpParse and OpParseValue
	Kind   error  // one of the Err… values, or nil
	Reason string // what exactly is wrong
	Symbol string // the offending symbol, if any

	// Suggest holds the nearest known spellings, for an unknown symbol.
	Suggest []string

	// From and To are the units of a conversion that cannot be made;
	// FromDim is the dimension of the source, for a Quantity read in a
	// unit (From is then the zero Unit). Hint says how to write what was
	// meant, if known.
	From, To Unit
	FromDim  quantity.Dim
	Hint     string

	Value float64 // the offending number, for a number out of range

	// Class is the error's class when neither the cause nor the Kind
	// gives it (quantity.ErrRange for a number out of range).
	Class error
	Err   error // the cause, if any
}

func describeUnit(u Unit) string {
	return fmt.Sprintf("%s (%s)", u.Format(quantity.Unicode), quantity.Describe(u.dim))
}

// Error implements the error interface.
func (e *Error) Error() string {
	var sb strings.Builder
	switch {
	case e.Op == OpParse:
		fmt.Fprintf(&sb, "units: %q: at offset %d: %v", e.Input, e.Offset, e.Kind)
		if e.Reason != "" {
			sb.WriteString(": ")
			sb.WriteString(e.Reason)
		}
		if len(e.Suggest) > 0 {
			sb.WriteString(" (did you mean ")
			for i, s := range e.Suggest {
				if i > 0 {
					if i == len(e.Suggest)-1 {
						sb.WriteString(" or ")
					} else {
						sb.WriteString(", ")
					}
				}
				sb.WriteString(strconv.Quote(s))
			}
			sb.WriteString("?)")
		}
		if e.Err != nil {
			fmt.Fprintf(&sb, ": %v", e.Err)
		}
	case e.Op == OpParseValue || e.Op == OpFormat:
		if e.Err != nil {
			fmt.Fprintf(&sb, "units: value %q: %v", e.Input, e.Err)
		} else {
			fmt.Fprintf(&sb, "units: value %q: at offset %d: %s", e.Input, e.Offset, e.Reason)
		}
	case e.Op == OpConvert && e.Kind != nil:
		from := describeUnit(e.From)
		if e.From == (Unit{}) {
			from = "a quantity of " + quantity.Describe(e.FromDim)
		}
		fmt.Fprintf(&sb, "units: cannot convert %s to %s", from, describeUnit(e.To))
		if e.Reason != "" {
			sb.WriteString(": " + e.Reason)
		}
		if e.Hint != "" {
			sb.WriteString("; " + e.Hint)
		}
	case e.Op == OpSetFlag && e.Err != nil:
		// The dimension error names the text already, as a flag's
		// message does.
		sb.WriteString(e.Err.Error())
	case e.Op == OpGauge:
		fmt.Fprintf(&sb, "units: gauge pressure %q: %s", e.Input, e.Reason)
	case e.Op == OpDefine:
		if e.Err != nil {
			fmt.Fprintf(&sb, "units: define %q: %v", e.Input, e.Err)
		} else {
			fmt.Fprintf(&sb, "units: define %q: %s", e.Input, e.Reason)
		}
	default:
		sb.WriteString("units: " + e.Op + ": " + e.Reason)
		if e.Err != nil {
			if e.Reason != "" {
				sb.WriteString(": ")
			}
			sb.WriteString(e.Err.Error())
		}
	}
	return sb.String()
}

// Unwrap returns the cause, or nil.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is the error's Kind or its one class.
func (e *Error) Is(target error) bool {
	return target != nil && (target == e.Kind || target == e.class())
}

// classes are the module's error classes.
// class returns the error's one class: the cause's, Class, or the one
// its Kind and Op give.
func (e *Error) class() error {
	if c := quantity.ClassOf(e.Err); c != nil {
		return c
	}
	switch {
	case e.Class != nil:
		return e.Class
	case e.Kind == ErrUnknownSymbol:
		return quantity.ErrUnknown
	case e.Kind == ErrIncompatible:
		return quantity.ErrDimension
	case e.Op == OpParse || e.Op == OpParseValue:
		return quantity.ErrParse
	}
	return quantity.ErrInvalid
}
