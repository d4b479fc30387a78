package units_test

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

var _ fmt.Formatter = units.Value{}

// TestValueFormat checks Value's fmt.Formatter verb by verb: precision
// rounds the number and leaves the unit, width counts runes, '#' gives
// the ASCII unit, '+' a sign, %q a Go string literal.
func TestValueFormat(t *testing.T) {
	v := units.Value{Number: 1.7000000000000002, Unit: units.MustParse("m/s")} // 17 × 0.1 in float64
	mu := units.Value{Number: 0.0010016, Unit: units.MustParse("Pa*s")}
	um := units.Value{Number: 2.5, Unit: units.MustParse("µm")}
	scaled := units.Value{Number: 3, Unit: units.MustParse("12000 BTU/h")}
	cases := []struct {
		format string
		v      units.Value
		want   string
	}{
		{"%v", v, "1.7000000000000002 m/s"},
		{"%s", v, "1.7000000000000002 m/s"},
		{"%.4g", v, "1.7 m/s"},
		{"%.4v", v, "1.7 m/s"},
		{"%.3f", v, "1.700 m/s"},
		{"%f", v, "1.700000 m/s"},
		{"%.2e", v, "1.70e+00 m/s"},
		{"%E", mu, "1.001600E-03 Pa·s"},
		{"%.4G", units.Value{Number: 1.23456e-7, Unit: units.MustParse("m")}, "1.235E-07 m"},
		{"%.4g", mu, "0.001002 Pa·s"},
		{"%#.4g", mu, "0.001002 Pa*s"},
		{"%v", um, "2.5 µm"},
		{"%#v", um, "2.5 um"},
		{"%12.4g|", mu, "0.001002 Pa·s|"},
		{"%16.4g|", mu, "   0.001002 Pa·s|"}, // 13 runes, 14 bytes: padded to 16 runes
		{"%-16.4g|", mu, "0.001002 Pa·s   |"},
		{"%+.2f", v, "+1.70 m/s"},
		{"%+.2f", units.Value{Number: -1.7, Unit: units.MustParse("m/s")}, "-1.70 m/s"},
		{"%+v", units.Value{Number: math.Copysign(0, -1), Unit: units.MustParse("m")}, "-0 m"},
		{"%q", mu, `"0.0010016 Pa·s"`},
		{"%.2q", mu, `"0.001 Pa·s"`},
		{"%v", units.Value{Number: 0.25, Unit: units.One()}, "0.25"},
		{"%.1f", units.Value{Number: 0.25}, "0.2"}, // the zero Unit is one; strconv rounds half to even
		{"%v", scaled, "3 (12000·BTU/h)"},
		{"%.3g", scaled, "3 (12000·BTU/h)"},
		{"%v", units.Value{Number: math.NaN(), Unit: units.MustParse("K")}, "NaN K"},
		{"%d", v, "%!d(units.Value=1.7000000000000002 m/s)"},
		{"%x", v, "%!x(units.Value=1.7000000000000002 m/s)"},
	}
	for _, c := range cases {
		if got := fmt.Sprintf(c.format, c.v); got != c.want {
			t.Errorf("Sprintf(%q, %v) = %q, want %q", c.format, c.v, got, c.want)
		}
	}
	// A Flag prints through the Value it embeds.
	f := units.NewFlag(quantity.Velocity, v)
	if got := fmt.Sprintf("%.3g", f); got != "1.7 m/s" {
		t.Errorf("Flag %%.3g = %q", got)
	}
	// Formatting rounds the text, never the number.
	if v.Number != 1.7000000000000002 {
		t.Errorf("Number changed to %v", v.Number)
	}
}

// valueUnits are unit spellings for the round-trip properties: SI, prefixed,
// customary, temperature levels and differences, angles, compounds and a
// scaled unit.
var valueUnits = []string{"m/s", "kn", "Pa*s", "kPa", "µm", "°C", "Δ°F", "K", "rpm", "rad/s", "W/(m^2*K)",
	"J/(kg*K)", "N*m", "BTU/(h*ft^2*degF)", "L/min", "12000 BTU/h", "1", "m^(1/2)", "kg/m^3", "psi"}

