package ship_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

var nan = math.NaN()

// TestFiniteOrError: every entry point returns a finite result or an
// error for the inputs a fuzzing review found giving NaN or ±Inf.
func TestFiniteOrError(t *testing.T) {
	sea, _ := fluids.SeaWater().AtCelsius(15)
	tank, _ := fluids.FreshWater().AtCelsius(15)
	hull := func(mod func(*ship.HullTest)) error {
		h := ship.HullTest{Scale: 1.0 / 16, ModelLength: q.New(2, q.Length), ModelWettedArea: q.New(1.6, q.Area),
			Speeds: []q.Quantity{q.New(1.5, q.Velocity)}, Resistances: []q.Quantity{q.New(10, q.Force)},
			Tank: tank,
			Sea:  sea}
		mod(&h)
		_, err := ship.ExtrapolateHull(h)
		return err
	}
	cases := []struct {
		name string
		err  error
	}{
		{"hull with NaN form factor", hull(func(h *ship.HullTest) { h.FormFactor = nan })},
		{"hull with NaN allowance", hull(func(h *ship.HullTest) { h.Allowance = nan })},
		{"hull with NaN gravity", hull(func(h *ship.HullTest) { h.Gravity = q.New(nan, q.Acceleration) })},
		{"Prohaska on equal Froude numbers", func() error {
			_, err := ship.Prohaska([]float64{0.1, 0.1, 0.1}, []float64{5e-3, 5e-3, 5e-3}, []float64{4e-3, 4e-3, 4e-3}, 0.2)
			return err
		}()},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
		}
	}
}
