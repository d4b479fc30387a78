package similarity_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

var nan = math.NaN()

// TestFiniteOrError: every entry point returns a finite result or an
// error for the inputs a fuzzing review found giving NaN or ±Inf.
func TestFiniteOrError(t *testing.T) {
	sea, _ := fluids.SeaWater().AtCelsius(15)
	tank, _ := fluids.FreshWater().AtCelsius(15)
	hull := func(mod func(*similarity.HullTest)) error {
		h := similarity.HullTest{Scale: 1.0 / 16, ModelLength: q.New(2, q.Length), ModelWettedArea: q.New(1.6, q.Area),
			Speeds: []q.Quantity{q.New(1.5, q.Velocity)}, Resistances: []q.Quantity{q.New(10, q.Force)},
			Tank: tank,
			Sea:  sea}
		mod(&h)
		_, err := similarity.ExtrapolateHull(h)
		return err
	}
	std, _ := fluids.StandardAtmosphere(q.New(0, q.Length), fluids.Geometric)
	noSound := std
	noSound.SpeedOfSound = q.Quantity{}
	lim := similarity.TunnelLimits{MinTemperature: q.New(100, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	tunnel := func(st fluids.State, v float64) error {
		_, err := similarity.FindTunnelCondition(fluids.Air(), st, q.New(v, q.Velocity), q.New(2, q.Length), 0.1, lim)
		return err
	}
	derived := func(l float64) error {
		s, err := similarity.Froude(similarity.Scales{Length: l, Density: 1})
		if err != nil {
			return err
		}
		_, err = s.DerivedRatio(q.Power)
		return err
	}
	cases := []struct {
		name string
		err  error
	}{
		{"water at NaN °C", func() error { _, err := fluids.FreshWater().AtCelsius(nan); return err }()},
		{"water of NaN salinity", func() error { _, err := fluids.Water{Salinity: nan}.AtCelsius(15); return err }()},
		{"air at NaN pressure", func() error { _, err := fluids.Air().At(q.New(288, q.Temperature), q.New(nan, q.Pressure)); return err }()},
		{"water at negative pressure", func() error {
			_, err := fluids.FreshWater().At(q.New(288, q.Temperature), q.New(-1, q.Pressure))
			return err
		}()},
		{"gas with R = 0", func() error {
			_, err := fluids.IdealGas{GasName: "x", R: 0, Gamma: 1.4, Beta: 1e-6, S: 100}.At(q.New(288, q.Temperature), q.New(1e5, q.Pressure))
			return err
		}()},
		{"constant fluid of NaN density", func() error {
			_, err := fluids.Constant{FluidName: "oil", Density: q.New(nan, q.Density), Viscosity: q.New(0.1, q.DynamicViscosity)}.At(q.New(300, q.Temperature), q.New(1e5, q.Pressure))
			return err
		}()},
		{"constant fluid at −5 K", func() error {
			_, err := fluids.Constant{FluidName: "oil", Density: q.New(900, q.Density), Viscosity: q.New(0.1, q.DynamicViscosity)}.At(q.New(-5, q.Temperature), q.New(1e5, q.Pressure))
			return err
		}()},
		{"Froude power ratio at 1e-300", derived(1e-300)},
		{"affinity laws at 1e200", func() error {
			_, err := similarity.AffinityLaws(similarity.Scales{Speed: 1e200, Diameter: 1e200, Density: 1})
			return err
		}()},
		{"hull with NaN form factor", hull(func(h *similarity.HullTest) { h.FormFactor = nan })},
		{"hull with NaN allowance", hull(func(h *similarity.HullTest) { h.Allowance = nan })},
		{"hull with NaN gravity", hull(func(h *similarity.HullTest) { h.Gravity = q.New(nan, q.Acceleration) })},
		{"Moody with NaN exponent", func() error {
			_, err := similarity.MoodyStepUp(0.8, q.New(0.2, q.Length), q.New(1, q.Length), nan)
			return err
		}()},
		{"Prohaska on equal Froude numbers", func() error {
			_, err := similarity.Prohaska([]float64{0.1, 0.1, 0.1}, []float64{5e-3, 5e-3, 5e-3}, []float64{4e-3, 4e-3, 4e-3}, 0.2)
			return err
		}()},
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

// TestFixedRatioExact: a ratio the user fixed comes back as given, for
// every scale 1:2 … 1:1000, and a law of whole exponents is the product
// (λ_F = λ_L³ with the same fluid).
func TestFixedRatioExact(t *testing.T) {
	p := pigroups.MustProblem(pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"), pigroups.VarKind("rho", q.Density, "density"))
	bad := 0
	for n := 2; n <= 1000; n++ {
		l := 1 / float64(n)
		s, err := similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
			SameGravity("g").Fix("L", l).Fix("rho", 1).Basis("V", "L", "rho").Solve()
		if err != nil {
			t.Fatal(err)
		}
		r, _ := s.Ratio("L")
		f, _ := s.DerivedRatio(q.Force)
		if r.Value != l || f.Value != l*l*l {
			bad++
			if bad < 4 {
				t.Errorf("1:%d: λ_L = %v (want %v), λ_F = %v (want %v)", n, r.Value, l, f.Value, l*l*l)
			}
		}
	}
	if bad > 0 {
		t.Errorf("%d of 999 scales not returned exactly", bad)
	}
}

// TestScalesNamed: a rule takes its ratios by name; a missing one and one
// it does not use are refused with the field named, so swapped ratios
// cannot pass silently.
func TestScalesNamed(t *testing.T) {
	var pe *similarity.PlanError
	if _, err := similarity.Froude(similarity.Scales{Length: 0.04}); !errors.As(err, &pe) || pe.Symbol != "Density" {
		t.Errorf("missing density: %v", err)
	}
	if _, err := similarity.Froude(similarity.Scales{Length: 0.04, Density: 1, Velocity: 0.2}); !errors.As(err, &pe) || pe.Symbol != "Velocity" {
		t.Errorf("unused velocity: %v", err)
	}
	if _, err := similarity.AffinityLaws(similarity.Scales{Length: 0.5, Diameter: 0.5, Density: 1}); !errors.As(err, &pe) || pe.Symbol != "Length" && pe.Symbol != "Speed" {
		t.Errorf("a length for a speed: %v", err)
	}
	// Model/prototype everywhere: a model at 2× the speed and 1/2 the
	// diameter has λ_Q = 2·(1/2)³ = 1/4 (affinity laws, common practice).
	a, err := similarity.AffinityLaws(similarity.Scales{Speed: 2, Diameter: 0.5, Density: 1})
	if err != nil || math.Abs(a.Flow-0.25) > 1e-15 || math.Abs(a.Head-1) > 1e-15 || math.Abs(a.Power-2*2*2/32.0) > 1e-15 {
		t.Errorf("affinity %+v, %v", a, err)
	}
}

// TestGravityChecked: every method with an optional gravity takes g_n
// when it is unset and refuses a given one that is negative or not an
// acceleration, naming itself (the NPSH used to be reported as the
// ITTC-1978 prediction, and a hull run took a negative g).
func TestGravityChecked(t *testing.T) {
	neg := q.New(-9.81, q.Acceleration)
	npsh := func(g q.Quantity) error {
		_, err := similarity.NPSH(similarity.NPSHInput{Pressure: q.New(1e5, q.Pressure), VapourPressure: q.New(2339, q.Pressure),
			Density: q.New(998, q.Density), Velocity: q.New(3, q.Velocity), Gravity: g})
		return err
	}
	suction := func(g q.Quantity) error {
		_, err := similarity.SuctionPressureFor(0.1, q.New(30, q.Length), q.New(2339, q.Pressure), q.New(998, q.Density), q.New(3, q.Velocity), g)
		return err
	}
	blockage := func(g q.Quantity) error {
		_, err := similarity.TankBlockage(similarity.TankSection{Width: q.New(4, q.Length), Depth: q.New(2, q.Length)},
			q.New(0.05, q.Area), q.New(1, q.Velocity), g)
		return err
	}
	for _, c := range []struct {
		name string
		f    func(q.Quantity) error
	}{{"NPSH", npsh}, {"suction pressure", suction}, {"tank blockage correction", blockage}} {
		if err := c.f(q.Quantity{}); err != nil {
			t.Errorf("%s with g unset: %v", c.name, err)
		}
		err := c.f(neg)
		var ee *similarity.ExtrapolationError
		if !errors.As(err, &ee) || ee.Method != c.name {
			t.Errorf("%s with g < 0: %v", c.name, err)
		}
		if err := c.f(q.New(9.81, q.Velocity)); !errors.Is(err, q.ErrDimension) {
			t.Errorf("%s with g as a velocity: %v", c.name, err)
		}
	}
}
