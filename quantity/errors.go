package quantity

import (
	"errors"
	"fmt"
	"strings"
)

// The classes of error of the whole module. Every error similis returns
// matches exactly one of them, or ErrConflict of package similarity,
// under errors.Is, and its concrete type (a *…Error of the package that
// returned it) under errors.As; the concrete types name the input, the
// offset where there is one, and the reason.
var (
	// ErrDimension: a dimension that is wrong for an operation, or two
	// that differ where they must agree. Every *DimensionError matches it.
	ErrDimension = errors.New("dimension error")
	// ErrRange: a number out of range — not finite, an overflow or an
	// underflow, an exponent or a fraction too large, a value outside
	// the range of a correlation.
	ErrRange = errors.New("out of range")
	// ErrParse: text that cannot be read (a unit, a value, a dimension, an
	// exponent).
	ErrParse = errors.New("cannot parse")
	// ErrUnknown: a name that is not known (a unit symbol, a variable, a
	// kind of quantity).
	ErrUnknown = errors.New("unknown name")
	// ErrInvalid: an argument or a combination of arguments a function
	// cannot take (a repeating set of the wrong size, a group of another
	// problem, series of different lengths, a plan built wrongly).
	ErrInvalid = errors.New("invalid argument")
)

// DimensionError reports a dimension that is wrong for an operation: two
// sides of a sum that differ, a transcendental function given a
// dimensional argument, an exponent that overflows or cannot be held, or a
// value checked against the dimension it should have.
//
// Arithmetic on Quantity and Series panics with a *DimensionError; the
// checking functions (Quantity.Check, Series.Check, Eval, and Dim's own
// methods) return one.
type DimensionError struct {
	// Op is the operation as a verb phrase: "add", "compare",
	// "take the logarithm of", "check". A "%s" in it marks where the
	// operand is named: "raise %s to a real power".
	Op string
	// Name is the caller's name for the value, if any ("Re", "column 3").
	Name string
	// Left is the dimension of the (first) operand, or the dimension found
	// by a check.
	Left Dim
	// Right is the dimension of the second operand, or the expected
	// dimension for a check; it is meaningful when Binary is true.
	Right Dim
	// Binary reports whether the operation had two operands (or an
	// expected dimension).
	Binary bool
	// Detail says why, when the operation alone does not ("the argument
	// must be dimensionless").
	Detail string
}

// Describe names a dimension for a message: its kinds of quantity, if any
// are known, and its coherent SI unit as a Quantity's String writes it —
// the special name N, Pa or W where the dimension is exactly theirs, the
// base-unit form otherwise: "pressure, stress [Pa]", "density [kg·m⁻³]".
func Describe(d Dim) string {
	if name := KindName(d); name != "" {
		return name + " [" + d.unitText(false) + "]"
	}
	return "[" + d.unitText(false) + "]"
}

// Error returns the message, naming the operation and both sides with
// their kinds of quantity:
//
//	cannot add pressure, stress [Pa] and velocity [m·s⁻¹]
func (e *DimensionError) Error() string {
	var sb strings.Builder
	if e.Op == "check" {
		if e.Name != "" {
			sb.WriteString(e.Name)
			sb.WriteString(": ")
		}
		fmt.Fprintf(&sb, "want %s, got %s", Describe(e.Right), Describe(e.Left))
		if e.Detail != "" {
			sb.WriteString(": ")
			sb.WriteString(e.Detail)
		}
		return sb.String()
	}
	if e.Name != "" {
		sb.WriteString(e.Name)
		sb.WriteString(": ")
	}
	sb.WriteString("cannot ")
	// A product or quotient fails only by overflow, of two operands.
	binary := e.Binary || e.Op == "multiply" || e.Op == "divide"
	if before, after, ok := strings.Cut(e.Op, "%s"); ok {
		// The operand goes inside the phrase: "raise %s to a real power".
		sb.WriteString(before)
		sb.WriteString(Describe(e.Left))
		sb.WriteString(after)
	} else {
		sb.WriteString(e.Op)
		if e.Left != Dim(0) || binary || e.Detail == "" {
			sb.WriteByte(' ')
			sb.WriteString(Describe(e.Left))
		}
	}
	if binary {
		sb.WriteString(" and ")
		sb.WriteString(Describe(e.Right))
	}
	detail := e.Detail
	if detail == "" && (e.Op == "multiply" || e.Op == "divide" || e.Op == "invert") {
		detail = overflows // the only way these fail
	}
	if detail != "" {
		sb.WriteString(": ")
		sb.WriteString(detail)
	}
	return sb.String()
}

