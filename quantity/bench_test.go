package quantity_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"similis.dev/similis/quantity"
)

// kernelRows is the number of rows in the benchmark data set.
const kernelRows = 4096

// pipeRows holds invented pipe-flow data: density, velocity, diameter,
// dynamic viscosity, roughness and length, in SI units.
type pipeRows struct {
	rho, v, d, mu, eps, l []float64
}

func makePipeRows() pipeRows {
	r := rand.New(rand.NewPCG(1, 2))
	u := func(lo, hi float64) float64 { return lo + (hi-lo)*r.Float64() }
	var p pipeRows
	for range kernelRows {
		p.rho = append(p.rho, u(700, 1200))
		p.v = append(p.v, u(0.5, 5))
		p.d = append(p.d, u(0.02, 0.5))
		p.mu = append(p.mu, u(0.4e-3, 2e-3))
		p.eps = append(p.eps, u(1e-6, 1e-4))
		p.l = append(p.l, u(1, 100))
	}
	return p
}

func column(v []float64, d quantity.Dim) []quantity.Quantity {
	out := make([]quantity.Quantity, len(v))
	for i, x := range v {
		out[i] = quantity.New(x, d)
	}
	return out
}

type pipeQuantities struct {
	rho, v, d, mu, eps, l []quantity.Quantity
}

func (p pipeRows) quantities() pipeQuantities {
	return pipeQuantities{
		column(p.rho, quantity.Density), column(p.v, quantity.Velocity),
		column(p.d, quantity.Length), column(p.mu, quantity.DynamicViscosity),
		column(p.eps, quantity.Length), column(p.l, quantity.Length),
	}
}

type pipeSeries struct {
	rho, v, d, mu, eps, l quantity.Series
	// scratch destinations, reused across iterations
	re, t, u, f, dp quantity.Series
}

func (p pipeRows) series() *pipeSeries {
	return &pipeSeries{
		rho: quantity.NewSeries(p.rho, quantity.Density), v: quantity.NewSeries(p.v, quantity.Velocity),
		d: quantity.NewSeries(p.d, quantity.Length), mu: quantity.NewSeries(p.mu, quantity.DynamicViscosity),
		eps: quantity.NewSeries(p.eps, quantity.Length), l: quantity.NewSeries(p.l, quantity.Length),
	}
}

// kernelFloat computes ΣΔp for Darcy–Weisbach pressure drop with the
// Swamee–Jain (1976) explicit friction factor, on plain float64.
func kernelFloat(p *pipeRows) float64 {
	var sum float64
	rho, v, d, mu, eps, l := p.rho, p.v, p.d, p.mu, p.eps, p.l
	for i := range rho {
		re := rho[i] * v[i] * d[i] / mu[i]
		lg := math.Log10(eps[i]/d[i]*(1/3.7) + 5.74*(1/math.Pow(re, 0.9)))
		f := 0.25 / (lg * lg)
		sum += f * (l[i] / d[i]) * rho[i] * v[i] * v[i] * 0.5
	}
	return sum
}

// kernelQuantity is kernelFloat written as a user would with Quantity.
func kernelQuantity(p *pipeQuantities) quantity.Quantity {
	sum := quantity.New(0, quantity.Pressure)
	rho, v, d, mu, eps, l := p.rho, p.v, p.d, p.mu, p.eps, p.l
	for i := range rho {
		re := rho[i].Mul(v[i]).Mul(d[i]).Div(mu[i])
		lg := quantity.Log10(eps[i].Div(d[i]).Scale(1 / 3.7).Add(quantity.Powf(re, 0.9).Inv().Scale(5.74)))
		f := lg.Mul(lg).Inv().Scale(0.25)
		sum = sum.Add(f.Mul(l[i].Div(d[i])).Mul(rho[i]).Mul(v[i]).Mul(v[i]).Scale(0.5))
	}
	return sum
}

