package pigroups

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

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
	"resistance":                  quantity.Force, // a hull's or body's total resistance (drag) in the towing-tank sense
	"drag":                        quantity.Force, // the drag of a body in a stream: C_D, not C_L nor C_T
	"wetted surface":              quantity.Area,
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
var explicitOnly = map[string]bool{"mean free path": true, "speed of sound": true, "bulk modulus": true, "Coriolis parameter": true, "buoyancy": true,
	"resistance": true, "wetted surface": true, "drag": true}

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
func InferKinds(d quantity.Dim) []string { return slices.Clone(*inferKinds(d)) }

// inferSlot is one entry of inferKnown.
type inferSlot struct {
	d     quantity.Dim
	kinds []string
	used  bool
}

// inferKnown holds the inferred kinds of every dimension a kind of
// package quantity or of the trade has, found once, in an open-addressed
// table read without locking or hashing a map key: a problem's variables
// each look theirs up.
var inferKnown = func() *[512]inferSlot {
	var t [512]inferSlot
	n := 0
	add := func(d quantity.Dim) {
		if n++; n > len(t)/2 {
			panic("pigroups: more kinds' dimensions than inferKnown holds at half load")
		}
		for h := inferHash(d); ; h = (h + 1) % len(t) {
			if !t[h].used {
				t[h] = inferSlot{d: d, kinds: kindsOf(d), used: true}
				return
			}
			if t[h].d == d {
				return
			}
		}
	}
	for _, k := range quantity.Kinds() {
		add(k.Dim)
	}
	for _, d := range tradeKinds {
		add(d)
	}
	return &t
}()

// inferHash places a dimension in inferKnown (Fibonacci hashing).
func inferHash(d quantity.Dim) int { return int(uint64(d) * 0x9E3779B97F4A7C15 >> (64 - 9)) }

// noKinds is the shared empty list of a dimension no kind has.
var noKinds []string

// inferKinds returns the kinds a dimension can mean, shared and never
// modified: a pointer, so that a problem's variables hold one word each.
func inferKinds(d quantity.Dim) *[]string {
	for h := inferHash(d); inferKnown[h].used; h = (h + 1) % len(inferKnown) {
		if inferKnown[h].d == d {
			return &inferKnown[h].kinds
		}
	}
	// Every dimension a kind has is in inferKnown, so another has none;
	// nothing is kept per dimension a caller passes, so memory does not
	// grow with the input.
	if out := kindsOf(d); len(out) > 0 {
		return &out
	}
	return &noKinds
}

// kindsOf returns the kinds of package quantity a dimension can mean,
// synonyms left out.
func kindsOf(d quantity.Dim) []string {
	var out []string
	for _, n := range quantity.KindNames(d) {
		if !synonyms[n] {
			out = append(out, n)
		}
	}
	return out
}

// checkKind checks a variable's kind, if it has one: known, and of the
// variable's dimension.
func checkKind(v Variable) error {
	if v.Kind == "" {
		return nil
	}
	d, ok := KindDim(v.Kind)
	if !ok {
		return &Error{Op: OpProblem, Kind: ErrUnknownKind, Symbol: v.Symbol, Reason: fmt.Sprintf("kind %q", v.Kind),
			Hint: unknownKindHint(v.Dim)}
	}
	if d != v.Dim {
		return &Error{Op: OpProblem, Kind: ErrKindDimension, Symbol: v.Symbol, Reason: fmt.Sprintf("a %s has dimension %s, the variable %s", v.Kind, d, v.Dim)}
	}
	return nil
}

// KindsOfDim returns every kind of quantity known to pigroups with
// dimension d: those InferKinds gives, then the trade's kinds of that
// dimension a variable must be given explicitly (resistance, mean free
// path, …), each once.
func KindsOfDim(d quantity.Dim) []string {
	out := InferKinds(d)
	var more []string
	for k, kd := range tradeKinds {
		if kd == d && !slices.Contains(out, k) {
			more = append(more, k)
		}
	}
	slices.Sort(more)
	return append(out, more...)
}

// unknownKindHint names the known kinds of a variable's dimension and the
// fix, for an unknown kind.
func unknownKindHint(d quantity.Dim) string {
	known := KindsOfDim(d)
	if len(known) == 0 {
		return fmt.Sprintf("no kind of dimension %s is known; leave the kind out, and the variable is taken by its dimension alone", d)
	}
	return fmt.Sprintf("the kinds known for dimension %s are %s; give one of them, or leave the kind out to take it from the dimension", d, strings.Join(known, ", "))
}

// Named is a named dimensionless group of the trade, defined by the kinds
// of quantity it combines, their exponents, and the numerical factor and
// conventions of its definition.
type Named struct {
	Name     string // "Reynolds number"
	Symbol   string // "Re"
	Relation string // how it follows from others, if it does ("Gr·Pr")
	// Definition is the trade's definition as written, with its
	// conventions: "C_D = F/(½·ρ·V²·A)", "K_T = T/(ρ·n²·D⁴), n in
	// revolutions per second".
	Definition string
	// Coef is the numerical factor of the definition over the product of
	// its kinds: 2 for C_D = F/(½ρV²A), 1 for Re.
	Coef quantity.Rat
	// Revolutions is true when a rotational speed enters the definition
	// in revolutions per second (K_T, K_Q, J and the turbomachine
	// coefficients, common practice); otherwise it enters in radians per
	// second (ωR/V), which is the value a Quantity of angular velocity
	// holds, since the SI makes the radian the number one. A variable of
	// the kind "rotational speed" always holds rad/s; the factor 2π per
	// power is applied where the definition needs revolutions.
	Revolutions bool
	// Forms lists the definitions, each a product of kinds to powers; a
	// group matches a form when its variables' kinds match with all
	// exponents one common power of the form's.
	Forms []Form
	// Alternative, when set, is the named group the same product is when
	// one of its variables has a narrower kind than the one inferred (a
	// force that is a hull's resistance gives C_T, not C_D); a match of a
	// form with a stand-in (only proportional) says both when that
	// variable was given no kind.
	Alternative *Alternative
}

