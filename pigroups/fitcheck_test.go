package pigroups_test

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestFitCorrelatedRowsUseEffectiveN: rows whose errors drift slowly (a
// logged series) have a positive lag-1 autocorrelation r₁ of the
// residuals; with Correlated the intervals use n_eff = n(1 − r₁)/(1 + r₁)
// (common practice), so the standard errors grow by √(n/n_eff) and t
// takes n_eff − 2 degrees of freedom. r₁ is recomputed here from the
// residuals ln y − ln C − a·ln x by its definition Σeᵢeᵢ₊₁/Σeᵢ².
func TestFitCorrelatedRowsUseEffectiveN(t *testing.T) {
	const n = 40
	var y []float64
	x := make([]float64, n)
	for i := range n {
		x[i] = 1 + float64(i)
		drift := 0.03 * math.Sin(float64(i)) // invented, correlated from row to row
		y = append(y, 2*math.Sqrt(x[i])*math.Exp(drift))
	}
	plain, err := pigroups.FitPowerLaw(y, [][]float64{x}, nil)
	if err != nil {
		t.Fatal(err)
	}
	corr, err := pigroups.FitPowerLaw(y, [][]float64{x}, &pigroups.FitOptions{Correlated: true})
	if err != nil {
		t.Fatal(err)
	}
	var num, den float64
	prev := 0.0
	for i := range n {
		e := math.Log(y[i]) - math.Log(plain.C) - plain.Exponents[0]*math.Log(x[i])
		den += e * e
		if i > 0 {
			num += prev * e
		}
		prev = e
	}
	r1 := num / den
	if !(r1 > 0.3) || math.Abs(corr.R1-r1) > 1e-9 {
		t.Fatalf("r₁ = %v, by hand %v (want a clearly positive value)", corr.R1, r1)
	}
	nEff := n * (1 - r1) / (1 + r1)
	if math.Abs(corr.NEff-nEff) > 1e-9 || plain.NEff != n {
		t.Errorf("n_eff = %v (plain %v), by hand %v", corr.NEff, plain.NEff, nEff)
	}
	if got, want := corr.StdErr[1]/plain.StdErr[1], math.Sqrt(n/nEff); math.Abs(got/want-1) > 1e-9 {
		t.Errorf("standard error grew by %v, want √(n/n_eff) = %v", got, want)
	}
	tq := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: nEff - 2}.Quantile(0.975)
	if half := (corr.Intervals[0][1] - corr.Intervals[0][0]) / 2; math.Abs(half/(tq*corr.StdErr[1])-1) > 1e-9 {
		t.Errorf("interval half-width %v, want t(n_eff − 2)·se = %v", half, tq*corr.StdErr[1])
	}
	// A drift so slow (r₁ near 1) that no degree of freedom is left is
	// refused rather than quoted with a meaningless interval.
	slow := make([]float64, n)
	for i := range n {
		slow[i] = 2 * math.Sqrt(x[i]) * math.Exp(0.03*math.Sin(float64(i)/4))
	}
	if _, err := pigroups.FitPowerLaw(slow, [][]float64{x}, &pigroups.FitOptions{Correlated: true}); err == nil || !strings.Contains(err.Error(), "effective") {
		t.Errorf("a slow drift: %v, want a refusal naming the effective rows", err)
	}
}

// TestFitRunsTestFlagsLackOfFit: y = eˣ is no power law of x; its
// residuals against the best power law run in long stretches of one sign
// (a curve), and the runs test flags it. y = 2·√x·(1 ± 1 %), the sign
// alternating, has a run per row and is not flagged. Expected runs by
// hand for 10 + and 10 −: 2·10·10/20 + 1 = 11.
func TestFitRunsTestFlagsLackOfFit(t *testing.T) {
	var x, curve, good []float64
	for i := range 20 {
		v := 1 + float64(i)/4
		x = append(x, v)
		curve = append(curve, math.Exp(v))
		good = append(good, 2*math.Sqrt(v)*(1+0.01*float64(1-2*(i%2))))
	}
	c, err := pigroups.FitPowerLaw(curve, [][]float64{x}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Runs.LackOfFit || !strings.Contains(c.Runs.String(), "LACK OF FIT") {
		t.Errorf("eˣ as a power law: %s", c.Runs)
	}
	g, err := pigroups.FitPowerLaw(good, [][]float64{x}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if g.Runs.LackOfFit || g.Runs.Runs < 15 {
		t.Errorf("alternating residuals: %s", g.Runs)
	}
	if g.Runs.Plus == 10 && g.Runs.Minus == 10 && math.Abs(g.Runs.Expected-11) > 1e-12 {
		t.Errorf("expected runs %v, by hand 11", g.Runs.Expected)
	}
}

// TestFitWarnsSharedVariables: Eu = Δp/(ρV²) and Re = ρVd/μ share ρ and V,
// so a fit of one on the other is warned about; L/d shares nothing with
// Eu and is not named.
func TestFitWarnsSharedVariables(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("dp", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("d", q.Length), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("L", q.Length))
	s, err := p.PiSet("rho", "V", "d")
	if err != nil {
		t.Fatal(err)
	}
	gs := s.Groups()
	if sh := pigroups.SharedVariables(gs[0], gs[1]); strings.Join(sh, ",") != "rho,V" {
		t.Errorf("shared by Π₁ and Π₂: %v, want rho, V", sh)
	}
	y := []float64{1, 1.2, 1.1, 1.4, 1.3, 1.6}
	x1 := []float64{1e3, 2e3, 3e3, 4e3, 5e3, 6e3}
	x2 := []float64{2, 4, 2, 8, 4, 8}
	f, err := pigroups.FitPowerLaw(y, [][]float64{x1, x2}, &pigroups.FitOptions{Groups: gs, Names: []string{"Eu", "Re", "L/d"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(f.Warnings) != 1 || !strings.Contains(f.Warnings[0], "Eu and Re share rho, V") || !strings.Contains(f.Warnings[0], "spurious correlation") {
		t.Errorf("warnings %q", f.Warnings)
	}
}

// TestMissingBeatsZero: a row with a missing value (NaN) and a zero in a
// denominator is a missing group value, not a range error: the missing
// reading explains it.
func TestMissingBeatsZero(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("x", q.Length), pigroups.Var("b", q.Length))
	s, err := p.PiSet("b")
	if err != nil {
		t.Fatal(err)
	}
	dst := [][]float64{make([]float64, 2)}
	cols := []q.Series{q.NewSeries([]float64{math.NaN(), 1}, q.Length), q.NewSeries([]float64{0, 2}, q.Length)}
	if err := s.Evaluator().Series(cols, dst); err != nil || !math.IsNaN(dst[0][0]) || dst[0][1] != 0.5 {
		t.Errorf("x/b over (NaN/0, 1/2): %v, %v; want NaN and 0.5", dst[0], err)
	}
}
