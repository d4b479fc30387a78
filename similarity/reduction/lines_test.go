package reduction_test

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
)

// TestLineOfRowAgreesWithReader: LineOfRow counts rows as chanfile.Reader
// does. The file (invented) has a byte-order mark, a comment, the header
// on line 2, an empty line, and on line 5 a line of spaces, which the
// reader takes as a row of one missing value (row 2), so row 3 is on
// line 6 and row 4 on line 8, after a CRLF-ended comment.
func TestLineOfRowAgreesWithReader(t *testing.T) {
	text := "\ufeff# invented\nh [m]\n\n1\n   \n3\n# note\r\n4\n"
	path := filepath.Join(t.TempDir(), "rows.csv")
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	r, err := chanfile.NewReader(strings.NewReader(text), "rows.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	dst, n, err := r.Read([]quantity.Series(nil), 10)
	if err != nil || n != 4 {
		t.Fatalf("reader: %d rows, %v; want 4", n, err)
	}
	if v := dst[0].Values(); len(v) != 4 || v[0] != 1 || v[2] != 3 || v[3] != 4 || v[1] == v[1] {
		t.Fatalf("reader rows %v; want 1, missing, 3, 4", v)
	}
	for row, want := range map[int]int{1: 4, 2: 5, 3: 6, 4: 8, 5: 0} {
		if got := reduction.LineOfRow(path, row); got != want {
			t.Errorf("LineOfRow(row %d) = %d, want %d", row, got, want)
		}
	}
	if got := reduction.LineOfRow(filepath.Join(t.TempDir(), "none.csv"), 1); got != 0 {
		t.Errorf("LineOfRow of a missing file = %d, want 0", got)
	}
}
