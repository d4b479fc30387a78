package main

import (
	"bytes"
	"errors"
	"flag"
	"io"
	"math"
	"regexp"
	"strings"
	"testing"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// outDir returns the arguments with -out set to a fresh temporary
// directory, so that no test writes its plots anywhere else.
func outDir(t testing.TB, args ...string) []string {
	return append([]string{"-out", t.TempDir()}, args...)
}

func TestRuns(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, outDir(t)); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "ordinary tunnel", "cryogenic", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
	if err := run(&bytes.Buffer{}, outDir(t, "-mach", "1.5")); err == nil {
		t.Error("-mach 1.5 accepted")
	}
}

// TestByHand: the ordinary tunnel draws atmospheric air, total
// T₀ = 288.15 K and p₀ = 101 325 Pa; at Ma = 0.62 the isentropic
// relations (common practice) give T = T₀/(1 + 0.2·Ma²) and
// p = p₀/(1 + 0.2·Ma²)^3.5. The Mach number is held, so V_m = Ma·√(γRT),
// and Re_m = ρ·V_m·(c/12)/μ with ρ = p/(RT) and Sutherland's μ(T) of
// ISO 2533 (β = 1.458e-6, S = 110.4 K).
func TestByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	const R, gamma = 287.05287, 1.4
	f := 1 + 0.2*0.62*0.62
	T := 288.15 / f
	p := 101325 / math.Pow(f, 3.5)
	if math.Abs(T-267.579) > 1e-3 || math.Abs(p-78186.4) > 0.1 {
		t.Fatalf("hand static state T = %v, p = %v", T, p)
	}
	if math.Abs(r.Ordinary.Temperature.Value()/T-1) > 1e-12 || math.Abs(r.Ordinary.Pressure.Value()/p-1) > 1e-12 {
		t.Errorf("static state %v, %v; by hand %v K, %v Pa", r.Ordinary.Temperature, r.Ordinary.Pressure, T, p)
	}
	vm := 0.62 * math.Sqrt(gamma*R*T)
	if math.Abs(r.OrdinarySpeed/vm-1) > 1e-9 {
		t.Errorf("V_m = %v, by hand %v", r.OrdinarySpeed, vm)
	}
	mu := 1.458e-6 * T * math.Sqrt(T) / (T + 110.4)
	rem := p / (R * T) * vm * 0.2 / mu
	if math.Abs(r.ReOrdinary/rem-1) > 1e-9 {
		t.Errorf("Re_m = %v, by hand %v", r.ReOrdinary, rem)
	}
	ref := r.Flight.Density.Value() * r.Speed * 2.4 / r.Flight.DynamicViscosity.Value()
	if math.Abs(r.ReFlight/ref-1) > 1e-12 {
		t.Errorf("Re = %v", r.ReFlight)
	}
	if !r.Cryogenic.Achieved && !r.Pressurised.Achieved {
		t.Error("neither tunnel holds both groups")
	}
	// Each found condition: static = total by the isentropic relations.
	for _, c := range []struct {
		T0, p0, T, p float64
	}{{r.Cryogenic.Total.Temperature.Value(), r.Cryogenic.Total.Pressure.Value(), r.Cryogenic.Temperature.Value(), r.Cryogenic.Pressure.Value()}} {
		if math.Abs(c.T0/c.T-f) > 1e-12 || math.Abs(c.p0/c.p-math.Pow(f, 3.5)) > 1e-9 {
			t.Errorf("total/static: %v", c)
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
	// It says what the program does and what its output means, and
	// lists every flag with its range.
	for _, want := range []string{"plans wind-tunnel tests", "invented", "Re_m/Re (1 when both hold)", "ε = blockage", "safety cautions",
		"Exit status 2", "-alt", "-mach", "-chord", "-scale", "0.1 … 0.95",
		"six-component internal balance", "weight tare", "C_D = C_D0 + K·C_L²", "-amin", "-amax", "-out", "-dpi", "rated"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("-h lacks %q", want)
		}
	}
}

