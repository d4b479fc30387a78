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

// firstError opens text and reads every column to the end; it returns
// the first error, io.EOF left out.
func firstError(text string, opt chanfile.Options) error {
	r, err := chanfile.NewReader(strings.NewReader(text), "lab.csv", opt)
	if err != nil {
		return err
	}
	var dst []quantity.Series
	for {
		if dst, _, err = r.Read(dst, 0); err != nil {
			if err == io.EOF {
				return nil
			}
			return err
		}
	}
}

// TestUnitsRowMessages: the message of a fault in a file with a units
// row (or a missing-value text in a number column) names the fix that
// works. On the code before, "-" under slash dates gave "not a finite
// number", "n.a." in a decimal-comma file named Options.Decimal, and an
// empty units cell asked for "H [1]" in the header.
func TestUnitsRowMessages(t *testing.T) {
	tests := []struct {
		name, text string
		opt        chanfile.Options
		line, col  int
		class      error
		want, not  []string // in the message, and not in it
	}{
		{
			name: "dash under slash dates",
			text: "time;H\n-;m\n04/03/2026 10:00:00;1,5\n04/03/2026 10:00:01;1,6\n",
			line: 1, col: 1, class: quantity.ErrInvalid,
			want: []string{"Options.SlashDates", "DayFirst", "MonthFirst"},
			not:  []string{"not a finite number"},
		},
		{
			name: "dash under slash dates, comma file",
			text: "time,H\n-,m\n04/03/2026 10:00:00,1.5\n04/03/2026 10:00:01,1.6\n",
			line: 1, col: 1, class: quantity.ErrInvalid,
			want: []string{"Options.SlashDates"},
			not:  []string{"not a finite number"},
		},
		{
			name: "dash in the header under slash dates",
			text: "time [-],H [m]\n04/03/2026 10:00:00,1.5\n",
			line: 1, col: 1, class: quantity.ErrInvalid,
			want: []string{"Options.SlashDates"},
		},
		{
			name: "n.a. in a decimal-comma file",
			text: "t;H\ns;m\n0;1,5\n1;n.a.\n",
			line: 4, col: 2, class: quantity.ErrParse,
			want: []string{`Options.Missing = "n.a."`, "Options.MissingValues"},
			not:  []string{"Options.Decimal"},
		},
		{
			name: "n/a in a decimal-point file",
			text: "t,H\ns,m\n0,1.5\n1,n/a\n",
			line: 4, col: 2, class: quantity.ErrParse,
			want: []string{`Options.Missing = "n/a"`, "Options.Columns"},
		},
		{
			name: "a long text is not offered as a marker",
			text: "t,H\ns,m\n0,1.5\n1," + strings.Repeat("x", 70) + "\n",
			line: 4, col: 2, class: quantity.ErrParse,
			want: []string{"not a finite number", "Options.Columns"},
			not:  []string{"Options.Missing"},
		},
		{
			name: "a decimal point is still the decimal mark's fault",
			text: "t;H\ns;m\n0;1,5\n1;1.5e3\n",
			opt:  chanfile.Options{Decimal: ','},
			line: 4, col: 2, class: quantity.ErrParse,
			want: []string{"Options.Decimal"},
			not:  []string{"Options.Missing"},
		},
		{
			name: "a value with a unit in a decimal-comma file",
			text: "t;H\ns;m\n0;1,5\n1;1.5 m\n",
			opt:  chanfile.Options{Decimal: ','},
			line: 4, col: 2, class: quantity.ErrParse,
			want: []string{"the unit belongs in the header"},
		},
		{
			name: "empty units cell, semicolons",
			text: "t;H\ns;\n0;1,5\n1;2\n",
			line: 1, col: 2, class: quantity.ErrParse,
			want: []string{"units row (line 2)", "1 or -"},
			not:  []string{`"H [1]"`},
		},
		{
			name: "empty units cell after a comment",
			text: "t,H\n# units\ns,\n0,1.5\n",
			line: 1, col: 2, class: quantity.ErrParse,
			want: []string{"units row (line 3)", "1 or -"},
			not:  []string{`"H [1]"`},
		},
		{
			name: "no unit in a header without a units row",
			text: "t [s],H\n0,1.5\n",
			line: 1, col: 2, class: quantity.ErrParse,
			want: []string{`"H [1]"`},
			not:  []string{"units row"},
		},
	}
	classes := []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			err := firstError(tt.text, tt.opt)
			var ce *chanfile.Error
			if !errors.As(err, &ce) {
				t.Fatalf("error %v, want a *chanfile.Error", err)
			}
			if diff := cmp.Diff([2]int{tt.line, tt.col}, [2]int{ce.Line, ce.Column}); diff != "" {
				t.Errorf("%v: line and column (-want +got):\n%s", err, diff)
			}
			var in []error
			for _, c := range classes {
				if errors.Is(err, c) {
					in = append(in, c)
				}
			}
			if diff := cmp.Diff([]error{tt.class}, in, cmp.Comparer(func(a, b error) bool { return a == b })); diff != "" {
				t.Errorf("%v: classes (-want +got):\n%s", err, diff)
			}
			for _, w := range tt.want {
				if !strings.Contains(err.Error(), w) {
					t.Errorf("%v: does not say %q", err, w)
				}
			}
			if n := strings.Count(err.Error(), "Options.Columns"); n > 1 {
				t.Errorf("%v: names Options.Columns %d times", err, n)
			}
			for _, w := range tt.not {
				if strings.Contains(err.Error(), w) {
					t.Errorf("%v: says %q", err, w)
				}
			}
		})
	}
}

