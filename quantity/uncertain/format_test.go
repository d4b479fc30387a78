package uncertain_test

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/quantity/uncertain"
)

// TestMeasuredStringRounded: Measured.String writes u to two significant
// digits and the value to the same decimal place (GUM §7.2.6), in the
// derived unit's name with a decimal prefix where the value is large or
// small. The expected texts are the hand-rounded figures.
func TestMeasuredStringRounded(t *testing.T) {
	for _, c := range []struct {
		y, u float64
		d    quantity.Dim
		want string
	}{
		{138434.1051208327, 832.6328569252115, quantity.Force, "138.43 kN ± 0.83 kN"},
		{1.23412, 0.01234, quantity.Velocity, "1.234 m/s ± 0.012 m/s"},
		{0.0045901, 0.0000190, quantity.Dimensionless, "0.004590 ± 0.000019"},
		{2.3456, 0.0996, quantity.Dimensionless, "2.35 ± 0.10"}, // u rounds up to 0.10
		{101325, 12, quantity.Pressure, "101.325 kPa ± 0.012 kPa"},
		{12345, 678, quantity.Dimensionless, "12350 ± 680"},
		{12.345, 0.05, quantity.Energy, "12.345 N·m ± 0.050 N·m"},
		{1.0016e-3, 2e-6, quantity.DynamicViscosity, "1.0016 mPa·s ± 0.0020 mPa·s"},
		// u > |y|: y keeps two significant digits of its own and the text
		// says u exceeds it.
		{-0.0004, 0.01, quantity.Dimensionless, "-0.00040 ± 0.010 (u exceeds the value)"},
		{998.2, 0.05, quantity.Density, "998.200 kg/m³ ± 0.050 kg/m³"},
		{999999.7, 0.5, quantity.Dimensionless, "999999.70 ± 0.50"}, // just below 10⁶: fixed
		// A prefixed unit brings the numbers into the fixed range.
		{1.2e9, 3e7, quantity.Force, "1.200 GN ± 0.030 GN"},
	} {
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "u", U: quantity.New(c.u, c.d)})
		m := set.MustMeasure(quantity.New(c.y, c.d), id)
		if got := m.String(); got != c.want {
			t.Errorf("%v ± %v: %q, want %q", c.y, c.u, got, c.want)
		}
	}
	if got, want := uncertain.Exact(quantity.New(9.80665, quantity.Acceleration)).String(), "9.80665 m/s² ± 0"; got != want {
		t.Errorf("exact g: %q, want %q", got, want)
	}
}

