package pigroups

import (
	"errors"
	"fmt"
	"math"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
)

// evTerm is one factor of a group in an Evaluator: a variable and its
// exponent.
type evTerm struct {
	v   int
	exp float64
	n   int // the exponent as a whole number, when it is one (and small)
}

// Evaluator computes group values from variable values. It is built once
// per set and does not allocate when evaluating.
type Evaluator struct {
	set      *Set
	num, den [][]evTerm // per group: factors with positive and negative exponents
	dims     []quantity.Dim
	factor   []float64 // per group: its numerical factor (Group.Factor)
	nbuf     [evalBlock]float64
	dbuf     [evalBlock]float64
	// buffers of RowMeasured
	qbuf       []quantity.Quantity
	cbuf, gbuf []float64
	// buffers of SeriesU
	rbuf, shbuf []float64
	colbuf      []quantity.Series
	dstbuf      [][]float64
	uterms      [][]uTerm
}

const evalBlock = 256

// Evaluator returns an evaluator for the set's groups, each with its
// numerical factor (Group.Factor: 1 for a Pi set, the trade's factor for
// a set WithCoefficients).
func (s *Set) Evaluator() *Evaluator {
	e := &Evaluator{set: s}
	for _, v := range s.prob.vars {
		e.dims = append(e.dims, v.Dim)
	}
	for _, g := range s.groups {
		var num, den []evTerm
		for i, x := range g.exps {
			if x.IsZero() {
				continue
			}
			t := evTerm{v: i, exp: math.Abs(x.Float())}
			if x.IsInt() && x.Num() >= -8 && x.Num() <= 8 {
				t.n = int(x.Num())
				if t.n < 0 {
					t.n = -t.n
				}
			}
			if x.Sign() > 0 {
				num = append(num, t)
			} else {
				den = append(den, t)
			}
		}
		e.num = append(e.num, num)
		e.den = append(e.den, den)
		e.factor = append(e.factor, g.Factor())
	}
	return e
}

func factor(x float64, t evTerm) float64 {
	if t.n > 0 {
		return exact.PowNat(x, t.n)
	}
	return math.Pow(x, t.exp)
}

// Row evaluates every group for one row of values, given in variable
// order, into dst (which must have room for Len groups) and returns it.
// A numerator and denominator that overflow apart are evaluated again in
// logarithms; a group value that is still out of range, or a fractional
// power of a negative value, is an *Error of kind ErrNotFinite. A
// NaN input gives NaN.
// Dimensions are checked; nothing is allocated.
func (e *Evaluator) Row(values []quantity.Quantity, dst []float64) ([]float64, error) {
	if len(values) != len(e.dims) {
		return nil, &Error{Op: OpEvaluate, Reason: fmt.Sprintf("%d values for %d variables", len(values), len(e.dims))}
	}
	for i, q := range values {
		if err := q.Check(e.dims[i]); err != nil {
			return nil, &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Err: err}
		}
	}
	if len(dst) < len(e.num) {
		return nil, &Error{Op: OpEvaluate, Reason: fmt.Sprintf("destination holds %d groups, the set has %d", len(dst), len(e.num))}
	}
	for g := range e.num {
		n, d := 1.0, 1.0
		for _, t := range e.num[g] {
			n *= factor(values[t.v].Value(), t)
		}
		for _, t := range e.den[g] {
			d *= factor(values[t.v].Value(), t)
		}
		v := e.factor[g] * n / d
		if !finiteNonzero(v) {
			var ok bool
			if v, ok = e.logRow(g, func(i int) float64 { return values[i].Value() }); !ok {
				return nil, e.rangeError(g, -1)
			}
		}
		dst[g] = v
	}
	return dst[:len(e.num)], nil
}

// checkSeries checks the columns and destinations of Series once.
func (e *Evaluator) checkSeries(cols []quantity.Series, dst [][]float64) error {
	if len(cols) != len(e.dims) {
		return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("%d columns for %d variables", len(cols), len(e.dims))}
	}
	n := -1
	for i, c := range cols {
		if err := c.Check(e.dims[i]); err != nil {
			return &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Err: err}
		}
		if n >= 0 && c.Len() != n {
			return &Error{Op: OpEvaluate, Symbol: e.set.prob.vars[i].Symbol, Reason: fmt.Sprintf("column of length %d, others %d", c.Len(), n)}
		}
		n = c.Len()
	}
	if len(dst) < len(e.num) {
		return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("%d destinations for %d groups", len(dst), len(e.num))}
	}
	for g := range e.num {
		if len(dst[g]) < n {
			return &Error{Op: OpEvaluate, Reason: fmt.Sprintf("destination %d holds %d values, the columns %d", g, len(dst[g]), n)}
		}
	}
	return nil
}

