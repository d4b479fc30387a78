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
	"regexp"
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

// TestReportLines: the printed lines a reader acts on.
//
// The rows: row 3 is 6.0 L/min through the 12 mm restrictor, V =
// (6.0/60000 m³/s)/(π/4·0.006² m²) = 3.5368 m/s, Eu = 26600/(1050·3.5368²)
// = 2.0252, Re = 1050·3.5368·0.006/0.0022 = 10128, L/d = 12/6 = 2; the
// range of Re is 10128·2/6 = 3376 to 10128·8/6 = 13504 and of L/d 2 to 8.
// The exponents' ± is the standard error, said so, with the 95 % interval
// at t = 2.18 for 12 degrees of freedom (t table, 0.975 quantile:
// 2.179). The row's Re = 10128 with u ≈ 210 is quoted as 10130 (u = 210),
// u to two figures and the value to the same place (GUM 7.2.6), and
// ν_eff, some 7·10⁴, as "> 100". The residuals alternate (13 runs against
// 8.5, z = +2.44, r₁ = −0.813): the output says so.
func TestReportLines(t *testing.T) {
	var out bytes.Buffer
	if _, err := evaluate(&out, []string{"-out", t.TempDir()}); err != nil {
		t.Fatal(err)
	}
	s := out.String()
	for _, want := range []string{
		"#   Q L/min  L mm   Δp kPa   V m/s      Eu     Re   L/d  Eu_fit  residual",
		"    3       6.0    12     26.6   3.537  2.0252  10128     2  2.0209   +0.21 %",
		"   14       8.0    48     65.0   4.716  2.7838  13504     8  2.7886   -0.17 %",
		"exponent of Re: -0.0977, standard uncertainty 0.0050 (k = 1); 95 % interval [-0.1086, -0.0867] (±t·u, t = 2.18, 12 degrees of freedom)",
		"CAUTION: the residuals alternate in sign: 13 runs against 8.5 expected (z = +2.44; two-sided, |z| ≥ 1.96 is significant at 5 %), and r₁ = -0.813",
		"Re = 10130 (u = 210), L/d = 2.0000 (u = 0.0090); u: standard uncertainties, k = 1",
		"ν_eff > 100, k = 1.96",
		"the fit at this row: Eu = 2.0209 (u = 0.0099; standard uncertainty, k = 1, from the fit and the inputs)",
		"Note: a correlation is valid only over the range of the data it was fitted to: here Re 3376 … 13504 and L/d 2 … 8.",
	} {
		if !strings.Contains(s, want) {
			t.Errorf("output lacks %q", want)
		}
	}
	if n := len(regexp.MustCompile(`(?m)^ +\d+ +\d\.\d +(12|24|48) +\d+\.\d+ +\d\.\d{3} `).FindAllString(s, -1)); n != 15 {
		t.Errorf("%d row lines, want the 15 rows", n)
	}
	for _, bad := range []string{"69701", "± 0.0050", "10128 ± 210", "2.0209 ± 0.0099"} {
		if strings.Contains(s, bad) {
			t.Errorf("output still has %q", bad)
		}
	}
}

// TestRoundPair: u to two significant figures, the value to the same
// decimal place.
func TestRoundPair(t *testing.T) {
	for _, c := range []struct {
		v, u float64
		a, b string
	}{
		{10128.4, 211.7, "10130", "210"}, {2.02087, 0.00987, "2.0209", "0.0099"}, {2, 0.00904, "2.0000", "0.0090"},
		{0.00434, 0.0526, "0.004", "0.053"}, {5.0, 0.996, "5.0", "1.0"},
	} {
		if a, b := cli.RoundToUncertainty(c.v, c.u, 4); a != c.a || b != c.b {
			t.Errorf("cli.RoundToUncertainty(%v, %v, 4) = %s, %s; want %s, %s", c.v, c.u, a, b, c.a, c.b)
		}
	}
}

// TestReBudgetListsEverySource: the Re of the 6.0 L/min row has its u
// from four independent relative sources, each printed, and their root
// sum of squares is the printed u: Re = 4ρQ/(πμd) = 4·1050·1e-4/
// (π·2.2e-3·6e-3) = 10128, with u/Re = √(2.00² + 0.50² + 0.20² +
// (0.01/6·100)²) % = √(4 + 0.25 + 0.04 + 0.0278) % = 2.078 %, u = 210.5
// (viscosity 2 %, flow meter 0.5 %, density 0.2 %, bore 0.01 mm of
// 6 mm). L/d = 12/6 = 2 with u/(L/d) = √((0.05/12)² + (0.01/6)²) =
// √(0.417² + 0.167²) % = 0.449 %, u = 0.0090 (caliper 0.05 mm of 12 mm). It printed "Re = 10130
// (u = 210)" with no viscosity anywhere, the Eu table's sources giving
// about 0.56 %.
func TestReBudgetListsEverySource(t *testing.T) {
	var out bytes.Buffer
	r, err := evaluate(&out, []string{"-out", t.TempDir()})
	if err != nil {
		t.Fatal(err)
	}
	re := 4 * 1050 * 1e-4 / (math.Pi * 2.2e-3 * 6e-3)
	rel := math.Sqrt(2*2+0.5*0.5+0.2*0.2+math.Pow(100*0.01/6, 2)) / 100
	if math.Abs(re-10128) > 0.5 || math.Abs(re*rel-210.5) > 0.1 {
		t.Fatalf("hand Re %v, u %v", re, re*rel)
	}
	if b := r.Budget.ReBudget; math.Abs(b.Value.Value()/re-1) > 1e-12 || math.Abs(b.U.Value()/(re*rel)-1) > 1e-9 || len(b.Lines) < 4 {
		t.Errorf("Re budget %v ± %v, %d lines; by hand %v ± %v", b.Value, b.U, len(b.Lines), re, re*rel)
	}
	ld := math.Hypot(0.05/12, 0.01/6)
	if got := r.Budget.LDBudget.U.Value(); math.Abs(got/(2*ld)-1) > 1e-9 {
		t.Errorf("u(L/d) = %v, by hand %v", got, 2*ld)
	}
	for _, want := range []string{
		"Re = ρVd/μ = 4ρQ/(πμd): u/value = 2.08 % from viscosity (coolant data) 2.00 %, flow meter 0.50 %, density (coolant data) 0.20 %, bore (gauge pin) 0.17 %",
		"L/d: u/value = 0.45 % from length (caliper) 0.42 %, bore (gauge pin) 0.17 %",
		"the budget of Eu = Δp/(ρV²) (the viscosity and the caliper do not enter it):",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("report lacks %q", want)
		}
	}
}
