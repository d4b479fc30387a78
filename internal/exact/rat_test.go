package exact

import (
	"math/big"
	"testing"

	"pgregory.net/rapid"
)

// TestRatAgainstBig checks the int64 fractions against math/big.Rat, the
// standard library's arbitrary-precision rationals.
func TestRatAgainstBig(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a := Frac(rapid.Int64Range(-1e6, 1e6).Draw(t, "an"), rapid.Int64Range(1, 1e6).Draw(t, "ad"))
		b := Frac(rapid.Int64Range(-1e6, 1e6).Draw(t, "bn"), rapid.Int64Range(1, 1e6).Draw(t, "bd"))
		ba, bb := big.NewRat(a.Num, a.Den), big.NewRat(b.Num, b.Den)
		check := func(name string, got Rat, err error, want *big.Rat) {
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			if got.Num != want.Num().Int64() || got.Den != want.Denom().Int64() {
				t.Fatalf("%s(%v, %v) = %v, big.Rat gives %v", name, a, b, got, want)
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
	})
}

func TestOverflow(t *testing.T) {
	big := Int(1 << 62)
	if _, err := big.Mul(Int(4)); err != ErrOverflow {
		t.Errorf("(2⁶²)·4: err = %v", err)
	}
	if _, err := big.Add(big); err != ErrOverflow {
		t.Errorf("2⁶²+2⁶²: err = %v", err)
	}
}

func TestNullSpaceAndSolve(t *testing.T) {
	// Drag on a sphere: F, ρ, V, D, μ over L, M, T (common practice).
	m := Matrix{
		{Int(1), Int(-3), Int(1), Int(1), Int(-1)},
		{Int(1), Int(1), Int(0), Int(0), Int(1)},
		{Int(-2), Int(0), Int(-1), Int(0), Int(-1)},
	}
	r, err := m.Rank()
	if err != nil || r != 3 {
		t.Fatalf("rank = %d, %v", r, err)
	}
	ns, err := m.NullSpace()
	if err != nil || len(ns) != 2 {
		t.Fatalf("null space: %v, %v", ns, err)
	}
	for _, v := range ns {
		for i := range m {
			sum := Int(0)
			for j := range v {
				p, _ := m[i][j].Mul(v[j])
				sum, _ = sum.Add(p)
			}
			if !sum.IsZero() {
				t.Errorf("A·v ≠ 0 for %v", v)
			}
		}
	}
	x, ok, err := Solve(Matrix{{Int(2), Int(1)}, {Int(1), Int(3)}}, Vec{Int(1), Int(2)})
	if err != nil || !ok || x[0] != Frac(1, 5) || x[1] != Frac(3, 5) {
		t.Errorf("Solve = %v, %v, %v", x, ok, err)
	}
	if _, ok, _ := Solve(Matrix{{Int(1), Int(1)}, {Int(2), Int(2)}}, Vec{Int(1), Int(3)}); ok {
		t.Error("an inconsistent system was solved")
	}
	v, f, err := Integers(Vec{Frac(1, 2), Frac(-1, 3), Int(0)})
	if err != nil || v[0] != Int(3) || v[1] != Int(-2) || f != Int(6) {
		t.Errorf("Integers = %v, %v, %v", v, f, err)
	}
}

// TestGaussJordanAgainstRREF checks the fraction-free elimination against
// the rational one on random integer matrices.
func TestGaussJordanAgainstRREF(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		rows, cols := rapid.IntRange(1, 5).Draw(t, "rows"), rapid.IntRange(1, 8).Draw(t, "cols")
		im := make(IntMatrix, rows)
		rm := NewMatrix(rows, cols)
		for i := range im {
			im[i] = make([]int64, cols)
			for j := range im[i] {
				v := rapid.Int64Range(-12, 12).Draw(t, "v")
				im[i][j], rm[i][j] = v, Int(v)
			}
		}
		ip, err := im.GaussJordan()
		if err != nil {
			t.Fatal(err)
		}
		rp, err := rm.RREF()
		if err != nil {
			t.Fatal(err)
		}
		if len(ip) != len(rp) {
			t.Fatalf("ranks %d and %d", len(ip), len(rp))
		}
		for r, c := range ip {
			if rp[r] != c {
				t.Fatalf("pivots %v and %v", ip, rp)
			}
			for j := range cols {
				want := rm[r][j]
				got := Frac(im[r][j], im[r][c])
				if got != want {
					t.Fatalf("row %d col %d: %v, RREF %v", r, j, got, want)
				}
			}
		}
	})
}
