package similarity

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/units"
)

type consKind uint8

const (
	consHold consKind = iota // a group held equal on both sides
	consSame                 // ratios fixed at 1
	consFix                  // a ratio fixed at a value
)

// constraint is one requirement of a plan.
type constraint struct {
	kind  consKind
	label string
	rows  [][]quantity.Rat // homogeneous rows over the variables
	vars  []int            // variables a Same or Fix constrains
	value float64          // the ratio for Fix
	exps  []quantity.Rat   // a held group's exponents
	group pigroups.Group
}

// Plan is a model test plan: the problem's variables, the groups to hold
// equal between model and prototype, and constraints on the scale ratios
// λ = model/prototype. Build it with the methods, which record the first
// mistake and let Solve report it.
type Plan struct {
	prob  *pigroups.Problem
	vars  []pigroups.Variable
	cons  []constraint
	basis []string
	err   error
}

// NewPlan starts a plan for a problem.
func NewPlan(p *pigroups.Problem) *Plan {
	return &Plan{prob: p, vars: p.Variables()}
}

// Classes of a *PlanError, for errors.Is.
var (
	ErrUnknownVariable  = errors.New("unknown variable")
	ErrForeignGroup     = errors.New("group of another problem")
	ErrBadRatio         = errors.New("ratio not positive and finite")
	ErrNotDimensionless = errors.New("group not dimensionless")
	ErrPlan             = errors.New("plan cannot be solved as built")
)

// PlanError reports a plan built or used wrongly: an unknown symbol, a
// ratio that is not positive and finite, a group of another problem. Err
// is its class, Symbol the variable or group concerned.
type PlanError struct {
	Err    error
	Symbol string
	Reason string
}

// Error implements the error interface.
func (e *PlanError) Error() string { return "similarity: " + e.Reason }

// Unwrap returns the class of the error, and the cause it wraps if any.
func (e *PlanError) Unwrap() error {
	if e.Err == nil {
		return ErrPlan
	}
	return e.Err
}

func unknownVar(op, sym string, vars []pigroups.Variable) *PlanError {
	names := make([]string, len(vars))
	for i, v := range vars {
		names[i] = v.Symbol
	}
	return &PlanError{Err: ErrUnknownVariable, Symbol: sym, Reason: fmt.Sprintf("%s: %q is not a variable of the plan (%s)", op, sym, strings.Join(names, ", "))}
}

func (pl *Plan) index(sym string) int {
	for i, v := range pl.vars {
		if v.Symbol == sym {
			return i
		}
	}
	return -1
}

func (pl *Plan) fail(class error, sym, format string, a ...any) *Plan {
	if pl.err == nil {
		pl.err = &PlanError{Err: class, Symbol: sym, Reason: fmt.Sprintf(format, a...)}
	}
	return pl
}

func (pl *Plan) failErr(e *PlanError) *Plan {
	if pl.err == nil {
		pl.err = e
	}
	return pl
}

// Hold requires the group to have the same value on model and prototype.
// The group must come from the plan's problem, or one with the same
// variables in the same order.
func (pl *Plan) Hold(g pigroups.Group) *Plan {
	if err := pl.prob.CheckGroup(g); err != nil {
		return pl.fail(ErrForeignGroup, g.Name, "hold %s: %v", g, err)
	}
	label := g.String()
	if len(g.Matches) > 0 {
		label = "the " + g.Matches[0].Name
	}
	return pl.holdGroup(label, g)
}

// HoldExps holds the group ∏ xᵢ^eᵢ given as exponents by symbol, with a
// label for messages ("the Froude number").
func (pl *Plan) HoldExps(label string, exps map[string]int) *Plan {
	m := make(map[string]quantity.Rat, len(exps))
	for s, e := range exps {
		if pl.index(s) < 0 {
			return pl.failErr(unknownVar("hold "+label, s, pl.vars))
		}
		m[s] = quantity.RatInt(int64(e))
	}
	g, err := pl.prob.NewGroup(label, m)
	if err != nil {
		return pl.fail(ErrNotDimensionless, label, "hold %s: %v", label, err)
	}
	return pl.holdGroup(label, g)
}

