package parquetfile

import (
	"bytes"
	"encoding/binary"
	"errors"
	"math"
	"strings"
	"testing"
	"time"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/deprecated"
	"github.com/parquet-go/parquet-go/format"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
)

// bools makes a column of BOOLEAN values.
func bools(xs ...bool) []parquet.Value {
	var v []parquet.Value
	for _, x := range xs {
		v = append(v, parquet.BooleanValue(x))
	}
	return v
}

// i96 is the legacy INT96 timestamp of nanoseconds ns within Julian day
// day: 8 bytes of ns and 4 of the day, little-endian, which parquet-go
// holds as three 32-bit words, low first.
func i96(day int32, ns int64) parquet.Value {
	return parquet.Int96Value(deprecated.Int96{uint32(ns), uint32(ns >> 32), uint32(day)})
}

// legacyFile holds a column of each type read here since the code
// before refused them, beside a DOUBLE: a BOOLEAN (optional), TIME in
// ms, µs and ns, and an INT96 timestamp (optional), five rows.
func legacyFile(t tb, opts ...parquet.WriterOption) []byte {
	const hms = 12*3600 + 34*60 + 56 // 12:34:56 in s
	return schemaFile(t, []pcol{
		{"valve [1]", parquet.Optional(parquet.Leaf(parquet.BooleanType)), append(bools(true, false), parquet.NullValue(), parquet.BooleanValue(true), parquet.BooleanValue(true))},
		{"clock_ms", parquet.Time(parquet.Millisecond), i32s(0, hms*1e3+789, 86399999, 86400000, 1)},
		{"clock_us", parquet.TimeAdjusted(parquet.Microsecond, false), i64s(hms*1e6+789012, 0, 1, 86400e6, 5e5)},
		{"clock_ns", parquet.Time(parquet.Nanosecond), i64s(hms*1e9+789012345, 1, 0, 0, 0)},
		{"ts96", parquet.Optional(parquet.Leaf(parquet.Int96Type)), []parquet.Value{
			i96(2460000, 3723000000123), i96(2460000, 3724500000123), i96(2460001, 3723000000373), parquet.NullValue(), i96(2459999, 3722000000122),
		}},
		{"V [m/s]", parquet.Leaf(parquet.DoubleType), []parquet.Value{parquet.DoubleValue(1), parquet.DoubleValue(2), parquet.DoubleValue(3), parquet.DoubleValue(4), parquet.DoubleValue(5)}},
	}, opts...)
}

