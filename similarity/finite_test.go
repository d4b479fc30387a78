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
		{"water of NaN salinity", func() error { _, err := fluids.Water{Salinity: q.New(nan, q.Dimensionless)}.AtCelsius(15); return err }()},
		{"air at NaN pressure", func() error { _, err := fluids.Air().At(q.New(288, q.Temperature), q.New(nan, q.Pressure)); return err }()},
		{"water at negative pressure", func() error {
			_, err := fluids.FreshWater().At(q.New(288, q.Temperature), q.New(-1, q.Pressure))
			return err
		}()},
		{"gas with R = 0", func() error {
			_, err := fluids.IdealGas{GasName: "x", R: q.New(0, q.SpecificHeatCapacity), Gamma: 1.4, Beta: q.New(1e-6, fluids.SutherlandConstantDim), S: q.New(100, q.Temperature)}.At(q.New(288, q.Temperature), q.New(1e5, q.Pressure))
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
}
