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
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "ordinary tunnel", "cryogenic", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
	if err := run(&bytes.Buffer{}, []string{"-mach", "1.5"}); err == nil {
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
	r, err := evaluate(&bytes.Buffer{}, nil)
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
}

// TestLoadsByHand: q = (γ/2)·p·Ma² with γ = 1.4 at each test section's
// static pressure, lift = C_L·q·S_m with S_m = 38 m²/12², and the
// pressurised tunnel (higher pressure for the same Reynolds number) is
// the one that overloads the 4 kN balance.
func TestLoadsByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, nil)
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
	if !(r.Loads[1].Lift > 4000 && r.Loads[0].Lift < 4000 && r.Loads[2].Lift < 4000) || !strings.Contains(out.String(), "EXCEEDS the balance limit") {
		t.Errorf("loads %+v", r.Loads)
	}
}

// TestCondensationMargin: the margin is the static temperature less the
// nitrogen saturation temperature at the static pressure.
func TestCondensationMargin(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, nil)
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

// TestSectionByHand: σ = (π²/48)(0.3/0.9)², ε_sb = 0.25σ,
// ε_wb = (0.3/(4·0.9))·0.0125, C_l = 0.82(1 − σ − 2ε).
func TestSectionByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	sig := math.Pi * math.Pi / 48 / 9
	e := 0.25*sig + 0.3/3.6*0.0125
	if math.Abs(r.Section.CL-0.82*(1-sig-2*e)) > 1e-15 || math.Abs(r.Section.Sigma-sig) > 1e-15 {
		t.Errorf("section %+v", r.Section)
	}
}

// TestModelCorrectionsByHand: ε_sb = 0.86·0.010/3^1.5, ε_wb =
// S_m/(4·3)·0.035, C_L on the corrected q = 0.6/(1 + ε)²,
// Δα = 57.3·0.12·(S_m/3)·C_L; streamline curvature τ₂ = 0.12:
// Δα_sc = 0.12·Δα, ΔC_L = −0.085·Δα_sc, ΔC_m¼ = −0.25·ΔC_L; the tail
// (τ₂,t = 0.55) meets 0.55·Δα more, ΔC_m,t = 0.025·0.55·Δα.
func TestModelCorrectionsByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	sm := 38.0 / 144
	eps := 0.86*0.010/math.Pow(3, 1.5) + sm/12*0.035
	f := (1 + eps) * (1 + eps)
	clq := 0.6 / f
	da := 57.3 * 0.12 * sm / 3 * clq
	dcl := -0.085 * 0.12 * da
	cm := -0.030/f - 0.25*dcl + 0.025*0.55*da
	if math.Abs(r.Model.CL-(clq+dcl)) > 1e-15 || math.Abs(r.Model.Alpha-(3+da*1.12)) > 1e-13 || math.Abs(r.Model.CM-cm) > 1e-15 {
		t.Errorf("model %+v; by hand C_L %v, α %v, C_m %v", r.Model, clq+dcl, 3+da*1.12, cm)
	}
}
