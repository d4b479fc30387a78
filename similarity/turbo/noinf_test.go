package turbo_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/turbo"
)

// errorClasses are the module's error classes; every error matches
// exactly one.
var errorClasses = []error{q.ErrDimension, q.ErrRange, q.ErrParse, q.ErrUnknown, q.ErrInvalid, similarity.ErrConflict}

// oneClass returns the one class err matches, or nil when it matches
// none or several.
func oneClass(err error) error {
	var got error
	for _, c := range errorClasses {
		if errors.Is(err, c) {
			if got != nil {
				return nil
			}
			got = c
		}
	}
	return got
}

// TestTurboNoSilentInf: each pump and turbine
// entry point, given finite inputs whose result overflows a float64 (or
// a NaN where its check missed one), refuses with a typed error of one
// class instead of returning ±Inf or NaN with a nil error. Each case
// gave +Inf, NaN or an underflowed zero with no error before.
func TestTurboNoSilentInf(t *testing.T) {
	const big, tiny, maxF = 1e300, 1e-300, math.MaxFloat64
	pa := func(v float64) q.Quantity { return q.New(v, q.Pressure) }
	rho := func(v float64) q.Quantity { return q.New(v, q.Density) }
	vel := func(v float64) q.Quantity { return q.New(v, q.Velocity) }
	m := func(v float64) q.Quantity { return q.New(v, q.Length) }
	npsh := func(in turbo.NPSHInput) error { _, err := turbo.NPSH(in); return err }
	for _, c := range []struct {
		name  string
		err   error
		class error
	}{
		{"NPSH, 1e300 Pa over 1e-300 kg/m³", npsh(turbo.NPSHInput{Pressure: pa(big), VapourPressure: pa(1), Density: rho(tiny), Velocity: vel(1)}), q.ErrRange},
		{"NPSH, 1e300 m/s", npsh(turbo.NPSHInput{Pressure: pa(2), VapourPressure: pa(1), Density: rho(1), Velocity: vel(big)}), q.ErrRange},
		{"NPSH, g = 1e-300", npsh(turbo.NPSHInput{Pressure: pa(big), VapourPressure: pa(1), Density: rho(1), Velocity: vel(1), Gravity: q.New(tiny, q.Acceleration)}), q.ErrRange},
		{"Thoma, 1e300 m over 1e-300 m", func() error { _, err := turbo.Thoma(turbo.Heads{NPSH: m(big), Head: m(tiny)}); return err }(), q.ErrRange},
		{"suction pressure, σ = 1e300", func() error {
			_, err := turbo.SuctionPressureFor(big, m(big), pa(1), rho(1), vel(1), q.Quantity{})
			return err
		}(), q.ErrRange},
		{"suction pressure, negative vapour pressure", func() error {
			_, err := turbo.SuctionPressureFor(0.1, m(10), pa(-1), rho(1000), vel(1), q.Quantity{})
			return err
		}(), q.ErrInvalid},
		{"specific speed of 1e300 rad/s, 1e300 m³/s, 1e-300 m", func() error {
			_, err := turbo.SpecificSpeedOf(q.New(big, q.AngularVelocity), q.New(big, q.VolumeFlowRate), m(tiny))
			return err
		}(), q.ErrRange},
		{"n_q = MaxFloat64 (its N_s overflows)", func() error { _, err := turbo.SpecificSpeedMetric(maxF); return err }(), q.ErrRange},
		{"n_q = NaN", func() error { _, err := turbo.SpecificSpeedMetric(math.NaN()); return err }(), q.ErrInvalid},
		{"N_s = −1", func() error { _, err := turbo.SpecificSpeedUS(-1); return err }(), q.ErrInvalid},
		{"N_s = 5e-324 (its Ω_s underflows)", func() error { _, err := turbo.SpecificSpeedUS(5e-324); return err }(), q.ErrRange},
		{"Ω_s = +Inf", func() error { _, err := turbo.SpecificSpeedDimensionless(math.Inf(1)); return err }(), q.ErrInvalid},
		{"Ω_s = MaxFloat64", func() error { _, err := turbo.SpecificSpeedDimensionless(maxF); return err }(), q.ErrRange},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if got := oneClass(c.err); got != c.class {
			t.Errorf("%s: %v: class %v, want %v alone", c.name, c.err, got, c.class)
		}
		var te *turbo.Error
		if !errors.As(c.err, &te) {
			t.Errorf("%s: %T is not a *turbo.Error", c.name, c.err)
		}
	}
}

// TestPumpCaution: the pump caution
// defers to local codes and licensed engineers.
func TestPumpCaution(t *testing.T) {
	for name, c := range map[string]string{"pump": turbo.PumpCaution} {
		for _, want := range []string{"local codes", "licensed engineers", "scale effects"} {
			if !strings.Contains(c, want) {
				t.Errorf("%s caution lacks %q: %s", name, want, c)
			}
		}
	}
}
