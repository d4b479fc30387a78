// Package uncertain carries a measured Quantity together with its
// standard uncertainty, propagated to first order through arithmetic and
// the quantity functions as in JCGM 100:2008 (the GUM), §5.1 and §5.2.
//
// Every uncertainty comes from a named Source, registered in a Set: a
// calibration, a repeatability, a resolution, a fluid-property
// correlation. Each Source records what an uncertainty budget needs: its
// standard uncertainty, whether it is a Type A evaluation (with its
// degrees of freedom) or Type B (with the distribution assumed), and
// whether it is a systematic or a random effect, as test-uncertainty
// practice separates them.
//
// A Measured value holds its estimate and, for each source it depends on,
// the derivative of the value with respect to that source's error (the
// sensitivity coefficient times the source's standard uncertainty). The
// derivatives are exact, carried forward through each operation by the
// chain rule (forward-mode differentiation), not by finite differences.
// Since each source keeps its identity, two inputs that share a source (two
// transducers calibrated against one standard) are correlated
// automatically: the standard's error enters both, and cancels in their
// difference. Correlation between distinct sources is given with
// Set.Correlate. The combined standard uncertainty is GUM eq. (13):
//
//	u_c²(y) = Σ_k d_k² + 2 Σ_{k<l} r_kl d_k d_l,   d_k = ∂y/∂δ_k · u(δ_k)
//
// Budget reports it with the effective degrees of freedom
// (Welch–Satterthwaite, GUM eq. G.2b), the expanded uncertainty at a
// chosen coverage probability with the Student t coverage factor, and a
// table of contributions by source with the systematic and random parts
// apart, as text or Markdown. MonteCarlo propagates the same model by
// sampling, as in JCGM 101:2008 (a Type A source drawn as a t variable
// scaled by its standard uncertainty, §6.4.9), with at most MaxTrials
// trials so that its memory is bounded, and Validate applies its §8 test
// to say whether the first-order result holds for the model.
//
// Reports read as the trade writes them: a standard uncertainty to two
// significant digits and the estimate to the same decimal place (GUM
// §7.2.6), in SI units with a derived unit's name where the dimension has
// one (N, Pa, W, Pa·s; N·m for energy and torque alike) and a decimal
// prefix for a large or small value (138.43 kN ± 0.83 kN); sensitivity
// coefficients in the unit of the result per unit of the source (N/K,
// m/Pa). Numbers are written in powers of ten when the larger of |x| and
// u, in the unit shown, is below 10⁻³ or at least 10⁶, or when u is below
// 10⁻⁶ (1.7938×10⁻⁵ ± 1.5×10⁻⁸), with the same rounding. Where u exceeds
// |x| the estimate keeps two significant digits of its own rather than
// rounding to 0, and Measured.String adds "(u exceeds the value)":
// 1.2×10⁹ ± 1.7×10¹¹ (u exceeds the value).
//
// Dimensions are checked exactly as for Quantity: adding a pressure to a
// velocity panics with a *quantity.Error of class quantity.ErrDimension,
// and Eval turns the panic into an error. A value depends on at most
// MaxTerms sources; an operation that would exceed it panics with an
// *Error whose Terms is set, which Eval also returns. An operation whose
// result, or whose derivative with respect to an uncertain operand, is not
// a finite number — 1/0, the logarithm of 0, √0 with an uncertainty, an
// overflow — panics with an *Error of class quantity.ErrRange, which Eval
// returns too; no NaN or infinite value comes out of Eval, Budget or
// MonteCarlo with a nil error. Every error of the package matches exactly
// one of the module's classes under errors.Is (quantity.ErrDimension,
// ErrRange or ErrInvalid), with its cause kept for errors.As. Operations
// do not allocate. A Measured is a value of about 200 bytes; in a loop
// over many rows the in-place forms (z.SetMul(x, y), z.SetAdd(x, y), …)
// write into a destination through pointers and copy nothing, with results
// identical to the value forms.
//
// First-order propagation is exact for a model linear in its inputs and
// an approximation otherwise; where the model is strongly nonlinear
// within the inputs' uncertainty, check it with MonteCarlo. An
// uncertainty statement for a rating, an acceptance test or a design
// follows the procedure its standard prescribes and the judgment of the
// engineer responsible.
package uncertain
