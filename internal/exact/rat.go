package exact

import (
	"errors"
	"math"
	"math/bits"
	"strconv"
)

// ErrOverflow reports a numerator or denominator that would not fit in
// an int64.
var ErrOverflow = errors.New("exact: rational overflow")

// Rat is a fraction Num/Den in lowest terms with Den > 0. The zero value
// is 0.
type Rat struct {
	Num, Den int64
}

// Int returns the rational n/1.
func Int(n int64) Rat { return Rat{n, 1} }

// Frac returns n/d in lowest terms. It panics if d is 0.
func Frac(n, d int64) Rat {
	if d == 0 {
		panic("exact: zero denominator")
	}
	return norm(n, d)
}

// gcd is Stein's binary algorithm, which avoids the slow 64-bit
// division; the small entries of dimensional matrices make it short.
func gcd(a, b int64) int64 {
	ua, ub := uabs(a), uabs(b)
	if ua == 0 {
		return int64(ub)
	}
	if ub == 0 {
		return int64(ua)
	}
	shift := bits.TrailingZeros64(ua | ub)
	ua >>= bits.TrailingZeros64(ua)
	for ub != 0 {
		ub >>= bits.TrailingZeros64(ub)
		if ua > ub {
			ua, ub = ub, ua
		}
		ub -= ua
	}
	return int64(ua << shift)
}

func uabs(a int64) uint64 {
	if a < 0 {
		return uint64(-a)
	}
	return uint64(a)
}

func norm(n, d int64) Rat {
	if n == 0 {
		return Rat{0, 1}
	}
	if d == 1 {
		return Rat{n, 1}
	}
	if d < 0 {
		n, d = -n, -d
	}
	g := gcd(n, d)
	return Rat{n / g, d / g}
}

func (r Rat) den() int64 {
	if r.Den == 0 {
		return 1
	}
	return r.Den
}

func mul64(a, b int64) (int64, bool) {
	if a == 0 || b == 0 {
		return 0, true
	}
	neg := (a < 0) != (b < 0)
	ua, ub := uint64(a), uint64(b)
	if a < 0 {
		ua = uint64(-a)
	}
	if b < 0 {
		ub = uint64(-b)
	}
	hi, lo := bits.Mul64(ua, ub)
	if hi != 0 || lo > math.MaxInt64 {
		return 0, false
	}
	if neg {
		return -int64(lo), true
	}
	return int64(lo), true
}

func add64(a, b int64) (int64, bool) {
	s := a + b
	if (a > 0 && b > 0 && s < 0) || (a < 0 && b < 0 && s >= 0) {
		return 0, false
	}
	return s, true
}

// Add returns r+s.
func (r Rat) Add(s Rat) (Rat, error) {
	rd, sd := r.den(), s.den()
	if rd == 1 && sd == 1 {
		n, ok := add64(r.Num, s.Num)
		if !ok {
			return Rat{}, ErrOverflow
		}
		return Rat{n, 1}, nil
	}
	g := gcd(rd, sd)
	a, ok1 := mul64(r.Num, sd/g)
	b, ok2 := mul64(s.Num, rd/g)
	d, ok3 := mul64(rd, sd/g)
	if !ok1 || !ok2 || !ok3 {
		return Rat{}, ErrOverflow
	}
	n, ok := add64(a, b)
	if !ok {
		return Rat{}, ErrOverflow
	}
	return norm(n, d), nil
}

// Sub returns r−s.
func (r Rat) Sub(s Rat) (Rat, error) { return r.Add(s.Neg()) }

// Mul returns r·s.
func (r Rat) Mul(s Rat) (Rat, error) {
	if r.Num == 0 || s.Num == 0 {
		return Rat{0, 1}, nil
	}
	if r.den() == 1 && s.den() == 1 {
		n, ok := mul64(r.Num, s.Num)
		if !ok {
			return Rat{}, ErrOverflow
		}
		return Rat{n, 1}, nil
	}
	g1, g2 := gcd(r.Num, s.den()), gcd(s.Num, r.den())
	if g1 == 0 {
		g1 = 1
	}
	if g2 == 0 {
		g2 = 1
	}
	n, ok1 := mul64(r.Num/g1, s.Num/g2)
	d, ok2 := mul64(r.den()/g2, s.den()/g1)
	if !ok1 || !ok2 {
		return Rat{}, ErrOverflow
	}
	return norm(n, d), nil
}

