package formula_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/formula"
)

// The same 4096 invented pipe rows as the quantity package's Kernel
// benchmark, and the same ΣΔp (Darcy–Weisbach with Swamee–Jain).
const kernelRows = 4096

func pipeColumns() [][]float64 {
	r := rand.New(rand.NewPCG(1, 2))
	u := func(lo, hi float64) float64 { return lo + (hi-lo)*r.Float64() }
	cols := make([][]float64, 6)
	for range kernelRows {
		for i, b := range [][2]float64{{700, 1200}, {0.5, 5}, {0.02, 0.5}, {0.4e-3, 2e-3}, {1e-6, 1e-4}, {1, 100}} {
			cols[i] = append(cols[i], u(b[0], b[1]))
		}
	}
	return cols
}

const swameeJain = `Re = rho*V*D/mu
f = 0.25 / log10(eps/D*(1/3.7) + 5.74/Re^0.9)^2
dp = f * (L/D) * rho*V^2*0.5`

var pipeInputs = []formula.Input{{Name: "rho", Dim: quantity.Density}, {Name: "V", Dim: quantity.Velocity}, {Name: "D", Dim: quantity.Length},
	{Name: "mu", Dim: quantity.DynamicViscosity}, {Name: "eps", Dim: quantity.Length}, {Name: "L", Dim: quantity.Length}}

var sink float64

// BenchmarkFormulaKernel compares the Swamee–Jain kernel written as
// formula text and evaluated over Series with the hand-written float64
// loop over the same columns.
func BenchmarkFormulaKernel(b *testing.B) {
	cols := pipeColumns()
	b.Run("float64", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			var sum float64
			rho, v, d, mu, eps, l := cols[0], cols[1], cols[2], cols[3], cols[4], cols[5]
			for i := range rho {
				re := rho[i] * v[i] * d[i] / mu[i]
				lg := math.Log10(eps[i]/d[i]*(1/3.7) + 5.74/math.Pow(re, 0.9))
				f := 0.25 / (lg * lg)
				sum += f * (l[i] / d[i]) * rho[i] * v[i] * v[i] * 0.5
			}
			sink = sum
		}
	})
	for _, check := range []formula.Check{formula.CheckFinite, formula.Unchecked} {
		name := "formula" // checked, the default
		if check == formula.Unchecked {
			name = "formula_unchecked"
		}
		b.Run(name, func(b *testing.B) { benchFormula(b, cols, check) })
	}
}

func benchFormula(b *testing.B, cols [][]float64, check formula.Check) {
	{
		p, err := formula.Compile(swameeJain, pipeInputs...)
		if err != nil {
			b.Fatal(err)
		}
		ev := p.Evaluator()
		ev.SetCheck(check)
		series := make([]quantity.Series, len(cols))
		for i := range cols {
			series[i] = quantity.NewSeries(cols[i], pipeInputs[i].Dim)
		}
		dst := [][]float64{make([]float64, kernelRows), make([]float64, kernelRows), make([]float64, kernelRows)}
		b.ReportAllocs()
		for b.Loop() {
			if err := ev.Series(series, dst); err != nil {
				b.Fatal(err)
			}
			var sum float64
			for _, x := range dst[2] {
				sum += x
			}
			sink = sum
		}
	}
}

// TestKernelAgrees: the formula's ΣΔp is the hand-written loop's.
func TestKernelAgrees(t *testing.T) {
	cols := pipeColumns()
	var want float64
	for i := range cols[0] {
		re := cols[0][i] * cols[1][i] * cols[2][i] / cols[3][i]
		lg := math.Log10(cols[4][i]/cols[2][i]*(1/3.7) + 5.74/math.Pow(re, 0.9))
		want += 0.25 / (lg * lg) * (cols[5][i] / cols[2][i]) * cols[0][i] * cols[1][i] * cols[1][i] * 0.5
	}
	p, err := formula.Compile(swameeJain, pipeInputs...)
	if err != nil {
		t.Fatal(err)
	}
	series := make([]quantity.Series, len(cols))
	for i := range cols {
		series[i] = quantity.NewSeries(cols[i], pipeInputs[i].Dim)
	}
	dst := [][]float64{make([]float64, kernelRows), make([]float64, kernelRows), make([]float64, kernelRows)}
	if err := p.Evaluator().Series(series, dst); err != nil {
		t.Fatal(err)
	}
	var got float64
	for _, x := range dst[2] {
		got += x
	}
	if math.Abs(got/want-1) > 1e-12 {
		t.Errorf("ΣΔp = %v, the float64 loop %v", got, want)
	}
}
