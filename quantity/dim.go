package quantity

import (
	"strconv"
)

// Base names one of the seven SI base dimensions, in ISO 80000-1 order.
type Base uint8

// The seven base dimensions of the International System of Quantities,
// in the order ISO 80000-1 lists them.
const (
	BaseL     Base = iota // length, L
	BaseM                 // mass, M
	BaseT                 // time, T
	BaseI                 // electric current, I
	BaseTheta             // thermodynamic temperature, Θ
	BaseN                 // amount of substance, N
	BaseJ                 // luminous intensity, J
	NumBases  = 7         // number of base dimensions
)

var baseSymbol = [NumBases]string{"L", "M", "T", "I", "Θ", "N", "J"}
var baseSymbolASCII = [NumBases]string{"L", "M", "T", "I", "Th", "N", "J"}
var baseUnit = [NumBases]string{"m", "kg", "s", "A", "K", "mol", "cd"}

// unitOrder is the order in which base units are written in the SI
// base-unit form: kg first, as in kg·m⁻¹·s⁻².
var unitOrder = [NumBases]Base{BaseM, BaseL, BaseT, BaseI, BaseTheta, BaseN, BaseJ}

// String returns the ISO 80000 dimension symbol of b ("L", "M", …, "Θ").
func (b Base) String() string {
	if b >= NumBases {
		return "Base(" + strconv.Itoa(int(b)) + ")"
	}
	return baseSymbol[b]
}

// Unit returns the symbol of the SI base unit of b ("m", "kg", …).
func (b Base) Unit() string {
	if b >= NumBases {
		return b.String()
	}
	return baseUnit[b]
}

// expDen is the denominator in which Dim stores exponents: every exponent
// is a whole number of sixths, which holds halves and thirds exactly.
const expDen = 6

// MaxExp and MinExp bound the exponents a Dim can hold, in sixths:
// from −128/6 = −21⅓ to 127/6 = 21⅙.
const (
	maxExpSixths = 127
	minExpSixths = -128
)

// Dim is a physical dimension: the product of the seven SI base
// dimensions, each raised to a rational exponent. Exponents are held
// exactly as whole numbers of sixths (so L^(1/2), T^(1/3) and M^(5/6) are
// exact), over −21⅓ … 21⅙. An operation whose result would fall outside
// that range, or whose exponent is not a whole number of sixths, reports
// an *Error of class ErrDimension; nothing wraps.
//
// Dim is a small comparable value: == compares dimensions and a Dim can be
// a map key. The zero Dim is dimensionless (dimension one).
//
// The integer holds the exponents e₀…e₆ (in sixths, each in −128…127) as
// Σ eₖ·2^(9k), modulo 2⁶⁴. The encoding is linear, so the dimension of a
// product is the sum of the encodings and of a quotient their difference;
// and it is one-to-one, so == compares dimensions. Build dimensions with
// the kinds (Length, Pressure, …), NewDim, DimOf, ParseDim and the
// methods; converting an arbitrary integer to a Dim is not meaningful.
type Dim uint64

// Dimensionless is the dimension one, the zero Dim.
const Dimensionless Dim = 0

const (
	laneBits = 9
	// laneBias, added to an encoding, makes every in-range lane a
	// non-negative 8-bit number with bit 8 clear.
	laneBias = 128 * (1 | 1<<9 | 1<<18 | 1<<27 | 1<<36 | 1<<45 | 1<<54)
	// laneGuard selects bit 8 of every lane: after adding laneBias it is
	// set exactly in the lowest lane that left −128…127, so a nonzero
	// (bits+laneBias)&laneGuard reports an overflow.
	laneGuard = 256 * (1 | 1<<9 | 1<<18 | 1<<27 | 1<<36 | 1<<45 | 1<<54)
)

