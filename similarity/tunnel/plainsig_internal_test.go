package tunnel

import "testing"

// TestPlainSig: n significant figures in fixed notation, worked by hand;
// a value that rounds up across a decade takes its new decade's decimals.
func TestPlainSig(t *testing.T) {
	for _, c := range []struct {
		x    float64
		n    int
		want string
	}{
		{0.99996, 4, "1.000"},
		{9.9996, 4, "10.00"},
		{13.8035, 3, "13.8"},
		{0.00074, 3, "0.000740"},
		{231325, 4, "231325"},
		{-0.0123456, 3, "-0.0123"},
	} {
		if got := plainSig(c.x, c.n); got != c.want {
			t.Errorf("plainSig(%v, %d) = %q, want %q", c.x, c.n, got, c.want)
		}
	}
}
