package pigroups

import (
	"fmt"
	"strings"

	"similis.dev/similis/quantity"
)

// The operations an Error reports.
const (
	OpProblem   = "problem"       // forming a problem, a group or a set of groups
	OpRepeating = "repeating set" // checking a repeating set
	OpEvaluate  = "evaluate"      // evaluating groups from values
	OpFit       = "fit"           // fitting a power law to group values
)

// Error is the package's one error type: a list of variables that cannot
// form a problem, a repeating set that is refused, values that cannot be
// evaluated, or data a power law cannot be fitted to. Op says which.
//
// Kind, one of the package's Err… values, names the problem, and Err
// holds the error of another package that caused it, if one did. Under
// errors.Is an Error matches its Kind and exactly one class of the
// module: the cause's class when the cause has one (a unit that does not
// parse, a wrong dimension), else the Kind's (quantity.ErrUnknown for an
// unknown name, quantity.ErrRange for exponents too large or a value
// that is not finite, quantity.ErrDimension for a kind or group of the
// wrong dimension), else quantity.ErrInvalid. Unwrap returns the cause.
type Error struct {
	Op     string // OpProblem, OpRepeating, OpEvaluate or OpFit
	Kind   error  // one of the package's Err… values, or nil
	Symbol string // the offending variable or group, if one
	Reason string // what was wrong, in words

	// OpFit: the offending row and group (0 for Π₀), or −1; the
	// condition number, for collinear groups: of the groups' centred,
	// scaled logarithms (FitOptions.MaxCollinear), +Inf for a constant
	// group, or of the log design matrix (FitOptions.MaxCond).
	Row, Group int
	Cond       float64
	// Groups lists, for ErrCollinear, the groups (1 for Π₁, …) that vary
	// together or the one that is constant.
	Groups []int

	// OpRepeating: the set given, the number of repeating variables
	// needed (the rank) and the base dimensions no member carries.
	Set       []string
	Want      int
	Uncovered []quantity.Base
	// Combination is the dimensionless product the repeating variables
	// form among themselves, when they are not independent ("ω·D/V").
	Combination string
	// Hint says what to do about it, when there is more to say.
	Hint string

	Err error // the cause, an error of another package
}

// Error implements the error interface.
func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("pigroups:")
	switch e.Op {
	case OpEvaluate:
		sb.WriteString(" evaluate")
		if e.Symbol != "" {
			fmt.Fprintf(&sb, " %q", e.Symbol)
		}
		if e.Reason != "" {
			sb.WriteString(": " + e.Reason)
		}
	case OpFit:
		sb.WriteString(" fit")
		if e.Kind != nil {
			sb.WriteString(": " + e.Kind.Error())
		}
		if e.Row >= 0 {
			fmt.Fprintf(&sb, " at row %d", e.Row)
		}
		if e.Group >= 0 {
			fmt.Fprintf(&sb, " in group %d", e.Group)
		}
		if e.Reason != "" {
			sb.WriteString(": " + e.Reason)
		}
		if e.Hint != "" {
			sb.WriteString("; " + e.Hint)
		}
	case OpRepeating:
		fmt.Fprintf(&sb, " repeating set {%s}: %v", strings.Join(e.Set, ", "), e.Kind)
		switch {
		case e.Kind == ErrRepeatingCount:
			fmt.Fprintf(&sb, ": %d given, the rank of the dimensional matrix is %d, so %d are needed", len(e.Set), e.Want, e.Want)
		case e.Symbol != "" && e.Hint == "":
			fmt.Fprintf(&sb, ": %q", e.Symbol)
		}
		if len(e.Uncovered) > 0 && e.Hint == "" {
			names := make([]string, len(e.Uncovered))
			for i, b := range e.Uncovered {
				names[i] = b.String()
			}
			fmt.Fprintf(&sb, "; no repeating variable carries %s", strings.Join(names, ", "))
		}
		if e.Combination != "" {
			fmt.Fprintf(&sb, "; they form the dimensionless group %s among themselves", e.Combination)
		}
		if e.Hint != "" {
			sb.WriteString("; " + e.Hint)
		}
	default:
		if e.Kind != nil {
			sb.WriteString(" " + e.Kind.Error())
		}
		if e.Symbol != "" {
			fmt.Fprintf(&sb, " %q", e.Symbol)
		}
		if e.Reason != "" {
			sb.WriteString(": " + e.Reason)
		}
		if e.Hint != "" {
			sb.WriteString("; " + e.Hint)
		}
	}
	if e.Err != nil {
		sb.WriteString(": " + strings.TrimPrefix(e.Err.Error(), "pigroups: "))
	}
	return sb.String()
}

// Unwrap returns the cause, an error of another package, or nil.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is the error's Kind or its one class.
func (e *Error) Is(target error) bool {
	return target != nil && (target == e.Kind || target == e.class())
}

// classes are the module's error classes.
// class returns the error's one class: the cause's, the Kind's or
// quantity.ErrInvalid.
func (e *Error) class() error {
	if c := quantity.ClassOf(e.Err); c != nil {
		return c
	}
	if c := classOf(e.Kind); c != nil {
		return c
	}
	return quantity.ErrInvalid
}
