package quantity

import (
	"strconv"
	"strings"

	"similis.dev/similis/internal/exact"
)

// Style selects how a product of powers — a dimension, a unit, a Pi
// group, a scale law — is written. It is the one style of the module:
// units, pigroups and similarity print through it.
type Style uint8

// Styles.
const (
	Unicode  Style = iota // kg·m⁻³, μ/(ρ·V·D), λ_L^(3/2)
	ASCII                 // kg*m^-3, mu/(rho*V*D), lambda_L^(3/2)
	LaTeX                 // \frac{\mu}{\rho\cdot V\cdot D}, m^{-3}
	Markdown              // as Unicode, with Markdown's * and _ escaped
)

// String names the style.
func (s Style) String() string {
	switch s {
	case Unicode:
		return "Unicode"
	case ASCII:
		return "ASCII"
	case LaTeX:
		return "LaTeX"
	case Markdown:
		return "Markdown"
	}
	return "Style(" + strconv.Itoa(int(s)) + ")"
}

// normal returns s, or Unicode for an undefined style.
func (s Style) normal() Style {
	if s > Markdown {
		return Unicode
	}
	return s
}

// Factor is one named factor of a product, raised to an exact power. The
// name is written as given: the caller spells it for the style.
type Factor struct {
	Name string
	Exp  Rat
}

// Product is a product of named factors raised to exact rational powers:
// the one representation behind the spelling of dimensions, units, Pi
// groups and scale laws. Factors with a zero exponent are left out when
// it is written.
type Product []Factor

// Layout says how a Product is laid out.
type Layout uint8

// Layouts.
const (
	// Inline writes every factor with its signed exponent: "L⁻¹ M T⁻²",
	// "λ_ρ·λ_L^(-3/2)".
	Inline Layout = iota
	// Fraction writes the factors with positive exponents over those with
	// negative ones: "μ/(ρ·V·D)"; in LaTeX, \frac{…}{…}.
	Fraction
	// Solidus is Fraction with a solidus in every style, LaTeX included:
	// "W/(m·K)", as the SI writes units in running text.
	Solidus
)

// Sep returns the product sign of a style: "·", "*", `\cdot `, "·".
func (s Style) Sep() string {
	switch s.normal() {
	case ASCII:
		return "*"
	case LaTeX:
		return `\cdot `
	}
	return "·"
}

// Format writes p in a style and layout, with sep between factors ("" for
// the style's product sign). The empty product is "1".
func (p Product) Format(style Style, layout Layout, sep string) string {
	var buf [64]byte // most spellings fit: one allocation, the string
	return string(p.AppendFormat(buf[:0], style, layout, sep))
}

// AppendFormat appends p as Format writes it.
func (p Product) AppendFormat(b []byte, style Style, layout Layout, sep string) []byte {
	style = style.normal()
	if sep == "" {
		sep = style.Sep()
	}
	if layout == Inline {
		n := 0
		for _, f := range p {
			if f.Exp.IsZero() {
				continue
			}
			if n > 0 {
				b = append(b, sep...)
			}
			b = appendName(b, f.Name, style)
			if !f.Exp.IsOne() {
				b = AppendExponent(b, f.Exp, style)
			}
			n++
		}
		if n == 0 {
			b = append(b, '1')
		}
		return b
	}
	nNum, nDen := 0, 0
	for _, f := range p {
		switch f.Exp.Sign() {
		case 1:
			nNum++
		case -1:
			nDen++
		}
	}
	frac := style == LaTeX && layout == Fraction && nDen > 0
	if frac {
		b = append(b, `\frac{`...)
	}
	b = p.appendSide(b, 1, nNum, style, sep)
	if nDen == 0 {
		return b
	}
	if frac {
		b = append(b, "}{"...)
		b = p.appendSide(b, -1, nDen, style, sep)
		return append(b, '}')
	}
	b = append(b, '/')
	if nDen > 1 {
		b = append(b, '(')
	}
	b = p.appendSide(b, -1, nDen, style, sep)
	if nDen > 1 {
		b = append(b, ')')
	}
	return b
}

// appendSide writes the factors whose exponent has the given sign, with
// the exponent's magnitude; "1" if there are none.
func (p Product) appendSide(b []byte, sign, n int, style Style, sep string) []byte {
	if n == 0 {
		return append(b, '1')
	}
	k := 0
	for _, f := range p {
		if f.Exp.Sign() != sign {
			continue
		}
		if k > 0 {
			b = append(b, sep...)
		}
		b = appendName(b, f.Name, style)
		e := f.Exp
		if sign < 0 {
			e = e.Neg()
		}
		if !e.IsOne() {
			b = AppendExponent(b, e, style)
		}
		k++
	}
	return b
}

var markdownEscaper = strings.NewReplacer("*", `\*`, "_", `\_`)

func appendName(b []byte, name string, style Style) []byte {
	if style == Markdown && strings.ContainsAny(name, "*_") {
		return append(b, markdownEscaper.Replace(name)...)
	}
	return append(b, name...)
}

var supDigits = [...]string{"⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"}

// AppendExponent appends the exponent e as a style writes it after a
// symbol: "²", "⁻¹" and "^(1/2)" in Unicode and Markdown, "^2", "^-1" and
// "^(1/2)" in ASCII, "^{2}" and "^{1/2}" in LaTeX.
func AppendExponent(b []byte, e Rat, style Style) []byte {
	switch style.normal() {
	case LaTeX:
		b = append(b, "^{"...)
		b = append(b, e.String()...)
		return append(b, '}')
	case ASCII:
		if e.IsInt() {
			b = append(b, '^')
			return strconv.AppendInt(b, e.Num(), 10)
		}
	default:
		if e.IsInt() {
			n := e.Num()
			if n < 0 {
				b = append(b, "⁻"...)
			}
			// The magnitude as unsigned, exact for every int64.
			for _, c := range strconv.FormatUint(exact.Uabs(n), 10) {
				b = append(b, supDigits[c-'0']...)
			}
			return b
		}
	}
	b = append(b, "^("...)
	b = append(b, e.String()...)
	return append(b, ')')
}
