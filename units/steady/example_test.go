package steady_test

import (
	"fmt"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

// The statistics of one channel over a window: the samples are taken as
// a correlated series, so the uncertainty of the mean uses n_eff, not n.
func ExampleSummarize() {
	x := quantity.NewSeries([]float64{11, 11, 9, 9}, quantity.Force)
	st, err := steady.Summarize(x, steady.Window{Start: 0, End: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("mean %v, s %.4f N, drift %.1f N\n", st.Mean, st.SD.Value(), st.Drift.Value())
	fmt.Printf("n = %d, n_eff = %.4f (%d lag), u(mean) = %.4f N\n", st.N, st.NEff, st.Lags, st.UMean.Value())
	// Output:
	// mean 10 N, s 1.1547 N, drift -2.4 N
	// n = 4, n_eff = 2.9091 (1 lag), u(mean) = 0.6770 N
}

// A calibration file read from text: a monotone table of a tachometer.
func ExampleParseCalibration() {
	const text = `# invented tachometer calibration
name         speed
raw          V
engineering  m/s
uncertainty  0.002
point  0  0
point  2  1.0
point  4  2.05
`
	c, err := steady.ParseCalibration(strings.NewReader(text), "speed.cal")
	if err != nil {
		fmt.Println(err)
		return
	}
	v, slope, _ := c.Eval(quantity.New(3, quantity.Voltage))
	fmt.Printf("3 V: %v (slope %.3f m/s per V)\n", v, slope.Value())
	_, _, err = c.Eval(quantity.New(4.5, quantity.Voltage))
	fmt.Println(err)
	// Output:
	// 3 V: 1.525 m·s⁻¹ (slope 0.525 m/s per V)
	// steady: calibration "speed": reading 4.5 V outside the calibrated range [0, 4] V
}

// The whole procedure on the invented 200 Hz towing-carriage log:
// calibrate the tachometer, take the steady runs from the run label and
// the zero from a time span, reduce, tare and calibrate the drag.
func Example() {
	log := carriage(1) // INVENTED data: see fixture_test.go
	speedCal, dragCal := mustCal("speed.cal"), mustCal("drag.cal")

	var speed quantity.Series
	if err := speedCal.Apply(&speed, log.tacho, "tacho", log.t); err != nil {
		fmt.Println(err)
		return
	}
	var ws []steady.Window
	for _, r := range steady.Runs(log.run) {
		if r.Label > 0 { // 0 is "between runs"
			ws = append(ws, r.Window)
		}
	}
	zw, err := steady.TimeWindows(log.t, steady.Span{From: quantity.New(0.5, quantity.Time), To: quantity.New(2.5, quantity.Time)})
	if err != nil {
		fmt.Println(err)
		return
	}
	chs := []steady.Channel{
		{Name: "speed", Data: speed, DriftLimit: quantity.New(0.005, quantity.Velocity)},
		{Name: "drag", Data: log.drag, DriftLimit: quantity.New(0.005e-3, quantity.Dimensionless)},
	}
	set := uncertain.NewSet()
	zero, err := steady.Reduce(set, "zero", chs[1:], zw[0])
	if err != nil {
		fmt.Println(err)
		return
	}
	pts, err := steady.Points(set, chs, ws)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("INVENTED carriage log, 200 Hz")
	for _, p := range pts {
		if p, err = steady.Tare(p, zero); err == nil {
			p, err = dragCal.Calibrate(set, p, "drag") // tared mV/V to N
		}
		if err == nil {
			p, err = speedCal.AddSource(set, p, "speed") // calibrated sample by sample
		}
		if err != nil {
			fmt.Println(err)
			return
		}
		v, _ := p.Value("speed")
		d, _ := p.Value("drag")
		fmt.Printf("%s: rows %d–%d  V = %v (n_eff %.0f of %d)  R = %v (n_eff %.0f of %d)\n",
			p.Tag, p.Window.Start, p.Window.End-1, v.Mean, v.Stats.NEff, v.Stats.N, d.Mean, d.Stats.NEff, d.Stats.N)
	}
	// Output:
	// INVENTED carriage log, 200 Hz
	// point 1: rows 1000–1799  V = 0.9999 m/s ± 0.0020 m/s (n_eff 800 of 800)  R = 40.24 N ± 0.16 N (n_eff 220 of 800)
	// point 2: rows 2000–2799  V = 1.5200 m/s ± 0.0020 m/s (n_eff 735 of 800)  R = 91.01 N ± 0.16 N (n_eff 207 of 800)
	// point 3: rows 3000–3799  V = 2.0499 m/s ± 0.0020 m/s (n_eff 738 of 800)  R = 163.20 N ± 0.16 N (n_eff 197 of 800)
}

func mustCal(name string) *steady.Calibration {
	b, err := testdataFile(name)
	if err != nil {
		panic(err)
	}
	c, err := steady.ParseCalibration(strings.NewReader(b), name)
	if err != nil {
		panic(err)
	}
	return c
}

// Detect finds the steady stretches of a channel by its moving-window
// criterion: here a level of 1 for 60 samples, a ramp of 20, and a level
// of 3 for 60, with a small alternating ripple.
func ExampleDetect() {
	v := make([]float64, 140)
	for i := range v {
		switch {
		case i < 60:
			v[i] = 1
		case i < 80:
			v[i] = 1 + 2*float64(i-59)/21
		default:
			v[i] = 3
		}
		v[i] += 0.01 * float64(1-2*(i%2))
	}
	ws, err := steady.Detect(steady.Criterion{Half: 5, MinLen: 20, Channels: []steady.Tolerance{{
		Name: "x", Data: quantity.NewSeries(v, quantity.Pressure),
		SD: quantity.New(0.05, quantity.Pressure), Change: quantity.New(0.02, quantity.Pressure),
	}}})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, w := range ws {
		fmt.Printf("rows %d to %d\n", w.Start, w.End-1)
	}
	// Rows 0–4 and 135–139 have no full window. Row 55's window reaches
	// the ramp's first row (1.095 Pa): its halves differ by 0.095/5 =
	// 0.019 Pa, within 0.02 Pa, so it is steady; row 56's differ by
	// (0.095 + 0.190)/5 = 0.057 Pa.

	// Output:
	// rows 5 to 55
	// rows 84 to 134
}
