package ship_test

import (
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// hullRun builds an invented run (a 2.0 m model at 1:16, 2.4 m/s, 38.1 N)
// with a source on every input.
func hullRun(t *testing.T) (ship.HullRun, map[string]uncertain.ID) {
	t.Helper()
	set := uncertain.NewSet()
	ids := map[string]uncertain.ID{}
	add := func(name string, u quantity.Quantity, rel bool) uncertain.ID {
		id := set.MustAdd(uncertain.Source{Name: name, U: u, Relative: rel, Effect: uncertain.Systematic})
		ids[name] = id
		return id
	}
	K := quantity.New(1, quantity.Temperature)
	run := ship.HullRun{
		Scale:           1.0 / 16,
		ModelLength:     set.MustMeasure(quantity.New(2.0, quantity.Length), add("length", quantity.New(0.001, quantity.Length), false)),
		ModelWettedArea: set.MustMeasure(quantity.New(1.62, quantity.Area), add("area", quantity.Scalar(0.005), true)),
		ModelSpeed:      set.MustMeasure(quantity.New(2.4, quantity.Velocity), add("speed", quantity.Scalar(0.002), true)),
		ModelResistance: set.MustMeasure(quantity.New(38.10, quantity.Force), add("resistance", quantity.New(0.1, quantity.Force), false)),
		TankTemperature: set.MustMeasure(quantity.New(288.15, quantity.Temperature), add("tank T", K.Scale(0.3), false)),
		SeaTemperature:  set.MustMeasure(quantity.New(288.15, quantity.Temperature)),
		Tank:            fluids.FreshWater(), Sea: fluids.SeaWater(),
		FormFactor: set.MustMeasure(quantity.Scalar(1.15), add("form factor", quantity.Scalar(0.02), false)),
		Allowance:  set.MustMeasure(quantity.Scalar(0.0004), add("C_A", quantity.Scalar(0.0001), false)),
	}
	return run, ids
}

// TestHullRunMatchesExtrapolateHull: the estimates are ExtrapolateHull's,
// and two sensitivities are checked by hand: ∂R_s/∂C_A = ½ρ_s·V_s²·S_s,
// and ∂R_s/∂R_m = (ρ_s/ρ_m)·λ⁻³ (C_R carries R_m to the ship with
// V_s²S_s/(V_m²S_m) = λ⁻³).
func TestHullRunMatchesExtrapolateHull(t *testing.T) {
	run, ids := hullRun(t)
	res, err := ship.ExtrapolateHullRun(run)
	if err != nil {
		t.Fatal(err)
	}
	tank, _ := fluids.FreshWater().AtCelsius(15)
	sea, _ := fluids.SeaWater().AtCelsius(15)
	plain, err := ship.ExtrapolateHull(ship.HullTest{
		Scale: 1.0 / 16, ModelLength: quantity.New(2, quantity.Length), ModelWettedArea: quantity.New(1.62, quantity.Area),
		Speeds: []quantity.Quantity{quantity.New(2.4, quantity.Velocity)}, Resistances: []quantity.Quantity{quantity.New(38.1, quantity.Force)},
		Tank: tank, Sea: sea, FormFactor: 1.15, Allowance: 0.0004,
	})
	if err != nil {
		t.Fatal(err)
	}
	p := plain.Points[0]
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"R_s", res.ShipResistance.Value(), p.ShipResistance.Value()},
		{"P_E", res.EffectivePower.Value(), p.EffectivePower.Value()},
		{"C_Tm", res.ModelCT.Value(), p.ModelCT},
		{"C_Fs", res.ShipCF.Value(), p.ShipCF},
		{"Fn", res.Froude.Value(), p.Froude},
	} {
		if math.Abs(c.got-c.want) > 1e-12*math.Abs(c.want) {
			t.Errorf("%s = %v, ExtrapolateHull gives %v", c.name, c.got, c.want)
		}
	}
	vs := 2.4 * 4
	ss := 1.62 * 256
	terms := map[uncertain.ID]float64{}
	for i := range res.ShipResistance.Terms() {
		id, d := res.ShipResistance.Term(i)
		terms[id] = d
	}
	wantCA := 0.5 * sea.Density.Value() * vs * vs * ss * 0.0001
	if d := terms[ids["C_A"]]; math.Abs(d-wantCA) > 1e-9*wantCA {
		t.Errorf("C_A's contribution %v N, want ½ρ_sV_s²S_s·u = %v N", d, wantCA)
	}
	wantR := sea.Density.Value() / tank.Density.Value() * 4096 * 0.1
	if d := terms[ids["resistance"]]; math.Abs(d-wantR) > 1e-9*wantR {
		t.Errorf("R_m's contribution %v N, want (ρ_s/ρ_m)λ⁻³·u = %v N", d, wantR)
	}
	if _, ok := terms[ids["tank T"]]; !ok {
		t.Errorf("the tank temperature does not reach R_s")
	}
}

