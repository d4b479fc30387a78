package reduction_test

import (
	"bufio"
	"bytes"
	"errors"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"similis.dev/similis/quantity"
	"similis.dev/similis/similarity/fluids"
	"similis.dev/similis/similarity/reduction"
	"similis.dev/similis/units/chanfile"
	"similis.dev/similis/units/steady"
)

func carriageSpec(t testing.TB) *reduction.Spec {
	return &reduction.Spec{
		Derive: "rho = rho_water(T_w); nu = nu_water(T_w); L = 2 {m}",
		Funcs:  fluids.FormulaFuncs(),
		Points: reduction.Runs("run", 200, 0),
		Zero:   ptr(reduction.Spans("t", steady.Span{From: quantity.New(0.5, quantity.Time), To: quantity.New(2.0, quantity.Time)})),
		Tare:   []string{"F"},
		Also:   []string{"T_w"},
		Set:    dragSet(t),
	}
}

// readColumns reads the carriage file's columns as plain numbers, with
// strconv, independently of the library.
func readColumns(t *testing.T, path string) map[string][]float64 {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	names := []string{"t", "run", "V", "F", "T_w"}
	out := map[string][]float64{}
	header := false
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") {
			continue
		}
		if !header {
			header = true
			continue
		}
		for k, fld := range strings.Split(line, ",") {
			x, err := strconv.ParseFloat(fld, 64)
			if err != nil {
				t.Fatal(err)
			}
			out[names[k]] = append(out[names[k]], x)
		}
	}
	return out
}

// meanU is the test's own statement of a window's mean and standard
// uncertainty of the mean: s/√n_eff, n_eff = n/(1 + 2 Σ_{k=1}^{K} (1 −
// k/n) ρ_k), ρ_k = c_k/c_0, the sum stopped before the first ρ_k ≤ 0.
func meanU(x []float64) (mean, u float64) {
	n := float64(len(x))
	for _, v := range x {
		mean += v
	}
	mean /= n
	var c0 float64
	for _, v := range x {
		c0 += (v - mean) * (v - mean)
	}
	s := math.Sqrt(c0 / (n - 1))
	sum := 0.0
	for k := 1; k < len(x)/2; k++ {
		ck := 0.0
		for i := 0; i+k < len(x); i++ {
			ck += (x[i] - mean) * (x[i+k] - mean)
		}
		rho := ck / c0
		if rho <= 0 {
			break
		}
		sum += (1 - float64(k)/n) * rho
	}
	neff := n / (1 + 2*sum)
	return mean, s / math.Sqrt(neff)
}

// TestCarriage reduces the invented carriage log end to end: three runs
// tared by the zero window, each mean and uncertainty checked against the
// test's own computation over the same rows.
func TestCarriage(t *testing.T) {
	res, err := carriageSpec(t).Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	raw := readColumns(t, "testdata/carriage.csv")
	if len(res.Points) != 3 {
		t.Fatalf("%d points, want 3", len(res.Points))
	}
	// The zero: rows of 0.5 s ≤ t ≤ 2.0 s, rows 100 … 400 (301 samples).
	if res.Zero.Window != (steady.Window{Start: 100, End: 401}) {
		t.Errorf("zero window %v, want [100, 401)", res.Zero.Window)
	}
	zF, zU := meanU(raw["F"][100:401])
	for i, p := range res.Points {
		w := p.Window
		// Each run spans its label's rows: 2.5 s at 200 Hz, 500 rows
		// from 4.0 s, 7.5 s, 11.0 s (rows 800, 1500, 2200).
		if start := []int{800, 1500, 2200}[i]; w.Start != start || w.Len() != 500 {
			t.Errorf("%s: window %v, want [%d, %d)", p.Tag, w, start, start+500)
		}
		vm, vu := meanU(raw["V"][w.Start:w.End])
		fm, fu := meanU(raw["F"][w.Start:w.End])
		tm, _ := meanU(raw["T_w"][w.Start:w.End])
		v, _ := p.Value("V")
		f, _ := p.Value("F")
		check(t, p.Tag+" V", v.Mean.Value(), vm, 1e-12)
		check(t, p.Tag+" u(V)", v.Mean.U().Value(), vu, 1e-9)
		check(t, p.Tag+" F tared", f.Mean.Value(), fm-zF, 1e-12)
		check(t, p.Tag+" u(F)", f.Mean.U().Value(), math.Hypot(fu, zU), 1e-9)
		// The generator's levels lie within 4 standard uncertainties.
		if lv := fxRuns[i].v; math.Abs(vm-lv) > 4*vu {
			t.Errorf("%s: V %g far from its level %g (u %g)", p.Tag, vm, lv, vu)
		}
		if ln := fxRuns[i].net; math.Abs(fm-zF-ln) > 4*math.Hypot(fu, zU) {
			t.Errorf("%s: F %g far from its level %g", p.Tag, fm-zF, ln)
		}
		// The groups from the point's means: ρ at the mean temperature
		// (18 °C, 998.6 kg/m³ from memory; the derived channel's mean).
		rho, _ := p.Value("rho")
		if math.Abs(rho.Mean.Value()-998.6) > 0.05 {
			t.Errorf("%s: ρ = %g at %g °C", p.Tag, rho.Mean.Value(), tm)
		}
		want := (fm - zF) / (rho.Mean.Value() * vm * vm * fxHullL * fxHullL)
		check(t, p.Tag+" Π₁", p.Groups[0].Value(), want, 1e-12)
		rel := math.Hypot(math.Hypot(fu, zU)/(fm-zF), 2*vu/vm)
		check(t, p.Tag+" u(Π₁)", p.Groups[0].U().Value(), want*math.Hypot(rel, rho.Mean.Rel()), 1e-6)
	}
}

