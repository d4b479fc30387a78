package units_test

import (
	"encoding/json"
	"errors"
	"flag"
	"io"
	"math"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

func TestParseValue(t *testing.T) {
	cases := []struct {
		text string
		si   float64
		dim  quantity.Dim
	}{
		{"12.5 kn", 12.5 * 1852 / 3600, quantity.Velocity},          // exact: nmi/h
		{"101.325 kPa", 101325, quantity.Pressure},                  // exact
		{"20 °C", 293.15, quantity.Temperature},                     // exact: scale
		{"3.2e-3 Pa·s", 3.2e-3, quantity.DynamicViscosity},          // exact
		{"12kn", 12 * 1852.0 / 3600, quantity.Velocity},             // no space
		{"  -5 degF ", (-5 + 459.67) * 5 / 9, quantity.Temperature}, // exact by the scale definitions
		{"1500 rpm", 1500 * 2 * math.Pi / 60, quantity.AngularVelocity},
		{"0.5", 0.5, quantity.Dimensionless},
		{"2.5E+3 gpm", 2500 * 231 * 0.0254 * 0.0254 * 0.0254 / 60, quantity.VolumeFlowRate},
	}
	for _, c := range cases {
		q, err := units.ParseQuantity(c.text)
		if err != nil {
			t.Errorf("ParseQuantity(%q): %v", c.text, err)
			continue
		}
		if q.Dim() != c.dim || math.Abs(q.Value()-c.si) > 1e-12*math.Abs(c.si) {
			t.Errorf("ParseQuantity(%q) = %v, want %v %v", c.text, q, c.si, c.dim)
		}
	}
	for _, bad := range []string{"", "kn", "12 knots", "1e400 m", "12 /s", "nan m", "12 kn kn/", "--1 m"} {
		if _, err := units.ParseValue(bad); err == nil {
			t.Errorf("ParseValue(%q) accepted", bad)
		}
	}
	_, err := units.ParseValue("12 knots")
	var pe *units.Error
	if !errors.As(err, &pe) || pe.Symbol != "knots" {
		t.Errorf("ParseValue(12 knots): %v", err)
	}
}

func TestValueText(t *testing.T) {
	v, err := units.ParseValue("12.5 kn")
	if err != nil {
		t.Fatal(err)
	}
	b, err := json.Marshal(struct{ Speed units.Value }{v})
	if err != nil {
		t.Fatal(err)
	}
	if string(b) != `{"Speed":"12.5 kn"}` {
		t.Errorf("JSON = %s", b)
	}
	var back struct{ Speed units.Value }
	if err := json.Unmarshal([]byte(`{"Speed":"3.2e-3 Pa·s"}`), &back); err != nil {
		t.Fatal(err)
	}
	if back.Speed.Number != 3.2e-3 || back.Speed.Unit.Dim() != quantity.DynamicViscosity {
		t.Errorf("unmarshal: %+v", back.Speed)
	}
	if err := json.Unmarshal([]byte(`{"Speed":"3 furlong"}`), &back); err == nil {
		t.Error("unknown unit in JSON accepted")
	}
	if got := v.String(); got != "12.5 kn" {
		t.Errorf("String = %q", got)
	}
	kmh, err := v.In(units.MustParse("km/h"))
	if err != nil || math.Abs(kmh.Number-23.15) > 1e-12 { // 12.5 × 1.852, exact
		t.Errorf("In(km/h) = %v, %v", kmh, err)
	}
	u := units.MustParse("W/(m²·K)")
	tb, _ := u.MarshalText()
	var u2 units.Unit
	if err := u2.UnmarshalText(tb); err != nil || !u2.Equal(u) {
		t.Errorf("Unit text round trip %s: %v", tb, err)
	}
}

func TestFlag(t *testing.T) {
	fs := flag.NewFlagSet("rig", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	speed := units.NewFlag(quantity.Velocity, units.Value{Number: 10, Unit: units.MustParse("kn")})
	fs.Var(speed, "speed", "towing speed")
	if err := fs.Parse([]string{"-speed", "12kn"}); err != nil {
		t.Fatal(err)
	}
	if got := speed.Quantity().Value(); math.Abs(got-12*1852.0/3600) > 1e-12 {
		t.Errorf("speed = %v", got)
	}
	err := fs.Parse([]string{"-speed", "12 kg"})
	if err == nil || !strings.Contains(err.Error(), "want velocity") {
		t.Errorf("-speed 12 kg: %v", err)
	}
	var raw units.Value
	fs.Var(&raw, "any", "any value")
	if err := fs.Parse([]string{"-any", "3 psi"}); err != nil || raw.Unit.Dim() != quantity.Pressure {
		t.Errorf("-any 3 psi: %v %v", raw, err)
	}
}

func TestConversionErrors(t *testing.T) {
	cases := []struct {
		from, to string
		err      error
		text     string
	}{
		{"psi", "m/s", units.ErrIncompatible, "cannot convert psi (pressure, stress [Pa]) to m/s (velocity [m·s⁻¹])"},
		{"rpm", "Hz", units.ErrAngle, "write the target with its angle (rev/s or rad/s"},
		{"Hz", "rpm", units.ErrAngle, "write the source with its angle"},
		{"rad", "1", units.ErrAngle, "plane angle"},
		{"lm", "cd", units.ErrAngle, "solid angle"},
		{"degC", "degF_diff", units.ErrTemperature, "temperature scale (a level)"},
		{"Δ°F", "°C", units.ErrTemperature, "both as differences"},
		{"kg/m^3", "lb/ft^2", units.ErrIncompatible, "density"},
	}
	for _, c := range cases {
		_, err := units.Convert(1, c.from, c.to)
		var ce *units.Error
		if !errors.As(err, &ce) || !errors.Is(err, c.err) || !strings.Contains(err.Error(), c.text) {
			t.Errorf("Convert(%q, %q): %v\nwant %v containing %q", c.from, c.to, err, c.err, c.text)
		}
	}
	if _, err := units.MustParse("psi").ValueOf(quantity.New(1, quantity.Velocity)); err == nil {
		t.Error("ValueOf with the wrong dimension accepted")
	}
}

func TestUnitAlgebra(t *testing.T) {
	ft, s := units.MustParse("ft"), units.MustParse("s")
	lbf := units.MustParse("lbf")
	p, err := lbf.Mul(ft)
	if err != nil {
		t.Fatal(err)
	}
	p, err = p.Div(s)
	if err != nil {
		t.Fatal(err)
	}
	if !p.Equal(units.MustParse("ft*lbf/s")) || p.String() != "lbf*ft/s" {
		t.Errorf("lbf·ft/s = %q, factor %v", p, p.Factor())
	}
	a, err := ft.Pow(2, 1)
	if err != nil || !a.Equal(units.MustParse("ft^2")) {
		t.Errorf("ft² = %v, %v", a, err)
	}
	if _, err := units.MustParse("rad").Pow(1, 2); err == nil {
		t.Error("√rad accepted")
	}
	c := units.MustParse("degC")
	if !c.IsScale() || c.Offset() != 273.15 {
		t.Errorf("°C: scale %v offset %v", c.IsScale(), c.Offset())
	}
	if units.MustParse("W/(m*degC)").IsScale() || !units.MustParse("Δ°C").IsInterval() {
		t.Error("scale and interval roles")
	}
	cp, _ := c.Mul(units.MustParse("kg"))
	if cp.IsScale() || cp.Offset() != 0 {
		t.Error("a scale inside a product must be its interval")
	}
	if pl, so := units.MustParse("rpm").Angle(); pl != 1 || so != 0 {
		t.Errorf("rpm angle = %d, %d", pl, so)
	}
	if q := units.MustParse("degF").Of(32); math.Abs(q.Value()-273.15) > 1e-12 {
		t.Errorf("32 °F = %v", q)
	}
	v, err := units.MustParse("degF").ValueOf(quantity.New(373.15, quantity.Temperature))
	if err != nil || math.Abs(v-212) > 1e-12 {
		t.Errorf("373.15 K in °F = %v, %v", v, err)
	}
	if !units.MustParse("psi").Compatible(units.MustParse("Pa")) || units.MustParse("rpm").Compatible(units.MustParse("Hz")) {
		t.Error("Compatible")
	}
}

func TestUserTable(t *testing.T) {
	tab := units.NewTable()
	if err := tab.Define("TR", "12000 BTU/h"); err != nil { // a ton of refrigeration, common practice
		t.Fatal(err)
	}
	if err := tab.Define("div", "0.25 inH2O"); err != nil {
		t.Fatal(err)
	}
	got, err := tab.Convert(1, "TR", "kW")
	// 12000 × 1055.05585262 / 3600 W = 3.516852842 kW, exact from the IT BTU.
	if err != nil || math.Abs(got-3.5168528420666667) > 1e-12 {
		t.Errorf("1 TR = %v kW, %v", got, err)
	}
	got, err = tab.Convert(4, "div", "Pa")
	if err != nil || math.Abs(got-249.08891) > 1e-9 { // 4 × 0.25 × 249.08891 (conventional inH2O)
		t.Errorf("4 div = %v Pa, %v", got, err)
	}
	if v, err := tab.ParseValue("3 TR"); err != nil || v.Unit.String() != "TR" {
		t.Errorf("ParseValue(3 TR) = %v, %v", v, err)
	}
	if err := tab.Define("TR2", "TR*2"); err != nil {
		t.Errorf("definition from a definition: %v", err)
	}
	for _, c := range []struct{ name, expr string }{
		{"psi", "6895 Pa"}, {"kPa", "1000 Pa"}, {"TR", "1 W"}, {"bad name", "1 W"}, {"", "1 W"},
		{"x", "furlong"}, {"2x", "1 W"}, {"degX", "degC"},
	} {
		err := tab.Define(c.name, c.expr)
		if !errors.Is(err, units.ErrDefine) {
			t.Errorf("Define(%q, %q) = %v, want ErrDefine", c.name, c.expr, err)
		}
	}
	if _, err := units.Parse("TR"); err == nil {
		t.Error("a user definition leaked into the built-in table")
	}
}

// TestPrinterPrecisionProperty: at any Precision the printed number has
// exactly that many significant digits, trailing zeros kept, and reads
// back through ParseQuantity to within half a unit of its last digit.
func TestPrinterPrecisionProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		prec := rapid.IntRange(1, 17).Draw(t, "precision")
		v := rapid.Float64Range(1, 10).Draw(t, "mantissa") * math.Pow10(rapid.IntRange(-30, 30).Draw(t, "exponent"))
		if rapid.Bool().Draw(t, "negative") {
			v = -v
		}
		s := units.Printer{Precision: prec}.Format(quantity.New(v, quantity.Pressure))
		num, _, _ := strings.Cut(s, " ")
		mant, _, _ := strings.Cut(num, "e")
		digits := strings.TrimLeft(strings.NewReplacer("-", "", ".", "").Replace(mant), "0")
		if len(digits) != prec {
			t.Fatalf("%v at precision %d: %q has %d significant digits", v, prec, s, len(digits))
		}
		q, err := units.ParseQuantity(s)
		if err != nil {
			t.Fatalf("%q does not read back: %v", s, err)
		}
		if got := q.Value(); math.Abs(got-v) > 0.5*math.Pow10(1-prec)*math.Abs(v)*(1+1e-9) {
			t.Fatalf("%v at precision %d: %q reads back as %v", v, prec, s, got)
		}
	})
}