// lanes decodes the seven exponents, in sixths.
func (d Dim) lanes() (e [NumBases]int8) {
	u := uint64(d) + laneBias
	for k := range e {
		e[k] = int8(int((u>>(laneBits*k))&0x1ff) - 128)
	}
	return e
}

func encode(e [NumBases]int8) Dim {
	var x uint64
	for k, v := range e {
		x += uint64(int64(v) << (laneBits * k))
	}
	return Dim(x)
}

// lane decodes the exponent of base b, in sixths.
func (d Dim) lane(b Base) int8 {
	return int8(int(((uint64(d)+laneBias)>>(laneBits*uint(b)))&0x1ff) - 128)
}

// add returns d+o lane-wise and whether every lane stayed in range.
func (d Dim) add(o Dim) (Dim, bool) {
	s := uint64(d) + uint64(o)
	return Dim(s), (s+laneBias)&laneGuard == 0
}

// sub returns d−o lane-wise and whether every lane stayed in range.
func (d Dim) sub(o Dim) (Dim, bool) {
	s := uint64(d) - uint64(o)
	return Dim(s), (s+laneBias)&laneGuard == 0
}

// DimOf returns the dimension of base b raised to num/den.
func DimOf(b Base, num, den int) (Dim, error) {
	if b >= NumBases {
		return Dim(0), &Error{Op: "build a dimension", Reason: "base " + strconv.Itoa(int(b)) + " does not exist", Class: ErrDimension}
	}
	s, err := sixths(num, den)
	if err != nil {
		return Dim(0), err
	}
	var e [NumBases]int8
	e[b] = s
	return encode(e), nil
}

// NewDim returns the dimension L^l M^m T^t I^i Θ^th N^n J^j with whole
// exponents. It reports an *Error of class ErrDimension if an exponent is
// out of range.
func NewDim(l, m, t, i, th, n, j int) (Dim, error) {
	var e [NumBases]int8
	for k, x := range [NumBases]int{l, m, t, i, th, n, j} {
		s, err := sixths(x, 1)
		if err != nil {
			return Dim(0), err
		}
		e[k] = s
	}
	return encode(e), nil
}

// MustDim is like NewDim but panics if the exponents are out of range. It
// is meant for package-level declarations.
func MustDim(l, m, t, i, th, n, j int) Dim {
	d, err := NewDim(l, m, t, i, th, n, j)
	if err != nil {
		panic(err)
	}
	return d
}

func sixths(num, den int) (int8, error) {
	if den == 0 {
		return 0, &Error{Op: "build a dimension", Reason: "exponent " + strconv.Itoa(num) + "/0 has a zero denominator", Class: ErrDimension}
	}
	if (num*expDen)%den != 0 || num > 1<<20 || num < -(1<<20) {
		return 0, &Error{Op: "build a dimension", Reason: "exponent " + ratText(num, den) + " is not a whole number of sixths", Class: ErrDimension}
	}
	s := num * expDen / den
	if s > maxExpSixths || s < minExpSixths {
		return 0, &Error{Op: "build a dimension", Reason: "exponent " + ratText(num, den) + " is outside −21⅓ … 21⅙", Class: ErrDimension}
	}
	return int8(s), nil
}

// Sixths returns the exponent of base b in d in sixths (so L^(1/2) gives 3).
func (d Dim) Sixths(b Base) int {
	if b >= NumBases {
		return 0
	}
	return int(d.lane(b))
}

// IsDimensionless reports whether d is the dimension one.
func (d Dim) IsDimensionless() bool { return d == 0 }

// Mul returns the dimension of a product d·o.
func (d Dim) Mul(o Dim) (Dim, error) {
	r, ok := d.add(o)
	if !ok {
		return Dim(0), &Error{Op: "multiply", Dims: [2]Dim{d, o}, Binary: true, Reason: "an exponent overflows", Class: ErrDimension}
	}
	return r, nil
}

