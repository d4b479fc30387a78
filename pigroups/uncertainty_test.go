package pigroups_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// reynolds is the one-group problem Re = ρVD/μ.
func reynolds(t *testing.T) *pigroups.Evaluator {
	t.Helper()
	p := pigroups.MustProblem(pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity))
	s, err := p.PiSet("rho", "V", "D")
	if err != nil {
		t.Fatal(err)
	}
	return s.Evaluator()
}

// TestRowMeasured: the group of a product of powers has the relative
// uncertainty of GUM eq. (12) (root-sum-square of exponent-weighted
// relative uncertainties); a source shared by ρ and μ with the same
// relative effect (one thermometer, say) cancels, since Re has ρ¹ and μ⁻¹
// (here the Pi group is its inverse, μ/(ρVD), with the same cancellation).
func TestRowMeasured(t *testing.T) {
	e := reynolds(t)
	set := uncertain.NewSet()
	rel := func(name string, r float64) uncertain.ID {
		return set.MustAdd(uncertain.Source{Name: name, U: q.Scalar(r), Relative: true})
	}
	th := rel("shared", 0.01)
	rho := set.MustMeasure(q.New(998, q.Density), rel("rho", 0.001), th)
	v := set.MustMeasure(q.New(2, q.Velocity), rel("V", 0.005))
	d := set.MustMeasure(q.New(0.05, q.Length), rel("D", 0.002))
	mu := set.MustMeasure(q.New(1e-3, q.DynamicViscosity), rel("mu", 0.02), th)
	dst := make([]uncertain.Measured, 1)
	g, err := e.RowMeasured([]uncertain.Measured{rho, v, d, mu}, dst)
	if err != nil {
		t.Fatal(err)
	}
	want := math.Sqrt(0.001*0.001 + 0.005*0.005 + 0.002*0.002 + 0.02*0.02)
	if math.Abs(g[0].Rel()-want) > 1e-12 {
		t.Errorf("u_rel = %v, want %v (the shared source cancelling)", g[0].Rel(), want)
	}
	if math.Abs(g[0].Value()-1e-3/(998*2*0.05)) > 1e-18 {
		t.Errorf("value %v", g[0].Value())
	}
}

// TestSeriesU: the per-row uncertainties of SeriesU are those of
// RowMeasured for the same rows, with a shared calibration on V and D.
func TestSeriesU(t *testing.T) {
	e := reynolds(t)
	rows := [][4]float64{{998, 2, 0.05, 1e-3}, {1025, 0.7, 0.1, 1.2e-3}, {870, 5, 0.02, 4e-3}}
	urow := [][4]float64{{1, 0.01, 0.0001, 2e-5}, {2, 0.003, 0.0002, 1e-5}, {0.5, 0.05, 0, 8e-5}}
	dims := []q.Dim{q.Density, q.Velocity, q.Length, q.DynamicViscosity}
	cols := make([]q.Series, 4)
	us := make([]q.Series, 4)
	for j := range 4 {
		var x, u []float64
		for r := range rows {
			x, u = append(x, rows[r][j]), append(u, urow[r][j])
		}
		cols[j], us[j] = q.NewSeries(x, dims[j]), q.NewSeries(u, dims[j])
	}
	shared := []pigroups.SharedSource{{Name: "cal", Rel: []float64{0, 0.003, 0.001, 0}}}
	out, uout := [][]float64{make([]float64, 3)}, [][]float64{make([]float64, 3)}
	if err := e.SeriesU(cols, us, shared, out, uout); err != nil {
		t.Fatal(err)
	}
	for r := range rows {
		set := uncertain.NewSet()
		cal := set.MustAdd(uncertain.Source{Name: "cal", U: q.Scalar(1), Relative: true})
		var in []uncertain.Measured
		for j := range 4 {
			id := set.MustAdd(uncertain.Source{Name: string(rune('a' + j)), U: q.New(urow[r][j], dims[j])})
			m := set.MustMeasure(q.New(rows[r][j], dims[j]), id)
			if s := shared[0].Rel[j]; s != 0 {
				// The shared calibration: x·(1 + s·δ) with δ of unit standard
				// uncertainty, one source for every variable it acts on.
				delta := set.MustMeasure(q.Scalar(1), cal) // 1 with derivative 1
				m = m.Add(uncertain.Linear(q.New(0, dims[j]), []float64{rows[r][j] * s}, []uncertain.Measured{delta}))
			}
			in = append(in, m)
		}
		g, err := e.RowMeasured(in, make([]uncertain.Measured, 1))
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(out[0][r]-g[0].Value()) > 1e-15*g[0].Value() || math.Abs(uout[0][r]-g[0].U().Value()) > 1e-12*g[0].U().Value() {
			t.Errorf("row %d: SeriesU %v ± %v, RowMeasured %v", r, out[0][r], uout[0][r], g[0])
		}
	}
}

