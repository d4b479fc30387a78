package reduction_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

func mustUnit(t testing.TB, s string) units.Unit {
	t.Helper()
	u, err := units.Parse(s)
	if err != nil {
		t.Fatal(err)
	}
	return u
}

// dragSet is the Pi set of a towed body's drag: F, ρ, V, L, ν, with
// groups F/(ρV²L²) and Re = VL/ν.
func dragSet(t testing.TB) *pigroups.Set {
	t.Helper()
	p, err := pigroups.NewProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
	)
	if err != nil {
		t.Fatal(err)
	}
	s, err := p.PiSet("rho", "V", "L")
	if err != nil {
		t.Fatal(err)
	}
	return s.WithConventional()
}

// TestHandCase reduces a history of 14 rows written out, with two runs
// and a zero, and checks every mean and uncertainty against a hand
// calculation.
func TestHandCase(t *testing.T) {
	nan := math.NaN()
	_ = nan
	// rows:      zero (run 9)      gap  run 1              gap  run 2
	run := []float64{9, 9, 9, 9, 0, 1, 1, 1, 1, 0, 2, 2, 2, 2}
	V := []float64{0, 0, 0, 0, 1, 1.9, 2.1, 1.9, 2.1, 2, 2.95, 3.05, 2.95, 3.05}
	F := []float64{0.5, 0.7, 0.5, 0.7, 3, 10.6, 10.4, 10.6, 10.4, 15, 20.6, 20.8, 20.6, 20.8}
	cols := []chanfile.Column{
		{Name: "run", Unit: units.One()},
		{Name: "V", Unit: mustUnit(t, "m/s")},
		{Name: "F", Unit: mustUnit(t, "N")},
	}
	src, err := chanfile.NewSeriesSource(cols, []quantity.Series{
		quantity.NewSeries(run, 0), quantity.NewSeries(V, quantity.Velocity), quantity.NewSeries(F, quantity.Force)})
	if err != nil {
		t.Fatal(err)
	}
	spec := &reduction.Spec{
		Derive: "rho = 1000 {kg/m^3}; L = 2 {m}; nu = 1e-6 {m^2/s}",
		Points: reduction.Runs("run", 4, 0, 9),
		Zero:   ptr(reduction.Run("run", 4, 9)),
		Tare:   []string{"F"},
		Set:    dragSet(t),
	}
	res, err := spec.Reduce(reduction.Input{Name: "hand", Source: src})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Points) != 2 {
		t.Fatalf("%d points, want 2", len(res.Points))
	}
	// Every window alternates a ± d about its mean, so its lag-1
	// autocorrelation is negative, the sum stops at K = 0 and n_eff = n = 4:
	// s² = 4d²/3, u(mean) = s/√4 = d/√3.
	//   zero F: mean 0.6, d 0.1 → u 0.057735
	//   run 1: V 2.0 (d 0.1, u 0.057735), F 10.5 (d 0.1) → tared 9.9,
	//          u = √(0.057735² + 0.057735²) = 0.081650
	//   run 2: V 3.0 (d 0.05, u 0.028868), F 20.7 → tared 20.1, u 0.081650
	// Groups: Π₁ = F/(ρV²L²), u_rel² = u_rel(F)² + (2·u_rel(V))²;
	//         Re = V·L/ν, u_rel = u_rel(V).
	//   run 1: Π₁ = 9.9/(1000·4·4) = 6.1875e-4, u_rel² = (0.08165/9.9)² +
	//          (2·0.057735/2)² = 6.802e-5 + 3.3333e-3 → u_rel 0.058325,
	//          u = 3.6089e-5; Re = 2·2/1e-6 = 4e6, u = 4e6·0.028868 = 115470
	//   run 2: Π₁ = 20.1/(1000·9·4) = 5.5833e-4, u_rel² = (0.08165/20.1)² +
	//          (2·0.028868/3)² = 1.6502e-5 + 3.7037e-4 → u_rel 0.019669,
	//          u = 1.0982e-5; Re = 6e6, u = 6e6·0.0096225 = 57735
	want := []struct {
		V, uV, F, uF, pi, upi, re, ure float64
	}{
		{2.0, 0.057735, 9.9, 0.081650, 6.1875e-4, 3.6089e-5, 4e6, 115470},
		{3.0, 0.028868, 20.1, 0.081650, 5.5833e-4, 1.0982e-5, 6e6, 57735},
	}
	close := func(what string, got, want, rel float64) {
		t.Helper()
		if math.Abs(got-want) > rel*math.Abs(want) {
			t.Errorf("%s = %.6g, want %.6g", what, got, want)
		}
	}
	for i, p := range res.Points {
		w := want[i]
		v, _ := pointValue(p, "V")
		f, _ := pointValue(p, "F")
		close(p.Tag+" V", v.Mean.Value(), w.V, 1e-12)
		close(p.Tag+" u(V)", v.Mean.U().Value(), w.uV, 1e-4)
		close(p.Tag+" F", f.Mean.Value(), w.F, 1e-12)
		close(p.Tag+" u(F)", f.Mean.U().Value(), w.uF, 1e-4)
		if v.Stats.NEff != 4 {
			t.Errorf("%s: n_eff(V) = %g, want 4", p.Tag, v.Stats.NEff)
		}
		close(p.Tag+" Π₁", p.Groups[0].Value(), w.pi, 1e-4)
		close(p.Tag+" u(Π₁)", p.Groups[0].U().Value(), w.upi, 1e-3)
		close(p.Tag+" Re", p.Groups[1].Value(), w.re, 1e-12)
		close(p.Tag+" u(Re)", p.Groups[1].U().Value(), w.ure, 1e-4)
	}
	if got := res.Groups[1].Column; got != "Re" {
		t.Errorf("second group's column %q, want Re", got)
	}
	if res.Points[0].Tag != "run 1" || res.Points[1].Window.Start != 10 {
		t.Errorf("points %q %v", res.Points[0].Tag, res.Points[1].Window)
	}
}

