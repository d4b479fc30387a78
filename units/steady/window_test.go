package steady_test

import (
	"errors"
	"math"
	"os"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

func TestRuns(t *testing.T) {
	nan := math.NaN()
	got := steady.Runs(quantity.NewSeries([]float64{0, 0, 1, 1, 1, nan, 1, 2, 0}, quantity.Dimensionless))
	want := []steady.Run{
		{Window: steady.Window{Start: 0, End: 2}, Label: 0},
		{Window: steady.Window{Start: 2, End: 5}, Label: 1},
		{Window: steady.Window{Start: 6, End: 7}, Label: 1},
		{Window: steady.Window{Start: 7, End: 8}, Label: 2},
		{Window: steady.Window{Start: 8, End: 9}, Label: 0},
	}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
	w := steady.RunsWhere([]bool{true, false, true, true, true, false, true, true}, 2)
	if d := cmp.Diff([]steady.Window{{Start: 2, End: 5}, {Start: 6, End: 8}}, w); d != "" {
		t.Errorf("RunsWhere (-want +got)\n%s", d)
	}
}

func sec(v float64) quantity.Quantity { return quantity.New(v, quantity.Time) }

func TestTimeWindows(t *testing.T) {
	tm := quantity.NewSeries([]float64{0, 0.5, 1, 1.5, 2, 2.5, 3}, quantity.Time)
	got, err := steady.TimeWindows(tm, steady.Span{From: sec(0.5), To: sec(1.5)}, steady.Span{From: sec(0.7), To: sec(3)})
	if err != nil {
		t.Fatal(err)
	}
	// [0.5, 1.5] holds rows 1, 2, 3; [0.7, 3] rows 2 … 6.
	if d := cmp.Diff([]steady.Window{{Start: 1, End: 4}, {Start: 2, End: 7}}, got); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
	for _, tc := range []struct {
		name  string
		t     quantity.Series
		span  steady.Span
		class error
	}{
		{"before the record", tm, steady.Span{From: sec(-1), To: sec(1)}, quantity.ErrRange},
		{"after the record", tm, steady.Span{From: sec(1), To: sec(3.5)}, quantity.ErrRange},
		{"reversed", tm, steady.Span{From: sec(2), To: sec(1)}, quantity.ErrInvalid},
		{"too few samples", tm, steady.Span{From: sec(1), To: sec(1.6)}, quantity.ErrInvalid},
		{"span not a time", tm, steady.Span{From: quantity.New(1, quantity.Length), To: sec(2)}, quantity.ErrInvalid},
		{"time not a time", quantity.NewSeries([]float64{0, 1, 2}, quantity.Length), steady.Span{From: sec(0), To: sec(2)}, quantity.ErrDimension},
		{"not increasing", quantity.NewSeries([]float64{0, 1, 1, 2}, quantity.Time), steady.Span{From: sec(0), To: sec(2)}, quantity.ErrInvalid},
		{"missing time", quantity.NewSeries([]float64{0, math.NaN(), 2}, quantity.Time), steady.Span{From: sec(0), To: sec(2)}, quantity.ErrRange},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := steady.TimeWindows(tc.t, tc.span)
			oneClass(t, err, tc.class)
		})
	}
}

