package units_test

import (
	"errors"
	"fmt"
	"runtime"
	"strings"
	"sync"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// TestRequiredSpellings parses every spelling the project promises.
func TestRequiredSpellings(t *testing.T) {
	spellings := strings.Fields(`in ft yd mi nmi mil ha acre L gal bbl lb oz slug t lbf kip kgf dyn
		Pa bar mbar atm Torr mmHg inHg inH2O psi psf ksi J kWh BTU cal kcal erg eV W hp kn mph gpm cfm
		P cP St cSt K degC degF degR °C °F °R rad deg ° rev rpm sr s min h d % ppm um µm μm
		m kg g A mol cd Hz N C V F Ω ohm S Wb T H lm lx Bq Gy Sv kat ′ ″ l Da gal_imp cal_IT`)
	for _, s := range spellings {
		if _, err := units.Parse(s); err != nil {
			t.Errorf("Parse(%q): %v", s, err)
		}
	}
	exprs := []string{"kg/(m·s)", "kg m^-1 s^-2", "kg*m**-1*s**-2", "N·m", "W/(m²·K)", "BTU/(h*ft^2*degF)",
		"ft^3/min", "m/s²", "1/s", "s⁻¹", "MPa·m^(1/2)", "ksi*in^0.5", "L/min", "kg/m/s", "((m))", "m^(-1/2)", "m^-0.5", "J/(kg·K)"}
	for _, s := range exprs {
		if _, err := units.Parse(s); err != nil {
			t.Errorf("Parse(%q): %v", s, err)
		}
	}
	// Equal meanings, different spellings.
	same := [][]string{
		{"kg/(m·s)", "kg m^-1 s^-1", "kg*m**-1*s**-1", "kg/m/s", "Pa·s", "Pa*s", "N s/m^2"},
		{"1/s", "s⁻¹", "s^-1", "Hz"},
		{"MPa·m^(1/2)", "MPa*m^0.5", "MPa m^(1/2)"},
		{"W/(m²·K)", "W m^-2 K^-1", "W/m^2/K"},
	}
	for _, group := range same {
		first := units.MustParse(group[0])
		for _, s := range group[1:] {
			if u := units.MustParse(s); !u.Equal(first) {
				t.Errorf("%q (%v) ≠ %q (%v)", s, u.Factor(), group[0], first.Factor())
			}
		}
	}
	if units.MustParse("kg/(m·s)").Dim() != quantity.DynamicViscosity {
		t.Error("kg/(m·s) is not a dynamic viscosity")
	}
	if d := units.MustParse("MPa·m^(1/2)").Dim(); d != quantity.StressIntensityFactor {
		t.Errorf("MPa·m^(1/2) has dimension %v", d)
	}
}

// TestMalformed checks that bad expressions are refused with the right
// class of error and offset.
func TestMalformed(t *testing.T) {
	cases := []struct {
		expr   string
		err    error
		offset int
	}{
		{"", units.ErrEmpty, 0},
		{"   ", units.ErrEmpty, 0},
		{"kg/", units.ErrDangling, 2},
		{"/s", units.ErrDangling, 0},
		{"*m", units.ErrDangling, 0},
		{"m*", units.ErrDangling, 1},
		{"m·", units.ErrDangling, 1},
		{"·m", units.ErrDangling, 0},
		{"m^", units.ErrDangling, 1},
		{"m**", units.ErrDangling, 1},
		{"m^-", units.ErrDangling, 2},
		{"m//s", units.ErrDangling, 2},
		{"m s ^2", units.ErrDangling, 4},
		{"(m", units.ErrParen, 0},
		{"m)", units.ErrParen, 1},
		{"((m)", units.ErrParen, 0},
		{"m^(1/2", units.ErrParen, 2},
		{"m^(1/0)", units.ErrExponent, 2},
		{"m^(a)", units.ErrExponent, 3},
		{"m^100", units.ErrExponent, 1},
		{"m^30", units.ErrExponent, 1},
		{"m^(1/13)", units.ErrExponent, 1},
		{"m^0.33333", units.ErrExponent, 2},
		{"m^0", units.ErrExponent, 1},
		{"m^(1/4)", units.ErrExponent, 0},
		{"m^22", units.ErrExponent, 0},
		{"m⁻", units.ErrExponent, 1},
		{"rad^(1/2)", units.ErrExponent, 0},
		{"m^20*m^20", units.ErrExponent, 4},
		{"xyz", units.ErrUnknownSymbol, 0},
		{"m2", units.ErrUnknownSymbol, 0},
		{"kpa", units.ErrUnknownSymbol, 0},
		{"mkg", units.ErrUnknownSymbol, 0},
		{"kmin", units.ErrUnknownSymbol, 0},
		{"kft", units.ErrUnknownSymbol, 0},
		{"k°C", units.ErrUnknownSymbol, 0},
		{"N/m furlong", units.ErrAmbiguous, 4},
		{"W/m K", units.ErrAmbiguous, 4},
		{"W/m*K", units.ErrAmbiguous, 3},
		{"J/kg·K", units.ErrAmbiguous, 4},
		{"0 m", units.ErrNumber, 0},
		{"1e999 m", units.ErrNumber, 0},
		{"1.2.3 m", units.ErrNumber, 0},
		{"5m", units.ErrSyntax, 1},
		{"-1 m", units.ErrSyntax, 0},
		{"m$", units.ErrSyntax, 1},
		{"()", units.ErrSyntax, 1},
		{"m(s)", units.ErrSyntax, 1},
		{"\xff", units.ErrSyntax, 0},
		{"m \xffs", units.ErrSyntax, 2},
		{strings.Repeat("(", 20) + "m" + strings.Repeat(")", 20), units.ErrTooDeep, 16},
		{strings.Repeat("m*", 300) + "m", units.ErrTooLong, 512},
		{"m^1.23456", units.ErrExponent, 2},
	}
	if len(cases) < 40 {
		t.Fatalf("%d malformed inputs, want at least 40", len(cases))
	}
	for _, c := range cases {
		_, err := units.Parse(c.expr)
		var pe *units.Error
		if !errors.As(err, &pe) {
			t.Errorf("Parse(%q): err = %v, want a *units.Error", c.expr, err)
			continue
		}
		if !errors.Is(err, c.err) || pe.Offset != c.offset {
			t.Errorf("Parse(%q):\n  got  %v (offset %d)\n  want %v at offset %d", c.expr, err, pe.Offset, c.err, c.offset)
		}
	}
}

func TestUnknownSuggestions(t *testing.T) {
	cases := map[string][]string{
		"kpa":    {"kPa"},
		"m2":     {"m^2"},
		"psia":   {"psi"},
		"degc":   {"degC"},
		"BTUs":   {"BTU"},
		"inHG":   {"inHg"},
		"gallon": nil,
	}
	for expr, want := range cases {
		_, err := units.Parse(expr)
		var pe *units.Error
		if !errors.As(err, &pe) {
			t.Fatalf("Parse(%q): %v", expr, err)
		}
		if len(want) > 0 && (len(pe.Suggest) == 0 || pe.Suggest[0] != want[0]) {
			t.Errorf("Parse(%q) suggests %q, want %q first", expr, pe.Suggest, want)
		}
		if pe.Symbol != expr {
			t.Errorf("Parse(%q): Symbol = %q", expr, pe.Symbol)
		}
	}
	_, err := units.Parse("mkg")
	if !strings.Contains(err.Error(), "mass prefixes attach to g") {
		t.Errorf("mkg: %v", err)
	}
}

// TestRoundTrip checks Parse(Format(u)) == u for every unit in the table,
// in both parseable styles.
func TestRoundTrip(t *testing.T) {
	syms := units.Symbols()
	if len(syms) < 80 {
		t.Fatalf("%d symbols in the table", len(syms))
	}
	var all []string
	for _, s := range syms {
		all = append(all, s)
		if units.Prefixable(s) {
			for _, p := range []string{"Q", "k", "da", "m", "u", "q"} {
				all = append(all, p+s)
			}
		}
	}
	all = append(all, "BTU/(h*ft^2*degF)", "kg m^(-1/2) s^-2", "12000 BTU/h", "(rpm)/rev", "1/(m*s)", "m^(1/3)")
	for _, s := range all {
		u, err := units.Parse(s)
		if err != nil && (s == "kt" || s == "mt") && errors.Is(err, units.ErrAmbiguous) {
			continue // refused as ambiguous; see TestAmbiguousPrefixed
		}
		if err != nil {
			t.Errorf("Parse(%q): %v", s, err)
			continue
		}
		for _, style := range []quantity.Style{quantity.Unicode, quantity.ASCII} {
			f := u.Format(style)
			back, err := units.Parse(f)
			if err != nil || !back.Equal(u) {
				t.Errorf("%q: %v spelling %q parses to %v, %v", s, style, f, back, err)
			}
		}
		if u.Format(quantity.LaTeX) == "" {
			t.Errorf("%q: empty LaTeX spelling", s)
		}
	}
	want := map[string][3]string{
		"BTU/(h*ft^2*degF)": {"BTU/(h·ft²·°F)", "BTU/(h*ft^2*degF)", `\mathrm{BTU}/(\mathrm{h}\cdot \mathrm{ft}^{2}\cdot {}^{\circ}\mathrm{F})`},
		"µm":                {"µm", "um", `\mu\mathrm{m}`},
		"kPa":               {"kPa", "kPa", `\mathrm{kPa}`},
		"ohm":               {"Ω", "ohm", `\Omega`},
	}
	for expr, w := range want {
		u := units.MustParse(expr)
		got := [3]string{u.Format(quantity.Unicode), u.Format(quantity.ASCII), u.Format(quantity.LaTeX)}
		if diff := cmp.Diff(w, got); diff != "" {
			t.Errorf("spellings of %q (-want +got):\n%s", expr, diff)
		}
	}
}

func TestPrefixRules(t *testing.T) {
	// Prefixes only where the SI allows: none on min, h, d, °, kg.
	for _, s := range []string{"kmin", "kh", "mh", "kd", "k°", "mkg", "kkg", "kft", "kpsi", "krpm"} {
		if _, err := units.Parse(s); err == nil {
			t.Errorf("Parse(%q) accepted a prefix the SI does not allow", s)
		}
	}
	// "min" is the minute, not milli-inch; "cd" the candela, not centi-day.
	if units.MustParse("min").Dim() != quantity.Time || units.MustParse("cd").Dim() != quantity.LuminousIntensity {
		t.Error("exact symbols must win over prefixed readings")
	}
}

func TestConcurrentParse(t *testing.T) {
	tab := units.NewTable()
	var wg sync.WaitGroup
	for g := range 8 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range 200 {
				exprs := []string{"BTU/(h*ft^2*degF)", "psi", "kg/(m·s)", "gpm", "W/(m²·K)"}
				if _, err := units.Parse(exprs[i%len(exprs)]); err != nil {
					t.Error(err)
				}
				if _, err := tab.Parse(exprs[(i+g)%len(exprs)]); err != nil {
					t.Error(err)
				}
				if i == 50 && g < 4 {
					_ = tab.Define([]string{"TR", "div", "lab_unit", "rig"}[g], "12000 BTU/h")
				}
			}
		}()
	}
	wg.Wait()
	if _, err := tab.Parse("TR"); err != nil {
		t.Error(err)
	}
}

