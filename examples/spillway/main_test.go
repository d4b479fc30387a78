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

// TestScaleChecksByHand: at the design discharge the model head is
// 4.2/30 = 0.14 m, the critical velocity √(g·⅔h); at a tenth of the
// discharge the head is 4.2·0.1^(2/3)/30 = 0.0302 m, which fails the
// published 7 cm head and, with σ at 15 °C from IAPWS, the Weber limit.
// The crest radius is 0.9/30 = 0.03 m, above the published 0.01 m. The
// distorted reach needs grains of (1/30)²/(1/120) = 0.1333 of the
// prototype's.
func TestScaleChecksByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	wat, _ := fluids.FreshWater().AtCelsius(15)
	sig, _ := fluids.SurfaceTension(wat.Temperature)
	for i, share := range []float64{1, 0.1} {
		h := 4.2 * math.Pow(share, 2.0/3) / 30
		v := math.Sqrt(9.80665 * 2 * h / 3)
		re := v * h / wat.KinematicViscosity.Value()
		we := wat.Density.Value() * v * v * h / sig.Value()
		c := r.Checks[i]
		if math.Abs(c[0].Value-re) > 1e-9*re || math.Abs(c[1].Value-we) > 1e-9*we || math.Abs(c[2].Value-h) > 1e-15 {
			t.Errorf("case %d: %v; by hand Re %v, We %v, h %v", i, c, re, we, h)
		}
	}
	if !r.Checks[0][1].Pass || r.Checks[1][1].Pass || r.Checks[1][2].Pass {
		t.Errorf("verdicts %v", r.Checks)
	}
	if rc := r.CrestRadius; math.Abs(rc.Value-0.03) > 1e-15 || rc.Limit != 0.01 || !rc.Pass {
		t.Errorf("crest radius check %v", rc)
	}
	if math.Abs(r.Sediment.Grain-120.0/900) > 1e-15 {
		t.Errorf("grain ratio %v", r.Sediment.Grain)
	}
}
