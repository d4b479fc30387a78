package pigroups

import (
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
)

// TestCoprimeGroupMatchesRat: the int64 path of PiSet gives the very
// exponents of the exact path (MustRat, then quantity.Coprime) on any
// reduced matrix, negative pivots and large entries included.
func TestCoprimeGroupMatchesRat(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		rank := rapid.IntRange(1, quantity.NumBases).Draw(t, "rank")
		cols := rank + rapid.IntRange(1, 4).Draw(t, "free")
		entry := rapid.OneOf(rapid.Int64Range(-12, 12), rapid.Int64Range(-1<<40, 1<<40))
		aug := make(exact.IntMatrix, rank)
		for r := range aug {
			aug[r] = make([]int64, cols)
			for c := range aug[r] {
				aug[r][c] = entry.Draw(t, "a")
			}
			for aug[r][r] == 0 {
				aug[r][r] = entry.Draw(t, "pivot")
			}
		}
		idx := make([]int, rank)
		for r := range idx {
			idx[r] = r
		}
		col := rapid.IntRange(rank, cols-1).Draw(t, "col")
		j := col // the group's own variable
		n := cols
		got := make([]quantity.Rat, n)
		if !coprimeGroup(got, j, idx, aug, col) {
			return // overflow: PiSet takes the exact path
		}
		want := make([]quantity.Rat, n)
		want[j] = quantity.RatInt(1)
		for r, i := range idx {
			want[i] = quantity.MustRat(-aug[r][col], aug[r][r])
		}
		if _, err := quantity.Coprime(want, want); err != nil {
			t.Fatalf("int64 path succeeded where Coprime fails: %v", err)
		}
		for i := range want {
			if got[i] != want[i] {
				t.Fatalf("exponent %d: int64 path %v, exact path %v (all: %v against %v)", i, got[i], want[i], got, want)
			}
		}
	})
}