// TestMeasuredLaw: predicting from a fit whose coefficients are sources,
// the uncertainty from the coefficients alone is the fit's standard error
// of the mean in log space times y (the half-width of Predict's mean
// interval over the Student t quantile), and the inputs' uncertainty adds
// in quadrature through the exponent: u_rel² = se² + (a·u_Π/Π)².
func TestMeasuredLaw(t *testing.T) {
	// Invented data scattered about Π₀ = 2·Π₁^−0.25.
	x := []float64{1e4, 2e4, 5e4, 1e5, 2e5, 5e5, 1e6}
	noise := []float64{0.01, -0.02, 0.015, 0, -0.01, 0.02, -0.012}
	var y []float64
	for i, xi := range x {
		y = append(y, 2*math.Pow(xi, -0.25)*math.Exp(noise[i]))
	}
	fit, err := pigroups.FitPowerLaw(y, [][]float64{x}, nil)
	if err != nil {
		t.Fatal(err)
	}
	set := uncertain.NewSet()
	law, err := fit.Measured(set, "fit")
	if err != nil {
		t.Fatal(err)
	}
	exact := uncertain.Exact(q.Scalar(3e5))
	p0, pr, err := law.Predict(exact)
	if err != nil {
		t.Fatal(err)
	}
	tq := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: float64(fit.DoF)}.Quantile(1 - (1-fit.Level)/2)
	se := math.Log(pr.Mean[1]/pr.Value) / tq
	if math.Abs(p0.Rel()-se) > 1e-9*se {
		t.Errorf("u_rel from the fit = %v, standard error of the mean %v", p0.Rel(), se)
	}
	id := set.MustAdd(uncertain.Source{Name: "Re", U: q.Scalar(0.02), Relative: true})
	p1, _, err := law.Predict(set.MustMeasure(q.Scalar(3e5), id))
	if err != nil {
		t.Fatal(err)
	}
	want := math.Hypot(se, fit.Exponents[0]*0.02)
	if math.Abs(p1.Rel()-want) > 1e-9*want {
		t.Errorf("u_rel = %v, want √(se² + (a·0.02)²) = %v", p1.Rel(), want)
	}
	if p1.Value() != pr.Value {
		t.Errorf("value %v, Predict %v", p1.Value(), pr.Value)
	}
}

// TestRowMeasuredZero: at a zero value the sensitivity Π·a/x of a
// product of powers is not defined, and RowMeasured says so rather than
// return a NaN derivative.
func TestRowMeasuredZero(t *testing.T) {
	e := reynolds(t)
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "V", U: q.New(0.01, q.Velocity)})
	in := []uncertain.Measured{uncertain.Exact(q.New(998, q.Density)), set.MustMeasure(q.New(0, q.Velocity), id),
		uncertain.Exact(q.New(0.05, q.Length)), uncertain.Exact(q.New(1e-3, q.DynamicViscosity))}
	if _, err := e.RowMeasured(in, make([]uncertain.Measured, 1)); err == nil {
		t.Errorf("a zero velocity accepted")
	}
}
