package units

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/internal/numlex"
	"similis.dev/similis/quantity"
)

// symbolTable resolves unit symbols.
type symbolTable interface {
	lookup(sym string) (*entry, bool)
	spellings() []string
}

type builtinTable struct{}

func (builtinTable) lookup(sym string) (*entry, bool) { return lookupIn(builtinIndex, sym) }
func (builtinTable) spellings() []string              { return builtinSpellings() }

var builtinSpellings = sync.OnceValue(func() []string {
	var out []string
	for s := range builtinIndex.bySym {
		out = append(out, s)
	}
	return out
})

// term is one factor of a unit's spelling: a symbol (with its prefix) or a
// numeric literal (Name), raised to an exact power (Exp), in the module's
// one product of powers.
type term struct {
	quantity.Factor
	number bool
}

// symTerm returns the term sym¹: a symbol, or a numeric literal.
func symTerm(sym string, number bool) term {
	return term{Factor: quantity.Factor{Name: sym, Exp: quantity.RatInt(1)}, number: number}
}

// expOutOfRange reports whether a symbol's exponent lies outside what
// Parse accepts: ±MaxExpAbs, denominator at most MaxExpDen.
func expOutOfRange(e quantity.Rat) bool {
	return e.Cmp(quantity.RatInt(MaxExpAbs)) > 0 || e.Cmp(quantity.RatInt(-MaxExpAbs)) < 0 || e.Den() > MaxExpDen
}

// scaleExp returns e·num/den, or ok = false if it leaves the range of
// expOutOfRange (or of a Rat).
func scaleExp(e quantity.Rat, num, den int) (quantity.Rat, bool) {
	r, err := quantity.NewRat(int64(num), int64(den))
	if err != nil {
		return quantity.Rat{}, false
	}
	if e, err = e.Mul(r); err != nil || expOutOfRange(e) {
		return e, false
	}
	return e, true
}

type terms []term

// val is a partly parsed expression.
type val struct {
	factor       float64
	dim          quantity.Dim
	angle, solid int
	lo, hi       int // this value's terms are p.terms[lo:hi]
}

type parser struct {
	s     string
	i     int
	depth int
	tab   symbolTable
	// terms holds the spelling terms of every factor read so far, in
	// order; each val owns a contiguous range of it, so products and
	// quotients join ranges and powers scale them, without allocating.
	terms terms
	// overflow is 1 + the offset of the first product or quotient whose
	// dimension left the range a Dim holds, or 0. Reading goes on (the
	// running dimension is then a placeholder), and the unit's dimension
	// is summed from its final terms: a spelling read left to right may
	// pass through more than a Dim holds and come back, as
	// W^(20/3)·Pa·s/(m^(20/3)·K^(20/3)) does in its time exponent.
	overflow int
}

func (p *parser) fail(at int, kind error, reason string) *Error {
	return &Error{Op: OpParse, Input: p.s, Offset: at, Kind: kind, Reason: reason}
}

// parserPool recycles parsers and their term storage.
var parserPool = sync.Pool{New: func() any { return &parser{terms: make(terms, 0, 16)} }}

func parseWith(tab symbolTable, expr string) (Unit, error) {
	if len(expr) > MaxExprLen {
		return Unit{}, &Error{Op: OpParse, Input: expr[:MaxExprLen] + "…", Offset: MaxExprLen, Kind: ErrTooLong, Reason: fmt.Sprintf("longer than %d bytes", MaxExprLen)}
	}
	if !utf8.ValidString(expr) {
		i := 0
		for i < len(expr) {
			r, n := utf8.DecodeRuneInString(expr[i:])
			if r == utf8.RuneError && n == 1 {
				break
			}
			i += n
		}
		return Unit{}, &Error{Op: OpParse, Input: expr, Offset: i, Kind: ErrSyntax, Reason: "invalid UTF-8"}
	}
	p := parserPool.Get().(*parser)
	defer parserPool.Put(p)
	*p = parser{s: expr, tab: tab, terms: p.terms[:0]}
	p.skipSpace()
	if p.i == len(p.s) {
		return Unit{}, p.fail(0, ErrEmpty, "no unit given (write 1 for a pure number)")
	}
	v, err := p.product()
	if err != nil {
		return Unit{}, err
	}
	p.skipSpace()
	if p.i < len(p.s) {
		if p.s[p.i] == ')' {
			return Unit{}, p.fail(p.i, ErrParen, "')' without a matching '('")
		}
		return Unit{}, p.fail(p.i, ErrSyntax, fmt.Sprintf("unexpected %q", p.peekRune()))
	}
	return p.unit(v)
}

