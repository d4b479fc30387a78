package steady_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/steady"
)

var sink float64

// BenchmarkSummarize: the per-point statistics over 10⁶ samples. The
// float64 baseline is the plain two-pass loop of a mean and a standard
// deviation, what a reduction that took the samples as independent would
// do; steady is Summarize on white noise (n_eff ≈ n, a lag or two
// summed), steady-ar1 on an AR(1) series of φ = 0.5 (about 10 lags, each
// one more pass).
func BenchmarkSummarize(b *testing.B) {
	const n = 1_000_000
	r := rand.New(rand.NewPCG(1, 2))
	white := ar1(r, n, 0, 1)
	corr := ar1(r, n, 0.5, 1)
	w := steady.Window{Start: 0, End: n}
	b.Run("float64", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sink = plainMeanU(white)
		}
	})
	for _, bc := range []struct {
		name string
		v    []float64
	}{{"steady", white}, {"steady-ar1", corr}} {
		x := quantity.NewSeries(bc.v, quantity.Force)
		b.Run(bc.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				st, err := steady.Summarize(x, w)
				if err != nil {
					b.Fatal(err)
				}
				sink = st.UMean.Value()
			}
		})
	}
}

// plainMeanU is the baseline: the mean plus s/√n, by two passes.
func plainMeanU(v []float64) float64 {
	var s float64
	for _, x := range v {
		s += x
	}
	fn := float64(len(v))
	m := s / fn
	var s2 float64
	for _, x := range v {
		e := x - m
		s2 += e * e
	}
	return m + math.Sqrt(s2/(fn-1)/fn)
}

// TestSummarizeAllocs: Summarize allocates nothing, whatever the length.
func TestSummarizeAllocs(t *testing.T) {
	x := quantity.NewSeries(ar1(rand.New(rand.NewPCG(1, 1)), 10000, 0.5, 1), quantity.Force)
	allocs := testing.AllocsPerRun(20, func() {
		if _, err := steady.Summarize(x, steady.Window{Start: 0, End: 10000}); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("%v allocations per call", allocs)
	}
}