// TestLoadsByHand: q = (γ/2)·p·Ma² with γ = 1.4 at each test section's
// static pressure, lift = C_L·q·S_m with S_m = 38 m²/12², and the
// pressurised tunnel (higher pressure for the same Reynolds number) is
// the one that overloads the 4 kN balance.
func TestLoadsByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	ps := []float64{r.Ordinary.Pressure.Value(), r.Pressurised.Pressure.Value(), r.Cryogenic.Pressure.Value()}
	for i, l := range r.Loads {
		qd := 0.7 * ps[i] * 0.62 * 0.62
		lift := 0.6 * qd * 38 / 144
		if math.Abs(l.Q-qd) > 1e-9*qd || math.Abs(l.Lift-lift) > 1e-9*lift {
			t.Errorf("%s: q = %v, lift = %v; by hand %v, %v", l.Name, l.Q, l.Lift, qd, lift)
		}
	}
	if !(r.Loads[1].Lift > 4000 && r.Loads[0].Lift < 4000 && r.Loads[2].Lift < 4000) || !strings.Contains(out.String(), "EXCEEDS the balance's rating") {
		t.Errorf("loads %+v", r.Loads)
	}
}

// TestCondensationMargin: the margin is the static temperature less the
// nitrogen saturation temperature at the static pressure.
func TestCondensationMargin(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	ts, err := fluids.NitrogenSaturationTemperature(r.Cryogenic.Pressure)
	if err != nil {
		t.Fatal(err)
	}
	if m := r.Cryogenic.Temperature.Value() - ts.Value(); math.Abs(r.Margin.Value()-m) > 1e-12 || !(m > 50) {
		t.Errorf("margin %v, by hand %v", r.Margin, m)
	}
}

// TestSectionByHand: at the default Ma = 0.62, β² = 1 − 0.62² (the
// compressibility factors of the classical corrections, from memory);
// σ = (π²/48)(0.3/0.9)², ε_sb = 0.25σ/β³,
// ε_wb = (0.3/(4·0.9))·0.0125·(1 + 0.4·0.62²)/β², ε = ε_sb + ε_wb,
// C_l = 0.82[1 − σ/β² − (2 − 0.62²)ε], q/q_u = 1 + (2 − 0.62²)ε.
func TestSectionByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	m2 := 0.62 * 0.62
	b2 := 1 - m2
	sig := math.Pi * math.Pi / 48 / 9
	esb := 0.25 * sig / (b2 * math.Sqrt(b2))
	e := esb + 0.3/3.6*0.0125*(1+0.4*m2)/b2
	if math.Abs(r.Section.CL-0.82*(1-sig/b2-(2-m2)*e)) > 1e-15 || math.Abs(r.Section.Sigma-sig) > 1e-15 ||
		math.Abs(r.Section.SolidBlock-esb) > 1e-15 || math.Abs(r.Section.DynamicPressureFactor-(1+(2-m2)*e)) > 1e-15 {
		t.Errorf("section %+v", r.Section)
	}
}