// Alternative is another named group a product of a form is, for a
// variable of a narrower kind.
type Alternative struct {
	Of     string // the form's kind the variable is inferred as ("force")
	Kind   string // the narrower kind ("resistance")
	Symbol string // the other group's symbol ("C_T")
	When   string // when it applies ("a hull's resistance")
	// Exact, when set, applies the alternative to every form; otherwise
	// only to a form with a stand-in, which is only proportional anyway.
	Exact bool
}

// Form is one way of writing a named group as a product of kinds of
// quantity.
type Form struct {
	// Factors is the product, each factor named by a kind of quantity
	// ("density") and raised to an exact power.
	Factors quantity.Product
	// Proxy, when set, is the factor of this form that stands in for a
	// reference quantity of the definition (a length squared in place of
	// the reference area A), so a group of this form is proportional to
	// the named group, not equal to it.
	Proxy *Proxy
}

// Proxy describes a stand-in for a reference quantity: the form's factor
// (its Factor: a kind to a power, length^−2) takes the place of the
// definition's Ref (A^−1).
type Proxy struct {
	quantity.Factor                 // the stand-in: {Name: "length", Exp: −2}
	Ref             quantity.Factor // what it stands in for: {Name: "A", Exp: −1}
	What            string          // "the reference area"
}

func kp(kind string, n, d int64) quantity.Factor {
	return quantity.Factor{Name: kind, Exp: quantity.MustRat(n, d)}
}

func form(f ...quantity.Factor) Form { return Form{Factors: f} }

// areaProxy is the form with L² standing in for a reference area.
func areaProxy(f ...quantity.Factor) Form {
	return Form{Factors: f, Proxy: &Proxy{Factor: kp("length", -2, 1), Ref: quantity.Factor{Name: "A", Exp: quantity.RatInt(-1)}, What: "the reference area"}}
}

var one, two = quantity.RatInt(1), quantity.RatInt(2)

