package chanfile_test

import (
	"bytes"
	"errors"
	"io"
	"math"
	"slices"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

func TestParseHeaderField(t *testing.T) {
	tests := []struct {
		field, name, unit string
		dim               quantity.Dim
		gauge             bool
		readings          int
	}{
		{"V [kn]", "V", "kn", quantity.Velocity, false, 0},
		{"Torque (in-lb)", "Torque", "in-lb", quantity.Torque, false, 1},
		{"P1 psig", "P1", "psig", quantity.Pressure, true, 0},
		{"P2 kPa(g)", "P2", "kPa(g)", quantity.Pressure, true, 0},
		{"T_in °F", "T_in", "°F", quantity.Temperature, false, 0},
		{"Q m3/h", "Q", "m3/h", quantity.VolumeFlowRate, false, 1},
		{"mu Pa.s", "mu", "Pa.s", quantity.DynamicViscosity, false, 1},
		{"Re [1]", "Re", "1", 0, false, 0},
		{"Cp [-]", "Cp", "-", 0, false, 0},
		{"Inlet pressure (kPa)", "Inlet pressure", "kPa", quantity.Pressure, false, 0},
		{"Δp [kPa]", "Δp", "kPa", quantity.Pressure, false, 0},
		{"\ufeffTime s", "Time", "s", quantity.Time, false, 0},
		{"q (W/(m^2*K))", "q", "W/(m^2*K)", quantity.HeatTransferCoefficient, false, 0},
	}
	for _, tc := range tests {
		c, err := chanfile.ParseHeaderField(tc.field)
		if err != nil {
			t.Errorf("ParseHeaderField(%q): %v", tc.field, err)
			continue
		}
		got := []any{c.Name, c.Text, c.Unit.Dim(), c.Gauge, len(c.Readings)}
		want := []any{tc.name, tc.unit, tc.dim, tc.gauge, tc.readings}
		if d := cmp.Diff(want, got); d != "" {
			t.Errorf("ParseHeaderField(%q) (-want +got):\n%s", tc.field, d)
		}
	}
	for _, bad := range []struct{ field, says string }{
		{"V", `write "V [1]"`},
		{"[kn]", "no channel name"},
		{"W ton", "short ton"},
		{"x (kPa", "not a unit"},
		{"n [rpm", "not a unit"},
		{"x [furlong]", "not a unit"},
		{"V []", "no unit"},
	} {
		_, err := chanfile.ParseHeaderField(bad.field)
		if classes(err) != 1 || !strings.Contains(err.Error(), bad.says) {
			t.Errorf("ParseHeaderField(%q) error %v, want one saying %q", bad.field, err, bad.says)
		}
	}
}

// The invented log of a pump-loop run: BOM, a comment, CRLF line ends, a
// quoted header field, a missing value and a gauge channel.
const pumpLog = "\ufeff# pump loop, invented data\r\n" +
	"t [s],\"Q, flow (m3/h)\",P1 psig,T_in °F,Torque (in-lb),n [rpm]\r\n" +
	"0,41.2,12.5,68,84.1,1450\r\n" +
	"0.5,,12.4,68.2,NA,1450\r\n" +
	"1.0,41.0,12.6,68.4,84.3,1451\r\n"

func TestReadByHand(t *testing.T) {
	baro := units.MustParseValue("1002 hPa").Quantity() // invented barometer reading
	r, err := chanfile.NewReader(strings.NewReader(pumpLog), "loop.csv", chanfile.Options{Reference: baro})
	if err != nil {
		t.Fatal(err)
	}
	s, n, err := r.Read(nil, 0)
	if err != nil || n != 3 {
		t.Fatalf("Read: %d rows, %v", n, err)
	}
	const psi = 4.4482216152605 / (0.0254 * 0.0254) // NIST SP 811: 6.894757 kPa
	nan := math.NaN()
	want := [][]float64{
		{0, 0.5, 1},
		{41.2 / 3600, nan, 41.0 / 3600}, // m3/h → m³/s
		{12.5*psi + 100200, 12.4*psi + 100200, 12.6*psi + 100200},                   // gauge + barometer
		{293.15, (68.2-32)*5/9 + 273.15, (68.4-32)*5/9 + 273.15},                    // °F → K (68 °F = 20 °C)
		{84.1 * 0.0254 * 4.4482216152605, nan, 84.3 * 0.0254 * 4.4482216152605},     // lbf·in → N·m
		{1450 * 2 * math.Pi / 60, 1450 * 2 * math.Pi / 60, 1451 * 2 * math.Pi / 60}, // rpm → rad/s
	}
	for j := range want {
		if d := cmp.Diff(want[j], s[j].Values(), cmp.Comparer(func(a, b float64) bool {
			return math.IsNaN(a) && math.IsNaN(b) || math.Abs(a-b) <= 1e-12*math.Abs(a)
		})); d != "" {
			t.Errorf("column %d (%s) (-want +got):\n%s", j+1, r.Columns()[j].Name, d)
		}
	}
	cols := r.Columns()
	if cols[1].Name != "Q, flow" || cols[1].Missing != 1 || cols[4].Missing != 1 || cols[0].Missing != 0 {
		t.Errorf("columns %+v", cols)
	}
	if !cols[2].Gauge || cols[2].Unit.String() != "Pa" {
		t.Errorf("gauge column %+v", cols[2])
	}
	if _, n, err := r.Read(s, 0); err != io.EOF || n != 0 {
		t.Errorf("Read at end: %d, %v; want io.EOF", n, err)
	}
}

func TestMissingMarkers(t *testing.T) {
	for _, tc := range []struct {
		marker, text string
		missing      int
	}{
		{"-999", "x [m]\n1\n-999\n-999.5\nNA\n\n", 2},
		{"-", "x [m]\n1\n-\n-1\nnan\n", 2},
		{"", "x [m]\n1\n NaN \n,\n", 0}, // the blank line is skipped; ",," is ragged
	} {
		r, err := chanfile.NewReader(strings.NewReader(tc.text), "m.csv", chanfile.Options{Missing: tc.marker})
		if err != nil {
			t.Fatal(err)
		}
		s, _, err := r.Read(nil, 0)
		if tc.marker == "" {
			if err == nil || !strings.Contains(err.Error(), "a row of 2 fields") {
				t.Errorf("marker %q: %v, want a ragged-row error", tc.marker, err)
			}
			continue
		}
		if err != nil {
			t.Fatalf("marker %q: %v", tc.marker, err)
		}
		if got := r.Columns()[0].Missing; got != tc.missing {
			t.Errorf("marker %q: %d missing, want %d (%v)", tc.marker, got, tc.missing, s[0].Values())
		}
	}
}

func TestReadChunks(t *testing.T) {
	var sb strings.Builder
	sb.WriteString("x [m]\ty [s]\n")
	for i := range 10 {
		sb.WriteString(strings.Repeat("1", 1) + "\t" + string(rune('0'+i)) + "\n")
	}
	r, err := chanfile.NewReader(strings.NewReader(sb.String()), "t.tsv", chanfile.Options{Comma: '\t'})
	if err != nil {
		t.Fatal(err)
	}
	var got []int
	var ys []float64
	var s []quantity.Series
	if r.Offset() != 12 { // the header line, "x [m]\ty [s]\n"
		t.Errorf("Offset after the header = %d, want 12", r.Offset())
	}
	for {
		var n int
		s, n, err = r.Read(s, 3)
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		got = append(got, n)
		ys = append(ys, s[1].Values()...)
	}
	if r.Offset() != int64(sb.Len()) {
		t.Errorf("Offset at the end = %d, want the file's %d bytes", r.Offset(), sb.Len())
	}
	if d := cmp.Diff([]int{3, 3, 3, 1}, got); d != "" {
		t.Errorf("chunks (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]float64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9}, ys); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
}

// TestMalformed: each malformed file gives an error at the line and
// column expected.
func TestMalformed(t *testing.T) {
	tests := []struct {
		name, text   string
		opt          chanfile.Options
		line, column int
		says         string
		is           error
	}{
		{"empty", "", chanfile.Options{}, 1, 0, "no header", quantity.ErrParse},
		{"comments only", "# a\n# b\n", chanfile.Options{}, 2, 0, "no header", quantity.ErrParse},
		{"ragged", "a [m],b [m]\n1,2\n3\n", chanfile.Options{}, 3, 0, "a row of 1 fields, not the header's 2", quantity.ErrParse},
		{"crlf ragged", "a [m],b [m]\r\n1,2\r\n3,4,5\r\n", chanfile.Options{}, 3, 0, "a row of 3 fields", quantity.ErrParse},
		{"text after quote", "a [m],b [m]\n\"1\"x,2\n", chanfile.Options{}, 2, 1, "after the closing quote", quantity.ErrParse},
		{"long line", "a [m]\n" + strings.Repeat("1", 1<<17) + "\n", chanfile.Options{}, 2, 0, "longer than", quantity.ErrParse},
		{"bad delimiter", "a [m]\n1\n", chanfile.Options{Comma: '"'}, 0, 0, "delimiter", quantity.ErrInvalid},
		{"unit in data", "V [kn]\n12 kn\n", chanfile.Options{}, 2, 1, "unit belongs in the header", quantity.ErrParse},
		{"dialect unit in data", "Q m3/h\n160 m3/h\n", chanfile.Options{}, 2, 1, "unit belongs in the header", quantity.ErrParse},
		{"text in data", "V [kn]\n1\nabc\n", chanfile.Options{}, 3, 1, "not a finite number", quantity.ErrParse},
		{"infinite", "V [kn]\n1e999\n", chanfile.Options{}, 2, 1, "beyond the range of float64", quantity.ErrRange},
		{"overflow in SI", "L [km]\n1e308\n", chanfile.Options{}, 2, 1, "beyond the range of float64 in SI", quantity.ErrRange},
		{"negative overflow in SI", "t [s],L [km]\n0,-1e308\n", chanfile.Options{}, 2, 2, "beyond the range of float64 in SI", quantity.ErrRange},
		{"underflow", "V [kn]\n1\n1e-400\n", chanfile.Options{}, 3, 1, "too small for float64", quantity.ErrRange},
		{"hex underflow", "V [kn]\n0x1p-2000\n", chanfile.Options{}, 2, 1, "too small for float64", quantity.ErrRange},
		{"underflow in SI", "d [nm]\n1e-320\n", chanfile.Options{}, 2, 1, "beyond the range of float64 in SI", quantity.ErrRange},
		{"unknown unit", "V [furlongs]\n1\n", chanfile.Options{}, 1, 1, "not a unit", quantity.ErrUnknown},
		{"non-UTF-8 data", "V [kn]\n1\xff\n", chanfile.Options{}, 2, 0, "Options.Encoding = chanfile.Windows1252", quantity.ErrParse},
		{"non-UTF-8 header", "V [kn],\xff [m]\n1,2\n", chanfile.Options{}, 1, 0, "Options.Encoding = chanfile.Windows1252", quantity.ErrParse},
		{"non-UTF-8 header, UTF-8 asked", "V [kn],\xff [m]\n1,2\n", chanfile.Options{Encoding: chanfile.UTF8}, 1, 0, "Options.Encoding = chanfile.Windows1252", quantity.ErrParse},
		{"bad quote", "a [m],b [m]\n1,\"2\n", chanfile.Options{}, 2, 2, "may not span lines", quantity.ErrParse},
		{"gauge without reference", "P1 psig\n12\n", chanfile.Options{}, 1, 1, "Options.Reference", quantity.ErrInvalid},
		{"duplicate", "V [kn],V [m/s]\n1,2\n", chanfile.Options{}, 1, 2, "also column 1", quantity.ErrParse},
		{"no unit", "V,t [s]\n1,2\n", chanfile.Options{}, 1, 1, "dimensionless", quantity.ErrParse},
		{"ambiguous unit", "W ton\n1\n", chanfile.Options{}, 1, 1, "refrigeration", quantity.ErrParse},
	}
	for _, tc := range tests {
		r, err := chanfile.NewReader(strings.NewReader(tc.text), tc.name, tc.opt)
		if err == nil {
			_, _, err = r.Read(nil, 0)
			for err == nil {
				_, _, err = r.Read(nil, 0)
			}
		}
		var fe *chanfile.Error
		if !errors.As(err, &fe) || !errors.Is(err, tc.is) || classes(err) != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("%s: error %v, want a *chanfile.Error saying %q", tc.name, err, tc.says)
			continue
		}
		if fe.File != tc.name || fe.Line != tc.line || (tc.column != 0 && fe.Column != tc.column) {
			t.Errorf("%s: error at %s:%d:%d, want %s:%d:%d", tc.name, fe.File, fe.Line, fe.Column, tc.name, tc.line, tc.column)
		}
	}
}

// TestRoundTrip: Series written in chosen units read back to the same
// numbers in those units (rapid): exactly in SI units, and to the unit
// conversion's rounding otherwise.
func TestRoundTrip(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		cols := []chanfile.Column{
			{Name: "V", Unit: units.MustParse("m/s")},
			{Name: "V_kn", Unit: units.MustParse("kn")},
			{Name: "Re", Unit: units.One()},
			{Name: "T", Unit: units.MustParse("degC")},
		}
		n := rapid.IntRange(0, 20).Draw(t, "n")
		s := make([]quantity.Series, len(cols))
		for j, c := range cols {
			v := make([]float64, n)
			for i := range v {
				if rapid.IntRange(0, 9).Draw(t, "missing") == 0 {
					v[i] = math.NaN()
				} else {
					v[i] = rapid.Float64Range(1, 1e6).Draw(t, "v")
					if c.Name == "T" {
						v[i] = rapid.Float64Range(200, 2000).Draw(t, "T") // K
					}
				}
			}
			s[j] = quantity.NewSeries(v, c.Unit.Dim())
		}
		var buf bytes.Buffer
		w, err := chanfile.NewWriter(&buf, "t.csv", cols, chanfile.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if err := w.Write(s); err != nil {
			t.Fatal(err)
		}
		if err := w.Flush(); err != nil {
			t.Fatal(err)
		}
		r, err := chanfile.NewReader(&buf, "rt.csv", chanfile.Options{})
		if err != nil {
			t.Fatalf("%v\n%s", err, buf.String())
		}
		back, m, err := r.Read(nil, 0)
		if n == 0 {
			if err != io.EOF {
				t.Fatalf("empty file: %v", err)
			}
			return
		}
		if err != nil || m != n {
			t.Fatalf("read %d of %d rows: %v", m, n, err)
		}
		for j, c := range r.Columns() {
			if c.Name != cols[j].Name || !c.Unit.Equal(cols[j].Unit) {
				t.Fatalf("column %d read back as %+v", j, c)
			}
			for i, x := range s[j].Values() {
				y := back[j].Values()[i]
				tol := 0.0
				if j%2 == 1 {
					tol = 2e-15 * math.Abs(x) // kn and °C: one conversion each way
				}
				if math.IsNaN(x) != math.IsNaN(y) || math.Abs(x-y) > tol {
					t.Fatalf("column %d row %d: %v read back as %v", j, i, x, y)
				}
			}
		}
	})
}

func TestWriterRefuses(t *testing.T) {
	pa := units.MustParse("Pa")
	for _, tc := range []struct {
		cols []chanfile.Column
		s    []quantity.Series
		says string
	}{
		{[]chanfile.Column{{Name: "P1", Unit: pa, Gauge: true}}, nil, "gauge column"},
		{[]chanfile.Column{{Unit: pa}}, nil, "without a name"},
		{[]chanfile.Column{{Name: "P1", Unit: pa}}, []quantity.Series{quantity.NewSeries([]float64{1}, quantity.Velocity)}, "velocity"},
		{[]chanfile.Column{{Name: "P1", Unit: pa}, {Name: "P2", Unit: pa}}, []quantity.Series{quantity.NewSeries([]float64{1}, quantity.Pressure), quantity.NewSeries([]float64{1, 2}, quantity.Pressure)}, "2 values"},
		{[]chanfile.Column{{Name: "P1", Unit: pa}}, []quantity.Series{}, "0 series for 1 columns"},
		{[]chanfile.Column{{Name: "P1", Unit: pa}}, []quantity.Series{quantity.NewSeries([]float64{1, math.Inf(1)}, quantity.Pressure)}, "an infinite value"},
		// 1e308 m is 1e311 mm, beyond float64: it would be written +Inf.
		{[]chanfile.Column{{Name: "L", Unit: units.MustParse("mm")}}, []quantity.Series{quantity.NewSeries([]float64{1, 1e308}, quantity.Length)}, "t.csv:3:1: \"L\": 1e+308 in SI is beyond the range of float64 in mm"},
		// 5e-324 m, the least subnormal, is 0 in km.
		{[]chanfile.Column{{Name: "L", Unit: units.MustParse("km")}}, []quantity.Series{quantity.NewSeries([]float64{5e-324}, quantity.Length)}, "beyond the range of float64 in km"},
		{[]chanfile.Column{{Name: "a\nb", Unit: pa}}, nil, "would not read back"},
		{[]chanfile.Column{{Name: "#P", Unit: pa}}, nil, "would not read back (no header row)"},
		{[]chanfile.Column{{Name: " P", Unit: pa}}, nil, "would not read back"},
		{[]chanfile.Column{{Name: "P", Unit: pa}, {Name: "P", Unit: pa}}, nil, "also column 1"},
		{[]chanfile.Column{{Name: "P\xff", Unit: pa}}, nil, "UTF-8"},
	} {
		var buf bytes.Buffer
		w, err := chanfile.NewWriter(&buf, "t.csv", tc.cols, chanfile.Options{})
		if err == nil {
			err = w.Write(tc.s)
		}
		if err == nil || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("%+v: error %v, want one saying %q", tc.cols, err, tc.says)
		}
	}
}

