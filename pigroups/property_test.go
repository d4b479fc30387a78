package pigroups_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"
	"pgregory.net/rapid"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

func randomProblem(t *rapid.T) *pigroups.Problem {
	n := rapid.IntRange(2, 8).Draw(t, "n")
	nb := rapid.IntRange(1, 4).Draw(t, "bases")
	var vars []pigroups.Variable
	for i := range n {
		e := make([]int, 7)
		for b := range nb {
			e[b] = rapid.IntRange(-3, 3).Draw(t, "e")
		}
		d := q.MustDim(e[0], e[1], e[2], e[3], e[4], e[5], e[6])
		v := pigroups.Var(fmt.Sprintf("x%d", i), d)
		if i == 0 && rapid.Bool().Draw(t, "dep") {
			v = v.AsDependent()
		}
		vars = append(vars, v)
	}
	p, err := pigroups.NewProblem(vars...)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestPiSetProperties checks Buckingham's theorem on random dimensional
// matrices: every group is dimensionless, there are n − r of them, and
// any two valid repeating sets give equivalent sets.
func TestPiSetProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		p := randomProblem(t)
		sets, _ := p.RepeatingSets()
		var first *pigroups.Set
		for k, r := range sets {
			if k > 6 {
				break
			}
			s, err := p.PiSet(r...)
			if p.NumGroups() == 0 {
				if err == nil {
					t.Fatalf("a set with no groups was built")
				}
				return
			}
			if err != nil {
				t.Fatalf("PiSet(%v): %v", r, err)
			}
			if s.Len() != p.NumGroups() {
				t.Fatalf("%d groups, n − r = %d", s.Len(), p.NumGroups())
			}
			for _, g := range s.Groups() {
				d, err := g.Dim()
				if err == nil && !d.IsDimensionless() {
					t.Fatalf("group %s has dimension %v", g, d)
				}
				if g.Exponents()[g.Var].Sign() <= 0 {
					t.Fatalf("group %s: its variable's exponent is not positive", g)
				}
			}
			if first == nil {
				first = s
			} else if eq, err := pigroups.Equivalent(first, s); err != nil || !eq {
				t.Fatalf("sets from %v and %v are not equivalent", first.Repeating(), r)
			}
		}
	})
}

// TestFitRecoversExponents fits synthetic noisy data with known exponents
// and checks that the 95 % intervals cover the truth at about the stated
// rate. The data are invented: Π₀ = 0.3·Π₁^0.5·Π₂^−1.2 with log-normal
// scatter of 5 %.
func TestFitRecoversExponents(t *testing.T) {
	r := rand.New(rand.NewPCG(7, 11))
	noise := distuv.Normal{Mu: 0, Sigma: 0.05, Src: r}
	const trials, rows = 400, 30
	covered := 0
	for range trials {
		y := make([]float64, rows)
		x1 := make([]float64, rows)
		x2 := make([]float64, rows)
		for i := range rows {
			x1[i] = math.Exp(r.Float64()*6 + 8) // Re-like, 3e3 … 1e6
			x2[i] = 1 + 9*r.Float64()
			y[i] = 0.3 * math.Pow(x1[i], 0.5) * math.Pow(x2[i], -1.2) * math.Exp(noise.Rand())
		}
		f, err := pigroups.FitPowerLaw(y, [][]float64{x1, x2}, nil)
		if err != nil {
			t.Fatal(err)
		}
		if f.Intervals[0][0] <= 0.5 && 0.5 <= f.Intervals[0][1] {
			covered++
		}
		if f.R2 < 0.9 {
			t.Fatalf("R² = %v", f.R2)
		}
	}
	// Binomial(400, 0.95): mean 380, standard deviation 4.4; accept ±4σ.
	if covered < 362 || covered > 398 {
		t.Errorf("95 %% interval covered the true exponent in %d of %d trials", covered, trials)
	}
}