// TestValueFormatRoundTrip: for any finite number and unit, %v (String),
// %#v (ASCII unit) and %q (unquoted) read back through ParseValue to the
// same bits and the same unit; %.4g reads back to the same unit and to
// the number rounded to four digits.
func TestValueFormatRoundTrip(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		x := rapid.Float64().Filter(func(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }).Draw(t, "x")
		u := units.MustParse(rapid.SampledFrom(valueUnits).Draw(t, "unit"))
		v := units.Value{Number: x, Unit: u}
		q, err := strconv.Unquote(fmt.Sprintf("%q", v))
		if err != nil {
			t.Fatalf("%%q of %v does not unquote: %v", v, err)
		}
		for _, s := range []string{fmt.Sprintf("%v", v), fmt.Sprintf("%s", v), fmt.Sprintf("%#v", v), q, v.String()} {
			back, err := units.ParseValue(s)
			if err != nil || math.Float64bits(back.Number) != math.Float64bits(x) || !back.Unit.Equal(u) {
				t.Fatalf("%q reads back as %v, %v; want %v", s, back, err, v)
			}
		}
		s := fmt.Sprintf("%.4g", v)
		back, err := units.ParseValue(s)
		want, _ := strconv.ParseFloat(strconv.FormatFloat(x, 'g', 4, 64), 64)
		if math.IsInf(want, 0) {
			return // 1.798e+308: rounded up past the largest float64, refused as it should be
		}
		if err != nil || back.Number != want || !back.Unit.Equal(u) {
			t.Fatalf("%q reads back as %v, %v; want %v in %v", s, back, err, want, u)
		}
	})
}

// FuzzValueFormat checks that any value ParseValue accepts prints with
// %v back to the same number and unit, and with a precision to the same
// unit, without a panic.
func FuzzValueFormat(f *testing.F) {
	for _, s := range []string{"1.7 m/s", "0.0010016 Pa·s", "2.5 µm", "20 °C", "3 (12000·BTU/h)", "0.25", "-0 K", "1e-300 m"} {
		f.Add(s, uint8(4))
	}
	f.Fuzz(func(t *testing.T, s string, prec uint8) {
		v, err := units.ParseValue(s)
		if err != nil {
			return
		}
		out := fmt.Sprintf("%v", v)
		back, err := units.ParseValue(out)
		if err != nil || math.Float64bits(back.Number) != math.Float64bits(v.Number) || !back.Unit.Equal(v.Unit) {
			t.Fatalf("ParseValue(%q) = %v; %%v %q reads back as %v, %v", s, v, out, back, err)
		}
		p := int(prec % 18)
		out = fmt.Sprintf("%.*g", p, v)
		back, err = units.ParseValue(out)
		if r, _ := strconv.ParseFloat(strconv.FormatFloat(v.Number, 'g', p, 64), 64); math.IsInf(r, 0) || r == 0 && v.Number != 0 {
			return // rounded past the float64 range: refused as it should be
		}
		if err != nil || !back.Unit.Equal(v.Unit) {
			t.Fatalf("%%.%dg of %v = %q reads back as %v, %v", p, v, out, back, err)
		}
		if w := fmt.Sprintf("%*.*e", 40, p, v); len([]rune(w)) < 40 || strings.TrimSpace(w) != fmt.Sprintf("%.*e", p, v) {
			t.Fatalf("%%40.%de of %v = %q", p, v, w)
		}
	})
}

