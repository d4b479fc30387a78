package ship

import (
	"fmt"
	"math"
	"slices"

	"similis.dev/similis/internal/roots"
	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

// OpenWaterRun is one steady point of a propeller open-water test: the
// advance speed, the rate of revolution and the propeller's thrust and
// torque, each net of the idle values of the hub or dummy boss measured
// without blades (the test's own correction, made before this point).
type OpenWaterRun struct {
	// Speed is the advance speed V_A, the carriage speed in open water.
	Speed quantity.Quantity
	// RevsPerSecond is n in revolutions per second: not rad/s, not rpm.
	// An angular velocity ω in rad/s gives n = ω/2π.
	RevsPerSecond float64
	Thrust        quantity.Quantity // T
	Torque        quantity.Quantity // Q
}

// OpenWaterTest is a model propeller's open-water test, to be reduced to
// coefficients and faired (ITTC Recommended Procedure 7.5-02-03-02.1,
// open water test; the definitions below are quoted from memory).
type OpenWaterTest struct {
	// Diameter is the model propeller's D.
	Diameter quantity.Quantity
	// Chord is the blade's chord at 0.7R, model scale, for the test's
	// Reynolds number Re_0.7.
	Chord quantity.Quantity
	// Water is the tank's water during the test (density, kinematic
	// viscosity).
	Water fluids.State
	// Runs are the test's points, at least five, in any order.
	Runs []OpenWaterRun
	// Order is the order of both the K_T and the K_Q polynomial in J
	// (1 … 6). Zero chooses each by Criterion among orders 1 … 4 (the
	// usual open-water curve is a polynomial of order 2 to 4 in J,
	// common practice), and the choice is stated in Poly.Notes.
	Order int
	// Criterion chooses the order when Order is zero; fit.NextTerm (the
	// zero value) stops at the first order whose next term is not
	// significant at 5 %.
	Criterion fit.Criterion
	// Level is the confidence level of the fits' intervals, 0.95 if zero.
	Level float64
}

// OpenWaterReduced is one run of an open-water test reduced to
// coefficients, with n in revolutions per second:
//
//	J = V_A/(nD), K_T = T/(ρn²D⁴), K_Q = Q/(ρn²D⁵), η₀ = J·K_T/(2π·K_Q),
//
// and the run's Reynolds number at 0.7R,
// Re_0.7 = c_0.7·√(V_A² + (0.7πnD)²)/ν.
type OpenWaterReduced struct {
	J, KT, KQ, Eta0 float64
	Reynolds        float64
}

// UsualOpenWaterReynolds is the Re_0.7 below which an open-water test is
// flagged: the blade boundary layer may be partly laminar, and K_Q in
// particular is then not that of a turbulent blade. ITTC's open water
// test procedure asks for at least about 2×10⁵ (7.5-02-03-02.1; from
// memory; common practice).
const UsualOpenWaterReynolds = 2e5

// OpenWaterFit is a reduced and faired open-water curve: K_T and K_Q
// (not 10K_Q) each a polynomial in J fitted by least squares over the
// measured J range, with the fits' intervals. η₀ is derived from the two
// faired coefficients, not fitted itself.
type OpenWaterFit struct {
	Points     []OpenWaterReduced // the runs, in increasing J
	KT, KQ     *fit.Poly          // the faired K_T(J) and K_Q(J)
	JMin, JMax float64            // the fitted J range: no extrapolation
	// MinReynolds and MaxReynolds are the runs' extreme Re_0.7.
	MinReynolds, MaxReynolds float64
	// Chord and Viscosity are kept for the Reynolds numbers of a
	// self-propulsion test with the same propeller.
	//
	// Chord is the test's model chord c_0.7 (m).
	Chord float64
	// Viscosity is the water's kinematic viscosity ν (m²/s).
	Viscosity float64
	// Warning, when not empty, says why the curve is doubtful (a
	// Reynolds number below UsualOpenWaterReynolds, an outlier among the
	// runs); every report that prints the curve prints it.
	Warning string
}

// PropellerReynolds returns a propeller blade section's Reynolds number
// at the radius fraction x = r/R, Re_x = c_x·√(V_A² + (xπnD)²)/ν, with
// n in revolutions per second: x = 0.7 for the open-water test's Re_0.7,
// x = 0.75 for the ITTC-1978 scale correction's Re_co
// (PropellerGeometry.ModelReynolds).
func PropellerReynolds(chord, speed quantity.Quantity, revsPerSecond float64, diameter quantity.Quantity, x float64, nu quantity.Quantity) (float64, error) {
	const op = "propeller Reynolds number"
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "chord", Value: chord, Dim: quantity.Length},
		similarity.Input{Name: "diameter", Value: diameter, Dim: quantity.Length},
		similarity.Input{Name: "kinematic viscosity", Value: nu, Dim: quantity.KinematicViscosity})); err != nil {
		return 0, err
	}
	if err := speed.CheckNamed("advance speed", quantity.Velocity); err != nil {
		return 0, err
	}
	if !(speed.Value() >= 0) || math.IsInf(speed.Value(), 0) {
		return 0, &Error{Op: op, Fault: similarity.Invalid("advance speed", fmt.Sprintf("advance speed %v m/s: want a finite value ≥ 0", speed.Value()))}
	}
	if !(revsPerSecond > 0) || math.IsInf(revsPerSecond, 0) {
		return 0, &Error{Op: op, Fault: similarity.Invalid("n", fmt.Sprintf("n = %v rev/s: want a positive finite rate of revolution", revsPerSecond))}
	}
	if !(x > 0 && x <= 1) {
		return 0, &Error{Op: op, Fault: similarity.Invalid("r/R", fmt.Sprintf("radius fraction r/R = %v: want 0 < r/R ≤ 1", x))}
	}
	re := bladeReynolds(chord.Value(), speed.Value(), revsPerSecond, diameter.Value(), x, nu.Value())
	if err := fail(op, similarity.CheckResults(true, similarity.Result{Name: "Reynolds number", Value: re})); err != nil {
		return 0, err
	}
	return re, nil
}

