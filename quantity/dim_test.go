package quantity_test

import (
	"errors"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

func mul(a, b q.Dim) q.Dim {
	d, err := a.Mul(b)
	if err != nil {
		panic(err)
	}
	return d
}

func div(a, b q.Dim) q.Dim {
	d, err := a.Div(b)
	if err != nil {
		panic(err)
	}
	return d
}

// TestSIDerivedUnits checks the dimensions of the 22 SI derived units with
// special names. The base-unit expressions are those of the SI Brochure,
// 9th ed. (2019), Table 4, column "expressed in terms of SI base units";
// the left side builds each dimension from its defining relation.
func TestSIDerivedUnits(t *testing.T) {
	one := q.Dimensionless
	s, m, kg, A, K, mol, cd := q.Time, q.Length, q.Mass, q.Current, q.Temperature, q.Amount, q.LuminousIntensity
	N := mul(kg, div(m, mul(s, s)))
	J := mul(N, m)
	W := div(J, s)
	C := mul(A, s)
	V := div(W, A)
	ohm := div(V, A)
	Wb := mul(V, s)
	cases := []struct {
		name     string
		built    q.Dim
		brochure string // SI Brochure (2019), Table 4
		kind     q.Dim
	}{
		{"radian", div(m, m), "1", one},
		{"steradian", div(mul(m, m), mul(m, m)), "1", one},
		{"hertz", div(one, s), "s^-1", q.Frequency},
		{"newton", N, "kg m s^-2", q.Force},
		{"pascal", div(N, mul(m, m)), "kg m^-1 s^-2", q.Pressure},
		{"joule", J, "kg m^2 s^-2", q.Energy},
		{"watt", W, "kg m^2 s^-3", q.Power},
		{"coulomb", C, "A s", q.Charge},
		{"volt", V, "kg m^2 s^-3 A^-1", q.Voltage},
		{"farad", div(C, V), "kg^-1 m^-2 s^4 A^2", q.Capacitance},
		{"ohm", ohm, "kg m^2 s^-3 A^-2", q.Resistance},
		{"siemens", div(one, ohm), "kg^-1 m^-2 s^3 A^2", q.Conductance},
		{"weber", Wb, "kg m^2 s^-2 A^-1", q.MagneticFlux},
		{"tesla", div(Wb, mul(m, m)), "kg s^-2 A^-1", q.MagneticFluxDensity},
		{"henry", div(Wb, A), "kg m^2 s^-2 A^-2", q.Inductance},
		{"degree Celsius", K, "K", q.Temperature},
		{"lumen", mul(cd, one), "cd", q.LuminousIntensity},
		{"lux", div(cd, mul(m, m)), "cd m^-2", q.Illuminance},
		{"becquerel", div(one, s), "s^-1", q.Frequency},
		{"gray", div(J, kg), "m^2 s^-2", q.AbsorbedDose},
		{"sievert", div(J, kg), "m^2 s^-2", q.AbsorbedDose},
		{"katal", div(mol, s), "mol s^-1", q.CatalyticActivity},
	}
	if len(cases) != 22 {
		t.Fatalf("%d cases, the SI has 22 derived units with special names", len(cases))
	}
	for _, c := range cases {
		got, err := q.ParseDim(c.brochure)
		if err != nil {
			t.Errorf("%s: ParseDim(%q): %v", c.name, c.brochure, err)
			continue
		}
		if got != c.built || got != c.kind {
			t.Errorf("%s: brochure %q gives %v; built %v; kind %v", c.name, c.brochure, got, c.built, c.kind)
		}
	}
}

func TestDimSpellings(t *testing.T) {
	// The forms are those of ISO 80000-1 (dimension) and the SI Brochure
	// (base units); the examples are common practice.
	cases := []struct {
		d                            q.Dim
		iso, isoASCII, unit, unitASC string
	}{
		{q.Pressure, "L⁻¹ M T⁻²", "L^-1 M T^-2", "kg·m⁻¹·s⁻²", "kg m^-1 s^-2"},
		{q.Velocity, "L T⁻¹", "L T^-1", "m·s⁻¹", "m s^-1"},
		{q.Dimensionless, "1", "1", "1", "1"},
		{q.ThermalConductivity, "L M T⁻³ Θ⁻¹", "L M T^-3 Th^-1", "kg·m·s⁻³·K⁻¹", "kg m s^-3 K^-1"},
		{q.StressIntensityFactor, "L^(-1/2) M T⁻²", "L^(-1/2) M T^-2", "kg·m^(-1/2)·s⁻²", "kg m^(-1/2) s^-2"},
		{mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, mul(q.Mass, q.Mass))))))))))), "M¹²", "M^12", "kg¹²", "kg^12"},
	}
	for _, c := range cases {
		got := []string{c.d.String(), c.d.ASCII(), c.d.SIUnit(), c.d.SIUnitASCII()}
		want := []string{c.iso, c.isoASCII, c.unit, c.unitASC}
		if diff := cmp.Diff(want, got); diff != "" {
			t.Errorf("spellings of %v (-want +got):\n%s", c.d, diff)
		}
		for _, s := range want {
			back, err := q.ParseDim(s)
			if err != nil || back != c.d {
				t.Errorf("ParseDim(%q) = %v, %v; want %v", s, back, err, c.d)
			}
		}
	}
}