// TestHullRunMonteCarlo: the first-order budget of R_s is validated by a
// Monte Carlo run of the same model (JCGM 101 §8, two significant
// digits): the model is mildly nonlinear within these uncertainties.
func TestHullRunMonteCarlo(t *testing.T) {
	run, _ := hullRun(t)
	inputs := []uncertain.Measured{run.ModelLength, run.ModelWettedArea, run.ModelSpeed, run.ModelResistance,
		run.TankTemperature, run.SeaTemperature, run.FormFactor, run.Allowance}
	model := func(x []uncertain.Measured) uncertain.Measured {
		r := run
		r.ModelLength, r.ModelWettedArea, r.ModelSpeed, r.ModelResistance = x[0], x[1], x[2], x[3]
		r.TankTemperature, r.SeaTemperature, r.FormFactor, r.Allowance = x[4], x[5], x[6], x[7]
		res, err := ship.ExtrapolateHullRun(r)
		if err != nil {
			t.Fatal(err)
		}
		return res.ShipResistance
	}
	b, err := model(inputs).Budget("R_s", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	mc, err := uncertain.MonteCarlo(inputs, model, 50_000, 0.95, 11)
	if err != nil {
		t.Fatal(err)
	}
	if v := b.Validate(mc, 2); !v.Validated {
		t.Errorf("%v\n%v\n%v", b, mc, v)
	}
}

// TestProhaskaStdErr: the intercept's standard error by hand for the
// line through (1, 1), (2, 2), (3, 4): a = −2/3, b = 3/2, residuals 1/6,
// −1/3, 1/6, s² = (1/6)/1, SE(a) = s·√(1/3 + 4/2) = 0.62361.
func TestProhaskaStdErr(t *testing.T) {
	fn := []float64{1, math.Pow(2, 0.25), math.Pow(3, 0.25)} // Fn⁴/C_F = 1, 2, 3 with C_F = 1
	r, err := ship.Prohaska(fn, []float64{1, 2, 4}, []float64{1, 1, 1}, 2)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.FormFactor+2.0/3) > 1e-12 || math.Abs(r.FormFactorStdErr-math.Sqrt(1.0/6)*math.Sqrt(1.0/3+2)) > 1e-12 {
		t.Errorf("1 + k = %v ± %v, want −0.6667 ± 0.62361", r.FormFactor, r.FormFactorStdErr)
	}
}

// TestMeasuredToPrototype: Froude scaling of a model force at 1:25 in the
// same water, F_p = F_m·λ_L⁻³; with the length scale itself uncertain
// (u_rel 0.2 %) the force carries 3 × 0.2 % from it, root-sum-square with
// the force's own 0.5 % (GUM eq. 12, exponent-weighted).
func TestMeasuredToPrototype(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	set := uncertain.NewSet()
	f := set.MustMeasure(quantity.New(12.5, quantity.Force), set.MustAdd(uncertain.Source{Name: "force", U: quantity.Scalar(0.005), Relative: true}))
	exact, err := s.MeasuredToPrototype(f, nil)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(exact.Value()-12.5*15625) > 1e-9 || math.Abs(exact.Rel()-0.005) > 1e-15 {
		t.Errorf("F_p = %v, want 195312.5 N ± 0.5 %%", exact)
	}
	lam := set.MustMeasure(quantity.Scalar(1.0/25), set.MustAdd(uncertain.Source{Name: "length scale", U: quantity.Scalar(0.002), Relative: true}))
	got, err := s.MeasuredToPrototype(f, map[string]uncertain.Measured{"L": lam})
	if err != nil {
		t.Fatalf("parameters %v: %v", s.Params(), err)
	}
	if _, err := s.MeasuredToPrototype(f, map[string]uncertain.Measured{"X": lam}); err == nil {
		t.Errorf("a ratio that is not a parameter accepted")
	}
	if want := math.Hypot(0.005, 3*0.002); math.Abs(got.Rel()-want) > 1e-12 {
		t.Errorf("u_rel = %v, want %v", got.Rel(), want)
	}
}
