package hydraulic

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/stat/distuv"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/fit"
	"similis.dev/similis/similarity"
)

// RatingInput is a weir's or flume's head–discharge measurements in a
// Froude model, the model crest and water they were made with, and the
// model/prototype length ratio they are carried to full scale by.
type RatingInput struct {
	// Head is the head h over the crest (upstream water level above
	// crest level, read where the drawdown has not begun), and Discharge
	// the discharge Q measured with it, one row each: model values.
	Head, Discharge quantity.Series
	// CrestLength is the model crest's length b across the flow, for the
	// weir coefficient C_d and the unit discharge q = Q/b.
	CrestLength quantity.Quantity
	// LengthRatio is λ_L, model/prototype (1/30 for a 1:30 model).
	LengthRatio float64
	// The model water: kinematic viscosity ν, density ρ and surface
	// tension σ, for the scale-effect checks.
	KinematicViscosity, Density, SurfaceTension quantity.Quantity
	// Limits are the scale-effect limits each head is checked against;
	// WeirLimits when left zero.
	Limits FreeSurfaceLimits
	// Gravity is g; g_n when unset.
	Gravity quantity.Quantity
	// Level is the confidence level of the intervals and bands, 0.95
	// when zero.
	Level float64
}

// ExclusionRule is the rule FitRating applies to the scale-effect
// checks, printed with the rating.
const ExclusionRule = "a point whose head, Reynolds or Weber number fails its limit is excluded from the fitted rating, " +
	"and so from the prototype rating and its range; it is listed with the checks it failed"

// RatingPoint is one model measurement as FitRating used it.
type RatingPoint struct {
	Head      float64 // model h (m)
	Discharge float64 // model Q (m³/s)
	// WeirCoefficient is this point's C_d = Q/((2/3)·√(2g)·b·h^(3/2)).
	WeirCoefficient float64
	// Velocity is the critical velocity V = (g·q)^(1/3) for the measured
	// unit discharge q = Q/b, with which the Reynolds and Weber numbers
	// are formed (Re = V·h/ν, We = ρV²h/σ) (m/s).
	Velocity float64
	Checks   []ScaleCheck // FreeSurfaceChecks at V and h
	// Excluded is set when a check fails (ExclusionRule); Failed names
	// the checks that failed.
	Excluded bool
	Failed   []string
	// For an included point: its residual in ln Q (Q/Q_fit − 1 to first
	// order), externally studentised residual, and whether the fit flags
	// it as an outlier (|t| > 3) or influential (Cook's D > 4/N). Flagged
	// points stay in the fit.
	Residual, Studentized float64
	Outlier, Influential  bool
}

// Rating is a head–discharge relation fitted to model measurements and
// carried to the prototype by Froude similarity.
//
// The power law Q = C·h^n is fitted as the straight line
// ln Q = ln C + n·ln h by linear least squares (fit.FitPoly, order 1):
// the scatter of a discharge measurement is a fraction of the reading
// (a flowmeter's or a volumetric tank's uncertainty is quoted as a
// percentage), so it is the logarithm whose scatter is even over a head
// range of several times; the model is linear in ln C and n, so its
// intervals are exact for normal residuals rather than linearised, and
// it needs no starting point. The weir coefficient C_d of
// Q = C_d·(2/3)·√(2g)·b·h^(3/2) is fitted the same way with the
// exponent held at 3/2, as the mean of ln C_d (fit.FitPoly, order 0).
// Back-transformed, the fitted curve is the median discharge at a head;
// for scatter of a few per cent the mean is larger by the fraction S²/2,
// negligible beside the band.
type Rating struct {
	Points []RatingPoint
	Used   int // included points
	// C and N are the model's Q = C·h^n in SI (Q in m³/s, h in m), with
	// their confidence intervals at Level.
	//
	// C is the coefficient (m^(3−n)/s).
	C float64
	// N is the exponent n (dimensionless).
	N float64
	// CInterval is the interval of C (m^(3−n)/s); NInterval that of N.
	CInterval, NInterval [2]float64
	// NStdErr and LnCStdErr are the standard errors of n and ln C.
	NStdErr, LnCStdErr float64
	// WeirCoefficient is C_d with n held at 3/2, and its interval;
	// Froude similarity carries it unchanged to the prototype.
	WeirCoefficient         float64
	WeirCoefficientInterval [2]float64
	// S is the residual standard deviation in ln Q (about the relative
	// scatter of one discharge about the curve); DoF its degrees of
	// freedom.
	S   float64
	DoF int
	// T is the Student t quantile at Level with DoF degrees of freedom:
	// the coverage factor of the intervals and of RatingValue.Band, whose
	// RelU is a standard (k = 1) uncertainty.
	T float64
	// HeadMin and HeadMax are the model heads of the included points (m):
	// the range of validity of the rating, HeadMin/λ_L to HeadMax/λ_L at
	// full scale.
	HeadMin, HeadMax float64
	// LengthRatio λ_L and DischargeRatio λ_Q = λ_L^(5/2), model/prototype,
	// from similarity.Froude with the same water.
	LengthRatio, DischargeRatio float64
	// ProtoC is the prototype's C_p = C·λ_L^n/λ_Q of Q_p = C_p·h_p^n
	// (m^(3−n)/s).
	ProtoC float64
	// CrestLength is the model crest length b (m).
	CrestLength float64
	// Level is the confidence level of the intervals.
	Level float64
	// Gravity is the acceleration of gravity g used (m/s²).
	Gravity float64
	// Notes says what the numbers above do not: the outliers, a weir
	// exponent whose interval excludes 3/2.
	Notes []string

	fit *fit.Poly
}

