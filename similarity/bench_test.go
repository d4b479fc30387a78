package similarity_test

import (
	"math/rand/v2"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// BenchmarkPlan builds and solves a typical plan: a ship model with
// Froude held, the same water and gravity, a 1:16 scale, and derived
// ratios for force and power.
func BenchmarkPlan(b *testing.B) {
	p := pigroups.MustProblem(
		pigroups.Dep("R", q.Force), pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length), pigroups.Var("g", q.Acceleration),
		pigroups.Var("rho", q.Density), pigroups.Var("mu", q.DynamicViscosity))
	b.ReportAllocs()
	for b.Loop() {
		s, err := similarity.NewPlan(p).
			HoldExps("Fr", map[string]int{"V": 2, "g": -1, "L": -1}).
			HoldExps("C_R", map[string]int{"R": 1, "rho": -1, "V": -2, "L": -2}).
			SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/16).Basis("V", "L", "rho").Solve()
		if err != nil {
			b.Fatal(err)
		}
		if _, err := s.DerivedRatio(q.Power); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkTransfer carries 10⁶ model values to full scale, against a
// plain float64 loop multiplying by the same factor.
func BenchmarkTransfer(b *testing.B) {
	s, _ := similarity.Froude(similarity.Scales{Length: 1.0 / 30, Density: 1})
	r := rand.New(rand.NewPCG(1, 1))
	v := make([]float64, 1_000_000)
	for i := range v {
		v[i] = r.Float64()
	}
	m := q.NewSeries(v, q.Force)
	out := make([]float64, len(v))
	f := 27000.0
	b.Run("float64", func(b *testing.B) {
		for b.Loop() {
			for i, x := range v {
				out[i] = x * f
			}
		}
	})
	b.Run("series", func(b *testing.B) {
		dst := q.NewSeries(make([]float64, len(v)), q.Force)
		b.ReportAllocs()
		for b.Loop() {
			if err := s.SeriesToPrototype(&dst, m); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// BenchmarkToPrototype carries one model force to full scale per call
// through ToPrototype, against a plain float64 multiply by the same
// factor.
func BenchmarkToPrototype(b *testing.B) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 30, Density: 1})
	if err != nil {
		b.Fatal(err)
	}
	f := 27000.0
	x := 12.5
	b.Run("float64", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkF = x * f
		}
	})
	m := q.New(12.5, q.Force)
	b.Run("quantity", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			p, err := s.ToPrototype(m)
			if err != nil {
				b.Fatal(err)
			}
			sinkQ = p
		}
	})
}

var (
	sinkF float64
	sinkQ q.Quantity
)
