package fit

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// maxCond is the largest condition number of the weighted design matrix a
// fit accepts; beyond it the coefficients are not determined by the data
// to any useful precision.
const maxCond = 1e12

// lsq is a weighted linear least-squares solution.
type lsq struct {
	b    []float64     // coefficients
	covU *mat.SymDense // (AᵀWA)⁻¹, the covariance per unit variance
	sse  float64       // Σ w e²
	e    []float64     // residuals y − ŷ (unweighted)
	h    []float64     // leverages, diagonal of the hat matrix
	cond float64
}

// solve fits y ≈ A·b with weights w (nil for equal weights) by the QR
// factorisation of √W·A: R b = Qᵀ √W y, so the normal equations, whose
// condition number is the square of A's, are never formed. The covariance
// per unit variance is R⁻¹R⁻ᵀ and the leverage of row i is |√wᵢ aᵢ R⁻¹|².
func solve(op string, a *mat.Dense, y, w []float64) (*lsq, error) {
	n, p := a.Dims()
	aw := mat.NewDense(n, p, nil)
	yw := mat.NewVecDense(n, nil)
	for i := range n {
		sw := 1.0
		if w != nil {
			sw = math.Sqrt(w[i])
		}
		for j := range p {
			aw.Set(i, j, sw*a.At(i, j))
		}
		yw.SetVec(i, sw*y[i])
	}
	var qr mat.QR
	qr.Factorize(aw)
	cond := qr.Cond()
	if !(cond <= maxCond) {
		return nil, invalid(op, -1, "the design matrix is singular or nearly so (condition number %.3g > %.0e): too few distinct x values, or an order too high for them", cond, maxCond)
	}
	var bv mat.VecDense
	if err := qr.SolveVecTo(&bv, false, yw); err != nil {
		return nil, invalid(op, -1, "the least-squares problem is singular: %v", err)
	}
	var r mat.Dense
	qr.RTo(&r)
	// R⁻¹ by back substitution, column by column.
	ri := mat.NewDense(p, p, nil)
	for c := range p {
		for i := c; i >= 0; i-- {
			s := 0.0
			if i == c {
				s = 1
			}
			for k := i + 1; k <= c; k++ {
				s -= r.At(i, k) * ri.At(k, c)
			}
			ri.Set(i, c, s/r.At(i, i))
		}
	}
	cov := mat.NewSymDense(p, nil)
	for i := range p {
		for j := i; j < p; j++ {
			s := 0.0
			for k := max(i, j); k < p; k++ {
				s += ri.At(i, k) * ri.At(j, k)
			}
			cov.SetSym(i, j, s)
		}
	}
	out := &lsq{b: make([]float64, p), covU: cov, e: make([]float64, n), h: make([]float64, n), cond: cond}
	for j := range p {
		out.b[j] = bv.AtVec(j)
	}
	z := make([]float64, p)
	for i := range n {
		fit := 0.0
		for j := range p {
			fit += a.At(i, j) * out.b[j]
		}
		out.e[i] = y[i] - fit
		wi := 1.0
		if w != nil {
			wi = w[i]
		}
		out.sse += wi * out.e[i] * out.e[i]
		// zᵀ = √wᵢ aᵢ R⁻¹
		h := 0.0
		for c := range p {
			s := 0.0
			for k := 0; k <= c; k++ {
				s += aw.At(i, k) * ri.At(k, c)
			}
			z[c] = s
			h += s * s
		}
		out.h[i] = min(h, 1)
	}
	return out, nil
}