// Series evaluates every group over whole columns of data, one Series per
// variable in variable order, writing group g's values into dst[g], which
// must have the columns' length. A NaN input (a missing value) gives a
// NaN group value in its row; a value out of range is an *Error
// naming the group and the row. Dimensions and lengths are checked once;
// the work is done in blocks, with no allocation. An Evaluator is not safe
// for concurrent use by Series; use one per goroutine.
func (e *Evaluator) Series(cols []quantity.Series, dst [][]float64) error {
	if err := e.checkSeries(cols, dst); err != nil {
		return err
	}
	n := 0
	if len(cols) > 0 {
		n = cols[0].Len()
	}
	bad := false // a group value out of range somewhere: checked per block, redone after
	for lo := 0; lo < n; lo += evalBlock {
		hi := min(lo+evalBlock, n)
		for g := range e.num {
			bad = e.block(g, cols, dst[g][lo:hi], lo) || bad
		}
	}
	if !bad {
		return nil
	}
	// A numerator and a denominator that overflow or underflow apart
	// although the group is finite: evaluate those rows in logarithms. A
	// zero or a NaN that the inputs explain (a zero reading, a missing
	// value) is kept.
	for g := range e.num {
		out := dst[g][:n]
		for i := range out {
			if x := out[i]; x-x == 0 && x != 0 {
				continue
			}
			v, ok := e.logRow(g, func(j int) float64 { return cols[j].Values()[i] })
			if !ok {
				return e.rangeError(g, i)
			}
			out[i] = v
		}
	}
	return nil
}

func finiteNonzero(x float64) bool { return x != 0 && !math.IsInf(x, 0) && !math.IsNaN(x) }

// logRow evaluates group g in logarithms, as factor·∏|x|^e with the sign
// of the product. A NaN input (a missing value) gives NaN, whatever the
// other inputs; a zero in the
// numerator gives 0; ok is false when the value is truly out of range, an
// input is infinite or zero in the denominator, or a negative value is
// raised to a fractional power.
func (e *Evaluator) logRow(g int, value func(int) float64) (float64, bool) {
	// A missing value makes the group missing, whatever the other inputs
	// of its row (a zero elsewhere in the denominator included).
	for _, terms := range [2][]evTerm{e.num[g], e.den[g]} {
		for _, t := range terms {
			if math.IsNaN(value(t.v)) {
				return math.NaN(), true
			}
		}
	}
	lv, neg := math.Log(math.Abs(e.factor[g])), e.factor[g] < 0
	zero := false
	add := func(terms []evTerm, sign float64) bool {
		for _, t := range terms {
			x := value(t.v)
			switch {
			case math.IsNaN(x):
				lv = math.NaN()
				continue
			case math.IsInf(x, 0):
				return false
			case x == 0 && sign > 0:
				zero = true
				continue
			case x == 0:
				return false
			case x < 0:
				if t.n == 0 {
					return false // a fractional power of a negative value
				}
				neg = neg != (t.n%2 == 1)
			}
			lv += sign * t.exp * math.Log(math.Abs(x))
		}
		return true
	}
	if !add(e.num[g], 1) || !add(e.den[g], -1) {
		return 0, false
	}
	switch {
	case math.IsNaN(lv):
		return math.NaN(), true
	case zero:
		return 0, true
	}
	v := math.Exp(lv)
	if !finiteNonzero(v) {
		return 0, false
	}
	if neg {
		v = -v
	}
	return v, true
}

// rangeError reports a group value that is not finite (row −1 for Row).
func (e *Evaluator) rangeError(g, row int) error {
	name := e.set.groups[g].Name
	where := ""
	if row >= 0 {
		where = fmt.Sprintf(" at row %d", row)
	}
	return &Error{Op: OpEvaluate, Symbol: name, Kind: ErrNotFinite, Reason: fmt.Sprintf("%s%s is zero, not finite, or a fractional power of a negative value", name, where)}
}

// ErrNotFinite is the Kind of an Error for a group value that is not
// finite and nonzero.
var ErrNotFinite = errors.New("group value not finite")

