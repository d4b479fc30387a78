package chanfile_test

import (
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"pgregory.net/rapid"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

// readSelected opens text, selects the columns at sel and reads them to
// the end: their values (an empty slice for a Label column).
func readSelected(text string, opt chanfile.Options, sel []int) ([][]float64, error) {
	r, err := chanfile.NewReader(strings.NewReader(text), "lab.csv", opt)
	if err != nil {
		return nil, err
	}
	if sel != nil {
		if err := r.Select(sel); err != nil {
			return nil, err
		}
	} else {
		for k := range r.Columns() {
			sel = append(sel, k)
		}
	}
	out := make([][]float64, len(sel))
	var dst []quantity.Series
	for {
		var n int
		dst, n, err = r.Read(dst, 3)
		if err == io.EOF {
			return out, nil
		}
		if err != nil {
			return nil, err
		}
		for i, k := range sel {
			out[i] = append(out[i], dst[k].Values()[:n]...)
		}
	}
}

// TestHeaderFaultInUnusedColumn: a header the reader cannot read in a
// column nobody selects no longer fails the file. The column is listed
// with its header as written and its Fault; selecting it (by
// Reader.Select or Options.Columns) returns that fault, naming line and
// column; reading every column refuses the file as before, the message
// saying how to leave the column out. The file's other columns read to
// the values written: t [s] and F [N] are in SI as written, V [kn] is
// 2 kn = 2 × 1852/3600 m/s (the knot is 1852 m per hour, SI Brochure,
// 9th ed., Table 8), written 2*1852.0/3600 so the compiler rounds it once.
// On the code before, NewReader refused every one of these files.
func TestHeaderFaultInUnusedColumn(t *testing.T) {
	kn2 := 2 * 1852.0 / 3600
	want := [][]float64{{0, 1}, {kn2, kn2}, {10, 11}} // t, V, F
	tests := []struct {
		name   string
		header string // the third column's header field
		cells  [2]string
		says   string // in the fault's message
		class  error
	}{
		{"unit with a stray sign", "Temp [degF?]", [2]string{"68", "69"}, "not a unit", quantity.ErrParse},
		{"unit not in the table", "Flow [furlongs/fortnight]", [2]string{"1", "2"}, "not a unit", quantity.ErrUnknown},
		{"no unit", "C", [2]string{"1", "2"}, `write "C [1]" for a dimensionless one`, quantity.ErrParse},
		{"no name before the unit", "[m/s]", [2]string{"1", "2"}, "no channel name before the unit", quantity.ErrParse},
		{"unbalanced parentheses", "Flow (m3/h))", [2]string{"1", "2"}, "unbalanced parentheses", quantity.ErrParse},
		{"field too long", strings.Repeat("x", chanfile.MaxFieldLen+1) + " [m]", [2]string{"1", "2"}, "header field too long", quantity.ErrParse},
		{"gauge with no reference", "P1 psig", [2]string{"12", "13"}, "Options.Reference", quantity.ErrInvalid},
		{"dates of no stated order", "Day", [2]string{"03/04/2026", "04/04/2026"}, "Options.SlashDates", quantity.ErrInvalid},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			text := fmt.Sprintf("# rig 2\nt [s],V [kn],%s,F [N]\n0,2,%s,10\n1,2,%s,11\n", tc.header, tc.cells[0], tc.cells[1])
			r, err := chanfile.NewReader(strings.NewReader(text), "lab.csv", chanfile.Options{})
			if err != nil {
				t.Fatalf("NewReader: %v", err)
			}
			// The column is listed, with its header and its fault.
			cols := r.Columns()
			if len(cols) != 4 || cols[2].Header != tc.header || cols[2].Index != 3 || cols[2].Fault == nil {
				t.Fatalf("columns %+v: want 4, the third with header %q and a fault", cols, tc.header)
			}
			for k, c := range cols {
				if k != 2 && c.Fault != nil {
					t.Errorf("column %d: fault %v", k+1, c.Fault)
				}
			}
			checkFault := func(what string, err error, hint bool) {
				t.Helper()
				var fe *chanfile.Error
				if !errors.As(err, &fe) || !errors.Is(err, tc.class) || classes(err) != 1 || !strings.Contains(err.Error(), tc.says) {
					t.Fatalf("%s: %v, want an *Error of class %v saying %q", what, err, tc.class, tc.says)
				}
				got := []any{fe.File, fe.Line, fe.Column, strings.Contains(fe.Reason, "Reader.Select")}
				if d := cmp.Diff([]any{"lab.csv", 2, 3, hint}, got); d != "" {
					t.Errorf("%s: file, line, column, hint (-want +got):\n%s", what, d)
				}
			}
			checkFault("Column.Fault", cols[2].Fault, false)
			// The other columns read, by Select or by Options.Columns.
			got, err := readSelected(text, chanfile.Options{}, []int{0, 1, 3})
			if err != nil {
				t.Fatalf("Select(0, 1, 3): %v", err)
			}
			if d := cmp.Diff(want, got); d != "" {
				t.Errorf("Select(0, 1, 3) (-want +got):\n%s", d)
			}
			got, err = readSelected(text, chanfile.Options{Columns: []string{"t", "V", "F"}}, nil)
			if err != nil {
				t.Fatalf("Options.Columns: %v", err)
			}
			if d := cmp.Diff(want, got); d != "" {
				t.Errorf("Options.Columns (-want +got):\n%s", d)
			}
			// Selecting it, or reading every column, refuses.
			_, err = readSelected(text, chanfile.Options{}, []int{0, 2})
			checkFault("Select(0, 2)", err, false)
			_, err = readSelected(text, chanfile.Options{Columns: []string{"t", tc.header}}, nil)
			checkFault("Options.Columns naming it", err, false)
			_, err = readSelected(text, chanfile.Options{}, nil)
			checkFault("every column", err, true)
			// Through chanfile.Select too.
			r, _ = chanfile.NewReader(strings.NewReader(text), "lab.csv", chanfile.Options{})
			_, err = chanfile.Select(r, 2)
			checkFault("chanfile.Select(2)", err, false)
		})
	}
}

