package ship_test

import (
	"errors"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/ship"
)

// TestGravityChecked: every method with an optional gravity takes g_n
// when it is unset and refuses a given one that is negative or not an
// acceleration, naming itself (the NPSH used to be reported as the
// ITTC-1978 prediction, and a hull run took a negative g).
func TestGravityChecked(t *testing.T) {
	neg := q.New(-9.81, q.Acceleration)
	blockage := func(g q.Quantity) error {
		_, err := ship.TankBlockage(ship.TankSection{Width: q.New(4, q.Length), Depth: q.New(2, q.Length)},
			q.New(0.05, q.Area), q.New(1, q.Velocity), g)
		return err
	}
	for _, c := range []struct {
		name string
		f    func(q.Quantity) error
	}{{"tank blockage correction", blockage}} {
		if err := c.f(q.Quantity{}); err != nil {
			t.Errorf("%s with g unset: %v", c.name, err)
		}
		err := c.f(neg)
		var ee *ship.Error
		if !errors.As(err, &ee) || ee.Op != c.name {
			t.Errorf("%s with g < 0: %v", c.name, err)
		}
		if err := c.f(q.New(9.81, q.Velocity)); !errors.Is(err, q.ErrDimension) {
			t.Errorf("%s with g as a velocity: %v", c.name, err)
		}
	}
}