// TestLegacyColumnsRead: BOOLEAN, TIME and INT96 columns, refused by the
// code before, are read in data pages of either version.
//
// The values are written out by hand. BOOLEAN: true 1, false 0, a null
// missing. TIME: ticks over ticks per second, each an integer exact in
// float64 divided once, so the Go literal of the decimal is the value
// (12:34:56.789 = 12·3600 + 34·60 + 56.789 = 45296.789 s). INT96: the
// first sample is Julian day 2460000, 01:02:03.000000123; the others
// are 1.5 s later (1.5), the next day 250 ns later (86400.00000025), a
// null, and the day before, 1 s and 1 ns earlier (−86401.000000001). Julian day 2460000 is 2023-02-24: Python's datetime gives
// date.fromordinal(2460000 − 1721425) = 2023-02-24, the offset 1721425
// checked by date(1970, 1, 1).toordinal() + 1721425 = 2440588, the
// Julian day number of 1970-01-01 (and 2451545 for 2000-01-01, the
// J2000.0 epoch's day, from memory).
func TestLegacyColumnsRead(t *testing.T) {
	for _, version := range []int{1, 2} {
		b := legacyFile(t, parquet.DataPageVersion(version))
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
		if err != nil {
			t.Fatalf("version %d: %v", version, err)
		}
		dst, n, err := r.Read(nil, 10)
		if err != nil || n != 5 {
			t.Fatalf("version %d: %d rows, %v", version, n, err)
		}
		var got [][]float64
		for j := range dst {
			got = append(got, dst[j].Values())
		}
		// ts96, last row: 01:02:02.000000122 on the day before the first
		// sample's 01:02:03.000000123: −86400 − 1 − 1e-9 s = −86401.000000001.
		want := [][]float64{
			{1, 0, math.NaN(), 1, 1},
			{0, 45296.789, 86399.999, 86400, 0.001},
			{45296.789012, 0, 0.000001, 86400, 0.5},
			{45296.789012345, 1e-9, 0, 0, 0},
			{0, 1.5, 86400.00000025, math.NaN(), -86401.000000001},
			{1, 2, 3, 4, 5},
		}
		if d := cmp.Diff(want, got, sameFloats); d != "" {
			t.Errorf("version %d (-want +got):\n%s", version, d)
		}
		cols := r.Columns()
		type desc struct {
			Name    string
			Unit    string
			Kind    Kind
			Missing int
		}
		var gotDesc []desc
		for j, c := range cols {
			gotDesc = append(gotDesc, desc{c.Name, c.Unit.String(), r.Kind(j), c.Missing})
		}
		wantDesc := []desc{
			{"valve", units.One().String(), Number, 1},
			{"clock_ms", "s", TimeOfDay, 0},
			{"clock_us", "s", TimeOfDay, 0},
			{"clock_ns", "s", TimeOfDay, 0},
			{"ts96", "s", Time, 1},
			{"V", "m/s", Number, 0},
		}
		if d := cmp.Diff(wantDesc, gotDesc); d != "" {
			t.Errorf("version %d: columns (-want +got):\n%s", version, d)
		}
		for j, says := range map[int]string{0: "1 for true, 0 for false", 1: "since midnight", 2: "of no stated zone", 4: "Julian day"} {
			if rd := cols[j].Readings; len(rd) != 1 || !strings.Contains(rd[0].To+" "+rd[0].Note, says) {
				t.Errorf("version %d: column %s: readings %v, want one saying %q", version, cols[j].Name, rd, says)
			}
		}
		o, ok := r.Origin(4)
		if w := time.Date(2023, 2, 24, 1, 2, 3, 123, time.UTC); !ok || !o.Time.Equal(w) || o.UTC {
			t.Errorf("version %d: INT96 origin %v %v, want %v of no stated zone", version, o, ok, w)
		}
		if _, ok := r.Origin(1); ok {
			t.Errorf("version %d: a time of day has an origin", version)
		}
		if dst[1].Dim() != quantity.Time || dst[0].Dim() != quantity.Dimensionless {
			t.Errorf("version %d: dimensions %v, %v", version, dst[1].Dim(), dst[0].Dim())
		}
	}
}

