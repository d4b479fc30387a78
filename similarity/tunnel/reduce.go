package tunnel

import (
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
)

// Reference is the model's reference geometry for its coefficients: the
// area S, the span b (for the rolling and yawing moments) and the mean
// aerodynamic chord c̄ (for the pitching moment).
type Reference struct {
	Area, Span, Chord quantity.Quantity
}

// Coefficients are force and moment coefficients in wind axes:
// C_D = D/(qS), C_Y = Y_w/(qS), C_L = L/(qS), C_l = l/(qSb),
// C_m = m/(qSc̄), C_n = n/(qSb), on the dynamic pressure q they were
// formed with.
type Coefficients struct {
	CD, CY, CL, Cl, Cm, Cn float64
}

// Coefficients returns the loads' coefficients on the dynamic pressure q
// and the reference geometry.
func (a AxisLoads) Coefficients(q quantity.Quantity, ref Reference) (Coefficients, error) {
	const op = "coefficients"
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "dynamic pressure", Value: q, Dim: quantity.Pressure},
		similarity.Input{Name: "reference area", Value: ref.Area, Dim: quantity.Area},
		similarity.Input{Name: "span", Value: ref.Span, Dim: quantity.Length},
		similarity.Input{Name: "mean aerodynamic chord", Value: ref.Chord, Dim: quantity.Length})); err != nil {
		return Coefficients{}, err
	}
	qs := q.Value() * ref.Area.Value()
	c := Coefficients{CD: a.Drag / qs, CY: a.Side / qs, CL: a.Lift / qs,
		Cl: a.Roll / (qs * ref.Span.Value()), Cm: a.Pitch / (qs * ref.Chord.Value()), Cn: a.Yaw / (qs * ref.Span.Value())}
	if err := fail(op, similarity.CheckResults(false,
		similarity.Result{Name: "C_D", Value: c.CD},
		similarity.Result{Name: "C_Y", Value: c.CY},
		similarity.Result{Name: "C_L", Value: c.CL},
		similarity.Result{Name: "C_l", Value: c.Cl},
		similarity.Result{Name: "C_m", Value: c.Cm},
		similarity.Result{Name: "C_n", Value: c.Cn})); err != nil {
		return Coefficients{}, err
	}
	return c, nil
}

// Reduction is the data reduction of one balance on one model in one
// closed test section, in the order of the procedure: the balance's
// calibration gives the loads at its moment centre; the weight tare at
// the point's attitude is subtracted; the moments are transferred to the
// model's moment reference point; the loads are resolved in wind axes at
// the point's α and β; the coefficients are formed on the uncorrected
// dynamic pressure; and CorrectWalls3D corrects them for the walls onto
// the corrected dynamic pressure.
type Reduction struct {
	Calibration *Calibration
	// Tare is the weight tare; a zero Weight subtracts nothing (readings
	// whose zero was taken with the model on at the same attitude).
	Tare WeightTare
	// Offset is the moment reference point from the balance's moment
	// centre. For the wall corrections' moment terms it is the quarter
	// point of the mean aerodynamic chord.
	Offset    Offset
	Reference Reference
	// Walls holds the tunnel's and model's geometry and chart factors for
	// CorrectWalls3D (TunnelArea, ModelVolume, ShapeFactor, Delta, the
	// curvature factors and LiftSlopePerDeg); its WingArea is taken from
	// Reference.Area and its Alpha, CL, CD, CM and Mach from each point.
	Walls Model3D
}

// Point is one wind-on data point: the balance's readings (in the
// calibration's order and unit, from its unloaded zero), the model's
// attitude, the uncorrected dynamic pressure q_u and the test section's
// uncorrected Mach number.
type Point struct {
	// Readings are the balance's readings (the calibration's
	// ReadingUnit), one per component in its order.
	Readings        []float64
	Attitude        Attitude
	DynamicPressure quantity.Quantity
	Mach            float64
}

