package uncertain_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

func near(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if math.Abs(got-want) > tol {
		t.Errorf("%s = %.6g, want %.6g ± %.2g", what, got, want, tol)
	}
}

// TestGUMAnnexH2 is the simultaneous measurement of resistance and
// reactance, JCGM 100:2008 Annex H.2: five readings each of V, I and the
// phase angle φ, with their correlation coefficients, give R = (V/I)cos φ,
// X = (V/I)sin φ and Z = V/I. The inputs and results are Tables H.2, H.3
// and H.4 of the GUM (values from memory, rounded as printed there):
// R = 127.732 Ω, u = 0.071 Ω; X = 219.847 Ω, u = 0.295 Ω; Z = 254.260 Ω,
// u = 0.236 Ω.
func TestGUMAnnexH2(t *testing.T) {
	set := uncertain.NewSet()
	volt := quantity.New(1, quantity.Voltage)
	amp := quantity.New(1, quantity.Current)
	sv := set.MustAdd(uncertain.Source{Name: "V repeatability", U: volt.Scale(0.0032), Type: uncertain.TypeA, DoF: 4})
	si := set.MustAdd(uncertain.Source{Name: "I repeatability", U: amp.Scale(0.0095e-3), Type: uncertain.TypeA, DoF: 4})
	sp := set.MustAdd(uncertain.Source{Name: "φ repeatability", U: quantity.Scalar(0.00075), Type: uncertain.TypeA, DoF: 4})
	for _, c := range []struct {
		a, b uncertain.ID
		r    float64
	}{{sv, si, -0.36}, {sv, sp, 0.86}, {si, sp, -0.65}} {
		if err := set.Correlate(c.a, c.b, c.r); err != nil {
			t.Fatal(err)
		}
	}
	v := set.MustMeasure(volt.Scale(4.9990), sv)
	i := set.MustMeasure(amp.Scale(19.6610e-3), si)
	phi := set.MustMeasure(quantity.Scalar(1.04446), sp)
	z := v.Div(i)
	r := z.Mul(uncertain.Cos(phi))
	x := z.Mul(uncertain.Sin(phi))
	for _, c := range []struct {
		name    string
		m       uncertain.Measured
		y, u    float64
		yTol    float64
		uTolRel float64
	}{
		// u(R) comes from near-cancelling terms (r(V,φ) = 0.86), so it
		// moves with the rounding of the printed inputs: 0.0700 from them.
		{"R", r, 127.732, 0.071, 0.001, 0.02},
		{"X", x, 219.847, 0.295, 0.001, 0.01},
		{"Z", z, 254.260, 0.236, 0.001, 0.01},
	} {
		if c.m.Dim() != quantity.Resistance {
			t.Errorf("%s is %s", c.name, quantity.Describe(c.m.Dim()))
		}
		near(t, c.name, c.m.Value(), c.y, c.yTol)
		near(t, "u("+c.name+")", c.m.U().Value(), c.u, c.uTolRel*c.u)
	}
	b, err := z.Budget("Z", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	if !b.Correlated {
		t.Errorf("budget of Z does not say its sources are correlated")
	}
}

// TestProductOfPowers: for y = a²·b/√c with independent inputs the relative
// uncertainty is the root-sum-square of exponent-weighted relative
// uncertainties (GUM eq. 12), exactly here since the derivatives are exact
// at the estimate.
func TestProductOfPowers(t *testing.T) {
	set := uncertain.NewSet()
	ua := set.MustAdd(uncertain.Source{Name: "a", U: quantity.Scalar(0.01), Relative: true})
	ub := set.MustAdd(uncertain.Source{Name: "b", U: quantity.New(0.03, quantity.Length)})
	uc := set.MustAdd(uncertain.Source{Name: "c", U: quantity.Scalar(0.02), Relative: true})
	a := set.MustMeasure(quantity.New(2, quantity.Velocity), ua)
	b := set.MustMeasure(quantity.New(1.5, quantity.Length), ub)
	c := set.MustMeasure(quantity.New(4, quantity.Area), uc)
	y := a.Pow(2, 1).Mul(b).Div(c.Sqrt())
	want := math.Sqrt(math.Pow(2*0.01, 2) + math.Pow(0.03/1.5, 2) + math.Pow(0.5*0.02, 2))
	near(t, "u_rel(y)", y.Rel(), want, 1e-15)
	near(t, "y", y.Value(), 4*1.5/2, 1e-15)
	// Powf agrees with the exact power.
	near(t, "u_rel((a/(1 m/s))^2.0)", a.DivQ(quantity.New(1, quantity.Velocity)).Powf(2).Rel(), 0.02, 1e-15)
}

// TestSharedSource: two pressure transducers calibrated against the same
// standard carry its error alike, so it cancels in their difference and
// adds fully in their sum; explicit correlation of +1 and −1 between two
// distinct sources does the same (GUM §5.2.2, r = ±1).
func TestSharedSource(t *testing.T) {
	pa := quantity.New(1, quantity.Pressure)
	set := uncertain.NewSet()
	std := set.MustAdd(uncertain.Source{Name: "standard", U: pa.Scale(30), Effect: uncertain.Systematic})
	r1 := set.MustAdd(uncertain.Source{Name: "P1 repeatability", U: pa.Scale(4), Type: uncertain.TypeA, DoF: 19})
	r2 := set.MustAdd(uncertain.Source{Name: "P2 repeatability", U: pa.Scale(3), Type: uncertain.TypeA, DoF: 19})
	p1 := set.MustMeasure(pa.Scale(250e3), std, r1)
	p2 := set.MustMeasure(pa.Scale(180e3), std, r2)
	near(t, "u(P1)", p1.U().Value(), math.Hypot(30, 4), 1e-12)
	near(t, "u(P1−P2)", p1.Sub(p2).U().Value(), 5, 1e-12)
	near(t, "u(P1+P2)", p1.Add(p2).U().Value(), math.Sqrt(60*60+25), 1e-12)

	for _, c := range []struct {
		r       float64
		sum     float64
		comment string
	}{{1, 30 + 20, "r = +1: u adds"}, {-1, 10, "r = −1: u subtracts"}, {0, math.Hypot(30, 20), "r = 0: root-sum-square"}} {
		s := uncertain.NewSet()
		a := s.MustAdd(uncertain.Source{Name: "a", U: pa.Scale(30)})
		b := s.MustAdd(uncertain.Source{Name: "b", U: pa.Scale(20)})
		if err := s.Correlate(a, b, c.r); err != nil {
			t.Fatal(err)
		}
		x := s.MustMeasure(pa.Scale(1), a).Add(s.MustMeasure(pa.Scale(2), b))
		near(t, c.comment, x.U().Value(), c.sum, 1e-12)
	}
}

// TestBudget checks the budget's figures by hand: contributions, percent,
// Welch–Satterthwaite (GUM eq. G.2b), the coverage factor for ν = 9 at
// 95 % (t = 2.262, GUM Table G.2) and the systematic and random parts.
func TestBudget(t *testing.T) {
	pa := quantity.New(1, quantity.Pressure)
	set := uncertain.NewSet()
	cal := set.MustAdd(uncertain.Source{Name: "calibration", U: pa.Scale(10), Effect: uncertain.Systematic})
	rep := set.MustAdd(uncertain.Source{Name: "repeatability", U: pa.Scale(5), Type: uncertain.TypeA, DoF: 9})
	p := set.MustMeasure(pa.Scale(1e5), cal, rep)
	y := p.Mul(p) // ∂y/∂p = 2p = 2e5
	b, err := y.Budget("p²", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "u_c", b.U.Value(), math.Hypot(2e6, 1e6), 1e-6)
	near(t, "systematic", b.Systematic.Value(), 2e6, 1e-6)
	near(t, "random", b.Random.Value(), 1e6, 1e-6)
	near(t, "ν_eff", b.DoF, math.Pow(5e12, 2)/(1e24/9), 1e-9) // 225
	near(t, "k(ν=225)", b.K, 1.9706, 1e-3)
	if b.Lines[0].Source.Name != "calibration" || b.Lines[0].Percent != 80 || b.Lines[1].Percent != 20 {
		t.Errorf("lines %+v", b.Lines)
	}
	near(t, "c", b.Lines[0].Sensitivity.Value(), 2e5, 1e-9)
	if b.Lines[0].Sensitivity.Dim() != quantity.Pressure {
		t.Errorf("c has dimension %v, want pressure (Pa² per Pa)", b.Lines[0].Sensitivity.Dim())
	}
	near(t, "t(0.975, 9)", coverage(t, 0.95, 9), 2.262, 1e-3)
	near(t, "t(0.975, ∞)", coverage(t, 0.95, math.Inf(1)), 1.960, 1e-3)
	near(t, "t(0.995, 4)", coverage(t, 0.99, 4), 4.604, 1e-3) // GUM Table G.2
	for _, s := range []string{"calibration", "A (ν = 9)", "systematic", "80.0", "ν_eff > 100"} {
		if !strings.Contains(b.String(), s) || !strings.Contains(b.Markdown(), s) {
			t.Errorf("budget text lacks %q:\n%s\n%s", s, b.String(), b.Markdown())
		}
	}
	if _, err := y.Budget("p²", 1); err == nil {
		t.Errorf("coverage 1 accepted")
	}
}

// TestMonteCarloLinear: JCGM 101:2008 §9.2, the additive model
// Y = X₁+X₂+X₃+X₄ with unit standard uncertainties. With normal inputs the
// first-order interval ±1.96·2 = ±3.92 is exact; with rectangular inputs
// JCGM 101 reports a Monte Carlo interval of about ±3.88 (§9.2.3, from
// memory) and the first-order result validated to one significant digit.
func TestMonteCarloLinear(t *testing.T) {
	for _, c := range []struct {
		dist uncertain.Distribution
		half float64
	}{{uncertain.Normal, 3.92}, {uncertain.Rectangular, 3.88}} {
		set := uncertain.NewSet()
		var in []uncertain.Measured
		for k := range 4 {
			id := set.MustAdd(uncertain.Source{Name: string(rune('a' + k)), U: quantity.Scalar(1), Dist: c.dist})
			in = append(in, set.MustMeasure(quantity.Scalar(0), id))
		}
		model := func(x []uncertain.Measured) uncertain.Measured { return x[0].Add(x[1]).Add(x[2]).Add(x[3]) }
		y := model(in)
		b, _ := y.Budget("Y", 0.95)
		mc, err := uncertain.MonteCarlo(in, model, 200_000, 0.95, 1)
		if err != nil {
			t.Fatal(err)
		}
		near(t, c.dist.String()+" first order U", b.Expanded.Value(), 3.92, 0.005)
		near(t, c.dist.String()+" MC u", mc.U.Value(), 2, 0.02)
		near(t, c.dist.String()+" MC high", mc.High.Value(), c.half, 0.03)
		near(t, c.dist.String()+" MC low", mc.Low.Value(), -c.half, 0.03)
		if v := b.Validate(mc, 1); !v.Validated {
			t.Errorf("%v: %v", c.dist, v)
		}
	}
}

// TestMonteCarloNonlinear: y = x² with x = 0.1 ± 1 (normal) is far from
// linear over the uncertainty: first order gives u = 2·0.1·1 = 0.2, while
// y's true standard deviation is √(2u⁴ + 4x²u²) = 1.428 (moments of a
// normal variable). Monte Carlo finds it and the validation fails.
func TestMonteCarloNonlinear(t *testing.T) {
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "x", U: quantity.Scalar(1)})
	in := []uncertain.Measured{set.MustMeasure(quantity.Scalar(0.1), id)}
	model := func(x []uncertain.Measured) uncertain.Measured { return x[0].Mul(x[0]) }
	b, _ := model(in).Budget("y", 0.95)
	near(t, "first-order u", b.U.Value(), 0.2, 1e-12)
	mc, err := uncertain.MonteCarlo(in, model, 100_000, 0.95, 7)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "MC u", mc.U.Value(), math.Sqrt(2+4*0.01), 0.03)
	if v := b.Validate(mc, 2); v.Validated {
		t.Errorf("a strongly nonlinear model validated: %v", v)
	}
	// A mildly nonlinear model validates: y = x² with x = 10 ± 0.1.
	set2 := uncertain.NewSet()
	id2 := set2.MustAdd(uncertain.Source{Name: "x", U: quantity.Scalar(0.01)})
	in = []uncertain.Measured{set2.MustMeasure(quantity.Scalar(10), id2)}
	b, _ = model(in).Budget("y", 0.95)
	mc, _ = uncertain.MonteCarlo(in, model, 200_000, 0.95, 3)
	if v := b.Validate(mc, 1); !v.Validated {
		t.Errorf("a nearly linear model not validated: %v", v)
	}
}