func TestFitErrors(t *testing.T) {
	ok := []float64{1, 2, 3, 4, 5}
	cases := []struct {
		y   []float64
		x   [][]float64
		err error
	}{
		{[]float64{1, 2}, [][]float64{{1, 2}}, pigroups.ErrTooFewRows},
		{[]float64{1, -2, 3, 4, 5}, [][]float64{ok}, pigroups.ErrNonPositive},
		{ok, [][]float64{{1, 2, 0, 4, 5}}, pigroups.ErrNonPositive},
		{ok, [][]float64{ok, {1, 4, 9, 16, 25}}, pigroups.ErrCollinear}, // second = first²
		{ok, [][]float64{{2, 2, 2, 2, 2}}, pigroups.ErrCollinear},       // constant, collinear with C
		{ok, [][]float64{{1, 2, 3}}, pigroups.ErrFitShape},
	}
	for _, c := range cases {
		_, err := pigroups.FitPowerLaw(c.y, c.x, nil)
		var fe *pigroups.Error
		if !errors.As(err, &fe) || !errors.Is(err, c.err) {
			t.Errorf("FitPowerLaw(%v, %v) = %v, want %v", c.y, c.x, err, c.err)
		}
		if c.err == pigroups.ErrCollinear && fe != nil && fe.Cond < 1e10 {
			t.Errorf("collinear: condition number %v", fe.Cond)
		}
	}
}

func TestFitExactAndPredict(t *testing.T) {
	// Noise-free data y = 2·x^1.5 with one small perturbation so the
	// residual variance is positive.
	x := []float64{1, 2, 4, 8, 16, 32}
	y := make([]float64, len(x))
	for i, v := range x {
		y[i] = 2 * math.Pow(v, 1.5)
	}
	y[2] *= 1.001
	f, err := pigroups.FitPowerLaw(y, [][]float64{x}, &pigroups.FitOptions{Weights: []float64{1, 1, 1, 1, 1, 2}})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(f.Exponents[0]-1.5) > 1e-3 || math.Abs(f.C-2) > 1e-2 {
		t.Errorf("fit: C = %v, a = %v", f.C, f.Exponents)
	}
	pr, err := f.Predict(10)
	if err != nil {
		t.Fatal(err)
	}
	want := 2 * math.Pow(10, 1.5)
	if math.Abs(pr.Value/want-1) > 2e-3 || !(pr.Mean[0] < pr.Value && pr.Value < pr.Mean[1]) ||
		!(pr.Individual[0] < pr.Mean[0] && pr.Mean[1] < pr.Individual[1]) {
		t.Errorf("prediction %+v, want about %v", pr, want)
	}
}

func TestEvaluator(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("dp", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("eps", q.Length))
	s, _ := p.PiSet("rho", "V", "D")
	e := s.Evaluator()
	row := []q.Quantity{q.New(2000, q.Pressure), q.New(1000, q.Density), q.New(2, q.Velocity), q.New(0.1, q.Length),
		q.New(1e-3, q.DynamicViscosity), q.New(1e-4, q.Length)}
	dst := make([]float64, s.Len())
	got, err := e.Row(row, dst)
	if err != nil {
		t.Fatal(err)
	}
	// By hand: Δp/(ρV²) = 2000/4000 = 0.5; μ/(ρVD) = 1e-3/200 = 5e-6; ε/D = 1e-3.
	want := []float64{0.5, 5e-6, 1e-3}
	for i := range want {
		if math.Abs(got[i]/want[i]-1) > 1e-15 {
			t.Errorf("group %d = %v, want %v", i, got[i], want[i])
		}
	}
	if allocs := testing.AllocsPerRun(100, func() { _, _ = e.Row(row, dst) }); allocs != 0 {
		t.Errorf("Row allocates %v times", allocs)
	}
	bad := append([]q.Quantity(nil), row...)
	bad[4] = q.New(1e-6, q.KinematicViscosity)
	if _, err := e.Row(bad, dst); err == nil || !errors.Is(err, q.ErrDimension) {
		t.Errorf("a kinematic viscosity for μ: %v", err)
	}
	// Series over 600 rows (more than one block) against Row.
	n := 600
	cols := make([]q.Series, 6)
	for j := range cols {
		v := make([]float64, n)
		for i := range v {
			v[i] = row[j].Value() * (1 + 0.001*float64(i+j))
		}
		cols[j] = q.NewSeries(v, row[j].Dim())
	}
	out := make([][]float64, s.Len())
	for g := range out {
		out[g] = make([]float64, n)
	}
	if err := e.Series(cols, out); err != nil {
		t.Fatal(err)
	}
	for i := 0; i < n; i += 97 {
		r := make([]q.Quantity, 6)
		for j := range r {
			r[j] = cols[j].At(i)
		}
		g, _ := e.Row(r, make([]float64, 3))
		for k := range g {
			if math.Abs(out[k][i]/g[k]-1) > 1e-14 {
				t.Errorf("row %d group %d: series %v, row %v", i, k, out[k][i], g[k])
			}
		}
	}
	if allocs := testing.AllocsPerRun(20, func() { _ = e.Series(cols, out) }); allocs != 0 {
		t.Errorf("Series allocates %v times", allocs)
	}
}