func TestPrinter(t *testing.T) {
	atm := units.StandardAtmosphere()
	torque := quantity.New(12.5, quantity.Torque)
	cases := []struct {
		p    units.Printer
		q    quantity.Quantity
		want string
	}{
		{units.Printer{}, atm, "101325 Pa"},
		{units.Printer{Prefix: true}, atm, "101.325 kPa"},
		{units.Printer{Prefix: true, Style: quantity.ASCII}, quantity.New(2.5e-6, quantity.Length), "2.5 um"},
		{units.Printer{Prefix: true}, quantity.New(2.5e-6, quantity.Length), "2.5 µm"},
		{units.Printer{}, quantity.New(1.225, quantity.Density), "1.225 kg/m³"},
		{units.Printer{}, quantity.New(1.8e-5, quantity.DynamicViscosity), "1.8e-05 Pa·s"},
		{units.Printer{Prefix: true}, quantity.New(1.8e-5, quantity.DynamicViscosity), "18 µPa·s"},
		{units.Printer{Prefix: true, Precision: 3}, quantity.New(745699.87, quantity.Power), "746 kW"},
		{units.Printer{}, torque, "12.5 N·m"}, // energy and torque share N·m (SI Brochure, 8th ed. (2006), Table 4: moment of force N m)
		{units.Printer{Prefer: map[quantity.Dim]units.Unit{quantity.Energy: units.MustParse("J")}}, quantity.New(12.5, quantity.Energy), "12.5 J"},
		{units.Printer{Prefix: true}, quantity.New(2500, quantity.Torque), "2.5 kN·m"},
		{units.Printer{}, quantity.New(50, quantity.Frequency), "50 1/s"},
		{units.Printer{Style: quantity.LaTeX}, quantity.New(0.025, quantity.ThermalConductivity), `0.025\,\mathrm{W}/(\mathrm{m}\cdot \mathrm{K})`},
		{units.Printer{Style: quantity.LaTeX, Precision: 3}, quantity.New(1.5e-5, quantity.KinematicViscosity), `1.50\times 10^{-5}\,\mathrm{m}^{2}/\mathrm{s}`},
		// A precision keeps significant trailing zeros, so that a column
		// of values to four significant digits lines up.
		{units.Printer{Precision: 4}, quantity.New(21.9, quantity.Length), "21.90 m"},
		{units.Printer{Precision: 4}, quantity.New(19.77, quantity.Length), "19.77 m"},
		{units.Printer{Precision: 4}, quantity.New(3, quantity.Length), "3.000 m"},
		{units.Printer{Precision: 4}, quantity.New(0.0005, quantity.Length), "0.0005000 m"},
		{units.Printer{Precision: 4}, quantity.New(9.99996, quantity.Length), "10.00 m"}, // rounds into the next decade
		{units.Printer{Precision: 4}, quantity.New(120000, quantity.Pressure), "1.200e+05 Pa"},
		{units.Printer{Precision: 3}, quantity.New(0, quantity.Pressure), "0.00 Pa"},
		{units.Printer{Prefix: true, Precision: 4}, quantity.New(2000, quantity.Force), "2.000 kN"},
		{units.Printer{Prefix: true}, quantity.New(1500, quantity.Mass), "1.5 Mg"},
		{units.Printer{}, quantity.Scalar(0.25), "0.25"},
	}
	for _, c := range cases {
		if got := c.p.Format(c.q); got != c.want {
			t.Errorf("%+v.Format(%v) = %q, want %q", c.p, c.q, got, c.want)
		}
	}
	s, err := units.Printer{Precision: 5}.FormatIn(atm, units.MustParse("psi"))
	if err != nil || s != "14.696 psi" {
		t.Errorf("atm in psi = %q, %v", s, err)
	}
	s, err = units.Printer{}.FormatIn(quantity.New(293.15, quantity.Temperature), units.MustParse("°C"))
	if err != nil || s != "20 °C" {
		t.Errorf("293.15 K in °C = %q, %v", s, err)
	}
	if _, err := (units.Printer{}).FormatIn(atm, units.MustParse("m")); err == nil {
		t.Error("FormatIn with the wrong dimension accepted")
	}
}

