package uncertain_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// classes counts the module's error classes err matches.
func classes(err error) int {
	n := 0
	for _, c := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
		if errors.Is(err, c) {
			n++
		}
	}
	return n
}

// TestErrorClasses: every error the package returns matches exactly one
// class of the module, its concrete type, and keeps its cause; the
// package's prefix appears once.
func TestErrorClasses(t *testing.T) {
	set := uncertain.NewSet()
	u := set.MustAdd(uncertain.Source{Name: "u", U: quantity.New(1, quantity.Length)})
	r := set.MustAdd(uncertain.Source{Name: "rel", U: quantity.Scalar(0.01), Relative: true})
	r2 := set.MustAdd(uncertain.Source{Name: "rel2", U: quantity.Scalar(2), Relative: true})
	a := set.MustMeasure(quantity.New(1, quantity.Length), u)
	zero := set.MustMeasure(quantity.Scalar(0), r, set.MustAdd(uncertain.Source{Name: "z", U: quantity.Scalar(0.1)}))
	other := uncertain.NewSet()
	b := other.MustMeasure(quantity.New(1, quantity.Length), other.MustAdd(uncertain.Source{Name: "w", U: quantity.New(1, quantity.Length)}))
	tiny := uncertain.NewSet()
	tn := tiny.MustMeasure(quantity.Scalar(1), tiny.MustAdd(uncertain.Source{Name: "tiny ν", U: quantity.Scalar(1), Type: uncertain.TypeA, DoF: 1e-300}))
	model := func(x []uncertain.Measured) uncertain.Measured { return x[0] }
	in := []uncertain.Measured{a}
	err2 := func(_ any, err error) error { return err }
	eval := func(f func() uncertain.Measured) error { _, err := uncertain.Eval(f); return err }
	budget := func(m uncertain.Measured, p float64) error { _, err := m.Budget("y", p); return err }

	for _, c := range []struct {
		name  string
		err   error
		class error
		cause error // kept under errors.Is, if any
	}{
		{"Add: no name", err2(set.Add(uncertain.Source{U: quantity.Scalar(1)})), quantity.ErrInvalid, nil},
		{"Add: negative u", err2(set.Add(uncertain.Source{Name: "neg", U: quantity.Scalar(-1)})), quantity.ErrInvalid, nil},
		{"Add: Type A without ν", err2(set.Add(uncertain.Source{Name: "A", U: quantity.Scalar(1), Type: uncertain.TypeA})), quantity.ErrInvalid, nil},
		{"Add: same name", err2(set.Add(uncertain.Source{Name: "u", U: quantity.Scalar(1)})), quantity.ErrInvalid, nil},
		{"Measure: wrong dimension", err2(set.Measure(quantity.New(1, quantity.Velocity), u)), quantity.ErrInvalid, nil},
		{"Measure: unknown ID", err2(set.Measure(quantity.Scalar(1), 99)), quantity.ErrInvalid, nil},
		{"Measure: too many sources", err2(set.Measure(quantity.Scalar(1), make([]uncertain.ID, uncertain.MaxTerms+1)...)), quantity.ErrInvalid, nil},
		{"Measure: NaN", err2(set.Measure(quantity.Scalar(math.NaN()))), quantity.ErrInvalid, nil},
		{"Measure: relative overflow", err2(set.Measure(quantity.Scalar(math.MaxFloat64), r2)), quantity.ErrRange, nil},
		{"Correlate: r = 2", set.Correlate(u, r, 2), quantity.ErrInvalid, nil},
		{"Source: unknown ID", err2(set.Source(99)), quantity.ErrInvalid, nil},
		{"Eval: two sets", eval(func() uncertain.Measured { return a.Add(b) }), quantity.ErrInvalid, uncertain.ErrSets},
		{"Eval: dimensions", eval(func() uncertain.Measured { return a.Add(uncertain.Exact(quantity.Scalar(1))) }), quantity.ErrDimension, nil},
		{"Eval: 1/0", eval(func() uncertain.Measured { return zero.Inv() }), quantity.ErrRange, nil},
		{"Eval: overflow", eval(func() uncertain.Measured { return uncertain.Exact(quantity.Scalar(1e300)).Mul(zero.Scale(1e300)) }), quantity.ErrRange, nil},
		{"Budget: p = 1", budget(a, 1), quantity.ErrInvalid, nil},
		{"Budget: ν = 1e-300", budget(tn, 0.95), quantity.ErrRange, nil},
		{"CoverageFactor: p = 1.5", err2(uncertain.CoverageFactor(1.5, 3)), quantity.ErrInvalid, nil},
		{"CoverageFactor: ν = −1", err2(uncertain.CoverageFactor(0.95, -1)), quantity.ErrInvalid, nil},
		{"CoverageFactor: ν = 1e-300", err2(uncertain.CoverageFactor(0.95, 1e-300)), quantity.ErrRange, nil},
		{"MonteCarlo: 10 trials", err2(uncertain.MonteCarlo(in, model, 10, 0.95, 1)), quantity.ErrInvalid, nil},
		{"MonteCarlo: too many trials", err2(uncertain.MonteCarlo(in, model, uncertain.MaxTrials+1, 0.95, 1)), quantity.ErrRange, nil},
		{"MonteCarlo: p = 0", err2(uncertain.MonteCarlo(in, model, 1000, 0, 1)), quantity.ErrInvalid, nil},
		{"MonteCarlo: two sets", err2(uncertain.MonteCarlo([]uncertain.Measured{a, b}, model, 1000, 0.95, 1)), quantity.ErrInvalid, uncertain.ErrSets},
		{"MonteCarlo: model's dimensions", err2(uncertain.MonteCarlo(in, func(x []uncertain.Measured) uncertain.Measured {
			return x[0].Add(uncertain.Exact(quantity.Scalar(1)))
		}, 1000, 0.95, 1)), quantity.ErrDimension, nil},
	} {
		if c.err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if n := classes(c.err); n != 1 || !errors.Is(c.err, c.class) {
			t.Errorf("%s: %v matches %d classes, want %v alone", c.name, c.err, n, c.class)
		}
		if c.cause != nil && !errors.Is(c.err, c.cause) {
			t.Errorf("%s: %v does not keep its cause %v", c.name, c.err, c.cause)
		}
		var ue *uncertain.Error
		var de *quantity.Error
		if !errors.As(c.err, &ue) && !(errors.As(c.err, &de) && de.Class == quantity.ErrDimension) {
			t.Errorf("%s: %T is none of the package's error types", c.name, c.err)
		}
		if strings.Count(c.err.Error(), "uncertain:") > 1 {
			t.Errorf("%s: %q repeats the prefix", c.name, c.err)
		}
	}
}

