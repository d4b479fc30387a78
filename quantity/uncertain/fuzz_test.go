package uncertain_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// fuzzInputs builds two measured inputs from fuzzed figures: each with a
// source of standard uncertainty u (relative when rel is set), Type A
// with ν when typeA is set, else Type B with the distribution dist, and
// a correlation r between the two sources. Refused figures give ok =
// false with an error that must match one class.
func fuzzInputs(t *testing.T, x1, x2, u1, u2, nu1, nu2, r float64, dist1, dist2 uint8, flags uint8) (in []uncertain.Measured, ok bool) {
	set := uncertain.NewSet()
	mk := func(name string, x, u, nu float64, dist uint8, typeA, rel bool) (uncertain.Measured, bool) {
		src := uncertain.Source{Name: name, U: quantity.Scalar(u), Relative: rel, DoF: nu, Dist: uncertain.Distribution(dist % 5)}
		if typeA {
			src.Type = uncertain.TypeA
		}
		id, err := set.Add(src)
		if err != nil {
			oneClass(t, "Add", err)
			return uncertain.Measured{}, false
		}
		m, err := set.Measure(quantity.Scalar(x), id)
		if err != nil {
			oneClass(t, "Measure", err)
			return uncertain.Measured{}, false
		}
		return m, true
	}
	a, ok1 := mk("a", x1, u1, nu1, dist1, flags&1 != 0, flags&2 != 0)
	b, ok2 := mk("b", x2, u2, nu2, dist2, flags&4 != 0, flags&8 != 0)
	if !ok1 || !ok2 {
		return nil, false
	}
	if flags&16 != 0 {
		if err := set.Correlate(0, 1, r); err != nil {
			oneClass(t, "Correlate", err)
			return nil, false
		}
	}
	return []uncertain.Measured{a, b}, true
}

func oneClass(t *testing.T, what string, err error) {
	t.Helper()
	if n := classes(err); n != 1 {
		t.Fatalf("%s: %v matches %d classes", what, err, n)
	}
}

// fuzzModel is one of a few models of two dimensionless inputs.
func fuzzModel(op uint8) func(x []uncertain.Measured) uncertain.Measured {
	return func(x []uncertain.Measured) uncertain.Measured {
		a, b := x[0], x[1]
		switch op % 8 {
		case 0:
			return a.Add(b)
		case 1:
			return a.Sub(b)
		case 2:
			return a.Mul(b)
		case 3:
			return a.Div(b)
		case 4:
			return a.Sqrt().Add(b)
		case 5:
			return uncertain.Log(a).Mul(b)
		case 6:
			return a.Powf(0.7).Sub(b.Pow(3, 1))
		default:
			return uncertain.Exp(a).Mul(b.Inv())
		}
	}
}

func allFinite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// FuzzBudget: any sources, model and coverage give a budget or an error
// of one class, never a panic, and a budget with a nil error has finite
// figures (ν_eff may be +Inf, as documented) and text without NaN.
func FuzzBudget(f *testing.F) {
	f.Add(1.0, 2.0, 0.01, 0.02, 0.0, 0.0, 0.5, uint8(0), uint8(1), uint8(0), uint8(2), 0.95)
	f.Add(0.0, 1e-300, 0.0, 1e300, 1e-300, 3.0, -1.0, uint8(2), uint8(3), uint8(21), uint8(5), 0.99)
	f.Add(1e308, -1e308, 1e308, 1e-320, 2.0, 2.01, 1.0, uint8(4), uint8(0), uint8(31), uint8(7), 0.5)
	f.Fuzz(func(t *testing.T, x1, x2, u1, u2, nu1, nu2, r float64, d1, d2, flags, op uint8, p float64) {
		in, ok := fuzzInputs(t, x1, x2, u1, u2, nu1, nu2, r, d1, d2, flags)
		if !ok {
			return
		}
		y, err := uncertain.Eval(func() uncertain.Measured { return fuzzModel(op)(in) })
		if err != nil {
			oneClass(t, "Eval", err)
			return
		}
		if !allFinite(y.Value(), y.U().Value()) {
			t.Fatalf("Eval gave %v with a nil error", y)
		}
		b, err := y.Budget("y", p)
		if err != nil {
			oneClass(t, "Budget", err)
			return
		}
		fig := []float64{b.Value.Value(), b.U.Value(), b.Systematic.Value(), b.Random.Value(), b.K, b.Expanded.Value(), b.Coverage}
		for _, l := range b.Lines {
			fig = append(fig, l.Sensitivity.Value(), l.Contribution.Value(), l.Percent)
		}
		if !allFinite(fig...) || !(b.DoF > 0) {
			t.Fatalf("budget with a nil error has figures %v, ν_eff %v", fig, b.DoF)
		}
		for _, s := range []string{b.String(), b.Markdown(), y.String()} {
			if strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
				t.Fatalf("text with a non-finite number:\n%s", s)
			}
		}
		k, err := uncertain.CoverageFactor(p, b.DoF)
		if err != nil || k != b.K {
			t.Fatalf("CoverageFactor(%v, %v) = %v, %v; budget's k %v", p, b.DoF, k, err, b.K)
		}
	})
}

// FuzzMonteCarlo: any sources, correlations, model and trial count give
// a result or an error of one class, never a panic; a nil error means
// finite figures with Low ≤ High. Work is bounded: a trial count above
// MaxTrials must be refused, and one that is run is at most 1999.
func FuzzMonteCarlo(f *testing.F) {
	f.Add(1.0, 2.0, 0.01, 0.02, 0.0, 0.0, 0.5, uint8(0), uint8(1), uint8(0), uint8(2), 0.95, uint64(1), int64(0))
	f.Add(0.5, 1.0, 1.0, 0.1, 2.0, 1e-300, 0.9, uint8(0), uint8(0), uint8(21), uint8(5), 0.99, uint64(7), int64(1e12))
	f.Add(1.0, 1.0, 0.1, 0.1, 1.0, 1.0, 1.0, uint8(0), uint8(0), uint8(16), uint8(3), 0.5, uint64(3), int64(-5))
	f.Fuzz(func(t *testing.T, x1, x2, u1, u2, nu1, nu2, r float64, d1, d2, flags, op uint8, p float64, seed uint64, trials int64) {
		in, ok := fuzzInputs(t, x1, x2, u1, u2, nu1, nu2, r, d1, d2, flags)
		if !ok {
			return
		}
		n := 1000 + int(uint64(trials)%1000)
		if trials > uncertain.MaxTrials {
			n = int(trials)
		}
		mc, err := uncertain.MonteCarlo(in, fuzzModel(op), n, p, seed)
		if n > uncertain.MaxTrials {
			if !errors.Is(err, quantity.ErrRange) {
				t.Fatalf("%d trials: %v", n, err)
			}
			return
		}
		if err != nil {
			oneClass(t, "MonteCarlo", err)
			return
		}
		if !allFinite(mc.Mean.Value(), mc.U.Value(), mc.Low.Value(), mc.High.Value()) || mc.Low.Value() > mc.High.Value() {
			t.Fatalf("result with a nil error: %+v", mc)
		}
		if s := mc.String(); strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
			t.Fatalf("text with a non-finite number: %s", s)
		}
	})
}
