package units_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// TestDialect reads each data-sheet spelling and checks its SI factor
// against the conversion factors of NIST SP 811 (2008), Appendix B
// (values as recalled there to 7 digits; the products below are exact
// definitions: inch 0.0254 m, foot 0.3048 m, lbf 4.4482216152605 N, US
// gallon 231 in³, BTU_IT 1055.05585262 J), and that every lenient reading
// is reported.
func TestDialect(t *testing.T) {
	const (
		inch  = 0.0254
		foot  = 0.3048
		lbf   = 4.4482216152605
		gal   = 231 * inch * inch * inch
		btuIT = 1055.05585262
		gn    = 9.80665
	)
	tests := []struct {
		text  string
		si    float64 // SI factor, by hand from the exact definitions
		sp811 float64 // NIST SP 811 Appendix B, 7 digits (0: not listed)
		dim   quantity.Dim
		reads []string // the From of every reading, in order
	}{
		{"hr", 3600, 0, quantity.Time, []string{"hr"}},
		{"sec", 1, 0, quantity.Time, []string{"sec"}},
		{"mins", 60, 0, quantity.Time, []string{"mins"}},
		{"m3", 1, 0, quantity.Volume, []string{"m3"}},
		{"ft3", foot * foot * foot, 2.831685e-2, quantity.Volume, []string{"ft3"}},
		{"ft-lbf", foot * lbf, 1.355818, quantity.Energy, []string{"-"}},
		{"lbf-ft", foot * lbf, 1.355818, quantity.Energy, []string{"-"}},
		{"in-lb", inch * lbf, 1.129848e-1, quantity.Energy, []string{"in-lb"}},
		{"lb-ft", foot * lbf, 1.355818, quantity.Energy, []string{"lb-ft"}},
		{"Pa.s", 1, 0, quantity.DynamicViscosity, []string{"."}},
		{"N.m", 1, 0, quantity.Energy, []string{"."}},
		{"kg/m3", 1, 0, quantity.Density, []string{"m3"}},
		{"m3/h", 1.0 / 3600, 2.777778e-4, quantity.VolumeFlowRate, []string{"m3"}},
		{"m3/hr", 1.0 / 3600, 2.777778e-4, quantity.VolumeFlowRate, []string{"m3", "hr"}},
		{"GPM", gal / 60, 6.309020e-5, quantity.VolumeFlowRate, []string{"GPM"}},
		{"ftH2O", 1000 * gn * foot, 2.989067e3, quantity.Pressure, nil},
		{"mH2O", 1000 * gn, 0, quantity.Pressure, nil},
		{"bhp", 550 * foot * lbf, 7.456999e2, quantity.Power, []string{"bhp"}},
		{"BTU/hr-ft2-F", btuIT / (3600 * foot * foot * 5.0 / 9), 5.678263, quantity.HeatTransferCoefficient, []string{"hr", "-", "ft2", "-", "F"}},
		{"W/m2-K", 1, 0, quantity.HeatTransferCoefficient, []string{"m2", "-"}},
		{"lb/hr", 0.45359237 / 3600, 1.259979e-4, quantity.MassFlowRate, []string{"hr"}}, // a pound of mass, not a force
		{"kg/s", 1, 0, quantity.MassFlowRate, nil},                                       // strict spellings need no reading
		{"Nm", 1, 0, quantity.Energy, []string{"Nm"}},
		{"kW/Nm", 1000, 0, quantity.Frequency, []string{"Nm"}}, // power over torque: kW/(N·m), not (kW/N)·m
		{"RPM", 2 * math.Pi / 60, 0, quantity.Frequency, []string{"RPM"}},
		{"U/min", 2 * math.Pi / 60, 0, quantity.Frequency, []string{"U/min"}},
		{"r/min", 2 * math.Pi / 60, 0, quantity.Frequency, []string{"r/min"}},
		{"mWC", 1000 * gn, 0, quantity.Pressure, []string{"mWC"}}, // conventional water column, common practice
		{"inWC", 1000 * gn * inch, 2.490889e2, quantity.Pressure, []string{"inWC"}},
		{"kts", 1852.0 / 3600, 5.144444e-1, quantity.Velocity, []string{"kts"}},
		{"knots", 1852.0 / 3600, 5.144444e-1, quantity.Velocity, []string{"knots"}},
		{"CFM", foot * foot * foot / 60, 4.719474e-4, quantity.VolumeFlowRate, []string{"CFM"}},
		{"psia", lbf / (inch * inch), 6.894757e3, quantity.Pressure, []string{"psia"}},
		{"bara", 1e5, 1e5, quantity.Pressure, []string{"bara"}},
		{"bar(a)", 1e5, 1e5, quantity.Pressure, []string{"bar(a)"}},
		{"kPa(a)", 1e3, 0, quantity.Pressure, []string{"kPa(a)"}},
		{"kPa (abs)", 1e3, 0, quantity.Pressure, []string{"kPa (abs)"}},
		{"N.m", 1, 0, quantity.Energy, []string{"."}},
	}
	for _, tc := range tests {
		u, rd, err := units.ParseDialect(tc.text)
		if err != nil {
			t.Errorf("ParseDialect(%q): %v", tc.text, err)
			continue
		}
		if u.Dim() != tc.dim {
			t.Errorf("ParseDialect(%q) dimension %v, want %v", tc.text, u.Dim(), tc.dim)
		}
		if f := u.Factor(); math.Abs(f-tc.si) > 1e-14*tc.si {
			t.Errorf("ParseDialect(%q) factor %.16g, want %.16g", tc.text, f, tc.si)
		}
		if tc.sp811 != 0 && math.Abs(u.Factor()-tc.sp811) > 5e-7*tc.sp811 {
			t.Errorf("ParseDialect(%q) factor %.7g, NIST SP 811 gives %.7g", tc.text, u.Factor(), tc.sp811)
		}
		var from []string
		for _, r := range rd {
			from = append(from, r.From)
			if r.To == "" || !strings.Contains(r.String(), " read as ") {
				t.Errorf("ParseDialect(%q) reading %+v is not self-explaining", tc.text, r)
			}
		}
		if d := cmp.Diff(tc.reads, from); d != "" {
			t.Errorf("ParseDialect(%q) readings (-want +got):\n%s", tc.text, d)
		}
	}
}

