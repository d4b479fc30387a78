package pigroups

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
	"unicode"
	"unicode/utf8"

	"similis.dev/similis/internal/exact"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// Role says whether a variable is the one the test measures.
type Role uint8

// Roles of a variable.
const (
	Independent Role = iota // a variable the test sets or the problem depends on
	Dependent               // the variable measured, at most one per problem
)

// Variable is one variable of a problem: a symbol, its dimension, an
// optional kind of quantity and its role.
type Variable struct {
	// Symbol is any UTF-8 name: "Δp", "ρ", "μ", "D".
	Symbol string
	// Dim is the variable's dimension.
	Dim quantity.Dim
	// Kind names the kind of quantity ("density", "dynamic viscosity",
	// "speed of sound"); see Kinds. Empty means inferred from Dim where
	// that is unambiguous.
	Kind string
	// Role marks the dependent variable.
	Role Role
	// Angle is the measure in which the variable's values count a plane
	// angle, for a rotational speed: Radians (the SI value, rad/s; the
	// zero value) or Revolutions (rev/s, or the cycles per second of a
	// value in Hz, as ISO 80000-3 writes a rotational frequency). It
	// decides the factor 2π between a group and a named group whose
	// definition takes the other measure (K_T = 4π²·T/(ρ·ω²·D⁴) with ω in
	// rad/s, K_T = T/(ρ·n²·D⁴) with n in rev/s).
	Angle AngleMeasure
}

// AngleMeasure says how a variable's values count a plane angle.
type AngleMeasure uint8

// Angle measures.
const (
	Radians     AngleMeasure = iota // rad, the SI value (rad = 1)
	Revolutions                     // rev (1 rev = 2π rad), or cycles
)

// String returns "rad" or "rev".
func (a AngleMeasure) String() string {
	switch a {
	case Radians:
		return "rad"
	case Revolutions:
		return "rev"
	}
	return fmt.Sprintf("AngleMeasure(%d)", uint8(a))
}

// InRevolutions returns v holding its values in revolutions (rev/s).
func (v Variable) InRevolutions() Variable { v.Angle = Revolutions; return v }

// Var returns an independent variable.
func Var(symbol string, d quantity.Dim) Variable { return Variable{Symbol: symbol, Dim: d} }

// VarKind returns an independent variable of a named kind.
func VarKind(symbol string, d quantity.Dim, kind string) Variable {
	return Variable{Symbol: symbol, Dim: d, Kind: kind}
}

// Dep returns the dependent variable.
func Dep(symbol string, d quantity.Dim) Variable {
	return Variable{Symbol: symbol, Dim: d, Role: Dependent}
}

// VarUnit returns a variable whose dimension is that of a unit expression
// ("lbf/ft^2"). Angles are dimensionless, as in the SI.
func VarUnit(symbol, unit string) (Variable, error) {
	u, err := units.Parse(unit)
	if err != nil {
		return Variable{}, &Error{Op: OpProblem, Symbol: symbol, Reason: "its unit does not parse", Err: err}
	}
	return Variable{Symbol: symbol, Dim: u.Dim()}, nil
}

// AsDependent returns v with the dependent role.
func (v Variable) AsDependent() Variable { v.Role = Dependent; return v }

// WithKind returns v with the named kind.
func (v Variable) WithKind(kind string) Variable { v.Kind = kind; return v }

// Errors a problem or a repeating set can be refused with; the concrete
// *Error has one as its Kind.
var (
	ErrNoVariables       = errors.New("no variables")
	ErrDuplicateSymbol   = errors.New("duplicate symbol")
	ErrTwoDependent      = errors.New("more than one dependent variable")
	ErrUnknownKind       = errors.New("unknown kind of quantity")
	ErrKindDimension     = errors.New("kind does not match the dimension")
	ErrRepeatingCount    = errors.New("wrong number of repeating variables")
	ErrRepeatingDep      = errors.New("dependent variable in the repeating set")
	ErrRepeatingUnknown  = errors.New("unknown repeating variable")
	ErrRepeatingSingular = errors.New("repeating variables not independent")
	ErrNoGroups          = errors.New("no dimensionless groups")
	ErrUnknownVariable   = errors.New("unknown variable")
	ErrTooManyVariables  = errors.New("too many variables")
	ErrBadSymbol         = errors.New("bad symbol")
	ErrDependentOnly     = errors.New("a base dimension only the dependent variable carries")
	ErrTooLarge          = errors.New("exponents too large for exact arithmetic")
	ErrForeignGroup      = errors.New("group of another problem")
	ErrNotDimensionless  = errors.New("not dimensionless")
	ErrBadAngle          = errors.New("unknown angle measure")
)

