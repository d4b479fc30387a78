package pigroups_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

var (
	dimHead  = q.SpecificEnergy // g·H
	dimOmega = q.AngularVelocity
)

func labels(s *pigroups.Set) []string {
	var out []string
	for _, g := range s.Groups() {
		out = append(out, g.Format(q.ASCII)+" = "+g.Label())
	}
	return out
}

// Textbook cases, common practice; the count n − r is Buckingham's
// theorem (E. Buckingham, Phys. Rev. 4, 345, 1914).
func TestTextbookCases(t *testing.T) {
	cases := []struct {
		name      string
		vars      []pigroups.Variable
		repeating []string
		rank      int
		want      []string
	}{
		{
			name: "drag on a sphere",
			vars: []pigroups.Variable{
				pigroups.Dep("F", q.Force).WithKind("force"), pigroups.Var("rho", q.Density),
				pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity),
			},
			repeating: []string{"rho", "V", "D"},
			rank:      3,
			// D² stands in for the reference area A of C_D = F/(½ρV²A).
			want: []string{"F/(rho*V^2*D^2) = ∝C_D", "mu/(rho*V*D) = 1/Re"},
		},
		{
			name: "pipe pressure drop with roughness and length",
			vars: []pigroups.Variable{
				pigroups.Dep("dp", q.Pressure).WithKind("pressure difference"), pigroups.Var("rho", q.Density),
				pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity),
				pigroups.Var("eps", q.Length), pigroups.Var("L", q.Length),
			},
			repeating: []string{"rho", "V", "D"},
			rank:      3,
			want:      []string{"dp/(rho*V^2) = Eu", "mu/(rho*V*D) = 1/Re", "eps/D = Π₃", "L/D = Π₄"},
		},
		{
			name: "pump performance",
			vars: []pigroups.Variable{
				pigroups.Dep("gH", dimHead), pigroups.VarKind("Q", q.VolumeFlowRate, "volume flow rate"),
				pigroups.VarKind("N", dimOmega, "rotational speed"), pigroups.Var("D", q.Length),
				pigroups.Var("rho", q.Density), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("P", q.Power),
			},
			repeating: []string{"N", "D", "rho"},
			rank:      3,
			want:      []string{"gH/(N^2*D^2) = ψ/(4π²)", "Q/(N*D^3) = φ/(2π)", "mu/(N*D^2*rho) = 1/(2π·Re_n)", "P/(N^3*D^5*rho) = C_P/(8π³)"},
			// The turbomachine coefficients take n in rev/s (common practice);
			// N holds rad/s, n = N/(2π): ψ = gH/(n²D²) = 4π²·gH/(N²D²), and so on.
		},
		{
			name: "forced convection, four base dimensions",
			vars: []pigroups.Variable{
				pigroups.Dep("h", q.HeatTransferCoefficient), pigroups.Var("k", q.ThermalConductivity),
				pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length), pigroups.Var("rho", q.Density),
				pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("cp", q.SpecificHeatCapacity),
			},
			repeating: []string{"k", "L", "rho", "mu"},
			rank:      4,
			want:      []string{"h*L/k = Nu", "V*L*rho/mu = Re", "mu*cp/k = Pr"},
		},
		{
			name: "natural convection",
			vars: []pigroups.Variable{
				pigroups.Dep("h", q.HeatTransferCoefficient), pigroups.Var("L", q.Length), pigroups.Var("k", q.ThermalConductivity),
				pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("rho", q.Density), pigroups.Var("cp", q.SpecificHeatCapacity),
				pigroups.VarKind("gbdT", q.Acceleration, "buoyancy"),
			},
			repeating: []string{"L", "k", "mu", "rho"},
			rank:      4,
			want:      []string{"h*L/k = Nu", "mu*cp/k = Pr", "L^3*rho^2*gbdT/mu^2 = Gr"},
		},
		{
			name: "capillary rise, rank deficient",
			vars: []pigroups.Variable{
				pigroups.Dep("h", q.Length), pigroups.Var("sigma", q.SurfaceTension),
				pigroups.Var("rhog", q.SpecificWeight), pigroups.Var("d", q.Length),
			},
			repeating: []string{"sigma", "d"},
			rank:      2,
			want:      []string{"h/d = Π₁", "rhog*d^2/sigma = Bo"},
		},
		{
			name: "rotating disk torque, with angular speed",
			vars: []pigroups.Variable{
				pigroups.Dep("T", q.Torque).WithKind("torque"), pigroups.VarKind("omega", dimOmega, "rotational speed"),
				pigroups.Var("D", q.Length), pigroups.Var("rho", q.Density), pigroups.Var("mu", q.DynamicViscosity),
			},
			repeating: []string{"omega", "D", "rho"},
			rank:      3,
			want:      []string{"T/(omega^2*D^5*rho) = K_Q/(4π²)", "mu/(omega*D^2*rho) = 1/(2π·Re_n)"},
		},
	}
	for _, c := range cases {
		p, err := pigroups.NewProblem(c.vars...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if p.Rank() != c.rank || p.NumGroups() != len(c.vars)-c.rank {
			t.Errorf("%s: rank %d, %d groups; want rank %d", c.name, p.Rank(), p.NumGroups(), c.rank)
		}
		s, err := p.PiSet(c.repeating...)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if diff := cmp.Diff(c.want, labels(s)); diff != "" {
			t.Errorf("%s (-want +got):\n%s", c.name, diff)
		}
		for _, g := range s.Groups() {
			if d, err := g.Dim(); err != nil || !d.IsDimensionless() {
				t.Errorf("%s: %s has dimension %v, %v", c.name, g, d, err)
			}
		}
	}
}

