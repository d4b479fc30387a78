package similarity

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"similis.dev/similis/quantity"
)

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
