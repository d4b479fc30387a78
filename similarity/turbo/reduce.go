package turbo

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
)

// The band of test speeds, as fractions of the specified speed, within
// which ReducePoints translates a test point by the affinity laws: ISO
// 9906:2012 allows a test at 50 % to 120 % of the specified speed for the
// flow, head and power (from memory: check the band against ISO
// 9906:2012 and the contract before a pump is accepted on a test
// translated by it; a contract may set a narrower band, and the
// standard's band for NPSH tests is narrower still).
const (
	MinTestSpeedFraction = 0.5
	MaxTestSpeedFraction = 1.2
)

// MaxTestPoints is the most test points ReducePoints takes.
const MaxTestPoints = 10000

// TestPoint is one point of a pump acceptance test as measured, at the
// test speed: the volume flow rate Q, the pump total head H (a length),
// the pump power input P (shaft power) and the speed n (an angular
// velocity: give it through its unit, units.MustParse("rpm").Of(1480)).
type TestPoint struct {
	Flow, Head, Power, Speed quantity.Quantity
}

// ReducedPoint is a test point translated to the specified speed by the
// affinity laws, with its efficiency.
type ReducedPoint struct {
	Flow, Head, Power quantity.Quantity
	// Efficiency is the pump efficiency ρgQH/P, unchanged by the
	// translation.
	Efficiency float64
	// SpeedRatio is n_sp/n, the specified speed over the test speed.
	SpeedRatio float64
}

// TestConditions are the specified speed the points are translated to and
// the test liquid's density (for the efficiency).
type TestConditions struct {
	SpecifiedSpeed quantity.Quantity // n_sp, an angular velocity
	Density        quantity.Quantity // ρ of the test liquid
	Gravity        quantity.Quantity // g; g_n if zero
}

// ReducePoints translates each test point to the specified speed by the
// affinity laws, Q_sp = Q·(n_sp/n), H_sp = H·(n_sp/n)², P_sp = P·(n_sp/n)³
// (the same liquid), and gives its efficiency η = ρgQH/P, which the
// translation leaves unchanged. A test speed outside 50 % to 120 % of the
// specified speed (MinTestSpeedFraction, MaxTestSpeedFraction) is refused
// with an *Error of class quantity.ErrRange naming the point; an
// efficiency above 1 (inconsistent readings) with one of class
// quantity.ErrInvalid. Flow, head, power and speed must be positive and
// finite. See PumpCaution.
func ReducePoints(pts []TestPoint, c TestConditions) ([]ReducedPoint, error) {
	const op = "reduction to the specified speed"
	if len(pts) == 0 || len(pts) > MaxTestPoints {
		return nil, &Error{Op: op, Fault: similarity.Invalid("test points", fmt.Sprintf("%d test points: want 1 to %d", len(pts), MaxTestPoints))}
	}
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "specified speed", Value: c.SpecifiedSpeed, Dim: quantity.AngularVelocity},
		similarity.Input{Name: "density", Value: c.Density, Dim: quantity.Density})); err != nil {
		return nil, err
	}
	gq, bad := similarity.GravityOr(c.Gravity)
	if bad != nil {
		return nil, fail(op, bad)
	}
	rhoG := c.Density.Value() * gq.Value()
	nsp := c.SpecifiedSpeed.Value()
	out := make([]ReducedPoint, len(pts))
	for i, p := range pts {
		at := fmt.Sprintf("point %d", i)
		if err := fail(op, similarity.CheckInputs(true,
			similarity.Input{Name: at + ": flow", Value: p.Flow, Dim: quantity.VolumeFlowRate},
			similarity.Input{Name: at + ": head", Value: p.Head, Dim: quantity.Length},
			similarity.Input{Name: at + ": power", Value: p.Power, Dim: quantity.Power},
			similarity.Input{Name: at + ": speed", Value: p.Speed, Dim: quantity.AngularVelocity})); err != nil {
			return nil, err
		}
		frac := p.Speed.Value() / nsp
		if !(frac >= MinTestSpeedFraction && frac <= MaxTestSpeedFraction) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(at+": speed", fmt.Sprintf("%s: test speed %.4g %% of the specified speed, outside the %g %% to %g %% the affinity-law translation is used for (ISO 9906, from memory)",
				at, 100*frac, 100*MinTestSpeedFraction, 100*MaxTestSpeedFraction))}

		}
		r := nsp / p.Speed.Value()
		q, h, pw := p.Flow.Value()*r, p.Head.Value()*r*r, p.Power.Value()*r*r*r
		eta := rhoG * q * h / pw
		if err := fail(op, similarity.CheckResults(true,
			similarity.Result{Name: at + ": flow", Value: q},
			similarity.Result{Name: at + ": head", Value: h},
			similarity.Result{Name: at + ": power", Value: pw},
			similarity.Result{Name: at + ": efficiency", Value: eta})); err != nil {
			return nil, err
		}
		if eta > 1 {
			return nil, &Error{Op: op, Fault: similarity.Invalid(at+": efficiency", fmt.Sprintf("%s: efficiency ρgQH/P = %.4g is above 1: the flow, head and power readings disagree", at, eta))}
		}
		out[i] = ReducedPoint{Flow: quantity.New(q, quantity.VolumeFlowRate), Head: quantity.New(h, quantity.Length),
			Power: quantity.New(pw, quantity.Power), Efficiency: eta, SpeedRatio: r}
	}
	return out, nil
}

