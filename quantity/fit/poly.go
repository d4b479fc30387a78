package fit

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"
)

// MaxOrder is the highest polynomial order FitPoly and SelectPoly take.
const MaxOrder = 12

// MaxRows is the most rows a fit takes (131072), which bounds its work
// and memory.
const MaxRows = 1 << 17

// DefaultOutlierT is the threshold on the externally studentised residual
// |tᵢ| above which a row is flagged as an outlier when Options.OutlierT is
// zero (common practice).
const DefaultOutlierT = 3

// Options adjusts a fit. The zero value is an unweighted fit with 95 %
// intervals and outliers flagged at |tᵢ| > 3.
type Options struct {
	// Weights, one per row, positive and finite; nil means equal weights.
	// They are relative: the residual variance per unit weight is
	// estimated from the residuals, so multiplying every weight by one
	// constant changes nothing. For rows of known standard uncertainty uᵢ
	// use WeightsFromU (wᵢ = 1/uᵢ²).
	Weights []float64
	// Level is the confidence level of the intervals, 0.95 if zero.
	Level float64
	// OutlierT is the threshold on |tᵢ|, DefaultOutlierT if zero.
	OutlierT float64
}

// WeightsFromU returns the weights wᵢ = 1/uᵢ² of rows with standard
// uncertainties u, each positive and finite.
func WeightsFromU(u []float64) ([]float64, error) {
	w := make([]float64, len(u))
	for i, v := range u {
		if !(v > 0) || !finite(v) {
			return nil, invalid("WeightsFromU", i, "standard uncertainty %v: want a positive finite number", v)
		}
		w[i] = 1 / (v * v)
		if !(w[i] > 0) || !finite(w[i]) {
			return nil, outOfRange("WeightsFromU", i, "standard uncertainty %v: its weight 1/u² is out of the range of a float64", v)
		}
	}
	return w, nil
}

// options checks opt against n rows and fills the defaults.
func options(op string, opt *Options, n int) (Options, error) {
	var o Options
	if opt != nil {
		o = *opt
	}
	if o.Level == 0 {
		o.Level = 0.95
	}
	if !(o.Level > 0 && o.Level < 1) {
		return o, invalid(op, -1, "confidence level %v: want 0 < level < 1", o.Level)
	}
	if o.OutlierT == 0 {
		o.OutlierT = DefaultOutlierT
	}
	if !(o.OutlierT > 0) || !finite(o.OutlierT) {
		return o, invalid(op, -1, "outlier threshold %v: want a positive finite number", o.OutlierT)
	}
	if o.Weights != nil {
		if len(o.Weights) != n {
			return o, invalid(op, -1, "%d weights for %d rows", len(o.Weights), n)
		}
		// Normalise to mean 1, so that tiny or huge weights cannot
		// overflow the weighted sums; the fit is the same.
		sum := 0.0
		for i, w := range o.Weights {
			if !(w > 0) || !finite(w) {
				return o, invalid(op, i, "weight %v: want a positive finite number", w)
			}
			sum += w / float64(n)
		}
		ws := make([]float64, n)
		for i, w := range o.Weights {
			ws[i] = w / sum
			if !(ws[i] > 0) || !finite(ws[i]) {
				return o, outOfRange(op, i, "weight %v spans too wide a range from the others", w)
			}
		}
		o.Weights = ws
	}
	return o, nil
}

// checkXY refuses rows of different lengths, too many rows, and values
// that are not finite.
func checkXY(op string, x, y []float64) error {
	if len(x) != len(y) {
		return invalid(op, -1, "%d x values and %d y values", len(x), len(y))
	}
	if len(x) > MaxRows {
		return invalid(op, -1, "%d rows, more than %d", len(x), MaxRows)
	}
	for i := range x {
		if !finite(x[i]) {
			return outOfRange(op, i, "x = %v: want a finite number", x[i])
		}
		if !finite(y[i]) {
			return outOfRange(op, i, "y = %v: want a finite number", y[i])
		}
	}
	return nil
}

