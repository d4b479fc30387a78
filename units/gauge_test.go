package units_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// psiPa is the pascal value of one psi, NIST SP 811 (2008) Appendix B:
// 6.894 757 E+03 (exactly 4.4482216152605 N / 0.0254² m²).
const psiPa = 4.4482216152605 / (0.0254 * 0.0254)

func TestParseGauge(t *testing.T) {
	tests := []struct {
		text string
		pa   float64 // the gauge level in Pa, by hand
	}{
		{"40 kPa(g)", 40e3},
		{"40kPa(g)", 40e3},
		{"40 kPa (g)", 40e3},
		{"12.5 psig", 12.5 * psiPa},
		{"12.5psig", 12.5 * psiPa},
		{"0.8 barg", 0.8e5},
		{"25 inH2O(g)", 25 * 0.0254 * 1000 * 9.80665}, // conventional inch of water
		{"-3 kPa(g)", -3e3},                           // a suction gauge reads below ambient
		{"2 psi(g)", 2 * psiPa},
	}
	for _, tc := range tests {
		g, err := units.ParseGauge(tc.text)
		if err != nil {
			t.Errorf("ParseGauge(%q): %v", tc.text, err)
			continue
		}
		if got := g.Relative().Value(); math.Abs(got-tc.pa) > 1e-12*math.Abs(tc.pa) {
			t.Errorf("ParseGauge(%q).Relative() = %v Pa, want %v", tc.text, got, tc.pa)
		}
		if math.Abs(psiPa-6894.757) > 5e-4 {
			t.Fatalf("psi %v Pa differs from NIST SP 811", psiPa)
		}
	}
	for _, bad := range []struct{ text, says string }{
		{"40 kPa", "no gauge mark"},
		{"40 m(g)", "must be a pressure"},
		{"x kPa(g)", ""},
		{"40 kPa(g)(g)", "ParseGauge"},
		{"40 (g)", "must be a pressure"},
		{"", ""},
		{strings.Repeat("9", 5000) + " kPa(g)", "too long"},
	} {
		_, err := units.ParseGauge(bad.text)
		if err == nil || !strings.Contains(err.Error(), bad.says) {
			t.Errorf("ParseGauge(%.20q) error %v, want one saying %q", bad.text, err, bad.says)
		}
	}
}

// TestGaugeNeverAbsolute checks that text holding a gauge level is
// refused wherever an absolute pressure is read, with the way to supply
// the reference, and that "kPa (g)" is not read as kilopascal-gram.
func TestGaugeNeverAbsolute(t *testing.T) {
	for _, s := range []string{"12.5 psig", "0.8 barg", "40 kPa(g)", "40 kPa (g)", "3 mbar(g)"} {
		_, err := units.ParseValue(s)
		if !errors.Is(err, units.ErrGauge) || !errors.Is(err, quantity.ErrParse) || errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), "Gauge.Absolute") {
			t.Errorf("ParseValue(%q) error %v, want a gauge refusal", s, err)
		}
		if _, err := units.ParseQuantity(s); !errors.Is(err, units.ErrGauge) {
			t.Errorf("ParseQuantity(%q) error %v, want a gauge refusal", s, err)
		}
	}
}

func TestGaugeAbsolute(t *testing.T) {
	baro := units.MustParseValue("1002 hPa").Quantity()
	g := units.MustParseGauge("12.5 psig")
	p, err := g.Absolute(baro)
	if err != nil {
		t.Fatal(err)
	}
	// By hand: 12.5 × 6894.757 Pa + 100 200 Pa = 186 384.47 Pa.
	if want := 12.5*psiPa + 100200; math.Abs(p.Value()-want) > 1e-9 || p.Dim() != quantity.Pressure {
		t.Errorf("Absolute = %v, want %v Pa", p, want)
	}
	if _, err := (units.Gauge{Number: 1, Unit: units.MustParse("m")}).Sub(g); !errors.Is(err, units.ErrGauge) {
		t.Errorf("Sub of a gauge level in metres: %v, want ErrGauge", err)
	}
	for _, p := range []float64{math.Inf(1), math.NaN(), -1} {
		if _, err := units.GaugeOf(quantity.New(p, quantity.Pressure), units.StandardReference(), units.MustParse("kPa")); !errors.Is(err, units.ErrGauge) {
			t.Errorf("GaugeOf(%v Pa): %v, want ErrGauge", p, err)
		}
	}
	if std := units.StandardReference(); std.Value() != 101325 || std.Dim() != quantity.Pressure {
		t.Errorf("StandardReference = %v, want 101325 Pa (ISO 2533)", std)
	}
	// Two gauge levels on one ambient: the difference is the reference-free Δp.
	dp, err := units.MustParseGauge("30 psig").Sub(units.MustParseGauge("2 barg"))
	if err != nil {
		t.Fatal(err)
	}
	if want := 30*psiPa - 2e5; math.Abs(dp.Value()-want) > 1e-9 {
		t.Errorf("Sub = %v, want %v Pa", dp, want)
	}
	for _, tc := range []struct {
		g   string
		ref quantity.Quantity
		say string
	}{
		{"12.5 psig", quantity.New(10, quantity.Velocity), "must be an absolute pressure"},
		{"12.5 psig", quantity.New(0, quantity.Pressure), "not a finite positive"},
		{"12.5 psig", quantity.New(math.NaN(), quantity.Pressure), "not a finite positive"},
		{"-120 kPa(g)", units.StandardReference(), "below vacuum"},
		{"", units.StandardReference(), "must be a pressure"}, // a Gauge built by hand in metres
		{"NaN", units.StandardReference(), "not a finite number"},
	} {
		var err error
		switch tc.g {
		case "":
			_, err = units.Gauge{Number: 3, Unit: units.MustParse("m")}.Absolute(tc.ref)
		case "NaN":
			_, err = units.Gauge{Number: math.NaN(), Unit: units.MustParse("kPa")}.Absolute(tc.ref)
		default:
			_, err = units.MustParseGauge(tc.g).Absolute(tc.ref)
		}
		if !errors.Is(err, units.ErrGauge) || !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), tc.say) {
			t.Errorf("%s.Absolute(%v) error %v, want one saying %q", tc.g, tc.ref, err, tc.say)
		}
	}
}

