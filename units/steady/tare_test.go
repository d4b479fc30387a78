package steady_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

// tareCase reduces an INVENTED point and zero of a force F (offset
// 0.8 N at rest, 4.8 N at the point), a flow Q and a water temperature
// T_w (291.15 K and 291.32 K), both reduced with all three channels, as
// a user reduces the zero with the channels of the points.
func tareCase(t *testing.T) (p, zero steady.Point) {
	t.Helper()
	level := func(x, a float64, d quantity.Dim) quantity.Series {
		v := make([]float64, 40)
		for i := range v {
			v[i] = x + a*float64(i%2*2-1) // ±a about x: n_eff = n
		}
		return quantity.NewSeries(v, d)
	}
	chs := func(f, q, tw float64) []steady.Channel {
		return []steady.Channel{
			{Name: "F", Data: level(f, 0.01, quantity.Force), DriftLimit: quantity.New(1, quantity.Force)},
			{Name: "Q", Data: level(q, 1e-5, quantity.VolumeFlowRate), DriftLimit: quantity.New(1, quantity.VolumeFlowRate)},
			{Name: "T_w", Data: level(tw, 0.001, quantity.Temperature), DriftLimit: quantity.New(1, quantity.Temperature)},
		}
	}
	set := uncertain.NewSet()
	w := steady.Window{Start: 0, End: 40}
	zero, err := steady.Reduce(set, "zero", chs(0.8, 0, 291.15), w)
	if err != nil {
		t.Fatal(err)
	}
	p, err = steady.Reduce(set, "point 1", chs(4.8, 0.01, 291.32), w)
	if err != nil {
		t.Fatal(err)
	}
	return p, zero
}

// TestTareChannels: Tare subtracts the zero from the channels named
// only; with none named it refuses to tare a temperature the zero holds
// (it gave T_w = 0.17 K, tared); a named channel missing from the point
// or the zero, or named twice, is refused.
func TestTareChannels(t *testing.T) {
	p, zero := tareCase(t)
	type val struct {
		Mean  float64
		Tared bool
	}
	tests := []struct {
		name     string
		channels []string
		want     map[string]val // nil: an error
		errHas   string
	}{
		{"force only", []string{"F"}, map[string]val{"F": {4.0, true}, "Q": {0.01, false}, "T_w": {291.32, false}}, ""},
		{"force and flow", []string{"Q", "F"}, map[string]val{"F": {4.0, true}, "Q": {0.01, true}, "T_w": {291.32, false}}, ""},
		{"temperature named", []string{"T_w"}, map[string]val{"F": {4.8, false}, "Q": {0.01, false}, "T_w": {0.17, true}}, ""},
		{"none named, zero holds T_w", nil, nil, "a temperature is not tared"},
		{"not in the point", []string{"P"}, nil, "no such channel"},
		{"named twice", []string{"F", "F"}, nil, "named twice"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := steady.Tare(p, zero, tt.channels...)
			if tt.want == nil {
				var se *steady.Error
				if !errors.As(err, &se) || !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), tt.errHas) {
					t.Fatalf("err %v, want an *Error of class ErrInvalid with %q", err, tt.errHas)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			vals := map[string]val{}
			for _, v := range got.Values {
				vals[v.Name] = val{v.Mean.Value(), v.Tared}
			}
			if d := cmp.Diff(tt.want, vals, cmp.Comparer(func(a, b float64) bool { return math.Abs(a-b) <= 1e-9*math.Max(1, math.Abs(a)) })); d != "" {
				t.Errorf("(-want +got)\n%s", d)
			}
		})
	}
	// A zero without the temperature tares every channel it holds, as
	// before.
	zf := zero
	zf.Values = zero.Values[:1]
	got, err := steady.Tare(p, zf)
	if err != nil {
		t.Fatal(err)
	}
	if f, _ := got.Value("F"); !f.Tared || math.Abs(f.Mean.Value()-4.0) > 1e-9 {
		t.Errorf("F = %v tared %v, want 4 N tared", f.Mean, f.Tared)
	}
	// A channel named that the zero does not hold.
	if _, err := steady.Tare(p, zf, "Q"); err == nil || !strings.Contains(err.Error(), "the zero") {
		t.Errorf("Q not in the zero: %v", err)
	}
}

// TestNothingToReduce: the runs of a text column (whose Series is
// empty) give no window, and Points refuses the empty list rather than
// return no point with a nil error; TextRuns finds the runs of the text.
func TestNothingToReduce(t *testing.T) {
	empty := quantity.NewSeries(nil, quantity.Dimensionless)
	var ws []steady.Window
	for _, r := range steady.Runs(empty) {
		ws = append(ws, r.Window)
	}
	tests := []struct {
		name string
		ws   []steady.Window
		ok   bool
	}{
		{"runs of a text column", ws, false},
		{"nil", nil, false},
		{"one window", []steady.Window{{Start: 0, End: 40}}, true},
	}
	data := make([]float64, 40)
	for i := range data {
		data[i] = float64(i % 2)
	}
	chs := []steady.Channel{{Name: "x", Data: quantity.NewSeries(data, quantity.Dimensionless), DriftLimit: quantity.New(1, quantity.Dimensionless)}}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			pts, err := steady.Points(uncertain.NewSet(), chs, tt.ws)
			if tt.ok != (err == nil) || !tt.ok && (!errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), "TextRuns")) {
				t.Fatalf("%d points, err %v", len(pts), err)
			}
		})
	}
	got := steady.TextRuns([]string{"", "Lauf 1", "Lauf 1", "Pause", "Lauf 2", "Lauf 2", "", "Lauf 1"})
	want := []steady.TextRun{
		{Window: steady.Window{Start: 1, End: 3}, Label: "Lauf 1"},
		{Window: steady.Window{Start: 3, End: 4}, Label: "Pause"},
		{Window: steady.Window{Start: 4, End: 6}, Label: "Lauf 2"},
		{Window: steady.Window{Start: 7, End: 8}, Label: "Lauf 1"},
	}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("TextRuns (-want +got)\n%s", d)
	}
}