// Poly is a polynomial fitted by least squares,
//
//	y = Σ_{k=0}^{Order} B_k·t^k,   t = (x − Center)/Scale,
//
// in the scaled variable t, which runs from −1 to 1 over the fitted x
// range, so that the powers of t are of one size and the design matrix
// is well conditioned. Power gives the coefficients of the powers of x.
//
// The intervals use Student's t with DoF = N − Order − 1 degrees of
// freedom and the residual standard deviation S (per unit weight).
type Poly struct {
	Order         int
	Center, Scale float64
	B             []float64    // coefficients of t⁰ … t^Order
	StdErr        []float64    // standard errors of B
	Intervals     [][2]float64 // confidence intervals of B at Level
	N, DoF        int          // rows; residual degrees of freedom N − Order − 1
	S             float64      // residual standard deviation, √(SSE/DoF)
	SSE           float64      // weighted residual sum of squares Σ wᵢ eᵢ²
	R2            float64      // coefficient of determination (1 when y is constant and fitted exactly)
	XMin, XMax    float64      // the fitted x range: Predict refuses outside it
	Level         float64      // confidence level of the intervals
	Cond          float64      // condition number of the weighted design matrix in t
	// LackOfFit is the F test of the model against the pure error of
	// repeated x values; nil when there are no repeats, or no degrees of
	// freedom for lack of fit.
	LackOfFit *LackOfFit
	// Rows holds each row's residual and influence.
	Rows []Row
	// Outliers lists the rows whose |Studentized| exceeds the threshold
	// (Options.OutlierT); Influential those whose Cook's distance exceeds
	// 4/N (common practice). They are flagged, never dropped: refit
	// without them deliberately if they are found to be mistakes.
	Outliers, Influential []int
	// Selection lists the orders SelectPoly compared, empty for FitPoly.
	Selection []Candidate
	// Notes says what the numbers above do not: a criterion that reached
	// its highest order, residuals that could not be studentised.
	Notes []string

	cov  *mat.SymDense // S²·(AᵀWA)⁻¹
	tq   float64       // Student t quantile for Level
	wbar float64       // mean weight (1 after normalisation)
}

// Row is one row's residual and influence in a fit.
type Row struct {
	X, Y, Fit float64
	Residual  float64 // Y − Fit
	Leverage  float64 // hᵢ, the diagonal of the hat matrix
	// Studentized is the externally studentised residual
	// tᵢ = √wᵢ·eᵢ / (S₍ᵢ₎·√(1 − hᵢ)), S₍ᵢ₎ the residual standard deviation
	// of the fit without row i; it follows Student's t with DoF − 1
	// degrees of freedom when the row is not an outlier. It is 0 where it
	// is not defined (hᵢ = 1, or DoF < 2). A row that alone departs from
	// an otherwise exact fit has ±math.MaxFloat64.
	Studentized float64
	// Cook is Cook's distance Dᵢ = rᵢ²/p · hᵢ/(1 − hᵢ), rᵢ the internally
	// studentised residual and p the number of coefficients; 0 where
	// hᵢ = 1.
	Cook float64
}

// LackOfFit is the lack-of-fit F test: the residual sum of squares split
// into pure error, the scatter of repeated rows about their own mean, and
// lack of fit, the rest; F = (SSLack/DFLack)/(SSPure/DFPure). A small P
// says the model does not follow the data as closely as repeated rows
// agree with each other.
type LackOfFit struct {
	Groups         int // distinct x values
	SSPure, SSLack float64
	DFPure, DFLack int     // N − Groups and Groups − Order − 1
	F              float64 // math.MaxFloat64 when the pure error is 0 and the lack of fit is not
	P              float64 // the probability of an F this large if the model were right
}

// Candidate is one order compared by SelectPoly.
type Candidate struct {
	Order int
	SSE   float64
	// AICc = N·ln(SSE/N) + 2k + 2k(k+1)/(N − k − 1), k = Order + 2 (the
	// coefficients and the variance); 0 where N − k − 1 ≤ 0.
	AICc float64
	// PNext is the two-sided p-value of the t test of the highest
	// coefficient of the fit of order Order+1 (1 where that fit is not
	// made), and PTop that of this order's own highest coefficient (1
	// for order 0).
	PNext, PTop float64
}

// Prediction is a fitted value with its intervals.
type Prediction struct {
	X, Y float64
	// SE is the standard error of Y as an estimate of the mean response
	// at X.
	SE float64
	// Mean is the confidence interval of the mean response at X, and New
	// the prediction interval of one new observation there (of the mean
	// weight of the fitted rows), both at Level.
	Mean, New [2]float64
	Level     float64
	// Extrapolated is true when X lies outside the fitted range; only
	// Extrapolate returns such a prediction.
	Extrapolated bool
}

