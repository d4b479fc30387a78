package pigroups

import (
	"fmt"
	"slices"
	"strings"
	"sync"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
)

// tradeKinds are kinds of quantity the fluids and heat-transfer trade
// names beyond those of package quantity; each is a specific use of a
// dimension.
var tradeKinds = map[string]quantity.Dim{
	"speed of sound":              quantity.Velocity,
	"gravitational acceleration":  quantity.Acceleration,
	"pressure difference":         quantity.Pressure,
	"vapour pressure":             quantity.Pressure,
	"bulk modulus":                quantity.Pressure,
	"temperature difference":      quantity.Temperature,
	"buoyancy":                    quantity.Acceleration, // g·β·ΔT as one variable
	"mean free path":              quantity.Length,
	"area":                        quantity.Area,
	"rotational speed":            quantity.AngularVelocity,
	"Coriolis parameter":          quantity.AngularVelocity,
	"mass transfer coefficient":   quantity.Velocity,
	"density difference":          quantity.Density,
	"specific energy":             quantity.SpecificEnergy,
	"force":                       quantity.Force,
	"torque":                      quantity.Torque,
	"power":                       quantity.Power,
	"volume flow rate":            quantity.VolumeFlowRate,
	"thermal conductivity":        quantity.ThermalConductivity,
	"heat transfer coefficient":   quantity.HeatTransferCoefficient,
	"specific heat capacity":      quantity.SpecificHeatCapacity,
	"cubic expansion coefficient": quantity.ThermalExpansion,
	"thermal diffusivity":         quantity.ThermalDiffusivity,
	"diffusion coefficient":       quantity.KinematicViscosity,
	"kinematic viscosity":         quantity.KinematicViscosity,
	"dynamic viscosity":           quantity.DynamicViscosity,
	"surface tension":             quantity.SurfaceTension,
	"density":                     quantity.Density,
	"velocity":                    quantity.Velocity,
	"length":                      quantity.Length,
	"frequency":                   quantity.Frequency,
	"angular velocity":            quantity.AngularVelocity,
	"pressure":                    quantity.Pressure,
	"acceleration":                quantity.Acceleration,
}

// explicitOnly are kinds a variable must be given explicitly to match:
// a length is not assumed to be a mean free path, nor a velocity a speed
// of sound, nor a pressure a bulk modulus.
var explicitOnly = map[string]bool{"mean free path": true, "speed of sound": true, "bulk modulus": true, "Coriolis parameter": true}

// synonyms are kinds of package quantity left out of inference because a
// preferred name covers them.
var synonyms = map[string]bool{"stress": true, "work": true, "entropy": true}

// KindDim returns the dimension of a kind of quantity known to pigroups:
// the kinds of package quantity and the trade's own (speed of sound,
// gravitational acceleration, vapour pressure, temperature difference,
// mean free path, …).
func KindDim(name string) (quantity.Dim, bool) {
	if d, ok := tradeKinds[name]; ok {
		return d, true
	}
	for k, d := range tradeKinds {
		if strings.EqualFold(k, name) {
			return d, true
		}
	}
	return quantity.KindDim(name)
}

// InferKinds returns the kinds of quantity a dimension can mean, for a
// variable given without a kind: one name when that is unambiguous
// (density), several when it is not (L² T⁻¹: kinematic viscosity, thermal
// diffusivity or diffusion coefficient), none when no kind is known.
func InferKinds(d quantity.Dim) []string { return slices.Clone(inferKinds(d)) }

var inferCache sync.Map // quantity.Dim → []string, read-only once stored

func inferKinds(d quantity.Dim) []string {
	if v, ok := inferCache.Load(d); ok {
		return v.([]string)
	}
	var out []string
	for _, n := range quantity.KindNames(d) {
		if !synonyms[n] {
			out = append(out, n)
		}
	}
	inferCache.Store(d, out)
	return out
}

func candidateKinds(v Variable) ([]string, error) {
	if v.Kind == "" {
		return inferKinds(v.Dim), nil // shared, never modified
	}
	d, ok := KindDim(v.Kind)
	if !ok {
		return nil, &ProblemError{Err: ErrUnknownKind, Symbol: v.Symbol, Reason: fmt.Sprintf("kind %q", v.Kind)}
	}
	if d != v.Dim {
		return nil, &ProblemError{Err: ErrKindDimension, Symbol: v.Symbol, Reason: fmt.Sprintf("a %s has dimension %s, the variable %s", v.Kind, d, v.Dim)}
	}
	return []string{v.Kind}, nil
}

// Named is a named dimensionless group of the trade, defined by the kinds
// of quantity it combines and their exponents.
type Named struct {
	Name     string // "Reynolds number"
	Symbol   string // "Re"
	Relation string // how it follows from others, if it does ("Gr·Pr")
	// Forms lists the definitions, each a product of kinds to powers; a
	// group matches a form when its variables' kinds match with all
	// exponents one common power of the form's.
	Forms [][]KindPower
}

