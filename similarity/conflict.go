package similarity

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
	"sync"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// ErrConflict is the class of a *PlanError reporting requirements that
// cannot all hold; its Conflict says which and how to resolve it.
var ErrConflict = errors.New("requirements conflict")

// Conflict is a set of requirements that cannot all hold, as the
// *PlanError of class ErrConflict that Solve returns carries it; ConflictOf
// gets it from an error.
type Conflict struct {
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
	// Notes say, where it can be told, what the remedy would ask of the
	// model fluid or the facility, and whether anything can give it: a
	// changed gravity, a fluid denser than any liquid, the kinematic
	// viscosity the model fluid would need beside real fluids'. The
	// fluid's are given when the plan knows the prototype fluid
	// (FixFluids); NewReport adds them from its Prototype values.
	Notes []string

	sol   *Solution // the plan solved without the dropped requirement
	fluid bool      // the dropped requirement fixed a fluid property
}

// String writes the remedy in words: "without the Reynolds number: the
// Reynolds number would float, Re model/prototype = λ_L^(3/2) = 0.0156",
// followed by its notes.
func (r Remedy) String() string {
	s := "without " + r.Drop + ": " + strings.Join(r.Needs, "; ")
	if len(r.Notes) > 0 {
		s += " — " + strings.Join(r.Notes, "; ")
	}
	return s
}

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

// String says what the conflict forces and, for each remedy, what
// dropping its requirement gives.
func (c *Conflict) String() string {
	var sb strings.Builder
	sb.WriteString(c.Summary)
	for _, r := range c.Remedies {
		fmt.Fprintf(&sb, "; %s", r)
	}
	return sb.String()
}

// ConflictOf returns the Conflict an error reports, or nil when it
// reports none.
func ConflictOf(err error) *Conflict {
	var pe *PlanError
	if errors.As(err, &pe) {
		return pe.Conflict
	}
	return nil
}

// conflictError returns the *PlanError of class ErrConflict reporting c.
func conflictError(c *Conflict) *PlanError {
	return &PlanError{Op: "Solve", Class: ErrConflict, Reason: "requirements conflict: " + c.String(), Conflict: c}
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
	e := &Conflict{}
	if minimal == nil {
		e.Summary = "the requirements are inconsistent"
		return conflictError(e)
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
		r := Remedy{Drop: pl.cons[ci].label, sol: s}
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
			r.fluid = pl.fixesFluid(c)
			r.Notes = s.gravityNotes()
			if r.fluid {
				r.Notes = append(r.Notes, s.fluidNotes(pl.fluid)...)
			}
		}
		e.Remedies = append(e.Remedies, r)
	}
	return conflictError(e)
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
	isParam := len(l.Terms) == 1 && l.Terms[0].Name == sym && l.Terms[0].Exp == quantity.RatInt(1)
	return Outcome{Label: "λ_" + sym, Ratio: Ratio{Law: l, Value: l.Eval(s.values)}, One: l.IsOne(), Free: isParam && math.IsNaN(l.Eval(s.values))}
}

// Reference values for the notes on a remedy's fluid.
const (
	// densestLiquid: mercury at 20 °C, about 13 546 kg/m³, the densest
	// liquid at room temperature (from memory; CRC Handbook of Chemistry
	// and Physics).
	densestLiquid = 13546.0
	// waterDensity: fresh water at 20 °C, 998.2 kg/m³ (IAPWS-95, computed
	// with Debian's python3-iapws: 998.207).
	waterDensity = 998.2
	// lowestPracticalNu: practical test liquids reach down to a few
	// ×10⁻⁷ m²/s (common practice); a model fluid needing less has none
	// to use. Water at 80 °C and 101.325 kPa has 3.64e-7 m²/s (IAPWS-95
	// density, IAPWS 2008 viscosity, computed with Debian's
	// python3-iapws).
	lowestPracticalNu = 2e-7
)

// water20Nu is the kinematic viscosity of fresh water at 20 °C and
// 101.325 kPa, from the fluids package (IAPWS 2008 viscosity): about
// 1.0e-6 m²/s.
var water20Nu = sync.OnceValue(func() float64 {
	w, err := fluids.FreshWater().AtCelsius(20)
	if err != nil {
		return math.NaN()
	}
	return w.DynamicViscosity.Value() / w.Density.Value()
})

