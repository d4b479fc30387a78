package turbo_test

import (
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
	"similis.dev/similis/units"
)

// TestSpecificSpeedsString: the three specific speeds print with their
// conventions. By hand for n = 1450 rpm, Q = 0.1 m³/s, H = 40 m:
// n_q = 1450·√0.1/40^¾ = 1450·0.316228/15.9054 = 28.83;
// N_s = n_q·√(60/3.785411784e-3)·0.3048^¾ = 28.8286·125.900·0.410208 = 1489
// (1 US gal = 3.785411784 L, 1 ft = 0.3048 m, NIST SP 811);
// Ω_s = n_q·(2π/60)/9.80665^¾ = 28.8286·0.104720/5.54163 = 0.5448.
func TestSpecificSpeedsString(t *testing.T) {
	s, err := turbo.SpecificSpeedOf(units.MustParse("rpm").Of(1450), q.New(0.1, q.VolumeFlowRate), q.New(40, q.Length))
	if err != nil {
		t.Fatal(err)
	}
	const want = "n_q = 28.83 (n in rpm, Q in m³/s, H in m); N_s = 1489 (n in rpm, Q in US gpm, H in ft); Ω_s = 0.5448 (dimensionless: ω in rad/s, Q in m³/s, gH in J/kg)"
	if got := s.String(); got != want {
		t.Errorf("String:\n got %s\nwant %s", got, want)
	}
}
