package quantity_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

// namedCases are the twelve dimensions String names, with the spellings
// it writes. The compounds are those of SI Brochure, 8th ed. (2006),
// Table 4 (Pa s, N m, N/m, W/m², J/K, J/(kg K), W/(m K)); W/(m²·K) and
// N/m³ follow them (common practice).
var namedCases = []struct {
	d            q.Dim
	name, ascii  string
	kind, sample string // a kind of the dimension, and a value's text
}{
	{q.Force, "N", "N", "force", "138434.1 N"},
	{q.Pressure, "Pa", "Pa", "pressure", "101325 Pa"},
	{q.Power, "W", "W", "power", "2.5e+06 W"},
	{q.Torque, "N·m", "N*m", "torque", "12 N·m"},
	{q.DynamicViscosity, "Pa·s", "Pa*s", "dynamic viscosity", "0.0010016 Pa·s"},
	{q.SurfaceTension, "N/m", "N/m", "surface tension", "0.0728 N/m"},
	{q.SpecificWeight, "N/m³", "N/m^3", "specific weight", "9789 N/m³"},
	{q.HeatFluxDensity, "W/m²", "W/m^2", "heat flux density", "1361 W/m²"},
	{q.ThermalConductivity, "W/(m·K)", "W/(m*K)", "thermal conductivity", "0.6 W/(m·K)"},
	{q.HeatTransferCoefficient, "W/(m²·K)", "W/(m^2*K)", "heat transfer coefficient", "25 W/(m²·K)"},
	{q.HeatCapacity, "J/K", "J/K", "heat capacity", "4186 J/K"},
	{q.SpecificHeatCapacity, "J/(kg·K)", "J/(kg*K)", "specific heat capacity", "4186 J/(kg·K)"},
}

// TestNamedUnitSet checks the spelling of every named dimension in
// String, ASCII, Describe and %v, and that each text reads back through
// ParseQuantitySI to the same value and dimension.
func TestNamedUnitSet(t *testing.T) {
	for _, c := range namedCases {
		x, err := q.ParseQuantitySI(c.sample)
		if err != nil || x.Dim() != c.d {
			t.Errorf("ParseQuantitySI(%q) = %v, %v; want dimension %v", c.sample, x, err, c.d)
			continue
		}
		got := []string{x.String(), x.ASCII(), fmt.Sprintf("%v", x), fmt.Sprintf("%#v", x), q.Describe(c.d)}
		num := fmt.Sprint(x.Value())
		want := []string{c.sample, num + " " + c.ascii, c.sample, num + " " + c.ascii, q.KindName(c.d) + " [" + c.name + "]"}
		if d := cmp.Diff(want, got); d != "" {
			t.Errorf("%s (-want +got):\n%s", c.kind, d)
		}
		if k, ok := q.KindDim(c.kind); !ok || k != c.d {
			t.Errorf("KindDim(%q) = %v, %v; want %v", c.kind, k, ok, c.d)
		}
		for _, s := range got[:4] {
			back, err := q.ParseQuantitySI(s)
			if err != nil || back != x {
				t.Errorf("%q reads back as %v, %v; want %v", s, back, err, x)
			}
		}
	}
}

// TestUnnamedUnitText checks that dimensions outside the fixed set keep
// the SI base-unit form: a frequency or an angular velocity is never
// guessed to be Hz or rad/s, a molar flow is not katal, a specific energy
// is not J/kg (a velocity squared shares it), and no electrical unit is
// named (T alone is the ISO symbol of time).
func TestUnnamedUnitText(t *testing.T) {
	cases := []struct {
		x    q.Quantity
		want string
	}{
		{q.New(50, q.Frequency), "50 s⁻¹"},
		{q.New(50, q.AngularVelocity), "50 s⁻¹"},
		{q.New(2, q.CatalyticActivity), "2 s⁻¹·mol"},
		{q.New(9.81, q.SpecificEnergy), "9.81 m²·s⁻²"},
		{q.New(3, q.AngularMomentum), "3 kg·m²·s⁻¹"},
		{q.New(1.5, q.MagneticFluxDensity), "1.5 kg·s⁻²·A⁻¹"},
		{q.New(230, q.Voltage), "230 kg·m²·s⁻³·A⁻¹"},
		{q.New(1.225, q.Density), "1.225 kg·m⁻³"},
	}
	for _, c := range cases {
		if got := c.x.String(); got != c.want {
			t.Errorf("String of %v = %q, want %q", c.x.Dim(), got, c.want)
		}
		back, err := q.ParseQuantitySI(c.want)
		if err != nil || back != c.x {
			t.Errorf("%q reads back as %v, %v", c.want, back, err)
		}
	}
}

