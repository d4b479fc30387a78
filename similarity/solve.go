package similarity

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// Solution is a solved plan: every variable's ratio as an exact law of the
// free ratios, and its value where the free ratios are fixed.
type Solution struct {
	plan   *Plan
	params []string         // the free ratios, by variable symbol
	coef   [][]quantity.Rat // per variable: law coefficients over params
	values map[string]float64
	free   []string // free ratios with no value: the plan is underdetermined
	base   [][]quantity.Rat
	bases  []quantity.Base
	cache  *ratioCache // ratio values derived so far; replaced by With
}

// MaxRequirements bounds the requirements of a plan (held groups, fixed
// ratios, same-fluid and same-gravity requirements together).
const MaxRequirements = 256

// Solve solves the plan exactly. It returns a *PlanError of class ErrConflict, with its Conflict, if the
// requirements cannot all hold, naming an irreducible conflicting set:
// every requirement in it is needed for the conflict. Its work is
// polynomial: about (k + 2)·k solves of a system of k requirements over
// the plan's variables, with k at most MaxRequirements.
func (pl *Plan) Solve() (*Solution, error) {
	if pl.err != nil {
		return nil, pl.err
	}
	if len(pl.cons) > MaxRequirements {
		return nil, planError("Solve", "", ErrPlan, fmt.Sprintf("%d requirements, at most %d", len(pl.cons), MaxRequirements))
	}
	s, ok, err := pl.solveSubset(allIndices(len(pl.cons)))
	if err != nil {
		return nil, err
	}
	if ok {
		if err := s.deriveBase(); err != nil {
			return nil, err
		}
		s.cache = new(ratioCache)
		return s, nil
	}
	return nil, pl.conflict()
}

func allIndices(n int) []int {
	out := make([]int, n)
	for i := range out {
		out[i] = i
	}
	return out
}

// solveSubset solves the plan with only the given constraints.
func (pl *Plan) solveSubset(use []int) (*Solution, bool, error) {
	n := len(pl.vars)
	fixed := make(map[int]float64)
	var rows [][]quantity.Rat
	for _, ci := range use {
		c := pl.cons[ci]
		switch c.kind {
		case consFix:
			if v, ok := fixed[c.vars[0]]; ok && math.Abs(math.Log(v/c.value)) > 1e-12 {
				return nil, false, nil
			}
			fixed[c.vars[0]] = c.value
		default:
			rows = append(rows, c.rows...)
		}
	}
	// Column order: variables without a fixed value first, so that they
	// are solved for and the fixed ones stay free parameters.
	var order []int
	for i := range n {
		if _, ok := fixed[i]; !ok {
			order = append(order, i)
		}
	}
	for i := range n {
		if _, ok := fixed[i]; ok {
			order = append(order, i)
		}
	}
	m := exact.NewMatrix[quantity.Rat](len(rows), n)
	for r, row := range rows {
		for k, i := range order {
			m[r][k] = row[i]
		}
	}
	pivots, err := m.RREF()
	if err != nil {
		return nil, false, err
	}
	isPivot := make(map[int]int) // column → row
	for r, c := range pivots {
		isPivot[c] = r
	}
	s := &Solution{plan: pl, values: make(map[string]float64)}
	paramIdx := make(map[int]int) // variable → parameter index
	for k, i := range order {
		if _, ok := isPivot[k]; !ok {
			paramIdx[i] = len(s.params)
			s.params = append(s.params, pl.vars[i].Symbol)
		}
	}
	np := len(s.params)
	s.coef = make([][]quantity.Rat, n)
	for k, i := range order {
		c := make([]quantity.Rat, np)
		for j := range c {
			c[j] = quantity.RatInt(0)
		}
		if r, ok := isPivot[k]; ok {
			for k2, i2 := range order {
				if _, piv := isPivot[k2]; piv || m[r][k2].IsZero() {
					continue
				}
				c[paramIdx[i2]] = m[r][k2].Neg()
			}
		} else {
			c[paramIdx[i]] = quantity.RatInt(1)
		}
		s.coef[i] = c
	}
	for i, v := range fixed {
		if _, ok := paramIdx[i]; ok {
			s.values[pl.vars[i].Symbol] = v
		}
	}
	for _, p := range s.params {
		if _, ok := s.values[p]; !ok {
			s.free = append(s.free, p)
		}
	}
	// A fixed variable solved for in terms of other parameters must agree
	// with its own value.
	for i, v := range fixed {
		if _, ok := paramIdx[i]; ok {
			continue
		}
		got := lawOf(s.coef[i], s.params).Eval(s.values)
		if math.IsNaN(got) || math.Abs(math.Log(got/v)) > 1e-9 {
			return s, false, nil
		}
	}
	return s, true, nil
}