func TestRankNote(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("h", q.Length), pigroups.Var("σ", q.SurfaceTension),
		pigroups.Var("ρg", q.SpecificWeight), pigroups.Var("d", q.Length))
	note := p.RankNote()
	for _, want := range []string{"the rank is 2, less than the 3 base dimensions", "L and M T⁻²", "2 groups"} {
		if !strings.Contains(note, want) {
			t.Errorf("RankNote lacks %q:\n%s", want, note)
		}
	}
	full := pigroups.MustProblem(pigroups.Var("V", q.Velocity), pigroups.Var("L", q.Length), pigroups.Var("t", q.Time))
	if full.RankNote() != "" {
		t.Errorf("full-rank note: %q", full.RankNote())
	}
}

func TestRepeatingErrors(t *testing.T) {
	p := pigroups.MustProblem(
		pigroups.Dep("T", q.Torque), pigroups.Var("ω", dimOmega), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("ρ", q.Density), pigroups.Var("μ", q.DynamicViscosity),
	)
	cases := []struct {
		set  []string
		err  error
		text string
	}{
		{[]string{"ρ", "V"}, pigroups.ErrRepeatingCount, "2 given, the rank of the dimensional matrix is 3"},
		{[]string{"ρ", "V", "D", "μ"}, pigroups.ErrRepeatingCount, "4 given"},
		{[]string{"T", "V", "D"}, pigroups.ErrRepeatingDep, `"T"`},
		{[]string{"ρ", "V", "x"}, pigroups.ErrRepeatingUnknown, `"x"`},
		{[]string{"ω", "V", "D"}, pigroups.ErrRepeatingSingular, "they form the dimensionless group ω*D/V"},
		{[]string{"ω", "V", "D"}, pigroups.ErrRepeatingSingular, "no repeating variable carries M"},
		{[]string{"ρ", "ρ", "V"}, pigroups.ErrRepeatingCount, "given twice"},
	}
	for _, c := range cases {
		err := p.CheckRepeating(c.set...)
		var re *pigroups.Error
		if !errors.As(err, &re) || !errors.Is(err, c.err) || !strings.Contains(err.Error(), c.text) {
			t.Errorf("CheckRepeating(%v) = %v\nwant %v containing %q", c.set, err, c.err, c.text)
		}
	}
	if err := p.CheckRepeating("ρ", "V", "D"); err != nil {
		t.Error(err)
	}
}

