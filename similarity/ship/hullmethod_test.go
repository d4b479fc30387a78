package ship_test

import (
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// plainHull is the plain-float ITTC-1957 hull method as ExtrapolateHull
// computed it before the method was written once over Measured values:
// the reference for TestHullMethodMatchesPlainFloats.
func plainHull(scale, lm, sm, vm, r, rhoM, nuM, rhoS, nuS, k1, ca, g float64, line ship.FrictionLine) (fn, ct, cfm, cr, vs, cfs, cts, rs, pe float64) {
	ls, ss := lm/scale, sm/(scale*scale)
	fn = vm / math.Sqrt(g*lm)
	ct = r / (0.5 * rhoM * vm * vm * sm)
	cfm, _ = line.CF(vm * lm / nuM)
	cr = ct - k1*cfm
	vs = vm / math.Sqrt(scale)
	cfs, _ = line.CF(vs * ls / nuS)
	cts = k1*cfs + cr + ca
	rs = cts * 0.5 * rhoS * vs * vs * ss
	return fn, ct, cfm, cr, vs, cfs, cts, rs, rs * vs
}

// TestHullMethodMatchesPlainFloats: ExtrapolateHull, now computed by the
// one hull method over exact Measured inputs, gives the plain-float
// numbers within 1e-15 relative (in practice bit for bit) over random
// tests and every friction line.
func TestHullMethodMatchesPlainFloats(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		scale := 1 / rapid.Float64Range(4, 50).Draw(rt, "1/λ")
		lm := rapid.Float64Range(1, 8).Draw(rt, "L_m")
		sm := lm * lm * rapid.Float64Range(0.1, 0.5).Draw(rt, "S_m/L_m²")
		vm := rapid.Float64Range(0.8, 4).Draw(rt, "V_m")
		ctGuess := rapid.Float64Range(3e-3, 15e-3).Draw(rt, "C_T")
		k1 := rapid.Float64Range(1, 1.4).Draw(rt, "1 + k")
		ca := rapid.Float64Range(-2e-4, 6e-4).Draw(rt, "C_A")
		line := ship.FrictionLine(rapid.IntRange(0, 3).Draw(rt, "line"))
		rhoM, nuM, rhoS, nuS, g := 999.1, 1.1386e-6, 1026.0, 1.1892e-6, 9.80665
		r := ctGuess * 0.5 * rhoM * vm * vm * sm
		if line == ship.LineKatsui && vm*lm/nuM < 1e6 || vm/math.Sqrt(scale)*lm/scale/nuS > 1e10 {
			return // outside the line's range: refused, as TestFrictionLines checks
		}
		h := ship.HullTest{Scale: scale, ModelLength: quantity.New(lm, quantity.Length), ModelWettedArea: quantity.New(sm, quantity.Area),
			Speeds: []quantity.Quantity{quantity.New(vm, quantity.Velocity)}, Resistances: []quantity.Quantity{quantity.New(r, quantity.Force)},
			Tank:       fluids.State{Density: quantity.New(rhoM, quantity.Density), KinematicViscosity: quantity.New(nuM, quantity.KinematicViscosity)},
			Sea:        fluids.State{Density: quantity.New(rhoS, quantity.Density), KinematicViscosity: quantity.New(nuS, quantity.KinematicViscosity)},
			FormFactor: k1, Allowance: ca, Line: line}
		res, err := ship.ExtrapolateHull(h)
		if err != nil {
			rt.Fatal(err)
		}
		p := res.Points[0]
		fn, ct, cfm, cr, vs, cfs, cts, rs, pe := plainHull(scale, lm, sm, vm, r, rhoM, nuM, rhoS, nuS, k1, ca, g, line)
		for _, c := range []struct {
			name      string
			got, want float64
		}{{"Fn", p.Froude, fn}, {"C_Tm", p.ModelCT, ct}, {"C_Fm", p.ModelCF, cfm}, {"C_R", p.Residual, cr}, {"V_s", p.ShipSpeed.Value(), vs},
			{"C_Fs", p.ShipCF, cfs}, {"C_Ts", p.ShipCT, cts}, {"R_s", p.ShipResistance.Value(), rs}, {"P_E", p.EffectivePower.Value(), pe}} {
			if math.Abs(c.got-c.want) > 1e-15*math.Abs(c.want) {
				rt.Errorf("%s = %.17g, plain %.17g", c.name, c.got, c.want)
			}
		}
	})
}

