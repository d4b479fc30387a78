package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/parquet-go/parquet-go"

	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile/parquetfile"
)

var tankArgs = []string{"-derive", "R = R_T; L = 4.0 {m}; rho = 999.1 {kg/m^3}; nu = 1.1385e-6 {m^2/s}; g = 9.80665 {m/s^2}",
	"-dep", "R", "-repeat", "rho,V,L", "R=N@resistance", "V=m/s", "L=m", "rho=kg/m^3", "nu=m^2/s", "g=m/s^2"}

// TestDataUnusedColumns: the invented tank log with an operator's note
// and a spare channel holding one bad value ("ERR") reduces as the clean
// log does, since no variable or derived channel uses them; the same for
// a Parquet log with a column of a type the reader does not read (JSON).
func TestDataUnusedColumns(t *testing.T) {
	dir := t.TempDir()
	var clean, errb bytes.Buffer
	if code := run(append([]string{"-data", "testdata/tankrun.csv"}, tankArgs...), &clean, &errb); code != 0 {
		t.Fatalf("clean log: exit %d: %s", code, errb.String())
	}
	b, err := os.ReadFile("testdata/tankrun.csv")
	if err != nil {
		t.Fatal(err)
	}
	var export bytes.Buffer
	head := true
	for i, l := range strings.Split(strings.TrimSpace(string(b)), "\n") {
		switch {
		case strings.HasPrefix(l, "#"):
		case head:
			l += ",Note,Spare [V]"
			head = false
		case i == 6:
			l += ",\"dry, calm\",ERR"
		default:
			l += ",calm,0.5"
		}
		export.WriteString(l + "\n")
	}
	if !strings.Contains(export.String(), "ERR") {
		t.Fatalf("no bad value in the export:\n%s", export.String())
	}
	path := filepath.Join(dir, "export.csv")
	if err := os.WriteFile(path, export.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	errb.Reset()
	if code := run(append([]string{"-data", path}, tankArgs...), &out, &errb); code != 0 {
		t.Fatalf("export with a bad value in an unused column: exit %d: %s", code, errb.String())
	}
	if d := cmp.Diff(table(clean.String()), table(out.String())); d != "" {
		t.Errorf("groups (-clean +export):\n%s", d)
	}
	if strings.Contains(errb.String(), "Spare") || strings.Contains(errb.String(), "Note") {
		t.Errorf("the summary speaks of a channel not read:\n%s", errb.String())
	}

	// Parquet: V, R_T and T_w as DOUBLE with their units, and a JSON
	// column, a logical type the reader does not read.
	g := parquet.Group{"V": parquet.Leaf(parquet.DoubleType), "R_T": parquet.Leaf(parquet.DoubleType),
		"T_w": parquet.Leaf(parquet.DoubleType), "valve log": parquet.JSON()}
	schema := parquet.NewSchema("tank", g)
	var buf bytes.Buffer
	w := parquet.NewGenericWriter[any](&buf, schema,
		parquet.KeyValueMetadata(parquetfile.UnitKey+"V", "m/s"),
		parquet.KeyValueMetadata(parquetfile.UnitKey+"R_T", "N"),
		parquet.KeyValueMetadata(parquetfile.UnitKey+"T_w", "°C"))
	var rows []parquet.Row
	for _, l := range table(string(b))[1:] {
		var v, r, tw float64
		f := strings.Split(l, ",")
		if _, err := fmtSscan(f, &v, &r, &tw); err != nil {
			t.Fatal(err)
		}
		vals := map[string]parquet.Value{"V": parquet.DoubleValue(v), "R_T": parquet.DoubleValue(r), "T_w": parquet.DoubleValue(tw), "valve log": parquet.ByteArrayValue([]byte(`{"valve":"open"}`))}
		var row parquet.Row
		for j, fd := range schema.Fields() {
			row = append(row, vals[fd.Name()].Level(0, 0, j))
		}
		rows = append(rows, row)
	}
	if _, err := w.WriteRows(rows); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	// The reader lists the JSON column with its Fault: it is a column
	// the reader cannot read, in a position no variable uses.
	pr, err := parquetfile.NewReader(bytes.NewReader(buf.Bytes()), int64(buf.Len()), "tank.parquet", parquetfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	unread := false
	for _, c := range pr.Columns() {
		unread = unread || c.Name == "valve log" && c.Fault != nil
	}
	if !unread {
		t.Fatalf("the reader reads the JSON column or does not list it: choose a type it does not read")
	}
	pq := filepath.Join(dir, "tank.parquet")
	if err := os.WriteFile(pq, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	out.Reset()
	errb.Reset()
	if code := run(append([]string{"-data", pq}, tankArgs...), &out, &errb); code != 0 {
		t.Fatalf("Parquet log with a JSON column: exit %d: %s", code, errb.String())
	}
	if d := cmp.Diff(table(clean.String()), table(out.String())); d != "" {
		t.Errorf("groups (-clean CSV +Parquet):\n%s", d)
	}
}

// fmtSscan reads the tank log's three numbers of a row.
func fmtSscan(f []string, x ...*float64) (int, error) {
	for i := range x {
		v, err := strconv.ParseFloat(strings.TrimSpace(f[i]), 64)
		if err != nil {
			return i, err
		}
		*x[i] = v
	}
	return len(x), nil
}

// TestRowsNamedAndDefined: with n in rev/s the pump's groups are exactly
// ψ_p and φ, so the row-by-row CSV names its columns by them and carries
// each group's definition in a comment line that reduction.ReadDefinitions
// reads back; the JSON lines use the same keys, and the Parquet file the
// same columns with the definitions in its metadata.
func TestRowsNamedAndDefined(t *testing.T) {
	args := append([]string(nil), pumpArgs...)
	for i, a := range args {
		if a == "n=rad/s" {
			args[i] = "n=rev/s"
		}
	}
	var out, errb bytes.Buffer
	if code := run(args, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if h := table(out.String())[0]; h != "ψ_p [1],φ [1]" {
		t.Errorf("header %q, want ψ_p [1],φ [1]", h)
	}
	defs, err := reduction.ReadDefinitions(strings.NewReader(out.String()), "out")
	if err != nil {
		t.Fatal(err)
	}
	want := []reduction.Group{
		{Column: "ψ_p", Name: "Π₁", Definition: "Π₁ = dp/(n²·D²·rho)", Label: "ψ_p"},
		{Column: "φ", Name: "Π₂", Definition: "Π₂ = Q/(n·D³)", Label: "φ"},
	}
	if d := cmp.Diff(want, defs); d != "" {
		t.Errorf("definitions (-want +got):\n%s", d)
	}
	if !strings.Contains(errb.String(), "Π₁ = dp/(n²·D²·rho)  (ψ_p); column ψ_p") {
		t.Errorf("summary lacks the column of Π₁:\n%s", errb.String())
	}
	var js bytes.Buffer
	if code := run(append([]string{"-format", "jsonl"}, args...), &js, &errb); code != 0 {
		t.Fatalf("jsonl: exit %d", code)
	}
	var first map[string]any
	if err := json.Unmarshal([]byte(strings.SplitN(js.String(), "\n", 2)[0]), &first); err != nil {
		t.Fatal(err)
	}
	if _, ok := first["ψ_p"]; !ok || first["φ"] == nil {
		t.Errorf("JSON keys %v, want ψ_p and φ", first)
	}
	pq := filepath.Join(t.TempDir(), "rows.parquet")
	if code := run(append([]string{"-out", pq}, args...), &bytes.Buffer{}, &errb); code != 0 {
		t.Fatalf("parquet: exit %d: %s", code, errb.String())
	}
	pb, _ := os.ReadFile(pq)
	pdefs, err := reduction.ReadDefinitionsParquet(bytes.NewReader(pb), int64(len(pb)), pq)
	if err != nil {
		t.Fatal(err)
	}
	if d := cmp.Diff(want, pdefs); d != "" {
		t.Errorf("Parquet definitions (-want +got):\n%s", d)
	}
}