// Div returns r/s. It panics if s is zero.
func (r Rat) Div(s Rat) (Rat, error) {
	if s.Num == 0 {
		panic("exact: division by zero")
	}
	return r.Mul(Rat{s.den(), s.Num}.normed())
}

func (r Rat) normed() Rat { return norm(r.Num, r.Den) }

// Neg returns −r.
func (r Rat) Neg() Rat { return Rat{-r.Num, r.den()} }

// IsZero reports whether r is 0.
func (r Rat) IsZero() bool { return r.Num == 0 }

// IsInt reports whether r is a whole number.
func (r Rat) IsInt() bool { return r.den() == 1 }

// Sign returns −1, 0 or +1.
func (r Rat) Sign() int {
	switch {
	case r.Num < 0:
		return -1
	case r.Num > 0:
		return 1
	}
	return 0
}

// Cmp compares r and s.
func (r Rat) Cmp(s Rat) int {
	d, err := r.Sub(s)
	if err != nil {
		// Fall back to floating comparison; exact enough for ordering.
		a, b := r.Float(), s.Float()
		switch {
		case a < b:
			return -1
		case a > b:
			return 1
		}
		return 0
	}
	return d.Sign()
}

// Float returns r as the nearest float64.
func (r Rat) Float() float64 { return float64(r.Num) / float64(r.den()) }

// String returns "n" or "n/d".
func (r Rat) String() string {
	if r.den() == 1 {
		return strconv.FormatInt(r.Num, 10)
	}
	return strconv.FormatInt(r.Num, 10) + "/" + strconv.FormatInt(r.den(), 10)
}

// Vec is a vector of rationals.
type Vec []Rat

// Matrix is a dense matrix of rationals, stored by rows.
type Matrix [][]Rat

// NewMatrix returns a rows×cols zero matrix.
func NewMatrix(rows, cols int) Matrix {
	m := make(Matrix, rows)
	cells := make([]Rat, rows*cols)
	for i := range m {
		m[i] = cells[i*cols : (i+1)*cols : (i+1)*cols]
		for j := range m[i] {
			m[i][j] = Rat{0, 1}
		}
	}
	return m
}

// Clone returns a deep copy of m.
func (m Matrix) Clone() Matrix {
	if len(m) == 0 {
		return Matrix{}
	}
	c := NewMatrix(len(m), len(m[0]))
	for i := range m {
		copy(c[i], m[i])
	}
	return c
}

// Cols returns the number of columns.
func (m Matrix) Cols() int {
	if len(m) == 0 {
		return 0
	}
	return len(m[0])
}

// RREF reduces m in place to reduced row echelon form and returns the
// pivot column of each nonzero row, in order; their number is the rank.
func (m Matrix) RREF() (pivots []int, err error) {
	rows, cols := len(m), m.Cols()
	r := 0
	for c := 0; c < cols && r < rows; c++ {
		p := -1
		for i := r; i < rows; i++ {
			if !m[i][c].IsZero() {
				p = i
				break
			}
		}
		if p < 0 {
			continue
		}
		m[r], m[p] = m[p], m[r]
		inv := m[r][c]
		for j := c; j < cols; j++ {
			if m[r][j], err = m[r][j].Div(inv); err != nil {
				return nil, err
			}
		}
		for i := 0; i < rows; i++ {
			if i == r || m[i][c].IsZero() {
				continue
			}
			f := m[i][c]
			for j := c; j < cols; j++ {
				t, err := f.Mul(m[r][j])
				if err != nil {
					return nil, err
				}
				if m[i][j], err = m[i][j].Sub(t); err != nil {
					return nil, err
				}
			}
		}
		pivots = append(pivots, c)
		r++
	}
	return pivots, nil
}

// Rank returns the rank of m, leaving m unchanged.
func (m Matrix) Rank() (int, error) {
	p, err := m.Clone().RREF()
	return len(p), err
}

// NullSpace returns a basis of the right null space of m, one vector per
// free column, each with a 1 in its free column.
func (m Matrix) NullSpace() ([]Vec, error) {
	r := m.Clone()
	pivots, err := r.RREF()
	if err != nil {
		return nil, err
	}
	cols := m.Cols()
	isPivot := make([]bool, cols)
	for _, c := range pivots {
		isPivot[c] = true
	}
	var basis []Vec
	for f := 0; f < cols; f++ {
		if isPivot[f] {
			continue
		}
		v := make(Vec, cols)
		for j := range v {
			v[j] = Rat{0, 1}
		}
		v[f] = Int(1)
		for i, c := range pivots {
			v[c] = r[i][f].Neg()
		}
		basis = append(basis, v)
	}
	return basis, nil
}

