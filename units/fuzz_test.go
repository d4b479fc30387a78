package units_test

import (
	"testing"

	"similis.dev/similis/units"
)

var seedExprs = []string{
	"kg/(m·s)", "kg m^-1 s^-2", "kg*m**-1*s**-2", "N·m", "W/(m²·K)", "BTU/(h*ft^2*degF)",
	"ft^3/min", "m/s²", "1/s", "s⁻¹", "MPa·m^(1/2)", "ksi*in^0.5", "L/min", "°C", "Δ°F", "µm",
	"W/m K", "(((m", "m^(1/0)", "12000 BTU/h", "rpm/rev", "m^-0.5", "\xff", "",
}

// FuzzParse checks that Parse never panics and that what it accepts
// spells back to an equal unit.
func FuzzParse(f *testing.F) {
	for _, s := range seedExprs {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		u, err := units.Parse(s)
		if err != nil {
			return
		}
		for _, style := range []units.Style{units.ASCII, units.Unicode} {
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