// bladeReynolds is PropellerReynolds' Re_x = c_x·√(V_A² + (xπnD)²)/ν
// on plain SI values (n in rev/s), unchecked.
func bladeReynolds(chord, speed, revsPerSecond, diameter, x, nu float64) float64 {
	return chord * math.Hypot(speed, x*math.Pi*revsPerSecond*diameter) / nu
}

// MinOpenWaterRuns is the fewest runs ReduceOpenWater takes.
const MinOpenWaterRuns = 5

// ReduceOpenWater reduces an open-water test to K_T, K_Q and η₀ per run
// and fairs K_T and K_Q by polynomials in J (package fit: QR least
// squares, intervals with Student's t). It refuses a run that is not
// finite or not physical (n ≤ 0, V_A < 0, Q ≤ 0), two runs at one J
// that do not leave enough distinct J for the order, and a faired K_T
// that is not decreasing over the measured J range: thrust identity
// reads J back from K_T and needs one J per K_T. A Reynolds number below
// UsualOpenWaterReynolds, and any run the fits flag as an outlier, is
// stated in Warning.
func ReduceOpenWater(t OpenWaterTest) (*OpenWaterFit, error) {
	const op = "open-water test"
	if err := fail(op, similarity.CheckInputs(true,
		similarity.Input{Name: "propeller diameter", Value: t.Diameter, Dim: quantity.Length},
		similarity.Input{Name: "chord at 0.7R", Value: t.Chord, Dim: quantity.Length},
		similarity.Input{Name: "water density", Value: t.Water.Density, Dim: quantity.Density},
		similarity.Input{Name: "water viscosity", Value: t.Water.KinematicViscosity, Dim: quantity.KinematicViscosity})); err != nil {
		return nil, err
	}
	if len(t.Runs) < MinOpenWaterRuns || len(t.Runs) > fit.MaxRows {
		return nil, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("%d runs: want %d … %d", len(t.Runs), MinOpenWaterRuns, fit.MaxRows))}
	}
	if t.Order < 0 || t.Order > 6 {
		return nil, &Error{Op: op, Fault: similarity.Invalid("order", fmt.Sprintf("polynomial order %d: want 1 … 6, or 0 to choose it", t.Order))}
	}
	d, rho, nu := t.Diameter.Value(), t.Water.Density.Value(), t.Water.KinematicViscosity
	f := &OpenWaterFit{MinReynolds: math.Inf(1), Chord: t.Chord.Value(), Viscosity: nu.Value()}
	for i, r := range t.Runs {
		name := fmt.Sprintf("run %d", i+1)
		for _, c := range []similarity.Input{{Name: name + ": advance speed", Value: r.Speed, Dim: quantity.Velocity}, {Name: name + ": thrust", Value: r.Thrust, Dim: quantity.Force}, {Name: name + ": torque", Value: r.Torque, Dim: quantity.Torque}} {
			if err := c.Value.CheckNamed(c.Name, c.Dim); err != nil {
				return nil, err
			}
			if v := c.Value.Value(); math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, &Error{Op: op, Fault: similarity.Invalid(c.Name, fmt.Sprintf("%s = %v: not a finite number (a missing value?)", c.Name, v))}
			}
		}
		va, n, th, q := r.Speed.Value(), r.RevsPerSecond, r.Thrust.Value(), r.Torque.Value()
		if !(n > 0) || math.IsInf(n, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name+": n", fmt.Sprintf("%s: n = %v rev/s: want a positive finite rate of revolution", name, n))}
		}
		if !(va >= 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name+": advance speed", fmt.Sprintf("%s: V_A = %v m/s: want ≥ 0 (a propeller going astern is not an open-water curve)", name, va))}
		}
		if !(q > 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name+": torque", fmt.Sprintf("%s: Q = %v N·m: want a positive torque (at or beyond zero torque the propeller is windmilling)", name, q))}
		}
		re, err := PropellerReynolds(t.Chord, r.Speed, n, t.Diameter, 0.7, nu)
		if err != nil {
			return nil, &Error{Op: op, Fault: similarity.Caused(name, name, err)}
		}
		p := OpenWaterReduced{J: va / (n * d), KT: th / (rho * n * n * d * d * d * d), KQ: q / (rho * n * n * d * d * d * d * d), Reynolds: re}
		p.Eta0 = p.J * p.KT / (2 * math.Pi * p.KQ)
		if !allFinite(p.J, p.KT, p.KQ, p.Eta0) || !(p.KQ > 0) {
			return nil, &Error{Op: op, Fault: similarity.OutOfRange(name, fmt.Sprintf("%s: the coefficients J = %v, K_T = %v, K_Q = %v are out of the range of a float64", name, p.J, p.KT, p.KQ))}
		}
		if !(p.J <= 2) || !(math.Abs(p.KT) < 2) || !(p.KQ < 1) {
			return nil, &Error{Op: op, Fault: similarity.Invalid(name, fmt.Sprintf("%s: J = %.4g, K_T = %.4g, K_Q = %.4g: want J ≤ 2, |K_T| < 2, K_Q < 1 (a unit slip: n in rev/s, D in m?)", name, p.J, p.KT, p.KQ))}
		}
		f.MinReynolds, f.MaxReynolds = min(f.MinReynolds, re), max(f.MaxReynolds, re)
		f.Points = append(f.Points, p)
	}
	slices.SortStableFunc(f.Points, func(a, b OpenWaterReduced) int {
		switch {
		case a.J < b.J:
			return -1
		case a.J > b.J:
			return 1
		}
		return 0
	})
	js, kt, kq := make([]float64, len(f.Points)), make([]float64, len(f.Points)), make([]float64, len(f.Points))
	for i, p := range f.Points {
		js[i], kt[i], kq[i] = p.J, p.KT, p.KQ
	}
	f.JMin, f.JMax = js[0], js[len(js)-1]
	if !(f.JMax-f.JMin > 0.05) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("runs", fmt.Sprintf("the runs span J = %.4g … %.4g: too narrow a range to fair a curve", f.JMin, f.JMax))}
	}
	opt := &fit.Options{Level: t.Level}
	var err error
	for _, c := range []struct {
		name string
		y    []float64
		dst  **fit.Poly
	}{{"K_T", kt, &f.KT}, {"K_Q", kq, &f.KQ}} {
		if t.Order > 0 {
			*c.dst, err = fit.FitPoly(js, c.y, t.Order, opt)
		} else {
			*c.dst, err = fit.SelectPoly(js, c.y, 4, t.Criterion, opt)
		}
		if err != nil {
			return nil, &Error{Op: op, Fault: similarity.Caused(c.name, "fairing "+c.name+" against J", err)}
		}
	}
	if inc, err := f.KT.Monotone(f.JMin, f.JMax); err != nil || inc {
		return nil, &Error{Op: op, Fault: similarity.Invalid("K_T", fmt.Sprintf("the faired K_T (order %d) is not decreasing over J = %.4g … %.4g: thrust identity needs one J for each K_T (choose another order, or check the runs)", f.KT.Order, f.JMin, f.JMax))}
	}
	var warn []string
	if f.MinReynolds < UsualOpenWaterReynolds {
		warn = append(warn, fmt.Sprintf("the test's Reynolds number Re_0.7 falls to %.3g, below the usual minimum %.0e (ITTC 7.5-02-03-02.1; from memory): the blade flow may be partly laminar and K_Q too low or too high for a turbulent blade", f.MinReynolds, UsualOpenWaterReynolds))
	}
	for _, c := range []struct {
		name string
		p    *fit.Poly
	}{{"K_T", f.KT}, {"K_Q", f.KQ}} {
		warn = append(warn, outlierNotes(c.p, "J", "", c.name)...)
	}
	f.Warning = joinWarnings(warn)
	return f, nil
}