func (p *parser) unit(v val) (Unit, error) {
	t, err := mergeTerms(p.terms[v.lo:v.lo], p.terms[v.lo:v.hi], 1)
	if p.overflow > 0 {
		d, ok := termsDim(t, p.tab.lookup)
		if err != nil || !ok {
			return Unit{}, p.fail(p.overflow-1, ErrExponent, "an exponent of the dimension overflows")
		}
		v.dim = d
	}
	if err == nil {
		err = t.holdable(p.tab.lookup)
	}
	if err != nil {
		e := p.fail(0, ErrExponent, "")
		e.Err = err
		return Unit{}, e
	}
	u := Unit{dim: v.dim, factor: v.factor, angle: int8(v.angle), solid: int8(v.solid)}
	u.setTerms(t)
	// The temperature role follows from the final spelling, so that a unit
	// and its spelling always agree: one symbol to the power one keeps its
	// role (a bare °C is a scale, a bare Δ°C an interval); anything else
	// is an interval.
	if len(t) == 1 && t[0].Exp.IsOne() && !t[0].number {
		if e, ok := p.tab.lookup(t[0].Name); ok {
			switch {
			case e.scaleSym:
				u.temp, u.offset = tempScale, e.u.offset
			case e.u.temp == tempInterval:
				u.temp = tempInterval
			}
		}
	}
	return u, nil
}

// termsDim sums the dimension of a unit from its merged terms, exactly:
// Σ exponent × the symbol's exponents, per base, in sixths. It reports
// false when a symbol is not in the table or the sum is not a dimension
// a Dim holds.
func termsDim(t terms, look func(string) (*entry, bool)) (quantity.Dim, bool) {
	var sum [quantity.NumBases]int64 // in sixths, times lcm(1…MaxExpDen) = 27720
	for _, x := range t {
		if x.number {
			continue
		}
		e, ok := look(x.Name)
		if !ok || 27720%x.Exp.Den() != 0 {
			return 0, false
		}
		scale := x.Exp.Num() * (27720 / x.Exp.Den())
		for b := range quantity.NumBases {
			sum[b] += int64(e.u.dim.Sixths(quantity.Base(b))) * scale
		}
	}
	d := quantity.Dimensionless
	for b := range quantity.NumBases {
		if sum[b]%27720 != 0 {
			return 0, false
		}
		db, err := quantity.DimOf(quantity.Base(b), int(sum[b]/27720), 6)
		if err != nil {
			return 0, false
		}
		if d, err = d.Mul(db); err != nil {
			return 0, false
		}
	}
	return d, true
}

func (p *parser) peekRune() rune {
	r, _ := utf8.DecodeRuneInString(p.s[p.i:])
	return r
}

func (p *parser) skipSpace() bool {
	start := p.i
	for p.i < len(p.s) && (p.s[p.i] == ' ' || p.s[p.i] == '\t') {
		p.i++
	}
	return p.i > start
}

// mulOp reports a product operator at p.i and its width.
func (p *parser) mulOp() int {
	if p.i >= len(p.s) {
		return 0
	}
	switch c := p.s[p.i]; {
	case c == '*':
		if p.i+1 < len(p.s) && p.s[p.i+1] == '*' {
			return 0
		}
		return 1
	case c < utf8.RuneSelf:
		return 0
	}
	rest := p.s[p.i:]
	for _, op := range [...]string{"·", "⋅", "×"} {
		if strings.HasPrefix(rest, op) {
			return len(op)
		}
	}
	return 0
}

