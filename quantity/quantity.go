package quantity

import (
	"math"
)

// Quantity is a value of a quantity: a float64 in the coherent SI unit of
// its dimension, and that dimension. It is a small comparable value (16
// bytes, no pointers); == compares value and dimension exactly. The zero
// Quantity is dimensionless zero.
//
// Arithmetic methods return a new Quantity and panic with an *Error of
// class ErrDimension when the dimensions do not allow the operation; see
// the package documentation for the error model.
type Quantity struct {
	v float64
	d Dim
}

// New returns the quantity with value v in the coherent SI unit of d.
func New(v float64, d Dim) Quantity { return Quantity{v, d} }

// Scalar returns the dimensionless quantity v.
func Scalar(v float64) Quantity { return Quantity{v: v} }

// Value returns q's value in the coherent SI unit of its dimension.
func (q Quantity) Value() float64 { return q.v }

// Dim returns q's dimension.
func (q Quantity) Dim() Dim { return q.d }

// IsDimensionless reports whether q is of dimension one.
func (q Quantity) IsDimensionless() bool { return uint64(q.d) == 0 }

// Check returns nil if q has dimension want, and otherwise an *Error of
// class ErrDimension naming both. It is the way to check a value whose
// dimension comes from input before using it in a formula.
func (q Quantity) Check(want Dim) error {
	if q.d == want {
		return nil
	}
	return &Error{Op: "check", Dims: [2]Dim{q.d, want}, Binary: true, Class: ErrDimension}
}

// CheckNamed is Check with the caller's name for the value in the message.
func (q Quantity) CheckNamed(name string, want Dim) error {
	if q.d == want {
		return nil
	}
	return &Error{Op: "check", Name: name, Dims: [2]Dim{q.d, want}, Binary: true, Class: ErrDimension}
}

// Add returns q+o. It panics if the dimensions differ.
func (q Quantity) Add(o Quantity) Quantity {
	if q.d != o.d {
		panic(&Error{Op: "add", Dims: [2]Dim{q.d, o.d}, Binary: true, Class: ErrDimension})
	}
	return Quantity{q.v + o.v, q.d}
}

// Sub returns q−o. It panics if the dimensions differ.
func (q Quantity) Sub(o Quantity) Quantity {
	if q.d != o.d {
		panic(&Error{Op: "subtract", Dims: [2]Dim{q.d, o.d}, Binary: true, Class: ErrDimension})
	}
	return Quantity{q.v - o.v, q.d}
}

// Mul returns q·o. It panics if an exponent of the product overflows.
func (q Quantity) Mul(o Quantity) Quantity {
	// Dim.add written out, here and in Div: a call inlined inside an
	// inlined method leaves a no-op in the caller's loop.
	d := q.d + o.d
	if (uint64(d)+laneBias)&laneGuard != 0 {
		panic(&Error{Op: "multiply", Dims: [2]Dim{q.d, o.d}, Binary: true, Class: ErrDimension})
	}
	return Quantity{q.v * o.v, d}
}

// Div returns q/o. It panics if an exponent of the quotient overflows.
func (q Quantity) Div(o Quantity) Quantity {
	d := q.d - o.d
	if (uint64(d)+laneBias)&laneGuard != 0 {
		panic(&Error{Op: "divide", Dims: [2]Dim{q.d, o.d}, Binary: true, Class: ErrDimension})
	}
	return Quantity{q.v / o.v, d}
}

// Scale returns q multiplied by the pure number f.
func (q Quantity) Scale(f float64) Quantity { return Quantity{q.v * f, q.d} }

// Neg returns −q.
func (q Quantity) Neg() Quantity { return Quantity{-q.v, q.d} }

// Abs returns |q|.
func (q Quantity) Abs() Quantity { return Quantity{math.Abs(q.v), q.d} }

// Inv returns 1/q.
func (q Quantity) Inv() Quantity {
	d, ok := Dimensionless.sub(q.d)
	if !ok {
		panic(&Error{Op: "invert", Dims: [2]Dim{q.d}, Reason: overflows, Class: ErrDimension})
	}
	return Quantity{1 / q.v, d}
}

// Pow returns q raised to the rational power num/den. It panics if the
// resulting dimension cannot be held (an exponent that is not a whole
// number of sixths, or out of range). For a dimensionless q any exponent
// is allowed; see Powf.
func (q Quantity) Pow(num, den int) Quantity {
	d, err := q.d.Pow(num, den)
	if err != nil {
		panicErr(err)
	}
	switch {
	case den == 1 && num == 2:
		return Quantity{q.v * q.v, d}
	case den == 1 && num == 1:
		return q
	case den == 2 && num == 1:
		return Quantity{math.Sqrt(q.v), d}
	case den == 3 && num == 1:
		return Quantity{math.Cbrt(q.v), d}
	}
	return Quantity{math.Pow(q.v, float64(num)/float64(den)), d}
}

// Sqrt returns the square root of q.
func (q Quantity) Sqrt() Quantity { return q.Pow(1, 2) }

