package pigroups

import (
	"fmt"
	"strconv"
	"strings"

	"similis.dev/similis/quantity"
)

// FormatProduct writes the product ∏ xᵢ^eᵢ of the problem's variables, the
// exponents given in variable order, as Group.Format does: numerator over
// denominator in variable order ("μ/(ρ·V·D)"), a \frac in quantity.LaTeX, with
// Greek symbols as quantity.LaTeX commands. Exponents beyond the variables are
// ignored.
func (p *Problem) FormatProduct(exps []quantity.Rat, style quantity.Style) string {
	return p.product(exps, style).Format(style, quantity.Fraction, "")
}

// product returns ∏ xᵢ^eᵢ of the problem's variables as a quantity.Product
// in variable order, zero exponents left out, each factor named by its
// variable's symbol as the style writes it (TeXSymbol for quantity.LaTeX).
// It is the one representation a group and a product of variables are
// spelled through.
func (p *Problem) product(exps []quantity.Rat, style quantity.Style) quantity.Product {
	n := 0
	for i, e := range exps {
		if i < len(p.vars) && !e.IsZero() {
			n++
		}
	}
	prod := make(quantity.Product, 0, n)
	for i, e := range exps {
		if i < len(p.vars) && !e.IsZero() {
			name := p.vars[i].Symbol
			if style == quantity.LaTeX {
				name = TeXSymbol(name)
			}
			prod = append(prod, quantity.Factor{Name: name, Exp: e})
		}
	}
	return prod
}

// powerText writes a name to an exact power as a one-factor
// quantity.Product: "Re", "1/Re", "Fr²", "1/Re²", "Re^(1/2)", and a
// negative fractional power inline, "Re^(-1/2)".
func powerText(name string, e quantity.Rat) string {
	layout := quantity.Fraction
	if !e.IsInt() {
		layout = quantity.Inline
	}
	return quantity.Product{{Name: name, Exp: e}}.Format(quantity.Unicode, layout, "")
}

var greekTeX = map[rune]string{
	'α': `\alpha`, 'β': `\beta`, 'γ': `\gamma`, 'δ': `\delta`, 'ε': `\varepsilon`, 'ζ': `\zeta`, 'η': `\eta`,
	'θ': `\theta`, 'κ': `\kappa`, 'λ': `\lambda`, 'μ': `\mu`, 'ν': `\nu`, 'ξ': `\xi`, 'π': `\pi`, 'ρ': `\rho`,
	'σ': `\sigma`, 'τ': `\tau`, 'φ': `\phi`, 'χ': `\chi`, 'ψ': `\psi`, 'ω': `\omega`, 'Δ': `\Delta `,
	'Γ': `\Gamma`, 'Θ': `\Theta`, 'Λ': `\Lambda`, 'Π': `\Pi`, 'Σ': `\Sigma`, 'Φ': `\Phi`, 'Ψ': `\Psi`, 'Ω': `\Omega`,
}

// TeXSymbol writes a variable symbol for quantity.LaTeX: Greek letters as
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

var subDigits = []string{"₀", "₁", "₂", "₃", "₄", "₅", "₆", "₇", "₈", "₉"}

// piNames holds the names of the groups of the largest problem, so that
// a Pi set names its groups without allocating.
var piNames = func() []string {
	names := make([]string, MaxVariables+1)
	for k := range names {
		names[k] = writePiName(k)
	}
	return names
}()

// piName returns "Πk": Π₁, Π₁₂.
func piName(k int) string {
	if k >= 0 && k < len(piNames) {
		return piNames[k]
	}
	return writePiName(k)
}

func writePiName(k int) string {
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