// groupLaw returns the law of the ratio of ∏ xᵢ^eᵢ.
func (s *Solution) groupLaw(exps []quantity.Rat) Law {
	if len(exps) != len(s.coef) {
		return Law{}
	}
	c, err := combine(s.coef, exps, len(s.params))
	if err != nil {
		return Law{}
	}
	return lawOf(c, s.params)
}

// Free returns the free ratios that have no value: a plan with any is
// underdetermined, and its laws are in terms of them.
func (s *Solution) Free() []string { return slices.Clone(s.free) }

// Params returns every free ratio the laws are written in, with or
// without a value.
func (s *Solution) Params() []string { return slices.Clone(s.params) }

// Ratio is a scale ratio λ = model/prototype: its exact law and, when the
// free ratios it depends on have values, its value (NaN otherwise).
type Ratio struct {
	Law   Law
	Value float64
}

// String writes "law = value", or "1" for a ratio of one. The zero
// Ratio, which Solution.Ratio and DerivedRatio return beside an error,
// is no ratio at all: it writes "(no ratio)", never a value that could
// be read as a ratio.
func (r Ratio) String() string {
	if r.Law.IsOne() {
		if r.Value == 0 {
			return "(no ratio)"
		}
		return "1"
	}
	if math.IsNaN(r.Value) {
		return r.Law.String()
	}
	return fmt.Sprintf("%s = %.6g", r.Law, r.Value)
}

// Ratio returns the scale ratio of a variable, named by its symbol in the
// plan's problem (the rules of similitude document theirs). A symbol that
// is not a variable of the plan (an error matching quantity.ErrUnknown),
// or a ratio whose value overflows or underflows a float64 (ErrRange),
// returns the zero Ratio beside the error, never a ratio to use. A value
// of NaN, with a nil error, means the ratio depends on free ratios with
// no value (see Free).
func (s *Solution) Ratio(symbol string) (Ratio, error) {
	i := s.plan.index(symbol)
	if i < 0 {
		return Ratio{}, unknownVar("ratio", symbol, s.plan.vars)
	}
	l := lawOf(s.coef[i], s.params)
	return checked("λ_"+symbol, Ratio{Law: l, Value: l.Eval(s.values)})
}

// RatioValues returns the values of the ratios of the given variables,
// in order, as Ratio gives them: a trade builds its rule's result from
// the named scales with it. The first error from Ratio is returned.
func (s *Solution) RatioValues(symbols ...string) ([]float64, error) {
	out := make([]float64, len(symbols))
	for i, sym := range symbols {
		r, err := s.Ratio(sym)
		if err != nil {
			return nil, err
		}
		out[i] = r.Value
	}
	return out, nil
}

// checked returns r, or the zero Ratio and an error when its value
// overflowed or underflowed.
func checked(what string, r Ratio) (Ratio, error) {
	if err := checkRatioValue(what, r); err != nil {
		return Ratio{}, err
	}
	return r, nil
}

// checkRatioValue refuses a ratio whose value overflowed or underflowed
// (NaN, meaning a free ratio without a value, is left to the caller).
func checkRatioValue(what string, r Ratio) error {
	if v := r.Value; v == 0 || math.IsInf(v, 0) {
		return planError("Ratio", what, ErrBadRatio, fmt.Sprintf("%s = %s is out of the range of a float64 for these ratios", what, r.Law))
	}
	return nil
}

// GroupRatio returns the model/prototype ratio of a group, as oriented
// (the ratio of L·g/V² for that group, of Re for Re): 1 for a held group,
// a law of the free ratios for one that floats. A group of another
// problem is an error wrapping ErrForeignGroup; on any error the Ratio is
// the zero value. NamedRatio states the
// ratio for the named group instead.
func (s *Solution) GroupRatio(g pigroups.Group) (Ratio, error) {
	if err := s.plan.prob.CheckGroup(g); err != nil {
		return Ratio{}, planError("GroupRatio", g.Name, err, "group ratio")
	}
	l := s.groupLaw(g.Exponents())
	return checked("the ratio of "+g.Name, Ratio{Law: l, Value: l.Eval(s.values)})
}