// TestModelCorrectionsByHand: at Ma = 0.62, β² = 1 − 0.62²:
// ε_sb = 0.86·0.010/(3^1.5·β³), ε_wb = S_m/(4·3)·0.035·(1 + 0.4·0.62²)/β²,
// q/q_u = (1 + ε)²(1 − 0.62²ε), C_L on the corrected q = 0.6/(q/q_u),
// Δα = 57.3·0.12·(S_m/3)·C_L; streamline curvature τ₂ = 0.12:
// Δα_sc = 0.12·Δα, ΔC_L = −a·Δα_sc, ΔC_m¼ = −0.25·ΔC_L, with a the run's
// fitted slope at Ma 0.20 times β(0.20)/β(0.62) = √0.96/√(1 − 0.62²)
// (0.0803 × 1.2488 = 0.1003/°); the tail (τ₂,t = 0.55) meets 0.55·Δα
// more, ΔC_m,t = 0.025·0.55·Δα. The printed lines name the model's area
// and span (0.2639 m², 1.550 m) and the section's 3.00 m².
func TestModelCorrectionsByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	m2 := 0.62 * 0.62
	b2 := 1 - m2
	sm := 38.0 / 144
	a := r.Run.Polar.LiftSlopePerDeg.Value * math.Sqrt(0.96) / math.Sqrt(b2)
	if math.Abs(r.ModelSlope-a) > 1e-15 || math.Abs(a-0.1003) > 5e-5 {
		t.Errorf("complete-model slope %v, by hand %v", r.ModelSlope, a)
	}
	for _, want := range []string{"reference (wing) area S = 0.2639 m², span b = 1.550 m", "cross-section C = 3.00 m²",
		"a = 0.1003/°: the run's fitted 0.0803/° at Ma 0.20 × β(0.20)/β(0.62)"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	eps := 0.86*0.010/math.Pow(3, 1.5)/(b2*math.Sqrt(b2)) + sm/12*0.035*(1+0.4*m2)/b2
	f := (1 + eps) * (1 + eps) * (1 - m2*eps)
	clq := 0.6 / f
	da := 57.3 * 0.12 * sm / 3 * clq
	dcl := -a * 0.12 * da
	cm := -0.030/f - 0.25*dcl + 0.025*0.55*da
	if math.Abs(r.Model.CL-(clq+dcl)) > 1e-14 || math.Abs(r.Model.AlphaDeg-(3+da*1.12)) > 1e-13 || math.Abs(r.Model.CM-cm) > 1e-14 {
		t.Errorf("model %+v; by hand C_L %v, α %v, C_m %v", r.Model, clq+dcl, 3+da*1.12, cm)
	}
}

// TestCorrectionsFollowMach: the printed blockage changes with the Mach
// number as 1/β³ (the example used to print the same corrections at
// Ma 0.62 and 0.85), and at 0.85, above 0.8, the corrections are
// refused and say so instead of printing numbers.
func TestCorrectionsFollowMach(t *testing.T) {
	at := func(ma string) (*Result, string) {
		var out bytes.Buffer
		r, err := evaluate(&out, outDir(t, "-mach", ma))
		if err != nil {
			t.Fatal(err)
		}
		return r, out.String()
	}
	r5, _ := at("0.5")
	r7, _ := at("0.7")
	b5, b7 := math.Sqrt(1-0.25), math.Sqrt(1-0.49)
	if want := math.Pow(b5/b7, 3); math.Abs(r7.Section.SolidBlock/r5.Section.SolidBlock-want) > 1e-12 {
		t.Errorf("ε_sb(0.7)/ε_sb(0.5) = %v, by hand (β₀.₅/β₀.₇)³ = %v", r7.Section.SolidBlock/r5.Section.SolidBlock, want)
	}
	r85, out := at("0.85")
	if r85.SectionErr == nil || r85.ModelErr == nil || strings.Count(out, "not applied") != 2 || !strings.Contains(out, "0 … 0.8") {
		t.Errorf("at Ma 0.85: %v, %v\n%s", r85.SectionErr, r85.ModelErr, out)
	}
}

// TestCryogenicIsNitrogen: the tunnel described as nitrogen is computed
// for nitrogen and says so; by hand with nitrogen's constants
// (R = 8.314462618/0.0280134 J/(kg·K), Sutherland μ₀ = 1.663e-5 Pa·s at
// 273 K, S = 107 K), ρ = p/(RT), V = 0.62·√(1.4RT) and
// Re_m = ρV(2.4/12)/μ equals the flight Reynolds number.
func TestCryogenicIsNitrogen(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t))
	if err != nil {
		t.Fatal(err)
	}
	c := r.Cryogenic
	if c.Gas != "nitrogen" || !strings.Contains(out.String(), "gas: nitrogen") || !strings.Contains(out.String(), "gas: air") {
		t.Errorf("gas %q; output:\n%s", c.Gas, out.String())
	}
	R := 8.314462618 / 0.0280134
	T, p := c.Temperature.Value(), c.Pressure.Value()
	mu := 1.663e-5 * math.Pow(T/273, 1.5) * (273 + 107) / (T + 107)
	V := 0.62 * math.Sqrt(1.4*R*T)
	if re := p / (R * T) * V * 0.2 / mu; math.Abs(re/r.ReFlight-1) > 1e-6 || math.Abs(c.Velocity.Value()/V-1) > 1e-12 {
		t.Errorf("Re_m by hand %v, flight %v; V %v by hand %v", re, r.ReFlight, c.Velocity, V)
	}
}

