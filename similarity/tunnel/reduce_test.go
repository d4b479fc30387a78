package tunnel_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// diagonal returns a direct-form three-component balance (NF, AF, PM)
// with no interactions: 1000 N, 100 N and 10 N·m per mV/V.
func diagonal(t *testing.T) *tunnel.Calibration {
	t.Helper()
	c, err := tunnel.NewCalibration("diag", tunnel.LoadsFromReadings, "mV/V",
		[]tunnel.ComponentRange{{tunnel.NormalForce, -1000, 1000}, {tunnel.AxialForce, -100, 100}, {tunnel.PitchingMoment, -50, 50}},
		[][]float64{{1000, 0, 0}, {0, 100, 0}, {0, 0, 10}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestReduceByHand takes one point through every step, written out:
// readings 0.3, 0.02, 0.05 mV/V give N = 300 N, A = 2 N, m = 0.5 N·m.
// The model weighs 20 N with its CG at the balance centre; at 4° pitch
// (sin 4° = 0.0697565, cos 4° = 0.9975641) the tare is N_t = −20·cos 4°
// = −19.951281 N, A_t = 20·sin 4° = 1.395129 N, so the air's loads are
// N = 319.951281 N, A = 0.604871 N. The reference point 0.05 m ahead
// gives m = 0.5 − 0.05·319.951281 = −15.497564 N·m. In wind axes at
// α = 4°: L = N cos α − A sin α = 319.129702 N,
// D = A cos α + N sin α = 22.922070 N. On q_u = 1000 Pa, S = 0.5 m²,
// c̄ = 0.2 m: C_L = 0.6382594, C_D = 0.0458441, C_m = −0.1549756.
// Walls (6 m² section, V = 0.01 m³, K·τ₁ = 0.9, δ = 0.12, Ma 0):
// ε_sb = 0.9·0.01/6^1.5 = 0.00061237, ε_wb = (0.5/24)·C_D = 0.00095509,
// q/q_u = (1 + ε)² = 1.0031374; C_L = 0.6382594/1.0031374 = 0.6362632,
// α = 4 + 57.3·0.12·(0.5/6)·0.6362632 = 4.364579°,
// C_D = 0.0458441/1.0031374 + 0.12·(0.5/6)·0.6362632² = 0.0497491,
// C_m = −0.1549756/1.0031374 = −0.1544909.
func TestReduceByHand(t *testing.T) {
	r := tunnel.Reduction{
		Calibration: diagonal(t),
		Tare:        tunnel.WeightTare{Weight: 20},
		Offset:      tunnel.Offset{X: q.New(0.05, q.Length)},
		Reference:   tunnel.Reference{Area: q.New(0.5, q.Area), Span: q.New(2, q.Length), Chord: q.New(0.2, q.Length)},
		Walls:       tunnel.Model3D{TunnelArea: q.New(6, q.Area), ModelVolume: q.New(0.01, q.Volume), ShapeFactor: 0.9, Delta: 0.12},
	}
	out, err := r.Reduce(tunnel.Point{Readings: []float64{0.3, 0.02, 0.05}, Attitude: tunnel.Attitude{PitchDeg: 4}, DynamicPressure: q.New(1000, q.Pressure)})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"N", out.Aero[tunnel.NormalForce], 319.951281, 1e-6},
		{"A", out.Aero[tunnel.AxialForce], 0.604871, 1e-6},
		{"m", out.Aero[tunnel.PitchingMoment], -15.497564, 1e-6},
		{"L", out.Wind.Lift, 319.129702, 1e-6},
		{"D", out.Wind.Drag, 22.922070, 1e-6},
		{"C_L,u", out.Uncorrected.CL, 0.6382594, 1e-7},
		{"C_D,u", out.Uncorrected.CD, 0.0458441, 1e-7},
		{"C_m,u", out.Uncorrected.Cm, -0.1549756, 1e-7},
		{"q/q_u", out.Corrected.DynamicPressureFactor, 1.0031374, 1e-7},
		{"C_L", out.Corrected.CL, 0.6362632, 1e-7},
		{"α", out.Corrected.AlphaDeg, 4.364579, 1e-6},
		{"C_D", out.Corrected.CD, 0.0497491, 1e-7},
		{"C_m", out.Corrected.CM, -0.1544909, 1e-7},
	} {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("%s = %.8g, by hand %.8g", c.name, c.got, c.want)
		}
	}
	// A point beyond the calibration is refused at the balance step.
	if _, err := r.Reduce(tunnel.Point{Readings: []float64{1.2, 0, 0}, DynamicPressure: q.New(1000, q.Pressure)}); err == nil {
		t.Error("NF = 1200 N beyond the 1000 N range accepted")
	} else {
		oneClass(t, err)
	}
	if _, err := (&tunnel.Reduction{}).Reduce(tunnel.Point{}); err == nil {
		t.Error("no calibration accepted")
	} else {
		oneClass(t, err)
	}
}

