package pigroups

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
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
	// factor is the numerical factor the group carries (a coefficient's
	// ½ or its rev/s conversion, see Coefficient); nil means 1, as for
	// every group of a Pi set, which then holds a word for it.
	factor *groupFactor
}

// groupFactor is the numerical factor coef·(2π)^twoPi of a coefficient.
type groupFactor struct {
	coef  quantity.Rat
	twoPi int
}

// Factor returns the numerical factor the group carries in front of its
// product of powers: 1 for a Pi set's groups, 2 for a drag coefficient
// written as C_D = 2·F/(ρ·V²·A), 4π² for K_T with a rotational speed held
// in rad/s.
func (g Group) Factor() float64 {
	if g.factor == nil {
		return 1
	}
	return g.factor.coef.Float() * math.Pow(2*math.Pi, float64(g.factor.twoPi))
}

func (g Group) factorText(style quantity.Style) string {
	if g.factor == nil {
		return ""
	}
	return factorText(g.factor.coef, g.factor.twoPi, style)
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
		return Group{}, &Error{Op: OpProblem, Kind: ErrNotExact, Symbol: g.Name, Reason: fmt.Sprintf("%s has no name", g)}
	}
	m := g.Matches[0]
	if !m.Exact() {
		return Group{}, &Error{Op: OpProblem, Kind: ErrNotExact, Symbol: g.Name, Reason: fmt.Sprintf("%s is %s", g, m.describe(g.Name))}
	}
	exps := make([]quantity.Rat, len(g.exps))
	for i, e := range g.exps {
		x, err := e.Div(m.Power)
		if err != nil {
			return Group{}, &Error{Op: OpProblem, Symbol: g.Name, Reason: "an exponent over the named group's power", Err: err}
		}
		exps[i] = x
	}
	c := m.Coef
	if c.IsZero() {
		c = quantity.RatInt(1)
	}
	out := Group{Name: m.Symbol, Var: g.Var, exps: exps, prob: g.prob, factor: &groupFactor{coef: c, twoPi: m.TwoPiPower()}}
	out.Matches = g.prob.recognise(exps)
	return out, nil
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
		return quantity.RatInt(0), &Error{Op: OpProblem, Kind: ErrUnknownVariable, Symbol: symbol, Reason: "the zero Group has no variables"}
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
			return quantity.Dimensionless, &Error{Op: OpProblem, Symbol: g.Name, Reason: "the group's dimension", Err: err}
		}
		if d, err = d.Mul(p); err != nil {
			return quantity.Dimensionless, &Error{Op: OpProblem, Symbol: g.Name, Reason: "the group's dimension", Err: err}
		}
	}
	return d, nil
}

// Product returns the group as a product of powers of its variables,
// each factor named by the variable's symbol, in variable order, with the
// exact exponents and none that is zero: {ρ 1, V 1, D 1, μ −1} for
// ρ·V·D/μ. Format writes this product, after the group's numerical
// factor (Factor) when it has one; NewGroup reads it back. The zero Group
// is the empty product.
func (g Group) Product() quantity.Product {
	if g.prob == nil {
		return nil
	}
	return g.prob.product(g.exps, quantity.Unicode)
}

// String writes the group in plain text: "mu/(rho*V*D)".
func (g Group) String() string { return g.Format(quantity.ASCII) }

// Format writes the group in a style, its numerical factor first
// ("4π²·T/(ρ·n²·D⁴)"); the zero Group is "(no group)".
func (g Group) Format(style quantity.Style) string {
	if g.prob == nil {
		return "(no group)"
	}
	body := g.prob.product(g.exps, style).Format(style, quantity.Fraction, "")
	k := g.factorText(style)
	if k == "" {
		return body
	}
	sep := "·"
	switch style {
	case quantity.ASCII:
		sep = "*" // formula text: 4*pi^2*…, (1/(2*pi))*…
	case quantity.LaTeX:
		sep = " "
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
	if f := g.factor; f != nil && m.Exact() && m.Power.Num() == 1 && m.Power.Den() == 1 && f.coef == m.Coef && f.twoPi == m.TwoPiPower() {
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
	if l := g.Label(); g.factor != nil && l == m.Symbol {
		return l + " (" + m.Name + "; " + m.Definition + ")"
	}
	return m.describe(g.Name)
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
