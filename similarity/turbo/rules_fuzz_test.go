package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// FuzzRules runs the package's rules over the whole float range: every
// result is finite and positive, or an error.
func FuzzRules(f *testing.F) {
	f.Add(0.04, 1.0, 1.0)
	f.Add(1e-300, 1e300, math.NaN())
	f.Add(-1.0, math.Inf(1), 0.0)
	f.Fuzz(func(t *testing.T, a, b, c float64) {
		finite := func(name string, xs ...float64) {
			for _, x := range xs {
				if !(x > 0) || math.IsInf(x, 0) {
					t.Fatalf("%s(%v, %v, %v) gives %v", name, a, b, c, x)
				}
			}
		}
		if af, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: a, Diameter: b, Density: c}); err == nil {
			finite("AffinityLaws", af.Flow, af.Head, af.Power, af.Torque)
		}
		if eta, err := turbo.MoodyStepUp(a, turbo.Diameters{Model: q.New(b, q.Length), Prototype: q.New(c, q.Length)}, turbo.MoodyStepUpOptions{Exponent: 0.2}); err == nil {
			finite("MoodyStepUp", eta)
		}
	})
}
