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

// roundPair writes an estimate y and its uncertainty u as GUM §7.2.6
// states them: u to two significant digits, y to the same decimal place.
// Fixed notation is used unless the numbers are very large or very
// small. A zero or non-finite u leaves y in full and u as "0" (or as it
// is).
func roundPair(y, u float64) (string, string) {
	if u == 0 || !finite(u) || !finite(y) {
		us := strconv.FormatFloat(u, 'g', -1, 64)
		return strconv.FormatFloat(y, 'g', -1, 64), us
	}
	e := int(math.Floor(math.Log10(u)))
	if math.Round(u/math.Pow(10, float64(e-1))) >= 100 {
		e++ // 0.0996 rounds to 0.10
	}
	dec := 1 - e
	ay := math.Abs(y)
	switch {
	case dec >= 0 && dec <= 12 && ay < 1e15:
		return noNegZero(strconv.FormatFloat(y, 'f', dec, 64)), strconv.FormatFloat(u, 'f', dec, 64)
	case dec < 0 && dec > -15 && ay < 1e15:
		step := math.Pow(10, float64(-dec))
		return noNegZero(strconv.FormatFloat(math.Round(y/step)*step, 'f', 0, 64)),
			strconv.FormatFloat(math.Round(u/step)*step, 'f', 0, 64)
	}
	ey := e
	if ay > 0 {
		ey = int(math.Floor(math.Log10(ay)))
	}
	return noNegZero(strconv.FormatFloat(y, 'e', max(ey-e+1, 0), 64)), strconv.FormatFloat(u, 'e', 1, 64)
}

// noNegZero drops the sign of a number that rounds to zero.
func noNegZero(s string) string {
	if strings.HasPrefix(s, "-") && strings.Trim(s[1:], "0.") == "" {
		return s[1:]
	}
	return s
}

// sig writes x to n significant digits, in fixed notation unless it is
// very large or very small.
func sig(x float64, n int) string { return sigFrom(x, n, -9) }

// sigFrom is sig with e-notation from 10^minExp down.
func sigFrom(x float64, n, minExp int) string {
	if x == 0 || !finite(x) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	e := int(math.Floor(math.Log10(math.Abs(x))))
	if e < minExp || e >= 9 {
		return strconv.FormatFloat(x, 'e', n-1, 64)
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
