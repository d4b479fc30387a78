package quantity_test

import (
	"encoding"
	"encoding/json"
	"fmt"
	"math"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	q "similis.dev/similis/quantity"
)

var (
	_ encoding.TextAppender    = q.Dimensionless
	_ encoding.TextAppender    = q.Quantity{}
	_ encoding.TextUnmarshaler = (*q.Dim)(nil)
	_ encoding.TextUnmarshaler = (*q.Quantity)(nil)
)

// TestQuantityJSON: a Quantity used to encode as {} and lose its value.
func TestQuantityJSON(t *testing.T) {
	type row struct {
		P q.Quantity `json:"p"`
		D q.Dim      `json:"d"`
	}
	in := row{P: q.New(101325, q.Pressure), D: q.DynamicViscosity}
	b, err := json.Marshal(in)
	if err != nil {
		t.Fatal(err)
	}
	if want := `{"p":"101325 Pa","d":"L⁻¹ M T⁻¹"}`; string(b) != want {
		t.Errorf("json = %s, want %s", b, want)
	}
	var out row
	if err := json.Unmarshal(b, &out); err != nil {
		t.Fatal(err)
	}
	eq := cmp.Options{cmp.Comparer(func(a, b q.Quantity) bool { return a == b }), cmp.Comparer(func(a, b q.Dim) bool { return a == b })}
	if diff := cmp.Diff(in, out, eq); diff != "" {
		t.Error(diff)
	}
	if _, err := json.Marshal(q.New(math.NaN(), q.Length)); err == nil {
		t.Error("NaN encoded")
	}
}

// TestTextRoundTrip: every Dim and every finite Quantity reads back from
// its text to the same bits, and the text is String's.
func TestTextRoundTrip(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		d := genDim(t, "d")
		b, err := d.MarshalText()
		if err != nil || string(b) != d.String() {
			t.Fatalf("MarshalText(%v) = %q, %v", d, b, err)
		}
		var d2 q.Dim
		if err := d2.UnmarshalText(b); err != nil || d2 != d {
			t.Fatalf("%q reads back as %v, %v", b, d2, err)
		}
		v := rapid.Float64().Draw(t, "v")
		if math.IsInf(v, 0) || math.IsNaN(v) {
			return
		}
		x := q.New(v, d)
		b, err = x.MarshalText()
		if err != nil || string(b) != x.String() {
			t.Fatalf("MarshalText(%v) = %q, %v", x, b, err)
		}
		var x2 q.Quantity
		if err := x2.UnmarshalText(b); err != nil || x2 != x || math.Signbit(x2.Value()) != math.Signbit(v) {
			t.Fatalf("%q reads back as %v, %v", b, x2, err)
		}
		b, _ = x.AppendText([]byte("p="))
		if string(b) != "p="+x.String() {
			t.Fatalf("AppendText = %q", b)
		}
	})
}

func TestParseQuantitySIErrors(t *testing.T) {
	for _, s := range []string{"", "kg", "NaN kg", "Inf", "1e-400 m", "1 furlong", "1e999 m"} {
		if _, err := q.ParseQuantitySI(s); err == nil {
			t.Errorf("ParseQuantitySI(%q) accepted", s)
		}
	}
	got, err := q.ParseQuantitySI("1.225 kg m^-3")
	if err != nil || got != q.New(1.225, q.Density) {
		t.Errorf("ASCII form: %v, %v", got, err)
	}
}

// FuzzQuantityText checks that decoding a Quantity, a Dim or a Rat never panics
// and that what is accepted encodes back to the same bits.
func FuzzQuantityText(f *testing.F) {
	for _, s := range []string{"1.225 kg·m⁻³", "1.225 kg m^-3", "2.5", "101325 L^-1 M T^-2", "NaN", "1e-400 m", "-0 m", "3 m^(1/2)", "", "-6/4", "1/0", "9223372036854775807/-1", "138434.1 N", "101325 Pa", "2 W", "3 mol"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		var x q.Quantity
		if err := x.UnmarshalText([]byte(s)); err == nil {
			if math.IsNaN(x.Value()) || math.IsInf(x.Value(), 0) {
				t.Fatalf("%q decoded to %v", s, x)
			}
			b, err := x.MarshalText()
			var back q.Quantity
			if err != nil || back.UnmarshalText(b) != nil || back != x || math.Signbit(back.Value()) != math.Signbit(x.Value()) {
				t.Fatalf("%q → %q → %v", s, b, back)
			}
		}
		var r q.Rat
		if err := r.UnmarshalText([]byte(s)); err == nil {
			b, _ := r.MarshalText()
			var back q.Rat
			if back.UnmarshalText(b) != nil || back != r || r.Den() <= 0 {
				t.Fatalf("rat %q → %q → %v", s, b, back)
			}
		}
		var d q.Dim
		if err := d.UnmarshalText([]byte(s)); err == nil {
			b, _ := d.MarshalText()
			var back q.Dim
			if back.UnmarshalText(b) != nil || back != d {
				t.Fatalf("dim %q → %q → %v", s, b, back)
			}
		}
	})
}

// TestNamedUnitText checks that a force, a pressure and a power print
// with the SI special names N, Pa and W (SI Brochure, 9th ed. (2019),
// Table 4), in String, ASCII, %v, %#v and MarshalText, that each reads
// back to the same bits, that energy prints N·m (torque shares its
// dimension, and its unit is N·m, not J), and that the dimensions whose
// ISO symbols are N and J still print as mol and cd.
func TestNamedUnitText(t *testing.T) {
	cases := []struct {
		q    q.Quantity
		want string
	}{
		{q.New(138434.1, q.Force), "138434.1 N"},
		{q.New(101325, q.Pressure), "101325 Pa"},
		{q.New(-2.5e6, q.Power), "-2.5e+06 W"},
		{q.New(12, q.Energy), "12 N·m"},
		{q.New(3, q.Amount), "3 mol"},
		{q.New(3, q.LuminousIntensity), "3 cd"},
		{q.New(1.225, q.Density), "1.225 kg·m⁻³"},
	}
	for _, c := range cases {
		texts := []string{c.q.String(), c.q.ASCII(), fmt.Sprintf("%v", c.q), fmt.Sprintf("%#v", c.q)}
		if b, err := c.q.MarshalText(); err == nil {
			texts = append(texts, string(b))
		}
		if texts[0] != c.want {
			t.Errorf("String = %q, want %q", texts[0], c.want)
		}
		for _, s := range texts {
			back, err := q.ParseQuantitySI(s)
			if err != nil || back != c.q {
				t.Errorf("%q reads back as %v, %v; want %v", s, back, err, c.q)
			}
		}
	}
	if got := fmt.Sprintf("%.4g", q.New(138434.1, q.Force)); got != "1.384e+05 N" {
		t.Errorf("%%.4g of a force = %q", got)
	}
}