// catalogue of named groups. Definitions are those of ISO 80000-11
// (characteristic numbers) where it gives one, otherwise common practice,
// as the Definition of each states; the numerical factor (2 for a
// coefficient over ½ρV²) and the rotational-speed convention are part of
// each entry.
var catalogue = []Named{
	{Name: "Reynolds number", Symbol: "Re", Coef: one, Definition: "Re = ρ·V·L/μ = V·L/ν (ISO 80000-11)", Forms: []Form{
		form(kp("density", 1, 1), kp("velocity", 1, 1), kp("length", 1, 1), kp("dynamic viscosity", -1, 1)),
		form(kp("velocity", 1, 1), kp("length", 1, 1), kp("kinematic viscosity", -1, 1)),
	}},
	{Name: "Froude number", Symbol: "Fr", Coef: one, Definition: "Fr = V/√(g·L) (ISO 80000-11)", Forms: []Form{
		form(kp("velocity", 1, 1), kp("gravitational acceleration", -1, 2), kp("length", -1, 2)),
	}},
	{Name: "Mach number", Symbol: "Ma", Coef: one, Definition: "Ma = V/a", Forms: []Form{
		form(kp("velocity", 1, 1), kp("speed of sound", -1, 1)),
	}},
	{Name: "Weber number", Symbol: "We", Coef: one, Definition: "We = ρ·V²·L/σ (ISO 80000-11)", Forms: []Form{
		form(kp("density", 1, 1), kp("velocity", 2, 1), kp("length", 1, 1), kp("surface tension", -1, 1)),
	}},
	{Name: "Euler number", Symbol: "Eu", Coef: one, Definition: "Eu = Δp/(ρ·V²) (ISO 80000-11)", Forms: []Form{
		form(kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)),
	}},
	{Name: "cavitation number", Symbol: "σ", Coef: two, Definition: "σ = (p − p_v)/(½·ρ·V²), p − p_v the pressure above vapour pressure", Forms: []Form{
		form(kp("vapour pressure", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)),
		form(kp("pressure", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)),
	}},
	{Name: "pressure coefficient", Symbol: "C_p", Coef: two, Definition: "C_p = Δp/(½·ρ·V²)", Forms: []Form{
		form(kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)),
	}},
	{Name: "loss coefficient", Symbol: "K", Coef: two, Definition: "K = Δp/(½·ρ·V²)", Forms: []Form{
		form(kp("pressure difference", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1)),
	}},
	{Name: "Strouhal number", Symbol: "St", Coef: one, Definition: "St = f·L/V, f in cycles per second (ISO 80000-11)", Forms: []Form{
		form(kp("frequency", 1, 1), kp("length", 1, 1), kp("velocity", -1, 1)),
	}, Alternative: &Alternative{Of: "frequency", Kind: "rotational speed", Symbol: "J", When: "a propeller's or rotor's speed of rotation", Exact: true}},
	{Name: "Cauchy number", Symbol: "Ca", Coef: one, Definition: "Ca = ρ·V²/K", Forms: []Form{
		form(kp("density", 1, 1), kp("velocity", 2, 1), kp("bulk modulus", -1, 1)),
	}},
	{Name: "Prandtl number", Symbol: "Pr", Coef: one, Definition: "Pr = μ·c_p/k = ν/α (ISO 80000-11)", Forms: []Form{
		form(kp("dynamic viscosity", 1, 1), kp("specific heat capacity", 1, 1), kp("thermal conductivity", -1, 1)),
		form(kp("kinematic viscosity", 1, 1), kp("thermal diffusivity", -1, 1)),
	}},
	{Name: "Nusselt number", Symbol: "Nu", Coef: one, Definition: "Nu = h·L/k, k of the fluid (ISO 80000-11)", Forms: []Form{
		form(kp("heat transfer coefficient", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)),
	}},
	{Name: "Biot number", Symbol: "Bi", Coef: one, Definition: "Bi = h·L/k, k of the solid", Forms: []Form{
		form(kp("heat transfer coefficient", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)),
	}},
	{Name: "Grashof number", Symbol: "Gr", Coef: one, Definition: "Gr = g·β·ΔT·L³/ν² (ISO 80000-11)", Forms: []Form{
		form(kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -2, 1)),
		form(kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("dynamic viscosity", -2, 1)),
		form(kp("buoyancy", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -2, 1)),
		form(kp("buoyancy", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("dynamic viscosity", -2, 1)),
	}},
	{Name: "Galilei number", Symbol: "Ga", Coef: one, Definition: "Ga = g·L³/ν² = g·ρ²·L³/μ²", Forms: []Form{
		form(kp("gravitational acceleration", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -2, 1)),
		form(kp("gravitational acceleration", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("dynamic viscosity", -2, 1)),
	}},
	{Name: "Rayleigh number", Symbol: "Ra", Relation: "Gr·Pr", Coef: one, Definition: "Ra = g·β·ΔT·L³/(ν·α) (ISO 80000-11)", Forms: []Form{
		form(kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("kinematic viscosity", -1, 1), kp("thermal diffusivity", -1, 1)),
		form(kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 3, 1), kp("density", 2, 1), kp("specific heat capacity", 1, 1), kp("dynamic viscosity", -1, 1), kp("thermal conductivity", -1, 1)),
	}},
	{Name: "Péclet number", Symbol: "Pe", Relation: "Re·Pr", Coef: one, Definition: "Pe = V·L/α (ISO 80000-11)", Forms: []Form{
		form(kp("velocity", 1, 1), kp("length", 1, 1), kp("thermal diffusivity", -1, 1)),
		form(kp("density", 1, 1), kp("specific heat capacity", 1, 1), kp("velocity", 1, 1), kp("length", 1, 1), kp("thermal conductivity", -1, 1)),
	}},
	{Name: "Schmidt number", Symbol: "Sc", Coef: one, Definition: "Sc = ν/D (ISO 80000-11)", Forms: []Form{
		form(kp("kinematic viscosity", 1, 1), kp("diffusion coefficient", -1, 1)),
		form(kp("dynamic viscosity", 1, 1), kp("density", -1, 1), kp("diffusion coefficient", -1, 1)),
	}},
	{Name: "Sherwood number", Symbol: "Sh", Coef: one, Definition: "Sh = k_c·L/D (ISO 80000-11)", Forms: []Form{
		form(kp("mass transfer coefficient", 1, 1), kp("length", 1, 1), kp("diffusion coefficient", -1, 1)),
	}},
	{Name: "Stanton number", Symbol: "St_h", Relation: "Nu/(Re·Pr)", Coef: one, Definition: "St = h/(ρ·c_p·V) (ISO 80000-11)", Forms: []Form{
		form(kp("heat transfer coefficient", 1, 1), kp("density", -1, 1), kp("specific heat capacity", -1, 1), kp("velocity", -1, 1)),
	}},
	{Name: "Knudsen number", Symbol: "Kn", Coef: one, Definition: "Kn = λ/L (ISO 80000-11)", Forms: []Form{
		form(kp("mean free path", 1, 1), kp("length", -1, 1)),
	}},
	{Name: "Rossby number", Symbol: "Ro", Coef: one, Definition: "Ro = V/(f·L), f the Coriolis parameter in rad/s", Forms: []Form{
		form(kp("velocity", 1, 1), kp("Coriolis parameter", -1, 1), kp("length", -1, 1)),
	}},
	{Name: "Ekman number", Symbol: "Ek", Coef: one, Definition: "Ek = ν/(f·L²), f the Coriolis parameter in rad/s", Forms: []Form{
		form(kp("kinematic viscosity", 1, 1), kp("Coriolis parameter", -1, 1), kp("length", -2, 1)),
	}},
	{Name: "Bond (Eötvös) number", Symbol: "Bo", Coef: one, Definition: "Bo = Δρ·g·L²/σ", Forms: []Form{
		form(kp("density difference", 1, 1), kp("gravitational acceleration", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)),
		form(kp("density", 1, 1), kp("gravitational acceleration", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)),
		form(kp("specific weight", 1, 1), kp("length", 2, 1), kp("surface tension", -1, 1)),
	}},
	{Name: "capillary number", Symbol: "Ca_σ", Coef: one, Definition: "Ca = μ·V/σ", Forms: []Form{
		form(kp("dynamic viscosity", 1, 1), kp("velocity", 1, 1), kp("surface tension", -1, 1)),
	}},
	{Name: "Ohnesorge number", Symbol: "Oh", Coef: one, Definition: "Oh = μ/√(ρ·σ·L)", Forms: []Form{
		form(kp("dynamic viscosity", 1, 1), kp("density", -1, 2), kp("surface tension", -1, 2), kp("length", -1, 2)),
	}},
	{Name: "Richardson number", Symbol: "Ri", Coef: one, Definition: "Ri = g·β·ΔT·L/V²", Forms: []Form{
		form(kp("gravitational acceleration", 1, 1), kp("cubic expansion coefficient", 1, 1), kp("temperature difference", 1, 1), kp("length", 1, 1), kp("velocity", -2, 1)),
	}},
	{Name: "drag coefficient", Symbol: "C_D", Coef: two, Definition: "C_D = F/(½·ρ·V²·A), A the reference area", Forms: []Form{
		form(kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("area", -1, 1)),
		areaProxy(kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)),
		form(kp("drag", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("area", -1, 1)),
		areaProxy(kp("drag", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)),
	}, Alternative: &Alternative{Of: "force", Kind: "resistance", Symbol: "C_T", When: "a hull's resistance"}},
	{Name: "total resistance coefficient", Symbol: "C_T", Coef: two, Definition: "C_T = R/(½·ρ·V²·S), S the wetted surface (ITTC)", Forms: []Form{
		form(kp("resistance", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("wetted surface", -1, 1)),
		{Factors: quantity.Product{kp("resistance", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)},
			Proxy: &Proxy{Factor: kp("length", -2, 1), Ref: quantity.Factor{Name: "S", Exp: quantity.RatInt(-1)}, What: "the wetted surface"}},
	}},
	{Name: "lift coefficient", Symbol: "C_L", Coef: two, Definition: "C_L = F/(½·ρ·V²·A), A the reference area", Forms: []Form{
		form(kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("area", -1, 1)),
		areaProxy(kp("force", 1, 1), kp("density", -1, 1), kp("velocity", -2, 1), kp("length", -2, 1)),
	}},
	{Name: "advance coefficient", Symbol: "J", Coef: one, Revolutions: true, Definition: "J = V/(n·D), n in revolutions per second (also called the advance ratio)", Forms: []Form{
		form(kp("velocity", 1, 1), kp("rotational speed", -1, 1), kp("length", -1, 1)),
	}},
	{Name: "thrust coefficient", Symbol: "K_T", Coef: one, Revolutions: true, Definition: "K_T = T/(ρ·n²·D⁴), n in revolutions per second", Forms: []Form{
		form(kp("force", 1, 1), kp("density", -1, 1), kp("rotational speed", -2, 1), kp("length", -4, 1)),
	}},
	{Name: "torque coefficient", Symbol: "K_Q", Coef: one, Revolutions: true, Definition: "K_Q = Q/(ρ·n²·D⁵), n in revolutions per second", Forms: []Form{
		form(kp("torque", 1, 1), kp("density", -1, 1), kp("rotational speed", -2, 1), kp("length", -5, 1)),
	}},
	{Name: "power coefficient", Symbol: "C_P", Coef: one, Revolutions: true, Definition: "C_P = P/(ρ·n³·D⁵), n in revolutions per second", Forms: []Form{
		form(kp("power", 1, 1), kp("density", -1, 1), kp("rotational speed", -3, 1), kp("length", -5, 1)),
	}},
	{Name: "rotor power coefficient", Symbol: "C_P,rotor", Coef: two, Definition: "C_P = P/(½·ρ·V³·A), A the swept area", Forms: []Form{
		form(kp("power", 1, 1), kp("density", -1, 1), kp("velocity", -3, 1), kp("area", -1, 1)),
		areaProxy(kp("power", 1, 1), kp("density", -1, 1), kp("velocity", -3, 1), kp("length", -2, 1)),
	}},
	{Name: "flow coefficient", Symbol: "φ", Coef: one, Revolutions: true, Definition: "φ = Q/(n·D³), n in revolutions per second", Forms: []Form{
		form(kp("volume flow rate", 1, 1), kp("rotational speed", -1, 1), kp("length", -3, 1)),
	}},
	{Name: "head coefficient", Symbol: "ψ", Coef: one, Revolutions: true, Definition: "ψ = g·H/(n²·D²), n in revolutions per second", Forms: []Form{
		form(kp("specific energy", 1, 1), kp("rotational speed", -2, 1), kp("length", -2, 1)),
		form(kp("gravitational acceleration", 1, 1), kp("length", 1, 1), kp("rotational speed", -2, 1), kp("length", -2, 1)),
	}},
	{Name: "pressure coefficient of a pump or fan", Symbol: "ψ_p", Coef: one, Revolutions: true, Definition: "ψ_p = Δp/(ρ·n²·D²), n in revolutions per second (ψ_p = ψ for Δp = ρ·g·H; fan practice also writes 2·Δp/(ρ·u²) with u = π·D·n, which is (2/π²)·ψ_p: common practice)", Forms: []Form{
		form(kp("pressure difference", 1, 1), kp("density", -1, 1), kp("rotational speed", -2, 1), kp("length", -2, 1)),
	}},
	{Name: "machine Reynolds number", Symbol: "Re_n", Coef: one, Revolutions: true, Definition: "Re_n = ρ·n·D²/μ = n·D²/ν, n in revolutions per second", Forms: []Form{
		form(kp("density", 1, 1), kp("rotational speed", 1, 1), kp("length", 2, 1), kp("dynamic viscosity", -1, 1)),
		form(kp("rotational speed", 1, 1), kp("length", 2, 1), kp("kinematic viscosity", -1, 1)),
	}},
	{Name: "tip-speed ratio", Symbol: "λ_tip", Coef: one, Definition: "λ = ω·R/V, ω in radians per second", Forms: []Form{
		form(kp("rotational speed", 1, 1), kp("length", 1, 1), kp("velocity", -1, 1)),
	}},
	{Name: "specific speed", Symbol: "Ω_s", Relation: "φ^(1/2)/ψ^(3/4)", Coef: one, Definition: "Ω_s = ω·Q^(1/2)/(g·H)^(3/4), ω in radians per second", Forms: []Form{
		form(kp("rotational speed", 1, 1), kp("volume flow rate", 1, 2), kp("specific energy", -3, 4)),
	}},
}

