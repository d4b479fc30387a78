package steady_test

import (
	"fmt"
	"strings"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

// A small log read whole with chanfile.ReadAll and reduced to steady
// points: the runs of the run-number channel (0 between runs), each
// channel's mean with its uncertainty. Package similarity/reduction does
// the same, and the zero, the calibrations and the groups, on a file of
// any length in bounded memory.
func Example_fromFile() {
	const log = `# invented towing-carriage log, 10 Hz
t,run,V,R
s,-,m/s,N
0.0,0,0.00,0.1
0.1,1,1.01,20.2
0.2,1,0.99,19.8
0.3,1,1.01,20.2
0.4,1,0.99,19.8
0.5,1,1.01,20.2
0.6,1,0.99,19.8
0.7,0,0.50,5.0
0.8,2,1.51,45.3
0.9,2,1.49,44.7
1.0,2,1.51,45.3
1.1,2,1.49,44.7
1.2,2,1.51,45.3
1.3,2,1.49,44.7
`
	r, err := chanfile.NewReader(strings.NewReader(log), "carriage.csv", chanfile.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	w, err := chanfile.ReadAll(r, 100_000)
	if err != nil {
		fmt.Println(err)
		return
	}
	var ws []steady.Window
	for _, run := range steady.Runs(w.Series[w.Index("run")]) {
		if run.Label > 0 {
			ws = append(ws, run.Window)
		}
	}
	chs := []steady.Channel{
		{Name: "V", Data: w.Series[w.Index("V")], DriftLimit: quantity.New(0.05, quantity.Velocity)},
		{Name: "R", Data: w.Series[w.Index("R")], DriftLimit: quantity.New(1, quantity.Force)},
	}
	pts, err := steady.Points(uncertain.NewSet(), chs, ws)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, p := range pts {
		v, _ := p.Value("V")
		f, _ := p.Value("R")
		fmt.Printf("%s: rows %d–%d  V = %v  R = %v (n_eff %.0f of %d)\n", p.Tag, p.Window.Start, p.Window.End-1, v.Mean, f.Mean, f.Stats.NEff, f.Stats.N)
	}
	// Each run alternates ±a about its mean, so the lag-1 correlation is
	// negative, no lag is summed and n_eff = n = 6; s = a·√(6/5) and
	// u = s/√6 = a/√5: for V, 0.01/√5 = 0.0045 m/s; for R in run 1,
	// 0.2/√5 = 0.089 N, in run 2, 0.3/√5 = 0.13 N.

	// Output:
	// point 1: rows 1–6  V = 1.0000 m/s ± 0.0045 m/s  R = 20.000 N ± 0.089 N (n_eff 6 of 6)
	// point 2: rows 8–13  V = 1.5000 m/s ± 0.0045 m/s  R = 45.00 N ± 0.13 N (n_eff 6 of 6)
}
