package chanfile_test

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	cmpo "github.com/google/go-cmp/cmp/cmpopts"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// longLog returns a file of n rows: t [s] = row, tag = "r<row/1000>",
// V [km/h] = 3.6·row (row m/s in SI).
func longLog(n int) string {
	var sb strings.Builder
	sb.WriteString("t [s],tag,V [km/h]\n")
	for i := range n {
		fmt.Fprintf(&sb, "%d,r%d,%g\n", i, i/1000, 3.6*float64(i))
	}
	return sb.String()
}

// TestReadAll: ReadAll returns every row of every column, across the
// chunks it reads (a file of 9000 rows is read in three), with the
// labels of a Label column, also through Select and from a
// SeriesSource; a source of exactly maxRows rows is read and one of
// maxRows + 1 is refused, naming the bound, in one class.
func TestReadAll(t *testing.T) {
	type want struct {
		Rows    int
		Names   []string
		Values  [][]float64
		Labels  [][]string
		Missing []int
	}
	seq := func(n int, f func(i int) float64) []float64 {
		v := make([]float64, n)
		for i := range v {
			v[i] = f(i)
		}
		return v
	}
	tags := func(n int) []string {
		l := make([]string, n)
		for i := range l {
			l[i] = fmt.Sprintf("r%d", i/1000)
		}
		return l
	}
	nan := math.NaN()
	const long = 9000
	mem := func() chanfile.Source {
		s, err := chanfile.NewSeriesSource(
			[]chanfile.Column{{Name: "x", Unit: units.MustParse("m")}, {Name: "F", Unit: units.MustParse("N")}},
			[]quantity.Series{quantity.NewSeries([]float64{1, 2, 3}, quantity.Length), quantity.NewSeries([]float64{4, nan, 6}, quantity.Force)})
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	text := func(s string, opt chanfile.Options, sel ...int) func() chanfile.Source {
		return func() chanfile.Source {
			r, err := chanfile.NewReader(strings.NewReader(s), "lab.csv", opt)
			if err != nil {
				t.Fatal(err)
			}
			if sel == nil {
				return r
			}
			src, err := chanfile.Select(r, sel...)
			if err != nil {
				t.Fatal(err)
			}
			return src
		}
	}
	tests := []struct {
		name    string
		src     func() chanfile.Source
		maxRows int
		want    want
		class   error    // of the error, nil for none
		says    []string // in the error
	}{
		{
			name: "units row, label and missing value", maxRows: 3,
			src: text("t;tag;H\ns;-;m\n0;A;1,5\n1;;\n2;B;1,7\n", chanfile.Options{}),
			want: want{Rows: 3, Names: []string{"t", "tag", "H"},
				Values:  [][]float64{{0, 1, 2}, nil, {1.5, nan, 1.7}},
				Labels:  [][]string{nil, {"A", "", "B"}, nil},
				Missing: []int{0, 1, 1}},
		},
		{
			name: "many chunks", maxRows: long,
			src: text(longLog(long), chanfile.Options{}),
			want: want{Rows: long, Names: []string{"t", "tag", "V"},
				Values:  [][]float64{seq(long, func(i int) float64 { return float64(i) }), nil, seq(long, func(i int) float64 { return 3.6 * float64(i) * 1000 / 3600 })},
				Labels:  [][]string{nil, tags(long), nil},
				Missing: []int{0, 0, 0}},
		},
		{
			name: "selected, labels kept", maxRows: 5,
			src: text("t [s],tag,V [m/s]\n0,A,1\n1,B,2\n", chanfile.Options{}, 2, 1),
			want: want{Rows: 2, Names: []string{"V", "tag"},
				Values:  [][]float64{{1, 2}, nil},
				Labels:  [][]string{nil, {"A", "B"}},
				Missing: []int{0, 0}},
		},
		{
			name: "series held in memory", maxRows: 3, src: mem,
			want: want{Rows: 3, Names: []string{"x", "F"},
				Values:  [][]float64{{1, 2, 3}, {4, nan, 6}},
				Missing: []int{0, 1}},
		},
		{
			name: "one row past the bound", maxRows: long - 1,
			src:   text(longLog(long), chanfile.Options{}),
			class: quantity.ErrRange, says: []string{"lab.csv:9001:", "more than 8999 rows", "Read", "similarity/reduction"},
		},
		{
			name: "past the bound in memory", maxRows: 2, src: mem,
			class: quantity.ErrRange, says: []string{"more than 2 rows"},
		},
		{
			name: "no bound", maxRows: 0, src: mem,
			class: quantity.ErrInvalid, says: []string{"maxRows 0"},
		},
		{
			name: "a bad value fails the read", maxRows: 10,
			src:   text("t [s],V [m/s]\n0,1\n1,x\n", chanfile.Options{}),
			class: quantity.ErrParse, says: []string{"lab.csv:3:2"},
		},
	}
	classes := []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			w, err := chanfile.ReadAll(tt.src(), tt.maxRows)
			if tt.class != nil {
				var in []error
				for _, c := range classes {
					if errors.Is(err, c) {
						in = append(in, c)
					}
				}
				var ce *chanfile.Error
				if !errors.As(err, &ce) || len(in) != 1 || in[0] != tt.class {
					t.Fatalf("error %v (classes %v), want a *chanfile.Error of class %v", err, in, tt.class)
				}
				for _, s := range tt.says {
					if !strings.Contains(err.Error(), s) {
						t.Errorf("%v: does not say %q", err, s)
					}
				}
				if w.Rows != 0 || w.Series != nil {
					t.Errorf("a partial result with the error: %d rows", w.Rows)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			got := want{Rows: w.Rows}
			for k, c := range w.Columns {
				got.Names = append(got.Names, c.Name)
				got.Missing = append(got.Missing, c.Missing)
				v := w.Series[k].Values()
				if len(v) == 0 {
					v = nil
				}
				got.Values = append(got.Values, v)
			}
			got.Labels = w.Labels
			if diff := cmp.Diff(tt.want, got, cmpo.EquateNaNs(), cmpo.EquateApprox(0, 1e-12)); diff != "" {
				t.Errorf("(-want +got):\n%s", diff)
			}
			if k := w.Index(w.Columns[0].Name); k != 0 {
				t.Errorf("Index(%q) = %d, want 0", w.Columns[0].Name, k)
			}
			if k := w.Index("no such channel"); k != -1 {
				t.Errorf("Index of no channel = %d, want -1", k)
			}
		})
	}
}

