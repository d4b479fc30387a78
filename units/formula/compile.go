package formula

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Input names a variable of a formula and gives its dimension.
type Input struct {
	Name string
	Dim  quantity.Dim
}

var errTooBig = errors.New("exponent too large")

type opcode uint8

const (
	opConst opcode = iota
	opNeg
	opAdd
	opSub
	opMul
	opDiv
	opPowInt
	opPow // math.Pow with a constant exponent
	opPowX
	opSqrt
	opCbrt
	opExp
	opLn
	opLog10
	opAbs
	opMin
	opMax
	opHypot
	opSin
	opCos
	opTan
	opAsin
	opAcos
	opAtan
	opAtan2
	opLT
	opLE
	opGT
	opGE
	opEQ
	opNE
	opAnd
	opOr
	opIf
	opFunc  // a function of a library: calls[n]
	opSolve // a root of an equation: calls[n]
)

// op computes slot dst from slots a, b, c.
type op struct {
	code    opcode
	dst     int
	a, b, c int
	k       float64 // constant, or exponent
	n       int     // integer exponent
}

// Program is a compiled formula text. It is immutable and safe for
// concurrent use; evaluate it with an Evaluator.
type Program struct {
	src     string
	stmts   []stmt
	inputs  []Input
	ops     []op
	opPos   []int // per operation, the byte offset of its operator in the text
	slots   int
	outputs []output // every statement, in the order of the text
	kept    []int    // the statements that are results, in the order of Outputs
	calls   []call   // the function calls and solve expressions, by op.n
	fargs   int      // the most arguments of a function call
}

type output struct {
	name   string // "" for the bare result
	slot   int
	dim    quantity.Dim
	pos    int     // byte offset of the statement
	lo, hi int     // the statement's operations, ops[lo:hi]
	refs   []int   // the slots of the inputs and earlier results it names
	konst  bool    // its value is known at compile time
	val    float64 // that value
}

// Compile reads a formula text and checks it against the dimensions of
// its inputs. Every name a statement uses must be an input or assigned
// by an earlier statement; an input may not be assigned. It is
// Options{}.Compile: the built-in functions only, and every statement a
// result.
func Compile(src string, inputs ...Input) (*Program, error) {
	return Options{}.Compile(src, inputs...)
}

// Compile reads a formula text and checks it against the dimensions of
// its inputs, as the package function Compile does, with the functions of
// o.Funcs callable and only the statements o.Keep names as results.
func (o Options) Compile(src string, inputs ...Input) (*Program, error) {
	stmts, err := parseText(src)
	if err != nil {
		return nil, err
	}
	c := &compiler{p: &Program{src: src, stmts: stmts, inputs: append([]Input(nil), inputs...)}, names: map[string]int{}, dims: map[int]quantity.Dim{},
		funcs: map[string]*Func{}, konst: map[int]bool{}}
	if err := c.library(o.Funcs); err != nil {
		return nil, err
	}
	for i, in := range inputs {
		if _, dup := c.names[in.Name]; dup {
			return nil, &Error{Op: OpCompile, Row: -1, Input: src, Reason: fmt.Sprintf("input %q is given twice", in.Name), Class: quantity.ErrInvalid}
		}
		c.names[in.Name] = i
		c.dims[i] = in.Dim
	}
	c.p.slots = len(inputs)
	c.vals = make([]float64, c.p.slots)
	for _, st := range stmts {
		lo := len(c.p.ops)
		c.refs = nil
		slot, d, err := c.expr(st.e)
		if err != nil {
			return nil, err
		}
		if d.cond {
			return nil, c.dimErr(st.e.pos, "a comparison is not a quantity: use it in if(…)")
		}
		if st.name != "" {
			if _, exists := c.names[st.name]; exists {
				return nil, &Error{Op: OpCompile, Row: -1, Input: src, Offset: st.pos, Reason: fmt.Sprintf("%q is already defined", st.name), Class: quantity.ErrInvalid}
			}
			c.names[st.name] = slot
		}
		c.dims[slot] = d.dim
		c.p.outputs = append(c.p.outputs, output{name: st.name, slot: slot, dim: d.dim, pos: st.pos, lo: lo, hi: len(c.p.ops), refs: c.refs, konst: c.konst[slot], val: c.vals[slot]})
	}
	if err := c.keep(o.Keep); err != nil {
		return nil, err
	}
	return c.p, nil
}

