package units_test

import (
	"encoding"
	"encoding/json"
	"math"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/units"
)

var (
	_ encoding.TextAppender    = units.Unit{}
	_ encoding.TextAppender    = units.Value{}
	_ encoding.TextUnmarshaler = (*units.Unit)(nil)
	_ encoding.TextUnmarshaler = (*units.Value)(nil)
)

// genUnit draws a unit expression from the table: a product of up to
// three symbols, some prefixed, with small powers.
func genUnit(t *rapid.T) units.Unit {
	syms := units.Symbols()
	n := rapid.IntRange(1, 3).Draw(t, "n")
	u := units.One()
	for range n {
		s := rapid.SampledFrom(syms).Draw(t, "sym")
		if units.Prefixable(s) && rapid.Bool().Draw(t, "prefixed") {
			s = rapid.SampledFrom([]string{"k", "m", "u", "M", "c"}).Draw(t, "prefix") + s
		}
		f, err := units.Parse(s)
		if err != nil {
			continue // an ambiguous prefixed symbol
		}
		if e := rapid.IntRange(-2, 3).Draw(t, "exp"); e != 1 && e != 0 {
			if f, err = f.Pow(e, 1); err != nil {
				continue
			}
		}
		if v, err := u.Mul(f); err == nil {
			u = v
		}
	}
	return u
}

// TestUnitValueTextRoundTrip: Unit and Value read back from their text
// (and JSON) to the same unit and the same bits, and the text is
// String's.
func TestUnitValueTextRoundTrip(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		u := genUnit(t)
		b, err := u.MarshalText()
		if err != nil || string(b) != u.String() {
			t.Fatalf("MarshalText(%v) = %q, %v", u, b, err)
		}
		var u2 units.Unit
		if err := u2.UnmarshalText(b); err != nil || !u2.Equal(u) || u2.String() != u.String() {
			t.Fatalf("%q reads back as %v, %v", b, u2, err)
		}
		x := rapid.Float64().Draw(t, "x")
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return
		}
		v := units.Value{Number: x, Unit: u}
		b, err = v.MarshalText()
		if err != nil || string(b) != v.String() {
			t.Fatalf("MarshalText(%v) = %q, %v", v, b, err)
		}
		var v2 units.Value
		if err := v2.UnmarshalText(b); err != nil || v2.Number != x || !v2.Unit.Equal(u) {
			t.Fatalf("%q reads back as %v, %v", b, v2, err)
		}
		j, err := json.Marshal(v)
		if err != nil {
			t.Fatal(err)
		}
		var v3 units.Value
		if err := json.Unmarshal(j, &v3); err != nil || v3.Number != x || !v3.Unit.Equal(u) {
			t.Fatalf("JSON %s reads back as %v, %v", j, v3, err)
		}
	})
}

func TestValueNonFinite(t *testing.T) {
	for _, x := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		if _, err := json.Marshal(units.Value{Number: x, Unit: units.MustParse("m")}); err == nil {
			t.Errorf("%v encoded", x)
		}
	}
}
