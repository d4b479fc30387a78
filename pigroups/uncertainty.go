package pigroups

import (
	"fmt"
	"math"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// RowMeasured evaluates every group for one row of measured values, in
// variable order, into dst (room for Len groups), each group with its
// first-order uncertainty: for Π = F·Π x_i^a_i the derivative with
// respect to a source is Π·Σ a_i·(∂x_i/∂δ)/x_i, with the exponents exact.
// A source shared by two variables (one calibration for two channels)
// enters the group once, with its effects summed. It panics with a
// *uncertain.Error with Terms set if a group would depend on more than
// uncertain.MaxTerms sources; use uncertain.Eval to have it as an error.
func (e *Evaluator) RowMeasured(values []uncertain.Measured, dst []uncertain.Measured) ([]uncertain.Measured, error) {
	if len(values) != len(e.dims) {
		return nil, &Error{Op: OpEvaluate, Reason: fmt.Sprintf("%d values for %d variables", len(values), len(e.dims))}
	}
	if len(dst) < len(e.num) {
		return nil, &Error{Op: OpEvaluate, Reason: fmt.Sprintf("destination holds %d groups, the set has %d", len(dst), len(e.num))}
	}
	if cap(e.qbuf) < len(values) {
		e.qbuf = make([]quantity.Quantity, len(values))
		e.cbuf = make([]float64, len(values))
		e.gbuf = make([]float64, len(e.num))
	}
	q := e.qbuf[:len(values)]
	for i, v := range values {
		q[i] = v.Quantity()
	}
	g, err := e.Row(q, e.gbuf)
	if err != nil {
		return nil, err
	}
	for i, x := range q {
		if x.Value() == 0 {
			return nil, &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Reason: "a measured value of zero: the sensitivity of a product of powers is not defined there"}
		}
	}
	c := e.cbuf[:len(values)]
	for k := range e.num {
		clear(c)
		for _, t := range e.num[k] {
			c[t.v] += t.exp * g[k] / q[t.v].Value()
		}
		for _, t := range e.den[k] {
			c[t.v] -= t.exp * g[k] / q[t.v].Value()
		}
		dst[k] = uncertain.Linear(quantity.Scalar(g[k]), c, values)
	}
	return dst[:len(e.num)], nil
}

// SharedSource is a source of uncertainty common to every row of a
// data set, such as a channel's calibration: Rel[i] is its relative
// standard uncertainty on variable i (0 where it does not act), and its
// errors in different variables are fully correlated.
type SharedSource struct {
	Name string
	Rel  []float64
}