type compiler struct {
	p     *Program
	names map[string]int // name → slot
	dims  map[int]quantity.Dim
	refs  []int // the slots the statement being compiled names
	pos   int   // the offset of the operator being compiled
	funcs map[string]*Func
	konst map[int]bool // the slots whose value is known at compile time
	vals  []float64    // per slot, the value of a known one
	solve bool         // compiling the equation of a solve
}

// typ is a node's type: a quantity of a dimension, or a condition.
type typ struct {
	dim  quantity.Dim
	cond bool
}

func (c *compiler) dimErr(at int, format string, a ...any) error {
	return &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: at, Reason: fmt.Sprintf(format, a...), Dimension: true}
}

// describe names a dimension with its kind and a unit: "pressure [Pa]".
func describe(d quantity.Dim) string {
	u := units.BaseUnit(d)
	if du, ok := units.DerivedUnit(d); ok {
		u = du
	}
	kind := quantity.KindName(d)
	if d.IsDimensionless() {
		kind = "a number"
	}
	if kind == "" {
		return "[" + u.Format(quantity.Unicode) + "]"
	}
	if d.IsDimensionless() {
		return kind
	}
	return kind + " [" + u.Format(quantity.Unicode) + "]"
}

func (c *compiler) emit(o op) int {
	o.dst = c.p.slots
	c.p.slots++
	c.vals = append(c.vals, 0)
	if o.code == opConst {
		c.konst[o.dst], c.vals[o.dst] = true, o.k
	} else if o.code < opFunc && c.known(o) {
		// Bound now: every operand is known. A value that is not finite
		// stays an operation, so that evaluation reports it as before.
		if v := scalar(o, c.vals); finite(v) {
			o = op{code: opConst, dst: o.dst, k: v}
			c.konst[o.dst], c.vals[o.dst] = true, v
		}
	}
	c.p.ops = append(c.p.ops, o)
	c.p.opPos = append(c.p.opPos, c.pos)
	return o.dst
}

// known reports whether every slot op o reads has a value known at
// compile time.
func (c *compiler) known(o op) bool {
	for _, s := range reads(o) {
		if !c.konst[s] {
			return false
		}
	}
	return true
}

// reads returns the slots a built-in operation reads.
func reads(o op) []int {
	switch o.code {
	case opConst:
		return nil
	case opAdd, opSub, opMul, opDiv, opPowX, opMin, opMax, opHypot, opAtan2, opLT, opLE, opGT, opGE, opEQ, opNE, opAnd, opOr:
		return []int{o.a, o.b}
	case opIf:
		return []int{o.a, o.b, o.c}
	}
	return []int{o.a}
}

