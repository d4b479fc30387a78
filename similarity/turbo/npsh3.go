package turbo

import (
	"fmt"
	"math"
	"slices"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
)

// SuctionPoint is one point of a suction test: the NPSH available at the
// pump's inlet and the pump's total head, at the test's constant flow and
// speed.
type SuctionPoint struct {
	NPSHA, Head quantity.Quantity // both lengths
}

// NPSH3Options adjust FindNPSH3.
type NPSH3Options struct {
	// ReferencePoints is the number of points of highest NPSHA whose mean
	// head is the reference (the head free of cavitation), 3 if zero.
	ReferencePoints int
	// NPSHU is the standard uncertainty of each NPSHA reading; zero if
	// not given.
	NPSHU quantity.Quantity
	// HeadU is the standard uncertainty of each head reading; if zero it
	// is the standard deviation of the reference points' heads about
	// their mean (Type A), which needs at least two reference points.
	HeadU quantity.Quantity
}

// NPSH3Result is the NPSH at 3 % head drop found from a suction series.
type NPSH3Result struct {
	NPSH3 quantity.Quantity // the NPSHA at which the faired head is 97 % of the reference
	U     quantity.Quantity // its standard uncertainty
	// UFromNPSHA and UFromHead are the parts of U from the NPSHA readings
	// and from the head readings (reference and curve), combined in
	// quadrature.
	UFromNPSHA, UFromHead quantity.Quantity
	ReferenceHead         quantity.Quantity // the mean head of the reference points
	DropHead              quantity.Quantity // 0.97 × ReferenceHead
	HeadU                 quantity.Quantity // the head reading's standard uncertainty used
	// Slope is dH/dNPSHA of the fairing across the interval holding the
	// 3 % point (the secant of its end values) (m/m, dimensionless).
	Slope float64
	// Faired is the monotone fairing of head against NPSHA, in m, through
	// the series made non-decreasing (see FindNPSH3).
	Faired *fit.Fairing
	// Pooled lists the NPSHA values (m) whose heads were pooled with a
	// neighbour's to make the series monotone.
	Pooled []float64
	Notes  []string
}

// MaxSuctionPoints is the most points FindNPSH3 takes.
const MaxSuctionPoints = 10000

