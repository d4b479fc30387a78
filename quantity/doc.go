// Package quantity provides the dimension-checked value type on which the
// rest of similis rests: Dim, the exponents of the seven SI base
// dimensions; Quantity, a float64 in coherent SI units with its Dim; and
// Series, one channel of test data sharing a Dim.
//
// # Dimensions
//
// A Dim holds the exponents of L, M, T, I, Θ, N and J (ISO 80000-1 order)
// exactly, as whole numbers of sixths, so halves and thirds are exact
// (fracture toughness in MPa·√m is M L^(-1/2) T⁻²). Dims are comparable
// and print in the ISO dimension form (L⁻¹ M T⁻²) or the SI base-unit form
// (kg·m⁻¹·s⁻²). Named kinds of quantity (Pressure, DynamicViscosity, …)
// are exported as Dims, and KindName names a Dim in messages.
//
// # Text
//
// A Quantity prints (String, %v, MarshalText) its value and its coherent SI
// unit: one of a fixed set of twelve names — N, Pa, W, N·m, Pa·s, N/m,
// N/m³, W/m², W/(m·K), W/(m²·K), J/K, J/(kg·K) — where the dimension is
// exactly that unit's, the SI base-unit form otherwise ("138434.1 N",
// "0.0010016 Pa·s", "1.225 kg·m⁻³", "2 s⁻¹"); ParseQuantitySI reads every
// such text back to the same bits. Energy and torque share a dimension
// and print N·m, right for both (1 J = 1 N·m), where J would misname a
// torque. To print in any other unit, with prefixes or a chosen
// precision, use the units package's Printer.
//
// # Error model
//
// A dimension mismatch never yields a number. There are two ways it is
// reported, chosen by where the dimensions come from:
//
//   - In code a programmer wrote, a mismatch is a bug. Quantity and Series
//     arithmetic panics with an *Error of class ErrDimension whose
//     message names the operation and both sides with their kinds —
//     "cannot add pressure, stress [Pa] and velocity [m·s⁻¹]" —
//     so the bug surfaces on the formula's first run, with a stack trace.
//   - For values whose dimensions come from input (a file, a user), check
//     them first with Quantity.Check or Series.Check, which return the
//     error; or run a user-supplied formula through Eval, which turns the
//     panic into a returned error.
//
// Dim's own methods (Mul, Div, Pow, …) return errors rather than panic.
// The package has one error type, *Error: every error it returns or
// panics with is one, matching its Class (ErrDimension for a dimension
// that is wrong) under errors.Is, and errors.As recovers its fields —
// the operation, the input, the position, the caller's name for the
// value, the two dimensions and the cause.
//
// # The exponent algebra and the error classes
//
// Rat is the module's exact exponent (zero value 0, comparable, with text
// encoding); a Dim reports its exponents as Rats (Dim.Exponent), and the
// other packages use Rat for Pi-group exponents and scale laws. Product
// is the one product-of-powers formatter: dimensions, units, Pi groups
// and scale laws are all written through it, in the Unicode, ASCII,
// LaTeX or Markdown Style. ErrDimension, ErrRange, ErrParse, ErrUnknown
// and ErrInvalid are the error classes of the whole module.
//
// # Bounds
//
// ParseDim and ParseQuantitySI read at most 256 bytes (320 for a
// quantity) in one pass; ParseRat reads at most 41. Rat arithmetic
// reports an overflow of its int64 numerator or denominator as an error.
//
// Quantity arithmetic does not allocate; a Quantity is 16 bytes with no
// pointer, so formulas written with it cost close to plain float64 code.
// See the README for measured figures.
package quantity