// TestSafetyPrinted: the nitrogen tunnel's asphyxiation and cold-burn
// cautions, the overload of the balance in the pressurised tunnel and
// the deferral to the facility's safety rules and responsible engineer
// are printed.
func TestSafetyPrinted(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t)); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"asphyxiation", "cold burns", "OVERLOAD", "pressure-equipment code", "safety rules", "responsible engineer"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestFlagErrors: every numeric flag refuses NaN, ±Inf, text and values
// outside its range with the flag named, and the program exits 2.
func TestFlagErrors(t *testing.T) {
	for _, f := range []string{"alt", "mach", "chord", "scale", "amin", "amax", "width", "height", "dpi"} {
		for _, v := range []string{"NaN", "Inf", "-Inf", "x", "1e400", "-1e9", "1e9"} {
			err := run(io.Discard, outDir(t, "-"+f, v))
			if err == nil || !strings.Contains(err.Error(), "-"+f) {
				t.Errorf("-%s %s: %v", f, v, err)
				continue
			}
			if code := cli.ExitCode(io.Discard, "tunnel", err); code != 2 {
				t.Errorf("-%s %s: exit %d, want 2", f, v, code)
			}
		}
	}
	if code := cli.ExitCode(io.Discard, "tunnel", run(io.Discard, []string{"-h"})); code != 0 {
		t.Errorf("-h: exit %d", code)
	}
}

// FuzzFlags: any value of any flag ends in a plan or an error, never a
// panic, and a plan prints no NaN or Inf.
func FuzzFlags(f *testing.F) {
	f.Add(uint8(0), "18000")
	f.Add(uint8(1), "0.8")
	f.Add(uint8(2), "1e-300")
	f.Add(uint8(3), "\x1b[2J")
	names := []string{"-alt", "-mach", "-chord", "-scale", "-amin", "-amax", "-width", "-height", "-dpi", "-h", "-bogus"}
	dir := f.TempDir()
	f.Fuzz(func(t *testing.T, which uint8, v string) {
		var out bytes.Buffer
		err := run(&out, []string{"-out", dir, names[int(which)%len(names)], v})
		if code := cli.ExitCode(io.Discard, "tunnel", err); err != nil && code == 0 && !errors.Is(err, flag.ErrHelp) {
			t.Errorf("error %v with exit 0", err)
		}
		if err == nil && (strings.Contains(out.String(), "NaN") || strings.Contains(out.String(), "Inf")) {
			t.Errorf("non-finite number printed:\n%s", out.String())
		}
	})
}

// TestPressuresSayAbsolute: every pressure in bar, the limits and the
// found conditions, says it is absolute; the ordinary tunnel's p₀ too.
func TestPressuresSayAbsolute(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t)); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	all := strings.Count(s, " bar")
	abs := strings.Count(s, " bar absolute") + strings.Count(s, " bar (absolute)")
	if all == 0 || all != abs {
		t.Errorf("%d pressures in bar, %d of them marked absolute:\n%s", all, abs, s)
	}
	for _, want := range []string{"0.2–4 bar absolute", "1–4.5 bar absolute", "p₀ = 1.496 bar (absolute)", "p₀ = 1.01325 bar (absolute)", "p = 0.78186 bar (absolute)"} {
		if !strings.Contains(s, want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestCondensationIsFreeStream: the margin is said to be the free
// stream's, reduced by local expansion over the model.
func TestCondensationIsFreeStream(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t)); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"at the free-stream static 193.8 K", "local supersonic expansion over the model lowers the static temperature and reduces it"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestUsageHeader: -h begins as the other examples' do.
func TestUsageHeader(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-h"}); !errors.Is(err, flag.ErrHelp) || !strings.HasPrefix(out.String(), "Usage: tunnel [flags]\n") {
		t.Errorf("-h: %v\n%s", err, out.String())
	}
}

