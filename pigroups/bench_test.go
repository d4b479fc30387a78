package pigroups_test

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// twelveVars is a 12-variable problem: a ship propeller in a cavitation
// tunnel (common practice list of variables).
func twelveVars() []pigroups.Variable {
	return []pigroups.Variable{
		pigroups.Dep("T", q.Force), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("n", q.AngularVelocity), pigroups.Var("mu", q.DynamicViscosity),
		pigroups.Var("g", q.Acceleration), pigroups.Var("pv", q.Pressure), pigroups.Var("p0", q.Pressure),
		pigroups.Var("sigma", q.SurfaceTension), pigroups.Var("c", q.Length), pigroups.Var("Q", q.Torque),
	}
}

// BenchmarkPiSet builds the 12-variable problem and its Pi set for a
// chosen repeating set.
func BenchmarkPiSet(b *testing.B) {
	vars := twelveVars()
	b.ReportAllocs()
	for b.Loop() {
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := p.PiSet("rho", "n", "D"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkRepeatingSets enumerates every valid repeating set of a
// 20-variable, rank-4 problem.
func BenchmarkRepeatingSets(b *testing.B) {
	r := rand.New(rand.NewPCG(3, 4))
	var vars []pigroups.Variable
	for i := range 20 {
		d := q.MustDim(r.IntN(5)-2, r.IntN(3)-1, r.IntN(5)-3, 0, r.IntN(3)-1, 0, 0)
		vars = append(vars, pigroups.Var(fmt.Sprintf("x%d", i), d))
	}
	p, err := pigroups.NewProblem(vars...)
	if err != nil || p.Rank() != 4 {
		b.Fatalf("rank %d, %v", p.Rank(), err)
	}
	b.ReportAllocs()
	n := 0
	for b.Loop() {
		sets, _ := p.RepeatingSets()
		n = len(sets)
	}
	b.ReportMetric(float64(n), "sets")
}

const evalRows = 100_000

func evalData() ([]q.Series, *pigroups.Evaluator, [][]float64) {
	p := pigroups.MustProblem(pigroups.Dep("dp", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("eps", q.Length), pigroups.Var("L", q.Length))
	s, err := p.PiSet("rho", "V", "D")
	if err != nil {
		panic(err)
	}
	r := rand.New(rand.NewPCG(5, 6))
	dims := []q.Dim{q.Pressure, q.Density, q.Velocity, q.Length, q.DynamicViscosity, q.Length, q.Length}
	cols := make([]q.Series, len(dims))
	for j, d := range dims {
		v := make([]float64, evalRows)
		for i := range v {
			v[i] = 0.5 + r.Float64()
		}
		cols[j] = q.NewSeries(v, d)
	}
	out := make([][]float64, s.Len())
	for g := range out {
		out[g] = make([]float64, evalRows)
	}
	return cols, s.Evaluator(), out
}

// BenchmarkEvaluate evaluates the four groups of pipe flow (Δp/(ρV²),
// μ/(ρVD), ε/D, L/D) over 10⁵ rows: by the Evaluator, and by a plain
// float64 loop written for these groups.
func BenchmarkEvaluate(b *testing.B) {
	cols, e, out := evalData()
	b.Run("float64", func(b *testing.B) {
		dp, rho, v, d, mu, eps, l := cols[0].Values(), cols[1].Values(), cols[2].Values(), cols[3].Values(), cols[4].Values(), cols[5].Values(), cols[6].Values()
		o0, o1, o2, o3 := out[0], out[1], out[2], out[3]
		for b.Loop() {
			for i := range dp {
				o0[i] = dp[i] / (rho[i] * v[i] * v[i])
				o1[i] = mu[i] / (rho[i] * v[i] * d[i])
				o2[i] = eps[i] / d[i]
				o3[i] = l[i] / d[i]
			}
		}
	})
	b.Run("series", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := e.Series(cols, out); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// BenchmarkEvaluateU evaluates the same four groups over 10⁵ rows with a
// per-row standard uncertainty on every variable and one shared source:
// SeriesU against the value-only Series in the same run.
func BenchmarkEvaluateU(b *testing.B) {
	cols, e, out := evalData()
	u := make([]q.Series, len(cols))
	for j, c := range cols {
		v := make([]float64, c.Len())
		for i, x := range c.Values() {
			v[i] = 0.01 * x
		}
		u[j] = q.NewSeries(v, c.Dim())
	}
	shared := []pigroups.SharedSource{{Name: "calibration", Rel: []float64{0.002, 0, 0, 0, 0, 0, 0}}}
	uout := make([][]float64, len(out))
	for g := range uout {
		uout[g] = make([]float64, evalRows)
	}
	b.Run("series", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := e.Series(cols, out); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("seriesU", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := e.SeriesU(cols, u, shared, out, uout); err != nil {
				b.Fatal(err)
			}
		}
	})
}