func (p *parser) product() (val, error) {
	acc, err := p.factor()
	if err != nil {
		return val{}, err
	}
	divided := false
	for {
		spaced := p.skipSpace()
		if p.i >= len(p.s) || p.s[p.i] == ')' {
			return acc, nil
		}
		opAt := p.i
		var next val
		switch {
		case p.s[p.i] == '/':
			p.i++
			p.skipSpace()
			if p.i >= len(p.s) {
				return val{}, p.fail(opAt, ErrDangling, "'/' with nothing after it")
			}
			if next, err = p.factor(); err != nil {
				return val{}, err
			}
			if acc, err = combine(p, opAt, acc, next, -1); err != nil {
				return val{}, err
			}
			divided = true
			continue
		case p.mulOp() > 0:
			p.i += p.mulOp()
			p.skipSpace()
			if p.i >= len(p.s) || p.s[p.i] == ')' {
				return val{}, p.fail(opAt, ErrDangling, "product operator with nothing after it")
			}
		case spaced:
			// juxtaposition: a product, but not of a number after a unit,
			// which reads as a second number or a lost exponent.
			if c := p.s[p.i]; c >= '0' && c <= '9' || c == '.' {
				return val{}, p.fail(p.i, ErrAmbiguous, "a number after a unit and a space: write an exponent (m^3), a product with the number first (3·m), or a separate value")
			}
		default:
			return val{}, p.fail(p.i, ErrSyntax, fmt.Sprintf("unexpected %q (missing operator?)", p.peekRune()))
		}
		if divided {
			return val{}, p.fail(opAt, ErrAmbiguous, "a product after a division: write the denominator in parentheses, as in W/(m·K), or put the factor first, as in K·W/m")
		}
		if next, err = p.factor(); err != nil {
			return val{}, err
		}
		if acc, err = combine(p, opAt, acc, next, 1); err != nil {
			return val{}, err
		}
	}
}

func combine(p *parser, at int, a, b val, sign int) (val, error) {
	var d quantity.Dim
	var err error
	if sign > 0 {
		d, err = a.dim.Mul(b.dim)
	} else {
		d, err = a.dim.Div(b.dim)
	}
	if err != nil {
		if p.overflow == 0 {
			p.overflow = at + 1
		}
		d = 0
	}
	if sign < 0 {
		for i := b.lo; i < b.hi; i++ {
			p.terms[i].Exp = p.terms[i].Exp.Neg()
		}
	}
	f := a.factor * b.factor
	if sign < 0 {
		f = a.factor / b.factor
	}
	if f == 0 || math.IsInf(f, 0) || math.IsNaN(f) {
		return val{}, p.fail(at, ErrNumber, "the unit's factor overflows")
	}
	return val{factor: f, dim: d, angle: a.angle + sign*b.angle, solid: a.solid + sign*b.solid, lo: a.lo, hi: b.hi}, nil
}

