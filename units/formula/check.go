package formula

import (
	"fmt"
	"math"
	"strconv"

	"similis.dev/similis/quantity"
)

// Check says what an Evaluator does with a result that is not finite:
// ±Inf or NaN from a division by zero, a logarithm of zero or of a
// negative number, a square root of a negative number, asin or acos of a
// number outside [−1, 1], a fractional power of a negative number, or an
// overflow beyond the range of float64.
//
// A result is checked as later statements see it, so an operation on a
// branch of if that is not taken does not count: if(x > 0, ln(x), 0) is
// 0 at x = 0. A missing value — NaN in an input column, or a result
// already marked missing — makes missing (NaN) the results of the
// statements that name it; that is neither an error nor counted.
type Check uint8

const (
	// CheckFinite, the default, refuses a result that is not finite: the
	// evaluation stops with an *Error of OpCheck naming the first row and, in
	// that row, the first statement whose result is not finite, and the
	// operation that first gave a value that is not finite.
	CheckFinite Check = iota
	// MarkMissing sets a result that is not finite to NaN, the mark of a
	// missing value, and counts it (Evaluator.Marked); later statements
	// see it as missing. The evaluation goes on.
	MarkMissing
	// Unchecked leaves results as the float64 arithmetic gives them, ±Inf
	// and NaN included, and never reports them: the fastest way, for a
	// caller that checks the results itself.
	Unchecked
)

// String returns the constant's name.
func (c Check) String() string {
	switch c {
	case CheckFinite:
		return "CheckFinite"
	case MarkMissing:
		return "MarkMissing"
	case Unchecked:
		return "Unchecked"
	}
	return "Check(" + strconv.Itoa(int(c)) + ")"
}

// SetCheck sets what the evaluator does with a result that is not finite;
// an Evaluator starts with CheckFinite.
func (e *Evaluator) SetCheck(c Check) { e.check = c }

// Marked returns how many results of result i (an index of Outputs)
// MarkMissing has set to NaN since the evaluator was made or ResetMarked
// was called; missing inputs that made results missing are not counted.
func (e *Evaluator) Marked(i int) int { return e.marked[e.p.kept[i]] }

// ResetMarked sets the counts of Marked to zero.
func (e *Evaluator) ResetMarked() { clear(e.marked) }

func finite(x float64) bool { return x-x == 0 }

// missing reports whether a name that statement i uses holds a missing
// value (NaN) in the registers r.
func (p *Program) missing(i int, r []float64) bool {
	for _, s := range p.outputs[i].refs {
		if math.IsNaN(r[s]) {
			return true
		}
	}
	return false
}

// rowChecked evaluates one row, whose inputs are in e.regs, statement by
// statement, writing the results of every statement into res; a statement whose result is
// not finite, and not made missing by a missing value it uses, is
// reported (CheckFinite) or set to NaN and counted (MarkMissing). row is
// the row's index for an error, −1 for Row.
func (e *Evaluator) rowChecked(row int, res []float64) error {
	p := e.p
	r := e.regs
	for i, o := range p.outputs {
		for _, op := range p.ops[o.lo:o.hi] {
			r[op.dst] = p.scalar(op, r, e.fargs)
		}
		v := r[o.slot]
		if !finite(v) && !p.missing(i, r) {
			if e.check != MarkMissing {
				return p.rangeError(row, i, r)
			}
			e.marked[i]++
			v = math.NaN()
			if o.slot >= len(p.inputs) {
				r[o.slot] = v // later statements see it missing
			}
		}
		res[i] = v
	}
	return nil
}

// rangeError describes statement i's result that is not finite, with the
// registers r holding the row's values: it finds the first operation the
// result depends on (taking the branch of if that was taken) that gave a
// value that is not finite from operands that are.
func (p *Program) rangeError(row, i int, r []float64) *Error {
	o := p.outputs[i]
	e := &Error{Op: OpCheck, Class: quantity.ErrRange, Input: p.src, Row: row, Statement: i, Name: o.name, Value: r[o.slot], Offset: o.pos}
	nIn := len(p.inputs)
	if o.slot < nIn {
		e.Reason = fmt.Sprintf("input %s is %v", p.inputs[o.slot].Name, r[o.slot])
		return e
	}
	live := make(map[int]bool) // an error's cold path
	live[o.slot] = true
	ops := p.ops[o.lo:o.hi]
	for k := len(ops) - 1; k >= 0; k-- {
		op := ops[k]
		if !live[op.dst] {
			continue
		}
		for _, s := range p.operands(op, r) {
			live[s] = true
		}
	}
	for k, op := range ops {
		if !live[op.dst] || finite(r[op.dst]) {
			continue
		}
		e.Offset = p.opPos[o.lo+k]
		for _, s := range p.operands(op, r) {
			if s < nIn && !finite(r[s]) {
				e.Reason = fmt.Sprintf("input %s is %v", p.inputs[s].Name, r[s])
				return e
			}
		}
		if op.code >= opFunc {
			e.Reason, e.Err = p.whyCall(op, r)
			if e.Err != nil {
				e.Class = funcClass(e.Err)
			}
			return e
		}
		e.Reason = why(op, r)
		return e
	}
	e.Reason = "the result is not finite"
	return e
}

// operands returns the slots op reads, only the branch taken for if.
func (p *Program) operands(op op, r []float64) []int {
	switch op.code {
	case opFunc, opSolve:
		return p.calls[op.n].reads
	case opConst:
		return nil
	case opAdd, opSub, opMul, opDiv, opPowX, opMin, opMax, opHypot, opAtan2, opLT, opLE, opGT, opGE, opEQ, opNE, opAnd, opOr:
		return []int{op.a, op.b}
	case opIf:
		if r[op.a] != 0 {
			return []int{op.a, op.b}
		}
		return []int{op.a, op.c}
	}
	return []int{op.a}
}

// why says what an operation with finite operands did to give a value
// that is not finite.
func why(op op, r []float64) string {
	a, b := r[op.a], r[op.b]
	const overflow = "an overflow: the value is beyond the range of float64"
	switch op.code {
	case opDiv:
		if b == 0 {
			return "division by zero"
		}
		return overflow + " (a division)"
	case opPowInt, opPow, opPowX:
		e := float64(op.n)
		if op.code == opPow {
			e = op.k
		} else if op.code == opPowX {
			e = b
		}
		switch {
		case a == 0 && e < 0:
			return "zero raised to a negative power"
		case a < 0 && e != math.Trunc(e):
			return "a fractional power of a negative number"
		}
		return overflow + " (a power)"
	case opSqrt:
		return "square root of a negative number"
	case opLn, opLog10:
		if a == 0 {
			return "logarithm of zero"
		}
		return "logarithm of a negative number"
	case opAsin:
		return "asin of a number outside [−1, 1]"
	case opAcos:
		return "acos of a number outside [−1, 1]"
	case opExp:
		return overflow + " (exp)"
	case opMul:
		return overflow + " (a product)"
	case opAdd, opSub:
		return overflow + " (a sum)"
	}
	return overflow
}
