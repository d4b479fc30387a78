package formula

import (
	"fmt"
	"math"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
)

// evalErr is an OpEvaluate Error of class quantity.ErrInvalid.
func evalErr(format string, a ...any) error {
	return &Error{Op: OpEvaluate, Row: -1, Reason: fmt.Sprintf(format, a...), Class: quantity.ErrInvalid}
}

// block is the number of rows an Evaluator works on at a time.
const block = 256

// Evaluator evaluates a Program. It holds the working storage, so it does
// not allocate when evaluating; it is not safe for concurrent use (make
// one per goroutine).
type Evaluator struct {
	p      *Program
	check  Check
	regs   []float64   // one value per slot, for Row
	buf    []float64   // block storage for computed slots
	view   [][]float64 // per slot, the block being worked on
	dregs  []float64   // per slot, the derivatives with respect to the inputs (Gradient)
	res    []float64   // per statement, a row's results (RowQ, checked rows of Series)
	in     []float64   // per input, a row's values (RowQ, checked rows of Series)
	marked []int       // per statement, the results MarkMissing set to NaN
	qres   []float64   // per result, a row's results (RowQ)
	fargs  []float64   // the arguments of a function call
	fgrad  []float64   // the derivatives of a function call (Gradient)
	dx     []float64   // per slot, the derivatives with respect to a solve's unknown (Gradient)
}

// Evaluator returns an evaluator for the program. It checks that every
// result is finite (CheckFinite); SetCheck chooses otherwise.
func (p *Program) Evaluator() *Evaluator {
	e := &Evaluator{p: p, regs: make([]float64, p.slots), view: make([][]float64, p.slots),
		res: make([]float64, len(p.outputs)), in: make([]float64, len(p.inputs)), marked: make([]int, len(p.outputs)),
		qres: make([]float64, len(p.kept)), fargs: make([]float64, p.fargs), fgrad: make([]float64, p.fargs)}
	e.buf = make([]float64, (p.slots-len(p.inputs))*block)
	for s := len(p.inputs); s < p.slots; s++ {
		k := s - len(p.inputs)
		e.view[s] = e.buf[k*block : (k+1)*block : (k+1)*block]
	}
	// Constants fill their blocks once.
	for _, o := range p.ops {
		if o.code == opConst {
			v := e.view[o.dst]
			for i := range v {
				v[i] = o.k
			}
		}
	}
	return e
}

// Row evaluates the program for one row of input values, given in SI in
// the order of the inputs, and writes the results, in the order of
// Outputs, into out, which it returns. A result that is not finite is
// an *Error of OpCheck, or marked missing, as the evaluator's Check says; a NaN
// input is a missing value.
func (e *Evaluator) Row(in []float64, out []float64) ([]float64, error) {
	p := e.p
	if len(in) != len(p.inputs) {
		return nil, evalErr("%d values for %d inputs", len(in), len(p.inputs))
	}
	if len(out) < len(p.kept) {
		return nil, evalErr("room for %d results, the program has %d", len(out), len(p.kept))
	}
	if err := e.row(in, out); err != nil {
		return nil, err
	}
	return out[:len(p.kept)], nil
}

// row evaluates one row into out, checked as the evaluator's Check says.
func (e *Evaluator) row(in []float64, out []float64) error {
	p := e.p
	r := e.regs
	copy(r, in)
	for _, o := range p.ops {
		r[o.dst] = p.scalar(o, r, e.fargs)
	}
	ok := true
	for _, o := range p.outputs {
		ok = ok && finite(r[o.slot])
	}
	if !ok && e.check != Unchecked {
		// Again, statement by statement.
		copy(r, in)
		if err := e.rowChecked(-1, e.res); err != nil {
			return err
		}
		for i, k := range p.kept {
			out[i] = e.res[k]
		}
		return nil
	}
	for i, k := range p.kept {
		out[i] = r[p.outputs[k].slot]
	}
	return nil
}

