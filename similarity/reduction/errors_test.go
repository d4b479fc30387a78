package reduction_test

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

var classes = []error{quantity.ErrDimension, quantity.ErrRange, quantity.ErrParse, quantity.ErrUnknown, quantity.ErrInvalid}

// TestErrorClasses: every error names its file and step and matches
// exactly one class.
func TestErrorClasses(t *testing.T) {
	file := reduction.File("testdata/carriage.csv", reduction.FileOptions{})
	for _, tc := range []struct {
		name  string
		edit  func(s *reduction.Spec)
		in    reduction.Input
		class error
		op    string
		says  string
	}{
		{"no channel", func(s *reduction.Spec) { s.Also = []string{"G"} }, file, quantity.ErrInvalid, "plan", "no such channel"},
		{"formula", func(s *reduction.Spec) { s.Derive = "rho = T_w + V" }, file, quantity.ErrDimension, "plan", "derived channels"},
		{"unknown func", func(s *reduction.Spec) { s.Funcs = nil }, file, quantity.ErrUnknown, "plan", "rho_water"},
		{"zero twice", func(s *reduction.Spec) {
			s.Zero = ptr(reduction.Run("run", 3, 1, 2))
		}, file, quantity.ErrInvalid, "zero", "want 1"},
		{"no points", func(s *reduction.Spec) { s.Points = reduction.Runs("run", 100000) }, file, quantity.ErrRange, "points", "no points"},
		{"span outside", func(s *reduction.Spec) {
			s.Points = reduction.Spans("t", spanS(20, 30))
		}, file, quantity.ErrRange, "points", "t"},
		{"missing file", nil, reduction.File("testdata/none.csv", reduction.FileOptions{}), quantity.ErrInvalid, "read", "none.csv"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			spec := carriageSpec(t)
			if tc.edit != nil {
				tc.edit(spec)
			}
			_, err := spec.Reduce(tc.in)
			var re *reduction.Error
			if !errors.As(err, &re) {
				t.Fatalf("err = %v (%T), want *reduction.Error", err, err)
			}
			n := 0
			for _, c := range classes {
				if errors.Is(err, c) {
					n++
				}
			}
			if n != 1 || !errors.Is(err, tc.class) {
				t.Errorf("%v: matches %d classes, want %v only", err, n, tc.class)
			}
			if re.Op != tc.op || !strings.Contains(err.Error(), tc.says) || !strings.Contains(err.Error(), "testdata/") {
				t.Errorf("%v: op %q, want %q, saying %q and the file", err, re.Op, tc.op, tc.says)
			}
		})
	}
}

func spanS(a, b float64) (s struct{ From, To quantity.Quantity }) {
	return struct{ From, To quantity.Quantity }{quantity.New(a, quantity.Time), quantity.New(b, quantity.Time)}
}

// TestParquetSource: the log as Parquet reduces to the same points.
func TestParquetSource(t *testing.T) {
	b, _ := os.ReadFile("testdata/carriage.csv")
	rd, err := chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	data, _, err := rd.Read(nil, 1<<20)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "carriage.parquet")
	f, _ := os.Create(path)
	pw, err := parquetfile.NewWriter(f, path, rd.Columns(), parquetfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := pw.Write(data); err != nil {
		t.Fatal(err)
	}
	if err := pw.Close(); err != nil {
		t.Fatal(err)
	}
	f.Close()
	spec := carriageSpec(t)
	a, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	p, err := spec.Reduce(reduction.File(path, reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Points {
		for g := range a.Points[i].Groups {
			x, y := a.Points[i].Groups[g], p.Points[i].Groups[g]
			if x.Value() != y.Value() || x.U() != y.U() {
				t.Errorf("point %d group %d: CSV %v, Parquet %v", i+1, g+1, x, y)
			}
		}
	}
}

// FuzzReadDefinitions: reading definitions never panics, and what it
// returns has a column and a definition.
func FuzzReadDefinitions(f *testing.F) {
	f.Add("\ufeff# invented\n# group\tRe\tΠ₂ = V·L/ν\tRe\nRe [1]\n1\n")
	f.Add("# group\tx\n")
	f.Add("# group\t\t\t\n")
	f.Fuzz(func(t *testing.T, s string) {
		gs, err := reduction.ReadDefinitions(strings.NewReader(s), "f")
		if err != nil {
			if !errors.Is(err, quantity.ErrParse) && !errors.Is(err, quantity.ErrInvalid) {
				t.Fatalf("err %v of no class", err)
			}
			return
		}
		for _, g := range gs {
			if g.Column == "" || g.Definition == "" {
				t.Fatalf("empty definition %+v", g)
			}
		}
	})
}

// TestAllRowsRefusesZero: a zero, a tare or a calibration of the mean
// has no meaning row by row, and is refused rather than ignored.
func TestAllRowsRefusesZero(t *testing.T) {
	spec := carriageSpec(t)
	spec.Points = reduction.AllRows()
	_, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	var re *reduction.Error
	if !errors.As(err, &re) || re.Op != "plan" || !errors.Is(err, quantity.ErrInvalid) {
		t.Errorf("AllRows with a zero: %v", err)
	}
}

// TestDeriveInputsByWord: a tared channel F is not taken for an input
// of a formula that only contains the letter F inside another word.
func TestDeriveInputsByWord(t *testing.T) {
	spec := carriageSpec(t)
	spec.Derive += "; Fn = V / sqrt(9.80665 {m/s^2} * L)"
	if _, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{})); err != nil {
		t.Error(err)
	}
}
