package ship_test

import (
	"testing"

	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity/ship"
)

// BenchmarkTankBlockage corrects one run for the tank's blockage, against
// a plain-float64 baseline that solves the same mean-flow cubic by the
// same Newton iteration without unit checks, the choking speed or the
// surface drop.
func BenchmarkTankBlockage(b *testing.B) {
	tank := ship.TankSection{Width: q.New(4.5, q.Length), Depth: q.New(2.2, q.Length)}
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
			c, err := ship.TankBlockage(tank, ax, v, q.Quantity{})
			if err != nil {
				b.Fatal(err)
			}
			sink += c.SpeedCorrection
		}
	})
	_ = sink
}
