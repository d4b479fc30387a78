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

// TestGroupsAsFormula: every group of a Pi set, written in ASCII, is
// formula text that compiles against the variables to a dimensionless
// result and computes the group's value.
func TestGroupsAsFormula(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("T", q.Force).WithKind("force"), pigroups.VarKind("rho", q.Density, "density"),
		pigroups.VarKind("n", q.AngularVelocity, "rotational speed"), pigroups.VarKind("D", q.Length, "length"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"))
	s, err := p.PiSet("rho", "n", "D")
	if err != nil {
		t.Fatal(err)
	}
	var inputs []formula.Input
	row := []float64{150, 1000, 62.8, 0.25, 2.1, 1.1e-3, 9.81}
	qs := make([]q.Quantity, len(row))
	for i, v := range p.Variables() {
		inputs = append(inputs, formula.Input{Name: v.Symbol, Dim: v.Dim})
		qs[i] = q.New(row[i], v.Dim)
	}
	for _, set := range []*pigroups.Set{s, s.WithCoefficients()} {
		want, err := set.Evaluator().Row(qs, make([]float64, set.Len()))
		if err != nil {
			t.Fatal(err)
		}
		for k, g := range set.Groups() {
			text := g.Format(q.ASCII)
			prog, err := formula.Compile(text, inputs...)
			if err != nil {
				t.Fatalf("%s = %q: %v", g.Name, text, err)
			}
			got, _ := prog.Evaluator().Row(row, make([]float64, 1))
			if !prog.Dim(0).IsDimensionless() || math.Abs(got[0]/want[k]-1) > 1e-12 {
				t.Errorf("%q = %v (%v), the evaluator %v", text, got[0], prog.Dim(0), want[k])
			}
		}
	}
}
