package chanfile_test

import (
	"bytes"
	"errors"
	"io"
	"math"
	"os"
	"strings"
	"testing"
	"time"
	_ "time/tzdata" // the zone database, wherever the tests run
	"unicode/utf16"
	"unicode/utf8"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// readAll reads every row of a file, failing the test on an error.
func readAll(t *testing.T, r *chanfile.Reader) ([][]float64, [][]string) {
	t.Helper()
	cols := r.Columns()
	vals := make([][]float64, len(cols))
	labels := make([][]string, len(cols))
	var dst []quantity.Series
	for range 1000 {
		var n int
		var err error
		dst, n, err = r.Read(dst, 2)
		if err == io.EOF {
			return vals, labels
		}
		if err != nil {
			t.Fatalf("Read: %v", err)
		}
		for j := range cols {
			vals[j] = append(vals[j], dst[j].Values()...)
			labels[j] = append(labels[j], r.Labels(j)...)
		}
		_ = n
	}
	t.Fatal("no end of file after 1000 chunks")
	return nil, nil
}

func open(t *testing.T, name string, opt chanfile.Options) (*chanfile.Reader, error) {
	t.Helper()
	f, err := os.Open("testdata/" + name)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { f.Close() })
	return chanfile.NewReader(f, name, opt)
}

// near compares values to 1e-12 relative, NaN equal to NaN.
var near = cmp.Comparer(func(a, b float64) bool {
	if math.IsNaN(a) || math.IsNaN(b) {
		return math.IsNaN(a) && math.IsNaN(b)
	}
	return math.Abs(a-b) <= 1e-12*math.Max(math.Abs(a), math.Abs(b))
})

// TestSemicolonExport reads an invented export as a European data system
// writes it: ';' delimiter, decimal commas, units in a row under the
// names, ISO 8601 timestamps with a comma before the fraction, CR LF.
func TestSemicolonExport(t *testing.T) {
	r, err := open(t, "semicolon_decimal_comma.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	fm := r.Format()
	if fm.Comma != ';' || fm.Decimal != ',' || !fm.UnitsRow || fm.Encoding != chanfile.UTF8 {
		t.Errorf("Format = %+v, want ';', ',', a units row, UTF-8", fm)
	}
	var from []string
	for _, rd := range fm.Readings {
		from = append(from, rd.From)
	}
	if d := cmp.Diff([]string{"delimiter", "decimal mark", "line 3"}, from); d != "" {
		t.Errorf("Format readings (-want +got):\n%s", d)
	}
	cols := r.Columns()
	var names []string
	var kinds []chanfile.Kind
	for _, c := range cols {
		names = append(names, c.Name)
		kinds = append(kinds, c.Kind)
	}
	if d := cmp.Diff([]string{"Zeit", "Pump speed", "Q", "p1", "T"}, names); d != "" {
		t.Errorf("names (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]chanfile.Kind{chanfile.Timestamp, chanfile.Number, chanfile.Number, chanfile.Number, chanfile.Number}, kinds); d != "" {
		t.Errorf("kinds (-want +got):\n%s", d)
	}
	if want := time.Date(2026, 3, 4, 10, 15, 30, 0, time.UTC); !cols[0].Start.Equal(want) {
		t.Errorf("start %v, want %v", cols[0].Start, want)
	}
	vals, _ := readAll(t, r)
	nan := math.NaN()
	rpm := 2 * math.Pi / 60 // rad/s per rev/min, by definition
	want := [][]float64{
		{0, 0.5, 1.0}, // s from 10:15:30,0
		{1450 * rpm, 1452 * rpm, nan},
		{41.2 / 3600, 41.4 / 3600, 41.5 / 3600}, // m3/h to m3/s
		{1.013e5, 1.015e5, nan},                 // bar(a) to Pa
		{293.65, 293.75, 293.75},                // °C + 273.15
	}
	if d := cmp.Diff(want, vals, near); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if cols[1].Missing != 1 || cols[3].Missing != 1 {
		t.Errorf("missing counts %d, %d, want 1, 1", cols[1].Missing, cols[3].Missing)
	}
	if len(cols[1].Readings) == 0 || cols[1].Readings[0].From != "U/min" {
		t.Errorf("U/min readings %v", cols[1].Readings)
	}
}

// TestUTF16Export reads an invented UTF-16LE export with a byte-order
// mark: tabs, clock times, knots spelled kts, and a text column.
func TestUTF16Export(t *testing.T) {
	r, err := open(t, "utf16le.tsv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if fm := r.Format(); fm.Encoding != chanfile.UTF16LE || fm.Comma != '\t' || fm.Decimal != '.' {
		t.Errorf("Format = %+v", fm)
	}
	cols := r.Columns()
	if cols[3].Name != "Run tag" || cols[3].Kind != chanfile.Label || cols[0].Kind != chanfile.Timestamp {
		t.Errorf("columns %+v", cols)
	}
	vals, labels := readAll(t, r)
	kn := 1852.0 / 3600 // m/s per knot, by definition
	want := [][]float64{{0, 1, 3}, {12 * kn, 12.5 * kn, 13 * kn}, {291.65, 291.65, 291.75}, nil}
	if d := cmp.Diff(want, vals, near, cmpopts()); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]string{"run 12", "run 12", "run 13"}, labels[3]); d != "" {
		t.Errorf("labels (-want +got):\n%s", d)
	}
	if got := cols[0].Start; got.Hour() != 9 || got.Minute() != 59 || got.Second() != 58 {
		t.Errorf("start %v, want 09:59:58", got)
	}
}