// TestHullRunSlopesAgreeWithDifferences: the sensitivity of the ship's
// C_F to the model speed that ExtrapolateHullRun carries (through each
// friction line's analytic slope) matches a central difference of
// FrictionLine.CF, for every line.
func TestHullRunSlopesAgreeWithDifferences(t *testing.T) {
	for _, line := range []ship.FrictionLine{ship.LineITTC1957, ship.LineSchoenherr, ship.LineHughes, ship.LineKatsui} {
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "speed", U: quantity.New(0.01, quantity.Velocity)})
		run := ship.HullRun{Scale: 1.0 / 16,
			ModelLength: uncertain.Exact(quantity.New(4, quantity.Length)), ModelWettedArea: uncertain.Exact(quantity.New(3, quantity.Area)),
			ModelSpeed: set.MustMeasure(quantity.New(2, quantity.Velocity), id), ModelResistance: uncertain.Exact(quantity.New(60, quantity.Force)),
			TankTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)), SeaTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)),
			Tank: fluids.FreshWater(), Sea: fluids.SeaWater(), FormFactor: uncertain.Exact(quantity.Scalar(1.2)), Line: line}
		r, err := ship.ExtrapolateHullRun(run)
		if err != nil {
			t.Fatal(err)
		}
		_, got := r.ShipCF.Term(0)
		// The term is the slope times the source's u = 0.01 m/s. C_Fs(V_m)
		// with Re_s = (V_m·4)·(4·16)/ν_s; d/dV_m by a central difference.
		got /= 0.01
		nuS := r.SeaViscosity.Value()
		f := func(v float64) float64 { c, _ := line.CF(v * 4 * 64 / nuS); return c }
		h := 1e-5
		want := (f(2+h) - f(2-h)) / (2 * h)
		if math.Abs(got-want) > 1e-6*math.Abs(want) {
			t.Errorf("%v: dC_Fs/dV_m = %.9g, central difference %.9g", line, got, want)
		}
	}
}

// TestHullRunUpperReynoldsRefused: both hull paths share the friction
// line's range, so a ship Reynolds number above 10¹⁰ (a 12 m model of a
// 600 m ship at 7 m/s: Re_s = 7·√50·600/1.19e-6 ≈ 2.5×10¹⁰) is refused by
// the uncertainty path as by the plain one.
func TestHullRunUpperReynoldsRefused(t *testing.T) {
	run := ship.HullRun{Scale: 1.0 / 50,
		ModelLength: uncertain.Exact(quantity.New(12, quantity.Length)), ModelWettedArea: uncertain.Exact(quantity.New(30, quantity.Area)),
		ModelSpeed: uncertain.Exact(quantity.New(7, quantity.Velocity)), ModelResistance: uncertain.Exact(quantity.New(4000, quantity.Force)),
		TankTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)), SeaTemperature: uncertain.Exact(quantity.New(288.15, quantity.Temperature)),
		Tank: fluids.FreshWater(), Sea: fluids.SeaWater()}
	if r, err := ship.ExtrapolateHullRun(run); err == nil {
		t.Errorf("ship Re above 10¹⁰ accepted: R_s = %v", r.ShipResistance.Value())
	}
	tank, _ := fluids.FreshWater().AtCelsius(15)
	sea, _ := fluids.SeaWater().AtCelsius(15)
	h := ship.HullTest{Scale: 1.0 / 50, ModelLength: quantity.New(12, quantity.Length), ModelWettedArea: quantity.New(30, quantity.Area),
		Speeds: []quantity.Quantity{quantity.New(7, quantity.Velocity)}, Resistances: []quantity.Quantity{quantity.New(4000, quantity.Force)},
		Tank: tank, Sea: sea}
	if _, err := ship.ExtrapolateHull(h); err == nil {
		t.Error("the plain path accepted it")
	}
}