// block writes group g for rows lo…lo+len(out) into out and reports
// whether a value is zero or not finite. The division, the factor and the
// range check are one pass over the block; a lone factor to the first
// power is read from its column, not copied.
func (e *Evaluator) block(g int, cols []quantity.Series, out []float64, lo int) (bad bool) {
	if fused, bad := e.fusedBlock(g, cols, out, lo); fused {
		return bad
	}
	var x, y []float64
	if nt := e.num[g]; len(nt) == 1 && nt[0].n == 1 {
		x = cols[nt[0].v].Values()[lo : lo+len(out)]
	} else {
		x = e.nbuf[:len(out)]
		product(x, cols, nt, lo)
	}
	switch dt := e.den[g]; {
	case len(dt) == 0:
		// x alone, times the factor
	case len(dt) == 1 && dt[0].n == 1:
		y = cols[dt[0].v].Values()[lo : lo+len(out)]
	default:
		y = e.dbuf[:len(out)]
		product(y, cols, dt, lo)
	}
	// On the bits of |v|, a zero is 0 and a value that is not finite is
	// at least 0x7FF0…0, so |v|−1 wraps or reaches 0x7FEF…F exactly for
	// those: a running maximum keeps the loop free of branches.
	const abs = 1<<63 - 1
	var m uint64
	k := e.factor[g]
	x = x[:len(out)]
	switch {
	case y == nil:
		for i, v := range x {
			v *= k
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	case k == 1:
		y = y[:len(out)]
		for i, v := range x {
			v /= y[i]
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	default:
		y = y[:len(out)]
		for i, v := range x {
			v = v / y[i] * k
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	}
	return m >= 0x7FEFFFFFFFFFFFFF
}

// fusedBlock evaluates, in one pass with no buffer, the common shapes
// x/(a·b), x/(a·b²) and x/(a·b·c) with a factor of 1 (Δp/(ρV²),
// μ/(ρVD)), multiplying as Row does; fused is false for other shapes.
func (e *Evaluator) fusedBlock(g int, cols []quantity.Series, out []float64, lo int) (fused, bad bool) {
	nt, dt := e.num[g], e.den[g]
	if e.factor[g] != 1 || len(nt) != 1 || nt[0].n != 1 || len(dt) < 2 || len(dt) > 3 || dt[0].n != 1 {
		return false, false
	}
	hi := lo + len(out)
	x := cols[nt[0].v].Values()[lo:hi]
	a := cols[dt[0].v].Values()[lo:hi]
	b := cols[dt[1].v].Values()[lo:hi]
	x, a, b = x[:len(out)], a[:len(out)], b[:len(out)]
	const abs = 1<<63 - 1
	var m uint64
	switch {
	case len(dt) == 2 && dt[1].n == 1:
		for i := range out {
			v := x[i] / (a[i] * b[i])
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	case len(dt) == 2 && dt[1].n == 2:
		for i := range out {
			v := x[i] / (a[i] * (b[i] * b[i]))
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	case len(dt) == 3 && dt[1].n == 1 && dt[2].n == 1:
		c := cols[dt[2].v].Values()[lo:hi]
		c = c[:len(out)]
		for i := range out {
			v := x[i] / (a[i] * b[i] * c[i])
			out[i] = v
			m = max(m, math.Float64bits(v)&abs-1)
		}
	default:
		return false, false
	}
	return true, m >= 0x7FEFFFFFFFFFFFFF
}

// product writes ∏ col^exp over the terms into buf, for rows lo…lo+len(buf).
func product(buf []float64, cols []quantity.Series, terms []evTerm, lo int) {
	if len(terms) == 0 {
		for i := range buf {
			buf[i] = 1
		}
		return
	}
	if len(terms) >= 2 && terms[0].n == 1 && terms[1].n <= 2 && terms[1].n >= 1 {
		// The first factors in one pass: ρ·V, ρ·V², ρ·V·D, multiplied in
		// the order Row multiplies them.
		a, b := cols[terms[0].v].Values()[lo:lo+len(buf)], cols[terms[1].v].Values()[lo:lo+len(buf)]
		switch {
		case terms[1].n == 1 && len(terms) >= 3 && terms[2].n == 1:
			c := cols[terms[2].v].Values()[lo : lo+len(buf)]
			for i := range buf {
				buf[i] = a[i] * b[i] * c[i]
			}
			terms = terms[1:]
		case terms[1].n == 1:
			for i := range buf {
				buf[i] = a[i] * b[i]
			}
		default:
			for i := range buf {
				buf[i] = a[i] * (b[i] * b[i])
			}
		}
		for _, t := range terms[2:] {
			mulInto(buf, cols[t.v].Values()[lo:lo+len(buf)], t)
		}
		return
	}
	for k, t := range terms {
		x := cols[t.v].Values()[lo : lo+len(buf)]
		switch {
		case k == 0 && t.n == 1:
			copy(buf, x)
		case k == 0 && t.n == 2:
			for i, v := range x {
				buf[i] = v * v
			}
		case k == 0:
			for i, v := range x {
				buf[i] = factor(v, t)
			}
		case t.n == 1:
			for i, v := range x {
				buf[i] *= v
			}
		case t.n == 2:
			for i, v := range x {
				buf[i] *= v * v
			}
		default:
			for i, v := range x {
				buf[i] *= factor(v, t)
			}
		}
	}
}

// mulInto multiplies buf by x^t row by row.
func mulInto(buf, x []float64, t evTerm) {
	x = x[:len(buf)]
	switch t.n {
	case 1:
		for i, v := range x {
			buf[i] *= v
		}
	case 2:
		for i, v := range x {
			buf[i] *= v * v
		}
	default:
		for i, v := range x {
			buf[i] *= factor(v, t)
		}
	}
}