// RatingValue is the rating at one head with its band.
type RatingValue struct {
	Head, Discharge quantity.Quantity
	// Band is the confidence interval of the rating curve at Head (the
	// fit's uncertainty alone, at Level); New the prediction interval of
	// one new measurement there. Neither holds the scale effects.
	Band, New [2]quantity.Quantity
	// RelU is the standard uncertainty of the curve at Head as a fraction
	// of Discharge (the standard error of ln Q).
	RelU  float64
	Level float64
	// Extrapolated is set for a head outside the range of validity;
	// only Extrapolate returns one.
	Extrapolated bool
}

// BandNote says what a rating's band holds, to be printed with it.
const BandNote = "the band is the fit's uncertainty alone (the confidence interval of the fitted curve); " +
	"scale effects, the measurement's own systematic errors and any change of the structure are not in it"

// FitRating checks each model point for scale effects, excludes those
// that fail by ExclusionRule, fits the rating Q = C·h^n and the weir
// coefficient C_d to the rest, and carries the rating to the prototype
// by Froude similarity (Q_p = Q_m/λ_L^(5/2), h_p = h_m/λ_L, the same
// water). It needs at least three included points at two or more heads.
//
// Every error is a *Error: of class quantity.ErrDimension for a value of
// the wrong dimension, quantity.ErrInvalid for data it cannot take (a
// head or discharge that is not positive and finite, rows of different
// lengths, too few included points), quantity.ErrRange for a length
// ratio that is not positive and finite (as for the package's other
// ratios) or a result out of the range of a float64. See
// StructureCaution.
func FitRating(in RatingInput) (*Rating, error) {
	const op = "weir rating"
	if err := in.Head.Check(quantity.Length); err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("head", "the heads", err)}
	}
	if err := in.Discharge.Check(quantity.VolumeFlowRate); err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("discharge", "the discharges", err)}
	}
	n := in.Head.Len()
	if in.Discharge.Len() != n {
		return nil, &Error{Op: op, Fault: similarity.Invalid("discharge", fmt.Sprintf("%d heads and %d discharges: want one of each per point", n, in.Discharge.Len()))}
	}
	if n > fit.MaxRows {
		return nil, &Error{Op: op, Fault: similarity.Invalid("head", fmt.Sprintf("%d points, more than %d", n, fit.MaxRows))}
	}
	g, bad := similarity.GravityOr(in.Gravity)
	if bad != nil {
		return nil, asError(op, "gravity", fail(op, bad))
	}
	if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: "crest length", Value: in.CrestLength, Dim: quantity.Length})); err != nil {
		return nil, asError(op, "crest length", err)
	}
	if err := fail(op, similarity.CheckRatios(similarity.Result{Name: "length", Value: in.LengthRatio})); err != nil {
		return nil, err
	}
	level := in.Level
	if level == 0 {
		level = 0.95
	}
	if !(level > 0 && level < 1) {
		return nil, &Error{Op: op, Fault: similarity.Invalid("level", fmt.Sprintf("confidence level %v: want 0 < level < 1", in.Level))}
	}
	lim := in.Limits
	if lim == (FreeSurfaceLimits{}) {
		lim = WeirLimits()
	}
	fr, err := similarity.Froude(similarity.Scales{Length: in.LengthRatio, Density: 1})
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("length ratio", "the Froude scales", err)}
	}
	lq, err := fr.DerivedRatio(quantity.VolumeFlowRate)
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("length ratio", "the discharge ratio", err)}
	}
	ll, err := fr.DerivedRatio(quantity.Length)
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("length ratio", "the length ratio", err)}
	}
	if err := fail(op, similarity.CheckRatios(
		similarity.Result{Name: "discharge", Value: lq.Value},
		similarity.Result{Name: "length", Value: ll.Value})); err != nil {
		return nil, err
	}
	b, gv := in.CrestLength.Value(), g.Value()
	weir := 2.0 / 3 * math.Sqrt(2*gv) * b // C_d = Q/(weir·h^1.5)
	r := &Rating{Points: make([]RatingPoint, n), LengthRatio: ll.Value, DischargeRatio: lq.Value,
		CrestLength: b, Level: level, Gravity: gv}
	var lnH, lnQ, lnCd []float64
	var used []int
	for i := range n {
		h, q := in.Head.At(i).Value(), in.Discharge.At(i).Value()
		if !(h > 0) || math.IsInf(h, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid("head", fmt.Sprintf("point %d: head %v: want positive and finite", i, h))}
		}
		if !(q > 0) || math.IsInf(q, 0) {
			return nil, &Error{Op: op, Fault: similarity.Invalid("discharge", fmt.Sprintf("point %d: discharge %v: want positive and finite", i, q))}
		}
		p := RatingPoint{Head: h, Discharge: q}
		p.WeirCoefficient = q / (weir * h * math.Sqrt(h))
		p.Velocity = math.Cbrt(gv * q / b)
		if err := fail(op, similarity.CheckResults(true, similarity.Result{Name: fmt.Sprintf("weir coefficient at point %d", i), Value: p.WeirCoefficient},
			similarity.Result{Name: fmt.Sprintf("critical velocity at point %d", i), Value: p.Velocity})); err != nil {
			return nil, err
		}
		cs, err := FreeSurfaceChecks(quantity.New(p.Velocity, quantity.Velocity), in.Head.At(i), in.KinematicViscosity, in.Density, in.SurfaceTension, lim)
		if err != nil {
			if e, ok := err.(*Error); ok {
				return nil, &Error{Op: op, Fault: similarity.Fault{Input: e.Input, Reason: fmt.Sprintf("point %d: %s", i, e.Reason), Class: e.Class, Err: e.Err}}
			}
			return nil, &Error{Op: op, Fault: similarity.Caused("", fmt.Sprintf("point %d: the scale-effect checks", i), err)}
		}
		p.Checks = cs
		for _, c := range cs {
			if !c.Pass {
				p.Excluded = true
				p.Failed = append(p.Failed, c.Name)
			}
		}
		r.Points[i] = p
		if !p.Excluded {
			used = append(used, i)
			lnH, lnQ = append(lnH, math.Log(h)), append(lnQ, math.Log(q))
			lnCd = append(lnCd, math.Log(p.WeirCoefficient))
		}
	}
	r.Used = len(used)
	if r.Used < 3 {
		return nil, &Error{Op: op, Fault: similarity.Invalid("head", fmt.Sprintf("%d of %d points pass the scale-effect checks: the rating needs at least 3 (%s)", r.Used, n, ExclusionRule))}
	}
	opt := &fit.Options{Level: level}
	f, err := fit.FitPoly(lnH, lnQ, 1, opt)
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("head", "fitting ln Q against ln h", err)}
	}
	a, se, err := f.Power()
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("head", "the rating's coefficients", err)}
	}
	cd, err := fit.FitPoly(lnH, lnCd, 0, opt)
	if err != nil {
		return nil, &Error{Op: op, Fault: similarity.Caused("head", "fitting the weir coefficient", err)}
	}
	r.fit = f
	tq := distuv.StudentsT{Mu: 0, Sigma: 1, Nu: float64(f.DoF)}.Quantile(0.5 + level/2)
	r.N, r.NStdErr, r.LnCStdErr = a[1], se[1], se[0]
	r.C = math.Exp(a[0])
	r.CInterval = [2]float64{math.Exp(a[0] - tq*se[0]), math.Exp(a[0] + tq*se[0])}
	r.NInterval = [2]float64{a[1] - tq*se[1], a[1] + tq*se[1]}
	r.WeirCoefficient = math.Exp(cd.B[0])
	r.WeirCoefficientInterval = [2]float64{math.Exp(cd.Intervals[0][0]), math.Exp(cd.Intervals[0][1])}
	r.S, r.DoF, r.T = f.S, f.DoF, tq
	r.HeadMin, r.HeadMax = math.Inf(1), 0
	for _, i := range used {
		r.HeadMin, r.HeadMax = min(r.HeadMin, r.Points[i].Head), max(r.HeadMax, r.Points[i].Head)
	}
	r.ProtoC = r.C * math.Pow(r.LengthRatio, r.N) / r.DischargeRatio
	if err := fail(op, similarity.CheckResults(true,
		similarity.Result{Name: "coefficient C", Value: r.C},
		similarity.Result{Name: "lower bound of C", Value: r.CInterval[0]},
		similarity.Result{Name: "upper bound of C", Value: r.CInterval[1]},
		similarity.Result{Name: "weir coefficient C_d", Value: r.WeirCoefficient},
		similarity.Result{Name: "lower bound of C_d", Value: r.WeirCoefficientInterval[0]},
		similarity.Result{Name: "upper bound of C_d", Value: r.WeirCoefficientInterval[1]},
		similarity.Result{Name: "prototype coefficient C_p", Value: r.ProtoC},
		similarity.Result{Name: "highest head", Value: r.HeadMax},
		similarity.Result{Name: "lowest head", Value: r.HeadMin})); err != nil {
		return nil, err
	}
	if err := fail(op, similarity.CheckResults(false,
		similarity.Result{Name: "exponent n", Value: r.N},
		similarity.Result{Name: "lower bound of n", Value: r.NInterval[0]},
		similarity.Result{Name: "upper bound of n", Value: r.NInterval[1]},
		similarity.Result{Name: "standard error of n", Value: r.NStdErr},
		similarity.Result{Name: "standard error of ln C", Value: r.LnCStdErr},
		similarity.Result{Name: "residual standard deviation", Value: r.S})); err != nil {
		return nil, err
	}
	for k, row := range f.Rows {
		p := &r.Points[used[k]]
		p.Residual, p.Studentized = row.Residual, row.Studentized
	}
	for _, k := range f.Outliers {
		r.Points[used[k]].Outlier = true
	}
	for _, k := range f.Influential {
		r.Points[used[k]].Influential = true
	}
	if len(f.Outliers) > 0 {
		var idx []string
		for _, k := range f.Outliers {
			idx = append(idx, fmt.Sprint(used[k]))
		}
		r.Notes = append(r.Notes, fmt.Sprintf("point(s) %s flagged as outliers (|t| > %g) and kept in the fit: check them, and refit without them only if they are found to be mistakes",
			strings.Join(idx, ", "), float64(fit.DefaultOutlierT)))
	}
	if !(r.NInterval[0] <= 1.5 && 1.5 <= r.NInterval[1]) {
		r.Notes = append(r.Notes, fmt.Sprintf("the exponent's interval [%.4f, %.4f] excludes 3/2: C_d varies with the head, so the power law, not C_d, is the rating", r.NInterval[0], r.NInterval[1]))
	}
	r.Notes = append(r.Notes, f.Notes...)
	return r, nil
}

