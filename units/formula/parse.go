package formula

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/internal/numlex"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Limits that bound the work of parsing any text.
const (
	MaxLen   = 1 << 16 // bytes of text
	MaxNodes = 4096    // operations, numbers and names
	MaxDepth = 64      // nesting of parentheses and calls
)

// Error is the package's one error type. Op says what failed:
//
//   - OpCompile: a formula that cannot be read or does not compile — the
//     text, the byte offset of the mistake and the reason;
//   - OpEvaluate: values that do not fit a program — a wrong count, a
//     column of another length or dimension;
//   - OpCheck: a result that is not finite, where an Evaluator checks them
//     (CheckFinite), also the error of a function of the library
//     (Options.Funcs) at a row, such as a temperature outside a
//     correlation's range, and a solve whose bracket holds no root — the
//     row, the statement, its value and the operation that first gave a
//     value that is not finite.
//
// It matches exactly one class under errors.Is, in Class, and the class is
// the cause's when the cause has one: quantity.ErrDimension for a
// dimension mistake, quantity.ErrUnknown for a name or function that is
// not known, quantity.ErrRange for a text beyond the limits (MaxLen,
// MaxNodes, MaxDepth), a number or a result that is not finite,
// quantity.ErrInvalid for a name defined twice or values that do not fit,
// and quantity.ErrParse for text that cannot be read. When another
// package's error caused it (a unit that cannot be read, a function that
// refused its arguments), Err holds that error and Unwrap returns it.
type Error struct {
	Op        string  // OpCompile, OpEvaluate or OpCheck
	Input     string  // the formula text ("" for OpEvaluate)
	Offset    int     // byte offset in Input of the mistake, or of the operation that first gave a value that is not finite
	Reason    string  // what was wrong: "division by zero", "unknown name \"x\"…", …
	Dimension bool    // a dimension mistake rather than a syntax one (OpCompile)
	Row       int     // OpCheck: the row of the columns given to Series, from 0; −1 for Row, RowQ, Gradient and the other operations
	Statement int     // OpCheck: the statement, counting the statements of the text from 0 (the index of Outputs unless Options.Keep chose them)
	Name      string  // OpCheck: the statement's name, "" for a bare expression
	Value     float64 // OpCheck: the statement's result: +Inf, −Inf or NaN
	Wrt       string  // OpCheck: for a derivative from Gradient, the input it is taken with respect to
	Class     error   // the class; nil for quantity.ErrDimension if Dimension is set, else quantity.ErrParse
	Err       error   // the cause, when another package reported it
}

// The operations an Error reports.
const (
	OpCompile  = "compile"
	OpEvaluate = "evaluate"
	OpCheck    = "check"
)

// Error implements the error interface. It counts rows and statements
// from 1, as a reader does; the fields count from 0.
func (e *Error) Error() string {
	in := e.Input
	if len(in) > 80 {
		in = in[:80] + "…"
	}
	var msg string
	switch e.Op {
	case OpEvaluate:
		msg = "formula: " + e.Reason
	case OpCheck:
		where := ""
		if e.Row >= 0 {
			where = fmt.Sprintf("row %d, ", e.Row+1)
		}
		what := "result"
		if e.Name != "" {
			what = e.Name
		}
		if e.Wrt != "" {
			what = fmt.Sprintf("∂%s/∂%s", what, e.Wrt)
		}
		if e.Err != nil {
			msg = fmt.Sprintf("formula %q: %sstatement %d (counting from 1): %s: at %d: %s", in, where, e.Statement+1, what, e.Offset, e.Reason)
		} else {
			msg = fmt.Sprintf("formula %q: %sstatement %d (counting from 1): %s is %v, not finite: at %d: %s", in, where, e.Statement+1, what, e.Value, e.Offset, e.Reason)
		}
	default:
		msg = fmt.Sprintf("formula %q: at %d: %s", in, e.Offset, e.Reason)
	}
	if e.Err != nil {
		if e.Reason != "" {
			msg += ": "
		}
		msg += e.Err.Error()
	}
	return msg
}

// Unwrap returns the cause, if another package reported it.
func (e *Error) Unwrap() error { return e.Err }

// Is reports whether target is the error's class.
func (e *Error) Is(target error) bool { return target == e.class() }

// class returns the error's class: one of quantity.ErrDimension,
// ErrUnknown, ErrRange, ErrInvalid and ErrParse.
func (e *Error) class() error {
	switch {
	case e.Class != nil:
		return e.Class
	case e.Dimension:
		return quantity.ErrDimension
	}
	return quantity.ErrParse
}

