package ship_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/ship"
)

// TestFrictionLines checks each line against its definition worked by
// hand, and the Schoenherr line against the ATTC-1947 table as commonly
// reprinted (values from memory: 4.409, 2.934, 2.072 and 1.531 ×10⁻³ at
// Re = 10⁶ … 10⁹).
func TestFrictionLines(t *testing.T) {
	for _, c := range []struct {
		line     ship.FrictionLine
		re, want float64
		tol      float64
	}{
		{ship.LineITTC1957, 1e6, 0.075 / 16, 1e-15},
		{ship.LineITTC1957, 1e7, 0.075 / 25, 1e-15},
		{ship.LineITTC1957, 1e9, 0.075 / 49, 1e-15},
		{ship.LineSchoenherr, 1e6, 4.409e-3, 5e-4},
		{ship.LineSchoenherr, 1e7, 2.934e-3, 5e-4},
		{ship.LineSchoenherr, 1e8, 2.072e-3, 5e-4},
		{ship.LineSchoenherr, 1e9, 1.531e-3, 5e-4},
		{ship.LineHughes, 1e7, 0.066 / (4.97 * 4.97), 1e-14},
		{ship.LineHughes, 1e9, 0.066 / (6.97 * 6.97), 1e-14},
		// Katsui at 10⁷: a = 0.042612·7 + 0.56725 = 0.865534,
		// C_F = 0.0066577/2.6238^0.865534 = 2.88885e-3.
		{ship.LineKatsui, 1e7, 0.0066577 / math.Pow(2.6238, 0.865534), 1e-14},
	} {
		got, err := c.line.CF(c.re)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-c.want) > c.tol*c.want {
			t.Errorf("%v at Re = %g: C_F = %.6g, want %.6g", c.line, c.re, got, c.want)
		}
	}
	// The Schoenherr value satisfies its implicit equation to 1e-12.
	for _, re := range []float64{1e5, 3.7e6, 2e9, 1e10} {
		cf, _ := ship.LineSchoenherr.CF(re)
		if r := 0.242/math.Sqrt(cf) - math.Log10(re*cf); math.Abs(r) > 1e-12 {
			t.Errorf("Schoenherr at %g: residual %g", re, r)
		}
	}
	for _, c := range []struct {
		line ship.FrictionLine
		re   float64
	}{{ship.LineITTC1957, 5e4}, {ship.LineSchoenherr, 2e10}, {ship.LineKatsui, 5e5}, {ship.LineHughes, math.NaN()}, {ship.FrictionLine(9), 1e7}} {
		if _, err := c.line.CF(c.re); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("%v at %g: err = %v", c.line, c.re, err)
		}
	}
}

// The four friction lines at a model and a ship Reynolds number.
func ExampleFrictionLine_CF() {
	for _, l := range []ship.FrictionLine{ship.LineITTC1957, ship.LineSchoenherr, ship.LineHughes, ship.LineKatsui} {
		m, _ := l.CF(5e6)
		s, _ := l.CF(1e9)
		fmt.Printf("%-22s C_F(5e6) = %.5f  C_F(1e9) = %.5f\n", l, m, s)
	}
	// Output:
	// ITTC-1957              C_F(5e6) = 0.00340  C_F(1e9) = 0.00153
	// Schoenherr (ATTC-1947) C_F(5e6) = 0.00329  C_F(1e9) = 0.00153
	// Hughes (1954)          C_F(5e6) = 0.00303  C_F(1e9) = 0.00136
	// Katsui (2005)          C_F(5e6) = 0.00325  C_F(1e9) = 0.00155
}
