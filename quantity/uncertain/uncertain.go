package uncertain

import (
	"fmt"
	"math"
	"strings"

	"similis.dev/similis/quantity"
)

// MaxTerms is the number of sources one Measured value can depend on.
const MaxTerms = 16

// Type is how a source's standard uncertainty was evaluated (GUM §4.2,
// §4.3).
type Type uint8

const (
	// TypeB is an evaluation by other means than statistics of repeated
	// observations: a calibration certificate, a resolution, a
	// specification, a handbook value.
	TypeB Type = iota
	// TypeA is a statistical evaluation of repeated observations, with
	// its degrees of freedom.
	TypeA
)

// String returns "A" or "B".
func (t Type) String() string {
	if t == TypeA {
		return "A"
	}
	return "B"
}

// Distribution is the probability distribution assumed for a Type B
// source (GUM §4.3.7–4.3.9; JCGM 101 §6.4). Its standard uncertainty is
// given in the Source either way: for a rectangular distribution of
// half-width a it is a/√3.
type Distribution uint8

const (
	Normal      Distribution = iota // Gaussian
	Rectangular                     // uniform over ±a, u = a/√3
	Triangular                      // symmetric triangular over ±a, u = a/√6
	Arcsine                         // U-shaped over ±a, u = a/√2
)

var distNames = [...]string{"normal", "rectangular", "triangular", "arcsine"}

// String returns the distribution's name.
func (d Distribution) String() string {
	if int(d) < len(distNames) {
		return distNames[d]
	}
	return fmt.Sprintf("Distribution(%d)", d)
}

// Effect says whether a source's error is the same in every repetition of
// the test (systematic, such as a calibration) or varies between them
// (random, such as a repeatability).
type Effect uint8

const (
	Random Effect = iota
	Systematic
)

// String returns "random" or "systematic".
func (e Effect) String() string {
	if e == Systematic {
		return "systematic"
	}
	return "random"
}

// Source is one origin of uncertainty. U is its standard uncertainty: a
// Quantity in the dimension of the values it is attached to, or, when
// Relative is set, a dimensionless fraction of the value (0.001 for
// 0.1 % of reading).
type Source struct {
	Name     string
	U        quantity.Quantity
	Relative bool
	Type     Type
	// DoF is the degrees of freedom: n−1 for a Type A mean of n
	// readings. 0 means infinite, the usual choice for Type B.
	DoF    float64
	Dist   Distribution
	Effect Effect
}

// ID identifies a source within its Set.
type ID uint16

// Set holds the sources of one uncertainty analysis and the correlations
// between them. Values from different sets cannot be combined.
type Set struct {
	src  []Source
	corr map[[2]ID]float64
}

// NewSet returns an empty set.
func NewSet() *Set { return &Set{} }

// Error reports a source, a measurement or an argument given wrongly, or
// a result that would not be a finite number. Its class under errors.Is
// is Class when set (quantity.ErrRange for a number out of range), else
// the class of the cause Err, else quantity.ErrInvalid: every Error
// matches exactly one class. It is the package's one error type.
type Error struct {
	Source string // the source's name, if any
	Reason string
	// Terms is, for a value that would depend on more than MaxTerms
	// sources, the number of sources it would depend on; 0 otherwise.
	Terms int
	Class error // the class; nil for the cause's class or quantity.ErrInvalid
	Err   error // the cause, if any
}

func (e *Error) Error() string {
	var sb strings.Builder
	sb.WriteString("uncertain: ")
	if e.Source != "" {
		fmt.Fprintf(&sb, "source %q: ", e.Source)
	}
	sb.WriteString(e.Reason)
	if e.Err != nil {
		sb.WriteString(": ")
		sb.WriteString(strings.TrimPrefix(e.Err.Error(), "uncertain: "))
	}
	return sb.String()
}

// classes are the module's error classes an Error may have.
// class returns e's one class.
func (e *Error) class() error {
	if e.Class != nil {
		return e.Class
	}
	if c := quantity.ClassOf(e.Err); c != nil {
		return c
	}
	return quantity.ErrInvalid
}

// Is reports whether target is e's class.
func (e *Error) Is(target error) bool { return target == e.class() }

