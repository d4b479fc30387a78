package similarity_test

import (
	"errors"
	"go/ast"
	"go/parser"
	"go/token"
	"math"
	"slices"
	"strings"
	"testing"
	"unicode"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/similarity"
	"similis.dev/similis/similarity/fluids"
)

func lawExp(t *testing.T, r similarity.Ratio, sym string) q.Rat {
	t.Helper()
	return r.Law.Exponent(sym)
}

// TestFroudeLaws checks Froude scaling with the same fluid against its
// closed form (common practice): λ_V = λ_t = λ_L^(1/2), λ_F = λ_L³,
// λ_P = λ_L^(7/2), λ_Q = λ_L^(5/2), λ_p = λ_L.
func TestFroudeLaws(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		name string
		d    q.Dim
		exp  q.Rat
	}{
		{"velocity", q.Velocity, q.MustRat(1, 2)},
		{"time", q.Time, q.MustRat(1, 2)},
		{"force", q.Force, q.RatInt(3)},
		{"power", q.Power, q.MustRat(7, 2)},
		{"discharge", q.VolumeFlowRate, q.MustRat(5, 2)},
		{"pressure", q.Pressure, q.RatInt(1)},
		{"frequency", q.Frequency, q.MustRat(-1, 2)},
	}
	for _, c := range cases {
		r, err := s.DerivedRatio(c.d)
		if err != nil {
			t.Fatal(err)
		}
		if got := lawExp(t, r, "L"); got != c.exp || len(r.Law.Terms) != 1 {
			t.Errorf("%s: law %s, want λ_L^(%s)", c.name, r.Law, c.exp)
		}
		if want := math.Pow(1.0/25, c.exp.Float()); math.Abs(r.Value/want-1) > 1e-12 {
			t.Errorf("%s: %v, want %v", c.name, r.Value, want)
		}
	}
	if r, _ := s.Ratio("V"); r.Law.String() != "λ_L^(1/2)" {
		t.Errorf("λ_V printed %q", r.Law)
	}
}

// TestReynoldsMachLaws checks the closed forms λ_V = λ_ν/λ_L (Reynolds)
// and λ_V = λ_a (Mach); common practice.
func TestReynoldsMachLaws(t *testing.T) {
	s, err := similarity.Reynolds(similarity.Scales{Length: 0.1, KinematicViscosity: 1, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	r, _ := s.Ratio("V")
	if r.Law.Exponent("L") != q.RatInt(-1) || r.Law.Exponent("nu") != q.RatInt(1) || math.Abs(r.Value-10) > 1e-12 {
		t.Errorf("Reynolds λ_V = %s", r)
	}
	m, err := similarity.Mach(similarity.Scales{Length: 0.05, SpeedOfSound: 0.9, Density: 3})
	if err != nil {
		t.Fatal(err)
	}
	r, _ = m.Ratio("V")
	if r.Law.String() != "λ_a" || math.Abs(r.Value-0.9) > 1e-12 {
		t.Errorf("Mach λ_V = %s", r)
	}
	// Force in the Mach model: λ_ρ·λ_V²·λ_L².
	f, _ := m.DerivedRatio(q.Force)
	if want := 3 * 0.81 * 0.0025; math.Abs(f.Value/want-1) > 1e-12 {
		t.Errorf("Mach λ_F = %s, want %v", f, want)
	}
	w, _ := similarity.Weber(similarity.Scales{Length: 0.5, Density: 1, SurfaceTension: 1})
	r, _ = w.Ratio("V")
	if math.Abs(r.Value-math.Sqrt(2)) > 1e-12 {
		t.Errorf("Weber λ_V = %s", r)
	}
	st, _ := similarity.Strouhal(similarity.Scales{Length: 0.1, Velocity: 2})
	r, _ = st.Ratio("f")
	if math.Abs(r.Value-20) > 1e-12 {
		t.Errorf("Strouhal λ_f = %s", r)
	}
	e, _ := similarity.Euler(similarity.Scales{Length: 0.2, Density: 1, Velocity: 0.5})
	r, _ = e.Ratio("p")
	if math.Abs(r.Value-0.25) > 1e-12 {
		t.Errorf("Euler λ_p = %s", r)
	}
}

func froudeReynoldsPlan(t *testing.T) *similarity.Plan {
	p := pigroups.MustProblem(
		pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length), pigroups.Var("g", q.Acceleration),
		pigroups.Var("rho", q.Density), pigroups.Var("mu", q.DynamicViscosity))
	return similarity.NewPlan(p).
		HoldExps("the Froude number", map[string]int{"V": 2, "g": -1, "L": -1}).
		HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/25)
}

