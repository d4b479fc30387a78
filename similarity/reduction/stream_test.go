package reduction

import (
	"bytes"
	"errors"
	"os"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/pigroups"
	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

// TestStreamEqualsWholeHistory: the one-pass reduction of Runs and Spans
// (and their zeros) gives the very points, zero and uncertainties that
// reading the whole history gives, whatever the chunk size.
func TestStreamEqualsWholeHistory(t *testing.T) {
	b, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	p, err := pigroups.NewProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
	)
	if err != nil {
		t.Fatal(err)
	}
	set, err := p.PiSet("rho", "V", "L")
	if err != nil {
		t.Fatal(err)
	}
	sec := func(x float64) quantity.Quantity { return quantity.New(x, quantity.Time) }
	zeroSpan := Spans("t", steady.Span{From: sec(0.5), To: sec(2.0)})
	zeroRun := Run("run", 200, 3) // one run: a stand-in for a zero logged under its own label
	specs := map[string]Spec{
		"runs, zero span": {Points: Runs("run", 200, 0), Zero: &zeroSpan, Tare: []string{"F"}},
		"runs, no zero":   {Points: Runs("run", 3, 0)},
		"spans, zero run": {Points: Spans("t", steady.Span{From: sec(11.2), To: sec(13.0)}, steady.Span{From: sec(4.5), To: sec(6.0)}, steady.Span{From: sec(5.0), To: sec(9.0)}), Zero: &zeroRun, Tare: []string{"F"}},
		"drift flagged":   {Points: Runs("run", 200, 0), Drift: map[string]quantity.Quantity{"F": quantity.New(0.01, quantity.Force)}},
	}
	for name, spec := range specs {
		spec.Derive = "rho = 998.6 {kg/m^3}; nu = 1.0547e-6 {m^2/s}; L = 2 {m}"
		spec.Set = set
		spec.Also = []string{"T_w", "t"}
		for _, chunk := range []int{0, 7, 333} {
			spec.ChunkRows = chunk
			reduce := func(whole bool) *Result {
				wholeHistory = whole
				defer func() { wholeHistory = false }()
				src, err := chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
				if err != nil {
					t.Fatal(err)
				}
				res, err := spec.Reduce(Input{Name: "carriage.csv", Source: src})
				if err != nil {
					t.Fatalf("%s, chunk %d, whole %v: %v", name, chunk, whole, err)
				}
				return res
			}
			a, s := reduce(true), reduce(false)
			if len(a.Points) == 0 {
				t.Fatalf("%s: no points", name)
			}
			opts := cmp.Options{cmp.Comparer(func(x, y quantity.Quantity) bool { return x == y }),
				cmp.Comparer(func(x, y units.Unit) bool { return x.Equal(y) }),
				cmp.Comparer(func(x, y *Result) bool { return false })}
			type flat struct {
				Tag    string
				Window steady.Window
				Means  []string
				Stats  []steady.Stats
				Groups []string
				Drift  []bool
			}
			flatten := func(res *Result) []flat {
				var out []flat
				for _, p := range res.Points {
					f := flat{Tag: p.Tag, Window: p.Window}
					for _, v := range p.Channels {
						f.Means = append(f.Means, v.Mean.String()+" u "+v.Mean.U().String())
						f.Stats = append(f.Stats, v.Stats)
						f.Drift = append(f.Drift, v.Drifting)
					}
					for _, g := range p.Groups {
						f.Groups = append(f.Groups, g.String()+" u "+g.U().String())
					}
					out = append(out, f)
				}
				if res.Zero != nil {
					out = append(out, flat{Tag: res.Zero.Tag, Window: res.Zero.Window, Stats: []steady.Stats{res.Zero.Values[0].Stats}})
				}
				return out
			}
			if d := cmp.Diff(flatten(a), flatten(s), opts); d != "" {
				t.Errorf("%s, chunk %d (-whole +stream):\n%s", name, chunk, d)
			}
			if a.Rows != s.Rows {
				t.Errorf("%s: rows %d and %d", name, a.Rows, s.Rows)
			}
		}
	}
}

