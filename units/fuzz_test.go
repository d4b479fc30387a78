package units_test

import (
	"encoding/json"
	"math"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

var seedExprs = []string{
	"kg/(m·s)", "kg m^-1 s^-2", "kg*m**-1*s**-2", "N·m", "W/(m²·K)", "BTU/(h*ft^2*degF)",
	"ft^3/min", "m/s²", "1/s", "s⁻¹", "MPa·m^(1/2)", "ksi*in^0.5", "L/min", "°C", "Δ°F", "µm",
	"W/m K", "(((m", "m^(1/0)", "12000 BTU/h", "rpm/rev", "m^-0.5", "\xff", "",
	"% % % 9 % % % % %", // a crasher: its factor and its spelling's differed in the last bit; now refused (a number after a unit)
	"9 % % % % % % % %", // the same factors with the number first
}

// FuzzParse checks that Parse never panics and that what it accepts
// spells back to an equal unit: same dimension, angles and temperature
// role, and a factor equal to Equal's tolerance (1e-14 relative), since
// a spelling's numeric literal is the product of the numbers written,
// rounded once more.
func FuzzParse(f *testing.F) {
	for _, s := range seedExprs {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		u, err := units.Parse(s)
		if err != nil {
			return
		}
		for _, style := range []quantity.Style{quantity.ASCII, quantity.Unicode} {
			back, err := units.Parse(u.Format(style))
			if err != nil || !back.Equal(u) {
				t.Fatalf("Parse(%q) = %v; its %v spelling %q reparses to %v, %v", s, u, style, u.Format(style), back, err)
			}
		}
	})
}

// FuzzParseValue checks that the quantity parser never panics and that an
// accepted value round-trips through its text form.
func FuzzParseValue(f *testing.F) {
	for _, s := range []string{"12.5 kn", "101.325 kPa", "20 °C", "3.2e-3 Pa·s", "12kn", "-5 degF", "1e400 m", "1.5", ". m", "+.5e-3 psi"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, err := units.ParseValue(s)
		if err != nil {
			return
		}
		b, err := v.MarshalText()
		if err != nil {
			return // NaN and ±Inf are not encoded
		}
		var back units.Value
		if err := back.UnmarshalText(b); err != nil || back.Number != v.Number || !back.Unit.Equal(v.Unit) {
			t.Fatalf("ParseValue(%q) = %v; text %q reparses to %v, %v", s, v, b, back, err)
		}
	})
}

// FuzzDefine checks that a user table never panics and that a name Define
// accepts parses back to the unit it was defined as.
func FuzzDefine(f *testing.F) {
	for _, c := range [][2]string{{"TR", "12000 BTU/h"}, {"%x", "m"}, {"dTC", "Δ°C"}, {"PS", "75 kgf*m/s"}, {"", "m"}, {"a b", "s"}, {"ft", "m"}, {"x", "x"}} {
		f.Add(c[0], c[1])
	}
	f.Fuzz(func(t *testing.T, name, expr string) {
		tab := units.NewTable()
		if err := tab.Define(name, expr); err != nil {
			return
		}
		u, err := tab.Parse(name)
		if err != nil {
			t.Fatalf("Define(%q, %q) accepted but Parse(%q): %v", name, expr, name, err)
		}
		want, err := tab.Parse(expr)
		if err != nil {
			t.Fatalf("Define(%q, %q) accepted but the expression does not parse: %v", name, expr, err)
		}
		if !u.Equal(want) {
			t.Fatalf("%q = %v, defined as %q = %v", name, u, expr, want)
		}
		if _, err := tab.Parse(name + "/" + name); err != nil {
			t.Fatalf("%q/%q: %v", name, name, err)
		}
	})
}

// FuzzUnmarshal checks that Unit and Value text and JSON decoding never
// panic and that what they accept encodes back to what decodes the same.
func FuzzUnmarshal(f *testing.F) {
	for _, s := range append(seedExprs, "12.5 kn", "101\u2009325 Pa", "101 325 Pa", `"m"`, "1e-400 m", "NaN m") {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		var u units.Unit
		if err := u.UnmarshalText([]byte(s)); err == nil {
			b, err := u.MarshalText()
			var back units.Unit
			if err != nil || back.UnmarshalText(b) != nil || !back.Equal(u) {
				t.Fatalf("unit %q → %q → %v", s, b, back)
			}
		}
		var v units.Value
		if err := v.UnmarshalText([]byte(s)); err == nil {
			if math.IsNaN(v.Number) || math.IsInf(v.Number, 0) {
				t.Fatalf("value %q decoded to %v", s, v.Number)
			}
			b, err := v.MarshalText()
			var back units.Value
			if err != nil || back.UnmarshalText(b) != nil || back.Number != v.Number || !back.Unit.Equal(v.Unit) {
				t.Fatalf("value %q → %q → %v", s, b, back)
			}
		}
		var j units.Value
		_ = json.Unmarshal([]byte(s), &j)
	})
}

// FuzzFlag checks that flags never panic and hold only values of their
// dimension and temperature role.
func FuzzFlag(f *testing.F) {
	for _, s := range []string{"12 kn", "20 °C", "20 Δ°C", "293.15 K", "3 m", "", "-h", "1e999 kn"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		speed := units.NewFlag(quantity.Velocity, units.MustParseValue("10 kn"))
		if speed.Set(s) == nil && speed.Value.Unit.Dim() != quantity.Velocity {
			t.Fatalf("speed flag took %q", s)
		}
		temp := units.NewFlag(quantity.Temperature, units.MustParseValue("15 °C"))
		if temp.Set(s) == nil && (temp.Value.Unit.Dim() != quantity.Temperature || temp.Value.Unit.IsInterval()) {
			t.Fatalf("temperature flag took %q", s)
		}
		// Filled from text or JSON, the same checks hold.
		flow := units.NewFlag(quantity.VolumeFlowRate, units.MustParseValue("1 L/s"))
		if flow.UnmarshalText([]byte(s)) == nil && flow.Value.Unit.Dim() != quantity.VolumeFlowRate {
			t.Fatalf("flow flag took %q from text", s)
		}
		js, _ := json.Marshal(s)
		temp = units.NewFlag(quantity.Temperature, units.MustParseValue("15 °C"))
		if json.Unmarshal(js, temp) == nil && (temp.Value.Unit.Dim() != quantity.Temperature || temp.Value.Unit.IsInterval()) {
			t.Fatalf("temperature flag took %q from JSON", s)
		}
	})
}