// safety returns the SAFETY block of a report.
func safety(t *testing.T, report string) string {
	t.Helper()
	_, s, ok := strings.Cut(report, "\nSAFETY")
	if !ok {
		t.Fatalf("no SAFETY block in %q", report)
	}
	return s
}

// TestOrdinaryOverloadInSafety: an overloaded ordinary tunnel gets its
// own OVERLOAD line in the SAFETY block. At sea level, Ma 0.3, 1:4: the
// static p = 95192 Pa (101325 Pa through the isentropic ratio
// (1 + 0.2·0.09)^-3.5), q = 0.7·95192·0.09 = 5997 Pa, S_m = 38/16 =
// 2.375 m², lift = 0.6·5997·2.375 = 8546 N, 114 % over the 4000 N.
func TestOrdinaryOverloadInSafety(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t, "-alt", "0", "-mach", "0.3", "-scale", "4")); err != nil {
		t.Fatal(err)
	}
	s := safety(t, out.String())
	_, ord, ok := strings.Cut(s, "  ordinary tunnel (atmospheric intake")
	ord, _, _ = strings.Cut(ord, "  pressurised tunnel")
	want := "    - OVERLOAD: the load C·S·q = 8546 N at q = 5.997 kPa exceeds the rated 4000 N of the balance, sting or model by 114 %"
	if !ok || !strings.Contains(ord, want) || !strings.Contains(ord, "smaller model (a larger -scale)") {
		t.Errorf("ordinary tunnel in SAFETY: %q, want %q", ord, want)
	}
}

// TestCryogenicOverloadAdvice: at Ma 0.85 the cryogenic tunnel is at its
// minimum total pressure (1 bar), so the advice must not be to lower it.
func TestCryogenicOverloadAdvice(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t, "-mach", "0.85")); err != nil {
		t.Fatal(err)
	}
	_, cryo, _ := strings.Cut(safety(t, out.String()), "  cryogenic tunnel")
	if !strings.Contains(cryo, "OVERLOAD") || !strings.Contains(cryo, "at its minimum total pressure already") ||
		strings.Contains(cryo, "lower the total pressure") || strings.Contains(cryo, "e+0") {
		t.Errorf("cryogenic overload: %q", cryo)
	}
}

// TestLinearRangeTooNarrow: -amin 12 -amax 16 takes in 2 corrected angles
// (12.733°, 14.759°); the next are 16.725° above and 10.671° below. It is
// a usage error naming both flags and the bounds that would do, printed
// before any report, with the command's name once.
func TestLinearRangeTooNarrow(t *testing.T) {
	var out bytes.Buffer
	err := run(&out, outDir(t, "-amin", "12", "-amax", "16"))
	var ce *cli.Error
	if !errors.As(err, &ce) {
		t.Fatalf("got %v, want a usage error", err)
	}
	for _, w := range []string{"-amin 12 -amax 16", "2 lie in it (12.733°, 14.759°)", "raise -amax to at least 16.725", "lower -amin to at most 10.671"} {
		if !strings.Contains(err.Error(), w) {
			t.Errorf("%q lacks %q", err, w)
		}
	}
	if out.Len() != 0 {
		t.Errorf("printed before the usage error: %q", out.String())
	}
	var stderr strings.Builder
	if code := cli.ExitCode(&stderr, "tunnel", err); code != 2 || strings.Contains(stderr.String(), "tunnel: tunnel:") {
		t.Errorf("exit %d, %q", code, stderr.String())
	}
}

