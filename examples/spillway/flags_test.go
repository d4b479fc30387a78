package main

import (
	"bytes"
	"errors"
	"math"
	"strings"
	"testing"
	"unicode/utf8"

	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/similarity/fluids"
)

// TestSpillwayFlagsRefuse: a non-finite or out-of-range number, and a
// vertical scale larger than the horizontal, are usage errors naming the
// flag (exit 2); before, -scale +Inf printed a "1:+Inf" model.
func TestSpillwayFlagsRefuse(t *testing.T) {
	for _, c := range []struct {
		args []string
		flag string
	}{
		{[]string{"-scale", "+Inf"}, "-scale"},
		{[]string{"-scale", "NaN"}, "-scale"},
		{[]string{"-scale", "1"}, "-scale"},
		{[]string{"-q", "-5"}, "-q"},
		{[]string{"-q", "1e400"}, "-q"},
		{[]string{"-hscale", "Inf"}, "-hscale"},
		{[]string{"-vscale", "0"}, "-vscale"},
		{[]string{"-hscale", "60", "-vscale", "120"}, "-vscale"},
		{[]string{"-n", "0.001"}, "-n"},
		{[]string{"-d50", "0.01"}, "-d50"},
	} {
		var out bytes.Buffer
		err := run(&out, c.args)
		var ce *cli.Error
		if !errors.As(err, &ce) || !strings.Contains(err.Error(), c.flag) {
			t.Errorf("%v: %v (%T), want a usage error naming %s", c.args, err, err, c.flag)
		}
		if strings.Contains(out.String(), "Inf") {
			t.Errorf("%v printed %q", c.args, out.String())
		}
	}
}

// TestSpillwayHelp: -h says what the program does and what its output
// means, and gives every flag's range.
func TestSpillwayHelp(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, []string{"-h"}); err == nil {
		t.Fatal("-h: no ErrHelp")
	}
	for _, want := range []string{"Plans a Froude-scale model", "1:x means", "critical velocity", "invented", "caution",
		"-scale", "(2 … 500)", "-q", "-hscale", "-vscale", "-n", "-d50",
		"EXCLUDED from the rating", "EXTRAPOLATED", "scale effects are\nnot in the band", "-out", "-width", "-height", "-dpi"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("-h lacks %q:\n%s", want, out.String())
		}
	}
}