// TestFroudeReynoldsConflict: holding both with the same fluid and gravity
// forces λ_L = 1; dropping the same fluid needs ν_m/ν_p = λ_L^(3/2)
// (common practice).
func TestFroudeReynoldsConflict(t *testing.T) {
	_, err := froudeReynoldsPlan(t).Solve()
	ce := similarity.ConflictOf(err)
	if ce == nil || !errors.Is(err, similarity.ErrConflict) {
		t.Fatalf("Solve: %v", err)
	}
	wantSummary := "holding the Froude number and the Reynolds number with the same fluid and the same gravity forces λ_L to 1, against a length scale of 1:25"
	if ce.Summary != wantSummary {
		t.Errorf("summary:\n got %s\nwant %s", ce.Summary, wantSummary)
	}
	if len(ce.Constraints) != 5 {
		t.Errorf("minimal set %v", ce.Constraints)
	}
	var fluid *similarity.Remedy
	for i := range ce.Remedies {
		if ce.Remedies[i].Drop == "the same fluid" {
			fluid = &ce.Remedies[i]
		}
	}
	if fluid == nil || !strings.Contains(strings.Join(fluid.Needs, "; "), "ν_m/ν_p = λ_L^(3/2)") {
		t.Errorf("same-fluid remedy: %+v", fluid)
	}
	if !strings.Contains(err.Error(), "without the same gravity: λ_g = λ_L⁻³ = 15625") {
		t.Errorf("error text: %v", err)
	}
}

func TestCompromise(t *testing.T) {
	p := pigroups.MustProblem(
		pigroups.Dep("F", q.Force).WithKind("force"), pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length"),
		pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
		pigroups.VarKind("rho", q.Density, "density"), pigroups.VarKind("mu", q.DynamicViscosity, "dynamic viscosity"))
	set, err := p.PiSet("V", "L", "rho")
	if err != nil {
		t.Fatal(err)
	}
	var fr, re pigroups.Group
	for _, g := range set.Groups() {
		switch g.Label() {
		case "Fr²", "1/Fr²":
			fr = g
		case "1/Re", "Re":
			re = g
		}
	}
	pl := similarity.NewPlan(p).SameFluid("rho", "mu").SameGravity("g").Fix("L", 1.0/16)
	// An invented operating point: 7.7 m/s, 32 m, sea water of about 15 °C.
	proto := map[string]q.Quantity{"V": q.New(7.7, q.Velocity), "L": q.New(32, q.Length), "g": q.New(9.80665, q.Acceleration),
		"rho": q.New(1025, q.Density), "mu": q.New(1.22e-3, q.DynamicViscosity)}
	c, err := pl.Compromise(proto, similarity.Priority{Group: fr}, similarity.Priority{Group: re, MinModel: 5e6})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Held) != 1 || len(c.Floating) != 1 {
		t.Fatalf("compromise: %v", c)
	}
	f := c.Floating[0]
	// Re ratio λ_V·λ_L = λ_L^(3/2) (Froude, same fluid), reported in the
	// conventional orientation Re = ρVL/μ although the set holds 1/Re.
	wantRatio := math.Pow(16, -1.5)
	if math.Abs(f.Ratio.Value/wantRatio-1) > 1e-12 || !strings.HasPrefix(f.Label, "Re ") {
		t.Errorf("Re ratio %v (%s), want %v", f.Ratio.Value, f.Label, wantRatio)
	}
	reProto := 1025 * 7.7 * 32 / 1.22e-3
	if math.Abs(f.Prototype/reProto-1) > 1e-12 || f.Meets {
		t.Errorf("prototype Re = %v, want %v; meets %v", f.Prototype, reProto, f.Meets)
	}
	v, _ := c.Solution.Ratio("V")
	if math.Abs(v.Value-0.25) > 1e-12 {
		t.Errorf("λ_V = %v", v)
	}
	r, err := similarity.NewReport(c.Solution, similarity.ReportOptions{Title: "Catamaran 1:16", Prototype: proto,
		Units: map[string]string{"V": "kn"}, Groups: set.Groups(), Compromise: c})
	if err != nil {
		t.Fatal(err)
	}
	text, md := r.Text(), r.Markdown()
	for _, want := range []string{"Catamaran 1:16", "held", "floating, ratio", "14.968 kn", "3.7419 kn", "CAUTION: Model-test predictions"} {
		if !strings.Contains(text, want) {
			t.Errorf("text report lacks %q:\n%s", want, text)
		}
	}
	if !strings.Contains(md, "| variable | prototype | model | ratio model/prototype |") || !strings.Contains(md, "> **Caution.**") {
		t.Errorf("markdown report:\n%s", md)
	}
}

