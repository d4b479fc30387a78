package uncertain_test

import (
	"math/rand/v2"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// rowsU is the benchmark's invented pipe-flow data (4096 rows, as the
// quantity Kernel benchmark): ρ, V, D, μ, ε, L as Quantity and as
// Measured, each input with its own relative source, so a row depends on
// 6 sources.
type rowsU struct {
	q [6][]quantity.Quantity
	m [6][]uncertain.Measured
}

func makeRowsU() rowsU {
	r := rand.New(rand.NewPCG(3, 4))
	dims := [6]quantity.Dim{quantity.Density, quantity.Velocity, quantity.Length, quantity.DynamicViscosity, quantity.Length, quantity.Length}
	lo := [6]float64{700, 0.5, 0.02, 0.4e-3, 1e-6, 1}
	hi := [6]float64{1200, 5, 0.5, 2e-3, 1e-4, 100}
	rel := [6]float64{0.001, 0.005, 0.002, 0.02, 0.3, 0.001}
	set := uncertain.NewSet()
	var ids [6]uncertain.ID
	for k, name := range []string{"ρ", "V", "D", "μ", "ε", "L"} {
		ids[k] = set.MustAdd(uncertain.Source{Name: name, U: quantity.Scalar(rel[k]), Relative: true})
	}
	var p rowsU
	for range 4096 {
		for k := range 6 {
			q := quantity.New(lo[k]+(hi[k]-lo[k])*r.Float64(), dims[k])
			p.q[k] = append(p.q[k], q)
			p.m[k] = append(p.m[k], set.MustMeasure(q, ids[k]))
		}
	}
	return p
}

// kernelQ is the quantity Kernel benchmark's Darcy–Weisbach Δp with the
// Swamee–Jain friction factor, on Quantity.
func kernelQ(p *rowsU) quantity.Quantity {
	sum := quantity.New(0, quantity.Pressure)
	rho, v, d, mu, eps, l := p.q[0], p.q[1], p.q[2], p.q[3], p.q[4], p.q[5]
	for i := range rho {
		re := rho[i].Mul(v[i]).Mul(d[i]).Div(mu[i])
		lg := quantity.Log10(eps[i].Div(d[i]).Scale(1 / 3.7).Add(quantity.Powf(re, 0.9).Inv().Scale(5.74)))
		f := lg.Mul(lg).Inv().Scale(0.25)
		sum = sum.Add(f.Mul(l[i].Div(d[i])).Mul(rho[i]).Mul(v[i]).Mul(v[i]).Scale(0.5))
	}
	return sum
}

// kernelM is kernelQ on Measured: the same formula, first-order
// propagation over the row's 6 sources. It returns Σ u(Δp) as well, so
// each row's uncertainty is formed, not only the sum's.
func kernelM(p *rowsU) (uncertain.Measured, float64) {
	sum := uncertain.Exact(quantity.New(0, quantity.Pressure))
	var su float64
	rho, v, d, mu, eps, l := p.m[0], p.m[1], p.m[2], p.m[3], p.m[4], p.m[5]
	for i := range rho {
		re := rho[i].Mul(v[i]).Mul(d[i]).Div(mu[i])
		lg := uncertain.Log10(eps[i].Div(d[i]).Scale(1 / 3.7).Add(re.Powf(0.9).Inv().Scale(5.74)))
		f := lg.Mul(lg).Inv().Scale(0.25)
		dp := f.Mul(l[i].Div(d[i])).Mul(rho[i]).Mul(v[i]).Mul(v[i]).Scale(0.5)
		su += dp.U().Value()
		sum = sum.Add(dp)
	}
	return sum, su
}

// kernelP is kernelM written with the in-place forms.
func kernelP(p *rowsU) (uncertain.Measured, float64) {
	var sum, re, t, u, lg, f, dp uncertain.Measured
	sum = uncertain.Exact(quantity.New(0, quantity.Pressure))
	var su float64
	rho, v, d, mu, eps, l := p.m[0], p.m[1], p.m[2], p.m[3], p.m[4], p.m[5]
	for i := range rho {
		re.SetMul(&rho[i], &v[i]).SetMul(&re, &d[i]).SetDiv(&re, &mu[i])
		t.SetDiv(&eps[i], &d[i]).SetScale(&t, 1/3.7)
		u.SetPowf(&re, 0.9).SetInv(&u).SetScale(&u, 5.74)
		lg.SetAdd(&t, &u).SetLog10(&lg)
		f.SetMul(&lg, &lg).SetInv(&f).SetScale(&f, 0.25)
		dp.SetDiv(&l[i], &d[i]).SetMul(&dp, &f).SetMul(&dp, &rho[i]).SetMul(&dp, &v[i]).SetMul(&dp, &v[i]).SetScale(&dp, 0.5)
		su += dp.U().Value()
		sum.SetAdd(&sum, &dp)
	}
	return sum, su
}

var (
	sinkQU quantity.Quantity
	sinkMU uncertain.Measured
	sinkFU float64
)

// BenchmarkKernelU compares the Kernel formula on Quantity (value only)
// with first-order propagation on Measured, 6 sources per row.
func BenchmarkKernelU(b *testing.B) {
	p := makeRowsU()
	b.Run("quantity", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkQU = kernelQ(&p)
		}
	})
	b.Run("measured", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkMU, sinkFU = kernelM(&p)
		}
	})
	b.Run("inplace", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkMU, sinkFU = kernelP(&p)
		}
	})
}

// TestKernelU: the Measured kernel's values are the Quantity kernel's,
// and one row's u(Δp) is the root-sum-square of the exponent-weighted
// relative uncertainties in the laminar-free power-law part (checked on
// the formula's ρ and L, which enter Δp linearly: contributions 0.1 % of
// Δp each).
func TestKernelU(t *testing.T) {
	p := makeRowsU()
	m, su := kernelM(&p)
	q := kernelQ(&p)
	if m.Quantity() != q {
		t.Errorf("Measured Σ Δp %v, Quantity %v", m.Quantity(), q)
	}
	mp, sup := kernelP(&p)
	if mp != m || sup != su {
		t.Errorf("in-place forms give %v (Σu %v), value forms %v (Σu %v)", mp, sup, m, su)
	}
	one := rowsU{}
	for k := range 6 {
		one.q[k], one.m[k] = p.q[k][:1], p.m[k][:1]
	}
	dp, _ := kernelM(&one)
	if dp.Terms() != 6 {
		t.Fatalf("Δp depends on %d sources, want 6", dp.Terms())
	}
	for i := range dp.Terms() {
		id, d := dp.Term(i)
		src, err := dp.Set().Source(id)
		if err != nil {
			t.Fatal(err)
		}
		if src.Name == "L" {
			// Δp ∝ L exactly: contribution = 0.1 % of Δp.
			near(t, "L's contribution / Δp", d/dp.Value(), 0.001, 1e-12)
		}
	}
}
