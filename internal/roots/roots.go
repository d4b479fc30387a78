// Package roots finds a root of a function of one variable in a bracket.
// It holds the algorithm only; callers report a failure in their own
// error type, with ErrNoBracket as its cause.
package roots

import (
	"errors"
	"math"
)

// ErrNoBracket is returned when f has no sign change over the bracket
// (or is NaN at an end), so no root is bracketed.
var ErrNoBracket = errors.New("no root in the bracket")

// MaxHalvings bounds Bisect's work.
const MaxHalvings = 200

// Bisect finds x in [lo, hi] with f(x) = 0 by bisection, f(lo) and f(hi)
// having opposite signs; MaxHalvings halvings at most, stopping when the
// bracket is narrower than 1e-12 of its midpoint.
func Bisect(f func(float64) float64, lo, hi float64) (float64, error) {
	flo, fhi := f(lo), f(hi)
	if flo == 0 {
		return lo, nil
	}
	if fhi == 0 {
		return hi, nil
	}
	if math.IsNaN(flo) || math.IsNaN(fhi) || (flo > 0) == (fhi > 0) {
		return 0, ErrNoBracket
	}
	for range MaxHalvings {
		mid := 0.5 * (lo + hi)
		fm := f(mid)
		if fm == 0 || hi-lo <= 1e-12*math.Abs(mid) {
			return mid, nil
		}
		if (fm > 0) == (flo > 0) {
			lo, flo = mid, fm
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi), nil
}