func (p *parser) factor() (val, error) {
	start := p.i
	var v val
	var err error
	c := p.s[p.i]
	switch {
	case c == '(':
		if p.depth >= MaxDepth {
			return val{}, p.fail(p.i, ErrTooDeep, fmt.Sprintf("more than %d nested parentheses", MaxDepth))
		}
		p.depth++
		p.i++
		p.skipSpace()
		if p.i >= len(p.s) {
			return val{}, p.fail(start, ErrParen, "'(' is never closed")
		}
		if p.s[p.i] == ')' {
			return val{}, p.fail(p.i, ErrSyntax, "empty parentheses")
		}
		if v, err = p.product(); err != nil {
			return val{}, err
		}
		p.skipSpace()
		if p.i >= len(p.s) || p.s[p.i] != ')' {
			return val{}, p.fail(start, ErrParen, "'(' is never closed")
		}
		p.i++
		p.depth--
	case c >= '0' && c <= '9' || c == '.':
		if v, err = p.number(); err != nil {
			return val{}, err
		}
	case c == '/' || c == '*' || c == '^' || c == ')':
		if c == ')' {
			return val{}, p.fail(p.i, ErrParen, "')' without a matching '('")
		}
		return val{}, p.fail(p.i, ErrDangling, fmt.Sprintf("%q with nothing before it", c))
	default:
		if p.mulOp() > 0 {
			return val{}, p.fail(p.i, ErrDangling, "product operator with nothing before it")
		}
		if v, err = p.symbol(); err != nil {
			return val{}, err
		}
	}
	num, den, has, err := p.exponent()
	if err != nil {
		return val{}, err
	}
	if has {
		return p.raise(start, v, num, den)
	}
	return v, nil
}

func (p *parser) raise(at int, v val, num, den int) (val, error) {
	d, err := v.dim.Pow(num, den)
	if err != nil {
		return val{}, p.fail(at, ErrExponent, fmt.Sprintf("the dimension %s to the power %s cannot be held (exponents are whole sixths within ±21)", v.dim, ratText(num, den)))
	}
	if (v.angle*num)%den != 0 || (v.solid*num)%den != 0 {
		return val{}, p.fail(at, ErrExponent, "a fractional power of an angle unit")
	}
	var f float64
	switch {
	case den == 1 && num == 2:
		f = v.factor * v.factor
	case den == 1 && num == 3:
		f = v.factor * v.factor * v.factor
	case den == 1 && num == -1:
		f = 1 / v.factor
	case den == 1 && num == 1:
		f = v.factor
	default:
		f = math.Pow(v.factor, float64(num)/float64(den))
	}
	if f == 0 || math.IsInf(f, 0) || math.IsNaN(f) {
		return val{}, p.fail(at, ErrNumber, "the unit's factor overflows")
	}
	angle, solid := v.angle*num/den, v.solid*num/den
	if angle > MaxExpAbs || angle < -MaxExpAbs || solid > MaxExpAbs || solid < -MaxExpAbs {
		return val{}, p.fail(at, ErrExponent, "the exponent of an angle unit is out of range")
	}
	for i := v.lo; i < v.hi; i++ {
		e, ok := scaleExp(p.terms[i].Exp, num, den)
		if !ok && !p.terms[i].number {
			return val{}, p.fail(at, ErrExponent, fmt.Sprintf("the exponent of %s would be %s, outside ±%d with denominator at most %d", p.terms[i].Name, e, MaxExpAbs, MaxExpDen))
		}
		p.terms[i].Exp = e
	}
	out := val{factor: f, dim: d, angle: angle, solid: solid, lo: v.lo, hi: v.hi}
	return out, nil
}

func (p *parser) number() (val, error) {
	start := p.i
	n, _ := numlex.Scan(p.s[start:], 0) // never fails without Grouped
	j := start + n.End
	text := p.s[start:j]
	if len(text) > maxNumLen {
		return val{}, p.fail(start, ErrNumber, "numeric factor too long")
	}
	f, class := numlex.Float(text)
	if class != numlex.OK || f <= 0 {
		return val{}, p.fail(start, ErrNumber, fmt.Sprintf("%q is not a positive finite number", text))
	}
	p.i = j
	if j < len(p.s) && isSymbolStart(p.peekRune()) {
		return val{}, p.fail(j, ErrSyntax, "a number directly followed by a symbol: put a space or '·' between them")
	}
	v := val{factor: f, lo: len(p.terms), hi: len(p.terms)}
	if f != 1 {
		p.terms = append(p.terms, symTerm(strconv.FormatFloat(f, 'g', -1, 64), true))
		v.hi++
	}
	return v, nil
}

func isSymbolStart(r rune) bool {
	return unicode.IsLetter(r) || r == '°' || r == '%' || r == '′' || r == '″' || r == '℃' || r == '℉' || r == '\u2126'
}

