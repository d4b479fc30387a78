package exact_test

import (
	"math"
	"math/big"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/internal/exact"
	q "similis.dev/similis/quantity"
)

func i(n int64) q.Rat    { return q.RatInt(n) }
func f(n, d int64) q.Rat { return q.MustRat(n, d) }

func TestNullSpaceAndSolve(t *testing.T) {
	// Drag on a sphere: F, ρ, V, D, μ over L, M, T (common practice).
	m := exact.Matrix[q.Rat]{
		{i(1), i(-3), i(1), i(1), i(-1)},
		{i(1), i(1), i(0), i(0), i(1)},
		{i(-2), i(0), i(-1), i(0), i(-1)},
	}
	r, err := m.Rank()
	if err != nil || r != 3 {
		t.Fatalf("rank = %d, %v", r, err)
	}
	ns, err := m.NullSpace(i(1))
	if err != nil || len(ns) != 2 {
		t.Fatalf("null space: %v, %v", ns, err)
	}
	for _, v := range ns {
		for k := range m {
			sum := i(0)
			for j := range v {
				p, _ := m[k][j].Mul(v[j])
				sum, _ = sum.Add(p)
			}
			if !sum.IsZero() {
				t.Errorf("A·v ≠ 0 for %v", v)
			}
		}
	}
	x, ok, err := exact.Solve(exact.Matrix[q.Rat]{{i(2), i(1)}, {i(1), i(3)}}, []q.Rat{i(1), i(2)})
	if err != nil || !ok || x[0] != f(1, 5) || x[1] != f(3, 5) {
		t.Errorf("Solve = %v, %v, %v", x, ok, err)
	}
	if _, ok, _ := exact.Solve(exact.Matrix[q.Rat]{{i(1), i(1)}, {i(2), i(2)}}, []q.Rat{i(1), i(3)}); ok {
		t.Error("an inconsistent system was solved")
	}
}

// TestGaussJordanAgainstRREF checks the fraction-free elimination against
// the rational one on random integer matrices.
func TestGaussJordanAgainstRREF(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		rows, cols := rapid.IntRange(1, 5).Draw(t, "rows"), rapid.IntRange(1, 8).Draw(t, "cols")
		im := make(exact.IntMatrix, rows)
		rm := exact.NewMatrix[q.Rat](rows, cols)
		for r := range im {
			im[r] = make([]int64, cols)
			for j := range im[r] {
				v := rapid.Int64Range(-12, 12).Draw(t, "v")
				im[r][j], rm[r][j] = v, i(v)
			}
		}
		ip, err := im.GaussJordan(nil)
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
				if got := f(im[r][j], im[r][c]); got != rm[r][j] {
					t.Fatalf("row %d col %d: %v, RREF %v", r, j, got, rm[r][j])
				}
			}
		}
	})
}

// TestGCDAndUabs: the module's one gcd and absolute value, against
// math/big for any int64 pair (a gcd of 2⁶³ excepted, which no int64 holds).
func TestGCDAndUabs(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a := rapid.Int64().Draw(t, "a")
		b := rapid.Int64().Draw(t, "b")
		if (a == math.MinInt64 || a == 0) && (b == math.MinInt64 || b == 0) && a != b {
			return
		}
		if a == math.MinInt64 && b == math.MinInt64 {
			return
		}
		want := new(big.Int).GCD(nil, nil, new(big.Int).Abs(big.NewInt(a)), new(big.Int).Abs(big.NewInt(b)))
		if got := exact.GCD(a, b); big.NewInt(got).Cmp(want) != 0 {
			t.Fatalf("GCD(%d, %d) = %d, want %v", a, b, got, want)
		}
		if got, want := exact.Uabs(a), new(big.Int).Abs(big.NewInt(a)); new(big.Int).SetUint64(got).Cmp(want) != 0 {
			t.Fatalf("Uabs(%d) = %d, want %v", a, got, want)
		}
	})
	if got := exact.Uabs(math.MinInt64); got != 1<<63 {
		t.Errorf("Uabs(MinInt64) = %d, want 2⁶³", got)
	}
	if got := exact.GCD(0, 0); got != 0 {
		t.Errorf("GCD(0, 0) = %d, want 0", got)
	}
}