// classOf maps the package's kinds of problem to the module's classes.
func classOf(err error) error {
	switch err {
	case ErrUnknownVariable, ErrRepeatingUnknown, ErrUnknownKind:
		return quantity.ErrUnknown
	case ErrTooLarge, ErrNotFinite:
		return quantity.ErrRange
	case ErrKindDimension, ErrNotDimensionless:
		return quantity.ErrDimension
	case ErrNoVariables, ErrDuplicateSymbol, ErrTwoDependent, ErrRepeatingCount, ErrRepeatingDep, ErrRepeatingSingular,
		ErrNoGroups, ErrTooManyVariables, ErrBadSymbol, ErrDependentOnly, ErrForeignGroup, ErrTooManySets, ErrNotExact, ErrBadAngle,
		ErrTooFewRows, ErrNonPositive, ErrCollinear, ErrFitShape, errInternal:
		return quantity.ErrInvalid
	}
	return nil
}

// errInternal marks a failed internal consistency check, which is a bug.
var errInternal = errors.New("internal error")

// Problem is a list of variables with its dimensional matrix and rank.
type Problem struct {
	vars []varInfo
	rows []quantity.Base // base dimensions that appear, in ISO order
	rank int
	dep  int // index of the dependent variable, or −1

	// The backing array of rows, in the Problem's own allocation.
	rowBuf [quantity.NumBases]quantity.Base
}

// varInfo is a variable with the candidate kinds its dimension can mean,
// found once, so that a problem is two allocations: itself and its
// variables.
type varInfo struct {
	Variable
	// inferred are the kinds Dim can mean, for a variable without a
	// Kind (shared, never modified); nil when Kind is given.
	inferred *[]string
}

// hasKind reports whether k is one of the variable's candidate kinds.
func (v *varInfo) hasKind(k string) bool {
	if v.Kind != "" {
		return v.Kind == k
	}
	return v.inferred != nil && slices.Contains(*v.inferred, k)
}

// sixth returns entry (i, j) of the dimensional matrix in sixths: the
// exponent of base dimension rows[i] in variable j's dimension, as a
// whole number. Scaling a matrix changes neither its rank nor its null
// space, and integers eliminate faster; Matrix and MatrixTable divide by
// six.
func (p *Problem) sixth(i, j int) int64 { return int64(p.vars[j].Dim.Sixths(p.rows[i])) }

// tooLarge reports an overflow of the exact arithmetic as what the user
// did: the variables' exponents are too large (or too many) for 64-bit
// fractions.
func (p *Problem) tooLarge(err error) error {
	if !errors.Is(err, exact.ErrOverflow) && !errors.Is(err, quantity.ErrRange) {
		return err
	}
	var syms []string
	if p != nil {
		for _, v := range p.vars {
			if !v.Dim.IsDimensionless() {
				syms = append(syms, v.Symbol)
			}
		}
	}
	return &Error{Op: OpProblem, Kind: ErrTooLarge, Reason: fmt.Sprintf("the exponents of the variables %s are too large or too many to eliminate exactly in 64-bit fractions; use fewer variables or smaller exponents", strings.Join(syms, ", "))}
}

// MaxVariables bounds the variables of a problem.
const MaxVariables = 64

// maxSymbolLen bounds a variable's symbol, in bytes.
const maxSymbolLen = 64

