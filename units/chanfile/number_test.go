package chanfile

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"pgregory.net/rapid"
)

// TestPlainDecimal: the in-place reading of plain decimals gives
// bit for bit what strconv.ParseFloat gives, and leaves every other
// field to it.
func TestPlainDecimal(t *testing.T) {
	for _, c := range []struct {
		f  string
		ok bool
	}{
		{"0", true}, {"-0", true}, {"+5", true}, {"1.", true}, {".5", true}, {"-.25", true},
		{"0.1", true}, {"123456789012345", true}, {"0.30000000000001", true}, {"9007199.254740993", false},
		{"1234567890123456", false}, {"1e3", false}, {"1_0", false}, {".", false}, {"-", false},
		{"", false}, {"1.2.3", false}, {"NaN", false}, {"0x1p-2", false}, {" 1", false},
	} {
		x, ok := plainDecimal([]byte(c.f), '.')
		if ok != c.ok {
			t.Errorf("%q: ok %v, want %v", c.f, ok, c.ok)
			continue
		}
		if ok {
			y, err := strconv.ParseFloat(c.f, 64)
			if err != nil || math.Float64bits(x) != math.Float64bits(y) {
				t.Errorf("%q: %v, ParseFloat %v (%v)", c.f, x, y, err)
			}
		}
	}
	// With a decimal comma.
	if x, ok := plainDecimal([]byte("-3,75"), ','); !ok || x != -3.75 {
		t.Errorf("-3,75: %v %v", x, ok)
	}
	if _, ok := plainDecimal([]byte("3.75"), ','); ok {
		t.Error("3.75 read with a decimal comma")
	}
}

// TestPlainDecimalProperty: any sign, digits and point, as written by
// FormatFloat or at random, read alike by both.
func TestPlainDecimalProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		var f string
		if rapid.Bool().Draw(t, "formatted") {
			x := rapid.Float64().Draw(t, "x")
			f = strconv.FormatFloat(x, 'f', rapid.IntRange(-1, 12).Draw(t, "prec"), 64)
		} else {
			f = rapid.StringMatching(`[+-]?[0-9]{0,16}(\.[0-9]{0,16})?`).Draw(t, "f")
		}
		checkPlain(t, f)
	})
}

func checkPlain(t interface{ Fatalf(string, ...any) }, f string) {
	x, ok := plainDecimal([]byte(f), '.')
	if !ok {
		return
	}
	y, err := strconv.ParseFloat(f, 64)
	if err != nil || math.Float64bits(x) != math.Float64bits(y) {
		t.Fatalf("%q: plainDecimal %v, ParseFloat %v (%v)", f, x, y, err)
	}
	if z, ok := plainDecimal([]byte(strings.Replace(f, ".", ",", 1)), ','); !ok || math.Float64bits(z) != math.Float64bits(x) {
		t.Fatalf("%q with a decimal comma: %v %v", f, z, ok)
	}
}

// FuzzPlainDecimal: never a value other than ParseFloat's.
func FuzzPlainDecimal(f *testing.F) {
	for _, s := range []string{"0", "-1.5", "123456789012345", ".5", "1.", "+0.000000000000001"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) { checkPlain(t, s) })
}