// TestRefusals: dimensions, sets, sources and terms.
func TestRefusals(t *testing.T) {
	set := uncertain.NewSet()
	u := set.MustAdd(uncertain.Source{Name: "u", U: quantity.New(1, quantity.Length)})
	if _, err := set.Measure(quantity.New(1, quantity.Velocity), u); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("length uncertainty on a velocity: %v", err)
	}
	for _, src := range []uncertain.Source{
		{Name: "", U: quantity.Scalar(1)},
		{Name: "u", U: quantity.Scalar(1)},
		{Name: "neg", U: quantity.Scalar(-1)},
		{Name: "A", U: quantity.Scalar(1), Type: uncertain.TypeA},
		{Name: "rel", U: quantity.New(1, quantity.Length), Relative: true},
	} {
		if _, err := set.Add(src); err == nil {
			t.Errorf("source %+v accepted", src)
		}
	}
	a := set.MustMeasure(quantity.New(1, quantity.Length), u)
	other := uncertain.NewSet()
	w := other.MustAdd(uncertain.Source{Name: "w", U: quantity.New(1, quantity.Length)})
	b := other.MustMeasure(quantity.New(1, quantity.Length), w)
	if _, err := uncertain.Eval(func() uncertain.Measured { return a.Add(b) }); !errors.Is(err, uncertain.ErrSets) {
		t.Errorf("two sets: %v", err)
	}
	v := set.MustMeasure(quantity.New(1, quantity.Velocity))
	if _, err := uncertain.Eval(func() uncertain.Measured { return a.Add(v) }); !errors.Is(err, quantity.ErrDimension) {
		t.Errorf("length + velocity: %v", err)
	}
	many := uncertain.NewSet()
	sum := uncertain.Exact(quantity.Scalar(0))
	_, err := uncertain.Eval(func() uncertain.Measured {
		for k := range uncertain.MaxTerms + 1 {
			id := many.MustAdd(uncertain.Source{Name: string(rune('a' + k)), U: quantity.Scalar(1)})
			sum = sum.Add(many.MustMeasure(quantity.Scalar(1), id))
		}
		return sum
	})
	var te *uncertain.Error
	if !errors.As(err, &te) || te.Terms <= uncertain.MaxTerms || !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("%d sources: %v", uncertain.MaxTerms+1, err)
	}
}

