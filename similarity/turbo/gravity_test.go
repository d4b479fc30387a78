package turbo_test

import (
	"errors"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestGravityChecked: every method with an optional gravity takes g_n
// when it is unset and refuses a given one that is negative or not an
// acceleration, naming itself (the NPSH used to be reported as the
// ITTC-1978 prediction, and a hull run took a negative g).
func TestGravityChecked(t *testing.T) {
	neg := q.New(-9.81, q.Acceleration)
	npsh := func(g q.Quantity) error {
		_, err := turbo.NPSH(turbo.NPSHInput{Pressure: q.New(1e5, q.Pressure), VapourPressure: q.New(2339, q.Pressure),
			Density: q.New(998, q.Density), Velocity: q.New(3, q.Velocity), Gravity: g})
		return err
	}
	suction := func(g q.Quantity) error {
		_, err := turbo.SuctionPressureFor(0.1, q.New(30, q.Length), q.New(2339, q.Pressure), q.New(998, q.Density), q.New(3, q.Velocity), g)
		return err
	}
	for _, c := range []struct {
		name string
		f    func(q.Quantity) error
	}{{"NPSH", npsh}, {"suction pressure", suction}} {
		if err := c.f(q.Quantity{}); err != nil {
			t.Errorf("%s with g unset: %v", c.name, err)
		}
		err := c.f(neg)
		var ee *turbo.Error
		if !errors.As(err, &ee) || ee.Op != c.name {
			t.Errorf("%s with g < 0: %v", c.name, err)
		}
		if err := c.f(q.New(9.81, q.Velocity)); !errors.Is(err, q.ErrDimension) {
			t.Errorf("%s with g as a velocity: %v", c.name, err)
		}
	}
}
