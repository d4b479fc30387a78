// Package pigroups builds Buckingham Pi sets: from a problem's variables,
// the dimensionless groups formed with the repeating variables the
// engineer chooses, with exact exponents and the trade's names; and it
// evaluates the groups over test data and fits power laws to them.
//
// # The theorem, exactly
//
// A problem of n variables whose dimensional matrix has rank r has n − r
// independent dimensionless groups (E. Buckingham, Phys. Rev. 4, 345,
// 1914). The rank is found by exact rational elimination, never by a
// floating tolerance, and it can be less than the number of base
// dimensions that appear — Problem.RankNote says why. A repeating set
// must have r members, exclude the dependent variable, and be
// independent; CheckRepeating names the dimensionless group the members
// form when they are not. Each non-repeating variable gives one group,
// scaled to coprime integer exponents with its own exponent positive.
// A group is a quantity.Product of its variables' symbols
// (Group.Product), the one product of powers of the module: it is what
// Format writes, and what Problem.NewGroup reads.
//
// # Names
//
// Groups are matched against a catalogue of the trade's named groups by
// the kinds of quantity of their variables and their exponents, allowing
// any power: μ/(ρVD) is recognised as 1/Re, V²/(gL) as Fr². Each named
// group carries the numerical factor and conventions of its definition
// (C_D over ½ρV²A, K_T with n in revolutions per second), and a label
// says what a group's value is in those terms (C_D/2, K_T/(4π²), or ∝C_D
// where a length squared stands in for the reference area);
// Set.WithCoefficients evaluates the definitions themselves. A variable
// without a kind is matched by its dimension, and the match says which
// kind it assumed; give kinds (VarKind) to narrow the candidates, since a
// pressure over ρV² may be an Euler number, a pressure coefficient, a
// loss coefficient or a cavitation number.
//
// # Data
//
// FitPowerLaw lives here, not in a general statistics layer, because what
// it fits is the law between Pi groups, Π₀ = C·∏ Πₖ^aₖ, and what it
// returns (exponents on groups, a range of validity in groups) is read
// against a Set.
//
// An Evaluator computes the groups for one row of quantities or for whole
// Series without allocating; FitPowerLaw fits Π₀ = C·∏ Πₖ^aₖ by least
// squares on logarithms, with standard errors, confidence and prediction
// intervals, and marks a prediction outside the fitted range as an
// extrapolation.
//
// # Bounds
//
// Work is bounded for any input: a problem has at most MaxVariables (64)
// variables with symbols of at most 64 bytes; rank, Pi sets and the
// default repeating set are exact eliminations on a matrix of at most
// 7 × 64 small integers (an overflow of the 64-bit fractions is an error
// wrapping ErrTooLarge, never a wrong answer); recognition tries the
// catalogue's forms of at most eight factors; RepeatingSets stops with
// ErrTooManySets past MaxRepeatingSets, and EachRepeating visits at most
// C(n, r) sets and stops when its callback says so; FitPowerLaw is one
// QR factorisation of its rows. Evaluation is linear in the rows. Every
// number returned is finite, or the call returns a typed error.
package pigroups
