package similarity_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
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
	frForms := []q.Product{
		{{Name: "V", Exp: q.RatInt(2)}, {Name: "g", Exp: q.RatInt(-1)}, {Name: "L", Exp: q.RatInt(-1)}}, // Fr²
		{{Name: "V", Exp: q.RatInt(-2)}, {Name: "g", Exp: q.RatInt(1)}, {Name: "L", Exp: q.RatInt(1)}},  // L·g/V² = 1/Fr²
		{{Name: "V", Exp: q.RatInt(1)}, {Name: "g", Exp: h.Neg()}, {Name: "L", Exp: h.Neg()}},           // Fr
	}
	reForms := []q.Product{
		{{Name: "rho", Exp: q.RatInt(1)}, {Name: "V", Exp: q.RatInt(1)}, {Name: "L", Exp: q.RatInt(1)}, {Name: "mu", Exp: q.RatInt(-1)}},   // Re
		{{Name: "rho", Exp: q.RatInt(-1)}, {Name: "V", Exp: q.RatInt(-1)}, {Name: "L", Exp: q.RatInt(-1)}, {Name: "mu", Exp: q.RatInt(1)}}, // 1/Re
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
		ce := similarity.ConflictOf(err)
		if ce == nil {
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
	gr, err := p.NewGroup("Fr²", q.Product{{Name: v, Exp: q.RatInt(2)}, {Name: g, Exp: q.RatInt(-1)}, {Name: l, Exp: q.RatInt(-1)}})
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

// conflictShip is the classic conflict: Fr and Re held for a 1:16 model in
// the same water and gravity (common practice).
func conflictShip(t *testing.T) (*pigroups.Problem, *similarity.Conflict) {
	t.Helper()
	p := shipProblem()
	_, err := similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/16).Solve()
	ce := similarity.ConflictOf(err)
	if ce == nil {
		t.Fatalf("no conflict: %v", err)
	}
	return p, ce
}

// seaProto is an invented prototype operating point in sea water of about
// 15 °C.
var seaProto = map[string]q.Quantity{"V": q.New(7.7, q.Velocity), "L": q.New(32, q.Length), "g": q.New(9.80665, q.Acceleration),
	"rho": q.New(1025, q.Density), "mu": q.New(1.22e-3, q.DynamicViscosity)}

// TestReportConflictWithoutSolution: after a conflict there is no
// solution, and NewReport(nil, {Conflict}) lays out the conflict, each
// remedy, what the remedies ask of the model fluid, and the caution;
// without a conflict either it is an error, never a panic.
func TestReportConflictWithoutSolution(t *testing.T) {
	_, ce := conflictShip(t)
	r, err := similarity.NewReport(nil, similarity.ReportOptions{Title: "Hull 1:16", Conflict: ce, Prototype: seaProto})
	if err != nil {
		t.Fatal(err)
	}
	text := r.Text()
	want := []string{"Hull 1:16", "note: conflict: " + ce.Summary, "CAUTION: Model-test predictions"}
	for _, rem := range ce.Remedies {
		want = append(want, "without "+rem.Drop+": "+strings.Join(rem.Needs, "; "))
	}
	// By hand: without the same fluid, ν_m/ν_p = λ_L^(3/2) = 1/64, and
	// the sea water's ν_p = 1.22e-3/1025 = 1.190e-6 m²/s, so the model
	// fluid would need 1.190e-6/64 = 1.86e-8 m²/s.
	want = append(want, "kinematic viscosity of 1.86e-08 m²/s", "below every practical test liquid")
	for _, w := range want {
		if !strings.Contains(text, w) {
			t.Errorf("conflict report lacks %q:\n%s", w, text)
		}
	}
	if strings.Contains(text, "with a prototype in water") {
		t.Errorf("the report assumes a prototype in water though the prototype's fluid is given:\n%s", text)
	}
	if strings.Contains(text, "Variables") {
		t.Errorf("a conflict report without a solution prints a variables table:\n%s", text)
	}
	if _, err := similarity.NewReport(nil, similarity.ReportOptions{}); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("NewReport(nil, {}) = %v, want an ErrInvalid error", err)
	}
}

