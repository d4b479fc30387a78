package formula

import (
	"math"

	"similis.dev/similis/internal/exact"
)

// Gradient evaluates the program for one row of input values, in SI in
// the order of the inputs, writes the results into out, and writes into
// grad[i][j] the partial derivative of result i with respect to input j,
// ∂outᵢ/∂inⱼ, in SI (its dimension is result i's over input j's). The
// derivatives are exact, by forward-mode differentiation of every
// operation, not finite differences: the sensitivity coefficients an
// uncertainty budget needs. At a point where an operation is not
// differentiable (abs at 0, min or max at a tie, a branch of if) the
// derivative of the branch taken is used. A value or a derivative that is
// not finite is a *RangeError, or marked missing, as the evaluator's Check
// says; the derivatives of a missing value are not checked.
func (e *Evaluator) Gradient(in, out []float64, grad [][]float64) error {
	p := e.p
	nIn := len(p.inputs)
	if len(grad) < len(p.outputs) {
		return evalErr("room for the gradients of %d results, the program has %d", len(grad), len(p.outputs))
	}
	for i := range p.outputs {
		if len(grad[i]) < nIn {
			return evalErr("gradient %d holds %d derivatives, the program has %d inputs", i, len(grad[i]), nIn)
		}
	}
	if _, err := e.Row(in, out); err != nil {
		return err
	}
	if len(e.dregs) < p.slots*nIn {
		e.dregs = make([]float64, p.slots*nIn) // once per evaluator
	}
	d := func(s int) []float64 { return e.dregs[s*nIn : (s+1)*nIn : (s+1)*nIn] }
	for j := range nIn {
		dj := d(j)
		for k := range dj {
			dj[k] = 0
		}
		dj[j] = 1
	}
	r := e.regs
	for _, o := range p.ops {
		dst, da := d(o.dst), d(o.a)
		a := r[o.a]
		var db []float64
		var b float64
		if o.b < p.slots {
			db, b = d(o.b), r[o.b]
		}
		v := r[o.dst]
		for k := range dst {
			dst[k] = derivative(o, a, b, v, da[k], db, k, r, e.dregs, nIn)
		}
	}
	for i, o := range p.outputs {
		g := grad[i][:nIn]
		copy(g, d(o.slot))
		if e.check == Unchecked || math.IsNaN(out[i]) || p.missing(i, r) {
			continue
		}
		for j, x := range g {
			if finite(x) {
				continue
			}
			if e.check != MarkMissing {
				return &RangeError{Input: p.src, Row: -1, Statement: i, Name: o.name, Value: x, Wrt: p.inputs[j].Name, Offset: o.pos,
					Reason: "the derivative is not finite (a square root, a cube root or a fractional power at zero, asin or acos at ±1, or an overflow)"}
			}
			g[j] = math.NaN()
			e.marked[i]++
		}
	}
	return nil
}

// derivative is the derivative of operation o's result v with respect to
// one input, given its operands a, b and their derivatives da, db[k].
func derivative(o op, a, b, v, da float64, dbs []float64, k int, r, dregs []float64, nIn int) float64 {
	db := 0.0
	if dbs != nil {
		db = dbs[k]
	}
	switch o.code {
	case opConst, opLT, opLE, opGT, opGE, opEQ, opNE, opAnd, opOr:
		return 0
	case opNeg:
		return -da
	case opAdd:
		return da + db
	case opSub:
		return da - db
	case opMul:
		return a*db + b*da
	case opDiv:
		return (da*b - a*db) / (b * b)
	case opPowInt:
		if o.n == 0 {
			return 0
		}
		return float64(o.n) * exact.PowInt(a, o.n-1) * da
	case opPow:
		return o.k * math.Pow(a, o.k-1) * da
	case opPowX:
		return v * (b*da/a + math.Log(a)*db)
	case opSqrt:
		return da / (2 * v)
	case opCbrt:
		return da / (3 * v * v)
	case opExp:
		return v * da
	case opLn:
		return da / a
	case opLog10:
		return da / (a * math.Ln10)
	case opAbs:
		if a < 0 {
			return -da
		}
		return da
	case opMin:
		if a <= b {
			return da
		}
		return db
	case opMax:
		if a >= b {
			return da
		}
		return db
	case opHypot:
		return (a*da + b*db) / v
	case opSin:
		return math.Cos(a) * da
	case opCos:
		return -math.Sin(a) * da
	case opTan:
		return (1 + v*v) * da
	case opAsin:
		return da / math.Sqrt(1-a*a)
	case opAcos:
		return -da / math.Sqrt(1-a*a)
	case opAtan:
		return da / (1 + a*a)
	case opAtan2:
		return (b*da - a*db) / (a*a + b*b)
	case opIf:
		if a != 0 {
			return db
		}
		return dregs[o.c*nIn+k]
	}
	return math.NaN()
}