// causeClass returns the class of cause if it has one of the module's
// classes, and def otherwise.
func causeClass(cause, def error) error {
	if c := quantity.ClassOf(cause); c != nil {
		return c
	}
	return def
}

type kind uint8

const (
	kNum kind = iota
	kRef
	kNeg
	kAdd
	kSub
	kMul
	kDiv
	kPow  // exact exponent
	kPowX // exponent an expression
	kCall
	kCmp
	kAnd
	kOr
	kSolve // solve(name, lhs = rhs, lo, hi): args lhs, [rhs,] lo, hi
)

type node struct {
	k    kind
	pos  int
	val  float64      // kNum, in SI
	dim  quantity.Dim // kNum's unit
	name string       // kRef, kCall, kCmp's operator
	args []*node
	exp  quantity.Rat // kPow
	expF float64      // kPow: the exponent as the float64 its text reads as
}

type stmt struct {
	name string // "" for a bare expression
	pos  int
	e    *node
}

type parser struct {
	src   string
	i     int
	depth int
	nodes int
}

func (p *parser) fail(at int, format string, a ...any) error {
	return &Error{Op: OpCompile, Row: -1, Input: p.src, Offset: at, Reason: fmt.Sprintf(format, a...)}
}

// failRange reports text beyond a limit, or a number out of range.
func (p *parser) failRange(at int, format string, a ...any) error {
	return &Error{Op: OpCompile, Row: -1, Input: p.src, Offset: at, Reason: fmt.Sprintf(format, a...), Class: quantity.ErrRange}
}

// parseText reads the statements of a formula text.
func parseText(src string) ([]stmt, error) {
	if len(src) > MaxLen {
		return nil, &Error{Op: OpCompile, Row: -1, Input: src[:64], Offset: MaxLen, Reason: fmt.Sprintf("the text is longer than %d bytes", MaxLen), Class: quantity.ErrRange}
	}
	if !utf8.ValidString(src) {
		return nil, &Error{Op: OpCompile, Row: -1, Input: strings.ToValidUTF8(src, "\uFFFD"), Offset: 0, Reason: "the text is not valid UTF-8"}
	}
	p := &parser{src: src}
	var out []stmt
	for {
		p.skipBlank(true)
		if p.i >= len(p.src) {
			break
		}
		st := stmt{pos: p.i}
		save := p.i
		if name, ok := p.name(); ok {
			p.skipBlank(false)
			if p.peek("=") && !p.peek("==") {
				p.i++
				st.name = name
			} else {
				p.i = save
			}
		}
		e, err := p.expr()
		if err != nil {
			return nil, err
		}
		st.e = e
		out = append(out, st)
		p.skipBlank(false)
		switch {
		case p.i >= len(p.src):
		case p.src[p.i] == '\n' || p.src[p.i] == ';':
			p.i++
		default:
			return nil, p.fail(p.i, "unexpected %q: a statement ends at a new line or ';'", p.rune())
		}
	}
	if len(out) == 0 {
		return nil, p.fail(0, "no statement")
	}
	return out, nil
}

func (p *parser) rune() rune { r, _ := utf8.DecodeRuneInString(p.src[p.i:]); return r }

func (p *parser) peek(s string) bool { return strings.HasPrefix(p.src[p.i:], s) }

// skipBlank skips spaces and comments, and new lines when lines is true.
func (p *parser) skipBlank(lines bool) {
	for p.i < len(p.src) {
		r, n := utf8.DecodeRuneInString(p.src[p.i:])
		switch {
		case r == '#':
			for p.i < len(p.src) && p.src[p.i] != '\n' {
				p.i++
			}
		case r == '\n' && !lines:
			return
		case r == ';' && lines:
			p.i += n
		case unicode.IsSpace(r):
			p.i += n
		default:
			return
		}
	}
}

func isNameStart(r rune) bool { return unicode.IsLetter(r) || r == '_' }
func isNameRune(r rune) bool  { return unicode.IsLetter(r) || unicode.IsDigit(r) || r == '_' }

// name reads a name at p.i.
func (p *parser) name() (string, bool) {
	start := p.i
	r, n := utf8.DecodeRuneInString(p.src[p.i:])
	if !isNameStart(r) {
		return "", false
	}
	p.i += n
	for p.i < len(p.src) {
		r, n := utf8.DecodeRuneInString(p.src[p.i:])
		if !isNameRune(r) {
			break
		}
		p.i += n
	}
	return p.src[start:p.i], true
}

