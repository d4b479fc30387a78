package fit

import (
	"encoding/binary"
	"math"
	"testing"
)

// floats decodes up to 3·64 float64 values from b.
func floats(b []byte) []float64 {
	var v []float64
	for len(b) >= 8 && len(v) < 192 {
		v = append(v, math.Float64frombits(binary.LittleEndian.Uint64(b)))
		b = b[8:]
	}
	return v
}

func seedBytes(v ...float64) []byte {
	var b []byte
	for _, x := range v {
		b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x))
	}
	return b
}

// FuzzFitPoly: no panic, and a nil error means finite results.
func FuzzFitPoly(f *testing.F) {
	f.Add(seedBytes(1, 1, 1, 2, 2, 4, 3, 9, 4, 16.5, 5, 25), uint8(2), false, uint8(0))
	f.Add(seedBytes(1, 1, 1, 1.1, 2, 4, 1e300, 9, 4, -1e300, 5, 25, 0, 0, 7, 1), uint8(1), true, uint8(1))
	f.Add(seedBytes(0, 0, 1e-300, 1, 2e-300, 0, 3e-300, 1), uint8(3), false, uint8(1))
	f.Fuzz(func(t *testing.T, data []byte, order uint8, weighted bool, crit uint8) {
		v := floats(data)
		n := len(v) / 3
		x, y, w := v[:n], v[n:2*n], v[2*n:3*n]
		opt := &Options{}
		if weighted {
			opt.Weights = w
		}
		check := func(p *Poly) {
			for k := range p.B {
				if !finite(p.B[k]) || !finite(p.StdErr[k]) || !finite(p.Intervals[k][0]) || !finite(p.Intervals[k][1]) {
					t.Fatalf("coefficient %d not finite: %v ± %v", k, p.B[k], p.StdErr[k])
				}
			}
			if !allFinite(p.S, p.SSE, p.R2, p.Center, p.Scale) {
				t.Fatalf("S %v SSE %v R² %v centre %v scale %v", p.S, p.SSE, p.R2, p.Center, p.Scale)
			}
			for _, r := range p.Rows {
				if !allFinite(r.Fit, r.Residual, r.Leverage, r.Studentized, r.Cook) {
					t.Fatalf("row %+v", r)
				}
			}
			if l := p.LackOfFit; l != nil && !allFinite(l.F, l.P, l.SSPure, l.SSLack) {
				t.Fatalf("lack of fit %+v", l)
			}
			for _, xi := range []float64{p.XMin, p.XMax, p.XMin/2 + p.XMax/2} {
				if pr, err := p.Predict(xi); err == nil && !allFinite(pr.Y, pr.SE, pr.Mean[0], pr.Mean[1], pr.New[0], pr.New[1]) {
					t.Fatalf("prediction %+v", pr)
				}
			}
			if a, se, err := p.Power(); err == nil && (!allFinite(a...) || !allFinite(se...)) {
				t.Fatalf("Power: %v ± %v with a nil error", a, se)
			}
			_, _ = p.Monotone(p.XMin, p.XMax)
		}
		if p, err := FitPoly(x, y, int(order%8), opt); err == nil {
			check(p)
		}
		if p, err := SelectPoly(x, y, int(order%6), Criterion(crit%3), opt); err == nil {
			check(p)
		}
		if fr, err := Fair(x, y); err == nil {
			lo, hi := fr.Range()
			for _, xi := range []float64{lo, hi, lo/2 + hi/2} {
				if v, err := fr.At(xi); err == nil && !finite(v) {
					t.Fatalf("fairing at %v = %v", xi, v)
				}
			}
		}
	})
}

// FuzzFitCurve: no panic, bounded work, and a nil error means finite
// parameters, standard errors and predictions.
func FuzzFitCurve(f *testing.F) {
	f.Add(seedBytes(0.1, 0.2, 0.3, 0.4, 0.056, 0.158, 0.29, 0.44), 1.5, 1.5)
	f.Add(seedBytes(1, 2, 3, 1, 2, 3), 0.0, 0.0)
	f.Fuzz(func(t *testing.T, data []byte, c0, n0 float64) {
		v := floats(data)
		n := min(len(v)/2, 24)
		x, y := v[:n], v[n:2*n]
		model := func(x float64, p []float64) float64 { return p[0] * math.Pow(x, p[1]) }
		c, err := FitCurve(model, x, y, []float64{c0, n0}, nil)
		if err != nil {
			return
		}
		if !allFinite(c.P...) || !allFinite(c.StdErr...) || !allFinite(c.S, c.SSE) {
			t.Fatalf("P %v SE %v S %v", c.P, c.StdErr, c.S)
		}
		if pr, err := c.Predict(c.XMin); err == nil && !allFinite(pr.Y, pr.SE, pr.New[0], pr.New[1]) {
			t.Fatalf("prediction %+v", pr)
		}
	})
}
