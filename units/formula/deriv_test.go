package formula_test

import (
	"errors"
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// TestGradientAnalytic: for Dittus–Boelter, Nu = 0.023·Re^0.8·Pr^0.4,
// ∂Nu/∂Re = 0.8·Nu/Re and ∂Nu/∂Pr = 0.4·Nu/Pr (by hand); for
// Darcy–Weisbach with a fixed f, Δp = f·L/D·ρV²/2, ∂Δp/∂V = 2Δp/V and
// ∂Δp/∂D = −Δp/D.
func TestGradientAnalytic(t *testing.T) {
	p, err := formula.Compile("Nu = 0.023 * Re^0.8 * Pr^0.4", in("Re", quantity.Dimensionless), in("Pr", quantity.Dimensionless))
	if err != nil {
		t.Fatal(err)
	}
	out, grad := make([]float64, 1), [][]float64{make([]float64, 2)}
	if err := p.Evaluator().Gradient([]float64{5e4, 7}, out, grad); err != nil {
		t.Fatal(err)
	}
	nu := out[0]
	if math.Abs(grad[0][0]-0.8*nu/5e4) > 1e-15*nu || math.Abs(grad[0][1]-0.4*nu/7) > 1e-13*nu {
		t.Errorf("∂Nu = %v, want %v, %v", grad[0], 0.8*nu/5e4, 0.4*nu/7)
	}
	q, err := formula.Compile("dp = 0.02 * L/D * rho*V^2/2", in("L", quantity.Length), in("D", quantity.Length), in("rho", quantity.Density), in("V", quantity.Velocity))
	if err != nil {
		t.Fatal(err)
	}
	out, grad = make([]float64, 1), [][]float64{make([]float64, 4)}
	if err := q.Evaluator().Gradient([]float64{40, 0.08, 998.2, 2.5}, out, grad); err != nil {
		t.Fatal(err)
	}
	dp := out[0]
	if math.Abs(grad[0][3]-2*dp/2.5) > 1e-12*dp || math.Abs(grad[0][1]+dp/0.08) > 1e-12*dp/0.08 {
		t.Errorf("∂Δp = %v (Δp %v)", grad[0], dp)
	}
}

// TestGradientAgainstDifferences: on random formulas the exact
// derivatives agree with central differences.
func TestGradientAgainstDifferences(t *testing.T) {
	ins := []formula.Input{in("x", quantity.Dimensionless), in("y", quantity.Length)}
	rapid.Check(t, func(t *rapid.T) {
		src := genExpr(t, 0)
		p, err := formula.Compile(src, ins...)
		if err != nil {
			t.Fatalf("%q: %v", src, err)
		}
		ev := p.Evaluator()
		x := []float64{rapid.Float64Range(0.5, 3).Draw(t, "x"), rapid.Float64Range(0.5, 3).Draw(t, "y")}
		out, grad := make([]float64, 1), [][]float64{make([]float64, 2)}
		if err := ev.Gradient(x, out, grad); errors.Is(err, quantity.ErrRange) {
			return // a value or a derivative that is not finite, refused
		} else if err != nil {
			t.Fatal(err)
		}
		if math.IsNaN(out[0]) || math.IsInf(out[0], 0) || math.Abs(out[0]) > 1e6 {
			return
		}
		for j := range x {
			h := 1e-6 * x[j]
			xp, xm := append([]float64(nil), x...), append([]float64(nil), x...)
			xp[j] += h
			xm[j] -= h
			fp, _ := ev.Row(xp, make([]float64, 1))
			fpv := fp[0]
			fm, _ := ev.Row(xm, make([]float64, 1))
			fd := (fpv - fm[0]) / (2 * h)
			// Skip points near a kink (abs, min, max, if) where the
			// difference straddles it.
			if math.Abs(fd-grad[0][j]) > 1e-4*(1+math.Abs(fd)) {
				xp[j] = x[j] + h/10
				xm[j] = x[j] - h/10
				a, _ := ev.Row(xp, make([]float64, 1))
				av := a[0]
				b, _ := ev.Row(xm, make([]float64, 1))
				fd2 := (av - b[0]) / (h / 5)
				// A point exactly on a kink: the one-sided differences
				// disagree, and the central one is their mean.
				fwd, bwd := (fpv-out[0])/h, (out[0]-fm[0])/h
				onKink := math.Abs(fwd-bwd) > 1e-4*(1+math.Abs(fwd))
				if !onKink && math.Abs(fd2-grad[0][j]) > 1e-4*(1+math.Abs(fd2)) && math.Abs(fd2-fd) < 1e-6*(1+math.Abs(fd)) {
					t.Fatalf("%q at %v: ∂/∂x%d = %v, central difference %v", src, x, j, grad[0][j], fd)
				}
			}
		}
	})
}
