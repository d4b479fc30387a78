package main

import (
	"bytes"
	"errors"
	"flag"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"

	q "similis.dev/similis/quantity"
)

func TestRun(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "Re = 1.9925e+05 (turbulent", "want dimensionless [1], got density [kg·m⁻³]", "ITTC-1957"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
}

// TestPressureDropByHand checks the correlation against a calculation
// written out here: Re = 998.2·2.5·0.08/1.0016e-3 = 199321.09;
// Swamee–Jain (1976) f from its formula; Δp = f·(L/D)·ρV²/2.
func TestPressureDropByHand(t *testing.T) {
	re := 998.2 * 2.5 * 0.08 / 1.0016e-3
	f := 0.25 / math.Pow(math.Log10(4.5e-5/(3.7*0.08)+5.74/math.Pow(re, 0.9)), 2)
	dp := f * (40 / 0.08) * 998.2 * 2.5 * 2.5 / 2
	gotRe, gotF, gotDp, _, err := pressureDrop(pipe{
		q.New(998.2, q.Density), q.New(2.5, q.Velocity), q.New(0.08, q.Length),
		q.New(1.0016e-3, q.DynamicViscosity), q.New(4.5e-5, q.Length), q.New(40, q.Length),
	})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(gotRe.Value()/re-1) > 1e-14 || math.Abs(gotF.Value()/f-1) > 1e-14 || math.Abs(gotDp.Value()/dp-1) > 1e-14 {
		t.Errorf("got Re %v f %v Δp %v; hand %v %v %v", gotRe, gotF, gotDp, re, f, dp)
	}
	// Swamee and Jain's formula is within about 1 % of Colebrook over its
	// range; at Re ≈ 2e5 and ε/D = 5.6e-4, f ≈ 0.0197 (Moody chart,
	// common practice, read from memory).
	if f < 0.019 || f > 0.0205 {
		t.Errorf("f = %v, outside the Moody-chart band", f)
	}
	if gotDp.Dim() != q.Pressure {
		t.Errorf("Δp has dimension %v", gotDp.Dim())
	}
}

// TestRunBadFlags: every numeric flag refuses NaN, ±Inf, values outside
// its range and text, with a *cli.Error (exit status 2) naming the flag.
func TestRunBadFlags(t *testing.T) {
	for _, flagName := range []string{"v", "d", "l", "scale"} {
		for _, val := range []string{"NaN", "Inf", "-Inf", "-1", "0", "1e300", "x"} {
			err := run(&bytes.Buffer{}, []string{"-" + flagName, val})
			var ce *cli.Error
			if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-"+flagName) {
				t.Errorf("-%s %s: %v", flagName, val, err)
			}
		}
	}
	var ce *cli.Error
	if err := run(&bytes.Buffer{}, []string{"stray"}); !errors.As(err, &ce) || !strings.Contains(err.Error(), `"stray"`) {
		t.Errorf("a stray argument: %v", err)
	}
}

// ctmByHand is the towingtank example's invented C_TM at the Froude
// number of 15 kn on 32 m, written out: its runs at 1.60 and 2.00 m/s on
// the 2 m model (12.14 N and 22.30 N, S = 1.62 m², ρ = 999.1026 kg/m³)
// have Fn = V/√(9.80665·2) = 0.361281 and 0.451601 and
// C_TM = R/(½ρV²S) = 5.85981×10⁻³ and 6.88890×10⁻³; the ship's
// Fn = (15·1852/3600)/√(9.80665·32) = 0.435607; linearly in Fn,
// C_TM = 5.85981 + (0.435607 − 0.361281)/(0.451601 − 0.361281)·1.02909
// = 6.7067×10⁻³.
func ctmByHand() float64 {
	fn := func(v float64) float64 { return v / math.Sqrt(9.80665*2) }
	ct := func(v, r float64) float64 { return r / (0.5 * 999.1026 * v * v * 1.62) }
	f := 15 * 1852.0 / 3600 / math.Sqrt(9.80665*32)
	return ct(1.6, 12.14) + (f-fn(1.6))/(fn(2.0)-fn(1.6))*(ct(2.0, 22.30)-ct(1.6, 12.14))
}

