package similis_test

// The exponent API as an importer sees it: this test imports only the
// module's public packages and exercises every exported function and
// method that takes or returns an exact exponent.

import (
	"testing"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

func TestExponentsFromOutside(t *testing.T) {
	half := quantity.MustRat(1, 2)
	if r, err := quantity.NewRat(3, 6); err != nil || r != half || r.Num() != 1 || r.Den() != 2 || r.String() != "1/2" {
		t.Errorf("NewRat(3, 6) = %v, %v", r, err)
	}
	if p, err := quantity.ParseRat("-3/2"); err != nil || p != quantity.MustRat(-3, 2) {
		t.Errorf("ParseRat = %v, %v", p, err)
	}
	d, _ := quantity.Length.Pow(1, 2)
	if d.Exponent(quantity.BaseL) != half {
		t.Errorf("Dim.Exponent = %v", d.Exponent(quantity.BaseL))
	}
	v := []quantity.Rat{half, quantity.MustRat(-1, 3)}
	if f, err := quantity.Coprime(v, v); err != nil || f != quantity.RatInt(6) || v[0] != quantity.RatInt(3) {
		t.Errorf("Coprime = %v, %v, %v", v, f, err)
	}

	p := pigroups.MustProblem(
		pigroups.Dep("F", quantity.Force).WithKind("force"), pigroups.VarKind("ρ", quantity.Density, "density"),
		pigroups.VarKind("V", quantity.Velocity, "velocity"), pigroups.VarKind("D", quantity.Length, "length"),
		pigroups.VarKind("μ", quantity.DynamicViscosity, "dynamic viscosity"))
	m := p.Matrix()
	if m[0][1] != quantity.RatInt(-3) { // L row, ρ column
		t.Errorf("Matrix = %v", m)
	}
	s, err := p.PiSet("ρ", "V", "D")
	if err != nil {
		t.Fatal(err)
	}
	re := s.Groups()[1]
	if e, err := re.Exponent("μ"); err != nil || e != quantity.RatInt(1) {
		t.Errorf("Exponent(μ) = %v, %v", e, err)
	}
	if exps := re.Exponents(); len(exps) != 5 || exps[1] != quantity.RatInt(-1) {
		t.Errorf("Exponents = %v", exps)
	}
	if m := re.Matches[0]; m.Power != quantity.RatInt(-1) || m.Forms[0].Factors[0].Exp != quantity.RatInt(1) || !m.Coef.IsOne() {
		t.Errorf("match %+v", m)
	}
	cd := s.Groups()[0].Matches[0]
	if cd.Proxy == nil || cd.Proxy.Exp != quantity.RatInt(-2) || cd.Proxy.Ref.Exp != quantity.RatInt(-1) {
		t.Errorf("proxy %+v", cd.Proxy)
	}
	g, err := p.NewGroup("Re", quantity.Product{{Name: "ρ", Exp: quantity.RatInt(1)}, {Name: "V", Exp: quantity.RatInt(1)}, {Name: "D", Exp: quantity.RatInt(1)}, {Name: "μ", Exp: quantity.RatInt(-1)}})
	if err != nil {
		t.Fatal(err)
	}
	pw, ok, err := s.Express(g.Exponents())
	if err != nil || !ok || pw[1] != quantity.RatInt(-1) {
		t.Errorf("Express = %v, %v, %v", pw, ok, err)
	}
	// Π₁·Π₂ = F·μ/(ρ²V³D³); its exponent of μ is 1.
	r, err := s.Rewrite(0, []quantity.Rat{quantity.RatInt(1), quantity.RatInt(1)})
	if e, _ := r.Groups()[0].Exponent("μ"); err != nil || e != quantity.RatInt(1) {
		t.Errorf("Rewrite: %v, %v", e, err)
	}

	sol, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	pr, err := sol.DerivedRatio(quantity.Power)
	if err != nil || pr.Law.Exponent("L") != quantity.MustRat(7, 2) || pr.Law.Terms[0].Exp != quantity.MustRat(7, 2) {
		t.Errorf("λ_P = %v, %v", pr, err)
	}
}