func (c *compiler) expr(n *node) (int, typ, error) {
	switch n.k {
	case kNum:
		// A number's unit is its dimension wherever its slot is used,
		// also through a name it is assigned to.
		c.pos = n.pos
		return c.out(op{code: opConst, k: n.val}, n.dim)
	case kRef:
		slot, ok := c.names[n.name]
		if !ok && (n.name == "pi" || n.name == "π") {
			c.pos = n.pos
			return c.out(op{code: opConst, k: math.Pi}, quantity.Dimensionless)
		}
		if !ok {
			return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("unknown name %q: not an input and not assigned before", n.name), Class: quantity.ErrUnknown}
		}
		if !slices.Contains(c.refs, slot) {
			c.refs = append(c.refs, slot)
		}
		return slot, typ{dim: c.slotDim(slot)}, nil
	}
	if n.k == kSolve {
		c.pos = n.pos
		return c.solveExpr(n)
	}
	var slots [3]int
	var types [3]typ
	if n.k != kCall {
		for i, a := range n.args {
			s, t, err := c.expr(a)
			if err != nil {
				return 0, typ{}, err
			}
			if t.cond && n.k != kAnd && n.k != kOr {
				return 0, typ{}, c.dimErr(a.pos, "a comparison is not a quantity: use it in if(…)")
			}
			slots[i], types[i] = s, t
		}
	}
	a, b := slots[0], slots[1]
	ta, tb := types[0].dim, types[1].dim
	c.pos = n.pos
	switch n.k {
	case kNeg:
		return c.out(op{code: opNeg, a: a}, ta)
	case kAdd, kSub:
		if ta != tb {
			verb := "add"
			if n.k == kSub {
				verb = "subtract"
			}
			return 0, typ{}, c.dimErr(n.pos, "cannot %s %s and %s", verb, describe(ta), describe(tb))
		}
		code := opAdd
		if n.k == kSub {
			code = opSub
		}
		return c.out(op{code: code, a: a, b: b}, ta)
	case kMul, kDiv:
		var d quantity.Dim
		var err error
		code := opMul
		if n.k == kMul {
			d, err = ta.Mul(tb)
		} else {
			code = opDiv
			d, err = ta.Div(tb)
		}
		if err != nil {
			return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Dimension: true, Class: causeClass(err, quantity.ErrDimension), Err: err}
		}
		return c.out(op{code: code, a: a, b: b}, d)
	case kPow:
		e := n.exp
		d := ta
		if !ta.IsDimensionless() {
			var err error
			if e.Num() > math.MaxInt32 || e.Num() < math.MinInt32 || e.Den() > math.MaxInt32 {
				err = errTooBig
			} else {
				d, err = ta.Pow(int(e.Num()), int(e.Den()))
			}
			if err != nil {
				return 0, typ{}, c.dimErr(n.pos, "cannot raise %s to the power %s: the dimension cannot hold it", describe(ta), e)
			}
		}
		if e.IsInt() && e.Num() >= -16 && e.Num() <= 16 {
			return c.out(op{code: opPowInt, a: a, n: int(e.Num())}, d)
		}
		return c.out(op{code: opPow, a: a, k: n.expF}, d)
	case kPowX:
		if !ta.IsDimensionless() || !tb.IsDimensionless() {
			return 0, typ{}, c.dimErr(n.pos, "a power with a computed exponent needs a dimensionless base and exponent, not %s to the power %s (write an exact exponent: x^2, x^(1/3))", describe(ta), describe(tb))
		}
		return c.out(op{code: opPowX, a: a, b: b}, ta)
	case kCmp:
		if ta != tb {
			return 0, typ{}, c.dimErr(n.pos, "cannot compare %s and %s", describe(ta), describe(tb))
		}
		code := map[string]opcode{"<": opLT, "<=": opLE, ">": opGT, ">=": opGE, "==": opEQ, "!=": opNE}[n.name]
		s := c.emit(op{code: code, a: a, b: b})
		return s, typ{cond: true}, nil
	case kAnd, kOr:
		if !types[0].cond || !types[1].cond {
			return 0, typ{}, c.dimErr(n.pos, "'and' and 'or' join comparisons")
		}
		code := opAnd
		if n.k == kOr {
			code = opOr
		}
		return c.emit(op{code: code, a: a, b: b}), typ{cond: true}, nil
	case kCall:
		return c.call(n)
	}
	return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: "unknown construct", Class: quantity.ErrInvalid}
}

func (c *compiler) slotDim(slot int) quantity.Dim {
	if slot < len(c.p.inputs) {
		return c.p.inputs[slot].Dim
	}
	return c.dims[slot]
}

func (c *compiler) out(o op, d quantity.Dim) (int, typ, error) {
	s := c.emit(o)
	c.dims[s] = d
	return s, typ{dim: d}, nil
}

var unary = map[string]opcode{"sqrt": opSqrt, "cbrt": opCbrt, "exp": opExp, "ln": opLn, "log": opLn, "log10": opLog10, "abs": opAbs,
	"sin": opSin, "cos": opCos, "tan": opTan, "asin": opAsin, "acos": opAcos, "atan": opAtan}