// cfITTC is the ITTC-1957 line, C_F = 0.075/(log₁₀Re − 2)², written
// out for the hand calculations.
func cfITTC(re float64) float64 { return 0.075 / math.Pow(math.Log10(re)-2, 2) }

// nuTank is the kinematic viscosity of the tank's fresh water at 15 °C,
// μ/ρ = 1.1385×10⁻³/999.1026 m²/s as the report prints μ and ρ (IAPWS
// 2008 and IAPWS-95, python3-iapws).
const nuTank = 1.1385e-3 / 999.1026

// TestScaleFollowsReading: the invented reading holds the residuary
// coefficient of the towing-tank test (Froude's hypothesis), so it
// follows the model's size. By hand: the 2 m tank model at the ship's
// Fn runs at 15 kn/4 = 1.929167 m/s, Re = 1.929167·2/1.13952e-6 =
// 3.3859×10⁶, C_F = 0.075/(6.52968 − 2)² = 3.6553×10⁻³, so C_R =
// 6.7067 − 3.6553 = 3.0513×10⁻³ (the record's four decimals of 10³C_R:
// 6.70668 − 3.65534 = 3.05134). At 1:60 the model is 32/60 = 0.53333 m
// long at V_m = 15 kn/√60 = 0.99617 m/s: Re_m = 4.6624×10⁵, C_FM =
// 0.075/(5.66861 − 2)² = 5.5726×10⁻³, C_TM = 8.624×10⁻³, and R_m =
// C_TM·½·999.1026·V_m²·414.7/3600 = 0.4925 N; at 1:100 C_FM =
// 6.7398×10⁻³ and C_TM = 9.791×10⁻³. Froude scaling alone then makes
// the ship heavier as the model gets smaller (109.2 kN at 1:60, 84.96 kN
// at 1:16), while the ITTC-1957 extrapolation gives one ship at every
// scale: C_TS = C_FS + C_R + C_A whatever the model. The model's Re at
// 1:60 is warned about as possibly laminar.
func TestScaleFollowsReading(t *testing.T) {
	cr := math.Round((ctmByHand()-cfITTC(15*1852.0/3600/4*2/nuTank))*1e7) / 1e7
	if math.Abs(cr-3.0513e-3) > 1e-12 {
		t.Fatalf("C_R by hand %v", cr)
	}
	results := map[float64]*JobResult{}
	outs := map[float64]string{}
	for _, scale := range []float64{16, 60, 100} {
		var out bytes.Buffer
		r, err := wholeJob(&out, scale)
		if err != nil {
			t.Fatal(err)
		}
		results[scale], outs[scale] = r, out.String()
		vm, lm, sm := 15*1852.0/3600/math.Sqrt(scale), 32/scale, 414.7/(scale*scale)
		ct := cfITTC(vm*lm/nuTank) + cr
		rm := ct * 0.5 * 999.1026 * vm * vm * sm
		if math.Abs(r.ModelCT/ct-1) > 1e-4 || math.Abs(r.ModelResistance.Value()/rm-1) > 1e-4 || math.Abs(r.Residual/cr-1) > 1e-4 {
			t.Errorf("1:%g: C_TM %v, R_m %v; by hand %v, %v", scale, r.ModelCT, r.ModelResistance, ct, rm)
		}
		if p := r.Extrapolate.Points[0]; math.Abs(p.Residual/cr-1) > 1e-4 {
			t.Errorf("1:%g: the extrapolation's C_R %v, held %v", scale, p.Residual, cr)
		}
	}
	if math.Abs(results[60].ModelResistance.Value()-0.4925) > 1e-4 || math.Abs(results[60].ModelCT-8.624e-3) > 1e-6 || math.Abs(results[100].ModelCT-9.791e-3) > 1e-6 {
		t.Errorf("1:60 R_m %v, C_TM %v; 1:100 C_TM %v", results[60].ModelResistance, results[60].ModelCT, results[100].ModelCT)
	}
	if !(results[100].NaiveForce.Value() > results[60].NaiveForce.Value() && results[60].NaiveForce.Value() > results[16].NaiveForce.Value()) {
		t.Errorf("naive ship forces 1:16 %v, 1:60 %v, 1:100 %v: not heavier for a smaller model", results[16].NaiveForce, results[60].NaiveForce, results[100].NaiveForce)
	}
	for _, scale := range []float64{60, 100} {
		a, b := results[scale].Extrapolate.Points[0].ShipResistance.Value(), results[16].Extrapolate.Points[0].ShipResistance.Value()
		if math.Abs(a/b-1) > 1e-9 {
			t.Errorf("extrapolated ship resistance 1:%g %v, 1:16 %v: C_R is held, so they agree", scale, a, b)
		}
	}
	for _, want := range []string{
		"10³C_TM = 10³(C_FM + C_R) = 5.5726 + 3.0513 = 8.6239, with its own ITTC-1957 C_FM at Re = 4.66e+05)",
		"R = 0.4925 N", "→ ship 109.2 kN",
		"WARNING: run 1 (V_m = 0.9962 m/s): the model Reynolds number 4.66e+05 is below 1e+06",
		"ship resistance R = C_TS·½ρV²S = 67.5 kN",
	} {
		if !strings.Contains(outs[60], want) {
			t.Errorf("1:60 output lacks %q:\n%s", want, outs[60])
		}
	}
	if want := "10³C_TM = 9.791, 10³C_FM = 6.740, 10³C_R = 10³(C_TM − C_FM) = 3.051;"; !strings.Contains(outs[100], want) {
		t.Errorf("1:100 output lacks %q", want)
	}
}