// Cbrt returns the cube root of q.
func (q Quantity) Cbrt() Quantity { return q.Pow(1, 3) }

// Cmp compares q and o, returning −1, 0 or +1 as q is less than, equal to
// or greater than o (NaN compares as in cmp.Compare). It panics if the
// dimensions differ.
func (q Quantity) Cmp(o Quantity) int {
	if q.d != o.d {
		panicBinary("compare", q.d, o.d)
	}
	switch {
	case q.v < o.v:
		return -1
	case q.v > o.v:
		return 1
	case q.v == o.v:
		return 0
	}
	// At least one NaN: order NaN below everything, as cmp.Compare does.
	qn, on := math.IsNaN(q.v), math.IsNaN(o.v)
	switch {
	case qn && on:
		return 0
	case qn:
		return -1
	}
	return 1
}

// ApproxEqual reports whether q and o agree to the relative tolerance rel:
// |q−o| ≤ rel·max(|q|,|o|). It panics if the dimensions differ.
func (q Quantity) ApproxEqual(o Quantity, rel float64) bool {
	if q.d != o.d {
		panicBinary("compare", q.d, o.d)
	}
	if q.v == o.v {
		return true
	}
	return math.Abs(q.v-o.v) <= rel*math.Max(math.Abs(q.v), math.Abs(o.v))
}

func needDimensionless(op string, q Quantity) {
	if uint64(q.d) != 0 {
		panicUnary(op, q.d, mustBeDimensionless)
	}
}

// Exp returns e^q for a dimensionless q.
func Exp(q Quantity) Quantity {
	needDimensionless("take the exponential of", q)
	return Scalar(math.Exp(q.v))
}

// Log returns the natural logarithm of a dimensionless q.
func Log(q Quantity) Quantity {
	needDimensionless("take the logarithm of", q)
	return Scalar(math.Log(q.v))
}

// Log10 returns the decimal logarithm of a dimensionless q.
func Log10(q Quantity) Quantity {
	needDimensionless("take the logarithm of", q)
	return Scalar(math.Log10(q.v))
}

// Powf returns x raised to the real power p; x must be dimensionless,
// since a dimensional quantity can only be raised to a rational power
// (Quantity.Pow).
func Powf(x Quantity, p float64) Quantity {
	needDimensionless("raise %s to a real power", x)
	return Scalar(math.Pow(x.v, p))
}

// PowQ returns x^y where both are dimensionless quantities.
func PowQ(x, y Quantity) Quantity {
	needDimensionless("raise %s to a real power", x)
	needDimensionless("use as an exponent", y)
	return Scalar(math.Pow(x.v, y.v))
}

// Sin returns the sine of the dimensionless angle q in radians.
func Sin(q Quantity) Quantity { needDimensionless("take the sine of", q); return Scalar(math.Sin(q.v)) }

// Cos returns the cosine of the dimensionless angle q in radians.
func Cos(q Quantity) Quantity {
	needDimensionless("take the cosine of", q)
	return Scalar(math.Cos(q.v))
}

// Tan returns the tangent of the dimensionless angle q in radians.
func Tan(q Quantity) Quantity {
	needDimensionless("take the tangent of", q)
	return Scalar(math.Tan(q.v))
}

// Asin returns the arcsine, in radians, of a dimensionless q.
func Asin(q Quantity) Quantity {
	needDimensionless("take the arcsine of", q)
	return Scalar(math.Asin(q.v))
}

// Acos returns the arccosine, in radians, of a dimensionless q.
func Acos(q Quantity) Quantity {
	needDimensionless("take the arccosine of", q)
	return Scalar(math.Acos(q.v))
}

// Atan returns the arctangent, in radians, of a dimensionless q.
func Atan(q Quantity) Quantity {
	needDimensionless("take the arctangent of", q)
	return Scalar(math.Atan(q.v))
}

// Atan2 returns the angle, in radians, of the point (x, y); y and x must
// have the same dimension.
func Atan2(y, x Quantity) Quantity {
	if y.d != x.d {
		panicBinary("take the arctangent of the ratio of", y.d, x.d)
	}
	return Scalar(math.Atan2(y.v, x.v))
}

// Hypot returns √(p²+q²); p and q must have the same dimension.
func Hypot(p, q Quantity) Quantity {
	if p.d != q.d {
		panicBinary("take the hypotenuse of", p.d, q.d)
	}
	return Quantity{math.Hypot(p.v, q.v), p.d}
}

// Min returns the smaller of a and b, which must have the same dimension.
func Min(a, b Quantity) Quantity {
	if a.d != b.d {
		panicBinary("take the minimum of", a.d, b.d)
	}
	return Quantity{math.Min(a.v, b.v), a.d}
}

// Max returns the larger of a and b, which must have the same dimension.
func Max(a, b Quantity) Quantity {
	if a.d != b.d {
		panicBinary("take the maximum of", a.d, b.d)
	}
	return Quantity{math.Max(a.v, b.v), a.d}
}