// TestStreamStatsEqualSummarize: each window's statistics from the
// one-pass path, read 7 rows at a time so that the rows kept are trimmed
// many times, equal steady.Summarize's over the same window of the whole
// column.
func TestStreamStatsEqualSummarize(t *testing.T) {
	b, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	rd, err := chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	whole, _, err := rd.Read(nil, 1<<20)
	if err != nil {
		t.Fatal(err)
	}
	col := map[string]quantity.Series{}
	for k, c := range rd.Columns() {
		col[c.Name] = whole[k]
	}
	p, _ := pigroups.NewProblem(
		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
	)
	set, err := p.PiSet("rho", "V", "L")
	if err != nil {
		t.Fatal(err)
	}
	spec := Spec{Derive: "rho = 998.6 {kg/m^3}; L = 2 {m}", Points: Runs("run", 200, 0), Set: set, ChunkRows: 7, Also: []string{"T_w", "t"}}
	src, _ := chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
	res, err := spec.Reduce(Input{Name: "carriage.csv", Source: src})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Points) != 3 {
		t.Fatalf("%d points", len(res.Points))
	}
	n := 0
	for _, pt := range res.Points {
		for _, v := range pt.Channels {
			if _, ok := col[v.Name]; !ok {
				continue // derived
			}
			want, err := steady.Summarize(col[v.Name], pt.Window)
			if err != nil {
				t.Fatal(err)
			}
			if d := cmp.Diff(want, v.Stats, cmp.Comparer(func(x, y quantity.Quantity) bool { return x == y })); d != "" {
				t.Errorf("%s %s (-Summarize +stream):\n%s", pt.Tag, v.Name, d)
			}
			n++
		}
	}
	if n != 12 {
		t.Errorf("%d channels compared, want 3 points × 4", n)
	}
}

// TestReadErrorEveryPath: a malformed row deep in the file (line 1504,
// past several chunks of 333 rows) stops the reduction on every path —
// all rows, one pass over Runs, the whole history — with a "read" error
// of class ErrParse naming the file and the line.
func TestReadErrorEveryPath(t *testing.T) {
	b, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	lines := bytes.SplitAfter(b, []byte("\n"))
	bad := bytes.Join([][]byte{bytes.Join(lines[:1503], nil), []byte("1.0,1,2\n"), bytes.Join(lines[1503:], nil)}, nil)
	p, err := pigroups.NewProblem(
		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity, Role: pigroups.Dependent},
		pigroups.Variable{Symbol: "t", Dim: quantity.Time},
		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
	)
	if err != nil {
		t.Fatal(err)
	}
	set, err := p.PiSet("t", "L")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name   string
		points Points
		whole  bool
	}{
		{"all rows", AllRows(), false},
		{"runs, one pass", Runs("run", 200, 0), false},
		{"runs, whole history", Runs("run", 200, 0), true},
	} {
		t.Run(c.name, func(t *testing.T) {
			wholeHistory = c.whole
			defer func() { wholeHistory = false }()
			src, err := chanfile.NewReader(bytes.NewReader(bad), "carriage.csv", chanfile.Options{})
			if err != nil {
				t.Fatal(err)
			}
			spec := Spec{Points: c.points, Set: set, Derive: "L = 2 {m}", ChunkRows: 333}
			_, err = spec.Reduce(Input{Name: "carriage.csv", Source: src})
			var re *Error
			if !errors.As(err, &re) || re.Op != "read" || !errors.Is(err, quantity.ErrParse) || !strings.Contains(err.Error(), "carriage.csv:1504") {
				t.Errorf("err = %v; want a read error of class ErrParse at carriage.csv:1504", err)
			}
		})
	}
}