// Unwrap returns the cause, or nil.
func (e *Error) Unwrap() error { return e.Err }

// rangeError is an Error of class quantity.ErrRange.
func rangeError(format string, args ...any) *Error {
	return &Error{Reason: fmt.Sprintf(format, args...), Class: quantity.ErrRange}
}

// termsError is the Error of a value that would depend on n > MaxTerms
// sources.
func termsError(n int) *Error {
	return &Error{Reason: fmt.Sprintf("a value depending on %d or more sources, more than %d", n, MaxTerms), Terms: n}
}

// finite reports whether x is neither NaN nor ±Inf.
func finite(x float64) bool { return x-x == 0 }

// Add registers a source and returns its ID. A name may be used once.
func (s *Set) Add(src Source) (ID, error) {
	switch {
	case strings.TrimSpace(src.Name) == "":
		return 0, &Error{Reason: "a source without a name"}
	case !(src.U.Value() >= 0) || math.IsInf(src.U.Value(), 0):
		return 0, &Error{Source: src.Name, Reason: fmt.Sprintf("standard uncertainty %v: want a finite value ≥ 0", src.U)}
	case src.Relative && !src.U.IsDimensionless():
		return 0, &Error{Source: src.Name, Reason: fmt.Sprintf("a relative uncertainty is a fraction of the value, not %v", src.U)}
	case src.DoF < 0 || math.IsNaN(src.DoF):
		return 0, &Error{Source: src.Name, Reason: fmt.Sprintf("degrees of freedom %v", src.DoF)}
	case src.Type == TypeA && (src.DoF == 0 || math.IsInf(src.DoF, 0)):
		return 0, &Error{Source: src.Name, Reason: "a Type A evaluation needs its degrees of freedom (n−1 for the mean of n readings)"}
	case src.Type == TypeA && src.Dist != Normal:
		return 0, &Error{Source: src.Name, Reason: "a Type A evaluation has no assumed distribution: leave Dist as Normal"}
	case int(src.Dist) >= len(distNames) || src.Type > TypeA || src.Effect > Systematic:
		return 0, &Error{Source: src.Name, Reason: "unknown type, distribution or effect"}
	case len(s.src) >= math.MaxUint16:
		return 0, &Error{Source: src.Name, Reason: "too many sources in one set"}
	}
	for _, o := range s.src {
		if o.Name == src.Name {
			return 0, &Error{Source: src.Name, Reason: "a second source of this name: attach the same ID to share a source"}
		}
	}
	s.src = append(s.src, src)
	return ID(len(s.src) - 1), nil
}

// MustAdd is Add that panics on an error, for sources written in code.
func (s *Set) MustAdd(src Source) ID {
	id, err := s.Add(src)
	if err != nil {
		panic(err)
	}
	return id
}

// Source returns the source of id. An ID is the number of a source
// within its set: an ID beyond this set's sources is an error (an ID of
// another set that is in range names this set's source of that number).
func (s *Set) Source(id ID) (Source, error) {
	if int(id) >= len(s.src) {
		return Source{}, &Error{Reason: fmt.Sprintf("source ID %d not in this set of %d sources", id, len(s.src))}
	}
	return s.src[id], nil
}

// Len returns the number of sources.
func (s *Set) Len() int { return len(s.src) }

// Correlate sets the correlation coefficient r (−1 ≤ r ≤ 1) between the
// errors of two distinct sources (GUM §5.2.2).
func (s *Set) Correlate(a, b ID, r float64) error {
	if int(a) >= len(s.src) || int(b) >= len(s.src) {
		return &Error{Reason: "a source not in this set"}
	}
	if a == b {
		return &Error{Source: s.src[a].Name, Reason: "a source is fully correlated with itself already"}
	}
	if !(r >= -1 && r <= 1) {
		return &Error{Source: s.src[a].Name, Reason: fmt.Sprintf("correlation %v with %q: want −1 ≤ r ≤ 1", r, s.src[b].Name)}
	}
	if a > b {
		a, b = b, a
	}
	if s.corr == nil {
		s.corr = map[[2]ID]float64{}
	}
	s.corr[[2]ID{a, b}] = r
	return nil
}