// cmpopts treats nil and empty slices alike.
func cmpopts() cmp.Option {
	return cmp.Transformer("nonil", func(s []float64) []float64 {
		if len(s) == 0 {
			return nil
		}
		return s
	})
}

// TestWindows1252Export refuses an invented export in Windows-1252 with
// the option named, and reads it with that option.
func TestWindows1252Export(t *testing.T) {
	_, err := open(t, "windows1252.csv", chanfile.Options{})
	var fe *chanfile.Error
	if !errors.As(err, &fe) || fe.Line != 2 || !strings.Contains(err.Error(), "Options.Encoding = chanfile.Windows1252") || !errors.Is(err, quantity.ErrParse) {
		t.Fatalf("no option: error %v, want line 2 naming Options.Encoding = chanfile.Windows1252", err)
	}
	r, err := open(t, "windows1252.csv", chanfile.Options{Encoding: chanfile.Windows1252})
	if err != nil {
		t.Fatal(err)
	}
	cols := r.Columns()
	if cols[1].Text != "°C" {
		t.Errorf("unit text %q, want °C", cols[1].Text)
	}
	vals, _ := readAll(t, r)
	psi := 0.45359237 * 9.80665 / (0.0254 * 0.0254) // Pa per psi, from the exact lb, g_n and inch
	want := [][]float64{{0, 1}, {293.15, 294.15}, {14.7 * psi, 14.7 * psi}, {12.5, 12.6}}
	if d := cmp.Diff(want, vals, near); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	// NIST SP 811 Appendix B: 1 psi = 6.894757e3 Pa.
	if math.Abs(psi-6894.757) > 1e-3 {
		t.Errorf("psi %v", psi)
	}
}

// TestTextAndBadCell refuses a file whose unused column has a bad cell
// (naming Options.Columns), then reads the wanted columns by name and by
// alias, with a text column as labels.
func TestTextAndBadCell(t *testing.T) {
	r, err := open(t, "text_and_bad_cell.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	_, _, err = r.Read(nil, 10)
	var fe *chanfile.Error
	if !errors.As(err, &fe) || fe.Line != 4 || fe.Column != 4 || !strings.Contains(err.Error(), "Options.Columns") {
		t.Fatalf("all columns: error %v, want line 4 column 4 naming Options.Columns", err)
	}
	r, err = open(t, "text_and_bad_cell.csv", chanfile.Options{
		Columns: []string{"V", "n", "Operator", "t"},
		Aliases: map[string]string{"Pump speed [RPM]": "n"},
	})
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, c := range r.Columns() {
		names = append(names, c.Name)
	}
	if d := cmp.Diff([]string{"V", "n", "Operator", "t"}, names); d != "" {
		t.Errorf("names (-want +got):\n%s", d)
	}
	vals, labels := readAll(t, r)
	kn, rpm := 1852.0/3600, 2*math.Pi/60
	want := [][]float64{{2 * kn, 2.1 * kn, 2.2 * kn}, {1450 * rpm, 1460 * rpm, 1470 * rpm}, nil, {0, 1, 2}}
	if d := cmp.Diff(want, vals, near, cmpopts()); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]string{"AB", "AB", "CD"}, labels[2]); d != "" {
		t.Errorf("labels (-want +got):\n%s", d)
	}
	if _, err := open(t, "text_and_bad_cell.csv", chanfile.Options{Columns: []string{"Pump"}}); !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), `"Pump speed"`) {
		t.Errorf("unknown column: error %v, want ErrInvalid listing the columns", err)
	}
}