// At returns the faired K_T and K_Q at J, which must lie in the measured
// range (an *Error of class quantity.ErrRange otherwise).
func (f *OpenWaterFit) At(j float64) (OpenWaterPoint, error) {
	if !(j >= f.JMin && j <= f.JMax) {
		return OpenWaterPoint{}, &Error{Op: "open-water curve", Fault: similarity.OutOfRange("J", fmt.Sprintf("J = %v is outside the measured J = %.4g … %.4g: the faired curve is not extrapolated", j, f.JMin, f.JMax))}
	}
	return OpenWaterPoint{J: j, KT: f.KT.Eval(j), KQ: f.KQ.Eval(j)}, nil
}

// Eta0 returns the open-water efficiency η₀ = J·K_T/(2π·K_Q) of the faired
// curve at J, within the measured range.
func (f *OpenWaterFit) Eta0(j float64) (float64, error) {
	p, err := f.At(j)
	if err != nil {
		return 0, err
	}
	if !(p.KQ > 0) {
		return 0, &Error{Op: "open-water curve", Fault: similarity.OutOfRange("K_Q", fmt.Sprintf("the faired K_Q at J = %.4g is %v: η₀ is not defined", j, p.KQ))}
	}
	return j * p.KT / (2 * math.Pi * p.KQ), nil
}

