package pigroups

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"
	"similis.dev/similis/quantity"
)

// Errors a fit can be refused with; an *Error of OpFit has one as its Kind.
var (
	ErrTooFewRows  = errors.New("too few rows")
	ErrNonPositive = errors.New("non-positive value")
	ErrCollinear   = errors.New("collinear groups")
	ErrFitShape    = errors.New("inconsistent data")
)

// FitOptions adjusts a fit. The zero value is an unweighted fit with 95 %
// intervals.
type FitOptions struct {
	// Weights, one per row, positive; nil means equal weights.
	Weights []float64
	// Level is the confidence level of the intervals, 0.95 if zero.
	Level float64
	// MaxCond is the largest condition number of the design matrix
	// accepted, 1e10 if zero.
	MaxCond float64
	// MaxCollinear is the largest condition number accepted of the
	// groups' logarithms Π₁ … Π_k, each centred on its mean and scaled to
	// unit length: DefaultMaxCollinear if zero. It measures how nearly the
	// groups vary together over the rows whatever their size, so a group
	// that is nearly a power of others is refused with the groups named,
	// where the unscaled MaxCond would pass it and the exponents come out
	// meaningless.
	MaxCollinear float64
	// Names, if given, name Π₀, Π₁ … Π_k in notes ("Eu", "Re", "L/d");
	// by default they are Π₀ … Π_k.
	Names []string
	// Correlated marks rows logged in sequence, whose errors may be
	// correlated: the intervals then use an effective number of rows
	// n_eff = n·(1 − r₁)/(1 + r₁), r₁ the lag-1 autocorrelation of the
	// residuals in row order (common practice for serially correlated
	// samples; n_eff = n when r₁ ≤ 0), with the covariance scaled by
	// n/n_eff and Student's t on n_eff − k − 1 degrees of freedom.
	Correlated bool
	// Groups, if given, are the groups Π₀ … Π_k the values were
	// evaluated from; the fit then warns (Warnings) when Π₀ shares a
	// variable with another group, which correlates them whatever the
	// physics and inflates R² (spurious correlation).
	Groups []Group
}

// DefaultMaxCollinear is the default FitOptions.MaxCollinear. For two
// groups whose logarithms correlate with coefficient r the condition
// number is √((1 + |r|)/(1 − |r|)), so 100 refuses |r| > 0.9998, where
// the exponents' standard errors are some 50 times those of independent
// groups. Common practice reads a condition index of the scaled design
// above 30 as strong dependence and above 100 as severe (from memory).
const DefaultMaxCollinear = 100

// SharedVariables returns the symbols of the variables a and b both
// contain, in variable order; nil when they share none or belong to
// different problems.
func SharedVariables(a, b Group) []string {
	if a.prob == nil || a.prob != b.prob {
		return nil
	}
	var out []string
	for i, e := range a.exps {
		if !e.IsZero() && !b.exps[i].IsZero() {
			out = append(out, a.prob.vars[i].Symbol)
		}
	}
	return out
}

// PowerLaw is a fitted Π₀ = C·Π₁^a₁·…·Π_k^a_k, from least squares on
// logarithms: ln Π₀ = ln C + Σ aₖ ln Πₖ.
type PowerLaw struct {
	C         float64      // the coefficient
	CInterval [2]float64   // its confidence interval
	Exponents []float64    // a₁ … a_k
	StdErr    []float64    // standard errors of ln C, a₁, …, a_k
	Intervals [][2]float64 // confidence intervals of a₁ … a_k
	R2        float64      // coefficient of determination in log space
	RMS       float64      // residual root mean square in log space
	N, DoF    int          // rows and residual degrees of freedom (n_eff − k − 1 when Correlated)
	// R1 is the lag-1 autocorrelation of the residuals in row order, and
	// NEff the effective number of rows the intervals use: N unless
	// FitOptions.Correlated, then N·(1 − R1)/(1 + R1) for R1 > 0.
	R1, NEff float64
	// Runs is a lack-of-fit check: the Wald–Wolfowitz runs test on the
	// signs of the residuals ordered by the fitted value. Too few runs
	// mean residuals of one sign in stretches, a curve the law does not
	// follow.
	Runs RunsTest
	// Warnings lists what the intervals and R² do not show: groups that
	// share variables with Π₀ (see FitOptions.Groups).
	Warnings []string
	// Ranges holds the smallest and largest fitted value of each of
	// Π₁ … Π_k: the correlation's range of validity, outside which
	// Predict marks its result as an extrapolation.
	Ranges [][2]float64
	names  []string
	Level  float64 // confidence level of the intervals
	Cond   float64 // condition number of the design matrix
	tq     float64 // Student t quantile
	sigma2 float64
	cov    *mat.SymDense // σ²(XᵀWX)⁻¹
}

