package main

import (
	"bytes"
	"math"
	"strings"
	"testing"
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

// TestByHand: in the ordinary tunnel the Mach number is held, so
// V_m = Ma·a₀ with a₀ = √(1.4·287.05287·288.15) = 340.294 m/s (ISO 2533
// sea level), and Re_m = ρ₀·V_m·(c/12)/μ₀ with ρ₀ = 1.2250 kg/m³ and
// μ₀ = 1.7894e-5 Pa·s.
func TestByHand(t *testing.T) {
	r, err := evaluate(&bytes.Buffer{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	vm := 0.62 * 340.294
	if math.Abs(r.OrdinarySpeed/vm-1) > 1e-5 {
		t.Errorf("V_m = %v, by hand %v", r.OrdinarySpeed, vm)
	}
	rem := 1.2250 * vm * 0.2 / 1.7894e-5
	if math.Abs(r.ReOrdinary/rem-1) > 1e-4 {
		t.Errorf("Re_m = %v, by hand %v", r.ReOrdinary, rem)
	}
	ref := r.Flight.Density.Value() * r.Speed * 2.4 / r.Flight.DynamicViscosity.Value()
	if math.Abs(r.ReFlight/ref-1) > 1e-12 {
		t.Errorf("Re = %v", r.ReFlight)
	}
	if !r.Cryogenic.Achieved && !r.Pressurised.Achieved {
		t.Error("neither tunnel holds both groups")
	}
}