// TestLegacyColumnsUnusedNeverDecoded: left out by Options.Columns or by
// Select, these columns are not decoded, even with damaged pages; and
// when every column is read a damaged one fails the file.
func TestLegacyColumnsUnusedNeverDecoded(t *testing.T) {
	b, err := rewrite(legacyFile(t, parquet.Compression(&parquet.Uncompressed)), func(p *page) []byte {
		if p.column < 5 {
			for i := range p.body {
				p.body[i] = 0xA5
			}
		}
		return p.body
	}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if _, _, err := readAll(t, b, Options{}); err == nil {
		t.Fatal("damaged pages, every column read: no error")
	}
	_, vals, err := readAll(t, b, Options{Columns: []string{"V [m/s]"}})
	if err != nil || !cmp.Equal(vals, [][]float64{{1, 2, 3, 4, 5}}) {
		t.Errorf("Options.Columns: %v, %v", vals, err)
	}
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := r.Select([]int{5}); err != nil {
		t.Fatal(err)
	}
	dst, n, err := r.Read(nil, 10)
	if err != nil || n != 5 || !cmp.Equal(dst[5].Values(), []float64{1, 2, 3, 4, 5}) {
		t.Errorf("Select(5): %d rows %v, %v", n, dst[5].Values(), err)
	}
}

// TestLegacyColumnsRefused: values outside what their type defines are
// refused with the row and column (ErrRange), and a unit given to them
// is refused; TIME_MILLIS and TIME_MICROS, the older converted types,
// read as TIME adjusted to UTC.
func TestLegacyColumnsRefused(t *testing.T) {
	for _, tc := range []struct {
		name string
		col  pcol
		row  int64
		says string
	}{
		{"negative time of day", pcol{"c", parquet.Time(parquet.Millisecond), i32s(0, -1)}, 2, "outside 0 to 24 h"},
		{"time past 24 h", pcol{"c", parquet.Time(parquet.Microsecond), i64s(86400e6 + 1)}, 1, "outside 0 to 24 h"},
		{"INT96 ns past the day", pcol{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, 0), i96(2460000, 86400e9)}}, 2, "outside one day"},
		{"INT96 negative ns", pcol{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, -1)}}, 1, "outside one day"},
		{"INT96 2⁵³ ns away", pcol{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, 0), i96(2460105, 0)}}, 2, "more than 2⁵³ ns"},
		{"INT96 years away", pcol{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, 0), i96(-2147483648, 0)}}, 2, "more than 2⁵³ ns"},
	} {
		b := schemaFile(t, []pcol{tc.col})
		_, _, err := readAll(t, b, Options{})
		var pe *Error
		if !errors.As(err, &pe) || !errors.Is(err, quantity.ErrRange) || classCount(err) != 1 || pe.Row != tc.row || pe.Column != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("%s: %v, want row %d saying %q (ErrRange)", tc.name, err, tc.row, tc.says)
		}
	}
	// Within 2⁵³ ns: 104 days (104·86400e9 ns < 2⁵³ ≈ 9.007e15 ns).
	_, vals, err := readAll(t, schemaFile(t, []pcol{{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, 0), i96(2460104, 0)}}}), Options{})
	if err != nil || !cmp.Equal(vals, [][]float64{{0, 104 * 86400}}) {
		t.Errorf("104 days: %v, %v", vals, err)
	}
	// Units given to these columns.
	for _, tc := range []struct {
		name string
		b    []byte
		opt  Options
		says string
	}{
		{"a unit in the metadata of a time of day", schemaFile(t, []pcol{{"c", parquet.Time(parquet.Millisecond), i32s(1)}}, parquet.KeyValueMetadata(UnitKey+"c", "ms")), Options{}, `the unit "ms" to a column of a time of day`},
		{"a unit given to an INT96", schemaFile(t, []pcol{{"ts", parquet.Leaf(parquet.Int96Type), []parquet.Value{i96(2460000, 0)}}}), Options{Units: map[string]string{"ts": "s"}}, `gives the unit "s" to a column of an instant`},
		{"a unit in the name of a BOOLEAN", schemaFile(t, []pcol{{"level [m]", parquet.Leaf(parquet.BooleanType), bools(true)}}), Options{}, `the unit "m" to a BOOLEAN column`},
		{"a unit in the metadata of a BOOLEAN", schemaFile(t, []pcol{{"on", parquet.Leaf(parquet.BooleanType), bools(true)}}, parquet.KeyValueMetadata(UnitKey+"on", "%")), Options{}, `the unit "%" to a column of true or false`},
	} {
		if _, _, err := readAll(t, tc.b, tc.opt); err == nil || classCount(err) != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("%s: %v, want one saying %q", tc.name, err, tc.says)
		}
	}
	// The unit one stated for a BOOLEAN agrees; a name that is not a
	// unit in brackets ("valve A") is a name.
	cols, vals, err := readAll(t, schemaFile(t, []pcol{
		{"on", parquet.Leaf(parquet.BooleanType), bools(true, false)},
		{"valve A", parquet.Leaf(parquet.BooleanType), bools(false, true)},
	}, parquet.KeyValueMetadata(UnitKey+"on", "1")), Options{})
	if err != nil || !cmp.Equal(vals, [][]float64{{1, 0}, {0, 1}}) || cols[1].Name != "valve A" || !cols[1].Unit.Equal(units.One()) {
		t.Errorf("BOOLEAN with the unit one: %v %v, %v", cols, vals, err)
	}
	// The converted types TIME_MILLIS and TIME_MICROS alone.
	b, err := rewrite(schemaFile(t, []pcol{
		{"ms", parquet.Time(parquet.Millisecond), i32s(1500)},
		{"us", parquet.Time(parquet.Microsecond), i64s(1500)},
	}), nil, func(md *format.FileMetaData) {
		for i := range md.Schema[1:] {
			md.Schema[1+i].LogicalType = format.LogicalType{}
		}
	})
	if err != nil {
		t.Fatal(err)
	}
	cols, vals, err = readAll(t, b, Options{})
	if err != nil || !cmp.Equal(vals, [][]float64{{1.5}, {0.0015}}) || !strings.Contains(cols[0].Readings[0].From, "TIME_MILLIS") || !strings.Contains(cols[1].Readings[0].Note, "in UTC") {
		t.Errorf("converted TIME types: %v %v, %v", cols, vals, err)
	}
}

