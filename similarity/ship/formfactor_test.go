package ship_test

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// TestDoubleBody: C_V/C_F per run, its mean, standard error and spread by
// hand for three invented runs; the wave resistance is C_T − (1 + k)·C_F
// at the same Reynolds number.
func TestDoubleBody(t *testing.T) {
	re := []float64{2e6, 4e6, 8e6}
	cf := func(r float64) float64 { d := math.Log10(r) - 2; return 0.075 / (d * d) }
	ratios := []float64{1.21, 1.19, 1.20}
	cv := make([]float64, 3)
	for i := range re {
		cv[i] = ratios[i] * cf(re[i])
	}
	r, err := ship.FormFactorDoubleBody(re, cv, ship.LineITTC1957)
	if err != nil {
		t.Fatal(err)
	}
	// mean 1.20; s = √((0.01² + 0.01² + 0)/2) = 0.01; s/√3 = 0.0057735.
	if math.Abs(r.FormFactor-1.20) > 1e-12 || math.Abs(r.StdErr-0.01/math.Sqrt(3)) > 1e-12 || math.Abs(r.Spread-0.02) > 1e-12 {
		t.Errorf("1 + k = %v ± %v, spread %v; want 1.20 ± 0.00577, 0.02", r.FormFactor, r.StdErr, r.Spread)
	}
	ct := []float64{5e-3, 4.5e-3, 4.2e-3}
	cw, err := ship.WaveResistance(re, ct, 1.2, ship.LineITTC1957)
	if err != nil {
		t.Fatal(err)
	}
	for i := range re {
		if want := ct[i] - 1.2*cf(re[i]); math.Abs(cw[i]-want) > 1e-18 {
			t.Errorf("C_W[%d] = %v, want %v", i, cw[i], want)
		}
	}
	if _, err := ship.FormFactorDoubleBody(re, []float64{1e-3, 1e-3, 1e-3}, ship.LineITTC1957); err == nil {
		t.Errorf("1 + k below 1 accepted")
	}
	if _, err := ship.FormFactorDoubleBody(re[:1], cv[:1], ship.LineITTC1957); err == nil {
		t.Errorf("one run accepted")
	}
}

// TestProhaskaExponent: on runs made exactly as C_T/C_F = 1.15 + 40·Fn⁵/C_F
// the fitted exponent is 5 and the intercept 1.15; with the exponent fixed
// at 4 the intercept differs. A run below Re = 10⁶ gives the warning.
func TestProhaskaExponent(t *testing.T) {
	fn := []float64{0.08, 0.10, 0.12, 0.14, 0.16, 0.18}
	cf := []float64{4.9e-3, 4.6e-3, 4.4e-3, 4.25e-3, 4.1e-3, 4.0e-3}
	ct := make([]float64, len(fn))
	for i := range fn {
		ct[i] = cf[i] * (1.15 + 40*math.Pow(fn[i], 5)/cf[i])
	}
	re := []float64{0.8e6, 1.2e6, 1.5e6, 1.8e6, 2.1e6, 2.4e6}
	r, err := ship.ProhaskaWith(fn, ct, cf, ship.ProhaskaOptions{FitExponent: true, Reynolds: re})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.Exponent-5) > 1e-4 || math.Abs(r.FormFactor-1.15) > 1e-6 || r.FormFactorStdErr > 1e-6 {
		t.Errorf("n = %v, 1 + k = %v ± %v; want 5, 1.15, 0", r.Exponent, r.FormFactor, r.FormFactorStdErr)
	}
	if !strings.Contains(r.Warning, "run 1 (Re = 8e+05)") || len(r.Runs) != 6 {
		t.Errorf("warning %q, runs %v", r.Warning, r.Runs)
	}
	r4, _ := ship.ProhaskaWith(fn, ct, cf, ship.ProhaskaOptions{})
	if r4.Exponent != 4 || math.Abs(r4.FormFactor-1.15) < 1e-3 || r4.Warning != "" {
		t.Errorf("n = 4: %+v", r4)
	}
	if _, err := ship.ProhaskaWith(fn, ct, cf, ship.ProhaskaOptions{Exponent: 20}); err == nil {
		t.Errorf("exponent 20 accepted")
	}
}