// KindPower is one factor of a named group's definition.
type KindPower struct {
	Kind string
	Exp  exact.Rat
}

func kp(kind string, n, d int64) KindPower { return KindPower{kind, exact.Frac(n, d)} }

// catalogue of named groups. Definitions are those of ISO 80000-11
// (characteristic numbers) where it gives one, otherwise common practice;
// numerical factors (½ in coefficients) do not change the exponents.
var catalogue = []Named{
	{Name: "Reynolds number", Symbol: "Re", Forms: [][]KindPower{
		{kp("density", 1, 1), kp("velocity", 1, 1), kp("length", 1, 1), kp("dynamic viscosity", -1, 1)},
		{kp("velocity", 1, 1), kp("length", 1, 1), kp("kinematic viscosity", -1, 1)},
	}},
	{Name: "Froude number", Symbol: "Fr", Forms: [][]KindPower{
		{kp("velocity", 1, 1), kp("gravitational acceleration", -1, 2), kp("length", -1, 2)},
	}},
	{Name: "Mach number", Symbol: "Ma", Forms: [][]KindPower{
		{kp("velocity", 1, 1), kp("speed of sound", -1, 1)},
	}},
	{Name: "Weber number", Symbol: "We", Forms: [][]KindPower{
		{kp("density", 1, 1), kp("velocity", 2, 1), kp("length", 1, 1), kp("surface tension", -1, 1)},
	}},
	{Name: "Euler number", Symbol: "Eu", Forms: [][]KindPower{
		{kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)},
	}},
	{Name: "cavitation number", Symbol: "σ", Forms: [][]KindPower{
		{kp("vapour pressure", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)},
		{kp("pressure", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)},
	}},
	{Name: "pressure coefficient", Symbol: "C_p", Forms: [][]KindPower{
		{kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)},
	}},
	{Name: "loss coefficient", Symbol: "K", Forms: [][]KindPower{
		{kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)},
	}},
	{Name: "Strouhal number", Symbol: "St", Forms: [][]KindPower{
		{kp("frequency", 1, 1), kp("length", 1, 1), kp("velocity", -1, 1)},
	}},
	{Name: "Cauchy number", Symbol: "Ca", Forms: [][]KindPower{
		{kp("density", 1, 1), kp("velocity", 2, 1), kp("bulk modulus", -1, 1)},
	}},
	{Name: "Prandtl number", Symbol: "Pr", Forms: [][]KindPower{
		{kp("dynamic viscosity", 1, 1), kp("specific heat capacity", 1, 1), kp("thermal conductivity", -1, 1)},
		{kp("kinematic viscosity", 1, 1), kp("thermal diffusivity", -1, 1)},
	}},
	{Name: "Nusselt number", Symbol: "Nu", Forms: [][]KindPower{
		{kp("heat transfer coefficient", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)},
	}},
	{Name: "Biot number", Symbol: "Bi", Forms: [][]KindPower{
		{kp("heat transfer coefficient", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)},
	}},
	{Name: "Grashof number", Symbol: "Gr", Forms: [][]KindPower{
		{kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -2, 1)},
		{kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("dynamic viscosity", -2, 1)},
		{kp("buoyancy", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -2, 1)},
		{kp("buoyancy", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("dynamic viscosity", -2, 1)},
	}},
	{Name: "Rayleigh number", Symbol: "Ra", Relation: "Gr·Pr", Forms: [][]KindPower{
		{kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -1, 1), kp("thermal diffusivity", -1, 1)},
		{kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("specific heat capacity", 1, 1), kp("dynamic viscosity", -1, 1), kp("thermal conductivity", -1, 1)},
	}},
	{Name: "Péclet number", Symbol: "Pe", Relation: "Re·Pr", Forms: [][]KindPower{
		{kp("velocity", 1, 1), kp("length", 1, 1), kp("thermal diffusivity", -1, 1)},
		{kp("density", 1, 1), kp("specific heat capacity", 1, 1), kp("velocity", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)},
	}},
	{Name: "Schmidt number", Symbol: "Sc", Forms: [][]KindPower{
		{kp("kinematic viscosity", 1, 1), kp("diffusion coefficient", -1, 1)},
		{kp("dynamic viscosity", 1, 1), kp("density", -1, 1), kp("diffusion coefficient", -1, 1)},
	}},
	{Name: "Sherwood number", Symbol: "Sh", Forms: [][]KindPower{
		{kp("mass transfer coefficient", 1, 1), kp("length", 1, 1), kp("diffusion coefficient", -1, 1)},
	}},
	{Name: "Stanton number", Symbol: "St_h", Relation: "Nu/(Re·Pr)", Forms: [][]KindPower{
		{kp("heat transfer coefficient", 1, 1), kp("density", -1, 1), kp("specific heat capacity", -1, 1), kp("velocity", -1, 1)},
	}},
	{Name: "Knudsen number", Symbol: "Kn", Forms: [][]KindPower{
		{kp("mean free path", 1, 1), kp("length", -1, 1)},
	}},
	{Name: "Rossby number", Symbol: "Ro", Forms: [][]KindPower{
		{kp("velocity", 1, 1), kp("Coriolis parameter", -1, 1), kp("length", -1, 1)},
	}},
	{Name: "Ekman number", Symbol: "Ek", Forms: [][]KindPower{
		{kp("kinematic viscosity", 1, 1), kp("Coriolis parameter", -1, 1), kp("length", -2, 1)},
	}},
	{Name: "Bond (Eötvös) number", Symbol: "Bo", Forms: [][]KindPower{
		{kp("density difference", 1, 1), kp("gravitational acceleration", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)},
		{kp("density", 1, 1), kp("gravitational acceleration", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)},
		{kp("specific weight", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)},
	}},
	{Name: "capillary number", Symbol: "Ca_σ", Forms: [][]KindPower{
		{kp("dynamic viscosity", 1, 1), kp("velocity", 1, 1), kp("surface tension", -1, 1)},
	}},
	{Name: "Richardson number", Symbol: "Ri", Forms: [][]KindPower{
		{kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 1, 1), kp("velocity", -2, 1)},
	}},
	{Name: "drag coefficient", Symbol: "C_D", Forms: [][]KindPower{
		{kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("area", -1, 1)},
		{kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)},
	}},
	{Name: "lift coefficient", Symbol: "C_L", Forms: [][]KindPower{
		{kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("area", -1, 1)},
		{kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)},
	}},
	{Name: "thrust coefficient", Symbol: "K_T", Forms: [][]KindPower{
		{kp("force", 1, 1), kp("density", -1, 1), kp("rotational speed", -2, 1), kp("length", -4, 1)},
	}},
	{Name: "torque coefficient", Symbol: "K_Q", Forms: [][]KindPower{
		{kp("torque", 1, 1), kp("density", -1, 1), kp("rotational speed", -2, 1), kp("length", -5, 1)},
	}},
	{Name: "power coefficient", Symbol: "C_P", Forms: [][]KindPower{
		{kp("power", 1, 1), kp("density", -1, 1), kp("rotational speed", -3, 1), kp("length", -5, 1)},
		{kp("power", 1, 1), kp("density", -1, 1), kp("velocity", -3, 1), kp("length", -2, 1)},
	}},
	{Name: "flow coefficient", Symbol: "φ", Forms: [][]KindPower{
		{kp("volume flow rate", 1, 1), kp("rotational speed", -1, 1), kp("length", -3, 1)},
	}},
	{Name: "head coefficient", Symbol: "ψ", Forms: [][]KindPower{
		{kp("specific energy", 1, 1), kp("rotational speed", -2, 1), kp("length", -2, 1)},
		{kp("gravitational acceleration", 1, 1), kp("length", 1, 1), kp("rotational speed", -2, 1), kp("length", -2, 1)},
	}},
	{Name: "specific speed", Symbol: "Ω_s", Relation: "φ^(1/2)/ψ^(3/4)", Forms: [][]KindPower{
		{kp("rotational speed", 1, 1), kp("volume flow rate", 1, 2), kp("specific energy", -3, 4)},
	}},
}