// TestRLEBooleansChecked: BOOLEAN values encoded RLE are read when the
// decoder reads their runs right, as parquet-go writes them (a run of
// true as the byte 0xFF, every run but the last a multiple of 8 values);
// a run of true written as the byte 1, as the format writes it, the
// decoder expands to 1 then 7 false, so it is refused rather than read
// wrong.
func TestRLEBooleansChecked(t *testing.T) {
	for _, version := range []int{1, 2} {
		testRLEBooleans(t, version)
	}
	// RLE for a column that is not BOOLEAN is refused as before.
	b := encodedFile(t, 1)
	bad, _ := rewrite(b, func(p *page) []byte {
		if p.column == 1 && p.header.DataPageHeader.Valid {
			p.header.DataPageHeader.V.Encoding = format.RLE
		}
		return p.body
	}, nil)
	if _, _, err := readAll(t, bad, Options{}); err == nil || !strings.Contains(err.Error(), "RLE are not read but for a BOOLEAN") {
		t.Errorf("RLE integers: %v", err)
	}
}

// rleBoolFile is a file of one BOOLEAN column, RLE-encoded in one
// uncompressed data page of the version given: 16 true, then false,
// true, false.
func rleBoolFile(t tb, version int) []byte {
	vals := bools(true, true, true, true, true, true, true, true, true, true, true, true, true, true, true, true, false, true, false)
	return schemaFile(t, []pcol{{"on [1]", parquet.Encoded(parquet.Leaf(parquet.BooleanType), &parquet.RLE), vals}}, parquet.Compression(&parquet.Uncompressed), parquet.DataPageVersion(version))
}

// testRLEBooleans checks RLE booleans in data pages of a version.
func testRLEBooleans(t *testing.T, version int) {
	b := rleBoolFile(t, version)
	_, got, err := readAll(t, b, Options{})
	want := []float64{1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, 1, 0}
	if err != nil || !cmp.Equal(got, [][]float64{want}) {
		t.Fatalf("version %d: RLE booleans: %v, %v", version, got, err)
	}
	// The page: a 4-byte length, a run of 16 (varint 16<<1 = 0x20) of
	// the byte 0xFF, then the rest bit-packed.
	var body []byte
	rewrite(b, func(p *page) []byte {
		if p.header.DataPageHeader.Valid || p.header.DataPageHeaderV2.Valid {
			body = bytes.Clone(p.body)
		}
		return p.body
	}, nil)
	if len(body) < 6 || body[4] != 0x20 || body[5] != 0xFF {
		t.Fatalf("version %d: page body % x: not the run expected", version, body)
	}
	for _, tc := range []struct {
		name string
		at   int
		to   byte
		says string
	}{
		{"a run of true as the byte 1", 5, 0x01, "would misread"},
		{"a run of 15", 4, 0x1E, "would misread"},
		{"a run value byte 7", 5, 0x07, "damaged"},
	} {
		bad, err := rewrite(b, func(p *page) []byte {
			if p.header.DataPageHeader.Valid || p.header.DataPageHeaderV2.Valid {
				p.body[tc.at] = tc.to
			}
			return p.body
		}, nil)
		if err != nil {
			t.Fatal(err)
		}
		_, _, err = readAll(t, bad, Options{})
		if !errors.Is(err, quantity.ErrParse) || classCount(err) != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("version %d: %s: %v, want a refusal saying %q", version, tc.name, err, tc.says)
		}
	}
}

// TestRefusesBooleanRunDeclaringMoreValues: a run of 2³¹−1 booleans in
// a page of 19, which the decoder would expand into 256 MiB, is refused
// before it runs; the child process is limited to 1 GiB more than it
// holds.
func TestRefusesBooleanRunDeclaringMoreValues(t *testing.T) {
	if !inChild(t) {
		return
	}
	huge := binary.AppendUvarint(nil, (1<<31-1)<<1)
	for _, version := range []int{1, 2} {
		b, err := rewrite(rleBoolFile(t, version), func(p *page) []byte {
			if !p.header.DataPageHeader.Valid && !p.header.DataPageHeaderV2.Valid {
				return p.body
			}
			// The 4-byte length, then the huge run of 0xFF in place of
			// the run of 16.
			runs := append(append(append([]byte{}, huge...), 0xFF), p.body[6:]...)
			body := binary.LittleEndian.AppendUint32(nil, uint32(len(runs)))
			body = append(body, runs...)
			p.header.UncompressedPageSize = int32(len(body))
			return body
		}, nil)
		if err != nil {
			t.Fatal(err)
		}
		_, _, err = readAll(t, b, Options{})
		if !errors.Is(err, quantity.ErrParse) || classCount(err) != 1 || !strings.Contains(err.Error(), "booleans whose runs declare more than the page's 19 values") {
			t.Errorf("version %d: %v", version, err)
		}
	}
}

