package fit_test

import (
	"errors"
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/quantity/uncertain"
)

// A calibration fitted by a quadratic: the NIST StRD Pontius load-cell
// data (deflection against load, 20 loads each measured twice).
func ExampleFitPoly() {
	var load, defl []float64
	d := []float64{.11019, .21956, .32949, .43899, .54803, .65694, .76562, .87487, .98292, 1.09146,
		1.20001, 1.30822, 1.41599, 1.52399, 1.63194, 1.73947, 1.84646, 1.95392, 2.06128, 2.16844,
		.11052, .22018, .32939, .43886, .54798, .65739, .76596, .87474, .98300, 1.09150,
		1.20004, 1.30818, 1.41613, 1.52408, 1.63159, 1.73965, 1.84696, 1.95445, 2.06177, 2.16829}
	for i, v := range d {
		load = append(load, 150000*float64(i%20+1))
		defl = append(defl, v)
	}
	f, err := fit.FitPoly(load, defl, 2, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	a, se, err := f.Power()
	if err != nil {
		fmt.Println(err)
		return
	}
	for k := range a {
		fmt.Printf("a%d = %.9e ± %.3e\n", k, a[k], se[k])
	}
	fmt.Printf("S = %.6e with %d degrees of freedom\n", f.S, f.DoF)
	fmt.Printf("lack of fit: F = %.3f, P = %.3f\n", f.LackOfFit.F, f.LackOfFit.P)
	fmt.Println("outliers:", f.Outliers)
	p, _ := f.Predict(1e6)
	fmt.Printf("at 1e6: %.5f, mean in [%.5f, %.5f], new reading in [%.5f, %.5f] (95 %%)\n", p.Y, p.Mean[0], p.Mean[1], p.New[0], p.New[1])
	_, err = f.Predict(4e6)
	fmt.Println(errors.Is(err, quantity.ErrRange), err)
	// Output:
	// a0 = 6.735657895e-04 ± 1.079e-04
	// a1 = 7.320591604e-07 ± 1.578e-10
	// a2 = -3.160818713e-15 ± 4.867e-17
	// S = 2.051774e-04 with 37 degrees of freedom
	// lack of fit: F = 0.811, P = 0.666
	// outliers: []
	// at 1e6: 0.72957, mean in [0.72948, 0.72966], new reading in [0.72915, 0.73000] (95 %)
	// true fit: Predict: x = 4e+06 is outside the fitted range [150000, 3e+06]: an extrapolation (use Extrapolate to make one deliberately)
}

// Choosing the order. Invented data from a curve close to a cubic
// symmetric about the middle of the range, with noise: its linear and
// quadratic terms are small, so the forward rule (stop at the first order
// whose next term is not significant) stops at order 1, while the
// backward rule (the highest order whose own top term is significant)
// finds the cubic. Compare the candidates when the choice matters.
func ExampleSelectPoly() {
	x := []float64{0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6}
	y := []float64{1.02, 1.31, 1.49, 1.52, 1.52, 1.44, 1.29, 1.17, 1.03, 0.95, 0.92, 0.98, 1.10}
	for _, c := range []fit.Criterion{fit.NextTerm, fit.TopTerm, fit.AICc} {
		f, err := fit.SelectPoly(x, y, 6, c, nil)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Println(f.Notes[len(f.Notes)-1])
		if c == fit.AICc {
			for _, c := range f.Selection {
				fmt.Printf("order %d: SSE %.4f, AICc %6.1f, p of its top term %.2g, of the next %.2g\n", c.Order, c.SSE, c.AICc, c.PTop, c.PNext)
			}
		}
	}
	// Output:
	// order 1 chosen by next term not significant at 5 % among orders 0 … 6
	// order 3 chosen by highest order with a significant top coefficient at 5 % among orders 0 … 6
	// order 3 chosen by least AICc among orders 0 … 6
	// order 0: SSE 0.6267, AICc  -34.2, p of its top term 1, of the next 0.03
	// order 1: SSE 0.4009, AICc  -36.6, p of its top term 0.03, of the next 0.13
	// order 2: SSE 0.3140, AICc  -35.4, p of its top term 0.13, of the next 9.9e-12
	// order 3: SSE 0.0015, AICc  -99.1, p of its top term 9.9e-12, of the next 0.48
	// order 4: SSE 0.0014, AICc  -92.5, p of its top term 0.48, of the next 0.17
	// order 5: SSE 0.0011, AICc  -86.0, p of its top term 0.17, of the next 0.34
	// order 6: SSE 0.0009, AICc  -72.5, p of its top term 0.34, of the next 1
}

// A monotone fairing through averaged points of a curve that rises
// steeply after a flat start (invented values); it neither overshoots
// nor dips between the points.
func ExampleFair() {
	x := []float64{0, 1, 2, 3, 4, 5}
	y := []float64{0, 0, 0.05, 2.0, 2.1, 2.1}
	f, err := fit.Fair(x, y)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, xi := range []float64{0.5, 1.5, 2.5, 3.5, 4.5} {
		v, _ := f.At(xi)
		fmt.Printf("%.1f: %.4f\n", xi, v)
	}
	_, err = fit.Fair(x, []float64{0, 1, 0.9, 2, 3, 4})
	fmt.Println(err)
	// Output:
	// 0.5: 0.0000
	// 1.5: 0.0062
	// 2.5: 1.0062
	// 3.5: 2.0875
	// 4.5: 2.1000
	// fit: Fair: row 2: y = 0.9 after 1 turns back: the points are not monotone, and a monotone fairing through them does not exist (fit or average them first)
}

// A prediction that carries the fit's uncertainty, as correlated
// sources, and its input's. Invented calibration of a flow meter: flow
// rate Q in m³/s against a differential pressure in Pa.
func ExamplePoly_Measured() {
	dp := []float64{100, 200, 300, 400, 500, 600, 700, 800}
	q := []float64{0.0101, 0.0139, 0.0172, 0.0199, 0.0224, 0.0244, 0.0265, 0.0284}
	f, err := fit.FitPoly(dp, q, 2, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	set := uncertain.NewSet()
	m, err := f.Measured(set, "meter fit", quantity.Pressure, quantity.VolumeFlowRate)
	if err != nil {
		fmt.Println(err)
		return
	}
	u := set.MustAdd(uncertain.Source{Name: "Δp transducer", U: quantity.New(2, quantity.Pressure)})
	x := set.MustMeasure(quantity.New(600, quantity.Pressure), u)
	y, pr, err := m.Predict(x)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Q = %v (the fit alone: ± %.2g m³/s)\n", y, pr.SE)
	b, err := y.Budget("Q", 0.95)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Print(b)
	// Output:
	// Q = 0.02466 m³/s ± 0.00011 m³/s (the fit alone: ± 9.9e-05 m³/s)
	// Q = 0.02466 m³/s, u_c = 0.00011 m³/s (0.44 %), ν_eff = 6.9, k = 2.37, U(95 %) = 0.00025 m³/s
	// systematic part 0.000099 m³/s, random part 0.000042 m³/s
	// source         type       distribution  effect         u(source)                  c  contribution (m³/s)  % of u_c²
	// meter fit: B0  A (ν = 5)  t             systematic  0.00011 m³/s               1.00              0.00011      105.6
	// meter fit: B1  A (ν = 5)  t             systematic  0.00011 m³/s              0.429             0.000047       19.6
	// Δp transducer  B          normal        random            2.0 Pa  2.09×10⁻⁵ m³/s/Pa             0.000042       15.2
	// meter fit: B2  A (ν = 5)  t             systematic  0.00019 m³/s              0.184             0.000036       11.0
	// correlated sources: u_c includes their covariance; ν_eff takes each correlated group as one term with its smallest ν (approximate)
}

// A weir-like rating Q = C·h^n by nonlinear least squares (invented
// readings).
func ExampleFitCurve() {
	h := []float64{0.05, 0.08, 0.1, 0.12, 0.15, 0.18, 0.2, 0.25, 0.3, 0.35}
	q := []float64{0.01985, 0.04006, 0.05590, 0.07355, 0.10270, 0.13540, 0.15785, 0.22050, 0.28980, 0.36530}
	c, err := fit.FitCurve(func(h float64, p []float64) float64 { return p[0] * math.Pow(h, p[1]) }, h, q, []float64{1.5, 1.5}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("C = %.4f ± %.4f, n = %.4f ± %.4f\n", c.P[0], c.StdErr[0], c.P[1], c.StdErr[1])
	p, _ := c.Predict(0.22)
	fmt.Printf("Q(0.22 m) = %.4f m³/s, 95 %% for a new reading [%.4f, %.4f]\n", p.Y, p.New[0], p.New[1])
	for _, i := range c.Outliers {
		fmt.Printf("row %d (h = %.2f m) flagged: t = %.1f\n", i, c.Rows[i].X, c.Rows[i].Studentized)
	}
	// Output:
	// C = 1.7580 ± 0.0026, n = 1.4970 ± 0.0011
	// Q(0.22 m) = 0.1822 m³/s, 95 % for a new reading [0.1818, 0.1827]
	// row 5 (h = 0.18 m) flagged: t = 5.7
}