// TestCoverageFactorNoPanic: CoverageFactor answers every input with a
// number or an error. ν = 0 is the package's infinite degrees of freedom:
// the normal quantile, scipy.stats.norm.ppf(0.975) = 1.959963984540054
// (SciPy 1.10.1).
func TestCoverageFactorNoPanic(t *testing.T) {
	for _, c := range []struct {
		p, nu float64
		k     float64 // 0: an error is wanted
	}{
		{0.95, 0, 1.959963984540054},
		{0.95, math.Inf(1), 1.959963984540054},
		{0.95, -1, 0},
		{1.5, 3, 0},
		{math.NaN(), 3, 0},
		{0.95, math.NaN(), 0},
		{0.95, math.Inf(-1), 0},
		{0.95, 1e-300, 0},
	} {
		k, err := uncertain.CoverageFactor(c.p, c.nu)
		switch {
		case c.k == 0 && (err == nil || classes(err) != 1):
			t.Errorf("CoverageFactor(%v, %v) = %v, %v; want an error of one class", c.p, c.nu, k, err)
		case c.k != 0 && (err != nil || math.Abs(k-c.k) > 1e-9):
			t.Errorf("CoverageFactor(%v, %v) = %v, %v; want %v", c.p, c.nu, k, err, c.k)
		}
	}
}