func check(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Abs(want) || math.IsNaN(got) {
		t.Errorf("%s = %.10g, want %.10g", what, got, want)
	}
}

// TestDetectedAndSpans finds the same runs by the moving-window
// criterion, and by time spans.
func TestDetectedAndSpans(t *testing.T) {
	spec := carriageSpec(t)
	spec.Points = reduction.Detected(reduction.Criterion{Half: 20, MinLen: 200, Channels: []reduction.Tolerance{
		{Channel: "V", SD: quantity.New(0.005, quantity.Velocity), Change: quantity.New(0.003, quantity.Velocity)},
	}})
	res, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	// The zero span itself is steady too (the carriage at rest), so
	// four points: at rest, then the three runs, each inside its run.
	if len(res.Points) != 4 {
		t.Fatalf("%d detected points, want 4", len(res.Points))
	}
	for i, p := range res.Points[1:] {
		lo, hi := []int{800, 1500, 2200}[i], []int{1300, 2000, 2700}[i]
		if p.Window.Start < lo || p.Window.End > hi {
			t.Errorf("%s: %v outside run %d's rows [%d, %d)", p.Tag, p.Window, i+1, lo, hi)
		}
	}
	spec.Points = reduction.Spans("t", steady.Span{From: quantity.New(4.5, quantity.Time), To: quantity.New(6, quantity.Time)})
	if res, err = spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{})); err != nil {
		t.Fatal(err)
	}
	if w := res.Points[0].Window; w != (steady.Window{Start: 900, End: 1201}) {
		t.Errorf("span window %v, want [900, 1201)", w)
	}
}

// TestAllRows gives each row its groups, as the row-by-row harness does.
func TestAllRows(t *testing.T) {
	spec := carriageSpec(t)
	spec.Points, spec.Zero, spec.Tare = reduction.AllRows(), nil, nil
	// The rows of the runs only: at rest V is 0 and F/(ρV²L²) is not
	// defined, an error with its line.
	raw := readColumns(t, "testdata/carriage.csv")
	if _, err := spec.Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{})); !errors.Is(err, quantity.ErrRange) {
		t.Errorf("at rest: err = %v, want ErrRange", err)
	}
	cols := []chanfile.Column{{Name: "V", Unit: mustUnit(t, "m/s")}, {Name: "F", Unit: mustUnit(t, "N")}, {Name: "T_w", Unit: mustUnit(t, "°C")}}
	var v, f, tw []float64
	for k, r := range raw["run"] {
		if r != 0 {
			v, f, tw = append(v, raw["V"][k]), append(f, raw["F"][k]), append(tw, raw["T_w"][k]+273.15)
		}
	}
	src, err := chanfile.NewSeriesSource(cols, []quantity.Series{quantity.NewSeries(v, quantity.Velocity), quantity.NewSeries(f, quantity.Force), quantity.NewSeries(tw, quantity.Temperature)})
	if err != nil {
		t.Fatal(err)
	}
	spec.Also = nil
	res, err := spec.Reduce(reduction.Input{Name: "runs", Source: src})
	if err != nil {
		t.Fatal(err)
	}
	if res.Rows != 1500 || res.RowGroups[0].Len() != 1500 {
		t.Fatalf("%d rows, %d groups rows; want 1500", res.Rows, res.RowGroups[0].Len())
	}
	// Row 100 of the runs: Re = V·L/ν with ν = nu_water(T_w).
	k := 100
	re := res.RowGroups[1].Values()[k]
	nu := v[k] * fxHullL / re
	if nu < 1.04e-6 || nu > 1.07e-6 { // ν of water at 18 °C ≈ 1.053e-6 m²/s, from memory
		t.Errorf("row %d: Re %g gives ν = %g", k, re, nu)
	}
}

