package tunnel_test

import (
	"math"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/tunnel"
)

// FuzzParseCalibration: any text ends in a calibration or an error of one
// class, never a panic; a calibration read reduces its own readings of
// mid-range loads back to those loads.
func FuzzParseCalibration(f *testing.F) {
	f.Add(calText)
	f.Add("similis-balance 1\nform loads-from-readings\nreadings uV/V\ncomponent YM in*lbf -5 5\nlinear YM 2\nquadratic YM 1e-3\n")
	f.Add("similis-balance 1\nform readings-from-loads\nreadings mV/V\ncomponent NF N -1e308 1e308\nlinear NF 1e-308\n")
	f.Add("similis-balance 1\nname \u202e\nform x\n")
	f.Fuzz(func(t *testing.T, text string) {
		c, err := tunnel.ParseCalibration(strings.NewReader(text))
		if err != nil {
			oneClass(t, err)
			return
		}
		var l tunnel.Loads
		for _, cr := range c.Components() {
			l[cr.Component] = (cr.Min + cr.Max) / 2
		}
		r, err := c.Readings(l)
		if err != nil {
			oneClass(t, err)
			return
		}
		back, err := c.Loads(r)
		if err != nil {
			oneClass(t, err)
			return
		}
		for _, v := range back {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("loads %v with a nil error", back)
			}
		}
	})
}

// FuzzReduce drives the reduction's entry points — the balance's loads,
// the axis and moment transfers, the weight tare and a whole point — with
// any finite or non-finite numbers: none may panic, an error matches one
// class, and a result with a nil error is finite.
func FuzzReduce(f *testing.F) {
	f.Add(0.3, 0.02, 0.05, 4.0, 0.0, 1000.0, 0.05, 20.0, 0.0)
	f.Add(1e308, -1e308, 5e-324, 180.0, -180.0, 1e-300, 1e300, 1e300, 0.8)
	f.Add(math.NaN(), math.Inf(1), 0.0, 90.0, 90.0, -1.0, -100.0, -5.0, 2.0)
	f.Fuzz(func(t *testing.T, r0, r1, r2, pitch, roll, qd, dx, w, mach float64) {
		c := diagonal(t)
		red := tunnel.Reduction{
			Calibration: c,
			Tare:        tunnel.WeightTare{Weight: w, CG: [3]float64{dx, 0, dx}},
			Offset:      tunnel.Offset{X: q.New(dx, q.Length)},
			Reference:   tunnel.Reference{Area: q.New(0.5, q.Area), Span: q.New(2, q.Length), Chord: q.New(0.2, q.Length)},
			Walls:       tunnel.Model3D{TunnelArea: q.New(6, q.Area), ModelVolume: q.New(0.01, q.Volume), ShapeFactor: 0.9, Delta: 0.12},
		}
		att := tunnel.Attitude{PitchDeg: pitch, RollDeg: roll}
		out, err := red.Reduce(tunnel.Point{Readings: []float64{r0, r1, r2}, Attitude: att, DynamicPressure: q.New(qd, q.Pressure), Mach: mach})
		if err != nil {
			oneClass(t, err)
		} else {
			cs := out.Corrected
			for _, v := range []float64{cs.AlphaDeg, cs.CL, cs.CD, cs.CM, out.Uncorrected.Cl, out.Uncorrected.Cn, out.Uncorrected.CY, out.BetaDeg} {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("non-finite result %+v with a nil error", out)
				}
			}
		}
		var l tunnel.Loads
		l[tunnel.NormalForce], l[tunnel.AxialForce], l[tunnel.SideForce], l[tunnel.PitchingMoment] = r0, r1, r2, w
		if wl, err := l.ToWind(pitch, roll); err != nil {
			oneClass(t, err)
		} else if math.IsNaN(wl.Drag + wl.Lift + wl.Side + wl.Roll + wl.Pitch + wl.Yaw) {
			t.Fatalf("wind loads %+v", wl)
		}
		if _, err := l.About(tunnel.Offset{X: q.New(dx, q.Length), Z: q.New(qd, q.Length)}); err != nil {
			oneClass(t, err)
		}
		pts := []tunnel.TarePoint{{Attitude: att, Loads: l}, {Attitude: tunnel.Attitude{PitchDeg: pitch / 2}, Loads: l.Sub(l)}}
		if tr, err := tunnel.FitWeightTare(pts, []tunnel.Component{tunnel.NormalForce, tunnel.AxialForce, tunnel.PitchingMoment}); err != nil {
			oneClass(t, err)
		} else if math.IsNaN(tr.Weight+tr.CG[0]+tr.CG[1]+tr.CG[2]) || math.IsInf(tr.Weight+tr.CG[0]+tr.CG[2], 0) {
			t.Fatalf("tare %+v", tr)
		}
		if p, err := tunnel.FitPolar([]float64{pitch, roll, dx, 1}, []float64{r0, r1, r2, 0.1}, []float64{qd, w, mach, 0.02}, -10, 20, 0); err != nil {
			oneClass(t, err)
		} else if math.IsNaN(p.LiftSlopePerDeg.Value + p.ZeroLiftAlphaDeg.Interval[1] + p.K.Interval[0]) {
			t.Fatalf("polar %+v", p)
		}
	})
}
