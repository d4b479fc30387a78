package ship_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/ship"
)

// finiteAll reports whether every x is finite.
func finiteAll(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// FuzzShipEntryPoints drives ITTC1978, ExtrapolateHull,
// ExtrapolateHullRun and TankBlockage with extreme finite (and, from the
// fuzzer, non-finite) inputs: none may panic, and a nil error must come
// with finite outputs.
func FuzzShipEntryPoints(f *testing.F) {
	f.Add(1.0/24, 7.0, 8.1, 1.75, 45.0, 1.18, 0.0, 0.32, 0.2, 1.01, 4e5, 1.0, 9.80665)
	f.Add(1.0/16, 2.0, 1.62, 0.5, 1.105, 1.141, 0.0, 0.085, 0.072, 0.985, 2e5, 1.0, 9.80665)
	f.Add(1e-300, 1e300, 1e300, 1e300, 1e300, 2.0, 0.005, 0.99, 0.99, 1.49, 1e8, 1e300, math.MaxFloat64)
	f.Add(0.5, 1e-300, 1e-300, 1e-300, 1e-300, 1.0, -0.005, 0.0, 0.0, 0.51, 12914.0, 1e-300, 1e-300)
	f.Add(0.999, math.MaxFloat64, math.MaxFloat64, math.MaxFloat64, math.MaxFloat64, 1.5, 0.001, 0.5, 0.5, 1.0, 1e6, math.MaxFloat64, 1e300)
	f.Fuzz(func(t *testing.T, scale, lm, sm, vm, rm, k1, ca, wm, th, etaR, reco, x, g float64) {
		tank := fluids.State{Density: q.New(999.1, q.Density), KinematicViscosity: q.New(1.1386e-6, q.KinematicViscosity)}
		sea := fluids.State{Density: q.New(1026, q.Density), KinematicViscosity: q.New(1.1892e-6, q.KinematicViscosity)}
		in := poweringInput()
		in.Scale, in.FormFactor, in.CorrelationAllowance = scale, k1, ca
		in.ModelLength, in.ModelWettedArea = q.New(lm, q.Length), q.New(sm, q.Area)
		in.ModelSpeed, in.ModelResistance = q.New(vm, q.Velocity), q.New(rm, q.Force)
		in.ModelWake, in.ThrustDeduction, in.RelativeRotative = wm, th, etaR
		in.Propeller.ModelReynolds = reco
		in.Propeller.Diameter = q.New(x, q.Length)
		in.Gravity = q.New(g, q.Acceleration)
		in.OpenWater[1].KT *= x
		if r, err := ship.ITTC1978(in); err == nil {
			if !finiteAll(r.ShipCT, r.ShipResistance.Value(), r.EffectivePower.Value(), r.ShipWake, r.J, r.KT, r.KQ, r.Eta0, r.EtaD,
				r.RevsPerSecond, r.RPM, r.Thrust.Value(), r.Torque.Value(), r.DeliveredPower.Value(), r.CorrelationAllowance,
				r.RoughnessAllowance, r.ModelBladeDrag, r.ShipBladeDrag, r.Load) {
				t.Errorf("ITTC1978 %+v: non-finite result %+v with a nil error", in, r)
			}
		}
		h := ship.HullTest{Scale: scale, ModelLength: q.New(lm, q.Length), ModelWettedArea: q.New(sm, q.Area),
			Speeds: []q.Quantity{q.New(vm, q.Velocity)}, Resistances: []q.Quantity{q.New(rm, q.Force)},
			Tank: tank, Sea: sea, FormFactor: k1, Allowance: ca, Gravity: q.New(g, q.Acceleration)}
		if r, err := ship.ExtrapolateHull(h); err == nil {
			for _, p := range r.Points {
				if !finiteAll(p.Froude, p.ModelCT, p.ShipCT, p.ShipResistance.Value(), p.EffectivePower.Value(), p.ShipSpeed.Value()) {
					t.Errorf("ExtrapolateHull %+v: non-finite point %+v with a nil error", h, p)
				}
			}
		}
		run := ship.HullRun{Scale: scale,
			ModelLength: uncertain.Exact(q.New(lm, q.Length)), ModelWettedArea: uncertain.Exact(q.New(sm, q.Area)),
			ModelSpeed: uncertain.Exact(q.New(vm, q.Velocity)), ModelResistance: uncertain.Exact(q.New(rm, q.Force)),
			TankTemperature: uncertain.Exact(q.New(288.15, q.Temperature)), SeaTemperature: uncertain.Exact(q.New(288.15, q.Temperature)),
			Tank: fluids.FreshWater(), Sea: fluids.SeaWater(), FormFactor: uncertain.Exact(q.Scalar(k1)), Allowance: uncertain.Exact(q.Scalar(ca)),
			Gravity: q.New(g, q.Acceleration)}
		if r, err := ship.ExtrapolateHullRun(run); err == nil {
			if !finiteAll(r.Froude.Value(), r.ShipCT.Value(), r.ShipResistance.Value(), r.EffectivePower.Value(), r.ShipResistance.U().Value()) {
				t.Errorf("ExtrapolateHullRun: non-finite result with a nil error (R = %v)", r.ShipResistance.Value())
			}
		}
		c, err := ship.TankBlockage(ship.TankSection{Width: q.New(lm, q.Length), Depth: q.New(x, q.Length)},
			q.New(sm, q.Area), q.New(vm, q.Velocity), q.New(g, q.Acceleration))
		if err == nil && !finiteAll(c.Blockage, c.DepthFroude, c.LinearCorrection, c.SpeedCorrection, c.Speed.Value(), c.SurfaceDrop.Value(),
			c.CTFactor, c.ChokingSpeed.Value()) {
			t.Errorf("TankBlockage: non-finite %+v with a nil error", c)
		}
	})
}
