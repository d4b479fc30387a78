package exact

// PowInt returns x^n for an integer n, the one integer power of the
// module (group evaluation, formulas, scale laws): x·x and x·x·x as
// written for n = 2 and 3, repeated squaring above, and 1/x^|n| for
// n < 0, so a power is exact whenever its products are and agrees bit for
// bit with the same product written by hand for the small exponents of
// the trade.
func PowInt(x float64, n int) float64 {
	if n < 0 {
		return 1 / PowNat(x, -n)
	}
	return PowNat(x, n)
}

// PowNat is PowInt for n ≥ 0 (1 for n ≤ 0), small enough to be inlined in
// the evaluators' loops.
func PowNat(x float64, n int) float64 {
	switch n {
	case 2:
		return x * x
	case 3:
		return x * x * x
	}
	r := 1.0
	for ; n > 0; n >>= 1 {
		if n&1 == 1 {
			r *= x
		}
		x *= x
	}
	return r
}
