package dual

import (
	"math"
	"testing"
)

// TestDerivatives checks each rule against the derivative worked by hand.
func TestDerivatives(t *testing.T) {
	x := Var(1.7)
	for _, c := range []struct {
		name string
		got  Num
		v, d float64
	}{
		{"x·x + 3", x.Mul(x).AddC(3), 1.7*1.7 + 3, 2 * 1.7},
		{"1/x", Const(1).Div(x), 1 / 1.7, -1 / (1.7 * 1.7)},
		{"√x", x.Sqrt(), math.Sqrt(1.7), 0.5 / math.Sqrt(1.7)},
		{"10^x", x.Exp10(), math.Pow(10, 1.7), math.Pow(10, 1.7) * math.Ln10},
		{"2 − 3x + x²", x.Poly(2, -3, 1), 2 - 3*1.7 + 1.7*1.7, -3 + 2*1.7},
		{"5x − x", x.Scale(5).Sub(x), 4 * 1.7, 4},
		{"x + x", x.Add(x), 3.4, 2},
	} {
		if math.Abs(c.got.V-c.v) > 1e-12*math.Abs(c.v) || math.Abs(c.got.D-c.d) > 1e-12*math.Abs(c.d) {
			t.Errorf("%s: %v, want {%v %v}", c.name, c.got, c.v, c.d)
		}
	}
}
