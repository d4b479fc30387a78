package uncertain_test

import (
	"strings"
	"testing"

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
		{-0.0004, 0.01, quantity.Dimensionless, "0.000 ± 0.010"},
		{998.2, 0.05, quantity.Density, "998.200 kg/m³ ± 0.050 kg/m³"},
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
