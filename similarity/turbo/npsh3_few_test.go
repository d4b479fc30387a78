package turbo_test

import (
	"errors"
	"strings"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/turbo"
)

// TestNPSH3TooFewPointsSaysFix: a series of fewer than three distinct
// NPSHA values is refused saying how many are needed and what to add,
// not with an empty range ("want 1 to -1").
func TestNPSH3TooFewPointsSaysFix(t *testing.T) {
	for _, n := range []int{0, 1, 2} {
		var s []turbo.SuctionPoint
		for i := range n {
			s = append(s, turbo.SuctionPoint{NPSHA: q.New(10-float64(i), q.Length), Head: q.New(40, q.Length)})
		}
		_, err := turbo.FindNPSH3(s, turbo.NPSH3Options{ReferencePoints: 1, HeadU: q.New(0.1, q.Length)})
		if !errors.Is(err, q.ErrInvalid) || !strings.Contains(err.Error(), "want at least 3") || !strings.Contains(err.Error(), "add points at lower NPSHA") {
			t.Errorf("%d points: %v", n, err)
		}
	}
}