func (p *parser) newNode(k kind, pos int, args ...*node) (*node, error) {
	p.nodes++
	if p.nodes > MaxNodes {
		return nil, p.failRange(pos, "more than %d operations", MaxNodes)
	}
	return &node{k: k, pos: pos, args: args}, nil
}

func (p *parser) enter(at int) error {
	p.depth++
	if p.depth > MaxDepth {
		return p.failRange(at, "nested more than %d deep", MaxDepth)
	}
	return nil
}

// op reads one of the operators at p.i and returns it, or "".
func (p *parser) op(ops ...string) string {
	p.skipBlank(false)
	for _, o := range ops {
		if p.peek(o) {
			p.i += len(o)
			return o
		}
	}
	return ""
}

func (p *parser) expr() (*node, error) { return p.or() }

func (p *parser) or() (*node, error) {
	a, err := p.and()
	if err != nil {
		return nil, err
	}
	for {
		p.skipBlank(false)
		at := p.i
		if !p.keyword("or") {
			return a, nil
		}
		b, err := p.and()
		if err != nil {
			return nil, err
		}
		if a, err = p.newNode(kOr, at, a, b); err != nil {
			return nil, err
		}
	}
}

func (p *parser) and() (*node, error) {
	a, err := p.cmp()
	if err != nil {
		return nil, err
	}
	for {
		p.skipBlank(false)
		at := p.i
		if !p.keyword("and") {
			return a, nil
		}
		b, err := p.cmp()
		if err != nil {
			return nil, err
		}
		if a, err = p.newNode(kAnd, at, a, b); err != nil {
			return nil, err
		}
	}
}

// keyword reads the word w if it stands alone at p.i.
func (p *parser) keyword(w string) bool {
	if !p.peek(w) {
		return false
	}
	if r, _ := utf8.DecodeRuneInString(p.src[p.i+len(w):]); p.i+len(w) < len(p.src) && isNameRune(r) {
		return false
	}
	p.i += len(w)
	return true
}

func (p *parser) cmp() (*node, error) {
	a, err := p.sum()
	if err != nil {
		return nil, err
	}
	at := p.i
	o := p.op("<=", ">=", "==", "!=", "<", ">", "≤", "≥", "≠")
	if o == "" {
		return a, nil
	}
	b, err := p.sum()
	if err != nil {
		return nil, err
	}
	n, err := p.newNode(kCmp, at, a, b)
	if err != nil {
		return nil, err
	}
	n.name = map[string]string{"≤": "<=", "≥": ">=", "≠": "!="}[o]
	if n.name == "" {
		n.name = o
	}
	return n, nil
}

func (p *parser) sum() (*node, error) {
	a, err := p.product()
	if err != nil {
		return nil, err
	}
	for {
		at := p.i
		o := p.op("+", "-", "−")
		if o == "" {
			return a, nil
		}
		b, err := p.product()
		if err != nil {
			return nil, err
		}
		k := kAdd
		if o != "+" {
			k = kSub
		}
		if a, err = p.newNode(k, at, a, b); err != nil {
			return nil, err
		}
	}
}

func (p *parser) product() (*node, error) {
	a, err := p.unary()
	if err != nil {
		return nil, err
	}
	for {
		p.skipBlank(false)
		if p.peek("**") {
			return a, nil
		}
		at := p.i
		o := p.op("*", "/", "×", "·", "÷")
		if o == "" {
			return a, nil
		}
		b, err := p.unary()
		if err != nil {
			return nil, err
		}
		k := kMul
		if o == "/" || o == "÷" {
			k = kDiv
		}
		if a, err = p.newNode(k, at, a, b); err != nil {
			return nil, err
		}
	}
}

func (p *parser) unary() (*node, error) {
	at := p.i
	switch p.op("-", "−", "+") {
	case "-", "−":
		if err := p.enter(at); err != nil {
			return nil, err
		}
		a, err := p.unary()
		p.depth--
		if err != nil {
			return nil, err
		}
		return p.newNode(kNeg, at, a)
	case "+":
		return p.unary()
	}
	return p.power()
}

