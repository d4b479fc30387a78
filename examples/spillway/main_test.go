package main

import (
	"bytes"
	"errors"
	"flag"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/similarity/fluids"
)

func TestRuns(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, noPlot); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "λ_L^(5/2)", "CAUTION", "distorted"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-scale", "1"}); err == nil {
		t.Error("-scale 1 accepted")
	}
}

// TestByHand: Froude scaling at 1:30 (common practice): Q_m = 450/30^2.5
// m³/s = 91.29 L/s; times ×√30 and pressures ×30 at full scale; the
// distorted 1:120/1:30 model has λ_V = 30^-½, λ_Q = 1/(120·30^1.5).
func TestByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	if want := 450 / math.Pow(30, 2.5); math.Abs(r.ModelDischarge/want-1) > 1e-12 {
		t.Errorf("Q_m = %v, want %v", r.ModelDischarge, want)
	}
	if math.Abs(r.ProtoTimes.At(3).Value()-3*0.05*math.Sqrt(30)) > 1e-12 {
		t.Errorf("t_p[3] = %v", r.ProtoTimes.At(3))
	}
	if math.Abs(r.ProtoPressure.At(4).Value()-4200*30) > 1e-8 {
		t.Errorf("p_p[4] = %v", r.ProtoPressure.At(4))
	}
	if math.Abs(r.ForceRatio-math.Pow(30, -3)) > 1e-18 {
		t.Errorf("λ_F = %v", r.ForceRatio)
	}
	d := r.Distorted
	if math.Abs(d.Velocity-1/math.Sqrt(30)) > 1e-15 || math.Abs(d.Discharge*120*math.Pow(30, 1.5)-1) > 1e-12 {
		t.Errorf("distorted: %+v", d)
	}
}

// TestHelp: -h prints the usage and is not an error for main.
func TestHelp(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-h"})
	if !errors.Is(err, flag.ErrHelp) || !strings.Contains(out.String(), "Usage") {
		t.Errorf("-h: %v, %q", err, out.String())
	}
}

// TestScaleChecksByHand: the crest checks take the model head from the
// model's own measurements and one crest velocity, V = (g·q)^(1/3) with
// q = Q/b (b = 0.76 m), as the rating table does.
//
// Design: Q_m = 450/30^2.5 = 91.287 L/s lies in the fitted rating's
// range, so h = (Q/C)^(1/n) from the fit (C = 1.9641, n = 1.5612 printed:
// h = 0.1401 m). Low flow: Q_m = 9.1287 L/s lies below it, between the
// measured points (0.030 m, 7.38 L/s) and (0.045 m, 14.38 L/s); log–log
// h = 0.030·1.5^(ln(9.1287/7.38)/ln(14.38/7.38)) = 0.030·1.5^0.31886 =
// 0.03414 m. There q = 0.012011 m²/s, V = (9.80665·0.012011)^(1/3) =
// 0.4903 m/s, and with ρ, ν and σ at 15 °C (IAPWS) We = ρV²h/σ ≈ 112:
// passes (the old invented head of 0.0302 m and V = √(g·⅔h) gave 80.9,
// a fail the measurements contradict); the 7 cm head limit still fails.
// The crest radius is 0.9/30 = 0.03 m, above the published 0.01 m. The
// distorted reach needs grains of (1/30)²/(1/120) = 0.1333 of the
// prototype's.
func TestScaleChecksByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	wat, _ := fluids.FreshWater().AtCelsius(15)
	sig, _ := fluids.SurfaceTension(wat.Temperature)
	qd := 450 / math.Pow(30, 2.5)
	hd := math.Pow(qd/r.Rating.C, 1/r.Rating.N)
	hl := 0.030 * math.Pow(1.5, math.Log(qd/10/7.38e-3)/math.Log(14.38/7.38))
	if math.Abs(hd-0.1401) > 5e-5 || math.Abs(hl-0.03414) > 5e-6 {
		t.Fatalf("hand heads %v, %v", hd, hl)
	}
	for i, c := range []struct{ q, h float64 }{{qd, hd}, {qd / 10, hl}} {
		v := math.Cbrt(9.80665 * c.q / 0.76)
		re := v * c.h / wat.KinematicViscosity.Value()
		we := wat.Density.Value() * v * v * c.h / sig.Value()
		ck := r.Checks[i]
		if math.Abs(r.CrestHeads[i]/c.h-1) > 1e-12 || math.Abs(ck[0].Value-re) > 1e-9*re || math.Abs(ck[1].Value-we) > 1e-9*we || math.Abs(ck[2].Value-c.h) > 1e-15 {
			t.Errorf("case %d: h %v, %v; by hand Re %v, We %v, h %v", i, r.CrestHeads[i], ck, re, we, c.h)
		}
	}
	if we := r.Checks[1][1].Value; math.Abs(we-112) > 1 {
		t.Errorf("low-flow We = %v, want about 112", we)
	}
	if !r.Checks[0][1].Pass || !r.Checks[1][1].Pass || r.Checks[1][2].Pass {
		t.Errorf("verdicts %v", r.Checks)
	}
	// One definition of V: the crest check's V at a measured discharge
	// is the rating table's V of that point.
	if v, p := criticalVelocity(r.Rating.Points[0].Discharge), r.Rating.Points[0].Velocity; v != p {
		t.Errorf("crest V %v, rating V %v", v, p)
	}
	for _, want := range []string{
		"low flow, a tenth of it: model Q = 9.129 L/s, q = 0.0120 m²/s, critical velocity V = 0.4902 m/s, y_c = 0.0245 m",
		"model head h = 0.0341 m: interpolated log–log between the measured points 0 (h = 0.030 m, Q = 7.38 L/s) and 1 (h = 0.045 m, Q = 14.38 L/s)",
		"We = ρV²h/σ = 112 (limit ≥ 100, common practice): passes",
		"model head h = 0.140 m: the fitted model rating inverted, h = (Q/C)^(1/n), within its range 0.075 … 0.180 m",
		"V = (g·q)^(1/3) is the critical velocity for the unit discharge q = Q/b",
		"V, Re and We are defined as at the crest",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	for _, bad := range []string{"√(g·⅔h)", "y_c = ⅔h", "limits as at the crest above"} {
		if strings.Contains(out.String(), bad) {
			t.Errorf("output still has %q", bad)
		}
	}
	if rc := r.CrestRadius; math.Abs(rc.Value-0.03) > 1e-15 || rc.Limit != 0.01 || !rc.Pass {
		t.Errorf("crest radius check %v", rc)
	}
	if math.Abs(r.Sediment.Grain-120.0/900) > 1e-15 {
		t.Errorf("grain ratio %v", r.Sediment.Grain)
	}
}