// NamedRatio returns the model/prototype ratio of the named group g is
// recognised as (Fr for V²/(g·L) or L·g/V²), with the whole-exponent
// power the trade also quotes (Fr²); for a group with no name, the ratio
// of the group as written.
func (s *Solution) NamedRatio(g pigroups.Group) (GroupRatio, error) {
	if err := s.plan.prob.CheckGroup(g); err != nil {
		return GroupRatio{}, planError("NamedRatio", g.Name, err, "named ratio")
	}
	return s.groupRatio(g), nil
}

// With returns a copy of the solution with values for free ratios.
func (s *Solution) With(values map[string]float64) (*Solution, error) {
	c := *s
	c.cache = new(ratioCache)
	c.values = make(map[string]float64, len(s.values)+len(values))
	for k, v := range s.values {
		c.values[k] = v
	}
	c.free = nil
	for k, v := range values {
		if !slices.Contains(s.params, k) {
			return nil, planError("With", k, ErrUnknownVariable, fmt.Sprintf("%q is not a free ratio of the plan (free: %s)", k, strings.Join(s.params, ", ")))
		}
		if !(v > 0) || math.IsInf(v, 0) {
			return nil, planError("With", k, ErrBadRatio, fmt.Sprintf("ratio %v for %q is not positive and finite", v, k))
		}
		c.values[k] = v
	}
	for _, p := range s.params {
		if _, ok := c.values[p]; !ok {
			c.free = append(c.free, p)
		}
	}
	return &c, nil
}

// deriveBase finds the base-dimension ratios from the basis variables.
func (s *Solution) deriveBase() error {
	pl := s.plan
	basis := pl.basis
	if basis == nil {
		var err error
		if basis, err = pl.prob.DefaultRepeating(); err != nil {
			return nil // no derived ratios for this problem
		}
	}
	if err := pl.prob.CheckRepeating(basis...); err != nil {
		return planError("DerivedRatio", "", err, "basis for derived ratios")
	}
	s.bases = pl.prob.Bases()
	r := len(basis)
	// u_R = A_Rᵀ·w, so w = (A_Rᵀ)⁻¹·u_R, column by column over params.
	at := exact.NewMatrix[quantity.Rat](r, len(s.bases))
	for k, sym := range basis {
		i := pl.index(sym)
		for b, base := range s.bases {
			at[k][b] = pl.vars[i].Dim.Exponent(base)
		}
	}
	np := len(s.params)
	s.base = make([][]quantity.Rat, len(s.bases))
	for b := range s.base {
		s.base[b] = make([]quantity.Rat, np)
	}
	for p := range np {
		rhs := make([]quantity.Rat, r)
		for k, sym := range basis {
			rhs[k] = s.coef[pl.index(sym)][p]
		}
		w, ok, err := exact.Solve(at, rhs)
		if err != nil {
			return err
		}
		if !ok {
			return planError("DerivedRatio", "", nil, "basis does not determine the base-dimension ratios")
		}
		for b := range s.bases {
			s.base[b][p] = w[b]
		}
	}
	return nil
}

// DerivedRatio returns the scale ratio of any quantity of dimension d,
// from the base-dimension ratios the basis variables fix: for power,
// M L² T⁻³, λ_P = λ_M·λ_L²·λ_T⁻³. On error the Ratio is the zero value.
func (s *Solution) DerivedRatio(d quantity.Dim) (Ratio, error) {
	if s.base == nil {
		return Ratio{}, planError("DerivedRatio", "", nil, "no basis for derived ratios")
	}
	exps := make([]quantity.Rat, len(s.bases))
	for b, base := range s.bases {
		exps[b] = d.Exponent(base)
	}
	for base := quantity.Base(0); base < quantity.NumBases; base++ {
		if d.Sixths(base) != 0 && !slices.Contains(s.bases, base) {
			return Ratio{}, planError("DerivedRatio", "", ErrUnknownVariable, fmt.Sprintf("dimension %s carries %s, which no variable of the plan has", d, base))
		}
	}
	c, err := combine(s.base, exps, len(s.params))
	if err != nil {
		return Ratio{}, err
	}
	l := lawOf(c, s.params)
	return checked("the ratio of "+quantity.Describe(d), Ratio{Law: l, Value: l.Eval(s.values)})
}

// BaseRatio returns the ratio of a base dimension (λ_L, λ_M, λ_T, …).
func (s *Solution) BaseRatio(b quantity.Base) (Ratio, error) {
	d, err := quantity.DimOf(b, 1, 1)
	if err != nil {
		return Ratio{}, err
	}
	return s.DerivedRatio(d)
}
