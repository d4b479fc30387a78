package units

import (
	"math"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// derived lists the SI unit a quantity of a known dimension is printed
// in by default; where a spelling would give one dimension two units, the
// first listed wins.
var derived = func() map[quantity.Dim]Unit {
	m := make(map[quantity.Dim]Unit)
	for _, s := range []string{
		// The twelve quantity.Quantity.String names, in the same spelling.
		"N", "Pa", "W", "N*m", "Pa*s", "N/m", "N/m^3", "W/m^2", "W/(m*K)", "W/(m^2*K)", "J/K", "J/(kg*K)",
		// Beyond them: the electrical special names, the specific energy of
		// pump and turbine work (IEC 60193 writes E = gH in J/kg), and the
		// units of the constants.
		"C", "V", "F", "ohm", "S", "Wb", "T", "H",
		"J/kg", "J/(mol*K)", "W/(m^2*K^4)", "m^3/(kg*s^2)"} {
		u := MustParse(s)
		if _, ok := m[u.dim]; !ok {
			m[u.dim] = u
		}
	}
	return m
}()

// DerivedUnit returns the SI unit with a special name (or the coherent
// compound of them) in which a quantity of dimension d is printed by
// default: Pa for pressure, W for power, Pa·s for dynamic viscosity,
// W/(m·K) for thermal conductivity. For every dimension that
// quantity.Quantity.String names it gives that same unit — so energy and
// torque, which share a dimension, get N·m, right for both (1 J = 1 N·m),
// where J would misname a torque; Printer.Prefer prints an energy in J.
// Beyond those it names the electrical units (C, V, F, Ω, S, Wb, T, H),
// J/kg for specific energy, J/(mol·K), W/(m²·K⁴) and m³/(kg·s²). It never
// guesses an angle or a count: a frequency or an angular velocity (s⁻¹),
// an angular momentum and a molar flow have no derived unit, and it
// reports false for them as for the dimensions printed in base units
// (velocity, density).
func DerivedUnit(d quantity.Dim) (Unit, bool) {
	u, ok := derived[d]
	return u, ok
}

// BaseUnit returns the coherent SI unit of d written in base units
// (kg·m⁻³ for density).
func BaseUnit(d quantity.Dim) Unit {
	if d.IsDimensionless() {
		return one
	}
	u, err := Parse(d.SIUnitASCII())
	if err != nil {
		// Every Dim's base-unit spelling parses; reaching here is a bug.
		panic("units: base-unit spelling of " + d.String() + " does not parse: " + err.Error())
	}
	return u
}

// Printer formats quantities in units.
type Printer struct {
	// Style is the spelling of units: Unicode (the zero value), ASCII or
	// LaTeX.
	Style quantity.Style
	// Prefix chooses an SI prefix, with an exponent that is a multiple of
	// three, so that the number lies in [1, 1000): 101325 Pa prints as
	// 101.325 kPa. A unit whose leading symbol takes no prefix is left as
	// it is.
	Prefix bool
	// Precision is the number of significant digits; 0 means as many as
	// needed to read the value back exactly. The digits are all written,
	// trailing zeros included (21.90 m at 4), so that a column of values
	// of one precision lines up; the form is fixed, or e-notation where
	// the exponent is below −4 or at least Precision (1.200e+05 Pa at 4),
	// as %g chooses.
	Precision int
	// Prefer maps a dimension to the unit to print it in, overriding
	// DerivedUnit (for example J for an energy, which DerivedUnit prints
	// N·m, the unit it shares with a torque).
	Prefer map[quantity.Dim]Unit
}

// Format returns q in the unit Prefer or DerivedUnit chooses for its
// dimension, or in SI base units.
func (p Printer) Format(q quantity.Quantity) string {
	u, ok := p.Prefer[q.Dim()]
	if !ok {
		if u, ok = derived[q.Dim()]; !ok {
			u = BaseUnit(q.Dim())
		}
	}
	s, _ := p.FormatIn(q, u)
	return s
}

// FormatIn returns q expressed in unit u. It reports an *Error of OpConvert
// if the dimensions differ.
func (p Printer) FormatIn(q quantity.Quantity, u Unit) (string, error) {
	v, err := u.ValueOf(q)
	if err != nil {
		return "", err
	}
	if p.Prefix && u.offset == 0 {
		v, u = withPrefix(v, u)
	}
	num := strconv.FormatFloat(v, 'g', -1, 64)
	if p.Precision > 0 {
		num = significant(v, p.Precision)
	}
	if p.Style == quantity.LaTeX {
		if m, e, ok := strings.Cut(num, "e"); ok {
			exp, _ := strconv.Atoi(e)
			num = m + `\times 10^{` + strconv.Itoa(exp) + `}`
		}
	}
	if u.String() == "1" {
		return num, nil
	}
	sep := " "
	if p.Style == quantity.LaTeX {
		sep = `\,`
	}
	return num + sep + u.Format(p.Style), nil
}

// significant writes v to prec significant digits, keeping trailing
// zeros: %#g's digits, in %g's choice of fixed or e-notation (the choice
// made on the exponent after rounding, so 9.9996 at 4 is 10.00).
func significant(v float64, prec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'g', -1, 64)
	}
	e := strconv.FormatFloat(v, 'e', prec-1, 64)
	exp, _ := strconv.Atoi(e[strings.IndexByte(e, 'e')+1:])
	if exp < -4 || exp >= prec {
		return e
	}
	return strconv.FormatFloat(v, 'f', prec-1-exp, 64)
}

var engPrefixes = func() map[int]prefix {
	m := make(map[int]prefix)
	for _, p := range prefixes {
		e := int(math.Round(math.Log10(p.factor)))
		if e%3 == 0 {
			m[e] = p
		}
	}
	return m
}()

// withPrefix rewrites v in u with an engineering prefix on u's leading
// symbol, when that symbol takes one.
func withPrefix(v float64, u Unit) (float64, Unit) {
	t := termsOf(u)
	if len(t) == 0 || v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v, u
	}
	for _, x := range t {
		if x.Exp.Sign() < 0 {
			return v, u // no prefixes on a quotient: 0.6 W/(m·K), not 600 mW/(m·K)
		}
	}
	first := t[0]
	if !first.Exp.IsOne() || first.number {
		return v, u
	}
	base := first.Name
	scale := 1.0
	if base == "kg" {
		if len(t) > 1 {
			return v, u // no prefixes on kg inside a compound
		}
		base, scale = "g", 1000
	}
	e, ok := builtinIndex.bySym[base]
	if !ok || !e.prefixable || e.u.String() != base {
		return v, u
	}
	vv := v * scale
	exp := int(math.Floor(math.Log10(math.Abs(vv))/3)) * 3
	exp = max(-30, min(30, exp))
	sym := base
	if exp != 0 {
		sym = engPrefixes[exp].ascii + base
	}
	t[0].Name = sym
	nu := u
	nu.factor = applyPrefix(u.factor/scale, exp)
	nu.setTerms(t)
	// Scale by an exact power of ten, multiplying for small values so
	// that 2.5e-6 m prints as 2.5 µm rather than 2.5000000000000004 µm.
	if exp < 0 {
		return vv * math.Pow10(-exp), nu
	}
	return vv / math.Pow10(exp), nu
}
