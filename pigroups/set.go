package pigroups

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"similis.dev/similis/internal/exact"
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

// Group is one dimensionless group: a product of powers of the problem's
// variables with exact, coprime integer exponents.
type Group struct {
	// Name is Π₁, Π₂, … in the set's order.
	Name string
	// Var is the index of the variable the group was built for (the
	// non-repeating one), whose exponent is positive.
	Var  int
	exps []quantity.Rat
	// Matches lists the named groups this one is recognised as, best
	// first; empty when it has no name.
	Matches []Match
	prob    *Problem
	// coef·(2π)^twoPi is a numerical factor the group carries (a
	// coefficient's ½ or its rev/s conversion, see Coefficient); the zero
	// coef means 1, as for every group of a Pi set.
	coef  quantity.Rat
	twoPi int
}

// Factor returns the numerical factor the group carries in front of its
// product of powers: 1 for a Pi set's groups, 2 for a drag coefficient
// written as C_D = 2·F/(ρ·V²·A), 4π² for K_T with a rotational speed held
// in rad/s.
func (g Group) Factor() float64 {
	if g.coef.IsZero() {
		return 1
	}
	return g.coef.Float() * math.Pow(2*math.Pi, float64(g.twoPi))
}

func (g Group) factorText() string {
	if g.coef.IsZero() {
		return ""
	}
	return factorText(g.coef, g.twoPi)
}

// ErrNotExact is wrapped by the error of Coefficient for a group that is
// not a power of a named group up to a known factor.
var ErrNotExact = errors.New("not exactly a named group")

// Coefficient returns the named group the group is recognised as, in the
// trade's own definition, numerical factor and rotational-speed
// convention included, so that evaluating it gives the number a report
// labels with the symbol: for T/(ρ·ω²·D⁴) it returns K_T = 4π²·T/(ρ·ω²·D⁴)
// (n = ω/2π in rev/s), for F/(ρ·V²·A) C_D = 2·F/(ρ·V²·A), and for
// V²/(g·L) Fr = (V²/(g·L))^(1/2). Its Name is the named group's symbol.
// A group with no name, or one only proportional to its name (L² in
// place of a reference area), returns an error wrapping ErrNotExact that
// says why.
func (g Group) Coefficient() (Group, error) {
	if len(g.Matches) == 0 {
		return Group{}, fmt.Errorf("pigroups: %s = %s: %w: it has no name", g.Name, g, ErrNotExact)
	}
	m := g.Matches[0]
	if !m.Exact() {
		return Group{}, fmt.Errorf("pigroups: %s = %s: %w: it is %s", g.Name, g, ErrNotExact, m.describe(g.Name))
	}
	exps := make([]quantity.Rat, len(g.exps))
	for i, e := range g.exps {
		x, err := e.Div(m.Power)
		if err != nil {
			return Group{}, err
		}
		exps[i] = x
	}
	c := m.Coef
	if c.IsZero() {
		c = quantity.RatInt(1)
	}
	out := Group{Name: m.Symbol, Var: g.Var, exps: exps, prob: g.prob, coef: c, twoPi: m.TwoPiPower()}
	out.Matches = g.prob.recognise(exps)
	return out, nil
}

// WithCoefficients returns a copy of the set in which every group that is
// exactly a named group up to its factor is replaced by its Coefficient;
// the others are kept as they are.
func (s *Set) WithCoefficients() *Set {
	out := &Set{prob: s.prob, repeating: s.repeating, groups: slices.Clone(s.groups)}
	for k, g := range out.groups {
		if c, err := g.Coefficient(); err == nil {
			out.groups[k] = c
		}
	}
	return out
}

// Problem returns the problem whose variables the group's exponents
// refer to.
func (g Group) Problem() *Problem { return g.prob }

// Exponents returns the exponent of each variable, in variable order.
func (g Group) Exponents() []quantity.Rat { return slices.Clone(g.exps) }

