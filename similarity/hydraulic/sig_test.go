package hydraulic

import "testing"

// TestSig3: a check's value has three significant figures, trailing
// zeros kept, plain from 0.001 to 10⁴ and with an exponent outside, so a
// column of one quantity reads alike (1.20e+04 beside 2.25e+04, 85.1
// beside 1170).
func TestSig3(t *testing.T) {
	for _, c := range []struct {
		x    float64
		want string
	}{
		{12000, "1.20e+04"}, {22500, "2.25e+04"}, {130400, "1.30e+05"}, {85.1, "85.1"}, {1172.6, "1170"},
		{199.2, "199"}, {0.14, "0.140"}, {0.0302, "0.0302"}, {0.00794, "0.00794"}, {9996, "1.00e+04"},
		{999.6, "1000"}, {0.0004, "4.00e-04"}, {-85.14, "-85.1"}, {0, "0"},
	} {
		if got := sig3(c.x); got != c.want {
			t.Errorf("sig3(%v) = %q, want %q", c.x, got, c.want)
		}
	}
	ck := ScaleCheck{Name: "Re", Value: 1.3e5, Limit: 1e4, Unit: "1", Pass: true}
	if got, want := ck.String(), "Re = 1.30e+05 (limit ≥ 1e+04): passes"; got != want {
		t.Errorf("%q, want %q", got, want)
	}
}