// air20Nu is the kinematic viscosity of dry air at 20 °C and 101.325 kPa,
// from the fluids package (ideal gas, Sutherland viscosity): about
// 1.5e-5 m²/s.
var air20Nu = sync.OnceValue(func() float64 {
	a, err := fluids.Air().At(quantity.New(293.15, quantity.Temperature), quantity.New(101325, quantity.Pressure))
	if err != nil {
		return math.NaN()
	}
	return a.DynamicViscosity.Value() / a.Density.Value()
})

// realFluids compares a kinematic viscosity with water's and air's.
func realFluids() string {
	return fmt.Sprintf("water at 20 °C has %.2e m²/s, air at 20 °C and 101.325 kPa %.2e m²/s", water20Nu(), air20Nu())
}

// fixesFluid reports whether constraint c fixes a fluid property: the
// ratio of a density or a viscosity.
func (pl *Plan) fixesFluid(c constraint) bool {
	for _, i := range c.vars {
		switch pl.vars[i].Dim {
		case quantity.Density, quantity.DynamicViscosity, quantity.KinematicViscosity:
			return true
		}
	}
	return false
}

// gravityNotes notes a gravity ratio other than 1.
func (s *Solution) gravityNotes() []string {
	var notes []string
	for i, v := range s.plan.vars {
		if v.Dim != quantity.Acceleration || !s.plan.isGravity(i) {
			continue
		}
		l := lawOf(s.coef[i], s.params)
		if l.IsOne() {
			continue
		}
		notes = append(notes, fmt.Sprintf("λ_%s ≠ 1 cannot be met: no tank, flume or tunnel changes gravity (common practice; only a centrifuge raises it)", v.Symbol))
	}
	return notes
}

// isGravity reports whether variable i is the acceleration of gravity:
// its symbol is g or its kind names gravity.
func (pl *Plan) isGravity(i int) bool {
	if pl.vars[i].Symbol == "g" {
		return true
	}
	kinds, _ := pl.prob.Kinds(i)
	for _, k := range kinds {
		if strings.Contains(k, "gravit") {
			return true
		}
	}
	return false
}

// varOfDim returns the first variable of dimension d, or −1.
func (pl *Plan) varOfDim(d quantity.Dim) int {
	for i, v := range pl.vars {
		if v.Dim == d {
			return i
		}
	}
	return -1
}

// nuLaw returns the law of the model/prototype kinematic-viscosity ratio:
// that of a kinematic-viscosity variable, or μ/ρ of a dynamic-viscosity
// and a density variable; false when the plan has neither.
func (s *Solution) nuLaw() (Law, bool) {
	pl := s.plan
	if i := pl.varOfDim(quantity.KinematicViscosity); i >= 0 {
		return lawOf(s.coef[i], s.params), true
	}
	ir, im := pl.varOfDim(quantity.Density), pl.varOfDim(quantity.DynamicViscosity)
	if ir < 0 || im < 0 {
		return Law{}, false
	}
	v := make([]quantity.Rat, len(pl.vars))
	v[ir], v[im] = quantity.RatInt(-1), quantity.RatInt(1)
	return s.groupLaw(v), true
}

// fluidNotes notes, for a known prototype fluid, a model density above any
// liquid's and the model kinematic viscosity needed, beside water's and
// the lowest of practical test liquids.
func (s *Solution) fluidNotes(pf protoFluid) []string {
	var notes []string
	if i := s.plan.varOfDim(quantity.Density); i >= 0 {
		l := lawOf(s.coef[i], s.params)
		v := l.Eval(s.values)
		switch {
		case l.IsOne() || math.IsNaN(v):
		case pf.rho > 0 && v*pf.rho > densestLiquid:
			notes = append(notes, fmt.Sprintf("the model fluid would need a density of %.0f kg/m³, %.3g times the prototype's: no liquid is that dense (mercury, the densest at room temperature, has about 13 546 kg/m³)", v*pf.rho, v))
		case pf.rho == 0 && v*waterDensity > densestLiquid:
			notes = append(notes, fmt.Sprintf("the model fluid would need %.3g times the prototype's density: with a prototype in water no liquid meets it (mercury, the densest at room temperature, is about %.1f times as dense as water)", v, densestLiquid/waterDensity))
		}
	}
	if l, ok := s.nuLaw(); ok && pf.nu == 0 && !l.IsOne() {
		// The prototype fluid is unknown: say what a prototype in water
		// would ask, the common case of tanks and flumes.
		if v := l.Eval(s.values); !math.IsNaN(v) && v*water20Nu() < lowestPracticalNu {
			notes = append(notes, fmt.Sprintf("ν_m/ν_p = %.4g: with a prototype in water at 20 °C (%.2e m²/s) the model fluid would need %.2e m²/s, below every practical test liquid, which reach down to a few ×10⁻⁷ m²/s (common practice)", v, water20Nu(), v*water20Nu()))
		}
	}
	if l, ok := s.nuLaw(); ok && pf.nu > 0 && !l.IsOne() {
		if v := l.Eval(s.values); !math.IsNaN(v) {
			nu := v * pf.nu
			n := fmt.Sprintf("the model fluid would need a kinematic viscosity of %.2e m²/s (ν_m/ν_p = %.4g, prototype %.2e m²/s; %s)", nu, v, pf.nu, realFluids())
			if nu < lowestPracticalNu {
				n += ": below every practical test liquid, which reach down to a few ×10⁻⁷ m²/s (common practice)"
			}
			notes = append(notes, n)
		}
	}
	return notes
}