// r returns the correlation coefficient of two sources.
func (s *Set) r(a, b ID) float64 {
	if a == b {
		return 1
	}
	if a > b {
		a, b = b, a
	}
	return s.corr[[2]ID{a, b}]
}

// Measure returns the measured value x with the sources ids attached: the
// value is x plus each source's error (x times it, for a relative
// source). Each absolute source must have x's dimension.
func (s *Set) Measure(x quantity.Quantity, ids ...ID) (Measured, error) {
	m := Measured{q: x, set: s}
	if math.IsNaN(x.Value()) || math.IsInf(x.Value(), 0) {
		return Measured{}, &Error{Reason: fmt.Sprintf("value %v: want a finite value", x)}
	}
	if len(ids) > MaxTerms {
		return Measured{}, termsError(len(ids))
	}
	for _, id := range ids {
		if int(id) >= len(s.src) {
			return Measured{}, &Error{Reason: fmt.Sprintf("source ID %d not in this set", id)}
		}
		src := s.src[id]
		var d float64
		if src.Relative {
			d = x.Value() * src.U.Value()
		} else {
			if src.U.Dim() != x.Dim() {
				return Measured{}, &Error{Source: src.Name, Reason: fmt.Sprintf("an uncertainty of %s attached to a value of %s", quantity.Describe(src.U.Dim()), quantity.Describe(x.Dim()))}
			}
			d = src.U.Value()
		}
		if !finite(d) {
			return Measured{}, &Error{Source: src.Name, Reason: fmt.Sprintf("value %v times the relative uncertainty %v overflows", x, src.U.Value()), Class: quantity.ErrRange}
		}
		// Insert in order of ID; attaching a source twice adds its effect.
		i := 0
		for i < int(m.n) && m.id[i] < id {
			i++
		}
		if i < int(m.n) && m.id[i] == id {
			m.d[i] += d
			if !finite(m.d[i]) {
				return Measured{}, &Error{Source: src.Name, Reason: "attached again, its effect overflows", Class: quantity.ErrRange}
			}
			continue
		}
		copy(m.id[i+1:m.n+1], m.id[i:m.n])
		copy(m.d[i+1:m.n+1], m.d[i:m.n])
		m.id[i], m.d[i] = id, d
		m.n++
	}
	return m, nil
}

// MustMeasure is Measure that panics on an error.
func (s *Set) MustMeasure(x quantity.Quantity, ids ...ID) Measured {
	m, err := s.Measure(x, ids...)
	if err != nil {
		panic(err)
	}
	return m
}

// ErrSets is the error of combining values from two different Sets. It
// is an *Error, of class quantity.ErrInvalid; errors that report two sets
// wrap it.
var ErrSets error = &Error{Reason: "values from two different sets"}

// Measured is a Quantity with the derivatives of its value with respect
// to the errors of its sources, scaled by their standard uncertainties.
// It is a small comparable value; the zero Measured is an exact
// dimensionless 0.
type Measured struct {
	q   quantity.Quantity
	set *Set
	n   uint8
	id  [MaxTerms]ID
	d   [MaxTerms]float64
}

// Exact returns q with no uncertainty: a defined constant, or a value
// whose uncertainty is negligible by choice.
func Exact(q quantity.Quantity) Measured { return Measured{q: q} }

// Quantity returns the estimate.
func (m Measured) Quantity() quantity.Quantity { return m.q }

// Value returns the estimate in SI.
func (m Measured) Value() float64 { return m.q.Value() }

// Dim returns the dimension.
func (m Measured) Dim() quantity.Dim { return m.q.Dim() }

// Set returns the set of the value's sources, or nil for an exact value.
func (m Measured) Set() *Set { return m.set }

// Terms returns the number of sources the value depends on.
func (m Measured) Terms() int { return int(m.n) }

// Term returns the i-th source and the derivative of the value with
// respect to its error, times its standard uncertainty, in SI: the
// source's signed contribution c·u to the value's uncertainty. i must
// lie in 0 ≤ i < Terms(); beyond that, as a slice index, it panics.
func (m Measured) Term(i int) (ID, float64) {
	if i < 0 || i >= int(m.n) {
		panic(&Error{Reason: fmt.Sprintf("Term(%d) of a value with %d terms", i, m.n)})
	}
	return m.id[i], m.d[i]
}