// CurveOptions choose how FitPumpCurves fits each curve.
type CurveOptions struct {
	// MaxOrder is the highest polynomial order compared, 3 if zero.
	MaxOrder int
	// Criterion chooses the order among 0 … MaxOrder; nil means
	// fit.TopTerm, which does not stop early on a curve nearly symmetric
	// about the middle of the tested range, as the Q–η curve is about its
	// best-efficiency point (fit.NextTerm would stop at order 0 there).
	Criterion *fit.Criterion
	// Level is the confidence level of the intervals, 0.95 if zero.
	Level float64
}

// PumpCurves are the Q–H, Q–P and Q–η curves fitted to reduced test
// points, each a polynomial in the flow in m³/s giving the head in m, the
// power in W and the efficiency as a fraction, with its order, the orders
// compared and its intervals (see quantity/fit).
type PumpCurves struct {
	Head, Power, Efficiency *fit.Poly
}

// FitPumpCurves fits the Q–H, Q–P and Q–η curves to the reduced points by
// least squares, each of the order the options' criterion selects
// (fit.SelectPoly; TopTerm unless chosen). It needs as many distinct
// flows as the highest order compared plus two; errors are the fit
// package's, wrapped in an *Error naming the curve.
func FitPumpCurves(pts []ReducedPoint, opt CurveOptions) (PumpCurves, error) {
	const op = "pump curve fit"
	maxOrder := opt.MaxOrder
	if maxOrder == 0 {
		maxOrder = 3
	}
	if maxOrder < 1 || maxOrder > fit.MaxOrder {
		return PumpCurves{}, &Error{Op: op, Fault: similarity.Invalid("maximum order", fmt.Sprintf("maximum order %d: want 1 to %d", maxOrder, fit.MaxOrder))}
	}
	if len(pts) > MaxTestPoints {
		return PumpCurves{}, &Error{Op: op, Fault: similarity.Invalid("test points", fmt.Sprintf("%d points: want at most %d", len(pts), MaxTestPoints))}
	}
	q := make([]float64, len(pts))
	h, p, e := make([]float64, len(pts)), make([]float64, len(pts)), make([]float64, len(pts))
	for i, r := range pts {
		if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: fmt.Sprintf("point %d: flow", i), Value: r.Flow, Dim: quantity.VolumeFlowRate},
			similarity.Input{Name: fmt.Sprintf("point %d: head", i), Value: r.Head, Dim: quantity.Length},
			similarity.Input{Name: fmt.Sprintf("point %d: power", i), Value: r.Power, Dim: quantity.Power})); err != nil {
			return PumpCurves{}, err
		}
		if !(r.Efficiency > 0 && r.Efficiency <= 1) {
			return PumpCurves{}, &Error{Op: op, Fault: similarity.Invalid(fmt.Sprintf("point %d: efficiency", i), fmt.Sprintf("point %d: efficiency %.4g is not in (0, 1]", i, r.Efficiency))}
		}
		q[i], h[i], p[i], e[i] = r.Flow.Value(), r.Head.Value(), r.Power.Value(), r.Efficiency
	}
	crit := fit.TopTerm
	if opt.Criterion != nil {
		crit = *opt.Criterion
	}
	fo := &fit.Options{Level: opt.Level}
	var c PumpCurves
	for _, f := range []struct {
		name string
		y    []float64
		dst  **fit.Poly
	}{{"Q–H curve", h, &c.Head}, {"Q–P curve", p, &c.Power}, {"Q–η curve", e, &c.Efficiency}} {
		pf, err := fit.SelectPoly(q, f.y, maxOrder, crit, fo)
		if err != nil {
			return PumpCurves{}, &Error{Op: op, Fault: similarity.Caused(f.name, "the "+f.name, err)}
		}
		*f.dst = pf
	}
	return c, nil
}

// finite reports whether every value is a finite number.
func finite(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}
