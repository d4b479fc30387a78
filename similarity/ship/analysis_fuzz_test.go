package ship_test

import (
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/ship"
)

// FuzzAnalyses drives ReduceOpenWater, FairResistance,
// SkinFrictionCorrection, AnalyseSelfPropulsion and PredictSpeedPower
// with one run or input replaced by extreme (and, from the fuzzer,
// non-finite) values: none may panic, and a nil error must come with
// finite results.
func FuzzAnalyses(f *testing.F) {
	f.Add(1.5, 20.0, 50.0, 2.0, 1.75, 20.0, 0.1)
	f.Add(1e300, 1e-300, 1e300, 1e-300, 1e300, -1e300, 1e300)
	f.Add(0.0, math.MaxFloat64, -math.MaxFloat64, math.MaxFloat64, 1e-300, 0.0, -1.0)
	f.Add(math.SmallestNonzeroFloat64, 1.0, 0.0, 1e-10, 2.0, 1e10, 0.0)
	f.Fuzz(func(t *testing.T, va, n, th, qq, vm, fd, x float64) {
		ot := synOpenWater(0)
		ot.Runs = append([]ship.OpenWaterRun(nil), ot.Runs...)
		ot.Runs[4] = ship.OpenWaterRun{Speed: quantity.New(va, quantity.Velocity), RevsPerSecond: n, Thrust: quantity.New(th, quantity.Force), Torque: quantity.New(qq, quantity.Torque)}
		if ow, err := ship.ReduceOpenWater(ot); err == nil {
			for _, p := range ow.Points {
				if !finiteAll(p.J, p.KT, p.KQ, p.Eta0, p.Reynolds) {
					t.Errorf("ReduceOpenWater: non-finite point %+v with a nil error", p)
				}
			}
			if j, err := ow.JForKT(x); err == nil && !finiteAll(j) {
				t.Errorf("JForKT(%v) = %v with a nil error", x, j)
			}
		}
		h := synResistance()
		h.Speeds = append([]quantity.Quantity(nil), h.Speeds...)
		h.Resistances = append([]quantity.Quantity(nil), h.Resistances...)
		h.Speeds[3], h.Resistances[3] = quantity.New(vm, quantity.Velocity), quantity.New(th, quantity.Force)
		if r, err := ship.FairResistance(h, 0); err == nil {
			if rv, _, err := r.At(quantity.New(vm, quantity.Velocity)); err == nil && !finiteAll(rv.Value()) {
				t.Errorf("FairResistance: R(%v) = %v with a nil error", vm, rv)
			}
		}
		in := poweringInput()
		in.ModelSpeed = quantity.New(vm, quantity.Velocity)
		in.FormFactor = 1 + math.Abs(x)
		if s, err := ship.SkinFrictionCorrection(in); err == nil && !finiteAll(s.Force.Value(), s.ModelCF, s.ShipCF, s.RoughnessAllowance) {
			t.Errorf("SkinFrictionCorrection: non-finite %+v with a nil error", s)
		}
		ow, err := ship.ReduceOpenWater(synOpenWater(0))
		if err != nil {
			t.Fatal(err)
		}
		res, err := ship.FairResistance(synResistance(), 2)
		if err != nil {
			t.Fatal(err)
		}
		sp := ship.SelfPropulsionTest{Diameter: quantity.New(synD, quantity.Length), Water: synWater, OpenWater: ow, Resistance: res,
			Runs: []ship.SelfPropulsionRun{{ModelSpeed: quantity.New(vm, quantity.Velocity), RevsPerSecond: n, Thrust: quantity.New(th, quantity.Force),
				Torque: quantity.New(qq, quantity.Torque), TowingForce: quantity.New(fd, quantity.Force)}}}
		if pts, err := ship.AnalyseSelfPropulsion(sp); err == nil {
			p := pts[0]
			if !finiteAll(p.KT, p.KQ, p.J, p.Wake, p.ThrustDeduction, p.RelativeRotative, p.EtaH, p.Eta0, p.EtaD) {
				t.Errorf("AnalyseSelfPropulsion: non-finite %+v with a nil error", p)
			}
		}
		spi := speedPowerInput(t, 0)
		spi.ShipSpeeds = []quantity.Quantity{quantity.New(vm, quantity.Velocity)}
		spi.Level = math.Abs(x)
		if r, err := ship.PredictSpeedPower(spi); err == nil {
			for _, p := range r.Points {
				if !finiteAll(p.DeliveredPower.Value(), p.PowerU, p.RevsU, p.Power[0], p.Power[1], p.Revs[0], p.Revs[1]) {
					t.Errorf("PredictSpeedPower: non-finite %+v with a nil error", p)
				}
			}
		}
	})
}
