package formula

import (
	"fmt"
	"math"
	"slices"
	"unicode/utf8"

	"similis.dev/similis/quantity"
)

// Func is a function that a formula may call by its name, with the
// dimensions of its arguments and of its result declared, so that a call
// is checked when the text is compiled: a property correlation
// nu_water(T), a fluid's density rho_air(T, p).
//
// Eval receives the arguments in SI, in the order of Args, and returns the
// result in SI. It must not keep args, and it is called from one goroutine
// per Evaluator. An argument outside the range where the function is
// defined (a correlation's temperature range) is an error, which an
// Evaluator reports with the row and the statement (see Error, OpCheck); such
// an error should match quantity.ErrRange under errors.Is. A function is
// never called with a missing (NaN) argument: its result is then missing.
// An error, or a result that is not finite, is treated as any result that
// is not finite (see Check): reported by default, marked missing under
// MarkMissing, and NaN under Unchecked.
//
// Deriv, if not nil, writes into grad the partial derivative of the result
// with respect to each argument, ∂f/∂argⱼ in SI, at args; Gradient needs it
// for every function a program calls and refuses a program calling a
// function without it.
type Func struct {
	Name   string
	Args   []quantity.Dim
	Result quantity.Dim
	Eval   func(args []float64) (float64, error)
	Deriv  func(args, grad []float64) error
}

// Options are the choices of Options.Compile. The zero value is what the
// package function Compile does.
type Options struct {
	// Funcs are functions that the text may call besides the built-in
	// ones. Their names may not be those of built-in functions or repeat.
	// A call whose arguments depend on no input is evaluated once, when
	// the text is compiled; its error is then the compile error.
	Funcs []Func
	// Keep, if not nil, names the statements that are the program's
	// results, in the order of Outputs; the others are intermediate
	// values, evaluated and checked but given no column. A bare
	// expression cannot be named.
	Keep []string
}

// builtin reports whether name is a function of the language itself.
func builtin(name string) bool {
	_, ok := unary[name]
	return ok || slices.Contains([]string{"min", "max", "hypot", "atan2", "if", "solve"}, name)
}

// library checks the functions given to Compile.
func (c *compiler) library(fs []Func) error {
	fs = slices.Clone(fs)
	bad := func(format string, a ...any) error {
		return &Error{Op: OpCompile, Row: -1, Input: c.p.src, Reason: fmt.Sprintf(format, a...), Class: quantity.ErrInvalid}
	}
	for i := range fs {
		f := &fs[i]
		r, _ := utf8.DecodeRuneInString(f.Name)
		ok := f.Name != "" && isNameStart(r)
		for _, r := range f.Name {
			ok = ok && isNameRune(r)
		}
		switch {
		case !ok:
			return bad("function %q: a function's name is a name, letters, digits and '_' starting with a letter", f.Name)
		case builtin(f.Name):
			return bad("function %q: the name of a built-in function", f.Name)
		case c.funcs[f.Name] != nil:
			return bad("function %q is given twice", f.Name)
		case f.Eval == nil:
			return bad("function %q has no Eval", f.Name)
		}
		f.Args = slices.Clone(f.Args)
		c.funcs[f.Name] = f
	}
	return nil
}

// keep chooses the statements that are results.
func (c *compiler) keep(names []string) error {
	if names == nil {
		for i := range c.p.outputs {
			c.p.kept = append(c.p.kept, i)
		}
		return nil
	}
	c.p.kept = []int{}
	for _, name := range names {
		k := slices.IndexFunc(c.p.outputs, func(o output) bool { return o.name == name && name != "" })
		switch {
		case k < 0:
			return &Error{Op: OpCompile, Row: -1, Input: c.p.src, Reason: fmt.Sprintf("Keep names %q, which no statement assigns", name), Class: quantity.ErrUnknown}
		case slices.Contains(c.p.kept, k):
			return &Error{Op: OpCompile, Row: -1, Input: c.p.src, Reason: fmt.Sprintf("Keep names %q twice", name), Class: quantity.ErrInvalid}
		}
		c.p.kept = append(c.p.kept, k)
	}
	return nil
}

