package quantity

import "math"

// Series is a sequence of values sharing one dimension: one channel of
// test data. Element-wise operations check dimensions once per call, never
// per element.
//
// Operations are in place and named Set… (SetMul, SetDiv): the receiver
// is the destination, it is also returned, and its storage is reused when
// it has the capacity, so a loop over data sets allocates nothing once its
// destinations have grown. A bare verb (Add, Mul) is always a value method
// returning a new value, as on Quantity and Rat.
//
//	var re quantity.Series
//	re.SetMul(rho, v)
//	re.SetMul(re, d)
//	re.SetDiv(re, mu) // ρVD/μ
//
// (see the Series_reynolds example). Write one operation per statement
// when an operand is the destination itself: in a chain such as
// re.SetMul(rho, v).SetMul(re, d), Go does not specify whether the second re is
// read before or after the first call.
// Destination and operands may be the same Series. The zero Series is an
// empty dimensionless series.
type Series struct {
	d Dim
	v []float64
}

// NewSeries returns a series of the values v in the coherent SI unit of d.
// The series uses v as its storage; it does not copy it.
func NewSeries(v []float64, d Dim) Series { return Series{d, v} }

// Len returns the number of values.
func (z Series) Len() int { return len(z.v) }

// Dim returns the dimension shared by the values.
func (z Series) Dim() Dim { return z.d }

// At returns the i-th value as a Quantity. It panics if i is out of range.
func (z Series) At(i int) Quantity { return Quantity{z.v[i], z.d} }

// Values returns the values in the coherent SI unit, as a view of the
// series' storage: it does not copy, and writing to it changes the series.
func (z Series) Values() []float64 { return z.v }

// Check returns nil if z has dimension want, and otherwise an *Error of
// class ErrDimension naming both.
func (z Series) Check(want Dim) error {
	if z.d == want {
		return nil
	}
	return &Error{Op: "check", Dims: [2]Dim{z.d, want}, Binary: true, Class: ErrDimension}
}

// Sum returns the sum of the values.
func (z Series) Sum() Quantity {
	var t float64
	for _, x := range z.v {
		t += x
	}
	return Quantity{t, z.d}
}

// Mean returns the arithmetic mean of the values (NaN for an empty series).
func (z Series) Mean() Quantity {
	if len(z.v) == 0 {
		return Quantity{math.NaN(), z.d}
	}
	q := z.Sum()
	q.v /= float64(len(z.v))
	return q
}

// Min returns the smallest value (NaN for an empty series).
func (z Series) Min() Quantity {
	m := math.NaN()
	for i, x := range z.v {
		if i == 0 || x < m {
			m = x
		}
	}
	return Quantity{m, z.d}
}

// Max returns the largest value (NaN for an empty series).
func (z Series) Max() Quantity {
	m := math.NaN()
	for i, x := range z.v {
		if i == 0 || x > m {
			m = x
		}
	}
	return Quantity{m, z.d}
}

// grow returns z's storage resized to n, reusing it when it can.
func (z *Series) grow(n int) []float64 {
	if cap(z.v) >= n {
		return z.v[:n]
	}
	return make([]float64, n)
}

func sameLen(op string, x, y Series) int {
	if len(x.v) != len(y.v) {
		panicLength(op, len(x.v), len(y.v))
	}
	return len(x.v)
}

// Set sets z to a copy of x and returns z.
func (z *Series) Set(x Series) *Series {
	v := z.grow(len(x.v))
	copy(v, x.v)
	z.d, z.v = x.d, v
	return z
}

// SetAdd sets z = x + y element-wise and returns z. It panics if the
// dimensions or the lengths differ.
func (z *Series) SetAdd(x, y Series) *Series {
	if x.d != y.d {
		panicBinary("add", x.d, y.d)
	}
	n := sameLen("add", x, y)
	v := z.grow(n)
	xv, yv := x.v[:n], y.v[:n]
	for i := range v {
		v[i] = xv[i] + yv[i]
	}
	z.d, z.v = x.d, v
	return z
}

// SetSub sets z = x − y element-wise and returns z.
func (z *Series) SetSub(x, y Series) *Series {
	if x.d != y.d {
		panicBinary("subtract", x.d, y.d)
	}
	n := sameLen("subtract", x, y)
	v := z.grow(n)
	xv, yv := x.v[:n], y.v[:n]
	for i := range v {
		v[i] = xv[i] - yv[i]
	}
	z.d, z.v = x.d, v
	return z
}

// SetMul sets z = x · y element-wise and returns z.
func (z *Series) SetMul(x, y Series) *Series {
	d, ok := x.d.add(y.d)
	if !ok {
		panicOverflow("multiply", x.d, y.d)
	}
	n := sameLen("multiply", x, y)
	v := z.grow(n)
	xv, yv := x.v[:n], y.v[:n]
	for i := range v {
		v[i] = xv[i] * yv[i]
	}
	z.d, z.v = d, v
	return z
}

