package steady

import (
	"math"

	"similis.dev/similis/quantity"
)

// MaxLag bounds the autocorrelation lags Summarize sums: the sum stops at
// the first lag whose autocorrelation is ≤ 0, and a window whose
// autocorrelation stays positive past min(MaxLag, n/2) lags is refused
// as too short for the correlation it contains (or not steady). Each lag
// costs one pass over the window.
const MaxLag = 4096

// MinSamples is the fewest samples a window may hold.
const MinSamples = 3

// Window is a steady point's span of samples, [Start, End) as row numbers
// (from 0) of its history.
type Window struct{ Start, End int }

// Len returns the number of samples, End − Start.
func (w Window) Len() int { return w.End - w.Start }

// Stats are the statistics of one channel over one window of samples
// taken at a fixed rate.
type Stats struct {
	N    int               // samples
	Mean quantity.Quantity // arithmetic mean x̄
	SD   quantity.Quantity // sample standard deviation s, with n − 1 in the denominator
	// Drift is the change across the window of the least-squares line
	// through the samples against their row: the slope per sample times
	// n − 1 sample intervals (the line's value at the last sample minus
	// its value at the first).
	Drift quantity.Quantity
	// Lags is the number of autocorrelation lags summed, K: the lags
	// before the first whose estimate ρ_k is ≤ 0.
	Lags int
	// NEff is the effective number of independent samples,
	// n / (1 + 2 Σ_{k=1..K} (1 − k/n) ρ_k); it is n for a series with no
	// positive lag-1 correlation and for a constant series.
	NEff float64
	// UMean is the standard uncertainty of the mean, s/√NEff.
	UMean quantity.Quantity
}

// Summarize returns the statistics of x over the samples of w. The
// samples are taken as a stationary series sampled at a fixed rate, not
// as independent readings: the standard uncertainty of the mean is
// s/√n_eff with the effective number of samples
//
//	n_eff = n / (1 + 2 Σ_{k=1}^{K} (1 − k/n) ρ_k),
//
// the variance of the mean of a correlated stationary series, truncated
// at K, the last lag before the first whose estimate is ≤ 0. The
// autocorrelation is estimated as ρ_k = c_k/c_0 with
// c_k = (1/n) Σ_{i=0}^{n−k−1} (x_i − x̄)(x_{i+k} − x̄). For independent
// samples the truncated sum still takes in the chance positive estimates
// before the first negative one, each of order 1/√n, so n_eff comes out
// somewhat below n (by a few per cent for 10⁴ samples): the estimate errs
// toward a larger uncertainty, never a smaller one. For a first-order
// autoregressive series of lag-1 correlation φ, n_eff tends to
// n(1 − φ)/(1 + φ).
//
// Summarize refuses a window outside x or shorter than MinSamples, and a
// sample that is not finite (a missing value) with an *Error naming its
// row. When the autocorrelation does not reach zero within
// min(MaxLag, n/2) lags, or n_eff is below 2 (fewer than one degree of
// freedom), it returns the statistics found so far with an *Error of
// class quantity.ErrRange: the window is too short for the correlation
// in it, and its mean has no usable Type A uncertainty. It allocates
// nothing; its cost is n(K + 2) multiply-adds.
func Summarize(x quantity.Series, w Window) (Stats, error) {
	return summarize("", x, w)
}

