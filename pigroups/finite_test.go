package pigroups_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestEvaluatorOverflowApart: a group whose numerator and denominator
// overflow apart but whose value is finite is evaluated exactly enough
// (in logarithms); one truly out of range is a typed error; a zero in
// the numerator and a missing value (NaN) pass through.
func TestEvaluatorOverflowApart(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("F", q.Force), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length))
	s, err := p.PiSet("ρ", "V", "D")
	if err != nil {
		t.Fatal(err)
	}
	ev := s.Evaluator()
	row := func(f, rho, v, d float64) []q.Quantity {
		return []q.Quantity{q.New(f, q.Force), q.New(rho, q.Density), q.New(v, q.Velocity), q.New(d, q.Length)}
	}
	// F/(ρV²D²) with F = 1e300, ρ = 1e150, V = 1e75, D = 1: numerator and
	// denominator are each near the float64 limit; the group is 1e300/
	// (1e150·1e150) = 1.
	got, err := ev.Row(row(1e300, 1e150, 1e75, 1e75), make([]float64, 1))
	if err != nil || math.Abs(got[0]-1e300/1e150/1e150/1e150) > 1e-12*got[0] {
		t.Errorf("overflowing apart: %v, %v", got, err)
	}
	got, err = ev.Row(row(1e300, 1e-300, 1e-10, 1e-10), make([]float64, 1))
	var ee *pigroups.Error
	if !errors.Is(err, pigroups.ErrNotFinite) || !errors.As(err, &ee) || ee.Symbol != "Π₁" {
		t.Errorf("out of range: %v, %v", got, err)
	}
	if got, err := ev.Row(row(0, 1000, 2, 0.1), make([]float64, 1)); err != nil || got[0] != 0 {
		t.Errorf("zero force: %v, %v", got, err)
	}
	if got, err := ev.Row(row(math.NaN(), 1000, 2, 0.1), make([]float64, 1)); err != nil || !math.IsNaN(got[0]) {
		t.Errorf("missing force: %v, %v", got, err)
	}
	cols := []q.Series{q.NewSeries([]float64{1e300, 2, 1e300}, q.Force), q.NewSeries([]float64{1e150, 1, 1e-300}, q.Density),
		q.NewSeries([]float64{1e75, 1, 1e-10}, q.Velocity), q.NewSeries([]float64{1e75, 1, 1e-10}, q.Length)}
	dst := [][]float64{make([]float64, 3)}
	err = ev.Series(cols, dst)
	if !errors.As(err, &ee) || !errors.Is(err, pigroups.ErrNotFinite) {
		t.Errorf("Series out of range: %v", err)
	}
	if math.Abs(dst[0][0]-1e-150) > 1e-162 || dst[0][1] != 2 {
		t.Errorf("Series values %v", dst[0])
	}
}