// utf16Bytes encodes s in UTF-16 with a byte-order mark.
func utf16Bytes(s string, big bool) []byte {
	var b []byte
	if big {
		b = []byte{0xfe, 0xff}
	} else {
		b = []byte{0xff, 0xfe}
	}
	for _, u := range utf16.Encode([]rune(s)) {
		if big {
			b = append(b, byte(u>>8), byte(u))
		} else {
			b = append(b, byte(u), byte(u>>8))
		}
	}
	return b
}

// TestExportForms reads small files in the forms a data system writes,
// or refuses them with the fix named.
func TestExportForms(t *testing.T) {
	kn := 1852.0 / 3600
	tests := []struct {
		name string
		text string
		opt  chanfile.Options
		want [][]float64 // column values in SI, by hand
		err  string      // the fix an error names, if refused
	}{
		{"units in brackets", "V [kn],t [s]\n1,2\n", chanfile.Options{}, [][]float64{{kn}, {2}}, ""},
		{"units in parentheses", "V (kn);t (s)\n1,5;2\n", chanfile.Options{}, [][]float64{{1.5 * kn}, {2}}, ""},
		{"units after a slash", "V/kn,Q/(m3/h)\n3,36\n", chanfile.Options{}, [][]float64{{3 * kn}, {0.01}}, ""},
		{"a name with a slash", "dp/dx,t [s]\n3,1\n", chanfile.Options{}, nil, `"dp/dx [1]"`},
		{"label names", "Run tag,Op [who],Time [hh:mm:ss],Shift crew,t [s]\nA,B,10:00:00,C,1\n", chanfile.Options{Aliases: map[string]string{"Shift": "crew"}, Columns: []string{"Run tag", "Op", "Time", "crew", "t"}}, [][]float64{nil, nil, {0}, nil, {1}}, ""},
		{"a label with a slash", "Op/Shift,t [s]\nA,1\n", chanfile.Options{}, [][]float64{nil, {1}}, ""},
		{"units row, tabs", "V\tt\nkn\ts\n1\t2\n", chanfile.Options{}, [][]float64{{kn}, {2}}, ""},
		{"whitespace", "t[s]  V[kn]\n0   1.5\n1   2.5\n", chanfile.Options{}, [][]float64{{0, 1}, {1.5 * kn, 2.5 * kn}}, ""},
		{"whitespace, units row", "t V\ns kn\n0 1,5\n1 2,5\n", chanfile.Options{}, [][]float64{{0, 1}, {1.5 * kn, 2.5 * kn}}, ""},
		{"header units of every form", "a [bar(a)];b (kPa(a));c kPa(a);d kPag;e [knots];f [U/min]\n1;1;1;1;1;1\n", chanfile.Options{Reference: units.StandardReference()},
			[][]float64{{1e5}, {1e3}, {1e3}, {101325 + 1e3}, {kn}, {2 * math.Pi / 60}}, ""},
		{"decimal comma forced", "V [kn];t [s]\n1,5;2\n", chanfile.Options{Decimal: ','}, [][]float64{{1.5 * kn}, {2}}, ""},
		{"a point in a comma file", "V [kn];t [s]\n1,5;2\n1.5;3\n", chanfile.Options{Decimal: ','}, nil, "Options.Decimal"},
		{"mixed marks", "V [kn];t [s]\n1,5;2.5\n", chanfile.Options{}, nil, "Options.Decimal"},
		{"epoch seconds", "Unix time [s],V [kn]\n1700000000,1\n1700000000.5,2\n", chanfile.Options{}, [][]float64{{0, 0.5}, {kn, 2 * kn}}, ""},
		{"epoch in ms", "Unix time [ms],V [kn]\n1700000000000,1\n", chanfile.Options{}, [][]float64{{1700000000}, {kn}}, ""},
		{"ISO with zone", "Time,V [kn]\n2026-03-04T23:59:59+01:00,1\n2026-03-04T23:00:01Z,2\n", chanfile.Options{}, [][]float64{{0, 2}, {kn, 2 * kn}}, ""}, // 23:59:59+01:00 is 22:59:59Z
		{"dotted date", "Datum Zeit;V [kn]\n04.03.2026 10:00:00;1\n05.03.2026 10:00:00;2\n", chanfile.Options{}, [][]float64{{0, 86400}, {kn, 2 * kn}}, ""},
		{"slash dates", "Date,V [kn]\n03/04/2026 10:00,1\n", chanfile.Options{}, nil, "Options.SlashDates"},
		{"slash dates, day first", "Date,V [kn]\n03/04/2026 10:00,1\n4/4/2026 10:00,2\n", chanfile.Options{SlashDates: chanfile.DayFirst}, [][]float64{{0, 86400}, {kn, 2 * kn}}, ""},          // 3 April to 4 April
		{"slash dates, month first", "Date,V [kn]\n03/04/2026 10:00,1\n4/4/2026 10:00,2\n", chanfile.Options{SlashDates: chanfile.MonthFirst}, [][]float64{{0, 31 * 86400}, {kn, 2 * kn}}, ""}, // 4 March to 4 April: 31 days
		{"slash dates, two-digit year", "Date,V [kn]\n03/04/26,1\n", chanfile.Options{SlashDates: chanfile.DayFirst}, nil, "four-digit year"},
		{"dotted date, one digit", "Date;V [kn]\n4.3.2026;1\n5.3.2026;2\n", chanfile.Options{}, [][]float64{{0, 86400}, {kn, 2 * kn}}, ""},
		{"clock back", "Time,V [kn]\n23:59:59,1\n00:00:01,2\n", chanfile.Options{}, nil, "log the date"},
		{"missing markers", "V [kn],t [s]\n---,1\n-9999,2\n,3\n", chanfile.Options{MissingValues: []string{"---", "-9999"}}, nil, "not a finite number"},
		{"missing markers and empty", "V [kn],t [s]\n---,1\n-9999,2\n,3\n", chanfile.Options{MissingValues: []string{"---", "-9999", ""}}, [][]float64{{math.NaN(), math.NaN(), math.NaN()}, {1, 2, 3}}, ""},
		{"spreadsheet #N/A", "V [kn],t [s]\n#N/A,1\n", chanfile.Options{}, [][]float64{{math.NaN()}, {1}}, ""},
		{"a comment after a row", "V [kn],t [s]\n#N/A,1\n# note\n2,2\n", chanfile.Options{}, [][]float64{{math.NaN(), 2 * kn}, {1, 2}}, ""},
		{"bare C", "T [C],t [s]\n20,1\n", chanfile.Options{}, nil, "write °C or degC"},
		{"spellings", "M [Nm],n [RPM],p [psia],q [CFM],h [mWC],V [kts]\n1,1,1,1,1,1\n", chanfile.Options{},
			[][]float64{{1}, {2 * math.Pi / 60}, {6894.757293168361}, {0.028316846592 / 60}, {9806.65}, {kn}}, ""},
		{"gauge kPag", "p [kPag]\n1\n", chanfile.Options{Reference: units.StandardReference()}, [][]float64{{101325 + 1000}}, ""},
		{"UTF-16 BE", string(utf16Bytes("V [kn]\tT [°C]\n1\t20\n", true)), chanfile.Options{}, [][]float64{{kn}, {293.15}}, ""},
		{"UTF-16 LE, no mark", string(utf16Bytes("V [kn],T [°C]\n1,20\n", false)[2:]), chanfile.Options{}, nil, "Options.Encoding = chanfile.UTF16LE"},
		{"UTF-16 LE, no mark, given", string(utf16Bytes("V [kn],T [°C]\n1,20\n", false)[2:]), chanfile.Options{Encoding: chanfile.UTF16LE}, [][]float64{{kn}, {293.15}}, ""},
		{"Latin-1", "T [\xb0C]\n20\n", chanfile.Options{Encoding: chanfile.Latin1}, [][]float64{{293.15}}, ""},
		{"Windows-1252 undefined byte", "T [\x81C]\n20\n", chanfile.Options{Encoding: chanfile.Windows1252}, nil, "Latin1"},
		{"name with spaces by alias", "Pump speed [rpm]\n60\n", chanfile.Options{Aliases: map[string]string{"Pump speed": "n"}, Columns: []string{"n"}}, [][]float64{{2 * math.Pi}}, ""},
		{"unused column with an unknown unit", "a [furlongs],b [m]\n1,2\n", chanfile.Options{Columns: []string{"b"}}, [][]float64{{2}}, ""},
	}
	for _, tc := range tests {
		r, err := chanfile.NewReader(strings.NewReader(tc.text), tc.name, tc.opt)
		var vals [][]float64
		if err == nil {
			var dst []quantity.Series
			for range 100 {
				var n int
				dst, n, err = r.Read(dst, 100)
				if n > 0 {
					if vals == nil {
						vals = make([][]float64, len(dst))
					}
					for j := range dst {
						vals[j] = append(vals[j], dst[j].Values()...)
					}
				}
				if err != nil {
					break
				}
			}
			if err == io.EOF {
				err = nil
			}
		}
		if tc.err != "" {
			if err == nil || !strings.Contains(err.Error(), tc.err) || classes(err) != 1 {
				t.Errorf("%s: error %v, want one naming %q, in one class", tc.name, err, tc.err)
			}
			continue
		}
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if d := cmp.Diff(tc.want, vals, near); d != "" {
			t.Errorf("%s: values (-want +got):\n%s", tc.name, d)
		}
	}
}

