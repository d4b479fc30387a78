package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"image/png"
	"io"
	"math"
	"os"
	"slices"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
)

func TestRuns(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-out", t.TempDir()}); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented data", "1 + k =", "CAUTION:", "ITTC-1957"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-scale", "0.5"}); err == nil {
		t.Error("-scale 0.5 accepted")
	}
}

// TestByHand repeats the ITTC-1957 steps for the fourth run (1.00 m/s)
// by hand, with the water properties the example reports.
func TestByHand(t *testing.T) {
	o, err := evaluate(&bytes.Buffer{}, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	p := o.Plain.Points[3]
	nuM := o.Plain.Test.Tank.KinematicViscosity.Value()
	rhoM := o.Plain.Test.Tank.Density.Value()
	nuS := o.Plain.Test.Sea.KinematicViscosity.Value()
	rhoS := o.Plain.Test.Sea.Density.Value()
	Vm, Lm, Sm, R := 1.00, 2.0, 1.62, 4.055
	fn := Vm / math.Sqrt(9.80665*Lm)
	cf := func(re float64) float64 { d := math.Log10(re) - 2; return 0.075 / (d * d) }
	ctm := R / (0.5 * rhoM * Vm * Vm * Sm)
	cfm := cf(Vm * Lm / nuM)
	cr := ctm - cfm
	Vs := Vm * 4 // √16
	cfs := cf(Vs * 32 / nuS)
	cts := cfs + cr + 0.0004
	Rs := cts * 0.5 * rhoS * Vs * Vs * Sm * 256
	got := []float64{p.Froude, p.ModelCT, p.ModelCF, p.ShipSpeed.Value(), p.ShipResistance.Value(), p.EffectivePower.Value()}
	want := []float64{fn, ctm, cfm, Vs, Rs, Rs * Vs}
	for i := range got {
		if math.Abs(got[i]/want[i]-1) > 1e-12 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	// With the form factor the ship resistance is lower: (1 + k) > 1 moves
	// part of C_R to the frictional part, which falls with Re.
	if !(o.Form.FormFactor > 1 && o.Form.FormFactor < 1.5) || !(o.WithForm.Points[3].ShipResistance.Value() < Rs) {
		t.Errorf("form factor %v, R with form %v", o.Form.FormFactor, o.WithForm.Points[3].ShipResistance)
	}
}

// TestHelp: -h prints the usage and is not an error for main.
func TestHelp(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-h"})
	for _, want := range []string{"Usage", "It prints:", "C_Ts (including the allowance C_A)", "P_D (all shafts)", "naval architect", "thrust identity", "open-water test", "-dpi", "-plotw", "towingtank-coefficients.png/.svg and towingtank-openwater.png/.svg", "-scale changes the ship", "The invented readings were recorded in the tank at 15 °C. -tank makes\nthem for another tank temperature, consistently", "-sea changes only the ship's water"} {
		if !errors.Is(err, flag.ErrHelp) || !strings.Contains(out.String(), want) {
			t.Errorf("-h: %v, lacks %q", err, want)
		}
	}
}

// TestBadFlags: every numeric flag refuses NaN, ±Inf, values outside its
// range and text with a *cli.Error (exit status 2) naming the flag; a
// tank so deep that the old code printed "choking at +Inf m/s" is out of
// range.
func TestBadFlags(t *testing.T) {
	for _, name := range []string{"scale", "tank", "sea", "ca", "maxfn", "width", "depth", "plotw", "ploth", "dpi"} {
		for _, val := range []string{"NaN", "Inf", "-Inf", "1e308", "-1e308", "x"} {
			err := run(io.Discard, []string{"-out", t.TempDir(), "-" + name, val})
			var ce *cli.Error
			if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-"+name) {
				t.Errorf("-%s %s: %v", name, val, err)
			}
		}
	}
	var ce *cli.Error
	if err := run(io.Discard, []string{"stray"}); !errors.As(err, &ce) || !strings.Contains(err.Error(), `"stray"`) {
		t.Errorf("a stray argument: %v", err)
	}
}

// TestPrintedStatements: the output says what each number includes.
func TestPrintedStatements(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-out", t.TempDir()}); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{
		"ship figures: C_Ts = (1 + k)·C_Fs + C_R + C_A with C_A = 0.0004",
		"S = 1.62 m² (wetted, both hulls); ship L = 32 m, S = 414.7 m²",
		"1 + k = 1.131, u = 0.0023 (standard uncertainty of the intercept, Type A, ν = 1)",
		"1 + k = 1.141, u = 0.0018 (standard uncertainty of the mean, Type A, ν = 3)",
		"u(1 + k) = 0.0023 (Prohaska fit, ν = 1)",
		"WARNING (form factor): double body − Prohaska = +0.010",
		"form factor method (double body vs Prohaska)",
		"so the procedure's twin-screw rule is applied, w_TS = w_TM\n(ITTC 7.5-02-03-01.4, the wake not scaled; from memory)",
		// One form factor and one C_A for the speed–power result, said so.
		"the speed–power result uses this 1 + k = 1.141",
		"the ITTC-1957 tables above use Prohaska's 1 + k = 1.131 and the -ca allowance,\nwhich lumps roughness and correlation for that method only",
		"the basin has no\nITTC-1978 correlation allowance of its own, so C_A is the procedure's formula",
		// Standard uncertainty and half-width; s of one run.
		"speed u = 0.1 % (rectangular, half-width 0.17 %)",
		"repeatability 0.06 N (the standard deviation s of a single run,\nfrom 5 repeat runs, ν = 4",
		"R_s = 130.80 kN, u_c = 0.43 kN (0.33 %), ν_eff = 31, k = 2.04",
		"after the correlation factors C_P = 1 on P_D and C_N = 1 on n",
		"C_Tm×10³  C_Fm×10³  C_R×10³",
		"K_T   10K_Q    η_O",
		"lowers C_TS by 1.5 %",
		"WARNING (1 + k = 1.000 and 1.131): run 1 (V_m = 0.5 m/s): the model Reynolds number 8.78e+05",
		"WARNING: self-propulsion run 1 (V_M = 1 m/s): the propeller's Re_0.7 = 7.08e+04 is below the usual minimum 2e+05",
		"WARNING: self-propulsion run 4 (V_M = 2 m/s): the propeller's Re_0.7 = 1.6e+05 is below",
		"P_D the sum over both shafts",
		"ΔC_F×10³  C_A×10³",
		"C_A from the procedure's formula",
		"ΔC_F = -0.055×10⁻³ is negative",
		"columns: Vm the carriage speed; Fh = Vm/√(g·h) the depth Froude number",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	// Printed once each; no run numbered from 0; the -ca figure is not
	// called "none".
	for _, once := range []string{"WARNING (8.00 kn)", "CAUTION: Delivered power", "model Reynolds number 8.78e+05"} {
		if n := strings.Count(out.String(), once); n != 1 {
			t.Errorf("%q printed %d times", once, n)
		}
	}
	for _, not := range []string{"run 0", "from 0", "×1e3", "residual standard deviations from", "the basin giving none", "self-propulsion run 5"} {
		if strings.Contains(out.String(), not) {
			t.Errorf("output has %q", not)
		}
	}
}

// TestSelfPropulsionReynoldsByHand: run 1's Re_0.7 by hand,
// c_0.7·√(V_A² + (0.7πnD)²)/ν with V_A = J_TM·nD, below 2×10⁵; run 5's
// above it.
func TestSelfPropulsionReynoldsByHand(t *testing.T) {
	o, err := evaluate(io.Discard, []string{"-plot=false"})
	if err != nil {
		t.Fatal(err)
	}
	nu := o.Plain.Test.Tank.KinematicViscosity.Value()
	d := 1.35 / 16
	for i, want := range []bool{true, true, true, true, false} {
		p := o.Powering.SpeedPower.Factors[i]
		va := p.J * p.RevsPerSecond * d
		re := 0.45 / 16 * math.Hypot(va, 0.7*math.Pi*p.RevsPerSecond*d) / nu
		if math.Abs(p.Reynolds-re) > 1e-9*re || (p.Warning != "") != want || (re < 2e5) != want {
			t.Errorf("run %d: Re_0.7 %v, by hand %v, warning %q", i+1, p.Reynolds, re, p.Warning)
		}
	}
	// Run 1 written out: J_TM = 0.7427, n = 14.64 rev/s, D = 0.084375 m:
	// V_A = 0.9174 m/s, 0.7πnD = 2.7164 m/s, √(0.8417 + 7.3790) = 2.8672 m/s,
	// Re_0.7 = 0.028125·2.8672/1.1395×10⁻⁶ ≈ 7.08×10⁴.
	if re := o.Powering.SpeedPower.Factors[0].Reynolds; math.Abs(re-7.08e4) > 0.01e4 {
		t.Errorf("run 1: Re_0.7 = %v, by hand 7.08e4", re)
	}
}

// TestFormFactorDisagreementByHand: the double-body and Prohaska values
// differ by Δ; with u_c = √(u_DB² + u_P²) the difference is flagged when
// |Δ| > 2u_c and then enters the budget as a rectangular source of
// standard uncertainty |Δ|/√3, contributing |∂R_s/∂(1 + k)|·|Δ|/√3.
func TestFormFactorDisagreementByHand(t *testing.T) {
	o, err := evaluate(io.Discard, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	d := o.DoubleBody.FormFactor - o.Form.FormFactor
	uc := math.Sqrt(o.DoubleBody.StdErr*o.DoubleBody.StdErr + o.Form.FormFactorStdErr*o.Form.FormFactorStdErr)
	if !(math.Abs(d) > 2*uc) || o.MethodDiff != d {
		t.Fatalf("Δ = %v, u_c = %v, flagged %v", d, uc, o.MethodDiff)
	}
	var kSens, got float64
	for _, l := range o.Budget.Resistance.Lines {
		switch l.Source.Name {
		case "form factor (Prohaska fit)":
			kSens = l.Sensitivity.Value()
		case "form factor method (double body vs Prohaska)":
			got = l.Contribution.Value()
		}
	}
	if want := math.Abs(kSens) * math.Abs(d) / math.Sqrt(3); kSens == 0 || math.Abs(got-want) > 1e-9*want {
		t.Errorf("method source contributes %v N, by hand %v N", got, want)
	}
}

// TestCorrelationAllowanceByHand: the ITTC-1978 rows use the procedure's
// C_A = (5.68 − 0.6·log₁₀Re_S)·10⁻³ at Re_S = V_S·L_S/ν_S, and C_TS adds
// it to the rest.
func TestCorrelationAllowanceByHand(t *testing.T) {
	o, err := evaluate(io.Discard, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	nuS := o.Plain.Test.Sea.KinematicViscosity.Value()
	for i, p := range o.Powering.Points {
		re := o.Powering.ShipKnots[i] * 1852 / 3600 * 32 / nuS
		ca := (5.68 - 0.6*math.Log10(re)) * 1e-3
		k := o.DoubleBody.FormFactor
		cts := k*p.ShipCF + p.RoughnessAllowance + ca + p.Residual + p.AirResistance
		if math.Abs(p.CorrelationAllowance-ca) > 1e-15 || !p.CorrelationFromFormula || math.Abs(p.ShipCT-cts) > 1e-15 {
			t.Errorf("speed %d: C_A %v (by hand %v), C_TS %v (by hand %v)", i, p.CorrelationAllowance, ca, p.ShipCT, cts)
		}
	}
}

// TestPlotSize: -plotw 5 -ploth 3 -dpi 200 gives a 1000 × 600 pixel PNG.
func TestPlotSize(t *testing.T) {
	dir := t.TempDir()
	o, err := evaluate(io.Discard, []string{"-out", dir, "-plotw", "5", "-ploth", "3", "-dpi", "200"})
	if err != nil {
		t.Fatal(err)
	}
	f, err := os.Open(o.Powering.PNG)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	cfg, err := png.DecodeConfig(f)
	if err != nil || cfg.Width != 1000 || cfg.Height != 600 {
		t.Errorf("PNG %d × %d, %v; want 1000 × 600", cfg.Width, cfg.Height, err)
	}
}

// TestSubscriptSegments: "_{…}" becomes a subscript run, the rest plain.
func TestSubscriptSegments(t *testing.T) {
	for _, c := range []struct {
		in   string
		want []plotstyle.Segment
	}{
		{"model C_{TM} (measured)", []plotstyle.Segment{{Text: "model C", Sub: false}, {Text: "TM", Sub: true}, {Text: " (measured)", Sub: false}}},
		{"C_{TS}", []plotstyle.Segment{{Text: "C", Sub: false}, {Text: "TS", Sub: true}}},
		{"Re_x no brace", []plotstyle.Segment{{Text: "Re_x no brace", Sub: false}}},
		{"open _{ brace", []plotstyle.Segment{{Text: "open _{ brace", Sub: false}}},
	} {
		if got := plotstyle.Segments(c.in, true); !cmp.Equal(got, c.want) {
			t.Errorf("segments(%q) = %v, want %v", c.in, got, c.want)
		}
	}
}

// TestBudgetByHand checks the top-speed budget: R_s is the table's value;
// the resistance measurement reaches R_s with the sensitivity
// c = (ρ_s/ρ_m)·λ⁻³ (C_R carried at equal Fn; V_s²S_s/(V_m²S_m) = 16·256),
// so its repeatability contributes c·0.06 N; the wetted area, as a relative
// source, contributes |∂R_s/∂S_m|·0.005·S_m; the shares of u_c² add to
// 100 % (no correlated sources); and P_E = R_s·V_s carries the same
// relative parts plus the speed's own.
func TestBudgetByHand(t *testing.T) {
	var out bytes.Buffer
	o, err := evaluate(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	b := o.Budget
	top := o.WithForm.Points[len(o.WithForm.Points)-1]
	if r := b.Result.ShipResistance.Value(); math.Abs(r/top.ShipResistance.Value()-1) > 1e-12 {
		t.Errorf("budget R_s %v, table %v", r, top.ShipResistance)
	}
	rhoS, rhoM := o.WithForm.Test.Sea.Density.Value(), o.WithForm.Test.Tank.Density.Value()
	c := rhoS / rhoM * 4096
	var sum float64
	for _, l := range b.Resistance.Lines {
		sum += l.Percent
		if l.Source.Name == "resistance repeatability" {
			if math.Abs(l.Contribution.Value()-c*0.06) > 1e-9*c {
				t.Errorf("repeatability contributes %v N, by hand %v N", l.Contribution.Value(), c*0.06)
			}
			if math.Abs(l.Sensitivity.Value()-c) > 1e-9*c {
				t.Errorf("c = %v, by hand %v", l.Sensitivity.Value(), c)
			}
		}
	}
	if math.Abs(sum-100) > 1e-9 {
		t.Errorf("shares add to %v %%", sum)
	}
	// u_c by hand as the root-sum-square of the lines.
	var ss float64
	for _, l := range b.Resistance.Lines {
		ss += l.Contribution.Value() * l.Contribution.Value()
	}
	if math.Abs(math.Sqrt(ss)/b.Resistance.U.Value()-1) > 1e-12 {
		t.Errorf("u_c %v, root-sum-square %v", b.Resistance.U.Value(), math.Sqrt(ss))
	}
	// The report: R_s to the decimal place of u_c (GUM 7.2.6), and the
	// repeatability's c by hand in kN per newton of R_m.
	for _, want := range []string{"R_s = 130.80 kN", fmt.Sprintf("u_c = %.2f kN", math.Sqrt(ss)/1e3), "P_E = 1255.6 kW", fmt.Sprintf("%.3g kN/N", c/1e3), "tank thermometer", "form factor (Prohaska fit)", "invented instrument figures"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestPoweringByHand checks the second half of the job: the double-body
// form factor as the mean of C_V/C_F with C_V = R_V/(½ρV²·2S) and the
// ITTC-1957 C_F; and at the top speed the propeller load
// K_T/J² = S_s·C_TS/(2·N·D²(1 − t)(1 − w)²) with N = 2 and the model wake
// (twin screws), the operating point on that load, n = (1 − w)V_s/(J·D),
// and P_D = P_E/η_D; the plots are written.
func TestPoweringByHand(t *testing.T) {
	dir := t.TempDir()
	o, err := evaluate(&bytes.Buffer{}, []string{"-out", dir})
	if err != nil {
		t.Fatal(err)
	}
	pw := o.Powering
	tank := o.Plain.Test.Tank
	nu, rho := tank.KinematicViscosity.Value(), tank.Density.Value()
	var sum float64
	for i, v := range dbSpeeds {
		cv := dbResistances[i] / (0.5 * rho * v * v * 2 * 1.62)
		d := math.Log10(v*2.0/nu) - 2
		sum += cv / (0.075 / (d * d))
	}
	if k := sum / 4; math.Abs(pw.DoubleBody.FormFactor-k) > 1e-12 {
		t.Errorf("double-body 1 + k = %v, by hand %v", pw.DoubleBody.FormFactor, k)
	}
	top := pw.Points[len(pw.Points)-1]
	vs, d := 18*1852.0/3600, 1.35
	vm := vs / 4
	// The factors are the self-propulsion test's, faired against V_M.
	w, th := pw.SpeedPower.Wake.Eval(vm), pw.SpeedPower.Thrust.Eval(vm)
	ss := 1.62 * 256
	load := ss * top.ShipCT / (2 * 2 * d * d * (1 - th) * (1 - w) * (1 - w))
	if top.ShipWake != w || top.ModelWake != w || top.ThrustDeduction != th || math.Abs(top.Load-load) > 1e-12*load {
		t.Errorf("w_TS = %v (want the model's %v), t = %v (want %v), load %v (by hand %v)", top.ShipWake, w, top.ThrustDeduction, th, top.Load, load)
	}
	if math.Abs(top.KT-load*top.J*top.J) > 1e-9 {
		t.Errorf("K_T = %v is not the load's %v at J = %v", top.KT, load*top.J*top.J, top.J)
	}
	if n := (1 - w) * vs / (top.J * d); math.Abs(top.RevsPerSecond-n) > 1e-12*n {
		t.Errorf("n = %v rev/s, by hand %v", top.RevsPerSecond, n)
	}
	if pe := top.EffectivePower.Value(); math.Abs(top.DeliveredPower.Value()-pe/top.EtaD) > 1e-9*pe {
		t.Errorf("P_D = %v, P_E/η_D = %v", top.DeliveredPower.Value(), pe/top.EtaD)
	}
	for _, f := range []string{pw.PNG, pw.SVG} {
		if st, err := os.Stat(f); err != nil || st.Size() < 1000 {
			t.Errorf("plot %s: %v", f, err)
		}
	}
}

// TestBlockageByHand: the top run in the 4.5 m × 2.2 m tank:
// m = 0.030/9.9 = 0.0030303, Fh² = 2.4²/(9.80665·2.2) = 0.2669802,
// linearised ΔV/V = 0.0030303/(1 − 0.0030303 − 0.2669802) = 0.0041512;
// the full correction satisfies continuity,
// V·b·h = (V + ΔV)·(b·(h − Δh) − A_x), and the extrapolation on V' uses
// C_T = R/(½ρV'²S).
func TestBlockageByHand(t *testing.T) {
	o, err := evaluate(&bytes.Buffer{}, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	c := o.Blockage[len(o.Blockage)-1]
	m, fh2 := 0.030/9.9, 2.4*2.4/(9.80665*2.2)
	if math.Abs(c.Blockage-m) > 1e-15 || math.Abs(c.LinearCorrection-m/(1-m-fh2)) > 1e-14 || math.Abs(c.LinearCorrection-0.0041512) > 5e-8 {
		t.Errorf("m = %v, linear ΔV/V = %v; by hand 0.0030303, 0.0041512", c.Blockage, c.LinearCorrection)
	}
	dv, dh := 2.4*c.SpeedCorrection, c.SurfaceDrop.Value()
	if got := (2.4 + dv) * (4.5*(2.2-dh) - 0.030); math.Abs(got-2.4*9.9) > 1e-9 {
		t.Errorf("continuity %v, want %v", got, 2.4*9.9)
	}
	p := o.Blocked.Points[len(o.Blocked.Points)-1]
	rho := o.Plain.Test.Tank.Density.Value()
	vp := 2.4 * (1 + c.SpeedCorrection)
	if want := 38.10 / (0.5 * rho * vp * vp * 1.62); math.Abs(p.ModelCT/want-1) > 1e-12 {
		t.Errorf("C_T on V' = %v, by hand %v", p.ModelCT, want)
	}
	if want := vp * 4; math.Abs(p.ShipSpeed.Value()/want-1) > 1e-12 {
		t.Errorf("ship speed %v, want %v", p.ShipSpeed.Value(), want)
	}
}

// TestEveryScale: every accepted -scale runs to the end with the same
// model readings, and the self-propulsion readings made for the scale
// give back the hull's invented factors (w_TM, t, η_R within the
// readings' rounding) and a speed–power curve inside the tests' range.
func TestEveryScale(t *testing.T) {
	for _, s := range []float64{2, 3, 5, 8, 10, 15, 16, 17, 20, 25, 40, 60, 100} {
		o, err := evaluate(io.Discard, []string{"-plot=false", "-scale", fmt.Sprint(s)})
		if err != nil {
			t.Errorf("-scale %v: %v", s, err)
			continue
		}
		for i, p := range o.Powering.SpeedPower.Factors {
			f := spFactors[i]
			if math.Abs(p.Wake-f[0]) > 0.002 || math.Abs(p.ThrustDeduction-f[1]) > 0.002 || math.Abs(p.RelativeRotative-f[2]) > 0.002 {
				t.Errorf("-scale %v, run %d: w_TM %.4f, t %.4f, η_R %.4f; invented %v", s, i+1, p.Wake, p.ThrustDeduction, p.RelativeRotative, f)
			}
		}
		if n := len(o.Powering.ShipKnots); n < 3 || n > 6 {
			t.Errorf("-scale %v: %d ship speeds %v", s, n, o.Powering.ShipKnots)
		}
		if d := o.Powering.Propeller.Diameter.Value(); math.Abs(d-1.35/16*s) > 1e-12 {
			t.Errorf("-scale %v: ship propeller D = %v m, want D_M·λ = %v", s, d, 1.35/16*s)
		}
	}
}

// TestMaxFnTooLow: -maxfn 0.1 leaves no run for Prohaska's method (the
// lowest is 0.50/√(9.80665·2) = 0.113); the third-lowest run's Fn is
// 0.80/√(9.80665·2) = 0.18064, so the fix is -maxfn 0.181 or more. It is
// a usage error printed before any report, with no package prefix.
func TestMaxFnTooLow(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-plot=false", "-maxfn", "0.1"})
	var ce *cli.Error
	if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-maxfn 0.1") ||
		!strings.Contains(err.Error(), "raise -maxfn to at least 0.181 (the third-lowest run's Fn)") || strings.Contains(err.Error(), "ship:") {
		t.Errorf("got %v", err)
	}
	if out.Len() != 0 {
		t.Errorf("printed before the usage error: %q", out.String())
	}
	if err := run(io.Discard, []string{"-plot=false", "-maxfn", "0.181"}); err != nil {
		t.Errorf("-maxfn 0.181: %v", err)
	}
	var help bytes.Buffer
	if err := run(&help, []string{"-h"}); !errors.Is(err, flag.ErrHelp) || !strings.Contains(help.String(), "(0.181 or more with these runs)") ||
		!strings.Contains(help.String(), "a -maxfn that leaves fewer than 3 runs") {
		t.Errorf("-h does not say how low -maxfn may go: %v", err)
	}
}

// TestChokedRunsMarked: in a 1 m × 0.5 m tank m = 0.03/0.5 = 0.06, the
// choking Fh = x^(3/2) with x = 2·cos((arccos(m − 1) − 2π)/3) is 0.70578,
// i.e. 0.70578·√(9.80665·0.5) = 1.563 m/s; the runs at 1.60 m/s (Fh =
// 1.6/2.2144 = 0.7226), 2.00 and 2.40 m/s are choked. Their rows say so,
// the fix is named once, and the report goes on to its caution.
func TestChokedRunsMarked(t *testing.T) {
	var out bytes.Buffer
	o, err := evaluate(&out, []string{"-plot=false", "-width", "1", "-depth", "0.5"})
	if err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, w := range []string{"  1.60  0.723   choked: ", "  2.00  0.903   choked: ", "  2.40  1.084   choked: ", "choking value 0.7058 (1.56 m/s)",
		"3 of the 8 runs are at or above the choking speed 1.56 m/s of this tank: a wider or deeper tank (-width, -depth) raises it"} {
		if !strings.Contains(s, w) {
			t.Errorf("report lacks %q", w)
		}
	}
	if n := strings.Count(s, "wider or deeper tank"); n != 1 {
		t.Errorf("the fix is named %d times, want once", n)
	}
	if !strings.Contains(s, "CAUTION: Full-scale resistance") || len(o.Blocked.Points) != 5 || !o.Choked[5] || o.Choked[4] {
		t.Errorf("the report stopped, or the choked runs are wrong: %v", o.Choked)
	}
}

// TestOutRefusedFirst: an -out that does not exist is a usage error
// naming -out, before the report is printed.
func TestOutRefusedFirst(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-out", "/nonexistent/dir"})
	var ce *cli.Error
	if !errors.As(err, &ce) || !strings.Contains(err.Error(), `-out "/nonexistent/dir": the directory does not exist; create it or pass another`) || out.Len() != 0 {
		t.Errorf("got %v after printing %d bytes", err, out.Len())
	}
}

// TestSmallShipFigures: at 1:4 the resistances and powers keep four
// significant figures, each column in the unit its largest value calls
// for (R_s in N up to 2336 N, P_E in kW up to 11.21 kW). The top run
// with the form factor: R = 2336 N (the line below the table) at V_s =
// 2.40·√4 = 4.80 m/s, so P_E = 2336·4.80 = 11.21 kW; the slowest run's
// ship speed is 0.50·2 = 1.00 m/s, so its P_E in W equals its R_s in N
// (57.99 N, 0.05799 kW).
func TestSmallShipFigures(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-plot=false", "-scale", "4", "-sea", "0", "-tank", "35"}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, w := range []string{"|     7.608      2336     11.21\n", "|     4.353     57.99   0.05799\n", "R = 2336 N, P_E = 11.21 kW", "R_s N    P_E kW |"} {
		if !strings.Contains(s, w) {
			t.Errorf("report lacks %q", w)
		}
	}
	// The ITTC-1978 and speed–power tables: no power rounded to a whole
	// kilowatt (P_D at 4 kn is about 1.0 kW).
	if strings.Contains(s, "   1       1 … 1  ") || !strings.Contains(s, "   1.039  1.032 … 1.047") {
		t.Errorf("speed–power table without significant figures:\n%s", s)
	}
	out.Reset()
	if _, err := evaluate(&out, []string{"-plot=false", "-scale", "50"}); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(out.String(), "propeller D = 4.219 m,") { // 84.375 mm × 50 = 4.21875 m
		t.Errorf("propeller diameter not to four figures")
	}
}

// TestFiguresInPrefixedUnits: forces and powers carry the SI prefix
// their size calls for, each table column in one unit named in its
// header. By hand at 1:100 the top run with the form factor has
// C_Ts = 6.074×10⁻³ on S_s = 1.62·100² = 16 200 m² at V_s = 2.40·10 =
// 24 m/s in sea water of 1025.97 kg/m³: R = 6.074e-3·½·1025.97·24²·
// 16 200 = 2.9075×10⁷ N = 29.08 MN and P_E = R·V = 697.8 MW. At 1:2 the
// ship's P_D at 3 kn is 124.1 W, its R_TS 40.12 N, in columns of N and W.
func TestFiguresInPrefixedUnits(t *testing.T) {
	r := 6.074e-3 * 0.5 * 1025.97 * 24 * 24 * 16200
	if math.Abs(r/29.08e6-1) > 5e-4 || math.Abs(r*24/697.8e6-1) > 5e-4 {
		t.Fatalf("by hand R = %v N, P_E = %v W", r, r*24)
	}
	for _, c := range []struct {
		scale string
		want  []string
	}{
		{"100", []string{
			"at the top speed, with the form factor: R = 29.08 MN, P_E = 697.8 MW\n",
			"C_Ts×10³    R_s MN    P_E MW |  C_Ts×10³    R_s MN    P_E MW\n",
			"|     6.074     29.08     697.8\n",
			"R_s = 29.08 MN, u_c = 0.12 MN",
			"R_TS MN  P_E MW", "P_D MW\n", "   1052\n",
			"P_D MW    P_D 95 % MW", "1052    1039 … 1064",
		}},
		{"2", []string{
			"R_TS N  P_E W", "P_D W\n", "5.067   40.12  61.92", "  124.1\n",
			"P_D W     P_D 95 % W", "124.1  123.2 … 124.9",
		}},
	} {
		var out bytes.Buffer
		if _, err := evaluate(&out, []string{"-plot=false", "-scale", c.scale}); err != nil {
			t.Fatal(err)
		}
		s := out.String()
		for _, w := range c.want {
			if !strings.Contains(s, w) {
				t.Errorf("-scale %s: report lacks %q", c.scale, w)
			}
		}
		for _, not := range []string{"e+04 kN", "e+05 kW", "0.1241", "29076", "1051866"} {
			if strings.Contains(s, not) {
				t.Errorf("-scale %s: report has %q", c.scale, not)
			}
		}
	}
}

// TestTankTemperatureRemakesReadings: -tank re-makes the invented
// readings for the tank's water, holding each run's wave part, so the
// form factors do not drift with the temperature (they moved from 1.028
// at 1 °C to 1.253 at 35 °C while the readings in N stayed fixed). By
// hand, the top run (2.40 m/s) recorded 38.10 N at 15 °C (ρ = 999.1026
// kg/m³, ν = 1.1385e-3/999.1026 m²/s): C_TM = 38.10/(½·999.1026·2.4²·
// 1.62) = 8.1735×10⁻³, Re = 2.4·2/ν = 4.2123×10⁶, C_F = 0.075/(log₁₀Re
// − 2)² = 3.5069×10⁻³, C_W = C_TM − 1.13·C_F = 4.2106×10⁻³; at 35 °C in
// the tank's water the report prints, C_TM = C_W + 1.13·C_F(2.4·2/ν₃₅)
// and R = C_TM·½ρ₃₅·2.4²·1.62 = 36.433 N.
func TestTankTemperatureRemakesReadings(t *testing.T) {
	cf := func(re float64) float64 { return 0.075 / math.Pow(math.Log10(re)-2, 2) }
	nu15 := 1.1385e-3 / 999.1026
	ct15 := 38.10 / (0.5 * 999.1026 * 2.4 * 2.4 * 1.62)
	cw := ct15 - 1.13*cf(4.8/nu15)
	if math.Abs(ct15-8.1735e-3) > 1e-7 || math.Abs(cf(4.8/nu15)-3.5069e-3) > 1e-7 || math.Abs(cw-4.2106e-3) > 1e-7 {
		t.Fatalf("by hand C_TM %v, C_F %v, C_W %v", ct15, cf(4.8/nu15), cw)
	}
	form := map[string][2]float64{}
	top := map[string]float64{}
	for _, tank := range []string{"1", "15", "25", "35"} {
		var out bytes.Buffer
		o, err := evaluate(&out, []string{"-plot=false", "-tank", tank})
		if err != nil {
			t.Fatal(err)
		}
		form[tank] = [2]float64{o.Form.FormFactor, o.DoubleBody.FormFactor}
		top[tank] = o.WithForm.Points[7].ShipResistance.Value()
		s := out.String()
		if tank == "15" {
			if !slices.Equal(o.Readings.Resistances, resistances) || !slices.Equal(o.Readings.DoubleBody, dbResistances) || !slices.Equal(o.Readings.OpenWater, owRuns) ||
				!strings.Contains(s, "readings: the invented record, taken in the tank at 15 °C\n") {
				t.Errorf("at 15 °C the readings are not the record: %v", o.Readings)
			}
			continue
		}
		if !strings.Contains(s, "readings: re-made for "+tank+" °C from the invented record taken at 15 °C, each resistance run holding its C_W = C_Tm − 1.13·C_Fm") {
			t.Errorf("-tank %s: the report does not say the readings are re-made", tank)
		}
		if tank == "35" {
			rho, nu := o.Plain.Test.Tank.Density.Value(), o.Plain.Test.Tank.KinematicViscosity.Value()
			if math.Abs(rho-994.03) > 0.005 || math.Abs(nu/7.2344e-7-1) > 1e-4 {
				t.Errorf("35 °C water ρ %v ν %v, the report prints 994.03 and 7.2344e-07", rho, nu)
			}
			r := (cw + 1.13*cf(4.8/nu)) * 0.5 * rho * 2.4 * 2.4 * 1.62
			if math.Abs(r-36.433) > 0.0006 || math.Abs(o.Readings.Resistances[7]-r) > 0.0006 || !strings.Contains(s, "  2.40  0.542   36.433 ") {
				t.Errorf("35 °C top reading %v, by hand %v", o.Readings.Resistances[7], r)
			}
		}
	}
	for tank, f := range form {
		if math.Abs(f[0]-form["15"][0]) > 0.003 || math.Abs(f[1]-form["15"][1]) > 0.002 {
			t.Errorf("-tank %s: 1 + k = %.4f (Prohaska), %.4f (double body); at 15 °C %.4f, %.4f", tank, f[0], f[1], form["15"][0], form["15"][1])
		}
	}
	// The sea stays at 15 °C: the ship with the form factor hardly moves.
	if math.Abs(top["25"]/top["15"]-1) > 0.002 {
		t.Errorf("top-speed ship resistance at -tank 25 %v, at 15 %v", top["25"], top["15"])
	}
}