// Transpose returns mᵀ.
func (m Matrix) Transpose() Matrix {
	t := NewMatrix(m.Cols(), len(m))
	for i := range m {
		for j := range m[i] {
			t[j][i] = m[i][j]
		}
	}
	return t
}

// Solve returns x with A·x = b when the system is consistent; the
// solution sets free variables to zero. It reports ok = false for an
// inconsistent system.
func Solve(a Matrix, b Vec) (x Vec, ok bool, err error) {
	rows, cols := len(a), a.Cols()
	aug := NewMatrix(rows, cols+1)
	for i := range a {
		copy(aug[i], a[i])
		aug[i][cols] = b[i]
	}
	pivots, err := aug.RREF()
	if err != nil {
		return nil, false, err
	}
	for _, c := range pivots {
		if c == cols {
			return nil, false, nil
		}
	}
	x = make(Vec, cols)
	for j := range x {
		x[j] = Rat{0, 1}
	}
	for i, c := range pivots {
		x[c] = aug[i][cols]
	}
	return x, true, nil
}

// Integers scales v by a positive rational so that its entries are
// coprime integers, and returns the scaled vector and the factor used.
func Integers(v Vec) (Vec, Rat, error) {
	out := make(Vec, len(v))
	f, err := IntegersTo(out, v)
	return out, f, err
}

// IntegersTo is Integers writing into dst, which must have v's length
// and may be v itself.
func IntegersTo(dst, v Vec) (Rat, error) {
	l := int64(1)
	for _, x := range v {
		d := x.den()
		g := gcd(l, d)
		var ok bool
		if l, ok = mul64(l, d/g); !ok {
			return Rat{}, ErrOverflow
		}
	}
	out := dst
	g := int64(0)
	for i, x := range v {
		n, ok := mul64(x.Num, l/x.den())
		if !ok {
			return Rat{}, ErrOverflow
		}
		out[i] = Int(n)
		g = gcd(g, n)
	}
	if g > 1 {
		for i := range out {
			out[i] = Int(out[i].Num / g)
		}
	}
	if g == 0 {
		g = 1
	}
	return Frac(l, g), nil
}

// IntMatrix is a dense matrix of int64, for fraction-free elimination of
// integer matrices (dimensional matrices held in sixths).
type IntMatrix [][]int64

// GaussJordan reduces m in place, without fractions, to a form in which
// each pivot column is zero but for its pivot: row i is replaced by
// p·row_i − f·row_r and divided by the gcd of its entries. It returns the
// pivot column of each nonzero row in order; their number is the rank.
// The solution of the system in the pivot variables is then
// x_c = m[r][j]/m[r][c] for the pivot c of row r.
func (m IntMatrix) GaussJordan() (pivots []int, err error) {
	rows := len(m)
	if rows == 0 {
		return nil, nil
	}
	cols := len(m[0])
	r := 0
	for c := 0; c < cols && r < rows; c++ {
		p := -1
		for i := r; i < rows; i++ {
			if m[i][c] != 0 {
				p = i
				break
			}
		}
		if p < 0 {
			continue
		}
		m[r], m[p] = m[p], m[r]
		pv := m[r][c]
		for i := 0; i < rows; i++ {
			f := m[i][c]
			if i == r || f == 0 {
				continue
			}
			g := int64(0)
			for j := range cols {
				a, ok1 := mul64(pv, m[i][j])
				b, ok2 := mul64(f, m[r][j])
				if !ok1 || !ok2 {
					return nil, ErrOverflow
				}
				d, ok := add64(a, -b)
				if !ok {
					return nil, ErrOverflow
				}
				m[i][j] = d
				g = gcd(g, d)
			}
			if g > 1 {
				for j := range cols {
					m[i][j] /= g
				}
			}
		}
		pivots = append(pivots, c)
		r++
	}
	return pivots, nil
}

// Clone returns a deep copy of m.
func (m IntMatrix) Clone() IntMatrix {
	c := make(IntMatrix, len(m))
	if len(m) == 0 {
		return c
	}
	cells := make([]int64, len(m)*len(m[0]))
	for i := range m {
		c[i] = cells[i*len(m[0]) : (i+1)*len(m[0]) : (i+1)*len(m[0])]
		copy(c[i], m[i])
	}
	return c
}