// TestDerivedUnitMatchesQuantity: for every named kind of quantity,
// DerivedUnit gives the unit quantity.Quantity.String writes, where that
// names one, in the same Unicode and ASCII spelling; and every
// Quantity's text, named or in base units, reads back through
// ParseQuantity (units.Parse) to the same bits and dimension.
func TestDerivedUnitMatchesQuantity(t *testing.T) {
	named := map[quantity.Dim]bool{}
	for _, k := range quantity.Kinds() {
		if k.Dim.IsDimensionless() {
			continue
		}
		x := quantity.New(1, k.Dim)
		uni := strings.TrimPrefix(x.String(), "1 ")
		ascii := strings.TrimPrefix(x.ASCII(), "1 ")
		if uni == k.Dim.SIUnit() {
			continue // base units: nothing named
		}
		named[k.Dim] = true
		du, ok := units.DerivedUnit(k.Dim)
		if !ok {
			t.Errorf("%s: quantity names %s, DerivedUnit names nothing", k.Name, uni)
			continue
		}
		if got := []string{du.Format(quantity.Unicode), du.String()}; !cmp.Equal(got, []string{uni, ascii}) {
			t.Errorf("%s: DerivedUnit spells %q, quantity %q", k.Name, got, []string{uni, ascii})
		}
		pu, err := units.Parse(uni)
		if err != nil || pu.Dim() != k.Dim || pu.Factor() != 1 || pu.Offset() != 0 {
			t.Errorf("%s: Parse(%q) = %v (factor %v), %v", k.Name, uni, pu, pu.Factor(), err)
		}
	}
	if len(named) != 12 {
		t.Errorf("%d named dimensions among the kinds, want the twelve of quantity.Quantity.String", len(named))
	}
	// Energy and torque: one dimension, one unit, N·m.
	if du, _ := units.DerivedUnit(quantity.Energy); du.String() != "N*m" {
		t.Errorf("DerivedUnit(energy) = %v, want N*m", du)
	}
	// Nothing guessed for an angle, a count or a molar flow.
	for _, d := range []quantity.Dim{quantity.Frequency, quantity.AngularMomentum, quantity.CatalyticActivity, quantity.Velocity} {
		if du, ok := units.DerivedUnit(d); ok {
			t.Errorf("DerivedUnit(%v) = %v, want none", d, du)
		}
	}
}

// TestQuantityTextReadsBackThroughUnits: for any kind of quantity and any
// finite value, the Quantity's String and ASCII texts read back through
// units.ParseQuantity to the same value and dimension. (The value, not
// the bits: Unit.Of adds the unit's offset, so -0 comes back as +0.)
func TestQuantityTextReadsBackThroughUnits(t *testing.T) {
	kinds := quantity.Kinds()
	rapid.Check(t, func(t *rapid.T) {
		k := rapid.SampledFrom(kinds).Draw(t, "kind")
		x := rapid.Float64().Filter(func(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }).Draw(t, "x")
		q := quantity.New(x, k.Dim)
		for _, s := range []string{q.String(), q.ASCII()} {
			back, err := units.ParseQuantity(s)
			if err != nil || back.Dim() != q.Dim() || back.Value() != x {
				t.Fatalf("%s: %q reads back through units as %v, %v", k.Name, s, back, err)
			}
		}
	})
}

// A set point computed as 8.5 m/s × 0.2 holds the float64 product,
// 1.7000000000000002; %v writes every digit of it, and %.4g rounds the
// text for an operator while the unit stays as it is.
func ExampleValue_Format() {
	speed, ratio := 8.5, 0.2
	v := units.Value{Number: speed * ratio, Unit: units.MustParse("m/s")}
	mu := units.Value{Number: 0.0010016, Unit: units.MustParse("Pa*s")}
	fmt.Printf("%v\n", v)
	fmt.Printf("V = %.4g, mu = %.4g\n", v, mu)
	fmt.Printf("%.2f | %#.3e | %-9.3g| %q\n", v, mu, v, v)
	// Output:
	// 1.7000000000000002 m/s
	// V = 1.7 m/s, mu = 0.001002 Pa·s
	// 1.70 m/s | 1.002e-03 Pa*s | 1.7 m/s  | "1.7000000000000002 m/s"
}