// TestConstants checks the derived constants against CODATA 2018 values
// (exact for R and σ, which follow from the defining constants).
func TestConstants(t *testing.T) {
	cases := []struct {
		name string
		q    quantity.Quantity
		want float64
		unit string
		rel  float64
	}{
		{"R", units.MolarGas(), 8.314462618, "J/(mol*K)", 1e-10},            // CODATA 2018: 8.314 462 618… (exact)
		{"σ", units.StefanBoltzmann(), 5.670374419e-8, "W/(m^2*K^4)", 1e-9}, // CODATA 2018: 5.670 374 419… × 10⁻⁸ (exact)
		{"G", units.Gravitation(), 6.67430e-11, "m^3/(kg*s^2)", 1e-15},      // CODATA 2018
		{"c", units.SpeedOfLight(), 299792458, "m/s", 0},
		{"g_n", units.StandardGravity(), 9.80665, "m/s^2", 0},
		{"atm", units.StandardAtmosphere(), 101325, "Pa", 0},
		{"h", units.Planck(), 6.62607015e-34, "J*s", 0},
		{"e", units.ElementaryCharge(), 1.602176634e-19, "C", 0},
		{"k", units.Boltzmann(), 1.380649e-23, "J/K", 0},
		{"N_A", units.Avogadro(), 6.02214076e23, "1/mol", 0},
		{"K_cd", units.LuminousEfficacy(), 683, "cd*sr/W", 0},
		{"Δν_Cs", units.HyperfineCs(), 9192631770, "Hz", 0},
	}
	for _, c := range cases {
		u := units.MustParse(c.unit)
		if c.q.Dim() != u.Dim() {
			t.Errorf("%s has dimension %v, want that of %s", c.name, c.q.Dim(), c.unit)
			continue
		}
		if d := math.Abs(c.q.Value()-c.want) / c.want; d > c.rel {
			t.Errorf("%s = %v, want %v", c.name, c.q.Value(), c.want)
		}
	}
}

