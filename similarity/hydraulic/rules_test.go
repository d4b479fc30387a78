package hydraulic_test

import (
	"math"
	"testing"

	"similis.dev/similis/similarity/hydraulic"
)

// TestManningRatio: Manning's n in a Froude model scales as λ_L^(1/6)
// (common practice).
func TestManningRatio(t *testing.T) {
	// Manning's n in a Froude model: λ_L^(1/6) (common practice).
	n, err := hydraulic.ManningRatio(1.0 / 30)
	if math.Abs(n-math.Pow(30, -1.0/6)) > 1e-15 || err != nil {
		t.Errorf("Manning ratio %v, %v", n, err)
	}
}

// TestDistorted checks a distorted Froude model, 1:400 across and 1:80
// deep, against the ratios worked by hand.
func TestDistorted(t *testing.T) {
	dd, err := hydraulic.DistortedFroude(hydraulic.DistortedScales{Horizontal: 1.0 / 400, Vertical: 1.0 / 80})
	if err != nil {
		t.Fatal(err)
	}
	// By hand: λ_V = (1/80)^½, λ_Q = (1/400)(1/80)^(3/2), λ_t = (1/400)/(1/80)^½.
	if math.Abs(dd.Velocity-math.Sqrt(1.0/80)) > 1e-14 || math.Abs(dd.Discharge/(math.Pow(1.0/80, 1.5)/400)-1) > 1e-12 ||
		math.Abs(dd.Time/((1.0/400)/math.Sqrt(1.0/80))-1) > 1e-12 || dd.Distortion != 5 {
		t.Errorf("distorted: %+v", dd)
	}
}
