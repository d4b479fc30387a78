package similarity

import (
	"fmt"
	"math"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
)

// Priority is a group a compromise tries to hold, with an optional
// threshold its model value should reach when it floats (a Reynolds
// number above about 10⁶ for inertia-dominated flow, a rule of thumb of
// the trade).
type Priority struct {
	Group pigroups.Group
	// MinModel is the smallest acceptable model value when the group
	// floats; 0 means no check.
	MinModel float64
}

// Floating is a group a compromise lets float.
type Floating struct {
	Label     string
	Ratio     Ratio   // model/prototype value of the group
	Prototype float64 // the group's prototype value, if the prototype was given
	Model     float64 // Prototype × Ratio
	MinModel  float64
	// Meets reports whether Model ≥ MinModel (true when there is no
	// threshold).
	Meets bool
}

// Compromise is a plan with priorities: the groups held, in priority
// order, and those that float.
type Compromise struct {
	Solution *Solution
	Held     []string
	Floating []Floating
}

// Compromise holds the priority groups in order, each if it can hold
// together with the plan's requirements and the groups already held, and
// lets the rest float. For each floating group it reports its ratio and,
// given the prototype's variable values (by symbol), its prototype and
// model values and the threshold check. The plan's own requirements must
// be consistent.
func (pl *Plan) Compromise(prototype map[string]quantity.Quantity, groups ...Priority) (*Compromise, error) {
	if pl.err != nil {
		return nil, pl.err
	}
	work := &Plan{prob: pl.prob, vars: pl.vars, cons: append([]constraint(nil), pl.cons...), basis: pl.basis, fluid: pl.fluid}
	if _, ok, err := work.solveSubset(allIndices(len(work.cons))); err != nil {
		return nil, err
	} else if !ok {
		return nil, work.conflict()
	}
	c := &Compromise{}
	var floating []Priority
	for _, g := range groups {
		try := &Plan{prob: work.prob, vars: work.vars, cons: append([]constraint(nil), work.cons...), basis: work.basis, fluid: work.fluid}
		try.Hold(g.Group)
		if try.err != nil {
			return nil, try.err
		}
		if _, ok, err := try.solveSubset(allIndices(len(try.cons))); err != nil {
			return nil, err
		} else if ok {
			work = try
			c.Held = append(c.Held, try.cons[len(try.cons)-1].label)
		} else {
			floating = append(floating, g)
		}
	}
	s, err := work.Solve()
	if err != nil {
		return nil, err
	}
	c.Solution = s
	for _, g := range floating {
		label, exps := conventional(g.Group)
		ratio := Ratio{Law: s.groupLaw(exps)}
		ratio.Value = ratio.Law.Eval(s.values)
		f := Floating{Label: label, Ratio: ratio, MinModel: g.MinModel, Prototype: math.NaN(), Model: math.NaN()}
		if v, ok := groupValue(pl.vars, exps, prototype); ok {
			f.Prototype = v
			f.Model = v * f.Ratio.Value
		}
		f.Meets = g.MinModel == 0 || f.Model >= g.MinModel
		c.Floating = append(c.Floating, f)
	}
	return c, nil
}

// conventional returns a group's label and exponents in the named
// group's conventional orientation (pigroups.Group.Conventional), so that
// values and thresholds read as the trade writes them: Re, not 1/Re.
func conventional(g pigroups.Group) (string, []quantity.Rat) {
	c := g.Conventional()
	if len(c.Matches) == 0 {
		return c.String(), []quantity.Rat(c.Exponents())
	}
	return c.Matches[0].Label() + " (" + c.Matches[0].Name + ")", []quantity.Rat(c.Exponents())
}

// groupValue evaluates ∏ xᵢ^eᵢ from values by symbol, checking dimensions.
func groupValue(vars []pigroups.Variable, exps []quantity.Rat, values map[string]quantity.Quantity) (float64, bool) {
	lv := 0.0
	for i, e := range exps {
		if e.IsZero() {
			continue
		}
		q, ok := values[vars[i].Symbol]
		if !ok || q.Dim() != vars[i].Dim || !(q.Value() > 0) {
			return 0, false
		}
		lv += e.Float() * math.Log(q.Value())
	}
	return math.Exp(lv), true
}

// String summarises the compromise.
func (c *Compromise) String() string {
	s := "held:"
	for _, h := range c.Held {
		s += " " + h + ";"
	}
	for _, f := range c.Floating {
		s += fmt.Sprintf(" floating %s with ratio %s", f.Label, f.Ratio)
		if !math.IsNaN(f.Model) {
			s += fmt.Sprintf(", model %.4g (prototype %.4g)", f.Model, f.Prototype)
		}
		if f.MinModel > 0 {
			if f.Meets {
				s += fmt.Sprintf(", above %.3g", f.MinModel)
			} else {
				s += fmt.Sprintf(", BELOW the threshold %.3g", f.MinModel)
			}
		}
		s += ";"
	}
	return s
}