// TestFlagCheckedFromText checks that a Flag is checked however it is
// filled — flag.Set, UnmarshalText, JSON — against its dimension, and
// that a temperature difference given where a level is asked is refused
// rather than read as kelvins, keeping the value it held.
func TestFlagCheckedFromText(t *testing.T) {
	type config struct {
		Flow *units.Flag `json:"flow"`
		Tin  *units.Flag `json:"t_in"`
	}
	newConfig := func() config {
		return config{
			Flow: units.NewFlag(quantity.VolumeFlowRate, units.MustParseValue("1 L/s")),
			Tin:  units.NewFlag(quantity.Temperature, units.MustParseValue("20 °C")),
		}
	}
	cases := []struct {
		name, json string
		class      error // nil: accepted
	}{
		{"flow in m/s", `{"flow": "1.2 m/s"}`, quantity.ErrDimension},
		{"flow unknown unit", `{"flow": "1.2 furlongs"}`, quantity.ErrUnknown},
		{"flow in L/min", `{"flow": "90 L/min"}`, nil},
		{"temperature difference for a level", `{"t_in": "20 Δ°C"}`, quantity.ErrInvalid},
		{"temperature level", `{"t_in": "68 °F"}`, nil},
		{"temperature in kelvin", `{"t_in": "293.15 K"}`, nil},
	}
	for _, c := range cases {
		cfg := newConfig()
		before := *cfg.Flow
		err := json.Unmarshal([]byte(c.json), &cfg)
		switch {
		case c.class == nil && err != nil:
			t.Errorf("%s: refused: %v", c.name, err)
		case c.class != nil && !errors.Is(err, c.class):
			t.Errorf("%s: error %v, want one matching %v (flow now %v, t_in %v)", c.name, err, c.class, cfg.Flow.Value, cfg.Tin.Value)
		case c.class != nil && cfg.Flow.Value != before.Value:
			t.Errorf("%s: the refused text changed the flag to %v", c.name, cfg.Flow.Value)
		}
	}
	// The same through UnmarshalText and Set directly.
	tin := units.NewFlag(quantity.Temperature, units.MustParseValue("20 °C"))
	for _, fill := range []func(string) error{tin.Set, func(s string) error { return tin.UnmarshalText([]byte(s)) }} {
		if err := fill("20 Δ°C"); !errors.Is(err, quantity.ErrInvalid) || tin.Quantity().Value() != 293.15 {
			t.Errorf("20 Δ°C for a level: %v; flag now %v", err, tin.Value)
		}
	}
	// A flag that takes differences refuses a level, and takes kelvins
	// (whose zero is absolute zero) without turning into a level flag.
	dt := units.NewFlag(quantity.Temperature, units.MustParseValue("5 Δ°C"))
	if err := dt.UnmarshalText([]byte("20 °C")); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("20 °C for a difference: %v", err)
	}
	if err := dt.Set("3 K"); err != nil {
		t.Errorf("3 K for a difference: %v", err)
	}
	if err := dt.Set("20 °F"); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("20 °F for a difference after 3 K: %v", err)
	}
	if err := dt.Set("4 Δ°F"); err != nil {
		t.Errorf("4 Δ°F for a difference after 3 K: %v", err)
	}
}

