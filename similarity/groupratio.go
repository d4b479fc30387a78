package similarity

import (
	"similis.dev/similis/internal/exact"
	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// GroupRatio is the model/prototype ratio of a group, stated for the
// group the trade names: for a held or floating L·g/V² it is the ratio of
// Fr, with the ratio of Fr² beside it, since Fr itself has half-integer
// exponents.
type GroupRatio struct {
	// Symbol is the named group's symbol ("Fr", "Re"), or the group
	// written out when it has no name.
	Symbol string
	// Name is the named group's name ("Froude number"); empty when none.
	Name string
	// Ratio is the model/prototype ratio of the named group itself.
	Ratio Ratio
	// Whole, when the named group has fractional exponents, is the
	// smallest whole-exponent power of it ("Fr²"), and WholeRatio its
	// ratio.
	Whole      string
	WholeRatio Ratio
}

// String writes "Fr model/prototype = λ_L^(-3/2) = 64 (Fr²: λ_L⁻³ = 4096)".
func (r GroupRatio) String() string {
	s := r.Symbol + " model/prototype = " + r.Ratio.String()
	if r.Whole != "" {
		s += " (" + r.Whole + ": " + r.WholeRatio.String() + ")"
	}
	return s
}

// groupRatio states a group's ratio for its named group.
func (s *Solution) groupRatio(g pigroups.Group) GroupRatio {
	exps := []quantity.Rat(g.Exponents())
	ratio := func(v []quantity.Rat) Ratio {
		l := s.groupLaw(v)
		return Ratio{Law: l, Value: l.Eval(s.values)}
	}
	if len(g.Matches) == 0 {
		return GroupRatio{Symbol: g.Format(quantity.Unicode), Ratio: ratio(exps)}
	}
	m := g.Matches[0]
	named := make([]quantity.Rat, len(exps))
	lcm := int64(1)
	for i, e := range exps {
		x, err := e.Div(m.Power)
		if err != nil {
			return GroupRatio{Symbol: g.Format(quantity.Unicode), Ratio: ratio(exps)}
		}
		named[i] = x
		lcm = lcm / exact.GCD(lcm, x.Den()) * x.Den()
	}
	out := GroupRatio{Symbol: m.Symbol, Name: m.Name, Ratio: ratio(named)}
	if lcm > 1 {
		whole := make([]quantity.Rat, len(named))
		for i, x := range named {
			whole[i], _ = x.Mul(quantity.RatInt(lcm))
		}
		out.Whole = m.Symbol + string(quantity.AppendExponent(nil, quantity.RatInt(lcm), quantity.Unicode))
		out.WholeRatio = ratio(whole)
	}
	return out
}

// FloatingGroups returns the groups of the problem's default Pi set that
// do not hold the measured (dependent) variable and that the solution does
// not hold, each with its model/prototype ratio stated for the group the
// trade names (Re, not 1/Re). Whichever Pi set is taken, the list is empty
// exactly when every dimensionless group of the other variables is held.
//
// The ratio of the measured variable — DerivedRatio of its dimension, as
// ToPrototype and ToModel use it — carries a reading faithfully only when
// the list is empty: only then is the measured group equal on model and
// prototype. With a group floating (Re in a Froude-scaled tank test) the
// reading carries a scale effect the ratio does not include, and a report
// prints no ratio for it. A problem without groups returns nil.
func (s *Solution) FloatingGroups() []GroupRatio {
	set, err := s.plan.prob.DefaultSet()
	if err != nil {
		return nil
	}
	dep := s.plan.prob.DependentIndex()
	var out []GroupRatio
	for _, g := range set.Groups() {
		exps := g.Exponents()
		if dep >= 0 && !exps[dep].IsZero() {
			continue
		}
		if s.groupLaw(exps).IsOne() {
			continue
		}
		out = append(out, s.groupRatio(g.Conventional()))
	}
	return out
}

// floatingNames returns "Re", "Re and We" for the floating groups.
func floatingNames(fl []GroupRatio) string {
	names := make([]string, len(fl))
	for i, f := range fl {
		names[i] = f.Symbol
	}
	return joinAnd(names)
}