// SetDiv sets z = x / y element-wise and returns z.
func (z *Series) SetDiv(x, y Series) *Series {
	d, ok := x.d.sub(y.d)
	if !ok {
		panicOverflow("divide", x.d, y.d)
	}
	n := sameLen("divide", x, y)
	v := z.grow(n)
	xv, yv := x.v[:n], y.v[:n]
	for i := range v {
		v[i] = xv[i] / yv[i]
	}
	z.d, z.v = d, v
	return z
}

// SetAddQ sets z = x + q for every element and returns z.
func (z *Series) SetAddQ(x Series, q Quantity) *Series {
	if x.d != q.d {
		panicBinary("add", x.d, q.d)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = a + q.v
	}
	z.d, z.v = x.d, v
	return z
}

// SetSubQ sets z = x − q for every element and returns z.
func (z *Series) SetSubQ(x Series, q Quantity) *Series {
	return z.SetAddQ(x, q.Neg())
}

// SetMulQ sets z = x · q for every element and returns z.
func (z *Series) SetMulQ(x Series, q Quantity) *Series {
	d, ok := x.d.add(q.d)
	if !ok {
		panicOverflow("multiply", x.d, q.d)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = a * q.v
	}
	z.d, z.v = d, v
	return z
}

// SetDivQ sets z = x / q for every element and returns z.
func (z *Series) SetDivQ(x Series, q Quantity) *Series {
	d, ok := x.d.sub(q.d)
	if !ok {
		panicOverflow("divide", x.d, q.d)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = a / q.v
	}
	z.d, z.v = d, v
	return z
}

// SetQDiv sets z = q / x for every element and returns z.
func (z *Series) SetQDiv(q Quantity, x Series) *Series {
	d, ok := q.d.sub(x.d)
	if !ok {
		panicOverflow("divide", q.d, x.d)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = q.v / a
	}
	z.d, z.v = d, v
	return z
}

// SetScale sets z = f · x for the pure number f and returns z.
func (z *Series) SetScale(x Series, f float64) *Series {
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = a * f
	}
	z.d, z.v = x.d, v
	return z
}

// SetInv sets z = 1/x element-wise and returns z.
func (z *Series) SetInv(x Series) *Series { return z.SetQDiv(Scalar(1), x) }

// SetPow sets z = x^(num/den) element-wise and returns z. It panics if the
// resulting dimension cannot be held.
func (z *Series) SetPow(x Series, num, den int) *Series {
	d, err := x.d.Pow(num, den)
	if err != nil {
		panicErr(err)
	}
	v := z.grow(len(x.v))
	switch {
	case num == 2 && den == 1:
		for i, a := range x.v {
			v[i] = a * a
		}
	case num == 1 && den == 2:
		for i, a := range x.v {
			v[i] = math.Sqrt(a)
		}
	case num == 1 && den == 3:
		for i, a := range x.v {
			v[i] = math.Cbrt(a)
		}
	default:
		p := float64(num) / float64(den)
		for i, a := range x.v {
			v[i] = math.Pow(a, p)
		}
	}
	z.d, z.v = d, v
	return z
}

// SetSqrt sets z = √x element-wise and returns z.
func (z *Series) SetSqrt(x Series) *Series { return z.SetPow(x, 1, 2) }

func (z *Series) unary(op string, x Series, f func(float64) float64) *Series {
	if uint64(x.d) != 0 {
		panicUnary(op, x.d, mustBeDimensionless)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = f(a)
	}
	z.d, z.v = Dimensionless, v
	return z
}

// SetPowf sets z = x^p element-wise for a dimensionless x and returns z.
func (z *Series) SetPowf(x Series, p float64) *Series {
	if uint64(x.d) != 0 {
		panicUnary("raise %s to a real power", x.d, mustBeDimensionless)
	}
	v := z.grow(len(x.v))
	for i, a := range x.v {
		v[i] = math.Pow(a, p)
	}
	z.d, z.v = Dimensionless, v
	return z
}

// SetLog10 sets z = log₁₀ x element-wise for a dimensionless x and returns z.
func (z *Series) SetLog10(x Series) *Series {
	return z.unary("take the logarithm of", x, math.Log10)
}

// SetLog sets z = ln x element-wise for a dimensionless x and returns z.
func (z *Series) SetLog(x Series) *Series { return z.unary("take the logarithm of", x, math.Log) }

// SetExp sets z = eˣ element-wise for a dimensionless x and returns z.
func (z *Series) SetExp(x Series) *Series {
	return z.unary("take the exponential of", x, math.Exp)
}