// TestPowRoundTrip checks that whatever Unit.Pow returns, Parse reads its
// String back to the same unit and spelling, and that a power Parse would
// refuse ("%^62") is refused by Pow, as an *Error of class quantity.ErrRange.
func TestPowRoundTrip(t *testing.T) {
	if u, err := units.MustParse("%").Pow(62, 1); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("%%.Pow(62) = %v, %v; want an ErrRange error (Parse refuses %%^62)", u, err)
	}
	for _, c := range []struct{ num, den int }{{math.MinInt, 1}, {math.MaxInt, 1}, {1, math.MaxInt}, {-1 << 40, 3}} {
		if u, err := units.MustParse("m").Pow(c.num, c.den); err == nil {
			t.Errorf("m.Pow(%d, %d) = %v", c.num, c.den, u)
		}
	}
	spellings := []string{"%", "m", "kg/m^3", "rpm", "Pa*s", "W/(m*K)", "m^(1/2)", "in^(1/3)", "degC", "ΔdegC", "ppm", "N*m", "km/h", "1000*m", "s^-1", "ft^(1/6)"}
	rapid.Check(t, func(t *rapid.T) {
		u := units.MustParse(rapid.SampledFrom(spellings).Draw(t, "unit"))
		num := rapid.IntRange(-400, 400).Draw(t, "num")
		den := rapid.IntRange(1, 30).Draw(t, "den")
		p, err := u.Pow(num, den)
		if err != nil {
			return
		}
		back, err := units.Parse(p.String())
		if err != nil {
			t.Fatalf("(%v).Pow(%d, %d) = %q, which Parse refuses: %v", u, num, den, p, err)
		}
		if !back.Equal(p) || back.String() != p.String() {
			t.Fatalf("(%v).Pow(%d, %d) = %q (factor %v), reads back as %q (factor %v)", u, num, den, p, p.Factor(), back, back.Factor())
		}
		// Products and quotients with another unit read back too.
		o := units.MustParse(rapid.SampledFrom(spellings).Draw(t, "other"))
		for _, op := range []func(units.Unit) (units.Unit, error){p.Mul, p.Div} {
			r, err := op(o)
			if err != nil {
				continue
			}
			back, err := units.Parse(r.String())
			if err != nil || !back.Equal(r) || back.String() != r.String() {
				t.Fatalf("%q with %q gives %q, which reads back as %v, %v", p, o, r, back, err)
			}
		}
	})
}

