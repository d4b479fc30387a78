package turbo_test

import (
	"errors"
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestAffinity checks the pump affinity laws Q ∝ N·D³, gH ∝ N²·D²,
// P ∝ ρ·N³·D⁵ (common practice).
func TestAffinity(t *testing.T) {
	a, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 1450.0 / 1750, Diameter: 2.5, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	n, d := 1450.0/1750, 2.5
	want := []float64{n * d * d * d, n * n * d * d, n * n * n * math.Pow(d, 5), n * n * math.Pow(d, 5)}
	got := []float64{a.Flow, a.Head, a.Power, a.Torque}
	for i := range want {
		if math.Abs(got[i]/want[i]-1) > 1e-12 {
			t.Errorf("affinity %d: %v, want %v", i, got[i], want[i])
		}
	}
}

// TestMoody checks η_p = 1 − (1 − η_m)(D_m/D_p)^(1/5) against a value
// worked by hand: η_m = 0.85, D_m/D_p = 1/4 gives 0.886321.
func TestMoody(t *testing.T) {
	eta, err := turbo.MoodyStepUp(0.85, turbo.Diameters{Model: q.New(0.3, q.Length), Prototype: q.New(1.2, q.Length)}, turbo.MoodyStepUpOptions{})
	if err != nil || math.Abs(eta-0.886321) > 5e-7 {
		t.Errorf("Moody = %v, %v", eta, err)
	}
	if _, err := turbo.MoodyStepUp(1.2, turbo.Diameters{Model: q.New(0.3, q.Length), Prototype: q.New(1.2, q.Length)}, turbo.MoodyStepUpOptions{}); err == nil {
		t.Error("efficiency 1.2 accepted")
	}
}

// TestMoodyExponentNamed: the exponent is a named field, so it cannot be
// passed for the efficiency. By hand, η_m = 0.85, D_m/D_p = 1/4, n = 1/2:
// η_p = 1 − 0.15·(1/4)^(1/2) = 0.925. A diameter that is not a length is
// an ErrDimension.
func TestMoodyExponentNamed(t *testing.T) {
	d := turbo.Diameters{Model: q.New(0.3, q.Length), Prototype: q.New(1.2, q.Length)}
	if eta, err := turbo.MoodyStepUp(0.85, d, turbo.MoodyStepUpOptions{Exponent: 0.5}); err != nil || math.Abs(eta-0.925) > 1e-12 {
		t.Errorf("Moody n = 1/2: %v, %v; want 0.925", eta, err)
	}
	if _, err := turbo.MoodyStepUp(0.85, d, turbo.MoodyStepUpOptions{Exponent: 1.5}); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("exponent 1.5: %v, want ErrInvalid", err)
	}
	bad := turbo.Diameters{Model: q.New(0.3, q.Area), Prototype: q.New(1.2, q.Length)}
	if _, err := turbo.MoodyStepUp(0.85, bad, turbo.MoodyStepUpOptions{}); !errors.Is(err, q.ErrDimension) {
		t.Errorf("an area as diameter: %v, want ErrDimension", err)
	}
}
