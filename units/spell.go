package units

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"

	"similis.dev/similis/quantity"
)

// powTo raises t to num/den, writing into dst, which may be a caller's
// stack buffer. It returns the first symbol term whose exponent would
// leave what Parse accepts (±MaxExpAbs, denominator at most MaxExpDen),
// with that exponent, and ok = false.
func (t terms) powTo(dst terms, num, den int) (_ terms, bad term, ok bool) {
	out := dst[:0]
	for _, x := range t {
		e, ok := scaleExp(x.Exp, num, den)
		if !ok && !x.number {
			x.Exp = e
			return nil, x, false
		}
		if x.Exp = e; !e.IsZero() {
			out = append(out, x)
		}
	}
	return foldNumbers(out), term{}, true
}

// mergeTerms is combineTerms reusing a's storage; a must not be used
// afterwards.
func mergeTerms(a, b terms, sign int) (terms, error) {
	for _, x := range b {
		if sign < 0 {
			x.Exp = x.Exp.Neg()
		}
		found := false
		for i := range a {
			if a[i].Name == x.Name && a[i].number == x.number {
				e, err := a[i].Exp.Add(x.Exp)
				if !x.number && (err != nil || expOutOfRange(e)) {
					return nil, fmt.Errorf("the exponent of %s would be %s, outside ±%d with denominator at most %d", x.Name, e, MaxExpAbs, MaxExpDen)
				}
				a[i].Exp = e
				found = true
				break
			}
		}
		if !found {
			a = append(a, x)
		}
	}
	return foldNumbers(slices.DeleteFunc(a, func(x term) bool { return x.Exp.IsZero() })), nil
}

// foldNumbers replaces the numeric factors of t by one literal, their
// product, placed first; a product of 1 is dropped.
func foldNumbers(t terms) terms {
	n, v := 0, 1.0
	for _, x := range t {
		if x.number {
			f, _ := strconv.ParseFloat(x.Name, 64)
			v *= math.Pow(f, x.Exp.Float())
			n++
		}
	}
	if n == 0 || n == 1 && t[0].number && t[0].Exp.IsOne() {
		return t
	}
	out := make(terms, 0, len(t)-n+1)
	if v != 1 {
		out = append(out, symTerm(strconv.FormatFloat(v, 'g', -1, 64), true))
	}
	for _, x := range t {
		if !x.number {
			out = append(out, x)
		}
	}
	return out
}

// termsOf returns a copy of u's terms.
func termsOf(u Unit) terms {
	return slices.Clone(u.terms())
}

// spell writes terms in a style: numerator factors, then '/' and the
// denominator, parenthesised when it has more than one factor, through
// the module's one product formatter.
func (t terms) spell(style quantity.Style) string {
	var buf [8]quantity.Factor
	p := quantity.Product(buf[:0])
	for _, x := range t {
		p = append(p, quantity.Factor{Name: spellSymbol(x, style), Exp: x.Exp})
	}
	return p.Format(style, quantity.Solidus, "")
}

// spellSymbol spells one symbol in a style, using the built-in table's
// spellings; symbols the table does not know (a user's own) are written
// as given.
func spellSymbol(x term, style quantity.Style) string {
	if x.number || style == quantity.ASCII {
		return x.Name
	}
	e, ok := lookupIn(builtinIndex, x.Name)
	if !ok {
		if style == quantity.LaTeX {
			return `\mathrm{` + x.Name + `}`
		}
		return x.Name
	}
	if style == quantity.LaTeX {
		return e.tex
	}
	return e.uni
}

// Format spells u in the given style. Parse reads back the Unicode and
// ASCII forms.
//
// A style other than the three defined is taken as Unicode.
func (u Unit) Format(style quantity.Style) string {
	u = u.norm()
	if style > quantity.Markdown {
		style = quantity.Unicode
	}
	if style == quantity.ASCII {
		return u.String()
	}
	if style == quantity.Unicode {
		return u.sp.unicode()
	}
	return u.terms().spell(style)
}