// TestSmallModelFigures: at 32 km, Ma 0.1, 1:200 the loads are printed
// with significant figures in one unit: static p = 100619 Pa, q =
// 0.7·100619·0.01 = 704.3 Pa, S_m = 38/200² = 0.00095 m², lift =
// 0.6·704.3·0.00095 = 0.4015 N, 0.010 % of 4000 N.
func TestSmallModelFigures(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, outDir(t, "-alt", "32000", "-mach", "0.1", "-scale", "200")); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, w := range []string{"0.0009500 m² model",
		"ordinary tunnel:     q = 0.7043 kPa, lift = 0.4015 N — 0.010 % of the balance's rating",
		"- load: C·S·q = 0.4015 N at q = 0.7043 kPa is 0.010 % of the rated 4000 N"} {
		if !strings.Contains(s, w) {
			t.Errorf("report lacks %q", w)
		}
	}
	if strings.Contains(safety(t, s), " Pa ") || strings.Contains(s, "0.00 kN") || strings.Contains(s, "applied: tunnel: ") {
		t.Errorf("a pressure in Pa in SAFETY, a load printed as 0.00 kN or a package prefix in the report")
	}
}

// TestMachAboveWallRange: at -mach 0.95 both wall corrections are
// refused for the Mach number (above 0.8), the 3-D one too, although
// the lift slope it would take, the run's 0.0803/° raised by
// √(1 − 0.2²)/√(1 − 0.95²) = 0.97980/0.31225, is 0.252/°, above the
// 0.2/° the curvature correction takes (by hand): the Mach number is the
// reason, not the slope.
func TestMachAboveWallRange(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t, "-mach", "0.95"))
	if err != nil {
		t.Fatal(err)
	}
	if a := 0.0803 * math.Sqrt(1-0.04) / math.Sqrt(1-0.95*0.95); math.Abs(r.ModelSlope-a) > 5e-4 || !(a > 0.2) {
		t.Errorf("model slope %v, by hand %v", r.ModelSlope, a)
	}
	const want = "  not applied: 3-D wall correction: test-section Mach number 0.95 outside 0 … 0.8: "
	if !strings.Contains(out.String(), want) || strings.Contains(out.String(), "lift slope 0.25") {
		t.Errorf("output lacks %q:\n%s", want, out.String())
	}
	var te *tunnel.Error
	if !errors.As(r.ModelErr, &te) || te.Input != "test-section Mach number" {
		t.Errorf("ModelErr = %v", r.ModelErr)
	}
}

// TestChordSizesAircraft: -chord 20 sizes the whole aircraft at the
// design's aspect ratio. By hand: the wing area scales with the square
// of the chord, S = 38·(20/2.4)² = 38·69.444 = 2638.9 m², the span with
// the chord, b = 18.6·20/2.4 = 155.0 m, so b²/S = 24025/2638.9 = 9.104 =
// 18.6²/38, unchanged; the 1:12 model's wing is 2638.9/144 = 18.33 m²,
// S/C = 18.33/3 = 6.11, which the complete model's correction refuses
// (above 0.2), and its lift C_L·q·S_m = 0.6·q·18.33 m².
func TestChordSizesAircraft(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t, "-chord", "20"))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.WingArea-2638.9) > 0.05 || math.Abs(r.Span-155.0) > 1e-9 || math.Abs(r.Span*r.Span/r.WingArea-18.6*18.6/38) > 1e-9 {
		t.Errorf("S = %v m², b = %v m", r.WingArea, r.Span)
	}
	if math.Abs(r.ModelArea-2638.9/144) > 1e-3 {
		t.Errorf("model wing %v m², by hand 18.33", r.ModelArea)
	}
	if o := r.Loads[0]; math.Abs(o.Lift/(0.6*o.Q*18.326)-1) > 1e-4 {
		t.Errorf("ordinary-tunnel lift %v N at q = %v Pa, by hand 0.6·q·18.326 m²", o.Lift, o.Q)
	}
	for _, want := range []string{"fixed aspect ratio b²/S = 9.10: wing area S = 2639 m², span b = 155.0 m",
		"wing 2639 m² full scale, 18.33 m² model", "not applied: 3-D wall correction: S/C = 6.11"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	var h bytes.Buffer
	_ = run(&h, []string{"-h"})
	if !strings.Contains(h.String(), "-chord sizes the whole aircraft") || !strings.Contains(h.String(), "aspect ratio") {
		t.Errorf("-h does not say what -chord changes:\n%s", h.String())
	}
}