// Reduced is one point through every step of the reduction.
type Reduced struct {
	AlphaDeg, BetaDeg float64 // from the attitude (degrees), before the wall correction
	Balance           Loads   // from the calibration, at the balance's moment centre
	Tare              Loads   // the weight's loads at the point's attitude
	Aero              Loads   // Balance − Tare, about the moment reference point
	Wind              AxisLoads
	Uncorrected       Coefficients // on the uncorrected dynamic pressure
	Corrected         Corrected3D  // corrected for the walls: α, C_L, C_D, C_m on the corrected q
}

// Reduce takes one point through the reduction. Each step's error names
// its step: a reading beyond the calibration, an attitude beyond ±180°,
// a coefficient or a blockage out of the wall corrections' range. A
// Walls.LiftSlopePerDeg the curvature correction cannot use (not in
// 0 … 0.2 per degree, as from a fit past the stall) is refused before
// the point is read, naming Walls.LiftSlopePerDeg: it is the same for
// every point.
func (r *Reduction) Reduce(p Point) (Reduced, error) {
	const op = "reduction"
	// The lift slope is the wing's, the same for every point: a slope
	// the curvature correction cannot use is the reduction's fault, not
	// the first point's.
	if w := r.Walls; w.CurvatureFactor > 0 && !(w.LiftSlopePerDeg > 0 && w.LiftSlopePerDeg < 0.2) {
		e := slopeError(op, w.LiftSlopePerDeg)
		e.Input = "Walls.LiftSlopePerDeg"
		e.Reason += " (Walls.LiftSlopePerDeg, the same for every point)"
		return Reduced{}, e
	}
	if r.Calibration == nil {
		return Reduced{}, &Error{Op: op, Fault: similarity.Invalid("calibration", "no balance calibration")}
	}
	var out Reduced
	var err error
	if out.AlphaDeg, out.BetaDeg, err = p.Attitude.Angles(); err != nil {
		return Reduced{}, err
	}
	if out.Balance, err = r.Calibration.Loads(p.Readings); err != nil {
		return Reduced{}, err
	}
	out.Tare = r.Tare.Loads(p.Attitude)
	if !out.Tare.finite() {
		return Reduced{}, &Error{Op: op, Fault: similarity.OutOfRange("weight tare", "the weight tare is not finite")}
	}
	if out.Aero, err = out.Balance.Sub(out.Tare).About(r.Offset); err != nil {
		return Reduced{}, err
	}
	if out.Wind, err = out.Aero.ToWind(out.AlphaDeg, out.BetaDeg); err != nil {
		return Reduced{}, err
	}
	if out.Uncorrected, err = out.Wind.Coefficients(p.DynamicPressure, r.Reference); err != nil {
		return Reduced{}, err
	}
	m := r.Walls
	m.WingArea = r.Reference.Area
	m.AlphaDeg, m.CL, m.CD, m.CM, m.Mach = out.AlphaDeg, out.Uncorrected.CL, out.Uncorrected.CD, out.Uncorrected.Cm, p.Mach
	if out.Corrected, err = CorrectWalls3D(m); err != nil {
		return Reduced{}, err
	}
	return out, nil
}

// Estimate is a fitted value with its confidence interval.
type Estimate struct {
	// Value is the fitted value, in the unit of what is estimated (per
	// degree for LiftSlopePerDeg, degrees for ZeroLiftAlphaDeg,
	// dimensionless for CD0 and K).
	Value float64
	// Interval is the confidence interval of Value (same unit).
	Interval [2]float64
}

// nearestOutside names the nearest angles below and above the linear
// range, the ones a wider range would take in first.
func nearestOutside(alphaDeg []float64, lo, hi float64) string {
	below, above := math.Inf(-1), math.Inf(1)
	for _, x := range alphaDeg {
		if x < lo && x > below {
			below = x
		}
		if x > hi && x < above {
			above = x
		}
	}
	var parts []string
	if !math.IsInf(below, 0) {
		parts = append(parts, fmt.Sprintf("%.3f° below", below))
	}
	if !math.IsInf(above, 0) {
		parts = append(parts, fmt.Sprintf("%.3f° above", above))
	}
	if len(parts) == 0 {
		return ""
	}
	return "; the nearest points outside it are at " + strings.Join(parts, " and ")
}

