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
	"similis.dev/similis/similarity/fluids"
)

func TestRuns(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "gpm", "kW", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-np", "0"}); err == nil {
		t.Error("-np 0 accepted")
	}
}

// TestByHand carries the 800 gpm point: Q_p = 800·(1180/1750)·2.4³ gpm,
// H_p = 96·(1180/1750)²·2.4² ft (common practice affinity laws), η_p =
// 1 − 0.165·(1/2.4)^0.2 (Moody at the best-efficiency point, 83.5 %), and
// shaft power ρgQH/η with 1 gpm = 6.30901964e-5 m³/s and 1 ft = 0.3048 m
// exactly and ρ the prototype's water at 30 °C (995.65 kg/m³, the same
// water as its Reynolds number and suction pressure), not 998.2 at 20 °C:
// at 200 gpm, 118 ft and 54.65 % the prototype takes 197.9 kW (198.4 kW
// at 998.2 kg/m³). The 200 gpm part-load point gains the same 2.65 points as the
// best-efficiency point, not the 7.7 Moody's formula would give it alone.
func TestByHand(t *testing.T) {
	var out bytes.Buffer
	rows, err := evaluate(&out, nil)
	if err != nil {
		t.Fatal(err)
	}
	w30, _ := fluids.FreshWater().AtCelsius(30)
	if math.Abs(w30.Density.Value()-995.65) > 0.005 {
		t.Fatalf("water at 30 °C %v kg/m³", w30.Density)
	}
	r := rows[3]
	n, d := 1180.0/1750, 2.4
	qp := 800 * n * d * d * d * 6.30901964e-5
	hp := 96 * n * n * d * d * 0.3048
	eta := 1 - 0.165*math.Pow(1/2.4, 0.2)
	pp := w30.Density.Value() * 9.80665 * qp * hp / eta
	got := []float64{r.ProtoQ.Value(), r.ProtoH.Value(), r.ProtoEta, r.ProtoP.Value()}
	want := []float64{qp, hp, eta, pp}
	for i := range got {
		if math.Abs(got[i]/want[i]-1) > 1e-12 {
			t.Errorf("quantity %d: %v, by hand %v", i, got[i], want[i])
		}
	}
	gain := 0.165 * (1 - math.Pow(1/2.4, 0.2)) // 0.0265026
	if math.Abs(gain-0.0265026) > 1e-6 {
		t.Fatalf("hand gain %v", gain)
	}
	q0 := 200 * n * d * d * d * 6.30901964e-5
	h0 := 118 * n * n * d * d * 0.3048
	p0 := 995.65 * 9.80665 * q0 * h0 / (0.52 + gain) // 197.9 kW
	if math.Abs(rows[0].ProtoP.Value()/p0-1) > 1e-5 || !strings.Contains(out.String(), "94.19     197.9\n") ||
		!strings.Contains(out.String(), "prototype ρ = 995.65 kg/m³ (30 °C)") {
		t.Errorf("first point P_p = %v W, by hand %.1f kW at 995.65 kg/m³", rows[0].ProtoP, p0/1e3)
	}
	for i, m := range []float64{0.52, 0.71, 0.80, 0.835, 0.81, 0.72} {
		if math.Abs(rows[i].ProtoEta-(m+gain)) > 1e-12 {
			t.Errorf("point %d: η_p = %v, want %v + %v", i, rows[i].ProtoEta, m, gain)
		}
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

// TestSuctionByHand: at the BEP (800 gpm, 96 ft, 1750 rpm) N_s =
// 1750·√800/96^0.75 = 1614; Re = D·(πDn/60)/ν for 10 in at 1750 rpm in
// water at 20 °C and 24 in at 1180 rpm at 30 °C, with the package's own
// water viscosities; σ = 12/96 = 0.125; prototype NPSH3 = 0.125·H_p with
// H_p = 96 ft/(N²D² ratio); and p = p_v(30 °C) + ρg(NPSH3 − V²/(2g)) with
// V = Q_p/(π·d²/4) at the BEP: Q_p = 800 gpm·(1180/1750)·(24/10)³ =
// 7457 gpm = 0.4705 m³/s through the default bore d = 6 in·24/10 =
// 14.4 in = 0.36576 m, V = 4.478 m/s (p_v from IAPWS-IF97: 4246.69 Pa,
// python3-iapws).
func TestSuctionByHand(t *testing.T) {
	_, s, err := evaluateAll(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if ns := 1750 * math.Sqrt(800) / math.Pow(96, 0.75); math.Abs(s.SpecificSpeed.US-ns) > 1e-6*ns {
		t.Errorf("N_s = %v, by hand %v", s.SpecificSpeed.US, ns)
	}
	w20, _ := fluids.FreshWater().AtCelsius(20)
	w30, _ := fluids.FreshWater().AtCelsius(30)
	dm, dp := 10*0.0254, 24*0.0254
	rem := dm * (math.Pi * dm * 1750 / 60) / w20.KinematicViscosity.Value()
	rep := dp * (math.Pi * dp * 1180 / 60) / w30.KinematicViscosity.Value()
	if math.Abs(s.ReModel-rem) > 1e-9*rem || math.Abs(s.ReProto-rep) > 1e-9*rep {
		t.Errorf("Re %v, %v; by hand %v, %v", s.ReModel, s.ReProto, rem, rep)
	}
	if s.Sigma != 0.125 {
		t.Errorf("σ = %v, want 12/96", s.Sigma)
	}
	hp := 96 * 0.3048 / math.Pow(1750.0/1180, 2) / math.Pow(10.0/24, 2)
	npsh := 0.125 * hp
	if math.Abs(s.ProtoNPSH3.Value()-npsh) > 1e-9*npsh {
		t.Errorf("prototype NPSH3 %v m, by hand %v", s.ProtoNPSH3.Value(), npsh)
	}
	qp := 800 * 3.785411784e-3 / 60 * (1180.0 / 1750) * math.Pow(24.0/10, 3)
	d := 14.4 * 0.0254
	v := qp / (math.Pi / 4 * d * d)
	if math.Abs(v-4.478) > 0.001 || math.Abs(s.FlangeVelocity-v) > 1e-9*v {
		t.Errorf("flange velocity %v m/s, by hand %v (about 4.478)", s.FlangeVelocity, v)
	}
	p := 4246.69 + w30.Density.Value()*9.80665*(npsh-v*v/(2*9.80665))
	if math.Abs(s.ProtoSuction.Value()-p) > 0.01 {
		t.Errorf("suction pressure %v Pa, by hand %v", s.ProtoSuction.Value(), p)
	}
	if !(s.IECGain > 0 && s.Ackeret > 0.835 && s.IEC > 0.835) {
		t.Errorf("step-ups %+v", s)
	}
}

// TestNPSHBudgetByHand: the model's NPSH3 from the invented readings,
// (−66 680 + 101 000 − p_v)/(ρg) + V²/(2g), V = 800 gpm/(π/4·0.1524²),
// with p_v(20 °C) = 2339.21 Pa (IAPWS-IF97, python3-iapws) and ρ the
// package's fresh water at 20 °C; u_c by hand as the root sum of squares
// of 150 Pa/(ρg), 50 Pa/(ρg), 2·(V²/2g)·0.5 %, 0.04 m and the
// thermometer's 0.2 K through central differences of p_v and ρ; the
// prototype's NPSH3 and u_c are the model's times H_p/H_m.
func TestNPSHBudgetByHand(t *testing.T) {
	_, s, err := evaluateAll(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	const g = 9.80665
	w20, _ := fluids.FreshWater().AtCelsius(20)
	rho := w20.Density.Value()
	p := -66680.0 + 101000 - 2339.21
	v := 800 * 3.785411784e-3 / 60 / (math.Pi / 4 * 0.1524 * 0.1524)
	hv := v * v / (2 * g)
	npsh := p/(rho*g) + hv
	if math.Abs(s.NPSH.Model.Value()-npsh) > 1e-5 || math.Abs(npsh/0.3048-12.0) > 0.005 {
		t.Errorf("model NPSH3 %v m, by hand %v m (%v ft)", s.NPSH.Model.Value(), npsh, npsh/0.3048)
	}
	const h = 1e-3
	pvLo, _ := fluids.VapourPressure(q.New(293.15-h, q.Temperature))
	pvHi, _ := fluids.VapourPressure(q.New(293.15+h, q.Temperature))
	wLo, _ := fluids.FreshWater().AtCelsius(20 - h)
	wHi, _ := fluids.FreshWater().AtCelsius(20 + h)
	dpv := (pvHi.Value() - pvLo.Value()) / (2 * h)
	drho := (wHi.Density.Value() - wLo.Density.Value()) / (2 * h)
	cT := -dpv/(rho*g) - p/(rho*rho*g)*drho
	terms := []float64{150 / (rho * g), 50 / (rho * g), 2 * hv * 0.005, 0.04, cT * 0.2}
	var ss float64
	for _, x := range terms {
		ss += x * x
	}
	ratio := s.ProtoNPSH3.Value() / (12 * 0.3048) // H_p/H_m, as the Thoma scaling above
	if got, want := s.NPSH.Budget.U.Value(), math.Sqrt(ss)*ratio; math.Abs(got/want-1) > 1e-6 {
		t.Errorf("u_c(NPSH3_p) = %v m, by hand %v m", got, want)
	}
	if got := s.NPSH.Proto.Value(); math.Abs(got/(s.NPSH.Model.Value()*ratio)-1) > 1e-12 {
		t.Errorf("prototype NPSH3 %v, want model × %v", got, ratio)
	}
	if s.NPSH.Budget.Lines[0].Source.Name != "3 % drop point (6 curves)" {
		t.Errorf("largest contribution %q", s.NPSH.Budget.Lines[0].Source.Name)
	}
}

// TestStepUpBasisPrinted: the IEC 60193 comparison prints its reference
// values (Re_ref = 7×10⁶, V_ref = 0.70), the assumption η_h = η and the
// formula's scope, and calls its figure an indication; by hand with
// r(Re) = (7e6/Re)^0.16 and V_ref = 0.7, Δη = 0.165·(r(Re_M) − r(Re_P))/
// (r(Re_M) + 0.3/0.7) = 2.61 points at Re_M 5.89e6, Re_P 2.87e7. The
// dimensionless specific speed is labelled with its definition:
// Ω_s = ωQ^½/(gH)^¾ = (1750·2π/60)·√0.0504722/(9.80665·29.2608)^¾ = 0.591.
func TestStepUpBasisPrinted(t *testing.T) {
	var out bytes.Buffer
	_, s, err := evaluateAll(&out, []string{"-out", ""})
	if err != nil {
		t.Fatal(err)
	}
	r := func(re float64) float64 { return math.Pow(7e6/re, 0.16) }
	if g := 0.165 * (r(s.ReModel) - r(s.ReProto)) / (r(s.ReModel) + 0.3/0.7); math.Abs(s.IECGain-g) > 1e-12 || math.Abs(g-0.0261) > 5e-5 {
		t.Errorf("IEC gain %v, by hand %v", s.IECGain, g)
	}
	om := 1750 * 2 * math.Pi / 60 * math.Sqrt(800*6.30901964e-5) / math.Pow(9.80665*96*0.3048, 0.75)
	if math.Abs(s.SpecificSpeed.Dimensionless-om) > 1e-9 || math.Abs(om-0.591) > 5e-4 {
		t.Errorf("Ω_s %v, by hand %v", s.SpecificSpeed.Dimensionless, om)
	}
	for _, want := range []string{
		"IEC 60193 scalable losses 86.1 % (Δη 2.61 points, an indication: see below)",
		"with Re_ref = 7×10⁶ and V_ref = 0.70",
		"taking the hydraulic efficiency η_h equal to this pump's overall η",
		"scope is the hydraulic efficiency of turbines,\n  storage pumps and pump-turbines (from memory), so for this pump it is an indication only",
		"dimensionless specific speed Ω_s = ωQ^½/(gH)^¾ = 0.591 with ω in rad/s",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if strings.Contains(out.String(), "(rad/s, dimensionless)") {
		t.Error("the old Ω_s label is still printed")
	}
}

// TestFlangeVelocityFollowsFlow: the flange velocity is Q/(π·d²/4), not
// a fixed figure. At -dp 100 -np 200, Q_p = 800 gpm·(200/1750)·(100/10)³
// = 91429 gpm = 5768 L/s and the default bore is 6·100/10 = 60 in =
// 1.524 m: V = 5.768/1.8241 = 3.162 m/s; with -flange 48 (1.2192 m),
// V = 5.768/1.1675 = 4.941 m/s. Each line states the bore.
func TestFlangeVelocityFollowsFlow(t *testing.T) {
	for _, c := range []struct {
		args []string
		want string
	}{
		{nil, "V = Q/(π·d²/4) = 4.48 m/s at the flange"},
		{[]string{"-dp", "100", "-np", "200"}, "V = Q/(π·d²/4) = 3.16 m/s at the flange"},
		{[]string{"-dp", "100", "-np", "200", "-flange", "48"}, "V = Q/(π·d²/4) = 4.94 m/s at the flange"},
	} {
		var out bytes.Buffer
		if _, err := evaluate(&out, append([]string{"-out", ""}, c.args...)); err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(out.String(), c.want) || !strings.Contains(out.String(), "suction-flange bore d = ") {
			t.Errorf("%v: report lacks %q", c.args, c.want)
		}
	}
}

// TestPooledWording: the monotone fairing's pooling is said in plain
// words, naming the NPSHA values and why.
func TestPooledWording(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-out", ""}); err != nil {
		t.Fatal(err)
	}
	if w := "the heads at NPSHA 8 and 10 m were pooled into their mean, because the head rose as NPSHA fell (monotone fairing)"; !strings.Contains(out.String(), w) {
		t.Errorf("report lacks %q", w)
	}
}

// TestFlangeTooSmall: a 1 in bore would pass the BEP flow 470.5 L/s at
// V = 0.4705/(π/4·0.0254²) = 928 m/s; V²/2g must stay below NPSH3 =
// 9.58 m, i.e. V < √(2·9.80665·9.58) = 13.71 m/s, a bore above
// √(4·0.4705/(π·13.71)) = 0.2090 m = 8.23 in. It is a usage error naming
// -flange and the bore, before the report.
func TestFlangeTooSmall(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, []string{"-out", "", "-flange", "1"})
	var ce *cli.Error
	if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-flange 1 in: V = Q/(π·d²/4) = 928 m/s") ||
		!strings.Contains(err.Error(), "give -flange above 8.3 in") || out.Len() != 0 {
		t.Errorf("got %v after printing %d bytes", err, out.Len())
	}
	var stderr strings.Builder
	cli.ExitCode(&stderr, "pumpscale", err)
	if strings.Contains(stderr.String(), "…") {
		t.Errorf("the message is cut: %q", stderr.String())
	}
}