// FitPoly fits a polynomial of the given order (0 to MaxOrder) to the
// rows (x[i], y[i]) by weighted least squares, solved by a QR
// factorisation of the design matrix in the scaled variable t. It needs
// at least order+1 distinct x values and order+2 rows (one residual
// degree of freedom for the intervals).
func FitPoly(x, y []float64, order int, opt *Options) (*Poly, error) {
	const op = "FitPoly"
	if err := checkXY(op, x, y); err != nil {
		return nil, err
	}
	o, err := options(op, opt, len(x))
	if err != nil {
		return nil, err
	}
	return fitPoly(op, x, y, order, o)
}

func fitPoly(op string, x, y []float64, order int, o Options) (*Poly, error) {
	n := len(x)
	if order < 0 || order > MaxOrder {
		return nil, invalid(op, -1, "order %d: want 0 … %d", order, MaxOrder)
	}
	p := order + 1
	if n < p+1 {
		return nil, invalid(op, -1, "%d rows for order %d: want at least %d (one degree of freedom for the intervals)", n, order, p+1)
	}
	if d := distinct(x); d < p {
		return nil, invalid(op, -1, "%d distinct x values for order %d: want at least %d", d, order, p)
	}
	lo, hi := slices.Min(x), slices.Max(x)
	c, s := lo/2+hi/2, hi/2-lo/2
	if s == 0 {
		s = 1
	}
	if !finite(s) || !(s > 0) {
		return nil, outOfRange(op, -1, "x range [%v, %v] too wide for a float64", lo, hi)
	}
	a := mat.NewDense(n, p, nil)
	for i, xi := range x {
		t := (xi - c) / s
		v := 1.0
		for k := range p {
			a.Set(i, k, v)
			v *= t
		}
	}
	r, err := solve(op, a, y, o.Weights)
	if err != nil {
		return nil, err
	}
	f := &Poly{Order: order, Center: c, Scale: s, B: r.b, N: n, DoF: n - p, SSE: r.sse,
		XMin: lo, XMax: hi, Level: o.Level, Cond: r.cond, wbar: 1}
	if !allFinite(r.b...) || !finite(r.sse) {
		return nil, outOfRange(op, -1, "the coefficients or residuals are not finite numbers (values too large for a float64)")
	}
	s2 := r.sse / float64(f.DoF)
	f.S = math.Sqrt(s2)
	f.cov = mat.NewSymDense(p, nil)
	f.cov.ScaleSym(s2, r.covU)
	f.tq = distuv.StudentsT{Mu: 0, Sigma: 1, Nu: float64(f.DoF)}.Quantile(0.5 + o.Level/2)
	f.StdErr = make([]float64, p)
	f.Intervals = make([][2]float64, p)
	for k := range p {
		f.StdErr[k] = math.Sqrt(f.cov.At(k, k))
		f.Intervals[k] = [2]float64{f.B[k] - f.tq*f.StdErr[k], f.B[k] + f.tq*f.StdErr[k]}
	}
	// R²
	sw, swy := 0.0, 0.0
	for i := range n {
		w := weight(o.Weights, i)
		sw += w
		swy += w * y[i]
	}
	ybar, sst := swy/sw, 0.0
	for i := range n {
		d := y[i] - ybar
		sst += weight(o.Weights, i) * d * d
	}
	switch {
	case sst > 0:
		f.R2 = 1 - r.sse/sst
	case r.sse == 0:
		f.R2 = 1
	}
	f.diagnose(x, y, r, o)
	f.LackOfFit = lackOfFit(x, y, o.Weights, r.sse, p)
	if l := f.LackOfFit; l != nil && !(finite(l.SSPure) && finite(l.SSLack)) {
		// The scatter of the repeat points overflows a float64 when
		// squared: the test cannot be computed, and says so.
		f.LackOfFit = nil
		f.Notes = append(f.Notes, "no lack-of-fit test: the repeat points' sum of squares overflows a float64")
	}
	return f, nil
}

func weight(w []float64, i int) float64 {
	if w == nil {
		return 1
	}
	return w[i]
}

// distinct returns the number of distinct values in x.
func distinct(x []float64) int {
	s := slices.Clone(x)
	slices.Sort(s)
	return len(slices.Compact(s))
}

// diagnose fills Rows, Outliers and Influential.
func (f *Poly) diagnose(x, y []float64, r *lsq, o Options) {
	var note string
	f.Rows, f.Outliers, f.Influential, note = diagnostics(x, y, r.e, r.h, o, r.sse, f.S, f.DoF, f.Order+1)
	if note != "" {
		f.Notes = append(f.Notes, note)
	}
}

