package hydraulic_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// water at about 15 °C for the checks (ν, ρ, σ; round values, enough
// for checks whose limits are round numbers).
func ratingInput(h, q []float64, b, lambda float64) hydraulic.RatingInput {
	return hydraulic.RatingInput{
		Head: quantity.NewSeries(h, quantity.Length), Discharge: quantity.NewSeries(q, quantity.VolumeFlowRate),
		CrestLength: quantity.New(b, quantity.Length), LengthRatio: lambda,
		KinematicViscosity: quantity.New(1.14e-6, quantity.KinematicViscosity),
		Density:            quantity.New(999.1, quantity.Density), SurfaceTension: quantity.New(0.0735, quantity.SurfaceTension),
	}
}

// powerData returns Q = c·h^n at the heads, each multiplied by
// 1 + amp·sin(1.7·i): a deterministic scatter of ±amp.
func powerData(c, n, amp float64, h []float64) []float64 {
	q := make([]float64, len(h))
	for i, x := range h {
		q[i] = c * math.Pow(x, n) * (1 + amp*math.Sin(1.7*float64(i)))
	}
	return q
}

var testHeads = []float64{0.08, 0.095, 0.11, 0.125, 0.14, 0.155, 0.17, 0.185}

// TestRatingRoundTrip: data made from known C and n are fitted back to
// them: exactly without scatter, and within the 95 % intervals with a
// ±1.5 % scatter.
func TestRatingRoundTrip(t *testing.T) {
	for _, c := range []struct{ c, n float64 }{{1.9, 1.5}, {0.42, 2.5}, {3.1, 1.62}} {
		r, err := hydraulic.FitRating(ratingInput(testHeads, powerData(c.c, c.n, 0, testHeads), 0.8, 1.0/30))
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(r.C/c.c-1) > 1e-10 || math.Abs(r.N-c.n) > 1e-10 {
			t.Errorf("exact data C = %v, n = %v: fitted %v, %v", c.c, c.n, r.C, r.N)
		}
		r, err = hydraulic.FitRating(ratingInput(testHeads, powerData(c.c, c.n, 0.015, testHeads), 0.8, 1.0/30))
		if err != nil {
			t.Fatal(err)
		}
		if !(r.CInterval[0] < c.c && c.c < r.CInterval[1]) || !(r.NInterval[0] < c.n && c.n < r.NInterval[1]) {
			t.Errorf("C = %v, n = %v outside the intervals %v, %v", c.c, c.n, r.CInterval, r.NInterval)
		}
		if r.C == c.c || r.N == c.n || r.S == 0 {
			t.Errorf("the scatter changed nothing: %+v", r)
		}
	}
}