func (p *parser) power() (*node, error) {
	base, err := p.primary()
	if err != nil {
		return nil, err
	}
	p.skipBlank(false)
	at := p.i
	if o := p.op("^", "**"); o == "" {
		return base, nil
	}
	p.skipBlank(false)
	// An exact exponent: a number, a signed number, or (n/d).
	if r, f, ok := p.exactExponent(); ok {
		n, err := p.newNode(kPow, at, base)
		if err != nil {
			return nil, err
		}
		n.exp, n.expF = r, f
		return n, nil
	}
	if err := p.enter(at); err != nil {
		return nil, err
	}
	e, err := p.unary()
	p.depth--
	if err != nil {
		return nil, err
	}
	return p.newNode(kPowX, at, base, e)
}

// exactExponent reads an exact exponent at p.i if there is one: 2, -1,
// 0.8, (1/3), (-3/2), (0.5). It also returns the float64 the exponent's
// text reads as, so that a decimal exponent evaluates to the very number
// written.
func (p *parser) exactExponent() (quantity.Rat, float64, bool) {
	save := p.i
	paren := p.op("(") != ""
	neg := false
	if o := p.op("-", "−", "+"); o == "-" || o == "−" {
		neg = true
	}
	p.skipBlank(false)
	start := p.i
	num, ok := p.decimal()
	if !ok {
		p.i = save
		return quantity.Rat{}, 0, false
	}
	f, _ := strconv.ParseFloat(p.src[start:p.i], 64)
	if paren {
		if p.op("/") != "" {
			p.skipBlank(false)
			den, ok := p.decimal()
			if !ok || den.IsZero() {
				p.i = save
				return quantity.Rat{}, 0, false
			}
			var err error
			if num, err = num.Div(den); err != nil {
				p.i = save
				return quantity.Rat{}, 0, false
			}
			f = num.Float()
		}
		if p.op(")") == "" {
			p.i = save
			return quantity.Rat{}, 0, false
		}
	} else {
		// A bare number followed by another operand is not an exponent.
		p.skipBlank(false)
		if p.i < len(p.src) && (p.src[p.i] == '{' || p.src[p.i] == '[' || p.src[p.i] == '(') {
			p.i = save
			return quantity.Rat{}, 0, false
		}
	}
	if neg {
		num, f = num.Neg(), -f
	}
	return num, f, true
}

// decimal reads an unsigned decimal number as an exact rational.
func (p *parser) decimal() (quantity.Rat, bool) {
	start := p.i
	num, _ := numlex.Scan(p.src[start:], numlex.NoExponent) // never fails without Grouped
	text := num.Text
	p.i = start + num.End
	if text == "" || text == "." || strings.Count(text, ".") > 1 || len(text) > 24 {
		p.i = start
		return quantity.Rat{}, false
	}
	r, ok := new(big.Rat).SetString(text)
	if !ok || !r.Num().IsInt64() || !r.Denom().IsInt64() {
		p.i = start
		return quantity.Rat{}, false
	}
	q, err := quantity.NewRat(r.Num().Int64(), r.Denom().Int64())
	if err != nil {
		p.i = start
		return quantity.Rat{}, false
	}
	return q, true
}

func (p *parser) primary() (*node, error) {
	p.skipBlank(false)
	at := p.i
	if p.i >= len(p.src) || p.src[p.i] == '\n' || p.src[p.i] == ';' {
		return nil, p.fail(at, "an operand is missing")
	}
	c := p.src[p.i]
	switch {
	case c == '(':
		if err := p.enter(at); err != nil {
			return nil, err
		}
		p.i++
		e, err := p.expr()
		if err != nil {
			return nil, err
		}
		if p.op(")") == "" {
			return nil, p.fail(at, "'(' is never closed")
		}
		p.depth--
		return e, nil
	case c >= '0' && c <= '9' || c == '.':
		return p.number()
	case c == '[' || c == ']':
		return nil, p.fail(at, bracketHelp)
	case c == '{':
		return nil, p.fail(at, "a unit in braces follows a number: 9.80665 {m/s^2}")
	}
	name, ok := p.name()
	if !ok {
		return nil, p.fail(at, "unexpected %q", p.rune())
	}
	p.skipBlank(false)
	if p.peek("{") || p.peek("[") {
		return nil, p.fail(p.i, "a unit in braces follows a number, not a name: write 9.80665 {m/s^2}, or give the name's unit with its input")
	}
	if name == "solve" && p.peek("(") {
		return p.solve(at)
	}
	if !p.peek("(") {
		n, err := p.newNode(kRef, at)
		if err != nil {
			return nil, err
		}
		n.name = name
		return n, nil
	}
	if err := p.enter(at); err != nil {
		return nil, err
	}
	p.i++
	n, err := p.newNode(kCall, at)
	if err != nil {
		return nil, err
	}
	n.name = name
	p.skipBlank(false)
	if p.op(")") == "" {
		for {
			a, err := p.expr()
			if err != nil {
				return nil, err
			}
			n.args = append(n.args, a)
			if p.op(",") != "" {
				continue
			}
			if p.op(")") != "" {
				break
			}
			return nil, p.fail(p.i, "expected ',' or ')' in the arguments of %s", name)
		}
	}
	p.depth--
	return n, nil
}