// TestPageFaultInUnusedColumn: a column whose pages the pre-check
// refuses (LZ4 compression; RLE booleans the decoder would misread) no
// longer fails NewReader when no Options.Columns are given: it is listed
// with its fault, Select leaves it out or refuses it, and reading every
// column refuses the file. Named in Options.Columns it fails NewReader
// as before. On the code before, NewReader refused the file.
func TestPageFaultInUnusedColumn(t *testing.T) {
	var v, p []parquet.Value
	for i := range 19 {
		v = append(v, parquet.DoubleValue(float64(i)))
		p = append(p, parquet.DoubleValue(100))
	}
	b := schemaFile(t, []pcol{
		{"V [m/s]", parquet.Leaf(parquet.DoubleType), v},
		{"P [kPa]", parquet.Compressed(parquet.Leaf(parquet.DoubleType), &parquet.Lz4Raw), p},
		{"on [1]", parquet.Encoded(parquet.Leaf(parquet.BooleanType), &parquet.RLE), bools(true, true, true, true, true, true, true, true, true, true, true, true, true, true, true, true, false, true, false)},
	}, parquet.Compression(&parquet.Uncompressed))
	// The run of 16 true written as the format writes it, the byte 1.
	b, err := rewrite(b, func(pg *page) []byte {
		if pg.column == 2 && len(pg.body) > 5 && pg.body[4] == 0x20 && pg.body[5] == 0xFF {
			pg.body[5] = 0x01
		}
		return pg.body
	}, nil)
	if err != nil {
		t.Fatal(err)
	}
	open := func() *Reader {
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "rig.parquet", Options{})
		if err != nil {
			t.Fatalf("NewReader: %v", err)
		}
		return r
	}
	r := open()
	cols := r.Columns()
	for j, says := range map[int]string{1: "compression LZ4_RAW is not read", 2: "would misread"} {
		var pe *Error
		if !errors.As(cols[j].Fault, &pe) || pe.Column != j+1 || pe.Field != cols[j].Header || classCount(cols[j].Fault) != 1 || !strings.Contains(cols[j].Fault.Error(), says) {
			t.Errorf("column %d: fault %v, want one of column %d saying %q", j+1, cols[j].Fault, j+1, says)
		}
		if r2 := open(); r2.Select([]int{0, j}) != r2.Columns()[j].Fault {
			t.Errorf("Select(0, %d): not the column's fault", j)
		}
	}
	if err := r.Select([]int{0}); err != nil {
		t.Fatal(err)
	}
	dst, n, err := r.Read(nil, 100)
	if err != nil || n != 19 || dst[0].Values()[18] != 18 {
		t.Errorf("Select(0): %d rows, %v", n, err)
	}
	if _, _, err := open().Read(nil, 100); err == nil || !strings.Contains(err.Error(), "LZ4_RAW") {
		t.Errorf("every column: %v, want the LZ4 column refused", err)
	}
	if _, err := NewReader(bytes.NewReader(b), int64(len(b)), "rig.parquet", Options{Columns: []string{"V [m/s]", "on [1]"}}); err == nil || !strings.Contains(err.Error(), "would misread") {
		t.Errorf("Options.Columns naming the RLE column: %v", err)
	}
	// A Writer refuses a column that could not be read: its unit is not known.
	var out bytes.Buffer
	if _, err := NewWriter(&out, "out.parquet", cols, Options{}); !errors.Is(err, quantity.ErrInvalid) || classCount(err) != 1 || !strings.Contains(err.Error(), "Fault") {
		t.Errorf("NewWriter of the columns read: %v, want ErrInvalid", err)
	}
}

// TestColumnKindFilled: Columns fills chanfile.Column.Kind as its doc
// promises, in step with Reader.Kind — timestamps for TIMESTAMP and
// INT96, numbers for a time of day (seconds since midnight), a BOOLEAN
// (0/1) and a DOUBLE.
func TestColumnKindFilled(t *testing.T) {
	b := legacyFile(t)
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	got := map[string]string{}
	for j, c := range r.Columns() {
		got[c.Name] = c.Kind.String() + " / " + r.Kind(j).String()
	}
	want := map[string]string{
		"valve":    "number / number",
		"clock_ms": "number / time of day",
		"clock_us": "number / time of day",
		"clock_ns": "number / time of day",
		"ts96":     "timestamp / time",
		"V":        "number / number",
	}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("Column.Kind / Reader.Kind (-want +got):\n%s", d)
	}
}