// TestSpellingsDoNotAccumulate: a long-running program that reads ever
// new unit spellings must not degrade. The spelling table holds only the
// spellings of live units: after 20 000 distinct spellings are dropped,
// collection takes the table back near where it was, so no cap is ever
// reached and Parse keeps working. The wait for collection is bounded by
// a count of collections, not by time.
func TestSpellingsDoNotAccumulate(t *testing.T) {
	const n = 20000
	runtime.GC()
	base := units.SpellingsInUse()
	keep := make([]units.Unit, 0, n)
	for i := range n {
		u, err := units.ParseUncached(fmt.Sprintf("%d*m/s", i+2))
		if err != nil {
			t.Fatal(err)
		}
		keep = append(keep, u)
	}
	if got := units.SpellingsInUse(); got < n {
		t.Fatalf("%d spellings in use with %d distinct live units (base %d)", got, n, base)
	}
	// Units of one spelling still share it, so == compares spellings.
	again, err := units.ParseUncached("2*m/s")
	if err != nil || again != keep[0] {
		t.Errorf("two parses of 2*m/s differ under ==: %v, %v", again, keep[0])
	}
	keep, again = nil, units.Unit{}
	got := units.SpellingsInUse()
	for i := 0; i < 200 && got > base+n/10; i++ {
		runtime.GC()
		runtime.Gosched()
		got = units.SpellingsInUse()
	}
	if got > base+n/10 {
		t.Errorf("%d spellings still interned after their units were dropped (base %d): the table only grows", got, base)
	}
	if u, err := units.Parse("kg/s"); err != nil || u.Dim() != quantity.MassFlowRate {
		t.Errorf("Parse(kg/s) after many spellings: %v, %v", u, err)
	}
}

