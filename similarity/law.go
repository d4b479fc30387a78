package similarity

import (
	"math"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// Law is a scale ratio written exactly as a product of rational powers of
// free ratios: λ_V = λ_L^(1/2), λ_P = λ_ρ·λ_L^(7/2). Terms is that
// product, each factor named by the symbol of its free ratio's variable
// ({{"L", 1/2}} for λ_L^(1/2)); no factor has a zero exponent, and the
// empty product is the ratio 1.
type Law struct {
	Terms quantity.Product
}

// IsOne reports whether the law is the ratio 1 whatever the free ratios.
func (l Law) IsOne() bool { return len(l.Terms) == 0 }

// Exponent returns the exponent of the free ratio λ_symbol in l.
func (l Law) Exponent(symbol string) quantity.Rat {
	for _, t := range l.Terms {
		if t.Name == symbol {
			return t.Exp
		}
	}
	return quantity.RatInt(0)
}

// Eval returns the law's value for the given free ratios; a missing one
// makes the value NaN. A ratio given as a free ratio comes back as given
// (λ_L = 0.125 is 0.125, not exp(log 0.125)); whole exponents are
// evaluated by multiplication, fractional ones by math.Pow, and the
// product falls back to logarithms only when an intermediate overflows.
// The result can still overflow or underflow for extreme ratios: callers
// that return it check it.
func (l Law) Eval(free map[string]float64) float64 {
	v := 1.0
	for _, t := range l.Terms {
		x, ok := free[t.Name]
		if !ok || !(x > 0) {
			return math.NaN()
		}
		switch {
		case t.Exp.IsInt():
			v *= exact.PowInt(x, int(t.Exp.Num()))
		default:
			v *= math.Pow(x, t.Exp.Float())
		}
	}
	if v == 0 || math.IsInf(v, 0) || math.IsNaN(v) {
		lv := 0.0
		for _, t := range l.Terms {
			lv += t.Exp.Float() * math.Log(free[t.Name])
		}
		return math.Exp(lv)
	}
	return v
}

// String writes the law with λ for ratios: "λ_L^(1/2)", "λ_ρ·λ_L³", "1".
func (l Law) String() string { return l.Format(quantity.Unicode) }

// Format writes the law in a style: λ_L^(1/2) in Unicode and Markdown,
// lambda_L^(1/2) in ASCII, \lambda_{L}^{1/2} in LaTeX.
func (l Law) Format(style quantity.Style) string {
	p := make(quantity.Product, len(l.Terms))
	for i, t := range l.Terms {
		var name string
		switch style {
		case quantity.ASCII:
			name = "lambda_" + t.Name
		case quantity.LaTeX:
			name = `\lambda_{` + pigroups.TeXSymbol(t.Name) + `}`
		default:
			name = "λ_" + t.Name
		}
		p[i] = quantity.Factor{Name: name, Exp: t.Exp}
	}
	return p.Format(style, quantity.Inline, "")
}

// lawOf builds a law from a coefficient vector over parameters.
func lawOf(coef []quantity.Rat, params []string) Law {
	var l Law
	for k, c := range coef {
		if !c.IsZero() {
			l.Terms = append(l.Terms, quantity.Factor{Name: params[k], Exp: c})
		}
	}
	return l
}

// combine returns Σ aᵢ·lawᵢ as coefficient vectors.
func combine(coefs [][]quantity.Rat, a []quantity.Rat, n int) ([]quantity.Rat, error) {
	out := make([]quantity.Rat, n)
	for k := range out {
		out[k] = quantity.RatInt(0)
	}
	for i, c := range coefs {
		if a[i].IsZero() {
			continue
		}
		for k := range c {
			t, err := a[i].Mul(c[k])
			if err != nil {
				return nil, err
			}
			if out[k], err = out[k].Add(t); err != nil {
				return nil, err
			}
		}
	}
	return out, nil
}