// TestWholeJob checks the demo's chain against hand calculations.
func TestWholeJob(t *testing.T) {
	var out bytes.Buffer
	r, err := wholeJob(&out, 16)
	if err != nil {
		t.Fatal(err)
	}
	if r.Set.Len() != 3 || r.Conflict == nil || len(r.Compromise.Held) != 1 {
		t.Fatalf("set %v, conflict %v, compromise %v", r.Set, r.Conflict, r.Compromise)
	}
	// The invented reading: R_m = C_TM·½ρ_m·V_m²·S_m with C_TM the
	// towingtank example's at this Froude number (ctmByHand, 6.7067e-3),
	// V_m = 15 kn/4 = 1.929167 m/s, S_m = 414.7/256 m² and fresh water of
	// 999.1026 kg/m³ (IAPWS-95 at 15 °C, python3-iapws): 20.199 N.
	// Froude scaling of force at 1:16: λ_F = λ_ρ·16⁻³ (common practice),
	// with sea water of 1025.976 kg/m³ (IAPWS-08 at 15 °C, 35.16504 g/kg,
	// python3-iapws): R_m·4096·1025.976/999.1026.
	vm := 15 * 1852.0 / 3600 / 4
	rm := ctmByHand() * 0.5 * 999.1026 * vm * vm * 414.7 / 256
	if math.Abs(r.ModelResistance.Value()/rm-1) > 1e-5 || math.Abs(rm-20.199) > 1e-3 || math.Abs(r.ModelCT-6.7067e-3) > 1e-7 {
		t.Errorf("model reading %v, by hand %v", r.ModelResistance, rm)
	}
	want := rm * 4096 * 1025.976 / 999.1026
	if math.Abs(r.NaiveForce.Value()/want-1) > 1e-5 {
		t.Errorf("naive ship force %v, want %v", r.NaiveForce, want)
	}
	// The extrapolated resistance is below the naive one: the ship's
	// frictional coefficient is smaller at its higher Reynolds number.
	if !(r.Extrapolate.Points[0].ShipResistance.Value() < r.NaiveForce.Value()) {
		t.Errorf("extrapolated %v not below naive %v", r.Extrapolate.Points[0].ShipResistance, r.NaiveForce)
	}
	// 15 kn at 1:16: V_m = 15·1852/3600/4 m/s (exact).
	if vm := r.Extrapolate.Points[0].ModelSpeed.Value(); math.Abs(vm-15*1852.0/3600/4) > 1e-12 {
		t.Errorf("model speed %v", vm)
	}
	// Holding Fr and Re with the fluids fixed forces λ_L = (λ_μ/λ_ρ)^(2/3)
	// (ν ratio = λ_L^(3/2)); dropping the viscosity ratio needs
	// λ_μ = λ_ρ·λ_L^(3/2) = 0.973811/64 = 0.015216.
	for _, want := range []string{"forces λ_L = λ_rho^(-2/3)·λ_mu^(2/3)", "λ_mu = λ_L^(3/2)·λ_rho = 0.0152158", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestPressureDropRegimes: at V = 0.01 m/s the flow is laminar,
// Re = 998.2·0.01·0.08/1.0016e-3 = 797.28, and f = 64/Re = 0.080273
// (Hagen–Poiseuille); at V = 0.03 m/s, Re = 2392 is transitional and
// refused; at V = 0.055 m/s, Re = 4385 is turbulent but below the 5000
// Swamee–Jain was fitted on, and says so.
func TestPressureDropRegimes(t *testing.T) {
	mk := func(v float64) pipe {
		return pipe{q.New(998.2, q.Density), q.New(v, q.Velocity), q.New(0.08, q.Length),
			q.New(1.0016e-3, q.DynamicViscosity), q.New(4.5e-5, q.Length), q.New(40, q.Length)}
	}
	re, f, dp, regime, err := pressureDrop(mk(0.01))
	wantRe := 998.2 * 0.01 * 0.08 / 1.0016e-3
	if err != nil || math.Abs(re.Value()/wantRe-1) > 1e-14 || math.Abs(f.Value()-64/wantRe) > 1e-15 || !strings.HasPrefix(regime, "laminar") {
		t.Errorf("laminar: Re %v f %v (%s), %v", re, f, regime, err)
	}
	if want := 64 / wantRe * 500 * 998.2 * 0.01 * 0.01 / 2; math.Abs(dp.Value()/want-1) > 1e-14 {
		t.Errorf("laminar Δp %v, want %v", dp, want)
	}
	if _, _, _, _, err := pressureDrop(mk(0.03)); err == nil || !strings.Contains(err.Error(), "transition") {
		t.Errorf("transitional flow: %v", err)
	}
	if _, _, _, regime, err := pressureDrop(mk(0.055)); err != nil || !strings.Contains(regime, "EXTRAPOLATED") {
		t.Errorf("Re ≈ 4400: %q, %v", regime, err)
	}
}

// TestHelp: -h prints the usage and is not an error for main.
func TestHelp(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-h"})
	if !errors.Is(err, flag.ErrHelp) || !strings.Contains(out.String(), "Usage") || !strings.Contains(out.String(), "It prints, in order") ||
		!strings.Contains(out.String(), "naval architect") || !strings.Contains(out.String(), "-scale") ||
		!strings.Contains(out.String(), "by Froude's hypothesis C_R is the same for a model of any size") || strings.Contains(out.String(), "held at the Froude-scaled speed") {
		t.Errorf("-h: %v, %q", err, out.String())
	}
}

// TestPrintedLines: the printed coefficients say their factor 10³ on the
// name, use one spelling (C_TM, capital subscripts), and the ship's
// figures carry one decimal each; the printed μ reproduces the printed
// Re by hand: 998.207·2.5·0.08/1.00194×10⁻³ = 199 255 → 1.9925×10⁵.
func TestPrintedLines(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, want := range []string{
		"ρ = 998.207 kg/m³, V = 2.5 m/s, D = 0.08 m, μ = 1.00194 mPa·s",
		"Re = 1.9925e+05",
		"(Fn = 0.4356), R = 20.20 N",
		"on its 2 m model at this Froude number, gives 10³C_TM = 6.7066\n",
		"Froude's hypothesis holds C_R for a model\n",
		"10³C_TM = 6.707, 10³C_FM = 3.655, 10³C_R = 10³(C_TM − C_FM) = 3.051",
		"ship resistance R = C_TS·½ρV²S = 67.5 kN, effective power P_E = R·V = 521 kW",
	} {
		if !strings.Contains(s, want) {
			t.Errorf("output lacks %q:\n%s", want, s)
		}
	}
	if re := 998.207 * 2.5 * 0.08 / 1.00194e-3; math.Abs(re-1.9925e5) > 5 {
		t.Errorf("Re from the printed values %v, printed 1.9925e+05", re)
	}
	for _, not := range []string{"C_Tm", "C_Fm", "× 1000", "μ = 0.0010", "run 0"} {
		if strings.Contains(s, not) {
			t.Errorf("output has %q", not)
		}
	}
}

// TestShipFiguresStated: the ship's resistance comes with the figures it
// is made from: S = 414.7 m² and V = 15 kn = 15·1852/3600 = 7.7167 m/s,
// and by hand R = C_TS·½ρV²S = 5.331×10⁻³·½·1025.97·7.7167²·414.7 =
// 67.5 kN, P_E = R·V = 67.5·7.7167 = 521 kW.
func TestShipFiguresStated(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	want := "  ship: L = 32 m, S = 414.7 m² (wetted), V = 15 kn = 7.717 m/s, sea water at 15 °C, ρ = 1025.97 kg/m³\n" +
		"  ship resistance R = C_TS·½ρV²S = 67.5 kN"
	if !strings.Contains(out.String(), want) {
		t.Errorf("output lacks %q", want)
	}
	v := 15 * 1852.0 / 3600
	r := 5.331e-3 * 0.5 * 1025.97 * v * v * 414.7
	if math.Abs(r/1e3-67.5) > 0.05 || math.Abs(r*v/1e3-521.1) > 0.5 {
		t.Errorf("by hand R = %v N, P_E = %v W", r, r*v)
	}
}

// TestPipeLineDigits: the pipe line gives f and Δp to three significant
// figures whatever the regime, Δp with an SI prefix by magnitude. By
// hand, laminar (-d 0.001 -v 0.001 -l 0.01): Re = 998.207·0.001·0.001/
// 1.00194e-3 = 0.99627, f = 64/Re = 64.24, Δp = f·(L/D)·ρV²/2 =
// 64.24·10·998.207·1e-6/2 = 0.3206 Pa; by default f = 0.0193 and Δp =
// 30 042 Pa = 30.0 kPa. With -d 0.001 the relative roughness is
// ε/D = 4.5e-5/0.001 = 0.045, above the Swamee–Jain range's 1e-2, and
// the note names that bound with the value.
func TestPipeLineDigits(t *testing.T) {
	re := 998.207 * 0.001 * 0.001 / 1.00194e-3
	f := 64 / re
	if dp := f * 10 * 998.207 * 1e-6 / 2; math.Abs(f-64.24) > 0.005 || math.Abs(dp-0.3206) > 0.0001 {
		t.Fatalf("by hand f = %v, Δp = %v", f, dp)
	}
	for _, c := range []struct {
		args      []string
		want, not string
	}{
		{nil, "f = 0.0193   Δp = 30.0 kPa\n", "30042"},
		{[]string{"-d", "0.001", "-v", "0.001", "-l", "0.01"}, "(laminar, f = 64/Re)   f = 64.2   Δp = 0.321 Pa\n", "64.2395"},
		{[]string{"-d", "0.001", "-v", "50", "-l", "10000"}, "(EXTRAPOLATED: ε/D = 0.045 above 1e-2; the formula was fitted for 5000 ≤ Re ≤ 1e8 and 1e-6 ≤ ε/D ≤ 1e-2))   f = 0.0690", "outside 5000"},
		{[]string{"-v", "0.055"}, "(EXTRAPOLATED: Re = 4384 below 5000;", "ε/D ="},
	} {
		var out bytes.Buffer
		if err := run(&out, c.args); err != nil {
			t.Fatal(err)
		}
		if s := out.String(); !strings.Contains(s, c.want) || strings.Contains(s, c.not) {
			t.Errorf("%v: output lacks %q or has %q:\n%s", c.args, c.want, c.not, s[:min(len(s), 600)])
		}
	}
	for _, c := range []struct {
		v    float64
		want string
	}{{30042, "30.0 kPa"}, {0.32062, "0.321 Pa"}, {8.6136e11, "861 GPa"}, {999.96, "1.00 kPa"}, {0.00012345, "0.123 mPa"}} {
		if got := siSig(c.v, "Pa", 3); got != c.want {
			t.Errorf("siSig(%v) = %q, want %q", c.v, got, c.want)
		}
	}
}