func TestTransfer(t *testing.T) {
	s, _ := similarity.Froude(similarity.Scales{Length: 1.0 / 30, Density: 1})
	m := q.NewSeries([]float64{0.1, 0.2, 0.3}, q.VolumeFlowRate)
	var p q.Series
	if err := s.SeriesToPrototype(&p, m); err != nil {
		t.Fatal(err)
	}
	want := math.Pow(30, 2.5)
	for i := range 3 {
		if math.Abs(p.At(i).Value()/(m.At(i).Value()*want)-1) > 1e-12 {
			t.Errorf("Q[%d] = %v", i, p.At(i))
		}
	}
	back, _ := s.ToModel(p.At(1))
	if math.Abs(back.Value()/0.2-1) > 1e-12 {
		t.Errorf("round trip: %v", back)
	}
	// An underdetermined plan lists its free ratios and refuses numbers.
	pp := pigroups.MustProblem(pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length), pigroups.Var("g", q.Acceleration))
	u, err := similarity.NewPlan(pp).HoldExps("Fr", map[string]int{"V": 2, "g": -1, "L": -1}).SameGravity("g").Basis("V", "L").Solve()
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff([]string{"L"}, u.Free()); diff != "" {
		t.Errorf("free ratios (-want +got):\n%s", diff)
	}
	if _, err := u.ToPrototype(q.New(1, q.Velocity)); !errors.Is(err, similarity.ErrUnknownRatio) {
		t.Errorf("transfer with a free ratio: %v", err)
	}
	w, err := u.With(map[string]float64{"L": 0.01})
	if err != nil {
		t.Fatal(err)
	}
	if v, _ := w.ToPrototype(q.New(1, q.Velocity)); math.Abs(v.Value()-10) > 1e-12 {
		t.Errorf("with λ_L = 0.01: %v", v)
	}
}

func TestPlanErrors(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length))
	for _, pl := range []*similarity.Plan{
		similarity.NewPlan(p).Fix("x", 1),
		similarity.NewPlan(p).Fix("L", -1),
		similarity.NewPlan(p).HoldExps("bad", map[string]int{"V": 1}),
		similarity.NewPlan(p).Same("s", "nope"),
		similarity.NewPlan(p).Hold(pigroups.Group{}),
	} {
		if _, err := pl.Solve(); err == nil {
			t.Error("a plan built wrongly solved")
		}
	}
}

// TestFluidStatesAndSetPoints: a Reynolds plan from actual water states
// (a model in 40 °C water, the prototype in 10 °C water) and model set
// points in chosen units.
func TestFluidStatesAndSetPoints(t *testing.T) {
	warm, _ := fluids.FreshWater().AtCelsius(40)
	cold, _ := fluids.FreshWater().AtCelsius(10)
	p := pigroups.MustProblem(pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length),
		pigroups.Var("rho", q.Density), pigroups.Var("mu", q.DynamicViscosity))
	s, err := similarity.NewPlan(p).HoldExps("the Reynolds number", map[string]int{"rho": 1, "V": 1, "L": 1, "mu": -1}).
		Fix("L", 0.2).FixFluids(warm, cold, "rho", "mu", "").Basis("V", "L", "rho").Solve()
	if err != nil {
		t.Fatal(err)
	}
	sp, err := s.SetPoints(map[string]q.Quantity{"V": q.New(1.5, q.Velocity), "L": q.New(2, q.Length)}, map[string]string{"V": "m/s", "L": "mm"})
	if err != nil {
		t.Fatal(err)
	}
	// By hand: V_m = V_p·(ν_m/ν_p)/λ_L.
	want := 1.5 * (warm.KinematicViscosity.Value() / cold.KinematicViscosity.Value()) / 0.2
	if math.Abs(sp["V"].Number/want-1) > 1e-12 || math.Abs(sp["L"].Number-400) > 1e-9 || sp["L"].Unit.String() != "mm" {
		t.Errorf("set points %v, want V = %v m/s", sp, want)
	}
	if _, err := s.SetPoints(map[string]q.Quantity{"V": q.New(1.5, q.Length)}, nil); err == nil {
		t.Error("a set point with the wrong dimension was accepted")
	}
}

