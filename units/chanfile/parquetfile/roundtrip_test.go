package parquetfile

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// TestMissingValuesRoundTripInEveryShape: a missing value keeps its row
// and column in a file of one column or many, whichever columns are
// missing, across row groups.
func TestMissingValuesRoundTripInEveryShape(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		ncol := rapid.IntRange(1, 4).Draw(t, "columns")
		n := rapid.IntRange(1, 12).Draw(t, "rows")
		cols := make([]chanfile.Column, ncol)
		s := make([]quantity.Series, ncol)
		for j := range cols {
			cols[j] = chanfile.Column{Name: fmt.Sprintf("x%d", j), Unit: units.MustParse("m")}
			v := make([]float64, n)
			for i := range v {
				if rapid.Bool().Draw(t, "missing") {
					v[i] = math.NaN()
				} else {
					v[i] = float64(rapid.IntRange(-1000, 1000).Draw(t, "v"))
				}
			}
			s[j] = quantity.NewSeries(v, quantity.Length)
		}
		b := write(t, cols, Options{RowGroupRows: rapid.IntRange(1, 5).Draw(t, "group")}, s...)
		back, vals, err := readAll(t, b, Options{})
		if err != nil {
			t.Fatal(err)
		}
		for j := range cols {
			if len(vals[j]) != n {
				t.Fatalf("column %d: %d rows read back of %d", j+1, len(vals[j]), n)
			}
			missing := 0
			for i, x := range s[j].Values() {
				y := vals[j][i]
				if math.IsNaN(x) {
					missing++
				}
				if math.IsNaN(x) != math.IsNaN(y) || !math.IsNaN(x) && x != y {
					t.Fatalf("column %d row %d: %v read back as %v", j+1, i+1, x, y)
				}
			}
			if back[j].Missing != missing {
				t.Fatalf("column %d: %d missing counted, %d written", j+1, back[j].Missing, missing)
			}
		}
	})
}

// nameGen draws column names with characters a Parquet name might trip
// on: dots, brackets, spaces, line ends, invalid UTF-8.
var nameGen = rapid.Custom(func(t *rapid.T) string {
	parts := rapid.SliceOfN(rapid.SampledFrom([]string{
		"V", "ρ", "x", ".", ",", "\"", "#", "[", "]", "(", ")", " ", "\n", "\x00", "\xff", "kn", "m/s", "similis.unit.",
	}), 1, 6).Draw(t, "parts")
	return strings.Join(parts, "")
})

// TestWriterOutputReadsBack: what Writer accepts, Reader reads back with
// the same names and units and the values to the unit conversion's
// rounding; what it refuses is refused with an *Error of one class,
// quantity.ErrInvalid for a column and quantity.ErrRange for a value.
func TestWriterOutputReadsBack(t *testing.T) {
	unitTexts := []string{"m", "km", "nm", "kn", "degC", "1", "Pa"}
	rapid.Check(t, func(t *rapid.T) {
		ncol := rapid.IntRange(1, 3).Draw(t, "columns")
		cols := make([]chanfile.Column, ncol)
		for j := range cols {
			u := units.One()
			if ut := rapid.SampledFrom(unitTexts).Draw(t, "unit"); ut != "1" {
				u = units.MustParse(ut)
			}
			cols[j] = chanfile.Column{Name: nameGen.Draw(t, "name"), Unit: u}
		}
		var buf bytes.Buffer
		w, err := NewWriter(&buf, "rt.parquet", cols, Options{})
		if err != nil {
			var pe *Error
			if !errors.As(err, &pe) || !errors.Is(err, quantity.ErrInvalid) || classCount(err) != 1 || pe.File != "rt.parquet" {
				t.Fatalf("NewWriter refused with %v, want an *Error of rt.parquet of class ErrInvalid", err)
			}
			return
		}
		n := rapid.IntRange(0, 6).Draw(t, "rows")
		s := make([]quantity.Series, ncol)
		for j, c := range cols {
			v := make([]float64, n)
			for i := range v {
				v[i] = rapid.OneOf(rapid.Float64(), rapid.Float64Range(-1e6, 1e6), rapid.Just(math.NaN())).Draw(t, "v")
			}
			s[j] = quantity.NewSeries(v, c.Unit.Dim())
		}
		if err := w.Write(s); err != nil {
			var pe *Error
			if !errors.As(err, &pe) || !errors.Is(err, quantity.ErrRange) || classCount(err) != 1 || pe.Row < 1 || pe.Column < 1 {
				t.Fatalf("Write refused with %v, want an *Error of class ErrRange at a row and column", err)
			}
			u := cols[pe.Column-1].Unit
			x := s[pe.Column-1].Values()[pe.Row-1]
			if y := (x - u.Offset()) / u.Factor(); !math.IsInf(y, 0) && !(y == 0 && x != u.Offset()) && !math.IsInf(y*u.Factor(), 0) && !(y != 0 && y*u.Factor() == 0) {
				t.Fatalf("Write refused %v (%v in %v): %v", x, y, u, err)
			}
			return
		}
		if err := w.Close(); err != nil {
			t.Fatal(err)
		}
		back, vals, err := readAll(t, buf.Bytes(), Options{})
		if err != nil {
			t.Fatal(err)
		}
		for j, c := range back {
			if c.Name != cols[j].Name || !c.Unit.Equal(cols[j].Unit) {
				t.Fatalf("column %d %q in %v read back as %q in %v", j+1, cols[j].Name, cols[j].Unit, c.Name, c.Unit)
			}
			var got []float64
			if vals != nil {
				got = vals[j]
			}
			if len(got) != n {
				t.Fatalf("column %d: %d rows of %d", j+1, len(got), n)
			}
			u := cols[j].Unit
			for i, x := range s[j].Values() {
				y := got[i]
				tol := 4e-16*(math.Abs(x)+math.Abs(u.Offset())) + 1e-300
				if math.IsNaN(x) != math.IsNaN(y) || !math.IsNaN(x) && !(math.Abs(x-y) <= tol) {
					t.Fatalf("column %d row %d: %v read back as %v", j+1, i+1, x, y)
				}
			}
		}
	})
}