// TestMeasuredStringPowersOfTen: where the larger of |y| and u is below
// 10⁻³ or at least 10⁶ in the unit shown, or u is below 10⁻⁶, the pair is
// written in powers of ten, still rounded as JCGM 100:2008 §7.2.6 states
// (u to two significant digits, y to u's decimal place); where u exceeds
// |y|, y keeps two significant digits of its own, so that it never reads
// as 0 unless it is 0, and the text flags it. The expected texts are
// rounded by hand, the place of u's last digit written beside each.
func TestMeasuredStringPowersOfTen(t *testing.T) {
	const over = " (u exceeds the value)"
	for _, c := range []struct {
		y, u float64
		d    quantity.Dim
		want string
	}{
		// A zero run: y = 1.228×10⁹, u = 1.71×10¹¹ (place 10¹⁰; y alone
		// to two digits, 1.2×10⁹). m³/s takes no prefix.
		{1.228e9, 1.71e11, quantity.Dimensionless, "1.2×10⁹ ± 1.7×10¹¹" + over},
		{1.228e9, 1.71e11, quantity.VolumeFlowRate, "1.2×10⁹ m³/s ± 1.7×10¹¹ m³/s" + over},
		{-1.228e9, 1.71e11, quantity.Dimensionless, "-1.2×10⁹ ± 1.7×10¹¹" + over},
		{0, 1.71e11, quantity.Dimensionless, "0 ± 1.7×10¹¹" + over},
		// u place 10⁻⁹: y = 0.000017938 keeps 4 decimals in 10⁻⁵.
		{1.7938e-5, 1.5e-8, quantity.Dimensionless, "1.7938×10⁻⁵ ± 1.5×10⁻⁸"},
		// u place 10³: y to 3 decimals in 10⁶.
		{2.5e6, 3.3e4, quantity.Dimensionless, "2.500×10⁶ ± 3.3×10⁴"},
		{-4.2e7, 1.3e5, quantity.Dimensionless, "-4.200×10⁷ ± 1.3×10⁵"},
		// u = 9.96×10⁻⁸ rounds to 1.0×10⁻⁷ (place 10⁻⁸).
		{3.0e-5, 9.96e-8, quantity.Dimensionless, "3.000×10⁻⁵ ± 1.0×10⁻⁷"},
		// y = 0.000999999996 at place 10⁻⁹ rounds up into 10⁻³ and keeps
		// its last digit at 10⁻⁹.
		{9.99999996e-4, 2e-8, quantity.Dimensionless, "1.000000×10⁻³ ± 2.0×10⁻⁸"},
		// u below 10⁻⁶ beside a value of order 1: u place 10⁻⁸.
		{1.0, 1.5e-7, quantity.Dimensionless, "1.00000000 ± 1.5×10⁻⁷"},
		// Small and over: u place 10⁻⁶, y to two digits of its own.
		{3.14e-7, 4.4e-5, quantity.Dimensionless, "3.1×10⁻⁷ ± 4.4×10⁻⁵" + over},
		// Fixed and over.
		{123, 4567, quantity.Dimensionless, "120 ± 4600" + over},
		{0.0095, 0.012, quantity.Velocity, "0.0095 m/s ± 0.012 m/s" + over},
	} {
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "u", U: quantity.New(c.u, c.d)})
		m := set.MustMeasure(quantity.New(c.y, c.d), id)
		if got := m.String(); got != c.want {
			t.Errorf("%v ± %v: %q, want %q", c.y, c.u, got, c.want)
		}
	}
	for _, c := range []struct {
		y    float64
		want string
	}{
		{1.228e9, "1.228×10⁹ ± 0"},
		{1.7938e-5, "1.7938×10⁻⁵ ± 0"},
		{0.0125, "0.0125 ± 0"},
	} {
		if got := uncertain.Exact(quantity.Scalar(c.y)).String(); got != c.want {
			t.Errorf("exact %v: %q, want %q", c.y, got, c.want)
		}
	}
}

// TestMeasuredStringProperty: for any estimate and uncertainty, the
// printed estimate reads back within half a unit of the last digit of the
// printed uncertainty (or of its own second digit where u exceeds it, GUM
// §7.2.6), never reads as 0 unless it is 0, and the printed uncertainty
// is u to two significant digits; the flag appears exactly when u > |y|.
func TestMeasuredStringProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		y := rapid.Float64Range(1, 10).Draw(t, "y mantissa") * math.Pow10(rapid.IntRange(-15, 15).Draw(t, "y exponent"))
		if rapid.Bool().Draw(t, "negative") {
			y = -y
		}
		if rapid.IntRange(0, 9).Draw(t, "zero") == 0 {
			y = 0
		}
		u := rapid.Float64Range(1, 10).Draw(t, "u mantissa") * math.Pow10(rapid.IntRange(-15, 15).Draw(t, "u exponent"))
		set := uncertain.NewSet()
		id := set.MustAdd(uncertain.Source{Name: "u", U: quantity.Scalar(u)})
		s := set.MustMeasure(quantity.Scalar(y), id).String()
		body, flagged := strings.CutSuffix(s, " (u exceeds the value)")
		if flagged != (u > math.Abs(y)) {
			t.Fatalf("%v ± %v: %q flags u > |y| wrongly", y, u, s)
		}
		ys, us, ok := strings.Cut(body, " ± ")
		if !ok {
			t.Fatalf("%v ± %v: %q has no ±", y, u, s)
		}
		gy, gu := readNumber(t, ys), readNumber(t, us)
		if y != 0 && gy == 0 {
			t.Fatalf("%v ± %v: %q prints the estimate as 0", y, u, s)
		}
		if math.Abs(gu-u) > 0.051*u {
			t.Fatalf("%v ± %v: %q: u read back as %v", y, u, s, gu)
		}
		// The place of the second digit; 1+1e-12 keeps Log10 of an exact
		// power of ten from falling just short of it.
		second := func(x float64) float64 { return math.Pow10(int(math.Floor(math.Log10(x*(1+1e-12)))) - 1) }
		step := second(gu)
		if u > math.Abs(y) && y != 0 {
			step = math.Min(step, second(math.Abs(y)))
		}
		if math.Abs(gy-y) > 0.5*step*(1+1e-9)+1e-15*math.Abs(y) { // beside the read-back's own rounding
			t.Fatalf("%v ± %v: %q: y read back as %v, off by more than half of %v", y, u, s, gy, step)
		}
	})
}

