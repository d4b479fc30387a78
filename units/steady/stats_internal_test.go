package steady

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestLagSums: the four-lag pass gives the sums of the plain one-lag
// loop, tails included, for every length and lag near the ends.
func TestLagSums(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 1))
	for n := 8; n < 40; n++ {
		v := make([]float64, n)
		for i := range v {
			v[i] = r.NormFloat64()
		}
		m := 0.3
		for k := 1; k+3 <= n/2; k++ {
			var got [4]float64
			lagSums(&got, v, m, k, 4)
			for j := range 4 {
				var want float64
				for i := 0; i < n-k-j; i++ {
					want += (v[i] - m) * (v[i+k+j] - m)
				}
				if math.Abs(got[j]-want) > 1e-12*(1+math.Abs(want)) {
					t.Fatalf("n %d, lag %d: %v, want %v", n, k+j, got[j], want)
				}
			}
		}
	}
}
