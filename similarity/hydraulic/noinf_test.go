package hydraulic_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/hydraulic"
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

// TestHydraulicNoSilentInf: each hydraulic-model
// entry point, given finite inputs whose result overflows a float64 (or
// a NaN where its check missed one), refuses with a typed error of one
// class instead of returning ±Inf or NaN with a nil error. Each case
// gave +Inf, NaN or an underflowed zero with no error before.
func TestHydraulicNoSilentInf(t *testing.T) {
	const big, tiny, maxF = 1e300, 1e-300, math.MaxFloat64
	pa := func(v float64) q.Quantity { return q.New(v, q.Pressure) }
	rho := func(v float64) q.Quantity { return q.New(v, q.Density) }
	vel := func(v float64) q.Quantity { return q.New(v, q.Velocity) }
	m := func(v float64) q.Quantity { return q.New(v, q.Length) }
	nu, sig := q.New(1e-6, q.KinematicViscosity), q.New(0.073, q.SurfaceTension)
	shields := func(tau, d, grav float64) error {
		_, _, err := hydraulic.Shields(hydraulic.ShieldsInput{BedShearStress: pa(tau), GrainDensity: rho(2650), WaterDensity: rho(1000), GrainDiameter: m(d), KinematicViscosity: nu, Gravity: q.New(grav, q.Acceleration)})
		return err
	}
	sediment := func(h, v, delta, n float64) error {
		_, err := hydraulic.SedimentFor(hydraulic.SedimentRatios{Horizontal: h, Vertical: v, RelativeDensity: delta, Viscosity: n})
		return err
	}
	free := func(v, h float64, lim hydraulic.FreeSurfaceLimits) error {
		_, err := hydraulic.FreeSurfaceChecks(vel(v), m(h), nu, rho(1000), sig, lim)
		return err
	}
	nanLim := hydraulic.DefaultFreeSurfaceLimits()
	nanLim.MinReynolds = math.NaN()
	for _, c := range []struct {
		name  string
		err   error
		class error
	}{
		{"free-surface checks at 1e300 m/s and 1e300 m", free(big, big, hydraulic.DefaultFreeSurfaceLimits()), q.ErrRange},
		{"free-surface checks at 1e-300 m/s and 1e-300 m", free(tiny, tiny, hydraulic.DefaultFreeSurfaceLimits()), q.ErrRange},
		{"free-surface checks with a NaN Reynolds limit", free(1, 0.1, nanLim), q.ErrInvalid},
		{"Shields, 1e300 Pa on a 1e-300 m grain", shields(big, tiny, 9.81), q.ErrRange},
		{"Shields, g = MaxFloat64", shields(1, 1e-3, maxF), q.ErrRange},
		{"sediment scales, 1e-300 across and 1e300 deep", sediment(tiny, big, 1, 1), q.ErrRange},
		{"sediment scales, λ_Δ = λ_ν = 1e-300", sediment(1, 1, tiny, tiny), q.ErrRange},
		{"model Manning n, 1e300 × 1e300", func() error { _, err := hydraulic.ModelManningCheck(q.New(big, hydraulic.ManningDim), big); return err }(), q.ErrRange},
		{"particle Reynolds check of NaN", func() error { _, err := hydraulic.ParticleReynoldsCheck(math.NaN()); return err }(), q.ErrInvalid},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if got := oneClass(c.err); got != c.class {
			t.Errorf("%s: %v: class %v, want %v alone", c.name, c.err, got, c.class)
		}
		var he *hydraulic.Error
		if !errors.As(c.err, &he) {
			t.Errorf("%s: %T is not a *hydraulic.Error", c.name, c.err)
		}
	}
}

// TestModelManningCheck: by hand, a prototype n of 0.014 (concrete
// cast in forms, common practice) in a 1:30 Froude model needs
// 0.014·30^(−1/6) = 0.014·0.567301 = 0.0079422 s·m^(−1/3), below the
// 0.009 of smooth plastic, and fails with its warning; a natural channel's
// 0.030 needs 0.017019 and passes; the distorted 1:120 × 1:30 model's
// ratio (1/30)^(2/3)/(1/120)^(1/2) = 1.13454 takes 0.014 to 0.015884.
func TestModelManningCheck(t *testing.T) {
	r := math.Pow(30, -1.0/6)
	if math.Abs(r-0.567301) > 1e-6 {
		t.Fatalf("hand ratio %v", r)
	}
	c, err := hydraulic.ModelManningCheck(q.New(0.014, hydraulic.ManningDim), r)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(c.Value-0.0079422) > 1e-7 || c.Limit != 0.009 || c.Pass || c.Warning == "" ||
		!strings.Contains(c.String(), "FAILS: no model material is this smooth") {
		t.Errorf("1:30, n = 0.014: %+v\n%v", c, c)
	}
	if c, err = hydraulic.ModelManningCheck(q.New(0.030, hydraulic.ManningDim), r); err != nil || math.Abs(c.Value-0.017019) > 1e-6 || !c.Pass || c.Warning != "" {
		t.Errorf("1:30, n = 0.030: %+v, %v", c, err)
	}
	d := math.Pow(1.0/30, 2.0/3) / math.Sqrt(1.0/120)
	if c, err = hydraulic.ModelManningCheck(q.New(0.014, hydraulic.ManningDim), d); err != nil || math.Abs(c.Value-0.015884) > 1e-6 || !c.Pass {
		t.Errorf("distorted: %+v, %v (ratio %v)", c, err, d)
	}
}

// TestParticleReynoldsCheck: Re* = 4.2 is below the viscous limit 5 and
// fails with the viscous-range warning; 12 passes; the limit itself
// passes.
func TestParticleReynoldsCheck(t *testing.T) {
	for _, c := range []struct {
		re   float64
		pass bool
	}{{4.2, false}, {12, true}, {5, true}, {0.3, false}} {
		got, err := hydraulic.ParticleReynoldsCheck(c.re)
		if err != nil || got.Pass != c.pass || got.Limit != 5 || (got.Warning != "") == c.pass {
			t.Errorf("Re* %v: %+v, %v", c.re, got, err)
		}
		if !c.pass && !strings.Contains(got.String(), "viscous range") {
			t.Errorf("Re* %v: %v", c.re, got)
		}
	}
}

// TestHydraulicStructureCaution: the hydraulic-structure caution
// defers to local codes and licensed engineers.
func TestHydraulicStructureCaution(t *testing.T) {
	for name, c := range map[string]string{"hydraulic structure": hydraulic.StructureCaution} {
		for _, want := range []string{"local codes", "licensed engineers", "scale effects"} {
			if !strings.Contains(c, want) {
				t.Errorf("%s caution lacks %q: %s", name, want, c)
			}
		}
	}
}

// TestModelManningCheckDimension: the prototype's n is a Quantity of
// dimension L^(−1/3)·T; a bare length (a roughness height in m, a common
// mix-up with Manning's n) is an ErrDimension, not a model n.
func TestModelManningCheckDimension(t *testing.T) {
	if got := hydraulic.ManningDim.String(); got != "L^(-1/3) T" {
		t.Errorf("ManningDim = %q, want L^(-1/3) T", got)
	}
	_, err := hydraulic.ModelManningCheck(q.New(0.014, q.Length), 0.5673)
	if !errors.Is(err, q.ErrDimension) || oneClass(err) != q.ErrDimension {
		t.Errorf("a length as Manning n: %v, want ErrDimension alone", err)
	}
}