// TestRatingFroudeByHand: at 1:30, λ_Q = 30^(−5/2) and h_p = h_m·30, so
// Q = 1.9·h^1.5 in the model is Q_p = 1.9·(h_p/30)^1.5·30^2.5
// = 1.9·30·h_p^1.5 = 57·h_p^1.5 in the prototype; at h_p = 4.2 m,
// Q_p = 57·4.2^1.5 = 490.62 m³/s. The band of exact data is nil width.
func TestRatingFroudeByHand(t *testing.T) {
	r, err := hydraulic.FitRating(ratingInput(testHeads, powerData(1.9, 1.5, 0, testHeads), 0.8, 1.0/30))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.DischargeRatio*math.Pow(30, 2.5)-1) > 1e-12 || math.Abs(r.LengthRatio*30-1) > 1e-12 {
		t.Errorf("λ_Q = %v, λ_L = %v", r.DischargeRatio, r.LengthRatio)
	}
	if math.Abs(r.ProtoC/57-1) > 1e-9 {
		t.Errorf("C_p = %v, by hand 57", r.ProtoC)
	}
	v, err := r.Prototype(quantity.New(4.2, quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	byHand := 57 * 4.2 * math.Sqrt(4.2)
	if math.Abs(byHand-490.62) > 0.01 || math.Abs(v.Discharge.Value()/byHand-1) > 1e-12 || v.Extrapolated {
		t.Errorf("Q_p(4.2 m) = %v, by hand %v", v.Discharge, byHand)
	}
	lo, hi := r.ProtoHeadRange()
	if math.Abs(lo-2.4) > 1e-12 || math.Abs(hi-5.55) > 1e-12 {
		t.Errorf("prototype range %v … %v, by hand 0.08·30 = 2.4 … 0.185·30 = 5.55", lo, hi)
	}
}

// TestRatingBandByHand: the band of a straight-line fit at x₀ = ln h is
// ŷ ± t·S·√(1/N + (x₀ − x̄)²/Sxx) (Draper and Smith, Applied Regression
// Analysis, 3rd ed. (1998), §3.1, from memory), exponentiated, with
// t(0.975, 6) = 2.446912 (Student t tables give 2.447;
// python3-scipy 1.10.1, scipy.stats.t.ppf(0.975, 6) = 2.4469118487916806).
func TestRatingBandByHand(t *testing.T) {
	q := powerData(1.9, 1.5, 0.015, testHeads)
	r, err := hydraulic.FitRating(ratingInput(testHeads, q, 0.8, 1.0/30))
	if err != nil {
		t.Fatal(err)
	}
	// The straight line by hand.
	n := float64(len(testHeads))
	var sx, sy float64
	for i := range testHeads {
		sx += math.Log(testHeads[i])
		sy += math.Log(q[i])
	}
	mx, my := sx/n, sy/n
	var sxx, sxy float64
	for i := range testHeads {
		dx := math.Log(testHeads[i]) - mx
		sxx += dx * dx
		sxy += dx * (math.Log(q[i]) - my)
	}
	slope := sxy / sxx
	icpt := my - slope*mx
	var sse float64
	for i := range testHeads {
		e := math.Log(q[i]) - icpt - slope*math.Log(testHeads[i])
		sse += e * e
	}
	s := math.Sqrt(sse / (n - 2))
	if math.Abs(r.N-slope) > 1e-12 || math.Abs(math.Log(r.C)-icpt) > 1e-11 || math.Abs(r.S-s) > 1e-12 {
		t.Errorf("n = %v, ln C = %v, S = %v; by hand %v, %v, %v", r.N, math.Log(r.C), r.S, slope, icpt, s)
	}
	const tq = 2.446912
	hp := 3.3 // m, prototype; model 0.11 m
	x0 := math.Log(hp / 30)
	se := s * math.Sqrt(1/n+(x0-mx)*(x0-mx)/sxx)
	qp := math.Exp(icpt+slope*x0) * math.Pow(30, 2.5)
	v, err := r.Prototype(quantity.New(hp, quantity.Length))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(v.Discharge.Value()/qp-1) > 1e-11 || math.Abs(v.RelU-se) > 1e-12 {
		t.Errorf("Q_p = %v, u_rel = %v; by hand %v, %v", v.Discharge, v.RelU, qp, se)
	}
	if math.Abs(v.Band[0].Value()/(qp*math.Exp(-tq*se))-1) > 1e-6 || math.Abs(v.Band[1].Value()/(qp*math.Exp(tq*se))-1) > 1e-6 {
		t.Errorf("band %v, by hand %v … %v", v.Band, qp*math.Exp(-tq*se), qp*math.Exp(tq*se))
	}
	if !(v.New[0].Value() < v.Band[0].Value() && v.Band[1].Value() < v.New[1].Value()) {
		t.Errorf("prediction interval %v inside the band %v", v.New, v.Band)
	}
}

// TestRatingFrancis checks the weir coefficient's convention against a
// published formula: Francis's Q = 3.33·b·h^(3/2) (ft³/s, b and h in ft)
// for a suppressed sharp-crested weir (J. B. Francis, Lowell Hydraulic
// Experiments, 1855, as the hydraulics handbooks quote it; from memory).
// With g = g_n = 32.174 ft/s², C_d = 3.33/((2/3)·√(2·32.174)) = 0.622684,
// the coefficient 1.84 of the formula's SI form Q = 1.84·b·h^(3/2)
// (from memory, rounded to 3 digits) over (2/3)·√(2·9.80665) = 2.95291.
func TestRatingFrancis(t *testing.T) {
	const ft = 0.3048
	b := 0.6 // m
	q := make([]float64, len(testHeads))
	for i, h := range testHeads {
		q[i] = 3.33 * (b / ft) * math.Pow(h/ft, 1.5) * ft * ft * ft
	}
	r, err := hydraulic.FitRating(ratingInput(testHeads, q, b, 1.0/20))
	if err != nil {
		t.Fatal(err)
	}
	cd := 3.33 / (2.0 / 3 * math.Sqrt(2*9.80665/ft))
	if math.Abs(cd-0.622684) > 5e-7 || math.Abs(r.WeirCoefficient/cd-1) > 1e-9 || math.Abs(r.N-1.5) > 1e-9 {
		t.Errorf("C_d = %v, n = %v; Francis %v", r.WeirCoefficient, r.N, cd)
	}
	if si := cd * 2.0 / 3 * math.Sqrt(2*9.80665); math.Abs(si-1.84) > 0.005 {
		t.Errorf("SI Francis coefficient %v, published 1.84", si)
	}
	for _, p := range r.Points {
		if math.Abs(p.WeirCoefficient/cd-1) > 1e-12 {
			t.Errorf("point C_d %v", p.WeirCoefficient)
		}
	}
}

// TestRatingRehbock: each point's C_d is Q/((2/3)·√(2g)·b·h^(3/2)), so
// data from Rehbock's C_d = 0.611 + 0.08·h/P for a sharp-crested
// rectangular weir of height P (Rehbock 1929, as the open-channel texts
// quote it; from memory) give back 0.611 + 0.08·h/P at every point; a
// C_d that grows with h makes the fitted exponent larger than 3/2, and
// the rating notes that its interval excludes 3/2.
func TestRatingRehbock(t *testing.T) {
	const b, p = 0.5, 0.4
	q := make([]float64, len(testHeads))
	for i, h := range testHeads {
		q[i] = (0.611 + 0.08*h/p) * 2 / 3 * math.Sqrt(2*9.80665) * b * math.Pow(h, 1.5)
	}
	r, err := hydraulic.FitRating(ratingInput(testHeads, q, b, 1.0/10))
	if err != nil {
		t.Fatal(err)
	}
	for i, pt := range r.Points {
		if want := 0.611 + 0.08*testHeads[i]/p; math.Abs(pt.WeirCoefficient-want) > 1e-12 {
			t.Errorf("point %d: C_d %v, Rehbock %v", i, pt.WeirCoefficient, want)
		}
	}
	// The note quotes the interval as the fit line does, to four decimals;
	// T is the t quantile the interval was formed with.
	if want := fmt.Sprintf("[%.4f, %.4f] excludes 3/2", r.NInterval[0], r.NInterval[1]); !strings.Contains(strings.Join(r.Notes, "\n"), want) {
		t.Errorf("notes %q lack %q", r.Notes, want)
	}
	if tq := (r.NInterval[1] - r.N) / r.NStdErr; math.Abs(r.T/tq-1) > 1e-12 || !(r.T > 1.96) {
		t.Errorf("T = %v, interval's t = %v", r.T, tq)
	}
	if !(r.N > 1.5) || !(r.NInterval[0] > 1.5) || !strings.Contains(strings.Join(r.Notes, "\n"), "excludes 3/2") {
		t.Errorf("n = %v %v, notes %q", r.N, r.NInterval, r.Notes)
	}
}

// TestRatingExcludes: heads of 3 and 5 cm fail the 7 cm of WeirLimits and
// are excluded by the stated rule, listed with the failed check, out of
// the fit and of the range; at 3 cm the Weber number fails too:
// with its discharge 10 % low (a scale effect), q = 0.9·1.9·0.03^1.5/0.8
// = 0.011107 m²/s, V = (g·q)^(1/3) = 0.477569 m/s and
// We = 999.1·0.477569²·0.03/0.0735 = 93.007 < 100.
func TestRatingExcludes(t *testing.T) {
	h := append([]float64{0.03, 0.05}, testHeads...)
	q := powerData(1.9, 1.5, 0, h)
	q[0] *= 0.9 // a scale effect at the lowest head: it would bend the fit
	r, err := hydraulic.FitRating(ratingInput(h, q, 0.8, 1.0/30))
	if err != nil {
		t.Fatal(err)
	}
	if r.Used != len(testHeads) || !r.Points[0].Excluded || !r.Points[1].Excluded || r.Points[2].Excluded {
		t.Fatalf("used %d, points %+v", r.Used, r.Points[:3])
	}
	if math.Abs(r.N-1.5) > 1e-10 || r.HeadMin != 0.08 {
		t.Errorf("the excluded points reached the fit: n = %v, range from %v", r.N, r.HeadMin)
	}
	v := math.Cbrt(9.80665 * 0.9 * 1.9 * math.Pow(0.03, 1.5) / 0.8)
	we := 999.1 * v * v * 0.03 / 0.0735
	p0 := r.Points[0]
	if math.Abs(v-0.477569) > 1e-6 || math.Abs(we-93.007) > 0.001 || math.Abs(p0.Velocity/v-1) > 1e-12 || math.Abs(p0.Checks[1].Value/we-1) > 1e-12 {
		t.Errorf("point 0: V %v We %v; by hand %v %v", p0.Velocity, p0.Checks[1].Value, v, we)
	}
	if got := strings.Join(p0.Failed, ", "); got != "We = ρV²h/σ, head h" || strings.Join(r.Points[1].Failed, ", ") != "head h" {
		t.Errorf("failed checks %q, %q", got, r.Points[1].Failed)
	}
	// Too few points left: refused, naming the rule.
	_, err = hydraulic.FitRating(ratingInput(h[:4], q[:4], 0.8, 1.0/30))
	if !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), "2 of 4 points pass") {
		t.Errorf("two usable points: %v", err)
	}
}

