package chanfile_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units/chanfile"
)

// rig is an INVENTED pump-rig log with a text remark column.
const rig = "t [s],Q [m3/h],T [°C],Bemerkung\n0,10,20,Lauf 1\n1,11,20,Lauf 1\n2,12,21,Lauf 2\n"

func rigWhole(t *testing.T) chanfile.Whole {
	t.Helper()
	r, err := chanfile.NewReader(strings.NewReader(rig), "rig.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	w, err := chanfile.ReadAll(r, 10)
	if err != nil {
		t.Fatal(err)
	}
	return w
}

// TestWholeChannel: Channel gives a numeric column's Series and refuses
// a text column (whose Series is empty, so that steady.Runs of it found
// no run and said nothing) and an unknown name, each with an *Error of
// class quantity.ErrInvalid naming the channel.
func TestWholeChannel(t *testing.T) {
	w := rigWhole(t)
	tests := []struct {
		name   string
		want   []float64 // nil: an error
		errHas []string
	}{
		{"Q", []float64{10.0 / 3600, 11.0 / 3600, 12.0 / 3600}, nil},
		{"Bemerkung", nil, []string{`"Bemerkung" is a column of text`, "Whole.Labels", "TextRuns"}},
		{"run", nil, []string{`no channel "run"`}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s, err := w.Channel(tt.name)
			if tt.want == nil {
				var ce *chanfile.Error
				if !errors.As(err, &ce) || quantity.ClassOf(err) != quantity.ErrInvalid {
					t.Fatalf("err %v, want a *chanfile.Error of class ErrInvalid", err)
				}
				for _, h := range tt.errHas {
					if !strings.Contains(err.Error(), h) {
						t.Errorf("err %q lacks %q", err, h)
					}
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if d := cmp.Diff(tt.want, s.Values(), cmp.Comparer(func(a, b float64) bool { return math.Abs(a-b) <= 1e-15*math.Abs(a) })); d != "" {
				t.Errorf("(-want +got)\n%s", d)
			}
		})
	}
}

// TestErrorPlaces: an error with no line prints no ":0" (ReadAll's
// argument error printed "rig.csv:0: ReadAll: …"); one with a line keeps
// "file:line:column".
func TestErrorPlaces(t *testing.T) {
	r, err := chanfile.NewReader(strings.NewReader(rig), "rig.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	_, argErr := chanfile.ReadAll(r, 0)
	tests := []struct {
		name string
		err  error
		want string
	}{
		{"ReadAll argument", argErr, "chanfile: rig.csv: ReadAll: maxRows 0 is not positive"},
		{"file and column", &chanfile.Error{File: "rig.csv", Column: 3, Reason: "r"}, "chanfile: rig.csv: column 3: r"},
		{"column only", &chanfile.Error{Column: 3, Reason: "r"}, "chanfile: column 3: r"},
		{"line and column", &chanfile.Error{File: "rig.csv", Line: 4, Column: 2, Reason: "r"}, "chanfile: rig.csv:4:2: r"},
		{"nothing", &chanfile.Error{Reason: "r"}, "chanfile: r"},
	}
	for _, tt := range tests {
		if tt.err == nil || tt.err.Error() != tt.want {
			t.Errorf("%s: %v, want %q", tt.name, tt.err, tt.want)
		}
	}
}

// TestUnitSpelling: Unit.String respells the header's unit in ASCII,
// Text keeps it as written, and a text column's Kind says Label.
func TestUnitSpelling(t *testing.T) {
	w := rigWhole(t)
	type col struct{ Unit, Text, Kind string }
	var got []col
	for _, c := range w.Columns {
		got = append(got, col{c.Unit.String(), c.Text, c.Kind.String()})
	}
	want := []col{{"s", "s", "number"}, {"m^3/h", "m3/h", "number"}, {"degC", "°C", "number"}, {"1", "", "label"}}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("(-want +got)\n%s", d)
	}
}
