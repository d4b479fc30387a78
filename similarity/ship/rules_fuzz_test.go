package ship_test

import (
	"math"
	"testing"

	"similis.dev/similis/similarity/ship"
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
		if cf, err := ship.ITTC1957(a); err == nil {
			finite("ITTC1957", cf)
		}
	})
}
