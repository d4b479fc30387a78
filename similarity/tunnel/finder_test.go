package tunnel_test

import (
	"errors"
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

func TestTunnelFinder(t *testing.T) {
	proto, _ := fluids.StandardAtmosphere(q.New(18000, q.Length), fluids.GeopotentialAlt)
	V := q.New(0.6*proto.SpeedOfSound.Value(), q.Velocity)
	L := q.New(2.0, q.Length)
	lim := tunnel.Limits{MinTemperature: q.New(100, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	c, err := tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/10, lim)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Achieved || math.Abs(c.ReynoldsRatio-1) > 1e-6 || math.Abs(c.Mach-0.6) > 1e-12 {
		t.Errorf("condition %+v", c)
	}
	// Check it independently: the state at the found T and p.
	st, _ := fluids.Air().At(c.Temperature, c.Pressure)
	reM := st.Density.Value() * c.Velocity.Value() * 0.2 / st.DynamicViscosity.Value()
	reP := proto.Density.Value() * V.Value() * 2 / proto.DynamicViscosity.Value()
	if math.Abs(reM/reP-1) > 1e-6 || math.Abs(c.Velocity.Value()/st.SpeedOfSound.Value()-0.6) > 1e-12 {
		t.Errorf("Re_m/Re_p = %v", reM/reP)
	}
	// An ordinary atmospheric tunnel cannot: report how close.
	lim.MaxPressure = q.New(1.1e5, q.Pressure)
	lim.MinTemperature = q.New(280, q.Temperature)
	c, err = tunnel.FindCondition(fluids.Air(), proto, V, L, 1.0/50, lim)
	if err != nil {
		t.Fatal(err)
	}
	// The limit is on the total pressure; the static pressure is below it
	// by the isentropic ratio at Ma 0.6: p₀/p = (1 + 0.2·0.36)^3.5.
	if c.Achieved || !(c.ReynoldsRatio < 1) || c.Total.Pressure.Value() != 1.1e5 ||
		math.Abs(c.Total.Pressure.Value()/c.Pressure.Value()-math.Pow(1.072, 3.5)) > 1e-12 ||
		math.Abs(c.Total.Temperature.Value()/c.Temperature.Value()-1.072) > 1e-12 {
		t.Errorf("limited condition %+v", c)
	}
	// TemperatureFor: the fresh-water temperature with ν = 1.0034e-6 m²/s
	// is about 20 °C (ITTC 7.5-02-01-03 (2011), from memory).
	T, err := similarity.TemperatureFor(fluids.FreshWater(), q.New(101325, q.Pressure),
		func(s fluids.State) float64 { return s.KinematicViscosity.Value() }, 1.0034e-6, q.New(273.15, q.Temperature), q.New(313.15, q.Temperature))
	if err != nil || math.Abs(T.Value()-293.15) > 0.1 {
		t.Errorf("TemperatureFor = %v, %v", T, err)
	}
}

// TestFinderErrorIsTunnels: the condition finder reports with the
// tunnel's own error, naming itself, never with the core's plan error.
func TestFinderErrorIsTunnels(t *testing.T) {
	std, _ := fluids.StandardAtmosphere(q.New(0, q.Length), fluids.Geometric)
	lim := tunnel.Limits{MinTemperature: q.New(100, q.Temperature), MaxTemperature: q.New(320, q.Temperature),
		MinPressure: q.New(2e4, q.Pressure), MaxPressure: q.New(5e5, q.Pressure)}
	_, err := tunnel.FindCondition(fluids.Air(), std, q.New(100, q.Velocity), q.New(2, q.Length), -0.1, lim)
	var te *tunnel.Error
	var pe *similarity.PlanError
	if !errors.As(err, &te) || errors.As(err, &pe) || te.Op != "tunnel condition" || te.Input != "length ratio" || !errors.Is(err, q.ErrRange) {
		t.Errorf("negative length ratio: %v", err)
	}
}