// U returns the combined standard uncertainty (GUM eq. 13), correlations
// included.
func (m Measured) U() quantity.Quantity {
	return quantity.New(math.Sqrt(m.variance(-1)), m.q.Dim())
}

// Rel returns the relative standard uncertainty u/|y|: 0 when u is 0,
// and +Inf for a zero value with an uncertainty (a relative uncertainty
// is not defined there).
func (m Measured) Rel() float64 {
	u := math.Sqrt(m.variance(-1))
	if u == 0 {
		return 0
	}
	return u / math.Abs(m.q.Value())
}

// variance returns Σ r_kl d_k d_l over all terms, or over the terms of
// one Effect when e ≥ 0.
func (m Measured) variance(e int) float64 {
	var v float64
	for i := 0; i < int(m.n); i++ {
		if e >= 0 && int(m.set.src[m.id[i]].Effect) != e {
			continue
		}
		v += m.d[i] * m.d[i]
		if m.set.corr == nil {
			continue
		}
		for j := i + 1; j < int(m.n); j++ {
			if e >= 0 && int(m.set.src[m.id[j]].Effect) != e {
				continue
			}
			if r := m.set.r(m.id[i], m.id[j]); r != 0 {
				v += 2 * r * m.d[i] * m.d[j]
			}
		}
	}
	return max(v, 0)
}

// String formats the value as "1.234 m/s ± 0.012 m/s": the standard
// uncertainty to two significant digits and the estimate to the same
// decimal place (JCGM 100:2008, §7.2.6), in SI units with the derived
// unit's name where the dimension has one (N, Pa, W, Pa·s; N·m for energy
// and torque alike), and a decimal prefix on a named unit for a large or
// small value (138.43 kN).
//
// The numbers are written in powers of ten when the larger of |x| and u,
// in the unit shown, is below 10⁻³ or at least 10⁶, or when u is below
// 10⁻⁶: "1.7938×10⁻⁵ ± 1.5×10⁻⁸". Where u exceeds |x| the estimate keeps
// two significant digits of its own, so that it never reads as 0 unless
// it is 0, and the text says so: "1.2×10⁹ m³/s ± 1.7×10¹¹ m³/s (u exceeds
// the value)". An exact value is written in full: "9.80665 m/s² ± 0".
func (m Measured) String() string {
	y, u := m.q.Value(), m.U().Value()
	unit, f := displayUnit(m.q.Dim(), math.Max(math.Abs(y), u))
	ys, us := roundPair(y/f, u/f)
	if us == "0" {
		return withUnit(ys, unit) + " ± 0"
	}
	s := withUnit(ys, unit) + " ± " + withUnit(us, unit)
	if u > math.Abs(y) {
		s += " " + overNote
	}
	return s
}

// overNote marks a value whose standard uncertainty exceeds its
// magnitude.
const overNote = "(u exceeds the value)"

// combine returns the terms of a·x + b·y: the chain rule for a result
// whose partial derivatives are a with respect to x and b to y.
func combine(v quantity.Quantity, a float64, x *Measured, b float64, y *Measured) (z Measured) {
	mergeInto(&z, v, a, x, b, y)
	return z
}

// mergeInto sets *z to combine's result; z must not be x or y.
func mergeInto(z *Measured, v quantity.Quantity, a float64, x *Measured, b float64, y *Measured) {
	old := z.n
	mergeTerms(z, v, a, x, b, y)
	z.clearFrom(old) // a reused z: no stale terms past the new n
}

