package fluids_test

import (
	"errors"
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

// TestGasStateRefusesCondensed: an ideal-gas state of nitrogen at or
// below its saturation temperature at the pressure, below its triple
// point, below the critical temperature above the critical pressure, or
// above the stated 600 K, is a *fluids.RangeError of class ErrRange, not
// a density. Just above saturation it is a gas. Nitrogen boils at
// 77.355 K at 101 325 Pa (normal boiling point, Span et al., J. Phys.
// Chem. Ref. Data 29 (2000) 1361, table of saturation properties, from
// memory).
func TestGasStateRefusesCondensed(t *testing.T) {
	n2 := fluids.Nitrogen()
	atm := q.New(101325, q.Pressure)
	ts, err := n2.LowestTemperature(atm)
	if err != nil || math.Abs(ts.Value()-77.355) > 0.05 {
		t.Fatalf("nitrogen condenses at %v at 1 atm (%v); the published normal boiling point is 77.355 K", ts, err)
	}
	for _, c := range []struct {
		name string
		g    fluids.IdealGas
		T, p float64
	}{
		{"nitrogen at 77 K, 1 atm (liquid)", n2, 77, 101325},
		{"nitrogen at its saturation temperature", n2, ts.Value(), 101325},
		{"nitrogen at 90 K, 4.5 bar (liquid)", n2, 90, 4.5e5},
		{"nitrogen at 50 K, 1 kPa (below the triple point: solid)", n2, 50, 1000},
		{"nitrogen at 120 K, 50 bar (above the critical pressure, below T_c)", n2, 120, 5e6},
		{"nitrogen at 700 K (above the stated 600 K)", n2, 700, 1e5},
		{"air at 100 K (below its maxcondentherm)", fluids.Air(), 100, 1e5},
		{"air at 800 K (above the stated 600 K)", fluids.Air(), 800, 1e5},
	} {
		s, err := c.g.At(q.New(c.T, q.Temperature), q.New(c.p, q.Pressure))
		var re *fluids.RangeError
		if !errors.As(err, &re) || !errors.Is(err, q.ErrRange) || errors.Is(err, q.ErrInvalid) {
			t.Errorf("%s: got %+v, %v; want a *fluids.RangeError of class ErrRange", c.name, s, err)
		}
	}
	if _, err := n2.At(q.New(ts.Value()+0.01, q.Temperature), atm); err != nil {
		t.Errorf("nitrogen 0.01 K above saturation at 1 atm: %v", err)
	}
	if _, err := n2.At(q.New(130, q.Temperature), q.New(5e6, q.Pressure)); err != nil {
		t.Errorf("nitrogen above the critical temperature: %v", err)
	}
}

// TestViscosityRefuses: Sutherland's law outside the gas's stated range,
// or at a temperature that is not positive and finite, is an error, not a
// number.
func TestViscosityRefuses(t *testing.T) {
	for _, c := range []struct {
		name string
		g    fluids.IdealGas
		T    float64
	}{
		{"nitrogen at 50 K", fluids.Nitrogen(), 50}, {"air at 100 K", fluids.Air(), 100}, {"air at 1e300 K", fluids.Air(), 1e300},
		{"air at NaN", fluids.Air(), math.NaN()}, {"air at −5 K", fluids.Air(), -5},
		{"a gas of β = MaxFloat64", fluids.IdealGas{GasName: "x", R: q.New(287, q.SpecificHeatCapacity), Gamma: 1.4, Beta: q.New(math.MaxFloat64, fluids.SutherlandConstantDim), S: q.New(0, q.Temperature)}, 1e10},
	} {
		if mu, err := c.g.Viscosity(q.New(c.T, q.Temperature)); !errors.Is(err, q.ErrRange) {
			t.Errorf("%s: μ = %v, %v", c.name, mu, err)
		}
	}
	// In range, the law as written: μ(273 K) = 1.663e-5 Pa·s for nitrogen
	// (the constant the law is built on).
	if mu, err := fluids.Nitrogen().Viscosity(q.New(273, q.Temperature)); err != nil || math.Abs(mu.Value()/1.663e-5-1) > 1e-12 {
		t.Errorf("nitrogen μ(273 K) = %v, %v", mu, err)
	}
}

// TestViscosityDimension: the temperature is a Quantity; a pressure, or a
// bare number taken as a dimensionless Quantity, is an ErrDimension and
// not a viscosity (273 Pa would otherwise pass as 273 K).
func TestViscosityDimension(t *testing.T) {
	for _, T := range []q.Quantity{q.New(273, q.Pressure), q.New(273, q.Dimensionless)} {
		mu, err := fluids.Nitrogen().Viscosity(T)
		if !errors.Is(err, q.ErrDimension) || errors.Is(err, q.ErrRange) {
			t.Errorf("Viscosity(%v) = %v, %v; want ErrDimension alone", T, mu, err)
		}
	}
}

// TestRangeErrorUnit: a refused value prints with its unit after the value
// and after the range, as a reader checks it against the instrument.
func TestRangeErrorUnit(t *testing.T) {
	_, err := fluids.FreshWater().AtCelsius(45)
	var re *fluids.RangeError
	if !errors.As(err, &re) || re.Unit != "°C" {
		t.Fatalf("water at 45 °C: %v (%#v)", err, re)
	}
	if got, want := err.Error(), "fluids: fresh water: temperature 45 °C outside 0 … 40 °C"; got != want {
		t.Errorf("got %q, want %q", got, want)
	}
	_, err = fluids.Air().Viscosity(q.New(100, q.Temperature))
	if !errors.As(err, &re) || re.Unit != "K" || re.Lo != 132.6 || re.Hi != 600 {
		t.Errorf("air at 100 K: %v", err)
	}
	if dimless := (&fluids.RangeError{Fluid: "perfect gas", What: "Mach number", Value: 60, Lo: 0, Hi: 50}).Error(); dimless != "fluids: perfect gas: Mach number 60 outside 0 … 50" {
		t.Errorf("dimensionless: %q", dimless)
	}
}

// TestGasFunctionsFinite: extreme finite inputs that overflowed to ±Inf
// with a nil error are refused.
func TestGasFunctionsFinite(t *testing.T) {
	big := fluids.IdealGas{GasName: "x", R: q.New(1e300, q.SpecificHeatCapacity), Gamma: 1 + 1e-15, Beta: q.New(1e-6, fluids.SutherlandConstantDim), S: q.New(100, q.Temperature)}
	if cp, err := big.SpecificHeat(); err == nil {
		t.Errorf("c_p = %v with nil error", cp)
	}
	if qd, err := fluids.Air().DynamicPressure(q.New(math.MaxFloat64, q.Pressure), 40); err == nil {
		t.Errorf("q = %v with nil error", qd)
	}
	s := fluids.State{Temperature: q.New(1e308, q.Temperature), Pressure: q.New(1e308, q.Pressure)}
	if tot, err := fluids.Air().TotalOf(s, 5); err == nil {
		t.Errorf("total %v with nil error", tot)
	}
}

// finite reports whether every value is a finite number.
func finite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// FuzzIdealGas: the ideal-gas entry points at extreme finite inputs
// never panic, and a nil error comes with finite outputs.
func FuzzIdealGas(f *testing.F) {
	f.Add(288.15, 101325.0, 287.05, 1.4, 1.458e-6, 110.4, 0.6, uint8(0))
	f.Add(90.0, 4.5e5, 296.8, 1.4, 1.4e-6, 107.0, 0.85, uint8(1))
	f.Add(1e300, 1e300, 1e300, 1.0000001, 1e300, 0.0, 49.0, uint8(2))
	f.Add(5e-324, 5e-324, 5e-324, 1e308, 5e-324, 1e308, 1e-300, uint8(3))
	f.Fuzz(func(t *testing.T, T, p, R, gamma, beta, S, ma float64, which uint8) {
		var g fluids.IdealGas
		switch which % 4 {
		case 0:
			g = fluids.Air()
		case 1:
			g = fluids.Nitrogen()
		case 2:
			g = fluids.IdealGas{GasName: "fuzz", R: q.New(R, q.SpecificHeatCapacity), Gamma: gamma,
				Beta: q.New(beta, fluids.SutherlandConstantDim), S: q.New(S, q.Temperature),
				KRef: q.New(beta, q.ThermalConductivity), KTemp: q.New(S, q.Temperature), KS: q.New(R, q.Temperature)}
		default:
			// Constants of the wrong dimensions: each call must refuse.
			g = fluids.IdealGas{GasName: "fuzz", R: q.Scalar(R), Gamma: gamma, Beta: q.New(beta, q.DynamicViscosity), S: q.Scalar(S)}
		}
		if which%4 == 3 {
			wrongDimensionRefused(t, g)
		}
		Tq, pq := q.New(T, q.Temperature), q.New(p, q.Pressure)
		if s, err := g.At(Tq, pq); err == nil && !finite(s.Density.Value(), s.DynamicViscosity.Value(), s.KinematicViscosity.Value(), s.SpeedOfSound.Value()) {
			t.Errorf("At: %+v", s)
		} else if err == nil {
			if tot, err := g.TotalOf(s, ma); err == nil && !finite(tot.Temperature.Value(), tot.Pressure.Value()) {
				t.Errorf("TotalOf: %+v", tot)
			}
		}
		if mu, err := g.Viscosity(Tq); err == nil && !finite(mu.Value()) {
			t.Errorf("Viscosity: %v", mu)
		}
		if lo, err := g.LowestTemperature(pq); err == nil && !finite(lo.Value()) {
			t.Errorf("LowestTemperature: %v", lo)
		}
		tot := fluids.Total{Temperature: Tq, Pressure: pq}
		if s, err := g.StaticAt(tot, ma); err == nil && !finite(s.Density.Value(), s.DynamicViscosity.Value(), s.SpeedOfSound.Value()) {
			t.Errorf("StaticAt: %+v", s)
		}
		if qd, err := g.DynamicPressure(pq, ma); err == nil && !finite(qd.Value()) {
			t.Errorf("DynamicPressure: %v", qd)
		}
		if cp, err := g.SpecificHeat(); err == nil && !finite(cp.Value()) {
			t.Errorf("SpecificHeat: %v", cp)
		}
		if k, err := g.ThermalConductivity(Tq); err == nil && !finite(k.Value()) {
			t.Errorf("ThermalConductivity: %v", k)
		}
		if pr, err := g.Prandtl(Tq); err == nil && !finite(pr) {
			t.Errorf("Prandtl: %v", pr)
		}
		if tr, pr, err := fluids.TotalRatios(gamma, ma); err == nil && !finite(tr, pr) {
			t.Errorf("TotalRatios: %v %v", tr, pr)
		}
		if m, err := fluids.CondensationMargin(Tq, pq); err == nil && !finite(m.Value()) {
			t.Errorf("CondensationMargin: %v", m)
		}
		if e, err := fluids.NitrogenCompressibility(Tq, pq); err == nil && (!finite(e.Z, e.SoundSpeedRatio) || !(e.Z > 0 && e.SoundSpeedRatio > 0)) {
			t.Errorf("NitrogenCompressibility: %+v", e)
		} else if err != nil && q.ClassOf(err) == nil {
			t.Errorf("NitrogenCompressibility: unclassed error %v", err)
		}
	})
}

// wrongDimensionRefused checks that every method of a gas with a
// constant of the wrong dimension refuses, at a state that is otherwise
// good, with an ErrDimension alone.
func wrongDimensionRefused(t *testing.T, g fluids.IdealGas) {
	t.Helper()
	T, p := q.New(288.15, q.Temperature), q.New(101325, q.Pressure)
	s := fluids.State{Temperature: T, Pressure: p}
	errs := map[string]error{}
	_, errs["At"] = g.At(T, p)
	_, errs["Viscosity"] = g.Viscosity(T)
	_, errs["LowestTemperature"] = g.LowestTemperature(p)
	_, errs["StaticAt"] = g.StaticAt(fluids.Total{Temperature: T, Pressure: p}, 0.5)
	_, errs["TotalOf"] = g.TotalOf(s, 0.5)
	_, errs["DynamicPressure"] = g.DynamicPressure(p, 0.5)
	_, errs["SpecificHeat"] = g.SpecificHeat()
	_, errs["ThermalConductivity"] = g.ThermalConductivity(T)
	_, errs["Prandtl"] = g.Prandtl(T)
	for name, err := range errs {
		if !errors.Is(err, q.ErrDimension) || q.ClassOf(err) != q.ErrDimension {
			t.Errorf("%s of %+v: %v; want an ErrDimension alone", name, g, err)
		}
	}
}
