// Package similarity plans model tests and carries results between model
// and prototype.
//
// A Plan lists a problem's variables (a pigroups.Problem), the groups to
// hold equal on both sides, and constraints on the scale ratios
// λ = model/prototype: fixed ratios (a 1:25 geometric scale), the same
// fluid (λ_ρ = λ_μ = 1), the same gravity. Solve works exactly, with
// uᵢ = log λᵢ: each held group is a linear equation a·u = 0, solved over
// the rationals, so every ratio comes out as a product of rational powers
// of the free ratios — Froude scaling with the same fluid gives
// λ_V = λ_L^(1/2), λ_F = λ_L³, λ_P = λ_L^(7/2) — and only then are numbers
// put in. Requirements that cannot all hold give a *ConflictError with
// an irreducible conflicting set in words (every requirement in it is
// needed for the conflict) and, for each requirement whose removal
// resolves it, what its ratios would then be — for a held group, the
// ratio of the named group itself (Fr, with Fr² beside it). Compromise holds
// groups in priority order and reports the rest as floating, with their
// model values against a threshold.
//
// Any quantity's ratio follows from its dimension once the base-dimension
// ratios are known (DerivedRatio), so measured model quantities and whole
// Series are carried to full scale and back (ToPrototype, ToModel).
//
// The rule library (Froude, Reynolds, Mach, Weber, Euler, Cavitation,
// Strouhal, AffinityLaws, DistortedFroude, ManningRatio) gives the
// standard plans ready-made; ExtrapolateHull, Prohaska and MoodyStepUp
// are the published partial-similarity corrections. For ships, the
// friction lines (FrictionLine: ITTC-1957, Schoenherr, Hughes, Katsui),
// the form factor from a double-body test (FormFactorDoubleBody) or by
// Prohaska with a chosen or fitted exponent (ProhaskaWith), the wave
// resistance, the temperature correction, the ITTC-1978 performance
// prediction (ITTC1978) with its tables, and ExtrapolateHullRun, a run
// carried to full scale with its uncertainty budget; FindTunnelCondition
// and TemperatureFor find the fluid states a plan needs. Package fluids
// gives water, air and the standard atmosphere.
//
// # Bounds
//
// A plan has at most MaxRequirements (256) requirements; Solve is one
// exact elimination, and a conflict is isolated by deletion filtering in
// at most k + 1 further solves, with k the number of requirements.
// Fluid-property searches bisect at most 200 times. Every ratio and
// transferred value is finite, or the call returns a typed error.
//
// # Caution
//
// Model-test predictions are estimates subject to scale effects.
// Hydraulic structures, hulls and pressure vessels are designed to the
// applicable local codes and checked by licensed engineers; reports
// printed by this package say so, and PumpCaution and
// HydraulicStructureCaution go with pump and hydraulic-model results.
package similarity
