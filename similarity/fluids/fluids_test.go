package fluids_test

import (
	"errors"
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// TestWaterAgainstITTC checks fresh and sea water against the tables of
// ITTC Recommended Procedure 7.5-02-01-03 (2011), "Fresh water and
// seawater properties". The table values are quoted from memory; the
// tolerances are those the package documents (0.05 % in density, 0.5 %
// in kinematic viscosity).
func TestWaterAgainstITTC(t *testing.T) {
	cases := []struct {
		water   fluids.Water
		t       float64
		rho, nu float64
	}{
		{fluids.FreshWater(), 10, 999.7026, 1.3063e-6},
		{fluids.FreshWater(), 15, 999.1026, 1.1386e-6},
		{fluids.FreshWater(), 20, 998.2071, 1.0034e-6},
		{fluids.FreshWater(), 25, 997.0479, 0.8926e-6},
		{fluids.SeaWater(), 10, 1026.9, 1.3604e-6},
		{fluids.SeaWater(), 15, 1026.0, 1.1892e-6},
		{fluids.SeaWater(), 20, 1024.8, 1.0508e-6},
	}
	for _, c := range cases {
		s, err := c.water.AtCelsius(c.t)
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(s.Density.Value()/c.rho - 1); d > 5e-4 {
			t.Errorf("%s at %g °C: ρ = %.4f, table %.4f (%.2g)", c.water.Name(), c.t, s.Density.Value(), c.rho, d)
		}
		if d := math.Abs(s.KinematicViscosity.Value()/c.nu - 1); d > 5e-3 {
			t.Errorf("%s at %g °C: ν = %.5g, table %.5g (%.2g)", c.water.Name(), c.t, s.KinematicViscosity.Value(), c.nu, d)
		}
	}
	// The CIPM formula itself reproduces its own anchor: maximum density
	// 999.974950 kg/m³ at 3.983035 °C (Tanaka et al., 2001).
	s, _ := fluids.FreshWater().AtCelsius(3.983035)
	if math.Abs(s.Density.Value()-999.97495) > 1e-9 {
		t.Errorf("ρ_max = %v", s.Density.Value())
	}
	if _, err := fluids.FreshWater().AtCelsius(60); !errors.Is(err, fluids.ErrRange) {
		t.Errorf("60 °C: %v", err)
	}
	if _, err := fluids.FreshWater().At(q.New(300, q.Pressure), q.New(1e5, q.Pressure)); !errors.Is(err, q.ErrDimension) {
		t.Errorf("a pressure given as temperature: %v", err)
	}
}

// TestStandardAtmosphere checks ISO 2533:1975 values (Table of the
// standard atmosphere, geopotential altitude; from memory, to the digits
// given there).
func TestStandardAtmosphere(t *testing.T) {
	cases := []struct {
		H, T, p, rho, a float64
	}{
		{0, 288.15, 101325, 1.2250, 340.29},
		{11000, 216.65, 22632, 0.36392, 295.07},
		{20000, 216.65, 5474.9, 0.088035, 295.07},
	}
	for _, c := range cases {
		s, err := fluids.StandardAtmosphere(q.New(c.H, q.Length), fluids.GeopotentialAlt)
		if err != nil {
			t.Fatal(err)
		}
		got := []float64{s.Temperature.Value(), s.Pressure.Value(), s.Density.Value(), s.SpeedOfSound.Value()}
		want := []float64{c.T, c.p, c.rho, c.a}
		tol := []float64{1e-9, 5e-5, 5e-5, 5e-5}
		for i := range got {
			if math.Abs(got[i]/want[i]-1) > tol[i] {
				t.Errorf("H = %g: quantity %d = %.6g, ISO 2533 %.6g", c.H, i, got[i], want[i])
			}
		}
	}
	s, _ := fluids.StandardAtmosphere(q.New(0, q.Length), fluids.Geometric)
	// ISO 2533 sea level: μ = 1.7894e-5 Pa·s, ν = 1.4607e-5 m²/s.
	if math.Abs(s.DynamicViscosity.Value()/1.7894e-5-1) > 5e-5 || math.Abs(s.KinematicViscosity.Value()/1.4607e-5-1) > 5e-5 {
		t.Errorf("sea-level viscosity %v, %v", s.DynamicViscosity, s.KinematicViscosity)
	}
	if _, err := fluids.StandardAtmosphere(q.New(40000, q.Length), fluids.GeopotentialAlt); !errors.Is(err, fluids.ErrRange) {
		t.Errorf("40 km: %v", err)
	}
	if h, _ := fluids.Geopotential(q.New(18000, q.Length)); math.Abs(h.Value()-17949.2) > 0.1 { // r·z/(r+z), worked by hand
		t.Errorf("geopotential of 18 km = %v", h)
	}
}

// TestSutherland checks Sutherland's law for air against the table of
// air properties in Incropera and DeWitt, Fundamentals of Heat and Mass
// Transfer, Table A.4 (from memory), to 1 %.
func TestSutherland(t *testing.T) {
	cases := []struct{ T, mu float64 }{
		{250, 159.6e-7}, {300, 184.6e-7}, {350, 208.2e-7}, {400, 230.1e-7},
	}
	for _, c := range cases {
		if got, err := fluids.Air().Viscosity(q.New(c.T, q.Temperature)); err != nil || got.Dim() != q.DynamicViscosity || math.Abs(got.Value()/c.mu-1) > 0.01 {
			t.Errorf("μ(%g K) = %.4g, table %.4g", c.T, got, c.mu)
		}
	}
	s, err := fluids.Air().At(q.New(288.15, q.Temperature), q.New(101325, q.Pressure))
	if err != nil || math.Abs(s.SpeedOfSound.Value()-340.294) > 1e-3 {
		t.Errorf("a(288.15 K) = %v, %v", s.SpeedOfSound, err)
	}
	c := fluids.Constant{FluidName: "glycerol mix", Density: q.New(1150, q.Density), Viscosity: q.New(0.01, q.DynamicViscosity)}
	cs, err := c.At(q.New(293.15, q.Temperature), q.New(1e5, q.Pressure))
	if err != nil || math.Abs(cs.KinematicViscosity.Value()-0.01/1150) > 1e-18 {
		t.Errorf("constant fluid: %v, %v", cs, err)
	}
	var f fluids.Fluid = c
	_ = f
}

// TestSlopes: the exact temperature derivatives of the water correlations
// agree with central differences of At, and the fresh-water density slope
// at 20 °C is −β·ρ with the volumetric expansion coefficient
// β = 2.07×10⁻⁴ K⁻¹ (handbook value, from memory).
func TestSlopes(t *testing.T) {
	for _, w := range []fluids.Water{fluids.FreshWater(), fluids.SeaWater()} {
		for _, c := range []float64{2, 15, 19.9, 20.1, 30} {
			T := q.New(c+273.15, q.Temperature)
			dRho, dNu, err := w.Slopes(T)
			if err != nil {
				t.Fatal(err)
			}
			const h = 1e-4
			lo, _ := w.AtCelsius(c - h)
			hi, _ := w.AtCelsius(c + h)
			fdRho := (hi.Density.Value() - lo.Density.Value()) / (2 * h)
			fdNu := (hi.KinematicViscosity.Value() - lo.KinematicViscosity.Value()) / (2 * h)
			if math.Abs(dRho.Value()-fdRho) > 1e-5*math.Abs(fdRho) || math.Abs(dNu.Value()-fdNu) > 1e-5*math.Abs(fdNu) {
				t.Errorf("%s at %g °C: dρ/dT %v, dν/dT %v; differences give %v, %v", w.Name(), c, dRho, dNu, fdRho, fdNu)
			}
			wantRho, _ := q.Density.Div(q.Temperature)
			wantNu, _ := q.KinematicViscosity.Div(q.Temperature)
			if dRho.Dim() != wantRho || dNu.Dim() != wantNu {
				t.Errorf("slopes of dimensions %v, %v", dRho.Dim(), dNu.Dim())
			}
		}
	}
	dRho, _, _ := fluids.FreshWater().Slopes(q.New(293.15, q.Temperature))
	s, _ := fluids.FreshWater().AtCelsius(20)
	if beta := -dRho.Value() / s.Density.Value(); math.Abs(beta-2.07e-4) > 0.01e-4 {
		t.Errorf("β at 20 °C = %.4g K⁻¹, want 2.07e-4", beta)
	}
	if _, _, err := fluids.FreshWater().Slopes(q.New(350, q.Temperature)); err == nil {
		t.Errorf("a slope outside the range: no error")
	}
}