// badSymbol says why a symbol cannot name a variable, or "".
func badSymbol(s string) string {
	switch {
	case s == "":
		return "the symbol is empty"
	case len(s) > maxSymbolLen:
		return fmt.Sprintf("the symbol is longer than %d bytes", maxSymbolLen)
	case !utf8.ValidString(s):
		return "the symbol is not valid UTF-8"
	}
	for _, r := range s {
		if r < utf8.RuneSelf && r > ' ' && r != 0x7f && !asciiOperator[r] {
			continue // printable ASCII that is no operator, the usual case
		}
		if unicode.IsSpace(r) || unicode.IsControl(r) || strings.ContainsRune("*/^()·=,@", r) {
			return fmt.Sprintf("the symbol may not contain %q (spaces, control characters and the operators * / ^ ( ) · = , @)", r)
		}
	}
	return ""
}

// asciiOperator marks the ASCII operators a symbol may not contain.
var asciiOperator = [utf8.RuneSelf]bool{'*': true, '/': true, '^': true, '(': true, ')': true, '=': true, ',': true, '@': true}

// NewProblem checks the variables and builds the dimensional matrix.
// Symbols must be distinct and non-empty; at most one variable may be
// dependent; a kind, if given, must be known and match the dimension.
func NewProblem(vars ...Variable) (*Problem, error) {
	if len(vars) == 0 {
		return nil, &Error{Op: OpProblem, Kind: ErrNoVariables}
	}
	if len(vars) > MaxVariables {
		return nil, &Error{Op: OpProblem, Kind: ErrTooManyVariables, Reason: fmt.Sprintf("%d variables, at most %d", len(vars), MaxVariables)}
	}
	p := &Problem{vars: make([]varInfo, len(vars)), dep: -1}
	p.rows = p.rowBuf[:0]
	for i, v := range vars {
		if reason := badSymbol(v.Symbol); reason != "" {
			return nil, &Error{Op: OpProblem, Kind: ErrBadSymbol, Symbol: v.Symbol, Reason: fmt.Sprintf("variable %d: %s", i+1, reason)}
		}
		for _, w := range vars[:i] {
			if w.Symbol == v.Symbol {
				return nil, &Error{Op: OpProblem, Kind: ErrDuplicateSymbol, Symbol: v.Symbol}
			}
		}
		if v.Angle > Revolutions {
			return nil, &Error{Op: OpProblem, Kind: ErrBadAngle, Symbol: v.Symbol, Reason: fmt.Sprintf("angle measure %v: want Radians or Revolutions", v.Angle)}
		}
		if v.Role == Dependent {
			if p.dep >= 0 {
				return nil, &Error{Op: OpProblem, Kind: ErrTwoDependent, Symbol: v.Symbol, Reason: fmt.Sprintf("%q is dependent already", vars[p.dep].Symbol)}
			}
			p.dep = i
		}
		if err := checkKind(v); err != nil {
			return nil, err
		}
		p.vars[i].Variable = v
		if v.Kind == "" {
			p.vars[i].inferred = inferKinds(v.Dim)
		}
	}
	for b := quantity.Base(0); b < quantity.NumBases; b++ {
		for _, v := range vars {
			if v.Dim.Sixths(b) != 0 {
				p.rows = append(p.rows, b)
				break
			}
		}
	}
	rank, err := p.matrixRank()
	if err != nil {
		return nil, p.tooLarge(err)
	}
	p.rank = rank
	return p, nil
}

// matrixRank returns the rank of the dimensional matrix.
func (p *Problem) matrixRank() (int, error) {
	var buf [quantity.NumBases]int
	sel, err := p.independent(nil, buf[:0])
	return len(sel), err
}

