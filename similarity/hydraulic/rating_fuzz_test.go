package hydraulic_test

import (
	"errors"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/hydraulic"
)

// FuzzRating fits ratings to fuzzed heads, discharges, crest lengths,
// ratios and levels, extreme finite values among them, and asks for the
// prototype rating at a fuzzed head: nothing panics, every refusal is a
// *hydraulic.Error of exactly one class, and a nil error means every
// number returned is finite.
func FuzzRating(f *testing.F) {
	f.Add(0.08, 0.015, 1.9, 1.5, 0.01, 0.8, 1.0/30, 0.95, 3.3)
	f.Add(1e-300, 1e300, 1e300, 300.0, 0.5, 1e-300, 1e-300, 0.5, 1e300)
	f.Add(math.MaxFloat64, 5e-324, 5e-324, -300.0, 0.0, math.MaxFloat64, math.MaxFloat64, 1e-300, 5e-324)
	f.Add(0.5, 0.0, 2.0, 1.5, 0.0, 1.0, 1.0, 0.0, 0.5)
	classes := []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}
	f.Fuzz(func(t *testing.T, h0, dh, c, n, amp, b, lambda, level, hp float64) {
		const rows = 6
		h, q := make([]float64, rows), make([]float64, rows)
		for i := range rows {
			h[i] = h0 + float64(i)*dh
			q[i] = c * math.Pow(h[i], n) * (1 + amp*math.Sin(1.7*float64(i)))
		}
		in := ratingInput(h, q, b, lambda)
		in.Level = level
		one := func(err error) {
			t.Helper()
			var e *hydraulic.Error
			if !errors.As(err, &e) {
				t.Fatalf("%v (%T): not a *hydraulic.Error", err, err)
			}
			k := 0
			for _, cl := range classes {
				if errors.Is(err, cl) {
					k++
				}
			}
			if k != 1 {
				t.Fatalf("%v matches %d classes", err, k)
			}
		}
		finite := func(what string, xs ...float64) {
			t.Helper()
			for i, x := range xs {
				if math.IsNaN(x) || math.IsInf(x, 0) {
					t.Fatalf("%s: value %d is %v with a nil error (h %v, q %v, b %v, λ %v)", what, i, x, h, q, b, lambda)
				}
			}
		}
		r, err := hydraulic.FitRating(in)
		if err != nil {
			one(err)
			return
		}
		finite("FitRating", r.C, r.N, r.CInterval[0], r.CInterval[1], r.NInterval[0], r.NInterval[1], r.NStdErr, r.LnCStdErr,
			r.WeirCoefficient, r.WeirCoefficientInterval[0], r.WeirCoefficientInterval[1], r.S, r.HeadMin, r.HeadMax,
			r.LengthRatio, r.DischargeRatio, r.ProtoC)
		for _, p := range r.Points {
			finite("point", p.Head, p.Discharge, p.WeirCoefficient, p.Velocity, p.Residual, p.Studentized)
		}
		lo, hi := r.ProtoHeadRange()
		finite("ProtoHeadRange", lo, hi)
		_ = r.String()
		for _, get := range []func(quantity.Quantity) (hydraulic.RatingValue, error){r.Prototype, r.Extrapolate, r.Model} {
			for _, x := range []float64{hp, lo, hi} {
				v, err := get(quantity.New(x, quantity.Length))
				if err != nil {
					one(err)
					continue
				}
				finite("rating value", v.Head.Value(), v.Discharge.Value(), v.Band[0].Value(), v.Band[1].Value(), v.New[0].Value(), v.New[1].Value(), v.RelU)
			}
		}
	})
}