// TestSniffBounded checks that detection looks only at the first
// SniffBytes bytes: a file whose early lines are ';'-delimited is read so
// even when later lines would say otherwise.
func TestSniffBounded(t *testing.T) {
	var b bytes.Buffer
	b.WriteString("a [m];b [m]\n")
	for b.Len() < chanfile.SniffBytes+100 {
		b.WriteString("1;2\n")
	}
	b.WriteString("1,5;2\n")
	r, err := chanfile.NewReader(&b, "big.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if fm := r.Format(); fm.Comma != ';' || fm.Decimal != '.' {
		t.Fatalf("Format %+v", fm)
	}
	var dst []quantity.Series
	for range 1000 {
		_, _, err = r.Read(dst, 1<<20)
		if err != nil {
			break
		}
	}
	if err == nil || err == io.EOF || !strings.Contains(err.Error(), "not a finite number") {
		t.Errorf("a decimal comma after the sniffed lines: error %v", err)
	}
}

// FuzzTimestamp reads a time column of two fuzzed fields: never a panic,
// an error of one class, or times that are finite, 0 at the first sample
// of a Timestamp column.
func FuzzTimestamp(f *testing.F) {
	for _, p := range [][2]string{
		{"2026-03-04T10:00:00Z", "2026-03-04T10:00:01.5+01:00"},
		{"10:00:00,5", "10:00:01"},
		{"04.03.2026 10:00", "31.12.9999 23:59"},
		{"1700000000", "1e10"},
		{"0001-01-01", "9999-12-31"},
		{"23:59", "00:00"},
	} {
		f.Add(p[0], p[1], false)
		f.Add(p[0], p[1], true)
	}
	f.Fuzz(func(t *testing.T, a, b string, epoch bool) {
		if strings.ContainsAny(a+b, ",\n\r\"#") {
			return
		}
		name := "Time"
		if epoch {
			name = "Unix time"
		}
		text := name + ",V [kn]\n" + a + ",1\n" + b + ",2\n"
		r, err := chanfile.NewReader(strings.NewReader(text), "t.csv", chanfile.Options{Comma: ','})
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("NewReader(%q): error %v of %d classes", text, err, classes(err))
			}
			return
		}
		dst, n, err := r.Read(nil, 10)
		if err != nil && err != io.EOF && classes(err) != 1 {
			t.Fatalf("Read(%q): error %v of %d classes", text, err, classes(err))
		}
		c := r.Columns()[0]
		if c.Kind != chanfile.Timestamp || n == 0 {
			return
		}
		v := dst[0].Values()
		for _, x := range v {
			if math.IsInf(x, 0) {
				t.Fatalf("Read(%q): %v", text, v)
			}
		}
		if !math.IsNaN(v[0]) && v[0] != 0 {
			t.Fatalf("Read(%q): first time %v, want 0", text, v[0])
		}
	})
}

