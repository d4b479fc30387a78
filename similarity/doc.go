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
//     corrections, resistance fairing, open-water reduction,
//     self-propulsion by thrust identity, ITTC-1978 powering and the
//     speed–power curve with its band;
//   - similarity/tunnel: wind tunnel — the pressurised or cryogenic
//     tunnel's condition, balance reduction, tares, axes, wall
//     corrections and the polar;
//   - similarity/turbo: pumps, turbines and fans — affinity laws,
//     efficiency step-ups, specific speed, the acceptance test against
//     the ISO 9906 grades, NPSH3, NPSH;
//   - similarity/hydraulic: hydraulic models — distorted Froude models,
//     Manning's n, free-surface scale-effect limits, sediment, the weir
//     rating.
//
// Shared checks for trade procedures: CheckInputs (dimension, and a
// positive finite value), OrDefault and GravityOr (an option left unset
// takes its default), CheckResults (a finite result) and CheckRatios (a
// positive finite model/prototype ratio) describe what they find wrong in
// a Fault, which is not an error: each trade's one error type embeds it
// beside the name of its procedure and reports a check's fault through
// Fail (Invalid, OutOfRange and Caused build the other faults a trade
// reports); ClassOf gives the class a wrapped error
// keeps, Solution.RatioValues the ratios a rule's result is built from,
// and FormatTable the tables of the core's and the trades' reports.
//
// Every error is a *PlanError: its operation, input, class (quantity.ErrUnknown,
// ErrRange, ErrDimension, ErrInvalid, or ErrConflict) and cause. A plan has at most MaxRequirements requirements; a
// conflict is isolated in at most k + 1 further solves. Every ratio and
// transferred value is finite, or the call returns an error.
//
// Model-test predictions are estimates subject to scale effects; Caution
// says so, and the reports print it.
package similarity
