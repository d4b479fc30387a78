package units

import (
	"fmt"
	"math"
	"runtime"
	"sync"
	"sync/atomic"
	"weak"

	"similis.dev/similis/quantity"
)

// tempRole says how a unit treats temperature.
type tempRole uint8

const (
	// tempNone: no special meaning; K and °R are here, since their zero is
	// absolute zero and a level and an interval read the same.
	tempNone tempRole = iota
	// tempScale: a bare temperature scale with a shifted zero (°C, °F),
	// which converts a level affinely.
	tempScale
	// tempInterval: an explicit temperature difference (Δ°C, Δ°F).
	tempInterval
)

// Unit is a unit of measurement: its dimension, its factor to the
// coherent SI unit of that dimension, an offset for a temperature scale,
// and its spelling. A value x in unit u is the SI value x·factor + offset.
//
// Plane and solid angle are dimensionless in the SI, but a Unit keeps
// their exponents (rad, sr) so that no conversion silently applies or
// drops a factor 2π: rpm converts to rad/s and rev/s, not to Hz.
//
// A Unit holds its spelling as terms — symbols (with their prefixes) and
// numbers, each to an exact power — in an interned, immutable record, so
// that unit algebra and printing work on the terms directly, never
// re-reading text, and two units with the same spelling share one record.
//
// Unit is comparable; == also compares spellings, Equal does not.
type Unit struct {
	dim    quantity.Dim
	factor float64
	offset float64
	angle  int8 // exponent of plane angle
	solid  int8 // exponent of solid angle
	temp   tempRole
	sp     *spelling // nil for the zero Unit, which is One
}

// spelling is a unit's spelling: its terms and their ASCII form, with the
// Unicode form written once, when first asked for. Spellings are interned
// by their ASCII form, so == on Units compares spellings.
type spelling struct {
	t     terms
	ascii string
	uni   atomic.Pointer[string]
}

// spellings interns spelling records by their ASCII form, weakly: an
// entry lives as long as some Unit (or the parse cache) holds its record,
// and is removed once the record is collected. So == compares the
// spellings of any two live Units, the table holds only the spellings in
// use, and a long-running program that reads ever new spellings neither
// grows without bound nor meets a cap that would make Parse fail.
var (
	spellings    sync.Map // ASCII spelling → weak.Pointer[spelling]
	spellingsLen atomic.Int64
)

// internSpelling returns the record of the spelling of t.
func internSpelling(t terms) *spelling {
	return internAs(t.spell(quantity.ASCII), t)
}

// internAs returns the record of the spelling ascii of t, the one every
// live Unit of that spelling shares.
func internAs(ascii string, t terms) *spelling {
	for {
		old, ok := spellings.Load(ascii)
		if ok {
			if sp := old.(weak.Pointer[spelling]).Value(); sp != nil {
				return sp
			}
		}
		sp := &spelling{t: append(terms(nil), t...), ascii: ascii}
		wp := weak.Make(sp)
		if ok {
			// The record was collected but its entry not yet removed.
			if !spellings.CompareAndSwap(ascii, old, wp) {
				continue
			}
		} else if _, loaded := spellings.LoadOrStore(ascii, wp); loaded {
			continue
		} else {
			spellingsLen.Add(1)
		}
		runtime.AddCleanup(sp, forgetSpelling, spellingKey{ascii, wp})
		return sp
	}
}

// spellingKey names an entry of spellings for its cleanup.
type spellingKey struct {
	ascii string
	wp    weak.Pointer[spelling]
}

// forgetSpelling removes the entry of a collected record, unless a new
// record has taken its place.
func forgetSpelling(k spellingKey) {
	if spellings.CompareAndDelete(k.ascii, k.wp) {
		spellingsLen.Add(-1)
	}
}

// unicode returns the Unicode spelling, writing it the first time.
func (sp *spelling) unicode() string {
	if s := sp.uni.Load(); s != nil {
		return *s
	}
	s := sp.t.spell(quantity.Unicode)
	sp.uni.Store(&s)
	return s
}

// setTerms gives u the spelling of t.
func (u *Unit) setTerms(t terms) { u.sp = internSpelling(t) }

// terms returns u's terms; the caller must not change them.
func (u Unit) terms() terms {
	if u.sp == nil {
		return nil
	}
	return u.sp.t
}

// symbolUnit returns u with the single symbol sym as its spelling.
func symbolUnit(u Unit, sym string) Unit {
	u.sp = internAs(sym, terms{symTerm(sym, false)})
	return u
}

// one is the unit one, for dimensionless numbers.
var one = func() Unit {
	return Unit{factor: 1, sp: internAs("1", nil)}
}()

