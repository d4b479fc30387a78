package uncertain

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"

	"similis.dev/similis/quantity"
)

// MonteCarloResult is the outcome of propagating distributions by
// sampling (JCGM 101:2008, §7).
type MonteCarloResult struct {
	Trials int
	Mean   quantity.Quantity // the estimate, the mean of the trials
	U      quantity.Quantity // the standard deviation of the trials
	// Low and High bound the probabilistically symmetric coverage
	// interval at probability Coverage (JCGM 101 §7.7).
	Low, High quantity.Quantity
	Coverage  float64
}

// String formats the result as "Monte Carlo, 200000 trials: y = 1.153 m/s,
// u = 0.013 m/s, 95 % interval [1.128, 1.177] m/s": u to two significant
// digits and the estimate and the interval's ends to the same decimal
// place (GUM §7.2.6), in SI units named as Measured.String names them and
// in powers of ten where Measured.String would use them.
func (r MonteCarloResult) String() string {
	unit, f := displayUnit(r.Mean.Dim(), math.Max(math.Abs(r.Mean.Value()), r.U.Value()))
	mean, su, low, high := r.Mean.Value()/f, r.U.Value()/f, r.Low.Value()/f, r.High.Value()/f
	y, u := roundPair(mean, su)
	lo, hi := exactText(low), exactText(high)
	if su > 0 && finite(su) && finite(mean) && finite(low) && finite(high) {
		// The interval's ends to u's decimal place, in the notation of
		// the whole line.
		sci := sciFor(max(math.Abs(mean), su, math.Abs(low), math.Abs(high)), su)
		var p int
		u, p = uncText(su, sci)
		y = estText(mean, su, p, sci)
		lo, hi = roundedAt(low, p, sci), roundedAt(high, p, sci)
	}
	return fmt.Sprintf("Monte Carlo, %d trials: y = %s, u = %s, %s %% interval %s",
		r.Trials, withUnit(y, unit), withUnit(u, unit), strconv.FormatFloat(100*r.Coverage, 'g', 4, 64), withUnit("["+lo+", "+hi+"]", unit))
}

// MaxTrials is the largest number of trials MonteCarlo runs. The
// coverage interval needs every trial's output, sorted, so memory grows
// with the trials: 8 bytes each, 80 MB at the maximum. JCGM 101 §7.2.1
// suggests 10⁶ trials for a 95 % interval; more are refused rather than
// allowed to exhaust memory.
const MaxTrials = 10_000_000

