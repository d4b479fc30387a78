package main

import (
	"bytes"
	"math"
	"strings"
	"testing"
	"time"

	q "similis.dev/similis/quantity"
)

func TestRun(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, nil); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"invented", "Re = 1.9932e+05", "cannot raise density [kg·m⁻³] to a real power", "ITTC-1957"} {
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
	gotRe, gotF, gotDp := pressureDrop(pipe{
		q.New(998.2, q.Density), q.New(2.5, q.Velocity), q.New(0.08, q.Length),
		q.New(1.0016e-3, q.DynamicViscosity), q.New(4.5e-5, q.Length), q.New(40, q.Length),
	})
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

func TestRunBadFlags(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-v", "-1"}); err == nil {
		t.Error("negative velocity accepted")
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
	// Froude scaling of force at 1:16 with the same density: λ_F = 16⁻³,
	// so 30.9 N → 30.9·4096 N (common practice).
	if math.Abs(r.NaiveForce.Value()-30.9*4096) > 1e-6 {
		t.Errorf("naive ship force %v, want %v", r.NaiveForce, 30.9*4096)
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
	for _, want := range []string{"forces λ_L to 1", "ν_m/ν_p = λ_L^(3/2)", "CAUTION"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

func TestMainDemoIsFast(t *testing.T) {
	start := time.Now()
	if err := run(&bytes.Buffer{}, nil); err != nil {
		t.Fatal(err)
	}
	if d := time.Since(start); d > 10*time.Second {
		t.Errorf("the main demo took %v", d)
	}
}