// diagnostics returns each row's residual, leverage, externally
// studentised residual and Cook's distance, the rows flagged as outliers
// and as influential, and a note when residuals cannot be studentised.
func diagnostics(x, y, res, lev []float64, o Options, sse, s float64, dof, p int) (rows []Row, outliers, influential []int, note string) {
	n := len(x)
	rows = make([]Row, n)
	canT := dof >= 2
	if !canT {
		note = "one residual degree of freedom: residuals are not studentised and no row is flagged as an outlier"
	}
	for i := range n {
		e, h, w := res[i], lev[i], weight(o.Weights, i)
		row := Row{X: x[i], Y: y[i], Fit: y[i] - e, Residual: e, Leverage: h}
		we := math.Sqrt(w) * e
		if h < 1-1e-12 {
			if s > 0 {
				ri := we / (s * math.Sqrt(1-h))
				row.Cook = ri * ri / float64(p) * h / (1 - h)
			}
			if canT {
				sd2 := (sse - we*we/(1-h)) / float64(dof-1)
				switch {
				case sd2 > 0:
					row.Studentized = we / math.Sqrt(sd2*(1-h))
				case we != 0:
					row.Studentized = math.Copysign(math.MaxFloat64, we)
				}
				if !finite(row.Studentized) {
					row.Studentized = math.Copysign(math.MaxFloat64, we)
				}
			}
		}
		if !finite(row.Cook) {
			row.Cook = math.MaxFloat64
		}
		rows[i] = row
		if math.Abs(row.Studentized) > o.OutlierT {
			outliers = append(outliers, i)
		}
		if row.Cook > 4/float64(n) {
			influential = append(influential, i)
		}
	}
	return rows, outliers, influential, note
}

// lackOfFit splits sse into pure error and lack of fit over the groups of
// rows with equal x.
func lackOfFit(x, y, w []float64, sse float64, p int) *LackOfFit {
	n := len(x)
	idx := make([]int, n)
	for i := range idx {
		idx[i] = i
	}
	slices.SortFunc(idx, func(a, b int) int {
		switch {
		case x[a] < x[b]:
			return -1
		case x[a] > x[b]:
			return 1
		}
		return 0
	})
	groups, pure := 0, 0.0
	for i := 0; i < n; {
		j := i
		sw, swy := 0.0, 0.0
		for j < n && x[idx[j]] == x[idx[i]] {
			sw += weight(w, idx[j])
			swy += weight(w, idx[j]) * y[idx[j]]
			j++
		}
		m := swy / sw
		for k := i; k < j; k++ {
			d := y[idx[k]] - m
			pure += weight(w, idx[k]) * d * d
		}
		groups++
		i = j
	}
	l := &LackOfFit{Groups: groups, SSPure: pure, SSLack: max(0, sse-pure), DFPure: n - groups, DFLack: groups - p}
	if l.DFPure <= 0 || l.DFLack <= 0 {
		return nil
	}
	switch {
	case l.SSPure > 0:
		l.F = (l.SSLack / float64(l.DFLack)) / (l.SSPure / float64(l.DFPure))
		if !finite(l.F) {
			// The pure error is negligible against the lack of fit: the
			// F ratio overflows and the lack of fit is as certain as it
			// can be.
			l.F, l.P = math.MaxFloat64, 0
			break
		}
		l.P = distuv.F{D1: float64(l.DFLack), D2: float64(l.DFPure)}.Survival(l.F)
	case l.SSLack > 0:
		l.F, l.P = math.MaxFloat64, 0
	default:
		l.F, l.P = 0, 1
	}
	return l
}

// T returns the scaled variable t = (x − Center)/Scale.
func (f *Poly) T(x float64) float64 { return (x - f.Center) / f.Scale }

// Eval returns the fitted value at x, without intervals or a range
// check: for plotting and for loops over the fitted range.
func (f *Poly) Eval(x float64) float64 {
	t, y := f.T(x), 0.0
	for k := f.Order; k >= 0; k-- {
		y = y*t + f.B[k]
	}
	return y
}

// Slope returns dy/dx at x, without a range check.
func (f *Poly) Slope(x float64) float64 {
	t, d := f.T(x), 0.0
	for k := f.Order; k >= 1; k-- {
		d = d*t + float64(k)*f.B[k]
	}
	return d / f.Scale
}

// Cov returns the covariance of B_i and B_j.
func (f *Poly) Cov(i, j int) float64 { return f.cov.At(i, j) }