// TestSetSourceForeignID: an ID beyond the set is an error, not a panic.
func TestSetSourceForeignID(t *testing.T) {
	big := uncertain.NewSet()
	for _, n := range []string{"a", "b", "c"} {
		big.MustAdd(uncertain.Source{Name: n, U: quantity.Scalar(1)})
	}
	id := big.MustAdd(uncertain.Source{Name: "d", U: quantity.Scalar(1)})
	small := uncertain.NewSet()
	if _, err := small.Source(id); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("Source of another set's ID %d: %v", id, err)
	}
	if src, err := big.Source(id); err != nil || src.Name != "d" {
		t.Errorf("Source(%d) = %+v, %v", id, src, err)
	}
}

// TestNonFiniteRefused: at a measured zero, 1/x, log x, √x and x^0.5 have
// no finite value or derivative: each is an ErrRange error from Eval, not
// an infinite or NaN value with a nil error. Powers ≥ 1 are fine there
// (d(x²)/dx = 0 at 0). A zero standard uncertainty gives a finite
// (documented unknown) sensitivity, not NaN.
func TestNonFiniteRefused(t *testing.T) {
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "x", U: quantity.Scalar(0.1)})
	x := set.MustMeasure(quantity.Scalar(0), id)
	one := uncertain.Exact(quantity.Scalar(1))
	for name, f := range map[string]func() uncertain.Measured{
		"Inv":        x.Inv,
		"Log":        func() uncertain.Measured { return uncertain.Log(x) },
		"Log10":      func() uncertain.Measured { return uncertain.Log10(x) },
		"Sqrt":       x.Sqrt,
		"Powf(0.5)":  func() uncertain.Measured { return x.Powf(0.5) },
		"Pow(1, 2)":  func() uncertain.Measured { return x.Pow(1, 2) },
		"Pow(-1, 1)": func() uncertain.Measured { return x.Pow(-1, 1) },
		"1/x":        func() uncertain.Measured { return one.Div(x) },
		"x/0":        func() uncertain.Measured { return one.DivQ(quantity.Scalar(0)) },
		"SetInv":     func() uncertain.Measured { var z uncertain.Measured; return *z.SetInv(&x) },
		"SetPowf":    func() uncertain.Measured { var z uncertain.Measured; return *z.SetPowf(&x, 0.5) },
		"exp(1000)": func() uncertain.Measured {
			return uncertain.Exp(x.Scale(1e4).Add(uncertain.Exact(quantity.Scalar(1000))))
		},
	} {
		m, err := uncertain.Eval(f)
		var ue *uncertain.Error
		if !errors.Is(err, quantity.ErrRange) || !errors.As(err, &ue) {
			t.Errorf("%s of a measured 0: %v, %v; want an ErrRange *Error", name, m, err)
		}
	}
	for name, f := range map[string]func() uncertain.Measured{
		"Pow(2, 1)": func() uncertain.Measured { return x.Pow(2, 1) },
		"Powf(2)":   func() uncertain.Measured { return x.Powf(2) },
		"Pow(1, 1)": func() uncertain.Measured { return x.Pow(1, 1) },
	} {
		m, err := uncertain.Eval(f)
		if err != nil || math.IsNaN(m.U().Value()) {
			t.Errorf("%s at 0: %v, %v; want a finite value", name, m, err)
		}
	}
	// A source of zero uncertainty: its line has no NaN.
	z := set.MustAdd(uncertain.Source{Name: "exact by choice", U: quantity.New(0, quantity.Pressure)})
	p := set.MustMeasure(quantity.New(2e5, quantity.Pressure), z)
	b, err := p.Mul(p).Budget("p²", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	l := b.Lines[0]
	if !l.SensitivityUnknown || math.IsNaN(l.Sensitivity.Value()) || l.Contribution.Value() != 0 {
		t.Errorf("zero-u line %+v: want a finite, flagged sensitivity and no contribution", l)
	}
	if s := b.String(); strings.Contains(s, "NaN") || !strings.Contains(s, "–") {
		t.Errorf("budget with a zero-u source:\n%s", s)
	}
}
