package quantity_test

import (
	"errors"
	"math/big"
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
