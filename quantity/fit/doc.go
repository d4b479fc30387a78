// Package fit holds the curve fits that test analyses share: polynomial
// least squares of a chosen order or of an order chosen by a stated
// criterion, weighted fits, a monotone fairing for curves that must not
// wiggle, the intervals of coefficients and predictions, the lack-of-fit
// test, outlier and influence flags, predictions that carry the fit's
// uncertainty as correlated sources, and nonlinear least squares.
//
// # Polynomials
//
// FitPoly fits y = Σ B_k·t^k in the scaled variable
// t = (x − Center)/Scale, which runs from −1 to 1 over the fitted x
// range, by a QR factorisation of the (weighted) design matrix: the
// normal equations, whose condition number is the square of the design
// matrix's, are never formed (Golub and Van Loan, Matrix Computations,
// 4th ed. (2013), §5.3). A design matrix whose condition number exceeds
// 10¹² is refused. Power expands B into the coefficients of the powers
// of x, with their standard errors. The fit reproduces the certified
// values of the NIST Statistical Reference Datasets Pontius (order 2),
// Wampler1 (order 5) and Filip (order 10), the last to 8 digits.
//
// SelectPoly chooses the order by a stated Criterion: NextTerm, the
// smallest order whose next coefficient is not significant (two-sided
// t test at SignificanceLevel, 5 %); TopTerm, the highest order whose own
// top coefficient is significant, by backward elimination from the
// highest order compared; or AICc, the least corrected Akaike criterion
// (Hurvich and Tsai, Biometrika 76 (1989) 297–307). NextTerm can stop
// early on a curve whose low-order terms are small; the Candidates it
// compared are kept in Poly.Selection to be read.
//
// # Weights
//
// Options.Weights are relative weights (WeightsFromU gives 1/u² from
// standard uncertainties): the residual variance per unit weight S² is
// estimated from the residuals, so scaling every weight by one constant
// changes nothing, and the intervals do not assume the uncertainties
// are known absolutely.
//
// # Intervals
//
// Coefficients have standard errors from the covariance S²·(AᵀWA)⁻¹
// (computed as S²·R⁻¹R⁻ᵀ from the QR factor) and confidence intervals
// with Student's t on ν = N − p degrees of freedom. Predict gives the
// confidence interval of the mean response at x and the prediction
// interval of one new observation there, ŷ ± t·√(S²/w̄ + SE²) with w̄ the
// mean weight (Draper and Smith, Applied Regression Analysis, 3rd ed.
// (1998), §3.1 and §3.3, from memory). Predict refuses an x outside the
// fitted range with an error of class quantity.ErrRange; Extrapolate
// makes the prediction deliberately and marks it Extrapolated.
//
// # Checks of the fit
//
// Where x values repeat, LackOfFit splits the residual sum of squares
// into pure error and lack of fit and gives F and its p-value (Draper and
// Smith, §2.1, from memory). Every row's leverage, externally
// studentised residual tᵢ and Cook's distance Dᵢ are kept in Rows; rows
// with |tᵢ| > 3 (Options.OutlierT) are listed in Outliers and those with
// Dᵢ > 4/N in Influential (both thresholds common practice). No row is
// ever dropped: refitting without a row is the caller's decision, made
// deliberately.
//
// # Monotone fairing
//
// Fair builds the monotone piecewise-cubic Hermite interpolant of
// Fritsch and Carlson (SIAM J. Numer. Anal. 17 (1980) 238–246) through
// points whose y are monotone in x. It guarantees a curve monotone in the
// same sense as the points, through each point, with a continuous slope
// and no extremum between points; it refuses points that are not
// monotone rather than return a curve that is not, and checks the
// monotonicity condition on every interval before returning. It does not
// smooth: fair fitted or averaged values, not raw scatter. Poly.Monotone
// checks a fitted polynomial on a range through the real roots of its
// slope, and Poly.Fair tabulates a polynomial as a fairing only where it
// is monotone.
//
// # Predictions with uncertainty
//
// Poly.Measured registers the coefficients B_k as sources of an
// uncertain.Set: Type A with the fit's degrees of freedom, systematic,
// correlated as the fit's covariance says. MeasuredPoly.Predict takes a
// measured x and returns an uncertain.Measured with both the fit's
// uncertainty and the input's (first order, JCGM 100:2008 §5.2); two
// predictions from one fit are correlated through the shared sources.
//
// # Nonlinear least squares
//
// FitCurve fits y = f(x; p) by the Levenberg–Marquardt method
// (Marquardt, J. SIAM 11 (1963) 431–441), each step solved by QR, with
// the covariance S²·(JᵀWJ)⁻¹ from the Jacobian at the solution (central
// differences): first-order intervals, exact only for a model linear in
// p. Its rows carry the same residual, leverage and outlier flags as a
// polynomial's, and Curve.Measured makes its parameters correlated
// sources as Poly.Measured does. It is written here rather than taken from gonum's optimize package,
// whose general minimisers neither use the least-squares structure nor
// come without a further module dependency.
//
// # Errors
//
// Every error is an *Error matching exactly one of the module's classes
// under errors.Is: quantity.ErrInvalid for data or arguments a fit
// cannot take (lengths that differ, too few rows or distinct x, a weight
// that is not positive, points that are not monotone), quantity.ErrRange
// for numbers out of range (a value that is not finite, an x outside the
// fitted range), or the class of a cause it wraps (a dimension given
// wrongly to MeasuredPoly.Predict is a quantity.ErrDimension). No result
// that is NaN or infinite comes with a nil error. Work is bounded:
// MaxRows rows, MaxOrder, MaxParams, MaxIterations.
//
// A fitted Poly, Curve or Fairing, and their Measured forms, are not
// changed by their methods and may be used from several goroutines.
//
// A fit describes the data it was made from. A correlation used for a
// hydraulic structure, a hull's powering, a pump's rating or a pressurised
// facility goes through the checks its standard or code requires and the
// judgment of the engineer responsible.
package fit
