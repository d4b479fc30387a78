package fit

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// Fairing is a monotone piecewise-cubic Hermite interpolant through
// points (x_i, y_i) whose y are monotone in x: the method of Fritsch and
// Carlson (SIAM J. Numer. Anal. 17 (1980) 238–246). The slopes at the
// points start as the mean of the neighbouring secant slopes (0 where
// those differ in sign or one is 0, the one secant at an end) and are then
// limited on each interval so that (α, β) = (d_i, d_{i+1})/Δ_i lies in
// the disc α² + β² ≤ 9, a sufficient condition for the cubic on the
// interval to be monotone. The curve is therefore monotone in the same
// sense as the points, passes through each of them, has a continuous
// slope, and has no extremum between points: it cannot wiggle. It is not
// a fit: it goes through the points given, so fair fitted or averaged
// values (the means at repeated x, a fitted curve sampled where it is
// known to be monotone), not raw scatter.
type Fairing struct {
	x, y, d []float64
	// Increasing is true for a non-decreasing curve, false for a
	// non-increasing one.
	Increasing bool
}

// MaxFairPoints is the most points Fair takes.
const MaxFairPoints = 1 << 20

// Fair returns the monotone fairing through the points. x must be
// strictly increasing and y monotone (non-decreasing or non-increasing);
// Fair refuses, naming the row, data that are not monotone rather than
// return a curve that is not, and checks the limited slopes of every
// interval against the monotonicity condition before returning.
func Fair(x, y []float64) (*Fairing, error) {
	const op = "Fair"
	if err := checkXY(op, x, y); err != nil {
		return nil, err
	}
	n := len(x)
	if n < 2 {
		return nil, invalid(op, -1, "%d points: want at least 2", n)
	}
	if n > MaxFairPoints {
		return nil, invalid(op, -1, "%d points, more than %d", n, MaxFairPoints)
	}
	up, down := true, true
	for i := 1; i < n; i++ {
		if !(x[i] > x[i-1]) {
			return nil, invalid(op, i, "x = %v after %v: want x strictly increasing", x[i], x[i-1])
		}
		up = up && y[i] >= y[i-1]
		down = down && y[i] <= y[i-1]
		if !up && !down {
			return nil, invalid(op, i, "y = %v after %v turns back: the points are not monotone, and a monotone fairing through them does not exist (fit or average them first)", y[i], y[i-1])
		}
	}
	f := &Fairing{x: slices.Clone(x), y: slices.Clone(y), d: make([]float64, n), Increasing: up}
	delta := make([]float64, n-1)
	for i := range n - 1 {
		h := x[i+1] - x[i]
		if !finite(h) {
			return nil, outOfRange(op, i+1, "the step in x from row %d is out of the range of a float64", i)
		}
		delta[i] = (y[i+1] - y[i]) / h
		if !finite(delta[i]) || !finite(delta[i]*h) {
			return nil, outOfRange(op, i, "the slope from row %d to %d is out of the range of a float64", i, i+1)
		}
	}
	f.d[0], f.d[n-1] = delta[0], delta[n-2]
	for i := 1; i < n-1; i++ {
		if delta[i-1]*delta[i] > 0 {
			f.d[i] = delta[i-1]/2 + delta[i]/2
		}
	}
	for i := range n - 1 {
		if delta[i] == 0 {
			f.d[i], f.d[i+1] = 0, 0
			continue
		}
		a, b := f.d[i]/delta[i], f.d[i+1]/delta[i]
		if r := math.Hypot(a, b); r > 3 {
			tau := 3 / r
			f.d[i], f.d[i+1] = tau*a*delta[i], tau*b*delta[i]
		}
	}
	// Check every interval: slopes of the secant's sign, (α, β) in the
	// disc (with a rounding margin).
	for i := range n - 1 {
		if delta[i] == 0 {
			if f.d[i] != 0 || f.d[i+1] != 0 {
				return nil, invalid(op, i, "internal: a flat interval with a slope")
			}
			continue
		}
		a, b := f.d[i]/delta[i], f.d[i+1]/delta[i]
		if a < 0 || b < 0 || a*a+b*b > 9*(1+1e-12) {
			return nil, invalid(op, i, "internal: the slopes on the interval from row %d do not meet the monotonicity condition", i)
		}
	}
	return f, nil
}

// Range returns the first and last x of the fairing.
func (f *Fairing) Range() (lo, hi float64) { return f.x[0], f.x[len(f.x)-1] }

