package roots

import (
	"errors"
	"math"
	"testing"
)

func TestBisect(t *testing.T) {
	// √2 is the positive root of x² − 2.
	x, err := Bisect(func(x float64) float64 { return x*x - 2 }, 0, 2)
	if err != nil || math.Abs(x-math.Sqrt2) > 1e-11 {
		t.Errorf("Bisect(x²−2, 0, 2) = %v, %v; want √2", x, err)
	}
	for _, c := range []struct{ lo, hi float64 }{{2, 3}, {math.NaN(), 1}} {
		if _, err := Bisect(func(x float64) float64 { return x*x - 2 }, c.lo, c.hi); !errors.Is(err, ErrNoBracket) {
			t.Errorf("Bisect over [%v, %v] = %v; want ErrNoBracket", c.lo, c.hi, err)
		}
	}
	n := 0
	Bisect(func(x float64) float64 { n++; return x - 1.0/3 }, 0, 1e300)
	if n > MaxHalvings+2 {
		t.Errorf("Bisect evaluated f %d times; at most %d", n, MaxHalvings+2)
	}
}