func isSymbolRune(r rune) bool {
	return unicode.IsLetter(r) || unicode.IsDigit(r) || r == '_' || r == '°' || r == '₂'
}

func (p *parser) symbol() (val, error) {
	start := p.i
	r, n := utf8.DecodeRuneInString(p.s[p.i:])
	if !isSymbolStart(r) {
		return val{}, p.fail(p.i, ErrSyntax, fmt.Sprintf("unexpected %q", r))
	}
	p.i += n
	if r != '%' && r != '′' && r != '″' {
		for p.i < len(p.s) {
			if c := p.s[p.i]; c < utf8.RuneSelf {
				if c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_' {
					p.i++
					continue
				}
				break
			}
			r, n := utf8.DecodeRuneInString(p.s[p.i:])
			if !isSymbolRune(r) {
				break
			}
			p.i += n
		}
	}
	sym := p.s[start:p.i]
	if sym == "°" {
		k := p.i
		for k < len(p.s) && (p.s[k] == ' ' || p.s[k] == '\t') {
			k++
		}
		if k > p.i && k < len(p.s) && strings.ContainsRune("CFRK", rune(p.s[k])) {
			return val{}, p.fail(start, ErrAmbiguous, fmt.Sprintf("a degree sign, a space and %c: write °%c for the temperature, or deg·%c for an angle times the unit", p.s[k], p.s[k], p.s[k]))
		}
	}
	e, ok := p.tab.lookup(sym)
	if !ok {
		return val{}, p.unknown(start, sym)
	}
	if e.ambiguous != "" {
		return val{}, &Error{Op: OpParse, Input: p.s, Offset: start, Kind: ErrAmbiguous, Symbol: sym, Reason: fmt.Sprintf("%q reads as %s; define it in a Table to say which is meant", sym, e.ambiguous)}
	}
	p.terms = append(p.terms, symTerm(e.sym, false))
	v := val{
		factor: e.u.factor, dim: e.u.dim, angle: int(e.u.angle), solid: int(e.u.solid),
		lo: len(p.terms) - 1, hi: len(p.terms),
	}
	return v, nil
}

var superscripts = map[rune]int{'⁰': 0, '¹': 1, '²': 2, '³': 3, '⁴': 4, '⁵': 5, '⁶': 6, '⁷': 7, '⁸': 8, '⁹': 9}

// exponent reads an optional exponent.
func (p *parser) exponent() (num, den int, has bool, err error) {
	if p.i >= len(p.s) {
		return 1, 1, false, nil
	}
	start := p.i
	r, n := utf8.DecodeRuneInString(p.s[p.i:])
	if _, ok := superscripts[r]; ok || r == '⁻' || r == '⁺' {
		neg := r == '⁻'
		if r == '⁻' || r == '⁺' {
			p.i += n
		}
		v, digits := 0, 0
		for p.i < len(p.s) {
			r, n := utf8.DecodeRuneInString(p.s[p.i:])
			dv, ok := superscripts[r]
			if !ok {
				break
			}
			if digits >= 3 {
				return 0, 0, false, p.fail(start, ErrExponent, "exponent too long")
			}
			v, digits = v*10+dv, digits+1
			p.i += n
		}
		if digits == 0 {
			return 0, 0, false, p.fail(start, ErrExponent, "superscript sign without digits")
		}
		if neg {
			v = -v
		}
		return p.checkExp(start, v, 1)
	}
	switch {
	case strings.HasPrefix(p.s[p.i:], "**"):
		p.i += 2
	case p.s[p.i] == '^':
		p.i++
	default:
		return 1, 1, false, nil
	}
	if p.i >= len(p.s) {
		return 0, 0, false, p.fail(start, ErrDangling, "exponent operator with no exponent")
	}
	if p.s[p.i] == '(' {
		open := p.i
		p.i++
		num, den, err = p.rational()
		if err != nil {
			return 0, 0, false, err
		}
		if p.i < len(p.s) && p.s[p.i] == '/' {
			p.i++
			var d2, one int
			d2, one, err = p.rational()
			if err != nil {
				return 0, 0, false, err
			}
			if one != 1 || d2 <= 0 {
				return 0, 0, false, p.fail(open, ErrExponent, "the denominator of an exponent must be a positive integer")
			}
			den *= d2
		}
		if p.i >= len(p.s) || p.s[p.i] != ')' {
			return 0, 0, false, p.fail(open, ErrParen, "exponent '(' is never closed")
		}
		p.i++
		return p.checkExp(start, num, den)
	}
	num, den, err = p.rational()
	if err != nil {
		return 0, 0, false, err
	}
	return p.checkExp(start, num, den)
}

