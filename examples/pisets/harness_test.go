package main

import (
	"bytes"
	"fmt"
	"image/png"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"gonum.org/v1/plot"

	"similis.dev/similis/examples/internal/plotstyle"
)

// TestDataErrorNamesFileLine: a row whose group overflows (x/b =
// 1e300/1e-300) is reported at its line in the file, counted with the
// comments, the blank lines and the header, even past the first 4096-row
// chunk: two comment lines, the header on line 3, a blank line after the
// header, then data rows from line 5; data row 4100 is on line 4104.
func TestDataErrorNamesFileLine(t *testing.T) {
	dir := t.TempDir()
	var b strings.Builder
	b.WriteString("# invented\n# rows\nx [m],b [m]\n\n")
	for i := 1; i <= 4100; i++ {
		if i == 4100 {
			b.WriteString("1e300,1e-300\n")
			continue
		}
		fmt.Fprintf(&b, "%d,1\n", i)
	}
	path := filepath.Join(dir, "long.csv")
	if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	var errb bytes.Buffer
	code := run([]string{"-data", path, "x=m", "b=m"}, io.Discard, &errb)
	if want := path + ":4104:"; code != 1 || !strings.Contains(errb.String(), want) {
		t.Errorf("exit %d, %q; want 1 naming %s", code, errb.String(), want)
	}
}