// TestRulesDocumentVariables checks that each rule of similitude names, in
// its doc comment, every variable its Solution has, that Ratio reads each
// of them, and that Ratio of a name that is not a variable returns the
// zero Ratio beside an error matching quantity.ErrUnknown.
func TestRulesDocumentVariables(t *testing.T) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "rules.go", nil, parser.ParseComments)
	if err != nil {
		t.Fatal(err)
	}
	docs := map[string]string{}
	for _, d := range f.Decls {
		if fd, ok := d.(*ast.FuncDecl); ok && fd.Recv == nil && fd.Doc != nil {
			docs[fd.Name.Name] = fd.Doc.Text()
		}
	}
	cases := []struct {
		rule  string
		solve func(similarity.Scales) (*similarity.Solution, error)
		sc    similarity.Scales
		vars  []string
	}{
		{"Froude", similarity.Froude, similarity.Scales{Length: 0.04, Density: 1}, []string{"V", "L", "g", "rho", "mu"}},
		{"Reynolds", similarity.Reynolds, similarity.Scales{Length: 0.04, Density: 1, KinematicViscosity: 1}, []string{"V", "L", "rho", "nu"}},
		{"Mach", similarity.Mach, similarity.Scales{Length: 0.04, Density: 1, SpeedOfSound: 1}, []string{"V", "a", "L", "rho"}},
		{"Weber", similarity.Weber, similarity.Scales{Length: 0.04, Density: 1, SurfaceTension: 1}, []string{"V", "L", "rho", "sigma"}},
		{"Euler", similarity.Euler, similarity.Scales{Length: 0.04, Density: 1, Velocity: 0.2}, []string{"p", "V", "L", "rho"}},
		{"Strouhal", similarity.Strouhal, similarity.Scales{Length: 0.04, Velocity: 0.2}, []string{"f", "V", "L"}},
	}
	for _, c := range cases {
		t.Run(c.rule, func(t *testing.T) {
			doc := strings.Join(strings.Fields(docs[c.rule]), " ")
			s, err := c.solve(c.sc)
			if err != nil {
				t.Fatal(err)
			}
			for _, v := range c.vars {
				_, list, _ := strings.Cut(doc, "variables")
				words := strings.FieldsFunc(list, func(r rune) bool { return !unicode.IsLetter(r) && !unicode.IsDigit(r) && r != '_' })
				if !slices.Contains(words, v) {
					t.Errorf("the doc comment of %s does not name the variable %s: %q", c.rule, v, doc)
				}
				if r, err := s.Ratio(v); err != nil || r.Value <= 0 {
					t.Errorf("%s: Ratio(%q) = %v, %v", c.rule, v, r, err)
				}
			}
			r, err := s.Ratio("nope")
			if !errors.Is(err, q.ErrUnknown) {
				t.Errorf("%s: Ratio(\"nope\") error %v, want one matching ErrUnknown", c.rule, err)
			}
			if !cmp.Equal(r, similarity.Ratio{}) {
				t.Errorf("%s: Ratio(\"nope\") = %+v beside its error, want the zero Ratio", c.rule, r)
			}
		})
	}
}