// FuzzDecode decodes fuzzed bytes as UTF-16 and the 8-bit code pages:
// never a panic, and what is read is valid UTF-8.
func FuzzDecode(f *testing.F) {
	f.Add([]byte("\xff\xfeV\x00 \x00[\x00m\x00]\x00\n\x001\x00"), uint8(0))
	f.Add([]byte("\x00V\x00 \x00[\x00m\x00]\x00\n\x001"), uint8(1))
	f.Add([]byte("\x00\xd8\x00\xdc"), uint8(0))
	f.Add([]byte("T [\xb0C]\n\x81\n"), uint8(3))
	f.Fuzz(func(t *testing.T, b []byte, e uint8) {
		enc := []chanfile.Encoding{chanfile.UTF16LE, chanfile.UTF16BE, chanfile.Latin1, chanfile.Windows1252}[e%4]
		r, err := chanfile.NewReader(bytes.NewReader(b), "d.csv", chanfile.Options{Encoding: enc, Columns: nil})
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("error %v of %d classes", err, classes(err))
			}
			return
		}
		for _, c := range r.Columns() {
			if !utf8.ValidString(c.Name) {
				t.Fatalf("name %q is not UTF-8", c.Name)
			}
		}
		for range 1 << 12 {
			_, _, err := r.Read(nil, 64)
			if err != nil {
				if err != io.EOF && classes(err) != 1 {
					t.Fatalf("error %v of %d classes", err, classes(err))
				}
				return
			}
			for j, c := range r.Columns() {
				if c.Kind == chanfile.Label {
					for _, l := range r.Labels(j) {
						if !utf8.ValidString(l) {
							t.Fatalf("label %q is not UTF-8", l)
						}
					}
				}
			}
		}
	})
}