// mergeTerms writes the terms of a·x + b·y into z.
func mergeTerms(z *Measured, v quantity.Quantity, a float64, x *Measured, b float64, y *Measured) {
	z.q = v
	switch {
	case y.n == 0:
		z.set, z.n, z.id = x.set, x.n, x.id
		for i := 0; i < int(x.n); i++ {
			z.d[i] = a * x.d[i]
		}
		return
	case x.n == 0:
		z.set, z.n, z.id = y.set, y.n, y.id
		for i := 0; i < int(y.n); i++ {
			z.d[i] = b * y.d[i]
		}
		return
	case x.set != y.set:
		panic(ErrSets)
	case x.n == y.n && x.id == y.id:
		// The same sources, the common case along a chain of operations.
		z.set, z.n, z.id = x.set, x.n, x.id
		for i := 0; i < int(x.n); i++ {
			z.d[i] = a*x.d[i] + b*y.d[i]
		}
		return
	}
	z.set = x.set
	i, j, k := 0, 0, 0
	xn, yn := int(x.n), int(y.n)
	for i < xn && j < yn {
		if k == MaxTerms {
			panic(termsError(MaxTerms + 1))
		}
		xi, yj := x.id[i], y.id[j]
		switch {
		case xi < yj:
			z.id[k], z.d[k] = xi, a*x.d[i]
			i++
		case yj < xi:
			z.id[k], z.d[k] = yj, b*y.d[j]
			j++
		default:
			z.id[k], z.d[k] = xi, a*x.d[i]+b*y.d[j]
			i++
			j++
		}
		k++
	}
	if k+(xn-i)+(yn-j) > MaxTerms {
		panic(termsError(k + (xn - i) + (yn - j)))
	}
	for ; i < xn; i++ {
		z.id[k], z.d[k] = x.id[i], a*x.d[i]
		k++
	}
	for ; j < yn; j++ {
		z.id[k], z.d[k] = y.id[j], b*y.d[j]
		k++
	}
	z.n = uint8(k)
}

// clearFrom zeroes the terms from m.n up to old, so that a reused
// Measured compares equal to a fresh one with the same terms.
func (m *Measured) clearFrom(old uint8) {
	for i := m.n; i < old; i++ {
		m.id[i], m.d[i] = 0, 0
	}
}

// scale returns the terms of a·x with the value v.
func scale(v quantity.Quantity, a float64, x *Measured) (z Measured) {
	z.q, z.set, z.n, z.id = v, x.set, x.n, x.id
	for i := 0; i < int(x.n); i++ {
		z.d[i] = a * x.d[i]
	}
	return z
}

// Domain errors. An operation whose result, or whose derivative with
// respect to an uncertain operand, is not a finite number at the estimate
// (a division by zero, the logarithm of a value ≤ 0, the square root of
// 0 with an uncertainty, an overflow) panics with an *Error of class
// quantity.ErrRange naming the operation and the operand, as a dimension
// mismatch panics with a *quantity.Error of class quantity.ErrDimension;
// Eval returns either as an error. First-order propagation does not hold at such a point: check
// the model there with MonteCarlo, whose trials are exact values.

//go:noinline
func panicDomain(op string, x float64) {
	panic(rangeError("%s %v: the result or its derivative there is not a finite number", op, x))
}

// ok1 reports whether the result v and its derivative a on x are finite;
// a matters only when x carries uncertainty.
func ok1(v, a float64, x *Measured) bool { return finite(v) && (x.n == 0 || finite(a)) }

// ok2 is ok1 for a result of two operands.
func ok2(v, a float64, x *Measured, b float64, y *Measured) bool {
	return finite(v) && (x.n == 0 || finite(a)) && (y.n == 0 || finite(b))
}

// powDeriv returns d(x^p)/dx = p·x^(p−1) given v = x^p; at x = 0 it is 0
// for p > 1 or p = 0, 1 for p = 1, and infinite otherwise.
func powDeriv(p, x, v float64) float64 {
	if x != 0 {
		return p * v / x
	}
	switch {
	case p == 1:
		return 1
	case p > 1 || p == 0:
		return 0
	}
	return math.Inf(1)
}

// Add returns m + o; the dimensions must agree.
func (m Measured) Add(o Measured) Measured {
	v := m.q.Add(o.q)
	if !finite(v.Value()) {
		panicDomain("sum with", o.q.Value())
	}
	return combine(v, 1, &m, 1, &o)
}

// Sub returns m − o; a source shared by both cancels as far as its
// effect on them is equal.
func (m Measured) Sub(o Measured) Measured {
	v := m.q.Sub(o.q)
	if !finite(v.Value()) {
		panicDomain("difference with", o.q.Value())
	}
	return combine(v, 1, &m, -1, &o)
}

// Mul returns m·o.
func (m Measured) Mul(o Measured) Measured {
	v := m.q.Mul(o.q)
	if !finite(v.Value()) {
		panicDomain("product with", o.q.Value())
	}
	return combine(v, o.q.Value(), &m, m.q.Value(), &o)
}