// Model returns the model rating at the model head h, refusing a head
// outside the range of validity (an *Error of class quantity.ErrRange).
func (r *Rating) Model(h quantity.Quantity) (RatingValue, error) {
	return r.at("model rating", h, 1, 1, false)
}

// Prototype returns the prototype rating at the prototype head h: the
// model rating at h_m = λ_L·h, its discharge divided by λ_Q. A head
// outside HeadMin/λ_L … HeadMax/λ_L is refused with an *Error of class
// quantity.ErrRange: use Extrapolate to go outside deliberately.
func (r *Rating) Prototype(h quantity.Quantity) (RatingValue, error) {
	return r.at("prototype rating", h, r.LengthRatio, r.DischargeRatio, false)
}

// Extrapolate is Prototype without the range check; the value is marked
// Extrapolated outside the range of validity, where the power law and
// the band rest on no measurement.
func (r *Rating) Extrapolate(h quantity.Quantity) (RatingValue, error) {
	return r.at("prototype rating", h, r.LengthRatio, r.DischargeRatio, true)
}

// ProtoHeadRange returns the prototype heads of the range of validity,
// in m.
func (r *Rating) ProtoHeadRange() (lo, hi float64) {
	return r.HeadMin / r.LengthRatio, r.HeadMax / r.LengthRatio
}