// Exponent returns the exponent of the variable with the given symbol;
// a symbol that is not a variable of the group's problem (and any symbol
// for the zero Group) is an error wrapping ErrUnknownVariable.
func (g Group) Exponent(symbol string) (quantity.Rat, error) {
	if g.prob == nil {
		return quantity.RatInt(0), &ProblemError{Err: ErrUnknownVariable, Symbol: symbol, Reason: "the zero Group has no variables"}
	}
	i, err := g.prob.Index(symbol)
	if err != nil {
		return quantity.RatInt(0), err
	}
	return g.exps[i], nil
}

// Dim returns the group's dimension, computed from its variables; it is
// dimensionless for every group a Set holds. It reports an error if an
// intermediate power cannot be held by a quantity.Dim.
func (g Group) Dim() (quantity.Dim, error) {
	var d quantity.Dim
	for i, e := range g.exps {
		if e.IsZero() {
			continue
		}
		p, err := g.prob.vars[i].Dim.Pow(int(e.Num()), int(e.Den()))
		if err != nil {
			return quantity.Dim{}, err
		}
		if d, err = d.Mul(p); err != nil {
			return quantity.Dim{}, err
		}
	}
	return d, nil
}

// String writes the group in plain text: "mu/(rho*V*D)".
func (g Group) String() string { return g.Format(Plain) }

// Format writes the group in a style, its numerical factor first
// ("4π²·T/(ρ·n²·D⁴)"); the zero Group is "(no group)".
func (g Group) Format(style Style) string {
	if g.prob == nil {
		return "(no group)"
	}
	body := g.prob.FormatProduct(g.exps, style)
	k := g.factorText()
	if k == "" {
		return body
	}
	if style != Unicode {
		k = strings.NewReplacer("π", "pi", "²", "^2", "³", "^3").Replace(k)
	}
	sep := "*"
	if style == Unicode {
		sep = "·"
	}
	if style == LaTeX {
		sep = " "
		k = strings.ReplaceAll(k, "pi", `\pi`)
	}
	if strings.Contains(k, "/") {
		k = "(" + k + ")"
	}
	return k + sep + body
}

// Label returns what the group's value is, in terms of the named group
// it is recognised as: "Re", "1/Re", "Fr²", "C_D/2", "K_T/(4π²)", "∝C_D"
// (see Match.Label), the bare symbol for a Coefficient, or its Π name
// when it has no name.
func (g Group) Label() string {
	if len(g.Matches) == 0 {
		return g.Name
	}
	m := g.Matches[0]
	if !g.coef.IsZero() && m.Exact() && m.Power.Num() == 1 && m.Power.Den() == 1 && g.coef == m.Coef && g.twoPi == m.TwoPiPower() {
		return m.Symbol
	}
	return m.Label()
}

// Describe writes what the group is in terms of its best named match,
// naming the group in any equation ("∝C_D (proportional to the drag
// coefficient; …: C_D = 2·Π₁·L²/A)"), or "" when it has no name.
func (g Group) Describe() string {
	if len(g.Matches) == 0 {
		return ""
	}
	m := g.Matches[0]
	if l := g.Label(); !g.coef.IsZero() && l == m.Symbol {
		return l + " (" + m.Name + "; " + m.Definition + ")"
	}
	return m.describe(g.Name)
}

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