// call is a call of a function of the library (fn not nil), or a solve.
type call struct {
	fn    *Func
	args  []int // the slots of the arguments; for a solve, of the bracket's ends
	reads []int // the slots it reads from outside: args, and what the equation names
	// A solve: the equation's operations, which set slot g from the
	// unknown in slot x.
	body    []op
	bodyPos []int
	x, g    int
	name    string // the unknown
}

// funcClass is the class of a function's error: its own, or ErrRange.
func funcClass(err error) error { return causeClass(err, quantity.ErrRange) }

func (c *compiler) callFunc(n *node, f *Func) (int, typ, error) {
	if len(n.args) != len(f.Args) {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("%s takes %d arguments, not %d", f.Name, len(f.Args), len(n.args))}
	}
	slots := make([]int, len(n.args))
	known := true
	for i, a := range n.args {
		s, t, err := c.expr(a)
		if err != nil {
			return 0, typ{}, err
		}
		if t.cond {
			return 0, typ{}, c.dimErr(a.pos, "a comparison is not a quantity: use it in if(…)")
		}
		if t.dim != f.Args[i] {
			return 0, typ{}, c.dimErr(a.pos, "argument %d of %s is %s, not %s", i+1, f.Name, describe(t.dim), describe(f.Args[i]))
		}
		slots[i] = s
		known = known && c.konst[s]
	}
	c.pos = n.pos
	if known {
		args := make([]float64, len(slots))
		for i, s := range slots {
			args[i] = c.vals[s]
		}
		v, err := f.Eval(args)
		if err != nil {
			return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: f.Name, Err: err, Class: funcClass(err)}
		}
		if !finite(v) {
			return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("%s gives %v, not a finite number", f.Name, v), Class: quantity.ErrRange}
		}
		return c.out(op{code: opConst, k: v}, f.Result)
	}
	c.p.calls = append(c.p.calls, call{fn: f, args: slots, reads: slots})
	c.p.fargs = max(c.p.fargs, len(slots))
	return c.out(op{code: opFunc, n: len(c.p.calls) - 1}, f.Result)
}

// solveExpr compiles solve(x, lhs = rhs, lo, hi).
func (c *compiler) solveExpr(n *node) (int, typ, error) {
	if c.solve {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: "a solve inside the equation of a solve", Class: quantity.ErrInvalid}
	}
	if _, exists := c.names[n.name]; exists || n.name == "pi" || n.name == "π" {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("the unknown %q of solve is already a name: choose another", n.name), Class: quantity.ErrInvalid}
	}
	k := len(n.args)
	var ends [2]int
	var dims [2]quantity.Dim
	for i, a := range n.args[k-2:] {
		s, t, err := c.expr(a)
		if err != nil {
			return 0, typ{}, err
		}
		if t.cond {
			return 0, typ{}, c.dimErr(a.pos, "a comparison is not a quantity: use it in if(…)")
		}
		ends[i], dims[i] = s, t.dim
	}
	if dims[0] != dims[1] {
		return 0, typ{}, c.dimErr(n.args[k-1].pos, "the ends of the bracket of solve differ: %s and %s", describe(dims[0]), describe(dims[1]))
	}
	x := c.p.slots
	c.p.slots++
	c.vals = append(c.vals, 0)
	c.names[n.name], c.dims[x] = x, dims[0]
	ops, pos := c.p.ops, c.p.opPos
	c.p.ops, c.p.opPos = nil, nil
	c.solve = true
	g, err := c.equation(n)
	body, bodyPos := c.p.ops, c.p.opPos
	c.p.ops, c.p.opPos = ops, pos
	c.solve = false
	delete(c.names, n.name)
	c.refs = slices.DeleteFunc(c.refs, func(s int) bool { return s == x })
	if err != nil {
		return 0, typ{}, err
	}
	cl := call{args: ends[:], body: body, bodyPos: bodyPos, x: x, g: g, name: n.name, reads: []int{ends[0], ends[1]}}
	made := map[int]bool{x: true}
	uses := g == x
	for _, o := range body {
		for _, s := range c.p.reads(o) {
			uses = uses || s == x
			if !made[s] && !slices.Contains(cl.reads, s) {
				cl.reads = append(cl.reads, s)
			}
		}
		made[o.dst] = true
	}
	if !uses {
		return 0, typ{}, &Error{Op: OpCompile, Row: -1, Input: c.p.src, Offset: n.pos, Reason: fmt.Sprintf("the equation of solve does not contain the unknown %q", n.name), Class: quantity.ErrInvalid}
	}
	c.p.calls = append(c.p.calls, cl)
	c.pos = n.pos
	return c.out(op{code: opSolve, n: len(c.p.calls) - 1}, dims[0])
}