// SeriesU evaluates every group over whole columns as Series does, and
// the standard uncertainty of each group value into udst. u holds one
// Series per variable of per-row standard uncertainties (random,
// independent between variables and rows; a nil Values or 0 for none);
// shared lists sources common to all rows. For group g = F·Π x_i^a_i the
// relative uncertainty is √(Σ_i (a_i·u_i/x_i)² + Σ_s (Σ_i a_i·Rel_s,i)²).
// Dimensions and lengths are checked once; no allocation once the
// evaluator has run. A row where a variable is zero, or missing (NaN),
// gets a NaN uncertainty for the groups it enters: the relative form is
// not defined there.
func (e *Evaluator) SeriesU(cols, u []quantity.Series, shared []SharedSource, dst, udst [][]float64) error {
	if err := e.checkSeries(cols, dst); err != nil {
		return err
	}
	if len(u) != len(e.dims) {
		return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("%d uncertainty series for %d variables", len(u), len(e.dims))}
	}
	n := 0
	if len(cols) > 0 {
		n = cols[0].Len()
	}
	for i, s := range u {
		if s.Len() == 0 {
			continue
		}
		if err := s.Check(e.dims[i]); err != nil {
			return &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Reason: "uncertainty series", Err: err}
		}
		if s.Len() != n {
			return &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Reason: fmt.Sprintf("uncertainty series of %d rows, data of %d", s.Len(), n)}
		}
	}
	for _, sh := range shared {
		if len(sh.Rel) != len(e.dims) {
			return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("shared source %q gives %d relative uncertainties for %d variables", sh.Name, len(sh.Rel), len(e.dims))}
		}
	}
	if len(udst) < len(e.num) {
		return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("destination holds %d groups, the set has %d", len(udst), len(e.num))}
	}
	sh2 := e.shbuf[:0]
	for g := range e.num {
		if len(udst[g]) != n {
			return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("uncertainty destination of group %d holds %d rows, the data %d", g+1, len(udst[g]), n)}
		}
		// The shared sources give one relative variance per group.
		var v float64
		for _, sh := range shared {
			var r float64
			for _, t := range e.num[g] {
				r += t.exp * sh.Rel[t.v]
			}
			for _, t := range e.den[g] {
				r -= t.exp * sh.Rel[t.v]
			}
			v += r * r
		}
		sh2 = append(sh2, v)
	}
	e.shbuf = sh2
	if e.uterms == nil {
		e.uterms = make([][]uTerm, len(e.num))
		for g := range e.num {
			for _, t := range append(append([]evTerm(nil), e.num[g]...), e.den[g]...) {
				e.uterms[g] = append(e.uterms[g], uTerm{v: t.v, a2: t.exp * t.exp})
			}
		}
	}
	// Block by block: each variable's relative uncertainty once, then
	// every group's exponent-weighted sum of squares.
	nv := len(e.dims)
	if len(e.rbuf) < nv*uBlock {
		e.rbuf = make([]float64, nv*uBlock)
	}
	if len(e.colbuf) < nv {
		e.colbuf = make([]quantity.Series, nv)
		e.dstbuf = make([][]float64, len(e.num))
	}
	for lo := 0; lo < n; lo += uBlock {
		m := min(uBlock, n-lo)
		// The values of this block, while its data are in cache.
		for i := range nv {
			e.colbuf[i] = quantity.NewSeries(cols[i].Values()[lo:lo+m], cols[i].Dim())
		}
		for g := range e.num {
			e.dstbuf[g] = dst[g][lo : lo+m]
		}
		if err := e.Series(e.colbuf[:nv], e.dstbuf[:len(e.num)]); err != nil {
			return e.Series(cols, dst) // the error, with its row in the whole data
		}
		for i := range nv {
			rel := e.rbuf[i*uBlock : i*uBlock+m]
			uv := u[i].Values()
			if len(uv) == 0 {
				clear(rel)
				continue
			}
			relSquared(rel, uv[lo:lo+m], cols[i].Values()[lo:lo+m])
		}
		for g := range e.num {
			out := udst[g][lo : lo+m]
			gv := dst[g][lo : lo+m]
			gv = gv[:len(out)]
			s0 := sh2[g]
			tv := e.uterms[g]
			// Rows of the block in registers: the common group shapes
			// (two to four variables) unrolled.
			rel := func(k int) []float64 { return e.rbuf[tv[k].v*uBlock : tv[k].v*uBlock+len(out)] }
			switch len(tv) {
			case 2:
				r0, r1 := rel(0), rel(1)
				a0, a1 := tv[0].a2, tv[1].a2
				for r := range out {
					out[r] = math.Abs(gv[r]) * math.Sqrt(s0+a0*r0[r]+a1*r1[r])
				}
			case 3:
				r0, r1, r2 := rel(0), rel(1), rel(2)
				a0, a1, a2 := tv[0].a2, tv[1].a2, tv[2].a2
				for r := range out {
					out[r] = math.Abs(gv[r]) * math.Sqrt(s0+a0*r0[r]+a1*r1[r]+a2*r2[r])
				}
			case 4:
				r0, r1, r2, r3 := rel(0), rel(1), rel(2), rel(3)
				a0, a1, a2, a3 := tv[0].a2, tv[1].a2, tv[2].a2, tv[3].a2
				for r := range out {
					out[r] = math.Abs(gv[r]) * math.Sqrt(s0+a0*r0[r]+a1*r1[r]+a2*r2[r]+a3*r3[r])
				}
			default:
				for r := range out {
					out[r] = s0
				}
				for k := range tv {
					rk, ak := rel(k), tv[k].a2
					for r := range out {
						out[r] += ak * rk[r]
					}
				}
				for r := range out {
					out[r] = math.Abs(gv[r]) * math.Sqrt(out[r])
				}
			}
		}
	}
	return nil
}

// uTerm is one variable of a group for SeriesU: its index and its
// exponent squared.
type uTerm struct {
	v  int
	a2 float64
}

// relSquared sets rel[r] = (u[r]/x[r])². Divisions are the cost here, so
// four rows share one: with p = x₀x₁x₂x₃ and inv = 1/p, 1/x₀ = x₁x₂x₃·inv
// and so on, which holds to a few ulps while p stays well inside the
// float64 range; otherwise each row is divided alone.
func relSquared(rel, u, x []float64) {
	n := len(rel)
	u, x = u[:n], x[:n]
	r := 0
	for ; r+4 <= n; r += 4 {
		xs, us, rs := x[r:r+4:r+4], u[r:r+4:r+4], rel[r:r+4:r+4]
		x0, x1, x2, x3 := xs[0], xs[1], xs[2], xs[3]
		p01, p23 := x0*x1, x2*x3
		p := p01 * p23
		if a := math.Abs(p); a > 1e-280 && a < 1e280 {
			inv := 1 / p
			i01, i23 := inv*p23, inv*p01 // 1/(x₀x₁), 1/(x₂x₃)
			a0, a1, a2, a3 := us[0]*x1*i01, us[1]*x0*i01, us[2]*x3*i23, us[3]*x2*i23
			rs[0], rs[1], rs[2], rs[3] = a0*a0, a1*a1, a2*a2, a3*a3
			continue
		}
		for k := r; k < r+4; k++ {
			a := u[k] / x[k]
			rel[k] = a * a
		}
	}
	for ; r < n; r++ {
		a := u[r] / x[r]
		rel[r] = a * a
	}
}