func TestDimExponents(t *testing.T) {
	noise, err := q.DimOf(q.BaseT, 1, 2) // V/√Hz carries T^(1/2)
	if err != nil {
		t.Fatal(err)
	}
	if e := noise.Exponent(q.BaseT); e != q.MustRat(1, 2) {
		t.Errorf("T exponent = %v, want 1/2", e)
	}
	third, _ := q.DimOf(q.BaseL, 1, 3)
	half, _ := q.DimOf(q.BaseL, 1, 2)
	if e := div(half, third).Exponent(q.BaseL); e != q.MustRat(1, 6) {
		t.Errorf("L^(1/2)/L^(1/3) = L^(%v), want L^(1/6)", e)
	}
	// Pow with a non-representable result is refused.
	if _, err := q.Length.Pow(1, 4); !errors.Is(err, q.ErrDimension) {
		t.Errorf("L^(1/4): err = %v, want a dimension error", err)
	}
	// Overflow is reported, not wrapped: 21 + 1 = 22 > 21⅙.
	big, _ := q.NewDim(21, 0, 0, 0, 0, 0, 0)
	if _, err := big.Mul(q.Length); err == nil {
		t.Error("L²¹·L: want overflow error")
	}
	if _, err := q.NewDim(0, 0, 22, 0, 0, 0, 0); err == nil {
		t.Error("T²²: want range error")
	}
	neg, _ := q.NewDim(0, -21, 0, 0, 0, 0, 0)
	if _, err := neg.Div(q.Mass); err == nil {
		t.Error("M⁻²¹/M: want overflow error")
	}
	if _, err := neg.Pow(-1, 1); err != nil {
		t.Errorf("(M⁻²¹)⁻¹: %v", err)
	}
	// Every exponent −12…12 in sixths is representable in every base.
	for b := q.Base(0); b < q.NumBases; b++ {
		for s := -72; s <= 72; s++ {
			d, err := q.DimOf(b, s, 6)
			if err != nil {
				t.Fatalf("%v^(%d/6): %v", b, s, err)
			}
			if d.Sixths(b) != s {
				t.Fatalf("%v^(%d/6) holds %d sixths", b, s, d.Sixths(b))
			}
		}
	}
	m := map[q.Dim]string{q.Pressure: "p", q.Energy: "E"}
	if m[mul(q.Force, div(q.Dimensionless, q.Area))] != "p" {
		t.Error("Dim as a map key: N/m² does not find pressure")
	}
}

func TestKindName(t *testing.T) {
	cases := map[q.Dim]string{
		q.Pressure:            "pressure, stress",
		q.KinematicViscosity:  "kinematic viscosity, thermal diffusivity, diffusion coefficient",
		q.DynamicViscosity:    "dynamic viscosity",
		mul(q.Power, q.Power): "",
	}
	for d, want := range cases {
		if got := q.KindName(d); got != want {
			t.Errorf("KindName(%v) = %q, want %q", d, got, want)
		}
	}
	if d, ok := q.KindDim("Density"); !ok || d != q.Density {
		t.Errorf("KindDim(Density) = %v, %v", d, ok)
	}
	if n := len(q.Kinds()); n < 30 {
		t.Errorf("%d kinds, want at least 30", n)
	}
}

func TestParseDimErrors(t *testing.T) {
	bad := []string{"L^", "L^(1/0)", "L^(1/2", "X", "kg^-", "m⁻", "L^1234", "L^(1/4)", "L^22", "M²² L", "m//s", "L^(a)"}
	for _, s := range bad {
		_, err := q.ParseDim(s)
		var pe *q.Error
		if !errors.As(err, &pe) {
			t.Errorf("ParseDim(%q): err = %v, want *Error", s, err)
		}
	}
}

func genDim(t *rapid.T, label string) q.Dim {
	var d q.Dim
	for b := q.Base(0); b < q.NumBases; b++ {
		e, err := q.DimOf(b, rapid.IntRange(-36, 36).Draw(t, label), 6)
		if err != nil {
			t.Fatal(err)
		}
		d = mul(d, e)
	}
	return d
}

