package quantity

import (
	"fmt"
	"math"
	"math/bits"
	"strconv"
	"strings"

	"similis.dev/similis/internal/exact"
)

// Rat is an exact rational number n/d in lowest terms with d > 0: the
// exponent of a dimension, a Pi group's variable or a scale law's free
// ratio (3/2 in λ_L^(3/2)). Its zero value is 0. It is comparable: two
// Rats are equal exactly when == says so, since every Rat is kept in
// lowest terms.
//
// A Rat's numerator and denominator lie within ±(2⁶³−1): math.MinInt64,
// whose negation an int64 cannot hold, is never stored, so Neg and the
// printers are exact for every Rat. Arithmetic whose result would need it
// reports an error wrapping ErrRange.
type Rat struct {
	n, d int64 // d == 0 stands for 1, so that the zero value is 0
}

// RatInt returns the whole number n as a Rat. The one int64 a Rat cannot
// hold, math.MinInt64, comes back as −(2⁶³−1), the nearest Rat; code that
// takes exponents from outside checks them with NewRat, which refuses it.
func RatInt(n int64) Rat {
	if n == math.MinInt64 {
		n = -math.MaxInt64
	}
	return Rat{n: n, d: 1}.canon()
}

// NewRat returns n/d in lowest terms; a zero denominator is an error
// wrapping ErrRange.
func NewRat(n, d int64) (Rat, error) {
	if d == 0 {
		return Rat{}, &Error{Op: "make", Input: fmt.Sprintf("%d/%d", n, d), Reason: "zero denominator", Class: ErrRange}
	}
	if d == math.MinInt64 || n == math.MinInt64 {
		return Rat{}, &Error{Op: "make", Input: fmt.Sprintf("%d/%d", n, d), Reason: "out of the range of an int64", Class: ErrRange}
	}
	return norm(n, d), nil
}

// MustRat is NewRat for constants written in code; it panics on error.
func MustRat(n, d int64) Rat {
	r, err := NewRat(n, d)
	if err != nil {
		panic(err)
	}
	return r
}

// Num returns the numerator, with the sign of r.
func (r Rat) Num() int64 { return r.n }

// Den returns the denominator, always positive.
func (r Rat) Den() int64 {
	if r.d == 0 {
		return 1
	}
	return r.d
}

// canon stores a denominator of 1 as 0, so that the zero value and every
// whole number have one representation.
func (r Rat) canon() Rat {
	if r.d == 1 || r.n == 0 {
		r.d = 0
	}
	if r.n == 0 {
		r.n = 0
	}
	return r
}

func gcd(a, b int64) int64 { return exact.GCD(a, b) }

func norm(n, d int64) Rat {
	if n == 0 {
		return Rat{}
	}
	if d == 1 {
		return Rat{n: n}
	}
	if d < 0 {
		n, d = -n, -d
	}
	g := gcd(n, d)
	return Rat{n / g, d / g}.canon()
}

func overflow(op string, r, s Rat) error {
	return &Error{Op: op, Input: r.String() + " and " + s.String(), Reason: "the result does not fit in 64-bit fractions", Class: ErrRange}
}

// Add returns r+s, or an error wrapping ErrRange if it does not fit.
func (r Rat) Add(s Rat) (Rat, error) {
	rd, sd := r.Den(), s.Den()
	if rd == 1 && sd == 1 {
		n, ok := exact.Add64(r.n, s.n)
		if !ok || n == math.MinInt64 {
			return Rat{}, overflow("add", r, s)
		}
		return Rat{n: n}.canon(), nil
	}
	g := gcd(rd, sd)
	a, ok1 := exact.Mul64(r.n, sd/g)
	b, ok2 := exact.Mul64(s.n, rd/g)
	d, ok3 := exact.Mul64(rd, sd/g)
	if !ok1 || !ok2 || !ok3 {
		return Rat{}, overflow("add", r, s)
	}
	n, ok := exact.Add64(a, b)
	if !ok || n == math.MinInt64 {
		return Rat{}, overflow("add", r, s)
	}
	return norm(n, d), nil
}

// Sub returns r−s, or an error wrapping ErrRange if it does not fit.
func (r Rat) Sub(s Rat) (Rat, error) { return r.Add(s.Neg()) }

// Mul returns r·s, or an error wrapping ErrRange if it does not fit.
func (r Rat) Mul(s Rat) (Rat, error) {
	if r.n == 0 || s.n == 0 {
		return Rat{}, nil
	}
	if r.Den() == 1 && s.Den() == 1 {
		n, ok := exact.Mul64(r.n, s.n)
		if !ok || n == math.MinInt64 {
			return Rat{}, overflow("multiply", r, s)
		}
		return Rat{n: n}, nil
	}
	g1, g2 := gcd(r.n, s.Den()), gcd(s.n, r.Den())
	n, ok1 := exact.Mul64(r.n/g1, s.n/g2)
	d, ok2 := exact.Mul64(r.Den()/g2, s.Den()/g1)
	if !ok1 || !ok2 || n == math.MinInt64 || d == math.MinInt64 {
		return Rat{}, overflow("multiply", r, s)
	}
	return norm(n, d), nil
}

// Div returns r/s; division by zero, or a result that does not fit, is an
// error wrapping ErrRange.
func (r Rat) Div(s Rat) (Rat, error) {
	if s.n == 0 {
		return Rat{}, &Error{Op: "divide", Input: r.String() + " by 0", Reason: "division by zero", Class: ErrRange}
	}
	return r.Mul(norm(s.Den(), s.n))
}