// FitPowerLaw fits Π₀ = C·∏ Πₖ^aₖ to measured rows: y holds Π₀ and x[k]
// holds Πₖ₊₁, each with one value per row. All values must be positive.
// Standard errors use the residual variance; intervals use Student's t
// with N − k − 1 degrees of freedom. Groups that cannot be told apart
// over the rows — one constant, or some nearly powers of one another
// (FitOptions.MaxCollinear) — are refused with ErrCollinear, the groups
// named in the error's Groups and text.
func FitPowerLaw(y []float64, x [][]float64, opt *FitOptions) (*PowerLaw, error) {
	var o FitOptions
	if opt != nil {
		o = *opt
	}
	if o.Level == 0 {
		o.Level = 0.95
	}
	if o.MaxCond == 0 {
		o.MaxCond = 1e10
	}
	if !(o.Level > 0 && o.Level < 1) {
		return nil, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("confidence level %v is not between 0 and 1", o.Level)}
	}
	n, k := len(y), len(x)
	p := k + 1
	if n <= p {
		return nil, &Error{Op: OpFit, Kind: ErrTooFewRows, Row: -1, Group: -1, Reason: fmt.Sprintf("%d rows for %d coefficients; at least %d are needed for intervals", n, p, p+1)}
	}
	for j, col := range x {
		if len(col) != n {
			return nil, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: j + 1, Reason: fmt.Sprintf("%d values, Π₀ has %d", len(col), n)}
		}
	}
	if o.Weights != nil && len(o.Weights) != n {
		return nil, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("%d weights for %d rows", len(o.Weights), n)}
	}
	X := mat.NewDense(n, p, nil)
	Y := mat.NewVecDense(n, nil)
	sw := make([]float64, n)
	for i := range n {
		w := 1.0
		if o.Weights != nil {
			w = o.Weights[i]
			if !(w > 0) || math.IsInf(w, 0) {
				return nil, &Error{Op: OpFit, Kind: ErrFitShape, Row: i, Group: -1, Reason: fmt.Sprintf("weight %v is not positive and finite", w)}
			}
		}
		sw[i] = math.Sqrt(w)
		if !(y[i] > 0) || math.IsInf(y[i], 0) {
			return nil, &Error{Op: OpFit, Kind: ErrNonPositive, Row: i, Group: 0, Reason: fmt.Sprintf("Π₀ = %v; a power law needs positive values", y[i])}
		}
		Y.SetVec(i, sw[i]*math.Log(y[i]))
		X.Set(i, 0, sw[i])
		for j := range k {
			v := x[j][i]
			if !(v > 0) || math.IsInf(v, 0) {
				return nil, &Error{Op: OpFit, Kind: ErrNonPositive, Row: i, Group: j + 1, Reason: fmt.Sprintf("value %v; a power law needs positive values", v)}
			}
			X.Set(i, j+1, sw[i]*math.Log(v))
		}
	}
	if err := collinear(X, sw, k, &o); err != nil {
		return nil, err
	}
	cond := mat.Cond(X, 2)
	if math.IsInf(cond, 0) || math.IsNaN(cond) || cond > o.MaxCond {
		return nil, &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: cond, Reason: fmt.Sprintf("condition number %.3g of the log design matrix exceeds %.3g: some groups are (nearly) powers of one another, or constant", cond, o.MaxCond)}
	}
	var qr mat.QR
	qr.Factorize(X)
	var beta mat.VecDense
	if err := qr.SolveVecTo(&beta, false, Y); err != nil {
		return nil, &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: cond, Reason: "solving the least-squares problem", Err: err}
	}
	var fitted mat.VecDense
	fitted.MulVec(X, &beta)
	ssRes, ssTot, sumW, meanY := 0.0, 0.0, 0.0, 0.0
	for i := range n {
		w := sw[i] * sw[i]
		sumW += w
		meanY += w * math.Log(y[i])
	}
	meanY /= sumW
	for i := range n {
		r := Y.AtVec(i) - fitted.AtVec(i) // already weighted
		ssRes += r * r
		d := math.Log(y[i]) - meanY
		ssTot += sw[i] * sw[i] * d * d
	}
	resid := make([]float64, n)
	for i := range n {
		resid[i] = (Y.AtVec(i) - fitted.AtVec(i)) / sw[i]
	}
	r1 := lag1(resid)
	nEff := float64(n)
	if o.Correlated && r1 > 0 {
		nEff = float64(n) * (1 - r1) / (1 + r1)
	}
	dof := n - p
	if nEff-float64(p) < 1 {
		return nil, &Error{Op: OpFit, Kind: ErrTooFewRows, Row: -1, Group: -1, Reason: fmt.Sprintf("the residuals' lag-1 autocorrelation %.3f leaves an effective %.1f rows for %d coefficients: no interval can be quoted; log more widely spaced rows", r1, nEff, p)}
	}
	sigma2 := ssRes / float64(dof)
	var xtx mat.SymDense
	xtx.SymOuterK(1, X.T())
	var inv mat.SymDense
	var chol mat.Cholesky
	if !chol.Factorize(&xtx) {
		return nil, &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: cond, Reason: "XᵀX is not positive definite"}
	}
	if err := chol.InverseTo(&inv); err != nil {
		return nil, &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: cond, Reason: "inverting XᵀX", Err: err}
	}
	inflate := float64(n) / nEff // 1 unless correlated
	inv.ScaleSym(sigma2*inflate, &inv)
	tDoF := float64(dof)
	if nEff < float64(n) {
		tDoF = nEff - float64(p)
		dof = int(math.Floor(tDoF))
	}
	tq := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: tDoF}.Quantile(1 - (1-o.Level)/2)
	f := &PowerLaw{N: n, DoF: dof, Level: o.Level, Cond: cond, tq: tq, sigma2: sigma2 * inflate, cov: &inv, R1: r1, NEff: nEff}
	f.Runs = runsTest(resid, &fitted, sw)
	if len(o.Groups) == p {
		for j := 1; j < p; j++ {
			if sh := SharedVariables(o.Groups[0], o.Groups[j]); len(sh) > 0 {
				a, b := fitName(o.Names, 0), fitName(o.Names, j)
				f.Warnings = append(f.Warnings, fmt.Sprintf("%s and %s share %s: the fit correlates them through those variables whatever the physics (spurious correlation), so R² and the exponent of %s overstate the evidence; check the law on a set where the shared variables are held or on a group that leaves them out", a, b, strings.Join(sh, ", "), b))
			}
		}
	}
	f.names = slices.Clone(o.Names)
	f.Ranges = make([][2]float64, k)
	for j, col := range x {
		f.Ranges[j] = [2]float64{slices.Min(col), slices.Max(col)}
	}
	f.StdErr = make([]float64, p)
	for j := range p {
		f.StdErr[j] = math.Sqrt(inv.At(j, j))
	}
	lnC := beta.AtVec(0)
	f.C = math.Exp(lnC)
	f.CInterval = [2]float64{math.Exp(lnC - tq*f.StdErr[0]), math.Exp(lnC + tq*f.StdErr[0])}
	for j := range k {
		a := beta.AtVec(j + 1)
		f.Exponents = append(f.Exponents, a)
		f.Intervals = append(f.Intervals, [2]float64{a - tq*f.StdErr[j+1], a + tq*f.StdErr[j+1]})
	}
	if ssTot > 0 {
		f.R2 = 1 - ssRes/ssTot
	}
	f.RMS = math.Sqrt(ssRes / sumW)
	if !finiteFit(f) {
		return nil, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: "the fitted coefficient or exponents are not finite (the data's logarithms span too wide a range)"}
	}
	return f, nil
}

