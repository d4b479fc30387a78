package fit

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// classes counts the module's error classes err matches; it must be one.
func classes(err error) int {
	n := 0
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			n++
		}
	}
	return n
}

// Reference values for the Pontius data computed once with numpy 1.24.2
// and scipy 1.10.1 (Debian python3-numpy, python3-scipy): least squares
// in u = x/10⁶ by numpy.linalg.lstsq, hat matrix from (XᵀX)⁻¹,
// scipy.stats.f.sf and scipy.stats.t.ppf.
func TestPontiusDiagnostics(t *testing.T) {
	f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	near := func(name string, got, want, tol float64) {
		t.Helper()
		if relErr(got, want) > tol {
			t.Errorf("%s = %.12g, want %.12g (numpy/scipy)", name, got, want)
		}
	}
	near("leverage row 0", f.Rows[0].Leverage, 0.18538961039, 1e-9)
	near("t row 0", f.Rows[0].Studentized, -1.20231489833, 1e-7)
	near("Cook row 0", f.Rows[0].Cook, 0.108355767032, 1e-7)
	near("t row 1", f.Rows[1].Studentized, -2.48188995793, 1e-7)
	near("Cook row 1", f.Rows[1].Cook, 0.2518888277, 1e-7)
	if len(f.Outliers) != 0 {
		t.Errorf("outliers %v, want none (largest |t| is 2.48 < 3)", f.Outliers)
	}
	// Cook's distance > 4/40 = 0.1: numpy's values give rows 0 and 1
	// among them.
	if !slices.Contains(f.Influential, 0) || !slices.Contains(f.Influential, 1) {
		t.Errorf("influential %v, want rows 0 and 1 among them", f.Influential)
	}
	l := f.LackOfFit
	if l == nil {
		t.Fatal("no lack-of-fit test on data with 20 loads measured twice")
	}
	if l.Groups != 20 || l.DFPure != 20 || l.DFLack != 17 {
		t.Errorf("groups %d, DF pure %d, lack %d; want 20, 20, 17", l.Groups, l.DFPure, l.DFLack)
	}
	near("SS pure", l.SSPure, 9.2215e-07, 1e-6)
	near("SS lack", l.SSLack, 6.3546768797e-07, 1e-6)
	near("F", l.F, 0.81072390031, 1e-6)
	near("P", l.P, 0.666172944808, 1e-6)

	pr, err := f.Predict(1e6)
	if err != nil {
		t.Fatal(err)
	}
	near("ŷ(10⁶)", pr.Y, 0.729571907477025, 1e-12)
	near("SE(10⁶)", pr.SE, 4.39359871479e-05, 1e-8)
	near("mean lo", pr.Mean[0], 0.72948288471101, 1e-12)
	near("mean hi", pr.Mean[1], 0.72966093024304, 1e-12)
	near("new lo", pr.New[0], 0.729146753842509, 1e-12)
	near("new hi", pr.New[1], 0.729997061111541, 1e-12)
	if pr.Extrapolated {
		t.Error("a prediction inside the range marked extrapolated")
	}
}

// Weighted Pontius fit with invented uncertainties u = 10⁻⁴ + 2·10⁻⁴·x/10⁶;
// reference by numpy.linalg.solve of the weighted normal equations in
// u = x/10⁶ (numpy 1.24.2), coefficients converted here by a_k·10⁶ᵏ.
func TestWeighted(t *testing.T) {
	x := pontiusX()
	u := make([]float64, len(x))
	for i := range x {
		u[i] = 1e-4 + 2e-4*x[i]/1e6
	}
	w, err := WeightsFromU(u)
	if err != nil {
		t.Fatal(err)
	}
	f, err := FitPoly(x, pontiusY, 2, &Options{Weights: w})
	if err != nil {
		t.Fatal(err)
	}
	a, se, err := f.Power()
	if err != nil {
		t.Fatal(err)
	}
	wantB := []float64{0.000584740513178821, 0.732240460844448, -0.0032217472220473}
	wantSE := []float64{7.08089313973e-05, 0.000160370215536, 6.16709750366e-05}
	for k := range 3 {
		sc := math.Pow(1e6, float64(k))
		if relErr(a[k]*sc, wantB[k]) > 1e-8 || relErr(se[k]*sc, wantSE[k]) > 1e-7 {
			t.Errorf("B%d = %.15g ± %.12g, want %.15g ± %.12g", k, a[k]*sc, se[k]*sc, wantB[k], wantSE[k])
		}
	}
}

