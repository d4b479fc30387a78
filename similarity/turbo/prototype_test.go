package turbo_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestPrototypePointByHand carries a model point to a prototype twice the
// size at half the speed, with Moody's step-up, and checks each value by
// hand: λ_N = 2, λ_D = 0.5, λ_ρ = 1 give λ_Q = 2·0.5³ = 0.25 and
// λ_H = 2²·0.5² = 1, so Q_M = 25 L/s, H_M = 40 m carry to Q_P = 0.1 m³/s,
// H_P = 40 m (affinity laws, common practice). Moody (n = 1/5):
// η_P = 1 − (1 − 0.80)·0.5^0.2 = 1 − 0.2·0.870551 = 0.825890.
// P_P = ρgQH/η_P = 998.2·9.80665·0.1·40/0.825890 = 47410.67 W.
func TestPrototypePointByHand(t *testing.T) {
	a, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 2, Diameter: 0.5, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	d := turbo.Diameters{Model: q.New(0.25, q.Length), Prototype: q.New(0.5, q.Length)}
	etaP, err := turbo.MoodyStepUp(0.80, d, turbo.MoodyStepUpOptions{})
	if err != nil {
		t.Fatal(err)
	}
	in := turbo.PrototypeInput{Affinity: a,
		Model:   turbo.ModelPoint{Flow: q.New(0.025, q.VolumeFlowRate), Head: q.New(40, q.Length), Efficiency: 0.80},
		StepUp:  turbo.StepUpApplied{Method: "Moody, n = 1/5", Efficiency: etaP},
		Density: q.New(998.2, q.Density)}
	p, err := turbo.PrototypePointOf(in)
	if err != nil {
		t.Fatal(err)
	}
	near := func(got, want, tol float64) bool { return math.Abs(got-want) <= tol }
	if !near(p.Flow.Value(), 0.1, 1e-15) || !near(p.Head.Value(), 40, 1e-12) || !near(p.Efficiency, 0.825890, 1e-6) ||
		!near(p.Gain, 0.025890, 1e-6) || !near(p.Power.Value(), 47410.67, 0.01) || p.StepUp != "Moody, n = 1/5" ||
		p.ModelEfficiency != 0.80 || p.Caution != turbo.PumpCaution {
		t.Errorf("prototype point %+v", p)
	}
	cases := []struct {
		name string
		mod  func(*turbo.PrototypeInput)
		want string
		cl   error
	}{
		{"unnamed step-up", func(in *turbo.PrototypeInput) { in.StepUp.Method = "" }, "turbo: prototype point: StepUpApplied.Method is not set", q.ErrInvalid},
		{"step-up efficiency 1", func(in *turbo.PrototypeInput) { in.StepUp.Efficiency = 1 }, "turbo: prototype point: prototype efficiency 1 (Moody, n = 1/5) is not between 0 and 1", q.ErrInvalid},
		{"no density", func(in *turbo.PrototypeInput) { in.Density = q.Quantity{} }, "turbo: prototype point: wrong dimension: prototype density", q.ErrDimension},
		{"zero affinity", func(in *turbo.PrototypeInput) { in.Affinity = turbo.Affinity{} }, "turbo: prototype point: flow ratio 0 and head ratio 0", q.ErrInvalid},
	}
	for _, c := range cases {
		bad := in
		c.mod(&bad)
		_, err := turbo.PrototypePointOf(bad)
		if err == nil || !strings.HasPrefix(err.Error(), c.want) || !errors.Is(err, c.cl) || !errors.As(err, new(*turbo.Error)) {
			t.Errorf("%s: %v, want %q", c.name, err, c.want)
		}
	}
}