func ptr[T any](x T) *T { return &x }

func pointValue(p reduction.Point, name string) (steady.Value, bool) { return p.Value(name) }

// TestHandCalibrations: the hand case with the dynamometer calibrated at
// the tared mean (F_eng = 2·F, u_cal 0.1 N) and the speed sample by
// sample (V_eng = V + 0.1 m/s, u_cal 0.01 m/s), both by hand:
//
//	run 1: F = 2·9.9 = 19.8 N, u = √((2·0.081650)² + 0.1²) = 0.19149 N
//	       V = 2.0 + 0.1 = 2.1 m/s, u = √(0.057735² + 0.01²) = 0.058595 m/s
func TestHandCalibrations(t *testing.T) {
	parse := func(text string) *steady.Calibration {
		c, err := steady.ParseCalibration(strings.NewReader(text), "hand.cal")
		if err != nil {
			t.Fatal(err)
		}
		return c
	}
	fcal := parse("name dyn\nraw N\nengineering N\nrange -100 100\nuncertainty 0.1\nc0 0\nc1 2\n")
	vcal := parse("name speed\nraw m/s\nengineering m/s\nrange -10 10\nuncertainty 0.01\nc0 0.1\nc1 1\n")
	run := []float64{9, 9, 9, 9, 0, 1, 1, 1, 1}
	V := []float64{0, 0, 0, 0, 1, 1.9, 2.1, 1.9, 2.1}
	F := []float64{0.5, 0.7, 0.5, 0.7, 3, 10.6, 10.4, 10.6, 10.4}
	src, err := chanfile.NewSeriesSource([]chanfile.Column{
		{Name: "run", Unit: units.One()}, {Name: "V", Unit: mustUnit(t, "m/s")}, {Name: "F", Unit: mustUnit(t, "N")}},
		[]quantity.Series{quantity.NewSeries(run, 0), quantity.NewSeries(V, quantity.Velocity), quantity.NewSeries(F, quantity.Force)})
	if err != nil {
		t.Fatal(err)
	}
	spec := &reduction.Spec{
		Derive:       "rho = 1000 {kg/m^3}; L = 2 {m}; nu = 1e-6 {m^2/s}",
		Points:       reduction.Runs("run", 4, 0, 9),
		Zero:         ptr(reduction.Run("run", 4, 9)),
		Tare:         []string{"F"},
		Calibrations: []reduction.Calibration{{Channel: "F", Cal: fcal}, {Channel: "V", Cal: vcal, Samples: true}},
		Set:          dragSet(t),
	}
	res, err := spec.Reduce(reduction.Input{Name: "hand", Source: src})
	if err != nil {
		t.Fatal(err)
	}
	f, _ := res.Points[0].Value("F")
	v, _ := res.Points[0].Value("V")
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"F", f.Mean.Value(), 19.8}, {"u(F)", f.Mean.U().Value(), 0.19149},
		{"V", v.Mean.Value(), 2.1}, {"u(V)", v.Mean.U().Value(), 0.058595},
	} {
		if math.Abs(c.got-c.want) > 1e-4*c.want {
			t.Errorf("%s = %.6g, want %.6g", c.what, c.got, c.want)
		}
	}
	if V[5] != 1.9 {
		t.Error("the sample calibration changed the caller's series")
	}
	// A reading outside the calibrated range is refused with its row.
	vcal = parse("name speed\nraw m/s\nengineering m/s\nrange 0.5 10\nuncertainty 0.01\nc0 0.1\nc1 1\n")
	spec.Calibrations[1].Cal = vcal
	src.Rewind()
	_, err = spec.Reduce(reduction.Input{Name: "hand", Source: src})
	var re *reduction.Error
	if !errors.As(err, &re) || re.Row != 1 || re.Op != "calibrate" || !errors.Is(err, quantity.ErrRange) {
		t.Errorf("V = 0 outside [0.5, 10]: %v", err)
	}
}