// compiledForm is a catalogue form with its kinds resolved.
type compiledForm struct {
	named *Named
	form  *Form
	terms []compiledTerm
	// sig is the product of the terms' dimensions, each to the power one:
	// a cheap necessary condition for a match.
	sig   quantity.Dim
	sigOK bool
	proxy int // index of the proxy term, or −1
	// distinct is true when no two terms have the same dimension: a
	// group's variables then have one assignment to the terms at most.
	distinct bool
}

// compiledTerm is a form's factor (a kind to a power) with the kind's
// dimension resolved.
type compiledTerm struct {
	quantity.Factor
	dim      quantity.Dim
	known    bool
	explicit bool // must be given explicitly
}

var compiled = func() []compiledForm {
	var out []compiledForm
	for i := range catalogue {
		n := &catalogue[i]
		for j := range n.Forms {
			f := &n.Forms[j]
			cf := compiledForm{named: n, form: f, sigOK: true, proxy: -1}
			for k, t := range f.Factors {
				d, ok := KindDim(t.Name)
				cf.terms = append(cf.terms, compiledTerm{Factor: t, dim: d, known: ok, explicit: explicitOnly[t.Name]})
				var err error
				if cf.sig, err = cf.sig.Mul(d); err != nil {
					cf.sigOK = false
				}
				if f.Proxy != nil && cf.proxy < 0 && t == f.Proxy.Factor {
					cf.proxy = k
				}
			}
			cf.distinct = !slices.ContainsFunc(cf.terms, func(a compiledTerm) bool {
				n := 0
				for _, b := range cf.terms {
					if b.dim == a.dim {
						n++
					}
				}
				return n > 1
			})
			out = append(out, cf)
		}
	}
	return out
}()

