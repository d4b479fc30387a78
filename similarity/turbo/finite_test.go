package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

var nan = math.NaN()

// TestFiniteOrError: every entry point returns a finite result or an
// error for the inputs a fuzzing review found giving NaN or ±Inf.
func TestFiniteOrError(t *testing.T) {
	cases := []struct {
		name string
		err  error
	}{
		{"affinity laws at 1e200", func() error {
			_, err := turbo.AffinityLaws(turbo.AffinityScales{RotationalSpeed: 1e200, Diameter: 1e200, Density: 1})
			return err
		}()},
		{"Moody with NaN exponent", func() error {
			_, err := turbo.MoodyStepUp(0.8, turbo.Diameters{Model: q.New(0.2, q.Length), Prototype: q.New(1, q.Length)}, turbo.MoodyStepUpOptions{Exponent: nan})
			return err
		}()},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
		}
	}
}
