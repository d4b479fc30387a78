package ship_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// TestITTC1957 checks the correlation line: Re = 10⁷ gives 0.003 exactly
// by the formula; the other values are those tabulated for the line in
// ITTC Recommended Procedure 7.5-02-02-02 to 4 significant figures (from
// memory).
func TestITTC1957(t *testing.T) {
	cases := []struct{ re, cf float64 }{
		{1e6, 0.004688}, {2e6, 0.004054}, {5e6, 0.003397}, {1e7, 0.003000}, {1e8, 0.002083}, {1e9, 0.001531},
	}
	for _, c := range cases {
		got, err := ship.ITTC1957(c.re)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-c.cf) > 0.6e-6 { // half a unit in the 4th figure, plus rounding
			t.Errorf("C_F(%g) = %.6f, table %.6f", c.re, got, c.cf)
		}
	}
	if got, _ := ship.ITTC1957(1e7); math.Abs(got-0.003) > 1e-18 {
		t.Errorf("C_F(1e7) = %v, want 0.003 exactly", got)
	}
	if _, err := ship.ITTC1957(1e4); !errors.As(err, new(*ship.Error)) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("laminar Re accepted: %v", err)
	}
}

// TestHullAndProhaska builds invented model data from a known form factor
// and residual law, then checks that Prohaska's method recovers 1 + k and
// that the ship values follow the ITTC-1957 steps written out here.
func TestHullAndProhaska(t *testing.T) {
	const scale, k1 = 1.0 / 16, 1.12
	Lm, Sm := 2.5, 1.9
	tank := fluids.State{Density: q.New(999.1, q.Density), KinematicViscosity: q.New(1.1386e-6, q.KinematicViscosity)}
	sea := fluids.State{Density: q.New(1026.0, q.Density), KinematicViscosity: q.New(1.1892e-6, q.KinematicViscosity)}
	var speeds, res []q.Quantity
	for _, fn := range []float64{0.08, 0.10, 0.12, 0.14, 0.16, 0.18, 0.30, 0.40} {
		v := fn * math.Sqrt(9.80665*Lm)
		cf, _ := ship.ITTC1957(v * Lm / 1.1386e-6)
		ct := k1*cf + 0.0021*math.Pow(fn, 4) // invented wave-resistance law
		speeds = append(speeds, q.New(v, q.Velocity))
		res = append(res, q.New(ct*0.5*999.1*v*v*Sm, q.Force))
	}
	test := ship.HullTest{Scale: scale, ModelLength: q.New(Lm, q.Length), ModelWettedArea: q.New(Sm, q.Area),
		Speeds: speeds, Resistances: res, Tank: tank, Sea: sea, Allowance: 0.0004}
	pr, err := ship.ProhaskaFromTest(test, 0.2)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(pr.FormFactor-k1) > 1e-9 || pr.Points != 6 {
		t.Errorf("Prohaska: %+v, want 1 + k = %v from 6 runs", pr, k1)
	}
	test.FormFactor = pr.FormFactor
	r, err := ship.ExtrapolateHull(test)
	if err != nil {
		t.Fatal(err)
	}
	p := r.Points[6] // Fn = 0.30
	Vs := speeds[6].Value() * 4
	cfs, _ := ship.ITTC1957(Vs * Lm * 16 / 1.1892e-6)
	cfm, _ := ship.ITTC1957(speeds[6].Value() * Lm / 1.1386e-6)
	ctm := k1*cfm + 0.0021*math.Pow(0.30, 4)
	cts := k1*cfs + (ctm - k1*cfm) + 0.0004
	rs := cts * 0.5 * 1026 * Vs * Vs * Sm * 256
	if math.Abs(p.ShipResistance.Value()/rs-1) > 1e-9 || math.Abs(p.EffectivePower.Value()/(rs*Vs)-1) > 1e-9 {
		t.Errorf("ship: R = %v, want %v", p.ShipResistance, rs)
	}
	if !strings.Contains(r.Caution, "naval architect") {
		t.Error("hull result lacks its caution")
	}
	if _, err := ship.ExtrapolateHull(ship.HullTest{Scale: 2}); !errors.As(err, new(*ship.Error)) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("scale 2 accepted: %v", err)
	}
}

// TestHullTestUnsetAndWrongInputsNamed: an unset HullTest.Tank or .Sea
// says so and names the fix, and a resistance of the wrong dimension is
// refused with the procedure's prefix and its run's number (1-based, as
// the speeds are), each in exactly one class.
func TestHullTestUnsetAndWrongInputsNamed(t *testing.T) {
	tank := fluids.State{Density: q.New(999.1, q.Density), KinematicViscosity: q.New(1.1386e-6, q.KinematicViscosity)}
	sea := fluids.State{Density: q.New(1026.0, q.Density), KinematicViscosity: q.New(1.1892e-6, q.KinematicViscosity)}
	base := ship.HullTest{Scale: 1.0 / 16, ModelLength: q.New(2.5, q.Length), ModelWettedArea: q.New(1.9, q.Area),
		Speeds: []q.Quantity{q.New(1.5, q.Velocity)}, Resistances: []q.Quantity{q.New(12, q.Force)}, Tank: tank, Sea: sea}
	noTank, noSea, kg := base, base, base
	noTank.Tank, noSea.Sea = fluids.State{}, fluids.State{}
	kg.Resistances = []q.Quantity{q.New(1.2, q.Mass)}
	cases := []struct {
		name  string
		test  ship.HullTest
		want  string
		class error
	}{
		{"unset tank", noTank, "ship: hull extrapolation: HullTest.Tank is not set: give the tank water's state, e.g. fluids.FreshWater().AtCelsius(15)", q.ErrInvalid},
		{"unset sea", noSea, "ship: hull extrapolation: HullTest.Sea is not set: give the sea water's state, e.g. fluids.SeaWater().AtCelsius(15)", q.ErrInvalid},
		{"resistance in kg", kg, "ship: hull extrapolation: resistance 1: want force", q.ErrDimension},
	}
	for _, c := range cases {
		_, err := ship.ExtrapolateHull(c.test)
		if err == nil || !strings.HasPrefix(err.Error(), c.want) || !errors.As(err, new(*ship.Error)) {
			t.Errorf("%s: %v, want an *ship.Error beginning %q", c.name, err, c.want)
			continue
		}
		n := 0
		for _, cl := range []error{q.ErrDimension, q.ErrRange, q.ErrParse, q.ErrUnknown, q.ErrInvalid} {
			if errors.Is(err, cl) {
				n++
			}
		}
		if !errors.Is(err, c.class) || n != 1 {
			t.Errorf("%s: %v: want class %v alone", c.name, err, c.class)
		}
	}
	if _, err := ship.ExtrapolateHull(base); err != nil {
		t.Errorf("the complete test: %v", err)
	}
	const want = "ship: ITTC-1978 prediction: PoweringInput.Tank is not set: give the tank water's state"
	if _, err := ship.ITTC1978(ship.PoweringInput{Scale: 1.0 / 16, Sea: sea}); err == nil || !strings.HasPrefix(err.Error(), want) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("ITTC-1978 with no tank water: %v, want %q", err, want)
	}
}