// TestColumnNames checks the names and kinds given to columns that are
// not numbers: a text field split at a space is named whole, a bracketed
// one keeps its name, and an alias always wins.
func TestColumnNames(t *testing.T) {
	const text = "Run tag,Op [who],Time [hh:mm:ss],Shift crew,t [s]\nA,B,10:00:00,C,1\n"
	r, err := chanfile.NewReader(strings.NewReader(text), "n.csv", chanfile.Options{Aliases: map[string]string{"Shift": "crew"}})
	if err != nil {
		t.Fatal(err)
	}
	type nk struct {
		Name string
		Kind chanfile.Kind
	}
	var got []nk
	for _, c := range r.Columns() {
		got = append(got, nk{c.Name, c.Kind})
	}
	want := []nk{{"Run tag", chanfile.Label}, {"Op", chanfile.Label}, {"Time", chanfile.Timestamp}, {"crew", chanfile.Label}, {"t", chanfile.Number}}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("columns (-want +got):\n%s", d)
	}
}

// FuzzSniff checks what detection makes of any first lines: a delimiter
// and a decimal mark of the documented set that differ, and a reading
// for each detected choice.
func FuzzSniff(f *testing.F) {
	for _, s := range []string{"a;b\n1,5;2\n", "a b\n1 2\n", "a\tb\n1\t2\n", "a,b\n1.5,2\n", "t V\ns kn\n0 1,5\n", "x;y\n1,5;2.5\n", "", "#\n"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		r, err := chanfile.NewReader(strings.NewReader(s), "s.csv", chanfile.Options{})
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("NewReader(%q): error %v of %d classes", s, err, classes(err))
			}
			return
		}
		fm := r.Format()
		if !strings.ContainsRune(",;\t ", fm.Comma) || (fm.Decimal != '.' && fm.Decimal != ',') || rune(fm.Decimal) == fm.Comma {
			t.Fatalf("NewReader(%q): Format %+v", s, fm)
		}
		for _, rd := range fm.Readings {
			if rd.From == "" || rd.To == "" {
				t.Fatalf("NewReader(%q): reading %+v", s, rd)
			}
		}
	})
}

// TestLocation reads clock times written without a zone in the zone
// given: across the start of summer time in Berlin (2026-03-29, 02:00 CET
// becomes 03:00 CEST, EU rule: last Sunday of March) 01:30 to 03:30 on
// the wall clock is one hour, 00:30Z to 01:30Z.
func TestLocation(t *testing.T) {
	berlin, err := time.LoadLocation("Europe/Berlin")
	if err != nil {
		t.Fatal(err)
	}
	const text = "Time,V [kn]\n2026-03-29 01:30:00,1\n2026-03-29 03:30:00,2\n"
	for _, tc := range []struct {
		loc  *time.Location
		want float64
		note string
	}{
		{nil, 7200, "read in UTC"},
		{berlin, 3600, "read in Europe/Berlin"},
	} {
		r, err := chanfile.NewReader(strings.NewReader(text), "z.csv", chanfile.Options{Location: tc.loc})
		if err != nil {
			t.Fatal(err)
		}
		s, _, err := r.Read(nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		c := r.Columns()[0]
		if got := s[0].Values()[1]; got != tc.want {
			t.Errorf("%v: %v s, want %v", tc.loc, got, tc.want)
		}
		if len(c.Readings) != 1 || !strings.Contains(c.Readings[0].Note, tc.note) {
			t.Errorf("%v: readings %v, want one saying %q", tc.loc, c.Readings, tc.note)
		}
	}
}