// TestNonFiniteDerivedValue: x = a·a/b is 0/0 in a row where both
// channels are present (line 5: comment, header, two rows before it);
// it is an error naming that line, or with -nonfinite=missing a counted
// missing value and a NaN group field. A missing channel value is not
// such a row.
func TestNonFiniteDerivedValue(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "zero.csv")
	if err := os.WriteFile(path, []byte("# invented\na [m],b [m]\n1,2\n2,\n0,0\n3,4\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	args := []string{"-data", path, "-derive", "x = a*a/b", "-dep", "x", "x=m", "b=m"}
	var out, errb bytes.Buffer
	if code := run(args, &out, &errb); code != 1 || !strings.Contains(errb.String(), path+":5:") || !strings.Contains(errb.String(), "-nonfinite=missing") {
		t.Errorf("0/0: exit %d, %q; want 1 naming line 5", code, errb.String())
	}
	out.Reset()
	errb.Reset()
	if code := run(append([]string{"-nonfinite=missing"}, args...), &out, &errb); code != 0 {
		t.Fatalf("-nonfinite=missing: exit %d: %s", code, errb.String())
	}
	// x/b by hand: 1·1/2/2 = 0.25; missing; 0/0 missing; 3·3/4/4 = 0.5625.
	if got := strings.Join(table(out.String()), "\n"); got != "Π₁ [1]\n0.25\nNaN\nNaN\n0.5625" {
		t.Errorf("groups %q", got)
	}
	if !strings.Contains(errb.String(), "derived x: 1 non-finite value counted as missing") {
		t.Errorf("summary lacks the count:\n%s", errb.String())
	}
	if code := run(append([]string{"-nonfinite=skip"}, args...), io.Discard, &errb); code != 2 {
		t.Errorf("-nonfinite=skip: exit %d", code)
	}
}

// TestFitReportsCorrelationAndLackOfFit: -fit states the effective
// number of rows it used, the runs test, and warns that ψ_p and φ share
// n and D (both groups hold the speed and the diameter).
func TestFitReportsCorrelationAndLackOfFit(t *testing.T) {
	var errb bytes.Buffer
	if code := run(append([]string{"-fit"}, pumpArgs...), io.Discard, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	for _, want := range []string{"n_eff = n(1 − r₁)/(1 + r₁)", "runs test", "WARNING: Π₁ and Π₂ share n, D", "spurious correlation"} {
		if !strings.Contains(errb.String(), want) {
			t.Errorf("fit report lacks %q:\n%s", want, errb.String())
		}
	}
}

// TestPlotReadable: the fit plot labels both axes with at least two
// ticks each (the pump loop's groups span less than a decade), gives the
// rows a marker, keeps every point inside the padded axes, writes the
// subscript of ψ_p as a subscript, and a PNG has the asked size: 5 in ×
// 3 in at 100 dpi is 500 × 300 pixels.
func TestPlotReadable(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "fit.png")
	args := append([]string{"-fit", "-plot", path, "-plot-width", "5", "-plot-height", "3", "-dpi", "100"}, pumpArgs...)
	args[len(args)-3] = "n=rev/s" // ψ_p itself: the label has a subscript
	var errb bytes.Buffer
	if code := run(args, io.Discard, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	cfg, err := png.DecodeConfig(f)
	if err != nil || cfg.Width != 500 || cfg.Height != 300 {
		t.Errorf("PNG %d × %d, %v; want 500 × 300", cfg.Width, cfg.Height, err)
	}
	// The same plot, built in memory.
	r, err := build(args[len(args)-5:], "dp", "n,D,rho", false)
	if err != nil {
		t.Fatal(err)
	}
	fr := &fitRows{y: []float64{6.8, 6.5, 6.1, 5.0}, x: [][]float64{{0.13, 0.12, 0.10, 0.06}}}
	gs := r.set.Groups()
	law, err := reportFit(fr, gs, io.Discard)
	if err != nil {
		t.Fatal(err)
	}
	pl, err := buildPlot(fr, law, gs, "loop.csv")
	if err != nil {
		t.Fatal(err)
	}
	for name, ax := range map[string]*plot.Axis{"x": &pl.X, "y": &pl.Y} {
		n := 0
		for _, tk := range ax.Tick.Marker.Ticks(ax.Min, ax.Max) {
			if tk.Label != "" {
				n++
			}
		}
		if n < 2 {
			t.Errorf("%s axis: %d labelled ticks over %g … %g", name, n, ax.Min, ax.Max)
		}
	}
	for i := range fr.y {
		x, y := fr.x[0][i], fr.y[i]
		if !(x > pl.X.Min && x < pl.X.Max && y > pl.Y.Min && y < pl.Y.Max) {
			t.Errorf("point (%g, %g) on or outside the axes %g … %g, %g … %g", x, y, pl.X.Min, pl.X.Max, pl.Y.Min, pl.Y.Max)
		}
	}
	if !strings.Contains(pl.Y.Label.Text, "ψ_p") {
		t.Fatalf("y label %q", pl.Y.Label.Text)
	}
	h, ok := pl.Y.Label.TextStyle.Handler.(plotstyle.Subscripts)
	if !ok {
		t.Fatalf("y label drawn by %T, which prints the underscore", pl.Y.Label.TextStyle.Handler)
	}
	segs := plotstyle.Segments("ψ_p/(4π²)", h.BracedOnly)
	want := []plotstyle.Segment{{Text: "ψ"}, {Text: "p", Sub: true}, {Text: "/(4π²)"}}
	if !cmp.Equal(segs, want) {
		t.Errorf("segments of ψ_p/(4π²): %+v, want %+v", segs, want)
	}
}

// TestHelpSaysWhatAndOutputs: -h says what the command does and lists
// every output format and input kind, on standard output, exit 0.
func TestHelpSaysWhatAndOutputs(t *testing.T) {
	var out bytes.Buffer
	if code := run([]string{"-h"}, &out, io.Discard); code != 0 {
		t.Fatalf("-h: exit %d", code)
	}
	for _, want := range []string{"finds the Buckingham Pi groups", "csv", "jsonl", "json", "text", "parquet",
		"CSV", "TSV", "Parquet", "derived", "-nonfinite", "-plot-width", "-dpi", "Exit status", "n_eff"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("help lacks %q", want)
		}
	}
}

// TestEchoBoundedAndEscaped: a 100 KB -format value comes back cut to a
// few hundred bytes, and a flag carrying a terminal escape comes back
// escaped; both are usage errors (exit 2) on one line.
func TestEchoBoundedAndEscaped(t *testing.T) {
	for _, args := range [][]string{
		{"-format", strings.Repeat("x", 100_000), "a=m", "b=s"},
		{"-format", strings.Repeat("y", 100_000), "-data", "testdata/pumploop.csv", "Q=m^3/s"},
		{"-\x1b[2J"},
		{"-nonfinite", "\x1b[31mred", "-data", "testdata/pumploop.csv", "Q=m^3/s"},
		{"-dpi", "NaN"},
	} {
		var errb bytes.Buffer
		code := run(args, io.Discard, &errb)
		msg := errb.String()
		if code != 2 || len(msg) > 1000 || strings.Contains(msg, "\x1b") || strings.Count(msg, "\n") != 1 {
			t.Errorf("%.30q: exit %d, %d bytes: %.200q", args, code, len(msg), msg)
		}
	}
}

// FuzzFlags runs the command on fuzzed command lines, file flags
// included (outputs in a temporary directory): it never panics and exits
// 0, 1 or 2.
func FuzzFlags(f *testing.F) {
	for _, s := range []string{
		"-data testdata/pumploop.csv -std-atm -derive dp=P2-P1;D=0.25[m];rho=998[kg/m^3] -dep dp -repeat n,D,rho dp=Pa Q=m^3/s n=rad/s D=m rho=kg/m^3",
		"-fit -plot out.png -data testdata/tankrun.csv V=m/s",
		"-format parquet -out g.parquet -data testdata/tankrun.csv -dep V V=m/s",
		"-dpi 1e9 -plot-width -1", "-sets -format json a=m b=s c=kg", "-nonfinite missing",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, line string) {
		args := confine(strings.Fields(line), t.TempDir())
		switch code := run(args, io.Discard, io.Discard); code {
		case 0, 1, 2:
		default:
			t.Fatalf("exit %d", code)
		}
	})
}