// TestProperties: with no uncertainty the arithmetic is Quantity's bit
// for bit; a source's contribution scales linearly with its uncertainty.
func TestProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		x := rapid.Float64Range(0.1, 1e3).Draw(t, "x")
		y := rapid.Float64Range(0.1, 1e3).Draw(t, "y")
		qx, qy := quantity.New(x, quantity.Length), quantity.New(y, quantity.Time)
		mx, my := uncertain.Exact(qx), uncertain.Exact(qy)
		got := []quantity.Quantity{
			uncertain.Log(mx.Div(my).Mul(my).DivQ(qx)).Quantity(),
			mx.Pow(3, 2).Mul(my.Inv()).Scale(2).Sub(mx.Sqrt().Pow(3, 1).Div(my).Scale(2)).Quantity(),
			uncertain.Exp(mx.DivQ(qx)).Neg().Abs().Powf(1.7).Quantity(),
		}
		want := []quantity.Quantity{
			quantity.Log(qx.Div(qy).Mul(qy).Div(qx)),
			qx.Pow(3, 2).Mul(qy.Inv()).Scale(2).Sub(qx.Sqrt().Pow(3, 1).Div(qy).Scale(2)),
			quantity.Powf(quantity.Exp(qx.Div(qx)).Neg().Abs(), 1.7),
		}
		for i := range got {
			if got[i] != want[i] {
				t.Fatalf("expression %d: exact Measured %v, Quantity %v", i, got[i], want[i])
			}
		}
		k := rapid.Float64Range(0.01, 100).Draw(t, "k")
		c1 := contribution(x, y, 1)
		ck := contribution(x, y, k)
		if math.Abs(ck-k*c1) > 1e-12*ck {
			t.Fatalf("contribution at k·u = %v, k·(contribution at u) = %v", ck, k*c1)
		}
	})
}

