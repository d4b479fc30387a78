package ship

import (
	"strings"
	"testing"
)

// TestSig4 checks that the tables' resistances and powers keep four
// significant figures: a small ship's 0.31842 kW is not printed as 0.
func TestSig4(t *testing.T) {
	for _, tc := range []struct {
		x    float64
		want string
	}{
		{0.31842, "0.3184"}, {1.2345678, "1.235"}, {24.2431, "24.24"}, {521.14, "521.1"}, {1234.6, "1235"}, {56789.2, "56789"}, {0, "0"},
	} {
		if got := sig4(tc.x); got != tc.want {
			t.Errorf("sig4(%v) = %q, want %q", tc.x, got, tc.want)
		}
	}
}

// TestSigNKeepsZeros: a figure to two significant digits keeps its
// trailing zero, so the fits' S = 0.001 prints 0.0010 beside 0.0032.
func TestSigNKeepsZeros(t *testing.T) {
	for _, tc := range []struct {
		x    float64
		want string
	}{{0.001, "0.0010"}, {0.0032, "0.0032"}, {0.00085, "0.00085"}, {0.026, "0.026"}, {1.0, "1.0"}} {
		if got := sigN(tc.x, 2); got != tc.want {
			t.Errorf("sigN(%v, 2) = %q, want %q", tc.x, got, tc.want)
		}
	}
}

// TestSIColumn: a column of forces or powers takes the SI prefix that
// leaves its largest value, rounded to four figures, between 10 and
// 9999, and every cell keeps four significant figures in that unit:
// 29 076 kN is 29.08 MN; 124.1 W beside 1618 W stays W (not 0.1241 kW);
// 1297 kW stays kW; 999 960 W rounds to 1000 kW; a power above 1000 MW
// stays in MW.
func TestSIColumn(t *testing.T) {
	for _, tc := range []struct {
		vals  []float64
		base  string
		unit  string
		cells []string
	}{
		{[]float64{452.3e3, 29.076e6}, "N", "MN", []string{"0.4523", "29.08"}},
		{[]float64{697.835e6, 2261e3}, "W", "MW", []string{"697.8", "2.261"}},
		{[]float64{40.12, 252.2}, "N", "N", []string{"40.12", "252.2"}},
		{[]float64{124.1, 1618}, "W", "W", []string{"124.1", "1618"}},
		{[]float64{5.824, 1029.9}, "W", "W", []string{"5.824", "1030"}},
		{[]float64{52.82e3, 1296.8e3}, "W", "kW", []string{"52.82", "1297"}},
		{[]float64{999960}, "W", "kW", []string{"1000"}},
		{[]float64{9999.6}, "W", "kW", []string{"10.00"}},
		{[]float64{1.051866e9, 39.856e6}, "W", "MW", []string{"1052", "39.86"}},
		{[]float64{0.5}, "N", "mN", []string{"500.0"}},
		{[]float64{3}, "N", "N", []string{"3.000"}},
	} {
		c := siColumn(tc.vals, tc.base)
		if c.unit != tc.unit {
			t.Errorf("siColumn(%v) unit %q, want %q", tc.vals, c.unit, tc.unit)
		}
		for i, v := range tc.vals {
			if got := c.cell(v); got != tc.cells[i] {
				t.Errorf("siColumn(%v).cell(%v) = %q, want %q", tc.vals, v, got, tc.cells[i])
			}
		}
	}
}

// TestProhaskaTooFewRunsSaysLimit: with the limit below the runs the
// message names the limit that would take in three. The third-lowest Fn
// is 0.18064 (0.80 m/s on a 2 m model: 0.80/√(9.80665·2)), rounded up
// to 0.181.
func TestProhaskaTooFewRunsSaysLimit(t *testing.T) {
	fn := []float64{0.11290, 0.14677, 0.18064, 0.22580}
	ct := []float64{5.49e-3, 5.23e-3, 5.05e-3, 5.04e-3}
	cf := []float64{4.38e-3, 4.14e-3, 3.97e-3, 3.80e-3}
	_, err := Prohaska(fn, ct, cf, 0.1)
	if err == nil || !strings.Contains(err.Error(), "0 runs at Fn ≤ 0.1; at least 3 are needed: raise the limit to at least 0.181 (the third-lowest run's Fn)") {
		t.Errorf("got %v", err)
	}
	_, err = Prohaska(fn[:2], ct[:2], cf[:2], 0.3)
	if err == nil || !strings.Contains(err.Error(), "only 2 of the runs") {
		t.Errorf("two runs: %v", err)
	}
}
