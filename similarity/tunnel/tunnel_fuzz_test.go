package tunnel_test

import (
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/tunnel"
)

// FuzzTunnel drives the tunnel entry points — the condition finder, the
// 2-D and 3-D wall corrections and the ideal-gas states — with extreme
// finite values: none may panic, and a nil error must come with finite
// outputs.
func FuzzTunnel(f *testing.F) {
	f.Add(180.0, 2.4, 1.0/12, 110.0, 320.0, 1e5, 4.5e5, 0.3, 0.9, 0.6, 0.01, 0.62, 0.01, uint8(1))
	f.Add(1e300, 1e300, 1e300, 1e-300, 1e300, 1e-300, 1e300, 1e300, 1e300, 1e300, 1e300, 0.8, 1e300, uint8(0))
	f.Add(1e-300, 1.7976931348623157e308, 1e-300, 300.0, 300.0, 1e5, 1e5, 1e-300, 1e-290, -1e300, 1e-300, 0.0, 5e-324, uint8(2))
	f.Fuzz(func(t *testing.T, v, l, ratio, tlo, thi, plo, phi, c, h, coef, vol, mach, margin float64, which uint8) {
		proto, err := fluids.StandardAtmosphere(q.New(11000, q.Length), fluids.GeopotentialAlt)
		if err != nil {
			t.Fatal(err)
		}
		gas := fluids.Air()
		lim := tunnel.Limits{MinTemperature: q.New(tlo, q.Temperature), MaxTemperature: q.New(thi, q.Temperature),
			MinPressure: q.New(plo, q.Pressure), MaxPressure: q.New(phi, q.Pressure)}
		if which%2 == 1 {
			gas = fluids.Nitrogen()
			lim.CondensationMargin = q.New(margin, q.Temperature)
			lim.RatedLoad, lim.LoadArea = q.New(vol, q.Force), q.New(c, q.Area)
			lim.MaxDynamicPressure = q.New(coef, q.Pressure)
		}
		if r, err := tunnel.FindCondition(gas, proto, q.New(v, q.Velocity), q.New(l, q.Length), ratio, lim); err == nil {
			if !allFinite(r.FullReynolds, r.ModelReynolds, r.ReynoldsRatio, r.Mach, r.Total.Pressure.Value(), r.Total.Temperature.Value(),
				r.Pressure.Value(), r.Temperature.Value(), r.Velocity.Value(), r.Q.Value(), r.Load.Value()) {
				t.Errorf("finder: %+v", r)
			}
			if _, err := gas.At(r.Temperature, r.Pressure); err != nil {
				t.Errorf("finder returned a state the gas refuses: %v", err)
			}
		}
		s := tunnel.Section2D{Chord: q.New(c, q.Length), Height: q.New(h, q.Length), ShapeFactor: margin, AlphaDeg: coef, CL: coef, CD: vol, CM: -coef, Mach: mach}
		if r, err := tunnel.CorrectWalls2D(s); err == nil {
			if !allFinite(r.Sigma, r.Beta, r.SolidBlock, r.WakeBlock, r.Blockage, r.VelocityFactor, r.MachFactor, r.ReynoldsFactor,
				r.DynamicPressureFactor, r.AlphaDeg, r.CL, r.CD, r.CM, r.DeltaAlphaDeg, r.ChordToHeight) {
				t.Errorf("2-D: %+v", r)
			}
		}
		m := tunnel.Model3D{WingArea: q.New(c, q.Area), TunnelArea: q.New(h, q.Area), ModelVolume: q.New(vol, q.Volume), ShapeFactor: margin,
			Delta: ratio, AlphaDeg: coef, CL: coef, CD: vol, CM: -coef, CurvatureFactor: margin, LiftSlopePerDeg: ratio, TailCurvatureFactor: margin,
			TailMomentSlopePerDeg: -coef, Mach: mach}
		if r, err := tunnel.CorrectWalls3D(m); err == nil {
			if !allFinite(r.Beta, r.SolidBlock, r.WakeBlock, r.Blockage, r.DynamicPressureFactor, r.DeltaAlphaDeg, r.DeltaCD, r.DeltaAlphaCurvatureDeg,
				r.DeltaCLCurvature, r.DeltaCMCurvature, r.TailAngleDeg, r.DeltaCMTail, r.AlphaDeg, r.CL, r.CD, r.CM) {
				t.Errorf("3-D: %+v", r)
			}
		}
		if st, err := gas.At(q.New(tlo, q.Temperature), q.New(plo, q.Pressure)); err == nil {
			if !allFinite(st.Density.Value(), st.DynamicViscosity.Value(), st.KinematicViscosity.Value(), st.SpeedOfSound.Value()) {
				t.Errorf("gas state: %+v", st)
			}
		}
		if st, err := gas.StaticAt(fluids.Total{Temperature: q.New(thi, q.Temperature), Pressure: q.New(phi, q.Pressure)}, mach); err == nil {
			if !allFinite(st.Density.Value(), st.DynamicViscosity.Value(), st.KinematicViscosity.Value(), st.SpeedOfSound.Value()) {
				t.Errorf("static state: %+v", st)
			}
		}
	})
}
