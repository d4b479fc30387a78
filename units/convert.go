package units

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"similis.dev/similis/internal/numlex"
	"similis.dev/similis/quantity"
)

// Reasons a conversion is refused; an *Error of OpConvert has one as
// its Kind.
var (
	ErrIncompatible = errors.New("incompatible dimensions")
	ErrAngle        = errors.New("angle mismatch")
	ErrTemperature  = errors.New("temperature scale and difference mixed")
	// ErrRange is quantity.ErrRange, the module's class for numbers out of
	// range.
	ErrRange = quantity.ErrRange
)

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

func checkConvert(from, to Unit) error {
	if from.dim != to.dim {
		return &Error{Op: OpConvert, From: from, To: to, Kind: ErrIncompatible, Reason: "the dimensions differ"}
	}
	if from.angle != to.angle || from.solid != to.solid {
		e := &Error{Op: OpConvert, From: from, To: to, Kind: ErrAngle}
		if from.solid != to.solid {
			e.Reason = "one carries a solid angle (sr) and the other does not"
			e.Hint = "multiply or divide by sr explicitly if that is meant"
			return e
		}
		e.Reason = fmt.Sprintf("%s carries a plane angle to the power %d and %s to the power %d; a revolution is 2π rad, so converting would silently apply or drop 2π",
			from.Format(quantity.Unicode), from.angle, to.Format(quantity.Unicode), to.angle)
		switch {
		case from.angle > to.angle:
			e.Hint = fmt.Sprintf("write the target with its angle (rev/s or rad/s for a rotational speed), or divide the source by the angle unit, as in (%s)/rev, to count revolutions as cycles", from.Format(quantity.Unicode))
		default:
			e.Hint = fmt.Sprintf("write the source with its angle (rev/s for cycles per second), or divide the target by the angle unit, as in (%s)/rev", to.Format(quantity.Unicode))
		}
		return e
	}
	if from.temp == tempScale && to.temp == tempInterval || from.temp == tempInterval && to.temp == tempScale {
		return &Error{Op: OpConvert, From: from, To: to, Kind: ErrTemperature,
			Reason: "one is a temperature scale (a level) and the other a temperature difference",
			Hint:   "write both as differences (Δ°C, Δ°F, K) or both as levels (°C, °F, K)"}
	}
	return nil
}

// ConvertUnits converts v from unit from to unit to. A temperature level
// on a scale converts affinely (20 °C is 68 °F); everything else, a
// temperature difference included, scales by the ratio of factors.
//
// A value that is not finite, or a result that would overflow (1e308 km
// in m) or underflow to zero from a nonzero value, is an error wrapping
// ErrRange.
func ConvertUnits(v float64, from, to Unit) (float64, error) {
	if from.sp == nil {
		from = one
	}
	if to.sp == nil {
		to = one
	}
	if from.dim != to.dim || from.angle != to.angle || from.solid != to.solid || from.temp != to.temp && (from.temp == tempInterval || to.temp == tempInterval) {
		if err := checkConvert(from, to); err != nil {
			return 0, err
		}
	}
	if v-v != 0 { // NaN or ±Inf
		return 0, &Error{Class: quantity.ErrRange, Op: "convert", Value: v, Reason: fmt.Sprintf("the value %v is not finite", v)}
	}
	var x float64
	switch {
	case from.offset == 0 && to.offset == 0 && from.factor == to.factor:
		return v, nil
	case from.offset == 0 && to.offset == 0:
		x = v * (from.factor / to.factor)
		if x-x == 0 && (x != 0 || v == 0) {
			return x, nil
		}
		// The ratio of factors may overflow where the product does not.
		x = v * from.factor / to.factor
	default:
		x = (v*from.factor + from.offset - to.offset) / to.factor
	}
	if !finite(x) || x == 0 && v != 0 && from.offset == 0 && to.offset == 0 {
		return 0, &Error{Class: quantity.ErrRange, Op: "convert", Value: v, Reason: fmt.Sprintf("%g %s in %s is out of the range of a float64", v, from, to)}
	}
	return x, nil
}

// Convert converts the value v from the unit expression from to the unit
// expression to, with the built-in table: Convert(14.7, "psi", "kPa").
func Convert(v float64, from, to string) (float64, error) {
	fu, err := Parse(from)
	if err != nil {
		return 0, err
	}
	tu, err := Parse(to)
	if err != nil {
		return 0, err
	}
	return ConvertUnits(v, fu, tu)
}

