package fit

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"
)

// Model is a relation y = f(x; p) with parameters p. It must not keep or
// modify p, and should return a non-finite value where p is not allowed
// (a negative exponent's base, say); the fit then avoids it.
type Model func(x float64, p []float64) float64

// MaxParams is the most parameters FitCurve takes.
const MaxParams = 12

// Curve is a relation fitted by nonlinear least squares. The covariance
// of the parameters is S²·(JᵀWJ)⁻¹, J the Jacobian ∂f/∂p at the
// solution (by central differences), from the same QR solution as the
// polynomial fit: first-order, so the intervals are those of the model
// linearised at the solution (exact only for a model linear in p).
type Curve struct {
	P          []float64    // the parameters
	StdErr     []float64    // their standard errors
	Intervals  [][2]float64 // their confidence intervals at Level (Student t, DoF)
	N, DoF     int          // rows; N − len(P)
	S, SSE     float64      // residual standard deviation (per unit weight) and Σ wᵢ eᵢ²
	XMin, XMax float64
	Level      float64
	// Rows, Outliers and Influential are as for Poly, with the leverages
	// of the linearised model (the hat matrix of √W·J).
	Rows                  []Row
	Outliers, Influential []int
	// Notes says what the numbers above do not.
	Notes []string
	// Evaluations is the number of steps the minimiser took, at most
	// MaxIterations.
	Evaluations int

	f   Model
	cov *mat.SymDense
	tq  float64
}

// MaxIterations bounds the Levenberg–Marquardt steps of one FitCurve.
const MaxIterations = 1000

// FitCurve fits y = f(x; p) to the rows by weighted least squares,
// minimising Σ wᵢ (yᵢ − f(xᵢ; p))² from the starting point p0 with the
// Levenberg–Marquardt method (Marquardt, J. SIAM 11 (1963) 431–441:
// each step solves [√W·J; √λ·D]·δ = [√W·e; 0] by QR, D² the diagonal of
// JᵀWJ, J by central differences), at most MaxIterations steps. It needs more rows than parameters; it
// refuses a start where f is not finite, a minimisation that does not
// converge, and a Jacobian of less than full rank at the solution (the
// parameters are then not all determined by the data).
func FitCurve(f Model, x, y, p0 []float64, opt *Options) (*Curve, error) {
	const op = "FitCurve"
	if f == nil {
		return nil, invalid(op, -1, "no model")
	}
	if err := checkXY(op, x, y); err != nil {
		return nil, err
	}
	o, err := options(op, opt, len(x))
	if err != nil {
		return nil, err
	}
	n, np := len(x), len(p0)
	if np == 0 || np > MaxParams {
		return nil, invalid(op, -1, "%d parameters: want 1 … %d", np, MaxParams)
	}
	if n <= np {
		return nil, invalid(op, -1, "%d rows for %d parameters: want more rows than parameters", n, np)
	}
	for j, v := range p0 {
		if !finite(v) {
			return nil, outOfRange(op, -1, "starting parameter %d = %v: want a finite number", j, v)
		}
	}
	c := &Curve{N: n, DoF: n - np, XMin: slices.Min(x), XMax: slices.Max(x), Level: o.Level, f: f}
	sse := func(p []float64) float64 {
		s := 0.0
		for i := range n {
			e := y[i] - f(x[i], p)
			s += weight(o.Weights, i) * e * e
		}
		if !finite(s) {
			return math.Inf(1)
		}
		return s
	}
	if s0 := sse(p0); !finite(s0) {
		return nil, outOfRange(op, -1, "the model is not finite at the starting parameters %v", p0)
	}
	jac := mat.NewDense(n, np, nil)
	pt := make([]float64, np)
	jacobian := func(p []float64) bool {
		copy(pt, p)
		for j := range np {
			h := 1e-6 * max(math.Abs(p[j]), 1e-6)
			pt[j] = p[j] + h
			for i := range n {
				a := f(x[i], pt)
				pt[j] = p[j] - h
				b := f(x[i], pt)
				pt[j] = p[j] + h
				d := (a - b) / (2 * h)
				if !finite(d) {
					return false
				}
				jac.Set(i, j, d)
			}
			pt[j] = p[j]
		}
		return true
	}
	p, evals, err := levenbergMarquardt(op, sse, jacobian, jac, f, x, y, o.Weights, slices.Clone(p0))
	c.Evaluations = evals
	if err != nil {
		return nil, err
	}
	c.P = p
	if !allFinite(c.P...) || !jacobian(c.P) {
		return nil, outOfRange(op, -1, "the model or its derivatives are not finite at the solution %v", c.P)
	}
	r, err := solve(op, jac, make([]float64, n), o.Weights)
	if err != nil {
		return nil, err
	}
	c.SSE = sse(c.P)
	s2 := c.SSE / float64(c.DoF)
	c.S = math.Sqrt(s2)
	c.cov = mat.NewSymDense(np, nil)
	c.cov.ScaleSym(s2, r.covU)
	c.tq = distuv.StudentsT{Mu: 0, Sigma: 1, Nu: float64(c.DoF)}.Quantile(0.5 + o.Level/2)
	c.StdErr = make([]float64, np)
	c.Intervals = make([][2]float64, np)
	for j := range np {
		c.StdErr[j] = math.Sqrt(c.cov.At(j, j))
		c.Intervals[j] = [2]float64{c.P[j] - c.tq*c.StdErr[j], c.P[j] + c.tq*c.StdErr[j]}
	}
	if !allFinite(c.StdErr...) || !finite(c.SSE) {
		return nil, outOfRange(op, -1, "the standard errors are not finite numbers")
	}
	res := make([]float64, n)
	for i := range n {
		res[i] = y[i] - f(x[i], c.P)
	}
	var note string
	c.Rows, c.Outliers, c.Influential, note = diagnostics(x, y, res, r.h, o, c.SSE, c.S, c.DoF, np)
	if note != "" {
		c.Notes = append(c.Notes, note)
	}
	return c, nil
}