// confine rewrites the file flags of fuzzed arguments: outputs (-out,
// -plot) go into dir, and -data reads only files under testdata.
func confine(args []string, dir string) []string {
	place := func(flag, v string) string {
		switch flag {
		case "out", "plot":
			return filepath.Join(dir, filepath.Base(v))
		case "data":
			return filepath.Join("testdata", filepath.Base(v))
		}
		return v
	}
	for i := 0; i < len(args); i++ {
		a := args[i]
		if !strings.HasPrefix(a, "-") {
			continue
		}
		name, v, eq := strings.Cut(strings.TrimLeft(a, "-"), "=")
		if eq {
			args[i] = a[:len(a)-len(v)] + place(name, v)
		} else if i+1 < len(args) {
			args[i+1] = place(name, args[i+1])
		}
	}
	return args
}

// TestGroupNamedOnStderr: each recognised group's name and definition go
// to standard error with the group, so a pump engineer reading ψ_p sees
// that it is the pressure coefficient Δp/(ρn²D²) of a pump or fan with n
// in rev/s, not the head coefficient 2gH/u²; the definition, with n's
// measure, is printed whether n is held in rad/s or in rev/s.
func TestGroupNamedOnStderr(t *testing.T) {
	for _, c := range []struct {
		n    string
		want []string
	}{
		{"n=rad/s", []string{
			"Π₁ = dp/(n²·D²·rho)  (ψ_p/(4π²))",
			"(pressure coefficient of a pump or fan; ψ_p = Δp/(ρ·n²·D²), n in revolutions per second",
			"(flow coefficient; φ = Q/(n·D³)",
		}},
		{"n=rev/s", []string{
			"Π₁ = dp/(n²·D²·rho)  (ψ_p)",
			"ψ_p (pressure coefficient of a pump or fan; ψ_p = Δp/(ρ·n²·D²), n in revolutions per second",
			"φ (flow coefficient; φ = Q/(n·D³), n in revolutions per second)",
		}},
	} {
		args := []string{"-data", "testdata/pumploop.csv", "-baro", "1002hPa",
			"-derive", "dp = P2 - P1; D = 0.25 {m}; rho = 998.2 {kg/m^3}",
			"-dep", "dp", "-repeat", "n,D,rho", "dp=Pa", "Q=m^3/s", c.n, "D=m", "rho=kg/m^3"}
		var out, errb bytes.Buffer
		if code := run(args, &out, &errb); code != 0 {
			t.Fatalf("%s: exit %d: %s", c.n, code, errb.String())
		}
		for _, want := range c.want {
			if !strings.Contains(errb.String(), want) {
				t.Errorf("%s: standard error lacks %q:\n%s", c.n, want, errb.String())
			}
		}
		if strings.Contains(errb.String(), "fan pressure coefficient") {
			t.Errorf("%s: ψ_p of a pump loop named for fans alone:\n%s", c.n, errb.String())
		}
	}
}

