package pigroups_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// propellerProblem is an open-water test: thrust T, torque Q, advance
// speed V, rate of revolution n, diameter D, water density ρ.
func propellerProblem(t *testing.T) (*pigroups.Set, []q.Quantity) {
	t.Helper()
	p := pigroups.MustProblem(
		pigroups.Dep("T", q.Force).WithKind("force"),
		pigroups.VarKind("Q", q.Torque, "torque"),
		pigroups.VarKind("V", q.Velocity, "velocity"),
		pigroups.VarKind("n", q.AngularVelocity, "rotational speed"),
		pigroups.VarKind("D", q.Length, "length"),
		pigroups.VarKind("ρ", q.Density, "density"))
	s, err := p.PiSet("n", "D", "ρ")
	if err != nil {
		t.Fatal(err)
	}
	n, err := units.ParseQuantity("600 rpm") // held as 62.83 rad/s
	if err != nil {
		t.Fatal(err)
	}
	row := []q.Quantity{q.New(200, q.Force), q.New(8, q.Torque), q.New(2, q.Velocity), n, q.New(0.25, q.Length), q.New(1000, q.Density)}
	return s, row
}

// TestOpenWaterCoefficients checks K_T, K_Q and J against their
// definitions in ITTC Recommended Procedure 7.5-02-03-02.1 (open water
// test), n in revolutions per second, by a hand calculation: a 0.25 m
// propeller at 600 rpm (n = 10 rev/s) in water of 1000 kg/m³ with
// T = 200 N, Q = 8 N·m, V = 2 m/s:
//
//	K_T = 200/(1000·10²·0.25⁴) = 0.512
//	K_Q = 8/(1000·10²·0.25⁵) = 0.08192
//	J   = 2/(10·0.25) = 0.8
//	η₀  = J·K_T/(2π·K_Q) = T·V/(2π·n·Q) = 400/(160π) = 0.795775
func TestOpenWaterCoefficients(t *testing.T) {
	s, row := propellerProblem(t)
	var labels []string
	for _, g := range s.Groups() {
		labels = append(labels, g.Label())
	}
	// The Pi groups hold n's SI value in rad/s: each says what it is.
	// J = V/(n·D) = 2π·V/(ω·D), so V/(ω·D) = J/(2π).
	if diff := cmp.Diff([]string{"K_T/(4π²)", "K_Q/(4π²)", "J/(2π)"}, labels); diff != "" {
		t.Errorf("Pi-group labels (-want +got):\n%s", diff)
	}
	c := s.WithCoefficients()
	labels = labels[:0]
	for _, g := range c.Groups() {
		labels = append(labels, g.Label())
	}
	if diff := cmp.Diff([]string{"K_T", "K_Q", "J"}, labels); diff != "" {
		t.Errorf("coefficient labels (-want +got):\n%s", diff)
	}
	got, err := c.Evaluator().Row(row, make([]float64, 3))
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{0.512, 0.08192, 0.8}
	if diff := cmp.Diff(want, got, cmpopts.EquateApprox(1e-12, 0)); diff != "" {
		t.Errorf("K_T, K_Q, J (-want +got):\n%s", diff)
	}
	eta := got[2] * got[0] / (2 * math.Pi * got[1])
	if math.Abs(eta-400/(160*math.Pi)) > 1e-12 {
		t.Errorf("η₀ = %v, want 0.795775", eta)
	}
	// The raw Pi groups are the coefficients over their factors.
	raw, _ := s.Evaluator().Row(row, make([]float64, 3))
	if diff := cmp.Diff([]float64{0.512 / (4 * math.Pi * math.Pi), 0.08192 / (4 * math.Pi * math.Pi), 0.8 / (2 * math.Pi)}, raw, cmpopts.EquateApprox(1e-12, 0)); diff != "" {
		t.Errorf("raw groups (-want +got):\n%s", diff)
	}
	if f := c.Groups()[0].Format(q.Unicode); f != "4π²·T/(n²·D⁴·ρ)" {
		t.Errorf("K_T written %q", f)
	}
}

