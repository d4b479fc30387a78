package steady_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
	"similis.dev/similis/units/steady"
)

var classes = []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}

// oneClass fails unless err matches exactly the class want among the
// module's classes.
func oneClass(t testing.TB, err, want error) {
	t.Helper()
	if err == nil {
		t.Fatalf("no error, want one of class %v", want)
	}
	var got []error
	for _, c := range classes {
		if errors.Is(err, c) {
			got = append(got, c)
		}
	}
	if len(got) != 1 || got[0] != want {
		t.Errorf("%v: classes %v, want exactly %v", err, got, want)
	}
}

func force(v ...float64) quantity.Series { return quantity.NewSeries(v, quantity.Force) }

// TestSummarizeByHand checks every statistic of a four-sample series
// worked out in full.
func TestSummarizeByHand(t *testing.T) {
	// x = 11, 11, 9, 9 N.
	//   mean x̄ = 40/4 = 10 N; deviations e = +1, +1, −1, −1.
	//   s² = Σe²/(n−1) = 4/3, s = 1.154700538 N.
	//   Drift: rows i − ī = −1.5, −0.5, 0.5, 1.5; Σ(i−ī)e = −1.5 − 0.5 −
	//   0.5 − 1.5 = −4; Σ(i−ī)² = n(n²−1)/12 = 5; slope −0.8 N per
	//   sample; over n − 1 = 3 intervals, −2.4 N.
	//   c₀ = Σe² = 4; c₁ = (1·1) + (1·−1) + (−1·−1) = 1, ρ₁ = 0.25;
	//   c₂ = (1·−1) + (1·−1) = −2 ≤ 0: the sum stops, K = 1.
	//   n_eff = 4/(1 + 2·(1 − 1/4)·0.25) = 4/1.375 = 2.909090909.
	//   u(x̄) = s/√n_eff = 1.154700538/1.705605731 = 0.677003 N.
	st, err := steady.Summarize(force(11, 11, 9, 9), steady.Window{Start: 0, End: 4})
	if err != nil {
		t.Fatal(err)
	}
	want := steady.Stats{
		N:     4,
		Mean:  quantity.New(10, quantity.Force),
		SD:    quantity.New(1.154700538, quantity.Force),
		Drift: quantity.New(-2.4, quantity.Force),
		Lags:  1,
		NEff:  2.909090909,
		UMean: quantity.New(0.6770032, quantity.Force),
	}
	if d := cmp.Diff(want, st, cmp.Comparer(func(a, b quantity.Quantity) bool { return a.ApproxEqual(b, 1e-6) }), cmpopts.EquateApprox(1e-9, 0)); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
}

// ar1 returns n samples of a first-order autoregressive series of lag-1
// correlation phi and stationary standard deviation sigma, started in
// its stationary distribution.
func ar1(r *rand.Rand, n int, phi, sigma float64) []float64 {
	v := make([]float64, n)
	innov := sigma * math.Sqrt(1-phi*phi)
	e := sigma * r.NormFloat64()
	for i := range v {
		e = phi*e + innov*r.NormFloat64()
		v[i] = e
	}
	return v
}

// TestNEffAR1 checks n_eff against its closed form for a first-order
// autoregressive series: ρ_k = φ^k, so for large n
// 1 + 2Σφ^k = (1 + φ)/(1 − φ) and n_eff → n(1 − φ)/(1 + φ).
func TestNEffAR1(t *testing.T) {
	const n = 200000
	for _, tc := range []struct {
		phi, want float64 // want = (1 − φ)/(1 + φ), worked out
	}{
		{0, 1},
		{0.5, 0.5 / 1.5}, // 1/3
		{0.8, 0.2 / 1.8}, // 1/9
	} {
		r := rand.New(rand.NewPCG(uint64(tc.phi*100), 1))
		x := quantity.NewSeries(ar1(r, n, tc.phi, 1), quantity.Dimensionless)
		st, err := steady.Summarize(x, steady.Window{Start: 0, End: n})
		if err != nil {
			t.Fatal(err)
		}
		if got := st.NEff / n; math.Abs(got-tc.want) > 0.06*tc.want {
			t.Errorf("φ = %v: n_eff/n = %.4f, want %.4f within 6 %%", tc.phi, got, tc.want)
		}
	}
}

