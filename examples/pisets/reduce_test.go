package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"similis.dev/similis/quantity"
	"similis.dev/similis/units"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/chanfile/parquetfile"
)

var pumpArgs = []string{"-data", "testdata/pumploop.csv", "-baro", "1002hPa",
	"-derive", "dp = P2 - P1; D = 0.25 {m}; rho = 998.2 {kg/m^3}",
	"-dep", "dp", "-repeat", "n,D,rho", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}

// TestReducePumpLoop reduces the invented pump-loop log and checks every
// group value by hand: Π₁ = Δp/(ρn²D²) and Π₂ = Q/(nD³) with n in rad/s
// (1 psi = 6894.757 Pa, NIST SP 811; 1 rpm = 2π/60 rad/s).
func TestReducePumpLoop(t *testing.T) {
	var out, errb bytes.Buffer
	if code := run(pumpArgs, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	const psi = 4.4482216152605 / (0.0254 * 0.0254)
	rows := []struct{ q, p1, p2, rpm float64 }{
		{180, 2.0, 38.0, 1450}, {160, 2.4, 41.5, 1450}, {140, 2.8, 44.1, 1451},
		{120, 3.1, math.NaN(), 1450}, {100, 3.4, 47.6, 1449}, {80, 3.6, 48.9, 1450},
	}
	lines := table(out.String())
	if lines[0] != "Π₁ [1],Π₂ [1]" || len(lines) != len(rows)+1 {
		t.Fatalf("output:\n%s", out.String())
	}
	for i, r := range rows {
		n := r.rpm * 2 * math.Pi / 60
		const d, rho = 0.25, 998.2
		pi1 := (r.p2 - r.p1) * psi / (rho * n * n * d * d) // the barometer reading cancels
		pi2 := r.q / 3600 / (n * d * d * d)
		f := strings.Split(lines[i+1], ",")
		if math.IsNaN(pi1) {
			if f[0] != chanfile.MissingText {
				t.Errorf("row %d: Π₁ %q, want %q (P2 missing)", i+1, f[0], chanfile.MissingText)
			}
		} else if got, _ := strconv.ParseFloat(f[0], 64); math.Abs(got-pi1) > 1e-9*pi1 {
			t.Errorf("row %d: Π₁ = %v, want %v", i+1, got, pi1)
		}
		if got, _ := strconv.ParseFloat(f[1], 64); math.Abs(got-pi2) > 1e-12*pi2 {
			t.Errorf("row %d: Π₂ = %v, want %v", i+1, got, pi2)
		}
	}
	for _, want := range []string{"reduced 6 rows", "Π₁ = dp/(n²·D²·rho)  (ψ_p/(4π²))", "Π₂ = Q/(n·D³)  (φ/(2π))",
		"m3 read as m^3", "P1: gauge (psig) read as absolute with the reference 100200 Pa", "P2: 1 missing value ", "engineer responsible"} {
		if !strings.Contains(errb.String(), want) {
			t.Errorf("summary lacks %q:\n%s", want, errb.String())
		}
	}
}

// TestReduceExitCodes: 0 on success, 1 for bad data with the file, line
// and column, 2 for bad usage.
func TestReduceExitCodes(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.csv")
	if err := os.WriteFile(bad, []byte("Q m3/h,n [rpm]\n180,1450\n160 m3/h,1450\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	outFile := filepath.Join(dir, "groups.csv")
	tests := []struct {
		args []string
		code int
		says string
	}{
		{append([]string{"-out", outFile}, pumpArgs...), 0, ""},
		{[]string{"-data", bad, "Q=m^3/s", "n=rad/s", "D=m"}, 2, "variable D is neither a channel"},
		{[]string{"-data", bad, "-derive", "D = 0.25 {m}", "Q=m^3/s", "n=rad/s", "D=m"}, 1, "bad.csv:3:1: \"160 m3/h\": a value with a unit in a data row"},
		{[]string{"-data", "testdata/pumploop.csv", "-derive", "dp = P2; D = 0.25 {m}; rho = 998 {kg/m^3}", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "give -baro"},
		{[]string{"-data", "testdata/pumploop.csv", "-std-atm", "-derive", "dp = P2 - P1 + Q", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "cannot add pressure"},
		{[]string{"-data", "testdata/pumploop.csv", "-std-atm", "-derive", "dp = P2; D = 0.25 {m}; rho = 998 {kg/m^3}", "dp=Pa*s", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "variable dp is dynamic viscosity"},
		{[]string{"-data", "testdata/pumploop.csv", "-baro", "12kn", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "want an absolute pressure"},
		{[]string{"-data", "testdata/pumploop.csv", "-baro", "1bar", "-std-atm", "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "give one reference"},
		{[]string{"-data", filepath.Join(dir, "none.csv"), "dp=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}, 2, "-data"},
		{[]string{"-derive", "dp = P2 - P1", "Q=m^3/s"}, 2, "go with -data"},
		{[]string{"-data", "testdata/pumploop.csv"}, 2, "needs the variables"},
	}
	for _, tc := range tests {
		var out, errb bytes.Buffer
		code := run(tc.args, &out, &errb)
		if code != tc.code || !strings.Contains(errb.String(), tc.says) {
			t.Errorf("pisets %s: exit %d, %q; want exit %d saying %q", strings.Join(tc.args, " "), code, errb.String(), tc.code, tc.says)
		}
	}
	b, err := os.ReadFile(outFile)
	if err != nil || !strings.HasPrefix(string(b), "# the groups of each data row of testdata/pumploop.csv") || table(string(b))[0] != "Π₁ [1],Π₂ [1]" || len(table(string(b))) != 7 {
		t.Errorf("-out file: %q, %v", b, err)
	}
}

// TestReduceTankRun reduces the invented towing-tank log; by hand for the
// 2.0 m/s row: R/(ρV²L²) = 47.9/(999.1·4·16) = 7.4911e-4, ν/(VL) =
// 1.1385e-6/8 and gL/V² = 9.80665·4/4.
func TestReduceTankRun(t *testing.T) {
	var out, errb bytes.Buffer
	args := []string{"-data", "testdata/tankrun.csv",
		"-derive", "R = R_T; L = 4.0 {m}; rho = 999.1 {kg/m^3}; nu = 1.1385e-6 {m^2/s}; g = 9.80665 {m/s^2}",
		"-dep", "R", "-repeat", "rho,V,L", "R=N@resistance", "V=m/s", "L=m", "rho=kg/m^3", "nu=m^2/s", "g=m/s^2"}
	if code := run(args, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	lines := table(out.String())
	if len(lines) != 6 || lines[0] != "Π₁ [1],Π₂ [1],Π₃ [1]" {
		t.Fatalf("output:\n%s", out.String())
	}
	want := []float64{47.9 / (999.1 * 4 * 16), 1.1385e-6 / 8, 9.80665 * 4 / 4}
	for k, f := range strings.Split(lines[3], ",") {
		if got, _ := strconv.ParseFloat(f, 64); math.Abs(got-want[k]) > 1e-12*want[k] {
			t.Errorf("row 3 group %d = %v, want %v", k+1, got, want[k])
		}
	}
	for _, s := range []string{"(1/Re)", "(1/Fr²)", "reduced 5 rows"} {
		if !strings.Contains(errb.String(), s) {
			t.Errorf("summary lacks %q:\n%s", s, errb.String())
		}
	}
}

// TestReduceJSONLines: -format jsonl writes the same numbers as the CSV,
// one object per row, null where a value is missing.
func TestReduceJSONLines(t *testing.T) {
	var csvOut, jsonOut, errb bytes.Buffer
	if code := run(pumpArgs, &csvOut, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if code := run(append([]string{"-format", "jsonl"}, pumpArgs...), &jsonOut, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	csvLines := table(csvOut.String())[1:]
	jsonLines := strings.Split(strings.TrimSpace(jsonOut.String()), "\n")
	if len(jsonLines) != len(csvLines) {
		t.Fatalf("%d JSON lines, %d CSV rows", len(jsonLines), len(csvLines))
	}
	for i, l := range jsonLines {
		var row map[string]*float64
		if err := json.Unmarshal([]byte(l), &row); err != nil {
			t.Fatalf("line %d %q: %v", i+1, l, err)
		}
		if r := row["row"]; r == nil || *r != float64(i+1) {
			t.Errorf("line %d: row %v", i+1, r)
		}
		for k, f := range strings.Split(csvLines[i], ",") {
			v := row[[]string{"Π₁", "Π₂"}[k]]
			if f == chanfile.MissingText {
				if v != nil {
					t.Errorf("line %d group %d: %v, want null", i+1, k+1, *v)
				}
				continue
			}
			if want, _ := strconv.ParseFloat(f, 64); v == nil || *v != want {
				t.Errorf("line %d group %d: %v, want %v", i+1, k+1, v, want)
			}
		}
	}
	if code := run(append([]string{"-format", "xml"}, pumpArgs...), &jsonOut, &errb); code != 2 || !strings.Contains(errb.String(), "want csv, jsonl, json, text or parquet") {
		t.Errorf("-format xml: exit %d, %s", code, errb.String())
	}
}

// TestReduceFitAndPlot: -fit reports the power law that a simple
// least-squares line through (ln Π₂, ln Π₁) of the hand-computed rows
// gives (the row with P2 missing excluded and counted), and -plot writes
// a PNG and an SVG.
func TestReduceFitAndPlot(t *testing.T) {
	const psi = 4.4482216152605 / (0.0254 * 0.0254)
	rows := []struct{ q, p1, p2, rpm float64 }{
		{180, 2.0, 38.0, 1450}, {160, 2.4, 41.5, 1450}, {140, 2.8, 44.1, 1451},
		{100, 3.4, 47.6, 1449}, {80, 3.6, 48.9, 1450},
	}
	var sx, sy, sxx, sxy float64
	for _, r := range rows {
		n := r.rpm * 2 * math.Pi / 60
		x := math.Log(r.q / 3600 / (n * 0.25 * 0.25 * 0.25))
		y := math.Log((r.p2 - r.p1) * psi / (998.2 * n * n * 0.25 * 0.25))
		sx, sy, sxx, sxy = sx+x, sy+y, sxx+x*x, sxy+x*y
	}
	k := float64(len(rows))
	a := (k*sxy - sx*sy) / (k*sxx - sx*sx)
	c := math.Exp((sy - a*sx) / k)
	dir := t.TempDir()
	for _, ext := range []string{".png", ".svg"} {
		path := filepath.Join(dir, "fit"+ext)
		var out, errb bytes.Buffer
		if code := run(append([]string{"-fit", "-plot", path}, pumpArgs...), &out, &errb); code != 0 {
			t.Fatalf("exit %d: %s", code, errb.String())
		}
		want := fmt.Sprintf("5 rows, 1 excluded as not positive or missing): Π₁ = %.6g·Π₂^%.4g", c, a)
		if !strings.Contains(errb.String(), want) || !strings.Contains(errb.String(), "at 95 %") {
			t.Errorf("summary lacks %q:\n%s", want, errb.String())
		}
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		if ext == ".png" && !bytes.HasPrefix(b, []byte("\x89PNG")) || ext == ".svg" && !bytes.Contains(b[:min(len(b), 512)], []byte("<svg")) {
			t.Errorf("%s is not a %s file: %q", path, ext, b[:min(len(b), 16)])
		}
	}
	for _, tc := range []struct {
		args []string
		says string
	}{
		{append([]string{"-plot", filepath.Join(dir, "x.png")}, pumpArgs...), "give -fit too"},
		{append([]string{"-fit", "-plot", filepath.Join(dir, "x.jpg")}, pumpArgs...), "want a .png or .svg"},
		{[]string{"-fit", "Q=m^3/s", "n=rad/s", "D=m"}, "go with -data"},
		{[]string{"-fit", "-plot", filepath.Join(dir, "t.png"), "-data", "testdata/tankrun.csv",
			"-derive", "R = R_T; L = 4.0 {m}; rho = 999.1 {kg/m^3}; nu = 1.1385e-6 {m^2/s}; g = 9.80665 {m/s^2}",
			"-dep", "R", "-repeat", "rho,V,L", "R=N", "V=m/s", "L=m", "rho=kg/m^3", "nu=m^2/s", "g=m/s^2"}, "this set has 3 groups"},
	} {
		var out, errb bytes.Buffer
		if code := run(tc.args, &out, &errb); code != 2 || !strings.Contains(errb.String(), tc.says) {
			t.Errorf("pisets %s: exit %d, %q; want 2 saying %q", strings.Join(tc.args, " "), code, errb.String(), tc.says)
		}
	}
}

// TestReduceParquet: the groups written as Parquet carry their unit in
// the file and hold the same numbers as the CSV output; a Parquet log
// (the tank run, converted here) reduces to the same groups as the CSV
// log; Parquet output needs -out.
func TestReduceParquet(t *testing.T) {
	dir := t.TempDir()
	var csvOut, errb bytes.Buffer
	if code := run(pumpArgs, &csvOut, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	pq := filepath.Join(dir, "groups.parquet")
	if code := run(append([]string{"-out", pq}, pumpArgs...), io.Discard, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	cols, vals := readParquet(t, pq)
	if len(cols) != 2 || cols[0].Name != "Π₁" || !cols[0].Unit.Equal(units.One()) || cols[1].Missing != 0 || cols[0].Missing != 1 {
		t.Fatalf("columns %+v", cols)
	}
	lines := table(csvOut.String())[1:]
	for i, line := range lines {
		for g, f := range strings.Split(line, ",") {
			want := math.NaN()
			if f != "" {
				want, _ = strconv.ParseFloat(f, 64)
			}
			if got := vals[g][i]; got != want && !(math.IsNaN(got) && math.IsNaN(want)) {
				t.Errorf("row %d group %d: Parquet %v, CSV %v", i+1, g+1, got, want)
			}
		}
	}

	// The tank log as Parquet: units from the CSV header, in the metadata.
	src, err := os.Open("testdata/tankrun.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer src.Close()
	cr, err := chanfile.NewReader(src, "tankrun.csv", chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	log := filepath.Join(dir, "tankrun.parquet")
	lf, err := os.Create(log)
	if err != nil {
		t.Fatal(err)
	}
	pw, err := parquetfile.NewWriter(lf, log, cr.Columns(), parquetfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for chunk := []quantity.Series(nil); ; {
		var n int
		if chunk, n, err = cr.Read(chunk, 2); err == io.EOF {
			break
		} else if err != nil {
			t.Fatal(err)
		}
		if err := pw.Write(chunk); err != nil || n == 0 {
			t.Fatal(err)
		}
	}
	if err := pw.Close(); err != nil {
		t.Fatal(err)
	}
	lf.Close()
	tank := []string{"-derive", "R = R_T; L = 4.0 {m}; rho = 999.1 {kg/m^3}; nu = 1.1385e-6 {m^2/s}; g = 9.80665 {m/s^2}",
		"-dep", "R", "-repeat", "rho,V,L", "R=N@resistance", "V=m/s", "L=m", "rho=kg/m^3", "nu=m^2/s", "g=m/s^2"}
	var fromCSV, fromPQ bytes.Buffer
	if code := run(append([]string{"-data", "testdata/tankrun.csv"}, tank...), &fromCSV, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if code := run(append([]string{"-data", log}, tank...), &fromPQ, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	// The knots of the log are stored as knots: a value may move by an ulp
	// through the unit and back, so compare to 1e-15.
	a := table(fromCSV.String())
	b := table(fromPQ.String())
	if len(a) != len(b) || a[0] != b[0] {
		t.Fatalf("CSV log gives\n%s\nParquet log gives\n%s", fromCSV.String(), fromPQ.String())
	}
	for i := 1; i < len(a); i++ {
		fa, fb := strings.Split(a[i], ","), strings.Split(b[i], ",")
		for k := range fa {
			x, _ := strconv.ParseFloat(fa[k], 64)
			y, _ := strconv.ParseFloat(fb[k], 64)
			if math.Abs(x-y) > 1e-15*math.Abs(x) {
				t.Errorf("row %d group %d: CSV log %v, Parquet log %v", i, k+1, x, y)
			}
		}
	}

	for _, tc := range []struct {
		args []string
		says string
	}{
		{append([]string{"-format", "parquet"}, pumpArgs...), "give -out"},
	} {
		errb.Reset()
		code := run(tc.args, io.Discard, &errb)
		if code != 2 || !strings.Contains(errb.String(), tc.says) {
			t.Errorf("pisets %v: exit %d %q, want 2 saying %q", tc.args, code, errb.String(), tc.says)
		}
	}
	bad := filepath.Join(dir, "bad.parquet")
	os.WriteFile(bad, []byte("PAR1 not really"), 0o644)
	errb.Reset()
	if code := run(append([]string{"-data", bad}, tank[4:]...), io.Discard, &errb); code != 1 || !strings.Contains(errb.String(), "not a readable Parquet file") {
		t.Errorf("a damaged Parquet log: exit %d %q, want 1", code, errb.String())
	}
}

func readParquet(t *testing.T, name string) ([]chanfile.Column, [][]float64) {
	t.Helper()
	f, err := os.Open(name)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	st, _ := f.Stat()
	r, err := parquetfile.NewReader(f, st.Size(), name, parquetfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var dst []quantity.Series
	var out [][]float64
	for {
		var n int
		dst, n, err = r.Read(dst, 0)
		if err == io.EOF {
			break
		} else if err != nil {
			t.Fatal(err)
		}
		if out == nil {
			out = make([][]float64, len(dst))
		}
		for j := range dst {
			out[j] = append(out[j], dst[j].Values()[:n]...)
		}
	}
	return r.Columns(), out
}

// TestProgress: a bar is drawn only on a terminal and for a long file,
// and cleared at the end.
func TestProgress(t *testing.T) {
	defer func(f func(io.Writer) bool) { isTerminal = f }(isTerminal)
	var buf bytes.Buffer
	if p := newProgress(&buf, 1<<30, true); p.bar != nil {
		t.Errorf("a bar on a buffer that is not a terminal")
	}
	isTerminal = func(io.Writer) bool { return true }
	if p := newProgress(&buf, progressRows-1, false); p.bar != nil {
		t.Errorf("a bar for a short file")
	}
	p := newProgress(&buf, 2*progressRows, false)
	if p.bar == nil {
		t.Fatal("no bar for a long file on a terminal")
	}
	p.set(progressRows)
	p.finish()
	if !strings.Contains(buf.String(), "pisets: reducing") || !strings.Contains(buf.String(), "50%") {
		t.Errorf("bar drawn as %q", buf.String())
	}
}

// TestReduceAngleOfChannel: binding a channel to a variable applies the
// angle rule of units.ConvertUnits. A speed logged in Hz is refused for a
// variable declared rad/s, with the fixes named; the same speed logged
// as (Hz)*rev is read; and a variable declared rev/s takes the rpm
// channel's value in revolutions, so its groups are ψ_p and φ themselves.
// By hand for the first pump-loop row: n = 1450 rpm = 24.1667 rev/s,
// ψ_p = Δp/(ρ·n²·D²) = 36·6894.757/(998.2·24.1667²·0.25²) = 6.8115, and
// φ = Q/(n·D³) = (180/3600)/(24.1667·0.25³) = 0.13241
// (1 psi = 6894.757 Pa, NIST SP 811).
func TestReduceAngleOfChannel(t *testing.T) {
	dir := t.TempDir()
	hz := filepath.Join(dir, "hz.csv")
	if err := os.WriteFile(hz, []byte("Q [m3/s],n [Hz],D [m]\n0.05,24,0.25\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	revHz := filepath.Join(dir, "revhz.csv")
	if err := os.WriteFile(revHz, []byte("Q [m3/s],n [(Hz)*rev],D [m]\n0.05,24,0.25\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	var out, errb bytes.Buffer
	code := run([]string{"-data", hz, "Q=m^3/s", "n=rad/s", "D=m"}, &out, &errb)
	if code != 2 || !strings.Contains(errb.String(), "(Hz)*rev") || !strings.Contains(errb.String(), "n=Hz") {
		t.Errorf("Hz channel into a rad/s variable: exit %d, %q; want 2 naming (Hz)*rev and n=Hz", code, errb.String())
	}
	for _, c := range []struct {
		file, unit string
		want       float64 // Q/(n·D³) with n in the variable's measure
	}{
		{revHz, "rad/s", 0.05 / (24 * 2 * math.Pi * 0.25 * 0.25 * 0.25)},
		{hz, "Hz", 0.05 / (24 * 0.25 * 0.25 * 0.25)},
	} {
		out.Reset()
		errb.Reset()
		if code := run([]string{"-data", c.file, "Q=m^3/s", "n=" + c.unit, "D=m"}, &out, &errb); code != 0 {
			t.Fatalf("%s as %s: exit %d: %s", c.file, c.unit, code, errb.String())
		}
		lines := table(out.String())
		if got, _ := strconv.ParseFloat(lines[1], 64); math.Abs(got/c.want-1) > 1e-12 {
			t.Errorf("%s as %s: Q/(n·D³) = %v, want %v", c.file, c.unit, got, c.want)
		}
	}
	args := slices.Clone(pumpArgs)
	args[slices.Index(args, "n=rad/s")] = "n=rev/s"
	out.Reset()
	errb.Reset()
	if code := run(args, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	for _, want := range []string{"(ψ_p)", "(φ)"} {
		if !strings.Contains(errb.String(), want) {
			t.Errorf("n in rev/s: summary lacks %q:\n%s", want, errb.String())
		}
	}
	if strings.Contains(errb.String(), "4π²") || strings.Contains(errb.String(), "2π)") {
		t.Errorf("n in rev/s: a 2π factor in the labels:\n%s", errb.String())
	}
	f := strings.Split(table(out.String())[1], ",")
	n := 1450.0 / 60
	psi, _ := strconv.ParseFloat(f[0], 64)
	phi, _ := strconv.ParseFloat(f[1], 64)
	if want := 36 * 6894.757293168361 / (998.2 * n * n * 0.0625); math.Abs(psi/want-1) > 1e-9 {
		t.Errorf("ψ_p = %v, want %v", psi, want)
	}
	if want := 0.05 / (n * 0.015625); math.Abs(phi/want-1) > 1e-12 {
		t.Errorf("φ = %v, want %v", phi, want)
	}
}

// TestReduceExport reduces an invented export as a data system writes it
// (';' delimiter, decimal commas, a units row, timestamps, a run tag):
// the text column is no variable and does not stop the reduction.
// By hand: Q/(n·D³) = 0.05/(24·0.25³) = 0.05/0.375 = 0.133333.
func TestReduceExport(t *testing.T) {
	path := filepath.Join(t.TempDir(), "export.csv")
	const export = "# invented data\nZeit;Q;n;Run tag\n;[m3/s];[Hz];\n2026-03-04 10:00:00;0,05;24;run 1\n"
	if err := os.WriteFile(path, []byte(export), 0o644); err != nil {
		t.Fatal(err)
	}
	var out, errb bytes.Buffer
	if code := run([]string{"-data", path, "-derive", "D = 0.25 {m}", "Q=m^3/s", "n=Hz", "D=m"}, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	lines := table(out.String())
	if got, _ := strconv.ParseFloat(lines[1], 64); math.Abs(got/(0.05/0.375)-1) > 1e-12 {
		t.Errorf("Q/(n·D³) = %v (%q), want 0.133333", got, lines[1])
	}
}

// table returns the lines of a channel file written by the command, its
// comment lines (the group definitions) left out: the header row, then
// one line per data row.
func table(s string) []string {
	var out []string
	for _, l := range strings.Split(strings.TrimSpace(s), "\n") {
		if !strings.HasPrefix(l, "#") {
			out = append(out, l)
		}
	}
	return out
}

// TestFitCollinearTank: one model towed at five speeds in the invented
// tank log, L, ρ and g given as constants: 1/Re and 1/Fr² follow V alone,
// so the fit refuses with the two groups named and what separates them
// (exit 1, bad data for a fit), not with a coefficient out of range.
func TestFitCollinearTank(t *testing.T) {
	args := []string{"-data", "testdata/tankrun.csv", "-fluids",
		"-derive", "L = 4.0 {m}; rho = 999.1 {kg/m^3}; nu = nu_water(T_w); g = 9.80665 {m/s^2}",
		"-dep", "R_T", "-fit", "R_T=N", "V=m/s", "L=m", "rho=kg/m^3", "nu=m^2/s", "g=m/s^2"}
	var out, errb bytes.Buffer
	code := run(args, &out, &errb)
	msg := errb.String()
	if code != 1 {
		t.Fatalf("exit %d, want 1: %s", code, msg)
	}
	for _, want := range []string{"-fit: pigroups: fit: collinear groups: Π₂ and Π₃ vary together", "Π₃ ∝ Π₂^1.99", "varying V moves them together; vary L, nu or g as well"} {
		if !strings.Contains(msg, want) {
			t.Errorf("standard error lacks %q:\n%s", want, msg)
		}
	}
	if strings.Contains(msg, "span too wide") {
		t.Errorf("the old reason is given:\n%s", msg)
	}
}

// TestReduceGaugeDifference: the pump loop's suction and discharge
// pressures are gauge readings against the one test-cell ambient, so
// dp = P2 − P1 does not depend on it and needs no -baro: the groups are
// those read with -baro 1002hPa, to rounding, and standard error says why
// no reference was needed and that dp is a pressure difference. By hand
// for the first row: dp = (38 − 2) psi = 36·6894.757 Pa, whatever the
// ambient. A gauge channel used alone (as a variable, or in a derived
// channel that moves with the ambient) still needs -baro.
func TestReduceGaugeDifference(t *testing.T) {
	noBaro := slices.Clone(pumpArgs)
	i := slices.Index(noBaro, "-baro")
	noBaro = slices.Delete(noBaro, i, i+2)
	var out, errb, ref, referr bytes.Buffer
	if code := run(noBaro, &out, &errb); code != 0 {
		t.Fatalf("without -baro: exit %d: %s", code, errb.String())
	}
	if code := run(pumpArgs, &ref, &referr); code != 0 {
		t.Fatalf("with -baro: exit %d: %s", code, referr.String())
	}
	got, want := table(out.String()), table(ref.String())
	if len(got) != len(want) {
		t.Fatalf("%d rows without -baro, %d with", len(got), len(want))
	}
	for r := range got {
		g, w := strings.Split(got[r], ","), strings.Split(want[r], ",")
		for k := range g {
			a, _ := strconv.ParseFloat(g[k], 64)
			b, _ := strconv.ParseFloat(w[k], 64)
			if !(math.Abs(a-b) <= 1e-9*math.Abs(b)) && !(math.IsNaN(a) && math.IsNaN(b)) {
				t.Errorf("row %d group %d: %v without -baro, %v with", r+1, k+1, a, b)
			}
		}
	}
	n := 1450.0 / 60 * 2 * math.Pi
	if psi, _ := strconv.ParseFloat(strings.Split(got[1], ",")[0], 64); math.Abs(psi/(36*6894.757293168361/(998.2*n*n*0.0625))-1) > 1e-9 {
		t.Errorf("first row: Π₁ = %v", psi)
	}
	for _, want := range []string{"gauge channels P1, P2 enter only dp, in which the ambient pressure cancels", "read without -baro", "a pressure difference"} {
		if !strings.Contains(errb.String(), want) {
			t.Errorf("standard error lacks %q:\n%s", want, errb.String())
		}
	}
	if strings.Contains(errb.String(), "read as absolute with the reference") {
		t.Errorf("a reference is claimed:\n%s", errb.String())
	}
	for _, c := range []struct {
		derive, dep, says string
	}{
		{"D = 0.25 {m}; rho = 998.2 {kg/m^3}", "P2", "variable P2 is the gauge channel itself"},
		{"dp = P2 - 0.5*P1; D = 0.25 {m}; rho = 998.2 {kg/m^3}", "dp", "the derived dp changes with the ambient pressure"},
	} {
		errb.Reset()
		args := []string{"-data", "testdata/pumploop.csv", "-derive", c.derive, "-dep", c.dep, "-repeat", "n,D,rho", c.dep + "=Pa", "Q=m^3/s", "n=rad/s", "D=m", "rho=kg/m^3"}
		if code := run(args, &bytes.Buffer{}, &errb); code != 2 || !strings.Contains(errb.String(), "give -baro") || !strings.Contains(errb.String(), c.says) {
			t.Errorf("%s: exit %d, %q; want 2, give -baro, %q", c.derive, code, errb.String(), c.says)
		}
	}
}
