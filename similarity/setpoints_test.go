package similarity_test

import (
	"fmt"
	"math"
	"slices"
	"testing"

	"github.com/google/go-cmp/cmp"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/units"
)

// TestSetPointsUnitsAndPrecision: a 1:25 Froude model in the same water.
// Set points without a chosen unit come in the unit quantity.String
// writes (Pa·s for a dynamic viscosity, not kg/(m·s)); every Number is
// the computed value at full precision; %.4g rounds only the text.
func TestSetPointsUnitsAndPrecision(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	proto := map[string]q.Quantity{
		"V":  q.New(8.5, q.Velocity),
		"L":  q.New(100, q.Length),
		"mu": q.New(0.0010016, q.DynamicViscosity), // fresh water at 20 °C, 1.0016 mPa·s (IAPWS 2008, from memory)
		"g":  q.New(9.80665, q.Acceleration),
	}
	sp, err := s.SetPoints(proto, map[string]string{"L": "mm"})
	if err != nil {
		t.Fatal(err)
	}
	// By hand: λ_L = 1/25, λ_V = λ_L^(1/2) = 0.2, λ_μ = 1 (the same
	// water), λ_g = 1: V_m = 8.5 × 0.2 m/s, L_m = 100 m/25 = 4000 mm.
	want := map[string]struct {
		n    float64
		unit string
		g4   string
	}{
		"V":  {8.5 * math.Sqrt(1.0/25), "m/s", "1.7 m/s"},
		"L":  {4000, "mm", "4000 mm"},
		"mu": {0.0010016, "Pa*s", "0.001002 Pa·s"},
		"g":  {9.80665, "m/s^2", "9.807 m/s²"},
	}
	keys := slices.Sorted(func(yield func(string) bool) {
		for k := range sp {
			if !yield(k) {
				return
			}
		}
	})
	if d := cmp.Diff([]string{"L", "V", "g", "mu"}, keys); d != "" {
		t.Fatalf("set point symbols (-want +got):\n%s", d)
	}
	for sym, w := range want {
		v := sp[sym]
		if math.Abs(v.Number/w.n-1) > 4e-16 {
			t.Errorf("%s: Number = %v, want %v (full precision)", sym, v.Number, w.n)
		}
		if v.Unit.String() != w.unit {
			t.Errorf("%s: unit %v, want %s", sym, v.Unit, w.unit)
		}
		if got := fmt.Sprintf("%.4g", v); got != w.g4 {
			t.Errorf("%s: %%.4g = %q, want %q", sym, got, w.g4)
		}
	}
	// The number is not rounded for display: 8.5 × 0.2 is not the
	// float64 nearest 1.7, and SetPoints keeps it.
	if v := sp["V"].Number; v != 8.5*math.Sqrt(1.0/25) || v == 1.7 {
		t.Errorf("V Number = %v, want the unrounded product %v", v, 8.5*math.Sqrt(1.0/25))
	}
}

// TestSetPointsDefaultIsDerivedUnit: for each dimension of a plan's
// variables, a set point without a chosen unit is in units.DerivedUnit
// where there is one, else in SI base units.
func TestSetPointsDefaultIsDerivedUnit(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 16, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	proto := map[string]q.Quantity{"V": q.New(3, q.Velocity), "mu": q.New(1e-3, q.DynamicViscosity), "rho": q.New(998.2, q.Density)}
	sp, err := s.SetPoints(proto, nil)
	if err != nil {
		t.Fatal(err)
	}
	for sym, v := range sp {
		want, ok := units.DerivedUnit(v.Unit.Dim())
		if !ok {
			want = units.BaseUnit(v.Unit.Dim())
		}
		if v.Unit != want {
			t.Errorf("%s in %v, want %v", sym, v.Unit, want)
		}
	}
}

// Model set points of a 1:25 Froude model in the same water (invented
// operating point). The Numbers are as computed; %.4g rounds the text an
// operator reads, and keeps the unit.
func ExampleSolution_SetPoints() {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		panic(err)
	}
	proto := map[string]q.Quantity{
		"V":  q.New(8.5, q.Velocity),
		"L":  q.New(100, q.Length),
		"mu": q.New(0.0010016, q.DynamicViscosity),
	}
	sp, err := s.SetPoints(proto, map[string]string{"L": "mm"})
	if err != nil {
		panic(err)
	}
	for _, sym := range []string{"V", "L", "mu"} {
		fmt.Printf("%-2s = %.4g\n", sym, sp[sym])
	}
	fmt.Printf("V as computed: %v\n", sp["V"])
	// Output:
	// V  = 1.7 m/s
	// L  = 4000 mm
	// mu = 0.001002 Pa·s
	// V as computed: 1.7000000000000002 m/s
}