func TestProblemErrors(t *testing.T) {
	cases := []struct {
		vars []pigroups.Variable
		err  error
	}{
		{nil, pigroups.ErrNoVariables},
		{[]pigroups.Variable{pigroups.Var("x", q.Length), pigroups.Var("x", q.Time)}, pigroups.ErrDuplicateSymbol},
		{[]pigroups.Variable{pigroups.Dep("a", q.Length), pigroups.Dep("b", q.Time)}, pigroups.ErrTwoDependent},
		{[]pigroups.Variable{pigroups.VarKind("a", q.Length, "flux capacitance")}, pigroups.ErrUnknownKind},
		{[]pigroups.Variable{pigroups.VarKind("a", q.Length, "density")}, pigroups.ErrKindDimension},
		{[]pigroups.Variable{pigroups.Var("a b", q.Length)}, pigroups.ErrBadSymbol},
		{[]pigroups.Variable{pigroups.Var("", q.Length)}, pigroups.ErrBadSymbol},
		{[]pigroups.Variable{pigroups.Var("a\x00", q.Length)}, pigroups.ErrBadSymbol},
		{[]pigroups.Variable{pigroups.Var("\xff", q.Length)}, pigroups.ErrBadSymbol},
		{manyVars(65), pigroups.ErrTooManyVariables},
	}
	for _, c := range cases {
		if _, err := pigroups.NewProblem(c.vars...); !errors.Is(err, c.err) {
			t.Errorf("NewProblem(%v) = %v, want %v", c.vars, err, c.err)
		}
	}
	v, err := pigroups.VarUnit("Δp", "lbf/ft^2")
	if err != nil || v.Dim != q.Pressure {
		t.Errorf("VarUnit = %v, %v", v, err)
	}
	if _, err := pigroups.VarUnit("x", "furlong"); err == nil {
		t.Error("VarUnit accepted an unknown unit")
	}
}

func TestDefaultAndEnumeration(t *testing.T) {
	p := pigroups.MustProblem(
		pigroups.Dep("dp", q.Pressure), pigroups.Var("mu", q.DynamicViscosity), pigroups.Var("D", q.Length),
		pigroups.Var("V", q.Velocity), pigroups.Var("rho", q.Density), pigroups.Var("eps", q.Length),
	)
	def, err := p.DefaultRepeating()
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff([]string{"D", "V", "rho"}, def); diff != "" {
		t.Errorf("default repeating (-want +got):\n%s", diff)
	}
	sets, _ := p.RepeatingSets()
	// Counted by hand: of the C(5,3) = 10 triples of mu, D, V, rho, eps,
	// the three holding both lengths D and eps are dependent; the other
	// seven span L, M and T (even {mu, V, rho}, whose determinant is 1).
	if len(sets) != 7 {
		t.Errorf("%d valid repeating sets: %v", len(sets), sets)
	}
	for _, s := range sets {
		if err := p.CheckRepeating(s...); err != nil {
			t.Errorf("enumerated set %v is refused: %v", s, err)
		}
	}
}

func TestRecognitionPowersAndCandidates(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("V", q.Velocity), pigroups.Var("g", q.Acceleration), pigroups.Var("L", q.Length))
	s, err := p.PiSet("g", "L")
	if err != nil {
		t.Fatal(err)
	}
	g := s.Groups()[0]
	if g.Format(q.Unicode) != "V²/(g·L)" || g.Label() != "Fr²" {
		t.Errorf("Froude group: %s, %s", g.Format(q.Unicode), g.Label())
	}
	m := g.Matches[0]
	if !strings.Contains(m.Describe(), "taking g as gravitational acceleration") {
		t.Errorf("Describe: %s", m.Describe())
	}
	// Δp/(ρV²) without kinds: several candidates, listed.
	p2 := pigroups.MustProblem(pigroups.Dep("p", q.Pressure), pigroups.Var("rho", q.Density), pigroups.Var("V", q.Velocity))
	s2, _ := p2.PiSet("rho", "V")
	var names []string
	for _, m := range s2.Groups()[0].Matches {
		names = append(names, m.Symbol)
	}
	if diff := cmp.Diff([]string{"Eu", "σ", "C_p", "K"}, names); diff != "" {
		t.Errorf("candidates for p/(ρV²) (-want +got):\n%s", diff)
	}
	if got := pigroups.InferKinds(q.KinematicViscosity); len(got) != 3 {
		t.Errorf("InferKinds(L² T⁻¹) = %v, want three candidates", got)
	}
	if got := pigroups.InferKinds(q.Density); len(got) != 1 || got[0] != "density" {
		t.Errorf("InferKinds(density) = %v", got)
	}
	// Pe = Re·Pr reported with its relation.
	p3 := pigroups.MustProblem(pigroups.Dep("V", q.Velocity), pigroups.VarKind("L", q.Length, "length"), pigroups.VarKind("alpha", q.ThermalDiffusivity, "thermal diffusivity"))
	s3, _ := p3.PiSet("L", "alpha")
	if d := s3.Groups()[0].Matches[0].Describe(); !strings.Contains(d, "Péclet number = Re·Pr") {
		t.Errorf("Péclet: %s", d)
	}
}

