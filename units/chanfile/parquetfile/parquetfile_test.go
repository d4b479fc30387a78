package parquetfile

import (
	"bytes"
	"errors"
	"io"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// tb is what the helpers need of a *testing.T or a *rapid.T.
type tb interface {
	Helper()
	Fatal(...any)
}

func col(name, unit string) chanfile.Column {
	c, err := chanfile.ParseHeaderField(name + " [" + unit + "]")
	if err != nil {
		panic(err)
	}
	return c
}

// readAll reads every row of a file into one Series per column.
func readAll(t tb, b []byte, opt Options) ([]chanfile.Column, [][]float64, error) {
	t.Helper()
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", opt)
	if err != nil {
		return nil, nil, err
	}
	var dst []quantity.Series
	var out [][]float64
	for {
		var n int
		dst, n, err = r.Read(dst, 3) // small chunks cross row groups
		if err == io.EOF {
			break
		}
		if err != nil {
			return r.Columns(), out, err
		}
		if out == nil {
			out = make([][]float64, len(dst))
		}
		for j := range dst {
			if r.Kind(j) != Label {
				out[j] = append(out[j], dst[j].Values()[:n]...)
			}
		}
	}
	return r.Columns(), out, nil
}

func write(t tb, cols []chanfile.Column, opt Options, s ...quantity.Series) []byte {
	t.Helper()
	var buf bytes.Buffer
	w, err := NewWriter(&buf, "t.parquet", cols, opt)
	if err != nil {
		t.Fatal(err)
	}
	if err := w.Write(s); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// TestRoundTrip writes channels in knots, degrees Celsius and a
// dimensionless group and reads them back: the same names, units and SI
// values bit for bit, the order kept, a missing value kept and counted.
// The knot (1852/3600 m/s exactly) and the kelvin offset 273.15 are the SI
// Brochure's (9th ed., Table 8 and §2.3.1).
func TestRoundTrip(t *testing.T) {
	cols := []chanfile.Column{col("V", "kn"), col("T", "°C"), col("Re", "1"), col("A", "m^2")}
	v := quantity.NewSeries([]float64{1852.0 / 3600 * 4, 1852.0 / 3600 * 6.5, math.NaN()}, quantity.Velocity)
	temp := quantity.NewSeries([]float64{288.15, 293.15, 300.4}, quantity.Temperature)
	re := quantity.NewSeries([]float64{1e6, 2.5e6, 3.1e6}, quantity.Dimensionless)
	a := quantity.NewSeries([]float64{0.5, 0.5, 0.5}, quantity.Area)
	b := write(t, cols, Options{RowGroupRows: 2}, v, temp, re, a)

	got, vals, err := readAll(t, b, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var names, unitsText []string
	for _, c := range got {
		names = append(names, c.Name)
		unitsText = append(unitsText, c.Unit.String())
	}
	if d := cmp.Diff([]string{"V", "T", "Re", "A"}, names); d != "" {
		t.Errorf("names (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]string{"kn", "degC", "1", "m^2"}, unitsText); d != "" {
		t.Errorf("units (-want +got):\n%s", d)
	}
	if got[0].Missing != 1 {
		t.Errorf("V missing = %d, want 1", got[0].Missing)
	}
	want := [][]float64{v.Values(), temp.Values(), re.Values(), a.Values()}
	// Values are stored in the column's unit, so a unit with a factor
	// other than 1 may move the SI value by an ulp; the kelvin are exact.
	if d := cmp.Diff(want, vals, cmp.Comparer(func(x, y float64) bool {
		return math.Abs(x-y) <= 2e-16*math.Abs(x) || math.IsNaN(x) && math.IsNaN(y)
	})); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	// The unit is in the footer under the documented key, in the column's unit.
	f, err := parquet.OpenFile(bytes.NewReader(b), int64(len(b)))
	if err != nil {
		t.Fatal(err)
	}
	if u, ok := f.Lookup(UnitKey + "V"); !ok || u != "kn" {
		t.Errorf("metadata %q = %q, %v; want kn", UnitKey+"V", u, ok)
	}
	if f.NumRows() != 3 || len(f.RowGroups()) != 2 {
		t.Errorf("%d rows in %d row groups, want 3 in 2", f.NumRows(), len(f.RowGroups()))
	}
	// The stored number is the value in the column's unit: 4 kn is 4.
	r := parquet.NewGenericReader[any](f)
	rows := make([]parquet.Row, 1)
	if n, _ := r.ReadRows(rows); n != 1 || rows[0][0].Double() != 4 || math.Abs(rows[0][1].Double()-15) > 1e-12 {
		t.Errorf("first stored row = %v, want V 4 and T 15", rows[0])
	}
}

// TestRoundTripProperty: any finite values in any of a few units read
// back to the same float64 in SI after the conversion there and back
// (the values written are in the column's unit, so the check is on what
// the unit conversion preserves: exact for factor-only units).
func TestRoundTripProperty(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		unit := rapid.SampledFrom([]string{"m/s", "1", "Pa", "kg/m^3", "N*m"}).Draw(t, "unit")
		xs := rapid.SliceOfN(rapid.Float64Range(-1e12, 1e12), 0, 50).Draw(t, "xs")
		c := col("x", unit)
		b := write(t, []chanfile.Column{c}, Options{RowGroupRows: 7}, quantity.NewSeries(xs, c.Unit.Dim()))
		_, vals, err := readAll(t, b, Options{})
		if err != nil {
			t.Fatal(err)
		}
		var got []float64
		if len(vals) > 0 {
			got = vals[0]
		}
		if len(xs) == 0 {
			xs = nil
		}
		if d := cmp.Diff(xs, got); d != "" {
			t.Fatalf("(-want +got):\n%s", d)
		}
	})
}

// foreign writes a file the way another program might: a struct schema,
// no unit metadata.
func foreign[T any](t *testing.T, rows []T, kv ...string) []byte {
	t.Helper()
	var buf bytes.Buffer
	var opts []parquet.WriterOption
	for i := 0; i+1 < len(kv); i += 2 {
		opts = append(opts, parquet.KeyValueMetadata(kv[i], kv[i+1]))
	}
	w := parquet.NewGenericWriter[T](&buf, opts...)
	if _, err := w.Write(rows); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// TestForeignFiles reads files written without similis: units from the
// column name or from Options.Units, integers and floats converted, and
// every column that cannot be read refused with its name.
func TestForeignFiles(t *testing.T) {
	type named struct {
		V  float64 `parquet:"V [kn]"`
		P  float32 `parquet:"P1 psig"`
		N  int32   `parquet:"n [rpm]"`
		Ct int64   `parquet:"count [1]"`
	}
	b := foreign(t, []named{{V: 2, P: 10, N: 1200, Ct: 7}})
	// psig needs a reference pressure.
	if _, _, err := readAll(t, b, Options{}); !errors.Is(err, units.ErrGauge) {
		t.Fatalf("gauge column without a reference: err = %v, want ErrGauge", err)
	}
	cols, vals, err := readAll(t, b, Options{Reference: units.StandardReference()})
	if err != nil {
		t.Fatal(err)
	}
	// Hand values: 2 kn = 2·1852/3600 m/s; 10 psi = 10·6894.757293168361 Pa
	// (NIST SP 811, B.8) above 101325 Pa; 1200 rpm = 1200·2π/60 rad/s.
	want := []float64{2 * 1852.0 / 3600, 10*6894.757293168361 + 101325, 1200 * 2 * math.Pi / 60, 7}
	for j, w := range want {
		if g := vals[j][0]; math.Abs(g-w) > 1e-12*math.Abs(w) {
			t.Errorf("column %s = %v, want %v", cols[j].Name, g, w)
		}
	}
	if !cols[1].Gauge {
		t.Errorf("P1 not marked gauge")
	}

	type bare struct {
		V float64 `parquet:"V"`
	}
	b = foreign(t, []bare{{1}})
	if _, _, err := readAll(t, b, Options{}); err == nil || !strings.Contains(err.Error(), "no unit") {
		t.Errorf("a column with no unit: err = %v", err)
	}
	cols, vals, err = readAll(t, b, Options{Units: map[string]string{"V": "ft/s"}})
	if err != nil || cols[0].Unit.String() != "ft/s" || vals[0][0] != 0.3048 {
		t.Errorf("Options.Units: %v %v %v, want ft/s and 0.3048 m/s (exact, NIST SP 811)", cols, vals, err)
	}
	if _, _, err := readAll(t, b, Options{Units: map[string]string{"W": "m"}}); err == nil {
		t.Errorf("Options.Units naming an absent column: no error")
	}
	bm := foreign(t, []bare{{1}}, UnitKey+"V", "m/s")
	if _, _, err := readAll(t, bm, Options{Units: map[string]string{"V": "ft/s"}}); err == nil || !strings.Contains(err.Error(), "give one") {
		t.Errorf("metadata and Options.Units both: err = %v", err)
	}

	type blob struct {
		S []byte `parquet:"S [m]"`
	}
	type fixed4 struct {
		F [4]byte `parquet:"F [m]"`
	}
	type js struct {
		J string `parquet:"J [1],json"`
	}
	type rep struct {
		R []float64 `parquet:"R [m]"`
	}
	for _, c := range []struct {
		name  string
		b     []byte
		want  string
		class error
	}{
		{"bytes", foreign(t, []blob{{[]byte("a")}}), "physical type BYTE_ARRAY with no logical type", quantity.ErrParse},
		{"fixed bytes", foreign(t, []fixed4{{}}), "physical type FIXED_LEN_BYTE_ARRAY with no logical type", quantity.ErrParse},
		{"json", foreign(t, []js{{"{}"}}), "logical type JSON stored as BYTE_ARRAY: not read", quantity.ErrParse},
		{"repeated", foreign(t, []rep{{[]float64{1}}}), "repeated", quantity.ErrParse},
		{"bad unit", foreign(t, []bare{{1}}, UnitKey+"V", "furlongs"), "not a unit", quantity.ErrUnknown},
		{"bracket unit", foreign(t, []bare{{1}}, UnitKey+"V", "m] [s"), "brackets", quantity.ErrParse},
		{"infinite", foreign(t, []bare{{math.Inf(1)}}, UnitKey+"V", "m"), "infinite", quantity.ErrRange},
		{"overflow in SI", foreign(t, []bare{{1e308}}, UnitKey+"V", "km"), "beyond the range of float64 in SI", quantity.ErrRange},
		{"underflow in SI", foreign(t, []bare{{1e-320}}, UnitKey+"V", "nm"), "beyond the range of float64 in SI", quantity.ErrRange},
	} {
		_, _, err := readAll(t, c.b, Options{})
		var pe *Error
		if !errors.As(err, &pe) || !errors.Is(err, c.class) || classCount(err) != 1 || !strings.Contains(err.Error(), c.want) || pe.Column != 1 {
			t.Errorf("%s: err = %v, want an *Error on column 1 saying %q", c.name, err, c.want)
		}
	}
	// A NaN stored in a DOUBLE column is a missing value.
	cols, vals, err = readAll(t, foreign(t, []bare{{math.NaN()}, {2}}, UnitKey+"V", "m"), Options{})
	if err != nil || cols[0].Missing != 1 || !math.IsNaN(vals[0][0]) || vals[0][1] != 2 {
		t.Errorf("NaN: %v %v %v", cols, vals, err)
	}
}

// TestDamaged: a truncated or altered file is an *Error, never a panic.
func TestDamaged(t *testing.T) {
	c := col("V", "m/s")
	b := write(t, []chanfile.Column{c}, Options{}, quantity.NewSeries([]float64{1, 2, 3, 4}, quantity.Velocity))
	for _, cut := range []int{0, 3, 8, len(b) / 2, len(b) - 9, len(b) - 1} {
		if _, _, err := readAll(t, b[:cut], Options{}); err == nil {
			t.Errorf("truncated at %d: no error", cut)
		}
	}
	for i := range b {
		d := bytes.Clone(b)
		d[i] ^= 0xff
		readAll(t, d, Options{}) // must not panic
	}
}

// TestWriterRefuses checks the writer's refusals.
func TestWriterRefuses(t *testing.T) {
	var buf bytes.Buffer
	g := col("P", "psig")
	if _, err := NewWriter(&buf, "t.parquet", []chanfile.Column{g}, Options{}); err == nil {
		t.Errorf("gauge column accepted")
	}
	if _, err := NewWriter(&buf, "t.parquet", []chanfile.Column{col("V", "m/s"), col("V", "kn")}, Options{}); err == nil {
		t.Errorf("duplicate column accepted")
	}
	// A name that carries a unit other than the column's would be
	// refused on reading.
	if _, err := NewWriter(&buf, "t.parquet", []chanfile.Column{{Name: "V [kn]", Unit: units.MustParse("m/s")}}, Options{}); !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), `the name carries the unit "kn"`) {
		t.Errorf("name V [kn] for a column in m/s: err = %v", err)
	}
	if _, err := NewWriter(&buf, "t.parquet", []chanfile.Column{{Name: "V [kn]", Unit: units.MustParse("kn")}}, Options{}); err != nil {
		t.Errorf("name V [kn] for a column in kn: err = %v", err)
	}
	if _, err := NewWriter(&buf, "t.parquet", nil, Options{}); err == nil {
		t.Errorf("no columns accepted")
	}
	w, err := NewWriter(&buf, "t.parquet", []chanfile.Column{col("V", "m/s")}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := w.Write([]quantity.Series{quantity.NewSeries([]float64{1}, quantity.Length)}); !errors.Is(err, quantity.ErrDimension) {
		t.Errorf("length for velocity: err = %v", err)
	}
	if err := w.Write([]quantity.Series{quantity.NewSeries([]float64{math.Inf(1)}, quantity.Velocity)}); err == nil || !strings.Contains(err.Error(), "row 1") || !errors.Is(err, quantity.ErrRange) {
		t.Errorf("infinite value: err = %v", err)
	}
	// 1e308 m is 1e311 mm, beyond float64: it would be stored +Inf.
	w, err = NewWriter(&buf, "t.parquet", []chanfile.Column{col("V", "m/s"), col("L", "mm")}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	err = w.Write([]quantity.Series{quantity.NewSeries([]float64{1, 2}, quantity.Velocity), quantity.NewSeries([]float64{1, 1e308}, quantity.Length)})
	if !errors.Is(err, quantity.ErrRange) || !strings.Contains(err.Error(), `t.parquet: row 2: column 2 "L": 1e+308 in SI is beyond the range of float64 in mm`) {
		t.Errorf("overflow in the column's unit: err = %v", err)
	}
	if _, err := NewWriter(&buf, "t.parquet", []chanfile.Column{{Name: "V\xff", Unit: units.MustParse("m")}}, Options{}); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("a name not valid UTF-8: err = %v", err)
	}
}

// FuzzReader: no input crashes the reader or makes it run unbounded.
func FuzzReader(f *testing.F) {
	c := col("V", "kn")
	var buf bytes.Buffer
	w, _ := NewWriter(&buf, "t.parquet", []chanfile.Column{c, col("Re", "1")}, Options{RowGroupRows: 2})
	w.Write([]quantity.Series{quantity.NewSeries([]float64{1, 2, math.NaN()}, quantity.Velocity), quantity.NewSeries([]float64{1, 2, 3}, quantity.Dimensionless)})
	w.Close()
	f.Add(buf.Bytes())
	f.Add(buf.Bytes()[:buf.Len()/2])
	f.Add([]byte("PAR1PAR1"))
	// Files of every kind read, from another program: DECIMAL, TIMESTAMP,
	// DATE, STRING, GZIP and ZSTD pages.
	// BOOLEAN, TIME and INT96 columns, and RLE booleans.
	for _, b := range [][]byte{typedFile(f, parquet.Compression(&parquet.Gzip)), typedFile(f, parquet.Compression(&parquet.Zstd)), legacyFile(f), rleBoolFile(f, 2)} {
		f.Add(b)
		f.Add(b[:len(b)*2/3])
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "f", Options{})
		if err != nil {
			var pe *Error
			if !errors.As(err, &pe) {
				t.Fatalf("error of type %T: %v", err, err)
			}
			return
		}
		var dst []quantity.Series
		for range 1000 {
			var err error
			dst, _, err = r.Read(dst, 64)
			if err != nil {
				return
			}
		}
	})
}