// Is reports whether target is ErrDimension.
func (e *DimensionError) Is(target error) bool { return target == ErrDimension }

// Error reports text that does not parse (a dimension, a quantity, an
// exact exponent), an exact rational operation that cannot be done, or
// Series of different lengths combined element-wise. It matches exactly
// one class under errors.Is, in Class: ErrParse, ErrRange or ErrInvalid.
// A dimension that is wrong is a *DimensionError instead.
type Error struct {
	Op     string // "parse", "add", "divide", "scale to integers", …
	Input  string // the text, or the operands of a rational operation
	Offset int    // byte offset of the problem within Input, for "parse"
	Reason string // what is wrong
	// Left and Right are the two lengths, for Series of different
	// lengths (ErrInvalid); equal otherwise.
	Left, Right int
	Class       error // ErrParse, ErrRange or ErrInvalid
}

// Is reports whether target is the error's class.
func (e *Error) Is(target error) bool { return target != nil && target == e.Class }

// Error implements the error interface.
func (e *Error) Error() string {
	switch {
	case e.Op == "parse":
		return fmt.Sprintf("parse %q: at offset %d: %s", e.Input, e.Offset, e.Reason)
	case e.Left != e.Right:
		return fmt.Sprintf("cannot %s series of lengths %d and %d", e.Op, e.Left, e.Right)
	}
	return fmt.Sprintf("quantity: %s %s: %s", e.Op, e.Input, e.Reason)
}

// parseError is the Error of text s that does not parse at byte at.
func parseError(s string, at int, reason string) *Error {
	return &Error{Op: "parse", Input: s, Offset: at, Reason: reason, Class: ErrParse}
}

// lengthError is the Error of Series of lengths a and b combined by op.
func lengthError(op string, a, b int) *Error {
	return &Error{Op: op, Left: a, Right: b, Class: ErrInvalid}
}

//go:noinline
func panicBinary(op string, a, b Dim) {
	panic(&DimensionError{Op: op, Left: a, Right: b, Binary: true})
}

//go:noinline
func panicOverflow(op string, a, b Dim) {
	panic(&DimensionError{Op: op, Left: a, Right: b, Binary: true, Detail: overflows})
}

//go:noinline
func panicUnary(op string, a Dim, detail string) {
	panic(&DimensionError{Op: op, Left: a, Detail: detail})
}

//go:noinline
func panicErr(err error) { panic(err) }

//go:noinline
func panicLength(op string, a, b int) {
	panic(lengthError(op, a, b))
}

const overflows = "an exponent overflows"

const mustBeDimensionless = "the argument must be dimensionless"

// Eval runs a formula and returns its result, turning a panic with a
// *DimensionError, or with an *Error for Series of different lengths,
// raised inside it into a returned error. Any other panic is passed on.
// It is meant for programs that evaluate formulas their users supply,
// where a dimension mismatch is an input error rather than a bug.
func Eval(formula func() Quantity) (q Quantity, err error) {
	defer func() {
		if r := recover(); r != nil {
			switch e := r.(type) {
			case *DimensionError:
				err = e
			case *Error:
				if e.Left == e.Right {
					panic(r) // not a length mismatch: a Must… function's error
				}
				err = e
			default:
				panic(r)
			}
			q = Quantity{}
		}
	}()
	return formula(), nil
}

// classes are the module's error classes, in the order ClassOf tries them.
var classes = [...]error{ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid}

// ClassOf returns the class of this package that err matches under
// errors.Is — ErrDimension, ErrRange, ErrParse, ErrUnknown or ErrInvalid —
// or nil when it matches none. An error type that wraps a cause takes the
// cause's class with it, so that the wrapper matches exactly one class.
func ClassOf(err error) error {
	for _, c := range classes {
		if errors.Is(err, c) {
			return c
		}
	}
	return nil
}