// Div returns m/o; o must not be 0.
func (m Measured) Div(o Measured) Measured {
	y := o.q.Value()
	v := m.q.Div(o.q)
	a, b := 1/y, -m.q.Value()/(y*y)
	if y == 0 || !ok2(v.Value(), a, &m, b, &o) {
		panicDomain("quotient by", y)
	}
	return combine(v, a, &m, b, &o)
}

// MulQ returns m·q for an exact q.
func (m Measured) MulQ(q quantity.Quantity) Measured {
	v := m.q.Mul(q)
	if !ok1(v.Value(), q.Value(), &m) {
		panicDomain("product with", q.Value())
	}
	return scale(v, q.Value(), &m)
}

// DivQ returns m/q for an exact q other than 0.
func (m Measured) DivQ(q quantity.Quantity) Measured {
	v := m.q.Div(q)
	if q.Value() == 0 || !ok1(v.Value(), 1/q.Value(), &m) {
		panicDomain("quotient by", q.Value())
	}
	return scale(v, 1/q.Value(), &m)
}

// Scale returns f·m for an exact number f.
func (m Measured) Scale(f float64) Measured {
	v := m.q.Scale(f)
	if !ok1(v.Value(), f, &m) {
		panicDomain("product with", f)
	}
	return scale(v, f, &m)
}

// Neg returns −m.
func (m Measured) Neg() Measured { return scale(m.q.Neg(), -1, &m) }

// Inv returns 1/m; m must not be 0.
func (m Measured) Inv() Measured {
	x := m.q.Value()
	v := m.q.Inv()
	if x == 0 || !ok1(v.Value(), -1/(x*x), &m) {
		panicDomain("inverse of", x)
	}
	return scale(v, -1/(x*x), &m)
}

// Pow returns m^(num/den), the exponent exact as for Quantity.Pow. At
// m = 0 a power below 1 has no finite derivative, and a negative power
// no finite value.
func (m Measured) Pow(num, den int) Measured {
	v := m.q.Pow(num, den)
	x := m.q.Value()
	a := powDeriv(float64(num)/float64(den), x, v.Value())
	if !ok1(v.Value(), a, &m) {
		panicDomain(fmt.Sprintf("power %d/%d of", num, den), x)
	}
	return scale(v, a, &m)
}

// Powf returns m^p for a dimensionless m, or for any m as
// quantity.Powf allows; at m = 0 as Pow.
func (m Measured) Powf(p float64) Measured {
	v := quantity.Powf(m.q, p)
	a := powDeriv(p, m.q.Value(), v.Value())
	if !ok1(v.Value(), a, &m) {
		panicDomain(fmt.Sprintf("power %v of", p), m.q.Value())
	}
	return scale(v, a, &m)
}

// Sqrt returns √m; m must be positive, or 0 when exact.
func (m Measured) Sqrt() Measured {
	v := m.q.Sqrt()
	a := 0.5 / v.Value()
	if !ok1(v.Value(), a, &m) {
		panicDomain("square root of", m.q.Value())
	}
	return scale(v, a, &m)
}

// Abs returns |m|.
func (m Measured) Abs() Measured {
	if m.q.Value() < 0 {
		return m.Neg()
	}
	return m
}

// Log returns the natural logarithm of a dimensionless m > 0.
func Log(m Measured) Measured {
	v := quantity.Log(m.q)
	if !ok1(v.Value(), 1/m.q.Value(), &m) {
		panicDomain("logarithm of", m.q.Value())
	}
	return scale(v, 1/m.q.Value(), &m)
}

// Log10 returns the base-10 logarithm of a dimensionless m > 0.
func Log10(m Measured) Measured {
	v := quantity.Log10(m.q)
	a := 1 / (m.q.Value() * math.Ln10)
	if !ok1(v.Value(), a, &m) {
		panicDomain("logarithm of", m.q.Value())
	}
	return scale(v, a, &m)
}

// Exp returns e^m for a dimensionless m.
func Exp(m Measured) Measured {
	v := quantity.Exp(m.q)
	if !finite(v.Value()) {
		panicDomain("exponential of", m.q.Value())
	}
	return scale(v, v.Value(), &m)
}

