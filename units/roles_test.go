package units_test

import (
	"errors"
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// TestRolesSurvive: the temperature role of a unit survives unit
// algebra, user tables, flags and text round trips.
func TestRolesSurvive(t *testing.T) {
	tab := units.NewTable()
	if err := tab.Define("dTC", "Δ°C"); err != nil {
		t.Fatal(err)
	}
	if _, err := tab.Convert(10, "dTC", "°C"); !errors.Is(err, units.ErrTemperature) {
		t.Errorf("a user difference converted to a level: %v", err)
	}
	if x, err := tab.Convert(10, "dTC", "ΔdegF"); err != nil || math.Abs(x-18) > 1e-12 {
		t.Errorf("10 dTC = %v Δ°F, %v", x, err)
	}
	degC := units.MustParse("°C")
	same, err := degC.Mul(units.One())
	if err != nil || !same.IsScale() || same.String() != "degC" {
		t.Fatalf("°C·1 = %v (scale %v), %v", same, same.IsScale(), err)
	}
	for _, u := range []units.Unit{same, units.MustParse(same.String())} {
		if x, err := units.ConvertUnits(20, u, units.MustParse("K")); err != nil || math.Abs(x-293.15) > 1e-12 {
			t.Errorf("20 %v = %v K, %v", u, x, err)
		}
	}
	f := units.NewFlag(quantity.Temperature, units.MustParseValue("15 °C"))
	if err := f.Set("20 Δ°C"); !errors.Is(err, units.ErrTemperature) {
		t.Errorf("a level flag took a difference: %v", err)
	}
	if err := f.Set("293.15 K"); err != nil {
		t.Errorf("a level flag refused kelvin: %v", err)
	}
	d := units.NewFlag(quantity.Temperature, units.MustParseValue("5 Δ°C"))
	if err := d.Set("20 °C"); !errors.Is(err, units.ErrTemperature) {
		t.Errorf("a difference flag took a level: %v", err)
	}
	m := units.MustParse("m")
	if z, err := m.Pow(0, 1); err != nil || z.String() != "1" || z.Format(quantity.Unicode) != "1" {
		t.Errorf("m^0 = %q / %q, %v", z.String(), z.Format(quantity.Unicode), err)
	}
	if s := units.MustParse("m*s").Format(quantity.Style(9)); s != "m·s" {
		t.Errorf("an undefined style writes %q", s)
	}
	var zero units.Unit
	if !zero.Equal(units.One()) || zero.Factor() != 1 {
		t.Errorf("the zero Unit: factor %v", zero.Factor())
	}
	if x, err := units.ConvertUnits(3, zero, units.One()); err != nil || x != 3 {
		t.Errorf("3 in the zero Unit = %v, %v", x, err)
	}
}

// TestAlgebraSpellingsParse: every spelling unit algebra produces parses
// back to the same unit, temperature role included (a property over the
// algebra, not only over the parser).
func TestAlgebraSpellingsParse(t *testing.T) {
	syms := append(units.Symbols(), "°C", "Δ°C", "degF", "ΔdegF")
	rapid.Check(t, func(t *rapid.T) {
		u := units.MustParse(rapid.SampledFrom(syms).Draw(t, "first"))
		for range rapid.IntRange(0, 3).Draw(t, "ops") {
			o, err := units.Parse(rapid.SampledFrom(syms).Draw(t, "sym"))
			if err != nil {
				continue
			}
			switch rapid.IntRange(0, 2).Draw(t, "op") {
			case 0:
				u, err = u.Mul(o)
			case 1:
				u, err = u.Div(o)
			default:
				u, err = u.Pow(rapid.IntRange(-3, 3).Draw(t, "n"), rapid.IntRange(1, 2).Draw(t, "d"))
			}
			if err != nil {
				return // refused with an error: fine
			}
		}
		for _, style := range []quantity.Style{quantity.ASCII, quantity.Unicode} {
			s := u.Format(style)
			back, err := units.Parse(s)
			if err != nil || !back.Equal(u) {
				t.Logf("factors %v %v rel %g", u.Factor(), back.Factor(), (u.Factor()-back.Factor())/u.Factor())
				t.Fatalf("%v spelling %q of %v parses to %v (scale %v, interval %v), %v; want scale %v, interval %v",
					style, s, u, back, back.IsScale(), back.IsInterval(), err, u.IsScale(), u.IsInterval())
			}
		}
	})
}
