package chanfile_test

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// readBack reads every row of a written file.
func readBack(t *rapid.T, text, name string, opt chanfile.Options) ([]chanfile.Column, [][]float64) {
	r, err := chanfile.NewReader(strings.NewReader(text), name, opt)
	if err != nil {
		t.Fatalf("%v\n%q", err, text)
	}
	out := make([][]float64, len(r.Columns()))
	var dst []quantity.Series
	for {
		var n int
		dst, n, err = r.Read(dst, 5)
		if err == io.EOF {
			return r.Columns(), out
		}
		if err != nil {
			t.Fatalf("%v\n%q", err, text)
		}
		for j := range dst {
			out[j] = append(out[j], dst[j].Values()[:n]...)
		}
	}
}

// TestMissingValuesRoundTripInEveryShape: a missing value keeps its row
// and column in a file of one column or many, CSV or TSV, whichever
// columns are missing (the first, the last, all of a row).
func TestMissingValuesRoundTripInEveryShape(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		ncol := rapid.IntRange(1, 4).Draw(t, "columns")
		comma := rapid.SampledFrom([]rune{',', '\t', ';'}).Draw(t, "delimiter")
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
		var buf bytes.Buffer
		w, err := chanfile.NewWriter(&buf, "m.csv", cols, chanfile.Options{Comma: comma})
		if err != nil {
			t.Fatal(err)
		}
		if err := w.Write(s); err != nil {
			t.Fatal(err)
		}
		if err := w.Flush(); err != nil {
			t.Fatal(err)
		}
		back, vals := readBack(t, buf.String(), "m.csv", chanfile.Options{Comma: comma})
		for j := range cols {
			if len(vals[j]) != n {
				t.Fatalf("column %d: %d rows read back of %d\n%q", j+1, len(vals[j]), n, buf.String())
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

// nameGen draws column names rich in what a header must carry or refuse:
// delimiters, quotes, '#', brackets, parentheses, spaces, line ends, a
// byte-order mark, invalid UTF-8.
var nameGen = rapid.Custom(func(t *rapid.T) string {
	parts := rapid.SliceOfN(rapid.SampledFrom([]string{
		"V", "T_in", "ρ", "x", "1", ",", ";", "\t", "\"", "#", "[", "]", "(", ")", " ", "\n", "\r", "\ufeff", "\xff", "kn", "(g)", "-",
	}), 1, 6).Draw(t, "parts")
	return strings.Join(parts, "")
})

// TestWriterOutputReadsBack: what Writer accepts, Reader reads back with
// the same names and units and the values to the unit conversion's
// rounding; what it refuses is refused with an *Error of one class,
// quantity.ErrInvalid for a header and quantity.ErrRange for a value.
func TestWriterOutputReadsBack(t *testing.T) {
	unitTexts := []string{"m", "km", "nm", "kn", "degC", "1", "Pa"}
	rapid.Check(t, func(t *rapid.T) {
		comma := rapid.SampledFrom([]rune{',', '\t', ';', ' '}).Draw(t, "delimiter")
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
		w, err := chanfile.NewWriter(&buf, "rt.csv", cols, chanfile.Options{Comma: comma})
		if err != nil {
			var fe *chanfile.Error
			if !errors.As(err, &fe) || !errors.Is(err, quantity.ErrInvalid) || classes(err) != 1 || fe.File != "rt.csv" {
				t.Fatalf("NewWriter refused with %v, want an *Error of rt.csv of class ErrInvalid", err)
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
			var fe *chanfile.Error
			if !errors.As(err, &fe) || !errors.Is(err, quantity.ErrRange) || classes(err) != 1 || fe.Line < 2 || fe.Column < 1 {
				t.Fatalf("Write refused with %v, want an *Error of class ErrRange at a line and column", err)
			}
			x := s[fe.Column-1].Values()[fe.Line-2]
			if y, _ := cols[fe.Column-1].Unit.ValueOf(quantity.New(x, cols[fe.Column-1].Unit.Dim())); !math.IsInf(x, 0) && !math.IsInf(y, 0) && !(y == 0 && x != cols[fe.Column-1].Unit.Offset()) && !math.IsInf(y*cols[fe.Column-1].Unit.Factor(), 0) && !(y != 0 && y*cols[fe.Column-1].Unit.Factor() == 0) {
				t.Fatalf("Write refused %v (%v in %v): %v", x, y, cols[fe.Column-1].Unit, err)
			}
			return
		}
		if err := w.Flush(); err != nil {
			t.Fatal(err)
		}
		back, vals := readBack(t, buf.String(), "rt.csv", chanfile.Options{Comma: comma})
		for j, c := range back {
			if c.Name != cols[j].Name || !c.Unit.Equal(cols[j].Unit) {
				t.Fatalf("column %d %q in %v read back as %q in %v\n%q", j+1, cols[j].Name, cols[j].Unit, c.Name, c.Unit, buf.String())
			}
			if len(vals[j]) != n {
				t.Fatalf("column %d: %d rows of %d", j+1, len(vals[j]), n)
			}
			u := cols[j].Unit
			for i, x := range s[j].Values() {
				y := vals[j][i]
				tol := 4e-16*(math.Abs(x)+math.Abs(u.Offset())) + 1e-300
				if math.IsNaN(x) != math.IsNaN(y) || !math.IsNaN(x) && !(math.Abs(x-y) <= tol) {
					t.Fatalf("column %d row %d: %v read back as %v", j+1, i+1, x, y)
				}
			}
		}
	})
}

// TestWriterRefusesNamesThatSplit: a name holding the delimiter and a line
// break reads back as more columns than were written; the writer refuses
// it with an *Error instead of indexing past its columns (a saved rapid
// input: "\tV\nV" with a tab delimiter).
func TestWriterRefusesNamesThatSplit(t *testing.T) {
	for _, tc := range []struct {
		name  string
		comma rune
	}{
		{"\tV\nV", '\t'},
		{"a\nb", ','},
		{"a;b\nc", ';'},
		{"x y\nz", ' '},
	} {
		var buf bytes.Buffer
		_, err := chanfile.NewWriter(&buf, "rt.csv", []chanfile.Column{{Name: tc.name, Unit: units.MustParse("m")}}, chanfile.Options{Comma: tc.comma})
		var fe *chanfile.Error
		if !errors.As(err, &fe) || !errors.Is(err, quantity.ErrInvalid) || classes(err) != 1 {
			t.Errorf("NewWriter(%q, %q) = %v, want an *Error of class ErrInvalid", tc.name, tc.comma, err)
		}
	}
}
