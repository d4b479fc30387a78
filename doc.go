// Package similis is a library for engineers who plan scale-model tests and
// write unit-safe engineering code: wind-tunnel, towing-tank,
// hydraulic-model and pump or fan test teams, and the authors of their
// data-reduction and design programs. They must turn a problem's variables
// into a sound set of dimensionless groups, decide which groups a model
// test can match and what the model's speed, fluid, pressure and
// temperature must be, and carry every measured model value to full scale.
// similis makes each of those steps a checked computation.
//
// # Packages
//
//   - quantity: dimensions (exact rational exponents of the seven SI base
//     dimensions), the dimension-checked value Quantity, and Series, one
//     channel of test data; quantity/uncertain carries a measured value
//     with its named uncertainty sources (GUM first order with exact
//     derivatives, budgets, a JCGM 101 Monte Carlo check); quantity/fit
//     holds the curve fits analyses share (polynomial least squares with
//     intervals, order selection, fairing, outlier flags, nonlinear least
//     squares).
//   - units: the unit table, the unit-expression parser, conversion,
//     printing and physical constants; units/formula, correlations as
//     text; units/chanfile and units/chanfile/parquetfile, logged test
//     channels in CSV/TSV and Parquet files with their units;
//     units/steady, a logged time history cut into steady points, each
//     channel's mean with its uncertainty, tared and calibrated.
//   - pigroups: Buckingham Pi sets from a chosen repeating set, named
//     groups, evaluation over data and power-law fitting.
//   - similarity: the similitude core — scale ratios, test plans and
//     their conflicts, the compromise, transfer of model data, rules of
//     similitude and reports, and the checks the trades' procedures share;
//     similarity/fluids gives water, sea water, air, nitrogen and the
//     ISO 2533 atmosphere.
//   - the trades, each over the core and fluids, none importing another:
//     similarity/ship (towing tank: friction lines, form factor, hull
//     extrapolation and its uncertainty, blockage, resistance fairing,
//     open-water reduction, self-propulsion by thrust identity, ITTC-1978
//     powering, the speed–power curve with its band), similarity/tunnel
//     (the condition finder, balance reduction, tares, axes, wall
//     corrections, the polar), similarity/turbo (affinity laws, the Moody
//     efficiency step-up, the IEC 60193, Ackeret and fan step-ups,
//     specific speed, the acceptance test against the ISO 9906 grades,
//     NPSH3, NPSH) and similarity/hydraulic (distorted Froude, Manning,
//     free-surface limits, sediment, the weir rating).
//   - similarity/reduction: the data-reduction pipeline as a library,
//     from raw channels to steady points and their groups, each with its
//     uncertainty; it may call the core, fluids and the trades.
//   - internal/exact: algorithms only — exact elimination, rank, null
//     space, fraction-free integer elimination; internal/dual, dual
//     numbers for the exact slopes of the fluid correlations;
//     internal/roots, root bracketing; no type of any appears in an
//     exported signature.
//   - examples/...: runnable programs on invented data, sharing their
//     flag handling (examples/internal/cli) and plot style
//     (examples/internal/plotstyle).
//
// # Layers and the one algebra
//
// Imports run one way, and a test (arch_test.go) fails on any other:
//
//	examples ──► ship, tunnel, turbo, hydraulic ──► similarity ──► pigroups ──► units ──► quantity
//	                        │                         │             │          │           │
//	                        └─────────────────────────┴─────────────┴──────────┴───────────┴──► internal/...
//	             (similarity/fluids sits below similarity; the trades import it too;
//	              similarity/reduction sits between the trades and examples)
//
// One idea runs through all of them: a product of named factors raised
// to exact rational powers. Its exponent is quantity.Rat, defined once in
// the lowest layer. A dimension (quantity.Dim) is such a product over the
// seven base dimensions; a unit (units.Unit) over unit symbols; a Pi
// group (pigroups.Group) over a problem's variables, its exponents a null
// vector of the dimensional matrix; a scale law (similarity.Law, whose
// terms are a quantity.Product) over the
// free scale ratios, solved from the held groups as linear equations in
// log λ. The eliminations on those exponents are internal/exact's, done
// once; floats carry measured values only.
//
// # Error model
//
// A dimension mismatch never yields a number. In formulas a programmer
// wrote, quantity arithmetic panics with a *quantity.Error of class
// quantity.ErrDimension naming the operation and both sides, so the bug
// shows on the first run. Values and text that come from input are checked
// by functions that return errors (Quantity.Check, quantity.Eval,
// units.Parse); parsing user text never panics, and its work is bounded.
// Every error is a typed error of the package that returned it (errors.As)
// and matches one class of the module under errors.Is:
// quantity.ErrDimension, ErrRange, ErrParse, ErrUnknown, ErrInvalid, or
// similarity.ErrConflict. Every number returned is finite, or the call
// returns an error.
//
// # Where to start
//
// Run the main demo, go run ./examples/quickstart, which walks the whole
// job from variables to an extrapolated full-scale result. Then read, in
// order, the package documentation of quantity (the error model), units
// (the grammar), pigroups and similarity; each has runnable Examples. The
// other programs in examples/ are scenarios of single tasks.
//
// # Caution
//
// Model-test predictions are estimates subject to scale effects. Hydraulic
// structures, hulls and pressure vessels are designed to the applicable
// local codes and checked by licensed engineers; nothing in this library
// replaces that.
package similis
