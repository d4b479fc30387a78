package main

import (
	"bytes"
	"fmt"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/plot"
	"similis.dev/similis/examples/internal/cli"
	"similis.dev/similis/examples/internal/plotstyle"
)

// TestRepeatFindsGroupsByWhatTheyAre: the report finds Eu, Re and L/d by
// their exponents, so the same set written in another order gives the
// same numbers; a set whose groups it cannot label (mu,V,d gives
// dp·d/(mu·V), not Eu) is refused with the sets that work, never printed
// as Re = 0.
func TestRepeatFindsGroupsByWhatTheyAre(t *testing.T) {
	dir := t.TempDir()
	a, err := evaluate(io.Discard, []string{"-out", dir})
	if err != nil {
		t.Fatal(err)
	}
	b, err := evaluate(io.Discard, []string{"-out", dir, "-repeat", "d,rho,V"})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(a.Groups, b.Groups) || a.Fit.C != b.Fit.C {
		t.Errorf("rho,V,d and d,rho,V differ: %v / %v", a.Groups[0], b.Groups[0])
	}
	var out bytes.Buffer
	_, err = evaluate(&out, []string{"-out", dir, "-repeat", "mu,V,d"})
	if err == nil || cli.ExitCode(io.Discard, "restrictor", err) != 2 || !strings.Contains(err.Error(), "sets that do: rho,V,d") {
		t.Errorf("-repeat mu,V,d: %v (exit %d)", err, cli.ExitCode(io.Discard, "restrictor", err))
	}
	if strings.Contains(out.String(), "Re = 0") {
		t.Errorf("printed Re = 0:\n%s", out.String())
	}
}

// TestDarcyFrictionFactor: the friction factor printed is Darcy's,
// f_D = 2·Eu/(L/d) from Δp = f_D·(L/d)·ρV²/2 (Darcy–Weisbach), at the
// mid-range point Re = round(√(Re_min·Re_max)), L/d = 4; by hand from the
// fitted law: f_D = 2·C·Re^a·4^b/4.
func TestDarcyFrictionFactor(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	f := r.Fit
	re := math.Round(math.Sqrt(f.Ranges[0][0] * f.Ranges[0][1]))
	want := 2 * f.C * math.Pow(re, f.Exponents[0]) * math.Pow(4, f.Exponents[1]) / 4
	if math.Abs(r.DarcyMid/want-1) > 1e-12 {
		t.Errorf("f_D = %v, by hand %v", r.DarcyMid, want)
	}
	line := fmt.Sprintf("apparent Darcy friction factor there f_D = 2·Eu/(L/d) = %.4f", want)
	if !strings.Contains(out.String(), line) || !strings.Contains(out.String(), "the Fanning factor is f_D/4") {
		t.Errorf("output lacks %q:\n%s", line, out.String())
	}
}

// TestFitStatisticsStated: the fit says how many effective rows its
// intervals use, what its lack-of-fit test found, and that Eu and Re
// share ρ and V.
func TestFitStatisticsStated(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-out", t.TempDir()}); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"n_eff = n(1 − r₁)/(1 + r₁)", "runs test on the residuals' signs", "WARNING: Eu and Re share rho, V", "spurious correlation"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q", want)
		}
	}
}

// TestPlotReadable: labelled ticks on both axes (Re spans less than a
// decade), a different marker shape for each L/d, every point inside the
// axes, and a PNG of the asked size: 5 in × 3 in at 100 dpi is 500 × 300
// pixels.
func TestPlotReadable(t *testing.T) {
	dir := t.TempDir()
	r, err := evaluate(io.Discard, []string{"-out", dir, "-width", "5", "-height", "3", "-dpi", "100"})
	if err != nil {
		t.Fatal(err)
	}
	f, err := os.Open(r.PNG)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	if cfg, err := png.DecodeConfig(f); err != nil || cfg.Width != 500 || cfg.Height != 300 {
		t.Errorf("PNG %d × %d, %v; want 500 × 300", cfg.Width, cfg.Height, err)
	}
	pl, scs, err := buildPlot(r)
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
	shapes := map[string]bool{}
	for _, sc := range scs {
		shapes[fmt.Sprintf("%T", sc.GlyphStyle.Shape)] = true
		for _, p := range sc.XYs {
			if !(p.X > pl.X.Min && p.X < pl.X.Max && p.Y > pl.Y.Min && p.Y < pl.Y.Max) {
				t.Errorf("point %v on or outside the axes", p)
			}
		}
	}
	if len(scs) != 3 || len(shapes) != 3 {
		t.Errorf("%d series with %d marker shapes, want 3 and 3", len(scs), len(shapes))
	}
	if _, ok := pl.X.Label.TextStyle.Handler.(plotstyle.Subscripts); !ok {
		t.Errorf("x label drawn by %T", pl.X.Label.TextStyle.Handler)
	}
}

// TestUsageErrors: usage mistakes are exit 2 with the user's text echoed
// bounded and escaped.
func TestUsageErrors(t *testing.T) {
	dir := t.TempDir()
	for _, args := range [][]string{
		{"-dpi", "NaN"}, {"-width", "1e9"}, {"-repeat", strings.Repeat("x", 100_000)},
		{"-\x1b[2J"}, {"-out", dir, "extra"}, {"-out", filepath.Join(dir, "none")},
	} {
		err := run(io.Discard, args)
		if err == nil || cli.ExitCode(io.Discard, "restrictor", err) != 2 {
			t.Errorf("%.30q: %v, exit %d; want a usage error", args, err, cli.ExitCode(io.Discard, "restrictor", err))
			continue
		}
		if msg := err.Error(); len(msg) > 1000 || strings.Contains(msg, "\x1b") {
			t.Errorf("%.30q: message of %d bytes: %.100q", args, len(msg), msg)
		}
	}
}

// FuzzRun runs the command on fuzzed flags, its outputs in a temporary
// directory: it never panics.
func FuzzRun(f *testing.F) {
	for _, s := range []string{"-repeat rho,V,d", "-repeat mu,V,d -dpi 72", "-width 2 -height 40", "-h", "-repeat ,,,", "-dpi 1e400"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, line string) {
		args := append(strings.Fields(line), "-out", t.TempDir())
		_ = run(io.Discard, args)
	})
}
