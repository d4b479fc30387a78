package exact

import (
	"math"
	"testing"
)

// TestPowInt: the small powers agree bit for bit with the products
// written by hand; the rest agree with math.Pow to rounding; exact cases
// are exact.
func TestPowInt(t *testing.T) {
	for _, x := range []float64{0.3, 1.7, -2.5, 1e-3, 998.2, math.Pi} {
		hand := []float64{1, x, x * x, x * x * x, (x * x) * (x * x)}
		for n, want := range hand {
			if got := PowInt(x, n); got != want {
				t.Errorf("PowInt(%v, %d) = %v, want %v (by hand)", x, n, got, want)
			}
		}
		for n := -9; n <= 12; n++ {
			if got, want := PowInt(x, n), math.Pow(x, float64(n)); math.Abs(got-want) > 1e-14*math.Abs(want) {
				t.Errorf("PowInt(%v, %d) = %v, math.Pow %v", x, n, got, want)
			}
		}
	}
	for _, tc := range []struct {
		x    float64
		n    int
		want float64
	}{{2, 10, 1024}, {2, -3, 0.125}, {10, 5, 1e5}, {-3, 3, -27}, {0, 0, 1}} {
		if got := PowInt(tc.x, tc.n); got != tc.want {
			t.Errorf("PowInt(%v, %d) = %v, want %v exactly", tc.x, tc.n, got, tc.want)
		}
	}
}
