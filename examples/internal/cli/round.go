package cli

import (
	"fmt"
	"math"
	"strconv"
)

// RoundToUncertainty formats a value v and its uncertainty u together as
// JCGM 100:2008 (GUM) §7.2.6 recommends: u rounded to two significant
// figures and v rounded to the same decimal place, so
// RoundToUncertainty(10128.4, 211.7, 4) is "10130", "210" and a u of
// 0.0996 rounds to "0.10" with v to two decimals. A value that rounds to
// zero prints without a minus sign. When u is zero, negative, NaN or
// ±Inf, or v is NaN or ±Inf, there is no place to round to: v is written
// with fallbackDigits significant digits (%g) and u with two.
func RoundToUncertainty(v, u float64, fallbackDigits int) (value, uncertainty string) {
	if !(u > 0) || math.IsInf(u, 0) || math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Sprintf("%.*g", fallbackDigits, v), fmt.Sprintf("%.2g", u)
	}
	e := int(math.Floor(math.Log10(u))) - 1 // the place of u's second figure
	p := math.Pow(10, float64(e))
	if math.Round(u/p) >= 100 { // 0.0996 rounds to 0.10: one place up
		e++
		p *= 10
	}
	vr, ur := math.Round(v/p)*p, math.Round(u/p)*p
	if vr == 0 {
		vr = 0 // no "-0"
	}
	dec := max(0, -e)
	return strconv.FormatFloat(vr, 'f', dec, 64), strconv.FormatFloat(ur, 'f', dec, 64)
}

// Superscript writes the integer n in superscript digits, a negative n
// with a superscript minus: Superscript(-3) is "⁻³".
func Superscript(n int) string {
	const digits = "⁰¹²³⁴⁵⁶⁷⁸⁹"
	d := []rune(digits)
	var out []rune
	for _, c := range strconv.Itoa(n) {
		if c == '-' {
			out = append(out, '⁻')
			continue
		}
		out = append(out, d[c-'0'])
	}
	return string(out)
}
