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
	// that differ where they must agree. An *Error of this package
	// carrying it names the operation and the dimensions.
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

// Describe names a dimension for a message: its kinds of quantity, if any
// are known, and its coherent SI unit as a Quantity's String writes it —
// a name of String's fixed set (N, Pa, W, N·m, Pa·s, …) where the
// dimension is exactly its, the base-unit form otherwise:
// "pressure, stress [Pa]", "dynamic viscosity [Pa·s]", "density [kg·m⁻³]".
func Describe(d Dim) string {
	if name := KindName(d); name != "" {
		return name + " [" + d.unitText(false) + "]"
	}
	return "[" + d.unitText(false) + "]"
}

// Error is the one error type of this package. It reports
//
//   - a dimension that is wrong for an operation (class ErrDimension): two
//     sides of a sum that differ, a transcendental function given a
//     dimensional argument, an exponent that overflows or cannot be held,
//     or a value checked against the dimension it should have;
//   - text that does not parse — a dimension, a quantity, an exact
//     exponent (ErrParse);
//   - an exact rational operation that cannot be done (ErrRange);
//   - Series of different lengths combined element-wise, or a value with
//     no text form (ErrInvalid).
//
// Arithmetic on Quantity and Series panics with an *Error of class
// ErrDimension (or, for Series of different lengths, ErrInvalid); the
// checking functions (Quantity.Check, Series.Check, Eval, and Dim's own
// methods) and the parsers return one. It matches exactly one class under
// errors.Is, the one in Class.
type Error struct {
	// Op is the operation as a verb phrase: "parse", "add", "compare",
	// "take the logarithm of", "check", "scale to integers". In a
	// dimension error a "%s" in it marks where the operand is named:
	// "raise %s to a real power".
	Op string
	// Input is the text that does not parse, or the operands of an exact
	// rational operation; empty for a dimension error.
	Input string
	// Offset is the byte offset of the problem within Input, for "parse".
	Offset int
	// Name is the caller's name for the value, if any ("Re", "column 3").
	Name string
	// Dims are the dimensions of a dimension error: Dims[0] is that of the
	// (first) operand, or the dimension a check found; Dims[1] is that of
	// the second operand, or the dimension a check expected. Dims[1] is
	// meaningful when Binary is true.
	Dims [2]Dim
	// Binary reports whether the operation had two operands (or an
	// expected dimension).
	Binary bool
	// Lengths are the two lengths of Series of different lengths
	// (ErrInvalid); equal (zero) otherwise.
	Lengths [2]int
	// Reason says what is wrong. A dimension error leaves it empty when
	// the operation alone says why ("cannot add … and …").
	Reason string
	// Class is the error's class: ErrDimension, ErrParse, ErrRange or
	// ErrInvalid.
	Class error
	// Err is the underlying cause, if any (a *strconv.NumError for a
	// number that does not parse); it matches none of the module's
	// classes, so the Error matches only its Class.
	Err error
}

// Is reports whether target is the error's class.
func (e *Error) Is(target error) bool { return target != nil && target == e.Class }

// Unwrap returns the cause, or nil.
func (e *Error) Unwrap() error { return e.Err }

// Error returns the message. A dimension error names the operation and
// both sides with their kinds of quantity:
//
//	cannot add pressure, stress [Pa] and velocity [m·s⁻¹]
func (e *Error) Error() string {
	switch {
	case e.Class == ErrDimension:
		return e.dimensionText()
	case e.Op == "parse":
		return fmt.Sprintf("parse %q: at offset %d: %s", e.Input, e.Offset, e.Reason)
	case e.Lengths[0] != e.Lengths[1]:
		return fmt.Sprintf("cannot %s series of lengths %d and %d", e.Op, e.Lengths[0], e.Lengths[1])
	}
	return fmt.Sprintf("quantity: %s %s: %s", e.Op, e.Input, e.Reason)
}

// dimensionText is the message of an error of class ErrDimension.
func (e *Error) dimensionText() string {
	var sb strings.Builder
	left, right := e.Dims[0], e.Dims[1]
	if e.Op == "check" {
		if e.Name != "" {
			sb.WriteString(e.Name)
			sb.WriteString(": ")
		}
		fmt.Fprintf(&sb, "want %s, got %s", Describe(right), Describe(left))
		if e.Reason != "" {
			sb.WriteString(": ")
			sb.WriteString(e.Reason)
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
		sb.WriteString(Describe(left))
		sb.WriteString(after)
	} else {
		sb.WriteString(e.Op)
		if left != Dim(0) || binary || e.Reason == "" {
			sb.WriteByte(' ')
			sb.WriteString(Describe(left))
		}
	}
	if binary {
		sb.WriteString(" and ")
		sb.WriteString(Describe(right))
	}
	detail := e.Reason
	if detail == "" && (e.Op == "multiply" || e.Op == "divide" || e.Op == "invert") {
		detail = overflows // the only way these fail
	}
	if detail != "" {
		sb.WriteString(": ")
		sb.WriteString(detail)
	}
	return sb.String()
}

// parseError is the Error of text s that does not parse at byte at.
func parseError(s string, at int, reason string) *Error {
	return &Error{Op: "parse", Input: s, Offset: at, Reason: reason, Class: ErrParse}
}

// lengthError is the Error of Series of lengths a and b combined by op.
func lengthError(op string, a, b int) *Error {
	return &Error{Op: op, Lengths: [2]int{a, b}, Class: ErrInvalid}
}

// dimError is the Error of class ErrDimension of a unary operation op on
// a dimension a, for the reason given ("" when op says it).
func dimError(op string, a Dim, reason string) *Error {
	return &Error{Op: op, Dims: [2]Dim{a, 0}, Reason: reason, Class: ErrDimension}
}

// binaryError is the Error of class ErrDimension of a binary operation op
// on dimensions a and b, or of a check that found a where b was expected.
func binaryError(op string, a, b Dim, reason string) *Error {
	return &Error{Op: op, Dims: [2]Dim{a, b}, Binary: true, Reason: reason, Class: ErrDimension}
}

//go:noinline
func panicBinary(op string, a, b Dim) {
	panic(binaryError(op, a, b, ""))
}

//go:noinline
func panicOverflow(op string, a, b Dim) {
	panic(binaryError(op, a, b, overflows))
}

//go:noinline
func panicUnary(op string, a Dim, detail string) {
	panic(dimError(op, a, detail))
}

//go:noinline
func panicErr(err error) { panic(err) }

//go:noinline
func panicLength(op string, a, b int) {
	panic(lengthError(op, a, b))
}

const overflows = "an exponent overflows"

const mustBeDimensionless = "the argument must be dimensionless"

// Eval runs a formula and returns its result, turning a panic with an
// *Error of class ErrDimension, or of class ErrInvalid for Series of
// different lengths, raised inside it into a returned error. Any other
// panic is passed on.
// It is meant for programs that evaluate formulas their users supply,
// where a dimension mismatch is an input error rather than a bug.
func Eval(formula func() Quantity) (q Quantity, err error) {
	defer func() {
		if r := recover(); r != nil {
			switch e := r.(type) {
			case *Error:
				if e.Class != ErrDimension && e.Lengths[0] == e.Lengths[1] {
					panic(r) // not a dimension or length mismatch: a Must… function's error
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