// TestTemperatureCorrection by hand: a model at 2 m/s, L = 4 m, tested in
// water of ν = 1.0035e-6 m²/s (20 °C) corrected to ν₁₅ = 1.1386e-6 m²/s
// (ITTC 7.5-02-01-03 fresh water, from memory): C_T(15) = C_T(t) +
// (1 + k)(C_F(Re₁₅) − C_F(Re_t)), ITTC-1957 line.
func TestTemperatureCorrection(t *testing.T) {
	ret, res := 2*4/1.0035e-6, 2*4/1.1386e-6
	cf := func(r float64) float64 { d := math.Log10(r) - 2; return 0.075 / (d * d) }
	got, err := ship.TemperatureCorrection(ship.TemperatureInput{CT: 4.5e-3, TestReynolds: ret, StandardReynolds: res, FormFactor: 1.1, Line: ship.LineITTC1957})
	if err != nil {
		t.Fatal(err)
	}
	want := 4.5e-3 + 1.1*(cf(res)-cf(ret))
	if math.Abs(got-want) > 1e-18 || !(got > 4.5e-3) {
		t.Errorf("C_T(15) = %v, want %v (colder water: higher C_F)", got, want)
	}
}

// The form factor from a double-body test (invented runs), and the wave
// resistance of the free-surface model at the same Reynolds numbers.
func ExampleFormFactorDoubleBody() {
	re := []float64{3.0e6, 4.5e6, 6.0e6}
	cv := []float64{3.97e-3, 3.68e-3, 3.49e-3}
	db, err := ship.FormFactorDoubleBody(re, cv, ship.LineITTC1957)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("1 + k = %.4f ± %.4f (spread %.4f over %d runs, %v line)\n", db.FormFactor, db.StdErr, db.Spread, len(db.PerRun), db.Line)
	cw, _ := ship.WaveResistance(re, []float64{4.21e-3, 4.02e-3, 4.05e-3}, db.FormFactor, db.Line)
	for i, c := range cw {
		fmt.Printf("Re = %.1e: C_W = %.2e\n", re[i], c)
	}
	// Output:
	// 1 + k = 1.0619 ± 0.0005 (spread 0.0014 over 3 runs, ITTC-1957 line)
	// Re = 3.0e+06: C_W = 2.37e-04
	// Re = 4.5e+06: C_W = 3.42e-04
	// Re = 6.0e+06: C_W = 5.61e-04
}

// TestHullTable: the resistance table carries each run's figures, the
// line, the warnings and the caution.
func TestHullTable(t *testing.T) {
	tank, _ := fluids.FreshWater().AtCelsius(15)
	sea, _ := fluids.SeaWater().AtCelsius(15)
	res, err := ship.ExtrapolateHull(ship.HullTest{
		Scale: 1.0 / 16, ModelLength: quantity.New(2, quantity.Length), ModelWettedArea: quantity.New(1.62, quantity.Area),
		Speeds:      []quantity.Quantity{quantity.New(1.0, quantity.Velocity), quantity.New(2.4, quantity.Velocity)},
		Resistances: []quantity.Quantity{quantity.New(4.055, quantity.Force), quantity.New(38.1, quantity.Force)},
		Tank:        tank, Sea: sea, Allowance: 0.0004, Line: ship.LineSchoenherr,
	})
	if err != nil {
		t.Fatal(err)
	}
	p := res.Points[1]
	txt, md := res.Table(false), res.Table(true)
	for _, want := range []string{"Schoenherr", fmt.Sprintf("%.3f", p.ModelCT*1e3), fmt.Sprintf("%.1f", p.ShipResistance.Value()/1e3), "R_TS kN", "P_E kW", "CAUTION:"} {
		if !strings.Contains(txt, want) || !strings.Contains(md, want) {
			t.Errorf("table lacks %q:\n%s", want, txt)
		}
	}
	// On the Schoenherr line C_FM at Re = 2.4·2/1.1395e-6 is the line's own.
	if cf, _ := ship.LineSchoenherr.CF(p.ModelReynolds); cf != p.ModelCF {
		t.Errorf("C_FM %v, Schoenherr line %v", p.ModelCF, cf)
	}
}

// TestWaveResistanceRefuses: a C_T that is not finite, or a form factor
// outside 1 … 2, is an error with the run.
func TestWaveResistanceRefuses(t *testing.T) {
	if _, err := ship.WaveResistance([]float64{2e6}, []float64{math.NaN()}, 1.1, ship.LineITTC1957); err == nil {
		t.Errorf("a NaN C_T accepted")
	}
	if _, err := ship.WaveResistance([]float64{2e6}, []float64{4e-3}, 0.9, ship.LineITTC1957); err == nil {
		t.Errorf("1 + k = 0.9 accepted")
	}
	if _, err := ship.TemperatureCorrection(ship.TemperatureInput{CT: math.Inf(1), TestReynolds: 2e6, StandardReynolds: 1.8e6, FormFactor: 1.1, Line: ship.LineITTC1957}); err == nil {
		t.Errorf("an infinite C_T accepted")
	}
}
