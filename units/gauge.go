package units

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"

	"similis.dev/similis/internal/numlex"
	"similis.dev/similis/quantity"
)

// ErrGauge is matched by every error about a gauge pressure: one given
// where an absolute pressure is needed, or converted without a valid
// reference.
var ErrGauge = errors.New("gauge pressure needs a reference pressure")

const gaugeHelp = "a gauge level is relative to the ambient pressure: read it with ParseGauge and make it absolute with Gauge.Absolute and a barometer reading (or StandardReference, chosen explicitly)"

// Gauge is a gauge pressure: a level read relative to the ambient
// pressure, as a Bourdon gauge or a vented transducer gives it. It is
// deliberately not a Quantity, so it cannot reach a computation that needs
// an absolute pressure (a vapour pressure in a cavitation number, a gas
// density from p/(RT)); Absolute makes it one, given the reference. The
// difference of two gauge levels is an ordinary pressure difference.
//
// Its text form is the number, a space and the pressure unit followed by
// "(g)": "40 kPa(g)". ParseGauge also reads the data-sheet spellings psig
// and barg.
type Gauge struct {
	Number float64
	Unit   Unit // a pressure unit
}

// gaugeSuffix strips a gauge mark from a unit spelling: "kPa(g)",
// "kPa (g)", "psig", "barg".
func gaugeSuffix(u string) (string, bool) {
	u = strings.TrimSpace(u)
	switch {
	case u == "psig":
		return "psi", true
	case u == "barg":
		return "bar", true
	case u == "kPag":
		return "kPa", true
	case strings.HasSuffix(u, "(g)"):
		return strings.TrimSpace(strings.TrimSuffix(u, "(g)")), true
	}
	return u, false
}

// ParseGauge reads a gauge pressure: "40 kPa(g)", "12.5 psig", "0.8 barg",
// "25 inH2O(g)". The unit must be a pressure and must carry the gauge
// mark; a value without it is refused, since a bare pressure on a data
// sheet is taken to be absolute.
func ParseGauge(s string) (Gauge, error) {
	if len(s) > MaxExprLen+maxNumLen {
		return Gauge{}, &Error{Op: OpParseValue, Input: s[:64] + "…", Reason: "text too long"}
	}
	t := strings.TrimSpace(s)
	lead := len(s) - len(strings.TrimLeftFunc(s, unicode.IsSpace)) // offsets are into s, as Input is
	n, lexErr := numlex.Scan(t, numlex.Signed|numlex.Grouped)
	if lexErr != nil {
		return Gauge{}, &Error{Op: OpParseValue, Input: s, Offset: lead + lexErr.Offset, Reason: lexErr.Reason}
	}
	text, j := n.Text, n.End
	rest, ok := gaugeSuffix(t[j:])
	if !ok {
		return Gauge{}, &Error{Op: OpParseValue, Input: s, Offset: lead + j, Reason: "no gauge mark: write the unit followed by (g), as in 40 kPa(g), or psig or barg"}
	}
	v, err := ParseValue(text + " " + rest)
	if err != nil {
		return Gauge{}, err
	}
	if v.Unit.Dim() != quantity.Pressure {
		return Gauge{}, &Error{Op: OpParseValue, Input: s, Offset: lead + j, Reason: fmt.Sprintf("a gauge level must be a pressure, not %s", quantity.Describe(v.Unit.Dim()))}
	}
	return Gauge(v), nil
}

// MustParseGauge is like ParseGauge but panics on error; for values
// written in code.
func MustParseGauge(s string) Gauge {
	g, err := ParseGauge(s)
	if err != nil {
		panic(err)
	}
	return g
}

// String writes "40 kPa(g)".
func (g Gauge) String() string {
	return strconv.FormatFloat(g.Number, 'g', -1, 64) + " " + g.Unit.Format(quantity.Unicode) + "(g)"
}

// AppendText appends g as String writes it; a value that is not finite
// is refused.
func (g Gauge) AppendText(b []byte) ([]byte, error) {
	if math.IsNaN(g.Number) || math.IsInf(g.Number, 0) {
		return b, &Error{Op: OpFormat, Input: strconv.FormatFloat(g.Number, 'g', -1, 64), Reason: "a value that is not finite has no text form"}
	}
	return append(b, g.String()...), nil
}

// MarshalText encodes g as String writes it; UnmarshalText reads it back
// to the same number and unit.
func (g Gauge) MarshalText() ([]byte, error) { return g.AppendText(nil) }