// compiledForm is a catalogue form with its kinds resolved.
type compiledForm struct {
	named *Named
	terms []compiledTerm
	// sig is the product of the terms' dimensions, each to the power one:
	// a cheap necessary condition for a match.
	sig   quantity.Dim
	sigOK bool
}

type compiledTerm struct {
	kind     string
	exp      exact.Rat
	dim      quantity.Dim
	known    bool
	explicit bool // must be given explicitly
}

var compiled = func() []compiledForm {
	var out []compiledForm
	for i := range catalogue {
		n := &catalogue[i]
		for _, f := range n.Forms {
			cf := compiledForm{named: n, sigOK: true}
			for _, t := range f {
				d, ok := KindDim(t.Kind)
				cf.terms = append(cf.terms, compiledTerm{kind: t.Kind, exp: t.Exp, dim: d, known: ok, explicit: explicitOnly[t.Kind]})
				var err error
				if cf.sig, err = cf.sig.Mul(d); err != nil {
					cf.sigOK = false
				}
			}
			out = append(out, cf)
		}
	}
	return out
}()

// Catalogue returns a copy of the named groups known to recognition.
func Catalogue() []Named { return slices.Clone(catalogue) }

// Match is a recognition of a group as a power of a named group.
type Match struct {
	Named
	// Power is the exponent p with group = Named^p: 1 for the group
	// itself, −1 for its inverse, 2 for its square.
	Power exact.Rat
	// Assumed lists the variables whose kind was taken from their
	// dimension to make the match ("a as speed of sound").
	Assumed []string
}

