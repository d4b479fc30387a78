package parquetfile

import (
	"bytes"
	"encoding/binary"
	"errors"
	"io"
	"math"
	"math/big"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/format"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
)

// pcol is one column of a file written with parquet-go's schema API, as
// another program would write it: its schema node and its values, a nil
// Value (parquet.NullValue()) for a null of an optional column.
type pcol struct {
	name string
	node parquet.Node
	vals []parquet.Value
}

// schemaFile writes cols (of equal length) with parquet-go's schema API,
// in the order given, with the writer options given (a codec, key-value
// metadata, a page or row-group size).
func schemaFile(t tb, cols []pcol, opts ...parquet.WriterOption) []byte {
	t.Helper()
	g := parquet.Group{}
	rank := map[string]int{}
	for i, c := range cols {
		g[c.name] = c.node
		rank[c.name] = i
	}
	schema := parquet.NewSchema("other", orderedGroup{Group: g, rank: rank})
	var buf bytes.Buffer
	w := parquet.NewGenericWriter[any](&buf, append(opts, schema)...)
	n := len(cols[0].vals)
	rows := make([]parquet.Row, n)
	for i := range rows {
		for j, c := range cols {
			v := c.vals[i]
			def := 0
			if c.node.Optional() && !v.IsNull() {
				def = 1
			}
			rows[i] = append(rows[i], v.Level(0, def, j))
		}
	}
	if _, err := w.WriteRows(rows); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// i32s, i64s and strs make columns of values.
func i32s(xs ...int32) []parquet.Value {
	var v []parquet.Value
	for _, x := range xs {
		v = append(v, parquet.Int32Value(x))
	}
	return v
}

func i64s(xs ...int64) []parquet.Value {
	var v []parquet.Value
	for _, x := range xs {
		v = append(v, parquet.Int64Value(x))
	}
	return v
}

func strs(xs ...string) []parquet.Value {
	var v []parquet.Value
	for _, x := range xs {
		v = append(v, parquet.ByteArrayValue([]byte(x)))
	}
	return v
}

// fixed returns the n-byte big-endian two's complement of x.
func fixed(x *big.Int, n int) parquet.Value {
	b := make([]byte, n)
	y := new(big.Int).Set(x)
	if y.Sign() < 0 {
		y.Add(y, new(big.Int).Lsh(big.NewInt(1), uint(8*n)))
	}
	y.FillBytes(b)
	return parquet.FixedLenByteArrayValue(b)
}

func bigInt(s string) *big.Int {
	z, ok := new(big.Int).SetString(s, 10)
	if !ok {
		panic(s)
	}
	return z
}

// sameFloats compares exactly, a NaN equal to a NaN.
var sameFloats = cmp.Comparer(func(x, y float64) bool { return x == y || math.IsNaN(x) && math.IsNaN(y) })

// TestDecimalColumnsReadExactly: a DECIMAL is unscaled × 10^−scale, read
// as the float64 nearest that exact decimal, whichever its physical type.
// The values are written by hand; each want is the Go literal of the
// decimal, which the compiler rounds to the nearest float64 (the Go
// specification, "Constant expressions"; Python's float(Fraction(…))
// gives the same, 123456789012.34567 and -1.2345678901234567e+19).
func TestDecimalColumnsReadExactly(t *testing.T) {
	b := schemaFile(t, []pcol{
		{"F [N]", parquet.Optional(parquet.Decimal(3, 9, parquet.Int32Type)), append(i32s(12345, -1, 0), parquet.NullValue())},
		{"L [m]", parquet.Decimal(6, 18, parquet.Int64Type), i64s(123456789012345678, -5, 7, 1)},
		{"h [mm]", parquet.Decimal(2, 9, parquet.FixedLenByteArrayType(4)), []parquet.Value{
			fixed(big.NewInt(-12345), 4), fixed(big.NewInt(1), 4), fixed(big.NewInt(2147483647), 4), fixed(big.NewInt(-2147483648), 4),
		}},
		{"Q [m3/s]", parquet.Decimal(10, 38, parquet.FixedLenByteArrayType(16)), []parquet.Value{
			fixed(bigInt("-123456789012345678901234567890"), 16),
			fixed(big.NewInt(5), 16),
			fixed(big.NewInt(-1), 16),
			fixed(bigInt("99999999999999999999999999999999999999"), 16),
		}},
	})
	cols, vals, err := readAll(t, b, Options{})
	if err != nil {
		t.Fatal(err)
	}
	want := [][]float64{
		{12.345, -0.001, 0, math.NaN()},
		{123456789012.345678, -0.000005, 0.000007, 0.000001},
		{-0.12345, 0.00001, 21474.83647, -21474.83648}, // in m: the mm are ×0.001
		{-12345678901234567890.1234567890, 0.0000000005, -0.0000000001, 9999999999999999999999999999.9999999999},
	}
	if d := cmp.Diff(want, vals, sameFloats); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if cols[0].Missing != 1 || cols[0].Unit.String() != "N" || cols[3].Unit.String() != "m^3/s" {
		t.Errorf("columns %v", cols)
	}
	// 12.345 exactly: the float64 nearest 12.345 is the one ParseFloat gives.
	if vals[0][0] != 12.345 {
		t.Errorf("DECIMAL(9,3) 12345 = %v, want 12.345", vals[0][0])
	}
}

// TestDecimalNearestFloat: for any INT64 DECIMAL(18, scale), the value
// read is the float64 nearest the exact rational unscaled/10^scale, as
// math/big's Rat.Float64 computes it.
func TestDecimalNearestFloat(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		scale := rapid.IntRange(0, 18).Draw(t, "scale")
		u := rapid.OneOf(rapid.Int64Range(-1<<53, 1<<53), rapid.Int64()).Draw(t, "unscaled")
		b := schemaFile(t, []pcol{{"x [1]", parquet.Decimal(scale, 18, parquet.Int64Type), i64s(u)}})
		_, vals, err := readAll(t, b, Options{})
		if err != nil {
			t.Fatal(err)
		}
		want, _ := new(big.Rat).SetFrac(big.NewInt(u), new(big.Int).Exp(big.NewInt(10), big.NewInt(int64(scale)), nil)).Float64()
		if vals[0][0] != want {
			t.Fatalf("%de-%d read as %v, want %v", u, scale, vals[0][0], want)
		}
	})
}