// synth returns rows from y = Σ a_k x^k plus normal noise of standard
// deviation sd, from a fixed seed.
func synth(a []float64, n int, lo, hi, sd float64, seed uint64) (x, y []float64) {
	r := rand.New(rand.NewPCG(seed, 1))
	for i := range n {
		xi := lo + (hi-lo)*float64(i)/float64(n-1)
		yi := 0.0
		for k := len(a) - 1; k >= 0; k-- {
			yi = yi*xi + a[k]
		}
		x = append(x, xi)
		y = append(y, yi+sd*r.NormFloat64())
	}
	return x, y
}

// TestRoundTrip: coefficients made up, data made from them with noise;
// the 95 % intervals must cover the true values in about 95 % of 400
// independent data sets (binomial: 95 % ± 3.3 standard deviations of
// √(0.95·0.05/400) ≈ 1.1 %, so 91.4 % … 98.6 %).
func TestRoundTrip(t *testing.T) {
	a := []float64{2, -0.5, 0.03} // y = 2 − 0.5x + 0.03x²
	const runs = 400
	cover := make([]int, 3)
	coverMean, coverNew := 0, 0
	for s := range uint64(runs) {
		x, y := synth(a, 15, 1, 20, 0.05, s)
		f, err := FitPoly(x, y, 2, nil)
		if err != nil {
			t.Fatal(err)
		}
		// Intervals of the x-power coefficients from Power's standard errors.
		got, se, err := f.Power()
		if err != nil {
			t.Fatal(err)
		}
		for k := range 3 {
			if math.Abs(got[k]-a[k]) <= f.tq*se[k] {
				cover[k]++
			}
		}
		pr, err := f.Predict(7)
		if err != nil {
			t.Fatal(err)
		}
		truth := a[0] + 7*a[1] + 49*a[2]
		if truth >= pr.Mean[0] && truth <= pr.Mean[1] {
			coverMean++
		}
		// A new observation at 7, from the same noise.
		r := rand.New(rand.NewPCG(s+1e6, 2))
		obs := truth + 0.05*r.NormFloat64()
		if obs >= pr.New[0] && obs <= pr.New[1] {
			coverNew++
		}
	}
	check := func(name string, c int) {
		if p := float64(c) / runs; p < 0.914 || p > 0.986 {
			t.Errorf("%s covered in %.1f %% of runs, want about 95 %%", name, 100*p)
		}
	}
	for k := range 3 {
		check("coefficient "+string(rune('0'+k)), cover[k])
	}
	check("mean response", coverMean)
	check("new observation", coverNew)
}