func (c *compiler) call(n *node) (int, typ, error) {
	if f, ok := c.funcs[n.name]; ok {
		return c.callFunc(n, f)
	}
	want := map[string]int{"min": 2, "max": 2, "hypot": 2, "atan2": 2, "if": 3}[n.name]
	code, isUnary := unary[n.name]
	if isUnary {
		want = 1
	}
	if want == 0 {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("unknown function %q", n.name), Class: quantity.ErrUnknown}
	}
	if len(n.args) != want {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("%s takes %d arguments, not %d", n.name, want, len(n.args))}
	}
	var slots [3]int
	var types [3]typ
	for i, a := range n.args {
		s, t, err := c.expr(a)
		if err != nil {
			return 0, typ{}, err
		}
		if t.cond != (n.name == "if" && i == 0) {
			if t.cond {
				return 0, typ{}, c.dimErr(a.pos, "a comparison is not a quantity: use it as the first argument of if(…)")
			}
			return 0, typ{}, c.dimErr(a.pos, "the first argument of if must be a comparison")
		}
		slots[i], types[i] = s, t
	}
	ta := types[0].dim
	c.pos = n.pos
	switch {
	case isUnary:
		switch code {
		case opSqrt, opCbrt:
			den := 2
			if code == opCbrt {
				den = 3
			}
			d, err := ta.Pow(1, den)
			if err != nil {
				return 0, typ{}, c.dimErr(n.pos, "cannot take the %s of %s: the dimension cannot hold it", n.name, describe(ta))
			}
			return c.out(op{code: code, a: slots[0]}, d)
		case opAbs:
			return c.out(op{code: code, a: slots[0]}, ta)
		}
		if !ta.IsDimensionless() {
			return 0, typ{}, c.dimErr(n.args[0].pos, "cannot take %s of %s: the argument must be dimensionless", n.name, describe(ta))
		}
		return c.out(op{code: code, a: slots[0]}, ta)
	case n.name == "if":
		if types[1].dim != types[2].dim {
			return 0, typ{}, c.dimErr(n.pos, "the branches of if differ: %s and %s", describe(types[1].dim), describe(types[2].dim))
		}
		return c.out(op{code: opIf, a: slots[0], b: slots[1], c: slots[2]}, types[1].dim)
	}
	tb := types[1].dim
	if ta != tb {
		return 0, typ{}, c.dimErr(n.pos, "%s needs arguments of one dimension, not %s and %s", n.name, describe(ta), describe(tb))
	}
	switch n.name {
	case "min":
		return c.out(op{code: opMin, a: slots[0], b: slots[1]}, ta)
	case "max":
		return c.out(op{code: opMax, a: slots[0], b: slots[1]}, ta)
	case "hypot":
		return c.out(op{code: opHypot, a: slots[0], b: slots[1]}, ta)
	}
	return c.out(op{code: opAtan2, a: slots[0], b: slots[1]}, quantity.Dimensionless)
}

// Outputs returns the names of the program's results in order: each
// assigned name, and "" for a bare expression; with Options.Keep, the
// names it lists, in its order.
func (p *Program) Outputs() []string {
	out := make([]string, len(p.kept))
	for i, k := range p.kept {
		out[i] = p.outputs[k].name
	}
	return out
}

// Dim returns the dimension of result i (in the order of Outputs).
func (p *Program) Dim(i int) quantity.Dim { return p.outputs[p.kept[i]].dim }

// Constant reports whether result i (in the order of Outputs) depends on
// no input, and its value if so: such a statement is computed once, when
// the text is compiled, and costs no work per row.
func (p *Program) Constant(i int) (float64, bool) {
	o := p.outputs[p.kept[i]]
	if !o.konst {
		return 0, false
	}
	return o.val, true
}

// Inputs returns the inputs the program was compiled for.
func (p *Program) Inputs() []Input { return append([]Input(nil), p.inputs...) }

// String returns the formula text.
func (p *Program) String() string { return p.src }
