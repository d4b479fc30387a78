package main

import (
	"bytes"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
)

// TestOpenWaterByHand reduces the first open-water run by hand, with the
// tank's density ρ the example reports: V_A = 0.380 m/s, n = 45 rev/s,
// D = 1.35/16 = 0.084375 m, T = 38.13 N, Q = 0.4515 N·m:
//
//	J    = 0.380/(45·0.084375) = 0.380/3.796875 = 0.100082
//	K_T  = 38.13/(ρ·45²·0.084375⁴)  ≈ 0.3719 (ρ = 999.10)
//	10K_Q = 10·0.4515/(ρ·45²·0.084375⁵) ≈ 0.5219
//	η₀   = J·K_T/(2π·K_Q) ≈ 0.1001·0.3719/(2π·0.05219) ≈ 0.114
//	Re_0.7 = (0.45/16)·√(0.380² + (0.7π·45·0.084375)²)/ν ≈ 2.06×10⁵
func TestOpenWaterByHand(t *testing.T) {
	var out bytes.Buffer
	o, err := evaluate(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	ow := o.Powering.OpenWater
	tank := o.Plain.Test.Tank
	rho, nu := tank.Density.Value(), tank.KinematicViscosity.Value()
	d := 1.35 / 16
	p := ow.Points[0]
	j := 0.380 / (45 * d)
	kt := 38.13 / (rho * 45 * 45 * math.Pow(d, 4))
	kq := 0.4515 / (rho * 45 * 45 * math.Pow(d, 5))
	re := 0.45 / 16 * math.Hypot(0.380, 0.7*math.Pi*45*d) / nu
	got := []float64{p.J, p.KT, p.KQ, p.Eta0, p.Reynolds}
	want := []float64{j, kt, kq, j * kt / (2 * math.Pi * kq), re}
	for i := range got {
		if math.Abs(got[i]/want[i]-1) > 1e-12 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	if math.Abs(j-0.100082) > 1e-6 || math.Abs(kt-0.3719) > 1e-4 || math.Abs(10*kq-0.5219) > 1e-4 || math.Abs(re/2.06e5-1) > 0.005 {
		t.Errorf("by hand: J %v, K_T %v, 10K_Q %v, Re %v", j, kt, 10*kq, re)
	}
	for _, want := range []string{
		"   0.380    38.13    0.4515 |  0.100  0.3719  0.5219  0.114  2.06e+05",
		"faired K_T = 0.40041(±0.00100) − 0.28161(±0.00416)·J − 0.09872(±0.00368)·J²;",
		"order 2 chosen by next term not significant at 5 %",
		"above the usual minimum 2e+05",
		"towingtank-openwater.png",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestSelfPropulsionByHand analyses the top self-propulsion run
// (V_M = 2.40 m/s, n = 42.80 rev/s, T = 17.647 N per propeller,
// Q = 0.28015 N·m, F_D = 5.20 N, two propellers) by hand from the faired
// curves: K_TM = T/(ρn²D⁴); J_TM where the faired K_T equals it;
// w_TM = 1 − J_TM·nD/V_M; t = (2T + F_D − R_TM)/(2T) with R_TM from the
// faired C_TM; η_R = K_Q0(J_TM)/K_QM. And F_D by the formula
// ½ρV²S[(1 + k)(C_FM − C_FS) − ΔC_F − C_A] at 2.4 m/s.
func TestSelfPropulsionByHand(t *testing.T) {
	o, err := evaluate(&bytes.Buffer{}, []string{"-plot=false"})
	if err != nil {
		t.Fatal(err)
	}
	pw := o.Powering
	tank, sea := o.Plain.Test.Tank, o.Plain.Test.Sea
	rho, nu, nuS := tank.Density.Value(), tank.KinematicViscosity.Value(), sea.KinematicViscosity.Value()
	r := pw.Runs[4]
	d, v, n, th, qq, fd := 1.35/16, r.V, r.N, r.T, r.Q, r.FD
	// The readings made for 1:16 are those of the invented test: n, T, Q
	// and F_D as the carriage recorded them.
	if v != 2.40 || math.Abs(n-42.80) > 0.005 || math.Abs(th-17.647) > 0.002 || math.Abs(qq-0.28015) > 2e-5 || fd != 5.20 {
		t.Errorf("run 5 readings %+v, want about 2.40 m/s, 42.80 rev/s, 17.647 N, 0.28015 N·m, 5.20 N", r)
	}
	ktm := th / (rho * n * n * math.Pow(d, 4))
	kqm := qq / (rho * n * n * math.Pow(d, 5))
	// J_TM by bisection on the faired K_T, written out.
	lo, hi := pw.OpenWater.JMin, pw.OpenWater.JMax
	for range 100 {
		m := (lo + hi) / 2
		if pw.OpenWater.KT.Eval(m) > ktm {
			lo = m
		} else {
			hi = m
		}
	}
	j := (lo + hi) / 2
	rq, _, err := pw.Resistance.At(q.New(v, q.Velocity))
	if err != nil {
		t.Fatal(err)
	}
	w := 1 - j*n*d/v
	tt := (2*th + fd - rq.Value()) / (2 * th)
	er := pw.OpenWater.KQ.Eval(j) / kqm
	p := pw.SpeedPower.Factors[4]
	got := []float64{p.KT, p.KQ, p.J, p.Wake, p.ThrustDeduction, p.RelativeRotative}
	want := []float64{ktm, kqm, j, w, tt, er}
	for i := range got {
		if math.Abs(got[i]-want[i]) > 1e-9 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	// R_TM is near the measured 38.10 N at 2.4 m/s, and t near 0.069.
	if math.Abs(rq.Value()-38.10) > 0.2 || math.Abs(tt-0.069) > 0.002 {
		t.Errorf("R_TM = %v, t = %v", rq.Value(), tt)
	}
	k1 := o.DoubleBody.FormFactor
	cf := func(re float64) float64 { x := math.Log10(re) - 2; return 0.075 / (x * x) }
	res := v * 4 * 32 / nuS
	dcf := 0.044*(math.Cbrt(150e-6/32)-10*math.Pow(res, -1.0/3)) + 0.000125
	ca := (5.68 - 0.6*math.Log10(res)) * 1e-3
	fdh := 0.5 * rho * v * v * 1.62 * (k1*(cf(v*2/nu)-cf(res)) - dcf - ca)
	if got := pw.SkinFriction[4].Force.Value(); math.Abs(got-fdh) > 1e-9*fdh || math.Abs(fdh-5.20) > 0.005 {
		t.Errorf("F_D = %v N, by hand %v N, applied 5.20 N", got, fdh)
	}
}

// TestSpeedPowerBand: every speed's P_D lies inside its band, the band
// is symmetric, K·u wide on each side with K ≥ 1.96, and below 2 % of
// P_D for these fits; P_D rises with speed.
func TestSpeedPowerBand(t *testing.T) {
	var out bytes.Buffer
	o, err := evaluate(&out, []string{"-plot=false"})
	if err != nil {
		t.Fatal(err)
	}
	prev := 0.0
	for i, p := range o.Powering.SpeedPower.Points {
		pd := p.DeliveredPower.Value()
		lo, hi := pd-p.Power[0], p.Power[1]-pd
		if !(p.PowerU > 0) || math.Abs(lo-hi) > 1e-9*pd || !(hi >= 1.96*p.PowerU) || !(hi < 0.02*pd) || !(pd > prev) {
			t.Errorf("speed %d: P_D %v, band %v, u %v", i, pd, p.Power, p.PowerU)
		}
		prev = pd
	}
	for _, want := range []string{"Speed–power prediction, ITTC-1978", "P_D 95 % kW", "band from the fits alone", "18.00    1161", "WARNING (fits): the run at V_M = 1.3 m/s has an externally studentised residual of 4.41 from the faired t (its residual 0.00529 is 1.66 times the fit's residual standard deviation S = 0.0032"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestFairedPolynomialReads: the faired curves print as sums with their
// operators (no J^0, no juxtaposed terms), and each S has two
// significant figures, trailing zero kept (0.0010 beside 0.00085).
func TestFairedPolynomialReads(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-plot=false"}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, want := range []string{
		"faired K_T = 0.40041(±0.00100) − 0.28161(±0.00416)·J − 0.09872(±0.00368)·J²; order 2",
		"faired 10K_Q = 0.54893(±0.00117) − 0.24601(±0.00489)·J − 0.12292(±0.00433)·J²; order 2",
		"S = 0.00085, 10 runs", "S = 0.0010, 10 runs",
		"η_R faired against V_M: order 0 (order 0 chosen by next term not significant at 5 % among orders 0 … 2), S = 0.0010\n",
		"residual standard deviation S = 0.0010; an outlier",
	} {
		if !strings.Contains(s, want) {
			t.Errorf("output lacks %q", want)
		}
	}
	for _, not := range []string{"J^", ")·J^0", "S = 0.001,", "S = 0.001\n", "S = 0.001;"} {
		if strings.Contains(s, not) {
			t.Errorf("output has %q", not)
		}
	}
	// A negative constant and higher powers: −1 + 2J − 3J³ + 0.5J⁴ (×10).
	got := polyText([]float64{-0.1, 0.2, 0, -0.3, 0.05}, []float64{0.01, 0.02, 0.03, 0.04, 0.005}, 10)
	if want := "−1.00000(±0.10000) + 2.00000(±0.20000)·J + 0.00000(±0.30000)·J² − 3.00000(±0.40000)·J³ + 0.50000(±0.05000)·J⁴"; got != want {
		t.Errorf("polyText = %q, want %q", got, want)
	}
}

// TestNegativeCorrelationAllowanceWarned: at 1:100 the ship is 200 m
// long and its top speed 45 kn = 23.15 m/s, so by hand Re_S =
// 23.15·200/1.1902e-6 = 3.89×10⁹ (ν of sea water at 15 °C as the report
// prints it) and the procedure's C_A = (5.68 − 0.6·log₁₀3.89e9)·10⁻³ =
// (5.68 − 5.754)·10⁻³ = −0.074×10⁻³: warned about like a negative ΔC_F.
func TestNegativeCorrelationAllowanceWarned(t *testing.T) {
	var out bytes.Buffer
	o, err := evaluate(&out, []string{"-scale", "100", "-plot=false"})
	if err != nil {
		t.Fatal(err)
	}
	top := o.Powering.Points[len(o.Powering.Points)-1]
	re := 45 * 1852.0 / 3600 * 200 / 1.1902e-6
	if ca := (5.68 - 0.6*math.Log10(re)) * 1e-3; math.Abs(top.CorrelationAllowance-ca) > 2e-7 || math.Abs(ca*1e3+0.074) > 0.001 {
		t.Errorf("C_A = %v, by hand %v", top.CorrelationAllowance, ca)
	}
	for _, want := range []string{
		"(-0.074×10⁻³ at the top speed, negative: the formula used beyond its range, see the WARNING below the table)",
		"WARNING (45.00 kn): the correlation allowance C_A = -0.074×10⁻³ from the procedure's formula (5.68 − 0.6·log₁₀Re_S)·10⁻³ is negative",
		"the ship Reynolds number Re_S = 3.89e+09 is above 2.93e+09, where the formula changes sign, so it is used beyond its range (L = 200 m)",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}