// independent appends to dst the columns of the dimensional matrix that
// are independent of those before them, taken in the given order (every
// variable's, in variable order, for nil): the greedy choice of a basis.
// Each column is reduced against the ones kept so far, fraction-free on
// vectors of at most NumBases entries, each kept column zero at the
// earlier ones' pivots, until as many are kept as there are rows.
func (p *Problem) independent(order []int, dst []int) ([]int, error) {
	var (
		basis [quantity.NumBases][quantity.NumBases]int64
		pivot [quantity.NumBases]int
	)
	n := len(p.vars)
	if order != nil {
		n = len(order)
	}
	nr, r := len(p.rows), 0
	for k := range n {
		if r == nr {
			break
		}
		j := k
		if order != nil {
			j = order[k]
		}
		var v [quantity.NumBases]int64
		for i := range nr {
			v[i] = p.sixth(i, j)
		}
		for b := range r {
			c := v[pivot[b]]
			if c == 0 {
				continue
			}
			pv := basis[b][pivot[b]]
			g := int64(0)
			for i := range nr {
				x, ok1 := exact.Mul64(pv, v[i])
				y, ok2 := exact.Mul64(c, basis[b][i])
				if !ok1 || !ok2 || y == math.MinInt64 {
					return nil, exact.ErrOverflow
				}
				d, ok := exact.Add64(x, -y)
				if !ok || d == math.MinInt64 {
					return nil, exact.ErrOverflow
				}
				v[i] = d
				g = exact.GCD(g, d)
			}
			if g > 1 {
				for i := range nr {
					v[i] /= g
				}
			}
		}
		for i := range nr {
			if v[i] != 0 {
				basis[r], pivot[r] = v, i
				r++
				dst = append(dst, j)
				break
			}
		}
	}
	return dst, nil
}

// MustProblem is like NewProblem but panics on error; for variables
// written in code.
func MustProblem(vars ...Variable) *Problem {
	p, err := NewProblem(vars...)
	if err != nil {
		panic(err)
	}
	return p
}

// DependentIndex returns the index of the dependent variable, or −1.
func (p *Problem) DependentIndex() int { return p.dep }

// Variables returns a copy of the variables.
func (p *Problem) Variables() []Variable {
	out := make([]Variable, len(p.vars))
	for i, v := range p.vars {
		out[i] = v.Variable
	}
	return out
}

// Rank returns the rank of the dimensional matrix, found by exact
// rational elimination: the number of repeating variables a Pi set needs.
func (p *Problem) Rank() int { return p.rank }

// NumGroups returns n − r, the number of independent dimensionless
// groups (Buckingham's theorem).
func (p *Problem) NumGroups() int { return len(p.vars) - p.rank }

// Bases returns the base dimensions that appear among the variables, in
// ISO order; they are the rows of the dimensional matrix.
func (p *Problem) Bases() []quantity.Base { return slices.Clone(p.rows) }

// Matrix returns the dimensional matrix: one row per base dimension that
// appears (Bases), one column per variable, exact exponents.
func (p *Problem) Matrix() [][]quantity.Rat {
	m := make([][]quantity.Rat, len(p.rows))
	for i, b := range p.rows {
		m[i] = make([]quantity.Rat, len(p.vars))
		for j, v := range p.vars {
			m[i][j] = v.Dim.Exponent(b)
		}
	}
	return m
}

// Kinds returns the candidate kinds of quantity of variable i: its own
// kind if given, or the kinds its dimension can mean. An index outside
// the problem is an error wrapping ErrUnknownVariable.
func (p *Problem) Kinds(i int) ([]string, error) {
	if i < 0 || i >= len(p.vars) {
		return nil, &Error{Op: OpProblem, Kind: ErrUnknownVariable, Reason: fmt.Sprintf("index %d of a problem of %d variables", i, len(p.vars))}
	}
	if k := p.vars[i].Kind; k != "" {
		return []string{k}, nil
	}
	return slices.Clone(*p.vars[i].inferred), nil
}

// Index returns the index of the variable with the given symbol, or an
// error wrapping ErrUnknownVariable that names it.
func (p *Problem) Index(symbol string) (int, error) {
	if i := p.index(symbol); i >= 0 {
		return i, nil
	}
	return -1, &Error{Op: OpProblem, Kind: ErrUnknownVariable, Symbol: symbol, Reason: "not a variable of the problem (" + p.symbols() + ")"}
}

func (p *Problem) symbols() string {
	s := make([]string, len(p.vars))
	for i, v := range p.vars {
		s[i] = v.Symbol
	}
	return strings.Join(s, ", ")
}

// Owns reports whether g is a group of this problem: built from it, or
// from a problem with the same variables (symbols and dimensions) in the
// same order, so that its exponents mean the same variables.
func (p *Problem) Owns(g Group) bool {
	gp := g.Problem()
	if gp == p {
		return true
	}
	return gp != nil && slices.EqualFunc(gp.vars, p.vars, func(a, b varInfo) bool { return a.Symbol == b.Symbol && a.Dim == b.Dim })
}