// One returns the unit one, for dimensionless numbers. The zero Unit is
// the unit one too: every method treats it as One (Equal reports them
// equal; == does not).
func One() Unit { return one }

// norm returns One for the zero Unit.
func (u Unit) norm() Unit {
	if u.sp == nil {
		return one
	}
	return u
}

// Dim returns the unit's dimension.
func (u Unit) Dim() quantity.Dim { return u.dim }

// Factor returns the value in the coherent SI unit of one unit u (for a
// temperature scale, of one degree of interval).
func (u Unit) Factor() float64 { return u.norm().factor }

// Offset returns the SI value of the zero of a temperature scale
// (273.15 for °C); it is 0 for every other unit.
func (u Unit) Offset() float64 { return u.offset }

// IsScale reports whether u is a temperature scale with a shifted zero
// (°C, °F) written alone, which converts a temperature level affinely.
func (u Unit) IsScale() bool { return u.temp == tempScale }

// IsInterval reports whether u is an explicit temperature-difference unit
// (Δ°C, Δ°F, ΔK).
func (u Unit) IsInterval() bool { return u.temp == tempInterval }

// Angle returns the exponents of plane angle and of solid angle that u
// carries (1 and 0 for rad/s, 1 and 0 for rpm, 0 and 1 for sr).
func (u Unit) Angle() (plane, solid int) { return int(u.angle), int(u.solid) }

// Equal reports whether u and o are the same unit, whatever their
// spellings: same dimension, angles, factor, offset and temperature role.
func (u Unit) Equal(o Unit) bool {
	u, o = u.norm(), o.norm()
	return u.dim == o.dim && u.angle == o.angle && u.solid == o.solid && u.temp == o.temp &&
		u.offset == o.offset && sameFactor(u.factor, o.factor)
}

// sameFactor compares factors to 1e-13 relative (some hundreds of units
// in the last place), since the same unit reached by different products
// (kW·h, 3.6 MJ) may round differently, and a power of an inexact factor
// (eV⁻⁹ reached through eV^(3/2) and its square and cube) multiplies the
// rounding of each step by its exponent.
func sameFactor(a, b float64) bool {
	return a == b || math.Abs(a-b) <= 1e-13*math.Max(math.Abs(a), math.Abs(b))
}

// Compatible reports whether values in u convert to values in o.
func (u Unit) Compatible(o Unit) bool { return checkConvert(u, o) == nil }

// Mul returns the product unit u·o. A temperature scale in a product
// denotes its interval.
func (u Unit) Mul(o Unit) (Unit, error) {
	u, o = u.norm(), o.norm()
	d, err := u.dim.Mul(o.dim)
	if err != nil {
		return Unit{}, &Error{Op: "multiply units", Err: err}
	}
	var bt [16]term
	t, err := mergeTerms(append(bt[:0], u.terms()...), o.terms(), 1)
	if err == nil {
		err = t.holdable(builtinLookup)
	}
	if err != nil {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "multiply units", Err: err}
	}
	return newUnit("multiply units", Unit{dim: d, factor: u.factor * o.factor, angle: u.angle + o.angle, solid: u.solid + o.solid}, t, u, o)
}

// Div returns the quotient unit u/o.
func (u Unit) Div(o Unit) (Unit, error) {
	u, o = u.norm(), o.norm()
	d, err := u.dim.Div(o.dim)
	if err != nil {
		return Unit{}, &Error{Op: "divide units", Err: err}
	}
	var bt [16]term
	t, err := mergeTerms(append(bt[:0], u.terms()...), o.terms(), -1)
	if err == nil {
		err = t.holdable(builtinLookup)
	}
	if err != nil {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "divide units", Err: err}
	}
	return newUnit("divide units", Unit{dim: d, factor: u.factor / o.factor, angle: u.angle - o.angle, solid: u.solid - o.solid}, t, u, o)
}

// maxPowArg bounds the exponent Pow takes, so that its arithmetic cannot
// overflow; any larger exponent would take every symbol outside
// ±MaxExpAbs anyway.
const maxPowArg = 1 << 24

