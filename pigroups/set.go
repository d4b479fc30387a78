package pigroups

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
)

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

// Set is a Buckingham Pi set: n − r dimensionless groups built from a
// repeating set of r variables, one group per non-repeating variable.
type Set struct {
	prob      *Problem
	repeating []int
	groups    []Group
	// repBuf backs repeating for the set PiSet builds, in the set's own
	// allocation (a repeating set has at most NumBases members).
	repBuf [quantity.NumBases]int
}

// PiSet builds the Pi set for a repeating set (validated as
// CheckRepeating does). Each non-repeating variable xⱼ gives the group
// xⱼ·∏ xᵢ^cᵢ over the repeating xᵢ, with A_R·c = −A_j solved exactly and
// scaled to coprime integers with xⱼ's exponent positive. The dependent
// variable's group comes first, then the others in variable order; each
// is checked to be dimensionless.
func (p *Problem) PiSet(repeating ...string) (*Set, error) {
	s := &Set{prob: p}
	// The members are checked here and their independence by the
	// elimination below, which solves the groups too; a set it finds
	// dependent goes through CheckRepeating's checks for their error.
	idx, err := p.repeatingMembers(s.repBuf[:0], repeating)
	if err != nil {
		return nil, err
	}
	s.repeating = idx
	if len(idx) == 0 {
		// Rank 0: every variable is dimensionless and is its own group.
		return p.trivialSet(s), nil
	}
	// The column order stays on the stack for problems of up to 32
	// variables; it is not kept.
	var colBuf [32]int
	var cols []int
	if len(p.vars) <= len(colBuf) {
		cols = colBuf[:len(idx)]
	} else {
		cols = make([]int, len(idx), len(p.vars))
	}
	copy(cols, idx)
	order := cols[len(idx):]
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
	var rows [quantity.NumBases][]int64
	var pivBuf [quantity.NumBases]int
	ic := p.intColumns(cols[:len(idx)+len(order)])
	nc := len(idx) + len(order)
	for i := range p.rows {
		rows[i] = ic[i][:nc:nc]
	}
	aug := exact.IntMatrix(rows[:len(p.rows)])
	pivots, err := aug.GaussJordan(pivBuf[:0])
	if err != nil || len(pivots) != len(idx) || pivots[len(pivots)-1] != len(idx)-1 {
		// The repeating columns are dependent (a pivot past them), or the
		// elimination overflowed: CheckRepeating's error says which.
		if _, cerr := p.repeatingIndex(repeating); cerr != nil {
			return nil, cerr
		}
		if err != nil {
			return nil, p.tooLarge(err)
		}
		return nil, &Error{Op: OpProblem, Kind: errInternal, Reason: fmt.Sprintf("repeating set %v is not independent", s.Repeating())}
	}
	n := len(p.vars)
	cells := make([]quantity.Rat, n*len(order))
	s.groups = make([]Group, 0, len(order))
	// The matches of all the groups share one block, allocated at the
	// first match with room for one per group left (most groups match
	// one named group or none), each group's a capped piece of it; a
	// group that does not fit starts a new block.
	var spare []Match
	var ar matchArena
	for k, j := range order {
		v := cells[k*n : (k+1)*n : (k+1)*n]
		if !coprimeGroup(v, j, idx, aug, len(idx)+k) {
			// The int64 path overflowed: the exact one says by how much.
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
		}
		// v solves A·v = 0 exactly by construction: the property tests
		// check every group's dimension, not this path.
		g := Group{Name: piName(k + 1), Var: j, exps: v, prob: p}
		if ms := p.recogniseIn(&ar, spare, len(order)-k, v); len(ms) > 0 {
			g.Matches = ms[:len(ms):len(ms)] // a group with no name keeps a nil list
			spare = ms[len(ms):]
		}
		s.groups = append(s.groups, g)
	}
	return s, nil
}

// coprimeGroup writes into v, which is zero on entry, the exponents of
// the group of variable j, as quantity.Coprime would scale them: x_j = 1
// and x_i = −aug[r][col]/aug[r][r] for the repeating variable i of pivot
// row r, times the least common denominator, divided by the gcd of the
// results. It works in int64, dividing only where a denominator or a
// gcd is not one (a 64-bit division costs tens of cycles, and most of
// them are one), and reports false on an overflow, leaving the caller to
// the exact path.
func coprimeGroup(v []quantity.Rat, j int, idx []int, aug exact.IntMatrix, col int) bool {
	var num, den [quantity.NumBases]int64
	l := int64(1)
	for r := range idx {
		n, d := -aug[r][col], aug[r][r]
		if n == math.MinInt64 || d == math.MinInt64 || aug[r][col] == math.MinInt64 {
			return false
		}
		if d < 0 {
			n, d = -n, -d
		}
		if d != 1 {
			if g := exact.GCD(n, d); g > 1 {
				n, d = n/g, d/g
			}
		}
		num[r], den[r] = n, d
		if d != 1 && d != l {
			var ok bool
			if l == 1 {
				l = d
			} else if l, ok = exact.Mul64(l, d/exact.GCD(l, d)); !ok {
				return false
			}
		}
	}
	g := l
	for r := range idx {
		if den[r] != l {
			w, ok := exact.Mul64(num[r], l/den[r])
			if !ok || w == math.MinInt64 {
				return false
			}
			num[r] = w
		}
		if g != 1 {
			g = exact.GCD(g, num[r])
		}
	}
	if g != 1 {
		l /= g
		for r := range idx {
			num[r] /= g
		}
	}
	v[j] = quantity.RatInt(l)
	for r, i := range idx {
		v[i] = quantity.RatInt(num[r])
	}
	return true
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
		for i := range p.rows {
			var sum int64
			for j, x := range v {
				sum += p.sixth(i, j) * x.Num()
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
			t, err := quantity.RatInt(p.sixth(i, j)).Mul(x)
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
func (s *Set) Format(style quantity.Style) string {
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
func (s *Set) String() string { return s.Format(quantity.Unicode) }

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
		return nil, false, &Error{Op: OpProblem, Kind: ErrUnknownVariable, Reason: fmt.Sprintf("%d exponents for the %d variables %s", len(target), len(s.prob.vars), s.prob.symbols())}
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
		return nil, &Error{Op: OpProblem, Kind: ErrUnknownVariable, Reason: fmt.Sprintf("rewrite group %d with %d powers of a %d-group set", k, len(powers), len(s.groups))}
	}
	if powers[k].IsZero() {
		return nil, &Error{Op: OpProblem, Kind: ErrRepeatingSingular, Symbol: s.groups[k].Name, Reason: "the power of the group itself must be nonzero, or the set would lose a group"}
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