// UnmarshalText decodes text ParseGauge reads.
func (g *Gauge) UnmarshalText(b []byte) error {
	x, err := ParseGauge(string(b))
	if err != nil {
		return err
	}
	*g = x
	return nil
}

// Relative returns the gauge level as a pressure difference from the
// ambient, in SI. It is a difference, not a pressure: use it where a
// pressure rise or drop is meant.
func (g Gauge) Relative() quantity.Quantity { return g.Unit.Of(g.Number) }

// Sub returns the pressure difference g − o between two gauge levels
// read against the same ambient; the reference cancels. Both units must
// be pressures.
func (g Gauge) Sub(o Gauge) (quantity.Quantity, error) {
	if err := g.check(); err != nil {
		return quantity.Quantity{}, err
	}
	if err := o.check(); err != nil {
		return quantity.Quantity{}, err
	}
	return quantity.New(g.Relative().Value()-o.Relative().Value(), quantity.Pressure), nil
}

func (g Gauge) check() error {
	if g.Unit.Dim() != quantity.Pressure {
		return &Error{Op: OpGauge, Kind: ErrGauge, Input: g.String(), Reason: fmt.Sprintf("the unit of a gauge level must be a pressure, not %s", quantity.Describe(g.Unit.Dim()))}
	}
	if math.IsNaN(g.Number) || math.IsInf(g.Number, 0) {
		return &Error{Op: OpGauge, Kind: ErrGauge, Input: g.String(), Reason: "the gauge level is not a finite number"}
	}
	return nil
}

// Absolute returns the absolute pressure g + reference. The reference is
// the ambient (barometric) pressure at the gauge, an absolute pressure;
// it must be a finite positive pressure, and the result must not be below
// vacuum.
func (g Gauge) Absolute(reference quantity.Quantity) (quantity.Quantity, error) {
	if err := g.check(); err != nil {
		return quantity.Quantity{}, err
	}
	r := reference.Value()
	if reference.Dim() != quantity.Pressure {
		return quantity.Quantity{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: g.String(), Reason: fmt.Sprintf("the reference must be an absolute pressure, not %s", quantity.Describe(reference.Dim()))}
	}
	if !(r > 0) || math.IsInf(r, 0) {
		return quantity.Quantity{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: g.String(), Reason: fmt.Sprintf("the reference %g Pa is not a finite positive absolute pressure", r)}
	}
	p := r + g.Relative().Value()
	if !(p >= 0) || math.IsInf(p, 0) {
		return quantity.Quantity{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: g.String(), Reason: fmt.Sprintf("with the reference %g Pa it is %g Pa absolute, below vacuum: check the sign and the reference", r, p)}
	}
	return quantity.New(p, quantity.Pressure), nil
}

// GaugeOf returns the gauge level of the absolute pressure p against the
// reference, in unit u: the reading a gauge vented to that ambient gives.
// p must be finite and not below vacuum, the reference finite and
// positive.
func GaugeOf(p, reference quantity.Quantity, u Unit) (Gauge, error) {
	if p.Dim() != quantity.Pressure || reference.Dim() != quantity.Pressure || u.Dim() != quantity.Pressure {
		return Gauge{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: fmt.Sprint(p), Reason: "the absolute pressure, the reference and the unit must all be pressures"}
	}
	if r := reference.Value(); !(r > 0) || math.IsInf(r, 0) {
		return Gauge{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: fmt.Sprint(p), Reason: fmt.Sprintf("the reference %g Pa is not a finite positive absolute pressure", r)}
	}
	if v := p.Value(); !(v >= 0) || math.IsInf(v, 0) {
		return Gauge{}, &Error{Op: OpGauge, Kind: ErrGauge, Input: fmt.Sprint(p), Reason: fmt.Sprintf("the absolute pressure %g Pa is not finite and at or above vacuum", v)}
	}
	x, err := u.ValueOf(quantity.New(p.Value()-reference.Value(), quantity.Pressure))
	if err != nil {
		return Gauge{}, err
	}
	return Gauge{Number: x, Unit: u}, nil
}

// StandardReference returns the standard atmosphere at sea level,
// 101 325 Pa (ISO 2533), for a gauge reading whose barometer reading was
// not logged. It is an explicit choice: the day's barometric pressure
// differs by up to a few per cent, and by more at altitude.
func StandardReference() quantity.Quantity { return quantity.New(101325, quantity.Pressure) }
