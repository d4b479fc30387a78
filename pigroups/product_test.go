package pigroups_test

import (
	"errors"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"similis.dev/similis/pigroups"
	q "similis.dev/similis/quantity"
)

// TestGroupProduct: a group is one quantity.Product of its variables'
// symbols. Written by quantity.Product.Format it spells exactly as the
// group's String and Format (after the numerical factor of a
// coefficient: "2*" + F/(rho*V^2*A)), in every style; a match's label
// with no factor is the one-factor product of its symbol to its power
// ("1/Re", "Fr²"); and the product reads back through NewGroup to the
// same group. Package quantity has no parser of product text (ParseDim
// reads products of base dimensions only), so the round trip is through
// NewGroup and, for each exponent, quantity's text of a Rat.
func TestGroupProduct(t *testing.T) {
	problems := []struct {
		vars []pigroups.Variable
		rep  []string
	}{
		{[]pigroups.Variable{pigroups.Dep("Δp", q.Pressure), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
			pigroups.Var("D", q.Length), pigroups.Var("μ", q.DynamicViscosity), pigroups.Var("ε", q.Length)}, []string{"ρ", "V", "D"}},
		{[]pigroups.Variable{pigroups.Dep("F", q.Force).WithKind("force"), pigroups.Var("ρ", q.Density), pigroups.Var("V", q.Velocity),
			pigroups.VarKind("A", q.Area, "area"), pigroups.Var("μ", q.DynamicViscosity)}, []string{"ρ", "V", "A"}},
		{[]pigroups.Variable{pigroups.Dep("R", q.Force), pigroups.Var("V", q.Velocity), pigroups.Var("g", q.Acceleration),
			pigroups.Var("L", q.Length), pigroups.Var("rho", q.Density)}, []string{"V", "L", "rho"}},
		{twelveVars(), []string{"rho", "n", "D"}},
	}
	tex := func(p q.Product) q.Product {
		out := make(q.Product, len(p))
		for i, f := range p {
			out[i] = q.Factor{Name: pigroups.TeXSymbol(f.Name), Exp: f.Exp}
		}
		return out
	}
	checked, labelled := 0, 0
	for _, c := range problems {
		p := pigroups.MustProblem(c.vars...)
		s, err := p.PiSet(c.rep...)
		if err != nil {
			t.Fatal(err)
		}
		var groups []pigroups.Group
		groups = append(groups, s.Groups()...)
		groups = append(groups, s.WithCoefficients().Groups()...)
		groups = append(groups, s.WithConventional().Groups()...)
		for _, g := range groups {
			prod := g.Product()
			for _, st := range []q.Style{q.ASCII, q.Unicode, q.Markdown, q.LaTeX} {
				pr := prod
				if st == q.LaTeX {
					pr = tex(prod)
				}
				want, got := pr.Format(st, q.Fraction, ""), g.Format(st)
				if g.Factor() != 1 {
					// The factor comes first, then the product: 2·F/(ρ·V²·A).
					if !strings.HasSuffix(got, want) || len(got) == len(want) {
						t.Errorf("%s in %v: %q does not end in its product %q", g.Name, st, got, want)
					}
					continue
				}
				if got != want {
					t.Errorf("%s in %v: Format %q, its product %q", g.Name, st, got, want)
				}
			}
			if g.Factor() == 1 && g.String() != prod.Format(q.ASCII, q.Fraction, "") {
				t.Errorf("%s: String %q, product %q", g.Name, g.String(), prod.Format(q.ASCII, q.Fraction, ""))
			}
			for _, f := range prod {
				e, err := g.Exponent(f.Name)
				if err != nil || e != f.Exp || f.Exp.IsZero() {
					t.Errorf("%s: factor %v, exponent %v, %v", g.Name, f, e, err)
				}
				if r, err := q.ParseRat(f.Exp.String()); err != nil || r != f.Exp {
					t.Errorf("%s: exponent %v reads back as %v, %v", g.Name, f.Exp, r, err)
				}
			}
			back, err := p.NewGroup(g.Name, prod)
			if err != nil {
				t.Fatalf("%s: NewGroup of its product: %v", g.Name, err)
			}
			if diff := cmp.Diff(g.Exponents(), back.Exponents(), cmpopts.EquateComparable(q.Rat{})); diff != "" {
				t.Errorf("%s: NewGroup of its product (-group +read back):\n%s", g.Name, diff)
			}
			if g.Factor() == 1 && (back.String() != g.String() || back.Label() != g.Label()) {
				t.Errorf("%s: read back as %s (%s), was %s (%s)", g.Name, back, back.Label(), g, g.Label())
			}
			checked++
			if len(g.Matches) == 0 {
				continue
			}
			if m := g.Matches[0]; m.Exact() && m.FactorText() == "" && m.Power.IsInt() {
				if want := (q.Product{{Name: m.Symbol, Exp: m.Power}}).Format(q.Unicode, q.Fraction, ""); g.Label() != want {
					t.Errorf("%s: label %q, the product of its name %q", g.Name, g.Label(), want)
				}
				labelled++
			}
		}
	}
	if checked < 20 || labelled < 4 {
		t.Errorf("%d groups and %d labels checked: too few for the test to mean anything", checked, labelled)
	}
}