// compiledByLen lists the indices of the compiled forms by their number
// of factors, in catalogue order, so recognition looks only at forms of
// the group's length.
var compiledByLen = func() [][]int {
	var by [][]int
	for i, f := range compiled {
		for len(by) <= len(f.terms) {
			by = append(by, nil)
		}
		by[len(f.terms)] = append(by[len(f.terms)], i)
	}
	return by
}()

// sigKey selects the compiled forms a group can match: its number of
// factors and the product of their dimensions.
type sigKey struct {
	n   int
	sig quantity.Dim
}

// sigSlot is one entry of compiledBySig.
type sigSlot struct {
	key   sigKey
	forms []int
	used  bool
}

// compiledBySig lists, for each number of factors and signature, the
// indices of the compiled forms a group of that signature can match: the
// forms with that signature and those whose signature overflowed, in
// catalogue order, so that recognition looks at those alone. It is an
// open-addressed table, read without hashing a map key. compiledUnsig
// lists the latter alone, by number of factors, for a signature no form
// has.
var compiledBySig, compiledUnsig = func() (*[256]sigSlot, [][]int) {
	var t [256]sigSlot
	unsig := make([][]int, len(compiledByLen))
	var keys []sigKey
	for n, forms := range compiledByLen {
		for _, i := range forms {
			if f := &compiled[i]; f.sigOK {
				if k := (sigKey{n, f.sig}); !slices.Contains(keys, k) {
					keys = append(keys, k)
				}
			} else {
				unsig[n] = append(unsig[n], i)
			}
		}
	}
	if len(keys) > len(t)/2 {
		panic("pigroups: more form signatures than compiledBySig holds at half load")
	}
	for _, k := range keys {
		h := sigHash(k)
		for t[h].used {
			h = (h + 1) % len(t)
		}
		t[h] = sigSlot{key: k, used: true}
		for _, i := range compiledByLen[k.n] {
			if f := &compiled[i]; !f.sigOK || f.sig == k.sig {
				t[h].forms = append(t[h].forms, i)
			}
		}
	}
	return &t, unsig
}()

// sigHash places a key in compiledBySig (Fibonacci hashing).
func sigHash(k sigKey) int {
	return int((uint64(k.sig) + uint64(k.n)<<58) * 0x9E3779B97F4A7C15 >> (64 - 8))
}

// formsFor returns the compiled forms a group of n factors and signature
// sig can match.
func formsFor(n int, sig quantity.Dim) []int {
	k := sigKey{n, sig}
	for h := sigHash(k); compiledBySig[h].used; h = (h + 1) % len(compiledBySig) {
		if compiledBySig[h].key == k {
			return compiledBySig[h].forms
		}
	}
	return compiledUnsig[n]
}

// Catalogue returns a copy of the named groups known to recognition.
func Catalogue() []Named { return slices.Clone(catalogue) }

// Match is a recognition of a group as a power of a named group. The
// group equals (Named/k)^Power, with k the factor of the named group's
// definition (Factor), unless Proxy is set, when it is only proportional
// to that.
type Match struct {
	Named
	// Power is the exponent p with group ∝ Named^p: 1 for the group
	// itself, −1 for its inverse, 2 for its square.
	Power quantity.Rat
	// Assumed lists the variables whose kind was taken from their
	// dimension to make the match ("a as speed of sound").
	Assumed []string
	// Proxy, when set, is the variable that stands in for a reference
	// quantity of the definition (L for the area A of C_D): the group is
	// then only proportional to the named group.
	Proxy *ProxyUse
	// twoPi is the power of 2π between the definition's measure of a
	// rotational speed and the measure its variables hold (see Angle).
	twoPi int
	// alt is set when the named group's Alternative applies too: the
	// variable it concerns was given no kind.
	alt bool
}