// Value is a number and a unit: a quantity value as written on a data
// sheet ("12.5 kn"). Its text form is the number, a space and the unit's
// spelling; it implements encoding.TextMarshaler and TextUnmarshaler
// (and so JSON through text), flag.Value, and fmt.Formatter, so that
// fmt.Sprintf("%.4g", v) rounds the number for a reader and keeps the
// unit ("1.7 m/s").
type Value struct {
	Number float64
	Unit   Unit
}

// Quantity returns the value as a Quantity in SI.
func (v Value) Quantity() quantity.Quantity { return v.Unit.Of(v.Number) }

// In converts v to unit u.
func (v Value) In(u Unit) (Value, error) {
	x, err := ConvertUnits(v.Number, v.Unit, u)
	if err != nil {
		return Value{}, err
	}
	return Value{x, u}, nil
}

// String returns "12.5 kn" in Unicode spelling: the shortest decimal
// that reads back to the same float64, a space and the unit. ParseValue
// reads it back to the same number and unit.
func (v Value) String() string {
	return string(v.appendText(nil, 'g', -1, quantity.Unicode))
}

// appendText appends the number, formatted by strconv with verb and prec,
// a space and the unit in style to b; a dimensionless value is its number
// alone, and a unit that starts with a number is parenthesised.
func (v Value) appendText(b []byte, verb byte, prec int, style quantity.Style) []byte {
	b = strconv.AppendFloat(b, v.Number, verb, prec, 64)
	if v.Unit.String() == "1" {
		return b
	}
	u := v.Unit.Format(style)
	b = append(b, ' ')
	if c := u[0]; c >= '0' && c <= '9' || c == '.' {
		// A scaled unit, as in 3 (0.5·s): not a second number.
		b = append(b, '(')
		b = append(b, u...)
		return append(b, ')')
	}
	return append(b, u...)
}

// Format implements fmt.Formatter, as quantity.Quantity's Format does.
// The verbs %v, %s, %g, %G, %e, %E, %f and %F format the number as
// strconv does, honouring precision ("%.4g" writes four significant
// digits, "%.2f" two decimals), followed by a space and the unit, which
// no precision touches; %v and %s without precision equal String, and so
// read back through ParseValue to the same number and unit. %q writes the
// %v text as a Go string literal. Width pads the whole text, counted in
// runes, to the left unless the '-' flag is given; the '#' flag writes the
// unit in ASCII (as Unit.String does) and '+' forces a sign. Other verbs
// write "%!d(units.Value=12.5 kn)".
//
// Format rounds only the text: a Value keeps the number it was given.
func (v Value) Format(f fmt.State, verb rune) {
	var b byte
	switch verb {
	case 'v', 's', 'q':
		b = 'g'
	case 'g', 'G', 'e', 'E', 'f', 'F':
		b = byte(verb)
	default:
		fmt.Fprintf(f, "%%!%c(units.Value=%s)", verb, v.String())
		return
	}
	prec, ok := f.Precision()
	if !ok {
		prec = -1
		if b == 'f' || b == 'F' || b == 'e' || b == 'E' {
			prec = 6
		}
	}
	style := quantity.Unicode
	if f.Flag('#') {
		style = quantity.ASCII
	}
	var buf [64]byte
	s := buf[:0]
	if f.Flag('+') && !math.Signbit(v.Number) && !math.IsNaN(v.Number) {
		s = append(s, '+')
	}
	s = v.appendText(s, b, prec, style)
	if verb == 'q' {
		s = strconv.AppendQuote(nil, string(s))
	}
	if w, ok := f.Width(); ok {
		if n := w - utf8.RuneCount(s); n > 0 {
			if f.Flag('-') {
				s = append(s, strings.Repeat(" ", n)...)
			} else {
				s = append([]byte(strings.Repeat(" ", n)), s...)
			}
		}
	}
	_, _ = f.Write(s)
}

