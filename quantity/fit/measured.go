package fit

import (
	"fmt"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// MeasuredPoly is a fitted polynomial whose coefficients B₀ … B_m (in the
// scaled variable t, so each has the dimension of y) are sources of
// uncertainty in a set: Type A with the fit's residual degrees of
// freedom, systematic (every prediction from the fit shares them), and
// correlated as the fit's covariance says. A prediction then carries both
// the fit's uncertainty and that of its measured input, and two
// predictions from one fit are correlated through the shared sources.
type MeasuredPoly struct {
	Poly       *Poly
	XDim, YDim quantity.Dim
	params     []uncertain.Measured
}

// Measured registers the fit's coefficients in set as sources named
// "name: B0", "name: B1", … with x and y of the dimensions xd and yd, and
// returns the polynomial for predictions with uncertainty. The sources'
// standard uncertainties are the coefficients' standard errors and their
// correlations r_ij = Cov(B_i, B_j)/(SE_i·SE_j).
func (f *Poly) Measured(set *uncertain.Set, name string, xd, yd quantity.Dim) (*MeasuredPoly, error) {
	p := f.Order + 1
	m := &MeasuredPoly{Poly: f, XDim: xd, YDim: yd}
	ids := make([]uncertain.ID, p)
	for k := range p {
		id, err := set.Add(uncertain.Source{Name: fmt.Sprintf("%s: B%d", name, k), U: quantity.New(f.StdErr[k], yd),
			Type: uncertain.TypeA, DoF: float64(f.DoF), Effect: uncertain.Systematic})
		if err != nil {
			return nil, &Error{Op: "Measured", Row: -1, Reason: "registering the coefficients", Err: err}
		}
		ids[k] = id
		v, err := set.Measure(quantity.New(f.B[k], yd), id)
		if err != nil {
			return nil, &Error{Op: "Measured", Row: -1, Reason: "registering the coefficients", Err: err}
		}
		m.params = append(m.params, v)
	}
	for i := range p {
		for j := i + 1; j < p; j++ {
			d := f.StdErr[i] * f.StdErr[j]
			if d == 0 {
				continue
			}
			r := f.cov.At(i, j) / d
			if r != 0 && finite(r) {
				if err := set.Correlate(ids[i], ids[j], max(-1, min(1, r))); err != nil {
					return nil, &Error{Op: "Measured", Row: -1, Reason: "correlating the coefficients", Err: err}
				}
			}
		}
	}
	return m, nil
}

// Predict returns y at a measured x, with the derivatives with respect to
// the coefficients' sources (t^k for B_k) and to x's own sources (dy/dx),
// and the plain Prediction with its intervals. The uncertainty from the
// coefficients alone is the standard error of the mean response,
// Prediction.SE. x must have the dimension XDim and lie in the fitted
// range (an *Error of class quantity.ErrRange otherwise); the result has
// the dimension YDim.
func (m *MeasuredPoly) Predict(x uncertain.Measured) (uncertain.Measured, Prediction, error) {
	return m.predict("Predict", x, false)
}

// Extrapolate is Predict without the range check; the Prediction says
// whether x lies outside the fitted range.
func (m *MeasuredPoly) Extrapolate(x uncertain.Measured) (uncertain.Measured, Prediction, error) {
	return m.predict("Extrapolate", x, true)
}

func (m *MeasuredPoly) predict(op string, x uncertain.Measured, outside bool) (uncertain.Measured, Prediction, error) {
	f := m.Poly
	if err := x.Quantity().CheckNamed("x", m.XDim); err != nil {
		return uncertain.Measured{}, Prediction{}, &Error{Op: op, Row: -1, Reason: "the input", Err: err}
	}
	var pr Prediction
	var err error
	if outside {
		pr, err = f.Extrapolate(x.Value())
	} else {
		pr, err = f.Predict(x.Value())
	}
	if err != nil {
		if e, ok := err.(*Error); ok {
			e.Op = op
		}
		return uncertain.Measured{}, Prediction{}, err
	}
	p := f.Order + 1
	var cbuf [MaxOrder + 2]float64
	var xbuf [MaxOrder + 2]uncertain.Measured
	c, xs := cbuf[:0], xbuf[:0]
	t, v := f.T(x.Value()), 1.0
	for k := range p {
		c = append(c, v)
		xs = append(xs, m.params[k])
		v *= t
	}
	c = append(c, f.Slope(x.Value()))
	xs = append(xs, x)
	if !finite(c[p]) {
		return uncertain.Measured{}, Prediction{}, outOfRange(op, -1, "the slope at x = %v is out of the range of a float64", x.Value())
	}
	z, err := uncertain.Eval(func() uncertain.Measured {
		return uncertain.Linear(quantity.New(pr.Y, m.YDim), c, xs)
	})
	if err != nil {
		return uncertain.Measured{}, Prediction{}, &Error{Op: op, Row: -1, Reason: "propagating the uncertainty", Err: err}
	}
	return z, pr, nil
}

// MeasuredCurve is a fitted Curve whose parameters are sources of
// uncertainty in a set, as MeasuredPoly's coefficients are: Type A with
// the fit's residual degrees of freedom, systematic, correlated as the
// fit's covariance says. The parameters are the plain numbers the model
// takes (in SI where they have units), so their sources are
// dimensionless numbers: a fitted exponent would give its coefficient a
// dimension no Dim can hold.
type MeasuredCurve struct {
	Curve      *Curve
	XDim, YDim quantity.Dim
	params     []uncertain.Measured
}

// Measured registers the fit's parameters in set as sources named
// "name: p0", "name: p1", … and returns the curve for predictions with
// uncertainty, x and y having the dimensions xd and yd.
func (c *Curve) Measured(set *uncertain.Set, name string, xd, yd quantity.Dim) (*MeasuredCurve, error) {
	m := &MeasuredCurve{Curve: c, XDim: xd, YDim: yd}
	ids := make([]uncertain.ID, len(c.P))
	for k := range c.P {
		id, err := set.Add(uncertain.Source{Name: fmt.Sprintf("%s: p%d", name, k), U: quantity.Scalar(c.StdErr[k]),
			Type: uncertain.TypeA, DoF: float64(c.DoF), Effect: uncertain.Systematic})
		if err != nil {
			return nil, &Error{Op: "Curve.Measured", Row: -1, Reason: "registering the parameters", Err: err}
		}
		ids[k] = id
		v, err := set.Measure(quantity.Scalar(c.P[k]), id)
		if err != nil {
			return nil, &Error{Op: "Curve.Measured", Row: -1, Reason: "registering the parameters", Err: err}
		}
		m.params = append(m.params, v)
	}
	for i := range c.P {
		for j := i + 1; j < len(c.P); j++ {
			d := c.StdErr[i] * c.StdErr[j]
			if d == 0 {
				continue
			}
			r := c.cov.At(i, j) / d
			if r != 0 && finite(r) {
				if err := set.Correlate(ids[i], ids[j], max(-1, min(1, r))); err != nil {
					return nil, &Error{Op: "Curve.Measured", Row: -1, Reason: "correlating the parameters", Err: err}
				}
			}
		}
	}
	return m, nil
}

// Predict returns y = f(x; P) at a measured x with the derivatives with
// respect to the parameters' sources (∂f/∂p_j) and x's own sources
// (∂f/∂x), both by central differences, and the plain Prediction. x must
// have the dimension XDim and lie in the fitted range.
func (m *MeasuredCurve) Predict(x uncertain.Measured) (uncertain.Measured, Prediction, error) {
	const op = "Curve.Predict"
	c := m.Curve
	if err := x.Quantity().CheckNamed("x", m.XDim); err != nil {
		return uncertain.Measured{}, Prediction{}, &Error{Op: op, Row: -1, Reason: "the input", Err: err}
	}
	pr, err := c.Predict(x.Value())
	if err != nil {
		return uncertain.Measured{}, Prediction{}, err
	}
	np := len(c.P)
	var cbuf [MaxParams + 1]float64
	var xbuf [MaxParams + 1]uncertain.Measured
	g := c.grad(x.Value(), cbuf[:np])
	xs := append(xbuf[:0], m.params...)
	coef := append(g, c.slopeX(x.Value()))
	xs = append(xs, x)
	if !allFinite(coef...) {
		return uncertain.Measured{}, Prediction{}, outOfRange(op, -1, "the model's derivatives at x = %v are not finite", x.Value())
	}
	z, err := uncertain.Eval(func() uncertain.Measured {
		return uncertain.Linear(quantity.New(pr.Y, m.YDim), coef, xs)
	})
	if err != nil {
		return uncertain.Measured{}, Prediction{}, &Error{Op: op, Row: -1, Reason: "propagating the uncertainty", Err: err}
	}
	return z, pr, nil
}