// TestSmallCorrectionsHaveFigures: at -scale 200 the complete model's
// corrections are small but not zero and print with significant figures.
// By hand (β = √(1 − 0.62²) = 0.78460, β² = 0.61560, β³ = 0.48300; the
// model's volume 0.010·(12/200)³ = 2.16e-6 m³ and wing 38/200² =
// 0.00095 m²; C = 3 m², C^1.5 = 5.1962):
// ε_sb = 0.86·2.16e-6/5.1962/0.48300 = 7.40e-7 and
// ε_wb = (0.00095/12)·0.035·(1 + 0.4·0.3844)/0.61560 = 5.19e-6.
func TestSmallCorrectionsHaveFigures(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, outDir(t, "-scale", "200"))
	if err != nil {
		t.Fatal(err)
	}
	b := math.Sqrt(1 - 0.62*0.62)
	esb, ewb := 0.86*2.16e-6/math.Pow(3, 1.5)/(b*b*b), 0.00095/12*0.035*(1+0.4*0.62*0.62)/(b*b)
	if math.Abs(r.Model.SolidBlock/esb-1) > 1e-9 || math.Abs(r.Model.WakeBlock/ewb-1) > 1e-9 {
		t.Errorf("ε_sb = %v, ε_wb = %v; by hand %v, %v", r.Model.SolidBlock, r.Model.WakeBlock, esb, ewb)
	}
	s := out.String()
	if want := "ε_sb = 7.40e-07, ε_wb = 5.19e-06"; !strings.Contains(s, want) {
		t.Errorf("output lacks %q", want)
	}
	i, j := strings.Index(s, "Complete model"), strings.Index(s, "Balance reduction")
	if i < 0 || j < i {
		t.Fatal("no complete-model section")
	}
	if m := regexp.MustCompile(`= -?0\.0+[;,) °]`).FindString(s[i:j]); m != "" {
		t.Errorf("a correction rounds to nothing: %q", m)
	}
}

// TestReviewCommandsNumbers: under the commands a reader tries, no
// number prints with more than 7 decimals (no 17-digit floats), the
// pressure notes are in the bar of their lines, and each tunnel's header
// states the limits the finder used (the pressurised tunnel's 0.2 bar
// minimum included; at -alt 32000 it runs at that minimum).
func TestReviewCommandsNumbers(t *testing.T) {
	long := regexp.MustCompile(`[0-9]\.[0-9]{8,}`)
	for _, args := range [][]string{nil, {"-mach", "0.95"}, {"-chord", "20"}, {"-scale", "200"}, {"-alt", "0"}, {"-alt", "32000"}, {"-amin", "12", "-amax", "30"}} {
		var out bytes.Buffer
		err := run(&out, outDir(t, args...))
		var stderr bytes.Buffer
		cli.ExitCode(&stderr, "tunnel", err)
		s := out.String() + stderr.String()
		if m := long.FindString(s); m != "" {
			t.Errorf("%v: long number %q", args, m)
		}
		if strings.Contains(s, "e+05 Pa") || strings.Contains(s, "e+06 Pa") {
			t.Errorf("%v: a pressure in Pa with an exponent", args)
		}
	}
	var out bytes.Buffer
	if err := run(&out, outDir(t, "-alt", "0")); err != nil {
		t.Fatal(err)
	}
	// By hand (see TestFinderNoteInBar in the tunnel package): p₀ = 1.3804e6 Pa = 13.8 bar.
	if !strings.Contains(out.String(), "needs a total pressure of 13.8 bar (absolute)") {
		t.Error("-alt 0: the pressure note is not 13.8 bar")
	}
	out.Reset()
	if err := run(&out, outDir(t, "-alt", "32000")); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"pressurised tunnel (total 280–320 K, 0.2–4 bar absolute)", "p₀ = 0.200 bar (absolute)", "cryogenic tunnel (total 110–320 K, 1–4.5 bar absolute)"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("-alt 32000: output lacks %q", want)
		}
	}
}