// AlsoText returns what the group is for a narrower kind of one of its
// variables, when that variable was given no kind and the named group
// has an Alternative: "∝C_T for a hull's resistance"; "" otherwise.
func (m Match) AlsoText() string {
	if !m.alt || m.Proxy == nil {
		return ""
	}
	a := m.Alternative
	o := m
	o.Symbol, o.alt = a.Symbol, false
	return o.Label() + " for " + a.When
}

// ProxyUse is a variable that stands in for a reference quantity in a
// match.
type ProxyUse struct {
	Symbol string // the variable ("L")
	Proxy         // what it stands in for
}

// Exact reports whether the group is a power of the named group up to a
// known numerical factor, with no stand-in for a reference quantity.
func (m Match) Exact() bool { return m.Proxy == nil }

// TwoPiPower returns m with Factor = Coef·(2π)^m: the power of 2π that
// turns the measure the group's rotational speeds are held in (each
// variable's Angle) into the measure of the definition: 2 for K_T against
// a speed in rad/s, 0 for K_T against one in rev/s, −1 for a tip-speed
// ratio ω·R/V against one in rev/s.
func (m Match) TwoPiPower() int { return m.twoPi }

// Factor returns k with Named = k·group^(1/Power) for an exact match, the
// group's variables taking their SI values: 2 for C_D against F/(ρV²A),
// 4π² for K_T against T/(ρω²D⁴) with ω in rad/s, 1 for Re.
func (m Match) Factor() float64 {
	c := m.Coef
	if c.IsZero() {
		c = quantity.RatInt(1)
	}
	return c.Float() * math.Pow(2*math.Pi, float64(m.TwoPiPower()))
}

// FactorText writes Factor exactly: "2", "4π²", "1/(2π)"; "" for 1.
func (m Match) FactorText() string {
	c := m.Coef
	if c.IsZero() {
		c = quantity.RatInt(1)
	}
	return factorText(c, m.TwoPiPower(), quantity.Unicode)
}

// factorText writes c·(2π)^k exactly in a style: "2", "4π²", "1/(2π)"
// in Unicode, "4*pi^2" and "1/(2*pi)" in formula text (quantity.ASCII),
// `4\pi^{2}` in LaTeX; "" for 1. The power of π is a one-factor
// quantity.Product, written against the number.
func factorText(c quantity.Rat, k int, style quantity.Style) string {
	n, d := c.Num(), c.Den()
	piNum, piDen := "", ""
	pi, sep := "π", ""
	switch style {
	case quantity.ASCII:
		pi, sep = "pi", "*"
	case quantity.LaTeX:
		pi = `\pi`
	}
	piPow := func(a int) string {
		return sep + quantity.Product{{Name: pi, Exp: quantity.RatInt(int64(a))}}.Format(style, quantity.Inline, "")
	}
	if k > 0 {
		n <<= k
		piNum = piPow(k)
	} else if k < 0 {
		d <<= -k
		piDen = piPow(-k)
	}
	num := strconv.FormatInt(n, 10) + piNum
	den := strconv.FormatInt(d, 10) + piDen
	if den == "1" {
		if num == "1" {
			return ""
		}
		return num
	}
	if piDen != "" {
		den = "(" + den + ")"
	}
	return num + "/" + den
}

// Label writes what the group is, in terms of the named group: "Re",
// "1/Re", "Fr²", "C_D/2", "K_T/(4π²)", and "∝C_D" when a stand-in makes
// it only proportional.
func (m Match) Label() string {
	if t := m.AlsoText(); t != "" {
		return m.label() + " (" + t + ")"
	}
	return m.label()
}

func (m Match) label() string {
	if m.Proxy != nil {
		return "∝" + m.Symbol
	}
	c := m.Coef
	if c.IsZero() {
		c = quantity.RatInt(1)
	}
	k := factorText(c, m.TwoPiPower(), quantity.Unicode)
	if k == "" {
		return powerText(m.Symbol, m.Power)
	}
	ci, _ := quantity.RatInt(1).Div(c)
	ki := factorText(ci, -m.TwoPiPower(), quantity.Unicode) // 1/k
	var first string                                        // the group to the power one: Named/k
	switch {
	case !strings.Contains(k, "/"):
		first = m.Symbol + "/" + parenFactor(k)
	case !strings.Contains(ki, "/"):
		first = ki + "·" + m.Symbol
	default:
		first = ki + "·" + m.Symbol
	}
	switch {
	case m.Power.Num() == 1 && m.Power.Den() == 1:
		return first
	case m.Power.Num() == -1 && m.Power.Den() == 1:
		if kn, kd, ok := strings.Cut(k, "/"); ok {
			return kn + "/(" + strings.Trim(kd, "()") + "·" + m.Symbol + ")"
		}
		return k + "/" + m.Symbol
	}
	return powerText("("+first+")", m.Power)
}

// rotational reports whether the named group's definition holds a
// rotational speed, whose measure (rev/s or rad/s) the definition states.
func (m Match) rotational() bool {
	for _, f := range m.Forms {
		for _, t := range f.Factors {
			if t.Name == "rotational speed" {
				return true
			}
		}
	}
	return false
}

func parenFactor(s string) string {
	if strings.ContainsAny(s, "/·π") {
		return "(" + s + ")"
	}
	return s
}