func summarize(name string, x quantity.Series, w Window) (Stats, error) {
	const op = "summarize"
	if w.Start < 0 || w.End > x.Len() || w.Start > w.End {
		return Stats{}, invalid(op, name, -1, "window [%d, %d) outside the %d samples", w.Start, w.End, x.Len())
	}
	n := w.Len()
	if n < MinSamples {
		return Stats{}, invalid(op, name, w.Start, "a window of %d samples: want at least %d", n, MinSamples)
	}
	v := x.Values()[w.Start:w.End]
	d := x.Dim()
	// First pass: the mean, shifted by the first sample against
	// cancellation.
	ref := v[0]
	var s1 float64
	for i, a := range v {
		if a-a != 0 {
			return Stats{}, outOfRange(op, name, w.Start+i, "sample %v: a missing or infinite value inside the window", a)
		}
		s1 += a - ref
	}
	fn := float64(n)
	mean := ref + s1/fn
	// Second pass: deviations, their squares, the regression on the row
	// and the lag-1 product.
	var s2, sid, c1 float64
	ibar := (fn - 1) / 2
	prev := 0.0
	for i, a := range v {
		e := a - mean
		s2 += e * e
		sid += (float64(i) - ibar) * e
		c1 += prev * e
		prev = e
	}
	st := Stats{
		N:     n,
		Mean:  quantity.New(mean, d),
		SD:    quantity.New(math.Sqrt(s2/(fn-1)), d),
		Drift: quantity.New(sid/(fn*(fn*fn-1)/12)*(fn-1), d),
		NEff:  fn,
		UMean: quantity.New(0, d),
	}
	if !finite(mean) || !finite(s2) || !finite(st.Drift.Value()) {
		return Stats{}, outOfRange(op, name, -1, "the sums overflow a float64")
	}
	if s2 == 0 {
		return st, nil // constant: no variation to correlate
	}
	// Σ (1 − k/n) ρ_k up to the first ρ_k ≤ 0. Lags after the first are
	// summed four to a pass over the window.
	c0 := s2
	limit := min(MaxLag, n/2)
	sum := 0.0
	k := 1
	var ck [4]float64
	next := 0 // ck[next:] hold lags k, k+1, … still to be used
	have := 0
	for ; k <= limit; k++ {
		if k == 1 {
			ck[0], next, have = c1, 0, 1
		} else if next == have {
			have = min(4, limit-k+1)
			if k == 2 {
				have = 1 // white noise mostly stops at lag 2
			}
			lagSums(&ck, v, mean, k, have)
			next = 0
		}
		rho := ck[next] / c0
		next++
		if rho <= 0 {
			break
		}
		sum += (1 - float64(k)/fn) * rho
	}
	st.Lags = k - 1
	st.NEff = fn / (1 + 2*sum)
	st.UMean = quantity.New(st.SD.Value()/math.Sqrt(st.NEff), d)
	if k > limit {
		return st, outOfRange(op, name, w.Start, "the autocorrelation stays positive for %d lags of a window of %d samples: the window is too short for the correlation in it, or not steady", limit, n)
	}
	if st.NEff < 2 {
		return st, outOfRange(op, name, w.Start, "n_eff = %.3g of %d samples: fewer than two independent samples, the mean has no usable Type A uncertainty", st.NEff, n)
	}
	return st, nil
}

// finite reports whether x is neither NaN nor ±Inf.
func finite(x float64) bool { return x-x == 0 }

// lagSums sets c[j] = Σ_{i=0}^{n−k−j−1} (v_i − m)(v_{i+k+j} − m) for
// j < have (at most 4) in one pass over v.
func lagSums(c *[4]float64, v []float64, m float64, k, have int) {
	n := len(v)
	if have < 4 {
		for j := range have {
			a, b := v[:n-k-j], v[k+j:]
			var s float64
			for i := range a {
				s += (a[i] - m) * (b[i] - m)
			}
			c[j] = s
		}
		return
	}
	var s0, s1, s2, s3 float64
	end := n - k - 3 // i < end holds all four products
	a := v[:end]
	b := v[k : k+end+3]
	for i, x := range a {
		e := x - m
		s0 += e * (b[i] - m)
		s1 += e * (b[i+1] - m)
		s2 += e * (b[i+2] - m)
		s3 += e * (b[i+3] - m)
	}
	// The tails: lag k+j runs to i < n−k−j.
	for i := end; i < n-k; i++ {
		e := v[i] - m
		s0 += e * (v[i+k] - m)
		if i < n-k-1 {
			s1 += e * (v[i+k+1] - m)
		}
		if i < n-k-2 {
			s2 += e * (v[i+k+2] - m)
		}
	}
	c[0], c[1], c[2], c[3] = s0, s1, s2, s3
}