// equation compiles the equation of a solve as one slot, lhs − rhs, that
// is zero at the root.
func (c *compiler) equation(n *node) (int, error) {
	l, tl, err := c.expr(n.args[0])
	if err != nil {
		return 0, err
	}
	if tl.cond {
		return 0, c.dimErr(n.args[0].pos, "the equation of solve is a quantity, or two equal ones: lhs = rhs")
	}
	if len(n.args) == 3 {
		return l, nil
	}
	r, tr, err := c.expr(n.args[1])
	if err != nil {
		return 0, err
	}
	if tr.cond {
		return 0, c.dimErr(n.args[1].pos, "the equation of solve is a quantity, or two equal ones: lhs = rhs")
	}
	if tl.dim != tr.dim {
		return 0, c.dimErr(n.args[1].pos, "the two sides of the equation of solve differ: %s and %s", describe(tl.dim), describe(tr.dim))
	}
	c.pos = n.pos
	return c.emit(op{code: opSub, a: l, b: r}), nil
}

// reads returns the slots operation o reads.
func (p *Program) reads(o op) []int {
	if o.code >= opFunc {
		return p.calls[o.n].reads
	}
	return reads(o)
}

// scalar computes one operation on the registers r, with fargs room for
// the arguments of a function.
func (p *Program) scalar(o op, r, fargs []float64) float64 {
	switch o.code {
	case opFunc:
		v, _ := p.call(o, r, fargs)
		return v
	case opSolve:
		v, _ := p.root(&p.calls[o.n], r, fargs)
		return v
	}
	return scalar(o, r)
}

// call calls a function of the library. A missing argument makes the
// result missing; an error or a result that is not finite is NaN, and the
// error is returned for a report.
func (p *Program) call(o op, r, fargs []float64) (float64, error) {
	c := &p.calls[o.n]
	a := fargs[:len(c.args)]
	for j, s := range c.args {
		if math.IsNaN(r[s]) {
			return math.NaN(), nil
		}
		a[j] = r[s]
	}
	v, err := c.fn.Eval(a)
	if err != nil || !finite(v) {
		return math.NaN(), err
	}
	return v, nil
}

// Bounds of the root finder.
const maxIter = 200

// rootStatus says why a solve has no root: no bracket, an equation that
// is not finite, no convergence.
type rootStatus struct {
	code   uint8 // 0 a root; rootMissing, rootOrder, rootBracket, rootNotFinite, rootIter
	x1, g1 float64
	x2, g2 float64
}

const (
	rootOK uint8 = iota
	rootMissing
	rootOrder
	rootBracket
	rootNotFinite
	rootIter
)

// equation evaluates the equation of a solve at x, in the registers r.
func (p *Program) equation(c *call, x float64, r, fargs []float64) float64 {
	r[c.x] = x
	for _, o := range c.body {
		r[o.dst] = p.scalar(o, r, fargs)
	}
	return r[c.g]
}

