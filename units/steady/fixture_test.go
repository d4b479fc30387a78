package steady_test

import (
	"math"
	"math/rand/v2"
	"os"

	"similis.dev/similis/quantity"
)

// The INVENTED towing-carriage log of the tests and examples: 200 Hz for
// 20 s (4000 rows), generated deterministically. Channels:
//
//	t      time, s
//	run    the carriage's run label: 0 between runs, 1, 2, 3 on the
//	       steady runs
//	tacho  tachometer voltage, V (calibrated by testdata/speed.cal)
//	drag   dynamometer bridge output, mV/V, held in SI (dimensionless,
//	       1 mV/V = 1e-3), with an offset of 0.040 mV/V
//
// The carriage stands still from 0 to 3 s (the zero window), accelerates
// to each run's speed, holds it, and stops at the end:
//
//	run 1:  5 s ≤ t < 9 s,  tacho 2.0 V,  drag 0.040 + 0.20 mV/V
//	run 2: 10 s ≤ t < 14 s, tacho 3.0 V,  drag 0.040 + 0.45 mV/V
//	run 3: 15 s ≤ t < 19 s, tacho 4.0 V,  drag 0.040 + 0.80 mV/V
//
// The drag channel's noise is a first-order autoregressive series, each
// sample φ = 0.6 times the last plus a normal innovation, with stationary
// standard deviation 0.002 mV/V; the tachometer's noise is white with
// standard deviation 0.004 V.
const (
	rate      = 200.0 // Hz
	rows      = 4000
	dragOff   = 0.040 // mV/V
	dragPhi   = 0.6
	dragSigma = 0.002 // mV/V, stationary
	tachSigma = 0.004 // V
)

var runs = []struct {
	from, to   float64 // s
	tacho, net float64 // V, mV/V
}{
	{5, 9, 2.0, 0.20},
	{10, 14, 3.0, 0.45},
	{15, 19, 4.0, 0.80},
}

type carriageLog struct {
	t, run, tacho, drag quantity.Series
}

// carriage returns the invented log, the same for each seed.
func carriage(seed uint64) carriageLog {
	r := rand.New(rand.NewPCG(seed, 7))
	t := make([]float64, rows)
	run := make([]float64, rows)
	tacho := make([]float64, rows)
	drag := make([]float64, rows)
	innov := dragSigma * math.Sqrt(1-dragPhi*dragPhi)
	e := r.NormFloat64() * dragSigma
	for i := range t {
		ti := float64(i) / rate
		t[i] = ti
		// The level: still, then each run, with linear ramps of 1 s
		// between them (the ramp up to run 1 takes 2 s).
		v, x := 0.0, 0.0
		prevV, prevX, prevEnd := 0.0, 0.0, 3.0
		for k, rn := range runs {
			switch {
			case ti >= rn.from && ti < rn.to:
				v, x, run[i] = rn.tacho, rn.net, float64(k+1)
			case ti >= prevEnd && ti < rn.from:
				f := (ti - prevEnd) / (rn.from - prevEnd)
				v, x = prevV+f*(rn.tacho-prevV), prevX+f*(rn.net-prevX)
			}
			prevV, prevX, prevEnd = rn.tacho, rn.net, rn.to
		}
		if ti >= 19 { // stopping
			f := (ti - 19) / 1
			v, x = prevV*(1-f), prevX*(1-f)
		}
		e = dragPhi*e + innov*r.NormFloat64()
		tacho[i] = v + tachSigma*r.NormFloat64()
		drag[i] = (dragOff + x + e) * 1e-3
	}
	return carriageLog{
		t:     quantity.NewSeries(t, quantity.Time),
		run:   quantity.NewSeries(run, quantity.Dimensionless),
		tacho: quantity.NewSeries(tacho, quantity.Voltage),
		drag:  quantity.NewSeries(drag, quantity.Dimensionless),
	}
}

func testdataFile(name string) (string, error) {
	b, err := os.ReadFile("testdata/" + name)
	return string(b), err
}