// TestTimeColumns: a TIMESTAMP (millis, micros, nanos; adjusted to UTC or
// not) or a DATE is read as seconds from the column's first sample, with
// the instant of that sample kept. 1 700 000 000 s from the epoch is
// 2023-11-14T22:13:20Z, and that day is day 19675 (date -u -d
// @1700000000; Python's date(2023,11,14)−date(1970,1,1)).
func TestTimeColumns(t *testing.T) {
	const t0 = 1_700_000_000
	b := schemaFile(t, []pcol{
		{"t_ms", parquet.Optional(parquet.Timestamp(parquet.Millisecond)), append([]parquet.Value{parquet.NullValue()}, i64s(t0*1e3, t0*1e3+250, t0*1e3+1000, t0*1e3+1500)...)},
		{"t_us", parquet.TimestampAdjusted(parquet.Microsecond, false), i64s(t0*1e6, t0*1e6+1, t0*1e6-1, t0*1e6+2_000_000, t0*1e6+1_000_000)},
		{"t_ns", parquet.Timestamp(parquet.Nanosecond), i64s(t0*1e9+5, t0*1e9+5+1e9, t0*1e9+5+3, t0*1e9+5, t0*1e9+5)},
		{"day", parquet.Date(), i32s(19675, 19676, 19675, 19670, 19675+365)},
		{"V [kn]", parquet.Leaf(parquet.DoubleType), []parquet.Value{parquet.DoubleValue(1), parquet.DoubleValue(2), parquet.DoubleValue(3), parquet.DoubleValue(4), parquet.DoubleValue(5)}},
	})
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if _, ok := r.Origin(0); ok {
		t.Errorf("an origin before a sample is read")
	}
	dst, n, err := r.Read(nil, 10)
	if err != nil || n != 5 {
		t.Fatalf("Read: %d rows, %v", n, err)
	}
	var got [][]float64
	for j := range dst {
		got = append(got, dst[j].Values())
	}
	want := [][]float64{
		{math.NaN(), 0, 0.25, 1, 1.5},
		{0, 1e-6, -1e-6, 2, 1},
		{0, 1, 3e-9, 0, 0},
		{0, 86400, 0, -5 * 86400, 365 * 86400},
	}
	if d := cmp.Diff(want, got[:4], sameFloats); d != "" {
		t.Errorf("seconds (-want +got):\n%s", d)
	}
	at := time.Date(2023, 11, 14, 22, 13, 20, 0, time.UTC)
	for j, w := range []Origin{{at, true}, {at, false}, {at.Add(5), true}, {time.Date(2023, 11, 14, 0, 0, 0, 0, time.UTC), false}} {
		o, ok := r.Origin(j)
		if !ok || !o.Time.Equal(w.Time) || o.UTC != w.UTC || o.Time.Location() != time.UTC {
			t.Errorf("column %d: origin %v %v, want %v", j, o, ok, w)
		}
		if r.Kind(j) != Time || dst[j].Dim() != quantity.Time || r.Columns()[j].Unit.String() != "s" {
			t.Errorf("column %d: kind %v, %v", j, r.Kind(j), dst[j].Dim())
		}
	}
	if r.Kind(4) != Number {
		t.Errorf("V is %v", r.Kind(4))
	}
	if _, ok := r.Origin(4); ok {
		t.Errorf("an origin for a number column")
	}
	if r.Columns()[0].Missing != 1 {
		t.Errorf("t_ms missing = %d, want 1", r.Columns()[0].Missing)
	}
	// A unit given to a time column is refused, not applied.
	b = schemaFile(t, []pcol{{"t", parquet.Timestamp(parquet.Millisecond), i64s(1)}}, parquet.KeyValueMetadata(UnitKey+"t", "ms"))
	if _, _, err := readAll(t, b, Options{}); err == nil || !strings.Contains(err.Error(), `the file gives the unit "ms" to a column of an instant`) || classCount(err) != 1 {
		t.Errorf("a unit on a timestamp: %v", err)
	}
	// Instants more than 2⁵³ ticks apart are not exact in seconds.
	b = schemaFile(t, []pcol{{"t", parquet.Timestamp(parquet.Nanosecond), i64s(0, 1<<53+1)}})
	if _, _, err := readAll(t, b, Options{}); !errors.Is(err, quantity.ErrRange) || classCount(err) != 1 || !strings.Contains(err.Error(), "row 2") {
		t.Errorf("instants 2⁵³+1 ns apart: %v", err)
	}
}

