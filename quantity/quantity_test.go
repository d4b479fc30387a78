package quantity_test

import (
	"errors"
	"fmt"
	"math"
	"testing"
	"unsafe"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

func TestQuantitySize(t *testing.T) {
	if s := unsafe.Sizeof(q.Quantity{}); s != 16 {
		t.Errorf("Quantity is %d bytes, want 16", s)
	}
	var zero q.Quantity
	if zero != q.Scalar(0) || !zero.IsDimensionless() {
		t.Errorf("zero Quantity = %v, want dimensionless 0", zero)
	}
}

// mustPanic runs f and returns the *Error of class ErrDimension it panics
// with.
func mustPanic(t *testing.T, f func()) (e *q.Error) {
	t.Helper()
	defer func() {
		r := recover()
		var ok bool
		if e, ok = r.(*q.Error); !ok || e.Class != q.ErrDimension {
			t.Fatalf("panic value %v (%T), want an *Error of class ErrDimension", r, r)
		}
	}()
	f()
	return nil
}

func TestMismatchMessages(t *testing.T) {
	p := q.New(101325, q.Pressure)
	v := q.New(3, q.Velocity)
	L := q.New(2, q.Length)
	nu := q.New(1e-6, q.KinematicViscosity)
	huge := q.New(1, q.MustDim(20, 0, 0, 0, 0, 0, 0))
	cases := []struct {
		name string
		f    func()
		want string
	}{
		{"add", func() { p.Add(v) }, "cannot add pressure, stress [Pa] and velocity [m·s⁻¹]"},
		{"sub", func() { v.Sub(L) }, "cannot subtract velocity [m·s⁻¹] and length [m]"},
		{"cmp", func() { v.Cmp(p) }, "cannot compare velocity [m·s⁻¹] and pressure, stress [Pa]"},
		{"exp", func() { q.Exp(L) }, "cannot take the exponential of length [m]: the argument must be dimensionless"},
		{"log", func() { q.Log10(nu) }, "cannot take the logarithm of kinematic viscosity, thermal diffusivity, diffusion coefficient [m²·s⁻¹]: the argument must be dimensionless"},
		{"sin", func() { q.Sin(L) }, "cannot take the sine of length [m]: the argument must be dimensionless"},
		{"powf", func() { q.Powf(v, 0.9) }, "cannot raise velocity [m·s⁻¹] to a real power: the argument must be dimensionless"},
		{"hypot", func() { q.Hypot(L, v) }, "cannot take the hypotenuse of length [m] and velocity [m·s⁻¹]"},
		{"max", func() { q.Max(L, v) }, "cannot take the maximum of length [m] and velocity [m·s⁻¹]"},
		{"overflow", func() { huge.Mul(huge) }, "cannot multiply [m²⁰] and [m²⁰]: an exponent overflows"},
		{"pow", func() { L.Pow(1, 4) }, "cannot raise length [m] to the power 1/4: the exponent of L would not be a whole number of sixths"},
	}
	for _, c := range cases {
		e := mustPanic(t, c.f)
		if e.Error() != c.want {
			t.Errorf("%s:\n got %s\nwant %s", c.name, e.Error(), c.want)
		}
		if !errors.Is(e, q.ErrDimension) {
			t.Errorf("%s: errors.Is(err, ErrDimension) = false", c.name)
		}
	}
}

func TestCheckAndEval(t *testing.T) {
	nu := q.New(1.0e-6, q.KinematicViscosity) // a kinematic viscosity given where μ belongs
	err := nu.CheckNamed("μ", q.DynamicViscosity)
	want := "μ: want dynamic viscosity [Pa·s], got kinematic viscosity, thermal diffusivity, diffusion coefficient [m²·s⁻¹]"
	if err == nil || err.Error() != want {
		t.Errorf("Check: %v\nwant %s", err, want)
	}
	var de *q.Error
	if !errors.As(err, &de) || de.Dims != [2]q.Dim{q.KinematicViscosity, q.DynamicViscosity} || de.Name != "μ" || de.Class != q.ErrDimension {
		t.Errorf("errors.As: %+v", de)
	}
	if err := q.New(1e-3, q.DynamicViscosity).Check(q.DynamicViscosity); err != nil {
		t.Errorf("Check of a matching value: %v", err)
	}
	rho, v, d := q.New(998, q.Density), q.New(2, q.Velocity), q.New(0.05, q.Length)
	re, err := q.Eval(func() q.Quantity { return rho.Mul(v).Mul(d).Div(nu) })
	if err != nil {
		t.Fatal(err)
	}
	// ρVD/ν is not dimensionless: the mistake shows in the dimension and in
	// the next dimensionless-only step.
	if re.IsDimensionless() {
		t.Error("ρVD/ν came out dimensionless")
	}
	_, err = q.Eval(func() q.Quantity { return q.Log10(rho.Mul(v).Mul(d).Div(nu)) })
	if !errors.As(err, &de) || !errors.Is(err, q.ErrDimension) {
		t.Errorf("Eval: err = %v, want an *Error of class ErrDimension", err)
	}
	defer func() {
		if r := recover(); r != "other" {
			t.Errorf("Eval passed on %v, want the original panic", r)
		}
	}()
	_, _ = q.Eval(func() q.Quantity { panic("other") })
}

func TestArithmetic(t *testing.T) {
	rho := q.New(1.225, q.Density) // ISO 2533 sea-level density
	v := q.New(50, q.Velocity)
	dyn := rho.Mul(v).Mul(v).Scale(0.5)
	if dyn.Dim() != q.Pressure || !dyn.ApproxEqual(q.New(1531.25, q.Pressure), 1e-15) {
		t.Errorf("ρV²/2 = %v", dyn)
	}
	if got := v.Pow(2, 1).Sqrt(); got != v {
		t.Errorf("√(V²) = %v", got)
	}
	vol := q.New(8, q.Volume)
	if got := vol.Cbrt(); got != q.New(2, q.Length) {
		t.Errorf("∛(8 m³) = %v", got)
	}
	if got := v.Inv().Inv(); got != v {
		t.Errorf("1/(1/V) = %v", got)
	}
	if got := v.Neg().Abs(); got != v {
		t.Errorf("|−V| = %v", got)
	}
	if v.Cmp(v.Scale(2)) != -1 || v.Scale(2).Cmp(v) != 1 || v.Cmp(v) != 0 {
		t.Error("Cmp ordering")
	}
	if !v.ApproxEqual(v.Scale(1+1e-10), 1e-9) || v.ApproxEqual(v.Scale(1.1), 1e-3) {
		t.Error("ApproxEqual")
	}
	L := q.New(3, q.Length)
	if got := q.Hypot(L, q.New(4, q.Length)); got != q.New(5, q.Length) {
		t.Errorf("Hypot = %v", got)
	}
	if got := q.Atan2(L, L).Value(); math.Abs(got-math.Pi/4) > 1e-15 {
		t.Errorf("Atan2 = %v", got)
	}
	if got := q.Min(L, L.Scale(2)); got != L {
		t.Errorf("Min = %v", got)
	}
	if got := q.Exp(q.Log(q.Scalar(2))).Value(); math.Abs(got-2) > 1e-15 {
		t.Errorf("exp(ln 2) = %v", got)
	}
	if got := q.PowQ(q.Scalar(8), q.Scalar(1.0/3)).Value(); math.Abs(got-2) > 1e-15 {
		t.Errorf("8^(1/3) = %v", got)
	}
	trig := []float64{q.Sin(q.Scalar(0.5)).Value(), q.Cos(q.Scalar(0.5)).Value(), q.Tan(q.Scalar(0.5)).Value(),
		q.Asin(q.Scalar(0.5)).Value(), q.Acos(q.Scalar(0.5)).Value(), q.Atan(q.Scalar(0.5)).Value()}
	want := []float64{math.Sin(0.5), math.Cos(0.5), math.Tan(0.5), math.Asin(0.5), math.Acos(0.5), math.Atan(0.5)}
	if diff := cmp.Diff(want, trig); diff != "" {
		t.Errorf("trigonometric functions (-want +got):\n%s", diff)
	}
	nan := q.New(math.NaN(), q.Length)
	if nan.Cmp(L) != -1 || L.Cmp(nan) != 1 || nan.Cmp(nan) != 0 {
		t.Error("NaN ordering")
	}
}

func genQuantity(t *rapid.T, d q.Dim, label string) q.Quantity {
	return q.New(rapid.Float64Range(1e-3, 1e3).Draw(t, label), d)
}

func TestQuantityProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		da, db := genDim(t, "da"), genDim(t, "db")
		a, b := genQuantity(t, da, "a"), genQuantity(t, db, "b")
		if got := a.Mul(b).Div(b); got.Dim() != a.Dim() || !got.ApproxEqual(a, 1e-15) {
			t.Fatalf("(a·b)/b = %v, a = %v", got, a)
		}
		if got := a.Pow(3, 1).Pow(1, 3); !got.ApproxEqual(a, 1e-14) {
			t.Fatalf("∛(a³) = %v, a = %v", got, a)
		}
		if got := a.Pow(2, 1).Sqrt(); !got.ApproxEqual(a, 1e-15) {
			t.Fatalf("√(a²) = %v, a = %v", got, a)
		}
		c := genQuantity(t, da, "c")
		if a.Add(c) != c.Add(a) {
			t.Fatalf("a+c ≠ c+a")
		}
		if da != db {
			e := mustPanicRapid(t, func() { a.Add(b) })
			if e.Dims != [2]q.Dim{da, db} || !e.Binary {
				t.Fatalf("mismatch error names %v", e.Dims)
			}
			mustPanicRapid(t, func() { a.Sub(b) })
			mustPanicRapid(t, func() { a.Cmp(b) })
		}
	})
}

