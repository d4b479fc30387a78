package ship

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/gonum/stat"
	"similis.dev/similis/similarity"
)

// ProhaskaResult is a form factor found by Prohaska's method.
type ProhaskaResult struct {
	FormFactor float64 // 1 + k, the intercept
	// FormFactorStdErr is the standard error of the intercept from the
	// regression (n − 2 degrees of freedom): the Type A part of the form
	// factor's standard uncertainty.
	FormFactorStdErr float64
	Slope            float64 // m in C_T/C_F = (1 + k) + m·Fnⁿ/C_F
	Exponent         float64 // n, the Froude-number exponent (4 unless chosen or fitted)
	R2               float64
	Points           int   // runs used (Fn ≤ MaxFroude)
	Runs             []int // their indices in the input
	MaxFroude        float64
	// Warning, when not empty, says why the result is doubtful (runs
	// whose Reynolds number suggests laminar flow over the model); every
	// report that prints the form factor prints it.
	Warning string
}

// ProhaskaOptions adjust Prohaska's method.
type ProhaskaOptions struct {
	// MaxFroude is the highest Froude number used; 0.2 if zero (ITTC
	// practice is roughly 0.1 … 0.2).
	MaxFroude float64
	// Exponent is n in Fnⁿ/C_F; 4 if zero, as the ITTC procedure uses.
	Exponent float64
	// FitExponent fits n between 2 and 8 to the runs (least squares of
	// the straight line), instead of taking Exponent.
	FitExponent bool
	// Reynolds, if given, are the runs' model Reynolds numbers, for the
	// warning on laminar flow.
	Reynolds []float64
}

// LaminarReynolds is the model Reynolds number (on waterline length)
// below which a run is flagged as possibly laminar or transitional over
// part of the hull even with turbulence stimulators: common practice
// following the ITTC's recommendations on ship models and turbulence
// stimulation (ITTC 7.5-01-01-01; the figure 10⁶ is from memory, and
// basins set their own, often higher). Every hull extrapolation path
// (ExtrapolateHull, ExtrapolateHullRun, ITTC1978, Prohaska) warns below
// it.
const LaminarReynolds = 1e6

// Prohaska finds the form factor from low-speed runs: a straight line
// through C_T/C_F against Fn⁴/C_F, whose intercept is 1 + k (C. W.
// Prohaska, 1966). Only runs with Fn ≤ maxFroude are used (0.2 if zero;
// ITTC practice is roughly 0.1 … 0.2); at least three are needed.
func Prohaska(froude, ct, cf []float64, maxFroude float64) (ProhaskaResult, error) {
	return ProhaskaWith(froude, ct, cf, ProhaskaOptions{MaxFroude: maxFroude})
}

// thirdFroude says how high the Froude-number limit must be to take in
// three usable runs (the third-lowest Fn, rounded up to three decimals),
// or that the runs have fewer than three usable ones.
func thirdFroude(froude, ct, cf []float64) string {
	var fns []float64
	for i, fn := range froude {
		if fn > 0 && cf[i] > 0 && ct[i] > 0 {
			fns = append(fns, fn)
		}
	}
	if len(fns) < 3 {
		return fmt.Sprintf(", and only %d of the runs have positive Fn, C_T and C_F", len(fns))
	}
	slices.Sort(fns)
	return fmt.Sprintf(": raise the limit to at least %.3f (the third-lowest run's Fn)", math.Ceil(fns[2]*1000)/1000)
}