// TestDefaultIsBestValidSet checks the greedy default against an
// exhaustive search over every valid repeating set, ranking each set by
// its members' preference ranks sorted (then their indices), on random
// problems with kinds drawn from the preference list.
func TestDefaultIsBestValidSet(t *testing.T) {
	kinds := []struct {
		kind string
		d    q.Dim
	}{
		{"density", q.Density}, {"velocity", q.Velocity}, {"length", q.Length}, {"dynamic viscosity", q.DynamicViscosity},
		{"mass", q.Mass}, {"time", q.Time}, {"", q.Force}, {"", q.Pressure}, {"", q.Power}, {"", q.Energy},
	}
	rank := map[string]int{"density": 0, "velocity": 1, "length": 2, "dynamic viscosity": 5, "mass": 9, "time": 10}
	rapid.Check(t, func(t *rapid.T) {
		n := rapid.IntRange(3, 8).Draw(t, "n")
		var vars []pigroups.Variable
		var pref []int
		for i := range n {
			k := kinds[rapid.IntRange(0, len(kinds)-1).Draw(t, "kind")]
			v := pigroups.Var(fmt.Sprintf("x%d", i), k.d)
			r := 50
			if k.kind != "" {
				v = v.WithKind(k.kind)
				r = rank[k.kind]
			} else if inf := pigroups.InferKinds(k.d); len(inf) > 0 {
				if rr, ok := rank[inf[0]]; ok {
					r = rr
				}
			}
			vars = append(vars, v)
			pref = append(pref, r)
		}
		p, err := pigroups.NewProblem(vars...)
		if err != nil {
			t.Fatal(err)
		}
		sets, _ := p.RepeatingSets()
		got, err := p.DefaultRepeating()
		if len(sets) == 0 {
			if err == nil {
				t.Fatalf("a default %v with no valid set", got)
			}
			return
		}
		if err != nil {
			t.Fatal(err)
		}
		key := func(set []string) []int {
			var idx []int
			for _, s := range set {
				var i int
				fmt.Sscanf(s, "x%d", &i)
				idx = append(idx, i)
			}
			sortByPref(idx, pref)
			k := make([]int, 0, 2*len(idx))
			for _, i := range idx {
				k = append(k, pref[i])
			}
			return append(k, idx...)
		}
		best := sets[0]
		for _, s := range sets[1:] {
			if cmpInts(key(s), key(best)) < 0 {
				best = s
			}
		}
		if cmpInts(key(got), key(best)) != 0 {
			t.Fatalf("default %v, exhaustive best %v", got, best)
		}
	})
}

func sortByPref(idx, pref []int) {
	for i := 1; i < len(idx); i++ {
		for j := i; j > 0 && (pref[idx[j]] < pref[idx[j-1]] || pref[idx[j]] == pref[idx[j-1]] && idx[j] < idx[j-1]); j-- {
			idx[j], idx[j-1] = idx[j-1], idx[j]
		}
	}
}

func cmpInts(a, b []int) int {
	for i := range min(len(a), len(b)) {
		if a[i] != b[i] {
			return a[i] - b[i]
		}
	}
	return len(a) - len(b)
}

// TestPiSetRefusesAsCheckRepeating: PiSet checks a repeating set's
// independence by the elimination that solves its groups, and refuses
// exactly the sets CheckRepeating refuses, with the same error —
// dependent members, a base dimension none carries, the dependent
// variable, a wrong count — on random dimensional matrices and random
// candidate sets.
func TestPiSetRefusesAsCheckRepeating(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		p := randomProblem(t)
		vars := p.Variables()
		size := rapid.IntRange(0, min(len(vars), p.Rank()+1)).Draw(t, "size")
		set := make([]string, size)
		for k := range set {
			set[k] = vars[rapid.IntRange(0, len(vars)-1).Draw(t, "member")].Symbol
		}
		want := p.CheckRepeating(set...)
		_, got := p.PiSet(set...)
		if (got == nil) != (want == nil) || got != nil && got.Error() != want.Error() {
			t.Fatalf("PiSet(%v) = %v, CheckRepeating = %v", set, got, want)
		}
	})
}
