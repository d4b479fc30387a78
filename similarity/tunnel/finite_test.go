package tunnel_test

import (
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// TestFiniteOrError: every entry point returns a finite result or an
// error for the inputs a fuzzing review found giving NaN or ±Inf.
func TestFiniteOrError(t *testing.T) {
	std, _ := fluids.StandardAtmosphere(q.New(0, q.Length), fluids.Geometric)
	noSound := std
	noSound.SpeedOfSound = q.Quantity{}
	lim := tunnel.Limits{MinTemperature: q.New(100, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	tunnel := func(st fluids.State, v float64) error {
		_, err := tunnel.FindCondition(fluids.Air(), st, q.New(v, q.Velocity), q.New(2, q.Length), 0.1, lim)
		return err
	}
	cases := []struct {
		name string
		err  error
	}{
		{"tunnel with a fluid without a speed of sound", tunnel(noSound, 100)},
		{"tunnel at zero speed", tunnel(std, 0)},
		{"tunnel at negative speed", tunnel(std, -50)},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
		}
	}
}