func (pl *Plan) holdGroup(label string, g pigroups.Group) *Plan {
	v := []quantity.Rat(g.Exponents())
	if len(v) != len(pl.vars) {
		return pl.fail(ErrForeignGroup, label, "hold %s: %d exponents for %d variables", label, len(v), len(pl.vars))
	}
	if !pl.dimensionless(v) {
		return pl.fail(ErrNotDimensionless, label, "hold %s: the group is not dimensionless", label)
	}
	pl.cons = append(pl.cons, constraint{kind: consHold, label: label, rows: [][]quantity.Rat{slices.Clone(v)}, exps: slices.Clone(v), group: g})
	return pl
}

func (pl *Plan) dimensionless(v []quantity.Rat) bool {
	var d quantity.Dim
	for i, e := range v {
		if e.IsZero() {
			continue
		}
		p, err := pl.vars[i].Dim.Pow(int(e.Num()), int(e.Den()))
		if err != nil {
			return false
		}
		if d, err = d.Mul(p); err != nil {
			return false
		}
	}
	return d.IsDimensionless()
}

// Fix sets the scale ratio of a variable: Fix("L", 1.0/25) for a 1:25
// model.
func (pl *Plan) Fix(symbol string, ratio float64) *Plan {
	i := pl.index(symbol)
	if i < 0 {
		return pl.failErr(unknownVar("fix", symbol, pl.vars))
	}
	if !(ratio > 0) || math.IsInf(ratio, 0) {
		return pl.fail(ErrBadRatio, symbol, "fix %s: the ratio %v is not positive and finite", symbol, ratio)
	}
	label := fmt.Sprintf("a %s ratio λ_%s = %.6g", pl.kindWord(i), symbol, ratio)
	if r := 1 / ratio; ratio < 1 && math.Abs(r-math.Round(r)) < 1e-9*r {
		label = fmt.Sprintf("a %s scale of 1:%g", pl.kindWord(i), math.Round(r))
	}
	pl.cons = append(pl.cons, constraint{kind: consFix, label: label, vars: []int{i}, value: ratio})
	return pl
}

func (pl *Plan) kindWord(i int) string {
	if k, _ := pl.prob.Kinds(i); len(k) > 0 {
		return k[0]
	}
	return pl.vars[i].Symbol
}

// Same fixes the ratios of the variables at 1, as one requirement with a
// label ("the same fluid").
func (pl *Plan) Same(label string, symbols ...string) *Plan {
	c := constraint{kind: consSame, label: label}
	for _, s := range symbols {
		i := pl.index(s)
		if i < 0 {
			return pl.failErr(unknownVar(label, s, pl.vars))
		}
		row := make([]quantity.Rat, len(pl.vars))
		for k := range row {
			row[k] = quantity.RatInt(0)
		}
		row[i] = quantity.RatInt(1)
		c.rows = append(c.rows, row)
		c.vars = append(c.vars, i)
	}
	pl.cons = append(pl.cons, c)
	return pl
}

// SameFluid requires the same fluid on both sides: λ_ρ = λ_μ = 1.
func (pl *Plan) SameFluid(density, viscosity string) *Plan {
	return pl.Same("the same fluid", density, viscosity)
}

// SameGravity requires λ_g = 1.
func (pl *Plan) SameGravity(g string) *Plan { return pl.Same("the same gravity", g) }

// Basis names the variables whose ratios fix the base-dimension ratios
// (λ_L, λ_M, λ_T, …) for DerivedRatio; by default the problem's default
// repeating set.
func (pl *Plan) Basis(symbols ...string) *Plan { pl.basis = slices.Clone(symbols); return pl }

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
}

// ErrConflict is wrapped by every *ConflictError.
var ErrConflict = errors.New("requirements conflict")

