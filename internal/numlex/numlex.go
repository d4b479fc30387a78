// Package numlex is the one lexer of decimal numbers in text of the
// module: unit expressions ("1000 m"), values ("101 325 Pa" with thin
// spaces) and formulas ("9.80665 {m/s^2}", exact exponents "^1.5"). It
// finds where a number ends and reads it as a float64, telling a
// malformed number from one out of the range of a float64 (overflow to
// ±Inf, or underflow of a nonzero number to 0). It holds an algorithm
// only: its types never appear in an exported signature of the module.
package numlex

import (
	"math"
	"strconv"
	"unicode/utf8"
)

// Mode selects what a number may hold beyond digits and decimal points.
type Mode uint8

// Modes, combined with |.
const (
	// Signed allows one leading '+' or '-'.
	Signed Mode = 1 << iota
	// Grouped reads a value as written on a data sheet: at most one
	// decimal point, and digits that may be grouped in threes by a thin
	// space (U+2009) or a narrow no-break space (U+202F), as the SI
	// Brochure (9th ed., 2019, §5.4.4) writes them ("101 325"). Without it the
	// run of digits and points is taken whole ("1.2.3"), for the reader to
	// refuse.
	Grouped
	// NoExponent stops before an exponent ("e-3"); without it an 'e' or
	// 'E' followed by an optionally signed digit belongs to the number.
	NoExponent
)

// Number is a number found at the start of a text.
type Number struct {
	// Text is the number without its group separators, ready for
	// strconv.ParseFloat; it is the source text itself (no allocation)
	// unless separators were removed.
	Text string
	// End is the byte offset just after the number in the source.
	End int
}

// Error says why the text at the start is not a well-formed number.
type Error struct {
	Offset int    // byte offset of the fault
	Reason string // what is wrong
}

// Scan reads the number at the start of s in a mode. Without Grouped,
// Scan never fails: a number with no digit, or with several points, is
// returned for the reader (Float) to refuse. With Grouped it refuses text
// without a digit and misplaced group separators.
func Scan(s string, m Mode) (Number, *Error) {
	j := 0
	if m&Signed != 0 && j < len(s) && (s[j] == '+' || s[j] == '-') {
		j++
	}
	if m&Grouped == 0 {
		for j < len(s) && (s[j] >= '0' && s[j] <= '9' || s[j] == '.') {
			j++
		}
		j = exponent(s, j, m)
		return Number{Text: s[:j], End: j}, nil
	}
	var sb []byte    // the digits without separators, once one is seen
	group := 0       // digits in the current group
	grouped := false // a separator was seen in this part
	frac := false
	digits := 0
	for j < len(s) {
		c := s[j]
		switch {
		case c >= '0' && c <= '9':
			if sb != nil {
				sb = append(sb, c)
			}
			group++
			digits++
			j++
			continue
		case c == '.' && !frac:
			if grouped && group != 3 {
				return Number{}, &Error{j, errGroups}
			}
			if sb != nil {
				sb = append(sb, c)
			}
			frac, grouped, group = true, false, 0
			j++
			continue
		}
		r, n := utf8.DecodeRuneInString(s[j:])
		if r != '\u2009' && r != '\u202f' {
			break
		}
		k := j + n
		if group == 0 || k >= len(s) || s[k] < '0' || s[k] > '9' {
			return Number{}, &Error{j, "a thin space must stand between two digits"}
		}
		// Integer part: the first group has one to three digits, the
		// others three. Fraction: every group but the last has three.
		if frac || grouped {
			if group != 3 {
				return Number{}, &Error{j, errGroups}
			}
		} else if group > 3 {
			return Number{}, &Error{j, errGroups}
		}
		if sb == nil {
			sb = append(make([]byte, 0, len(s)), s[:j]...)
		}
		grouped, group = true, 0
		j = k
	}
	if grouped && !frac && group != 3 {
		return Number{}, &Error{j, errGroups}
	}
	if digits == 0 {
		return Number{}, &Error{0, "expected a number"}
	}
	e := exponent(s, j, m)
	if sb == nil {
		return Number{Text: s[:e], End: e}, nil
	}
	sb = append(sb, s[j:e]...)
	return Number{Text: string(sb), End: e}, nil
}

const errGroups = "digits grouped with a thin space must come in groups of three"

// exponent returns the end of an exponent part starting at s[j], or j if
// there is none (or the mode has none).
func exponent(s string, j int, m Mode) int {
	if m&NoExponent != 0 || j >= len(s) || s[j] != 'e' && s[j] != 'E' {
		return j
	}
	k := j + 1
	if k < len(s) && (s[k] == '+' || s[k] == '-') {
		k++
	}
	if k >= len(s) || s[k] < '0' || s[k] > '9' {
		return j
	}
	for k < len(s) && s[k] >= '0' && s[k] <= '9' {
		k++
	}
	return k
}

// Class says how Float found a number.
type Class uint8

// Classes of Float.
const (
	OK        Class = iota // a finite float64
	Malformed              // not a number strconv reads
	Overflow               // beyond the largest float64
	Underflow              // nonzero, but nearer zero than the least float64
)

// Float reads text Scan returned as a float64. A nonzero number that
// rounds to zero is Underflow, not 0.
func Float(text string) (float64, Class) {
	x, err := strconv.ParseFloat(text, 64)
	if err != nil {
		if ne, ok := err.(*strconv.NumError); ok && ne.Err == strconv.ErrRange {
			return 0, Overflow
		}
		return 0, Malformed
	}
	if math.IsInf(x, 0) || math.IsNaN(x) {
		return 0, Malformed // "Inf", "NaN": words, not numbers Scan finds
	}
	if x == 0 && nonzeroMantissa(text) {
		return 0, Underflow
	}
	return x, OK
}

// nonzeroMantissa reports whether the digits before any exponent hold a
// nonzero digit.
func nonzeroMantissa(text string) bool {
	for i := 0; i < len(text); i++ {
		switch c := text[i]; {
		case c == 'e' || c == 'E':
			return false
		case c >= '1' && c <= '9':
			return true
		}
	}
	return false
}
