package quantity

import (
	"fmt"
	"strconv"
	"strings"
	"unicode/utf8"
)

// String returns the value and its coherent SI unit: the special name
// where the dimension is exactly that of one without ambiguity — N for a
// force, Pa for a pressure or stress, W for a power ("138434.1 N",
// "101325 Pa") — and the SI base-unit form otherwise ("1.225 kg·m⁻³").
// A dimensionless quantity is its number alone. ParseQuantitySI, and so
// UnmarshalText, reads every form String writes back to the same bits.
// Other units, prefixes and the joule are the units package's job
// (units.Printer).
func (q Quantity) String() string {
	return q.text(q.d.unitText(false), 'g', -1)
}

// ASCII returns the value and its unit in ASCII, for logs and CSV:
// "1.225 kg m^-3", "101325 Pa".
func (q Quantity) ASCII() string {
	return q.text(q.d.unitText(true), 'g', -1)
}

// namedUnits are the SI coherent units with special names that a
// Quantity's text uses for exactly their dimension (SI Brochure, 9th ed.
// (2019), Table 4): the newton, the pascal and the watt. The joule is
// left out on purpose: energy shares its dimension with torque, whose
// unit is the newton metre and never the joule (SI Brochure, 9th ed.,
// Table 4, note on the unit of torque), so "12 J" could misname a torque.
var namedUnits = [...]struct {
	name string
	d    Dim
}{{"N", Force}, {"Pa", Pressure}, {"W", Power}}

// unitText returns the unit a Quantity of dimension d is written in: a
// special name from namedUnits, or the SI base-unit form.
func (d Dim) unitText(ascii bool) string {
	for _, n := range namedUnits {
		if n.d == d {
			return n.name
		}
	}
	if ascii {
		return d.SIUnitASCII()
	}
	return d.SIUnit()
}

// namedDim returns the dimension of a special unit name String writes.
func namedDim(s string) (Dim, bool) {
	for _, n := range namedUnits {
		if n.name == s {
			return n.d, true
		}
	}
	return 0, false
}

func (q Quantity) text(unit string, verb byte, prec int) string {
	s := strconv.FormatFloat(q.v, verb, prec, 64)
	if uint64(q.d) == 0 {
		return s
	}
	return s + " " + unit
}

// Format implements fmt.Formatter. The verbs %v, %s, %g, %G, %e, %E and %f
// format the number as strconv does, honouring precision (%.4g), followed
// by the unit String writes (N, Pa, W, or the SI base-unit form); width pads the whole text, to the left unless
// the '-' flag is given; the '#' flag selects the ASCII unit form and '+'
// forces a sign. %v and %s without precision equal String.
func (q Quantity) Format(f fmt.State, verb rune) {
	var b byte
	switch verb {
	case 'v', 's':
		b = 'g'
	case 'g', 'G', 'e', 'E', 'f', 'F':
		b = byte(verb)
	default:
		fmt.Fprintf(f, "%%!%c(quantity.Quantity=%s)", verb, q.String())
		return
	}
	prec, ok := f.Precision()
	if !ok {
		prec = -1
		if b == 'f' || b == 'F' || b == 'e' || b == 'E' {
			prec = 6
		}
	}
	unit := q.d.unitText(f.Flag('#'))
	s := q.text(unit, b, prec)
	if f.Flag('+') && q.v >= 0 {
		s = "+" + s
	}
	if w, ok := f.Width(); ok {
		if n := w - len([]rune(s)); n > 0 {
			pad := strings.Repeat(" ", n)
			if f.Flag('-') {
				s += pad
			} else {
				s = pad + s
			}
		}
	}
	_, _ = f.Write([]byte(s))
}

// maxDimText bounds the input ParseDim reads.
const maxDimText = 256