// AppendText appends v as String writes it to b: the shortest decimal
// that reads back to the same float64, a space and the unit's Unicode
// spelling. A value that is not finite is refused. It implements
// encoding.TextAppender.
func (v Value) AppendText(b []byte) ([]byte, error) {
	if math.IsNaN(v.Number) || math.IsInf(v.Number, 0) {
		return b, &Error{Op: OpFormat, Input: strconv.FormatFloat(v.Number, 'g', -1, 64), Reason: "a value that is not finite has no text form"}
	}
	return append(b, v.String()...), nil
}

// MarshalText encodes v as String writes it; ParseValue, and so
// UnmarshalText, reads it back to the same number and unit.
func (v Value) MarshalText() ([]byte, error) { return v.AppendText(nil) }

// UnmarshalText decodes text ParseValue reads.
func (v *Value) UnmarshalText(b []byte) error {
	x, err := ParseValue(string(b))
	if err != nil {
		return err
	}
	*v = x
	return nil
}

// Set parses s into v, for flag.Value: -speed 12kn.
func (v *Value) Set(s string) error { return v.UnmarshalText([]byte(s)) }

// ParseValue reads a number and a unit expression, with or without a
// space between them: "12.5 kn", "101.325 kPa", "20 °C", "3.2e-3 Pa·s",
// "12kn". A number alone is dimensionless.
func ParseValue(s string) (Value, error) { return parseValue(builtinTable{}, s, Parse) }

func parseValue(tab symbolTable, s string, parse func(string) (Unit, error)) (Value, error) {
	if len(s) > MaxExprLen+maxNumLen {
		return Value{}, &Error{Op: OpParseValue, Input: s[:64] + "…", Offset: 0, Reason: "text too long"}
	}
	t := strings.TrimSpace(s)
	lead := strings.Index(s, t)
	n, lexErr := numlex.Scan(t, numlex.Signed|numlex.Grouped)
	if lexErr != nil {
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead + lexErr.Offset, Reason: lexErr.Reason}
	}
	text, j := n.Text, n.End
	if j > maxNumLen {
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead, Reason: "number too long"}
	}
	x, class := numlex.Float(text)
	switch class {
	case numlex.Malformed, numlex.Overflow:
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead, Reason: fmt.Sprintf("%q is not a finite number", t[:j])}
	case numlex.Underflow:
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead, Reason: fmt.Sprintf("%q underflows to zero", t[:j])}
	}
	rest := strings.TrimSpace(t[j:])
	if rest == "" {
		return Value{Number: x, Unit: one}, nil
	}
	if c := rest[0]; (c >= '0' && c <= '9' || c == '.') && !reciprocal(rest) {
		// 101 325 Pa: a second number, not a unit.
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead + len(t) - len(rest), Reason: "a second number after a space: to group digits write a thin space (U+2009) between groups of three, as in 101\u2009325 Pa, or no space at all"}
	}
	if r, _ := utf8.DecodeRuneInString(rest); r == '/' || r == '*' || r == '^' {
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead + j, Reason: "a unit must follow the number (write 1/s, not /s)"}
	}
	if _, gauge := gaugeSuffix(rest); gauge {
		// 40 kPa(g), 12 psig: a gauge level is not an absolute pressure,
		// and "kPa (g)" is not kilopascal-gram.
		return Value{}, valueUnitError(s, lead+len(t)-len(rest), &Error{Op: OpParse, Input: rest, Kind: ErrGauge, Reason: gaugeHelp})
	}
	u, err := parse(rest)
	if err != nil {
		return Value{}, valueUnitError(s, lead+len(t)-len(rest), err)
	}
	if pureNumber(u) {
		return Value{}, &Error{Op: OpParseValue, Input: s, Offset: lead + len(t) - len(rest), Reason: fmt.Sprintf("the unit %q is a pure number: write the value as one number", rest)}
	}
	return Value{Number: x, Unit: u}, nil
}

// MustParseValue is like ParseValue but panics on error; for values
// written in code.
func MustParseValue(s string) Value {
	v, err := ParseValue(s)
	if err != nil {
		panic(err)
	}
	return v
}

// valueUnitError is the error of value text s whose unit, at byte at,
// does not parse: it carries the unit's error as its cause, and its Kind,
// Symbol and Suggest, with the Offset in s.
func valueUnitError(s string, at int, err error) *Error {
	e := &Error{Op: OpParseValue, Input: s, Offset: at, Err: err}
	var pe *Error
	if errors.As(err, &pe) {
		e.Kind, e.Symbol, e.Suggest = pe.Kind, pe.Symbol, pe.Suggest
		if pe.Op == OpParse {
			e.Offset += pe.Offset
		}
	}
	return e
}