// TestFitPolarExact: points on C_L = 0.1·(α + 2) and
// C_D = 0.02 + 0.05·C_L² give slope 0.1 per degree, α₀ = −2°,
// C_D0 = 0.02 and K = 0.05; the points above the linear range (stall,
// α = 14°, 16°) are left out.
func TestFitPolarExact(t *testing.T) {
	var a, l, d []float64
	for al := -4.0; al <= 10; al++ {
		cl := 0.1 * (al + 2)
		a, l, d = append(a, al), append(l, cl), append(d, 0.02+0.05*cl*cl)
	}
	a, l, d = append(a, 14, 16), append(l, 1.2, 1.1), append(d, 0.2, 0.3)
	p, err := tunnel.FitPolar(a, l, d, -4, 10, 0)
	if err != nil {
		t.Fatal(err)
	}
	if p.N != 15 || math.Abs(p.LiftSlopePerDeg.Value-0.1) > 1e-12 || math.Abs(p.ZeroLiftAlphaDeg.Value+2) > 1e-10 ||
		math.Abs(p.CD0.Value-0.02) > 1e-12 || math.Abs(p.K.Value-0.05) > 1e-12 || p.Level != 0.95 {
		t.Errorf("polar %+v", p)
	}
}

// TestFitPolarIntervals: a synthetic polar with a fixed scatter of
// ±0.004 in C_L and ±0.0004 in C_D (a repeating pattern, so the test is
// the same every run) is recovered with the true slope 0.095/°,
// α₀ = −1.5°, C_D0 = 0.018 and K = 0.06 inside the 95 % intervals, and
// those intervals are narrow (the slope's under 5 % of it).
func TestFitPolarIntervals(t *testing.T) {
	noise := []float64{0.7, -1, 0.2, 0.9, -0.4, -0.8, 0.5, 0.1, -0.6, 1, -0.3, 0.4, -0.9, 0.3, -0.2}
	var a, l, d []float64
	for i := range noise {
		al := -4 + float64(i)
		cl := 0.095*(al+1.5) + 0.004*noise[i]
		cd := 0.018 + 0.06*cl*cl + 0.0004*noise[(i+5)%len(noise)]
		a, l, d = append(a, al), append(l, cl), append(d, cd)
	}
	p, err := tunnel.FitPolar(a, l, d, -4, 10, 0.95)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name string
		e    tunnel.Estimate
		true float64
	}{{"slope", p.LiftSlopePerDeg, 0.095}, {"α₀", p.ZeroLiftAlphaDeg, -1.5}, {"C_D0", p.CD0, 0.018}, {"K", p.K, 0.06}} {
		if !(c.e.Interval[0] < c.true && c.true < c.e.Interval[1]) {
			t.Errorf("%s: %v, interval %v does not hold the true %v", c.name, c.e.Value, c.e.Interval, c.true)
		}
	}
	if w := p.LiftSlopePerDeg.Interval[1] - p.LiftSlopePerDeg.Interval[0]; !(w > 0 && w < 0.05*0.095) {
		t.Errorf("slope interval %v: width %v", p.LiftSlopePerDeg.Interval, w)
	}
}

// TestFitPolarRefuses: too few points in the range, lengths that differ,
// a coefficient that is not finite.
func TestFitPolarRefuses(t *testing.T) {
	for name, tc := range map[string]struct {
		a, l, d []float64
	}{
		"few":     {[]float64{0, 1, 20}, []float64{0, 0.1, 1}, []float64{0.02, 0.02, 0.1}},
		"lengths": {[]float64{0, 1, 2}, []float64{0, 0.1}, []float64{0.02, 0.02, 0.03}},
		"NaN":     {[]float64{0, 1, 2}, []float64{0, math.NaN(), 0.2}, []float64{0.02, 0.02, 0.03}},
	} {
		_, err := tunnel.FitPolar(tc.a, tc.l, tc.d, -4, 10, 0)
		if err == nil {
			t.Errorf("%s: accepted", name)
			continue
		}
		oneClass(t, err)
	}
}
