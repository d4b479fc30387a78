package parquetfile

import (
	"bytes"
	"errors"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
)

// corpusArgs reads the arguments of a saved fuzz input ("go test fuzz
// v1", one Go literal a line: byte('x'), uint16(3), []byte("..."), ...).
func corpusArgs(t *testing.T, path string) []any {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(string(b)), "\n")
	if lines[0] != "go test fuzz v1" {
		t.Fatalf("%s: not a saved fuzz input", path)
	}
	var args []any
	for _, l := range lines[1:] {
		typ, lit, ok := strings.Cut(strings.TrimSuffix(l, ")"), "(")
		if !ok {
			t.Fatalf("%s: %q", path, l)
		}
		switch {
		case typ == "[]byte":
			s, err := strconv.Unquote(lit)
			if err != nil {
				t.Fatalf("%s: %q: %v", path, l, err)
			}
			args = append(args, []byte(s))
		case strings.HasPrefix(lit, "'"):
			r, _, _, err := strconv.UnquoteChar(lit[1:len(lit)-1], '\'')
			if err != nil {
				t.Fatalf("%s: %q: %v", path, l, err)
			}
			args = append(args, int64(r))
		default:
			n, err := strconv.ParseInt(lit, 0, 64)
			if err != nil {
				t.Fatalf("%s: %q: %v", path, l, err)
			}
			args = append(args, n)
		}
	}
	return args
}

// TestColumnShortOfValuesInARowGroupIsRefused: the saved FuzzPages input
// ac975b373eb98d2a sets a data page's null count so that its column
// yields fewer values than its row group declares. Read the whole file
// through, the columns shifted against each other across row groups and
// the reader returned 32 of 40 declared rows with no error, values of one
// row group beside those of the next. The property: a file whose pages
// do not hold the rows declared is refused with an *Error, and every row
// returned before it has one value from each column of its own row group.
func TestColumnShortOfValuesInARowGroupIsRefused(t *testing.T) {
	a := corpusArgs(t, filepath.Join("testdata", "fuzz", "FuzzPages", "ac975b373eb98d2a"))
	bases := pageBases(t)
	b := mutate(bases[int(a[0].(int64))%savedBases], uint16(a[1].(int64)), uint16(a[2].(int64)), a[3].([]byte), uint8(a[4].(int64)), int32(a[5].(int64)))
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "f.parquet", Options{})
	if err != nil {
		t.Fatalf("the file is refused at once (%v); this test is about Read", err)
	}
	dst, n, err := r.Read(nil, int(r.NumRows()))
	var pe *Error
	if err == io.EOF || !errors.As(err, &pe) || !errors.Is(err, quantity.ErrParse) || classCount(err) != 1 {
		t.Fatalf("Read of %d declared rows: %d rows, %v; want an *Error", r.NumRows(), n, err)
	}
	// The rows before the error are the first row group's, unshifted:
	// as pageBases wrote them, V is (row−1)/7 m/s (missing in rows 5,
	// 14, …) and Re is 1e5·row.
	for i := 0; i < n; i++ {
		v, re := dst[0].Values()[i], dst[1].Values()[i]
		if i%9 == 4 && !math.IsNaN(v) || i%9 != 4 && !(math.Abs(v-float64(i)/7) <= 1e-15) || re != 1e5*float64(i+1) {
			t.Errorf("row %d: V = %v, Re = %v; want %v and %v", i+1, v, re, float64(i)/7, 1e5*float64(i+1))
		}
	}
}

// TestRowGroupHoldingMoreRowsThanDeclaredIsRefused: the saved FuzzPages
// input 1c971a4d8bb8a8d6 sets the value count of the only data page of a
// four-row file to 25 and changes its first level byte, so its pages hold
// more rows than its row group declares. The reader counted the fifth row
// before it refused the group. The property: Read never returns more rows
// than the file declares, refuses the group with an *Error, and the rows
// it returned are the four written.
func TestRowGroupHoldingMoreRowsThanDeclaredIsRefused(t *testing.T) {
	a := corpusArgs(t, filepath.Join("testdata", "fuzz", "FuzzPages", "1c971a4d8bb8a8d6"))
	bases := pageBases(t)
	b := mutate(bases[int(a[0].(int64))%savedBases], uint16(a[1].(int64)), uint16(a[2].(int64)), a[3].([]byte), uint8(a[4].(int64)), int32(a[5].(int64)))
	r, err := NewReader(bytes.NewReader(b), int64(len(b)), "f.parquet", Options{})
	if err != nil {
		t.Fatalf("the file is refused at once (%v); this test is about Read", err)
	}
	var dst []quantity.Series
	var got []float64
	for range 100 {
		var n int
		dst, n, err = r.Read(dst, 3)
		got = append(got, dst[0].Values()[:n]...)
		if err != nil {
			break
		}
	}
	var pe *Error
	if int64(len(got)) > r.NumRows() || !errors.As(err, &pe) || classCount(err) != 1 || !strings.Contains(err.Error(), "holds more") && !strings.Contains(err.Error(), "hold more") {
		t.Fatalf("%d rows of %d declared, then %v; want at most %d and an *Error", len(got), r.NumRows(), err, r.NumRows())
	}
	for i, v := range got {
		if v != float64(i+1) {
			t.Errorf("row %d: %v, want %v", i+1, v, i+1)
		}
	}
}

// savedBases is the number of files pageBases returned when the saved
// inputs were found; the gzip one came after, last.
const savedBases = 4