func TestSelectPoly(t *testing.T) {
	a := []float64{1, 0.2, -0.3, 0.05} // a cubic
	x, y := synth(a, 30, -3, 4, 0.01, 7)
	for _, c := range []Criterion{NextTerm, TopTerm, AICc} {
		f, err := SelectPoly(x, y, 7, c, nil)
		if err != nil {
			t.Fatal(err)
		}
		if f.Order != 3 {
			t.Errorf("%v chose order %d, want 3 (data made from a cubic); candidates %+v", c, f.Order, f.Selection)
		}
		if len(f.Selection) != 8 {
			t.Errorf("%v compared %d orders, want 8", c, len(f.Selection))
		}
	}
	// Nearly symmetric about the middle: NextTerm stops at the line,
	// TopTerm finds the cubic (invented data).
	xs := []float64{0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6}
	ys := []float64{1.02, 1.31, 1.49, 1.52, 1.52, 1.44, 1.29, 1.17, 1.03, 0.95, 0.92, 0.98, 1.10}
	for c, want := range map[Criterion]int{NextTerm: 1, TopTerm: 3} {
		f, err := SelectPoly(xs, ys, 6, c, nil)
		if err != nil || f.Order != want {
			t.Errorf("%v: order %v, %v; want %d", c, f, err, want)
		}
	}
	// A straight line with noise: the quadratic term is not significant.
	x, y = synth([]float64{3, 2}, 20, 0, 1, 0.1, 3)
	f, err := SelectPoly(x, y, 5, NextTerm, nil)
	if err != nil {
		t.Fatal(err)
	}
	if f.Order != 1 {
		t.Errorf("NextTerm chose order %d for a line, want 1; candidates %+v", f.Order, f.Selection)
	}
}

