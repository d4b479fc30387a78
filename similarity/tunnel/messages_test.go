package tunnel_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// model3D is a 1:12 model in a closed 2.0 × 1.5 m section (C = 3 m²)
// with the curvature correction on, at Mach ma with lift slope a.
func model3D(ma, a float64) tunnel.Model3D {
	return tunnel.Model3D{WingArea: quantity.New(38.0/144, quantity.Area), TunnelArea: quantity.New(3, quantity.Area),
		ModelVolume: quantity.New(0.01, quantity.Volume), ShapeFactor: 0.86, Delta: 0.12, AlphaDeg: 3, CL: 0.6, CD: 0.035, CM: -0.03,
		CurvatureFactor: 0.12, LiftSlopePerDeg: a, TailCurvatureFactor: 0.55, TailMomentSlopePerDeg: -0.025, Mach: ma}
}

// TestWalls3DMachFirst: above Ma 0.8 the 3-D correction's refusal gives
// the Mach number as its reason, as the 2-D one does, even when the lift
// slope raised to that Mach number by the Prandtl–Glauert factor is out
// of its range too: 0.0803·√(1 − 0.2²)/√(1 − 0.95²) = 0.0803·0.97980/0.31225
// = 0.2520 per degree, above 0.2 (by hand).
func TestWalls3DMachFirst(t *testing.T) {
	a := 0.0803 * math.Sqrt(1-0.2*0.2) / math.Sqrt(1-0.95*0.95)
	if math.Abs(a-0.2520) > 5e-5 {
		t.Fatalf("hand slope %v", a)
	}
	_, err := tunnel.CorrectWalls3D(model3D(0.95, a))
	if !errors.Is(err, quantity.ErrRange) {
		t.Fatalf("err = %v, want ErrRange", err)
	}
	var te *tunnel.Error
	if !errors.As(err, &te) || te.Input != "test-section Mach number" {
		t.Fatalf("err = %#v, want the Mach number named", err)
	}
	if want := "test-section Mach number 0.95 outside 0 … 0.8"; !strings.Contains(err.Error(), want) || strings.Contains(err.Error(), "lift slope") {
		t.Errorf("err = %q, want %q and no word of the lift slope", err, want)
	}
	// A Mach number just above the bound prints with the figures that
	// show it is above: 0.80001, not 0.8.
	_, err = tunnel.CorrectWalls3D(model3D(0.80001, 0.1))
	if err == nil || !strings.Contains(err.Error(), "0.80001 outside 0 … 0.8") {
		t.Errorf("err = %v", err)
	}
}

// TestWalls3DSlopeMessage: a lift slope past the stall is refused with
// the slope to three significant figures (not 17), named as
// LiftSlopePerDeg, class ErrRange, and called past the stall.
func TestWalls3DSlopeMessage(t *testing.T) {
	_, err := tunnel.CorrectWalls3D(model3D(0.2, -0.002833243330430501))
	var te *tunnel.Error
	if !errors.As(err, &te) || !errors.Is(err, quantity.ErrRange) || te.Input != "LiftSlopePerDeg" {
		t.Fatalf("err = %#v", err)
	}
	msg := err.Error()
	for _, want := range []string{"lift slope -0.00283 per degree", "past the stall"} {
		if !strings.Contains(msg, want) {
			t.Errorf("err = %q lacks %q", msg, want)
		}
	}
	if strings.Contains(msg, "0028332") {
		t.Errorf("err = %q: too many figures", msg)
	}
	// The reduction refuses the same slope before it reads any point, so
	// that the refusal is not pinned on whichever point came first.
	red := tunnel.Reduction{Walls: model3D(0, -0.002833243330430501)}
	_, err = red.Reduce(tunnel.Point{})
	if !errors.As(err, &te) || te.Op != "reduction" || te.Input != "Walls.LiftSlopePerDeg" || !strings.Contains(err.Error(), "every point") {
		t.Errorf("Reduce err = %v", err)
	}
}

// TestFinderNoteInBar: at sea level (ISO 2533: ρ = 1.225 kg/m³,
// μ = 1.7894e-5 Pa·s, a = 340.294 m/s) and Ma 0.62, chord 2.4 m,
// Re = 1.225·210.98·2.4/1.7894e-5 = 3.466e7. A 1:12 air model (0.2 m)
// at the lowest total temperature 280 K: T = 280/(1 + 0.2·0.62²) =
// 260.01 K, V_m = 0.62·√(1.4·287.05·260.01) = 200.41 m/s,
// μ(T) = 1.458e-6·T^1.5/(T + 110.4) = 1.6503e-5 Pa·s, so
// p = Re·μ·R·T/(V_m·0.2) = 1.0652e6 Pa and p₀ = p·1.07688^3.5 = 1.3804e6 Pa:
// the note says 13.8 bar, in the bar its report prints, not 1.38e+06 Pa.
func TestFinderNoteInBar(t *testing.T) {
	proto, err := fluids.StandardAtmosphere(quantity.New(0, quantity.Length), fluids.Geometric)
	if err != nil {
		t.Fatal(err)
	}
	V := 0.62 * proto.SpeedOfSound.Value()
	lim := tunnel.Limits{MinTemperature: quantity.New(280, quantity.Temperature), MaxTemperature: quantity.New(320, quantity.Temperature),
		MinPressure: quantity.New(2e4, quantity.Pressure), MaxPressure: quantity.New(4e5, quantity.Pressure)}
	c, err := tunnel.FindCondition(fluids.Air(), proto, quantity.New(V, quantity.Velocity), quantity.New(2.4, quantity.Length), 1.0/12, lim)
	if err != nil {
		t.Fatal(err)
	}
	f := 1 + 0.2*0.62*0.62
	T := 280 / f
	vm := 0.62 * math.Sqrt(1.4*287.05*T)
	mu := 1.458e-6 * T * math.Sqrt(T) / (T + 110.4)
	re := 1.225 * 0.62 * 340.294 * 2.4 / 1.7894e-5
	p0 := re * mu * 287.05 * T / (vm * 0.2) * math.Pow(f, 3.5)
	if math.Abs(p0/1.3804e6-1) > 1e-4 {
		t.Fatalf("hand p₀ = %v", p0)
	}
	if want := "needs a total pressure of 13.8 bar (absolute)"; !strings.Contains(c.Note, want) {
		t.Errorf("note %q lacks %q", c.Note, want)
	}
}
