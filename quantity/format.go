package quantity

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"
)

// String returns the value and its coherent SI unit. Twelve dimensions
// are written with a unit of special name or a compound of one — N, Pa,
// W, N·m, Pa·s, N/m, N/m³, W/m², W/(m·K), W/(m²·K), J/K and J/(kg·K),
// each for exactly its dimension ("138434.1 N", "101325 Pa",
// "0.0010016 Pa·s", "4186 J/(kg·K)") — and every other in the SI
// base-unit form ("1.225 kg·m⁻³"; "2 s⁻¹", since a dimension cannot tell
// a frequency in Hz from an angular velocity in rad/s). A dimensionless
// quantity is its number alone.
//
// The one dimension shared by named quantities whose units take
// different names is L² M T⁻², energy and torque: it is written N·m,
// which is the unit of a moment of force and, since 1 J = 1 N·m by the
// joule's definition, a correct spelling of an energy too, where J would
// misname a torque (SI Brochure, 8th ed. (2006), Table 3, "J = N m", and
// Table 4, "moment of force: newton metre, N m"). Print an energy in
// joules with units.Printer and its Prefer map.
//
// ParseQuantitySI, and so UnmarshalText, reads every form String writes
// back to the same bits and dimension. Other units and prefixes are the
// units package's job (units.Printer).
func (q Quantity) String() string {
	return q.text(q.d.unitText(false), 'g', -1)
}

// ASCII returns the value and its unit in ASCII, for logs and CSV:
// "1.225 kg m^-3", "101325 Pa", "0.0010016 Pa*s".
func (q Quantity) ASCII() string {
	return q.text(q.d.unitText(true), 'g', -1)
}

// namedUnits is the fixed set of units a Quantity's text names, each for
// exactly its dimension: the coherent derived units with special names of
// mechanics — the newton, the pascal, the watt — and the coherent
// compounds of them that the SI Brochure gives as examples for the
// quantities of fluids and heat-transfer work (SI Brochure, 8th ed.
// (2006), Tables 3 and 4: Pa s, N m, N/m, W/m², J/K, J/(kg K), W/(m K));
// W/(m²·K) for a heat transfer coefficient and N/m³ for a specific weight
// follow the same pattern (common practice). Nothing else is named: no
// hertz, becquerel, radian or steradian (a dimension cannot tell a
// frequency from an angular velocity), no katal, no electrical unit, and
// no J or T alone, which ParseDim reads as the ISO symbols of luminous
// intensity and time. Each Unicode spelling is the one units.Unit.Format
// writes and each ASCII spelling the one units.Unit.String writes, so the
// units package reads both back to the same dimension with factor one.
var namedUnits = [...]struct {
	name, ascii string
	d           Dim
}{
	{"N", "N", Force},
	{"Pa", "Pa", Pressure},
	{"W", "W", Power},
	{"N·m", "N*m", Torque}, // also energy and work: see String
	{"Pa·s", "Pa*s", DynamicViscosity},
	{"N/m", "N/m", SurfaceTension},
	{"N/m³", "N/m^3", SpecificWeight},
	{"W/m²", "W/m^2", HeatFluxDensity},
	{"W/(m·K)", "W/(m*K)", ThermalConductivity},
	{"W/(m²·K)", "W/(m^2*K)", HeatTransferCoefficient},
	{"J/K", "J/K", HeatCapacity},
	{"J/(kg·K)", "J/(kg*K)", SpecificHeatCapacity},
}

// unitText returns the unit a Quantity of dimension d is written in: a
// name from namedUnits, or the SI base-unit form.
func (d Dim) unitText(ascii bool) string {
	for _, n := range namedUnits {
		if n.d == d {
			if ascii {
				return n.ascii
			}
			return n.name
		}
	}
	if ascii {
		return d.SIUnitASCII()
	}
	return d.SIUnit()
}

// namedDim returns the dimension of a unit name String or ASCII writes.
func namedDim(s string) (Dim, bool) {
	for _, n := range namedUnits {
		if n.name == s || n.ascii == s {
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
// by the unit String writes (a name from its fixed set, or the SI
// base-unit form); width pads the whole text, counted in runes, to the
// left unless the '-' flag is given; the '#' flag selects the ASCII unit
// form and '+' forces a sign. %v and %s without precision equal String.
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
	if f.Flag('+') && !math.Signbit(q.v) && !math.IsNaN(q.v) { // -0 has its sign already
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