// TestRatioOutOfRangeIsZero checks that a ratio whose value overflows is
// returned as the zero Ratio beside its error, never as a value to use.
func TestRatioOutOfRangeIsZero(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1e-300, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	for _, get := range []func() (similarity.Ratio, error){
		func() (similarity.Ratio, error) { return s.Ratio("L") },
		func() (similarity.Ratio, error) { return s.DerivedRatio(q.Power) },
	} {
		r, err := get()
		if err == nil {
			continue
		}
		if !errors.Is(err, q.ErrRange) || !cmp.Equal(r, similarity.Ratio{}) {
			t.Errorf("got %+v, %v; want the zero Ratio and an ErrRange error", r, err)
		}
	}
	if _, err := s.DerivedRatio(q.Power); err == nil {
		t.Errorf("λ_P = λ_L^(7/2) for λ_L = 1e-300 did not overflow")
	}
}

// TestLawIsProduct: a law's terms are the module's one product of powers,
// quantity.Product, named by the free ratios' symbols: λ_P = λ_L^(7/2)
// for Froude scaling with the same fluid, and it reads back through
// Product's own formatting.
func TestLawIsProduct(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 1.0 / 25, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	pr, err := s.DerivedRatio(q.Power)
	if err != nil {
		t.Fatal(err)
	}
	want := q.Product{{Name: "L", Exp: q.MustRat(7, 2)}}
	if diff := cmp.Diff(want, pr.Law.Terms, cmpopts.EquateComparable(q.Rat{})); diff != "" {
		t.Errorf("λ_P terms (-want +got):\n%s", diff)
	}
	if got := pr.Law.Terms.Format(q.Unicode, q.Inline, ""); got != "L^(7/2)" {
		t.Errorf("λ_P terms formatted %q, want L^(7/2)", got)
	}
}

// TestPlanErrorShape: a *PlanError carries the operation, the input, its
// class and its cause; Is compares the class and Unwrap returns the
// cause, kept as an error (a foreign group's *pigroups.Error is
// reachable with errors.As, not turned into text).
func TestPlanErrorShape(t *testing.T) {
	s, err := similarity.Froude(similarity.Scales{Length: 0.04, Density: 1})
	if err != nil {
		t.Fatal(err)
	}
	_, err = s.Ratio("nope")
	var pe *similarity.PlanError
	if !errors.As(err, &pe) || pe.Symbol != "nope" || pe.Op != "ratio" || pe.Class != q.ErrUnknown ||
		errors.Unwrap(err) != similarity.ErrUnknownVariable || !errors.Is(err, pigroups.ErrUnknownVariable) {
		t.Errorf("Ratio(\"nope\"): %#v", pe)
	}
	other := pigroups.MustProblem(pigroups.Var("a", q.Length), pigroups.Var("b", q.Length))
	set, err := other.PiSet("a")
	if err != nil {
		t.Fatal(err)
	}
	_, err = s.GroupRatio(set.Groups()[0])
	var prob *pigroups.Error
	if !errors.As(err, &pe) || pe.Op != "GroupRatio" || !errors.As(err, &prob) || !errors.Is(err, similarity.ErrForeignGroup) || !errors.Is(err, q.ErrInvalid) {
		t.Errorf("GroupRatio of a foreign group: %v", err)
	}
}

// TestZeroRatioString checks that the zero Ratio returned beside an
// error prints as no ratio, not as the ratio one (its Value is 0), and
// that a true ratio of one still prints "1".
func TestZeroRatioString(t *testing.T) {
	s, err := similarity.Reynolds(similarity.Scales{Length: 0.1, Density: 1, KinematicViscosity: 1})
	if err != nil {
		t.Fatal(err)
	}
	r, err := s.Ratio("p") // the Reynolds rule has no pressure variable
	if err == nil {
		t.Fatalf("Ratio(\"p\") = %v with no error", r)
	}
	for _, tc := range []struct {
		r    similarity.Ratio
		want string
	}{
		{r, "(no ratio)"},
		{similarity.Ratio{}, "(no ratio)"},
		{similarity.Ratio{Value: 1}, "1"},
	} {
		if got := tc.r.String(); got != tc.want {
			t.Errorf("%+v.String() = %q, want %q", tc.r, got, tc.want)
		}
	}
	if v, _ := s.Ratio("V"); v.String() != v.Law.String()+" = 10" {
		t.Errorf("λ_V = %q, want its law = 10 (V_m/V_p = λ_ν/λ_L = 1/0.1)", v.String())
	}
}