// solve reads solve(x, lhs = rhs, lo, hi) or solve(x, g, lo, hi) at the
// '(' after the word solve.
func (p *parser) solve(at int) (*node, error) {
	const form = "solve(x, lhs = rhs, lo, hi): the unknown, the equation, and the two ends of a bracket around the root"
	if err := p.enter(at); err != nil {
		return nil, err
	}
	p.i++
	n, err := p.newNode(kSolve, at)
	if err != nil {
		return nil, err
	}
	p.skipBlank(false)
	x, ok := p.name()
	if !ok || p.op(",") == "" {
		return nil, p.fail(p.i, "%s", form)
	}
	n.name = x
	lhs, err := p.expr()
	if err != nil {
		return nil, err
	}
	n.args = append(n.args, lhs)
	if p.op("=") != "" {
		rhs, err := p.expr()
		if err != nil {
			return nil, err
		}
		n.args = append(n.args, rhs)
	}
	for range 2 {
		if p.op(",") == "" {
			return nil, p.fail(p.i, "%s", form)
		}
		e, err := p.expr()
		if err != nil {
			return nil, err
		}
		n.args = append(n.args, e)
	}
	if p.op(")") == "" {
		return nil, p.fail(p.i, "%s", form)
	}
	p.depth--
	return n, nil
}

// bracketHelp is the reason given for a square bracket in a formula.
const bracketHelp = "a unit in a formula is written in braces: 9.80665 {m/s^2}, 20{°C}"

// number reads a number and an optional unit in braces: 9.80665 {m/s^2}.
func (p *parser) number() (*node, error) {
	at := p.i
	num, _ := numlex.Scan(p.src[at:], 0) // never fails without Grouped
	text := num.Text
	p.i = at + num.End
	n, err := p.newNode(kNum, at)
	if err != nil {
		return nil, err
	}
	x, class := numlex.Float(text)
	switch class {
	case numlex.Overflow:
		return nil, p.failRange(at, "%q is beyond the range of float64: it overflows or underflows", text)
	case numlex.Malformed:
		return nil, p.fail(at, "%q is not a number", text)
	case numlex.Underflow:
		return nil, p.failRange(at, "%q is beyond the range of float64: it underflows to zero", text)
	}
	n.val = x
	p.skipBlank(false)
	switch {
	case p.peek("["):
		return nil, p.fail(p.i, bracketHelp)
	case p.peek("{"):
		end := strings.IndexAny(p.src[p.i:], "}\n;")
		if end < 0 || p.src[p.i+end] != '}' {
			return nil, p.fail(p.i, "'{' is never closed: a unit in braces ends with '}' on the same line")
		}
		unitText := p.src[p.i+1 : p.i+end]
		ut := strings.TrimSpace(unitText)
		if ut == "" {
			return nil, p.fail(p.i, "empty braces: a unit goes between them, as in 9.80665 {m/s^2}")
		}
		if c := ut[0]; (c >= '0' && c <= '9' || c == '.') && !strings.HasPrefix(ut, "1/") {
			return nil, p.fail(p.i+1, "{%s} is a number, not a unit: write the value as one number", ut)
		}
		v, err := units.ParseValue(text + " " + unitText)
		if err != nil {
			// The unit's own error, so that the error has one class.
			var ve *units.Error
			if errors.As(err, &ve) && ve.Op == units.OpParseValue && ve.Err != nil {
				err = ve.Err
			}
			return nil, &Error{Op: OpCompile, Row: -1, Input: p.src, Offset: p.i + 1, Reason: fmt.Sprintf("the unit {%s}", unitText), Err: err, Class: causeClass(err, quantity.ErrParse)}
		}
		q := v.Quantity()
		n.val, n.dim = q.Value(), q.Dim()
		p.i += end + 1
		if math.IsNaN(n.val) || math.IsInf(n.val, 0) {
			return nil, p.failRange(at, "%s {%s} is not finite in SI", text, unitText)
		}
	}
	return n, nil
}