func mustPanicRapid(t *rapid.T, f func()) (e *q.Error) {
	defer func() {
		r := recover()
		var ok bool
		if e, ok = r.(*q.Error); !ok || e.Class != q.ErrDimension {
			t.Fatalf("panic value %v, want an *Error of class ErrDimension", r)
		}
	}()
	f()
	return nil
}

func TestFormat(t *testing.T) {
	rho := q.New(1.225, q.Density)
	cases := []struct{ format, want string }{
		{"%v", "1.225 kg·m⁻³"},
		{"%s", "1.225 kg·m⁻³"},
		{"%.2g", "1.2 kg·m⁻³"},
		{"%.3e", "1.225e+00 kg·m⁻³"},
		{"%.1f", "1.2 kg·m⁻³"},
		{"%#v", "1.225 kg m^-3"},
		{"%15v", "   1.225 kg·m⁻³"},
		{"%-15v|", "1.225 kg·m⁻³   |"},
		{"%+.4g", "+1.225 kg·m⁻³"},
		{"%d", "%!d(quantity.Quantity=1.225 kg·m⁻³)"},
	}
	for _, c := range cases {
		if got := fmt.Sprintf(c.format, rho); got != c.want {
			t.Errorf("Sprintf(%q) = %q, want %q", c.format, got, c.want)
		}
	}
	if got := rho.ASCII(); got != "1.225 kg m^-3" {
		t.Errorf("ASCII = %q", got)
	}
	if got := q.Scalar(0.5).String(); got != "0.5" {
		t.Errorf("dimensionless String = %q", got)
	}
	b, _ := q.Pressure.MarshalText()
	var d q.Dim
	if err := d.UnmarshalText(b); err != nil || d != q.Pressure {
		t.Errorf("text round trip of %s: %v, %v", b, d, err)
	}
}