// ConflictError reports requirements that cannot all hold.
type ConflictError struct {
	// Constraints is an irreducible conflicting set, in words: drop any
	// one of them and the rest can hold.
	Constraints []string
	// Summary says what the set forces: "holding the Reynolds number and
	// the Froude number with the same fluid and the same gravity forces
	// λ_L to 1, but a length scale of 1:25 requires 0.04".
	Summary string
	// Remedies lists, for each requirement whose removal resolves the
	// conflict, what its ratios would then have to be.
	Remedies []Remedy
}

// Remedy is one way out of a conflict: a requirement to drop, and what
// the ratios then are, as data and as text rendered from it.
type Remedy struct {
	Drop string // the requirement to drop, in words
	// Group, when the requirement dropped is a held group, is the
	// model/prototype ratio that group then floats to, stated for the
	// group the trade names (Fr, not the L·g/V² that may have been held).
	Group *GroupRatio
	// Ratios, when the requirement dropped fixes ratios (the same fluid,
	// a scale), are those ratios once it is dropped, and any the trade
	// reads from them (ν_m/ν_p for the same fluid).
	Ratios []Outcome
	// Needs is the same in words, one phrase per item, rendered from
	// Group and Ratios.
	Needs []string
}

// String writes the remedy in words: "without the Reynolds number: the
// Reynolds number would float, Re model/prototype = λ_L^(3/2) = 0.0156".
func (r Remedy) String() string { return "without " + r.Drop + ": " + strings.Join(r.Needs, "; ") }

// Outcome is the model/prototype ratio of one variable or derived
// quantity in a remedy.
type Outcome struct {
	Label string // "λ_rho", or "ν_m/ν_p" for a derived ratio
	Ratio Ratio
	// Free is true when the ratio is left free (a parameter of the
	// laws), One when the requirements force it to 1.
	Free, One bool
}

// String writes the outcome: "λ_rho = λ_mu·λ_L^(-3/2)", "λ_mu free",
// "λ_L to 1", "λ_g = λ_L⁻³ = 4096".
func (o Outcome) String() string {
	switch {
	case o.One:
		return o.Label + " to 1"
	case o.Free:
		return o.Label + " free"
	}
	return o.Label + " = " + o.Ratio.String()
}

// Error implements the error interface.
func (e *ConflictError) Error() string {
	var sb strings.Builder
	sb.WriteString("similarity: requirements conflict: ")
	sb.WriteString(e.Summary)
	for _, r := range e.Remedies {
		fmt.Fprintf(&sb, "; %s", r)
	}
	return sb.String()
}

// Unwrap returns ErrConflict.
func (e *ConflictError) Unwrap() error { return ErrConflict }

// MaxRequirements bounds the requirements of a plan (held groups, fixed
// ratios, same-fluid and same-gravity requirements together).
const MaxRequirements = 256