// rational reads a signed integer or decimal and returns it as num/den.
func (p *parser) rational() (num, den int, err error) {
	start := p.i
	neg := false
	if p.i < len(p.s) && (p.s[p.i] == '-' || p.s[p.i] == '+' || strings.HasPrefix(p.s[p.i:], "−")) {
		neg = p.s[p.i] != '+'
		if strings.HasPrefix(p.s[p.i:], "−") {
			p.i += len("−")
		} else {
			p.i++
		}
	}
	intPart, fracPart, digits := 0, 0, 0
	for p.i < len(p.s) && p.s[p.i] >= '0' && p.s[p.i] <= '9' {
		if digits >= 3 {
			return 0, 0, p.fail(start, ErrExponent, "exponent too long")
		}
		intPart, digits = intPart*10+int(p.s[p.i]-'0'), digits+1
		p.i++
	}
	den = 1
	if p.i < len(p.s) && p.s[p.i] == '.' {
		p.i++
		fd := 0
		for p.i < len(p.s) && p.s[p.i] >= '0' && p.s[p.i] <= '9' {
			if fd >= 4 {
				return 0, 0, p.fail(start, ErrExponent, "decimal exponent with more than 4 decimals: write a fraction such as ^(1/3)")
			}
			fracPart, fd, den = fracPart*10+int(p.s[p.i]-'0'), fd+1, den*10
			p.i++
		}
		if fd == 0 {
			return 0, 0, p.fail(start, ErrExponent, "a decimal point without decimals")
		}
		digits++
	}
	if digits == 0 {
		if p.i >= len(p.s) {
			return 0, 0, p.fail(start, ErrDangling, "exponent operator with no exponent")
		}
		return 0, 0, p.fail(start, ErrExponent, "expected a number as exponent")
	}
	num = intPart*den + fracPart
	if neg {
		num = -num
	}
	num, den = reduce(num, den)
	return num, den, nil
}

func (p *parser) checkExp(start, num, den int) (int, int, bool, error) {
	num, den = reduce(num, den)
	if den > MaxExpDen {
		return 0, 0, false, p.fail(start, ErrExponent, fmt.Sprintf("exponent %s is not a simple fraction (denominator above %d)", ratText(num, den), MaxExpDen))
	}
	if num > MaxExpAbs*den || num < -MaxExpAbs*den {
		return 0, 0, false, p.fail(start, ErrExponent, fmt.Sprintf("exponent %s is out of range (±%d)", ratText(num, den), MaxExpAbs))
	}
	if num == 0 {
		return 0, 0, false, p.fail(start, ErrExponent, "exponent zero (write 1 for a pure number)")
	}
	return num, den, true, nil
}

// reduce writes n/d in lowest terms with d > 0, by quantity.Rat.
func reduce(n, d int) (int, int) {
	if d == 0 {
		return n, d
	}
	r := quantity.MustRat(int64(n), int64(d))
	return int(r.Num()), int(r.Den())
}

// ratText writes n/d as quantity.Rat does: "3/2", "-1".
func ratText(n, d int) string {
	if d == 0 {
		return strconv.Itoa(n) + "/0"
	}
	return quantity.MustRat(int64(n), int64(d)).String()
}
