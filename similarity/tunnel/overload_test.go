package tunnel_test

import (
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// TestOverloadAdvice checks that an overloaded condition's advice can be
// followed: a tunnel already at its minimum total pressure is not told
// to lower it, and elsewhere a lower total pressure is said to cost
// Reynolds number. The aircraft is cruising at Ma 0.85 at 18 km with a
// 2.4 m chord; the model is 1:12 with C·S = 0.6 × 38/144 m² against a
// 4 kN rating (the tunnel example's invented figures).
func TestOverloadAdvice(t *testing.T) {
	flight, err := fluids.StandardAtmosphere(q.New(18000, q.Length), fluids.Geometric)
	if err != nil {
		t.Fatal(err)
	}
	V := q.New(0.85*flight.SpeedOfSound.Value(), q.Velocity)
	L := q.New(2.4, q.Length)
	rated, area := q.New(4000, q.Force), q.New(0.6*38.0/144, q.Area)
	cryo := tunnel.Limits{MinTemperature: q.New(110, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(1e5, q.Pressure), MaxPressure: q.New(4.5e5, q.Pressure), RatedLoad: rated, LoadArea: area}
	warm := tunnel.Limits{MinTemperature: q.New(280, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(4e5, q.Pressure), RatedLoad: rated, LoadArea: area}
	for _, tc := range []struct {
		name    string
		gas     fluids.IdealGas
		lim     tunnel.Limits
		binding string
		want    []string
		mustNot string
	}{
		{"cryogenic at its minimum p₀", fluids.Nitrogen(), cryo, "minimum total pressure",
			[]string{"at its minimum total pressure already", "smaller model", "stronger balance", "lose the Reynolds number"},
			"lower the total pressure"},
		{"pressurised at its coldest", fluids.Air(), warm, "minimum total temperature",
			[]string{"smaller model", "stronger balance", "gives up part of the Reynolds number"}, "minimum total pressure already"},
	} {
		c, err := tunnel.FindCondition(tc.gas, flight, V, L, 1.0/12, tc.lim)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if !c.Overloaded || !strings.Contains(strings.Join(c.Binding, ", "), tc.binding) {
			t.Fatalf("%s: overloaded %v, binding %q; want an overload set by the %s", tc.name, c.Overloaded, c.Binding, tc.binding)
		}
		var over string
		for _, s := range c.Cautions {
			if strings.HasPrefix(s, "OVERLOAD") {
				over = s
			}
		}
		for _, w := range tc.want {
			if !strings.Contains(over, w) {
				t.Errorf("%s: overload caution %q lacks %q", tc.name, over, w)
			}
		}
		if !strings.Contains(over, " kPa exceeds") || strings.Contains(over, "e+0") {
			t.Errorf("%s: overload caution %q: want q in kPa in plain figures", tc.name, over)
		}
		if strings.Contains(over, tc.mustNot) {
			t.Errorf("%s: overload caution %q says %q", tc.name, over, tc.mustNot)
		}
	}
}

// TestFitPolarTooFewSaysNearest: a range holding two points names the
// nearest points outside it, the ones a wider range takes in first.
func TestFitPolarTooFewSaysNearest(t *testing.T) {
	al := []float64{-4.138, 10.671, 12.733, 14.759, 16.725}
	cl := []float64{-0.2, 0.98, 1.07, 1.11, 1.06}
	cd := []float64{0.025, 0.079, 0.11, 0.135, 0.149}
	_, err := tunnel.FitPolar(al, cl, cd, 12, 16, 0.95)
	want := "2 points in the linear range 12 … 16°: want at least 3; the nearest points outside it are at 10.671° below and 16.725° above"
	if err == nil || !strings.Contains(err.Error(), want) {
		t.Errorf("got %v, want %q", err, want)
	}
}