// Label writes the match as a power of the symbol: "Re", "1/Re", "Fr²",
// "Re^(1/2)".
func (m Match) Label() string {
	switch {
	case m.Power.Num == 1 && m.Power.Den == 1:
		return m.Symbol
	case m.Power.Num == -1 && m.Power.Den == 1:
		return "1/" + m.Symbol
	case m.Power.IsInt() && m.Power.Num > 0:
		return m.Symbol + expText(m.Power, Unicode)
	case m.Power.IsInt():
		return "1/" + m.Symbol + expText(m.Power.Neg(), Unicode)
	}
	return m.Symbol + "^(" + m.Power.String() + ")"
}

// Describe writes the match for a report: "1/Re (Reynolds number,
// inverted; conventional form Re)".
func (m Match) Describe() string {
	var sb strings.Builder
	sb.WriteString(m.Label())
	sb.WriteString(" (")
	sb.WriteString(m.Name)
	if m.Relation != "" {
		sb.WriteString(" = " + m.Relation)
	}
	if !(m.Power.Num == 1 && m.Power.Den == 1) {
		sb.WriteString("; conventional form " + m.Symbol)
	}
	if len(m.Assumed) > 0 {
		sb.WriteString("; taking " + strings.Join(m.Assumed, ", "))
	}
	sb.WriteString(")")
	return sb.String()
}

// recognise matches a group's exponents against the catalogue, best
// matches (fewest assumed kinds, lowest power) first.
func (p *Problem) recognise(exps []exact.Rat) []Match {
	var termBuf [16]int
	terms := termBuf[:0]
	for i, e := range exps {
		if !e.IsZero() {
			terms = append(terms, i)
		}
	}
	var sig quantity.Dim
	sigOK := true
	for _, i := range terms {
		var err error
		if sig, err = sig.Mul(p.vars[i].Dim); err != nil {
			sigOK = false
		}
	}
	var out []Match
	var last *Named
	for fi := range compiled {
		f := &compiled[fi]
		if len(f.terms) != len(terms) || f.named == last || sigOK && f.sigOK && sig != f.sig || !p.sameDims(f, terms) {
			continue
		}
		if m, ok := p.matchForm(f, terms, exps); ok {
			out = append(out, m)
			last = f.named // one match per named group
		}
	}
	slices.SortStableFunc(out, func(a, b Match) int {
		if d := len(a.Assumed) - len(b.Assumed); d != 0 {
			return d
		}
		return absCmp(a.Power, b.Power)
	})
	return out
}

// sameDims reports whether the group's variables and the form's kinds
// have the same multiset of dimensions, which every match needs.
func (p *Problem) sameDims(f *compiledForm, terms []int) bool {
	var used [16]bool
	for _, i := range terms {
		found := false
		for k, t := range f.terms {
			if !used[k] && t.known && t.dim == p.vars[i].Dim {
				used[k], found = true, true
				break
			}
		}
		if !found {
			return false
		}
	}
	return true
}

func absCmp(a, b exact.Rat) int {
	if a.Sign() < 0 {
		a = a.Neg()
	}
	if b.Sign() < 0 {
		b = b.Neg()
	}
	return a.Cmp(b)
}

// matchForm tries every assignment of the group's variables to the form's
// factors, with one common power.
func (p *Problem) matchForm(f *compiledForm, terms []int, exps []exact.Rat) (Match, bool) {
	var used [16]bool
	var best *Match
	var rec func(k int, power exact.Rat, havePower bool, assumed []string)
	rec = func(k int, power exact.Rat, havePower bool, assumed []string) {
		if k == len(terms) {
			if best == nil || len(assumed) < len(best.Assumed) {
				best = &Match{Named: *f.named, Power: power, Assumed: slices.Clone(assumed)}
			}
			return
		}
		i := terms[k]
		v := p.vars[i]
		for fi, fp := range f.terms {
			if used[fi] || fp.dim != v.Dim {
				continue
			}
			explicit := slices.Contains(p.kinds[i], fp.kind)
			if !explicit && (v.Kind != "" || !fp.known || fp.explicit) {
				continue
			}
			pw, err := exps[i].Div(fp.exp)
			if err != nil || havePower && pw != power {
				continue
			}
			used[fi] = true
			a := assumed
			if !explicit {
				a = append(slices.Clone(assumed), v.Symbol+" as "+fp.kind)
			}
			rec(k+1, pw, true, a)
			used[fi] = false
		}
	}
	rec(0, exact.Rat{}, false, nil)
	if best == nil {
		return Match{}, false
	}
	return *best, true
}
