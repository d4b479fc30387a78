package pigroups_test

import (
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestSeriesAgreesWithRow: Series, with its fused passes, gives every
// row bit for bit what Row gives it, over blocks of any length and with
// zeros, NaNs and values whose products overflow apart (the logarithmic
// path), for the groups of pipe flow and of a fan (ρ·n³·D⁵ in a
// denominator).
func TestSeriesAgreesWithRow(t *testing.T) {
	pipe := pigroups.MustProblem(pigroups.Dep("dp", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("eps", q.Length), pigroups.Var("L", q.Length))
	fan := pigroups.MustProblem(pigroups.Dep("P", q.Power), pigroups.Var("rho", q.Density), pigroups.Var("n", q.Frequency),
		pigroups.Var("D", q.Length), pigroups.Var("Q", q.VolumeFlowRate), pigroups.Var("mu", q.DynamicViscosity))
	sets := []*pigroups.Set{}
	for _, c := range []struct {
		p   *pigroups.Problem
		rep []string
	}{{pipe, []string{"rho", "V", "D"}}, {pipe, []string{"mu", "V", "L"}}, {fan, []string{"rho", "n", "D"}}} {
		s, err := c.p.PiSet(c.rep...)
		if err != nil {
			t.Fatal(err)
		}
		sets = append(sets, s)
	}
	rapid.Check(t, func(t *rapid.T) {
		s := sets[rapid.IntRange(0, len(sets)-1).Draw(t, "set")]
		vars := s.Problem().Variables()
		rows := rapid.IntRange(0, 600).Draw(t, "rows")
		special := rapid.SampledFrom([]float64{0, math.NaN(), 1e200, 1e-200, -1.5})
		odds := rapid.IntRange(0, 50).Draw(t, "odds") // one value in odds is special (none for 0)
		cols := make([]q.Series, len(vars))
		for j, v := range vars {
			x := make([]float64, rows)
			for i := range x {
				x[i] = rapid.Float64Range(0.5, 2).Draw(t, "x")
				if odds > 0 && rapid.IntRange(1, odds).Draw(t, "special?") == 1 {
					x[i] = special.Draw(t, "special")
				}
			}
			cols[j] = q.NewSeries(x, v.Dim)
		}
		dst := make([][]float64, s.Len())
		for g := range dst {
			dst[g] = make([]float64, rows)
		}
		ev := s.Evaluator()
		serr := ev.Series(cols, dst)
		row := make([]q.Quantity, len(vars))
		got := make([]float64, s.Len())
		for i := range rows {
			for j := range vars {
				row[j] = cols[j].At(i)
			}
			_, rerr := ev.Row(row, got)
			if rerr != nil {
				if serr == nil {
					t.Fatalf("row %d: Row refuses (%v), Series does not", i, rerr)
				}
				return // Series stops at its first refused row
			}
			for g := range got {
				w := dst[g][i]
				if serr != nil && (w == 0 || math.IsInf(w, 0) || math.IsNaN(w)) {
					continue // Series stopped before it redid this row
				}
				if math.Float64bits(w) != math.Float64bits(got[g]) && !(math.IsNaN(w) && math.IsNaN(got[g])) {
					t.Fatalf("row %d group %d: Series %v, Row %v", i, g, w, got[g])
				}
			}
		}
		if serr != nil {
			t.Fatalf("Series refuses (%v), Row accepts every row", serr)
		}
	})
}

// TestPiSetAllocations: building the 12-variable problem and its Pi set
// allocates a bounded number of objects (59 before the matrices moved to
// the stack and the matches to one arena per set).
func TestPiSetAllocations(t *testing.T) {
	vars := twelveVars()
	n := testing.AllocsPerRun(50, func() {
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := p.PiSet("rho", "n", "D"); err != nil {
			t.Fatal(err)
		}
	})
	if n > 16 {
		t.Errorf("NewProblem and PiSet: %v allocations, want at most 16", n)
	}
}