func TestOutlierFlagged(t *testing.T) {
	x, y := synth([]float64{1, 1}, 20, 0, 10, 0.1, 11)
	y[8] += 2 // 20 standard deviations
	f, err := FitPoly(x, y, 1, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !cmp.Equal(f.Outliers, []int{8}) {
		t.Errorf("outliers %v, want [8]", f.Outliers)
	}
	if f.N != 20 {
		t.Errorf("N = %d: a flagged row must not be dropped", f.N)
	}
	// Not silently dropped: row 8 is in the fit (the intercept moves by
	// about 2/20 = 0.1 from 1).
	if f.Eval(0) < 1.03 {
		t.Errorf("intercept %.3g: the outlier seems to have been left out", f.Eval(0))
	}
}

func TestLackOfFitDetects(t *testing.T) {
	// A parabola measured three times at each of 8 x, fitted by a line.
	var x, y []float64
	r := rand.New(rand.NewPCG(5, 5))
	for i := range 8 {
		for range 3 {
			xi := float64(i)
			x = append(x, xi)
			y = append(y, xi*xi+0.1*r.NormFloat64())
		}
	}
	f, err := FitPoly(x, y, 1, nil)
	if err != nil {
		t.Fatal(err)
	}
	if f.LackOfFit == nil || f.LackOfFit.P > 1e-6 {
		t.Errorf("lack of fit %+v, want P ≈ 0 for a line through a parabola", f.LackOfFit)
	}
	g, err := FitPoly(x, y, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	if g.LackOfFit == nil || g.LackOfFit.P < 0.01 {
		t.Errorf("lack of fit %+v of the right model, want P not small", g.LackOfFit)
	}
	// No repeats, no test.
	h, err := FitPoly([]float64{1, 2, 3, 4}, []float64{1, 2, 2, 4}, 1, nil)
	if err != nil {
		t.Fatal(err)
	}
	if h.LackOfFit != nil {
		t.Errorf("lack of fit %+v without repeated x", h.LackOfFit)
	}
}

func TestExtrapolation(t *testing.T) {
	f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	_, err = f.Predict(3.5e6)
	if !errors.Is(err, quantity.ErrRange) || classes(err) != 1 {
		t.Errorf("Predict outside the range: %v, want one error of class ErrRange", err)
	}
	pr, err := f.Extrapolate(3.5e6)
	if err != nil || !pr.Extrapolated {
		t.Errorf("Extrapolate: %+v, %v; want a prediction marked Extrapolated", pr, err)
	}
	in, _ := f.Predict(3e6)
	if pr.SE <= in.SE {
		t.Errorf("SE outside %.3g not above SE at the end %.3g", pr.SE, in.SE)
	}
}

func TestErrors(t *testing.T) {
	nan := math.NaN()
	x4 := []float64{1, 2, 3, 4}
	tests := []struct {
		name  string
		err   func() error
		class error
	}{
		{"lengths", func() error { _, err := FitPoly(x4, x4[:3], 1, nil); return err }, quantity.ErrInvalid},
		{"NaN x", func() error { _, err := FitPoly([]float64{1, nan, 3}, []float64{1, 2, 3}, 1, nil); return err }, quantity.ErrRange},
		{"Inf y", func() error { _, err := FitPoly(x4, []float64{1, 2, math.Inf(1), 3}, 1, nil); return err }, quantity.ErrRange},
		{"order", func() error { _, err := FitPoly(x4, x4, MaxOrder+1, nil); return err }, quantity.ErrInvalid},
		{"negative order", func() error { _, err := FitPoly(x4, x4, -1, nil); return err }, quantity.ErrInvalid},
		{"too few rows", func() error { _, err := FitPoly(x4, x4, 3, nil); return err }, quantity.ErrInvalid},
		{"too few distinct", func() error {
			_, err := FitPoly([]float64{1, 1, 2, 2, 2}, []float64{1, 2, 3, 4, 5}, 2, nil)
			return err
		}, quantity.ErrInvalid},
		{"weight", func() error {
			_, err := FitPoly(x4, x4, 1, &Options{Weights: []float64{1, -1, 1, 1}})
			return err
		}, quantity.ErrInvalid},
		{"weights length", func() error { _, err := FitPoly(x4, x4, 1, &Options{Weights: []float64{1}}); return err }, quantity.ErrInvalid},
		{"level", func() error { _, err := FitPoly(x4, x4, 1, &Options{Level: 1.5}); return err }, quantity.ErrInvalid},
		{"u", func() error { _, err := WeightsFromU([]float64{0.1, 0}); return err }, quantity.ErrInvalid},
		{"criterion", func() error { _, err := SelectPoly(x4, x4, 1, Criterion(9), nil); return err }, quantity.ErrInvalid},
		{"fair not monotone", func() error { _, err := Fair(x4, []float64{1, 3, 2, 4}); return err }, quantity.ErrInvalid},
		{"fair x order", func() error { _, err := Fair([]float64{1, 3, 2}, []float64{1, 2, 3}); return err }, quantity.ErrInvalid},
		{"fair outside", func() error {
			f, err := Fair(x4, x4)
			if err != nil {
				return nil
			}
			_, err = f.At(5)
			return err
		}, quantity.ErrRange},
		{"curve rows", func() error {
			_, err := FitCurve(func(x float64, p []float64) float64 { return p[0] * x }, []float64{1}, []float64{1}, []float64{1}, nil)
			return err
		}, quantity.ErrInvalid},
		{"measured x dimension", func() error {
			f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
			if err != nil {
				return nil
			}
			set := uncertain.NewSet()
			m, err := f.Measured(set, "cell", quantity.Dimensionless, quantity.Dimensionless)
			if err != nil {
				return nil
			}
			_, _, err = m.Predict(uncertain.Exact(quantity.New(1e6, quantity.Dim(1))))
			return err
		}, quantity.ErrDimension},
	}
	for _, tt := range tests {
		err := tt.err()
		var fe *Error
		if err == nil || !errors.Is(err, tt.class) || classes(err) != 1 || !errors.As(err, &fe) {
			t.Errorf("%s: %v, want one *Error of class %v", tt.name, err, tt.class)
		}
	}
}

func TestMeasured(t *testing.T) {
	f, err := FitPoly(pontiusX(), pontiusY, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	set := uncertain.NewSet()
	m, err := f.Measured(set, "load cell", quantity.Dimensionless, quantity.Dimensionless)
	if err != nil {
		t.Fatal(err)
	}
	// An exact input: the uncertainty is the fit's alone, the standard
	// error of the mean response (u² = gᵀCg through the correlated
	// sources).
	z, pr, err := m.Predict(uncertain.Exact(quantity.Scalar(1e6)))
	if err != nil {
		t.Fatal(err)
	}
	if relErr(z.U().Value(), pr.SE) > 1e-9 || z.Value() != pr.Y {
		t.Errorf("exact input: %v ± %v, want %v ± SE %v", z.Value(), z.U().Value(), pr.Y, pr.SE)
	}
	// A measured input: the input's part adds in quadrature, times the slope.
	ux := set.MustAdd(uncertain.Source{Name: "load", U: quantity.Scalar(2000)})
	x := set.MustMeasure(quantity.Scalar(1e6), ux)
	z2, _, err := m.Predict(x)
	if err != nil {
		t.Fatal(err)
	}
	want := math.Hypot(pr.SE, f.Slope(1e6)*2000)
	if relErr(z2.U().Value(), want) > 1e-9 {
		t.Errorf("measured input: u = %v, want √(SE² + (slope·u_x)²) = %v", z2.U().Value(), want)
	}
	// Two predictions from one fit share its sources: their difference
	// at the same x has no uncertainty from the fit.
	z3, _, err := m.Predict(uncertain.Exact(quantity.Scalar(1e6)))
	if err != nil {
		t.Fatal(err)
	}
	if d := z.Sub(z3); d.U().Value() > 1e-12*pr.SE {
		t.Errorf("difference of two equal predictions has u = %v, want 0 (correlated through the fit)", d.U().Value())
	}
	// Outside the range: refused.
	if _, _, err := m.Predict(uncertain.Exact(quantity.Scalar(4e6))); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("outside the range: %v, want ErrRange", err)
	}
	// The source's degrees of freedom are the fit's.
	src, err := set.Source(0)
	if err != nil || src.DoF != 37 || src.Type != uncertain.TypeA {
		t.Errorf("source %+v, %v; want Type A with 37 degrees of freedom", src, err)
	}
}

func TestFair(t *testing.T) {
	// Data with a flat stretch then a steep rise, which an unconstrained
	// cubic spline overshoots.
	x := []float64{0, 1, 2, 3, 4, 5, 6}
	y := []float64{0, 0, 0, 0.1, 5, 5.1, 5.1}
	f, err := Fair(x, y)
	if err != nil {
		t.Fatal(err)
	}
	if !f.Increasing {
		t.Error("not marked increasing")
	}
	prev := math.Inf(-1)
	for i := 0; i <= 6000; i++ {
		xi := 6 * float64(i) / 6000
		v, err := f.At(xi)
		if err != nil {
			t.Fatal(err)
		}
		if v < prev {
			t.Fatalf("decreases at x = %v: %v after %v", xi, v, prev)
		}
		prev = v
	}
	for i := range x {
		if v, _ := f.At(x[i]); v != y[i] {
			t.Errorf("At(%v) = %v, want the point's %v", x[i], v, y[i])
		}
	}
	// Decreasing data.
	g, err := Fair([]float64{0, 1, 2}, []float64{3, 1, 0})
	if err != nil || g.Increasing {
		t.Errorf("decreasing: %v, %v", g, err)
	}
}

func TestMonotone(t *testing.T) {
	x := []float64{-1, -0.5, 0, 0.5, 1, -1, 0, 1}
	sq := make([]float64, len(x))
	cube := make([]float64, len(x))
	for i, v := range x {
		sq[i] = v * v
		cube[i] = v * v * v
	}
	p2, err := FitPoly(x, sq, 2, nil)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := p2.Monotone(-1, 1); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("x² on [−1, 1]: %v, want refused as not monotone", err)
	}
	if _, err := p2.Fair(-1, 1, 10); err == nil {
		t.Error("Fair of x² on [−1, 1] returned a fairing")
	}
	if inc, err := p2.Monotone(0, 1); err != nil || !inc {
		t.Errorf("x² on [0, 1]: %v, %v; want increasing", inc, err)
	}
	p3, err := FitPoly(x, cube, 3, nil)
	if err != nil {
		t.Fatal(err)
	}
	if inc, err := p3.Monotone(-1, 1); err != nil || !inc {
		t.Errorf("x³ on [−1, 1] (slope touches 0): %v, %v; want increasing", inc, err)
	}
	if _, err := p3.Monotone(-2, 1); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("range beyond the fit: %v, want ErrRange", err)
	}
	fr, err := p3.Fair(-1, 1, 21)
	if err != nil {
		t.Fatal(err)
	}
	if v, _ := fr.At(0.5); math.Abs(v-0.125) > 0.01 {
		t.Errorf("faired x³ at 0.5 = %v, want about 0.125", v)
	}
}