// TestRatingExtrapolation: a prototype head outside the range of
// validity is refused (ErrRange) by Prototype and marked by Extrapolate.
func TestRatingExtrapolation(t *testing.T) {
	r, err := hydraulic.FitRating(ratingInput(testHeads, powerData(1.9, 1.5, 0.01, testHeads), 0.8, 1.0/30))
	if err != nil {
		t.Fatal(err)
	}
	for _, h := range []float64{1.0, 6.0} {
		_, err := r.Prototype(quantity.New(h, quantity.Length))
		var e *hydraulic.Error
		if !errors.Is(err, quantity.ErrRange) || errors.Is(err, quantity.ErrInvalid) || !errors.As(err, &e) || !strings.Contains(err.Error(), "range of validity") {
			t.Errorf("h_p = %v: %v", h, err)
		}
		v, err := r.Extrapolate(quantity.New(h, quantity.Length))
		if err != nil || !v.Extrapolated {
			t.Errorf("Extrapolate(%v): %+v, %v", h, v, err)
		}
	}
	v, err := r.Extrapolate(quantity.New(4, quantity.Length))
	if err != nil || v.Extrapolated {
		t.Errorf("Extrapolate(4 m) in range: %+v, %v", v, err)
	}
	if _, err := r.Model(quantity.New(0.1, quantity.Length)); err != nil {
		t.Errorf("Model(0.1 m): %v", err)
	}
}