// TestParseDialectErrorClass checks that a data-sheet reading that fails
// keeps the class of what is wrong: a syntax or exponent error is
// ErrParse, an unknown symbol ErrUnknown, never both.
func TestParseDialectErrorClass(t *testing.T) {
	cases := []struct {
		text  string
		class error
	}{
		{"m^^2", quantity.ErrParse},
		{"hr^99", quantity.ErrParse},
		{"ft3/(hr", quantity.ErrParse},
		{"furlongs/hr", quantity.ErrUnknown},
		{"GPM*", quantity.ErrParse},
	}
	for _, c := range cases {
		_, _, err := units.ParseDialect(c.text)
		var pe *units.Error
		if !errors.Is(err, c.class) || !errors.As(err, &pe) {
			t.Errorf("ParseDialect(%q): %v, want a *units.Error matching %v", c.text, err, c.class)
			continue
		}
		for _, other := range []error{quantity.ErrParse, quantity.ErrUnknown, quantity.ErrRange, quantity.ErrInvalid, quantity.ErrDimension} {
			if other != c.class && errors.Is(err, other) {
				t.Errorf("ParseDialect(%q): %v also matches %v", c.text, err, other)
			}
		}
	}
}

// TestNegativeZeroKept: a number read from text is the number written, so
// "-0 m" reads as −0 (IEEE 754 negative zero), not +0; a unit with an
// offset (°C) adds it, and −0 °C is 273.15 K.
func TestNegativeZeroKept(t *testing.T) {
	for _, c := range []struct {
		text    string
		wantNeg bool
		want    float64
	}{
		{"-0 m", true, 0},
		{"-0 kPa", true, 0},
		{"0 m", false, 0},
		{"-0 °C", false, 273.15},
	} {
		q, err := units.ParseQuantity(c.text)
		if err != nil {
			t.Fatalf("%q: %v", c.text, err)
		}
		if q.Value() != c.want || math.Signbit(q.Value()) != c.wantNeg {
			t.Errorf("%q: value %v (sign bit %v), want %v (sign bit %v)", c.text, q.Value(), math.Signbit(q.Value()), c.want, c.wantNeg)
		}
	}
}