func TestConventionalAndRewrite(t *testing.T) {
	p := pigroups.MustProblem(
		pigroups.Dep("F", q.Force).WithKind("force"), pigroups.Var("rho", q.Density),
		pigroups.Var("V", q.Velocity), pigroups.Var("D", q.Length), pigroups.Var("mu", q.DynamicViscosity),
	)
	s, _ := p.PiSet("rho", "V", "D")
	conv := s.WithConventional()
	if got := conv.Groups()[1].Format(q.ASCII); got != "rho*V*D/mu" {
		t.Errorf("conventional Re = %s", got)
	}
	// Replace Π₁ by Π₁·Π₂⁻¹ (= F/(μVD)); the set stays equivalent.
	r, err := s.Rewrite(0, []q.Rat{q.RatInt(1), q.RatInt(-1)})
	if err != nil {
		t.Fatal(err)
	}
	if got := r.Groups()[0].Format(q.ASCII); got != "F/(V*D*mu)" {
		t.Errorf("rewritten Π₁ = %s", got)
	}
	eq, err := pigroups.Equivalent(s, r)
	if err != nil || !eq {
		t.Errorf("rewritten set not equivalent: %v", err)
	}
	pw, ok, err := s.Express(r.Groups()[0].Exponents())
	if err != nil || !ok || pw[0] != q.RatInt(1) || pw[1] != q.RatInt(-1) {
		t.Errorf("Express = %v, %v, %v", pw, ok, err)
	}
	if _, err := s.Rewrite(0, []q.Rat{q.RatInt(0), q.RatInt(1)}); err == nil {
		t.Error("a rewrite dropping the group itself was accepted")
	}
	other, _ := p.PiSet("mu", "V", "D")
	if eq, _ := pigroups.Equivalent(s, other); !eq {
		t.Error("sets from two valid repeating sets are not equivalent")
	}
}

func TestRendering(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("Δp", q.Pressure), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
		pigroups.Var("D", q.Length), pigroups.Var("μ", q.DynamicViscosity))
	s, _ := p.PiSet("ρ", "V", "D")
	g := s.Groups()
	got := []string{g[0].Format(q.ASCII), g[0].Format(q.Unicode), g[0].Format(q.LaTeX), g[1].Format(q.LaTeX)}
	want := []string{"Δp/(ρ*V^2)", "Δp/(ρ·V²)", `\frac{\Delta p}{\rho\cdot V^{2}}`, `\frac{\mu}{\rho\cdot V\cdot D}`}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("rendering (-want +got):\n%s", diff)
	}
	table := p.MatrixTable()
	wantTable := "    Δp   ρ   V  D   μ\n" +
		" L  -1  -3   1  1  -1\n" +
		" M   1   1   0  0   1\n" +
		" T  -2   0  -1  0  -1\n" +
		"rank 3, 5 variables, 2 groups\n"
	if table != wantTable {
		t.Errorf("matrix table:\n%s\nwant:\n%s", table, wantTable)
	}
}

func manyVars(n int) []pigroups.Variable {
	out := make([]pigroups.Variable, n)
	for i := range out {
		out[i] = pigroups.Var(fmt.Sprintf("x%d", i), q.Length)
	}
	return out
}