// CheckGroup returns nil if p owns g, and otherwise an error wrapping
// ErrForeignGroup that names the group.
func (p *Problem) CheckGroup(g Group) error {
	if p.Owns(g) {
		return nil
	}
	if g.Problem() == nil {
		return &Error{Op: OpProblem, Kind: ErrForeignGroup, Reason: "the zero Group belongs to no problem"}
	}
	return &Error{Op: OpProblem, Kind: ErrForeignGroup, Symbol: g.Name, Reason: fmt.Sprintf("%s is a group of the variables %s, not of %s", g, g.prob.symbols(), p.symbols())}
}

// NewGroup returns the group a product of powers of the problem's
// variables names — the factors' names are the variables' symbols, as
// Group.Product writes them — recognised against the catalogue. The
// symbols must be the problem's and the product dimensionless; a symbol
// given twice has its exponents added, as in any product.
func (p *Problem) NewGroup(name string, prod quantity.Product) (Group, error) {
	v := make([]quantity.Rat, len(p.vars))
	for _, f := range prod {
		i, err := p.Index(f.Name)
		if err != nil {
			return Group{}, err
		}
		if v[i], err = v[i].Add(f.Exp); err != nil {
			return Group{}, p.tooLarge(err)
		}
	}
	if !p.dimensionless(v) {
		return Group{}, &Error{Op: OpProblem, Kind: ErrNotDimensionless, Symbol: name, Reason: p.FormatProduct(v, quantity.Unicode) + " has a dimension"}
	}
	g := Group{Name: name, Var: -1, exps: v, prob: p}
	for i, e := range v {
		if e.Sign() > 0 {
			g.Var = i
			break
		}
	}
	g.Matches = p.recognise(v)
	return g, nil
}

func (p *Problem) index(sym string) int {
	for i, v := range p.vars {
		if v.Symbol == sym {
			return i
		}
	}
	return -1
}

