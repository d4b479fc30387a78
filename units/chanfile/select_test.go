package chanfile_test

import (
	"errors"
	"io"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

var _ chanfile.Selector = (*chanfile.Reader)(nil)

// selectExport is an export with a text column and a bad value ("ERR")
// in a column the reading below does not ask for.
const selectExport = `t [s],V [m/s],Note,Spare [V],F [N]
0,1.5,start,0.1,10
1,1.6,,ERR,11
2,1.7,"end, dry",0.3,12
`

// TestReaderSelect: after Select the reader parses only the columns
// asked for, so the bad value of Spare fails neither the CSV reader nor
// chanfile.Select over it; without Select it fails the file at its line.
func TestReaderSelect(t *testing.T) {
	open := func() *chanfile.Reader {
		r, err := chanfile.NewReader(strings.NewReader(selectExport), "x.csv", chanfile.Options{})
		if err != nil {
			t.Fatal(err)
		}
		return r
	}
	// Without Select: the bad field fails the read, naming line 3, column 4.
	_, _, err := open().Read(nil, 10)
	var ce *chanfile.Error
	if !errors.As(err, &ce) || ce.Line != 3 || ce.Column != 4 {
		t.Fatalf("without Select: err = %v, want line 3 column 4", err)
	}
	r := open()
	if err := r.Select([]int{1, 4}); err != nil {
		t.Fatal(err)
	}
	dst, n, err := r.Read(nil, 10)
	if err != nil || n != 3 {
		t.Fatalf("Read = %d rows, %v", n, err)
	}
	got := [][]float64{dst[1].Values(), dst[4].Values()}
	want := [][]float64{{1.5, 1.6, 1.7}, {10, 11, 12}}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("values (-want +got):\n%s", d)
	}
	if dst[3].Len() != 0 {
		t.Errorf("unselected Spare holds %d values, want 0", dst[3].Len())
	}
	if len(r.Columns()) != 5 || r.Columns()[2].Missing != 0 {
		t.Errorf("columns %d, Note missing %d: want 5 columns and the unread Note not counted", len(r.Columns()), r.Columns()[2].Missing)
	}
	if _, _, err := r.Read(dst, 10); err != io.EOF {
		t.Errorf("end: %v, want io.EOF", err)
	}
	// Through chanfile.Select, which asks the reader to select.
	s, err := chanfile.Select(open(), 4, 0)
	if err != nil {
		t.Fatal(err)
	}
	dst, n, err = s.Read(nil, 10)
	if err != nil || n != 3 || len(dst) != 2 {
		t.Fatalf("Select(...).Read = %d series, %d rows, %v", len(dst), n, err)
	}
	if d := cmp.Diff([][]float64{{10, 11, 12}, {0, 1, 2}}, [][]float64{dst[0].Values(), dst[1].Values()}); d != "" {
		t.Errorf("selected values (-want +got):\n%s", d)
	}
	// Bad indices.
	for _, idx := range [][]int{{5}, {-1}, {1, 1}} {
		if err := open().Select(idx); !errors.Is(err, quantity.ErrInvalid) {
			t.Errorf("Select(%v) = %v, want ErrInvalid", idx, err)
		}
	}
}

// TestReaderSelectLabels: a selected label column keeps its text; an
// unselected one gives none.
func TestReaderSelectLabels(t *testing.T) {
	r, err := chanfile.NewReader(strings.NewReader(selectExport), "x.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := r.Select([]int{2, 0}); err != nil {
		t.Fatal(err)
	}
	if _, _, err := r.Read(nil, 10); err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([]string{"start", "", "end, dry"}, r.Labels(2)); d != "" {
		t.Errorf("labels (-want +got):\n%s", d)
	}
}
