// Package similarity is the similitude core: it plans model tests and
// carries results between model and prototype.
//
// A Plan lists a problem's variables (a pigroups.Problem), the groups to
// hold equal on both sides, and constraints on the scale ratios
// λ = model/prototype: fixed ratios (a 1:25 geometric scale), the same
// fluid, the same gravity. Solve works exactly in uᵢ = log λᵢ, so every
// ratio is a Law, a product of rational powers of the free ratios
// (Froude scaling in the same fluid gives λ_V = λ_L^(1/2), λ_P =
// λ_L^(7/2)), and only then are numbers put in. Requirements that cannot
// all hold give an error of class ErrConflict whose Conflict (ConflictOf)
// is an irreducible conflicting set with the remedies; Compromise holds groups in priority order and reports the
// rest as floating. DerivedRatio gives any quantity's ratio from its
// dimension; ToPrototype, ToModel and the Series forms carry measured
// values across; NewReport prints a plan. The rules of similitude
// (Froude, Reynolds, Mach, Weber, Euler, Strouhal) take their ratios by
// name in Scales.
//
// The trades' published procedures are in one package each, over this
// core and package fluids:
//
//   - similarity/ship: towing tank — friction lines, form factor, hull
//     extrapolation and its uncertainty, temperature and blockage
//     corrections, ITTC-1978 powering;
//   - similarity/tunnel: wind tunnel — wall corrections and the
//     pressurised or cryogenic tunnel's condition;
//   - similarity/turbo: pumps, turbines and fans — affinity laws,
//     efficiency step-ups, specific speed, NPSH;
//   - similarity/hydraulic: hydraulic models — distorted Froude models,
//     Manning's n, free-surface scale-effect limits, sediment.
//
// Every error is a *PlanError: its operation, input, class (quantity.ErrUnknown,
// ErrRange, ErrDimension, ErrInvalid, or ErrConflict) and cause. A plan has at most MaxRequirements requirements; a
// conflict is isolated in at most k + 1 further solves. Every ratio and
// transferred value is finite, or the call returns an error.
//
// Model-test predictions are estimates subject to scale effects; Caution
// says so, and the reports print it.
package similarity