// TestRemedyFacilityNotes: a remedy nothing can meet says so — a changed
// gravity always; with the prototype fluid known (FixFluids), a model
// liquid denser than any, and the kinematic viscosity the model fluid
// would need beside water's (1.0e-6 m²/s at 20 °C).
func TestRemedyFacilityNotes(t *testing.T) {
	_, ce := conflictShip(t)
	var gravity *similarity.Remedy
	for i := range ce.Remedies {
		if ce.Remedies[i].Drop == "the same gravity" {
			gravity = &ce.Remedies[i]
		}
	}
	if gravity == nil || !strings.Contains(gravity.String(), "no tank, flume or tunnel changes gravity") {
		t.Errorf("the same-gravity remedy does not say gravity cannot change: %v", gravity)
	}

	// The prototype fluid unknown, ratios fixed at 1: dropping the density
	// ratio needs λ_ρ = λ_L^(-3/2) = 64 (by hand, 1:16), which no liquid
	// gives a prototype in water (mercury/water ≈ 13 546/998.2 = 13.6).
	_, err := similarity.NewPlan(shipProblem()).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		Fix("rho", 1).Fix("mu", 1).SameGravity("g").Fix("L", 1.0/16).Solve()
	if ce = similarity.ConflictOf(err); ce == nil {
		t.Fatalf("no conflict: %v", err)
	}
	found := false
	for _, r := range ce.Remedies {
		if strings.HasPrefix(r.Drop, "a density ratio") {
			found = strings.Contains(r.String(), "64 times the prototype's density: with a prototype in water no liquid meets it (mercury, the densest at room temperature, is about 13.6 times as dense as water)")
		}
	}
	if !found {
		t.Errorf("the density remedy does not say no liquid meets it: %v", ce)
	}

	p := shipProblem()
	sea, err := fluids.SeaWater().AtCelsius(15)
	if err != nil {
		t.Fatal(err)
	}
	tank, err := fluids.FreshWater().AtCelsius(15)
	if err != nil {
		t.Fatal(err)
	}
	_, err = similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		FixFluids(tank, sea, "rho", "mu", "").SameGravity("g").Fix("L", 1.0/16).Solve()
	if ce = similarity.ConflictOf(err); ce == nil {
		t.Fatalf("no conflict: %v", err)
	}
	nuSea := sea.DynamicViscosity.Value() / sea.Density.Value()
	notes := map[string]string{}
	for _, r := range ce.Remedies {
		notes[r.Drop] = strings.Join(r.Notes, "; ")
	}
	// By hand: dropping the density ratio, Fr and Re with λ_μ fixed need
	// λ_ρ = λ_μ·λ_L^(-3/2) = λ_μ·64, about 60 (ρ_m ≈ 61 000 kg/m³); and
	// ν_m/ν_p = λ_L^(3/2) = 1/64 either way.
	var rhoNote, all string
	for k, v := range notes {
		if strings.HasPrefix(k, "a density ratio") {
			rhoNote = v
		}
		all += v + "\n"
	}
	if !strings.Contains(rhoNote, "no liquid is that dense") {
		t.Errorf("the density remedy does not say no liquid meets it: %q", rhoNote)
	}
	wantNu := fmt.Sprintf("kinematic viscosity of %.2e m²/s", nuSea/64)
	for k, v := range notes {
		if strings.HasPrefix(k, "a dynamic viscosity ratio") && (!strings.Contains(v, wantNu) || !strings.Contains(v, "below every practical test liquid")) {
			t.Errorf("the viscosity remedy: %q, want %q and below every practical test liquid", v, wantNu)
		}
		if (strings.HasPrefix(k, "the Froude") || strings.HasPrefix(k, "a length")) && v != "" {
			t.Errorf("the remedy without %s changes no fluid but notes %q", k, v)
		}
	}
	// Fresh water at 20 °C and 101.325 kPa: ν = 1.0034e-6 m²/s (IAPWS-95
	// density, IAPWS 2008 viscosity, computed with Debian's
	// python3-iapws); printed as 1.00e-06.
	// Dry air at 20 °C and 101.325 kPa: ν ≈ 1.516e-5 m²/s (handbook
	// value, from memory); printed as 1.51e-05 or 1.52e-05.
	if !strings.Contains(all, "air at 20 °C and 101.325 kPa 1.51e-05 m²/s") && !strings.Contains(all, "air at 20 °C and 101.325 kPa 1.52e-05 m²/s") {
		t.Errorf("no comparison with air at 20 °C: %q", all)
	}
	if !strings.Contains(all, "water at 20 °C has 1.00e-06 m²/s") {
		t.Errorf("no comparison with water at 20 °C: %q", notes)
	}
}