// FuzzReadAll: on any text and bound, ReadAll returns an error of one
// class, or at most maxRows rows, each column's Series and labels either
// empty or one value a row, and the same rows as reading chunk by chunk.
func FuzzReadAll(f *testing.F) {
	f.Add("t;tag;H\ns;-;m\n0;A;1,5\n1;;\n2;B;1,7\n", 3)
	f.Add("t;tag;H\ns;-;m\n0;A;1,5\n1;;\n2;B;1,7\n", 2)
	f.Add(longLog(5000), 4097)
	f.Add("t [s],V [m/s]\n0,1\n1,x\n", 10)
	f.Add("x [m]\n", 0)
	f.Fuzz(func(t *testing.T, s string, maxRows int) {
		open := func() *chanfile.Reader {
			r, err := chanfile.NewReader(strings.NewReader(s), "f.csv", chanfile.Options{})
			if err != nil {
				return nil
			}
			return r
		}
		r := open()
		if r == nil {
			return
		}
		w, err := chanfile.ReadAll(r, maxRows)
		// The rows chunk by chunk, up to maxRows + 1, for comparison.
		rows, cerr := 0, error(nil)
		r2 := open()
		var dst []quantity.Series
		for rows <= maxRows {
			var n int
			dst, n, cerr = r2.Read(dst, 7)
			if cerr != nil {
				break
			}
			rows += n
		}
		if err != nil {
			if classes(err) != 1 {
				t.Fatalf("ReadAll: error %v of %d classes", err, classes(err))
			}
			if maxRows >= 1 && rows <= maxRows && cerr == io.EOF {
				t.Fatalf("ReadAll: %v, but the file reads to its end in %d rows", err, rows)
			}
			return
		}
		if w.Rows > maxRows || w.Rows != rows || cerr != io.EOF {
			t.Fatalf("ReadAll: %d rows of at most %d; chunk by chunk %d rows, then %v", w.Rows, maxRows, rows, cerr)
		}
		for k, c := range w.Columns {
			if n := w.Series[k].Len(); n != 0 && n != w.Rows {
				t.Fatalf("column %s: %d values of %d rows", c.Name, n, w.Rows)
			}
			if n := len(w.Labels[k]); n != 0 && n != w.Rows {
				t.Fatalf("column %s: %d labels of %d rows", c.Name, n, w.Rows)
			}
		}
	})
}

// TestReadAllLargeBound: a bound of math.MaxInt reads a file whole (the
// rows asked of the source do not overflow).
func TestReadAllLargeBound(t *testing.T) {
	r, err := chanfile.NewReader(strings.NewReader(longLog(5000)), "lab.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	w, err := chanfile.ReadAll(r, math.MaxInt)
	if err != nil || w.Rows != 5000 {
		t.Fatalf("ReadAll: %d rows, %v; want 5000 rows", w.Rows, err)
	}
}
