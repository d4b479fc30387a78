package formula

import (
	"math"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
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
// not finite is an *Error of OpCheck, or marked missing, as the evaluator's Check
// says; the derivatives of a missing value are not checked.
func (e *Evaluator) Gradient(in, out []float64, grad [][]float64) error {
	p := e.p
	nIn := len(p.inputs)
	if len(grad) < len(p.kept) {
		return evalErr("room for the gradients of %d results, the program has %d", len(grad), len(p.kept))
	}
	for i := range p.kept {
		if len(grad[i]) < nIn {
			return evalErr("gradient %d holds %d derivatives, the program has %d inputs", i, len(grad[i]), nIn)
		}
	}
	for _, c := range p.calls {
		if c.fn != nil && c.fn.Deriv == nil {
			return evalErr("function %s gives no derivative (its Deriv is nil): the program has no gradient", c.fn.Name)
		}
	}
	if _, err := e.Row(in, out); err != nil {
		return err
	}
	if len(e.dregs) < p.slots*nIn {
		e.dregs = make([]float64, p.slots*nIn) // once per evaluator
	}
	if len(p.calls) > 0 && len(e.dx) < p.slots {
		e.dx = make([]float64, p.slots)
	}
	d := func(s int) []float64 { return e.dregs[s*nIn : (s+1)*nIn : (s+1)*nIn] }
	for j := range nIn {
		dj := d(j)
		for k := range dj {
			dj[k] = 0
		}
		dj[j] = 1
	}
	e.derivOps(p.ops, e.dregs, nIn)
	r := e.regs
	for i, s := range p.kept {
		o := p.outputs[s]
		g := grad[i][:nIn]
		copy(g, d(o.slot))
		if e.check == Unchecked || math.IsNaN(out[i]) || p.missing(s, r) {
			continue
		}
		for j, x := range g {
			if finite(x) {
				continue
			}
			if e.check != MarkMissing {
				return &Error{Op: OpCheck, Class: quantity.ErrRange, Input: p.src, Row: -1, Statement: s, Name: o.name, Value: x, Wrt: p.inputs[j].Name, Offset: o.pos,
					Reason: "the derivative is not finite (a square root, a cube root or a fractional power at zero, asin or acos at ±1, a solve whose equation is flat at its root, or an overflow)"}
			}
			g[j] = math.NaN()
			e.marked[s]++
		}
	}
	return nil
}

// derivOps computes the derivatives of the results of ops, nIn of them
// per slot in dregs, from those of their operands.
func (e *Evaluator) derivOps(ops []op, dregs []float64, nIn int) {
	p := e.p
	r := e.regs
	d := func(s int) []float64 { return dregs[s*nIn : (s+1)*nIn : (s+1)*nIn] }
	for _, o := range ops {
		dst := d(o.dst)
		switch o.code {
		case opFunc:
			c := &p.calls[o.n]
			args, gf := e.fargs[:len(c.args)], e.fgrad[:len(c.args)]
			for j, s := range c.args {
				args[j] = r[s]
			}
			if err := c.fn.Deriv(args, gf); err != nil {
				for k := range dst {
					dst[k] = math.NaN()
				}
				continue
			}
			for k := range dst {
				sum := 0.0
				for j, s := range c.args {
					sum += gf[j] * dregs[s*nIn+k]
				}
				dst[k] = sum
			}
		case opSolve:
			e.derivSolve(o, dregs, nIn)
		default:
			da := d(o.a)
			a := r[o.a]
			var db []float64
			var b float64
			if o.b < p.slots {
				db, b = d(o.b), r[o.b]
			}
			v := r[o.dst]
			for k := range dst {
				dst[k] = derivative(o, a, b, v, da[k], db, k, r, dregs, nIn)
			}
		}
	}
}

// derivSolve computes the derivatives of a solve's root x of g(x, θ) = 0
// by the implicit function theorem: dx/dθ = −(∂g/∂θ)/(∂g/∂x).
func (e *Evaluator) derivSolve(o op, dregs []float64, nIn int) {
	p := e.p
	c := &p.calls[o.n]
	r := e.regs
	dst := dregs[o.dst*nIn : (o.dst+1)*nIn]
	x := r[o.dst]
	if !finite(x) {
		for k := range dst {
			dst[k] = math.NaN()
		}
		return
	}
	p.equation(c, x, r, e.fargs) // the equation's registers at the root
	clear(dregs[c.x*nIn : (c.x+1)*nIn])
	e.derivOps(c.body, dregs, nIn) // ∂g/∂θ, x held
	dx := e.dx
	clear(dx)
	dx[c.x] = 1
	e.derivOps(c.body, dx, 1) // ∂g/∂x
	gx := dx[c.g]
	for k := range dst {
		dst[k] = -dregs[c.g*nIn+k] / gx
	}
	r[o.dst] = x
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