// TestDialectRefuses checks that spellings with more than one meaning or
// that need a reference are refused with the candidates named, and that
// strict parsing still refuses every dialect spelling.
func TestDialectRefuses(t *testing.T) {
	tests := []struct {
		text string
		err  error
		says string
	}{
		{"ton", units.ErrAmbiguous, "ton of refrigeration"},
		{"tons", units.ErrAmbiguous, "long ton"},
		{"PS", units.ErrAmbiguous, "metric horsepower"},
		{"psig", units.ErrGauge, "ParseGauge"},
		{"barg", units.ErrGauge, "barometer"},
		{"kPa(g)", units.ErrGauge, "Gauge.Absolute"},
		{"kPa (g)", units.ErrGauge, "relative to the ambient"}, // not kilopascal-gram
		{"SCFM", units.ErrAmbiguous, "reference conditions"},
		{"kPag", units.ErrGauge, "ParseGauge"},
		{"C", units.ErrAmbiguous, "write °C or degC"},
		{"Nm3/h", units.ErrAmbiguous, "normal cubic metre"},
		{"kg(a)", units.ErrSyntax, "not a pressure unit"},
		{"U/s", units.ErrUnknownSymbol, "not a unit"},
		{"kW/ton", units.ErrAmbiguous, "short ton"},
		{"Torque", units.ErrUnknownSymbol, "not a unit"},
		{"H2O", units.ErrUnknownSymbol, "not a unit"},
		{strings.Repeat("m", 5000), units.ErrTooLong, "longer"},
		{"m3\xff", units.ErrSyntax, "UTF-8"},
	}
	for _, tc := range tests {
		_, _, err := units.ParseDialect(tc.text)
		if !errors.Is(err, tc.err) {
			t.Errorf("ParseDialect(%.20q) error %v, want %v", tc.text, err, tc.err)
			continue
		}
		var pe *units.Error
		if !errors.As(err, &pe) || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("ParseDialect(%.20q) error %q does not say %q", tc.text, err, tc.says)
		}
	}
	for _, s := range []string{"hr", "sec", "mins", "m3", "ft3", "ft-lbf", "in-lb", "Pa.s", "kg/m3", "m3/h", "GPM", "bhp", "BTU/hr-ft2-F", "psig", "Nm", "RPM", "U/min", "mWC", "kts", "knots", "CFM", "psia", "bara", "bar(a)", "kPa(a)", "kPag"} {
		if _, err := units.Parse(s); err == nil {
			t.Errorf("strict Parse(%q) accepted a data-sheet spelling", s)
		}
	}
}