// collinear refuses groups Π₁ … Π_k (columns 1 … k of the weighted log
// design X) of which one is constant over the rows, or which vary
// together: the condition number of their logarithms, centred and scaled
// to unit length, above o.MaxCollinear. The error names the groups, the
// power law they follow among themselves, and, with o.Groups, the
// variables that move them together and those that would separate them.
func collinear(X *mat.Dense, sw []float64, k int, o *FitOptions) error {
	n, _ := X.Dims()
	maxC := o.MaxCollinear
	if maxC == 0 {
		maxC = DefaultMaxCollinear
	}
	if !(maxC >= 1) {
		return &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("MaxCollinear %v is not at least 1", maxC)}
	}
	sumW := 0.0
	for i := range n {
		sumW += sw[i] * sw[i]
	}
	Z := mat.NewDense(n, k, nil)
	scale := make([]float64, k)
	for j := range k {
		mean, big := 0.0, 1.0
		for i := range n {
			l := X.At(i, j+1) / sw[i]
			mean += sw[i] * sw[i] * l
			big = max(big, math.Abs(l))
		}
		mean /= sumW
		ss := 0.0
		for i := range n {
			z := X.At(i, j+1) - sw[i]*mean
			Z.Set(i, j, z)
			ss += z * z
		}
		s := math.Sqrt(ss)
		if !(s > 1e-12*big*math.Sqrt(sumW)) {
			name := fitName(o.Names, j+1)
			return &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: j + 1, Cond: math.Inf(1), Groups: []int{j + 1},
				Reason: fmt.Sprintf("%s is constant over these rows: its exponent cannot be fitted", name),
				Hint:   "vary it over the rows, or fit without it"}
		}
		scale[j] = s
		for i := range n {
			Z.Set(i, j, Z.At(i, j)/s)
		}
	}
	if k < 2 {
		return nil
	}
	var svd mat.SVD
	if !svd.Factorize(Z, mat.SVDThin) {
		return &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: math.Inf(1), Reason: "the groups' logarithms cannot be decomposed (SVD failed)"}
	}
	sv := svd.Values(nil)
	kappa := math.Inf(1)
	if sv[k-1] > 0 {
		kappa = sv[0] / sv[k-1]
	}
	if kappa <= maxC {
		return nil
	}
	var v mat.Dense
	svd.VTo(&v)
	// The near-null direction: Σ c_j·ln Π_j is nearly constant over the
	// rows, c_j its weight on the unscaled logarithm of group j.
	big := 0.0
	for j := range k {
		big = max(big, math.Abs(v.At(j, k-1)))
	}
	var in []int
	c := make([]float64, k)
	for j := range k {
		if math.Abs(v.At(j, k-1)) >= 0.1*big {
			in = append(in, j)
			c[j] = v.At(j, k-1) / scale[j]
		}
	}
	if len(in) < 2 {
		// Cannot be for unit columns of a few groups; for many, name the
		// next largest too, so that a relation is written.
		second := -1
		for j := range k {
			if j != in[0] && (second < 0 || math.Abs(v.At(j, k-1)) > math.Abs(v.At(second, k-1))) {
				second = j
			}
		}
		c[second] = v.At(second, k-1) / scale[second]
		in = append(in, second)
		slices.Sort(in)
	}
	// The group written in terms of the others: the last of those with a
	// large weight, so that its power in the relation is finite.
	pv := in[0]
	for _, j := range in {
		if math.Abs(v.At(j, k-1)) >= 0.5*big {
			pv = j
		}
	}
	var names []string
	var rel strings.Builder
	fmt.Fprintf(&rel, "%s ∝ ", fitName(o.Names, pv+1))
	written := 0
	for _, j := range in {
		names = append(names, fitName(o.Names, j+1))
		if j == pv {
			continue
		}
		if written++; written > 1 {
			rel.WriteString("·")
		}
		fmt.Fprintf(&rel, "%s^%.3g", fitName(o.Names, j+1), -c[j]/c[pv])
	}
	groups := make([]int, len(in))
	for i, j := range in {
		groups[i] = j + 1
	}
	together := strings.Join(names[:len(names)-1], ", ") + " and " + names[len(names)-1]
	e := &Error{Op: OpFit, Kind: ErrCollinear, Row: -1, Group: -1, Cond: kappa, Groups: groups,
		Reason: fmt.Sprintf("%s vary together over these rows (%s; the condition number of their centred, scaled logarithms is %.3g, above %.3g): the fit cannot tell their exponents apart", together, rel.String(), kappa, maxC)}
	e.Hint = "vary what separates them, or fit fewer groups"
	if len(o.Groups) == k+1 && o.Groups[0].prob != nil {
		// A variable x moves Σ c_j·ln Π_j by Σ c_j·e_j(x)·ln x: along the
		// rows' direction (no change) it moves the groups together; off
		// it, it separates them.
		var move, sep []string
		for vi, vr := range o.Groups[0].prob.vars {
			t, mag := 0.0, 0.0
			for _, j := range in {
				g := o.Groups[j+1]
				if g.prob != o.Groups[0].prob {
					return e
				}
				x := g.exps[vi].Float() * c[j]
				t += x
				mag += math.Abs(x)
			}
			switch {
			case mag == 0:
			case math.Abs(t) <= 0.02*mag:
				move = append(move, vr.Symbol)
			default:
				sep = append(sep, vr.Symbol)
			}
		}
		var h strings.Builder
		if len(move) > 0 {
			fmt.Fprintf(&h, "varying %s moves them together; ", orList(move, "and"))
		}
		if len(sep) > 0 {
			fmt.Fprintf(&h, "vary %s as well (a variable held constant over the rows cannot separate them), or fit one of them alone", orList(sep, "or"))
		} else {
			h.WriteString("fit one of them alone")
		}
		e.Hint = h.String()
	}
	return e
}