func TestDimProperties(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		a, b := genDim(t, "a"), genDim(t, "b")
		ab := mul(a, b)
		if div(ab, b) != a {
			t.Fatalf("(%v·%v)/%v ≠ %v", a, b, b, a)
		}
		if mul(a, b) != mul(b, a) {
			t.Fatalf("product not commutative")
		}
		sq, err := a.Pow(2, 1)
		if err != nil {
			t.Fatal(err)
		}
		root, err := sq.Pow(1, 2)
		if err != nil || root != a {
			t.Fatalf("√(%v²) = %v, %v", a, root, err)
		}
		inv, _ := a.Inv()
		if !mul(a, inv).IsDimensionless() {
			t.Fatalf("%v·%v⁻¹ not dimensionless", a, a)
		}
		back, err := q.ParseDim(a.String())
		if err != nil || back != a {
			t.Fatalf("ParseDim(%q) = %v, %v", a.String(), back, err)
		}
		back, err = q.ParseDim(a.SIUnitASCII())
		if err != nil || back != a {
			t.Fatalf("ParseDim(%q) = %v, %v", a.SIUnitASCII(), back, err)
		}
		for k := q.Base(0); k < q.NumBases; k++ {
			if ab.Sixths(k) != a.Sixths(k)+b.Sixths(k) {
				t.Fatalf("lane %v: %d + %d ≠ %d", k, a.Sixths(k), b.Sixths(k), ab.Sixths(k))
			}
		}
	})
}

// TestDimOverflowProperty checks against plain integer arithmetic that a
// product or a quotient overflows exactly when some exponent leaves
// −128…127 sixths, for Dim.Mul and Dim.Div (an error) and for
// Quantity.Mul and Quantity.Div (a panic at that operation).
func TestDimOverflowProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		var ea, eb [q.NumBases]int
		var a, b q.Dim
		for k := range ea {
			ea[k] = rapid.IntRange(-128, 127).Draw(t, "a")
			eb[k] = rapid.IntRange(-128, 127).Draw(t, "b")
			da, _ := q.DimOf(q.Base(k), ea[k], 6)
			db, _ := q.DimOf(q.Base(k), eb[k], 6)
			a, b = mul(a, da), mul(b, db)
		}
		wantOK, wantDivOK := true, true
		for k := range ea {
			if s := ea[k] + eb[k]; s < -128 || s > 127 {
				wantOK = false
			}
			if s := ea[k] - eb[k]; s < -128 || s > 127 {
				wantDivOK = false
			}
		}
		qa, qb := q.New(2, a), q.New(4, b)
		if got := panics(func() { qa.Mul(qb) }); got == wantOK {
			t.Fatalf("Quantity %v·%v: panic = %v, want %v", a, b, got, !wantOK)
		}
		if got := panics(func() { qa.Div(qb) }); got == wantDivOK {
			t.Fatalf("Quantity %v/%v: panic = %v, want %v", a, b, got, !wantDivOK)
		}
		if _, err := a.Div(b); (err == nil) != wantDivOK {
			t.Fatalf("%v/%v: err = %v, want ok = %v", a, b, err, wantDivOK)
		}
		if wantOK && qa.Mul(qb) != q.New(8, mul(a, b)) {
			t.Fatalf("Quantity %v·%v = %v", a, b, qa.Mul(qb))
		}
		d, err := a.Mul(b)
		if (err == nil) != wantOK {
			t.Fatalf("%v·%v: err = %v, want ok = %v", a, b, err, wantOK)
		}
		if err == nil {
			for k := range ea {
				if d.Sixths(q.Base(k)) != ea[k]+eb[k] {
					t.Fatalf("lane %d wrong", k)
				}
			}
		}
	})
}

// panics reports whether f panics with an *Error of class ErrDimension.
func panics(f func()) (p bool) {
	defer func() {
		e, ok := recover().(*q.Error)
		p = ok && e.Class == q.ErrDimension
	}()
	f()
	return false
}

func FuzzParseDim(f *testing.F) {
	for _, s := range []string{"L⁻¹ M T⁻²", "kg m^-1 s^-2", "kg·m^(-1/2)·s⁻²", "Th^-1", "1", "", "L^(", "m⁻⁻"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		d, err := q.ParseDim(s)
		if err != nil {
			return
		}
		back, err := q.ParseDim(d.String())
		if err != nil || back != d {
			t.Fatalf("ParseDim(%q) = %v; reparse of %q = %v, %v", s, d, d.String(), back, err)
		}
	})
}
