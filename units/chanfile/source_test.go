package chanfile_test

import (
	"errors"
	"io"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
)

// TestSourceImplementations: the CSV reader and the in-memory source are
// Sources.
var (
	_ chanfile.Source = (*chanfile.Reader)(nil)
	_ chanfile.Source = (*chanfile.SeriesSource)(nil)
)

func TestSeriesSourceChunks(t *testing.T) {
	v := []float64{1, 2, 3, 4, 5}
	f := []float64{10, 20, math.NaN(), 40, 50}
	src, err := chanfile.NewSeriesSource(
		[]chanfile.Column{{Name: "V", Unit: units.MustParse("m/s")}, {Name: "F", Unit: units.MustParse("N")}},
		[]quantity.Series{quantity.NewSeries(v, quantity.Velocity), quantity.NewSeries(f, quantity.Force)})
	if err != nil {
		t.Fatal(err)
	}
	if m := src.Columns()[1].Missing; m != 1 {
		t.Errorf("F missing %d, want 1", m)
	}
	var got []float64
	var dst []quantity.Series
	for reads := 0; ; reads++ {
		var n int
		dst, n, err = src.Read(dst, 2)
		if err == io.EOF {
			if reads != 3 {
				t.Errorf("%d reads of 2 rows for 5 rows, want 3", reads)
			}
			break
		}
		got = append(got, dst[0].Values()[:n]...)
	}
	if diff := cmp.Diff(v, got); diff != "" {
		t.Error(diff)
	}
	src.Rewind()
	if _, n, _ := src.Read(nil, 0); n != 5 {
		t.Errorf("after Rewind read %d rows, want 5", n)
	}
}

func TestSeriesSourceRefuses(t *testing.T) {
	m := units.MustParse("m")
	for name, tc := range map[string]struct {
		cols []chanfile.Column
		data []quantity.Series
	}{
		"count":     {[]chanfile.Column{{Name: "a", Unit: m}}, nil},
		"length":    {[]chanfile.Column{{Name: "a", Unit: m}, {Name: "b", Unit: m}}, []quantity.Series{quantity.NewSeries([]float64{1}, quantity.Length), quantity.NewSeries([]float64{1, 2}, quantity.Length)}},
		"dimension": {[]chanfile.Column{{Name: "a", Unit: m}}, []quantity.Series{quantity.NewSeries([]float64{1}, quantity.Time)}},
	} {
		if _, err := chanfile.NewSeriesSource(tc.cols, tc.data); !errors.Is(err, quantity.ErrInvalid) || errors.Is(err, quantity.ErrParse) {
			t.Errorf("%s: err = %v, want ErrInvalid only", name, err)
		}
	}
}

// TestSelect delivers only the columns asked for, in the order asked,
// from a CSV reader.
func TestSelect(t *testing.T) {
	rd, err := chanfile.NewReader(strings.NewReader("a [m],b [s],c [N]\n1,2,3\n4,5,6\n"), "x.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	sel, err := chanfile.Select(rd, 2, 0)
	if err != nil {
		t.Fatal(err)
	}
	if cs := sel.Columns(); len(cs) != 2 || cs[0].Name != "c" || cs[1].Name != "a" {
		t.Fatalf("columns %v", cs)
	}
	dst, n, err := sel.Read(nil, 0)
	if err != nil || n != 2 || len(dst) != 2 {
		t.Fatalf("read %d rows, %d series: %v", n, len(dst), err)
	}
	if diff := cmp.Diff([]float64{3, 6}, dst[0].Values()[:n]); diff != "" || dst[0].Dim() != quantity.Force {
		t.Errorf("c: %s %v", diff, dst[0].Dim())
	}
	for _, idx := range [][]int{{3}, {-1}, {0, 0}} {
		if _, err := chanfile.Select(rd, idx...); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("Select %v: err = %v", idx, err)
		}
	}
}
