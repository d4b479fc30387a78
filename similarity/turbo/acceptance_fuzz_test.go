package turbo_test

import (
	"math"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// FuzzAcceptance runs ReducePoints, FitPumpCurves, CheckGuarantee and
// FindNPSH3 on fuzzed finite and extreme readings: none may panic, every
// error matches exactly one class, and a nil error means every number
// returned is finite.
func FuzzAcceptance(f *testing.F) {
	f.Add(0.1, 40.0, 50e3, 1480.0, 0.02, 3.0, 0.8, 1e3)
	f.Add(1e300, 1e-300, math.MaxFloat64, 5e-324, 1e300, -1e300, 2.0, 0.0)
	f.Add(5e-324, 1e300, 1e-300, 1e300, -0.5, 1e-300, 0.0, math.MaxFloat64)
	f.Fuzz(func(t *testing.T, qv, h, p, n, dq, x, eta, pg float64) {
		check := func(name string, err error, xs ...float64) {
			t.Helper()
			if err != nil {
				if oneClass(err) == nil {
					t.Fatalf("%s: %v matches no class or several", name, err)
				}
				return
			}
			for i, v := range xs {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("%s: value %d is %v with a nil error", name, i, v)
				}
			}
		}
		var pts []turbo.TestPoint
		for i := range 6 {
			k := 1 + dq*float64(i-3)
			pts = append(pts, turbo.TestPoint{Flow: q.New(qv*k, q.VolumeFlowRate), Head: q.New(h*(2-k*k), q.Length),
				Power: q.New(p*k, q.Power), Speed: rpm.Of(n * (1 + 0.01*float64(i)))})
		}
		red, err := turbo.ReducePoints(pts, turbo.TestConditions{SpecifiedSpeed: rpm.Of(n), Density: q.New(rhoWater, q.Density)})
		for _, r := range red {
			check("ReducePoints", err, r.Flow.Value(), r.Head.Value(), r.Power.Value(), r.Efficiency)
		}
		check("ReducePoints", err)
		if err == nil {
			c, err := turbo.FitPumpCurves(red, turbo.CurveOptions{MaxOrder: 2})
			check("FitPumpCurves", err)
			if err == nil {
				g := turbo.Guarantee{Flow: q.New(qv*x, q.VolumeFlowRate), Head: q.New(h, q.Length), Efficiency: eta, Power: q.New(pg, q.Power)}
				for _, gr := range turbo.Grades() {
					v, err := turbo.CheckGuarantee(c, g, gr)
					check("CheckGuarantee", err, v.HeadAtGuaranteeFlow.Y, v.Intersection[0], v.Intersection[1], v.EfficiencyAt.Y,
						v.PowerAt.Y, v.FlowAtGuaranteeHead, v.EfficiencyMin, v.PowerMax, v.HeadBar[0], v.HeadBar[1], v.FlowBar[0], v.FlowBar[1])
				}
			}
		}
		s := series(x, h*0.9, x+dq, h*0.97, x+2*dq, h*eta, x+3*dq, h, x+4*dq, h, x+5*dq, h*(1+1e-3*eta))
		r, err := turbo.FindNPSH3(s, turbo.NPSH3Options{NPSHU: q.New(math.Abs(pg), q.Length)})
		check("FindNPSH3", err, r.NPSH3.Value(), r.U.Value(), r.UFromHead.Value(), r.UFromNPSHA.Value(), r.Slope, r.ReferenceHead.Value(), r.DropHead.Value())
	})
}