// Sin returns sin m for an angle or dimensionless m.
func Sin(m Measured) Measured { return scale(quantity.Sin(m.q), math.Cos(m.q.Value()), &m) }

// Cos returns cos m for an angle or dimensionless m.
func Cos(m Measured) Measured { return scale(quantity.Cos(m.q), -math.Sin(m.q.Value()), &m) }

// Eval runs a formula on Measured values and returns a dimension error,
// or an *Error — ErrSets, one with Terms set, or one of class
// quantity.ErrRange (a result or a derivative that is not a finite
// number) as an error instead of a panic. A result whose value or
// uncertainty terms are not finite (an overflow along the way) is such
// an *Error too.
func Eval(formula func() Measured) (m Measured, err error) {
	defer func() {
		if r := recover(); r != nil {
			switch e := r.(type) {
			case *quantity.Error:
				if e.Class != quantity.ErrDimension {
					panic(r)
				}
				err = e
			case *Error:
				err = e
			default:
				panic(r)
			}
			m = Measured{}
		}
	}()
	m = formula()
	if !m.finite() || !finite(m.variance(-1)) {
		return Measured{}, rangeError("the result %v is not a finite number, or its uncertainty is not (an overflow)", m.q)
	}
	return m, nil
}

// finite reports whether the value and every term are finite numbers.
func (m *Measured) finite() bool {
	s := m.q.Value() * 0
	for i := 0; i < int(m.n); i++ {
		s += m.d[i] * 0
	}
	return s == 0
}

// Apply returns y = f(m) for a function evaluated elsewhere — a property
// correlation, a calibration curve — given its value y at m's estimate
// and its derivative dydx there: the chain rule applied to each of m's
// sources. The dimensions must agree: y's is dydx's times m's. It panics
// with a *quantity.Error of class quantity.ErrDimension if they do not,
// as arithmetic does, and with an *Error of class quantity.ErrRange if y,
// or dydx where m is uncertain, is not a finite number.
func Apply(m Measured, y, dydx quantity.Quantity) Measured {
	want := dydx.Mul(m.q) // panics on an overflow of exponents
	if want.Dim() != y.Dim() {
		panic(&quantity.Error{Op: "check", Name: "Apply: the function's value", Dims: [2]quantity.Dim{y.Dim(), want.Dim()}, Binary: true, Reason: "a value y = f(x) has the dimension of dy/dx times x", Class: quantity.ErrDimension})
	}
	if !ok1(y.Value(), dydx.Value(), &m) {
		panicDomain("Apply: a function value or derivative not finite, at", m.q.Value())
	}
	return scale(y, dydx.Value(), &m)
}

// Linear returns a value y with the derivatives of Σ c_i·x_i: the chain
// rule for y = f(x₁, …, x_n) evaluated elsewhere, given its partial
// derivatives c_i = ∂f/∂x_i in SI at the estimates. Used where a
// function is cheaper to evaluate on plain numbers, such as a product of
// powers. The caller is responsible for the dimensions of c_i; y's is
// taken as given. It panics with an *Error (which Eval returns) if c and
// x differ in length, or if y or a c_i of an uncertain x_i is not finite.
func Linear(y quantity.Quantity, c []float64, x []Measured) Measured {
	if len(c) != len(x) {
		panic(&Error{Reason: fmt.Sprintf("Linear: %d derivatives for %d values", len(c), len(x))})
	}
	if !finite(y.Value()) {
		panicDomain("Linear: the value", y.Value())
	}
	z := Measured{q: y}
	for i := range x {
		if x[i].n > 0 && !finite(c[i]) {
			panicDomain(fmt.Sprintf("Linear: derivative %d is", i+1), c[i])
		}
		if x[i].n > 0 && c[i] != 0 {
			z = combine(y, 1, &z, c[i], &x[i])
		}
	}
	return z
}

// In-place forms, for loops over many rows: the receiver z is the
// destination, set and returned, and the operands are read through
// pointers, so no value is copied; z may be one of the operands. They
// panic as the value forms do.

