package parquetfile_test

import (
	"bytes"
	"errors"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

// TestReadAll: chanfile.ReadAll reads a Parquet file whole, with the
// text of its label column, directly and through chanfile.Select; one
// row more than the bound is refused with quantity.ErrRange. The force
// is DECIMAL(9,3) in newtons: 12345 is 12.345 N.
func TestReadAll(t *testing.T) {
	type row struct {
		Run  string `parquet:"run"`
		F    int32  `parquet:"F [N],decimal(3:9)"`
		Note string `parquet:"note,json"`
	}
	var file bytes.Buffer
	w := parquet.NewGenericWriter[row](&file)
	if _, err := w.Write([]row{{"R1", 12345, `{}`}, {"R1", 12400, `{}`}, {"R2", -75, `{}`}}); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	open := func() *parquetfile.Reader {
		r, err := parquetfile.NewReader(bytes.NewReader(file.Bytes()), int64(file.Len()), "export.parquet", parquetfile.Options{})
		if err != nil {
			t.Fatal(err)
		}
		return r
	}
	type got struct {
		Rows   int
		F      []float64
		Labels []string
	}
	want := got{Rows: 3, F: []float64{12.345, 12.4, -0.075}, Labels: []string{"R1", "R1", "R2"}}
	sel, err := chanfile.Select(open(), 1, 0) // F, run: the JSON note is never read
	if err != nil {
		t.Fatal(err)
	}
	for _, tt := range []struct {
		name     string
		src      chanfile.Source
		run, f   int
		maxRows  int
		errClass error
	}{
		{name: "selected", src: sel, run: 1, f: 0, maxRows: 3},
		{name: "past the bound", src: func() chanfile.Source { s, _ := chanfile.Select(open(), 0, 1); return s }(), maxRows: 2, errClass: quantity.ErrRange},
	} {
		t.Run(tt.name, func(t *testing.T) {
			all, err := chanfile.ReadAll(tt.src, tt.maxRows)
			if tt.errClass != nil {
				if !errors.Is(err, tt.errClass) {
					t.Fatalf("error %v, want %v", err, tt.errClass)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			g := got{Rows: all.Rows, F: all.Series[tt.f].Values(), Labels: all.Labels[tt.run]}
			if diff := cmp.Diff(want, g); diff != "" {
				t.Errorf("(-want +got):\n%s", diff)
			}
		})
	}
}
