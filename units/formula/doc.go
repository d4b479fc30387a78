// Package formula reads correlations and data-reduction formulas written
// as text, checks their dimensions once, when they are compiled against
// the dimensions of their inputs, and then evaluates them over rows or
// whole columns with no dimension work and no allocation per row.
//
// # The language
//
// A text is a sequence of statements separated by newlines or ';'. A
// statement is an assignment, name = expression, which defines a derived
// quantity that later statements may use, or a bare expression, the
// result. '#' starts a comment that runs to the end of the line.
//
//	# Darcy–Weisbach with the Swamee–Jain friction factor
//	Re = rho*V*D/mu
//	f  = 0.25 / log10(eps/(3.7*D) + 5.74/Re^0.9)^2
//	dp = f * L/D * rho*V^2/2
//
// Expressions use + − * / (also × · ÷), unary minus, parentheses, and
// powers with '^' (or '**'). An exponent is an exact number — 2, -1,
// 0.5, (1/3) — and may be any dimensionless expression when the base is
// dimensionless (Re^n). A number may carry a unit in braces, with or
// without a space before them, read by package units with its temperature
// rules: 9.80665 {m/s^2}, 20{°C}, 101.325 {kPa}. The value is held in SI,
// and a name assigned such a number has its dimension wherever it is used:
// after g = 9.80665 {m/s^2}, g*L is an area per second squared. Square
// brackets are refused in a formula (they name units in the headers of
// channel files, not in formulas).
//
// Names are UTF-8 words of letters, digits and '_' starting with a
// letter: rho, ρ, Δp, T_in; pi (or π), unless an input or a statement
// defines it, is the number π. The built-in functions are sqrt, cbrt, exp, ln (log),
// log10, abs, min, max, hypot, sin, cos, tan, asin, acos, atan, atan2 and
// if(condition, then, else), where the condition compares two quantities
// of one dimension with <, <=, >, >=, == or != and may combine such
// comparisons with 'and' and 'or': f = if(Re < 2000, 64/Re, 0.316/Re^0.25).
// solve(…) is the root of an equation (see Solving an equation), and a
// library may add functions (see Functions of a library).
//
// # Functions of a library
//
// A caller may give functions of its own, each a Func with the
// dimensions of its arguments and result declared, to Options.Compile:
//
//	formula.Options{Funcs: fluids.FormulaFuncs()}.Compile("nu = nu_water(T_w)\nRe = V*L/nu", inputs...)
//
// A call is checked against those dimensions when the text is compiled.
// At a row where the function fails (a temperature outside a
// correlation's range) the Evaluator reports an *Error of OpCheck naming the row
// and the statement, with the function's error in its Err field. The
// package keeps no registry of functions: the caller chooses them, and
// package fluids supplies the fluid properties in this form.
//
// # Solving an equation
//
// solve(x, lhs = rhs, lo, hi) is the root x of an equation between lo and
// hi, which must be of one dimension, the unknown's; the two sides of the
// equation must be of one dimension too (solve(x, g, lo, hi) solves
// g = 0). The unknown's name is local to the equation. The Colebrook–White
// friction factor, as published:
//
//	f = solve(f, 1/sqrt(f) = -2*log10(eps/(3.7*D) + 2.51/(Re*sqrt(f))), 0.005, 0.1)
//
// The root is found by Brent's method, in at most 200 evaluations of the
// equation, to a few units in the last place. A bracket whose ends give
// the equation one sign, an equation that is not finite in the bracket, or
// ends that are not in order, is an *Error of OpCheck for that row. A solve may
// not hold another solve. Gradient differentiates the root exactly, by the
// implicit function theorem.
//
// # Constants and results
//
// An operation whose operands depend on no input is computed once, when
// the text is compiled, a call of a library's function included: after
// rho0 = rho_water(20{°C}), rho0 is a number (Program.Constant), and a
// call's error is then the compile error. Options.Keep names the
// statements that are the program's results; the others are intermediate
// values, checked but given no output column.
//
// # Checked once, then fast
//
// Compile checks every operation against the dimensions of the inputs and
// refuses, with the offset of the mistake and the dimensions involved, a
// sum of a pressure and a velocity, the logarithm of a dimensional
// quantity, a fractional power that a dimension cannot hold. The compiled
// Program evaluates one row of SI values or whole columns in blocks,
// without allocating.
//
// # Results that are not finite
//
// A float64 operation gives ±Inf or NaN where the mathematics has no
// finite value — a division by zero, the logarithm of zero or of a
// negative number, the square root of a negative number, asin or acos
// outside [−1, 1], a fractional power of a negative number — or where the
// value is beyond the range of float64 (D*D*D at D = 1e200 m, exp(1000)).
// Such a result is never a number with a nil error: by default an
// Evaluator stops with an *Error of OpCheck (class quantity.ErrRange) naming the
// first row and, in it, the first statement whose result is not finite,
// and the operation that gave it. By the explicit option MarkMissing
// (Evaluator.SetCheck) it instead sets the result to NaN, the mark of a
// missing value, and counts it; only the option Unchecked gives the
// float64 results as they are, for a caller that checks them itself. A NaN in an input is a missing value:
// the results that use it are NaN, with no error. What is checked is each
// statement's result, as later statements see it, so an operation on a
// branch of if that is not taken does not count.
//
// # Bounds
//
// A text is at most MaxLen bytes with at most MaxNodes operations and
// parentheses nested at most MaxDepth deep; parsing never panics.
package formula