// TestReportWording: the pressure peak carries its caution (10 samples
// over 9·0.05·√30 = 2.46 s at full scale; 20 Hz in the model is
// 20/√30 = 3.65 Hz at full scale); u_rel is said to be a standard
// uncertainty (0.50 % at h_p = 2.25 m, the band's half-width 1.2 % over
// t = 2.447 for 6 degrees of freedom); one rounding per quantity.
func TestReportWording(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, noPlot); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, want := range []string{
		"peak 132.3 kPa(g): the highest of 10 samples over 2.5 s at prototype scale, NOT a design extreme",
		"the sampling rate (20 Hz in the model, 3.65 Hz at",
		"transducer's response (bandwidth, tubing), which were not scaled",
		"u_rel is the standard uncertainty (k = 1) of the curve as a fraction of Q_p; the band is Q_p·exp(±t·u_rel), t = 2.447 (Student, 6 degrees of freedom, 95 %)",
		"u_rel (k = 1)",
		"      2.25      169.7       167.7 … 171.8              0.50 %",
		"needs a model n of 0.00794)",
		"model Manning n = 0.00794",
		"n in [1.5398, 1.5826]",
		"the exponent's interval [1.5398, 1.5826] excludes 3/2",
		"velocity   λ_L^(1/2)    1:5.4772",
		"velocity 1:5.4772, time 1:21.909",
		"0.030      7.38  0.6330   0.457  1.20e+04    85.1",
		"0.105     57.74  0.7563   0.907  8.35e+04    1170",
	} {
		if !strings.Contains(s, want) {
			t.Errorf("output lacks %q", want)
		}
	}
	for _, bad := range []string{"model n of 0.0079)", "[1.54, 1.583]", "1:5.477,", " 1.2e+04 ", "1.17e+03"} {
		if strings.Contains(s, bad) {
			t.Errorf("output still has %q", bad)
		}
	}
}

// TestCrestHeadSource: the crest head says where it comes from in each
// case. At -q 2000 the model discharge 2000/30^2.5 = 0.4057 m³/s is
// beyond the largest measured 0.13467 m³/s: the inverted rating is an
// extrapolation and is marked so; at -q 30 the low flow, 0.6086 L/s, is
// below every measurement, and is marked so too.
func TestCrestHeadSource(t *testing.T) {
	for _, c := range []struct {
		q    string
		want string
	}{
		{"2000", "design discharge: model Q = 405.7 L/s"},
		{"30", "low flow, a tenth of it: model Q = 0.6086 L/s"},
	} {
		var out bytes.Buffer
		if err := run(&out, append([]string{"-q", c.q}, noPlot...)); err != nil {
			t.Fatal(err)
		}
		s := out.String()
		i := strings.Index(s, c.want)
		if i < 0 {
			t.Fatalf("-q %s: output lacks %q", c.q, c.want)
		}
		line := strings.SplitN(s[i:], "\n", 3)[1]
		if !strings.Contains(line, "model head h = ") || !strings.Contains(line, "EXTRAPOLATED: the fitted model rating inverted beyond every measurement") {
			t.Errorf("-q %s: %q", c.q, line)
		}
	}
}

// TestSmallDischargeFigures: at -q 0.1 m³/s the model discharges are
// printed with significant figures, none as 0.00: λ_Q = 30^-2.5 =
// 1/4929.5, so 0.1/4929.5 m³/s = 0.02029 L/s, a tenth of it 0.002029 L/s;
// the distorted model's λ_Q = 1/(120·30^1.5) = 1/19718, so 0.1/19718 m³/s
// = 0.005072 L/s.
func TestSmallDischargeFigures(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-out", "", "-q", "0.1"}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, w := range []string{"design discharge 0.1 m³/s → model 0.02029 L/s", "design discharge: model Q = 0.02029 L/s",
		"low flow, a tenth of it: model Q = 0.002029 L/s", "design discharge in the distorted model: 0.005072 L/s"} {
		if !strings.Contains(s, w) {
			t.Errorf("report lacks %q", w)
		}
	}
	if strings.Contains(s, "0.00 L/s") {
		t.Error("a discharge printed as 0.00 L/s")
	}
}
