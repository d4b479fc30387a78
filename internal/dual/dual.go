// Package dual holds dual numbers, a value with its derivative, so that a
// correlation written once gives its value and its exact derivative with
// respect to one input (forward-mode differentiation).
package dual

import "math"

// Num is a value V and its derivative D with respect to the chosen input.
type Num struct{ V, D float64 }

// Var returns x as the input of differentiation (derivative 1).
func Var(x float64) Num { return Num{x, 1} }

// Const returns a constant (derivative 0).
func Const(x float64) Num { return Num{x, 0} }

// Add returns a + b.
func (a Num) Add(b Num) Num { return Num{a.V + b.V, a.D + b.D} }

// Sub returns a − b.
func (a Num) Sub(b Num) Num { return Num{a.V - b.V, a.D - b.D} }

// Mul returns a·b.
func (a Num) Mul(b Num) Num { return Num{a.V * b.V, a.D*b.V + a.V*b.D} }

// Div returns a/b.
func (a Num) Div(b Num) Num { return Num{a.V / b.V, (a.D*b.V - a.V*b.D) / (b.V * b.V)} }

// AddC returns a + c for a constant c.
func (a Num) AddC(c float64) Num { return Num{a.V + c, a.D} }

// Scale returns c·a for a constant c.
func (a Num) Scale(c float64) Num { return Num{c * a.V, c * a.D} }

// Sqrt returns √a.
func (a Num) Sqrt() Num {
	s := math.Sqrt(a.V)
	return Num{s, a.D / (2 * s)}
}

// Exp10 returns 10^a.
func (a Num) Exp10() Num {
	v := math.Pow(10, a.V)
	return Num{v, v * math.Ln10 * a.D}
}

// Poly returns c[0] + c[1]·a + c[2]·a² + … by Horner's rule.
func (a Num) Poly(c ...float64) Num {
	r := Const(c[len(c)-1])
	for i := len(c) - 2; i >= 0; i-- {
		r = r.Mul(a).AddC(c[i])
	}
	return r
}