// Set is a Buckingham Pi set: n − r dimensionless groups built from a
// repeating set of r variables, one group per non-repeating variable.
type Set struct {
	prob      *Problem
	repeating []int
	groups    []Group
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

// PiSet builds the Pi set for a repeating set (validated as
// CheckRepeating does). Each non-repeating variable xⱼ gives the group
// xⱼ·∏ xᵢ^cᵢ over the repeating xᵢ, with A_R·c = −A_j solved exactly and
// scaled to coprime integers with xⱼ's exponent positive. The dependent
// variable's group comes first, then the others in variable order; each
// is checked to be dimensionless.
func (p *Problem) PiSet(repeating ...string) (*Set, error) {
	idx, err := p.repeatingIndex(repeating)
	if err != nil {
		return nil, err
	}
	if p.NumGroups() == 0 {
		return nil, &RepeatingError{Err: ErrNoGroups, Set: repeating, Want: p.rank}
	}
	s := &Set{prob: p, repeating: idx}
	if len(idx) == 0 {
		// Rank 0: every variable is dimensionless and is its own group.
		return p.trivialSet(s), nil
	}
	var order []int
	if p.dep >= 0 {
		order = append(order, p.dep)
	}
	for j := range p.vars {
		if j != p.dep && !slices.Contains(idx, j) {
			order = append(order, j)
		}
	}
	// One elimination solves every group: RREF of [A_R | A_others] is
	// [I | A_R⁻¹·A_others] on the independent rows, so the exponents of
	// the repeating variables in xⱼ's group are −(A_R⁻¹·A_j).
	aug := p.intColumns(append(slices.Clone(idx), order...))
	pivots, err := aug.GaussJordan()
	if err != nil {
		return nil, p.tooLarge(err)
	}
	if len(pivots) != len(idx) || pivots[len(pivots)-1] != len(idx)-1 {
		return nil, fmt.Errorf("pigroups: internal error: repeating set %v is not independent", s.Repeating())
	}
	n := len(p.vars)
	cells := make([]quantity.Rat, n*len(order))
	s.groups = make([]Group, 0, len(order))
	for k, j := range order {
		v := cells[k*n : (k+1)*n : (k+1)*n]
		for i := range v {
			v[i] = quantity.RatInt(0)
		}
		v[j] = quantity.RatInt(1)
		for r, i := range idx {
			v[i] = quantity.MustRat(-aug[r][len(idx)+k], aug[r][r])
		}
		if _, err := quantity.Coprime(v, v); err != nil {
			return nil, p.tooLarge(err)
		}
		iv := v
		g := Group{Name: piName(k + 1), Var: j, exps: iv, prob: p}
		if !p.dimensionless(iv) {
			return nil, fmt.Errorf("pigroups: internal error: group %s is not dimensionless", g)
		}
		g.Matches = p.recognise(iv)
		s.groups = append(s.groups, g)
	}
	return s, nil
}

// trivialSet fills s with one group per variable, for a problem of rank
// 0, the dependent variable's first.
func (p *Problem) trivialSet(s *Set) *Set {
	order := make([]int, 0, len(p.vars))
	if p.dep >= 0 {
		order = append(order, p.dep)
	}
	for j := range p.vars {
		if j != p.dep {
			order = append(order, j)
		}
	}
	for k, j := range order {
		v := make([]quantity.Rat, len(p.vars))
		for i := range v {
			v[i] = quantity.RatInt(0)
		}
		v[j] = quantity.RatInt(1)
		s.groups = append(s.groups, Group{Name: piName(k + 1), Var: j, exps: v, prob: p, Matches: p.recognise(v)})
	}
	return s
}

// DefaultSet is PiSet with the DefaultRepeating choice.
func (p *Problem) DefaultSet() (*Set, error) {
	r, err := p.DefaultRepeating()
	if err != nil {
		return nil, err
	}
	return p.PiSet(r...)
}

// dimensionless reports whether A·v = 0 exactly.
func (p *Problem) dimensionless(v []quantity.Rat) bool {
	small := true
	for _, x := range v {
		if !x.IsInt() || x.Num() > 1<<40 || x.Num() < -(1<<40) {
			small = false
			break
		}
	}
	if small {
		// Small integer exponents against the integer matrix (sixths): a
		// plain dot product, which cannot overflow (|aᵢⱼ| ≤ 128, at most
		// 64 terms of at most 2⁴⁰ each).
		for _, row := range p.ai {
			var sum int64
			for j, x := range v {
				sum += row[j] * x.Num()
			}
			if sum != 0 {
				return false
			}
		}
		return true
	}
	for i := range p.rows {
		sum := quantity.RatInt(0)
		for j, x := range v {
			t, err := p.a[i][j].Mul(x)
			if err != nil {
				return false
			}
			if sum, err = sum.Add(t); err != nil {
				return false
			}
		}
		if !sum.IsZero() {
			return false
		}
	}
	return true
}

// Problem returns the problem the set belongs to.
func (s *Set) Problem() *Problem { return s.prob }

// Groups returns the groups, the dependent variable's first.
func (s *Set) Groups() []Group { return slices.Clone(s.groups) }

// Repeating returns the symbols of the repeating set.
func (s *Set) Repeating() []string {
	out := make([]string, len(s.repeating))
	for k, i := range s.repeating {
		out[k] = s.prob.vars[i].Symbol
	}
	return out
}

// Len returns the number of groups.
func (s *Set) Len() int { return len(s.groups) }

// Format writes the set one group per line: "Π₁ = μ/(ρ·V·D)   1/Re".
func (s *Set) Format(style Style) string {
	var sb strings.Builder
	for _, g := range s.groups {
		fmt.Fprintf(&sb, "%s = %s", g.Name, g.Format(style))
		if d := g.Describe(); d != "" {
			fmt.Fprintf(&sb, "   %s", d)
		}
		sb.WriteByte('\n')
	}
	return sb.String()
}

// String writes the set in Unicode.
func (s *Set) String() string { return s.Format(Unicode) }

// MatrixTable writes the dimensional matrix as a text table, one column
// per variable and one row per base dimension that appears, with the rank
// beneath.
func (p *Problem) MatrixTable() string {
	width := make([]int, len(p.vars))
	cells := make([][]string, len(p.rows))
	for j, v := range p.vars {
		width[j] = len([]rune(v.Symbol))
	}
	for i := range p.rows {
		cells[i] = make([]string, len(p.vars))
		for j := range p.vars {
			cells[i][j] = quantity.MustRat(p.a[i][j].Num(), quantity.ExpDen).String()
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

// Equivalent reports whether two Pi sets span the same groups: each group
// of one is a product of powers of the other's. The sets may come from
// different problems with the same variables (symbols and dimensions) in
// any order; sets over different variables are not equivalent.
func Equivalent(a, b *Set) (bool, error) {
	bm := b.matrix()
	if a.prob != b.prob {
		if len(a.prob.vars) != len(b.prob.vars) {
			return false, nil
		}
		// Column k of a's order is b's variable perm[k].
		perm := make([]int, len(a.prob.vars))
		for k, v := range a.prob.vars {
			j := b.prob.index(v.Symbol)
			if j < 0 || b.prob.vars[j].Dim != v.Dim {
				return false, nil
			}
			perm[k] = j
		}
		for i, row := range bm {
			r := make([]quantity.Rat, len(row))
			for k, j := range perm {
				r[k] = row[j]
			}
			bm[i] = r
		}
	}
	ra, err := a.matrix().Rank()
	if err != nil {
		return false, a.prob.tooLarge(err)
	}
	rb, err := bm.Rank()
	if err != nil {
		return false, a.prob.tooLarge(err)
	}
	both := append(a.matrix(), bm...)
	rab, err := both.Rank()
	if err != nil {
		return false, a.prob.tooLarge(err)
	}
	return ra == rb && rab == ra, nil
}

func (s *Set) matrix() exact.Matrix[quantity.Rat] {
	m := make(exact.Matrix[quantity.Rat], len(s.groups))
	for i, g := range s.groups {
		m[i] = slices.Clone(g.exps)
	}
	return m
}

// Express returns the exponents pₖ with target = ∏ Πₖ^pₖ over the set's
// groups, exactly; ok is false if target is not a product of powers of
// them. target gives an exponent for each variable, in variable order.
func (s *Set) Express(target []quantity.Rat) (powers []quantity.Rat, ok bool, err error) {
	if len(target) != len(s.prob.vars) {
		return nil, false, &ProblemError{Err: ErrUnknownVariable, Reason: fmt.Sprintf("%d exponents for the %d variables %s", len(target), len(s.prob.vars), s.prob.symbols())}
	}
	powers, ok, err = exact.Solve(s.matrix().Transpose(), []quantity.Rat(target))
	return powers, ok, s.prob.tooLarge(err)
}

// Rewrite returns a new set in which group k is replaced by ∏ Πⱼ^pⱼ, the
// powers given over the current groups — for example, replacing Π₂ by
// Π₂·Π₁⁻¹ is Rewrite(1, {-1, 1, 0, …}). The power of group k itself must
// be nonzero, so the new set is still a basis; the result is scaled to
// coprime integers with a positive exponent for the group's variable.
func (s *Set) Rewrite(k int, powers []quantity.Rat) (*Set, error) {
	if k < 0 || k >= len(s.groups) || len(powers) != len(s.groups) {
		return nil, &ProblemError{Err: ErrUnknownVariable, Reason: fmt.Sprintf("rewrite group %d with %d powers of a %d-group set", k, len(powers), len(s.groups))}
	}
	if powers[k].IsZero() {
		return nil, &ProblemError{Err: ErrRepeatingSingular, Symbol: s.groups[k].Name, Reason: "the power of the group itself must be nonzero, or the set would lose a group"}
	}
	v := make([]quantity.Rat, len(s.prob.vars))
	for i := range v {
		v[i] = quantity.RatInt(0)
	}
	for j, p := range powers {
		for i := range v {
			t, err := p.Mul(s.groups[j].exps[i])
			if err != nil {
				return nil, s.prob.tooLarge(err)
			}
			if v[i], err = v[i].Add(t); err != nil {
				return nil, s.prob.tooLarge(err)
			}
		}
	}
	iv, _, err := integers(v)
	if err != nil {
		return nil, s.prob.tooLarge(err)
	}
	g := s.groups[k]
	if iv[g.Var].Sign() < 0 || iv[g.Var].IsZero() && firstNonzeroSign(iv) < 0 {
		for i := range iv {
			iv[i] = iv[i].Neg()
		}
	}
	out := &Set{prob: s.prob, repeating: s.repeating, groups: slices.Clone(s.groups)}
	out.groups[k] = Group{Name: g.Name, Var: g.Var, exps: iv, prob: s.prob, Matches: s.prob.recognise(iv)}
	return out, nil
}

func firstNonzeroSign(v []quantity.Rat) int {
	for _, x := range v {
		if s := x.Sign(); s != 0 {
			return s
		}
	}
	return 0
}

// Conventional returns the group in the orientation the trade writes its
// named group in: the named group itself when that has whole exponents
// (1/Re becomes Re), and otherwise the positive power with whole
// exponents (1/Fr² becomes Fr², since Fr itself has the exponent 1/2). A
// group with no name, or already in that form, is returned unchanged.
func (g Group) Conventional() Group {
	if len(g.Matches) == 0 {
		return g
	}
	m := g.Matches[0]
	if m.Power.Num() == 1 && m.Power.Den() == 1 {
		return g
	}
	conv := make([]quantity.Rat, len(g.exps))
	whole := true
	for i, e := range g.exps {
		x, err := e.Div(m.Power)
		if err != nil || !x.IsInt() {
			whole = false
			break
		}
		conv[i] = x
	}
	if !whole {
		if m.Power.Sign() > 0 {
			return g
		}
		for i, e := range g.exps {
			conv[i] = e.Neg()
		}
	}
	return Group{Name: g.Name, Var: g.Var, exps: conv, prob: g.prob, Matches: g.prob.recognise(conv)}
}

// WithConventional returns a copy of the set with every group in its
// conventional orientation (see Group.Conventional).
func (s *Set) WithConventional() *Set {
	out := &Set{prob: s.prob, repeating: s.repeating, groups: slices.Clone(s.groups)}
	for k, g := range out.groups {
		out.groups[k] = g.Conventional()
	}
	return out
}

// integers scales v to coprime integers (quantity.Coprime) into a new
// vector, with the factor used.
func integers(v []quantity.Rat) ([]quantity.Rat, quantity.Rat, error) {
	out := make([]quantity.Rat, len(v))
	f, err := quantity.Coprime(out, v)
	return out, f, err
}