// readNumber reads a number Measured.String wrote, in fixed notation or
// in powers of ten.
func readNumber(t *rapid.T, s string) float64 {
	m, e, sci := strings.Cut(s, "×10")
	if sci {
		r := strings.NewReplacer("⁻", "-", "⁰", "0", "¹", "1", "²", "2", "³", "3", "⁴", "4", "⁵", "5", "⁶", "6", "⁷", "7", "⁸", "8", "⁹", "9")
		m += "e" + r.Replace(e)
	}
	v, err := strconv.ParseFloat(m, 64)
	if err != nil {
		t.Fatalf("%q does not read back: %v", s, err)
	}
	return v
}

// TestBudgetReadable: a torque M = F·(1 + β(T − T₀))·L from a load cell,
// a thermometer and a lever arm (invented figures): F = 250 N (u = 0.5 N
// calibration, 0.3 N repeatability), β = 2·10⁻⁴ /K, T − T₀ = 3 K
// (u(T) = 0.5 K), L = 0.4 m (u = 0.5 mm). By hand: M = 250.15 N × 0.4 m
// = 100.06 N·m; c_F = 1.0006 × 0.4 m = 0.400 m, c_L = 250.15 N,
// c_T = 250 N × 2·10⁻⁴ /K × 0.4 m = 0.0200 N·m/K; contributions 0.2001,
// 0.1201, 0.1251, 0.0100 N·m; u_c = 0.265 N·m, so M is stated to 0.01 N·m.
// A head H = p/(ρg) from a pressure has c in m/Pa: 1/(998.2 × 9.80665)
// = 0.000102 m/Pa, u(H) = 150 Pa × c = 0.015 m, H = 15.323 m.
func TestBudgetReadable(t *testing.T) {
	set := uncertain.NewSet()
	cal := set.MustAdd(uncertain.Source{Name: "load cell calibration", U: quantity.New(0.5, quantity.Force), Effect: uncertain.Systematic})
	rep := set.MustAdd(uncertain.Source{Name: "load repeatability", U: quantity.New(0.3, quantity.Force), Type: uncertain.TypeA, DoF: 9})
	th := set.MustAdd(uncertain.Source{Name: "thermometer", U: quantity.New(0.5, quantity.Temperature), Effect: uncertain.Systematic})
	arm := set.MustAdd(uncertain.Source{Name: "lever arm", U: quantity.New(0.0005, quantity.Length), Effect: uncertain.Systematic})
	f := set.MustMeasure(quantity.New(250, quantity.Force), cal, rep)
	dT := set.MustMeasure(quantity.New(3, quantity.Temperature), th)
	l := set.MustMeasure(quantity.New(0.4, quantity.Length), arm)
	beta := quantity.New(2e-4, quantity.ThermalExpansion)
	corr := uncertain.Exact(quantity.Scalar(1)).Add(dT.MulQ(beta))
	m := f.Mul(corr).Mul(l)
	b, err := m.Budget("M", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	s := b.String()
	for _, want := range []string{"M = 100.06 N·m, u_c = 0.26 N·m", "contribution (N·m)", "0.400 m ", "250 N ", "0.0200 N·m/K", "0.50 K", "0.20 ", "0.12 ", "0.13 ", "0.010 "} {
		if !strings.Contains(s, want) {
			t.Errorf("budget lacks %q:\n%s", want, s)
		}
	}
	for _, bad := range []string{"SI", "kg", "s⁻²", "e+", "NaN"} {
		if strings.Contains(s, bad) {
			t.Errorf("budget has %q:\n%s", bad, s)
		}
	}

	ps := set.MustAdd(uncertain.Source{Name: "pressure transducer", U: quantity.New(150, quantity.Pressure)})
	p := set.MustMeasure(quantity.New(150e3, quantity.Pressure), ps)
	rhoG := quantity.New(998.2, quantity.Density).Mul(quantity.New(9.80665, quantity.Acceleration))
	h, err := p.DivQ(rhoG).Budget("H", 0.95)
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"H = 15.323 m, u_c = 0.015 m", "0.000102 m/Pa", "150 Pa"} {
		if !strings.Contains(h.String(), want) || !strings.Contains(h.Markdown(), want) {
			t.Errorf("head budget lacks %q:\n%s", want, h)
		}
	}
}