// RowQ is Row for quantities: each input's dimension is checked (a
// wrong one is an *Error of OpEvaluate wrapping the *quantity.Error of
// class quantity.ErrDimension), and results that are not finite are
// treated as the evaluator's Check says.
func (e *Evaluator) RowQ(in []quantity.Quantity, out []quantity.Quantity) ([]quantity.Quantity, error) {
	p := e.p
	if len(in) != len(p.inputs) || len(out) < len(p.kept) {
		return nil, evalErr("%d quantities for %d inputs, room for %d of %d results", len(in), len(p.inputs), len(out), len(p.kept))
	}
	vals := e.in
	for i, q := range in {
		if err := q.CheckNamed(p.inputs[i].Name, p.inputs[i].Dim); err != nil {
			return nil, &Error{Op: OpEvaluate, Row: -1, Reason: fmt.Sprintf("input %q", p.inputs[i].Name), Class: causeClass(err, quantity.ErrInvalid), Err: err}
		}
		vals[i] = q.Value()
	}
	if err := e.row(vals, e.qres); err != nil {
		return nil, err
	}
	for i, k := range p.kept {
		out[i] = quantity.New(e.qres[i], p.outputs[k].dim)
	}
	return out[:len(p.kept)], nil
}

func b2f(b bool) float64 {
	if b {
		return 1
	}
	return 0
}

// scalar computes one operation on registers.
func scalar(o op, r []float64) float64 {
	a, b := r[o.a], r[o.b]
	switch o.code {
	case opConst:
		return o.k
	case opNeg:
		return -a
	case opAdd:
		return a + b
	case opSub:
		return a - b
	case opMul:
		return a * b
	case opDiv:
		return a / b
	case opPowInt:
		return exact.PowInt(a, o.n)
	case opPow:
		return math.Pow(a, o.k)
	case opPowX:
		return math.Pow(a, b)
	case opSqrt:
		return math.Sqrt(a)
	case opCbrt:
		return math.Cbrt(a)
	case opExp:
		return math.Exp(a)
	case opLn:
		return math.Log(a)
	case opLog10:
		return math.Log10(a)
	case opAbs:
		return math.Abs(a)
	case opMin:
		return math.Min(a, b)
	case opMax:
		return math.Max(a, b)
	case opHypot:
		return math.Hypot(a, b)
	case opSin:
		return math.Sin(a)
	case opCos:
		return math.Cos(a)
	case opTan:
		return math.Tan(a)
	case opAsin:
		return math.Asin(a)
	case opAcos:
		return math.Acos(a)
	case opAtan:
		return math.Atan(a)
	case opAtan2:
		return math.Atan2(a, b)
	case opLT:
		return b2f(a < b)
	case opLE:
		return b2f(a <= b)
	case opGT:
		return b2f(a > b)
	case opGE:
		return b2f(a >= b)
	case opEQ:
		return b2f(a == b)
	case opNE:
		return b2f(a != b)
	case opAnd:
		return b2f(a != 0 && b != 0)
	case opOr:
		return b2f(a != 0 || b != 0)
	case opIf:
		if a != 0 {
			return b
		}
		return r[o.c]
	}
	return math.NaN()
}

// Series evaluates the program over whole columns, one Series per input
// in the order of the inputs, writing result i (in the order of Outputs)
// into dst[i], which must have the columns' length. Dimensions and
// lengths are checked once; the work is done in blocks of rows, without
// allocating. A NaN in a column is a missing value: the results that use
// it are NaN. Any other result that is not finite is an *Error of OpCheck naming
// the first such row and statement, or is marked missing, as the
// evaluator's Check says; after an error, dst holds the results of the
// rows before that row.
func (e *Evaluator) Series(cols []quantity.Series, dst [][]float64) error {
	p := e.p
	if len(cols) != len(p.inputs) {
		return evalErr("%d columns for %d inputs", len(cols), len(p.inputs))
	}
	n := -1
	for i, c := range cols {
		if err := c.Check(p.inputs[i].Dim); err != nil {
			return &Error{Op: OpEvaluate, Row: -1, Reason: fmt.Sprintf("column %q", p.inputs[i].Name), Class: causeClass(err, quantity.ErrInvalid), Err: err}
		}
		if n >= 0 && c.Len() != n {
			return evalErr("column %q has %d values, the others %d", p.inputs[i].Name, c.Len(), n)
		}
		n = c.Len()
	}
	if len(dst) < len(p.kept) {
		return evalErr("%d destinations for %d results", len(dst), len(p.kept))
	}
	for i := range p.kept {
		if len(dst[i]) < n {
			return evalErr("destination %d holds %d values, the columns %d", i, len(dst[i]), n)
		}
	}
	if n < 0 {
		n = 0
	}
	for lo := 0; lo < n; lo += block {
		hi := min(lo+block, n)
		m := hi - lo
		for i, c := range cols {
			e.view[i] = c.Values()[lo:hi]
		}
		for _, o := range p.ops {
			switch {
			case o.code == opConst:
			case o.code >= opFunc:
				e.vectorCall(o, m)
			default:
				vector(o, e.view, m)
			}
		}
		bad := false
		if e.check != Unchecked {
			for _, o := range p.outputs {
				bad = bad || !o.konst && !allFinite(e.view[o.slot][:m])
			}
		}
		for i, k := range p.kept {
			copy(dst[i][lo:hi], e.view[p.outputs[k].slot][:m])
		}
		if bad {
			if err := e.checkRows(cols, dst, lo, hi); err != nil {
				e.clearViews(len(cols))
				return err
			}
		}
	}
	e.clearViews(len(cols))
	return nil
}