// TestUMeanHonest checks the uncertainty of the mean against the scatter
// it claims to describe: the means of 400 independent AR(1) records
// (φ = 0.8, 2000 samples each) scatter with a standard deviation of
// σ·√((1 + φ)/(n(1 − φ))) = √(9/2000) = 0.0671 for σ = 1 (less a small
// finite-n term), where s/√n would claim 0.0224.
func TestUMeanHonest(t *testing.T) {
	const (
		records = 400
		n       = 2000
		phi     = 0.8
	)
	r := rand.New(rand.NewPCG(3, 4))
	var sumM, sumM2, sumU float64
	for range records {
		x := quantity.NewSeries(ar1(r, n, phi, 1), quantity.Dimensionless)
		st, err := steady.Summarize(x, steady.Window{Start: 0, End: n})
		if err != nil {
			t.Fatal(err)
		}
		m := st.Mean.Value()
		sumM += m
		sumM2 += m * m
		sumU += st.UMean.Value()
	}
	scatter := math.Sqrt((sumM2 - sumM*sumM/records) / (records - 1))
	meanU := sumU / records
	if math.Abs(scatter-0.0671) > 0.1*0.0671 {
		t.Errorf("the means scatter by %.4f, want 0.0671 within 10 %% (the generator)", scatter)
	}
	// The claimed uncertainty matches the scatter within what 400
	// records can tell (about 4 % on a standard deviation) and the
	// estimator's small bias low.
	if meanU < 0.85*scatter || meanU > 1.1*scatter {
		t.Errorf("mean claimed u = %.4f against a scatter of %.4f", meanU, scatter)
	}
}

// TestWhiteNoiseNEff: for independent samples n_eff is close to n, and
// never above it: the truncated sum adds only the chance positive ρ_k,
// of order 1/√n each, before the first that falls below zero.
func TestWhiteNoiseNEff(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		seed := rapid.Uint64().Draw(t, "seed")
		n := rapid.IntRange(20000, 60000).Draw(t, "n")
		r := rand.New(rand.NewPCG(seed, 9))
		x := quantity.NewSeries(ar1(r, n, 0, 1), quantity.Dimensionless)
		st, err := steady.Summarize(x, steady.Window{Start: 0, End: n})
		if err != nil {
			t.Fatal(err)
		}
		if st.NEff > float64(n) || st.NEff < 0.8*float64(n) {
			t.Fatalf("n = %d: n_eff = %.1f", n, st.NEff)
		}
	})
}

// TestShiftInvariance: adding a constant to every sample moves the mean
// by it and leaves the spread, the drift and n_eff alone.
func TestShiftInvariance(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		seed := rapid.Uint64().Draw(t, "seed")
		n := rapid.IntRange(50, 3000).Draw(t, "n")
		phi := rapid.Float64Range(0, 0.9).Draw(t, "phi")
		c := rapid.Float64Range(-1e3, 1e3).Draw(t, "c")
		r := rand.New(rand.NewPCG(seed, 2))
		v := ar1(r, n, phi, 1)
		w := make([]float64, n)
		for i, a := range v {
			w[i] = a + c
		}
		win := steady.Window{Start: 0, End: n}
		a, errA := steady.Summarize(quantity.NewSeries(v, quantity.Pressure), win)
		b, errB := steady.Summarize(quantity.NewSeries(w, quantity.Pressure), win)
		if (errA == nil) != (errB == nil) {
			t.Fatalf("errors differ: %v, %v", errA, errB)
		}
		const tol = 1e-6
		near := func(what string, x, y float64) {
			if math.Abs(x-y) > tol*(1+math.Abs(x)) {
				t.Fatalf("%s: %v unshifted, %v shifted by %v", what, x, y, c)
			}
		}
		near("mean", a.Mean.Value()+c, b.Mean.Value())
		near("sd", a.SD.Value(), b.SD.Value())
		near("drift", a.Drift.Value(), b.Drift.Value())
		near("n_eff", a.NEff, b.NEff)
		near("u", a.UMean.Value(), b.UMean.Value())
	})
}

func TestSummarizeErrors(t *testing.T) {
	// An AR(1) series of φ = 0.9999 (an integral scale of about 10⁴
	// samples) in a window of 10⁵: its autocorrelation is still positive
	// at MaxLag.
	slow := ar1(rand.New(rand.NewPCG(5, 5)), 100000, 0.9999, 1)
	for _, tc := range []struct {
		name  string
		x     quantity.Series
		w     steady.Window
		class error
		row   int
	}{
		{"outside", force(1, 2, 3), steady.Window{Start: 1, End: 4}, quantity.ErrInvalid, -1},
		{"reversed", force(1, 2, 3), steady.Window{Start: 2, End: 1}, quantity.ErrInvalid, -1},
		{"short", force(1, 2, 3), steady.Window{Start: 1, End: 3}, quantity.ErrInvalid, 1},
		{"missing", force(1, 2, math.NaN(), 4, 5), steady.Window{Start: 1, End: 5}, quantity.ErrRange, 2},
		{"infinite", force(1, 2, 3, math.Inf(1)), steady.Window{Start: 0, End: 4}, quantity.ErrRange, 3},
		{"too correlated", quantity.NewSeries(slow, quantity.Force), steady.Window{Start: 0, End: 100000}, quantity.ErrRange, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := steady.Summarize(tc.x, tc.w)
			oneClass(t, err, tc.class)
			var e *steady.Error
			if !errors.As(err, &e) || e.Row != tc.row {
				t.Errorf("%v: want a *steady.Error at row %d", err, tc.row)
			}
		})
	}
}

