package similarity

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
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
	// fluid holds the prototype's density and kinematic viscosity when
	// FixFluids gave them, so that a conflict's remedies can say what
	// they would ask of the model fluid.
	fluid protoFluid
}

// protoFluid is the prototype fluid of a plan, in SI; zero when unknown.
type protoFluid struct{ rho, nu float64 }

// NewPlan starts a plan for a problem. A nil problem makes Solve report
// an error matching quantity.ErrInvalid.
func NewPlan(p *pigroups.Problem) *Plan {
	if p == nil {
		return &Plan{err: planError("NewPlan", "", ErrPlan, "plan: no problem (nil *pigroups.Problem)")}
	}
	return &Plan{prob: p, vars: p.Variables()}
}

// Kinds of plan error, each the cause (Unwrap) of the *PlanError that
// reports it; errors.Is matches them. The three a plan shares with its
// problem are pigroups' own values.
var (
	ErrUnknownVariable  = pigroups.ErrUnknownVariable  // a symbol that is not a variable of the plan
	ErrForeignGroup     = pigroups.ErrForeignGroup     // a group of another problem
	ErrNotDimensionless = pigroups.ErrNotDimensionless // a held group that is not dimensionless
	ErrBadRatio         = errors.New("ratio not positive and finite")
	ErrPlan             = errors.New("plan cannot be solved as built")
)

// PlanError reports a plan built or used wrongly — an unknown symbol, a
// ratio that is not positive and finite, a group of another problem — or
// requirements that cannot all hold. It is the core's one error type.
type PlanError struct {
	Op     string // the method or step, "Ratio", "Hold", "report"
	Symbol string // the variable or group concerned (the input), if one is
	Class  error  // quantity.ErrUnknown, ErrRange, ErrDimension, ErrInvalid, or ErrConflict
	Reason string // what was wrong, in words
	Err    error  // the cause: one of the Err… kinds above, or another package's error
	// Conflict is the irreducible conflicting set and its remedies when
	// Class is ErrConflict, and nil otherwise.
	Conflict *Conflict
}

// Error implements the error interface.
func (e *PlanError) Error() string {
	s := "similarity: " + e.Reason
	if e.Err != nil && !isKind(e.Err) {
		s += ": " + e.Err.Error()
	}
	return s
}

// Unwrap returns the cause: the kind of problem (one of the Err… values),
// or the error that caused it.
func (e *PlanError) Unwrap() error { return e.Err }

// Is reports whether target is the error's class.
func (e *PlanError) Is(target error) bool { return target != nil && target == e.Class }

// isKind reports whether err is one of the package's kinds of plan error,
// whose text the message already says.
func isKind(err error) bool {
	switch err {
	case ErrUnknownVariable, ErrForeignGroup, ErrNotDimensionless, ErrBadRatio, ErrPlan, ErrUnknownRatio:
		return true
	}
	return false
}

// planError returns a *PlanError for op, of the class its cause gives:
// ErrUnknown for an unknown variable, ErrRange for a ratio out of range,
// ErrDimension for a group that is not dimensionless, ErrInvalid for the
// other kinds; an error of another package keeps its own class (among
// quantity's), or ErrInvalid if it has none.
func planError(op, sym string, cause error, reason string) *PlanError {
	if cause == nil {
		cause = ErrPlan
	}
	var class error
	switch cause {
	case ErrUnknownVariable:
		class = quantity.ErrUnknown
	case ErrBadRatio:
		class = quantity.ErrRange
	case ErrNotDimensionless:
		class = quantity.ErrDimension
	case ErrPlan, ErrForeignGroup, ErrUnknownRatio:
		class = quantity.ErrInvalid
	default:
		class = quantity.ErrInvalid
		if c := quantity.ClassOf(cause); c != nil {
			class = c
		}
	}
	return &PlanError{Op: op, Symbol: sym, Class: class, Reason: reason, Err: cause}
}

func unknownVar(op, sym string, vars []pigroups.Variable) *PlanError {
	names := make([]string, len(vars))
	for i, v := range vars {
		names[i] = v.Symbol
	}
	return planError(op, sym, ErrUnknownVariable, fmt.Sprintf("%s: %q is not a variable of the plan (%s)", op, sym, strings.Join(names, ", ")))
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
		pl.err = planError("plan", sym, class, fmt.Sprintf(format, a...))
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
	if pl.err != nil {
		return pl // Solve reports the first mistake
	}
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
// label for messages ("the Froude number"). An exponent a Rat cannot hold
// (math.MinInt64) makes Solve report an error matching quantity.ErrRange.
func (pl *Plan) HoldExps(label string, exps map[string]int) *Plan {
	if pl.err != nil {
		return pl // Solve reports the first mistake
	}
	m := make(quantity.Product, 0, len(exps))
	for s, e := range exps {
		if pl.index(s) < 0 {
			return pl.failErr(unknownVar("hold "+label, s, pl.vars))
		}
		r, err := quantity.NewRat(int64(e), 1)
		if err != nil {
			return pl.failErr(planError("HoldExps", label, err, fmt.Sprintf("hold %s: the exponent of %s", label, s)))
		}
		m = append(m, quantity.Factor{Name: s, Exp: r})
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

// FixFluids fixes the fluid-property ratios from actual fluid states on
// each side: the density ratio, the dynamic-viscosity ratio and, when
// both states have one and a symbol is given, the speed-of-sound ratio.
// An empty symbol skips that property.
func (pl *Plan) FixFluids(model, prototype fluids.State, density, viscosity, sound string) *Plan {
	ratio := func(m, p quantity.Quantity) float64 { return m.Value() / p.Value() }
	if rho, mu := prototype.Density.Value(), prototype.DynamicViscosity.Value(); rho > 0 && mu > 0 && !math.IsInf(rho, 0) && !math.IsInf(mu, 0) {
		pl.fluid = protoFluid{rho: rho, nu: mu / rho}
	}
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