// errDisk is the failure of a destination.
var errDisk = errors.New("disk full")

// failAfter is a destination that takes n bytes and then fails.
type failAfter struct{ n int }

func (f *failAfter) Write(p []byte) (int, error) {
	if len(p) > f.n {
		k := f.n
		f.n = 0
		return k, errDisk
	}
	f.n -= len(p)
	return len(p), nil
}

// TestWriteFailureNamesFileAndClass: a destination that fails gives an
// *Error naming the file, of class quantity.ErrInvalid, with the I/O
// error kept, also when wrapped again.
func TestWriteFailureNamesFileAndClass(t *testing.T) {
	cols := []chanfile.Column{col("V", "m/s")}
	s := quantity.NewSeries(make([]float64, 5000), quantity.Velocity)
	for _, at := range []int{0, 4, 100} {
		w, err := NewWriter(&failAfter{at}, "out.parquet", cols, Options{RowGroupRows: 1000})
		if err == nil {
			err = w.Write([]quantity.Series{s})
		}
		if err == nil {
			err = w.Close()
		}
		for _, e := range []error{err, fmt.Errorf("reducing run 12: %w", err)} {
			var pe *Error
			if !errors.As(e, &pe) || pe.File != "out.parquet" || !errors.Is(e, errDisk) || !errors.Is(e, quantity.ErrInvalid) || classCount(e) != 1 {
				t.Errorf("failing after %d bytes: %v, want an *Error of out.parquet, ErrInvalid only, keeping %v", at, e, errDisk)
			}
		}
	}
}

// TestErrorsInOneClass: reading errors match exactly one class, the one
// stated, and keep their cause, also when wrapped.
func TestErrorsInOneClass(t *testing.T) {
	type bare struct {
		V float64 `parquet:"V"`
	}
	valid := validFile(t)
	for _, tc := range []struct {
		name  string
		b     []byte
		opt   Options
		class error
		cause any
	}{
		{"unknown unit", foreign(t, []bare{{1}}, UnitKey+"V", "furlongs"), Options{}, quantity.ErrUnknown, new(*units.Error)},
		{"unknown unit in options", foreign(t, []bare{{1}}), Options{Units: map[string]string{"V": "blorps"}}, quantity.ErrUnknown, new(*units.Error)},
		{"no unit", foreign(t, []bare{{1}}), Options{}, quantity.ErrParse, new(*chanfile.Error)},
		{"gauge without reference", foreign(t, []bare{{1}}, UnitKey+"V", "psig"), Options{}, quantity.ErrInvalid, nil},
		{"options name no column", valid, Options{Units: map[string]string{"W": "m"}}, quantity.ErrInvalid, nil},
		{"infinite", foreign(t, []bare{{math.Inf(-1)}}, UnitKey+"V", "m"), Options{}, quantity.ErrRange, nil},
		{"truncated", valid[:len(valid)-20], Options{}, quantity.ErrParse, nil},
	} {
		_, _, err := readAll(t, tc.b, tc.opt)
		for _, e := range []error{err, fmt.Errorf("run 12: %w", err)} {
			var pe *Error
			if !errors.As(e, &pe) || pe.File != "t.parquet" || !errors.Is(e, tc.class) || classCount(e) != 1 {
				t.Errorf("%s: %v matches %d classes, want only %v", tc.name, e, classCount(e), tc.class)
			}
			if tc.cause != nil && !errors.As(e, tc.cause) {
				t.Errorf("%s: %v does not keep its cause %T", tc.name, e, tc.cause)
			}
		}
	}
}