// TestSpillwayLabels: the report says which velocity V is and where
// (critical, for the unit discharge over the crest: at the design
// discharge q = 0.091287/0.76 = 0.12011 m²/s, V = (9.80665·q)^(1/3) =
// 1.0561 m/s) and that Re and We are both formed with the head h; it ends with the caution deferring to local codes and licensed
// engineers.
func TestSpillwayLabels(t *testing.T) {
	var out bytes.Buffer
	if err := run(&out, noPlot); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{
		"V = (g·q)^(1/3) is the critical velocity for the unit discharge q = Q/b over the model crest",
		"Re = V·h/ν and We = ρV²h/σ are both formed with this V and the length h",
		"critical velocity V = 1.056 m/s",
		"local codes", "licensed engineers",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestSpillwayRoughnessAndGrainByHand: the 1:30 chute with a prototype n
// of 0.014 needs 0.014·30^(−1/6) = 0.0079422 s·m^(−1/3), below plastic's
// 0.009, and the report flags it. In the invented approach reach u* =
// √(9.80665·5·0.0002) = 0.0990285 m/s; with d50 = 1 mm and ν(15 °C) =
// 1.13859e-6 m²/s (python3-iapws, IAPWS-95 at 0.101325 MPa: μ =
// 1.137568 mPa·s, ρ = 999.1026 kg/m³) Re*_p =
// 86.97 (the package's water viscosity, which the program uses, agrees
// with IAPWS to 0.1 %, the tolerance below); the distorted 1:120 × 1:30 reach scales Re* by
// √(120/900)·(120/900) = 0.048686, so the model grain (0.1333 mm) has
// Re* = 4.234, in the viscous range below 5, and the report flags it.
func TestSpillwayRoughnessAndGrainByHand(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, noPlot)
	if err != nil {
		t.Fatal(err)
	}
	if n := 0.014 * math.Pow(30, -1.0/6); math.Abs(r.ManningCheck.Value-n) > 1e-15 || math.Abs(n-0.0079422) > 1e-7 || r.ManningCheck.Pass {
		t.Errorf("Manning check %+v, by hand %v", r.ManningCheck, n)
	}
	us := math.Sqrt(9.80665 * 5 * 0.0002)
	if math.Abs(us-0.0990285) > 1e-7 || math.Abs(r.ProtoShearVelocity-us) > 1e-15 {
		t.Errorf("u* = %v, by hand %v", r.ProtoShearVelocity, us)
	}
	w, _ := fluids.FreshWater().AtCelsius(15)
	if math.Abs(w.KinematicViscosity.Value()/1.13859e-6-1) > 1e-3 {
		t.Errorf("ν(15 °C) = %v, IAPWS 1.13859e-6", w.KinematicViscosity)
	}
	rp := us * 0.001 / 1.13859e-6
	ratio := math.Sqrt(120.0/900) * 120.0 / 900
	if math.Abs(r.ProtoReStar/rp-1) > 1e-3 || math.Abs(ratio-0.048686) > 1e-6 {
		t.Errorf("Re*_p = %v, by hand %v", r.ProtoReStar, rp)
	}
	if c := r.ReStarCheck; math.Abs(c.Value/(rp*ratio)-1) > 1e-3 || math.Abs(rp*ratio-4.234) > 1e-3 || c.Pass || c.Limit != 5 {
		t.Errorf("model Re* check %+v, by hand %v", c, rp*ratio)
	}
	if math.Abs(r.ModelGrain-0.001*120/900) > 1e-18 {
		t.Errorf("model grain %v m", r.ModelGrain)
	}
	for _, want := range []string{"model Manning n = 0.00794 s·m^(−1/3) (limit ≥ 0.009", "FAILS: no model material is this smooth",
		"model grain Re* = u*·d/ν = 4.23 (limit ≥ 5", "FAILS: the grain is in the viscous range"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
	// A coarser prototype bed (4 mm) keeps the model grain out of the
	// viscous range: Re* = 4·4.234.
	r, err = evaluate(&bytes.Buffer{}, []string{"-d50", "4", "-out", ""})
	if err != nil || !r.ReStarCheck.Pass {
		t.Errorf("-d50 4: %+v, %v", r.ReStarCheck, err)
	}
}

// FuzzSpillwayFlags runs the program with fuzzed flag values: it never
// panics, a refusal is a usage error naming a flag, and a run that
// succeeds prints no NaN or Inf.
func FuzzSpillwayFlags(f *testing.F) {
	f.Add(uint8(0), "30", uint8(1), "450")
	f.Add(uint8(2), "1e-300", uint8(3), "5e-324")
	f.Add(uint8(0), "500", uint8(1), "1e5")
	f.Add(uint8(4), "0.2", uint8(5), "100")
	names := []string{"-scale", "-q", "-hscale", "-vscale", "-n", "-d50", "-width", "-height", "-dpi"}
	f.Fuzz(func(t *testing.T, i uint8, a string, j uint8, b string) {
		args := []string{names[int(i)%len(names)], a, names[int(j)%len(names)], b, "-out", ""}
		var out bytes.Buffer
		err := run(&out, args)
		if err != nil {
			var ce *cli.Error
			if !errors.As(err, &ce) || !strings.Contains(err.Error(), "-") {
				t.Fatalf("%q: %v (%T), want a usage error naming the flag", args, err, err)
			}
			if utf8.RuneCountInString(err.Error()) > 6*cli.MaxEcho+200 {
				t.Fatalf("%q: message of %d runes", args, utf8.RuneCountInString(err.Error()))
			}
			return
		}
		if s := out.String(); strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
			t.Fatalf("%q printed a non-finite number:\n%s", args, s)
		}
	})
}