// TestGaugeRoundTrip: text and absolute round trips (rapid).
func TestGaugeRoundTrip(t *testing.T) {
	us := []string{"kPa", "psi", "bar", "mbar", "inH2O", "Pa", "MPa"}
	rapid.Check(t, func(t *rapid.T) {
		u := units.MustParse(rapid.SampledFrom(us).Draw(t, "unit"))
		x := rapid.Float64Range(-1e3, 1e3).Draw(t, "x")
		g := units.Gauge{Number: x, Unit: u}
		b, err := g.MarshalText()
		if err != nil {
			t.Fatal(err)
		}
		var back units.Gauge
		if err := back.UnmarshalText(b); err != nil {
			t.Fatalf("%q: %v", b, err)
		}
		if back.Number != x || !back.Unit.Equal(u) {
			t.Fatalf("%q read back as %v", b, back)
		}
		ref := quantity.New(rapid.Float64Range(5e4, 1.1e5).Draw(t, "ref"), quantity.Pressure)
		p := quantity.New(rapid.Float64Range(1, 1e7).Draw(t, "p"), quantity.Pressure)
		g2, err := units.GaugeOf(p, ref, u)
		if err != nil {
			t.Fatal(err)
		}
		p2, err := g2.Absolute(ref)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(p2.Value()-p.Value()) > 1e-9*(p.Value()+ref.Value()) {
			t.Fatalf("GaugeOf then Absolute: %v → %v → %v", p, g2, p2)
		}
	})
}

// FuzzGauge checks that ParseGauge never panics and that what it accepts
// writes back to text that reads as the same number and unit.
func FuzzGauge(f *testing.F) {
	for _, s := range []string{"40 kPa(g)", "12.5 psig", "0.8 barg", "-3 kPa (g)", "1e3 inH2O(g)", "40 kPa", "(g)", "psig", "1 (g)(g)", "1 m(g)"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		g, err := units.ParseGauge(s)
		if err != nil {
			return
		}
		if g.Unit.Dim() != quantity.Pressure {
			t.Fatalf("ParseGauge(%q) unit %v is not a pressure", s, g.Unit)
		}
		b, err := g.MarshalText()
		if err != nil {
			return // not finite
		}
		back, err := units.ParseGauge(string(b))
		if err != nil || back.Number != g.Number || !back.Unit.Equal(g.Unit) {
			t.Fatalf("ParseGauge(%q) = %v, written %q, read back %v %v", s, g, b, back, err)
		}
	})
}

// TestGaugeOffsetIntoInput: an error's offset counts in the text as given
// (its Input), leading spaces included: in " 40 kPa" the unit, which lacks
// the gauge mark, follows the number at byte 3 of the input (after " 40"),
// as counted by hand.
func TestGaugeOffsetIntoInput(t *testing.T) {
	for _, c := range []struct {
		in   string
		want int
	}{{"40 kPa", 2}, {" 40 kPa", 3}, {"  40 kPa", 4}} {
		_, err := units.ParseGauge(c.in)
		var e *units.Error
		if !errors.As(err, &e) || e.Offset != c.want {
			t.Errorf("ParseGauge(%q): %v; want the offset %d", c.in, err, c.want)
		}
	}
}
