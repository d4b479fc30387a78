package ship_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"similis.dev/similis/similarity/ship"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
)

func tank(b, h float64) ship.TankSection {
	return ship.TankSection{Width: quantity.New(b, quantity.Length), Depth: quantity.New(h, quantity.Length)}
}

// TestTankBlockageHand checks one run by hand: a 4 m × 2 m tank, a model
// of 0.08 m² largest section (m = 0.01) at 2 m/s, g = 9.80665 m/s².
// Fh² = 4/19.6133 = 0.2039432; the linearised ΔV/V = 0.01/0.7860568
// = 0.0127217. The full root of the cubic was computed once with an
// independent pure-Python bisection to 1e-15: ΔV/V = 0.0127856183,
// Δh = 5.2484199 mm, and the continuity check V·b·h = 16 m³/s on both
// sides. The choking Froude number, from the closed form
// 1 − m + Fh²/2 = (3/2)·Fh^(2/3) of the one-dimensional theory's limiting
// speed (Schijf's limit, the same computation), is 0.87840714, i.e.
// 3.8901934 m/s.
func TestTankBlockageHand(t *testing.T) {
	c, err := ship.TankBlockage(tank(4, 2), quantity.New(0.08, quantity.Area), quantity.New(2, quantity.Velocity), quantity.Quantity{})
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"m", c.Blockage, 0.01, 1e-15},
		{"Fh", c.DepthFroude, math.Sqrt(4 / 19.6133), 1e-15},
		{"linear ΔV/V", c.LinearCorrection, 0.012721727668903112, 1e-14},
		{"ΔV/V", c.SpeedCorrection, 0.012785618291129675, 1e-11},
		{"V'", c.Speed.Value(), 2 * 1.012785618291129675, 1e-11},
		{"Δh", c.SurfaceDrop.Value(), 0.005248419922674067, 1e-12},
		{"C_T factor", c.CTFactor, 1 / (1.012785618291129675 * 1.012785618291129675), 1e-11},
		{"choking speed", c.ChokingSpeed.Value(), 3.8901933812814677, 1e-9},
	} {
		if math.Abs(k.got-k.want) > k.tol*math.Max(1, math.Abs(k.want)) {
			t.Errorf("%s = %.12g, want %.12g", k.name, k.got, k.want)
		}
	}
	// Continuity and Bernoulli hold at the solution.
	v, dv, dh := 2.0, 2*c.SpeedCorrection, c.SurfaceDrop.Value()
	if got := (v + dv) * (4*(2-dh) - 0.08); math.Abs(got-16) > 1e-9 {
		t.Errorf("continuity: (V+ΔV)·(b(h−Δh) − A_x) = %v, want V·b·h = 16", got)
	}
}

// TestTankBlockageRefusals: choking, a blockage over 0.1, a wrong
// dimension and a non-positive input are refused with typed errors.
func TestTankBlockageRefusals(t *testing.T) {
	ax := quantity.New(0.08, quantity.Area)
	for _, c := range []struct {
		name  string
		tank  ship.TankSection
		ax, v quantity.Quantity
		dim   bool
	}{
		{"choked", tank(4, 2), ax, quantity.New(3.9, quantity.Velocity), false},
		{"far above choking", tank(4, 2), ax, quantity.New(10, quantity.Velocity), false},
		{"m above 0.1", tank(1, 0.5), ax, quantity.New(1, quantity.Velocity), false},
		{"zero section", tank(4, 2), quantity.New(0, quantity.Area), quantity.New(1, quantity.Velocity), false},
		{"negative depth", tank(4, -2), ax, quantity.New(1, quantity.Velocity), false},
		{"section given as a length", tank(4, 2), quantity.New(0.08, quantity.Length), quantity.New(1, quantity.Velocity), true},
	} {
		_, err := ship.TankBlockage(c.tank, c.ax, c.v, quantity.Quantity{})
		if err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		var de *quantity.Error
		var ee *ship.Error
		if c.dim && !(errors.As(err, &de) && de.Class == quantity.ErrDimension) || !c.dim && !errors.As(err, &ee) {
			t.Errorf("%s: error %T %v", c.name, err, err)
		}
	}
	// Just below the choking speed a solution still exists.
	if _, err := ship.TankBlockage(tank(4, 2), ax, quantity.New(3.88, quantity.Velocity), quantity.Quantity{}); err != nil {
		t.Errorf("3.88 m/s, below choking: %v", err)
	}
}