func readCal(t testing.TB, name string) *steady.Calibration {
	t.Helper()
	f, err := os.Open("testdata/" + name)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	c, err := steady.ParseCalibration(f, name)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestCarriage runs the whole procedure on the invented carriage log and
// checks each point against the levels the log was generated with.
func TestCarriage(t *testing.T) {
	log := carriage(1)
	speedCal, dragCal := readCal(t, "speed.cal"), readCal(t, "drag.cal")
	var speed quantity.Series
	if err := speedCal.Apply(&speed, log.tacho, "tacho", log.t); err != nil {
		t.Fatal(err)
	}
	var ws []steady.Window
	for _, r := range steady.Runs(log.run) {
		if r.Label > 0 {
			ws = append(ws, r.Window)
		}
	}
	// Run k holds the rows of from ≤ i/200 < to.
	if d := cmp.Diff([]steady.Window{{Start: 1000, End: 1800}, {Start: 2000, End: 2800}, {Start: 3000, End: 3800}}, ws); d != "" {
		t.Fatalf("runs (-want +got)\n%s", d)
	}
	zw, err := steady.TimeWindows(log.t, steady.Span{From: sec(0.5), To: sec(2.5)})
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([]steady.Window{{Start: 100, End: 501}}, zw); d != "" {
		t.Fatalf("zero window (-want +got)\n%s", d)
	}
	chs := []steady.Channel{
		{Name: "speed", Data: speed, DriftLimit: quantity.New(0.005, quantity.Velocity)},
		{Name: "drag", Data: log.drag, DriftLimit: quantity.New(0.005e-3, quantity.Dimensionless)},
	}
	set := uncertain.NewSet()
	zero, err := steady.Reduce(set, "zero", chs[1:], zw[0])
	if err != nil {
		t.Fatal(err)
	}
	pts, err := steady.Points(set, chs, ws)
	if err != nil {
		t.Fatal(err)
	}
	// Drag zero: the offset 0.040 mV/V; u = σ√((1+φ)/(n(1−φ))) =
	// 0.002·√(1.6/(401·0.4)) = 0.000200 mV/V (the AR(1) closed form).
	z, _ := zero.Value("drag")
	checkLevel(t, "zero drag", z, 0.040e-3, 0.000200e-3)
	wantSpeed := []float64{1.0, 1.52, 2.05} // the table's rows at 2, 3, 4 V
	for k, p := range pts {
		p, err := steady.Tare(p, zero)
		if err != nil {
			t.Fatal(err)
		}
		// Speed: white noise of 0.004 V at the table's slope (0.5 m/s/V
		// below 2 V and 0.52 above, 0.52 and 0.53 about 3 and 4 V); u ≈
		// 0.004·0.51/√800 = 7.2e-5 m/s.
		sv, _ := p.Value("speed")
		checkLevel(t, "speed", sv, wantSpeed[k], 7.2e-5)
		if sv.Tared {
			t.Errorf("point %d: speed tared by a zero without a speed channel", k+1)
		}
		// Drag, tared: the net level; u² of the point 0.002²·4/800 plus
		// the zero's 0.0002², (1.414e-4)² + (2.0e-4)² = (2.45e-4 mV/V)².
		dv, _ := p.Value("drag")
		checkLevel(t, "point drag", dv, runs[k].net*1e-3, 0.000141e-3)
		if dv.Drifting {
			t.Errorf("point %d: drag flagged drifting by %v", k+1, dv.Stats.Drift)
		}
		if u := dv.Mean.U().Value(); math.Abs(u-0.000245e-3) > 0.25*0.000245e-3 {
			t.Errorf("point %d: tared drag u = %.3g, want 2.45e-7 within 25 %%", k+1, u)
		}
		// Calibrated: F = 200x + 5x² N (x in mV/V); at x = 0.20:
		// 40 + 0.2 = 40.2 N, at 0.45: 90 + 1.0125 = 91.0125 N, at 0.80:
		// 160 + 3.2 = 163.2 N. dF/dx = 200 + 10x = 202, 204.5, 208
		// N/(mV/V); u² = (dF/dx · 2.45e-4)² + 0.15² (the calibration's).
		p, err = dragCal.Calibrate(set, p, "drag")
		if err != nil {
			t.Fatal(err)
		}
		dv, _ = p.Value("drag")
		x := runs[k].net
		wantF, slope := 200*x+5*x*x, 200+10*x
		ustat := slope * 2.45e-4
		if got := dv.Mean.Value(); math.Abs(got-wantF) > 4*ustat {
			t.Errorf("point %d: F = %.4f N, want %.4f within 4 × %.3f", k+1, got, wantF, ustat)
		}
		if u := dv.Mean.U().Value(); math.Abs(u*u-(ustat*ustat+0.15*0.15)) > 0.25*ustat*ustat {
			t.Errorf("point %d: u(F) = %.4f N, want √(%.4f² + 0.15²) = %.4f", k+1, u, ustat, math.Hypot(ustat, 0.15))
		}
		if dv.Mean.Dim() != quantity.Force {
			t.Errorf("point %d: F in %v", k+1, quantity.Describe(dv.Mean.Dim()))
		}
	}
	// The calibration's source is one, shared by the three points.
	if n := countSources(set, "calibration drag"); n != 1 {
		t.Errorf("%d calibration sources, want 1", n)
	}
}

// checkLevel checks a channel's mean against the level it was generated
// at (within 4 standard uncertainties) and its uncertainty of the mean
// against the closed form u (within 25 %).
func checkLevel(t *testing.T, what string, v steady.Value, level, u float64) {
	t.Helper()
	if got := v.Stats.UMean.Value(); math.Abs(got-u) > 0.25*u {
		t.Errorf("%s: u(mean) = %.4g, want %.4g within 25 %%", what, got, u)
	}
	if got := v.Mean.Value(); math.Abs(got-level) > 4*v.Mean.U().Value() {
		t.Errorf("%s: mean %.6g, want %.6g within 4 × %.3g", what, got, level, v.Mean.U().Value())
	}
}

func countSources(set *uncertain.Set, name string) int {
	n := 0
	for i := range set.Len() {
		if s, _ := set.Source(uncertain.ID(i)); s.Name == name {
			n++
		}
	}
	return n
}

// TestDriftFlag injects a linear drift of 0.010 mV/V across run 2 and
// checks that it is measured and flagged, and that the other runs are not.
func TestDriftFlag(t *testing.T) {
	log := carriage(2)
	v := append([]float64(nil), log.drag.Values()...)
	for i := 2000; i < 2800; i++ {
		v[i] += 0.010e-3 * float64(i-2000) / 799 // 0 at the first row, 0.010 mV/V at the last
	}
	chs := []steady.Channel{{Name: "drag", Data: quantity.NewSeries(v, quantity.Dimensionless), DriftLimit: quantity.New(0.005e-3, quantity.Dimensionless)}}
	pts, err := steady.Points(uncertain.NewSet(), chs, []steady.Window{{Start: 1000, End: 1800}, {Start: 2000, End: 2800}})
	if err != nil {
		t.Fatal(err)
	}
	if pts[0].Values[0].Drifting || !pts[1].Values[0].Drifting {
		t.Errorf("drifting flags %v, %v: want false, true", pts[0].Values[0].Drifting, pts[1].Values[0].Drifting)
	}
	// The line's change over the window is the injected 0.010 mV/V plus
	// the noise's own, of the order of u·√12 ≈ 0.0005 mV/V.
	if d := pts[1].Values[0].Stats.Drift.Value(); math.Abs(d-0.010e-3) > 0.002e-3 {
		t.Errorf("drift %.4g, want 1.0e-5", d)
	}
}

// TestDetect finds the steady points of the carriage log by the
// moving-window criterion: the zero and the three runs, each inside its
// true span, short of it by at most about the half-width at each end.
func TestDetect(t *testing.T) {
	log := carriage(3)
	const h = 50
	ws, err := steady.Detect(steady.Criterion{Half: h, MinLen: 200, Channels: []steady.Tolerance{
		{Name: "tacho", Data: log.tacho, SD: quantity.New(0.01, quantity.Voltage), Change: quantity.New(0.005, quantity.Voltage)},
		{Name: "drag", Data: log.drag, SD: quantity.New(0.006e-3, quantity.Dimensionless), Change: quantity.New(0.004e-3, quantity.Dimensionless)},
	}})
	if err != nil {
		t.Fatal(err)
	}
	truth := []steady.Window{{Start: 0, End: 600}, {Start: 1000, End: 1800}, {Start: 2000, End: 2800}, {Start: 3000, End: 3800}}
	if len(ws) != len(truth) {
		t.Fatalf("%d points %v, want %d", len(ws), ws, len(truth))
	}
	for k, w := range ws {
		tr := truth[k]
		// Inside the true span, and short of it by at most h + 10
		// samples at each end (the first window has only its own h).
		if w.Start < tr.Start || w.End > tr.End || w.Start > tr.Start+h+10 || w.End < tr.End-h-10 {
			t.Errorf("point %d: %v, want inside %v and short of it by at most %d samples at each end", k+1, w, tr, h+10)
		}
	}
	for _, c := range []steady.Criterion{
		{Half: 0, MinLen: 1, Channels: []steady.Tolerance{{Name: "x", Data: log.drag, SD: quantity.New(1, 0), Change: quantity.New(1, 0)}}},
		{Half: 5, MinLen: 1},
		{Half: 5, MinLen: 1, Channels: []steady.Tolerance{{Name: "x", Data: log.drag, SD: quantity.New(0, 0), Change: quantity.New(1, 0)}}},
	} {
		_, err := steady.Detect(c)
		oneClass(t, err, quantity.ErrInvalid)
	}
	_, err = steady.Detect(steady.Criterion{Half: 5, MinLen: 1, Channels: []steady.Tolerance{{Name: "x", Data: log.drag, SD: quantity.New(1, quantity.Voltage), Change: quantity.New(1, 0)}}})
	oneClass(t, err, quantity.ErrDimension)
}

// TestDetectMissing: a missing sample makes every window holding it
// unsteady, and no other.
func TestDetectMissing(t *testing.T) {
	v := make([]float64, 100)
	v[50] = math.NaN()
	ws, err := steady.Detect(steady.Criterion{Half: 5, MinLen: 1, Channels: []steady.Tolerance{{Name: "x", Data: quantity.NewSeries(v, 0), SD: quantity.New(1, 0), Change: quantity.New(1, 0)}}})
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([]steady.Window{{Start: 5, End: 45}, {Start: 56, End: 95}}, ws); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
}

// TestApplyOutOfRange: a tachometer spike past the table is refused with
// the channel, row, time and range named, and the destination untouched.
func TestApplyOutOfRange(t *testing.T) {
	log := carriage(1)
	v := append([]float64(nil), log.tacho.Values()...)
	v[1234] = 6 // V, past the table's 5 V
	c := readCal(t, "speed.cal")
	dst := quantity.NewSeries([]float64{42}, quantity.Velocity)
	err := c.Apply(&dst, quantity.NewSeries(v, quantity.Voltage), "tacho", log.t)
	oneClass(t, err, quantity.ErrRange)
	var re *steady.RangeError
	if !errors.As(err, &re) {
		t.Fatalf("%v: want a *steady.RangeError", err)
	}
	want := &steady.RangeError{Calibration: "speed", Channel: "tacho", Row: 1234, Time: sec(6.17), HasTime: true, Value: 6, Lo: -0.5, Hi: 5, Unit: "V"}
	if d := cmp.Diff(want, re, cmp.Comparer(func(a, b quantity.Quantity) bool { return a.ApproxEqual(b, 1e-12) })); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
	if msg := err.Error(); !strings.Contains(msg, `"tacho"`) || !strings.Contains(msg, "row 1234") || !strings.Contains(msg, "t = 6.17 s") || !strings.Contains(msg, "[-0.5, 5] V") {
		t.Errorf("message %q", msg)
	}
	if dst.Values()[0] != 42 || dst.Dim() != quantity.Velocity {
		t.Errorf("destination changed: %v", dst.Values())
	}
	// The wrong dimension: a speed channel given as the raw reading.
	err = c.Apply(&dst, dst, "speed", quantity.Series{})
	oneClass(t, err, quantity.ErrDimension)
}

func TestReduceErrors(t *testing.T) {
	x := force(1, 2, 3, 2, 1, 2, 3)
	w := steady.Window{Start: 0, End: 7}
	for _, tc := range []struct {
		name  string
		set   *uncertain.Set
		ch    steady.Channel
		class error
	}{
		{"no set", nil, steady.Channel{Name: "F", Data: x, DriftLimit: quantity.New(1, quantity.Force)}, quantity.ErrInvalid},
		{"no drift limit", uncertain.NewSet(), steady.Channel{Name: "F", Data: x, DriftLimit: quantity.New(0, quantity.Force)}, quantity.ErrInvalid},
		{"drift limit of another kind", uncertain.NewSet(), steady.Channel{Name: "F", Data: x, DriftLimit: quantity.New(1, quantity.Length)}, quantity.ErrDimension},
		{"missing sample", uncertain.NewSet(), steady.Channel{Name: "F", Data: force(1, math.NaN(), 3), DriftLimit: quantity.New(1, quantity.Force)}, quantity.ErrRange},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := steady.Reduce(tc.set, "p", []steady.Channel{tc.ch}, steady.Window{Start: 0, End: tc.ch.Data.Len()})
			oneClass(t, err, tc.class)
		})
	}
	// A tag used twice in one set: the set refuses the second source.
	set := uncertain.NewSet()
	chs := []steady.Channel{{Name: "F", Data: x, DriftLimit: quantity.New(1, quantity.Force)}}
	if _, err := steady.Reduce(set, "p", chs, w); err != nil {
		t.Fatal(err)
	}
	_, err := steady.Reduce(set, "p", chs, w)
	oneClass(t, err, quantity.ErrInvalid)
}

