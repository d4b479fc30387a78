package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/turbo"
)

// TestMoodyCurve: Moody's formula, η_p = 1 − (1 − η_m)(D_m/D_p)^(1/5)
// (Moody, 1925), taken at the best-efficiency point and its gain added
// along the curve (common practice), against each point stepped up on its
// own, worked by hand for D_m/D_p = 1/4.
func TestMoodyCurve(t *testing.T) {
	etas := []float64{0.50, 0.80, 0.86, 0.78}
	dm, dp := q.New(0.25, q.Length), q.New(1.0, q.Length)
	k := math.Pow(0.25, 0.2) // 0.757858
	gain := (1 - 0.86) * (1 - k)
	at, err := turbo.MoodyCurve(etas, turbo.Diameters{Model: dm, Prototype: dp}, turbo.MoodyStepUpOptions{}, turbo.StepUpAtBEP)
	if err != nil {
		t.Fatal(err)
	}
	if at.BEP != 2 || math.Abs(at.Gain-gain) > 1e-15 {
		t.Errorf("BEP %d, gain %v; want 2, %v", at.BEP, at.Gain, gain)
	}
	each, _ := turbo.MoodyCurve(etas, turbo.Diameters{Model: dm, Prototype: dp}, turbo.MoodyStepUpOptions{}, turbo.StepUpEachPoint)
	for i, e := range etas {
		if math.Abs(at.Efficiency[i]-(e+gain)) > 1e-15 {
			t.Errorf("at BEP, point %d: %v", i, at.Efficiency[i])
		}
		if math.Abs(each.Efficiency[i]-(1-(1-e)*k)) > 1e-15 {
			t.Errorf("each point, point %d: %v", i, each.Efficiency[i])
		}
	}
	// At part load the per-point formula gains (1 − 0.5)(1 − k) = 12.1
	// points, against 3.4 at the best-efficiency point.
	if d := each.Efficiency[0] - etas[0]; math.Abs(d-0.5*(1-k)) > 1e-15 || d < 3*gain {
		t.Errorf("part-load gain %v", d)
	}
	if _, err := turbo.MoodyCurve([]float64{0.8, 1.2}, turbo.Diameters{Model: dm, Prototype: dp}, turbo.MoodyStepUpOptions{}, turbo.StepUpAtBEP); err == nil {
		t.Error("efficiency 1.2 accepted")
	}
}

// TestIsentropic checks the perfect-gas isentropic relations, γ = 1.4,
// against the compressible-flow table values of NACA Report 1135 (1953)
// (quoted from memory, 4 digits): at Ma = 0.5, T/T₀ = 0.9524 and
// p/p₀ = 0.8430; at Ma = 1, T/T₀ = 0.8333 and p/p₀ = 0.5283; at Ma = 2,
// T/T₀ = 0.5556 and p/p₀ = 0.1278.
func TestIsentropic(t *testing.T) {
	for _, c := range []struct{ ma, tt, pp float64 }{{0.5, 0.9524, 0.8430}, {1, 0.8333, 0.5283}, {2, 0.5556, 0.1278}} {
		tr, pr, err := fluids.TotalRatios(1.4, c.ma)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(1/tr-c.tt) > 5e-5 || math.Abs(1/pr-c.pp) > 5e-5 {
			t.Errorf("Ma %g: T/T₀ = %.5f, p/p₀ = %.5f", c.ma, 1/tr, 1/pr)
		}
	}
	tot := fluids.Total{Temperature: q.New(300, q.Temperature), Pressure: q.New(2e5, q.Pressure)}
	s, err := fluids.Air().StaticAt(tot, 0.8)
	if err != nil {
		t.Fatal(err)
	}
	back, err := fluids.Air().TotalOf(s, 0.8)
	if err != nil || math.Abs(back.Temperature.Value()-300) > 1e-9 || math.Abs(back.Pressure.Value()-2e5) > 1e-6 {
		t.Errorf("round trip %v, %v", back, err)
	}
	for _, bad := range []float64{-1, math.NaN(), math.Inf(1)} {
		if _, _, err := fluids.TotalRatios(1.4, bad); err == nil {
			t.Errorf("Ma %v accepted", bad)
		}
	}
}