// Div returns the dimension of a quotient d/o.
func (d Dim) Div(o Dim) (Dim, error) {
	r, ok := d.sub(o)
	if !ok {
		return Dim(0), &Error{Op: "divide", Dims: [2]Dim{d, o}, Binary: true, Reason: "an exponent overflows", Class: ErrDimension}
	}
	return r, nil
}

// Inv returns the dimension of 1/d.
func (d Dim) Inv() (Dim, error) {
	return Dimensionless.Div(d)
}

// Pow returns d raised to num/den. It reports an *Error of class
// ErrDimension when a resulting exponent is not a whole number of sixths
// or is out of range.
func (d Dim) Pow(num, den int) (Dim, error) {
	if den == 0 {
		return Dim(0), &Error{Op: "raise %s to a power", Dims: [2]Dim{d}, Reason: "exponent " + strconv.Itoa(num) + "/0 has a zero denominator", Class: ErrDimension}
	}
	if num == den {
		return d, nil
	}
	in := d.lanes()
	var out [NumBases]int8
	for b, v := range in {
		e := int64(v) * int64(num)
		if e%int64(den) != 0 {
			return Dim(0), &Error{Op: "raise %s to the power " + ratText(num, den), Dims: [2]Dim{d}, Reason: "the exponent of " + Base(b).String() + " would not be a whole number of sixths", Class: ErrDimension}
		}
		e /= int64(den)
		if e > maxExpSixths || e < minExpSixths {
			return Dim(0), &Error{Op: "raise %s to the power " + ratText(num, den), Dims: [2]Dim{d}, Reason: "the exponent of " + Base(b).String() + " overflows", Class: ErrDimension}
		}
		out[b] = int8(e)
	}
	return encode(out), nil
}

// spelling is one way of writing a Dim.
type spelling struct {
	order   [NumBases]Base
	symbols *[NumBases]string
	sep     string
	sup     bool // Unicode superscripts rather than ^n
}

var (
	isoOrder      = [NumBases]Base{BaseL, BaseM, BaseT, BaseI, BaseTheta, BaseN, BaseJ}
	spellISO      = spelling{isoOrder, &baseSymbol, " ", true}
	spellISOASCII = spelling{isoOrder, &baseSymbolASCII, " ", false}
	spellSI       = spelling{unitOrder, &baseUnit, "·", true}
	spellSIASCII  = spelling{unitOrder, &baseUnit, " ", false}
)

func (d Dim) spell(sp spelling) string {
	var buf [NumBases]Factor
	p := Product(buf[:0])
	for _, b := range sp.order {
		if e := d.Exponent(b); !e.IsZero() {
			p = append(p, Factor{sp.symbols[b], e})
		}
	}
	style := ASCII
	if sp.sup {
		style = Unicode
	}
	return p.Format(style, Inline, sp.sep)
}

// String returns the ISO 80000 dimension form, base symbols in ISO order
// separated by spaces with Unicode superscripts: "L⁻¹ M T⁻²". Fractional
// exponents are written in parentheses, "L^(-1/2) M T⁻²"; the dimension one
// is "1".
func (d Dim) String() string { return d.spell(spellISO) }

// ASCII returns the ISO dimension form in ASCII: "L^-1 M T^-2", with Θ
// written "Th".
func (d Dim) ASCII() string { return d.spell(spellISOASCII) }

// SIUnit returns d written in SI base units with a middle dot and Unicode
// superscripts, kg first: "kg·m⁻¹·s⁻²". The dimension one is "1".
func (d Dim) SIUnit() string { return d.spell(spellSI) }

// SIUnitASCII returns d in SI base units in ASCII, for logs and CSV
// headers: "kg m^-1 s^-2".
func (d Dim) SIUnitASCII() string { return d.spell(spellSIASCII) }

// ratText writes num/den in lowest terms, as Rat writes it.
func ratText(num, den int) string {
	if den == 0 {
		return strconv.Itoa(num) + "/0"
	}
	return norm(int64(num), int64(den)).String()
}
