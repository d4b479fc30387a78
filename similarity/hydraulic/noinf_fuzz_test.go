package hydraulic_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// FuzzHydraulic calls every hydraulic-model entry
// point with fuzzed finite and extreme values: none may panic, and a nil
// error means every number returned is finite.
func FuzzHydraulic(f *testing.F) {
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
		lim := hydraulic.WeirLimits()
		lim.MinReynolds, lim.MinWeber = e, math.Abs(a)
		cs, err := hydraulic.FreeSurfaceChecks(q.New(v, q.Velocity), q.New(h, q.Length), q.New(c, q.KinematicViscosity), q.New(k, q.Density), q.New(b, q.SurfaceTension), lim)
		for _, ck := range cs {
			finite("FreeSurfaceChecks", err, ck.Value, ck.Limit)
		}
		rc, err := hydraulic.CrestRadiusCheck(q.New(h, q.Length), lim)
		finite("CrestRadiusCheck", err, rc.Value, rc.Limit)
		theta, reStar, err := hydraulic.Shields(hydraulic.ShieldsInput{BedShearStress: q.New(d, q.Pressure), GrainDensity: q.New(b, q.Density), WaterDensity: q.New(k, q.Density), GrainDiameter: q.New(h, q.Length), KinematicViscosity: q.New(c, q.KinematicViscosity), Gravity: q.New(e, q.Acceleration)})
		finite("Shields", err, theta, reStar)
		sd, err := hydraulic.SedimentFor(hydraulic.SedimentRatios{Horizontal: a, Vertical: b, RelativeDensity: c, Viscosity: d})
		finite("SedimentFor", err, sd.Shear, sd.Grain, sd.ReStar)
		pc, err := hydraulic.ParticleReynoldsCheck(e)
		finite("ParticleReynoldsCheck", err, pc.Value, pc.Limit)
		mc, err := hydraulic.ModelManningCheck(q.New(a, hydraulic.ManningDim), k)
		finite("ModelManningCheck", err, mc.Value, mc.Limit)
		mr, err := hydraulic.ManningRatio(h)
		finite("ManningRatio", err, mr)
		dist, err := hydraulic.DistortedFroude(hydraulic.DistortedScales{Horizontal: a, Vertical: h})
		finite("DistortedFroude", err, dist.Distortion, dist.Velocity, dist.Time, dist.Discharge, dist.Area, dist.Slope, dist.Manning)
		dc, err := hydraulic.DistortionCheck(hydraulic.Distorted{Distortion: v})
		finite("DistortionCheck", err, dc.Value, dc.Limit)
		_ = hydraulic.GrainClass(h)
	})
}