// MonteCarlo propagates the distributions of the sources through model
// by sampling. Each trial draws every source's error from its
// distribution (Type A: a scaled and shifted t with its degrees of
// freedom, JCGM 101 §6.4.9; Type B: the stated distribution with the
// stated standard uncertainty; correlated sources: a correlated normal
// draw), forms each input as its estimate plus its sources' errors, and
// evaluates model on those inputs as exact values. The inputs are values
// from Set.Measure (a derived value would be sampled by its linearization).
// The generator is seeded by seed, so a run repeats exactly.
//
// Trials must lie between 1000 and MaxTrials: fewer is an *Error of class
// quantity.ErrInvalid, more one of class quantity.ErrRange, refused before
// anything is allocated. A model that fails on a trial (a dimension
// error, a division by zero, a value that is not finite) ends the run
// with an *Error naming the trial and wrapping the cause.
func MonteCarlo(inputs []Measured, model func(x []Measured) Measured, trials int, p float64, seed uint64) (MonteCarloResult, error) {
	if trials < 1000 {
		return MonteCarloResult{}, &Error{Reason: fmt.Sprintf("%d trials: use at least 1000 (JCGM 101 §7.2.1 suggests 10⁶ for a 95 %% interval)", trials)}
	}
	if trials > MaxTrials {
		return MonteCarloResult{}, rangeError("%d trials: the most MonteCarlo runs is MaxTrials = %d (every trial's output is kept for the coverage interval)", trials, MaxTrials)
	}
	if !(p > 0 && p < 1) {
		return MonteCarloResult{}, &Error{Reason: fmt.Sprintf("coverage probability %v: want 0 < p < 1", p)}
	}
	var set *Set
	for k, in := range inputs {
		if in.set != nil {
			if set != nil && in.set != set {
				return MonteCarloResult{}, &Error{Reason: fmt.Sprintf("MonteCarlo input %d", k+1), Err: ErrSets}
			}
			set = in.set
		}
		if !in.finite() {
			return MonteCarloResult{}, rangeError("MonteCarlo input %d: %v is not a finite number, or its uncertainty is not", k+1, in.q)
		}
	}
	// The sources used, and how to draw each one's standardized error.
	var used []ID
	for _, in := range inputs {
		for i := 0; i < int(in.n); i++ {
			if !slices.Contains(used, in.id[i]) {
				used = append(used, in.id[i])
			}
		}
	}
	slices.Sort(used)
	pos := map[ID]int{}
	for i, id := range used {
		pos[id] = i
	}
	// Correlated sources are drawn jointly normal by a Cholesky factor.
	var chol *mat.Cholesky
	var lower *mat.TriDense
	correlated := false
	if set != nil && set.corr != nil {
		c := mat.NewSymDense(len(used), nil)
		for i, a := range used {
			for j, b := range used {
				c.SetSym(i, j, set.r(a, b))
				if i != j && set.r(a, b) != 0 {
					correlated = true
					if set.src[a].Dist != Normal || set.src[a].Type == TypeA {
						return MonteCarloResult{}, &Error{Source: set.src[a].Name, Reason: "a correlated source is drawn jointly normal: give it Type B and a normal distribution"}
					}
				}
			}
		}
		if correlated {
			chol = new(mat.Cholesky)
			if !chol.Factorize(c) {
				return MonteCarloResult{}, &Error{Reason: "the correlation matrix is not positive definite"}
			}
			lower = mat.NewTriDense(len(used), mat.Lower, nil)
			chol.LTo(lower)
		}
	}
	rng := rand.New(rand.NewPCG(seed, seed^0x9e3779b97f4a7c15))
	eps := make([]float64, len(used))
	z := make([]float64, len(used))
	x := make([]Measured, len(inputs))
	ys := make([]float64, trials)
	var dim quantity.Dim
	var mean, ss float64 // running mean and sum of squared deviations (Welford)
	for t := range trials {
		for i, id := range used {
			src := set.src[id]
			switch {
			case src.Type == TypeA:
				// JCGM 101 §6.4.9: the mean of n readings, with s its
				// standard deviation, is drawn as x̄ + (s/√n)·t_ν, ν = n−1:
				// a t variable with scale u = s/√n, not rescaled to a
				// standard deviation of u (which is u·√(ν/(ν−2)), and
				// infinite for ν ≤ 2).
				eps[i] = distuv.StudentsT{Mu: 0, Sigma: 1, Nu: src.DoF, Src: rng}.Rand()
			case src.Dist == Normal:
				eps[i] = rng.NormFloat64()
			case src.Dist == Rectangular:
				eps[i] = math.Sqrt(3) * (2*rng.Float64() - 1)
			case src.Dist == Triangular:
				eps[i] = math.Sqrt(6) * (rng.Float64() - rng.Float64())
			case src.Dist == Arcsine:
				eps[i] = math.Sqrt2 * math.Sin(2*math.Pi*rng.Float64())
			}
		}
		if correlated {
			// Replace the normal draws by correlated ones: ε = L·z.
			for i, id := range used {
				if set.src[id].Dist == Normal && set.src[id].Type == TypeB {
					z[i] = eps[i]
				} else {
					z[i] = 0
				}
			}
			for i := range used {
				if set.src[used[i]].Dist != Normal || set.src[used[i]].Type == TypeA {
					continue
				}
				var s float64
				for j := 0; j <= i; j++ {
					s += lower.At(i, j) * z[j]
				}
				eps[i] = s
			}
		}
		for k, in := range inputs {
			v := in.q.Value()
			for i := 0; i < int(in.n); i++ {
				v += in.d[i] * eps[pos[in.id[i]]]
			}
			if !finite(v) {
				return MonteCarloResult{}, rangeError("trial %d: input %d drawn as %v: a source's distribution reaches beyond the floating-point range (a Type A source with very few degrees of freedom?)", t+1, k+1, v)
			}
			x[k] = Exact(quantity.New(v, in.q.Dim()))
		}
		y, err := Eval(func() Measured { return model(x) })
		if err != nil {
			return MonteCarloResult{}, &Error{Reason: fmt.Sprintf("trial %d: the model is not defined over the inputs' distributions", t+1), Err: err}
		}
		if t == 0 {
			dim = y.Dim()
		} else if y.Dim() != dim {
			return MonteCarloResult{}, &Error{Reason: fmt.Sprintf("trial %d: the model gives %s, trial 1 gave %s", t+1, quantity.Describe(y.Dim()), quantity.Describe(dim)),
				Err: &quantity.Error{Op: "check", Name: "MonteCarlo: the model's value", Dims: [2]quantity.Dim{y.Dim(), dim}, Binary: true, Class: quantity.ErrDimension}}
		}
		v := y.Value()
		ys[t] = v
		dv := v - mean
		mean += dv / float64(t+1)
		ss += dv * (v - mean)
	}
	u := math.Sqrt(ss / float64(trials-1))
	if !finite(mean) || !finite(u) {
		return MonteCarloResult{}, rangeError("the trials' mean or standard deviation overflows")
	}
	slices.Sort(ys)
	// Probabilistically symmetric interval: the (1−p)/2 and (1+p)/2
	// quantiles of the sorted trials (JCGM 101 §7.7.1).
	q := int(math.Round(p * float64(trials)))
	r := int(math.Round(float64(trials-q) / 2))
	lo, hi := ys[max(r-1, 0)], ys[min(r+q-1, trials-1)]
	return MonteCarloResult{
		Trials: trials, Coverage: p,
		Mean: quantity.New(mean, dim), U: quantity.New(u, dim),
		Low: quantity.New(lo, dim), High: quantity.New(hi, dim),
	}, nil
}

