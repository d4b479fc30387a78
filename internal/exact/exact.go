package exact

import (
	"errors"
	"math"
	"math/bits"
)

// ErrOverflow reports an integer elimination whose entries would not fit
// in an int64.
var ErrOverflow = errors.New("exact: integer overflow")

// Field is what the rational algorithms need of an exact number type:
// its zero value is zero, and arithmetic reports overflow as an error.
type Field[T any] interface {
	Add(T) (T, error)
	Sub(T) (T, error)
	Mul(T) (T, error)
	Div(T) (T, error)
	Neg() T
	IsZero() bool
}

// GCD returns the greatest common divisor of |a| and |b| (0 for two
// zeros), for every pair of int64 but (MinInt64, MinInt64) and
// (MinInt64, 0), whose gcd 2⁶³ an int64 cannot hold. It is the one gcd
// of the module.
func GCD(a, b int64) int64 { return gcd(a, b) }

// Uabs returns |a| as a uint64, exact for every int64 (math.MinInt64
// included). It is the one absolute value of an int64 of the module.
func Uabs(a int64) uint64 { return uabs(a) }

// Mul64 returns a·b and whether it fits in an int64.
func Mul64(a, b int64) (int64, bool) { return mul64(a, b) }

// Add64 returns a+b and whether it fits in an int64.
func Add64(a, b int64) (int64, bool) { return add64(a, b) }

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

func mul64(a, b int64) (int64, bool) {
	if a == 0 || b == 0 {
		return 0, true
	}
	neg := (a < 0) != (b < 0)
	hi, lo := bits.Mul64(uabs(a), uabs(b))
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

// Matrix is a dense matrix of exact numbers, stored by rows.
type Matrix[T Field[T]] [][]T

// NewMatrix returns a rows×cols zero matrix.
func NewMatrix[T Field[T]](rows, cols int) Matrix[T] {
	m := make(Matrix[T], rows)
	cells := make([]T, rows*cols)
	for i := range m {
		m[i] = cells[i*cols : (i+1)*cols : (i+1)*cols]
	}
	return m
}

// Clone returns a deep copy of m.
func (m Matrix[T]) Clone() Matrix[T] {
	if len(m) == 0 {
		return Matrix[T]{}
	}
	c := NewMatrix[T](len(m), len(m[0]))
	for i := range m {
		copy(c[i], m[i])
	}
	return c
}

// Cols returns the number of columns.
func (m Matrix[T]) Cols() int {
	if len(m) == 0 {
		return 0
	}
	return len(m[0])
}

// RREF reduces m in place to reduced row echelon form and returns the
// pivot column of each nonzero row, in order; their number is the rank.
func (m Matrix[T]) RREF() (pivots []int, err error) {
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
func (m Matrix[T]) Rank() (int, error) {
	p, err := m.Clone().RREF()
	return len(p), err
}

// NullSpace returns a basis of the right null space of m, one vector per
// free column, each with one (the value given) in its free column.
func (m Matrix[T]) NullSpace(one T) ([][]T, error) {
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
	var basis [][]T
	for f := 0; f < cols; f++ {
		if isPivot[f] {
			continue
		}
		v := make([]T, cols)
		v[f] = one
		for i, c := range pivots {
			v[c] = r[i][f].Neg()
		}
		basis = append(basis, v)
	}
	return basis, nil
}

// Transpose returns mᵀ.
func (m Matrix[T]) Transpose() Matrix[T] {
	t := NewMatrix[T](m.Cols(), len(m))
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
func Solve[T Field[T]](a Matrix[T], b []T) (x []T, ok bool, err error) {
	rows, cols := len(a), a.Cols()
	aug := NewMatrix[T](rows, cols+1)
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
	x = make([]T, cols)
	for i, c := range pivots {
		x[c] = aug[i][cols]
	}
	return x, true, nil
}

// IntMatrix is a dense matrix of int64, for fraction-free elimination of
// integer matrices (dimensional matrices held in sixths).
type IntMatrix [][]int64

// GaussJordan reduces m in place, without fractions, to a form in which
// each pivot column is zero but for its pivot: row i is replaced by
// p·row_i − f·row_r and divided by the gcd of its entries. It appends the
// pivot column of each nonzero row in order to pivots (nil, or a caller's
// buffer) and returns them; their number is the rank.
// The solution of the system in the pivot variables is then
// x_c = m[r][j]/m[r][c] for the pivot c of row r.
func (m IntMatrix) GaussJordan(pivots []int) ([]int, error) {
	rows := len(m)
	if rows == 0 {
		return pivots, nil
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
		if p != r {
			// Swap the entries, not the row slices: m stores no pointer, so
			// a caller's stack matrix stays on the stack.
			for j := range cols {
				m[r][j], m[p][j] = m[p][j], m[r][j]
			}
		}
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