// TestOpenWaterWorkedExample: a published worked example (questions.
// collegedunia.com, marine screw propeller open-water efficiency) gives
// J = 0.6, K_T = 0.1336, 10·K_Q = 0.2010 and η₀ = J·K_T/(2π·K_Q) ≈ 0.6347.
// Raw readings built from those coefficients for a 0.2 m propeller at
// 720 rpm must give them back, and the efficiency.
func TestOpenWaterWorkedExample(t *testing.T) {
	s, _ := propellerProblem(t)
	const D, nRev, rho = 0.2, 12.0, 1000.0
	T := 0.1336 * rho * nRev * nRev * math.Pow(D, 4)
	Q := 0.02010 * rho * nRev * nRev * math.Pow(D, 5)
	V := 0.6 * nRev * D
	n, _ := units.ParseQuantity("720 rpm")
	row := []q.Quantity{q.New(T, q.Force), q.New(Q, q.Torque), q.New(V, q.Velocity), n, q.New(D, q.Length), q.New(rho, q.Density)}
	got, err := s.WithCoefficients().Evaluator().Row(row, make([]float64, 3))
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff([]float64{0.1336, 0.0201, 0.6}, got, cmpopts.EquateApprox(1e-12, 0)); diff != "" {
		t.Errorf("(-want +got):\n%s", diff)
	}
	if eta := got[2] * got[0] / (2 * math.Pi * got[1]); math.Abs(eta-0.6347) > 5e-5 {
		t.Errorf("η₀ = %.5f, want 0.6347", eta)
	}
}

// TestCoefficientFactor: C_D = F/(½ρV²A) (common practice), checked by
// hand for a sphere of 0.1 m diameter in air: F = 0.5 N, ρ = 1.2 kg/m³,
// V = 10 m/s, A = π·0.05² m² gives C_D = 0.5/(0.5·1.2·100·0.0078540)
// = 1.06103.
func TestCoefficientFactor(t *testing.T) {
	p := pigroups.MustProblem(
		pigroups.Dep("F", q.Force).WithKind("force"), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.VarKind("A", q.Area, "area"), pigroups.Var("μ", q.DynamicViscosity))
	s, err := p.PiSet("ρ", "V", "A")
	if err != nil {
		t.Fatal(err)
	}
	g := s.Groups()[0]
	if g.Label() != "C_D/2" {
		t.Errorf("label %q, want C_D/2", g.Label())
	}
	cd, err := g.Coefficient()
	if err != nil {
		t.Fatal(err)
	}
	if cd.Label() != "C_D" || cd.Format(q.Unicode) != "2·F/(ρ·V²·A)" {
		t.Errorf("coefficient %s = %s", cd.Label(), cd.Format(q.Unicode))
	}
	set := s.WithCoefficients()
	row := []q.Quantity{q.New(0.5, q.Force), q.New(1.2, q.Density), q.New(10, q.Velocity), q.New(math.Pi*0.05*0.05, q.Area), q.New(1.8e-5, q.DynamicViscosity)}
	got, err := set.Evaluator().Row(row, make([]float64, 2))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(got[0]-1.0610329539459689) > 1e-12 {
		t.Errorf("C_D = %v, want 1.06103", got[0])
	}

	// With a length where the definition has an area, the group is only
	// proportional to C_D, and says so.
	p2 := pigroups.MustProblem(
		pigroups.Dep("F", q.Force).WithKind("force"), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("L", q.Length), pigroups.Var("μ", q.DynamicViscosity))
	s2, _ := p2.PiSet("ρ", "V", "L")
	g2 := s2.Groups()[0]
	if g2.Label() != "∝C_D" || !strings.Contains(g2.Describe(), "C_D = 2·Π₁·L²/A") {
		t.Errorf("proportional group: %s, %s", g2.Label(), g2.Describe())
	}
	if _, err := g2.Coefficient(); !errors.Is(err, pigroups.ErrNotExact) {
		t.Errorf("Coefficient of a proportional group: %v", err)
	}
}