// FindNPSH3 finds NPSH3, the NPSH available at which the pump's head has
// fallen by 3 % (ISO 9906), from a suction series at constant flow and
// speed (a series at another speed is translated first, NPSH ∝ n²,
// which ISO 9906 allows for NPSH only within about 80 % to 120 % of the
// specified speed, from memory). What it does:
//
//  1. It sorts the points by NPSHA and averages the heads of points of
//     equal NPSHA.
//  2. The reference head is the mean head of the ReferencePoints points
//     of highest NPSHA (3 unless chosen); the 3 % point is where the head
//     is 0.97 times it.
//  3. It makes the heads non-decreasing in NPSHA by pooling adjacent
//     points that break the order into their mean (the least-squares
//     monotone fit: the head cannot rise as NPSHA falls), and fairs the
//     result with fit.Fair (a monotone piecewise-cubic curve through the
//     pooled values, which cannot wiggle).
//  4. NPSH3 is the largest NPSHA at which the faired head is at or below
//     0.97 times the reference, found by bisection.
//
// Its standard uncertainty combines, in quadrature, that of the NPSHA
// reading (NPSHU) and that of the head, moved along the curve by its
// slope s across the interval holding the point:
// u_H,NPSH3 = √(u_H² + (0.97·u_H)²/n_ref)/s, u_H being the head reading's
// uncertainty and n_ref the number of reference points (first order,
// JCGM 100:2008 §5.1). The series must fall to 97 % of the reference
// within its range (an *Error of class quantity.ErrRange otherwise: the
// point is not extrapolated). See PumpCaution.
func FindNPSH3(series []SuctionPoint, opt NPSH3Options) (NPSH3Result, error) {
	const op = "NPSH3"
	nref := opt.ReferencePoints
	if nref == 0 {
		nref = 3
	}
	if len(series) > MaxSuctionPoints {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.Invalid("series", fmt.Sprintf("%d points: want at most %d", len(series), MaxSuctionPoints))}
	}
	type pt struct{ x, y float64 }
	pts := make([]pt, 0, len(series))
	for i, s := range series {
		if err := fail(op, similarity.CheckInputs(true,
			similarity.Input{Name: fmt.Sprintf("point %d: NPSHA", i), Value: s.NPSHA, Dim: quantity.Length},
			similarity.Input{Name: fmt.Sprintf("point %d: head", i), Value: s.Head, Dim: quantity.Length})); err != nil {
			return NPSH3Result{}, err
		}
		pts = append(pts, pt{s.NPSHA.Value(), s.Head.Value()})
	}
	zero := quantity.New(0, quantity.Length)
	uNPSHq, bad := similarity.OrDefault("NPSHA uncertainty", opt.NPSHU, zero)
	if bad != nil {
		return NPSH3Result{}, fail(op, bad)
	}
	uHeadq, bad := similarity.OrDefault("head uncertainty", opt.HeadU, zero)
	if bad != nil {
		return NPSH3Result{}, fail(op, bad)
	}
	uNPSH, uHead := uNPSHq.Value(), uHeadq.Value()
	slices.SortStableFunc(pts, func(a, b pt) int {
		switch {
		case a.x < b.x:
			return -1
		case a.x > b.x:
			return 1
		}
		return 0
	})
	// Average the heads at equal NPSHA.
	var x, y, w []float64
	for _, p := range pts {
		if n := len(x); n > 0 && x[n-1] == p.x {
			y[n-1] += (p.y - y[n-1]) / (w[n-1] + 1)
			w[n-1]++
			continue
		}
		x, y, w = append(x, p.x), append(y, p.y), append(w, 1)
	}
	if len(x) < 3 {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.Invalid("series", fmt.Sprintf("%d distinct NPSHA values: want at least 3 (a reference point and two below it): add points at lower NPSHA", len(x)))}
	}
	if nref < 1 || nref > len(x)-2 {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.Invalid("reference points", fmt.Sprintf("%d reference points from %d distinct NPSHA values: want 1 to %d, leaving two below them", nref, len(x), len(x)-2))}
	}
	if nref < 2 && uHead == 0 {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.Invalid("head uncertainty", "one reference point gives no scatter for the head's uncertainty: give HeadU or two or more reference points")}
	}
	var res NPSH3Result
	ref := 0.0
	for _, v := range y[len(y)-nref:] {
		ref += v
	}
	ref /= float64(nref)
	if uHead == 0 {
		ss := 0.0
		for _, v := range y[len(y)-nref:] {
			ss += (v - ref) * (v - ref)
		}
		uHead = math.Sqrt(ss / float64(nref-1))
		res.Notes = append(res.Notes, fmt.Sprintf("the head's standard uncertainty %.3g m is the scatter of the %d reference points (Type A, %d degrees of freedom)", uHead, nref, nref-1))
	}
	target := 0.97 * ref
	if spread := y[len(y)-nref]; spread < 0.99*ref {
		res.Notes = append(res.Notes, fmt.Sprintf("the lowest reference point's head (%.4g m) is more than 1 %% below the reference: cavitation may already lower it; start the series at a higher NPSHA", spread))
	}
	// Pool adjacent violators: a non-decreasing head in NPSHA.
	type block struct {
		sum, wt float64
		n       int
	}
	var blocks []block
	for i := range y {
		blocks = append(blocks, block{y[i] * w[i], w[i], 1})
		for len(blocks) > 1 {
			b, a := blocks[len(blocks)-1], blocks[len(blocks)-2]
			if a.sum/a.wt <= b.sum/b.wt {
				break
			}
			blocks = append(blocks[:len(blocks)-2], block{a.sum + b.sum, a.wt + b.wt, a.n + b.n})
		}
	}
	yf := make([]float64, 0, len(y))
	for _, b := range blocks {
		for range b.n {
			yf = append(yf, b.sum/b.wt)
		}
		if b.n > 1 {
			res.Pooled = append(res.Pooled, x[len(yf)-b.n:len(yf)]...)
		}
	}
	if yf[0] > target {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.OutOfRange("series", fmt.Sprintf("the faired head falls only to %.4g m at the lowest NPSHA %.4g m, above 97 %% of the reference %.4g m (%.4g m): extend the series to lower NPSHA", yf[0], x[0], ref, target))}
	}
	fair, err := fit.Fair(x, yf)
	if err != nil {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.Caused("series", "the fairing", err)}
	}
	// Bisection for the largest x with fair(x) ≤ target: x[0] is in the
	// set, x[n−1] (the reference, above target) is not.
	at := func(v float64) float64 { f, _ := fair.At(v); return f }
	lo, hi := x[0], x[len(x)-1]
	if at(hi) <= target {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.OutOfRange("series", "the faired head at the highest NPSHA is not above 97 % of the reference")}
	}
	for range 200 {
		m := lo + (hi-lo)/2
		if m <= lo || m >= hi {
			break
		}
		if at(m) <= target {
			lo = m
		} else {
			hi = m
		}
	}
	x3 := lo + (hi-lo)/2
	k := max(0, min(len(x)-2, sortSearch(x, x3)-1))
	slope := (yf[k+1] - yf[k]) / (x[k+1] - x[k])
	if !(slope > 0) || math.IsInf(slope, 0) {
		return NPSH3Result{}, &Error{Op: op, Fault: similarity.OutOfRange("series", fmt.Sprintf("the faired head does not change with NPSHA between %.4g m and %.4g m, where the 3 %% point lies: its uncertainty is unbounded", x[k], x[k+1]))}
	}
	uH := math.Sqrt(uHead*uHead+0.97*0.97*uHead*uHead/float64(nref)) / slope
	u := math.Hypot(uNPSH, uH)
	if err := fail(op, similarity.CheckResults(false,
		similarity.Result{Name: "NPSH3", Value: x3},
		similarity.Result{Name: "its uncertainty", Value: u})); err != nil {
		return NPSH3Result{}, err
	}
	L := func(v float64) quantity.Quantity { return quantity.New(v, quantity.Length) }
	res.NPSH3, res.U, res.UFromNPSHA, res.UFromHead = L(x3), L(u), L(uNPSH), L(uH)
	res.ReferenceHead, res.DropHead, res.HeadU = L(ref), L(target), L(uHead)
	res.Slope, res.Faired = slope, fair
	return res, nil
}

// sortSearch returns the index of the first x[i] > v (x increasing).
func sortSearch(x []float64, v float64) int {
	i, _ := slices.BinarySearchFunc(x, v, func(e, t float64) int {
		if e <= t {
			return -1
		}
		return 1
	})
	return i
}