// Equation writes the named group in terms of a group called name:
// "Re = Π₃", "Fr = Π₂^(1/2)", "K_T = 4π²·Π₁", "C_D = 2·Π₁·L²/A".
func (m Match) Equation(name string) string {
	inv, err := quantity.RatInt(1).Div(m.Power)
	if err != nil {
		inv = quantity.RatInt(1)
	}
	g := powerText(name, inv)
	k := m.FactorText()
	rhs := g
	if k != "" {
		if strings.HasPrefix(g, "1/") {
			rhs = k + g[1:]
		} else {
			rhs = k + "·" + g
		}
	}
	if m.Proxy != nil {
		// The stand-in out, the reference quantity in: ·L²/A.
		rhs += "·" + quantity.Product{{Name: m.Proxy.Symbol, Exp: m.Proxy.Exp.Neg()}, m.Proxy.Ref}.Format(quantity.Unicode, quantity.Fraction, "")
	}
	return m.Symbol + " = " + rhs
}

// Describe writes the match for a report: "1/Re (Reynolds number;
// conventional form Re)", "K_T/(4π²) (thrust coefficient; K_T =
// T/(ρ·n²·D⁴), n in revolutions per second: K_T = 4π²·Π)".
func (m Match) Describe() string { return m.describe("Π") }

func (m Match) describe(name string) string {
	var sb strings.Builder
	sb.WriteString(m.Label())
	sb.WriteString(" (")
	if m.Proxy != nil {
		sb.WriteString("proportional to the ")
	}
	sb.WriteString(m.Name)
	if m.Relation != "" {
		sb.WriteString(" = " + m.Relation)
	}
	switch {
	case m.Proxy != nil:
		fmt.Fprintf(&sb, "; %s, and %s stands in for %s %s: %s", m.Definition, powerText(m.Proxy.Symbol, m.Proxy.Exp.Neg()), m.Proxy.What, m.Proxy.Ref.Name, m.Equation(name))
	case m.FactorText() != "":
		fmt.Fprintf(&sb, "; %s: %s", m.Definition, m.Equation(name))
		if m.TwoPiPower() != 0 {
			if m.Revolutions {
				sb.WriteString(" with the rotational speed held in rad/s")
			} else {
				sb.WriteString(" with the rotational speed held in rev/s")
			}
		}
	case !(m.Power.Num() == 1 && m.Power.Den() == 1):
		sb.WriteString("; conventional form " + m.Symbol)
		if m.rotational() {
			sb.WriteString("; " + m.Definition)
		}
	case m.rotational():
		// The definition carries the measure of the speed: said always.
		sb.WriteString("; " + m.Definition)
	}
	if m.alt {
		a := m.Alternative
		what := a.Symbol
		if t := m.AlsoText(); t != "" {
			what = strings.TrimSuffix(t, " for "+a.When)
		}
		fmt.Fprintf(&sb, "; for %s (give the %s the kind %s) the group is read as %s", a.When, a.Of, a.Kind, what)
		if i := slices.IndexFunc(catalogue, func(n Named) bool { return n.Symbol == a.Symbol }); i >= 0 {
			fmt.Fprintf(&sb, ", the %s, %s", catalogue[i].Name, catalogue[i].Definition)
		}
	}
	if len(m.Assumed) > 0 {
		sb.WriteString("; taking " + strings.Join(m.Assumed, ", "))
	}
	sb.WriteString(")")
	return sb.String()
}

// recognise matches a group's exponents against the catalogue, best
// matches (exact before proportional, fewest assumed kinds, lowest
// power) first.
func (p *Problem) recognise(exps []quantity.Rat) []Match {
	out := p.recogniseIn(nil, nil, 2, exps)
	return out[:len(out):len(out)]
}

// matchArena holds the text of the matches of a whole Pi set, so that
// building a set allocates once for it rather than per group.
type matchArena struct {
	assumed []string        // the Assumed lists of the matches
	text    strings.Builder // their text: only appended to, so earlier strings stay valid
}

