package reduction_test

import (
	"bytes"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

// exportWithUnused returns the carriage log with two more columns that
// no variable, derived channel or point uses: an operator's note (text)
// and a spare channel with one bad value ("ERR") on data row 100.
func exportWithUnused(t *testing.T) []byte {
	t.Helper()
	b, err := os.ReadFile("testdata/carriage.csv")
	if err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	row := 0
	for _, l := range strings.SplitAfter(string(b), "\n") {
		if l == "" {
			continue
		}
		l = strings.TrimSuffix(l, "\n")
		switch {
		case strings.HasPrefix(l, "#"):
		case row == 0:
			l += ",Note,Spare [V]"
			row++
		default:
			cell := "0.5"
			if row == 100 {
				cell = "ERR"
			}
			l += ",operator A," + cell
			row++
		}
		out.WriteString(l + "\n")
	}
	return out.Bytes()
}

// TestUnusedColumnsNeverParsed: a bad value in a column the spec does not
// use fails neither the CSV reduction, nor the Parquet one with a column
// the reader does not read (JSON); the points are those of the clean
// file. Read whole, the same CSV fails at that value.
func TestUnusedColumnsNeverParsed(t *testing.T) {
	dir := t.TempDir()
	spec := carriageSpec(t)
	clean, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	csvPath := filepath.Join(dir, "export.csv")
	if err := os.WriteFile(csvPath, exportWithUnused(t), 0o644); err != nil {
		t.Fatal(err)
	}
	// The whole file does not read: the bad value is there.
	rd, err := chanfile.NewReader(bytes.NewReader(exportWithUnused(t)), csvPath, chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if _, _, err := rd.Read(nil, 1<<20); err == nil || !strings.Contains(err.Error(), "ERR") {
		t.Fatalf("whole file read: %v, want the bad value refused", err)
	}
	got, err := spec.Reduce(reduction.File(csvPath, reduction.FileOptions{}))
	if err != nil {
		t.Fatalf("CSV with a bad value in an unused column: %v", err)
	}
	samePoints(t, "CSV", clean, got)

	// Parquet: the carriage's channels and a JSON column, a logical type
	// the reader does not read (it lists the column with its Fault).
	b, _ := os.ReadFile("testdata/carriage.csv")
	rd, err = chanfile.NewReader(bytes.NewReader(b), "carriage.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	data, n, err := rd.Read(nil, 1<<20)
	if err != nil {
		t.Fatal(err)
	}
	g := parquet.Group{"valve log": parquet.JSON()}
	opts := []parquet.WriterOption{}
	for _, c := range rd.Columns() {
		g[c.Name] = parquet.Leaf(parquet.DoubleType)
		opts = append(opts, parquet.KeyValueMetadata(parquetfile.UnitKey+c.Name, c.Text))
	}
	schema := parquet.NewSchema("export", g)
	var buf bytes.Buffer
	w := parquet.NewGenericWriter[any](&buf, append(opts, schema)...)
	rows := make([]parquet.Row, n)
	fields := schema.Fields() // sorted by name
	for i := range rows {
		for j, f := range fields {
			v := parquet.ByteArrayValue([]byte(`{"valve":"open"}`))
			if k := colIndex(rd.Columns(), f.Name()); k >= 0 {
				u := rd.Columns()[k].Unit // written in the CSV's unit
				v = parquet.DoubleValue((data[k].Values()[i] - u.Offset()) / u.Factor())
			}
			rows[i] = append(rows[i], v.Level(0, 0, j))
		}
	}
	if _, err := w.WriteRows(rows); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	if err := unreadColumn(buf.Bytes(), "valve log"); err != nil {
		t.Fatal(err)
	}
	pqPath := filepath.Join(dir, "export.parquet")
	if err := os.WriteFile(pqPath, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	got, err = spec.Reduce(reduction.File(pqPath, reduction.FileOptions{}))
	if err != nil {
		t.Fatalf("Parquet with a JSON column: %v", err)
	}
	samePoints(t, "Parquet", clean, got)
}

// unreadColumn returns nil if the Parquet file b lists the column name
// with a Fault (a column the reader does not read), and otherwise an
// error saying why not: the test then no longer tests what it says.
func unreadColumn(b []byte, name string) error {
	r, err := parquetfile.NewReader(bytes.NewReader(b), int64(len(b)), "export.parquet", parquetfile.Options{})
	if err != nil {
		return err
	}
	for _, c := range r.Columns() {
		if c.Name == name || c.Header == name {
			if c.Fault == nil {
				return errors.New("column " + name + " is read: choose a type the reader does not read")
			}
			return nil
		}
	}
	return errors.New("no column " + name)
}

func colIndex(cols []chanfile.Column, name string) int {
	for k, c := range cols {
		if c.Name == name {
			return k
		}
	}
	return -1
}

func samePoints(t *testing.T, what string, want, got *reduction.Result) {
	t.Helper()
	if len(got.Points) != len(want.Points) {
		t.Fatalf("%s: %d points, want %d", what, len(got.Points), len(want.Points))
	}
	for i := range want.Points {
		for g := range want.Points[i].Groups {
			x, y := want.Points[i].Groups[g], got.Points[i].Groups[g]
			if !near(x.Value(), y.Value()) || !near(x.U().Value(), y.U().Value()) {
				t.Errorf("%s point %d group %d: %v, want %v", what, i+1, g+1, y, x)
			}
		}
	}
}

// near: equal to a few ulps (a unit converted back and forth).
func near(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(a) }

// TestSaveParquetDefinitions: the points saved as Parquet carry the
// groups' definitions in the file's metadata, read back in the order of
// the columns; a malformed entry is refused as ErrParse.
func TestSaveParquetDefinitions(t *testing.T) {
	res, err := carriageSpec(t).Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "points.parquet")
	if err := reduction.SavePoints(path, res, reduction.WriteOptions{}); err != nil {
		t.Fatal(err)
	}
	b, _ := os.ReadFile(path)
	defs, err := reduction.ReadDefinitionsParquet(bytes.NewReader(b), int64(len(b)), path)
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Groups) < 2 {
		t.Fatalf("%d groups", len(res.Groups))
	}
	if diff := cmp.Diff(res.Groups, defs); diff != "" {
		t.Errorf("definitions read back (-wrote +read):\n%s", diff)
	}
	// The entries as parquetfile reads them.
	pr, err := parquetfile.NewReader(bytes.NewReader(b), int64(len(b)), path, parquetfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	g := res.Groups[1]
	if got, want := pr.Metadata()[reduction.ParquetKey+g.Column], g.Definition+"\t"+g.Label; got != want {
		t.Errorf("entry %s = %q, want %q", reduction.ParquetKey+g.Column, got, want)
	}
	// A malformed entry.
	var buf bytes.Buffer
	w, err := parquetfile.NewWriter(&buf, "p", []chanfile.Column{{Name: "Re", Unit: units.One()}},
		parquetfile.Options{Metadata: map[string]string{reduction.ParquetKey + "Re": "no tab"}})
	if err != nil {
		t.Fatal(err)
	}
	w.Close()
	if _, err := reduction.ReadDefinitionsParquet(bytes.NewReader(buf.Bytes()), int64(buf.Len()), "p"); !errors.Is(err, quantity.ErrParse) {
		t.Errorf("malformed entry: %v, want ErrParse", err)
	}
}

// FuzzReadDefinitionsParquet: any metadata entry under ParquetKey is
// read back as the group it states or refused as ErrParse, never a
// panic nor a group without a column or a definition.
func FuzzReadDefinitionsParquet(f *testing.F) {
	f.Add("Re", "Π₂ = V·L/ν\tRe (Reynolds number)")
	f.Add("", "x")
	f.Add("K_T", "\t")
	f.Fuzz(func(t *testing.T, col, val string) {
		var buf bytes.Buffer
		w, err := parquetfile.NewWriter(&buf, "p", []chanfile.Column{{Name: "x", Unit: units.One()}},
			parquetfile.Options{Metadata: map[string]string{reduction.ParquetKey + col: val}})
		if err != nil {
			return // a key or value the writer refuses
		}
		if err := w.Close(); err != nil {
			t.Fatal(err)
		}
		gs, err := reduction.ReadDefinitionsParquet(bytes.NewReader(buf.Bytes()), int64(buf.Len()), "p")
		if err != nil {
			if !errors.Is(err, quantity.ErrParse) {
				t.Fatalf("%q=%q: %v, want ErrParse", col, val, err)
			}
			return
		}
		for _, g := range gs {
			if g.Column == "" || g.Definition == "" {
				t.Fatalf("%q=%q: group %+v", col, val, g)
			}
		}
	})
}