// TestRatingOutlier: one discharge 12 % high among ±0.5 % scatter is
// flagged as an outlier, kept in the fit, and noted.
func TestRatingOutlier(t *testing.T) {
	h := []float64{0.08, 0.09, 0.1, 0.11, 0.12, 0.13, 0.14, 0.15, 0.16, 0.17}
	q := powerData(1.9, 1.5, 0.005, h)
	q[4] *= 1.12
	r, err := hydraulic.FitRating(ratingInput(h, q, 0.8, 1.0/30))
	if err != nil {
		t.Fatal(err)
	}
	if !r.Points[4].Outlier || r.Used != len(h) || !strings.Contains(strings.Join(r.Notes, " "), "point(s) 4 flagged as outliers") {
		t.Errorf("point 4 %+v, used %d, notes %q", r.Points[4], r.Used, r.Notes)
	}
	for i, p := range r.Points {
		if i != 4 && p.Outlier {
			t.Errorf("point %d flagged", i)
		}
	}
}

// TestRatingErrors: every refusal is a *hydraulic.Error of exactly one
// class, naming what was wrong.
func TestRatingErrors(t *testing.T) {
	good := func() hydraulic.RatingInput {
		return ratingInput(testHeads, powerData(1.9, 1.5, 0.01, testHeads), 0.8, 1.0/30)
	}
	classes := []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}
	for _, c := range []struct {
		name  string
		edit  func(*hydraulic.RatingInput)
		class error
		text  string
	}{
		{"head dimension", func(in *hydraulic.RatingInput) { in.Head = quantity.NewSeries(testHeads, quantity.Time) }, quantity.ErrDimension, "head"},
		{"discharge dimension", func(in *hydraulic.RatingInput) { in.Discharge = quantity.NewSeries(testHeads, quantity.Length) }, quantity.ErrDimension, "discharge"},
		{"lengths", func(in *hydraulic.RatingInput) {
			in.Discharge = quantity.NewSeries(in.Discharge.Values()[:3], quantity.VolumeFlowRate)
		}, quantity.ErrInvalid, "8 heads and 3 discharges"},
		{"NaN head", func(in *hydraulic.RatingInput) {
			h := append([]float64(nil), testHeads...)
			h[2] = math.NaN()
			in.Head = quantity.NewSeries(h, quantity.Length)
		}, quantity.ErrInvalid, "point 2: head NaN"},
		{"negative discharge", func(in *hydraulic.RatingInput) {
			q := append([]float64(nil), in.Discharge.Values()...)
			q[5] = -1
			in.Discharge = quantity.NewSeries(q, quantity.VolumeFlowRate)
		}, quantity.ErrInvalid, "point 5: discharge -1"},
		{"crest", func(in *hydraulic.RatingInput) { in.CrestLength = quantity.New(0, quantity.Length) }, quantity.ErrInvalid, "crest length"},
		{"crest dimension", func(in *hydraulic.RatingInput) { in.CrestLength = quantity.New(1, quantity.Area) }, quantity.ErrDimension, "crest length"},
		{"ratio", func(in *hydraulic.RatingInput) { in.LengthRatio = math.Inf(1) }, quantity.ErrRange, "length ratio"},
		{"tiny ratio", func(in *hydraulic.RatingInput) { in.LengthRatio = 1e-300 }, quantity.ErrRange, "ratio"},
		{"level", func(in *hydraulic.RatingInput) { in.Level = 1 }, quantity.ErrInvalid, "confidence level"},
		{"viscosity", func(in *hydraulic.RatingInput) { in.KinematicViscosity = quantity.Quantity{} }, quantity.ErrDimension, "kinematic viscosity"},
		{"sigma", func(in *hydraulic.RatingInput) { in.SurfaceTension = quantity.New(-1, quantity.SurfaceTension) }, quantity.ErrInvalid, "surface tension"},
	} {
		in := good()
		c.edit(&in)
		r, err := hydraulic.FitRating(in)
		var e *hydraulic.Error
		if err == nil || r != nil || !errors.As(err, &e) || !errors.Is(err, c.class) || !strings.Contains(err.Error(), c.text) {
			t.Errorf("%s: %v (%T), want class %v naming %q", c.name, err, err, c.class, c.text)
			continue
		}
		n := 0
		for _, cl := range classes {
			if errors.Is(err, cl) {
				n++
			}
		}
		if n != 1 {
			t.Errorf("%s: %v matches %d classes", c.name, err, n)
		}
	}
	r, err := hydraulic.FitRating(good())
	if err != nil {
		t.Fatal(err)
	}
	for _, h := range []quantity.Quantity{quantity.New(3, quantity.Time), quantity.New(-3, quantity.Length), quantity.New(math.NaN(), quantity.Length)} {
		_, err := r.Prototype(h)
		var e *hydraulic.Error
		if !errors.As(err, &e) {
			t.Errorf("Prototype(%v): %v (%T)", h, err, err)
		}
	}
}

// TestRatingRangeEnds: the ends of the prototype range, h_min/λ_L and
// h_max/λ_L, are inside it, whatever the rounding of h·λ_L.
func TestRatingRangeEnds(t *testing.T) {
	for k := 2; k <= 60; k++ {
		lambda := 1 / float64(k)
		r, err := hydraulic.FitRating(ratingInput(testHeads, powerData(1.9, 1.5, 0.01, testHeads), 0.8, lambda))
		if err != nil {
			t.Fatal(err)
		}
		lo, hi := r.ProtoHeadRange()
		for _, h := range []float64{lo, hi} {
			if v, err := r.Prototype(quantity.New(h, quantity.Length)); err != nil || v.Extrapolated {
				t.Errorf("λ = %v: h_p = %v: %v", lambda, h, err)
			}
		}
	}
}