// FuzzDialect checks that ParseDialect never panics, that what it accepts
// has a finite positive factor, and that every spelling strict Parse
// reads is read the same with no reading reported.
func FuzzDialect(f *testing.F) {
	for _, s := range append(seedExprs, "BTU/hr-ft2-F", "in-lb", "kg/m3", "m3/hr", "Pa.s", "ton", "psig", "ft3/min", "W/m2-K", "-", "/-", "a-", ".m", "bar(a)", "kPa (abs)", "U/min", "Nm3", "C", "kPag") {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		u, rd, err := units.ParseDialect(s)
		if err != nil {
			return
		}
		if f := u.Factor(); !(f > 0) || math.IsInf(f, 0) {
			t.Fatalf("ParseDialect(%q) factor %v", s, f)
		}
		if strict, err := units.Parse(s); err == nil && s != "C" && (!strict.Equal(u) || len(rd) != 0) {
			t.Fatalf("ParseDialect(%q) = %v %v, strict Parse gives %v", s, u, rd, strict)
		}
	})
}

// TestParseValueDialect reads a value with its unit as a configuration
// file writes it, and checks the SI value by hand and the readings.
func TestParseValueDialect(t *testing.T) {
	tests := []struct {
		text  string
		si    float64 // by hand
		reads []string
	}{
		{"12 m3/h", 12.0 / 3600, []string{"m3"}},
		{"3 bara", 3e5, []string{"bara"}},
		{"1450 RPM", 1450 * 2 * math.Pi / 60, []string{"RPM"}},
		{"20 kts", 20 * 1852.0 / 3600, []string{"kts"}},
		{"5 kn", 5 * 1852.0 / 3600, nil},
	}
	for _, tc := range tests {
		v, rd, err := units.ParseValueDialect(tc.text)
		if err != nil {
			t.Errorf("ParseValueDialect(%q): %v", tc.text, err)
			continue
		}
		if got := v.Quantity().Value(); math.Abs(got-tc.si) > 1e-12*tc.si {
			t.Errorf("ParseValueDialect(%q) = %v, want %v", tc.text, got, tc.si)
		}
		var from []string
		for _, r := range rd {
			from = append(from, r.From)
		}
		if d := cmp.Diff(tc.reads, from); d != "" {
			t.Errorf("ParseValueDialect(%q) readings (-want +got):\n%s", tc.text, d)
		}
	}
	for _, s := range []string{"2 kPag", "20 C", "12 ton", "x m3/h", "12 m3/h m"} {
		if _, _, err := units.ParseValueDialect(s); err == nil {
			t.Errorf("ParseValueDialect(%q) accepted", s)
		}
	}
	if _, err := units.ParseValue("12 m3/h"); err == nil {
		t.Error("strict ParseValue accepted a data-sheet spelling")
	}
}

// FuzzParseValueDialect checks that ParseValueDialect never panics and
// that what it accepts is finite.
func FuzzParseValueDialect(f *testing.F) {
	for _, s := range []string{"12 m3/h", "3 bara", "2 kPag", "1450 RPM", "1e999 m", "20 C"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, _, err := units.ParseValueDialect(s)
		if err != nil {
			if c := 0; true {
				for _, k := range []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid} {
					if errors.Is(err, k) {
						c++
					}
				}
				if c != 1 {
					t.Fatalf("ParseValueDialect(%q) error %v matches %d classes", s, err, c)
				}
			}
			return
		}
		if q := v.Quantity().Value(); math.IsInf(q, 0) || math.IsNaN(q) {
			t.Fatalf("ParseValueDialect(%q) = %v", s, q)
		}
	})
}
