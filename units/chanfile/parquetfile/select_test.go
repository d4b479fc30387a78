package parquetfile

import (
	"bytes"
	"errors"
	"io"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

var _ chanfile.Selector = (*Reader)(nil)

// withUnused is a file with a column of a type the reader does not read
// (BYTE_ARRAY with no logical type) between two channels.
func withUnused(t *testing.T) []byte {
	type row struct {
		V   float64 `parquet:"V [m/s]"`
		Raw []byte  `parquet:"raw frame"`
		F   float64 `parquet:"F [N]"`
	}
	return foreign(t, []row{{1.5, []byte{1}, 10}, {1.6, []byte{2}, 11}})
}

// TestSelectUnreadableColumn: a column of an unsupported type fails the
// first Read when every column is read, and nothing when Select (or
// chanfile.Select) leaves it out.
func TestSelectUnreadableColumn(t *testing.T) {
	b := withUnused(t)
	open := func() *Reader {
		r, err := NewReader(bytes.NewReader(b), int64(len(b)), "u.parquet", Options{})
		if err != nil {
			t.Fatal(err)
		}
		return r
	}
	var pe *Error
	if _, _, err := open().Read(nil, 10); !errors.As(err, &pe) || pe.Column != 2 || !strings.Contains(err.Error(), "BYTE_ARRAY") || !errors.Is(err, quantity.ErrParse) {
		t.Fatalf("every column: err = %v, want the BYTE_ARRAY column 2 refused (ErrParse)", err)
	}
	if cols := open().Columns(); len(cols) != 3 || cols[1].Name != "raw frame" || cols[1].Fault == nil {
		t.Fatalf("columns %v, want 3 with the unreadable one listed", cols)
	}
	src, err := chanfile.Select(open(), 2, 0)
	if err != nil {
		t.Fatal(err)
	}
	dst, n, err := src.Read(nil, 10)
	if err != nil || n != 2 {
		t.Fatalf("selected: %d rows, %v", n, err)
	}
	if d := cmp.Diff([][]float64{{10, 11}, {1.5, 1.6}}, [][]float64{dst[0].Values(), dst[1].Values()}); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if _, _, err := src.Read(dst, 10); err != io.EOF {
		t.Errorf("end: %v, want io.EOF", err)
	}
	// Named at construction the column is refused at once, as before;
	// selected, it is refused with its fault.
	if _, err := NewReader(bytes.NewReader(b), int64(len(b)), "u.parquet", Options{Columns: []string{"raw frame"}}); err == nil {
		t.Error("Options.Columns naming the BYTE_ARRAY column: no error")
	}
	if r := open(); r.Select([]int{0, 1}) != r.Columns()[1].Fault {
		t.Error("Select of the BYTE_ARRAY column: not its fault")
	}
	// Select after reading began, and bad indices.
	r := open()
	if err := r.Select([]int{0}); err != nil {
		t.Fatal(err)
	}
	if _, _, err := r.Read(nil, 1); err != nil {
		t.Fatal(err)
	}
	if err := r.Select([]int{0, 2}); !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("Select after a Read = %v, want ErrInvalid", err)
	}
	for _, idx := range [][]int{{3}, {-1}, {0, 0}} {
		if err := open().Select(idx); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("Select(%v) = %v, want ErrInvalid", idx, err)
		}
	}
}

// TestMetadataRoundTrip: Options.Metadata is written beside the unit
// entries and Reader.Metadata reads it back, the unit entries left out;
// a key in the units' namespace, an empty key or invalid UTF-8 is refused.
func TestMetadataRoundTrip(t *testing.T) {
	meta := map[string]string{"similis.group.Re": "Re = ρ·V·D/μ", "facility": "tank 2"}
	var buf bytes.Buffer
	cols := []chanfile.Column{{Name: "V", Unit: units.MustParse("m/s")}}
	w, err := NewWriter(&buf, "m.parquet", cols, Options{Metadata: meta})
	if err != nil {
		t.Fatal(err)
	}
	if err := w.Write([]quantity.Series{quantity.NewSeries([]float64{1}, quantity.Velocity)}); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	r, err := NewReader(bytes.NewReader(buf.Bytes()), int64(buf.Len()), "m.parquet", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(meta, r.Metadata()); d != "" {
		t.Errorf("metadata (-want +got):\n%s", d)
	}
	for _, bad := range []map[string]string{
		{UnitKey + "V": "kn"},
		{"": "x"},
		{"k": "\xff"},
		{"\xff": "v"},
	} {
		if _, err := NewWriter(io.Discard, "m.parquet", cols, Options{Metadata: bad}); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("Metadata %q: err = %v, want ErrInvalid", bad, err)
		}
	}
	// A file without any has none.
	b := withUnused(t)
	if r, err := NewReader(bytes.NewReader(b), int64(len(b)), "u.parquet", Options{}); err != nil || r.Metadata() != nil {
		t.Errorf("no metadata: %v, %v", r.Metadata(), err)
	}
}

// TestFunctionNames: a column named as a function of a channel, u(F) in
// N or n_eff(V), writes and reads back with its metadata unit, though F
// and V are also unit symbols; a name with a unit in brackets or after a
// blank must still agree with the unit.
func TestFunctionNames(t *testing.T) {
	cols := []chanfile.Column{{Name: "u(F)", Unit: units.MustParse("N")}, {Name: "n_eff(V)", Unit: units.One()}}
	var buf bytes.Buffer
	w, err := NewWriter(&buf, "f.parquet", cols, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := w.Write([]quantity.Series{quantity.NewSeries([]float64{0.08}, quantity.Force), quantity.NewSeries([]float64{12}, 0)}); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	got, vals, err := readAll(t, buf.Bytes(), Options{})
	if err != nil {
		t.Fatal(err)
	}
	if got[0].Name != "u(F)" || !got[0].Unit.Equal(units.MustParse("N")) || vals[0][0] != 0.08 || vals[1][0] != 12 {
		t.Errorf("read back %v %v", got, vals)
	}
	for _, name := range []string{"P (kPa)", "P [kPa]"} {
		if _, err := NewWriter(io.Discard, "f.parquet", []chanfile.Column{{Name: name, Unit: units.MustParse("Pa")}}, Options{}); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("%q in Pa: %v, want ErrInvalid", name, err)
		}
	}
}