// TestNewGroupProduct: NewGroup reads a product as a product — a symbol
// given twice has its exponents added, the order of the factors does not
// matter — and refuses a factor that is not a variable or a product that
// has a dimension.
func TestNewGroupProduct(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Var("V", q.Velocity), pigroups.Var("g", q.Acceleration), pigroups.Var("L", q.Length))
	fr2, err := p.NewGroup("Fr²", q.Product{{Name: "L", Exp: q.RatInt(-1)}, {Name: "V", Exp: q.RatInt(1)}, {Name: "g", Exp: q.RatInt(-1)}, {Name: "V", Exp: q.RatInt(1)}})
	if err != nil {
		t.Fatal(err)
	}
	if fr2.String() != "V^2/(g*L)" || fr2.Label() != "Fr²" {
		t.Errorf("NewGroup: %s (%s), want V^2/(g*L) (Fr²)", fr2, fr2.Label())
	}
	if _, err := p.NewGroup("x", q.Product{{Name: "W", Exp: q.RatInt(1)}}); !errors.Is(err, pigroups.ErrUnknownVariable) {
		t.Errorf("unknown symbol: %v", err)
	}
	if _, err := p.NewGroup("x", q.Product{{Name: "V", Exp: q.RatInt(1)}}); !errors.Is(err, pigroups.ErrNotDimensionless) {
		t.Errorf("dimensional product: %v", err)
	}
	var zero pigroups.Group
	if zero.Product() != nil {
		t.Errorf("the zero Group's product: %v", zero.Product())
	}
}

// TestFactorSpelling: a coefficient's numerical factor is written in each
// style before its product. By hand, with ω in rad/s and n = ω/(2π) in
// rev/s: K_T = T/(ρ·n²·D⁴) = 4π²·T/(ρ·ω²·D⁴), and Re_n = ρ·n·D²/μ =
// (1/(2π))·ρ·ω·D²/μ.
func TestFactorSpelling(t *testing.T) {
	p := pigroups.MustProblem(pigroups.Dep("T", q.Force), pigroups.Var("ρ", q.Density), pigroups.Var("ω", q.AngularVelocity),
		pigroups.Var("D", q.Length), pigroups.Var("V", q.Velocity), pigroups.Var("μ", q.DynamicViscosity))
	s, err := p.PiSet("ρ", "ω", "D")
	if err != nil {
		t.Fatal(err)
	}
	var got []string
	for _, g := range s.WithCoefficients().Groups() {
		got = append(got, g.Label(), g.Format(q.Unicode), g.Format(q.ASCII), g.Format(q.LaTeX))
	}
	want := []string{
		"K_T", "4π²·T/(ρ·ω²·D⁴)", "4*pi^2*T/(ρ*ω^2*D^4)", `4\pi^{2} \frac{T}{\rho\cdot \omega^{2}\cdot D^{4}}`,
		"St", "ω·D/V", "ω*D/V", `\frac{\omega\cdot D}{V}`,
		"Re_n", "(1/(2π))·ρ·ω·D²/μ", "(1/(2*pi))*ρ*ω*D^2/μ", `(1/(2\pi)) \frac{\rho\cdot \omega\cdot D^{2}}{\mu}`,
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("coefficients (-want +got):\n%s", diff)
	}
}