func FuzzHeaderField(f *testing.F) {
	for _, s := range []string{"V [kn]", "Torque (in-lb)", "P1 psig", "T_in °F", "Q m3/h", "mu Pa.s", "Re [1]", "x ((", "[", "(g)", "a (g)", "\xff"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		c, err := chanfile.ParseHeaderField(s)
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("ParseHeaderField(%q): %v matches %d error classes, not one", s, err, classes(err))
			}
			return
		}
		if c.Name == "" || c.Text == "" {
			t.Fatalf("ParseHeaderField(%q) = %+v", s, c)
		}
	})
}

func FuzzReader(f *testing.F) {
	f.Add(pumpLog, uint8(0), false)
	f.Add("a [m],b [m]\n1,2\n3\n", uint8(0), false)
	f.Add("V [kn]\n12 kn\n", uint8(0), false)
	f.Add("x [m]\n\"1\"\n,\n", uint8(0), false)
	f.Add("L [km]\n1e308\n1e-400\n", uint8(0), false)
	f.Add("Zeit;V\n;[kn]\n2026-03-04 10:00:00,5;1,5\n", uint8(0), false)
	f.Add("t[s] V[kn]\n0 1\n", uint8(0), false)
	f.Add("Time\tTag\n10:00\tA\n09:00\tB\n", uint8(0), false)
	f.Add("T [\xb0C]\n1\n", uint8(4), false)
	f.Add("\xff\xfeV\x00 \x00[\x00m\x00]\x00\n\x001\x00", uint8(0), false)
	f.Add("\x00V\x00 \x00[\x00m\x00]\x00\n\x001", uint8(3), false)
	for _, s := range []string{
		"t [s],Temp [degF?],V [kn]\n0,68,1\n1,69,2\n",
		"t [s],Flow [furlongs/fortnight],C,V [m/s],V [kn]\n0,1,2,3,4\n",
		"t;Day;P1;[m/s]\n[s];;psig;\n0;03/04/2026;1;2\n",
		"t [s],Flow (m3/h)),x\n0,1,a\n",
		"time;H\n-;m\n04/03/2026 10:00:00;1,5\n",
		"unix,tag,H\n-,-,\n1700000000,A,1.5\n",
		"t;H\ns;m\n0;1,5\n1;n.a.\n",
	} {
		f.Add(s, uint8(0), true)
		f.Add(s, uint8(0), false)
	}
	f.Fuzz(func(t *testing.T, s string, o uint8, sel bool) {
		// o picks the encoding (low 3 bits), the delimiter and the decimal mark.
		opt := chanfile.Options{Reference: units.StandardReference(), Encoding: chanfile.Encoding(o % 6)}
		opt.Comma = []rune{0, ',', ';', ' '}[o>>3%4]
		opt.Decimal = []byte{0, '.', ',', 0}[o>>5%4]
		if o>>7 == 1 {
			opt.Columns = []string{"V", "t"}
		}
		r, err := chanfile.NewReader(strings.NewReader(s), "f.csv", opt)
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("NewReader: error %v of %d classes", err, classes(err))
			}
			return
		}
		// A column that cannot be read has a fault of one class, at
		// the header's line, and selecting it is refused with it.
		faultLine := 0
		var readable []int
		names := map[string]bool{}
		for k, c := range r.Columns() {
			if c.Fault == nil {
				if !names[c.Name] {
					readable = append(readable, k)
				}
				names[c.Name] = true
				continue
			}
			var fe *chanfile.Error
			if !errors.As(c.Fault, &fe) || classes(c.Fault) != 1 || fe.Line < 1 || fe.Column != c.Index || opt.Columns != nil {
				t.Fatalf("column %d: fault %v (%+v)", k+1, c.Fault, fe)
			}
			faultLine = fe.Line
			if sel {
				if err := r.Select([]int{k}); err != c.Fault {
					t.Fatalf("Select(%d) = %v, want its fault %v", k, err, c.Fault)
				}
			}
		}
		if sel {
			// The columns without a fault, one of each name, always read
			// past the header.
			if err := r.Select(readable); err != nil {
				t.Fatalf("Select(%v), the readable columns: %v", readable, err)
			}
		}
		var dst []quantity.Series
		rows := 0
		for range 1 << 20 {
			var n int
			dst, n, err = r.Read(dst, 7)
			rows += n
			if err != nil {
				break
			}
			for j, c := range r.Columns() {
				if sel && !slices.Contains(readable, j) {
					if dst[j].Len() != 0 {
						t.Fatalf("unselected column %d: %d values", j, dst[j].Len())
					}
					continue
				}
				if c.Kind == chanfile.Label {
					if dst[j].Len() != 0 || len(r.Labels(j)) != n {
						t.Fatalf("label column %d: %d values, %d labels for %d rows", j, dst[j].Len(), len(r.Labels(j)), n)
					}
					continue
				}
				if dst[j].Len() != n || dst[j].Dim() != c.Unit.Dim() {
					t.Fatalf("column %d: %d values of %v for %d rows", j, dst[j].Len(), dst[j].Dim(), n)
				}
				for _, x := range dst[j].Values() {
					if math.IsInf(x, 0) {
						t.Fatalf("column %d: %v with a nil error", j, x)
					}
				}
			}
		}
		if err != io.EOF && classes(err) != 1 {
			t.Fatalf("error %v is neither io.EOF nor of one error class", err)
		}
		var fe *chanfile.Error
		if sel && errors.As(err, &fe) && faultLine > 0 && fe.Line == faultLine {
			t.Fatalf("with the readable columns selected: %v, at the header's line", err)
		}
		if rows > len(s) {
			t.Fatalf("%d rows from %d bytes", rows, len(s))
		}
	})
}
