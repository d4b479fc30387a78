package steady_test

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

// docLog writes an INVENTED carriage log at 100 Hz: 300 samples of the
// zero (run 9, F = 0.8 N), 50 between runs (0), run 1 (V = 1 m/s,
// F = 0.8 + 4 N) and run 2 (V = 1.5 m/s, F = 0.8 + 9 N) of 300 samples,
// 50 between them, and a water temperature T_w of 18 °C; each channel
// alternates ±a about its level.
func docLog() string {
	var b strings.Builder
	b.WriteString("t [s],run [1],V [m/s],F [N],T_w [°C]\n")
	i := 0
	add := func(n int, run, v, f float64) {
		for range n {
			s := float64(i%2*2 - 1)
			fmt.Fprintf(&b, "%g,%g,%g,%g,%g\n", float64(i)/100, run, v+0.001*s, f+0.01*s, 18+0.002*s)
			i++
		}
	}
	add(300, 9, 0, 0.8)
	add(50, 0, 0.5, 2)
	add(300, 1, 1, 4.8)
	add(50, 0, 1.2, 6)
	add(300, 2, 1.5, 9.8)
	add(20, 0, 0.2, 1)
	return b.String()
}

// TestDocSteps runs the steps of the package doc as written there (a
// reader on a string in place of os.Open): the runs labelled 0 are
// dropped, the zero is run 9, and only F is tared — to 4 N and 9 N,
// the levels written less the 0.8 N offset.
func TestDocSteps(t *testing.T) {
	check := func(err error) {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
	}
	r, err := chanfile.NewReader(strings.NewReader(docLog()), "carriage.csv", chanfile.Options{})
	check(err)
	w, err := chanfile.ReadAll(r, 1_000_000)
	check(err)
	run, err := w.Channel("run")
	check(err)
	v, err := w.Channel("V")
	check(err)
	fx, err := w.Channel("F")
	check(err)
	var ws []steady.Window
	var zw steady.Window
	for _, r := range steady.Runs(run) {
		switch {
		case r.Label == 9:
			zw = r.Window
		case r.Label == 0 || r.Len() < 200:
		default:
			ws = append(ws, r.Window)
		}
	}
	set := uncertain.NewSet()
	chs := []steady.Channel{
		{Name: "V", Data: v, DriftLimit: quantity.New(0.01, quantity.Velocity)},
		{Name: "F", Data: fx, DriftLimit: quantity.New(0.5, quantity.Force)},
	}
	zero, err := steady.Reduce(set, "zero", chs, zw)
	check(err)
	pts, err := steady.Points(set, chs, ws)
	check(err)
	for i := range pts {
		pts[i], err = steady.Tare(pts[i], zero, "F")
		check(err)
	}
	tests := []struct {
		window steady.Window
		v, f   float64
		vTared bool
	}{
		{steady.Window{Start: 350, End: 650}, 1, 4, false},
		{steady.Window{Start: 700, End: 1000}, 1.5, 9, false},
	}
	if len(pts) != len(tests) {
		t.Fatalf("%d points, want %d", len(pts), len(tests))
	}
	for k, tt := range tests {
		p := pts[k]
		vv, _ := p.Value("V")
		fv, _ := p.Value("F")
		if p.Window != tt.window || math.Abs(vv.Mean.Value()-tt.v) > 1e-12 || math.Abs(fv.Mean.Value()-tt.f) > 1e-12 || vv.Tared || !fv.Tared {
			t.Errorf("point %d: %v V %v (tared %v) F %v (tared %v), want %v V %v F %v tared", k+1, p.Window, vv.Mean, vv.Tared, fv.Mean, fv.Tared, tt.window, tt.v, tt.f)
		}
	}
}