// orList writes "a", "a or b", "a, b or c".
func orList(xs []string, conj string) string {
	if len(xs) == 1 {
		return xs[0]
	}
	return strings.Join(xs[:len(xs)-1], ", ") + " " + conj + " " + xs[len(xs)-1]
}

func fitName(names []string, j int) string {
	if j < len(names) && names[j] != "" {
		return names[j]
	}
	return piName(j)
}

// lag1 returns the lag-1 autocorrelation Σ eᵢ·eᵢ₊₁ / Σ eᵢ² of residuals
// e, 0 when they are all zero.
func lag1(e []float64) float64 {
	num, den := 0.0, 0.0
	for i, x := range e {
		den += x * x
		if i > 0 {
			num += e[i-1] * x
		}
	}
	if den == 0 {
		return 0
	}
	return num / den
}

// RunsTest is the Wald–Wolfowitz runs test on the signs of a fit's
// residuals ordered by the fitted value, with the normal approximation:
// mean μ = 2·n₊·n₋/n + 1 and variance (μ − 1)(μ − 2)/(n − 1) runs.
// LackOfFit is set when Z < −1.645 (fewer runs than chance gives, one-sided
// at 5 %). With fewer than 10 residuals of either sign the approximation
// is rough, and Approximate says so.
type RunsTest struct {
	Runs, Plus, Minus int
	Expected, Z       float64
	LackOfFit         bool
	Approximate       bool
}