// TestDuplicateNameInUnusedColumn: two columns of one channel name are
// refused only when both are read; either alone reads. On the code
// before, NewReader refused the file.
func TestDuplicateNameInUnusedColumn(t *testing.T) {
	text := "t [s],V [m/s],V [kn]\n0,1.5,2\n1,1.5,2\n"
	kn2 := 2 * 1852.0 / 3600 // m/s: the knot is 1852 m/h (SI Brochure, 9th ed., Table 8)
	for _, tc := range []struct {
		sel  []int
		want [][]float64
	}{
		{[]int{0, 1}, [][]float64{{0, 1}, {1.5, 1.5}}},
		{[]int{0, 2}, [][]float64{{0, 1}, {kn2, kn2}}},
	} {
		got, err := readSelected(text, chanfile.Options{}, tc.sel)
		if err != nil {
			t.Fatalf("Select%v: %v", tc.sel, err)
		}
		if d := cmp.Diff(tc.want, got); d != "" {
			t.Errorf("Select%v (-want +got):\n%s", tc.sel, d)
		}
	}
	for _, sel := range [][]int{{1, 2}, nil} {
		_, err := readSelected(text, chanfile.Options{}, sel)
		var fe *chanfile.Error
		if !errors.As(err, &fe) || fe.Line != 1 || fe.Column != 3 || !strings.Contains(err.Error(), `channel "V" is also column 2: rename one with Options.Aliases`) || classes(err) != 1 {
			t.Errorf("Select%v: %v, want the second V refused at 1:3", sel, err)
		}
	}
	// Renamed, both read.
	got, err := readSelected(text, chanfile.Options{Aliases: map[string]string{"V [kn]": "V_kn"}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([][]float64{{0, 1}, {1.5, 1.5}, {kn2, kn2}}, got); d != "" {
		t.Errorf("aliased (-want +got):\n%s", d)
	}
}

// TestHeaderFaultInUnitsRow: a units row under the names whose cell for
// an unused column is not a unit fails only that column.
func TestHeaderFaultInUnitsRow(t *testing.T) {
	text := "t;V;Temp;F\n[s];[m/s];[degF?];[N]\n0;1,5;68;10\n1;1,6;69;11\n"
	r, err := chanfile.NewReader(strings.NewReader(text), "lab.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !r.Format().UnitsRow || r.Columns()[2].Fault == nil || r.Columns()[2].Name != "Temp" {
		t.Fatalf("format %+v, Temp %+v: want a units row and Temp faulted", r.Format(), r.Columns()[2])
	}
	got, err := readSelected(text, chanfile.Options{}, []int{0, 1, 3})
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff([][]float64{{0, 1}, {1.5, 1.6}, {10, 11}}, got); d != "" {
		t.Errorf("(-want +got):\n%s", d)
	}
}

// garbageGen is arbitrary text for one field: any valid UTF-8 but the
// delimiter ',', a quote and a line break, which would change the row's
// fields rather than one field.
var garbageGen = rapid.Custom(func(t *rapid.T) string {
	s := rapid.String().Draw(t, "garbage")
	return strings.Map(func(r rune) rune {
		if r == ',' || r == '"' || r == '\n' || r == '\r' {
			return -1
		}
		return r
	}, s)
})

// TestGarbageColumnNeverChangesSelected: whatever text an unused column
// holds, in its header and its cells, the columns selected read to the
// same values as from the file without it (rapid). The delimiter, the
// decimal mark and the encoding are given, since their detection looks
// at whole lines.
func TestGarbageColumnNeverChangesSelected(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		rows := rapid.IntRange(1, 40).Draw(t, "rows")
		heads := []string{"t [s]", "V [m/s]", "F [N]"}
		vals := make([][]string, rows)
		for i := range vals {
			for range heads {
				x := rapid.Float64Range(-1e6, 1e6).Draw(t, "x")
				vals[i] = append(vals[i], strconv.FormatFloat(x, 'g', -1, 64))
			}
		}
		at := rapid.IntRange(1, len(heads)).Draw(t, "at") // the garbage column's place, after the first
		gHead := garbageGen.Draw(t, "header")
		gCells := make([]string, rows)
		for i := range gCells {
			gCells[i] = garbageGen.Draw(t, "cell")
		}
		file := func(garbage bool) string {
			var sb strings.Builder
			line := func(fs []string, g string) {
				if garbage {
					fs = append(fs[:at:at], append([]string{g}, fs[at:]...)...)
				}
				sb.WriteString(strings.Join(fs, ","))
				sb.WriteByte('\n')
			}
			line(heads, gHead)
			for i := range vals {
				line(vals[i], gCells[i])
			}
			return sb.String()
		}
		opt := chanfile.Options{Comma: ',', Decimal: '.', Encoding: chanfile.UTF8}
		want, err := readSelected(file(false), opt, nil)
		if err != nil {
			t.Fatalf("without the garbage: %v", err)
		}
		sel := []int{0, 1, 2}
		for k := range sel {
			if k >= at {
				sel[k]++
			}
		}
		got, err := readSelected(file(true), opt, sel)
		if err != nil {
			t.Fatalf("Select%v: %v\n%q", sel, err, file(true))
		}
		if d := cmp.Diff(want, got); d != "" {
			t.Fatalf("Select%v (-without +with the garbage):\n%s", sel, d)
		}
		// Named in Options.Columns, by header: the same, unless the
		// garbage header is one of them, which is refused as ambiguous.
		opt.Columns = heads
		got, err = readSelected(file(true), opt, nil)
		if err != nil {
			if !errors.Is(err, quantity.ErrInvalid) || !strings.Contains(err.Error(), "names both") {
				t.Fatalf("Options.Columns: %v", err)
			}
			return
		}
		if d := cmp.Diff(want, got); d != "" {
			t.Fatalf("Options.Columns (-without +with the garbage):\n%s", d)
		}
	})
}

// TestWriterRefusesFaultedColumn: a column a reader could not read has
// no known unit, so a Writer refuses it rather than write it as "[1]".
func TestWriterRefusesFaultedColumn(t *testing.T) {
	r, err := chanfile.NewReader(strings.NewReader("t [s],Temp [degF?]\n0,68\n"), "lab.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var sb strings.Builder
	_, err = chanfile.NewWriter(&sb, "out.csv", r.Columns(), chanfile.Options{})
	var fe *chanfile.Error
	if !errors.As(err, &fe) || fe.Column != 2 || !errors.Is(err, quantity.ErrInvalid) || classes(err) != 1 || !strings.Contains(err.Error(), "Fault") {
		t.Errorf("NewWriter: %v, want column 2 refused (ErrInvalid)", err)
	}
}
