package pigroups

import (
	"fmt"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// Style selects how groups are written.
type Style uint8

// Rendering styles.
const (
	Plain   Style = iota // mu/(rho*V*D), V^2/(g*L)
	Unicode              // μ/(ρ·V·D), V²/(g·L)
	LaTeX                // \frac{\mu}{\rho V D}
)

// FormatProduct writes the product ∏ xᵢ^eᵢ of the problem's variables, the
// exponents given in variable order, as Group.Format does.
func (p *Problem) FormatProduct(exps []quantity.Rat, style Style) string {
	m := make(map[int]quantity.Rat)
	for i, e := range exps {
		if i < len(p.vars) && !e.IsZero() {
			m[i] = e
		}
	}
	return p.spell(m, style)
}

// spell writes ∏ xᵢ^eᵢ in a style, numerator first, in variable order.
func (p *Problem) spell(exps map[int]quantity.Rat, style Style) string {
	var num, den []int
	for i := range p.vars {
		e, ok := exps[i]
		if !ok || e.IsZero() {
			continue
		}
		if e.Sign() > 0 {
			num = append(num, i)
		} else {
			den = append(den, i)
		}
	}
	if style == LaTeX {
		n := p.latexList(num, exps, 1)
		if len(num) == 0 {
			n = "1"
		}
		if len(den) == 0 {
			return n
		}
		return `\frac{` + n + `}{` + p.latexList(den, exps, -1) + `}`
	}
	sep := "*"
	if style == Unicode {
		sep = "·"
	}
	list := func(idx []int, sign int64) string {
		parts := make([]string, len(idx))
		for k, i := range idx {
			e := exps[i]
			if sign < 0 {
				e = e.Neg()
			}
			parts[k] = p.vars[i].Symbol + expText(e, style)
		}
		return strings.Join(parts, sep)
	}
	s := list(num, 1)
	if len(num) == 0 {
		s = "1"
	}
	if len(den) > 0 {
		d := list(den, -1)
		if len(den) > 1 {
			d = "(" + d + ")"
		}
		s += "/" + d
	}
	return s
}

var supDigits = map[rune]string{'0': "⁰", '1': "¹", '2': "²", '3': "³", '4': "⁴", '5': "⁵", '6': "⁶", '7': "⁷", '8': "⁸", '9': "⁹", '-': "⁻"}

func expText(e quantity.Rat, style Style) string {
	if e.Num() == 1 && e.Den() == 1 {
		return ""
	}
	if style == Unicode && e.IsInt() {
		var sb strings.Builder
		for _, c := range strconv.FormatInt(e.Num(), 10) {
			sb.WriteString(supDigits[c])
		}
		return sb.String()
	}
	if e.IsInt() {
		return "^" + e.String()
	}
	return "^(" + e.String() + ")"
}

var greekTeX = map[rune]string{
	'α': `\alpha`, 'β': `\beta`, 'γ': `\gamma`, 'δ': `\delta`, 'ε': `\varepsilon`, 'ζ': `\zeta`, 'η': `\eta`,
	'θ': `\theta`, 'κ': `\kappa`, 'λ': `\lambda`, 'μ': `\mu`, 'ν': `\nu`, 'ξ': `\xi`, 'π': `\pi`, 'ρ': `\rho`,
	'σ': `\sigma`, 'τ': `\tau`, 'φ': `\phi`, 'χ': `\chi`, 'ψ': `\psi`, 'ω': `\omega`, 'Δ': `\Delta `,
	'Γ': `\Gamma`, 'Θ': `\Theta`, 'Λ': `\Lambda`, 'Π': `\Pi`, 'Σ': `\Sigma`, 'Φ': `\Phi`, 'Ψ': `\Psi`, 'Ω': `\Omega`,
}

// TeXSymbol writes a variable symbol for LaTeX: Greek letters as
// commands, a trailing part after '_' as a subscript, other multi-letter
// names upright.
func TeXSymbol(s string) string {
	base, sub, hasSub := strings.Cut(s, "_")
	var sb strings.Builder
	letters := 0
	for _, r := range base {
		if t, ok := greekTeX[r]; ok {
			sb.WriteString(t)
		} else {
			sb.WriteRune(r)
			letters++
		}
	}
	out := sb.String()
	if letters > 1 && !strings.ContainsRune(out, '\\') {
		out = `\mathrm{` + out + `}`
	}
	if hasSub {
		out += `_{` + sub + `}`
	}
	return out
}

func (p *Problem) latexList(idx []int, exps map[int]quantity.Rat, sign int64) string {
	parts := make([]string, len(idx))
	for k, i := range idx {
		e := exps[i]
		if sign < 0 {
			e = e.Neg()
		}
		s := TeXSymbol(p.vars[i].Symbol)
		if !(e.Num() == 1 && e.Den() == 1) {
			s = "{" + s + "}^{" + e.String() + "}"
		}
		parts[k] = s
	}
	return strings.Join(parts, " ")
}

var subDigits = []string{"₀", "₁", "₂", "₃", "₄", "₅", "₆", "₇", "₈", "₉"}

func piName(k int) string {
	var sb strings.Builder
	sb.WriteString("Π")
	for _, c := range strconv.Itoa(k) {
		sb.WriteString(subDigits[c-'0'])
	}
	return sb.String()
}

// MatrixTable writes the dimensional matrix as a text table, one column
// per variable and one row per base dimension that appears, with the rank
// beneath.
func (p *Problem) MatrixTable() string {
	width := make([]int, len(p.vars))
	cells := make([][]string, len(p.rows))
	for j, v := range p.vars {
		width[j] = len([]rune(v.Symbol))
	}
	for i, b := range p.rows {
		cells[i] = make([]string, len(p.vars))
		for j, v := range p.vars {
			cells[i][j] = v.Dim.Exponent(b).String()
			width[j] = max(width[j], len(cells[i][j]))
		}
	}
	var sb strings.Builder
	pad := func(s string, w int) string {
		if n := w - len([]rune(s)); n > 0 {
			return strings.Repeat(" ", n) + s
		}
		return s
	}
	sb.WriteString("  ")
	for j, v := range p.vars {
		sb.WriteString("  " + pad(v.Symbol, width[j]))
	}
	sb.WriteByte('\n')
	for i, b := range p.rows {
		sb.WriteString(pad(b.String(), 2))
		for j := range p.vars {
			sb.WriteString("  " + pad(cells[i][j], width[j]))
		}
		sb.WriteByte('\n')
	}
	fmt.Fprintf(&sb, "rank %d, %d variables, %d groups\n", p.rank, len(p.vars), p.NumGroups())
	return sb.String()
}