func (e *Evaluator) clearViews(n int) {
	for i := range n {
		e.view[i] = nil
	}
}

// allFinite reports whether every value of x is finite.
func allFinite(x []float64) bool {
	// v*0 is NaN for ±Inf and NaN, 0 otherwise; four sums run in parallel.
	var a0, a1, a2, a3 float64
	i := 0
	for ; i+4 <= len(x); i += 4 {
		a0 += x[i] * 0
		a1 += x[i+1] * 0
		a2 += x[i+2] * 0
		a3 += x[i+3] * 0
	}
	for ; i < len(x); i++ {
		a0 += x[i] * 0
	}
	return a0+a1+a2+a3 == 0
}

// checkRows evaluates again, statement by statement, the rows lo…hi−1
// that have a result that is not finite, and reports the first (or marks
// them missing).
func (e *Evaluator) checkRows(cols []quantity.Series, dst [][]float64, lo, hi int) error {
	p := e.p
	for k := lo; k < hi; k++ {
		ok := true
		for _, o := range p.outputs {
			ok = ok && finite(e.view[o.slot][k-lo])
		}
		if ok {
			continue
		}
		for j, c := range cols {
			e.regs[j] = c.Values()[k]
		}
		if err := e.rowChecked(k, e.res); err != nil {
			return err
		}
		for i, s := range p.kept {
			dst[i][k] = e.res[s]
		}
	}
	return nil
}

// vectorCall computes a function call or a solve over m rows of the slot
// views, one row at a time in the registers.
func (e *Evaluator) vectorCall(o op, m int) {
	p := e.p
	c := &p.calls[o.n]
	d := e.view[o.dst][:m]
	r := e.regs
	for i := range d {
		for _, s := range c.reads {
			r[s] = e.view[s][i]
		}
		if o.code == opFunc {
			d[i], _ = p.call(o, r, e.fargs)
		} else {
			d[i], _ = p.root(c, r, e.fargs)
		}
	}
}

// vector computes one operation over m rows of the slot views.
func vector(o op, v [][]float64, m int) {
	d := v[o.dst][:m]
	a := v[o.a][:m]
	switch o.code {
	case opNeg:
		for i, x := range a {
			d[i] = -x
		}
	case opAdd:
		b := v[o.b][:m]
		for i := range d {
			d[i] = a[i] + b[i]
		}
	case opSub:
		b := v[o.b][:m]
		for i := range d {
			d[i] = a[i] - b[i]
		}
	case opMul:
		b := v[o.b][:m]
		for i := range d {
			d[i] = a[i] * b[i]
		}
	case opDiv:
		b := v[o.b][:m]
		for i := range d {
			d[i] = a[i] / b[i]
		}
	case opPowInt:
		switch o.n {
		case 2:
			for i, x := range a {
				d[i] = x * x
			}
		case -1:
			for i, x := range a {
				d[i] = 1 / x
			}
		default:
			for i, x := range a {
				d[i] = exact.PowInt(x, o.n)
			}
		}
	case opPow:
		for i, x := range a {
			d[i] = math.Pow(x, o.k)
		}
	case opSqrt:
		for i, x := range a {
			d[i] = math.Sqrt(x)
		}
	case opLog10:
		for i, x := range a {
			d[i] = math.Log10(x)
		}
	case opLn:
		for i, x := range a {
			d[i] = math.Log(x)
		}
	case opExp:
		for i, x := range a {
			d[i] = math.Exp(x)
		}
	default:
		// The rest, one row at a time through the scalar form.
		var r [4]float64
		for i := range d {
			r[1] = a[i]
			if o.code == opPowX || o.code >= opMin && o.code <= opHypot || o.code >= opAtan2 {
				r[2] = v[o.b][i]
			}
			if o.code == opIf {
				r[3] = v[o.c][i]
			}
			d[i] = scalar(op{code: o.code, a: 1, b: 2, c: 3, k: o.k, n: o.n}, r[:])
		}
	}
}
