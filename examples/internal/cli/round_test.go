package cli

import (
	"math"
	"testing"
)

// TestRoundToUncertainty: JCGM 100:2008 (GUM) §7.2.6 — the uncertainty
// to two significant figures, the value to the same decimal place. Each
// row is rounded by hand, e.g. u = 211.7 has its second figure in the
// tens, so u = 210 and v = 10128.4 → 10130; u = 0.000996 rounds to
// 0.0010, whose second figure is at 10⁻⁴, so v = 0.0123456 → 0.0123.
func TestRoundToUncertainty(t *testing.T) {
	for _, c := range []struct {
		v, u         float64
		digits       int
		wantV, wantU string
	}{
		{10128.4, 211.7, 4, "10130", "210"},
		{2.02087, 0.00987, 4, "2.0209", "0.0099"},
		{2, 0.00904, 4, "2.0000", "0.0090"},
		{0.00434, 0.0526, 4, "0.004", "0.053"},
		{5.0, 0.996, 4, "5.0", "1.0"}, // u rounds up a decade: one place fewer
		{47.222, 0.2312, 5, "47.22", "0.23"},
		{-0.38971, 4.81, 5, "-0.4", "4.8"},
		{-798.22, 24.3, 5, "-798", "24"},
		{12345.6, 240, 5, "12350", "240"},
		{0.0123456, 0.000996, 5, "0.0123", "0.0010"},
		{-0.00004, 0.0023, 5, "0.0000", "0.0023"}, // no "-0.0000"
		// No place to round to: v to the fallback digits, u to two.
		{5, 0, 5, "5", "0"},
		{3.14159265, 0, 4, "3.142", "0"},
		{3.14159265, 0, 5, "3.1416", "0"},
		{1.5, -0.1, 4, "1.5", "-0.1"},
		{1.5, math.NaN(), 4, "1.5", "NaN"},
		{1.5, math.Inf(1), 4, "1.5", "+Inf"},
		{math.NaN(), 0.1, 4, "NaN", "0.1"},
		{math.Inf(-1), 0.1, 4, "-Inf", "0.1"},
	} {
		gv, gu := RoundToUncertainty(c.v, c.u, c.digits)
		if gv != c.wantV || gu != c.wantU {
			t.Errorf("RoundToUncertainty(%v, %v, %d) = %s, %s; want %s, %s", c.v, c.u, c.digits, gv, gu, c.wantV, c.wantU)
		}
	}
}

func TestSuperscript(t *testing.T) {
	for _, c := range []struct {
		n    int
		want string
	}{
		{0, "⁰"}, {7, "⁷"}, {10, "¹⁰"}, {1234567890, "¹²³⁴⁵⁶⁷⁸⁹⁰"},
		{-1, "⁻¹"}, {-12, "⁻¹²"}, {math.MinInt64, "⁻⁹²²³³⁷²⁰³⁶⁸⁵⁴⁷⁷⁵⁸⁰⁸"},
	} {
		if got := Superscript(c.n); got != c.want {
			t.Errorf("Superscript(%d) = %q, want %q", c.n, got, c.want)
		}
	}
}