// Validation is the comparison of a first-order budget with a Monte
// Carlo result (JCGM 101 §8).
type Validation struct {
	Tolerance         float64 // δ, in SI
	DLow, DHigh       float64 // |y − U_p − y_low|, |y + U_p − y_high|
	Validated         bool
	SignificantDigits int
}

// String says whether the first-order result is validated.
func (v Validation) String() string {
	verdict := "validated"
	if !v.Validated {
		verdict = "not validated: use the Monte Carlo interval"
	}
	return fmt.Sprintf("first order vs Monte Carlo (JCGM 101 §8, %d significant digits, δ = %.3g): d_low = %.3g, d_high = %.3g: %s",
		v.SignificantDigits, v.Tolerance, v.DLow, v.DHigh, verdict)
}

// Validate compares the budget's interval y ± U_p with the Monte Carlo
// coverage interval. The tolerance δ is half a unit in the last of ndig
// significant digits of u_c (JCGM 101 §7.9.2, §8.2): u_c = c·10^l with c
// an ndig-digit integer, δ = ½·10^l. Both ends must agree within δ.
func (b Budget) Validate(mc MonteCarloResult, ndig int) Validation {
	if ndig < 1 {
		ndig = 2
	}
	u := b.U.Value()
	l := math.Floor(math.Log10(u)) - float64(ndig-1)
	delta := 0.5 * math.Pow(10, l)
	y, up := b.Value.Value(), b.Expanded.Value()
	v := Validation{Tolerance: delta, SignificantDigits: ndig,
		DLow: math.Abs(y - up - mc.Low.Value()), DHigh: math.Abs(y + up - mc.High.Value())}
	v.Validated = v.DLow <= delta && v.DHigh <= delta
	return v
}