// TestIntermediateOverflowRead: a spelling read left to right may pass
// through a dimension a Dim cannot hold and come back (the time exponent
// of W^(20/3)·Pa is −22, beyond ±21, and ·s brings it to −21); the unit
// is read by its final terms. A unit whose final dimension is out of
// range is still refused, at the operator where it first overflowed.
func TestIntermediateOverflowRead(t *testing.T) {
	for _, c := range []struct {
		text string
		want string // the dimension, or "" for a refusal
	}{
		// W^(20/3)·Pa·s/(m^(20/3)·K^(20/3)) = (W/(m·K))^(20/3)·Pa·s:
		// L (2−1)·20/3 − 1 = 17/3, M 20/3 + 1 = 23/3, T −20 − 1 = −21,
		// Θ −20/3 (W = kg·m²·s⁻³, Pa·s = kg·m⁻¹·s⁻¹).
		{"W^(20/3)*Pa*s/(m^(20/3)*K^(20/3))", "L^(17/3) M^(23/3) T⁻²¹ Θ^(-20/3)"},
		{"s^-20*s^-2*s^3", "T⁻¹⁹"},
		{"m^20*m^20", ""},
		{"s^-20*s^-2", ""},
	} {
		u, err := units.Parse(c.text)
		if c.want == "" {
			if !errors.Is(err, units.ErrExponent) {
				t.Errorf("Parse(%q) = %v, %v; want a bad-exponent error", c.text, u, err)
			}
			continue
		}
		if err != nil {
			t.Errorf("Parse(%q): %v", c.text, err)
			continue
		}
		if got := u.Dim().String(); got != c.want {
			t.Errorf("Parse(%q) has dimension %s, want %s", c.text, got, c.want)
		}
		back, err := units.Parse(u.String())
		if err != nil || !back.Equal(u) {
			t.Errorf("Parse(%q).String() = %q reads back as %v, %v", c.text, u, back, err)
		}
	}
	if u, err := units.MustParse("m").Pow(-64, 3); err == nil {
		t.Errorf("m.Pow(-64, 3) = %q; want refused (its spelling 1/m^(64/3) cannot be read: +64/3 is not held)", u)
	}
}