// panics reports whether f panics with an error of this package's classes.
func panics(f func()) (p bool) {
	defer func() {
		if r := recover(); r != nil {
			if _, ok := r.(error); !ok {
				panic(r)
			}
			p = true
		}
	}()
	f()
	return false
}

func coverage(t *testing.T, p, nu float64) float64 {
	t.Helper()
	k, err := uncertain.CoverageFactor(p, nu)
	if err != nil {
		t.Fatalf("CoverageFactor(%v, %v): %v", p, nu, err)
	}
	return k
}

func contribution(x, y, u float64) float64 {
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "x", U: quantity.New(u, quantity.Length)})
	m := set.MustMeasure(quantity.New(x, quantity.Length), id)
	z := m.Mul(m).DivQ(quantity.New(y, quantity.Area))
	_, d := z.Term(0)
	return math.Abs(d)
}

// TestInPlace: the in-place forms give the value forms' results bit for
// bit, whatever the aliasing, and a reused destination compares equal to
// a fresh value (no stale terms).
func TestInPlace(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		set := uncertain.NewSet()
		var xs []uncertain.Measured
		for k := range 4 {
			var ids []uncertain.ID
			for j := range rapid.IntRange(0, 3).Draw(t, "sources") {
				ids = append(ids, set.MustAdd(uncertain.Source{Name: string(rune('a'+k)) + string(rune('0'+j)), U: quantity.Scalar(0.01), Relative: true}))
			}
			xs = append(xs, set.MustMeasure(quantity.Scalar(rapid.Float64Range(0.5, 2).Draw(t, "x")), ids...))
		}
		z := xs[0] // value form
		var w uncertain.Measured
		w = xs[0] // in-place form, reused throughout
		for range rapid.IntRange(1, 12).Draw(t, "ops") {
			o := rapid.IntRange(0, 7).Draw(t, "op")
			k := rapid.IntRange(0, 3).Draw(t, "operand")
			y := xs[k]
			zp, wp := panics(func() {
				switch o {
				case 0:
					z = z.Add(y)
				case 1:
					z = z.Sub(y)
				case 2:
					z = z.Mul(y)
				case 3:
					z = z.Div(y)
				case 4:
					z = y.Mul(z)
				case 5:
					z = z.Scale(1.5).Inv()
				case 6:
					if z.Value() > 0 {
						z = z.Powf(0.9)
					}
				case 7:
					z = y.Add(y)
				}
			}), panics(func() {
				switch o {
				case 0:
					w.SetAdd(&w, &y)
				case 1:
					w.SetSub(&w, &y)
				case 2:
					w.SetMul(&w, &y)
				case 3:
					w.SetDiv(&w, &y)
				case 4:
					w.SetMul(&y, &w)
				case 5:
					w.SetScale(&w, 1.5).SetInv(&w)
				case 6:
					if w.Value() > 0 {
						w.SetPowf(&w, 0.9)
					}
				case 7:
					var fresh uncertain.Measured
					fresh.SetAdd(&y, &y)
					w = fresh
				}
			})
			if zp != wp {
				t.Fatalf("op %d: value form panics: %v, in place: %v", o, zp, wp)
			}
			if zp {
				return // a division by zero, refused alike
			}
			if z != w {
				t.Fatalf("op %d: value form %v, in place %v", o, z, w)
			}
		}
	})
}