// ParseQuantity reads a number and a unit, as ParseValue does, and returns
// the quantity in SI: "20 °C" is 293.15 K. A temperature difference
// ("20 Δ°C") comes back as 20 K, and a Quantity keeps no mark of being a
// difference: where a temperature level (or a difference) is asked, read
// the text into a Flag made by NewFlag, which checks the dimension and
// refuses the other kind of temperature, or check ParseValue's unit with
// Unit.IsInterval.
func ParseQuantity(s string) (quantity.Quantity, error) {
	v, err := ParseValue(s)
	if err != nil {
		return quantity.Quantity{}, err
	}
	return v.Quantity(), nil
}

// Flag is a flag.Value for a quantity with a required dimension, so a
// program can accept -speed 12kn and refuse -speed 12kg:
//
//	speed := units.NewFlag(quantity.Velocity, units.Value{Number: 10, Unit: units.MustParse("kn")})
//	flag.Var(speed, "speed", "towing speed")
//
// A Flag is checked however it is filled: Set (the flag package) and
// UnmarshalText (JSON, configuration files) alike. The zero Flag requires
// a dimensionless value; make one with NewFlag.
type Flag struct {
	Value
	dim  quantity.Dim
	diff bool // a temperature flag that takes differences
}

// NewFlag returns a Flag requiring dimension d, holding def. A
// temperature flag takes levels (°C, °F, K) unless def is a difference
// (Δ°C), when it takes differences (Δ°C, Δ°F, K); the other kind is
// refused. Kelvins, whose zero is absolute zero, serve both.
func NewFlag(d quantity.Dim, def Value) *Flag {
	return &Flag{Value: def, dim: d, diff: d == quantity.Temperature && def.Unit.IsInterval()}
}

// Set parses s and checks its dimension.
func (f *Flag) Set(s string) error {
	v, err := ParseValue(s)
	if err != nil {
		return err
	}
	if v.Unit.dim != f.dim {
		return &Error{Op: OpSetFlag, Input: s, Err: &quantity.Error{Op: "check", Name: s, Dims: [2]quantity.Dim{v.Unit.dim, f.dim}, Binary: true, Class: quantity.ErrDimension}}
	}
	if f.dim == quantity.Temperature && (!f.diff && v.Unit.IsInterval() || f.diff && v.Unit.IsScale()) {
		what, want := "a temperature difference", "a temperature level (°C, °F, K)"
		if f.diff {
			what, want = "a temperature level", "a temperature difference (Δ°C, Δ°F, K)"
		}
		return &Error{Op: OpConvert, From: v.Unit, To: f.Value.Unit, Kind: ErrTemperature, Reason: fmt.Sprintf("%q is %s", s, what), Hint: "the flag takes " + want}
	}
	f.Value = v
	return nil
}

// UnmarshalText parses text and checks it as Set does, so that a Flag
// filled from JSON, a configuration file or any other text is checked
// exactly as one set on the command line: {"flow": "1.2 m/s"} into a
// volume-flow Flag is refused, and so is "20 Δ°C" where a temperature
// level is asked. (Without it, the UnmarshalText of the embedded Value
// would fill the Flag unchecked.)
func (f *Flag) UnmarshalText(b []byte) error { return f.Set(string(b)) }

// Dim returns the dimension the flag requires.
func (f *Flag) Dim() quantity.Dim { return f.dim }

// reciprocal reports whether a unit expression starts with a number that
// divides ("1/s", "1 / min"), which is a unit, not a second number.
func reciprocal(s string) bool {
	i := 0
	for i < len(s) && (s[i] >= '0' && s[i] <= '9' || s[i] == '.') {
		i++
	}
	for i < len(s) && s[i] == ' ' {
		i++
	}
	return i < len(s) && s[i] == '/'
}

// pureNumber reports whether u is a number with no unit symbol (1000,
// 100/1), which a value's text could not tell from a second number.
func pureNumber(u Unit) bool {
	t := termsOf(u)
	for _, x := range t {
		if !x.number {
			return false
		}
	}
	return len(t) > 0
}