// TestAddSource: a channel calibrated sample by sample gains the
// calibration's systematic source, once per set and once per value, its
// value unchanged.
func TestAddSource(t *testing.T) {
	c := readCal(t, "speed.cal")
	set := uncertain.NewSet()
	v := quantity.NewSeries([]float64{1, 1.1, 0.9, 1, 1.05, 0.95}, quantity.Velocity)
	p, err := steady.Reduce(set, "p", []steady.Channel{{Name: "V", Data: v, DriftLimit: quantity.New(1, quantity.Velocity)}}, steady.Window{Start: 0, End: 6})
	if err != nil {
		t.Fatal(err)
	}
	q, err := c.AddSource(set, p, "V")
	if err != nil {
		t.Fatal(err)
	}
	a, b := p.Values[0].Mean, q.Values[0].Mean
	// u² = u_A² + 0.002² (m/s).
	if b.Value() != a.Value() || math.Abs(b.U().Value()-math.Hypot(a.U().Value(), 0.002)) > 1e-15 {
		t.Errorf("%v from %v", b, a)
	}
	// Added twice to one value: refused (it would double the effect).
	_, err = c.AddSource(set, q, "V")
	oneClass(t, err, quantity.ErrInvalid)
	if n := countSources(set, "calibration speed"); n != 1 {
		t.Errorf("%d sources", n)
	}
	_, err = c.AddSource(set, p, "W")
	oneClass(t, err, quantity.ErrInvalid)
	_, err = readCal(t, "drag.cal").AddSource(set, p, "V")
	oneClass(t, err, quantity.ErrDimension)
}

