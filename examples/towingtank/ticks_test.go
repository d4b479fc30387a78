package main

import (
	"strconv"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/plot"

	"similis.dev/similis/examples/internal/plotstyle"
)

// TestOpenWaterTicks: on the open-water plot's fixed axes (J from 0 to
// 1.1, K_T, 10K_Q and η₀ from 0 to 1.0) the shared linear ticker gives
// the marks the plot has always had: a tick every 0.1, labelled with one
// decimal every 0.2 (8 labels at most → a major step of 0.2, a minor
// tick half-way).
func TestOpenWaterTicks(t *testing.T) {
	for _, r := range []struct {
		hi float64
		n  int
	}{{1.1, 11}, {1.0, 10}} {
		var want []plot.Tick
		for i := 0; i <= r.n; i++ {
			v := 0.1 * float64(i)
			tk := plot.Tick{Value: v}
			if i%2 == 0 {
				tk.Label = strconv.FormatFloat(v, 'f', 1, 64)
			}
			want = append(want, tk)
		}
		got := plotstyle.LinearTicks{}.Ticks(0, r.hi)
		if d := cmp.Diff(want, got); d != "" {
			t.Errorf("ticks on 0…%v (-want +got):\n%s", r.hi, d)
		}
	}
}
