package turbo_test

import (
	"math"
	"testing"

	"pgregory.net/rapid"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity/turbo"
)

// TestGuaranteeOnCurveProperty: for any falling parabola H = a − b·Q²
// and any guarantee point on it (with the efficiency and power
// guaranteed at the curves' own values, a hair looser), every grade is
// met, and the line through the origin meets the curve at Q_G.
func TestGuaranteeOnCurveProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a := rapid.Float64Range(5, 500).Draw(t, "a")
		qmax := rapid.Float64Range(0.01, 10).Draw(t, "qmax")
		b := rapid.Float64Range(0.1, 0.6).Draw(t, "drop") * a / (qmax * qmax) // H(qmax) ≥ 0.4·a
		e0 := rapid.Float64Range(0.3, 0.9).Draw(t, "eta")
		var x, h, e, p []float64
		for i := range 11 {
			v := qmax * (0.4 + 0.06*float64(i))
			x, h, e, p = append(x, v), append(h, a-b*v*v), append(e, e0-0.2*(v/qmax-0.7)*(v/qmax-0.7)), append(p, 1e3*(1+v))
		}
		var c turbo.PumpCurves
		var err error
		if c.Head, err = fit.FitPoly(x, h, 2, nil); err != nil {
			t.Fatal(err)
		}
		if c.Efficiency, err = fit.FitPoly(x, e, 2, nil); err != nil {
			t.Fatal(err)
		}
		if c.Power, err = fit.FitPoly(x, p, 1, nil); err != nil {
			t.Fatal(err)
		}
		qg := qmax * rapid.Float64Range(0.55, 0.85).Draw(t, "at")
		g := turbo.Guarantee{Flow: q.New(qg, q.VolumeFlowRate), Head: q.New(c.Head.Eval(qg), q.Length),
			Efficiency: c.Efficiency.Eval(qg) * (1 - 1e-9), Power: q.New(c.Power.Eval(qg)*(1+1e-9), q.Power)}
		for _, gr := range turbo.Grades() {
			v, err := turbo.CheckGuarantee(c, g, gr)
			if err != nil {
				t.Fatal(gr, err)
			}
			if !v.Met || math.Abs(v.Intersection[0]-qg) > 1e-9*qg {
				t.Fatalf("grade %v: met %v, Q_X %v against Q_G %v", gr, v.Met, v.Intersection[0], qg)
			}
		}
	})
}

// TestNPSH3Property: a suction series sampled from H = H0 above x0 and
// H0 − k·(x0 − x)² below has its 3 % point at x0 − √(0.03·H0/k); the
// faired curve finds it within 2 % of the drop's width.
func TestNPSH3Property(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		h0 := rapid.Float64Range(5, 500).Draw(t, "H0")
		x0 := rapid.Float64Range(1, 30).Draw(t, "x0")
		d := x0 * rapid.Float64Range(0.1, 0.5).Draw(t, "d") // the 3 % point lies d below x0
		k := 0.03 * h0 / (d * d)
		lo := x0 - 1.6*d
		var s []turbo.SuctionPoint
		for i := range 25 {
			x := lo + (x0+2*d-lo)*float64(i)/24
			h := h0
			if x < x0 {
				h -= k * (x0 - x) * (x0 - x)
			}
			s = append(s, turbo.SuctionPoint{NPSHA: q.New(x, q.Length), Head: q.New(h, q.Length)})
		}
		r, err := turbo.FindNPSH3(s, turbo.NPSH3Options{HeadU: q.New(0.001*h0, q.Length)})
		if err != nil {
			t.Fatal(err)
		}
		if got := r.NPSH3.Value(); math.Abs(got-(x0-d)) > 0.02*d {
			t.Fatalf("NPSH3 %v, known %v (d %v)", got, x0-d, d)
		}
	})
}
