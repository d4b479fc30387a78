package quantity_test

import (
	"errors"
	"math"
	"math/big"
	"strings"
	"testing"

	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

// TestRatAgainstBig checks the int64 fractions against math/big.Rat, the
// standard library's arbitrary-precision rationals.
func TestRatAgainstBig(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a := q.MustRat(rapid.Int64Range(-1e6, 1e6).Draw(t, "an"), rapid.Int64Range(1, 1e6).Draw(t, "ad"))
		b := q.MustRat(rapid.Int64Range(-1e6, 1e6).Draw(t, "bn"), rapid.Int64Range(1, 1e6).Draw(t, "bd"))
		ba, bb := big.NewRat(a.Num(), a.Den()), big.NewRat(b.Num(), b.Den())
		check := func(name string, got q.Rat, err error, want *big.Rat) {
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			if got.Num() != want.Num().Int64() || got.Den() != want.Denom().Int64() {
				t.Fatalf("%s(%v, %v) = %v, big.Rat gives %v", name, a, b, got, want)
			}
			if w, _ := q.NewRat(want.Num().Int64(), want.Denom().Int64()); got != w {
				t.Fatalf("%s: %#v is not the canonical %#v", name, got, w)
			}
		}
		s, err := a.Add(b)
		check("Add", s, err, new(big.Rat).Add(ba, bb))
		s, err = a.Sub(b)
		check("Sub", s, err, new(big.Rat).Sub(ba, bb))
		s, err = a.Mul(b)
		check("Mul", s, err, new(big.Rat).Mul(ba, bb))
		if !b.IsZero() {
			s, err = a.Div(b)
			check("Div", s, err, new(big.Rat).Quo(ba, bb))
		}
		if a.Cmp(b) != ba.Cmp(bb) {
			t.Fatalf("Cmp(%v, %v)", a, b)
		}
		text, _ := a.MarshalText()
		var back q.Rat
		if err := back.UnmarshalText(text); err != nil || back != a {
			t.Fatalf("%v → %q → %v, %v", a, text, back, err)
		}
	})
}

func TestRatZeroAndErrors(t *testing.T) {
	var zero q.Rat
	if !zero.IsZero() || zero.Den() != 1 || zero != q.RatInt(0) || zero.String() != "0" {
		t.Errorf("zero value %#v", zero)
	}
	if q.MustRat(6, -4) != q.MustRat(-3, 2) {
		t.Error("6/−4 is not −3/2")
	}
	big := q.RatInt(1 << 62)
	if _, err := big.Mul(q.RatInt(4)); !errors.Is(err, q.ErrRange) {
		t.Errorf("(2⁶²)·4: err = %v", err)
	}
	if _, err := big.Add(big); !errors.Is(err, q.ErrRange) {
		t.Errorf("2⁶²+2⁶²: err = %v", err)
	}
	if _, err := q.RatInt(1).Div(zero); !errors.Is(err, q.ErrRange) {
		t.Errorf("1/0: err = %v", err)
	}
	for _, s := range []string{"", "1/0", "a", "1/-2", "1 /2", "+-1", "1/2/3", "99999999999999999999"} {
		if _, err := q.ParseRat(s); err == nil {
			t.Errorf("ParseRat(%q) accepted", s)
		}
	}
	if r, err := q.ParseRat("-6/4"); err != nil || r != q.MustRat(-3, 2) {
		t.Errorf("ParseRat(-6/4) = %v, %v", r, err)
	}
	v := []q.Rat{q.MustRat(1, 2), q.MustRat(-1, 3), q.RatInt(0)}
	f, err := q.Coprime(v, v)
	if err != nil || v[0] != q.RatInt(3) || v[1] != q.RatInt(-2) || f != q.RatInt(6) {
		t.Errorf("Coprime = %v, %v, %v", v, f, err)
	}
	if e := q.MustDim(0, 0, 0, 0, 0, 0, 0); !e.Exponent(q.BaseL).IsZero() {
		t.Error("exponent of the dimension one")
	}
	d, _ := q.Length.Pow(1, 2)
	if d.Exponent(q.BaseL) != q.MustRat(1, 2) {
		t.Errorf("L^(1/2): %v", d.Exponent(q.BaseL))
	}
}