// TestMonteCarloStringPowersOfTen: the Monte Carlo line writes its
// estimate, u and interval in the notation Measured.String uses, the
// interval's ends to u's decimal place (GUM §7.2.6): u = 1.71×10¹¹ keeps
// the place 10¹⁰, so −3.24×10¹¹ is −3.2×10¹¹ and 3.47×10¹¹ is 3.5×10¹¹.
func TestMonteCarloStringPowersOfTen(t *testing.T) {
	s := func(v float64) quantity.Quantity { return quantity.Scalar(v) }
	for _, c := range []struct {
		r    uncertain.MonteCarloResult
		want string
	}{
		{uncertain.MonteCarloResult{Trials: 1000, Mean: s(1.228e9), U: s(1.71e11), Low: s(-3.24e11), High: s(3.47e11), Coverage: 0.95},
			"Monte Carlo, 1000 trials: y = 1.2×10⁹, u = 1.7×10¹¹, 95 % interval [-3.2×10¹¹, 3.5×10¹¹]"},
		{uncertain.MonteCarloResult{Trials: 1000, Mean: s(1.7938e-5), U: s(1.5e-8), Low: s(1.7909e-5), High: s(1.7967e-5), Coverage: 0.95},
			"Monte Carlo, 1000 trials: y = 1.7938×10⁻⁵, u = 1.5×10⁻⁸, 95 % interval [1.7909×10⁻⁵, 1.7967×10⁻⁵]"},
		{uncertain.MonteCarloResult{Trials: 1000, Mean: quantity.New(1.1532, quantity.Velocity), U: quantity.New(0.0128, quantity.Velocity),
			Low: quantity.New(1.1281, quantity.Velocity), High: quantity.New(1.1774, quantity.Velocity), Coverage: 0.95},
			"Monte Carlo, 1000 trials: y = 1.153 m/s, u = 0.013 m/s, 95 % interval [1.128, 1.177] m/s"},
	} {
		if got := c.r.String(); got != c.want {
			t.Errorf("got  %q\nwant %q", got, c.want)
		}
	}
}

// TestBudgetPowersOfTen: a budget of a small group and one of a zero run
// write the headline, U, the parts and the contributions in powers of ten
// as Measured.String would (GUM §7.2.6 rounding). By hand: u_c =
// √(1.2² + 0.9²)×10⁻⁸ = 1.5×10⁻⁸, U = 1.96 × 1.5×10⁻⁸ = 2.9×10⁻⁸,
// u_c/Π₂ = 0.084 %; for the zero run u_c/Q = 1.71×10¹¹/1.228×10⁹ = 13925 %.
func TestBudgetPowersOfTen(t *testing.T) {
	set := uncertain.NewSet()
	a := set.MustAdd(uncertain.Source{Name: "a", U: quantity.Scalar(1.2e-8), Effect: uncertain.Systematic})
	b := set.MustAdd(uncertain.Source{Name: "b", U: quantity.Scalar(0.9e-8)})
	drift := set.MustAdd(uncertain.Source{Name: "zero drift", U: quantity.Scalar(1.71e11)})
	for _, c := range []struct {
		name string
		m    uncertain.Measured
		want []string
	}{
		{"Π₂", set.MustMeasure(quantity.Scalar(1.7938e-5), a, b), []string{
			"Π₂ = 1.7938×10⁻⁵, u_c = 1.5×10⁻⁸ (0.084 %)", "U(95 %) = 2.9×10⁻⁸",
			"systematic part 1.2×10⁻⁸, random part 9.0×10⁻⁹", "   1.2×10⁻⁸ ", "   9.0×10⁻⁹ "}},
		{"Q", set.MustMeasure(quantity.Scalar(1.228e9), drift), []string{
			"Q = 1.2×10⁹, u_c = 1.7×10¹¹ (13925 %)", "U(95 %) = 3.4×10¹¹", "random part 1.7×10¹¹"}},
	} {
		bd, err := c.m.Budget(c.name, 0.95)
		if err != nil {
			t.Fatal(err)
		}
		for _, w := range c.want {
			if !strings.Contains(bd.String(), w) {
				t.Errorf("%s budget lacks %q:\n%s", c.name, w, bd)
			}
		}
		if strings.Contains(bd.String(), "0.0000") || strings.Contains(bd.String(), "0000000") {
			t.Errorf("%s budget has long fixed numbers:\n%s", c.name, bd)
		}
	}
}