// TestParseNamedUnitNotISO checks that a unit text that is exactly a name
// of the set reads as that unit, not as ISO dimension symbols: "N·m" is
// the newton metre, not amount of substance times length, while the ISO
// form keeps its meaning elsewhere.
func TestParseNamedUnitNotISO(t *testing.T) {
	cases := []struct {
		in   string
		want q.Dim
	}{
		{"12 N·m", q.Torque},
		{"12 N*m", q.Torque},
		{"2 Pa*s", q.DynamicViscosity},
		{"4186 J/(kg*K)", q.SpecificHeatCapacity},
		{"12 L N", q.MustParseDim("L N")}, // the ISO form: amount of substance times length
		{"3 J", q.LuminousIntensity},      // J alone is the ISO symbol, as before
		{"3 T", q.Time},
	}
	for _, c := range cases {
		x, err := q.ParseQuantitySI(c.in)
		if err != nil || x.Dim() != c.want {
			t.Errorf("ParseQuantitySI(%q) = %v, %v; want dimension %v", c.in, x, err, c.want)
		}
	}
	for _, s := range []string{"1 Pa·s·m", "1 N·m ", "1 W/(m K)"} {
		if s == "1 N·m " { // trailing space is trimmed: still the newton metre
			if x, err := q.ParseQuantitySI(s); err != nil || x.Dim() != q.Torque {
				t.Errorf("ParseQuantitySI(%q) = %v, %v", s, x, err)
			}
			continue
		}
		if x, err := q.ParseQuantitySI(s); err == nil {
			t.Errorf("ParseQuantitySI(%q) = %v, want an error (not a spelling String writes)", s, x)
		}
	}
}

// TestNamedUnitRoundTrip: for every named kind and any finite value,
// String, ASCII, %v, %#v and MarshalText read back through
// ParseQuantitySI to the same bits and dimension.
func TestNamedUnitRoundTrip(t *testing.T) {
	kinds := q.Kinds()
	rapid.Check(t, func(t *rapid.T) {
		k := kinds[rapid.IntRange(0, len(kinds)-1).Draw(t, "kind")]
		v := rapid.Float64().Filter(func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }).Draw(t, "v")
		x := q.New(v, k.Dim)
		b, err := x.MarshalText()
		if err != nil {
			t.Fatalf("MarshalText(%v): %v", x, err)
		}
		for _, s := range []string{x.String(), x.ASCII(), fmt.Sprintf("%v", x), fmt.Sprintf("%#v", x), string(b)} {
			back, err := q.ParseQuantitySI(s)
			if err != nil || back.Dim() != x.Dim() || math.Float64bits(back.Value()) != math.Float64bits(v) {
				t.Fatalf("%s: %q reads back as %v, %v", k.Name, s, back, err)
			}
		}
	})
}

// TestFormatNamedUnit checks the Formatter with a compound unit: the
// precision applies to the number only, the unit is kept, and the width
// counts runes.
func TestFormatNamedUnit(t *testing.T) {
	mu := q.New(0.0010016, q.DynamicViscosity)
	cases := []struct {
		format string
		want   string
	}{
		{"%.4g", "0.001002 Pa·s"},
		{"%#.3e", "1.002e-03 Pa*s"},
		{"%-16v|", "0.0010016 Pa·s  |"},
		{"%16v|", "  0.0010016 Pa·s|"},
		{"%+.2g", "+0.001 Pa·s"},
	}
	if got := fmt.Sprintf("%+v", q.New(math.Copysign(0, -1), q.Pressure)); got != "-0 Pa" {
		t.Errorf("%%+v of -0 Pa = %q, want \"-0 Pa\"", got)
	}
	for _, c := range cases {
		if got := fmt.Sprintf(c.format, mu); got != c.want {
			t.Errorf("Sprintf(%q) = %q, want %q", c.format, got, c.want)
		}
	}
	if got := fmt.Sprintf("%.4g", q.New(12.345, q.Energy)); got != "12.35 N·m" {
		t.Errorf("energy %%.4g = %q", got)
	}
}
