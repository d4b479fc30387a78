package formula_test

import (
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// FuzzCompile checks that parsing and compiling never panic, that their
// work is bounded, and that a compiled program evaluates a row without
// panicking.
func FuzzCompile(f *testing.F) {
	for _, s := range []string{swameeJain, "Nu = 0.023 * Re^0.8 * Pr^0.4", "if(Re < 2000, 64/Re, 0.316/Re^0.25)", "p + V", "(((", "2 {m/s^2} * D", "20{°C} - 1 {K}", "9.80665 [m/s^2]", "2 {furlong}", "x = 2 {m}; x + D",
		"x = 1; y = x^(1/3); y", "# only a comment", "a ** -2", "hypot(D, D) / D", "\xff"} {
		f.Add(s)
	}
	ins := []formula.Input{{Name: "Re", Dim: quantity.Dimensionless}, {Name: "Pr", Dim: quantity.Dimensionless},
		{Name: "D", Dim: quantity.Length}, {Name: "p", Dim: quantity.Pressure}, {Name: "V", Dim: quantity.Velocity}, {Name: "a", Dim: quantity.Dimensionless}}
	f.Fuzz(func(t *testing.T, src string) {
		p, err := formula.Compile(src, ins...)
		if err != nil {
			return
		}
		out := make([]float64, len(p.Outputs()))
		if _, err := p.Evaluator().Row([]float64{1e5, 7, 0.1, 2e5, 3, 0.5}, out); err != nil {
			t.Fatalf("%q: %v", src, err)
		}
		_ = math.IsNaN(out[0])
	})
}