// TestDoFCorrelated: fully correlated sources of ν = 5 and ν = 10 enter
// Welch–Satterthwaite as one term with ν = 5; with an independent Type B
// term of equal size, ν_eff = (2v)²/(v²/5) = 20 (GUM eq. G.2b with the
// group as one input).
func TestDoFCorrelated(t *testing.T) {
	set := uncertain.NewSet()
	a := set.MustAdd(uncertain.Source{Name: "a", U: quantity.Scalar(0.5), Type: uncertain.TypeA, DoF: 5})
	b := set.MustAdd(uncertain.Source{Name: "b", U: quantity.Scalar(0.5), Type: uncertain.TypeA, DoF: 10})
	c := set.MustAdd(uncertain.Source{Name: "c", U: quantity.Scalar(1)})
	if err := set.Correlate(a, b, 1); err != nil {
		t.Fatal(err)
	}
	x := set.MustMeasure(quantity.Scalar(3), a, b, c) // the a–b group has u = 1
	bd, err := x.Budget("x", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "u_c", bd.U.Value(), math.Sqrt2, 1e-12)
	near(t, "ν_eff", bd.DoF, 20, 1e-9)
	if !bd.Correlated || !strings.Contains(bd.String(), "correlated group") {
		t.Errorf("budget does not say how ν_eff treats the correlated sources:\n%s", bd)
	}
}

// TestMonteCarloUndefined: a model that is not defined over the inputs'
// distributions (a logarithm of a value that can go negative) is an
// error, not NaN quantiles.
func TestMonteCarloUndefined(t *testing.T) {
	set := uncertain.NewSet()
	id := set.MustAdd(uncertain.Source{Name: "x", U: quantity.Scalar(1)})
	in := []uncertain.Measured{set.MustMeasure(quantity.Scalar(0.5), id)}
	model := func(x []uncertain.Measured) uncertain.Measured { return uncertain.Log(x[0]) }
	if _, err := uncertain.MonteCarlo(in, model, 1000, 0.95, 1); err == nil {
		t.Errorf("NaN trials accepted")
	}
}