// TestDashIsNoUnit: "-" under a column of times or text (in a units row
// or in the header) reads as an empty unit does: the times as seconds
// from the first, the text as labels, an epoch column as times, and a
// column of numbers as dimensionless.
func TestDashIsNoUnit(t *testing.T) {
	type col struct {
		Name string
		Kind chanfile.Kind
	}
	tests := []struct {
		name, text string
		opt        chanfile.Options
		cols       []col
		first      []float64 // the values of the first column
		labels     []string  // of the second column
	}{
		{
			name:  "slash dates under -, day first",
			text:  "time;tag;H\n-;-;m\n04/03/2026 10:00:00;A;1,5\n04/03/2026 10:00:02;B;1,6\n",
			opt:   chanfile.Options{SlashDates: chanfile.DayFirst},
			cols:  []col{{"time", chanfile.Timestamp}, {"tag", chanfile.Label}, {"H", chanfile.Number}},
			first: []float64{0, 2}, labels: []string{"A", "B"},
		},
		{
			name:  "epoch under -",
			text:  "unix,tag,H\n-,-,m\n1700000000,A,1.5\n1700000003.5,B,1.6\n",
			cols:  []col{{"unix", chanfile.Timestamp}, {"tag", chanfile.Label}, {"H", chanfile.Number}},
			first: []float64{0, 3.5}, labels: []string{"A", "B"},
		},
		{
			name:  "epoch under an empty cell",
			text:  "unix,tag,H\n,,m\n1700000000,A,1.5\n1700000003.5,B,1.6\n",
			cols:  []col{{"unix", chanfile.Timestamp}, {"tag", chanfile.Label}, {"H", chanfile.Number}},
			first: []float64{0, 3.5}, labels: []string{"A", "B"},
		},
		{
			name:  "numbers under - are dimensionless",
			text:  "Re,tag,H\n-,-,m\n2.5,A,1.5\n3,B,1.6\n",
			cols:  []col{{"Re", chanfile.Number}, {"tag", chanfile.Label}, {"H", chanfile.Number}},
			first: []float64{2.5, 3}, labels: []string{"A", "B"},
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r, err := chanfile.NewReader(strings.NewReader(tt.text), "lab.csv", tt.opt)
			if err != nil {
				t.Fatal(err)
			}
			var got []col
			for _, c := range r.Columns() {
				if c.Fault != nil {
					t.Errorf("column %s: %v", c.Name, c.Fault)
				}
				got = append(got, col{c.Name, c.Kind})
			}
			if diff := cmp.Diff(tt.cols, got); diff != "" {
				t.Errorf("columns (-want +got):\n%s", diff)
			}
			dst, n, err := r.Read(nil, 0)
			if err != nil {
				t.Fatal(err)
			}
			if diff := cmp.Diff(tt.first, dst[0].Values()[:n]); diff != "" {
				t.Errorf("first column (-want +got):\n%s", diff)
			}
			if diff := cmp.Diff(tt.labels, r.Labels(1)); diff != "" {
				t.Errorf("labels (-want +got):\n%s", diff)
			}
		})
	}
}
