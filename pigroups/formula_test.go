package pigroups_test

import (
	"math"
	"testing"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// TestFitAsFormula: a fitted power law written as formula text compiles
// against the problem's variables and computes what Predict computes.
func TestFitAsFormula(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("dp", q.Pressure).WithKind("pressure difference"), pigroups.Var("rho", q.Density),
		pigroups.Var("V", q.Velocity), pigroups.Var("d", q.Length), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("L", q.Length))
	s, err := p.PiSet("rho", "V", "d")
	if err != nil {
		t.Fatal(err)
	}
	// Invented readings: Eu = 4·Re^-0.1·(L/d)^0.25 with a little scatter.
	var y, re, ld []float64
	for i := range 12 {
		r, l := 3000*math.Pow(1.3, float64(i)), 2+float64(i%4)
		re, ld = append(re, r), append(ld, l)
		y = append(y, 4*math.Pow(r, -0.1)*math.Pow(l, 0.25)*(1+0.003*float64(i%3-1)))
	}
	fit, err := pigroups.FitPowerLaw(y, [][]float64{re, ld}, nil)
	if err != nil {
		t.Fatal(err)
	}
	gs := s.Groups() // Eu, Re (as ρVd/μ after orientation), L/d
	reG := gs[1].Conventional()
	text, err := fit.Formula("Eu", reG, gs[2])
	if err != nil {
		t.Fatal(err)
	}
	var inputs []formula.Input
	for _, v := range p.Variables() {
		inputs = append(inputs, formula.Input{Name: v.Symbol, Dim: v.Dim})
	}
	prog, err := formula.Compile(text, inputs...)
	if err != nil {
		t.Fatalf("%q: %v", text, err)
	}
	// A row: ρ = 998, V = 1.5, d = 0.02, μ = 1e-3, L = 0.08 (dp unused).
	row := []float64{0, 998, 1.5, 0.02, 1e-3, 0.08}
	got, err := prog.Evaluator().Row(row, make([]float64, 1))
	if err != nil {
		t.Fatal(err)
	}
	pr, err := fit.Predict(998*1.5*0.02/1e-3, 0.08/0.02)
	if err != nil || math.Abs(got[0]/pr.Value-1) > 1e-12 {
		t.Errorf("%q gives %v, Predict %v (%v)", text, got[0], pr.Value, err)
	}
}