// recogniseIn is recognise writing the Assumed lists into an arena (nil
// for their own) and the matches into the room of spare, which has
// length zero (a block of matches the caller shares between groups),
// while they fit, and otherwise into a new block of capacity at least
// hint. The result keeps the room after the matches, for the next group;
// it is nil when nothing matches.
func (p *Problem) recogniseIn(ar *matchArena, spare []Match, hint int, exps []quantity.Rat) []Match {
	var termBuf [16]int
	terms := termBuf[:0]
	for i, e := range exps {
		if !e.IsZero() {
			terms = append(terms, i)
		}
	}
	if len(terms) > len(termBuf) {
		return nil // longer than any catalogue form
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
	if len(terms) >= len(compiledByLen) {
		return nil
	}
	forms := compiledByLen[len(terms)]
	if sigOK {
		forms = formsFor(len(terms), sig)
	}
	for _, fi := range forms {
		f := &compiled[fi]
		if f.named == last || sigOK && f.sigOK && sig != f.sig || !p.sameDims(f, terms) {
			continue
		}
		if m, ok := p.matchForm(ar, f, terms, exps); ok {
			if out == nil {
				out = spare[:0]
			}
			if len(out) == cap(out) {
				// A new block, the group's matches so far moved to its start.
				grown := make([]Match, len(out), max(hint, 2*len(out)+1))
				copy(grown, out)
				out = grown
			}
			out = append(out, m)
			last = f.named // one match per named group
		}
	}
	if len(out) < 2 {
		return out
	}
	slices.SortStableFunc(out, func(a, b Match) int {
		if a.Exact() != b.Exact() {
			if a.Exact() {
				return -1
			}
			return 1
		}
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

// ratDiv is a.Div(b), with whole exponents that divide exactly (the
// usual case of a group's and a form's exponents) taken without the
// general product's overflow checks.
func ratDiv(a, b quantity.Rat) (quantity.Rat, error) {
	if a.IsInt() && b.IsInt() {
		n, d := a.Num(), b.Num()
		switch d {
		case 1:
			return a, nil
		case -1:
			return a.Neg(), nil // exact: no Rat holds math.MinInt64
		}
		if d != 0 && n%d == 0 {
			return quantity.RatInt(n / d), nil
		}
	}
	return a.Div(b)
}

func absCmp(a, b quantity.Rat) int {
	if a.Sign() < 0 {
		a = a.Neg()
	}
	if b.Sign() < 0 {
		b = b.Neg()
	}
	return a.Cmp(b)
}

// matchForm tries every assignment of the group's variables to the form's
// factors, with one common power, and keeps the one that assumes the
// fewest kinds. The search works on fixed arrays and builds the Match
// once, at the end.
func (p *Problem) matchForm(ar *matchArena, f *compiledForm, terms []int, exps []quantity.Rat) (Match, bool) {
	var (
		used, assumed, bestAssumed [16]bool
		assign, bestAssign         [16]int // form term → variable
		termOf, bestTermOf         [16]int // group variable k → form term
		bestPower                  quantity.Rat
		bestN                      = -1
	)
	var rec func(k int, power quantity.Rat, havePower bool, nAssumed int)
	rec = func(k int, power quantity.Rat, havePower bool, nAssumed int) {
		if bestN >= 0 && nAssumed >= bestN {
			return // cannot improve
		}
		if k == len(terms) {
			bestN, bestPower = nAssumed, power
			bestAssign, bestAssumed, bestTermOf = assign, assumed, termOf
			return
		}
		i := terms[k]
		v := &p.vars[i]
		for fi := range f.terms {
			fp := &f.terms[fi]
			if used[fi] || fp.dim != v.Dim {
				continue
			}
			explicit := v.hasKind(fp.Name)
			if !explicit && (v.Kind != "" || !fp.known || fp.explicit) {
				continue
			}
			pw, err := ratDiv(exps[i], fp.Exp)
			if err != nil || havePower && pw != power {
				continue
			}
			used[fi], assign[fi], termOf[k], assumed[k] = true, i, fi, !explicit
			n := nAssumed
			if !explicit {
				n++
			}
			rec(k+1, pw, true, n)
			used[fi] = false
		}
	}
	if f.distinct {
		// Each variable has the one term of its dimension (sameDims
		// found them all): no search, one pass.
		n, have := 0, false
		for k, i := range terms {
			v := &p.vars[i]
			fi := slices.IndexFunc(f.terms, func(t compiledTerm) bool { return t.dim == v.Dim })
			if fi < 0 {
				return Match{}, false
			}
			fp := &f.terms[fi]
			explicit := v.hasKind(fp.Name)
			if !explicit && (v.Kind != "" || !fp.known || fp.explicit) {
				return Match{}, false
			}
			pw, err := ratDiv(exps[i], fp.Exp)
			if err != nil || have && pw != bestPower {
				return Match{}, false
			}
			bestPower, have = pw, true
			bestAssign[fi], bestTermOf[k], bestAssumed[k] = i, fi, !explicit
			if !explicit {
				n++
			}
		}
		bestN = n
	} else {
		rec(0, quantity.Rat{}, false, 0)
	}
	if bestN < 0 {
		return Match{}, false
	}
	m := Match{Named: *f.named, Power: bestPower}
	if a := f.named.Alternative; a != nil && (f.proxy >= 0 || a.Exact) {
		// Without Exact only for a stand-in: an area of a form need not
		// be the wetted surface the other group is defined on.
		for fi, t := range f.terms {
			if t.Name == a.Of && p.vars[bestAssign[fi]].Kind == "" {
				m.alt = true
			}
		}
	}
	for fi, t := range f.terms {
		if t.Name != "rotational speed" || !t.Exp.IsInt() {
			continue
		}
		// The definition's speed is 2π times a speed held in rev/s when it
		// takes rad/s, and 1/(2π) times one held in rad/s when it takes
		// rev/s.
		held := p.vars[bestAssign[fi]].Angle == Revolutions
		switch {
		case f.named.Revolutions && !held:
			m.twoPi -= int(t.Exp.Num())
		case !f.named.Revolutions && held:
			m.twoPi += int(t.Exp.Num())
		}
	}
	if bestN > 0 {
		// Every "a as speed of sound" of the match in one string, sliced,
		// in the arena's text when there is one; the list from the arena.
		var own matchArena
		shared := ar != nil
		if !shared {
			ar = &own
		}
		if shared && ar.text.Cap() == 0 {
			ar.text.Grow(256) // room for a set's worth, at its first
		}
		var ends [16]int
		start := ar.text.Len()
		for k, i := range terms {
			if bestAssumed[k] {
				ar.text.WriteString(p.vars[i].Symbol)
				ar.text.WriteString(" as ")
				ar.text.WriteString(f.terms[bestTermOf[k]].Name)
				ends[k] = ar.text.Len()
			}
		}
		all := ar.text.String()
		if cap(ar.assumed)-len(ar.assumed) < bestN {
			ar.assumed = make([]string, 0, max(16, bestN))
		}
		m.Assumed = ar.assumed[len(ar.assumed) : len(ar.assumed) : len(ar.assumed)+bestN]
		for k := range terms {
			if bestAssumed[k] {
				m.Assumed = append(m.Assumed, all[start:ends[k]])
				start = ends[k]
			}
		}
		ar.assumed = ar.assumed[:len(ar.assumed)+bestN]
	}
	if f.proxy >= 0 {
		m.Proxy = &ProxyUse{Symbol: p.vars[bestAssign[f.proxy]].Symbol, Proxy: *f.form.Proxy}
	}
	return m, true
}