// TestRotationalSpeedLabels: a speed declared with a unit of turns (rpm,
// rev/s, rad/s) is a rotational speed n, so V/(n·D) beside a thrust
// coefficient is the advance coefficient J (J/(2π) with n in rad/s: V/(ω·D)
// = V/(2π·n·D)); one in Hz is a frequency f, and V/(f·D) is 1/St, the
// label naming J for a speed of rotation.
func TestRotationalSpeedLabels(t *testing.T) {
	for _, c := range []struct{ unit, kind, label, not string }{
		{"rpm", "rotational speed", "Π₂ = V/(n·D)   J (advance coefficient; J = V/(n·D), n in revolutions per second", "St"},
		{"rev/s", "rotational speed", "Π₂ = V/(n·D)   J (advance coefficient;", "St"},
		{"rad/s", "rotational speed", "Π₂ = V/(n·D)   J/(2π) (advance coefficient;", "St"},
		{"Hz", "frequency", "Π₂ = V/(n·D)   1/St (Strouhal number; conventional form St; for a propeller's or rotor's speed of rotation (give the frequency the kind rotational speed) the group is read as J", "Π₂ = V/(n·D)   J"},
	} {
		var out, errb bytes.Buffer
		if code := run([]string{"-dep", "T", "-repeat", "rho,n,D", "T=N", "rho=kg/m^3", "n=" + c.unit, "D=m", "V=m/s"}, &out, &errb); code != 0 {
			t.Fatalf("%s: exit %d: %s", c.unit, code, errb.String())
		}
		o := out.String()
		if !strings.Contains(o, c.label) || !strings.Contains(o, c.kind) || strings.Contains(o, c.label[:strings.Index(c.label, "(")]+c.not) {
			t.Errorf("n=%s: want %q and kind %q, not %q:\n%s", c.unit, c.label, c.kind, c.not, o)
		}
	}
}

// TestForceLabels: a plain force over ρV²L² is ∝C_D and, for a hull's
// resistance, ∝C_T, and the label says both; a force of the kind
// resistance is ∝C_T and one of the kind force or drag ∝C_D alone, as the
// towing-tank example (kind resistance) labels it.
func TestForceLabels(t *testing.T) {
	for _, c := range []struct{ spec, label string }{
		{"R=N", "Π₁ = R/(rho·V²·L²)   ∝C_D (∝C_T for a hull's resistance) (proportional to the drag coefficient;"},
		{"R=N@resistance", "Π₁ = R/(rho·V²·L²)   ∝C_T (proportional to the total resistance coefficient;"},
		{"R=N@force", "Π₁ = R/(rho·V²·L²)   ∝C_D (proportional to the drag coefficient;"},
		{"R=N@drag", "Π₁ = R/(rho·V²·L²)   ∝C_D (proportional to the drag coefficient;"},
	} {
		var out, errb bytes.Buffer
		if code := run([]string{"-dep", "R", "-repeat", "rho,V,L", c.spec, "rho=kg/m^3", "V=m/s", "L=m", "nu=m^2/s"}, &out, &errb); code != 0 {
			t.Fatalf("%s: exit %d: %s", c.spec, code, errb.String())
		}
		if !strings.Contains(out.String(), c.label) {
			t.Errorf("%s: want %q:\n%s", c.spec, c.label, out.String())
		}
	}
}
