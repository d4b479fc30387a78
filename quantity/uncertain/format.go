package uncertain

import (
	"math"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// derived names the SI coherent derived units the reports write by name
// (SI Brochure, 9th ed. (2019), Table 4), and the compound units of
// fluids and heat-transfer work written with them. Energy and torque
// share a dimension; N·m is right for both (1 J = 1 N·m), J would be
// wrong for a torque. Other dimensions are written in base units.
var derived = map[quantity.Dim]string{
	quantity.Force:                   "N",
	quantity.Pressure:                "Pa",
	quantity.Energy:                  "N·m",
	quantity.Power:                   "W",
	quantity.DynamicViscosity:        "Pa·s",
	quantity.SurfaceTension:          "N/m",
	quantity.SpecificWeight:          "N/m³",
	quantity.HeatFluxDensity:         "W/m²",
	quantity.ThermalConductivity:     "W/(m·K)",
	quantity.HeatTransferCoefficient: "W/(m²·K)",
	quantity.HeatCapacity:            "J/K",
	quantity.SpecificHeatCapacity:    "J/(kg·K)",
	quantity.Charge:                  "C",
	quantity.Voltage:                 "V",
	quantity.Resistance:              "Ω",
	quantity.Conductance:             "S",
	quantity.Capacitance:             "F",
	quantity.Inductance:              "H",
	quantity.MagneticFlux:            "Wb",
	quantity.MagneticFluxDensity:     "T",
}

// prefixable are the units a report may write with a decimal prefix on
// the first symbol (kN, MPa, mPa·s, kN·m, kW, mm).
var prefixable = map[string]bool{
	"N": true, "Pa": true, "Pa·s": true, "N·m": true, "W": true, "V": true,
	"Ω": true, "C": true, "m": true, "A": true,
}

// prefixes are the decimal prefixes used, by power of 1000 from 10⁻⁹.
var prefixes = [...]string{"n", "µ", "m", "", "k", "M", "G"}

// unitName writes a dimension in SI units for a report: a derived unit's
// name where one fits, else the base units as a fraction ("kg/m³",
// "m²/s"); "" when dimensionless.
func unitName(d quantity.Dim) string {
	if d == 0 {
		return ""
	}
	if s, ok := derived[d]; ok {
		return s
	}
	return baseFraction(d)
}

// baseFraction writes d in SI base units as a fraction, "kg/(m·s)".
func baseFraction(d quantity.Dim) string {
	if d == 0 {
		return ""
	}
	order := [...]quantity.Base{quantity.BaseM, quantity.BaseL, quantity.BaseT, quantity.BaseI,
		quantity.BaseTheta, quantity.BaseN, quantity.BaseJ}
	var buf [quantity.NumBases]quantity.Factor
	p := quantity.Product(buf[:0])
	for _, b := range order {
		if e := d.Exponent(b); !e.IsZero() {
			p = append(p, quantity.Factor{Name: b.Unit(), Exp: e})
		}
	}
	return p.Format(quantity.Unicode, quantity.Solidus, "·")
}

// displayUnit returns the unit a value of dimension d and size ref (in
// SI) is shown in, and that unit's size in SI: the unit's name, with a
// decimal prefix when ref is 10⁴ or more, or below 10⁻², and the unit
// takes one.
func displayUnit(d quantity.Dim, ref float64) (string, float64) {
	name := unitName(d)
	if !prefixable[name] || !(ref > 0) || !finite(ref) || (ref >= 1e-2 && ref < 1e4) {
		return name, 1
	}
	k := int(math.Floor(math.Log10(ref) / 3))
	k = max(min(k, 3), -3)
	return prefixes[k+3] + name, math.Pow(1000, float64(k))
}

// withUnit joins a number and its unit, the number alone when
// dimensionless.
func withUnit(num, unit string) string {
	if unit == "" {
		return num
	}
	return num + " " + unit
}

// Report numbers follow JCGM 100:2008 (GUM) §7.2.6: a standard
// uncertainty is stated to two significant digits and the estimate to
// the same decimal place. Numbers are written in fixed notation, or in
// powers of ten (1.7938×10⁻⁵, 1.7×10¹¹) when the larger of |y| and u, in
// the unit shown, is below sciBelow or at least sciFrom, or when u itself
// is below sciTiny (a fixed form would need more than seven decimals).
const (
	sciBelow = 1e-3
	sciFrom  = 1e6
	sciTiny  = 1e-6
)

// sciFor reports whether an uncertainty u beside numbers of magnitude up
// to ref is written in powers of ten.
func sciFor(ref, u float64) bool {
	return ref != 0 && finite(ref) && (ref < sciBelow || ref >= sciFrom) ||
		u != 0 && finite(u) && u < sciTiny
}

// roundPair writes an estimate y and its standard uncertainty u for a
// report (GUM §7.2.6), in the notation sciFor chooses for them. Where u
// exceeds |y|, rounding y to u's decimal place could leave no digit of
// it (1.228×10⁹ ± 1.71×10¹¹ would read 0 ± 1.7×10¹¹), so y then keeps
// two significant digits of its own: it is written as 0 only when it is
// 0. A zero or non-finite u leaves y in full and u as "0" (or as it is).
func roundPair(y, u float64) (string, string) {
	if u == 0 || !finite(u) || !finite(y) {
		return exactText(y), strconv.FormatFloat(u, 'g', -1, 64)
	}
	sci := sciFor(math.Max(math.Abs(y), u), u)
	us, p := uncText(u, sci)
	return estText(y, u, p, sci), us
}

// sideText writes an uncertainty x reported beside a value of magnitude
// ref (an expanded uncertainty, a part of u) to two significant digits,
// in the notation sciFor chooses for it there.
func sideText(ref, x float64) string {
	if x == 0 || !finite(x) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	s, _ := uncText(x, sciFor(math.Max(ref, x), x))
	return s
}

// exactText writes an exact y in full: its shortest decimal that reads
// back as y, in powers of ten beyond the fixed range.
func exactText(y float64) string {
	if !finite(y) {
		return strconv.FormatFloat(y, 'g', -1, 64)
	}
	if sciFor(math.Abs(y), 0) {
		return pow10Text(strconv.FormatFloat(y, 'e', -1, 64))
	}
	return strconv.FormatFloat(y, 'f', -1, 64)
}

// uncText writes u (> 0, finite) to two significant digits and returns
// the exponent p of its last digit: 0.0123 is "0.012" with p = −3,
// 0.0996 is "0.10" with p = −2, 1.71×10¹¹ is "1.7×10¹¹" with p = 10.
func uncText(u float64, sci bool) (string, int) {
	e := strconv.FormatFloat(u, 'e', 1, 64) // rounds exactly: 9.96e-02 → 1.0e-01
	x, _ := strconv.Atoi(e[strings.IndexByte(e, 'e')+1:])
	p := x - 1
	if sci {
		return pow10Text(e), p
	}
	return fixedAt(u, p), p
}

// estText writes an estimate y beside an uncertainty u whose last digit
// is at 10^p: to that place, or to two significant digits of its own when
// u exceeds |y| and that is finer.
func estText(y, u float64, p int, sci bool) string {
	if ay := math.Abs(y); ay > 0 && u > ay {
		// The exponent of y's leading digit, read off its shortest
		// decimal so that no logarithm's rounding can shift it.
		e := strconv.FormatFloat(ay, 'e', -1, 64)
		x, _ := strconv.Atoi(e[strings.IndexByte(e, 'e')+1:])
		p = min(p, x-1)
	}
	return roundedAt(y, p, sci)
}

// roundedAt writes x rounded to the decimal place 10^p, in powers of ten
// when sci is set.
func roundedAt(x float64, p int, sci bool) string {
	if !sci {
		return fixedAt(x, p)
	}
	if x == 0 {
		return "0"
	}
	e := strconv.FormatFloat(math.Abs(x), 'e', -1, 64)
	ex, _ := strconv.Atoi(e[strings.IndexByte(e, 'e')+1:])
	if ex < p {
		// x lies below the place kept: it rounds to 0 or to ±10^p.
		r := math.Round(x / math.Pow10(p))
		if r == 0 || !finite(r) {
			return "0"
		}
		x, ex = r*math.Pow10(p), p
	}
	s := strconv.FormatFloat(x, 'e', ex-p, 64)
	if y, _ := strconv.Atoi(s[strings.IndexByte(s, 'e')+1:]); y > ex {
		// Rounding carried into the next power (9.96×10⁻³ → 1.0×10⁻²):
		// one more decimal keeps the last digit at 10^p.
		s = strconv.FormatFloat(x, 'e', y-p, 64)
	}
	return noNegZero(pow10Text(s))
}

// fixedAt writes x rounded to the decimal place 10^p in fixed notation.
func fixedAt(x float64, p int) string {
	if p < 0 {
		return noNegZero(strconv.FormatFloat(x, 'f', -p, 64))
	}
	step := math.Pow10(p)
	return noNegZero(strconv.FormatFloat(math.Round(x/step)*step, 'f', 0, 64))
}

// pow10Text rewrites a number strconv wrote in e-notation ("1.7938e-05")
// in powers of ten ("1.7938×10⁻⁵"); a zero exponent leaves the mantissa
// alone, and a number without an exponent is returned as it is.
func pow10Text(s string) string {
	m, e, ok := strings.Cut(s, "e")
	if !ok {
		return s
	}
	x, err := strconv.Atoi(e)
	if err != nil || x == 0 {
		return m
	}
	var b strings.Builder
	b.WriteString(m)
	b.WriteString("×10")
	if x < 0 {
		b.WriteString("⁻")
		x = -x
	}
	for _, d := range strconv.Itoa(x) {
		b.WriteString(superDigits[d-'0'])
	}
	return b.String()
}

var superDigits = [10]string{"⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"}

// noNegZero drops the sign of a number that rounds to zero.
func noNegZero(s string) string {
	if strings.HasPrefix(s, "-") && strings.Trim(s[1:], "0.") == "" {
		return s[1:]
	}
	return s
}

// sig writes x to n significant digits, in fixed notation unless it is
// very large or very small, then in powers of ten.
func sig(x float64, n int) string { return sigFrom(x, n, -9) }

// sigIn writes x to n significant digits in powers of ten when sci is
// set, else as sig does.
func sigIn(x float64, n int, sci bool) string {
	if sci && x != 0 && finite(x) {
		return pow10Text(strconv.FormatFloat(x, 'e', n-1, 64))
	}
	return sig(x, n)
}

// sigFrom is sig with e-notation from 10^minExp down.
func sigFrom(x float64, n, minExp int) string {
	if x == 0 || !finite(x) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	e := int(math.Floor(math.Log10(math.Abs(x))))
	if e < minExp || e >= 9 {
		return pow10Text(strconv.FormatFloat(x, 'e', n-1, 64))
	}
	return strconv.FormatFloat(x, 'f', max(n-1-e, 0), 64)
}

// sensitivityUnit writes the unit of a sensitivity coefficient c = ∂y/∂x
// for a report that shows y in yUnit (of dimension yd, size yf in SI) and
// the source in SI units of dimension xd: "N/K", "kN/K", "m/Pa",
// "N/(kg/m³)"; c's own unit where that is one symbol ("m" for (N·m)/N,
// "N" for W/(m/s)); a base-unit fraction when neither side has a named
// unit ("1/s" for (m/s)/m); "" for a dimensionless coefficient.
func sensitivityUnit(yUnit string, yd quantity.Dim, yf float64, xd quantity.Dim) string {
	xUnit := unitName(xd)
	switch {
	case xd == 0:
		return yUnit
	case yd == xd && yf == 1:
		return ""
	case yUnit == "":
		if _, named := derived[xd]; named {
			if strings.ContainsAny(xUnit, "·/") {
				return "1/(" + xUnit + ")"
			}
			return "1/" + xUnit
		}
		inv, err := xd.Inv()
		if err != nil {
			return "1/(" + xUnit + ")"
		}
		return baseFraction(inv)
	}
	_, yNamed := derived[yd]
	_, xNamed := derived[xd]
	if yf == 1 {
		// c itself a named unit of one symbol, or one base unit: (N·m)/N
		// is m, W/(m/s) is N.
		if cd, err := yd.Div(xd); err == nil {
			if n, ok := derived[cd]; ok && !strings.ContainsAny(n, "·/") {
				return n
			}
			if n := baseFraction(cd); n != "" && !strings.ContainsAny(n, "·/⁻¹²³⁴⁵⁶⁷⁸⁹()^") {
				return n
			}
		}
	}
	if !yNamed && !xNamed && yf == 1 {
		if c, err := yd.Div(xd); err == nil {
			return baseFraction(c)
		}
	}
	if strings.ContainsAny(xUnit, "·/") {
		xUnit = "(" + xUnit + ")"
	}
	return yUnit + "/" + xUnit
}