// Predict returns the fitted value at x with the confidence interval of
// the mean response and the prediction interval of a new observation. It
// refuses an x outside [XMin, XMax] with an *Error of class
// quantity.ErrRange: use Extrapolate to go outside deliberately.
func (f *Poly) Predict(x float64) (Prediction, error) {
	if !finite(x) {
		return Prediction{}, outOfRange("Predict", -1, "x = %v: want a finite number", x)
	}
	if x < f.XMin || x > f.XMax {
		return Prediction{}, outOfRange("Predict", -1, "x = %v is outside the fitted range [%v, %v]: an extrapolation (use Extrapolate to make one deliberately)", x, f.XMin, f.XMax)
	}
	return f.predict("Predict", x)
}

// Extrapolate is Predict without the range check: the prediction is
// marked Extrapolated when x is outside the fitted range. Its intervals
// hold only if the polynomial still describes the relation there, which
// the data cannot show.
func (f *Poly) Extrapolate(x float64) (Prediction, error) {
	if !finite(x) {
		return Prediction{}, outOfRange("Extrapolate", -1, "x = %v: want a finite number", x)
	}
	return f.predict("Extrapolate", x)
}

func (f *Poly) predict(op string, x float64) (Prediction, error) {
	p := f.Order + 1
	var vbuf [MaxOrder + 1]float64
	v := vbuf[:p]
	t := f.T(x)
	v[0] = 1
	for k := 1; k < p; k++ {
		v[k] = v[k-1] * t
	}
	y := f.Eval(x)
	pr := Prediction{X: x, Y: y, SE: math.Sqrt(max(0, quad(f.cov, v))), Level: f.Level, Extrapolated: x < f.XMin || x > f.XMax}
	hw := f.tq * pr.SE
	hn := f.tq * math.Sqrt(f.S*f.S/f.wbar+pr.SE*pr.SE)
	pr.Mean = [2]float64{y - hw, y + hw}
	pr.New = [2]float64{y - hn, y + hn}
	if !allFinite(y, pr.SE, pr.Mean[0], pr.Mean[1], pr.New[0], pr.New[1]) {
		return Prediction{}, outOfRange(op, -1, "the prediction at x = %v is out of the range of a float64", x)
	}
	return pr, nil
}

// quad returns vᵀ C v.
func quad(c *mat.SymDense, v []float64) float64 {
	s := 0.0
	for i := range v {
		for j := range v {
			s += v[i] * c.At(i, j) * v[j]
		}
	}
	return s
}

// Power returns the coefficients a_k of the powers of x, y = Σ a_k·x^k,
// with their standard errors, from B by the binomial expansion of
// ((x − Center)/Scale)^k and the covariance by the same linear map. The
// expansion loses precision when |Center/Scale| is large and the order
// high: predict with Eval or Predict, which work in t. It returns an
// *Error of class quantity.ErrRange if a coefficient or its standard
// error is out of the range of a float64 (a range far from 0 and a high
// order).
func (f *Poly) Power() (a, se []float64, err error) {
	p := f.Order + 1
	// T[j][k]: the coefficient of x^j in t^k = Σ_j C(k,j) x^j (−c)^(k−j) / s^k.
	tm := mat.NewDense(p, p, nil)
	for k := range p {
		sk := math.Pow(f.Scale, float64(k))
		binom := 1.0
		for j := 0; j <= k; j++ {
			if j > 0 {
				binom = binom * float64(k-j+1) / float64(j)
			}
			tm.Set(j, k, binom*math.Pow(-f.Center, float64(k-j))/sk)
		}
	}
	a = make([]float64, p)
	se = make([]float64, p)
	for j := range p {
		s := 0.0
		for k := range p {
			s += tm.At(j, k) * f.B[k]
		}
		a[j] = s
		v := 0.0
		for k := range p {
			for l := range p {
				v += tm.At(j, k) * f.cov.At(k, l) * tm.At(j, l)
			}
		}
		se[j] = math.Sqrt(max(0, v))
		if !finite(a[j]) || !finite(se[j]) {
			return nil, nil, outOfRange("Power", -1, "the coefficient of x^%d is out of the range of a float64: use the coefficients in t", j)
		}
	}
	return a, se, nil
}

// String summarises the fit in one line.
func (f *Poly) String() string {
	return fmt.Sprintf("polynomial of order %d in t = (x − %.6g)/%.6g over x ∈ [%.6g, %.6g]: N = %d, S = %.4g, R² = %.6f",
		f.Order, f.Center, f.Scale, f.XMin, f.XMax, f.N, f.S, f.R2)
}