// Pow returns u raised to num/den. Angles must keep whole exponents. The
// result is one Parse reads back from its String: a power that takes a
// symbol's exponent outside what Parse accepts (±MaxExpAbs, denominator at
// most MaxExpDen) is refused with an *Error of class quantity.ErrRange, as Parse refuses
// "%^62".
func (u Unit) Pow(num, den int) (Unit, error) {
	u = u.norm()
	if den <= 0 {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Reason: fmt.Sprintf("the exponent %d/%d has a denominator that is not positive", num, den)}
	}
	if num > maxPowArg || num < -maxPowArg || den > maxPowArg {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Reason: fmt.Sprintf("the exponent %d/%d is out of range (a unit's exponents lie within ±%d)", num, den, MaxExpAbs)}
	}
	num, den = reduce(num, den)
	d, err := u.dim.Pow(num, den)
	if err != nil {
		return Unit{}, &Error{Op: "raise a unit to a power", Err: err}
	}
	a, s := int(u.angle)*num, int(u.solid)*num
	if a%den != 0 || s%den != 0 {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Reason: fmt.Sprintf("%s carries an angle, which cannot be raised to the power %s", u, ratText(num, den))}
	}
	var bt [16]term
	t, bad, ok := u.terms().powTo(bt[:0], num, den)
	if !ok {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Reason: fmt.Sprintf("the exponent of %s would be %s, outside ±%d with denominator at most %d", bad.Name, bad.Exp, MaxExpAbs, MaxExpDen)}
	}
	for _, x := range t {
		if !x.number && 6%x.Exp.Den() != 0 {
			return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Reason: fmt.Sprintf("the exponent of %s would be %s; a unit's exponents must be whole sixths, as its dimension's are", x.Name, x.Exp)}
		}
	}
	if err := t.holdable(builtinLookup); err != nil {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: "raise a unit to a power", Err: err}
	}
	return newUnit("raise a unit to a power", Unit{dim: d, factor: math.Pow(u.factor, float64(num)/float64(den)), angle: int8(a / den), solid: int8(s / den)}, t, u)
}

// newUnit completes r, the result of unit algebra, with its terms t, its
// spelling and temperature role, and checks its factor.
func newUnit(op string, r Unit, t terms, operands ...Unit) (Unit, error) {
	r.setTerms(t)
	return checkFactor(op, withRole(r, t, operands...))
}

// withRole gives the result r of unit algebra, spelled by terms t, the
// temperature role its spelling has, as Parse would: a result spelled as
// one of its operands keeps that operand's role (°C·1 is still the
// scale °C, a user's interval unit stays an interval); a single
// temperature symbol of the built-in table has its own role; anything
// else has none.
func withRole(r Unit, t terms, operands ...Unit) Unit {
	for _, o := range operands {
		if o.sp == r.sp && o.dim == r.dim {
			r.temp, r.offset = o.temp, o.offset
			return r
		}
	}
	if len(t) == 1 && t[0].Exp.IsOne() && !t[0].number {
		if e, ok := lookupIn(builtinIndex, t[0].Name); ok {
			switch {
			case e.scaleSym:
				r.temp, r.offset = tempScale, e.u.offset
			case e.u.temp == tempInterval:
				r.temp = tempInterval
			}
		}
	}
	return r
}

// checkFactor refuses a unit whose factor overflowed or underflowed.
func checkFactor(op string, u Unit) (Unit, error) {
	if !finite(u.factor) || u.factor == 0 {
		return Unit{}, &Error{Class: quantity.ErrRange, Op: op, Reason: fmt.Sprintf("the factor of %s to SI is out of the range of a float64", u)}
	}
	return u, nil
}

// Of returns the quantity of value v in unit u: v·factor + offset in SI.
// A unit without an offset adds none, so −0 stays −0 as written.
func (u Unit) Of(v float64) quantity.Quantity {
	u = u.norm()
	if u.offset == 0 {
		return quantity.New(v*u.factor, u.dim)
	}
	return quantity.New(v*u.factor+u.offset, u.dim)
}

// ValueOf returns q's value in unit u. It reports an *Error of OpConvert if q
// has another dimension. A Quantity carries no angle: its value is taken in
// radians (and steradians), as in the SI, so an angular velocity read in
// rpm is divided by 2π/60.
func (u Unit) ValueOf(q quantity.Quantity) (float64, error) {
	u = u.norm()
	if q.Dim() != u.dim {
		return 0, &Error{Op: OpConvert, FromDim: q.Dim(), To: u, Kind: ErrIncompatible, Reason: "the dimensions differ"}
	}
	return (q.Value() - u.offset) / u.factor, nil
}

// String returns the unit's spelling in ASCII, which Parse reads back.
func (u Unit) String() string {
	if u.sp == nil {
		return "1"
	}
	return u.sp.ascii
}

// AppendText appends u's ASCII spelling, as String writes it, to b. It
// implements encoding.TextAppender.
func (u Unit) AppendText(b []byte) ([]byte, error) { return append(b, u.String()...), nil }

// MarshalText encodes u as its ASCII spelling, as String writes it; Parse
// reads it back to the same unit.
func (u Unit) MarshalText() ([]byte, error) { return u.AppendText(nil) }

// UnmarshalText parses a unit expression with the built-in table.
func (u *Unit) UnmarshalText(b []byte) error {
	v, err := Parse(string(b))
	if err != nil {
		return err
	}
	*u = v
	return nil
}