// TestTankBlockageProperties: the full correction lies above the
// linearised one (the neglected terms add), both tend to m/(1 − Fh²) as
// m → 0, and the cubic holds at the root.
func TestTankBlockageProperties(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		m := rapid.Float64Range(1e-4, 0.05).Draw(rt, "m")
		frac := rapid.Float64Range(0, 0.9).Draw(rt, "fraction of choking")
		b, h := 4.0, 2.0
		ax := quantity.New(m*b*h, quantity.Area)
		c0, err := ship.TankBlockage(tank(b, h), ax, quantity.New(0.01, quantity.Velocity), quantity.Quantity{})
		if err != nil {
			rt.Fatal(err)
		}
		v := frac * c0.ChokingSpeed.Value()
		if v == 0 {
			v = 1e-3
		}
		c, err := ship.TankBlockage(tank(b, h), ax, quantity.New(v, quantity.Velocity), quantity.Quantity{})
		if err != nil {
			rt.Fatal(err)
		}
		if c.SpeedCorrection < c.LinearCorrection*(1-1e-9) {
			rt.Errorf("full ΔV/V %v below the linearised %v", c.SpeedCorrection, c.LinearCorrection)
		}
		s, fh2 := 1+c.SpeedCorrection, c.DepthFroude*c.DepthFroude
		if r := fh2/2*s*s*s - (1-m+fh2/2)*s + 1; math.Abs(r) > 1e-9 {
			rt.Errorf("cubic residual %v at s = %v", r, s)
		}
	})
	// The small-m limit: m = 1e-6 at Fh² = 0.2 gives m/(1 − Fh²) to 1e-5.
	g := 9.80665
	v := math.Sqrt(0.2 * g * 2)
	c, err := ship.TankBlockage(tank(4, 2), quantity.New(8e-6, quantity.Area), quantity.New(v, quantity.Velocity), quantity.Quantity{})
	if err != nil {
		t.Fatal(err)
	}
	if want := 1e-6 / 0.8; math.Abs(c.SpeedCorrection/want-1) > 1e-5 {
		t.Errorf("small-m limit %v, want %v", c.SpeedCorrection, want)
	}
}

// TestWithBlockage: the corrected test's speeds are the corrected speeds,
// its resistances unchanged, and the extrapolation's model C_T is the
// uncorrected one times the C_T factor.
func TestWithBlockage(t *testing.T) {
	test := invented1to20Test(t)
	ax := quantity.New(0.06, quantity.Area)
	corrected, corr, err := test.WithBlockage(tank(4, 2), ax)
	if err != nil {
		t.Fatal(err)
	}
	raw, err := ship.ExtrapolateHull(test)
	if err != nil {
		t.Fatal(err)
	}
	got, err := ship.ExtrapolateHull(corrected)
	if err != nil {
		t.Fatal(err)
	}
	for i := range test.Speeds {
		if corrected.Speeds[i] != corr[i].Speed || corrected.Resistances[i] != test.Resistances[i] {
			t.Errorf("run %d: speed %v resistance %v", i, corrected.Speeds[i], corrected.Resistances[i])
		}
		if want := raw.Points[i].ModelCT * corr[i].CTFactor; math.Abs(got.Points[i].ModelCT/want-1) > 1e-12 {
			t.Errorf("run %d: C_T %v, want %v", i, got.Points[i].ModelCT, want)
		}
	}
	if test.Speeds[0] == corrected.Speeds[0] {
		t.Error("the original test's speeds were changed in place or not corrected")
	}
	if _, _, err := test.WithBlockage(tank(0.5, 0.3), ax); err == nil {
		t.Error("a tank too small for the model gave no error")
	}
}

// invented1to20Test is an invented 1:20 resistance test (a 3 m model,
// C_T = 1.15·C_F + 0.002·Fn⁴).
func invented1to20Test(t *testing.T) ship.HullTest {
	t.Helper()
	Lm, Sm, nu, rho := 3.0, 2.2, 1.1386e-6, 999.1
	var speeds, res []quantity.Quantity
	for _, fn := range []float64{0.12, 0.18, 0.24, 0.30} {
		v := fn * math.Sqrt(9.80665*Lm)
		cf, err := ship.ITTC1957(v * Lm / nu)
		if err != nil {
			t.Fatal(err)
		}
		ct := 1.15*cf + 0.002*math.Pow(fn, 4)
		speeds = append(speeds, quantity.New(v, quantity.Velocity))
		res = append(res, quantity.New(ct*0.5*rho*v*v*Sm, quantity.Force))
	}
	return ship.HullTest{Scale: 1.0 / 20, ModelLength: quantity.New(Lm, quantity.Length), ModelWettedArea: quantity.New(Sm, quantity.Area),
		Speeds: speeds, Resistances: res, FormFactor: 1.15,
		Tank: fluids.State{Density: quantity.New(rho, quantity.Density), KinematicViscosity: quantity.New(nu, quantity.KinematicViscosity)},
		Sea:  fluids.State{Density: quantity.New(1026, quantity.Density), KinematicViscosity: quantity.New(1.1892e-6, quantity.KinematicViscosity)}}
}

// A 4 m × 2 m tank, a model of 0.08 m² largest section at 2 m/s: the
// water passes the model 1.28 % faster than the carriage moves.
func ExampleTankBlockage() {
	c, err := ship.TankBlockage(
		ship.TankSection{Width: quantity.New(4, quantity.Length), Depth: quantity.New(2, quantity.Length)},
		quantity.New(0.08, quantity.Area), quantity.New(2, quantity.Velocity), quantity.Quantity{})
	if err != nil {
		panic(err)
	}
	fmt.Printf("m = %.4f, Fh = %.3f\n", c.Blockage, c.DepthFroude)
	fmt.Printf("ΔV/V = %.3f %% (linearised %.3f %%), V' = %.4f m/s, surface drop %.2f mm\n",
		100*c.SpeedCorrection, 100*c.LinearCorrection, c.Speed.Value(), 1e3*c.SurfaceDrop.Value())
	fmt.Printf("C_T factor %.5f; the flow chokes at %.2f m/s\n", c.CTFactor, c.ChokingSpeed.Value())
	// Output:
	// m = 0.0100, Fh = 0.452
	// ΔV/V = 1.279 % (linearised 1.272 %), V' = 2.0256 m/s, surface drop 5.25 mm
	// C_T factor 0.97491; the flow chokes at 3.89 m/s
}