// String writes the test for a report.
func (r RunsTest) String() string {
	s := fmt.Sprintf("runs test on the residuals' signs ordered by the fitted value: %d runs, %.1f expected, z = %.2f", r.Runs, r.Expected, r.Z)
	if r.LackOfFit {
		s += ": LACK OF FIT (too few runs, one-sided 5 %): the law misses a trend in the data"
	} else {
		s += ": no lack of fit shown (one-sided 5 %)"
	}
	if r.Approximate {
		s += " (fewer than 10 residuals of one sign: the normal approximation is rough)"
	}
	return s
}

func runsTest(resid []float64, fitted *mat.VecDense, sw []float64) RunsTest {
	idx := make([]int, len(resid))
	for i := range idx {
		idx[i] = i
	}
	slices.SortStableFunc(idx, func(a, b int) int {
		return cmp.Compare(fitted.AtVec(a)/sw[a], fitted.AtVec(b)/sw[b])
	})
	var r RunsTest
	last := 0
	for _, i := range idx {
		sg := 0
		switch {
		case resid[i] > 0:
			sg, r.Plus = 1, r.Plus+1
		case resid[i] < 0:
			sg, r.Minus = -1, r.Minus+1
		default:
			continue
		}
		if sg != last {
			r.Runs++
			last = sg
		}
	}
	n := float64(r.Plus + r.Minus)
	r.Approximate = r.Plus < 10 || r.Minus < 10
	if r.Plus == 0 || r.Minus == 0 {
		r.LackOfFit = n > 2 // every residual of one sign
		r.Expected, r.Z = 1, 0
		return r
	}
	r.Expected = 2*float64(r.Plus)*float64(r.Minus)/n + 1
	v := (r.Expected - 1) * (r.Expected - 2) / (n - 1)
	if v > 0 {
		r.Z = (float64(r.Runs) - r.Expected) / math.Sqrt(v)
	}
	r.LackOfFit = r.Z < -1.645
	return r
}

