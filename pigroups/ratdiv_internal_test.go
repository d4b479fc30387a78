package pigroups

import (
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
)

// TestRatDivMatchesDiv: the whole-number shortcut of matchForm gives the
// very Rat (and error) of quantity.Rat.Div, extreme values included.
func TestRatDivMatchesDiv(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		small := rapid.Int64Range(-12, 12)
		num := rapid.OneOf(small, rapid.Int64Range(-1<<62, 1<<62), rapid.SampledFrom([]int64{math.MaxInt64, -math.MaxInt64, 0, 1, -1}))
		den := rapid.OneOf(rapid.Just(int64(1)), rapid.Int64Range(1, 12))
		a, err := quantity.NewRat(num.Draw(t, "an"), den.Draw(t, "ad"))
		if err != nil {
			t.Skip()
		}
		b, err := quantity.NewRat(num.Draw(t, "bn"), den.Draw(t, "bd"))
		if err != nil {
			t.Skip()
		}
		want, werr := a.Div(b)
		got, gerr := ratDiv(a, b)
		if (werr == nil) != (gerr == nil) || got != want {
			t.Fatalf("ratDiv(%v, %v) = %v, %v; Div gives %v, %v", a, b, got, gerr, want, werr)
		}
	})
}