// Neg returns −r. It is exact for every Rat, since no Rat holds
// math.MinInt64.
func (r Rat) Neg() Rat { return Rat{-r.n, r.d} }

// IsZero reports whether r is 0.
func (r Rat) IsZero() bool { return r.n == 0 }

// IsInt reports whether r is a whole number.
func (r Rat) IsInt() bool { return r.Den() == 1 }

// IsOne reports whether r is 1.
func (r Rat) IsOne() bool { return r.n == 1 && r.Den() == 1 }

// Sign returns −1, 0 or +1.
func (r Rat) Sign() int {
	switch {
	case r.n < 0:
		return -1
	case r.n > 0:
		return 1
	}
	return 0
}

// Cmp compares r and s: −1, 0 or +1.
func (r Rat) Cmp(s Rat) int {
	// n₁/d₁ against n₂/d₂ as n₁·d₂ against n₂·d₁, in 128 bits.
	a1, a0 := mul128(r.n, s.Den())
	b1, b0 := mul128(s.n, r.Den())
	switch {
	case a1 != b1:
		if a1 < b1 {
			return -1
		}
		return 1
	case a0 != b0:
		if a0 < b0 {
			return -1
		}
		return 1
	}
	return 0
}

// mul128 returns the signed 128-bit product a·b (b > 0) as high (signed)
// and low words.
func mul128(a, b int64) (int64, uint64) {
	hi, lo := bits.Mul64(exact.Uabs(a), uint64(b))
	if a < 0 {
		lo = ^lo + 1
		hi = ^hi
		if lo == 0 {
			hi++
		}
	}
	return int64(hi), lo
}

// Float returns r as the nearest float64.
func (r Rat) Float() float64 { return float64(r.n) / float64(r.Den()) }

// String returns "n" or "n/d": "3/2", "-1".
func (r Rat) String() string {
	if r.Den() == 1 {
		return strconv.FormatInt(r.n, 10)
	}
	return strconv.FormatInt(r.n, 10) + "/" + strconv.FormatInt(r.Den(), 10)
}

// AppendText appends r as String writes it. It implements
// encoding.TextAppender.
func (r Rat) AppendText(b []byte) ([]byte, error) { return append(b, r.String()...), nil }

// MarshalText encodes r as String writes it.
func (r Rat) MarshalText() ([]byte, error) { return r.AppendText(nil) }

// UnmarshalText decodes text ParseRat reads.
func (r *Rat) UnmarshalText(b []byte) error {
	x, err := ParseRat(string(b))
	if err != nil {
		return err
	}
	*r = x
	return nil
}

// ParseRat reads "n" or "n/d" (an optional sign, decimal digits, no
// spaces) and returns it in lowest terms: "6/4" is 3/2. It reports a
// *Error of class ErrParse for anything else.
func ParseRat(s string) (Rat, error) {
	bad := func(reason string) (Rat, error) {
		in := s
		if len(in) > 64 {
			in = in[:64] + "…"
		}
		return Rat{}, parseError(in, 0, reason)
	}
	if len(s) > 41 {
		return bad("too long for an exact exponent")
	}
	ns, ds, frac := strings.Cut(s, "/")
	n, err := strconv.ParseInt(ns, 10, 64)
	if err != nil || ns == "" || ns[0] == '+' && len(ns) > 1 && ns[1] == '-' {
		return bad("not a whole number over a whole number")
	}
	d := int64(1)
	if frac {
		if d, err = strconv.ParseInt(ds, 10, 64); err != nil || ds[0] == '+' || ds[0] == '-' {
			return bad("the denominator is not a positive whole number")
		}
	}
	r, err := NewRat(n, d)
	if err != nil {
		return bad("zero denominator or out of range")
	}
	return r, nil
}

// Exponent returns the exponent of base b in d as an exact rational
// (1/2 for the L of L^(1/2)); 0 for a base d does not carry.
func (d Dim) Exponent(b Base) Rat {
	if b >= NumBases {
		return Rat{}
	}
	return norm(int64(d.lane(b)), expDen)
}

// Coprime scales the exponent vector v by a positive rational so that its
// entries are coprime integers, writes the result to dst (which must have
// v's length and may be v itself) and returns the factor used: {1/2,
// −1/3, 0} becomes {3, −2, 0} with factor 6. It reports an error wrapping
// ErrRange if the result does not fit in int64 fractions, and a
// *Error of class ErrInvalid if dst is shorter than v.
func Coprime(dst, v []Rat) (Rat, error) {
	if len(dst) < len(v) {
		return Rat{}, lengthError("scale to integers into", len(dst), len(v))
	}
	l := int64(1)
	for _, x := range v {
		d := x.Den()
		var ok bool
		if l, ok = exact.Mul64(l, d/gcd(l, d)); !ok {
			return Rat{}, &Error{Op: "scale to integers", Input: fmt.Sprint(v), Reason: "the common denominator does not fit in an int64", Class: ErrRange}
		}
	}
	g := int64(0)
	for i, x := range v {
		n, ok := exact.Mul64(x.n, l/x.Den())
		if !ok || n == math.MinInt64 {
			return Rat{}, &Error{Op: "scale to integers", Input: fmt.Sprint(v), Reason: "a scaled exponent does not fit in an int64", Class: ErrRange}
		}
		dst[i] = Rat{n: n}
		g = gcd(g, n)
	}
	if g > 1 {
		for i := range dst[:len(v)] {
			dst[i] = Rat{n: dst[i].n / g}
		}
	}
	if g == 0 {
		g = 1
	}
	return norm(l, g), nil
}