// TestLabelColumns: a STRING (or ENUM) column is read as text, one label
// a row across chunks, a null an empty label counted missing.
func TestLabelColumns(t *testing.T) {
	b := schemaFile(t, []pcol{
		{"run", parquet.Optional(parquet.String()), append(strs("A1", "A2", "ρ-3"), parquet.NullValue(), parquet.ByteArrayValue([]byte("B1")))},
		{"state", parquet.Enum(), strs("up", "up", "down", "down", "up")},
		{"V [m/s]", parquet.Leaf(parquet.DoubleType), []parquet.Value{parquet.DoubleValue(1), parquet.DoubleValue(2), parquet.DoubleValue(3), parquet.DoubleValue(4), parquet.DoubleValue(5)}},
	})
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	var run, state []string
	var v []float64
	var dst []quantity.Series
	for {
		var n int
		dst, n, err = r.Read(dst, 2)
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		if len(r.Labels(0)) != n || dst[0].Len() != 0 || r.Labels(2) != nil {
			t.Fatalf("%d rows: %d labels, a Series of %d", n, len(r.Labels(0)), dst[0].Len())
		}
		run = append(run, r.Labels(0)...)
		state = append(state, r.Labels(1)...)
		v = append(v, dst[2].Values()...)
	}
	if d := cmp.Diff([]string{"A1", "A2", "ρ-3", "", "B1"}, run); d != "" {
		t.Errorf("run (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]string{"up", "up", "down", "down", "up"}, state); d != "" {
		t.Errorf("state (-want +got):\n%s", d)
	}
	if d := cmp.Diff([]float64{1, 2, 3, 4, 5}, v); d != "" {
		t.Errorf("V (-want +got):\n%s", d)
	}
	if r.Kind(0) != Label || r.Columns()[0].Missing != 1 || r.Columns()[1].Missing != 0 {
		t.Errorf("kind %v, missing %d", r.Kind(0), r.Columns()[0].Missing)
	}
	b = schemaFile(t, []pcol{{"run", parquet.String(), strs("a\xffb")}})
	if _, _, err := readAll(t, b, Options{}); err == nil || !strings.Contains(err.Error(), "not valid UTF-8") || classCount(err) != 1 {
		t.Errorf("a label not UTF-8: %v", err)
	}
}

// TestUnusedColumnsNeverDecoded: the columns Options.Columns does not
// name are never decoded: a JSON column, an LZ4-compressed one, a nested
// group and a column whose pages are garbage do not fail the file when
// they are not asked for, and fail it when every column is read.
func TestUnusedColumnsNeverDecoded(t *testing.T) {
	vs := []parquet.Value{parquet.DoubleValue(1.5), parquet.DoubleValue(2.5), parquet.DoubleValue(3.5)}
	b := schemaFile(t, []pcol{
		{"note", parquet.JSON(), strs(`{}`, `[]`, `1`)},
		{"V [kn]", parquet.Leaf(parquet.DoubleType), vs},
		{"junk [m]", parquet.Leaf(parquet.DoubleType), vs},
		{"P [kPa]", parquet.Compressed(parquet.Leaf(parquet.DoubleType), &parquet.Lz4Raw), vs},
		{"t", parquet.Timestamp(parquet.Millisecond), i64s(0, 100, 200)},
	})
	// The pages of junk become garbage of the same length.
	b, err := rewrite(b, func(p *page) []byte {
		if p.column == 2 {
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
		t.Fatalf("every column read: no error")
	}
	cols, vals, err := readAll(t, b, Options{Columns: []string{"t", "V [kn]"}})
	if err != nil {
		t.Fatal(err)
	}
	kn := 1852.0 / 3600 // m/s, exact by definition (SI Brochure, 9th ed., Table 8), rounded once
	if d := cmp.Diff([][]float64{{0, 0.1, 0.2}, {1.5 * kn, 2.5 * kn, 3.5 * kn}}, vals); d != "" || cols[0].Name != "t" || cols[1].Name != "V" {
		t.Errorf("(-want +got):\n%s; columns %v", d, cols)
	}
	for _, tc := range []struct {
		cols []string
		says string
	}{
		{[]string{"W"}, "Options.Columns names a column the file does not have"},
		{[]string{"t", "t"}, "Options.Columns names this column twice"},
		{[]string{}, "Options.Columns names no column"},
	} {
		_, _, err := readAll(t, b, Options{Columns: tc.cols})
		if !errors.Is(err, quantity.ErrInvalid) || classCount(err) != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("Columns %q: %v", tc.cols, err)
		}
	}
}

// TestUnitInNameAndMetadataMustAgree: a unit in the file's metadata, or
// in Options.Units, that the unit in the column's name contradicts is
// refused with both named; the same unit spelled another way is read.
func TestUnitInNameAndMetadataMustAgree(t *testing.T) {
	type named struct {
		V float64 `parquet:"V [kn]"`
	}
	b := foreign(t, []named{{2}}, UnitKey+"V [kn]", "m/s")
	_, _, err := readAll(t, b, Options{})
	var pe *Error
	if !errors.As(err, &pe) || classCount(err) != 1 || !errors.Is(err, quantity.ErrParse) || !strings.Contains(err.Error(), `gives the unit "m/s", the column's name gives "kn"`) {
		t.Errorf("metadata m/s, name kn: %v", err)
	}
	_, _, err = readAll(t, foreign(t, []named{{2}}), Options{Units: map[string]string{"V [kn]": "m/s"}})
	if !errors.Is(err, quantity.ErrInvalid) || classCount(err) != 1 || !strings.Contains(err.Error(), `Options.Units gives the unit "m/s", the column's name gives "kn"`) {
		t.Errorf("Options.Units m/s, name kn: %v", err)
	}
	cols, vals, err := readAll(t, foreign(t, []named{{2}}, UnitKey+"V [kn]", "knot"), Options{})
	if err != nil || vals[0][0] != 2*1852.0/3600 || cols[0].Name != "V [kn]" {
		t.Errorf("metadata knot, name kn: %v %v %v", cols, vals, err)
	}
}

// TestGzipFilesRead: a file written GZIP-compressed by parquet-go, in
// several pages and row groups, reads back its values.
func TestGzipFilesRead(t *testing.T) {
	n := 3000
	v := make([]parquet.Value, n)
	want := make([]float64, n)
	for i := range v {
		v[i] = parquet.DoubleValue(float64(i) / 8)
		want[i] = float64(i) / 8
	}
	b := schemaFile(t, []pcol{{"x [m]", parquet.Leaf(parquet.DoubleType), v}}, parquet.Compression(&parquet.Gzip), parquet.PageBufferSize(1024), parquet.MaxRowsPerRowGroup(1000))
	_, vals, err := readAll(t, b, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(want, vals[0]); d != "" {
		t.Errorf("(-want +got):\n%s", d)
	}
}

// typedFile is a file of every kind read, as another program writes it:
// a DECIMAL of each physical type, timestamps, a date, labels and a
// double, 40 rows in row groups of 16, with the codec given.
func typedFile(t tb, codec parquet.WriterOption) []byte {
	const n = 40
	var d32, d64, dfx, ts, day, lab, v []parquet.Value
	for i := range n {
		d32 = append(d32, parquet.Int32Value(int32(i*1234-9000)))
		d64 = append(d64, parquet.Int64Value(int64(i)*123456789012345))
		dfx = append(dfx, fixed(big.NewInt(int64(i-20)*1e15), 16))
		ts = append(ts, parquet.Int64Value(1_700_000_000_000+int64(i)*250))
		day = append(day, parquet.Int32Value(int32(19675+i)))
		lab = append(lab, parquet.ByteArrayValue([]byte{'r', byte('a' + i%26)}))
		if i%7 == 3 {
			lab[i] = parquet.NullValue()
		}
		v = append(v, parquet.DoubleValue(float64(i)/3))
	}
	return schemaFile(t, []pcol{
		{"F [N]", parquet.Decimal(3, 9, parquet.Int32Type), d32},
		{"L [m]", parquet.Decimal(6, 18, parquet.Int64Type), d64},
		{"Q [m3/s]", parquet.Decimal(10, 38, parquet.FixedLenByteArrayType(16)), dfx},
		{"t", parquet.Timestamp(parquet.Millisecond), ts},
		{"day", parquet.Date(), day},
		{"run", parquet.Optional(parquet.String()), lab},
		{"V [kn]", parquet.Leaf(parquet.DoubleType), v},
	}, codec, parquet.MaxRowsPerRowGroup(16))
}

// encodedFile is a file of three columns as other programs write them
// (an optional dictionary-encoded double, a DELTA_BINARY_PACKED integer,
// an optional string), 100 rows, data pages of the version given,
// uncompressed so that a test can edit the encoded values.
func encodedFile(t tb, version int) []byte {
	var d, c, s []parquet.Value
	for i := range 100 {
		d = append(d, parquet.DoubleValue(float64(i%3)/4))
		c = append(c, parquet.Int64Value(int64(i*i)))
		s = append(s, parquet.ByteArrayValue([]byte{'a' + byte(i%5)}))
		if i%10 == 9 {
			d[i], s[i] = parquet.NullValue(), parquet.NullValue()
		}
	}
	return schemaFile(t, []pcol{
		{"D [m]", parquet.Optional(parquet.Encoded(parquet.Leaf(parquet.DoubleType), &parquet.RLEDictionary)), d},
		{"count [1]", parquet.Encoded(parquet.Int(64), &parquet.DeltaBinaryPacked), c},
		{"run", parquet.Optional(parquet.Encoded(parquet.String(), &parquet.DeltaLengthByteArray)), s},
	}, parquet.Compression(&parquet.Uncompressed), parquet.DataPageVersion(version))
}

// TestEncodedFilesRead: dictionary, delta and optional columns, in data
// pages of version 1 (levels inside the page) and 2, read back; the
// pre-check that walks their levels and indices accepts them.
func TestEncodedFilesRead(t *testing.T) {
	for _, version := range []int{1, 2} {
		b := encodedFile(t, version)
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "t.parquet", Options{})
		if err != nil {
			t.Fatalf("version %d: %v", version, err)
		}
		dst, n, err := r.Read(nil, 200)
		if err != nil || n != 100 {
			t.Fatalf("version %d: %d rows, %v", version, n, err)
		}
		for i := range 100 {
			d, c, s := dst[0].Values()[i], dst[1].Values()[i], r.Labels(2)[i]
			wd, ws := float64(i%3)/4, string(rune('a'+i%5))
			if i%10 == 9 {
				wd, ws = math.NaN(), ""
			}
			if !(d == wd || math.IsNaN(d) && math.IsNaN(wd)) || c != float64(i*i) || s != ws {
				t.Fatalf("version %d row %d: %v %v %q, want %v %v %q", version, i+1, d, c, s, wd, i*i, ws)
			}
		}
		// The encodings are the ones named.
		seen := map[string]bool{}
		rewrite(b, func(p *page) []byte {
			if h := p.header.DataPageHeader; h.Valid {
				seen[h.V.Encoding.String()] = true
			} else if h := p.header.DataPageHeaderV2; h.Valid {
				seen[h.V.Encoding.String()] = true
			}
			return p.body
		}, nil)
		for _, e := range []string{"RLE_DICTIONARY", "DELTA_BINARY_PACKED", "DELTA_LENGTH_BYTE_ARRAY"} {
			if !seen[e] {
				t.Errorf("version %d: no page of %s in %v", version, e, seen)
			}
		}
	}
}

// TestRefusesRunsDeclaringMoreValues: a few bytes of a page can declare
// 2³¹ values, which the decoder allocates at once: a run of dictionary
// indices, a run of definition levels, a DELTA_BINARY_PACKED header, a
// run of RLE-encoded numbers. Each is refused before the decoder runs;
// the child process, limited to 1 GiB more than it holds, shows nothing
// of them is allocated.
func TestRefusesRunsDeclaringMoreValues(t *testing.T) {
	if !inChild(t) {
		return
	}
	huge := binary.AppendUvarint(nil, (1<<31-1)<<1) // an RLE run of 2³¹−1 repeats
	for _, tc := range []struct {
		name    string
		version int
		column  int
		edit    func(p *page, values []byte) []byte // the new values
		levels  func(levels []byte) []byte          // the new definition levels (version 2)
		says    string
	}{
		{"dictionary indices", 2, 0, func(p *page, v []byte) []byte { return append([]byte{0}, huge...) }, nil, "dictionary indices whose runs declare more than the page's 100 values"},
		{"definition levels", 2, 0, nil, func(l []byte) []byte { return append(huge, 1) }, "definition levels whose runs declare more"},
		{"delta header", 2, 1, func(p *page, v []byte) []byte {
			b := binary.AppendUvarint(nil, 128)
			b = binary.AppendUvarint(b, 4)
			b = binary.AppendUvarint(b, 1<<31-1)
			return append(b, 0)
		}, nil, "a delta-encoded header declaring 2147483647 values"},
		{"RLE numbers", 2, 1, func(p *page, v []byte) []byte {
			p.header.DataPageHeaderV2.V.Encoding = format.RLE
			return huge
		}, nil, "values of encoding RLE are not read"},
		{"definition levels, version 1", 1, 0, func(p *page, v []byte) []byte { return v }, nil, "definition levels whose runs declare more"},
	} {
		b, err := rewrite(encodedFile(t, tc.version), func(p *page) []byte {
			if p.column != tc.column || p.header.DictionaryPageHeader.Valid {
				return p.body
			}
			body := p.body
			if v := p.header.DataPageHeaderV2; v.Valid {
				lv := int(v.V.RepetitionLevelsByteLength + v.V.DefinitionLevelsByteLength)
				levels, values := body[:lv], body[lv:]
				if tc.levels != nil {
					levels = tc.levels(levels)
					p.header.DataPageHeaderV2.V.DefinitionLevelsByteLength = int32(len(levels))
				}
				if tc.edit != nil {
					values = tc.edit(p, values)
				}
				body = append(append([]byte{}, levels...), values...)
			} else {
				// Version 1: the levels, after their 4-byte length, become
				// one huge run; the values follow unchanged.
				n := int(binary.LittleEndian.Uint32(body))
				values := body[4+n:]
				body = binary.LittleEndian.AppendUint32(nil, uint32(len(huge)+1))
				body = append(append(append(body, huge...), 1), values...)
			}
			p.header.UncompressedPageSize = int32(len(body))
			return body
		}, nil)
		if err != nil {
			t.Fatal(err)
		}
		_, _, err = readAll(t, b, Options{})
		var pe *Error
		if !errors.As(err, &pe) || classCount(err) != 1 || !strings.Contains(err.Error(), tc.says) {
			t.Errorf("%s: %v, want an *Error saying %q", tc.name, err, tc.says)
		}
	}
	// The input FuzzPages found: a DATE page's encoding set to RLE.
	a := corpusArgs(t, filepath.Join("testdata", "fuzz", "FuzzPages", "e6455657736ba30f"))
	b := mutate(pageBases(t)[int(a[0].(int64))%7], uint16(a[1].(int64)), uint16(a[2].(int64)), a[3].([]byte), uint8(a[4].(int64)), int32(a[5].(int64)))
	if _, _, err := readAll(t, b, Options{}); err == nil || !strings.Contains(err.Error(), "values of encoding RLE are not read") {
		t.Errorf("saved input e6455657736ba30f: %v", err)
	}
}