func (r *Rating) at(op string, h quantity.Quantity, lambdaL, lambdaQ float64, outside bool) (RatingValue, error) {
	if err := fail(op, similarity.CheckInputs(true, similarity.Input{Name: "head", Value: h, Dim: quantity.Length})); err != nil {
		return RatingValue{}, asError(op, "head", err)
	}
	hm := h.Value() * lambdaL
	if err := fail(op, similarity.CheckResults(true, similarity.Result{Name: "model head", Value: hm})); err != nil {
		return RatingValue{}, err
	}
	if !outside && (hm < r.HeadMin*(1-1e-12) || hm > r.HeadMax*(1+1e-12)) {
		return RatingValue{}, &Error{Op: op, Fault: similarity.OutOfRange("head", fmt.Sprintf("head %.4g m is outside the range of validity %.4g … %.4g m: an extrapolation (use Extrapolate to make one deliberately)",
			h.Value(), r.HeadMin/lambdaL, r.HeadMax/lambdaL))}
	}
	// A head at an end of the range, up to rounding in h·λ_L, is the end.
	x := math.Log(hm)
	if math.Abs(hm/r.HeadMin-1) < 1e-12 {
		x = r.fit.XMin
	} else if math.Abs(hm/r.HeadMax-1) < 1e-12 {
		x = r.fit.XMax
	}
	var pr fit.Prediction
	var err error
	if outside {
		pr, err = r.fit.Extrapolate(x)
	} else {
		pr, err = r.fit.Predict(x)
	}
	if err != nil {
		return RatingValue{}, &Error{Op: op, Fault: similarity.Caused("head", "the rating at this head", err)}
	}
	qv := func(lnq float64) float64 { return math.Exp(lnq) / lambdaQ }
	v := RatingValue{Head: h, Discharge: quantity.New(qv(pr.Y), quantity.VolumeFlowRate), RelU: pr.SE, Level: pr.Level, Extrapolated: pr.Extrapolated}
	for k := range 2 {
		v.Band[k] = quantity.New(qv(pr.Mean[k]), quantity.VolumeFlowRate)
		v.New[k] = quantity.New(qv(pr.New[k]), quantity.VolumeFlowRate)
	}
	if err := fail(op, similarity.CheckResults(true,
		similarity.Result{Name: "discharge", Value: v.Discharge.Value()},
		similarity.Result{Name: "lower band", Value: v.Band[0].Value()},
		similarity.Result{Name: "upper band", Value: v.Band[1].Value()},
		similarity.Result{Name: "lower prediction bound", Value: v.New[0].Value()},
		similarity.Result{Name: "upper prediction bound", Value: v.New[1].Value()})); err != nil {
		return RatingValue{}, err
	}
	if err := fail(op, similarity.CheckResults(false, similarity.Result{Name: "relative uncertainty", Value: v.RelU})); err != nil {
		return RatingValue{}, err
	}
	return v, nil
}

// String writes the model rating: "Q = 1.234·h^1.502 (Q in m³/s, h in m)
// …" with the intervals, the weir coefficient and the range.
func (r *Rating) String() string {
	return fmt.Sprintf("Q = %.5g·h^%.4f (model; Q in m³/s, h in m), n in [%.4f, %.4f], C in [%.5g, %.5g] at %g %%; C_d = %.4f in [%.4f, %.4f] with n = 3/2; %d points, heads %.4g … %.4g m",
		r.C, r.N, r.NInterval[0], r.NInterval[1], r.CInterval[0], r.CInterval[1], r.Level*100,
		r.WeirCoefficient, r.WeirCoefficientInterval[0], r.WeirCoefficientInterval[1], r.Used, r.HeadMin, r.HeadMax)
}

// asError returns err as a *Error of op: itself when it is one, wrapped
// in its class otherwise.
func asError(op, input string, err error) error {
	if e, ok := err.(*Error); ok {
		return e
	}
	return &Error{Op: op, Fault: similarity.Caused(input, "the "+input, err)}
}