// into sets *m to a·x + b·y with the value v, as combine, writing in
// place unless m is an operand.
func (m *Measured) into(v quantity.Quantity, a float64, x *Measured, b float64, y *Measured) *Measured {
	if m == x || m == y {
		*m = combine(v, a, x, b, y)
		return m
	}
	if x.n != 0 && y.n != 0 && (x.set != y.set || x.n != y.n || x.id != y.id) {
		mergeInto(m, v, a, x, b, y)
		return m
	}
	// No merge: one operand exact, or both on the same sources.
	old := m.n
	src := x
	if x.n == 0 {
		src = y
	}
	m.q, m.set, m.n, m.id = v, src.set, src.n, src.id
	switch {
	case y.n == 0:
		for i := 0; i < int(x.n); i++ {
			m.d[i] = a * x.d[i]
		}
	case x.n == 0:
		for i := 0; i < int(y.n); i++ {
			m.d[i] = b * y.d[i]
		}
	default:
		for i := 0; i < int(x.n); i++ {
			m.d[i] = a*x.d[i] + b*y.d[i]
		}
	}
	m.clearFrom(old)
	return m
}

// scaleInto sets *m to a·x with the value v; m may be x.
func (m *Measured) scaleInto(v quantity.Quantity, a float64, x *Measured) *Measured {
	old := m.n
	m.q, m.set, m.n = v, x.set, x.n
	if m != x {
		m.id = x.id
	}
	for i := 0; i < int(x.n); i++ {
		m.d[i] = a * x.d[i]
	}
	m.clearFrom(old)
	return m
}

// SetAdd sets m to x + y and returns m.
func (m *Measured) SetAdd(x, y *Measured) *Measured {
	v := x.q.Add(y.q)
	if !finite(v.Value()) {
		panicDomain("sum with", y.q.Value())
	}
	return m.into(v, 1, x, 1, y)
}

// SetSub sets m to x − y and returns m.
func (m *Measured) SetSub(x, y *Measured) *Measured {
	v := x.q.Sub(y.q)
	if !finite(v.Value()) {
		panicDomain("difference with", y.q.Value())
	}
	return m.into(v, 1, x, -1, y)
}

// SetMul sets m to x·y and returns m.
func (m *Measured) SetMul(x, y *Measured) *Measured {
	v := x.q.Mul(y.q)
	if !finite(v.Value()) {
		panicDomain("product with", y.q.Value())
	}
	return m.into(v, y.q.Value(), x, x.q.Value(), y)
}

// SetDiv sets m to x/y and returns m.
func (m *Measured) SetDiv(x, y *Measured) *Measured {
	w := y.q.Value()
	v := x.q.Div(y.q)
	a, b := 1/w, -x.q.Value()/(w*w)
	if w == 0 || !ok2(v.Value(), a, x, b, y) {
		panicDomain("quotient by", w)
	}
	return m.into(v, a, x, b, y)
}

// SetScale sets m to f·x and returns m.
func (m *Measured) SetScale(x *Measured, f float64) *Measured {
	v := x.q.Scale(f)
	if !ok1(v.Value(), f, x) {
		panicDomain("product with", f)
	}
	return m.scaleInto(v, f, x)
}

// SetInv sets m to 1/x and returns m.
func (m *Measured) SetInv(x *Measured) *Measured {
	w := x.q.Value()
	v := x.q.Inv()
	if w == 0 || !ok1(v.Value(), -1/(w*w), x) {
		panicDomain("inverse of", w)
	}
	return m.scaleInto(v, -1/(w*w), x)
}

// SetPowf sets m to x^p for a dimensionless x and returns m.
func (m *Measured) SetPowf(x *Measured, p float64) *Measured {
	v := quantity.Powf(x.q, p)
	a := powDeriv(p, x.q.Value(), v.Value())
	if !ok1(v.Value(), a, x) {
		panicDomain(fmt.Sprintf("power %v of", p), x.q.Value())
	}
	return m.scaleInto(v, a, x)
}

// SetLog10 sets m to log₁₀ x for a dimensionless x > 0 and returns m.
func (m *Measured) SetLog10(x *Measured) *Measured {
	v := quantity.Log10(x.q)
	a := 1 / (x.q.Value() * math.Ln10)
	if !ok1(v.Value(), a, x) {
		panicDomain("logarithm of", x.q.Value())
	}
	return m.scaleInto(v, a, x)
}