// RankNote explains a rank below the number of base dimensions that
// appear, naming the combinations of base dimensions the variables'
// dimensions are made of; it returns "" when the rank equals that number.
//
// For capillary rise with h, σ, ρg and d, every dimension is a product of
// powers of L and M T⁻², so the rank is 2, not 3, and there are two
// groups, not one.
func (p *Problem) RankNote() string {
	if p.rank == len(p.rows) {
		return ""
	}
	names := make([]string, len(p.rows))
	for i, b := range p.rows {
		names[i] = b.String()
	}
	// The nonzero rows of the reduced Aᵀ span the dimensions that occur.
	at := p.ratMatrix().Transpose()
	piv, err := at.RREF()
	if err != nil {
		return ""
	}
	var combos []string
	for r := range piv {
		iv, _, err := integers(at[r])
		if err != nil {
			return ""
		}
		d := quantity.Dimensionless
		ok := true
		for k, x := range iv {
			if x.IsZero() {
				continue
			}
			e, err := quantity.DimOf(p.rows[k], int(x.Num()), 1)
			if err == nil {
				d, err = d.Mul(e)
			}
			if err != nil {
				ok = false
				break
			}
		}
		if !ok {
			return ""
		}
		combos = append(combos, d.String())
	}
	made := "a power of " + combos[0]
	if len(combos) > 1 {
		made = "a product of powers of " + joinAnd(combos)
	}
	counted := len(p.vars) - len(p.rows)
	countText := "none"
	if counted > 0 {
		countText = countNoun(counted, "group", "groups")
	}
	return fmt.Sprintf("the rank is %d, less than the %s that appear (%s): every variable's dimension is %s, and only %s of the base dimensions %s independent; so there %s %s (%s less the rank %d), where counting base dimensions would give %s",
		p.rank, countNoun(len(p.rows), "base dimension", "base dimensions"), strings.Join(names, ", "), made,
		countNoun(p.rank, "combination", "combinations"), plural(p.rank, "is", "are"),
		plural(p.NumGroups(), "is", "are"), countNoun(p.NumGroups(), "group", "groups"),
		countNoun(len(p.vars), "variable", "variables"), p.rank, countText)
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func countNoun(n int, one, many string) string { return fmt.Sprintf("%d %s", n, plural(n, one, many)) }

func joinAnd(s []string) string {
	switch len(s) {
	case 0:
		return ""
	case 1:
		return s[0]
	}
	return strings.Join(s[:len(s)-1], ", ") + " and " + s[len(s)-1]
}

// intCells is an integer submatrix of a problem held by value, on the
// stack: a row per base dimension, a column per variable at most.
type intCells [quantity.NumBases][MaxVariables]int64

// intColumns returns the integer submatrix of the given columns.
func (p *Problem) intColumns(idx []int) (c intCells) {
	for i := range p.rows {
		for k, j := range idx {
			c[i][k] = p.sixth(i, j)
		}
	}
	return c
}

// The callers view the first columns of an intCells as an exact.IntMatrix
// with its rows in a local array, written out in each so that both stay
// on the stack (a helper storing the rows through a pointer would move
// them to the heap); GaussJordan stores no pointer.

// ratMatrix returns the dimensional matrix, in sixths, as exact
// rationals; it is built when asked for, off the path of PiSet.
func (p *Problem) ratMatrix() exact.Matrix[quantity.Rat] {
	m := exact.NewMatrix[quantity.Rat](len(p.rows), len(p.vars))
	for i := range m {
		for j := range m[i] {
			m[i][j] = quantity.RatInt(p.sixth(i, j))
		}
	}
	return m
}

// columns returns the submatrix of the given columns.
func (p *Problem) columns(idx []int) exact.Matrix[quantity.Rat] {
	m := exact.NewMatrix[quantity.Rat](len(p.rows), len(idx))
	for i := range p.rows {
		for k, j := range idx {
			m[i][k] = quantity.RatInt(p.sixth(i, j))
		}
	}
	return m
}

// CheckRepeating validates a repeating set, exactly as PiSet does: it
// must leave at least one group (a problem of rank equal to its number of
// variables has none, and no set is valid), and it must have exactly Rank
// members, all known, none dependent, carrying every base dimension that
// appears, and independent among themselves. The error is a
// *Error of OpRepeating; when the members are dependent it names the
// dimensionless group they form.
func (p *Problem) CheckRepeating(set ...string) error {
	_, err := p.repeatingIndex(set)
	return err
}

func (p *Problem) repeatingIndex(set []string) ([]int, error) {
	idx, err := p.repeatingMembers(make([]int, 0, len(set)), set)
	if err != nil {
		return nil, err
	}
	var uncovered []quantity.Base
	var rows [quantity.NumBases][]int64
	var pivBuf [quantity.NumBases]int
	cells := p.intColumns(idx)
	for i := range p.rows {
		rows[i] = cells[i][:len(idx):len(idx)]
	}
	isub := exact.IntMatrix(rows[:len(p.rows)])
	for i, b := range p.rows {
		covered := false
		for k := range idx {
			if isub[i][k] != 0 {
				covered = true
			}
		}
		if !covered {
			uncovered = append(uncovered, b)
		}
	}
	piv, err := isub.GaussJordan(pivBuf[:0])
	if err != nil {
		return nil, p.tooLarge(err)
	}
	if len(piv) < len(idx) || len(uncovered) > 0 {
		e := &Error{Op: OpRepeating, Set: slices.Clone(set), Want: p.rank, Uncovered: uncovered}
		ns, err := p.columns(idx).NullSpace(quantity.RatInt(1))
		if err != nil {
			return nil, p.tooLarge(err)
		}
		e.Kind = ErrRepeatingSingular
		if len(ns) > 0 {
			iv, _, err := integers(ns[0])
			if err == nil {
				exps := make([]quantity.Rat, len(p.vars))
				for k, j := range idx {
					exps[j] = iv[k]
				}
				e.Combination = p.FormatProduct(exps, quantity.ASCII)
			}
		}
		return nil, e
	}
	return idx, nil
}

// repeatingMembers appends to dst the indices of a repeating set's
// members, checking all that CheckRepeating does but that they carry every
// base dimension and are independent.
func (p *Problem) repeatingMembers(dst []int, set []string) ([]int, error) {
	fail := func(err error, sym string) *Error {
		return &Error{Op: OpRepeating, Kind: err, Set: slices.Clone(set), Want: p.rank, Symbol: sym}
	}
	idx := dst
	for _, s := range set {
		i := p.index(s)
		if i < 0 {
			return nil, fail(ErrRepeatingUnknown, s)
		}
		if slices.Contains(idx, i) {
			e := fail(ErrRepeatingCount, s)
			e.Hint = fmt.Sprintf("%q is given twice", s)
			return nil, e
		}
		if i == p.dep {
			return nil, fail(ErrRepeatingDep, s)
		}
		idx = append(idx, i)
	}
	if len(idx) != p.rank {
		return nil, fail(ErrRepeatingCount, "")
	}
	if p.NumGroups() == 0 {
		e := fail(ErrNoGroups, "")
		e.Hint = fmt.Sprintf("the rank equals the %d variables, so every variable repeats and no group is left", len(p.vars))
		return nil, e
	}
	return idx, nil
}

// MaxRepeatingSets bounds what RepeatingSets returns.
const MaxRepeatingSets = 100000

// ErrTooManySets is wrapped when a problem has more valid repeating sets
// than RepeatingSets returns.
var ErrTooManySets = errors.New("too many repeating sets")

// RepeatingSets returns every valid repeating set, each in variable
// order, the sets in lexicographic order of their indices. Their number
// grows as C(n, r) — 3750 for 20 variables of rank 4, but millions for 40
// of rank 6 — so past MaxRepeatingSets it stops with an error wrapping
// ErrTooManySets; use EachRepeating, which can stop early, or
// DefaultRepeating for large problems.
func (p *Problem) RepeatingSets() ([][]string, error) {
	var out [][]string
	var err error
	p.EachRepeating(func(set []string) bool {
		if len(out) == MaxRepeatingSets {
			err = &Error{Op: OpProblem, Kind: ErrTooManySets, Reason: fmt.Sprintf("more than %d valid repeating sets among %d variables of rank %d; use EachRepeating", MaxRepeatingSets, len(p.vars), p.rank)}
			return false
		}
		out = append(out, set)
		return true
	})
	if err != nil {
		return nil, err
	}
	return out, nil
}

// EachRepeating calls f with each valid repeating set, in the order of
// RepeatingSets, until f returns false. The valid sets are those
// CheckRepeating accepts and PiSet builds a set from: for a problem of
// rank 0 (every variable dimensionless) the one empty set, and for a
// problem with no groups none.
func (p *Problem) EachRepeating(f func(set []string) bool) {
	p.eachRepeating(func(idx []int) bool {
		set := make([]string, len(idx))
		for k, i := range idx {
			set[k] = p.vars[i].Symbol
		}
		return f(set)
	})
}

// eachRepeating calls f with every valid repeating set until f returns
// false.
func (p *Problem) eachRepeating(f func(idx []int) bool) {
	var cand []int
	for i := range p.vars {
		if i != p.dep {
			cand = append(cand, i)
		}
	}
	r := p.rank
	if r > len(cand) || p.NumGroups() == 0 {
		return
	}
	if r == 0 {
		f([]int{}) // every variable dimensionless: the empty set repeats
		return
	}
	// Work on the row echelon columns with an incremental rank test:
	// choose columns one at a time, keeping them independent.
	sel := make([]int, 0, r)
	basis := make([][]quantity.Rat, 0, r) // reduced basis vectors with their pivot rows
	pivRow := make([]int, 0, r)
	var rec func(start int) bool
	rec = func(start int) bool {
		if len(sel) == r {
			return f(slices.Clone(sel))
		}
		for k := start; k <= len(cand)-(r-len(sel)); k++ {
			j := cand[k]
			v := make([]quantity.Rat, len(p.rows))
			for i := range p.rows {
				v[i] = quantity.RatInt(p.sixth(i, j))
			}
			// Reduce v by the current basis.
			ok := true
			for b, bv := range basis {
				c := v[pivRow[b]]
				if c.IsZero() {
					continue
				}
				for i := range v {
					t, err := c.Mul(bv[i])
					if err != nil {
						ok = false
						break
					}
					if v[i], err = v[i].Sub(t); err != nil {
						ok = false
						break
					}
				}
			}
			if !ok {
				continue
			}
			pr := -1
			for i := range v {
				if !v[i].IsZero() {
					pr = i
					break
				}
			}
			if pr < 0 {
				continue // dependent on the chosen ones
			}
			inv := v[pr]
			for i := range v {
				v[i], _ = v[i].Div(inv)
			}
			sel, basis, pivRow = append(sel, j), append(basis, v), append(pivRow, pr)
			cont := rec(k + 1)
			sel, basis, pivRow = sel[:len(sel)-1], basis[:len(basis)-1], pivRow[:len(pivRow)-1]
			if !cont {
				return false
			}
		}
		return true
	}
	rec(0)
}

// dependentOnly reports a base dimension that only the dependent variable
// carries: no repeating set can then make it dimensionless.
func (p *Problem) dependentOnly() error {
	if p.dep < 0 {
		return nil
	}
	for i, b := range p.rows {
		others := false
		for j := range p.vars {
			if j != p.dep && p.sixth(i, j) != 0 {
				others = true
				break
			}
		}
		if !others {
			return &Error{Op: OpRepeating, Kind: ErrDependentOnly, Want: p.rank, Symbol: p.vars[p.dep].Symbol, Uncovered: []quantity.Base{b},
				Hint: fmt.Sprintf("only the dependent variable %q carries %s, so it cannot appear in any dimensionless group; add the variable that brings %s into the problem (a density or a mass for M, a temperature for Θ)", p.vars[p.dep].Symbol, b, b)}
		}
	}
	return nil
}

// preference ranks kinds for the default repeating set, lower first.
var preference = map[string]int{
	"density": 0, "velocity": 1, "length": 2, "angular velocity": 3, "rotational speed": 3,
	"frequency": 4, "dynamic viscosity": 5, "thermal conductivity": 6, "temperature difference": 7,
	"acceleration": 8, "gravitational acceleration": 8, "mass": 9, "time": 10,
}

func (p *Problem) prefRank(i int) int {
	best := 50
	var ks []string
	if k := p.vars[i].Kind; k != "" {
		ks = []string{k}
	} else {
		ks = *p.vars[i].inferred
	}
	for _, k := range ks {
		if r, ok := preference[k]; ok && r < best {
			best = r
		}
	}
	return best
}

// DefaultRepeating returns the repeating set chosen by the documented
// rule: the variables are ranked by preference, following the fluids
// trade — a density, then a velocity, then a length, then an angular
// velocity or frequency, then a dynamic viscosity, a thermal
// conductivity, a temperature difference, an acceleration, a mass, a
// time, and anything else last, ties going to the variable listed first —
// and taken in that order whenever they are independent of those already
// taken, until there are Rank of them. (The repeating sets are the bases
// of a matroid, so this greedy choice is the best valid set under the
// ranking.) The set is returned in variable order. It returns an error
// only when no valid set exists.
func (p *Problem) DefaultRepeating() ([]string, error) {
	var cand []int
	for i := range p.vars {
		if i != p.dep {
			cand = append(cand, i)
		}
	}
	slices.SortStableFunc(cand, func(a, b int) int {
		if d := p.prefRank(a) - p.prefRank(b); d != 0 {
			return d
		}
		return a - b
	})
	chosen, err := p.independent(cand, nil)
	if err != nil {
		return nil, p.tooLarge(err)
	}
	if p.rank == 0 {
		return []string{}, nil // every variable is dimensionless: no repeating set is needed
	}
	if len(chosen) != p.rank {
		if e := p.dependentOnly(); e != nil {
			return nil, e
		}
		return nil, &Error{Op: OpRepeating, Kind: ErrNoGroups, Want: p.rank}
	}
	if p.NumGroups() == 0 {
		return nil, &Error{Op: OpRepeating, Kind: ErrNoGroups, Want: p.rank, Hint: "the rank equals the number of variables, so no group is left"}
	}
	slices.Sort(chosen)
	out := make([]string, len(chosen))
	for k, i := range chosen {
		out[k] = p.vars[i].Symbol
	}
	return out, nil
}
