package similarity_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
)

// shipProblem is ship resistance R(V, L, g, ρ, μ).
func shipProblem() *pigroups.Problem {
	return pigroups.MustProblem(
		pigroups.Dep("R", q.Force).WithKind("force"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"))
}

// TestRemedyStatesNamedGroup: whatever orientation a group was held in,
// the remedy states the ratio of the group it names. By hand, for a 1:16
// model in the same water and gravity (common practice):
//   - holding Re: λ_V = 1/λ_L = 16, so Fr_m/Fr_p = λ_V/λ_L^(1/2) =
//     λ_L^(-3/2) = 64 and Fr² goes as λ_L⁻³ = 4096;
//   - holding Fr: λ_V = λ_L^(1/2), so Re_m/Re_p = λ_V·λ_L = λ_L^(3/2) =
//     1/64.
func TestRemedyStatesNamedGroup(t *testing.T) {
	p := shipProblem()
	h := q.MustRat(1, 2)
	frForms := []map[string]q.Rat{
		{"V": q.RatInt(2), "g": q.RatInt(-1), "L": q.RatInt(-1)}, // Fr²
		{"V": q.RatInt(-2), "g": q.RatInt(1), "L": q.RatInt(1)},  // L·g/V² = 1/Fr²
		{"V": q.RatInt(1), "g": h.Neg(), "L": h.Neg()},           // Fr
	}
	reForms := []map[string]q.Rat{
		{"rho": q.RatInt(1), "V": q.RatInt(1), "L": q.RatInt(1), "mu": q.RatInt(-1)},   // Re
		{"rho": q.RatInt(-1), "V": q.RatInt(-1), "L": q.RatInt(-1), "mu": q.RatInt(1)}, // 1/Re
	}
	for k := range frForms {
		fr, err := p.NewGroup("Πa", frForms[k])
		if err != nil {
			t.Fatal(err)
		}
		re, err := p.NewGroup("Πb", reForms[k%2])
		if err != nil {
			t.Fatal(err)
		}
		rep := fr.String() + ", " + re.String()
		_, err = similarity.NewPlan(p).Hold(fr).Hold(re).SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/16).Solve()
		var ce *similarity.ConflictError
		if !errors.As(err, &ce) {
			t.Fatalf("no conflict: %v", err)
		}
		got := map[string]similarity.GroupRatio{}
		for _, r := range ce.Remedies {
			if strings.Contains(r.String(), "[") {
				t.Errorf("Go slice syntax in %q", r)
			}
			if r.Group != nil {
				got[r.Group.Symbol] = *r.Group
			}
		}
		frR, reR := got["Fr"], got["Re"]
		if frR.Ratio.Law.Exponent("L") != q.MustRat(-3, 2) || math.Abs(frR.Ratio.Value-64) > 1e-9 ||
			frR.Whole != "Fr²" || frR.WholeRatio.Law.Exponent("L") != q.RatInt(-3) || math.Abs(frR.WholeRatio.Value-4096) > 1e-6 {
			t.Errorf("repeating %v (held %s): Fr remedy %+v", rep, fr, frR)
		}
		if reR.Ratio.Law.Exponent("L") != q.MustRat(3, 2) || math.Abs(reR.Ratio.Value-1.0/64) > 1e-12 || reR.Whole != "" {
			t.Errorf("repeating %v (held %s): Re remedy %+v", rep, re, reR)
		}
	}
}

// TestForeignGroupRefused: a group of another problem is refused by name,
// never evaluated with positional exponents.
func TestForeignGroupRefused(t *testing.T) {
	p := shipProblem()
	other := pigroups.MustProblem(pigroups.Var("a", q.Length), pigroups.Var("b", q.Length), pigroups.Var("c", q.Velocity), pigroups.Var("d", q.Time))
	og, _ := other.PiSet("a", "c")
	g := og.Groups()[0]
	s, err := similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		SameGravity("g").SameFluid("rho", "mu").Fix("L", 0.1).Solve()
	if err != nil {
		t.Fatal(err)
	}
	if _, err := s.GroupRatio(g); !errors.Is(err, similarity.ErrForeignGroup) {
		t.Errorf("GroupRatio of a foreign group: %v", err)
	}
	if _, err := s.GroupRatio(pigroups.Group{}); !errors.Is(err, similarity.ErrForeignGroup) {
		t.Errorf("GroupRatio of the zero group: %v", err)
	}
	if _, err := s.NamedRatio(g); !errors.Is(err, similarity.ErrForeignGroup) {
		t.Errorf("NamedRatio of a foreign group: %v", err)
	}
	_, err = similarity.NewPlan(p).Hold(g).Solve()
	var pe *similarity.PlanError
	if !errors.Is(err, similarity.ErrForeignGroup) || !errors.As(err, &pe) || pe.Symbol != g.Name {
		t.Errorf("Hold of a foreign group: %v", err)
	}
	if _, err := s.Ratio("nu"); !errors.Is(err, similarity.ErrUnknownVariable) || !strings.Contains(err.Error(), `"nu"`) {
		t.Errorf("Ratio of an unknown symbol: %v", err)
	}
	if _, err := similarity.NewPlan(p).Fix("Lpp", 0.1).Solve(); !errors.Is(err, similarity.ErrUnknownVariable) {
		t.Errorf("Fix of an unknown symbol: %v", err)
	}
	if _, err := p.Kinds(17); !errors.Is(err, pigroups.ErrUnknownVariable) {
		t.Errorf("Kinds(17): %v", err)
	}
	if _, err := g.Exponent("zz"); !errors.Is(err, pigroups.ErrUnknownVariable) {
		t.Errorf("Exponent(zz): %v", err)
	}
	ok, _ := s.NamedRatio(mustGroup(t, p, "V", "g", "L"))
	if diff := cmp.Diff("Fr", ok.Symbol); diff != "" || !ok.Ratio.Law.IsOne() {
		t.Errorf("held Fr: %+v", ok)
	}
}

func mustGroup(t *testing.T, p *pigroups.Problem, v, g, l string) pigroups.Group {
	t.Helper()
	gr, err := p.NewGroup("Fr²", map[string]q.Rat{v: q.RatInt(2), g: q.RatInt(-1), l: q.RatInt(-1)})
	if err != nil {
		t.Fatal(err)
	}
	return gr
}

func TestReportRefusesForeignGroup(t *testing.T) {
	p := shipProblem()
	other := pigroups.MustProblem(pigroups.Var("a", q.Length), pigroups.Var("b", q.Length))
	og, _ := other.PiSet("a")
	s, err := similarity.Froude(similarity.Scales{Length: 0.1, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	_ = p
	if _, err := similarity.NewReport(s, similarity.ReportOptions{Groups: og.Groups()}); !errors.Is(err, similarity.ErrForeignGroup) {
		t.Errorf("NewReport with a foreign group: %v", err)
	}
}