// TestConstant: a constant channel has no scatter; its mean is exact
// as far as repeatability goes and n_eff is n.
func TestConstant(t *testing.T) {
	st, err := steady.Summarize(force(3, 3, 3, 3, 3), steady.Window{Start: 0, End: 5})
	if err != nil {
		t.Fatal(err)
	}
	if st.Mean.Value() != 3 || st.SD.Value() != 0 || st.UMean.Value() != 0 || st.NEff != 5 || st.Drift.Value() != 0 {
		t.Errorf("%+v", st)
	}
}

// TestTareProperty: subtracting a zero moves each mean by the zero's mean
// and adds the variances of the two Type A sources.
func TestTareProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		seed := rapid.Uint64().Draw(t, "seed")
		off := rapid.Float64Range(-10, 10).Draw(t, "offset")
		level := rapid.Float64Range(-100, 100).Draw(t, "level")
		r := rand.New(rand.NewPCG(seed, 11))
		v := ar1(r, 1200, 0.5, 0.1)
		for i := range v {
			if i >= 400 {
				v[i] += level
			}
			v[i] += off
		}
		chs := []steady.Channel{{Name: "F", Data: force(v...), DriftLimit: quantity.New(1, quantity.Force)}}
		set := uncertain.NewSet()
		zero, err := steady.Reduce(set, "zero", chs, steady.Window{Start: 0, End: 400})
		if err != nil {
			t.Fatal(err)
		}
		p, err := steady.Reduce(set, "point 1", chs, steady.Window{Start: 400, End: 1200})
		if err != nil {
			t.Fatal(err)
		}
		tared, err := steady.Tare(p, zero)
		if err != nil {
			t.Fatal(err)
		}
		z, pv, tv := zero.Values[0], p.Values[0], tared.Values[0]
		if !tv.Tared || pv.Tared {
			t.Fatalf("tared flags: point %v, result %v", pv.Tared, tv.Tared)
		}
		if got, want := tv.Mean.Value(), pv.Stats.Mean.Value()-z.Stats.Mean.Value(); math.Abs(got-want) > 1e-9*(1+math.Abs(want)) {
			t.Fatalf("tared mean %v, want %v", got, want)
		}
		if math.Abs(tv.Mean.Value()-level) > 0.1 {
			t.Fatalf("tared mean %v, want about the level %v", tv.Mean.Value(), level)
		}
		u2 := pv.Stats.UMean.Value()*pv.Stats.UMean.Value() + z.Stats.UMean.Value()*z.Stats.UMean.Value()
		if got := tv.Mean.U().Value(); math.Abs(got*got-u2) > 1e-12*(1+u2) {
			t.Fatalf("tared u² %v, want %v", got*got, u2)
		}
		if _, err := steady.Tare(tared, zero); err == nil {
			t.Fatal("a second tare accepted")
		}
	})
}

// FuzzSummarize: any samples give finite statistics with 2 ≤ n_eff ≤ n,
// or an error of exactly one class; Detect on them never panics.
func FuzzSummarize(f *testing.F) {
	f.Add([]byte{0, 0, 0, 0, 0, 0, 240, 63, 0, 0, 0, 0, 0, 0, 0, 64, 0, 0, 0, 0, 0, 0, 8, 64}, uint8(1), uint8(2))
	f.Add(make([]byte, 8*40), uint8(3), uint8(5))
	f.Fuzz(func(t *testing.T, b []byte, half, minLen uint8) {
		n := min(len(b)/8, 512)
		v := make([]float64, n)
		for i := range v {
			var u uint64
			for j := range 8 {
				u |= uint64(b[8*i+j]) << (8 * j)
			}
			v[i] = math.Float64frombits(u)
		}
		x := quantity.NewSeries(v, quantity.Force)
		st, err := steady.Summarize(x, steady.Window{Start: 0, End: n})
		if err != nil {
			oneClass(t, err, errClass(err))
		} else {
			for _, q := range []float64{st.Mean.Value(), st.SD.Value(), st.Drift.Value(), st.UMean.Value(), st.NEff} {
				if math.IsNaN(q) || math.IsInf(q, 0) {
					t.Fatalf("%+v", st)
				}
			}
			if st.NEff < 2 || st.NEff > float64(n) {
				t.Fatalf("n_eff %v of %d", st.NEff, n)
			}
		}
		_, err = steady.Detect(steady.Criterion{Half: int(half), MinLen: int(minLen), Channels: []steady.Tolerance{
			{Name: "x", Data: x, SD: quantity.New(1, quantity.Force), Change: quantity.New(1, quantity.Force)}}})
		if err != nil {
			oneClass(t, err, errClass(err))
		}
	})
}

// errClass returns the first class err matches, for oneClass to check
// that it is the only one.
func errClass(err error) error {
	for _, c := range classes {
		if errors.Is(err, c) {
			return c
		}
	}
	return nil
}
