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

// BenchmarkTankBlockage corrects one run for the tank's blockage, against
// a plain-float64 baseline that solves the same mean-flow cubic by the
// same Newton iteration without unit checks, the choking speed or the
// surface drop.
func BenchmarkTankBlockage(b *testing.B) {
	tank := similarity.TankSection{Width: q.New(4.5, q.Length), Depth: q.New(2.2, q.Length)}
	ax, v := q.New(0.03, q.Area), q.New(2.4, q.Velocity)
	var sink float64
	b.Run("float64", func(b *testing.B) {
		for b.Loop() {
			m, fh2 := 0.03/(4.5*2.2), 2.4*2.4/(9.80665*2.2)
			s := 1 / (1 - m)
			for range 100 {
				f := fh2/2*s*s*s - (1-m+fh2/2)*s + 1
				next := s - f/(1.5*fh2*s*s-(1-m+fh2/2))
				if next <= s {
					break
				}
				s = next
			}
			sink += s
		}
	})
	b.Run("quantity", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			c, err := similarity.TankBlockage(tank, ax, v, q.Quantity{})
			if err != nil {
				b.Fatal(err)
			}
			sink += c.SpeedCorrection
		}
	})
	_ = sink
}