// Cov returns the covariance of P_i and P_j.
func (c *Curve) Cov(i, j int) float64 { return c.cov.At(i, j) }

// Predict returns f(x; P) with the confidence interval of the mean
// response (delta method: SE² = gᵀ C g, g = ∂f/∂p at x) and the
// prediction interval of a new observation, refusing an x outside the
// fitted range (class quantity.ErrRange).
func (c *Curve) Predict(x float64) (Prediction, error) {
	if !finite(x) || x < c.XMin || x > c.XMax {
		return Prediction{}, outOfRange("Curve.Predict", -1, "x = %v is outside the fitted range [%v, %v]: an extrapolation", x, c.XMin, c.XMax)
	}
	var gbuf [MaxParams]float64
	g := c.grad(x, gbuf[:len(c.P)])
	y := c.f(x, c.P)
	pr := Prediction{X: x, Y: y, SE: math.Sqrt(max(0, quad(c.cov, g))), Level: c.Level}
	hw, hn := c.tq*pr.SE, c.tq*math.Sqrt(c.S*c.S+pr.SE*pr.SE)
	pr.Mean = [2]float64{y - hw, y + hw}
	pr.New = [2]float64{y - hn, y + hn}
	if !allFinite(y, pr.SE, pr.Mean[0], pr.Mean[1], pr.New[0], pr.New[1]) {
		return Prediction{}, outOfRange("Curve.Predict", -1, "the prediction at x = %v is not a finite number", x)
	}
	return pr, nil
}

// levenbergMarquardt minimises sse from p. jacobian fills jac at a point
// and reports whether every derivative is finite.
func levenbergMarquardt(op string, sse func([]float64) float64, jacobian func([]float64) bool, jac *mat.Dense,
	f Model, x, y, w []float64, p []float64) ([]float64, int, error) {
	n, np := jac.Dims()
	aug := mat.NewDense(n+np, np, nil)
	rhs := mat.NewVecDense(n+np, nil)
	trial := make([]float64, np)
	cur := sse(p)
	lambda := 1e-3
	for it := 1; it <= MaxIterations; it++ {
		if !jacobian(p) {
			return nil, it, outOfRange(op, -1, "the model's derivatives are not finite at %v", p)
		}
		for i := range n {
			sw := math.Sqrt(weight(w, i))
			for j := range np {
				aug.Set(i, j, sw*jac.At(i, j))
			}
			rhs.SetVec(i, sw*(y[i]-f(x[i], p)))
		}
		var dn [MaxParams]float64
		for j := range np {
			s := 0.0
			for i := range n {
				s += aug.At(i, j) * aug.At(i, j)
			}
			dn[j] = math.Sqrt(s)
			if dn[j] == 0 {
				return nil, it, invalid(op, -1, "parameter %d does not change the model at %v: it is not determined by the data", j, p)
			}
		}
		improved := false
		for !improved && lambda < 1e16 {
			for j := range np {
				for k := range np {
					aug.Set(n+j, k, 0)
				}
				aug.Set(n+j, j, math.Sqrt(lambda)*dn[j])
				rhs.SetVec(n+j, 0)
			}
			var qr mat.QR
			qr.Factorize(aug)
			var d mat.VecDense
			if err := qr.SolveVecTo(&d, false, rhs); err != nil {
				lambda *= 10
				continue
			}
			small := true
			for j := range np {
				trial[j] = p[j] + d.AtVec(j)
				if math.Abs(d.AtVec(j)) > 1e-12*(math.Abs(p[j])+1e-12) {
					small = false
				}
			}
			next := sse(trial)
			if small {
				if next <= cur {
					copy(p, trial)
				}
				return p, it, nil
			}
			if next <= cur {
				improved = true
				rel := (cur - next) / max(cur, math.SmallestNonzeroFloat64)
				copy(p, trial)
				cur = next
				lambda = max(lambda/10, 1e-12)
				if rel < 1e-14 {
					return p, it, nil
				}
			} else {
				lambda *= 10
			}
		}
		if !improved {
			return p, it, nil // no step reduces the sum: a minimum to working precision
		}
	}
	return nil, MaxIterations, invalid(op, -1, "no convergence in %d steps; try a better starting point", MaxIterations)
}

// grad fills g with ∂f/∂p_j at x by central differences and returns it.
func (c *Curve) grad(x float64, g []float64) []float64 {
	var pbuf [MaxParams]float64
	pt := pbuf[:len(c.P)]
	copy(pt, c.P)
	for j := range c.P {
		h := 1e-6 * max(math.Abs(c.P[j]), 1e-6)
		pt[j] = c.P[j] + h
		a := c.f(x, pt)
		pt[j] = c.P[j] - h
		b := c.f(x, pt)
		pt[j] = c.P[j]
		g[j] = (a - b) / (2 * h)
	}
	return g
}

// slopeX returns ∂f/∂x at x by central differences, or one-sided ones
// where the model is not finite on one side (x at the edge of its
// domain).
func (c *Curve) slopeX(x float64) float64 {
	h := 1e-6 * max(math.Abs(x), 1e-9)
	a, b, y := c.f(x+h, c.P), c.f(x-h, c.P), c.f(x, c.P)
	switch {
	case finite(a) && finite(b):
		return (a - b) / (2 * h)
	case finite(a):
		return (a - y) / h
	default:
		return (y - b) / h
	}
}
