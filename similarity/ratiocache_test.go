package similarity_test

import (
	"math"
	"sync"
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// froude30 is a Froude ship plan at 1:30 in the same water.
func froude30(t *testing.T) *similarity.Solution {
	t.Helper()
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 30, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// TestTransferAllocs: after the first call of a dimension, a transfer
// is a lookup and a multiply, with no allocation.
func TestTransferAllocs(t *testing.T) {
	s := froude30(t)
	m := q.New(12.5, q.Force)
	dst := q.NewSeries(make([]float64, 8), q.Force)
	ms := q.NewSeries([]float64{1, 2, 3, 4, 5, 6, 7, 8}, q.Force)
	for _, tc := range []struct {
		name string
		f    func()
	}{
		{"ToPrototype", func() { _, _ = s.ToPrototype(m) }},
		{"ToModel", func() { _, _ = s.ToModel(m) }},
		{"SeriesToPrototype", func() { _ = s.SeriesToPrototype(&dst, ms) }},
		{"SeriesToModel", func() { _ = s.SeriesToModel(&dst, ms) }},
		{"VariableToPrototype", func() { _, _ = s.VariableToPrototype("V", q.New(1, q.Velocity)) }},
	} {
		tc.f() // the first call derives the ratio
		if n := testing.AllocsPerRun(100, tc.f); n != 0 {
			t.Errorf("%s: %v allocations per call, want 0", tc.name, n)
		}
	}
}

// TestTransferCacheAgrees: the cached ratios give what the exact laws
// give, call after call, and a solution made by With does not see its
// parent's cached values.
func TestTransferCacheAgrees(t *testing.T) {
	s := froude30(t)
	// Froude at 1:30, same water and gravity (from the laws λ_V = λ_L^½,
	// λ_F = λ_ρ·λ_L³, λ_P = λ_ρ·λ_L^(7/2), λ_T = λ_L^½).
	for _, tc := range []struct {
		d    q.Dim
		want float64 // prototype/model factor 1/λ
	}{
		{q.Velocity, math.Sqrt(30)},
		{q.Force, 27000},
		{q.Power, math.Pow(30, 3.5)},
		{q.Time, math.Sqrt(30)},
		{q.Length, 30},
	} {
		for range 3 {
			p, err := s.ToPrototype(q.New(1, tc.d))
			if err != nil {
				t.Fatal(err)
			}
			if d := math.Abs(p.Value()/tc.want - 1); d > 1e-12 {
				t.Errorf("%v: factor %v, want %v", tc.d, p.Value(), tc.want)
			}
			back, err := s.ToModel(p)
			if err != nil {
				t.Fatal(err)
			}
			if d := math.Abs(back.Value() - 1); d > 1e-12 {
				t.Errorf("%v: round trip gives %v", tc.d, back.Value())
			}
		}
		v, err := s.VariableToPrototype("V", q.New(1, q.Velocity))
		if err != nil || math.Abs(v.Value()/math.Sqrt(30)-1) > 1e-12 {
			t.Errorf("VariableToPrototype V: %v, %v", v, err)
		}
	}
	// A free length ratio: a cached value of one solution must not
	// leak into another made by With.
	w1, err := s.With(map[string]float64{"L": 0.01})
	if err != nil {
		t.Fatal(err)
	}
	if v, err := w1.ToPrototype(q.New(1, q.Length)); err != nil || math.Abs(v.Value()-100) > 1e-9 {
		t.Errorf("With λ_L = 0.01: length factor %v, %v; want 100", v, err)
	}
	if v, err := w1.VariableToPrototype("L", q.New(1, q.Length)); err != nil || math.Abs(v.Value()-100) > 1e-9 {
		t.Errorf("With λ_L = 0.01: VariableToPrototype L %v, %v; want 100", v, err)
	}
	if v, err := s.ToPrototype(q.New(1, q.Length)); err != nil || math.Abs(v.Value()-30) > 1e-9 {
		t.Errorf("parent after With: length factor %v, %v; want 30", v, err)
	}
}

// TestTransferConcurrent shares one Solution between goroutines that
// derive and use ratios of several dimensions at once; `go test -race`
// checks the cache. Work is bounded by a count of calls.
func TestTransferConcurrent(t *testing.T) {
	s := froude30(t)
	dims := []q.Dim{q.Velocity, q.Force, q.Power, q.Time, q.Length, q.Mass, q.Pressure}
	var wg sync.WaitGroup
	errs := make(chan error, 8)
	for w := range 8 {
		wg.Go(func() {
			for i := range 200 {
				d := dims[(w+i)%len(dims)]
				p, err := s.ToPrototype(q.New(1, d))
				if err != nil {
					errs <- err
					return
				}
				if _, err := s.ToModel(p); err != nil {
					errs <- err
					return
				}
				if _, err := s.VariableToPrototype("V", q.New(1, q.Velocity)); err != nil {
					errs <- err
					return
				}
			}
		})
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		t.Error(err)
	}
}