// Solve solves the plan exactly. It returns a *ConflictError if the
// requirements cannot all hold, naming an irreducible conflicting set:
// every requirement in it is needed for the conflict. Its work is
// polynomial: about (k + 2)·k solves of a system of k requirements over
// the plan's variables, with k at most MaxRequirements.
func (pl *Plan) Solve() (*Solution, error) {
	if pl.err != nil {
		return nil, pl.err
	}
	if len(pl.cons) > MaxRequirements {
		return nil, &PlanError{Err: ErrPlan, Reason: fmt.Sprintf("%d requirements, at most %d", len(pl.cons), MaxRequirements)}
	}
	s, ok, err := pl.solveSubset(allIndices(len(pl.cons)))
	if err != nil {
		return nil, err
	}
	if ok {
		if err := s.deriveBase(); err != nil {
			return nil, err
		}
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

// conflict finds the smallest conflicting subset and the remedies.
func (pl *Plan) conflict() error {
	n := len(pl.cons)
	// Deletion filtering: drop each requirement in turn and keep it out
	// when the rest still conflict. What remains is irreducible — every
	// member is needed for the conflict — in n + 1 solves of the linear
	// system, not the 2ⁿ subsets of an exhaustive search.
	var minimal []int
	if _, ok, err := pl.solveSubset(allIndices(n)); err == nil && !ok {
		minimal = allIndices(n)
		for k := 0; k < len(minimal); {
			trial := slices.Delete(slices.Clone(minimal), k, k+1)
			if _, ok, err := pl.solveSubset(trial); err == nil && !ok {
				minimal = trial
				continue
			}
			k++
		}
	}
	e := &ConflictError{}
	if minimal == nil {
		e.Summary = "the requirements are inconsistent"
		return e
	}
	var held, same, fixes []string
	var fixIdx []int
	for _, ci := range minimal {
		c := pl.cons[ci]
		e.Constraints = append(e.Constraints, c.label)
		switch c.kind {
		case consHold:
			held = append(held, c.label)
		case consSame:
			same = append(same, c.label)
		case consFix:
			fixes = append(fixes, c.label)
			fixIdx = append(fixIdx, ci)
		}
	}
	// What do the other requirements force the fixed ratios to?
	var rest []int
	for _, ci := range minimal {
		if !slices.Contains(fixIdx, ci) {
			rest = append(rest, ci)
		}
	}
	var forced []string
	if s, ok, err := pl.solveSubset(rest); err == nil && ok {
		for _, ci := range fixIdx {
			// A ratio the other requirements leave free is not forced.
			if o := s.outcome(pl.cons[ci].vars[0]); !o.Free {
				forced = append(forced, o.String())
			}
		}
	}
	var sb strings.Builder
	if len(held) > 0 {
		sb.WriteString("holding " + joinAnd(held))
	}
	if len(same) > 0 {
		if sb.Len() > 0 {
			sb.WriteString(" with ")
		} else {
			sb.WriteString("requiring ")
		}
		sb.WriteString(joinAnd(same))
	}
	if len(forced) > 0 {
		sb.WriteString(" forces " + joinAnd(forced) + ", against " + joinAnd(fixes))
	} else {
		sb.WriteString(" cannot hold with " + joinAnd(fixes))
	}
	e.Summary = sb.String()
	for _, ci := range minimal {
		without := make([]int, 0, n-1)
		for k := range n {
			if k != ci {
				without = append(without, k)
			}
		}
		s, ok, err := pl.solveSubset(without)
		if err != nil || !ok {
			continue
		}
		r := Remedy{Drop: pl.cons[ci].label}
		c := pl.cons[ci]
		switch c.kind {
		case consHold:
			gr := s.groupRatio(c.group)
			r.Group = &gr
			r.Needs = append(r.Needs, c.label+" would float, "+gr.String())
		default:
			for _, i := range c.vars {
				r.Ratios = append(r.Ratios, s.outcome(i))
			}
			if c.label == "the same fluid" && len(c.vars) == 2 {
				// The kinematic viscosity ratio μ/ρ is what a held Reynolds
				// number fixes.
				v := make([]quantity.Rat, len(pl.vars))
				for k := range v {
					v[k] = quantity.RatInt(0)
				}
				v[c.vars[0]], v[c.vars[1]] = quantity.RatInt(-1), quantity.RatInt(1)
				l := s.groupLaw(v)
				r.Ratios = append(r.Ratios, Outcome{Label: "ν_m/ν_p", Ratio: Ratio{Law: l, Value: l.Eval(s.values)}, One: l.IsOne()})
			}
			for _, o := range r.Ratios {
				r.Needs = append(r.Needs, o.String())
			}
		}
		e.Remedies = append(e.Remedies, r)
	}
	return e
}

func joinAnd(s []string) string {
	switch len(s) {
	case 0:
		return ""
	case 1:
		return s[0]
	}
	return strings.Join(s[:len(s)-1], ", ") + " and " + s[len(s)-1]
}

// outcome returns a variable's ratio: its law, and its value when known.
func (s *Solution) outcome(i int) Outcome {
	l := lawOf(s.coef[i], s.params)
	sym := s.plan.vars[i].Symbol
	isParam := len(l.Terms) == 1 && l.Terms[0].Symbol == sym && l.Terms[0].Exp == quantity.RatInt(1)
	return Outcome{Label: "λ_" + sym, Ratio: Ratio{Law: l, Value: l.Eval(s.values)}, One: l.IsOne(), Free: isParam && math.IsNaN(l.Eval(s.values))}
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

// String writes "law = value", or "1" for a ratio of one.
func (r Ratio) String() string {
	if r.Law.IsOne() {
		return "1"
	}
	if math.IsNaN(r.Value) {
		return r.Law.String()
	}
	return fmt.Sprintf("%s = %.6g", r.Law, r.Value)
}

// Ratio returns the scale ratio of a variable.
func (s *Solution) Ratio(symbol string) (Ratio, error) {
	i := s.plan.index(symbol)
	if i < 0 {
		return Ratio{}, unknownVar("ratio", symbol, s.plan.vars)
	}
	l := lawOf(s.coef[i], s.params)
	r := Ratio{Law: l, Value: l.Eval(s.values)}
	return r, checkRatioValue("λ_"+symbol, r)
}

// checkRatioValue refuses a ratio whose value overflowed or underflowed
// (NaN, meaning a free ratio without a value, is left to the caller).
func checkRatioValue(what string, r Ratio) error {
	if v := r.Value; v == 0 || math.IsInf(v, 0) {
		return &PlanError{Err: ErrBadRatio, Symbol: what, Reason: fmt.Sprintf("%s = %s is out of the range of a float64 for these ratios", what, r.Law)}
	}
	return nil
}

// GroupRatio returns the model/prototype ratio of a group, as oriented
// (the ratio of L·g/V² for that group, of Re for Re): 1 for a held group,
// a law of the free ratios for one that floats. A group of another
// problem is an error wrapping ErrForeignGroup. NamedRatio states the
// ratio for the named group instead.
func (s *Solution) GroupRatio(g pigroups.Group) (Ratio, error) {
	if err := s.plan.prob.CheckGroup(g); err != nil {
		return Ratio{}, &PlanError{Err: ErrForeignGroup, Symbol: g.Name, Reason: "group ratio: " + err.Error()}
	}
	l := s.groupLaw(g.Exponents())
	r := Ratio{Law: l, Value: l.Eval(s.values)}
	return r, checkRatioValue("the ratio of "+g.Name, r)
}

// NamedRatio returns the model/prototype ratio of the named group g is
// recognised as (Fr for V²/(g·L) or L·g/V²), with the whole-exponent
// power the trade also quotes (Fr²); for a group with no name, the ratio
// of the group as written.
func (s *Solution) NamedRatio(g pigroups.Group) (GroupRatio, error) {
	if err := s.plan.prob.CheckGroup(g); err != nil {
		return GroupRatio{}, &PlanError{Err: ErrForeignGroup, Symbol: g.Name, Reason: "named ratio: " + err.Error()}
	}
	return s.groupRatio(g), nil
}

// With returns a copy of the solution with values for free ratios.
func (s *Solution) With(values map[string]float64) (*Solution, error) {
	c := *s
	c.values = make(map[string]float64, len(s.values)+len(values))
	for k, v := range s.values {
		c.values[k] = v
	}
	c.free = nil
	for k, v := range values {
		if !slices.Contains(s.params, k) {
			return nil, &PlanError{Err: ErrUnknownVariable, Symbol: k, Reason: fmt.Sprintf("%q is not a free ratio of the plan (free: %s)", k, strings.Join(s.params, ", "))}
		}
		if !(v > 0) || math.IsInf(v, 0) {
			return nil, &PlanError{Err: ErrBadRatio, Symbol: k, Reason: fmt.Sprintf("ratio %v for %q is not positive and finite", v, k)}
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
		return &PlanError{Reason: fmt.Sprintf("basis for derived ratios: %v", err)}
	}
	s.bases = pl.prob.Bases()
	r := len(basis)
	// u_R = A_Rᵀ·w, so w = (A_Rᵀ)⁻¹·u_R, column by column over params.
	at := exact.NewMatrix[quantity.Rat](r, len(s.bases))
	for k, sym := range basis {
		i := pl.index(sym)
		for b, base := range s.bases {
			at[k][b] = quantity.MustRat(int64(pl.vars[i].Dim.Sixths(base)), quantity.ExpDen)
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
			return &PlanError{Reason: "basis does not determine the base-dimension ratios"}
		}
		for b := range s.bases {
			s.base[b][p] = w[b]
		}
	}
	return nil
}

// DerivedRatio returns the scale ratio of any quantity of dimension d,
// from the base-dimension ratios the basis variables fix: for power,
// M L² T⁻³, λ_P = λ_M·λ_L²·λ_T⁻³.
func (s *Solution) DerivedRatio(d quantity.Dim) (Ratio, error) {
	if s.base == nil {
		return Ratio{}, &PlanError{Reason: "no basis for derived ratios"}
	}
	exps := make([]quantity.Rat, len(s.bases))
	for b, base := range s.bases {
		exps[b] = quantity.MustRat(int64(d.Sixths(base)), quantity.ExpDen)
	}
	for base := quantity.Base(0); base < quantity.NumBases; base++ {
		if d.Sixths(base) != 0 && !slices.Contains(s.bases, base) {
			return Ratio{}, &PlanError{Err: ErrUnknownVariable, Reason: fmt.Sprintf("dimension %s carries %s, which no variable of the plan has", d, base)}
		}
	}
	c, err := combine(s.base, exps, len(s.params))
	if err != nil {
		return Ratio{}, err
	}
	l := lawOf(c, s.params)
	r := Ratio{Law: l, Value: l.Eval(s.values)}
	return r, checkRatioValue("the ratio of "+quantity.Describe(d), r)
}

// BaseRatio returns the ratio of a base dimension (λ_L, λ_M, λ_T, …).
func (s *Solution) BaseRatio(b quantity.Base) (Ratio, error) {
	d, err := quantity.DimOf(b, 1, 1)
	if err != nil {
		return Ratio{}, err
	}
	return s.DerivedRatio(d)
}

// ErrUnknownRatio is returned by transfers whose ratio has no value.
var ErrUnknownRatio = errors.New("the ratio depends on a free ratio with no value")

func (s *Solution) ratioFor(d quantity.Dim) (float64, error) {
	r, err := s.DerivedRatio(d)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(r.Value) {
		return 0, fmt.Errorf("similarity: %s: %w (%s; free: %s)", quantity.Describe(d), ErrUnknownRatio, r.Law, strings.Join(s.free, ", "))
	}
	return r.Value, nil
}

// ToPrototype carries a measured model quantity to full scale through the
// ratio its dimension implies: q_p = q_m/λ.
func (s *Solution) ToPrototype(q quantity.Quantity) (quantity.Quantity, error) {
	r, err := s.ratioFor(q.Dim())
	if err != nil {
		return quantity.Quantity{}, err
	}
	return scaled(q, 1/r)
}

// scaled returns q·f, refusing a result that is not finite.
func scaled(q quantity.Quantity, f float64) (quantity.Quantity, error) {
	out := q.Scale(f)
	if v := out.Value(); math.IsNaN(v) || math.IsInf(v, 0) {
		return quantity.Quantity{}, &PlanError{Err: ErrBadRatio, Reason: fmt.Sprintf("%v scaled by %g is not finite", q, f)}
	}
	return out, nil
}

// ToModel carries a prototype quantity to the model: q_m = λ·q_p.
func (s *Solution) ToModel(q quantity.Quantity) (quantity.Quantity, error) {
	r, err := s.ratioFor(q.Dim())
	if err != nil {
		return quantity.Quantity{}, err
	}
	return scaled(q, r)
}

// SeriesToPrototype carries a whole measured Series to full scale into
// dst, with one ratio and no allocation once dst has grown.
func (s *Solution) SeriesToPrototype(dst *quantity.Series, m quantity.Series) error {
	r, err := s.ratioFor(m.Dim())
	if err != nil {
		return err
	}
	dst.Scale(m, 1/r)
	return nil
}

// SeriesToModel carries a prototype Series to the model into dst.
func (s *Solution) SeriesToModel(dst *quantity.Series, p quantity.Series) error {
	r, err := s.ratioFor(p.Dim())
	if err != nil {
		return err
	}
	dst.Scale(p, r)
	return nil
}

// VariableToPrototype carries a model value of one of the plan's variables
// through that variable's own ratio, which differs from the ratio of its
// dimension when the plan scales two variables of one dimension apart (a
// distorted model's horizontal and vertical lengths).
func (s *Solution) VariableToPrototype(symbol string, q quantity.Quantity) (quantity.Quantity, error) {
	i := s.plan.index(symbol)
	if i < 0 {
		return quantity.Quantity{}, unknownVar("to prototype", symbol, s.plan.vars)
	}
	if err := q.CheckNamed(symbol, s.plan.vars[i].Dim); err != nil {
		return quantity.Quantity{}, err
	}
	r, err := s.Ratio(symbol)
	if err != nil {
		return quantity.Quantity{}, err
	}
	if math.IsNaN(r.Value) {
		return quantity.Quantity{}, fmt.Errorf("similarity: λ_%s: %w (%s)", symbol, ErrUnknownRatio, r.Law)
	}
	return scaled(q, 1/r.Value)
}

// FixFluids fixes the fluid-property ratios from actual fluid states on
// each side: the density ratio, the dynamic-viscosity ratio and, when
// both states have one and a symbol is given, the speed-of-sound ratio.
// An empty symbol skips that property.
func (pl *Plan) FixFluids(model, prototype fluids.State, density, viscosity, sound string) *Plan {
	ratio := func(m, p quantity.Quantity) float64 { return m.Value() / p.Value() }
	if density != "" {
		pl.Fix(density, ratio(model.Density, prototype.Density))
	}
	if viscosity != "" {
		pl.Fix(viscosity, ratio(model.DynamicViscosity, prototype.DynamicViscosity))
	}
	if sound != "" {
		if model.SpeedOfSound.Value() <= 0 || prototype.SpeedOfSound.Value() <= 0 {
			return pl.fail(ErrBadRatio, sound, "fix %s: a fluid state has no speed of sound", sound)
		}
		pl.Fix(sound, ratio(model.SpeedOfSound, prototype.SpeedOfSound))
	}
	return pl
}

// SetPoints turns a prototype operating point, given by variable symbol,
// into model set points in the units chosen by symbol ("kn", "rpm",
// "L/s"); variables without a unit are given in SI. Every variable of the
// operating point must have a known ratio.
func (s *Solution) SetPoints(prototype map[string]quantity.Quantity, unitOf map[string]string) (map[string]units.Value, error) {
	out := make(map[string]units.Value, len(prototype))
	for sym, q := range prototype {
		i := s.plan.index(sym)
		if i < 0 {
			return nil, unknownVar("set points", sym, s.plan.vars)
		}
		if err := q.CheckNamed(sym, s.plan.vars[i].Dim); err != nil {
			return nil, err
		}
		r, err := s.Ratio(sym)
		if err != nil {
			return nil, err
		}
		if math.IsNaN(r.Value) {
			return nil, fmt.Errorf("similarity: set point for %s: %w (%s)", sym, ErrUnknownRatio, r.Law)
		}
		m, err := scaled(q, r.Value)
		if err != nil {
			return nil, err
		}
		u := units.BaseUnit(m.Dim())
		if name, ok := unitOf[sym]; ok {
			var err error
			if u, err = units.Parse(name); err != nil {
				return nil, fmt.Errorf("similarity: set point unit for %s: %w", sym, err)
			}
		}
		v, err := u.ValueOf(m)
		if err != nil {
			return nil, err
		}
		out[sym] = units.Value{Number: v, Unit: u}
	}
	return out, nil
}
