package plotstyle

import (
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/plot"
)

// TestSegments checks both ways of reading a subscript: every "_" (the
// run of letters and digits, or {…}) and "_{…}" only.
func TestSegments(t *testing.T) {
	for _, c := range []struct {
		in     string
		braced bool
		want   []Segment
	}{
		{"K_T", false, []Segment{{Text: "K"}, {Text: "T", Sub: true}}},
		{"C_{m¼} at x", false, []Segment{{Text: "C"}, {Text: "m¼", Sub: true}, {Text: " at x"}}},
		{"a_ b", false, []Segment{{Text: "a_ b"}}},
		{"K_T", true, []Segment{{Text: "K_T"}}},
		{"C_{TM} (measured)", true, []Segment{{Text: "C"}, {Text: "TM", Sub: true}, {Text: " (measured)"}}},
		{"open _{ brace", true, []Segment{{Text: "open _{ brace"}}},
	} {
		if got := Segments(c.in, c.braced); !cmp.Equal(got, c.want) {
			t.Errorf("Segments(%q, %v) = %v, want %v", c.in, c.braced, got, c.want)
		}
	}
}

// TestTicksAndPadding checks the labels of a log axis over 0.3 … 40
// (0.5, 1, 2, 5, 10, 20 by the 1-2-5 rule), a linear axis over 0 … 1
// (steps of 0.2), and the padding: 6 % of the span, in logarithms for
// PadLog (10 … 1000 spans 2 decades, so 10^∓0.12 beyond each end).
func TestTicksAndPadding(t *testing.T) {
	labels := func(ts []plot.Tick) []string {
		var out []string
		for _, tk := range ts {
			if tk.Label != "" {
				out = append(out, tk.Label)
			}
		}
		return out
	}
	if got, want := labels(LogTicks{}.Ticks(0.3, 40)), []string{"0.5", "1", "2", "5", "10", "20"}; !cmp.Equal(got, want) {
		t.Errorf("log labels %v, want %v", got, want)
	}
	if got, want := labels(LinearTicks{}.Ticks(0, 1)), []string{"0.0", "0.2", "0.4", "0.6", "0.8", "1.0"}; !cmp.Equal(got, want) {
		t.Errorf("linear labels %v, want %v", got, want)
	}
	lo, hi := PadLog([]float64{10, 1000, math.NaN(), -1})
	if math.Abs(lo-10*math.Pow(10, -0.12)) > 1e-12 || math.Abs(hi-1000*math.Pow(10, 0.12)) > 1e-9 {
		t.Errorf("PadLog = %g, %g", lo, hi)
	}
	if lo, hi := PadLinear([]float64{0, 50}); lo != -3 || hi != 53 {
		t.Errorf("PadLinear = %g, %g; want -3, 53", lo, hi)
	}
}