// Polar is a model's lift curve and drag polar fitted to corrected
// coefficients: C_L = a·(α − α₀) over the linear range of the lift curve,
// and the parabolic polar C_D = C_D0 + K·C_L² over the same points.
type Polar struct {
	// AlphaRangeDeg is the range of α (degrees) taken as linear; N the
	// number of points in it.
	AlphaRangeDeg [2]float64
	N             int
	// LiftSlopePerDeg is dC_L/dα (per degree) and ZeroLiftAlphaDeg α₀ (degrees),
	// from a straight line C_L = a₀ + a·α; the interval of α₀ = −a₀/a is
	// first-order (delta method with the covariance of a₀ and a).
	LiftSlopePerDeg, ZeroLiftAlphaDeg Estimate
	// CD0 and K are the polar's C_D at zero lift and its induced-drag
	// factor, from a straight line of C_D against C_L².
	CD0, K Estimate
	// Lift and Drag are the two straight-line fits, with their rows,
	// outlier flags and notes.
	Lift, Drag *fit.Poly
	// Level is the intervals' confidence level.
	Level float64
}

// FitPolar fits the lift curve and the parabolic drag polar to corrected
// points (α in degrees, C_L, C_D), using the points whose α lies in
// [alphaLoDeg, alphaHiDeg] (degrees), the range the engineer judges linear (below the
// stall, above any negative stall), with intervals at the confidence
// level (0.95 if zero). Both fits are straight lines by quantity/fit's
// FitPoly. The parabolic polar is symmetric about C_L = 0; a cambered
// wing whose least drag lies at C_L ≠ 0 is fitted only approximately by
// it (compare the Drag fit's residuals). It needs at least three points
// in the range with distinct α and distinct C_L².
func FitPolar(alphaDeg, cl, cd []float64, alphaLoDeg, alphaHiDeg, level float64) (Polar, error) {
	const op = "polar fit"
	if len(alphaDeg) != len(cl) || len(alphaDeg) != len(cd) {
		return Polar{}, &Error{Op: op, Fault: similarity.Invalid("points", fmt.Sprintf("%d angles, %d lift and %d drag coefficients: want one of each per point", len(alphaDeg), len(cl), len(cd)))}
	}
	if !(alphaLoDeg < alphaHiDeg) || math.Abs(alphaLoDeg) > maxAngleDeg || math.Abs(alphaHiDeg) > maxAngleDeg {
		return Polar{}, &Error{Op: op, Fault: similarity.Invalid("alphaDeg range", fmt.Sprintf("the linear range %s … %s° must be finite and increasing", sig(alphaLoDeg, 6), sig(alphaHiDeg, 6)))}
	}
	if level == 0 {
		level = 0.95
	}
	if !(level > 0 && level < 1) {
		return Polar{}, &Error{Op: op, Fault: similarity.Invalid("level", fmt.Sprintf("confidence level %s: want 0 < level < 1", sig(level, 6)))}
	}
	var a, l, l2, d []float64
	for i := range alphaDeg {
		if math.IsNaN(alphaDeg[i]) || math.IsInf(alphaDeg[i], 0) || !(math.Abs(cl[i]) <= maxCoefficient) || !(math.Abs(cd[i]) <= maxCoefficient) {
			return Polar{}, &Error{Op: op, Fault: similarity.OutOfRange(fmt.Sprintf("point %d", i+1), fmt.Sprintf("point %d: α, C_L and C_D must be finite and the coefficients within ±%g", i+1, maxCoefficient))}
		}
		if alphaDeg[i] >= alphaLoDeg && alphaDeg[i] <= alphaHiDeg {
			a, l, l2, d = append(a, alphaDeg[i]), append(l, cl[i]), append(l2, cl[i]*cl[i]), append(d, cd[i])
		}
	}
	if len(a) < 3 {
		return Polar{}, &Error{Op: op, Fault: similarity.Invalid("points", fmt.Sprintf("%d points in the linear range %s … %s°: want at least 3%s", len(a), sig(alphaLoDeg, 6), sig(alphaHiDeg, 6), nearestOutside(alphaDeg, alphaLoDeg, alphaHiDeg)))}
	}
	opt := &fit.Options{Level: level}
	p := Polar{AlphaRangeDeg: [2]float64{alphaLoDeg, alphaHiDeg}, N: len(a), Level: level}
	var err error
	if p.Lift, err = fit.FitPoly(a, l, 1, opt); err != nil {
		return Polar{}, &Error{Op: op, Fault: similarity.Caused("lift curve", "the lift curve cannot be fitted", err)}
	}
	if p.Drag, err = fit.FitPoly(l2, d, 1, opt); err != nil {
		return Polar{}, &Error{Op: op, Fault: similarity.Caused("drag polar", "the drag polar cannot be fitted", err)}
	}
	// Coefficients of the powers of x with their standard errors; the
	// t quantile is the fits' own (interval half-width over SE).
	la, lse, err := p.Lift.Power()
	if err != nil {
		return Polar{}, &Error{Op: op, Fault: similarity.Caused("lift curve", "the lift curve's coefficients", err)}
	}
	da, dse, err := p.Drag.Power()
	if err != nil {
		return Polar{}, &Error{Op: op, Fault: similarity.Caused("drag polar", "the drag polar's coefficients", err)}
	}
	tq := tQuantile(p.Lift)
	p.LiftSlopePerDeg = estimate(la[1], tq*lse[1])
	td := tQuantile(p.Drag)
	p.CD0, p.K = estimate(da[0], td*dse[0]), estimate(da[1], td*dse[1])
	if !(la[1] != 0) {
		return Polar{}, &Error{Op: op, Fault: similarity.Invalid("lift curve", "the lift curve has no slope: no zero-lift angle")}
	}
	// α₀ = −a₀/a₁; in the fit's scaled variable t = (α − c)/s,
	// C_L = B₀ + B₁t, so α₀ = c − s·B₀/B₁, and to first order
	// var α₀ = s²·(var B₀/B₁² + B₀²·var B₁/B₁⁴ − 2·B₀·cov/B₁³).
	b0, b1, s := p.Lift.B[0], p.Lift.B[1], p.Lift.Scale
	a0 := p.Lift.Center - s*b0/b1
	v := s * s * (p.Lift.Cov(0, 0)/(b1*b1) + b0*b0*p.Lift.Cov(1, 1)/(b1*b1*b1*b1) - 2*b0*p.Lift.Cov(0, 1)/(b1*b1*b1))
	p.ZeroLiftAlphaDeg = estimate(a0, tq*math.Sqrt(math.Max(v, 0)))
	for _, e := range []Estimate{p.LiftSlopePerDeg, p.ZeroLiftAlphaDeg, p.CD0, p.K} {
		if !allFinite(e.Value, e.Interval[0], e.Interval[1]) {
			return Polar{}, &Error{Op: op, Fault: similarity.OutOfRange("polar", "a fitted value or interval is out of the range of a float64")}
		}
	}
	return p, nil
}

// tQuantile returns the Student t factor of the fit's intervals.
func tQuantile(f *fit.Poly) float64 {
	if f.StdErr[1] > 0 {
		return (f.Intervals[1][1] - f.B[1]) / f.StdErr[1]
	}
	return 0
}

func estimate(v, half float64) Estimate {
	return Estimate{Value: v, Interval: [2]float64{v - half, v + half}}
}

func allFinite(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}
