package units

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// Reasons a unit expression is refused; a *ParseError wraps one of them,
// so errors.Is(err, ErrUnknownSymbol) and the like work.
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

// ParseError reports a unit expression that cannot be read: where, and
// why. Err is one of the Err… values above.
type ParseError struct {
	Input   string   // the expression given
	Offset  int      // byte offset of the problem
	Err     error    // the class of problem, for errors.Is
	Reason  string   // what exactly is wrong
	Symbol  string   // the offending symbol, if any
	Suggest []string // nearest known spellings, for an unknown symbol
}

// Error implements the error interface.
func (e *ParseError) Error() string {
	var sb strings.Builder
	fmt.Fprintf(&sb, "units: %q: at offset %d: %v", e.Input, e.Offset, e.Err)
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
	return sb.String()
}

// Unwrap returns the kind of problem (ErrSyntax, ErrUnknownSymbol, …).
func (e *ParseError) Unwrap() error { return e.Err }

// Is reports whether target is the error's class: quantity.ErrUnknown
// for an unknown symbol, quantity.ErrParse otherwise.
func (e *ParseError) Is(target error) bool {
	if e.Err == ErrUnknownSymbol {
		return target == quantity.ErrUnknown
	}
	return target == quantity.ErrParse
}