// TestReportNoRatioWhileGroupFloats: the measured variable's ratio is
// printed only when every other group is held. With Re floating in a
// Froude-scaled test, R gets no ratio and no model value, and the report
// names Re; with Fr and Re both held (the model fluid's viscosity free to
// follow), R's ratio λ_L³ (λ_ρ = 1, common practice) is printed.
func TestReportNoRatioWhileGroupFloats(t *testing.T) {
	p := shipProblem()
	set, err := p.PiSet("V", "L", "rho")
	if err != nil {
		t.Fatal(err)
	}
	proto := map[string]q.Quantity{"R": q.New(5e5, q.Force)}
	for k, v := range seaProto {
		proto[k] = v
	}
	froude, err := similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/16).Basis("V", "L", "rho").Solve()
	if err != nil {
		t.Fatal(err)
	}
	fl := froude.FloatingGroups()
	if len(fl) != 1 || fl[0].Symbol != "Re" {
		t.Fatalf("floating groups %v, want Re", fl)
	}
	r, err := similarity.NewReport(froude, similarity.ReportOptions{Prototype: proto, Groups: set.Groups()})
	if err != nil {
		t.Fatal(err)
	}
	text := r.Text()
	row := lineWith(text, "R ")
	if !strings.Contains(row, "none while Re floats") || strings.Contains(row, "λ") || strings.Count(row, " N") > 1 {
		t.Errorf("R's row while Re floats: %q\n%s", row, text)
	}
	if !strings.Contains(text, "not equal on both sides while Re floats") {
		t.Errorf("the measured group's status does not name Re:\n%s", text)
	}
	// By hand: the same sea water on both sides, ν = 1.22e-3/1025 =
	// 1.190e-6 m²/s; Re's ratio is λ_L^(3/2) = 1/64, so holding it needs
	// ν_m = 1.190e-6/64 = 1.86e-8 m²/s, below any practical test liquid.
	if !strings.Contains(text, "to hold Re as well at this scale and speed, the model fluid would need a kinematic viscosity of 1.86e-08 m²/s (it has 1.19e-06 m²/s") ||
		!strings.Contains(text, "below every practical test liquid") {
		t.Errorf("the report does not say which model viscosity would hold Re:\n%s", text)
	}

	both, err := similarity.NewPlan(p).HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		Same("the same density", "rho").SameGravity("g").Fix("L", 1.0/16).Basis("V", "L", "rho").Solve()
	if err != nil {
		t.Fatal(err)
	}
	if fl := both.FloatingGroups(); len(fl) != 0 {
		t.Errorf("floating groups %v with Fr and Re held", fl)
	}
	r, err = similarity.NewReport(both, similarity.ReportOptions{Prototype: proto, Groups: set.Groups()})
	if err != nil {
		t.Fatal(err)
	}
	// λ_R = λ_ρ·λ_V²·λ_L² = λ_L³ = 1/4096: 5e5 N → 122.07 N.
	if row := lineWith(r.Text(), "R "); !strings.Contains(row, "λ_L³ = 0.000244141") || !strings.Contains(row, "122.07 N") {
		t.Errorf("R's row with every group held: %q\n%s", row, r.Text())
	}
}

// lineWith returns the first line of text starting with prefix.
func lineWith(text, prefix string) string {
	for _, l := range strings.Split(text, "\n") {
		if strings.HasPrefix(l, prefix) {
			return l
		}
	}
	return ""
}

// TestNoPanicOnBadArguments: a nil destination Series and an exponent a
// Rat cannot hold are errors, not panics.
func TestNoPanicOnBadArguments(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	m := q.NewSeries([]float64{1, 2}, q.Force)
	if err := s.SeriesToPrototype(nil, m); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("SeriesToPrototype(nil, …) = %v", err)
	}
	if err := s.SeriesToModel(nil, m); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("SeriesToModel(nil, …) = %v", err)
	}
	for _, e := range []int{math.MinInt64, math.MaxInt64, -1 << 40} {
		_, err := similarity.NewPlan(shipProblem()).HoldExps("x", map[string]int{"V": e, "L": 1}).Solve()
		if err == nil {
			t.Errorf("HoldExps with exponent %d: no error", e)
		}
	}
	if _, err := similarity.NewPlan(nil).HoldExps("x", nil).Hold(pigroups.Group{}).Fix("L", 1).Solve(); !errors.Is(err, q.ErrInvalid) {
		t.Errorf("a plan of a nil problem: %v, want an ErrInvalid error", err)
	}
	_, err = similarity.NewPlan(shipProblem()).HoldExps("x", map[string]int{"V": math.MinInt64}).Solve()
	if !errors.Is(err, q.ErrRange) {
		t.Errorf("HoldExps with exponent MinInt64: %v, want an ErrRange error", err)
	}
}