// At returns the faired value at x, refusing an x outside the points'
// range with an *Error of class quantity.ErrRange: a fairing says
// nothing beyond its points.
func (f *Fairing) At(x float64) (float64, error) {
	lo, hi := f.Range()
	if !(x >= lo && x <= hi) {
		return 0, outOfRange("Fairing.At", -1, "x = %v is outside the faired range [%v, %v]", x, lo, hi)
	}
	i, _ := slices.BinarySearch(f.x, x)
	if i > 0 {
		i--
	}
	if i >= len(f.x)-1 {
		i = len(f.x) - 2
	}
	h := f.x[i+1] - f.x[i]
	s := (x - f.x[i]) / h
	s2, s3 := s*s, s*s*s
	h00, h10, h01, h11 := 2*s3-3*s2+1, s3-2*s2+s, -2*s3+3*s2, s3-s2
	y := h00*f.y[i] + h10*h*f.d[i] + h01*f.y[i+1] + h11*h*f.d[i+1]
	if !finite(y) {
		return 0, outOfRange("Fairing.At", -1, "the faired value at x = %v is out of the range of a float64", x)
	}
	// Rounding cannot take y outside the interval's end values.
	a, b := min(f.y[i], f.y[i+1]), max(f.y[i], f.y[i+1])
	return min(max(y, a), b), nil
}

// Monotone reports whether the polynomial is monotone on [lo, hi], and
// in which sense: it finds the real roots of dy/dx (the eigenvalues of
// its companion matrix, in t) and checks the sign of dy/dx between
// consecutive roots in the range. A derivative that touches 0 without
// changing sign keeps the polynomial monotone. A slope within 10⁻⁹ of the
// largest slope found in the range counts as 0 (rounding about a root). It returns an *Error of
// class quantity.ErrInvalid naming an x where the slope changes sign when
// the polynomial is not monotone there, and refuses a range that is not
// within the fitted range (class quantity.ErrRange).
func (f *Poly) Monotone(lo, hi float64) (increasing bool, err error) {
	const op = "Monotone"
	if !(lo < hi) || !finite(lo) || !finite(hi) {
		return false, invalid(op, -1, "range [%v, %v]: want finite lo < hi", lo, hi)
	}
	if lo < f.XMin || hi > f.XMax {
		return false, outOfRange(op, -1, "range [%v, %v] is not within the fitted range [%v, %v]", lo, hi, f.XMin, f.XMax)
	}
	// Derivative in t: Σ k B_k t^(k−1); find its degree.
	deg := f.Order - 1
	for deg >= 0 && f.B[deg+1] == 0 {
		deg--
	}
	tl, th := f.T(lo), f.T(hi)
	pts := []float64{tl, th}
	if deg >= 1 {
		lead := float64(deg+1) * f.B[deg+1]
		cm := mat.NewDense(deg, deg, nil)
		for j := range deg {
			cm.Set(0, j, -float64(deg-j)*f.B[deg-j]/lead)
			if j+1 < deg {
				cm.Set(j+1, j, 1)
			}
		}
		var eig mat.Eigen
		if !eig.Factorize(cm, mat.EigenNone) {
			return false, invalid(op, -1, "the roots of the slope could not be found")
		}
		for _, r := range eig.Values(nil) {
			if math.Abs(imag(r)) <= 1e-9*(1+math.Abs(real(r))) && real(r) > tl && real(r) < th {
				pts = append(pts, real(r))
			}
		}
	}
	slices.Sort(pts)
	// Slopes at the ends and between consecutive roots; a slope within
	// 10⁻⁹ of the largest found is rounding about a root, not a sign.
	xs, ss := make([]float64, 0, 2*len(pts)), make([]float64, 0, 2*len(pts))
	smax := 0.0
	add := func(tm float64) {
		xm := f.Center + f.Scale*tm
		s := f.Slope(xm)
		xs, ss = append(xs, xm), append(ss, s)
		smax = max(smax, math.Abs(s))
	}
	add(tl)
	add(th)
	for i := range len(pts) - 1 {
		if pts[i+1]-pts[i] > 1e-9*(th-tl) {
			add(pts[i]/2 + pts[i+1]/2)
		}
	}
	pos, neg := false, false
	var negAt, posAt float64
	for i, s := range ss {
		switch {
		case s > 1e-9*smax:
			pos, posAt = true, xs[i]
		case s < -1e-9*smax:
			neg, negAt = true, xs[i]
		}
	}
	switch {
	case pos && neg:
		return false, invalid(op, -1, "the polynomial is not monotone on [%v, %v]: its slope is positive at x = %.6g and negative at x = %.6g", lo, hi, posAt, negAt)
	case !pos && !neg:
		return true, nil // constant: both non-decreasing and non-increasing
	}
	return pos, nil
}

// Fair returns the monotone fairing of the polynomial sampled at n
// equally spaced points on [lo, hi] (2 ≤ n ≤ MaxFairPoints), after
// checking with Monotone that the polynomial is monotone there; it
// refuses otherwise. Use it to tabulate a fitted curve that must not
// wiggle between the points of the table.
func (f *Poly) Fair(lo, hi float64, n int) (*Fairing, error) {
	if n < 2 || n > MaxFairPoints {
		return nil, invalid("Poly.Fair", -1, "%d points: want 2 … %d", n, MaxFairPoints)
	}
	if _, err := f.Monotone(lo, hi); err != nil {
		return nil, err
	}
	x, y := make([]float64, n), make([]float64, n)
	for i := range n {
		x[i] = lo + (hi-lo)*float64(i)/float64(n-1)
		y[i] = f.Eval(x[i])
	}
	x[n-1] = hi
	return Fair(x, y)
}