// JForKT returns the J at which the faired K_T equals kt: the thrust
// identity of a self-propulsion analysis. A kt outside the faired
// curve's K_T over the measured J range is an *Error of class
// quantity.ErrRange.
func (f *OpenWaterFit) JForKT(kt float64) (float64, error) {
	const op = "thrust identity"
	g := func(j float64) float64 { return f.KT.Eval(j) - kt }
	hi, lo := f.KT.Eval(f.JMin), f.KT.Eval(f.JMax)
	if !(kt <= hi && kt >= lo) {
		return 0, &Error{Op: op, Fault: similarity.OutOfRange("K_T", fmt.Sprintf("K_T = %.5g is outside the faired open-water K_T = %.5g … %.5g (J = %.4g … %.4g): the curve is not extrapolated", kt, lo, hi, f.JMin, f.JMax))}
	}
	j, err := roots.Bisect(g, f.JMin, f.JMax)
	if err != nil {
		return 0, &Error{Op: op, Fault: similarity.Caused("K_T", "no J for this K_T on the faired curve", err)}
	}
	return j, nil
}

// Table returns the faired curve at n equally spaced J over the measured
// range (2 ≤ n ≤ 1000), for a printed table or for PoweringInput.OpenWater.
func (f *OpenWaterFit) Table(n int) ([]OpenWaterPoint, error) {
	if n < 2 || n > 1000 {
		return nil, &Error{Op: "open-water curve", Fault: similarity.Invalid("points", fmt.Sprintf("%d points: want 2 … 1000", n))}
	}
	out := make([]OpenWaterPoint, n)
	for i := range n {
		j := f.JMin + (f.JMax-f.JMin)*float64(i)/float64(n-1)
		if i == n-1 {
			j = f.JMax
		}
		out[i] = OpenWaterPoint{J: j, KT: f.KT.Eval(j), KQ: f.KQ.Eval(j)}
	}
	return out, nil
}

// perturbed returns a copy of f whose K_T (which = 0) or K_Q (which = 1)
// coefficient k is moved by h: for the sensitivities of a prediction to
// the fit.
func (f *OpenWaterFit) perturbed(which, k int, h float64) *OpenWaterFit {
	g := *f
	src := f.KT
	if which == 1 {
		src = f.KQ
	}
	p := *src
	p.B = slices.Clone(src.B)
	p.B[k] += h
	if which == 0 {
		g.KT = &p
	} else {
		g.KQ = &p
	}
	return &g
}

// outlierNotes describes the rows a fit flags as outliers, unless the
// fit is exact to rounding (its residuals then studentise to noise).
func outlierNotes(p *fit.Poly, x, unit, y string) []string {
	ymax := 0.0
	for _, r := range p.Rows {
		ymax = max(ymax, math.Abs(r.Y))
	}
	if p.S <= 1e-9*ymax {
		return nil
	}
	var out []string
	for _, i := range p.Outliers {
		r := p.Rows[i]
		out = append(out, fmt.Sprintf("the run at %s = %.4g%s has an externally studentised residual of %.3g from the faired %s (its residual %.3g is %.3g times the fit's residual standard deviation S = %s; an outlier; not dropped)",
			x, r.X, unit, math.Abs(r.Studentized), y, r.Residual, math.Abs(r.Residual)/p.S, sigN(p.S, 2)))
	}
	return out
}

// joinWarnings joins warnings with "; ".
func joinWarnings(w []string) string {
	s := ""
	for i, x := range w {
		if i > 0 {
			s += "; "
		}
		s += x
	}
	return s
}