// Prediction is the fitted Π₀ at a point, with its confidence interval
// (for the mean) and prediction interval (for one new measurement), both
// at the fit's level. A point outside the range the law was fitted on is
// an extrapolation: Extrapolated is set and Outside lists the groups
// (1 for Π₁, …) that left their range; Note says so in words, and every
// report that prints the value should print it.
type Prediction struct {
	Value        float64
	Mean         [2]float64
	Individual   [2]float64
	Extrapolated bool
	Outside      []int
	note         string
}

// Note is "" for a prediction within the fitted range, and otherwise
// "EXTRAPOLATED: Π₁ = 3e+05 outside the fitted 1000 … 2e+05".
func (p Prediction) Note() string { return p.note }

// Predict returns the fitted Π₀ for groups Π₁ … Π_k.
func (f *PowerLaw) Predict(groups ...float64) (Prediction, error) {
	if len(groups) != len(f.Exponents) {
		return Prediction{}, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("%d groups for a fit of %d", len(groups), len(f.Exponents))}
	}
	x0 := mat.NewVecDense(len(groups)+1, nil)
	x0.SetVec(0, 1)
	lnY := math.Log(f.C)
	for j, g := range groups {
		if !(g > 0) || math.IsInf(g, 0) {
			return Prediction{}, &Error{Op: OpFit, Kind: ErrNonPositive, Row: -1, Group: j + 1, Reason: fmt.Sprintf("value %v is not positive and finite", g)}
		}
		x0.SetVec(j+1, math.Log(g))
		lnY += f.Exponents[j] * math.Log(g)
	}
	v := mat.Inner(x0, f.cov, x0)
	se, sp := math.Sqrt(v), math.Sqrt(v+f.sigma2)
	pr := Prediction{
		Value:      math.Exp(lnY),
		Mean:       [2]float64{math.Exp(lnY - f.tq*se), math.Exp(lnY + f.tq*se)},
		Individual: [2]float64{math.Exp(lnY - f.tq*sp), math.Exp(lnY + f.tq*sp)},
	}
	for _, x := range []float64{pr.Value, pr.Mean[0], pr.Mean[1], pr.Individual[0], pr.Individual[1]} {
		if !(x > 0) || math.IsInf(x, 0) {
			return Prediction{}, &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("the prediction at %v is out of the range of a float64", groups)}
		}
	}
	var parts []string
	for j, g := range groups {
		if j < len(f.Ranges) && (g < f.Ranges[j][0] || g > f.Ranges[j][1]) {
			pr.Outside = append(pr.Outside, j+1)
			name := piName(j + 1)
			if j+1 < len(f.names) {
				name = f.names[j+1]
			}
			parts = append(parts, fmt.Sprintf("%s = %.4g outside the fitted %.4g … %.4g", name, g, f.Ranges[j][0], f.Ranges[j][1]))
		}
	}
	if len(parts) > 0 {
		pr.Extrapolated = true
		pr.note = "EXTRAPOLATED: " + strings.Join(parts, "; ")
	}
	return pr, nil
}

// finiteFit reports whether every number a fit returns is finite.
func finiteFit(f *PowerLaw) bool {
	xs := append([]float64{f.C, f.CInterval[0], f.CInterval[1], f.R2, f.RMS, f.Cond}, f.Exponents...)
	xs = append(xs, f.StdErr...)
	for _, iv := range f.Intervals {
		xs = append(xs, iv[0], iv[1])
	}
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// Formula writes the fitted law as formula text for package
// units/formula: "Eu = 4.176 * (rho*V*d/mu)^(-0.0977) * (L/d)^(0.2525)",
// with y naming the fitted group and groups the Pi groups Π₁ … Π_k the
// law was fitted on, written in their variables. The coefficient and the
// exponents are written with the shortest decimals that read back to the
// same float64s, so a harness can keep its reduction as text and compile
// it against the variables' dimensions.
func (f *PowerLaw) Formula(y string, groups ...Group) (string, error) {
	if len(groups) != len(f.Exponents) {
		return "", &Error{Op: OpFit, Kind: ErrFitShape, Row: -1, Group: -1, Reason: fmt.Sprintf("%d groups for a fit of %d", len(groups), len(f.Exponents))}
	}
	var sb strings.Builder
	sb.WriteString(y)
	sb.WriteString(" = ")
	sb.WriteString(strconv.FormatFloat(f.C, 'g', -1, 64))
	for k, g := range groups {
		fmt.Fprintf(&sb, " * (%s)^(%s)", g.Format(quantity.ASCII), strconv.FormatFloat(f.Exponents[k], 'g', -1, 64))
	}
	return sb.String(), nil
}