// ProhaskaWith is Prohaska with the Froude-number exponent chosen or
// fitted and a warning on laminar runs.
func ProhaskaWith(froude, ct, cf []float64, o ProhaskaOptions) (ProhaskaResult, error) {
	m := func(r string) error {
		return &Error{Op: "Prohaska", Fault: similarity.Invalid("", r)}
	}
	if o.MaxFroude == 0 {
		o.MaxFroude = 0.2
	}
	if o.Exponent == 0 {
		o.Exponent = 4
	}
	if !(o.Exponent >= 1 && o.Exponent <= 10) {
		return ProhaskaResult{}, m(fmt.Sprintf("exponent %v: want 1 … 10 (4 is the usual)", o.Exponent))
	}
	if len(froude) != len(ct) || len(ct) != len(cf) || o.Reynolds != nil && len(o.Reynolds) != len(ct) {
		return ProhaskaResult{}, m("Froude numbers, C_T, C_F (and Reynolds numbers) differ in length")
	}
	var runs []int
	for i, fn := range froude {
		if fn <= o.MaxFroude && fn > 0 && cf[i] > 0 && ct[i] > 0 {
			runs = append(runs, i)
		}
	}
	if len(runs) < 3 {
		return ProhaskaResult{}, m(fmt.Sprintf("%d runs at Fn ≤ %g; at least 3 are needed%s", len(runs), o.MaxFroude, thirdFroude(froude, ct, cf)))
	}
	line := func(n float64) (x, y []float64) {
		for _, i := range runs {
			x = append(x, math.Pow(froude[i], n)/cf[i])
			y = append(y, ct[i]/cf[i])
		}
		return x, y
	}
	n := o.Exponent
	if o.FitExponent {
		// Golden-section search of the residual sum of squares over n.
		sse := func(n float64) float64 {
			x, y := line(n)
			a, b := stat.LinearRegression(x, y, nil, false)
			var s float64
			for i := range x {
				e := y[i] - a - b*x[i]
				s += e * e
			}
			return s
		}
		lo, hi := 2.0, 8.0
		g := (math.Sqrt(5) - 1) / 2
		c, d := hi-g*(hi-lo), lo+g*(hi-lo)
		fc, fd := sse(c), sse(d)
		for hi-lo > 1e-6 {
			if fc < fd {
				hi, d, fd = d, c, fc
				c = hi - g*(hi-lo)
				fc = sse(c)
			} else {
				lo, c, fc = c, d, fd
				d = lo + g*(hi-lo)
				fd = sse(d)
			}
		}
		n = (lo + hi) / 2
	}
	x, y := line(n)
	if slices.Min(x) == slices.Max(x) {
		return ProhaskaResult{}, m(fmt.Sprintf("the %d runs at Fn ≤ %g all have the same Fnⁿ/C_F, so the line has no slope to fit: use runs at different speeds", len(x), o.MaxFroude))
	}
	a, b := stat.LinearRegression(x, y, nil, false)
	r2 := stat.RSquared(x, y, nil, a, b)
	if math.IsNaN(a) || math.IsInf(a, 0) || math.IsNaN(b) || math.IsInf(b, 0) {
		return ProhaskaResult{}, m("the fit is not finite")
	}
	// Standard error of the intercept: s·√(1/n + x̄²/Sxx), s² = Σe²/(n − 2).
	k := float64(len(x))
	xm := stat.Mean(x, nil)
	var sxx, sse float64
	for i := range x {
		sxx += (x[i] - xm) * (x[i] - xm)
		e := y[i] - a - b*x[i]
		sse += e * e
	}
	se := math.Sqrt(sse/(k-2)) * math.Sqrt(1/k+xm*xm/sxx)
	res := ProhaskaResult{FormFactor: a, FormFactorStdErr: se, Slope: b, Exponent: n, R2: r2, Points: len(x), Runs: runs, MaxFroude: o.MaxFroude}
	if o.Reynolds != nil {
		var low []string
		for _, i := range runs {
			if o.Reynolds[i] < LaminarReynolds {
				low = append(low, fmt.Sprintf("run %d (Re = %.3g)", i+1, o.Reynolds[i]))
			}
		}
		if len(low) > 0 {
			res.Warning = fmt.Sprintf("%s below Re = %g: the flow over the model may be partly laminar, which lowers C_T/C_F and the form factor; check the turbulence stimulation or leave those runs out",
				strings.Join(low, ", "), LaminarReynolds)
		}
	}
	return res, nil
}

// ProhaskaFromTest applies Prohaska's method to a hull test's runs, with
// the laminar-flow warning from their Reynolds numbers.
func ProhaskaFromTest(t HullTest, maxFroude float64) (ProhaskaResult, error) {
	return ProhaskaFromTestWith(t, ProhaskaOptions{MaxFroude: maxFroude})
}

// ProhaskaFromTestWith is ProhaskaFromTest with options; Reynolds is
// filled from the test.
func ProhaskaFromTestWith(t HullTest, o ProhaskaOptions) (ProhaskaResult, error) {
	t.FormFactor = 1
	r, err := ExtrapolateHull(t)
	if err != nil {
		return ProhaskaResult{}, err
	}
	var fn, ct, cf, re []float64
	for _, p := range r.Points {
		fn, ct, cf, re = append(fn, p.Froude), append(ct, p.ModelCT), append(cf, p.ModelCF), append(re, p.ModelReynolds)
	}
	o.Reynolds = re
	return ProhaskaWith(fn, ct, cf, o)
}

// DoubleBodyResult is a form factor from a double-body test: the
// viscous resistance of the underwater hull and its mirror image, towed
// deeply submerged or in a wind tunnel, where no waves form.
type DoubleBodyResult struct {
	FormFactor float64   // 1 + k, the mean of C_V/C_F over the runs
	StdErr     float64   // standard error of the mean, s/√n
	Spread     float64   // largest minus smallest C_V/C_F
	PerRun     []float64 // C_V/C_F of each run
	Line       FrictionLine
}

