package units_test

import (
	"errors"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/units"
)

// TestValueDigitGroups: the SI Brochure, 9th ed. (2019), §5.4.4, groups
// digits in threes separated by a thin space; such a number is one
// number. Two numbers separated by an ordinary space are refused.
func TestValueDigitGroups(t *testing.T) {
	ok := []struct {
		in   string
		want float64
		unit string
	}{
		{"101\u2009325 Pa", 101325, "Pa"},
		{"101\u202f325 Pa", 101325, "Pa"},
		{"1\u2009013.25 hPa", 1013.25, "hPa"},
		{"3.141\u2009592\u200965", 3.14159265, "1"},
		{"-12\u2009345.678\u20099e3 m", -12345.6789e3, "m"},
		{"0.000\u200901 m", 0.00001, "m"},
		{"998.2 kg/m^3", 998.2, "kg/m^3"},
	}
	for _, c := range ok {
		v, err := units.ParseValue(c.in)
		if err != nil {
			t.Errorf("ParseValue(%q): %v", c.in, err)
			continue
		}
		if v.Number != c.want || !v.Unit.Equal(units.MustParse(c.unit)) {
			t.Errorf("ParseValue(%q) = %v, want %v %s", c.in, v, c.want, c.unit)
		}
	}
	bad := []struct {
		in     string
		offset int
	}{
		{"101 325 Pa", 4},      // ordinary space: two numbers
		{"101\u00a0325 Pa", 5}, // no-break space: two numbers
		{"1\u20090000 Pa", 8},  // a group of four
		{"1234\u2009567 Pa", 4},
		{"12\u200934 Pa", 7},      // a short last group in the integer part
		{"0.12\u20093456 m", 4},   // a short group before another in the fraction
		{"101\u2009 Pa", 3},       // separator not between digits
		{"101\u2009\u2009325", 3}, // doubled separator
		{"1e-400 m", 0},           // underflows to zero
	}
	for _, c := range bad {
		_, err := units.ParseValue(c.in)
		var ve *units.Error
		if !errors.As(err, &ve) {
			t.Errorf("ParseValue(%q) = %v, want a *units.Error", c.in, err)
			continue
		}
		if ve.Offset != c.offset {
			t.Errorf("ParseValue(%q): offset %d, want %d (%v)", c.in, ve.Offset, c.offset, err)
		}
	}
}

// TestNumberAfterUnit: a number after a unit symbol is neither an
// exponent nor a factor the writer meant; it is refused.
func TestNumberAfterUnit(t *testing.T) {
	for _, in := range []string{"12 kn 3", "1 m 2", "1 kg m 3"} {
		_, err := units.ParseValue(in)
		if !errors.Is(err, units.ErrAmbiguous) {
			t.Errorf("ParseValue(%q) = %v, want ErrAmbiguous", in, err)
		}
	}
	for _, in := range []string{"m 3", "kg 1000"} {
		if _, err := units.Parse(in); !errors.Is(err, units.ErrAmbiguous) {
			t.Errorf("Parse(%q) = %v, want ErrAmbiguous", in, err)
		}
	}
	// A number first is a scaled unit, as before.
	if _, err := units.Parse("12000 BTU/h"); err != nil {
		t.Error(err)
	}
}

// TestAmbiguousPrefixed: SI-prefixed symbols that data sheets use for
// other units (common practice) are refused, unless a table defines them.
func TestAmbiguousPrefixed(t *testing.T) {
	for _, sym := range []string{"PS", "kt", "pt", "Pt", "mt", "ct", "at"} {
		_, err := units.Parse(sym)
		var pe *units.Error
		if !errors.Is(err, units.ErrAmbiguous) || !errors.As(err, &pe) || pe.Symbol != sym {
			t.Errorf("Parse(%q) = %v, want ErrAmbiguous naming the symbol", sym, err)
		}
		if _, err := units.Parse("k" + "W/" + sym); sym != "kt" && sym != "mt" && err == nil {
			t.Errorf("Parse(kW/%s) accepted", sym)
		}
	}
	// SI meanings that stay: the picosecond, the nanometre, the kilopascal.
	for _, sym := range []string{"ps", "nm", "kPa", "cP", "cSt", "MPa"} {
		if _, err := units.Parse(sym); err != nil {
			t.Errorf("Parse(%q): %v", sym, err)
		}
	}
	tab := units.NewTable()
	// Metric horsepower: 75 kgf·m/s = 735.49875 W (exact by definition of
	// the kilogram-force, NIST SP 811 (2008), App. B.9).
	if err := tab.Define("PS", "75 kgf*m/s"); err != nil {
		t.Fatal(err)
	}
	got, err := tab.Convert(1, "PS", "W")
	if err != nil || cmp.Diff(735.49875, got, cmp.Comparer(func(a, b float64) bool { return a-b < 1e-9 && b-a < 1e-9 })) != "" {
		t.Errorf("1 PS = %v W, %v; want 735.49875", got, err)
	}
}

// TestDegreeSpace: "20 ° C" is not a degree of angle times a coulomb.
func TestDegreeSpace(t *testing.T) {
	for _, in := range []string{"20 ° C", "20 ° F", "1 °  K"} {
		if _, err := units.ParseValue(in); !errors.Is(err, units.ErrAmbiguous) {
			t.Errorf("ParseValue(%q) = %v, want ErrAmbiguous", in, err)
		}
	}
	if _, err := units.ParseValue("20 °C"); err != nil {
		t.Error(err)
	}
}

// TestDefineReadsBack: every name Define accepts parses back to the
// unit it defines.
func TestDefineReadsBack(t *testing.T) {
	tab := units.NewTable()
	for _, name := range []string{"%x", "′a", "x y", "", "1a", "a/b"} {
		if err := tab.Define(name, "m"); err == nil {
			t.Errorf("Define(%q) accepted", name)
		}
	}
	for _, name := range []string{"TR", "furlong", "Ωx", "rev_s"} {
		if err := tab.Define(name, "12000 BTU/h"); err != nil {
			t.Errorf("Define(%q): %v", name, err)
			continue
		}
		if u, err := tab.Parse(name); err != nil || u.String() != name {
			t.Errorf("Parse(%q) = %v, %v", name, u, err)
		}
	}
}
