package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// FuzzTurbo calls every pump and turbine entry
// point with fuzzed finite and extreme values: none may panic, and a nil
// error means every number returned is finite.
func FuzzTurbo(f *testing.F) {
	f.Add(0.9, 5e6, 8e7, 150e3, 2339.0, 998.2, 3.0, 30.0)
	f.Add(0.5, 1e300, 1e-300, math.MaxFloat64, 5e-324, 1e-300, 1e300, -1e300)
	f.Add(1e-300, 1e5, math.MaxFloat64, 1e300, 1.0, 1e-300, 0.0, 1e-300)
	f.Fuzz(func(t *testing.T, a, b, c, d, e, k, v, h float64) {
		finite := func(name string, err error, xs ...float64) {
			t.Helper()
			if err != nil {
				return
			}
			for i, x := range xs {
				if math.IsNaN(x) || math.IsInf(x, 0) {
					t.Fatalf("%s: value %d is %v with a nil error (inputs %v %v %v %v %v %v %v %v)", name, i, x, a, b, c, d, e, k, v, h)
				}
			}
		}
		eta, gain, err := turbo.IECStepUp(a, turbo.ReynoldsNumbers{Model: b, Prototype: c})
		finite("IECStepUp", err, eta, gain)
		eta, err = turbo.AckeretStepUp(a, turbo.ReynoldsNumbers{Model: b, Prototype: c})
		finite("AckeretStepUp", err, eta)
		eta, gain, err = turbo.FanStepUp(a, turbo.ReynoldsNumbers{Model: b, Prototype: c})
		finite("FanStepUp", err, eta, gain)
		curve := []float64{a, a * 0.9, math.Abs(k)}
		if st, err := turbo.FanCurve(curve, turbo.ReynoldsNumbers{Model: b, Prototype: c}); err == nil {
			finite("FanCurve", nil, append(st.Efficiency, st.Gain)...)
		}
		if st, err := turbo.IECCurve(curve, turbo.ReynoldsNumbers{Model: b, Prototype: c}); err == nil {
			finite("IECCurve", nil, append(st.Efficiency, st.Gain)...)
		}
		n, err := turbo.NPSH(turbo.NPSHInput{Pressure: q.New(d, q.Pressure), VapourPressure: q.New(e, q.Pressure),
			Density: q.New(k, q.Density), Velocity: q.New(v, q.Velocity), Gravity: q.New(h, q.Acceleration)})
		finite("NPSH", err, n.Value())
		sigma, err := turbo.Thoma(turbo.Heads{NPSH: q.New(d, q.Length), Head: q.New(h, q.Length)})
		finite("Thoma", err, sigma)
		p, err := turbo.SuctionPressureFor(a, q.New(h, q.Length), q.New(e, q.Pressure), q.New(k, q.Density), q.New(v, q.Velocity), q.New(b, q.Acceleration))
		finite("SuctionPressureFor", err, p.Value())
		ss, err := turbo.SpecificSpeedOf(q.New(b, q.AngularVelocity), q.New(c, q.VolumeFlowRate), q.New(h, q.Length))
		finite("SpecificSpeedOf", err, ss.Metric, ss.US, ss.Dimensionless)
		for name, conv := range map[string]func(float64) (turbo.SpecificSpeeds, error){
			"SpecificSpeedMetric": turbo.SpecificSpeedMetric, "SpecificSpeedUS": turbo.SpecificSpeedUS,
			"SpecificSpeedDimensionless": turbo.SpecificSpeedDimensionless,
		} {
			ss, err := conv(d)
			finite(name, err, ss.Metric, ss.US, ss.Dimensionless)
		}
		pp, err := turbo.PrototypePointOf(turbo.PrototypeInput{Affinity: turbo.Affinity{Flow: b, Head: c},
			Model:   turbo.ModelPoint{Flow: q.New(d, q.VolumeFlowRate), Head: q.New(h, q.Length), Efficiency: a},
			StepUp:  turbo.StepUpApplied{Method: "fuzzed", Efficiency: math.Abs(v)},
			Density: q.New(k, q.Density), Gravity: q.New(e, q.Acceleration)})
		finite("PrototypePointOf", err, pp.Flow.Value(), pp.Head.Value(), pp.Power.Value(), pp.Efficiency, pp.Gain)
	})
}