// unknown builds the error for an unknown symbol, with suggestions.
func (p *parser) unknown(at int, sym string) *Error {
	e := p.fail(at, ErrUnknownSymbol, strconv.Quote(sym))
	e.Symbol = sym
	// m2, s2: an exponent written without '^'.
	stem := strings.TrimRight(sym, "0123456789")
	if stem != sym && stem != "" {
		if _, ok := p.tab.lookup(stem); ok {
			e.Reason += fmt.Sprintf(": write the exponent with '^' or a superscript, as in %s^%s", stem, sym[len(stem):])
			e.Suggest = []string{stem + "^" + sym[len(stem):]}
			return e
		}
	}
	for _, pfx := range []string{"k", "m", "M", "G", "c", "u", "n"} {
		if rest, ok := strings.CutPrefix(sym, pfx); ok {
			if base, ok := p.tab.lookup(rest); ok && !base.prefixable {
				e.Reason += fmt.Sprintf(": %s takes no SI prefix", base.u)
				if base.u.dim == builtinIndex.bySym["kg"].u.dim && rest == "kg" {
					e.Reason += " (mass prefixes attach to g)"
				}
			}
		}
	}
	e.Suggest = nearest(sym, p.tab.spellings(), 3)
	return e
}

// nearest returns up to n spellings within edit distance 2 of s, closest
// first; a case-insensitive match counts as distance 0.
func nearest(s string, candidates []string, n int) []string {
	type cand struct {
		s string
		d int
	}
	var cs []cand
	ls := strings.ToLower(s)
	for _, c := range candidates {
		if utf8.RuneCountInString(c) > 12 {
			continue
		}
		var d int
		if strings.ToLower(c) == ls {
			d = 0
		} else {
			d = editDistance(s, c)
		}
		limit := 2
		if utf8.RuneCountInString(s) <= 2 {
			limit = 1
		}
		if d <= limit {
			cs = append(cs, cand{c, d})
		}
	}
	// Prefixed forms of the most used units, for typos like "kpa".
	for _, base := range []string{"Pa", "W", "J", "N", "m", "g", "L", "bar", "Hz"} {
		for _, pfx := range []string{"k", "M", "G", "m", "c", "u"} {
			c := pfx + base
			if strings.ToLower(c) == ls && c != s {
				cs = append(cs, cand{c, 0})
			}
		}
	}
	slices.SortFunc(cs, func(a, b cand) int {
		if a.d != b.d {
			return a.d - b.d
		}
		return strings.Compare(a.s, b.s)
	})
	var out []string
	for _, c := range cs {
		if !slices.Contains(out, c.s) {
			out = append(out, c.s)
		}
		if len(out) == n {
			break
		}
	}
	return out
}

func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > 32 || len(rb) > 32 {
		return 99
	}
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}

// holdable checks that every symbol of t, raised to its exponent, has a
// dimension a quantity.Dim can hold, as the parser requires of each
// factor it reads; symbols look cannot resolve are skipped.
func (t terms) holdable(look func(string) (*entry, bool)) error {
	for _, x := range t {
		if x.number || x.Exp.IsOne() || x.Exp.Neg().IsOne() {
			continue // a symbol's own dimension, or its inverse, is always held
		}
		e, ok := look(x.Name)
		if !ok {
			continue
		}
		num, den := int(x.Exp.Num()), int(x.Exp.Den()) // within ±MaxExpAbs, den ≤ MaxExpDen
		// A negative power is spelled as a denominator, 1/m^(64/3), which
		// is read as the positive power inverted: both must be held (a
		// dimension's exponents reach −128 sixths but only +127).
		if _, err := e.u.dim.Pow(max(num, -num), den); err != nil {
			return fmt.Errorf("%s to the power %s has a dimension out of range (exponents are whole sixths within ±21)", x.Name, x.Exp)
		}
		if den != 1 && (int(e.u.angle)*num%den != 0 || int(e.u.solid)*num%den != 0) {
			return fmt.Errorf("%s carries an angle, which cannot be raised to the power %s", x.Name, x.Exp)
		}
	}
	return nil
}

func builtinLookup(sym string) (*entry, bool) { return lookupIn(builtinIndex, sym) }