// TestCatalogueAdditions: groups the trade names that recognition must
// know, each with its convention.
func TestCatalogueAdditions(t *testing.T) {
	cases := []struct {
		name      string
		vars      []pigroups.Variable
		repeating []string
		want      []string // labels
	}{
		{"advance ratio", []pigroups.Variable{
			pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("n", q.AngularVelocity, "rotational speed"), pigroups.VarKind("D", q.Length, "length")},
			[]string{"n", "D"}, []string{"J/(2π)"}},
		{"fan pressure coefficient", []pigroups.Variable{
			pigroups.Dep("Δp", q.Pressure).WithKind("pressure difference"), pigroups.VarKind("ρ", q.Density, "density"),
			pigroups.VarKind("N", q.AngularVelocity, "rotational speed"), pigroups.VarKind("D", q.Length, "length")},
			[]string{"ρ", "N", "D"}, []string{"ψ_p/(4π²)"}},
		{"machine Reynolds number", []pigroups.Variable{
			pigroups.VarKind("μ", q.DynamicViscosity, "dynamic viscosity"), pigroups.VarKind("ρ", q.Density, "density"),
			pigroups.VarKind("N", q.AngularVelocity, "rotational speed"), pigroups.VarKind("D", q.Length, "length")},
			[]string{"ρ", "N", "D"}, []string{"1/(2π·Re_n)"}},
		{"Galilei number, not Grashof", []pigroups.Variable{
			pigroups.Var("g", q.Acceleration), pigroups.Var("ρ", q.Density), pigroups.Var("d", q.Length), pigroups.Var("μ", q.DynamicViscosity)},
			[]string{"ρ", "d", "μ"}, []string{"Ga"}},
		{"Ohnesorge number", []pigroups.Variable{
			pigroups.Var("μ", q.DynamicViscosity), pigroups.Var("ρ", q.Density), pigroups.VarKind("σ", q.SurfaceTension, "surface tension"), pigroups.Var("L", q.Length)},
			[]string{"ρ", "σ", "L"}, []string{"Oh²"}}, // μ²/(ρσL), whole exponents
		{"tip-speed ratio, rad/s", []pigroups.Variable{
			pigroups.VarKind("ω", q.AngularVelocity, "rotational speed"), pigroups.VarKind("R", q.Length, "length"), pigroups.VarKind("V", q.Velocity, "velocity")},
			[]string{"R", "V"}, []string{"2π/J", "λ_tip"}}, // ωR/V read with R as D: J = 2πV/(ωD)
	}
	for _, c := range cases {
		p, err := pigroups.NewProblem(c.vars...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		s, err := p.PiSet(c.repeating...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		var got []string
		for _, g := range s.Groups() {
			if len(c.want) > 1 {
				for _, m := range g.Matches {
					got = append(got, m.Label())
				}
			} else {
				got = append(got, g.Label())
			}
		}
		if diff := cmp.Diff(c.want, got); diff != "" {
			t.Errorf("%s (-want +got):\n%s", c.name, diff)
		}
	}
}

// TestMatchLabels: the label and equation of a match say what the group
// is, factor and power included.
func TestMatchLabels(t *testing.T) {
	cases := []struct {
		sym  string
		eqn  string
		vars []pigroups.Variable
		rep  []string
	}{
		{"K_T/(4π²)", "K_T = 4π²·Π₁", []pigroups.Variable{
			pigroups.Dep("T", q.Force).WithKind("force"), pigroups.VarKind("ρ", q.Density, "density"),
			pigroups.VarKind("n", q.AngularVelocity, "rotational speed"), pigroups.VarKind("D", q.Length, "length")}, []string{"ρ", "n", "D"}},
		{"Fr²", "Fr = Π₁^(1/2)", []pigroups.Variable{
			pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("g", q.Acceleration, "gravitational acceleration"),
			pigroups.VarKind("L", q.Length, "length")}, []string{"g", "L"}},
		{"1/Re", "Re = 1/Π₁", []pigroups.Variable{
			pigroups.VarKind("μ", q.DynamicViscosity, "dynamic viscosity"), pigroups.VarKind("ρ", q.Density, "density"),
			pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("L", q.Length, "length")}, []string{"ρ", "V", "L"}},
	}
	for _, c := range cases {
		s, err := pigroups.MustProblem(c.vars...).PiSet(c.rep...)
		if err != nil {
			t.Fatal(err)
		}
		g := s.Groups()[0]
		if g.Label() != c.sym || g.Matches[0].Equation(g.Name) != c.eqn {
			t.Errorf("%s: label %q, equation %q; want %q, %q", g, g.Label(), g.Matches[0].Equation(g.Name), c.sym, c.eqn)
		}
	}
}

// TestCoefficientSeries: Series evaluation applies the factors as Row
// does.
func TestCoefficientSeries(t *testing.T) {
	s, row := propellerProblem(t)
	c := s.WithCoefficients()
	cols := make([]q.Series, len(row))
	for i, x := range row {
		vals := make([]float64, 300)
		for k := range vals {
			vals[k] = x.Value() * (1 + float64(k)/1000)
		}
		cols[i] = q.NewSeries(vals, x.Dim())
	}
	dst := [][]float64{make([]float64, 300), make([]float64, 300), make([]float64, 300)}
	if err := c.Evaluator().Series(cols, dst); err != nil {
		t.Fatal(err)
	}
	ev := c.Evaluator()
	for k := range 300 {
		r := make([]q.Quantity, len(cols))
		for i := range cols {
			r[i] = q.New(cols[i].Values()[k], cols[i].Dim())
		}
		want, _ := ev.Row(r, make([]float64, 3))
		for g := range 3 {
			if math.Abs(dst[g][k]-want[g]) > 1e-12*math.Abs(want[g]) {
				t.Fatalf("row %d group %d: %v, want %v", k, g, dst[g][k], want[g])
			}
		}
	}
}

// TestTotalResistanceCoefficient: a hull's resistance over ρV²S is
// C_T/2, and its Coefficient is the towing tank's C_T = R/(½ρV²S)
// (ITTC). By hand for the quickstart's invented catamaran model: R =
// 30.9 N at 3.75 kn (1.929 167 m/s) in water of 999.1026 kg/m³ with S =
// 414.7/16² m²: C_T = 2·30.9/(999.1026·1.929167²·1.619922) = 0.0102599.
func TestTotalResistanceCoefficient(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("R", q.Force).WithKind("resistance"), pigroups.VarKind("ρ", q.Density, "density"),
		pigroups.VarKind("V", q.Velocity, "velocity"), pigroups.VarKind("S", q.Area, "wetted surface"))
	s, err := p.PiSet("ρ", "V", "S")
	if err != nil {
		t.Fatal(err)
	}
	if l := s.Groups()[0].Label(); l != "C_T/2" {
		t.Errorf("label %q", l)
	}
	v := 15 * 1852.0 / 3600 / 4
	row := []q.Quantity{q.New(30.9, q.Force), q.New(999.1026, q.Density), q.New(v, q.Velocity), q.New(414.7/256, q.Area)}
	got, err := s.WithCoefficients().Evaluator().Row(row, make([]float64, 1))
	want := 2 * 30.9 / (999.1026 * v * v * 414.7 / 256)
	if err != nil || math.Abs(got[0]-want) > 1e-15 || math.Abs(want-0.0102599) > 5e-8 {
		t.Errorf("C_T = %v, want %v (0.0102599), %v", got, want, err)
	}
}