// extremeInt64 draws an int64 near the ends of its range or small.
func extremeInt64(t *rapid.T, label string) int64 {
	return rapid.OneOf(
		rapid.Int64Range(math.MinInt64, math.MinInt64+4),
		rapid.Int64Range(math.MaxInt64-4, math.MaxInt64),
		rapid.Int64Range(-1<<32-2, -1<<32+2),
		rapid.Int64Range(-6, 6),
		rapid.Int64(),
	).Draw(t, label)
}

// TestRatNeverHoldsMinInt64 checks, over extreme operands, that no Rat
// holds math.MinInt64 (so Neg keeps exact: −r has the opposite sign and
// −(−r) is r), that arithmetic reaching it reports an ErrRange error,
// and that every printer of an exponent writes any Rat without panicking
// and with the sign it has.
func TestRatNeverHoldsMinInt64(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a := q.RatInt(extremeInt64(t, "a"))
		b := q.RatInt(extremeInt64(t, "b"))
		rs := []q.Rat{a, b, a.Neg(), b.Neg()}
		for _, op := range []func(x, y q.Rat) (q.Rat, error){q.Rat.Add, q.Rat.Sub, q.Rat.Mul, q.Rat.Div} {
			r, err := op(a, b)
			if err != nil {
				if !errors.Is(err, q.ErrRange) {
					t.Fatalf("%v, %v: error %v does not match ErrRange", a, b, err)
				}
				continue
			}
			rs = append(rs, r)
		}
		for _, r := range rs {
			if r.Num() == math.MinInt64 || r.Den() == math.MinInt64 {
				t.Fatalf("a Rat holds math.MinInt64: %v", r)
			}
			if r.Neg().Sign() != -r.Sign() || r.Neg().Neg() != r {
				t.Fatalf("Neg of %v is %v", r, r.Neg())
			}
			for _, st := range []q.Style{q.Unicode, q.ASCII, q.LaTeX, q.Markdown} {
				s := string(q.AppendExponent(nil, r, st))
				neg := strings.Contains(s, "-") || strings.Contains(s, "⁻")
				if neg != (r.Sign() < 0) {
					t.Fatalf("AppendExponent(%v, %v) = %q: wrong sign", r, st, s)
				}
				_ = q.Product{{Name: "x", Exp: r}, {Name: "y", Exp: r.Neg()}}.Format(st, q.Fraction, "")
				_ = q.Product{{Name: "x", Exp: r}}.Format(st, q.Inline, "")
			}
		}
	})
}

// TestRatIntMinInt64 checks the documented result of RatInt for the one
// int64 a Rat cannot hold, and that NewRat and ParseRat refuse it.
func TestRatIntMinInt64(t *testing.T) {
	if got := q.RatInt(math.MinInt64); got.Num() != -math.MaxInt64 || got.Neg().Num() != math.MaxInt64 {
		t.Errorf("RatInt(MinInt64) = %v, Neg %v; want −(2⁶³−1) and 2⁶³−1", got, got.Neg())
	}
	if got := string(q.AppendExponent(nil, q.RatInt(math.MinInt64), q.Unicode)); got != "⁻⁹²²³³⁷²⁰³⁶⁸⁵⁴⁷⁷⁵⁸⁰⁷" {
		t.Errorf("AppendExponent(RatInt(MinInt64)) = %q", got)
	}
	if _, err := q.NewRat(math.MinInt64, 1); !errors.Is(err, q.ErrRange) {
		t.Errorf("NewRat(MinInt64, 1): %v", err)
	}
	if _, err := q.ParseRat("-9223372036854775808"); !errors.Is(err, q.ErrParse) {
		t.Errorf("ParseRat(MinInt64): %v", err)
	}
}

// TestCoprimeShortDestination: a destination shorter than the vector is
// an ErrInvalid error, not a panic.
func TestCoprimeShortDestination(t *testing.T) {
	v := []q.Rat{q.MustRat(1, 2), q.MustRat(-1, 3)}
	if _, err := q.Coprime(make([]q.Rat, 1), v); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("Coprime into a short dst: %v", err)
	}
	dst := make([]q.Rat, 2)
	if f, err := q.Coprime(dst, v); err != nil || f != q.RatInt(6) || dst[0] != q.RatInt(3) || dst[1] != q.RatInt(-2) {
		t.Errorf("Coprime(1/2, -1/3) = %v, %v, %v", dst, f, err)
	}
}