// FormFactorDoubleBody returns 1 + k = C_V/C_F(Re) from the double-body
// runs' Reynolds numbers re and viscous resistance coefficients cv (on
// the double body's own wetted surface, which is twice the hull's, and
// speed), with C_F from line; at least two runs.
func FormFactorDoubleBody(re, cv []float64, line FrictionLine) (DoubleBodyResult, error) {
	m := func(r string) error {
		return &Error{Op: "double-body form factor", Fault: similarity.Invalid("", r)}
	}
	if len(re) != len(cv) || len(re) < 2 {
		return DoubleBodyResult{}, m(fmt.Sprintf("%d Reynolds numbers and %d coefficients; at least 2 runs", len(re), len(cv)))
	}
	res := DoubleBodyResult{Line: line}
	for i := range re {
		cf, err := line.CF(re[i])
		if err != nil {
			return DoubleBodyResult{}, &Error{Op: "double-body form factor", Fault: similarity.Caused("Reynolds number", fmt.Sprintf("run %d", i+1), err)}
		}
		if !(cv[i] > 0) || math.IsInf(cv[i], 0) {
			return DoubleBodyResult{}, m(fmt.Sprintf("run %d: C_V = %v is not positive and finite", i+1, cv[i]))
		}
		res.PerRun = append(res.PerRun, cv[i]/cf)
	}
	mean, sd := stat.MeanStdDev(res.PerRun, nil)
	res.FormFactor = mean
	res.StdErr = sd / math.Sqrt(float64(len(re)))
	res.Spread = slices.Max(res.PerRun) - slices.Min(res.PerRun)
	if !(mean >= 1 && mean <= 2) {
		return res, m(fmt.Sprintf("1 + k = %.4f is outside 1 … 2: check that C_V is on the double body's own wetted surface", mean))
	}
	return res, nil
}

// WaveResistance returns the wave-making coefficients of the
// free-surface model's runs, C_W = C_T − (1 + k)·C_F(Re): the total less
// the viscous part at the same Reynolds number.
func WaveResistance(re, ct []float64, formFactor float64, line FrictionLine) ([]float64, error) {
	if len(re) != len(ct) {
		return nil, &Error{Op: "wave resistance", Fault: similarity.Invalid("", fmt.Sprintf("%d Reynolds numbers and %d coefficients", len(re), len(ct)))}
	}
	if !(formFactor >= 1 && formFactor <= 2) {
		return nil, &Error{Op: "wave resistance", Fault: similarity.Invalid("", fmt.Sprintf("form factor 1 + k = %v is outside 1 … 2", formFactor))}
	}
	out := make([]float64, len(re))
	for i := range re {
		cf, err := line.CF(re[i])
		if err != nil {
			return nil, &Error{Op: "wave resistance", Fault: similarity.Caused("Reynolds number", fmt.Sprintf("run %d", i+1), err)}
		}
		if math.IsNaN(ct[i]) || math.IsInf(ct[i], 0) {
			return nil, &Error{Op: "wave resistance", Fault: similarity.Invalid("", fmt.Sprintf("run %d: C_T = %v is not finite", i+1, ct[i]))}
		}
		out[i] = ct[i] - formFactor*cf
	}
	return out, nil
}

// TemperatureInput is one run for TemperatureCorrection, its values named
// so that the two Reynolds numbers cannot be swapped.
type TemperatureInput struct {
	CT               float64      // the model's total resistance coefficient at the test temperature
	TestReynolds     float64      // Re = VL/ν at the test temperature
	StandardReynolds float64      // Re at the same speed in water at the standard temperature (15 °C)
	FormFactor       float64      // 1 + k, within 1 … 2
	Line             FrictionLine // the friction line of the extrapolation
}

// TemperatureCorrection corrects a model's total resistance coefficient
// measured in water at one temperature to another (the standard 15 °C),
// through the friction line at the two Reynolds numbers of the same
// speed: C_T(15) = C_T(t) + (1 + k)·(C_F(Re₁₅) − C_F(Re_t)), the wave part
// being unchanged. The resistance at 15 °C is C_T(15)·½ρ₁₅V²S.
func TemperatureCorrection(in TemperatureInput) (float64, error) {
	ct, reTest, reStd, formFactor, line := in.CT, in.TestReynolds, in.StandardReynolds, in.FormFactor, in.Line
	if !(formFactor >= 1 && formFactor <= 2) || math.IsNaN(ct) || math.IsInf(ct, 0) {
		return 0, &Error{Op: "temperature correction", Fault: similarity.Invalid("", fmt.Sprintf("C_T = %v and 1 + k = %v: want a finite C_T and 1 ≤ 1 + k ≤ 2", ct, formFactor))}
	}
	cft, err := line.CF(reTest)
	if err != nil {
		return 0, err
	}
	cfs, err := line.CF(reStd)
	if err != nil {
		return 0, err
	}
	return ct + formFactor*(cfs-cft), nil
}