// TestZeroFile: a zero taken from a separate zero file (here a separate
// invented history, still from 0 to 3 s) tares like a zero window.
func TestZeroFile(t *testing.T) {
	zlog := carriage(9)
	zdrag := quantity.NewSeries(zlog.drag.Values()[:600], quantity.Dimensionless)
	log := carriage(1)
	lim := quantity.New(0.005e-3, quantity.Dimensionless)
	set := uncertain.NewSet()
	zero, err := steady.Reduce(set, "zero file", []steady.Channel{{Name: "drag", Data: zdrag, DriftLimit: lim}}, steady.Window{Start: 0, End: 600})
	if err != nil {
		t.Fatal(err)
	}
	p, err := steady.Reduce(set, "point 1", []steady.Channel{{Name: "drag", Data: log.drag, DriftLimit: lim}}, steady.Window{Start: 1000, End: 1800})
	if err != nil {
		t.Fatal(err)
	}
	if p, err = steady.Tare(p, zero); err != nil {
		t.Fatal(err)
	}
	// The net level 0.20 mV/V; u² = 0.002²·4/800 + 0.002²·4/600 (the
	// AR(1) closed form for the point and for the zero):
	// (1.414e-4)² + (1.633e-4)² = (2.160e-4 mV/V)².
	v, _ := p.Value("drag")
	if u := v.Mean.U().Value(); math.Abs(u-0.000216e-3) > 0.25*0.000216e-3 {
		t.Errorf("u = %.4g, want 2.16e-7 within 25 %%", u)
	}
	if math.Abs(v.Mean.Value()-0.20e-3) > 4*v.Mean.U().Value() {
		t.Errorf("tared mean %.6g, want 2e-4 within 4u", v.Mean.Value())
	}
}
