package quantity_test

import (
	"testing"

	"github.com/google/go-cmp/cmp"

	q "similis.dev/similis/quantity"
)

// TestProductFormat: the one formatter, in every style and layout.
func TestProductFormat(t *testing.T) {
	p := q.Product{{Name: "μ", Exp: q.RatInt(1)}, {Name: "ρ", Exp: q.RatInt(-1)}, {Name: "V_x", Exp: q.RatInt(-2)}, {Name: "D", Exp: q.MustRat(-1, 2)}, {Name: "z", Exp: q.RatInt(0)}}
	got := []string{
		p.Format(q.Unicode, q.Inline, ""),
		p.Format(q.ASCII, q.Inline, " "),
		p.Format(q.Unicode, q.Fraction, ""),
		p.Format(q.ASCII, q.Fraction, ""),
		p.Format(q.LaTeX, q.Fraction, ""),
		p.Format(q.LaTeX, q.Solidus, ""),
		p.Format(q.Markdown, q.Fraction, ""),
		q.Product{}.Format(q.Unicode, q.Fraction, ""),
		q.Product{{Name: "s", Exp: q.RatInt(-1)}}.Format(q.ASCII, q.Fraction, ""),
		p.Format(q.Style(42), q.Inline, ""),
	}
	want := []string{
		"μ·ρ⁻¹·V_x⁻²·D^(-1/2)",
		"μ ρ^-1 V_x^-2 D^(-1/2)",
		"μ/(ρ·V_x²·D^(1/2))",
		"μ/(ρ*V_x^2*D^(1/2))",
		`\frac{μ}{ρ\cdot V_x^{2}\cdot D^{1/2}}`,
		`μ/(ρ\cdot V_x^{2}\cdot D^{1/2})`,
		`μ/(ρ·V\_x²·D^(1/2))`,
		"1",
		"1/s",
		"μ·ρ⁻¹·V_x⁻²·D^(-1/2)",
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("(-want +got):\n%s", diff)
	}
	if s := q.MustDim(-1, 1, -2, 0, 0, 0, 0); s.String() != "L⁻¹ M T⁻²" || s.SIUnit() != "kg·m⁻¹·s⁻²" || s.ASCII() != "L^-1 M T^-2" {
		t.Errorf("Dim spellings %q %q %q", s.String(), s.SIUnit(), s.ASCII())
	}
}
