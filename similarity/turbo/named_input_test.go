package turbo_test

import (
	"errors"
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestBadInputNamed: an input that is not positive and finite is an
// ErrInvalid *Error whose Fault names that input.
func TestBadInputNamed(t *testing.T) {
	m := func(v float64) q.Quantity { return q.New(v, q.Length) }
	pa := func(v float64) q.Quantity { return q.New(v, q.Pressure) }
	npsh := turbo.NPSHInput{Pressure: pa(1e5), VapourPressure: pa(2339), Density: q.New(998, q.Density), Velocity: q.New(3, q.Velocity)}
	negP, nanV := npsh, npsh
	negP.Pressure = pa(-5e3)
	nanV.Velocity = q.New(math.NaN(), q.Velocity)
	for _, c := range []struct {
		name, input string
		err         error
	}{
		{"specific speed, head −30 m", "head", func() error {
			_, err := turbo.SpecificSpeedOf(q.New(150, q.AngularVelocity), q.New(0.1, q.VolumeFlowRate), m(-30))
			return err
		}()},
		{"Moody, prototype diameter +Inf", "prototype diameter", func() error {
			_, err := turbo.MoodyStepUp(0.8, turbo.Diameters{Model: m(0.3), Prototype: m(math.Inf(1))}, turbo.MoodyStepUpOptions{})
			return err
		}()},
		{"NPSH, pressure −5 kPa", "pressure", func() error { _, err := turbo.NPSH(negP); return err }()},
		{"NPSH, velocity NaN", "velocity", func() error { _, err := turbo.NPSH(nanV); return err }()},
	} {
		var e *turbo.Error
		if !errors.As(c.err, &e) || e.Input != c.input || !errors.Is(c.err, q.ErrInvalid) {
			t.Errorf("%s: %v, want an ErrInvalid *turbo.Error naming %q", c.name, c.err, c.input)
		}
	}
}