// Invented weir-like rating: Q = C·h^n. Reference by
// scipy.optimize.curve_fit (scipy 1.10.1), covariance scaled by the
// residual variance (its default), from p0 = (1.5, 1.5).
func TestFitCurve(t *testing.T) {
	h := []float64{0.05, 0.08, 0.1, 0.12, 0.15, 0.18, 0.2, 0.25, 0.3, 0.35}
	q := []float64{0.01985, 0.04006, 0.05590, 0.07355, 0.10270, 0.13540, 0.15785, 0.22050, 0.28980, 0.36530}
	c, err := FitCurve(func(x float64, p []float64) float64 { return p[0] * math.Pow(x, p[1]) }, h, q, []float64{1.5, 1.5}, nil)
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{1.7580252037, 1.49698496728}
	wantSE := []float64{0.00260661855714, 0.00112554526117}
	opts := cmpopts.EquateApprox(1e-7, 0)
	if !cmp.Equal(c.P, want, opts) {
		t.Errorf("P = %v, want %v", c.P, want)
	}
	if !cmp.Equal(c.StdErr, wantSE, cmpopts.EquateApprox(1e-5, 0)) {
		t.Errorf("SE = %v, want %v", c.StdErr, wantSE)
	}
	if _, err := c.Predict(0.5); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("Predict beyond the rating: %v, want ErrRange", err)
	}
	pr, err := c.Predict(0.2)
	if err != nil || !(pr.Mean[0] < pr.Y && pr.Y < pr.Mean[1] && pr.New[0] < pr.Mean[0]) {
		t.Errorf("Predict(0.2) = %+v, %v", pr, err)
	}
	// The invented reading at h = 0.18 m sits high: its externally
	// studentised residual of the linearised model is 5.7297 (numpy
	// 1.24.2: hat matrix of J = [h^n, C·h^n·ln h] at scipy's solution).
	if !cmp.Equal(c.Outliers, []int{5}) || math.Abs(c.Rows[5].Studentized-5.7297) > 1e-3 {
		t.Errorf("outliers %v, t₅ = %.4f; want [5], 5.7297", c.Outliers, c.Rows[5].Studentized)
	}
	// With uncertainty: a head measured to ±1 mm. First order,
	// u² = SE² + (∂Q/∂h·u_h)², ∂Q/∂h = C·n·h^(n−1) by hand.
	set := uncertain.NewSet()
	m, err := c.Measured(set, "rating", quantity.Length, quantity.VolumeFlowRate)
	if err != nil {
		t.Fatal(err)
	}
	uh := set.MustAdd(uncertain.Source{Name: "head gauge", U: quantity.New(0.001, quantity.Length)})
	q2, pr2, err := m.Predict(set.MustMeasure(quantity.New(0.2, quantity.Length), uh))
	if err != nil {
		t.Fatal(err)
	}
	dqdh := c.P[0] * c.P[1] * math.Pow(0.2, c.P[1]-1)
	if want := math.Hypot(pr2.SE, dqdh*0.001); relErr(q2.U().Value(), want) > 1e-6 {
		t.Errorf("u(Q) = %v, want %v", q2.U().Value(), want)
	}
	if q2.Dim() != quantity.VolumeFlowRate {
		t.Errorf("Q has dimension %v", q2.Dim())
	}
	// The fit's part alone equals the delta-method standard error.
	q3, _, err := m.Predict(uncertain.Exact(quantity.New(0.2, quantity.Length)))
	if err != nil || relErr(q3.U().Value(), pr2.SE) > 1e-9 {
		t.Errorf("fit alone: u = %v, %v; want SE %v", q3.U().Value(), err, pr2.SE)
	}
}