// kernelSeries is kernelFloat written with whole-Series operations.
func kernelSeries(s *pipeSeries) quantity.Quantity {
	s.re.SetMul(s.rho, s.v).SetMul(s.re, s.d).SetDiv(s.re, s.mu)
	s.t.SetDiv(s.eps, s.d).SetScale(s.t, 1/3.7)
	s.u.SetPowf(s.re, 0.9).SetInv(s.u).SetScale(s.u, 5.74)
	s.t.SetAdd(s.t, s.u).SetLog10(s.t)
	s.f.SetMul(s.t, s.t).SetInv(s.f).SetScale(s.f, 0.25)
	s.dp.SetDiv(s.l, s.d).SetMul(s.dp, s.f).SetMul(s.dp, s.rho).SetMul(s.dp, s.v).SetMul(s.dp, s.v).SetScale(s.dp, 0.5)
	return s.dp.Sum()
}

func arithFloat(p *pipeRows) (float64, float64) {
	var sq, sre float64
	rho, v, d, mu := p.rho, p.v, p.d, p.mu
	for i := range rho {
		sq += rho[i] * v[i] * v[i] * 0.5
		sre += rho[i] * v[i] * d[i] / mu[i]
	}
	return sq, sre
}

func arithQuantity(p *pipeQuantities) (quantity.Quantity, quantity.Quantity) {
	sq := quantity.New(0, quantity.Pressure)
	sre := quantity.Scalar(0)
	rho, v, d, mu := p.rho, p.v, p.d, p.mu
	for i := range rho {
		sq = sq.Add(rho[i].Mul(v[i]).Mul(v[i]).Scale(0.5))
		sre = sre.Add(rho[i].Mul(v[i]).Mul(d[i]).Div(mu[i]))
	}
	return sq, sre
}

var sinkF float64
var sinkQ quantity.Quantity

// BenchmarkKernel compares a pipe pressure-drop kernel on plain float64,
// on Quantity, and on Series; see the README for figures.
func BenchmarkKernel(b *testing.B) {
	rows := makePipeRows()
	qs := rows.quantities()
	ss := rows.series()
	kernelSeries(ss) // grow scratch storage before timing
	b.Run("float64", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkF = kernelFloat(&rows)
		}
	})
	b.Run("quantity", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkQ = kernelQuantity(&qs)
		}
	})
	b.Run("series", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkQ = kernelSeries(ss)
		}
	})
}

// BenchmarkArith compares dynamic pressure and Reynolds number, no
// transcendental functions, on float64 and on Quantity.
func BenchmarkArith(b *testing.B) {
	rows := makePipeRows()
	qs := rows.quantities()
	b.Run("float64", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkF, _ = arithFloat(&rows)
		}
	})
	b.Run("quantity", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			sinkQ, _ = arithQuantity(&qs)
		}
	})
}

func relDiff(a, b float64) float64 { return math.Abs(a-b) / math.Max(math.Abs(a), math.Abs(b)) }

func TestKernelVariantsAgree(t *testing.T) {
	rows := makePipeRows()
	want := kernelFloat(&rows)
	qs := rows.quantities()
	gotQ := kernelQuantity(&qs)
	gotS := kernelSeries(rows.series())
	for name, got := range map[string]quantity.Quantity{"quantity": gotQ, "series": gotS} {
		if got.Dim() != quantity.Pressure {
			t.Errorf("%s: ΣΔp has dimension %v, want pressure", name, got.Dim())
		}
		if d := relDiff(got.Value(), want); d > 1e-12 {
			t.Errorf("%s: ΣΔp = %v, float64 gives %v (relative difference %g)", name, got.Value(), want, d)
		}
	}
	sq, sre := arithFloat(&rows)
	q, re := arithQuantity(&qs)
	if relDiff(q.Value(), sq) > 1e-12 || relDiff(re.Value(), sre) > 1e-12 || q.Dim() != quantity.Pressure || !re.IsDimensionless() {
		t.Errorf("arith: quantity gives %v, %v; float64 gives %v, %v", q, re, sq, sre)
	}
	// A hand check of one row: ρ = 1000 kg/m³, V = 2 m/s, D = 0.1 m,
	// μ = 1e-3 Pa·s gives Re = 2e5 (definition of the Reynolds number).
	one := pipeRows{rho: []float64{1000}, v: []float64{2}, d: []float64{0.1}, mu: []float64{1e-3}, eps: []float64{4.6e-5}, l: []float64{10}}
	if _, re := arithFloat(&one); relDiff(re, 2e5) > 1e-15 {
		t.Errorf("Re = %v, want 2e5", re)
	}
}