// TestHandZeroFile: the zero read from a file of its own gives the same
// tared means and uncertainties as the zero window of the hand case.
func TestHandZeroFile(t *testing.T) {
	cols := []chanfile.Column{{Name: "run", Unit: units.One()}, {Name: "V", Unit: mustUnit(t, "m/s")}, {Name: "F", Unit: mustUnit(t, "N")}}
	src, _ := chanfile.NewSeriesSource(cols, []quantity.Series{
		quantity.NewSeries([]float64{1, 1, 1, 1}, 0), quantity.NewSeries([]float64{1.9, 2.1, 1.9, 2.1}, quantity.Velocity),
		quantity.NewSeries([]float64{10.6, 10.4, 10.6, 10.4}, quantity.Force)})
	zero, _ := chanfile.NewSeriesSource(cols[2:], []quantity.Series{quantity.NewSeries([]float64{0.5, 0.7, 0.5, 0.7}, quantity.Force)})
	spec := &reduction.Spec{
		Derive: "rho = 1000 {kg/m^3}; L = 2 {m}; nu = 1e-6 {m^2/s}",
		Points: reduction.Runs("run", 4),
		Tare:   []string{"F"},
		Set:    dragSet(t),
	}
	res, err := spec.Reduce(reduction.Input{Name: "hand", Source: src, Zero: zero})
	if err != nil {
		t.Fatal(err)
	}
	f, _ := res.Points[0].Value("F")
	// 10.5 − 0.6 = 9.9 N, u = √2·0.057735 = 0.081650 N (TestHandCase).
	if math.Abs(f.Mean.Value()-9.9) > 1e-12 || math.Abs(f.Mean.U().Value()-0.081650) > 1e-5 || !f.Tared {
		t.Errorf("F = %v (tared %v), want 9.900 N ± 0.082 N", f.Mean, f.Tared)
	}
}
