package reduction_test

import (
	"bytes"
	"errors"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

// csvInput is an Input reading the CSV text b.
func csvInput(t testing.TB, b []byte) reduction.Input {
	t.Helper()
	rd, err := chanfile.NewReader(bytes.NewReader(b), "export.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return reduction.Input{Name: "export.csv", Source: rd}
}

// TestSpecRefusedBeforeReading: a text column (the Note of the export,
// "operator A") named by the spec, Spans with no span and Run with no
// label are each refused with an *Error of Op "plan", class
// quantity.ErrInvalid, naming the column and the fix — never a panic,
// never "no points found".
func TestSpecRefusedBeforeReading(t *testing.T) {
	sec := func(x float64) quantity.Quantity { return quantity.New(x, quantity.Time) }
	tests := []struct {
		name    string
		edit    func(*reduction.Spec)
		channel string
		want    []string // in the message
	}{
		{"text run label", func(s *reduction.Spec) { s.Points = reduction.Runs("Note", 20) }, "Note", []string{"column of text", "numeric run label", "Spans"}},
		{"text zero label", func(s *reduction.Spec) { s.Zero = new(reduction.Run("Note", 20, 1)) }, "Note", []string{"column of text", "numeric run label"}},
		{"text Also", func(s *reduction.Spec) { s.Also = append(s.Also, "Note") }, "Note", []string{"column of text", "leave it out"}},
		{"text time of spans", func(s *reduction.Spec) { s.Points = reduction.Spans("Note", steady.Span{From: sec(4), To: sec(6)}) }, "Note", []string{"column of text"}},
		{"text detected", func(s *reduction.Spec) {
			s.Points = reduction.Detected(reduction.Criterion{Half: 20, MinLen: 200, Channels: []reduction.Tolerance{{Channel: "Note", SD: quantity.New(1, 0), Change: quantity.New(1, 0)}}})
		}, "Note", []string{"column of text"}},
		{"no spans", func(s *reduction.Spec) { s.Points = reduction.Spans("t") }, "t", []string{"no spans given"}},
		{"zero of no spans", func(s *reduction.Spec) { s.Zero = new(reduction.Spans("t")) }, "t", []string{"zero", "no spans given"}},
		{"run of no label", func(s *reduction.Spec) { s.Zero = new(reduction.Run("run", 20)) }, "run", []string{"zero", "no labels given"}},
	}
	for _, tt := range tests {
		for _, whole := range []bool{false, true} {
			t.Run(tt.name, func(t *testing.T) {
				spec := carriageSpec(t)
				tt.edit(spec)
				in := csvInput(t, exportWithUnused(t))
				if whole {
					// Through the whole-history path: a zero found by
					// Detected makes Reduce read the history whole.
					spec.Zero = new(reduction.Detected(reduction.Criterion{Half: 20, MinLen: 200, Channels: []reduction.Tolerance{{Channel: "V", SD: quantity.New(0.01, quantity.Velocity), Change: quantity.New(0.01, quantity.Velocity)}}}))
					tt.edit(spec)
				}
				_, err := spec.Reduce(in)
				var re *reduction.Error
				if !errors.As(err, &re) {
					t.Fatalf("err %v, want a *reduction.Error", err)
				}
				if re.Op != "plan" || re.Channel != tt.channel || !errors.Is(err, quantity.ErrInvalid) || quantity.ClassOf(err) != quantity.ErrInvalid {
					t.Errorf("err %v: Op %q, Channel %q, want plan, %q, class ErrInvalid", err, re.Op, re.Channel, tt.channel)
				}
				for _, w := range tt.want {
					if !strings.Contains(err.Error(), w) {
						t.Errorf("err %q lacks %q", err, w)
					}
				}
			})
		}
	}
}

// FuzzReduceCSV: reducing any CSV text by runs of its label channel, with
// a zero from a time span, never panics, and any error is an *Error of
// one class. The seeds hold a text run label and a text variable.
func FuzzReduceCSV(f *testing.F) {
	f.Add("t [s],run [1],V [m/s],F [N],T_w [°C]\n0,1,1,4,18\n0.1,1,1,4,18\n0.2,1,1,4,18\n")
	f.Add("t [s],run,V [m/s],F [N],T_w [°C]\n0,Lauf 1,1,4,18\n0.1,Lauf 1,1,4,18\n")
	f.Add("t [s],run [1],V [m/s],F,T_w [°C]\n0,1,1,x,18\n")
	f.Add("t [s],run [1],V [m/s],F [N],T_w [°C]\n0,1,NaN,4,18\n1,2,,4,\n")
	f.Fuzz(func(t *testing.T, s string) {
		if len(s) > 1<<14 {
			return
		}
		rd, err := chanfile.NewReader(strings.NewReader(s), "f.csv", chanfile.Options{})
		if err != nil {
			return
		}
		spec := carriageSpec(t)
		spec.Points = reduction.Runs("run", 3)
		spec.Zero = new(reduction.Spans("t", steady.Span{From: quantity.New(0, quantity.Time), To: quantity.New(0.2, quantity.Time)}))
		spec.ChunkRows = 2
		_, err = spec.Reduce(reduction.Input{Name: "f.csv", Source: rd})
		if err == nil {
			return
		}
		var re *reduction.Error
		if !errors.As(err, &re) {
			t.Fatalf("err %v is not a *reduction.Error", err)
		}
		if quantity.ClassOf(err) == nil {
			t.Fatalf("err %v of no class", err)
		}
	})
}

// TestSpanToLastRow: a time span that runs to the record's last sample
// (t = 13.995 s, row 2800) is a point or a zero like any other, read in
// one pass or whole, with the window of the last 200 rows.
func TestSpanToLastRow(t *testing.T) {
	sec := func(x float64) quantity.Quantity { return quantity.New(x, quantity.Time) }
	last := steady.Span{From: sec(13.0), To: sec(13.995)}
	tests := []struct {
		name string
		edit func(*reduction.Spec)
	}{
		{"points", func(s *reduction.Spec) { s.Points = reduction.Spans("t", last) }},
		{"zero", func(s *reduction.Spec) { s.Zero = new(reduction.Spans("t", last)) }},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			spec := carriageSpec(t)
			tt.edit(spec)
			spec.ChunkRows = 64
			res, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
			if err != nil {
				t.Fatal(err)
			}
			w := res.Points[len(res.Points)-1].Window
			if res.Zero != nil && tt.name == "zero" {
				w = res.Zero.Window
			}
			if want := (steady.Window{Start: 2600, End: 2800}); w != want {
				t.Errorf("window %v, want %v", w, want)
			}
		})
	}
}