// TestSaveRoundTrip writes the points as CSV with a byte-order mark and
// reads them back: the columns with chanfile, the group definitions
// with ReadDefinitions.
func TestSaveRoundTrip(t *testing.T) {
	res, err := carriageSpec(t).Reduce(reduction.File("testdata/carriage.csv", reduction.FileOptions{}))
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "points.csv")
	if err := reduction.SavePoints(path, res, reduction.WriteOptions{BOM: true, Notes: []string{"invented data"}}); err != nil {
		t.Fatal(err)
	}
	b, _ := os.ReadFile(path)
	if !bytes.HasPrefix(b, []byte("\ufeff# invented data\n")) {
		t.Errorf("file starts %q", b[:min(40, len(b))])
	}
	defs, err := reduction.ReadDefinitions(bytes.NewReader(b), path)
	if err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(res.Groups, defs); diff != "" {
		t.Errorf("definitions read back (-wrote +read):\n%s", diff)
	}
	rd, err := chanfile.NewReader(bytes.NewReader(b), path, chanfile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	cols, n, err := rd.Read(nil, 0)
	if err != nil || n != 3 {
		t.Fatalf("read %d rows: %v", n, err)
	}
	byName := map[string]int{}
	for i, c := range rd.Columns() {
		byName[c.Name] = i
	}
	for _, name := range []string{"point", "V", "u(V)", "n_eff(V)", "F", "u(F)", "Re", "u(Re)", "u(Π₁)"} {
		if _, ok := byName[name]; !ok {
			t.Errorf("no column %q in %v", name, rd.Columns())
		}
	}
	for i, p := range res.Points {
		if got := cols[byName["u(Re)"]].Values()[i]; got != p.Groups[1].U().Value() {
			t.Errorf("%s: u(Re) read back %v, want %v", p.Tag, got, p.Groups[1].U().Value())
		}
		v, _ := p.Value("T_w")
		if got := cols[byName["T_w"]].Values()[i]; math.Abs(got-v.Mean.Value()) > 1e-9 {
			t.Errorf("%s: T_w read back %v K, want %v K", p.Tag, got, v.Mean.Value())
		}
	}
}

// TestWriteFileAtomic: a write failing half-way leaves the previous
// file as it was and no temporary file behind.
func TestWriteFileAtomic(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.csv")
	os.WriteFile(path, []byte("previous\n"), 0o644)
	boom := errors.New("disk full")
	err := reduction.WriteFile(path, func(w io.Writer) error {
		io.WriteString(w, "half a file")
		return boom
	})
	if !errors.Is(err, boom) {
		t.Errorf("err = %v, want the cause kept", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "previous\n" {
		t.Errorf("file now %q", b)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("%d entries left in the directory, want 1", len(ents))
	}
	if err := reduction.WriteFile(path, func(w io.Writer) error { _, err := io.WriteString(w, "new\n"); return err }); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(path); string(b) != "new\n" {
		t.Errorf("file now %q", b)
	}
}

// TestCampaignOrder reduces copies of the log, one damaged, on several
// workers: the outcomes come in input order and equal the serial ones.
func TestCampaignOrder(t *testing.T) {
	dir := t.TempDir()
	var ins []reduction.Input
	for i := range 7 {
		b := carriageCSV(uint64(i+1), fxRows)
		if i == 4 {
			b = bytes.Replace(b, []byte("\n2.000,0,"), []byte("\n2.000,0,x"), 1)
		}
		p := filepath.Join(dir, "run"+strconv.Itoa(i)+".csv")
		os.WriteFile(p, b, 0o644)
		ins = append(ins, reduction.File(p, reduction.FileOptions{}))
	}
	spec := carriageSpec(t)
	par := spec.Campaign(ins, 4)
	for i, in := range ins {
		r, err := spec.Reduce(in)
		o := par[i]
		if (err == nil) != (o.Err == nil) {
			t.Fatalf("file %d: serial err %v, campaign err %v", i, err, o.Err)
		}
		if err != nil {
			var e *reduction.Error
			if i != 4 || !errors.As(o.Err, &e) || e.Line != 404 || !errors.Is(o.Err, quantity.ErrParse) {
				t.Errorf("file %d: %v (want line 404, ErrParse)", i, o.Err)
			}
			continue
		}
		if o.Result.File != in.Name || o.Result.Points[2].Groups[0].Value() != r.Points[2].Groups[0].Value() {
			t.Errorf("file %d: campaign result differs from the serial one", i)
		}
	}
}