// fluidNotes says what the remedy asks of the model fluid, from the
// prototype's values by symbol, when the plan did not know its fluid.
func (r Remedy) fluidNotes(prototype map[string]quantity.Quantity) []string {
	if r.sol == nil || !r.fluid || r.sol.plan.fluid != (protoFluid{}) {
		return nil
	}
	pf := r.sol.plan.prototypeFluid(prototype)
	return r.sol.fluidNotes(pf)
}

// holdNotes says, for each floating group that the fluid enters only
// through its kinematic viscosity (Re, with ρ/μ or 1/ν), which model
// kinematic viscosity would hold it at the plan's scale and speed, beside
// water's and the lowest of practical test liquids; pf is the prototype
// fluid.
func (s *Solution) holdNotes(pf protoFluid) []string {
	if pf.nu <= 0 {
		return nil
	}
	set, err := s.plan.prob.DefaultSet()
	if err != nil {
		return nil
	}
	pl := s.plan
	ir, im, in := pl.varOfDim(quantity.Density), pl.varOfDim(quantity.DynamicViscosity), pl.varOfDim(quantity.KinematicViscosity)
	nuLaw, ok := s.nuLaw()
	if !ok {
		return nil
	}
	lambdaNu := nuLaw.Eval(s.values)
	dep := pl.prob.DependentIndex()
	var notes []string
	for _, g := range set.Groups() {
		g = g.Conventional()
		exps := g.Exponents()
		if dep >= 0 && !exps[dep].IsZero() {
			continue
		}
		// a is the group's exponent of ν: the fluid must enter through ν
		// alone.
		var a quantity.Rat
		switch {
		case in >= 0 && (ir < 0 || exps[ir].IsZero()) && (im < 0 || exps[im].IsZero()):
			a = exps[in]
		case in < 0 && ir >= 0 && im >= 0 && exps[im] == exps[ir].Neg():
			a = exps[im]
		}
		l := s.groupLaw(exps)
		r := l.Eval(s.values)
		if a.IsZero() || l.IsOne() || math.IsNaN(r) || math.IsNaN(lambdaNu) {
			continue
		}
		nu := pf.nu * lambdaNu * math.Pow(r, -1/a.Float())
		if !(nu > 0) || math.IsInf(nu, 0) {
			continue
		}
		name := s.groupRatio(g).Symbol
		n := fmt.Sprintf("to hold %s as well at this scale and speed, the model fluid would need a kinematic viscosity of %.2e m²/s (it has %.2e m²/s; %s)", name, nu, pf.nu*lambdaNu, realFluids())
		if nu < lowestPracticalNu {
			n += ": below every practical test liquid, which reach down to a few ×10⁻⁷ m²/s (common practice)"
		}
		notes = append(notes, n)
	}
	return notes
}

// prototypeFluid returns the prototype fluid from values by symbol, or
// the plan's own from FixFluids.
func (pl *Plan) prototypeFluid(prototype map[string]quantity.Quantity) protoFluid {
	if pl.fluid != (protoFluid{}) {
		return pl.fluid
	}
	var pf protoFluid
	val := func(d quantity.Dim) float64 {
		if i := pl.varOfDim(d); i >= 0 {
			if q, ok := prototype[pl.vars[i].Symbol]; ok && q.Dim() == d && q.Value() > 0 && !math.IsInf(q.Value(), 0) {
				return q.Value()
			}
		}
		return 0
	}
	pf.rho = val(quantity.Density)
	if pf.nu = val(quantity.KinematicViscosity); pf.nu == 0 && pf.rho > 0 {
		if mu := val(quantity.DynamicViscosity); mu > 0 {
			pf.nu = mu / pf.rho
		}
	}
	return pf
}