// MeasuredLaw is a fitted power law whose coefficients are sources of
// uncertainty in a set: ln C and each exponent, Type A with the fit's
// residual degrees of freedom, systematic (every prediction from the fit
// shares them), and correlated as the fit's covariance says. A
// prediction then carries both the fit's uncertainty and that of its
// measured inputs, and two predictions from one fit are correlated.
type MeasuredLaw struct {
	Law    *PowerLaw
	params []uncertain.Measured // ln C, a₁ … a_k
	cbuf   []float64
	xbuf   []uncertain.Measured
}

// Measured registers the fit's coefficients in set as sources named
// "name: ln C", "name: a1", … and returns the law for predictions with
// uncertainty.
func (f *PowerLaw) Measured(set *uncertain.Set, name string) (*MeasuredLaw, error) {
	k := len(f.Exponents) + 1
	ml := &MeasuredLaw{Law: f}
	ids := make([]uncertain.ID, k)
	for j := range k {
		label := "ln C"
		v := math.Log(f.C)
		if j > 0 {
			label = fmt.Sprintf("a%d", j)
			v = f.Exponents[j-1]
		}
		id, err := set.Add(uncertain.Source{Name: name + ": " + label, U: quantity.Scalar(math.Sqrt(f.cov.At(j, j))),
			Type: uncertain.TypeA, DoF: float64(f.DoF), Effect: uncertain.Systematic})
		if err != nil {
			return nil, &Error{Op: OpFit, Row: -1, Group: -1, Reason: "registering the coefficients", Err: err}
		}
		ids[j] = id
		m, err := set.Measure(quantity.Scalar(v), id)
		if err != nil {
			return nil, &Error{Op: OpFit, Row: -1, Group: -1, Reason: "registering the coefficients", Err: err}
		}
		ml.params = append(ml.params, m)
	}
	for i := range k {
		for j := i + 1; j < k; j++ {
			r := f.cov.At(i, j) / math.Sqrt(f.cov.At(i, i)*f.cov.At(j, j))
			if r != 0 && !math.IsNaN(r) {
				if err := set.Correlate(ids[i], ids[j], max(-1, min(1, r))); err != nil {
					return nil, &Error{Op: OpFit, Row: -1, Group: -1, Reason: "correlating the coefficients", Err: err}
				}
			}
		}
	}
	return ml, nil
}

// Predict returns Π₀ = C·Π₁^a₁·… at measured groups, with the
// derivatives with respect to the fit's coefficients (y for ln C,
// y·ln Π_k for a_k) and to the groups' own sources (a_k·y/Π_k), and the
// plain Prediction with its intervals and extrapolation note. The
// first-order uncertainty from the coefficients alone is the fit's
// standard error of the mean in log space, times y.
func (m *MeasuredLaw) Predict(groups ...uncertain.Measured) (uncertain.Measured, Prediction, error) {
	f := m.Law
	if len(groups) != len(f.Exponents) {
		return uncertain.Measured{}, Prediction{}, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("%d groups for a fit of %d", len(groups), len(f.Exponents))}
	}
	if m.cbuf == nil {
		m.cbuf = make([]float64, 2*len(groups)+1)
		m.xbuf = make([]uncertain.Measured, 2*len(groups)+1)
	}
	vals := m.cbuf[:len(groups)]
	for k, g := range groups {
		if err := g.Quantity().Check(quantity.Dimensionless); err != nil {
			return uncertain.Measured{}, Prediction{}, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: k + 1, Err: err}
		}
		vals[k] = g.Value()
	}
	pr, err := f.Predict(vals...)
	if err != nil {
		return uncertain.Measured{}, Prediction{}, err
	}
	y := pr.Value
	c, x := m.cbuf[:0], m.xbuf[:0]
	c = append(c, y)
	x = append(x, m.params[0])
	for k, g := range groups {
		c = append(c, y*math.Log(g.Value()), f.Exponents[k]*y/g.Value())
		x = append(x, m.params[k+1], g)
	}
	z, err := uncertain.Eval(func() uncertain.Measured { return uncertain.Linear(quantity.Scalar(y), c, x) })
	if err != nil {
		return uncertain.Measured{}, Prediction{}, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: "the groups' sources", Err: err}
	}
	return z, pr, nil
}

// uBlock is the number of rows SeriesU works on at a time: its data
// stay in cache between the values and the uncertainties.
const uBlock = 2048