// ParseDim reads a dimension in either of the forms Dim prints: the ISO
// dimension form ("L⁻¹ M T⁻²", "L^-1 M T^-2", Θ also as "Th") or the SI
// base-unit form ("kg·m⁻¹·s⁻²", "kg m^-1 s^-2"). Factors are separated by
// spaces, '·' or '*'; exponents are Unicode superscripts or follow '^' as
// an integer or a parenthesised fraction ("m^(1/2)"). "1" and "" are the
// dimension one. Repeated factors multiply. It reports an *Error of class ErrParse.
func ParseDim(s string) (Dim, error) {
	if len(s) > maxDimText {
		return Dim(0), parseError(s, maxDimText, "text longer than 256 bytes")
	}
	t := strings.TrimSpace(s)
	if t == "" || t == "1" {
		return Dim(0), nil
	}
	var d Dim
	i := 0
	for i < len(s) {
		r, n := utf8.DecodeRuneInString(s[i:])
		if r == ' ' || r == '*' || r == '·' || r == '\t' {
			i += n
			continue
		}
		start := i
		for i < len(s) {
			r, n := utf8.DecodeRuneInString(s[i:])
			if !isSymbolRune(r) {
				break
			}
			i += n
		}
		if i == start {
			return Dim(0), parseError(s, i, fmt.Sprintf("unexpected %q", r))
		}
		sym := s[start:i]
		b, ok := lookupBase(sym)
		if !ok {
			return Dim(0), parseError(s, start, fmt.Sprintf("unknown base symbol %q (want one of L M T I Θ N J or m kg s A K mol cd)", sym))
		}
		num, den := 1, 1
		if i < len(s) {
			var err error
			var used int
			num, den, used, err = parseExponent(s, i)
			if err != nil {
				return Dim(0), err
			}
			i += used
		}
		e, err := DimOf(b, num, den)
		if err != nil {
			return Dim(0), parseError(s, start, err.(*Error).Reason)
		}
		if d, err = d.Mul(e); err != nil {
			return Dim(0), parseError(s, start, "exponent of "+b.String()+" overflows")
		}
	}
	return d, nil
}

// MustParseDim is like ParseDim but panics on error; it is meant for
// package-level declarations.
func MustParseDim(s string) Dim {
	d, err := ParseDim(s)
	if err != nil {
		panic(err)
	}
	return d
}

func isSymbolRune(r rune) bool {
	return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r == 'Θ'
}

func lookupBase(sym string) (Base, bool) {
	for b := Base(0); b < NumBases; b++ {
		if sym == baseSymbol[b] || sym == baseSymbolASCII[b] || sym == baseUnit[b] {
			return b, true
		}
	}
	return 0, false
}

var supValue = map[rune]int{'⁰': 0, '¹': 1, '²': 2, '³': 3, '⁴': 4, '⁵': 5, '⁶': 6, '⁷': 7, '⁸': 8, '⁹': 9}

// parseExponent reads an optional exponent at s[i:]: Unicode superscripts
// or '^' followed by an integer or "(n/d)". It returns 1/1 with used = 0 if
// there is none.
func parseExponent(s string, i int) (num, den, used int, err error) {
	start := i
	r, n := utf8.DecodeRuneInString(s[i:])
	if _, ok := supValue[r]; ok || r == '⁻' {
		neg := false
		if r == '⁻' {
			neg = true
			i += n
		}
		v, digits := 0, 0
		for i < len(s) {
			r, n := utf8.DecodeRuneInString(s[i:])
			dv, ok := supValue[r]
			if !ok {
				break
			}
			if digits >= 3 {
				return 0, 0, 0, parseError(s, i, "exponent too long")
			}
			v = v*10 + dv
			digits++
			i += n
		}
		if digits == 0 {
			return 0, 0, 0, parseError(s, i, "superscript minus without digits")
		}
		if neg {
			v = -v
		}
		return v, 1, i - start, nil
	}
	if r != '^' {
		return 1, 1, 0, nil
	}
	i++
	paren := i < len(s) && s[i] == '('
	if paren {
		i++
	}
	num, i, err = parseInt(s, i)
	if err != nil {
		return 0, 0, 0, err
	}
	den = 1
	if paren {
		if i < len(s) && s[i] == '/' {
			den, i, err = parseInt(s, i+1)
			if err != nil {
				return 0, 0, 0, err
			}
			if den <= 0 {
				return 0, 0, 0, parseError(s, i, "exponent denominator must be positive")
			}
		}
		if i >= len(s) || s[i] != ')' {
			return 0, 0, 0, parseError(s, i, "missing ')' after exponent")
		}
		i++
	}
	return num, den, i - start, nil
}

func parseInt(s string, i int) (int, int, error) {
	start := i
	neg := false
	if i < len(s) && (s[i] == '-' || s[i] == '+') {
		neg = s[i] == '-'
		i++
	}
	v, digits := 0, 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		if digits >= 3 {
			return 0, i, parseError(s, i, "exponent too long")
		}
		v = v*10 + int(s[i]-'0')
		digits++
		i++
	}
	if digits == 0 {
		return 0, start, parseError(s, start, "expected an integer exponent")
	}
	if neg {
		v = -v
	}
	return v, i, nil
}