// root finds the root of a solve's equation within its bracket by Brent's
// method (inverse quadratic interpolation, secant steps and bisection),
// in at most maxIter evaluations, to a few units in the last place of x.
// It returns NaN when there is none, with the reason.
func (p *Program) root(c *call, r, fargs []float64) (float64, rootStatus) {
	a, b := r[c.args[0]], r[c.args[1]]
	nan := math.NaN()
	switch {
	case math.IsNaN(a) || math.IsNaN(b):
		return nan, rootStatus{code: rootMissing}
	case !(a < b) || !finite(a) || !finite(b):
		return nan, rootStatus{code: rootOrder, x1: a, x2: b}
	}
	fa, fb := p.equation(c, a, r, fargs), p.equation(c, b, r, fargs)
	switch {
	case !finite(fa):
		return nan, rootStatus{code: rootNotFinite, x1: a, g1: fa}
	case !finite(fb):
		return nan, rootStatus{code: rootNotFinite, x1: b, g1: fb}
	case fa == 0:
		return a, rootStatus{}
	case fb == 0:
		return b, rootStatus{}
	case (fa > 0) == (fb > 0):
		return nan, rootStatus{code: rootBracket, x1: a, g1: fa, x2: b, g2: fb}
	}
	cc, fc := b, fb
	var d, e float64
	for range maxIter {
		if (fb > 0) == (fc > 0) {
			cc, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, cc = b, cc, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*0x1p-52*math.Abs(b) + 0x1p-1000
		m := 0.5 * (cc - b)
		if math.Abs(m) <= tol || fb == 0 {
			return b, rootStatus{}
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			s := fb / fa
			var pp, q float64
			if a == cc {
				pp, q = 2*m*s, 1-s
			} else {
				q0, r0 := fa/fc, fb/fc
				pp = s * (2*m*q0*(q0-r0) - (b-a)*(r0-1))
				q = (q0 - 1) * (r0 - 1) * (s - 1)
			}
			if pp > 0 {
				q = -q
			} else {
				pp = -pp
			}
			if 2*pp < min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e, d = d, pp/q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, fa = b, fb
		switch {
		case math.Abs(d) > tol:
			b += d
		case m > 0:
			b += tol
		default:
			b -= tol
		}
		fb = p.equation(c, b, r, fargs)
		if !finite(fb) {
			return nan, rootStatus{code: rootNotFinite, x1: b, g1: fb}
		}
	}
	return nan, rootStatus{code: rootIter, x1: b, g1: fb}
}

// whyCall says why a function call or a solve gave a value that is not
// finite, with the function's error if it gave one.
func (p *Program) whyCall(o op, r []float64) (string, error) {
	c := &p.calls[o.n]
	fargs := make([]float64, p.fargs) // an error's cold path
	if o.code == opFunc {
		v, err := p.call(o, r, fargs)
		if err != nil {
			return c.fn.Name, err
		}
		if math.IsNaN(v) {
			v, _ = c.fn.Eval(fargs[:len(c.args)])
		}
		return fmt.Sprintf("%s gives %v", c.fn.Name, v), nil
	}
	_, st := p.root(c, r, fargs)
	switch st.code {
	case rootOrder:
		return fmt.Sprintf("solve for %s: the bracket %v … %v is not two finite numbers, the lower first", c.name, st.x1, st.x2), nil
	case rootBracket:
		return fmt.Sprintf("solve for %s: no root is bracketed: the equation is %v at %s = %v and %v at %s = %v, of one sign", c.name, st.g1, c.name, st.x1, st.g2, c.name, st.x2), nil
	case rootNotFinite:
		return fmt.Sprintf("solve for %s: the equation is %v at %s = %v, not finite", c.name, st.g1, c.name, st.x1), nil
	case rootIter:
		return fmt.Sprintf("solve for %s: no convergence in %d steps (last %s = %v)", c.name, maxIter, c.name, st.x1), nil
	}
	return "solve for " + c.name + ": no root", nil
}
